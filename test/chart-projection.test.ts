/**
 * The chart projection against the stereographic projection's published definition (Snyder, J. P.
 * 1987, "Map Projections — A Working Manual", USGS Professional Paper 1395, §21): a point at
 * angular distance c from the centre lies at ρ = 2R tan(c/2) (eq. 21-1 with k0 = 1), in the
 * direction of its azimuth from the centre (azimuthal projection), and the point scale is
 * k = 2/(1 + cos c) in every direction (eq. 21-4: conformal). Angular distances and bearings
 * come from astronomy-engine (`AngleBetween` on vectors), not from the projection code.
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { stereographic } from '../lib/outputs/chart/projection.ts';
import { expectWithin } from './helpers/tolerance.ts';
import { seededRandom } from './helpers/random.ts';

const RAD = Math.PI / 180;


/** Horizontal unit vector (x north, y east, z up) for the outside angle computation. */
function vec(altitudeDeg: number, azimuthDeg: number): Astronomy.Vector {
  const a = altitudeDeg * RAD, z = azimuthDeg * RAD;
  return new Astronomy.Vector(Math.cos(a) * Math.cos(z), Math.cos(a) * Math.sin(z), Math.sin(a), Astronomy.MakeTime(new Date(0)));
}

describe('stereographic projection (Snyder 1987 §21)', () => {
  const rnd = seededRandom(7);
  const cases = Array.from({ length: 400 }, () => ({
    centre: { altitudeDeg: -10 + 100 * rnd(), azimuthDeg: 360 * rnd() },
    alt: -20 + 110 * rnd(),
    az: 360 * rnd(),
  })).filter((c) => Astronomy.AngleBetween(vec(c.centre.altitudeDeg, c.centre.azimuthDeg), vec(c.alt, c.az)) < 150);

  it('puts a point at ρ = 2 tan(c/2), c from astronomy-engine AngleBetween (eq. 21-1)', () => {
    for (const c of cases) {
      const p = stereographic(c.centre).project(c.alt, c.az)!;
      const angle = Astronomy.AngleBetween(vec(c.centre.altitudeDeg, c.centre.azimuthDeg), vec(c.alt, c.az));
      expectWithin(Math.hypot(p.x, p.y), 2 * Math.tan((angle * RAD) / 2), 1e-9, 'ρ');
    }
  });

  it('inverse returns the original direction (eqs. 20-14, 20-15, 21-15)', () => {
    for (const c of cases) {
      const proj = stereographic(c.centre);
      const p = proj.project(c.alt, c.az)!;
      const back = proj.unproject(p.x, p.y);
      const err = Astronomy.AngleBetween(vec(back.altitudeDeg, back.azimuthDeg), vec(c.alt, c.az));
      expect(err).toBeLessThan(1e-6);
    }
  });

  it('is conformal: the scale along altitude and along azimuth both equal 2/(1 + cos c) (eq. 21-4)', () => {
    const h = 1e-4;
    for (const c of cases.slice(0, 100)) {
      if (Math.abs(c.alt) > 80) continue;
      const proj = stereographic(c.centre);
      const p = proj.project(c.alt, c.az)!;
      const pa = proj.project(c.alt + h, c.az)!;
      const pz = proj.project(c.alt, c.az + h)!;
      const kAlt = Math.hypot(pa.x - p.x, pa.y - p.y) / (h * RAD);
      const kAz = Math.hypot(pz.x - p.x, pz.y - p.y) / (h * RAD * Math.cos(c.alt * RAD));
      const cosC = Math.cos(Astronomy.AngleBetween(vec(c.centre.altitudeDeg, c.centre.azimuthDeg), vec(c.alt, c.az)) * RAD);
      expectWithin(kAlt, 2 / (1 + cosC), 1e-4, 'k along altitude');
      expectWithin(kAz, 2 / (1 + cosC), 1e-4, 'k along azimuth');
      // Conformal maps keep right angles: the two grid directions stay perpendicular.
      const dot = (pa.x - p.x) * (pz.x - p.x) + (pa.y - p.y) * (pz.y - p.y);
      expect(Math.abs(dot) / (Math.hypot(pa.x - p.x, pa.y - p.y) * Math.hypot(pz.x - p.x, pz.y - p.y))).toBeLessThan(1e-4);
    }
  });

  it('facing south at the horizon, east (azimuth 90°) is on the left and the zenith is up (observer inside the sphere)', () => {
    const proj = stereographic({ altitudeDeg: 0, azimuthDeg: 180 });
    expect(proj.project(0, 135)!.x).toBeLessThan(0);
    expect(proj.project(0, 225)!.x).toBeGreaterThan(0);
    expect(proj.project(40, 180)!.y).toBeGreaterThan(0);
    // The horizon through the centre is a straight line (a great circle through the centre).
    for (const az of [120, 150, 210, 240]) expect(Math.abs(proj.project(0, az)!.y)).toBeLessThan(1e-12);
  });
});
