/**
 * Checking templates over many weeks without publishing anything: every template is rendered for
 * every site and week asked for, and every problem is collected as a positioned message with its
 * site and week — errors (a template that cannot render), value placeholders with no value,
 * repeated sections with nothing to repeat, and pages over the size budget — and, once per run,
 * comets whose elements are too old for the date (`checkObjects`). `gloaming check` and
 * the build both use it; the build for the weeks it publishes, `check` for a span of weeks.
 */
import { readFileSync } from 'node:fs';
import type { BodyRegistry } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import { loadYaml } from '../../core/yaml.ts';
import type { SmallBodyObject } from '../../models/orbit/elements.ts';
import { staleCometWarning } from '../../models/orbit/import.ts';
import type { Site } from '../../core/site.ts';
import { addDays, isoWeekOf, type IsoWeek } from '../../core/time.ts';
import type { Satellite } from '../../models/satellite/passes.ts';
import { siteForTemplate, sitesFor } from './pages.ts';
import { authorWords } from './messages.ts';
import { ProblemList, errorsOf, problemOfError } from './problems.ts';
import { renderBulletinSync } from './render.ts';
import type { BulletinTemplate, ChartOutput, PageSpec, RenderedBulletin } from './types.ts';
import { WeekCache } from '../../models/week.ts';

/** The page budget: HTML with its inline CSS, bytes (40 KB). */
export const PAGE_BUDGET_BYTES = 40 * 1024;

/**
 * What a published page adds around the bulletin's own HTML: the layout, navigation, cautions
 * box and the inline stylesheet, bytes. Measured on the demo build for 2026-12-04: a bulletin
 * page is 9.1–9.5 KB more than its bulletin HTML; 10 KB leaves room for the cautions box. The
 * check counts the bulletin plus this.
 */
export const LAYOUT_BYTES = 10 * 1024;

export interface CheckOptions {
  bodies: BodyRegistry;
  /** Satellites followed (content/satellites/), for passes; default none. */
  satellites?: readonly Satellite[];
  /** Finder chart output for `::chart` (default: the library's default chart cache). */
  charts?: ChartOutput;
  /** Shared week data (pass the build's own). */
  cache?: WeekCache;
  /** Where problems go (default: a new list with the default limit). */
  problems?: ProblemList;
  /** Bytes the layout adds to each page (default `LAYOUT_BYTES`). */
  layoutBytes?: number;
  /** Receives each page that rendered, so a build that publishes the pages renders each once. */
  onRendered?: (page: Pick<PageSpec, 'template' | 'site' | 'week'>, rendered: RenderedBulletin) => void;
}

/** How a problem names a page's week: its ISO week, or a one-off's date. */
function weekLabel(page: Pick<PageSpec, 'template' | 'week'>): string {
  const date = page.template.frontMatter.date;
  return date !== undefined && isoWeekOf(date).id === page.week.id ? date : page.week.id;
}

/**
 * Renders each page and collects its problems; stops early only when the list is full. Returns
 * the list (errors and warnings, in page order).
 */
export function checkPages(pages: readonly Pick<PageSpec, 'template' | 'site' | 'week'>[], options: CheckOptions): ProblemList {
  const problems = options.problems ?? new ProblemList();
  const cache = options.cache ?? new WeekCache();
  const layout = options.layoutBytes ?? LAYOUT_BYTES;
  for (const page of pages) {
    if (problems.full) {
      problems.dropped++;
      continue;
    }
    const context = { site: page.site.id, week: weekLabel(page) };
    try {
      const r = renderBulletinSync(page.template, { site: page.site, week: page.week, bodies: options.bodies, ...(options.satellites ? { satellites: options.satellites } : {}), ...(options.charts ? { charts: options.charts } : {}) }, cache);
      for (const p of r.problems) problems.add(p);
      options.onRendered?.(page, r);
      const bytes = Buffer.byteLength(r.html) + layout;
      if (bytes > PAGE_BUDGET_BYTES) {
        problems.add({
          kind: 'page-size',
          severity: 'warning',
          message: authorWords(page.template.language).say('err.page-size', { size: Math.round(bytes / 1024), budget: PAGE_BUDGET_BYTES / 1024, own: Math.round(Buffer.byteLength(r.html) / 1024) }),
          place: { file: page.template.file },
          ...context,
        });
      }
    } catch (error) {
      if (!(error instanceof GloamingError)) throw error;
      for (const e of errorsOf(error)) problems.add(problemOfError(e, e.code === 'unsafe-output' || e.place?.line === undefined ? context : {}));
    }
  }
  return problems;
}

/**
 * The object files' warnings for the date a run is judged on (the build date, `check`'s `--today`),
 * once per run rather than per page: a comet near perihelion whose elements are too old or give
 * no epoch (`staleCometWarning`), placed at its file's `elements.epoch` line (or `elements`).
 * A registry's objects: `objectsIn(bodies)` (lib/models/orbit/body.ts).
 */
export function checkObjects(objects: Iterable<SmallBodyObject>, options: { today: string; problems?: ProblemList }): ProblemList {
  const problems = options.problems ?? new ProblemList();
  for (const object of objects) {
    const stale = staleCometWarning(object, options.today);
    if (!stale) continue;
    const place = object.file ? loadYaml(readFileSync(object.file, 'utf8'), object.file).locate(stale.field) : { field: stale.field };
    problems.add({ kind: 'stale-elements', severity: 'warning', message: stale.message, place });
  }
  return problems;
}

/**
 * The pages `gloaming check` renders: for a standing template, every site and each of `weeks`
 * ISO weeks starting with the week of `today`; for a one-off, every site for its date. Unknown
 * sites in a template's front matter go to `problems` (the template's other sites are still checked).
 */
export function pagesToCheck(templates: readonly BulletinTemplate[], options: { sites: Map<string, Site>; today: string; weeks: number; problems: ProblemList }): Pick<PageSpec, 'template' | 'site' | 'week'>[] {
  const first = isoWeekOf(options.today);
  const span: IsoWeek[] = Array.from({ length: options.weeks }, (_, k) => isoWeekOf(addDays(first.days[0]!, 7 * k)));
  const pages: Pick<PageSpec, 'template' | 'site' | 'week'>[] = [];
  for (const template of templates) {
    let sites: Site[];
    try {
      sites = sitesFor(template, options.sites);
    } catch (error) {
      if (!(error instanceof GloamingError)) throw error;
      options.problems.add(problemOfError(error));
      continue;
    }
    const date = template.frontMatter.date;
    const weeks = date !== undefined ? [isoWeekOf(date)] : span;
    // The site as the build renders this template there (its language, the site's region).
    for (const site of sites) for (const week of weeks) pages.push({ template, site: siteForTemplate(template, site), week });
  }
  return pages;
}
