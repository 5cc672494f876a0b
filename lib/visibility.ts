/**
 * What a person will actually see: the best viewing time, the window and a verdict for one
 * body on one night, from the sky-brightness and limiting-magnitude model of `lib/sky/`.
 *
 * Definitions (also in the README):
 * - *margin* (magnitudes) = limiting magnitude at the target's place in the sky and moment
 *   − (the body's magnitude + extinction k·X). Positive: visible with that instrument.
 *   Only moments when the body stands above the site's skyline and its minimum altitude count.
 * - *viewing hours*: the site's audience hours, or by default sunset to local midnight.
 * - *verdict*: the least optical aid (naked eye, then binoculars, then telescope) whose margin
 *   becomes positive within the viewing hours; if none, the same search over the rest of the
 *   night (a morning object), flagged `outsideViewingHours`; otherwise `not-visible`.
 * - *best time*: the moment of largest margin for the verdict's instrument within the searched
 *   span; the *window* is the continuous span around it where that margin stays positive, between
 *   sunset and sunrise (it may reach outside the viewing hours: a comet visible from dusk is not
 *   "findable from 19:00").
 * - *reason* (when not visible) is found by asking what would change the answer: below the
 *   horizon; too close to the Sun (< 8° elongation); hidden by daylight or lost in twilight
 *   (visible without the Sun's light; daylight when the Sun is up at the moment it would be
 *   best seen); washed out by moonlight (visible without the Moon); otherwise too faint.
 */
import type { Body } from './body.ts';
import { nightMagnitude, type NightReport } from './night.ts';
import { skylineAltitudeDeg, type Site } from './site.ts';
import { darkSkyFromQuality } from './sky/quality.ts';
import { extinctionCoefficientGreen, extinctionMag } from './sky/extinction.ts';
import { skyBrightness, type SkyBrightness } from './sky/brightness.ts';
import { limitingMagnitude, DEFAULT_INSTRUMENTS, type Instrument, type InstrumentKind } from './sky/threshold.ts';
import { findCrossings, findMaximum } from './search.ts';
import { dateFromUt, separationDeg, utDays, type Track } from './track.ts';
import { addDays, localMidnight, zonedTime } from './time.ts';

/** Below this elongation a body is reported as too close to the Sun, degrees (near conjunction). */
export const TOO_CLOSE_TO_SUN_DEG = 8;
/** Sampling step of the visibility search, days (5 minutes). */
const STEP_DAYS = 5 / 1440;

export type Verdict = InstrumentKind | 'not-visible';
export type NotVisibleReason = 'below-horizon' | 'too-close-to-sun' | 'daylight' | 'twilight' | 'moonlight' | 'too-faint' | 'is-the-sun';

export const REASON_TEXT: Record<NotVisibleReason, string> = {
  'below-horizon': 'below the horizon',
  'too-close-to-sun': 'too close to the Sun',
  daylight: 'hidden by daylight',
  twilight: 'lost in twilight',
  moonlight: 'washed out by moonlight',
  'too-faint': 'too faint',
  'is-the-sun': 'the Sun is never a target: never look at it directly',
};

/** The state of the sky at the best moment. */
export interface BestMoment {
  time: Date;
  /** Apparent (refracted) altitude, degrees. */
  altitudeDeg: number;
  azimuthDeg: number;
  /** Magnitude outside the atmosphere, V. */
  magnitude: number;
  /** Magnitude after extinction, V. */
  extinctedMagnitude: number;
  /** Limiting magnitude for the verdict's instrument at that place and moment. */
  limitingMagnitude: number;
  /** Sky brightness at the target, V mag/arcsec². */
  skyBrightnessMagArcsec2: number;
  margin: number;
  /** Angle from the Sun at that moment, degrees. */
  sunSeparationDeg: number;
  /** The sky brightness's parts at the target, nL: night sky, moonlight, twilight. */
  skyParts: { darkNl: number; moonNl: number; twilightNl: number };
}

export interface Visibility {
  verdict: Verdict;
  /** Which instrument the best time and window refer to (null when not visible). */
  instrument: Instrument | null;
  best: BestMoment | null;
  window: { start: Date; end: Date } | null;
  /** True when the body is only visible outside the audience's viewing hours. */
  outsideViewingHours: boolean;
  reason: NotVisibleReason | null;
}

export interface VisibilityOptions {
  /** Instruments to try, least optical aid first. Default: naked eye, 10×50 binoculars, 100 mm telescope. */
  instruments?: Instrument[];
  /** V extinction coefficient override, mag/airmass (default: Green 1992 from the site's elevation). */
  kV?: number;
  /** Search span override (UT days); default the site's viewing hours. */
  span?: { ut0: number; ut1: number };
  /** Sampling step of the search, days (default 5 minutes); refinement makes results independent of it. */
  stepDays?: number;
}

/** The viewing hours of a night as UT days: the site's hours, or sunset to local midnight. */
export function viewingSpan(report: NightReport): { ut0: number; ut1: number } {
  const { site, night } = report;
  const h = site.viewingHours;
  if (h) {
    const at = (minutes: number): number => {
      const day = Math.floor(minutes / 1440);
      const m = minutes - day * 1440;
      return utDays(zonedTime(addDays(night.date, day), Math.floor(m / 60), m % 60, night.timeZone));
    };
    return { ut0: Math.max(report.frame.ut0, at(h.startMinutes)), ut1: Math.min(report.frame.ut1, at(h.endMinutes)) };
  }
  const sunset = report.sun.set.time;
  // Polar night: no sunset → from the end of civil dusk, or from 18:00 local, to midnight.
  const start = sunset ?? report.sun.civilDusk.time ?? zonedTime(night.date, 18, 0, night.timeZone);
  return { ut0: utDays(start), ut1: utDays(localMidnight(night)) };
}


/** The sky state of a body at `ut`, or null when it is not above the skyline and minimum altitude. */
interface SkyState {
  altitudeDeg: number;
  azimuthDeg: number;
  sky: SkyBrightness;
  sunSeparationDeg: number;
}

/** A per-night evaluator of margins, with the Moon's phase and the body's brightness fixed for the night. */
export class NightVisibility {
  readonly report: NightReport;
  readonly kV: number;
  readonly #darkZenithNl: number;
  readonly #moonPhaseDeg: number;

  constructor(report: NightReport, options: { kV?: number } = {}) {
    this.report = report;
    this.kV = options.kV ?? extinctionCoefficientGreen(report.site.elevationM);
    this.#darkZenithNl = darkSkyFromQuality(report.site.sky).zenithNl;
    this.#moonPhaseDeg = report.moon.phase.phaseAngleDeg;
  }

  /**
   * Sky state at `ut` for a body's track: null when the body is below the skyline or the minimum altitude.
   * With `without`, the twilight or the Moon is left out (for finding why a body is not visible).
   */
  state(track: Track, ut: number, without?: 'twilight' | 'moon'): SkyState | null {
    const site: Site = this.report.site;
    const p = track.at(ut);
    const altitudeDeg = track.apparentAltitudeDeg(ut);
    if (altitudeDeg < Math.max(site.minAltitudeDeg, skylineAltitudeDeg(site, p.azimuthDeg))) return null;
    const frame = this.report.frame;
    const v = track.vectorAt(ut);
    const sunVec = frame.sun.vectorAt(ut);
    const sunAlt = frame.sun.at(ut).geometricAltitudeDeg;
    const isMoon = track.body.kind === 'moon';
    const moonVec = frame.moon.vectorAt(ut);
    const moonAlt = isMoon || without === 'moon' ? -90 : frame.moon.at(ut).geometricAltitudeDeg;
    const sunSeparationDeg = separationDeg(v, sunVec);
    const sky = skyBrightness({
      target: { altitudeDeg, sunSeparationDeg, moonSeparationDeg: isMoon ? 90 : separationDeg(v, moonVec) },
      sun: { altitudeDeg: without === 'twilight' ? -90 : sunAlt },
      moon: { altitudeDeg: moonAlt, phaseAngleDeg: this.#moonPhaseDeg },
      darkSkyZenithNl: this.#darkZenithNl,
      kV: this.kV,
    });
    return { altitudeDeg, azimuthDeg: p.azimuthDeg, sky, sunSeparationDeg };
  }

  /** The margin function of a body for an instrument (NaN when the body is not up). */
  marginFunction(body: Body, instrument: Instrument, magnitude: number, without?: 'twilight' | 'moon'): (ut: number) => number {
    const track = this.report.frame.track(body);
    const coma = body.comaDiameterArcmin;
    return (ut) => {
      const s = this.state(track, ut, without);
      if (!s) return NaN;
      const lim = limitingMagnitude({ skyNl: s.sky.totalNl, instrument, ...(coma ? { comaDiameterArcmin: coma } : {}) });
      return lim - (magnitude + extinctionMag(this.kV, s.altitudeDeg));
    };
  }

  /** Best time, window and verdict for `body` on this night. */
  visibility(body: Body, options: VisibilityOptions = {}): Visibility {
    const none = (reason: NotVisibleReason): Visibility => ({ verdict: 'not-visible', instrument: null, best: null, window: null, outsideViewingHours: false, reason });
    if (body.kind === 'sun') return none('is-the-sun');
    const step = options.stepDays ?? STEP_DAYS;
    const instruments = options.instruments ?? [DEFAULT_INSTRUMENTS['naked-eye'], DEFAULT_INSTRUMENTS.binoculars, DEFAULT_INSTRUMENTS.telescope];
    const frame = this.report.frame;
    const hours = options.span ?? viewingSpan(this.report);
    const magnitude = nightMagnitude(this.report.night, body).value;
    // The rest of the night: from the end of the viewing hours to sunrise (or the night's end).
    const sunrise = this.report.sun.rise.time;
    const rest = { ut0: hours.ut1, ut1: sunrise ? utDays(sunrise) : frame.ut1 };
    // Windows may extend beyond the viewing hours, but not into daylight: sunset to sunrise.
    const sunset = this.report.sun.set.time;
    const dark = { ut0: sunset ? utDays(sunset) : frame.ut0, ut1: rest.ut1 };
    const spans: { span: { ut0: number; ut1: number }; outside: boolean }[] = [{ span: hours, outside: false }];
    if (!options.span && rest.ut1 - rest.ut0 > step) spans.push({ span: rest, outside: true });
    for (const { span, outside } of spans) {
      if (span.ut1 <= span.ut0) continue;
      for (const instrument of instruments) {
        const f = this.marginFunction(body, instrument, magnitude);
        const best = findMaximum(f, span.ut0, span.ut1, { stepDays: step });
        if (!best || !(best.value > 0)) continue;
        const window = this.#window(f, best.ut, { ut0: Math.min(span.ut0, dark.ut0), ut1: Math.max(span.ut1, dark.ut1) }, step);
        return { verdict: instrument.kind, instrument, best: this.#moment(body, instrument, magnitude, best.ut), window, outsideViewingHours: outside, reason: null };
      }
    }
    const searched = { ut0: hours.ut0, ut1: !options.span && rest.ut1 > hours.ut1 ? rest.ut1 : hours.ut1 };
    return none(this.#reason(body, instruments, magnitude, searched, step));
  }

  #window(f: (ut: number) => number, bestUt: number, span: { ut0: number; ut1: number }, step: number): { start: Date; end: Date } {
    const g = (ut: number): number => {
      const v = f(ut);
      return Number.isNaN(v) ? -1 : v;
    };
    const before = findCrossings(g, span.ut0, bestUt, { stepDays: step }).filter((c) => c.direction === 1);
    const after = findCrossings(g, bestUt, span.ut1, { stepDays: step }).filter((c) => c.direction === -1);
    const start = before.length ? before[before.length - 1]!.ut : span.ut0;
    const end = after.length ? after[0]!.ut : span.ut1;
    return { start: dateFromUt(start), end: dateFromUt(end) };
  }

  #moment(body: Body, instrument: Instrument, magnitude: number, ut: number): BestMoment {
    const s = this.state(this.report.frame.track(body), ut)!;
    const coma = body.comaDiameterArcmin;
    const lim = limitingMagnitude({ skyNl: s.sky.totalNl, instrument, ...(coma ? { comaDiameterArcmin: coma } : {}) });
    const extincted = magnitude + extinctionMag(this.kV, s.altitudeDeg);
    return {
      time: dateFromUt(ut),
      altitudeDeg: s.altitudeDeg,
      azimuthDeg: s.azimuthDeg,
      magnitude,
      extinctedMagnitude: extincted,
      limitingMagnitude: lim,
      skyBrightnessMagArcsec2: s.sky.magPerArcsec2,
      margin: lim - extincted,
      sunSeparationDeg: s.sunSeparationDeg,
      skyParts: { darkNl: s.sky.darkNl, moonNl: s.sky.moonNl, twilightNl: s.sky.twilightNl },
    };
  }

  #reason(body: Body, instruments: Instrument[], magnitude: number, span: { ut0: number; ut1: number }, step: number): NotVisibleReason {
    const track = this.report.frame.track(body);
    const sun = this.report.frame.sun;
    // The smallest angle from the Sun over the searched span, and whether the body is ever up.
    const closest = -findMaximum((ut) => -separationDeg(track.vectorAt(ut), sun.vectorAt(ut)), span.ut0, span.ut1, { stepDays: step })!.value;
    if (closest < TOO_CLOSE_TO_SUN_DEG) return 'too-close-to-sun';
    const up = findMaximum((ut) => this.state(track, ut)?.altitudeDeg ?? NaN, span.ut0, span.ut1, { stepDays: step });
    if (!up) return 'below-horizon';
    const best = instruments[instruments.length - 1]!;
    const visibleWithout = (without: 'twilight' | 'moon'): { ut: number } | null => {
      const m = findMaximum(this.marginFunction(body, best, magnitude, without), span.ut0, span.ut1, { stepDays: step });
      return m && m.value > 0 ? m : null;
    };
    const withoutSun = visibleWithout('twilight');
    if (withoutSun) return this.report.frame.sun.at(withoutSun.ut).geometricAltitudeDeg > 0 ? 'daylight' : 'twilight';
    if (visibleWithout('moon')) return 'moonlight';
    return 'too-faint';
  }
}
