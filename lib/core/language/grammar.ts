/**
 * Grammar a message cannot express by itself: contractions of a preposition with the article that
 * begins the next name (Spanish de el → del, a el → al; French à le → au, de le → du, de les → des,
 * à les → aux, de Orion → d’Orion; German in dem → im, von dem → vom, an dem → am, zu dem → zum, zu der → zur), applied
 * to every formatted message. All are obligatory in the standard language (common usage, from
 * memory; RAE, Académie française and Duden grammars all state them).
 *
 * Spanish also reads "a la 1:05" but "a las 2:05": the article before a clock time agrees with
 * the hour (common usage, from memory).
 */
import type { Language } from './catalogue.ts';

type Rule = readonly [RegExp, string];

/** A rule matching whole words (JavaScript's \b knows only ASCII letters: 'à le' has none). */
function words(source: string): RegExp {
  return new RegExp(`(?<!\\p{L})${source}(?!\\p{L})`, 'gu');
}

const RULES: Readonly<Record<Language, readonly Rule[]>> = {
  en: [],
  es: [
    [words('([Dd])e el'), '$1el'],
    [words('([Aa]) el'), '$1l'],
    // "las 1:05" is always a clock time: a las, desde las, entre las, y las → la 1:05.
    [words('([Ll])as (0?1[:.]\\d)'), '$1a $2'],
  ],
  fr: [
    [words('à le'), 'au'],
    [words('à les'), 'aux'],
    [words('([Dd])e le'), '$1u'],
    [words('([Dd])e les'), '$1es'],
    // Elision before a vowel or a mute H: de Orion → d’Orion, que il → qu’il.
    [words('([Dd])e ([AEIOUÉÈÊaeiouéèêH])'), '$1’$2'],
  ],
  de: [
    [words('([Ii])n dem'), '$1m'],
    [words('([Vv])on dem'), '$1om'],
    [words('([Aa])n dem'), '$1m'],
    [words('([Zz])u dem'), '$1um'],
    [words('([Zz])u der'), '$1ur'],
  ],
};

/** Applies the language's contractions to a formatted message. */
export function applyGrammar(text: string, language: Language): string {
  let out = text;
  for (const [pattern, replacement] of RULES[language]) out = out.replace(pattern, replacement);
  return out;
}
