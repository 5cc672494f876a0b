/**
 * `gloaming events`: the events of a date range for one site (lib/outputs/almanac), as text, JSON or an
 * iCalendar feed. Wrong input raises `GloamingError` (the command line maps it to exit code 2).
 */
import { parseArgs } from 'node:util';
import { resolve } from 'node:path';
import { BodyRegistry } from '../../core/body.ts';
import { loadBodies } from '../../models/content.ts';
import { GloamingError } from '../../core/errors.ts';
import { argumentError, joinNegativeNumbers, siteFromFlags, SITE_RANGE_OPTIONS } from './args.ts';
import { addDays, formatInstant, parseInstant, parseLocalDate, roundInstant, zonedTime } from '../../core/time.ts';
import { EVENT_TYPES, eventsToICalendar, findEvents, hiddenNote, type AlmanacEvent, type AlmanacEventType } from '../almanac/index.ts';
import { round } from './format.ts';
import { loadSatellites } from '../../models/satellite/catalogue.ts';

export const EVENTS_HELP = `gloaming events — the sky's events for a site: Moon phases, close approaches, oppositions,
elongations, meteor showers, eclipses, equinoxes and solstices, comet events

Usage: gloaming events (--site <id> | --lat <deg> --lon <deg> [--elevation <m>] --tz <zone>)
                       --from <YYYY-MM-DD> [--to <YYYY-MM-DD>] [--order time|interest]
                       [--type <id> ...] [--sky bortle:<n>|sqm:<x>|nelm:<x>] [--json | --ics [--now <instant>]]

  --site <id>         a site from content/sites/
  --lat, --lon        latitude (degrees north) and longitude (degrees east), with --tz
  --elevation <m>     height above sea level, metres (default 0)
  --tz <zone>         IANA time zone, e.g. Europe/London
  --sky <quality>     the site's dark sky for meteor counts (coordinate form; default bortle:5)
  --from <date>       first local date, YYYY-MM-DD (from local midnight)
  --to <date>         last local date, inclusive (default: six days after --from, one week)
  --order <how>       time (default) or interest (most interesting first)
  --type <id>         repeatable; only these event types:
                      ${EVENT_TYPES.join(', ')}
  --content <dir>     content folder (default ./content); comets and asteroids come from its objects/,
                      satellites (naked-eye passes only) from its satellites/
  --json              print { events: [{ type, time, bodies, separation?, visible, description, … }] }
  --ics               print an iCalendar (RFC 5545) feed instead
  --now <instant>     build instant for the feed's DTSTAMP (default: 00:00 UTC of --from)

Times are ISO 8601 with the site's UTC offset. Events that cannot be seen from the site are
listed with visible: false and the reason; solar eclipses always carry the eye-safety caution.`;

const OPTIONS = {
  ...SITE_RANGE_OPTIONS,
  order: { type: 'string' },
  type: { type: 'string', multiple: true },
  prodid: { type: 'string' },
} as const;

/** One event as the command's JSON (a public shape: keep these names). */
export function eventJson(e: AlmanacEvent, zone: string): Record<string, unknown> {
  return {
    type: e.type,
    time: formatInstant(e.time, zone),
    ...(e.end ? { end: formatInstant(e.end, zone) } : {}),
    bodies: e.bodies,
    ...(e.separationDeg !== undefined ? { separation: round(e.separationDeg, 3) } : {}),
    visible: e.visible,
    description: e.description,
    title: e.title,
    visibility: {
      note: e.visibility.note,
      moment: e.visibility.moment,
      time: e.visibility.time ? formatInstant(e.visibility.time, zone) : null,
      ...(e.visibility.altitudeDeg !== null ? { altitude: round(e.visibility.altitudeDeg, 1) } : {}),
      ...(e.visibility.azimuthDeg !== null ? { azimuth: round(e.visibility.azimuthDeg, 1) } : {}),
      reason: e.visibility.reason,
    },
    score: e.score,
    ...(e.caution ? { caution: e.caution } : {}),
    ...(e.eclipse
      ? { eclipse: { kind: e.eclipse.kind, obscuration: round(e.eclipse.obscuration, 3), contacts: e.eclipse.contacts.map((c) => ({ name: c.name, time: formatInstant(c.time, zone), altitude: round(c.altitudeDeg, 1) })) } }
      : {}),
    ...(e.shower
      ? {
          shower: {
            code: e.shower.code,
            zhr: e.shower.zhr,
            expectedHourlyRate: e.shower.best ? round(e.shower.best.hourlyRate, 1) : 0,
            bestTime: e.shower.best ? formatInstant(e.shower.best.time, zone) : null,
            radiantAltitude: e.shower.best ? round(e.shower.best.radiantAltitudeDeg, 1) : null,
            limitingMagnitude: e.shower.best ? round(e.shower.best.limitingMagnitude, 2) : null,
            moonIlluminatedFraction: round(e.shower.moonIlluminatedFraction, 2),
            moonInterferes: e.shower.moonInterferes,
          },
        }
      : {}),
  };
}

/** Runs `gloaming events` with `args` (without the command name), writing to `out`. */
export function runEvents(args: string[], out: (s: string) => void): void {
  const { values } = parseArgs({ args: joinNegativeNumbers(args), options: OPTIONS, strict: true });
  if (values.help) return out(EVENTS_HELP);
  const site = siteFromFlags(values, { needZone: true });
  if (values.from === undefined) throw new GloamingError('invalid-argument', '--from is required', { place: { field: '--from' }, expected: 'the first local date, YYYY-MM-DD' });
  parseLocalDate(values.from, '--from');
  const lastDate = values.to ?? addDays(values.from, 6);
  parseLocalDate(lastDate, '--to');
  const from = zonedTime(values.from, 0, 0, site.timeZone);
  const to = zonedTime(addDays(lastDate, 1), 0, 0, site.timeZone);
  if (to <= from) throw argumentError('--to', 'is before --from', `a date on or after ${values.from}`, lastDate);
  const order = values.order ?? 'time';
  if (order !== 'time' && order !== 'interest') throw argumentError('--order', 'unknown order', 'time or interest', order);
  const types = values.type?.map((t) => {
    if (!(EVENT_TYPES as readonly string[]).includes(t)) throw argumentError('--type', 'unknown event type', `one of ${EVENT_TYPES.join(', ')}`, t);
    return t as AlmanacEventType;
  });
  if (values.json && values.ics) throw argumentError('--ics', '--json and --ics exclude each other', 'one output format');
  const contentDir = resolve(String(values.content ?? 'content'));
  const bodies: BodyRegistry = loadBodies(resolve(contentDir, 'objects'));
  const satellites = loadSatellites(resolve(contentDir, 'satellites'));
  const events = findEvents({ site, from, to, bodies, satellites, options: { order, ...(types ? { types } : {}) } });
  const zone = site.timeZone;
  if (values.ics) {
    // DTSTAMP: --now, or 00:00 UTC of --from, so the same command writes the same feed (lib never reads the clock).
    const now = values.now !== undefined ? parseInstant(values.now, '--now') : new Date(`${values.from}T00:00:00Z`);
    return out(eventsToICalendar(events, { site, prodId: values.prodid ?? '-//gloaming//night-sky diary//EN', now }).replace(/\r\n$/, ''));
  }
  if (values.json) {
    return out(
      JSON.stringify(
        {
          site: { ...(site.id !== 'site' ? { id: site.id } : {}), latitude: site.latitudeDeg, longitude: site.longitudeDeg, elevation: site.elevationM, timeZone: zone },
          from: formatInstant(from, zone),
          to: formatInstant(to, zone),
          events: events.map((e) => eventJson(e, zone)),
        },
        null,
        2,
      ),
    );
  }
  const lines = [`Events ${values.from} – ${lastDate} at ${site.name} (${zone})`];
  for (const e of events) {
    // Rounded to the minute like the sentences and the pages (never truncated).
    const note = hiddenNote(e);
    lines.push(`${formatInstant(roundInstant(e.time, 'minute'), zone).slice(0, 16).replace('T', ' ')}  ${e.visible ? 'visible    ' : 'not visible'}  ${e.description}${note ? ` ${note}` : ''}`);
    if (e.caution) lines.push(`                              ${e.caution}`);
  }
  if (events.length === 0) lines.push('No events in this range.');
  out(lines.join('\n'));
}
