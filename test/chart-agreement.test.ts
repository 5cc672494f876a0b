/**
 * Charts agree with their words (issue #13): on every demo chart and on the charts of 200 seeded
 * generated site-nights (latitudes −60…70, all seasons, the Moon, every planet and the demo
 * comet), every star, pattern and body that the guide phrase or the alt text names is drawn and
 * labelled; pattern names sit by their figure, never on a star; no two labels overlap (the
 * title, compass points and scale included); a target higher than 70° gets a chart centred on
 * the zenith that contains it; altitude labels sit on the vertical through the target.
 *
 * These are consistency checks of the picture against the chart's own words (the positions in
 * the words are checked against astronomy-engine in test/patterns-guide.test.ts and
 * test/guide.test.ts); the boxes are the placer's estimates of the text extents.
 */
import { wordsFor } from '../lib/core/language/index.ts';
import { OVERHEAD_ALTITUDE_DEG, passWhere } from '../lib/models/satellite/words.ts';
import { bodyLabel, bodyPhrase, patternLabel } from '../lib/core/language/names/index.ts';
import { describe, expect, it } from 'vitest';
import { BUILT_IN_IDS, builtInBody, type Body } from '../lib/core/body.ts';
import { horizonAltText, horizonChart, wholeSkyAltText, wholeSkyChart, eveningMoment, type HorizonChart, type WholeSkyChart } from '../lib/outputs/chart/index.ts';
import { chartLabel, formatChartTime } from '../lib/outputs/chart/words.ts';
import { chartPassOf } from '../lib/outputs/chart/pass.ts';
import { compass } from '../lib/core/describe.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';
import { passNights, recommendedPasses } from '../lib/models/satellite/nights.ts';
import { FAINT_STAR_MAG } from '../lib/outputs/chart/style.ts';
import type { PlacedLabel } from '../lib/outputs/chart/svg.ts';
import { loadBodies, loadSites } from '../lib/models/content.ts';
import { computeNight } from '../lib/models/night.ts';
import { defineSite, type Site } from '../lib/core/site.ts';
import { addDays, isoWeekOf } from '../lib/core/time.ts';
import { seededRandom } from './helpers/random.ts';
import { starByHip } from '../lib/models/stars/catalogue.ts';
import { patternById } from '../lib/models/stars/patterns.ts';

const bodies = loadBodies('content/objects');
const demoSites = [...loadSites('content/sites').values()];
const TODAY = '2026-12-04';

function overlap(a: PlacedLabel, b: PlacedLabel): number {
  return Math.max(0, Math.min(a.x1, b.x1) - Math.max(a.x0, b.x0)) * Math.max(0, Math.min(a.y1, b.y1) - Math.max(a.y0, b.y0));
}

/** Every check of the issue on one chart; returns the names it checked. */
function checkChart(chart: HorizonChart | WholeSkyChart, what: string): string[] {
  const labels = chart.labels;
  const texts = labels.map((l) => l.text);
  const checked: string[] = [];
  const expectLabel = (name: string, role: PlacedLabel['role']): void => {
    expect(labels.some((l) => l.role === role && (l.text === name || l.text.startsWith(`${name} `))), `${what}: "${name}" (${role}) labelled; labels: ${texts.join(' | ')}`).toBe(true);
    checked.push(name);
  };
  // The target, and every star, pattern and body the guide phrase names.
  // Names in the chart's language (lib/core/language/names): "Luna", "Carro de la Osa Mayor"; star names are IAU names in every language.
  const language = wordsFor(chart.site.locale).language;
  const localName = (n: NonNullable<typeof chart.guide>['names'][number]): string =>
    n.kind === 'pattern' ? patternLabel(language, { ...n, sentenceName: n.name }) : n.kind === 'body' ? bodyLabel(language, n) : n.name;
  if (chart.body && chart.marks.some((m) => m.kind === 'target')) expectLabel(chartLabel(chart.body, chart.site), 'target');
  for (const name of chart.guide?.names ?? []) expectLabel(localName(name), name.kind === 'star' ? 'star' : name.kind === 'pattern' ? 'pattern' : 'body');
  // Every body the alt text names ("Also in view: …").
  const alt = chart.kind === 'horizon' ? horizonAltText(chart) : wholeSkyAltText(chart);
  for (const m of chart.marks) {
    if (m.kind !== 'moon' && m.kind !== 'planet') continue;
    expect(alt, what).toContain(m.kind === 'moon' ? bodyPhrase(language, { id: 'moon', name: m.label }).text : m.label);
    expectLabel(m.label, 'body');
  }
  // Where the Sun set, when the words measure from it.
  if (chart.guide?.horizon?.sun) expect(labels.some((l) => l.role === 'sun'), `${what}: the Sun's point`).toBe(true);
  // No two labels overlap; all lie inside the picture.
  for (let i = 0; i < labels.length; i++) {
    const a = labels[i]!;
    expect(a.x0 >= -1 && a.x1 <= chart.width + 1 && a.y0 >= -1, `${what}: "${a.text}" inside the chart`).toBe(true);
    for (let j = i + 1; j < labels.length; j++) {
      const b = labels[j]!;
      expect(overlap(a, b), `${what}: "${a.text}" and "${b.text}" overlap`).toBe(0);
    }
  }
  // A pattern's name sits by its figure and on none of its stars, the stars the words name, or any
  // star brighter than V 3 (fainter ones are avoided where there is room; lib/outputs/chart/svg.ts).
  const guidePattern = chart.guide?.pattern ? patternById(chart.guide.pattern.id) : null;
  const keep = new Set([...(guidePattern?.stars ?? []), ...(chart.guide?.names ?? []).flatMap((x) => (x.kind === 'star' ? [x.hip] : []))]);
  for (const l of labels.filter((x) => x.role === 'pattern')) {
    const onStar = chart.stars.find((s) => (keep.has(s.hip) || starByHip(s.hip)!.vMag <= FAINT_STAR_MAG) && s.x > l.x0 && s.x < l.x1 && s.y > l.y0 && s.y < l.y1);
    expect(onStar, `${what}: pattern name "${l.text}" on star HIP ${onStar?.hip}`).toBeUndefined();
    const figure = chart.stars.filter((s) => guidePattern?.stars.includes(s.hip));
    const distance = Math.min(...figure.map((s) => Math.hypot(Math.max(l.x0 - s.x, 0, s.x - l.x1), Math.max(l.y0 - s.y, 0, s.y - l.y1))));
    expect(distance, `${what}: pattern name "${l.text}" by its figure`).toBeLessThan(80);
  }
  if (chart.kind === 'horizon') {
    // A target above 70° gets the view centred on the zenith, with the target inside it.
    if (chart.target.altitudeDeg > 70) expect(chart.view, what).toBe('overhead');
    const t = chart.marks[0]!;
    expect(t.x > 0 && t.x < chart.width && t.y > 0 && t.y < 262, `${what}: target inside the scene`).toBe(true);
    // Altitude labels on the vertical through the target: within 45 units of where their circle crosses it.
    for (const l of labels.filter((x) => x.role === 'altitude')) {
      const deg = /^(\d+)°$/.exec(l.text)?.[1] ?? String(Number(/^(\d+) (fist|puño|Faust|Fäuste|poing)/.exec(l.text)![1]) * 10);
      const q = chart.layout.toChart(Number(deg), chart.facing.azimuthDeg)!;
      const dx = Math.max(l.x0 - q.x, 0, q.x - l.x1), dy = Math.max(l.y0 - q.y, 0, q.y - l.y1);
      expect(Math.hypot(dx, dy), `${what}: "${l.text}" beside its crossing`).toBeLessThan(12);
    }
  }
  return checked;
}

/** The horizon chart of `body` at its best time that night (or null when it has none), as the `::chart` placeholder draws it. */
function chartOfNight(site: Site, body: Body, date: string): HorizonChart | null {
  const night = computeNight(site, date, [body]);
  const best = night.bodies[0]!.visibility.best;
  if (!best) return null;
  return horizonChart({ site, body, time: best.time, options: { trackDays: [-3, -2, -1, 1, 2, 3] } });
}

describe('every demo chart labels what its words name, with no overlapping labels', () => {
  it('the weekly Jupiter charts of every demo site (8 weeks back, 4 ahead) and the comet one-off', () => {
    let charts = 0;
    const monday = isoWeekOf(TODAY).days[0]!;
    for (const site of demoSites) {
      for (let w = -8; w <= 4; w++) {
        const chart = chartOfNight(site, bodies.get('jupiter'), addDays(monday, 7 * w));
        if (chart) {
          checkChart(chart, `${site.id} jupiter ${addDays(monday, 7 * w)}`);
          charts++;
        }
      }
      const comet = chartOfNight(site, bodies.get('comet-lumen'), '2027-01-13');
      if (comet) {
        checkChart(comet, `${site.id} comet 2027-01-13`);
        charts++;
      }
      const night = computeNight(site, '2027-01-13', []);
      checkChart(wholeSkyChart({ site, time: eveningMoment(night), body: bodies.get('comet-lumen') }), `${site.id} whole sky 2027-01-13`);
    }
    expect(charts).toBeGreaterThan(30);
  });
});

describe('satellite pass charts mark the pass where its words put it', () => {
  it('every naked-eye pass of the demo week at every demo site: the ends labelled with their times, drawn at the alt-az the words give', () => {
    const satellites = loadSatellites('content/satellites');
    let charts = 0;
    for (const site of demoSites) {
      const monday = isoWeekOf(TODAY).days[0]!;
      for (const pass of recommendedPasses(passNights({ site, satellites, from: monday, to: addDays(monday, 6) }))) {
        const chart = wholeSkyChart({ site, time: pass.visible!.best.time, options: { pass: chartPassOf(pass) } });
        const what = `${site.id} ${pass.satellite.id} ${pass.visible!.start.time.toISOString()}`;
        checkChart(chart, what);
        const alt = wholeSkyAltText(chart);
        for (const [kind, point] of [['appears', pass.visible!.start], ['disappears', pass.visible!.end]] as const) {
          const mark = chart.marks.find((m) => m.id === `pass:${kind}`)!;
          expect(mark.labelled, `${what}: ${kind} labelled`).toBe(true);
          expect(mark.label, what).toContain(formatChartTime(point.time, site));
          // The place in the site's language (the English words: "appears at 21:40, 35° up in the west-northwest").
          const w = wordsFor(site.locale);
          expect(alt, what).toContain(`${formatChartTime(point.time, site)}, ${passWhere(w, point)}`);
          if (site.locale.startsWith('en') && point.altitudeDeg < OVERHEAD_ALTITUDE_DEG) expect(alt, what).toContain(`${kind} at ${formatChartTime(point.time, site)}, ${Math.round(point.altitudeDeg)}° up in the ${compass(point.azimuthDeg).word}`);
          // Where it is drawn: the projection of the pass's own alt-az (the track is interpolated between points 1/40 of the pass apart).
          const q = chart.layout.toChart(point.altitudeDeg, point.azimuthDeg)!;
          expect(Math.hypot(mark.x - q.x, mark.y - q.y), `${what}: ${kind} drawn at its place`).toBeLessThan(1.5);
        }
        charts++;
      }
    }
    expect(charts).toBeGreaterThan(40);
  });
});

describe('charts of 200 generated site-nights label what their words name, with no overlapping labels', () => {
  it('seeded: latitudes −60…70, all seasons, the Moon, every planet and the demo comet', () => {
    const random = seededRandom(13_2026);
    const ids = [...BUILT_IN_IDS.filter((id) => id !== 'sun'), 'comet-lumen'];
    const seen = { bodies: new Set<string>(), south: 0, north: 0, months: new Set<number>(), overhead: 0, kinds: new Set<string>(), names: 0 };
    let charts = 0;
    for (let i = 0; charts < 200 && i < 1200; i++) {
      const id = ids[i % ids.length]!;
      const latitude = -60 + random() * 130;
      const longitude = -180 + random() * 360;
      // The comet's apparition is late 2026 to early 2027; the others any day of 2026–2028.
      const start = id === 'comet-lumen' ? Date.UTC(2026, 10, 20) : Date.UTC(2026, 0, 1);
      const span = id === 'comet-lumen' ? 90 : 1095;
      const date = new Date(start + Math.floor(random() * span) * 86_400_000).toISOString().slice(0, 10);
      const horizon = random() < 0.4 ? [{ azimuth: 0, altitude: random() * 8 }, { azimuth: 120, altitude: random() * 15 }, { azimuth: 240, altitude: random() * 10 }] : [];
      const site = defineSite({ id: `gen-${i}`, name: `Generated site ${i}`, latitude, longitude, timeZone: 'UTC', zoneTolerance: 12, sky: { bortle: 1 + Math.floor(random() * 8) }, horizon, locale: random() < 0.5 ? 'en-GB' : 'en-US' });
      const body = id === 'comet-lumen' ? bodies.get(id) : builtInBody(id as (typeof BUILT_IN_IDS)[number]);
      const chart = chartOfNight(site, body, date);
      if (!chart) continue;
      seen.names += checkChart(chart, `${site.id} ${latitude.toFixed(1)},${longitude.toFixed(1)} ${id} ${date}`).length;
      if (i % 5 === 0) checkChart(wholeSkyChart({ site, time: chart.time, body }), `${site.id} whole sky ${id} ${date}`);
      charts++;
      seen.bodies.add(id);
      if (latitude < 0) seen.south++;
      else seen.north++;
      seen.months.add(Number(date.slice(5, 7)));
      if (chart.view === 'overhead') seen.overhead++;
      if (chart.guide) seen.kinds.add(chart.guide.kind);
    }
    expect(charts).toBe(200);
    expect([...seen.bodies].sort()).toEqual([...ids].sort());
    expect(seen.south).toBeGreaterThan(40);
    expect(seen.north).toBeGreaterThan(40);
    expect(seen.months.size).toBe(12);
    expect(seen.overhead).toBeGreaterThan(0);
    expect(seen.kinds.size).toBeGreaterThanOrEqual(4);
    expect(seen.names).toBeGreaterThan(400);
  }, 120_000);
});
