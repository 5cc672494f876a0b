/**
 * One build or dev session of the site: the project (sites, templates, objects, satellites)
 * loaded once and shared by both content loaders, the caches' folders, and the problems found.
 * The Astro integration (`integration.ts`) hands it to the loaders; `scripts/build.ts` makes one
 * before Astro starts, so bad input stops the build with its place before anything runs.
 *
 * Everything here runs in Node's own module graph (not Vite's), so errors are the library's own
 * `GloamingError` objects with their places, untouched on their way out.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, renameSync, writeFileSync } from 'node:fs';
import { threadId } from 'node:worker_threads';
import { join, resolve, sep } from 'node:path';
import type { DataStore, LoaderContext } from 'astro/loaders';
import { checkObjects, checkPages, ProblemList, WeekCache, formatProblem, type Problem, type RenderedBulletin } from '../../lib/outputs/bulletin/index.ts';
import type { PageSpec } from '../../lib/outputs/bulletin/types.ts';
import { ChartCache } from '../../lib/outputs/chart/cache.ts';
import { demoNotice, publicOrigin } from '../../lib/outputs/centre.ts';
import { GloamingError } from '../../lib/core/errors.ts';
import { objectsIn } from '../../lib/models/orbit/body.ts';
import { catalogueLanguage, LANGUAGE_NAMES } from '../../lib/core/language/index.ts';
import { isoWeekOf, parseLocalDate } from '../../lib/core/time.ts';
import { siteCalendar } from './calendar.ts';
import { cardInputOf, renderCardCached } from './card.ts';
import { entryDigest } from './digest.ts';
import { nextNights } from './nights.ts';
import { WorkerPool } from './pool.ts';
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

/** Work a session can hand to a worker thread: the entries of some sites, or some pages (with their cards). */
export type Job = { kind: 'sites'; ids: string[] } | { kind: 'pages'; paths: string[] };

/** One page rendered: its entry (null when it failed), its problems and its charts. */
export interface PageResult {
  path: string;
  data: PageEntry | null;
  problems: Problem[];
}

/** What a job gives back: plain data, as it crosses from a worker thread. */
export type JobResult =
  | { kind: 'sites'; entries: SiteEntry[] }
  | { kind: 'pages'; pages: PageResult[]; charts: { count: number; drawn: number; workMs: number } };

/** Below this many pages or sites to compute, a session computes them itself rather than start workers. */
const PARALLEL_FROM = 6;

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
    alternates: spec.alternates.map((a) => `${a.locale} ${a.path}`).join(','),
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
  /** What this session computes with (a worker's session keeps them across its jobs). */
  #weeks = new WeekCache();
  #charts: ChartCache | null = null;
  #pool: WorkerPool<Job, JobResult> | null = null;

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

  /**
   * The entries' long texts, named by their content hash (bulletin pages' HTML `<sha256>.html`,
   * sites' calendar feeds `<sha256>.ics`), inside Astro's cache folder beside the charts: the
   * content store keeps the file names, not the texts, so the store Astro loads and compiles on
   * every build stays small (16.6 MB → under 1 MB for 34 sites).
   */
  get textDir(): string {
    return join(this.cacheDir, 'gloaming', 'texts');
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
    this.#weeks = new WeekCache();
    this.#charts = null;
    void this.#pool?.close();
    this.#pool = null;
  }

  /** The options a worker's session needs to load the same project. */
  get options(): SessionOptions {
    return { root: this.root, cacheDir: this.cacheDir, today: this.today, sites: this.sites, content: this.content };
  }

  /**
   * Runs `jobs` on worker threads (both cores) when there are enough of them, else here; results
   * in the order of `jobs`.
   */
  async #compute(jobs: Job[], items: number): Promise<JobResult[]> {
    if (items < PARALLEL_FROM || jobs.length < 2) {
      const out: JobResult[] = [];
      for (const job of jobs) out.push(await this.runJob(job));
      return out;
    }
    this.#pool ??= new WorkerPool<Job, JobResult>(new URL('./worker.ts', import.meta.url), this.options);
    return Promise.all(jobs.map((job) => this.#pool!.run(job)));
  }

  /** Does one job (in a worker thread, or here): see `Job`. */
  async runJob(job: Job): Promise<JobResult> {
    const project = this.project();
    if (job.kind === 'sites') {
      const built = new Set(project.selected.map((s) => s.site.id));
      return { kind: 'sites', entries: job.ids.map((id) => this.#siteEntry(project, project.sites.get(id)!, built.has(id))) };
    }
    this.#charts ??= new ChartCache({ dir: this.chartDir, codeVersion: project.codeDigest, clock: () => performance.now() });
    const before = { count: this.#charts.count, drawn: this.#charts.rendered, workMs: this.#charts.workMs };
    const specs = new Map(project.pages.map((p) => [p.path, p]));
    const pages: PageResult[] = [];
    for (const path of job.paths) pages.push(await this.#renderPage(project, specs.get(path)!, this.#charts));
    const c = this.#charts;
    return { kind: 'pages', pages, charts: { count: c.count - before.count, drawn: c.rendered - before.drawn, workMs: c.workMs - before.workMs } };
  }

  #siteEntry(project: Project, source: SiteSource, built: boolean): SiteEntry {
    const s = source.site;
    return {
      id: s.id,
      name: s.name,
      description: source.description,
      latitudeDeg: s.latitudeDeg,
      longitudeDeg: s.longitudeDeg,
      elevationM: s.elevationM,
      timeZone: s.timeZone,
      locale: s.locale,
      sky: skyLabel(s.sky, s.locale),
      viewingHours: s.viewingHours?.label ?? null,
      horizon: s.horizon.map((p) => ({ azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg })),
      built,
      currentWeek: isoWeekOf(project.today).id,
      nights: built ? nextNights(s, project.today, NIGHTS_SHOWN, project.satellites) : [],
      calendarFile: built ? keepText(this.textDir, siteCalendar(s, { bodies: project.bodies, today: project.today, satellites: project.satellites, centreName: project.centre.name }), 'ics') : null,
    };
  }

  /**
   * One bulletin page through the checks of `gloaming check` (`checkPages`), and its social card
   * into the card cache, where the card route finds it.
   */
  async #renderPage(project: Project, spec: PageSpec, chartCache: ChartCache): Promise<PageResult> {
    // The charts this page links: served by the `/charts/[chart].svg` route.
    const charts = new Set<string>();
    const output = { cache: chartCache, url: (file: string) => (charts.add(file), `/charts/${file}`) };
    const found = new ProblemList();
    let rendered: RenderedBulletin | undefined;
    checkPages([spec], { bodies: project.bodies, satellites: project.satellites, charts: output, cache: this.#weeks, problems: found, onRendered: (_, r) => (rendered = r) });
    if (!rendered) return { path: spec.path, data: null, problems: found.items }; // an error, among the problems
    const oneOff = spec.template.frontMatter.date !== undefined;
    const data: PageEntry = {
      path: spec.path,
      siteId: spec.site.id,
      siteName: spec.site.name,
      locale: spec.site.locale,
      weekId: spec.week.id,
      weekLabel: weekLabel(spec.week, spec.site.locale),
      weekStart: spec.week.days[0]!,
      slug: spec.path.split('/').pop()!,
      language: spec.template.language,
      primary: !spec.path.endsWith(`.${spec.template.language}`),
      alternates: spec.alternates.map((a) => ({ locale: a.locale, path: a.path, label: LANGUAGE_NAMES[catalogueLanguage(a.locale) ?? 'en'] })),
      oneOff,
      when: oneOff ? dateLabel(spec.template.frontMatter.date!, spec.site.locale) : weekLabel(spec.week, spec.site.locale),
      title: rendered.title,
      description: rendered.description,
      htmlFile: keepText(this.textDir, rendered.html, 'html'),
      cautions: rendered.cautions,
      charts: [...charts].sort(),
      warnings: found.warnings as PageWarning[],
    };
    await renderCardCached(cardInputOf(data, spec.site, project.centre), { cacheDir: this.cardDir, codeDigest: project.codeDigest });
    return { path: spec.path, data, problems: found.items };
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
    const stale = (id: string, source: SiteSource): boolean => {
      const stored = store.get<SiteEntry>(id);
      // Unchanged, and its calendar still in the cache folder (else it is made again).
      return stored?.digest !== siteDigest(project, source, builtIds.has(id)) || (stored.data.calendarFile !== null && !existsSync(join(this.textDir, stored.data.calendarFile)));
    };
    const todo = [...project.sites].filter(([id, source]) => stale(id, source)).map(([id]) => id);
    const results = await this.#compute(todo.map((id) => ({ kind: 'sites', ids: [id] })), todo.length);
    for (const result of results) {
      if (result.kind !== 'sites') continue;
      for (const data of result.entries) store.set({ id: data.id, data: await parseData({ id: data.id, data }), digest: siteDigest(project, project.sites.get(data.id)!, data.built) });
    }
    prune(store, (id) => project.sites.has(id));
    logger.info(`sites: ${todo.length} computed, ${project.sites.size - todo.length} unchanged`);
  }

  /**
   * The content loader of the `pages` collection: every bulletin page of the build date, rendered
   * through the same checks as `gloaming check` (`checkPages`). A page whose digest is unchanged
   * is kept with its stored warnings. The object files' warnings for the build date (`checkObjects`)
   * come first. Errors of every template are collected and stop the load together
   * (`BuildProblems`), as do warnings with `strict`.
   */
  async loadPages(context: LoaderContext): Promise<void> {
    this.#watch(context, (c) => this.loadPages(c));
    const { store, logger, parseData } = context;
    const project = this.project();
    // The object files' warnings (old comet elements) first, once per build.
    const problems = checkObjects(objectsIn(project.bodies), { today: project.today });
    const todo: PageSpec[] = [];
    for (const spec of project.pages) {
      const stored = store.get<PageEntry>(spec.path);
      // Unchanged, and its HTML still in the cache folder (else it is made again).
      if (stored?.digest === pageDigest(project, spec) && existsSync(join(this.textDir, stored.data.htmlFile))) for (const w of stored.data.warnings) problems.add(w);
      else todo.push(spec);
    }
    // One job per site: the pages of a site share its weeks (WeekCache).
    const bySite = new Map<string, string[]>();
    for (const spec of todo) bySite.set(spec.site.id, [...(bySite.get(spec.site.id) ?? []), spec.path]);
    const t0 = performance.now();
    const results = await this.#compute([...bySite.values()].map((paths) => ({ kind: 'pages', paths })), todo.length);
    const rendered = new Map<string, PageResult>();
    const charts = { count: 0, drawn: 0, workMs: 0 };
    for (const result of results) {
      if (result.kind !== 'pages') continue;
      for (const page of result.pages) rendered.set(page.path, page);
      charts.count += result.charts.count;
      charts.drawn += result.charts.drawn;
      charts.workMs += result.charts.workMs;
    }
    // Entries and problems in page order, whichever worker finished first.
    for (const spec of todo) {
      const page = rendered.get(spec.path)!;
      for (const p of page.problems) problems.add(p);
      if (page.data) store.set({ id: spec.path, data: await parseData({ id: spec.path, data: page.data }), digest: pageDigest(project, spec) });
    }
    const keep = new Set(project.pages.map((p) => p.path));
    prune(store, (id) => keep.has(id));
    this.problems = problems;
    logger.info(`bulletin pages: ${todo.length} computed, ${project.pages.length - todo.length} unchanged (${((performance.now() - t0) / 1000).toFixed(1)} s)`);
    if (charts.count) logger.info(`charts: ${charts.count} (${charts.drawn} drawn, ${charts.count - charts.drawn} from the cache) in ${charts.workMs.toFixed(0)} ms of chart work`);
    stopOnProblems(problems, this.strict);
  }

}

/** Writes `text` into `dir` under its content hash (once; atomically) and returns the file name, `<hash>.<ext>`. */
function keepText(dir: string, text: string, ext: 'html' | 'ics'): string {
  const name = `${createHash('sha256').update(text).digest('hex').slice(0, 32)}.${ext}`;
  const file = join(dir, name);
  if (!existsSync(file)) {
    mkdirSync(dir, { recursive: true });
    const tmp = `${file}.${process.pid}.${threadId}.tmp`;
    writeFileSync(tmp, text);
    renameSync(tmp, file); // a concurrent build or worker never reads half a file
  }
  return name;
}
