/**
 * Benchmarks of comet positions from orbital elements (issue #3): one light-time corrected
 * geocentric position of the demo comet (target ≤ 20 µs median), its illumination (distances,
 * phase, magnitude), and the bare two-body solution of a near-parabolic orbit.
 */
import * as Astronomy from 'astronomy-engine';
import { smallBody } from '../lib/models/orbit/body.ts';
import { loadObjectFile } from '../lib/models/orbit/elements.ts';
import { conicPosition } from '../lib/models/orbit/kepler.ts';
import { measure, report, type BenchRow } from './harness.ts';

const comet = smallBody(loadObjectFile(new URL('../content/objects/comet-lumen.yaml', import.meta.url).pathname));
const start = Astronomy.MakeTime(new Date('2026-12-01T18:00:00Z'));
const times = Array.from({ length: 1024 }, (_, k) => start.AddDays(k * 0.0731));

export async function run(): Promise<BenchRow[]> {
  let i = 0;
  const rows: BenchRow[] = [];
  rows.push(await measure('orbit: one comet position (geoVector, light-time)', () => comet.geoVector(times[i++ & 1023]!, { aberration: true }), { targetMs: 0.02 }));
  rows.push(await measure('orbit: one comet illumination (r, Δ, phase, magnitude)', () => comet.illumination(times[i++ & 1023]!)));
  rows.push(await measure('orbit: universal Kepler solve, e = 0.9995', () => conicPosition(0.5, 0.9995, (i++ & 1023) * 3.7 - 1900)));
  return rows;
}

export default run;

if (import.meta.main) report(await run());
