/**
 * Every catalogue has every key of the English one (and no other), every message parses, and
 * every translation reads the same arguments as the English message, each in the grammatical form
 * its language needs (`<name>_dative`, `<name>_gender`, which the code supplies for every name,
 * and the body's `gender`). Plural messages offer a case for every plural category the language has
 * (Unicode CLDR plural rules, as `Intl.PluralRules` reports them).
 */
import { describe, expect, it } from 'vitest';
import { CATALOGUES, LANGUAGES } from '../lib/core/language/index.ts';
import { messageShape, parseMessage, type MessagePart } from '../lib/core/language/message.ts';

/** The argument a grammatical form belongs to: `what_dative` → `what`; the body's own `gender` → null. */
function base(name: string): string | null {
  if (name === 'gender') return null;
  return name.replace(/_(gender|dative)$/, '');
}

function bases(names: Iterable<string>): string[] {
  return [...new Set([...names].map(base).filter((n): n is string => n !== null))].sort();
}

function pluralCases(parts: readonly MessagePart[], out: Set<string>[] = []): Set<string>[] {
  for (const p of parts) {
    if (p.kind === 'plural') out.push(new Set(p.cases.keys()));
    if (p.kind === 'plural' || p.kind === 'select') for (const c of p.cases.values()) pluralCases(c, out);
  }
  return out;
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
        const mine = messageShape(parseMessage(text)).arguments;
        const english = messageShape(parseMessage(reference[key as keyof typeof reference])).arguments;
        expect(bases(mine.keys()), `${language} '${key}'`).toEqual(bases(english.keys()));
        for (const [name, kind] of english) if (mine.has(name) && kind === 'plural') expect(mine.get(name), `${language} '${key}' {${name}}`).toBe('plural');
      }
    });
    it(`${language}: plural messages cover every plural category of the language (CLDR)`, () => {
      const categories = new Intl.PluralRules(language).resolvedOptions().pluralCategories;
      for (const [key, text] of Object.entries(catalogue)) {
        for (const cases of pluralCases(parseMessage(text))) {
          // 'many' (Spanish and French, for millions) never occurs with counts of fingers, fists or days below a thousand.
          for (const c of categories) if (c !== 'many') expect(cases.has(c) || c === 'other', `${language} '${key}' lacks '${c}'`).toBe(true);
        }
      }
    });
    it(`${language}: no message has doubled punctuation or stray spaces`, () => {
      for (const [key, text] of Object.entries(catalogue)) {
        expect(text, `${language} '${key}'`).not.toMatch(/\.\.|,,|\s,|\s\.(?!\w)|\s$|^\s| {2}/);
      }
    });
  }
});

describe('message syntax', () => {
  it('reports a malformed message with its position', () => {
    expect(() => parseMessage('{count, plural, one {a}}')).toThrow(/needs an 'other' case/);
    expect(() => parseMessage('about {degrees°')).toThrow(/character 15/);
    expect(() => parseMessage('a } b')).toThrow(/unmatched/);
  });
});
