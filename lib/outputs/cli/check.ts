/**
 * `gloaming check`: renders every bulletin template for every site and every week of a span and
 * lists every problem a reader would meet — errors, value placeholders with no value (`–`),
 * repeated sections with nothing to repeat, pages over the size budget, comets whose elements are
 * too old on the first date — each with its `file:line:column`, site and week. Exit code 0 when nothing is found, 1 when anything is, 2 for
 * wrong arguments.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseArgs } from 'node:util';
import { BodyRegistry } from '../../core/body.ts';
import { loadCentre } from '../centre.ts';
import { loadBodies, parseSite, projectRegistry, yamlFiles } from '../../models/content.ts';
import { GloamingError } from '../../core/errors.ts';
import type { Site } from '../../core/site.ts';
import { parseLocalDate } from '../../core/time.ts';
import { PAGE_BUDGET_BYTES, checkObjects, checkPages, pagesToCheck } from '../bulletin/check.ts';
import { parseBulletin } from '../bulletin/frontmatter.ts';
import { ProblemList, formatProblem, problemOfError, type Problem } from '../bulletin/problems.ts';
import type { BulletinTemplate } from '../bulletin/types.ts';
import { objectsIn } from '../../models/orbit/body.ts';
import { loadSatellites } from '../../models/satellite/catalogue.ts';
import type { Satellite } from '../../models/satellite/passes.ts';
import { argumentError } from './args.ts';

export const CHECK_HELP = `gloaming check — find the weeks where a template would print gibberish or a gap

Usage: gloaming check [--today <YYYY-MM-DD>] [--weeks <n>] [--content <dir>] [--json]

  --today <date>     first week of the span (default: GLOAMING_TODAY, else today's date)
  --weeks <n>        how many ISO weeks to render from the week of --today (default 52)
  --content <dir>    content folder with sites/, bulletins/ and objects/ (default ./content)
  --json             print one JSON object

Renders every template in <content>/bulletins for every site it names and every week of the span
(a one-off template for its date), and reports, each with file:line:column, site and week:
errors; value placeholders with no value, which print '–' (put them inside :::provided … ::otherwise);
repeated sections with nothing to repeat and no ::otherwise; pages over the ${PAGE_BUDGET_BYTES / 1024} KB budget;
comets near perihelion whose elements are too old on --today (refresh them with gloaming objects add).
Exit code 0 when nothing is found, 1 when anything is, 2 for wrong arguments.`;

/** Default span of `check`, ISO weeks. */
export const CHECK_WEEKS = 52;

function collect<T>(problems: ProblemList, load: () => T): T | null {
  try {
    return load();
  } catch (error) {
    if (!(error instanceof GloamingError)) throw error;
    problems.add(problemOfError(error));
    return null;
  }
}

/** Every site file and template of the content folder; each file's error is a problem, the others still load. */
function loadContent(contentDir: string, problems: ProblemList): { sites: Map<string, Site>; templates: BulletinTemplate[]; bodies: BodyRegistry; satellites: Satellite[] } {
  const sites = new Map<string, Site>();
  // The centre (content/centre.yaml) stops a build when it is missing or wrong, so the check reports it too.
  const centre = collect(problems, () => loadCentre(contentDir));
  for (const file of yamlFiles(join(contentDir, 'sites'))) {
    const site = collect(problems, () => parseSite(readFileSync(file, 'utf8'), file, centre ? { defaultLocale: centre.locale } : {}));
    if (site) sites.set(site.id, site);
  }
  const bodies = collect(problems, () => loadBodies(join(contentDir, 'objects'))) ?? projectRegistry();
  const satellites = collect(problems, () => loadSatellites(join(contentDir, 'satellites'))) ?? [];
  const dir = join(contentDir, 'bulletins');
  let names: string[];
  try {
    names = readdirSync(dir).filter((n) => n.endsWith('.md')).sort();
  } catch {
    throw argumentError('--content', `no bulletins folder at '${dir}'`, 'a content folder with sites/, bulletins/ and objects/');
  }
  const templates = names.flatMap((name) => {
    const file = join(dir, name);
    const t = collect(problems, () => parseBulletin(readFileSync(file, 'utf8'), file));
    return t ? [t] : [];
  });
  return { sites, templates, bodies, satellites };
}

function problemJson(p: Problem): Record<string, unknown> {
  return {
    kind: p.kind,
    severity: p.severity,
    file: p.place.file ?? null,
    line: p.place.line ?? null,
    column: p.place.column ?? null,
    ...(p.place.field ? { field: p.place.field } : {}),
    site: p.site ?? null,
    week: p.week ?? null,
    message: p.message,
    ...(p.code ? { code: p.code } : {}),
  };
}

/** Runs `gloaming check`; returns the exit code. `today` is the caller's date (the command line's edge reads the clock). */
export function runCheck(args: string[], out: (s: string) => void, context: { today?: string } = {}): number {
  const { values } = parseArgs({
    args,
    options: { today: { type: 'string' }, weeks: { type: 'string' }, content: { type: 'string' }, json: { type: 'boolean' }, help: { type: 'boolean', short: 'h' } },
    strict: true,
  });
  if (values.help) {
    out(CHECK_HELP);
    return 0;
  }
  const today = values.today ?? context.today;
  if (!today) throw argumentError('--today', 'is required here', 'the first date of the span, YYYY-MM-DD');
  parseLocalDate(today, '--today');
  const weeksText = values.weeks ?? String(CHECK_WEEKS);
  const weeks = Number(weeksText);
  if (!/^\d+$/.test(weeksText.trim()) || weeks < 1 || weeks > 260) throw argumentError('--weeks', 'is not a number of weeks', 'a whole number from 1 to 260', weeksText);
  const contentDir = values.content ?? 'content';

  const problems = new ProblemList();
  const content = loadContent(contentDir, problems);
  checkObjects(objectsIn(content.bodies), { today, problems });
  const pages = pagesToCheck(content.templates, { sites: content.sites, today, weeks, problems });
  checkPages(pages, { bodies: content.bodies, satellites: content.satellites, problems });

  const list = problems.items;
  if (values.json) {
    out(JSON.stringify({ today, weeks, pages: pages.length, templates: content.templates.length, sites: content.sites.size, problems: list.map(problemJson), dropped: problems.dropped }, null, 2));
  } else {
    for (const p of list) out(formatProblem(p));
    const errors = problems.errors.length;
    const warnings = problems.warnings.length;
    const summary = `checked ${pages.length} page(s): ${content.templates.length} template(s), ${content.sites.size} site(s), ${weeks} week(s) from ${today}`;
    out(list.length === 0 ? `${summary}; no problems found` : `${summary}; ${errors} error(s), ${warnings} warning(s)${problems.dropped ? `, and ${problems.dropped} more not listed` : ''}`);
  }
  return list.length > 0 || problems.dropped > 0 ? 1 : 0;
}
