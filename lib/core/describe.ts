/**
 * Describe: numbers in the words a reader uses outside. Compass points and hand measures at
 * arm's length (common practice: a fist ≈ 10°, a finger ≈ 2°).
 */

const POINTS = ['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW'] as const;
const WORDS = [
  'north', 'north-northeast', 'northeast', 'east-northeast', 'east', 'east-southeast', 'southeast', 'south-southeast',
  'south', 'south-southwest', 'southwest', 'west-southwest', 'west', 'west-northwest', 'northwest', 'north-northwest',
] as const;

export type CompassPoint = (typeof POINTS)[number];

/** The 16-point compass direction of an azimuth (degrees from north through east): abbreviation and words. */
export function compass(azimuthDeg: number): { abbreviation: CompassPoint; word: string } {
  const i = Math.round((((azimuthDeg % 360) + 360) % 360) / 22.5) % 16;
  return { abbreviation: POINTS[i]!, word: WORDS[i]! };
}

/** Degrees covered by a fist at arm's length (common practice). */
export const FIST_DEG = 10;
/** Degrees covered by one finger width at arm's length (common practice). */
export const FINGER_DEG = 2;

/** An angle in fists at arm's length, rounded to halves: 18° → 2 (1.8 rounds to 2). */
export function fists(angleDeg: number): number {
  return Math.round((angleDeg / FIST_DEG) * 2) / 2;
}

/**
 * An angle as a hand measure in words: "less than a finger", "about a finger", "about 3 fingers",
 * "almost a fist" (7°–9.5°), "about a fist", "about a fist and a half", "about 2 fists",
 * "about 2 and a half fists".
 */
export function handMeasure(angleDeg: number): string {
  const a = Math.abs(angleDeg);
  if (a < FINGER_DEG / 2) return 'less than a finger';
  if (a < 7) {
    const n = Math.round(a / FINGER_DEG);
    return n === 1 ? 'about a finger' : `about ${n} fingers`;
  }
  if (a < 0.95 * FIST_DEG) return 'almost a fist';
  const f = fists(a);
  if (f === 1) return 'about a fist';
  if (f === 1.5) return 'about a fist and a half';
  return Number.isInteger(f) ? `about ${f} fists` : `about ${Math.floor(f)} and a half fists`;
}

/**
 * Altitude in degrees and fists: `{ degrees: 18, fists: 2, words: "18° (about 2 fists) up" }`.
 * Below the horizon the words say so, without a hand measure: "13° below the horizon", "just
 * below the horizon" (−0.5° to 0°).
 */
export function describeAltitude(altitudeDeg: number): { degrees: number; fists: number; words: string } {
  const degrees = Math.round(altitudeDeg);
  if (altitudeDeg < 0) {
    return { degrees, fists: fists(altitudeDeg), words: degrees === 0 ? 'just below the horizon' : `${Math.abs(degrees)}° below the horizon` };
  }
  return { degrees, fists: fists(altitudeDeg), words: `${degrees}° (${handMeasure(altitudeDeg)}) up` };
}
