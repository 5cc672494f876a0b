/**
 * `gloaming objects add <line> | --file <F>`: imports comets and asteroids from the MPC's one-line
 * orbit formats or JPL SBDB element fields (lib/orbit/import.ts) into `content/objects/<id>.yaml`,
 * one file per object, each checked as the build checks object files. Prints the files written,
 * and a warning when a comet near perihelion has old elements (the one the build and `check` give).
 */
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { GloamingError } from '../../core/errors.ts';
import { parseObject, type SmallBodyObject } from '../../models/orbit/elements.ts';
import { objectYaml, readElements, type ImportedObject } from '../../models/orbit/import.ts';
import { checkObjects } from '../bulletin/check.ts';
import { formatProblem } from '../bulletin/problems.ts';
import { argumentError, fileFlag } from './args.ts';

export const OBJECTS_HELP = `gloaming objects add — import a comet's or an asteroid's orbital elements

Usage: gloaming objects add '<one line>' [--content <dir>] [--id <id>] [--force]
       gloaming objects add --file <F> [--content <dir>] [--force]

Reads, and tells apart by their layout:
  - an MPC one-line comet orbit (the lines of CometEls.txt / the MPC's comet element lists)
  - an MPC minor-planet orbit (the lines of MPCORB.DAT), with packed numbers, designations and epochs
  - JPL Small-Body Database elements: the SBDB API's JSON answer (a file), or name=value pairs
    (e=… q=… i=… om=… w=… tp=… [epoch=…] M1=… K1=…, or a=… ma=… epoch=… H=… G=… for an asteroid)
A file may hold many MPC lines: each becomes its own object file.

  --content <dir>   content folder (default ./content); files go to <dir>/objects/<id>.yaml
  --id <id>         the object's id (one object only; default: from its designation)
  --force           replace an existing object file (its names in other languages are kept)
  --today <date>    the date the age warning is judged on (default: today)

Each file records the source (format, reference) and the epoch. A comet within 120 days of
perihelion whose elements are more than 60 days old (or have no epoch) gets a warning, here and
in every build and gloaming check on such a date.`;

/** The `names` of the object file a forced import replaces, or undefined when it has none (or cannot be read). */
function previousNames(file: string): SmallBodyObject['names'] {
  try {
    return parseObject(readFileSync(file, 'utf8'), file).names;
  } catch (error) {
    if (error instanceof GloamingError) return undefined;
    throw error;
  }
}

function linesOf(text: string): string[] {
  const trimmed = text.trim();
  if (trimmed.startsWith('{')) return [trimmed];
  return text.split(/\r?\n/).filter((l) => l.trim() !== '' && !l.startsWith('#'));
}

/** Runs `objects add`; `today` (YYYY-MM-DD) judges the age of comet elements. */
export function runObjects(argv: string[], out: (s: string) => void, context: { today?: string }): number {
  const [sub, ...rest] = argv;
  if (!sub || sub === '--help' || sub === '-h') {
    out(OBJECTS_HELP);
    return sub ? 0 : 2;
  }
  if (sub !== 'add') throw argumentError('<subcommand>', `unknown subcommand '${sub}'`, "'add'", sub);
  const { values, positionals } = parseArgs({
    args: rest,
    options: { file: { type: 'string' }, content: { type: 'string' }, id: { type: 'string' }, force: { type: 'boolean' }, today: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
    allowPositionals: true,
    strict: true,
  });
  if (values.help) {
    out(OBJECTS_HELP);
    return 0;
  }
  if (values.file !== undefined && positionals.length) throw argumentError('--file', '--file and a line exclude each other', "either '<line>' or --file <F>");
  if (values.file === undefined && positionals.length !== 1) throw argumentError('<line>', positionals.length ? 'give the line as one argument (in quotes)' : 'is required', "an element line in quotes, or --file <F>");
  const source = values.file === undefined ? null : fileFlag(values.file, '--file', 'a file of element lines or an SBDB JSON answer');
  const lines = source === null ? [positionals[0]!] : linesOf(readFileSync(source, 'utf8'));
  if (lines.length === 0) throw argumentError('--file', 'the file holds no element lines', 'one element line per object', source);
  if (values.id !== undefined && lines.length > 1) throw argumentError('--id', `the file holds ${lines.length} objects`, 'one object per --id (leave --id out to name them by designation)');
  const dir = resolve(values.content ?? 'content', 'objects');
  const today = values.today ?? context.today;

  // Read and check everything first: nothing is written when any line is wrong.
  const objects: { object: ImportedObject; parsed: SmallBodyObject; file: string; text: string }[] = [];
  lines.forEach((line, index) => {
    try {
      const { object } = readElements(line);
      if (values.id !== undefined) object.id = values.id;
      const file = join(dir, `${object.id}.yaml`);
      // Replacing a file (--force) keeps what the element line cannot give: the names in other languages.
      if (values.force && existsSync(file)) {
        const names = previousNames(file);
        if (names) object.names = names;
      }
      const text = objectYaml(object);
      const parsed = parseObject(text, relative(process.cwd(), file)); // the build's own checks
      if (existsSync(file) && !values.force) throw argumentError('--force', `${relative(process.cwd(), file)} exists`, 'a new id (--id), or --force to replace it');
      objects.push({ object, parsed, file, text });
    } catch (error) {
      if (error instanceof GloamingError && source !== null && !error.place?.file) {
        throw error.at({ file: source, line: index + 1 });
      }
      throw error;
    }
  });
  mkdirSync(dir, { recursive: true });
  for (const { object, file, text } of objects) {
    writeFileSync(file, text);
    out(`wrote ${relative(process.cwd(), file)}: ${object.name} (${object.kind}; ${object.source})`);
  }
  // The build's and check's own warning on old comet elements, placed in the files just written.
  if (today) for (const p of checkObjects(objects.map((o) => o.parsed), { today }).items) out(formatProblem(p));
  return 0;
}
