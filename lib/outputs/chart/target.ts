/**
 * The target's symbol on a chart: a ring with a dot; a deep-sky object larger than the ring is
 * drawn at its apparent size, so a reader knows how big a patch to look for (M 31 spans several
 * Moon diameters, M 57 is a speck).
 *
 * Size: the catalogue gives the axes a × b of the object's ellipse but no position angle (the
 * deep-sky data of `d3-celestial` carries none), so the object is drawn as the circle of the same
 * area, diameter √(a b), rather than as an ellipse turned the wrong way. The radius on the chart is
 * measured on the projection at the target (stereographic, so circles stay circles).
 */
import type { Body } from '../../core/body.ts';
import type { AltAz, ChartLayout } from './projection.ts';
import { COLOURS } from './style.ts';
import { n } from './svg.ts';

/** The symbol's markup and the radius it covers, chart units. */
export interface TargetSymbol {
  markup: string;
  radius: number;
}

/** Apparent radius of an extended body on the chart at `at`, user units (0 for a point). */
export function extentRadius(layout: ChartLayout, at: AltAz, body: Body): number {
  if (!body.extentArcmin) return 0;
  const radiusDeg = Math.sqrt(body.extentArcmin.major * body.extentArcmin.minor) / 120;
  const up = at.altitudeDeg + radiusDeg <= 90 ? radiusDeg : -radiusDeg;
  const a = layout.toChart(at.altitudeDeg, at.azimuthDeg);
  const b = layout.toChart(at.altitudeDeg + up, at.azimuthDeg);
  return a && b ? Math.hypot(b.x - a.x, b.y - a.y) : 0;
}

/**
 * The target at chart point `q`: a ring of `ring` units with a dot of `dot` units, or, for a
 * deep-sky object larger than the ring, a translucent disc at its apparent size with a dashed edge.
 */
export function targetSymbol(layout: ChartLayout, at: AltAz, body: Body, q: { x: number; y: number }, ring: number, dot: number): TargetSymbol {
  const size = extentRadius(layout, at, body);
  const centre = `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="${dot}" fill="${COLOURS.target}" stroke="none"/>`;
  if (size <= ring) {
    return { markup: `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="${ring}" fill="none" stroke="${COLOURS.target}" stroke-width="2.2"/>${centre}`, radius: ring };
  }
  return {
    markup: `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="${n(size)}" fill="${COLOURS.target}" fill-opacity="0.16" stroke="${COLOURS.target}" stroke-width="1.6" stroke-dasharray="4 3"/>${centre}`,
    radius: size,
  };
}
