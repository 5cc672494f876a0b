/**
 * The charts' look: palette, sizes and the rule for how faint the plotted stars go. Gloaming's
 * own design. Marks use the Okabe–Ito colour-blind-safe palette (Okabe M. & Ito K. 2008, "Color
 * Universal Design — How to make figures and presentations that are friendly to colorblind
 * people", J*Fly), and every kind of mark also differs in shape, so colour is never the only cue.
 *
 * Sizes are in SVG user units. Charts are drawn 390 units wide, so one unit is one CSS pixel when
 * a chart is shown 390 px wide on a phone: text of 12 units or more stays at least 12 CSS px there.
 */
import type { SkyQuality } from '../../core/site.ts';
import { darkSkyFromQuality, nelmFromSkyBrightness } from '../../models/sky/quality.ts';

/** Okabe–Ito colours (hex values as published by Okabe & Ito 2008). */
export const OKABE_ITO = {
  orange: '#E69F00',
  skyBlue: '#56B4E9',
  bluishGreen: '#009E73',
  yellow: '#F0E442',
  blue: '#0072B2',
  vermillion: '#D55E00',
  reddishPurple: '#CC79A7',
} as const;

/** Colours of each kind of mark. */
export const COLOURS = {
  sky: '#0A1224',
  skyEdge: '#16223D',
  ground: '#1B1A14',
  groundEdge: '#6B6450',
  grid: '#5B6B8C',
  star: '#F4F1E8',
  text: '#E8E6DF',
  dimText: '#B9C0CF',
  target: OKABE_ITO.yellow,
  planet: OKABE_ITO.skyBlue,
  moon: '#E9E4D4',
  guide: OKABE_ITO.orange,
  otherPattern: '#3E4C6E',
  tail: OKABE_ITO.bluishGreen,
  track: OKABE_ITO.reddishPurple,
  compass: '#F2D6A2',
  sun: OKABE_ITO.vermillion,
} as const;

/** Stars fainter than this (V) are soft obstacles for labels: avoided where possible, covered when not. */
export const FAINT_STAR_MAG = 3;

/** Chart width in user units: 1 unit = 1 CSS px at a 390 px wide phone layout. */
export const CHART_WIDTH = 390;
/** Smallest font size used on a chart, user units (= CSS px at 390 px width). */
export const MIN_FONT = 12;
/** Font sizes by role, user units. */
export const FONT = { small: 12, label: 13, target: 15, compass: 14 } as const;
export const FONT_FAMILY = "'Atkinson Hyperlegible', 'DejaVu Sans', system-ui, sans-serif";

/** Faintest and brightest magnitude limits a chart will use. */
export const CHART_LIMIT_RANGE = { brightest: 3.0, faintest: 5.0 } as const;

/**
 * How faint a chart's stars go for a site's sky (V magnitude). Gloaming's own rule: the site's
 * zenith naked-eye limiting magnitude (from its sky quality: `darkSkyFromQuality`, then
 * `nelmFromSkyBrightness`, Schaefer's threshold model in lib/models/sky) minus 0.3 (stars at the limit
 * are hard to pick out away from the zenith and in late twilight), rounded to the nearest half
 * magnitude and kept within 3.0–5.0 (brighter than 3 a chart loses its patterns; fainter than 5
 * the dots clutter a phone screen). Bortle 7 city sky → 3.5; Bortle 6 → 4.0; Bortle 5 → 5.0; Bortle 2 → 5.0.
 * Stars of a drawn pattern are always shown, whatever the limit.
 */
export function chartMagnitudeLimit(sky: SkyQuality): number {
  const nelm = nelmFromSkyBrightness(darkSkyFromQuality(sky).zenithMagPerArcsec2);
  const stepped = Math.round((nelm - 0.3) * 2) / 2;
  return Math.min(CHART_LIMIT_RANGE.faintest, Math.max(CHART_LIMIT_RANGE.brightest, stepped));
}

/** Radius of a star's dot, user units, from its V magnitude: 2.9 − 0.45 V, kept within 0.7–3.8. */
export function starRadius(vMag: number): number {
  return Math.min(3.8, Math.max(0.7, 2.9 - 0.45 * vMag));
}
