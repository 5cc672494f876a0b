/**
 * Every reader-facing phrase about satellite passes on pages (bulletin placeholders, the site's
 * "tonight" card), in one place so they can move into message catalogues together. Values come
 * in already formatted (clock times and dates in the site's zone and locale).
 */
import { compass } from '../../core/describe.ts';
import { MAX_ELEMENT_AGE_DAYS, type PassPoint, type SatellitePass } from './passes.ts';

/** A magnitude to one decimal with a true minus sign ("−3.8", "2.1"). */
function magnitudeText(value: number): string {
  const r = Math.round(value * 10) / 10;
  return (r < 0 ? '\u2212' : '') + Math.abs(r).toFixed(1);
}

export const PASS_WORDS = {
  /** Heading-free lead of the site's tonight line. */
  tonight: "Tonight's satellite passes",
  /** No satellites followed: nothing is said (pages leave passes out). */
  noneThisWeek: 'no bright satellite passes this week',
  noneTonight: 'no bright passes',
  noneThisNight: 'no bright satellite pass this night',
  noSatellites: 'no satellites are followed for this site',
  /** The whole span past the element sets' reach. */
  unavailable: (span: string): string => `satellite pass predictions are not available for ${span}: our orbital elements for the satellites are more than ${MAX_ELEMENT_AGE_DAYS} days from it`,
  unavailableShort: 'predictions not available (orbital elements out of date)',
  /** Some nights past the reach of every element set (`none`), or of some (`some`): day lists, or null. */
  partly: (none: string | null, some: string | null): string =>
    [none ? `No predictions for ${none}` : null, some ? `${none ? 'only' : 'Only'} some satellites are predicted for ${some}` : null].filter(Boolean).join('; ') +
    `: the orbital elements are more than ${MAX_ELEMENT_AGE_DAYS} days from ${none && some ? 'those nights' : 'then'}.`,
  /** "and 12 fainter passes" after a shortened list. */
  more: (count: number): string => `… and ${count} fainter pass${count === 1 ? '' : 'es'}.`,
  noChart: (why: string): string => `No pass chart (${why}).`,
  /** One pass in a few words: "Demo station, west-northwest to east, up to 77°, magnitude −3.8". */
  short: (pass: SatellitePass): string => {
    const seen = pass.visible!;
    return `${pass.satellite.name}, ${compass(seen.start.azimuthDeg).word} to ${compass(seen.end.azimuthDeg).word}, up to ${Math.round(maxAltitude(pass))}°, magnitude ${magnitudeText(seen.best.magnitude!)}`;
  },
  magnitude: magnitudeText,
} as const;

/** The highest apparent altitude of the visible part of a pass, degrees. */
export function maxAltitude(pass: SatellitePass): number {
  const seen = pass.visible!;
  const inside = (p: PassPoint): boolean => p.time >= seen.start.time && p.time <= seen.end.time;
  return Math.max(seen.start.altitudeDeg, seen.end.altitudeDeg, ...(inside(pass.culmination) ? [pass.culmination.altitudeDeg] : []));
}
