/** Dates and times of a night: the week, a date, sunset and sunrise, twilight, and a body's rise, transit and set. */
import type { ElementContent } from 'hast';
import { el, formatDay, formatDayRange } from '../format.ts';
import { BODY, NIGHT, TIME_ATTRS, TWILIGHT, bodyOf, classes, eventElement, nightDate, showsBody, type PlaceholderCall, type PlaceholderSpec } from './call.ts';
import { RISE_PHRASES, SET_PHRASES, SUN_PHRASES, TRANSIT_PHRASES, type TwilightKind } from './phrases.ts';


function sunTime(field: 'set' | 'rise') {
  return (call: PlaceholderCall): ElementContent => eventElement(call, call.week.nights[call.night]!.sun[field], SUN_PHRASES);
}

function twilight(edge: 'dusk' | 'dawn') {
  return (call: PlaceholderCall): ElementContent => {
    const kind = call.attrs.get('kind') as TwilightKind;
    const sun = call.week.nights[call.night]!.sun;
    const key = `${kind}${edge === 'dusk' ? 'Dusk' : 'Dawn'}` as const;
    return eventElement(call, sun[key], kind, { dataTwilight: kind });
  };
}

function bodyEvent(field: 'rise' | 'transit' | 'set') {
  const phrases = field === 'rise' ? RISE_PHRASES : field === 'set' ? SET_PHRASES : TRANSIT_PHRASES;
  return (call: PlaceholderCall): ElementContent => {
    const body = bodyOf(call);
    const event = call.week.bodyNight(call.night, body)[field];
    return eventElement(call, event, phrases, { dataBody: body.id });
  };
}

function dateOf(call: PlaceholderCall): ElementContent {
  const date = nightDate(call);
  const weekday = call.attrs.get('style') === 'short' ? 'short' : 'long';
  return el('time', { ...classes(call), dateTime: date }, formatDay(date, call.site, { weekday }));
}

function weekOf(call: PlaceholderCall): ElementContent {
  const days = call.week.week.days;
  return el('time', { ...classes(call), dateTime: call.week.week.id }, formatDayRange(days[0]!, days[6]!, call.site));
}

export const TIME_PLACEHOLDERS: PlaceholderSpec[] = [
  { name: 'week', form: 'inline', summary: "the page's week as a date range", attributes: {}, example: ':week', render: weekOf },
  { name: 'date', form: 'inline', summary: 'the date of a night of the week', attributes: { night: NIGHT, style: { type: { kind: 'choice', values: ['long', 'short'] }, default: 'long', doc: 'weekday and month written out or abbreviated' } }, example: ':date{night=fri}', render: dateOf },
  { name: 'sunset', form: 'inline', slot: true, summary: 'sunset (upper limb on the horizon, standard refraction)', attributes: TIME_ATTRS, example: ':sunset{night=sat}', render: sunTime('set') },
  { name: 'sunrise', form: 'inline', slot: true, summary: 'sunrise the morning after the night', attributes: TIME_ATTRS, example: ':sunrise', render: sunTime('rise') },
  { name: 'dark', form: 'inline', slot: true, summary: 'end of evening twilight (Sun 6°, 12° or 18° below the horizon)', attributes: { kind: TWILIGHT, ...TIME_ATTRS }, example: ':dark{kind=nautical}', render: twilight('dusk') },
  { name: 'dawn', form: 'inline', slot: true, summary: 'start of morning twilight', attributes: { kind: TWILIGHT, ...TIME_ATTRS }, example: ':dawn', render: twilight('dawn') },
  { name: 'rise', form: 'inline', slot: true, summary: 'rise time of a body (or an honest phrase when it does not rise)', attributes: { body: BODY, ...TIME_ATTRS }, example: ':rise{body=jupiter}', shows: showsBody, render: bodyEvent('rise') },
  { name: 'transit', form: 'inline', slot: true, summary: 'time a body crosses the meridian, highest in the sky', attributes: { body: BODY, ...TIME_ATTRS }, example: ':transit{body=saturn}', shows: showsBody, render: bodyEvent('transit') },
  { name: 'set', form: 'inline', slot: true, summary: 'set time of a body', attributes: { body: BODY, ...TIME_ATTRS }, example: ':set{body=moon night=3}', shows: showsBody, render: bodyEvent('set') },
];
