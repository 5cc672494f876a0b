/**
 * The note after an event that cannot be seen must not seem to deny its sentence. A new Moon's
 * sentence is about the dark nights around it, so its note says that the Moon itself cannot be
 * seen (it is lost in the Sun's glare: astronomy-engine puts it a few degrees from the Sun).
 */
import { AngleFromSun, Body, MakeTime, SearchMoonPhase } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { loadSites } from '../lib/models/content.ts';
import { nightOf } from '../lib/core/time.ts';

const sites = loadSites('content/sites');

describe('the note of a hidden new Moon', () => {
  for (const [id, locale, words] of [
    ['southern-station', 'en', 'The Moon itself cannot be seen from Southern Field Station'],
    ['cerro-lucero', 'es', 'La Luna misma no se ve desde Observatorio Cerro Lucero'],
  ] as const) {
    it(`says the Moon itself cannot be seen (${id}, ${locale}; astronomy-engine SearchMoonPhase and AngleFromSun)`, () => {
      const site = sites.get(id)!;
      const events = findEvents({ site, from: nightOf('2026-12-05', site.timeZone).start, to: nightOf('2026-12-12', site.timeZone).end, options: { types: ['new-moon'] } });
      expect(events).toHaveLength(1);
      const e = events[0]!;
      const reference = SearchMoonPhase(0, new Date('2026-12-05T00:00:00Z'), 10)!;
      expect(Math.abs(e.time.getTime() - reference.date.getTime())).toBeLessThan(60_000);
      expect(AngleFromSun(Body.Moon, MakeTime(e.time))).toBeLessThan(10);
      expect(e.visible).toBe(false);
      expect(e.visibility.note).toContain(words);
    });
  }
});
