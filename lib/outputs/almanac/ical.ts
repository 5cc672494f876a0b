/**
 * iCalendar feed (RFC 5545) of a site's events, for readers to subscribe to from a phone.
 *
 * Deterministic: DTSTAMP is the injected `now` (the build date), UIDs are hashes of type, instant
 * (to the minute), bodies and site, and nothing else varies. Times are UTC (`…Z`, RFC 5545
 * §3.3.5 form 2), so no VTIMEZONE is needed and every calendar shows them in the reader's zone.
 * An instantaneous event has DTSTART only (§3.6.1: it then ends when it starts); a lasting one
 * (an eclipse) has DTEND. Lines end in CRLF and are folded at 75 octets (§3.1) without splitting
 * a UTF-8 sequence; TEXT values escape backslash, semicolon, comma and newline (§3.3.11).
 */
import { createHash } from 'node:crypto';
import { wordsFor } from '../../core/language/index.ts';
import type { Site } from '../../core/site.ts';
import type { AlmanacEvent } from './types.ts';

export interface ICalendarOptions {
  site: Site;
  /** PRODID (§3.7.3), e.g. `-//Quayside Lantern Science Centre//gloaming//EN`. */
  prodId: string;
  /** The build instant, used as every DTSTAMP (lib/ never reads the clock). */
  now: Date;
  /** Calendar name shown by clients (X-WR-CALNAME); default "<site name>: night-sky diary" in the site's language. */
  name?: string;
}

/** Escapes a TEXT value (RFC 5545 §3.3.11); other control characters, which TEXT may not hold (§3.3.11 CONTROL), are dropped. */
export function escapeText(text: string): string {
  return (
    text
      .replace(/\\/g, '\\\\')
      .replace(/;/g, '\\;')
      .replace(/,/g, '\\,')
      .replace(/\r\n|\r|\n/g, '\\n')
      // eslint-disable-next-line no-control-regex
      .replace(/[\u0000-\u0008\u000a-\u001f\u007f]/g, '')
  );
}

/** Folds one content line at 75 octets (RFC 5545 §3.1); continuation lines begin with a space. */
export function foldLine(line: string): string {
  const parts: string[] = [];
  let current = '';
  let octets = 0;
  let limit = 75;
  for (const ch of line) {
    const size = Buffer.byteLength(ch, 'utf8');
    if (octets + size > limit) {
      parts.push(current);
      current = ' ';
      octets = 1;
      limit = 75;
    }
    current += ch;
    octets += size;
  }
  parts.push(current);
  return parts.join('\r\n');
}

/** `YYYYMMDDTHHMMSSZ` (UTC, whole seconds). */
export function icalUtc(instant: Date): string {
  return new Date(Math.round(instant.getTime() / 1000) * 1000).toISOString().replace(/[-:]/g, '').replace(/\.\d{3}Z$/, 'Z');
}

/** A stable UID: the same event of the same site always gets the same one. */
export function eventUid(event: AlmanacEvent, site: Site): string {
  const minute = new Date(Math.round(event.time.getTime() / 60_000) * 60_000).toISOString();
  const hash = createHash('sha256').update(`${event.type}|${minute}|${event.bodies.join(',')}|${site.id}`).digest('hex').slice(0, 32);
  return `${hash}@${site.id}.gloaming`;
}

/** The full text of a feed: one VEVENT per event, CRLF line ends. */
export function eventsToICalendar(events: readonly AlmanacEvent[], options: ICalendarOptions): string {
  const { site } = options;
  const words = wordsFor(site.locale);
  const stamp = icalUtc(options.now);
  const lines: string[] = [
    'BEGIN:VCALENDAR',
    'VERSION:2.0',
    // PRODID's value is TEXT (§3.7.3): escaped like any text, so a line break cannot start a new property.
    `PRODID:${escapeText(options.prodId)}`,
    'CALSCALE:GREGORIAN',
    'METHOD:PUBLISH',
    `X-WR-CALNAME:${escapeText(options.name ?? words.t('ui.diary-title', { site: site.name }))}`,
    `X-WR-TIMEZONE:${site.timeZone}`,
  ];
  for (const e of events) {
    const text = [e.description, e.visibility.note, e.caution].filter((s): s is string => !!s).join('\n');
    lines.push(
      'BEGIN:VEVENT',
      `UID:${eventUid(e, site)}`,
      `DTSTAMP:${stamp}`,
      `DTSTART:${icalUtc(e.time)}`,
      ...(e.end && e.end > e.time ? [`DTEND:${icalUtc(e.end)}`] : []),
      `SUMMARY:${escapeText(e.visible ? e.title : words.t('ev.title-hidden', { title: e.title }))}`,
      `DESCRIPTION:${escapeText(text)}`,
      `LOCATION:${escapeText(site.name)}`,
      `GEO:${site.latitudeDeg.toFixed(6)};${site.longitudeDeg.toFixed(6)}`,
      `CATEGORIES:${escapeText(e.type)}`,
      'TRANSP:TRANSPARENT',
      'END:VEVENT',
    );
  }
  lines.push('END:VCALENDAR');
  return lines.map(foldLine).join('\r\n') + '\r\n';
}
