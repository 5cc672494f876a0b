/**
 * Where a satellite is: SGP4/SDP4 (Hoots & Roehrich 1980, Spacetrack Report #3, as revised by
 * Vallado, Crawford, Hujsak & Kelso 2006, AIAA 2006-6753) through `satellite.js`, then the
 * satellite as seen from a site.
 *
 * Frames: SGP4 gives positions in TEME (true equator, mean equinox of date), km. The site's
 * position comes from its geodetic latitude, longitude and height (WGS 84 ellipsoid) rotated by
 * the Greenwich mean sidereal time (IAU 1982, as SGP4's own convention); polar motion is
 * ignored (< 15 m). TEME differs from the true equator and equinox of date used for the Sun and
 * Moon elsewhere in gloaming by the equation of the equinoxes (≤ 1.2 s of rotation, ≤ 18″),
 * far below anything a pass prediction shows.
 *
 * Time is `astronomy-engine` UT days (days from 2000-01-01 12:00 UT), as in `lib/core/search.ts`.
 */
import * as Astronomy from 'astronomy-engine';
import { ecfToEci, geodeticToEcf, gstime, sgp4, type EciVec3, type GeodeticLocation } from 'satellite.js';
import type { Site } from '../../core/site.ts';
import type { ElementSet } from './elements.ts';

const RAD = Math.PI / 180;
/** Julian date of `astronomy-engine`'s UT day 0 (2000-01-01 12:00). */
const JD_J2000 = 2_451_545.0;
const UNIX_MS_AT_UT0 = Date.UTC(2000, 0, 1, 12);

export type Vec3 = [number, number, number];

/** Position and velocity in TEME. */
export interface TemeState {
  /** km */
  positionKm: Vec3;
  /** km/s */
  velocityKmS: Vec3;
}

/** UT days of the element set's epoch. */
export function epochUt(set: ElementSet): number {
  return (set.epoch.getTime() - UNIX_MS_AT_UT0) / 86_400_000;
}

/**
 * SGP4/SDP4 state at `minutesSinceEpoch` (minutes from the element set's epoch), TEME, or null
 * when SGP4 reports an error at that time (the orbit has decayed, or the elements have become
 * meaningless).
 */
export function stateAtMinutes(set: ElementSet, minutesSinceEpoch: number): TemeState | null {
  const pv = sgp4(set.satrec, minutesSinceEpoch);
  if (!pv || set.satrec.error !== 0) return null;
  const p = pv.position;
  const v = pv.velocity;
  return { positionKm: [p.x, p.y, p.z], velocityKmS: [v.x, v.y, v.z] };
}

/** SGP4/SDP4 state at `ut` (UT days), TEME; null when SGP4 fails (see `stateAtMinutes`). */
export function stateAt(set: ElementSet, ut: number): TemeState | null {
  return stateAtMinutes(set, (ut - epochUt(set)) * 1440);
}

/**
 * A satellite's SGP4 states on a fixed grid of nodes (computed when first needed, then kept),
 * with cubic Hermite interpolation of the position and velocity in between. With nodes two
 * minutes apart the interpolation error of a low orbit is about |r⁗| h⁴/384 ≈ ω⁴ a h⁴/384 ≈ 6 m
 * (0.001 s of along-track time); `test/satellite-passes.test.ts` checks it against SGP4 itself.
 */
export class StateTrack {
  readonly elements: ElementSet;
  readonly #base: number;
  readonly #nodeDays: number;
  readonly #nodeSeconds: number;
  readonly #nodes = new Map<number, TemeState | null>();

  /** Nodes at `baseUt` + k · `nodeDays` (UT days). */
  constructor(elements: ElementSet, options: { baseUt: number; nodeDays: number }) {
    this.elements = elements;
    this.#base = options.baseUt;
    this.#nodeDays = options.nodeDays;
    this.#nodeSeconds = options.nodeDays * 86_400;
  }

  #node(k: number): TemeState | null {
    let state = this.#nodes.get(k);
    if (state === undefined) {
      state = stateAt(this.elements, this.#base + k * this.#nodeDays);
      this.#nodes.set(k, state);
    }
    return state;
  }

  /** Interpolated TEME state at `ut`; null when SGP4 fails at a neighbouring node. */
  at(ut: number): TemeState | null {
    const u = (ut - this.#base) / this.#nodeDays;
    let k = Math.floor(u);
    const s = u - k;
    // At (or within rounding of) a node, that node's exact state.
    if (s < 1e-9 || s > 1 - 1e-9) {
      k = Math.round(u);
      return this.#node(k);
    }
    const a = this.#node(k);
    const b = this.#node(k + 1);
    if (!a || !b) return null;
    const h = this.#nodeSeconds;
    const s2 = s * s;
    const s3 = s2 * s;
    const h00 = 2 * s3 - 3 * s2 + 1, h10 = s3 - 2 * s2 + s, h01 = -2 * s3 + 3 * s2, h11 = s3 - s2;
    const d00 = (6 * s2 - 6 * s) / h, d10 = 3 * s2 - 4 * s + 1, d01 = (-6 * s2 + 6 * s) / h, d11 = 3 * s2 - 2 * s;
    const p: Vec3 = [0, 0, 0];
    const v: Vec3 = [0, 0, 0];
    for (let i = 0; i < 3; i++) {
      const p0 = a.positionKm[i]!, p1 = b.positionKm[i]!, v0 = a.velocityKmS[i]!, v1 = b.velocityKmS[i]!;
      p[i] = h00 * p0 + h10 * h * v0 + h01 * p1 + h11 * h * v1;
      v[i] = d00 * p0 + d10 * v0 + d01 * p1 + d11 * v1;
    }
    return { positionKm: p, velocityKmS: v };
  }
}

/** Earth's rotation rate, rad/s (IERS Conventions 2010, ω = 7.292115 × 10⁻⁵). */
const EARTH_ROTATION_RAD_S = 7.292115e-5;

/** A satellite seen from the site at one instant. */
export interface LookAngles {
  /** Geometric (airless) altitude, degrees. */
  geometricAltitudeDeg: number;
  /** Apparent altitude with standard refraction (astronomy-engine, 10 °C, 1010 hPa), degrees. */
  altitudeDeg: number;
  /** Degrees from north through east, 0–360. */
  azimuthDeg: number;
  /** Observer–satellite distance, km. */
  rangeKm: number;
  /** Observer → satellite, TEME, km. */
  topocentricKm: Vec3;
  /** Earth's centre → satellite, TEME, km. */
  positionKm: Vec3;
}

/** The site as an SGP4 observer: its geodetic place and local vertical, fixed once. */
export class SatelliteObserver {
  readonly site: Site;
  readonly #ecf: EciVec3<number>;
  readonly #sinLat: number;
  readonly #cosLat: number;
  readonly #longitudeRad: number;

  constructor(site: Site) {
    this.site = site;
    const geodetic: GeodeticLocation = { latitude: site.latitudeDeg * RAD, longitude: site.longitudeDeg * RAD, height: site.elevationM / 1000 };
    this.#ecf = geodeticToEcf(geodetic);
    this.#sinLat = Math.sin(geodetic.latitude);
    this.#cosLat = Math.cos(geodetic.latitude);
    this.#longitudeRad = geodetic.longitude;
  }

  /** Greenwich mean sidereal time at `ut`, radians (IAU 1982, satellite.js `gstime`). */
  gmstRad(ut: number): number {
    return gstime(ut + JD_J2000);
  }

  /** The observer's position at `ut`, TEME, km. */
  positionKm(ut: number): Vec3 {
    const o = ecfToEci(this.#ecf, this.gmstRad(ut));
    return [o.x, o.y, o.z];
  }

  /**
   * Rate of change of the sine of the satellite's geometric altitude at `ut`, 1/s: positive while
   * it climbs, zero at its highest point. From the TEME state and the site's motion with the
   * Earth's rotation (about the TEME z axis).
   */
  altitudeRate(state: TemeState, ut: number): number {
    const o = this.positionKm(ut);
    const theta = this.gmstRad(ut) + this.#longitudeRad;
    const u: Vec3 = [this.#cosLat * Math.cos(theta), this.#cosLat * Math.sin(theta), this.#sinLat];
    const w = EARTH_ROTATION_RAD_S;
    const r: Vec3 = [state.positionKm[0] - o[0], state.positionKm[1] - o[1], state.positionKm[2] - o[2]];
    const rd: Vec3 = [state.velocityKmS[0] + w * o[1], state.velocityKmS[1] - w * o[0], state.velocityKmS[2]];
    const ud: Vec3 = [-w * u[1], w * u[0], 0];
    const range = Math.hypot(r[0], r[1], r[2]);
    const ru = r[0] * u[0] + r[1] * u[1] + r[2] * u[2];
    const rrd = r[0] * rd[0] + r[1] * rd[1] + r[2] * rd[2];
    return (rd[0] * u[0] + rd[1] * u[1] + rd[2] * u[2] + r[0] * ud[0] + r[1] * ud[1]) / range - (ru * rrd) / range ** 3;
  }

  /**
   * Altitude, azimuth and range of a TEME position at `ut`. The direction is the topocentric
   * vector resolved on the site's geodetic east–north–up axes (the usual south–east–zenith
   * rotation, e.g. Vallado, *Fundamentals of Astrodynamics*, §3.4).
   */
  look(positionKm: Vec3, ut: number): LookAngles {
    const o = this.positionKm(ut);
    const dx = positionKm[0] - o[0];
    const dy = positionKm[1] - o[1];
    const dz = positionKm[2] - o[2];
    // Local sidereal angle: the site's meridian in TEME.
    const theta = this.gmstRad(ut) + this.#longitudeRad;
    const c = Math.cos(theta);
    const s = Math.sin(theta);
    const east = -s * dx + c * dy;
    const north = -this.#sinLat * (c * dx + s * dy) + this.#cosLat * dz;
    const up = this.#cosLat * (c * dx + s * dy) + this.#sinLat * dz;
    const range = Math.hypot(dx, dy, dz);
    const geometric = Math.asin(up / range) / RAD;
    let az = Math.atan2(east, north) / RAD;
    if (az < 0) az += 360;
    return {
      geometricAltitudeDeg: geometric,
      altitudeDeg: geometric + Astronomy.Refraction('normal', geometric),
      azimuthDeg: az,
      rangeKm: range,
      topocentricKm: [dx, dy, dz],
      positionKm,
    };
  }
}
