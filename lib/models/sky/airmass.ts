/**
 * Airmass: the path length through the atmosphere towards a direction, relative to the zenith.
 *
 * Every function here takes the APPARENT (refracted) altitude in degrees, 0 at the horizon,
 * 90 at the zenith, and returns a dimensionless airmass. They are pure, allocation-free and
 * cheap enough for the inner loop of a night-long search.
 *
 * Below the apparent horizon (altitudeDeg < 0) no light path is modelled. The functions then
 * return a fixed, documented value: `airmassKastenYoung` returns `Infinity` (an object below the
 * horizon is not seen: `k · X` is infinite, a visibility margin is −∞); the two airmasses used
 * only inside the sky-glow models (`airmassRozenberg`, `airmassScattering`) return their horizon
 * value, as Schaefer's published program does for a Sun or Moon below the horizon (X = 40).
 * Altitudes above 90° are treated as 90°. NaN propagates.
 */

const DEG = Math.PI / 180;

/**
 * Kasten & Young (1989) relative optical airmass, valid down to the horizon:
 * X = 1 / (cos z + 0.50572 (96.07995° − z)^−1.6364), z = 90° − h apparent zenith distance in degrees.
 *
 * Source: Kasten F., Young A.T. 1989, "Revised optical air mass tables and approximation formula",
 * Applied Optics 28(22):4735–4738, doi:10.1364/AO.28.004735. Gives 0.9997 at the zenith and
 * 37.92 at the horizon.
 *
 * @param altitudeDeg apparent altitude, degrees.
 * @returns airmass (dimensionless); `Infinity` below the horizon.
 */
export function airmassKastenYoung(altitudeDeg: number): number {
  if (altitudeDeg < 0) return Infinity;
  const zDeg = altitudeDeg >= 90 ? 0 : 90 - altitudeDeg;
  return 1 / (Math.cos(zDeg * DEG) + 0.50572 * Math.pow(96.07995 - zDeg, -1.6364));
}

/**
 * Rozenberg (1966) airmass: X = 1 / (cos z + 0.025 e^(−11 cos z)); X = 40 at the horizon.
 *
 * Source: Rozenberg G.V. 1966, *Twilight: A Study in Atmospheric Optics*, Plenum Press. Used by
 * Green (1992, Int. Comet Q. 14:55) for his extinction tables and by Schaefer (1998, Sky &
 * Telescope 95(5):57, program VISLIMIT) for sky brightness, so models built on their constants use it.
 *
 * @param altitudeDeg apparent altitude, degrees.
 * @returns airmass (dimensionless); 40 (the horizon value) for altitudes below the horizon.
 */
export function airmassRozenberg(altitudeDeg: number): number {
  if (altitudeDeg <= 0) return 40;
  const cosZ = altitudeDeg >= 90 ? 1 : Math.sin(altitudeDeg * DEG);
  return 1 / (cosZ + 0.025 * Math.exp(-11 * cosZ));
}

/**
 * Krisciunas & Schaefer (1991) airmass for scattered light (sky glow), their eq. 3:
 * X = (1 − 0.96 sin² z)^−½, which reaches 5 at the horizon. For the brightness of the sky,
 * not for the extinction of a star.
 *
 * Source: Krisciunas K., Schaefer B.E. 1991, "A model of the brightness of moonlight",
 * PASP 103:1033–1039, eq. 3.
 *
 * @param altitudeDeg apparent altitude, degrees.
 * @returns airmass (dimensionless), 1 to 5; 5 (the horizon value) below the horizon.
 */
export function airmassScattering(altitudeDeg: number): number {
  if (altitudeDeg <= 0) return 5;
  const cosZ = altitudeDeg >= 90 ? 1 : Math.sin(altitudeDeg * DEG);
  // sin² z = 1 − cos² z
  return 1 / Math.sqrt(1 - 0.96 * (1 - cosZ * cosZ));
}
