/**
 * Builds lib/models/stars/catalogue.json, the compact bright-star table, from the star data of the
 * `d3-celestial` npm package (devDependency; BSD-3-Clause, notice in LICENSES/d3-celestial-data.txt).
 * Only its star data files are read: none of its code, line figures, asterisms or styles.
 *
 *   node scripts/build-stars.ts        (Node ≥ 22.6 with type stripping; `npx node …` uses the pinned one)
 *
 * Inputs (node_modules/d3-celestial/data/):
 * - `stars.8.json`: GeoJSON points, id = Hipparcos number, properties.mag = V, properties.bv = B−V
 *   (a string, sometimes empty), coordinates [longitude, latitude] = [RA in degrees folded to
 *   −180…180, Dec in degrees], J2000 epoch and equinox (XHIP, Anderson & Francis 2012).
 *   No proper motions are given, so positions stay at epoch J2000 (see `epochNote`).
 * - `starnames.json`: keyed by Hipparcos number; fields `name` (proper name; the package documents it
 *   as the official IAU name), `bayer` (Greek letter or Latin letter, with a digit for components,
 *   e.g. `α1`), `flam` (Flamsteed number), `c` (IAU constellation abbreviation). All fields optional.
 * - `lib/models/stars/patterns.yaml`: every star a pattern uses is kept even when fainter than the limit.
 *
 * Output rows: [hip, raDeg, decDeg, vMag, bv | null, bayer, flamsteed, name, con, designationCon];
 * empty string when a designation or name is missing. `con` is the IAU constellation that holds
 * the star. It is the source's `c` when that agrees with the IAU boundaries (astronomy-engine's
 * `Constellation`); where `c` is missing, malformed or names the constellation of a displaced
 * Flamsteed designation, `con` comes from the boundaries, the star is listed in
 * `constellationFromBoundaries`, and a displaced designation's constellation is kept in
 * `designationCon` (so that "10 UMa" still reads as its designation).
 */
import { readFileSync, writeFileSync, existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Constellation } from 'astronomy-engine';
import { parse } from 'yaml';

const root = fileURLToPath(new URL('..', import.meta.url));
const dataDir = `${root}node_modules/d3-celestial/data/`;
const patternsFile = `${root}lib/models/stars/patterns.yaml`;
const outFile = `${root}lib/models/stars/catalogue.json`;

/** Every star to this V magnitude is kept. */
const MAG_LIMIT = 5.5;

/**
 * Labels in the `name` field that are not names of single stars (from memory: a cluster and an
 * infrared source that share θ¹ Ori's Hipparcos entries, and the nickname of the ε Lyr system).
 */
const NOT_STAR_NAMES = new Set(['Trapezium', "Becklin's Star", 'Double Double']);

interface StarFeature {
  id: number;
  properties: { mag: number; bv: string };
  geometry: { coordinates: [number, number] };
}
interface NameEntry {
  name?: string;
  bayer?: string;
  flam?: string;
  c?: string;
}

const features = (JSON.parse(readFileSync(`${dataDir}stars.8.json`, 'utf8')) as { features: StarFeature[] }).features;
const names = JSON.parse(readFileSync(`${dataDir}starnames.json`, 'utf8')) as Record<string, NameEntry>;

const patternHips = new Set<number>();
if (existsSync(patternsFile)) {
  const doc = parse(readFileSync(patternsFile, 'utf8')) as { patterns?: { stars?: number[] }[] };
  for (const p of doc.patterns ?? []) for (const hip of p.stars ?? []) patternHips.add(hip);
}

const round = (x: number, digits: number): number => Number(x.toFixed(digits));

const selected = features.filter((f) => f.properties.mag <= MAG_LIMIT || patternHips.has(f.id));
const selectedIds = new Set(selected.map((f) => f.id));
const missing = [...patternHips].filter((hip) => !selectedIds.has(hip));
if (missing.length) {
  console.error(`patterns use stars missing from stars.8.json: ${missing.join(', ')}`);
  process.exitCode = 1;
}

// A proper name must name one star: where the field repeats a name, keep it on the brightest.
const brightestWithName = new Map<string, { hip: number; mag: number }>();
for (const f of selected) {
  const name = names[String(f.id)]?.name;
  if (!name) continue;
  const prev = brightestWithName.get(name);
  if (!prev || f.properties.mag < prev.mag) brightestWithName.set(name, { hip: f.id, mag: f.properties.mag });
}

type Row = [number, number, number, number, number | null, string, string, string, string, string];
const rows: Row[] = [];
const conFromBoundaries: number[] = [];
for (const f of selected.sort((a, b) => a.id - b.id)) {
  const [lon, lat] = f.geometry.coordinates;
  const raDeg = round(lon < 0 ? lon + 360 : lon, 4);
  const decDeg = round(lat, 4);
  const entry = names[String(f.id)] ?? {};
  // One entry has bayer "undefined3" (a glitch in the source): treat it as having no Bayer letter.
  const bayer = entry.bayer && !entry.bayer.startsWith('undefined') ? entry.bayer : '';
  let name = entry.name ?? '';
  if (NOT_STAR_NAMES.has(name) || (name && brightestWithName.get(name)?.hip !== f.id)) name = '';
  // `c` in starnames.json is the constellation of the star's designation. It is also the IAU
  // constellation that holds the star, except for a few Flamsteed stars left outside their
  // constellation when the boundaries were drawn (e.g. 10 UMa lies in Lynx): `con` is the
  // constellation by the IAU boundaries; `designationCon` keeps the designation's one when it differs.
  const sourceCon = entry.c && /^[A-Z][A-Za-z]{2}$/.test(entry.c) ? entry.c : '';
  const boundaryCon = Constellation(raDeg / 15, decDeg).symbol;
  let con = sourceCon;
  let designationCon = '';
  if (sourceCon !== boundaryCon) {
    con = boundaryCon;
    if (sourceCon) designationCon = sourceCon;
    conFromBoundaries.push(f.id);
  }
  const bv = f.properties.bv === '' ? null : round(Number(f.properties.bv), 3);
  rows.push([f.id, raDeg, decDeg, f.properties.mag, bv, bayer, entry.flam ?? '', name, con, designationCon]);
}

const header = {
  source:
    'd3-celestial 0.7.35 data/stars.8.json and data/starnames.json (XHIP, Anderson & Francis 2012; BSD-3-Clause, see LICENSES/d3-celestial-data.txt). Generated by scripts/build-stars.ts; do not edit by hand.',
  epochNote:
    'Positions are ICRS/J2000 at epoch J2000.0, rounded to 0.0001° (0.36″). The source has no proper motions, so none are applied: a star moves by its proper motion × (year − 2000) from the tabulated place, under 3″ by 2030 for most stars but about 1.1′ for Arcturus, 1.8′ for α Cen and 2.6′ for 61 Cyg (proper motions from memory). Negligible for pattern descriptions at degree scale.',
  nameNote:
    "name: the `name` field of starnames.json (documented by d3-celestial as the official IAU name); a name the field gives to several stars is kept on the brightest only, and labels that are not star names are dropped.",
  magnitudeLimit: MAG_LIMIT,
  fields: ['hip', 'raDeg', 'decDeg', 'vMag', 'bv', 'bayer', 'flamsteed', 'name', 'con', 'designationCon'],
  constellationFromBoundaries: conFromBoundaries,
};

const body = rows.map((r) => JSON.stringify(r)).join(',\n');
const headerText = Object.entries(header)
  .map(([key, value]) => `  ${JSON.stringify(key)}: ${JSON.stringify(value)}`)
  .join(',\n');
const text = `{\n${headerText},\n  "stars": [\n${body}\n]}\n`;
writeFileSync(outFile, text);
console.log(`wrote ${rows.length} stars (${patternHips.size} pattern stars) to ${outFile}`);
