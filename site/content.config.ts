/**
 * Content collections. Both come from gloaming's own loaders (site/gloaming/loaders.ts), which
 * validate the YAML sites and Markdown bulletin templates with positioned errors and compute
 * every value through lib/; Astro only stores the results and renders the pages.
 */
import { defineCollection } from 'astro:content';
import { pagesLoader, sitesLoader } from './gloaming/loaders.ts';

export const collections = {
  sites: defineCollection({ loader: sitesLoader() }),
  pages: defineCollection({ loader: pagesLoader() }),
};
