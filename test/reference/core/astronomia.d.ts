/**
 * Minimal type declarations for the parts of `astronomia` 4.2 (npm; Sonia Keys and commenthol's
 * implementation of Meeus, *Astronomical Algorithms*) that the core reference tests use.
 * The package ships no types. Angles are radians unless stated.
 */
declare module 'astronomia/planetposition' {
  export interface EclipticCoord { lon: number; lat: number; range: number }
  export class Planet {
    constructor(data: unknown);
    name: string;
    /** Heliocentric ecliptic position, equinox and ecliptic of date (VSOP87B precessed), AU. */
    position(jde: number): EclipticCoord;
    /** Heliocentric ecliptic position, dynamical equinox and ecliptic J2000, AU. */
    position2000(jde: number): EclipticCoord;
  }
  export function toFK5(lon: number, lat: number, jde: number): { lon: number; lat: number };
}
declare module 'astronomia/data' {
  const data: Record<string, unknown>;
  export default data;
}
declare module 'astronomia/elliptic' {
  import type { Planet } from 'astronomia/planetposition';
  /** Apparent geocentric RA/Dec of a planet, true equator of date (Meeus ch. 33). */
  export function position(planet: Planet, earth: Planet, jde: number): { ra: number; dec: number };
}
declare module 'astronomia/solar' {
  import type { Planet } from 'astronomia/planetposition';
  /** Apparent geocentric RA/Dec of the Sun from VSOP87 (Meeus ch. 25), range in AU. */
  export function apparentEquatorialVSOP87(earth: Planet, jde: number): { ra: number; dec: number; range: number };
  /** True geometric longitude of the Sun referred to the J2000 ecliptic, radians (Meeus ch. 25, low precision); T in Julian centuries from J2000. */
  export function true2000(T: number): { lon: number; ano: number };
  /** The Sun's distance, AU (Meeus eq. 25.5). */
  export function radius(T: number): number;
}
declare module 'astronomia/moonposition' {
  /** Geocentric ecliptic position of the Moon, mean equinox of date, no nutation (Meeus ch. 47); range in km. */
  export function position(jde: number): { lon: number; lat: number; range: number };
  /** Equatorial horizontal parallax for a distance in km. */
  export function parallax(distanceKm: number): number;
}
declare module 'astronomia/nutation' {
  /** [Δψ, Δε] in radians (Meeus ch. 22). */
  export function nutation(jde: number): [number, number];
  export function meanObliquity(jde: number): number;
}
declare module 'astronomia/coord' {
  export class Ecliptic {
    constructor(lon: number, lat: number);
    lon: number;
    lat: number;
    toEquatorial(obliquity: number): { ra: number; dec: number };
  }
  export class Equatorial {
    constructor(ra: number, dec: number);
    ra: number;
    dec: number;
  }
}
declare module 'astronomia/sidereal' {
  /** Mean sidereal time at Greenwich, seconds of time 0–86400 (IAU 1982, Meeus 12.4). */
  export function mean(jdUt: number): number;
  /** Apparent sidereal time at Greenwich, seconds of time 0–86400. */
  export function apparent(jdUt: number): number;
}
declare module 'astronomia/globe' {
  export class Ellipsoid {
    constructor(radiusKm: number, flattening: number);
    /** [ρ sin φ′, ρ cos φ′] for geodetic latitude φ (radians) and height h (metres). */
    parallaxConstants(latitudeRad: number, heightM: number): [number, number];
  }
}
declare module 'astronomia/parallax' {
  /**
   * Topocentric RA/Dec from geocentric (Meeus 40.2, 40.3). `c.range` in AU; longitude positive WEST;
   * the last argument is only used for the apparent sidereal time, so pass JD in UT.
   */
  export function topocentric(
    c: { ra: number; dec: number; range: number },
    rhoSinPhi: number,
    rhoCosPhi: number,
    longitudeWestRad: number,
    jdUt: number,
  ): { ra: number; dec: number };
}
declare module 'astronomia/illum' {
  /** Phase angle from r, Δ, R (AU), radians (Meeus 41.1). */
  export function phaseAngle(r: number, delta: number, R: number): number;
  export function fraction(r: number, delta: number, R: number): number;
  export function mercury84(r: number, delta: number, i: number): number;
  export function venus84(r: number, delta: number, i: number): number;
  export function mars84(r: number, delta: number, i: number): number;
  export function jupiter84(r: number, delta: number, i: number): number;
  export function saturn84(r: number, delta: number, B: number, dU: number): number;
  export function uranus84(r: number, delta: number): number;
  export function neptune84(r: number, delta: number): number;
  export function saturn(r: number, delta: number, B: number, dU: number): number;
}
declare module 'astronomia/saturnring' {
  import type { Planet } from 'astronomia/planetposition';
  /** [ΔU, B] in radians (Meeus ch. 45). */
  export function ub(jde: number, earth: Planet, saturn: Planet): [number, number];
  /** [B, B′, ΔU, P, aEdge, bEdge]: Saturnicentric latitudes of the Earth (B) and the Sun (B′) on the ring plane, radians (Meeus ch. 45). */
  export function ring(jde: number, earth: Planet, saturn: Planet): [number, number, number, number, number, number];
}
declare module 'astronomia/precess' {
  import type { Equatorial } from 'astronomia/coord';
  /** Rigorous precession of equatorial coordinates between Julian epochs (Meeus 21.2–21.4). */
  export function position(eq: Equatorial, epochFrom: number, epochTo: number, mRa: number, mDec: number): Equatorial;
}
declare module 'astronomia/deltat' {
  /** ΔT = TD − UT, seconds, for a decimal year. */
  export function deltaT(decimalYear: number): number;
}

declare module 'astronomia/apparent' {
  /** Ron–Vondrák annual aberration for a J2000 (α, δ) in radians at Julian day `jd`: [Δα, Δδ] in radians. */
  export function aberrationRonVondrak(ra: number, dec: number, jd: number): [number, number];
}
