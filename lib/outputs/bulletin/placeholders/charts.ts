/** `::chart`: a finder chart of the body at its best time, or of the whole sky. */
import { firstSentence } from '../../../core/language/index.ts';
import type { ElementContent } from 'hast';
import { placeholderChart } from '../../chart/index.ts';
import { el } from '../format.ts';
import { BODY, NIGHT, bodyOf, classes, nightDate, showsBody, labelOf, wordsOf, type PlaceholderCall, type PlaceholderSpec } from './call.ts';

/** `::chart`: a figure with the finder chart image and a caption, or an honest sentence. */
function chart(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const output = call.charts;
  const visibility = call.week.bodyNight(call.night, body).visibility;
  const r = placeholderChart({
    site: call.site,
    body,
    report: call.week.nights[call.night]!,
    visibility,
    nightIndex: call.night,
    view: call.attrs.get('view') as 'horizon' | 'sky',
    cache: output.cache,
  });
  if (r.kind === 'not-visible') {
    return el('p', { ...classes(call, 'gl-none'), dataReason: visibility.reason ?? 'not-visible' }, wordsOf(call).t('chart.none', { name: labelOf(call, body), reason: r.reason }));
  }
  const c = r.chart;
  const caption = firstSentence(c.alt, wordsOf(call).language);
  return el('figure', { ...classes(call), dataChart: c.key, dataBody: body.id, dataNight: nightDate(call) }, [
    el('img', { src: output.url(c.files.svg), width: c.width, height: c.height, loading: 'lazy', decoding: 'async', alt: c.alt }),
    el('figcaption', {}, caption),
  ]);
}

export const CHART_PLACEHOLDERS: PlaceholderSpec[] = [
  {
    name: 'chart',
    shows: showsBody,
    form: 'block',
    summary: 'a finder chart: the view facing the body at its best time with its track over the week, or the whole sky at the end of nautical twilight',
    attributes: { body: BODY, night: NIGHT, view: { type: { kind: 'choice', values: ['horizon', 'sky'] }, default: 'horizon', doc: 'facing the body, or the whole sky' } },
    example: '::chart{body=jupiter}',
    render: chart,
  },
];
