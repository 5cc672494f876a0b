/**
 * A deep-sky object or double star as a `Body`: a fixed direction (J2000) far outside the solar
 * system, so every later step (tracks, rise and set, visibility, guide phrases, charts) treats it
 * as it treats a planet.
 */
import * as Astronomy from 'astronomy-engine';
import type { Body } from '../../core/body.ts';

/** What a deep-sky object is, as pages word it. */
export type DeepSkyType = 'open-cluster' | 'globular-cluster' | 'nebula' | 'planetary-nebula' | 'galaxy' | 'double-star';

/** One row of the table. */
export interface DeepSkyObject {
  /** Catalogue designation for readers: "M 31", "NGC 869", "β Cyg". */
  id: string;
  /** Attribute id: "m31", "ngc869", "albireo". */
  slug: string;
  /** Further attribute ids (a Messier object's NGC number: "ngc224"). */
  aliases: string[];
  type: DeepSkyType;
  /** IAU constellation abbreviation (from the boundaries). */
  con: string;
  /** Right ascension and declination, J2000, degrees. */
  raDeg: number;
  decDeg: number;
  /** Total V magnitude; for a double star, the fainter star's. */
  mag: number;
  /** Axes of the object's ellipse, arcminutes (0 for a double star). */
  majorArcmin: number;
  minorArcmin: number;
  /** Mean V surface brightness over the ellipse, mag/arcsec² (null for a double star). */
  surfaceBrightness: number | null;
  /** Proper names by language (en, es, de, fr), where the source has one. */
  names: Partial<Record<'en' | 'es' | 'de' | 'fr', string>>;
  /** For a double star: its two stars, their magnitudes and their separation, arcseconds. */
  pair: { components: string[]; magnitudes: number[]; separationArcsec: number } | null;
  /** Where the row comes from. */
  source: string;
}

/** The distance the direction is scaled to, AU: far enough that the observer's place on the Earth moves it by < 10⁻⁹″. */
const FAR_AU = 1e10;
const RAD = Math.PI / 180;

/** The Earth's barycentric velocity (AU/day, J2000) by time, shared by every object: they ask at the same grid times. */
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
 * A reader's name: "M 31 (Andromeda Galaxy)", or the designation alone when the language has no
 * name. Objects of the lesser-known catalogues (Collinder, Caldwell, PGC) and double stars lead
 * with their name: "Large Magellanic Cloud (PGC 17223)", "Albireo (β Cyg)".
 */
function displayName(object: DeepSkyObject, name: string | undefined): string {
  if (!name) return object.id;
  return /^(M|NGC|IC) /.test(object.id) ? `${object.id} (${name})` : `${name} (${object.id})`;
}

/**
 * The body of a catalogue row. `geoVector` is the J2000 direction (EQJ) times `FAR_AU`; with
 * `aberration: true` the Earth's barycentric velocity v is added as v·τ with τ = FAR_AU / c, the
 * annual aberration (up to 20.5″), which is what astronomy-engine's back-dated positions give a
 * planet when the light time is long. Proper motions are not applied (none of these objects moves
 * by 1″ a century, except the double stars' own stars, whose table has no proper motions).
 * Magnitude: the object's total magnitude (a double star's fainter star, the one that decides
 * whether the pair is seen); phase and distances are those of a far point.
 */
export function fixedBody(object: DeepSkyObject): Body {
  const ra = object.raDeg * RAD;
  const dec = object.decDeg * RAD;
  const ux = Math.cos(dec) * Math.cos(ra);
  const uy = Math.cos(dec) * Math.sin(ra);
  const uz = Math.sin(dec);
  const lightDays = FAR_AU / Astronomy.C_AUDAY;
  const localNames: Record<string, string> = {};
  for (const lang of ['es', 'de', 'fr'] as const) localNames[lang] = displayName(object, object.names[lang]);
  return {
    id: object.slug,
    name: displayName(object, object.names.en),
    kind: 'deep-sky',
    radiusKm: 0,
    ...(object.majorArcmin > 0 ? { extentArcmin: { major: object.majorArcmin, minor: object.minorArcmin } } : {}),
    ...(object.pair ? { pairSeparationArcsec: object.pair.separationArcsec } : {}),
    localNames,
    geoVector(time, { aberration }) {
      if (!aberration) return new Astronomy.Vector(ux * FAR_AU, uy * FAR_AU, uz * FAR_AU, time);
      const v = earthVelocity(time);
      return new Astronomy.Vector(ux * FAR_AU + v.vx * lightDays, uy * FAR_AU + v.vy * lightDays, uz * FAR_AU + v.vz * lightDays, time);
    },
    illumination() {
      return { heliocentricDistanceAu: FAR_AU, geocentricDistanceAu: FAR_AU, phaseAngleDeg: 0, illuminatedFraction: 1, magnitude: { value: object.mag } };
    },
  };
}
