/**
 * Impossible and hostile input on the command line, in calendar feeds and in historical time
 * zones (issue #14 §3, §5, §6, §7): every problem is one line naming the flag, exit code 2
 * (EXIT_CODES.input), values echoed at most MAX_ECHO_CHARS long; nothing is rolled over silently.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import ICAL from 'ical.js';
import { afterAll, describe, expect, it } from 'vitest';
import { main } from '../lib/outputs/cli/main.ts';
import { EXIT_CODES, MAX_ECHO_CHARS } from '../lib/core/errors.ts';
import { formatInstant, zonedParts, zonedTime } from '../lib/core/time.ts';
import { eventsToICalendar, findEvents } from '../lib/outputs/almanac/index.ts';
import { defineSite } from '../lib/core/site.ts';

function run(...argv: string[]): { code: number; out: string; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err };
}

const scratch = mkdtempSync(join(tmpdir(), 'gloaming-input-'));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const POSITION = ['position', '--lon', '5', '--body', 'mars'];
const NIGHT = ['night', '--lat', '52', '--lon', '5', '--tz', 'UTC', '--body', 'mars'];

describe('command line: impossible input is refused with one line and exit code 2 (issue #14 §5)', () => {
  const longValue = 'x'.repeat(100_000);
  const notYaml = join(scratch, 'notes.txt');
  writeFileSync(notYaml, `secret line one\n${'filler '.repeat(20_000)}\n`);
  const cases: { what: string; argv: string[]; names: RegExp; mentions?: RegExp }[] = [
    { what: 'a 30 February instant (the Date parser rolls it to 2 March)', argv: [...POSITION, '--lat', '52', '--at', '2026-02-30T20:00Z'], names: /--at/, mentions: /2026-02-30T20:00Z/ },
    { what: 'hour 24', argv: [...POSITION, '--lat', '52', '--at', '2026-02-03T24:00Z'], names: /--at/ },
    { what: 'an offset beyond ±14:00', argv: [...POSITION, '--lat', '52', '--at', '2026-02-03T20:00+15:00'], names: /--at/ },
    { what: 'year 0000', argv: [...POSITION, '--lat', '52', '--at', '0000-01-01T00:00Z'], names: /--at/, mentions: /1000-01-01.*2999-12-31/ },
    { what: 'a night in year 9999 (reported as 10000-01-01 before)', argv: [...NIGHT, '--date', '9999-12-31'], names: /--date/, mentions: /'9999-12-31'.*2999-12-31/ },
    { what: 'hexadecimal latitude', argv: [...POSITION, '--lat', '0x10', '--at', '2026-02-03T20:00Z'], names: /--lat/, mentions: /0x10/ },
    { what: 'latitude -Infinity', argv: [...POSITION, '--lat', '-Infinity', '--at', '2026-02-03T20:00Z'], names: /--lat/, mentions: /-Infinity/ },
    { what: '--lat without a value', argv: ['night', '--lat', '--lon', '5', '--tz', 'UTC', '--date', '2026-01-01'], names: /--lat: needs a value/ },
    { what: 'a fixed offset as zone', argv: ['night', '--lat', '52', '--lon', '5', '--tz', '+05:00', '--date', '2026-01-01'], names: /--tz/, mentions: /'\+05:00'.*Etc\/GMT-5/ },
    { what: '--site together with --lat', argv: ['night', '--site', 'harbour-roof', '--lat', '10', '--date', '2026-01-01'], names: /--site/, mentions: /--lat/ },
    { what: '--elements on a missing file', argv: [...POSITION.filter((a) => a !== '--body' && a !== 'mars'), '--lat', '52', '--at', '2026-02-03T20:00Z', '--elements', join(scratch, 'nowhere.yaml')], names: /--elements/, mentions: /no such file/ },
    { what: '--elements on a folder', argv: ['position', '--lat', '52', '--lon', '5', '--at', '2026-02-03T20:00Z', '--elements', scratch], names: /--elements/, mentions: /is a folder/ },
    { what: 'a date the zone skipped (Pacific/Apia had no 30 December 2011; IANA tz database)', argv: ['night', '--lat', '-13.8', '--lon', '-171.8', '--tz', 'Pacific/Apia', '--date', '2011-12-30'], names: /--date/, mentions: /'2011-12-30' did not happen in Pacific\/Apia/ },
    { what: 'the events range error names --to', argv: ['events', '--lat', '52', '--lon', '5', '--tz', 'UTC', '--from', '2026-01-01', '--to', '2032-01-01'], names: /^gloaming events: --to: / },
  ];
  for (const c of cases) {
    it(c.what, () => {
      const r = run(...c.argv);
      expect(r.code).toBe(EXIT_CODES.input);
      expect(r.out).toBe('');
      expect(r.err).toHaveLength(1);
      expect(r.err[0]!.split('\n')).toHaveLength(1);
      expect(r.err[0]).toMatch(c.names);
      if (c.mentions) expect(r.err[0]).toMatch(c.mentions);
    });
  }

  it('a 100 KB value is echoed cut short', () => {
    const r = run(...NIGHT, '--date', longValue);
    expect(r.code).toBe(EXIT_CODES.input);
    expect(r.err[0]).toMatch(/--date: /);
    expect(r.err[0]!.length).toBeLessThan(MAX_ECHO_CHARS + 200);
  });

  it('a file given as elements is not echoed', () => {
    const r = run('position', '--lat', '52', '--lon', '5', '--at', '2026-02-03T20:00Z', '--elements', notYaml);
    expect(r.code).toBe(EXIT_CODES.input);
    expect(r.err).toHaveLength(1);
    expect(r.err[0]).toContain('notes.txt');
    expect(r.err[0]!.length).toBeLessThan(MAX_ECHO_CHARS + 400);
  });

  it('dates and instants at the edges of the supported years still work', () => {
    expect(run(...NIGHT, '--date', '2999-12-31', '--json').code).toBe(EXIT_CODES.ok);
    expect(run(...POSITION, '--lat', '52', '--at', '1000-01-01T00:00Z').code).toBe(EXIT_CODES.ok);
    expect(run(...POSITION, '--lat', '.5e1', '--at', '2026-02-03T20:00:00.5+05:45').code).toBe(EXIT_CODES.ok);
  });
});

describe('historical UTC offsets keep their seconds in ISO strings (issue #14 §6)', () => {
  // IANA tz database (file `europe`): Dublin Mean Time −0:25:21 until 1916-10-01; (file `africa`):
  // Monrovia −0:44:30 until 1972-01-07. From memory; the platform's zone data is the same database.
  it('Dublin 1910 is −00:25:21, and wall time + offset gives the instant back', () => {
    const noon = zonedTime('1910-06-01', 12, 0, 'Europe/Dublin');
    expect(noon.toISOString()).toBe('1910-06-01T12:25:21.000Z');
    expect(formatInstant(noon, 'Europe/Dublin')).toBe('1910-06-01T12:00:00-00:25:21');
  });

  it('Monrovia 1960 is −00:44:30; whole-minute offsets keep the short form', () => {
    expect(formatInstant(new Date('1960-01-01T00:44:30Z'), 'Africa/Monrovia')).toBe('1960-01-01T00:00:00-00:44:30');
    expect(formatInstant(new Date('2026-07-01T00:00:00Z'), 'Asia/Kathmandu')).toBe('2026-07-01T05:45:00+05:45');
  });

  it('wall-clock fields equal the platform\'s own at every second around offset changes, remembered or not', () => {
    // The reference is Intl.DateTimeFormat.formatToParts itself, asked afresh for each instant
    // (the platform's IANA data); the library remembers offsets per quarter hour.
    const platform = (ms: number, zone: string): string => {
      const f = new Intl.DateTimeFormat('en-US', { timeZone: zone, hourCycle: 'h23', year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', second: '2-digit' });
      const p = Object.fromEntries(f.formatToParts(new Date(ms)).map((x) => [x.type, x.value]));
      return `${Number(p.year)}-${Number(p.month)}-${Number(p.day)} ${Number(p.hour)}:${Number(p.minute)}:${Number(p.second)}`;
    };
    const ours = (ms: number, zone: string): string => {
      const p = zonedParts(new Date(ms), zone);
      return `${p.year}-${p.month}-${p.day} ${p.hour}:${p.minute}:${p.second}`;
    };
    // Changes of offset (IANA tz database, from memory; the assertions compare with the platform, not with these):
    // Dublin's end of mean time 1916-10-01 02:25:21 UTC, Lord Howe's half-hour DST (2026-04-05 15:00 UTC),
    // the Chatham Islands' +13:45 → +12:45 (2026-04-04 14:00 UTC), Berlin's DST (2026-03-29 01:00 UTC).
    const around: [string, string][] = [
      ['Europe/Dublin', '1916-10-01T02:25:21Z'],
      ['Australia/Lord_Howe', '2026-04-05T15:00:00Z'],
      ['Pacific/Chatham', '2026-04-04T14:00:00Z'],
      ['Europe/Berlin', '2026-03-29T01:00:00Z'],
    ];
    let compared = 0;
    for (const [zone, iso] of around) {
      const change = Date.parse(iso);
      // Every 7 s through an hour either side (odd steps hit seconds inside and at the change), then twice more (remembered).
      for (let pass = 0; pass < 2; pass++) {
        for (let ms = change - 3_600_000; ms <= change + 3_600_000; ms += 7_000) {
          expect(ours(ms, zone), `${zone} ${new Date(ms).toISOString()}`).toBe(platform(ms, zone));
          compared++;
        }
      }
      for (const ms of [change - 1000, change, change + 1000, change + 250]) expect(ours(ms, zone)).toBe(platform(ms, zone));
    }
    expect(compared).toBeGreaterThan(4000);
  });

  it('the night command prints a pre-1916 Dublin sunset with the seconds of the offset', () => {
    const r = run('night', '--lat', '53.35', '--lon', '-6.26', '--tz', 'Europe/Dublin', '--date', '1910-06-01', '--body', 'mars', '--json');
    expect(r.code).toBe(0);
    const night = JSON.parse(r.out) as { start: string; sun: { set: string } };
    expect(night.start).toBe('1910-06-01T12:00:00-00:25:21');
    expect(night.sun.set).toMatch(/^1910-06-01T\d\d:\d\d:\d\d-00:25:21$/);
  });
});

describe('iCalendar PRODID cannot inject lines (issue #14 §3)', () => {
  const site = defineSite({ id: 'pier', name: 'Pier', latitude: 50.9, longitude: -1.4, timeZone: 'Europe/London' });
  const events = findEvents({ site, from: new Date('2026-08-01T00:00:00Z'), to: new Date('2026-08-15T00:00:00Z') });
  const hostile = 'x\r\nBEGIN:VEVENT\r\nSUMMARY:injected\r\nEND:VEVENT\nX-EVIL:1';

  it('a PRODID with CR/LF stays one property: ical.js (npm) reads it back and finds no extra event', () => {
    const feed = eventsToICalendar(events, { site, prodId: hostile, now: new Date('2026-08-01T00:00:00Z') });
    const calendar = new ICAL.Component(ICAL.parse(feed));
    expect(calendar.getFirstPropertyValue('prodid')).toBe(hostile.replace(/\r\n/g, '\n'));
    expect(calendar.getAllSubcomponents('vevent')).toHaveLength(events.length);
    expect(calendar.getFirstPropertyValue('x-evil')).toBeNull();
  });

  it('through the command line too', () => {
    const r = run('events', '--lat', '50.9', '--lon', '-1.4', '--tz', 'Europe/London', '--from', '2026-08-01', '--ics', '--prodid', hostile);
    expect(r.code).toBe(0);
    expect(r.out.split('\r\n').filter((l) => l.startsWith('BEGIN:VEVENT'))).toHaveLength(new ICAL.Component(ICAL.parse(r.out)).getAllSubcomponents('vevent').length);
    expect(r.out).not.toMatch(/^SUMMARY:injected/m);
  });
});
