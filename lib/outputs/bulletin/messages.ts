/**
 * Messages for template authors, in the template's language (`weekly.es.md` → Spanish): every
 * problem of a bulletin template — errors in its front matter, placeholders, sections and links,
 * and the fallback, empty-section and page-size warnings — is worded from the `err.*` messages of
 * the catalogues (lib/core/language/catalogues/),
 * and so is the framing of the offending value and the expectation ("(got …); expected …",
 * `Wording` in lib/core/errors.ts). The place (`file:line:column`, the field) and the error's code
 * are the same in every language.
 *
 * Arguments are syntax or the author's own text (placeholder and attribute names, values as
 * written, allowed values such as `fri` or `naked-eye`, examples): they are put into the message
 * exactly as given, quotes included, after the language's grammar and punctuation rules have run
 * on the message's own words, so an echoed value is never changed.
 *
 * Problems not tied to a template (site and object YAML files, the centre's file, command-line
 * flags) stay English, like the command line's own text.
 */
import { GloamingError, closest, type ErrorCode, type GloamingErrorOptions, type Wording } from '../../core/errors.ts';
import { wordsFor, type Language, type MessageKey } from '../../core/language/index.ts';

/** The catalogue keys of messages for template authors. */
export type AuthorKey = Extract<MessageKey, `err.${string}`>;

/** Arguments of an author message: syntax and values as written, shown exactly as given. */
export type AuthorArguments = Readonly<Record<string, string | number>>;

/** A private-use character pair around an argument's index while the message is formatted. */
const OPEN = '\uE000';
const CLOSE = '\uE001';

/** A name, value or snippet as a message quotes it: `'jupiter'`. */
export function quoted(text: string): string {
  return `'${text}'`;
}

/** The messages of one language for template authors. */
export interface AuthorWords {
  readonly language: Language;
  /** How a problem frames its offending value and expectation in this language. */
  readonly wording: Wording;
  /** A message with its arguments. */
  say(key: AuthorKey, args?: AuthorArguments): string;
  /** A `GloamingError` worded in this language (`reason`, `expected` and `hint` as said by `say`). */
  error(code: ErrorCode, reason: string, options?: Omit<GloamingErrorOptions, 'wording'>): GloamingError;
  /** "did you mean 'x'?" for the closest candidate, or undefined when nothing is close. */
  didYouMean(word: string, candidates: Iterable<string>): string | undefined;
  /** "one of a, b, c" (the items are syntax, joined with commas). */
  oneOf(items: Iterable<string>): string;
  /** Syntax items joined the language's way ("seen and moon", "seen y moon"). */
  list(items: readonly string[]): string;
}

const cache = new Map<Language, AuthorWords>();

function makeAuthorWords(language: Language): AuthorWords {
  const words = wordsFor(language);
  const say = (key: AuthorKey, args: AuthorArguments = {}): string => {
    const names = Object.keys(args);
    const tokens = Object.fromEntries(names.map((name, i) => [name, `${OPEN}${i}${CLOSE}`]));
    let text = words.t(key, tokens);
    names.forEach((name, i) => {
      text = text.replaceAll(`${OPEN}${i}${CLOSE}`, String(args[name]));
    });
    return text;
  };
  const wording: Wording = { got: (shown) => say('err.got', { value: shown }), expected: (text) => say('err.expected', { expected: text }), nothing: say('err.nothing') };
  return {
    language,
    wording,
    say,
    error: (code, reason, options = {}) => new GloamingError(code, reason, { ...options, wording }),
    didYouMean(word, candidates) {
      const match = closest(word, candidates);
      return match === undefined ? undefined : say('err.did-you-mean', { name: quoted(match) });
    },
    oneOf: (items) => say('err.one-of', { list: [...items].join(', ') }),
    list: (items) => words.list(items),
  };
}

/** The author messages of `language` (English when none is given). */
export function authorWords(language: Language = 'en'): AuthorWords {
  let w = cache.get(language);
  if (!w) {
    w = makeAuthorWords(language);
    cache.set(language, w);
  }
  return w;
}
