/**
 * Golden fixtures with a frozen build date (test/fixtures/<case>/: template.md, site.yaml,
 * today.txt, expected.html, expected.json). Rewritten only with UPDATE_FIXTURES=1; otherwise a
 * changed output fails. Also: two renders are byte-identical, the cache is shared, page lists
 * across a year boundary and ISO week 53, the publishability check, and the docs table.
 */
import { existsSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { loadSites, parseSite } from '../lib/models/content.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';
import { ECLIPSE_CAUTION, WeekCache, assertPublishable, formatProblem, pagesFor, pagesToCheck, parseBulletin, placeholderTable, renderBulletin } from '../lib/outputs/bulletin/index.ts';
import { ProblemList } from '../lib/outputs/bulletin/problems.ts';

const ROOT = 'test/fixtures';
const UPDATE = process.env.UPDATE_FIXTURES === '1';
const CASES = readdirSync(ROOT).filter((d) => existsSync(join(ROOT, d, 'template.md'))).sort();

async function renderCase(name: string, cache = new WeekCache()): Promise<{ html: string; meta: unknown }> {
  const dir = join(ROOT, name);
  const site = parseSite(readFileSync(join(dir, 'site.yaml'), 'utf8'), join(dir, 'site.yaml'));
  const today = readFileSync(join(dir, 'today.txt'), 'utf8').trim();
  const template = parseBulletin(readFileSync(join(dir, 'template.md'), 'utf8'), join(dir, 'template.md'));
  const pages = pagesFor([template], { sites: new Map([[site.id, site]]), today });
  const page = pages.find((p) => p.week.id === isoWeekOf(today).id) ?? pages[0]!;
  // A case with a satellites/ folder follows those satellites (its element sets and satellites.yaml).
  const satellites = existsSync(join(dir, 'satellites')) ? loadSatellites(join(dir, 'satellites')) : [];
  const r = await renderBulletin(template, { site, week: page.week, bodies: new BodyRegistry(), satellites }, cache);
  return { html: r.html + '\n', meta: { path: page.path, pages: pages.map((p) => p.path), title: r.title, description: r.description, cautions: r.cautions, problems: r.problems.map(formatProblem) } };
}

describe.each(CASES)('fixture %s', (name) => {
  it('matches expected.html and expected.json', async () => {
    const { html, meta } = await renderCase(name);
    const json = JSON.stringify(meta, null, 2) + '\n';
    const htmlFile = join(ROOT, name, 'expected.html');
    const jsonFile = join(ROOT, name, 'expected.json');
    if (UPDATE || !existsSync(htmlFile)) {
      if (!UPDATE) throw new Error(`${htmlFile} is missing: run with UPDATE_FIXTURES=1 and review the output`);
      writeFileSync(htmlFile, html);
      writeFileSync(jsonFile, json);
    }
    expect(html).toBe(readFileSync(htmlFile, 'utf8'));
    expect(json).toBe(readFileSync(jsonFile, 'utf8'));
  });

  it('renders byte-identically twice, with a fresh cache and with a warm one', async () => {
    const cache = new WeekCache();
    const a = await renderCase(name, cache);
    const b = await renderCase(name, cache);
    const c = await renderCase(name);
    expect(b.html).toBe(a.html);
    expect(c.html).toBe(a.html);
    expect(cache.hits).toBeGreaterThan(0);
  });
});

describe('pages', () => {
  const sites = loadSites('content/sites');
  const weekly = parseBulletin('---\ntitle: W\nsites: all\nschedule: { every: week, past: 2, future: 1 }\n---\nx\n', 'content/bulletins/weekly.md');

  it('a standing template gives one page per site per week, in a fixed order', () => {
    const pages = pagesFor([weekly], { sites, today: '2026-12-31' });
    expect(pages.map((p) => p.path)).toEqual(
      [...sites.keys()].sort().flatMap((id) => ['2026-W51', '2026-W52', '2026-W53', '2027-W01'].map((w) => `${id}/${w}/weekly`)),
    );
  });

  it('ISO week 53 and the year boundary: 2026-W53 is 28 Dec 2026 – 3 Jan 2027 (ISO 8601: the week of 31 Dec 2026, a Thursday)', () => {
    const [page] = pagesFor([weekly], { sites, today: '2027-01-03' }).filter((p) => p.week.id === '2026-W53');
    expect(page!.week.days[0]).toBe('2026-12-28');
    expect(page!.week.days[6]).toBe('2027-01-03');
    // 2027-01-04 (Monday) starts 2027-W01.
    expect(pagesFor([weekly], { sites, today: '2027-01-04' }).at(-1)!.week.id).toBe('2027-W02');
  });

  it('a one-off template gives one page per listed site for its date', () => {
    const oneOff = parseBulletin('---\ntitle: O\nsites: [southern-station, harbour-roof]\ndate: 2027-01-01\n---\nx\n', 'content/bulletins/new-year.md');
    expect(pagesFor([oneOff, weekly], { sites, today: '2026-06-01' }).filter((p) => p.template === oneOff).map((p) => p.path)).toEqual([
      'harbour-roof/2026-W53/new-year',
      'southern-station/2026-W53/new-year',
    ]);
  });

  it('`check` renders each page for the same site and locale as the build publishes it, whatever the template\'s language', () => {
    // The demo's own templates at its four sites: an English version at the Spanish-speaking site
    // is published for en-CL, so check must see en-CL there too, not the site's es-CL.
    const templates = readdirSync('content/bulletins')
      .filter((f) => f.endsWith('.md'))
      .map((f) => parseBulletin(readFileSync(join('content/bulletins', f), 'utf8'), join('content/bulletins', f)));
    const today = '2026-12-04';
    const built = pagesFor(templates, { sites, today });
    const problems = new ProblemList();
    const checked = pagesToCheck(templates, { sites, today, weeks: 1, problems });
    expect(problems.items).toEqual([]);
    const key = (p: { template: { file: string }; site: { id: string }; week: { id: string } }): string => `${p.template.file} ${p.site.id} ${p.week.id}`;
    const byKey = new Map(checked.map((p) => [key(p), p]));
    const thisWeek = built.filter((p) => p.week.id === isoWeekOf(today).id);
    expect(thisWeek.length).toBeGreaterThan(5);
    for (const page of thisWeek) expect(byKey.get(key(page))?.site, key(page)).toEqual(page.site);
    expect(thisWeek.some((p) => p.site.id === 'cerro-lucero' && p.site.locale === 'en-CL')).toBe(true);
  });

  it('two templates with one name are refused', () => {
    expect(() => pagesFor([weekly, weekly], { sites, today: '2026-06-01' })).toThrow(/share the name 'weekly'/);
  });

  it('a bad build date is refused', () => {
    expect(() => pagesFor([weekly], { sites, today: '2026-13-01' })).toThrow(GloamingError);
  });
});

describe('cautions', () => {
  it('the eclipse fixture carries the eclipse caution and the near-Sun caution naming its targets', async () => {
    const { meta } = await renderCase('eclipse-one-off');
    const cautions = (meta as { cautions: string[] }).cautions;
    expect(cautions).toContain(ECLIPSE_CAUTION);
    expect(cautions.some((c) => /Never point binoculars or a telescope at or near the Sun/.test(c))).toBe(true);
  });

  it('a placeholder about a body near the Sun adds the near-Sun caution (Mercury at inferior conjunction, found by astronomy-engine SearchRelativeLongitude)', async () => {
    const conjunction = Astronomy.SearchRelativeLongitude(Astronomy.Body.Mercury, 0, new Date('2026-01-15T00:00:00Z'));
    const date = conjunction.date.toISOString().slice(0, 10);
    const sites = loadSites('content/sites');
    const t = parseBulletin(`---\ntitle: M\nsites: all\nschedule: { every: week }\n---\n:set{body=mercury night=${date}}\n`, 'content/bulletins/m.md');
    const site = sites.get('harbour-roof')!;
    const r = await renderBulletin(t, { site, week: isoWeekOf(date), bodies: new BodyRegistry() });
    expect(r.cautions.join(' ')).toMatch(/^Mercury is close to the Sun in the sky this week/);
    // Three months later Mercury is far from the Sun: no caution (its greatest elongation is 18–28°).
    const later = parseBulletin(`---\ntitle: M\nsites: all\nschedule: { every: week }\n---\n:set{body=mercury}\n`, 'content/bulletins/m.md');
    const laterWeek = isoWeekOf(new Date(conjunction.date.getTime() + 40 * 86_400_000).toISOString().slice(0, 10));
    const elongation = Astronomy.Elongation(Astronomy.Body.Mercury, Astronomy.MakeTime(new Date(`${laterWeek.days[0]}T23:00:00Z`))).elongation;
    const far = await renderBulletin(later, { site, week: laterWeek, bodies: new BodyRegistry() });
    expect(far.cautions.length === 0).toBe(elongation >= 15.5);
  });
});

describe('assertPublishable', () => {
  it.each([
    ['NaN', '<p>at <data class="gl gl-altitude" value="NaN">NaN°</data></p>'],
    ['undefined', '<p>rises at undefined</p>'],
    ['Invalid Date', '<time datetime="x">Invalid Date</time>'],
    ['empty placeholder', '<p>Sunset <time class="gl gl-sunset" datetime="2026-12-04T16:00:00Z"></time></p>'],
  ])('refuses %s', (_what, html) => {
    expect(() => assertPublishable(html, 'page.html')).toThrow(GloamingError);
    try {
      assertPublishable(html, 'page.html');
    } catch (error) {
      expect((error as GloamingError).code).toBe('unsafe-output');
      expect((error as GloamingError).place?.file).toBe('page.html');
    }
  });

  it('accepts every fixture', () => {
    for (const name of CASES) assertPublishable(readFileSync(join(ROOT, name, 'expected.html'), 'utf8'), name);
  });
});

describe('docs', () => {
  it('lib/outputs/bulletin/PLACEHOLDERS.md equals the table generated from the registry (UPDATE_FIXTURES=1 rewrites it)', () => {
    const file = 'lib/outputs/bulletin/PLACEHOLDERS.md';
    const table = placeholderTable({ satellites: loadSatellites('content/satellites') });
    if (UPDATE) writeFileSync(file, table);
    expect(readFileSync(file, 'utf8')).toBe(table);
  });
});
