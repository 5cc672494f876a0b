/**
 * Alt text for charts, written from the same computed values the chart was drawn from (the
 * target's apparent altitude and azimuth, the guide phrase of lib/models/stars/guide.ts, the bodies in
 * view), so the words and the picture always agree. Times are in the site's zone and locale.
 *
 *   "Looking west-northwest at 21:40: Jupiter 18° up, about 3° (about 2 fingers) above Regulus,
 *    in the Sickle of Leo. Also in view: the Moon, Saturn."
 */
import { compass } from '../../core/describe.ts';
import type { ChartMark, HorizonChart } from './horizon.ts';
import type { WholeSkyChart } from './whole-sky.ts';
import { chartLabel, formatChartTime } from './words.ts';

function bodyName(mark: ChartMark): string {
  return mark.kind === 'moon' ? 'the Moon' : mark.label;
}

function list(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items[items.length - 1]}`;
}

/** Alt text of a horizon-view finder chart. */
export function horizonAltText(chart: HorizonChart): string {
  const clock = formatChartTime(chart.time, chart.site);
  const alt = Math.round(chart.target.altitudeDeg);
  const where = chart.guide ? `, ${chart.guide.phrase}` : '';
  const looking = chart.view === 'overhead' ? `Looking up, facing ${chart.facing.word},` : `Looking ${chart.facing.word}`;
  let out = `${looking} at ${clock}: ${chartLabel(chart.body)} ${alt}° up${where}.`;
  const others = chart.marks.filter((m) => m.kind === 'moon' || m.kind === 'planet').map(bodyName);
  if (others.length) out += ` Also in view: ${list(others)}.`;
  const track = chart.marks.filter((m) => m.kind === 'track');
  if (track.length) out += ` Dots show it on other nights from ${track[0]!.label} to ${track[track.length - 1]!.label}, with the stars as drawn.`;
  return out;
}

/** Alt text of a whole-sky chart. */
export function wholeSkyAltText(chart: WholeSkyChart): string {
  const clock = formatChartTime(chart.time, chart.site);
  const up = chart.marks.filter((m) => m.kind !== 'star' && m.kind !== 'track');
  const phrases = up.map((m) => `${m.kind === 'target' ? chartLabel(chart.body!) : bodyName(m)} ${Math.round(m.altitudeDeg)}° up in the ${compass(m.azimuthDeg).word}`);
  let out = `The whole sky from ${chart.site.name} at ${clock}, north at the top and east at the left`;
  out += phrases.length ? `: ${phrases.join('; ')}.` : '.';
  if (chart.body && chart.target && !up.some((m) => m.kind === 'target')) out += ` ${chartLabel(chart.body)} is not above the skyline at this time.`;
  else if (chart.guide && chart.body) out += ` ${chartLabel(chart.body)} is ${chart.guide.phrase}.`;
  return out;
}
