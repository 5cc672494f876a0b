/**
 * Reference images: a few charts rendered to PNG with @resvg/resvg-js (DejaVu Sans, loaded from the
 * `dejavu-fonts-ttf` devDependency so text renders the same on every machine) and compared with
 * the committed images in test/reference/charts/ by a pixel-difference metric over RGBA.
 *
 * The committed images were looked at by eye before being committed (see the README there).
 * Regenerate after an intended change of the drawing: UPDATE_CHART_REFERENCES=1 npx vitest run test/chart-reference.test.ts
 */
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { Resvg } from '@resvg/resvg-js';
import { describe, expect, it } from 'vitest';
import { builtInBody } from '../lib/core/body.ts';
import { eveningMoment, horizonChart, wholeSkyChart } from '../lib/outputs/chart/index.ts';
import { loadBodies, loadSites } from '../lib/models/content.ts';
import { computeNight } from '../lib/models/night.ts';

const DIR = 'test/reference/charts';
const FONT_DIR = new URL('../node_modules/dejavu-fonts-ttf/ttf/', import.meta.url).pathname;
const FONTS = [`${FONT_DIR}DejaVuSans.ttf`, `${FONT_DIR}DejaVuSans-Bold.ttf`];
const update = process.env.UPDATE_CHART_REFERENCES === '1';

/** RGBA pixels of an SVG rendered at its own width. */
function render(svg: string): { width: number; height: number; pixels: Buffer; png: Buffer } {
  const img = new Resvg(svg, { font: { loadSystemFonts: false, fontFiles: FONTS, defaultFontFamily: 'DejaVu Sans' } }).render();
  return { width: img.width, height: img.height, pixels: img.pixels, png: img.asPng() };
}

/** RGBA pixels of a PNG file, decoded by resvg through an SVG <image> at its own size. */
function decodePng(file: string, width: number, height: number): Buffer {
  const data = readFileSync(file).toString('base64');
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}"><image href="data:image/png;base64,${data}" width="${width}" height="${height}"/></svg>`;
  return new Resvg(svg, { font: { loadSystemFonts: false } }).render().pixels;
}

/**
 * Difference of two RGBA images of the same size: the mean absolute channel difference (0–255)
 * and the fraction of pixels where any channel differs by more than 40.
 */
export function pixelDifference(a: Buffer, b: Buffer): { meanAbs: number; changedFraction: number } {
  if (a.length !== b.length) return { meanAbs: 255, changedFraction: 1 };
  let sum = 0;
  let changed = 0;
  for (let i = 0; i < a.length; i += 4) {
    let worst = 0;
    for (let c = 0; c < 4; c++) {
      const d = Math.abs(a[i + c]! - b[i + c]!);
      sum += d;
      if (d > worst) worst = d;
    }
    if (worst > 40) changed++;
  }
  return { meanAbs: sum / a.length, changedFraction: changed / (a.length / 4) };
}

function cases(): { name: string; svg: string }[] {
  const sites = loadSites('content/sites');
  const bodies = loadBodies('content/objects');
  const harbour = sites.get('harbour-roof')!;
  const southern = sites.get('southern-station')!;
  const jupiter = builtInBody('jupiter');
  const comet = bodies.get('comet-lumen');
  const n1 = computeNight(harbour, '2026-12-10', [jupiter]);
  const n2 = computeNight(southern, '2027-01-12', [comet]);
  return [
    { name: 'horizon-harbour-roof-jupiter-2026-12-10', svg: horizonChart({ site: harbour, body: jupiter, time: n1.bodies[0]!.visibility.best!.time, options: { trackDays: [-3, -2, -1, 1, 2, 3] } }).svg },
    { name: 'horizon-southern-station-comet-lumen-2027-01-12', svg: horizonChart({ site: southern, body: comet, time: n2.bodies[0]!.visibility.best!.time, options: { trackDays: [-3, -2, -1, 1, 2, 3] } }).svg },
    { name: 'sky-southern-station-2027-01-12', svg: wholeSkyChart({ site: southern, time: eveningMoment(n2), body: comet }).svg },
  ];
}

describe('chart reference images (test/reference/charts/)', () => {
  for (const c of cases()) {
    it(`${c.name} matches its reference`, () => {
      const file = `${DIR}/${c.name}.png`;
      const now = render(c.svg);
      if (update || !existsSync(file)) {
        writeFileSync(file, now.png);
        if (!update) throw new Error(`reference ${file} was missing and has been written: look at it, then commit it`);
        return;
      }
      const reference = decodePng(file, now.width, now.height);
      const diff = pixelDifference(now.pixels, reference);
      // Tolerances: anti-aliasing and font hinting differences stay far below these.
      expect(diff.changedFraction, `${c.name}: changed pixels`).toBeLessThanOrEqual(0.005);
      expect(diff.meanAbs, `${c.name}: mean channel difference`).toBeLessThanOrEqual(1.5);
    });
  }

  it('the metric sees a real change (a chart for another night differs)', () => {
    const [a, b] = cases();
    const ra = render(a!.svg);
    const rb = render(b!.svg);
    expect(ra.width === rb.width && ra.height === rb.height).toBe(true);
    expect(pixelDifference(ra.pixels, rb.pixels).changedFraction).toBeGreaterThan(0.01);
  });
});
