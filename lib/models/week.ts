/**
 * A week at one site: seven nights (Monday–Sunday of the ISO week, or seven nights from a
 * given date) and, per body, the best night and how things change across the week, in
 * sentences a bulletin can print ("brightens from 4.2 to 3.6", "rises 25 minutes earlier each
 * night", "Moon interference ends on Thursday").
 */
import type { Body } from '../core/body.ts';
import type { EventTime } from '../core/events.ts';
import { nightMagnitude } from '../core/body.ts';
import { computeNight, type NightReport } from './night.ts';
import type { Site } from '../core/site.ts';
import { addDays, isoWeekOf, parseLocalDate, type IsoWeek } from '../core/time.ts';
import type { Visibility } from './visibility.ts';

/** A change across the week smaller than this is not worth a sentence, magnitudes. */
const MAGNITUDE_STEP = 0.2;
/** A nightly drift of rise or set times smaller than this is not worth a sentence, minutes. */
const DRIFT_MINUTES = 5;

const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'];

/** English weekday of a `YYYY-MM-DD` date. */
export function weekdayName(date: string): string {
  const { year, month, day } = parseLocalDate(date);
  return WEEKDAYS[new Date(Date.UTC(year, month - 1, day)).getUTCDay()]!;
}

export interface BodyWeek {
  body: Body;
  /** Visibility per night, in night order. */
  nights: { date: string; visibility: Visibility }[];
  /** The night with the largest margin at its best time, or null when never visible. */
  bestNight: string | null;
  /** Magnitude on the first and last night (V, outside the atmosphere). */
  magnitude: { first: number; last: number; brightest: number; faintest: number };
  /** Nights on which moonlight at least doubles the sky brightness at the target (or hides it). */
  moonInterference: string[];
  /** Sentences describing the week's changes, possibly empty. */
  changes: string[];
}

export interface WeekReport {
  site: Site;
  week: IsoWeek;
  nights: NightReport[];
  bodies: BodyWeek[];
}

function minutesOfDay(e: EventTime, night: NightReport): number | null {
  return e.time ? (e.time.getTime() - night.night.start.getTime()) / 60_000 : null;
}

/**
 * Mean nightly drift of an event time, minutes per night (positive: later), from nights where it
 * happens: a least-squares slope. Clock times are unwrapped first (each within ±12 h of the one
 * before), so a moonrise that moves across local noon from one night to the next is a drift of
 * about 50 minutes, not a jump of a day.
 */
function drift(values: (number | null)[]): number | null {
  const pts: [number, number][] = [];
  for (const [i, v] of values.entries()) {
    if (v === null) continue;
    const prev = pts[pts.length - 1]?.[1];
    pts.push([i, prev === undefined ? v : v + 1440 * Math.round((prev - v) / 1440)]);
  }
  if (pts.length < 3) return null;
  const n = pts.length;
  const mx = pts.reduce((s, p) => s + p[0], 0) / n;
  const my = pts.reduce((s, p) => s + p[1], 0) / n;
  const sxx = pts.reduce((s, p) => s + (p[0] - mx) ** 2, 0);
  const sxy = pts.reduce((s, p) => s + (p[0] - mx) * (p[1] - my), 0);
  return sxy / sxx;
}

/** Moonlight interferes with a target: it is washed out by moonlight, or at its best moment moonlight at least doubles the sky brightness at its place (moon ≥ dark-sky part, nL). */
export function moonInterferes(v: Visibility): boolean {
  if (v.reason === 'moonlight') return true;
  const p = v.best?.skyParts;
  return !!p && p.moonNl >= p.darkNl;
}

/** Summarises one body over the nights of a week. */
function summarise(body: Body, nights: NightReport[]): BodyWeek {
  const entries = nights.map((n) => n.bodies.find((b) => b.body.id === body.id)!);
  const visibilities = entries.map((e) => e.visibility);
  const magnitudes = nights.map((n) => nightMagnitude(n.night, body).value);
  let bestNight: string | null = null;
  let bestMargin = -Infinity;
  visibilities.forEach((v, i) => {
    if (v.best && v.best.margin > bestMargin) {
      bestMargin = v.best.margin;
      bestNight = nights[i]!.night.date;
    }
  });
  const changes: string[] = [];
  const first = magnitudes[0]!;
  const last = magnitudes[magnitudes.length - 1]!;
  if (body.kind !== 'sun' && Math.abs(last - first) >= MAGNITUDE_STEP) {
    changes.push(`${last < first ? 'brightens' : 'fades'} from magnitude ${first.toFixed(1)} to ${last.toFixed(1)}`);
  }
  const riseDrift = drift(entries.map((e, i) => minutesOfDay(e.rise, nights[i]!)));
  const setDrift = drift(entries.map((e, i) => minutesOfDay(e.set, nights[i]!)));
  const sentence = (verb: string, d: number): string => `${verb} ${Math.round(Math.abs(d))} minutes ${d < 0 ? 'earlier' : 'later'} each night`;
  if (riseDrift !== null && Math.abs(riseDrift) >= DRIFT_MINUTES) changes.push(sentence('rises', riseDrift));
  else if (setDrift !== null && Math.abs(setDrift) >= DRIFT_MINUTES) changes.push(sentence('sets', setDrift));
  const moonNights = nights.filter((_, i) => moonInterferes(visibilities[i]!)).map((n) => n.night.date);
  if (body.kind !== 'moon') {
    const flags = visibilities.map(moonInterferes);
    for (let i = 1; i < flags.length; i++) {
      if (flags[i - 1] && !flags[i]) changes.push(`Moon interference ends on ${weekdayName(nights[i]!.night.date)}`);
      if (!flags[i - 1] && flags[i]) changes.push(`Moon interference begins on ${weekdayName(nights[i]!.night.date)}`);
    }
  }
  return {
    body,
    nights: visibilities.map((visibility, i) => ({ date: nights[i]!.night.date, visibility })),
    bestNight,
    magnitude: { first, last, brightest: Math.min(...magnitudes), faintest: Math.max(...magnitudes) },
    moonInterference: moonNights,
    changes,
  };
}


/**
 * The week containing `date` (ISO week, Monday–Sunday) at `site`, for `bodies`.
 * With `{ from: 'date' }` the seven nights start on `date` itself instead.
 */
export function computeWeek(site: Site, date: string, bodies: readonly Body[], options: { from?: 'monday' | 'date' } = {}): WeekReport {
  const week = isoWeekOf(date);
  const days = options.from === 'date' ? Array.from({ length: 7 }, (_, i) => addDays(date, i)) : week.days;
  const nights = days.map((d) => computeNight(site, d, bodies));
  return { site, week, nights, bodies: bodies.map((b) => summarise(b, nights)) };
}
