/**
 * The planets' events: oppositions and conjunctions with the Sun (`astronomy-engine`
 * `SearchRelativeLongitude`: heliocentric ecliptic longitudes of Earth and planet equal (0°) or
 * opposite (180°)), greatest elongations of Mercury and Venus (`SearchMaxElongation`), Venus at
 * greatest brilliancy (`SearchPeakMagnitude`), and stationary points (the geocentric ecliptic
 * longitude stops changing; found with lib/core/search.ts, since the engine has no search for it).
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody, type EngineBody } from '../../core/body.ts';
import { sunEvents } from '../../core/events.ts';
import { findCrossings, sharedSearch, type Crossing } from '../../core/search.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import type { AlmanacContext } from './context.ts';
import { eventVisibility, hidden, overNight, riseWords } from './visibility.ts';
import type { AlmanacEvent } from './types.ts';

const RAD = Math.PI / 180;
/** Mean obliquity of the ecliptic at J2000.0, 23°26′21.448″ (IAU 1976; Meeus 2nd ed. eq. 22.2 at T = 0). */
export const OBLIQUITY_J2000_DEG = 23.4392911;
const COS_E = Math.cos(OBLIQUITY_J2000_DEG * RAD);
const SIN_E = Math.sin(OBLIQUITY_J2000_DEG * RAD);

/** Ecliptic longitude on the J2000 mean ecliptic and equinox of an EQJ vector, degrees 0–360. */
export function eclipticLongitudeJ2000Deg(v: { x: number; y: number; z: number }): number {
  const lon = Math.atan2(v.y * COS_E + v.z * SIN_E, v.x) / RAD;
  return lon < 0 ? lon + 360 : lon;
}

/** Wraps an angle difference to (−180°, 180°]. */
export function wrap180(deg: number): number {
  const d = ((deg % 360) + 360) % 360;
  return d > 180 ? d - 360 : d;
}

const SUPERIOR = ['mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const;
const INFERIOR = ['mercury', 'venus'] as const;
const ALL = [...INFERIOR, ...SUPERIOR] as const;

/** Repeats an engine search from `from` (restarting a day after each hit) while its result is before `to`. */
function repeat<T>(from: Date, to: Date, search: (start: Astronomy.AstroTime) => T, timeOf: (result: T) => Astronomy.AstroTime): T[] {
  const out: T[] = [];
  let start = Astronomy.MakeTime(from);
  for (let i = 0; i < 1000; i++) {
    const r = search(start);
    const t = timeOf(r);
    if (t.date >= to) break;
    if (t.date >= from) out.push(r);
    start = t.AddDays(1);
  }
  return out;
}

function magnitudeAt(body: EngineBody, time: Astronomy.AstroTime): number {
  return Math.round(Astronomy.Illumination(body.engineBody, time).mag * 10) / 10;
}

/** A rise this close to sunset is said to be "around sunset", minutes (this project's choice). */
export const AROUND_SUNSET_MIN = 30;

/**
 * How a planet at opposition spends the night containing `time` from the site (`overNight`:
 * up for at least 90% of the dark part, or not at all): `sunset` it rises within
 * `AROUND_SUNSET_MIN` of sunset and stays up all night (the textbook opposition, true at most
 * latitudes); `rises` it rises at another time (`rise`: "at 14:52 in the north-north-east") and
 * stays up all night; `up` it is up all night without rising in it (it never sets, as in a polar
 * winter); `part` it is up for only part of the night (a far-south planet seen from far north);
 * `down` it stays below the horizon all night (a polar summer's opposition of a southern planet).
 */
export function oppositionNight(ctx: AlmanacContext, body: EngineBody, time: Date): { kind: 'sunset' | 'rises' | 'up' | 'part' | 'down'; rise: string | null } {
  const over = overNight(ctx, body, time);
  const rise = riseWords(ctx, body, time);
  if (over.share === 'none') return { kind: rise ? 'part' : 'down', rise: null };
  if (over.share === 'part') return { kind: 'part', rise: null };
  if (!rise) return { kind: 'up', rise: null };
  const sunset = sunEvents(ctx.frameAt(time)).set.time;
  const nearSunset = sunset !== null && Math.abs(rise.time.getTime() - sunset.getTime()) <= AROUND_SUNSET_MIN * 60_000;
  return nearSunset ? { kind: 'sunset', rise: null } : { kind: 'rises', rise: rise.words };
}

/** Oppositions of Mars–Neptune and conjunctions of every planet with the Sun, instants in [from, to). */
export function oppositionAndConjunctionEvents(ctx: AlmanacContext, from: Date, to: Date, ids: readonly string[] = ALL): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  for (const id of ALL) {
    if (!ids.includes(id)) continue;
    const body = builtInBody(id);
    const inferior = (INFERIOR as readonly string[]).includes(id);
    const targets: { relLon: number; kind: 'opposition' | 'superior' | 'inferior' }[] = inferior
      ? [{ relLon: 0, kind: 'inferior' }, { relLon: 180, kind: 'superior' }]
      : [{ relLon: 0, kind: 'opposition' }, { relLon: 180, kind: 'superior' }];
    for (const target of targets) {
      const find = (a: Date, b: Date): Astronomy.AstroTime[] => repeat(a, b, (s) => Astronomy.SearchRelativeLongitude(body.engineBody, target.relLon, s), (r) => r);
      for (const t of sharedSearch(oppositionAndConjunctionEvents, `${id}:${target.relLon}`, from, to, find, (r) => r.date)) {
        const time = t.date;
        const mag = magnitudeAt(body, t);
        if (target.kind === 'opposition') {
          const visibility = eventVisibility(ctx, [body], time);
          const look = ctx.look(visibility);
          const night = oppositionNight(ctx, body, time);
          const args = { name: ctx.phrase(body), day: ctx.day(time), magnitude: mag, night: night.kind, rise: night.rise ?? '' };
          out.push({
            type: 'opposition',
            time,
            bodies: [id],
            names: [body.name],
            visible: visibility.visible,
            visibility,
            title: ctx.words.t('ev.title.opposition', { name: ctx.label(body) }),
            description: night.kind === 'down' ? ctx.words.t('ev.opposition-down', args) : look ? ctx.words.t('ev.opposition', { ...args, look }) : ctx.words.t('ev.opposition-low', args),
            score: 0,
            data: { magnitude: mag, night: night.kind },
          });
        } else {
          // An inner planet's conjunctions are inferior or superior; an outer planet only passes behind the Sun.
          const kind = inferior ? target.kind : 'outer';
          out.push({
            type: 'conjunction',
            time,
            bodies: [id, 'sun'],
            names: [body.name, 'Sun'],
            visible: false,
            visibility: hidden(ctx, 'too-close-to-sun'),
            title: ctx.words.t('ev.title.conjunction', { name: ctx.label(body) }),
            description: ctx.words.t('ev.conjunction', { name: ctx.phrase(body), kind, day: ctx.day(time) }),
            score: 0,
            data: { kind: target.kind, magnitude: mag },
          });
        }
      }
    }
  }
  return out;
}

/** Greatest elongations of Mercury and Venus, instants in [from, to). */
export function elongationEvents(ctx: AlmanacContext, from: Date, to: Date, ids: readonly string[] = INFERIOR): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  for (const id of INFERIOR) {
    if (!ids.includes(id)) continue;
    const body = builtInBody(id);
    const find = (a: Date, b: Date): Astronomy.ElongationEvent[] => repeat(a, b, (s) => Astronomy.SearchMaxElongation(body.engineBody, s), (r) => r.time);
    for (const e of sharedSearch(elongationEvents, id, from, to, find, (r) => r.time.date)) {
      const time = e.time.date;
      const evening = e.visibility === 'evening';
      const visibility = eventVisibility(ctx, [body], time);
      const look = ctx.look(visibility);
      const elongation = Math.round(e.elongation * 10) / 10;
      out.push({
        type: 'greatest-elongation',
        time,
        bodies: [id],
        names: [body.name],
        separationDeg: e.elongation,
        visible: visibility.visible,
        visibility,
        title: ctx.words.t('ev.title.elongation', { name: ctx.label(body), side: e.visibility }),
        description: look
          ? ctx.words.t('ev.elongation', { name: ctx.phrase(body), side: e.visibility, degrees: elongation, day: ctx.day(time), look })
          : ctx.words.t('ev.elongation-low', { name: ctx.phrase(body), side: e.visibility, degrees: elongation, day: ctx.day(time) }),
        score: 0,
        data: { elongationDeg: elongation, side: evening ? 'evening' : 'morning', magnitude: magnitudeAt(body, e.time) },
      });
    }
  }
  return out;
}

/** Venus at greatest brilliancy (peak magnitude), instants in [from, to). */
export function brilliancyEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  const venus = builtInBody('venus');
  const find = (a: Date, b: Date): Astronomy.IlluminationInfo[] => repeat(a, b, (s) => Astronomy.SearchPeakMagnitude(Astronomy.Body.Venus, s), (r) => r.time);
  return sharedSearch(brilliancyEvents, 'venus', from, to, find, (r) => r.time.date).map((info) => {
    const time = info.time.date;
    const visibility = eventVisibility(ctx, [venus], time);
    const look = ctx.look(visibility);
    const mag = Math.round(info.mag * 10) / 10;
    const evening = Astronomy.Elongation(Astronomy.Body.Venus, info.time).visibility === 'evening';
    return {
      type: 'greatest-brilliancy' as const,
      time,
      bodies: ['venus'],
      names: ['Venus'],
      visible: visibility.visible,
      visibility,
      title: ctx.words.t('ev.title.brilliancy', { name: ctx.label(venus) }),
      description: look
        ? ctx.words.t('ev.brilliancy', { name: ctx.phrase(venus), magnitude: mag, day: ctx.day(time), side: evening ? 'evening' : 'morning', look })
        : ctx.words.t('ev.brilliancy-low', { name: ctx.phrase(venus), magnitude: mag, day: ctx.day(time), side: evening ? 'evening' : 'morning' }),
      score: 0,
      data: { magnitude: mag, side: evening ? 'evening' : 'morning' },
    };
  });
}

/**
 * Stationary points: zero crossings of the rate of change of the planet's apparent geocentric
 * ecliptic longitude (J2000 mean ecliptic; precession moves the instant by well under a minute),
 * rate by a central difference of ±1 h, sampled daily and refined to 1 minute.
 */
export function stationEvents(ctx: AlmanacContext, from: Date, to: Date, ids: readonly string[] = ALL): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const delta = 1 / 24;
  for (const id of ALL) {
    if (!ids.includes(id)) continue;
    const body = builtInBody(id);
    const lon = (ut: number): number => eclipticLongitudeJ2000Deg(Astronomy.GeoVector(body.engineBody, Astronomy.MakeTime(dateFromUt(ut)), true));
    const rate = (ut: number): number => wrap180(lon(ut + delta) - lon(ut - delta)) / (2 * delta);
    const find = (a: Date, b: Date): Crossing[] => findCrossings(rate, utDays(a), utDays(b), { stepDays: 1, toleranceDays: 1 / 1440 });
    for (const c of sharedSearch(stationEvents, id, from, to, find, (r) => dateFromUt(r.ut))) {
      const time = dateFromUt(c.ut);
      const retrograde = c.direction === -1;
      const visibility = eventVisibility(ctx, [body], time);
      out.push({
        type: 'stationary',
        time,
        bodies: [id],
        names: [body.name],
        visible: visibility.visible,
        visibility,
        title: ctx.words.t('ev.title.stationary', { name: ctx.label(body) }),
        description: ctx.words.t(retrograde ? 'ev.stationary-retrograde' : 'ev.stationary-direct', { name: ctx.phrase(body), day: ctx.day(time) }),
        score: 0,
        data: { motion: retrograde ? 'retrograde' : 'direct' },
      });
    }
  }
  return out;
}
