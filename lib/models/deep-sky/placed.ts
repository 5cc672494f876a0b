/**
 * The deep-sky objects well placed on a night at a site: high enough while the sky is fully dark
 * within the audience's viewing hours, and recommended by the visibility model, best first.
 *
 * - *fully dark*: the Sun's centre at least 18° below the horizon (astronomical darkness, USNO
 *   definition), inside the site's viewing hours (`viewingSpan`). Where the Sun stays that low all
 *   night (polar night) the whole viewing span counts; where it never gets there, nothing is listed.
 * - *high enough*: at least `WELL_PLACED_ALTITUDE_DEG` (30°) up at some moment of that dark span,
 *   sampled every 10 minutes (common practice: below about 30° extinction and the low sky's glow
 *   dim faint, extended objects quickly).
 * - *recommended*: at some sampled moment of that dark span an aid shows it (the small
 *   telescope's margin reaches the required margin; a screen that skips the full computation for
 *   the rest), and the object's verdict for the night (`lib/models/visibility.ts`, Crumey's
 *   threshold for extended objects, so the Moon and light pollution count) is an aid, within the
 *   viewing hours.
 * - *best first*: least optical aid first (naked eye, binoculars, telescope), then the larger
 *   margin above the required one at the best time, then catalogue order.
 */
import { utDays } from '../../core/track.ts';
import type { BodyNight, NightReport } from '../night.ts';
import { DEFAULT_INSTRUMENTS } from '../sky/threshold.ts';
import { darkestUt, viewingSpan } from '../visibility.ts';
import { deepSkyBody, deepSkyObjects, type DeepSkyObject } from './catalogue.ts';

/** The lowest altitude at which a deep-sky object counts as well placed, degrees (common practice). */
export const WELL_PLACED_ALTITUDE_DEG = 30;
/** The Sun's altitude at and below which the sky is fully dark, degrees (astronomical twilight's end). */
const DARK_SUN_ALTITUDE_DEG = -18;
const SAMPLE_DAYS = 10 / 1440;
const AID_ORDER = ['naked-eye', 'binoculars', 'telescope'];
/** The aid that shows the most, for the screen: an object it cannot show in the dark is left out before its full night is computed. */
const STRONGEST_AID = DEFAULT_INSTRUMENTS.telescope;

/** A well-placed object: its catalogue row and its night (verdict, best time, window, guide). */
export interface PlacedObject {
  object: DeepSkyObject;
  night: BodyNight;
}

/** The list of a night, or why there is none. */
export interface WellPlaced {
  /** Best first; empty when nothing qualifies. */
  objects: PlacedObject[];
  /** The fully dark part of the viewing hours, UT days; null when the sky does not get fully dark then. */
  dark: { ut0: number; ut1: number } | null;
}

/** The fully dark part of the night's viewing hours, UT days, or null. */
export function darkViewingSpan(report: NightReport): { ut0: number; ut1: number } | null {
  const hours = viewingSpan(report);
  const dusk = report.sun.astronomicalDusk.time;
  const dawn = report.sun.astronomicalDawn.time;
  if (!dusk && !dawn) {
    // No crossing of −18° this night: either it stays darker (polar night) or it never gets there.
    return report.frame.sun.at(darkestUt(report)).geometricAltitudeDeg <= DARK_SUN_ALTITUDE_DEG ? hours : null;
  }
  const ut0 = Math.max(hours.ut0, dusk ? utDays(dusk) : report.frame.ut0);
  const ut1 = Math.min(hours.ut1, dawn ? utDays(dawn) : report.frame.ut1);
  return ut1 > ut0 ? { ut0, ut1 } : null;
}

/**
 * The deep-sky objects well placed on `report`'s night (see the module notes), at most `limit`.
 * Only objects that pass the altitude test get a full visibility computation.
 */
export function wellPlaced(report: NightReport, options: { limit?: number } = {}): WellPlaced {
  const dark = darkViewingSpan(report);
  if (!dark) return { objects: [], dark: null };
  const found: { placed: PlacedObject; rank: number; excess: number; order: number }[] = [];
  deepSkyObjects().forEach((object, order) => {
    const body = deepSkyBody(object);
    const track = report.frame.track(body);
    const samples: number[] = [];
    let high = false;
    for (let ut = dark.ut0; ut <= dark.ut1 + 1e-9; ut += SAMPLE_DAYS) {
      const at = Math.min(ut, dark.ut1);
      samples.push(at);
      high ||= track.apparentAltitudeDeg(at) >= WELL_PLACED_ALTITUDE_DEG;
    }
    if (!high) return;
    // Screen: an object that no aid shows at any sampled dark moment is not worth its full night.
    const margin = report.sky.marginFunction(body, STRONGEST_AID, object.mag);
    if (!samples.some((ut) => margin(ut) >= 0)) return;
    const night = report.body(body);
    const v = night.visibility;
    if (v.verdict === 'not-visible' || v.outsideViewingHours || !v.best) return;
    found.push({ placed: { object, night }, rank: AID_ORDER.indexOf(v.verdict), excess: v.best.margin - v.best.requiredMargin, order });
  });
  found.sort((a, b) => a.rank - b.rank || b.excess - a.excess || a.order - b.order);
  return { objects: found.slice(0, options.limit ?? found.length).map((f) => f.placed), dark };
}
