/**
 * Sections: container directives that decide what a page says, written
 *
 * ```markdown
 * :::provided{seen=either body=jupiter}
 * Jupiter is best at :best-time{body=jupiter}.
 * ::otherwise
 * Jupiter is :verdict{body=jupiter}.
 * :::
 * ```
 *
 * `:::provided{…}` shows its block when one condition holds and the part after `::otherwise`
 * (if any) when it does not. `:::every-target{…}` repeats its block for each target of the night,
 * `:::every-event{…}` for each event of the page; inside, the target or event is bound, and every
 * placeholder that is about a body or an event picks it up when it does not name one (one
 * mechanism: the binding is a scope the placeholders read). `::otherwise` in a repeated section is
 * shown when there is nothing to repeat. Sections nest (the outer one takes more colons).
 *
 * Like the placeholder table, this is one registry: a section's name, its attributes, and what it
 * decides from the shared week data.
 */
import type { Body } from '../../core/body.ts';
import { authorWords, quoted, type AuthorWords } from './messages.ts';
import { EVENT_TYPES, OWN_LIST_EVENT_TYPES, pickEvent, type AlmanacEvent, type AlmanacEventType } from '../almanac/index.ts';
import { moonOutshinesTwilight, viewingSpan } from '../../models/visibility.ts';
import { moonInterferes, type WeekData } from '../../models/week.ts';
import { addDays, formatLocalDate, zonedParts, zonedTime } from '../../core/time.ts';
import type { AttributeSpec, AttributeValue, ClockTime } from './attributes.ts';
import { PLACEHOLDERS, type PlaceholderSpec } from './placeholders/registry.ts';

/** What an enclosing section binds for the placeholders inside it. */
export interface Binding {
  body?: Body;
  event?: AlmanacEvent;
  /** The night (0–6 of the page's week) placeholders default to. */
  night?: number;
}

/** What a section's decision gets: its typed attributes, the week and the enclosing binding. */
export interface SectionCall {
  name: string;
  week: WeekData;
  /** The night (0–6) the section is about. */
  night: number;
  attrs: ReadonlyMap<string, AttributeValue>;
  /** What enclosing sections bind (the event of `:::every-event`, for `moon=interferes`). */
  bound: Binding;
  /** The page's events (the week's, or around a one-off's date). */
  events(): AlmanacEvent[];
  /** Whether the value placeholder `spec` with `attrs` has a value here (prints no `–`). */
  hasValue(spec: PlaceholderSpec, attrs: ReadonlyMap<string, AttributeValue>): boolean;
}

export type SectionDecision = { kind: 'choose'; show: boolean } | { kind: 'repeat'; items: Binding[] };

export interface SectionSpec {
  name: string;
  summary: string;
  example: string;
  /** What the section binds inside its block. */
  binds?: 'body' | 'event';
  /** Every attribute, for the docs table. */
  attributes: Readonly<Record<string, AttributeSpec>>;
  /** The attributes that apply for what was written (`:::provided` depends on its condition); throws a placeless error. */
  attributesFor(written: Readonly<Record<string, string | null | undefined>>, words: AuthorWords): Readonly<Record<string, AttributeSpec>>;
  decide(call: SectionCall): SectionDecision;
}

// ---------------------------------------------------------------------------------------------
// Attributes

const NIGHT: AttributeSpec = { type: { kind: 'night' }, default: 'Monday, the one-off date, or the night of the enclosing section', doc: 'which night of the week' };
const BODY: AttributeSpec = { type: { kind: 'body' }, required: true, bound: 'body', doc: 'the body or object', need: 'err.need-body' };
const SEEN: AttributeSpec = {
  type: { kind: 'choice', values: ['naked-eye', 'binoculars', 'either'] },
  doc: 'visible to the naked eye, only in binoculars, or either (lib/models/visibility.ts verdict within the viewing hours or later that night)',
};

/** Value placeholders `has=` can test. */
const SLOT_NAMES = [...PLACEHOLDERS.values()].filter((p) => p.slot).map((p) => p.name);

const CONDITIONS: Record<string, { doc: string; attributes: (written: Readonly<Record<string, string | null | undefined>>) => Record<string, AttributeSpec> }> = {
  seen: { doc: 'the body is visible this night', attributes: () => ({ seen: { ...SEEN, default: undefined }, body: BODY, night: NIGHT }) },
  up: {
    doc: 'the body stands above the horizon (apparent altitude > 0°) at a moment',
    attributes: () => ({ up: { type: { kind: 'moment', values: ['best', 'transit'] }, doc: 'the moment (a clock time before 12:00 is the next morning)' }, body: BODY, night: NIGHT }),
  },
  first: {
    doc: "the body both rises and sets this night (noon to noon), rise first (first=rise) or set first (first=set): a sentence naming both can put them in the order they happen",
    attributes: () => ({ first: { type: { kind: 'choice', values: ['rise', 'set'] }, doc: 'rise or set' }, body: BODY, night: NIGHT }),
  },
  has: {
    doc: 'a value placeholder (written with its own attributes) has a value here, so it will not print –',
    attributes: (written) => {
      const spec = PLACEHOLDERS.get(String(written.has ?? ''));
      return { has: { type: { kind: 'choice', values: SLOT_NAMES }, doc: 'a value placeholder' }, ...(spec?.slot ? spec.attributes : {}) };
    },
  },
  event: {
    doc: "the page's events (the week's, or ±3 nights around a one-off's date) include one of this type (involving the body, if given)",
    attributes: () => ({ event: { type: { kind: 'choice', values: EVENT_TYPES }, doc: 'an event type' }, body: { ...BODY, required: false } }),
  },
  moon: {
    doc: 'moonlight interferes: with a body, it at least doubles the sky brightness at the body at its best moment (or washes it out); inside :::every-event for a meteor shower, it cuts the best hourly count by more than a third; otherwise, the Moon is at least half lit, and for at least half an hour of the viewing hours it is up and lights the sky overhead at least as much as the twilight (not in a sky still bright from the Sun)',
    attributes: () => ({ moon: { type: { kind: 'choice', values: ['interferes'] }, doc: 'interferes' }, body: { ...BODY, required: false }, night: NIGHT }),
  },
};

// ---------------------------------------------------------------------------------------------
// Decisions

function bodyAttr(call: SectionCall): Body {
  return call.attrs.get('body') as Body;
}

function seen(call: SectionCall, body: Body, which: string): boolean {
  const verdict = call.week.bodyNight(call.night, body).visibility.verdict;
  return which === 'either' ? verdict === 'naked-eye' || verdict === 'binoculars' : verdict === which;
}

function up(call: SectionCall): boolean {
  const body = bodyAttr(call);
  const moment = call.attrs.get('up') as string | ClockTime;
  const bn = call.week.bodyNight(call.night, body);
  let time: Date | null;
  if (moment === 'best') time = bn.visibility.best?.time ?? null;
  else if (moment === 'transit') time = bn.transit.time;
  else {
    const { hour, minute } = moment as ClockTime;
    const date = call.week.week.days[call.night]!;
    time = zonedTime(hour < 12 ? addDays(date, 1) : date, hour, minute, call.week.site.timeZone);
  }
  return time !== null && call.week.observe(body, time).altitudeDeg > 0;
}

/** Whether the body's rise and set both happen this night with the one named by `first=` first. */
function first(call: SectionCall): boolean {
  const bn = call.week.bodyNight(call.night, bodyAttr(call));
  const rise = bn.rise.time;
  const set = bn.set.time;
  if (!rise || !set) return false;
  return call.attrs.get('first') === 'rise' ? rise < set : set < rise;
}

/** Sampling step over the viewing hours for moonlight, days (10 minutes). */
const MOONLIGHT_STEP_DAYS = 10 / 1440;
/** Moonlight counts when it lasts at least this long in the viewing hours, days (30 minutes; this project's choice). */
const MOONLIGHT_MIN_DAYS = 30 / 1440;

/**
 * Moonlight without a body: the Moon at least half lit, and for at least half an hour of the
 * viewing hours (sampled every 10 minutes) up and lighting the sky overhead at least as much as
 * the twilight (`moonOutshinesTwilight`): a half Moon in the dark end of the evening counts, a
 * Moon in the midnight Sun's bright sky does not.
 */
function moonBright(call: SectionCall): boolean {
  const report = call.week.nights[call.night]!;
  if (report.moon.phase.illuminatedFraction < 0.5) return false;
  const { ut0, ut1 } = viewingSpan(report);
  let samples = 0;
  for (let ut = ut0; ut <= ut1; ut += MOONLIGHT_STEP_DAYS) if (moonOutshinesTwilight(report, ut)) samples++;
  return samples >= Math.round(MOONLIGHT_MIN_DAYS / MOONLIGHT_STEP_DAYS);
}

function moon(call: SectionCall): boolean {
  const event = call.bound.event;
  const body = call.attrs.get('body') as Body | undefined;
  if (body) return moonInterferes(call.week.bodyNight(call.night, body).visibility);
  if (event?.shower) return event.shower.moonInterferes;
  return moonBright(call);
}

/** Which condition of `:::provided` was written; throws when none or several (in the template's language, `words`). */
export function conditionOf(written: Readonly<Record<string, unknown>>, words: AuthorWords = authorWords()): string {
  const given = Object.keys(CONDITIONS).filter((c) => c in written);
  if (given.length === 1) return given[0]!;
  const expected = words.oneOf(Object.keys(CONDITIONS));
  const section = quoted(':::provided');
  if (given.length === 0) throw words.error('invalid-placeholder', words.say('err.needs-condition', { section }), { expected, hint: words.say('err.for-example', { example: ':::provided{seen=either body=jupiter}' }) });
  throw words.error('invalid-placeholder', words.say('err.one-condition', { section, conditions: words.list(given) }), { expected, hint: words.say('err.two-conditions') });
}

function provided(call: SectionCall): boolean {
  const which = conditionOf(Object.fromEntries(call.attrs));
  switch (which) {
    case 'seen':
      return seen(call, bodyAttr(call), call.attrs.get('seen') as string);
    case 'up':
      return up(call);
    case 'first':
      return first(call);
    case 'has': {
      const spec = PLACEHOLDERS.get(call.attrs.get('has') as string)!;
      const attrs = new Map(call.attrs);
      attrs.delete('has');
      return call.hasValue(spec, attrs);
    }
    case 'event': {
      const body = call.attrs.get('body') as Body | undefined;
      return pickEvent(call.events(), { type: call.attrs.get('event') as AlmanacEventType, ...(body ? { bodies: [body.id] } : {}) }) !== null;
    }
    default:
      return moon(call);
  }
}

const KINDS = ['planet', 'moon', 'comet', 'asteroid', 'any'] as const;

function targets(call: SectionCall): Binding[] {
  const which = call.attrs.get('seen') as string;
  const kind = call.attrs.get('kind') as (typeof KINDS)[number];
  const reg = call.week.bodies;
  return reg
    .ids()
    .map((id) => reg.get(id))
    .filter((b) => b.kind !== 'sun' && (kind === 'any' || b.kind === kind) && seen(call, b, which))
    .map((b) => ({ body: b, best: call.week.bodyNight(call.night, b).visibility.best!.time.getTime() }))
    .sort((a, b) => a.best - b.best || (a.body.id < b.body.id ? -1 : 1))
    .map(({ body }) => ({ body, night: call.night }));
}

function events(call: SectionCall): Binding[] {
  const type = call.attrs.get('type') as AlmanacEventType | undefined;
  const visible = call.attrs.get('visible') === 'only';
  const list = call.events().filter((e) => (type ? e.type === type : !OWN_LIST_EVENT_TYPES.has(e.type)) && (!visible || e.visible));
  if (call.attrs.get('order') === 'interest') list.sort((a, b) => b.score - a.score || a.time.getTime() - b.time.getTime());
  const limit = call.attrs.get('limit') as number | undefined;
  const zone = call.week.site.timeZone;
  return list.slice(0, limit ?? list.length).map((event) => {
    // The event's night: the local evening it follows (noon to noon), when that night is in the week.
    const local = zonedParts(event.time, zone);
    const date = formatLocalDate(local.year, local.month, local.day);
    const night = call.week.indexOf(local.hour < 12 ? addDays(date, -1) : date);
    return night >= 0 ? { event, night } : { event };
  });
}

// ---------------------------------------------------------------------------------------------
// The table

const PROVIDED_ATTRIBUTES: Record<string, AttributeSpec> = {
  ...Object.fromEntries(
    Object.entries(CONDITIONS).map(([name, c]) => {
      const own = c.attributes({})[name]!;
      return [name, { ...own, doc: c.doc }];
    }),
  ),
  body: { ...BODY, required: false, doc: 'the body the condition is about (default: the target of an enclosing :::every-target)' },
  night: NIGHT,
};

const DEFINITIONS: SectionSpec[] = [
  {
    name: 'provided',
    summary: 'shows its block only when one condition holds, and the part after ::otherwise when it does not',
    example: ':::provided{seen=either body=jupiter}',
    attributes: PROVIDED_ATTRIBUTES,
    attributesFor: (written, words) => CONDITIONS[conditionOf(written, words)]!.attributes(written),
    decide: (call) => ({ kind: 'choose', show: provided(call) }),
  },
  {
    name: 'every-target',
    summary: 'repeats its block for each target of the night, by best time, with the body bound inside; ::otherwise when there is none',
    example: ':::every-target{seen=naked-eye kind=planet}',
    binds: 'body',
    attributes: {
      seen: { ...SEEN, default: 'either' },
      kind: { type: { kind: 'choice', values: KINDS }, default: 'any', doc: 'which kind of body' },
      night: NIGHT,
    },
    attributesFor() {
      return this.attributes;
    },
    decide: (call) => ({ kind: 'repeat', items: targets(call) }),
  },
  {
    name: 'every-event',
    summary: "repeats its block for each event of the week (or around a one-off's date), with the event bound inside; ::otherwise when there is none",
    example: ':::every-event{type=meteor-shower-peak}',
    binds: 'event',
    attributes: {
      type: { type: { kind: 'choice', values: EVENT_TYPES }, doc: 'only events of this type (default: all but satellite passes, a dozen a week)' },
      visible: { type: { kind: 'choice', values: ['only', 'any'] }, default: 'any', doc: 'only events visible from the site, or all' },
      order: { type: { kind: 'choice', values: ['time', 'interest'] }, default: 'time', doc: 'in time order, or most interesting first' },
      limit: { type: { kind: 'integer', min: 1, max: 50 }, doc: 'at most this many (default: all)' },
    },
    attributesFor() {
      return this.attributes;
    },
    decide: (call) => ({ kind: 'repeat', items: events(call) }),
  },
];

/** Every section by name. */
export const SECTIONS: ReadonlyMap<string, SectionSpec> = new Map(DEFINITIONS.map((d) => [d.name, d]));

/** The leaf directive that splits a section into its block and the alternative. */
export const OTHERWISE = 'otherwise';
