/**
 * What every placeholder family shares: the call a render function gets, the spec of a table
 * entry, the attributes several placeholders take, and the small helpers that turn values into
 * semantic HTML (`<time datetime>`, `<data value>`, `data-*` attributes, classes `gl gl-<name>`)
 * or into the neutral mark of a value slot with no value.
 */
import type { ElementContent, Properties } from 'hast';
import type { Body } from '../../../core/body.ts';
import type { EventTime, MissingReason } from '../../../core/events.ts';
import type { Site } from '../../../core/site.ts';
import { formatInstant } from '../../../core/time.ts';
import { reasonText, type Visibility } from '../../../models/visibility.ts';
import { wordsFor, type Words } from '../../../core/language/index.ts';
import { bodyLabel, bodyPhrase } from '../../../core/language/names/index.ts';
import { TWILIGHT_DEPTH_DEG, type MissingPhrases, type TwilightKind } from './phrases.ts';
import type { AlmanacEvent } from '../../almanac/index.ts';
import type { AttributeSpec, AttributeValue } from '../attributes.ts';
import type { AuthorWords } from '../messages.ts';
import { el, formatClock, type Clock, type TimePrecision } from '../format.ts';
import { FALLBACK_MARK } from '../problems.ts';
import type { ChartOutput } from '../types.ts';
import type { WeekData } from '../../../models/week.ts';

/** What a render function gets: the placeholder's typed attributes and the shared week. */
export interface PlaceholderCall {
  name: string;
  site: Site;
  week: WeekData;
  /** Night 0–6 of the week (0 = Monday evening) the placeholder is about. */
  night: number;
  clock: Clock;
  /** Attribute values, defaults filled in. */
  attrs: ReadonlyMap<string, AttributeValue>;
  /** Names of the attributes the author wrote (as opposed to defaults). */
  given: ReadonlySet<string>;
  /** Where finder charts go (the build's chart output; see `ChartOutput`). */
  charts: ChartOutput;
  /** The page's events: the week's, or those around a one-off's date (see `eventsBetween` in lib/outputs/almanac). */
  events(): AlmanacEvent[];
  /** How the page's event span is named in sentences: `this week` or `around this date`. */
  eventSpan: string;
  /** The event bound by an enclosing `:::every-event` (used by `:event` without a type). */
  event?: AlmanacEvent;
  /**
   * Records that a value placeholder had no value (it prints `FALLBACK_MARK`); `honest` is the
   * sentence saying why, `guard` the `:::provided` condition that would have guarded it (default
   * `has=<name> …`). The plugin turns it into a problem with the place, site and week.
   */
  fallback(honest: string, guard?: string): void;
  /** Table cells: print the honest phrase instead of the mark (a cell has room for it). */
  honest?: boolean;
}

export interface PlaceholderSpec {
  name: string;
  /** `inline` is written `:name{…}` inside a sentence; `block` is `::name{…}` on its own line. */
  form: 'inline' | 'block';
  /** One line for the placeholder table. */
  summary: string;
  attributes: Readonly<Record<string, AttributeSpec>>;
  /** An example as written in a template. */
  example: string;
  /**
   * A value slot: it can have no value (a body not visible, an event that does not happen), and
   * then prints `FALLBACK_MARK` and reports a fallback. Only slots can be tested with `:::provided{has=…}`.
   */
  slot?: boolean;
  /**
   * The bodies the placeholder shows on its night, for the eye-safety pass over the rendered page
   * (`nearSunBodies` in `../safety.ts`); none when absent.
   */
  shows?: (call: PlaceholderCall) => Body[];
  /** Extra checks of the attributes against what an enclosing section binds (`bound`). */
  validate?: (attrs: ReadonlyMap<string, AttributeValue>, bound: Readonly<{ body: boolean; event: boolean }>, words: AuthorWords) => void;
  render: (call: PlaceholderCall) => ElementContent;
}

// ---------------------------------------------------------------------------------------------
// Shared attributes

export const NIGHT: AttributeSpec = { type: { kind: 'night' }, default: 'Monday, or the one-off date', doc: 'which night of the week' };
export const CLOCK: AttributeSpec = { type: { kind: 'clock' }, default: "the site's locale", doc: '12- or 24-hour clock' };
export const TIME_PRECISION: AttributeSpec = { type: { kind: 'time-precision' }, default: 'minute', doc: 'times are rounded to this' };
export const BODY: AttributeSpec = { type: { kind: 'body' }, required: true, bound: 'body', doc: 'the body or object', need: 'err.need-body' };
export const TWILIGHT: AttributeSpec = { type: { kind: 'choice', values: ['civil', 'nautical', 'astronomical'] }, default: 'astronomical', doc: 'which twilight' };
export const DIGITS = (fallback: number, doc = 'decimals shown'): AttributeSpec => ({ type: { kind: 'integer', min: 0, max: 2 }, default: String(fallback), doc });

export const TIME_ATTRS = { night: NIGHT, clock: CLOCK, precision: TIME_PRECISION };

// ---------------------------------------------------------------------------------------------
// Helpers


/** The words of the page's language (its site's locale). */
export function wordsOf(call: PlaceholderCall): Words {
  return wordsFor(call.site.locale);
}

/** A body's label in the page's language ("Jupiter", "Júpiter"). */
export function labelOf(call: PlaceholderCall, body: Body): string {
  return bodyLabel(wordsOf(call).language, body);
}

export function classes(call: PlaceholderCall, ...extra: string[]): Properties {
  return { className: ['gl', `gl-${call.name}`, ...extra] };
}

export function nightDate(call: PlaceholderCall): string {
  return call.week.week.days[call.night]!;
}

export function precisionOf(call: PlaceholderCall): TimePrecision {
  return (call.attrs.get('precision') as TimePrecision | undefined) ?? 'minute';
}

export function digitsOf(call: PlaceholderCall, fallback: number): number {
  return (call.attrs.get('precision') as number | undefined) ?? fallback;
}

/** The body a placeholder is about (its `body` attribute, or the one an enclosing section binds). */
export function bodyOf(call: PlaceholderCall): Body {
  return call.attrs.get('body') as Body;
}

/** `shows` of a placeholder about one body: that body. */
export function showsBody(call: PlaceholderCall): Body[] {
  return [bodyOf(call)];
}

/** An instant as `<time datetime="…">16:29</time>`. */
export function timeElement(call: PlaceholderCall, instant: Date, data: Properties = {}): ElementContent {
  return el(
    'time',
    { ...classes(call), dateTime: formatInstant(instant, call.site.timeZone), dataNight: nightDate(call), ...data },
    formatClock(instant, call.site, { clock: call.clock, precision: precisionOf(call) }),
  );
}

/**
 * A value slot with no value: the neutral mark `–` (the honest sentence in its title and in the
 * problem report), or the sentence itself in a table cell. Says why in `data-reason`.
 */
export function noValue(call: PlaceholderCall, honest: string, data: Properties = {}, guard?: string): ElementContent {
  if (call.honest) return el('span', { ...classes(call, 'gl-none'), dataNight: nightDate(call), ...data }, honest);
  call.fallback(honest, guard);
  return el('span', { ...classes(call, 'gl-none'), dataNight: nightDate(call), title: honest, ...data }, FALLBACK_MARK);
}

/** An event that does not happen this night. */
export function missingElement(call: PlaceholderCall, reason: MissingReason, phrase: string, data: Properties = {}): ElementContent {
  return noValue(call, phrase, { dataReason: reason, ...data });
}

export function eventElement(call: PlaceholderCall, event: EventTime, phrases: MissingPhrases | TwilightKind, data: Properties = {}): ElementContent {
  return event.time ? timeElement(call, event.time, data) : missingElement(call, event.reason, missingText(call, phrases, event.reason), data);
}

/** Why an event does not happen, in the page's language; for a twilight, with its depth. */
export function missingText(call: PlaceholderCall, phrases: MissingPhrases | TwilightKind, reason: MissingReason): string {
  const words = wordsOf(call);
  if (typeof phrases !== 'string') return words.t(phrases[reason]);
  if (reason === 'outside-night') return words.t('missing.not-this-night');
  const depth = TWILIGHT_DEPTH_DEG[phrases];
  if (reason === 'stays-above' || reason === 'always-above') {
    // When the Sun does not even set (the midnight Sun), that is the whole story.
    const sunset = call.week.nights[call.night]?.sun.set.reason;
    if (sunset === 'always-above' || sunset === 'stays-above') return words.t('missing.sun-stays-up');
    return words.t('missing.no-darkness', { kind: phrases, depth });
  }
  return words.t('missing.dark-all-day', { kind: phrases, depth });
}

/** The honest phrase for a body with no best moment this night. */
export function notVisible(call: PlaceholderCall, body: Body, v: Visibility, data: Properties = {}): ElementContent {
  const reason = v.reason ?? 'too-faint';
  const words = wordsOf(call);
  const said = words.t('ph.not-visible', { name: labelOf(call, body), reason: reasonText(reason, call.site, words, bodyPhrase(words.language, body).gender) });
  return noValue(call, said, { dataBody: body.id, dataVerdict: v.verdict, dataReason: reason, ...data }, `seen=either body=${body.id}`);
}
