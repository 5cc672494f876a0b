/**
 * Sky brightness at a point of the sky at one moment: the moonless night sky, scattered moonlight
 * and twilight (or daylight), each in nanolamberts (nL), summed, and also given in V mag/arcsec².
 *
 * Frame: horizontal coordinates of the observer; all angles in degrees; altitudes apparent.
 * Pure and allocation-light: one small result object per call, no ephemeris calls — the caller
 * supplies the Sun's and Moon's altitudes, the Moon's phase angle and the target's separations.
 */
import { airmassRozenberg, airmassScattering } from './airmass.ts';
import { nlToMagPerArcsec2 } from './quality.ts';

const DEG = Math.PI / 180;
const LN10 = Math.LN10;

/** 10^x, written with exp for speed. */
function pow10(x: number): number {
  return Math.exp(x * LN10);
}

/** Inputs of `skyBrightness`. */
export interface SkyBrightnessInput {
  target: {
    /** Apparent altitude of the point of sky looked at, degrees. */
    altitudeDeg: number;
    /** Angular distance from the Sun's centre, degrees (0–180). */
    sunSeparationDeg: number;
    /** Angular distance from the Moon's centre, degrees (0–180). */
    moonSeparationDeg: number;
  };
  sun: {
    /** Apparent altitude of the Sun's centre, degrees. */
    altitudeDeg: number;
    /** Geometric altitude of the Sun's centre, degrees: the depression that sets the twilight (default: `altitudeDeg`). */
    geometricAltitudeDeg?: number;
  };
  moon: {
    /** Apparent altitude of the Moon's centre, degrees. Below 0 the Moon adds no light. */
    altitudeDeg: number;
    /** Sun–Moon–Earth phase angle, degrees: 0 full, 90 quarter, 180 new. */
    phaseAngleDeg: number;
  };
  /** The site's moonless zenith sky brightness, nL (from `darkSkyFromQuality(...).zenithNl`). */
  darkSkyZenithNl: number;
  /** V extinction coefficient, magnitudes per airmass. */
  kV: number;
}

/** Sky brightness and its parts, nL; `magPerArcsec2` is the total in V mag/arcsec². */
export interface SkyBrightness {
  totalNl: number;
  magPerArcsec2: number;
  /** Moonless, twilight-free night sky at this altitude. */
  darkNl: number;
  /** Scattered moonlight (0 when the Moon is below the horizon). */
  moonNl: number;
  /** Twilight or daylight, whichever Schaefer's model gives smaller (see `twilightNl`). */
  twilightNl: number;
}

/**
 * Moonless night sky at a target, from the zenith value (Krisciunas & Schaefer 1991, PASP 103:1033,
 * eq. 2 with the airmass of eq. 3): B(z) = B_zen · 10^(−0.4 k (X − 1)) · X. The airglow path grows
 * towards the horizon (X) while extinction dims it.
 *
 * @param zenithNl moonless zenith brightness, nL. @param kV extinction, mag/airmass.
 * @param altitudeDeg apparent altitude of the target, degrees (below 0: the horizon value).
 */
export function darkSkyNl(zenithNl: number, kV: number, altitudeDeg: number): number {
  const x = airmassScattering(altitudeDeg);
  return zenithNl * pow10(-0.4 * kV * (x - 1)) * x;
}

/**
 * Moon's V magnitude outside the atmosphere at mean distance (KS91 eq. 9):
 * m = −12.73 + 0.026 |α| + 4·10⁻⁹ α⁴, α = phase angle in degrees (0 = full).
 */
export function moonMagnitudeKs91(phaseAngleDeg: number): number {
  const a = Math.abs(phaseAngleDeg);
  const a2 = a * a;
  return -12.73 + 0.026 * a + 4e-9 * a2 * a2;
}

/**
 * Scattering function of KS91 (eq. 21), per unit illuminance, for scattering angle ρ (degrees):
 * f(ρ) = 10^5.36 (1.06 + cos² ρ) [Rayleigh] + 10^(6.15 − ρ/40) [Mie, ρ ≥ 10°] or 6.2·10⁷ ρ⁻² [ρ < 10°].
 * ρ is clamped to ≥ 1°: the fit was made far from the Moon and diverges at ρ = 0.
 */
export function scatteringFunctionKs91(separationDeg: number): number {
  const rho = separationDeg < 1 ? 1 : separationDeg;
  const c = Math.cos(rho * DEG);
  const rayleigh = 229086.765 * (1.06 + c * c); // 10^5.36
  const mie = rho >= 10 ? pow10(6.15 - rho / 40) : 6.2e7 / (rho * rho);
  return rayleigh + mie;
}

/**
 * Scattered moonlight at a target, nL (Krisciunas & Schaefer 1991, PASP 103:1033):
 * B = f(ρ) · I* · 10^(−0.4 k X(Z_moon)) · (1 − 10^(−0.4 k X(Z))), with I* = 10^(−0.4 (m + 16.57))
 * foot-candles (eq. 8), m from eq. 9, f from eq. 21 and X the scattering airmass of eq. 3.
 *
 * Opposition effect: KS91 note that eq. 9 underestimates the Moon within 7° of full, by up to
 * about 35 % at exactly full (the paper's text as quoted in third-party code). This function
 * multiplies I* by 1 + 0.35 (1 − |α|/7°) for |α| < 7° — the linear taper is this project's
 * choice of shape, documented as such.
 *
 * @returns nL; 0 when the Moon is below the horizon (altitude < 0).
 */
export function moonlightNl(input: {
  targetAltitudeDeg: number;
  moonSeparationDeg: number;
  moonAltitudeDeg: number;
  moonPhaseAngleDeg: number;
  kV: number;
}): number {
  if (input.moonAltitudeDeg < 0) return 0;
  const alpha = Math.abs(input.moonPhaseAngleDeg);
  let illuminance = pow10(-0.4 * (moonMagnitudeKs91(alpha) + 16.57));
  if (alpha < 7) illuminance *= 1 + 0.35 * (1 - alpha / 7);
  const k = input.kV;
  const xMoon = airmassScattering(input.moonAltitudeDeg);
  const xTarget = airmassScattering(input.targetAltitudeDeg);
  return (
    scatteringFunctionKs91(input.moonSeparationDeg) *
    illuminance *
    pow10(-0.4 * k * xMoon) *
    (1 - pow10(-0.4 * k * xTarget))
  );
}

/** VISLIMIT's V-band unit: B_nL = B / 1.11·10⁻¹⁵ (Schaefer 1998). */
const VISLIMIT_UNIT_NL = 1 / 1.11e-15;
/** Sun's V magnitude and VISLIMIT's V zero point m_O (Schaefer 1998, VISLIMIT data). */
const SUN_V = -26.74;
const MO_V = -11.05;

/**
 * Twilight and daylight at a target, nL, exactly as Schaefer's model gives them (Schaefer 1998, "To the
 * Visual Limits", Sky & Telescope 95(5):57, VISLIMIT.BAS, V band), using Rozenberg airmasses as the program does:
 * - twilight B_T = 10^(−0.4 (m_sun − m_O + 32.5 − h_sun − z/(360 k))) · (100/ρ_sun) · (1 − 10^(−0.4 k X))
 * - daylight B_D = 10^(−0.4 (m_sun − m_O + 43.27)) (1 − 10^(−0.4 k X)) (f(ρ_sun) C + 440000 (1 − C)),
 *   C = 10^(−0.4 k X_sun), X_sun = 40 with the Sun below the horizon, f the KS91 scattering function;
 * and returns min(B_D, B_T), as the program adds the smaller of the two to the night sky: B_T
 * grows without bound as the Sun rises, B_D is the real daylight then, and with the Sun deep
 * below the horizon B_T is the (small) twilight. In units: B_nL = B / 1.11·10⁻¹⁵, m_O = −11.05, m_sun = −26.74.
 * ρ_sun is clamped to ≥ 1°.
 *
 * Kept as published (and tested against the program's numbers); the sky model uses the calibrated
 * `twilightNl`, whose twilight falls with the Sun's depression as measured rather than by 1 mag per degree.
 *
 * @returns nL (≥ 0).
 */
export function twilightNlSchaefer(input: {
  targetAltitudeDeg: number;
  sunSeparationDeg: number;
  sunAltitudeDeg: number;
  kV: number;
}): number {
  const k = input.kV > 1e-6 ? input.kV : 1e-6;
  const hSun = input.sunAltitudeDeg;
  const zDeg = 90 - (input.targetAltitudeDeg < 0 ? 0 : input.targetAltitudeDeg > 90 ? 90 : input.targetAltitudeDeg);
  const rho = input.sunSeparationDeg < 1 ? 1 : input.sunSeparationDeg;
  const scatter = 1 - pow10(-0.4 * k * airmassRozenberg(input.targetAltitudeDeg));
  const twilight = pow10(-0.4 * (SUN_V - MO_V + 32.5 - hSun - zDeg / (360 * k))) * (100 / rho) * scatter;
  return Math.min(twilight, schaeferDaylight(k, hSun, rho, scatter)) * VISLIMIT_UNIT_NL;
}

/** Schaefer's daylight term B_D in VISLIMIT units (see `twilightNlSchaefer`). */
function schaeferDaylight(k: number, sunAltitudeDeg: number, rho: number, scatter: number): number {
  const c = pow10(-0.4 * k * airmassRozenberg(sunAltitudeDeg));
  return pow10(-0.4 * (SUN_V - MO_V + 43.27)) * scatter * (scatteringFunctionKs91(rho) * c + 440000 * (1 - c));
}

/**
 * Patat, Ugolnikov & Postylyakov 2006 (A&A 455:385, "UBVRI twilight sky brightness at ESO-Paranal"),
 * Table 4, V band: zenith m(ζ) = 11.84 + 1.518 (ζ − 95°) − 0.057 (ζ − 95°)² mag/arcsec², fitted for Sun zenith
 * distances 95° ≤ ζ ≤ 105°, night sky included. Coefficients as read in two independent third-party codes
 * (not confirmed against the paper's table). The Paranal night sky (21.6 V mag/arcsec², Patat 2003, A&A 400:1183)
 * is taken out to leave the twilight alone; the extinction the model gives Paranal's 2635 m (Green 1992,
 * k = 0.141) sets the scale for other sites.
 */
const PATAT_V = { a0: 11.84, a1: 1.518, a2: -0.057 } as const;
const PATAT_NIGHT_V = 21.6;
const PATAT_K = 0.1412;
/** (k / k_Paranal)^0.38: 1.3× at sea level (k 0.281), Patat et al.'s low-site ratio. */
const SITE_SCALE_EXPONENT = Math.log(1.3) / Math.log(0.281 / 0.1412);
/** Zenith distances of the Sun between which the Patat fit is used; outside it the twilight changes by 1 mag per degree (Schaefer's law). */
const PATAT_ZETA_MIN = 95;
const PATAT_ZETA_MAX = 105;
const SCHAEFER_SLOPE_MAG_PER_DEG = 1;
/**
 * Between sunset and ζ = 95° the zenith brightens by 0.78 mag per degree towards sunset: the straight line from
 * Patat's value at 95° to Schaefer's own zenith twilight at ζ = 90° for Paranal (7.93 mag/arcsec²), whose whole-sky
 * illuminance near sunset agrees with the few hundred lux measured on clear evenings (AMS Glossary, "civil twilight").
 */
const SUNSET_SLOPE_MAG_PER_DEG = 0.78;

/** Twilight alone at the zenith of a Paranal-like site, V mag/arcsec², for Sun zenith distance ζ (degrees); see `PATAT_V`. */
function patatZenithTwilightMag(zetaDeg: number): number {
  const fit = (z: number): number => {
    const x = z - 95;
    const total = PATAT_V.a0 + PATAT_V.a1 * x + PATAT_V.a2 * x * x;
    // Remove the night sky: m_twi = m − 2.5 log10(1 − 10^(−0.4 (m_night − m))).
    return total - 2.5 * Math.log10(1 - pow10(-0.4 * (PATAT_NIGHT_V - total)));
  };
  if (zetaDeg < PATAT_ZETA_MIN) return fit(PATAT_ZETA_MIN) - SUNSET_SLOPE_MAG_PER_DEG * (PATAT_ZETA_MIN - zetaDeg);
  if (zetaDeg > PATAT_ZETA_MAX) return fit(PATAT_ZETA_MAX) + SCHAEFER_SLOPE_MAG_PER_DEG * (zetaDeg - PATAT_ZETA_MAX);
  return fit(zetaDeg);
}

/** 1 V mag/arcsec² in nL: B_nL = 3.408·10¹⁰ · 10^(−0.4 V) (Garstang 1986, PASP 98:364, eq. 19). */
const NL_AT_ZERO_MAG = 3.408e10;

/**
 * Twilight and daylight at a target, nL: the model gloaming uses.
 *
 * - How bright the twilit zenith is for a given solar depression comes from measurements: the Patat et al.
 *   2006 V-band zenith fit at Paranal (see `PATAT_V`) for Sun zenith distances 95°–105°, continued outside
 *   that range towards sunset by a straight line to Schaefer's zenith value at ζ = 90° (0.78 mag per degree),
 *   and into the night by Schaefer's 1 mag per degree.
 * - How it spreads over the sky is Schaefer's (1998, VISLIMIT): relative to the zenith, a target at zenith
 *   distance z and distance ρ from the Sun gets 10^(0.4 z/(360 k)) · (ζ/ρ) · (1 − 10^(−0.4 k X))/(1 − 10^(−0.4 k)).
 * - The level scales with the site's extinction as (k / k_Paranal)^0.38, chosen so that a sea-level site (k 0.28)
 *   gets the 1.3× Paranal's twilight that Patat et al. report for a low-altitude site (their abstract).
 * - As in Schaefer's program the result is min(twilight, daylight), the daylight term taking over with the Sun up.
 *
 * Compared with `twilightNlSchaefer` fed the same Sun altitude (Paranal's k): equal at sunset, 1.1 mag brighter
 * with the Sun 5° down, 0.7 mag at 6°, 0.1 mag at 8°, within 0.4 mag from 9° to 15°.
 *
 * @param input.sunAltitudeDeg apparent altitude of the Sun's centre, degrees (sets the daylight term's airmass).
 * @param input.sunGeometricAltitudeDeg geometric (airless) altitude of the Sun's centre, degrees: the depression
 *   that sets the twilight, ζ = 90° − altitude, as in the USNO twilight definitions and Patat's fit; default: the apparent one.
 * @returns nL (≥ 0).
 */
export function twilightNl(input: {
  targetAltitudeDeg: number;
  sunSeparationDeg: number;
  sunAltitudeDeg: number;
  sunGeometricAltitudeDeg?: number;
  kV: number;
}): number {
  const k = input.kV > 1e-6 ? input.kV : 1e-6;
  const hSun = input.sunAltitudeDeg;
  const zeta = 90 - (input.sunGeometricAltitudeDeg ?? hSun);
  const zDeg = 90 - (input.targetAltitudeDeg < 0 ? 0 : input.targetAltitudeDeg > 90 ? 90 : input.targetAltitudeDeg);
  const rho = input.sunSeparationDeg < 1 ? 1 : input.sunSeparationDeg;
  const scatter = 1 - pow10(-0.4 * k * airmassRozenberg(input.targetAltitudeDeg));
  const zenithScatter = 1 - pow10(-0.4 * k);
  const zenithNl = NL_AT_ZERO_MAG * pow10(-0.4 * patatZenithTwilightMag(zeta)) * Math.pow(k / PATAT_K, SITE_SCALE_EXPONENT);
  const twilightNl = zenithNl * pow10((0.4 * zDeg) / (360 * k)) * (zeta / rho) * (scatter / zenithScatter);
  const daylightNl = schaeferDaylight(k, hSun, rho, scatter) * VISLIMIT_UNIT_NL;
  return twilightNl < daylightNl ? twilightNl : daylightNl;
}

/**
 * Sky brightness at a target: dark sky (KS91 eqs. 2–3) + moonlight (KS91 eqs. 8, 9, 21 with the
 * opposition effect) + min(twilight, daylight) (`twilightNl`: Patat et al. 2006 depression law, Schaefer 1998 distribution and daylight), in nL and V mag/arcsec²
 * (Garstang 1986 units). The brightening by the Moon in magnitudes (KS91 eq. 22) is
 * −2.5 log10((darkNl + moonNl) / darkNl).
 */
export function skyBrightness(input: SkyBrightnessInput): SkyBrightness {
  const { target, sun, moon, kV } = input;
  const darkNl = darkSkyNl(input.darkSkyZenithNl, kV, target.altitudeDeg);
  const moonNl = moonlightNl({
    targetAltitudeDeg: target.altitudeDeg,
    moonSeparationDeg: target.moonSeparationDeg,
    moonAltitudeDeg: moon.altitudeDeg,
    moonPhaseAngleDeg: moon.phaseAngleDeg,
    kV,
  });
  const twiNl = twilightNl({
    targetAltitudeDeg: target.altitudeDeg,
    sunSeparationDeg: target.sunSeparationDeg,
    sunAltitudeDeg: sun.altitudeDeg,
    ...(sun.geometricAltitudeDeg === undefined ? {} : { sunGeometricAltitudeDeg: sun.geometricAltitudeDeg }),
    kV,
  });
  const totalNl = darkNl + moonNl + twiNl;
  return { totalNl, magPerArcsec2: nlToMagPerArcsec2(totalNl), darkNl, moonNl, twilightNl: twiNl };
}
