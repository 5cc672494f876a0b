/**
 * The RSS feed of a site (RSS 2.0), as options for `@astrojs/rss`.
 *
 * RSS carries `<title>` and `<description>` as text that readers decode once from XML and then
 * show as HTML (RSS Advisory Board, RSS 2.0 specification: description is an "entity-encoded
 * HTML" synopsis; common practice for title). `@astrojs/rss` escapes for XML only, so text from
 * content files (site names, bulletin titles and descriptions) is escaped for HTML first: a
 * reader then shows `<svg onload=…>` in a site's name as those characters, never as markup.
 */
import type { RSSOptions } from '@astrojs/rss';
import { escapeXml } from '../../lib/outputs/chart/svg.ts';
import { wordsFor } from '../../lib/core/language/index.ts';

/** What one feed item needs from a bulletin page. */
export interface FeedPage {
  title: string;
  description: string;
  /** What the page is about: its week ("30 Nov – 6 Dec 2026"), or a one-off's date. */
  weekLabel: string;
  /** Monday of the page's week, YYYY-MM-DD. */
  weekStart: string;
  /** Path of the page, e.g. `/harbour-roof/2026-W49/weekly/`. */
  path: string;
}

/** Plain text as HTML text (the same escaping as XML text). */
const htmlText = escapeXml;

/** Feed options for one site: its bulletins newest first, every text field escaped for HTML. */
export function siteFeed(input: {
  siteName: string;
  centreName: string;
  /** The invented-demo notice, or '' for a real centre. */
  note: string;
  /** BCP 47 language of the bulletins (the site's locale); default `en`. */
  language?: string;
  origin: URL | string;
  pages: FeedPage[];
}): RSSOptions {
  const w = wordsFor(input.language ?? 'en');
  return {
    title: htmlText(`${input.siteName} · ${input.centreName}`),
    description: htmlText(`${w.t('ui.feed-description', { site: input.siteName })}${input.note ? ` ${input.note}` : ''}`),
    site: input.origin,
    items: input.pages.map((p) => ({
      title: htmlText(`${p.title} (${p.weekLabel})`),
      link: p.path,
      // Monday of the bulletin's week, at 00:00 UTC: stable from build to build.
      pubDate: new Date(`${p.weekStart}T00:00:00Z`),
      description: htmlText(p.description),
    })),
    customData: `<language>${htmlText(input.language ?? 'en')}</language>`,
  };
}
