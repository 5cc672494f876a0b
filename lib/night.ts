/**
 * One night at one site: the Sun's events, the Moon, and the rise, transit and set of any
 * bodies. This is the value the command line prints and the bulletin placeholders read; later
 * stages (visibility, guide patterns) add to each body's entry.
 */
import type { Body } from './body.ts';
import { builtInBody } from './body.ts';
import { riseTransitSet, sunEvents, type RiseTransitSet, type SunEvents } from './events.ts';
import { moonPhase, type MoonPhase } from './moon.ts';
import type { Site } from './site.ts';
import { nightOf, zonedTime, addDays, type Night } from './time.ts';
import { NightFrame } from './track.ts';

export interface BodyNight extends RiseTransitSet {
  body: Body;
}

export interface NightReport {
  site: Site;
  night: Night;
  frame: NightFrame;
  sun: SunEvents;
  moon: RiseTransitSet & {
    /** Phase at local midnight of the night. */
    phase: MoonPhase;
  };
  bodies: BodyNight[];
}

/** Local midnight that splits the night of `night.date` (start of the next date). */
export function localMidnight(night: Night): Date {
  return zonedTime(addDays(night.date, 1), 0, 0, night.timeZone);
}

/**
 * Computes the night that begins on the local evening of `date` (`YYYY-MM-DD`) at `site`
 * for `bodies` (each computed once, however many places later read it).
 */
export function computeNight(site: Site, date: string, bodies: readonly Body[]): NightReport {
  const night = nightOf(date, site.timeZone);
  const frame = new NightFrame(site, night);
  const moonBody = builtInBody('moon');
  return {
    site,
    night,
    frame,
    sun: sunEvents(frame),
    moon: { ...riseTransitSet(frame, frame.track(moonBody)), phase: moonPhase(localMidnight(night)) },
    bodies: bodies.map((body) => ({ body, ...riseTransitSet(frame, frame.track(body)) })),
  };
}
