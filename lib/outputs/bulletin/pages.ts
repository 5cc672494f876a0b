/**
 * Which pages exist: a standing weekly template yields one page per site per ISO week around the
 * build date; a one-off template one page per site for its date's week. Pure: the build date is
 * an input (`today`), never read from the clock.
 */
import { GloamingError, type Place } from '../../core/errors.ts';
import type { Site } from '../../core/site.ts';
import { addDays, isoWeekOf, parseLocalDate, type IsoWeek } from '../../core/time.ts';
import { fieldPlace } from './frontmatter.ts';
import { authorWords, quoted, type AuthorWords } from './messages.ts';
import { catalogueLanguage, type Language } from '../../core/language/index.ts';

import type { BulletinTemplate, PageSpec } from './types.ts';

/** A locale for a page in `language` at a site with `siteLocale`: the language with the site's region (`en` at `es-CL` → `en-CL`), or the bare language. */
export function localeFor(language: Language, siteLocale: string): string {
  const region = new Intl.Locale(siteLocale).region;
  return region ? `${language}-${region}` : language;
}

/**
 * The site as a page of `template` sees it: the site itself when the template is in the site's
 * language, else the site with the locale of the template's language and the site's region (an
 * English version at an `es-CL` site is written for `en-CL`). The build and `check` both render
 * pages through this, so a check sees the words the build publishes.
 */
export function siteForTemplate(template: Pick<BulletinTemplate, 'language'>, site: Site): Site {
  if (template.language === catalogueLanguage(site.locale)) return site;
  return { ...site, locale: localeFor(template.language, site.locale) };
}

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

/** The site with id `id`, named in a template's front matter; an unknown id is `unknown-site` in the template's language, with a suggestion. */
function siteOf(sites: Map<string, Site>, id: string, words: AuthorWords, place: Place): Site {
  const site = sites.get(id);
  if (site) return site;
  const hint = words.didYouMean(id, sites.keys());
  throw words.error('unknown-site', words.say('err.unknown-site', { name: quoted(id) }), {
    place,
    expected: sites.size ? words.oneOf(sites.keys()) : words.say('err.site-folder', { folder: 'content/sites/' }),
    ...(hint ? { hint } : {}),
  });
}

/** The sites of a template, in id order; unknown ids are positioned `unknown-site` errors with a suggestion. */
export function sitesFor(template: BulletinTemplate, sites: Map<string, Site>): Site[] {
  const wanted = template.frontMatter.sites;
  const words = authorWords(template.language);
  if (wanted === 'all') return [...sites.keys()].sort().map((id) => sites.get(id)!);
  return wanted
    .map((id, i) => {
      try {
        return siteOf(sites, id, words, { field: `sites.${i}` });
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
  // A bulletin is all templates with one slug, one per language (`weekly.md`, `weekly.es.md`).
  const bySlug = new Map<string, BulletinTemplate[]>();
  for (const t of templates) {
    const versions = bySlug.get(t.slug) ?? [];
    const other = versions.find((v) => v.language === t.language);
    if (other) {
      const words = authorWords(t.language);
      throw words.error('invalid-value', words.say('err.same-name', { slug: quoted(t.slug), language: t.language }), {
        place: { file: t.file },
        actual: t.slug,
        expected: words.say('err.same-name-expected', { file: other.file }),
      });
    }
    bySlug.set(t.slug, [...versions, t].sort((a, b) => (a.language < b.language ? -1 : 1)));
  }
  const pages: PageSpec[] = [];
  for (const slug of [...bySlug.keys()].sort()) {
    const versions = bySlug.get(slug)!;
    const served = versions.map((template) => ({ template, sites: new Set(sitesFor(template, options.sites).map((s) => s.id)) }));
    for (const id of [...options.sites.keys()].sort()) {
      const site = options.sites.get(id)!;
      const mine = served.filter((v) => v.sites.has(id)).map((v) => v.template);
      if (mine.length === 0) continue;
      // The version in the site's own language takes the plain address; the others add their language.
      const own = mine.find((t) => t.language === catalogueLanguage(site.locale)) ?? mine[0]!;
      const versionsHere = mine.map((template) => {
        const primary = template === own;
        const pageSite = siteForTemplate(template, site);
        return { template, pageSite, locale: pageSite.locale, segment: primary ? slug : `${slug}.${template.language}` };
      });
      for (const v of versionsHere) {
        for (const week of weeksFor(v.template, options.today)) {
          const alternates = versionsHere
            .filter((o) => o !== v && weeksFor(o.template, options.today).some((w) => w.id === week.id))
            .map((o) => ({ locale: o.locale, path: `${site.id}/${week.id}/${o.segment}` }));
          pages.push({ template: v.template, site: v.pageSite, week, path: `${site.id}/${week.id}/${v.segment}`, alternates });
        }
      }
    }
  }
  return pages;
}
