/**
 * Sentences of generated text: splitting (for chart captions, which repeat the alt text's first
 * sentence) and joining without doubled punctuation.
 *
 * Splitting uses `Intl.Segmenter` (Unicode UAX #29 sentence boundaries) and then joins back any
 * break that follows an abbreviation of the language, so "9:47 p. m." or "approx. 3°" never ends a
 * sentence: UAX #29 breaks after ". " before an upper-case letter, and clock times in Spanish
 * ("p. m.", "a. m."), English ("a.m.", "p.m.") and abbreviations such as "approx.", "ca.", "env."
 * end in a full stop. A sentence that really ends with such an abbreviation stays joined to the
 * next one: a caption one sentence too long is harmless, one cut in the middle is not.
 */
import type { Language } from './catalogue.ts';

/** Abbreviations after which a sentence never ends, per language (compared without case, NBSPs as spaces). */
export const NO_BREAK_AFTER: Readonly<Record<Language, readonly string[]>> = {
  en: ['a.m.', 'p.m.', 'a. m.', 'p. m.', 'approx.', 'ca.', 'c.', 'e.g.', 'i.e.', 'no.', 'vs.', 'mag.', 'st.', 'mt.'],
  es: ['a. m.', 'p. m.', 'a.m.', 'p.m.', 'aprox.', 'ca.', 'p. ej.', 'núm.', 'n.º', 'sr.', 'sra.', 'etc.'],
  de: ['ca.', 'etwa.', 'z. B.', 'bzw.', 'usw.', 'Nr.', 'd. h.', 'vgl.', 'St.'],
  fr: ['env.', 'ca.', 'approx.', 'p. ex.', 'n°', 'no.', 'St.', 'av.', 'apr.'],
};

const segmenters = new Map<Language, Intl.Segmenter>();

function normal(text: string): string {
  return text.replace(/[\u00a0\u202f]/g, ' ').toLowerCase();
}

/** Splits text into sentences, each with its trailing space trimmed; never after an abbreviation of the language. */
export function splitSentences(text: string, language: Language): string[] {
  let seg = segmenters.get(language);
  if (!seg) {
    seg = new Intl.Segmenter(language, { granularity: 'sentence' });
    segmenters.set(language, seg);
  }
  const abbreviations = NO_BREAK_AFTER[language].map(normal);
  const out: string[] = [];
  let pending = '';
  for (const { segment } of seg.segment(text)) {
    pending += segment;
    const end = normal(pending.trimEnd());
    if (abbreviations.some((a) => end.endsWith(a) && (end.length === a.length || !/\p{L}/u.test(end[end.length - a.length - 1]!)))) continue;
    out.push(pending.trim());
    pending = '';
  }
  if (pending.trim()) out.push(pending.trim());
  return out;
}

/** The first sentence of a text (the whole text when it has one). */
export function firstSentence(text: string, language: Language): string {
  return splitSentences(text, language)[0] ?? text;
}

/**
 * Ends a sentence with `mark` unless it already ends with a full stop, question or exclamation
 * mark (an abbreviation's full stop ends the sentence too: "… a las 9:47 p. m."), or with an
 * ellipsis: never "p. m..".
 */
export function endSentence(text: string, mark = '.'): string {
  const trimmed = text.trimEnd();
  return /[.!?…]$/u.test(trimmed) ? trimmed : trimmed + mark;
}

/**
 * Removes doubled punctuation that joining pieces of text can produce: "p. m.." → "p. m.",
 * ". ." → ".", ",," → ",", ", ." → ".", and spaces before a comma or full stop (French keeps its
 * no-break space before ":" ";" "?" "!"). An ellipsis "…" is left alone.
 */
export function tidyPunctuation(text: string): string {
  return text
    .replace(/\.(\s*\.)+(?!\.)/g, '.')
    .replace(/,(\s*,)+/g, ',')
    .replace(/,\s*\./g, '.')
    .replace(/[ \t]+([,.])/g, '$1');
}
