/**
 * Which pages exist: a standing weekly template yields one page per site per ISO week around the
 * build date; a one-off template one page per site for its date's week. Pure: the build date is
 * an input (`today`), never read from the clock.
 */
import { findSite } from '../../models/content.ts';
import { GloamingError } from '../../core/errors.ts';
import type { Site } from '../../core/site.ts';
import { addDays, isoWeekOf, parseLocalDate, type IsoWeek } from '../../core/time.ts';
import { fieldPlace } from './frontmatter.ts';
import type { BulletinTemplate, PageSpec } from './types.ts';

export interface PagesOptions {
  /** All sites by id. */
  sites: Map<string, Site>;
  /** The build date, `YYYY-MM-DD` (local date of the build; its ISO week is "this week"). */
  today: string;
}

/** The ISO weeks of a template for a build date, oldest first. */
export function weeksFor(template: BulletinTemplate, today: string): IsoWeek[] {
  const fm = template.frontMatter;
  if (fm.date !== undefined) return [isoWeekOf(fm.date)];
  const schedule = fm.schedule ?? { every: 'week', past: 8, future: 4 };
  const weeks: IsoWeek[] = [];
  for (let k = -schedule.past; k <= schedule.future; k++) weeks.push(isoWeekOf(addDays(today, 7 * k)));
  return weeks;
}

/** The sites of a template, in id order; unknown ids are positioned `unknown-site` errors with a suggestion. */
export function sitesFor(template: BulletinTemplate, sites: Map<string, Site>): Site[] {
  const wanted = template.frontMatter.sites;
  if (wanted === 'all') return [...sites.keys()].sort().map((id) => sites.get(id)!);
  return wanted
    .map((id, i) => {
      try {
        return findSite(sites, id, { field: `sites.${i}` });
      } catch (error) {
        if (error instanceof GloamingError) throw error.at(fieldPlace(template, `sites.${i}`));
        throw error;
      }
    })
    .sort((a, b) => (a.id < b.id ? -1 : a.id > b.id ? 1 : 0));
}

/**
 * Every page of `templates` for the build date. Order: templates by slug, then sites by id, then
 * weeks oldest first — the same input always gives the same list. Two templates with one slug are
 * an error (they would write the same URL).
 */
export function pagesFor(templates: readonly BulletinTemplate[], options: PagesOptions): PageSpec[] {
  parseLocalDate(options.today, 'today');
  const bySlug = new Map<string, BulletinTemplate>();
  for (const t of templates) {
    const other = bySlug.get(t.slug);
    if (other) {
      throw new GloamingError('invalid-value', `two bulletin templates share the name '${t.slug}'`, {
        place: { file: t.file },
        actual: t.slug,
        expected: `a file name not used by ${other.file}`,
      });
    }
    bySlug.set(t.slug, t);
  }
  const pages: PageSpec[] = [];
  for (const slug of [...bySlug.keys()].sort()) {
    const template = bySlug.get(slug)!;
    const weeks = weeksFor(template, options.today);
    for (const site of sitesFor(template, options.sites)) {
      for (const week of weeks) pages.push({ template, site, week, path: `${site.id}/${week.id}/${template.slug}` });
    }
  }
  return pages;
}
