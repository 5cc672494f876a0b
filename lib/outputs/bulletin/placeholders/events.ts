/** The sky's events: the week's list, one event picked by type, and the name of a body or event. */
import type { ElementContent } from 'hast';
import type { Body } from '../../../core/body.ts';
import { quoted } from '../messages.ts';
import { formatInstant, localDateOf } from '../../../core/time.ts';
import { EVENT_TYPES, OWN_LIST_EVENT_TYPES, hiddenNote, pickEvent, type AlmanacEvent, type AlmanacEventType } from '../../almanac/index.ts';
import { el, exact, formatClock, formatDay } from '../format.ts';
import { bodyPhrase } from '../../../core/language/names/index.ts';
import { BODY, CLOCK, classes, noValue, labelOf, wordsOf, type PlaceholderCall, type PlaceholderSpec } from './call.ts';

/** One almanac event as a list item: time, sentence, visibility note and any caution. */
function eventItem(call: PlaceholderCall, e: AlmanacEvent): ElementContent {
  const zone = call.site.timeZone;
  const children: ElementContent[] = [
    el('time', { dateTime: formatInstant(e.time, zone) }, `${formatDay(localDateOf(e.time, zone), call.site, { weekday: 'short' })} ${formatClock(e.time, call.site, { clock: call.clock, precision: 'minute' })}`),
    { type: 'text', value: ' ' },
    el('span', { className: ['gl-event-text'] }, e.description),
  ];
  const note = hiddenNote(e);
  if (note) children.push({ type: 'text', value: ' ' }, el('span', { className: ['gl-event-note'] }, note));
  if (e.caution) children.push({ type: 'text', value: ' ' }, el('strong', { className: ['gl-caution'] }, e.caution));
  return el('li', { dataType: e.type, dataVisible: String(e.visible), dataBodies: e.bodies.join(' ') }, children);
}

/** `::events`: the week's events for the site. */
function weekEvents(call: PlaceholderCall): ElementContent {
  const order = call.attrs.get('order') as 'time' | 'interest';
  const events = call.events().filter((e) => !OWN_LIST_EVENT_TYPES.has(e.type));
  if (order === 'interest') events.sort((a, b) => b.score - a.score || a.time.getTime() - b.time.getTime());
  if (events.length === 0) return el('p', { ...classes(call, 'gl-none') }, wordsOf(call).t('ph.no-events', { span: call.eventSpan }));
  return el('ul', { ...classes(call), dataOrder: order }, events.map((e) => eventItem(call, e)));
}

/** `:event`: one event of the page's span picked by type (and body), or the event bound by `:::every-event`. */
function oneEvent(call: PlaceholderCall): ElementContent {
  const type = call.attrs.get('type') as AlmanacEventType | undefined;
  const body = call.attrs.get('body') as Body | undefined;
  const e = type === undefined ? (call.event ?? null) : pickEvent(call.events(), { type, ...(body ? { bodies: [body.id] } : {}) });
  const words = wordsOf(call);
  const what = words.t(`event-type.${type ?? 'any'}`);
  const said = body ? words.t('ph.no-event-involving', { type: what, name: labelOf(call, body), span: call.eventSpan }) : words.t('ph.no-event', { type: what, span: call.eventSpan });
  if (!e) return noValue(call, said, { dataType: type ?? '' }, `event=${type ?? '…'}${body ? ` body=${body.id}` : ''}`);
  const zone = call.site.timeZone;
  const data = { ...classes(call), dataType: e.type, dataVisible: String(e.visible) };
  switch (call.attrs.get('show')) {
    case 'date':
      return el('time', { ...data, dateTime: localDateOf(e.time, zone) }, formatDay(localDateOf(e.time, zone), call.site, { weekday: 'long' }));
    case 'separation':
      return e.separationDeg === undefined
        ? noValue(call, words.t('ph.no-separation', { title: e.title }), { dataType: e.type })
        : el('data', { ...data, value: exact(e.separationDeg, 4) }, `${words.number(e.separationDeg, e.separationDeg < 1 ? 1 : 0)}°`);
    case 'sentence':
      return el('span', data, e.description);
    case 'title':
      return el('span', data, e.title);
    default:
      return el('time', { ...data, dateTime: formatInstant(e.time, zone) }, formatClock(e.time, call.site, { clock: call.clock, precision: 'minute' }));
  }
}

/** `:name`: the name of a body, or of the body or event an enclosing section binds. */
function nameOf(call: PlaceholderCall): ElementContent {
  const body = call.attrs.get('body') as Body | undefined;
  if (body) return el('span', { ...classes(call), dataBody: body.id }, body.kind === 'moon' ? bodyPhrase(wordsOf(call).language, body).text : labelOf(call, body));
  const e = call.event!;
  return el('span', { ...classes(call), dataType: e.type }, e.title);
}

export const EVENT_PLACEHOLDERS: PlaceholderSpec[] = [
  {
    name: 'events',
    form: 'block',
    summary: "the week's events for the site (Moon phases, close approaches, oppositions, showers, eclipses …) with a sentence and a visibility note each; satellite passes are listed by gloaming events and the calendar feed",
    attributes: { order: { type: { kind: 'choice', values: ['time', 'interest'] }, default: 'time', doc: 'in time order, or most interesting first' }, clock: CLOCK },
    example: '::events{order=interest}',
    render: weekEvents,
  },
  {
    name: 'event',
    form: 'inline',
    summary: "one event of the week (or around a one-off's date), found by type (and body), or the event of an enclosing :::every-event: its time, date, separation, sentence or title",
    slot: true,
    attributes: {
      type: { type: { kind: 'choice', values: EVENT_TYPES }, required: true, bound: 'event', doc: 'the event type', need: 'err.need-event-type' },
      body: { ...BODY, required: false, doc: 'a body the event must involve' },
      show: { type: { kind: 'choice', values: ['time', 'date', 'separation', 'sentence', 'title'] }, default: 'time', doc: 'what to show' },
      clock: CLOCK,
    },
    example: ':event{type=full-moon show=date}',
    render: oneEvent,
  },
  {
    name: 'name',
    form: 'inline',
    summary: 'the name of a body, or of the body or event an enclosing :::every-target or :::every-event is about',
    attributes: { body: { ...BODY, required: false } },
    example: ':name{body=moon}',
    validate: (attrs, bound, words) => {
      if (!attrs.has('body') && !bound.body && !bound.event) {
        throw words.error('invalid-placeholder', words.say('err.name-nothing', { placeholder: quoted(':name') }), {
          place: { field: 'body' },
          hint: words.say('err.name-where', { body: 'body=…', targets: ':::every-target', events: ':::every-event' }),
        });
      }
    },
    render: nameOf,
  },
];
