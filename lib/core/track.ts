/**
 * Tracks: a body's path across one night's sky, for fast searches. The topocentric apparent
 * position (`observe.ts`) is computed at hourly nodes and interpolated with cubic Lagrange
 * polynomials; horizontal coordinates then follow from the local sidereal time, which is linear
 * in UT over a night. At each hourly node the observer's exact position is subtracted from the
 * body's geocentric apparent position; for the Sun, the Moon and the planets that geocentric
 * position is itself interpolated (cubic Lagrange) from nodes six hours apart on a fixed UT grid,
 * computed once per body and shared by every night and site that needs them (`GeocentricNodes`):
 * over six hours the geocentric motion is smooth to far below 0.1″ (the Moon's 4th-order term is
 * about 0.1 km), while the daily turn of the observer is what needs the hourly nodes. Comets and
 * asteroids keep an exact geocentric position at every hourly node. Interpolation error is below
 * 1″ for planets and about 1″ for the Moon (checked against `observe` in the tests), far below the
 * 1′ target.
 */
import * as Astronomy from 'astronomy-engine';
import type { Body } from './body.ts';
import { builtInBody } from './body.ts';
import { Horizon, SIDEREAL_HOURS_PER_DAY, apparentAltitudeDeg, localSiderealHours, type Horizontal } from './geometry.ts';
import { KM_PER_AU } from './observe.ts';
import type { Site } from './site.ts';
import type { Night } from './time.ts';

const RAD = Math.PI / 180;
const NODE_STEP_DAYS = 1 / 24;
const MARGIN_DAYS = 3 / 24;
/** Spacing of the shared geocentric nodes of the Sun, the Moon and the planets, days. */
const GEOCENTRIC_STEP_DAYS = 6 / 24;

/** Cubic Lagrange weights for nodes at 0, 1, 2, 3 and a position `p` between them (in node steps). */
function lagrangeWeights(p: number): [number, number, number, number] {
  return [(-(p - 1) * (p - 2) * (p - 3)) / 6, (p * (p - 2) * (p - 3)) / 2, (-p * (p - 1) * (p - 3)) / 2, (p * (p - 1) * (p - 2)) / 6];
}

/**
 * A body's geocentric apparent position (J2000 equator, light time and aberration applied, AU) at
 * nodes every `GEOCENTRIC_STEP_DAYS` on the UT grid k × step, computed once and kept. A node
 * depends only on the body and k, so every night and site reads the same values whatever order
 * they come in (builds stay deterministic).
 */
class GeocentricNodes {
  readonly #body: Body;
  readonly #nodes = new Map<number, readonly [number, number, number]>();

  constructor(body: Body) {
    this.#body = body;
  }

  #node(k: number): readonly [number, number, number] {
    let v = this.#nodes.get(k);
    if (!v) {
      const g = this.#body.geoVector(Astronomy.MakeTime(k * GEOCENTRIC_STEP_DAYS), { aberration: true });
      v = [g.x, g.y, g.z];
      // A long-running process (the dev server) keeps at most a few years of nodes per body.
      if (this.#nodes.size >= 20_000) this.#nodes.clear();
      this.#nodes.set(k, v);
    }
    return v;
  }

  /** The geocentric vector at `ut`, interpolated from the four nodes around it. */
  at(ut: number): [number, number, number] {
    const u = ut / GEOCENTRIC_STEP_DAYS;
    const k0 = Math.floor(u) - 1;
    const [w0, w1, w2, w3] = lagrangeWeights(u - k0);
    const a = this.#node(k0), b = this.#node(k0 + 1), c = this.#node(k0 + 2), d = this.#node(k0 + 3);
    return [w0 * a[0] + w1 * b[0] + w2 * c[0] + w3 * d[0], w0 * a[1] + w1 * b[1] + w2 * c[1] + w3 * d[1], w0 * a[2] + w1 * b[2] + w2 * c[2] + w3 * d[2]];
  }
}

/** The shared geocentric nodes of each built-in body (the Sun, the Moon, the planets), kept as long as the body object lives. */
const geocentricNodes = new WeakMap<Body, GeocentricNodes>();

/** The geocentric apparent vector of `body` at `time`: interpolated for the Sun, the Moon and the planets, exact for others. */
function geocentricAt(body: Body, time: Astronomy.AstroTime): [number, number, number] {
  if (body.kind === 'comet' || body.kind === 'asteroid') {
    const g = body.geoVector(time, { aberration: true });
    return [g.x, g.y, g.z];
  }
  let nodes = geocentricNodes.get(body);
  if (!nodes) {
    nodes = new GeocentricNodes(body);
    geocentricNodes.set(body, nodes);
  }
  return nodes.at(time.ut);
}

/** A body's place in the sky at one instant, as seen from the site (`distance` is the topocentric distance in AU). */
export type SkyPoint = Horizontal;

/** Converts a `Date` to `astronomy-engine` UT days. */
export function utDays(date: Date): number {
  return Astronomy.MakeTime(date).ut;
}

/** Converts `astronomy-engine` UT days to a `Date`. */
export function dateFromUt(ut: number): Date {
  return new Date(Math.round(Date.UTC(2000, 0, 1, 12) + ut * 86_400_000));
}

/** The hourly nodes every track of a night shares: their times and the observer's geocentric position (J2000 equator, AU) at each. */
interface NightNodes {
  start: number;
  times: Astronomy.AstroTime[];
  observer: Float64Array;
}

/** The shared frame of one site-night: sidereal time, the precession–nutation rotation and the observer's place at the track nodes. */
export class NightFrame {
  readonly site: Site;
  readonly night: Night;
  /** UT days of the night's start and end (local noon to local noon). */
  readonly ut0: number;
  readonly ut1: number;
  readonly #lst0Hours: number;
  /** Row-major EQJ → EQD rotation (precession and nutation at the middle of the night). */
  readonly #rotation: number[];
  readonly #horizon: Horizon;
  readonly #tracks = new Map<string, Track>();
  #nodes: NightNodes | undefined;

  constructor(site: Site, night: Night) {
    this.site = site;
    this.night = night;
    this.ut0 = utDays(night.start);
    this.ut1 = utDays(night.end);
    // Apparent sidereal time at the start; over one night the equation of the equinoxes changes by < 1 ms.
    this.#lst0Hours = localSiderealHours(Astronomy.MakeTime(night.start), site.longitudeDeg);
    // astronomy-engine stores rot[column][row].
    const r = Astronomy.Rotation_EQJ_EQD(Astronomy.MakeTime(dateFromUt((this.ut0 + this.ut1) / 2))).rot;
    this.#rotation = [0, 1, 2].flatMap((row) => [r[0]![row]!, r[1]![row]!, r[2]![row]!]);
    this.#horizon = new Horizon(site.latitudeDeg);
  }

  /** The node times and observer positions shared by every track of the night (computed on first use). */
  get nodes(): NightNodes {
    if (!this.#nodes) {
      const start = this.ut0 - MARGIN_DAYS;
      const n = Math.ceil((this.ut1 + MARGIN_DAYS - start) / NODE_STEP_DAYS) + 1;
      const times: Astronomy.AstroTime[] = [];
      const observer = new Float64Array(3 * n);
      for (let i = 0; i < n; i++) {
        const time = Astronomy.MakeTime(dateFromUt(start + i * NODE_STEP_DAYS));
        const o = Astronomy.ObserverVector(time, this.site.observer, false);
        times.push(time);
        observer[3 * i] = o.x;
        observer[3 * i + 1] = o.y;
        observer[3 * i + 2] = o.z;
      }
      this.#nodes = { start, times, observer };
    }
    return this.#nodes;
  }

  /** The topocentric equator-of-date vector from a geocentric J2000 one and the observer's at node `i`. */
  topocentricAtNode(i: number, geo: readonly [number, number, number]): [number, number, number] {
    const o = this.nodes.observer;
    const x = geo[0] - o[3 * i]!, y = geo[1] - o[3 * i + 1]!, z = geo[2] - o[3 * i + 2]!;
    const m = this.#rotation;
    return [m[0]! * x + m[1]! * y + m[2]! * z, m[3]! * x + m[4]! * y + m[5]! * z, m[6]! * x + m[7]! * y + m[8]! * z];
  }

  /** Local apparent sidereal time at `ut`, hours (not reduced to 0–24). */
  lstHours(ut: number): number {
    return this.#lst0Hours + SIDEREAL_HOURS_PER_DAY * (ut - this.ut0);
  }

  /** The body's track for this night (built once, then shared). */
  track(body: Body): Track {
    let t = this.#tracks.get(body.id);
    if (!t) {
      t = new Track(this, body);
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

  /** Horizontal coordinates of a topocentric equator-of-date vector at `ut` (see `Horizon` in geometry.ts). */
  horizontalOf(x: number, y: number, z: number, ut: number): SkyPoint {
    return this.#horizon.ofDate(x, y, z, this.lstHours(ut));
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

  constructor(frame: NightFrame, body: Body) {
    this.frame = frame;
    this.body = body;
    const { start, times } = frame.nodes;
    this.#start = start;
    const n = times.length;
    this.#x = new Float64Array(n);
    this.#y = new Float64Array(n);
    this.#z = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      const [x, y, z] = frame.topocentricAtNode(i, geocentricAt(body, times[i]!));
      this.#x[i] = x;
      this.#y[i] = y;
      this.#z[i] = z;
    }
  }

  /** Topocentric apparent vector (equator of date, AU) at `ut`, by 4-point Lagrange interpolation. */
  vectorAt(ut: number): [number, number, number] {
    const n = this.#x.length;
    const u = (ut - this.#start) / NODE_STEP_DAYS;
    const i0 = Math.min(Math.max(Math.floor(u) - 1, 0), n - 4);
    // Position relative to node i0, typically in [1, 2).
    const [w0, w1, w2, w3] = lagrangeWeights(u - i0);
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
    return apparentAltitudeDeg(this.at(ut).geometricAltitudeDeg);
  }

  /** Apparent semidiameter at a topocentric distance (AU, e.g. `at(ut).distance`), degrees. */
  semidiameterDeg(distanceAu: number): number {
    return Math.asin(Math.min(1, this.body.radiusKm / (distanceAu * KM_PER_AU))) / RAD;
  }
}
