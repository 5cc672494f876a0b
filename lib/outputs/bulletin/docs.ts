/**
 * The placeholder table for the README, generated from the registry (`PLACEHOLDERS`) so the docs
 * cannot drift: each placeholder, its form, what it shows, its attributes, an example and the
 * example's output for a fixed, invented example site and week. `lib/outputs/bulletin/PLACEHOLDERS.md`
 * holds the committed copy; a test checks it equals this function's output.
 */
import { projectRegistry } from '../../models/content.ts';
import { defineSite, type Site } from '../../core/site.ts';
import { isoWeekOf, type IsoWeek } from '../../core/time.ts';
import { describeType, type AttributeSpec } from './attributes.ts';
import { SECTIONS } from './sections.ts';
import { PLACEHOLDERS } from './placeholders/registry.ts';
import { renderBulletinSync } from './render.ts';
import { WeekCache } from '../../models/week.ts';
import type { Satellite } from '../../models/satellite/passes.ts';

/** The invented site and week the table's example outputs are computed for. */
export const EXAMPLE_SITE: Site = defineSite({
  id: 'example-site',
  name: 'Example site',
  latitude: 52,
  longitude: 5,
  timeZone: 'Europe/Amsterdam',
  locale: 'en-GB',
});
export const EXAMPLE_WEEK: IsoWeek = isoWeekOf('2026-12-07');

function cell(text: string): string {
  return text.replace(/\|/g, '\\|').replace(/\n/g, ' ');
}

function outputOf(example: string, cache: WeekCache, satellites: readonly Satellite[]): string {
  const template = { file: 'example.md', slug: 'example', language: 'en' as const, frontMatter: { title: 'Example', sites: 'all' as const, schedule: { every: 'week' as const, past: 0, future: 0 } }, body: example, bodyLine: 1 };
  const { html } = renderBulletinSync(template, { site: EXAMPLE_SITE, week: EXAMPLE_WEEK, bodies: projectRegistry(), satellites }, cache);
  if (html.includes('<table')) return 'a table, one row per night';
  if (html.includes('<ul')) return `a list, one line per ${html.includes('gl-passes') ? 'pass' : 'target'}`;
  if (html.includes('gl-pass-chart')) return `a chart; caption: ${html.replace(/^[\s\S]*<figcaption>|<\/figcaption>[\s\S]*$/g, '')}`;
  return html.replace(/<[^>]+>/g, '').replace(/\s+/g, ' ').trim();
}

/**
 * The Markdown table of every placeholder, in registry order. `satellites`: the satellites the
 * example site follows (the table in the README uses the demo's synthetic element sets).
 */
export function placeholderTable(options: { satellites?: readonly Satellite[] } = {}): string {
  const cache = new WeekCache();
  const satellites = options.satellites ?? [];
  const lines = [
    '<!-- Generated from lib/outputs/bulletin/placeholders/ (the registry) by placeholderTable(); test/bulletin-fixtures.test.ts keeps it in step (UPDATE_FIXTURES=1 rewrites it). -->',
    '',
    `Example outputs are for an invented example site at 52° N, 5° E (Europe/Amsterdam, en-GB) in the week ${EXAMPLE_WEEK.id}, Monday night unless the example says otherwise${satellites.length ? ", following the demo's (synthetic) satellites" : ''}.`,
    '',
    '| Placeholder | What it shows | Attributes | Example | Output |',
    '| --- | --- | --- | --- | --- |',
  ];
  for (const spec of PLACEHOLDERS.values()) {
    const written = spec.form === 'block' ? `::${spec.name}` : `:${spec.name}`;
    const output = outputOf(spec.example, cache, satellites);
    const summary = spec.slot ? `${spec.summary} — *value slot*: \`–\` when there is no value` : spec.summary;
    lines.push(`| \`${written}\` | ${cell(summary)} | ${cell(attributeList(spec.attributes) || '—')} | \`${cell(spec.example)}\` | ${cell(output)} |`);
  }
  lines.push('', 'Sections are container directives: `:::name{…}` on a line, the block, an optional `::otherwise` line and the alternative, then `:::`.', '');
  lines.push('| Section | What it does | Attributes | Example |', '| --- | --- | --- | --- |');
  for (const spec of SECTIONS.values()) {
    lines.push(`| \`:::${spec.name}\` | ${cell(spec.summary)} | ${cell(attributeList(spec.attributes, { withDoc: true }))} | \`${cell(spec.example)}\` |`);
  }
  return lines.join('\n') + '\n';
}

/** Attributes as `name (required): type (default: …)`; with `withDoc`, what each means too (for sections, whose attributes are conditions). */
function attributeList(attributes: Readonly<Record<string, AttributeSpec>>, options: { withDoc?: boolean } = {}): string {
  return Object.entries(attributes)
    .map(([name, a]) => {
      const need = a.required ? (a.bound ? ` (required outside :::every-${a.bound === 'body' ? 'target' : 'event'})` : ' (required)') : '';
      const doc = options.withDoc ? ` — ${a.doc}` : '';
      return `\`${name}\`${need}: ${describeType(a.type)}${doc}${a.default !== undefined ? ` (default: ${a.default})` : ''}`;
    })
    .join('; ');
}
