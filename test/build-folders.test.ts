/**
 * The build's folders (issue #14 §1, §2): the build lock, removal of work folders left by killed
 * builds, the gap-free output swap, and the final check that every file a page links is there.
 * These run on small folders made here; test/site-build.test.ts runs real builds at once.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, lstatSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { GloamingError } from '../lib/core/errors.ts';
import { readOptions } from '../scripts/build.ts';
import { checkLinkedFiles, checkOutput } from '../scripts/output-check.ts';
import { acquireBuildLock, removeStaleWork, swapInto, workFolder } from '../scripts/work-folders.ts';

const scratch = mkdtempSync(join(tmpdir(), 'gloaming-folders-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** The id of a process that has ended (a child that ran `true`). */
function deadPid(): number {
  const r = spawnSync('true');
  return r.pid!;
}

function freshBuild(parent: string, out: string, content: string): string {
  const dir = workFolder(join(parent, out));
  mkdirSync(dir, { recursive: true });
  writeFileSync(join(dir, 'index.html'), content);
  return dir;
}

/** Swaps `count` builds into `out` while a poller looks for it between every step of the event loop. */
async function swapsWatched(parent: string, count: number, options: { links?: boolean }): Promise<{ misses: number; looks: number }> {
  const out = join(parent, 'dist');
  let misses = 0;
  let looks = 0;
  let running = true;
  const poll = (): void => {
    if (!running) return;
    looks++;
    if (!existsSync(join(out, 'index.html'))) misses++;
    setImmediate(poll);
  };
  await swapInto(freshBuild(parent, 'dist', 'build 0'), out, options);
  setImmediate(poll);
  for (let i = 1; i <= count; i++) await swapInto(freshBuild(parent, 'dist', `build ${i}`), out, options);
  running = false;
  return { misses, looks };
}

describe('the output swap', () => {
  it('never leaves the output missing where the platform has symbolic links (POSIX rename of a link is atomic)', async () => {
    const parent = join(scratch, 'swap-links');
    mkdirSync(parent);
    const { misses, looks } = await swapsWatched(parent, 40, { links: true });
    expect(looks).toBeGreaterThan(40);
    expect(misses).toBe(0);
    expect(readFileSync(join(parent, 'dist/index.html'), 'utf8')).toBe('build 40');
    expect(lstatSync(join(parent, 'dist')).isSymbolicLink()).toBe(true);
    // Only the published build is left: no work folders, no previous builds.
    expect(readdirSync(parent).sort()).toEqual([readdirSync(parent).find((n) => n.startsWith('.dist-'))!, 'dist'].sort());
  });

  it('the probe does see the gap of the two-rename swap (what builds did before, and still do without links)', async () => {
    const parent = join(scratch, 'swap-renames');
    mkdirSync(parent);
    const { misses } = await swapsWatched(parent, 40, { links: false });
    expect(misses).toBeGreaterThan(0);
    expect(readFileSync(join(parent, 'dist/index.html'), 'utf8')).toBe('build 40');
  });

  it('replaces a plain output folder from an older build by a link, once', async () => {
    const parent = join(scratch, 'swap-migrate');
    mkdirSync(join(parent, 'dist'), { recursive: true });
    writeFileSync(join(parent, 'dist/index.html'), 'old');
    await swapInto(freshBuild(parent, 'dist', 'new'), join(parent, 'dist'));
    expect(readFileSync(join(parent, 'dist/index.html'), 'utf8')).toBe('new');
    expect(lstatSync(join(parent, 'dist')).isSymbolicLink()).toBe(true);
  });
});

describe('work folders of killed builds', () => {
  it('are removed; those of running builds and the published build are kept', async () => {
    const parent = join(scratch, 'stale');
    mkdirSync(parent);
    await swapInto(freshBuild(parent, 'dist', 'published'), join(parent, 'dist'));
    const dead = deadPid();
    const names = [`.tmp-dist-${dead}`, `.tmp-old-dist-${dead}`, `.tmp-link-dist-${dead}`, `.dist-mabc123-${dead}`, `.tmp-dist-${process.pid}`, `.tmp-other-${dead}`];
    for (const n of names) mkdirSync(join(parent, n));
    const removed = await removeStaleWork(join(parent, 'dist'));
    expect(removed.sort()).toEqual([`.dist-mabc123-${dead}`, `.tmp-dist-${dead}`, `.tmp-link-dist-${dead}`, `.tmp-old-dist-${dead}`].sort());
    expect(existsSync(join(parent, `.tmp-dist-${process.pid}`))).toBe(true); // this process is running
    expect(existsSync(join(parent, `.tmp-other-${dead}`))).toBe(true); // another output's
    expect(readFileSync(join(parent, 'dist/index.html'), 'utf8')).toBe('published');
  });
});

describe('the build lock', () => {
  it('is taken over from a build that was killed', async () => {
    const folder = join(scratch, 'lock-stale');
    mkdirSync(folder);
    writeFileSync(join(folder, 'gloaming-build.lock'), `${deadPid()}\n`);
    const lock = await acquireBuildLock([folder], { timeoutMs: 1000 });
    expect(readFileSync(join(folder, 'gloaming-build.lock'), 'utf8')).toBe(`${process.pid}\n`);
    await lock.release();
    expect(existsSync(join(folder, 'gloaming-build.lock'))).toBe(false);
  });

  it('makes a second build wait for a running one, and gives up with its process id after the timeout', async () => {
    const folder = join(scratch, 'lock-held');
    const first = await acquireBuildLock([folder, folder]);
    const waited: number[] = [];
    const second = acquireBuildLock([folder], { timeoutMs: 300, pollMs: 20, onWait: (pid) => waited.push(pid) });
    await expect(second).rejects.toThrow(GloamingError);
    await expect(second).rejects.toThrow(new RegExp(`another build \\(process ${process.pid}\\) is still running`));
    expect(waited).toEqual([process.pid]);
    await first.release();
    const third = await acquireBuildLock([folder], { timeoutMs: 300 });
    await third.release();
  });
});

describe('the final output check', () => {
  const dir = join(scratch, 'site');
  const page = '<!DOCTYPE html><html><head><link rel="canonical" href="https://sky.example.org/a/">' +
    "<style>@font-face{src:url(/_astro/font.a1.woff2) format('woff2')}</style>" +
    '<meta property="og:image" content="https://sky.example.org/a/card.png"><meta name="viewport" content="width=device-width">' +
    '<link rel="alternate" type="application/rss+xml" href="/a/rss.xml"></head><body>' +
    '<img src="/charts/0f.svg" srcset="/charts/0f.svg 1x, /charts/0f@2x.png 2x"><a href="/b/">b</a><a href="https://elsewhere.example/x.png">x</a><a href="mailto:a@b.c">m</a><a href="#top">t</a></body></html>';
  const assets = ['_astro/font.a1.woff2', 'a/card.png', 'a/rss.xml', 'charts/0f.svg', 'charts/0f@2x.png'];

  function writeSite(missing: string | null): void {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(join(dir, 'a'), { recursive: true });
    writeFileSync(join(dir, 'a/index.html'), page);
    for (const f of assets) {
      if (f === missing) continue;
      mkdirSync(join(dir, f, '..'), { recursive: true });
      writeFileSync(join(dir, f), 'x');
    }
  }

  for (const missing of assets) {
    it(`refuses a page whose ${missing} is missing, naming the page and the address`, async () => {
      writeSite(missing);
      const check = checkLinkedFiles(dir, ['a/index.html'], { pages: false });
      await expect(check).rejects.toThrow(/^a\/index\.html: the page links the file .*, which is not in the output/);
    });
  }

  it('passes a complete page; page links are checked only when asked (not in a shard build)', async () => {
    writeSite(null);
    expect(await checkLinkedFiles(dir, ['a/index.html'], { pages: false })).toBe(6);
    await expect(checkLinkedFiles(dir, ['a/index.html'], { pages: true })).rejects.toThrow(/links the page \/b\//);
    mkdirSync(join(dir, 'b'));
    writeFileSync(join(dir, 'b/index.html'), '');
    expect(await checkLinkedFiles(dir, ['a/index.html'], { pages: true })).toBe(8); // + canonical /a/ and /b/
  });
});

describe('the 40 KB page budget (HTML and CSS)', () => {
  const dir = join(scratch, 'budget');
  const html = (bytes: number, extra = ''): string => {
    const head = `<!DOCTYPE html><html><head>${extra}</head><body><p>`;
    const tail = '</p></body></html>';
    return head + 'x'.repeat(bytes - head.length - tail.length) + tail;
  };

  it('warns about a page over 40 KB, counting the stylesheets it links; --strict makes it an error', async () => {
    rmSync(dir, { recursive: true, force: true });
    mkdirSync(join(dir, 'big'), { recursive: true });
    mkdirSync(join(dir, 'styled'), { recursive: true });
    mkdirSync(join(dir, 'small'), { recursive: true });
    mkdirSync(join(dir, '_astro'), { recursive: true });
    writeFileSync(join(dir, 'big/index.html'), html(41 * 1024));
    writeFileSync(join(dir, 'styled/index.html'), html(30 * 1024, '<link rel="stylesheet" href="/_astro/page.css">'));
    writeFileSync(join(dir, '_astro/page.css'), 'p{}'.repeat(4 * 1024)); // 12 KB
    writeFileSync(join(dir, 'small/index.html'), html(39 * 1024));
    const { warnings } = await checkOutput(dir, { pages: false });
    expect(warnings).toEqual([
      'big/index.html: the page weighs 41.0 KB of HTML and CSS, over the 40 KB budget for phones',
      'styled/index.html: the page weighs 42.0 KB of HTML and CSS, over the 40 KB budget for phones',
    ]);
    await expect(checkOutput(dir, { pages: false, strict: true })).rejects.toThrow(/^big\/index\.html: the page weighs 41\.0 KB .* \(and 1 more page\(s\)\)/);
  });

  it('--strict is a build option', () => {
    expect(readOptions(['--strict', '--today', '2026-12-04'], {}).strict).toBe(true);
    expect(readOptions(['--today', '2026-12-04'], {}).strict).toBe(false);
  });
});
