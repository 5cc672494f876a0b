/**
 * Observe: where a body is in a site's sky at one instant. This is the exact, per-instant path
 * of the pipeline (site → time → body → observe → describe); `lib/core/track.ts` interpolates the same
 * quantities across a night for event searches and is tested against this module.
 *
 * Frames: `raHours`/`decDeg` are topocentric apparent coordinates on the true equator and
 * equinox of date (precession and nutation applied, light time and aberration corrected);
 * `raJ2000Hours`/`decJ2000Deg` are geocentric astrometric coordinates on the J2000 mean equator
 * (the star catalogue's frame). Altitude and azimuth are topocentric; azimuth runs from north
 * through east, 0–360°.
 */
import * as Astronomy from 'astronomy-engine';
import type { Body, MagnitudeEstimate } from './body.ts';
import { builtInBody } from './body.ts';
import { Horizon, apparentAltitudeDeg, localSiderealHours, separationDeg, unitFromRaDec } from './geometry.ts';
import type { Site } from './site.ts';

const RAD = Math.PI / 180;

/** Standard refraction at the horizon used for rise and set, degrees (34′; USNO and Meeus ch. 15). */
export const HORIZON_REFRACTION_DEG = 34 / 60;
/** Kilometres per astronomical unit (IAU 2012 exact value). */
export const KM_PER_AU = 149_597_870.7;

export type Instant = Date | Astronomy.AstroTime;

/** An `astronomy-engine` time for a `Date` or an existing `AstroTime`. */
export function astroTime(instant: Instant): Astronomy.AstroTime {
  return instant instanceof Astronomy.AstroTime ? instant : Astronomy.MakeTime(instant);
}

export interface Observation {
  body: Body;
  time: Astronomy.AstroTime;
  /** Topocentric apparent right ascension, equator of date, hours 0–24. */
  raHours: number;
  /** Topocentric apparent declination, equator of date, degrees. */
  decDeg: number;
  /** Geocentric astrometric right ascension, J2000 equator, hours 0–24. */
  raJ2000Hours: number;
  /** Geocentric astrometric declination, J2000 equator, degrees. */
  decJ2000Deg: number;
  /** Apparent altitude of the centre with standard refraction (10 °C, 1010 hPa), degrees. */
  altitudeDeg: number;
  /** Geometric (airless) altitude of the centre, degrees. */
  geometricAltitudeDeg: number;
  /** Azimuth from north through east, degrees 0–360. */
  azimuthDeg: number;
  /** Observer–body distance, AU. */
  distanceAu: number;
  /** Earth centre–body distance (Δ), AU. */
  geocentricDistanceAu: number;
  /** Sun–body distance (r), AU; 0 for the Sun. */
  heliocentricDistanceAu: number;
  /** Geocentric angle between the body and the Sun, degrees. */
  elongationDeg: number;
  /** Sun–body–Earth angle, degrees. */
  phaseAngleDeg: number;
  /** Lit fraction of the disc, 0–1. */
  illuminatedFraction: number;
  magnitude: MagnitudeEstimate;
  /** Angular semidiameter seen from the site, degrees. */
  semidiameterDeg: number;
  /** IAU constellation abbreviation (three letters), from the J2000 position (Roman 1987 boundaries). */
  constellation: string;
}

/** The unit vector (or any vector) as right ascension in hours and declination in degrees. */
export function vectorToRaDec(x: number, y: number, z: number): { raHours: number; decDeg: number; length: number } {
  const length = Math.hypot(x, y, z);
  let ra = Math.atan2(y, x) / RAD / 15;
  if (ra < 0) ra += 24;
  return { raHours: ra, decDeg: Math.asin(z / length) / RAD, length };
}

/**
 * Topocentric apparent position of `body` for `site` at `time`: the vector on the equator of date
 * in AU. Geocentric vector from the body (light time and aberration), minus the observer's
 * geocentric vector (WGS 84 ellipsoid, from `astronomy-engine`), rotated by precession and nutation.
 */
export function topocentricOfDate(site: Site, body: Body, time: Astronomy.AstroTime, rotation = Astronomy.Rotation_EQJ_EQD(time)): Astronomy.Vector {
  const geo = body.geoVector(time, { aberration: true });
  const obs = Astronomy.ObserverVector(time, site.observer, false);
  const topo = new Astronomy.Vector(geo.x - obs.x, geo.y - obs.y, geo.z - obs.z, time);
  return Astronomy.RotateVector(rotation, topo);
}

/** Where `body` is in the sky of `site` at `instant`, with distances, phase and magnitude. */
export function observe(site: Site, body: Body, instant: Instant): Observation {
  const time = astroTime(instant);
  const topo = topocentricOfDate(site, body, time);
  const eq = vectorToRaDec(topo.x, topo.y, topo.z);
  const astrometric = body.geoVector(time, { aberration: false });
  const j2000 = vectorToRaDec(astrometric.x, astrometric.y, astrometric.z);
  const hor = new Horizon(site.latitudeDeg).ofDate(topo.x, topo.y, topo.z, localSiderealHours(time, site.longitudeDeg));
  const illum = body.illumination(time);
  const sun = body.kind === 'sun' ? null : builtInBody('sun').geoVector(time, { aberration: true });
  const apparent = body.geoVector(time, { aberration: true });
  return {
    body,
    time,
    raHours: eq.raHours,
    decDeg: eq.decDeg,
    raJ2000Hours: j2000.raHours,
    decJ2000Deg: j2000.decDeg,
    altitudeDeg: apparentAltitudeDeg(hor.geometricAltitudeDeg),
    geometricAltitudeDeg: hor.geometricAltitudeDeg,
    azimuthDeg: hor.azimuthDeg,
    distanceAu: eq.length,
    geocentricDistanceAu: illum.geocentricDistanceAu,
    heliocentricDistanceAu: illum.heliocentricDistanceAu,
    elongationDeg: sun ? separationDeg([apparent.x, apparent.y, apparent.z], [sun.x, sun.y, sun.z]) : 0,
    phaseAngleDeg: illum.phaseAngleDeg,
    illuminatedFraction: illum.illuminatedFraction,
    magnitude: illum.magnitude,
    semidiameterDeg: Math.asin(Math.min(1, body.radiusKm / (eq.length * KM_PER_AU))) / RAD,
    constellation: Astronomy.Constellation(j2000.raHours, j2000.decDeg).symbol,
  };
}

/**
 * Horizontal coordinates from apparent equatorial coordinates of date, for a site at `time`
 * (`Horizon` of geometry.ts at the local apparent sidereal time; standard refraction when asked).
 */
export function horizontal(site: Site, time: Astronomy.AstroTime, raHours: number, decDeg: number, options: { refraction: boolean }): { altitudeDeg: number; azimuthDeg: number } {
  const [x, y, z] = unitFromRaDec(raHours * 15, decDeg);
  const hor = new Horizon(site.latitudeDeg).ofDate(x, y, z, localSiderealHours(time, site.longitudeDeg));
  return { altitudeDeg: options.refraction ? apparentAltitudeDeg(hor.geometricAltitudeDeg) : hor.geometricAltitudeDeg, azimuthDeg: hor.azimuthDeg };
}
