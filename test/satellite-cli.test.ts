/**
 * `gloaming passes` end to end on the demo content: JSON shape, the naked-eye filter, and wrong
 * input as one line with exit code 2 (unknown satellite, element sets too far from the dates).
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { main } from '../lib/outputs/cli/main.ts';

function run(...argv: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

describe('gloaming passes', () => {
  it('lists only recommended passes as JSON with times in the site offset, and all of them with --all', () => {
    const r = run('passes', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-04', '--json');
    expect(r.code).toBe(0);
    expect(r.out).not.toMatch(/NaN|undefined|Invalid Date/);
    const passes = JSON.parse(r.out).passes as { recommended: boolean; verdict: string; start: { time: string }; visible: unknown; elements: { ageDays: number; file: string } }[];
    expect(passes.length).toBeGreaterThan(0);
    for (const p of passes) {
      expect(p.recommended).toBe(true);
      expect(p.verdict).toBe('naked-eye');
      expect(p.start.time).toMatch(/^2026-12-0[345]T\d\d:\d\d:\d\d\+00:00$/);
      expect(p.elements.file).toMatch(/content\/satellites\/demo(\.tle|-omm\.json)$/);
    }
    const all = JSON.parse(run('passes', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-04', '--json', '--all').out).passes as { verdict: string; reason: string | null }[];
    expect(all.length).toBeGreaterThan(passes.length);
    expect(all.some((p) => p.reason === 'earth-shadow')).toBe(true);
  });

  it('prints one line per pass as text', () => {
    const r = run('passes', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-03', '--satellite', 'demo-station');
    expect(r.code).toBe(0);
    expect(r.out.split('\n')[0]).toContain('Satellite passes 2026-12-03 – 2026-12-03 at Harbour Roof Terrace');
    expect(r.out).toMatch(/Demo station: \w+ \d+° → highest \w+ \d+° → \w+ \d+°; naked eye, magnitude -?\d/);
  });

  it('names an unknown satellite and refuses element sets too far from the dates, in one line with exit code 2', () => {
    const unknown = run('passes', '--site', 'harbour-roof', '--from', '2026-12-03', '--satellite', 'demo-statoin');
    expect(unknown.code).toBe(2);
    expect(unknown.err).toMatch(/^gloaming passes: --satellite: unknown satellite .*did you mean 'demo-station'\?/);
    const stale = run('passes', '--site', 'harbour-roof', '--from', '2027-02-01');
    expect(stale.code).toBe(2);
    expect(stale.err.split('\n')).toHaveLength(1);
    expect(stale.err).toMatch(/demo\.tle:\d+: the element set of Demo station \(epoch 2026-12-03T12:00Z\) is \d+ days from the requested dates; expected elements within 14 days/);
    expect(run('passes', '--help').out).toContain('Usage: gloaming passes');
  });
});

describe('README', () => {
  it('documents every field of a pass in the `gloaming passes` table', () => {
    const readme = readFileSync(new URL('../README.md', import.meta.url), 'utf8');
    const start = readme.indexOf('### `gloaming passes`');
    const text = readme.slice(start, readme.indexOf('\n#', start + 10));
    const documented = new Set([...text.matchAll(/^\|\s*([^|]+)\|/gm)].flatMap((m) => [...m[1]!.matchAll(/`([A-Za-z]+)`/g)].map((f) => f[1]!)));
    const pass = JSON.parse(run('passes', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-03', '--json', '--all').out).passes[0] as Record<string, unknown>;
    // `reason` is documented with `verdict`, in the same row.
    for (const key of Object.keys(pass).filter((k) => k !== 'reason')) expect(documented, key).toContain(key);
    expect(text).toContain('`reason`');
  });
});
