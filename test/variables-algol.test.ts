/**
 * Algol's minima against its published ephemeris (GCVS: Min I = HJD 2445641.5135 + 2.8673043 E),
 * with the light-time correction computed independently from Meeus's low-precision Sun
 * (astronomia `solar`, *Astronomical Algorithms* ch. 25, referred to the J2000 ecliptic), and the
 * site's view of each minimum against astronomy-engine's own Sun and star altitudes.
 */
import * as Astronomy from 'astronomy-engine';
import * as solar from 'astronomia/solar';
import { describe, expect, it } from 'vitest';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { parseBulletin, renderBulletinSync, WeekCache } from '../lib/outputs/bulletin/index.ts';
import { BodyRegistry } from '../lib/core/body.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { DARK_SUN_ALTITUDE_DEG, MIN_STAR_ALTITUDE_DEG } from '../lib/outputs/almanac/variables.ts';
import { loadSites } from '../lib/models/content.ts';
import { starByHip } from '../lib/models/stars/catalogue.ts';
import { ALGOL } from '../lib/models/variables/catalogue.ts';
import { primaryMinima } from '../lib/models/variables/minima.ts';
import { errorStats, expectWithin, SECOND_MS } from './helpers/tolerance.ts';

const RAD = Math.PI / 180;
const JD_UNIX = 2_440_587.5;
/** Light time for 1 AU, seconds (IAU 2012: 149 597 870 700 m / 299 792 458 m/s). */
const AU_LIGHT_S = 499.004784;
/** Mean obliquity of the ecliptic at J2000 (IAU 1980, Meeus eq. 22.2). */
const EPSILON_J2000 = 23.4392911 * RAD;

/** HJD − JD at `jd` from Meeus's Sun (the Earth is opposite it), for a star at J2000 (raDeg, decDeg), days. */
function meeusCorrectionDays(jd: number, raDeg: number, decDeg: number): number {
  const T = (jd - 2_451_545) / 36_525;
  const lon = solar.true2000(T).lon + Math.PI; // the Earth seen from the Sun
  const r = solar.radius(T);
  // Ecliptic (latitude 0) to J2000 equatorial.
  const x = r * Math.cos(lon);
  const y = r * Math.sin(lon) * Math.cos(EPSILON_J2000);
  const z = r * Math.sin(lon) * Math.sin(EPSILON_J2000);
  const a = raDeg * RAD, d = decDeg * RAD;
  return ((x * Math.cos(d) * Math.cos(a) + y * Math.cos(d) * Math.sin(a) + z * Math.sin(d)) * AU_LIGHT_S) / 86_400;
}

describe("Algol's primary minima", () => {
  const star = starByHip(ALGOL.hip)!;
  const from = new Date('2026-01-01T00:00:00Z');
  const to = new Date('2027-01-01T00:00:00Z');
  const minima = primaryMinima(ALGOL, from, to);

  it('one every 2.867 days: 127 or 128 in a year, in order, inside the range', () => {
    expect(minima.length).toBeGreaterThanOrEqual(127);
    expect(minima.length).toBeLessThanOrEqual(128);
    for (let i = 1; i < minima.length; i++) {
      // Successive minima differ by the period plus the change of the light-time correction (< 30 s over 3 days).
      expectWithin(minima[i]!.getTime() - minima[i - 1]!.getTime(), ALGOL.periodDays * 86_400_000, 30 * SECOND_MS, `gap ${i}`);
    }
    expect(minima[0]! >= from && minima[minima.length - 1]! < to).toBe(true);
  });

  it('each is the ephemeris minimum (GCVS) less the light time, within 2 s of an independent correction (Meeus ch. 25 Sun)', () => {
    const errors: number[] = [];
    for (const t of minima) {
      const jd = t.getTime() / 86_400_000 + JD_UNIX;
      const hjd = jd + meeusCorrectionDays(jd, star.raDeg, star.decDeg);
      const cycles = (hjd - ALGOL.epochHjd) / ALGOL.periodDays;
      // A whole number of cycles from the published epoch.
      const offsetS = (cycles - Math.round(cycles)) * ALGOL.periodDays * 86_400;
      errors.push(offsetS);
      expect(Math.abs(offsetS), t.toISOString()).toBeLessThan(2);
    }
    console.log(`Algol minima vs GCVS ephemeris with Meeus light time: ${JSON.stringify(errorStats(errors))} s`);
  });

  it('the light-time correction swings over the year by up to ±499 s × cos β (Algol at ecliptic latitude ≈ 22°)', () => {
    const corrections = minima.map((t) => {
      const jd = t.getTime() / 86_400_000 + JD_UNIX;
      const hjd = ALGOL.epochHjd + ALGOL.periodDays * Math.round((jd - ALGOL.epochHjd) / ALGOL.periodDays);
      return (hjd - jd) * 86_400;
    });
    const beta = Math.asin(Math.sin(star.decDeg * RAD) * Math.cos(EPSILON_J2000) - Math.cos(star.decDeg * RAD) * Math.sin(EPSILON_J2000) * Math.sin(star.raDeg * RAD));
    const amplitude = AU_LIGHT_S * Math.cos(beta);
    expect(Math.max(...corrections)).toBeGreaterThan(0.9 * amplitude);
    expect(Math.min(...corrections)).toBeLessThan(-0.9 * amplitude);
    expect(Math.max(...corrections.map(Math.abs))).toBeLessThan(1.02 * amplitude);
  });
});

describe('variable-minimum events', () => {
  const sites = loadSites('content/sites');
  const harbour = sites.get('harbour-roof')!;
  const from = new Date('2026-10-01T12:00:00Z');
  const to = new Date('2027-01-01T12:00:00Z');
  const events = findEvents({ site: harbour, from, to, options: { types: ['variable-minimum'] } });
  const observer = new Astronomy.Observer(harbour.latitudeDeg, harbour.longitudeDeg, harbour.elevationM);
  const star = starByHip(ALGOL.hip)!;
  const altitudes = (date: Date): { sun: number; algol: number } => {
    const time = Astronomy.MakeTime(date);
    const sun = Astronomy.Equator(Astronomy.Body.Sun, time, observer, true, true);
    // Algol at J2000 precessed to the date (Astronomy.Rotation_EQJ_EQD).
    const v = Astronomy.RotateVector(Astronomy.Rotation_EQJ_EQD(time), Astronomy.VectorFromSphere(new Astronomy.Spherical(star.decDeg, star.raDeg, 1), time));
    const eq = Astronomy.EquatorFromVector(v);
    return { sun: Astronomy.Horizon(time, observer, sun.ra, sun.dec, 'normal').altitude, algol: Astronomy.Horizon(time, observer, eq.ra, eq.dec, 'normal').altitude };
  };

  it('one event per minimum, listed whether it can be watched or not', () => {
    expect(events.map((e) => e.time.getTime())).toEqual(primaryMinima(ALGOL, from, to).map((t) => t.getTime()));
    expect(events.some((e) => e.visible)).toBe(true);
    expect(events.some((e) => !e.visible)).toBe(true);
  });

  it(`visible ones: within an hour of minimum, the Sun ≥ ${-DARK_SUN_ALTITUDE_DEG}° down and Algol ≥ ${MIN_STAR_ALTITUDE_DEG}° up (astronomy-engine); hidden ones fail that all hour`, () => {
    for (const e of events) {
      if (e.visible) {
        const at = e.visibility.time!;
        expect(Math.abs(at.getTime() - e.time.getTime())).toBeLessThanOrEqual(3_600_000);
        const a = altitudes(at);
        expect(a.sun, `${e.time.toISOString()} Sun`).toBeLessThan(DARK_SUN_ALTITUDE_DEG + 0.05);
        expect(a.algol, `${e.time.toISOString()} Algol`).toBeGreaterThan(MIN_STAR_ALTITUDE_DEG - 0.05);
        expect(e.description).toMatch(/^Algol fades from magnitude 2\.1 to 3\.3 around \d\d:\d\d on \w{3} \d+ \w{3}, .*look [a-z-]+, \d+° up, at \d\d:\d\d/);
      } else {
        for (let m = -60; m <= 60; m += 5) {
          const a = altitudes(new Date(e.time.getTime() + m * 60_000));
          // The harbour terrace's skyline stays below 17°: the 20° limit decides.
          expect(a.sun > DARK_SUN_ALTITUDE_DEG - 0.05 || a.algol < MIN_STAR_ALTITUDE_DEG + 0.05, `${e.time.toISOString()} ${m} min`).toBe(true);
        }
        expect(e.visibility.reason).toMatch(/^(daylight|below-horizon)$/);
      }
    }
  });

  it('a hidden minimum says once why it cannot be watched, in its sentence and in the bulletin list', () => {
    const hiddenOnes = events.filter((e) => !e.visible);
    expect(hiddenOnes.length).toBeGreaterThan(0);
    const count = (text: string, part: string): number => text.split(part).length - 1;
    for (const e of hiddenOnes) {
      expect(count(e.description, 'Not visible from Harbour Roof Terrace: '), e.description).toBe(1);
      expect(e.description.endsWith(e.visibility.note), e.description).toBe(true);
    }
    // The week of 30 November 2026 has a minimum in daylight (Sat 5 Dec, 15:24 local).
    const page = renderBulletinSync(parseBulletin('---\ntitle: Events\nsites: all\nschedule: { every: week, past: 0, future: 0 }\n---\n\n::events\n', 'events.md'), { site: harbour, week: isoWeekOf('2026-12-04'), bodies: new BodyRegistry() }, new WeekCache());
    const items = [...page.html.matchAll(/<li data-type="variable-minimum" data-visible="false"[^>]*>(.*?)<\/li>/g)].map((m) => m[1]!.replace(/<[^>]+>/g, ''));
    expect(items.length).toBeGreaterThan(0);
    for (const item of items) expect(count(item, 'the sky is not dark then') + count(item, 'while the sky is dark'), item).toBe(1);
  });
});
