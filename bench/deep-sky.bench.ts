/**
 * Benchmark of the deep-sky list (issue #19): the well-placed objects of one site-week's night as a
 * weekly page computes them, cold (a fresh week: the night's frame, the altitude screen of the
 * whole table, then rise/set, verdict and guide for the objects that pass it).
 */
import { fileURLToPath } from 'node:url';
import { isoWeekOf } from '../lib/core/time.ts';
import { loadSites, projectRegistry } from '../lib/models/content.ts';
import { wellPlaced } from '../lib/models/deep-sky/placed.ts';
import { WeekData } from '../lib/models/week.ts';
import { measure, type BenchRow } from './harness.ts';
import { report } from './harness.ts';

const content = fileURLToPath(new URL('../content/', import.meta.url));

export async function run(): Promise<BenchRow[]> {
  const sites = loadSites(`${content}sites`);
  const bodies = projectRegistry();
  const rows: BenchRow[] = [];
  for (const id of ['harbour-roof', 'southern-station']) {
    const site = sites.get(id)!;
    let listed = 0;
    rows.push(
      await measure(
        `deep-sky: the well-placed list of one site-week (${id}, Friday of 2026-W50, cold, guide phrases included)`,
        () => {
          const week = new WeekData(site, isoWeekOf('2026-12-09'), bodies);
          const list = wellPlaced(week.nights[4]!, { limit: 6 });
          for (const p of list.objects) void p.night.guide;
          listed = list.objects.length;
        },
        { targetMs: 300, timeMs: 3000 },
      ),
    );
    if (listed === 0) throw new Error(`benchmark listed no deep-sky object at ${id}`);
  }
  return rows;
}

if (import.meta.main) report(await run());
