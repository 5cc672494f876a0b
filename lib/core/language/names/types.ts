/** The names of star patterns and bodies in one language, as labels and as sentences use them. */
import type { Gender } from '../index.ts';

export interface NameEntry {
  /** A label, without an article ("Osa Mayor", "Großer Wagen"): charts, headings. */
  name: string;
  /** The phrase inside a sentence, with the article the language puts there ("el Carro de la Osa Mayor"). */
  phrase: string;
  gender: Gender;
  /** German: the phrase in the dative ("dem Großen Wagen"); others leave it out. */
  dative?: string;
}

export interface PatternNames extends NameEntry {
  /** Each named part of the pattern as a sentence reads it ("la caja del Carro"). */
  parts?: Readonly<Record<string, Omit<NameEntry, 'name'>>>;
}

/** One language's names: where each comes from, patterns by id, bodies by id (sun, moon, planets). */
export interface LanguageNames {
  /** Where the names come from. */
  source: string;
  patterns: Readonly<Record<string, PatternNames>>;
  bodies: Readonly<Record<string, NameEntry>>;
}

type PartTuple = readonly [phrase: string, gender: Gender, dative?: string];

/** A pattern entry in short form: name, phrase, gender, (German) dative, parts. */
export function pattern(name: string, phrase: string, gender: Gender, dative?: string, parts?: Record<string, PartTuple>): PatternNames {
  const out: PatternNames = { name, phrase, gender, ...(dative ? { dative } : {}) };
  if (parts) out.parts = Object.fromEntries(Object.entries(parts).map(([k, [p, g, d]]) => [k, { phrase: p, gender: g, ...(d ? { dative: d } : {}) }]));
  return out;
}

/** A body entry: name (label), phrase, gender, (German) dative. */
export function body(name: string, phrase: string, gender: Gender, dative?: string): NameEntry {
  return { name, phrase, gender, ...(dative ? { dative } : {}) };
}
