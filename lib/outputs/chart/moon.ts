/**
 * The Moon as a reader sees it on a chart: its lit part (crescent, quarter, gibbous) with the
 * bright limb turned towards the Sun. The terminator is drawn as the half-ellipse it projects to
 * (semi-axis r·|1 − 2k| for lit fraction k), the usual way of drawing a phase.
 */
import type { ChartLayout } from './projection.ts';
import { COLOURS } from './style.ts';
import { n } from './svg.ts';

const RAD = Math.PI / 180;

function unit(altitudeDeg: number, azimuthDeg: number): [number, number, number] {
  const h = altitudeDeg * RAD;
  const a = azimuthDeg * RAD;
  return [Math.cos(h) * Math.cos(a), Math.cos(h) * Math.sin(a), Math.sin(h)];
}

/**
 * Direction on the chart (radians, x right, y down) from the Moon towards the Sun along the great
 * circle joining them: where the bright limb faces. Taken from a point 0.5° along that circle, so
 * it is right wherever the Sun is, even far below the horizon.
 */
export function brightLimbAngle(layout: ChartLayout, moon: { altitudeDeg: number; azimuthDeg: number }, sun: { altitudeDeg: number; azimuthDeg: number }): number | null {
  const m = unit(moon.altitudeDeg, moon.azimuthDeg);
  const s = unit(sun.altitudeDeg, sun.azimuthDeg);
  const dot = m[0] * s[0] + m[1] * s[1] + m[2] * s[2];
  const t: [number, number, number] = [s[0] - dot * m[0], s[1] - dot * m[1], s[2] - dot * m[2]];
  const len = Math.hypot(...t);
  if (len < 1e-9) return null;
  const e = 0.5 * RAD;
  const p = m.map((v, i) => Math.cos(e) * v + (Math.sin(e) * t[i]!) / len) as [number, number, number];
  const from = layout.toChart(moon.altitudeDeg, moon.azimuthDeg);
  const to = layout.toChart(Math.asin(p[2]) / RAD, ((Math.atan2(p[1], p[0]) / RAD) + 360) % 360);
  return from && to ? Math.atan2(to.y - from.y, to.x - from.x) : null;
}

/**
 * SVG of the Moon at (x, y) with radius r: the dark disc outlined, and the lit part for lit
 * fraction `k` (0 new … 1 full) with its bright limb towards chart angle `limbAngle` (radians).
 */
export function moonMarkup(x: number, y: number, r: number, k: number, limbAngle: number | null): string {
  const disc = `<circle cx="${n(x)}" cy="${n(y)}" r="${n(r)}" fill="${COLOURS.sky}" stroke="${COLOURS.moon}" stroke-width="0.8" stroke-opacity="0.6"/>`;
  if (k >= 0.995 || limbAngle === null) return `<circle cx="${n(x)}" cy="${n(y)}" r="${n(r)}" fill="${COLOURS.moon}" stroke="${COLOURS.sky}" stroke-width="1"/>`;
  if (k <= 0.005) return disc;
  // Local frame: the bright limb towards +x. Lit outline: the bright half of the rim, then back
  // along the terminator (bulging towards the bright side for a crescent, away for a gibbous Moon).
  const a = r * Math.abs(1 - 2 * k);
  const sweep = k < 0.5 ? 0 : 1;
  const lit = `M0 ${n(-r)}A${n(r)} ${n(r)} 0 0 1 0 ${n(r)}A${n(a)} ${n(r)} 0 0 ${sweep} 0 ${n(-r)}Z`;
  return `${disc}<path d="${lit}" fill="${COLOURS.moon}" transform="translate(${n(x)} ${n(y)}) rotate(${n(limbAngle / RAD)})"/>`;
}
