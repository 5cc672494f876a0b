/**
 * The eye's threshold for extended objects (clusters, nebulae, galaxies): the faintest total
 * magnitude of a uniform patch of a given size that can be seen against a given sky, for the naked
 * eye and through binoculars or a telescope.
 *
 * Method: Crumey A. 2014, "Human contrast threshold and astronomical visibility", MNRAS 442:2600–2619
 * (doi 10.1093/mnras/stu992, arXiv 1405.4209). A target of angular area A (steradians) on a
 * background of luminance B (cd/m²) is at threshold when its excess luminance ΔB reaches
 *   ΔB = F B C(A, B),   C = ((R/A)^q + C∞^q)^(1/q)                       (Crumey eq. 41)
 * with R(B) the point-source (Riccò) factor, C∞(B) the threshold contrast of a very large target and
 * q the joining exponent (0.6 at night, eqs. 42–44). For night skies (B ≲ 7·10⁻² cd/m²) the
 * scotopic fits apply: R = (r₁ B^−¼ + r₂)², r₁ = 6.505·10⁻⁴, r₂ = −8.461·10⁻⁴ (eqs. 23, 26, from
 * Blackwell 1946) and C∞ = k₁ B^−¼ + k₂, k₁ = 7.633·10⁻³, k₂ = −7.174·10⁻³ (eqs. 35, 37, from
 * Taylor 1960); for brighter backgrounds the full-range fits
 * R = (√(a₁B^−½ + a₂B^−¼ + a₃) + a₄B^−¼ + a₅)² (eq. 28) and
 * C∞ = √(b₁B^−½ + b₂B^−¼ + b₃) + b₄B^−¼ + b₅ (eq. 40). The coefficients were read in two
 * independent third-party implementations of the paper, not in the paper itself; the scotopic
 * ones are confirmed by reproducing the paper's own approximations (eqs. 54, 55, 57, 63; see
 * test/sky-extended.test.ts). This module takes the larger of the scotopic and full-range values
 * of R and C∞: that is the scotopic fit on every night sky and the full-range fit in bright
 * twilight and daylight, and it keeps the threshold continuous for the searches.
 *
 * Below 10⁻⁵ cd/m² (about 25 mag/arcsec², reached in a telescope of small exit pupil) the
 * background counts as zero (Crumey §2.6, eqs. 45–52): the threshold increment is held at its
 * value there.
 *
 * Through optics (Crumey §3, eqs. 65–77): the sky and the object are both dimmed at the eye by
 * g = (min(d, p)/p)² · transmission (d = exit pupil, p = eye pupil); the object's apparent area
 * is A M²; one-eyed viewing raises the threshold by F_T = √2 (his "telescope field factor",
 * 1 for binoculars, as Schaefer's F_b).
 *
 * Field factor F: Blackwell's laboratory observers needed F ≈ 2 or more to turn a 50 % forced-choice
 * threshold into ordinary seeing (Crumey §1.6). Here F = 1: the site's findability margin
 * (`DEFAULT_FINDABILITY_MARGIN_MAG`, 1 magnitude = a factor 2.5) plays that part for extended
 * objects exactly as for stars and planets, so one margin decides every verdict.
 *
 * Unit links: 1 nL = 10⁻⁵/π cd/m² (the lambert's definition); V = 0 gives 2.54·10⁻⁶ lux outside
 * the eye (Crumey §1.2, after Allen's Astrophysical Quantities). Colour is not corrected (Crumey's
 * eqs. 12–17 give the scotopic colour term; targets and sky are taken as achromatic, as in his
 * Blackwell data).
 */
import { eyePupilMm, NAKED_EYE, type Instrument, type Observer } from './threshold.ts';

/** Illuminance of a V = 0 source outside the atmosphere and the eye, lux (Crumey 2014 §1.2). */
const ZERO_MAG_LUX = 2.54e-6;
/** One nanolambert in cd/m² (1 L = 10⁴/π cd/m²). */
export const NL_TO_CD_M2 = 1e-5 / Math.PI;
/** One square arcminute in steradians. */
export const ARCMIN2_TO_SR = (Math.PI / (180 * 60)) ** 2;
/** Background below which the eye sees no background at all, cd/m² (Crumey 2014 §2.6). */
const ZERO_BACKGROUND_CD_M2 = 1e-5;
/** The joining exponent at night (B < 0.193 cd/m²), Crumey 2014 eq. 44. */
const Q_NIGHT = 0.6;

// Scotopic fits, Crumey 2014 eqs. 26 and 37.
const R1 = 6.505e-4;
const R2 = -8.461e-4;
const K1 = 7.633e-3;
const K2 = -7.174e-3;
// Full-range fits, Crumey 2014 eqs. 28 and 40.
const A_FIT = [5.949e-8, -2.389e-7, 2.459e-7, 4.12e-4, -4.225e-4] as const;
const B_FIT = [9.606e-6, -4.112e-5, 5.019e-5, 4.837e-3, -4.884e-3] as const;

function fullRange(c: readonly [number, number, number, number, number], b: number): number {
  const quarter = Math.pow(b, -0.25);
  return Math.sqrt(Math.max(0, c[0] * quarter * quarter + c[1] * quarter + c[2])) + c[3] * quarter + c[4];
}

/** Crumey's joining exponent q(B), eqs. 42–44 (B in cd/m²). */
function joiningExponent(b: number): number {
  if (b < 0.193) return Q_NIGHT;
  const lg = Math.log10(b);
  return b <= 3.4 ? 0.8861 + 0.4 * lg : 1.146 - 0.0885 * lg;
}

/**
 * Threshold contrast ΔB/B of a uniform target of `areaSr` steradians on a background of
 * `backgroundCdM2` (> 0), Crumey 2014 eq. 41 with F = 1 (see the module notes for R, C∞ and q).
 */
export function contrastThresholdCrumey(areaSr: number, backgroundCdM2: number): number {
  const b = backgroundCdM2;
  const quarter = Math.pow(b, -0.25);
  const scotopicR = R1 * quarter + R2;
  const fullR = fullRange(A_FIT, b);
  const r = Math.max(scotopicR > 0 ? scotopicR * scotopicR : 0, fullR * fullR);
  const cInf = Math.max(K1 * quarter + K2, fullRange(B_FIT, b));
  const q = joiningExponent(b);
  // ((R/A)^q + C∞^q)^(1/q), in logarithms so that tiny areas do not overflow.
  const x = q * Math.log(r / areaSr);
  const y = q * Math.log(cInf);
  const hi = Math.max(x, y);
  return Math.exp((hi + Math.log1p(Math.exp(Math.min(x, y) - hi))) / q);
}

/**
 * Threshold excess luminance of a target of `areaSr` on a background of `backgroundCdM2` (≥ 0),
 * cd/m², with the zero-background floor of Crumey 2014 §2.6.
 */
export function thresholdIncrementCdM2(areaSr: number, backgroundCdM2: number): number {
  const b = Math.max(backgroundCdM2, ZERO_BACKGROUND_CD_M2);
  return b * contrastThresholdCrumey(areaSr, b);
}

/** Inputs of `extendedLimitingMagnitude`. */
export interface ExtendedLimitInput {
  /** Sky brightness at the target, nanolamberts (`skyBrightness(...).totalNl`). */
  skyNl: number;
  /** The object's area on the sky, square arcminutes (π a b / 4 for an ellipse of axes a, b). */
  areaArcmin2: number;
  /** Default `NAKED_EYE`. */
  instrument?: Instrument;
  observer?: Observer;
}

/**
 * Limiting total magnitude of an extended object of the given area: the faintest V magnitude (as
 * arriving at the observer, after extinction) at which a uniform patch of that size reaches
 * Crumey's threshold (2014, eqs. 41, 66, 77; F = 1, see the module notes). Compare it with the
 * object's extincted total magnitude, as for a star; for a very small area it tends to Crumey's
 * point-source limit.
 *
 * @returns limiting magnitude, V.
 */
export function extendedLimitingMagnitude(input: ExtendedLimitInput): number {
  const instrument = input.instrument ?? NAKED_EYE;
  const areaSr = input.areaArcmin2 * ARCMIN2_TO_SR;
  const sky = Math.max(0, input.skyNl) * NL_TO_CD_M2;
  let increment: number;
  if (instrument.apertureMm <= 0) {
    increment = thresholdIncrementCdM2(areaSr, sky);
  } else {
    const eye = eyePupilMm(input.observer?.ageYears ?? 40);
    const exit = instrument.apertureMm / instrument.magnification;
    const g = (Math.min(exit, eye) / eye) ** 2 * instrument.transmission;
    const oneEye = instrument.bothEyes ? 1 : Math.SQRT2;
    const apparentArea = areaSr * instrument.magnification * instrument.magnification;
    increment = (oneEye * thresholdIncrementCdM2(apparentArea, g * sky)) / g;
  }
  const snellen = input.observer?.snellenRatio ?? 1;
  return -2.5 * Math.log10((increment * areaSr) / ZERO_MAG_LUX) + 5 * Math.log10(snellen);
}

/**
 * Mean surface brightness of an object of total magnitude `magnitude` spread evenly over an
 * ellipse of axes `majorArcmin` × `minorArcmin`, V mag/arcsec²:
 *   S = m + 2.5 log10(π a b / 4),  a, b in arcseconds.
 * The usual definition of a deep-sky object's mean surface brightness (e.g. Clark 1990, *Visual
 * Astronomy of the Deep Sky*, ch. 4; from memory).
 */
export function meanSurfaceBrightness(magnitude: number, majorArcmin: number, minorArcmin: number): number {
  return magnitude + 2.5 * Math.log10((Math.PI * majorArcmin * 60 * minorArcmin * 60) / 4);
}
