/**
 * Satellite passes against independent computations: the satellite's altitude from SGP4
 * positions with the site, Earth rotation and refraction of astronomy-engine (not the
 * sidereal-time path of lib/models/satellite), the Earth's shadow as the cylinder of the Earth's radius
 * along astronomy-engine's Sun direction, and the Lambert-sphere phase law's published phase
 * integral.
 */
import { readFileSync } from 'node:fs';
import * as Astronomy from 'astronomy-engine';
import { propagate } from 'satellite.js';
import { describe, expect, it } from 'vitest';
import { GloamingError } from '../lib/core/errors.ts';
import { defineSite } from '../lib/core/site.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';
import { readTle } from '../lib/models/satellite/elements.ts';
import { lambertPhaseFunction, satelliteMagnitude } from '../lib/models/satellite/magnitude.ts';
import { findPasses, MAX_ELEMENT_AGE_DAYS, type Satellite } from '../lib/models/satellite/passes.ts';
import { stateAt, StateTrack } from '../lib/models/satellite/propagate.ts';
import { utDays } from '../lib/core/track.ts';
import { passNights } from '../lib/models/satellite/nights.ts';
import { errorStats, expectWithin, SECOND_MS } from './helpers/tolerance.ts';

const KM_PER_AU = 149_597_870.7;
const EARTH_RADIUS_KM = 6378.135;

const satellites = loadSatellites(new URL('../content/satellites/', import.meta.url).pathname);
const station = satellites.find((s) => s.id === 'demo-station')!;
// A flat-horizon site at the demo's latitude, minimum altitude 10°.
const site = defineSite({ id: 'flat', latitude: 50.45, longitude: -1.55, elevation: 28, timeZone: 'Europe/London', sky: { bortle: 4 }, minAltitude: 10 });
const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);

/** Apparent altitude of the satellite at `date`: SGP4 (satellite.js) position, astronomy-engine site, rotation and refraction. */
function independentAltitude(sat: Satellite, date: Date): number {
  const time = Astronomy.MakeTime(date);
  const p = propagate(sat.elements.satrec, date)!.position;
  const o = Astronomy.ObserverVector(time, observer, true);
  const v = new Astronomy.Vector(p.x / KM_PER_AU - o.x, p.y / KM_PER_AU - o.y, p.z / KM_PER_AU - o.z, time);
  const eq = Astronomy.EquatorFromVector(v);
  return Astronomy.Horizon(time, observer, eq.ra, eq.dec, 'normal').altitude;
}

/** Bisection for the instant in [a, b] where f changes sign. */
function bisect(f: (ms: number) => number, a: number, b: number): number {
  const fa = f(a);
  for (let i = 0; i < 60 && b - a > 1; i++) {
    const m = (a + b) / 2;
    if ((f(m) > 0) === (fa > 0)) a = m;
    else b = m;
  }
  return (a + b) / 2;
}

describe('passes of the demo station over a flat-horizon site', () => {
  const passes = findPasses({ site, satellites: [station], from: '2026-11-30', to: '2026-12-06' });

  it('finds passes, each rising to its culmination and setting', () => {
    expect(passes.length).toBeGreaterThan(5);
    for (const p of passes) {
      expect(p.start.time < p.culmination.time && p.culmination.time < p.end.time).toBe(true);
      expect(p.culmination.altitudeDeg).toBeGreaterThan(10);
    }
  });

  it('start, culmination and end agree with astronomy-engine within 0.5 s (and 0.02° at culmination)', () => {
    const timeErrors: number[] = [];
    for (const p of passes) {
      const alt = (ms: number): number => independentAltitude(station, new Date(ms)) - 10;
      const t0 = p.start.time.getTime();
      const t1 = p.end.time.getTime();
      const s0 = bisect(alt, t0 - 120_000, t0 + 60_000);
      const s1 = bisect(alt, t1 - 60_000, t1 + 120_000);
      timeErrors.push((s0 - t0) / 1000, (s1 - t1) / 1000);
      expectWithin(s0, t0, 0.5 * SECOND_MS, `start ${p.start.time.toISOString()}`);
      expectWithin(s1, t1, 0.5 * SECOND_MS, `end ${p.end.time.toISOString()}`);
      // Culmination: the highest independent altitude, sampled every 50 ms within 5 s of ours
      // (near the zenith the altitude peaks sharply, at up to 1°/s).
      let best = -90;
      let bestMs = 0;
      for (let ms = p.culmination.time.getTime() - 5000; ms <= p.culmination.time.getTime() + 5000; ms += 50) {
        const a = independentAltitude(station, new Date(ms));
        if (a > best) [best, bestMs] = [a, ms];
      }
      expectWithin(p.culmination.altitudeDeg, best, 0.02, 'culmination altitude');
      expectWithin(p.culmination.time.getTime(), bestMs, 0.5 * SECOND_MS, 'culmination time');
      timeErrors.push((bestMs - p.culmination.time.getTime()) / 1000);
    }
    const stats = errorStats(timeErrors);
    console.log(`pass times vs astronomy-engine: n=${stats.n} rms=${stats.rms.toFixed(2)} s max=${stats.max.toFixed(2)} s`);
  });

  it("shadow entries and exits agree within 0.5 s with the cylinder of the Earth's radius along astronomy-engine's Sun", () => {
    // Half the Sun's disc covered ⇔ the Earth's limb crosses the Sun's centre ⇔ the satellite
    // is one Earth radius from the shadow axis (the Sun's parallax shifts this by < 1 m).
    const cylinder = (ms: number): number => {
      const date = new Date(ms);
      const time = Astronomy.MakeTime(date);
      const s = Astronomy.RotateVector(Astronomy.Rotation_EQJ_EQD(time), Astronomy.GeoVector(Astronomy.Body.Sun, time, true));
      const n = Math.hypot(s.x, s.y, s.z);
      const u = [s.x / n, s.y / n, s.z / n];
      const p = propagate(station.elements.satrec, date)!.position;
      const along = p.x * u[0]! + p.y * u[1]! + p.z * u[2]!;
      const off = Math.hypot(p.x - along * u[0]!, p.y - along * u[1]!, p.z - along * u[2]!);
      return along > 0 ? 1 : off - EARTH_RADIUS_KM;
    };
    const crossings = passes.flatMap((p) => p.shadow);
    expect(crossings.length).toBeGreaterThan(0);
    const errors: number[] = [];
    for (const c of crossings) {
      const t = c.point.time.getTime();
      const independent = bisect(cylinder, t - 30_000, t + 30_000);
      errors.push((independent - t) / 1000);
      expectWithin(independent, t, 0.5 * SECOND_MS, `${c.kind} ${c.point.time.toISOString()}`);
      expect(c.kind === 'enters-shadow' ? cylinder(t - 20_000) > 0 : cylinder(t + 20_000) > 0).toBe(true);
    }
    const stats = errorStats(errors);
    console.log(`shadow crossings vs cylinder: n=${stats.n} rms=${stats.rms.toFixed(2)} s max=${stats.max.toFixed(2)} s`);
  });

  it('recommends exactly the naked-eye passes seen for a minute or more, never one in the shadow, and gives the element age', () => {
    for (const p of passes) {
      expect(p.recommended).toBe(p.verdict === 'naked-eye' && p.visible!.end.time.getTime() - p.visible!.start.time.getTime() >= 60_000);
      if (p.reason === 'earth-shadow') expect([p.start.sunlit, p.culmination.sunlit, p.end.sunlit]).toEqual([false, false, false]);
      if (p.visible) {
        expect(p.visible.best.sunlit).toBe(true);
        expect(p.sky.margin).toBeGreaterThan(0);
      }
      expectWithin(p.elements.ageDays, (p.culmination.time.getTime() - station.elements.epoch.getTime()) / 86_400_000, 1e-6, 'age days');
    }
    expect(passes.some((p) => p.recommended)).toBe(true);
  });
});

describe('element freshness', () => {
  it(`refuses passes more than ${MAX_ELEMENT_AGE_DAYS} days from the epoch, naming the element file`, () => {
    let error: unknown;
    try {
      findPasses({ site, satellites: [station], from: '2027-01-10', to: '2027-01-11' });
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(GloamingError);
    expect((error as GloamingError).code).toBe('stale-elements');
    expect((error as GloamingError).message).toMatch(/demo\.tle:\d+: the element set of Demo station \(epoch 2026-12-03T12:00Z\) is 40 days from the requested dates/);
    // Night by night, the same dates are unavailable, not refused.
    const nights = passNights({ site, satellites: [station], from: '2027-01-10', to: '2027-01-11' });
    expect(nights.map((n) => [n.date, n.passes.length, n.unavailable.map((u) => u.id)])).toEqual([
      ['2027-01-10', 0, ['demo-station']],
      ['2027-01-11', 0, ['demo-station']],
    ]);
  });

  it(`predicts a night only when the elements are within ${MAX_ELEMENT_AGE_DAYS} days of all of it`, () => {
    // Epoch 2026-12-03 12:00 UT: the night of 16 December (noon to noon, UT+0) ends 14.0 days later, that of the 17th 15 days later.
    const nights = passNights({ site, satellites: [station], from: '2026-12-15', to: '2026-12-17' });
    expect(nights.map((n) => n.unavailable.length)).toEqual([0, 0, 1]);
    expect(nights[0]!.passes.length + nights[1]!.passes.length).toBeGreaterThan(0);
  });
});

describe('standard magnitudes (Lambert sphere)', () => {
  it('the phase function integrates to the published phase integral q = 3/2 (Russell 1916)', () => {
    let q = 0;
    const n = 20_000;
    for (let i = 0; i < n; i++) {
      const a = ((i + 0.5) * Math.PI) / n;
      q += 2 * lambertPhaseFunction((a * 180) / Math.PI) * Math.sin(a) * (Math.PI / n);
    }
    expectWithin(q, 1.5, 1e-6, 'phase integral');
  });

  it('returns the standard magnitude at 1000 km and 90°, 5 log10 of range, and nothing in the umbra', () => {
    expectWithin(satelliteMagnitude({ standardMagnitude: -1.3, rangeKm: 1000, phaseAngleDeg: 90 }), -1.3, 1e-12, 'standard conditions');
    // Full phase: π Φ(0) = π, i.e. 2.5 log10 π = 1.243 mag brighter than half phase.
    expectWithin(satelliteMagnitude({ standardMagnitude: 0, rangeKm: 1000, phaseAngleDeg: 0 }), -2.5 * Math.log10(Math.PI), 1e-12, 'full phase');
    expectWithin(satelliteMagnitude({ standardMagnitude: 0, rangeKm: 500, phaseAngleDeg: 90 }), 5 * Math.log10(0.5), 1e-12, 'half range');
    expect(satelliteMagnitude({ standardMagnitude: 0, rangeKm: 500, phaseAngleDeg: 90, sunlitFraction: 0 })).toBe(Infinity);
  });
});

describe('element files of the demo', () => {
  it('reads the committed element sets in both formats', () => {
    const tle = readTle(readFileSync(new URL('../content/satellites/demo.tle', import.meta.url), 'utf8'), 'demo.tle');
    expect(tle.length).toBeGreaterThanOrEqual(3);
    expect(satellites.map((s) => s.id)).toContain('demo-cargo-ship');
  });
});

describe('interpolated SGP4 states', () => {
  it('stay within 20 m of SGP4 itself between nodes two minutes apart (a day of the demo station)', () => {
    const base = utDays(new Date('2026-12-04T00:00:00Z'));
    const track = new StateTrack(station.elements, { baseUt: base, nodeDays: 2 / 1440 });
    const errors: number[] = [];
    for (let i = 0; i < 1000; i++) {
      const ut = base + i * 0.001 + 0.0003;
      const a = track.at(ut)!.positionKm;
      const b = stateAt(station.elements, ut)!.positionKm;
      errors.push(Math.hypot(a[0] - b[0], a[1] - b[1], a[2] - b[2]) * 1000);
    }
    const stats = errorStats(errors);
    console.log(`Hermite interpolation vs SGP4: rms=${stats.rms.toFixed(2)} m max=${stats.max.toFixed(2)} m`);
    expect(stats.max).toBeLessThan(20);
  });
});
