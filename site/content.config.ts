/**
 * Content collections. All three come from gloaming's own loaders (site/gloaming/loaders.ts), which
 * hand the work to the session of the `gloaming()` integration: the centre, the YAML sites and Markdown
 * bulletin templates are validated with positioned errors and every value is computed through
 * lib/; entries are checked against the schemas of site/gloaming/schema.ts, and Astro stores
 * them and renders the pages.
 */
import { defineCollection } from 'astro:content';
import { centreLoader, pagesLoader, sitesLoader } from './gloaming/loaders.ts';

export const collections = {
  centre: defineCollection({ loader: centreLoader() }),
  sites: defineCollection({ loader: sitesLoader() }),
  pages: defineCollection({ loader: pagesLoader() }),
};
