/**
 * The eye's threshold: the faintest point source that can be seen against a given sky background,
 * for the naked eye and through binoculars or a telescope.
 *
 * Units: sky (background) brightness in nanolamberts (nL), illuminance in foot-candles (ft-cd),
 * magnitudes in V. A "limiting magnitude" here is the faintest magnitude of light ARRIVING at the
 * observer, i.e. after the atmosphere; compare it with an object's extincted magnitude m + k·X
 * (see `visibilityMargin` in ./index.ts). It does not include extinction itself.
 */
import { GloamingError } from '../../core/errors.ts';
import type { InstrumentKind } from '../../core/site.ts';

/** Night (scotopic) constants of the Hecht-form threshold, Schaefer 1998: C = 10^−9.8 ft-cd, K = 10^−1.9 nL⁻¹. */
const C_NIGHT = Math.pow(10, -9.8);
const K_NIGHT = Math.pow(10, -1.9);
/** Day (photopic) constants: C = 10^−8.35 ft-cd, K = 10^−5.9 nL⁻¹. */
const C_DAY = Math.pow(10, -8.35);
const K_DAY = Math.pow(10, -5.9);
const LOG10 = Math.LN10;

/**
 * Threshold illuminance of a point source against a background of `backgroundNl` nanolamberts,
 * in Hecht's form I = C (1 + √(K B))², foot-candles, for an average observer with both eyes.
 *
 * Sources: Hecht S. 1947, JOSA 37:59 (form); constants from Schaefer B.E. 1998, "To the Visual
 * Limits", Sky & Telescope 95(5):57, program VISLIMIT.BAS (night C = 10^−9.8, K = 10^−1.9;
 * day C = 10^−8.35, K = 10^−5.9); method in Schaefer 1990, PASP 102:212.
 *
 * Which constants apply: VISLIMIT switches from night to day at B = 1500 nL, Schaefer's 1987
 * program (Sky & Telescope 73:426, EXTINC.BAS) at 1650 nL. The two curves cross at 1645 nL, so
 * this function takes the smaller (more sensitive) of the two thresholds: the same rule, made
 * continuous for root-finding; it differs from VISLIMIT by at most 0.08 mag between 1500 and 1645 nL.
 *
 * @param backgroundNl background brightness, nL (≥ 0).
 * @returns threshold illuminance, ft-cd.
 */
export function thresholdIlluminanceFtcd(backgroundNl: number): number {
  const b = backgroundNl > 0 ? backgroundNl : 0;
  const night = 1 + Math.sqrt(K_NIGHT * b);
  const day = 1 + Math.sqrt(K_DAY * b);
  return Math.min(C_NIGHT * night * night, C_DAY * day * day);
}

/**
 * V magnitude of a point source giving illuminance `illuminanceFtcd` outside the eye:
 * m = −16.57 − 2.5 log10(I), I in foot-candles (Schaefer 1998, VISLIMIT; KS91 eq. 8 uses the same zero point).
 */
export function magnitudeFromIlluminanceFtcd(illuminanceFtcd: number): number {
  return -16.57 - (2.5 * Math.log(illuminanceFtcd)) / LOG10;
}

/** Who is looking. */
export interface Observer {
  /** Age, years; sets the dark-adapted eye pupil for optics (Schaefer 1990). Default 40. */
  ageYears?: number;
  /** Snellen ratio of visual acuity (1 = 20/20; 2 = 20/10); adds 5 log10(ratio) mag (Schaefer 1998). Default 1. */
  snellenRatio?: number;
}

/** An optical aid. Build custom ones with `defineInstrument`. */
export interface Instrument {
  /** Stable id, e.g. `binoculars-10x50`. */
  readonly id: string;
  readonly kind: InstrumentKind;
  /** Clear aperture, millimetres (0 for the naked eye). */
  readonly apertureMm: number;
  /** Magnification (1 for the naked eye). */
  readonly magnification: number;
  /** Fraction of light transmitted, 0–1, including any central obstruction (1 for the naked eye). */
  readonly transmission: number;
  /** True when both eyes are used (naked eye, binoculars); false for a one-eyed telescope view. */
  readonly bothEyes: boolean;
}

/** The naked eye: no gain, both eyes. */
export const NAKED_EYE: Instrument = Object.freeze({
  id: 'naked-eye',
  kind: 'naked-eye',
  apertureMm: 0,
  magnification: 1,
  transmission: 1,
  bothEyes: true,
});

/**
 * 10×50 binoculars. Transmission 0.80: coated objective, roof/porro prisms and eyepiece; a typical
 * figure for ordinary coated binoculars (common practice, from memory; Schaefer 1990's refractor
 * value 0.99^8 ≈ 0.92 is for a telescope without prisms).
 */
export const BINOCULARS_10X50: Instrument = Object.freeze({
  id: 'binoculars-10x50',
  kind: 'binoculars',
  apertureMm: 50,
  magnification: 10,
  transmission: 0.8,
  bothEyes: true,
});

/** 7×50 binoculars (exit pupil 7.1 mm: light is lost when the eye pupil is smaller). Transmission as 10×50. */
export const BINOCULARS_7X50: Instrument = Object.freeze({
  id: 'binoculars-7x50',
  kind: 'binoculars',
  apertureMm: 50,
  magnification: 7,
  transmission: 0.8,
  bothEyes: true,
});

/**
 * A small telescope: 100 mm refractor at 50×, one eye. Transmission 0.99^8 ≈ 0.92 (four coated
 * objective surfaces and four eyepiece surfaces, Schaefer 1989, Sky & Telescope 78:522, LIMMAG.BAS).
 */
export const TELESCOPE_100MM: Instrument = Object.freeze({
  id: 'telescope-100mm',
  kind: 'telescope',
  apertureMm: 100,
  magnification: 50,
  transmission: Math.pow(0.99, 8),
  bothEyes: false,
});

/** The three instruments a bulletin reports on by default. */
export const DEFAULT_INSTRUMENTS: Readonly<Record<InstrumentKind, Instrument>> = Object.freeze({
  'naked-eye': NAKED_EYE,
  binoculars: BINOCULARS_10X50,
  telescope: TELESCOPE_100MM,
});

/** What `defineInstrument` accepts. */
export interface InstrumentSpec {
  id?: string;
  kind: 'binoculars' | 'telescope';
  apertureMm: number;
  magnification: number;
  /** Default 0.8 for binoculars, 0.92 for telescopes. */
  transmission?: number;
  /** Default: true for binoculars, false for telescopes. */
  bothEyes?: boolean;
}

/**
 * Validates and builds an instrument (e.g. from a site's configuration).
 * @throws GloamingError `invalid-value` with the offending field.
 */
export function defineInstrument(spec: InstrumentSpec): Instrument {
  if (spec.kind !== 'binoculars' && spec.kind !== 'telescope') {
    throw new GloamingError('invalid-value', 'unknown instrument kind', {
      place: { field: 'kind' },
      actual: spec.kind,
      expected: "'binoculars' or 'telescope'",
    });
  }
  const check = (value: number | undefined, field: string, min: number, max: number, expected: string): void => {
    if (typeof value !== 'number' || !Number.isFinite(value) || value < min || value > max) {
      throw new GloamingError('invalid-value', `instrument ${field} is out of range`, { place: { field }, actual: value, expected });
    }
  };
  check(spec.apertureMm, 'apertureMm', 5, 2000, 'an aperture in millimetres from 5 to 2000');
  check(spec.magnification, 'magnification', 1, 1000, 'a magnification from 1 to 1000');
  const transmission = spec.transmission ?? (spec.kind === 'binoculars' ? 0.8 : Math.pow(0.99, 8));
  check(transmission, 'transmission', 0.05, 1, 'a transmitted fraction from 0.05 to 1');
  return Object.freeze({
    id: spec.id ?? `${spec.kind}-${spec.apertureMm}mm-${spec.magnification}x`,
    kind: spec.kind,
    apertureMm: spec.apertureMm,
    magnification: spec.magnification,
    transmission,
    bothEyes: spec.bothEyes ?? spec.kind === 'binoculars',
  });
}

/**
 * Dark-adapted eye pupil diameter: D_e = 7 e^(−½ (age/100)²) mm (Schaefer 1990, PASP 102:212;
 * Schaefer 1989, Sky & Telescope 78:522, LIMMAG.BAS).
 */
export function eyePupilMm(ageYears: number): number {
  const a = ageYears / 100;
  return 7 * Math.exp(-0.5 * a * a);
}

/**
 * Extra magnitudes a diffuse, round source of apparent (magnified) diameter θ needs over a point
 * source: 1.25 log10(θ / 15′) for θ > 15′, else 0.
 *
 * APPROXIMATION. This is Schaefer's extended-image factor F_r = √(θ / 900″) (Schaefer 1990,
 * PASP 102:212; LIMMAG.BAS), defined for a seeing disk magnified beyond the eye's ~15′ summation
 * area. Applying it to a comet's coma (θ = coma diameter × magnification) is this project's
 * approximation, not a published comet method: it ignores the coma's central condensation and
 * contrast thresholds for extended objects (Blackwell-type data would be better).
 *
 * @param apparentDiameterArcmin apparent diameter as seen in the eyepiece (or by eye), arcminutes.
 * @returns penalty, magnitudes (≥ 0).
 */
export function extendedSourcePenaltyMag(apparentDiameterArcmin: number): number {
  return apparentDiameterArcmin > 15 ? (1.25 * Math.log(apparentDiameterArcmin / 15)) / LOG10 : 0;
}

/**
 * The closest pair of stars an instrument shows as two, arcseconds: the unaided eye's 4′ divided by
 * the magnification, but never closer than Dawes' limit of the aperture, 116″ / D(mm) (Dawes 1867,
 * MNRAS 27:217, 4.56″ per inch; from memory). The eye's 4′ is common practice for a pair of
 * unequal, moderately bright stars: Mizar and Alcor (11.8′) are an easy naked-eye pair, ε Lyr
 * (3.5′) only for keen eyes.
 */
export function pairResolutionArcsec(instrument: Instrument): number {
  return Math.max(240 / instrument.magnification, instrument.apertureMm > 0 ? 116 / instrument.apertureMm : 0);
}

/** Inputs of `limitingMagnitude`. */
export interface LimitingMagnitudeInput {
  /** Sky brightness at the target, nanolamberts (from `skyBrightness(...).totalNl`). */
  skyNl: number;
  /** Default `NAKED_EYE`. */
  instrument?: Instrument;
  observer?: Observer;
  /** Coma diameter of a diffuse comet, arcminutes (true size on the sky). Omit for point sources. */
  comaDiameterArcmin?: number;
}

const SQRT2 = Math.SQRT2;

/**
 * Limiting magnitude: the faintest V magnitude (as arriving at the observer, after extinction)
 * of a point source — or, with `comaDiameterArcmin`, of a diffuse comet — that can be seen
 * against a sky of `skyNl`.
 *
 * Naked eye (Schaefer 1998, VISLIMIT): m = −16.57 − 2.5 log10(I_th(B)) + 5 log10(Snellen).
 * With optics (Schaefer 1990, "Telescopic limiting magnitudes", PASP 102:212–229; Schaefer 1989,
 * Sky & Telescope 78:522, LIMMAG.BAS): the sky seen in the eyepiece is B' = B / (F_b F_t F_p F_a F_m)
 * and the source must deliver I = I_th(B') F_b F_t F_p F_a at the objective, with
 * F_b = √2 for one eye (1 with both), F_t = 1/transmission, F_p = (D_p/D_e)² when the exit pupil
 * D_p = D/M exceeds the eye pupil D_e (else 1), F_a = (D_e/D)², F_m = M². Extinction (F_e) is left
 * to the caller (m + k·X); star colour (F_c) and experience terms are taken as 1 (average observer,
 * white light); the seeing-disk factor F_r is replaced by the coma penalty when a coma is given.
 *
 * @returns limiting magnitude, V.
 */
export function limitingMagnitude(input: LimitingMagnitudeInput): number {
  const instrument = input.instrument ?? NAKED_EYE;
  const observer = input.observer;
  const snellen = observer?.snellenRatio ?? 1;
  const acuity = snellen === 1 ? 0 : (5 * Math.log(snellen)) / LOG10;
  const coma = input.comaDiameterArcmin ?? 0;
  if (instrument.apertureMm <= 0) {
    return magnitudeFromIlluminanceFtcd(thresholdIlluminanceFtcd(input.skyNl)) + acuity - extendedSourcePenaltyMag(coma);
  }
  const dEye = eyePupilMm(observer?.ageYears ?? 40);
  const d = instrument.apertureMm;
  const mag = instrument.magnification;
  const exitPupil = d / mag;
  const fb = instrument.bothEyes ? 1 : SQRT2;
  const ft = 1 / instrument.transmission;
  const fp = exitPupil > dEye ? (exitPupil / dEye) * (exitPupil / dEye) : 1;
  const fa = (dEye / d) * (dEye / d);
  const fm = mag * mag;
  const gain = fb * ft * fp * fa;
  const background = input.skyNl / (gain * fm);
  const illuminance = thresholdIlluminanceFtcd(background) * gain;
  return magnitudeFromIlluminanceFtcd(illuminance) + acuity - extendedSourcePenaltyMag(coma * mag);
}
