/**
 * Variable-star minima (event type `variable-minimum`): the predicted primary minima of the eclipsing
 * binaries of lib/variables (Algol), with whether the site can watch them.
 *
 * A minimum counts as visible from the site when, at some moment within `WATCH_WINDOW_HOURS` of
 * the predicted minimum, the sky is dark (the Sun's centre at least `DARK_SUN_ALTITUDE_DEG` below
 * the horizon: nautical twilight over, so the comparison stars of magnitude 2–3.5 are out) and the
 * star stands at least `MIN_STAR_ALTITUDE_DEG` high and above the site's skyline and minimum
 * altitude (common practice, this project's choice: lower down, extinction of up to a magnitude
 * near the horizon and the different heights of the comparison stars spoil the comparison). Within
 * an hour of minimum an Algol-type star is within a few tenths of a magnitude of its faintest.
 */
import { findMaximum } from '../../core/search.ts';
import { skylineAltitudeDeg } from '../../core/site.ts';
import { starByHip } from '../../models/stars/catalogue.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import { VARIABLE_STARS, type VariableStar } from '../../models/variables/catalogue.ts';
import { primaryMinima } from '../../models/variables/minima.ts';
import { starBody, type AlmanacContext } from './context.ts';
import { apparentPlace, hidden } from './visibility.ts';
import type { AlmanacEvent, EventHiddenReason } from './types.ts';

/** The Sun's centre must be this far below the horizon (degrees): the end of nautical twilight. */
export const DARK_SUN_ALTITUDE_DEG = -12;
/** The star must stand at least this high (degrees, apparent). */
export const MIN_STAR_ALTITUDE_DEG = 20;
/** A minimum can be watched this many hours either side of the predicted instant. */
export const WATCH_WINDOW_HOURS = 1;

/** Reader-facing words for variable-star minima, in one place (for message catalogues). */
/** The predicted minima of every variable star in [from, to), with their visibility from the site. */
export function variableStarEvents(ctx: AlmanacContext, from: Date, to: Date, stars: readonly VariableStar[] = VARIABLE_STARS): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  for (const star of stars) {
    const body = starBody(starByHip(star.hip)!);
    for (const time of primaryMinima(star, from, to)) {
      const ut = utDays(time);
      const frame = ctx.frameAt(time);
      // How far the star stands above every limit while the sky is dark (NaN while it is not).
      const margin = (u: number): number => {
        if (apparentPlace(frame, frame.sun.body, u).altitudeDeg > DARK_SUN_ALTITUDE_DEG) return NaN;
        const p = apparentPlace(frame, body, u);
        return p.altitudeDeg - Math.max(MIN_STAR_ALTITUDE_DEG, ctx.site.minAltitudeDeg, skylineAltitudeDeg(ctx.site, p.azimuthDeg));
      };
      const half = WATCH_WINDOW_HOURS / 24;
      const u0 = Math.max(frame.ut0, ut - half), u1 = Math.min(frame.ut1, ut + half);
      // The predicted instant itself when it will do; else the watchable moment nearest to it.
      const atMinimum = margin(ut);
      const best = atMinimum >= 0 ? { ut, value: atMinimum } : findMaximum(margin, u0, u1, { stepDays: 5 / 1440 });
      const w = ctx.words;
      const said = { name: star.name, max: w.number(star.maxMagnitude, 1), min: w.number(star.minMagnitude, 1), when: w.t('ev.variable-when', { clock: ctx.clock(time), day: ctx.day(time) }) };
      let event: Pick<AlmanacEvent, 'visible' | 'visibility' | 'description'>;
      if (best && best.value >= 0) {
        const at = dateFromUt(best.ut);
        const p = apparentPlace(frame, body, best.ut);
        const place = { clock: ctx.clock(at), degrees: Math.round(p.altitudeDeg), direction: ctx.direction(p.azimuthDeg) };
        event = {
          visible: true,
          visibility: { visible: true, moment: 'event', time: at, altitudeDeg: p.altitudeDeg, azimuthDeg: p.azimuthDeg, reason: null, note: w.t('ev.variable-note', place) },
          description: w.t('ev.variable-watch', { ...said, ...place, hours: Math.round(star.eclipseHours / 2) }),
        };
      } else {
        const dark = [u0, ut, u1].some((u) => apparentPlace(frame, frame.sun.body, u).altitudeDeg <= DARK_SUN_ALTITUDE_DEG);
        const reason: EventHiddenReason = dark ? 'below-horizon' : 'daylight';
        const visibility = hidden(ctx, reason);
        const words = reason === 'below-horizon' ? w.t('ev.variable-low', { degrees: Math.max(MIN_STAR_ALTITUDE_DEG, ctx.site.minAltitudeDeg) }) : w.t('ev.variable-daylight');
        // What happens, then why it cannot be watched from here: the note ends the sentence (as an
        // occultation's does), so a list that adds a hidden event's note does not say it twice.
        const note = w.t('event-hidden.note', { site: ctx.site.name, reason: words, itself: 'other' });
        event = { visible: false, visibility: { ...visibility, note }, description: `${w.t('ev.variable-hidden', said)} ${note}` };
      }
      out.push({
        type: 'variable-minimum',
        time,
        bodies: [`variable:${star.id}`, body.id],
        names: [star.name],
        title: w.t('ev.title.variable', { name: star.name }),
        score: 0,
        ...event,
        data: { maxMagnitude: star.maxMagnitude, minMagnitude: star.minMagnitude, eclipseHours: star.eclipseHours, uncertaintyMinutes: star.uncertaintyMinutes, ephemeris: star.source },
      });
    }
  }
  return out;
}
