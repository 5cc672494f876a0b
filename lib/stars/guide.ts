/**
 * Guide patterns: for a target, an observer and a moment, the most useful nearby star pattern and
 * the nearest bright named star, with the offset told in the observer's own frame ("about 8°
 * (almost a fist) below the bowl of the Big Dipper", "about 2° (about a finger) to the upper
 * right of Regulus"); and, over several nights, how the target moves against a pattern.
 *
 * Frames: stars are J2000 (lib/stars/catalogue.ts) and are turned into the observer's horizontal
 * frame with astronomy-engine's precession–nutation and Earth-rotation matrices
 * (`Rotation_EQJ_EQD`, `Rotation_EQD_HOR`); the target comes as apparent RA/Dec of date and uses
 * `Rotation_EQD_HOR`. Altitudes here are geometric (no refraction: it lifts two points at the
 * same altitude alike and changes separations by well under 0.1° above 10° altitude). Stellar
 * aberration (≤ 20″) and proper motion since J2000 (≤ 2.6′) are ignored: they are far below the
 * degree scale of these phrases.
 *
 * Hand measures are common practice: a fist at arm's length ≈ 10°, a finger ≈ 2°.
 */
import {
  Observer,
  Rotation_EQD_EQJ,
  Rotation_EQD_HOR,
  Rotation_EQJ_EQD,
  type AstroTime,
  type RotationMatrix,
} from 'astronomy-engine';
import { handMeasure } from '../describe.ts';
import { GloamingError } from '../errors.ts';
import { starByHip, stars, type Star } from './catalogue.ts';
import { partPhrase, patternById, patterns, type StarPattern } from './patterns.ts';

/** Where the observer stands: geodetic latitude and longitude (east positive) in degrees, height in metres. */
export interface GuideObserver {
  latitudeDeg: number;
  longitudeDeg: number;
  elevationM: number;
}

/** A target's apparent place: right ascension in hours and declination in degrees, equator and equinox of date. */
export interface ApparentPlace {
  raHours: number;
  decDeg: number;
}

/** Eight directions in the observer's frame at the reference point: up = toward the zenith. */
export type OffsetDirection = 'above' | 'upper right' | 'right' | 'lower right' | 'below' | 'lower left' | 'left' | 'upper left';

const DIRECTIONS: readonly OffsetDirection[] = ['above', 'upper right', 'right', 'lower right', 'below', 'lower left', 'left', 'upper left'];

export interface NearestStar {
  hip: number;
  /** Proper name of the star. */
  name: string;
  /** Great-circle distance from the star to the target, degrees. */
  separationDeg: number;
  /** Where the target lies as seen from the star. */
  offsetDirection: OffsetDirection;
  /** "about 2° (about a finger) to the upper right of Regulus". */
  phrase: string;
}

export interface GuideResult {
  pattern: { id: string; name: string };
  /** The named part used as the reference ("bowl"), when the pattern has parts. */
  part?: string;
  /** The star of the pattern used as the reference point, when the phrase names one. */
  anchorStar?: string;
  /** Whether the target lies inside the outline of the pattern (or part). */
  inside: boolean;
  /** Degrees from the target to the nearest star of the reference (to its centre when inside). */
  separationDeg: number;
  /** Where the target lies as seen from the reference. */
  offsetDirection: OffsetDirection;
  /** "about 8° (almost a fist) below the bowl of the Big Dipper". */
  phrase: string;
  /** Altitude of the reference point above the horizon, degrees (geometric). */
  referenceAltitudeDeg: number;
  /** The score that chose this pattern (lower is better; see `patternScore`). */
  score: number;
  nearestStar: NearestStar | null;
}

export interface GuideOptions {
  observer: GuideObserver;
  time: AstroTime;
  /** Apparent RA (hours) and Dec (degrees) of date. */
  target: ApparentPlace;
  /** A pattern is used only when its reference point stands this high, degrees. Default 10. */
  minAltitudeDeg?: number;
  /** Patterns whose nearest star is farther than this from the target are not used, degrees. Default 30. */
  maxSeparationDeg?: number;
  /** Faintest star that may serve as the nearest named star, V magnitude. Default 3.0. */
  maxStarMagnitude?: number;
}

type Vec = [number, number, number];

const DEG = 180 / Math.PI;
/** Inside a group when closer to its centre than this fraction of its radius. */
const INSIDE_FRACTION = 0.75;
/** Groups wider than this (radius, degrees) are referred to by their nearest star. */
const WIDE_GROUP_DEG = 10;

function dot(a: Vec, b: Vec): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}
function cross(a: Vec, b: Vec): Vec {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}
function normalize(a: Vec): Vec {
  const n = Math.hypot(a[0], a[1], a[2]);
  return [a[0] / n, a[1] / n, a[2] / n];
}
function rotate(m: number[][], v: Vec): Vec {
  // astronomy-engine's RotationMatrix.rot is stored column-major: rot[j][i] is row i, column j.
  const c0 = m[0]!, c1 = m[1]!, c2 = m[2]!;
  return [
    c0[0]! * v[0] + c1[0]! * v[1] + c2[0]! * v[2],
    c0[1]! * v[0] + c1[1]! * v[1] + c2[1]! * v[2],
    c0[2]! * v[0] + c1[2]! * v[1] + c2[2]! * v[2],
  ];
}
/** Angle between two unit vectors, degrees (atan2 form, accurate at small and large angles). */
function angleDeg(a: Vec, b: Vec): number {
  const c = cross(a, b);
  return Math.atan2(Math.hypot(c[0], c[1], c[2]), dot(a, b)) * DEG;
}
function fromRaDec(raDeg: number, decDeg: number): Vec {
  const ra = raDeg / DEG, dec = decDeg / DEG;
  return [Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)];
}
/** Horizontal unit vector (astronomy-engine HOR axes: x north, y west, z zenith) from altitude and azimuth (from north through east). */
function fromAltAz(altitudeDeg: number, azimuthDeg: number): Vec {
  const alt = altitudeDeg / DEG, az = azimuthDeg / DEG;
  return [Math.cos(alt) * Math.cos(az), -Math.cos(alt) * Math.sin(az), Math.sin(alt)];
}

/**
 * Where `to` lies as seen from `from`, both unit vectors in the horizontal frame (x north, y west,
 * z zenith). "Up" at `from` is the direction toward the zenith along the vertical circle through
 * `from`; "right" is to the right of an observer facing `from` with the head toward the zenith
 * (the direction of increasing azimuth). Within 0.5° of the zenith the vertical is undefined and
 * every other point is below, so the answer is 'below'. Returns the position angle of `to`
 * measured from up through right, degrees 0–360, and the eight-way word (sectors of 45° centred
 * on each word).
 */
function offsetVectors(from: Vec, to: Vec): { separationDeg: number; angleDeg: number; offsetDirection: OffsetDirection } {
  const separationDeg = angleDeg(from, to);
  const t = dot(to, from);
  const d: Vec = [to[0] - t * from[0], to[1] - t * from[1], to[2] - t * from[2]];
  const cosAlt = Math.hypot(from[0], from[1]);
  let pa: number;
  if (cosAlt < Math.sin(0.5 / DEG) || Math.hypot(d[0], d[1], d[2]) < 1e-12) {
    pa = 180;
  } else {
    const up = normalize([-from[2] * from[0], -from[2] * from[1], 1 - from[2] * from[2]]);
    const right = cross(from, up);
    pa = (Math.atan2(dot(d, right), dot(d, up)) * DEG + 360) % 360;
  }
  const offsetDirection = DIRECTIONS[Math.round(pa / 45) % 8]!;
  return { separationDeg, angleDeg: pa, offsetDirection };
}

/**
 * Where a point at (`toAltitudeDeg`, `toAzimuthDeg`) lies as seen from a point at
 * (`fromAltitudeDeg`, `fromAzimuthDeg`) in the observer's horizontal frame (azimuth from north
 * through east, degrees). Same conventions as the phrases: up toward the zenith along the
 * vertical through the `from` point, right = direction of increasing azimuth for an observer
 * facing it; 'below' within 0.5° of the zenith. Spherical geometry of the tangent plane at `from`.
 */
export function offsetInSky(input: { fromAltitudeDeg: number; fromAzimuthDeg: number; toAltitudeDeg: number; toAzimuthDeg: number }): {
  separationDeg: number;
  positionAngleDeg: number;
  offsetDirection: OffsetDirection;
} {
  const r = offsetVectors(fromAltAz(input.fromAltitudeDeg, input.fromAzimuthDeg), fromAltAz(input.toAltitudeDeg, input.toAzimuthDeg));
  return { separationDeg: r.separationDeg, positionAngleDeg: r.angleDeg, offsetDirection: r.offsetDirection };
}

/**
 * An angle in words for the phrases: "about 8° (almost a fist)", "about 2° (about a finger)",
 * "about 0.4° (less than a finger)". Degrees are rounded to whole degrees from 1° up. The hand
 * measure is `handMeasure` from lib/describe.ts (common practice: fist ≈ 10°, finger ≈ 2°).
 */
export function distanceWords(angleDeg: number): string {
  const a = Math.abs(angleDeg);
  // The hand measure follows the degrees as printed, so "about 3°" never reads "(about a finger)".
  const shown = a < 1 ? Number(a.toFixed(1)) : Math.round(a);
  return `about ${a < 1 ? a.toFixed(1) : String(shown)}° (${handMeasure(shown)})`;
}

function directionWords(direction: OffsetDirection, what: string): string {
  if (direction === 'above' || direction === 'below') return `${direction} ${what}`;
  return `to the ${direction} of ${what}`;
}

interface Group {
  pattern: StarPattern;
  part: string | undefined;
  stars: { star: Star; eqj: Vec }[];
  centroidEqj: Vec;
  radiusDeg: number;
}

interface Prepared {
  groups: Map<string, Group[]>;
  /** Brightness term of each pattern: V of its second-brightest star (its only star if one). */
  brightness: Map<string, number>;
  named: { star: Star; eqj: Vec }[];
}

let prepared: Prepared | null = null;

function prepare(): Prepared {
  if (prepared) return prepared;
  const groups = new Map<string, Group[]>();
  const brightness = new Map<string, number>();
  const makeGroup = (pattern: StarPattern, part: string | undefined, hips: number[]): Group => {
    const list = hips.map((hip) => {
      const star = starByHip(hip)!;
      return { star, eqj: fromRaDec(star.raDeg, star.decDeg) };
    });
    const sum: Vec = [0, 0, 0];
    for (const s of list) for (let i = 0; i < 3; i++) sum[i]! += s.eqj[i]!;
    const centroidEqj = normalize(sum);
    const radiusDeg = Math.max(...list.map((s) => angleDeg(centroidEqj, s.eqj)));
    return { pattern, part, stars: list, centroidEqj, radiusDeg };
  };
  for (const pattern of patterns()) {
    const parts = Object.entries(pattern.parts);
    // The whole pattern is always a candidate reference, so that stars outside every part count.
    groups.set(pattern.id, [makeGroup(pattern, undefined, pattern.stars), ...parts.map(([part, hips]) => makeGroup(pattern, part, hips))]);
    const mags = pattern.stars.map((hip) => starByHip(hip)!.vMag).sort((a, b) => a - b);
    brightness.set(pattern.id, mags[1] ?? mags[0]!);
  }
  const named = stars()
    .filter((s) => s.name && s.vMag <= 3.5)
    .map((star) => ({ star, eqj: fromRaDec(star.raDeg, star.decDeg) }));
  prepared = { groups, brightness, named };
  return prepared;
}

/**
 * The score that ranks candidate patterns, in degree-equivalents (lower is better):
 * distance from the target to the pattern's nearest reference star (degrees)
 * + 6 per familiarity step above 1 (a well-known pattern is worth a 6° longer hop)
 * + 3 per magnitude by which the pattern's second-brightest star is fainter than V 1.0
 * + 0.2 per degree by which the reference stands lower than 30° (low patterns are hard to see).
 * Gloaming's own weighting, chosen so that a familiar bright pattern wins over a faint one a few
 * degrees nearer.
 */
export function patternScore(input: { separationDeg: number; familiarity: 1 | 2 | 3; brightnessMag: number; altitudeDeg: number }): number {
  return (
    input.separationDeg +
    6 * (input.familiarity - 1) +
    3 * Math.max(0, input.brightnessMag - 1) +
    0.2 * Math.max(0, 30 - input.altitudeDeg)
  );
}

function checkNumber(value: number, field: string, min: number, max: number): void {
  if (!Number.isFinite(value) || value < min || value > max) {
    throw new GloamingError('invalid-value', `${field} is out of range`, { place: { field }, actual: value, expected: `a number from ${min} to ${max}` });
  }
}

interface Frame {
  eqjToHor: number[][];
  eqdToHor: number[][];
}

function horizontalFrame(observer: GuideObserver, time: AstroTime): Frame {
  checkNumber(observer.latitudeDeg, 'observer.latitudeDeg', -90, 90);
  checkNumber(observer.longitudeDeg, 'observer.longitudeDeg', -180, 360);
  checkNumber(observer.elevationM, 'observer.elevationM', -500, 10_000);
  const site = new Observer(observer.latitudeDeg, observer.longitudeDeg, observer.elevationM);
  const eqdHor: RotationMatrix = Rotation_EQD_HOR(time, site);
  const eqjEqd: RotationMatrix = Rotation_EQJ_EQD(time);
  // Combined EQJ → HOR: apply EQJ→EQD first, then EQD→HOR (column-major storage, see `rotate`).
  const eqjToHor = [0, 1, 2].map((j) => rotate(eqdHor.rot, [eqjEqd.rot[j]![0]!, eqjEqd.rot[j]![1]!, eqjEqd.rot[j]![2]!]) as number[]);
  return { eqjToHor, eqdToHor: eqdHor.rot };
}

function targetVector(frame: Frame, target: ApparentPlace): Vec {
  checkNumber(target.raHours, 'target.raHours', 0, 24);
  checkNumber(target.decDeg, 'target.decDeg', -90, 90);
  return rotate(frame.eqdToHor, fromRaDec(target.raHours * 15, target.decDeg));
}

function altitudeOf(v: Vec): number {
  return Math.asin(Math.max(-1, Math.min(1, v[2]))) * DEG;
}

/**
 * Chooses the most useful guide pattern for a target seen by `observer` at `time`, and the
 * nearest bright named star, and tells where the target lies from each in the observer's frame.
 *
 * For each pattern, the reference is the named part with the nearest star to the target, or the
 * whole pattern when it has no parts or when one of its other stars is over 1° nearer. Patterns whose reference stands lower than `minAltitudeDeg` or whose nearest star is
 * farther than `maxSeparationDeg` are skipped; the rest are ranked by `patternScore`.
 *
 * The phrase is told from the reference's nearest star when that star has a proper name and the
 * target is close to it (within 3°, or 30% of the reference's radius), or, outside the
 * reference, when the reference is wide (radius over 10°) or the target is nearer than the
 * reference's own size ("about 2° … of Merak, in the bowl of the Big Dipper"). A target within
 * three quarters of the reference's radius of its centre is "inside …" (followed by the offset
 * from the nearest star when it has a proper name). Otherwise the distance is to the nearest star
 * and the direction from the reference's centre ("about 8° (almost a fist) below the bowl of the
 * Big Dipper").
 *
 * The nearest star is the proper-named star of V ≤ `maxStarMagnitude` (default 3.0) above the
 * horizon that minimises separation + 1.5 × (V − 1) for stars fainter than V 1 (a brighter star
 * is worth a slightly longer hop).
 *
 * Returns null when no pattern qualifies. Throws `GloamingError` ('invalid-value') for
 * out-of-range inputs.
 */
export function guidePattern(options: GuideOptions): GuideResult | null {
  const minAltitudeDeg = options.minAltitudeDeg ?? 10;
  const maxSeparationDeg = options.maxSeparationDeg ?? 30;
  const maxStarMagnitude = options.maxStarMagnitude ?? 3.0;
  const { groups, brightness, named } = prepare();
  const frame = horizontalFrame(options.observer, options.time);
  const target = targetVector(frame, options.target);

  let best: { group: Group; score: number; centroid: Vec; nearest: { star: Star; hor: Vec; sep: number }; centreSep: number } | null = null;
  for (const [id, list] of groups) {
    let pick: { group: Group; centroid: Vec; nearest: { star: Star; hor: Vec; sep: number }; centreSep: number; rank: number } | null = null;
    for (const group of list) {
      let nearest: { star: Star; hor: Vec; sep: number } | null = null;
      for (const s of group.stars) {
        const hor = rotate(frame.eqjToHor, s.eqj);
        const sep = angleDeg(hor, target);
        if (!nearest || sep < nearest.sep) nearest = { star: s.star, hor, sep };
      }
      const centroid = rotate(frame.eqjToHor, group.centroidEqj);
      const centreSep = angleDeg(centroid, target);
      // A named part is preferred to the whole pattern unless the pattern has a star over 1° nearer.
      const rank = nearest!.sep + (group.part === undefined ? 1 : 0);
      if (!pick || rank < pick.rank) pick = { group, centroid, nearest: nearest!, centreSep, rank };
    }
    if (!pick) continue;
    const altitudeDeg = altitudeOf(pick.centroid);
    if (altitudeDeg < minAltitudeDeg || pick.nearest.sep > maxSeparationDeg) continue;
    const pattern = pick.group.pattern;
    const score = patternScore({ separationDeg: pick.nearest.sep, familiarity: pattern.familiarity, brightnessMag: brightness.get(id)!, altitudeDeg });
    if (!best || score < best.score) best = { ...pick, score };
  }
  if (!best) return null;

  const { group, centroid, nearest, centreSep } = best;
  const pattern = group.pattern;
  const what = group.part === undefined ? pattern.sentenceName : partPhrase(pattern, group.part);
  const inside = group.stars.length >= 3 && centreSep <= INSIDE_FRACTION * group.radiusDeg;
  let phrase: string;
  let separationDeg: number;
  let offsetDirection: OffsetDirection;
  let anchorStar: string | undefined;
  const starAnchored = nearest.star.name !== '' && (nearest.sep <= Math.max(3, 0.3 * group.radiusDeg) || (!inside && (group.radiusDeg > WIDE_GROUP_DEG || nearest.sep < group.radiusDeg)));
  if (starAnchored || (inside && nearest.star.name)) {
    const o = offsetVectors(nearest.hor, target);
    separationDeg = o.separationDeg;
    offsetDirection = o.offsetDirection;
    anchorStar = nearest.star.name;
    const fromStar = `${distanceWords(separationDeg)} ${directionWords(offsetDirection, nearest.star.name)}`;
    phrase = inside && !starAnchored ? `inside ${what}, ${fromStar}` : `${fromStar}, in ${what}`;
  } else if (inside) {
    const o = offsetVectors(centroid, target);
    separationDeg = o.separationDeg;
    offsetDirection = o.offsetDirection;
    phrase = `inside ${what}`;
  } else {
    const o = offsetVectors(centroid, target);
    separationDeg = nearest.sep;
    offsetDirection = o.offsetDirection;
    phrase = `${distanceWords(separationDeg)} ${directionWords(offsetDirection, what)}`;
  }

  let nearestStar: NearestStar | null = null;
  let bestCost = Infinity;
  for (const s of named) {
    if (s.star.vMag > maxStarMagnitude) continue;
    const hor = rotate(frame.eqjToHor, s.eqj);
    if (hor[2] <= 0) continue;
    const sep = angleDeg(hor, target);
    const cost = sep + 1.5 * Math.max(0, s.star.vMag - 1);
    if (cost < bestCost) {
      bestCost = cost;
      const o = offsetVectors(hor, target);
      nearestStar = {
        hip: s.star.hip,
        name: s.star.name,
        separationDeg: o.separationDeg,
        offsetDirection: o.offsetDirection,
        phrase: `${distanceWords(o.separationDeg)} ${directionWords(o.offsetDirection, s.star.name)}`,
      };
    }
  }

  const result: GuideResult = {
    pattern: { id: pattern.id, name: pattern.name },
    inside,
    separationDeg,
    offsetDirection,
    phrase,
    referenceAltitudeDeg: altitudeOf(centroid),
    score: best.score,
    nearestStar,
  };
  if (group.part !== undefined) result.part = group.part;
  if (anchorStar !== undefined) result.anchorStar = anchorStar;
  return result;
}

/** A target's apparent place at one moment, for `describeMotion`. */
export interface TimedPlace extends ApparentPlace {
  time: AstroTime;
}

export interface MotionDescription {
  /** Great-circle distance between the first and last place against the stars, degrees. */
  motionDeg: number;
  /** What the motion heads for ("the handle of the Big Dipper", "Regulus"), or null when it heads nowhere in particular. */
  toward: string | null;
  /** Whether the target moves away from the pattern. */
  away: boolean;
  /** "moves about 6° (about 3 fingers) toward the handle of the Big Dipper during the week". */
  phrase: string;
}

/**
 * How a target moves against a pattern over several nights. The apparent places (of date) are
 * referred to the J2000 equator with `Rotation_EQD_EQJ` so that they compare with the stars. When
 * the first and last places are less than `minMotionDeg` apart (default 2°) the motion is not
 * noticeable and the result is null. Otherwise the direction of motion (the great circle from the
 * first place toward the last) is compared with the directions from the first place to each part
 * of the pattern, each of its named stars and its centre: the one within 30° of the direction of
 * motion that is most nearly ahead is named ("toward the handle of the Big Dipper"); motion within
 * 30° of straight away from the centre reads "away from …"; otherwise "past …".
 */
export function describeMotion(input: { patternId: string; places: readonly TimedPlace[]; minMotionDeg?: number }): MotionDescription | null {
  const pattern = patternById(input.patternId);
  const minMotionDeg = input.minMotionDeg ?? 2;
  const first = input.places[0];
  const last = input.places[input.places.length - 1];
  if (!first || !last || input.places.length < 2) {
    throw new GloamingError('invalid-value', 'describeMotion needs at least two places', { place: { field: 'places' }, actual: input.places.length, expected: 'two or more timed places' });
  }
  const toEqj = (p: TimedPlace): Vec => rotate(Rotation_EQD_EQJ(p.time).rot, fromRaDec(p.raHours * 15, p.decDeg));
  const start = toEqj(first);
  const end = toEqj(last);
  const motionDeg = angleDeg(start, end);
  if (motionDeg < minMotionDeg) return null;

  // Tangent directions at the start point: toward the end, and toward each candidate.
  const tangent = (to: Vec): Vec => {
    const t = dot(to, start);
    return normalize([to[0] - t * start[0], to[1] - t * start[1], to[2] - t * start[2]]);
  };
  const heading = tangent(end);
  const groups = prepare().groups.get(pattern.id)!;
  const sum: Vec = [0, 0, 0];
  for (const hip of pattern.stars) {
    const s = starByHip(hip)!;
    const v = fromRaDec(s.raDeg, s.decDeg);
    for (let i = 0; i < 3; i++) sum[i]! += v[i]!;
  }
  const centre = normalize(sum);
  const candidates: { label: string; v: Vec }[] = [];
  for (const g of groups) if (g.part !== undefined) candidates.push({ label: partPhrase(pattern, g.part), v: g.centroidEqj });
  for (const hip of pattern.stars) {
    const s = starByHip(hip)!;
    if (s.name) candidates.push({ label: s.name, v: fromRaDec(s.raDeg, s.decDeg) });
  }
  candidates.push({ label: pattern.sentenceName, v: centre });

  let toward: string | null = null;
  let bestAngle = 30;
  for (const c of candidates) {
    if (angleDeg(c.v, start) < 0.5) continue;
    const a = Math.acos(Math.max(-1, Math.min(1, dot(heading, tangent(c.v))))) * DEG;
    if (a < bestAngle) {
      bestAngle = a;
      toward = c.label;
    }
  }
  const awayAngle = angleDeg(centre, start) < 0.5 ? 0 : Math.acos(Math.max(-1, Math.min(1, dot(heading, tangent(centre))))) * DEG;
  const away = toward === null && awayAngle > 150;
  const days = last.time.ut - first.time.ut;
  const span = days >= 6 && days <= 8 ? 'during the week' : `over ${Math.round(days)} days`;
  const how = toward !== null ? `toward ${toward}` : away ? `away from ${pattern.sentenceName}` : `past ${pattern.sentenceName}`;
  return { motionDeg, toward, away, phrase: `moves ${distanceWords(motionDeg)} ${how} ${span}` };
}
