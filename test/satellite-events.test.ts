/**
 * Satellite passes as almanac events: `satellite-pass` in `gloaming events` and its calendar
 * feed (checked by parsing the feed with the independent ical.js), only for naked-eye passes,
 * and none for nights too far from the element sets' epochs.
 */
import ICAL from 'ical.js';
import { OVERHEAD_ALTITUDE_DEG, visibleTop } from '../lib/models/satellite/words.ts';
import { describe, expect, it } from 'vitest';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { main } from '../lib/outputs/cli/main.ts';
import { loadSites } from '../lib/models/content.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';
import { findPasses } from '../lib/models/satellite/passes.ts';
import { zonedTime } from '../lib/core/time.ts';
import { expectWithin, SECOND_MS } from './helpers/tolerance.ts';

const content = new URL('../content/', import.meta.url).pathname;
const site = loadSites(`${content}sites`).get('harbour-roof')!;
const satellites = loadSatellites(`${content}satellites`);

function run(...argv: string[]): { code: number; out: string; err: string } {
  const out: string[] = [];
  const err: string[] = [];
  const code = main(argv, (s) => out.push(s), (s) => err.push(s));
  return { code, out: out.join('\n'), err: err.join('\n') };
}

describe('satellite-pass events', () => {
  const from = zonedTime('2026-12-03', 0, 0, site.timeZone);
  const to = zonedTime('2026-12-05', 0, 0, site.timeZone);
  const events = findEvents({ site, from, to, satellites, options: { types: ['satellite-pass'] } });

  it('are exactly the recommended passes whose sighting starts in the range, from sighting start to end', () => {
    const recommended = findPasses({ site, satellites, from: '2026-12-02', to: '2026-12-04' }).filter((p) => p.recommended && p.visible!.start.time >= from && p.visible!.start.time < to);
    expect(events.length).toBe(recommended.length);
    expect(events.length).toBeGreaterThan(0);
    events.forEach((e, i) => {
      expect(e.type).toBe('satellite-pass');
      expect(e.visible).toBe(true);
      expect(e.time).toEqual(recommended[i]!.visible!.start.time);
      expect(e.end).toEqual(recommended[i]!.visible!.end.time);
      expect(e.bodies).toEqual([`satellite:${recommended[i]!.satellite.id}`]);
      // The top of the pass: a height and a compass direction, or straight overhead from OVERHEAD_ALTITUDE_DEG up.
      expect(e.description).toMatch(/^Demo .+ at \d\d:\d\d, \d+° up in the [a-z-]+; it (climbs to \d+° in the [a-z-]+|passes almost straight overhead|is highest there) and .+ at \d\d:\d\d, \d+° up in the [a-z-]+\. Magnitude −?\d\.\d at its brightest\.$/);
      expect(e.description.includes('overhead')).toBe(visibleTop(recommended[i]!).point.altitudeDeg >= OVERHEAD_ALTITUDE_DEG);
      expect(e.score).toBeGreaterThan(0);
    });
  });

  it('leave nights beyond the element-set age limit out instead of failing', () => {
    expect(findEvents({ site, from: zonedTime('2027-03-01', 0, 0, site.timeZone), to: zonedTime('2027-03-08', 0, 0, site.timeZone), satellites, options: { types: ['satellite-pass'] } })).toEqual([]);
  });

  it('reach `gloaming events` and its calendar feed, which ical.js reads back with the same times', () => {
    const json = run('events', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-04', '--type', 'satellite-pass', '--json');
    expect(json.code).toBe(0);
    const listed = JSON.parse(json.out).events as { type: string; time: string; end: string }[];
    expect(listed.length).toBe(events.length);
    listed.forEach((e, i) => expectWithin(Date.parse(e.time), events[i]!.time.getTime(), SECOND_MS, 'JSON time (to the second)'));
    const ics = run('events', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-04', '--type', 'satellite-pass', '--ics');
    const vevents = new ICAL.Component(ICAL.parse(ics.out)).getAllSubcomponents('vevent').map((v) => new ICAL.Event(v));
    expect(vevents.length).toBe(events.length);
    vevents.forEach((v, i) => {
      expectWithin(v.startDate.toJSDate().getTime(), events[i]!.time.getTime(), SECOND_MS, 'DTSTART');
      expectWithin(v.endDate.toJSDate().getTime(), events[i]!.end!.getTime(), SECOND_MS, 'DTEND');
      expect(v.summary).toMatch(/^Demo .+ passes over$/);
    });
    const passesIcs = run('passes', '--site', 'harbour-roof', '--from', '2026-12-03', '--to', '2026-12-03', '--ics');
    expect(passesIcs.code).toBe(0);
    expect(passesIcs.out).toContain('CATEGORIES:satellite-pass');
  });
});
