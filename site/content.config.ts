/**
 * Content collections. Both come from gloaming's own loaders (site/gloaming/loaders.ts), which
 * validate the YAML sites and Markdown bulletin templates with positioned errors and compute
 * every value through lib/; Astro only stores the results and renders the pages.
 */
import { defineCollection } from 'astro:content';
import { centreLoader, pagesLoader, sitesLoader } from './gloaming/loaders.ts';

export const collections = {
  centre: defineCollection({ loader: centreLoader() }),
  sites: defineCollection({ loader: sitesLoader() }),
  pages: defineCollection({ loader: pagesLoader() }),
};
