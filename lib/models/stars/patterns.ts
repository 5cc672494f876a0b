/**
 * Star patterns (asterisms and bright constellation figures) from lib/models/stars/patterns.yaml, with
 * the schema that file must follow. Stars are Hipparcos numbers of the bright-star table
 * (lib/models/stars/catalogue.ts); the validator checks that every star exists there, that every line
 * and part uses listed stars, and that ids are unique.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { GloamingError, didYouMean } from '../../core/errors.ts';
import { loadYaml, type YamlSource } from '../../core/yaml.ts';
import { starByHip } from './catalogue.ts';

/** How well a reader is expected to know a pattern: 1 most beginners, 2 regular stargazers, 3 needs a chart. */
export type Familiarity = 1 | 2 | 3;

export interface StarPattern {
  /** Unique kebab-case id ("big-dipper"). */
  id: string;
  /** Short display name ("Big Dipper"). */
  name: string;
  /** The name as it reads inside a sentence ("the Big Dipper"). */
  sentenceName: string;
  familiarity: Familiarity;
  /** Hipparcos numbers of the pattern's stars. */
  stars: number[];
  /** Pairs of Hipparcos numbers joined by a line. */
  lines: [number, number][];
  /** Named parts ("bowl", "handle") → Hipparcos numbers; empty when the pattern has none. */
  parts: Record<string, number[]>;
  /** Part name → how it reads in a sentence; parts without one read "the <part> of <sentenceName>". */
  partPhrases: Record<string, string>;
}

const PATTERN_FIELDS = ['id', 'name', 'sentenceName', 'familiarity', 'stars', 'lines', 'parts', 'partPhrases'];
const ID_PATTERN = /^[a-z][a-z0-9]*(-[a-z0-9]+)*$/;

/** How a part of a pattern reads inside a sentence ("the bowl of the Big Dipper"). */
export function partPhrase(pattern: StarPattern, part: string): string {
  return pattern.partPhrases[part] ?? `the ${part} of ${pattern.sentenceName}`;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}

/**
 * Checks parsed pattern data against the schema and the bright-star table. Returns every problem
 * found (an empty list when the data is valid), each a `GloamingError` placed at its field
 * (`patterns.3.lines.2`), and placed in the file when `source` is given.
 */
export function checkPatterns(data: unknown, source?: YamlSource): { patterns: StarPattern[]; errors: GloamingError[] } {
  const errors: GloamingError[] = [];
  const fail = (code: 'invalid-value' | 'missing-field' | 'unknown-field', field: string, reason: string, extra: { actual?: unknown; expected?: string; hint?: string } = {}): void => {
    const error = new GloamingError(code, reason, { place: { field }, ...extra });
    errors.push(source ? source.place(error) : error);
  };
  const patterns: StarPattern[] = [];
  if (!isRecord(data) || !Array.isArray(data['patterns'])) {
    fail('missing-field', 'patterns', 'The patterns file must have a list named patterns', { expected: 'patterns: [ ... ]' });
    return { patterns, errors };
  }
  const seen = new Set<string>();
  data['patterns'].forEach((raw: unknown, index: number) => {
    const at = `patterns.${index}`;
    if (!isRecord(raw)) {
      fail('invalid-value', at, 'A pattern must be a mapping', { actual: raw, expected: 'id, name, familiarity, stars, lines' });
      return;
    }
    for (const key of Object.keys(raw)) {
      if (!PATTERN_FIELDS.includes(key)) {
        const hint = didYouMean(key, PATTERN_FIELDS);
        fail('unknown-field', `${at}.${key}`, 'This field is not part of the pattern schema', { actual: key, expected: PATTERN_FIELDS.join(', '), ...(hint ? { hint } : {}) });
      }
    }
    const errorsBefore = errors.length;
    const id = raw['id'];
    if (typeof id !== 'string' || !ID_PATTERN.test(id)) {
      fail(id === undefined ? 'missing-field' : 'invalid-value', `${at}.id`, 'A pattern needs a kebab-case id', { actual: id, expected: 'lower-case words joined by hyphens, e.g. big-dipper' });
    } else if (seen.has(id)) {
      fail('invalid-value', `${at}.id`, 'Two patterns have the same id', { actual: id, expected: 'a unique id' });
    } else {
      seen.add(id);
    }
    const name = raw['name'];
    if (typeof name !== 'string' || !name.trim()) {
      fail(name === undefined ? 'missing-field' : 'invalid-value', `${at}.name`, 'A pattern needs a short name', { actual: name, expected: 'a non-empty string' });
    }
    const sentenceName = raw['sentenceName'];
    if (sentenceName !== undefined && (typeof sentenceName !== 'string' || !sentenceName.trim())) {
      fail('invalid-value', `${at}.sentenceName`, 'sentenceName must be a non-empty string', { actual: sentenceName });
    }
    const familiarity = raw['familiarity'];
    if (familiarity !== 1 && familiarity !== 2 && familiarity !== 3) {
      fail(familiarity === undefined ? 'missing-field' : 'invalid-value', `${at}.familiarity`, 'familiarity must be 1, 2 or 3', { actual: familiarity, expected: '1 (beginners know it), 2 (regular stargazers) or 3 (needs a chart)' });
    }
    const starsRaw = raw['stars'];
    const members = new Set<number>();
    if (!Array.isArray(starsRaw) || starsRaw.length === 0) {
      fail(starsRaw === undefined ? 'missing-field' : 'invalid-value', `${at}.stars`, 'A pattern needs a list of Hipparcos numbers', { actual: starsRaw, expected: 'a non-empty list of integers' });
    } else {
      starsRaw.forEach((hip: unknown, i: number) => {
        if (typeof hip !== 'number' || !Number.isInteger(hip) || hip <= 0) {
          fail('invalid-value', `${at}.stars.${i}`, 'A star must be a Hipparcos number', { actual: hip, expected: 'a positive integer' });
        } else if (members.has(hip)) {
          fail('invalid-value', `${at}.stars.${i}`, 'A star is listed twice in this pattern', { actual: hip });
        } else if (!starByHip(hip)) {
          fail('invalid-value', `${at}.stars.${i}`, 'This Hipparcos number is not in the bright-star table', { actual: hip, hint: 'run node scripts/build-stars.ts after adding a pattern star' });
        } else {
          members.add(hip);
        }
      });
    }
    const memberList = (value: unknown, field: string, minLength: number, what: string): number[] => {
      if (!Array.isArray(value) || value.length < minLength) {
        fail('invalid-value', field, `${what} must be a list of at least ${minLength} of the pattern's stars`, { actual: value });
        return [];
      }
      value.forEach((hip: unknown, i: number) => {
        if (typeof hip !== 'number' || !members.has(hip)) {
          fail('invalid-value', `${field}.${i}`, `${what} uses a star that is not in the pattern's stars`, { actual: hip, expected: "one of the pattern's stars" });
        }
      });
      return value as number[];
    };
    const linesRaw = raw['lines'];
    const lines: [number, number][] = [];
    if (!Array.isArray(linesRaw)) {
      fail(linesRaw === undefined ? 'missing-field' : 'invalid-value', `${at}.lines`, 'A pattern needs a list of lines', { actual: linesRaw, expected: 'pairs of Hipparcos numbers, e.g. [[54061, 53910]]' });
    } else {
      linesRaw.forEach((pair: unknown, i: number) => {
        const field = `${at}.lines.${i}`;
        if (!Array.isArray(pair) || pair.length !== 2) {
          fail('invalid-value', field, 'A line must join exactly two stars', { actual: pair, expected: 'a pair [hip, hip]' });
          return;
        }
        const [a, b] = memberList(pair, field, 2, 'A line') as [number, number];
        if (a === b) fail('invalid-value', field, 'A line joins a star to itself', { actual: pair });
        lines.push([a, b]);
      });
    }
    const parts: Record<string, number[]> = {};
    const partsRaw = raw['parts'];
    if (partsRaw !== undefined) {
      if (!isRecord(partsRaw)) {
        fail('invalid-value', `${at}.parts`, 'parts must map part names to lists of stars', { actual: partsRaw });
      } else {
        for (const [part, list] of Object.entries(partsRaw)) parts[part] = memberList(list, `${at}.parts.${part}`, 1, 'A part');
      }
    }
    const partPhrases: Record<string, string> = {};
    const phrasesRaw = raw['partPhrases'];
    if (phrasesRaw !== undefined) {
      if (!isRecord(phrasesRaw)) {
        fail('invalid-value', `${at}.partPhrases`, 'partPhrases must map part names to phrases', { actual: phrasesRaw });
      } else {
        for (const [part, phrase] of Object.entries(phrasesRaw)) {
          if (!(part in parts)) {
            const hint = didYouMean(part, Object.keys(parts));
            fail('invalid-value', `${at}.partPhrases.${part}`, 'A phrase is given for a part the pattern does not have', { actual: part, ...(hint ? { hint } : {}) });
          } else if (typeof phrase !== 'string' || !phrase.trim()) {
            fail('invalid-value', `${at}.partPhrases.${part}`, 'A part phrase must be a non-empty string', { actual: phrase });
          } else {
            partPhrases[part] = phrase;
          }
        }
      }
    }
    if (errors.length === errorsBefore) {
      patterns.push({
        id: id as string,
        name: name as string,
        sentenceName: typeof sentenceName === 'string' ? sentenceName : (name as string),
        familiarity: familiarity as Familiarity,
        stars: [...members],
        lines,
        parts,
        partPhrases,
      });
    }
  });
  return { patterns, errors };
}

/** Path of the bundled patterns file. */
export const PATTERNS_FILE = fileURLToPath(new URL('./patterns.yaml', import.meta.url));

let cache: StarPattern[] | null = null;

/**
 * The bundled star patterns, validated. Throws the first `GloamingError` (placed at its line and
 * column in patterns.yaml) when the file does not follow the schema.
 */
export function patterns(): readonly StarPattern[] {
  if (cache) return cache;
  const source = loadYaml(readFileSync(PATTERNS_FILE, 'utf8'), 'lib/models/stars/patterns.yaml');
  const { patterns: list, errors } = checkPatterns(source.data, source);
  if (errors[0]) throw errors[0];
  cache = list;
  return cache;
}

/** The pattern with this id; throws a `GloamingError` ('invalid-value') with a "did you mean" hint otherwise. */
export function patternById(id: string): StarPattern {
  const list = patterns();
  const found = list.find((p) => p.id === id);
  if (found) return found;
  const hint = didYouMean(id, list.map((p) => p.id));
  throw new GloamingError('invalid-value', 'No star pattern has this id', { actual: id, expected: 'a pattern id such as big-dipper', ...(hint ? { hint } : {}) });
}
