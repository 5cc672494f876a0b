/**
 * Instants of a variable star's predicted minima, from its ephemeris.
 *
 * Ephemerides are in heliocentric Julian dates: the time the light would reach the Sun. The light
 * reaches the Earth earlier or later by the light time along the Earth's heliocentric position
 * projected on the direction of the star (up to 499 s, the light time for 1 AU):
 *
 *   HJD = JD + (r⊕ · ŝ) / c
 *
 * with r⊕ the Earth's heliocentric position (AU, J2000 equator; astronomy-engine) and ŝ the unit
 * vector towards the star (J2000, from the bright-star table); c = 173.1446 AU/day (IAU 2012,
 * 1 AU / 499.004784 s). HJD and JD are both on the UT scale here, as the GCVS gives its epochs
 * (the difference TT − UT, about 69 s, is below the ephemerides' own uncertainty).
 */
import * as Astronomy from 'astronomy-engine';
import { starByHip } from '../stars/catalogue.ts';
import type { VariableStar } from './catalogue.ts';

/** The speed of light, AU per day (IAU 2012: 1 AU = 149 597 870 700 m; c = 299 792 458 m/s). */
export const LIGHT_AU_PER_DAY = (299_792_458 * 86_400) / 149_597_870_700;
const RAD = Math.PI / 180;
/** Julian date of the Unix epoch. */
const JD_UNIX = 2_440_587.5;

/** The J2000 unit vector towards the star of the bright-star table with Hipparcos number `hip`. */
function starDirection(hip: number): [number, number, number] {
  const star = starByHip(hip);
  if (!star) throw new Error(`variable star HIP ${hip} is not in the bright-star table`);
  const a = star.raDeg * RAD, d = star.decDeg * RAD;
  return [Math.cos(d) * Math.cos(a), Math.cos(d) * Math.sin(a), Math.sin(d)];
}

/** Light-time correction HJD − JD at `date` for a star in direction `s` (J2000 unit vector), days. */
export function heliocentricCorrectionDays(date: Date, s: readonly [number, number, number]): number {
  const e = Astronomy.HelioVector(Astronomy.Body.Earth, Astronomy.MakeTime(date));
  return (e.x * s[0] + e.y * s[1] + e.z * s[2]) / LIGHT_AU_PER_DAY;
}

function dateOfJd(jd: number): Date {
  return new Date((jd - JD_UNIX) * 86_400_000);
}

/**
 * The predicted primary minima of an eclipsing binary with instants in [from, to), in time order,
 * as seen from the Earth (UT). Each is Min I = T₀ + P·E (HJD) less the light-time correction at
 * that moment (found by fixed-point iteration: the correction changes by < 0.02 s per minute).
 */
export function primaryMinima(star: VariableStar, from: Date, to: Date): Date[] {
  const s = starDirection(star.hip);
  const jd = (d: Date): number => d.getTime() / 86_400_000 + JD_UNIX;
  // The light-time correction is at most 0.006 days: widen the cycle range by one either side.
  const first = Math.ceil((jd(from) - star.epochHjd) / star.periodDays) - 1;
  const last = Math.floor((jd(to) - star.epochHjd) / star.periodDays) + 1;
  const out: Date[] = [];
  for (let e = first; e <= last; e++) {
    const hjd = star.epochHjd + star.periodDays * e;
    let t = dateOfJd(hjd);
    for (let i = 0; i < 3; i++) t = dateOfJd(hjd - heliocentricCorrectionDays(t, s));
    if (t >= from && t < to) out.push(t);
  }
  return out;
}
