/**
 * Sites: where a bulletin is for. A site is validated once, up front, so every later step can
 * trust its fields; a bad value is a `GloamingError` naming the field, the value and the range.
 */
import * as Astronomy from 'astronomy-engine';
import { GloamingError, type Place } from './errors.ts';
import { assertTimeZone, offsetMinutes } from './time.ts';

/**
 * How dark the site's moonless sky is, in one of the three ways people state it: `{ bortle }`
 * (class 1–9), `{ sqm }` (mag/arcsec²) or `{ nelm }` (naked-eye limiting magnitude at the zenith);
 * `lib/models/sky/quality.ts` turns it into a sky brightness.
 */
export type SkyQuality = { bortle: number } | { sqm: number } | { nelm: number };

/** The kind of optical aid a reader uses, as verdicts and findability margins name it. */
export type InstrumentKind = 'naked-eye' | 'binoculars' | 'telescope';

/** One point of a local horizon profile: the skyline's altitude at an azimuth. */
export interface HorizonPoint {
  /** Degrees from north through east, 0–360. */
  azimuthDeg: number;
  /** Apparent altitude of the skyline (trees, buildings, hills), degrees, −5–60. */
  altitudeDeg: number;
}

/** Local clock times between which the audience will be outside. */
export interface ViewingHours {
  /** Minutes after local midnight of the evening date at which viewing starts (may exceed 1440 for after-midnight starts). */
  startMinutes: number;
  /** Minutes after local midnight of the evening date at which viewing ends (> start; up to 1440 + 720). */
  endMinutes: number;
  /** As written, e.g. `19:00–23:30`. */
  label: string;
}

export interface Site {
  id: string;
  name: string;
  /** Geodetic latitude, degrees north, −90…90. */
  latitudeDeg: number;
  /** Longitude, degrees east, −180…180. */
  longitudeDeg: number;
  /** Height above mean sea level, metres. */
  elevationM: number;
  /** IANA time zone. */
  timeZone: string;
  sky: SkyQuality;
  /** Sorted by azimuth; empty for a flat horizon. */
  horizon: HorizonPoint[];
  /** Lowest altitude worth recommending, degrees (default 5). */
  minAltitudeDeg: number;
  /** Audience viewing hours, or null for the default (`DEFAULT_VIEWING_HOURS` hours from sunset, see `lib/models/visibility.ts`). */
  viewingHours: ViewingHours | null;
  /**
   * Findability margin per optical aid, magnitudes: how far above the 50 % detection threshold a target must be
   * before gloaming recommends it (`margin >= requiredMargin`). Default `DEFAULT_FINDABILITY_MARGIN_MAG`.
   */
  findabilityMarginMag: Readonly<Record<InstrumentKind, number>>;
  /** Largest allowed difference between the zone's standard offset and longitude/15, hours (default 3.5). */
  zoneToleranceHours: number;
  /** BCP 47 locale for formatting times (12/24-hour clock), e.g. `en-GB`. */
  locale: string;
  /** A sentence or two about the site for its page (may be empty). */
  description: string;
  /** The observer for `astronomy-engine`. */
  observer: Astronomy.Observer;
}

/** What a site is written as (in `content/sites/*.yaml` or on the command line). */
export interface SiteInput {
  id?: unknown;
  name?: unknown;
  latitude?: unknown;
  longitude?: unknown;
  elevation?: unknown;
  timeZone?: unknown;
  sky?: unknown;
  horizon?: unknown;
  minAltitude?: unknown;
  viewingHours?: unknown;
  locale?: unknown;
  description?: unknown;
  findabilityMargin?: unknown;
  zoneTolerance?: unknown;
}

const FIELDS = ['id', 'name', 'latitude', 'longitude', 'elevation', 'timeZone', 'sky', 'horizon', 'minAltitude', 'viewingHours', 'locale', 'description', 'findabilityMargin', 'zoneTolerance'];

/**
 * How far (magnitudes) a target must stand above Schaefer's threshold before a bulletin recommends it, per aid.
 * Schaefer's limiting magnitude is the 50 % detection limit of an observer who knows exactly where to look;
 * a member of the public scanning for a target needs it clearly brighter. One magnitude (a factor 2.5 in light)
 * is common practice (this project's choice, not a published value); sites may override it (`findabilityMargin`).
 */
export const DEFAULT_FINDABILITY_MARGIN_MAG: Readonly<Record<InstrumentKind, number>> = Object.freeze({
  'naked-eye': 1,
  binoculars: 1,
  telescope: 1,
});

/**
 * Default bound on |standard zone offset − longitude/15|, hours. Legal zones run up to about 3 h from
 * their longitude (western China: UTC+8 at 76° E is 2.9 h); beyond 3.5 h a zone is almost surely the wrong
 * one for the coordinates (a site at 68° W with Asia/Tokyo). Sites with a real exception set `zoneTolerance`.
 */
export const DEFAULT_ZONE_TOLERANCE_HOURS = 3.5;

const KINDS: readonly InstrumentKind[] = ['naked-eye', 'binoculars', 'telescope'];

function parseFindability(value: unknown): Readonly<Record<InstrumentKind, number>> {
  if (value === undefined || value === null) return DEFAULT_FINDABILITY_MARGIN_MAG;
  const what = 'a findability margin in magnitudes';
  if (typeof value === 'number' || typeof value !== 'object' || Array.isArray(value)) {
    const m = numberIn(value, 'findabilityMargin', 0, 3, what);
    return Object.freeze({ 'naked-eye': m, binoculars: m, telescope: m });
  }
  const o = value as Record<string, unknown>;
  for (const key of Object.keys(o)) {
    if (!KINDS.includes(key as InstrumentKind)) {
      throw new GloamingError('unknown-field', `unknown optical aid '${key}' in findabilityMargin`, { place: { field: `findabilityMargin.${key}` }, expected: `one of ${KINDS.join(', ')}` });
    }
  }
  const out = { ...DEFAULT_FINDABILITY_MARGIN_MAG };
  for (const kind of KINDS) if (o[kind] !== undefined) out[kind] = numberIn(o[kind], `findabilityMargin.${kind}`, 0, 3, what);
  return Object.freeze(out);
}

/** Formats an offset in hours as `UTC+09:00` / `UTC−04:33`. */
function utcOffsetLabel(hours: number): string {
  const minutes = Math.round(Math.abs(hours) * 60);
  return `UTC${hours < 0 ? '\u2212' : '+'}${String(Math.floor(minutes / 60)).padStart(2, '0')}:${String(minutes % 60).padStart(2, '0')}`;
}

/**
 * The zone's standard offset (the smaller of its January and July offsets in 2026), hours east of Greenwich.
 * Sanity check only: it does not need the offset of any particular date.
 */
export function standardOffsetHours(timeZone: string): number {
  const jan = offsetMinutes(new Date(Date.UTC(2026, 0, 15)), timeZone);
  const jul = offsetMinutes(new Date(Date.UTC(2026, 6, 15)), timeZone);
  return Math.min(jan, jul) / 60;
}

/** Raises a `timeZone` error when the zone's standard offset is further than `toleranceHours` from longitude/15. */
function checkZoneAgainstLongitude(timeZone: string, longitudeDeg: number, toleranceHours: number): void {
  const offset = standardOffsetHours(timeZone);
  const solar = longitudeDeg / 15;
  const diff = ((((offset - solar) % 24) + 36) % 24) - 12; // wrapped to −12…12 (Kiribati's +14 is −10)
  if (Math.abs(diff) <= toleranceHours) return;
  const side = longitudeDeg < 0 ? `${(-longitudeDeg).toFixed(2)}° W` : `${longitudeDeg.toFixed(2)}° E`;
  throw new GloamingError(
    'invalid-value',
    `time zone ${timeZone} (${utcOffsetLabel(offset)}) is ${Math.abs(diff).toFixed(1)} h from the site's longitude (${side}, about ${utcOffsetLabel(solar)}): every time on the site's pages would be wrong`,
    {
      place: { field: 'timeZone' },
      actual: timeZone,
      expected: `the zone the site's clocks keep, within ${toleranceHours} h of longitude/15; if this zone is right, allow it with 'zoneTolerance: ${Math.ceil(Math.abs(diff))}' (hours)`,
    },
  );
}

function fail(field: string, reason: string, actual: unknown, expected: string): never {
  throw new GloamingError('invalid-value', reason, { place: { field }, actual, expected });
}

/** A finite number within [min, max]; raises a field error otherwise. */
export function numberIn(value: unknown, field: string, min: number, max: number, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    fail(field, `${field} must be a number`, value, `${what}, a number from ${min} to ${max}`);
  }
  if (value < min || value > max) fail(field, `${field} is out of range`, value, `${what} from ${min} to ${max}`);
  return value;
}

function required(input: Record<string, unknown>, field: string, expected: string): unknown {
  if (input[field] === undefined || input[field] === null) {
    throw new GloamingError('missing-field', `missing field '${field}'`, { place: { field }, expected });
  }
  return input[field];
}

function parseSky(value: unknown): SkyQuality {
  if (value === undefined) return { bortle: 5 };
  if (typeof value === 'string') return parseSkyArgument(value, 'sky');
  if (typeof value !== 'object' || value === null || Array.isArray(value)) {
    fail('sky', 'sky must give one of bortle, sqm or nelm', value, 'e.g. { bortle: 6 } or { sqm: 20.4 } or { nelm: 5.5 }');
  }
  const keys = Object.keys(value);
  if (keys.length !== 1) fail('sky', 'sky must give exactly one of bortle, sqm or nelm', value, 'e.g. { bortle: 6 }');
  const v = value as Record<string, unknown>;
  if ('bortle' in v) {
    const b = numberIn(v.bortle, 'sky.bortle', 1, 9, 'a Bortle class');
    if (!Number.isInteger(b)) fail('sky.bortle', 'a Bortle class is a whole number', b, 'an integer from 1 to 9');
    return { bortle: b };
  }
  if ('sqm' in v) return { sqm: numberIn(v.sqm, 'sky.sqm', 15, 22.5, 'an SQM reading in mag/arcsec²') };
  if ('nelm' in v) return { nelm: numberIn(v.nelm, 'sky.nelm', 1, 8.5, 'a naked-eye limiting magnitude') };
  return fail(`sky.${keys[0]}`, `unknown sky quality '${keys[0]}'`, keys[0], 'bortle, sqm or nelm');
}

/** Reads the command-line form `bortle:6`, `sqm:20.4` or `nelm:5.5`. */
export function parseSkyArgument(text: string, field = 'sky'): SkyQuality {
  const m = /^(bortle|sqm|nelm):(.+)$/.exec(text.trim());
  if (!m) fail(field, `cannot read the sky quality '${text}'`, text, 'bortle:<1–9>, sqm:<mag/arcsec²> or nelm:<magnitude>');
  const n = Number(m[2]);
  return parseSky({ [m[1]!]: Number.isFinite(n) ? n : m[2] });
}

function parseHorizon(value: unknown): HorizonPoint[] {
  if (value === undefined || value === null) return [];
  if (!Array.isArray(value)) fail('horizon', 'horizon must be a list', value, 'a list of { azimuth, altitude } points');
  const points = value.map((p: unknown, i: number): HorizonPoint => {
    const field = `horizon.${i}`;
    if (Array.isArray(p) && p.length === 2) {
      return {
        azimuthDeg: numberIn(p[0], `${field}.0`, 0, 360, 'an azimuth in degrees'),
        altitudeDeg: numberIn(p[1], `${field}.1`, -5, 60, 'a skyline altitude in degrees'),
      };
    }
    if (typeof p !== 'object' || p === null) fail(field, 'a horizon point must be { azimuth, altitude }', p, '{ azimuth: 250, altitude: 8 }');
    const o = p as Record<string, unknown>;
    return {
      azimuthDeg: numberIn(o.azimuth, `${field}.azimuth`, 0, 360, 'an azimuth in degrees'),
      altitudeDeg: numberIn(o.altitude, `${field}.altitude`, -5, 60, 'a skyline altitude in degrees'),
    };
  });
  return points.sort((a, b) => a.azimuthDeg - b.azimuthDeg);
}

const HOURS_RE = /^(\d{1,2}):(\d{2})\s*(?:-|–|to)\s*(\d{1,2}):(\d{2})$/;

/** Reads viewing hours like `19:00–23:30` or `04:30-06:30` (a morning window). */
export function parseViewingHours(value: unknown, field = 'viewingHours'): ViewingHours | null {
  if (value === undefined || value === null) return null;
  const m = typeof value === 'string' ? HOURS_RE.exec(value.trim()) : null;
  const expected = "a local time range such as '19:00–23:30' (evening) or '04:30–06:30' (morning)";
  if (!m) fail(field, 'cannot read the viewing hours', value, expected);
  const [h1, m1, h2, m2] = [m[1], m[2], m[3], m[4]].map(Number) as [number, number, number, number];
  if (h1 > 23 || h2 > 24 || m1 > 59 || m2 > 59) fail(field, 'viewing hours contain an impossible time', value, expected);
  // Times before noon belong to the morning after the evening date.
  let start = h1 * 60 + m1;
  let end = h2 * 60 + m2;
  if (start < 12 * 60) start += 1440;
  if (end <= 12 * 60) end += 1440;
  if (end <= start) fail(field, 'viewing hours end before they start', value, expected);
  return { startMinutes: start, endMinutes: end, label: (value as string).trim() };
}

/**
 * Validates a site description and returns a `Site`. Every problem is a `GloamingError` with
 * `place.field` naming the field, so a YAML loader can add the line and column.
 */
export function defineSite(input: unknown, place?: Place): Site {
  try {
    if (typeof input !== 'object' || input === null || Array.isArray(input)) {
      fail('', 'a site must be a mapping of fields', input, 'latitude, longitude, timeZone, …');
    }
    const o = input as Record<string, unknown>;
    for (const key of Object.keys(o)) {
      if (!FIELDS.includes(key)) {
        throw new GloamingError('unknown-field', `unknown site field '${key}'`, {
          place: { field: key },
          expected: `one of ${FIELDS.join(', ')}`,
        });
      }
    }
    const latitudeDeg = numberIn(required(o, 'latitude', 'degrees north, −90 to 90'), 'latitude', -90, 90, 'a latitude in degrees north');
    const longitudeDeg = numberIn(required(o, 'longitude', 'degrees east, −180 to 180'), 'longitude', -180, 180, 'a longitude in degrees east');
    const elevationM = o.elevation === undefined ? 0 : numberIn(o.elevation, 'elevation', -500, 9000, 'an elevation in metres');
    const zone = required(o, 'timeZone', "an IANA time zone such as 'Europe/Berlin'");
    if (typeof zone !== 'string') fail('timeZone', 'timeZone must be text', zone, "an IANA zone such as 'Europe/Berlin'");
    const timeZone = assertTimeZone(zone);
    const id = o.id === undefined ? 'site' : o.id;
    if (typeof id !== 'string' || !/^[a-z0-9][a-z0-9-]*$/.test(id)) {
      fail('id', 'a site id is a lower-case slug', id, "letters a–z, digits and hyphens, e.g. 'harbour-roof'");
    }
    const name = o.name === undefined ? id : o.name;
    if (typeof name !== 'string' || name.trim() === '') fail('name', 'a site name is non-empty text', name, 'a display name');
    const description = o.description === undefined ? '' : o.description;
    if (typeof description !== 'string') fail('description', 'a site description is text', description, 'a sentence or two');
    const zoneToleranceHours = o.zoneTolerance === undefined ? DEFAULT_ZONE_TOLERANCE_HOURS : numberIn(o.zoneTolerance, 'zoneTolerance', 0, 12, 'a tolerance in hours');
    checkZoneAgainstLongitude(timeZone, longitudeDeg, zoneToleranceHours);
    const locale = o.locale === undefined ? 'en-GB' : o.locale;
    if (typeof locale !== 'string' || !isLocale(locale)) fail('locale', 'unknown locale', locale, "a BCP 47 locale such as 'en-GB' or 'en-US'");
    return {
      id,
      name,
      latitudeDeg,
      longitudeDeg,
      elevationM,
      timeZone,
      sky: parseSky(o.sky),
      horizon: parseHorizon(o.horizon),
      minAltitudeDeg: o.minAltitude === undefined ? 5 : numberIn(o.minAltitude, 'minAltitude', 0, 45, 'a minimum altitude in degrees'),
      viewingHours: parseViewingHours(o.viewingHours),
      findabilityMarginMag: parseFindability(o.findabilityMargin),
      zoneToleranceHours,
      locale,
      description: description.trim(),
      observer: new Astronomy.Observer(latitudeDeg, longitudeDeg, elevationM),
    };
  } catch (error) {
    if (error instanceof GloamingError && place) throw error.at(place);
    throw error;
  }
}

function isLocale(tag: string): boolean {
  try {
    return Intl.DateTimeFormat.supportedLocalesOf([tag]).length > 0;
  } catch {
    return false;
  }
}

/**
 * Altitude of the site's skyline at `azimuthDeg`, degrees, by linear interpolation between the
 * profile's points (wrapping through north). A flat horizon is 0°.
 */
export function skylineAltitudeDeg(site: Pick<Site, 'horizon'>, azimuthDeg: number): number {
  const h = site.horizon;
  if (h.length === 0) return 0;
  if (h.length === 1) return h[0]!.altitudeDeg;
  const az = ((azimuthDeg % 360) + 360) % 360;
  for (let i = 0; i < h.length; i++) {
    const a = h[i]!;
    const b = h[(i + 1) % h.length]!;
    const span = (b.azimuthDeg - a.azimuthDeg + 360) % 360 || 360;
    const offset = (az - a.azimuthDeg + 360) % 360;
    if (offset <= span) return a.altitudeDeg + ((b.altitudeDeg - a.altitudeDeg) * offset) / span;
  }
  return h[0]!.altitudeDeg;
}
