/** Reading the content collections, and the site's URL scheme, in one place. */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { getCollection, getEntry } from 'astro:content';
import { texts } from 'virtual:gloaming';
import type { CentreEntry, PageEntry, SiteEntry } from './gloaming/schema.ts';

export type { CentreEntry, PageEntry, SiteEntry };

/** The publishing centre (content/centre.yaml). */
export async function centre(): Promise<CentreEntry> {
  const entry = await getEntry('centre', 'centre');
  if (!entry) throw new Error('the centre collection is empty: content/centre.yaml was not loaded');
  return entry.data;
}

/** Every site, by name. */
export async function allSites(): Promise<SiteEntry[]> {
  const entries = await getCollection('sites');
  return entries.map((e) => e.data).sort((a, b) => a.name.localeCompare(b.name, 'en'));
}

/** Sites this build publishes pages for. */
export async function builtSites(): Promise<SiteEntry[]> {
  return (await allSites()).filter((s) => s.built);
}

/** Every bulletin page, oldest week first, then by slug. */
export async function allPages(): Promise<PageEntry[]> {
  const entries = await getCollection('pages');
  return entries
    .map((e) => e.data)
    .sort((a, b) => (a.weekStart === b.weekStart ? (a.slug < b.slug ? -1 : 1) : a.weekStart < b.weekStart ? -1 : 1));
}

/** A long text of an entry (a page's `htmlFile`, a site's `calendarFile`), kept beside the content store (see `GloamingSession.textDir`). */
export function entryText(file: string): string {
  return readFileSync(join(texts.dir, file), 'utf8');
}

/** The pages of one site in its own language, oldest first (versions in other languages are linked from these). */
export async function pagesOf(siteId: string): Promise<PageEntry[]> {
  return (await allPages()).filter((p) => p.siteId === siteId && p.primary);
}

/** The standing weekly bulletin of a week, else the first one-off of that week. */
export function mainPageOf(pages: PageEntry[], weekId: string): PageEntry | undefined {
  const week = pages.filter((p) => p.weekId === weekId);
  return week.find((p) => !p.oneOff) ?? week[0];
}

export const paths = {
  site: (id: string): string => `/${id}/`,
  archive: (id: string): string => `/${id}/archive/`,
  feed: (id: string): string => `/${id}/rss.xml`,
  calendar: (id: string): string => `/${id}/events.ics`,
  page: (p: Pick<PageEntry, 'path'>): string => `/${p.path}/`,
  card: (p: Pick<PageEntry, 'path'>): string => `/${p.path}/card.png`,
  chart: (file: string): string => `/charts/${file}`,
};
