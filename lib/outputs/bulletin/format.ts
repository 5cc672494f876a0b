/**
 * Formatting values for pages: clock times and dates in the site's zone and locale
 * (`Intl.DateTimeFormat`), numbers with a true minus sign, and small HAST element builders.
 * Everything here is deterministic for a given input (no clock, no environment locale).
 */
import { wordsFor } from '../../core/language/index.ts';
import type { Element, ElementContent, Properties } from 'hast';
import type { Site } from '../../core/site.ts';
import { defaultClock, formatClock, roundInstant, type Clock, type TimePrecision } from '../../core/time.ts';

export type { Clock, TimePrecision };
export { defaultClock, formatClock, roundInstant };

/** A local date (`YYYY-MM-DD`) in words in the site's locale, e.g. `Monday 7 December`. */
export function formatDay(date: string, site: Site, options: { weekday: 'long' | 'short' }): string {
  return wordsFor(site.locale).day(date, { weekday: options.weekday, month: options.weekday === 'long' ? 'long' : 'short' });
}

/** A span of local dates in words, e.g. `7–13 December 2026` (locale's own range style). */
export function formatDayRange(first: string, last: string, site: Site): string {
  return wordsFor(site.locale).dayRange(first, last, { month: 'long', year: true });
}

/** A number with `digits` decimals and a typographic minus sign (U+2212); −0 prints as 0. */
export function formatNumber(value: number, digits: number): string {
  const text = value.toFixed(digits);
  if (Number(text) === 0) return (0).toFixed(digits);
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/** A number rounded to `digits` decimals, for data attributes (plain ASCII, −0 → 0). */
export function exact(value: number, digits: number): string {
  const f = 10 ** digits;
  const r = Math.round(value * f) / f;
  return String(Object.is(r, -0) ? 0 : r);
}

/** A HAST element. */
export function el(tagName: string, properties: Properties, children: ElementContent[] | string = []): Element {
  return {
    type: 'element',
    tagName,
    properties,
    children: typeof children === 'string' ? [{ type: 'text', value: children }] : children,
  };
}
