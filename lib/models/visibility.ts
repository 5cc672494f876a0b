/**
 * What a person will actually see: the best viewing time, the window and a verdict for one
 * body on one night, from the sky-brightness and limiting-magnitude model of `lib/models/sky/`.
 *
 * Definitions (also in the README, "What visible means"):
 * - *margin* (magnitudes) = limiting magnitude at the target's place in the sky and moment
 *   − (the body's magnitude + extinction k·X). Positive: above the 50 % detection threshold of an
 *   observer who knows exactly where to look. Only moments when the body stands above the site's
 *   skyline and its minimum altitude count.
 * - *required margin*: the site's findability margin for the aid (default 1 mag,
 *   `DEFAULT_FINDABILITY_MARGIN_MAG`): verdicts, best times and windows need margin ≥ required margin.
 * - *optics safety*: binoculars and telescopes count only while the Sun's centre is at least
 *   `OPTICS_SUN_DEPRESSION_DEG` below the horizon and at least `OPTICS_SUN_MINUTES` from sunset and
 *   sunrise. The naked eye has no such cut (the daytime Moon and Venus stay; pages show the caution).
 * - *viewing hours*: the site's audience hours; by default `DEFAULT_VIEWING_HOURS` hours from sunset
 *   (from the start of the night's darkest part where the Sun does not set).
 * - *verdict*: the least optical aid (naked eye, then binoculars, then telescope) whose margin
 *   reaches the required margin within the viewing hours; if none, the same search over the rest
 *   of the night (a morning object), flagged `outsideViewingHours`; otherwise `not-visible`.
 * - *best time*: the moment of largest margin above the required margin for the verdict's
 *   instrument within the searched span; the *window* is the continuous span around it where that
 *   stays true, between sunset and sunrise (it may reach outside the viewing hours), and says why it ends.
 * - *reason* (when not visible) is found by asking what would change the answer: too close to the
 *   Sun (< 8° elongation); below the horizon, behind the skyline or under the minimum altitude;
 *   visible only in optics while the Sun is too near; hidden by daylight or lost in twilight
 *   (visible without the Sun's light); washed out by moonlight (visible without the Moon); otherwise too faint.
 */
import { nightMagnitude, type Body } from '../core/body.ts';
import type { SunEvents } from '../core/events.ts';
import type { MoonPhase } from '../core/moon.ts';
import { skylineAltitudeDeg, type InstrumentKind, type Site } from '../core/site.ts';
import { darkSkyFromQuality } from './sky/quality.ts';
import { extinctionCoefficientGreen, extinctionMag } from './sky/extinction.ts';
import { skyBrightness, type SkyBrightness } from './sky/brightness.ts';
import { DEFAULT_INSTRUMENTS, pairResolutionArcsec, type Instrument } from './sky/threshold.ts';
import { objectLimitingMagnitude, visibilityMargin } from './sky/index.ts';
import { findCrossings, findMaximum } from '../core/search.ts';
import { separationDeg } from '../core/geometry.ts';
import { OPTICS_SUN_DEPRESSION_DEG, OPTICS_SUN_MINUTES, TOO_CLOSE_TO_SUN_DEG } from './near-sun.ts';
import { dateFromUt, utDays, type NightFrame, type Track } from '../core/track.ts';
import { addDays, zonedTime, type Night } from '../core/time.ts';
import { wordsFor, type Gender, type Words } from '../core/language/index.ts';

const ENGLISH = wordsFor('en');

/**
 * What the visibility model reads of a night (a `NightReport` of `./night.ts` is one): the site,
 * the night, its shared frame, the Sun's events and the Moon's phase.
 */
export interface NightSky {
  site: Site;
  night: Night;
  frame: NightFrame;
  sun: SunEvents;
  moon: { phase: MoonPhase };
}

/** Default length of the viewing hours, hours from sunset (or from the start of the night's darkest part). */
export const DEFAULT_VIEWING_HOURS = 4;
/** Sampling step of the visibility search, days (5 minutes). */
const STEP_DAYS = 5 / 1440;
const MINUTE_DAYS = 1 / 1440;

export type Verdict = InstrumentKind | 'not-visible';
export type NotVisibleReason =
  | 'below-horizon'
  | 'behind-skyline'
  | 'under-min-altitude'
  | 'too-close-to-sun'
  | 'optics-unsafe'
  | 'daylight'
  | 'twilight'
  | 'moonlight'
  | 'too-faint'
  | 'is-the-sun';

/**
 * Why a not-visible body is not visible, as a phrase in the language of `words` (English by
 * default): "too close to the Sun", "under the site's minimum altitude (10°)" (it names the
 * site's minimum altitude). `gender` makes the words agree with the body in languages that need it
 * ("oculta por la luz del día" for la Luna).
 */
export function reasonText(reason: NotVisibleReason, site: { minAltitudeDeg: number }, words: Words = ENGLISH, gender: Gender = 'masculine'): string {
  return words.t(`reason.${reason}`, { degrees: Math.round(site.minAltitudeDeg), gender });
}

/** The words for a positive verdict, to follow "is": "Jupiter is visible to the naked eye". */
export function verdictWords(verdict: InstrumentKind, words: Words = ENGLISH, gender: Gender = 'masculine'): string {
  return words.t(`verdict.${verdict}`, { gender });
}

/** Why a viewing window ends. */
export type WindowEnd = 'optics-safety' | 'sunrise' | 'dawn' | 'sets' | 'behind-skyline' | 'under-min-altitude' | 'low' | 'moonlight' | 'night-end';

/** Why a window ends, to follow "until HH:MM, when …", in the language of `words`. */
export function windowEndText(end: WindowEnd, words: Words = ENGLISH): string {
  return words.t(`window-end.${end}`);
}

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
  /** Limiting magnitude − extincted magnitude, magnitudes (the 50 % detection margin). */
  margin: number;
  /** The findability margin the site asks for this aid, magnitudes; the verdict needs `margin >= requiredMargin`. */
  requiredMargin: number;
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
  /** The span around the best time where margin ≥ required margin, and why it ends. */
  window: { start: Date; end: Date; endReason: WindowEnd } | null;
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

type Span = { ut0: number; ut1: number };

/**
 * Whether the Moon, up at `ut`, lights the sky overhead at least as much as the twilight does: the
 * zenith's Moon and twilight terms of `skyBrightness` (Krisciunas & Schaefer 1991; Patat et al.
 * 2006). A Moon in a sky still bright from the Sun (a white night, the midnight Sun) does not
 * count; a city's own light does not enter, since a bright Moon is there for its readers too.
 */
export function moonOutshinesTwilight(report: NightSky, ut: number): boolean {
  const frame = report.frame;
  const sunAlt = frame.sun.apparentAltitudeDeg(ut);
  const moonAlt = frame.moon.apparentAltitudeDeg(ut);
  if (moonAlt <= 0) return false;
  const sky = skyBrightness({
    target: { altitudeDeg: 90, sunSeparationDeg: 90 - sunAlt, moonSeparationDeg: 90 - moonAlt },
    sun: { altitudeDeg: sunAlt, geometricAltitudeDeg: frame.sun.at(ut).geometricAltitudeDeg },
    moon: { altitudeDeg: moonAlt, phaseAngleDeg: report.moon.phase.phaseAngleDeg },
    darkSkyZenithNl: darkSkyFromQuality(report.site.sky).zenithNl,
    kV: extinctionCoefficientGreen(report.site.elevationM),
  });
  return sky.moonNl >= sky.twilightNl;
}

/**
 * The viewing hours of a night as UT days: the site's hours; by default `DEFAULT_VIEWING_HOURS` hours from
 * sunset, or, where the Sun does not set this night, from the first of civil, nautical and astronomical dusk,
 * or (no dusk either: polar day or polar night) centred on the darkest moment (the Sun's lowest point).
 * Never empty.
 */
export function viewingSpan(report: NightSky): Span {
  const { site, night, sun, frame } = report;
  const h = site.viewingHours;
  if (h) {
    const at = (minutes: number): number => {
      const day = Math.floor(minutes / 1440);
      const m = minutes - day * 1440;
      return utDays(zonedTime(addDays(night.date, day), Math.floor(m / 60), m % 60, night.timeZone));
    };
    return { ut0: Math.max(frame.ut0, at(h.startMinutes)), ut1: Math.min(frame.ut1, at(h.endMinutes)) };
  }
  const length = DEFAULT_VIEWING_HOURS / 24;
  const start = sun.set.time ?? sun.civilDusk.time ?? sun.nauticalDusk.time ?? sun.astronomicalDusk.time;
  const ut0 = start ? utDays(start) : darkestUt(report) - length / 2;
  const from = Math.max(frame.ut0, Math.min(ut0, frame.ut1 - length));
  return { ut0: from, ut1: from + length };
}

/** The darkest moment of the night (the Sun's lowest geometric altitude), UT days. */
export function darkestUt(report: NightSky): number {
  const { frame } = report;
  return findMaximum((ut) => -frame.sun.at(ut).geometricAltitudeDeg, frame.ut0, frame.ut1, { stepDays: 20 / 1440 })!.ut;
}

/** The sky state of a body at `ut`, or null when it is not above the skyline and minimum altitude. */
interface SkyState {
  altitudeDeg: number;
  azimuthDeg: number;
  sky: SkyBrightness;
  sunSeparationDeg: number;
}

/** What a margin function leaves out or ignores, to find why a body is not visible. */
interface MarginOptions {
  without?: 'twilight' | 'moon';
  /** Count optical aids even with the Sun too near (only to name the reason). */
  ignoreSafety?: boolean;
}

/**
 * What the threshold needs to know of a body's size: a comet's coma diameter (Schaefer's
 * extended-image penalty) or a deep-sky object's area, π a b / 4 (Crumey's extended-object threshold).
 */
function extentOf(body: Body): { comaDiameterArcmin?: number; areaArcmin2?: number } {
  if (body.extentArcmin) return { areaArcmin2: (Math.PI * body.extentArcmin.major * body.extentArcmin.minor) / 4 };
  return body.comaDiameterArcmin ? { comaDiameterArcmin: body.comaDiameterArcmin } : {};
}

/** A per-night evaluator of margins, with the Moon's phase and the body's brightness fixed for the night. */
export class NightVisibility {
  readonly report: NightSky;
  readonly kV: number;
  readonly #darkZenithNl: number;
  readonly #moonPhaseDeg: number;
  /** Sunset + the optics margin and sunrise − the optics margin, UT days (±Infinity when the Sun does not set or rise). */
  readonly #opticsFrom: number;
  readonly #opticsUntil: number;

  constructor(report: NightSky, options: { kV?: number } = {}) {
    this.report = report;
    this.kV = options.kV ?? extinctionCoefficientGreen(report.site.elevationM);
    this.#darkZenithNl = darkSkyFromQuality(report.site.sky).zenithNl;
    this.#moonPhaseDeg = report.moon.phase.phaseAngleDeg;
    const { set, rise } = report.sun;
    this.#opticsFrom = set.time ? utDays(set.time) + OPTICS_SUN_MINUTES * MINUTE_DAYS : -Infinity;
    this.#opticsUntil = rise.time ? utDays(rise.time) - OPTICS_SUN_MINUTES * MINUTE_DAYS : Infinity;
  }

  /** Whether binoculars and telescopes may be recommended at `ut` (see `OPTICS_SUN_DEPRESSION_DEG`). */
  opticsAllowed(ut: number): boolean {
    return ut >= this.#opticsFrom && ut <= this.#opticsUntil && this.report.frame.sun.at(ut).geometricAltitudeDeg <= -OPTICS_SUN_DEPRESSION_DEG;
  }

  /**
   * Sky state at `ut` for a body's track: null when the body is below the skyline or the minimum altitude.
   * With `without`, the twilight or the Moon is left out (for finding why a body is not visible).
   * The Sun's and Moon's apparent altitudes feed the sky brightness; the twilight depression is the Sun's geometric altitude.
   */
  state(track: Track, ut: number, without?: 'twilight' | 'moon'): SkyState | null {
    const site = this.report.site;
    const altitudeDeg = track.apparentAltitudeDeg(ut);
    if (altitudeDeg < site.minAltitudeDeg) return null;
    const p = track.at(ut);
    if (site.horizon.length && altitudeDeg < skylineAltitudeDeg(site, p.azimuthDeg)) return null;
    const frame = this.report.frame;
    const v = track.vectorAt(ut);
    const sunVec = frame.sun.vectorAt(ut);
    const isMoon = track.body.kind === 'moon';
    const noMoon = isMoon || without === 'moon';
    const sunSeparationDeg = separationDeg(v, sunVec);
    const sunGeometric = without === 'twilight' ? -90 : frame.sun.at(ut).geometricAltitudeDeg;
    const sky = skyBrightness({
      target: { altitudeDeg, sunSeparationDeg, moonSeparationDeg: noMoon ? 90 : separationDeg(v, frame.moon.vectorAt(ut)) },
      sun: { altitudeDeg: without === 'twilight' ? -90 : frame.sun.apparentAltitudeDeg(ut), geometricAltitudeDeg: sunGeometric },
      moon: { altitudeDeg: noMoon ? -90 : frame.moon.apparentAltitudeDeg(ut), phaseAngleDeg: this.#moonPhaseDeg },
      darkSkyZenithNl: this.#darkZenithNl,
      kV: this.kV,
    });
    return { altitudeDeg, azimuthDeg: p.azimuthDeg, sky, sunSeparationDeg };
  }

  /**
   * The margin function of a body for an instrument, minus the site's required margin for it: ≥ 0 where the body
   * is recommended. NaN when the body is not up, or for optics while the Sun is too near (unless `ignoreSafety`).
   */
  marginFunction(body: Body, instrument: Instrument, magnitude: number, options: MarginOptions = {}): (ut: number) => number {
    const track = this.report.frame.track(body);
    const extent = extentOf(body);
    const required = this.requiredMargin(instrument);
    const guarded = instrument.kind !== 'naked-eye' && !options.ignoreSafety;
    // A double star counts only in an instrument that shows its two stars apart.
    if (body.pairSeparationArcsec !== undefined && body.pairSeparationArcsec < pairResolutionArcsec(instrument)) return () => -Infinity;
    return (ut) => {
      if (guarded && !this.opticsAllowed(ut)) return NaN;
      const s = this.state(track, ut, options.without);
      if (!s) return NaN;
      return visibilityMargin({ magnitude, altitudeDeg: s.altitudeDeg, kV: this.kV, skyNl: s.sky.totalNl, instrument, ...extent }) - required;
    };
  }

  /** The site's findability margin for an instrument, magnitudes. */
  requiredMargin(instrument: Instrument): number {
    return this.report.site.findabilityMarginMag[instrument.kind];
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
    const spans: { span: Span; outside: boolean }[] = [{ span: hours, outside: false }];
    if (!options.span && rest.ut1 - rest.ut0 > step) spans.push({ span: rest, outside: true });
    for (const { span, outside } of spans) {
      if (span.ut1 <= span.ut0) continue;
      for (const instrument of instruments) {
        const f = this.marginFunction(body, instrument, magnitude);
        const best = findMaximum(f, span.ut0, span.ut1, { stepDays: step });
        if (!best || !(best.value >= 0)) continue;
        const around = { ut0: Math.max(frame.ut0, Math.min(span.ut0, dark.ut0)), ut1: Math.min(frame.ut1, Math.max(span.ut1, dark.ut1)) };
        const window = this.#window(f, best.ut, around, step);
        const endReason = this.#windowEnd(body, instrument, window.ut1, around);
        return {
          verdict: instrument.kind,
          instrument,
          best: this.#moment(body, instrument, magnitude, best.ut),
          window: { start: dateFromUt(window.ut0), end: dateFromUt(window.ut1), endReason },
          outsideViewingHours: outside,
          reason: null,
        };
      }
    }
    const searched = { ut0: hours.ut0, ut1: !options.span && rest.ut1 > hours.ut1 ? rest.ut1 : hours.ut1 };
    return none(this.#reason(body, instruments, magnitude, searched, step));
  }

  #window(f: (ut: number) => number, bestUt: number, span: Span, step: number): Span {
    const g = (ut: number): number => {
      const v = f(ut);
      return Number.isNaN(v) ? -1 : v;
    };
    const before = findCrossings(g, span.ut0, bestUt, { stepDays: step }).filter((c) => c.direction === 1);
    const after = findCrossings(g, bestUt, span.ut1, { stepDays: step }).filter((c) => c.direction === -1);
    return { ut0: before.length ? before[before.length - 1]!.ut : span.ut0, ut1: after.length ? after[0]!.ut : span.ut1 };
  }

  /** Why a window that ends at `endUt` ends: what is different a moment later. */
  #windowEnd(body: Body, instrument: Instrument, endUt: number, span: Span): WindowEnd {
    const { sun, frame } = this.report;
    if (endUt >= span.ut1 - 1e-6) return sun.rise.time && endUt >= utDays(sun.rise.time) - 1e-6 ? 'sunrise' : 'night-end';
    const after = endUt + 0.5 * MINUTE_DAYS;
    if (instrument.kind !== 'naked-eye' && !this.opticsAllowed(after)) return 'optics-safety';
    const track = frame.track(body);
    const site = this.report.site;
    const altitude = track.apparentAltitudeDeg(after);
    if (altitude < 0) return 'sets';
    if (site.horizon.length && altitude < skylineAltitudeDeg(site, track.at(after).azimuthDeg)) return 'behind-skyline';
    if (altitude < site.minAltitudeDeg) return 'under-min-altitude';
    const s = this.state(track, after)!;
    const before = endUt - 10 * MINUTE_DAYS;
    if (frame.sun.at(after).geometricAltitudeDeg > frame.sun.at(before).geometricAltitudeDeg && s.sky.twilightNl > s.sky.darkNl) return 'dawn';
    if (s.sky.moonNl > s.sky.darkNl && s.sky.moonNl > s.sky.twilightNl) return 'moonlight';
    return altitude < track.apparentAltitudeDeg(before) ? 'low' : 'dawn';
  }

  #moment(body: Body, instrument: Instrument, magnitude: number, ut: number): BestMoment {
    const s = this.state(this.report.frame.track(body), ut)!;
    const lim = objectLimitingMagnitude({ skyNl: s.sky.totalNl, instrument, ...extentOf(body) });
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
      requiredMargin: this.requiredMargin(instrument),
      sunSeparationDeg: s.sunSeparationDeg,
      skyParts: { darkNl: s.sky.darkNl, moonNl: s.sky.moonNl, twilightNl: s.sky.twilightNl },
    };
  }

  #reason(body: Body, instruments: Instrument[], magnitude: number, span: Span, step: number): NotVisibleReason {
    const track = this.report.frame.track(body);
    const sun = this.report.frame.sun;
    const site = this.report.site;
    const max = (f: (ut: number) => number): number | null => findMaximum(f, span.ut0, span.ut1, { stepDays: step })?.value ?? null;
    // The smallest angle from the Sun over the searched span, and whether the body is ever up.
    const closest = -max((ut) => -separationDeg(track.vectorAt(ut), sun.vectorAt(ut)))!;
    if (closest < TOO_CLOSE_TO_SUN_DEG) return 'too-close-to-sun';
    if (max((ut) => this.state(track, ut)?.altitudeDeg ?? NaN) === null) {
      if (max((ut) => track.apparentAltitudeDeg(ut))! < 0) return 'below-horizon';
      if (site.horizon.length && max((ut) => track.apparentAltitudeDeg(ut) - skylineAltitudeDeg(site, track.at(ut).azimuthDeg))! < 0) return 'behind-skyline';
      return 'under-min-altitude';
    }
    const visible = (options: MarginOptions): boolean =>
      instruments.some((instrument) => (max(this.marginFunction(body, instrument, magnitude, options)) ?? -1) >= 0);
    if (visible({ ignoreSafety: true })) return 'optics-unsafe';
    const withoutSun = instruments
      .map((instrument) => findMaximum(this.marginFunction(body, instrument, magnitude, { without: 'twilight', ignoreSafety: true }), span.ut0, span.ut1, { stepDays: step }))
      .find((m) => m && m.value >= 0);
    if (withoutSun) return sun.at(withoutSun.ut).geometricAltitudeDeg > 0 ? 'daylight' : 'twilight';
    if (visible({ without: 'moon', ignoreSafety: true })) return 'moonlight';
    return 'too-faint';
  }
}
