/**
 * Object files: comets and asteroids given by published orbital elements and magnitude
 * parameters (`content/objects/<id>.yaml`). This module defines the schema, validates it with
 * errors that name the field (and, through `lib/core/yaml.ts`, the file, line and column), and
 * reduces both element forms to one perihelion form for propagation.
 *
 * YAML keys keep the trade's symbols in their docs:
 *
 * ```yaml
 * id: example-comet
 * name: Comet Example
 * names: { es: Cometa Ejemplo, de: Komet Beispiel }   # optional: the name on pages in those languages
 * kind: comet                    # comet | asteroid
 * elements:                      # heliocentric, J2000 ecliptic and equinox
 *   perihelionDistance: 0.62     # q, AU
 *   eccentricity: 0.9991         # e
 *   inclination: 71.3            # i, degrees
 *   ascendingNode: 214.8         # Ω, degrees
 *   argumentOfPerihelion: 102.4  # ω, degrees
 *   perihelionTime: 2027-03-18T04:30:00Z   # T, an instant in TT (or a Julian Ephemeris Date)
 * magnitude: { M1: 6.0, K1: 10.0 }         # comets: m = M1 + 5 log10 Δ + K1 log10 r
 * coma: 8                        # optional, apparent coma diameter, arcminutes
 * source: "where the elements come from, and their date"
 * ```
 *
 * The osculating (elliptic only) form replaces `perihelionDistance` and `perihelionTime` by
 * `semiMajorAxis` (a, AU), `meanAnomaly` (M, degrees) and `epoch` (TT). Magnitudes are either
 * `{ M1, K1, K1Alternative?, uncertainty? }` (total magnitude of a comet; `K1Alternative` or a
 * ± `uncertainty` in magnitudes turns the prediction into a range) or `{ H, G }` (IAU H–G system,
 * Bowell et al. 1989, asteroids only).
 */
import { readFileSync } from 'node:fs';
import { GloamingError, didYouMean } from '../../core/errors.ts';
import { LANGUAGES, type Language } from '../../core/language/index.ts';
import { loadYaml, validateYaml } from '../../core/yaml.ts';
import { GAUSSIAN_K, type ConicElements } from './kepler.ts';

export type SmallBodyKind = 'comet' | 'asteroid';

/** Elements given with q and T (any conic): the conic's own elements (q, e, i, Ω, ω, T). */
export interface PerihelionElements extends ConicElements {
  form: 'perihelion';
  /** Epoch of osculation (when the orbit was fitted), days since J2000.0, TT; optional. Not used for positions. */
  epochTt?: number;
}

/** Osculating elements with a, M and epoch (ellipses only). */
export interface OsculatingElements {
  form: 'osculating';
  /** a, AU. */
  semiMajorAxisAu: number;
  /** e (0 ≤ e < 1). */
  eccentricity: number;
  /** i, degrees, 0–180. */
  inclinationDeg: number;
  /** Ω, degrees. */
  ascendingNodeDeg: number;
  /** ω, degrees. */
  argumentOfPerihelionDeg: number;
  /** M at the epoch, degrees. */
  meanAnomalyDeg: number;
  /** Epoch of osculation, days since J2000.0, TT. */
  epochTt: number;
}

export type OrbitalElements = PerihelionElements | OsculatingElements;

/** Comet total magnitude m = M1 + 5 log10 Δ + K1 log10 r, with an optional uncertainty. */
export interface CometMagnitudeModel {
  model: 'comet';
  M1: number;
  K1: number;
  /** A second plausible K1; the prediction becomes the range spanned by both. */
  K1Alternative?: number;
  /** ± band in magnitudes around the prediction. */
  uncertaintyMag?: number;
}

/** IAU H–G magnitude system (Bowell et al. 1989). */
export interface AsteroidMagnitudeModel {
  model: 'hg';
  H: number;
  G: number;
}

export type MagnitudeModel = CometMagnitudeModel | AsteroidMagnitudeModel;

/** A validated object file. */
export interface SmallBodyObject {
  id: string;
  name: string;
  /** The name on pages in other languages (`es`, `de`, `fr`), where the file gives one; else `name`. */
  names?: Readonly<Partial<Record<Exclude<Language, 'en'>, string>>>;
  kind: SmallBodyKind;
  elements: OrbitalElements;
  magnitude: MagnitudeModel;
  /** Apparent coma diameter, arcminutes, when given. */
  comaArcmin?: number;
  source: string;
  /** The file the object was read from, when it came from one (for errors that name it). */
  file?: string;
}

const TOP_FIELDS = ['id', 'name', 'names', 'kind', 'elements', 'magnitude', 'coma', 'source'];
const ANGLE_FIELDS = ['inclination', 'ascendingNode', 'argumentOfPerihelion'];
const PERIHELION_FIELDS = ['perihelionDistance', 'eccentricity', ...ANGLE_FIELDS, 'perihelionTime', 'epoch'];
const OSCULATING_FIELDS = ['semiMajorAxis', 'eccentricity', ...ANGLE_FIELDS, 'meanAnomaly', 'epoch'];
const COMET_MAGNITUDE_FIELDS = ['M1', 'K1', 'K1Alternative', 'uncertainty'];
const HG_FIELDS = ['H', 'G'];

/** Milliseconds of 2000-01-01T12:00:00 read on the TT scale. */
const J2000_MS = Date.UTC(2000, 0, 1, 12);
/** Julian date of J2000.0 (2000-01-01 12:00 TT). */
export const JD_J2000 = 2451545.0;

function invalid(field: string, reason: string, actual: unknown, expected: string, hint?: string): never {
  throw new GloamingError('invalid-value', reason, { place: { field }, actual, expected, ...(hint ? { hint } : {}) });
}

function missing(field: string, expected: string, hint?: string): never {
  throw new GloamingError('missing-field', `missing field '${field}'`, { place: { field }, expected, ...(hint ? { hint } : {}) });
}

function record(value: unknown, field: string, expected: string): Record<string, unknown> {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    invalid(field, `${field} must be a mapping`, value, expected);
  }
  return value as Record<string, unknown>;
}

function rejectUnknown(input: Record<string, unknown>, allowed: string[], prefix: string): void {
  for (const key of Object.keys(input)) {
    if (!allowed.includes(key)) {
      const field = prefix ? `${prefix}.${key}` : key;
      const hint = didYouMean(key, allowed);
      throw new GloamingError('unknown-field', `unknown field '${field}'`, {
        place: { field },
        actual: key,
        expected: `one of ${allowed.join(', ')}`,
        ...(hint ? { hint } : {}),
      });
    }
  }
}

function present(input: Record<string, unknown>, key: string): boolean {
  return input[key] !== undefined && input[key] !== null;
}

function finite(input: Record<string, unknown>, key: string, field: string, what: string): number {
  if (!present(input, key)) missing(field, what);
  const value = input[key];
  if (typeof value !== 'number' || !Number.isFinite(value)) invalid(field, `${field} must be a finite number`, value, what);
  return value;
}

function text(input: Record<string, unknown>, key: string, what: string): string {
  if (!present(input, key)) missing(key, what);
  const value = input[key];
  if (typeof value !== 'string' || value.trim() === '') invalid(key, `${key} must be a non-empty string`, value, what);
  return value.trim();
}

const INSTANT_RE = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}(?:\.\d+)?))?)?(Z)?$/;

/**
 * Reads an instant on the TT scale: an ISO 8601 date or date-time (`1990-10-28T13:05:47Z`; the
 * `Z` is allowed but the digits are read as TT, no zone offsets), or a Julian Ephemeris Date as a
 * number (> 1e6). Returns days since J2000.0 (2000-01-01 12:00 TT).
 */
export function parseTtInstant(value: unknown, field: string): number {
  const expected = 'an ISO 8601 instant in TT such as 2027-03-18T04:30:00Z, or a Julian Ephemeris Date such as 2461482.69';
  if (typeof value === 'number') {
    if (!Number.isFinite(value) || value < 1e6 || value > 1e7) {
      throw new GloamingError('invalid-date', `${field} is not a plausible Julian Ephemeris Date`, { place: { field }, actual: value, expected });
    }
    return value - JD_J2000;
  }
  if (typeof value !== 'string') {
    throw new GloamingError('invalid-date', `${field} cannot be read as an instant`, { place: { field }, actual: value, expected });
  }
  const m = INSTANT_RE.exec(value.trim());
  const bad = (): never => {
    throw new GloamingError('invalid-date', `${field} cannot be read as an instant`, { place: { field }, actual: value, expected });
  };
  if (!m) return bad();
  const [year, month, day, hour, minute] = [m[1], m[2], m[3], m[4] ?? '0', m[5] ?? '0'].map(Number) as [number, number, number, number, number];
  const second = Number(m[6] ?? '0');
  if (month < 1 || month > 12 || day < 1 || hour > 23 || minute > 59 || second >= 60) return bad();
  const ms = Date.UTC(year, month - 1, day, hour, minute, 0) + second * 1000;
  const check = new Date(Date.UTC(year, month - 1, day));
  if (check.getUTCDate() !== day || check.getUTCMonth() !== month - 1) return bad();
  return (ms - J2000_MS) / 86_400_000;
}

function angle(input: Record<string, unknown>, key: string, symbol: string): number {
  return finite(input, key, `elements.${key}`, `${symbol}, an angle in degrees`);
}

function validateElements(value: unknown): OrbitalElements {
  if (value === undefined || value === null) missing('elements', 'orbital elements: perihelionDistance, eccentricity, inclination, ascendingNode, argumentOfPerihelion, perihelionTime');
  const input = record(value, 'elements', 'a mapping of orbital elements');
  // The epoch belongs to both forms (the perihelion form may give it: when the orbit was fitted).
  const perihelion = ['perihelionDistance', 'perihelionTime'].some((k) => k in input);
  const osculating = ['semiMajorAxis', 'meanAnomaly', ...(perihelion ? [] : ['epoch'])].some((k) => k in input);
  if (osculating && perihelion) {
    const key = ['semiMajorAxis', 'meanAnomaly'].find((k) => k in input)!;
    throw new GloamingError('unknown-field', `elements mix the perihelion form (q, T) with the osculating form (a, M, epoch)`, {
      place: { field: `elements.${key}` },
      actual: key,
      expected: 'either perihelionDistance and perihelionTime, or semiMajorAxis, meanAnomaly and epoch',
    });
  }
  rejectUnknown(input, osculating ? OSCULATING_FIELDS : PERIHELION_FIELDS, 'elements');

  const e = finite(input, 'eccentricity', 'elements.eccentricity', 'e, a number ≥ 0');
  if (e < 0) invalid('elements.eccentricity', 'the eccentricity e cannot be negative', e, 'e ≥ 0 (e < 1 ellipse, 1 parabola, > 1 hyperbola)');
  const inclinationDeg = angle(input, 'inclination', 'i');
  if (inclinationDeg < 0 || inclinationDeg > 180) {
    invalid('elements.inclination', 'the inclination i is out of range', inclinationDeg, 'i from 0 to 180 degrees (retrograde orbits have i > 90)');
  }
  const ascendingNodeDeg = angle(input, 'ascendingNode', 'Ω');
  const argumentOfPerihelionDeg = angle(input, 'argumentOfPerihelion', 'ω');

  if (osculating) {
    if (e >= 1) {
      invalid('elements.eccentricity', 'the osculating form (a, M, epoch) describes ellipses only', e, 'e < 1, or give perihelionDistance and perihelionTime for a parabola or hyperbola');
    }
    const a = finite(input, 'semiMajorAxis', 'elements.semiMajorAxis', 'a, AU, a number > 0');
    if (a <= 0) invalid('elements.semiMajorAxis', 'the semi-major axis a must be positive', a, 'a > 0 AU');
    const meanAnomalyDeg = angle(input, 'meanAnomaly', 'M');
    if (!present(input, 'epoch')) missing('elements.epoch', 'the epoch of osculation, an instant in TT');
    const epochTt = parseTtInstant(input.epoch, 'elements.epoch');
    return { form: 'osculating', semiMajorAxisAu: a, eccentricity: e, inclinationDeg, ascendingNodeDeg, argumentOfPerihelionDeg, meanAnomalyDeg, epochTt };
  }
  const q = finite(input, 'perihelionDistance', 'elements.perihelionDistance', 'q, AU, a number > 0');
  if (q <= 0) invalid('elements.perihelionDistance', 'the perihelion distance q must be positive', q, 'q > 0 AU');
  if (!present(input, 'perihelionTime')) {
    missing('elements.perihelionTime', 'T, the time of perihelion, an instant in TT', 'or give the osculating form: semiMajorAxis, meanAnomaly and epoch');
  }
  const perihelionTimeTt = parseTtInstant(input.perihelionTime, 'elements.perihelionTime');
  const epoch = present(input, 'epoch') ? { epochTt: parseTtInstant(input.epoch, 'elements.epoch') } : {};
  return { form: 'perihelion', perihelionDistanceAu: q, eccentricity: e, inclinationDeg, ascendingNodeDeg, argumentOfPerihelionDeg, perihelionTimeTt, ...epoch };
}

function validateMagnitude(value: unknown, kind: SmallBodyKind): MagnitudeModel {
  const expected = kind === 'comet' ? '{ M1, K1 } with optional K1Alternative or uncertainty' : '{ H, G } or { M1, K1 }';
  if (value === undefined || value === null) missing('magnitude', expected);
  const input = record(value, 'magnitude', expected);
  const hg = 'H' in input || 'G' in input;
  if (hg && kind === 'comet') {
    const key = 'H' in input ? 'H' : 'G';
    throw new GloamingError('unknown-field', `the H–G system is for asteroids; a comet's magnitude uses M1 and K1`, {
      place: { field: `magnitude.${key}` },
      actual: key,
      expected: 'magnitude: { M1, K1 } (total magnitude m = M1 + 5 log10 Δ + K1 log10 r)',
    });
  }
  rejectUnknown(input, hg ? HG_FIELDS : COMET_MAGNITUDE_FIELDS, 'magnitude');
  if (hg) {
    const H = finite(input, 'H', 'magnitude.H', 'H, the absolute magnitude');
    const G = finite(input, 'G', 'magnitude.G', 'G, the slope parameter (typically 0.15)');
    // G weighs the two phase functions, V = H + 5 log10(rΔ) − 2.5 log10((1 − G) Φ1 + G Φ2): only for 0 ≤ G ≤ 1 is the
    // blend positive at every phase angle (with G = −0.5 it is negative at α = 60° and the magnitude is not a number).
    if (G < 0 || G > 1) invalid('magnitude.G', 'the slope parameter G is outside the H–G system', G, 'G from 0 to 1 (typically 0.15), the range where (1 − G) Φ1 + G Φ2 stays positive at every phase angle (Bowell et al. 1989)');
    return { model: 'hg', H, G };
  }
  const M1 = finite(input, 'M1', 'magnitude.M1', 'M1, the total absolute magnitude');
  const K1 = finite(input, 'K1', 'magnitude.K1', 'K1, the brightness slope (10 for the common n = 4)');
  const model: CometMagnitudeModel = { model: 'comet', M1, K1 };
  if (present(input, 'K1Alternative')) {
    model.K1Alternative = finite(input, 'K1Alternative', 'magnitude.K1Alternative', 'a second plausible K1');
  }
  if (present(input, 'uncertainty')) {
    const u = finite(input, 'uncertainty', 'magnitude.uncertainty', 'a ± band in magnitudes, > 0');
    if (u <= 0 || u > 10) invalid('magnitude.uncertainty', 'the magnitude uncertainty must be a positive band', u, 'a ± band in magnitudes, more than 0 and at most 10');
    model.uncertaintyMag = u;
  }
  return model;
}

const ID_RE = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** The languages an object file may name the object in besides `name` (English, and every other language without a name of its own). */
const NAME_LANGUAGES = LANGUAGES.filter((l): l is Exclude<Language, 'en'> => l !== 'en');

/** `names`: a mapping from a language code (es, de, fr) to the object's name on pages in that language. */
function validateNames(value: unknown): Partial<Record<Exclude<Language, 'en'>, string>> {
  const expected = `a mapping from a language code (${NAME_LANGUAGES.join(', ')}) to the name on pages in that language, e.g. { es: Cometa Ejemplo }`;
  const input = record(value, 'names', expected);
  const names: Partial<Record<Exclude<Language, 'en'>, string>> = {};
  for (const key of Object.keys(input)) {
    if (!(NAME_LANGUAGES as readonly string[]).includes(key)) {
      invalid(`names.${key}`, key === 'en' ? "the English name is 'name'" : `unknown language '${key}' in names`, key, `one of ${NAME_LANGUAGES.join(', ')} (the English name is 'name')`);
    }
    const name = input[key];
    if (typeof name !== 'string' || name.trim() === '') invalid(`names.${key}`, `names.${key} must be a non-empty string`, name, `the object's name on pages in that language`);
    names[key as Exclude<Language, 'en'>] = name.trim();
  }
  return names;
}

/**
 * Validates the data of one object file. Every problem is a `GloamingError` whose `place.field`
 * is the dotted path (`elements.eccentricity`), with the offending `actual` value and the
 * `expected` one; `parseObject` adds file, line and column.
 */
export function validateObject(data: unknown): SmallBodyObject {
  const input = record(data, '', 'a mapping with id, name, kind, elements, magnitude and source');
  rejectUnknown(input, TOP_FIELDS, '');
  const id = text(input, 'id', 'a lower-case id such as example-comet');
  if (!ID_RE.test(id)) invalid('id', 'the id must be a lower-case slug', id, 'lower-case letters, digits and single hyphens, e.g. c2027-lumen');
  const name = text(input, 'name', 'the display name');
  const names = present(input, 'names') ? validateNames(input.names) : undefined;
  if (!present(input, 'kind')) missing('kind', "'comet' or 'asteroid'");
  const kind = input.kind;
  if (kind !== 'comet' && kind !== 'asteroid') invalid('kind', 'unknown kind of object', kind, "'comet' or 'asteroid'");
  const elements = validateElements(input.elements);
  const magnitude = validateMagnitude(input.magnitude, kind);
  const object: SmallBodyObject = { id, name, ...(names ? { names } : {}), kind, elements, magnitude, source: '' };
  if (present(input, 'coma')) {
    const coma = finite(input, 'coma', 'coma', 'the apparent coma diameter in arcminutes');
    if (coma <= 0 || coma > 600) invalid('coma', 'the coma diameter is out of range', coma, 'arcminutes, more than 0 and at most 600');
    object.comaArcmin = coma;
  }
  object.source = text(input, 'source', 'where the elements come from, and their date');
  return object;
}

/** Parses and validates object-file text; errors carry `file:line:column` and the field. */
export function parseObject(text: string, file: string): SmallBodyObject {
  return { ...validateYaml(loadYaml(text, file), validateObject), file };
}

/** Reads and validates one object file from disk. */
export function loadObjectFile(path: string): SmallBodyObject {
  return parseObject(readFileSync(path, 'utf8'), path);
}

/**
 * The perihelion form (q, e, i, Ω, ω, T) of any element set. For osculating elements
 * q = a(1 − e) and T = epoch − M/n with the mean motion n = k a^{−3/2} rad/day (Meeus 2nd ed.
 * eq. 33.6 in radians); M is first reduced to (−180°, 180°] so T is the nearest perihelion.
 */
export function toConicElements(elements: OrbitalElements): ConicElements {
  if (elements.form === 'perihelion') {
    return {
      perihelionDistanceAu: elements.perihelionDistanceAu,
      eccentricity: elements.eccentricity,
      inclinationDeg: elements.inclinationDeg,
      ascendingNodeDeg: elements.ascendingNodeDeg,
      argumentOfPerihelionDeg: elements.argumentOfPerihelionDeg,
      perihelionTimeTt: elements.perihelionTimeTt,
    };
  }
  const a = elements.semiMajorAxisAu;
  const meanMotionRadPerDay = GAUSSIAN_K / (a * Math.sqrt(a));
  let m = elements.meanAnomalyDeg % 360;
  if (m > 180) m -= 360;
  if (m <= -180) m += 360;
  return {
    perihelionDistanceAu: a * (1 - elements.eccentricity),
    eccentricity: elements.eccentricity,
    inclinationDeg: elements.inclinationDeg,
    ascendingNodeDeg: elements.ascendingNodeDeg,
    argumentOfPerihelionDeg: elements.argumentOfPerihelionDeg,
    perihelionTimeTt: elements.epochTt - (m * (Math.PI / 180)) / meanMotionRadPerDay,
  };
}
