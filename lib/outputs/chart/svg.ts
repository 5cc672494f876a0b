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
export function text(x: number, y: number, content: string | readonly string[], options: { size: number; fill?: string; anchor?: 'start' | 'middle' | 'end'; weight?: 'bold'; italic?: boolean; halo?: string }): string {
  const anchor = options.anchor && options.anchor !== 'start' ? ` text-anchor="${options.anchor}"` : '';
  const weight = (options.weight ? ` font-weight="${options.weight}"` : '') + (options.italic ? ' font-style="italic"' : '');
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

/** What a label names, so tests and alt text can check that the picture says what the words say. */
export type LabelRole = 'title' | 'compass' | 'altitude' | 'target' | 'body' | 'star' | 'pattern' | 'track' | 'sun';

/** A label drawn on a chart: its text (lines joined by a space), role and estimated box, user units. */
export interface PlacedLabel extends Box {
  text: string;
  role: LabelRole;
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
 * Places labels without overlaps. Each label tries spots around its mark (right, left, above,
 * below, the four diagonals, then the same farther out; a pattern's name may also sit centred on
 * its figure) and takes the first that stays inside the chart, clear of every earlier label and
 * reserved mark; among those it prefers near spots that cross none of the lines given to
 * `avoidLine` and cover no soft mark (a faint star): 3 per ring outward, 1 per line, 2 per faint star. Labels placed first win, so place the most important ones first. A forced label that
 * finds no clear spot tries four farther rings, then takes the spot that overlaps no label and the
 * fewest marks; only when none exists does it take the least overlap overall. Every placed label
 * is kept in `labels` with its box, so a chart can report (and a test check) what it labelled.
 */
export class LabelPlacer {
  readonly #marks: Box[] = [];
  readonly #soft: Box[] = [];
  readonly #segments: [number, number, number, number][] = [];
  readonly #width: number;
  readonly #height: number;
  /** Every label placed or fixed so far, in order. */
  readonly labels: PlacedLabel[] = [];

  constructor(width: number, height: number) {
    this.#width = width;
    this.#height = height;
  }

  /**
   * Marks an area as taken by a drawn mark (a star, a body, the ground). A `soft` mark (a faint
   * star) is only avoided when there is a choice, like a line.
   */
  reserve(x0: number, y0: number, x1: number, y1: number, options: { soft?: boolean } = {}): void {
    (options.soft ? this.#soft : this.#marks).push({ x0, y0, x1, y1 });
  }

  /** A line labels should not cross when they can avoid it (a pattern's figure). */
  avoidLine(x1: number, y1: number, x2: number, y2: number): void {
    this.#segments.push([x1, y1, x2, y2]);
  }

  /** The box of `lines` of text at anchor point (x, y) (first baseline) with alignment `anchor`. */
  box(x: number, y: number, lines: readonly string[], size: number, anchor: Anchor, bold = false): Box {
    const w = Math.max(...lines.map((line) => textWidth(line, size, { bold })));
    const extra = (lines.length - 1) * size * 1.15;
    const x0 = anchor === 'start' ? x : anchor === 'end' ? x - w : x - w / 2;
    return { x0, y0: y - size * 0.8, x1: x0 + w, y1: y + size * 0.2 + extra };
  }

  /**
   * A label at a fixed place (a title, a compass point, a scale label): kept and returned true
   * when its box overlaps no earlier label (nor, with `avoidMarks`, a reserved mark); false (and
   * not kept) otherwise, so the caller skips it.
   */
  fixed(x: number, y: number, content: string | readonly string[], size: number, options: { anchor?: Anchor; bold?: boolean; role: LabelRole; avoidMarks?: boolean }): boolean {
    const lines = typeof content === 'string' ? [content] : content;
    const b = this.box(x, y, lines, size, options.anchor ?? 'start', options.bold ?? false);
    if (b.x0 < 1 || b.x1 > this.#width - 1 || b.y0 < 1 || b.y1 > this.#height - 1) return false;
    if (this.labels.some((l) => overlapArea(l, b) > 0)) return false;
    if (options.avoidMarks && this.#marks.some((m) => overlapArea(m, b) > 0)) return false;
    this.labels.push({ ...b, text: lines.join(' '), role: options.role });
    return true;
  }

  /**
   * Finds a spot for `content` near the mark at (x, y) with radius `gap`; returns the text's
   * anchor point and alignment, or null when no candidate fits (unless `force`). `centred` also
   * offers the spot centred on (x, y) first, and `scan` a grid of centred spots over a box, nearest
   * first (for a pattern's name over its figure).
   */
  place(
    x: number,
    y: number,
    lines: readonly string[],
    size: number,
    gap: number,
    options: { force?: boolean; bold?: boolean; role?: LabelRole; centred?: boolean; scan?: Box } = {},
  ): { x: number; y: number; anchor: Anchor; box: Box } | null {
    const bold = options.bold ?? false;
    const extra = (lines.length - 1) * size * 1.15;
    const h = size;
    // Each spot has a rank: how far out it lies (0 for the first ring), so a near spot over a faint
    // star or a line can still beat a clean one much farther away.
    const candidates: { x: number; y: number; anchor: Anchor; box: Box; rank: number }[] = [];
    let rank = 0;
    const add = (tx: number, ty: number, anchor: Anchor): void => {
      candidates.push({ x: tx, y: ty, anchor, box: this.box(tx, ty, lines, size, anchor, bold), rank });
    };
    if (options.centred) add(x, y + h * 0.35 - extra / 2, 'middle');
    // A pattern's name may sit anywhere over its figure: a grid of centred spots, nearest first.
    if (options.scan) {
      const grid: [number, number][] = [];
      for (let gx = options.scan.x0; gx <= options.scan.x1; gx += 6) for (let gy = options.scan.y0; gy <= options.scan.y1; gy += 6) grid.push([gx, gy]);
      grid.sort((a, b) => Math.hypot(a[0] - x, a[1] - y) - Math.hypot(b[0] - x, b[1] - y));
      for (const [gx, gy] of grid) {
        rank = Math.floor(Math.hypot(gx - x, gy - y) / 12);
        add(gx, gy + h * 0.35 - extra / 2, 'middle');
      }
    }
    const rings = options.force ? [gap + 2, gap + 12, gap + 24, gap + 38, gap + 54, gap + 72] : [gap + 2, gap + 12];
    for (const [i, g] of rings.entries()) {
      rank = i;
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
    const labelOverlap = (b: Box): number => this.labels.reduce((sum, o) => sum + overlapArea(b, o), 0);
    const markOverlap = (b: Box): number => this.#marks.reduce((sum, o) => sum + overlapArea(b, o), 0);
    const crosses = (b: Box): boolean => this.#segments.some((sg) => segmentHitsBox(sg, b));
    const hits = (b: Box, list: readonly Box[]): boolean => list.some((o) => overlapArea(b, o) > 0);
    // Among clear spots (no label, no mark), the one with the least cost: 3 per ring outward, 1 for
    // crossing a line, 2 per faint star covered. Spots are tried nearest first, and the search stops
    // once no farther spot can cost less.
    const cost = (c: (typeof inside)[number]): number => 3 * c.rank + (crosses(c.box) ? 1 : 0) + 2 * this.#soft.filter((o) => overlapArea(c.box, o) > 0).length;
    let chosen: (typeof inside)[number] | undefined;
    let least = Infinity;
    for (const c of [...inside].sort((a, b) => a.rank - b.rank)) {
      if (3 * c.rank >= least) break;
      if (hits(c.box, this.labels) || hits(c.box, this.#marks)) continue;
      const k = cost(c);
      if (k < least) {
        least = k;
        chosen = c;
      }
    }
    if (!chosen && options.force) {
      const noLabel = inside.filter((c) => labelOverlap(c.box) === 0);
      const pool = noLabel.length ? noLabel : inside.length ? inside : candidates;
      chosen = pool.reduce((a, b) => (labelOverlap(b.box) * 1000 + markOverlap(b.box) < labelOverlap(a.box) * 1000 + markOverlap(a.box) ? b : a));
    }
    if (!chosen) return null;
    this.labels.push({ ...chosen.box, text: lines.join(' '), role: options.role ?? 'star' });
    return { x: chosen.x, y: chosen.y, anchor: chosen.anchor, box: chosen.box };
  }
}

/**
 * A thin leader line from a mark (radius `gap`) to its label's box when the label had to sit
 * farther than `gap` + 8 units away, so the pair still reads as one; '' otherwise.
 */
export function leaderLine(x: number, y: number, gap: number, box: Box, colour: string): string {
  const bx = Math.max(box.x0, Math.min(x, box.x1));
  const by = Math.max(box.y0, Math.min(y, box.y1));
  const d = Math.hypot(bx - x, by - y);
  if (d <= gap + 8) return '';
  const ux = (bx - x) / d, uy = (by - y) / d;
  return `<path d="M${n(x + ux * (gap + 1))} ${n(y + uy * (gap + 1))}L${n(bx - ux * 2)} ${n(by - uy * 2)}" stroke="${colour}" stroke-width="0.8" opacity="0.8" fill="none"/>`;
}

/** Area shared by two boxes. */
export function overlapArea(a: Box, b: Box): number {
  return Math.max(0, Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0)) * Math.max(0, Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0));
}

/** Whether the segment (x1, y1)–(x2, y2) passes through the box (Liang–Barsky clipping). */
function segmentHitsBox([x1, y1, x2, y2]: [number, number, number, number], b: Box): boolean {
  let t0 = 0, t1 = 1;
  const dx = x2 - x1, dy = y2 - y1;
  const edges: [number, number][] = [[-dx, x1 - b.x0], [dx, b.x1 - x1], [-dy, y1 - b.y0], [dy, b.y1 - y1]];
  for (const [p, q] of edges) {
    if (p === 0) {
      if (q < 0) return false;
    } else {
      const r = q / p;
      if (p < 0) t0 = Math.max(t0, r);
      else t1 = Math.min(t1, r);
      if (t0 > t1) return false;
    }
  }
  return true;
}
