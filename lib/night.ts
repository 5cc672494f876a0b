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
import { localMidnight, nightOf, type Night } from './time.ts';

export { localMidnight };
import { NightFrame } from './track.ts';
import { NightVisibility, type Visibility } from './visibility.ts';

/** One body's night: rise, transit and set, and (computed on first use) its visibility. */
export interface BodyNight extends RiseTransitSet {
  body: Body;
  /** Best time, window and verdict (see `lib/visibility.ts`), computed once on first read. */
  readonly visibility: Visibility;
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
  /** The margin model of this night (sky quality, extinction, Moon phase fixed for the night). */
  readonly sky: NightVisibility;
}

/**
 * Computes the night that begins on the local evening of `date` (`YYYY-MM-DD`) at `site`
 * for `bodies` (each computed once, however many places later read it).
 */
export function computeNight(site: Site, date: string, bodies: readonly Body[]): NightReport {
  const night = nightOf(date, site.timeZone);
  const frame = new NightFrame(site, night);
  const moonBody = builtInBody('moon');
  let sky: NightVisibility | undefined;
  const report: NightReport = {
    site,
    night,
    frame,
    sun: sunEvents(frame),
    moon: { ...riseTransitSet(frame, frame.track(moonBody)), phase: moonPhase(localMidnight(night)) },
    bodies: bodies.map((body) => {
      let visibility: Visibility | undefined;
      return {
        body,
        ...riseTransitSet(frame, frame.track(body)),
        get visibility(): Visibility {
          visibility ??= report.sky.visibility(body);
          return visibility;
        },
      };
    }),
    get sky(): NightVisibility {
      sky ??= new NightVisibility(report);
      return sky;
    },
  };
  return report;
}
