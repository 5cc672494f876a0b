/**
 * The shapes of the two content collections, as Zod schemas (`astro/zod`): the loaders validate
 * every entry against them (`parseData`) and the pages read typed entries from `getCollection`,
 * so no page casts its data. The TypeScript types are inferred from the schemas: one definition.
 */
import { z } from 'astro/zod';

/** One shown time. */
const shownTime = z.object({
  /** ISO 8601 with the site's offset, or null when the event does not happen that night. */
  datetime: z.string().nullable(),
  /** Local clock time in the site's locale ("17:42", "5:42 pm"), or a short reason. */
  text: z.string(),
});

/** One row of the "next nights" panel (`nightRow` in nights.ts). */
export const nightRowSchema = z.object({
  /** Local date of the evening, YYYY-MM-DD. */
  date: z.string(),
  /** "Fri 4 Dec" in the site's locale. */
  label: z.string(),
  sunset: shownTime,
  /** End of nautical twilight (Sun 12° down): most stars are out. */
  nauticalDusk: shownTime,
  /** End of astronomical twilight (Sun 18° down): full darkness. */
  darkness: shownTime,
  moonrise: shownTime,
  moonset: shownTime,
  /** The Moon seen from dusk on: "sets" 21:40, "rises" 04:16, or no time and "up all night" / "down all night". */
  moon: z.object({ verb: z.string(), time: shownTime.nullable() }),
  /** "Waxing crescent". */
  moonPhase: z.string(),
  /** Lit fraction of the Moon's disc at local midnight, whole per cent. */
  moonLitPercent: z.number(),
  /**
   * Satellite passes to recommend this night (naked eye, at least a minute), or why there are none
   * (`text`); null when the site follows no satellites (only tonight's row has them).
   */
  passes: z.object({ items: z.array(z.object({ time: shownTime, text: z.string() })), text: z.string().nullable() }).nullable(),
});

export const siteEntrySchema = z.object({
  id: z.string(),
  name: z.string(),
  description: z.string(),
  latitudeDeg: z.number(),
  longitudeDeg: z.number(),
  elevationM: z.number(),
  timeZone: z.string(),
  locale: z.string(),
  /** "Bortle 7 (city sky)" and the like. */
  sky: z.string(),
  viewingHours: z.string().nullable(),
  /** The skyline, degrees, sorted by azimuth. */
  horizon: z.array(z.object({ azimuthDeg: z.number(), altitudeDeg: z.number() })),
  /** Whether this build publishes the site's pages (false for sites of other CI shards). */
  built: z.boolean(),
  /** ISO week id of the build date, e.g. 2026-W49. */
  currentWeek: z.string(),
  nights: z.array(nightRowSchema),
  /** The site's iCalendar feed of sky events: a file of the session's text folder, read with `entryText()` (site/data.ts); null for sites of other CI shards. */
  calendarFile: z.string().regex(/^[0-9a-f]{32}\.ics$/).nullable(),
});

/** A warning found while rendering a page (errors stop the build and are never stored). */
export const pageWarningSchema = z.object({
  kind: z.enum(['fallback', 'empty-section', 'page-size']),
  severity: z.literal('warning'),
  message: z.string(),
  place: z.object({ file: z.string().optional(), line: z.number().optional(), column: z.number().optional(), field: z.string().optional() }),
  site: z.string().optional(),
  week: z.string().optional(),
});

export const pageEntrySchema = z.object({
  /** URL path below the root without slashes at the ends: site/week/slug. */
  path: z.string(),
  siteId: z.string(),
  siteName: z.string(),
  locale: z.string(),
  weekId: z.string(),
  /** "30 Nov – 6 Dec 2026". */
  weekLabel: z.string(),
  /** Monday of the week, YYYY-MM-DD. */
  weekStart: z.string(),
  /** The last part of the path: the bulletin's name, with its language when it is not the site's (`weekly`, `weekly.en`). */
  slug: z.string(),
  /** The language of the page's words (a catalogue language): `es` for `es-CL`. */
  language: z.string(),
  /** The version in the site's own language (listed in the archive, the feed and "this week"); other versions are linked from it. */
  primary: z.boolean(),
  /** The same bulletin for the same week in other languages: locale, path, and the language's name in itself. */
  alternates: z.array(z.object({ locale: z.string(), path: z.string(), label: z.string() })),
  /** A one-off bulletin (dated) rather than a standing weekly one. */
  oneOff: z.boolean(),
  /** What the page is about in words: the week, or a one-off's date ("Wednesday 13 January 2027"). */
  when: z.string(),
  title: z.string(),
  description: z.string(),
  /** The page's bulletin HTML: a file of the session's text folder (`GloamingSession.textDir`), read with `entryText()` (site/data.ts). */
  htmlFile: z.string().regex(/^[0-9a-f]{32}\.html$/),
  cautions: z.array(z.string()),
  /** File names of the finder charts the page links (served by `/charts/[file]`). */
  charts: z.array(z.string()),
  /** Warnings the page's rendering reported (a value placeholder without a value, …), kept so a warm build reports them too. */
  warnings: z.array(pageWarningSchema),
});

export type ShownTimeEntry = z.infer<typeof shownTime>;
/** The publishing centre as pages read it (content/centre.yaml, see lib/outputs/centre.ts). */
export const centreEntrySchema = z.object({
  name: z.string(),
  shortName: z.string(),
  /** The logo's absolute path on disk and where pages load it from, or null. */
  logoFile: z.string().nullable(),
  logoPath: z.string().nullable(),
  accentDark: z.string(),
  accentRed: z.string(),
  locale: z.string(),
  footerHtml: z.string(),
  links: z.array(z.object({ label: z.string(), href: z.string() })),
  /** The invented-demo notice, or null for a real centre. */
  notice: z.string().nullable(),
  /** The origin absolute links use; `preview` when centre.yaml has no public address. */
  origin: z.string(),
  preview: z.boolean(),
});

export type CentreEntry = z.infer<typeof centreEntrySchema>;
export type NightRowEntry = z.infer<typeof nightRowSchema>;
export type SiteEntry = z.infer<typeof siteEntrySchema>;
export type PageEntry = z.infer<typeof pageEntrySchema>;
export type PageWarning = z.infer<typeof pageWarningSchema>;
