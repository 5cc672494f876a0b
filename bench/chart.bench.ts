/**
 * Benchmark of finder charts (issue #7): one horizon-view chart drawn cold (SVG only, and SVG
 * plus 1× and 2× PNG rasters with @resvg/resvg-js), a whole-sky chart, and a cache hit.
 * Budgets: ≤ 60 ms per SVG chart, ≤ 150 ms with rasters, ≤ 2 ms per cache hit. Each measured
 * cold call draws a different moment, so nothing is reused between calls except the star table.
 *
 *   node bench/chart.bench.ts        (or `npm run bench -- chart`)
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { builtInBody } from '../lib/core/body.ts';
import { ChartCache, drawChart, rasterizeChart, type ChartRequest } from '../lib/outputs/chart/index.ts';
import { loadBodies, loadSites } from '../lib/models/content.ts';
import { measure, report, type BenchRow } from './harness.ts';

const sites = loadSites('content/sites');
const bodies = loadBodies('content/objects');
const southern = sites.get('southern-station')!;
const harbour = sites.get('harbour-roof')!;
const comet = bodies.get('comet-lumen');
const jupiter = builtInBody('jupiter');
const start = Date.parse('2027-01-12T10:06:00Z');

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  let i = 0;
  const horizon = (): ChartRequest => ({ kind: 'horizon', site: southern, body: comet, time: new Date(start + (i++ % 500) * 61_000), options: { trackDays: [-3, -2, -1, 1, 2, 3] } });
  drawChart(horizon());
  rows.push(await measure('chart: horizon view, comet with week track, SVG (cold)', () => drawChart(horizon()), { targetMs: 60 }));
  rows.push(await measure('chart: horizon view, Jupiter from the city, SVG (cold)', () => drawChart({ kind: 'horizon', site: harbour, body: jupiter, time: new Date(start + (i++ % 500) * 61_000) }), { targetMs: 60 }));
  rows.push(await measure('chart: whole sky, SVG (cold)', () => drawChart({ kind: 'sky', site: southern, body: comet, time: new Date(start + (i++ % 500) * 61_000) }), { targetMs: 60 }));
  rows.push(
    await measure('chart: horizon view, SVG + PNG 1× and 2× (cold)', () => {
      const c = drawChart(horizon());
      rasterizeChart(c.svg, { widthPx: c.width });
      rasterizeChart(c.svg, { widthPx: c.width * 2 });
    }, { targetMs: 150 }),
  );
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-chart-bench-'));
  try {
    const cache = new ChartCache({ dir });
    const fixed = horizon();
    cache.get(fixed);
    rows.push(await measure('chart: cache hit (key + read SVG and metadata)', () => cache.get(fixed), { targetMs: 2 }));
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
  return rows;
}

if (import.meta.main) report(await run());
