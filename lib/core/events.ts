/**
 * Daily events of one night: rise, transit and set of any body, and the Sun's twilights.
 * All are zero crossings found by `search.ts` on a body's `Track`.
 *
 * Definitions (USNO "Rise, Set, and Twilight Definitions"; Meeus, *Astronomical Algorithms*, ch. 15):
 * - rise / set: the upper limb touches the ideal horizon, i.e. the geometric altitude of the
 *   centre is −(34′ + semidiameter) (34′ = standard horizontal refraction);
 * - transit: upper culmination, hour angle 0;
 * - civil / nautical / astronomical dusk and dawn: the Sun's centre is geometrically 6°, 12°, 18°
 *   below the horizon.
 * An event that does not happen within the night is `null`, with a reason saying why.
 */
import { findCrossings, type Crossing } from './search.ts';
import { HORIZON_REFRACTION_DEG } from './observe.ts';
import { dateFromUt, type NightFrame, type Track } from './track.ts';

/** Why an event is missing from a night. */
export type MissingReason =
  | 'always-above' // circumpolar: never sets this night
  | 'always-below' // never rises this night
  | 'outside-night' // happens, but before local noon or after the next local noon
  | 'stays-above' // twilight: the Sun never gets that far below the horizon (no darkness of that kind)
  | 'stays-below'; // twilight: the Sun never gets that high (polar night)

export const MISSING_REASON_TEXT: Record<MissingReason, string> = {
  'always-above': 'stays above the horizon all night',
  'always-below': 'stays below the horizon all night',
  'outside-night': 'happens outside this night (before local noon or after the next local noon)',
  'stays-above': 'the Sun does not sink that far below the horizon this night',
  'stays-below': 'the Sun stays below that altitude all night',
};

/** An event time, or null with the reason it does not happen. */
export type EventTime = { time: Date; reason?: undefined } | { time: null; reason: MissingReason };

export interface RiseTransitSet {
  rise: EventTime;
  /** Upper culmination, with the apparent (refracted) altitude of the centre then, degrees. */
  transit: EventTime & { altitudeDeg?: number };
  set: EventTime;
}

const SEARCH_STEP_DAYS = 10 / 1440;

/** Geometric altitude of the centre minus the rise/set altitude −(34′ + semidiameter), degrees. */
function horizonFunction(track: Track): (ut: number) => number {
  return (ut) => {
    const p = track.at(ut);
    return p.geometricAltitudeDeg + HORIZON_REFRACTION_DEG + track.semidiameterDeg(p.distance);
  };
}

function first(crossings: Crossing[], direction: 1 | -1): Crossing | undefined {
  return crossings.find((c) => c.direction === direction);
}

/**
 * Why an event is missing: with no crossing at all the function kept one sign all night (always
 * above or always below); otherwise the crossing it needed happens outside the night.
 */
function missing(f: (ut: number) => number, frame: NightFrame, crossings: readonly Crossing[], twilight: boolean): EventTime {
  if (crossings.length > 0) return { time: null, reason: 'outside-night' };
  const above = f(frame.ut0) > 0;
  if (twilight) return { time: null, reason: above ? 'stays-above' : 'stays-below' };
  return { time: null, reason: above ? 'always-above' : 'always-below' };
}

/** Rise, transit and set of a body within the night of `frame` (the first of each). */
export function riseTransitSet(frame: NightFrame, track: Track): RiseTransitSet {
  const f = horizonFunction(track);
  const crossings = findCrossings(f, frame.ut0, frame.ut1, { stepDays: SEARCH_STEP_DAYS });
  const rise = first(crossings, 1);
  const set = first(crossings, -1);
  const transits = findCrossings((ut) => track.at(ut).hourAngleHours, frame.ut0, frame.ut1, {
    stepDays: SEARCH_STEP_DAYS,
    accept: (a, b) => Math.abs(a) < 6 && Math.abs(b) < 6,
  });
  const transit = transits[0];
  return {
    rise: rise ? { time: dateFromUt(rise.ut) } : missing(f, frame, crossings, false),
    set: set ? { time: dateFromUt(set.ut) } : missing(f, frame, crossings, false),
    transit: transit
      ? { time: dateFromUt(transit.ut), altitudeDeg: track.apparentAltitudeDeg(transit.ut) }
      : { time: null, reason: 'outside-night' },
  };
}

/** The Sun's events of one night, in the order they happen on an ordinary night. */
export interface SunEvents {
  set: EventTime;
  civilDusk: EventTime;
  nauticalDusk: EventTime;
  astronomicalDusk: EventTime;
  astronomicalDawn: EventTime;
  nauticalDawn: EventTime;
  civilDawn: EventTime;
  rise: EventTime;
}

/**
 * Sunset, twilights and sunrise of the night of `frame`, always in this order: each morning event is the first
 * upward crossing after the matching evening one. Where the Sun is still below the horizon at local noon (polar
 * edges, zones far from their longitude) an upward crossing before the evening's is the tail of the day, not this
 * night's dawn: the dawn then falls after the night's end and is `null` ('outside-night').
 */
export function sunEvents(frame: NightFrame): SunEvents {
  const sun = frame.sun;
  const pair = (f: (ut: number) => number, twilight: boolean): { down: EventTime; up: EventTime } => {
    const c = findCrossings(f, frame.ut0, frame.ut1, { stepDays: SEARCH_STEP_DAYS });
    const down = first(c, -1);
    const up = c.find((x) => x.direction === 1 && (!down || x.ut > down.ut));
    return {
      down: down ? { time: dateFromUt(down.ut) } : missing(f, frame, c, twilight),
      up: up ? { time: dateFromUt(up.ut) } : down ? { time: null, reason: 'outside-night' } : missing(f, frame, c, twilight),
    };
  };
  const twilight = (depthDeg: number): { dusk: EventTime; dawn: EventTime } => {
    const { down, up } = pair((ut) => sun.at(ut).geometricAltitudeDeg + depthDeg, true);
    return { dusk: down, dawn: up };
  };
  const horizon = pair(horizonFunction(sun), false);
  const rs = { set: horizon.down, rise: horizon.up };
  const civil = twilight(6);
  const nautical = twilight(12);
  const astronomical = twilight(18);
  return {
    set: rs.set,
    civilDusk: civil.dusk,
    nauticalDusk: nautical.dusk,
    astronomicalDusk: astronomical.dusk,
    astronomicalDawn: astronomical.dawn,
    nauticalDawn: nautical.dawn,
    civilDawn: civil.dawn,
    rise: rs.rise,
  };
}
