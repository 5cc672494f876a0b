/**
 * Content-layer loaders: the thin Astro edge of the build. `sitesLoader` stores each site with
 * its next nights; `pagesLoader` renders every bulletin page of the build date through
 * `lib/outputs/bulletin`. Each entry's digest covers everything its values depend on (see `digest.ts`),
 * and an entry whose digest is unchanged is not computed again.
 */
import { fileURLToPath } from 'node:url';
import type { Loader } from 'astro/loaders';
import { renderBulletin, WeekCache } from '../../lib/outputs/bulletin/index.ts';
import { ChartCache, type ChartProgress } from '../../lib/outputs/chart/cache.ts';
import { demoNotice, publicOrigin } from '../../lib/outputs/centre.ts';
import { siteCalendar } from './calendar.ts';
import { chartCacheDir } from './options.ts';
import type { PageSpec } from '../../lib/outputs/bulletin/types.ts';
import { isoWeekOf } from '../../lib/core/time.ts';
import { entryDigest } from './digest.ts';
import { nextNights, type NightRow } from './nights.ts';
import { optionsFromEnv } from './options.ts';
import { loadProject, type Project, type SiteSource } from './project.ts';
import { dateLabel, skyLabel, weekLabel } from './words.ts';

/** How many nights the per-site home page shows, starting with the build date's evening. */
export const NIGHTS_SHOWN = 5;

export interface SiteEntry {
  id: string;
  name: string;
  description: string;
  latitudeDeg: number;
  longitudeDeg: number;
  elevationM: number;
  timeZone: string;
  locale: string;
  sky: string;
  viewingHours: string | null;
  /** The skyline, degrees, sorted by azimuth. */
  horizon: { azimuthDeg: number; altitudeDeg: number }[];
  /** Whether this build publishes the site's pages (false for sites of other CI shards). */
  built: boolean;
  /** ISO week id of the build date, e.g. 2026-W49. */
  currentWeek: string;
  nights: NightRow[];
  /** The site's iCalendar feed of sky events (empty for sites of other CI shards). */
  calendar: string;
}

export interface PageEntry {
  /** URL path below the root without slashes at the ends: site/week/slug. */
  path: string;
  siteId: string;
  siteName: string;
  locale: string;
  weekId: string;
  /** "30 Nov – 6 Dec 2026". */
  weekLabel: string;
  /** Monday of the week, YYYY-MM-DD. */
  weekStart: string;
  slug: string;
  /** A one-off bulletin (dated) rather than a standing weekly one. */
  oneOff: boolean;
  /** What the page is about in words: the week ("30 Nov – 6 Dec 2026"), or a one-off's date ("Wednesday 13 January 2027"). */
  when: string;
  title: string;
  description: string;
  html: string;
  cautions: string[];
}

/** The digest of one bulletin page: code, site file, template file, object files, build date and path. */
export function pageDigest(project: Project, spec: PageSpec): string {
  return entryDigest({
    code: project.codeDigest,
    site: project.sites.get(spec.site.id)!.textDigest,
    template: project.templateDigests.get(spec.template.file) ?? '',
    objects: project.objectsDigest,
    today: project.today,
    path: spec.path,
  });
}

/** The digest of one site entry: code, centre (the calendar's PRODID), site file, build date and whether this shard builds it. */
export function siteDigest(project: Project, source: SiteSource, built: boolean): string {
  return entryDigest({ code: project.codeDigest, centre: project.centreDigest, site: source.textDigest, objects: project.objectsDigest, today: project.today, built: String(built) });
}

/** The publishing centre as pages read it (content/centre.yaml, see lib/outputs/centre.ts). */
export interface CentreEntry {
  name: string;
  shortName: string;
  /** The logo's absolute path on disk and where pages load it from, or null. */
  logoFile: string | null;
  logoPath: string | null;
  accentDark: string;
  accentRed: string;
  locale: string;
  footerHtml: string;
  links: { label: string; href: string }[];
  /** The invented-demo notice, or null for a real centre. */
  notice: string | null;
  /** The origin absolute links use; `preview` when centre.yaml has no public address. */
  origin: string;
  preview: boolean;
}

/** The one entry of the `centre` collection. */
export function centreLoader(): Loader {
  return {
    name: 'gloaming-centre',
    async load({ store, config }) {
      const project = loadProject(rootOf(config), optionsFromEnv());
      const c = project.centre;
      const { url, preview } = publicOrigin(c, process.env);
      const data: CentreEntry = {
        name: c.name,
        shortName: c.shortName,
        logoFile: c.logoFile,
        logoPath: c.logoPath,
        accentDark: c.accentDark,
        accentRed: c.accentRed,
        locale: c.locale,
        footerHtml: c.footerHtml,
        links: c.links,
        notice: demoNotice(c, project.sites.size),
        origin: url,
        preview,
      };
      store.set({ id: 'centre', data: data as unknown as Record<string, unknown>, digest: entryDigest({ centre: project.centreDigest, sites: String(project.sites.size), origin: url, code: project.codeDigest }) });
    },
  };
}

function rootOf(config: { root: URL }): string {
  return fileURLToPath(config.root);
}

export function sitesLoader(): Loader {
  return {
    name: 'gloaming-sites',
    async load({ store, config, logger }) {
      const project = loadProject(rootOf(config), optionsFromEnv());
      const builtIds = new Set(project.selected.map((s) => s.site.id));
      const currentWeek = isoWeekOf(project.today).id;
      let computed = 0;
      for (const [id, source] of project.sites) {
        const built = builtIds.has(id);
        const digest = siteDigest(project, source, built);
        if (store.get(id)?.digest === digest) continue;
        const s = source.site;
        const data: SiteEntry = {
          id,
          name: s.name,
          description: source.description,
          latitudeDeg: s.latitudeDeg,
          longitudeDeg: s.longitudeDeg,
          elevationM: s.elevationM,
          timeZone: s.timeZone,
          locale: s.locale,
          sky: skyLabel(s.sky),
          viewingHours: s.viewingHours?.label ?? null,
          horizon: s.horizon.map((p) => ({ azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg })),
          built,
          currentWeek,
          nights: built ? nextNights(s, project.today, NIGHTS_SHOWN) : [],
          calendar: built ? siteCalendar(s, { bodies: project.bodies, today: project.today, satellites: project.satellites, centreName: project.centre.name }) : '',
        };
        store.set({ id, data: data as unknown as Record<string, unknown>, digest });
        computed++;
      }
      for (const id of store.keys()) if (!project.sites.has(id)) store.delete(id);
      logger.info(`sites: ${computed} computed, ${project.sites.size - computed} unchanged`);
    },
  };
}

export function pagesLoader(): Loader {
  return {
    name: 'gloaming-pages',
    async load({ store, config, logger }) {
      const project = loadProject(rootOf(config), optionsFromEnv());
      const cache = new WeekCache();
      // Finder charts: content-hashed files in the chart cache; the build copies those pages link to.
      // Progress: a line every 25 charts, and a summary with the rate at the end.
      let last: ChartProgress | undefined;
      const onProgress = (p: ChartProgress): void => {
        last = p;
        if (p.count % 25 === 0) logger.info(`charts: ${p.count} (${p.rendered} drawn, ${p.hits} from the cache), ${(p.elapsedMs / 1000).toFixed(1)} s`);
      };
      const charts = { cache: new ChartCache({ dir: chartCacheDir(), onProgress, codeVersion: project.codeDigest, clock: () => performance.now() }), url: (file: string) => `/charts/${file}` };
      const keep = new Set<string>();
      let computed = 0;
      for (const spec of project.pages) {
        keep.add(spec.path);
        const digest = pageDigest(project, spec);
        if (store.get(spec.path)?.digest === digest) continue;
        const rendered = await renderBulletin(spec.template, { site: spec.site, week: spec.week, bodies: project.bodies, charts }, cache);
        const data: PageEntry = {
          path: spec.path,
          siteId: spec.site.id,
          siteName: spec.site.name,
          locale: spec.site.locale,
          weekId: spec.week.id,
          weekLabel: weekLabel(spec.week, spec.site.locale),
          weekStart: spec.week.days[0]!,
          slug: spec.template.slug,
          oneOff: spec.template.frontMatter.date !== undefined,
          when: spec.template.frontMatter.date !== undefined ? dateLabel(spec.template.frontMatter.date, spec.site.locale) : weekLabel(spec.week, spec.site.locale),
          title: rendered.title,
          description: rendered.description,
          html: rendered.html,
          cautions: rendered.cautions,
        };
        store.set({ id: spec.path, data: data as unknown as Record<string, unknown>, digest });
        computed++;
      }
      for (const id of store.keys()) if (!keep.has(id)) store.delete(id);
      logger.info(`bulletin pages: ${computed} computed, ${project.pages.length - computed} unchanged`);
      if (last) logger.info(`charts: ${last.count} (${last.rendered} drawn, ${last.hits} from the cache) in ${last.workMs.toFixed(0)} ms of chart work, ${Math.round(last.count / (last.workMs / 1000))} charts/s`);
    },
  };
}
