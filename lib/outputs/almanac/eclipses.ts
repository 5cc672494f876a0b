/**
 * Eclipses seen from the site. Lunar eclipses from `astronomy-engine` `SearchLunarEclipse` /
 * `NextLunarEclipse` (peak and semi-durations of the penumbral, partial and total phases, from
 * which the contacts P1, U1, U2, U3, U4, P4 follow), with the Moon's apparent altitude at each
 * contact; solar eclipses from `SearchLocalSolarEclipse` / `NextLocalSolarEclipse` (local kind,
 * obscuration, contacts C1–C4 with the Sun's altitude). A solar eclipse always carries
 * `SOLAR_ECLIPSE_CAUTION`.
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody } from '../../core/body.ts';
import { observe } from '../../core/observe.ts';
import { findMaximum, sharedSearch } from '../../core/search.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import { wordsFor } from '../../core/language/index.ts';
import type { AlmanacContext } from './context.ts';
import type { AlmanacEvent, EclipseContact, EclipseDetails, EventVisibility } from './types.ts';
import { hidden } from './visibility.ts';

/** Eye-safety text shown with every solar eclipse (gloaming's own wording; `ev.solar-caution` in each catalogue, English here). */
export const SOLAR_ECLIPSE_CAUTION = wordsFor('en').t('ev.solar-caution');
/** Added for a total eclipse: the only moment the filter may come off (`ev.totality-note`). */
export const TOTALITY_NOTE = wordsFor('en').t('ev.totality-note');

const MINUTE_DAYS = 1 / 1440;
const STEP_MINUTES = 5;

function pct(x: number): number {
  return Math.round(x * 100);
}

/** The moment in [t0, t1] when the body is highest, with its altitude (the search module's maximum). */
function highest(altitudeAt: (t: Date) => number, t0: Date, t1: Date): { time: Date; altitudeDeg: number } {
  const top = findMaximum((ut) => altitudeAt(dateFromUt(ut)), utDays(t0), utDays(t1), { stepDays: STEP_MINUTES / 1440 });
  return top ? { time: dateFromUt(top.ut), altitudeDeg: top.value } : { time: t0, altitudeDeg: altitudeAt(t0) };
}

/** Lunar eclipses with their peak in [from, to) (the same from every site). */
function findLunarEclipses(from: Date, to: Date): Astronomy.LunarEclipseInfo[] {
  const out: Astronomy.LunarEclipseInfo[] = [];
  for (let e = Astronomy.SearchLunarEclipse(from); e.peak.date < to; e = Astronomy.NextLunarEclipse(e.peak)) out.push(e);
  return out;
}

/** Solar eclipses anywhere on the Earth with their greatest moment in [from, to). */
function findGlobalSolarEclipses(from: Date, to: Date): Astronomy.GlobalSolarEclipseInfo[] {
  const out: Astronomy.GlobalSolarEclipseInfo[] = [];
  for (let e = Astronomy.SearchGlobalSolarEclipse(from); e.peak.date < to; e = Astronomy.NextGlobalSolarEclipse(e.peak)) out.push(e);
  return out;
}

/** Lunar eclipses with their peak in [from, to). */
export function lunarEclipseEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const moon = builtInBody('moon');
  const altitudeAt = (t: Date): number => observe(ctx.site, moon, t).altitudeDeg;
  for (const e of sharedSearch(lunarEclipseEvents, 'lunar', from, to, findLunarEclipses, (e) => e.peak.date)) {
    const peak = e.peak;
    const at = (minutes: number): Date => peak.AddDays(minutes * MINUTE_DAYS).date;
    const contacts: EclipseContact[] = [];
    const add = (name: string, t: Date): void => void contacts.push({ name, time: t, altitudeDeg: altitudeAt(t) });
    add('P1', at(-e.sd_penum));
    if (e.sd_partial > 0) add('U1', at(-e.sd_partial));
    if (e.sd_total > 0) add('U2', at(-e.sd_total));
    add('max', peak.date);
    if (e.sd_total > 0) add('U3', at(e.sd_total));
    if (e.sd_partial > 0) add('U4', at(e.sd_partial));
    add('P4', at(e.sd_penum));
    const kind = e.kind as EclipseDetails['kind'];
    // The part worth seeing: the umbral phase, or the whole penumbral eclipse when there is none.
    const span = e.sd_partial > 0 ? { start: at(-e.sd_partial), end: at(e.sd_partial) } : { start: at(-e.sd_penum), end: at(e.sd_penum) };
    const top = highest(altitudeAt, span.start, span.end);
    const maxAlt = contacts.find((c) => c.name === 'max')!.altitudeDeg;
    const visibleAtMax = maxAlt > 0;
    const seenAt = visibleAtMax ? { time: peak.date, altitudeDeg: maxAlt } : top;
    let visibility: EventVisibility;
    if (seenAt.altitudeDeg > 0) {
      const az = observe(ctx.site, moon, seenAt.time).azimuthDeg;
      visibility = {
        visible: true,
        moment: visibleAtMax ? 'event' : 'night',
        time: seenAt.time,
        altitudeDeg: seenAt.altitudeDeg,
        azimuthDeg: az,
        reason: null,
        note: visibleAtMax
          ? ctx.words.t('ev.lunar-note-max', { clock: ctx.clock(peak.date), degrees: Math.round(maxAlt), direction: ctx.direction(az) })
          : ctx.words.t('ev.lunar-note-highest', { clock: ctx.clock(seenAt.time), degrees: Math.round(seenAt.altitudeDeg), direction: ctx.direction(az) }),
      };
    } else {
      visibility = hidden(ctx, 'below-horizon');
    }
    const c = (name: string): string => {
      const contact = contacts.find((x) => x.name === name);
      return contact ? ctx.clock(contact.time) : '';
    };
    const seen = visibility.visible && visibility.azimuthDeg !== null && visibility.altitudeDeg !== null;
    const description = ctx.words.t('ev.lunar-eclipse', {
      kind,
      day: ctx.day(peak.date),
      u1: c('U1'),
      u2: c('U2'),
      u3: c('U3'),
      u4: c('U4'),
      max: c('max'),
      percent: ctx.words.percent(pct(e.obscuration) / 100),
      seen: seen ? 'yes' : 'no',
      degrees: seen ? Math.round(visibility.altitudeDeg!) : 0,
      direction: seen ? ctx.direction(visibility.azimuthDeg!) : '',
      clock: seen ? ctx.clock(visibility.time!) : '',
    });
    out.push({
      type: 'lunar-eclipse',
      time: peak.date,
      end: at(e.sd_penum),
      bodies: ['moon'],
      names: ['Moon'],
      visible: visibility.visible,
      visibility,
      title: ctx.words.t('ev.title.lunar-eclipse', { kind }),
      description,
      score: 0,
      eclipse: { kind, obscuration: e.obscuration, contacts },
    });
  }
  return out;
}

/** Solar eclipses seen (at least in principle) from the site, with their maximum in [from, to). */
export function solarEclipseEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const sun = builtInBody('sun');
  const altitudeAt = (t: Date): number => observe(ctx.site, sun, t).altitudeDeg;
  // The Moon's shadow crosses the Earth within hours of the eclipse's greatest (global) moment: with
  // no eclipse anywhere within a day of the range, the site sees none and its own search is skipped.
  const global = sharedSearch(solarEclipseEvents, 'global', new Date(from.getTime() - 86_400_000), new Date(to.getTime() + 86_400_000), findGlobalSolarEclipses, (e) => e.peak.date);
  if (global.length === 0) return out;
  const start = new Date(Math.max(from.getTime(), global[0]!.peak.date.getTime() - 86_400_000));
  for (let e = Astronomy.SearchLocalSolarEclipse(start, ctx.site.observer); e.peak.time.date < to; e = Astronomy.NextLocalSolarEclipse(e.peak.time, ctx.site.observer)) {
    const contacts: EclipseContact[] = [{ name: 'C1', time: e.partial_begin.time.date, altitudeDeg: e.partial_begin.altitude }];
    if (e.total_begin) contacts.push({ name: 'C2', time: e.total_begin.time.date, altitudeDeg: e.total_begin.altitude });
    contacts.push({ name: 'max', time: e.peak.time.date, altitudeDeg: e.peak.altitude });
    if (e.total_end) contacts.push({ name: 'C3', time: e.total_end.time.date, altitudeDeg: e.total_end.altitude });
    contacts.push({ name: 'C4', time: e.partial_end.time.date, altitudeDeg: e.partial_end.altitude });
    const kind = e.kind as EclipseDetails['kind'];
    const top = e.peak.altitude > 0 ? { time: e.peak.time.date, altitudeDeg: e.peak.altitude } : highest(altitudeAt, e.partial_begin.time.date, e.partial_end.time.date);
    const day = ctx.day(e.peak.time.date);
    const w = ctx.words;
    const caution = kind === 'total' ? `${w.t('ev.solar-caution')} ${w.t('ev.totality-note')}` : w.t('ev.solar-caution');
    let visibility: EventVisibility;
    let description: string;
    const percent = w.percent(pct(e.obscuration) / 100);
    if (top.altitudeDeg > 0) {
      const az = observe(ctx.site, sun, top.time).azimuthDeg;
      visibility = {
        visible: true,
        moment: e.peak.altitude > 0 ? 'event' : 'night',
        time: top.time,
        altitudeDeg: top.altitudeDeg,
        azimuthDeg: az,
        reason: null,
        note:
          e.peak.altitude > 0
            ? w.t('ev.solar-note-max', { degrees: Math.round(top.altitudeDeg), direction: ctx.direction(az) })
            : w.t('ev.solar-note-highest', { clock: ctx.clock(top.time), degrees: Math.round(top.altitudeDeg) }),
      };
      const times = { day, begin: ctx.clock(e.partial_begin.time.date), end: ctx.clock(e.partial_end.time.date), max: ctx.clock(e.peak.time.date) };
      // A partial eclipse covering under half a per cent would print as "0% covered": say the Moon only grazes the Sun.
      description =
        kind === 'partial' && pct(e.obscuration) === 0
          ? w.t('ev.solar-eclipse-graze', { ...times, percent: w.percent(0.01) })
          : w.t('ev.solar-eclipse', {
              ...times,
              kind,
              percent,
              phase: e.total_begin && e.total_end ? (kind === 'total' ? 'total' : 'annular') : 'none',
              p1: e.total_begin ? ctx.clock(e.total_begin.time.date) : '',
              p2: e.total_end ? ctx.clock(e.total_end.time.date) : '',
            });
    } else {
      visibility = hidden(ctx, 'sun-below-horizon');
      description = w.t('ev.solar-eclipse-hidden', { percent, day });
    }
    out.push({
      type: 'solar-eclipse',
      time: e.peak.time.date,
      end: e.partial_end.time.date,
      bodies: ['sun', 'moon'],
      names: ['Sun', 'Moon'],
      visible: visibility.visible,
      visibility,
      title: w.t('ev.title.solar-eclipse', { kind }),
      description,
      score: 0,
      caution,
      eclipse: { kind, obscuration: e.obscuration, contacts },
    });
  }
  return out;
}
