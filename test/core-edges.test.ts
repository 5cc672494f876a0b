/**
 * Edge cases of the computation core: polar day and night, missing darkness, both daylight-saving
 * transitions in three hemispheres/zones, a night across New Year, sites beside the date line,
 * bodies that never rise or never set, ISO weeks, and wall-clock times that do not exist or
 * happen twice. Expected values come from outside the library: the geometry of the Sun's
 * altitude, the IANA zone rules (quoted from memory), the ISO 8601 week definition, and
 * `astronomia` positions where a body must be chosen.
 */
import { describe, expect, it } from 'vitest';
import { builtInBody } from '../lib/core/body.ts';
import { computeNight } from '../lib/models/night.ts';
import { defineSite } from '../lib/core/site.ts';
import { formatInstant, isoWeekOf, nightOf, offsetMinutes, zonedTime } from '../lib/core/time.ts';
import { apparentGeocentric, jdUtOf } from './reference/core/astronomia-reference.ts';

const tromso = defineSite({ latitude: 69.65, longitude: 18.96, timeZone: 'Europe/Oslo' });

describe('polar day and polar night (Tromsø 69.65° N)', () => {
  // Geometry: the Sun's lowest altitude is −(90° − φ − δ) and its highest 90° − φ + δ. With
  // δ = ±23.44° at the solstices (Meeus ch. 22 obliquity) at φ = 69.65°: in June the Sun stays
  // ≥ +3.8°, above the sunset altitude −0.83°; in December it stays ≤ −3.1°, below it.
  it('midsummer night: no sunset or sunrise (always above), no twilight of any kind', () => {
    const n = computeNight(tromso, '2026-06-21', []);
    expect(n.sun.set).toEqual({ time: null, reason: 'always-above' });
    expect(n.sun.rise).toEqual({ time: null, reason: 'always-above' });
    for (const key of ['civilDusk', 'nauticalDusk', 'astronomicalDusk', 'astronomicalDawn', 'nauticalDawn', 'civilDawn'] as const) {
      expect(n.sun[key], key).toEqual({ time: null, reason: 'stays-above' });
    }
  });

  it('midwinter night: no sunrise or sunset (always below), but civil twilight around noon', () => {
    const n = computeNight(tromso, '2026-12-21', []);
    expect(n.sun.set).toEqual({ time: null, reason: 'always-below' });
    expect(n.sun.rise).toEqual({ time: null, reason: 'always-below' });
    // The Sun climbs to about −3.1° (> −6°) at local noon, so civil dawn and dusk both happen;
    // within a noon-to-noon night the dawn comes on the next morning, the dusk on the first afternoon.
    expect(n.sun.civilDusk.time).not.toBeNull();
    expect(n.sun.civilDawn.time).not.toBeNull();
    // Astronomical darkness is reached (the Sun sinks to −(90 − 69.65 + 23.44) = −43.8°).
    expect(n.sun.astronomicalDusk.time).not.toBeNull();
  });
});

describe('no astronomical darkness in a northern June (55° N)', () => {
  // Lowest solar altitude at the June solstice: −(90° − 55° − 23.44°) = −11.56°, above −12° and −18°.
  // (The methods digest §7 computes the same: "lat 55°, δ +23.4: nautical never, astronomical never" —
  // computed, not published.)
  const site = defineSite({ latitude: 55, longitude: -1.6, timeZone: 'Europe/London' });
  it('astronomical and nautical dusk and dawn are null with reason stays-above; civil dusk and dawn happen', () => {
    const n = computeNight(site, '2026-06-21', []);
    expect(n.sun.astronomicalDusk).toEqual({ time: null, reason: 'stays-above' });
    expect(n.sun.astronomicalDawn).toEqual({ time: null, reason: 'stays-above' });
    expect(n.sun.nauticalDusk).toEqual({ time: null, reason: 'stays-above' });
    expect(n.sun.nauticalDawn).toEqual({ time: null, reason: 'stays-above' });
    expect(n.sun.civilDusk.time).not.toBeNull();
    expect(n.sun.civilDawn.time).not.toBeNull();
    expect(n.sun.set.time).not.toBeNull();
  });
});

/** Local wall-clock minutes of an event, from its ISO text. */
function wallMinutes(iso: string): number {
  return Number(iso.slice(11, 13)) * 60 + Number(iso.slice(14, 16));
}

describe('daylight-saving transitions: nights run local noon to local noon, events carry the right offset', () => {
  // IANA zone rules (from memory): EU clocks change on the last Sundays of March and October at
  // 01:00 UTC; the US on the second Sunday of March and the first of November at 02:00 local;
  // New South Wales on the first Sundays of October (on) and April (off) at 02:00 standard time.
  const cases = [
    { zone: 'Europe/Berlin', lat: 52.52, lon: 13.4, date: '2026-03-28', before: '+01:00', after: '+02:00', hours: 23 },
    { zone: 'Europe/Berlin', lat: 52.52, lon: 13.4, date: '2026-10-24', before: '+02:00', after: '+01:00', hours: 25 },
    { zone: 'America/New_York', lat: 40.71, lon: -74.0, date: '2026-03-07', before: '-05:00', after: '-04:00', hours: 23 },
    { zone: 'America/New_York', lat: 40.71, lon: -74.0, date: '2026-10-31', before: '-04:00', after: '-05:00', hours: 25 },
    { zone: 'Australia/Sydney', lat: -33.87, lon: 151.21, date: '2026-10-03', before: '+10:00', after: '+11:00', hours: 23 },
    { zone: 'Australia/Sydney', lat: -33.87, lon: 151.21, date: '2026-04-04', before: '+11:00', after: '+10:00', hours: 25 },
  ];
  for (const c of cases) {
    it(`${c.zone}, night of ${c.date}: ${c.hours} h long, sunset at ${c.before}, sunrise at ${c.after}`, () => {
      const site = defineSite({ latitude: c.lat, longitude: c.lon, timeZone: c.zone });
      const night = nightOf(c.date, c.zone);
      expect(formatInstant(night.start, c.zone)).toBe(`${c.date}T12:00:00${c.before}`);
      expect(formatInstant(night.end, c.zone).slice(10)).toBe(`T12:00:00${c.after}`);
      expect((night.end.getTime() - night.start.getTime()) / 3_600_000).toBe(c.hours);
      const n = computeNight(site, c.date, []);
      const set = formatInstant(n.sun.set.time!, c.zone);
      const rise = formatInstant(n.sun.rise.time!, c.zone);
      expect(set.startsWith(c.date) && set.endsWith(c.before), set).toBe(true);
      expect(rise.endsWith(c.after), rise).toBe(true);
      // Across the change the sunrise clock time jumps by about an hour against the night before
      // (sunrise itself moves by only a few minutes a day).
      const previous = computeNight(site, new Date(Date.parse(`${c.date}T12:00:00Z`) - 86_400_000).toISOString().slice(0, 10), []);
      const jump = wallMinutes(rise) - wallMinutes(formatInstant(previous.sun.rise.time!, c.zone));
      const expected = c.hours === 23 ? 60 : -60;
      expect(Math.abs(jump - expected), `sunrise clock jump ${jump} min`).toBeLessThanOrEqual(4);
    });
  }
});

describe('a night across New Year', () => {
  it('the night of 2026-12-31 in Europe/Berlin ends at noon on 2027-01-01 and its sunrise is dated 2027', () => {
    const site = defineSite({ latitude: 52.52, longitude: 13.4, timeZone: 'Europe/Berlin' });
    const n = computeNight(site, '2026-12-31', [builtInBody('jupiter')]);
    expect(formatInstant(n.night.start, site.timeZone)).toBe('2026-12-31T12:00:00+01:00');
    expect(formatInstant(n.night.end, site.timeZone)).toBe('2027-01-01T12:00:00+01:00');
    expect(formatInstant(n.sun.set.time!, site.timeZone).slice(0, 10)).toBe('2026-12-31');
    expect(formatInstant(n.sun.rise.time!, site.timeZone).slice(0, 10)).toBe('2027-01-01');
    expect(isoWeekOf('2026-12-31').id).toBe('2026-W53');
  });
});

describe('sites beside the date line', () => {
  // Kiritimati keeps UTC+14 at 157° W; Pago Pago UTC−11 at 171° W: the same instant is a
  // different calendar date at the two (IANA zone data, from memory).
  const sites = [
    { site: defineSite({ latitude: 1.87, longitude: -157.4, timeZone: 'Pacific/Kiritimati' }), offset: '+14:00', offsetMin: 840 },
    { site: defineSite({ latitude: -14.28, longitude: -170.7, timeZone: 'Pacific/Pago_Pago' }), offset: '-11:00', offsetMin: -660 },
  ];
  for (const { site, offset, offsetMin } of sites) {
    it(`${site.timeZone}: the night of 2026-06-15 runs from local noon, sunset that evening and sunrise next morning at ${offset}`, () => {
      const n = computeNight(site, '2026-06-15', []);
      expect(formatInstant(n.night.start, site.timeZone)).toBe(`2026-06-15T12:00:00${offset}`);
      expect(n.night.start.toISOString()).toBe(new Date(Date.UTC(2026, 5, 15, 12) - offsetMin * 60_000).toISOString());
      const set = formatInstant(n.sun.set.time!, site.timeZone);
      const rise = formatInstant(n.sun.rise.time!, site.timeZone);
      expect(set.startsWith('2026-06-15T') && set.endsWith(offset), set).toBe(true);
      expect(rise.startsWith('2026-06-16T') && rise.endsWith(offset), rise).toBe(true);
      // Near the equator (|φ| ≤ 15°) sunset falls between 17:00 and 20:00 on the local clock
      // (zone offset minus mean solar time: Kiritimati +3.5 h − 24 h, Pago Pago −0.4 h).
      const hour = Number(set.slice(11, 13));
      const expectedLmt = 18 + ((offsetMin / 60 - site.longitudeDeg / 15 + 36) % 24) - 12;
      expect(Math.abs(hour - expectedLmt), `sunset ${set}`).toBeLessThanOrEqual(1.5);
    });
  }
  it('the two sites\' nights of the same date start 25 hours apart', () => {
    const a = nightOf('2026-06-15', 'Pacific/Kiritimati');
    const b = nightOf('2026-06-15', 'Pacific/Pago_Pago');
    expect((b.start.getTime() - a.start.getTime()) / 3_600_000).toBe(25);
  });
});

/** The night in `year` (scanning every `stepDays`) at which astronomia puts the body's declination at its extreme. */
function extremeDeclinationNight(id: 'moon' | 'jupiter', year: number, sign: 1 | -1, stepDays: number): { date: string; decDeg: number } {
  let best = { date: '', decDeg: -Infinity * sign };
  for (let d = 0; d < 366; d += stepDays) {
    const t = new Date(Date.UTC(year, 0, 1, 22) + d * 86_400_000);
    const dec = (apparentGeocentric(id, jdUtOf(t) + 69 / 86_400).dec * 180) / Math.PI;
    if (sign * dec > sign * best.decDeg) best = { date: t.toISOString().slice(0, 10), decDeg: dec };
  }
  return best;
}

describe('bodies that never rise or never set (Tromsø 69.65° N; declinations from astronomia)', () => {
  // A body is circumpolar when δ > 90° − φ + (its rise altitude): 20.35° + ~0.1° for the Moon
  // (h0 = 0.7275 π − 34′ ≈ +0.1°), 20.35° − 0.57° for a planet. 2025 is near a major lunar
  // standstill, when the Moon's declination reaches about ±28° every month.
  it('the Moon at its most northerly night of 2025 never sets; at its most southerly it never rises', () => {
    const north = extremeDeclinationNight('moon', 2025, 1, 1);
    const south = extremeDeclinationNight('moon', 2025, -1, 1);
    expect(north.decDeg).toBeGreaterThan(25);
    expect(south.decDeg).toBeLessThan(-25);
    const n = computeNight(tromso, north.date, []);
    expect(n.moon.rise.reason, `${north.date} δ ${north.decDeg.toFixed(1)}°`).toBe('always-above');
    expect(n.moon.set.reason).toBe('always-above');
    expect(n.moon.transit.time).not.toBeNull();
    const s = computeNight(tromso, south.date, []);
    expect(s.moon.rise.reason, `${south.date} δ ${south.decDeg.toFixed(1)}°`).toBe('always-below');
    expect(s.moon.set.reason).toBe('always-below');
  });

  it('Jupiter in Gemini (δ ≈ +23°, early 2026) is circumpolar at Tromsø', () => {
    const north = extremeDeclinationNight('jupiter', 2025, 1, 10);
    expect(north.decDeg).toBeGreaterThan(22);
    const n = computeNight(tromso, north.date, [builtInBody('jupiter')]);
    const j = n.bodies[0]!;
    expect(j.rise.reason, `${north.date} δ ${north.decDeg.toFixed(1)}°`).toBe('always-above');
    expect(j.set.reason).toBe('always-above');
  });
});

describe('ISO 8601 weeks (the week containing the year\'s first Thursday is week 01)', () => {
  // Weekdays from the platform's proleptic Gregorian calendar (Date.UTC), not from the library.
  const weekday = (date: string): number => (new Date(`${date}T00:00:00Z`).getUTCDay() + 6) % 7; // Monday 0
  const cases: [string, string][] = [
    ['2020-12-31', '2020-W53'],
    ['2021-01-03', '2020-W53'],
    ['2021-01-04', '2021-W01'],
    ['2026-01-01', '2026-W01'],
    ['2026-12-31', '2026-W53'],
    ['2027-01-03', '2026-W53'],
    ['2027-01-04', '2027-W01'],
    ['2024-12-30', '2025-W01'],
    ['2019-12-29', '2019-W52'],
    ['2019-12-30', '2020-W01'],
  ];
  for (const [date, id] of cases) {
    it(`${date} is in ${id}`, () => {
      const w = isoWeekOf(date);
      expect(w.id).toBe(id);
      expect(w.days).toHaveLength(7);
      expect(w.days).toContain(date);
      expect(weekday(w.days[0]!)).toBe(0);
      expect(weekday(w.days[6]!)).toBe(6);
    });
  }
  it('2020 and 2026 have 53 weeks (they start on a Wednesday-leap-year / a Thursday), 2021 and 2027 have 52', () => {
    expect(weekday('2020-01-01')).toBe(2);
    expect(weekday('2026-01-01')).toBe(3);
    expect(isoWeekOf('2020-12-28').week).toBe(53);
    expect(isoWeekOf('2026-12-28').week).toBe(53);
    expect(isoWeekOf('2021-12-27').week).toBe(52);
    expect(isoWeekOf('2027-12-27').week).toBe(52);
  });
});

describe('zonedTime in the spring gap and the autumn fold (IANA rules, from memory)', () => {
  const cases: [string, string, number, number, string, string][] = [
    // zone, date, hour, minute, expected UTC, why
    ['Europe/Berlin', '2026-03-29', 2, 30, '2026-03-29T01:30:00.000Z', 'gap: 02:30 does not exist; the clock reads 03:30 CEST'],
    ['Europe/Berlin', '2026-10-25', 2, 30, '2026-10-25T00:30:00.000Z', 'fold: the earlier 02:30 (CEST)'],
    ['America/New_York', '2026-11-01', 1, 30, '2026-11-01T05:30:00.000Z', 'fold: the earlier 01:30 (EDT)'],
    ['Australia/Sydney', '2026-10-04', 2, 30, '2026-10-03T16:30:00.000Z', 'gap: 03:30 AEDT'],
    ['Australia/Sydney', '2026-04-05', 2, 30, '2026-04-04T15:30:00.000Z', 'fold: the earlier 02:30 (AEDT)'],
    ['Europe/Berlin', '2026-03-29', 12, 0, '2026-03-29T10:00:00.000Z', 'ordinary noon after the change'],
  ];
  for (const [zone, date, h, m, utc, why] of cases) {
    it(`${zone} ${date} ${h}:${String(m).padStart(2, '0')} → ${utc} (${why})`, () => {
      expect(zonedTime(date, h, m, zone).toISOString()).toBe(utc);
    });
  }
  // Zones west of Greenwich: the spring gap resolves to the instant the clock jumps to (03:30 EDT),
  // from the offset before the change (regression: an earlier fixed-point version gave 01:30 EST).
  it('America/New_York 2026-03-08 2:30 → 2026-03-08T07:30:00.000Z (gap: 03:30 EDT; also Denver and Los Angeles)', () => {
    expect(zonedTime('2026-03-08', 2, 30, 'America/New_York').toISOString()).toBe('2026-03-08T07:30:00.000Z');
    expect(zonedTime('2026-03-08', 2, 30, 'America/Denver').toISOString()).toBe('2026-03-08T09:30:00.000Z');
    expect(zonedTime('2026-03-08', 2, 30, 'America/Los_Angeles').toISOString()).toBe('2026-03-08T10:30:00.000Z');
  });
  it('offsets of fractional and far-east zones (Kathmandu +5:45, Chatham +12:45 standard, Kiritimati +14)', () => {
    expect(offsetMinutes(new Date('2026-07-01T00:00:00Z'), 'Asia/Kathmandu')).toBe(345);
    expect(offsetMinutes(new Date('2026-07-01T00:00:00Z'), 'Pacific/Chatham')).toBe(765);
    expect(offsetMinutes(new Date('2026-07-01T00:00:00Z'), 'Pacific/Kiritimati')).toBe(840);
    expect(formatInstant(new Date('2026-07-01T00:00:00Z'), 'Pacific/Chatham')).toBe('2026-07-01T12:45:00+12:45');
  });
});
