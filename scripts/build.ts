/**
 * Builds the site: `node scripts/build.ts [--today YYYY-MM-DD] [--sites a,b] [--out dist]`.
 *
 * 1. Reads the build date (`--today`, else `GLOAMING_TODAY`, else today's date in UTC — the only
 *    place in gloaming that reads the clock) and the site subset (`--sites`, else `GLOAMING_SITES`).
 * 2. Loads and validates every input up front, then renders every page it will publish through
 *    the same checks as `gloaming check` (`checkPages`): every error of every template is listed
 *    with `file:line:column` before Astro starts; warnings (a value placeholder with no value, a
 *    repeated section with nothing to repeat, a page over the budget) are printed with their site
 *    and week, and stop the build only with `--strict`.
 * 3. Takes the build lock (builds sharing this checkout or cache take turns) and removes work
 *    folders that killed builds left behind.
 * 4. Builds with Astro into a work folder beside the output folder (`.tmp-<out>-<pid>`).
 * 5. Checks every HTML, XML and calendar file (`assertPublishable`: no NaN, `undefined`,
 *    `Invalid Date` or empty placeholder) and that every file a page links is there.
 * 6. Swaps the work folder into place (`swapInto`: an atomic link swap where the platform has
 *    symbolic links), so a failed build leaves the previous output untouched and readers never
 *    find the output missing. docs/deploy.md says what failed, killed and concurrent builds leave.
 *
 * `--merge a b c --out dist` joins the outputs of CI shards (each built with `--sites`) into one
 * folder and writes one sitemap index for all of them.
 *
 * Errors are printed as `error: file:line:column: message` without a stack trace. Exit codes are
 * the command line's (`EXIT_CODES` in lib/core/errors.ts): 2 for input and output problems, 1 for
 * anything unexpected (with the stack).
 */
import { cp, mkdir, readdir, readFile, rm, writeFile } from 'node:fs/promises';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { ProblemList, assertPublishable, checkPages, errorsOf, formatProblem } from '../lib/outputs/bulletin/index.ts';
import { ChartCache } from '../lib/outputs/chart/cache.ts';
import { publicOrigin } from '../lib/outputs/centre.ts';
import { ERROR_CODES, EXIT_CODES, GloamingError, type ErrorCode, type Place } from '../lib/core/errors.ts';
import { parseLocalDate } from '../lib/core/time.ts';
import { chartCacheDir, parseSiteList } from '../site/gloaming/options.ts';
import { loadProject } from '../site/gloaming/project.ts';
import { budgetMessage, checkLinkedFiles, pagesOverBudget } from './output-check.ts';
import { acquireBuildLock, exists, removeStaleWork, swapInto, workFolder } from './work-folders.ts';

const ROOT = resolve(dirname(fileURLToPath(import.meta.url)), '..');

export interface BuildOptions {
  /** Build date, YYYY-MM-DD. */
  today: string;
  /** Site ids to build, or null for all. */
  sites: string[] | null;
  /** Output folder (replaced only when the whole build succeeds). */
  out: string;
  /** Content folder (default `content`). */
  content: string;
  /** Astro's log level; default 'warn'. */
  logLevel: 'debug' | 'info' | 'warn' | 'error' | 'silent';
  /** Warnings (a value placeholder without a value, an empty repeated section, a page over the 40 KB budget) stop the build too (`--strict`). */
  strict?: boolean;
}

export interface BuildResult {
  out: string;
  /** Number of files written. */
  files: number;
  /** Wall time of the Astro build, milliseconds. */
  astroMs: number;
  totalMs: number;
  /** The warnings found (errors stop the build). Later checks of the output add theirs here. */
  problems: ProblemList;
  /** The origin feeds, the sitemap and cards link to; `preview` when content/centre.yaml has no `url`. */
  origin: { url: string; preview: boolean };
}

/**
 * The build stopped because of problems in its input or output: every problem found (up to the
 * list's limit), printed one a line by `report`. The previous output is untouched.
 */
export class BuildProblems extends GloamingError {
  readonly problems: ProblemList;

  constructor(problems: ProblemList, strict: boolean) {
    const errors = problems.errors.length;
    const warnings = problems.warnings.length;
    const why = errors > 0 ? `${errors} error(s)` : `${warnings} warning(s) with --strict`;
    super(problems.errors[0]?.code ?? 'invalid-value', `the build stopped: ${why}; the previous output is unchanged`, {
      ...(problems.items[0] ? { place: problems.items[0].place } : {}),
    });
    Object.defineProperty(this, 'message', { value: [...problems.items.map(formatProblem), `${why}${problems.dropped ? ` (and ${problems.dropped} more not listed)` : ''}: the build stopped${strict && errors === 0 ? ' (--strict)' : ''}; the previous output is unchanged`].join('\n') });
    this.problems = problems;
  }
}

/** Stops the build when `problems` has errors, or any warning with `strict`. */
export function stopOnProblems(problems: ProblemList, strict: boolean): void {
  if (problems.errors.length > 0 || (strict && problems.items.length > 0)) throw new BuildProblems(problems, strict);
}

/** Today's date in UTC, YYYY-MM-DD. The one reading of the clock in gloaming. */
function utcToday(): string {
  return new Date().toISOString().slice(0, 10);
}

/** Reads command-line arguments and the environment into build options. */
export function readOptions(argv: string[], env: Record<string, string | undefined>): BuildOptions & { merge: string[] | null } {
  let values: Record<string, string | boolean | undefined>;
  let positionals: string[];
  try {
    ({ values, positionals } = parseArgs({
      args: argv,
      options: {
        today: { type: 'string' },
        sites: { type: 'string' },
        out: { type: 'string' },
        content: { type: 'string' },
        merge: { type: 'boolean' },
        verbose: { type: 'boolean' },
        strict: { type: 'boolean' },
      },
      allowPositionals: true,
      strict: true,
    }));
  } catch (error) {
    throw new GloamingError('invalid-argument', (error as Error).message, {
      expected: '--today YYYY-MM-DD, --sites a,b, --out <folder>, --content <folder>, --verbose, --strict, or --merge <folders…>',
    });
  }
  if (positionals.length && !values.merge) {
    throw new GloamingError('invalid-argument', `unexpected argument '${positionals[0]}'`, { expected: 'options only (folders only with --merge)' });
  }
  const today = (values.today as string | undefined) || env.GLOAMING_TODAY || utcToday();
  parseLocalDate(today, values.today ? '--today' : 'GLOAMING_TODAY');
  return {
    today,
    sites: parseSiteList((values.sites as string | undefined) ?? env.GLOAMING_SITES),
    out: resolve((values.out as string | undefined) ?? 'dist'),
    // Relative to the working folder: `npx gloaming build` in a centre's own folder builds its content.
    content: resolve((values.content as string | undefined) || env.GLOAMING_CONTENT || 'content'),
    logLevel: values.verbose ? 'info' : 'warn',
    strict: values.strict === true,
    merge: values.merge ? positionals.map((p) => resolve(p)) : null,
  };
}

/** Every file below `dir`, as absolute paths, sorted. */
async function walk(dir: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const full = join(dir, entry.name);
    if (entry.isDirectory()) out.push(...(await walk(full)));
    else out.push(full);
  }
  return out.sort();
}

const CHART_LINK = /\/charts\/([0-9a-f]+(?:@2x)?\.(?:svg|png))/g;

/**
 * Copies the finder charts the pages link to (`/charts/<hash>.svg`) from the chart cache into the
 * output, so only charts in use are published. A linked chart missing from the cache is an error
 * (a page must never show a broken image).
 */
export async function copyLinkedCharts(dir: string, chartDir: string): Promise<number> {
  const wanted = new Map<string, string>();
  for (const file of await walk(dir)) {
    if (!file.endsWith('.html')) continue;
    for (const m of (await readFile(file, 'utf8')).matchAll(CHART_LINK)) wanted.set(m[1]!, relative(dir, file));
  }
  if (wanted.size === 0) return 0;
  await mkdir(join(dir, 'charts'), { recursive: true });
  for (const [name, page] of [...wanted].sort()) {
    const from = join(chartDir, name);
    if (!(await exists(from))) {
      throw new GloamingError('unsafe-output', `the page links the chart ${name}, which is not in the chart cache`, {
        place: { file: page },
        hint: `delete node_modules/.astro (Astro's and the charts' caches) and build again`,
      });
    }
    await cp(from, join(dir, 'charts', name));
  }
  return wanted.size;
}

/**
 * The final check: every HTML, XML and calendar file must be publishable, and every file a page
 * links (fonts, CSS, images, charts, cards, feeds) must be in the output — with `pages`, every
 * page it links too. A page over the 40 KB HTML+CSS budget is a warning, an error with `strict`.
 * Paths in errors are relative to `dir`. Returns the number of files and the warnings.
 */
export async function checkOutput(dir: string, options: { pages: boolean; strict?: boolean } = { pages: false }): Promise<{ files: number; warnings: string[] }> {
  const files = await walk(dir);
  const rel = (file: string): string => relative(dir, file).split(sep).join('/');
  for (const file of files) {
    if (!/\.(html|xml|ics)$/.test(file)) continue;
    assertPublishable(await readFile(file, 'utf8'), rel(file));
  }
  const pages = files.filter((f) => f.endsWith('.html')).map(rel);
  await checkLinkedFiles(dir, pages, options);
  const over = await pagesOverBudget(dir, pages);
  if (over.length && options.strict) {
    throw new GloamingError('unsafe-output', `${budgetMessage(over[0]!)}${over.length > 1 ? ` (and ${over.length - 1} more page(s))` : ''}`, {
      hint: 'shorten the template, or build without --strict to publish with a warning',
    });
  }
  return { files: files.length, warnings: over.map(budgetMessage) };
}

/**
 * Folders a build shares with other builds: Astro's `.astro` folder in the project (and in the
 * working directory, where Astro puts its prerender chunks when the output is outside it) and the
 * cache folder. Builds that share one take turns (`acquireBuildLock`).
 */
function sharedFolders(cacheDir: string): string[] {
  return [join(ROOT, '.astro'), join(process.cwd(), '.astro'), cacheDir];
}

/**
 * The `GloamingError` behind `error`, or null. One thrown inside Astro's module runner is an
 * instance of another copy of the class, often wrapped in Astro's own errors: it is recognised by
 * shape along the `cause` chain and rebuilt here with its own code, place and message.
 */
export function asGloamingError(error: unknown): GloamingError | null {
  const seen = new Set<unknown>();
  let e: unknown = error;
  while (e && typeof e === 'object' && !seen.has(e)) {
    seen.add(e);
    if (e instanceof GloamingError) return e;
    const o = e as { name?: unknown; code?: unknown; message?: unknown; cause?: unknown; place?: unknown; reason?: unknown };
    if (o.name === 'GloamingError' && typeof o.code === 'string' && o.code in ERROR_CODES && typeof o.message === 'string') {
      const copy = new GloamingError(o.code as ErrorCode, typeof o.reason === 'string' ? o.reason : o.message, { place: o.place as Place | undefined });
      // The message was formatted by the other copy of the class: keep it word for word.
      Object.defineProperty(copy, 'message', { value: o.message });
      return copy;
    }
    e = o.cause;
  }
  return null;
}

/** Builds the site with Astro into a temporary folder, checks it and swaps it into place. */
export async function buildSite(options: BuildOptions): Promise<BuildResult> {
  const t0 = performance.now();
  // Validate every input before starting Astro: a bad file is reported with its place, fast.
  const project = loadProject(ROOT, { today: options.today, only: options.sites, content: options.content });
  // Render every page through the checks first: all template errors at once, warnings per site and week.
  // Charts go into the build's chart cache with the loader's code version, so Astro finds them there.
  const problems = new ProblemList();
  const charts = { cache: new ChartCache({ dir: chartCacheDir(process.env, ROOT), codeVersion: project.codeDigest }), url: (file: string) => `/charts/${file}` };
  checkPages(project.pages, { bodies: project.bodies, charts, problems });
  stopOnProblems(problems, options.strict ?? false);

  process.env.GLOAMING_TODAY = options.today;
  if (options.sites) process.env.GLOAMING_SITES = options.sites.join(',');
  else delete process.env.GLOAMING_SITES;
  process.env.GLOAMING_CONTENT = options.content;
  process.env.ASTRO_TELEMETRY_DISABLED = '1';
  // Social cards are cached by content hash beside Astro's own cache.
  process.env.GLOAMING_CODE_DIGEST = project.codeDigest;
  process.env.GLOAMING_CHART_CACHE = chartCacheDir(process.env, ROOT);
  process.env.GLOAMING_CARD_CACHE = resolve(process.env.GLOAMING_CACHE_DIR ?? join(ROOT, 'node_modules/.astro'), 'gloaming');

  await mkdir(dirname(options.out), { recursive: true });
  const lock = await acquireBuildLock(sharedFolders(process.env.GLOAMING_CARD_CACHE), {
    onWait: (pid) => console.error(`waiting for another build (process ${pid}) in this checkout to finish …`),
  });
  const tmp = workFolder(options.out);
  try {
    // Work folders of builds that were killed (kill -9, a cancelled CI job) go first.
    await removeStaleWork(options.out);
    await rm(tmp, { recursive: true, force: true });
    const { build } = await import('astro');
    const t1 = performance.now();
    // Astro writes its prerender chunks below the working folder when the output is there, and
    // they import gloaming's packages: a centre's own folder (`npx gloaming build`) may not have
    // them, so Astro runs from gloaming's folder (the output path is absolute).
    const cwd = process.cwd();
    process.chdir(ROOT);
    try {
      await build({ root: ROOT, outDir: tmp, logLevel: options.logLevel, mode: 'production' });
    } finally {
      process.chdir(cwd);
    }
    const astroMs = performance.now() - t1;
    await copyLinkedCharts(tmp, process.env.GLOAMING_CHART_CACHE);
    // The output's own checks (the page budget) add their warnings to the same list; --strict decides once, here.
    const { files, warnings } = await checkOutput(tmp, { pages: options.sites === null });
    for (const w of warnings) problems.add({ kind: 'page-size', severity: 'warning', message: w, place: {} });
    stopOnProblems(problems, options.strict ?? false);
    await swapInto(tmp, options.out);
    return { out: options.out, files, astroMs, totalMs: performance.now() - t0, problems, origin: publicOrigin(project.centre, process.env) };
  } catch (error) {
    await rm(tmp, { recursive: true, force: true });
    throw asGloamingError(error) ?? error;
  } finally {
    await lock.release();
  }
}

/** Joins shard outputs into `out`; each shard's sitemap files are listed in one sitemap index. */
export async function mergeShards(shards: string[], out: string): Promise<{ files: number }> {
  if (shards.length === 0) throw new GloamingError('invalid-argument', 'nothing to merge', { expected: '--merge <shard folder> <shard folder> … --out <folder>' });
  await removeStaleWork(out);
  const tmp = workFolder(out);
  await rm(tmp, { recursive: true, force: true });
  await mkdir(tmp, { recursive: true });
  try {
    const sitemaps: string[] = [];
    let siteUrl: string | null = null;
    for (const shard of shards) {
      if (!(await exists(shard))) throw new GloamingError('invalid-argument', `no shard output at '${shard}'`, { expected: 'a folder written by a `--sites` build' });
      for (const file of await walk(shard)) {
        const rel = relative(shard, file).split(sep).join('/');
        if (/^sitemap-.*index\.xml$/.test(rel) || rel === 'sitemap-index.xml') {
          const xml = await readFile(file, 'utf8');
          for (const m of xml.matchAll(/<loc>([^<]+)<\/loc>/g)) {
            const loc = m[1]!;
            siteUrl ??= new URL('/', loc).href;
            sitemaps.push(new URL(loc).pathname.replace(/^\//, ''));
          }
          continue;
        }
        // Shared files (home page, assets) are identical across shards built on the same date.
        await cp(file, join(tmp, rel), { force: true });
      }
    }
    const unique = [...new Set(sitemaps)].sort();
    const base = siteUrl ?? '/';
    const index =
      '<?xml version="1.0" encoding="UTF-8"?><sitemapindex xmlns="http://www.sitemaps.org/schemas/sitemap/0.9">' +
      unique.map((p) => `<sitemap><loc>${new URL(p, base).href}</loc></sitemap>`).join('') +
      '</sitemapindex>';
    await writeFile(join(tmp, 'sitemap-index.xml'), index);
    const { files } = await checkOutput(tmp);
    await swapInto(tmp, out);
    return { files };
  } catch (error) {
    await rm(tmp, { recursive: true, force: true });
    throw error;
  }
}

/**
 * Prints an error the way compilers do and returns the exit code (`EXIT_CODES`, the same
 * convention as the command line): input problems without a stack (2), anything else with it (1).
 */
export function report(error: unknown, print: (line: string) => void = console.error): number {
  if (error instanceof BuildProblems) {
    for (const line of error.message.split('\n')) print(line);
    return EXIT_CODES.input;
  }
  const known = asGloamingError(error);
  if (known) {
    for (const e of errorsOf(known)) print(`error: ${e.message}`);
    return EXIT_CODES.input;
  }
  print('error: the build failed unexpectedly; the previous output is unchanged.');
  print(error instanceof Error ? (error.stack ?? error.message) : String(error));
  return EXIT_CODES.unexpected;
}

/** The build as a command: `node scripts/build.ts …` and `npx gloaming build …`. Returns the exit code. */
export async function main(argv: string[] = process.argv.slice(2)): Promise<number> {
  try {
    const options = readOptions(argv, process.env);
    if (options.merge) {
      const { files } = await mergeShards(options.merge, options.out);
      console.log(`merged ${options.merge.length} shard(s): ${files} files in ${relative(process.cwd(), options.out) || '.'}`);
      return EXIT_CODES.ok;
    }
    const result = await buildSite(options);
    for (const p of result.problems.items) console.error(formatProblem(p));
    const where = relative(process.cwd(), result.out) || '.';
    const which = options.sites ? options.sites.join(', ') : 'all sites';
    const warnings = result.problems.items.length + result.problems.dropped;
    if (result.origin.preview) {
      console.log(`preview: ${relative(process.cwd(), join(options.content, 'centre.yaml'))} has no url, so feeds, the sitemap and social cards link to ${result.origin.url} and pages are marked noindex; set url: to publish`);
    }
    console.log(`built ${which} for ${options.today}${result.origin.preview ? ' (a preview)' : ` for ${result.origin.url}`}: ${result.files} files in ${where} (${(result.totalMs / 1000).toFixed(1)} s)${warnings ? `, ${warnings} warning(s) above` : ''}`);
    return EXIT_CODES.ok;
  } catch (error) {
    return report(error);
  }
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  process.exitCode = await main();
}
