/**
 * Vitest global setup of the `site` project: builds the demo once (`scripts/build.ts`, as
 * `npm run build` does, with the frozen date 2026-12-04) for every test file that only reads a
 * built site. Tests get the folders with `inject('demoBuild')` and must not write into them; a
 * test that changes an output builds into its own folder (it may share the cache folder, whose
 * writers take turns through the build lock). Runs only when a file of the `site` project runs.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { TestProject } from 'vitest/node';

export interface DemoBuild {
  /** The build date. */
  today: string;
  /** The published folder (read only). */
  dist: string;
  /** The build's cache folder (`GLOAMING_CACHE_DIR`): Astro's content store, charts and cards. */
  cache: string;
  /** A scratch folder for the tests' own builds and copies, removed after the run. */
  work: string;
  /** What the build printed on standard error. */
  stderr: string;
  /** Wall time of the build, milliseconds. */
  ms: number;
}

declare module 'vitest' {
  export interface ProvidedContext {
    demoBuild: DemoBuild;
  }
}

const ROOT = resolve(import.meta.dirname, '../..');
export const DEMO_TODAY = '2026-12-04'; // a Friday in ISO week 2026-W49

export default function setup(project: TestProject): () => void {
  // Inside the project: Astro puts its prerender chunks beside the output only when the output is inside the working directory.
  const work = mkdtempSync(join(ROOT, '.tmp-test-demo-'));
  const dist = join(work, 'dist');
  const cache = join(work, 'cache');
  const t0 = performance.now();
  const r = spawnSync(process.execPath, ['scripts/build.ts', '--today', DEMO_TODAY, '--out', dist], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, GLOAMING_CACHE_DIR: cache, GLOAMING_TODAY: '', GLOAMING_SITES: '', GLOAMING_CONTENT: '' },
    timeout: 300_000,
  });
  if (r.status !== 0) {
    rmSync(work, { recursive: true, force: true });
    throw new Error(`the demo build for the site tests failed (exit code ${r.status}):\n${r.stderr}`);
  }
  project.provide('demoBuild', { today: DEMO_TODAY, dist, cache, work, stderr: r.stderr, ms: performance.now() - t0 });
  return () => rmSync(work, { recursive: true, force: true });
}
