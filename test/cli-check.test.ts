/**
 * `gloaming check`: every template × site × week of a span is rendered and every problem listed
 * with file:line:column, site and week; exit code 1 when anything is found, 0 when nothing is,
 * 2 for wrong arguments; `--json` for machines. The demo content passes 52 weeks for every site.
 */
import { cpSync, mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
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
  problems: { kind: string; severity: string; file: string; line: number | null; column: number | null; site: string | null; week: string | null; message: string }[];
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

  it('wrong arguments exit 2 with one line naming the flag', () => {
    const r = run(['check', '--weeks', 'many']);
    expect(r.code).toBe(2);
    expect(r.err.trim()).toMatch(/^gloaming check: --weeks: is not a number of weeks \(got 'many'\); expected a whole number from 1 to 260$/);
    expect(run(['check', '--today', '2026-02-30']).code).toBe(2);
  });
});
