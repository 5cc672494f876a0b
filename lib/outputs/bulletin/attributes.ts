/**
 * Placeholder attributes: their types, how each is read from the directive's text, and the words
 * used for them in errors and in the generated placeholder table. A value that cannot be read is
 * an `invalid-placeholder` error saying what was expected; the caller adds the place.
 */
import type { Body, BodyRegistry } from '../../core/body.ts';
import { GloamingError, type Place } from '../../core/errors.ts';
import { DEEP_SKY } from '../../models/deep-sky/catalogue.ts';
import { authorWords, quoted, type AuthorArguments, type AuthorKey, type AuthorWords } from './messages.ts';
import { addDays } from '../../core/time.ts';
import type { Clock, TimePrecision } from './format.ts';

export type AttributeType =
  /** A body id from the registry. */
  | { kind: 'body' }
  /** A night of the week: `mon`…`sun`, `1`–`7`, or a `YYYY-MM-DD` date inside the week. */
  | { kind: 'night' }
  /** `12` or `24`. */
  | { kind: 'clock' }
  /** `minute` or `second`. */
  | { kind: 'time-precision' }
  /** One word of a fixed list. */
  | { kind: 'choice'; values: readonly string[] }
  /** An integer in a range. */
  | { kind: 'integer'; min: number; max: number }
  /** A named moment (`rise`, `transit`, …) or a local clock time `HH:MM` (before 12:00 = the next morning). */
  | { kind: 'moment'; values: readonly string[] };

export interface AttributeSpec {
  type: AttributeType;
  /** What the attribute means, for the placeholder table. */
  doc: string;
  /** Default as written in the table; `undefined` with `required` for mandatory attributes. */
  default?: string;
  required?: boolean;
  /** Supplied by an enclosing section when not written: the body of `:::every-target`, the event of `:::every-event`. */
  bound?: 'body' | 'event';
  /** For a required attribute: what it should be, said in the template's language when it is missing (`doc` is the table's English). */
  need?: AuthorKey;
}

/** A local clock time as given in a `moment` attribute. */
export interface ClockTime {
  hour: number;
  minute: number;
}

export type AttributeValue = Body | number | string | Clock | TimePrecision | ClockTime;

const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;

/** How an attribute type is written, for errors (in the template's language) and the placeholder table (English). */
export function describeType(type: AttributeType, words: AuthorWords = authorWords()): string {
  switch (type.kind) {
    case 'body':
      return words.say('err.type-body');
    case 'night':
      return words.say('err.type-night');
    case 'clock':
      return words.say('err.either', { first: '12', second: '24' });
    case 'time-precision':
      return words.say('err.either', { first: 'minute', second: 'second' });
    case 'choice':
      return type.values.join(' | ');
    case 'integer':
      return words.say('err.type-integer', { min: type.min, max: type.max });
    case 'moment':
      return `${type.values.join(' | ')} | HH:MM`;
  }
}

export interface ReadContext {
  bodies: BodyRegistry;
  /** The seven local dates of the page's week, Monday first. */
  days: readonly string[];
  /** The messages of the template's language (default English). */
  words?: AuthorWords;
}

/**
 * The body with id `id`; an unknown id is `unknown-body` in the template's language, listing the
 * ids (and the deep-sky table, when the registry looks ids up in it) with a suggestion.
 */
export function bodyOf(id: string, bodies: BodyRegistry, words: AuthorWords, place?: Place): Body {
  try {
    return bodies.get(id, place);
  } catch (error) {
    if (!(error instanceof GloamingError) || error.code !== 'unknown-body') throw error;
    const ids = bodies.ids();
    const others = bodies.catalogues.map((c) => (c === DEEP_SKY ? words.say('err.deep-sky-ids') : c.expected));
    const hint = words.didYouMean(id.trim().toLowerCase(), [...ids, ...bodies.catalogues.flatMap((c) => c.ids())]);
    throw words.error('unknown-body', words.say(others.length ? 'err.unknown-object' : 'err.unknown-body', { name: quoted(id) }), {
      ...(place ? { place } : {}),
      expected: others.reduce((text, other) => words.say('err.either', { first: text, second: other }), words.oneOf(ids)),
      ...(hint ? { hint } : {}),
    });
  }
}

/** Reads one attribute value; raises `invalid-placeholder` or `unknown-body` (without a place). */
export function readAttribute(name: string, raw: string, type: AttributeType, context: ReadContext): AttributeValue {
  const value = raw.trim();
  const words = context.words ?? authorWords();
  const bad = (key: AuthorKey, args: AuthorArguments, hint?: string): never => {
    throw words.error('invalid-placeholder', words.say(key, args), { actual: raw, expected: describeType(type, words), ...(hint ? { hint } : {}) });
  };
  switch (type.kind) {
    case 'body':
      if (value === '') bad('err.attribute-empty', { name: quoted(name) });
      return bodyOf(value, context.bodies, words);
    case 'night': {
      const lower = value.toLowerCase();
      const weekday = WEEKDAYS.indexOf(lower.slice(0, 3) as (typeof WEEKDAYS)[number]);
      if (weekday >= 0 && /^[a-z]+$/.test(lower) && ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'][weekday]!.startsWith(lower)) return weekday;
      if (/^\d+$/.test(value)) {
        const n = Number(value);
        if (n < 1 || n > 7) bad('err.night-outside-week', { night: n }, words.say('err.night-numbers'));
        return n - 1;
      }
      if (/^\d{4}-\d{2}-\d{2}$/.test(value)) {
        const i = context.days.indexOf(value);
        if (i < 0) {
          const first = context.days[0]!;
          bad('err.date-not-in-week', { date: value }, words.say('err.week-runs', { first, last: addDays(first, 6) }));
        }
        return i;
      }
      return bad('err.cannot-read-night', { value: quoted(value) }, words.didYouMean(lower, WEEKDAYS));
    }
    case 'clock':
      if (value !== '12' && value !== '24') bad('err.cannot-read-clock', { value: quoted(value) });
      return Number(value) as Clock;
    case 'time-precision':
      if (value !== 'minute' && value !== 'second') bad('err.cannot-read-precision', { value: quoted(value) }, words.didYouMean(value, ['minute', 'second']));
      return value;
    case 'choice':
      if (!type.values.includes(value)) bad('err.not-a-value-of', { value: quoted(value), name: quoted(name) }, words.didYouMean(value, type.values));
      return value;
    case 'integer': {
      if (!/^-?\d+$/.test(value)) bad('err.not-whole-number', { name: quoted(name) });
      const n = Number(value);
      if (n < type.min || n > type.max) bad('err.out-of-range', { name: quoted(name) });
      return n;
    }
    case 'moment': {
      if (type.values.includes(value)) return value;
      const m = /^(\d{1,2}):(\d{2})$/.exec(value);
      if (m) {
        const hour = Number(m[1]);
        const minute = Number(m[2]);
        if (hour > 23 || minute > 59) bad('err.not-clock-time', { value: quoted(value) });
        return { hour, minute };
      }
      return bad('err.cannot-read-moment', { value: quoted(value) }, words.didYouMean(value, type.values));
    }
  }
}
