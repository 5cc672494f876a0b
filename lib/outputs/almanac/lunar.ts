/**
 * The Moon's events: the four principal phases (`astronomy-engine` `SearchMoonQuarter` /
 * `NextMoonQuarter`: the Moon's geocentric ecliptic longitude minus the Sun's reaches 0°, 90°,
 * 180°, 270° — the almanac definition, e.g. Meeus, Astronomical Algorithms 2nd ed., ch. 49) and
 * perigee and apogee (`SearchLunarApsis` / `NextLunarApsis`: extrema of the geocentric distance).
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody } from '../../core/body.ts';
import { sharedSearch } from '../../core/search.ts';
import type { AlmanacContext } from './context.ts';
import { eventVisibility, hidden, overNight, riseWords } from './visibility.ts';
import type { AlmanacEvent } from './types.ts';

const QUARTERS = ['new-moon', 'first-quarter', 'full-moon', 'last-quarter'] as const;
/** Mean Earth–Moon distance, km (semi-major axis of the lunar orbit, 384 400 km; from memory, standard value). */
export const MEAN_MOON_DISTANCE_KM = 384_400;

/** The Moon's quarters with instants in [from, to) (the same from every site). */
function findQuarters(from: Date, to: Date): Astronomy.MoonQuarter[] {
  const out: Astronomy.MoonQuarter[] = [];
  for (let q = Astronomy.SearchMoonQuarter(from); q.time.date < to; q = Astronomy.NextMoonQuarter(q)) out.push(q);
  return out;
}

/** The Moon's perigees and apogees with instants in [from, to) (the same from every site). */
function findApsides(from: Date, to: Date): Astronomy.Apsis[] {
  const out: Astronomy.Apsis[] = [];
  for (let a = Astronomy.SearchLunarApsis(from); a.time.date < to; a = Astronomy.NextLunarApsis(a)) out.push(a);
  return out;
}

/** The principal phases with instants in [from, to). */
export function moonPhaseEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const moon = builtInBody('moon');
  for (const q of sharedSearch(moonPhaseEvents, 'quarters', from, to, findQuarters, (q) => q.time.date)) {
    const time = q.time.date;
    const type = QUARTERS[q.quarter]!;
    const seen = eventVisibility(ctx, [moon], time);
    // A new Moon's sentence is about the dark nights around it: its note says the Moon itself cannot be seen.
    const visibility = type === 'new-moon' && !seen.visible && seen.reason ? hidden(ctx, seen.reason, { itself: 'moon' }) : seen;
    const when = ctx.when(time);
    const w = ctx.words;
    const look = ctx.look(visibility);
    const rise = type === 'full-moon' || type === 'last-quarter' ? riseWords(ctx, moon, time)?.words ?? null : null;
    let description: string;
    switch (type) {
      case 'new-moon':
        description = w.t('ev.new-moon', { when });
        break;
      case 'first-quarter':
        description = look ? w.t('ev.first-quarter', { when, look }) : w.t('ev.first-quarter-evening', { when });
        break;
      case 'full-moon': {
        // A Moon whose upper limb grazes the horizon (a rise is found) while its centre stays below counts as up for part of the night.
        const { share } = overNight(ctx, moon, time);
        if (share === 'none' && !rise) description = w.t('ev.full-moon-down', { when });
        else if (share !== 'all') description = w.t('ev.full-moon-part', { when });
        else description = rise ? w.t('ev.full-moon', { when, rise }) : w.t('ev.full-moon-no-rise', { when });
        break;
      }
      default: {
        // "The evening sky stays dark" only where the sky gets dark and the Moon is still down when it does.
        const night = overNight(ctx, moon, time);
        if (!night.dark) description = w.t('ev.last-quarter-bright', { when, risen: rise ? 'yes' : 'no', rise: rise ?? '' });
        else if (night.upAtDusk) description = w.t('ev.last-quarter-up', { when });
        else description = rise ? w.t('ev.last-quarter', { when, rise }) : w.t('ev.last-quarter-late', { when });
      }
    }
    out.push({ type, time, bodies: ['moon'], names: ['Moon'], visible: visibility.visible, visibility, title: w.t(`ev.title.${type}`), description, score: 0 });
  }
  return out;
}

/** Perigees and apogees with instants in [from, to); `data.distanceKm` is the centre-to-centre distance. */
export function lunarApsisEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const moon = builtInBody('moon');
  for (const a of sharedSearch(lunarApsisEvents, 'apsides', from, to, findApsides, (a) => a.time.date)) {
    const time = a.time.date;
    const perigee = a.kind === Astronomy.ApsisKind.Pericenter;
    const km = Math.round(a.dist_km / 100) * 100;
    // Days to the nearest full Moon: a perigee within ~1.5 days of full makes the largest full Moons.
    const elongation = Astronomy.MoonPhase(a.time);
    const daysFromFull = Math.abs(elongation - 180) / 12.19;
    const sizePct = Math.round((MEAN_MOON_DISTANCE_KM / a.dist_km - 1) * 100);
    const visibility = eventVisibility(ctx, [moon], time);
    const w = ctx.words;
    const args = { km: new Intl.NumberFormat(ctx.site.locale).format(km), when: ctx.when(time), percent: w.percent(Math.abs(sizePct) / 100) };
    const nearFull = daysFromFull < 1.5;
    const description = perigee ? w.t(nearFull ? 'ev.perigee-full' : 'ev.perigee', args) : w.t(nearFull ? 'ev.apogee-full' : 'ev.apogee', args);
    out.push({
      type: perigee ? 'perigee' : 'apogee',
      time,
      bodies: ['moon'],
      names: ['Moon'],
      visible: visibility.visible,
      visibility,
      title: w.t(perigee ? 'ev.title.perigee' : 'ev.title.apogee'),
      description,
      score: 0,
      data: { distanceKm: Math.round(a.dist_km), daysFromFullMoon: Math.round(daysFromFull * 100) / 100 },
    });
  }
  return out;
}
