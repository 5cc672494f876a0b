/**
 * The build's folders on disk: a lock so builds sharing a checkout or a cache take turns, removal
 * of the work folders that killed builds left behind, and the swap that puts a finished build in
 * place without a moment in which the output folder is missing (docs/deploy.md says what each
 * kind of failed, killed or concurrent build leaves behind).
 */
import { lstat, mkdir, open, readdir, readFile, readlink, rename, rm, stat, symlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { GloamingError } from '../lib/core/errors.ts';

/** Whether a process with this id is running on this machine. */
export function processAlive(pid: number): boolean {
  if (!Number.isInteger(pid) || pid <= 0) return false;
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    // EPERM: it exists but belongs to someone else.
    return (error as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** Whether `path` exists (following links). */
export async function exists(path: string): Promise<boolean> {
  try {
    await stat(path);
    return true;
  } catch {
    return false;
  }
}

/** A held build lock; `release()` removes it. */
export interface BuildLock {
  files: string[];
  release(): Promise<void>;
}

export interface LockOptions {
  /** Give up after this long, milliseconds (default 15 minutes: longer than any build). */
  timeoutMs?: number;
  /** Told once when the build has to wait, with the id of the build it waits for. */
  onWait?: (holderPid: number, file: string) => void;
  /** Poll interval, milliseconds. */
  pollMs?: number;
}

const LOCK_NAME = 'gloaming-build.lock';

/**
 * Takes the build lock in each of `folders` (in sorted order, so two builds never wait for each
 * other crosswise). A lock file holds the id of the build's process; a lock whose process is no
 * longer running (a build killed with `kill -9`) is taken over. Another running build is waited
 * for, up to `timeoutMs`, then the build stops with an error naming it.
 */
export async function acquireBuildLock(folders: string[], options: LockOptions = {}): Promise<BuildLock> {
  const files = [...new Set(folders)].sort().map((f) => join(f, LOCK_NAME));
  const held: string[] = [];
  const release = async (): Promise<void> => {
    for (const file of held.reverse()) await rm(file, { force: true });
    held.length = 0;
  };
  const deadline = Date.now() + (options.timeoutMs ?? 15 * 60_000);
  let told = false;
  try {
    for (const file of files) {
      await mkdir(dirname(file), { recursive: true });
      for (;;) {
        try {
          const handle = await open(file, 'wx');
          await handle.writeFile(`${process.pid}\n`);
          await handle.close();
          held.push(file);
          break;
        } catch (error) {
          if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
        }
        const holder = Number.parseInt(await readFile(file, 'utf8').catch(() => ''), 10);
        if (!processAlive(holder)) {
          // Left by a build that was killed (or still being written: then the holder wins the next round).
          if (Number.isInteger(holder)) await rm(file, { force: true });
          else await new Promise((r) => setTimeout(r, 50));
          continue;
        }
        if (Date.now() > deadline) {
          throw new GloamingError('unsafe-output', `another build (process ${holder}) is still running in this checkout or cache`, {
            place: { file },
            hint: 'wait for it to finish, or give each build its own checkout and GLOAMING_CACHE_DIR',
          });
        }
        if (!told) options.onWait?.(holder, file);
        told = true;
        await new Promise((r) => setTimeout(r, options.pollMs ?? 200));
      }
    }
  } catch (error) {
    await release();
    throw error;
  }
  return { files, release };
}

/** The prefix of every work folder a build of `out` makes beside it. */
function workPrefix(out: string): string {
  return `.tmp-${basename(out)}-`;
}

/** A new work folder name beside `out` for this process: `.tmp-<name>-<pid>`. */
export function workFolder(out: string): string {
  return join(dirname(out), `${workPrefix(out)}${process.pid}`);
}

/**
 * Removes the work folders beside `out` that builds no longer running left behind
 * (`.tmp-<name>-<pid>`, `.tmp-link-<name>-<pid>`, `.tmp-old-<name>-<pid>`, and a finished
 * `.<name>-<stamp>-<pid>` that never became the published one). Folders of running builds and
 * the folder `out` links to are kept. Returns the names removed.
 */
export async function removeStaleWork(out: string): Promise<string[]> {
  const parent = dirname(out);
  const name = basename(out).replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  const patterns = [new RegExp(`^\\.tmp-(?:old-|link-)?${name}-(\\d+)$`), new RegExp(`^\\.${name}-[0-9a-z]+-(\\d+)$`)];
  const removed: string[] = [];
  let entries: string[];
  try {
    entries = await readdir(parent);
  } catch {
    return removed;
  }
  const published = await readlink(out).catch(() => null);
  for (const entry of entries.sort()) {
    const m = patterns.map((p) => p.exec(entry)).find((x) => x);
    if (!m || entry === published || processAlive(Number(m[1]))) continue;
    await rm(join(parent, entry), { recursive: true, force: true });
    removed.push(entry);
  }
  return removed;
}

/** Swaps made by this process, part of each published folder's name. */
let swapCount = 0;

/** Where a published build lives when `out` is a link to it: `.<name>-<stamp>` beside `out`. */
function versionFolder(out: string, stamp: string): string {
  return join(dirname(out), `.${basename(out)}-${stamp}`);
}

/**
 * Puts the finished build `fresh` in place as `out`.
 *
 * Where the platform has symbolic links (Linux, macOS), `out` is a link to a folder beside it
 * (`.dist-<stamp>`), and the swap replaces the link in one `rename`, which POSIX makes atomic: a
 * server or upload reading `out` sees the old build or the new one, never nothing. The first such
 * build replaces a plain `out` folder (from an older gloaming) with two renames, once. Without
 * symbolic links (Windows) every swap is two renames, with a moment between them in which `out`
 * does not exist. In every case the previous build is removed only after the new one is in place.
 */
export async function swapInto(fresh: string, out: string, options: { links?: boolean } = {}): Promise<void> {
  const links = options.links ?? process.platform !== 'win32';
  const parent = dirname(out);
  const kind = await lstat(out).then(
    (s) => (s.isSymbolicLink() ? 'link' : 'folder'),
    () => null,
  );
  const had = kind !== null;
  const isLink = kind === 'link';
  if (!links) {
    const old = join(parent, `.tmp-old-${basename(out)}-${process.pid}`);
    if (had) await rename(out, old);
    try {
      await rename(fresh, out);
    } catch (error) {
      if (had) await rename(old, out);
      throw error;
    }
    if (had) await rm(old, { recursive: true, force: true });
    return;
  }
  // The clock alone can repeat within a millisecond (two swaps in a row): a per-process count keeps names apart.
  const stamp = `${Date.now().toString(36)}${(swapCount++).toString(36).padStart(3, '0')}-${process.pid}`;
  const target = versionFolder(out, stamp);
  await rename(fresh, target);
  const previous = isLink ? join(parent, await readlink(out)) : null;
  const link = join(parent, `.tmp-link-${basename(out)}-${process.pid}`);
  await rm(link, { force: true });
  await symlink(basename(target), link, 'dir');
  if (had && !isLink) {
    // A plain folder cannot be replaced atomically by a link: move it aside once.
    const old = join(parent, `.tmp-old-${basename(out)}-${process.pid}`);
    await rename(out, old);
    await rename(link, out);
    await rm(old, { recursive: true, force: true });
  } else {
    await rename(link, out);
  }
  if (previous && previous !== target && (await exists(previous))) await rm(previous, { recursive: true, force: true });
}
