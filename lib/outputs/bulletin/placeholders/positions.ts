/** Where and how bright: a body's compass direction and altitude at a moment, and its magnitude. */
import type { ElementContent } from 'hast';
import type { Body } from '../../../core/body.ts';
import { compass, fists } from '../../../core/describe.ts';
import type { EventTime } from '../../../core/events.ts';
import { addDays, formatInstant, zonedTime } from '../../../core/time.ts';
import type { Visibility } from '../../../models/visibility.ts';
import type { ClockTime } from '../attributes.ts';
import { el, exact } from '../format.ts';
import { BODY, DIGITS, NIGHT, bodyOf, classes, digitsOf, missingElement, missingText, nightDate, notVisible, showsBody, wordsOf, type PlaceholderCall, type PlaceholderSpec } from './call.ts';
import { RISE_PHRASES, SET_PHRASES, TRANSIT_PHRASES, type MissingPhrases } from './phrases.ts';

/** The instant of a moment attribute on the placeholder's night: a rise/transit/set event or a clock time. */
function momentOf(call: PlaceholderCall, body: Body): { event: EventTime; at: string; visibility?: Visibility } {
  const moment = call.attrs.get('at') as string | ClockTime;
  if (moment === 'best') {
    const v = call.week.bodyNight(call.night, body).visibility;
    return { event: v.best ? { time: v.best.time } : { time: null, reason: 'always-below' }, at: 'best', visibility: v };
  }
  if (typeof moment === 'string') {
    const bn = call.week.bodyNight(call.night, body);
    const event = moment === 'rise' ? bn.rise : moment === 'set' ? bn.set : bn.transit;
    return { event, at: moment };
  }
  // Clock times before noon belong to the morning after the evening date.
  const date = moment.hour < 12 ? addDays(nightDate(call), 1) : nightDate(call);
  const label = `${String(moment.hour).padStart(2, '0')}:${String(moment.minute).padStart(2, '0')}`;
  return { event: { time: zonedTime(date, moment.hour, moment.minute, call.site.timeZone) }, at: label };
}

function momentPhrases(at: string): MissingPhrases {
  return at === 'rise' ? RISE_PHRASES : at === 'set' ? SET_PHRASES : TRANSIT_PHRASES;
}

function direction(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const { event, at, visibility } = momentOf(call, body);
  if (visibility && !visibility.best) return notVisible(call, body, visibility, { dataAt: at });
  if (!event.time) return missingElement(call, event.reason, missingText(call, momentPhrases(at), event.reason), { dataBody: body.id, dataAt: at });
  const o = call.week.observe(body, event.time);
  const style = call.attrs.get('style') as string;
  const point = compass(o.azimuthDeg, wordsOf(call));
  let words = style === 'short' ? point.abbreviation : style === 'degrees' ? `${wordsOf(call).number(o.azimuthDeg, 0)}°` : point.word;
  if (typeof call.attrs.get('at') !== 'string' && o.altitudeDeg < 0) words += ' (below the horizon then)';
  return el(
    'data',
    { ...classes(call), value: exact(o.azimuthDeg, 2), dataBody: body.id, dataAt: at, dataAzimuthDeg: exact(o.azimuthDeg, 3), dataAltitudeDeg: exact(o.altitudeDeg, 3), dataTime: formatInstant(event.time, call.site.timeZone) },
    words,
  );
}

function altitude(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const { event, at, visibility } = momentOf(call, body);
  if (visibility && !visibility.best) return notVisible(call, body, visibility, { dataAt: at });
  if (!event.time) return missingElement(call, event.reason, missingText(call, momentPhrases(at), event.reason), { dataBody: body.id, dataAt: at });
  const o = call.week.observe(body, event.time);
  const digits = digitsOf(call, 0);
  const lang = wordsOf(call);
  const deg = `${lang.number(o.altitudeDeg, digits)}°`;
  const words = o.altitudeDeg < 0 ? lang.t('ph.altitude-below', { degrees: deg }) : lang.t('ph.altitude', { degrees: deg, hand: lang.handMeasure(Number(o.altitudeDeg.toFixed(digits))) });
  return el(
    'data',
    { ...classes(call, ...(o.altitudeDeg < 0 ? ['gl-below'] : [])), value: exact(o.altitudeDeg, 2), dataBody: body.id, dataAt: at, dataAltitudeDeg: exact(o.altitudeDeg, 3), dataFists: String(fists(o.altitudeDeg)), dataTime: formatInstant(event.time, call.site.timeZone) },
    words,
  );
}

function magnitude(call: PlaceholderCall): ElementContent {
  const body = bodyOf(call);
  const m = call.week.magnitudes(body);
  const digits = digitsOf(call, 1);
  const band = m.brightest !== Math.min(...m.values) || m.faintest !== Math.max(...m.values) ? { dataBrightest: exact(m.brightest, 2), dataFaintest: exact(m.faintest, 2) } : {};
  if (call.given.has('night')) {
    const v = m.values[call.night]!;
    return el('data', { ...classes(call), value: exact(v, 2), dataBody: body.id, dataNight: nightDate(call), ...band }, wordsOf(call).number(v, digits));
  }
  const first = m.values[0]!;
  const last = m.values[6]!;
  const a = wordsOf(call).number(first, digits);
  const b = wordsOf(call).number(last, digits);
  const lo = Math.min(...m.values);
  const hi = Math.max(...m.values);
  // A range only when the week's change reaches one unit of the last digit shown (rounding alone must not make one).
  const text = hi - lo < 10 ** -digits || a === b ? a : wordsOf(call).t('ph.magnitude-range', { first: a, last: b });
  return el(
    'data',
    { ...classes(call), value: exact(first, 2), dataBody: body.id, dataWeek: call.week.week.id, dataMagnitudeFirst: exact(first, 2), dataMagnitudeLast: exact(last, 2), dataMagnitudeMin: exact(lo, 2), dataMagnitudeMax: exact(hi, 2), ...band },
    text,
  );
}

export const POSITION_PLACEHOLDERS: PlaceholderSpec[] = [
  {
    name: 'direction',
    shows: showsBody,
    form: 'inline',
    slot: true,
    summary: 'compass direction of a body at a moment',
    attributes: {
      body: BODY,
      at: { type: { kind: 'moment', values: ['best', 'rise', 'transit', 'set'] }, required: true, doc: 'the moment (a clock time before 12:00 is the next morning)', need: 'err.need-moment' },
      style: { type: { kind: 'choice', values: ['word', 'short', 'degrees'] }, default: 'word', doc: 'west-southwest, WSW or 247°' },
      night: NIGHT,
    },
    example: ':direction{body=jupiter at=best}',
    render: direction,
  },
  {
    name: 'altitude',
    shows: showsBody,
    form: 'inline',
    slot: true,
    summary: 'height above the horizon in degrees and fists (apparent, with refraction)',
    attributes: {
      body: BODY,
      at: { type: { kind: 'moment', values: ['best', 'transit'] }, required: true, doc: 'the moment (a clock time before 12:00 is the next morning)', need: 'err.need-moment' },
      precision: DIGITS(0),
      night: NIGHT,
    },
    example: ':altitude{body=jupiter at=21:00}',
    render: altitude,
  },
  { name: 'magnitude', form: 'inline', summary: 'expected magnitude: over the week (a range when it changes), or on one night', attributes: { body: BODY, night: { ...NIGHT, default: 'the whole week' }, precision: DIGITS(1) }, example: ':magnitude{body=mars}', shows: showsBody, render: magnitude },
];
