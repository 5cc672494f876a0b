/**
 * The opposition sentence follows the planet's real night at the site ("rises around sunset",
 * "rises at 15:20 in the north-east", "stays up all night", "is above the horizon for only part of
 * the night", "stays below the horizon all night"), checked against astronomy-engine: its
 * `SearchRelativeLongitude` for the instant, `SearchRiseSet` for the planet's rise and the Sun's
 * set, and `Horizon` sampled every 5 minutes for how much of the dark part (Sun 6° or more down,
 * geometric) the planet is up (apparent altitude above 0°, standard refraction) — an independent
 * path from gloaming's tracks and searches.
 */
import { Body, Equator, Horizon, MakeTime, SearchRelativeLongitude, SearchRiseSet, type Observer } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { AROUND_SUNSET_MIN } from '../lib/outputs/almanac/planets.ts';
import { defineSite, type Site } from '../lib/core/site.ts';
import { loadSites } from '../lib/models/content.ts';
import { nightOf } from '../lib/core/time.ts';
import { nightDateOf } from '../lib/outputs/almanac/context.ts';
import { MINUTE_MS, expectWithin } from './helpers/tolerance.ts';

type Kind = 'sunset' | 'rises' | 'up' | 'part' | 'down';

function altitude(body: Body, time: Date, observer: Observer, refraction: 'normal' | undefined): number {
  const t = MakeTime(time);
  const eq = Equator(body, t, observer, true, true);
  return Horizon(t, observer, eq.ra, eq.dec, refraction).altitude;
}

/** What astronomy-engine says of the planet's night: the kind of sentence it calls for, and its rise. */
function outside(site: Site, body: Body, opposition: Date): { kind: Kind; rise: Date | null; sunset: Date | null; upShare: number } {
  // The night containing the opposition instant: local noon to the next local noon (calendar only).
  const night = nightOf(nightDateOf(opposition, site.timeZone), site.timeZone);
  const start = MakeTime(night.start);
  const days = (night.end.getTime() - night.start.getTime()) / 86_400_000;
  const rise = SearchRiseSet(body, site.observer, +1, start, days)?.date ?? null;
  const sunset = SearchRiseSet(Body.Sun, site.observer, -1, start, days)?.date ?? null;
  const samples: Date[] = [];
  for (let t = night.start.getTime(); t <= night.end.getTime(); t += 5 * MINUTE_MS) samples.push(new Date(t));
  const dark = samples.filter((t) => altitude(Body.Sun, t, site.observer, undefined) <= -6);
  const sunDown = samples.filter((t) => altitude(Body.Sun, t, site.observer, undefined) < 0);
  const judged = dark.length > 0 ? dark : sunDown.length > 0 ? sunDown : samples;
  const upShare = judged.filter((t) => altitude(body, t, site.observer, 'normal') > 0).length / judged.length;
  let kind: Kind;
  if (upShare === 0) kind = rise ? 'part' : 'down';
  else if (upShare < 0.9) kind = 'part';
  else if (!rise) kind = 'up';
  else kind = sunset && Math.abs(rise.getTime() - sunset.getTime()) <= AROUND_SUNSET_MIN * MINUTE_MS ? 'sunset' : 'rises';
  return { kind, rise, sunset, upShare };
}

const PHRASE: Record<Kind, RegExp> = {
  sunset: /opposite the Sun, it rises around sunset, stays up all night and is at its brightest/,
  rises: /opposite the Sun, it rises at (\d\d):(\d\d) in the [a-z-]+, stays up all night and is at its brightest/,
  up: /opposite the Sun, it stays up all night and is at its brightest/,
  part: /opposite the Sun, it is above the horizon for only part of the night and is at its brightest/,
  down: /opposite the Sun and at its brightest this year \(magnitude −?\d+\.\d\), but from here it stays below the horizon all night\./,
};

const northernOutpost = loadSites('content/sites').get('northern-outpost')!;
const harbourRoof = loadSites('content/sites').get('harbour-roof')!;
const at50n = defineSite({ id: 'held-out-50n', name: 'Held-out site', latitude: 50, longitude: 13.4, timeZone: 'Europe/Berlin' });

// [what, site, planet, a date a few days before the opposition, the kind expected]
const CASES: [string, Site, Body, string, Kind][] = [
  ['Mars 2027 from Harbour Roof (50.5° N): rises 26 minutes before sunset', harbourRoof, Body.Mars, '2027-02-10', 'sunset'],
  ['Mars 2027 from the Northern Outpost (68.6° N): rises over an hour before sunset', northernOutpost, Body.Mars, '2027-02-10', 'rises'],
  ['Mars 2018 from 50° N: a far-south planet in a short summer night rises well after sunset', at50n, Body.Mars, '2018-07-20', 'rises'],
  ['Mars 2018 from the Northern Outpost: at declination −25° it never rises', northernOutpost, Body.Mars, '2018-07-20', 'down'],
  ['Mars 2022 from the Northern Outpost: at declination +25° it never sets', northernOutpost, Body.Mars, '2022-12-01', 'up'],
  ['Saturn 2019 from the Northern Outpost: under the midnight Sun it is up for only part of the night', northernOutpost, Body.Saturn, '2019-07-01', 'part'],
];

describe('the opposition sentence follows the night at the site (astronomy-engine)', () => {
  it.each(CASES)('%s', (_what, site, body, from, kind) => {
    const opposition = SearchRelativeLongitude(body, 0, MakeTime(new Date(`${from}T00:00:00Z`))).date;
    const events = findEvents({ site, from: new Date(opposition.getTime() - 86_400_000), to: new Date(opposition.getTime() + 86_400_000), options: { types: ['opposition'] } });
    expect(events.length).toBe(1);
    const e = events[0]!;
    expectWithin(e.time.getTime(), opposition.getTime(), MINUTE_MS, 'opposition instant (SearchRelativeLongitude)');
    const o = outside(site, body, opposition);
    expect(o.kind, `astronomy-engine: up ${Math.round(o.upShare * 100)}% of the dark part, rise ${o.rise?.toISOString()}, sunset ${o.sunset?.toISOString()}`).toBe(kind);
    // Not on an edge of the rules, where a minute's difference between the two ephemerides could flip the words.
    if (o.rise && o.sunset) expect(Math.abs(Math.abs(o.rise.getTime() - o.sunset.getTime()) / MINUTE_MS - AROUND_SUNSET_MIN)).toBeGreaterThan(2);
    expect(Math.abs(o.upShare - 0.9)).toBeGreaterThan(0.02);
    expect(e.data!.night).toBe(kind);
    const m = PHRASE[kind].exec(e.description);
    expect(m, e.description).not.toBeNull();
    // "rises at 15:20": the printed clock time is astronomy-engine's rise, to the minute.
    if (kind === 'rises') {
      const local = new Intl.DateTimeFormat('en-GB', { timeZone: site.timeZone, hour: '2-digit', minute: '2-digit', hourCycle: 'h23' }).formatToParts(o.rise!);
      const minutes = Number(local.find((p) => p.type === 'hour')!.value) * 60 + Number(local.find((p) => p.type === 'minute')!.value);
      expect(Math.abs(Number(m![1]) * 60 + Number(m![2]) - minutes)).toBeLessThanOrEqual(1);
    }
    // Never the textbook phrase where it is false.
    if (kind !== 'sunset') expect(e.description).not.toContain('sunset');
  });
});
