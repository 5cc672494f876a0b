/**
 * The command line's JSON shapes. These field names are a public interface (documented in the
 * README): keep them stable, add fields freely.
 */
import type { EventTime } from '../../core/events.ts';
import { MISSING_REASON_TEXT } from '../../core/events.ts';
import { compass } from '../../core/describe.ts';
import type { NightReport } from '../../models/night.ts';
import type { Observation } from '../../core/observe.ts';
import { PHASE_LABEL } from '../../core/moon.ts';
import { formatInstant } from '../../core/time.ts';
import { reasonText, windowEndText, type Visibility } from '../../models/visibility.ts';
import type { WeekReport } from '../../models/week.ts';
import type { GuideResult } from '../../models/stars/guide.ts';

/** Rounds to `digits` decimals, keeping JSON short and deterministic. */
export function round(value: number, digits: number): number {
  const f = 10 ** digits;
  const r = Math.round(value * f) / f;
  return Object.is(r, -0) ? 0 : r;
}

/** The `gloaming position --json` object. */
export function positionJson(o: Observation): Record<string, unknown> {
  const m = o.magnitude;
  return {
    body: o.body.id,
    name: o.body.name,
    at: o.time.date.toISOString(),
    ra: round(o.raHours, 6),
    dec: round(o.decDeg, 5),
    raJ2000: round(o.raJ2000Hours, 6),
    decJ2000: round(o.decJ2000Deg, 5),
    altitude: round(o.altitudeDeg, 4),
    geometricAltitude: round(o.geometricAltitudeDeg, 4),
    azimuth: round(o.azimuthDeg, 4),
    distance: round(o.distanceAu, 9),
    geocentricDistance: round(o.geocentricDistanceAu, 9),
    heliocentricDistance: round(o.heliocentricDistanceAu, 9),
    elongation: round(o.elongationDeg, 4),
    phaseAngle: round(o.phaseAngleDeg, 4),
    illuminatedFraction: round(o.illuminatedFraction, 4),
    magnitude: round(m.value, 2),
    ...(m.brightest !== undefined && m.faintest !== undefined ? { magnitudeRange: [round(m.brightest, 2), round(m.faintest, 2)] } : {}),
    semidiameterArcsec: round(o.semidiameterDeg * 3600, 2),
    constellation: o.constellation,
    direction: compass(o.azimuthDeg).abbreviation,
  };
}

function eventJson(e: EventTime, zone: string): string | null {
  return e.time ? formatInstant(e.time, zone) : null;
}

function reasons(events: Record<string, EventTime>): Record<string, string> | undefined {
  const out: Record<string, string> = {};
  for (const [key, e] of Object.entries(events)) if (e.time === null) out[key] = MISSING_REASON_TEXT[e.reason];
  return Object.keys(out).length ? out : undefined;
}

/** The `gloaming night --json` object. */
export function nightJson(report: NightReport): Record<string, unknown> {
  const zone = report.site.timeZone;
  const s = report.sun;
  const sunEvents = {
    set: s.set,
    civilDusk: s.civilDusk,
    nauticalDusk: s.nauticalDusk,
    astronomicalDusk: s.astronomicalDusk,
    astronomicalDawn: s.astronomicalDawn,
    nauticalDawn: s.nauticalDawn,
    civilDawn: s.civilDawn,
    rise: s.rise,
  };
  const moon = report.moon;
  const moonEvents = { rise: moon.rise, transit: moon.transit, set: moon.set };
  return {
    site: {
      ...(report.site.id !== 'site' ? { id: report.site.id } : {}),
      latitude: report.site.latitudeDeg,
      longitude: report.site.longitudeDeg,
      elevation: report.site.elevationM,
      timeZone: zone,
    },
    date: report.night.date,
    start: formatInstant(report.night.start, zone),
    end: formatInstant(report.night.end, zone),
    sun: {
      ...Object.fromEntries(Object.entries(sunEvents).map(([k, e]) => [k, eventJson(e, zone)])),
      ...(reasons(sunEvents) ? { reasons: reasons(sunEvents) } : {}),
    },
    moon: {
      ...Object.fromEntries(Object.entries(moonEvents).map(([k, e]) => [k, eventJson(e, zone)])),
      phase: moon.phase.name,
      phaseLabel: PHASE_LABEL[moon.phase.name],
      illuminatedFraction: round(moon.phase.illuminatedFraction, 3),
      phaseAngle: round(moon.phase.phaseAngleDeg, 2),
      age: round(moon.phase.ageDays, 2),
      ...(reasons(moonEvents) ? { reasons: reasons(moonEvents) } : {}),
    },
    bodies: report.bodies.map((b) => {
      const events = { rise: b.rise, transit: b.transit, set: b.set };
      return {
        body: b.body.id,
        name: b.body.name,
        rise: eventJson(b.rise, zone),
        transit: eventJson(b.transit, zone),
        set: eventJson(b.set, zone),
        ...(b.transit.time && b.transit.altitudeDeg !== undefined ? { transitAltitude: round(b.transit.altitudeDeg, 2) } : {}),
        ...(reasons(events) ? { reasons: reasons(events) } : {}),
        ...visibilityJson(b.visibility, zone, report.site),
        guide: guideJson(b.guide),
      };
    }),
  };
}

/** The visibility fields of a body's night entry (issue #4 shape). */
export function visibilityJson(v: Visibility, zone: string, site: { minAltitudeDeg: number } = { minAltitudeDeg: 0 }): Record<string, unknown> {
  const b = v.best;
  return {
    best: b
      ? {
          time: formatInstant(b.time, zone),
          altitude: round(b.altitudeDeg, 2),
          azimuth: round(b.azimuthDeg, 2),
          direction: compass(b.azimuthDeg).abbreviation,
          magnitude: round(b.magnitude, 2),
          extinctedMagnitude: round(b.extinctedMagnitude, 2),
          limitingMagnitude: round(b.limitingMagnitude, 2),
          skyBrightness: round(b.skyBrightnessMagArcsec2, 2),
          margin: round(b.margin, 2),
          requiredMargin: round(b.requiredMargin, 2),
        }
      : null,
    window: v.window
      ? { start: formatInstant(v.window.start, zone), end: formatInstant(v.window.end, zone), endReason: v.window.endReason, endsBecause: windowEndText(v.window.endReason) }
      : null,
    verdict: v.verdict,
    instrument: v.instrument?.id ?? null,
    outsideViewingHours: v.outsideViewingHours,
    reason: v.reason ? reasonText(v.reason, site) : null,
    reasonId: v.reason,
  };
}

/** The `gloaming week --json` object: per body, the best night, the week's changes and each night's verdict. */
export function weekJson(report: WeekReport): Record<string, unknown> {
  const zone = report.site.timeZone;
  return {
    site: nightJson(report.nights[0]!).site,
    week: report.week.id,
    nights: report.nights.map((n) => {
      const j = nightJson({ ...n, bodies: [] });
      return { date: n.night.date, sun: j.sun, moon: j.moon };
    }),
    bodies: report.bodies.map((b) => ({
      body: b.body.id,
      name: b.body.name,
      bestNight: b.bestNight,
      magnitude: { first: round(b.magnitude.first, 2), last: round(b.magnitude.last, 2) },
      changes: b.changes,
      moonInterference: b.moonInterference,
      nights: b.nights.map((n) => ({ date: n.date, ...visibilityJson(n.visibility, zone, report.site) })),
    })),
  };
}

/** The `guide` field of a body's night entry, or null when the body is below the horizon. */
export function guideJson(g: GuideResult | null): Record<string, unknown> | null {
  if (!g) return null;
  return {
    kind: g.kind,
    phrase: g.phrase,
    pattern: g.pattern ? { id: g.pattern.id, name: g.pattern.name, ...(g.part ? { part: g.part } : {}) } : null,
    star: g.anchorStar ?? null,
    body: g.anchorBody ?? null,
    separation: g.separationDeg === null ? null : round(g.separationDeg, 2),
    offsetDirection: g.offsetDirection,
    nearestStar: g.nearestStar ? { name: g.nearestStar.name, separation: round(g.nearestStar.separationDeg, 2), phrase: g.nearestStar.phrase } : null,
  };
}
