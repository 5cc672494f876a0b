/**
 * Social card per bulletin: 1200×630 PNG. Text is laid out by satori (SVG with the text as
 * paths, using the Atkinson Hyperlegible woff files), then rasterised by @resvg/resvg-js. The
 * picture is the site's own skyline (its horizon profile, azimuth 0–360° across the width) under
 * the words. Flat colours only, so the PNG stays well under 80 KB.
 */
import { mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { createRequire } from 'node:module';
import { crc32, deflateSync } from 'node:zlib';
import { Resvg } from '@resvg/resvg-js';
import satori from 'satori';
import { wordsFor } from '../../lib/core/language/index.ts';
import { entryDigest } from './digest.ts';

export const CARD_WIDTH = 1200;
export const CARD_HEIGHT = 630;

export interface CardInput {
  centre: string;
  /** The centre's accent colour on the dark background (content/centre.yaml `accent`, checked for contrast there), for the site and week line. */
  accent: string;
  title: string;
  siteName: string;
  weekLabel: string;
  /** The site's skyline, sorted by azimuth (degrees). Empty for a flat horizon. */
  horizon: { azimuthDeg: number; altitudeDeg: number }[];
  /** The caution badge's words in the page's language ("Eye-safety notice inside"), or null for none. */
  caution: string | null;
}

/**
 * The card of a bulletin page: the same input, key for key, wherever it is made (the build makes
 * it beside the page, the card route reads it back from the cache by this input's hash).
 */
export function cardInputOf(
  page: { title: string; when: string; cautions: readonly string[]; language: string },
  site: { name: string; horizon: readonly { azimuthDeg: number; altitudeDeg: number }[] },
  centre: { name: string; accentDark: string },
): CardInput {
  return {
    centre: centre.name,
    accent: centre.accentDark,
    title: page.title,
    siteName: site.name,
    weekLabel: page.when,
    horizon: site.horizon.map((p) => ({ azimuthDeg: p.azimuthDeg, altitudeDeg: p.altitudeDeg })),
    caution: page.cautions.length > 0 ? wordsFor(page.language).t('ui.card-caution') : null,
  };
}

let fonts: { name: string; data: Buffer; weight: 400 | 700; style: 'normal' }[] | undefined;

function loadFonts(): NonNullable<typeof fonts> {
  if (!fonts) {
    const require = createRequire(import.meta.url);
    const file = (w: number): Buffer => readFileSync(require.resolve(`@fontsource/atkinson-hyperlegible/files/atkinson-hyperlegible-latin-${w}-normal.woff`));
    fonts = [
      { name: 'Atkinson Hyperlegible', data: file(400), weight: 400, style: 'normal' },
      { name: 'Atkinson Hyperlegible', data: file(700), weight: 700, style: 'normal' },
    ];
  }
  return fonts;
}

/** Height of the skyline band at the foot of the card, px. */
const SKYLINE_HEIGHT = 200;

/**
 * The skyline silhouette as SVG elements for the band at the foot of the card (`width` ×
 * `height` px, origin at the band's top left): altitude scaled 6 px per degree above a 70 px
 * ground band, and a dashed line for the flat horizon.
 */
export function skylineElements(horizon: CardInput['horizon'], width = CARD_WIDTH, height = SKYLINE_HEIGHT): string {
  const base = height - 70;
  const y = (alt: number): number => Math.max(0, base - Math.max(0, alt) * 6);
  const points: [number, number][] = [];
  if (horizon.length === 0) points.push([0, base], [width, base]);
  else {
    const sorted = [...horizon].sort((a, b) => a.azimuthDeg - b.azimuthDeg);
    const first = sorted[0]!;
    const last = sorted[sorted.length - 1]!;
    // Wrap through north so the left and right edges meet.
    const span = 360 - last.azimuthDeg + first.azimuthDeg;
    const northAlt = span > 0 ? last.altitudeDeg + ((first.altitudeDeg - last.altitudeDeg) * (360 - last.azimuthDeg)) / span : first.altitudeDeg;
    points.push([0, y(northAlt)]);
    for (const p of sorted) points.push([(p.azimuthDeg / 360) * width, y(p.altitudeDeg)]);
    points.push([width, y(northAlt)]);
  }
  const d = `M0 ${height}` + points.map(([px, py]) => `L${px.toFixed(1)} ${py.toFixed(1)}`).join('') + `L${width} ${height}Z`;
  return `<path d="${d}" fill="#1d2640"/><path d="M0 ${base}H${width}" stroke="#f3b962" stroke-width="2" stroke-dasharray="4 10"/>`;
}

type Node = { type: string; props: Record<string, unknown> };
const h = (type: string, style: Record<string, unknown>, children?: unknown, extra: Record<string, unknown> = {}): Node => ({
  type,
  props: { style, ...extra, ...(children === undefined ? {} : { children }) },
});

/**
 * The card as SVG text: satori lays out the words (text as paths, with the card's own fonts), and
 * the skyline is drawn straight into the same SVG at the foot of the card. Measured on the demo's
 * cards (README): drawing the skyline as an embedded SVG image made resvg render a second
 * document and doubled the time per card, for the same pixels.
 */
export async function cardSvg(input: CardInput): Promise<string> {
  const tree = h(
    'div',
    { width: CARD_WIDTH, height: CARD_HEIGHT, display: 'flex', flexDirection: 'column', background: '#0c1019', color: '#ece6d8', fontFamily: 'Atkinson Hyperlegible', position: 'relative' },
    [
      h('div', { display: 'flex', flexDirection: 'column', padding: '56px 72px 0', gap: 18 }, [
        h('div', { display: 'flex', fontSize: 30, color: '#b9b3a6' }, input.centre),
        h('div', { display: 'flex', fontSize: input.title.length > 40 ? 62 : 76, fontWeight: 700, lineHeight: 1.1, maxWidth: 1056 }, input.title),
        h('div', { display: 'flex', fontSize: 38, color: input.accent, fontWeight: 700 }, `${input.siteName} · ${input.weekLabel}`),
        ...(input.caution
          ? [h('div', { display: 'flex', fontSize: 28, color: '#ffe0b8', border: '3px solid #ef8a3a', borderRadius: 14, padding: '6px 16px', alignSelf: 'flex-start', background: '#35190b' }, input.caution)]
          : []),
      ]),
    ],
  );
  const words = await satori(tree as never, { width: CARD_WIDTH, height: CARD_HEIGHT, fonts: loadFonts() });
  // Drawn last, over the background, as the image was: the band's top is SKYLINE_HEIGHT above the foot.
  return words.replace(/<\/svg>\s*$/, `<g transform="translate(0 ${CARD_HEIGHT - SKYLINE_HEIGHT})">${skylineElements(input.horizon)}</g></svg>`);
}

/** The words on the card, one line each (also stored in the PNG, see `encodePng`). */
export function cardText(input: CardInput): string {
  return [input.centre, input.title, `${input.siteName} · ${input.weekLabel}`, ...(input.caution ? [input.caution] : [])].join('\n');
}

/** One PNG chunk: length, type, data and the CRC-32 of type and data (PNG specification §5.3). */
function chunk(type: string, data: Uint8Array): Buffer {
  const out = Buffer.alloc(12 + data.length);
  out.writeUInt32BE(data.length, 0);
  out.write(type, 4, 'latin1');
  out.set(data, 8);
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length);
  return out;
}

/**
 * An opaque RGBA picture as PNG (ISO/IEC 15948:2004): 8-bit truecolour with alpha, every row
 * unfiltered, deflated at zlib level 1, with `text` in an iTXt chunk, keyword `Description`
 * (§11.3.4.5; UTF-8, uncompressed), so what the picture says stays readable by tools and tests.
 * Measured on the demo's cards: resvg's own PNG writer took about 17 ms a card and this about 6 ms,
 * for about 50 KB instead of 40 KB (the budget is 80 KB).
 */
export function encodePng(rgba: Uint8Array, width: number, height: number, text: string): Uint8Array {
  const stride = width * 4;
  const rows = Buffer.alloc(height * (stride + 1)); // each row: filter type 0 (none), then its pixels
  for (let y = 0; y < height; y++) rows.set(rgba.subarray(y * stride, (y + 1) * stride), y * (stride + 1) + 1);
  const header = Buffer.alloc(13);
  header.writeUInt32BE(width, 0);
  header.writeUInt32BE(height, 4);
  header.set([8, 6, 0, 0, 0], 8); // bit depth 8, colour type 6 (RGBA), deflate, adaptive filtering, no interlace
  return new Uint8Array(
    Buffer.concat([
      Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
      chunk('IHDR', header),
      chunk('iTXt', Buffer.concat([Buffer.from('Description\0\0\0\0\0', 'latin1'), Buffer.from(text, 'utf8')])),
      chunk('IDAT', deflateSync(rows, { level: 1 })),
      chunk('IEND', new Uint8Array(0)),
    ]),
  );
}

/** The card as PNG bytes (see `encodePng`). */
export async function renderCard(input: CardInput): Promise<Uint8Array> {
  const svg = await cardSvg(input);
  const image = new Resvg(svg, { fitTo: { mode: 'width', value: CARD_WIDTH }, font: { loadSystemFonts: false } }).render();
  // resvg's pixels are premultiplied by alpha: the same as plain RGBA only where the card is opaque, as its background makes it everywhere.
  return encodePng(image.pixels, image.width, image.height, cardText(input));
}

/**
 * `renderCard` with a content-hash cache: the PNG is kept in `<cacheDir>/cards/<sha256>.png`,
 * keyed by the card's inputs and `codeDigest` (the hash of the computing and rendering code and
 * the lockfile, which pins satori, resvg and the font). Without a cache folder or code digest it
 * simply renders.
 */
export async function renderCardCached(input: CardInput, options: { cacheDir?: string; codeDigest?: string }): Promise<Uint8Array> {
  if (!options.cacheDir || !options.codeDigest) return renderCard(input);
  const key = entryDigest({ code: options.codeDigest, input: JSON.stringify(input) });
  const file = join(options.cacheDir, 'cards', `${key}.png`);
  try {
    return new Uint8Array(readFileSync(file));
  } catch {
    const png = await renderCard(input);
    mkdirSync(join(options.cacheDir, 'cards'), { recursive: true });
    const tmp = `${file}.${process.pid}.tmp`;
    writeFileSync(tmp, png);
    renameSync(tmp, file); // atomic: a concurrent build never reads half a file
    return png;
  }
}
