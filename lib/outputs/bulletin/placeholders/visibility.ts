/** What a reader can see: best time, viewing window, verdict, where to look, and the night's targets. */
import type { ElementContent, Properties } from 'hast';
import { compass } from '../../../core/describe.ts';
import { bodyPhrase } from '../../../core/language/names/index.ts';
import { guideBeyondPlace, guidePhrase } from '../../../models/stars/guide.ts';
import { formatInstant } from '../../../core/time.ts';
import type { BodyNight } from '../../../models/night.ts';
import type { InstrumentKind } from '../../../core/site.ts';
import { reasonText, verdictWords, windowEndText, type Visibility } from '../../../models/visibility.ts';
import type { AttributeSpec } from '../attributes.ts';
import { el, exact, formatClock } from '../format.ts';
import { BODY, NIGHT, TIME_ATTRS, bodyOf, classes, nightDate, noValue, notVisible, precisionOf, showsBody, timeElement, labelOf, wordsOf, type PlaceholderCall, type PlaceholderSpec } from './call.ts';

function visibilityData(v: Visibility): Properties {
  return {
    dataVerdict: v.verdict,
    ...(v.best ? { dataMargin: exact(v.best.margin, 2), dataRequiredMargin: exact(v.best.requiredMargin, 2), dataAltitudeDeg: exact(v.best.altitudeDeg, 3), dataAzimuthDeg: exact(v.best.azimuthDeg, 3) } : {}),
    ...(v.outsideViewingHours ? { dataOutsideViewingHours: 'true' } : {}),
  };
}

function bestTime(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const v = call.week.bodyNight(call.night, body).visibility;
  if (!v.best) return notVisible(call, body, v);
  const time = timeElement(call, v.best.time, { dataBody: body.id, ...visibilityData(v) });
  // A morning object: say so, so a reader does not plan on it during the evening viewing hours.
  if (!v.outsideViewingHours) return time;
  return el('span', { className: ['gl-after-hours'] }, [time, { type: 'text', value: ` ${wordsOf(call).t('ph.after-hours')}` }]);
}

function viewingWindow(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const v = call.week.bodyNight(call.night, body).visibility;
  if (!v.window) return notVisible(call, body, v);
  const zone = call.site.timeZone;
  const format = { clock: call.clock, precision: precisionOf(call) };
  // An optics window cut short for safety says so, so nobody keeps sweeping towards the rising Sun.
  const why: ElementContent[] = v.window.endReason === 'optics-safety' ? [{ type: 'text', value: wordsOf(call).t('window.when', { why: windowEndText('optics-safety', wordsOf(call)) }) }] : [];
  return el('span', { ...classes(call), dataNight: nightDate(call), dataBody: body.id, dataEndReason: v.window.endReason, ...visibilityData(v) }, [
    el('time', { dateTime: formatInstant(v.window.start, zone) }, formatClock(v.window.start, call.site, format)),
    { type: 'text', value: '\u2013' },
    el('time', { dateTime: formatInstant(v.window.end, zone) }, formatClock(v.window.end, call.site, format)),
    ...why,
  ]);
}

function verdict(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const v = call.week.bodyNight(call.night, body).visibility;
  const lang = wordsOf(call);
  const gender = bodyPhrase(lang.language, body).gender;
  const words =
    v.verdict === 'not-visible' ? lang.t('verdict.not-visible', { reason: reasonText(v.reason ?? 'too-faint', call.site, lang, gender), gender }) : verdictWords(v.verdict, lang, gender);
  return el('data', { ...classes(call), value: v.verdict, dataNight: nightDate(call), dataBody: body.id, ...(v.reason ? { dataReason: v.reason } : {}), ...visibilityData(v) }, words);
}

function guide(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const g = call.week.bodyNight(call.night, body).guide;
  if (!g) return noValue(call, wordsOf(call).t('ph.guide-below', { name: labelOf(call, body) }), { dataBody: body.id });
  // omit=place: the sentence already gives the altitude and direction, so a guide from the horizon says only where the Sun set or will rise.
  const phrase = call.attrs.get('omit') === 'place' ? guideBeyondPlace(g.said, wordsOf(call)) : guidePhrase(g.said, wordsOf(call));
  if (phrase === null) return noValue(call, wordsOf(call).t('ph.guide-horizon-only', { name: labelOf(call, body) }), { dataBody: body.id, dataGuide: g.kind });
  return el(
    'span',
    { ...classes(call), dataNight: nightDate(call), dataBody: body.id, dataGuide: g.kind, ...(g.pattern ? { dataPattern: g.pattern.id } : {}), ...(g.separationDeg !== null ? { dataSeparationDeg: exact(g.separationDeg, 2) } : {}), ...(g.offsetDirection ? { dataOffset: g.offsetDirection } : {}), ...(g.nearestStar ? { dataNearestStar: g.nearestStar.name } : {}) },
    phrase,
  );
}

/** The naked-eye and binocular targets of the night, by best time. Bodies come from the week's registry. */
function targetNights(call: PlaceholderCall): BodyNight[] {
  return call.week.bodies
    .ids()
    .filter((id) => id !== 'sun')
    .map((id) => call.week.bodyNight(call.night, call.week.bodies.get(id)))
    .filter((bn) => bn.visibility.best && (bn.visibility.verdict === 'naked-eye' || bn.visibility.verdict === 'binoculars'))
    .sort((a, b) => a.visibility.best!.time.getTime() - b.visibility.best!.time.getTime() || (a.body.id < b.body.id ? -1 : 1));
}

/**
 * One target of a list, as `<li>`: its name (and what it is, `kind`), best time, direction, altitude,
 * magnitude, nearby pattern and verdict. Shared by the night's targets and the deep-sky list.
 */
export function targetItem(call: PlaceholderCall, bn: BodyNight, kind?: string): ElementContent {
  const zone = call.site.timeZone;
  const format = { clock: call.clock, precision: precisionOf(call) };
  const words = wordsOf(call);
  const v = bn.visibility;
  const best = v.best!;
  // The item gives the direction and altitude itself: the guide adds only what they do not say.
  const guide = bn.guide ? guideBeyondPlace(bn.guide.said, words) : null;
  return el('li', { dataBody: bn.body.id, ...visibilityData(v) }, [
    el('strong', {}, labelOf(call, bn.body)),
    { type: 'text', value: `${kind ? `, ${kind}` : ''}${words.t('ph.target-best-at')} ` },
    el('time', { dateTime: formatInstant(best.time, zone) }, formatClock(best.time, call.site, format)),
    { type: 'text', value: `${words.t('ph.target-where', { direction: compass(best.azimuthDeg, words).word, degrees: words.number(best.altitudeDeg, 0), hand: words.handMeasure(Math.round(best.altitudeDeg)) })} ` },
    el('data', { value: exact(best.magnitude, 2) }, words.number(best.magnitude, 1)),
    { type: 'text', value: `${guide ? `, ${guide}` : ''} \u2014 ${verdictWords(v.verdict as InstrumentKind, words, bodyPhrase(words.language, bn.body).gender)}${v.outsideViewingHours ? ` ${words.t('verdict.outside-hours')}` : ''}` },
  ]);
}

/** Every naked-eye or binocular target of the night, by best time. */
function targets(call: PlaceholderCall): ElementContent {
  const rows = targetNights(call);
  if (rows.length === 0) {
    return el('p', { ...classes(call, 'gl-none'), dataNight: nightDate(call) }, wordsOf(call).t('ph.no-targets'));
  }
  const items = rows.map((bn) => targetItem(call, bn));
  return el('ul', { ...classes(call), dataNight: nightDate(call) }, items);
}

/** `:guide{omit=place}`: the sentence already says the altitude and direction (`:altitude`, `:direction`). */
const OMIT_PLACE: AttributeSpec = {
  type: { kind: 'choice', values: ['place'] },
  doc: 'place: the sentence already gives the altitude and direction, so a guide from the horizon says only where the Sun set or will rise, and has no value when that is all it has',
};

export const VISIBILITY_PLACEHOLDERS: PlaceholderSpec[] = [
  { name: 'best-time', form: 'inline', slot: true, summary: 'best viewing time: largest visibility margin within the viewing hours (lib/models/visibility.ts)', attributes: { body: BODY, ...TIME_ATTRS }, example: ':best-time{body=jupiter}', shows: showsBody, render: bestTime },
  { name: 'window', form: 'inline', slot: true, summary: 'viewing window: the span around the best time where the body stays visible', attributes: { body: BODY, ...TIME_ATTRS }, example: ':window{body=jupiter}', shows: showsBody, render: viewingWindow },
  { name: 'verdict', form: 'inline', summary: 'naked eye, binoculars, telescope or not visible, with the reason', attributes: { body: BODY, night: NIGHT }, example: ':verdict{body=saturn}', shows: showsBody, render: verdict },
  { name: 'guide', form: 'inline', slot: true, summary: 'where to look, at the best time (or transit): from a nearby star pattern, a bright star, the Moon or a bright planet, or else the horizon and where the Sun set', attributes: { body: BODY, night: NIGHT, omit: OMIT_PLACE }, example: ':guide{body=jupiter}', shows: showsBody, render: guide },
  { name: 'targets', form: 'block', summary: 'every naked-eye or binocular target of the night, by best time, with direction, altitude, magnitude and nearby pattern', attributes: { ...TIME_ATTRS }, example: '::targets{night=fri}', shows: (call) => targetNights(call).map((bn) => bn.body), render: targets },
];
