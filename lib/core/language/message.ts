/**
 * Messages in the ICU MessageFormat syntax (the subset gloaming's sentences need), evaluated with
 * the platform's `Intl.PluralRules` and `Intl.NumberFormat`:
 *
 *   text with {name} arguments
 *   {count, plural, =0 {…} one {# finger} other {# fingers}}   (# is the count in the language's digits)
 *   {gender, select, masculine {el {name}} feminine {la {name}} other {{name}}}
 *
 * Why not a MessageFormat library: the sentences need simple arguments, plural categories (which
 * `Intl.PluralRules` gives for every language, French's "one" for 0 and 1 included) and select on a
 * pattern name's grammatical gender and number; numbers, dates, lists and directions go through
 * `Intl` directly (lib/core/language/formatter.ts). That is about a hundred lines, tested, with no
 * package to keep in step. Apostrophes are plain text (French elisions read naturally:
 * "l'Ourse"); braces cannot appear in text.
 */
import { GloamingError } from '../errors.ts';

export type MessagePart =
  | { kind: 'text'; value: string }
  | { kind: 'argument'; name: string }
  | { kind: 'pound' }
  | { kind: 'plural'; name: string; cases: Map<string, MessagePart[]> }
  | { kind: 'select'; name: string; cases: Map<string, MessagePart[]> };

export type MessageArguments = Readonly<Record<string, string | number>>;

/** Every argument a message reads, with how it reads it ('text', 'plural' or 'select'), and the select keys it offers. */
export interface MessageShape {
  arguments: Map<string, 'text' | 'plural' | 'select'>;
}

function fail(source: string, at: number, what: string): never {
  throw new GloamingError('invalid-value', `message '${source}' at character ${at + 1}: ${what}`, {
    expected: "ICU MessageFormat text: {name}, {n, plural, one {…} other {…}} or {g, select, feminine {…} other {…}}",
  });
}

/** Parses a message; throws with the character position when it is malformed. */
export function parseMessage(source: string): MessagePart[] {
  let i = 0;
  const readName = (): string => {
    const m = /^\s*([A-Za-z][A-Za-z0-9_]*)\s*/.exec(source.slice(i));
    if (!m) fail(source, i, 'expected an argument name');
    i += m[0].length;
    return m[1]!;
  };
  const parse = (inPlural: boolean, nested: boolean): MessagePart[] => {
    const parts: MessagePart[] = [];
    let text = '';
    const flush = (): void => {
      if (text) parts.push({ kind: 'text', value: text });
      text = '';
    };
    while (i < source.length) {
      const c = source[i]!;
      if (c === '}') {
        if (!nested) fail(source, i, "unmatched '}'");
        break;
      }
      if (c === '#' && inPlural) {
        flush();
        parts.push({ kind: 'pound' });
        i++;
        continue;
      }
      if (c !== '{') {
        text += c;
        i++;
        continue;
      }
      flush();
      i++;
      const name = readName();
      if (source[i] === '}') {
        parts.push({ kind: 'argument', name });
        i++;
        continue;
      }
      if (source[i] !== ',') fail(source, i, "expected ',' or '}' after the argument name");
      i++;
      const type = readName();
      if (type !== 'plural' && type !== 'select') fail(source, i, `unknown argument type '${type}' (plural or select)`);
      if (source[i] !== ',') fail(source, i, `expected ',' after '${type}'`);
      i++;
      const cases = new Map<string, MessagePart[]>();
      for (;;) {
        const m = /^\s*(=\d+|[A-Za-z][A-Za-z0-9_-]*)\s*/.exec(source.slice(i));
        if (!m) break;
        i += m[0].length;
        if (source[i] !== '{') fail(source, i, `expected '{' after case '${m[1]}'`);
        i++;
        cases.set(m[1]!, parse(type === 'plural', true));
        if (source[i] !== '}') fail(source, i, `case '${m[1]}' is not closed`);
        i++;
      }
      while (source[i] === ' ') i++;
      if (source[i] !== '}') fail(source, i, `expected '}' to close the ${type}`);
      i++;
      if (!cases.has('other')) fail(source, i, `a ${type} needs an 'other' case`);
      parts.push({ kind: type, name, cases });
    }
    flush();
    return parts;
  };
  const parts = parse(false, false);
  if (i < source.length) fail(source, i, "unmatched '}'");
  return parts;
}

/** The arguments a parsed message reads, with their kind (for the catalogue parity test and for checks at load). */
export function messageShape(parts: readonly MessagePart[]): MessageShape {
  const args = new Map<string, 'text' | 'plural' | 'select'>();
  const walk = (ps: readonly MessagePart[]): void => {
    for (const p of ps) {
      if (p.kind === 'argument') {
        if (!args.has(p.name)) args.set(p.name, 'text');
      } else if (p.kind === 'plural' || p.kind === 'select') {
        args.set(p.name, p.kind);
        for (const c of p.cases.values()) walk(c);
      }
    }
  };
  walk(parts);
  return { arguments: args };
}

export interface MessageContext {
  plural: Intl.PluralRules;
  number: (value: number) => string;
}

/** Evaluates a parsed message with its arguments; a missing argument is an error naming it (never "undefined" on a page). */
export function formatParts(parts: readonly MessagePart[], args: MessageArguments, context: MessageContext, key: string, pound?: number): string {
  let out = '';
  for (const p of parts) {
    switch (p.kind) {
      case 'text':
        out += p.value;
        break;
      case 'pound':
        out += context.number(pound ?? 0);
        break;
      case 'argument': {
        const v = args[p.name];
        if (v === undefined) throw new GloamingError('invalid-value', `message '${key}' needs the argument '${p.name}'`, { actual: Object.keys(args) });
        out += typeof v === 'number' ? context.number(v) : v;
        break;
      }
      case 'plural': {
        const v = args[p.name];
        if (typeof v !== 'number') throw new GloamingError('invalid-value', `message '${key}' needs a number for '${p.name}'`, { actual: v });
        const chosen = p.cases.get(`=${v}`) ?? p.cases.get(context.plural.select(v)) ?? p.cases.get('other')!;
        out += formatParts(chosen, args, context, key, v);
        break;
      }
      case 'select': {
        const v = args[p.name];
        if (v === undefined) throw new GloamingError('invalid-value', `message '${key}' needs the argument '${p.name}'`, { actual: Object.keys(args) });
        out += formatParts(p.cases.get(String(v)) ?? p.cases.get('other')!, args, context, key, pound);
        break;
      }
    }
  }
  return out;
}
