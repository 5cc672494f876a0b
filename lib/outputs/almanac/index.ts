/**
 * The almanac: every event of a date range for one site — Moon phases and apsides, seasons,
 * planets' oppositions, conjunctions with the Sun, elongations, greatest brilliancy and
 * stations, close approaches, meteor shower peaks, eclipses, and comet/asteroid events — each
 * with its visibility from the site, a one-sentence description in local time and an interest
 * score. Pure: the caller passes the site, the range and the bodies; nothing reads the clock.
 *
 *   const events = findEvents({ site, from, to, bodies: registry });
 *   const feed = eventsToICalendar(events, { site, prodId: '-//Science Centre//gloaming//EN', now: buildDate });
 */
import type { WeekData } from '../../models/week.ts';
import { BUILT_IN_IDS, type Body, type BodyRegistry } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import type { Site } from '../../core/site.ts';
import { isoWeekOf, nightOf } from '../../core/time.ts';
import type { NightFrame } from '../../core/track.ts';
import { approachEvents } from './approaches.ts';
import { AlmanacContext } from './context.ts';
import { lunarEclipseEvents, solarEclipseEvents } from './eclipses.ts';
import { lunarApsisEvents, moonPhaseEvents } from './lunar.ts';
import { brilliancyEvents, elongationEvents, oppositionAndConjunctionEvents, stationEvents } from './planets.ts';
import { interestScore } from './score.ts';
import { seasonEvents } from './seasons.ts';
import { showerEvents } from './showers.ts';
import { smallBodyEvents } from './small-bodies.ts';
import { satellitePassEvents } from './satellite-passes.ts';
import { variableStarEvents } from './variables.ts';
import { occultationEvents } from './occultations.ts';
import type { Satellite } from '../../models/satellite/passes.ts';
import type { PassNight } from '../../models/satellite/nights.ts';
import { EVENT_TYPES, type AlmanacEvent, type AlmanacEventType, type FindEventsOptions } from './types.ts';

export * from './types.ts';
export { eventsToICalendar, type ICalendarOptions } from './ical.ts';
export { METEOR_SHOWERS, METEOR_SHOWER_SOURCE, hourlyRate, solarLongitudeJ2000Deg, type MeteorShower } from './showers.ts';
export { SOLAR_ECLIPSE_CAUTION, TOTALITY_NOTE } from './eclipses.ts';
export { closestApproaches, DEFAULT_APPROACH_LIMITS } from './approaches.ts';
export { HIDDEN_REASON_TEXT } from './visibility.ts';
export { interestScore } from './score.ts';

/** Longest range one call may cover, days (about five years). */
export const MAX_RANGE_DAYS = 5 * 366;

export interface FindEventsInput {
  site: Site;
  /** Start of the range (inclusive). */
  from: Date;
  /** End of the range (exclusive). */
  to: Date;
  /** Bodies: the built-in ones plus comets and asteroids (default: built-in only). */
  bodies?: BodyRegistry;
  options?: FindEventsOptions;
  /** Night frames already built for this site (e.g. a bulletin week's), reused instead of built again. */
  frames?: Iterable<NightFrame>;
  /** Satellites for `satellite-pass` events (lib/models/satellite; default none). */
  satellites?: readonly Satellite[];
  /** Pass nights already computed for this site and these satellites (e.g. a bulletin week's), reused instead of computed again. */
  passNights?: readonly PassNight[];
}

function smallBodiesOf(registry: BodyRegistry | undefined): Body[] {
  if (!registry) return [];
  const builtIn = new Set<string>(BUILT_IN_IDS);
  return registry
    .ids()
    .filter((id) => !builtIn.has(id))
    .map((id) => registry.get(id))
    .filter((b) => b.kind === 'comet' || b.kind === 'asteroid');
}

/**
 * Every event of `site` with its instant in [from, to), sorted by time (or by interest with
 * `options.order: 'interest'`). Events that cannot be seen from the site are kept and labelled
 * `visible: false` with a reason. Throws `GloamingError('invalid-value')` for an empty, reversed
 * or over-long range.
 */
export function findEvents(input: FindEventsInput): AlmanacEvent[] {
  const { site, from, to } = input;
  const options = input.options ?? {};
  if (!(from instanceof Date) || !(to instanceof Date) || Number.isNaN(from.getTime()) || Number.isNaN(to.getTime()) || to <= from) {
    throw new GloamingError('invalid-value', 'the date range is empty or reversed', { place: { field: 'to' }, actual: `${String(from)} … ${String(to)}`, expected: 'an end after the start' });
  }
  if ((to.getTime() - from.getTime()) / 86_400_000 > MAX_RANGE_DAYS) {
    throw new GloamingError('invalid-value', 'the date range is too long', { place: { field: 'to' }, expected: `at most ${MAX_RANGE_DAYS} days`, hint: 'ask for one year at a time' });
  }
  const wanted = new Set<AlmanacEventType>(options.types ?? EVENT_TYPES);
  const want = (...types: AlmanacEventType[]): boolean => types.some((t) => wanted.has(t));
  const ctx = new AlmanacContext(site, {
    ...(options.darkSunAltitudeDeg !== undefined ? { darkSunAltitudeDeg: options.darkSunAltitudeDeg } : {}),
    ...(input.frames ? { frames: input.frames } : {}),
  });
  const small = smallBodiesOf(input.bodies);
  const events: AlmanacEvent[] = [];
  if (want('new-moon', 'first-quarter', 'full-moon', 'last-quarter')) events.push(...moonPhaseEvents(ctx, from, to));
  if (want('perigee', 'apogee')) events.push(...lunarApsisEvents(ctx, from, to));
  if (want('equinox', 'solstice')) events.push(...seasonEvents(ctx, from, to));
  if (want('opposition', 'conjunction')) events.push(...oppositionAndConjunctionEvents(ctx, from, to));
  if (want('greatest-elongation')) events.push(...elongationEvents(ctx, from, to));
  if (want('greatest-brilliancy')) events.push(...brilliancyEvents(ctx, from, to));
  if (want('stationary')) events.push(...stationEvents(ctx, from, to));
  if (want('close-approach')) {
    events.push(
      ...approachEvents(ctx, from, to, {
        smallBodies: small,
        ...(options.approach ? { limits: options.approach } : {}),
        ...(options.approachPlanets ? { planets: options.approachPlanets } : {}),
        ...(options.starMagnitudeLimit !== undefined ? { starMagnitudeLimit: options.starMagnitudeLimit } : {}),
        ...(options.starEclipticLatitudeDeg !== undefined ? { starEclipticLatitudeDeg: options.starEclipticLatitudeDeg } : {}),
      }),
    );
  }
  if (want('meteor-shower-peak')) events.push(...showerEvents(ctx, from, to));
  if (want('lunar-eclipse')) events.push(...lunarEclipseEvents(ctx, from, to));
  if (want('solar-eclipse')) events.push(...solarEclipseEvents(ctx, from, to));
  if (want('perihelion', 'closest-approach-to-earth', 'peak-brightness')) events.push(...smallBodyEvents(ctx, from, to, small));
  if (want('variable-minimum')) events.push(...variableStarEvents(ctx, from, to));
  if (want('occultation')) events.push(...occultationEvents(ctx, from, to));
  if (want('satellite-pass') && input.satellites) events.push(...satellitePassEvents({ site, satellites: input.satellites, from, to, ...(input.passNights ? { known: input.passNights } : {}) }));
  const kept = events.filter((e) => wanted.has(e.type) && e.time >= from && e.time < to);
  for (const e of kept) e.score = interestScore(e);
  const typeOrder = (t: AlmanacEventType): number => EVENT_TYPES.indexOf(t);
  kept.sort((a, b) => a.time.getTime() - b.time.getTime() || typeOrder(a.type) - typeOrder(b.type) || a.bodies.join().localeCompare(b.bodies.join()));
  if (options.order === 'interest') kept.sort((a, b) => b.score - a.score || a.time.getTime() - b.time.getTime());
  return kept;
}

/**
 * The events of the bulletin week containing `date` (`YYYY-MM-DD`): the seven nights of its ISO
 * week, from local noon of the Monday to local noon of the next Monday in the site's zone, so an
 * event at 03:00 on Sunday night belongs to this week and one early on Monday morning to the week
 * before. For the bulletin's `::events` block (order by time, or `options.order: 'interest'`).
 */
export function eventsOfWeek(input: { site: Site; date: string; bodies?: BodyRegistry; options?: FindEventsOptions; frames?: Iterable<NightFrame> }): AlmanacEvent[] {
  const week = isoWeekOf(input.date);
  const zone = input.site.timeZone;
  return findEvents({
    site: input.site,
    from: nightOf(week.days[0]!, zone).start,
    to: nightOf(week.days[6]!, zone).end,
    ...(input.bodies ? { bodies: input.bodies } : {}),
    ...(input.options ? { options: input.options } : {}),
    ...(input.frames ? { frames: input.frames } : {}),
  });
}

/**
 * The site's events from local noon of `firstNight` to local noon after `lastNight` (local dates
 * of evenings; default the week's seven nights), in time order, computed once per span and kept
 * with the week (`WeekData.derived`), on the week's own night frames. A one-off bulletin asks for
 * the nights around its date.
 */
export function eventsBetween(week: WeekData, firstNight: string = week.week.days[0]!, lastNight: string = week.week.days[6]!): AlmanacEvent[] {
  return week.derived(`events:${firstNight}/${lastNight}`, (w) => {
    const zone = w.site.timeZone;
    return findEvents({
      site: w.site,
      from: nightOf(firstNight, zone).start,
      to: nightOf(lastNight, zone).end,
      bodies: w.bodies,
      satellites: w.satellites,
      frames: w.nights.map((n) => n.frame),
      // The week's own pass nights (the passes list reads the same), computed once for both.
      ...(w.satellites.length ? { passNights: w.passNights() } : {}),
    });
  });
}

/**
 * Event types too many to list with the rest (satellite passes, a dozen a week at a mid-latitude
 * site): `::events` and an `:::every-event` without `type` leave them out, and
 * `type=satellite-pass` asks for them.
 */
export const OWN_LIST_EVENT_TYPES: ReadonlySet<AlmanacEventType> = new Set(['satellite-pass']);

/**
 * What follows an event's sentence wherever it is printed (pages, the command line): for an event
 * that cannot be seen, why (`visibility.note`), unless the sentence already says it; else null.
 * A visible event's sentence already says when and where to look.
 */
export function hiddenNote(e: AlmanacEvent): string | null {
  return !e.visible && e.visibility.note && !e.description.includes(e.visibility.note) ? e.visibility.note : null;
}

/**
 * The one event an inline placeholder refers to: the first (in time) of `type` that involves every
 * body in `bodies` (ids, e.g. `['moon', 'jupiter']`), or null when there is none — a typed "nothing
 * this week", never an exception.
 */
export function pickEvent(events: readonly AlmanacEvent[], query: { type?: AlmanacEventType; bodies?: readonly string[] }): AlmanacEvent | null {
  const byTime = [...events].sort((a, b) => a.time.getTime() - b.time.getTime());
  return byTime.find((e) => (!query.type || e.type === query.type) && (query.bodies ?? []).every((b) => e.bodies.includes(b))) ?? null;
}
