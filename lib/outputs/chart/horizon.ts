/**
 * The horizon-view finder chart: what a reader sees facing a target at one moment (usually its
 * best time), with the skyline, compass points, an altitude scale in degrees and fists, stars to
 * a limit that suits the site's sky, the guide pattern, the Moon and planets in the field, a
 * comet's tail direction and, optionally, the target's place on other nights of the week.
 *
 * Geometry: the sky is projected stereographically (lib/outputs/chart/projection.ts) about the point of
 * the horizon under the target (so the horizon is a straight line, as the reader sees it), drawn
 * 38 units above the bottom of the scene; for a target too high to fit, the centre is raised.
 * The field is `fieldWidthDeg` wide (default 90°; the height follows from the 390 × 262 scene:
 * about 51° above and 9° below the horizon) and is widened in 10° steps (to at most
 * `maxFieldWidthDeg`, default 140°) until the guide pattern's stars above the skyline fit.
 * Altitude circles bend upward toward the sides (at 45° to the side the 10° circle is drawn 17%
 * higher than in the middle); they are labelled at both edges.
 *
 * Positions: bodies from `observe` (topocentric, apparent, refracted); stars from `SkyAt`
 * (lib/outputs/chart/place.ts, refracted); both in the same horizontal frame.
 *
 * Week track: each other night's dot is the target's place at the moment when the stars stand
 * exactly as drawn, i.e. a whole number of sidereal days (23 h 56 min 4.09 s, IERS value of the
 * mean sidereal day) from the chart's moment, so the dots show its motion against the stars.
 */
import type { Body } from '../../core/body.ts';
import { BUILT_IN_IDS, builtInBody } from '../../core/body.ts';
import { compass, FIST_DEG } from '../../core/describe.ts';
import { GloamingError } from '../../core/errors.ts';
import { SIDEREAL_DAY_DAYS } from '../../core/geometry.ts';
import { observe, type Observation } from '../../core/observe.ts';
import { isSmallBody } from '../../models/orbit/body.ts';
import { tailInSky } from '../../models/orbit/tail.ts';
import { skylineAltitudeDeg, type Site } from '../../core/site.ts';
import { guideFor } from '../../models/guide.ts';
import type { GuideResult } from '../../models/stars/guide.ts';
import { patternById, type StarPattern } from '../../models/stars/patterns.ts';
import { starByHip } from '../../models/stars/catalogue.ts';
import { patternLabel, patternLinesMarkup, SkyAt } from './place.ts';
import { targetSymbol } from './target.ts';
import { brightLimbAngle, moonMarkup } from './moon.ts';
import { angleFromRadius, makeLayout, stereographicRadius, type AltAz, type ChartLayout } from './projection.ts';

export type { ChartLayout };
import { CHART_WIDTH, COLOURS, FAINT_STAR_MAG, FONT, chartMagnitudeLimit, starRadius } from './style.ts';
import { LabelPlacer, SVG_CLOSE, leaderLine, n, pathOf, svgOpen, text, type LabelRole, type PlacedLabel } from './svg.ts';
import { chartLabel, chartWords, formatChartDate, formatChartTime, formatMagnitude } from './words.ts';
import { patternLabel as patternName } from '../../core/language/names/index.ts';

/** Height of the sky-and-ground area, user units. */
const SCENE_HEIGHT = 262;
/** Height of the legend strip under the scene, user units. */
const LEGEND_HEIGHT = 38;
/** Height from the horizon at the centre column to the bottom of the scene, user units. */
const GROUND_HEIGHT = 38;
/** A target higher than this (degrees) gets a chart centred on the zenith (as does one above 40° whose guide does not fit facing the horizon). */
export const OVERHEAD_ALTITUDE_DEG = 70;

export interface HorizonChartOptions {
  /** Width of the field across the centre, degrees (default 90, at least 30). */
  fieldWidthDeg?: number;
  /** Largest width the field may be widened to so the guide pattern fits, degrees (default 140). */
  maxFieldWidthDeg?: number;
  /** Faintest star drawn, V magnitude (default: `chartMagnitudeLimit(site.sky)`). */
  magnitudeLimit?: number;
  /**
   * Other nights to show the target on: whole sidereal days from the chart's moment (e.g.
   * `[-3, -2, -1, 1, 2, 3]`), each drawn as a dated dot. Default: none.
   */
  trackDays?: readonly number[];
  /** Bodies drawn when in the field (default: the Moon and the planets). */
  otherBodies?: readonly Body[];
}

/** A body, star or track point drawn on a chart, with where it was drawn. */
export interface ChartMark {
  kind: 'target' | 'moon' | 'planet' | 'star' | 'track' | 'sun' | 'pass';
  /** Body id, `hip:<n>` for stars, `track:<offset>`, or `pass:appears` / `pass:disappears` for a satellite pass's ends. */
  id: string;
  label: string;
  altitudeDeg: number;
  azimuthDeg: number;
  /** Chart position, user units (x right, y down). */
  x: number;
  y: number;
  /** Whether the label found a place on the chart. */
  labelled: boolean;
}

export interface HorizonChart {
  kind: 'horizon';
  /** Facing the horizon below the target, or looking up with the zenith at the centre (a target above 70°). */
  view: 'horizon' | 'overhead';
  svg: string;
  width: number;
  height: number;
  site: Site;
  body: Body;
  time: Date;
  /** The target at the chart's moment. */
  target: Observation;
  /** The direction faced (the target's azimuth). */
  facing: { azimuthDeg: number; word: string; abbreviation: string };
  fieldWidthDeg: number;
  fieldHeightDeg: number;
  magnitudeLimit: number;
  guide: GuideResult | null;
  /** Bodies drawn (target first), labelled stars and track points. */
  marks: ChartMark[];
  /** Every label on the chart (title, compass points, scale, names) with its box, user units. */
  labels: PlacedLabel[];
  /** Every star drawn: Hipparcos number and chart position. */
  stars: { hip: number; x: number; y: number }[];
  /** Direction of the comet's tail on the chart (unit vector, y down), or null. */
  tail: { dx: number; dy: number } | null;
  layout: ChartLayout;
}


function checkOptions(options: HorizonChartOptions): void {
  const check = (value: number | undefined, field: string, min: number, max: number): void => {
    if (value !== undefined && !(Number.isFinite(value) && value >= min && value <= max)) {
      throw new GloamingError('invalid-value', `${field} is out of range`, { place: { field }, actual: value, expected: `a number from ${min} to ${max}` });
    }
  };
  check(options.fieldWidthDeg, 'fieldWidthDeg', 30, 160);
  check(options.maxFieldWidthDeg, 'maxFieldWidthDeg', 30, 160);
  check(options.magnitudeLimit, 'magnitudeLimit', -2, 6.5);
  for (const d of options.trackDays ?? []) check(d, 'trackDays', -14, 14);
}

/** Draws the horizon-view finder chart of `body` from `site` at `time` (see the module note). */
export function horizonChart(input: { site: Site; body: Body; time: Date; options?: HorizonChartOptions }): HorizonChart {
  const { site, body, time } = input;
  const options = input.options ?? {};
  checkOptions(options);
  if (body.kind === 'sun') {
    throw new GloamingError('invalid-value', 'a finder chart cannot point at the Sun', { place: { field: 'body' }, actual: body.id, expected: 'a body other than the Sun' });
  }
  const W = CHART_WIDTH;
  const H = SCENE_HEIGHT + LEGEND_HEIGHT;
  const target = observe(site, body, time);
  const sky = new SkyAt(site, time);
  const guide = guideFor({ site, body, time: target.time });
  const guidePat: StarPattern | null = guide?.pattern ? patternById(guide.pattern.id) : null;
  const magnitudeLimit = options.magnitudeLimit ?? chartMagnitudeLimit(site.sky);
  const azimuth0 = target.azimuthDeg;
  const otherBodies = options.otherBodies ?? BUILT_IN_IDS.filter((id) => id !== 'sun').map((id) => builtInBody(id));

  // What the chart must contain: the target, everything its guide phrase names (stars, bodies,
  // the pattern's stars above the skyline) and the point where the Sun set or will rise.
  const namedHips = new Set<number>();
  const namedBodies = new Set<string>();
  for (const name of guide?.names ?? []) {
    if (name.kind === 'star') namedHips.add(name.hip);
    if (name.kind === 'body') namedBodies.add(name.id);
  }
  const mustShow: AltAz[] = [{ altitudeDeg: target.altitudeDeg, azimuthDeg: target.azimuthDeg }];
  for (const hip of namedHips) mustShow.push(sky.star(starByHip(hip)!));
  for (const other of otherBodies) if (namedBodies.has(other.id)) mustShow.push(observe(site, other, time));
  if (guidePat) mustShow.push(...guidePat.stars.map((hip) => sky.star(starByHip(hip)!)).filter((p) => p.altitudeDeg > skylineAltitudeDeg(site, p.azimuthDeg)));
  const sunPoint = guide?.horizon?.sun ?? null;
  if (sunPoint) mustShow.push({ altitudeDeg: skylineAltitudeDeg(site, sunPoint.azimuthDeg), azimuthDeg: sunPoint.azimuthDeg });

  // Field: facing the target with the horizon along the bottom (widened until everything named
  // fits), or, for a target higher than OVERHEAD_ALTITUDE_DEG, centred on the zenith with the
  // target's horizon at the bottom (opened until everything named fits).
  const fits = (l: ChartLayout): boolean =>
    mustShow.every((p) => {
      const q = l.toChart(p.altitudeDeg, p.azimuthDeg);
      return q !== null && q.x > 14 && q.x < W - 14 && q.y > 26 && q.y < SCENE_HEIGHT - 6;
    });
  let fieldWidthDeg = options.fieldWidthDeg ?? 90;
  let fieldHeightDeg = 0;
  let layout!: ChartLayout;
  let overhead = target.altitudeDeg > OVERHEAD_ALTITUDE_DEG;
  if (!overhead) {
    const maxWidth = Math.max(options.maxFieldWidthDeg ?? 140, fieldWidthDeg);
    for (;;) {
      const scale = W / 2 / stereographicRadius(fieldWidthDeg / 2);
      const topDeg = angleFromRadius((SCENE_HEIGHT - GROUND_HEIGHT) / scale);
      // Centred on the horizon, so the horizon is a straight line; raised when the target would be within 8° of the top edge.
      const centreAlt = Math.max(0, target.altitudeDeg - (topDeg - 8));
      layout = makeLayout({ altitudeDeg: centreAlt, azimuthDeg: azimuth0 }, scale, W / 2, SCENE_HEIGHT - GROUND_HEIGHT);
      if (fits(layout) || fieldWidthDeg + 10 > maxWidth) break;
      fieldWidthDeg += 10;
    }
    // A high target whose guide reaches past the top of the view is shown looking up instead.
    overhead = !fits(layout) && target.altitudeDeg > 40;
    fieldHeightDeg = angleFromRadius((SCENE_HEIGHT - GROUND_HEIGHT) / layout.scale) + angleFromRadius(GROUND_HEIGHT / layout.scale);
  }
  if (overhead) {
    let halfHeightDeg = 40;
    for (;;) {
      layout = makeLayout({ altitudeDeg: 90, azimuthDeg: azimuth0 }, SCENE_HEIGHT / 2 / stereographicRadius(halfHeightDeg), W / 2, SCENE_HEIGHT / 2);
      if (fits(layout) || halfHeightDeg >= 88) break;
      halfHeightDeg += 4;
    }
    fieldHeightDeg = 2 * halfHeightDeg;
    fieldWidthDeg = 2 * angleFromRadius(W / 2 / layout.scale);
  }
  const scale = layout.scale;
  const inScene = (p: { x: number; y: number } | null, margin = 0): p is { x: number; y: number } =>
    p !== null && p.x >= -margin && p.x <= W + margin && p.y >= -margin && p.y <= SCENE_HEIGHT + margin;
  const aboveSkyline = (p: AltAz): boolean => p.altitudeDeg >= skylineAltitudeDeg(site, p.azimuthDeg) - 0.2;
  const placer = new LabelPlacer(W, SCENE_HEIGHT);
  const parts: string[] = [];
  const marks: ChartMark[] = [];
  const words = chartWords(site);
  const facing = compass(azimuth0, words);
  const clock = formatChartTime(time, site);
  const labelMarkup: string[] = [];

  // Heading (top left): the first label, so nothing overprints it.
  const facingShort = words.compass(azimuth0).abbreviation;
  const heading = overhead ? words.t('chart.heading-overhead', { clock, direction: facingShort }) : words.t('chart.heading', { clock, direction: facingShort, degrees: Math.round(azimuth0) });
  placer.fixed(6, 17, heading, FONT.label, { bold: true, role: 'title' });
  labelMarkup.push(text(6, 17, heading, { size: FONT.label, fill: COLOURS.text, weight: 'bold' }));

  // Sky.
  parts.push(`<rect width="${W}" height="${H}" fill="${COLOURS.sky}" stroke="none"/>`);

  // Altitude circles every fist (10°); their labels go on the vertical through the target (below).
  const grid: string[] = [];
  const azSpan = overhead ? 180 : 100;
  for (let alt = FIST_DEG; alt < 90; alt += FIST_DEG) {
    const pts: ({ x: number; y: number } | null)[] = [];
    for (let d = -azSpan; d <= azSpan; d += 2) {
      const q = layout.toChart(alt, azimuth0 + d);
      pts.push(inScene(q, 60) ? q : null);
    }
    const d = pathOf(pts);
    if (d) grid.push(d);
  }
  // The vertical through the target, from the skyline to the zenith: the altitude scale's axis.
  const axis: ({ x: number; y: number } | null)[] = [];
  for (let alt = Math.max(0, skylineAltitudeDeg(site, azimuth0)); alt <= 90; alt += 2) {
    const q = layout.toChart(alt, azimuth0);
    axis.push(inScene(q, 20) ? q : null);
  }
  if (grid.length) parts.push(`<path d="${grid.join('')}" fill="none" stroke="${COLOURS.grid}" stroke-width="0.8" stroke-dasharray="3 4" opacity="0.7"/>`);
  const axisPath = pathOf(axis);
  if (axisPath) parts.push(`<path d="${axisPath}" fill="none" stroke="${COLOURS.grid}" stroke-width="0.8" opacity="0.5"/>`);

  // Pattern lines: other patterns faint, the guide pattern bold; labels keep off the guide's lines.
  // Lines a little below the horizon still show a pattern that is rising; ends far off the scene are dropped.
  parts.push(
    ...patternLinesMarkup(
      sky,
      layout,
      guidePat,
      ({ a, b, qa, qb }) => a.altitudeDeg >= -2 && b.altitudeDeg >= -2 && inScene(qa, 150) && inScene(qb, 150) && (inScene(qa) || inScene(qb)),
      { guideWidth: 1.6, guideOpacity: 0.9 },
    ),
  );
  for (const [ha, hb] of guidePat?.lines ?? []) {
    const a = sky.star(starByHip(ha)!), b = sky.star(starByHip(hb)!);
    const qa = layout.toChart(a.altitudeDeg, a.azimuthDeg), qb = layout.toChart(b.altitudeDeg, b.azimuthDeg);
    if (qa && qb) placer.avoidLine(qa.x, qa.y, qb.x, qb.y);
  }

  // Stars: to the limit, plus every star of the guide pattern and every star the guide names.
  const drawn: HorizonChart['stars'] = [];
  const guideHips = new Set(guidePat?.stars ?? []);
  const extraHips = new Set([...guideHips, ...namedHips]);
  const placedStars = sky.stars(Math.max(magnitudeLimit, ...[...extraHips].map((h) => starByHip(h)!.vMag)), (p) => aboveSkyline(p));
  let starMarkup = '';
  for (const s of placedStars) {
    if (s.star.vMag > magnitudeLimit && !extraHips.has(s.star.hip)) continue;
    const q = layout.toChart(s.altitudeDeg, s.azimuthDeg);
    if (!inScene(q, 4)) continue;
    const r = starRadius(s.star.vMag);
    starMarkup += `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="${n(r)}"/>`;
    drawn.push({ hip: s.star.hip, x: Math.round(q.x * 10) / 10, y: Math.round(q.y * 10) / 10 });
    // Labels never sit on a bright star or one of the figure's or the guide's; they avoid faint ones where they can.
    placer.reserve(q.x - r - 0.5, q.y - r - 0.5, q.x + r + 0.5, q.y + r + 0.5, { soft: s.star.vMag > FAINT_STAR_MAG && !extraHips.has(s.star.hip) });
  }
  parts.push(`<g fill="${COLOURS.star}" stroke="none">${starMarkup}</g>`);

  // Ground: the skyline profile, filled down to the bottom of the scene.
  const skylinePts: { x: number; y: number; az: number }[] = [];
  const halfSpan = overhead ? 180 : Math.min(179, fieldWidthDeg / 2 + 40);
  for (let d = -halfSpan; d <= halfSpan; d += 1) {
    const az = azimuth0 + d;
    const q = layout.toChart(skylineAltitudeDeg(site, az), az);
    if (q) skylinePts.push({ ...q, az });
  }
  const groundVisible = !overhead && skylinePts.some((p) => p.y < SCENE_HEIGHT && p.x > 0 && p.x < W);
  if (groundVisible && skylinePts.length > 1) {
    const first = skylinePts[0]!;
    const last = skylinePts[skylinePts.length - 1]!;
    const clampY = (y: number): number => Math.min(y, SCENE_HEIGHT + 400);
    const edge = pathOf(skylinePts.map((p) => ({ x: p.x, y: clampY(p.y) })));
    parts.push(`<path d="${edge}L${n(last.x)} ${SCENE_HEIGHT + 400}L${n(first.x)} ${SCENE_HEIGHT + 400}Z" fill="${COLOURS.ground}" stroke="${COLOURS.groundEdge}" stroke-width="1.5"/>`);
  }

  // Compass points: along the skyline facing the horizon; at the scene's edge, where each
  // direction's vertical leaves it, when looking up.
  for (let i = 0; i < 16; i++) {
    const az = i * 22.5;
    const label = words.compass(az).abbreviation;
    const main = i % 2 === 0;
    const size = main ? FONT.compass : FONT.small;
    const style = { size, fill: COLOURS.compass, anchor: 'middle' as const, halo: overhead ? COLOURS.sky : COLOURS.ground, ...(label === facingShort ? { weight: 'bold' as const } : {}) };
    if (overhead) {
      if (!main) continue;
      const q = layout.toChart(0, az);
      if (!q) continue;
      const dx = q.x - W / 2, dy = q.y - SCENE_HEIGHT / 2;
      const t = Math.min((W / 2 - 14) / Math.max(Math.abs(dx), 1e-9), (SCENE_HEIGHT / 2 - 12) / Math.max(Math.abs(dy), 1e-9), 1);
      const lx = W / 2 + dx * t, ly = SCENE_HEIGHT / 2 + dy * t + 5;
      if (placer.fixed(lx, ly, label, size, { anchor: 'middle', bold: label === facingShort, role: 'compass' })) labelMarkup.push(text(lx, ly, label, style));
      continue;
    }
    const delta = ((az - azimuth0 + 540) % 360) - 180;
    if (Math.abs(delta) > halfSpan) continue;
    const q = layout.toChart(skylineAltitudeDeg(site, az), az);
    if (!q || q.x < 8 || q.x > W - 8 || q.y > SCENE_HEIGHT - 4) continue;
    parts.push(`<path d="M${n(q.x)} ${n(q.y)}v${main ? 7 : 4}" stroke="${COLOURS.compass}" stroke-width="1.5"/>`);
    const ly = Math.min(q.y + 22, SCENE_HEIGHT - 4);
    if (placer.fixed(q.x, ly, label, size, { anchor: 'middle', bold: label === facingShort, role: 'compass' })) labelMarkup.push(text(q.x, ly, label, style));
  }
  // The ground, in 10-unit columns that follow the skyline: labels stay in the sky.
  if (groundVisible) {
    for (let x0 = 0; x0 < W; x0 += 10) {
      const column = skylinePts.filter((p) => p.x >= x0 - 2 && p.x <= x0 + 12).map((p) => p.y);
      if (column.length) placer.reserve(x0, Math.min(...column) + 1, x0 + 10, SCENE_HEIGHT);
    }
  }

  // Bodies: the Moon and planets in the field, then the target (drawn last, on top).
  const bodyMarkup: string[] = [];
  const labelQueue: { x: number; y: number; text: string; size: number; gap: number; fill: string; mark: ChartMark; force: boolean; weight?: 'bold'; role: LabelRole }[] = [];
  for (const other of otherBodies) {
    if (other.id === body.id || other.kind === 'sun') continue;
    const o = observe(site, other, time);
    const q = layout.toChart(o.altitudeDeg, o.azimuthDeg);
    if (!inScene(q) || !aboveSkyline(o)) continue;
    const isMoon = other.kind === 'moon';
    const mark: ChartMark = { kind: isMoon ? 'moon' : 'planet', id: other.id, label: chartLabel(other, site), altitudeDeg: o.altitudeDeg, azimuthDeg: o.azimuthDeg, x: q.x, y: q.y, labelled: false };
    const r = isMoon ? Math.max(6, o.semidiameterDeg * scale * (Math.PI / 180) * 2) : 3.2;
    if (isMoon) {
      const sun = observe(site, builtInBody('sun'), time);
      bodyMarkup.push(moonMarkup(q.x, q.y, r, o.illuminatedFraction, brightLimbAngle(layout, o, sun)));
    } else {
      // Planets: a small filled square, so they differ from stars by shape as well as colour.
      bodyMarkup.push(`<rect x="${n(q.x - 3.2)}" y="${n(q.y - 3.2)}" width="6.4" height="6.4" fill="${COLOURS.planet}" stroke="${COLOURS.sky}" stroke-width="1" transform="rotate(45 ${n(q.x)} ${n(q.y)})"/>`);
    }
    // Bodies the guide names are labelled right after the target.
    const item = { x: q.x, y: q.y, text: mark.label, size: FONT.label, gap: isMoon ? r : 5, fill: isMoon ? COLOURS.moon : COLOURS.planet, mark, force: true, role: 'body' as const };
    if (namedBodies.has(other.id)) labelQueue.unshift(item);
    else labelQueue.push(item);
    marks.push(mark);
    const rr = isMoon ? r + 1 : 5;
    placer.reserve(q.x - rr, q.y - rr, q.x + rr, q.y + rr);
  }

  // Where the Sun set or will rise, when the guide phrase measures from it.
  if (sunPoint) {
    const alt = skylineAltitudeDeg(site, sunPoint.azimuthDeg);
    const q = layout.toChart(alt, sunPoint.azimuthDeg);
    if (inScene(q)) {
      parts.push(`<path d="M${n(q.x - 7)} ${n(q.y)}A7 7 0 0 1 ${n(q.x + 7)} ${n(q.y)}Z" fill="${COLOURS.sun}" stroke="none"/>`);
      placer.reserve(q.x - 8, q.y - 8, q.x + 8, q.y + 1);
      const mark: ChartMark = { kind: 'sun', id: 'sun', label: words.t(sunPoint.event === 'set' ? 'chart.sun-set-here' : 'chart.sun-rises-here'), altitudeDeg: alt, azimuthDeg: sunPoint.azimuthDeg, x: q.x, y: q.y, labelled: false };
      marks.push(mark);
      labelQueue.push({ x: q.x, y: q.y - 4, text: mark.label, size: FONT.small, gap: 5, fill: COLOURS.sun, mark, force: true, role: 'sun' });
    }
  }

  // Week track: the target at the same sidereal moment on other nights.
  const trackMarkup: string[] = [];
  for (const days of [...(options.trackDays ?? [])].filter((d) => d !== 0).sort((a, b) => a - b)) {
    const when = new Date(time.getTime() + days * SIDEREAL_DAY_DAYS * 86_400_000);
    const o = observe(site, body, when);
    const q = layout.toChart(o.altitudeDeg, o.azimuthDeg);
    if (!inScene(q)) continue;
    const label = formatChartDate(when, site);
    const mark: ChartMark = { kind: 'track', id: `track:${days}`, label, altitudeDeg: o.altitudeDeg, azimuthDeg: o.azimuthDeg, x: q.x, y: q.y, labelled: false };
    // The first night's dot is hollow, so the direction of motion reads without dates.
    trackMarkup.push(trackMarkup.length === 0 ? `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="2.4" fill="${COLOURS.sky}" stroke="${COLOURS.track}" stroke-width="1.4"/>` : `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="2.6"/>`);
    labelQueue.push({ x: q.x, y: q.y, text: label, size: FONT.small, gap: 3, fill: COLOURS.track, mark, force: false, role: 'track' });
    marks.push(mark);
  }
  parts.push(...bodyMarkup);

  // Target: a ring with a dot; a comet gets a short indicative tail (anti-solar direction).
  const tq = layout.toChart(target.altitudeDeg, target.azimuthDeg) ?? { x: W / 2, y: SCENE_HEIGHT / 2 };
  let tail: HorizonChart['tail'] = null;
  if (body.kind === 'comet' && isSmallBody(body)) {
    const { head, tip } = tailInSky(site, body, target.time, { lengthAu: 0.05 });
    const qa = layout.toChart(head.altitudeDeg, head.azimuthDeg);
    const qb = layout.toChart(tip.altitudeDeg, tip.azimuthDeg);
    if (qa && qb) {
      const len = Math.hypot(qb.x - qa.x, qb.y - qa.y);
      if (len > 1e-9) {
        tail = { dx: (qb.x - qa.x) / len, dy: (qb.y - qa.y) / len };
        const L = 34;
        const px = -tail.dy, py = tail.dx;
        const ex = tq.x + tail.dx * L, ey = tq.y + tail.dy * L;
        parts.push(
          `<path d="M${n(tq.x + px * 2.2)} ${n(tq.y + py * 2.2)}L${n(ex + px * 6)} ${n(ey + py * 6)}L${n(ex - px * 6)} ${n(ey - py * 6)}L${n(tq.x - px * 2.2)} ${n(tq.y - py * 2.2)}Z" fill="${COLOURS.tail}" stroke="none" opacity="0.75"/>`,
        );
        placer.reserve(Math.min(tq.x, ex) - 6, Math.min(tq.y, ey) - 6, Math.max(tq.x, ex) + 6, Math.max(tq.y, ey) + 6);
      }
    }
  }
  // The track shows only when it spreads beyond the target's ring.
  const trackMarks = marks.filter((m) => m.kind === 'track');
  const trackShown = trackMarks.some((m) => Math.hypot(m.x - tq.x, m.y - tq.y) > 10);
  if (trackShown) parts.push(`<g fill="${COLOURS.track}" stroke="${COLOURS.sky}" stroke-width="0.8">${trackMarkup.join('')}</g>`);
  const symbol = targetSymbol(layout, target, body, tq, 8, 2.6);
  parts.push(symbol.markup);
  placer.reserve(tq.x - 9, tq.y - 9, tq.x + 9, tq.y + 9);
  const targetMark: ChartMark = { kind: 'target', id: body.id, label: words.t('chart.target-mag', { name: chartLabel(body, site), value: formatMagnitude(target.magnitude.value, site) }), altitudeDeg: target.altitudeDeg, azimuthDeg: target.azimuthDeg, x: tq.x, y: tq.y, labelled: false };
  marks.unshift(targetMark);
  labelQueue.unshift({ x: tq.x, y: tq.y, text: targetMark.label, size: FONT.target, gap: Math.max(9, Math.min(symbol.radius + 1, 60)), fill: COLOURS.target, mark: targetMark, force: true, weight: 'bold', role: 'target' });

  // Labels, most important first: target, the bodies and stars the guide names, the Sun's point,
  // other bodies, the altitude scale, the guide pattern's name, other star names, track dates.
  const placeLabel = (l: (typeof labelQueue)[number]): void => {
    // A long forced label (the target's) may break at ' · ' into two lines when one line finds no free spot.
    const split = l.text.split(' · ');
    const twoLines = l.force && split.length === 2;
    let lines = [l.text];
    let spot = placer.place(l.x, l.y, [l.text], l.size, l.gap, { force: l.force && !twoLines, bold: l.weight === 'bold', role: l.role });
    if (!spot && twoLines) {
      lines = split;
      spot = placer.place(l.x, l.y, lines, l.size, l.gap, { force: true, bold: l.weight === 'bold', role: l.role });
    }
    if (!spot) return;
    l.mark.labelled = true;
    labelMarkup.push(leaderLine(l.x, l.y, l.gap, spot.box, l.fill));
    labelMarkup.push(text(spot.x, spot.y, lines, { size: l.size, fill: l.fill, anchor: spot.anchor, ...(l.weight ? { weight: l.weight } : {}) }));
  };
  const starItem = (s: (typeof placedStars)[number], force: boolean): (typeof labelQueue)[number] | null => {
    const q = layout.toChart(s.altitudeDeg, s.azimuthDeg);
    if (!inScene(q)) return null;
    const mark: ChartMark = { kind: 'star', id: `hip:${s.star.hip}`, label: s.star.name, altitudeDeg: s.altitudeDeg, azimuthDeg: s.azimuthDeg, x: q.x, y: q.y, labelled: false };
    marks.push(mark);
    return { x: q.x, y: q.y, text: s.star.name, size: FONT.label, gap: starRadius(s.star.vMag) + 1, fill: COLOURS.text, mark, force, role: 'star' };
  };
  const trackQueue = labelQueue.filter((l) => l.mark.kind === 'track');
  const nonTrack = labelQueue.filter((l) => l.mark.kind !== 'track');
  const namedBodyCount = 1 + nonTrack.slice(1).filter((l) => l.mark.kind !== 'sun' && namedBodies.has(l.mark.id)).length;
  for (const l of nonTrack.slice(0, namedBodyCount)) placeLabel(l);
  for (const s of placedStars) {
    if (!namedHips.has(s.star.hip)) continue;
    const item = starItem(s, true);
    if (item) placeLabel(item);
  }
  for (const l of nonTrack.slice(namedBodyCount)) placeLabel(l);

  // The altitude scale, on the vertical through the target: degrees to its left, fists to its right.
  for (let alt = FIST_DEG; alt < 90; alt += FIST_DEG) {
    const q = layout.toChart(alt, azimuth0);
    if (!inScene(q) || q.y < 24 || q.y > SCENE_HEIGHT - 8 || alt < skylineAltitudeDeg(site, azimuth0)) continue;
    const f = alt / FIST_DEG;
    const deg = `${alt}°`;
    const fistWords = words.t('chart.fists', { count: f });
    if (placer.fixed(q.x - 4, q.y - 3, deg, FONT.small, { anchor: 'end', role: 'altitude', avoidMarks: true })) labelMarkup.push(text(q.x - 4, q.y - 3, deg, { size: FONT.small, fill: COLOURS.dimText, anchor: 'end' }));
    if (placer.fixed(q.x + 4, q.y - 3, fistWords, FONT.small, { role: 'altitude', avoidMarks: true })) labelMarkup.push(text(q.x + 4, q.y - 3, fistWords, { size: FONT.small, fill: COLOURS.dimText }));
  }

  // The guide pattern's name, by its figure (centred on it when there is room), never on a star.
  if (guidePat) {
    const pts = guidePat.stars
      .map((hip) => sky.star(starByHip(hip)!))
      .filter((p) => aboveSkyline(p))
      .map((p) => layout.toChart(p.altitudeDeg, p.azimuthDeg))
      .filter((q): q is { x: number; y: number } => inScene(q));
    if (pts.length) {
      labelMarkup.push(patternLabel(placer, patternName(words.language, guidePat), pts));
    }
  }
  // Other named stars: the guide pattern's bright stars, the nearest named star, and any star of V ≤ 1 in view.
  for (const s of placedStars) {
    if (namedHips.has(s.star.hip) || !s.star.name) continue;
    if (!((guideHips.has(s.star.hip) && s.star.vMag <= 3.5) || s.star.hip === guide?.nearestStar?.hip || s.star.vMag <= 1)) continue;
    const item = starItem(s, false);
    if (item) placeLabel(item);
  }
  // Track dates: the first and last night only (dots a few units apart cannot all carry a date).
  const trackLabels = trackShown ? [trackQueue[0], trackQueue[trackQueue.length - 1]].filter((l, i, a): l is NonNullable<typeof l> => l !== undefined && a.indexOf(l) === i) : [];
  for (const l of trackLabels) placeLabel(l);
  parts.push(...labelMarkup);

  // Legend strip.
  parts.push(`<rect y="${SCENE_HEIGHT}" width="${W}" height="${LEGEND_HEIGHT}" fill="${COLOURS.skyEdge}" stroke="none"/>`);
  const mag = words.number(magnitudeLimit, 1);
  const legend1 = words.t(overhead ? 'chart.legend-overhead' : 'chart.legend-horizon', { mag });
  const firstTrack = trackMarks[0];
  const lastTrack = trackMarks[trackMarks.length - 1];
  const legend2 = trackShown && firstTrack && lastTrack
    ? words.t('chart.legend-track', { first: firstTrack.label, last: lastTrack.label })
    : trackMarkup.length
      ? words.t('chart.legend-still', { name: chartLabel(body, site) })
      : site.name;
  parts.push(text(6, SCENE_HEIGHT + 15, legend1, { size: FONT.small, fill: COLOURS.dimText, halo: COLOURS.skyEdge }));
  parts.push(text(6, SCENE_HEIGHT + 31, legend2, { size: FONT.small, fill: trackShown ? COLOURS.track : COLOURS.dimText, halo: COLOURS.skyEdge }));

  const title = words.t('chart.title', { name: chartLabel(body, site), site: site.name, clock });
  const svg = svgOpen(W, H, title) + parts.join('') + SVG_CLOSE;
  return {
    kind: 'horizon',
    view: overhead ? 'overhead' : 'horizon',
    svg,
    width: W,
    height: H,
    site,
    body,
    time,
    target,
    facing: { azimuthDeg: azimuth0, word: facing.word, abbreviation: facing.abbreviation },
    fieldWidthDeg,
    fieldHeightDeg,
    magnitudeLimit,
    guide,
    marks,
    labels: placer.labels,
    stars: drawn,
    tail,
    layout,
  };
}
