/**
 * Satellite passes as almanac events (`satellite-pass`), for `gloaming events` and the calendar
 * feed. Only passes to recommend become events (seen with the naked eye for at least a minute);
 * the others are not events anyone could act on. Nights whose passes would be more than
 * `MAX_ELEMENT_AGE_DAYS` from the element sets' epochs are left out rather than refused, so a
 * feed covering many weeks simply shows passes for the weeks the elements are good for.
 */
import type { AlmanacEvent } from './types.ts';
import { wordsFor } from '../../core/language/index.ts';
import type { Site } from '../../core/site.ts';
import { addDays, formatClock, localDateOf } from '../../core/time.ts';
import { passNights, recommendedPasses, type PassNight } from '../../models/satellite/nights.ts';
import type { PassPoint, Satellite, SatellitePass } from '../../models/satellite/passes.ts';
import { passWords, type PassEdge } from '../../models/satellite/words.ts';

/** One recommended pass as an event, worded in the language of `locale` (default the site's): from the moment it can be seen to the moment it cannot. */
export function passEvent(pass: SatellitePass, site: Site, locale: string = site.locale): AlmanacEvent {
  const seen = pass.visible!;
  const words = passWords(wordsFor(locale));
  const clock = (p: PassPoint): string => formatClock(p.time, site);
  const name = pass.satellite.name;
  // What starts and ends the sighting: the skyline, the Earth's shadow (its penumbra dims the
  // satellite for some seconds around the crossing), or distance and twilight.
  const near = (a: PassPoint, b: PassPoint, seconds: number): boolean => Math.abs(a.time.getTime() - b.time.getTime()) <= seconds * 1000;
  const appears: PassEdge = near(seen.start, pass.start, 1) ? 'skyline' : pass.shadow.some((s) => s.kind === 'leaves-shadow' && near(s.point, seen.start, 30)) ? 'shadow' : 'fade';
  const leaves: PassEdge = near(seen.end, pass.end, 1) ? 'skyline' : pass.shadow.some((s) => s.kind === 'enters-shadow' && near(s.point, seen.end, 30)) ? 'shadow' : 'fade';
  const magnitude = seen.best.magnitude!;
  return {
    type: 'satellite-pass',
    time: seen.start.time,
    end: seen.end.time,
    bodies: [`satellite:${pass.satellite.id}`],
    names: [name],
    visible: true,
    visibility: {
      visible: true,
      moment: 'event',
      time: seen.best.time,
      altitudeDeg: seen.best.altitudeDeg,
      azimuthDeg: seen.best.azimuthDeg,
      reason: null,
      note: words.note(pass, clock),
    },
    title: words.title(pass),
    description: words.description(pass, clock, { appears, leaves }),
    score: 0,
    data: {
      magnitude: Math.round(magnitude * 10) / 10,
      culminationAltitudeDeg: Math.round(pass.culmination.altitudeDeg * 10) / 10,
      elementAgeDays: Math.round(pass.elements.ageDays * 100) / 100,
      norad: pass.satellite.noradId,
    },
  };
}

/**
 * The recommended passes of `satellites` over the site with their visible start in [from, to),
 * as events; nights the element sets do not cover are left out (see `passNights`). Nights in
 * `known` (already computed for this site and these satellites) are reused.
 */
export function satellitePassEvents(input: { site: Site; satellites: readonly Satellite[]; from: Date; to: Date; known?: readonly PassNight[] }): AlmanacEvent[] {
  const { site, satellites } = input;
  if (satellites.length === 0) return [];
  // Nights run from local noon: the night holding `from` began on the evening before its date.
  const from = addDays(localDateOf(input.from, site.timeZone), -1);
  const to = localDateOf(input.to, site.timeZone);
  return recommendedPasses(passNights({ site, satellites, from, to, ...(input.known ? { known: input.known } : {}) }))
    .filter((p) => p.visible!.start.time >= input.from && p.visible!.start.time < input.to)
    .map((p) => passEvent(p, site));
}
