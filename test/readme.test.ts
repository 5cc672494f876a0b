/**
 * Docs that run: the README's examples and field tables are checked against the code, so they
 * cannot drift. (The placeholder table is checked in the bulletin tests.)
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../lib/outputs/cli/main.ts';
import { parseCentre } from '../lib/outputs/centre.ts';
import { parseSite } from '../lib/models/content.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';

const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');

function section(title: string): string {
  const start = readme.indexOf(title);
  expect(start, `README has a section '${title}'`).toBeGreaterThanOrEqual(0);
  const next = readme.indexOf('\n#', start + title.length);
  return readme.slice(start, next < 0 ? undefined : next);
}

/** Field names in the first column of a Markdown table (backticked, possibly several per cell). */
function tableFields(text: string): string[] {
  const fields: string[] = [];
  for (const line of text.split('\n')) {
    const cell = /^\|\s*([^|]+)\|/.exec(line)?.[1];
    if (!cell) continue;
    for (const m of cell.matchAll(/`(?:[a-z]+\[\]\.)?([A-Za-z0-9]+)`/g)) fields.push(m[1]!);
  }
  return fields;
}

function run(argv: string[]): { code: number; out: string; err: string } {
  let out = '';
  let err = '';
  const code = main(argv, (s) => (out += s + '\n'), (s) => (err += s + '\n'));
  return { code, out, err };
}

describe('README', () => {
  it('opens with one paragraph stating the job, then the two set-up commands', () => {
    const lines = readme.split('\n');
    expect(lines[0]).toBe('# gloaming');
    expect(lines[2]).toMatch(/^gloaming turns one Markdown bulletin/);
    const setUp = section('## Set up');
    const commands = [...setUp.matchAll(/```sh\n([^\n]+)\n```/g)].map((m) => m[1]);
    expect(commands).toEqual(['npm install && npm run build', 'npm install && npm test']);
  });

  it('the position table lists exactly the fields `gloaming position --json` prints', () => {
    const documented = tableFields(section('### `gloaming position`'));
    const r = run(['position', '--lat', '52', '--lon', '5', '--at', '2026-12-04T20:00:00Z', '--body', 'jupiter', '--json']);
    expect(r.code).toBe(0);
    const printed = Object.keys(JSON.parse(r.out) as object);
    for (const field of documented.filter((f) => f !== 'magnitudeRange')) expect(printed, `documented field ${field}`).toContain(field);
    for (const field of printed) expect(documented, `printed field ${field} is documented`).toContain(field);
  });

  it('the night table documents the fields `gloaming night --json` prints', () => {
    const documented = tableFields(section('### `gloaming night`'));
    const r = run(['night', '--lat', '52', '--lon', '5', '--tz', 'Europe/Amsterdam', '--date', '2026-12-04', '--body', 'jupiter', '--json']);
    expect(r.code).toBe(0);
    const night = JSON.parse(r.out) as { sun: object; moon: object; bodies: object[] };
    const printed = [...Object.keys(night), ...Object.keys(night.sun), ...Object.keys(night.bodies[0]!)];
    for (const field of printed.filter((f) => !['reasons', 'name', 'instrument'].includes(f))) {
      expect(new RegExp(`[\`.]${field}\``).test(readme), `night field ${field} is documented`).toBe(true);
    }
    expect(documented).toContain('best');
  });

  it('the site example is a valid site file', () => {
    const example = /A site \(`content\/sites\/<id>\.yaml`\):\n\n```yaml\n([\s\S]*?)```/.exec(readme)?.[1];
    expect(example).toBeDefined();
    const site = parseSite(example!, 'harbour-roof.yaml');
    expect(site.sky).toEqual({ bortle: 7 });
    expect(site.horizon).toHaveLength(2);
    expect(site.viewingHours?.label).toBe('19:00–23:00');
  });

  it('the centre example is a valid centre file, and the accent message is what the check prints', () => {
    const example = /`content\/centre\.yaml`\): every page[\s\S]*?```yaml\n([\s\S]*?)```/.exec(readme)?.[1];
    expect(example).toBeDefined();
    const dir = mkdtempSync(join(tmpdir(), 'gloaming-readme-'));
    try {
      writeFileSync(join(dir, 'logo.svg'), '<svg xmlns="http://www.w3.org/2000/svg"/>');
      const centre = parseCentre(example!, 'centre.yaml', dir);
      expect(centre.url).toBe('https://sky.example.net/');
      expect(centre.links).toEqual([{ label: 'Contact', href: 'mailto:sky@example.net' }]);
      const documented = /`(content\/centre\.yaml:5:9 field 'accent': [^`…]+)…`/.exec(readme)![1]!.trim();
      const bad = example!.replace('accent: "#f3b962"', 'accent: "#2a3f7a"');
      expect(() => parseCentre(bad, 'content/centre.yaml', dir)).toThrow(documented);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('the error example is what the command prints', () => {
    const example = /\$ npx gloaming position ([^\n]+)\n([^\n]+)\n/.exec(readme)!;
    const r = run(['position', ...example[1]!.split(' ')]);
    expect(r.code).toBe(2);
    expect(r.err.trim()).toBe(example[2]);
  });
});

describe('README placeholder table', () => {
  it('equals the table generated from the placeholder registry (UPDATE_FIXTURES=1 rewrites it)', async () => {
    const { placeholderTable } = await import('../lib/outputs/bulletin/docs.ts');
    const markers = /(<!-- placeholders:start -->\n)([\s\S]*?)(<!-- placeholders:end -->)/;
    const block = markers.exec(readme)?.[2];
    expect(block, 'README has the placeholder table between its markers').toBeDefined();
    const generated = placeholderTable({ satellites: loadSatellites('content/satellites') }).split('\n').slice(2).join('\n');
    if (process.env.UPDATE_FIXTURES === '1' && block !== generated) {
      writeFileSync(new URL('../README.md', import.meta.url), readme.replace(markers, (_, a: string, _b: string, c: string) => a + generated + c));
      return;
    }
    expect(block).toBe(generated);
  });
});

describe('README: writing a template that lasts', () => {
  it('the worked example renders for every demo site and every week of a year without a problem', async () => {
    const { BodyRegistry } = await import('../lib/core/body.ts');
    const { loadSites } = await import('../lib/models/content.ts');
    const { checkPages, formatProblem, parseBulletin, ProblemList, WeekCache } = await import('../lib/outputs/bulletin/index.ts');
    const { addDays, isoWeekOf } = await import('../lib/core/time.ts');
    const example = /\*\*A worked example\.\*\*[^\n]*\n\n```markdown\n([\s\S]*?)```/.exec(readme)?.[1];
    expect(example, 'README has the worked example').toBeDefined();
    const template = parseBulletin(`---\ntitle: Example\nsites: all\nschedule: { every: week }\n---\n${example}`, 'readme-example.md');
    const sites = [...loadSites('content/sites').values()];
    const pages = sites.flatMap((site) => Array.from({ length: 52 }, (_, k) => ({ template, site, week: isoWeekOf(addDays('2027-01-04', 7 * k)) })));
    const problems = checkPages(pages, { bodies: new BodyRegistry(), problems: new ProblemList(), cache: new WeekCache() });
    expect(problems.items.map(formatProblem)).toEqual([]);
  }, 240_000);
});
