/**
 * Type declarations for the parts of `astronomia` 4.2 (npm; Meeus, Astronomical Algorithms 2nd
 * ed., implemented by Sonia Keys and commenthol) used by the almanac tests. The package ships no
 * types. Every function takes a decimal year and returns the event NEAREST to it, as a Julian
 * Ephemeris Day (TT). Angles are radians.
 */
declare module 'astronomia/moonphase' {
  /** Meeus ch. 49. */
  export function newMoon(year: number): number;
  export function first(year: number): number;
  export function full(year: number): number;
  export function last(year: number): number;
}
declare module 'astronomia/solstice' {
  /** Meeus ch. 27 (tables 27.A/B/C); within a minute for 1951–2050. Takes an integer year. */
  export function march(year: number): number;
  export function june(year: number): number;
  export function september(year: number): number;
  export function december(year: number): number;
}
declare module 'astronomia/eclipse' {
  /** Meeus ch. 54. Types: 0 none, 4 penumbral, 5 umbral (partial), 6 total. */
  export const TYPE: { None: 0; Partial: 1; Annular: 2; AnnularTotal: 3; Penumbral: 4; Umbral: 5; Total: 6 };
  export function lunar(year: number): {
    type: number;
    jdeMax?: number;
    magnitude?: number;
    /** Semi-durations, days. */
    sdTotal?: number;
    sdPartial?: number;
    sdPenumbral?: number;
  };
  export function solar(year: number): { type: number; central?: boolean; jdeMax?: number; magnitude?: number };
}
declare module 'astronomia/planetary' {
  /** Meeus ch. 36 (periodic terms of table 36.A). */
  export function marsOpp(year: number): number;
  export function jupiterOpp(year: number): number;
  export function saturnOpp(year: number): number;
  export function uranusOpp(year: number): number;
  export function neptuneOpp(year: number): number;
  export function mercuryInfConj(year: number): number;
  export function venusInfConj(year: number): number;
  export function saturnConj(year: number): number;
  /** [jde, elongation in radians]. */
  export function mercuryEastElongation(year: number): [number, number];
  export function mercuryWestElongation(year: number): [number, number];
  export function marsStation2(year: number): number;
}
declare module 'astronomia/apsis' {
  /** Meeus ch. 50. */
  export function perigee(year: number): number;
  export function apogee(year: number): number;
}
