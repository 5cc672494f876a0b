/**
 * Content-hash cache and delivery of charts. A chart is keyed by a SHA-256 hash of everything it
 * depends on: the site (every field), the body (its id, kind and, for comets and asteroids, the
 * whole object file), the instant, the options, the chart format version and a fingerprint of
 * the code (every source file under lib/, so a change to any computation invalidates every chart).
 * An unchanged chart is read back from the cache folder instead of being drawn again.
 *
 * Files per chart, in the cache folder: `<key>.svg`, `<key>.json` (alt text, size, kind) and, when
 * rasters are asked for, `<key>.png` (1×) and `<key>@2x.png`. A cache without a folder keeps its
 * charts in memory for its own lifetime (checks, tests, the docs): nothing is written anywhere.
 *
 * Delivery (measured, see the README of test/reference/charts/): SVG files are smaller and
 * sharper on a phone than PNG, so the default is an `<img>` of the SVG file; rasters are
 * optional, rendered with `@resvg/resvg-js`.
 */
import { createHash } from 'node:crypto';
import { existsSync, mkdirSync, readdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { Resvg } from '@resvg/resvg-js';
import type { Body } from '../../core/body.ts';
import type { Site } from '../../core/site.ts';
import { horizonAltText, wholeSkyAltText } from './alt.ts';
import { horizonChart, type HorizonChartOptions } from './horizon.ts';
import { wholeSkyChart, type WholeSkyChartOptions } from './whole-sky.ts';
import { escapeXml } from './svg.ts';

/** Bump when the drawing changes in a way the code fingerprint would not show (never needed in practice). */
export const CHART_FORMAT_VERSION = 1;
/** Size budget of one chart file, bytes (issue #7). */
export const CHART_BUDGET_BYTES = 80 * 1024;

/** What to draw. */
export type ChartRequest =
  | { kind: 'horizon'; site: Site; body: Body; time: Date; options?: HorizonChartOptions }
  | { kind: 'sky'; site: Site; time: Date; body?: Body; options?: WholeSkyChartOptions };

/** A chart ready to publish (drawn now or read from the cache). */
export interface DeliveredChart {
  key: string;
  kind: 'horizon' | 'sky';
  /** File names inside the cache folder. */
  files: { svg: string; png?: string; png2x?: string };
  svg: string;
  width: number;
  height: number;
  alt: string;
  /** True when read from the cache. */
  hit: boolean;
}

/** Progress of a build's charts, reported after each chart. */
export interface ChartProgress {
  count: number;
  hits: number;
  rendered: number;
  /** Milliseconds since the cache object was made, from the injected clock. */
  elapsedMs: number;
  /** Milliseconds spent drawing and writing charts (cache misses) and reading hits, from the injected clock. */
  workMs: number;
  key: string;
}

export interface ChartCacheOptions {
  /** Cache folder; without one the charts are kept in memory only. */
  dir?: string;
  /** Also write 1× and 2× PNG rasters (default false). */
  raster?: boolean;
  /** Called after each chart. */
  onProgress?: (progress: ChartProgress) => void;
  /** Monotonic milliseconds for progress reports (e.g. `() => performance.now()`); without one, times read 0 (lib reads no clock). */
  clock?: () => number;
  /** Replaces the code fingerprint: a digest of the computing code the caller already has (the site's build passes its own). */
  codeVersion?: string;
  /** Font files for rasters (TTF/OTF); system fonts are used as well unless `systemFonts` is false. */
  fontFiles?: string[];
  systemFonts?: boolean;
}

let fingerprint: string | null = null;

/**
 * SHA-256 over every source file under lib/ (path and content, sorted by path) and the project's
 * package-lock.json (library versions such as astronomy-engine), computed once per process. A
 * build that already has a code digest passes it as `codeVersion` instead (the site does).
 */
export function codeFingerprint(): string {
  if (fingerprint) return fingerprint;
  const root = fileURLToPath(new URL('../..', import.meta.url));
  const hash = createHash('sha256');
  const lock = join(root, '..', 'package-lock.json');
  if (existsSync(lock)) hash.update(readFileSync(lock));
  const walk = (dir: string): string[] =>
    readdirSync(dir)
      .sort()
      .flatMap((name) => {
        const path = join(dir, name);
        return statSync(path).isDirectory() ? walk(path) : /\.(ts|json|yaml)$/.test(name) ? [path] : [];
      });
  for (const file of walk(root)) {
    hash.update(file.slice(root.length));
    hash.update('\0');
    hash.update(readFileSync(file));
    hash.update('\0');
  }
  fingerprint = hash.digest('hex');
  return fingerprint;
}

function siteKey(site: Site): unknown {
  return Object.fromEntries(Object.entries(site).filter(([k]) => k !== 'observer'));
}

function bodyKey(body: Body | undefined): unknown {
  if (!body) return null;
  const object = (body as { object?: unknown }).object;
  return { id: body.id, name: body.name, kind: body.kind, radiusKm: body.radiusKm, coma: body.comaDiameterArcmin ?? null, object: object ?? null };
}

function optionsKey(options: HorizonChartOptions | WholeSkyChartOptions | undefined): unknown {
  if (!options) return {};
  const { otherBodies, ...rest } = options;
  return { ...rest, otherBodies: otherBodies ? otherBodies.map((b) => bodyKey(b)) : null };
}

/** The cache key of a request: SHA-256 (hex) of its inputs, the format version and the code fingerprint. */
export function chartKey(request: ChartRequest, options: { codeVersion?: string } = {}): string {
  const inputs = {
    format: CHART_FORMAT_VERSION,
    code: options.codeVersion ?? codeFingerprint(),
    kind: request.kind,
    site: siteKey(request.site),
    body: bodyKey(request.body),
    time: request.time.toISOString(),
    options: optionsKey(request.options),
  };
  return createHash('sha256').update(JSON.stringify(inputs, (_k, v: unknown) => (v instanceof Date ? v.toISOString() : v))).digest('hex').slice(0, 32);
}

/** Draws a request (no cache): the SVG and its alt text. */
export function drawChart(request: ChartRequest): { svg: string; width: number; height: number; alt: string } {
  if (request.kind === 'horizon') {
    const chart = horizonChart({ site: request.site, body: request.body, time: request.time, ...(request.options ? { options: request.options } : {}) });
    return { svg: chart.svg, width: chart.width, height: chart.height, alt: horizonAltText(chart) };
  }
  const chart = wholeSkyChart({ site: request.site, time: request.time, ...(request.body ? { body: request.body } : {}), ...(request.options ? { options: request.options } : {}) });
  return { svg: chart.svg, width: chart.width, height: chart.height, alt: wholeSkyAltText(chart) };
}

/** Rasterises a chart's SVG to PNG at `widthPx` with `@resvg/resvg-js`. */
export function rasterizeChart(svg: string, options: { widthPx: number; fontFiles?: string[]; systemFonts?: boolean }): Buffer {
  const resvg = new Resvg(svg, {
    fitTo: { mode: 'width', value: options.widthPx },
    font: { loadSystemFonts: options.systemFonts ?? true, fontFiles: options.fontFiles ?? [], defaultFontFamily: 'DejaVu Sans', sansSerifFamily: 'DejaVu Sans' },
  });
  return resvg.render().asPng();
}

/**
 * Writes a cache file so that no reader ever sees it half written (builds may share a cache):
 * write beside it, then rename, which replaces the file in one step. The meta file is written
 * last, so a chart counts as cached only once all its files are complete.
 */
function writeAtomically(path: string, data: string | Uint8Array): void {
  const tmp = `${path}.${process.pid}.tmp`;
  writeFileSync(tmp, data);
  renameSync(tmp, path);
}

/** A cache entry: the chart's metadata and SVG. */
interface StoredChart {
  meta: { width: number; height: number; alt: string; kind: 'horizon' | 'sky' };
  svg: string;
}

/** Charts drawn once per distinct input and kept in a folder (or, without one, in memory). */
export class ChartCache {
  /** The cache folder, or null when the charts are kept in memory. */
  readonly dir: string | null;
  readonly #memory = new Map<string, StoredChart>();
  readonly #options: ChartCacheOptions;
  readonly #clock: () => number;
  readonly #start: number;
  count = 0;
  hits = 0;
  rendered = 0;
  /** Milliseconds spent in `get` (drawing, writing, reading). */
  workMs = 0;

  constructor(options: ChartCacheOptions = {}) {
    this.#options = options;
    this.dir = options.dir ?? null;
    this.#clock = options.clock ?? (() => 0);
    this.#start = this.#clock();
    if (this.dir !== null) mkdirSync(this.dir, { recursive: true });
  }

  /** A stored entry with every file asked for, or null. */
  #read(key: string, files: DeliveredChart['files']): StoredChart | null {
    if (this.dir === null) return this.#memory.get(key) ?? null;
    const metaPath = join(this.dir, `${key}.json`);
    if (!existsSync(metaPath) || (files.png && !existsSync(join(this.dir, files.png)))) return null;
    return { meta: JSON.parse(readFileSync(metaPath, 'utf8')) as StoredChart['meta'], svg: readFileSync(join(this.dir, files.svg), 'utf8') };
  }

  /** Stores a drawn chart: in memory, or its files in the folder (the metadata last: its presence marks a complete entry). */
  #write(key: string, files: DeliveredChart['files'], stored: StoredChart): void {
    if (this.dir === null) {
      this.#memory.set(key, stored);
      return;
    }
    writeAtomically(join(this.dir, files.svg), stored.svg);
    if (files.png && files.png2x) {
      const fonts = { ...(this.#options.fontFiles ? { fontFiles: this.#options.fontFiles } : {}), ...(this.#options.systemFonts !== undefined ? { systemFonts: this.#options.systemFonts } : {}) };
      writeAtomically(join(this.dir, files.png), rasterizeChart(stored.svg, { widthPx: stored.meta.width, ...fonts }));
      writeAtomically(join(this.dir, files.png2x), rasterizeChart(stored.svg, { widthPx: stored.meta.width * 2, ...fonts }));
    }
    writeAtomically(join(this.dir, `${key}.json`), JSON.stringify(stored.meta));
  }

  /** The chart of `request`, from the cache when its inputs were drawn before, else drawn and stored. */
  get(request: ChartRequest): DeliveredChart {
    const key = chartKey(request, this.#options.codeVersion !== undefined ? { codeVersion: this.#options.codeVersion } : {});
    const raster = this.#options.raster ?? false;
    const files = { svg: `${key}.svg`, ...(raster ? { png: `${key}.png`, png2x: `${key}@2x.png` } : {}) };
    const began = this.#clock();
    let delivered: DeliveredChart;
    const stored = this.#read(key, files);
    if (stored) {
      delivered = { key, kind: stored.meta.kind, files, svg: stored.svg, width: stored.meta.width, height: stored.meta.height, alt: stored.meta.alt, hit: true };
      this.hits++;
    } else {
      const drawn = drawChart(request);
      this.#write(key, files, { meta: { kind: request.kind, width: drawn.width, height: drawn.height, alt: drawn.alt }, svg: drawn.svg });
      delivered = { key, kind: request.kind, files, ...drawn, hit: false };
      this.rendered++;
    }
    this.count++;
    this.workMs += this.#clock() - began;
    this.#options.onProgress?.({ count: this.count, hits: this.hits, rendered: this.rendered, elapsedMs: this.#clock() - this.#start, workMs: this.workMs, key });
    return delivered;
  }
}

/**
 * The `<img>` markup of a delivered chart: intrinsic width and height (no layout shift),
 * `loading="lazy"`, `decoding="async"`, the alt text, and for rasters a 1×/2× `srcset`.
 * `url(file)` maps a cache file name to its public URL (e.g. `/charts/${file}`).
 */
export function chartImg(chart: DeliveredChart, options: { url: (file: string) => string; raster?: boolean; className?: string }): string {
  const cls = options.className ? ` class="${escapeXml(options.className)}"` : '';
  const common = `width="${chart.width}" height="${chart.height}" loading="lazy" decoding="async" alt="${escapeXml(chart.alt)}"${cls}`;
  if (options.raster && chart.files.png && chart.files.png2x) {
    return `<img src="${escapeXml(options.url(chart.files.png))}" srcset="${escapeXml(options.url(chart.files.png))} 1x, ${escapeXml(options.url(chart.files.png2x))} 2x" ${common}>`;
  }
  return `<img src="${escapeXml(options.url(chart.files.svg))}" ${common}>`;
}
