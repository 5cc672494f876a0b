/**
 * A deep-sky object or double star as a `Body`: a fixed direction (J2000) far outside the solar
 * system, so every later step (tracks, rise and set, visibility, guide phrases, charts) treats it
 * as it treats a planet.
 */
import { fixedDirectionBody, type Body } from '../../core/body.ts';

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
 * The body of a catalogue row: a fixed direction (`fixedDirectionBody`, with the annual
 * aberration) with the object's total magnitude (a double star's fainter star, the one that
 * decides whether the pair is seen), size, separation and names.
 */
export function fixedBody(object: DeepSkyObject): Body {
  const localNames: Record<string, string> = {};
  for (const lang of ['es', 'de', 'fr'] as const) localNames[lang] = displayName(object, object.names[lang]);
  return fixedDirectionBody({
    id: object.slug,
    name: displayName(object, object.names.en),
    kind: 'deep-sky',
    raDeg: object.raDeg,
    decDeg: object.decDeg,
    vMag: object.mag,
    ...(object.majorArcmin > 0 ? { extentArcmin: { major: object.majorArcmin, minor: object.minorArcmin } } : {}),
    ...(object.pair ? { pairSeparationArcsec: object.pair.separationArcsec } : {}),
    localNames,
  });
}
