/**
 * Names of star patterns, their parts and the bodies in the reader's language, as sentences use
 * them (`NamePhrase`: phrase, gender, German dative) and as labels. English reads the names of
 * lib/stars/patterns.yaml and lib/body.ts themselves; other languages their table here, falling
 * back to the English name (an IAU name, a comet's) when the table has none.
 */
import type { Language, NamePhrase } from '../index.ts';
import { de } from './de.ts';
import { es } from './es.ts';
import { fr } from './fr.ts';
import type { LanguageNames } from './types.ts';

export type { LanguageNames };

/** Name tables for the languages other than English. */
export const NAMES: Readonly<Record<Exclude<Language, 'en'>, LanguageNames>> = { es, de, fr };

/** What the English names give: the pattern's id, label and phrase ("Big Dipper", "the Big Dipper"). */
export interface EnglishPattern {
  id: string;
  name: string;
  sentenceName: string;
}

/** A pattern's phrase inside a sentence ("the Big Dipper", "el Carro de la Osa Mayor", "der Große Wagen"). */
export function patternPhrase(language: Language, pattern: EnglishPattern): NamePhrase {
  const entry = language === 'en' ? undefined : NAMES[language].patterns[pattern.id];
  if (!entry) return { text: pattern.sentenceName, gender: 'masculine' };
  return { text: entry.phrase, gender: entry.gender, ...(entry.dative ? { dative: entry.dative } : {}) };
}

/** A pattern's label on a chart ("Big Dipper", "Carro de la Osa Mayor"). */
export function patternLabel(language: Language, pattern: EnglishPattern): string {
  return (language === 'en' ? undefined : NAMES[language].patterns[pattern.id]?.name) ?? pattern.name;
}

/** A part of a pattern inside a sentence; `english` is the English phrase ("the bowl of the Big Dipper"). */
export function partPhrase(language: Language, pattern: EnglishPattern, part: string, english: string): NamePhrase {
  const entry = language === 'en' ? undefined : NAMES[language].patterns[pattern.id]?.parts?.[part];
  if (!entry) return { text: english, gender: 'masculine' };
  return { text: entry.phrase, gender: entry.gender, ...(entry.dative ? { dative: entry.dative } : {}) };
}

/** What the English names give for a body: its id, its name and how a sentence reads it ("the Moon"). */
export interface EnglishBody {
  id: string;
  name: string;
  /** The body's own names in other languages (deep-sky objects carry theirs), used when the table has none. */
  localNames?: Readonly<Partial<Record<string, string>>>;
}

const ENGLISH_PHRASE: Readonly<Record<string, string>> = { sun: 'the Sun', moon: 'the Moon' };

/** A body's phrase inside a sentence ("the Moon", "la Luna", "Júpiter"); other bodies keep their own name. */
export function bodyPhrase(language: Language, body: EnglishBody): NamePhrase {
  const entry = language === 'en' ? undefined : NAMES[language].bodies[body.id];
  if (!entry) return { text: ENGLISH_PHRASE[body.id] ?? body.localNames?.[language] ?? body.name, gender: 'masculine' };
  return { text: entry.phrase, gender: entry.gender, ...(entry.dative ? { dative: entry.dative } : {}) };
}

/** A body's label ("Moon", "Luna", "Júpiter"). */
export function bodyLabel(language: Language, body: EnglishBody): string {
  return (language === 'en' ? undefined : NAMES[language].bodies[body.id]?.name ?? body.localNames?.[language]) ?? body.name;
}
