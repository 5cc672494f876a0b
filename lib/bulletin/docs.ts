/**
 * The placeholder table for the README, generated from the registry (`PLACEHOLDERS`) so the docs
 * cannot drift: each placeholder, its form, what it shows, its attributes, an example and the
 * example's output for a fixed, invented example site and week. `lib/bulletin/PLACEHOLDERS.md`
 * holds the committed copy; a test checks it equals this function's output.
 */
import { BodyRegistry } from '../body.ts';
import { defineSite, type Site } from '../site.ts';
import { isoWeekOf, type IsoWeek } from '../time.ts';
import { describeType } from './attributes.ts';
import { PLACEHOLDERS } from './placeholders.ts';
import { renderBulletinSync } from './render.ts';
import { WeekCache } from './week.ts';

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

function outputOf(example: string, cache: WeekCache): string {
  const template = { file: 'example.md', slug: 'example', frontMatter: { title: 'Example', sites: 'all' as const, schedule: { every: 'week' as const, past: 0, future: 0 } }, body: example, bodyLine: 1 };
  const { html } = renderBulletinSync(template, { site: EXAMPLE_SITE, week: EXAMPLE_WEEK, bodies: new BodyRegistry() }, cache);
  if (html.includes('<table')) return 'a table, one row per night';
  if (html.includes('<ul')) return 'a list, one line per target';
  return html.replace(/<[^>]+>/g, '').replace(/\s+/g, ' ').trim();
}

/** The Markdown table of every placeholder, in registry order. */
export function placeholderTable(): string {
  const cache = new WeekCache();
  const lines = [
    '<!-- Generated from lib/bulletin/placeholders.ts by placeholderTable(); test/bulletin-fixtures.test.ts keeps it in step (UPDATE_FIXTURES=1 rewrites it). -->',
    '',
    `Example outputs are for an invented example site at 52° N, 5° E (Europe/Amsterdam, en-GB) in the week ${EXAMPLE_WEEK.id}, Monday night unless the example says otherwise.`,
    '',
    '| Placeholder | What it shows | Attributes | Example | Output |',
    '| --- | --- | --- | --- | --- |',
  ];
  for (const spec of PLACEHOLDERS.values()) {
    const written = spec.form === 'block' ? `::${spec.name}` : `:${spec.name}`;
    const attrs = Object.entries(spec.attributes)
      .map(([name, a]) => `\`${name}\`${a.required ? ' (required)' : ''}: ${describeType(a.type)}${a.default !== undefined ? ` (default: ${a.default})` : ''}`)
      .join('; ');
    const output = outputOf(spec.example, cache);
    lines.push(`| \`${written}\` | ${cell(spec.summary)} | ${cell(attrs || '—')} | \`${cell(spec.example)}\` | ${cell(output)} |`);
  }
  return lines.join('\n') + '\n';
}
