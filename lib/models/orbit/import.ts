/**
 * Orbital elements from the trade's standard sources, read into gloaming's object files
 * (`content/objects/<id>.yaml`, lib/orbit/elements.ts):
 *
 * - the IAU Minor Planet Center's one-line formats: comets ("Export Format for Comet Orbits",
 *   the form of the *Ephemerides and Orbital Elements* lists and of `CometEls.txt`) and minor
 *   planets ("Export Format for Minor-Planet Orbits", the form of `MPCORB.DAT`), with packed
 *   numbers, designations and dates as the MPC documents them ("Packed Designations",
 *   "Packed Dates");
 * - the element fields of JPL's Small-Body Database (`e a q i om w ma tp epoch`, with `M1 K1`
 *   or `H G`; the SBDB API documentation, ssd-api.jpl.nasa.gov/doc/sbdb.html): the API's JSON
 *   answer, or `name=value` pairs on one line.
 *
 * Columns are 1-based and inclusive, as in the MPC's tables. Every reader returns the object
 * file's data (validated by `validateObject`) with a `source` naming the format, reference and
 * epoch; a malformed line is a `GloamingError` naming the columns (or field) and what was expected.
 * All MPC and SBDB angles are J2000 ecliptic and equinox, times TT (SBDB: TDB, < 2 ms from TT).
 */
import { GloamingError } from '../../core/errors.ts';
import { JD_J2000, parseTtInstant, toConicElements, type SmallBodyObject } from './elements.ts';

/** One object file's data, as `validateObject` reads it. */
export interface ImportedObject {
  id: string;
  name: string;
  /** The names on pages in other languages (kept from the file an import replaces). */
  names?: SmallBodyObject['names'];
  kind: 'comet' | 'asteroid';
  elements: Record<string, number | string>;
  magnitude: Record<string, number>;
  source: string;
}

export type ElementFormat = 'mpc-comet' | 'mpc-minor-planet' | 'sbdb';

function bad(reason: string, expected: string, actual?: unknown, field?: string): never {
  throw new GloamingError('invalid-value', reason, { ...(field ? { place: { field } } : {}), expected, ...(actual !== undefined ? { actual } : {}) });
}

/** Characters `from`–`to` (1-based, inclusive) of a fixed-width line, trimmed. */
function cols(line: string, from: number, to: number): string {
  return line.slice(from - 1, to).trim();
}

/** A number from columns `from`–`to`; blank gives undefined unless `required`. */
function numberAt(line: string, from: number, to: number, what: string, required = true): number | undefined {
  const text = cols(line, from, to);
  if (text === '') {
    if (required) bad(`columns ${from}–${to} (${what}) are blank`, `${what} in columns ${from}–${to}`, undefined, `columns ${from}-${to}`);
    return undefined;
  }
  if (!/^[+-]?(\d+\.?\d*|\.\d+)$/.test(text)) bad(`columns ${from}–${to} (${what}) do not hold a number`, `${what} in columns ${from}–${to} (check that the line is not shifted)`, text, `columns ${from}-${to}`);
  return Number(text);
}

/** Digits of the MPC's packed forms: 0–9, A–Z = 10–35, a–z = 36–61. */
function base62(char: string): number {
  const code = char.charCodeAt(0);
  if (code >= 48 && code <= 57) return code - 48;
  if (code >= 65 && code <= 90) return code - 55;
  if (code >= 97 && code <= 122) return code - 61;
  return NaN;
}

function toBase62(n: number, width: number): string {
  const digits = '0123456789ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz';
  let s = '';
  for (let i = 0; i < width; i++) {
    s = digits[n % 62] + s;
    n = Math.floor(n / 62);
  }
  return s;
}

const CENTURY_LETTERS = 'ABCDEFGHIJKL'; // A = 10 (1000s) … I = 18, J = 19, K = 20, L = 21

/**
 * A packed date (MPC "Packed Dates"): century letter (I = 18, J = 19, K = 20), two digits of the
 * year, the month and the day as one character each (1–9, then A = 10 … V = 31). `K01AM` is
 * 2001 October 22. Returns YYYY-MM-DD.
 */
export function unpackDate(packed: string): string {
  const m = /^([A-L])(\d\d)([1-9A-C])([1-9A-V])$/.exec(packed);
  if (!m) bad(`'${packed}' is not a packed date`, 'five characters such as K24AH (century letter, year, month 1–C, day 1–V)', packed);
  const year = (CENTURY_LETTERS.indexOf(m[1]!) + 10) * 100 + Number(m[2]);
  const month = base62(m[3]!);
  const day = base62(m[4]!);
  const check = new Date(Date.UTC(year, month - 1, day));
  if (check.getUTCMonth() !== month - 1) bad(`'${packed}' is not a date`, 'a day that exists in its month', packed);
  return `${year}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** The packed form of a YYYY-MM-DD date. */
export function packDate(date: string): string {
  const [y, mo, d] = date.split('-').map(Number) as [number, number, number];
  return `${CENTURY_LETTERS[Math.floor(y / 100) - 10]}${String(y % 100).padStart(2, '0')}${toBase62(mo, 1)}${toBase62(d, 1)}`;
}

/**
 * A packed minor-planet number (MPC "Packed Designations"): five digits up to 99999; a letter and
 * four digits up to 619999 (`A0345` = 100345, `a0017` = 360017); `~` and four base-62 digits from
 * 620000 (`~0000` = 620000).
 */
export function unpackNumber(packed: string): number | null {
  if (/^\d{5}$/.test(packed)) return Number(packed);
  if (/^[A-Za-z]\d{4}$/.test(packed)) return base62(packed[0]!) * 10000 + Number(packed.slice(1));
  if (/^~[0-9A-Za-z]{4}$/.test(packed)) return 620000 + [...packed.slice(1)].reduce((n, c) => n * 62 + base62(c), 0);
  return null;
}

export function packNumber(n: number): string {
  if (n < 100000) return String(n).padStart(5, '0');
  if (n < 620000) return `${toBase62(Math.floor(n / 10000), 1)}${String(n % 10000).padStart(4, '0')}`;
  return `~${toBase62(n - 620000, 4)}`;
}

/**
 * A packed provisional designation of a minor planet (`J95X00A` = 1995 XA, `K07Tf8A` =
 * 2007 TA418: the cycle count in columns 5–6 is a base-62 digit and a decimal digit), or of a
 * comet (`J95O010` = 1995 O1, `J94P01b` = 1994 P1-B: the order number, then a fragment letter or 0).
 */
export function unpackProvisional(packed: string, kind: 'comet' | 'minor-planet'): string {
  const m = /^([A-L])(\d\d)([A-Z])([0-9A-Za-z])(\d)([0-9A-Za-z])$/.exec(packed);
  if (!m) bad(`'${packed}' is not a packed provisional designation`, 'seven characters such as K07Tf8A or K20F030', packed);
  const year = (CENTURY_LETTERS.indexOf(m[1]!) + 10) * 100 + Number(m[2]);
  const count = base62(m[4]!) * 10 + Number(m[5]);
  if (kind === 'minor-planet') return `${year} ${m[3]}${m[6]}${count > 0 ? count : ''}`;
  const fragment = m[6] === '0' ? '' : `-${m[6]!.toUpperCase()}`;
  return `${year} ${m[3]}${count}${fragment}`;
}

/** An id for the object file: the designation as a lower-case slug. */
function idOf(text: string): string {
  return text
    .toLowerCase()
    .replace(/[()]/g, '')
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '');
}

/** Calendar date and fraction of a day (TT) as an ISO instant with seconds. */
function instantOf(year: number, month: number, day: number): string {
  const ms = Date.UTC(year, month - 1, 1) + (day - 1) * 86_400_000;
  return new Date(Math.round(ms / 1000) * 1000).toISOString().replace('.000Z', 'Z');
}

/** A Julian date (TT) as an ISO instant with seconds. */
export function instantOfJd(jd: number): string {
  const ms = (jd - 2440587.5) * 86_400_000;
  return new Date(Math.round(ms / 1000) * 1000).toISOString().replace('.000Z', 'Z');
}

/**
 * One comet line in the MPC's one-line format (`CometEls.txt`; columns as the MPC's "Export Format
 * for Comet Orbits" gives them for the *Ephemerides and Orbital Elements* form):
 *
 *  1–4 periodic number, 5 orbit type (C, P, D, X, I, A), 6–12 packed provisional designation,
 *  15–18 year, 20–21 month, 23–29 day (TT) of perihelion, 31–39 q (AU), 42–49 e,
 *  52–59 ω, 62–69 Ω, 72–79 i (degrees, J2000), 82–85 year, 86–87 month, 88–89 day of the epoch
 *  of osculation (blank for an unperturbed orbit), 92–95 absolute magnitude H, 97–100 slope
 *  parameter G (the comet's M1 and K1 = 2.5 G), 103–158 designation and name, 160–168 reference.
 */
export function readMpcComet(line: string): ImportedObject {
  if (line.length < 100) bad(`the line has ${line.length} characters`, 'an MPC one-line comet orbit of at least 100 characters (columns 1–100; name and reference follow)', line.slice(0, 30));
  const number = cols(line, 1, 4);
  const type = cols(line, 5, 5);
  if (!/^[CPDXIA]$/.test(type)) bad(`column 5 holds '${type}', not an orbit type`, "C, P, D, X, I or A (column 5)", type, 'column 5');
  const packed = cols(line, 6, 12);
  const year = numberAt(line, 15, 18, 'year of perihelion')!;
  const month = numberAt(line, 20, 21, 'month of perihelion')!;
  const day = numberAt(line, 23, 29, 'day of perihelion (TT)')!;
  if (!Number.isInteger(month) || month < 1 || month > 12) bad(`columns 20–21 hold month ${month}`, 'a month 1–12', month, 'columns 20-21');
  const q = numberAt(line, 31, 39, 'perihelion distance q (AU)')!;
  const e = numberAt(line, 42, 49, 'eccentricity e')!;
  const w = numberAt(line, 52, 59, 'argument of perihelion ω (degrees)')!;
  const node = numberAt(line, 62, 69, 'longitude of the ascending node Ω (degrees)')!;
  const i = numberAt(line, 72, 79, 'inclination i (degrees)')!;
  const epochText = cols(line, 82, 89);
  let epoch: string | undefined;
  if (epochText) {
    if (!/^\d{8}$/.test(epochText)) bad(`columns 82–89 hold '${epochText}', not an epoch`, 'YYYYMMDD (the epoch of osculation) or blanks', epochText, 'columns 82-89');
    epoch = `${epochText.slice(0, 4)}-${epochText.slice(4, 6)}-${epochText.slice(6, 8)}T00:00:00Z`;
  }
  const H = numberAt(line, 92, 95, 'absolute magnitude', false);
  const G = numberAt(line, 97, 100, 'slope parameter', false);
  const name = cols(line, 103, 158) || (number ? `${Number(number)}${type}` : `${type}/${unpackProvisional(packed, 'comet')}`);
  const reference = cols(line, 160, 168);
  const designation = number ? `${Number(number)}${type}` : `${type}/${unpackProvisional(packed, 'comet')}`;
  if (H === undefined || G === undefined) bad('the magnitude parameters (columns 92–100) are blank', 'H and G of the comet (its total-magnitude M1 and K1/2.5)', cols(line, 92, 100), 'columns 92-100');
  return {
    id: idOf(name.includes('/') ? name : designation),
    name,
    kind: 'comet',
    elements: {
      perihelionDistance: q,
      eccentricity: e,
      inclination: i,
      ascendingNode: node,
      argumentOfPerihelion: w,
      perihelionTime: instantOf(year, month, day),
      ...(epoch ? { epoch } : {}),
    },
    // The MPC's comet magnitudes: m = H + 5 log Δ + 2.5 G log r, i.e. M1 = H, K1 = 2.5 G.
    magnitude: { M1: H, K1: round(2.5 * G, 6) },
    source: `MPC one-line comet orbit of ${designation}${reference ? `, reference ${reference}` : ''}; ${epoch ? `epoch ${epoch.slice(0, 10)} TT` : 'no epoch (unperturbed)'}`,
  };
}

const round = (x: number, digits: number): number => Number(x.toFixed(digits));

/**
 * One minor planet in the MPC's export format (`MPCORB.DAT`, "Export Format for Minor-Planet
 * Orbits"): 1–7 packed number or provisional designation, 9–13 H, 15–19 G, 21–25 packed epoch
 * (.0 TT), 27–35 M, 38–46 ω, 49–57 Ω, 60–68 i (degrees, J2000), 71–79 e, 81–91 n (degrees a day),
 * 93–103 a (AU), 108–116 reference, 167–194 readable designation.
 */
export function readMpcMinorPlanet(line: string): ImportedObject {
  if (line.length < 103) bad(`the line has ${line.length} characters`, 'an MPC minor-planet orbit (MPCORB.DAT form) of at least 103 characters', line.slice(0, 30));
  const packed = cols(line, 1, 7);
  const number = unpackNumber(packed);
  const provisional = number === null ? unpackProvisional(packed, 'minor-planet') : null;
  const H = numberAt(line, 9, 13, 'absolute magnitude H')!;
  const G = numberAt(line, 15, 19, 'slope parameter G', false) ?? 0.15;
  const epoch = unpackDate(cols(line, 21, 25));
  const M = numberAt(line, 27, 35, 'mean anomaly M (degrees)')!;
  const w = numberAt(line, 38, 46, 'argument of perihelion ω (degrees)')!;
  const node = numberAt(line, 49, 57, 'longitude of the ascending node Ω (degrees)')!;
  const i = numberAt(line, 60, 68, 'inclination i (degrees)')!;
  const e = numberAt(line, 71, 79, 'eccentricity e')!;
  const a = numberAt(line, 93, 103, 'semi-major axis a (AU)')!;
  const reference = cols(line, 108, 116);
  const readable = cols(line, 167, 194);
  const designation = readable || (number !== null ? `(${number})` : provisional!);
  return {
    id: idOf(readable ? readable.replace(/^\((\d+)\)\s*/, '$1 ') : designation),
    name: designation,
    kind: 'asteroid',
    elements: { semiMajorAxis: a, eccentricity: e, inclination: i, ascendingNode: node, argumentOfPerihelion: w, meanAnomaly: M, epoch: `${epoch}T00:00:00Z` },
    magnitude: { H, G },
    source: `MPC minor-planet orbit (MPCORB form) of ${designation}${reference ? `, reference ${reference}` : ''}; epoch ${epoch} TT`,
  };
}

/**
 * JPL Small-Body Database elements: the SBDB API's JSON answer (`object.fullname`, `object.kind`,
 * `orbit.epoch`, `orbit.elements[]` with `name`/`value`, `phys_par[]`), or `name=value` pairs
 * (`e=0.8471 q=0.3302 i=11.78 om=334.2 w=186.5 tp=2460231.1 epoch=2460200.5 M1=11.5 K1=10
 * name="2P/Encke"`); other SBDB fields (n, per, ad, uncertainties) are derived or not used. Times
 * are Julian dates (TDB). A comet (`kind` beginning with c, or M1/K1)
 * keeps the perihelion form; an asteroid the osculating form (a, M at the epoch).
 */
export function readSbdb(text: string): ImportedObject {
  const fields = new Map<string, string>();
  const trimmed = text.trim();
  if (trimmed.startsWith('{')) {
    let json: {
      object?: { fullname?: string; des?: string; kind?: string };
      orbit?: { epoch?: string | number; elements?: { name: string; value: string | number | null }[] };
      phys_par?: { name: string; value: string | number | null }[];
    };
    try {
      json = JSON.parse(trimmed) as typeof json;
    } catch (error) {
      return bad(`the JSON cannot be read: ${(error as Error).message}`, 'the answer of the SBDB API (ssd-api.jpl.nasa.gov/sbdb.api?sstr=…&phys-par=1)', trimmed.slice(0, 40));
    }
    if (!json.orbit?.elements) bad('the JSON has no orbit.elements', 'the answer of the SBDB API for one object (with phys-par=1 for magnitudes)', undefined, 'orbit.elements');
    for (const el of json.orbit.elements) if (el.value !== null && el.value !== undefined) fields.set(el.name, String(el.value));
    for (const p of json.phys_par ?? []) if (p.value !== null && p.value !== undefined) fields.set(p.name, String(p.value));
    if (json.orbit.epoch !== undefined) fields.set('epoch', String(json.orbit.epoch));
    const name = json.object?.fullname ?? json.object?.des;
    if (name) fields.set('name', name.trim());
    if (json.object?.kind) fields.set('kind', json.object.kind);
  } else {
    for (const m of trimmed.matchAll(/([A-Za-z0-9_]+)=("([^"]*)"|\S+)/g)) fields.set(m[1]!, m[3] ?? m[2]!);
    if (fields.size === 0) bad('no name=value pairs', "SBDB fields such as 'e=0.85 q=0.33 i=11.8 om=334.6 w=186.5 tp=2460231.1 epoch=2460200.5 M1=11.5 K1=10'", trimmed.slice(0, 40));
  }
  const num = (name: string, what: string): number => {
    const v = fields.get(name);
    if (v === undefined) bad(`the SBDB field '${name}' (${what}) is missing`, `${name}=… (${what})`, undefined, name);
    const n = Number(v);
    if (!Number.isFinite(n)) bad(`the SBDB field '${name}' is not a number`, what, v, name);
    return n;
  };
  const name = fields.get('name') ?? 'unnamed object';
  const comet = (fields.get('kind') ?? '').startsWith('c') || fields.has('M1');
  const e = num('e', 'eccentricity');
  const angles = { inclination: num('i', 'inclination, degrees'), ascendingNode: num('om', 'longitude of the ascending node, degrees'), argumentOfPerihelion: num('w', 'argument of perihelion, degrees') };
  const epochJd = fields.has('epoch') ? num('epoch', 'epoch of osculation, Julian date TDB') : undefined;
  const epoch = epochJd !== undefined ? instantOfJd(epochJd) : undefined;
  const source = `JPL Small-Body Database elements of ${name}; ${epoch ? `epoch ${epoch.slice(0, 10)} TDB` : 'no epoch given'}`;
  if (comet) {
    const q = fields.has('q') ? num('q', 'perihelion distance, AU') : num('a', 'semi-major axis, AU') * (1 - e);
    return {
      id: idOf(name),
      name,
      kind: 'comet',
      elements: { perihelionDistance: q, eccentricity: e, ...angles, perihelionTime: instantOfJd(num('tp', 'time of perihelion, Julian date TDB')), ...(epoch ? { epoch } : {}) },
      magnitude: { M1: num('M1', 'comet total magnitude parameter'), K1: num('K1', 'comet total magnitude slope') },
      source,
    };
  }
  if (!epoch) bad("the SBDB field 'epoch' is missing", 'epoch=<Julian date> (the epoch of osculation)', undefined, 'epoch');
  return {
    id: idOf(name),
    name,
    kind: 'asteroid',
    elements: { semiMajorAxis: num('a', 'semi-major axis, AU'), eccentricity: e, ...angles, meanAnomaly: num('ma', 'mean anomaly, degrees'), epoch },
    magnitude: { H: num('H', 'absolute magnitude'), G: fields.has('G') ? num('G', 'slope parameter') : 0.15 },
    source,
  };
}

/** Which format a line or file is in. */
export function detectFormat(text: string): ElementFormat {
  const t = text.replace(/\s+$/, '');
  if (t.trimStart().startsWith('{') || /\b(e|q|om|tp)=/.test(t)) return 'sbdb';
  if (/^[ \d]{4}[CPDXIA]/.test(t) && /^\d{4}$/.test(t.slice(14, 18))) return 'mpc-comet';
  if (t.length >= 103 && /^[ 0-9A-Za-z~]{7} /.test(t) && /^[A-L]\d\d[1-9A-C][1-9A-V]$/.test(t.slice(20, 25))) return 'mpc-minor-planet';
  return bad('the line is in no format gloaming reads', "an MPC one-line comet orbit (CometEls.txt), an MPC minor-planet orbit (MPCORB.DAT), or JPL SBDB fields (JSON, or 'e=… q=… i=… om=… w=… tp=…')", t.slice(0, 40));
}

/** Reads one object from a line (or an SBDB JSON text) in any of the formats above. */
export function readElements(text: string): { format: ElementFormat; object: ImportedObject } {
  const format = detectFormat(text);
  const object = format === 'sbdb' ? readSbdb(text) : format === 'mpc-comet' ? readMpcComet(text.replace(/\s+$/, '')) : readMpcMinorPlanet(text.replace(/\s+$/, ''));
  return { format, object };
}

/**
 * How old a comet's elements may be near perihelion before gloaming warns: outgassing
 * (non-gravitational forces) and planetary perturbations move a comet away from a two-body orbit
 * fastest near the Sun, and the MPC refits active comets' orbits every few weeks. 60 days within
 * 120 days of perihelion is this project's choice (common practice: refresh elements monthly for
 * a comet in view).
 */
export const COMET_ELEMENTS_MAX_AGE_DAYS = 60;
export const NEAR_PERIHELION_DAYS = 120;

/** Old elements of a comet near perihelion: what is wrong and what to do, and the object file's field it is about. */
export interface StaleElements {
  message: string;
  /** `elements.epoch` when the file gives an epoch, else `elements`. */
  field: 'elements.epoch' | 'elements';
}

/**
 * The one rule on the age of a comet's elements: a warning when, on `today` (YYYY-MM-DD), the
 * comet is within `NEAR_PERIHELION_DAYS` of perihelion and its epoch of osculation is more than
 * `COMET_ELEMENTS_MAX_AGE_DAYS` old, or missing; else null. Takes a validated object file
 * (`parseObject`), in either element form; `gloaming objects add`, `gloaming check` and the build
 * all ask it.
 */
export function staleCometWarning(object: Pick<SmallBodyObject, 'name' | 'kind' | 'elements'>, today: string): StaleElements | null {
  if (object.kind !== 'comet') return null;
  const todayTt = parseTtInstant(today, 'today');
  const fromPerihelion = todayTt - toConicElements(object.elements).perihelionTimeTt;
  if (Math.abs(fromPerihelion) > NEAR_PERIHELION_DAYS) return null;
  const epochTt = object.elements.epochTt;
  const age = epochTt === undefined ? null : todayTt - epochTt;
  if (age !== null && age <= COMET_ELEMENTS_MAX_AGE_DAYS) return null;
  const when = `${Math.abs(Math.round(fromPerihelion))} days ${fromPerihelion < 0 ? 'before' : 'after'} perihelion`;
  const why = 'near the Sun a comet drifts from a two-body orbit within weeks';
  const fix = `expected elements fitted within the last ${COMET_ELEMENTS_MAX_AGE_DAYS} days: import a current MPC or JPL SBDB element line with \`gloaming objects add --force\``;
  return age === null
    ? { field: 'elements', message: `${object.name} is ${when} and its elements give no epoch of osculation (elements.epoch): ${why}; ${fix}` }
    : { field: 'elements.epoch', message: `${object.name} is ${when} and its elements are ${Math.round(age)} days old (epoch ${instantOfJd(epochTt! + JD_J2000).slice(0, 10)}), more than ${COMET_ELEMENTS_MAX_AGE_DAYS}: ${why}; ${fix}` };
}

/** The object as the text of a `content/objects/<id>.yaml` file. */
export function objectYaml(object: ImportedObject): string {
  const q = (s: string): string => JSON.stringify(s);
  const el = Object.entries(object.elements).map(([k, v]) => `  ${k}: ${v}`);
  const mag = Object.entries(object.magnitude).map(([k, v]) => `${k}: ${v}`).join(', ');
  return [
    `# Imported by 'gloaming objects add'. Elements: heliocentric, J2000 ecliptic and equinox; times TT.`,
    `id: ${object.id}`,
    `name: ${q(object.name)}`,
    ...(object.names && Object.keys(object.names).length ? [`names: { ${Object.entries(object.names).map(([k, v]) => `${k}: ${q(v)}`).join(', ')} }`] : []),
    `kind: ${object.kind}`,
    'elements:',
    ...el,
    `magnitude: { ${mag} }`,
    `source: ${q(object.source)}`,
    '',
  ].join('\n');
}

/** Fixed-width field, right-aligned. */
const right = (text: string, width: number): string => text.padStart(width).slice(-width);

/**
 * The MPC one-line comet form of an imported comet (the inverse of `readMpcComet` for the fields
 * gloaming keeps), for round-trip checks and for sharing a set in the trade's form.
 */
export function formatMpcComet(object: ImportedObject, designation: { number?: number; type: string; packed?: string; reference?: string }): string {
  const el = object.elements;
  const t = new Date(String(el.perihelionTime));
  const dayFraction = t.getUTCDate() + (t.getUTCHours() * 3600 + t.getUTCMinutes() * 60 + t.getUTCSeconds()) / 86400;
  const epoch = el.epoch ? String(el.epoch).slice(0, 10).replace(/-/g, '') : '';
  const chars = Array.from({ length: 168 }, () => ' ');
  const put = (from: number, text: string): void => {
    for (let k = 0; k < text.length; k++) chars[from - 1 + k] = text[k]!;
  };
  put(1, designation.number ? String(designation.number).padStart(4, '0') : '    ');
  put(5, designation.type);
  put(6, designation.packed ?? '       ');
  put(15, String(t.getUTCFullYear()));
  put(20, String(t.getUTCMonth() + 1).padStart(2, '0'));
  put(23, right(dayFraction.toFixed(4), 7));
  put(31, right(Number(el.perihelionDistance).toFixed(6), 9));
  put(42, right(Number(el.eccentricity).toFixed(6), 8));
  put(52, right(Number(el.argumentOfPerihelion).toFixed(4), 8));
  put(62, right(Number(el.ascendingNode).toFixed(4), 8));
  put(72, right(Number(el.inclination).toFixed(4), 8));
  put(82, epoch.padEnd(8));
  put(92, right(object.magnitude.M1!.toFixed(1), 4));
  put(97, right((object.magnitude.K1! / 2.5).toFixed(1), 4));
  put(103, object.name.padEnd(56).slice(0, 56));
  put(160, (designation.reference ?? '').padEnd(9).slice(0, 9));
  return chars.join('').replace(/\s+$/, '');
}

/** The MPCORB form of an imported asteroid (the inverse of `readMpcMinorPlanet` for the fields gloaming keeps). */
export function formatMpcMinorPlanet(object: ImportedObject, designation: { packed: string; reference?: string }): string {
  const el = object.elements;
  const a = Number(el.semiMajorAxis);
  // n = k a^(-3/2) in degrees a day (k: the Gaussian gravitational constant).
  const n = (0.01720209895 * (180 / Math.PI)) / (a * Math.sqrt(a));
  const chars = Array.from({ length: 194 }, () => ' ');
  const put = (from: number, text: string): void => {
    for (let k = 0; k < text.length; k++) chars[from - 1 + k] = text[k]!;
  };
  put(1, designation.packed.padEnd(7));
  put(9, right(object.magnitude.H!.toFixed(2), 5));
  put(15, right(object.magnitude.G!.toFixed(2), 5));
  put(21, packDate(String(el.epoch).slice(0, 10)));
  put(27, right(Number(el.meanAnomaly).toFixed(5), 9));
  put(38, right(Number(el.argumentOfPerihelion).toFixed(5), 9));
  put(49, right(Number(el.ascendingNode).toFixed(5), 9));
  put(60, right(Number(el.inclination).toFixed(5), 9));
  put(71, right(Number(el.eccentricity).toFixed(7), 9));
  put(81, right(n.toFixed(8), 11));
  put(93, right(a.toFixed(7), 11));
  put(108, (designation.reference ?? '').padEnd(9).slice(0, 9));
  put(167, object.name.padEnd(28).slice(0, 28));
  return chars.join('').replace(/\s+$/, '');
}

