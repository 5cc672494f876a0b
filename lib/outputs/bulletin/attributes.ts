/**
 * Placeholder attributes: their types, how each is read from the directive's text, and the words
 * used for them in errors and in the generated placeholder table. A value that cannot be read is
 * an `invalid-placeholder` error saying what was expected; the caller adds the place.
 */
import type { Body, BodyRegistry } from '../../core/body.ts';
import { GloamingError, didYouMean } from '../../core/errors.ts';
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
}

/** A local clock time as given in a `moment` attribute. */
export interface ClockTime {
  hour: number;
  minute: number;
}

export type AttributeValue = Body | number | string | Clock | TimePrecision | ClockTime;

const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;

/** How an attribute type is written, for errors and the placeholder table. */
export function describeType(type: AttributeType): string {
  switch (type.kind) {
    case 'body':
      return 'a body id (jupiter, moon, …) or a deep-sky id (m31, ngc869, albireo, …)';
    case 'night':
      return 'mon…sun, 1–7 or a YYYY-MM-DD date in the week';
    case 'clock':
      return '12 or 24';
    case 'time-precision':
      return 'minute or second';
    case 'choice':
      return type.values.join(' | ');
    case 'integer':
      return `an integer ${type.min}–${type.max}`;
    case 'moment':
      return `${type.values.join(' | ')} | HH:MM`;
  }
}

function bad(reason: string, actual: unknown, type: AttributeType, hint?: string): never {
  throw new GloamingError('invalid-placeholder', reason, { actual, expected: describeType(type), ...(hint ? { hint } : {}) });
}

export interface ReadContext {
  bodies: BodyRegistry;
  /** The seven local dates of the page's week, Monday first. */
  days: readonly string[];
}

/** Reads one attribute value; raises `invalid-placeholder` or `unknown-body` (without a place). */
export function readAttribute(name: string, raw: string, type: AttributeType, context: ReadContext): AttributeValue {
  const value = raw.trim();
  switch (type.kind) {
    case 'body':
      if (value === '') bad(`attribute '${name}' is empty`, raw, type);
      return context.bodies.get(value);
    case 'night': {
      const lower = value.toLowerCase();
      const weekday = WEEKDAYS.indexOf(lower.slice(0, 3) as (typeof WEEKDAYS)[number]);
      if (weekday >= 0 && /^[a-z]+$/.test(lower) && ['monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday', 'sunday'][weekday]!.startsWith(lower)) return weekday;
      if (/^\d+$/.test(value)) {
        const n = Number(value);
        if (n < 1 || n > 7) bad(`night ${n} is outside the week`, raw, type, 'nights are numbered 1 (Monday) to 7 (Sunday)');
        return n - 1;
      }
      if (/^\d{4}-\d{2}-\d{2}$/.test(value)) {
        const i = context.days.indexOf(value);
        if (i < 0) {
          const first = context.days[0]!;
          bad(`the date ${value} is not in this page's week`, raw, type, `this week runs from ${first} to ${addDays(first, 6)}`);
        }
        return i;
      }
      const hint = didYouMean(lower, WEEKDAYS);
      return bad(`cannot read the night '${value}'`, raw, type, hint);
    }
    case 'clock':
      if (value !== '12' && value !== '24') bad(`cannot read the clock '${value}'`, raw, type);
      return Number(value) as Clock;
    case 'time-precision':
      if (value !== 'minute' && value !== 'second') bad(`cannot read the precision '${value}'`, raw, type, didYouMean(value, ['minute', 'second']));
      return value;
    case 'choice':
      if (!type.values.includes(value)) bad(`'${value}' is not a value of '${name}'`, raw, type, didYouMean(value, type.values));
      return value;
    case 'integer': {
      if (!/^-?\d+$/.test(value)) bad(`attribute '${name}' must be a whole number`, raw, type);
      const n = Number(value);
      if (n < type.min || n > type.max) bad(`attribute '${name}' is out of range`, raw, type);
      return n;
    }
    case 'moment': {
      if (type.values.includes(value)) return value;
      const m = /^(\d{1,2}):(\d{2})$/.exec(value);
      if (m) {
        const hour = Number(m[1]);
        const minute = Number(m[2]);
        if (hour > 23 || minute > 59) bad(`'${value}' is not a clock time`, raw, type);
        return { hour, minute };
      }
      return bad(`cannot read the moment '${value}'`, raw, type, didYouMean(value, type.values));
    }
  }
}
