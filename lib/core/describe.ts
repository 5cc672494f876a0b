/**
 * Describe: numbers in the words a reader uses outside. Compass points and hand measures at
 * arm's length (common practice: a fist ≈ 10°, a finger ≈ 2°). The words come from the message
 * catalogues of lib/language/ (English unless a `Words` for the site's locale is given); the
 * compass abbreviations here are the machine-readable ones of the JSON output (always English).
 */
import { compassIndex, FINGER_DEG, FIST_DEG, fists, wordsFor, type Words } from './language/index.ts';

export { FINGER_DEG, FIST_DEG, fists };

const POINTS = ['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW'] as const;
const ENGLISH = wordsFor('en');

export type CompassPoint = (typeof POINTS)[number];

/** The 16-point compass direction of an azimuth (degrees from north through east): abbreviation (JSON) and words in the language of `words`. */
export function compass(azimuthDeg: number, words: Words = ENGLISH): { abbreviation: CompassPoint; word: string } {
  return { abbreviation: POINTS[compassIndex(azimuthDeg)]!, word: words.compass(azimuthDeg).word };
}

/**
 * An angle as a hand measure in words: "less than a finger", "about a finger", "about 3 fingers",
 * "almost a fist" (7°–9.5°), "about a fist", "about a fist and a half", "about 2 fists",
 * "about 2 and a half fists" (or the same in the language of `words`).
 */
export function handMeasure(angleDeg: number, words: Words = ENGLISH): string {
  return words.handMeasure(angleDeg);
}

/**
 * Altitude in degrees and fists: `{ degrees: 18, fists: 2, words: "18° (about 2 fists) up" }`.
 * Below the horizon the words say so, without a hand measure: "13° below the horizon", "just
 * below the horizon" (−0.5° to 0°).
 */
export function describeAltitude(altitudeDeg: number, words: Words = ENGLISH): { degrees: number; fists: number; words: string } {
  return { degrees: Math.round(altitudeDeg), fists: fists(altitudeDeg), words: words.altitude(altitudeDeg) };
}
