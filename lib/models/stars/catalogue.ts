/**
 * The bright-star table: every star to V 5.5 and every star a pattern uses, from the Hipparcos
 * compilation XHIP as shipped in d3-celestial's data (see scripts/build-stars.ts, which generates
 * catalogue.json, and LICENSES/d3-celestial-data.txt).
 *
 * Positions are ICRS (J2000 equator and equinox) at epoch J2000.0; the source has no proper
 * motions, so a star is off its place of date by proper motion × (year − 2000): under 3″ by
 * 2030 for most stars, about 1′–2.6′ for the fastest (Arcturus, α Cen, 61 Cyg).
 */
import { readFileSync } from 'node:fs';
import { GloamingError, didYouMean } from '../../core/errors.ts';

/** One star of the table. */
export interface Star {
  /** Hipparcos catalogue number. */
  hip: number;
  /** Right ascension, ICRS/J2000, degrees 0–360. */
  raDeg: number;
  /** Declination, ICRS/J2000, degrees −90…+90. */
  decDeg: number;
  /** Visual (Johnson V) magnitude. */
  vMag: number;
  /** B−V colour index in magnitudes, or null when the source gives none. */
  bv: number | null;
  /** Bayer letter with component digit as in the source ("α", "α1", "c"), or "" when none. */
  bayer: string;
  /** Flamsteed number as a string ("58"), or "" when none. */
  flamsteed: string;
  /** Proper name (IAU-approved name as given by the source), or "" when none. */
  name: string;
  /** IAU constellation abbreviation ("Ori"): the constellation whose boundaries hold the star. */
  con: string;
  /**
   * Constellation of the star's Bayer/Flamsteed designation when it differs from `con` (a few
   * Flamsteed stars lie outside the constellation of their number, e.g. 10 UMa in Lynx), else "".
   */
  designationCon: string;
  /** Bayer (preferred) or Flamsteed designation with constellation, e.g. "α¹ Cru", "61 Cyg"; "HIP n" when neither exists. */
  designation: string;
  /** The name to show a reader: the proper name, else the designation. */
  label: string;
}

type Row = [number, number, number, number, number | null, string, string, string, string, string];

interface CatalogueFile {
  source: string;
  epochNote: string;
  nameNote: string;
  magnitudeLimit: number;
  fields: string[];
  constellationFromBoundaries: number[];
  stars: Row[];
}

const SUPERSCRIPT: Record<string, string> = {
  '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹',
};

function designationOf(bayer: string, flamsteed: string, con: string, hip: number): string {
  if (bayer) return `${bayer.replace(/\d/g, (d) => SUPERSCRIPT[d] ?? d)} ${con}`;
  if (flamsteed) return `${flamsteed} ${con}`;
  return `HIP ${hip}`;
}

let cache: { file: CatalogueFile; list: Star[]; byHip: Map<number, Star>; byName: Map<string, Star> } | null = null;

function load(): NonNullable<typeof cache> {
  if (cache) return cache;
  const file = JSON.parse(readFileSync(new URL('./catalogue.json', import.meta.url), 'utf8')) as CatalogueFile;
  const list: Star[] = file.stars.map(([hip, raDeg, decDeg, vMag, bv, bayer, flamsteed, name, con, designationCon]) => {
    const designation = designationOf(bayer, flamsteed, designationCon || con, hip);
    return { hip, raDeg, decDeg, vMag, bv, bayer, flamsteed, name, con, designationCon, designation, label: name || designation };
  });
  const byHip = new Map(list.map((s) => [s.hip, s]));
  const byName = new Map<string, Star>();
  for (const s of list) if (s.name) byName.set(s.name.toLowerCase(), s);
  cache = { file, list, byHip, byName };
  return cache;
}

/** All stars of the table, sorted by Hipparcos number. The array and its stars must not be modified. */
export function stars(): readonly Star[] {
  return load().list;
}

/** The star with this Hipparcos number, or undefined when it is not in the table. */
export function starByHip(hip: number): Star | undefined {
  return load().byHip.get(hip);
}

/**
 * The star with this proper name (case-insensitive, e.g. "Vega"). Throws a `GloamingError`
 * ('invalid-value') with a "did you mean" hint when no star of the table has the name.
 */
export function starByName(name: string): Star {
  const { byName } = load();
  const star = byName.get(name.trim().toLowerCase());
  if (star) return star;
  const hint = didYouMean(name, [...byName.values()].map((s) => s.name));
  throw new GloamingError('invalid-value', 'No star of the bright-star table has this name', {
    actual: name,
    expected: 'a proper name such as "Vega" or "Regulus"',
    ...(hint ? { hint } : {}),
  });
}

/** Provenance of the table: source, epoch note, name note, magnitude limit. */
export function catalogueInfo(): { source: string; epochNote: string; nameNote: string; magnitudeLimit: number; constellationFromBoundaries: readonly number[] } {
  const { file } = load();
  return {
    source: file.source,
    epochNote: file.epochNote,
    nameNote: file.nameNote,
    magnitudeLimit: file.magnitudeLimit,
    constellationFromBoundaries: file.constellationFromBoundaries,
  };
}
