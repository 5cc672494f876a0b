/**
 * `gloaming passes`: satellite passes over a site (lib/models/satellite), as text or JSON. Wrong input
 * raises `GloamingError` (the command line maps it to exit code 2).
 */
import { parseArgs } from 'node:util';
import { resolve } from 'node:path';
import { didYouMean, GloamingError } from '../../core/errors.ts';
import { loadSatellites } from '../../models/satellite/catalogue.ts';
import { findPasses, PASS_REASON_TEXT, type PassPoint, type SatellitePass } from '../../models/satellite/passes.ts';
import { addDays, formatClock, formatInstant, parseInstant, parseLocalDate } from '../../core/time.ts';
import { eventsToICalendar } from '../almanac/ical.ts';
import { passEvent } from '../almanac/satellite-passes.ts';
import { argumentError, joinNegativeNumbers, requireFlag, siteFromFlags, SITE_RANGE_OPTIONS } from './args.ts';
import { round } from './format.ts';

export const PASSES_HELP = `gloaming passes — satellite passes over a site: when, where, how bright, visible or not

Usage: gloaming passes (--site <id> | --lat <deg> --lon <deg> [--elevation <m>] --tz <zone> [--sky …])
                       --from <YYYY-MM-DD> [--to <YYYY-MM-DD>] [--satellite <id> ...] [--all] [--json]

  --site <id>          a site from content/sites/ (its skyline and minimum altitude apply)
  --lat, --lon         latitude (degrees north) and longitude (degrees east), with --tz
  --elevation <m>      height above sea level, metres (default 0)
  --tz <zone>          IANA time zone, e.g. Europe/London
  --sky <quality>      the site's dark sky: bortle:<n>, sqm:<x> or nelm:<x> (default bortle:5)
  --from <date>        first local evening, YYYY-MM-DD (the nights that begin on these evenings)
  --to <date>          last local evening, inclusive (default: six days after --from, one week)
  --satellite <id>     repeatable; only these satellites from content/satellites/satellites.yaml
  --all                also list passes that cannot be seen (in the Earth's shadow, too faint …)
  --content <dir>      content folder (default ./content); satellites come from its satellites/
  --json               print { passes: [{ satellite, start, culmination, end, visible, verdict, … }] }
  --ics                print an iCalendar (RFC 5545) feed of the naked-eye passes instead
  --now <instant>      build instant for the feed's DTSTAMP (default: 00:00 UTC of --from)

Only passes a member of the public can see with the naked eye are listed unless --all is given.
Element sets more than 14 days from a pass are refused: refresh them first.`;

const OPTIONS = {
  ...SITE_RANGE_OPTIONS,
  satellite: { type: 'string', multiple: true },
  all: { type: 'boolean' },
} as const;

function pointJson(p: PassPoint, zone: string): Record<string, unknown> {
  return {
    time: formatInstant(p.time, zone),
    altitude: round(p.altitudeDeg, 1),
    azimuth: round(p.azimuthDeg, 1),
    direction: p.direction,
    range: Math.round(p.rangeKm),
    sunlit: p.sunlit,
    magnitude: p.magnitude === null ? null : round(p.magnitude, 1),
  };
}

/** One pass as the command's JSON (a public shape: keep these names). */
export function passJson(p: SatellitePass, zone: string): Record<string, unknown> {
  return {
    satellite: { id: p.satellite.id, name: p.satellite.name, norad: p.satellite.noradId },
    start: pointJson(p.start, zone),
    culmination: pointJson(p.culmination, zone),
    end: pointJson(p.end, zone),
    visible: p.visible ? { start: pointJson(p.visible.start, zone), best: pointJson(p.visible.best, zone), end: pointJson(p.visible.end, zone) } : null,
    verdict: p.verdict,
    reason: p.reason,
    recommended: p.recommended,
    shadow: p.shadow.map((s) => ({ kind: s.kind, ...pointJson(s.point, zone) })),
    sky: { sunAltitude: round(p.sky.sunAltitudeDeg, 1), darkness: p.sky.darkness, limitingMagnitude: round(p.sky.limitingMagnitude, 1), margin: round(p.sky.margin, 1) },
    elements: { epoch: p.elements.epoch.toISOString(), ageDays: round(p.elements.ageDays, 2), file: p.elements.source.file ?? null, line: p.elements.source.line ?? null },
  };
}

/** The element set's age at the pass, in words. */
function ageText(days: number): string {
  const d = Math.abs(round(days, 1));
  return days >= 0 ? `elements ${d} days old` : `elements dated ${d} days after the pass`;
}

/** Runs `gloaming passes` with `args` (without the command name), writing to `out`. */
export function runPasses(args: string[], out: (s: string) => void): void {
  const { values } = parseArgs({ args: joinNegativeNumbers(args), options: OPTIONS, strict: true });
  if (values.help) return out(PASSES_HELP);
  const site = siteFromFlags(values, { needZone: true });
  const from = requireFlag(values.from, '--from', 'the first local evening, YYYY-MM-DD');
  parseLocalDate(from, '--from');
  const to = values.to ?? addDays(from, 6);
  parseLocalDate(to, '--to');
  if (to < from) throw argumentError('--to', 'is before --from', `a date on or after ${from}`, to);
  if (addDays(from, 31) < to) throw argumentError('--to', 'the range is longer than 31 nights', `a date up to ${addDays(from, 31)}`, to);
  const dir = resolve(String(values.content ?? 'content'), 'satellites');
  let satellites = loadSatellites(dir);
  if (values.satellite) {
    const ids = satellites.map((s) => s.id);
    for (const id of values.satellite) {
      if (!ids.includes(id)) {
        const hint = didYouMean(id, ids);
        throw new GloamingError('invalid-argument', 'unknown satellite', { place: { field: '--satellite' }, actual: id, expected: `one of ${ids.join(', ') || '(none: add content/satellites/satellites.yaml)'}`, ...(hint ? { hint } : {}) });
      }
    }
    satellites = satellites.filter((s) => values.satellite!.includes(s.id));
  }
  const zone = site.timeZone;
  const all = findPasses({ site, satellites, from, to });
  const passes = values.all ? all : all.filter((p) => p.recommended);
  if (values.json && values.ics) throw argumentError('--ics', '--json and --ics exclude each other', 'one output format');
  if (values.ics) {
    // DTSTAMP: --now, or 00:00 UTC of --from, so the same command writes the same feed (lib never reads the clock).
    const now = values.now !== undefined ? parseInstant(values.now, '--now') : new Date(`${from}T00:00:00Z`);
    const events = all.filter((p) => p.recommended).map((p) => passEvent(p, site));
    return out(eventsToICalendar(events, { site, prodId: '-//gloaming//satellite passes//EN', now, name: `Satellite passes · ${site.name}` }).replace(/\r\n$/, ''));
  }
  if (values.json) {
    return out(
      JSON.stringify(
        {
          site: { ...(site.id !== 'site' ? { id: site.id } : {}), latitude: site.latitudeDeg, longitude: site.longitudeDeg, elevation: site.elevationM, timeZone: zone },
          from,
          to,
          passes: passes.map((p) => passJson(p, zone)),
        },
        null,
        2,
      ),
    );
  }
  const clock = (d: Date): string => formatClock(d, site);
  const where = (p: PassPoint): string => `${p.direction} ${Math.round(p.altitudeDeg)}°`;
  const lines = [`Satellite passes ${from} – ${to} at ${site.name} (${zone})${values.all ? '' : ', naked-eye passes only'}`];
  for (const p of passes) {
    const day = formatInstant(p.start.time, zone).slice(0, 10);
    const span = p.visible ?? { start: p.start, best: p.culmination, end: p.end };
    const seen = p.visible ? `${p.verdict === 'naked-eye' ? 'naked eye' : 'binoculars'}, magnitude ${round(p.visible.best.magnitude!, 1)}` : `not visible: ${PASS_REASON_TEXT[p.reason!]}`;
    const shadow = p.shadow.map((s) => `; ${s.kind === 'enters-shadow' ? 'fades into the Earth’s shadow' : 'leaves the Earth’s shadow'} at ${clock(s.point.time)} (${where(s.point)})`).join('');
    lines.push(`${day} ${clock(span.start.time)}–${clock(span.end.time)}  ${p.satellite.name}: ${where(span.start)} → highest ${where(p.culmination)} → ${where(span.end)}; ${seen}${shadow}; ${ageText(p.elements.ageDays)}`);
  }
  if (passes.length === 0) lines.push(values.all ? 'No passes in this range.' : 'No naked-eye passes in this range (--all lists the others).');
  out(lines.join('\n'));
}
