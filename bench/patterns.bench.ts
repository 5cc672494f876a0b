/**
 * Benchmark of the guide pattern (issue #5): choosing the pattern, part and phrase and the nearest
 * named star for one body at one moment. Budget: 1 ms median. The first call loads and indexes the
 * star table and patterns; the measured calls use a different moment and target each time.
 *
 *   node bench/patterns.bench.ts        (or `npm run bench -- patterns`)
 */
import { Body, Equator, MakeTime, Observer } from 'astronomy-engine';
import { describeMotion, guideTarget } from '../lib/models/stars/guide.ts';
import { measure, report, type BenchRow } from './harness.ts';

const observer = { latitudeDeg: 51.48, longitudeDeg: 0, elevationM: 20 };
const site = new Observer(observer.latitudeDeg, observer.longitudeDeg, observer.elevationM);
const start = MakeTime(new Date('2026-01-01T21:00:00Z'));
// Apparent places of Jupiter through a year, so the measured calls see varied skies.
const cases = Array.from({ length: 365 }, (_, d) => {
  const time = start.AddDays(d);
  const eq = Equator(Body.Jupiter, time, site, true, true);
  return { time, target: { raHours: eq.ra, decDeg: eq.dec } };
});

export async function run(): Promise<BenchRow[]> {
  guideTarget({ observer, ...cases[0]! });
  let i = 0;
  const rows: BenchRow[] = [];
  rows.push(await measure('patterns: guide pattern + phrase + nearest star, one body', () => guideTarget({ observer, ...cases[i++ % cases.length]! }), { targetMs: 1 }));
  // The Moon over a week: it moves far enough for a phrase.
  const week = [0, 2, 4, 6].map((d) => {
    const time = start.AddDays(d);
    const eq = Equator(Body.Moon, time, site, true, true);
    return { time, raHours: eq.ra, decDeg: eq.dec };
  });
  rows.push(await measure('patterns: Moon motion over a week against a pattern', () => describeMotion({ patternId: 'great-square', places: week })));
  return rows;
}

if (import.meta.main) report(await run());
