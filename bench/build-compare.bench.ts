/**
 * gloaming's build side by side with a plain Astro build of the same number of pages (issue #15).
 *
 * In a temporary folder it generates
 * - a gloaming project: the code of this checkout, the demo's centre, bulletins, objects and satellites,
 *   and `BENCH_SITES` (default 30) invented sites spread over the globe beside the demo's own — about 500 pages;
 * - a plain Astro 7 site with as many Markdown pages as gloaming wrote HTML pages, each with ten
 *   values computed by a remark directive plugin with astronomy-engine (sunset, sunrise, moonrise,
 *   moonset, the Moon's phase angle, Jupiter's rise, altitude, azimuth and magnitude, Venus's
 *   elongation), in a small layout;
 * and builds both, cold (no dist, no `.astro`, no cache folder) and warm (the same again), in
 * turns, `BENCH_RUNS` (default 3) times, and prints the medians and the ratios.
 *
 *   npm run bench -- build-compare
 *   BENCH_SITES=3 BENCH_RUNS=1 node bench/build-compare.bench.ts
 */
import { spawnSync } from 'node:child_process';
import { cpSync, mkdirSync, mkdtempSync, readdirSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { countFiles as count, median, report, type BenchRow } from './harness.ts';

const ROOT = resolve(import.meta.dirname, '..');
const TODAY = '2026-12-04';
const SITES = Number(process.env.BENCH_SITES ?? 30);
const RUNS = Number(process.env.BENCH_RUNS ?? 3);
/** The goals: gloaming cold ≤ 1.5×, warm ≤ 1.2× the plain build. */
const GOAL = { cold: 1.5, warm: 1.2 } as const;

/** Zones with a longitude inside each (for invented sites whose clock matches their place). */
const ZONES: [string, number][] = [
  ['Europe/London', -2], ['Europe/Berlin', 11], ['Europe/Athens', 23], ['Africa/Johannesburg', 27], ['Asia/Dubai', 55],
  ['Asia/Kolkata', 77], ['Asia/Bangkok', 101], ['Asia/Tokyo', 139], ['Australia/Sydney', 150], ['Pacific/Auckland', 174],
  ['America/Sao_Paulo', -47], ['America/New_York', -75], ['America/Chicago', -89], ['America/Denver', -105], ['America/Los_Angeles', -119],
];

/** An invented site: latitudes from 45° S to 65° N, zones round the globe, Bortle 2–8. */
function siteYaml(i: number): string {
  const [zone, lon] = ZONES[i % ZONES.length]!;
  const lat = -45 + ((i * 37) % 111);
  return [
    `# INVENTED for the build benchmark: no such site exists.`,
    `name: Bench site ${String(i + 1).padStart(2, '0')}`,
    `latitude: ${lat}`,
    `longitude: ${lon + ((i * 7) % 5) - 2}`,
    `elevation: ${(i * 53) % 900}`,
    `timeZone: ${zone}`,
    `locale: en-GB`,
    `sky: { bortle: ${2 + (i % 7)} }`,
    `minAltitude: 5`,
    '',
  ].join('\n');
}

/** The gloaming project: this checkout's code, the demo's templates and objects, `sites` invented sites. */
function gloamingProject(dir: string, sites: number): void {
  for (const p of ['lib', 'site', 'scripts', 'astro.config.mjs', 'package.json', 'package-lock.json', 'tsconfig.json']) cpSync(join(ROOT, p), join(dir, p), { recursive: true });
  // The demo's centre, templates, objects, satellites and sites (its bulletins name some of them),
  // and the benchmark's own sites beside them.
  cpSync(join(ROOT, 'content'), join(dir, 'content'), { recursive: true });
  for (let i = 0; i < sites; i++) writeFileSync(join(dir, `content/sites/bench-${String(i + 1).padStart(2, '0')}.yaml`), siteYaml(i));
  symlinkSync(join(ROOT, 'node_modules'), join(dir, 'node_modules'), 'dir');
}

/** The remark plugin of the plain site: `:sky{v=… lat=… lon=… date=…}` becomes a value computed with astronomy-engine. */
const SKY_PLUGIN = `import * as A from 'astronomy-engine';
const fmt = (t) => (t ? t.date.toISOString().slice(11, 16) + ' UTC' : 'none');
const VALUES = {
  sunset: (o, d) => fmt(A.SearchRiseSet(A.Body.Sun, o, -1, d, 1)),
  sunrise: (o, d) => fmt(A.SearchRiseSet(A.Body.Sun, o, +1, d, 1)),
  moonrise: (o, d) => fmt(A.SearchRiseSet(A.Body.Moon, o, +1, d, 1)),
  moonset: (o, d) => fmt(A.SearchRiseSet(A.Body.Moon, o, -1, d, 1)),
  phase: (o, d) => A.MoonPhase(d).toFixed(1) + '°',
  'jupiter-rise': (o, d) => fmt(A.SearchRiseSet(A.Body.Jupiter, o, +1, d, 1)),
  'jupiter-alt': (o, d) => { const e = A.Equator(A.Body.Jupiter, d, o, true, true); return A.Horizon(d, o, e.ra, e.dec, 'normal').altitude.toFixed(1) + '°'; },
  'jupiter-az': (o, d) => { const e = A.Equator(A.Body.Jupiter, d, o, true, true); return A.Horizon(d, o, e.ra, e.dec, 'normal').azimuth.toFixed(1) + '°'; },
  'jupiter-mag': (o, d) => A.Illumination(A.Body.Jupiter, d).mag.toFixed(1),
  'venus-elong': (o, d) => A.Elongation(A.Body.Venus, d).elongation.toFixed(1) + '°',
};
function walk(node, fn) { fn(node); for (const c of node.children ?? []) walk(c, fn); }
export default function skyValues() {
  return (tree, file) => {
    walk(tree, (node) => {
      if (node.type !== 'textDirective' || node.name !== 'sky') return;
      const a = node.attributes ?? {};
      const compute = VALUES[a.v];
      if (!compute) { file.fail('unknown value ' + a.v, node); }
      const observer = new A.Observer(Number(a.lat), Number(a.lon), 0);
      node.type = 'text';
      node.value = compute(observer, new Date(a.date + 'T12:00:00Z'));
      delete node.children;
    });
  };
}
`;

/** The plain Astro site: `pages` Markdown pages with ten computed values each, in one layout. */
function plainSite(dir: string, pages: number): void {
  mkdirSync(join(dir, 'src/pages/p'), { recursive: true });
  mkdirSync(join(dir, 'src/layouts'), { recursive: true });
  writeFileSync(join(dir, 'sky.mjs'), SKY_PLUGIN);
  writeFileSync(
    join(dir, 'astro.config.mjs'),
    `import { defineConfig } from 'astro/config';\nimport remarkDirective from 'remark-directive';\nimport skyValues from './sky.mjs';\nexport default defineConfig({ cacheDir: './.cache', trailingSlash: 'always', build: { format: 'directory', inlineStylesheets: 'always' }, markdown: { remarkPlugins: [remarkDirective, skyValues] } });\n`,
  );
  writeFileSync(join(dir, 'package.json'), '{ "name": "plain-bench", "private": true, "type": "module" }\n');
  writeFileSync(
    join(dir, 'src/layouts/Page.astro'),
    `---\nconst { frontmatter } = Astro.props;\n---\n<html lang="en"><head><meta charset="utf-8"><title>{frontmatter.title}</title><style>body{font:18px/1.5 sans-serif;max-width:40em;margin:auto;background:#0c1019;color:#ece6d8}</style></head><body><h1>{frontmatter.title}</h1><slot /></body></html>\n`,
  );
  const names = Object.keys({ sunset: 0, sunrise: 0, moonrise: 0, moonset: 0, phase: 0, 'jupiter-rise': 0, 'jupiter-alt': 0, 'jupiter-az': 0, 'jupiter-mag': 0, 'venus-elong': 0 });
  for (let i = 0; i < pages; i++) {
    const [, lon] = ZONES[i % ZONES.length]!;
    const lat = -45 + ((i * 37) % 111);
    const date = new Date(Date.UTC(2026, 9, 5) + 7 * 86_400_000 * (i % 13)).toISOString().slice(0, 10);
    const lines = names.map((v) => `- ${v}: :sky{v=${v} lat=${lat} lon=${lon} date=${date}}`);
    writeFileSync(
      join(dir, `src/pages/p/${i}.md`),
      `---\nlayout: ../../layouts/Page.astro\ntitle: Page ${i} (${date})\n---\n\nThe sky for the week of ${date} at ${lat}°, ${lon}°.\n\n${lines.join('\n')}\n`,
    );
  }
  symlinkSync(join(ROOT, 'node_modules'), join(dir, 'node_modules'), 'dir');
}

function timed(command: string[], cwd: string, env: Record<string, string> = {}): number {
  const t = performance.now();
  const r = spawnSync(process.execPath, command, { cwd, encoding: 'utf8', env: { ...process.env, ASTRO_TELEMETRY_DISABLED: '1', ...env } });
  if (r.status !== 0) throw new Error(`${command.join(' ')} failed in ${cwd}:\n${r.stderr}\n${r.stdout}`);
  return performance.now() - t;
}

export async function run(): Promise<BenchRow[]> {
  // Inside the checkout's parent temp folder: each project is its own root.
  const work = mkdtempSync(join(tmpdir(), 'gloaming-bench-compare-'));
  try {
    const g = join(work, 'gloaming');
    const p = join(work, 'plain');
    gloamingProject(g, SITES);
    const gloamingBuild = (): number => timed(['scripts/build.ts', '--today', TODAY, '--out', 'dist'], g, { GLOAMING_CACHE_DIR: join(g, '.cache'), GLOAMING_TODAY: '', GLOAMING_SITES: '', GLOAMING_CONTENT: '' });
    const clean = (dir: string): void => {
      for (const f of ['dist', '.astro', '.cache']) rmSync(join(dir, f), { recursive: true, force: true });
      for (const f of readdirSync(dir).filter((n) => n.startsWith('.dist-') || n.startsWith('.tmp-'))) rmSync(join(dir, f), { recursive: true, force: true });
    };
    // A first gloaming build counts its pages for the plain site (and is not timed).
    clean(g);
    gloamingBuild();
    const pages = count(join(g, 'dist'), '.html');
    plainSite(p, pages);
    const plainBuild = (): number => timed([join(ROOT, 'node_modules/astro/bin/astro.mjs'), 'build', '--silent'], p);
    const t = { gCold: [] as number[], gWarm: [] as number[], pCold: [] as number[], pWarm: [] as number[] };
    for (let i = 0; i < RUNS; i++) {
      clean(g);
      t.gCold.push(gloamingBuild());
      clean(p);
      t.pCold.push(plainBuild());
      t.gWarm.push(gloamingBuild());
      t.pWarm.push(plainBuild());
    }
    const plainPages = count(join(p, 'dist'), '.html');
    const m = { gCold: median(t.gCold), gWarm: median(t.gWarm), pCold: median(t.pCold), pWarm: median(t.pWarm) };
    const s = (ms: number): string => `${(ms / 1000).toFixed(1)} s`;
    console.log(`\n| pages | gloaming cold | plain cold | ratio | gloaming warm | plain warm | ratio |\n|---|---|---|---|---|---|---|`);
    console.log(`| ${pages} (${SITES} sites; plain ${plainPages}) | ${s(m.gCold)} | ${s(m.pCold)} | ${(m.gCold / m.pCold).toFixed(2)}× | ${s(m.gWarm)} | ${s(m.pWarm)} | ${(m.gWarm / m.pWarm).toFixed(2)}× |\n`);
    return [
      { name: `build-compare: gloaming cold, ${pages} pages (${SITES} sites); target ${GOAL.cold}× plain`, medianMs: m.gCold, targetMs: GOAL.cold * m.pCold, samples: RUNS },
      { name: `build-compare: plain Astro cold, ${plainPages} Markdown pages`, medianMs: m.pCold, samples: RUNS },
      { name: `build-compare: gloaming warm; target ${GOAL.warm}× plain`, medianMs: m.gWarm, targetMs: GOAL.warm * m.pWarm, samples: RUNS },
      { name: 'build-compare: plain Astro warm', medianMs: m.pWarm, samples: RUNS },
    ];
  } finally {
    rmSync(work, { recursive: true, force: true });
  }
}

if (import.meta.main) report(await run());
