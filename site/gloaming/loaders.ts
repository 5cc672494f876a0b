/**
 * Content-layer loaders: the thin Astro edge of the build. Each hands its work to the session of
 * the `gloaming()` integration (session.ts), which loaded the project once: `centreLoader` stores
 * the publishing centre, `sitesLoader` each site with its next nights and calendar, `pagesLoader`
 * every bulletin page of the build date. Entries are validated against the schemas of schema.ts,
 * so pages read typed data.
 */
import type { Loader } from 'astro/loaders';
import { sessionOf } from './integration.ts';
import { centreEntrySchema, pageEntrySchema, siteEntrySchema } from './schema.ts';

export function centreLoader(): Loader {
  return { name: 'gloaming-centre', schema: centreEntrySchema, load: (context) => sessionOf(context.config).loadCentre(context) };
}

export function sitesLoader(): Loader {
  return { name: 'gloaming-sites', schema: siteEntrySchema, load: (context) => sessionOf(context.config).loadSites(context) };
}

export function pagesLoader(): Loader {
  return { name: 'gloaming-pages', schema: pageEntrySchema, load: (context) => sessionOf(context.config).loadPages(context) };
}
