/**
 * One night at one site: the Sun's events, the Moon, and the rise, transit and set of any
 * bodies. This is the value the command line prints and the bulletin placeholders read; later
 * stages (visibility, guide patterns) add to each body's entry.
 */
import { builtInBody, type Body } from '../core/body.ts';
import { riseTransitSet, sunEvents, type RiseTransitSet, type SunEvents } from '../core/events.ts';
import { moonPhase, type MoonPhase } from '../core/moon.ts';
import type { Site } from '../core/site.ts';
import { localMidnight, nightOf, type Night } from '../core/time.ts';
import { NightFrame } from '../core/track.ts';
import { NightVisibility, type Visibility } from './visibility.ts';
import type { GuideResult } from './stars/guide.ts';
import { guideFor } from './guide.ts';

/** One body's night: rise, transit and set, and (computed on first use) its visibility. */
export interface BodyNight extends RiseTransitSet {
  body: Body;
  /** Best time, window and verdict (see `lib/models/visibility.ts`), computed once on first read. */
  readonly visibility: Visibility;
  /**
   * The guide pattern and nearest bright star at the best time (or at transit when there is no
   * best time), computed once on first read; null when neither moment exists or no pattern is up.
   */
  readonly guide: GuideResult | null;
}

/** The guide pattern for `body` at `time` as seen from `site` (see `lib/models/stars/guide.ts`). */
export function guideAt(site: Site, body: Body, time: Date): GuideResult | null {
  return guideFor({ site, body, time });
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
  /**
   * Any body's night on this report's shared frame, computed once and kept: `bodies` holds the
   * requested ones, and later readers (placeholders, charts) may ask for others.
   */
  body(body: Body): BodyNight;
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
  const entries = new Map<string, BodyNight>();
  let sky: NightVisibility | undefined;
  const report: NightReport = {
    site,
    night,
    frame,
    sun: sunEvents(frame),
    moon: { ...riseTransitSet(frame, frame.track(moonBody)), phase: moonPhase(localMidnight(night)) },
    bodies: [],
    body(body: Body): BodyNight {
      let entry = entries.get(body.id);
      if (!entry) {
        entry = bodyNight(report, body);
        entries.set(body.id, entry);
      }
      return entry;
    },
    get sky(): NightVisibility {
      sky ??= new NightVisibility(report);
      return sky;
    },
  };
  report.bodies = bodies.map((b) => report.body(b));
  return report;
}

/** One body's night on a report's frame: events now, visibility and guide pattern on first read. */
function bodyNight(report: NightReport, body: Body): BodyNight {
  const events = riseTransitSet(report.frame, report.frame.track(body));
  let visibility: Visibility | undefined;
  let guide: GuideResult | null | undefined;
  const entry: BodyNight = {
    body,
    ...events,
    get visibility(): Visibility {
      visibility ??= report.sky.visibility(body);
      return visibility;
    },
    get guide(): GuideResult | null {
      if (guide === undefined) {
        const at = body.kind === 'sun' ? null : (entry.visibility.best?.time ?? events.transit.time);
        guide = at ? guideAt(report.site, body, at) : null;
      }
      return guide;
    },
  };
  return entry;
}
