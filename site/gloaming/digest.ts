/**
 * Cache keys for the content layer. Astro keeps loaded entries between builds and keeps an
 * entry whenever the loader hands it the same digest, so a digest must cover everything the
 * entry's computed strings depend on: the computing code (every file under `lib/` and
 * `site/gloaming/`, plus the lockfile that pins `astronomy-engine`), the input files (site,
 * template, objects) and the build date. Leave one out and a warm build serves stale values.
 */
import { createHash } from 'node:crypto';
import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join, relative, sep } from 'node:path';

/** SHA-256 (hex) of a string or bytes. */
export function sha256(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

/** Every file below `dir`, as sorted `/`-separated paths relative to `root`; missing folders give []. */
export function filesUnder(dir: string, root: string): string[] {
  const out: string[] = [];
  const walk = (d: string): void => {
    let names: string[];
    try {
      names = readdirSync(d);
    } catch {
      return;
    }
    for (const name of names) {
      const full = join(d, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(relative(root, full).split(sep).join('/'));
    }
  };
  walk(dir);
  return out.sort();
}

/** Hash of the named files (relative to `root`): each file's path and its bytes, in order. */
export function hashFiles(root: string, files: readonly string[]): string {
  const h = createHash('sha256');
  for (const file of files) {
    h.update(file).update('\0');
    try {
      h.update(readFileSync(join(root, file)));
    } catch {
      h.update('(missing)');
    }
    h.update('\0');
  }
  return h.digest('hex');
}

/** Folders and files whose contents decide every computed value on a page. */
export const CODE_INPUTS = { folders: ['lib', 'site/gloaming'], files: ['package.json', 'package-lock.json'] } as const;

/** Hash of the computing code: all files under `lib/` and `site/gloaming/`, package.json and the lockfile. */
export function codeDigest(root: string): string {
  const files = [...CODE_INPUTS.folders.flatMap((f) => filesUnder(join(root, f), root)), ...CODE_INPUTS.files];
  return hashFiles(root, files);
}

/**
 * An entry digest: SHA-256 of the named parts, in key order. Give every input by name
 * (`{ code, site, template, objects, today }`) so that a missing part is visible in review.
 */
export function entryDigest(parts: Record<string, string>): string {
  const keys = Object.keys(parts).sort();
  return sha256(JSON.stringify(keys.map((k) => [k, parts[k]])));
}
