/**
 * Atmospheric extinction in the V band: how many magnitudes the air takes from an object's light.
 *
 * An extinction coefficient k_V (magnitudes per airmass) comes from the site, either from its
 * elevation alone (Green 1992) or from Schaefer's four-component model (elevation, humidity,
 * temperature, latitude, month). The extinction towards an object is then k_V · X(h).
 */
import { GloamingError } from '../../core/errors.ts';
import { airmassKastenYoung, airmassRozenberg } from './airmass.ts';

const DEG = Math.PI / 180;

function requireFinite(value: number, field: string, expected: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new GloamingError('invalid-value', `${field} must be a finite number`, {
      place: { field },
      actual: value,
      expected,
    });
  }
}

function requireRange(value: number, field: string, min: number, max: number, expected: string): void {
  requireFinite(value, field, expected);
  if (value < min || value > max) {
    throw new GloamingError('invalid-value', `${field} is out of range`, { place: { field }, actual: value, expected });
  }
}

/**
 * V-band extinction coefficient from the site's elevation alone (an average atmosphere):
 * k = 0.1451 e^(−H/7.996) (Rayleigh) + 0.120 e^(−H/1.5) (aerosol) + 0.016 (ozone), H in km.
 *
 * Source: Green D.W.E. 1992, "Magnitude Corrections for Atmospheric Extinction",
 * International Comet Quarterly 14:55–59. Green's Table Ia gives k · X with Rozenberg's airmass.
 *
 * @param elevationM site elevation above sea level, metres (−500 to 9000).
 * @returns k_V, magnitudes per airmass (0.281 at sea level, 0.21 at 1000 m).
 * @throws GloamingError `invalid-value` for a non-finite or out-of-range elevation.
 */
export function extinctionCoefficientGreen(elevationM: number): number {
  requireRange(elevationM, 'elevationM', -500, 9000, 'an elevation in metres from -500 to 9000');
  const hKm = elevationM / 1000;
  return 0.1451 * Math.exp(-hKm / 7.996) + 0.12 * Math.exp(-hKm / 1.5) + 0.016;
}

/** Inputs of Schaefer's extinction model. Only `elevationM` and `latitudeDeg` are required. */
export interface SchaeferExtinctionInput {
  /** Site elevation above sea level, metres. */
  elevationM: number;
  /** Geodetic latitude, degrees, north positive (sets the hemisphere of the seasons and the ozone term). */
  latitudeDeg: number;
  /** Relative humidity, percent (1–99). Default 50: a middle value for a temperate night (a documented choice). */
  relativeHumidityPct?: number;
  /** Air temperature, °C. Default 15 (Schaefer's program default). */
  temperatureC?: number;
  /**
   * Month, 1 (January) to 12 (fractions allowed). Omitted: the annual mean, i.e. the two seasonal
   * terms (aerosol sin RA, ozone cos RA) set to their yearly average of zero.
   */
  month?: number;
}

/** The four components of Schaefer's V-band extinction and their sum, magnitudes per airmass. */
export interface SchaeferExtinction {
  /** Total k_V = rayleigh + aerosol + ozone + water. */
  kV: number;
  rayleigh: number;
  aerosol: number;
  ozone: number;
  water: number;
}

/**
 * V-band extinction coefficient from Schaefer's model of the atmosphere (λ = 0.55 µm):
 * - Rayleigh k_R = 0.1066 e^(−H/8200 m)
 * - aerosol k_A = 0.1 e^(−H/1500 m) (1 − 0.32 / ln(RH/100))^1.33 (1 + 0.33 sgn(φ) sin RA), RA = (month − 3)·30°
 * - ozone k_O = 0.031 (3 + 0.4 (φ cos RA − cos 3φ)) / 3 (φ in radians)
 * - water k_W = 0.031 · 0.94 (RH/100) e^(T/15 °C) e^(−H/8200 m)
 *
 * Source: Schaefer B.E. 1998, "To the Visual Limits", Sky & Telescope 95(5):57–60, program
 * VISLIMIT.BAS (extinction subroutine, V band); the physics is reviewed in Schaefer B.E. 1993,
 * "Astronomy and the limits of vision", Vistas in Astronomy 36:311–361.
 *
 * @returns the coefficients in magnitudes per airmass (use `extinctionMagSchaefer` for the matching
 *   component airmasses, or `kV` with `extinctionMag`).
 * @throws GloamingError `invalid-value` for out-of-range inputs.
 */
export function extinctionCoefficientSchaefer(input: SchaeferExtinctionInput): SchaeferExtinction {
  const { elevationM, latitudeDeg } = input;
  const rh = input.relativeHumidityPct ?? 50;
  const tC = input.temperatureC ?? 15;
  requireRange(elevationM, 'elevationM', -500, 9000, 'an elevation in metres from -500 to 9000');
  requireRange(latitudeDeg, 'latitudeDeg', -90, 90, 'a latitude in degrees from -90 to 90');
  requireRange(rh, 'relativeHumidityPct', 1, 99, 'a relative humidity in percent from 1 to 99');
  requireRange(tC, 'temperatureC', -60, 50, 'an air temperature in °C from -60 to 50');
  let sinRA = 0;
  let cosRA = 0;
  if (input.month !== undefined) {
    requireRange(input.month, 'month', 1, 12.999, 'a month from 1 (January) to 12 (December)');
    const ra = (input.month - 3) * 30 * DEG;
    sinRA = Math.sin(ra);
    cosRA = Math.cos(ra);
  }
  const latRad = latitudeDeg * DEG;
  const rayleigh = 0.1066 * Math.exp(-elevationM / 8200);
  const aerosol =
    0.1 *
    Math.exp(-elevationM / 1500) *
    Math.pow(1 - 0.32 / Math.log(rh / 100), 1.33) *
    (1 + 0.33 * Math.sign(latitudeDeg) * sinRA);
  const ozone = (0.031 * (3 + 0.4 * (latRad * cosRA - Math.cos(3 * latRad)))) / 3;
  const water = 0.031 * 0.94 * (rh / 100) * Math.exp(tC / 15) * Math.exp(-elevationM / 8200);
  return { kV: rayleigh + aerosol + ozone + water, rayleigh, aerosol, ozone, water };
}

/**
 * Extinction towards an object with Schaefer's component airmasses (gas, aerosol and ozone layers
 * at their own heights): Δm = k_R X_gas + k_A X_aer + k_O X_oz + k_W X_gas, with
 * X_gas = 1/(cos z + 0.0286 e^(−10.5 cos z)), X_aer = 1/(cos z + 0.0123 e^(−24.5 cos z)),
 * X_oz = 1/√(1 − (sin z / (1 + 20/6378))²).
 *
 * Source: Schaefer 1998, Sky & Telescope 95(5):57, VISLIMIT.BAS.
 *
 * @param k the components from `extinctionCoefficientSchaefer`.
 * @param altitudeDeg apparent altitude, degrees.
 * @returns extinction, magnitudes; `Infinity` below the horizon.
 */
export function extinctionMagSchaefer(k: SchaeferExtinction, altitudeDeg: number): number {
  if (altitudeDeg < 0) return Infinity;
  const cosZ = altitudeDeg >= 90 ? 1 : Math.sin(altitudeDeg * DEG);
  const sinZ = Math.sqrt(Math.max(0, 1 - cosZ * cosZ));
  const xGas = 1 / (cosZ + 0.0286 * Math.exp(-10.5 * cosZ));
  const xAer = 1 / (cosZ + 0.0123 * Math.exp(-24.5 * cosZ));
  const s = sinZ / (1 + 20 / 6378);
  const xOz = 1 / Math.sqrt(1 - s * s);
  return (k.rayleigh + k.water) * xGas + k.aerosol * xAer + k.ozone * xOz;
}

/** Which airmass `extinctionMag` multiplies k by. */
export type ExtinctionAirmass = 'kasten-young' | 'rozenberg';

/**
 * Extinction towards an object: Δm = k_V · X(h). The extincted magnitude is m + Δm.
 *
 * @param kV extinction coefficient, magnitudes per airmass (from `extinctionCoefficientGreen`,
 *   `extinctionCoefficientSchaefer(...).kV` or a site's measured value).
 * @param altitudeDeg apparent altitude, degrees.
 * @param options.airmass `'kasten-young'` (default; Kasten & Young 1989) or `'rozenberg'`
 *   (Rozenberg 1966, as Green 1992 tabulates).
 * @returns extinction, magnitudes; `Infinity` below the horizon (0 if kV is 0).
 */
export function extinctionMag(kV: number, altitudeDeg: number, options?: { airmass?: ExtinctionAirmass }): number {
  if (altitudeDeg < 0) return kV === 0 ? 0 : Infinity;
  const x = options?.airmass === 'rozenberg' ? airmassRozenberg(altitudeDeg) : airmassKastenYoung(altitudeDeg);
  return kV * x;
}
