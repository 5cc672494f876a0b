/**
 * One build or dev session of the site: the project (sites, templates, objects, satellites)
 * loaded once and shared by both content loaders, the caches' folders, and the problems found.
 * The Astro integration (`integration.ts`) hands it to the loaders; `scripts/build.ts` makes one
 * before Astro starts, so bad input stops the build with its place before anything runs.
 *
 * Everything here runs in Node's own module graph (not Vite's), so errors are the library's own
 * `GloamingError` objects with their places, untouched on their way out.
 */
import { join, resolve, sep } from 'node:path';
import type { DataStore, LoaderContext } from 'astro/loaders';
import { checkPages, ProblemList, WeekCache, formatProblem, type RenderedBulletin } from '../../lib/outputs/bulletin/index.ts';
import type { PageSpec } from '../../lib/outputs/bulletin/types.ts';
import { ChartCache, type ChartProgress } from '../../lib/outputs/chart/cache.ts';
import { demoNotice, publicOrigin } from '../../lib/outputs/centre.ts';
import { GloamingError } from '../../lib/core/errors.ts';
import { isoWeekOf, parseLocalDate } from '../../lib/core/time.ts';
import { siteCalendar } from './calendar.ts';
import { entryDigest } from './digest.ts';
import { nextNights } from './nights.ts';
import { loadProject, type Project, type SiteSource } from './project.ts';
import type { CentreEntry, PageEntry, PageWarning, SiteEntry } from './schema.ts';
import { dateLabel, skyLabel, weekLabel } from './words.ts';

/** How many nights the per-site home page shows, starting with the build date's evening. */
export const NIGHTS_SHOWN = 5;

/** What a session builds. */
export interface SessionOptions {
  /** Project root (the folder with `content/`, `lib/`, `site/`), absolute. */
  root: string;
  /** Astro's cache folder, absolute: the content store, and gloaming's charts and cards (`<cacheDir>/gloaming/`). */
  cacheDir: string;
  /** Build date, YYYY-MM-DD; its ISO week is "this week". Required before anything is loaded. */
  today?: string | undefined;
  /** Site ids to publish (a CI shard), or null for all. */
  sites?: readonly string[] | null;
  /** Content folder, absolute or relative to the root; default `content`. */
  content?: string;
  /** Warnings stop the build too (`--strict`). */
  strict?: boolean;
}

/**
 * The build stopped because of problems in its input or output: every problem found (up to the
 * list's limit), one a line in its message. The previous output is untouched.
 */
export class BuildProblems extends GloamingError {
  readonly problems: ProblemList;

  constructor(problems: ProblemList, strict: boolean) {
    const errors = problems.errors.length;
    const warnings = problems.warnings.length;
    const why = errors > 0 ? `${errors} error(s)` : `${warnings} warning(s) with --strict`;
    super(problems.errors[0]?.code ?? 'invalid-value', `the build stopped: ${why}; the previous output is unchanged`, {
      ...(problems.items[0] ? { place: problems.items[0].place } : {}),
    });
    Object.defineProperty(this, 'message', { value: [...problems.items.map(formatProblem), `${why}${problems.dropped ? ` (and ${problems.dropped} more not listed)` : ''}: the build stopped${strict && errors === 0 ? ' (--strict)' : ''}; the previous output is unchanged`].join('\n') });
    this.problems = problems;
  }
}

/** Stops the build when `problems` has errors, or any warning with `strict`. */
export function stopOnProblems(problems: ProblemList, strict: boolean): void {
  if (problems.errors.length > 0 || (strict && problems.items.length > 0)) throw new BuildProblems(problems, strict);
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

/** Removes the entries of `store` whose ids are not in `keep`. */
function prune(store: DataStore, keep: (id: string) => boolean): void {
  for (const id of store.keys()) if (!keep(id)) store.delete(id);
}

export class GloamingSession {
  readonly root: string;
  readonly cacheDir: string;
  readonly today: string | undefined;
  readonly sites: readonly string[] | null;
  readonly content: string;
  readonly strict: boolean;
  /** Warnings found by the last load of the pages and by the output checks (errors stop the build). */
  problems = new ProblemList();
  #project: Project | null = null;
  /** In `astro dev`: each collection's loader context, to load again when a content file changes. */
  readonly #loaded = new Map<string, { context: LoaderContext; load: (context: LoaderContext) => Promise<void> }>();
  readonly #watched = new WeakSet<object>();
  #reloading: Promise<void> = Promise.resolve();

  constructor(options: SessionOptions) {
    this.root = options.root;
    this.cacheDir = options.cacheDir;
    this.today = options.today || undefined;
    this.sites = options.sites?.length ? [...new Set(options.sites)].sort() : null;
    this.content = options.content ?? 'content';
    this.strict = options.strict ?? false;
  }

  /** The content folder, absolute. */
  get contentDir(): string {
    return resolve(this.root, this.content);
  }

  /** Finder charts (content-hashed SVG files), inside Astro's cache folder: clearing one clears both. */
  get chartDir(): string {
    return join(this.cacheDir, 'gloaming', 'charts');
  }

  /** Social cards are kept in `<cardDir>/cards/`, keyed by content hash. */
  get cardDir(): string {
    return join(this.cacheDir, 'gloaming');
  }

  /** The project, loaded and validated on first use (every input problem at once, positioned). */
  project(): Project {
    if (!this.#project) {
      if (!this.today) {
        throw new GloamingError('invalid-argument', 'the build date is not set', {
          place: { field: 'today' },
          expected: 'a date YYYY-MM-DD',
          hint: 'build with `npm run build` (it sets the date), or run e.g. `GLOAMING_TODAY=2026-12-04 npm run dev`',
        });
      }
      parseLocalDate(this.today, 'today');
      this.#project = loadProject(this.root, { today: this.today, only: this.sites ? [...this.sites] : null, content: this.content });
    }
    return this.#project;
  }

  /** Forgets the loaded project (a content file changed): the next use loads it again. */
  invalidate(): void {
    this.#project = null;
  }

  /**
   * In `astro dev` (the loader context has a file watcher): remembers how to load `context`'s
   * collection, and watches the content folder once. A change to any content file reloads the
   * project and loads every collection again, one change after another; the dev server then
   * renders the next request from the new entries. A problem is logged, not thrown.
   */
  #watch(context: LoaderContext, load: (context: LoaderContext) => Promise<void>): void {
    const watcher = context.watcher;
    if (!watcher) return;
    this.#loaded.set(context.collection, { context, load });
    if (this.#watched.has(watcher)) return;
    this.#watched.add(watcher);
    const dir = this.contentDir;
    watcher.add(dir);
    const onChange = (path: string): void => {
      if (!path.startsWith(dir + sep)) return;
      this.#reloading = this.#reloading.then(async () => {
        this.invalidate();
        for (const { context: c, load: l } of this.#loaded.values()) {
          try {
            await l(c);
          } catch (error) {
            c.logger.error(error instanceof Error ? error.message : String(error));
          }
        }
      });
    };
    for (const event of ['add', 'change', 'unlink'] as const) watcher.on(event, onChange);
  }

  /** The content loader of the `centre` collection: its one entry, `centre`. */
  async loadCentre(context: LoaderContext): Promise<void> {
    this.#watch(context, (c) => this.loadCentre(c));
    const { store, parseData } = context;
    const project = this.project();
    const c = project.centre;
    const { url, preview } = publicOrigin(c, process.env);
    const digest = entryDigest({ centre: project.centreDigest, sites: String(project.sites.size), origin: url, code: project.codeDigest });
    if (store.get('centre')?.digest === digest) return;
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
    store.set({ id: 'centre', data: await parseData({ id: 'centre', data }), digest });
  }

  /** The content loader of the `sites` collection: each site with its next nights and its calendar feed. */
  async loadSites(context: LoaderContext): Promise<void> {
    this.#watch(context, (c) => this.loadSites(c));
    const { store, logger, parseData } = context;
    const project = this.project();
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
      store.set({ id, data: await parseData({ id, data }), digest });
      computed++;
    }
    prune(store, (id) => project.sites.has(id));
    logger.info(`sites: ${computed} computed, ${project.sites.size - computed} unchanged`);
  }

  /**
   * The content loader of the `pages` collection: every bulletin page of the build date, rendered
   * through the same checks as `gloaming check` (`checkPages`). A page whose digest is unchanged
   * is kept with its stored warnings. Errors of every template are collected and stop the load
   * together (`BuildProblems`), as do warnings with `strict`.
   */
  async loadPages(context: LoaderContext): Promise<void> {
    this.#watch(context, (c) => this.loadPages(c));
    const { store, logger, parseData } = context;
    const project = this.project();
    const cache = new WeekCache();
    const problems = new ProblemList();
    // Progress: a line every 25 charts, and a summary with the rate at the end.
    let last: ChartProgress | undefined;
    const onProgress = (p: ChartProgress): void => {
      last = p;
      if (p.count % 25 === 0) logger.info(`charts: ${p.count} (${p.rendered} drawn, ${p.hits} from the cache), ${(p.elapsedMs / 1000).toFixed(1)} s`);
    };
    const chartCache = new ChartCache({ dir: this.chartDir, onProgress, codeVersion: project.codeDigest, clock: () => performance.now() });
    const keep = new Set<string>();
    let computed = 0;
    for (const spec of project.pages) {
      keep.add(spec.path);
      const digest = pageDigest(project, spec);
      const stored = store.get<PageEntry>(spec.path);
      if (stored?.digest === digest) {
        for (const w of stored.data.warnings) problems.add(w);
        continue;
      }
      // The charts this page links: served by the `/charts/[chart].svg` route.
      const charts = new Set<string>();
      const output = { cache: chartCache, url: (file: string) => (charts.add(file), `/charts/${file}`) };
      const found = new ProblemList();
      let rendered: RenderedBulletin | undefined;
      checkPages([spec], { bodies: project.bodies, charts: output, cache, problems: found, onRendered: (_, r) => (rendered = r) });
      for (const p of found.items) problems.add(p);
      if (!rendered) continue; // an error: reported below with every other one
      const oneOff = spec.template.frontMatter.date !== undefined;
      const data: PageEntry = {
        path: spec.path,
        siteId: spec.site.id,
        siteName: spec.site.name,
        locale: spec.site.locale,
        weekId: spec.week.id,
        weekLabel: weekLabel(spec.week, spec.site.locale),
        weekStart: spec.week.days[0]!,
        slug: spec.template.slug,
        oneOff,
        when: oneOff ? dateLabel(spec.template.frontMatter.date!, spec.site.locale) : weekLabel(spec.week, spec.site.locale),
        title: rendered.title,
        description: rendered.description,
        html: rendered.html,
        cautions: rendered.cautions,
        charts: [...charts].sort(),
        warnings: found.warnings as PageWarning[],
      };
      store.set({ id: spec.path, data: await parseData({ id: spec.path, data }), digest });
      computed++;
    }
    prune(store, (id) => keep.has(id));
    this.problems = problems;
    logger.info(`bulletin pages: ${computed} computed, ${project.pages.length - computed} unchanged`);
    if (last) logger.info(`charts: ${last.count} (${last.rendered} drawn, ${last.hits} from the cache) in ${last.workMs.toFixed(0)} ms of chart work, ${Math.round(last.count / (last.workMs / 1000))} charts/s`);
    stopOnProblems(problems, this.strict);
  }
}
