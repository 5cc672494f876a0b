/**
 * Geometry on the sky, in one place: sidereal time and its rate, altitude and azimuth from
 * equatorial directions, the angle between two directions, and where one point lies from another
 * in an observer's sky. Every altitude and azimuth gloaming computes goes through `Horizon`
 * (tracks over a night, `observe` at an instant, the charts, the guide phrases, comet tails), and
 * every angle between two directions through `separationDeg`.
 *
 * Frames: J2000 mean equator (EQJ) and true equator of date (EQD) vectors, x towards the equinox,
 * z towards the pole; horizontal vectors on astronomy-engine's HOR axes (x north, y west, z
 * zenith). Azimuth runs from north through east, 0–360°; altitudes are geometric (airless) unless
 * a name says apparent.
 */
import * as Astronomy from 'astronomy-engine';

export type Vec3 = readonly [number, number, number];

const RAD = Math.PI / 180;

/** Sidereal hours per UT day: the rate of Greenwich mean sidereal time (IAU 1982, the derivative of Meeus, Astronomical Algorithms, eq. 12.4). */
export const SIDEREAL_HOURS_PER_DAY = 24.065709824419;
/** One sidereal day in UT days (23 h 56 m 4.0905 s): a star returns to the same place in the sky after this long. */
export const SIDEREAL_DAY_DAYS = 24 / SIDEREAL_HOURS_PER_DAY;

/**
 * Local apparent sidereal time at `time` for an east longitude, hours (not reduced to 0–24):
 * Greenwich apparent sidereal time from astronomy-engine's `SiderealTime` (IAU 2006 Earth rotation
 * angle with the equation of the equinoxes) plus longitude / 15.
 */
export function localSiderealHours(time: Astronomy.AstroTime, longitudeDeg: number): number {
  return Astronomy.SiderealTime(time) + longitudeDeg / 15;
}

/** A direction in an observer's sky. */
export interface Horizontal {
  /** Geometric (airless) altitude, degrees. */
  geometricAltitudeDeg: number;
  /** Azimuth from north through east, degrees 0–360. */
  azimuthDeg: number;
  /** Hour angle, hours, −12…12 (negative east of the meridian). */
  hourAngleHours: number;
  /** Length of the vector given (AU for positions, 1 for unit directions). */
  distance: number;
}

/**
 * The horizon of one latitude: equator-of-date vectors to altitude, azimuth and hour angle at a
 * local sidereal time. The altitude–azimuth relations of spherical astronomy (Meeus, Astronomical
 * Algorithms, eqs. 13.5 and 13.6) written for vectors, so no angle is lost near the poles.
 */
export class Horizon {
  readonly latitudeDeg: number;
  readonly #sinLat: number;
  readonly #cosLat: number;

  constructor(latitudeDeg: number) {
    this.latitudeDeg = latitudeDeg;
    this.#sinLat = Math.sin(latitudeDeg * RAD);
    this.#cosLat = Math.cos(latitudeDeg * RAD);
  }

  /** Horizontal coordinates of the equator-of-date vector (x, y, z) at local sidereal time `lstHours`. */
  ofDate(x: number, y: number, z: number, lstHours: number): Horizontal {
    const theta = lstHours * 15 * RAD;
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
      distance: r,
    };
  }

  /**
   * The rotation from the equator of date to the horizontal frame (HOR axes: x north, y west, z
   * zenith) at `lstHours`, row-major: `ofDate` as a matrix, for turning many directions at once.
   */
  rotationOfDate(lstHours: number): number[] {
    const theta = lstHours * 15 * RAD;
    const c = Math.cos(theta);
    const s = Math.sin(theta);
    const sl = this.#sinLat;
    const cl = this.#cosLat;
    // north = (−sin φ cos θ, −sin φ sin θ, cos φ); west = (sin θ, −cos θ, 0); zenith = (cos φ cos θ, cos φ sin θ, sin φ).
    return [-sl * c, -sl * s, cl, s, -c, 0, cl * c, cl * s, sl];
  }
}

/** Apparent altitude from a geometric one with standard refraction (10 °C, 1010 hPa; astronomy-engine `Refraction('normal', …)`), degrees. */
export function apparentAltitudeDeg(geometricAltitudeDeg: number): number {
  return geometricAltitudeDeg + Astronomy.Refraction('normal', geometricAltitudeDeg);
}

/** Altitude (degrees) of a horizontal vector (HOR axes), any length. */
export function altitudeOfHor(v: Vec3): number {
  return Math.asin(Math.max(-1, Math.min(1, v[2] / Math.hypot(v[0], v[1], v[2])))) / RAD;
}

/** Azimuth (degrees from north through east, 0–360) of a horizontal vector (HOR axes). */
export function azimuthOfHor(v: Vec3): number {
  const az = Math.atan2(-v[1], v[0]) / RAD;
  return az < 0 ? az + 360 : az;
}

/**
 * The horizontal frame of one observer at one moment: J2000 (EQJ) or equator-of-date directions
 * to HOR vectors and horizontal coordinates. Precession and nutation from astronomy-engine
 * (`Rotation_EQJ_EQD`), then `Horizon` at the local apparent sidereal time. Directions only:
 * parallax is the caller's (subtract the observer's position first, as `observe` does).
 */
export class SkyFrame {
  readonly time: Astronomy.AstroTime;
  readonly lstHours: number;
  readonly horizon: Horizon;
  /** Row-major EQD → HOR and EQJ → HOR rotations. */
  readonly #eqd: number[];
  readonly #eqj: number[];

  constructor(observer: { latitudeDeg: number; longitudeDeg: number }, time: Astronomy.AstroTime) {
    this.time = time;
    this.lstHours = localSiderealHours(time, observer.longitudeDeg);
    this.horizon = new Horizon(observer.latitudeDeg);
    this.#eqd = this.horizon.rotationOfDate(this.lstHours);
    // astronomy-engine stores rot[column][row].
    const p = Astronomy.Rotation_EQJ_EQD(time).rot;
    const m = this.#eqd;
    this.#eqj = [0, 1, 2].flatMap((row) => [0, 1, 2].map((col) => m[row * 3]! * p[col]![0]! + m[row * 3 + 1]! * p[col]![1]! + m[row * 3 + 2]! * p[col]![2]!));
  }

  /** HOR vector of a J2000 direction (same length). */
  horFromEqj(x: number, y: number, z: number): [number, number, number] {
    return multiply(this.#eqj, x, y, z);
  }

  /** HOR vector of an equator-of-date direction (same length). */
  horFromEqd(x: number, y: number, z: number): [number, number, number] {
    return multiply(this.#eqd, x, y, z);
  }

  /** The zenith component (sine of the altitude times the length) of a J2000 direction, for quick horizon cuts. */
  zenithFromEqj(x: number, y: number, z: number): number {
    const m = this.#eqj;
    return m[6]! * x + m[7]! * y + m[8]! * z;
  }
}

function multiply(m: readonly number[], x: number, y: number, z: number): [number, number, number] {
  return [m[0]! * x + m[1]! * y + m[2]! * z, m[3]! * x + m[4]! * y + m[5]! * z, m[6]! * x + m[7]! * y + m[8]! * z];
}

/** Unit vector of a right ascension and declination (degrees), on that equator. */
export function unitFromRaDec(raDeg: number, decDeg: number): [number, number, number] {
  const ra = raDeg * RAD;
  const dec = decDeg * RAD;
  return [Math.cos(dec) * Math.cos(ra), Math.cos(dec) * Math.sin(ra), Math.sin(dec)];
}

/** Horizontal unit vector (HOR axes) of an altitude and azimuth (from north through east), degrees. */
export function unitFromAltAz(altitudeDeg: number, azimuthDeg: number): [number, number, number] {
  const alt = altitudeDeg * RAD;
  const az = azimuthDeg * RAD;
  return [Math.cos(alt) * Math.cos(az), -Math.cos(alt) * Math.sin(az), Math.sin(alt)];
}

/** Angle between two directions (vectors of any length), degrees; the atan2 form, accurate at 0° and 180°. */
export function separationDeg(a: Vec3, b: Vec3): number {
  const dot = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const cross = Math.hypot(a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]);
  return Math.atan2(cross, dot) / RAD;
}

/** Where one point of the sky lies as seen from another, in eight words (sectors of 45° centred on each). */
export type OffsetDirection = 'above' | 'upper right' | 'right' | 'lower right' | 'below' | 'lower left' | 'left' | 'upper left';

const DIRECTIONS: readonly OffsetDirection[] = ['above', 'upper right', 'right', 'lower right', 'below', 'lower left', 'left', 'upper left'];

/**
 * Where `to` lies as seen from `from`, both horizontal vectors (HOR axes, any length). "Up" at
 * `from` is the direction towards the zenith along the vertical circle through `from`; "right" is
 * to the right of an observer facing `from` with the head towards the zenith (the direction of
 * increasing azimuth). Within 0.5° of the zenith the vertical is undefined and every other point
 * is below, so the answer is 'below'. Spherical geometry of the tangent plane at `from`.
 */
export function offsetOfHor(from: Vec3, to: Vec3): { separationDeg: number; positionAngleDeg: number; offsetDirection: OffsetDirection } {
  const f = normalize(from);
  const t = normalize(to);
  const sep = separationDeg(f, t);
  const k = dot(t, f);
  const d: Vec3 = [t[0] - k * f[0], t[1] - k * f[1], t[2] - k * f[2]];
  const cosAlt = Math.hypot(f[0], f[1]);
  let pa: number;
  if (cosAlt < Math.sin(0.5 * RAD) || Math.hypot(d[0], d[1], d[2]) < 1e-12) {
    pa = 180;
  } else {
    const up = normalize([-f[2] * f[0], -f[2] * f[1], 1 - f[2] * f[2]]);
    const right = cross(f, up);
    pa = ((Math.atan2(dot(d, right), dot(d, up)) / RAD) % 360 + 360) % 360;
  }
  return { separationDeg: sep, positionAngleDeg: pa, offsetDirection: DIRECTIONS[Math.round(pa / 45) % 8]! };
}

/**
 * Where a point at (`toAltitudeDeg`, `toAzimuthDeg`) lies as seen from a point at
 * (`fromAltitudeDeg`, `fromAzimuthDeg`) in the observer's sky (see `offsetOfHor`): the angle
 * between them, the position angle measured from up through right (degrees 0–360), and the word.
 */
export function offsetInSky(input: { fromAltitudeDeg: number; fromAzimuthDeg: number; toAltitudeDeg: number; toAzimuthDeg: number }): {
  separationDeg: number;
  positionAngleDeg: number;
  offsetDirection: OffsetDirection;
} {
  return offsetOfHor(unitFromAltAz(input.fromAltitudeDeg, input.fromAzimuthDeg), unitFromAltAz(input.toAltitudeDeg, input.toAzimuthDeg));
}

export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}

export function cross(a: Vec3, b: Vec3): [number, number, number] {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

export function normalize(a: Vec3): [number, number, number] {
  const n = Math.hypot(a[0], a[1], a[2]);
  return [a[0] / n, a[1] / n, a[2] / n];
}
