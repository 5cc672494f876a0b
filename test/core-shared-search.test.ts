/**
 * `sharedSearch` (lib/core/search.ts): a site-independent search done once per fixed UT bucket gives
 * the same results as the search done directly over the range asked, whatever the order in which
 * sites and weeks ask; and the almanac's events for a site do not depend on which site asked first.
 */
import { describe, expect, it } from 'vitest';
import * as Astronomy from 'astronomy-engine';
import { sharedSearch } from '../lib/core/search.ts';
import { defineSite } from '../lib/core/site.ts';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { seededRandom } from './helpers/random.ts';

function quarters(from: Date, to: Date): Date[] {
  const out: Date[] = [];
  for (let q = Astronomy.SearchMoonQuarter(from); q.time.date < to; q = Astronomy.NextMoonQuarter(q)) out.push(q.time.date);
  return out;
}

describe('sharedSearch', () => {
  it('returns exactly what the direct search finds in the range, for ranges cutting buckets anywhere', () => {
    const random = seededRandom(7);
    const owner = {};
    for (let i = 0; i < 60; i++) {
      const from = new Date(Date.UTC(2026, 0, 1) + random() * 400 * 86_400_000);
      const to = new Date(from.getTime() + (0.2 + random() * 20) * 86_400_000);
      const shared = sharedSearch(owner, 'quarters', from, to, quarters, (t) => t);
      // Astronomy Engine's own search from the range's start: the reference. Its instants depend on
      // where the search starts by up to a fraction of a second (its convergence tolerance).
      const direct = quarters(from, to);
      expect(shared).toHaveLength(direct.length);
      shared.forEach((t, k) => expect(Math.abs(t.getTime() - direct[k]!.getTime())).toBeLessThan(1000));
    }
  });

  it('keeps results per owner and key', () => {
    const calls: string[] = [];
    const find = (tag: string) => (from: Date): Date[] => (calls.push(tag), [new Date(from.getTime() + 3_600_000)]);
    const a = {}, b = {};
    const from = new Date(Date.UTC(2027, 2, 1)), to = new Date(Date.UTC(2027, 2, 3));
    sharedSearch(a, 'k', from, to, find('a'), (t) => t);
    sharedSearch(a, 'k', from, to, find('a again'), (t) => t);
    sharedSearch(a, 'other', from, to, find('a other'), (t) => t);
    sharedSearch(b, 'k', from, to, find('b'), (t) => t);
    expect(calls).toEqual(['a', 'a other', 'b']);
  });
});

describe('events shared across sites and weeks', () => {
  const north = defineSite({ id: 'north', latitude: 60.2, longitude: 24.9, timeZone: 'Europe/Helsinki' });
  const south = defineSite({ id: 'south', latitude: -33.9, longitude: 18.4, timeZone: 'Africa/Johannesburg' });
  const day = 86_400_000;
  const start = Date.UTC(2028, 0, 3, 10);
  const lines = (events: ReturnType<typeof findEvents>): string[] => events.map((e) => `${e.type} ${e.time.toISOString()} ${e.bodies.join()}`);

  it('a month asked week by week gives the same events at the same instants as the month asked at once', () => {
    const weekly = [0, 1, 2, 3].flatMap((w) => lines(findEvents({ site: north, from: new Date(start + 7 * w * day), to: new Date(start + 7 * (w + 1) * day) })));
    const month = lines(findEvents({ site: north, from: new Date(start), to: new Date(start + 28 * day) }));
    expect(weekly).toEqual(month);
    expect(month.filter((l) => /^(new-moon|first-quarter|full-moon|last-quarter) /.test(l))).toHaveLength(4);
  });

  it('two sites get the same instants for the events that are the same from everywhere', () => {
    const global = /^(new-moon|first-quarter|full-moon|last-quarter|perigee|apogee|equinox|solstice|opposition|conjunction|stationary|close-approach) /;
    const of = (site: typeof north): string[] => lines(findEvents({ site, from: new Date(start), to: new Date(start + 28 * day) })).filter((l) => global.test(l));
    expect(of(south)).toEqual(of(north));
  });
});
