/**
 * Build options as the Astro side receives them: through the environment, set by
 * `scripts/build.ts` (the only place that reads the clock). Nothing here reads the clock: a build
 * without `GLOAMING_TODAY` stops with a message saying how to give the date.
 */
import { GloamingError } from '../../lib/core/errors.ts';
import { parseLocalDate } from '../../lib/core/time.ts';

export interface SiteBuildOptions {
  /** The build date, YYYY-MM-DD; its ISO week is "this week". */
  today: string;
  /** Site ids to build (a CI shard), or null for all. Sorted, unique. */
  only: string[] | null;
  /** Content folder (sites/, bulletins/, objects/), absolute or relative to the project root; default `content`. */
  content: string;
}

/** Reads a comma-separated site list ("a,b"); empty gives null (all sites). */
export function parseSiteList(text: string | undefined): string[] | null {
  const ids = [...new Set((text ?? '').split(',').map((s) => s.trim()).filter(Boolean))].sort();
  return ids.length ? ids : null;
}

/** Options from `GLOAMING_TODAY`, `GLOAMING_SITES` and `GLOAMING_CONTENT`. */
export function optionsFromEnv(env: Record<string, string | undefined> = process.env): SiteBuildOptions {
  const today = env.GLOAMING_TODAY;
  if (!today) {
    throw new GloamingError('invalid-argument', 'the build date is not set', {
      place: { field: 'GLOAMING_TODAY' },
      expected: 'a date YYYY-MM-DD',
      hint: 'build with `npm run build` (it sets the date), or e.g. `GLOAMING_TODAY=2026-12-04 npx astro dev`',
    });
  }
  parseLocalDate(today, 'GLOAMING_TODAY');
  return { today, only: parseSiteList(env.GLOAMING_SITES), content: env.GLOAMING_CONTENT || 'content' };
}

/**
 * Folder of the finder-chart cache (content-hashed SVG files). It sits inside Astro's own cache
 * folder (`node_modules/.astro`, or `GLOAMING_CACHE_DIR`), so clearing one clears both;
 * `GLOAMING_CHART_CACHE` overrides it.
 */
export function chartCacheDir(env: Record<string, string | undefined> = process.env, root = process.cwd()): string {
  return env.GLOAMING_CHART_CACHE || `${env.GLOAMING_CACHE_DIR || `${root}/node_modules/.astro`}/gloaming/charts`;
}
