/**
 * Sky quality: how dark a site's moonless night sky is, given as a Bortle class, a Sky Quality
 * Meter reading or a naked-eye limiting magnitude, and its conversion to a zenith sky brightness
 * in V mag/arcsec² and nanolamberts (the unit the brightness and threshold models add up in).
 */
import { GloamingError } from '../../core/errors.ts';
import type { SkyQuality } from '../../core/site.ts';
import { magnitudeFromIlluminanceFtcd } from './threshold.ts';

/** Zenith brightness of the moonless, twilight-free sky. */
export interface DarkSky {
  /** V magnitudes per square arcsecond (larger is darker). */
  zenithMagPerArcsec2: number;
  /** Nanolamberts. */
  zenithNl: number;
}

const LN10 = Math.LN10;

/**
 * Surface brightness in V mag/arcsec² to nanolamberts: B = 34.08 e^(20.7233 − 0.92104 V)
 * (= 3.408·10^10 · 10^(−0.4 V); 21.587 → 79.0 nL).
 * Source: Garstang R.H. 1986, "Model for artificial night-sky illumination", PASP 98:364, eq. 19.
 */
export function magPerArcsec2ToNl(magPerArcsec2: number): number {
  return 34.08 * Math.exp(20.7233 - 0.92104 * magPerArcsec2);
}

/** Inverse of `magPerArcsec2ToNl`: V = (20.7233 − ln(B/34.08)) / 0.92104 (Garstang 1986, eq. 19). */
export function nlToMagPerArcsec2(nanolambert: number): number {
  return (20.7233 - Math.log(nanolambert / 34.08)) / 0.92104;
}

/**
 * The darkest natural zenith sky assumed when converting a naked-eye limiting magnitude: 22.0 V
 * mag/arcsec². The natural sky is about 21.6 at solar maximum (Patat F. 2003, A&A 400:1183,
 * Paranal) and about 22.0 at its darkest (from memory); the NELM relation below cannot tell
 * skies darker than this apart (it saturates at NELM 7.93).
 */
export const DARKEST_NATURAL_SKY_MAG = 22.0;

/** Schaefer's night (scotopic) threshold constants (Schaefer 1998, VISLIMIT): C ft-cd, K per nL. */
const C_NIGHT = Math.pow(10, -9.8);
const K_NIGHT = Math.pow(10, -1.9);

/**
 * Naked-eye limiting magnitude at the zenith for a sky of `magPerArcsec2`, ignoring extinction
 * (the usual meaning of NELM): Schaefer's night threshold I = C (1 + √(K B))² (C = 10^−9.8 ft-cd,
 * K = 10^−1.9 /nL; Schaefer 1998, VISLIMIT; Hecht 1947 form) with Garstang's units and
 * m = −16.57 − 2.5 log10 I. This is exactly the widely used relation
 * NELM = 7.93 − 5 log10(10^(4.316 − B/5) + 1), B in mag/arcsec² (common practice).
 *
 * It is a CONVERSION between the ways people state sky quality, kept on the night branch for
 * every sky so that it round-trips with `skyBrightnessFromNelm`. The limiting-magnitude model
 * (`limitingMagnitude` in ./threshold.ts) also uses Schaefer's day branch, which takes over for
 * skies brighter than 1645 nL (≈ 18.2 mag/arcsec²): there it gives about 4.1–4.2 where this
 * relation gives less (3.97 at 18.0, 3.10 at 17.0).
 *
 * @param magPerArcsec2 zenith sky brightness, V mag/arcsec².
 * @param options.snellenRatio observer acuity, default 1 (adds 5 log10 of it).
 */
export function nelmFromSkyBrightness(magPerArcsec2: number, options?: { snellenRatio?: number }): number {
  const snellen = options?.snellenRatio ?? 1;
  const root = 1 + Math.sqrt(K_NIGHT * magPerArcsec2ToNl(magPerArcsec2));
  return (
    magnitudeFromIlluminanceFtcd(C_NIGHT * root * root) + (snellen === 1 ? 0 : (5 * Math.log(snellen)) / LN10)
  );
}

/**
 * Zenith sky brightness (V mag/arcsec²) that gives naked-eye limiting magnitude `nelm`, the exact
 * inverse of `nelmFromSkyBrightness` (Snellen ratio 1): B = 21.58 − 5 log10(10^(1.586 − NELM/5) − 1)
 * (widely used; common practice). The relation saturates at NELM 7.93; any NELM that would give a
 * sky darker than `DARKEST_NATURAL_SKY_MAG` gives `DARKEST_NATURAL_SKY_MAG` (NELM ≥ 6.62).
 *
 * @throws GloamingError `invalid-value` for NELM outside 1 to 8.5.
 */
export function skyBrightnessFromNelm(nelm: number): number {
  requireRange(nelm, 'nelm', 1, 8.5, 'a naked-eye limiting magnitude from 1 to 8.5');
  const root = Math.sqrt(Math.pow(10, -0.4 * (nelm + 16.57)) / C_NIGHT) - 1;
  if (root <= 0) return DARKEST_NATURAL_SKY_MAG;
  return Math.min(DARKEST_NATURAL_SKY_MAG, nlToMagPerArcsec2((root * root) / K_NIGHT));
}

/** One row of the Bortle-class mapping. */
export interface BortleClass {
  bortle: number;
  /** Naked-eye limiting magnitude range in Bortle's description [faintest, brightest]. */
  nelmRange: readonly [number, number];
  /** Approximate SQM range, mag/arcsec² [darkest, brightest] (NOT from Bortle; approximate common practice). */
  sqmRange: readonly [number, number];
  /** Representative SQM this project uses for the class, mag/arcsec². */
  sqm: number;
}

/**
 * Bortle classes 1–9. NELM ranges: Bortle J.E. 2001, "Introducing the Bortle Dark-Sky Scale",
 * Sky & Telescope 101(2):126 (classes 1–4 read in several copies; 5–9 partly from memory).
 * SQM ranges are NOT part of Bortle's scale: they are approximate common-practice values
 * (as commonly tabulated in encyclopedia pages), sources disagree by several tenths of a magnitude,
 * and for classes 7–9 they only say "brighter than 18.0"; the representative values for 7–9
 * (17.8, 17.3, 16.8: steps of 0.5 mag) are this project's choice. Representative values for
 * classes 1–6 are the mid-points of the ranges. APPROXIMATE: a measured SQM or NELM is better.
 */
export const BORTLE_CLASSES: readonly BortleClass[] = Object.freeze([
  { bortle: 1, nelmRange: [8.0, 7.6], sqmRange: [22.0, 21.7], sqm: 21.85 },
  { bortle: 2, nelmRange: [7.5, 7.1], sqmRange: [21.7, 21.5], sqm: 21.6 },
  { bortle: 3, nelmRange: [7.0, 6.6], sqmRange: [21.5, 21.3], sqm: 21.4 },
  { bortle: 4, nelmRange: [6.5, 6.1], sqmRange: [21.3, 20.4], sqm: 20.85 },
  { bortle: 5, nelmRange: [6.0, 5.6], sqmRange: [20.4, 19.1], sqm: 19.75 },
  { bortle: 6, nelmRange: [5.5, 5.1], sqmRange: [19.1, 18.0], sqm: 18.55 },
  { bortle: 7, nelmRange: [5.0, 4.6], sqmRange: [18.0, 17.5], sqm: 17.8 },
  { bortle: 8, nelmRange: [4.5, 4.1], sqmRange: [17.5, 17.0], sqm: 17.3 },
  { bortle: 9, nelmRange: [4.0, 3.0], sqmRange: [17.0, 15.0], sqm: 16.8 },
] as const satisfies readonly BortleClass[]);

function requireRange(value: number, field: string, min: number, max: number, expected: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < min || value > max) {
    throw new GloamingError('invalid-value', `sky quality ${field} is out of range`, {
      place: { field },
      actual: value,
      expected,
    });
  }
}

/**
 * Zenith dark-sky brightness for a site's sky quality.
 * - `{ sqm }`: the reading is taken as V mag/arcsec² (SQM's passband is close to V; common practice).
 * - `{ nelm }`: `skyBrightnessFromNelm` (Schaefer threshold with Garstang units, no extinction).
 * - `{ bortle }`: the class's representative SQM from `BORTLE_CLASSES` (approximate).
 *
 * @throws GloamingError `invalid-value` (field `bortle`, `sqm` or `nelm`) for impossible values,
 *   `missing-field` when none of the three is given.
 */
export function darkSkyFromQuality(quality: SkyQuality): DarkSky {
  let mag: number;
  if ('sqm' in quality) {
    requireRange(quality.sqm, 'sqm', 14, 23, 'an SQM reading in mag/arcsec² from 14 to 23');
    mag = quality.sqm;
  } else if ('nelm' in quality) {
    mag = skyBrightnessFromNelm(quality.nelm);
  } else if ('bortle' in quality) {
    const b = quality.bortle;
    if (!Number.isInteger(b) || b < 1 || b > 9) {
      throw new GloamingError('invalid-value', 'sky quality bortle must be a whole class', {
        place: { field: 'bortle' },
        actual: b,
        expected: 'a whole number from 1 to 9',
      });
    }
    mag = BORTLE_CLASSES[b - 1]!.sqm;
  } else {
    throw new GloamingError('missing-field', 'sky quality needs one of bortle, sqm or nelm', {
      expected: '{ bortle } or { sqm } or { nelm }',
    });
  }
  return { zenithMagPerArcsec2: mag, zenithNl: magPerArcsec2ToNl(mag) };
}

/**
 * The three ways of stating a zenith sky brightness (V mag/arcsec²): the SQM reading (= the value),
 * the NELM (`nelmFromSkyBrightness`), and the Bortle class whose approximate SQM range holds it.
 */
export function skyQualityFromBrightness(magPerArcsec2: number): { bortle: number; sqm: number; nelm: number } {
  let bortle = 9;
  for (const row of BORTLE_CLASSES) {
    if (magPerArcsec2 >= row.sqmRange[1]) {
      bortle = row.bortle;
      break;
    }
  }
  return { bortle, sqm: magPerArcsec2, nelm: nelmFromSkyBrightness(magPerArcsec2) };
}
