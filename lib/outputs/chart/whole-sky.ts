/**
 * The whole-sky chart: the sky of one site at one moment as a disc, zenith at the centre, the
 * horizon at the rim, north at the top and east at the left (as seen lying on one's back with the
 * head to the south, or holding the chart overhead). It shows the skyline profile, bright stars,
 * every pattern above the horizon (the target's guide pattern emphasised), the Moon, the planets
 * and the target.
 *
 * Projection: stereographic centred on the zenith (lib/outputs/chart/projection.ts), oriented as if
 * facing south with the head tilted back, so north comes out at the top and east at the left;
 * the horizon lies at ρ = 2 (Snyder 1987, eq. 21-1). Conformal: patterns keep their shape even
 * low in the sky.
 *
 * The moment: any instant; `eveningMoment` gives the usual choice, the end of nautical twilight.
 */
import type { Body } from '../../core/body.ts';
import { BUILT_IN_IDS, builtInBody } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import type { NightReport } from '../../models/night.ts';
import { observe, type Observation } from '../../core/observe.ts';
import { skylineAltitudeDeg, type Site } from '../../core/site.ts';
import { starByHip } from '../../models/stars/catalogue.ts';
import { guideFor } from '../../models/guide.ts';
import type { GuideResult } from '../../models/stars/guide.ts';
import { patternById, type StarPattern } from '../../models/stars/patterns.ts';
import { targetSymbol } from './target.ts';
import { zonedTime } from '../../core/time.ts';
import type { ChartMark } from './horizon.ts';
import { drawPass, type ChartPass } from './pass.ts';
import { patternLabel, patternLinesMarkup, SkyAt } from './place.ts';
import { brightLimbAngle, moonMarkup } from './moon.ts';
import { makeLayout, type ChartLayout } from './projection.ts';
import { CHART_WIDTH, COLOURS, FAINT_STAR_MAG, FONT, chartMagnitudeLimit, starRadius } from './style.ts';
import { LabelPlacer, SVG_CLOSE, leaderLine, n, pathOf, svgOpen, text, type PlacedLabel } from './svg.ts';
import { chartLabel, chartWords, formatChartTime, formatMagnitude } from './words.ts';
import { patternLabel as patternName } from '../../core/language/names/index.ts';

/** Radius of the horizon circle, user units. */
const RADIUS = 170;
const DISC_HEIGHT = CHART_WIDTH;
const LEGEND_HEIGHT = 36;
/** Brightest-star cap on a whole-sky chart: it covers 2π sr on a phone screen, so stars stop at V 4.5. */
const SKY_FAINTEST = 4.5;

export interface WholeSkyChartOptions {
  /** Faintest star drawn, V magnitude (default: `chartMagnitudeLimit(site.sky)`, at most 4.5). */
  magnitudeLimit?: number;
  /** Bodies drawn when above the horizon (default: the Moon and the planets). */
  otherBodies?: readonly Body[];
  /** A satellite pass to draw: its track, where it appears and disappears, the way it moves (`pass.ts`). */
  pass?: ChartPass;
}

export interface WholeSkyChart {
  kind: 'sky';
  svg: string;
  width: number;
  height: number;
  site: Site;
  /** The highlighted target, if any. */
  body: Body | null;
  /** The satellite pass drawn, if any. */
  pass: ChartPass | null;
  time: Date;
  target: Observation | null;
  guide: GuideResult | null;
  magnitudeLimit: number;
  /** Bodies above the horizon (target first) and labelled stars. */
  marks: ChartMark[];
  /** Every label on the chart with its box, user units. */
  labels: PlacedLabel[];
  stars: { hip: number; x: number; y: number }[];
  layout: ChartLayout;
}

/**
 * The evening moment for a whole-sky chart of a night: the end of nautical twilight (Sun 12°
 * below the horizon), or, when the Sun does not go that low, the end of civil twilight, or
 * sunset, or else 21:00 local time.
 */
export function eveningMoment(report: NightReport): Date {
  return report.sun.nauticalDusk.time ?? report.sun.civilDusk.time ?? report.sun.set.time ?? zonedTime(report.night.date, 21, 0, report.night.timeZone);
}

/** Draws the whole-sky chart of `site` at `time`, with `body` (optional) highlighted. */
export function wholeSkyChart(input: { site: Site; time: Date; body?: Body; options?: WholeSkyChartOptions }): WholeSkyChart {
  const { site, time } = input;
  const body = input.body ?? null;
  const options = input.options ?? {};
  if (options.magnitudeLimit !== undefined && !(Number.isFinite(options.magnitudeLimit) && options.magnitudeLimit >= -2 && options.magnitudeLimit <= 6.5)) {
    throw new GloamingError('invalid-value', 'magnitudeLimit is out of range', { place: { field: 'magnitudeLimit' }, actual: options.magnitudeLimit, expected: 'a number from -2 to 6.5' });
  }
  if (body?.kind === 'sun') {
    throw new GloamingError('invalid-value', 'a chart cannot point at the Sun', { place: { field: 'body' }, actual: body.id, expected: 'a body other than the Sun' });
  }
  const W = CHART_WIDTH;
  const H = DISC_HEIGHT + LEGEND_HEIGHT;
  const cx = W / 2;
  const cy = DISC_HEIGHT / 2;
  const scale = RADIUS / 2;
  // Centre at the zenith, "facing" south: north comes out at the top, east at the left.
  const layout = makeLayout({ altitudeDeg: 90, azimuthDeg: 180 }, scale, cx, cy);
  const sky = new SkyAt(site, time);
  const magnitudeLimit = options.magnitudeLimit ?? Math.min(SKY_FAINTEST, chartMagnitudeLimit(site.sky));
  const target = body ? observe(site, body, time) : null;
  const guide = target && body ? guideFor({ site, body, time: target.time }) : null;
  const guidePat: StarPattern | null = guide?.pattern ? patternById(guide.pattern.id) : null;
  const placer = new LabelPlacer(W, DISC_HEIGHT);
  const namedHips = new Set<number>();
  const namedBodies = new Set<string>();
  for (const name of guide?.names ?? []) {
    if (name.kind === 'star') namedHips.add(name.hip);
    if (name.kind === 'body') namedBodies.add(name.id);
  }
  const guideHips = new Set(guidePat?.stars ?? []);
  const clock = formatChartTime(time, site);
  placer.fixed(6, 17, clock, FONT.label, { bold: true, role: 'title' });
  const parts: string[] = [];
  const marks: ChartMark[] = [];
  const up = (alt: number): boolean => alt > 0;
  const visible = (p: { altitudeDeg: number; azimuthDeg: number }): boolean => p.altitudeDeg > Math.max(0, skylineAltitudeDeg(site, p.azimuthDeg));

  parts.push(`<rect width="${W}" height="${H}" fill="${COLOURS.skyEdge}" stroke="none"/>`);
  parts.push(`<circle cx="${cx}" cy="${cy}" r="${RADIUS}" fill="${COLOURS.sky}" stroke="none"/>`);
  // Altitude circles at 30° and 60°.
  for (const alt of [30, 60]) {
    const r = scale * 2 * Math.tan(((90 - alt) * Math.PI) / 360);
    parts.push(`<circle cx="${cx}" cy="${cy}" r="${n(r)}" fill="none" stroke="${COLOURS.grid}" stroke-width="0.8" stroke-dasharray="3 4" opacity="0.7"/>`);
  }

  // Pattern lines: every pattern with both ends above the horizon; the guide pattern emphasised.
  parts.push(...patternLinesMarkup(sky, layout, guidePat, ({ a, b }) => up(a.altitudeDeg) && up(b.altitudeDeg), { guideWidth: 1.6 }));
  for (const [ha, hb] of guidePat?.lines ?? []) {
    const a = sky.star(starByHip(ha)!), b = sky.star(starByHip(hb)!);
    if (!up(a.altitudeDeg) || !up(b.altitudeDeg)) continue;
    const qa = layout.toChart(a.altitudeDeg, a.azimuthDeg)!, qb = layout.toChart(b.altitudeDeg, b.azimuthDeg)!;
    placer.avoidLine(qa.x, qa.y, qb.x, qb.y);
  }

  // Stars: to the limit, and every star the guide names.
  const faintestNamed = Math.max(magnitudeLimit, ...[...namedHips].map((h) => starByHip(h)!.vMag));
  const placed = sky.stars(faintestNamed, visible).filter((s) => s.star.vMag <= magnitudeLimit || namedHips.has(s.star.hip));
  const drawn: WholeSkyChart['stars'] = [];
  let starMarkup = '';
  for (const s of placed) {
    const q = layout.toChart(s.altitudeDeg, s.azimuthDeg)!;
    const r = starRadius(s.star.vMag) * 0.85;
    starMarkup += `<circle cx="${n(q.x)}" cy="${n(q.y)}" r="${n(r)}"/>`;
    drawn.push({ hip: s.star.hip, x: Math.round(q.x * 10) / 10, y: Math.round(q.y * 10) / 10 });
    // Labels never sit on a bright star or one of the guide's; they avoid faint ones where they can.
    placer.reserve(q.x - r - 0.5, q.y - r - 0.5, q.x + r + 0.5, q.y + r + 0.5, { soft: s.star.vMag > FAINT_STAR_MAG && !namedHips.has(s.star.hip) && !guideHips.has(s.star.hip) });
  }
  parts.push(`<g fill="${COLOURS.star}" stroke="none">${starMarkup}</g>`);

  // Skyline: the band between the horizon circle and the profile.
  const profile: { x: number; y: number }[] = [];
  for (let az = 0; az <= 360; az += 2) profile.push(layout.toChart(Math.max(0, skylineAltitudeDeg(site, az)), az)!);
  const rim: { x: number; y: number }[] = [];
  for (let az = 360; az >= 0; az -= 2) rim.push(layout.toChart(0, az)!);
  parts.push(`<path d="${pathOf(profile)}${pathOf(rim).replace(/^M/, 'L')}Z" fill="${COLOURS.ground}" stroke="${COLOURS.groundEdge}" stroke-width="1" fill-rule="evenodd"/>`);
  parts.push(`<circle cx="${cx}" cy="${cy}" r="${RADIUS}" fill="none" stroke="${COLOURS.groundEdge}" stroke-width="1.5"/>`);

  // Compass letters outside the rim.
  for (const az of [0, 90, 180, 270]) {
    const label = chartWords(site).compass(az).abbreviation;
    const q = layout.toChart(0, az)!;
    const dx = (q.x - cx) / RADIUS;
    const dy = (q.y - cy) / RADIUS;
    const lx = cx + dx * (RADIUS + 11), ly = cy + dy * (RADIUS + 11) + 5;
    placer.fixed(lx, ly, label, FONT.compass, { anchor: 'middle', bold: true, role: 'compass' });
    parts.push(text(lx, ly, label, { size: FONT.compass, fill: COLOURS.compass, anchor: 'middle', weight: 'bold', halo: COLOURS.skyEdge }));
  }

  // Bodies.
  const labels: { x: number; y: number; text: string; lines?: string[]; fill: string; gap: number; mark: ChartMark; bold?: boolean; role: 'target' | 'body' | 'star' | 'sun' | 'track' }[] = [];
  for (const other of options.otherBodies ?? BUILT_IN_IDS.filter((id) => id !== 'sun').map((id) => builtInBody(id))) {
    if (other.id === body?.id || other.kind === 'sun') continue;
    const o = observe(site, other, time);
    if (!visible(o)) continue;
    const q = layout.toChart(o.altitudeDeg, o.azimuthDeg)!;
    const isMoon = other.kind === 'moon';
    const mark: ChartMark = { kind: isMoon ? 'moon' : 'planet', id: other.id, label: chartLabel(other, site), altitudeDeg: o.altitudeDeg, azimuthDeg: o.azimuthDeg, x: q.x, y: q.y, labelled: false };
    marks.push(mark);
    if (isMoon) parts.push(moonMarkup(q.x, q.y, 6, o.illuminatedFraction, brightLimbAngle(layout, o, observe(site, builtInBody('sun'), time))));
    else parts.push(`<rect x="${n(q.x - 3.2)}" y="${n(q.y - 3.2)}" width="6.4" height="6.4" fill="${COLOURS.planet}" stroke="${COLOURS.sky}" stroke-width="1" transform="rotate(45 ${n(q.x)} ${n(q.y)})"/>`);
    placer.reserve(q.x - 7, q.y - 7, q.x + 7, q.y + 7);
    const item = { x: q.x, y: q.y, text: mark.label, fill: isMoon ? COLOURS.moon : COLOURS.planet, gap: isMoon ? 7 : 5, mark, role: 'body' as const };
    if (namedBodies.has(other.id)) labels.unshift(item);
    else labels.push(item);
  }
  // Where the Sun set or will rise, when the guide phrase measures from it: a mark on the rim.
  const sunPoint = guide?.horizon?.sun ?? null;
  if (sunPoint) {
    const q = layout.toChart(Math.max(0, skylineAltitudeDeg(site, sunPoint.azimuthDeg)), sunPoint.azimuthDeg)!;
    parts.push(`<circle cx="${n(q.x)}" cy="${n(q.y)}" r="5" fill="${COLOURS.sun}" stroke="none"/>`);
    placer.reserve(q.x - 6, q.y - 6, q.x + 6, q.y + 6);
    const mark: ChartMark = { kind: 'sun', id: 'sun', label: sunPoint.event === 'set' ? 'Sun set here' : 'Sun rises here', altitudeDeg: 0, azimuthDeg: sunPoint.azimuthDeg, x: q.x, y: q.y, labelled: false };
    marks.push(mark);
    labels.push({ x: q.x, y: q.y, text: mark.label, fill: COLOURS.sun, gap: 6, mark, role: 'sun' });
  }
  if (target && body) {
    const q = layout.toChart(target.altitudeDeg, target.azimuthDeg);
    if (q && visible(target)) {
      const mark: ChartMark = { kind: 'target', id: body.id, label: chartWords(site).t('chart.target-mag', { name: chartLabel(body, site), value: formatMagnitude(target.magnitude.value, site) }), altitudeDeg: target.altitudeDeg, azimuthDeg: target.azimuthDeg, x: q.x, y: q.y, labelled: false };
      marks.unshift(mark);
      const symbol = targetSymbol(layout, target, body, q, 7, 2.4);
      parts.push(symbol.markup);
      placer.reserve(q.x - 8, q.y - 8, q.x + 8, q.y + 8);
      labels.unshift({ x: q.x, y: q.y, text: chartLabel(body, site), fill: COLOURS.target, gap: Math.max(8, Math.min(symbol.radius + 1, 40)), mark, bold: true, role: 'target' });
    }
  }
  // A satellite pass: the track, its ends labelled with their times first (they are the chart's subject).
  const pass = options.pass ?? null;
  if (pass) {
    const drawing = drawPass(pass, layout, site);
    parts.push(drawing.markup);
    for (const [x1, y1, x2, y2] of drawing.segments) placer.avoidLine(x1, y1, x2, y2);
    drawing.ends.forEach((end, i) => {
      placer.reserve(end.x - 7, end.y - 7, end.x + 7, end.y + 7);
      const mark: ChartMark = { kind: 'pass', id: `pass:${end.kind}`, label: end.label, altitudeDeg: end.altitudeDeg, azimuthDeg: end.azimuthDeg, x: end.x, y: end.y, labelled: false };
      marks.splice(i, 0, mark);
      labels.splice(i, 0, { x: end.x, y: end.y, text: end.label, lines: end.lines, fill: COLOURS.target, gap: 8, mark, bold: end.kind === 'appears', role: 'track' });
    });
  }
  const labelMarkup: string[] = [];
  // Stars the guide names are labelled right after the target and the bodies it names.
  const namedStarLabels: typeof labels = placed
    .filter((s) => namedHips.has(s.star.hip))
    .map((s) => {
      const q = layout.toChart(s.altitudeDeg, s.azimuthDeg)!;
      const mark: ChartMark = { kind: 'star', id: `hip:${s.star.hip}`, label: s.star.name, altitudeDeg: s.altitudeDeg, azimuthDeg: s.azimuthDeg, x: q.x, y: q.y, labelled: false };
      marks.push(mark);
      return { x: q.x, y: q.y, text: s.star.name, fill: COLOURS.text, gap: starRadius(s.star.vMag) + 1, mark, role: 'star' as const };
    });
  const firstOthers = labels.findIndex((l) => l.role !== 'target' && l.role !== 'track' && !(l.role === 'body' && namedBodies.has(l.mark.id)));
  const split = firstOthers < 0 ? labels.length : firstOthers;
  for (const l of [...labels.slice(0, split), ...namedStarLabels, ...labels.slice(split)]) {
    const lines = l.lines ?? [l.text];
    const spot = placer.place(l.x, l.y, lines, l.bold ? FONT.target : FONT.label, l.gap, { force: true, bold: l.bold ?? false, role: l.role });
    if (!spot) continue;
    l.mark.labelled = true;
    labelMarkup.push(leaderLine(l.x, l.y, l.gap, spot.box, l.fill));
    labelMarkup.push(text(spot.x, spot.y, lines, { size: l.bold ? FONT.target : FONT.label, fill: l.fill, anchor: spot.anchor, ...(l.bold ? { weight: 'bold' as const } : {}) }));
  }
  // The guide pattern's name, by its figure (centred on it when there is room), never on a star.
  if (guidePat) {
    const pts = guidePat.stars.map((hip) => sky.star(starByHip(hip)!)).filter((p) => visible(p)).map((p) => layout.toChart(p.altitudeDeg, p.azimuthDeg)!);
    if (pts.length) {
      labelMarkup.push(patternLabel(placer, patternName(chartWords(site).language, guidePat), pts));
    }
  }
  // The brightest named stars (V ≤ 1.5), brightest first, where they fit.
  for (const s of placed) {
    if (!s.star.name || s.star.vMag > 1.5 || namedHips.has(s.star.hip)) continue;
    const q = layout.toChart(s.altitudeDeg, s.azimuthDeg)!;
    const mark: ChartMark = { kind: 'star', id: `hip:${s.star.hip}`, label: s.star.name, altitudeDeg: s.altitudeDeg, azimuthDeg: s.azimuthDeg, x: q.x, y: q.y, labelled: false };
    marks.push(mark);
    const spot = placer.place(q.x, q.y, [s.star.name], FONT.small, starRadius(s.star.vMag) + 1, { role: 'star' });
    if (!spot) continue;
    mark.labelled = true;
    labelMarkup.push(text(spot.x, spot.y, s.star.name, { size: FONT.small, fill: COLOURS.dimText, anchor: spot.anchor }));
  }
  parts.push(...labelMarkup);

  parts.push(text(6, 17, clock, { size: FONT.label, fill: COLOURS.text, weight: 'bold', halo: COLOURS.skyEdge }));
  const words = chartWords(site);
  parts.push(text(6, DISC_HEIGHT + 14, words.t('chart.sky-legend', { north: words.compass(0).abbreviation, east: words.compass(90).abbreviation }), { size: FONT.small, fill: COLOURS.dimText, halo: COLOURS.skyEdge }));
  const hidden = target && body && !visible(target) ? ` · ${words.t('chart.sky-not-up', { name: chartLabel(body, site) })}` : '';
  parts.push(text(6, DISC_HEIGHT + 30, `${words.t('chart.sky-stars', { mag: words.number(magnitudeLimit, 1) })}${pass ? ' · ring: appears, bar: disappears' : ''}${hidden}`, { size: FONT.small, fill: COLOURS.dimText, halo: COLOURS.skyEdge }));

  const title = pass ? `${pass.name} crossing the sky from ${site.name}, chart at ${clock}` : words.t('chart.sky-title', { site: site.name, clock });
  return {
    kind: 'sky',
    svg: svgOpen(W, H, title) + parts.join('') + SVG_CLOSE,
    width: W,
    height: H,
    site,
    body,
    pass,
    time,
    target,
    guide,
    magnitudeLimit,
    marks,
    labels: placer.labels,
    stars: drawn,
    layout,
  };
}
