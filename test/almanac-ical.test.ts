/**
 * The iCalendar feed against RFC 5545 and an independent parser: `ical.js` (npm, Mozilla's
 * iCalendar library, devDependency) must parse the feed and give back every event's UID, start,
 * end, summary and description unchanged (round trip); line rules are checked against the RFC's
 * text (§3.1 folding at 75 octets with CRLF, §3.3.11 TEXT escaping, §3.6.1 DTSTART/DTEND).
 */
import { describe, expect, it } from 'vitest';
import ICAL from 'ical.js';
import { defineSite } from '../lib/core/site.ts';
import { eventsToICalendar, findEvents, type AlmanacEvent } from '../lib/outputs/almanac/index.ts';
import { escapeText, foldLine } from '../lib/outputs/almanac/ical.ts';

const site = defineSite({ id: 'harbour', name: 'Harbour Roof, "Quayside"; level 5', latitude: 50.45, longitude: -1.55, timeZone: 'Europe/London', sky: { bortle: 7 } });
const now = new Date('2026-07-01T08:00:00Z');
const events = findEvents({ site, from: new Date('2026-08-01T00:00:00Z'), to: new Date('2026-09-01T00:00:00Z') });
const feed = eventsToICalendar(events, { site, prodId: '-//Test Centre//gloaming//EN', now });

function veventsOf(text: string): ICAL.Event[] {
  const comp = new ICAL.Component(ICAL.parse(text));
  return comp.getAllSubcomponents('vevent').map((v) => new ICAL.Event(v));
}

describe('iCalendar feed (RFC 5545)', () => {
  it('has events to test with, including a solar eclipse with its caution and characters that need escaping', () => {
    expect(events.length).toBeGreaterThan(10);
    expect(events.some((e) => e.type === 'solar-eclipse' && e.caution)).toBe(true);
    expect(events.some((e) => /[,;]/.test(e.description))).toBe(true);
  });

  it('is parsed by ical.js and round-trips UID, DTSTART, DTEND, SUMMARY and DESCRIPTION', () => {
    const comp = new ICAL.Component(ICAL.parse(feed));
    expect(comp.name).toBe('vcalendar');
    expect(comp.getFirstPropertyValue('version')).toBe('2.0');
    expect(comp.getFirstPropertyValue('prodid')).toBe('-//Test Centre//gloaming//EN');
    const parsed = veventsOf(feed);
    expect(parsed).toHaveLength(events.length);
    parsed.forEach((p, i) => {
      const e: AlmanacEvent = events[i]!;
      expect(p.startDate.toJSDate().getTime()).toBe(Math.round(e.time.getTime() / 1000) * 1000);
      if (e.end) expect(p.endDate.toJSDate().getTime()).toBe(Math.round(e.end.getTime() / 1000) * 1000);
      expect(p.summary).toBe(e.visible ? e.title : `${e.title} (not visible from here)`);
      expect(p.description).toBe([e.description, e.visibility.note, e.caution].filter(Boolean).join('\n'));
      expect(p.location).toBe(site.name);
      expect(p.component.getFirstPropertyValue('categories')).toBe(e.type);
      expect(p.component.getFirstPropertyValue('dtstamp')?.toString()).toBe('2026-07-01T08:00:00Z');
    });
    expect(new Set(parsed.map((p) => p.uid)).size).toBe(events.length);
  });

  it('lines end in CRLF, none is longer than 75 octets, folds never split a UTF-8 character (§3.1)', () => {
    expect(feed.endsWith('\r\n')).toBe(true);
    expect(feed.replace(/\r\n/g, '')).not.toMatch(/[\r\n]/);
    const lines = feed.split('\r\n').slice(0, -1);
    for (const line of lines) expect(Buffer.byteLength(line, 'utf8'), line).toBeLessThanOrEqual(75);
    expect(lines.some((l) => l.startsWith(' '))).toBe(true);
    // Unfolding (§3.1: remove CRLF followed by one space) restores valid UTF-8 with the degree signs intact.
    expect(feed.replace(/\r\n /g, '')).toContain('°');
    expect(feed).not.toContain('\uFFFD');
  });

  it('folds a long multi-byte line into chunks of ≤ 75 octets that unfold to the original', () => {
    const long = `DESCRIPTION:${'η-Aquariids ° '.repeat(30)}`;
    const folded = foldLine(long);
    for (const part of folded.split('\r\n')) expect(Buffer.byteLength(part, 'utf8')).toBeLessThanOrEqual(75);
    expect(folded.replace(/\r\n /g, '')).toBe(long);
  });

  it('escapes backslash, semicolon, comma and newline in TEXT (§3.3.11)', () => {
    expect(escapeText('a\\b;c,d\ne')).toBe('a\\\\b\\;c\\,d\\ne');
    const [p] = veventsOf(eventsToICalendar([{ ...events[0]!, description: 'x; y, z\\ w' }], { site, prodId: '-//t//t//EN', now }));
    expect(p!.description.startsWith('x; y, z\\ w\n')).toBe(true);
  });

  it('is deterministic: the same input gives the same bytes; UIDs stay when only DTSTAMP changes', () => {
    expect(eventsToICalendar(events, { site, prodId: '-//Test Centre//gloaming//EN', now })).toBe(feed);
    const later = eventsToICalendar(events, { site, prodId: '-//Test Centre//gloaming//EN', now: new Date('2026-07-08T08:00:00Z') });
    expect(veventsOf(later).map((e) => e.uid)).toEqual(veventsOf(feed).map((e) => e.uid));
    expect(later).not.toBe(feed);
  });

  it('an instantaneous event has DTSTART without DTEND (§3.6.1), a lasting one has DTEND after DTSTART', () => {
    const blocks = feed.replace(/\r\n /g, '').split('BEGIN:VEVENT').slice(1);
    for (const [i, block] of blocks.entries()) {
      const e = events[i]!;
      expect(block).toMatch(/\r\nDTSTART:\d{8}T\d{6}Z\r\n/);
      expect(block.includes('DTEND:')).toBe(!!e.end);
    }
  });
});
