/**
 * The message catalogues: one per language, each a table from a message key to an ICU
 * MessageFormat text (formatted by `intl-messageformat` in lib/core/language/index.ts). English (`catalogues/en.ts`) is the reference:
 * its keys are the type every other catalogue must fill, so a missing key fails the type check,
 * and test/language-catalogues.test.ts checks that every translation reads the same arguments.
 *
 * Adding a language: copy `catalogues/en.ts` to `catalogues/<code>.ts`, translate every message,
 * add it to `CATALOGUES` below and its grammar rules to lib/core/language/grammar.ts (or none), its
 * names to lib/core/language/names.ts, and golden sentences to test/language-golden.test.ts.
 */
import { en, type MessageKey } from './catalogues/en.ts';

export type { MessageKey };
export type Catalogue = Readonly<Record<MessageKey, string>>;

/** Languages with a catalogue (BCP 47 primary language subtags). */
export const LANGUAGES = ['en', 'es', 'de', 'fr'] as const;
export type Language = (typeof LANGUAGES)[number];

/** Each language's name in itself, for links between versions of a page ("Este boletín en English"). */
export const LANGUAGE_NAMES: Readonly<Record<Language, string>> = { en: 'English', es: 'español', de: 'Deutsch', fr: 'français' };

export { en };
