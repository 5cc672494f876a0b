/**
 * Benchmarks of the computation core (issue #2): one site-night for the Moon and all planets
 * (positions at hourly nodes, rise/transit/set, the Sun's twilights, Moon phase) and a year of
 * consecutive nights for one site; and (issue #4) the best time, window and verdict of one body-night.
 */
import { builtInBody, PLANET_IDS } from '../lib/core/body.ts';
import { defineSite } from '../lib/core/site.ts';
import { computeNight } from '../lib/models/night.ts';
import { addDays } from '../lib/core/time.ts';
import { measure, report, type BenchRow } from './harness.ts';

const site = defineSite({ id: 'bench', latitude: 51.48, longitude: -0.0, timeZone: 'Europe/London' });
const bodies = PLANET_IDS.map((id) => builtInBody(id));

export async function run(): Promise<BenchRow[]> {
  let i = 0;
  const rows: BenchRow[] = [];
  rows.push(
    await measure('core: one site-night, Moon + 7 planets + twilight', () => computeNight(site, addDays('2026-01-01', i++ % 365), bodies), { targetMs: 10 }),
  );
  rows.push(
    await measure(
      'core: a year of nights, one site',
      () => {
        for (let d = 0; d < 365; d++) computeNight(site, addDays('2027-01-01', d), bodies);
      },
      { targetMs: 500, timeMs: 3000 },
    ),
  );
  // Issue #4: best time, window and verdict for one body-night, tracks already built for the night.
  const night = computeNight(defineSite({ id: 'bench-city', latitude: 51.48, longitude: 0, timeZone: 'Europe/London', sky: { bortle: 7 } }), '2026-12-10', bodies);
  for (const b of bodies) night.sky.visibility(b);
  let k = 0;
  rows.push(await measure('visibility: best time + window + verdict, one body-night', () => night.sky.visibility(bodies[k++ % bodies.length]!), { targetMs: 2 }));
  return rows;
}

if (import.meta.main) report(await run());
