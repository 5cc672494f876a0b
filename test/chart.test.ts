/**
 * Finder charts: geometry against astronomy-engine (stars precessed to date and put through its
 * `Horizon`, bodies from its `Equator` + `Horizon`, transits from `SearchHourAngle`), the demo
 * site files' skyline values, image validity and budgets, alt text, and the cache.
 */
import { mkdtempSync, rmSync, statSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { Resvg } from '@resvg/resvg-js';
import * as Astronomy from 'astronomy-engine';
import { afterAll, describe, expect, it } from 'vitest';
import { builtInBody } from '../lib/core/body.ts';
import { ChartCache, CHART_BUDGET_BYTES, chartImg, chartKey, horizonAltText, horizonChart, wholeSkyAltText, wholeSkyChart, eveningMoment } from '../lib/outputs/chart/index.ts';
import { loadBodies, loadSites } from '../lib/models/content.ts';
import { compass } from '../lib/core/describe.ts';
import { computeNight } from '../lib/models/night.ts';
import type { Site } from '../lib/core/site.ts';
import { starByHip } from '../lib/models/stars/catalogue.ts';
import { angleDiffDeg, expectWithin } from './helpers/tolerance.ts';

const sites = loadSites('content/sites');
const bodies = loadBodies('content/objects');
const harbour = sites.get('harbour-roof')!;
const southern = sites.get('southern-station')!;
const jupiter = builtInBody('jupiter');
const comet = bodies.get('comet-lumen');

/** Chart units per degree are about 4.3 at the 90° field; 0.05° is well under one unit. */
const POSITION_TOL_DEG = 0.05;

/** Expected apparent alt/az of a catalogue star: J2000 vector precessed and nutated to date, then astronomy-engine `Horizon` with normal refraction. */
function starAltAz(site: Site, time: Date, hip: number): { altitudeDeg: number; azimuthDeg: number } {
  const s = starByHip(hip)!;
  const t = Astronomy.MakeTime(time);
  const v = new Astronomy.Vector(Math.cos(s.decDeg * Math.PI / 180) * Math.cos(s.raDeg * Math.PI / 180), Math.cos(s.decDeg * Math.PI / 180) * Math.sin(s.raDeg * Math.PI / 180), Math.sin(s.decDeg * Math.PI / 180), t);
  const eq = Astronomy.EquatorFromVector(Astronomy.RotateVector(Astronomy.Rotation_EQJ_EQD(t), v));
  const h = Astronomy.Horizon(t, site.observer, eq.ra, eq.dec, 'normal');
  return { altitudeDeg: h.altitude, azimuthDeg: h.azimuth };
}

/** Expected apparent alt/az of a planet from astronomy-engine (topocentric, of date, aberration, refraction). */
function planetAltAz(site: Site, body: Astronomy.Body, time: Date): { altitudeDeg: number; azimuthDeg: number } {
  const eq = Astronomy.Equator(body, time, site.observer, true, true);
  const h = Astronomy.Horizon(time, site.observer, eq.ra, eq.dec, 'normal');
  return { altitudeDeg: h.altitude, azimuthDeg: h.azimuth };
}

function expectSameDirection(actual: { altitudeDeg: number; azimuthDeg: number }, expected: { altitudeDeg: number; azimuthDeg: number }, tol: number, what: string): void {
  expectWithin(actual.altitudeDeg, expected.altitudeDeg, tol, `${what} altitude`);
  expect(angleDiffDeg(actual.azimuthDeg, expected.azimuthDeg) * Math.cos(expected.altitudeDeg * Math.PI / 180), `${what} azimuth`).toBeLessThanOrEqual(tol);
}

function circleAt(svg: string, x: number, y: number): boolean {
  const f = (v: number): string => String(Math.round(v * 10) / 10);
  return svg.includes(`cx="${f(x)}" cy="${f(y)}"`);
}

/** Every font size in a chart, user units. */
function fontSizes(svg: string): number[] {
  return [...svg.matchAll(/font-size="([\d.]+)"/g)].map((m) => Number(m[1]));
}

const night = computeNight(harbour, '2026-12-10', [jupiter]);
const best = night.bodies[0]!.visibility.best!;
const jupiterChart = horizonChart({ site: harbour, body: jupiter, time: best.time, options: { trackDays: [-3, -2, -1, 1, 2, 3] } });

const southNight = computeNight(southern, '2027-01-12', [comet]);
const cometBest = southNight.bodies[0]!.visibility.best!;
const cometChart = horizonChart({ site: southern, body: comet, time: cometBest.time, options: { trackDays: [-3, -2, -1, 1, 2, 3] } });
const wholeSky = wholeSkyChart({ site: southern, time: eveningMoment(southNight), body: comet });

describe('horizon chart geometry', () => {
  it('plots named stars where astronomy-engine puts them (J2000 precessed to date, Horizon with refraction)', () => {
    let checked = 0;
    for (const chart of [jupiterChart, cometChart]) {
      for (const s of chart.stars) {
        const star = starByHip(s.hip)!;
        if (!star.name || star.vMag > 2.5) continue;
        const drawnAt = chart.layout.fromChart(s.x, s.y);
        expectSameDirection(drawnAt, starAltAz(chart.site, chart.time, s.hip), POSITION_TOL_DEG, star.name);
        expect(circleAt(chart.svg, s.x, s.y), `${star.name} drawn in the SVG`).toBe(true);
        checked++;
      }
    }
    expect(checked).toBeGreaterThanOrEqual(4);
  });

  it('plots the target where its alt/az says (astronomy-engine Equator + Horizon)', () => {
    const target = jupiterChart.marks.find((m) => m.kind === 'target')!;
    expectSameDirection(jupiterChart.layout.fromChart(target.x, target.y), planetAltAz(harbour, Astronomy.Body.Jupiter, best.time), POSITION_TOL_DEG, 'Jupiter');
    expect(circleAt(jupiterChart.svg, target.x, target.y)).toBe(true);
    // The reader faces the target: it is on the chart's centre line.
    expectWithin(target.x, jupiterChart.width / 2, 0.5, 'target x');
  });

  it('puts the horizon and the skyline at the right height', () => {
    const az = jupiterChart.facing.azimuthDeg;
    // The mathematical horizon under the target: drawn 38 units above the scene's bottom (262).
    expectWithin(jupiterChart.layout.fromChart(195, 262 - 38).altitudeDeg, 0, 1e-6, 'horizon at the centre column');
    // Skyline of content/sites/harbour-roof.yaml: 17° at azimuth 75°, 14° at 110°, interpolated by hand.
    const expected = 17 + ((14 - 17) * (az - 75)) / 35;
    const d = /<path d="(M[^"]+)Z" fill="#1B1A14"/.exec(jupiterChart.svg)![1]!;
    const pts = [...d.matchAll(/[ML](-?[\d.]+) (-?[\d.]+)/g)].map((m) => ({ x: Number(m[1]), y: Number(m[2]) }));
    const under = pts.reduce((a, b) => (Math.abs(b.x - 195) < Math.abs(a.x - 195) ? b : a));
    expectWithin(jupiterChart.layout.fromChart(under.x, under.y).altitudeDeg, expected, 0.3, 'skyline under the target');
  });

  it('has east on the left facing south in the north, and on the right facing north in the south', () => {
    // Jupiter's transits from astronomy-engine SearchHourAngle: due south from 51° N, due north from 34° S (it is near +14° dec).
    for (const [site, facingSouth] of [[harbour, true], [southern, false]] as const) {
      const transit = Astronomy.SearchHourAngle(Astronomy.Body.Jupiter, site.observer, 0, new Date('2027-03-01T00:00:00Z'));
      const chart = horizonChart({ site, body: jupiter, time: transit.time.date });
      expect(angleDiffDeg(chart.facing.azimuthDeg, facingSouth ? 180 : 0)).toBeLessThan(0.5);
      const sides = chart.stars.map((s) => ({ s, place: starAltAz(site, chart.time, s.hip) }));
      const east = sides.filter((p) => p.place.azimuthDeg > 20 && p.place.azimuthDeg < 160);
      const west = sides.filter((p) => p.place.azimuthDeg > 200 && p.place.azimuthDeg < 340);
      expect(east.length + west.length).toBeGreaterThan(3);
      for (const p of east) expect(facingSouth ? p.s.x < 195 : p.s.x > 195, `star ${p.s.hip} east of the meridian`).toBe(true);
      for (const p of west) expect(facingSouth ? p.s.x > 195 : p.s.x < 195, `star ${p.s.hip} west of the meridian`).toBe(true);
      // Higher stars are higher on the chart: compare two stars at the target's azimuth ± 15°.
      const near = sides.filter((p) => angleDiffDeg(p.place.azimuthDeg, chart.facing.azimuthDeg) < 15).sort((a, b) => a.place.altitudeDeg - b.place.altitudeDeg);
      if (near.length >= 2) expect(near[near.length - 1]!.s.y).toBeLessThan(near[0]!.s.y);
    }
  });

  it('draws the comet tail away from the Sun (along the Sun–comet great circle, astronomy-engine Sun)', () => {
    expect(cometChart.tail).not.toBeNull();
    const t = cometChart.time;
    const sun = planetAltAz(southern, Astronomy.Body.Sun, t);
    const c = cometChart.target;
    // A point 1° beyond the comet on the great circle from the Sun: slerp in horizontal vectors.
    const v = (a: number, z: number): number[] => [Math.cos(a * Math.PI / 180) * Math.cos(z * Math.PI / 180), Math.cos(a * Math.PI / 180) * Math.sin(z * Math.PI / 180), Math.sin(a * Math.PI / 180)];
    const s = v(sun.altitudeDeg, sun.azimuthDeg);
    const k = v(c.altitudeDeg, c.azimuthDeg);
    const dot = s[0]! * k[0]! + s[1]! * k[1]! + s[2]! * k[2]!;
    const perp = k.map((ki, i) => s[i]! - dot * ki);
    const len = Math.hypot(...perp);
    const away = k.map((ki, i) => ki * Math.cos(Math.PI / 180) - (perp[i]! / len) * Math.sin(Math.PI / 180));
    const alt = Math.asin(away[2]!) * 180 / Math.PI;
    const az = (Math.atan2(away[1]!, away[0]!) * 180 / Math.PI + 360) % 360;
    const p0 = cometChart.layout.toChart(c.altitudeDeg, c.azimuthDeg)!;
    const p1 = cometChart.layout.toChart(alt, az)!;
    const expected = Math.atan2(p1.y - p0.y, p1.x - p0.x) * 180 / Math.PI;
    const actual = Math.atan2(cometChart.tail!.dy, cometChart.tail!.dx) * 180 / Math.PI;
    // The tail is the prolonged radius vector: parallax and the finite tail length allow ~1°.
    expect(angleDiffDeg(actual, expected)).toBeLessThan(2);
  });

  it('places each week-track dot at the same sidereal time (the stars stand as drawn)', () => {
    const dots = cometChart.marks.filter((m) => m.kind === 'track');
    expect(dots.length).toBeGreaterThan(0);
    const gmst0 = Astronomy.SiderealTime(cometChart.time);
    for (const d of dots) {
      const days = Number(d.id.split(':')[1]);
      const when = new Date(cometChart.time.getTime() + days * 86_164.0905 * 1000);
      expect(angleDiffDeg(Astronomy.SiderealTime(when) * 15, gmst0 * 15)).toBeLessThan(0.01);
    }
  });
});

describe('whole-sky chart', () => {
  it('has north at the top and east at the left, zenith at the centre', () => {
    const L = wholeSky.layout;
    const north = L.toChart(0, 0)!, east = L.toChart(0, 90)!, zenith = L.toChart(90, 0)!;
    expect(north.y).toBeLessThan(zenith.y);
    expect(east.x).toBeLessThan(zenith.x);
    // Named stars where astronomy-engine puts them.
    let n = 0;
    for (const s of wholeSky.stars) {
      const star = starByHip(s.hip)!;
      if (!star.name || star.vMag > 1.5) continue;
      expectSameDirection(L.fromChart(s.x, s.y), starAltAz(southern, wholeSky.time, s.hip), 0.1, star.name);
      n++;
    }
    expect(n).toBeGreaterThan(3);
  });
});

describe('images', () => {
  const charts = [jupiterChart, cometChart, wholeSky];

  it('every chart is well-formed SVG (resvg parses and renders it) within the 80 KB budget', () => {
    for (const c of charts) {
      expect(Buffer.byteLength(c.svg)).toBeLessThanOrEqual(CHART_BUDGET_BYTES);
      const img = new Resvg(c.svg, { fitTo: { mode: 'width', value: 390 }, font: { loadSystemFonts: false } }).render();
      expect(img.width).toBe(390);
    }
    // The check can fail: a malformed SVG is refused.
    expect(() => new Resvg('<svg xmlns="http://www.w3.org/2000/svg"><g></svg>')).toThrow();
  });

  it('keeps every label at least 12 CSS px when the chart is shown 390 px wide', () => {
    for (const c of charts) {
      const sizes = fontSizes(c.svg);
      expect(sizes.length).toBeGreaterThan(3);
      for (const s of sizes) expect(s * (390 / c.width)).toBeGreaterThanOrEqual(12);
    }
  });
});

describe('alt text', () => {
  it('says where to look with the computed direction, time, altitude and guide phrase', () => {
    const text = horizonAltText(jupiterChart);
    const expected = planetAltAz(harbour, Astronomy.Body.Jupiter, best.time);
    const clock = new Intl.DateTimeFormat('en-GB', { timeZone: 'Europe/London', hour: 'numeric', minute: '2-digit' }).format(best.time);
    expect(text.startsWith(`Looking ${compass(expected.azimuthDeg).word} at ${clock}: Jupiter ${Math.round(expected.altitudeDeg)}° up`)).toBe(true);
    expect(text).toContain(jupiterChart.guide!.phrase);
  });

  it('lists the bodies of the whole sky with their altitude and direction', () => {
    const text = wholeSkyAltText(wholeSky);
    const moon = planetAltAz(southern, Astronomy.Body.Moon, wholeSky.time);
    expect(text).toContain(`the Moon ${Math.round(moon.altitudeDeg)}° up in the ${compass(moon.azimuthDeg).word}`);
    expect(text).toContain('north at the top and east at the left');
  });
});

describe('cache', () => {
  const dir = mkdtempSync(join(tmpdir(), 'gloaming-charts-'));
  afterAll(() => rmSync(dir, { recursive: true, force: true }));

  it('draws a chart once and serves it from the cache afterwards, reporting progress', () => {
    const progress: number[] = [];
    let tick = 0;
    const cache = new ChartCache({ dir, codeVersion: 'test', onProgress: (p) => progress.push(p.count), clock: () => (tick += 5) });
    const request = { kind: 'horizon' as const, site: harbour, body: jupiter, time: best.time };
    const first = cache.get(request);
    const second = cache.get(request);
    expect(first.hit).toBe(false);
    expect(second.hit).toBe(true);
    expect(second.svg).toBe(first.svg);
    expect(second.alt).toBe(first.alt);
    expect(cache.rendered).toBe(1);
    expect(progress).toEqual([1, 2]);
    // A fresh cache object over the same folder also hits (a second build).
    const again = new ChartCache({ dir, codeVersion: 'test' }).get(request);
    expect(again.hit).toBe(true);
    const img = chartImg(first, { url: (f) => `/charts/${f}` });
    expect(img).toMatch(/^<img src="\/charts\/[0-9a-f]{32}\.svg" width="390" height="300" loading="lazy" decoding="async" alt="Looking /);
  });

  it('changes the key when any input changes', () => {
    const base = { kind: 'horizon' as const, site: harbour, body: jupiter, time: best.time };
    const k = chartKey(base, { codeVersion: 'a' });
    expect(chartKey(base, { codeVersion: 'b' })).not.toBe(k);
    expect(chartKey({ ...base, time: new Date(best.time.getTime() + 60_000) }, { codeVersion: 'a' })).not.toBe(k);
    expect(chartKey({ ...base, site: { ...harbour, sky: { bortle: 6 } } }, { codeVersion: 'a' })).not.toBe(k);
    expect(chartKey({ ...base, site: { ...harbour, horizon: [] } }, { codeVersion: 'a' })).not.toBe(k);
    expect(chartKey({ ...base, body: builtInBody('saturn') }, { codeVersion: 'a' })).not.toBe(k);
    expect(chartKey({ ...base, options: { fieldWidthDeg: 100 } }, { codeVersion: 'a' })).not.toBe(k);
    expect(chartKey({ ...base }, { codeVersion: 'a' })).toBe(k);
  });

  it('writes 1× and 2× rasters when asked (the 1× within the budget; see the README for why SVG is the default)', () => {
    const cache = new ChartCache({ dir: join(dir, 'raster'), codeVersion: 'test', raster: true });
    const c = cache.get({ kind: 'sky', site: southern, time: eveningMoment(southNight), body: comet });
    expect(c.files.png && c.files.png2x).toBeTruthy();
    expect(statSync(join(dir, 'raster', c.files.png!)).size).toBeLessThanOrEqual(CHART_BUDGET_BYTES);
    const img = chartImg(c, { url: (f) => f, raster: true });
    expect(img).toContain(`srcset="${c.files.png} 1x, ${c.files.png2x} 2x"`);
  });
});

