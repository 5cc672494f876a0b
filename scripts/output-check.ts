/**
 * The build's last look at its output before publishing it: every file a page links — fonts and
 * images in its CSS, stylesheets, icons, finder charts, social cards, feeds — must be in the output.
 * A build that lost a file on the way (an interrupted copy, two builds writing one folder) stops
 * with the page and the missing address instead of publishing a page with a hole in it.
 */
import { readdir, readFile } from 'node:fs/promises';
import { existsSync, statSync } from 'node:fs';
import { join, posix, relative, sep } from 'node:path';
import { PAGE_BUDGET_BYTES, assertPublishable } from '../lib/outputs/bulletin/index.ts';
import { GloamingError } from '../lib/core/errors.ts';

/** An address a page links, with the page's path (relative to the output folder, `/` separators). */
export interface Link {
  page: string;
  url: string;
}

const ATTRIBUTE = /\s(?:href|src|content|poster|data)\s*=\s*"([^"]*)"/gi;
const SRCSET = /\ssrcset\s*=\s*"([^"]*)"/gi;
const CSS_URL = /url\(\s*(['"]?)([^'")]+)\1\s*\)/gi;

function decodeAttribute(value: string): string {
  return value.replace(/&(amp|quot|#39|apos|lt|gt);/g, (_, e: string) => ({ amp: '&', quot: '"', '#39': "'", apos: "'", lt: '<', gt: '>' })[e]!);
}

/** Every address in one HTML page: attributes that load or link something, srcset entries and CSS `url()`. */
export function linksOf(html: string, page: string): Link[] {
  const urls: string[] = [];
  for (const m of html.matchAll(ATTRIBUTE)) urls.push(decodeAttribute(m[1]!));
  for (const m of html.matchAll(SRCSET)) for (const part of decodeAttribute(m[1]!).split(',')) urls.push(part.trim().split(/\s+/)[0]!);
  for (const m of html.matchAll(CSS_URL)) urls.push(decodeAttribute(m[2]!));
  return urls.filter((u) => u !== '').map((url) => ({ page, url }));
}

/** The site's own origin, from the page's canonical link (`<link rel="canonical" href="https://…">`). */
function canonicalOrigin(html: string): string | null {
  const m = /<link[^>]*rel="canonical"[^>]*href="([^"]+)"/i.exec(html) ?? /<link[^>]*href="([^"]+)"[^>]*rel="canonical"/i.exec(html);
  try {
    return m ? new URL(decodeAttribute(m[1]!)).origin : null;
  } catch {
    return null;
  }
}

/**
 * The path inside the output that `url` names, or null when it points elsewhere (another site,
 * `mailto:`, a fragment of the same page, or a `content` attribute that is not an address).
 */
export function localPath(url: string, page: string, origin: string | null): string | null {
  const base = `https://gloaming.invalid/${page}`;
  let resolved: URL;
  try {
    resolved = new URL(url, base);
  } catch {
    return null;
  }
  const own = resolved.origin === 'https://gloaming.invalid' || (origin !== null && resolved.origin === origin);
  if (!own || !/^(https?:|\/|\.{1,2}\/)/.test(url)) return null;
  if (url.startsWith('#')) return null;
  return decodeURIComponent(resolved.pathname).replace(/^\//, '');
}

/** Whether `path` names a page (a folder served from index.html) rather than a file. */
function isPage(path: string): boolean {
  return path === '' || path.endsWith('/') || path.endsWith('.html') || !posix.basename(path).includes('.');
}

/**
 * Checks that every asset each HTML page links exists in `dir` (and, with `pages`, every page it
 * links too — off for a shard build, whose home page lists sites built elsewhere). Throws
 * `unsafe-output` naming the page and the address. Returns the number of links checked.
 */
export async function checkLinkedFiles(dir: string, htmlFiles: string[], options: { pages: boolean }): Promise<number> {
  let checked = 0;
  for (const page of htmlFiles) {
    const html = await readFile(join(dir, page), 'utf8');
    const origin = canonicalOrigin(html);
    for (const link of linksOf(html, page)) {
      const path = localPath(link.url, page, origin);
      if (path === null) continue;
      const pageLink = isPage(path);
      if (pageLink && !options.pages) continue;
      const file = pageLink && !path.endsWith('.html') ? join(dir, path, 'index.html') : join(dir, path);
      checked++;
      if (!existsSync(file) || !statSync(file).isFile()) {
        throw new GloamingError('unsafe-output', `the page links ${pageLink ? 'the page' : 'the file'} ${link.url}, which is not in the output`, {
          place: { file: page },
          hint: 'nothing was published; build again, and do not run two builds into one folder at once',
        });
      }
    }
  }
  return checked;
}

/** A page over the budget. */
export interface OverBudget {
  page: string;
  bytes: number;
}

const STYLESHEET = /<link\b[^>]*\brel="stylesheet"[^>]*>/gi;

/** The pages whose HTML plus the stylesheets they link weigh more than `PAGE_BUDGET_BYTES`. */
export async function pagesOverBudget(dir: string, htmlFiles: string[]): Promise<OverBudget[]> {
  const over: OverBudget[] = [];
  for (const page of htmlFiles) {
    const html = await readFile(join(dir, page));
    let bytes = html.length;
    for (const tag of html.toString('utf8').matchAll(STYLESHEET)) {
      const href = /\bhref="([^"]+)"/.exec(tag[0])?.[1];
      const path = href ? localPath(decodeAttribute(href), page, null) : null;
      if (path && existsSync(join(dir, path))) bytes += statSync(join(dir, path)).size;
    }
    if (bytes > PAGE_BUDGET_BYTES) over.push({ page, bytes });
  }
  return over;
}

/** The budget problem of a page in words. */
export function budgetMessage(o: OverBudget): string {
  return `${o.page}: the page weighs ${(o.bytes / 1024).toFixed(1)} KB of HTML and CSS, over the ${PAGE_BUDGET_BYTES / 1024} KB budget for phones`;
}

/** Every file below `dir`, as absolute paths, sorted. */
export async function walk(dir: string): Promise<string[]> {
  const out: string[] = [];
  for (const entry of await readdir(dir, { withFileTypes: true })) {
    const full = join(dir, entry.name);
    if (entry.isDirectory()) out.push(...(await walk(full)));
    else out.push(full);
  }
  return out.sort();
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

