/**
 * Every catalogue has every key of the English one (and no other), every message parses, and
 * every translation reads the same arguments as the English message, each in the grammatical form
 * its language needs (`<name>_dative`, `<name>_gender`, which the code supplies for every name,
 * and the body's `gender`). Plural messages offer a case for every plural category the language has
 * (Unicode CLDR plural rules, as `Intl.PluralRules` reports them).
 *
 * Messages are read with formatjs's ICU MessageFormat parser (`@formatjs/icu-messageformat-parser`),
 * the same parser `intl-messageformat` formats them with.
 */
import { isArgumentElement, isNumberElement, isPluralElement, isSelectElement, parse, type MessageFormatElement } from '@formatjs/icu-messageformat-parser';
import { describe, expect, it } from 'vitest';
import { CATALOGUES, LANGUAGES, wordsFor } from '../lib/core/language/index.ts';

type Kind = 'text' | 'plural' | 'select';

/** Every argument a message reads, with how it reads it. */
function shape(elements: readonly MessageFormatElement[], out = new Map<string, Kind>()): Map<string, Kind> {
  for (const e of elements) {
    if (isArgumentElement(e) || isNumberElement(e)) {
      if (!out.has(e.value)) out.set(e.value, 'text');
    } else if (isPluralElement(e) || isSelectElement(e)) {
      out.set(e.value, isPluralElement(e) ? 'plural' : 'select');
      for (const o of Object.values(e.options)) shape(o.value, out);
    }
  }
  return out;
}

/** The case keys of every plural in a message. */
function pluralCases(elements: readonly MessageFormatElement[], out: Set<string>[] = []): Set<string>[] {
  for (const e of elements) {
    if (isPluralElement(e)) out.push(new Set(Object.keys(e.options)));
    if (isPluralElement(e) || isSelectElement(e)) for (const o of Object.values(e.options)) pluralCases(o.value, out);
  }
  return out;
}

const read = (text: string): MessageFormatElement[] => parse(text, { ignoreTag: true, requiresOtherClause: true });

/** The argument a grammatical form belongs to: `what_dative` → `what`; the body's own `gender` → null. */
function base(name: string): string | null {
  if (name === 'gender') return null;
  return name.replace(/_(gender|dative)$/, '');
}

function bases(names: Iterable<string>): string[] {
  return [...new Set([...names].map(base).filter((n): n is string => n !== null))].sort();
}

describe('message catalogues', () => {
  const reference = CATALOGUES.en;
  for (const language of LANGUAGES) {
    const catalogue = CATALOGUES[language];
    it(`${language}: has exactly the English keys`, () => {
      expect(Object.keys(catalogue).sort()).toEqual(Object.keys(reference).sort());
    });
    it(`${language}: every message parses and reads the English message's arguments`, () => {
      for (const [key, text] of Object.entries(catalogue)) {
        const mine = shape(read(text));
        const english = shape(read(reference[key as keyof typeof reference]));
        expect(bases(mine.keys()), `${language} '${key}'`).toEqual(bases(english.keys()));
        for (const [name, kind] of english) if (mine.has(name) && kind === 'plural') expect(mine.get(name), `${language} '${key}' {${name}}`).toBe('plural');
      }
    });
    it(`${language}: plural messages cover every plural category of the language (CLDR)`, () => {
      const categories = new Intl.PluralRules(language).resolvedOptions().pluralCategories;
      for (const [key, text] of Object.entries(catalogue)) {
        for (const cases of pluralCases(read(text))) {
          // 'many' (Spanish and French, for millions) never occurs with counts of fingers, fists or days below a thousand.
          for (const c of categories) if (c !== 'many') expect(cases.has(c) || c === 'other', `${language} '${key}' lacks '${c}'`).toBe(true);
        }
      }
    });
    it(`${language}: a pattern named in mid-sentence (", in the Sickle of Leo,") is set off by commas on both sides (common practice)`, () => {
      for (const [key, text] of Object.entries(catalogue)) {
        const names = shape(read(text));
        if (names.get('inPattern') !== 'select') continue;
        const args: Record<string, string | number> = {};
        for (const [name, kind] of names) args[name] = kind === 'plural' ? 1 : kind === 'select' ? 'other' : `«${name}»`;
        const said = wordsFor(language).t(key as keyof typeof reference, { ...args, inPattern: 'yes' });
        // Followed by a word, the pattern's phrase sits inside the sentence and needs its closing comma.
        expect(said, `${language} '${key}'`).not.toMatch(/«pattern(_dative)?» \p{L}/u);
      }
    });
    it(`${language}: no message has doubled punctuation or stray spaces`, () => {
      for (const [key, text] of Object.entries(catalogue)) {
        expect(text, `${language} '${key}'`).not.toMatch(/\.\.|,,|\s,|\s\.(?!\w)|\s$|^\s| {2}/);
      }
    });
  }
});

describe('message syntax and formatting', () => {
  it('the parser reports a malformed message with its position', () => {
    expect(() => read('{count, plural, one {a}}')).toThrow();
    try {
      read('about {degrees°');
      expect.unreachable();
    } catch (e) {
      // formatjs's parser errors carry the offending span (1-based columns).
      expect((e as { location?: { start: { offset: number } } }).location?.start.offset).toBe(6);
    }
  });
  it('plural categories follow CLDR: French "one" for 0 and 1, English "other" for 0 (Unicode CLDR plural rules)', () => {
    expect(wordsFor('fr-FR').handMeasure(2)).toBe(wordsFor('fr-FR').t('hand.fingers', { count: 1 }));
    expect(wordsFor('en').t('hand.fists', { count: 1 })).not.toBe(wordsFor('en').t('hand.fists', { count: 2 }));
  });
  it("a select reads gloaming's hyphenated ids (gender and Moon phase) through ICU identifier keys", () => {
    // Spanish adjectives ending in a consonant add -es in the plural ("débil" → "débiles"; grammar, from memory).
    expect(wordsFor('es-CL').t('reason.too-faint', { gender: 'plural-masculine' })).toBe('demasiado débiles');
    expect(wordsFor('es-CL').t('reason.twilight', { gender: 'plural-feminine' })).toBe('perdidas en el crepúsculo');
    expect(wordsFor('de-DE').t('ui.moon-phase-line', { phase: 'first-quarter' })).toBe('Erstes Viertel');
  });
  it('a number argument is written in the locale with a true minus sign; a missing argument is an error naming it', () => {
    expect(wordsFor('en').t('altitude.below', { degrees: 12 })).toContain('12');
    expect(() => wordsFor('en').t('altitude.below', {})).toThrow(/altitude\.below/);
  });
});
