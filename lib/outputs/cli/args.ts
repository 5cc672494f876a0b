/**
 * Shared command-line argument handling: negative numbers after flags, numeric flags, required
 * flags, and the site given as `--site <id>` or as coordinates. Problems are `GloamingError`s
 * whose field is the flag (e.g. `--lat`), so the command prints "--lat: …" and exits with code 2.
 */
import { statSync } from 'node:fs';
import { resolve } from 'node:path';
import { findSite, loadSites } from '../../models/content.ts';
import { GloamingError } from '../../core/errors.ts';
import { defineSite, parseSkyArgument, type Site } from '../../core/site.ts';

/**
 * Joins a flag with a following value that begins with a single dash (`--lat -33.9` →
 * `--lat=-33.9`, `--lat -Infinity` → `--lat=-Infinity`), which `parseArgs` would otherwise read
 * as short options; the flag's own check then says what is wrong with the value.
 */
export function joinNegativeNumbers(args: string[]): string[] {
  const out: string[] = [];
  for (let i = 0; i < args.length; i++) {
    const a = args[i]!;
    const next = args[i + 1];
    if (/^--[a-z]/.test(a) && !a.includes('=') && next !== undefined && /^-[^-]/.test(next) && next !== '-h') {
      out.push(`${a}=${next}`);
      i++;
    } else out.push(a);
  }
  return out;
}

/** An argument problem naming its flag. */
export function argumentError(flag: string, reason: string, expected: string, actual?: unknown): GloamingError {
  return new GloamingError('invalid-argument', reason, { place: { field: flag }, expected, ...(actual !== undefined ? { actual } : {}) });
}

/** A decimal number as people write one: `52`, `-33.9`, `.5`, `1e3`; no hexadecimal, `Infinity` or blanks. */
const DECIMAL_RE = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** A numeric flag's value, or undefined when absent. */
export function numberFlag(text: string | undefined, flag: string, expected: string): number | undefined {
  if (text === undefined) return undefined;
  const n = Number(text);
  if (!DECIMAL_RE.test(text) || !Number.isFinite(n)) throw argumentError(flag, 'not a decimal number', expected, text);
  return n;
}

/** The path of an existing, readable regular file given to `flag`. */
export function fileFlag(path: string, flag: string, expected: string): string {
  let kind: string | null = null;
  try {
    const stats = statSync(path);
    if (!stats.isFile()) kind = stats.isDirectory() ? 'is a folder' : 'is not a regular file';
  } catch {
    kind = 'no such file';
  }
  if (kind) throw argumentError(flag, kind, expected, path);
  return path;
}

/** Flags that describe a site by coordinates; `--site` stands for all of them. */
const COORDINATE_FLAGS = ['lat', 'lon', 'elevation', 'tz', 'sky'] as const;

/** A flag that must be given. */
export function requireFlag<T>(value: T | undefined, flag: string, expected: string): T {
  if (value === undefined) throw argumentError(flag, 'is required', expected);
  return value;
}

/**
 * The site of a command: `--site <id>` from `content/sites/` (or `--content <dir>`), or
 * `--lat --lon [--elevation] [--tz] [--sky]`. Without `needZone` the zone defaults to UTC.
 */
export function siteFromFlags(values: Record<string, unknown>, options: { needZone: boolean }): Site {
  const contentDir = resolve(String(values.content ?? 'content'));
  if (typeof values.site === 'string') {
    const extra = COORDINATE_FLAGS.find((f) => values[f] !== undefined);
    if (extra) throw argumentError('--site', `--site and --${extra} exclude each other`, `either --site <id> or --lat/--lon/--elevation/--tz/--sky`);
    return findSite(loadSites(resolve(contentDir, 'sites')), values.site, { field: '--site' });
  }
  const latitude = requireFlag(numberFlag(values.lat as string | undefined, '--lat', 'degrees north, −90 to 90'), '--lat', 'degrees north, −90 to 90 (or --site <id>)');
  const longitude = requireFlag(numberFlag(values.lon as string | undefined, '--lon', 'degrees east, −180 to 180'), '--lon', 'degrees east, −180 to 180');
  const elevation = numberFlag(values.elevation as string | undefined, '--elevation', 'metres above sea level');
  const tz = options.needZone ? requireFlag(values.tz as string | undefined, '--tz', "an IANA time zone such as 'Europe/Berlin'") : 'UTC';
  return defineSite({
    latitude,
    longitude,
    ...(elevation !== undefined ? { elevation } : {}),
    timeZone: tz,
    ...(typeof values.sky === 'string' ? { sky: parseSkyArgument(values.sky) } : {}),
  });
}

/**
 * The flags of the commands that list what happens at a site over a date range (`events`,
 * `passes`): the site (by id or coordinates), the range, the content folder and the output form.
 */
export const SITE_RANGE_OPTIONS = {
  site: { type: 'string' },
  lat: { type: 'string' },
  lon: { type: 'string' },
  elevation: { type: 'string' },
  tz: { type: 'string' },
  sky: { type: 'string' },
  from: { type: 'string' },
  to: { type: 'string' },
  content: { type: 'string' },
  json: { type: 'boolean' },
  ics: { type: 'boolean' },
  now: { type: 'string' },
  help: { type: 'boolean', short: 'h' },
} as const;
