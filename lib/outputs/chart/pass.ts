/**
 * A satellite pass drawn on the whole-sky chart: its track across the sky, solid where it can be
 * seen and dashed where it cannot (in the Earth's shadow, or before and after the visible part),
 * a ring where it appears and a bar where it disappears, each with its time, and arrowheads along
 * the visible part pointing the way it moves. The words are in `passAltSentence`, from the same
 * points.
 */
import { wordsFor } from '../../core/language/index.ts';
import type { SatellitePass } from '../../models/satellite/passes.ts';
import { passWhere } from '../../models/satellite/words.ts';
import type { Site } from '../../core/site.ts';
import type { ChartLayout } from './projection.ts';
import { COLOURS } from './style.ts';
import { n, pathOf } from './svg.ts';
import { formatChartTime } from './words.ts';

/** A pass as the chart needs it (from `SatellitePass`: its `track` and `visible` span). */
export interface ChartPass {
  /** The satellite's display name. */
  name: string;
  /** The track, start to end of the pass, in time order: apparent altitude, azimuth, sunlit. */
  track: readonly { time: Date; altitudeDeg: number; azimuthDeg: number; sunlit: boolean }[];
  /** When it can be seen: appears, is brightest, disappears. */
  visible: { start: Date; best: Date; end: Date };
  /** Expected magnitude at its best moment. */
  magnitude: number;
  /** The highest point of the whole pass (seen or not). */
  culmination: { time: Date; altitudeDeg: number; azimuthDeg: number };
}

/** The chart's view of a pass with a verdict (one with a `visible` span and a track). */
export function chartPassOf(pass: SatellitePass): ChartPass {
  const seen = pass.visible!;
  return { name: pass.satellite.name, track: pass.track, visible: { start: seen.start.time, best: seen.best.time, end: seen.end.time }, magnitude: seen.best.magnitude ?? Number.NaN, culmination: { time: pass.culmination.time, altitudeDeg: pass.culmination.altitudeDeg, azimuthDeg: pass.culmination.azimuthDeg } };
}

/** The point of the track at `time`, interpolated linearly in altitude and azimuth (the track is dense). */
export function passPointAt(pass: ChartPass, time: Date): { altitudeDeg: number; azimuthDeg: number } {
  const t = time.getTime();
  const pts = pass.track;
  let i = 0;
  while (i + 2 < pts.length && pts[i + 1]!.time.getTime() < t) i++;
  const a = pts[i]!, b = pts[Math.min(i + 1, pts.length - 1)]!;
  const span = b.time.getTime() - a.time.getTime();
  const f = span > 0 ? Math.min(1, Math.max(0, (t - a.time.getTime()) / span)) : 0;
  let dAz = b.azimuthDeg - a.azimuthDeg;
  if (dAz > 180) dAz -= 360;
  if (dAz < -180) dAz += 360;
  return { altitudeDeg: a.altitudeDeg + f * (b.altitudeDeg - a.altitudeDeg), azimuthDeg: (a.azimuthDeg + f * dAz + 360) % 360 };
}

export interface PassDrawing {
  /** SVG markup of the track, ends and arrowheads (labels are placed by the chart). */
  markup: string;
  /** Where the visible part begins and ends on the chart, with their labels. */
  ends: { kind: 'appears' | 'disappears'; x: number; y: number; altitudeDeg: number; azimuthDeg: number; label: string; lines: string[] }[];
  /** Segments of the drawn track, for the label placer to avoid. */
  segments: [number, number, number, number][];
}

/** Draws `pass` on a whole-sky chart layout. */
export function drawPass(pass: ChartPass, layout: ChartLayout, site: Site): PassDrawing {
  const t0 = pass.visible.start.getTime();
  const t1 = pass.visible.end.getTime();
  const at = (p: { altitudeDeg: number; azimuthDeg: number }): { x: number; y: number } | null => layout.toChart(Math.max(0, p.altitudeDeg), p.azimuthDeg);
  // The visible part, with its exact ends.
  const seen = [pass.visible.start, ...pass.track.map((p) => p.time).filter((t) => t.getTime() > t0 && t.getTime() < t1), pass.visible.end].map((t) => at(passPointAt(pass, t)));
  const whole = pass.track.map(at);
  const segments: PassDrawing['segments'] = [];
  for (let i = 0; i + 1 < seen.length; i++) {
    const a = seen[i], b = seen[i + 1];
    if (a && b) segments.push([a.x, a.y, b.x, b.y]);
  }
  const colour = COLOURS.target;
  let markup = `<path d="${pathOf(whole)}" fill="none" stroke="${colour}" stroke-width="1.4" stroke-dasharray="3 4" opacity="0.75"/>`;
  markup += `<path d="${pathOf(seen)}" fill="none" stroke="${colour}" stroke-width="3" stroke-linecap="round"/>`;
  // Arrowheads at a third and two thirds of the visible part, pointing along the motion.
  for (const share of [1 / 3, 2 / 3]) {
    const tm = t0 + share * (t1 - t0);
    const a = at(passPointAt(pass, new Date(tm - 5000)));
    const b = at(passPointAt(pass, new Date(tm + 5000)));
    if (!a || !b) continue;
    const len = Math.hypot(b.x - a.x, b.y - a.y);
    if (len < 1e-6) continue;
    const ux = (b.x - a.x) / len, uy = (b.y - a.y) / len;
    const tip = { x: (a.x + b.x) / 2 + ux * 5, y: (a.y + b.y) / 2 + uy * 5 };
    const back = { x: tip.x - ux * 11, y: tip.y - uy * 11 };
    markup += `<path d="M${n(tip.x)} ${n(tip.y)}L${n(back.x - uy * 6)} ${n(back.y + ux * 6)}L${n(back.x + uy * 6)} ${n(back.y - ux * 6)}Z" fill="${colour}" stroke="${COLOURS.sky}" stroke-width="1"/>`;
  }
  const ends: PassDrawing['ends'] = [];
  const first = seen[0], last = seen[seen.length - 1];
  const p0 = passPointAt(pass, pass.visible.start), p1 = passPointAt(pass, pass.visible.end);
  if (first) {
    markup += `<circle cx="${n(first.x)}" cy="${n(first.y)}" r="5.5" fill="${COLOURS.sky}" stroke="${colour}" stroke-width="2.4"/>`;
    const time = formatChartTime(pass.visible.start, site);
    ends.push({ kind: 'appears', x: first.x, y: first.y, ...p0, label: `${pass.name} ${time}`, lines: [pass.name, time] });
  }
  if (last && last !== first && seen.length > 1) {
    const prev = seen[seen.length - 2]!;
    const len = Math.hypot(last.x - prev.x, last.y - prev.y) || 1;
    const ux = (last.x - prev.x) / len, uy = (last.y - prev.y) / len;
    markup += `<path d="M${n(last.x - uy * 7)} ${n(last.y + ux * 7)}L${n(last.x + uy * 7)} ${n(last.y - ux * 7)}" stroke="${colour}" stroke-width="3" stroke-linecap="round"/>`;
    const time = formatChartTime(pass.visible.end, site);
    ends.push({ kind: 'disappears', x: last.x, y: last.y, ...p1, label: time, lines: [time] });
  }
  return { markup, ends, segments };
}

/**
 * The pass in words, from the points the chart draws: "Demo station appears at 17:02, 11° up in
 * the west-northwest, highest 77° up in the north at 17:05, and
 * disappears at 17:08, 15° up in the east."
 */
export function passAltSentence(pass: ChartPass, site: Site): string {
  const p0 = passPointAt(pass, pass.visible.start);
  const p1 = passPointAt(pass, pass.visible.end);
  const seen = pass.track.filter((p) => p.time >= pass.visible.start && p.time <= pass.visible.end);
  // The highest point seen: the culmination when it is seen (as the pass's sentence says), else the highest point drawn.
  const c = pass.culmination;
  const culminates = c.time > pass.visible.start && c.time < pass.visible.end;
  const top = culminates ? c : [p0, ...seen, p1].reduce((a, b) => (b.altitudeDeg > a.altitudeDeg ? b : a));
  const w = wordsFor(site.locale);
  const where = (p: { altitudeDeg: number; azimuthDeg: number }): string => passWhere(w, p);
  const clock = (t: Date): string => formatChartTime(t, site);
  return w.t('pass.alt', {
    satellite: pass.name,
    start: clock(pass.visible.start),
    start_where: where(p0),
    top: top === p0 || top === p1 ? 'no' : 'yes',
    top_where: where(top),
    end: clock(pass.visible.end),
    end_where: where(p1),
  });
}
