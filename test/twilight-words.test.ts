/**
 * The twilight cells of `::moon-and-twilight` (and `:dark`, `:dawn`) say why there is no time in
 * the words that fit the night: under the midnight Sun "the Sun stays up all night", in a white
 * night (the Sun sets but never sinks 18° below) "no astronomical darkness this night…". Which
 * case a night is comes from astronomy-engine: the Sun's altitude sampled through the night.
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { loadSites } from '../lib/models/content.ts';
import { isoWeekOf, nightOf } from '../lib/core/time.ts';
import { WeekCache, parseBulletin, renderBulletinSync } from '../lib/outputs/bulletin/index.ts';

const sites = loadSites('content/sites');
const FM = '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n';

/** The Sun's lowest apparent altitude (centre, standard refraction) over the night of `date` at `site`, every 5 minutes, degrees. */
function lowestSunDeg(siteId: string, date: string): number {
  const site = sites.get(siteId)!;
  const { start, end } = nightOf(date, site.timeZone);
  let lowest = 90;
  for (let t = start.getTime(); t <= end.getTime(); t += 5 * 60_000) {
    const time = Astronomy.MakeTime(new Date(t));
    const eq = Astronomy.Equator(Astronomy.Body.Sun, time, site.observer, true, true);
    lowest = Math.min(lowest, Astronomy.Horizon(time, site.observer, eq.ra, eq.dec, 'normal').altitude);
  }
  return lowest;
}

/** Cell `column` (0 sunset, 1 end of twilight, 2 start of twilight, 3 moonrise, 4 moonset) of each night row of the week containing `date`, as text. */
function cells(siteId: string, date: string, column: number): Map<string, string> {
  const html = renderBulletinSync(parseBulletin(`${FM}::moon-and-twilight\n`, 'content/bulletins/t.md'), { site: sites.get(siteId)!, week: isoWeekOf(date), bodies: new BodyRegistry() }, new WeekCache()).html;
  const rows = [...html.matchAll(/<tr data-night="([\d-]+)">(.*?)<\/tr>/g)];
  return new Map(rows.map(([, night, row]) => [night!, (row!.match(/<td>(.*?)<\/td>/g) ?? [])[column]!.replace(/<[^>]+>/g, '')]));
}

describe('twilight cells in the light nights', () => {
  it('under the midnight Sun (68.6° N, June 2027) say the Sun stays up all night', () => {
    const dark = cells('northern-outpost', '2027-06-16', 1);
    expect(dark.size).toBe(7);
    for (const [night, cell] of dark) {
      // −0.83°: the upper limb on the horizon (refraction 34′, semidiameter 16′), Meeus ch. 15.
      expect(lowestSunDeg('northern-outpost', night), night).toBeGreaterThan(-0.83);
      expect(cell, night).toContain('the Sun stays up all night');
      expect(cell, night).not.toContain('18°');
    }
  });

  it('in a white night (50.5° N, June 2027) say there is no astronomical darkness', () => {
    const dark = cells('harbour-roof', '2027-06-16', 1);
    for (const [night, cell] of dark) {
      const lowest = lowestSunDeg('harbour-roof', night);
      expect(lowest, night).toBeLessThan(-0.83);
      expect(lowest, night).toBeGreaterThan(-18);
      expect(cell, night).toContain('no astronomical darkness this night');
    }
  });

  it('the moonset cell of a night the Moon stays down says so, not "does not rise" (astronomy-engine altitudes)', () => {
    const site = sites.get('northern-outpost')!;
    const set = cells('northern-outpost', '2027-06-16', 4);
    let down = 0;
    for (const [night, cell] of set) {
      const { start, end } = nightOf(night, site.timeZone);
      let highest = -90;
      for (let t = start.getTime(); t <= end.getTime(); t += 5 * 60_000) {
        const time = Astronomy.MakeTime(new Date(t));
        const eq = Astronomy.Equator(Astronomy.Body.Moon, time, site.observer, true, true);
        highest = Math.max(highest, Astronomy.Horizon(time, site.observer, eq.ra, eq.dec, 'normal').altitude);
      }
      if (highest < -1) {
        expect(cell, night).toBe('stays below the horizon all night');
        down++;
      }
    }
    expect(down).toBeGreaterThan(2);
  });
});
