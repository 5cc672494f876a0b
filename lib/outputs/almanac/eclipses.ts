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
import { compass } from '../../core/describe.ts';
import { observe } from '../../core/observe.ts';
import { findMaximum, sharedSearch } from '../../core/search.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import type { AlmanacContext } from './context.ts';
import type { AlmanacEvent, EclipseContact, EclipseDetails, EventVisibility } from './types.ts';
import { hidden } from './visibility.ts';

/** Eye-safety text shown with every solar eclipse (gloaming's own wording). */
export const SOLAR_ECLIPSE_CAUTION =
  'Eye safety: never look straight at the Sun, however much of it is covered, and never through binoculars, a telescope or a camera ' +
  'unless a proper solar filter is fixed securely over the front of it; use only eclipse glasses or hand viewers certified to ISO 12312-2 ' +
  '(or project the Sun onto a card), check them for scratches first, supervise children, and follow the advice of local health authorities.';
/** Added for a total eclipse: the only moment the filter may come off. */
export const TOTALITY_NOTE = 'Only during totality itself, where the eclipse is total, may the filter come off; put it back the moment the Sun starts to reappear.';

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
          ? `At maximum (${ctx.clock(peak.date)}) the Moon is ${Math.round(maxAlt)}° up in the ${compass(az).word}.`
          : `The Moon is below the horizon at maximum; it is highest during the eclipse at ${ctx.clock(seenAt.time)}, ${Math.round(seenAt.altitudeDeg)}° up in the ${compass(az).word}.`,
      };
    } else {
      visibility = hidden(ctx, 'below-horizon');
    }
    const c = (name: string): string => ctx.clock(contacts.find((x) => x.name === name)!.time);
    const day = ctx.day(peak.date);
    const where = visibility.visible && visibility.azimuthDeg !== null && visibility.altitudeDeg !== null
      ? `, with the Moon ${Math.round(visibility.altitudeDeg)}° up in the ${compass(visibility.azimuthDeg).word} at ${ctx.clock(visibility.time!)}`
      : '';
    const description =
      kind === 'total'
        ? `Total eclipse of the Moon on ${day}: the Moon enters the Earth's shadow at ${c('U1')}, is fully eclipsed from ${c('U2')} to ${c('U3')} and leaves the shadow at ${c('U4')}${where}; safe to watch with the naked eye.`
        : kind === 'partial'
          ? `Partial eclipse of the Moon on ${day}: the Earth's shadow covers up to ${pct(e.obscuration)}% of the Moon between ${c('U1')} and ${c('U4')}, most at ${c('max')}${where}; safe to watch with the naked eye.`
          : `Penumbral eclipse of the Moon on ${day}, deepest at ${c('max')}: only a faint shading on one side of the Moon, easy to miss${where}.`;
    out.push({
      type: 'lunar-eclipse',
      time: peak.date,
      end: at(e.sd_penum),
      bodies: ['moon'],
      names: ['Moon'],
      visible: visibility.visible,
      visibility,
      title: `${kind[0]!.toUpperCase()}${kind.slice(1)} eclipse of the Moon`,
      description: visibility.visible ? description : `${description.replace(/;[^;]*$|\.$/, '')}, but from here the Moon is below the horizon throughout.`,
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
    const caution = kind === 'total' ? `${SOLAR_ECLIPSE_CAUTION} ${TOTALITY_NOTE}` : SOLAR_ECLIPSE_CAUTION;
    let visibility: EventVisibility;
    let description: string;
    const covered = `${pct(e.obscuration)}% of the Sun's disc covered`;
    if (top.altitudeDeg > 0) {
      const az = observe(ctx.site, sun, top.time).azimuthDeg;
      visibility = {
        visible: true,
        moment: e.peak.altitude > 0 ? 'event' : 'night',
        time: top.time,
        altitudeDeg: top.altitudeDeg,
        azimuthDeg: az,
        reason: null,
        note: e.peak.altitude > 0 ? `At maximum the Sun is ${Math.round(top.altitudeDeg)}° up in the ${compass(az).word}.` : `The Sun is down at maximum; it is highest during the eclipse at ${ctx.clock(top.time)}, ${Math.round(top.altitudeDeg)}° up.`,
      };
      const what = kind === 'total' ? 'Total eclipse of the Sun' : kind === 'annular' ? 'Annular eclipse of the Sun' : 'Partial eclipse of the Sun';
      const phase = e.total_begin && e.total_end ? `, ${kind === 'total' ? 'totality' : 'the ring phase'} ${ctx.clock(e.total_begin.time.date)}–${ctx.clock(e.total_end.time.date)}` : '';
      description = `${what} from here on ${day}, ${ctx.clock(e.partial_begin.time.date)}–${ctx.clock(e.partial_end.time.date)}, greatest at ${ctx.clock(e.peak.time.date)} with ${covered}${phase}: watch only through certified eclipse viewers or by projection.`;
    } else {
      visibility = hidden(ctx, 'sun-below-horizon');
      description = `A solar eclipse (${covered} at best) happens on ${day} while the Sun is below the horizon here, so it cannot be seen from this site.`;
    }
    out.push({
      type: 'solar-eclipse',
      time: e.peak.time.date,
      end: e.partial_end.time.date,
      bodies: ['sun', 'moon'],
      names: ['Sun', 'Moon'],
      visible: visibility.visible,
      visibility,
      title: `${kind[0]!.toUpperCase()}${kind.slice(1)} eclipse of the Sun`,
      description,
      score: 0,
      caution,
      eclipse: { kind, obscuration: e.obscuration, contacts },
    });
  }
  return out;
}
