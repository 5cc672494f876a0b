/**
 * Satellite element sets: SGP4 mean elements read from the open exchange formats, with every
 * problem reported at its place (file, line, column or field).
 *
 * - NORAD two-line element sets (TLE), optionally with a name line before each pair ("three-line"
 *   form, a leading `0 ` allowed). Columns, checksum and epoch follow the layout documented with
 *   Spacetrack Report #3 (Hoots & Roehrich 1980) and Vallado et al. 2006 (AIAA 2006-6753, app. A).
 *   Blank lines and lines starting with `#` are comments.
 * - CCSDS Orbit Mean-elements Message (OMM, CCSDS 502.0-B-3), as JSON (one object or an array of
 *   them, keyword names as in the standard) or as XML (`<omm>` messages, alone or inside an
 *   `<ndm>`). Only SGP4 mean elements in TEME about the Earth (`MEAN_ELEMENT_THEORY` SGP4 or
 *   absent) are accepted.
 *
 * The SGP4 record itself is built by `satellite.js` (Vallado's published code, ported), never here.
 */
import { json2satrec, twoline2satrec, type OMMJsonObject, type SatRec } from 'satellite.js';
import { GloamingError, type Place } from '../../core/errors.ts';
import { loadYaml } from '../../core/yaml.ts';

/** One object's SGP4 mean elements, with where they were read. */
export interface ElementSet {
  /** NORAD catalogue number (Alpha-5 numbers decoded: A0000 = 100000). */
  noradId: number;
  /** Object name from the name line or OBJECT_NAME; null when the file gives none. */
  name: string | null;
  /** International designator (`1998-067A`), or null. */
  internationalDesignator: string | null;
  /** Epoch of the elements, UTC. */
  epoch: Date;
  /** Mean motion, revolutions per day. */
  meanMotionRevPerDay: number;
  eccentricity: number;
  inclinationDeg: number;
  /** Drag term B*, 1/Earth radii. */
  bstar: number;
  /** Where the element set starts (file and line). */
  source: Place;
  /** The initialised SGP4 record (satellite.js). */
  satrec: SatRec;
}

const ALPHA5 = 'ABCDEFGHJKLMNPQRSTUVWXYZ';

/** Catalogue number from TLE columns 3–7: five digits, or Alpha-5 (a letter other than I and O, then four digits). */
function catalogueNumber(text: string): number | null {
  const t = text.trim();
  if (/^\d{1,5}$/.test(t)) return Number(t);
  const m = /^([A-HJ-NP-Z])(\d{4})$/.exec(t);
  return m ? (10 + ALPHA5.indexOf(m[1]!)) * 10_000 + Number(m[2]) : null;
}

/** TLE checksum: the sum of the digits of columns 1–68, with 1 for each minus sign, modulo 10. */
export function tleChecksum(line: string): number {
  let sum = 0;
  for (let i = 0; i < 68 && i < line.length; i++) {
    const c = line[i]!;
    if (c >= '0' && c <= '9') sum += c.charCodeAt(0) - 48;
    else if (c === '-') sum += 1;
  }
  return sum % 10;
}

interface TleField {
  /** 1-based first and last column, as in the published layout. */
  from: number;
  to: number;
  name: string;
  pattern: RegExp;
  expected: string;
}

const DECIMAL = /^\s*[+-]?\d*\.?\d+\s*$/;
/** Assumed-decimal-point exponent form, e.g. ` 12345-3` = 0.12345e-3. */
const EXPONENT = /^\s*[+-]?\d{1,5}[+-]\d\s*$/;
const LINE1_FIELDS: TleField[] = [
  { from: 19, to: 32, name: 'epoch', pattern: /^\d{2}[\d ]{3}\.\d+\s*$/, expected: 'YYDDD.DDDDDDDD (two-digit year, day of the year with fraction)' },
  { from: 34, to: 43, name: 'first derivative of mean motion', pattern: /^\s*[+-]?\.\d+\s*$|^\s*[+-]?0?\.\d+\s*$/, expected: 'a decimal like -.00002182' },
  { from: 45, to: 52, name: 'second derivative of mean motion', pattern: EXPONENT, expected: 'an assumed-decimal number like 00000-0' },
  { from: 54, to: 61, name: 'drag term B*', pattern: EXPONENT, expected: 'an assumed-decimal number like -11606-4' },
];
const LINE2_FIELDS: TleField[] = [
  { from: 9, to: 16, name: 'inclination', pattern: DECIMAL, expected: 'degrees, 0–180' },
  { from: 18, to: 25, name: 'right ascension of the ascending node', pattern: DECIMAL, expected: 'degrees, 0–360' },
  { from: 27, to: 33, name: 'eccentricity', pattern: /^\d{7}$/, expected: 'seven digits with an assumed leading decimal point' },
  { from: 35, to: 42, name: 'argument of perigee', pattern: DECIMAL, expected: 'degrees, 0–360' },
  { from: 44, to: 51, name: 'mean anomaly', pattern: DECIMAL, expected: 'degrees, 0–360' },
  { from: 53, to: 63, name: 'mean motion', pattern: DECIMAL, expected: 'revolutions per day, a positive decimal' },
];

/** Julian epoch of a TLE's two-digit year and fractional day (years 57–99 are 19xx, 00–56 20xx). */
function tleEpoch(text: string): { date: Date; ok: boolean } {
  const yy = Number(text.slice(0, 2));
  const day = Number(text.slice(2).trim());
  const year = yy < 57 ? 2000 + yy : 1900 + yy;
  const leap = (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
  const ok = Number.isFinite(day) && day >= 1 && day < (leap ? 367 : 366);
  return { date: new Date(Date.UTC(year, 0, 1) + (day - 1) * 86_400_000), ok };
}

/** Reads a TLE file: any number of element sets, each two lines, optionally after a name line. */
export function readTle(text: string, file: string): ElementSet[] {
  const lines = text.split(/\r?\n/);
  const out: ElementSet[] = [];
  let name: { text: string; line: number } | null = null;
  for (let i = 0; i < lines.length; i++) {
    const raw = lines[i]!.replace(/\s+$/, '');
    if (raw === '' || raw.startsWith('#')) continue;
    if (!raw.startsWith('1 ')) {
      if (raw.startsWith('2 ')) {
        throw new GloamingError('invalid-value', 'line 2 of an element set without its line 1', { place: { file, line: i + 1, column: 1 }, expected: 'line 1 (starting "1 ") before line 2' });
      }
      if (name) {
        throw new GloamingError('invalid-value', 'a name line is not followed by an element set', { place: { file, line: name.line, column: 1 }, actual: name.text, expected: 'a name line, then line 1 (starting "1 ") and line 2 (starting "2 ")' });
      }
      name = { text: raw.replace(/^0 /, '').trim(), line: i + 1 };
      continue;
    }
    const j = i + 1;
    const line2 = (lines[j] ?? '').replace(/\s+$/, '');
    if (!line2.startsWith('2 ')) {
      throw new GloamingError('invalid-value', 'line 1 of an element set is not followed by line 2', { place: { file, line: j + 1, column: 1 }, actual: line2, expected: 'line 2, starting "2 "' });
    }
    out.push(readTwoLines({ line1: raw, line2, name: name?.text ?? null, place: { file, line: name?.line ?? i + 1 }, line1Number: i + 1 }));
    name = null;
    i = j;
  }
  if (name) {
    throw new GloamingError('invalid-value', 'a name line is not followed by an element set', { place: { file, line: name.line, column: 1 }, actual: name.text, expected: 'line 1 (starting "1 ") and line 2 (starting "2 ") after the name' });
  }
  return out;
}

/** One element set from its two lines; `line1Number` is line 1's line in the file (line 2 follows it). */
function readTwoLines(input: { line1: string; line2: string; name: string | null; place: Place; line1Number: number }): ElementSet {
  const { line1, line2 } = input;
  const file = input.place.file;
  const at = (lineNo: 1 | 2, column: number): Place => ({ file, line: input.line1Number + lineNo - 1, column });
  for (const [lineNo, line] of [[1, line1], [2, line2]] as const) {
    // Verification files append start, stop and step times after column 69; read only the element columns.
    if (line.length < 69) {
      throw new GloamingError('invalid-value', `line ${lineNo} of the element set is ${line.length} characters long`, { place: at(lineNo, line.length + 1), expected: '69 columns (the checksum digit in column 69)' });
    }
    const sum = tleChecksum(line);
    if (line[68] !== String(sum)) {
      throw new GloamingError('invalid-value', `checksum of line ${lineNo} does not match`, { place: at(lineNo, 69), actual: line[68], expected: `${sum} (the sum of the digits, minus signs counting 1, modulo 10)` });
    }
  }
  const id1 = catalogueNumber(line1.slice(2, 7));
  if (id1 === null) {
    throw new GloamingError('invalid-value', 'catalogue number in line 1 cannot be read', { place: at(1, 3), actual: line1.slice(2, 7), expected: 'five digits (or Alpha-5: a letter and four digits) in columns 3–7' });
  }
  const id2 = catalogueNumber(line2.slice(2, 7));
  if (id2 !== id1) {
    throw new GloamingError('invalid-value', 'catalogue numbers of line 1 and line 2 differ', { place: at(2, 3), actual: line2.slice(2, 7), expected: `${line1.slice(2, 7)}, as in line 1` });
  }
  for (const [lineNo, line, fields] of [[1, line1, LINE1_FIELDS], [2, line2, LINE2_FIELDS]] as const) {
    for (const f of fields) {
      const text = line.slice(f.from - 1, f.to);
      if (!f.pattern.test(text)) {
        throw new GloamingError('invalid-value', `${f.name} (columns ${f.from}–${f.to}) cannot be read`, { place: at(lineNo, f.from), actual: text, expected: f.expected });
      }
    }
  }
  const epoch = tleEpoch(line1.slice(18, 32));
  if (!epoch.ok) {
    throw new GloamingError('invalid-date', 'epoch day of the year is out of range', { place: at(1, 21), actual: line1.slice(20, 32).trim(), expected: 'a day from 1 to 366.99999999 (365.99999999 in common years)' });
  }
  const inclination = Number(line2.slice(8, 16));
  if (inclination < 0 || inclination > 180) {
    throw new GloamingError('invalid-value', 'inclination out of range', { place: at(2, 9), actual: line2.slice(8, 16).trim(), expected: 'degrees, 0–180' });
  }
  const meanMotion = Number(line2.slice(52, 63));
  if (!(meanMotion > 0)) {
    throw new GloamingError('invalid-value', 'mean motion must be positive', { place: at(2, 53), actual: line2.slice(52, 63).trim(), expected: 'revolutions per day, > 0' });
  }
  const satrec = twoline2satrec(line1.slice(0, 69), line2.slice(0, 69));
  const designator = line1.slice(9, 17).trim();
  return finish({
    noradId: id1,
    name: input.name,
    internationalDesignator: designator ? designatorFromTle(designator) : null,
    epoch: epoch.date,
    meanMotionRevPerDay: meanMotion,
    eccentricity: Number(`0.${line2.slice(26, 33)}`),
    inclinationDeg: inclination,
    bstar: satrec.bstar,
    source: input.place,
    satrec,
  });
}

/** `98067A` → `1998-067A` (launch years 57–99 are 19xx). */
function designatorFromTle(text: string): string {
  const yy = Number(text.slice(0, 2));
  return Number.isFinite(yy) && text.length >= 5 ? `${yy < 57 ? 2000 + yy : 1900 + yy}-${text.slice(2)}` : text;
}

/** Rejects element sets SGP4 cannot initialise (satellite.js reports the reason as an error code). */
function finish(set: ElementSet): ElementSet {
  if (set.satrec.error !== 0) {
    const why: Record<number, string> = { 1: 'mean eccentricity out of range 0–1', 2: 'mean motion below zero', 4: 'semi-latus rectum below zero', 6: 'the orbit has decayed' };
    throw new GloamingError('invalid-value', `SGP4 cannot start from these elements: ${why[set.satrec.error] ?? `error ${set.satrec.error}`}`, { place: set.source, expected: 'the mean elements of an Earth orbit' });
  }
  return set;
}

/** OMM keywords read here, with their kind; numbers may be written as strings (as several publishers do). */
const OMM_REQUIRED = ['EPOCH', 'MEAN_MOTION', 'ECCENTRICITY', 'INCLINATION', 'RA_OF_ASC_NODE', 'ARG_OF_PERICENTER', 'MEAN_ANOMALY', 'NORAD_CAT_ID', 'BSTAR', 'MEAN_MOTION_DOT', 'MEAN_MOTION_DDOT'] as const;
const OMM_RANGES: Record<string, [number, number, string]> = {
  MEAN_MOTION: [1e-6, 20, 'revolutions per day, above 0 (Earth orbits: up to about 17)'],
  ECCENTRICITY: [0, 0.999999, 'a number from 0 to below 1'],
  INCLINATION: [0, 180, 'degrees, 0–180'],
  RA_OF_ASC_NODE: [-360, 360, 'degrees, 0–360'],
  ARG_OF_PERICENTER: [-360, 360, 'degrees, 0–360'],
  MEAN_ANOMALY: [-360, 360, 'degrees, 0–360'],
  NORAD_CAT_ID: [0, 339_999, 'a catalogue number, 0–339999'],
  BSTAR: [-1, 1, 'a drag term in 1/Earth radii, typically below 0.01'],
  MEAN_MOTION_DOT: [-1, 1, 'revolutions per day², small'],
  MEAN_MOTION_DDOT: [-1, 1, 'revolutions per day³, small'],
};

/** An OMM's keywords as read (strings or numbers), with a function placing each keyword. */
interface OmmRecord {
  values: Record<string, unknown>;
  place(keyword?: string): Place;
}

/** One element set from an OMM's keywords: checks presence, kinds, ranges and the mean-element theory. */
function fromOmm(record: OmmRecord): ElementSet {
  const v = record.values;
  const fail = (keyword: string, reason: string, expected: string): never => {
    throw new GloamingError('invalid-value', reason, { place: record.place(keyword), actual: v[keyword], expected });
  };
  const theory = v.MEAN_ELEMENT_THEORY;
  if (theory !== undefined && String(theory).trim().toUpperCase() !== 'SGP4') fail('MEAN_ELEMENT_THEORY', 'these are not SGP4 mean elements', "'SGP4' (gloaming propagates with SGP4/SDP4 only)");
  if (v.REF_FRAME !== undefined && String(v.REF_FRAME).trim().toUpperCase() !== 'TEME') fail('REF_FRAME', 'SGP4 mean elements must be in TEME', "'TEME'");
  if (v.CENTER_NAME !== undefined && String(v.CENTER_NAME).trim().toUpperCase() !== 'EARTH') fail('CENTER_NAME', 'only Earth satellites are supported', "'EARTH'");
  if (v.TIME_SYSTEM !== undefined && String(v.TIME_SYSTEM).trim().toUpperCase() !== 'UTC') fail('TIME_SYSTEM', 'SGP4 element epochs are in UTC', "'UTC'");
  for (const keyword of OMM_REQUIRED) {
    if (v[keyword] === undefined || v[keyword] === null || v[keyword] === '') {
      throw new GloamingError('missing-field', `OMM keyword ${keyword} is missing`, { place: { ...record.place(), field: keyword }, expected: `${keyword} (every SGP4 element set needs ${OMM_REQUIRED.join(', ')})` });
    }
  }
  const numbers: Record<string, number> = {};
  for (const [keyword, [min, max, expected]] of Object.entries(OMM_RANGES)) {
    const raw = v[keyword];
    const n = typeof raw === 'number' ? raw : typeof raw === 'string' && raw.trim() !== '' ? Number(raw) : NaN;
    if (!Number.isFinite(n) || n < min || n > max) fail(keyword, `OMM keyword ${keyword} is out of range or not a number`, expected);
    numbers[keyword] = n;
  }
  const epochText = String(v.EPOCH).trim();
  const m = /^(\d{4})-(\d{2})-(\d{2})T(\d{2}):(\d{2}):(\d{2}(?:\.\d+)?)Z?$/.exec(epochText);
  const epoch = m ? new Date(`${epochText.replace(/Z$/, '')}Z`) : null;
  if (!m || !epoch || Number.isNaN(epoch.getTime()) || epoch.getUTCDate() !== Number(m[3])) {
    throw new GloamingError('invalid-date', 'OMM EPOCH cannot be read', { place: record.place('EPOCH'), actual: v.EPOCH, expected: 'an ISO 8601 UTC time like 2026-12-03T11:52:13.123456' });
  }
  if (v.EPHEMERIS_TYPE !== undefined && String(v.EPHEMERIS_TYPE).trim() !== '0') fail('EPHEMERIS_TYPE', 'only SGP4 element sets (ephemeris type 0) are supported', '0');
  const omm: OMMJsonObject = {
    OBJECT_NAME: String(v.OBJECT_NAME ?? ''),
    OBJECT_ID: String(v.OBJECT_ID ?? ''),
    EPOCH: epochText.replace(/Z$/, ''),
    MEAN_MOTION: numbers.MEAN_MOTION!,
    ECCENTRICITY: numbers.ECCENTRICITY!,
    INCLINATION: numbers.INCLINATION!,
    RA_OF_ASC_NODE: numbers.RA_OF_ASC_NODE!,
    ARG_OF_PERICENTER: numbers.ARG_OF_PERICENTER!,
    MEAN_ANOMALY: numbers.MEAN_ANOMALY!,
    NORAD_CAT_ID: numbers.NORAD_CAT_ID!,
    ELEMENT_SET_NO: String(v.ELEMENT_SET_NO ?? '999'),
    BSTAR: numbers.BSTAR!,
    MEAN_MOTION_DOT: numbers.MEAN_MOTION_DOT!,
    MEAN_MOTION_DDOT: numbers.MEAN_MOTION_DDOT!,
  };
  const name = typeof v.OBJECT_NAME === 'string' && v.OBJECT_NAME.trim() ? v.OBJECT_NAME.trim() : null;
  const designator = typeof v.OBJECT_ID === 'string' && v.OBJECT_ID.trim() ? v.OBJECT_ID.trim() : null;
  return finish({
    noradId: numbers.NORAD_CAT_ID!,
    name,
    internationalDesignator: designator,
    epoch,
    meanMotionRevPerDay: numbers.MEAN_MOTION!,
    eccentricity: numbers.ECCENTRICITY!,
    inclinationDeg: numbers.INCLINATION!,
    bstar: numbers.BSTAR!,
    source: record.place(),
    satrec: json2satrec(omm),
  });
}

/** Reads OMM JSON: one object or an array of objects with the standard keywords. */
export function readOmmJson(text: string, file: string): ElementSet[] {
  // JSON is YAML 1.2, and the YAML loader knows where every value is written.
  const source = loadYaml(text, file);
  const data = source.data;
  const list = Array.isArray(data) ? data : [data];
  return list.map((item, i) => {
    const prefix = Array.isArray(data) ? `${i}.` : '';
    if (!item || typeof item !== 'object' || Array.isArray(item)) {
      throw new GloamingError('invalid-value', 'an OMM must be a JSON object of keywords', { place: source.locate(prefix.slice(0, -1) || undefined), expected: '{ "OBJECT_NAME": …, "EPOCH": …, "MEAN_MOTION": … }' });
    }
    return fromOmm({
      values: item as Record<string, unknown>,
      place: (keyword) => {
        const place = source.locate(keyword ? `${prefix}${keyword}` : prefix.slice(0, -1) || undefined);
        if (keyword) place.field = keyword;
        else delete place.field;
        return place;
      },
    });
  });
}

/** Line and column (1-based) of a character offset. */
function lineColumn(text: string, offset: number): { line: number; column: number } {
  let line = 1;
  let last = -1;
  for (let i = text.indexOf('\n'); i !== -1 && i < offset; i = text.indexOf('\n', i + 1)) {
    line++;
    last = i;
  }
  return { line, column: offset - last };
}

const XML_ENTITIES: Record<string, string> = { amp: '&', lt: '<', gt: '>', quot: '"', apos: "'" };

/**
 * Reads OMM XML: every `<omm>` element of the file (alone or inside an `<ndm>`). This is a reader
 * for the OMM's flat keyword elements (`<EPOCH>…</EPOCH>`), not a general XML parser: keywords
 * are the leaf elements of an `<omm>`, wherever they sit under `metadata`, `meanElements` or
 * `tleParameters`.
 */
export function readOmmXml(text: string, file: string): ElementSet[] {
  const out: ElementSet[] = [];
  const open = /<omm(?:\s[^>]*)?>/g;
  let match: RegExpExecArray | null;
  while ((match = open.exec(text))) {
    const start = match.index;
    const end = text.indexOf('</omm>', open.lastIndex);
    if (end === -1) {
      throw new GloamingError('invalid-value', '<omm> element is not closed', { place: { file, ...lineColumn(text, start) }, expected: 'a matching </omm>' });
    }
    const body = text.slice(open.lastIndex, end);
    const values: Record<string, unknown> = {};
    const places: Record<string, number> = {};
    const leaf = /<([A-Z][A-Z0-9_]*)(?:\s[^>]*)?>([^<]*)<\/([A-Za-z][A-Za-z0-9_]*)>/g;
    let l: RegExpExecArray | null;
    while ((l = leaf.exec(body))) {
      const offset = open.lastIndex + l.index;
      if (l[1] !== l[3]) {
        throw new GloamingError('invalid-value', `element <${l[1]}> is closed by </${l[3]}>`, { place: { file, ...lineColumn(text, offset) }, expected: `</${l[1]}>` });
      }
      if (l[1] === 'COMMENT' || l[1] === 'USER_DEFINED') continue;
      if (l[1]! in values) {
        throw new GloamingError('invalid-value', `keyword ${l[1]} appears twice in one OMM`, { place: { file, ...lineColumn(text, offset) }, expected: 'each keyword once per <omm>' });
      }
      values[l[1]!] = l[2]!.replace(/&(amp|lt|gt|quot|apos);/g, (_, e: string) => XML_ENTITIES[e]!).trim();
      places[l[1]!] = offset;
    }
    out.push(fromOmm({
      values,
      place: (keyword) => {
        const offset = keyword && places[keyword] !== undefined ? places[keyword] : start;
        return { file, ...lineColumn(text, offset), ...(keyword ? { field: keyword } : {}) };
      },
    }));
    open.lastIndex = end;
  }
  if (out.length === 0) {
    throw new GloamingError('invalid-value', 'no <omm> message in this XML file', { place: { file, line: 1, column: 1 }, expected: 'one or more <omm> elements (CCSDS 502.0-B-3)' });
  }
  return out;
}

/** The element-set file formats, by file name ending. */
export const ELEMENT_FILE_FORMATS = { '.tle': readTle, '.txt': readTle, '.json': readOmmJson, '.xml': readOmmXml } as const;

/** Reads an element-set file, choosing the format by its name (`.tle`/`.txt`, `.json`, `.xml`). */
export function readElementFile(text: string, file: string): ElementSet[] {
  const ext = Object.keys(ELEMENT_FILE_FORMATS).find((e) => file.toLowerCase().endsWith(e)) as keyof typeof ELEMENT_FILE_FORMATS | undefined;
  if (!ext) {
    throw new GloamingError('invalid-argument', 'unknown element-set file type', { place: { file }, expected: `a file ending in ${Object.keys(ELEMENT_FILE_FORMATS).join(', ')}` });
  }
  return ELEMENT_FILE_FORMATS[ext](text, file);
}
