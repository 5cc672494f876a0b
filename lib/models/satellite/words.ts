/**
 * Every reader-facing phrase about satellite passes (bulletin placeholders, the `satellite-pass`
 * event, the site's "tonight" card), worded from the message catalogues (`pass.*` in
 * lib/core/language/catalogues/) in the language of the `Words` given. Clock times and dates come
 * in already formatted in the site's zone and locale.
 */
import type { Words } from '../../core/language/index.ts';
import { MAX_ELEMENT_AGE_DAYS, type PassPoint, type SatellitePass } from './passes.ts';

/** How a pass starts or ends being seen: at the skyline, at the Earth's shadow, or by fading (distance, twilight). */
export type PassEdge = 'skyline' | 'shadow' | 'fade';

/**
 * Above this apparent altitude a point of a pass is "almost straight overhead" rather than "in the
 * north-west": near the zenith a compass direction sends the reader's eyes the wrong way (at 88°
 * the azimuth swings through half the horizon within seconds). Our own choice, degrees.
 */
export const OVERHEAD_ALTITUDE_DEG = 85;

/** Where a point of a pass is, in words: "40° up in the south", or "88° up, almost straight overhead". */
export function passWhere(w: Words, p: { altitudeDeg: number; azimuthDeg: number }): string {
  return w.t('pass.where', { degrees: Math.round(p.altitudeDeg), direction: w.compass(p.azimuthDeg).word, overhead: p.altitudeDeg >= OVERHEAD_ALTITUDE_DEG ? 'yes' : 'no' });
}

/** The pass phrases in one language. */
export function passWords(w: Words) {
  const magnitude = (value: number): string => w.number(Math.round(value * 10) / 10, 1);
  const where = (p: PassPoint): string => passWhere(w, p);
  return {
    /** Lead of the site's tonight line. */
    tonight: w.t('pass.tonight'),
    noneThisWeek: w.t('pass.none-week'),
    noneTonight: w.t('pass.none-tonight'),
    noneThisNight: w.t('pass.none-night'),
    noSatellites: w.t('pass.no-satellites'),
    thisWeek: w.t('pass.this-week'),
    /** The whole span past the element sets' reach. */
    unavailable: (span: string): string => w.t('pass.unavailable', { span, days: MAX_ELEMENT_AGE_DAYS }),
    unavailableShort: w.t('pass.unavailable-short'),
    /** Some nights past the reach of every element set (`none`), or of some (`some`): day lists, or null. */
    partly: (none: string | null, some: string | null): string => {
      const age = MAX_ELEMENT_AGE_DAYS;
      if (none && some) return w.t('pass.partly-both', { none, some, age });
      return none ? w.t('pass.partly-none', { none, age }) : w.t('pass.partly-some', { some: some ?? '', age });
    },
    /** Two days as a span ("Mon to Wed"). */
    days: (first: string, last: string): string => w.t('window.span', { start: first, end: last }),
    /** "… and 12 fainter passes." after a shortened list. */
    more: (count: number): string => w.t('pass.more', { count }),
    noChart: (why: string): string => w.t('pass.no-chart', { why }),
    /** One pass in a few words: "Demo station, west-northwest to east, up to 77°, magnitude −3.8", or "…, in the north, …" when it ends where it began. */
    short: (pass: SatellitePass): string => {
      const seen = pass.visible!;
      const from = w.compass(seen.start.azimuthDeg).word;
      const to = w.compass(seen.end.azimuthDeg).word;
      return w.t('pass.short', {
        satellite: pass.satellite.name,
        // A pass seen in one quarter of the sky (it fades where it appeared) is "in the north", not "north to north".
        same: from === to ? 'yes' : 'no',
        from,
        to,
        degrees: Math.round(maxAltitude(pass)),
        magnitude: magnitude(seen.best.magnitude!),
      });
    },
    magnitude,
    where,
    title: (pass: SatellitePass): string => w.t('pass.title', { satellite: pass.satellite.name }),
    /** The note: when it can be seen and where it is best. */
    note: (pass: SatellitePass, clock: (p: PassPoint) => string): string => {
      const seen = pass.visible!;
      return w.t('pass.note', { start: clock(seen.start), end: clock(seen.end), best: clock(seen.best), where: where(seen.best) });
    },
    /** The whole sentence: where it appears and how, how high it climbs, where and how it goes. */
    description: (pass: SatellitePass, clock: (p: PassPoint) => string, edges: { appears: PassEdge; leaves: PassEdge }): string => {
      const seen = pass.visible!;
      // The highest point seen: the culmination may fall in the Earth's shadow, before or after the part seen.
      const top = visibleTop(pass);
      return w.t('pass.description', {
        satellite: pass.satellite.name,
        appears: edges.appears,
        start: clock(seen.start),
        start_where: where(seen.start),
        top: Math.round(top.point.altitudeDeg),
        top_direction: w.compass(top.point.azimuthDeg).word,
        top_at: top.point.altitudeDeg >= OVERHEAD_ALTITUDE_DEG ? 'overhead' : top.at,
        leaves: edges.leaves,
        end: clock(seen.end),
        end_where: where(seen.end),
        magnitude: magnitude(seen.best.magnitude!),
      });
    },
  };
}

/**
 * The highest point of the visible part of a pass and where it lies in that part: the culmination
 * when it is seen ('inside'), else the higher of the first and last point seen ('start': the pass
 * only sinks while seen; 'end': it climbs until it is lost).
 */
export function visibleTop(pass: SatellitePass): { point: PassPoint; at: 'start' | 'inside' | 'end' } {
  const seen = pass.visible!;
  const c = pass.culmination;
  if (c.time > seen.start.time && c.time < seen.end.time) return { point: c, at: 'inside' };
  return seen.start.altitudeDeg >= seen.end.altitudeDeg ? { point: seen.start, at: 'start' } : { point: seen.end, at: 'end' };
}

/** The highest apparent altitude of the visible part of a pass, degrees. */
export function maxAltitude(pass: SatellitePass): number {
  return visibleTop(pass).point.altitudeDeg;
}
