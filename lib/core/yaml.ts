/**
 * YAML loading with positions. `loadYaml` parses a file and returns its data together with
 * a `locate` function that maps a field path (e.g. `elements.eccentricity`, `horizon.3`) to
 * the line and column where that value is written, so validation errors can name the place.
 */
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { isMap, isSeq, LineCounter, parseDocument, type Node } from 'yaml';
import { GloamingError, type Place } from './errors.ts';

export interface YamlSource {
  /** The parsed data (plain objects, arrays, strings, numbers, booleans, null). */
  data: unknown;
  /** File name used in error places. */
  file: string;
  /** The place of a dotted field path; falls back to the nearest existing parent, then the file. */
  locate(field?: string): Place;
  /** Raises `error` placed at its field inside this file. */
  place(error: GloamingError): GloamingError;
}

/**
 * Parses YAML text. Syntax errors become a `GloamingError` with code `invalid-yaml` and the
 * line and column of the problem. Dates are kept as strings (YAML 1.2 core schema) so that the
 * caller decides how to read them.
 */
export function loadYaml(text: string, file: string): YamlSource {
  const lineCounter = new LineCounter();
  const doc = parseDocument(text, { lineCounter, prettyErrors: false, uniqueKeys: true, schema: 'core' });
  const first = doc.errors[0];
  if (first) {
    const pos = lineCounter.linePos(first.pos[0]);
    throw new GloamingError('invalid-yaml', `YAML syntax error: ${first.message.split('\n')[0]}`, {
      place: { file, line: pos.line, column: pos.col },
      expected: 'valid YAML (check indentation, colons and quotes)',
    });
  }
  const data: unknown = doc.toJS();

  const nodeAt = (field: string | undefined): Node | null => {
    let node: unknown = doc.contents;
    if (!field) return (node as Node | null) ?? null;
    let lastGood: Node | null = (node as Node | null) ?? null;
    for (const key of field.split('.')) {
      if (isMap(node)) {
        const pair = node.items.find((p) => String((p.key as { value?: unknown } | null)?.value ?? p.key) === key);
        if (!pair) return lastGood;
        node = pair.value ?? pair.key;
      } else if (isSeq(node)) {
        const item = node.items[Number(key)];
        if (item === undefined) return lastGood;
        node = item;
      } else {
        return lastGood;
      }
      if (node && typeof node === 'object' && 'range' in node) lastGood = node as Node;
    }
    return lastGood;
  };

  const locate = (field?: string): Place => {
    const node = nodeAt(field);
    const offset = node?.range?.[0];
    const place: Place = { file };
    if (field) place.field = field;
    if (offset !== undefined) {
      const pos = lineCounter.linePos(offset);
      place.line = pos.line;
      place.column = pos.col;
    }
    return place;
  };

  return {
    data,
    file,
    locate,
    place: (error) => error.at(locate(error.place?.field)),
  };
}

/**
 * Runs `validate` on a YAML source and re-raises any `GloamingError` with the file, line and
 * column of the field it names.
 */
export function validateYaml<T>(source: YamlSource, validate: (data: unknown) => T): T {
  try {
    return validate(source.data);
  } catch (error) {
    if (error instanceof GloamingError) throw source.place(error);
    throw error;
  }
}

/**
 * Every `*.yaml` file of a folder, sorted by name (so builds are deterministic). A folder that
 * cannot be read is an error naming it (a misspelt content folder must not build an empty site),
 * except a missing one when `optional` (objects are optional).
 */
export function yamlFiles(dir: string, options: { optional?: boolean } = {}): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch (error) {
    if (options.optional && (error as NodeJS.ErrnoException).code === 'ENOENT') return [];
    throw new GloamingError('invalid-argument', `cannot read the folder ${dir}`, {
      place: { file: dir },
      expected: 'a folder of YAML files (check the content folder given with --content)',
      cause: error,
    });
  }
  return names.filter((n) => /\.ya?ml$/.test(n)).sort().map((n) => join(dir, n));
}

