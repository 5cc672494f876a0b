/**
 * Close approaches ("conjunctions" in the everyday sense): local minima of the geocentric angular
 * separation of two bodies, or of a body and a bright star, below a limit. `astronomy-engine` has
 * no search for these, so they are zero crossings (from − to +) of the separation's rate of
 * change, found by lib/core/search.ts `findCrossings`.
 *
 * Frame: geocentric astrometric directions on the J2000 equator (`Body.geoVector` with
 * `aberration: false`, the frame of the star catalogue); the minimum separation and its instant
 * are what almanacs tabulate. The description then gives the placement seen from the site at
 * the moment it can be seen (topocentric, so the Moon's parallax of up to 1° is included); one
 * that cannot be seen gives the Moon's least distance seen from the site (`siteMinimum`).
 */
import * as Astronomy from 'astronomy-engine';
import type { Body } from '../../core/body.ts';
import { builtInBody } from '../../core/body.ts';
import { findCrossings, findMaximum, sharedSearch } from '../../core/search.ts';
import { offsetInSky, separationDeg } from '../../core/geometry.ts';
import { distanceWords, offsetWords } from '../../models/stars/guide.ts';
import { starByHip, stars, type Star } from '../../models/stars/catalogue.ts';
import { patterns, type StarPattern as Pattern } from '../../models/stars/patterns.ts';
import type { NamePhrase } from '../../core/language/index.ts';
import { patternPhrase } from '../../core/language/names/index.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import type { AlmanacContext } from './context.ts';
import { starBody } from './context.ts';
import { OBLIQUITY_J2000_DEG } from './planets.ts';
import { apparentPlace, eventVisibility } from './visibility.ts';
import type { AlmanacEvent, ApproachLimits } from './types.ts';

const RAD = Math.PI / 180;
/** Sampling step, days. The fastest pair (the Moon and a star) turns from approach to recession every ~13.7 days. */
const STEP_DAYS = 0.5;
/** Half-width of the central difference for the separation rate, days (1 minute). */
const DELTA_DAYS = 1 / 1440;

export const DEFAULT_APPROACH_LIMITS: Required<ApproachLimits> = { moonPlanetDeg: 4, moonStarDeg: 2, planetPlanetDeg: 3, planetStarDeg: 1.5 };

type Vec = [number, number, number];

/** Unit direction vectors of one body, memoised by UT day (the sampling grid is shared by every pair). */
class Directions {
  readonly body: Body;
  readonly #fixed: Vec | null;
  readonly #memo = new Map<number, Vec>();

  constructor(body: Body, fixed: Vec | null = null) {
    this.body = body;
    this.#fixed = fixed;
  }

  at(ut: number): Vec {
    if (this.#fixed) return this.#fixed;
    let v = this.#memo.get(ut);
    if (!v) {
      const g = this.body.geoVector(Astronomy.MakeTime(dateFromUt(ut)), { aberration: false });
      const r = Math.hypot(g.x, g.y, g.z);
      v = [g.x / r, g.y / r, g.z / r];
      this.#memo.set(ut, v);
    }
    return v;
  }
}

/** Local minima of the separation of `a` and `b` in [ut0, ut1] that are at most `limitDeg`. */
export function separationMinima(a: Directions, b: Directions, ut0: number, ut1: number, limitDeg: number): { ut: number; separationDeg: number }[] {
  const sep = (ut: number): number => separationDeg(a.at(ut), b.at(ut));
  const rate = (ut: number): number => sep(ut + DELTA_DAYS) - sep(ut - DELTA_DAYS);
  return findCrossings(rate, ut0, ut1, { stepDays: STEP_DAYS, toleranceDays: 10 / 86_400 })
    .filter((c) => c.direction === 1)
    .map((c) => ({ ut: c.ut, separationDeg: sep(c.ut) }))
    .filter((m) => m.separationDeg <= limitDeg);
}

/** Minimum geocentric separation of two bodies in [from, to) (for tests and single-pair questions). */
export function closestApproaches(a: Body, b: Body, from: Date, to: Date, limitDeg = 180): { time: Date; separationDeg: number }[] {
  return separationMinima(new Directions(a), new Directions(b), utDays(from), utDays(to), limitDeg).map((m) => ({ time: dateFromUt(m.ut), separationDeg: m.separationDeg }));
}

/** Ecliptic latitude (J2000 mean ecliptic) of a star, degrees. */
function eclipticLatitudeDeg(star: Star): number {
  const a = star.raDeg * RAD;
  const d = star.decDeg * RAD;
  const y = Math.cos(d) * Math.sin(a);
  const z = Math.sin(d);
  const e = OBLIQUITY_J2000_DEG * RAD;
  return Math.asin(z * Math.cos(e) - y * Math.sin(e)) / RAD;
}

function starDirections(star: Star): Directions {
  const a = star.raDeg * RAD;
  const d = star.decDeg * RAD;
  return new Directions(starBody(star), [Math.cos(d) * Math.cos(a), Math.cos(d) * Math.sin(a), Math.sin(d)]);
}

export interface ApproachOptions {
  limits?: ApproachLimits;
  /** Planets taking part (default Mercury–Saturn). */
  planets?: readonly string[];
  /** Comets and asteroids taking part. */
  smallBodies?: readonly Body[];
  starMagnitudeLimit?: number;
  starEclipticLatitudeDeg?: number;
  /** Include the Moon (default true). */
  moon?: boolean;
}

/** Close approaches with minima in [from, to): Moon–planet, Moon–star, planet–planet, planet–star, comet–star (bright stars and every pattern star). */
export function approachEvents(ctx: AlmanacContext, from: Date, to: Date, options: ApproachOptions = {}): AlmanacEvent[] {
  const limits = { ...DEFAULT_APPROACH_LIMITS, ...options.limits };
  const planetIds = options.planets ?? ['mercury', 'venus', 'mars', 'jupiter', 'saturn'];
  const magLimit = options.starMagnitudeLimit ?? 1.6;
  const latLimit = options.starEclipticLatitudeDeg ?? 10;
  const bright = stars().filter((s) => s.vMag <= magLimit);
  const eclipticStars = bright.filter((s) => Math.abs(eclipticLatitudeDeg(s)) <= latLimit).map(starDirections);
  const allStars = bright.map(starDirections);
  const moon = new Directions(builtInBody('moon'));
  const planets = planetIds.map((id) => new Directions(builtInBody(id as 'mercury')));
  const small = (options.smallBodies ?? []).map((b) => new Directions(b));
  type Pair = { a: Directions; b: Directions; limit: number };
  // The built-in bodies' pairs: the same from every site, found once per range for the whole build.
  const pairs: Pair[] = [];
  if (options.moon !== false) {
    for (const p of planets) pairs.push({ a: moon, b: p, limit: limits.moonPlanetDeg });
    for (const s of eclipticStars) pairs.push({ a: moon, b: s, limit: limits.moonStarDeg });
  }
  for (let i = 0; i < planets.length; i++) {
    for (let j = i + 1; j < planets.length; j++) pairs.push({ a: planets[i]!, b: planets[j]!, limit: limits.planetPlanetDeg });
  }
  for (const p of planets) for (const s of eclipticStars) pairs.push({ a: p, b: s, limit: limits.planetStarDeg });
  // Each comet or asteroid with the Moon, the planets, the small bodies after it and the stars;
  // also every star of a pattern: a comet passing a familiar figure is news even when the star is faint.
  const brightHips = new Set(bright.map((s) => s.hip));
  const patternStars = [...PATTERN_OF_STAR.keys()].filter((hip) => !brightHips.has(hip)).map((hip) => starDirections(starByHip(hip)!));
  const ofSmall = small.map((c, i): Pair[] => [
    ...(options.moon !== false ? [{ a: moon, b: c, limit: limits.moonPlanetDeg }] : []),
    ...planets.map((p) => ({ a: p, b: c, limit: limits.planetPlanetDeg })),
    ...small.slice(i + 1).map((d) => ({ a: c, b: d, limit: limits.planetPlanetDeg })),
    ...[...allStars, ...patternStars].map((s) => ({ a: c, b: s, limit: limits.planetStarDeg })),
  ]);

  type Minimum = { first: Body; second: Body; ut: number; separationDeg: number };
  const minimaOf = (list: readonly Pair[]) => (a: Date, b: Date): Minimum[] =>
    list.flatMap((p) => separationMinima(p.a, p.b, utDays(a), utDays(b), p.limit).map((m) => ({ first: p.a.body, second: p.b.body, ...m })));
  const key = JSON.stringify([limits, planetIds, magLimit, latLimit, options.moon !== false]);
  const found = [
    ...sharedSearch(approachEvents, key, from, to, minimaOf(pairs), (m) => dateFromUt(m.ut)),
    ...small.flatMap((c, i) => sharedSearch(c.body, `${key}:${small.slice(i + 1).map((d) => d.body.id).join()}`, from, to, minimaOf(ofSmall[i]!), (m) => dateFromUt(m.ut))),
  ];
  const out: AlmanacEvent[] = [];
  for (const m of found) out.push(describeApproach(ctx, m.first, m.second, dateFromUt(m.ut), m.separationDeg));
  return out;
}

/** Star id (`star:<HIP>`) → the first pattern that uses the star. */
const PATTERN_OF_STAR = new Map<number, Pattern>();
for (const pattern of patterns()) for (const hip of pattern.stars) if (!PATTERN_OF_STAR.has(hip)) PATTERN_OF_STAR.set(hip, pattern);

/** The pattern a star belongs to, as the sentence's `inPattern` and `pattern` arguments ("…, in the Great Square of Pegasus"). */
function patternArgs(ctx: AlmanacContext, body: Body): { inPattern: 'yes' | 'no'; pattern: NamePhrase } {
  const hip = /^star:(\d+)$/.exec(body.id)?.[1];
  const pattern = hip ? PATTERN_OF_STAR.get(Number(hip)) : undefined;
  return pattern ? { inPattern: 'yes', pattern: patternPhrase(ctx.words.language, pattern) } : { inPattern: 'no', pattern: { text: '', gender: 'masculine' } };
}

function magnitudeOf(body: Body, time: Date): number {
  return body.illumination(Astronomy.MakeTime(time)).magnitude.value;
}

/**
 * The least separation of the Moon and `b` seen from the site (topocentric apparent directions,
 * equator of date) within six hours of the geocentric minimum at `time` and inside that night's
 * frame, degrees, and whether the Moon's disc covers `b` then (separation below the Moon's
 * topocentric semidiameter). The Moon's parallax moves it by up to a degree: a pair 0.0° apart
 * from the Earth's centre, an occultation somewhere on the Earth, may be a degree apart from here.
 */
export function siteMinimum(ctx: AlmanacContext, moon: Body, b: Body, time: Date): { separationDeg: number; covers: boolean } {
  const frame = ctx.frameAt(time);
  const ut = utDays(time);
  const sep = (t: number): number => separationDeg(frame.track(moon).vectorAt(t), frame.track(b).vectorAt(t));
  const best = findMaximum((t) => -sep(t), Math.max(frame.ut0, ut - 0.25), Math.min(frame.ut1, ut + 0.25), { stepDays: 10 / 1440, toleranceDays: 10 / 86_400 });
  const at = best?.ut ?? ut;
  const apart = best ? -best.value : sep(ut);
  const track = frame.track(moon);
  return { separationDeg: apart, covers: apart < track.semidiameterDeg(track.at(at).distance) };
}

/** The event for one minimum: visibility from the site and a sentence with the placement seen from there. */
export function describeApproach(ctx: AlmanacContext, first: Body, second: Body, time: Date, separationDeg: number): AlmanacEvent {
  // Lead with the Moon, else with the body that moves (a planet or comet before a star), else the brighter.
  let a = first;
  let b = second;
  const isStar = (x: Body): boolean => x.id.startsWith('star:');
  const lead = (x: Body, y: Body): boolean => x.kind === 'moon' || (y.kind !== 'moon' && (isStar(y) !== isStar(x) ? isStar(y) : magnitudeOf(x, time) <= magnitudeOf(y, time)));
  if (!lead(a, b)) [a, b] = [b, a];
  const visibility = eventVisibility(ctx, [a, b], time, { preferNear: true });
  const day = ctx.day(time);
  const w = ctx.words;
  const names = { a: ctx.phrase(a), b: ctx.phrase(b), day };
  let description: string;
  if (visibility.visible && visibility.time) {
    const frame = ctx.frameAt(visibility.time);
    const ut = utDays(visibility.time);
    const pa = apparentPlace(frame, a, ut);
    const pb = apparentPlace(frame, b, ut);
    const off = offsetInSky({ fromAltitudeDeg: pb.altitudeDeg, fromAzimuthDeg: pb.azimuthDeg, toAltitudeDeg: pa.altitudeDeg, toAzimuthDeg: pa.azimuthDeg });
    const lookNow = w.t('ev.look', { direction: ctx.direction(pb.azimuthDeg), clock: ctx.clock(visibility.time) });
    const look = visibility.moment === 'night' && ctx.day(visibility.time) !== day ? w.t('ev.look-day', { look: lookNow, day: ctx.day(visibility.time) }) : lookNow;
    const offset = offsetWords(off.separationDeg, off.offsetDirection, names.b, w);
    description =
      a.kind === 'moon'
        ? w.t('ev.approach-moon', { offset, day, look })
        : w.t('ev.approach', { ...names, distance: distanceWords(off.separationDeg, w), offset, look, ...patternArgs(ctx, b) });
  } else {
    // The Moon's parallax moves it by up to 1°: the distance said is the one seen from the site.
    if (a.kind === 'moon') {
      const seen = siteMinimum(ctx, a, b, time);
      const degrees = w.number(seen.separationDeg, seen.separationDeg < 1 ? 1 : 0);
      description = w.t('ev.approach-moon-hidden', { ...names, degrees, covers: seen.covers ? 'yes' : 'no' });
    } else {
      const degrees = w.number(separationDeg, separationDeg < 1 ? 1 : 0);
      description = w.t('ev.approach-hidden', { ...names, degrees, ...patternArgs(ctx, b) });
    }
  }
  return {
    type: 'close-approach',
    time,
    bodies: [a.id, b.id],
    names: [a.name, b.name],
    separationDeg,
    visible: visibility.visible,
    visibility,
    title: w.t('ev.title.approach', { a: ctx.label(a), b: ctx.label(b) }),
    description,
    score: 0,
    data: { magnitudeA: Math.round(magnitudeOf(a, time) * 10) / 10, magnitudeB: Math.round(magnitudeOf(b, time) * 10) / 10 },
  };
}

export { Directions };
