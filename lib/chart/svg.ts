/**
 * Small helpers for writing SVG as text: escaping, compact numbers, text with a halo, and a
 * label placer that keeps labels from overlapping. No DOM: charts are strings.
 */
import { COLOURS, FONT_FAMILY } from './style.ts';

/** Escapes text for an XML text node or attribute value. */
export function escapeXml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&apos;' })[c]!);
}

/** A coordinate rounded to 0.1 unit, without trailing zeros ("12.3", "-4", "0"). */
export function n(value: number): string {
  const r = Math.round(value * 10) / 10;
  return Object.is(r, -0) ? '0' : String(r);
}

/** A polyline's points as an SVG path `d` ("M x y L x y …"); points may be null (pen up). */
export function pathOf(points: readonly ({ x: number; y: number } | null)[]): string {
  let d = '';
  let down = false;
  for (const p of points) {
    if (!p) {
      down = false;
      continue;
    }
    d += `${down ? 'L' : 'M'}${n(p.x)} ${n(p.y)}`;
    down = true;
  }
  return d;
}

/** Text with a dark halo (so it reads over stars and lines); several lines go downward from `y`, 1.15 em apart. */
export function text(x: number, y: number, content: string | readonly string[], options: { size: number; fill?: string; anchor?: 'start' | 'middle' | 'end'; weight?: 'bold'; halo?: string }): string {
  const anchor = options.anchor && options.anchor !== 'start' ? ` text-anchor="${options.anchor}"` : '';
  const weight = options.weight ? ` font-weight="${options.weight}"` : '';
  const fill = options.fill ? ` fill="${options.fill}"` : '';
  const halo = options.halo ?? COLOURS.sky;
  const body = typeof content === 'string'
    ? escapeXml(content)
    : content.map((line, i) => (i === 0 ? `<tspan x="${n(x)}">` : `<tspan x="${n(x)}" dy="${n(options.size * 1.15)}">`) + escapeXml(line) + '</tspan>').join('');
  return `<text x="${n(x)}" y="${n(y)}" font-size="${options.size}"${fill}${anchor}${weight} stroke="${halo}">${body}</text>`;
}

/** The opening of a chart's SVG: size, viewBox, shared text style, background. */
export function svgOpen(width: number, height: number, title: string): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${width} ${height}" width="${width}" height="${height}" role="img">` +
    `<title>${escapeXml(title)}</title>` +
    `<g font-family="${escapeXml(FONT_FAMILY)}" fill="${COLOURS.text}" stroke-width="3" stroke-linejoin="round" paint-order="stroke">`
  );
}

export const SVG_CLOSE = '</g></svg>';

interface Box {
  x0: number;
  y0: number;
  x1: number;
  y1: number;
}

/**
 * Approximate advance width of text, user units: 0.62 em per character (0.68 in bold), on the
 * wide side of common sans-serif faces so that estimated boxes do not undershoot.
 */
export function textWidth(content: string, size: number, options: { bold?: boolean } = {}): number {
  return content.length * size * (options.bold ? 0.68 : 0.62);
}

type Anchor = 'start' | 'middle' | 'end';

/**
 * Places labels without overlaps: each label tries spots around its mark (right, left, above,
 * below, the four diagonals, then the same farther out) and takes the first that stays inside the
 * chart and clear of earlier labels and reserved boxes. Labels placed first win, so place the
 * most important ones first. A forced label that finds no free spot takes the inside spot with
 * the least overlap.
 */
export class LabelPlacer {
  readonly #boxes: Box[] = [];
  readonly #width: number;
  readonly #height: number;

  constructor(width: number, height: number) {
    this.#width = width;
    this.#height = height;
  }

  /** Marks an area as taken (a mark, a legend). */
  reserve(x0: number, y0: number, x1: number, y1: number): void {
    this.#boxes.push({ x0, y0, x1, y1 });
  }

  /**
   * Finds a spot for `content` near the mark at (x, y) with radius `gap`; returns the text's
   * anchor point and alignment, or null when no candidate fits (unless `force`).
   */
  place(x: number, y: number, lines: readonly string[], size: number, gap: number, options: { force?: boolean; bold?: boolean } = {}): { x: number; y: number; anchor: Anchor } | null {
    const w = Math.max(...lines.map((line) => textWidth(line, size, { bold: options.bold ?? false })));
    // Height of the block below the first baseline.
    const extra = (lines.length - 1) * size * 1.15;
    const h = size;
    const candidates: { x: number; y: number; anchor: Anchor; box: Box }[] = [];
    const add = (tx: number, ty: number, anchor: Anchor): void => {
      const x0 = anchor === 'start' ? tx : anchor === 'end' ? tx - w : tx - w / 2;
      candidates.push({ x: tx, y: ty, anchor, box: { x0, y0: ty - h * 0.8, x1: x0 + w, y1: ty + h * 0.2 + extra } });
    };
    for (const g of [gap + 2, gap + 12]) {
      const d = g * 0.75;
      add(x + g, y + h * 0.35 - extra / 2, 'start');
      add(x - g, y + h * 0.35 - extra / 2, 'end');
      add(x, y - g - h * 0.2 - extra, 'middle');
      add(x, y + g + h * 0.8, 'middle');
      add(x + d, y - d - extra, 'start');
      add(x - d, y - d - extra, 'end');
      add(x + d, y + d + h * 0.6, 'start');
      add(x - d, y + d + h * 0.6, 'end');
    }
    const inside = candidates.filter((c) => c.box.x0 >= 2 && c.box.x1 <= this.#width - 2 && c.box.y0 >= 2 && c.box.y1 <= this.#height - 2);
    const overlap = (b: Box): number =>
      this.#boxes.reduce((sum, o) => sum + Math.max(0, Math.min(b.x1, o.x1) - Math.max(b.x0, o.x0)) * Math.max(0, Math.min(b.y1, o.y1) - Math.max(b.y0, o.y0)), 0);
    let chosen = inside.find((c) => overlap(c.box) === 0);
    if (!chosen && options.force) {
      const pool = inside.length ? inside : candidates;
      chosen = pool.reduce((a, b) => (overlap(b.box) < overlap(a.box) ? b : a));
    }
    if (!chosen) return null;
    this.#boxes.push(chosen.box);
    return { x: chosen.x, y: chosen.y, anchor: chosen.anchor };
  }
}
