/**
 * Builds lib/models/deep-sky/catalogue.json, the curated deep-sky table (bright clusters, nebulae,
 * galaxies and a few double stars), from the deep-sky data of the `d3-celestial` npm package
 * (devDependency; BSD-3-Clause, notice in LICENSES/d3-celestial-data.txt) and, for the double
 * stars, from our own bright-star table (lib/models/stars/catalogue.json, built by build-stars.ts).
 * Only data files are read: none of the package's code or styles. Deterministic: the same package
 * version gives the same bytes.
 *
 *   node scripts/build-deep-sky.ts [--out <file>]       (`npx node …` uses the pinned Node)
 *
 * Inputs (node_modules/d3-celestial/data/); the package's readme names its sources:
 * - `messier.json`: the Messier objects, from "Messier Objects with Data", H. Frommert, SEDS
 *   (messier.seds.org/data.html): id "M31", `desig` (NGC number), `alt` (English name), `type`,
 *   `mag` (V, total), `dim` (arcminutes, "190x60" or "16"), coordinates [RA folded to −180…180°, Dec]
 *   at J2000.
 * - `dsos.bright.json` (hand-selected bright objects) and `dsos.6.json` (to magnitude 6): from the
 *   Saguaro Astronomy Club Database version 8.1, same fields.
 * - `dsonames.json`: proper names keyed by the most common designation, in English (`name`) and
 *   further languages (`es`, `de`, `fr` among them).
 *
 * Selection (the "public showpieces"): every Messier object of total magnitude ≤ `MESSIER_MAG_LIMIT`
 * except the three that are not clusters, nebulae or galaxies (M 24, a Milky Way star cloud; M 40, a
 * double star; M 73, an asterism), then the objects of `EXTRA` (bright clusters, nebulae and the
 * Magellanic Clouds, many of them southern), then the double stars of `DOUBLES`.
 */
import { readFileSync, writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Constellation } from 'astronomy-engine';
import { meanSurfaceBrightness } from '../lib/models/sky/extended.ts';
import type { DeepSkyObject, DeepSkyType } from '../lib/models/deep-sky/body.ts';

const root = fileURLToPath(new URL('..', import.meta.url));
const dataDir = `${root}node_modules/d3-celestial/data/`;
const starsFile = `${root}lib/models/stars/catalogue.json`;
/** Where to write: `--out <file>` (the test writes a copy to compare), else the committed table. */
const outArg = process.argv.indexOf('--out');
const outFile = outArg > 0 && process.argv[outArg + 1] ? process.argv[outArg + 1]! : `${root}lib/models/deep-sky/catalogue.json`;

/** Messier objects to this total V magnitude are kept. */
const MESSIER_MAG_LIMIT = 9.0;
/** Messier entries that are not deep-sky showpieces (see the header). */
const MESSIER_SKIP = new Set(['M24', 'M40', 'M73']);

/** Further objects, by the source's id, in the order they are listed. */
const EXTRA = [
  'NGC 869', 'NGC 884', 'Cr 39', 'C 41', 'NGC 752', 'Cr 256', 'Cr 399', 'IC 4665', 'NGC 6633', 'NGC 7000',
  'NGC 2244', 'NGC 2264', 'NGC 2362', 'NGC 2451', 'NGC 2477', 'NGC 2547', 'NGC 2516', 'IC 2391', 'IC 2602',
  'NGC 3372', 'NGC 3532', 'NGC 3766', 'NGC 4755', 'NGC 5139', 'NGC 6025', 'NGC 6231', 'NGC 6397', 'NGC 104',
  'NGC 292', 'PGC 17223',
];

/**
 * Double stars: both components must be in the bright-star table, which gives their positions and
 * magnitudes; the separation is computed from those positions (epoch J2000).
 */
const DOUBLES = [
  { id: 'β Cyg', slug: 'albireo', hips: [95947, 95951], names: { en: 'Albireo', es: 'Albireo', de: 'Albireo', fr: 'Albireo' } },
  { id: 'ζ UMa + 80 UMa', slug: 'mizar-alcor', hips: [65378, 65477], names: { en: 'Mizar and Alcor', es: 'Mizar y Alcor', de: 'Mizar und Alcor', fr: 'Mizar et Alcor' } },
  { id: 'ε Lyr', slug: 'epsilon-lyrae', hips: [91919, 91926], names: { en: 'Double Double', es: 'Doble Doble', de: 'Doppel-Doppelstern', fr: 'Double Double' } },
  { id: 'γ Del', slug: 'gamma-delphini', hips: [102532, 102531], names: {} },
] as const;

type SourceType = 'gc' | 'oc' | 's' | 's0' | 'sd' | 'e' | 'i' | 'g' | 'gg' | 'en' | 'bn' | 'sfr' | 'rn' | 'dn' | 'pn' | 'snr' | 'pos';
interface DsoFeature {
  id: string;
  properties: { desig: string; alt?: string; type: SourceType; mag: number | string; dim: string };
  geometry: { coordinates: [number, number] };
}
type Names = Partial<Record<'en' | 'es' | 'de' | 'fr', string>>;

/** Our object types (the words pages use), from the source's type codes ('pos', a star field or asterism, is never selected). */
const TYPES: Partial<Record<SourceType, DeepSkyType>> = {
  gc: 'globular-cluster',
  oc: 'open-cluster',
  s: 'galaxy', s0: 'galaxy', sd: 'galaxy', e: 'galaxy', i: 'galaxy', g: 'galaxy', gg: 'galaxy',
  en: 'nebula', bn: 'nebula', sfr: 'nebula', rn: 'nebula', dn: 'nebula', snr: 'nebula',
  pn: 'planetary-nebula',
};

const load = (file: string): DsoFeature[] => (JSON.parse(readFileSync(`${dataDir}${file}`, 'utf8')) as { features: DsoFeature[] }).features;
const dsoNames = JSON.parse(readFileSync(`${dataDir}dsonames.json`, 'utf8')) as Record<string, Record<string, string>>;

/** "M 31" → "m31", "NGC 869" → "ngc869", "Cr 399" → "cr399": lower case, no spaces. */
const slugOf = (id: string): string => id.toLowerCase().replace(/[^a-z0-9]+/g, '');
const round = (x: number, digits: number): number => Number(x.toFixed(digits));

function dimensions(dim: string, where: string): [number, number] {
  const parts = dim.split('x').map(Number);
  if (!parts.length || parts.some((p) => !(p > 0))) throw new Error(`${where}: no usable size '${dim}'`);
  const [a, b = a] = parts as [number, number?];
  return [Math.max(a, b!), Math.min(a, b!)];
}

function namesFor(...keys: string[]): Names {
  for (const k of keys) {
    const n = dsoNames[k];
    if (n?.name) {
      const out: Names = { en: n.name };
      for (const lang of ['es', 'de', 'fr'] as const) if (n[lang]) out[lang] = n[lang];
      return out;
    }
  }
  return {};
}

type Entry = DeepSkyObject;

function entry(f: DsoFeature, id: string, aliases: string[], names: Names, source: string): Entry {
  const [lon, decDeg] = f.geometry.coordinates;
  const raDeg = lon < 0 ? lon + 360 : lon;
  const mag = Number(f.properties.mag);
  if (!(mag < 30)) throw new Error(`${id}: no magnitude`);
  const [major, minor] = dimensions(f.properties.dim, id);
  const type = TYPES[f.properties.type];
  if (!type) throw new Error(`${id}: type '${f.properties.type}' is not a deep-sky showpiece`);
  return {
    id,
    slug: slugOf(id),
    aliases: aliases.map(slugOf).filter((a) => a !== slugOf(id)),
    type,
    con: Constellation(raDeg / 15, decDeg).symbol,
    raDeg: round(raDeg, 4),
    decDeg: round(decDeg, 4),
    mag,
    majorArcmin: major,
    minorArcmin: minor,
    surfaceBrightness: round(meanSurfaceBrightness(mag, major, minor), 2),
    names,
    pair: null,
    source,
  };
}

const out: Entry[] = [];
for (const f of load('messier.json')) {
  if (MESSIER_SKIP.has(f.id) || Number(f.properties.mag) > MESSIER_MAG_LIMIT) continue;
  const id = f.id.replace(/^M/, 'M ');
  // "NGC 5194/5" (M 51) names two NGC numbers: the first is the galaxy's.
  const ngc = f.properties.desig.split('/')[0]!.trim();
  const names = namesFor(id, ngc);
  if (!names.en && f.properties.alt) names.en = f.properties.alt.replace('´', '’');
  out.push(entry(f, id, ngc ? [ngc] : [], names, 'SEDS Messier data'));
}
const known = new Set(out.flatMap((e) => [e.slug, ...e.aliases]));
const sac = new Map<string, DsoFeature>();
for (const f of [...load('dsos.bright.json'), ...load('dsos.6.json')]) if (!sac.has(f.id)) sac.set(f.id, f);
for (const id of EXTRA) {
  const f = sac.get(id);
  if (!f) throw new Error(`${id} is not in the package's deep-sky data`);
  if (known.has(slugOf(id))) throw new Error(`${id} is already in the table`);
  out.push(entry(f, id, [], namesFor(id), 'SAC 8.1'));
}

interface StarFile {
  stars: [number, number, number, number, number | null, string, string, string, string, string][];
}
const starRows = new Map((JSON.parse(readFileSync(starsFile, 'utf8')) as StarFile).stars.map((r) => [r[0], r]));
const RAD = Math.PI / 180;
for (const d of DOUBLES) {
  const [a, b] = d.hips.map((h) => {
    const row = starRows.get(h);
    if (!row) throw new Error(`${d.id}: HIP ${h} is not in the bright-star table`);
    return row;
  }) as [NonNullable<ReturnType<typeof starRows.get>>, NonNullable<ReturnType<typeof starRows.get>>];
  // Angular separation (haversine) of the two J2000 positions.
  const s = Math.sin(((b[2] - a[2]) * RAD) / 2) ** 2 + Math.cos(a[2] * RAD) * Math.cos(b[2] * RAD) * Math.sin(((b[1] - a[1]) * RAD) / 2) ** 2;
  const separationArcsec = (2 * Math.asin(Math.sqrt(s))) / RAD * 3600;
  out.push({
    id: d.id,
    slug: d.slug,
    aliases: [],
    type: 'double-star',
    con: a[8],
    raDeg: a[1],
    decDeg: a[2],
    mag: Math.max(a[3], b[3]),
    majorArcmin: 0,
    minorArcmin: 0,
    surfaceBrightness: null,
    names: d.names,
    pair: { components: [`HIP ${a[0]}`, `HIP ${b[0]}`], magnitudes: [a[3], b[3]], separationArcsec: round(separationArcsec, 1) },
    source: 'bright-star table (XHIP)',
  });
}

const file = {
  source:
    'Derived by scripts/build-deep-sky.ts from d3-celestial 0.7.35 data: messier.json (SEDS, "Messier Objects with Data", H. Frommert), ' +
    'dsos.bright.json and dsos.6.json (Saguaro Astronomy Club Database 8.1), dsonames.json (names); double stars from lib/models/stars/catalogue.json (XHIP).',
  surfaceBrightnessNote: 'Mean V surface brightness over the ellipse, mag/arcsec²: S = m + 2.5 log10(π a b / 4), a and b in arcseconds.',
  selection: `Messier objects to V ${MESSIER_MAG_LIMIT} except ${[...MESSIER_SKIP].join(', ')}; ${EXTRA.length} further objects; ${DOUBLES.length} double stars.`,
  objects: out,
};
writeFileSync(outFile, `${JSON.stringify(file, null, 1)}\n`);
console.log(`wrote ${out.length} objects to ${outFile}`);
