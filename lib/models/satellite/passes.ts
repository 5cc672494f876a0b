/**
 * Satellite passes over a site: when a satellite crosses the site's sky, where it rises, climbs
 * highest and sets, whether it is sunlit, how bright it should be, and whether a member of the
 * public can actually see it.
 *
 * Definitions:
 * - A *pass* runs from the moment the satellite rises above the site's skyline and minimum
 *   altitude (`start`) to the moment it sinks below them (`end`); `culmination` is its highest
 *   point. Only passes while the Sun is down (geometric altitude below −0.833°, the sunset
 *   definition) are searched: a satellite is never seen in daylight.
 * - *Sunlit*: at least half of the Sun's disc is seen from the satellite (`shadow.ts`); passing
 *   that point is reported as entering or leaving the Earth's shadow.
 * - *Magnitude*: from the satellite's standard magnitude (`magnitude.ts`).
 * - *Visible*: the visibility model of `lib/models/sky` applied to the satellite as a point source, as for
 *   planets in `lib/models/visibility.ts`: margin = limiting magnitude for the sky brightness at the
 *   satellite (night sky, moonlight, twilight) − (magnitude + k·X). The *verdict* is the least
 *   optical aid with a positive margin somewhere in the pass; `visible` is the span around the
 *   best moment where it stays positive. Only naked-eye passes visible for at least a minute
 *   are `recommended`.
 * - *Freshness*: each pass carries the age of its elements at the pass; a pass more than
 *   `MAX_ELEMENT_AGE_DAYS` from the elements' epoch is refused (`stale-elements`).
 *
 * Search (all through `lib/core/search.ts`), per night on a track of SGP4 states two minutes apart
 * (`StateTrack`): the satellite's highest points (zero crossings of its altitude rate), then
 * around each the crossings of the skyline, then the shadow and visibility crossings inside the
 * pass. Passes that never reach the site's minimum altitude are not reported.
 */
import * as Astronomy from 'astronomy-engine';
import { compass, type CompassPoint } from '../../core/describe.ts';
import { GloamingError, type Place } from '../../core/errors.ts';
import { findCrossings, findMaximum } from '../../core/search.ts';
import { skylineAltitudeDeg, type Site } from '../../core/site.ts';
import { skyBrightness } from '../sky/brightness.ts';
import { extinctionCoefficientGreen, extinctionMag } from '../sky/extinction.ts';
import { darkSkyFromQuality } from '../sky/quality.ts';
import { DEFAULT_INSTRUMENTS, limitingMagnitude, type Instrument } from '../sky/threshold.ts';
import { addDays, localMidnight, nightOf } from '../../core/time.ts';
import { separationDeg } from '../../core/geometry.ts';
import { dateFromUt, NightFrame, utDays } from '../../core/track.ts';
import type { ElementSet } from './elements.ts';
import { satelliteMagnitude } from './magnitude.ts';
import { epochUt, SatelliteObserver, StateTrack, type LookAngles, type Vec3 } from './propagate.ts';
import { sunlitFraction } from './shadow.ts';

/**
 * Largest interval between an element set's epoch and a predicted pass, days. SGP4 element sets
 * of low satellites lose accuracy by roughly a few kilometres a day (drag, manoeuvres), i.e.
 * seconds of pass time after a week and up to a minute after two (common practice).
 */
export const MAX_ELEMENT_AGE_DAYS = 14;
/** A tracked satellite: catalogue entry and its current element set. */
export interface Satellite {
  id: string;
  name: string;
  noradId: number;
  /** Magnitude at 1000 km range and 90° phase angle (see `magnitude.ts`). */
  standardMagnitude: number;
  elements: ElementSet;
}

/** One moment of a pass. */
export interface PassPoint {
  time: Date;
  /** Apparent altitude (standard refraction), degrees. */
  altitudeDeg: number;
  /** Degrees from north through east. */
  azimuthDeg: number;
  direction: CompassPoint;
  rangeKm: number;
  /** At least half of the Sun's disc seen from the satellite. */
  sunlit: boolean;
  /** Expected V magnitude outside the atmosphere (dimmed in the penumbra); null in the umbra. */
  magnitude: number | null;
}

/** A point of a pass's track across the sky (for charts). */
export interface TrackPoint {
  time: Date;
  /** Apparent altitude, degrees. */
  altitudeDeg: number;
  /** Degrees from north through east. */
  azimuthDeg: number;
  /** At least half of the Sun's disc seen from the satellite. */
  sunlit: boolean;
}

export interface ShadowCrossing {
  kind: 'enters-shadow' | 'leaves-shadow';
  point: PassPoint;
}

export type PassVerdict = 'naked-eye' | 'binoculars' | 'not-visible';
export type PassReason = 'earth-shadow' | 'twilight' | 'moonlight' | 'too-faint';

export const PASS_REASON_TEXT: Record<PassReason, string> = {
  'earth-shadow': "in the Earth's shadow",
  twilight: 'lost in twilight',
  moonlight: 'washed out by moonlight',
  'too-faint': 'too faint',
};

/** How dark the sky is, from the Sun's geometric altitude (USNO twilight definitions). */
export type Darkness = 'night' | 'astronomical-twilight' | 'nautical-twilight' | 'civil-twilight' | 'daylight';

export function darknessOf(sunAltitudeDeg: number): Darkness {
  return sunAltitudeDeg < -18 ? 'night' : sunAltitudeDeg < -12 ? 'astronomical-twilight' : sunAltitudeDeg < -6 ? 'nautical-twilight' : sunAltitudeDeg < -0.833 ? 'civil-twilight' : 'daylight';
}

export interface SatellitePass {
  satellite: { id: string; name: string; noradId: number };
  start: PassPoint;
  culmination: PassPoint;
  end: PassPoint;
  /** The part of the pass where the verdict's instrument shows it, with its best (largest-margin) moment; null when not visible. */
  visible: { start: PassPoint; best: PassPoint; end: PassPoint } | null;
  verdict: PassVerdict;
  /** Why it is not visible; null when it is. */
  reason: PassReason | null;
  /** A naked-eye pass visible for at least a minute: one to recommend to the public. */
  recommended: boolean;
  shadow: ShadowCrossing[];
  /**
   * The track from `start` to `end` in `TRACK_POINTS` equal steps (with the visible part's start,
   * best moment and end and the shadow crossings),
   * for passes with a verdict (seen with the naked eye or binoculars); empty for the others.
   */
  track: TrackPoint[];
  /** The observer's sky at the best moment (or at culmination when not visible). */
  sky: { sunAltitudeDeg: number; darkness: Darkness; limitingMagnitude: number; margin: number };
  elements: { epoch: Date; ageDays: number; source: Place };
}

/** Raises `stale-elements` unless every instant of [ut0, ut1] is within the age limit of the elements. */
export function assertFreshElements(satellite: Satellite, ut0: number, ut1: number): void {
  const epoch = epochUt(satellite.elements);
  if (!elementsCover(satellite, ut0, ut1)) {
    const days = Math.round(Math.max(ut1 - epoch, epoch - ut0));
    throw new GloamingError('stale-elements', `the element set of ${satellite.name} (epoch ${satellite.elements.epoch.toISOString().slice(0, 16)}Z) is ${days} days from the requested dates`, {
      place: satellite.elements.source,
      expected: `elements within ${MAX_ELEMENT_AGE_DAYS} days of every predicted pass`,
      hint: 'refresh the element sets (see docs/deploy.md) or ask for dates nearer the epoch',
    });
  }
}

/** Whether every instant of [ut0, ut1] (UT days) is within the age limit of the satellite's elements. */
export function elementsCover(satellite: Satellite, ut0: number, ut1: number): boolean {
  const epoch = epochUt(satellite.elements);
  return Math.max(Math.abs(ut0 - epoch), Math.abs(ut1 - epoch)) <= MAX_ELEMENT_AGE_DAYS;
}

const SHADOW_HALF = 0.5;
/** Shortest naked-eye sighting worth sending people out for: one minute (common practice). */
const MIN_RECOMMENDED_DAYS = 60 / 86_400;
/** Lit fractions below this count as the umbra for magnitudes (keeps margins finite for the root finder). */
const MIN_LIT = 1e-6;
/** Spacing of the SGP4 nodes that passes are interpolated between (see `StateTrack`). */
const NODE_DAYS = 2 / 1440;
/** The highest point of a pass, to 0.01 s: near the zenith the altitude changes by up to 1°/s. */
const PEAK_TOLERANCE_DAYS = 0.01 / 86_400;
/** Sampling step inside a pass: shadow and visibility crossings closer together than this may merge. */
const PASS_STEP_DAYS = 30 / 86_400;
/** Points of a visible pass's `track`, start to end (a whole-sky chart needs no more for a smooth curve). */
const TRACK_POINTS = 41;
/** Sampling step for the skyline crossings around a highest point. */
const EDGE_STEP_DAYS = 1 / 1440;

/** One site-night's sky for satellites: Sun, Moon and the site's visibility constants. */
class SatelliteNight {
  readonly frame: NightFrame;
  readonly observer: SatelliteObserver;
  readonly site: Site;
  readonly kV: number;
  readonly darkZenithNl: number;
  readonly moonPhaseDeg: number;
  /** The spans of the night when the Sun is down (geometric altitude below −0.833°). */
  readonly darkSpans: readonly { ut0: number; ut1: number }[];

  constructor(site: Site, date: string, observer: SatelliteObserver) {
    this.site = site;
    this.observer = observer;
    const night = nightOf(date, site.timeZone);
    this.frame = new NightFrame(site, night);
    this.kV = extinctionCoefficientGreen(site.elevationM);
    this.darkZenithNl = darkSkyFromQuality(site.sky).zenithNl;
    this.moonPhaseDeg = Astronomy.Illumination(Astronomy.Body.Moon, localMidnight(night)).phase_angle;
    const { ut0, ut1 } = this.frame;
    const f = (ut: number): number => -0.833 - this.frame.sun.at(ut).geometricAltitudeDeg;
    const edges = [ut0, ...findCrossings(f, ut0, ut1).map((c) => c.ut), ut1];
    const spans: { ut0: number; ut1: number }[] = [];
    for (let i = 0; i + 1 < edges.length; i++) {
      if (f((edges[i]! + edges[i + 1]!) / 2) > 0) spans.push({ ut0: edges[i]!, ut1: edges[i + 1]! });
    }
    this.darkSpans = spans;
  }
}

/** Everything about a satellite at one instant that a pass needs. */
interface Sample {
  ut: number;
  look: LookAngles;
  lit: number;
  /** Apparent altitude minus the site's skyline (and minimum altitude) in that direction, degrees. */
  clearanceDeg: number;
}

class SatelliteTrack {
  readonly satellite: Satellite;
  readonly night: SatelliteNight;
  readonly states: StateTrack;
  constructor(satellite: Satellite, night: SatelliteNight) {
    this.satellite = satellite;
    this.night = night;
    this.states = new StateTrack(satellite.elements, { baseUt: night.frame.ut0, nodeDays: NODE_DAYS });
  }

  look(ut: number): LookAngles | null {
    const state = this.states.at(ut);
    return state ? this.night.observer.look(state.positionKm, ut) : null;
  }

  /** Rate of the sine of the altitude (positive while climbing); NaN where SGP4 fails. */
  rate(ut: number): number {
    const state = this.states.at(ut);
    return state ? this.night.observer.altitudeRate(state, ut) : NaN;
  }

  /** Samples of the pass being described, by time: its searches share one grid of instants. */
  readonly #samples = new Map<number, Sample | null>();

  sample(ut: number): Sample | null {
    let s = this.#samples.get(ut);
    if (s === undefined) {
      const look = this.look(ut);
      s = look ? { ut, look, lit: sunlitFraction(look.positionKm, this.night.frame.sun.vectorAt(ut)), clearanceDeg: this.clearanceDeg(look) } : null;
      this.#samples.set(ut, s);
    }
    return s;
  }

  /** Apparent altitude above the site's skyline and minimum altitude in the satellite's direction, degrees. */
  clearanceDeg(look: LookAngles): number {
    const site = this.night.site;
    return look.altitudeDeg - Math.max(site.minAltitudeDeg, skylineAltitudeDeg(site, look.azimuthDeg));
  }

  magnitude(s: Sample): number {
    const sun = this.night.frame.sun.vectorAt(s.ut);
    // Phase angle at the satellite: between the directions to the Sun and to the observer.
    const toObserver: Vec3 = [-s.look.topocentricKm[0], -s.look.topocentricKm[1], -s.look.topocentricKm[2]];
    return satelliteMagnitude({
      standardMagnitude: this.satellite.standardMagnitude,
      rangeKm: s.look.rangeKm,
      phaseAngleDeg: separationDeg(sun, toObserver),
      sunlitFraction: Math.max(MIN_LIT, s.lit),
    });
  }

  /** Visibility margin at `ut` for an instrument (NaN below the skyline); `without` leaves out twilight or the Moon. */
  margin(ut: number, instrument: Instrument, without?: 'twilight' | 'moon'): number {
    const s = this.sample(ut);
    if (!s || s.clearanceDeg < 0) return NaN;
    return this.marginOf(s, instrument, without).margin;
  }

  marginOf(s: Sample, instrument: Instrument, without?: 'twilight' | 'moon'): { margin: number; limitingMagnitude: number; sunAltitudeDeg: number } {
    const frame = this.night.frame;
    const topo = s.look.topocentricKm;
    // Sky brightness takes the apparent (refracted) Sun and Moon (moonlight starts at the apparent moonrise); twilight classes the geometric Sun.
    const sunAlt = frame.sun.at(s.ut).geometricAltitudeDeg;
    const moonAlt = without === 'moon' ? -90 : frame.moon.apparentAltitudeDeg(s.ut);
    const sky = skyBrightness({
      target: { altitudeDeg: s.look.altitudeDeg, sunSeparationDeg: separationDeg(topo, frame.sun.vectorAt(s.ut)), moonSeparationDeg: separationDeg(topo, frame.moon.vectorAt(s.ut)) },
      sun: without === 'twilight' ? { altitudeDeg: -90 } : { altitudeDeg: frame.sun.apparentAltitudeDeg(s.ut), geometricAltitudeDeg: sunAlt },
      moon: { altitudeDeg: moonAlt, phaseAngleDeg: this.night.moonPhaseDeg },
      darkSkyZenithNl: this.night.darkZenithNl,
      kV: this.night.kV,
    });
    const lim = limitingMagnitude({ skyNl: sky.totalNl, instrument });
    return { margin: lim - (this.magnitude(s) + extinctionMag(this.night.kV, s.look.altitudeDeg)), limitingMagnitude: lim, sunAltitudeDeg: sunAlt };
  }

  /** The track from `ut0` to `ut1`: `TRACK_POINTS` equal steps plus the instants `also` (exactly), in time order. */
  track(ut0: number, ut1: number, also: readonly number[]): TrackPoint[] {
    const uts = Array.from({ length: TRACK_POINTS }, (_, i) => ut0 + ((ut1 - ut0) * i) / (TRACK_POINTS - 1));
    uts.push(...also);
    return uts
      .sort((a, b) => a - b)
      .map((ut) => {
        const s = this.sample(ut)!;
        return { time: dateFromUt(ut), altitudeDeg: s.look.altitudeDeg, azimuthDeg: s.look.azimuthDeg, sunlit: s.lit >= SHADOW_HALF };
      });
  }

  point(ut: number): PassPoint {
    const s = this.sample(ut)!;
    const sunlit = s.lit >= SHADOW_HALF;
    return {
      time: dateFromUt(ut),
      altitudeDeg: s.look.altitudeDeg,
      azimuthDeg: s.look.azimuthDeg,
      direction: compass(s.look.azimuthDeg).abbreviation,
      rangeKm: s.look.rangeKm,
      sunlit,
      magnitude: s.lit > MIN_LIT ? this.magnitude(s) : null,
    };
  }

  /**
   * The passes of this satellite inside a dark span. The satellite's highest points are the
   * falling zero crossings of its altitude rate, sampled at a sixth of the orbital period (the
   * rate changes sign twice per orbit, so no highest point can slip between samples) on the
   * track's nodes; around each one that clears the minimum altitude, the crossings of the skyline
   * within the longest possible time above the horizon bound the pass.
   */
  passes(span: { ut0: number; ut1: number }): SatellitePass[] {
    const el = this.satellite.elements;
    const periodDays = 1 / el.meanMotionRevPerDay;
    const step = Math.max(1, Math.floor(periodDays / 6 / NODE_DAYS)) * NODE_DAYS;
    const base = this.night.frame.ut0;
    const a = base + Math.floor((span.ut0 - base) / NODE_DAYS) * NODE_DAYS;
    const b = a + Math.max(1, Math.ceil((span.ut1 - a) / step)) * step;
    const rate = (ut: number): number => this.rate(ut);
    const peaks = findCrossings(rate, a, b, { stepDays: step, toleranceDays: PEAK_TOLERANCE_DAYS, accept: (fa, fb) => fa > 0 && fb <= 0 })
      .map((c) => c.ut)
      .filter((ut) => ut > span.ut0 && ut < span.ut1);
    // A pass already under way at dusk, or still climbing at dawn.
    if (rate(span.ut0) < 0) peaks.unshift(span.ut0);
    if (rate(span.ut1) > 0) peaks.push(span.ut1);
    const halfWindow = longestHalfPassDays(el);
    const clearance = (ut: number): number => {
      const look = this.look(ut);
      return look ? this.clearanceDeg(look) : NaN;
    };
    const out: SatellitePass[] = [];
    let lastEnd = -Infinity;
    for (const peak of peaks) {
      const top = this.look(peak);
      if (!top || top.altitudeDeg < this.night.site.minAltitudeDeg) continue;
      const w0 = Math.max(span.ut0, peak - halfWindow, lastEnd);
      const w1 = Math.min(span.ut1, peak + halfWindow);
      for (const [start, end] of intervalsAbove(clearance, w0, w1, { stepDays: EDGE_STEP_DAYS })) {
        out.push(this.describe(start, end, peak >= start && peak <= end ? peak : null));
        lastEnd = end;
      }
    }
    return out;
  }

  describe(ut0: number, ut1: number, peak: number | null): SatellitePass {
    this.#samples.clear();
    const sat = this.satellite;
    // Near the zenith a low satellite's altitude peaks sharply (up to 1°/s): refine to 0.05 s.
    const culminationUt = peak ?? findMaximum((ut) => this.look(ut)?.altitudeDeg ?? NaN, ut0, ut1, { stepDays: PASS_STEP_DAYS, toleranceDays: 0.05 / 86_400 })?.ut ?? (ut0 + ut1) / 2;
    const start = this.point(ut0);
    const culmination = this.point(culminationUt);
    const end = this.point(ut1);
    const shadow: ShadowCrossing[] = [];
    // A pass lasts minutes of a long orbit: the Earth's shadow is entered or left at most once each.
    const anyLight = start.sunlit || culmination.sunlit || end.sunlit;
    if (anyLight && !(start.sunlit && culmination.sunlit && end.sunlit)) {
      for (const c of findCrossings((ut) => (this.sample(ut)?.lit ?? NaN) - SHADOW_HALF, ut0, ut1, { stepDays: PASS_STEP_DAYS })) {
        shadow.push({ kind: c.direction < 0 ? 'enters-shadow' : 'leaves-shadow', point: this.point(c.ut) });
      }
    }
    const epoch = epochUt(sat.elements);
    const base = {
      satellite: { id: sat.id, name: sat.name, noradId: sat.noradId },
      start,
      culmination,
      end,
      shadow,
      elements: { epoch: sat.elements.epoch, ageDays: culminationUt - epoch, source: sat.elements.source },
    };
    const skyAt = (ut: number, instrument: Instrument): SatellitePass['sky'] => {
      const m = this.marginOf(this.sample(ut)!, instrument);
      return { sunAltitudeDeg: m.sunAltitudeDeg, darkness: darknessOf(m.sunAltitudeDeg), limitingMagnitude: m.limitingMagnitude, margin: m.margin };
    };
    const naked = DEFAULT_INSTRUMENTS['naked-eye'];
    if (!anyLight) {
      return { ...base, visible: null, verdict: 'not-visible', reason: 'earth-shadow', recommended: false, track: [], sky: skyAt(culminationUt, naked) };
    }
    for (const instrument of [naked, DEFAULT_INSTRUMENTS.binoculars]) {
      const f = (ut: number): number => this.margin(ut, instrument);
      const best = findMaximum(f, ut0, ut1, { stepDays: PASS_STEP_DAYS });
      if (!best || !(best.value > 0)) continue;
      let vs = ut0;
      let ve = ut1;
      for (const c of findCrossings(f, ut0, ut1, { stepDays: PASS_STEP_DAYS })) {
        if (c.ut <= best.ut && c.direction > 0) vs = c.ut;
        if (c.ut > best.ut && c.direction < 0 && ve === ut1) ve = c.ut;
      }
      const verdict = instrument.kind === 'naked-eye' ? 'naked-eye' : 'binoculars';
      const recommended = verdict === 'naked-eye' && ve - vs >= MIN_RECOMMENDED_DAYS;
      return { ...base, visible: { start: this.point(vs), best: this.point(best.ut), end: this.point(ve) }, verdict, reason: null, recommended, track: this.track(ut0, ut1, [vs, best.ut, ve, ...shadow.map((c) => utDays(c.point.time))]), sky: skyAt(best.ut, instrument) };
    }
    const visibleWithout = (without: 'twilight' | 'moon'): boolean => (findMaximum((ut) => this.margin(ut, naked, without), ut0, ut1, { stepDays: PASS_STEP_DAYS })?.value ?? -1) > 0;
    const reason: PassReason = visibleWithout('twilight') ? 'twilight' : visibleWithout('moon') ? 'moonlight' : 'too-faint';
    return { ...base, visible: null, verdict: 'not-visible', reason, recommended: false, track: [], sky: skyAt(culminationUt, naked) };
  }
}

/**
 * An upper bound for the time from a satellite's highest point to its setting, days: the time to
 * cover the Earth-central angle between the site and the horizon seen from apogee,
 * arccos(R / r_apogee), at the mean motion, plus a minute.
 */
function longestHalfPassDays(elements: ElementSet): number {
  const n = (elements.meanMotionRevPerDay * 2 * Math.PI) / 86_400;
  const a = Math.cbrt(EARTH_GM_KM3_S2 / (n * n));
  const apogee = a * (1 + elements.eccentricity);
  return (Math.acos(Math.min(1, EARTH_RADIUS_KM / apogee)) / (2 * Math.PI)) / elements.meanMotionRevPerDay + 1 / 1440;
}

/** WGS-72 values, as SGP4 (Vallado et al. 2006). */
const EARTH_GM_KM3_S2 = 398_600.8;
const EARTH_RADIUS_KM = 6378.135;

/** The intervals of [ut0, ut1] where `f` > 0, found with `findCrossings`. */
function intervalsAbove(f: (ut: number) => number, ut0: number, ut1: number, options: { stepDays: number; toleranceDays?: number }): [number, number][] {
  const out: [number, number][] = [];
  let open: number | null = f(ut0) > 0 ? ut0 : null;
  for (const c of findCrossings(f, ut0, ut1, options)) {
    if (c.direction > 0) open = c.ut;
    else if (open !== null) {
      out.push([open, c.ut]);
      open = null;
    }
  }
  if (open !== null && ut1 > open) out.push([open, ut1]);
  return out;
}

export interface PassSearch {
  site: Site;
  satellites: readonly Satellite[];
  /** First and last local evening (YYYY-MM-DD), inclusive: the nights that begin on those dates. */
  from: string;
  to: string;
}

/**
 * All passes of `satellites` over the site during the nights from `from` to `to`, in time order.
 * Refuses (`stale-elements`) a satellite whose elements are too far from those nights (see
 * `passNights` in `nights.ts` for the nights that can be predicted).
 */
export function findPasses(search: PassSearch): SatellitePass[] {
  const { site } = search;
  const observer = new SatelliteObserver(site);
  const nights: SatelliteNight[] = [];
  for (let date = search.from; date <= search.to; date = addDays(date, 1)) nights.push(new SatelliteNight(site, date, observer));
  const first = nights[0]?.frame.ut0 ?? 0;
  const last = nights[nights.length - 1]?.frame.ut1 ?? 0;
  const out: SatellitePass[] = [];
  for (const satellite of search.satellites) {
    assertFreshElements(satellite, first, last);
    for (const night of nights) {
      const track = new SatelliteTrack(satellite, night);
      for (const dark of night.darkSpans) out.push(...track.passes(dark));
    }
  }
  return out.sort((a, b) => a.start.time.getTime() - b.start.time.getTime() || a.satellite.id.localeCompare(b.satellite.id));
}

