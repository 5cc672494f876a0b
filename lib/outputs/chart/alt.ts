/**
 * Alt text for charts, written from the same computed values the chart was drawn from (the
 * target's apparent altitude and azimuth, the guide phrase of lib/models/stars/guide.ts, the bodies in
 * view), so the words and the picture always agree. Times are in the site's zone and locale.
 *
 *   "Looking west-northwest at 21:40: Jupiter 18° up, about 3° (about 2 fingers) above Regulus,
 *    in the Sickle of Leo. Also in view: the Moon, Saturn."
 */
import type { ChartMark, HorizonChart } from './horizon.ts';
import { passAltSentence } from './pass.ts';
import type { WholeSkyChart } from './whole-sky.ts';
import { guideBeyondPlace } from '../../models/stars/guide.ts';
import type { Words } from '../../core/language/index.ts';
import { bodyPhrase } from '../../core/language/names/index.ts';
import { chartLabel, chartWords, formatChartTime } from './words.ts';

/** A body as a sentence names it ("the Moon", "la Luna", "Júpiter"). */
function bodyName(mark: ChartMark, words: Words): string {
  return mark.kind === 'moon' ? bodyPhrase(words.language, { id: 'moon', name: mark.label }).text : mark.label;
}

/** Alt text of a horizon-view finder chart, in the language of the chart's site. */
export function horizonAltText(chart: HorizonChart): string {
  const words = chartWords(chart.site);
  const clock = formatChartTime(chart.time, chart.site);
  const target = chartLabel(chart.body, chart.site);
  const degrees = Math.round(chart.target.altitudeDeg);
  // The sentence gives the direction faced and the altitude: the guide adds only what they do not say.
  const beyond = chart.guide ? guideBeyondPlace(chart.guide.said, words) : null;
  const guide = beyond ? `, ${beyond}` : '';
  const direction = words.compass(chart.facing.azimuthDeg).word;
  let out = words.t(chart.view === 'overhead' ? 'chart.looking-up' : 'chart.looking', { direction, clock, target, degrees, guide });
  const others = chart.marks.filter((m) => m.kind === 'moon' || m.kind === 'planet').map((m) => bodyName(m, words));
  if (others.length) out += ` ${words.t('chart.also-in-view', { names: words.list(others) })}`;
  const track = chart.marks.filter((m) => m.kind === 'track');
  if (track.length) out += ` ${words.t('chart.track', { first: track[0]!.label, last: track[track.length - 1]!.label })}`;
  return out;
}

/** Alt text of a whole-sky chart, in the language of the chart's site. */
export function wholeSkyAltText(chart: WholeSkyChart): string {
  const words = chartWords(chart.site);
  const clock = formatChartTime(chart.time, chart.site);
  const up = chart.marks.filter((m) => m.kind !== 'star' && m.kind !== 'track' && m.kind !== 'pass');
  const phrases = up.map((m) =>
    words.t('chart.whole-sky-body', { name: m.kind === 'target' ? chartLabel(chart.body!, chart.site) : bodyName(m, words), degrees: Math.round(m.altitudeDeg), direction: words.compass(m.azimuthDeg).word }),
  );
  let out = words.t('chart.whole-sky', { site: chart.site.name, clock });
  if (chart.pass) {
    out += `. ${passAltSentence(chart.pass, chart.site)}`;
    out += phrases.length ? ` ${words.t('chart.also-in-view', { names: phrases.join('; ') })}` : '';
    return out;
  }
  out += phrases.length ? `: ${phrases.join('; ')}.` : '.';
  if (chart.body && chart.target && !up.some((m) => m.kind === 'target')) out += ` ${words.t('chart.not-above-skyline', { name: chartLabel(chart.body, chart.site) })}`;
  else if (chart.guide && chart.body) {
    // Each body's altitude and direction are listed above: the guide adds only what they do not say.
    const beyond = guideBeyondPlace(chart.guide.said, words);
    if (beyond) out += ` ${words.t('chart.is-where', { name: chartLabel(chart.body, chart.site), guide: beyond })}`;
  }
  return out;
}
