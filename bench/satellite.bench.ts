/**
 * Benchmarks of satellite passes (issue #18): a week of passes for one site and 50 satellites
 * (target ≤ 200 ms median), and one SGP4 state with the site's look angles.
 *
 * The 50 satellites are synthetic low-orbit element sets spread in inclination (28°–99°), height
 * (about 350–900 km) and node, with epochs on the demo's build date, like a bright-satellite list.
 */
import { readOmmJson } from '../lib/models/satellite/elements.ts';
import { findPasses, type Satellite } from '../lib/models/satellite/passes.ts';
import { SatelliteObserver, stateAt } from '../lib/models/satellite/propagate.ts';
import { defineSite } from '../lib/core/site.ts';
import { utDays } from '../lib/core/track.ts';
import { measure, report, type BenchRow } from './harness.ts';

const site = defineSite({ id: 'bench', latitude: 50.45, longitude: -1.55, elevation: 28, timeZone: 'Europe/London', sky: { bortle: 7 }, minAltitude: 10 });

const omm = Array.from({ length: 50 }, (_, k) => ({
  OBJECT_NAME: `BENCH ${k}`,
  OBJECT_ID: `2026-900${String.fromCharCode(65 + (k % 26))}`,
  EPOCH: '2026-12-03T12:00:00.000000',
  MEAN_MOTION: 14.2 + ((k * 7) % 20) * 0.07,
  ECCENTRICITY: 0.0005 + (k % 5) * 0.0004,
  INCLINATION: 28 + ((k * 13) % 72),
  RA_OF_ASC_NODE: (k * 47) % 360,
  ARG_OF_PERICENTER: (k * 71) % 360,
  MEAN_ANOMALY: (k * 113) % 360,
  NORAD_CAT_ID: 99000 + k,
  ELEMENT_SET_NO: 999,
  BSTAR: 0.0001,
  MEAN_MOTION_DOT: 0.00001,
  MEAN_MOTION_DDOT: 0,
}));
const satellites: Satellite[] = readOmmJson(JSON.stringify(omm), 'bench.json').map((elements, k) => ({
  id: `bench-${k}`,
  name: `Bench ${k}`,
  noradId: elements.noradId,
  standardMagnitude: 1 + (k % 5),
  elements,
}));

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  rows.push(await measure('satellites: a week of passes, one site, 50 satellites', () => findPasses({ site, satellites, from: '2026-11-30', to: '2026-12-06' }), { targetMs: 200, timeMs: 3000 }));
  const observer = new SatelliteObserver(site);
  const ut0 = utDays(new Date('2026-12-04T18:00:00Z'));
  let i = 0;
  rows.push(await measure('satellites: one SGP4 state and look angles', () => {
    const ut = ut0 + (i++ & 1023) * 0.0007;
    return observer.look(stateAt(satellites[i % 50]!.elements, ut)!.positionKm, ut);
  }));
  return rows;
}

export default run;

if (import.meta.main) report(await run());
