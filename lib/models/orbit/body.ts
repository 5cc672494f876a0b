/**
 * Comets and asteroids as `Body` values: positions from their orbital elements (two-body motion,
 * `kepler.ts`), the Earth from `astronomy-engine`, and expected magnitudes (`magnitude.ts`).
 * Once wrapped, an object works everywhere a planet does (observe, events, visibility, CLI).
 */
import { yamlFiles } from '../../core/yaml.ts';
import * as Astronomy from 'astronomy-engine';
import type { Body, BodyRegistry, Illumination } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import { loadObjectFile, toConicElements, type SmallBodyObject } from './elements.ts';
import { makeOrbit, type Orbit, type Xyz } from './kepler.ts';
import { expectedMagnitude } from './magnitude.ts';

/** A comet or asteroid computed from orbital elements. */
export interface SmallBody extends Body {
  readonly kind: 'comet' | 'asteroid';
  /** The validated object file it was made from. */
  readonly object: SmallBodyObject;
  /** The compiled two-body orbit (perihelion form). */
  readonly orbit: Orbit;
  /** Geometric heliocentric position at `time`, J2000 mean equator (EQJ), AU; no light-time. */
  helioVector(time: Astronomy.AstroTime): Astronomy.Vector;
  /** Geocentric view at `time`: see `Sighting`. */
  sighting(time: Astronomy.AstroTime, options: { aberration: boolean }): Sighting;
}

/** Where a small body is seen from the Earth's centre at one moment (all EQJ, AU). */
export interface Sighting {
  /** Earth centre → body, corrected for light-time (the `geoVector` result). */
  geo: Astronomy.Vector;
  /** Sun → body at the moment the light left it. */
  helio: Xyz;
  /** Light travel time body → Earth, days. */
  lightTimeDays: number;
}

/** Whether a body is a small body with an orbit (and so a tail helper applies). */
export function isSmallBody(body: Body): body is SmallBody {
  return typeof (body as Partial<SmallBody>).sighting === 'function';
}

/** The object files behind a registry's comets and asteroids, in the order they were added. */
export function objectsIn(registry: BodyRegistry): SmallBodyObject[] {
  return registry.ids().map((id) => registry.get(id)).filter(isSmallBody).map((b) => b.object);
}

/**
 * Wraps a validated object as a `Body`.
 *
 * `geoVector` follows astronomy-engine's `GeoVector`/`BackdatePosition` convention exactly:
 * the light-time τ is iterated with `HelioVector(Body.Earth, ·)` until it changes by < 1e-9 day;
 * the body is taken at t − τ; with `aberration: true` the Earth is also taken at t − τ (which
 * adds the aberration to first order), with `false` the Earth is taken at t (Meeus's
 * "astrometric" position, ch. 33). The returned vector's `t` is the observation time.
 */
export function smallBody(object: SmallBodyObject): SmallBody {
  const orbit = makeOrbit(toConicElements(object.elements));

  const sighting = (time: Astronomy.AstroTime, { aberration }: { aberration: boolean }): Sighting => {
    const fixedEarth = aberration ? null : Astronomy.HelioVector(Astronomy.Body.Earth, time);
    let ltime = time;
    let helio: Xyz = { x: 0, y: 0, z: 0 };
    let gx = 0;
    let gy = 0;
    let gz = 0;
    let lightTimeDays = 0;
    for (let iter = 0; iter < 10; iter++) {
      const earth = fixedEarth ?? Astronomy.HelioVector(Astronomy.Body.Earth, ltime);
      helio = orbit.equatorialAu(ltime.tt);
      gx = helio.x - earth.x;
      gy = helio.y - earth.y;
      gz = helio.z - earth.z;
      lightTimeDays = Math.hypot(gx, gy, gz) / Astronomy.C_AUDAY;
      const next = time.AddDays(-lightTimeDays);
      const converged = Math.abs(next.tt - ltime.tt) < 1e-9;
      ltime = next;
      if (converged) break;
    }
    return { geo: new Astronomy.Vector(gx, gy, gz, time), helio, lightTimeDays };
  };

  return {
    id: object.id,
    name: object.name,
    // The object file's names in other languages: every page label and sentence reads them (bodyLabel, bodyPhrase).
    ...(object.names ? { localNames: object.names } : {}),
    kind: object.kind,
    radiusKm: 0,
    ...(object.comaArcmin !== undefined ? { comaDiameterArcmin: object.comaArcmin } : {}),
    object,
    orbit,
    helioVector(time) {
      const p = orbit.equatorialAu(time.tt);
      return new Astronomy.Vector(p.x, p.y, p.z, time);
    },
    sighting,
    geoVector: (time, options) => sighting(time, options).geo,
    illumination(time): Illumination {
      const { geo, helio } = sighting(time, { aberration: false });
      const r = Math.hypot(helio.x, helio.y, helio.z);
      const delta = geo.Length();
      // Phase angle α: Sun–body–Earth, between body→Sun (−helio) and body→Earth (−geo).
      const cosPhase = (helio.x * geo.x + helio.y * geo.y + helio.z * geo.z) / (r * delta);
      const phaseAngleDeg = (Math.acos(Math.max(-1, Math.min(1, cosPhase))) * 180) / Math.PI;
      const geometry = { heliocentricDistanceAu: r, geocentricDistanceAu: delta, phaseAngleDeg };
      return {
        ...geometry,
        illuminatedFraction: (1 + cosPhase) / 2,
        magnitude: expectedMagnitude(object.magnitude, geometry, { id: object.id, ...(object.file ? { file: object.file } : {}) }),
      };
    },
  };
}

/**
 * Position angle of a comet's tail (the anti-solar direction, i.e. the prolonged Sun → comet
 * radius vector, projected on the sky at the comet), degrees 0–360 measured from the north
 * celestial pole through east, in the J2000 mean equator (EQJ). Referred to the equator of date
 * the angle grows by the precession term ≈ 0.0056° × sin α sec δ per year since 2000 (the usual
 * position-angle correction for precession; from memory), about 0.15° in 2027 away from the poles.
 *
 * The projected radius vector lies on the great circle through the Sun and the comet, so this
 * equals the position angle of the Sun seen from the comet plus 180° (Meeus 2nd ed. eq. 48.5,
 * the bright-limb angle χ, applied with the Sun); the tests check that identity.
 */
export function tailPositionAngleDeg(body: SmallBody, time: Astronomy.AstroTime): number {
  const { geo, helio } = body.sighting(time, { aberration: true });
  const d = geo.Length();
  const ux = geo.x / d;
  const uy = geo.y / d;
  const uz = geo.z / d;
  // East = z × u (normalised), north = u × east.
  const eLen = Math.hypot(uy, ux);
  const ex = -uy / eLen;
  const ey = ux / eLen;
  const nx = -uz * ey;
  const ny = uz * ex;
  const nz = ux * ey - uy * ex;
  const east = helio.x * ex + helio.y * ey;
  const north = helio.x * nx + helio.y * ny + helio.z * nz;
  const pa = (Math.atan2(east, north) * 180) / Math.PI;
  return pa < 0 ? pa + 360 : pa;
}

/**
 * A point along the tail, as a geocentric EQJ vector (AU): the comet's light-time corrected
 * position plus `lengthAu` (default 0.01 AU) along the anti-solar direction. Converting both this
 * point and the comet to an observer's horizontal coordinates gives the tail's direction in that
 * observer's sky at that moment ("up and to the left").
 */
export function tailPointGeoVector(body: SmallBody, time: Astronomy.AstroTime, options: { lengthAu?: number } = {}): Astronomy.Vector {
  const { geo, helio } = body.sighting(time, { aberration: true });
  const lengthAu = options.lengthAu ?? 0.01;
  const r = Math.hypot(helio.x, helio.y, helio.z);
  const k = lengthAu / r;
  return new Astronomy.Vector(geo.x + helio.x * k, geo.y + helio.y * k, geo.z + helio.z * k, time);
}

/**
 * Loads every `*.yaml` (or `.yml`) object file in `dir` (sorted by file name) as bodies. Ids must be unique
 * within the folder; a clash names the second file. A missing folder gives no bodies.
 */
export function loadObjects(dir: string): SmallBody[] {
  const seen = new Map<string, string>();
  return yamlFiles(dir, { optional: true }).map((file) => {
    const object = loadObjectFile(file);
    const earlier = seen.get(object.id);
    if (earlier) {
      throw new GloamingError('invalid-value', `object id '${object.id}' is already used by ${earlier}`, {
        place: { file, field: 'id' },
        actual: object.id,
        expected: 'an id used by one object file only',
      });
    }
    seen.set(object.id, file);
    return smallBody(object);
  });
}
