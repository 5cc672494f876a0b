/**
 * Tracks: a body's path across one night's sky, for fast searches. The exact topocentric
 * apparent position (`observe.ts`) is computed at hourly nodes and interpolated with cubic
 * Lagrange polynomials; horizontal coordinates then follow from the local sidereal time, which
 * is linear in UT over a night. Interpolation error is below 1″ for planets and about 1″ for
 * the Moon (checked against `observe` in the tests), far below the 1′ target.
 */
import * as Astronomy from 'astronomy-engine';
import type { Body } from './body.ts';
import { builtInBody } from './body.ts';
import { KM_PER_AU, topocentricOfDate } from './observe.ts';
import type { Site } from './site.ts';
import type { Night } from './time.ts';

const RAD = Math.PI / 180;
/** Sidereal hours per UT day (IAU 1982 GMST rate, Meeus eq. 12.4 derivative). */
const SIDEREAL_HOURS_PER_DAY = 24.065709824419;
const NODE_STEP_DAYS = 1 / 24;
const MARGIN_DAYS = 3 / 24;

/** A body's place in the sky at one instant, as seen from the site. */
export interface SkyPoint {
  /** Geometric (airless) altitude of the centre, degrees. */
  geometricAltitudeDeg: number;
  /** Azimuth from north through east, degrees 0–360. */
  azimuthDeg: number;
  /** Hour angle, hours, −12…12 (negative east of the meridian). */
  hourAngleHours: number;
  /** Topocentric distance, AU. */
  distanceAu: number;
}

/** Angle between two vectors, degrees (atan2 form: accurate at 0° and 180°). */
export function separationDeg(a: readonly [number, number, number], b: readonly [number, number, number]): number {
  const dot = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const cross = Math.hypot(a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]);
  return Math.atan2(cross, dot) / RAD;
}

/** Converts a `Date` to `astronomy-engine` UT days. */
export function utDays(date: Date): number {
  return Astronomy.MakeTime(date).ut;
}

/** Converts `astronomy-engine` UT days to a `Date`. */
export function dateFromUt(ut: number): Date {
  return new Date(Math.round(Date.UTC(2000, 0, 1, 12) + ut * 86_400_000));
}

/** The shared frame of one site-night: sidereal time and the precession–nutation rotation. */
export class NightFrame {
  readonly site: Site;
  readonly night: Night;
  /** UT days of the night's start and end (local noon to local noon). */
  readonly ut0: number;
  readonly ut1: number;
  readonly #lst0Hours: number;
  readonly #rotation: Astronomy.RotationMatrix;
  readonly #sinLat: number;
  readonly #cosLat: number;
  readonly #tracks = new Map<string, Track>();

  constructor(site: Site, night: Night) {
    this.site = site;
    this.night = night;
    this.ut0 = utDays(night.start);
    this.ut1 = utDays(night.end);
    const t0 = Astronomy.MakeTime(night.start);
    // Apparent sidereal time at the start; over one night the equation of the equinoxes changes by < 1 ms.
    this.#lst0Hours = Astronomy.SiderealTime(t0) + site.longitudeDeg / 15;
    this.#rotation = Astronomy.Rotation_EQJ_EQD(Astronomy.MakeTime(dateFromUt((this.ut0 + this.ut1) / 2)));
    this.#sinLat = Math.sin(site.latitudeDeg * RAD);
    this.#cosLat = Math.cos(site.latitudeDeg * RAD);
  }

  /** Local apparent sidereal time at `ut`, hours (not reduced to 0–24). */
  lstHours(ut: number): number {
    return this.#lst0Hours + SIDEREAL_HOURS_PER_DAY * (ut - this.ut0);
  }

  /** The body's track for this night (built once, then shared). */
  track(body: Body): Track {
    let t = this.#tracks.get(body.id);
    if (!t) {
      t = new Track(this, body, this.#rotation);
      this.#tracks.set(body.id, t);
    }
    return t;
  }

  /** The Sun's track. */
  get sun(): Track {
    return this.track(builtInBody('sun'));
  }

  /** The Moon's track. */
  get moon(): Track {
    return this.track(builtInBody('moon'));
  }

  /** Horizontal coordinates of a topocentric equator-of-date vector at `ut`. */
  horizontalOf(x: number, y: number, z: number, ut: number): SkyPoint {
    const theta = (this.lstHours(ut) * 15) * RAD;
    const c = Math.cos(theta);
    const s = Math.sin(theta);
    const r = Math.hypot(x, y, z);
    const cosDecCosH = (x * c + y * s) / r;
    const cosDecSinH = (x * s - y * c) / r;
    const sinDec = z / r;
    const sinAlt = this.#sinLat * sinDec + this.#cosLat * cosDecCosH;
    let az = Math.atan2(-cosDecSinH, this.#cosLat * sinDec - this.#sinLat * cosDecCosH) / RAD;
    if (az < 0) az += 360;
    return {
      geometricAltitudeDeg: Math.asin(Math.max(-1, Math.min(1, sinAlt))) / RAD,
      azimuthDeg: az,
      hourAngleHours: Math.atan2(cosDecSinH, cosDecCosH) / RAD / 15,
      distanceAu: r,
    };
  }
}

/** One body's interpolated path over a night (plus a margin either side). */
export class Track {
  readonly body: Body;
  readonly frame: NightFrame;
  readonly #start: number;
  readonly #x: Float64Array;
  readonly #y: Float64Array;
  readonly #z: Float64Array;

  constructor(frame: NightFrame, body: Body, rotation: Astronomy.RotationMatrix) {
    this.frame = frame;
    this.body = body;
    this.#start = frame.ut0 - MARGIN_DAYS;
    const n = Math.ceil((frame.ut1 + MARGIN_DAYS - this.#start) / NODE_STEP_DAYS) + 1;
    this.#x = new Float64Array(n);
    this.#y = new Float64Array(n);
    this.#z = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const time = Astronomy.MakeTime(dateFromUt(this.#start + i * NODE_STEP_DAYS));
      const v = topocentricOfDate(frame.site, body, time, rotation);
      this.#x[i] = v.x;
      this.#y[i] = v.y;
      this.#z[i] = v.z;
    }
  }

  /** Topocentric apparent vector (equator of date, AU) at `ut`, by 4-point Lagrange interpolation. */
  vectorAt(ut: number): [number, number, number] {
    const n = this.#x.length;
    const u = (ut - this.#start) / NODE_STEP_DAYS;
    const i0 = Math.min(Math.max(Math.floor(u) - 1, 0), n - 4);
    const p = u - i0; // position relative to node i0, typically in [1, 2)
    // Lagrange weights for nodes at 0, 1, 2, 3.
    const w0 = (-(p - 1) * (p - 2) * (p - 3)) / 6;
    const w1 = (p * (p - 2) * (p - 3)) / 2;
    const w2 = (-p * (p - 1) * (p - 3)) / 2;
    const w3 = (p * (p - 1) * (p - 2)) / 6;
    const x = this.#x, y = this.#y, z = this.#z;
    return [
      w0 * x[i0]! + w1 * x[i0 + 1]! + w2 * x[i0 + 2]! + w3 * x[i0 + 3]!,
      w0 * y[i0]! + w1 * y[i0 + 1]! + w2 * y[i0 + 2]! + w3 * y[i0 + 3]!,
      w0 * z[i0]! + w1 * z[i0 + 1]! + w2 * z[i0 + 2]! + w3 * z[i0 + 3]!,
    ];
  }

  /** Where the body is in the site's sky at `ut`. */
  at(ut: number): SkyPoint {
    const [x, y, z] = this.vectorAt(ut);
    return this.frame.horizontalOf(x, y, z, ut);
  }

  /** Apparent altitude of the centre at `ut` with standard refraction (10 °C, 1010 hPa), degrees. */
  apparentAltitudeDeg(ut: number): number {
    const geometric = this.at(ut).geometricAltitudeDeg;
    return geometric + Astronomy.Refraction('normal', geometric);
  }

  /** Apparent semidiameter at `ut`, degrees. */
  semidiameterDeg(ut: number): number {
    const [x, y, z] = this.vectorAt(ut);
    return Math.asin(Math.min(1, this.body.radiusKm / (Math.hypot(x, y, z) * KM_PER_AU))) / RAD;
  }
}
