/**
 * Benchmark of the almanac (issue #8): every event type for one site and one year, including the
 * demo comet from content/objects/ (budget 2 s); a year of lunar occultations for one site (budget 1 s, issue #19).
 */
import { fileURLToPath } from 'node:url';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { AlmanacContext } from '../lib/outputs/almanac/context.ts';
import { findOccultations } from '../lib/outputs/almanac/occultations.ts';
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
  let occultations = 0;
  const ctx = new AlmanacContext(site);
  const occ = await measure(
    'almanac: a year of lunar occultations for one site (stars to V 4 near the ecliptic, planets)',
    () => {
      occultations = findOccultations(ctx, new Date('2026-01-01T00:00:00Z'), new Date('2027-01-01T00:00:00Z')).length;
    },
    { targetMs: 1000, timeMs: 3000, warmup: false },
  );
  if (occultations < 5) throw new Error(`benchmark found only ${occultations} occultations`);
  return [row, occ];
}

if (import.meta.main) report(await run());
