/**
 * Lunar occultations (event type `occultation`): the Moon passing in front of a bright star
 * (V ≤ `OCCULTATION_STAR_MAG_LIMIT`, from the bright-star table) or a planet, as seen from the
 * site: when the target disappears and reappears, at which limb (bright or dark), at which
 * position angle, how high the Moon stands and how much of it is lit; grazes are flagged.
 *
 * Geometry (all in the J2000 equatorial frame, topocentric): the Moon's geocentric position
 * (astronomy-engine `GeoMoon`) less the site's position (`ObserverVector`, WGS 84); a star's
 * catalogue direction with annual aberration from the Earth's barycentric velocity
 * (astronomy-engine `BaryState`; up to 20.5″, 40 s of occultation time); a planet's geocentric
 * apparent position (light time and aberration) less the site's position. The target is behind
 * the Moon while its angular distance from the Moon's centre is less than the Moon's topocentric
 * semidiameter, asin(R / d) with R = 1737.4 km (the mean lunar radius, IAU WGCCRE 2015). The
 * limb is taken as smooth: mountains and valleys move real contacts by a few seconds, and in a
 * graze decide them. Planets are timed at their centre (a disc takes up to a minute to go).
 *
 * Search: the Moon's geocentric direction every half day makes its path a chain of great-circle
 * arcs; a target whose closest point to an arc (its projection on the arc's circle, or the nearer
 * end) lies within the largest possible parallax plus the Moon's radius gets one search window,
 * centred on the moment the Moon, moving evenly along the arc, passes that point (a cheap test of
 * the target's distance from the arc's circle comes first). Inside the window the Moon comes from
 * geocentric positions two hours apart (`NodeTrack`, cubic interpolation, computed only where a
 * window needs them) and, with the site's position turned exactly with the Earth, the contacts
 * are the crossings of (separation − semidiameter) found by lib/core/search.ts, to 0.1 s.
 *
 * Position angle: of the contact point on the Moon's limb, from the north point of the Moon's
 * disc through east (J2000 equator). The limb is bright when the contact lies within 90° of the
 * position angle of the Sun seen from the Moon (the cusps are 90° either side of it).
 * A graze: the target's closest approach to the Moon's centre is within `GRAZE_FRACTION` of the
 * radius of the limb (about 35 km at the Moon): the times then depend on the limb profile and
 * on the exact place, and the star may blink several times (this project's choice of width).
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody, type Body } from '../../core/body.ts';
import { findCrossings, findMaximum } from '../../core/search.ts';
import { skylineAltitudeDeg, type Site } from '../../core/site.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import { stars, type Star } from '../../models/stars/catalogue.ts';
import { starBody, type AlmanacContext } from './context.ts';
import type { AlmanacEvent, EventHiddenReason } from './types.ts';

/** Faintest star whose occultations are listed, V magnitude. */
export const OCCULTATION_STAR_MAG_LIMIT = 4;
/** A graze: the closest approach is within this fraction of the Moon's radius from its limb. */
export const GRAZE_FRACTION = 0.02;
/** Mean radius of the Moon, km (IAU WGCCRE 2015). */
export const MOON_RADIUS_KM = 1737.4;
/** The Sun's altitude at or below which a contact counts as in a dark enough sky, degrees (the end of civil twilight). */
export const OCCULTATION_DARK_SUN_DEG = -6;
/** The planets the Moon can occult (all but the Sun and the Moon). */
const PLANETS = ['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const;

const RAD = Math.PI / 180;
const KM_PER_AU = 149_597_870.7;
/**
 * Screening limit: the Moon's horizontal parallax never exceeds 1.03° and its semidiameter 0.28°;
 * between two screening positions half a day apart its path leaves the great-circle arc through
 * them by less than 0.01° (its latitude swings ±5.3° over 27.2 days: ⅛ · 5.3° · (2π/27.2)² · 0.5² ≈ 0.009°),
 * for which 0.05° is allowed.
 */
const CANDIDATE_DEG = 1.03 + 0.28 + 0.05;
/** Spacing of the screening positions of the Moon, days: it moves about 6.6° in 12 hours. */
const SCREEN_DAYS = 0.5;
/**
 * Extra screening margin for planets, degrees: a planet is taken where it is at the arc's middle, and
 * moves up to 0.6° in a quarter day (Mercury near inferior conjunction, about 2.2° a day), plus 0.2°
 * for the linear interpolation of its screening positions.
 */
const PLANET_MARGIN_DEG = 0.8;
/** Sines of the screening limits (stars, planets), for the quick test against an arc's great circle. */
const SIN_LIMIT = [Math.sin(CANDIDATE_DEG * (Math.PI / 180)), Math.sin((CANDIDATE_DEG + PLANET_MARGIN_DEG) * (Math.PI / 180))];
/** Sampling step of the topocentric search, days; a dip shorter than this is caught by the minimum search. */
const STEP_DAYS = 5 / 1440;

type Vec = [number, number, number];

function unit(v: Vec): Vec {
  const r = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / r, v[1] / r, v[2] / r];
}

function angleDeg(a: Vec, b: Vec): number {
  const dot = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const cross = Math.hypot(a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]);
  return Math.atan2(cross, dot) / RAD;
}

/** Position angle of direction `b` around direction `a` (from north through east), degrees 0–360. */
function positionAngleDeg(a: Vec, b: Vec): number {
  const ra = Math.atan2(a[1], a[0]), dec = Math.asin(a[2]);
  const rb = Math.atan2(b[1], b[0]), decb = Math.asin(b[2]);
  const d = rb - ra;
  const pa = Math.atan2(Math.sin(d) * Math.cos(decb), Math.cos(dec) * Math.sin(decb) - Math.sin(dec) * Math.cos(decb) * Math.cos(d)) / RAD;
  return (pa + 360) % 360;
}

/** A target the Moon may cover: its apparent geocentric position (J2000, AU; stars far away, see `fixedDirectionBody`). */
interface Target {
  id: string;
  name: string;
  body: Body;
  /** V magnitude (NaN for planets: taken when described). */
  magnitude: number;
  star: boolean;
  geo(time: Astronomy.AstroTime): Vec;
}

/** A target of `body` (a star's, with `starBody`; a planet's): its apparent geocentric position is the body's own, with light time and aberration. */
function target(body: Body, magnitude: number, star: boolean): Target {
  return {
    id: body.id,
    name: body.name,
    body,
    magnitude,
    star,
    geo: (time) => {
      const g = body.geoVector(time, { aberration: true });
      return [g.x, g.y, g.z];
    },
  };
}

const starTarget = (star: Star): Target => target(starBody(star), star.vMag, true);
const planetTarget = (id: (typeof PLANETS)[number]): Target => target(builtInBody(id), Number.NaN, false);

/** The targets: stars to the magnitude limit within 7° of the ecliptic (the Moon's path stays within 6.7° of it), and the planets. */
export function occultationTargets(): Target[] {
  const eps = 23.4392911 * RAD;
  const near = stars().filter((s) => {
    if (s.vMag > OCCULTATION_STAR_MAG_LIMIT) return false;
    const a = s.raDeg * RAD, d = s.decDeg * RAD;
    const beta = Math.asin(Math.sin(d) * Math.cos(eps) - Math.cos(d) * Math.sin(eps) * Math.sin(a)) / RAD;
    return Math.abs(beta) < 7;
  });
  return [...near.map(starTarget), ...PLANETS.map(planetTarget)];
}

/** A step of the Moon's screening path: its ends (UT days, unit vectors) and the pole of their great circle. */
interface Arc {
  ut0: number;
  ut1: number;
  a: Vec;
  b: Vec;
  pole: Vec;
  /** Angle between the ends, radians. */
  length: number;
}

function arcOf(a: { ut: number; moon: Vec }, b: { ut: number; moon: Vec }): Arc {
  const c: Vec = [a.moon[1] * b.moon[2] - a.moon[2] * b.moon[1], a.moon[2] * b.moon[0] - a.moon[0] * b.moon[2], a.moon[0] * b.moon[1] - a.moon[1] * b.moon[0]];
  return { ut0: a.ut, ut1: b.ut, a: a.moon, b: b.moon, pole: unit(c), length: angleDeg(a.moon, b.moon) * RAD };
}

/**
 * When the Moon, moving along `arc` at an even pace, comes closest to direction `t`, if it comes
 * within the angle whose cosine is `cosLimit` (UT days), else null. The closest point of the arc's
 * great circle is the target's projection on it; outside the arc, the nearer end.
 */
function closestOnArc(arc: Arc, t: Vec, cosLimit: number): number | null {
  const d = t[0] * arc.pole[0] + t[1] * arc.pole[1] + t[2] * arc.pole[2];
  const p: Vec = [t[0] - d * arc.pole[0], t[1] - d * arc.pole[1], t[2] - d * arc.pole[2]];
  // Angle of the projection from the arc's start, along the arc (positive towards its end).
  const y: Vec = [arc.pole[1] * arc.a[2] - arc.pole[2] * arc.a[1], arc.pole[2] * arc.a[0] - arc.pole[0] * arc.a[2], arc.pole[0] * arc.a[1] - arc.pole[1] * arc.a[0]];
  const along = Math.atan2(p[0] * y[0] + p[1] * y[1] + p[2] * y[2], p[0] * arc.a[0] + p[1] * arc.a[1] + p[2] * arc.a[2]);
  const f = Math.min(1, Math.max(0, along / arc.length));
  const q = f === 0 ? arc.a : f === 1 ? arc.b : null;
  const cos = q ? t[0] * q[0] + t[1] * q[1] + t[2] * q[2] : Math.sqrt(Math.max(0, 1 - d * d));
  return cos >= cosLimit ? arc.ut0 + f * (arc.ut1 - arc.ut0) : null;
}

/** One contact (disappearance or reappearance). */
export interface OccultationContact {
  time: Date;
  /** Position angle of the contact point on the Moon's limb, degrees from north through east. */
  positionAngleDeg: number;
  limb: 'bright' | 'dark';
  /** The Moon's apparent altitude and azimuth at the contact, degrees. */
  moonAltitudeDeg: number;
  moonAzimuthDeg: number;
  /** The Sun's apparent altitude at the contact, degrees. */
  sunAltitudeDeg: number;
}

export interface Occultation {
  target: { id: string; name: string; magnitude: number };
  disappearance: OccultationContact;
  reappearance: OccultationContact;
  /** Closest approach of the target to the Moon's centre, in Moon radii (0 central, 1 the limb). */
  closestRadii: number;
  graze: boolean;
  /** Lit fraction of the Moon's disc at mid-occultation. */
  moonIlluminatedFraction: number;
}

/**
 * A vector function of time on equally spaced nodes (`base` + k·`step`, computed when first
 * needed and kept), read between them by four-point (cubic) Lagrange interpolation.
 */
class NodeTrack {
  readonly #base: number;
  readonly #step: number;
  readonly #f: (ut: number) => Vec;
  readonly #nodes = new Map<number, Vec>();
  constructor(f: (ut: number) => Vec, base: number, step: number) {
    this.#f = f;
    this.#base = base;
    this.#step = step;
  }

  /** The exact value at node `k`. */
  node(k: number): Vec {
    let v = this.#nodes.get(k);
    if (!v) {
      v = this.#f(this.#base + k * this.#step);
      this.#nodes.set(k, v);
    }
    return v;
  }

  at(ut: number): Vec {
    const u = (ut - this.#base) / this.#step;
    const k = Math.floor(u);
    const s = u - k;
    const w0 = (-s * (s - 1) * (s - 2)) / 6, w1 = ((s + 1) * (s - 1) * (s - 2)) / 2, w2 = (-(s + 1) * s * (s - 2)) / 2, w3 = ((s + 1) * s * (s - 1)) / 6;
    const a = this.node(k - 1), b = this.node(k), c = this.node(k + 1), d = this.node(k + 2);
    return [w0 * a[0] + w1 * b[0] + w2 * c[0] + w3 * d[0], w0 * a[1] + w1 * b[1] + w2 * c[1] + w3 * d[1], w0 * a[2] + w1 * b[2] + w2 * c[2] + w3 * d[2]];
  }
}

/**
 * Nodes of the Moon's geocentric position, two hours apart: the shortest periodic terms of the
 * lunar theory that matter (about 9 days, up to 1.3°) leave a cubic-interpolation error of
 * (2π/9 d × h)⁴ / 24 × 1.3° ≈ 0.0001″, and the screening reads the nodes themselves.
 */
const NODE_DAYS = 2 / 24;
/** Planets are screened from positions two days apart (interpolated linearly; Mercury strays by < 0.2°). */
const PLANET_SCREEN_DAYS = 2;
/** Half-width of the topocentric search around a screened approach, days: the parallax can shift the closest approach by up to two hours. */
const SEARCH_HALF_DAYS = 3.5 / 24;

/** Earth's rotation, radians per UT day (IERS: 1.002 737 811 911 354 48 turns per UT day). */
const EARTH_ROTATION_RAD_PER_DAY = 2 * Math.PI * 1.002737811911354;

/**
 * The site's position (J2000, AU) over a few hours: its position of date at one moment, turned
 * with the Earth's rotation about the true pole, then referred to the J2000 equator with that
 * moment's precession–nutation (which changes by far less than 0.01″ in hours).
 */
function siteTrack(observer: Astronomy.Observer, utMid: number): (ut: number) => Vec {
  const time = Astronomy.MakeTime(dateFromUt(utMid));
  const o = Astronomy.ObserverVector(time, observer, true);
  const m = Astronomy.Rotation_EQD_EQJ(time).rot;
  return (ut: number): Vec => {
    const a = EARTH_ROTATION_RAD_PER_DAY * (ut - utMid);
    const c = Math.cos(a), s = Math.sin(a);
    const x = c * o.x - s * o.y, y = s * o.x + c * o.y, z = o.z;
    return [m[0]![0]! * x + m[1]![0]! * y + m[2]![0]! * z, m[0]![1]! * x + m[1]![1]! * y + m[2]![1]! * z, m[0]![2]! * x + m[1]![2]! * y + m[2]![2]! * z];
  };
}

/** The geometry of one approach of the Moon to a target, topocentric: the Moon from shared interpolated nodes, the site exactly. */
class Approach {
  readonly #moon: NodeTrack;
  readonly #site: (ut: number) => Vec;
  readonly #target: ((ut: number) => Vec) | Vec;
  constructor(moon: NodeTrack, observer: Astronomy.Observer, target: Target, ut0: number, ut1: number) {
    const time = (ut: number): Astronomy.AstroTime => Astronomy.MakeTime(dateFromUt(ut));
    this.#moon = moon;
    this.#site = siteTrack(observer, (ut0 + ut1) / 2);
    if (target.star) {
      // A star's direction (with aberration) changes by < 0.01″ in hours: one value for the approach.
      this.#target = target.geo(time((ut0 + ut1) / 2));
    } else {
      const planet = new NodeTrack((ut) => target.geo(time(ut)), ut0, NODE_DAYS);
      this.#target = (ut: number): Vec => planet.at(ut);
    }
  }

  at(ut: number): { moon: Vec; target: Vec } {
    const m = this.#moon.at(ut);
    const o = this.#site(ut);
    const g = Array.isArray(this.#target) ? this.#target : (this.#target as (ut: number) => Vec)(ut);
    return { moon: [m[0] - o[0], m[1] - o[1], m[2] - o[2]], target: [g[0] - o[0], g[1] - o[1], g[2] - o[2]] };
  }

  /** Separation of the target from the Moon's centre minus the Moon's semidiameter, degrees (negative while covered). */
  depth(ut: number): number {
    const g = this.at(ut);
    const d = Math.hypot(g.moon[0], g.moon[1], g.moon[2]) * KM_PER_AU;
    return angleDeg(g.moon, g.target) - Math.asin(MOON_RADIUS_KM / d) / RAD;
  }
}

/**
 * The occultations seen from `ctx.site` with disappearance in [from, to), in time order.
 * Occultations already in progress at `from` are left out.
 */
export function findOccultations(ctx: AlmanacContext, from: Date, to: Date, targets: readonly Target[] = occultationTargets()): Occultation[] {
  const site = ctx.site;
  const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
  const ut0 = utDays(from), ut1 = utDays(to);
  // The Moon's geocentric position on nodes two hours apart, computed where a window needs them and shared by every target.
  const moon = new NodeTrack(
    (ut) => {
      const m = Astronomy.GeoMoon(Astronomy.MakeTime(dateFromUt(ut)));
      return [m.x, m.y, m.z];
    },
    ut0,
    NODE_DAYS,
  );
  // Screening: the Moon's geocentric direction every `SCREEN_DAYS`, each step an arc of its path.
  const coarse: { ut: number; moon: Vec }[] = [];
  for (let ut = ut0 - SEARCH_HALF_DAYS - SCREEN_DAYS; ut <= ut1 + SEARCH_HALF_DAYS + SCREEN_DAYS; ut += SCREEN_DAYS) {
    const m = Astronomy.GeoMoon(Astronomy.MakeTime(dateFromUt(ut)));
    coarse.push({ ut, moon: unit([m.x, m.y, m.z]) });
  }
  const arcs = coarse.slice(1).map((b, i) => arcOf(coarse[i]!, b));
  const out: Occultation[] = [];
  for (const target of targets) {
    // Where the target is (stars: fixed; planets: from positions two days apart, linearly).
    const direction = target.star
      ? ((v: Vec) => () => v)(unit(target.geo(Astronomy.MakeTime(dateFromUt((ut0 + ut1) / 2)))))
      : ((): ((ut: number) => Vec) => {
          const nodes = new Map<number, Vec>();
          const node = (k: number): Vec => {
            let v = nodes.get(k);
            if (!v) {
              v = unit(target.geo(Astronomy.MakeTime(dateFromUt(ut0 + k * PLANET_SCREEN_DAYS))));
              nodes.set(k, v);
            }
            return v;
          };
          return (ut: number): Vec => {
            const u = (ut - ut0) / PLANET_SCREEN_DAYS;
            const k = Math.floor(u), f = u - k;
            const a = node(k), b = node(k + 1);
            return unit([a[0] + f * (b[0] - a[0]), a[1] + f * (b[1] - a[1]), a[2] + f * (b[2] - a[2])]);
          };
        })();
    // Screening margin: parallax and semidiameter, the path's bend inside an arc, and for planets their own motion over half an arc.
    const limit = CANDIDATE_DEG + (target.star ? 0 : PLANET_MARGIN_DEG);
    const cosLimit = Math.cos(limit * RAD);
    let lastEnd = -Infinity;
    // Whether the previous arc came nearest at its very end (then its successor's start is the approach).
    let previousAtEnd = false;
    for (const arc of arcs) {
      const t = direction((arc.ut0 + arc.ut1) / 2);
      // Cheap test first: the target's angle from the arc's great circle (sin of it is t·n).
      const across = t[0] * arc.pole[0] + t[1] * arc.pole[1] + t[2] * arc.pole[2];
      const nearest = Math.abs(across) > SIN_LIMIT[target.star ? 0 : 1]! ? null : closestOnArc(arc, t, cosLimit);
      const atEnd = nearest === arc.ut1;
      // One window per approach: at the arc whose inside holds the closest point (the arcs before
      // it come nearest at their end, those after at their start).
      const approaching = nearest !== null && !atEnd && (nearest > arc.ut0 || previousAtEnd);
      previousAtEnd = atEnd;
      if (!approaching) continue;
      const w0 = Math.max(nearest - SEARCH_HALF_DAYS, lastEnd), w1 = nearest + SEARCH_HALF_DAYS;
      if (w1 <= w0) continue;
      const approach = new Approach(moon, observer, target, w0, w1);
      const depth = (ut: number): number => approach.depth(ut);
      let crossings = findCrossings(depth, w0, w1, { stepDays: STEP_DAYS, toleranceDays: 0.1 / 86_400 });
      if (crossings.length === 0) {
        // A short graze can fall between samples: look at the closest approach itself.
        const closest = findMaximum((ut) => -depth(ut), w0, w1, { stepDays: STEP_DAYS });
        if (closest && closest.value > 0) crossings = findCrossings(depth, closest.ut - STEP_DAYS, closest.ut + STEP_DAYS, { stepDays: 1 / 86_400, toleranceDays: 0.1 / 86_400 });
      }
      for (let j = 0; j + 1 < crossings.length; j++) {
        const a = crossings[j]!, b = crossings[j + 1]!;
        if (a.direction > 0 || b.direction < 0) continue;
        if (a.ut >= ut0 && a.ut < ut1) out.push(describe(observer, approach, target, a.ut, b.ut));
      }
      lastEnd = w1;
    }
  }
  return out.sort((x, y) => x.disappearance.time.getTime() - y.disappearance.time.getTime());
}

/** Apparent (refracted) altitude and azimuth of the Sun or the Moon seen from the site (astronomy-engine, standard refraction), degrees. */
function horizontal(body: Astronomy.Body, time: Astronomy.AstroTime, observer: Astronomy.Observer): { altitudeDeg: number; azimuthDeg: number } {
  const eq = Astronomy.Equator(body, time, observer, true, true);
  const h = Astronomy.Horizon(time, observer, eq.ra, eq.dec, 'normal');
  return { altitudeDeg: h.altitude, azimuthDeg: h.azimuth };
}

function contact(observer: Astronomy.Observer, approach: Approach, ut: number): OccultationContact {
  const g = approach.at(ut);
  const time = Astronomy.MakeTime(dateFromUt(ut));
  const sun = Astronomy.GeoVector(Astronomy.Body.Sun, time, true);
  const o = Astronomy.ObserverVector(time, observer, false);
  const sunTopo: Vec = [sun.x - o.x, sun.y - o.y, sun.z - o.z];
  const pa = positionAngleDeg(unit(g.moon), unit(g.target));
  const bright = positionAngleDeg(unit(g.moon), unit(sunTopo));
  const diff = Math.abs(((pa - bright + 540) % 360) - 180);
  const moon = horizontal(Astronomy.Body.Moon, time, observer);
  return {
    time: dateFromUt(ut),
    positionAngleDeg: pa,
    limb: diff < 90 ? 'bright' : 'dark',
    moonAltitudeDeg: moon.altitudeDeg,
    moonAzimuthDeg: moon.azimuthDeg,
    sunAltitudeDeg: horizontal(Astronomy.Body.Sun, time, observer).altitudeDeg,
  };
}

function describe(observer: Astronomy.Observer, approach: Approach, target: Target, a: number, b: number): Occultation {
  const closest = findMaximum((ut) => -approach.depth(ut), a, b, { stepDays: Math.max((b - a) / 8, 1 / 86_400) });
  const mid = closest?.ut ?? (a + b) / 2;
  const g = approach.at(mid);
  const time = Astronomy.MakeTime(dateFromUt(mid));
  const d = Math.hypot(g.moon[0], g.moon[1], g.moon[2]) * KM_PER_AU;
  const sd = Math.asin(MOON_RADIUS_KM / d) / RAD;
  const closestRadii = angleDeg(g.moon, g.target) / sd;
  const magnitude = Number.isNaN(target.magnitude) ? target.body.illumination(time).magnitude.value : target.magnitude;
  return {
    target: { id: target.id, name: target.name, magnitude },
    disappearance: contact(observer, approach, a),
    reappearance: contact(observer, approach, b),
    closestRadii,
    graze: closestRadii > 1 - GRAZE_FRACTION,
    moonIlluminatedFraction: Astronomy.Illumination(Astronomy.Body.Moon, time).phase_fraction,
  };
}

/**
 * How high the Moon stands at a contact, as a page says it: `below` the horizon (apparent altitude
 * of its centre under −0.5°), `horizon` (from −0.5° to 1°: rising or setting, said in words, never
 * "0° up"), `low` (1° or more but under the site's minimum altitude: its whole degrees, rounded
 * down so that "only 4° up" never reads as the 5° minimum), `skyline` (above that but behind the
 * site's skyline), or `up` (high enough to watch from the site).
 */
export type MoonHeight = 'below' | 'horizon' | 'low' | 'skyline' | 'up';

/** The Moon's height at a contact for a site with `minAltitudeDeg` and a skyline (see `MoonHeight`). */
export function moonHeight(c: Pick<OccultationContact, 'moonAltitudeDeg' | 'moonAzimuthDeg'>, site: Pick<Site, 'horizon' | 'minAltitudeDeg'>): MoonHeight {
  const altitudeDeg = c.moonAltitudeDeg;
  if (altitudeDeg < -0.5) return 'below';
  if (altitudeDeg < 1) return 'horizon';
  if (altitudeDeg < site.minAltitudeDeg) return 'low';
  if (altitudeDeg < skylineAltitudeDeg(site, c.moonAzimuthDeg)) return 'skyline';
  return 'up';
}

/** The site's occultations in [from, to) as almanac events, visible or not. */
export function occultationEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  return findOccultations(ctx, from, to).map((o) => {
    const dark = (c: OccultationContact): boolean => c.sunAltitudeDeg <= OCCULTATION_DARK_SUN_DEG;
    // A contact is watchable in a dark enough sky with the Moon at least at the site's minimum altitude and above its skyline.
    const watchable = (c: OccultationContact): boolean => dark(c) && c.moonAltitudeDeg >= Math.max(ctx.site.minAltitudeDeg, skylineAltitudeDeg(ctx.site, c.moonAzimuthDeg));
    const seen = [o.disappearance, o.reappearance].filter(watchable);
    const first = seen[0] ?? null;
    const w = ctx.words;
    const height = (c: OccultationContact): MoonHeight => moonHeight(c, ctx.site);
    const contact = (c: OccultationContact, n: 1 | 2): Record<string, string | number> => ({
      [`limb${n}`]: c.limb,
      [`clock${n}`]: ctx.clock(c.time),
      [`pa${n}`]: Math.round(c.positionAngleDeg),
      [`height${n}`]: height(c),
      [`alt${n}`]: height(c) === 'low' ? Math.floor(c.moonAltitudeDeg) : Math.round(c.moonAltitudeDeg),
    });
    const magnitude = o.target.magnitude;
    const sentence = w.t('ev.occultation', {
      percent: w.percent(o.moonIlluminatedFraction),
      name: ctx.phrase(o.target),
      day: ctx.day(o.disappearance.time),
      ...contact(o.disappearance, 1),
      ...contact(o.reappearance, 2),
      graze: o.graze ? 'yes' : 'no',
    });
    // Not watchable: in daylight, or, of the contacts in a dark sky, the one with the higher Moon says why.
    const inDark = [o.disappearance, o.reappearance].filter(dark).sort((a, b) => b.moonAltitudeDeg - a.moonAltitudeDeg);
    const reason: EventHiddenReason | null = first ? null : inDark.length > 0 ? 'below-horizon' : 'daylight';
    const note = first
      ? w.t('ev.occultation-note', {
          which: seen.length === 2 ? 'both' : first === o.disappearance ? 'disappearance' : 'reappearance',
          height: height(first),
          degrees: Math.round(first.moonAltitudeDeg),
          direction: ctx.direction(first.moonAzimuthDeg),
        })
      : w.t('ev.occultation-hidden', { site: ctx.site.name, why: inDark[0] ? height(inDark[0]) : 'daylight', min: ctx.site.minAltitudeDeg });
    return {
      type: 'occultation' as const,
      time: o.disappearance.time,
      end: o.reappearance.time,
      bodies: ['moon', o.target.id],
      names: ['the Moon', o.target.name],
      visible: first !== null,
      visibility: first
        ? { visible: true, moment: 'event' as const, time: first.time, altitudeDeg: first.moonAltitudeDeg, azimuthDeg: first.moonAzimuthDeg, reason: null, note }
        : { visible: false, moment: 'none' as const, time: null, altitudeDeg: null, azimuthDeg: null, reason, note },
      title: w.t('ev.title.occultation', { name: ctx.phrase(o.target) }),
      description: `${sentence} ${first ? w.t('ev.occultation-aid', { bright: magnitude <= 1.5 ? 'yes' : 'no' }) : note}`,
      score: 0,
      data: {
        disappearancePositionAngleDeg: Math.round(o.disappearance.positionAngleDeg),
        disappearanceLimb: o.disappearance.limb,
        reappearancePositionAngleDeg: Math.round(o.reappearance.positionAngleDeg),
        reappearanceLimb: o.reappearance.limb,
        moonIlluminatedFraction: Math.round(o.moonIlluminatedFraction * 1000) / 1000,
        closestRadii: Math.round(o.closestRadii * 1000) / 1000,
        graze: o.graze ? 'yes' : 'no',
        magnitude: Math.round(magnitude * 10) / 10,
      },
    };
  });
}
