/**
 * The bulletin library: Markdown templates with computed placeholders, rendered to HTML for a
 * site and an ISO week, outside Astro. The site imports only this module.
 *
 * - `parseBulletin(text, file)` — front matter validated with positioned errors.
 * - `pagesFor(templates, { sites, today })` — the pages a build publishes.
 * - `renderBulletin(template, { site, week, bodies }, cache?)` — HTML, title, description, cautions.
 * - `remarkPlaceholders` — the remark plugin itself, for any unified pipeline.
 * - `WeekCache` — shares each site-week's computation across placeholders and pages.
 * - `assertPublishable(html, file)` — refuses NaN / undefined / Invalid Date / empty placeholders.
 * - `PLACEHOLDERS`, `placeholderTable()` — the vocabulary and its documentation table.
 */
export type { BulletinFrontMatter, BulletinTemplate, PageSpec, RenderContext, RenderedBulletin } from './types.ts';
export { parseBulletin, validateFrontMatter, DEFAULT_SCHEDULE } from './frontmatter.ts';
export { pagesFor, weeksFor, sitesFor, type PagesOptions } from './pages.ts';
export { renderBulletin, renderBulletinSync, pageNights, ONE_OFF_EVENT_NIGHTS } from './render.ts';
export { checkObjects, checkPages, pagesToCheck, PAGE_BUDGET_BYTES, LAYOUT_BYTES, type CheckOptions } from './check.ts';
export { SECTIONS, type SectionSpec, type Binding } from './sections.ts';
export { FALLBACK_MARK, PROBLEM_LIMIT, ProblemList, TemplateErrors, errorsOf, errorsOnFile, formatProblem, reportError, reportWarning, throwErrors, problemOfError, warningsOnFile, type Problem, type ProblemKind } from './problems.ts';
export { remarkPlaceholders, type PlaceholderScope, type RemarkPlaceholdersOptions, type PlaceholderReport } from './plugin.ts';
export { WeekCache, WeekData, type WeekMagnitudes } from '../../models/week.ts';
export { assertPublishable, nearSunBodies, nearSunCaution, ECLIPSE_CAUTION, type ShownBody } from './safety.ts';
export { PLACEHOLDERS, type PlaceholderSpec, type PlaceholderCall } from './placeholders/registry.ts';
export { placeholderTable } from './docs.ts';
