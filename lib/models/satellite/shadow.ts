/**
 * Earth's shadow at a satellite: how much of the Sun's disc the satellite sees.
 *
 * Model: a spherical Earth (equatorial radius 6378.135 km, as SGP4's WGS-72 constants) and the
 * Sun's true disc, so the shadow is the conical umbra with its penumbra: the lit fraction is the
 * part of the Sun's disc not covered by the Earth's disc as seen from the satellite
 * (`satellite.js` `shadowFraction`, the overlap of two discs). The atmosphere, which widens the
 * shadow by about 1–2 % and reddens it, and the Earth's flattening (up to 21 km at the poles,
 * about 3 s of a low orbit's shadow entry) are ignored. A satellite is reported as entering or
 * leaving the shadow when half of the Sun's disc is covered; the penumbra of a low orbit lasts
 * about 8–10 s.
 */
import { shadowFraction } from 'satellite.js';
import type { Vec3 } from './propagate.ts';

/**
 * Fraction of the Sun's disc visible from the satellite: 1 in full sunlight, 0 in the umbra.
 *
 * @param positionKm satellite, geocentric, km (TEME, or any equatorial frame of date)
 * @param sunAu the Sun, geocentric, AU, same frame
 */
export function sunlitFraction(positionKm: Vec3, sunAu: Vec3): number {
  return 1 - shadowFraction({ x: sunAu[0], y: sunAu[1], z: sunAu[2] }, { x: positionKm[0], y: positionKm[1], z: positionKm[2] });
}
