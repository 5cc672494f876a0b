/**
 * Benchmarks of the visibility model (issue #4): one full evaluation — sky brightness at a
 * target (dark sky + moonlight + twilight) and the visibility margin for the three default
 * instruments — and a batch of 1000 such evaluations with varying inputs, which is the scale of
 * one body-night search (the budget for a whole body-night is 2 ms).
 */
import { DEFAULT_INSTRUMENTS, skyBrightness, visibilityMargin, type SkyBrightnessInput } from '../lib/models/sky/index.ts';
import { measure, report, type BenchRow } from './harness.ts';

const instruments = [DEFAULT_INSTRUMENTS['naked-eye'], DEFAULT_INSTRUMENTS.binoculars, DEFAULT_INSTRUMENTS.telescope];
let sink = 0;

function evaluate(i: number): number {
  const t = (i % 720) / 720;
  const input: SkyBrightnessInput = {
    target: { altitudeDeg: 5 + 60 * t, sunSeparationDeg: 30 + 100 * t, moonSeparationDeg: 20 + 120 * (1 - t) },
    sun: { altitudeDeg: -2 - 30 * t },
    moon: { altitudeDeg: 40 - 50 * t, phaseAngleDeg: 60 * t },
    darkSkyZenithNl: 120,
    kV: 0.22,
  };
  const sky = skyBrightness(input);
  let best = -Infinity;
  for (const instrument of instruments) {
    const m = visibilityMargin({ magnitude: 5.5, altitudeDeg: input.target.altitudeDeg, kV: 0.22, skyNl: sky.totalNl, instrument, comaDiameterArcmin: 4 });
    if (m > best) best = m;
  }
  return best;
}

export async function run(): Promise<BenchRow[]> {
  let i = 0;
  const rows: BenchRow[] = [];
  rows.push(
    await measure('sky: sky brightness + margins for 3 instruments (one evaluation)', () => {
      sink += evaluate(i++);
    }),
  );
  rows.push(
    await measure(
      'sky: 1000 evaluations (≈ one body-night search)',
      () => {
        for (let n = 0; n < 1000; n++) sink += evaluate(i++);
      },
      { targetMs: 1 },
    ),
  );
  if (Number.isNaN(sink)) throw new Error('benchmark produced NaN');
  return rows;
}

if (import.meta.main) report(await run());
