/**
 * The "next few nights" panel: for each evening, sunset, the start of darkness and the Moon, as
 * plain serialisable rows (the content layer stores them). Values come from `computeNight`; this
 * module only chooses which events to show and words them for a reader outside.
 */
import { computeNight, type NightReport } from '../../lib/models/night.ts';
import { printedLitFraction } from '../../lib/core/moon.ts';
import type { EventTime } from '../../lib/core/events.ts';
import type { Site } from '../../lib/core/site.ts';
import { wordsFor, type MessageKey } from '../../lib/core/language/index.ts';
import { addDays, formatClock, formatInstant, zonedTime } from '../../lib/core/time.ts';
import type { NightRowEntry as NightRow, ShownTimeEntry as ShownTime } from './schema.ts';

/** One shown time and one row of the panel: their shapes are the schemas' (schema.ts). */
export type { NightRow, ShownTime };
import { passNights, recommendedPasses, type PassNight } from '../../lib/models/satellite/nights.ts';
import type { Satellite } from '../../lib/models/satellite/passes.ts';
import { passWords } from '../../lib/models/satellite/words.ts';

/** "Fri 4 Dec" for a local date, in the site's locale (the date is a calendar date; no zone shift). */
export function dayLabel(date: string, locale: string): string {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Intl.DateTimeFormat(locale, { timeZone: 'UTC', weekday: 'short', day: 'numeric', month: 'short' }).format(
    new Date(Date.UTC(y, m - 1, d, 12)),
  );
}

function shown(event: EventTime, site: Site, missing: Readonly<Record<string, MessageKey>>): ShownTime {
  if (event.time) return { datetime: formatInstant(event.time, site.timeZone), text: formatClock(event.time, site) };
  return { datetime: null, text: wordsFor(site.locale).t(missing[event.reason] ?? 'ui.not-tonight') };
}

const SUNSET_MISSING = { 'always-below': 'ui.sun-stays-down', 'always-above': 'ui.sun-stays-up', 'outside-night': 'ui.no-sunset' } as const;
const DUSK_MISSING = { 'stays-above': 'ui.never-dark', 'stays-below': 'ui.dark-all-day', 'outside-night': 'ui.not-tonight' } as const;
const MOON_MISSING = { 'always-above': 'ui.moon-up-all-night', 'always-below': 'ui.moon-down-all-night', 'outside-night': 'ui.not-tonight' } as const;

/**
 * Whether the Moon is above the horizon at `at`, from the night's first moonrise and moonset
 * (noon to noon): the latest of them before `at` decides; with none before, the next one does
 * (a set next means it is up now); with neither, the missing-event reasons do.
 */
export function moonUpAt(report: NightReport, at: Date): boolean {
  const { rise, set } = report.moon;
  const t = at.getTime();
  const r = rise.time?.getTime();
  const s = set.time?.getTime();
  const before = [r !== undefined && r <= t ? { up: true, at: r } : null, s !== undefined && s <= t ? { up: false, at: s } : null].filter((x) => x !== null);
  if (before.length) return before.sort((a, b) => b.at - a.at)[0]!.up;
  const after = [r !== undefined ? { up: false, at: r } : null, s !== undefined ? { up: true, at: s } : null].filter((x) => x !== null);
  if (after.length) return after.sort((a, b) => a.at - b.at)[0]!.up;
  return rise.reason === 'always-above' || set.reason === 'always-above';
}

/** The moment the evening starts for the Moon summary: sunset, else civil dusk, else 18:00 local. */
function duskOf(report: NightReport): Date {
  return report.sun.set.time ?? report.sun.civilDusk.time ?? zonedTime(report.night.date, 18, 0, report.site.timeZone);
}

function moonSummary(report: NightReport): NightRow['moon'] {
  const dusk = duskOf(report);
  const up = moonUpAt(report, dusk);
  const next = up ? report.moon.set : report.moon.rise;
  const w = wordsFor(report.site.locale);
  if (next.time && next.time > dusk) return { verb: w.t(up ? 'ui.moon-sets' : 'ui.moon-rises'), time: shown(next, report.site, {}) };
  return { verb: w.t(up ? 'ui.moon-up-all-night' : 'ui.moon-down-all-night'), time: null };
}

/** A night's satellite passes as the tonight card shows them (lib/satellite/nights.ts). */
export function passesRow(night: PassNight, site: Site, followed: number): NightRow['passes'] {
  if (followed === 0) return null;
  const words = passWords(wordsFor(site.locale));
  const items = recommendedPasses([night]).map((p) => ({ time: shown({ time: p.visible!.start.time }, site, {}), text: words.short(p) }));
  if (items.length) return { items, text: null };
  return { items, text: night.unavailable.length === followed ? words.unavailableShort : words.noneTonight };
}

/** One row from a computed night (and its satellite passes, when given). */
export function nightRow(report: NightReport, passes: NightRow['passes'] = null): NightRow {
  const site = report.site;
  return {
    date: report.night.date,
    label: dayLabel(report.night.date, site.locale),
    sunset: shown(report.sun.set, site, SUNSET_MISSING),
    nauticalDusk: shown(report.sun.nauticalDusk, site, DUSK_MISSING),
    darkness: shown(report.sun.astronomicalDusk, site, DUSK_MISSING),
    moonrise: shown(report.moon.rise, site, MOON_MISSING),
    moonset: shown(report.moon.set, site, MOON_MISSING),
    moon: moonSummary(report),
    moonPhase: report.moon.phase.name,
    // As beside the phase's name in bulletins: a crescent is never 0% lit, a gibbous Moon never 100%.
    moonLitPercent: Math.round(printedLitFraction(report.moon.phase) * 100),
    passes,
  };
}

/**
 * The `count` nights starting on the evening of `today` (local date) at `site`; the first
 * (tonight) with the passes of `satellites`.
 */
export function nextNights(site: Site, today: string, count: number, satellites: readonly Satellite[] = []): NightRow[] {
  const tonight = passNights({ site, satellites, from: today, to: today })[0]!;
  return Array.from({ length: count }, (_, i) => nightRow(computeNight(site, addDays(today, i), []), i === 0 ? passesRow(tonight, site, satellites.length) : null));
}
