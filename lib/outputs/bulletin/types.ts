/**
 * The contract between the bulletin library (`lib/outputs/bulletin/`) and the site (`site/`, `scripts/build.ts`).
 * The library turns a Markdown template with placeholders into HTML for one site and one week;
 * the site decides which pages exist and lays them out. Neither side imports Astro here.
 */
import type { Language } from '../../core/language/index.ts';
import type { BodyRegistry } from '../../core/body.ts';
import type { ChartCache } from '../chart/cache.ts';
import type { Site } from '../../core/site.ts';
import type { IsoWeek } from '../../core/time.ts';
import type { Satellite } from '../../models/satellite/passes.ts';
import type { Problem } from './problems.ts';

/** A bulletin template's front matter, validated (see `parseBulletin`). */
export interface BulletinFrontMatter {
  title: string;
  /** One-line summary for cards, feeds and the page description. */
  description?: string;
  /** Site ids the bulletin is for, or 'all'. */
  sites: string[] | 'all';
  /** A standing weekly template: one page per site per ISO week in [today − past weeks, today + future weeks]. */
  schedule?: { every: 'week'; past: number; future: number };
  /** A one-off bulletin: the local date it is about (computed for that night; events ±3 nights around it; its URL uses the date's ISO week). */
  date?: string;
  /** Bodies the bulletin is about (used for cautions, cards and the default target list). */
  bodies?: string[];
  /** Marks a bulletin about a solar eclipse: the eye-safety caution is always shown. */
  eclipse?: boolean;
}

export interface BulletinTemplate {
  /** Path of the template file as given (used in error places). */
  file: string;
  /** File name without extension and language, used in URLs (`weekly` for `weekly.es.md`). */
  slug: string;
  /** The language the template is written in: its file name's (`weekly.es.md` → es), else English. */
  language: Language;
  frontMatter: BulletinFrontMatter;
  /** Markdown body after the front matter. */
  body: string;
  /** 1-based line of the file on which `body` starts, so positions in the body map to the file. */
  bodyLine: number;
  /**
   * 1-based line and column of front matter fields in the file, keyed by dotted path
   * (`sites`, `sites.1`, `bodies.0`, …), so problems found later (an unknown site or body) are
   * reported where they are written. Optional: without it, errors name the file and field only.
   */
  fieldPlaces?: Record<string, { line: number; column: number }>;
}

/** One page the site will publish: a template applied to a site and a week. */
export interface PageSpec {
  template: BulletinTemplate;
  /** The site, with `locale` set to the page's: the site's own when the template is in the site's language, else the template's language with the site's region (`en-CL`). */
  site: Site;
  week: IsoWeek;
  /**
   * URL path below the site root, without leading slash, e.g. `harbour-roof/2026-W49/weekly`; a
   * version in another language than the site's gets the language after the slug (`weekly.en`).
   */
  path: string;
  /** The same bulletin for the same site and week in other languages (BCP 47 locale and path). */
  alternates: { locale: string; path: string }[];
}

/** What rendering one page yields. */
export interface RenderedBulletin {
  /** The bulletin body as HTML (placeholders replaced by semantic HTML). */
  html: string;
  title: string;
  description: string;
  /** Safety cautions the page must show (e.g. near-Sun targets, eclipses), as plain sentences. */
  cautions: string[];
  /** Warnings for this site and week (value placeholders with no value, empty repeated sections), placed in the template. */
  problems: Problem[];
}

/** Where finder charts are kept and how pages link to them. */
export interface ChartOutput {
  /** The build's chart cache (content-hashed files in its folder). */
  cache: ChartCache;
  /** Public URL of a chart file, e.g. `(f) => '/charts/' + f`. The build copies the files pages link to. */
  url: (file: string) => string;
}

/** Everything rendering needs besides the template. */
export interface RenderContext {
  site: Site;
  week: IsoWeek;
  bodies: BodyRegistry;
  /** Satellites followed (content/satellites/), for passes and `satellite-pass` events; default none. */
  satellites?: readonly Satellite[];
  /**
   * Finder charts (`::chart`): the build's chart cache and links. Default: charts kept in memory for
   * this one render (nothing is written), linked as `/charts/<file>`.
   */
  charts?: ChartOutput;
}
