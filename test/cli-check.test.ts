/**
 * `gloaming check`: every template × site × week of a span is rendered and every problem listed
 * with file:line:column, site and week; exit code 1 when anything is found, 0 when nothing is,
 * 2 for wrong arguments; `--json` for machines. The demo content passes 52 weeks for every site.
 */
import { cpSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../lib/outputs/cli/main.ts';

function run(argv: string[]): { code: number; out: string; err: string } {
  let out = '';
  let err = '';
  const code = main(argv, (s) => (out += s + '\n'), (s) => (err += s + '\n'), { today: '2026-12-04' });
  return { code, out, err };
}

interface CheckJson {
  pages: number;
  problems: { kind: string; severity: string; file: string; line: number | null; column: number | null; field?: string; site: string | null; week: string | null; message: string }[];
}

const dir = mkdtempSync(join(tmpdir(), 'gloaming-check-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('gloaming check', () => {
  it('the demo content has no problem in 52 weeks at any site', () => {
    const r = run(['check', '--weeks', '52', '--json']);
    const json = JSON.parse(r.out) as CheckJson;
    expect(json.problems.map((p) => `${p.file}:${p.line}:${p.column} ${p.site} ${p.week} ${p.message}`)).toEqual([]);
    // 4 sites × 52 weeks of the standing template (English), 52 weeks of its Spanish version at the
    // Spanish-speaking site, the one-off once at each of the three English-speaking sites, and the
    // deep-sky bulletin (wonders.md) at the two northern sites.
    expect(json.pages).toBe(4 * 52 + 52 + 3 + 2 * 52);
    expect(r.code).toBe(0);
  }, 240_000);

  it('lists every problem of every file in one run, each with its place, site and week, and exits 1', () => {
    const content = join(dir, 'content');
    cpSync('content/sites', join(content, 'sites'), { recursive: true });
    cpSync('content/objects', join(content, 'objects'), { recursive: true });
    for (const f of ['centre.yaml', 'logo.svg']) cpSync(join('content', f), join(content, f));
    const fm = (extra: string): string => `---\ntitle: T\nsites: [northern-outpost]\n${extra}\n---\n`;
    // Two errors in one file, a front matter error in another, and warnings in a third.
    const bulletins = join(content, 'bulletins');
    mkdirSync(bulletins);
    writeFileSync(join(bulletins, 'a-errors.md'), fm('schedule: { every: week }') + 'Sunset :sunsett.\n\nJupiter :rise{body=jupyter}.\n');
    writeFileSync(join(bulletins, 'b-front.md'), '---\ntitle: T\nsites: all\nshedule: { every: week }\n---\nx\n');
    writeFileSync(join(bulletins, 'c-warnings.md'), fm('schedule: { every: week }') + 'Neptune at :best-time{body=neptune}.\n\n:::every-target{kind=comet}\n- :name\n:::\n');
    const r = run(['check', '--content', content, '--today', '2027-06-21', '--weeks', '2', '--json']);
    expect(r.code).toBe(1);
    const problems = (JSON.parse(r.out) as CheckJson).problems;
    const lines = problems.map((p) => `${p.severity} ${p.kind} ${p.file.replace(content, '<content>')}:${p.line}:${p.column} ${p.site ?? '-'} ${p.week ?? '-'}`);
    expect(lines).toEqual([
      'error error <content>/bulletins/b-front.md:4:10 - -',
      'error error <content>/bulletins/a-errors.md:6:8 - -',
      'error error <content>/bulletins/a-errors.md:8:9 - -',
      // Neptune is hidden by daylight at 68.5° N in midsummer (the visibility model), and there is no comet.
      'warning fallback <content>/bulletins/c-warnings.md:6:12 northern-outpost 2027-W25',
      'warning empty-section <content>/bulletins/c-warnings.md:8:1 northern-outpost 2027-W25',
      'warning fallback <content>/bulletins/c-warnings.md:6:12 northern-outpost 2027-W26',
      'warning empty-section <content>/bulletins/c-warnings.md:8:1 northern-outpost 2027-W26',
    ]);
    expect(problems[0]!.message).toMatch(/unknown front matter field 'shedule'.*did you mean 'schedule'/);
    expect(problems[1]!.message).toMatch(/unknown placeholder ':sunsett'/);
    expect(problems[2]!.message).toMatch(/unknown object 'jupyter'/);
    // The text form: one compiler-style line per problem, then a summary.
    const text = run(['check', '--content', content, '--today', '2027-06-21', '--weeks', '2']);
    expect(text.code).toBe(1);
    expect(text.out).toContain(`warning: ${join(content, 'bulletins/c-warnings.md')}:6:12: ':best-time{body=neptune}' has no value on Monday 21 June`);
    expect(text.out.trim().split('\n').at(-1)).toBe('checked 4 page(s): 2 template(s), 4 site(s), 2 week(s) from 2027-06-21; 3 error(s), 4 warning(s)');
  }, 120_000);

  it('warns once per run, at the object file\'s epoch line, when a comet near perihelion has old elements or none', () => {
    const content = join(dir, 'stale');
    cpSync('content/sites', join(content, 'sites'), { recursive: true });
    cpSync('content/objects', join(content, 'objects'), { recursive: true });
    for (const f of ['centre.yaml', 'logo.svg']) cpSync(join('content', f), join(content, f));
    mkdirSync(join(content, 'bulletins'));
    writeFileSync(join(content, 'bulletins/plain.md'), '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\nClear skies.\n');
    const file = join(content, 'objects/comet-lumen.yaml');
    const demo = readFileSync(file, 'utf8');
    const lineOf = (text: string, start: string): number => text.split('\n').findIndex((l) => l.startsWith(start)) + 1;
    const check = (today: string): CheckJson & { code: number } => {
      const r = run(['check', '--content', content, '--today', today, '--weeks', '2', '--json']);
      return { ...(JSON.parse(r.out) as CheckJson), code: r.code };
    };
    const DAY = 86_400_000;
    // The demo comet's perihelion is 2027-01-11T03:00 TT; the limits are 120 days from it and 60 days of age (common practice, README).
    const beforePerihelion = Math.round((Date.UTC(2027, 0, 11, 3) - Date.UTC(2026, 11, 4)) / DAY);

    // The demo's own epoch (2026-11-27) is a week old on 2026-12-04: nothing to say, for 4 sites × 2 weeks of pages.
    const fresh = check('2026-12-04');
    expect(fresh.pages).toBe(8);
    expect(fresh.problems).toEqual([]);
    expect(fresh.code).toBe(0);

    // An epoch of 2026-09-01 is too old: one warning for the run (not one per page), at the epoch's value.
    writeFileSync(file, demo.replace(/^ {2}epoch: \S+/m, '  epoch: 2026-09-01'));
    const old = check('2026-12-04');
    const age = Math.round((Date.UTC(2026, 11, 4) - Date.UTC(2026, 8, 1)) / DAY);
    expect(old.problems.map((p) => `${p.severity} ${p.kind} ${p.file}:${p.line}:${p.column} ${p.field} ${p.site} ${p.week}`)).toEqual([
      `warning stale-elements ${file}:${lineOf(demo, '  epoch:')}:10 elements.epoch null null`,
    ]);
    expect(old.problems[0]!.message).toBe(
      `Comet Lumen (invented for the demo) is ${beforePerihelion} days before perihelion and its elements are ${age} days old (epoch 2026-09-01), more than 60: near the Sun a comet drifts from a two-body orbit within weeks; expected elements fitted within the last 60 days: import a current MPC or JPL SBDB element line with \`gloaming objects add --force\``,
    );
    expect(old.code).toBe(1);
    // The text form, as the build prints it.
    const text = run(['check', '--content', content, '--today', '2026-12-04', '--weeks', '2']);
    expect(text.out).toContain(`warning: ${file}:${lineOf(demo, '  epoch:')}:10 field 'elements.epoch': Comet Lumen (invented for the demo) is ${beforePerihelion} days before perihelion`);
    expect(text.out.trim().split('\n').at(-1)).toMatch(/; 0 error\(s\), 1 warning\(s\)$/);

    // No epoch at all: placed at the elements (lib/core/yaml.ts places a mapping at its first value).
    writeFileSync(file, demo.replace(/^ {2}epoch: .*\n/m, ''));
    const none = check('2026-12-04');
    expect(none.problems.map((p) => `${p.file}:${p.line}:${p.column} ${p.field}`)).toEqual([`${file}:${lineOf(demo, '  perihelionDistance:')}:3 elements`]);
    expect(none.problems[0]!.message).toMatch(/gives? no epoch of osculation/);

    // The demo's own elements warn too, rightly, once they are 80 days old near perihelion (2027-02-15, 35 days after it).
    writeFileSync(file, demo);
    const later = check('2027-02-15');
    expect(later.problems.map((p) => p.kind)).toEqual(['stale-elements']);
    expect(later.problems[0]!.message).toMatch(/is 35 days after perihelion and its elements are 80 days old \(epoch 2026-11-27\)/);
  }, 120_000);

  it('wrong arguments exit 2 with one line naming the flag', () => {
    const r = run(['check', '--weeks', 'many']);
    expect(r.code).toBe(2);
    expect(r.err.trim()).toMatch(/^gloaming check: --weeks: is not a number of weeks \(got 'many'\); expected a whole number from 1 to 260$/);
    expect(run(['check', '--today', '2026-02-30']).code).toBe(2);
  });
});
