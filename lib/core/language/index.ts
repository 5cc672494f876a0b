/**
 * One vocabulary and one formatter for every word gloaming writes: `wordsFor(locale)` gives the
 * catalogue messages of the locale's language (`t`), and dates, clock times, numbers, lists,
 * compass directions and hand measures through `Intl` in the locale's own formats. The command
 * line, the placeholders, the charts and the site all read their words from here.
 *
 * A locale is a BCP 47 tag (`es-CL`): its language picks the catalogue (English when there is none
 * for it), the whole tag the formats (`es-CL` writes "8:10 p. m.", `es-ES` "20:10").
 * Deterministic: no clock, no environment locale.
 */
import { GloamingError } from '../errors.ts';
import { en, LANGUAGES, LANGUAGE_NAMES, type Catalogue, type Language, type MessageKey } from './catalogue.ts';
import { de } from './catalogues/de.ts';
import { es } from './catalogues/es.ts';
import { fr } from './catalogues/fr.ts';
import { applyGrammar } from './grammar.ts';
import { isPluralElement, isSelectElement, type MessageFormatElement } from '@formatjs/icu-messageformat-parser';
import { IntlMessageFormat, type Formatters } from 'intl-messageformat';
import { endSentence, firstSentence, splitSentences, tidyPunctuation } from './sentences.ts';

export { LANGUAGES, LANGUAGE_NAMES, endSentence, firstSentence, splitSentences, tidyPunctuation };
export type { Catalogue, Language, MessageKey };

/** The arguments of a catalogue message once names are spelled out (text, or numbers the message formats). */
export type MessageArguments = Readonly<Record<string, string | number>>;

export const CATALOGUES: Readonly<Record<Language, Catalogue>> = { en, es, de, fr };

/** The 16 compass points from north through east, as catalogue key suffixes. */
export const COMPASS_KEYS = ['n', 'nne', 'ne', 'ene', 'e', 'ese', 'se', 'sse', 's', 'ssw', 'sw', 'wsw', 'w', 'wnw', 'nw', 'nnw'] as const;
export type CompassKey = (typeof COMPASS_KEYS)[number];

/** The language of a BCP 47 locale that has a catalogue, or null ('es-CL' → 'es', 'pt-BR' → null). */
export function catalogueLanguage(locale: string): Language | null {
  const primary = locale.split('-')[0]!.toLowerCase();
  return (LANGUAGES as readonly string[]).includes(primary) ? (primary as Language) : null;
}

/** A grammatical gender and number, for messages that agree with a name (`{gender, select, …}`). */
export type Gender = 'masculine' | 'feminine' | 'neuter' | 'plural-masculine' | 'plural-feminine';

/** A name as a sentence uses it: the phrase (with its article where the language puts one), its gender, and its dative (German). */
export interface NamePhrase {
  text: string;
  gender: Gender;
  /** German dative phrase ("dem Großen Wagen"); other languages read `text`. */
  dative?: string;
}

export interface Words {
  /** The BCP 47 locale the formats follow. */
  readonly locale: string;
  /** The catalogue's language. */
  readonly language: Language;
  /**
   * A catalogue message with its arguments. A `NamePhrase` argument `x` also supplies `x_gender`
   * and `x_dative`; the message's grammar rules (contractions) are applied.
   */
  t(key: MessageKey, args?: Readonly<Record<string, string | number | NamePhrase>>): string;
  /** A number with `digits` decimals in the locale's digits and separators, with a true minus sign (−0 → 0). */
  number(value: number, digits?: number): string;
  /** A fraction (0–1) as a percentage in the locale's style ("42%", "42 %"), with `digits` decimals. */
  percent(fraction: number, digits?: number): string;
  /**
   * A calendar date (`YYYY-MM-DD`, no zone shift) in words: "Tuesday 1 December", "martes, 1 de
   * diciembre", "Dienstag, 1. Dezember", "mardi 1er décembre" (French writes the first of the
   * month as an ordinal; common usage, from memory).
   */
  day(date: string, options: { weekday?: 'long' | 'short'; month: 'long' | 'short'; year?: boolean }): string;
  /** A span of calendar dates in the locale's range style: "7–13 December 2026", "1er–7 décembre 2026". */
  dayRange(first: string, last: string, options: { month: 'long' | 'short'; year?: boolean }): string;
  /** A list joined the locale's way ("A, B and C", "A, B y C"). */
  list(items: readonly string[]): string;
  /** The 16-point compass word of an azimuth (degrees from north through east), and its abbreviation. */
  compass(azimuthDeg: number): { key: CompassKey; word: string; abbreviation: string };
  /** An angle as a hand measure at arm's length ("about 3 fingers", "unos 3 dedos"). */
  handMeasure(angleDeg: number): string;
  /** An altitude in degrees and hands ("18° (about 2 fists) up"), or below the horizon. */
  altitude(altitudeDeg: number): string;
}

/** Compiled messages, per (locale, key): plural rules and number formats follow the whole locale. */
const compiled = new Map<string, Compiled>();

interface Compiled {
  format: IntlMessageFormat;
  /** Arguments read as a plural count (other numbers are written before formatting). */
  plurals: ReadonlySet<string>;
  /** Arguments a `select` reads: their ids ('new-moon', 'plural-feminine') are matched as ICU keys ('new_moon', 'plural_feminine'). */
  selects: ReadonlySet<string>;
}

function compiledMessage(format: IntlMessageFormat): Compiled {
  const plurals = new Set<string>();
  const selects = new Set<string>();
  const walk = (elements: readonly MessageFormatElement[]): void => {
    for (const e of elements) {
      if (isPluralElement(e)) plurals.add(e.value);
      if (isSelectElement(e)) selects.add(e.value);
      if (isPluralElement(e) || isSelectElement(e)) for (const o of Object.values(e.options)) walk(o.value);
    }
  };
  walk(format.getAst());
  return { format, plurals, selects };
}
const words = new Map<string, Words>();

/** Degrees covered by a fist at arm's length (common practice). */
export const FIST_DEG = 10;
/** Degrees covered by one finger width at arm's length (common practice). */
export const FINGER_DEG = 2;

/** An angle in fists at arm's length, rounded to halves: 18° → 2 (1.8 rounds to 2). */
export function fists(angleDeg: number): number {
  return Math.round((angleDeg / FIST_DEG) * 2) / 2;
}

/** The index (0–15, from north through east) of an azimuth's 16-point compass direction. */
export function compassIndex(azimuthDeg: number): number {
  return Math.round((((azimuthDeg % 360) + 360) % 360) / 22.5) % 16;
}

function makeWords(locale: string): Words {
  const language = catalogueLanguage(locale) ?? 'en';
  const catalogue = CATALOGUES[language];
  const plural = new Intl.PluralRules(locale);
  const numberFormats = new Map<number, Intl.NumberFormat>();
  const numberFormat = (digits: number): Intl.NumberFormat => {
    let f = numberFormats.get(digits);
    if (!f) {
      f = new Intl.NumberFormat(locale, { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false });
      numberFormats.set(digits, f);
    }
    return f;
  };
  const number = (value: number, digits = 0): string => {
    if (!Number.isFinite(value)) throw new GloamingError('invalid-value', 'a number to print is not finite', { actual: value, expected: 'a finite number' });
    const text = numberFormat(digits).format(value);
    if (Number(value.toFixed(digits)) === 0) return numberFormat(digits).format(0);
    return text.replace(/^[-\u2212]/, '\u2212');
  };
  const listFormat = new Intl.ListFormat(locale, { type: 'conjunction', style: 'long' });
  const dateFormats = new Map<string, Intl.DateTimeFormat>();
  const dateFormat = (options: Intl.DateTimeFormatOptions): Intl.DateTimeFormat => {
    const key = JSON.stringify(options);
    let f = dateFormats.get(key);
    if (!f) {
      f = new Intl.DateTimeFormat(locale, { timeZone: 'UTC', ...options });
      dateFormats.set(key, f);
    }
    return f;
  };
  const noon = (date: string): Date => {
    const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(date);
    if (!m) throw new GloamingError('invalid-date', `'${date}' is not a date YYYY-MM-DD`, { actual: date, expected: 'a date YYYY-MM-DD' });
    return new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3]), 12));
  };
  // French: the first of the month is an ordinal ("1er décembre").
  const joinParts = (parts: Intl.DateTimeFormatPart[]): string =>
    parts.map((p) => (p.type === 'day' && language === 'fr' && p.value === '1' ? '1er' : p.value)).join('');
  // intl-messageformat asks for these when it formats `#` and picks a plural case; the count is
  // written like every other number here (no grouping, one decimal at most).
  const countFormat = new Intl.NumberFormat(locale, { useGrouping: false, maximumFractionDigits: 1 });
  const formatters: Formatters = {
    getNumberFormat: (_l, options) => (options ? new Intl.NumberFormat(locale, options as Intl.NumberFormatOptions) : countFormat),
    getDateTimeFormat: (...a) => new Intl.DateTimeFormat(...a),
    getPluralRules: (_l, options) => (options?.type === 'ordinal' ? new Intl.PluralRules(locale, options) : plural),
  };
  const compile = (key: MessageKey): Compiled => {
    const cacheKey = `${locale}|${key}`;
    let c = compiled.get(cacheKey);
    if (!c) {
      let format: IntlMessageFormat;
      try {
        format = new IntlMessageFormat(catalogue[key], locale, undefined, { formatters, ignoreTag: true });
      } catch (cause) {
        throw new GloamingError('invalid-value', `message '${key}' of the ${language} catalogue cannot be read: ${(cause as Error).message}`, {
          expected: 'ICU MessageFormat text: {name}, {n, plural, one {…} other {…}} or {g, select, feminine {…} other {…}}',
          cause,
        });
      }
      c = compiledMessage(format);
      compiled.set(cacheKey, c);
    }
    return c;
  };
  const t: Words['t'] = (key, args = {}) => {
    const { format, plurals, selects } = compile(key);
    const flat: Record<string, string | number> = {};
    for (const [name, value] of Object.entries(args)) {
      if (typeof value === 'object') {
        flat[name] = value.text;
        flat[`${name}_gender`] = value.gender;
        flat[`${name}_dative`] = value.dative ?? value.text;
      } else if (typeof value === 'number' && !plurals.has(name)) {
        // A number shown as it is: the locale's digits, a true minus sign, no grouping (as `number`).
        flat[name] = number(value, Number.isInteger(value) ? 0 : 1);
      } else flat[name] = value;
    }
    // ICU select keys are identifiers without hyphens: gloaming's ids are matched with '_' for '-'.
    for (const name of selects) if (typeof flat[name] === 'string') flat[name] = (flat[name] as string).replaceAll('-', '_');
    let text: unknown;
    try {
      text = format.format(flat);
    } catch (cause) {
      throw new GloamingError('invalid-value', `message '${key}' cannot be written: ${(cause as Error).message}`, { actual: Object.keys(args), cause });
    }
    if (typeof text !== 'string') throw new GloamingError('invalid-value', `message '${key}' did not format to text`, { actual: text });
    // Pieces joined by a message can double a stop: "a las 6:06 a. m." + "." reads "a. m." once.
    return tidyPunctuation(applyGrammar(text, language));
  };
  const self: Words = {
    locale,
    language,
    t,
    number,
    list: (items) => listFormat.format(items),
    day(date, options) {
      return joinParts(dateFormat({ ...(options.weekday ? { weekday: options.weekday } : {}), day: 'numeric', month: options.month, ...(options.year ? { year: 'numeric' } : {}) }).formatToParts(noon(date)));
    },
    dayRange(first, last, options) {
      return joinParts(dateFormat({ day: 'numeric', month: options.month, ...(options.year ? { year: 'numeric' } : {}) }).formatRangeToParts(noon(first), noon(last)));
    },
    percent(fraction, digits = 0) {
      if (!Number.isFinite(fraction)) throw new GloamingError('invalid-value', 'a percentage to print is not finite', { actual: fraction, expected: 'a finite number' });
      const key = -1 - digits;
      let f = numberFormats.get(key);
      if (!f) {
        f = new Intl.NumberFormat(locale, { style: 'percent', minimumFractionDigits: digits, maximumFractionDigits: digits });
        numberFormats.set(key, f);
      }
      return f.format(fraction);
    },
    compass(azimuthDeg) {
      const key = COMPASS_KEYS[compassIndex(azimuthDeg)]!;
      return { key, word: t(`compass.${key}`), abbreviation: t(`compass-short.${key}`) };
    },
    handMeasure(angleDeg) {
      const a = Math.abs(angleDeg);
      if (a < FINGER_DEG / 2) return t('hand.under-finger');
      if (a < 7) return t('hand.fingers', { count: Math.round(a / FINGER_DEG) });
      if (a < 0.95 * FIST_DEG) return t('hand.almost-fist');
      const f = fists(a);
      return Number.isInteger(f) ? t('hand.fists', { count: f }) : t('hand.fists-and-half', { count: Math.floor(f) });
    },
    altitude(altitudeDeg) {
      const degrees = Math.round(altitudeDeg);
      if (altitudeDeg < 0) return degrees === 0 ? t('altitude.just-below') : t('altitude.below', { degrees: Math.abs(degrees) });
      // The hand measure follows the degrees as printed, as distances do (guide.ts `distanceWords`): 6.6° reads "7° (almost a fist)".
      return t('altitude.up', { degrees, hand: self.handMeasure(degrees) });
    },
  };
  return self;
}

/** The words and formats of a BCP 47 locale (cached; the same object for the same locale). */
export function wordsFor(locale: string): Words {
  let w = words.get(locale);
  if (!w) {
    w = makeWords(locale);
    words.set(locale, w);
  }
  return w;
}
