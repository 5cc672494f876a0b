/**
 * Cache correctness. Astro's content layer keeps an entry between builds whenever the loader
 * hands it the same digest, so a digest that misses an input serves stale computed strings (seen
 * with Astro 7.3 after editing a computing module). These tests change each input in turn — code
 * under lib/ and site/gloaming/, the lockfile, a site file, a template, an object file, the build
 * date — and check that the page's digest changes, that unrelated changes leave it alone, and,
 * end to end, that a warm build after a lib/ edit publishes the edited value.
 */
import { spawnSync } from 'node:child_process';
import { appendFileSync, cpSync, mkdtempSync, readFileSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { pageDigest, siteDigest } from '../site/gloaming/session.ts';
import { loadProject, type Project } from '../site/gloaming/project.ts';

const ROOT = resolve(import.meta.dirname, '..');
const TODAY = '2026-12-04';
const PAGE = 'harbour-roof/2026-W49/weekly';

let copy: string;

/** A copy of what a build reads: code, content, config; node_modules linked, not copied. */
function copyProject(): string {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-cache-'));
  for (const p of ['lib', 'site', 'content', 'scripts', 'astro.config.mjs', 'package.json', 'package-lock.json', 'tsconfig.json']) {
    cpSync(join(ROOT, p), join(dir, p), { recursive: true });
  }
  symlinkSync(join(ROOT, 'node_modules'), join(dir, 'node_modules'), 'dir');
  return dir;
}

function project(today = TODAY): Project {
  return loadProject(copy, { today, only: null, content: 'content' });
}

function digestOf(p: Project, path = PAGE): string {
  const spec = p.pages.find((s) => s.path === path);
  if (!spec) throw new Error(`no page ${path}`);
  return pageDigest(p, spec);
}

beforeAll(() => {
  copy = copyProject();
});

afterAll(() => {
  if (copy) rmSync(copy, { recursive: true, force: true });
});

describe('page digest covers every input', () => {
  it('is stable when nothing changes', () => {
    expect(digestOf(project())).toBe(digestOf(project()));
  });

  const edits: [string, string][] = [
    ['a computing module under lib/', 'lib/core/moon.ts'],
    ['a data file under lib/', 'lib/models/stars/patterns.yaml'],
    ['the site-side computation', 'site/gloaming/nights.ts'],
    ['the lockfile (dependency versions)', 'package-lock.json'],
    ["the page's site file", 'content/sites/harbour-roof.yaml'],
    ["the page's template", 'content/bulletins/weekly.md'],
    ['an object file', 'content/objects/comet-lumen.yaml'],
  ];
  for (const [what, file] of edits) {
    it(`changes when ${what} changes`, () => {
      const before = digestOf(project());
      const original = readFileSync(join(copy, file));
      try {
        appendFileSync(join(copy, file), '\n# edited\n');
        expect(digestOf(project())).not.toBe(before);
      } finally {
        writeFileSync(join(copy, file), original);
      }
      expect(digestOf(project())).toBe(before);
    });
  }

  it('changes with the build date, even for the same week', () => {
    // 2026-12-03 and 2026-12-04 are both in ISO week 2026-W49.
    expect(digestOf(project('2026-12-03'))).not.toBe(digestOf(project('2026-12-04')));
  });

  it("does not change when another site's file changes", () => {
    const before = digestOf(project());
    const file = join(copy, 'content/sites/southern-station.yaml');
    const original = readFileSync(file);
    try {
      appendFileSync(file, '\n# edited\n');
      expect(digestOf(project())).toBe(before);
    } finally {
      writeFileSync(file, original);
    }
  });

  it('site entries change with code, site file and date', () => {
    const p = project();
    const source = p.sites.get('harbour-roof')!;
    const before = siteDigest(p, source, true);
    expect(siteDigest(project('2026-12-05'), project('2026-12-05').sites.get('harbour-roof')!, true)).not.toBe(before);
    expect(siteDigest(p, source, false)).not.toBe(before);
    const file = join(copy, 'lib/models/night.ts');
    const original = readFileSync(file);
    try {
      appendFileSync(file, '\n// edited\n');
      const q = project();
      expect(siteDigest(q, q.sites.get('harbour-roof')!, true)).not.toBe(before);
    } finally {
      writeFileSync(file, original);
    }
  });
});

describe('warm builds', () => {
  function build(): { status: number | null; stdout: string; stderr: string } {
    const r = spawnSync(process.execPath, ['scripts/build.ts', '--today', TODAY, '--sites', 'harbour-roof', '--out', 'dist', '--verbose'], {
      cwd: copy,
      encoding: 'utf8',
      env: { ...process.env, GLOAMING_CACHE_DIR: join(copy, '.cache'), GLOAMING_TODAY: '', GLOAMING_SITES: '', GLOAMING_CONTENT: '' },
      timeout: 120_000,
    });
    return { status: r.status, stdout: r.stdout, stderr: r.stderr };
  }

  it('reuse unchanged entries, and recompute every page after a lib/ edit', () => {
    // The suite's demo build computed every page from the same code, content and date: with a copy
    // of its cache the copy's first build computes nothing again.
    cpSync(inject('demoBuild').cache, join(copy, '.cache'), { recursive: true });
    const warm = build();
    expect(warm.status, warm.stderr).toBe(0);
    expect(warm.stdout).toMatch(/bulletin pages: 0 computed, [1-9]\d* unchanged/);
    const home = (): string => readFileSync(join(copy, 'dist/harbour-roof/index.html'), 'utf8');
    expect(home()).toContain('Waning crescent');

    // The edit that Astro's own cache does not see: a label inside the computing library (the message catalogue).
    const file = join(copy, 'lib/core/language/catalogues/en.ts');
    writeFileSync(file, readFileSync(file, 'utf8').replace('other {Waning crescent Moon}', 'other {Waning sliver Moon}'));
    const edited = build();
    expect(edited.status, edited.stderr).toBe(0);
    expect(edited.stdout).toMatch(/bulletin pages: [1-9]\d* computed, 0 unchanged/);
    expect(home()).toContain('Waning sliver');
    expect(home()).not.toContain('Waning crescent');
  }, 180_000);
});
