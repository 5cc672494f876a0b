/**
 * A week at one site, the one week model that the command line, the placeholders and the site
 * read: the seven nights of an ISO week (Monday–Sunday evenings), each site-night computed once
 * (`computeNight`), each body once per night on that night's shared frame (`NightReport.body`),
 * and per body the best night and how things change across the week, in sentences a bulletin can
 * print ("brightens from 4.2 to 3.6", "rises 25 minutes earlier each night", "Moon interference
 * ends on Thursday"). Everything is computed on first use; a `WeekCache` shares each site-week
 * across every placeholder, page and command of a run.
 */
import * as Astronomy from 'astronomy-engine';
import { BodyRegistry, builtInBody, nightMagnitude, type Body } from '../core/body.ts';
import type { EventTime } from '../core/events.ts';
import { separationDeg } from '../core/geometry.ts';
import { observe, type Observation } from '../core/observe.ts';
import type { Site } from '../core/site.ts';
import { isoWeekOf, localMidnight, parseLocalDate, type IsoWeek } from '../core/time.ts';
import { computeNight, type BodyNight, type NightReport } from './night.ts';
import type { Visibility } from './visibility.ts';
import { passNights, type PassNight } from './satellite/nights.ts';
import type { Satellite } from './satellite/passes.ts';

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
  nights: readonly NightReport[];
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
function summarise(body: Body, week: WeekData): BodyWeek {
  const nights = week.nights;
  const entries = nights.map((_, i) => week.bodyNight(i, body));
  const visibilities = entries.map((e) => e.visibility);
  const magnitudes = week.magnitudes(body).values;
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

/** One body over the week: its expected magnitude at local midnight of each night. */
export interface WeekMagnitudes {
  /** V magnitude at local midnight of each of the 7 nights, Monday first. */
  values: number[];
  /** Model band (brightest, faintest) over the week, when the body's model gives one (comets). */
  brightest: number;
  faintest: number;
}

/**
 * The one week model: one site and one ISO week. Everything is computed on first use and then
 * kept: the seven nights, each body's night on that night's shared frame, magnitudes,
 * elongations, positions, each body's summary, and what later stages derive from the week (the
 * almanac's events, see `derived`).
 */
export class WeekData {
  readonly site: Site;
  readonly week: IsoWeek;
  /** The bodies placeholders and events may name (built-in ones plus loaded objects). */
  readonly bodies: BodyRegistry;
  /** The satellites followed (content/satellites/), for passes and `satellite-pass` events. */
  readonly satellites: readonly Satellite[];
  #nights: readonly NightReport[] | undefined;
  #passes: PassNight[] | undefined;
  readonly #observations = new Map<string, Observation>();
  readonly #magnitudes = new Map<string, WeekMagnitudes>();
  readonly #elongations = new Map<string, number>();
  readonly #summaries = new Map<string, BodyWeek>();
  readonly #derived = new Map<string, unknown>();

  constructor(site: Site, week: IsoWeek, bodies: BodyRegistry = new BodyRegistry(), satellites: readonly Satellite[] = []) {
    this.site = site;
    this.week = week;
    this.bodies = bodies;
    this.satellites = satellites;
  }

  /** The satellite passes of the week's seven nights, night by night (lib/models/satellite/nights.ts), computed once. */
  passNights(): PassNight[] {
    this.#passes ??= passNights({ site: this.site, satellites: this.satellites, from: this.week.days[0]!, to: this.week.days[6]! });
    return this.#passes;
  }

  /** The seven nights, Monday evening first (`week.days[i]` is `nights[i].night.date`), computed on first use. */
  get nights(): readonly NightReport[] {
    this.#nights ??= this.week.days.map((date) => computeNight(this.site, date, []));
    return this.#nights;
  }

  /** Index 0–6 of a local date inside this week, or −1. */
  indexOf(date: string): number {
    return this.week.days.indexOf(date);
  }

  /** `body`'s night `index` (0 = Monday): the report's own entry, computed once (see `NightReport.body`). */
  bodyNight(index: number, body: Body): BodyNight {
    return this.nights[index]!.body(body);
  }

  /** The week of one body: visibility per night, the best night and the week's changes (computed once). */
  summary(body: Body): BodyWeek {
    let s = this.#summaries.get(body.id);
    if (!s) {
      s = summarise(body, this);
      this.#summaries.set(body.id, s);
    }
    return s;
  }

  /** A value a later stage derives from this week (the almanac's events of a span), computed once per key and kept with the week. */
  derived<T>(key: string, compute: (week: WeekData) => T): T {
    if (!this.#derived.has(key)) this.#derived.set(key, compute(this));
    return this.#derived.get(key) as T;
  }

  /** Exact position of `body` at `instant` from the site (`observe`), memoised per instant. */
  observe(body: Body, instant: Date): Observation {
    const key = `${body.id}@${instant.getTime()}`;
    let o = this.#observations.get(key);
    if (!o) {
      o = observe(this.site, body, instant);
      this.#observations.set(key, o);
    }
    return o;
  }

  /** Local midnight that splits night `index` (the moment magnitudes and elongations are taken at). */
  midnight(index: number): Date {
    return localMidnight(this.nights[index]!.night);
  }

  /** Expected magnitude of `body` at local midnight of each night of the week. */
  magnitudes(body: Body): WeekMagnitudes {
    let m = this.#magnitudes.get(body.id);
    if (!m) {
      const estimates = this.nights.map((n) => nightMagnitude(n.night, body));
      const values = estimates.map((e) => e.value);
      m = {
        values,
        brightest: Math.min(...estimates.map((e) => e.brightest ?? e.value)),
        faintest: Math.max(...estimates.map((e) => e.faintest ?? e.value)),
      };
      this.#magnitudes.set(body.id, m);
    }
    return m;
  }

  /** Geocentric angle between `body` and the Sun at local midnight of night `index`, degrees. */
  elongationDeg(index: number, body: Body): number {
    const key = `${index}:${body.id}`;
    let e = this.#elongations.get(key);
    if (e === undefined) {
      const time = Astronomy.MakeTime(this.midnight(index));
      const sun = builtInBody('sun').geoVector(time, { aberration: true });
      const g = body.geoVector(time, { aberration: true });
      e = separationDeg([g.x, g.y, g.z], [sun.x, sun.y, sun.z]);
      this.#elongations.set(key, e);
    }
    return e;
  }
}

/**
 * Week data keyed by site id and ISO week id. A site object or body registry that differs from
 * the cached one (same id, new definition) replaces the entry, so a changed file is never served stale.
 */
export class WeekCache {
  readonly #weeks = new Map<string, WeekData>();
  /** Number of lookups answered from the cache and computed afresh. */
  hits = 0;
  misses = 0;

  get(site: Site, week: IsoWeek, bodies?: BodyRegistry, satellites?: readonly Satellite[]): WeekData {
    const key = `${site.id}/${week.id}`;
    const found = this.#weeks.get(key);
    if (found && found.site === site && (bodies === undefined || found.bodies === bodies) && (satellites === undefined || found.satellites === satellites)) {
      this.hits++;
      return found;
    }
    this.misses++;
    const data = new WeekData(site, week, bodies, satellites);
    this.#weeks.set(key, data);
    return data;
  }

  /** Forgets everything. */
  clear(): void {
    this.#weeks.clear();
  }

  get size(): number {
    return this.#weeks.size;
  }
}

/** The week containing `date` (ISO week, Monday–Sunday) at `site`, with the summary of each of `bodies`. */
export function computeWeek(site: Site, date: string, bodies: readonly Body[], cache: WeekCache = new WeekCache()): WeekReport {
  const week = cache.get(site, isoWeekOf(date));
  return { site, week: week.week, nights: week.nights, bodies: bodies.map((b) => week.summary(b)) };
}
