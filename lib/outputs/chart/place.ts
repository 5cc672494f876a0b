/**
 * Where things are in a site's sky at one moment, for drawing: catalogue stars (J2000) and
 * geocentric vectors (J2000) turned into apparent altitude and azimuth.
 *
 * Frames and corrections: J2000 mean equator (EQJ) → true equator of date (precession and
 * nutation) → horizontal, through `SkyFrame` of lib/core/geometry.ts (the one altitude and azimuth
 * path). Altitudes get standard refraction (the same as `observe`), so stars and bodies sit at the
 * heights the reader sees. Stellar aberration (≤ 20″), annual parallax and proper motion since J2000 (≤ 2.6′,
 * see lib/models/stars/catalogue.ts) are ignored: a chart dot is several arcminutes across.
 */
import * as Astronomy from 'astronomy-engine';
import { SkyFrame, altitudeOfHor, apparentAltitudeDeg, azimuthOfHor, unitFromRaDec } from '../../core/geometry.ts';
import type { Site } from '../../core/site.ts';
import { starByHip, stars, type Star } from '../../models/stars/catalogue.ts';
import { patterns, type StarPattern } from '../../models/stars/patterns.ts';
import type { AltAz, ChartLayout } from './projection.ts';
import { COLOURS, FONT } from './style.ts';
import { LabelPlacer, n, text } from './svg.ts';

const RAD = Math.PI / 180;

type Vec = [number, number, number];

interface StarVector {
  star: Star;
  v: Vec;
}

let starVectors: StarVector[] | null = null;

/** Unit EQJ vectors of every catalogue star, sorted brightest first (computed once). */
function catalogueVectors(): StarVector[] {
  if (!starVectors) {
    starVectors = [...stars()]
      .sort((a, b) => a.vMag - b.vMag)
      .map((star) => {
        return { star, v: unitFromRaDec(star.raDeg, star.decDeg) };
      });
  }
  return starVectors;
}

/** A star placed in the sky of a site at a moment. */
export interface PlacedStar extends AltAz {
  star: Star;
}

/** The horizontal frame of one site at one moment. */
export class SkyAt {
  readonly site: Site;
  readonly time: Astronomy.AstroTime;
  readonly #frame: SkyFrame;

  constructor(site: Site, instant: Date) {
    this.site = site;
    this.time = Astronomy.MakeTime(instant);
    this.#frame = new SkyFrame(site, this.time);
  }

  /** Apparent (refracted) altitude and azimuth of an EQJ direction (any length). */
  fromEqj(x: number, y: number, z: number): AltAz {
    const h = this.#frame.horFromEqj(x, y, z);
    return { altitudeDeg: apparentAltitudeDeg(altitudeOfHor(h)), azimuthDeg: azimuthOfHor(h) };
  }

  /** Apparent altitude and azimuth of a catalogue star. */
  star(star: Star): AltAz {
    const [x, y, z] = unitFromRaDec(star.raDeg, star.decDeg);
    return this.fromEqj(x, y, z);
  }

  /**
   * Every catalogue star of V ≤ `maxMagnitude` (brightest first) that passes `keep` (given the
   * star's place), placed in this sky. Stars below `minAltitudeDeg` (default −1°) are skipped
   * before refraction is computed.
   */
  stars(maxMagnitude: number, keep: (place: AltAz) => boolean, options: { minAltitudeDeg?: number } = {}): PlacedStar[] {
    const minSin = Math.sin((options.minAltitudeDeg ?? -1) * RAD);
    const out: PlacedStar[] = [];
    for (const { star, v } of catalogueVectors()) {
      if (star.vMag > maxMagnitude) break;
      if (this.#frame.zenithFromEqj(v[0], v[1], v[2]) < minSin) continue;
      const p = this.fromEqj(v[0], v[1], v[2]);
      if (keep(p)) out.push({ star, ...p });
    }
    return out;
  }
}

/** A pattern line's two ends: where the stars are in the sky and on the chart (null when unprojectable). */
export interface LineEnds {
  a: { altitudeDeg: number; azimuthDeg: number };
  b: { altitudeDeg: number; azimuthDeg: number };
  qa: { x: number; y: number } | null;
  qb: { x: number; y: number } | null;
}

/**
 * The pattern lines of a chart as SVG: every pattern's lines that `keep` accepts, in the quiet
 * colour, and the guide pattern's on top in its own colour. One drawing for both kinds of chart;
 * each chart says which lines belong on it.
 */
export function patternLinesMarkup(
  sky: SkyAt,
  layout: ChartLayout,
  guide: StarPattern | null,
  keep: (ends: LineEnds) => boolean,
  style: { guideWidth: number; guideOpacity?: number },
): string[] {
  const path = (pattern: StarPattern): string => {
    let d = '';
    for (const [ha, hb] of pattern.lines) {
      const a = sky.star(starByHip(ha)!);
      const b = sky.star(starByHip(hb)!);
      const ends = { a, b, qa: layout.toChart(a.altitudeDeg, a.azimuthDeg), qb: layout.toChart(b.altitudeDeg, b.azimuthDeg) };
      if (!ends.qa || !ends.qb || !keep(ends)) continue;
      d += `M${n(ends.qa.x)} ${n(ends.qa.y)}L${n(ends.qb.x)} ${n(ends.qb.y)}`;
    }
    return d;
  };
  const out: string[] = [];
  let others = '';
  for (const pattern of patterns()) if (pattern.id !== guide?.id) others += path(pattern);
  if (others) out.push(`<path d="${others}" fill="none" stroke="${COLOURS.otherPattern}" stroke-width="1"/>`);
  const guideLines = guide ? path(guide) : '';
  if (guideLines) {
    const opacity = style.guideOpacity !== undefined ? ` opacity="${style.guideOpacity}"` : '';
    out.push(`<path d="${guideLines}" fill="none" stroke="${COLOURS.guide}" stroke-width="${style.guideWidth}"${opacity}/>`);
  }
  return out;
}

/**
 * The guide pattern's name over its figure (`pts`: its stars' chart positions): centred on their
 * mean position when that spot is clear, else at the nearest clear spot over the figure (its
 * box widened by 24 units), on one line or, for a long name, on two. Stars are reserved in the
 * placer, so the name never sits on one; when nothing is clear it is forced nearby. Returns the
 * SVG text ('' when it could not be placed at all).
 */
export function patternLabel(placer: LabelPlacer, name: string, pts: readonly { x: number; y: number }[]): string {
  const cx = pts.reduce((s, p) => s + p.x, 0) / pts.length;
  const cy = pts.reduce((s, p) => s + p.y, 0) / pts.length;
  const xs = pts.map((p) => p.x), ys = pts.map((p) => p.y);
  const scan = { x0: Math.min(...xs) - 24, y0: Math.min(...ys) - 24, x1: Math.max(...xs) + 24, y1: Math.max(...ys) + 24 };
  const words = name.split(' ');
  const half = Math.ceil(words.length / 2);
  const variants = words.length >= 2 ? [[name], [words.slice(0, half).join(' '), words.slice(half).join(' ')]] : [[name]];
  const style = { size: FONT.label, fill: COLOURS.guide, weight: 'bold' as const, italic: true };
  for (const lines of variants) {
    const spot = placer.place(cx, cy, lines, FONT.label, 6, { bold: true, centred: true, scan, role: 'pattern' });
    if (spot) return text(spot.x, spot.y, lines, { ...style, anchor: spot.anchor });
  }
  const lines = variants[variants.length - 1]!;
  const spot = placer.place(cx, cy, lines, FONT.label, 6, { bold: true, centred: true, force: true, role: 'pattern' });
  return spot ? text(spot.x, spot.y, lines, { ...style, anchor: spot.anchor }) : '';
}
