/**
 * Bulletin templates: a Markdown file whose front matter (YAML between two `---` lines) says what
 * the bulletin is, for which sites and for which weeks. Validation is strict and positioned: every
 * problem is a `GloamingError` naming `file:line:column` and the field.
 */
import { LANGUAGES, type Language } from '../../core/language/index.ts';
import { basename } from 'node:path';
import { GloamingError, didYouMean } from '../../core/errors.ts';
import { parseLocalDate } from '../../core/time.ts';
import { loadYaml, type YamlSource } from '../../core/yaml.ts';
import { assertTemplateSize } from './limits.ts';
import type { BulletinFrontMatter, BulletinTemplate } from './types.ts';

/** Default schedule of a standing weekly bulletin: the last 8 and the next 4 ISO weeks. */
export const DEFAULT_SCHEDULE = { every: 'week', past: 8, future: 4 } as const;
/** Largest `past` / `future` window, in weeks (two years either way). */
export const MAX_SCHEDULE_WEEKS = 104;

const FIELDS = ['title', 'description', 'sites', 'schedule', 'date', 'bodies', 'eclipse'] as const;
const SCHEDULE_FIELDS = ['every', 'past', 'future'] as const;
const SLUG_RE = /^[a-z0-9][a-z0-9-]*$/;

/** The language of a template whose file name names none (`weekly.md`). */
export const DEFAULT_LANGUAGE: Language = 'en';

function invalid(field: string, reason: string, actual: unknown, expected: string, hint?: string): never {
  throw new GloamingError('invalid-value', reason, { place: { field }, actual, expected, ...(hint ? { hint } : {}) });
}

function text(value: unknown, field: string, what: string): string {
  if (typeof value !== 'string' || value.trim() === '') invalid(field, `${field} must be non-empty text`, value, what);
  return value.trim();
}

function slugList(value: unknown, field: string, what: string): string[] {
  const list = typeof value === 'string' ? [value] : value;
  if (!Array.isArray(list) || list.length === 0) invalid(field, `${field} must be a list of ids`, value, what);
  const seen = new Set<string>();
  return list.map((item: unknown, i: number) => {
    const f = typeof value === 'string' ? field : `${field}.${i}`;
    if (typeof item !== 'string' || !SLUG_RE.test(item)) invalid(f, `${field} entries are lower-case ids`, item, "letters a–z, digits and hyphens, e.g. 'jupiter'");
    if (seen.has(item)) invalid(f, `'${item}' is listed twice in ${field}`, item, 'each id once');
    seen.add(item);
    return item;
  });
}

function weeksIn(value: unknown, field: string, fallback: number): number {
  if (value === undefined) return fallback;
  if (typeof value !== 'number' || !Number.isInteger(value) || value < 0 || value > MAX_SCHEDULE_WEEKS) {
    invalid(field, `${field} must be a whole number of weeks`, value, `an integer from 0 to ${MAX_SCHEDULE_WEEKS}`);
  }
  return value;
}

function rejectUnknown(o: Record<string, unknown>, allowed: readonly string[], prefix: string): void {
  for (const key of Object.keys(o)) {
    if (!allowed.includes(key)) {
      const hint = didYouMean(key, allowed);
      throw new GloamingError('unknown-field', `unknown front matter field '${prefix}${key}'`, {
        place: { field: `${prefix}${key}` },
        expected: `one of ${allowed.join(', ')}`,
        ...(hint ? { hint } : {}),
      });
    }
  }
}

/** Validates parsed front matter; errors name their field (the caller adds the line and column). */
export function validateFrontMatter(data: unknown): BulletinFrontMatter {
  if (typeof data !== 'object' || data === null || Array.isArray(data)) {
    invalid('', 'the front matter must be a mapping of fields', data, 'title, sites and either date or schedule');
  }
  const o = data as Record<string, unknown>;
  rejectUnknown(o, FIELDS, '');
  if (o.title === undefined || o.title === null) {
    throw new GloamingError('missing-field', "missing field 'title'", { place: { field: 'title' }, expected: 'the bulletin title as text' });
  }
  const fm: BulletinFrontMatter = { title: text(o.title, 'title', 'the bulletin title as text'), sites: 'all' };
  if (o.description !== undefined) fm.description = text(o.description, 'description', 'a one-line summary as text');
  if (o.sites === undefined || o.sites === null) {
    throw new GloamingError('missing-field', "missing field 'sites'", { place: { field: 'sites' }, expected: "'all' or a list of site ids" });
  }
  fm.sites = o.sites === 'all' ? 'all' : slugList(o.sites, 'sites', "'all' or a list of site ids such as [harbour-roof]");
  if (o.date !== undefined && o.schedule !== undefined) {
    invalid('schedule', 'a bulletin has either a date (one-off) or a schedule (standing weekly), not both', o.schedule, 'only one of date or schedule', 'remove one of them');
  }
  if (o.date !== undefined) {
    if (typeof o.date !== 'string') invalid('date', 'date must be a calendar date', o.date, 'YYYY-MM-DD, e.g. 2026-12-04');
    parseLocalDate(o.date, 'date');
    fm.date = o.date.trim();
  } else if (o.schedule !== undefined) {
    const s = o.schedule;
    if (typeof s !== 'object' || s === null || Array.isArray(s)) {
      invalid('schedule', 'schedule must be a mapping', s, '{ every: week, past: 8, future: 4 }');
    }
    const so = s as Record<string, unknown>;
    rejectUnknown(so, SCHEDULE_FIELDS, 'schedule.');
    if (so.every !== undefined && so.every !== 'week') invalid('schedule.every', 'only weekly schedules are supported', so.every, "'week'");
    fm.schedule = {
      every: 'week',
      past: weeksIn(so.past, 'schedule.past', DEFAULT_SCHEDULE.past),
      future: weeksIn(so.future, 'schedule.future', DEFAULT_SCHEDULE.future),
    };
  } else {
    throw new GloamingError('missing-field', 'a bulletin needs either a date or a schedule', {
      place: { field: 'schedule' },
      expected: 'date: YYYY-MM-DD for a one-off bulletin, or schedule: { every: week } for a standing weekly one',
    });
  }
  if (o.bodies !== undefined) fm.bodies = slugList(o.bodies, 'bodies', 'a list of body ids such as [jupiter, moon]');
  if (o.eclipse !== undefined) {
    if (typeof o.eclipse !== 'boolean') invalid('eclipse', 'eclipse must be true or false', o.eclipse, 'true or false');
    fm.eclipse = o.eclipse;
  }
  return fm;
}

/** Line and column of every field path the front matter writes (for errors raised later, e.g. unknown sites). */
function fieldPlaces(source: YamlSource, fm: BulletinFrontMatter): Record<string, { line: number; column: number }> {
  const out: Record<string, { line: number; column: number }> = {};
  const note = (field: string): void => {
    const p = source.locate(field);
    if (p.line !== undefined && p.column !== undefined) out[field] = { line: p.line, column: p.column };
  };
  for (const key of FIELDS) note(key);
  if (Array.isArray(fm.sites)) fm.sites.forEach((_, i) => note(`sites.${i}`));
  fm.bodies?.forEach((_, i) => note(`bodies.${i}`));
  return out;
}

/**
 * Parses a bulletin template. The file must start with a `---` line; the front matter ends at the
 * next `---` line. Errors carry `file:line:column` in the file's own numbering and the field.
 */
export function parseBulletin(text: string, file: string): BulletinTemplate {
  assertTemplateSize(text, file);
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  if (lines[0]?.trim() !== '---') {
    throw new GloamingError('missing-field', 'a bulletin template starts with front matter', {
      place: { file, line: 1, column: 1 },
      expected: "a first line '---', the YAML fields, then another '---' line",
    });
  }
  const end = lines.findIndex((line, i) => i > 0 && line.trim() === '---');
  if (end < 0) {
    throw new GloamingError('invalid-yaml', 'the front matter is not closed', {
      place: { file, line: lines.length, column: 1 },
      expected: "a line '---' after the front matter fields",
    });
  }
  // A leading newline makes the YAML's line numbers those of the file (the front matter starts on line 2).
  const source = loadYaml('\n' + lines.slice(1, end).join('\n'), file);
  let frontMatter: BulletinFrontMatter;
  try {
    frontMatter = validateFrontMatter(source.data ?? {});
  } catch (error) {
    if (error instanceof GloamingError) throw source.place(error);
    throw error;
  }
  const name = basename(file).replace(/\.(md|markdown)$/i, '');
  // `weekly.es.md`: the Spanish version of the bulletin `weekly` (a language the catalogues have).
  const [slug = '', suffix, ...rest] = name.split('.');
  if (!SLUG_RE.test(slug) || rest.length > 0) {
    throw new GloamingError('invalid-value', 'a bulletin file name is used in URLs and must be a lower-case slug', {
      place: { file },
      actual: name,
      expected: "letters a–z, digits and hyphens, with an optional language, e.g. 'weekly.md' or 'weekly.es.md'",
    });
  }
  if (suffix !== undefined && !(LANGUAGES as readonly string[]).includes(suffix)) {
    throw new GloamingError('invalid-value', `'${suffix}' in the file name is not a language gloaming has words for`, {
      place: { file },
      actual: suffix,
      expected: `one of ${LANGUAGES.join(', ')} (lib/core/language), e.g. 'weekly.es.md'`,
    });
  }
  return {
    file,
    slug,
    language: (suffix as Language | undefined) ?? DEFAULT_LANGUAGE,
    frontMatter,
    body: lines.slice(end + 1).join('\n'),
    bodyLine: end + 2,
    fieldPlaces: fieldPlaces(source, frontMatter),
  };
}

/** The place of a front matter field of `template` (falls back to the file). */
export function fieldPlace(template: BulletinTemplate, field: string): { file: string; line?: number; column?: number; field: string } {
  const p = template.fieldPlaces?.[field] ?? template.fieldPlaces?.[field.split('.')[0]!];
  return p ? { file: template.file, line: p.line, column: p.column, field } : { file: template.file, field };
}
