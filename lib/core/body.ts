/**
 * Bodies: the things gloaming can observe. The Sun, the Moon and the planets come from
 * `astronomy-engine` (VSOP87 for planets, a truncated ELP for the Moon); comets and asteroids
 * defined by orbital elements implement the same `Body` interface in `lib/models/orbit/`, so every
 * later step (observe, events, visibility, description) treats them alike.
 */
import * as Astronomy from 'astronomy-engine';
import { GloamingError, didYouMean } from './errors.ts';
import { localMidnight, type Night } from './time.ts';

/** What a body is; a fixed direction of the sky (`fixedDirectionBody`) is a catalogue `star`, a meteor shower's `radiant` or a `deep-sky` object. */
export type BodyKind = 'sun' | 'moon' | 'planet' | 'comet' | 'asteroid' | 'star' | 'radiant' | 'deep-sky';

/** An expected visual magnitude, possibly as a range when the model is uncertain (comets). */
export interface MagnitudeEstimate {
  /** Best estimate, V magnitude. */
  value: number;
  /** Brightest plausible value (smaller number), when the source gives a band. */
  brightest?: number;
  /** Faintest plausible value (larger number), when the source gives a band. */
  faintest?: number;
}

/** Geometry of a body against the Sun and the Earth at one moment (all geocentric). */
export interface Illumination {
  /** Distance Sun–body, AU (r). */
  heliocentricDistanceAu: number;
  /** Distance Earth centre–body, AU (Δ). */
  geocentricDistanceAu: number;
  /** Sun–body–Earth angle, degrees (α). */
  phaseAngleDeg: number;
  /** Fraction of the disc lit as seen from Earth, 0–1. */
  illuminatedFraction: number;
  magnitude: MagnitudeEstimate;
}

export interface Body {
  /** Stable lower-case id used on the command line and in placeholders (`jupiter`, `example-comet`). */
  readonly id: string;
  /** Display name ("Jupiter", "Comet Example"). */
  readonly name: string;
  readonly kind: BodyKind;
  /** Mean equatorial radius, km; 0 for bodies treated as points. Gives the semidiameter for rise and set. */
  readonly radiusKm: number;
  /** Apparent coma diameter of a diffuse comet, arcminutes; absent for point-like bodies. */
  readonly comaDiameterArcmin?: number;
  /**
   * Size of an extended deep-sky object (cluster, nebula, galaxy) on the sky, arcminutes: the axes
   * of the ellipse its total magnitude is spread over. Absent for point-like bodies.
   */
  readonly extentArcmin?: { readonly major: number; readonly minor: number };
  /** Angle between the two stars of a double star, arcseconds: seeing it means seeing both apart. */
  readonly pairSeparationArcsec?: number;
  /** The body's name in other languages (language code → name), when it has one there; else `name`. */
  readonly localNames?: Readonly<Partial<Record<string, string>>>;
  /**
   * Geocentric position, J2000 mean equator (EQJ), AU, at observation time `time`, corrected for
   * light travel time τ: the body is taken where it was when the light left it (t − τ). With
   * `aberration: true` the Earth is also taken at t − τ, so the Earth's motion during τ shifts the
   * direction by the annual aberration (the apparent direction); with `false` the Earth is taken
   * at t (the astrometric direction). This is the convention of `astronomy-engine`'s `GeoVector`
   * and `BackdatePosition`, which planets use directly.
   */
  geoVector(time: Astronomy.AstroTime, options: { aberration: boolean }): Astronomy.Vector;
  /** Distances, phase and expected magnitude at `time` (geocentric). */
  illumination(time: Astronomy.AstroTime): Illumination;
}

/** A fixed direction of the sky: a catalogue star, a meteor shower's radiant or a deep-sky object. */
export interface FixedDirection {
  id: string;
  name: string;
  kind: 'star' | 'radiant' | 'deep-sky';
  /** Right ascension and declination, J2000, degrees. */
  raDeg: number;
  decDeg: number;
  /** V magnitude (a double star: its fainter star's; a radiant has none: 99). */
  vMag: number;
  /** What only some have: an extended object's size, a double star's separation, names in other languages. */
  extentArcmin?: Body['extentArcmin'];
  pairSeparationArcsec?: number;
  localNames?: Body['localNames'];
}

/** The distance a fixed direction is scaled to, AU: far enough that the observer's place on the Earth moves it by < 10⁻⁹″. */
const FIXED_DISTANCE_AU = 1e10;
const RAD = Math.PI / 180;

/** The Earth's barycentric velocity (AU/day, J2000) by time, shared by every fixed direction: they are asked at the same grid times. */
const earthVelocities = new Map<number, Astronomy.StateVector>();

function earthVelocity(time: Astronomy.AstroTime): Astronomy.StateVector {
  let v = earthVelocities.get(time.tt);
  if (!v) {
    v = Astronomy.BaryState(Astronomy.Body.Earth, time);
    if (earthVelocities.size >= 20_000) earthVelocities.clear(); // a long-running dev server keeps a few years
    earthVelocities.set(time.tt, v);
  }
  return v;
}

/**
 * A fixed direction as a `Body`, so every later step (tracks, rise and set, visibility, guide
 * phrases, charts, approaches, occultations) treats it as it treats a planet. `geoVector` is the
 * J2000 direction times `FIXED_DISTANCE_AU`; with `aberration: true` the Earth's barycentric
 * velocity v is added as v·τ, τ the light time over that distance: the annual aberration to first
 * order (up to 20.5″; Meeus, *Astronomical Algorithms*, 2nd ed., ch. 23), which is also what
 * astronomy-engine's back-dated positions give a planet when the light time is long. Proper motion
 * is not applied (under 1′ a century for the stars and objects gloaming names, see
 * lib/models/stars/catalogue.ts). Phase and distances are those of a far point.
 */
export function fixedDirectionBody(d: FixedDirection): Body {
  const ra = d.raDeg * RAD;
  const dec = d.decDeg * RAD;
  const x = Math.cos(dec) * Math.cos(ra) * FIXED_DISTANCE_AU;
  const y = Math.cos(dec) * Math.sin(ra) * FIXED_DISTANCE_AU;
  const z = Math.sin(dec) * FIXED_DISTANCE_AU;
  const lightDays = FIXED_DISTANCE_AU / Astronomy.C_AUDAY;
  const magnitude = { value: d.vMag };
  return {
    id: d.id,
    name: d.name,
    kind: d.kind,
    radiusKm: 0,
    ...(d.extentArcmin ? { extentArcmin: d.extentArcmin } : {}),
    ...(d.pairSeparationArcsec !== undefined ? { pairSeparationArcsec: d.pairSeparationArcsec } : {}),
    ...(d.localNames ? { localNames: d.localNames } : {}),
    geoVector(time, { aberration }) {
      if (!aberration) return new Astronomy.Vector(x, y, z, time);
      const v = earthVelocity(time);
      return new Astronomy.Vector(x + v.vx * lightDays, y + v.vy * lightDays, z + v.vz * lightDays, time);
    },
    illumination: () => ({ heliocentricDistanceAu: FIXED_DISTANCE_AU, geocentricDistanceAu: FIXED_DISTANCE_AU, phaseAngleDeg: 0, illuminatedFraction: 1, magnitude }),
  };
}

const PLANETS = {
  sun: { body: Astronomy.Body.Sun, name: 'Sun', kind: 'sun', radiusKm: 695_700 },
  moon: { body: Astronomy.Body.Moon, name: 'Moon', kind: 'moon', radiusKm: 1737.4 },
  mercury: { body: Astronomy.Body.Mercury, name: 'Mercury', kind: 'planet', radiusKm: 2439.7 },
  venus: { body: Astronomy.Body.Venus, name: 'Venus', kind: 'planet', radiusKm: 6051.8 },
  mars: { body: Astronomy.Body.Mars, name: 'Mars', kind: 'planet', radiusKm: 3396.2 },
  jupiter: { body: Astronomy.Body.Jupiter, name: 'Jupiter', kind: 'planet', radiusKm: 71_492 },
  saturn: { body: Astronomy.Body.Saturn, name: 'Saturn', kind: 'planet', radiusKm: 60_268 },
  uranus: { body: Astronomy.Body.Uranus, name: 'Uranus', kind: 'planet', radiusKm: 25_559 },
  neptune: { body: Astronomy.Body.Neptune, name: 'Neptune', kind: 'planet', radiusKm: 24_764 },
} as const satisfies Record<string, { body: Astronomy.Body; name: string; kind: BodyKind; radiusKm: number }>;

/** Ids of the built-in bodies, in the order bulletins list them. */
export const BUILT_IN_IDS = Object.keys(PLANETS) as (keyof typeof PLANETS)[];
/** The planets Mercury–Neptune. */
export const PLANET_IDS = BUILT_IN_IDS.filter((id) => PLANETS[id].kind === 'planet');

/** A body computed by `astronomy-engine`. Exposes the engine's enum for callers that need it. */
export interface EngineBody extends Body {
  readonly engineBody: Astronomy.Body;
}

function engineBody(id: keyof typeof PLANETS): EngineBody {
  const spec = PLANETS[id];
  return {
    id,
    name: spec.name,
    kind: spec.kind,
    radiusKm: spec.radiusKm,
    engineBody: spec.body,
    geoVector: (time, { aberration }) => Astronomy.GeoVector(spec.body, time, aberration),
    illumination(time) {
      if (spec.body === Astronomy.Body.Sun) {
        const geo = Astronomy.GeoVector(Astronomy.Body.Sun, time, true).Length();
        // Apparent V magnitude of the Sun, −26.74 at 1 AU (Allen's Astrophysical Quantities, 4th ed.).
        return {
          heliocentricDistanceAu: 0,
          geocentricDistanceAu: geo,
          phaseAngleDeg: 0,
          illuminatedFraction: 1,
          magnitude: { value: -26.74 + 5 * Math.log10(geo) },
        };
      }
      const info = Astronomy.Illumination(spec.body, time);
      const mag =
        spec.body === Astronomy.Body.Saturn
          ? saturnMagnitude(time, info.helio_dist, info.geo_dist, info.phase_angle)
          : spec.body === Astronomy.Body.Mercury
            ? mercuryMagnitude(info.helio_dist, info.geo_dist, info.phase_angle)
            : spec.body === Astronomy.Body.Venus
              ? venusMagnitude(info.helio_dist, info.geo_dist, info.phase_angle)
              : info.mag;
      return {
        heliocentricDistanceAu: info.helio_dist,
        geocentricDistanceAu: info.geo_dist,
        phaseAngleDeg: info.phase_angle,
        illuminatedFraction: info.phase_fraction,
        magnitude: { value: mag },
      };
    },
  };
}

/**
 * Saturn's visual magnitude with its rings, Mallama & Hilton (2018), "Computing apparent planetary
 * magnitudes for The Astronomical Almanac", Astronomy and Computing 25:10, for phase angles
 * α ≤ 6.5° (all that the Earth sees):
 *   V = 5 log10(r Δ) − 8.914 − 1.825 sin β + 0.026 α − 0.378 sin β · e^(−2.25 α),
 * β = √(B · B′), the geometric mean of the Saturnicentric latitudes of the Earth (B) and the Sun (B′)
 * on the ring plane, 0 when they differ in sign (the lit face is turned away). Coefficients as
 * transcribed in the project's methods digest from a third-party implementation; the ring plane is
 * Saturn's equator, its pole from astronomy-engine's `RotationAxis` (IAU WGCCRE).
 * astronomy-engine's own Saturn formula is 0.03–0.19 mag brighter.
 */
function saturnMagnitude(time: Astronomy.AstroTime, r: number, delta: number, phaseAngleDeg: number): number {
  const pole = Astronomy.RotationAxis(Astronomy.Body.Saturn, time).north;
  const saturn = Astronomy.HelioVector(Astronomy.Body.Saturn, time);
  const earth = Astronomy.HelioVector(Astronomy.Body.Earth, time);
  const latitude = (x: number, y: number, z: number): number => Math.asin((x * pole.x + y * pole.y + z * pole.z) / Math.hypot(x, y, z)) * (180 / Math.PI);
  const bEarth = latitude(earth.x - saturn.x, earth.y - saturn.y, earth.z - saturn.z);
  const bSun = latitude(-saturn.x, -saturn.y, -saturn.z);
  const beta = bEarth * bSun > 0 ? Math.sqrt(bEarth * bSun) : 0;
  const sinBeta = Math.sin(beta * (Math.PI / 180));
  const a = phaseAngleDeg;
  return 5 * Math.log10(r * delta) - 8.914 - 1.825 * sinBeta + 0.026 * a - 0.378 * sinBeta * Math.exp(-2.25 * a);
}

/**
 * Mercury's visual magnitude, Mallama & Hilton (2018), "Computing apparent planetary magnitudes for The
 * Astronomical Almanac", Astronomy and Computing 25:10, valid for the phase angles the Earth sees (to about 170°):
 *   V = 5 log10(r Δ) − 0.613 + 6.3280·10⁻² α − 1.6336·10⁻³ α² + 3.3644·10⁻⁵ α³ − 3.4265·10⁻⁷ α⁴ + 1.6893·10⁻⁹ α⁵ − 3.0334·10⁻¹² α⁶,
 * α in degrees, r and Δ in AU. Coefficients as transcribed in the project's methods digest from a third-party
 * implementation. astronomy-engine's own law (Hilton 2005) is 0.17 mag fainter at α = 142°, a thin crescent.
 */
export function mercuryMagnitude(r: number, delta: number, phaseAngleDeg: number): number {
  const a = phaseAngleDeg;
  return 5 * Math.log10(r * delta) - 0.613 + a * (6.328e-2 + a * (-1.6336e-3 + a * (3.3644e-5 + a * (-3.4265e-7 + a * (1.6893e-9 + a * -3.0334e-12)))));
}

/**
 * Venus's visual magnitude, Mallama & Hilton (2018, as for Mercury): for α < 163.7°
 *   V = 5 log10(r Δ) − 4.384 − 1.044·10⁻³ α + 3.687·10⁻⁴ α² − 2.814·10⁻⁶ α³ + 8.938·10⁻⁹ α⁴,
 * and beyond (the forward-scattering brightening of the thinnest crescents) V = 5 log10(r Δ) + 236.05828 − 2.81914 α + 8.39034·10⁻³ α².
 * Coefficients as transcribed in the project's methods digest from a third-party implementation.
 */
export function venusMagnitude(r: number, delta: number, phaseAngleDeg: number): number {
  const a = phaseAngleDeg;
  const law = a < 163.7 ? -4.384 + a * (-1.044e-3 + a * (3.687e-4 + a * (-2.814e-6 + a * 8.938e-9))) : 236.05828 + a * (-2.81914 + a * 8.39034e-3);
  return 5 * Math.log10(r * delta) + law;
}

const BUILT_IN = new Map<string, EngineBody>(BUILT_IN_IDS.map((id) => [id, engineBody(id)]));

/**
 * A catalogue a registry can also look ids up in (the deep-sky table): its bodies are found by id
 * but not listed by `ids()`, so lists of every target stay the planets, the Moon and loaded objects.
 */
export interface BodyCatalogue {
  /** The body with this lower-case id (or alias), or undefined. */
  find(id: string): Body | undefined;
  /** Every id it knows, for "did you mean" hints. */
  ids(): readonly string[];
  /** What its ids look like, for error messages ("a Messier or NGC id from the deep-sky catalogue, such as m31 or ngc869"). */
  readonly expected: string;
}

/** A registry of bodies: the built-in ones plus any objects loaded from `content/objects/`, and catalogues looked up by id. */
export class BodyRegistry {
  readonly #extra = new Map<string, Body>();
  readonly #catalogues: readonly BodyCatalogue[];

  constructor(options: { catalogues?: readonly BodyCatalogue[] } = {}) {
    this.#catalogues = options.catalogues ?? [];
  }

  /** The catalogues this registry looks ids up in (a registry built from this one can share them). */
  get catalogues(): readonly BodyCatalogue[] {
    return this.#catalogues;
  }

  /** Adds an object; its id must not clash with a built-in body or another object. */
  add(body: Body): this {
    if (BUILT_IN.has(body.id) || this.#extra.has(body.id)) {
      throw new GloamingError('invalid-value', `body id '${body.id}' is already taken`, {
        place: { field: 'id' },
        actual: body.id,
        expected: 'an id not used by a built-in body or another object',
      });
    }
    this.#extra.set(body.id, body);
    return this;
  }

  /** All known ids: built-in first, then objects in the order they were added. */
  ids(): string[] {
    return [...BUILT_IN.keys(), ...this.#extra.keys()];
  }

  /** Looks up a body by id (case-insensitive); unknown ids raise `unknown-body` with a suggestion. */
  get(id: string, place?: { field?: string }): Body {
    const key = id.trim().toLowerCase();
    const found = BUILT_IN.get(key) ?? this.#extra.get(key);
    if (found) return found;
    for (const c of this.#catalogues) {
      const b = c.find(key);
      if (b) return b;
    }
    const hint = didYouMean(key, [...this.ids(), ...this.#catalogues.flatMap((c) => c.ids())]);
    const catalogued = this.#catalogues.map((c) => ` or ${c.expected}`).join('');
    throw new GloamingError('unknown-body', `unknown ${this.#catalogues.length ? 'object' : 'body'} '${id}'`, {
      ...(place ? { place } : {}),
      expected: `one of ${this.ids().join(', ')}${catalogued}`,
      ...(hint ? { hint } : {}),
    });
  }
}

/** The built-in body with this id (sun, moon, mercury … neptune). */
export function builtInBody(id: (typeof BUILT_IN_IDS)[number]): EngineBody {
  return BUILT_IN.get(id)!;
}

/**
 * A body's expected magnitude for a night: at local midnight, the one moment every page, chart,
 * verdict and week summary uses (a fast comet changes by a few hundredths over a night).
 */
export function nightMagnitude(night: Night, body: Body): MagnitudeEstimate {
  return body.illumination(Astronomy.MakeTime(localMidnight(night))).magnitude;
}
