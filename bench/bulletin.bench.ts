/**
 * Benchmarks of the bulletin library (issue #6): rendering the demo weekly bulletin for one site
 * and one week, cold (a fresh `WeekCache`: seven site-nights, the bodies the placeholders name,
 * their visibility and guide patterns) and warm (the site-week already in the cache, so only the
 * unified pipeline and the formatting run), and the pipeline alone on placeholder-free Markdown.
 *
 *   node bench/bulletin.bench.ts        (or `npm run bench -- bulletin`)
 */
import { readFileSync } from 'node:fs';
import { BodyRegistry } from '../lib/core/body.ts';
import { loadSites } from '../lib/models/content.ts';
import { addDays, isoWeekOf } from '../lib/core/time.ts';
import { WeekCache, parseBulletin, renderBulletin } from '../lib/outputs/bulletin/index.ts';
import { measure, report, type BenchRow } from './harness.ts';

const root = new URL('..', import.meta.url).pathname;
const sites = loadSites(`${root}content/sites`);
const site = sites.get('harbour-roof') ?? [...sites.values()][0]!;
const template = parseBulletin(readFileSync(`${root}content/bulletins/weekly.md`, 'utf8'), 'content/bulletins/weekly.md');
const plain = { ...template, body: template.body.replace(/:{1,3}[a-z][\w-]*(\{[^}]*\})?/g, 'value') };
const bodies = new BodyRegistry();
const weeks = Array.from({ length: 52 }, (_, k) => isoWeekOf(addDays('2026-01-05', 7 * k)));

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  let i = 0;
  rows.push(
    await measure('bulletin: weekly page, cold (new site-week)', () => renderBulletin(template, { site, week: weeks[i++ % weeks.length]!, bodies }, new WeekCache()), { timeMs: 4000 }),
  );
  const cache = new WeekCache();
  const week = weeks[48]!;
  await renderBulletin(template, { site, week, bodies }, cache);
  rows.push(await measure('bulletin: weekly page, warm (site-week cached)', () => renderBulletin(template, { site, week, bodies }, cache)));
  rows.push(await measure('bulletin: same Markdown without placeholders (pipeline only)', () => renderBulletin(plain, { site, week, bodies }, cache)));
  return rows;
}

if (import.meta.main) report(await run());
