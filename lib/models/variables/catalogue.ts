/**
 * Variable stars with published ephemerides: the stars whose changes a bulletin can predict.
 *
 * An eclipsing binary is given by a linear ephemeris of its primary minimum, Min I = T₀ + P·E,
 * with T₀ a heliocentric Julian date (UT based, as the General Catalogue of Variable Stars gives
 * it) and P the period in days, its magnitude range and the length of the eclipse. Other kinds of
 * variable (long-period variables with an ephemeris of maximum, Cepheids) join as further members
 * of `VariableStar` with their own `kind`; each kind has one function in `minima.ts` turning its
 * ephemeris into instants.
 *
 * Add a star by adding an entry: its Hipparcos number must be in the bright-star table
 * (lib/stars/catalogue.ts), which gives its position.
 */

/** An eclipsing binary with a linear ephemeris of its primary minimum. */
export interface EclipsingBinary {
  kind: 'eclipsing';
  /** Stable id (events' `bodies` hold `variable:<id>`). */
  id: string;
  name: string;
  /** Hipparcos number of the star in the bright-star table (its position). */
  hip: number;
  /** Heliocentric Julian date (UT) of a primary minimum, days. */
  epochHjd: number;
  /** Period, days. */
  periodDays: number;
  /** V magnitude outside eclipse and at primary minimum. */
  maxMagnitude: number;
  minMagnitude: number;
  /** Length of the primary eclipse, first to last contact, hours. */
  eclipseHours: number;
  /** Where the ephemeris and range come from. */
  source: string;
  /** How far a predicted minimum may be from the observed one, minutes (period changes, light time in the system). */
  uncertaintyMinutes: number;
}

export type VariableStar = EclipsingBinary;

/**
 * Algol (β Persei). Ephemeris: Min I = HJD 2445641.5135 + 2.8673043·E, General Catalogue of
 * Variable Stars (Samus et al., GCVS 5.1, 2017); the period 2.867 3043 d as in Ridpath (ed.),
 * *A Dictionary of Astronomy* (Oxford), the epoch from memory of the GCVS entry. Range V 2.09–3.30
 * (GCVS, from memory), eclipse about 9.6 hours (GCVS D = 0.14 of the period, from memory). Algol's
 * period wanders (mass transfer, and light time across the orbit of Algol C, ±4.5 minutes over
 * 1.86 years), so predicted minima can be off by a quarter of an hour or more: pages say "around".
 */
export const ALGOL: EclipsingBinary = {
  kind: 'eclipsing',
  id: 'algol',
  name: 'Algol',
  hip: 14576,
  epochHjd: 2445641.5135,
  periodDays: 2.8673043,
  maxMagnitude: 2.1,
  minMagnitude: 3.3,
  eclipseHours: 9.6,
  source: 'GCVS (Samus et al. 2017): Min I = HJD 2445641.5135 + 2.8673043 E',
  uncertaintyMinutes: 30,
};

/** Every variable star the almanac predicts. */
export const VARIABLE_STARS: readonly VariableStar[] = [ALGOL];
