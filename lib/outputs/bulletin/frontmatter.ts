/**
 * Bulletin templates: a Markdown file whose front matter (YAML between two `---` lines) says what
 * the bulletin is, for which sites and for which weeks. Validation is strict and positioned: every
 * problem is a `GloamingError` naming `file:line:column` and the field.
 */
import { LANGUAGES, type Language } from '../../core/language/index.ts';
import { basename } from 'node:path';
import { GloamingError, quoteValue } from '../../core/errors.ts';
import { SUPPORTED_YEARS, parseLocalDate } from '../../core/time.ts';
import { loadYaml, type YamlSource } from '../../core/yaml.ts';
import { assertTemplateSize } from './limits.ts';
import { authorWords, quoted, type AuthorWords } from './messages.ts';
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

/** The checks of one template's front matter, worded in the template's language. */
class FrontMatterCheck {
  readonly words: AuthorWords;

  constructor(words: AuthorWords) {
    this.words = words;
  }

  invalid(field: string, reason: string, actual: unknown, expected: string, hint?: string): never {
    throw this.words.error('invalid-value', reason, { place: { field }, actual, expected, ...(hint ? { hint } : {}) });
  }

  missing(field: string, reason: string, expected: string): never {
    throw this.words.error('missing-field', reason, { place: { field }, expected });
  }

  text(value: unknown, field: string, what: string): string {
    if (typeof value !== 'string' || value.trim() === '') this.invalid(field, this.words.say('err.fm-non-empty-text', { field }), value, what);
    return value.trim();
  }

  slugList(value: unknown, field: string, what: string): string[] {
    const w = this.words;
    const list = typeof value === 'string' ? [value] : value;
    if (!Array.isArray(list) || list.length === 0) this.invalid(field, w.say('err.fm-list-of-ids', { field }), value, what);
    const seen = new Set<string>();
    return list.map((item: unknown, i: number) => {
      const f = typeof value === 'string' ? field : `${field}.${i}`;
      if (typeof item !== 'string' || !SLUG_RE.test(item)) this.invalid(f, w.say('err.fm-lower-case-ids', { field }), item, w.say('err.fm-slug', { example: quoted('jupiter') }));
      if (seen.has(item)) this.invalid(f, w.say('err.fm-listed-twice', { id: quoted(item), field }), item, w.say('err.fm-each-once'));
      seen.add(item);
      return item;
    });
  }

  weeksIn(value: unknown, field: string, fallback: number): number {
    if (value === undefined) return fallback;
    if (typeof value !== 'number' || !Number.isInteger(value) || value < 0 || value > MAX_SCHEDULE_WEEKS) {
      this.invalid(field, this.words.say('err.fm-whole-weeks', { field }), value, this.words.say('err.fm-integer-from', { min: 0, max: MAX_SCHEDULE_WEEKS }));
    }
    return value;
  }

  rejectUnknown(o: Record<string, unknown>, allowed: readonly string[], prefix: string): void {
    for (const key of Object.keys(o)) {
      if (!allowed.includes(key)) {
        const hint = this.words.didYouMean(key, allowed);
        throw this.words.error('unknown-field', this.words.say('err.fm-unknown-field', { field: quoted(`${prefix}${key}`) }), {
          place: { field: `${prefix}${key}` },
          expected: this.words.oneOf(allowed),
          ...(hint ? { hint } : {}),
        });
      }
    }
  }

  /** A calendar date; one gloaming cannot read or compute is `invalid-date` at `field`. */
  date(value: string, field: string): string {
    try {
      parseLocalDate(value, field);
    } catch (error) {
      if (!(error instanceof GloamingError)) throw error;
      const year = Number(/^\s*(\d{4})-\d{2}-\d{2}\s*$/.exec(value)?.[1]);
      const outside = year < SUPPORTED_YEARS.first || year > SUPPORTED_YEARS.last;
      throw this.words.error('invalid-date', this.words.say(outside ? 'err.fm-date-outside' : 'err.fm-date-unreadable', { value: quoteValue(value) }), {
        place: { field },
        expected: outside
          ? this.words.say('err.fm-date-range', { first: `${SUPPORTED_YEARS.first}-01-01`, last: `${SUPPORTED_YEARS.last}-12-31` })
          : this.words.say('err.fm-date-written', { example: '2026-12-04' }),
      });
    }
    return value.trim();
  }
}

/**
 * Validates parsed front matter; errors name their field (the caller adds the line and column) and
 * are worded in the template's language (`words`, English by default).
 */
export function validateFrontMatter(data: unknown, words: AuthorWords = authorWords()): BulletinFrontMatter {
  const c: FrontMatterCheck = new FrontMatterCheck(words);
  const w = words;
  if (typeof data !== 'object' || data === null || Array.isArray(data)) {
    c.invalid('', w.say('err.fm-mapping'), data, w.say('err.fm-mapping-expected', { title: 'title', sites: 'sites', date: 'date', schedule: 'schedule' }));
  }
  const o = data as Record<string, unknown>;
  c.rejectUnknown(o, FIELDS, '');
  const title = w.say('err.fm-title-text');
  if (o.title === undefined || o.title === null) c.missing('title', w.say('err.fm-missing-field', { field: quoted('title') }), title);
  const fm: BulletinFrontMatter = { title: c.text(o.title, 'title', title), sites: 'all' };
  if (o.description !== undefined) fm.description = c.text(o.description, 'description', w.say('err.fm-description-text'));
  if (o.sites === undefined || o.sites === null) c.missing('sites', w.say('err.fm-missing-field', { field: quoted('sites') }), w.say('err.fm-sites-missing', { all: quoted('all') }));
  fm.sites = o.sites === 'all' ? 'all' : c.slugList(o.sites, 'sites', w.say('err.fm-sites-expected', { all: quoted('all'), example: '[harbour-roof]' }));
  if (o.date !== undefined && o.schedule !== undefined) {
    c.invalid('schedule', w.say('err.fm-date-and-schedule'), o.schedule, w.say('err.fm-only-one', { date: 'date', schedule: 'schedule' }), w.say('err.fm-remove-one'));
  }
  if (o.date !== undefined) {
    if (typeof o.date !== 'string') c.invalid('date', w.say('err.fm-date-calendar', { field: 'date' }), o.date, w.say('err.fm-date-format', { example: '2026-12-04' }));
    fm.date = c.date(o.date, 'date');
  } else if (o.schedule !== undefined) {
    const s = o.schedule;
    if (typeof s !== 'object' || s === null || Array.isArray(s)) {
      c.invalid('schedule', w.say('err.fm-schedule-mapping', { field: 'schedule' }), s, '{ every: week, past: 8, future: 4 }');
    }
    const so = s as Record<string, unknown>;
    c.rejectUnknown(so, SCHEDULE_FIELDS, 'schedule.');
    if (so.every !== undefined && so.every !== 'week') c.invalid('schedule.every', w.say('err.fm-weekly-only'), so.every, quoted('week'));
    fm.schedule = {
      every: 'week',
      past: c.weeksIn(so.past, 'schedule.past', DEFAULT_SCHEDULE.past),
      future: c.weeksIn(so.future, 'schedule.future', DEFAULT_SCHEDULE.future),
    };
  } else {
    c.missing('schedule', w.say('err.fm-needs-date-or-schedule'), w.say('err.fm-date-or-schedule', { date: 'date: YYYY-MM-DD', schedule: 'schedule: { every: week }' }));
  }
  if (o.bodies !== undefined) fm.bodies = c.slugList(o.bodies, 'bodies', w.say('err.fm-bodies-expected', { example: '[jupiter, moon]' }));
  if (o.eclipse !== undefined) {
    if (typeof o.eclipse !== 'boolean') c.invalid('eclipse', w.say('err.fm-eclipse-boolean', { field: 'eclipse' }), o.eclipse, w.say('err.either', { first: 'true', second: 'false' }));
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
  const name = basename(file).replace(/\.(md|markdown)$/i, '');
  // `weekly.es.md`: the Spanish version of the bulletin `weekly` (a language the catalogues have).
  const [slug = '', suffix, ...rest] = name.split('.');
  const language = languageOf(suffix);
  const words = authorWords(language ?? DEFAULT_LANGUAGE);
  assertTemplateSize(text, file, words);
  const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
  const fence = quoted('---');
  if (lines[0]?.trim() !== '---') {
    throw words.error('missing-field', words.say('err.fm-starts'), {
      place: { file, line: 1, column: 1 },
      expected: words.say('err.fm-starts-expected', { fence }),
    });
  }
  const end = lines.findIndex((line, i) => i > 0 && line.trim() === '---');
  if (end < 0) {
    throw words.error('invalid-yaml', words.say('err.fm-not-closed'), {
      place: { file, line: lines.length, column: 1 },
      expected: words.say('err.fm-closing-line', { fence }),
    });
  }
  // A leading newline makes the YAML's line numbers those of the file (the front matter starts on line 2).
  const source = frontMatterYaml('\n' + lines.slice(1, end).join('\n'), file, words);
  let frontMatter: BulletinFrontMatter;
  try {
    frontMatter = validateFrontMatter(source.data ?? {}, words);
  } catch (error) {
    if (error instanceof GloamingError) throw source.place(error);
    throw error;
  }
  if (!SLUG_RE.test(slug) || rest.length > 0) {
    throw words.error('invalid-value', words.say('err.fm-file-name'), {
      place: { file },
      actual: name,
      expected: words.say('err.fm-file-name-expected', { example: quoted('weekly.md'), other: quoted('weekly.es.md') }),
    });
  }
  if (suffix !== undefined && language === null) {
    // No language to word this in: the file name names none gloaming has.
    throw new GloamingError('invalid-value', `'${suffix}' in the file name is not a language gloaming has words for`, {
      place: { file },
      actual: suffix,
      expected: `one of ${LANGUAGES.join(', ')} (lib/core/language), e.g. 'weekly.es.md'`,
    });
  }
  return {
    file,
    slug,
    language: language ?? DEFAULT_LANGUAGE,
    frontMatter,
    body: lines.slice(end + 1).join('\n'),
    bodyLine: end + 2,
    fieldPlaces: fieldPlaces(source, frontMatter),
  };
}

/**
 * The language the second part of a template's file name gives (`weekly.es.md` → es), `undefined`
 * when there is none (`weekly.md`, English) and null when it is not a language gloaming has.
 */
function languageOf(suffix: string | undefined): Language | null | undefined {
  if (suffix === undefined) return undefined;
  return (LANGUAGES as readonly string[]).includes(suffix) ? (suffix as Language) : null;
}

/** The front matter's YAML; a syntax error keeps the YAML reader's own (English) words inside the template's sentence. */
function frontMatterYaml(text: string, file: string, words: AuthorWords): YamlSource {
  try {
    return loadYaml(text, file);
  } catch (error) {
    if (!(error instanceof GloamingError) || error.code !== 'invalid-yaml') throw error;
    throw words.error('invalid-yaml', words.say('err.fm-yaml', { detail: error.reason.replace(/^YAML syntax error: /, '') }), {
      ...(error.place ? { place: error.place } : {}),
      expected: words.say('err.fm-yaml-expected'),
    });
  }
}

/** The place of a front matter field of `template` (falls back to the file). */
export function fieldPlace(template: BulletinTemplate, field: string): { file: string; line?: number; column?: number; field: string } {
  const p = template.fieldPlaces?.[field] ?? template.fieldPlaces?.[field.split('.')[0]!];
  return p ? { file: template.file, line: p.line, column: p.column, field } : { file: template.file, field };
}
