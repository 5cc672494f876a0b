/**
 * `npm run dev`: the dev server (Astro's programmatic `dev()`, configured as astro.config.mjs
 * does, on a temporary copy of the content; test/helpers/dev-server.ts) serves a bulletin page and the finder chart it links,
 * and shows an edited bulletin template and an edited site file on the next request.
 */
import { spawn } from 'node:child_process';
import { cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { acquireBuildLock } from '../scripts/work-folders.ts';

const ROOT = resolve(import.meta.dirname, '..');
const TODAY = '2026-12-04';
const PAGE = '/harbour-roof/2026-W49/weekly/';

let work: string;
let origin: string;
let stop: () => Promise<void> = async () => {};
let unlock: () => Promise<void> = async () => {};

async function get(path: string): Promise<{ status: number; type: string; text: string }> {
  const r = await fetch(origin + path);
  return { status: r.status, type: r.headers.get('content-type') ?? '', text: await r.text() };
}

/** Fetches `path` until its text matches `pattern` (the content layer reloads after the watcher fires). */
async function until(path: string, pattern: RegExp, timeoutMs = 60_000): Promise<string> {
  const deadline = Date.now() + timeoutMs;
  let text = '';
  while (Date.now() < deadline) {
    try {
      text = (await get(path)).text;
      if (pattern.test(text)) return text;
    } catch {
      // A request that meets the server while it reloads the content may be dropped: ask again.
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  return text;
}

beforeAll(async () => {
  work = mkdtempSync(join(tmpdir(), 'gloaming-dev-'));
  cpSync(join(ROOT, 'content'), join(work, 'content'), { recursive: true });
  // The dev server writes Astro's `.astro` folder in the project, as builds do: take turns with them.
  const lock = await acquireBuildLock([join(ROOT, '.astro')]);
  unlock = () => lock.release();
  const options = { today: TODAY, sites: ['harbour-roof'], content: join(work, 'content'), cacheDir: join(work, 'cache'), port: 4700 + (process.pid % 200) };
  // Astro's dev server leaves its pages to the test runner when VITEST is set: the child runs without it.
  const env = Object.fromEntries(Object.entries(process.env).filter(([k]) => k !== 'VITEST'));
  const child = spawn(process.execPath, ['test/helpers/dev-server.ts', JSON.stringify(options)], { cwd: ROOT, env, stdio: ['pipe', 'pipe', 'inherit'] });
  const exited = new Promise<void>((done) => child.on('close', () => done()));
  stop = async () => {
    child.stdin.end();
    await exited;
  };
  origin = await new Promise<string>((ready, fail) => {
    let out = '';
    child.stdout.on('data', (d: Buffer) => {
      out += d.toString();
      const line = /^\{"origin".*\}$/m.exec(out)?.[0];
      if (line) ready((JSON.parse(line) as { origin: string }).origin);
    });
    child.on('close', (code) => fail(new Error(`the dev server stopped (exit code ${code}) before it was ready`)));
  });
}, 180_000);

afterAll(async () => {
  await stop();
  await unlock();
  if (work) rmSync(work, { recursive: true, force: true });
});

describe('npm run dev', () => {
  it('serves a bulletin page and the finder chart it links', async () => {
    const page = await get(PAGE);
    expect(page.status).toBe(200);
    expect(page.text).toContain('<h1>');
    const chart = /src="(\/charts\/[0-9a-f]+\.svg)"/.exec(page.text)?.[1];
    expect(chart, 'the page links a finder chart').toBeDefined();
    const svg = await get(chart!);
    expect(svg.status).toBe(200);
    expect(svg.type).toMatch(/^image\/svg\+xml/);
    expect(svg.text).toMatch(/^<svg\b/);
  }, 120_000);

  it('shows an edited bulletin template on the next request', async () => {
    const file = join(work, 'content/bulletins/weekly.md');
    writeFileSync(file, `${readFileSync(file, 'utf8')}\nA line added while the dev server runs.\n`);
    expect(await until(PAGE, /A line added while the dev server runs\./)).toContain('A line added while the dev server runs.');
  }, 90_000);

  it('shows an edited site file on the next request', async () => {
    const file = join(work, 'content/sites/harbour-roof.yaml');
    const text = readFileSync(file, 'utf8');
    const name = /^name:\s*(.+)$/m.exec(text)![1]!.trim();
    writeFileSync(file, text.replace(/^name:.*$/m, 'name: Harbour Roof Garden'));
    const html = await until(PAGE, /Harbour Roof Garden/);
    expect(html).toContain('Harbour Roof Garden');
    expect(html).not.toContain(name);
  }, 90_000);
});
