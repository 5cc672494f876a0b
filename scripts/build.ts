/**
 * Builds the site: `node scripts/build.ts [--today YYYY-MM-DD] [--sites a,b] [--out dist]`.
 * Astro does the work through the `gloaming()` integration (site/gloaming/integration.ts); this
 * wrapper keeps only what Astro cannot do:
 *
 * 1. Reads the build date (`--today`, else `GLOAMING_TODAY`, else today's date in UTC — the only
 *    place in gloaming that reads the clock) and the site subset (`--sites`, else `GLOAMING_SITES`).
 * 2. Loads and validates every input before Astro starts (the session the integration then uses):
 *    a bad file is reported with its `file:line:column` at once.
 * 3. Takes the build lock (builds sharing this checkout or cache take turns) and removes work
 *    folders that killed builds left behind.
 * 4. Builds with Astro into a work folder beside the output folder (`.tmp-<out>-<pid>`). The
 *    integration renders every page through the checks of `gloaming check` (every template error
 *    at once; warnings stop the build only with `--strict`) and checks the output after the build.
 * 5. Swaps the work folder into place (`swapInto`: an atomic link swap where the platform has
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
import { cp, mkdir, readFile, rm, writeFile } from 'node:fs/promises';
import { enableCompileCache } from 'node:module';
import { dirname, join, relative, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { ProblemList, errorsOf, formatProblem } from '../lib/outputs/bulletin/index.ts';
import { publicOrigin } from '../lib/outputs/centre.ts';
import { EXIT_CODES, GloamingError } from '../lib/core/errors.ts';
import { parseLocalDate } from '../lib/core/time.ts';
import { parseSiteList } from '../site/gloaming/options.ts';
import { BuildProblems, GloamingSession } from '../site/gloaming/session.ts';
import { checkOutput, walk } from './output-check.ts';
import { acquireBuildLock, exists, removeStaleWork, swapInto, workFolder } from './work-folders.ts';

export { BuildProblems, stopOnProblems } from '../site/gloaming/session.ts';

// Astro, Vite and the site's code load after this: Node keeps their compiled code in its compile
// cache (a folder under the system's temporary folder), so the next build starts sooner.
enableCompileCache();

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
  /** Warnings (a value placeholder without a value, an empty repeated section, a page over the 40 KB budget, a comet's elements too old for the build date) stop the build too (`--strict`). */
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

/**
 * Folders a build shares with other builds: Astro's `.astro` folder in the project (and in the
 * working directory, where Astro puts its prerender chunks when the output is outside it) and the
 * cache folder. Builds that share one take turns (`acquireBuildLock`).
 */
function sharedFolders(cacheDir: string): string[] {
  return [join(ROOT, '.astro'), join(process.cwd(), '.astro'), cacheDir];
}

/**
 * The `GloamingError` behind `error`, or null: the error itself, or one Astro passed on as the
 * `cause` of its own error. It is returned as it was thrown (the integration runs the library in
 * Node's own module graph, so it is an instance of the library's class, with its place).
 */
export function asGloamingError(error: unknown): GloamingError | null {
  const seen = new Set<unknown>();
  let e: unknown = error;
  while (e && typeof e === 'object' && !seen.has(e)) {
    seen.add(e);
    if (e instanceof GloamingError) return e;
    e = (e as { cause?: unknown }).cause;
  }
  return null;
}

/** Builds the site with Astro into a temporary folder, checks it and swaps it into place. */
export async function buildSite(options: BuildOptions): Promise<BuildResult> {
  const t0 = performance.now();
  const session = new GloamingSession({
    root: ROOT,
    cacheDir: resolve(process.env.GLOAMING_CACHE_DIR ?? join(ROOT, 'node_modules/.astro')),
    today: options.today,
    sites: options.sites,
    content: options.content,
    strict: options.strict ?? false,
  });
  // Validate every input before starting Astro: a bad file is reported with its place, fast.
  session.project();
  process.env.ASTRO_TELEMETRY_DISABLED = '1';

  await mkdir(dirname(options.out), { recursive: true });
  const lock = await acquireBuildLock(sharedFolders(session.cacheDir), {
    onWait: (pid) => console.error(`waiting for another build (process ${pid}) in this checkout to finish …`),
  });
  const tmp = workFolder(options.out);
  try {
    // Work folders of builds that were killed (kill -9, a cancelled CI job) go first.
    await removeStaleWork(options.out);
    await rm(tmp, { recursive: true, force: true });
    // Astro and the site's configuration load only now: a wrong flag or content file is reported
    // before, without their second of start-up.
    const [{ build }, { siteConfig }] = await Promise.all([import('astro'), import('../astro.config.mjs')]);
    const t1 = performance.now();
    // Astro writes its prerender chunks below the working folder when the output is there, and
    // they import gloaming's packages: a centre's own folder (`npx gloaming build`) may not have
    // them, so Astro runs from gloaming's folder (the output path is absolute).
    const cwd = process.cwd();
    process.chdir(ROOT);
    try {
      await build({ ...siteConfig({ session }), root: ROOT, configFile: false, outDir: tmp, logLevel: options.logLevel, mode: 'production' });
    } finally {
      process.chdir(cwd);
    }
    const astroMs = performance.now() - t1;
    const files = (await walk(tmp)).length;
    await swapInto(tmp, options.out);
    return { out: options.out, files, astroMs, totalMs: performance.now() - t0, problems: session.problems, origin: publicOrigin(session.project().centre, process.env) };
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
  const known = asGloamingError(error);
  if (known instanceof BuildProblems) {
    for (const line of known.message.split('\n')) print(line);
    return EXIT_CODES.input;
  }
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
