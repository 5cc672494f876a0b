/**
 * An object file's `names` (the name in other languages, beside `name`) reach every page in that
 * language: event sentences, the target's label, chart alt text; pages in a language without one
 * print `name`. `gloaming objects add --force` keeps the names of the file it replaces.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { loadBodies, loadSites } from '../lib/models/content.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { parseBulletin, renderBulletinSync, WeekCache } from '../lib/outputs/bulletin/index.ts';
import { loadObjectFile } from '../lib/models/orbit/elements.ts';
import { main } from '../lib/outputs/cli/main.ts';

const sites = loadSites('content/sites');
const bodies = loadBodies('content/objects');
const cache = new WeekCache();
const SPANISH = 'Cometa Lumen (inventado para la demostración)';
const ENGLISH = 'Comet Lumen (invented for the demo)';

function render(siteId: string, file: string, markdown: string, date: string): string {
  const template = parseBulletin(`---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n${markdown}\n`, file);
  return renderBulletinSync(template, { site: sites.get(siteId)!, week: isoWeekOf(date), bodies }, cache).html;
}

describe('names per language from the object file', () => {
  const markdown = ':name{body=comet-lumen}\n\n::events\n\n::chart{body=comet-lumen}';

  it('the demo comet is "Cometa Lumen" on a Spanish page (Cerro Lucero, the week it is brightest): label, events and chart', () => {
    expect(bodies.get('comet-lumen').localNames).toEqual({ es: SPANISH });
    const html = render('cerro-lucero', 'names.es.md', markdown, '2027-01-11');
    expect(html).toContain(`${SPANISH} debería alcanzar su máximo brillo`);
    expect(html).toMatch(/alt="Mirando hacia el \S+ a las [^"]*: Cometa Lumen a \d+° de altura/); // the chart's alt text (charts drop the parenthesis)
    expect(html).not.toContain('Comet Lumen');
  });

  it('an English page prints its name', () => {
    const html = render('harbour-roof', 'names.md', markdown, '2027-01-11');
    expect(html).toContain(`${ENGLISH} should be at its brightest`);
    expect(html).not.toContain('Cometa Lumen');
  });

  it('gloaming objects add --force keeps the names of the file it replaces', () => {
    const dir = mkdtempSync(join(tmpdir(), 'gloaming-names-'));
    afterAll(() => rmSync(dir, { recursive: true, force: true }));
    // 1P/Halley as an MPC one-line comet orbit (the line of test/orbit-import.test.ts).
    const line = '0001P         1986 02  9.4589  0.587104  0.967277  111.8657   58.8601  162.2422  19860219   5.5  4.0  1P/Halley                                                MPC 12345';
    const run = (argv: string[]): number => main(argv, () => {}, () => {}, { today: '1986-01-01' });
    expect(run(['objects', 'add', line, '--content', dir])).toBe(0);
    const file = join(dir, 'objects/1p-halley.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace(/^name: .*$/m, '$&\nnames: { es: "Cometa Halley", fr: "Comète de Halley" }'));
    expect(loadObjectFile(file).names).toEqual({ es: 'Cometa Halley', fr: 'Comète de Halley' });
    expect(run(['objects', 'add', line, '--content', dir, '--force'])).toBe(0);
    expect(loadObjectFile(file).names).toEqual({ es: 'Cometa Halley', fr: 'Comète de Halley' });
  });
});
