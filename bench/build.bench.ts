/**
 * Benchmark of the whole site build (issue #6): the demo (3 sites, standing weekly bulletin for
 * 13 weeks plus a one-off) built by `scripts/build.ts` in a child process, as `npm run build`
 * does. Cold = an empty content-layer cache (every page computed); warm = the same inputs again
 * (every entry reused by digest, Astro still renders HTML, cards, feeds and sitemap). Per-page
 * cost = build time / number of HTML pages written.
 *
 *   node bench/build.bench.ts          (or `npm run bench -- build`)
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { countFiles as count, median, report, type BenchRow } from './harness.ts';

const ROOT = resolve(import.meta.dirname, '..');
const TODAY = '2026-12-04';
const RUNS = 3;

function timedBuild(work: string, cache: string): number {
  const t = performance.now();
  const r = spawnSync(process.execPath, ['scripts/build.ts', '--today', TODAY, '--out', join(work, 'dist')], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, GLOAMING_CACHE_DIR: cache, GLOAMING_TODAY: '', GLOAMING_SITES: '', GLOAMING_CONTENT: '' },
  });
  if (r.status !== 0) throw new Error(`build failed: ${r.stderr}`);
  return performance.now() - t;
}

export async function run(): Promise<BenchRow[]> {
  // Output inside the project: Astro keeps its prerender chunks beside an output inside the working directory.
  const work = mkdtempSync(join(ROOT, '.tmp-bench-build-'));
  try {
    const cold: number[] = [];
    const warm: number[] = [];
    for (let i = 0; i < RUNS; i++) {
      const cache = join(work, `cache-${i}`);
      cold.push(timedBuild(work, cache));
      warm.push(timedBuild(work, cache));
    }
    const pages = count(join(work, 'dist'), '.html');
    const cards = count(join(work, 'dist'), '.png');
    const c = median(cold);
    const w = median(warm);
    return [
      { name: `build: demo site cold (${pages} pages, ${cards} cards)`, medianMs: c, samples: RUNS },
      { name: 'build: demo site warm (content cache hit)', medianMs: w, samples: RUNS },
      { name: 'build: per HTML page, cold', medianMs: c / pages, samples: RUNS },
      { name: 'build: per HTML page, warm', medianMs: w / pages, samples: RUNS },
    ];
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

if (import.meta.main) report(await run());
