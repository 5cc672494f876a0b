/**
 * Can an event be seen from the site? An event counts as visible when every body taking part
 * stands above the site's skyline and minimum altitude while the sky is dark (the Sun's apparent
 * altitude at or below the darkness limit, default −6°: the end of civil twilight, enough for the
 * Moon, planets and first-magnitude stars). If that is not so at the event's own instant, the
 * best moment of the same night (local noon to local noon) is searched: the moment when the
 * lowest of the bodies stands highest above its limit (`findMaximum` of lib/core/search.ts).
 */
import type { Body } from '../../core/body.ts';
import { wordsFor } from '../../core/language/index.ts';
import { riseTransitSet } from '../../core/events.ts';
import { findMaximum } from '../../core/search.ts';
import { skylineAltitudeDeg } from '../../core/site.ts';
import { separationDeg } from '../../core/geometry.ts';
import { GLARE_ELONGATION_DEG } from '../../models/near-sun.ts';
import { dateFromUt, utDays, type NightFrame } from '../../core/track.ts';
import type { AlmanacContext } from './context.ts';
import type { EventHiddenReason, EventVisibility } from './types.ts';

/** Sampling step of the best-moment search, days (10 minutes; refined to 1 s). */
const STEP_DAYS = 10 / 1440;
const ENGLISH = wordsFor('en');
const EVENT_HIDDEN_REASONS: readonly EventHiddenReason[] = ['below-horizon', 'daylight', 'too-close-to-sun', 'no-darkness', 'radiant-below-horizon', 'sun-below-horizon', 'too-faint'];

export const HIDDEN_REASON_TEXT: Record<EventHiddenReason, string> = Object.fromEntries(
  EVENT_HIDDEN_REASONS.map((r) => [r, ENGLISH.t(`event-hidden.${r}`)]),
) as Record<EventHiddenReason, string>;

/** Apparent (refracted) altitude and azimuth of a body on a night's track, degrees. */
export function apparentPlace(frame: NightFrame, body: Body, ut: number): { altitudeDeg: number; azimuthDeg: number } {
  const track = frame.track(body);
  return { altitudeDeg: track.apparentAltitudeDeg(ut), azimuthDeg: track.at(ut).azimuthDeg };
}

/** Lowest margin (apparent altitude − max(skyline, minimum altitude)) of the bodies at `ut`, degrees. */
function lowestMargin(ctx: AlmanacContext, frame: NightFrame, bodies: readonly Body[], ut: number): number {
  let lowest = Infinity;
  for (const body of bodies) {
    const p = apparentPlace(frame, body, ut);
    const limit = Math.max(ctx.site.minAltitudeDeg, skylineAltitudeDeg(ctx.site, p.azimuthDeg));
    lowest = Math.min(lowest, p.altitudeDeg - limit);
  }
  return lowest;
}

/**
 * Whether the sky counts as dark at `ut`: the Sun's centre at least `darkSunAltitudeDeg` below the
 * horizon, geometrically (airless), as twilight is defined (USNO; Meeus ch. 15) and as the
 * printed dusk and dawn are computed (`sunEvents`): with the default −6°, dark from the printed
 * civil dusk to the printed civil dawn.
 */
export function isDark(ctx: AlmanacContext, frame: NightFrame, ut: number): boolean {
  return frame.sun.at(ut).geometricAltitudeDeg <= ctx.darkSunAltitudeDeg;
}

/**
 * A body's rise on the night containing `time` (local noon to noon; lib/core/events.ts, the upper
 * limb on the ideal horizon with standard refraction): its instant and the words "at 18:04 in the
 * east-northeast", or null when it does not rise that night.
 */
export function riseWords(ctx: AlmanacContext, body: Body, time: Date): { time: Date; words: string } | null {
  const frame = ctx.frameAt(time);
  const rise = riseTransitSet(frame, frame.track(body)).rise.time;
  if (!rise) return null;
  return { time: rise, words: ctx.words.t('ev.rise-at', { clock: ctx.clock(rise), direction: ctx.direction(apparentPlace(frame, body, utDays(rise)).azimuthDeg) }) };
}

/** Sampling step over a night when judging how much of it a body is up, days (10 minutes). */
const UP_STEP_DAYS = 10 / 1440;

/** How much of a night a body is up (see `overNight`). */
export interface OverNight {
  share: 'all' | 'part' | 'none';
  /** Whether the night has a dark part. */
  dark: boolean;
  /** Whether the body is up when the dark part begins. */
  upAtDusk: boolean;
}

/**
 * A body over the night containing `time` (its centre's apparent altitude above 0° counts as up).
 * `share`: 'all' when it is up for at least 90% of the night's dark part (the Sun below the
 * context's darkness altitude; a full Moon rising a few minutes after dark still "stays up all
 * night"), 'none' when it is never up then, 'part' otherwise; a night with no dark part (midnight
 * Sun, white nights) is judged on the hours the Sun is below the horizon, or on the whole night.
 */
export function overNight(ctx: AlmanacContext, body: Body, time: Date): OverNight {
  const frame = ctx.frameAt(time);
  const samples: number[] = [];
  for (let ut = frame.ut0; ut <= frame.ut1; ut += UP_STEP_DAYS) samples.push(ut);
  const dark = samples.filter((ut) => isDark(ctx, frame, ut));
  const sunDown = samples.filter((ut) => frame.sun.at(ut).geometricAltitudeDeg < 0);
  const judged = dark.length > 0 ? dark : sunDown.length > 0 ? sunDown : samples;
  const isUp = (ut: number): boolean => apparentPlace(frame, body, ut).altitudeDeg > 0;
  const up = judged.filter(isUp).length;
  return { share: up === 0 ? 'none' : up >= 0.9 * judged.length ? 'all' : 'part', dark: dark.length > 0, upAtDusk: dark.length > 0 && isUp(dark[0]!) };
}

/** Geocentric angle between a body and the Sun at `ut`, degrees. */
export function elongationDeg(frame: NightFrame, body: Body, ut: number): number {
  return separationDeg(frame.track(body).vectorAt(ut), frame.sun.vectorAt(ut));
}

/** The note for a moment: "21:10, 25° up in the south-west". */
function placeWords(ctx: AlmanacContext, time: Date, altitudeDeg: number, azimuthDeg: number): string {
  return ctx.words.t('ev.place', { clock: ctx.clock(time), degrees: Math.round(altitudeDeg), direction: ctx.direction(azimuthDeg) });
}

/** Cap on the altitude margin that still improves a moment near the event, degrees. */
const NEAR_MARGIN_CAP_DEG = 15;
/** Cost of moving away from the event's instant, degrees of margin per hour. */
const NEAR_COST_DEG_PER_HOUR = 1;

export interface EventVisibilityOptions {
  /**
   * Prefer moments near the event (for close approaches, whose separation changes by the hour):
   * the best moment maximises min(margin, 15°) − 1° per hour away from the event, over the
   * night containing the event and the neighbouring night on the event's side. Otherwise the
   * best moment is the one where the lowest body stands highest, within the night containing it.
   */
  preferNear?: boolean;
}

/** Whether `bodies` can be seen together in a dark sky at `time`, or else at the best moment of that night. */
export function eventVisibility(ctx: AlmanacContext, bodies: readonly Body[], time: Date, options: EventVisibilityOptions = {}): EventVisibility {
  const frame = ctx.frameAt(time);
  const first = bodies[0]!;
  const ut = utDays(time);
  if (isDark(ctx, frame, ut) && lowestMargin(ctx, frame, bodies, ut) >= 0) {
    const p = apparentPlace(frame, first, ut);
    return { visible: true, moment: 'event', time, altitudeDeg: p.altitudeDeg, azimuthDeg: p.azimuthDeg, reason: null, note: ctx.words.t('ev.visible-at-time', { place: placeWords(ctx, time, p.altitudeDeg, p.azimuthDeg) }) };
  }
  let anyDark = false;
  const frames = [frame];
  if (options.preferNear) {
    // The neighbouring night whose dark hours may be nearer: the next one for a late-morning event,
    // the previous one for an early-afternoon event.
    const hour = (ut - frame.ut0) * 24;
    if (hour < 6) frames.push(ctx.frameAt(dateFromUt(ut - 0.5)));
    else if (hour > 18) frames.push(ctx.frameAt(dateFromUt(ut + 0.5)));
  }
  let best: { ut: number; value: number; frame: NightFrame } | null = null;
  for (const f of frames) {
    const objective = (u: number): number => {
      if (!isDark(ctx, f, u)) return NaN;
      anyDark = true;
      const margin = lowestMargin(ctx, f, bodies, u);
      if (!options.preferNear) return margin;
      return margin < 0 ? NaN : Math.min(margin, NEAR_MARGIN_CAP_DEG) - NEAR_COST_DEG_PER_HOUR * 24 * Math.abs(u - ut);
    };
    const m = findMaximum(objective, f.ut0, f.ut1, { stepDays: STEP_DAYS });
    if (m && (!best || m.value > best.value)) best = { ...m, frame: f };
  }
  if (best && (options.preferNear || best.value >= 0)) {
    const at = dateFromUt(best.ut);
    const p = apparentPlace(best.frame, first, best.ut);
    const day = ctx.day(at) === ctx.day(time) ? '' : ` (${ctx.day(at)})`; // the day in brackets when the best moment is on another date
    return {
      visible: true,
      moment: 'night',
      time: at,
      altitudeDeg: p.altitudeDeg,
      azimuthDeg: p.azimuthDeg,
      reason: null,
      note: ctx.words.t('ev.best-seen-at', { place: placeWords(ctx, at, p.altitudeDeg, p.azimuthDeg) + day }),
    };
  }
  let reason: EventHiddenReason = 'below-horizon';
  if (!anyDark) reason = 'no-darkness';
  else if (bodies.some((b) => b.kind !== 'sun' && elongationDeg(frame, b, ut) < GLARE_ELONGATION_DEG)) reason = 'too-close-to-sun';
  return hidden(ctx, reason);
}

/**
 * A not-visible verdict with its note. `itself: 'moon'` words the note for an event whose sentence
 * is about something else than seeing the Moon (the dark nights around a new Moon): "The Moon
 * itself cannot be seen from …", so the note does not seem to deny the sentence.
 */
export function hidden(ctx: AlmanacContext, reason: EventHiddenReason, options: { itself?: 'moon' } = {}): EventVisibility {
  const note = ctx.words.t('event-hidden.note', { site: ctx.site.name, reason: ctx.words.t(`event-hidden.${reason}`), itself: options.itself ?? 'other' });
  return { visible: false, moment: 'none', time: null, altitudeDeg: null, azimuthDeg: null, reason, note };
}
