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
 * Twilight and daylight at a target, nL, from Schaefer's model (Schaefer 1998, "To the Visual
 * Limits", Sky & Telescope 95(5):57, VISLIMIT.BAS, V band), using Rozenberg airmasses as the program does:
 * - twilight B_T = 10^(−0.4 (m_sun − m_O + 32.5 − h_sun − z/(360 k))) · (100/ρ_sun) · (1 − 10^(−0.4 k X))
 * - daylight B_D = 10^(−0.4 (m_sun − m_O + 43.27)) (1 − 10^(−0.4 k X)) (f(ρ_sun) C + 440000 (1 − C)),
 *   C = 10^(−0.4 k X_sun), X_sun = 40 with the Sun below the horizon, f the KS91 scattering function;
 * and returns min(B_D, B_T), as the program adds the smaller of the two to the night sky: B_T
 * grows without bound as the Sun rises, B_D is the real daylight then, and with the Sun deep
 * below the horizon B_T is the (small) twilight. In units: B_nL = B / 1.11·10⁻¹⁵, m_O = −11.05, m_sun = −26.74.
 * ρ_sun is clamped to ≥ 1°.
 *
 * @returns nL (≥ 0).
 */
export function twilightNl(input: {
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
  const c = pow10(-0.4 * k * airmassRozenberg(hSun));
  const daylight =
    pow10(-0.4 * (SUN_V - MO_V + 43.27)) * scatter * (scatteringFunctionKs91(rho) * c + 440000 * (1 - c));
  return (twilight < daylight ? twilight : daylight) * VISLIMIT_UNIT_NL;
}

/**
 * Sky brightness at a target: dark sky (KS91 eqs. 2–3) + moonlight (KS91 eqs. 8, 9, 21 with the
 * opposition effect) + min(twilight, daylight) (Schaefer 1998), in nL and V mag/arcsec²
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
    kV,
  });
  const totalNl = darkNl + moonNl + twiNl;
  return { totalNl, magPerArcsec2: nlToMagPerArcsec2(totalNl), darkNl, moonNl, twilightNl: twiNl };
}
