/**
 * A new centre end to end (issue #16): `gloaming init` in a temporary folder outside the project,
 * `gloaming check` for a year, `gloaming build` there, and not one of the demo's names anywhere in
 * the output (pages, feeds, sitemap, calendars, the words of the social cards). A build without a
 * public address says "preview" in its log and in its pages' metadata. The scaffolded workflow
 * names no site (it reads them from the content).
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../lib/outputs/cli/main.ts';
import { shardSites } from '../lib/outputs/cli/sites.ts';

const ROOT = resolve(import.meta.dirname, '..');
const TODAY = '2026-12-04';
/** Every name the invented demo uses: the centre, its sites (names and ids) and its comet. */
const DEMO_NAMES = /quayside|lantern|harbour|southern[- ]station|northern[- ]outpost|lumen|sky\.example\.org/i;

let work: string;

function run(argv: string[]): { code: number; out: string; err: string } {
  let out = '';
  let err = '';
  const code = main(argv, (s) => (out += s + '\n'), (s) => (err += s + '\n'), { today: TODAY });
  return { code, out, err };
}

function files(dir: string): string[] {
  return readdirSync(dir, { recursive: true, encoding: 'utf8' })
    .map((f) => join(dir, f))
    .filter((f) => statSync(f).isFile())
    .sort();
}

/** The UTF-8 text of every iTXt chunk of a PNG (PNG specification §11.3.4.5). */
function pngTexts(png: Buffer): string[] {
  const texts: string[] = [];
  for (let at = 8; at < png.length; ) {
    const length = png.readUInt32BE(at);
    const type = png.toString('latin1', at + 4, at + 8);
    if (type === 'iTXt') {
      const data = png.subarray(at + 8, at + 8 + length);
      // keyword \0, compression flag, method, language \0, translated keyword \0, text
      let p = data.indexOf(0) + 3;
      p = data.indexOf(0, p) + 1;
      p = data.indexOf(0, p) + 1;
      texts.push(data.toString('utf8', p));
    }
    at += 12 + length;
  }
  return texts;
}

beforeAll(() => {
  work = mkdtempSync(join(tmpdir(), 'gloaming-init-'));
});
afterAll(() => {
  if (work) rmSync(work, { recursive: true, force: true });
});

describe('gloaming init', () => {
  it('refuses a folder that is not empty, and writes nothing', () => {
    const folder = join(work, 'taken');
    mkdirSync(folder);
    writeFileSync(join(folder, 'notes.txt'), 'mine');
    const r = run(['init', folder, '--name', 'X', '--lat', '40', '--lon', '-3.7', '--tz', 'Europe/Madrid']);
    expect(r.code).toBe(2);
    expect(r.err).toContain("is not empty (it holds notes.txt); nothing was written; expected a new or empty folder");
    expect(readdirSync(folder)).toEqual(['notes.txt']);
  });

  it('names a missing or wrong flag (no terminal to ask in), and writes nothing', () => {
    const folder = join(work, 'not-yet');
    expect(run(['init', folder, '--name', 'X', '--lat', '40', '--lon', '-3.7']).err).toMatch(/^gloaming init: --tz: is required; expected an IANA time zone/);
    expect(run(['init', folder, '--name', 'X', '--lat', '40', '--lon', '-3.7', '--tz', 'Asia/Tokyo']).err).toMatch(/^gloaming init: --tz: .*longitude/);
    expect(existsSync(folder)).toBe(false);
  });

  it('scaffolds a centre whose weekly template passes check for 52 weeks at mid, polar and southern latitudes', () => {
    const folder = join(work, 'society');
    const r = run(['init', folder, '--name', 'Example Astronomy Society', '--lat', '40.42', '--lon', '-3.70', '--tz', 'Europe/Madrid', '--site-name', 'Hill Meadow', '--elevation', '650']);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    for (const f of ['content/centre.yaml', 'content/sites/hill-meadow.yaml', 'content/bulletins/weekly.md', '.github/workflows/weekly.yml', 'package.json', '.npmrc']) {
      expect(existsSync(join(folder, f)), f).toBe(true);
    }
    expect(r.out).toContain('npm install');
    expect(r.out).toContain('npm run build');
    const pkg = JSON.parse(readFileSync(join(folder, 'package.json'), 'utf8')) as { dependencies: Record<string, string>; devDependencies: Record<string, string>; scripts: Record<string, string> };
    expect(pkg.dependencies.gloaming).toBe(`file:${ROOT}`);
    expect(pkg.devDependencies.node).toBe((JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { devDependencies: Record<string, string> }).devDependencies.node);
    expect(pkg.scripts.build).toBe('gloaming build');
    // npm on an older machine Node stays quiet about engines the pinned Node satisfies (.npmrc).
    expect(readFileSync(join(folder, '.npmrc'), 'utf8')).toMatch(/^loglevel=error$/m);

    // The starter template at two harder sites as well: in the Arctic (midnight Sun, polar night) and in the south.
    const content = join(work, 'three-sites');
    mkdirSync(join(content, 'sites'), { recursive: true });
    mkdirSync(join(content, 'bulletins'));
    writeFileSync(join(content, 'centre.yaml'), 'name: Three Sites\n');
    writeFileSync(join(content, 'bulletins/weekly.md'), readFileSync(join(folder, 'content/bulletins/weekly.md')));
    writeFileSync(join(content, 'sites/mid.yaml'), readFileSync(join(folder, 'content/sites/hill-meadow.yaml')));
    writeFileSync(join(content, 'sites/arctic.yaml'), 'latitude: 69.6\nlongitude: 18.9\ntimeZone: Europe/Oslo\nsky: { bortle: 4 }\n');
    writeFileSync(join(content, 'sites/south.yaml'), 'latitude: -33.9\nlongitude: 18.4\ntimeZone: Africa/Johannesburg\nsky: { bortle: 6 }\n');
    const check = run(['check', '--content', content, '--today', TODAY, '--weeks', '52', '--json']);
    const json = JSON.parse(check.out) as { pages: number; problems: { file: string; line: number; site: string; week: string; message: string }[] };
    expect(json.problems.map((p) => `${p.site} ${p.week} ${p.line}: ${p.message}`)).toEqual([]);
    expect(json.pages).toBe(3 * 52);
    expect(check.code).toBe(0);
  }, 300_000);

  it('builds there as a preview, and no demo name appears anywhere in the output', () => {
    const folder = join(work, 'society');
    const r = spawnSync(process.execPath, [join(ROOT, 'bin/gloaming.mjs'), 'build', '--today', TODAY], {
      cwd: folder,
      encoding: 'utf8',
      env: { ...process.env, GLOAMING_CACHE_DIR: join(work, 'cache'), GLOAMING_TODAY: '', GLOAMING_SITES: '', GLOAMING_CONTENT: '', GLOAMING_SITE_URL: '' },
      timeout: 240_000,
    });
    expect(r.status, r.stderr).toBe(0);
    expect(r.stdout).toMatch(/^preview: content\/centre\.yaml has no url, so feeds, the sitemap and social cards link to http:\/\/localhost:4321\//m);
    expect(r.stdout).toMatch(/built all sites for 2026-12-04 \(a preview\): \d+ files in dist/);
    const dist = join(folder, 'dist');
    const all = files(dist);
    expect(all.some((f) => f.endsWith('hill-meadow/events.ics'))).toBe(true);
    const cards = all.filter((f) => f.endsWith('.png'));
    expect(cards.length).toBeGreaterThan(0);
    for (const file of all) {
      const bytes = readFileSync(file);
      const text = file.endsWith('.png') ? pngTexts(bytes).join('\n') : /\.(html|xml|ics|svg|txt|json)$/.test(file) ? bytes.toString('utf8') : '';
      expect(DEMO_NAMES.exec(text)?.[0], file).toBeUndefined();
      if (file.endsWith('.png')) expect(text, `${file}: the card's words`).toContain('Example Astronomy Society');
    }
    const page = readFileSync(join(dist, 'hill-meadow/2026-W49/weekly/index.html'), 'utf8');
    expect(page).toContain('<meta name="gloaming-build" content="preview">');
    expect(page).toContain('<meta name="robots" content="noindex, nofollow">');
    expect(page).toContain('<link rel="canonical" href="http://localhost:4321/hill-meadow/2026-W49/weekly/">');
    expect(page).toMatch(/<nav class="crumbs"[^>]*>\s*<a href="\/">Example Astronomy Society<\/a>/);
    expect(readFileSync(join(dist, 'hill-meadow/events.ics'), 'utf8')).toContain('PRODID:-//Example Astronomy Society//');
    expect(readFileSync(join(dist, 'hill-meadow/rss.xml'), 'utf8')).toContain('<title>Hill Meadow · Example Astronomy Society</title>');
    // No demo notice for a real centre.
    expect(page).not.toContain('this demo of gloaming');
  }, 300_000);
});

describe('the weekly workflow', () => {
  it('names no site: a first job lists the sites from the content and builds the matrix', () => {
    const workflow = readFileSync(join(ROOT, '.github/workflows/weekly.yml'), 'utf8');
    const ids = readdirSync(join(ROOT, 'content/sites')).map((f) => f.replace(/\.ya?ml$/, ''));
    for (const id of ids) expect(workflow, id).not.toContain(id);
    expect(workflow).toMatch(/npx gloaming sites --shards "\$\{\{ *env\.SHARD_SIZE *\}\}"/);
    expect(workflow).toMatch(/matrix:\s*\n\s*shard: \$\{\{ fromJSON\(needs\.sites\.outputs\.shards\) \}\}/);
  });

  it('gloaming sites --shards groups the content\'s site ids', () => {
    expect(shardSites(['c', 'a', 'b'], 2)).toEqual(['a,b', 'c']);
    const r = run(['sites', '--shards', '2']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out)).toEqual(['cerro-lucero,harbour-roof', 'northern-outpost,southern-station']);
    expect(run(['sites', '--shards', '0']).err).toMatch(/--shards: not a whole number of at least 1/);
  });
});
