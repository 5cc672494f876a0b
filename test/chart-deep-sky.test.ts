/**
 * Deep-sky targets on finder charts: an object larger than the target ring is drawn at its
 * apparent size (the circle of the catalogue ellipse's area, `lib/outputs/chart/target.ts`), a small
 * one keeps the ring; the size is checked against the angle between two stars of the same chart
 * (the projection's own scale, measured on the drawn stars, with their separation from
 * `separationDeg` of the star table's J2000 positions).
 */
import { describe, expect, it } from 'vitest';
import { loadSites, projectRegistry } from '../lib/models/content.ts';
import { horizonChart, wholeSkyChart } from '../lib/outputs/chart/index.ts';
import { starByHip } from '../lib/models/stars/catalogue.ts';
import { separationDeg } from './helpers/tolerance.ts';
import { expectWithin } from './helpers/tolerance.ts';

const sites = loadSites('content/sites');
const southern = sites.get('southern-station')!;
const reg = projectRegistry();

/** The dashed extent circle of the chart: centre and radius, or null. */
function extentCircle(svg: string): { x: number; y: number; r: number } | null {
  const m = /<circle cx="([\d.-]+)" cy="([\d.-]+)" r="([\d.]+)"[^>]*stroke-dasharray="4 3"/.exec(svg);
  return m ? { x: Number(m[1]), y: Number(m[2]), r: Number(m[3]) } : null;
}

describe('deep-sky targets on charts', () => {
  it('the Large Magellanic Cloud (550′ × 170′) is drawn at its size: radius √(a b)/2 = 2.55°, at the chart\'s own scale (within 10 %)', () => {
    const lmc = reg.get('pgc17223');
    const chart = horizonChart({ site: southern, body: lmc, time: new Date('2026-12-04T12:00:00Z') });
    const circle = extentCircle(chart.svg);
    expect(circle).not.toBeNull();
    // Scale: two drawn stars near the target, their separation on the sky and on the chart.
    const near = chart.stars
      .map((s) => ({ ...s, d: Math.hypot(s.x - circle!.x, s.y - circle!.y) }))
      .filter((s) => s.d > 20 && s.d < 120)
      .sort((a, b) => a.d - b.d)
      .slice(0, 2);
    expect(near.length).toBe(2);
    const [a, b] = near.map((s) => starByHip(s.hip)!);
    const skyDeg = separationDeg(a!.raDeg / 15, a!.decDeg, b!.raDeg / 15, b!.decDeg);
    const unitsPerDeg = Math.hypot(near[0]!.x - near[1]!.x, near[0]!.y - near[1]!.y) / skyDeg;
    expectWithin(circle!.r / unitsPerDeg, Math.sqrt(550 * 170) / 120, 0.1 * 2.55, 'radius, degrees');
    // The label still names it, clear of the disc.
    expect(chart.svg).toContain('Large Magellanic Cloud');
  });

  it('a small object (M 57, 1′) keeps the ordinary target ring', () => {
    const chart = horizonChart({ site: sites.get('northern-outpost')!, body: reg.get('m57'), time: new Date('2026-12-04T15:00:00Z') });
    expect(extentCircle(chart.svg)).toBeNull();
    expect(chart.svg).toMatch(/r="8" fill="none"/);
  });

  it('on the whole-sky chart, where 2.5° is smaller than the ring, the LMC keeps the ring (the minimum symbol) and its name', () => {
    const chart = wholeSkyChart({ site: southern, body: reg.get('pgc17223'), time: new Date('2026-12-04T12:00:00Z') });
    expect(extentCircle(chart.svg)).toBeNull();
    expect(chart.svg).toMatch(/r="7" fill="none"/);
    expect(chart.svg).toContain('Large Magellanic Cloud');
  });
});
