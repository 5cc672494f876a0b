/**
 * The guide pattern and its words. Offsets are checked against the position-angle formula of
 * spherical astronomy written in altitude and azimuth (Meeus, Astronomical Algorithms 2nd ed.,
 * eq. 48.5, with altitude for declination and azimuth for right ascension), with alt-az places from
 * astronomy-engine's `Horizon`, over random geometry in both hemispheres, every quadrant of azimuth
 * and near the zenith; and against plain alt-az differences for small offsets.
 * Hand measures: common practice, fist ≈ 10°, finger ≈ 2°.
 */
import { describe, expect, it } from 'vitest';
import {
  Body,
  DefineStar,
  Equator,
  EquatorFromVector,
  Horizon,
  MakeTime,
  Observer,
  RotateVector,
  Rotation_EQJ_EQD,
  Rotation_HOR_EQD,
  VectorFromHorizon,
  VectorFromSphere,
  Spherical,
  type AstroTime,
} from 'astronomy-engine';
import { offsetInSky, type OffsetDirection } from '../lib/core/geometry.ts';
import { describeMotion, distanceWords, guideTarget, IN_PATTERN_DEG, NEAR_BODY_DEG, NEAR_STAR_DEG } from '../lib/models/stars/guide.ts';
import { starByHip, starByName } from '../lib/models/stars/catalogue.ts';
import { patternById } from '../lib/models/stars/patterns.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { angleDiffDeg, expectWithin, separationDeg } from './helpers/tolerance.ts';
import { seededRandom } from './helpers/random.ts';

const R = Math.PI / 180;
const SECTORS: OffsetDirection[] = ['above', 'upper right', 'right', 'lower right', 'below', 'lower left', 'left', 'upper left'];


/**
 * Position angle of point 2 seen from point 1, measured from the zenith direction toward increasing
 * azimuth (to the right for an observer facing point 1): Meeus eq. 48.5 with (altitude, azimuth) in
 * place of (declination, right ascension); the sign of the azimuth term is reversed because
 * azimuth increases to the right where right ascension increases to the left.
 */
function positionAngleDeg(alt1: number, az1: number, alt2: number, az2: number): number {
  const y = Math.sin(alt2 * R) * Math.cos(alt1 * R) - Math.cos(alt2 * R) * Math.sin(alt1 * R) * Math.cos((az2 - az1) * R);
  const x = Math.cos(alt2 * R) * Math.sin((az2 - az1) * R);
  return ((Math.atan2(x, y) / R) + 360) % 360;
}
const sectorOf = (pa: number): OffsetDirection => SECTORS[Math.round(pa / 45) % 8]!;
/** Degrees from `pa` to the nearest sector boundary (22.5° + k·45°). */
const boundaryDistance = (pa: number): number => 22.5 - Math.abs(((((pa - 22.5) % 45) + 45) % 45) - 22.5);

/** Great-circle separation in alt-az (spherical law of cosines, haversine form). */
function altAzSeparationDeg(alt1: number, az1: number, alt2: number, az2: number): number {
  return separationDeg(az1 / 15, alt1, az2 / 15, alt2);
}

describe('offset words against the alt-az position angle (Meeus eq. 48.5 in alt-az)', () => {
  it('agree in every quadrant of azimuth, at every altitude up to 89.5°, for offsets up to 25°', () => {
    const random = seededRandom(20261201);
    const quadrants = new Set<number>();
    let checked = 0;
    let nearZenith = 0;
    for (let i = 0; i < 4000; i++) {
      const alt1 = -5 + random() * 94.5; // −5° … 89.5°
      const az1 = random() * 360;
      const alt2 = Math.max(-10, Math.min(89.99, alt1 + (random() - 0.5) * 30));
      const az2 = az1 + ((random() - 0.5) * 40) / Math.max(0.05, Math.cos(alt1 * R));
      const sep = altAzSeparationDeg(alt1, az1, alt2, az2);
      if (sep < 0.05 || sep > 25) continue;
      const pa = positionAngleDeg(alt1, az1, alt2, az2);
      if (boundaryDistance(pa) < 0.1) continue;
      const got = offsetInSky({ fromAltitudeDeg: alt1, fromAzimuthDeg: az1, toAltitudeDeg: alt2, toAzimuthDeg: az2 });
      expect(got.offsetDirection, `from (${alt1.toFixed(2)}, ${az1.toFixed(2)}) to (${alt2.toFixed(2)}, ${az2.toFixed(2)}), PA ${pa.toFixed(2)}`).toBe(sectorOf(pa));
      expect(angleDiffDeg(got.positionAngleDeg, pa)).toBeLessThan(1e-6);
      expectWithin(got.separationDeg, sep, 1e-9, 'separation');
      quadrants.add(Math.floor((((az1 % 360) + 360) % 360) / 90));
      if (alt1 > 80) nearZenith++;
      checked++;
    }
    expect(checked).toBeGreaterThan(3000);
    expect(quadrants.size).toBe(4);
    expect(nearZenith).toBeGreaterThan(100);
  });

  it('agree with plain alt-az differences for small offsets (Δalt up, Δaz·cos alt right)', () => {
    const random = seededRandom(7);
    let checked = 0;
    for (let i = 0; i < 4000; i++) {
      const alt1 = -5 + random() * 94; // up to 89°
      const az1 = random() * 360;
      const zenithDistance = 90 - alt1;
      const size = Math.min(10, 0.2 * zenithDistance) * random();
      const angle = random() * 2 * Math.PI;
      const dAlt = size * Math.cos(angle);
      const dAzScaled = size * Math.sin(angle);
      const alt2 = alt1 + dAlt;
      const az2 = az1 + dAzScaled / Math.cos(alt1 * R);
      const flat = ((Math.atan2(dAzScaled, dAlt) / R) + 360) % 360;
      if (size < 0.01 || boundaryDistance(flat) < 12) continue;
      const got = offsetInSky({ fromAltitudeDeg: alt1, fromAzimuthDeg: az1, toAltitudeDeg: alt2, toAzimuthDeg: az2 });
      expect(got.offsetDirection, `Δalt ${dAlt.toFixed(3)}, Δaz·cos alt ${dAzScaled.toFixed(3)} at alt ${alt1.toFixed(2)}`).toBe(sectorOf(flat));
      checked++;
    }
    expect(checked).toBeGreaterThan(1500);
  });

  it('from the zenith every other point is below', () => {
    for (const az of [0, 90, 180, 270, 33]) {
      expect(offsetInSky({ fromAltitudeDeg: 90, fromAzimuthDeg: 0, toAltitudeDeg: 85, toAzimuthDeg: az }).offsetDirection).toBe('below');
      expect(offsetInSky({ fromAltitudeDeg: 89.7, fromAzimuthDeg: 120, toAltitudeDeg: 88, toAzimuthDeg: az }).offsetDirection).toBe('below');
    }
  });

  it('straight up, down, left and right in each quadrant (facing north, east, south, west)', () => {
    for (const az of [0, 90, 180, 270]) {
      const from = { fromAltitudeDeg: 40, fromAzimuthDeg: az };
      expect(offsetInSky({ ...from, toAltitudeDeg: 45, toAzimuthDeg: az }).offsetDirection).toBe('above');
      expect(offsetInSky({ ...from, toAltitudeDeg: 35, toAzimuthDeg: az }).offsetDirection).toBe('below');
      // Facing any direction, azimuth increases to the right (facing north, east is on the right).
      expect(offsetInSky({ ...from, toAltitudeDeg: 40, toAzimuthDeg: az + 5 }).offsetDirection).toBe('right');
      expect(offsetInSky({ ...from, toAltitudeDeg: 40, toAzimuthDeg: az - 5 }).offsetDirection).toBe('left');
    }
  });
});

/** A star's apparent place of date via astronomy-engine (DefineStar + Equator), then Horizon without refraction. */
function starAltAz(hip: number, time: AstroTime, site: Observer): { altitudeDeg: number; azimuthDeg: number } {
  const s = starByHip(hip)!;
  DefineStar(Body.Star1, s.raDeg / 15, s.decDeg, 1000);
  const eq = Equator(Body.Star1, time, site, true, true);
  const h = Horizon(time, site, eq.ra, eq.dec);
  return { altitudeDeg: h.altitude, azimuthDeg: h.azimuth };
}

/** Apparent RA/Dec of date of a point given by altitude and azimuth (astronomy-engine, no refraction). */
function placeAt(altitudeDeg: number, azimuthDeg: number, time: AstroTime, site: Observer): { raHours: number; decDeg: number } {
  const hor = VectorFromHorizon(new Spherical(altitudeDeg, azimuthDeg, 1), time, '');
  const eq = EquatorFromVector(RotateVector(Rotation_HOR_EQD(time, site), hor));
  return { raHours: eq.ra, decDeg: eq.dec };
}

describe('guideTarget end to end: words agree with astronomy-engine alt-az places', () => {
  it('nearest star and pattern anchor directions agree for random sites (both hemispheres), times and targets', () => {
    const random = seededRandom(42);
    const start = MakeTime(new Date('2026-01-01T00:00:00Z'));
    let checked = 0;
    let south = 0;
    let north = 0;
    let highTargets = 0;
    const quadrants = new Set<number>();
    for (let i = 0; i < 300; i++) {
      const latitudeDeg = -85 + random() * 170;
      const longitudeDeg = -180 + random() * 360;
      const observer = { latitudeDeg, longitudeDeg, elevationM: 0 };
      const site = new Observer(latitudeDeg, longitudeDeg, 0);
      const time = start.AddDays(random() * 365);
      // A target well above the horizon, anywhere in azimuth, sometimes near the zenith.
      const altitudeDeg = random() < 0.2 ? 80 + random() * 9.5 : 15 + random() * 65;
      const azimuthDeg = random() * 360;
      const target = placeAt(altitudeDeg, azimuthDeg, time, site);
      const result = guideTarget({ observer, time, target });
      if (!result) continue;
      const checks: { hip: number; direction: OffsetDirection; sep: number }[] = [];
      if (result.nearestStar) checks.push({ hip: result.nearestStar.hip, direction: result.nearestStar.offsetDirection, sep: result.nearestStar.separationDeg });
      if (result.anchorStar) checks.push({ hip: starByName(result.anchorStar).hip, direction: result.offsetDirection!, sep: result.separationDeg! });
      for (const c of checks) {
        const star = starAltAz(c.hip, time, site);
        const pa = positionAngleDeg(star.altitudeDeg, star.azimuthDeg, altitudeDeg, azimuthDeg);
        const sep = altAzSeparationDeg(star.altitudeDeg, star.azimuthDeg, altitudeDeg, azimuthDeg);
        // astronomy-engine includes stellar aberration (≤ 20″), the guide does not: separations agree
        // within 0.01°, and directions unless the target sits within 1° of a sector boundary.
        expectWithin(c.sep, sep, 0.01, 'separation from the star');
        // Within 0.5° of the zenith "up" is undefined and the guide says 'below' (its documented convention).
        if (sep < 1 || boundaryDistance(pa) < 1 || star.altitudeDeg > 89.4) continue;
        expect(c.direction, `site ${latitudeDeg.toFixed(1)},${longitudeDeg.toFixed(1)} star HIP ${c.hip} PA ${pa.toFixed(1)}`).toBe(sectorOf(pa));
        checked++;
        if (latitudeDeg < 0) south++;
        else north++;
        if (altitudeDeg > 80) highTargets++;
        quadrants.add(Math.floor(azimuthDeg / 90));
      }
    }
    expect(checked).toBeGreaterThan(200);
    expect(south).toBeGreaterThan(50);
    expect(north).toBeGreaterThan(50);
    expect(highTargets).toBeGreaterThan(20);
    expect(quadrants.size).toBe(4);
  });
});

describe('guideTarget scenarios', () => {
  const observer = { latitudeDeg: 51.5, longitudeDeg: -0.1, elevationM: 10 };
  const site = new Observer(observer.latitudeDeg, observer.longitudeDeg, observer.elevationM);
  // A spring evening in London: the Big Dipper stands high in the north-east (checked below).
  const time = MakeTime(new Date('2026-03-20T21:00:00Z'));

  it('a target about a fist below the bowl is described from the bowl of the Big Dipper', () => {
    // Late May at 22 h UT the handle stands above the bowl (Alkaid near the zenith), so below the bowl is clear sky.
    const late = MakeTime(new Date('2026-05-20T22:00:00Z'));
    const bowl = patternById('big-dipper').parts['bowl']!.map((hip) => starAltAz(hip, late, site));
    const handle = patternById('big-dipper').parts['handle']!.map((hip) => starAltAz(hip, late, site));
    expect(Math.min(...handle.map((s) => s.altitudeDeg))).toBeGreaterThan(Math.max(...bowl.map((s) => s.altitudeDeg)));
    // Centre of the bowl (mean of the unit vectors), then a point straight below it, 8° beyond the bowl's lowest star.
    const v = bowl.map((s) => [Math.cos(s.altitudeDeg * R) * Math.cos(s.azimuthDeg * R), Math.cos(s.altitudeDeg * R) * Math.sin(s.azimuthDeg * R), Math.sin(s.altitudeDeg * R)]);
    const c = [0, 1, 2].map((k) => v.reduce((sum, x) => sum + x[k]!, 0));
    const centreAlt = Math.atan2(c[2]!, Math.hypot(c[0]!, c[1]!)) / R;
    const centreAz = Math.atan2(c[1]!, c[0]!) / R;
    const lowestAlt = Math.min(...bowl.map((s) => s.altitudeDeg));
    const targetAlt = lowestAlt - 8;
    const result = guideTarget({ observer, time: late, target: placeAt(targetAlt, centreAz, late, site) });
    const edge = Math.min(...bowl.map((s) => altAzSeparationDeg(s.altitudeDeg, s.azimuthDeg, targetAlt, centreAz)));
    expect(centreAlt).toBeGreaterThan(targetAlt);
    expect(result?.pattern?.id).toBe('big-dipper');
    expect(result?.part).toBe('bowl');
    expect(result?.offsetDirection).toBe('below');
    expectWithin(result!.separationDeg!, edge, 0.02, 'distance below the bowl');
    expect(result?.phrase).toBe(`about ${Math.round(edge)}° (almost a fist) below the bowl of the Big Dipper`);
  });

  it('a target 2° to the upper right of Regulus names Regulus', () => {
    const regulus = starAltAz(starByName('Regulus').hip, time, site);
    expect(regulus.altitudeDeg).toBeGreaterThan(20);
    // 2° along position angle 45° (upper right), by the spherical offset formula.
    const d = 2 * R, pa = 45 * R, a1 = regulus.altitudeDeg * R;
    const alt2 = Math.asin(Math.sin(a1) * Math.cos(d) + Math.cos(a1) * Math.sin(d) * Math.cos(pa)) / R;
    const az2 = regulus.azimuthDeg + Math.atan2(Math.sin(pa) * Math.sin(d) * Math.cos(a1), Math.cos(d) - Math.sin(a1) * Math.sin(alt2 * R)) / R;
    const result = guideTarget({ observer, time, target: placeAt(alt2, az2, time, site) });
    expect(result?.nearestStar?.name).toBe('Regulus');
    expect(result?.nearestStar?.offsetDirection).toBe('upper right');
    expect(result?.nearestStar?.phrase).toBe('about 2° (about a finger) to the upper right of Regulus');
    expect(result?.pattern?.id).toBe('leo');
  });

  it('returns null only below the horizon, and rejects impossible sites', () => {
    const target = placeAt(60, 200, time, site);
    expect(guideTarget({ observer, time, target, maxSeparationDeg: 0.01 })?.kind).not.toBe('pattern');
    expect(guideTarget({ observer, time, target: placeAt(-3, 200, time, site) })).toBeNull();
    expect(() => guideTarget({ observer: { ...observer, latitudeDeg: 100 }, time, target })).toThrow(GloamingError);
    expect(() => guideTarget({ observer, time, target: { raHours: 25, decDeg: 0 } })).toThrow(GloamingError);
  });
});

describe('describeMotion over a week', () => {
  const t0 = MakeTime(new Date('2026-04-01T21:00:00Z'));
  /** Places of date for a point moving along a great circle from `from` toward `to` (J2000 stars) by `totalDeg` over 6 days. */
  function track(from: { raDeg: number; decDeg: number }, to: { raDeg: number; decDeg: number }, totalDeg: number, startOffsetDeg = 0) {
    const v = (ra: number, dec: number) => VectorFromSphere(new Spherical(dec, ra, 1), t0);
    const a = v(from.raDeg, from.decDeg), b = v(to.raDeg, to.decDeg);
    const omega = Math.acos(a.x * b.x + a.y * b.y + a.z * b.z);
    return [0, 2, 4, 6].map((day) => {
      const f = ((startOffsetDeg + (totalDeg * day) / 6) * R) / omega;
      const s1 = Math.sin((1 - f) * omega) / Math.sin(omega), s2 = Math.sin(f * omega) / Math.sin(omega);
      const time = t0.AddDays(day);
      const eqj = VectorFromSphere(new Spherical(0, 0, 1), time);
      eqj.x = s1 * a.x + s2 * b.x; eqj.y = s1 * a.y + s2 * b.y; eqj.z = s1 * a.z + s2 * b.z;
      const eq = EquatorFromVector(RotateVector(Rotation_EQJ_EQD(time), eqj));
      return { time, raHours: eq.ra, decDeg: eq.dec };
    });
  }
  const alkaid = starByName('Alkaid');
  const arcturus = starByName('Arcturus');
  const dubhe = starByName('Dubhe');

  it('names the star it heads for, with the distance moved', () => {
    // Start at Arcturus's place (20° from the handle) and move 6° straight toward Alkaid.
    const result = describeMotion({ patternId: 'big-dipper', places: track(arcturus, alkaid, 6) });
    expectWithin(result!.motionDeg, 6, 0.01, 'motion');
    expect(result?.toward).toBe('Alkaid');
    expect(result?.phrase).toBe('moves about 6° (about 3 fingers) toward Alkaid during the week');
  });

  it('says "away from" when the target leaves the pattern, and null when it hardly moves', () => {
    const away = describeMotion({ patternId: 'big-dipper', places: track(dubhe, arcturus, 5, 25) });
    expect(away?.away).toBe(true);
    expect(away?.phrase).toMatch(/^moves about 5° .* away from the Big Dipper during the week$/);
    expect(describeMotion({ patternId: 'big-dipper', places: track(arcturus, alkaid, 1.5) })).toBeNull();
  });
});

describe('distance words (common practice: fist ≈ 10°, finger ≈ 2°)', () => {
  it('reads degrees with a hand measure', () => {
    expect(distanceWords(8)).toBe('about 8° (almost a fist)');
    expect(distanceWords(2.1)).toBe('about 2° (about a finger)');
    expect(distanceWords(10.2)).toBe('about 10° (about a fist)');
    expect(distanceWords(0.4)).toBe('about 0.4° (less than a finger)');
    expect(distanceWords(20)).toBe('about 20° (about 2 fists)');
  });
});

/** The point `distanceDeg` from (alt, az) along position angle `paDeg` (from up through right): the spherical offset formula in alt-az. */
function offsetPoint(altDeg: number, azDeg: number, distanceDeg: number, paDeg: number): { altitudeDeg: number; azimuthDeg: number } {
  const d = distanceDeg * R, pa = paDeg * R, a1 = altDeg * R;
  const alt2 = Math.asin(Math.sin(a1) * Math.cos(d) + Math.cos(a1) * Math.sin(d) * Math.cos(pa));
  const daz = Math.atan2(Math.sin(pa) * Math.sin(d) * Math.cos(a1), Math.cos(d) - Math.sin(a1) * Math.sin(alt2));
  return { altitudeDeg: alt2 / R, azimuthDeg: azDeg + daz / R };
}

describe('guide rules, in their documented order', () => {
  // An autumn evening at 51.5° N: the Great Square of Pegasus stands high in the south (checked below).
  const observer = { latitudeDeg: 51.5, longitudeDeg: -0.1, elevationM: 10 };
  const site = new Observer(observer.latitudeDeg, observer.longitudeDeg, observer.elevationM);
  const time = MakeTime(new Date('2026-10-15T21:00:00Z'));
  const square = patternById('great-square').stars.map((hip) => ({ hip, name: starByHip(hip)!.name, ...starAltAz(hip, time, site) }));
  const noPatterns = { minAltitudeDeg: 91 }; // no reference point stands this high: rule 1 cannot apply

  /** Separation and direction of a named star's offset, from astronomy-engine places and Meeus eq. 48.5. */
  function expectOffsetFrom(starName: string, target: { altitudeDeg: number; azimuthDeg: number }, got: { separationDeg: number | null; offsetDirection: OffsetDirection | null }): void {
    const star = starAltAz(starByName(starName).hip, time, site);
    expectWithin(got.separationDeg!, altAzSeparationDeg(star.altitudeDeg, star.azimuthDeg, target.altitudeDeg, target.azimuthDeg), 0.01, `separation from ${starName}`);
    const pa = positionAngleDeg(star.altitudeDeg, star.azimuthDeg, target.altitudeDeg, target.azimuthDeg);
    if (boundaryDistance(pa) > 1) expect(got.offsetDirection).toBe(sectorOf(pa));
  }

  it('rule 1, inside the figure: "inside" always comes with a named star, a direction and a distance', () => {
    expect(Math.min(...square.map((s) => s.altitudeDeg))).toBeGreaterThan(30);
    // The middle of the Square: the alt-az mean of its four corners.
    const v = square.map((s) => [Math.cos(s.altitudeDeg * R) * Math.cos(s.azimuthDeg * R), Math.cos(s.altitudeDeg * R) * Math.sin(s.azimuthDeg * R), Math.sin(s.altitudeDeg * R)]);
    const c = [0, 1, 2].map((k) => v.reduce((sum, x) => sum + x[k]!, 0));
    const middle = { altitudeDeg: Math.atan2(c[2]!, Math.hypot(c[0]!, c[1]!)) / R, azimuthDeg: Math.atan2(c[1]!, c[0]!) / R };
    const result = guideTarget({ observer, time, target: placeAt(middle.altitudeDeg, middle.azimuthDeg, time, site) })!;
    expect(result.kind).toBe('pattern');
    expect(result.inside).toBe(true);
    expect(result.phrase).toMatch(/^inside the Great Square of Pegasus, about \d+° \([^)]+\) (above|below|to the (upper |lower )?(left|right) of) (Alpheratz|Scheat|Markab|Algenib)$/);
    expectOffsetFrom(result.anchorStar!, middle, result);
    expect(result.names).toEqual(expect.arrayContaining([{ kind: 'pattern', id: 'great-square', name: 'Great Square of Pegasus' }]));
  });

  it(`rule 1, outside the figure: "in <pattern>" only within ${IN_PATTERN_DEG}° of its stars`, () => {
    // Points straight out from Markab, away from the Square's middle, at growing distances.
    const markab = square.find((s) => s.name === 'Markab')!;
    const alpheratz = square.find((s) => s.name === 'Alpheratz')!;
    const away = (positionAngleDeg(markab.altitudeDeg, markab.azimuthDeg, alpheratz.altitudeDeg, alpheratz.azimuthDeg) + 180) % 360;
    for (const distance of [2, 4.5, 7, 12, 25]) {
      const p = offsetPoint(markab.altitudeDeg, markab.azimuthDeg, distance, away);
      const result = guideTarget({ observer, time, target: placeAt(p.altitudeDeg, p.azimuthDeg, time, site) })!;
      const nearestSquareStar = Math.min(...square.map((s) => altAzSeparationDeg(s.altitudeDeg, s.azimuthDeg, p.altitudeDeg, p.azimuthDeg)));
      expect(result.phrase, `${distance}°`).not.toMatch(/\binside\b/);
      if (nearestSquareStar <= IN_PATTERN_DEG - 0.1) {
        expect(result.phrase, `${distance}°`).toMatch(/, in the Great Square of Pegasus$/);
        expectOffsetFrom(result.anchorStar!, p, result);
      } else if (nearestSquareStar > IN_PATTERN_DEG + 0.1) {
        expect(result.phrase, `${distance}°`).not.toMatch(/, in the Great Square/);
      }
      if (result.kind === 'star') {
        expect(result.separationDeg!).toBeLessThanOrEqual(NEAR_STAR_DEG);
        expectOffsetFrom(result.anchorStar!, p, result);
      }
    }
  });

  it('rule 1, a compact figure: "in" reaches no farther than the figure is wide (the Pleiades, radius about 1°)', () => {
    const winter = MakeTime(new Date('2026-12-15T22:00:00Z'));
    const alcyone = starAltAz(starByName('Alcyone').hip, winter, site);
    expect(alcyone.altitudeDeg).toBeGreaterThan(40);
    for (const pa of [0, 90, 180, 270]) {
      const p = offsetPoint(alcyone.altitudeDeg, alcyone.azimuthDeg, 3.5, pa);
      const result = guideTarget({ observer, time: winter, target: placeAt(p.altitudeDeg, p.azimuthDeg, winter, site) })!;
      expect(result.phrase, `PA ${pa}`).not.toMatch(/in the Pleiades|inside/);
    }
  });

  it(`rule 2: the Moon or a bright planet within ${NEAR_BODY_DEG}°, when no pattern qualifies; faint planets do not guide`, () => {
    const target = { altitudeDeg: 8, azimuthDeg: 250 };
    const above = (distance: number) => offsetPoint(target.altitudeDeg, target.azimuthDeg, distance, 0);
    const companion = (id: string, name: string, kind: 'moon' | 'planet', magnitude: number, at: { altitudeDeg: number; azimuthDeg: number }) => ({
      id, name, kind, magnitude, place: placeAt(at.altitudeDeg, at.azimuthDeg, time, site),
    });
    const place = placeAt(target.altitudeDeg, target.azimuthDeg, time, site);
    const venus = guideTarget({ observer, time, target: place, ...noPatterns, companions: [companion('venus', 'Venus', 'planet', -4.1, above(6))] })!;
    expect(venus.kind).toBe('planet');
    expect(venus.anchorBody).toBe('venus');
    expect(venus.phrase).toBe('about 6° (about 3 fingers) below Venus');
    expect(venus.names).toEqual([{ kind: 'body', id: 'venus', name: 'Venus' }]);
    const moon = guideTarget({ observer, time, target: place, ...noPatterns, companions: [companion('moon', 'Moon', 'moon', -10, above(4)), companion('venus', 'Venus', 'planet', -4.1, above(6))] })!;
    expect(moon.kind).toBe('moon');
    expect(moon.phrase).toBe('about 4° (about 2 fingers) below the Moon');
    const faint = guideTarget({ observer, time, target: place, ...noPatterns, companions: [companion('uranus', 'Uranus', 'planet', 5.7, above(3))] })!;
    expect(faint.kind).not.toBe('planet');
    const far = guideTarget({ observer, time, target: place, ...noPatterns, companions: [companion('venus', 'Venus', 'planet', -4.1, above(NEAR_BODY_DEG + 1))] })!;
    expect(far.kind).not.toBe('planet');
  });

  it(`rule 3: a bright named star within ${NEAR_STAR_DEG}°, only the brightest ones in twilight`, () => {
    const altair = starAltAz(starByName('Altair').hip, time, site);
    const p = offsetPoint(altair.altitudeDeg, altair.azimuthDeg, 4, 90);
    const dark = guideTarget({ observer, time, target: placeAt(p.altitudeDeg, p.azimuthDeg, time, site), ...noPatterns })!;
    expect(dark.kind).toBe('star');
    expect(dark.anchorStar).toBe('Altair');
    expect(dark.phrase).toBe('about 4° (about 2 fingers) to the right of Altair');
    expect(dark.names).toEqual([{ kind: 'star', hip: starByName('Altair').hip, name: 'Altair' }]);
    // 4° from Enif (V 2.4): in the dark it guides; with the Sun 8° down only stars of V ≤ 1.5 may.
    const enif = starAltAz(starByName('Enif').hip, time, site);
    const q = offsetPoint(enif.altitudeDeg, enif.azimuthDeg, 4, 180);
    const target = placeAt(q.altitudeDeg, q.azimuthDeg, time, site);
    expect(guideTarget({ observer, time, target, ...noPatterns })!.anchorStar).toBe('Enif');
    const sun = placeAt(-8, 270, time, site);
    const twilight = guideTarget({ observer, time, target, sun, ...noPatterns })!;
    expect(twilight.anchorStar).not.toBe('Enif');
    if (twilight.anchorStar) expect(starByName(twilight.anchorStar).vMag).toBeLessThanOrEqual(1.5);
  });

  it('every target above the horizon gets a phrase, whatever the sky (random sites, times and places)', () => {
    const random = seededRandom(1313);
    const kinds = new Set<string>();
    for (let i = 0; i < 400; i++) {
      const obs = { latitudeDeg: -70 + random() * 140, longitudeDeg: -180 + random() * 360, elevationM: 0 };
      const s = new Observer(obs.latitudeDeg, obs.longitudeDeg, 0);
      const t = MakeTime(new Date('2026-01-01T00:00:00Z')).AddDays(random() * 730);
      const target = placeAt(random() * 89, random() * 360, t, s);
      const sunEq = Equator(Body.Sun, t, s, true, true);
      const result = guideTarget({ observer: obs, time: t, target, sun: { raHours: sunEq.ra, decDeg: sunEq.dec }, maxStarMagnitude: random() < 0.3 ? -2 : 3 });
      expect(result).not.toBeNull();
      expect(result!.phrase).not.toMatch(/^inside [^,]+$/);
      kinds.add(result!.kind);
    }
    expect([...kinds].sort()).toEqual(['horizon', 'pattern', 'star']);
  });
});
