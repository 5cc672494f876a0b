/**
 * The physical visibility model: airmass and extinction, the site's dark sky, sky brightness from
 * night sky, Moon and twilight, and the eye's limiting magnitude with or without optics.
 *
 * Typical use, per site (once): `darkSkyFromQuality`, `extinctionCoefficientGreen` or
 * `extinctionCoefficientSchaefer`; per target and moment (hot path): `skyBrightness`, then
 * `visibilityMargin` for each instrument. Everything is pure: no clock, no ephemeris.
 */
import { extinctionMag } from './extinction.ts';
import { limitingMagnitude, type Instrument, type Observer } from './threshold.ts';

export { airmassKastenYoung, airmassRozenberg, airmassScattering } from './airmass.ts';
export {
  extinctionCoefficientGreen,
  extinctionCoefficientSchaefer,
  extinctionMag,
  extinctionMagSchaefer,
  type ExtinctionAirmass,
  type SchaeferExtinction,
  type SchaeferExtinctionInput,
} from './extinction.ts';
export {
  BORTLE_CLASSES,
  DARKEST_NATURAL_SKY_MAG,
  darkSkyFromQuality,
  magPerArcsec2ToNl,
  nelmFromSkyBrightness,
  nlToMagPerArcsec2,
  skyBrightnessFromNelm,
  skyQualityFromBrightness,
  type BortleClass,
  type DarkSky,
} from './quality.ts';
export {
  darkSkyNl,
  moonlightNl,
  moonMagnitudeKs91,
  scatteringFunctionKs91,
  skyBrightness,
  twilightNl,
  twilightNlSchaefer,
  type SkyBrightness,
  type SkyBrightnessInput,
} from './brightness.ts';
export {
  BINOCULARS_7X50,
  BINOCULARS_10X50,
  DEFAULT_INSTRUMENTS,
  NAKED_EYE,
  TELESCOPE_100MM,
  defineInstrument,
  extendedSourcePenaltyMag,
  eyePupilMm,
  limitingMagnitude,
  magnitudeFromIlluminanceFtcd,
  thresholdIlluminanceFtcd,
  type Instrument,
  type InstrumentSpec,
  type LimitingMagnitudeInput,
  type Observer,
} from './threshold.ts';

/** Inputs of `visibilityMargin`. */
export interface VisibilityMarginInput {
  /** The object's V magnitude outside the atmosphere (a comet's total magnitude). */
  magnitude: number;
  /** Apparent altitude of the object, degrees. */
  altitudeDeg: number;
  /** V extinction coefficient, magnitudes per airmass. */
  kV: number;
  /** Sky brightness at the object, nL (`skyBrightness(...).totalNl`). */
  skyNl: number;
  /** Default: the naked eye. */
  instrument?: Instrument;
  observer?: Observer;
  /** Coma diameter of a diffuse comet, arcminutes; omit for point sources (see `extendedSourcePenaltyMag`). */
  comaDiameterArcmin?: number;
}

/**
 * Visibility margin, magnitudes: limiting magnitude − (magnitude + k·X), X the Kasten & Young
 * (1989) airmass. Positive: the object should be visible with this instrument, by that many
 * magnitudes; negative: too faint by that many. `-Infinity` below the horizon.
 */
export function visibilityMargin(input: VisibilityMarginInput): number {
  const extinction = extinctionMag(input.kV, input.altitudeDeg);
  if (extinction === Infinity) return -Infinity;
  return (
    limitingMagnitude({
      skyNl: input.skyNl,
      instrument: input.instrument,
      observer: input.observer,
      comaDiameterArcmin: input.comaDiameterArcmin,
    }) -
    (input.magnitude + extinction)
  );
}
