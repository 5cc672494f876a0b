/**
 * The physical visibility model: airmass and extinction, the site's dark sky, sky brightness from
 * night sky, Moon and twilight, and the eye's limiting magnitude with or without optics.
 *
 * Typical use, per site (once): `darkSkyFromQuality`, `extinctionCoefficientGreen` or
 * `extinctionCoefficientSchaefer`; per target and moment (hot path): `skyBrightness`, then
 * `visibilityMargin` for each instrument. Everything is pure: no clock, no ephemeris.
 */
import { extinctionMag } from './extinction.ts';
import { limitingMagnitude, type Instrument, type LimitingMagnitudeInput, type Observer } from './threshold.ts';
import { extendedLimitingMagnitude } from './extended.ts';

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
  pairResolutionArcsec,
  thresholdIlluminanceFtcd,
  type Instrument,
  type InstrumentSpec,
  type LimitingMagnitudeInput,
  type Observer,
} from './threshold.ts';

export {
  ARCMIN2_TO_SR,
  NL_TO_CD_M2,
  contrastThresholdCrumey,
  extendedLimitingMagnitude,
  meanSurfaceBrightness,
  thresholdIncrementCdM2,
  type ExtendedLimitInput,
} from './extended.ts';

/**
 * The limiting magnitude for an object: Crumey's extended-object threshold when it has an area
 * (`areaArcmin2`, deep-sky objects; `./extended.ts`), else Schaefer's point-source threshold (with
 * the coma penalty for a diffuse comet; `./threshold.ts`).
 */
export function objectLimitingMagnitude(input: LimitingMagnitudeInput & { areaArcmin2?: number }): number {
  if (input.areaArcmin2 !== undefined && input.areaArcmin2 > 0) {
    return extendedLimitingMagnitude({ skyNl: input.skyNl, areaArcmin2: input.areaArcmin2, instrument: input.instrument, observer: input.observer });
  }
  return limitingMagnitude(input);
}

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
  /** Area of an extended object (cluster, nebula, galaxy), square arcminutes: Crumey's threshold applies. */
  areaArcmin2?: number;
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
    objectLimitingMagnitude({
      skyNl: input.skyNl,
      instrument: input.instrument,
      observer: input.observer,
      comaDiameterArcmin: input.comaDiameterArcmin,
      areaArcmin2: input.areaArcmin2,
    }) -
    (input.magnitude + extinction)
  );
}
