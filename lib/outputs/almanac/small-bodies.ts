/**
 * Events of comets and asteroids (any `Body` of kind comet or asteroid, e.g. from
 * `content/objects/`): perihelion (minimum of the heliocentric distance r), closest approach to
 * the Earth (minimum of the geocentric distance Δ) and peak expected brightness (minimum of the
 * predicted magnitude). None has a direct search in `astronomy-engine`, so each is a zero
 * crossing (from − to +) of the quantity's rate of change, found by lib/core/search.ts, sampled daily
 * and refined to a minute. Rates are central differences of ±0.01 day.
 */
import * as Astronomy from 'astronomy-engine';
import type { Body, Illumination } from '../../core/body.ts';
import { findCrossings, sharedSearch } from '../../core/search.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import { KM_PER_AU } from '../../core/observe.ts';
import { nightDateOf, type AlmanacContext } from './context.ts';
import { eventVisibility, hidden } from './visibility.ts';
import { computeNight } from '../../models/night.ts';
import { reasonText, verdictWords } from '../../models/visibility.ts';
import type { AlmanacEvent, AlmanacEventType } from './types.ts';

const DELTA_DAYS = 0.01;

/**
 * What the reader at this site can expect on the night of the event, in the words the pages use
 * for the same night: the verdict of the visibility model (lib/models/visibility.ts: twilight, moonlight,
 * the site's sky, skyline and findability margin) with its best time and direction, or why not.
 */
function siteWords(ctx: AlmanacContext, body: Body, time: Date): { seen: 'yes' | 'no'; verdict: string; look: string; reason: string } {
  const v = computeNight(ctx.site, nightDateOf(time, ctx.site.timeZone), [body]).body(body).visibility;
  const w = ctx.words;
  const gender = ctx.phrase(body).gender;
  if (v.verdict === 'not-visible' || !v.best) return { seen: 'no', verdict: '', look: '', reason: reasonText(v.reason ?? 'too-faint', ctx.site, w, gender) };
  const look = w.t('ev.look', { direction: ctx.direction(v.best.azimuthDeg), clock: ctx.clock(v.best.time) });
  return {
    seen: 'yes',
    verdict: verdictWords(v.verdict, w, gender),
    look: ctx.day(v.best.time) === ctx.day(time) ? look : w.t('ev.look-day', { look, day: ctx.day(v.best.time) }),
    reason: '',
  };
}

/** Minima of `quantity` over [from, to) as instants. */
function minima(quantity: (ut: number) => number, from: Date, to: Date): Date[] {
  const rate = (ut: number): number => quantity(ut + DELTA_DAYS) - quantity(ut - DELTA_DAYS);
  return findCrossings(rate, utDays(from), utDays(to), { stepDays: 1, toleranceDays: 1 / 1440 })
    .filter((c) => c.direction === 1)
    .map((c) => dateFromUt(c.ut));
}

/** Perihelion, closest approach to the Earth and peak brightness of comets and asteroids in [from, to). */
export function smallBodyEvents(ctx: AlmanacContext, from: Date, to: Date, bodies: readonly Body[]): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  for (const body of bodies) {
    if (body.kind !== 'comet' && body.kind !== 'asteroid') continue;
    const memo = new Map<number, Illumination>();
    const illum = (ut: number): Illumination => {
      let i = memo.get(ut);
      if (!i) {
        i = body.illumination(Astronomy.MakeTime(dateFromUt(ut)));
        memo.set(ut, i);
      }
      return i;
    };
    const kinds: { type: AlmanacEventType; quantity: (ut: number) => number }[] = [
      { type: 'perihelion', quantity: (ut) => illum(ut).heliocentricDistanceAu },
      { type: 'closest-approach-to-earth', quantity: (ut) => illum(ut).geocentricDistanceAu },
      { type: 'peak-brightness', quantity: (ut) => illum(ut).magnitude.value },
    ];
    for (const { type, quantity } of kinds) {
      for (const time of sharedSearch(body, type, from, to, (a, b) => minima(quantity, a, b), (t) => t)) {
        const i = body.illumination(Astronomy.MakeTime(time));
        const m = i.magnitude;
        const mag = Math.round(m.value * 10) / 10;
        const w = ctx.words;
        const band = m.brightest !== undefined && m.faintest !== undefined ? { band: 'yes', brightest: w.number(m.brightest, 1), faintest: w.number(m.faintest, 1) } : { band: 'no', brightest: '', faintest: '' };
        const placed = eventVisibility(ctx, [body], time);
        const site = siteWords(ctx, body, time);
        const visibility = placed.visible && site.seen === 'no' ? hidden(ctx, 'too-faint') : placed;
        const day = ctx.day(time);
        const name = ctx.phrase(body);
        const what =
          type === 'perihelion'
            ? w.t('ev.perihelion', { name, au: w.number(i.heliocentricDistanceAu, 2), day })
            : type === 'closest-approach-to-earth'
              ? w.t('ev.closest-to-earth', { name, au: w.number(i.geocentricDistanceAu, 2), million: Math.round((i.geocentricDistanceAu * KM_PER_AU) / 1e6), day })
              : w.t('ev.peak-brightness', { name, day });
        out.push({
          type,
          time,
          bodies: [body.id],
          names: [body.name],
          visible: visibility.visible,
          visibility,
          title: w.t('ev.title.small-body', { name: ctx.label(body), type: type === 'perihelion' ? 'perihelion' : type === 'closest-approach-to-earth' ? 'closest' : 'brightest' }),
          description: w.t('ev.small-body', { what, magnitude: mag, ...band, ...site }),
          score: 0,
          data: { magnitude: mag, heliocentricDistanceAu: Number(i.heliocentricDistanceAu.toFixed(4)), geocentricDistanceAu: Number(i.geocentricDistanceAu.toFixed(4)) },
        });
      }
    }
  }
  return out;
}
