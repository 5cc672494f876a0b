/**
 * The "next nights" panel against astronomy-engine (an independent library, npm devDependency):
 * sunset, end of astronomical twilight and the Moon's state at dusk, for the three demo sites over
 * a grid of dates through a year (including polar night and midnight sun at the northern site).
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { loadSites } from '../lib/models/content.ts';
import { computeNight } from '../lib/models/night.ts';
import { addDays, zonedTime } from '../lib/core/time.ts';
import { moonUpAt, nextNights } from '../site/gloaming/nights.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';

const sites = loadSites(new URL('../content/sites', import.meta.url).pathname);
const DATES = Array.from({ length: 24 }, (_, k) => addDays('2026-01-03', 15 * k + (k % 5)));
const MINUTE_MS = 60_000;

describe('next nights panel', () => {
  for (const site of sites.values()) {
    it(`${site.id}: sunset and darkness match astronomy-engine within 1 minute`, () => {
      let compared = 0;
      for (const date of DATES) {
        const row = nextNights(site, date, 1)[0]!;
        const noon = Astronomy.MakeTime(zonedTime(date, 12, 0, site.timeZone));
        // astronomy-engine's SearchRiseSet uses the Sun's upper limb with standard refraction (its docs).
        const set = Astronomy.SearchRiseSet(Astronomy.Body.Sun, site.observer, -1, noon, 1);
        if (set) {
          expect(row.sunset.datetime, date).not.toBeNull();
          expect(Math.abs(new Date(row.sunset.datetime!).getTime() - set.date.getTime()), date).toBeLessThan(MINUTE_MS);
          compared++;
        } else {
          expect(row.sunset.datetime, date).toBeNull();
        }
        const dark = Astronomy.SearchAltitude(Astronomy.Body.Sun, site.observer, -1, noon, 1, -18);
        if (dark) {
          expect(Math.abs(new Date(row.darkness.datetime!).getTime() - dark.date.getTime()), date).toBeLessThan(MINUTE_MS);
          compared++;
        } else {
          expect(row.darkness.datetime, date).toBeNull();
          expect(row.darkness.text).toMatch(/never fully dark|dark all day/);
        }
      }
      expect(compared).toBeGreaterThan(20);
    });
  }

  it('northern outpost: polar night in December and no full darkness in June are said in words', () => {
    const outpost = sites.get('northern-outpost')!;
    const december = nextNights(outpost, '2026-12-20', 1)[0]!;
    expect(december.sunset).toEqual({ datetime: null, text: 'Sun stays down' });
    const june = nextNights(outpost, '2026-06-20', 1)[0]!;
    expect(june.darkness).toEqual({ datetime: null, text: 'never fully dark' });
  });

  it('the Moon\'s lit percentage is astronomy-engine\'s, except that a crescent or gibbous Moon never shows 0% or 100%', () => {
    // 5 February 2027 at Harbour Roof Terrace: a waning crescent under 0.5% lit at the night's midnight (new Moon on 6 February).
    const site = sites.get('harbour-roof')!;
    const rows = nextNights(site, '2027-02-01', 10);
    for (const row of rows) {
      const t = Astronomy.MakeTime(zonedTime(row.date, 22, 0, site.timeZone));
      const fraction = Astronomy.Illumination(Astronomy.Body.Moon, t).phase_fraction;
      const crescentOrGibbous = row.moonPhase.endsWith('crescent') || row.moonPhase.endsWith('gibbous');
      if (crescentOrGibbous) expect(row.moonLitPercent, row.date).toBeGreaterThanOrEqual(1);
      if (crescentOrGibbous) expect(row.moonLitPercent, row.date).toBeLessThanOrEqual(99);
      // The panel gives the fraction of its night (local midnight), not of 22:00: within 3 points.
      if (fraction > 0.01 && fraction < 0.99) expect(Math.abs(row.moonLitPercent - fraction * 100), row.date).toBeLessThanOrEqual(3);
    }
    expect(rows.find((r) => r.date === '2027-02-05')).toMatchObject({ moonPhase: 'waning-crescent', moonLitPercent: 1 });
  });

  it("the Moon's state at dusk agrees with its altitude from astronomy-engine", () => {
    let checked = 0;
    for (const site of sites.values()) {
      for (const date of DATES) {
        const report = computeNight(site, date, []);
        const dusk = report.sun.set.time ?? zonedTime(date, 18, 0, site.timeZone);
        const t = Astronomy.MakeTime(dusk);
        const eq = Astronomy.Equator(Astronomy.Body.Moon, t, site.observer, true, true);
        const altitude = Astronomy.Horizon(t, site.observer, eq.ra, eq.dec, 'normal').altitude;
        // Rise/set altitude of the Moon's centre: about −0.83° + parallax ≈ +0.1° … +0.2° (Meeus ch. 15, h0 = 0.125°); skip the borderline.
        if (Math.abs(altitude - 0.125) < 0.5) continue;
        expect(moonUpAt(report, dusk), `${site.id} ${date} altitude ${altitude.toFixed(2)}`).toBe(altitude > 0.125);
        checked++;
      }
    }
    expect(checked).toBeGreaterThan(60);
  });

  it('rows are in the site locale: 24-hour for en-GB, 12-hour for en-AU', () => {
    expect(nextNights(sites.get('harbour-roof')!, '2026-12-04', 1)[0]!.sunset.text).toMatch(/^\d{2}:\d{2}$/);
    expect(nextNights(sites.get('southern-station')!, '2026-12-04', 1)[0]!.sunset.text).toMatch(/^\d{1,2}:\d{2}\s?pm$/);
  });

  it("tonight's satellite passes: the naked-eye passes of the night, or a plain sentence when the element sets do not reach it", () => {
    const satellites = loadSatellites('content/satellites');
    const harbour = sites.get('harbour-roof')!;
    // The demo's element sets (epochs 3–4 December 2026): tonight's two evening passes of the demo station and a morning pass of the rocket stage.
    const tonight = nextNights(harbour, '2026-12-04', 2, satellites);
    expect(tonight[0]!.passes!.items.map((p) => p.time.text)).toEqual(['16:15', '17:50', '05:37']);
    expect(tonight[0]!.passes!.items[0]!.text).toMatch(/^Demo station, west-northwest to east-southeast, up to \d+°, magnitude −\d\.\d$/);
    expect(tonight[1]!.passes).toBeNull();
    // Two months later the elements are 60 days old: no stale pass, a sentence.
    const later = nextNights(harbour, '2027-02-01', 1, satellites)[0]!.passes!;
    expect(later.items).toEqual([]);
    expect(later.text).toBe('predictions not available (orbital elements out of date)');
    // A site that follows no satellites says nothing about them.
    expect(nextNights(harbour, '2026-12-04', 1)[0]!.passes).toBeNull();
  });
});
