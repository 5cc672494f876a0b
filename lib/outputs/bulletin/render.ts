/**
 * Rendering one bulletin page: the template's Markdown through one unified pipeline
 * (remark-parse → remark-directive → remarkPlaceholders → remarkSafeLinks → remark-rehype →
 * rehype-stringify), then the eye-safety pass over what the page shows and the final
 * publishability check. Problems are messages on the page's file, at the template's own lines
 * (the file holds the front matter as blank lines, so positions need no offset).
 */
import rehypeStringify from 'rehype-stringify';
import remarkDirective from 'remark-directive';
import remarkParse from 'remark-parse';
import remarkRehype from 'remark-rehype';
import type { Root } from 'mdast';
import { unified } from 'unified';
import { VFile } from 'vfile';
import type { Body } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import { eventsBetween, type AlmanacEvent } from '../almanac/index.ts';
import { addDays, isoWeekOf, type IsoWeek } from '../../core/time.ts';
import { bodyOf } from './attributes.ts';
import { fieldPlace } from './frontmatter.ts';
import { authorWords } from './messages.ts';
import { remarkSafeLinks } from './links.ts';
import { remarkPlaceholders, type PlaceholderScope } from './plugin.ts';
import { warningsOnFile } from './problems.ts';
import { assertPublishable, eclipseCaution, nearSunBodies, nearSunCaution, type ShownBody } from './safety.ts';
import { rehypeTidyPunctuation } from './punctuation.ts';
import { wordsFor, type Words } from '../../core/language/index.ts';
import { bodyPhrase } from '../../core/language/names/index.ts';
import type { BulletinTemplate, RenderContext, RenderedBulletin } from './types.ts';
import { WeekCache, type WeekData } from '../../models/week.ts';

declare module 'vfile' {
  interface DataMap {
    /** The scope a page is rendered for, handed to `remarkPlaceholders` by `renderBulletin`. */
    gloamingScope: PlaceholderScope;
  }
}

/** One processor for every page; the page's scope travels in the file's data. */
const processor = unified()
  .use(remarkParse)
  .use(remarkDirective)
  .use(remarkPlaceholders, {
    scope: (file) => {
      const scope = file.data.gloamingScope;
      if (!scope) throw new GloamingError('invalid-argument', 'renderBulletin: no placeholder scope was given');
      return scope;
    },
  })
  // Links, images and definitions may use only http:, https:, mailto: or relative addresses.
  .use(remarkSafeLinks, { language: (file) => (file.data as { gloamingScope?: PlaceholderScope }).gloamingScope?.language })
  .use(remarkRehype)
  .use(rehypeTidyPunctuation, { language: (file) => wordsFor((file.data as { gloamingScope?: PlaceholderScope }).gloamingScope?.site.locale ?? 'en').language })
  .use(rehypeStringify)
  .freeze();

/**
 * Each template's Markdown tree, parsed once: a template is rendered for every site and week, and
 * parsing it again for each page was about a tenth of a page's time (`gloaming check` of the demo
 * for 52 weeks). Every page transforms its own copy.
 */
const parsedTrees = new WeakMap<BulletinTemplate, Root>();

function treeOf(template: BulletinTemplate, file: VFile): Root {
  let tree = parsedTrees.get(template);
  if (!tree) {
    tree = processor.parse(file);
    parsedTrees.set(template, tree);
  }
  return structuredClone(tree);
}

/** Front matter bodies, resolved; unknown ids are positioned errors with a suggestion. */
function frontMatterBodies(template: BulletinTemplate, context: RenderContext): Body[] {
  const words = authorWords(template.language);
  return (template.frontMatter.bodies ?? []).map((id, i) => {
    try {
      return bodyOf(id, context.bodies, words, { field: `bodies.${i}` });
    } catch (error) {
      if (error instanceof GloamingError) throw error.at(fieldPlace(template, `bodies.${i}`));
      throw error;
    }
  });
}

/** Cautions for a page: near-Sun targets (front matter bodies on any night, bodies the page shows on their night; see `nearSunBodies`) and eclipses among the page's events. */
function cautionsFor(template: BulletinTemplate, week: WeekData, events: AlmanacEvent[], listed: Body[], shown: ShownBody[], words: Words): string[] {
  const near = nearSunBodies(week, { listed, shown });
  const names = near.filter((b) => b.kind !== 'sun').map((b) => bodyPhrase(words.language, b).text);
  const cautions: string[] = [];
  if (near.length > 0) cautions.push(nearSunCaution(names, words));
  // Every page of a week with a solar eclipse visible from the site carries the eclipse caution.
  if (template.frontMatter.eclipse || events.some((e) => e.type === 'solar-eclipse' && e.visible)) cautions.push(eclipseCaution(words));
  return cautions;
}

/** A one-off bulletin's events are looked up this many nights either side of its date. */
export const ONE_OFF_EVENT_NIGHTS = 3;

/**
 * The nights a page is about. A standing bulletin: Monday of its ISO week by default, events of
 * the week's seven nights. A one-off: its date's night, and events from local noon
 * `ONE_OFF_EVENT_NIGHTS` evenings before its date to local noon after the evening
 * `ONE_OFF_EVENT_NIGHTS` after it — so a meteor shower peaking at 10:49 on a Monday morning (which
 * belongs to Sunday's night, and so to the previous ISO week) is found by a one-off dated Monday.
 */
export function pageNights(template: BulletinTemplate, week: IsoWeek): { defaultNight?: string; eventNights?: { first: string; last: string } } {
  const date = template.frontMatter.date;
  if (date === undefined || isoWeekOf(date).id !== week.id) return {};
  return { defaultNight: date, eventNights: { first: addDays(date, -ONE_OFF_EVENT_NIGHTS), last: addDays(date, ONE_OFF_EVENT_NIGHTS) } };
}

/**
 * Renders `template` for `context.site` and `context.week`. Pass one `WeekCache` to every call of
 * a build so each site-week is computed once. The default night is Monday of the week, or the
 * one-off bulletin's date (see `pageNights`). Throws `GloamingError` for any problem in the
 * template (placed at `file:line:column`; several at once as `TemplateErrors`) and `unsafe-output`
 * if the HTML is not publishable. Problems that depend on the site and week are in `problems`.
 */
export async function renderBulletin(template: BulletinTemplate, context: RenderContext, cache: WeekCache = new WeekCache()): Promise<RenderedBulletin> {
  return renderBulletinSync(template, context, cache);
}

/** The synchronous form of `renderBulletin` (same result). */
export function renderBulletinSync(template: BulletinTemplate, context: RenderContext, cache: WeekCache = new WeekCache()): RenderedBulletin {
  const listed = frontMatterBodies(template, context);
  const nights = pageNights(template, context.week);
  const scope: PlaceholderScope = {
    site: context.site,
    week: context.week,
    bodies: context.bodies,
    ...(context.satellites ? { satellites: context.satellites } : {}),
    cache,
    ...(context.charts ? { charts: context.charts } : {}),
    ...nights,
    language: template.language,
  };
  // The front matter's lines stay in the file as blank lines, so every position is the template's own.
  const value = '\n'.repeat(template.bodyLine - 1) + template.body;
  const file = new VFile({ value, path: template.file, data: { gloamingScope: scope } });
  const html = String(processor.stringify(processor.runSync(treeOf(template, file), file), file));
  assertPublishable(html, template.file);
  const shown = file.data.placeholders?.shown ?? [];
  const week = cache.get(context.site, context.week, context.bodies, context.satellites);
  const days = context.week.days;
  const events = eventsBetween(week, nights.eventNights?.first ?? days[0]!, nights.eventNights?.last ?? days[6]!);
  return {
    html,
    title: template.frontMatter.title,
    description: template.frontMatter.description ?? '',
    cautions: cautionsFor(template, week, events, listed, shown, wordsFor(context.site.locale)),
    // A one-off's problems name its date rather than its ISO week.
    problems: warningsOnFile(file, { site: context.site.id, week: nights.defaultNight ?? context.week.id }),
  };
}
