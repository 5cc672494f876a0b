/**
 * The error catalogue. Every problem gloaming reports is a `GloamingError` with a
 * permanent `code`, a message that says what is wrong and what would be right, and,
 * where it applies, the place it comes from: a file with line and column, or a field.
 *
 * Library code never throws strings; callers can rely on `instanceof GloamingError`
 * and read `code`, `place`, `actual` and `expected` to render their own messages.
 */

/** Where an input problem was found. All parts are optional; lines and columns are 1-based. */
export interface Place {
  /** File path, as given by the caller (relative paths are kept relative). */
  file?: string;
  line?: number;
  column?: number;
  /** Dotted field path inside a structured input, e.g. `sky.bortle` or `elements.eccentricity`. */
  field?: string;
}

/** Permanent error codes with a short title each. Add codes; never reuse or rename one. */
export const ERROR_CODES = {
  'invalid-value': 'A value is out of range or of the wrong kind',
  'missing-field': 'A required field is missing',
  'unknown-field': 'A field is not part of the schema',
  'unknown-body': 'No body or object has this id',
  'unknown-site': 'No site has this id',
  'unknown-zone': 'The time zone is not a known IANA zone',
  'invalid-date': 'A date or instant cannot be read',
  'invalid-yaml': 'A YAML file cannot be parsed',
  'invalid-argument': 'A command-line argument is wrong',
  'unknown-placeholder': 'A placeholder name is not known',
  'invalid-placeholder': 'A placeholder is malformed or has a wrong attribute',
  'unsafe-output': 'Built output contains a value that must never be published',
  'stale-elements': 'Satellite elements are too old (or too far ahead) for the requested dates',
} as const;

export type ErrorCode = keyof typeof ERROR_CODES;

/**
 * Exit codes of the command line and of the build, one convention for both (docs/deploy.md):
 * `input` for every `GloamingError` (wrong arguments, content or output that must not be
 * published: the message names the place), `unexpected` for anything else (a bug; the stack is printed).
 */
export const EXIT_CODES = { ok: 0, unexpected: 1, input: 2 } as const;

export interface GloamingErrorOptions {
  place?: Place;
  /** The offending value, as the user wrote it. */
  actual?: unknown;
  /** What would be right, in words ("a number from -90 to 90"). */
  expected?: string;
  /** A concrete suggestion ("did you mean 'jupiter'?"). */
  hint?: string;
  cause?: unknown;
  /** The words that frame the value and the expectation (default English, see `Wording`). */
  wording?: Wording;
}

/**
 * The words around a message's offending value and expectation: English "reason (got 'x');
 * expected y — hint" by default. Messages in a template's language give their own
 * (lib/outputs/bulletin/messages.ts); the punctuation that joins the parts stays the same.
 */
export interface Wording {
  /** The offending value's part, given the value as `quoteValue` shows it ("got 'x'"). */
  got(shown: string): string;
  /** The expectation's part ("expected a number from -90 to 90"). */
  expected(text: string): string;
  /** What stands for no value at all ("nothing"). */
  nothing: string;
}

/**
 * English, the wording of every message not written for a template's author (the same words as the
 * English catalogue's `err.got`, `err.expected` and `err.nothing`, which this layer cannot read).
 */
export const ENGLISH_WORDING: Wording = { got: (shown) => `got ${shown}`, expected: (text) => `expected ${text}`, nothing: 'nothing' };

/** Formats a place as `file:line:column` / `field`, the way compilers do. */
export function formatPlace(place: Place | undefined): string {
  if (!place) return '';
  const parts: string[] = [];
  if (place.file) {
    let loc = place.file;
    if (place.line !== undefined) {
      loc += `:${place.line}`;
      if (place.column !== undefined) loc += `:${place.column}`;
    }
    parts.push(loc);
  }
  if (place.field) parts.push(parts.length ? `field '${place.field}'` : place.field);
  return parts.join(' ');
}

/** Longest echo of an offending value in a message, characters; longer values are cut with "…". */
export const MAX_ECHO_CHARS = 80;

/**
 * A value as it appears in a message: strings in single quotes, everything else as JSON, cut to
 * `MAX_ECHO_CHARS` (a 100 KB argument or a whole file must not flood the terminal) with line
 * breaks and other control characters shown as `\n`, `\r`, `\t` or `\u00XX`, so the message stays one line.
 */
export function quoteValue(value: unknown, nothing = ENGLISH_WORDING.nothing): string {
  if (value === undefined) return nothing;
  let text: string;
  if (typeof value === 'string') text = value;
  else {
    try {
      text = JSON.stringify(value) ?? String(value);
    } catch {
      text = String(value);
    }
  }
  const chars = [...text];
  const cut = chars.length > MAX_ECHO_CHARS ? `${chars.slice(0, MAX_ECHO_CHARS - 1).join('')}…` : text;
  // eslint-disable-next-line no-control-regex
  const shown = cut.replace(/[\u0000-\u001f\u007f]/g, (c) => ({ '\n': '\\n', '\r': '\\r', '\t': '\\t' })[c] ?? `\\u${c.charCodeAt(0).toString(16).padStart(4, '0')}`);
  return typeof value === 'string' ? `'${shown}'` : shown;
}

/** An input problem with its place, the offending value and what was expected. */
export class GloamingError extends Error {
  override name = 'GloamingError';
  readonly code: ErrorCode;
  readonly place: Place | undefined;
  readonly actual: unknown;
  readonly expected: string | undefined;
  readonly hint: string | undefined;
  /** The message without the place prefix. */
  readonly reason: string;
  /** The message without the place prefix: reason, offending value, expectation and hint. */
  readonly detail: string;
  /** Whether an offending value was given (it may itself be `undefined`). */
  readonly hasActual: boolean;
  /** The words framing the value and the expectation (English unless the message is in a template's language). */
  readonly wording: Wording;

  constructor(code: ErrorCode, reason: string, options: GloamingErrorOptions = {}) {
    const where = formatPlace(options.place);
    const wording = options.wording ?? ENGLISH_WORDING;
    let text = reason;
    if ('actual' in options) text += ` (${wording.got(quoteValue(options.actual, wording.nothing))})`;
    if (options.expected) text += `; ${wording.expected(options.expected)}`;
    if (options.hint) text += ` — ${options.hint}`;
    super(where ? `${where}: ${text}` : text, options.cause === undefined ? undefined : { cause: options.cause });
    this.code = code;
    this.place = options.place;
    this.actual = options.actual;
    this.expected = options.expected;
    this.hint = options.hint;
    this.reason = reason;
    this.detail = text;
    this.hasActual = 'actual' in options;
    this.wording = wording;
  }

  /** A copy of this error placed inside a file (or a larger structure); its own line, column and field win. */
  at(outer: Place): GloamingError {
    const options: GloamingErrorOptions = { place: { ...outer, ...this.place }, cause: this.cause, wording: this.wording };
    if (this.hasActual) options.actual = this.actual;
    if (this.expected) options.expected = this.expected;
    if (this.hint) options.hint = this.hint;
    return new GloamingError(this.code, this.reason, options);
  }

}

/** Levenshtein distance, for "did you mean" suggestions. */
function editDistance(a: string, b: string): number {
  const row = Array.from({ length: b.length + 1 }, (_, j) => j);
  for (let i = 1; i <= a.length; i++) {
    let prev = row[0]!;
    row[0] = i;
    for (let j = 1; j <= b.length; j++) {
      const tmp = row[j]!;
      row[j] = Math.min(row[j]! + 1, row[j - 1]! + 1, prev + (a[i - 1] === b[j - 1] ? 0 : 1));
      prev = tmp;
    }
  }
  return row[b.length]!;
}

/** The closest candidate to `word`, if it is close enough to be a likely typo. */
export function closest(word: string, candidates: Iterable<string>): string | undefined {
  let best: string | undefined;
  let bestDistance = Infinity;
  const lower = word.toLowerCase();
  for (const candidate of candidates) {
    const d = editDistance(lower, candidate.toLowerCase());
    if (d < bestDistance) {
      bestDistance = d;
      best = candidate;
    }
  }
  return best !== undefined && bestDistance <= Math.max(2, Math.floor(word.length / 3)) ? best : undefined;
}

/** A "did you mean" hint, or undefined when nothing is close. */
export function didYouMean(word: string, candidates: Iterable<string>): string | undefined {
  const match = closest(word, candidates);
  return match ? `did you mean '${match}'?` : undefined;
}
