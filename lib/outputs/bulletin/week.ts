/**
 * The shared week data every placeholder reads: for one site and one ISO week, the seven nights
 * (Monday to Sunday evenings) with the Sun's and the Moon's events, and each requested body's
 * rise, transit and set. Each site-night is computed once (`computeNight`), each body once per
 * night on that night's shared frame (`NightReport.body`), and the result is shared by every
 * placeholder and every page of the same site and week through a `WeekCache`.
 */
import { separationDeg } from '../../core/geometry.ts';
import * as Astronomy from 'astronomy-engine';
import { BodyRegistry, builtInBody, type Body } from '../../core/body.ts';
import { nightMagnitude } from '../../core/body.ts';
import { localMidnight } from '../../core/time.ts';
import { computeNight, type BodyNight, type NightReport } from '../../models/night.ts';
import { findEvents, type AlmanacEvent } from '../almanac/index.ts';
import { observe, type Observation } from '../../core/observe.ts';
import type { Site } from '../../core/site.ts';
import { nightOf, type IsoWeek } from '../../core/time.ts';

/** One body over the week: its expected magnitude at local midnight of each night. */
export interface WeekMagnitudes {
  /** V magnitude at local midnight of each of the 7 nights, Monday first. */
  values: number[];
  /** Model band (brightest, faintest) over the week, when the body's model gives one (comets). */
  brightest: number;
  faintest: number;
}

/** The data of one site and one week. Bodies are computed on first use and then kept. */
export class WeekData {
  readonly site: Site;
  readonly week: IsoWeek;
  /** The bodies placeholders may name (built-in ones plus loaded objects). */
  readonly bodies: BodyRegistry;
  /** The seven nights, Monday evening first (`week.days[i]` is `nights[i].night.date`). */
  readonly nights: readonly NightReport[];
  readonly #observations = new Map<string, Observation>();
  readonly #magnitudes = new Map<string, WeekMagnitudes>();
  readonly #elongations = new Map<string, number>();
  readonly #events = new Map<string, AlmanacEvent[]>();

  constructor(site: Site, week: IsoWeek, bodies: BodyRegistry = new BodyRegistry()) {
    this.site = site;
    this.week = week;
    this.bodies = bodies;
    this.nights = week.days.map((date) => computeNight(site, date, []));
  }

  /** Index 0–6 of a local date inside this week, or −1. */
  indexOf(date: string): number {
    return this.week.days.indexOf(date);
  }

  /** `body`'s night `index` (0 = Monday): the report's own entry, computed once (see `NightReport.body`). */
  bodyNight(index: number, body: Body): BodyNight {
    return this.nights[index]!.body(body);
  }

  /** The week's events for the site (lib/outputs/almanac: the seven nights, Monday noon to the next Monday noon), in time order. */
  events(): AlmanacEvent[] {
    return this.eventsBetween(this.week.days[0]!, this.week.days[6]!);
  }

  /**
   * The site's events from local noon of `firstNight` to local noon after `lastNight` (local dates
   * of evenings), in time order, computed once per span on the week's own night frames where they
   * overlap. A one-off bulletin asks for the nights around its date.
   */
  eventsBetween(firstNight: string, lastNight: string): AlmanacEvent[] {
    const key = `${firstNight}/${lastNight}`;
    let events = this.#events.get(key);
    if (!events) {
      const zone = this.site.timeZone;
      events = findEvents({ site: this.site, from: nightOf(firstNight, zone).start, to: nightOf(lastNight, zone).end, bodies: this.bodies, frames: this.nights.map((n) => n.frame) });
      this.#events.set(key, events);
    }
    return events;
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

  get(site: Site, week: IsoWeek, bodies?: BodyRegistry): WeekData {
    const key = `${site.id}/${week.id}`;
    const found = this.#weeks.get(key);
    if (found && found.site === site && (bodies === undefined || found.bodies === bodies)) {
      this.hits++;
      return found;
    }
    this.misses++;
    const data = new WeekData(site, week, bodies);
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
