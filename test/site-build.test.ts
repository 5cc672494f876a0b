/**
 * Site build smoke tests: the demo builds with a frozen date into a fresh folder, every kind of
 * page exists, two builds are byte-identical, output budgets hold, and a failing build reports a
 * positioned error and leaves the previous output exactly as it was.
 *
 * Builds run `scripts/build.ts` in a child process (as `npm run build` does), with output and
 * Astro's cache in folders under the project (Astro keeps its prerender chunks beside the output
 * only when the output is inside the working directory). The first build is the suite's shared
 * demo build (test/setup/demo-build.ts), read only here; the builds below write into this file's
 * own folders, each with its own copy of the demo build's cache (a warm cache, as a weekly CI
 * rebuild has).
 */
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { cpSync, existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { join, relative, resolve } from 'node:path';
import ICAL from 'ical.js';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';

const ROOT = resolve(import.meta.dirname, '..');
const demo = inject('demoBuild');
const TODAY = demo.today; // 2026-12-04, a Friday in ISO week 2026-W49
const SITES = ['harbour-roof', 'northern-outpost', 'southern-station'];

let work: string;

/** A cache folder for one build: a copy of the demo build's (warm), or an empty one. */
function cacheFor(name: string, options: { warm: boolean } = { warm: true }): string {
  const dir = join(work, `cache-${name}`);
  if (options.warm) cpSync(demo.cache, dir, { recursive: true });
  return dir;
}

/**
 * A copy of the demo content with the standing weekly bulletin alone, a week either side of the
 * build date: for builds that need their own content but not the whole demo (each cold page costs).
 */
function weeklyOnly(name: string): string {
  const content = join(work, name);
  cpSync(join(ROOT, 'content'), content, { recursive: true });
  for (const f of ['wonders.md', 'weekly.es.md', 'comet-lumen.md']) rmSync(join(content, 'bulletins', f));
  const weekly = join(content, 'bulletins/weekly.md');
  writeFileSync(weekly, readFileSync(weekly, 'utf8').replace('schedule: { every: week, past: 8, future: 4 }', 'schedule: { every: week, past: 1, future: 1 }'));
  return content;
}

function build(args: string[], options: { cache?: string } = {}): { status: number | null; stdout: string; stderr: string } {
  const r = spawnSync(process.execPath, ['scripts/build.ts', ...args], {
    cwd: ROOT,
    encoding: 'utf8',
    env: { ...process.env, GLOAMING_CACHE_DIR: options.cache ?? join(work, 'cache'), GLOAMING_TODAY: '', GLOAMING_SITES: '' },
    timeout: 120_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Starts a build without waiting for it. */
function startBuild(args: string[], cache: string): { pid: number; done: Promise<{ status: number | null; stderr: string }> } {
  const child = spawn(process.execPath, ['scripts/build.ts', ...args], {
    cwd: ROOT,
    env: { ...process.env, GLOAMING_CACHE_DIR: cache, GLOAMING_TODAY: '', GLOAMING_SITES: '' },
    stdio: ['ignore', 'ignore', 'pipe'],
    timeout: 180_000,
  });
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  return { pid: child.pid!, done: new Promise((done) => child.on('close', (status) => done({ status, stderr }))) };
}

function files(dir: string): string[] {
  const out: string[] = [];
  const walk = (d: string): void => {
    for (const name of readdirSync(d)) {
      const full = join(d, name);
      if (statSync(full).isDirectory()) walk(full);
      else out.push(relative(dir, full));
    }
  };
  walk(dir);
  return out.sort();
}

function treeDigest(dir: string): Map<string, string> {
  return new Map(files(dir).map((f) => [f, createHash('sha256').update(readFileSync(join(dir, f))).digest('hex')]));
}

beforeAll(() => {
  work = mkdtempSync(join(ROOT, '.tmp-test-site-'));
  // This file's published output: a copy of the demo build, which later builds replace (or, failing, leave alone).
  cpSync(demo.dist, join(work, 'a'), { recursive: true, dereference: true });
  cpSync(demo.cache, join(work, 'cache'), { recursive: true });
});

afterAll(() => {
  if (work) rmSync(work, { recursive: true, force: true });
});

describe('site build', () => {
  it('prints nothing on standard error when all is well', () => {
    // Another test file may have been building in this checkout at the same time: then the build waited its turn.
    expect(demo.stderr.replace(/^waiting for another build \(process \d+\) in this checkout to finish …\n/, '')).toBe('');
  });

  it('writes every kind of page for every site', () => {
    const out = join(work, 'a');
    const expected = ['index.html', 'sitemap-index.xml'];
    for (const site of SITES) {
      expected.push(`${site}/index.html`, `${site}/archive/index.html`, `${site}/rss.xml`);
      // The standing weekly template of the demo: this week, 8 weeks back, 4 ahead.
      for (const week of ['2026-W41', '2026-W49', '2026-W53']) expected.push(`${site}/${week}/weekly/index.html`, `${site}/${week}/weekly/card.png`);
    }
    for (const f of expected) expect(existsSync(join(out, f)), f).toBe(true);
    // ISO 2026 has 53 weeks (it starts on a Thursday): the 4th week ahead is 2026-W53, not 2027-W01.
    expect(existsSync(join(out, 'harbour-roof/2026-W54'))).toBe(false);
    expect(existsSync(join(out, 'harbour-roof/2027-W01'))).toBe(false);
  });

  it('home page says the centre is invented and lists all sites', () => {
    const html = readFileSync(join(work, 'a/index.html'), 'utf8');
    expect(html).toMatch(/invented for (this|the) demo/i);
    for (const site of SITES) expect(html).toContain(`href="/${site}/"`);
  });

  it('pages ship no client JavaScript and stay within the 40 KB HTML+CSS budget', () => {
    const out = join(work, 'a');
    // Every page; the 'tonight' fragments (not pages: sections for other websites) carry no script either.
    for (const f of files(out).filter((f) => f.endsWith('tonight.html'))) expect(readFileSync(join(out, f), 'utf8'), f).not.toMatch(/<script\b/i);
    for (const f of files(out).filter((f) => f.endsWith('.html') && !f.endsWith('tonight.html'))) {
      const html = readFileSync(join(out, f), 'utf8');
      expect(html, f).not.toMatch(/<script\b/i);
      // The Content-Security-Policy forbids scripts, first thing in the head (issue #14 §3).
      expect(html, f).toMatch(/^<!DOCTYPE html><html[^>]*>\s*<head>\s*<meta charset="utf-8">\s*<meta http-equiv="Content-Security-Policy" content="[^"]*script-src 'none'/i);
      expect(html, f).not.toMatch(/<link[^>]+rel="stylesheet"/); // CSS is inline: the page is the whole cost
      expect(Buffer.byteLength(html), f).toBeLessThan(40 * 1024);
    }
  });

  it('bulletin pages carry og:image, lang, one h1, and the week in the title', () => {
    const html = readFileSync(join(work, 'a/southern-station/2026-W49/weekly/index.html'), 'utf8');
    expect(html).toMatch(/<html lang="en-AU">/); // the site's full BCP 47 locale
    expect(html).toContain('<meta property="og:image" content="https://sky.example.org/southern-station/2026-W49/weekly/card.png">');
    expect(html.match(/<h1\b/g)).toHaveLength(1);
    expect(html).toMatch(/<title>[^<]*30 Nov\s–\s6 Dec 2026<\/title>/); // Intl's range style puts thin spaces round the dash
  });

  it('social cards are 1200×630 PNGs under 80 KB', () => {
    const out = join(work, 'a');
    const cards = files(out).filter((f) => f.endsWith('card.png'));
    expect(cards.length).toBeGreaterThan(30);
    for (const f of cards) {
      const png = readFileSync(join(out, f));
      // PNG signature, then the IHDR chunk: width and height as big-endian 32-bit integers (PNG spec, ISO/IEC 15948 §11.2.2).
      expect(png.subarray(0, 8).toString('hex'), f).toBe('89504e470d0a1a0a');
      expect(png.readUInt32BE(16), f).toBe(1200);
      expect(png.readUInt32BE(20), f).toBe(630);
      expect(png.length, f).toBeLessThan(80 * 1024);
    }
  });

  it('RSS feeds list the weeks up to this one, newest first, with stable dates', () => {
    const xml = readFileSync(join(work, 'a/harbour-roof/rss.xml'), 'utf8');
    const links = [...xml.matchAll(/<link>([^<]+)<\/link>/g)].map((m) => m[1]!);
    // The newest week first: its two bulletins (the weekly one and the deep-sky one).
    expect(links.slice(1, 3).sort()).toEqual(['https://sky.example.org/harbour-roof/2026-W49/weekly/', 'https://sky.example.org/harbour-roof/2026-W49/wonders/']);
    expect(xml).not.toContain('2026-W50'); // future weeks are published as pages, not announced
    expect(xml).toContain('<pubDate>Mon, 30 Nov 2026 00:00:00 GMT</pubDate>');
  });

  it('each site publishes an iCalendar feed of its sky events that ical.js parses, linked from its home page', () => {
    for (const site of ['harbour-roof', 'southern-station', 'northern-outpost']) {
      const text = readFileSync(join(work, `a/${site}/events.ics`), 'utf8');
      // RFC 5545 via the ical.js parser (an independent implementation from the npm registry).
      const calendar = new ICAL.Component(ICAL.parse(text));
      const events = calendar.getAllSubcomponents('vevent');
      expect(events.length, site).toBeGreaterThan(10);
      for (const e of events) expect(e.getFirstPropertyValue('dtstamp')?.toString(), site).toBe('2026-12-04T00:00:00Z');
      expect(readFileSync(join(work, `a/${site}/index.html`), 'utf8')).toContain(`href="/${site}/events.ics"`);
    }
  });

  it('two shard builds started at once in one checkout take turns, and their merge equals the full build apart from sitemap names', async () => {
    // The shards are the two halves of the demo, so together they cost one full build.
    const [s1, s2] = [
      startBuild(['--today', TODAY, '--sites', 'harbour-roof', '--out', join(work, 's1')], cacheFor('s1')),
      startBuild(['--today', TODAY, '--sites', 'southern-station,northern-outpost,cerro-lucero', '--out', join(work, 's2')], cacheFor('s2')),
    ];
    const [r1, r2] = await Promise.all([s1.done, s2.done]);
    expect(r1.status, r1.stderr).toBe(0);
    expect(r2.status, r2.stderr).toBe(0);
    // Separate cache folders, one checkout: the checkout's lock makes the second wait.
    expect(`${r1.stderr}${r2.stderr}`).toMatch(/waiting for another build \(process \d+\)/);
    expect(existsSync(join(work, 's1/southern-station'))).toBe(false);
    expect(existsSync(join(work, 's2/harbour-roof'))).toBe(false);
    const m = build(['--merge', join(work, 's1'), join(work, 's2'), '--out', join(work, 'm')]);
    expect(m.status, m.stderr).toBe(0);
    const full = treeDigest(demo.dist);
    expect([...full.keys()].some((f) => f.startsWith('_astro/') && f.endsWith('.woff2'))).toBe(true);
    const merged = treeDigest(join(work, 'm'));
    const pages = (t: Map<string, string>): [string, string][] => [...t].filter(([f]) => !f.startsWith('sitemap'));
    expect(pages(merged).map(([f]) => f)).toEqual(pages(full).map(([f]) => f));
    expect(pages(merged)).toEqual(pages(full));
    const index = readFileSync(join(work, 'm/sitemap-index.xml'), 'utf8');
    expect(index.match(/<sitemap>/g)).toHaveLength(2);
    const listed = [...index.matchAll(/<loc>https:\/\/sky\.example\.org\/([^<]+)<\/loc>/g)].map((x) => x[1]!);
    for (const f of listed) expect(existsSync(join(work, 'm', f)), f).toBe(true);
  }, 240_000);

  it('a build killed with kill -9 leaves the previous output; the next build clears its work folder and lock', async () => {
    // The previous output: the one-site shard published by the test above.
    const out = join(work, 'k');
    cpSync(join(work, 's1'), out, { recursive: true });
    const args = ['--today', TODAY, '--sites', 'harbour-roof', '--out', out];
    const before = treeDigest(out);
    const killed = startBuild(args, join(work, 'cache'));
    const workFolder = join(work, `.tmp-k-${killed.pid}`);
    const deadline = Date.now() + 120_000;
    // Killed as soon as Astro starts writing into its work folder (after it took the lock, which it
    // leaves behind too). With a warm cache a one-site build can finish its writing, checks and swap
    // within a few hundred milliseconds, so the kill follows the folder's appearance at once.
    while (!existsSync(workFolder) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 5));
    process.kill(killed.pid, 'SIGKILL');
    await killed.done;
    expect(existsSync(workFolder)).toBe(true); // what kill -9 leaves (docs/deploy.md)
    expect(treeDigest(out)).toEqual(before);
    const r = build(args);
    expect(r.status, r.stderr).toBe(0);
    expect(existsSync(workFolder)).toBe(false);
    expect(readdirSync(work).filter((n) => n.startsWith('.tmp-'))).toEqual([]);
    expect(treeDigest(out)).toEqual(before);
  }, 240_000);

  it('a failed build prints file:line:column without a stack and leaves the previous output intact', () => {
    const before = treeDigest(join(work, 'a'));
    const bad = join(work, 'bad-content');
    cpSync(join(ROOT, 'content'), bad, { recursive: true });
    const file = join(bad, 'sites/harbour-roof.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('bortle: 7', 'bortle: 12'));
    const r = build(['--today', TODAY, '--out', join(work, 'a'), '--content', bad]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^error: \S*sites\/harbour-roof\.yaml:\d+:\d+ field 'sky\.bortle': .*out of range/);
    expect(r.stderr).not.toMatch(/\n\s+at /); // no stack trace
    expect(treeDigest(join(work, 'a'))).toEqual(before);
    expect(readdirSync(work).filter((n) => n.startsWith('.tmp-'))).toEqual([]);
  }, 60_000);

  it('a template over the 64 KiB limit stops the build before Astro starts, at its file:line:column', () => {
    const before = treeDigest(join(work, 'a'));
    const bad = join(work, 'big-template');
    cpSync(join(ROOT, 'content'), bad, { recursive: true });
    const file = join(bad, 'bulletins/weekly.md');
    writeFileSync(file, readFileSync(file, 'utf8') + 'Look up tonight.\n'.repeat(5000));
    const r = build(['--today', TODAY, '--out', join(work, 'a'), '--content', bad]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^error: \S*bulletins\/weekly\.md:\d+:\d+: the template is \d+ KiB, more than the 64 KiB/);
    expect(treeDigest(join(work, 'a'))).toEqual(before);
  }, 60_000);

  it('bad comet elements stop the build before any page is made, with file:line:column and field', () => {
    const before = treeDigest(join(work, 'a'));
    const bad = join(work, 'bad-object');
    cpSync(join(ROOT, 'content'), bad, { recursive: true });
    const file = join(bad, 'objects/comet-lumen.yaml');
    writeFileSync(file, readFileSync(file, 'utf8').replace('eccentricity: 0.999', 'eccentricity: -0.2'));
    const r = build(['--today', TODAY, '--out', join(work, 'a'), '--content', bad]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^error: \S*objects\/comet-lumen\.yaml:\d+:\d+ field 'elements\.eccentricity': /);
    expect(treeDigest(join(work, 'a'))).toEqual(before);
  }, 60_000);

  it('a placeholder error inside a bulletin (found while Astro runs) is positioned too, and nothing is replaced', () => {
    const before = treeDigest(join(work, 'a'));
    const bad = join(work, 'bad-template');
    cpSync(join(ROOT, 'content'), bad, { recursive: true });
    const file = join(bad, 'bulletins/weekly.md');
    const text = readFileSync(file, 'utf8');
    writeFileSync(file, `${text}\nLook for :best-time{body=jupyter} tonight.\n`);
    const line = text.split('\n').length + 1;
    // A second mistake in another template: both are reported by the same run.
    const other = join(bad, 'bulletins/comet-lumen.md');
    const otherText = readFileSync(other, 'utf8');
    writeFileSync(other, `${otherText}\nSunset :sunsett.\n`);
    // One site is enough to meet both templates (the one-off comet bulletin is Harbour Roof's).
    const r = build(['--today', TODAY, '--sites', 'harbour-roof', '--out', join(work, 'a'), '--content', bad]);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain(`bulletins/weekly.md:${line}:`);
    expect(r.stderr).toContain("did you mean 'jupiter'?");
    expect(r.stderr).toContain(`bulletins/comet-lumen.md:${otherText.split('\n').length + 1}:8: unknown placeholder ':sunsett'`);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(treeDigest(join(work, 'a'))).toEqual(before);
  }, 120_000);

  it('with --strict, a value placeholder without a value, or a comet\'s old elements, stop the build with their places', () => {
    const before = treeDigest(join(work, 'a'));
    // Changing the comet's file makes every page of the site new: the weekly bulletin alone keeps the build short.
    const bad = weeklyOnly('strict-template');
    const file = join(bad, 'bulletins/weekly.md');
    const text = readFileSync(file, 'utf8');
    // No solar eclipse falls in the build's weeks (2026-W48 to 2026-W50; NASA's five-millennium canon lists none between 12 Aug 2026 and 6 Feb 2027).
    writeFileSync(file, `${text}\nThe eclipse starts at :event{type=solar-eclipse}.\n`);
    const line = text.split('\n').length + 1;
    // The comet's elements 94 days old on the build date, 38 days before its perihelion (limits: README, common practice).
    const object = join(bad, 'objects/comet-lumen.yaml');
    const objectText = readFileSync(object, 'utf8');
    writeFileSync(object, objectText.replace(/^ {2}epoch: \S+/m, '  epoch: 2026-09-01'));
    const epochLine = objectText.split('\n').findIndex((l) => l.startsWith('  epoch:')) + 1;
    const r = build(['--today', TODAY, '--sites', 'harbour-roof', '--out', join(work, 'a'), '--content', bad, '--strict']);
    expect(r.status).toBe(2);
    expect(r.stderr).toContain(`warning: ${join(bad, 'bulletins/weekly.md').replace(ROOT + '/', '')}:${line}:23: ':event{type=solar-eclipse}' has no value`);
    expect(r.stderr).toMatch(/\(site harbour-roof, week 2026-W49\)/);
    // Once for the build, not once per page.
    const stale = `warning: ${object.replace(ROOT + '/', '')}:${epochLine}:10 field 'elements.epoch': Comet Lumen (invented for the demo) is 38 days before perihelion and its elements are 94 days old (epoch 2026-09-01)`;
    expect(r.stderr.split('\n').filter((l) => l.startsWith(stale))).toHaveLength(1);
    expect(r.stderr.trim().split('\n').at(-1)).toMatch(/warning\(s\) with --strict.*the build stopped \(--strict\); the previous output is unchanged$/);
    expect(treeDigest(join(work, 'a'))).toEqual(before);
  }, 120_000);

  it('a one-off bulletin shows its date, not a week range, on its page, card text and archive', () => {
    const html = readFileSync(join(work, 'a/harbour-roof/2027-W02/comet-lumen/index.html'), 'utf8');
    expect(html).toMatch(/<p class="kicker">Wednesday 13 January 2027<\/p>/);
    expect(html).toContain('<title>Comet Lumen at its best · Harbour Roof Terrace · Wednesday 13 January 2027</title>');
    const archive = readFileSync(join(work, 'a/harbour-roof/archive/index.html'), 'utf8');
    expect(archive).toMatch(/href="\/harbour-roof\/2027-W02\/comet-lumen\/"><strong>Wednesday 13 January 2027<\/strong>/);
  });

  it('a build date across the year boundary rolls the weeks into the next ISO year', () => {
    // A cold build for another date: one site and the weekly bulletin alone, a week either side
    // (the weeks around a date are unit-tested in bulletin-fixtures; this checks the build follows them).
    const content = weeklyOnly('year-content');
    // 2027-01-01 is a Friday in ISO week 2026-W53 (ISO 8601: the week belongs to the year of its Thursday, 2026-12-31).
    const r = build(['--today', '2027-01-01', '--sites', 'northern-outpost', '--content', content, '--out', join(work, 'y')], { cache: cacheFor('y', { warm: false }) });
    expect(r.status, r.stderr).toBe(0);
    const weeks = readdirSync(join(work, 'y/northern-outpost')).filter((n) => /^\d{4}-W\d{2}$/.test(n));
    expect(weeks).toEqual(['2026-W52', '2026-W53', '2027-W01']);
    const home = readFileSync(join(work, 'y/northern-outpost/index.html'), 'utf8');
    expect(home).toContain('href="/northern-outpost/2026-W53/weekly/"');
  }, 60_000);

  it('rejects a bad --today and an unknown --sites id with a suggestion', () => {
    const a = build(['--today', '2026-02-30', '--out', join(work, 'x')]);
    expect(a.status).toBe(2);
    expect(a.stderr).toMatch(/^error: .*cannot read the date '2026-02-30'/);
    const b = build(['--today', TODAY, '--sites', 'harbor-roof', '--out', join(work, 'x')]);
    expect(b.status).toBe(2);
    expect(b.stderr).toMatch(/unknown site 'harbor-roof'.*did you mean 'harbour-roof'\?/);
    expect(existsSync(join(work, 'x'))).toBe(false);
  }, 60_000);
});
