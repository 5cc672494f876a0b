/**
 * Guide patterns: for a target, an observer and a moment, the most useful nearby star pattern and
 * the nearest bright named star, with the offset told in the observer's own frame ("about 8°
 * (almost a fist) below the bowl of the Big Dipper", "about 2° (about a finger) to the upper
 * right of Regulus"); and, over several nights, how the target moves against a pattern.
 *
 * Frames: stars are J2000 (lib/models/stars/catalogue.ts) and are turned into the observer's horizontal
 * frame by `SkyFrame` of lib/core/geometry.ts (precession–nutation, then the local sidereal time);
 * the target comes as apparent RA/Dec of date. Altitudes here are geometric (no refraction: it lifts two points at the
 * same altitude alike and changes separations by well under 0.1° above 10° altitude). Stellar
 * aberration (≤ 20″) and proper motion since J2000 (≤ 2.6′) are ignored: they are far below the
 * degree scale of these phrases.
 *
 * Hand measures are common practice: a fist at arm's length ≈ 10°, a finger ≈ 2°.
 */
import { Rotation_EQD_EQJ, type AstroTime } from 'astronomy-engine';
import { wordsFor, type NamePhrase, type Words } from '../../core/language/index.ts';
import { bodyPhrase, partPhrase as namedPart, patternPhrase as namedPattern } from '../../core/language/names/index.ts';
import {
  SkyFrame,
  altitudeOfHor,
  apparentAltitudeDeg,
  azimuthOfHor,
  cross,
  dot,
  normalize,
  offsetOfHor,
  separationDeg as angleDeg,
  unitFromRaDec as fromRaDec,
  type OffsetDirection,
} from '../../core/geometry.ts';
import { GloamingError } from '../../core/errors.ts';
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

/** What a guide phrase leads the eye from. */
export type GuideKind = 'pattern' | 'star' | 'planet' | 'moon' | 'horizon';

/** A star, pattern or body named in a guide phrase (a chart that shows the phrase must label it). */
export type GuideName =
  | { kind: 'star'; hip: number; name: string }
  | { kind: 'pattern'; id: string; name: string }
  | { kind: 'body'; id: string; name: string };

/** The Moon or a bright planet that may lead the eye to a target: id, display name, apparent place of date, V magnitude. */
export interface GuideCompanion {
  id: string;
  name: string;
  kind: 'moon' | 'planet';
  place: ApparentPlace;
  magnitude: number;
}

/** What a guide phrase names as its reference: a star (IAU name), a pattern or a part of it, a body. */
export type GuideRef =
  | { kind: 'star'; name: string }
  | { kind: 'pattern'; pattern: { id: string; name: string; sentenceName: string }; part?: { id: string; english: string } }
  | { kind: 'body'; id: string; name: string };

/**
 * A guide phrase as data, so that it can be said in any language (`guidePhrase`): an offset from
 * a reference, that offset placed in or inside a pattern or said to be from a star of one, or
 * the horizon with where the Sun set or will rise.
 */
export type GuideSaid =
  | { kind: 'offset'; distanceDeg: number; direction: OffsetDirection; from: GuideRef }
  | { kind: 'in' | 'inside' | 'star-of'; offset: GuideSaid & { kind: 'offset' }; pattern: GuideRef & { kind: 'pattern' } }
  | { kind: 'horizon'; altitudeDeg: number; azimuthDeg: number; sun: SunPoint | null };

export interface GuideResult {
  /** What the phrase leads from: a star pattern, a named star, a planet, the Moon, or the horizon (and the Sun). */
  kind: GuideKind;
  /** "about 3° (about 2 fingers) to the upper right of Regulus, in the Sickle of Leo" (English; `guidePhrase(result.said, words)` in another language). */
  phrase: string;
  /** The phrase as data, for `guidePhrase`. */
  said: GuideSaid;
  /** The pattern the phrase names (kind 'pattern', or the pattern a guide star belongs to), else null. */
  pattern: { id: string; name: string } | null;
  /** The named part used as the reference ("bowl"), when the phrase names one. */
  part?: string;
  /** The named star the phrase measures from, when it names one. */
  anchorStar?: string;
  /** The id of the Moon or planet the phrase measures from (kinds 'moon' and 'planet'). */
  anchorBody?: string;
  /** Whether the target lies inside the figure of the pattern (or part). */
  inside: boolean;
  /** Degrees from the reference (star, body, or the pattern's nearest star) to the target; null for the horizon. */
  separationDeg: number | null;
  /** Where the target lies as seen from the reference; null for the horizon. */
  offsetDirection: OffsetDirection | null;
  /** Geometric altitude of the pattern's reference point, degrees, when a pattern was ranked. */
  referenceAltitudeDeg: number | null;
  /** The score of the best-ranked pattern (lower is better; see `patternScore`), or null when none stands up. */
  score: number | null;
  /** The nearest bright named star (V ≤ `maxStarMagnitude`) above the horizon, whatever the phrase uses. */
  nearestStar: NearestStar | null;
  /** The horizon phrase's numbers (kind 'horizon'): the target's apparent altitude (standard refraction) and azimuth, and the Sun's set or rise point. */
  horizon: { altitudeDeg: number; azimuthDeg: number; sun: SunPoint | null } | null;
  /** Every star, pattern and body the phrase names. */
  names: GuideName[];
}

/** Where the Sun set (or will rise) relative to a target: the point's azimuth (degrees from north through east) and its offset along the horizon. */
export interface SunPoint {
  event: 'set' | 'rise';
  /** Azimuth of the set or rise point, degrees. */
  azimuthDeg: number;
  /** Degrees of azimuth between the target and the point. */
  offsetDeg: number;
  /** Which side of the point the target is on, for a reader facing the target ('above' within 2°). */
  side: 'left' | 'right' | 'above';
}

export interface GuideOptions {
  observer: GuideObserver;
  time: AstroTime;
  /** Apparent RA (hours) and Dec (degrees) of date. */
  target: ApparentPlace;
  /** The Sun's apparent place of date: with it, a horizon phrase says where the Sun set or will rise. */
  sun?: ApparentPlace;
  /** The Moon and planets that may serve as guides (not the target itself). */
  companions?: readonly GuideCompanion[];
  /** The site's skyline: altitude (degrees) of the buildings or hills at an azimuth. Stars, bodies and figures behind it do not guide. */
  skylineAltitudeDeg?: (azimuthDeg: number) => number;
  /** A pattern is used only when its reference point stands this high, degrees. Default 10. */
  minAltitudeDeg?: number;
  /** Patterns whose nearest star is farther than this from the target are not ranked, degrees. Default 30. */
  maxSeparationDeg?: number;
  /** Faintest star that may serve as the nearest named star, V magnitude. Default 3.0. */
  maxStarMagnitude?: number;
  /**
   * Stars closer than this to the target are part of it (a cluster's own stars, a double star's
   * pair): they neither guide nor count as its nearest star, degrees. Default 0.
   */
  ownRadiusDeg?: number;
}

type Vec = [number, number, number];

const DEG = 180 / Math.PI;
/** "in <pattern>" is said outside the figure only this close to one of its stars (and no farther than the figure's radius, but at least 1°), degrees. */
export const IN_PATTERN_DEG = 5;
/** A compact figure (radius ≤ `WIDE_GROUP_DEG`) guides without "in" up to this far from its nearest star, degrees. */
export const NEAR_PATTERN_DEG = 10;
/** Figures wider than this (radius, degrees) are told from their nearest star rather than their centre. */
const WIDE_GROUP_DEG = 10;
/** The Moon or a bright planet guides up to this far from the target, degrees. */
export const NEAR_BODY_DEG = 15;
/** A bright named star guides up to this far from the target, degrees. */
export const NEAR_STAR_DEG = 20;
/** Planets at least this bright (V) may guide. */
export const BRIGHT_PLANET_MAG = 1.5;
/** While the Sun is higher than −12° only stars at least this bright (V) may guide: fainter ones are not yet out. */
export const TWILIGHT_STAR_MAG = 1.5;
/** Guide stars and bodies must stand at least this high, degrees (geometric). */
const MIN_GUIDE_ALTITUDE_DEG = 3;
/** A companion closer than this is the target itself (or hides it), degrees. */
const MIN_BODY_SEPARATION_DEG = 0.2;
/** Targets whose geometric altitude is lower than this are below the horizon even with refraction, degrees. */
const BELOW_HORIZON_DEG = -1;

function rotate(m: number[][], v: Vec): Vec {
  // astronomy-engine's RotationMatrix.rot is stored column-major: rot[j][i] is row i, column j.
  const c0 = m[0]!, c1 = m[1]!, c2 = m[2]!;
  return [
    c0[0]! * v[0] + c1[0]! * v[1] + c2[0]! * v[2],
    c0[1]! * v[0] + c1[1]! * v[1] + c2[1]! * v[2],
    c0[2]! * v[0] + c1[2]! * v[1] + c2[2]! * v[2],
  ];
}
/**
 * An angle in words for the phrases: "about 8° (almost a fist)", "about 2° (about a finger)",
 * "about 0.4° (less than a finger)". Degrees are rounded to whole degrees from 1° up. The hand
 * measure is `handMeasure` from lib/core/describe.ts (common practice: fist ≈ 10°, finger ≈ 2°).
 */
export function distanceWords(angleDeg: number, words: Words = ENGLISH): string {
  const a = Math.abs(angleDeg);
  // The hand measure follows the degrees as printed, so "about 3°" never reads "(about a finger)".
  const shown = a < 1 ? Number(a.toFixed(1)) : Math.round(a);
  return words.t('guide.distance', { degrees: words.number(shown, a < 1 ? 1 : 0), hand: words.handMeasure(shown) });
}

const ENGLISH = wordsFor('en');

const OFFSET_KEYS = {
  above: 'offset.above',
  'upper right': 'offset.upper-right',
  right: 'offset.right',
  'lower right': 'offset.lower-right',
  below: 'offset.below',
  'lower left': 'offset.lower-left',
  left: 'offset.left',
  'upper left': 'offset.upper-left',
} as const satisfies Record<OffsetDirection, string>;

/** A reference as a sentence names it, in the language of `words`. */
function refPhrase(ref: GuideRef, words: Words): NamePhrase {
  if (ref.kind === 'star') return { text: ref.name, gender: 'feminine' };
  if (ref.kind === 'body') return bodyPhrase(words.language, ref);
  const pattern = namedPattern(words.language, ref.pattern);
  if (!ref.part) return pattern;
  return namedPart(words.language, ref.pattern, ref.part.id, ref.part.english);
}

/** "about 3° (about 2 fingers) to the upper right of Regulus", in the language of `words`. */
export function offsetWords(distanceDeg: number, direction: OffsetDirection, what: NamePhrase, words: Words = ENGLISH): string {
  return words.t(OFFSET_KEYS[direction], { distance: distanceWords(distanceDeg, words), what });
}

/** A guide phrase in the language of `words` (English gives `GuideResult.phrase`). */
export function guidePhrase(said: GuideSaid, words: Words = ENGLISH): string {
  switch (said.kind) {
    case 'offset':
      return offsetWords(said.distanceDeg, said.direction, refPhrase(said.from, words), words);
    case 'in':
      return words.t('guide.in-pattern', { from: guidePhrase(said.offset, words), pattern: refPhrase(said.pattern, words) });
    case 'inside':
      return words.t('guide.inside-pattern', { from: guidePhrase(said.offset, words), pattern: refPhrase(said.pattern, words) });
    case 'star-of':
      return words.t('guide.star-of-pattern', { from: guidePhrase(said.offset, words), pattern: refPhrase(said.pattern, words) });
    case 'horizon': {
      const place = horizonWords(said.altitudeDeg, said.azimuthDeg, words);
      return said.sun ? words.t('guide.with-sun-point', { place, sun: sunPointWords(said.sun, words) }) : place;
    }
  }
}

/** "about 9° (almost a fist) to the right of where the Sun set", "right above where the Sun will rise". */
function sunPointWords(sun: SunPoint, words: Words): string {
  const where = words.t(sun.event === 'set' ? 'guide.sun-set-point' : 'guide.sun-rise-point');
  return sun.side === 'above' ? words.t('guide.right-above', { where }) : words.t('guide.beside-sun-point', { distance: distanceWords(sun.offsetDeg, words), side: sun.side, where });
}

/**
 * What a guide phrase adds to a sentence that already gives the target's altitude and compass
 * direction ("10° up in the south-east, …"), in the language of `words`: the whole phrase when it
 * leads from a pattern, a star, the Moon or a planet; for the horizon, only where the Sun set or
 * will rise, since "low in the south-east, about a fist above the horizon" would say the altitude
 * and direction again; null when the horizon is all the guide has.
 */
export function guideBeyondPlace(said: GuideSaid, words: Words = ENGLISH): string | null {
  if (said.kind !== 'horizon') return guidePhrase(said, words);
  return said.sun ? sunPointWords(said.sun, words) : null;
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

function horizontalFrame(observer: GuideObserver, time: AstroTime): SkyFrame {
  checkNumber(observer.latitudeDeg, 'observer.latitudeDeg', -90, 90);
  checkNumber(observer.longitudeDeg, 'observer.longitudeDeg', -180, 360);
  checkNumber(observer.elevationM, 'observer.elevationM', -500, 10_000);
  return new SkyFrame(observer, time);
}

function targetVector(frame: SkyFrame, target: ApparentPlace): Vec {
  checkNumber(target.raHours, 'target.raHours', 0, 24);
  checkNumber(target.decDeg, 'target.decDeg', -90, 90);
  return frame.horFromEqd(...fromRaDec(target.raHours * 15, target.decDeg));
}

/**
 * Where a target is, in the words a reader can follow outside, and what those words lead from.
 * The rules, tried in this order (each one's limits are constants below):
 *
 * 1. **A star pattern.** The patterns whose reference point (a named part, or the whole figure)
 *    stands at least `minAltitudeDeg` (10°) high and whose nearest star is within
 *    `maxSeparationDeg` (30°) of the target are ranked by `patternScore`; the best one is used
 *    only if the target lies within its figure (inside the convex outline of its stars on the
 *    gnomonic tangent plane) or close to one of its stars: within the figure's radius, at least 1°
 *    and at most `IN_PATTERN_DEG` (5°). Then the phrase
 *    says "in <pattern>" and measures from the nearest named star of that figure: "about 3° (about
 *    2 fingers) to the upper right of Regulus, in the Sickle of Leo" (within 3° of the star, or
 *    not inside), "inside the Great Square of Pegasus, about 6° (about 3 fingers) to the lower
 *    left of Scheat" (inside; "inside" always comes with a named star, a direction and a
 *    distance). A figure with no named star near enough reads "about 4° (about 2 fingers) to the
 *    lower left of the Pleiades" (distance to its nearest star, direction from its centre, or from
 *    that star for figures wider than `WIDE_GROUP_DEG`). A compact figure (radius ≤ 10°) within
 *    `NEAR_PATTERN_DEG` (10°) also reads that way ("about 8° (almost a fist) below the bowl of the
 *    Big Dipper"), with no "in".
 * 2. **The Moon or a bright planet** (V ≤ `BRIGHT_PLANET_MAG`) at least `MIN_GUIDE_ALTITUDE_DEG`
 *    up and within `NEAR_BODY_DEG` (15°): "about 6° (about 3 fingers) below Venus".
 * 3. **A bright named star** at least `MIN_GUIDE_ALTITUDE_DEG` up and within `NEAR_STAR_DEG` (20°):
 *    the one that minimises separation + 1.5 × (V − 1) for stars fainter than V 1, V ≤
 *    `maxStarMagnitude` (V ≤ `TWILIGHT_STAR_MAG` while the Sun is higher than −12°, when fainter
 *    stars are not yet out); "about 14° (about a fist and a half) to the lower left of Markab, a
 *    star of the Great Square of Pegasus" (the pattern is named when the star belongs to one that
 *    stands up).
 * 4. **The horizon and the Sun**: "low in the west-southwest, about a fist above the horizon,
 *    about 20° (about 2 fists) to the left of where the Sun set" (the Sun's part only in
 *    twilight, Sun 0° to −18°, and within 90° of azimuth of the target).
 *
 * With `skylineAltitudeDeg`, stars, bodies and figures hidden behind the site's skyline are
 * passed over. So every target above the horizon gets a phrase. Returns null only for a target whose geometric
 * altitude is below −1° (below the horizon even with refraction). Throws `GloamingError`
 * ('invalid-value') for out-of-range inputs.
 */
export function guideTarget(options: GuideOptions): GuideResult | null {
  const minAltitudeDeg = options.minAltitudeDeg ?? 10;
  const maxSeparationDeg = options.maxSeparationDeg ?? 30;
  const ownRadius = options.ownRadiusDeg ?? 0;
  const { groups, brightness, named } = prepare();
  const frame = horizontalFrame(options.observer, options.time);
  const target = targetVector(frame, options.target);
  const targetAltitudeDeg = altitudeOfHor(target);
  if (targetAltitudeDeg < BELOW_HORIZON_DEG) return null;
  // The horizon phrase gives the altitude a reader sees: with standard refraction (astronomy-engine `Refraction`).
  const apparentAltitude = apparentAltitudeDeg(targetAltitudeDeg);
  const sun = options.sun ? targetVector(frame, options.sun) : null;
  const sunAltitudeDeg = sun ? altitudeOfHor(sun) : null;
  const twilight = sunAltitudeDeg !== null && sunAltitudeDeg > -12;
  const maxStarMagnitude = Math.min(options.maxStarMagnitude ?? 3.0, twilight ? TWILIGHT_STAR_MAG : Infinity);
  const skyline = options.skylineAltitudeDeg ?? ((): number => 0);
  /** Whether a direction stands at least `marginDeg` above the skyline (and the ideal horizon). */
  const clear = (v: Vec, marginDeg = 0): boolean => {
    const alt = altitudeOfHor(v);
    return alt >= marginDeg && alt >= skyline(azimuthOfHor(v)) + marginDeg;
  };

  // Rank the patterns (rule 1).
  let best: { group: Group; score: number; centroid: Vec; hors: Vec[]; nearest: { star: Star; hor: Vec; sep: number } } | null = null;
  for (const [id, list] of groups) {
    let pick: { group: Group; centroid: Vec; hors: Vec[]; nearest: { star: Star; hor: Vec; sep: number }; rank: number } | null = null;
    for (const group of list) {
      const hors = group.stars.map((s) => frame.horFromEqj(...s.eqj));
      let nearest: { star: Star; hor: Vec; sep: number } | null = null;
      for (let i = 0; i < hors.length; i++) {
        const sep = angleDeg(hors[i]!, target);
        if (sep >= ownRadius && (!nearest || sep < nearest.sep)) nearest = { star: group.stars[i]!.star, hor: hors[i]!, sep };
      }
      // A figure made only of the target's own stars (the Pleiades for M 45) cannot lead the eye to it.
      if (!nearest) continue;
      const centroid = frame.horFromEqj(...group.centroidEqj);
      // A named part is preferred to the whole pattern unless the pattern has a star over 1° nearer.
      const rank = nearest.sep + (group.part === undefined ? 1 : 0);
      if (!pick || rank < pick.rank) pick = { group, centroid, hors, nearest, rank };
    }
    if (!pick) continue;
    const altitudeDeg = altitudeOfHor(pick.centroid);
    if (altitudeDeg < minAltitudeDeg || !clear(pick.centroid) || pick.nearest.sep > maxSeparationDeg) continue;
    const pattern = pick.group.pattern;
    const score = patternScore({ separationDeg: pick.nearest.sep, familiarity: pattern.familiarity, brightnessMag: brightness.get(id)!, altitudeDeg });
    if (!best || score < best.score) best = { ...pick, score };
  }

  // The nearest bright named star above the horizon (reported whatever the phrase uses; rule 3).
  let nearestStar: (NearestStar & { hor: Vec; altitudeDeg: number }) | null = null;
  let guideStar: (NearestStar & { hor: Vec }) | null = null;
  let bestCost = Infinity;
  let bestGuideCost = Infinity;
  for (const s of named) {
    if (s.star.vMag > (options.maxStarMagnitude ?? 3.0)) continue;
    const hor = frame.horFromEqj(...s.eqj);
    if (hor[2] <= 0) continue;
    const sep = angleDeg(hor, target);
    if (sep < ownRadius) continue;
    const cost = sep + 1.5 * Math.max(0, s.star.vMag - 1);
    const describe = (): NearestStar & { hor: Vec; altitudeDeg: number } => {
      const o = offsetOfHor(hor, target);
      return { hip: s.star.hip, name: s.star.name, separationDeg: o.separationDeg, offsetDirection: o.offsetDirection, phrase: offsetWords(o.separationDeg, o.offsetDirection, { text: s.star.name, gender: 'feminine' }), hor, altitudeDeg: altitudeOfHor(hor) };
    };
    if (cost < bestCost) {
      bestCost = cost;
      nearestStar = describe();
    }
    if (cost < bestGuideCost && s.star.vMag <= maxStarMagnitude && sep <= NEAR_STAR_DEG && clear(hor, MIN_GUIDE_ALTITUDE_DEG)) {
      bestGuideCost = cost;
      guideStar = describe();
    }
  }
  const reported: NearestStar | null = nearestStar
    ? { hip: nearestStar.hip, name: nearestStar.name, separationDeg: nearestStar.separationDeg, offsetDirection: nearestStar.offsetDirection, phrase: nearestStar.phrase }
    : null;
  const base = {
    inside: false,
    referenceAltitudeDeg: best ? altitudeOfHor(best.centroid) : null,
    score: best ? best.score : null,
    nearestStar: reported,
    horizon: null,
  };

  // Rule 1: the pattern, when the target is within its figure or close to its stars.
  if (best) {
    const phrased = patternPhrase(best, target, guideStar, clear, ownRadius);
    if (phrased) return { ...base, ...phrased, kind: 'pattern' };
  }

  // Rule 2: the Moon or a bright planet nearby.
  let companion: { c: GuideCompanion; o: ReturnType<typeof offsetOfHor> } | null = null;
  for (const c of options.companions ?? []) {
    if (c.kind === 'planet' && !(c.magnitude <= BRIGHT_PLANET_MAG)) continue;
    const hor = targetVector(frame, c.place);
    if (!clear(hor, MIN_GUIDE_ALTITUDE_DEG)) continue;
    const o = offsetOfHor(hor, target);
    if (o.separationDeg > NEAR_BODY_DEG || o.separationDeg < MIN_BODY_SEPARATION_DEG) continue;
    if (!companion || o.separationDeg < companion.o.separationDeg) companion = { c, o };
  }
  if (companion) {
    const { c, o } = companion;
    const said: GuideSaid = { kind: 'offset', distanceDeg: o.separationDeg, direction: o.offsetDirection, from: { kind: 'body', id: c.id, name: c.kind === 'moon' ? 'the Moon' : c.name } };
    return {
      ...base,
      kind: c.kind,
      phrase: guidePhrase(said),
      said,
      pattern: null,
      anchorBody: c.id,
      separationDeg: o.separationDeg,
      offsetDirection: o.offsetDirection,
      names: [{ kind: 'body', id: c.id, name: c.name }],
    };
  }

  // Rule 3: a bright named star, with the pattern it belongs to when that pattern stands up.
  if (guideStar) {
    const home = patternOfStar(guideStar.hip, frame, minAltitudeDeg);
    const offset = { kind: 'offset' as const, distanceDeg: guideStar.separationDeg, direction: guideStar.offsetDirection, from: { kind: 'star' as const, name: guideStar.name } };
    const said: GuideSaid = home ? { kind: 'star-of', offset, pattern: { kind: 'pattern', pattern: home } } : offset;
    const result: GuideResult = {
      ...base,
      kind: 'star',
      phrase: guidePhrase(said),
      said,
      pattern: home ? { id: home.id, name: home.name } : null,
      anchorStar: guideStar.name,
      separationDeg: guideStar.separationDeg,
      offsetDirection: guideStar.offsetDirection,
      names: [{ kind: 'star', hip: guideStar.hip, name: guideStar.name }, ...(home ? [{ kind: 'pattern' as const, id: home.id, name: home.name }] : [])],
    };
    return result;
  }

  // Rule 4: the horizon, and where the Sun set or will rise.
  const azimuthDeg = azimuthOfHor(target);
  const sunPart = sun && sunAltitudeDeg !== null && options.sun ? sunPoint(options.observer.latitudeDeg, options.sun.decDeg, sunAltitudeDeg, azimuthOfHor(sun), azimuthDeg) : null;
  const said: GuideSaid = { kind: 'horizon', altitudeDeg: apparentAltitude, azimuthDeg, sun: sunPart };
  return {
    ...base,
    kind: 'horizon',
    phrase: guidePhrase(said),
    said,
    pattern: null,
    separationDeg: null,
    offsetDirection: null,
    horizon: { altitudeDeg: apparentAltitude, azimuthDeg, sun: sunPart },
    names: [],
  };
}

/** An offset from a named star. */
function fromStar(o: { separationDeg: number; offsetDirection: OffsetDirection }, name: string): GuideSaid & { kind: 'offset' } {
  return { kind: 'offset', distanceDeg: o.separationDeg, direction: o.offsetDirection, from: { kind: 'star', name } };
}

/** Rule 1's phrase for the best-ranked pattern, or null when the target is neither within its figure nor close to it. */
function patternPhrase(
  best: { group: Group; centroid: Vec; hors: Vec[]; nearest: { star: Star; hor: Vec; sep: number } },
  target: Vec,
  guideStar: { hip: number; name: string; hor: Vec } | null,
  clear: (v: Vec) => boolean,
  ownRadius = 0,
): Pick<GuideResult, 'phrase' | 'said' | 'pattern' | 'part' | 'anchorStar' | 'inside' | 'separationDeg' | 'offsetDirection' | 'names'> | null {
  const { group, centroid, hors, nearest } = best;
  const pattern = group.pattern;
  const what: GuideRef & { kind: 'pattern' } = { kind: 'pattern', pattern, ...(group.part === undefined ? {} : { part: { id: group.part, english: partPhrase(pattern, group.part) } }) };
  const inside = group.stars.length >= 3 && insideOutline(centroid, hors, target);
  // "in" reaches as far from the figure's stars as the figure is wide (its radius), at least 1°, at most IN_PATTERN_DEG.
  const inLimitDeg = Math.min(IN_PATTERN_DEG, Math.max(1, group.radiusDeg));
  const close = nearest.sep <= inLimitDeg;
  // The nearest named star of the figure the phrase names, among those above the skyline.
  let anchor: { star: Star; hor: Vec; sep: number } | null = null;
  hors.forEach((hor, i) => {
    const star = group.stars[i]!.star;
    const sep = angleDeg(hor, target);
    if (star.name && sep >= ownRadius && clear(hor) && (!anchor || sep < anchor.sep)) anchor = { star, hor, sep };
  });
  const common = {
    pattern: { id: pattern.id, name: pattern.name },
    ...(group.part !== undefined ? { part: group.part } : {}),
    inside,
  };
  const patternName: GuideName = { kind: 'pattern', id: pattern.id, name: pattern.name };
  const a = anchor as { star: Star; hor: Vec; sep: number } | null;
  // Inside a figure none of whose stars has a name, the bright named star nearby gives the distance.
  const insideAnchor = a ? { hip: a.star.hip, name: a.star.name, hor: a.hor } : guideStar;
  if (inside && insideAnchor) {
    const o = offsetOfHor(insideAnchor.hor, target);
    const said: GuideSaid = { kind: o.separationDeg > 3 ? 'inside' : 'in', offset: fromStar(o, insideAnchor.name), pattern: what };
    return {
      ...common,
      phrase: guidePhrase(said),
      said,
      anchorStar: insideAnchor.name,
      separationDeg: o.separationDeg,
      offsetDirection: o.offsetDirection,
      names: [{ kind: 'star', hip: insideAnchor.hip, name: insideAnchor.name }, patternName],
    };
  }
  if (a && close && a.sep <= inLimitDeg) {
    const o = offsetOfHor(a.hor, target);
    return {
      ...common,
      phrase: guidePhrase({ kind: 'in', offset: fromStar(o, a.star.name), pattern: what }),
      said: { kind: 'in', offset: fromStar(o, a.star.name), pattern: what },
      anchorStar: a.star.name,
      separationDeg: o.separationDeg,
      offsetDirection: o.offsetDirection,
      names: [{ kind: 'star', hip: a.star.hip, name: a.star.name }, patternName],
    };
  }
  if (inside) return null;
  const compactNear = group.radiusDeg <= WIDE_GROUP_DEG && nearest.sep <= NEAR_PATTERN_DEG;
  if (close || compactNear) {
    const o = offsetOfHor(group.radiusDeg > WIDE_GROUP_DEG ? nearest.hor : centroid, target);
    return {
      ...common,
      inside: false,
      phrase: guidePhrase({ kind: 'offset', distanceDeg: nearest.sep, direction: o.offsetDirection, from: what }),
      said: { kind: 'offset', distanceDeg: nearest.sep, direction: o.offsetDirection, from: what },
      separationDeg: nearest.sep,
      offsetDirection: o.offsetDirection,
      names: [patternName],
    };
  }
  return null;
}

/**
 * Whether `target` lies inside the convex outline of `stars` (horizontal unit vectors), tested on
 * the gnomonic tangent plane at `centre`, where great circles are straight lines.
 */
function insideOutline(centre: Vec, stars: readonly Vec[], target: Vec): boolean {
  const ref: Vec = Math.abs(centre[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
  const e1 = normalize(cross(ref, centre));
  const e2 = cross(centre, e1);
  const plane = (v: Vec): [number, number] | null => {
    const d = dot(v, centre);
    return d <= 0.05 ? null : [dot(v, e1) / d, dot(v, e2) / d];
  };
  const t = plane(target);
  if (!t) return false;
  const points = stars.map(plane).filter((p): p is [number, number] => p !== null);
  const hull = convexHull(points);
  if (hull.length < 3) return false;
  for (let i = 0; i < hull.length; i++) {
    const p = hull[i]!, q = hull[(i + 1) % hull.length]!;
    if ((q[0] - p[0]) * (t[1] - p[1]) - (q[1] - p[1]) * (t[0] - p[0]) < 0) return false;
  }
  return true;
}

/** Convex hull of plane points, counter-clockwise (Andrew's monotone chain). */
function convexHull(points: readonly [number, number][]): [number, number][] {
  const sorted = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (sorted.length < 3) return sorted;
  const turn = (o: [number, number], a: [number, number], b: [number, number]): number => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: [number, number][] = [];
  for (const p of sorted) {
    while (lower.length >= 2 && turn(lower[lower.length - 2]!, lower[lower.length - 1]!, p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: [number, number][] = [];
  for (const p of [...sorted].reverse()) {
    while (upper.length >= 2 && turn(upper[upper.length - 2]!, upper[upper.length - 1]!, p) <= 0) upper.pop();
    upper.push(p);
  }
  return [...lower.slice(0, -1), ...upper.slice(0, -1)];
}

/** The most familiar pattern that holds star `hip` and whose centre stands at least `minAltitudeDeg` up. */
function patternOfStar(hip: number, frame: SkyFrame, minAltitudeDeg: number): StarPattern | null {
  let found: StarPattern | null = null;
  for (const list of prepare().groups.values()) {
    const whole = list[0]!;
    if (!whole.pattern.stars.includes(hip)) continue;
    if (altitudeOfHor(frame.horFromEqj(...whole.centroidEqj)) < minAltitudeDeg) continue;
    if (!found || whole.pattern.familiarity < found.familiarity) found = whole.pattern;
  }
  return found;
}

/**
 * "low in the west-southwest, about a fist above the horizon": below 20° "low in the …", below
 * 50° "in the …", below 75° "high in the …", above that "nearly overhead, a little to the …".
 */
export function horizonWords(altitudeDeg: number, azimuthDeg: number, words: Words = ENGLISH): string {
  const direction = words.compass(azimuthDeg).word;
  if (altitudeDeg >= 75) return words.t('guide.overhead', { direction });
  const height = altitudeDeg < 1 ? words.t('guide.just-above-horizon') : words.t('guide.height', { hand: words.handMeasure(altitudeDeg) });
  return words.t(altitudeDeg < 20 ? 'guide.low-in' : altitudeDeg < 50 ? 'guide.in' : 'guide.high-in', { direction, height });
}

/**
 * Where the Sun set (or will rise) relative to a target at `targetAzimuthDeg`, while the Sun is
 * between 0° and −18° (twilight). The set and rise points are the azimuths where the Sun's centre
 * stands at −0.833° (standard refraction and semidiameter), from cos A = (sin δ − sin φ sin h₀) /
 * (cos φ cos h₀) (the altitude–azimuth relation, Meeus, Astronomical Algorithms, eq. 13.6,
 * solved for azimuth); evening when the Sun is in the western half of the sky. Null when the Sun
 * is up or in full darkness, never sets or rises that day, or the point lies more than 90° of
 * azimuth from the target. "left"/"right" are for a reader facing the target.
 */
function sunPoint(latitudeDeg: number, sunDecDeg: number, sunAltitudeDeg: number, sunAzimuthDeg: number, targetAzimuthDeg: number): SunPoint | null {
  if (sunAltitudeDeg >= 0 || sunAltitudeDeg < -18) return null;
  const h0 = -0.833 / DEG;
  const phi = latitudeDeg / DEG;
  const cosA = (Math.sin(sunDecDeg / DEG) - Math.sin(phi) * Math.sin(h0)) / (Math.cos(phi) * Math.cos(h0));
  if (!(Math.abs(cosA) <= 1)) return null;
  const riseAz = Math.acos(cosA) * DEG;
  const event = sunAzimuthDeg > 180 ? 'set' : 'rise';
  const pointAz = event === 'set' ? 360 - riseAz : riseAz;
  const diff = ((targetAzimuthDeg - pointAz + 540) % 360) - 180;
  if (Math.abs(diff) > 90) return null;
  const offsetDeg = Math.abs(diff);
  return { event, azimuthDeg: pointAz, offsetDeg, side: offsetDeg < 2 ? 'above' : diff > 0 ? 'right' : 'left' };
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
