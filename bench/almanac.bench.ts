/**
 * Benchmark of the almanac (issue #8): every event type for one site and one year, including the
 * demo comet from content/objects/ (budget 2 s).
 */
import { fileURLToPath } from 'node:url';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { loadBodies, loadSites } from '../lib/models/content.ts';
import { measure, report, type BenchRow } from './harness.ts';

const content = fileURLToPath(new URL('../content/', import.meta.url));

export async function run(): Promise<BenchRow[]> {
  const site = loadSites(`${content}sites`).get('harbour-roof')!;
  const bodies = loadBodies(`${content}objects`);
  let count = 0;
  const row = await measure(
    'almanac: all events for one site and one year (2026, with one comet)',
    () => {
      count = findEvents({ site, from: new Date('2026-01-01T00:00:00Z'), to: new Date('2027-01-01T00:00:00Z'), bodies }).length;
    },
    { targetMs: 2000, timeMs: 3000, warmup: false },
  );
  if (count < 100) throw new Error(`benchmark found only ${count} events`);
  return [row];
}

if (import.meta.main) report(await run());
