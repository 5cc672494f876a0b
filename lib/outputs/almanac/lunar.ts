/**
 * The Moon's events: the four principal phases (`astronomy-engine` `SearchMoonQuarter` /
 * `NextMoonQuarter`: the Moon's geocentric ecliptic longitude minus the Sun's reaches 0°, 90°,
 * 180°, 270° — the almanac definition, e.g. Meeus, Astronomical Algorithms 2nd ed., ch. 49) and
 * perigee and apogee (`SearchLunarApsis` / `NextLunarApsis`: extrema of the geocentric distance).
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody } from '../../core/body.ts';
import { compass } from '../../core/describe.ts';
import { riseTransitSet } from '../../core/events.ts';
import { sharedSearch } from '../../core/search.ts';
import { utDays } from '../../core/track.ts';
import type { AlmanacContext } from './context.ts';
import { apparentPlace, eventVisibility } from './visibility.ts';
import type { AlmanacEvent, AlmanacEventType } from './types.ts';

const QUARTERS: AlmanacEventType[] = ['new-moon', 'first-quarter', 'full-moon', 'last-quarter'];
const TITLES: Record<string, string> = {
  'new-moon': 'New Moon',
  'first-quarter': 'First-quarter Moon',
  'full-moon': 'Full Moon',
  'last-quarter': 'Last-quarter Moon',
};
/** Mean Earth–Moon distance, km (semi-major axis of the lunar orbit, 384 400 km; from memory, standard value). */
export const MEAN_MOON_DISTANCE_KM = 384_400;

/** Moonrise on the night containing `time`, as words ("at 18:04 in the east-northeast"), or null. */
function moonriseWords(ctx: AlmanacContext, time: Date): string | null {
  const frame = ctx.frameAt(time);
  const rise = riseTransitSet(frame, frame.moon).rise.time;
  if (!rise) return null;
  return `at ${ctx.clock(rise)} in the ${compass(apparentPlace(frame, frame.moon.body, utDays(rise)).azimuthDeg).word}`;
}

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
    const visibility = eventVisibility(ctx, [moon], time);
    const when = ctx.when(time);
    const where = visibility.azimuthDeg !== null ? `look ${compass(visibility.azimuthDeg).word} at ${ctx.clock(visibility.time!)}` : null;
    const rise = type === 'full-moon' || type === 'last-quarter' ? moonriseWords(ctx, time) : null;
    let description: string;
    switch (type) {
      case 'new-moon':
        description = `New Moon on ${when}: the nights around it have no moonlight, the best of the month for faint objects and the Milky Way.`;
        break;
      case 'first-quarter':
        description = `First-quarter Moon on ${when}: ${where ? `${where} for` : 'the evening sky has'} a half-lit Moon, and binoculars show craters along the line between light and dark.`;
        break;
      case 'full-moon':
        description = `Full Moon on ${when}: ${rise ? `it rises ${rise} and` : 'it'} stays up all night, so its glare hides faint stars and comets.`;
        break;
      default:
        description = `Last-quarter Moon on ${when}: ${rise ? `it rises ${rise}, so` : 'it rises late, so'} the evening sky stays dark for faint objects.`;
    }
    out.push({ type, time, bodies: ['moon'], names: ['Moon'], visible: visibility.visible, visibility, title: TITLES[type]!, description, score: 0 });
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
    const kmText = km.toLocaleString('en-GB');
    const description = perigee
      ? `The Moon is at perigee, its closest to Earth this month (${kmText} km), on ${ctx.when(time)}` +
        (daysFromFull < 1.5 ? `; so near Full Moon it looks about ${sizePct}% wider than at its average distance.` : '; the difference in size is too small to notice by eye.')
      : `The Moon is at apogee, its farthest from Earth this month (${kmText} km), on ${ctx.when(time)}` +
        (daysFromFull < 1.5 ? `; this Full Moon looks about ${-sizePct}% narrower than at its average distance.` : '.');
    out.push({
      type: perigee ? 'perigee' : 'apogee',
      time,
      bodies: ['moon'],
      names: ['Moon'],
      visible: visibility.visible,
      visibility,
      title: perigee ? 'Moon at perigee' : 'Moon at apogee',
      description,
      score: 0,
      data: { distanceKm: Math.round(a.dist_km), daysFromFullMoon: Math.round(daysFromFull * 100) / 100 },
    });
  }
  return out;
}
