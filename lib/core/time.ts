/**
 * Civil time in a site's zone. All conversions go through the platform's IANA zone data
 * (`Intl.DateTimeFormat`), never through hand-made offset tables, so daylight-saving changes are
 * right wherever the platform is right.
 *
 * Vocabulary:
 * - a *local date* is a `YYYY-MM-DD` string in the site's zone;
 * - a *night* runs from local noon of its date to local noon of the next date, so the evening
 *   and the following morning belong to the same night;
 * - a *week* is the ISO 8601 week (Monday to Sunday) containing a date.
 */
import { GloamingError, quoteValue } from './errors.ts';

const formatters = new Map<string, Intl.DateTimeFormat>();

function formatter(zone: string): Intl.DateTimeFormat {
  let f = formatters.get(zone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-US', {
      timeZone: zone,
      hourCycle: 'h23',
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
      hour: '2-digit',
      minute: '2-digit',
      second: '2-digit',
    });
    formatters.set(zone, f);
  }
  return f;
}

/** Checks that `zone` is an IANA zone the platform knows; returns its canonical spelling. */
export function assertTimeZone(zone: string, field = 'timeZone'): string {
  const unknown = (): GloamingError =>
    new GloamingError('unknown-zone', `unknown time zone ${quoteValue(zone)}`, {
      place: { field },
      expected: "an IANA time zone such as 'Europe/Berlin' or 'America/Santiago'",
      // The platform also takes bare offsets ('+05:00'); they are not zones: they know no daylight saving.
      ...(/^[+-]\d/.test(zone.trim()) ? { hint: "a fixed offset is not a zone; use 'Etc/GMT-5' for UTC+5 (the Etc sign is inverted) or the place's IANA zone" } : {}),
    });
  if (/^[+-]\d/.test(zone.trim())) throw unknown();
  try {
    return new Intl.DateTimeFormat('en-US', { timeZone: zone }).resolvedOptions().timeZone;
  } catch {
    throw unknown();
  }
}

/** Calendar fields of an instant in a zone. */
export interface ZonedParts {
  year: number;
  month: number;
  day: number;
  hour: number;
  minute: number;
  second: number;
}

/** The platform's wall-clock fields of `instant` in `zone` (seconds truncated): one `formatToParts` call. */
function platformParts(instant: Date, zone: string): ZonedParts {
  const parts = formatter(zone).formatToParts(instant);
  const get = (type: Intl.DateTimeFormatPartTypes): number => Number(parts.find((p) => p.type === type)!.value);
  return {
    year: get('year'),
    month: get('month'),
    day: get('day'),
    hour: get('hour'),
    minute: get('minute'),
    second: get('second'),
  };
}

/** The platform's UTC offset of `zone` at `ms` (a whole second), seconds east of Greenwich. */
function platformOffset(ms: number, zone: string): number {
  const p = platformParts(new Date(ms), zone);
  return Math.round((Date.UTC(p.year, p.month - 1, p.day, p.hour, p.minute, p.second) - ms) / 1000);
}

/** Length of the spans over which offsets are remembered, ms (a quarter of an hour). */
const SPAN_MS = 900_000;
/** Remembered offsets per zone, by span number; null for a span in which the offset changes. */
const spanOffsets = new Map<string, Map<number, number | null>>();

/**
 * UTC offset of `zone` at the whole second `ms`, seconds east. Asking the platform costs a
 * `formatToParts` call (about 10 µs) and a week of pages asks for thousands of instants, so the
 * offset is remembered per quarter hour of UTC when the platform gives the same offset at the
 * span's first and last second: a zone's offset changes at most once in a quarter hour (IANA tz
 * database), so it then holds for the whole span. In a span with a change the platform is asked
 * each time.
 */
function offsetAt(ms: number, zone: string): number {
  let spans = spanOffsets.get(zone);
  if (!spans) spanOffsets.set(zone, (spans = new Map()));
  const span = Math.floor(ms / SPAN_MS);
  let offset = spans.get(span);
  if (offset === undefined) {
    const first = platformOffset(span * SPAN_MS, zone);
    offset = first === platformOffset(span * SPAN_MS + SPAN_MS - 1000, zone) ? first : null;
    if (spans.size > 200_000) spans.clear(); // about five years of quarter hours
    spans.set(span, offset);
  }
  return offset ?? platformOffset(ms, zone);
}

/** The wall-clock fields of `instant` in `zone` (seconds truncated). */
export function zonedParts(instant: Date, zone: string): ZonedParts {
  const ms = Math.floor(instant.getTime() / 1000) * 1000;
  const local = new Date(ms + offsetAt(ms, zone) * 1000);
  return {
    year: local.getUTCFullYear(),
    month: local.getUTCMonth() + 1,
    day: local.getUTCDate(),
    hour: local.getUTCHours(),
    minute: local.getUTCMinutes(),
    second: local.getUTCSeconds(),
  };
}

/**
 * UTC offset of `zone` at `instant`, seconds east of Greenwich (e.g. 3600 for CET). Historical
 * local mean times keep their seconds (Dublin until 1916: −00:25:21 = −1521 s, IANA tz database).
 */
export function offsetSeconds(instant: Date, zone: string): number {
  return offsetAt(Math.floor(instant.getTime() / 1000) * 1000, zone);
}

/** UTC offset of `zone` at `instant`, minutes east of Greenwich (e.g. +60 for CET), rounded to the minute. */
export function offsetMinutes(instant: Date, zone: string): number {
  return Math.round(offsetSeconds(instant, zone) / 60);
}

/**
 * The years gloaming accepts in dates and instants given to it: 1000 to 2999. Astronomy Engine's
 * ΔT follows Espenak & Meeus (2006), whose polynomials end in 3000; before 1000 no zone has civil
 * time (the IANA database gives local mean time) and JavaScript dates of years below 100 are
 * read as 19xx. Inside gloaming, weeks and nights may run a few days past these years.
 */
export const SUPPORTED_YEARS = { first: 1000, last: 2999 } as const;

function supportedYear(year: number): boolean {
  return year >= SUPPORTED_YEARS.first && year <= SUPPORTED_YEARS.last;
}

const DATE_RE = /^(\d{4})-(\d{2})-(\d{2})$/;

/**
 * Reads a `YYYY-MM-DD` date given to gloaming; raises `invalid-date` naming `field` when it is not
 * a real date or lies outside `SUPPORTED_YEARS`.
 */
export function parseLocalDate(text: string, field = 'date'): { year: number; month: number; day: number } {
  const value = readDate(text);
  if (!value) {
    throw new GloamingError('invalid-date', `cannot read the date ${quoteValue(text)}`, {
      place: { field },
      expected: 'a calendar date written YYYY-MM-DD, e.g. 2026-12-04',
    });
  }
  if (!supportedYear(value.year)) throw outOfRange(text, field);
  return value;
}

function outOfRange(text: string, field: string): GloamingError {
  return new GloamingError('invalid-date', `the date ${quoteValue(text)} is outside the years gloaming computes`, {
    place: { field },
    expected: `a date from ${SUPPORTED_YEARS.first}-01-01 to ${SUPPORTED_YEARS.last}-12-31`,
  });
}

/** A real `YYYY-MM-DD` date of any four-digit year (for arithmetic inside gloaming), or null. */
function readDate(text: string): { year: number; month: number; day: number } | null {
  const m = DATE_RE.exec(text.trim());
  const value = m && { year: Number(m[1]), month: Number(m[2]), day: Number(m[3]) };
  return value && isRealDate(value.year, value.month, value.day) ? value : null;
}

/** `readDate` for dates gloaming made itself: a failure is a bug, not an input problem. */
function internalDate(text: string): { year: number; month: number; day: number } {
  const value = readDate(text);
  if (!value) return parseLocalDate(text);
  return value;
}

function isRealDate(year: number, month: number, day: number): boolean {
  const d = new Date(0);
  d.setUTCFullYear(year, month - 1, day); // Date.UTC would read years 0–99 as 1900–1999

  return d.getUTCFullYear() === year && d.getUTCMonth() === month - 1 && d.getUTCDate() === day;
}

const INSTANT_RE = /^(\d{4}-\d{2}-\d{2})T(\d{2}):(\d{2})(?::(\d{2})(\.\d+)?)?(Z|[+-](\d{2}):?(\d{2}))$/;

/**
 * Reads an ISO 8601 instant with an explicit offset or `Z`; raises `invalid-date` when it is not
 * written so, names a day or time that does not exist (2026-02-30, 24:00, 23:60, an offset beyond
 * ±14:00 — the Date parser would roll them over) or falls outside `SUPPORTED_YEARS`.
 */
export function parseInstant(text: string, field = 'at'): Date {
  const m = INSTANT_RE.exec(text.trim());
  const d = new Date(text.trim());
  const real =
    m &&
    readDate(m[1]!) &&
    Number(m[2]) < 24 &&
    Number(m[3]) < 60 &&
    Number(m[4] ?? 0) < 60 &&
    (m[6] === 'Z' || (Number(m[7]) * 60 + Number(m[8]) <= 14 * 60 && Number(m[8]) < 60)) &&
    !Number.isNaN(d.getTime());
  if (!real) {
    throw new GloamingError('invalid-date', `cannot read the instant ${quoteValue(text)}`, {
      place: { field },
      expected: 'an ISO 8601 instant with a zone, e.g. 2026-12-04T18:30:00Z or 2026-12-04T19:30+01:00',
    });
  }
  if (!supportedYear(Number(m[1]!.slice(0, 4))) || !supportedYear(d.getUTCFullYear())) throw outOfRange(text, field);
  return d;
}

/** Formats a date as `YYYY-MM-DD`. */
export function formatLocalDate(year: number, month: number, day: number): string {
  return `${String(year).padStart(4, '0')}-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`;
}

/** The local date `days` after `date` (calendar arithmetic, no zone involved). */
export function addDays(date: string, days: number): string {
  const { year, month, day } = internalDate(date);
  const d = new Date(Date.UTC(year, month - 1, day + days));
  return formatLocalDate(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate());
}

/**
 * The instant at which the wall clock in `zone` shows `date` `hour:minute`.
 * In a spring-forward gap the wall time does not exist: the instant returned is the one the
 * clock jumps to (e.g. 02:30 → 03:30). In an autumn fold the earlier of the two instants is returned.
 */
export function zonedTime(date: string, hour: number, minute: number, zone: string): Date {
  const { year, month, day } = internalDate(date);
  const wall = Date.UTC(year, month - 1, day, hour, minute);
  // Zone offsets change at most once within a day either side: the offsets a day before and a day
  // after are the only candidates. A candidate is valid when the instant it gives shows that offset.
  const before = offsetSeconds(new Date(wall - 86_400_000), zone) * 1000;
  const after = offsetSeconds(new Date(wall + 86_400_000), zone) * 1000;
  const valid = [wall - before, wall - after].filter((t) => offsetSeconds(new Date(t), zone) * 1000 === wall - t);
  // Fold: both readings exist, take the earlier. Gap: none exists, the clock jumps forward by the
  // change, which the offset before the change gives (02:30 EST does not exist → 07:30Z = 03:30 EDT).
  return new Date(valid.length ? Math.min(...valid) : wall - before);
}

/** The local date in `zone` of `instant`. */
export function localDateOf(instant: Date, zone: string): string {
  const p = zonedParts(instant, zone);
  return formatLocalDate(p.year, p.month, p.day);
}

/**
 * ISO 8601 text of `instant` with the zone's offset, to the second: `2026-12-04T17:42:10+01:00`.
 * This is the form every gloaming event time takes in JSON. An offset with seconds (local mean
 * time before about 1970, e.g. Dublin's −00:25:21 until 1916) keeps them: `−hh:mm:ss`, so the
 * wall time and the offset always add up to the instant.
 */
export function formatInstant(instant: Date, zone: string): string {
  const rounded = new Date(Math.round(instant.getTime() / 1000) * 1000);
  const p = zonedParts(rounded, zone);
  const off = offsetSeconds(rounded, zone);
  const sign = off < 0 ? '-' : '+';
  const abs = Math.abs(off);
  const pad = (n: number): string => String(n).padStart(2, '0');
  const seconds = abs % 60 ? `:${pad(abs % 60)}` : '';
  return (
    `${formatLocalDate(p.year, p.month, p.day)}T${pad(p.hour)}:${pad(p.minute)}:${pad(p.second)}` +
    `${sign}${pad(Math.floor(abs / 3600))}:${pad(Math.floor(abs / 60) % 60)}${seconds}`
  );
}

/** A night: from local noon of `date` to local noon of the next date. */
export interface Night {
  /** Local date of the evening, `YYYY-MM-DD`. */
  date: string;
  /** Local noon of `date`. */
  start: Date;
  /** Local noon of the next date. */
  end: Date;
  timeZone: string;
}

/**
 * The night that begins on the local evening of `date` in `zone`. Raises `invalid-date` for a date
 * the zone's clocks skipped (Pacific/Apia had no 30 December 2011: it moved across the date line),
 * which has no evening and so no night.
 */
export function nightOf(date: string, zone: string): Night {
  internalDate(date);
  const start = zonedTime(date, 12, 0, zone);
  const end = zonedTime(addDays(date, 1), 12, 0, zone);
  if (localDateOf(start, zone) !== date) {
    throw new GloamingError('invalid-date', `the date ${quoteValue(date)} did not happen in ${zone}: its clocks skipped that day`, {
      place: { field: 'date' },
      expected: `a date that exists in ${zone}, such as ${localDateOf(end, zone)}`,
    });
  }
  return { date, start, end, timeZone: zone };
}

/** Local midnight that splits the night of `night.date` (the start of the next date). */
export function localMidnight(night: Night): Date {
  return zonedTime(addDays(night.date, 1), 0, 0, night.timeZone);
}

/** An ISO 8601 week. */
export interface IsoWeek {
  /** ISO week-numbering year (may differ from the calendar year near New Year). */
  year: number;
  /** Week number 1–53. */
  week: number;
  /** `YYYY-Www`, e.g. `2026-W53`. */
  id: string;
  /** The seven local dates Monday…Sunday. */
  days: string[];
}

/** The ISO 8601 week (Monday–Sunday) that contains `date`. */
export function isoWeekOf(date: string): IsoWeek {
  const { year, month, day } = internalDate(date);
  const d = new Date(Date.UTC(year, month - 1, day));
  const weekday = (d.getUTCDay() + 6) % 7; // Monday = 0
  const monday = addDays(date, -weekday);
  // The week belongs to the year of its Thursday.
  const thursday = new Date(Date.UTC(year, month - 1, day - weekday + 3));
  const isoYear = thursday.getUTCFullYear();
  const jan1 = Date.UTC(isoYear, 0, 1);
  const week = 1 + Math.floor((thursday.getTime() - jan1) / (7 * 86_400_000));
  return {
    year: isoYear,
    week,
    id: `${isoYear}-W${String(week).padStart(2, '0')}`,
    days: Array.from({ length: 7 }, (_, i) => addDays(monday, i)),
  };
}

/** A 12- or 24-hour clock. */
export type Clock = 12 | 24;
/** How finely a clock time is shown. */
export type TimePrecision = 'minute' | 'second';

const clockFormatters = new Map<string, Intl.DateTimeFormat>();

function clockFormatter(key: string, make: () => Intl.DateTimeFormat): Intl.DateTimeFormat {
  let f = clockFormatters.get(key);
  if (!f) {
    f = make();
    clockFormatters.set(key, f);
  }
  return f;
}

/** The clock a locale uses by default: 12 for `en-US`, 24 for `en-GB`, `de-DE`, … */
export function defaultClock(locale: string): Clock {
  const cycle = clockFormatter(`cycle|${locale}`, () => new Intl.DateTimeFormat(locale, { hour: 'numeric' })).resolvedOptions().hourCycle;
  return cycle === 'h11' || cycle === 'h12' ? 12 : 24;
}

/** `instant` rounded to the nearest minute or second (almanac practice: times are rounded, not truncated). */
export function roundInstant(instant: Date, precision: TimePrecision): Date {
  const step = precision === 'second' ? 1000 : 60_000;
  return new Date(Math.round(instant.getTime() / step) * step);
}

/**
 * Wall-clock time of `instant` in a site's zone and locale, rounded: `16:29` and `04:16` on a
 * 24-hour clock (two-digit hours), `4:29 pm` on a 12-hour one, `16:29:35` to the second. The clock
 * defaults to the locale's. The one clock formatter for pages, charts and alt text. Spaces inside
 * the time are no-break spaces (U+00A0), so "8:10 p. m." never wraps between its parts.
 */
export function formatClock(instant: Date, site: { locale: string; timeZone: string }, options: { clock?: Clock; precision?: TimePrecision } = {}): string {
  const clock = options.clock ?? defaultClock(site.locale);
  const precision = options.precision ?? 'minute';
  const f = clockFormatter(`clock|${site.locale}|${site.timeZone}|${clock}|${precision}`, () =>
    new Intl.DateTimeFormat(site.locale, {
      timeZone: site.timeZone,
      hour: clock === 24 ? '2-digit' : 'numeric',
      minute: '2-digit',
      ...(precision === 'second' ? { second: '2-digit' } : {}),
      hourCycle: clock === 24 ? 'h23' : 'h12',
    }),
  );
  return f.format(roundInstant(instant, precision)).replace(/\s/g, '\u00a0');
}
