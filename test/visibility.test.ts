/**
 * Best viewing time, window and verdict (issue #4) on real ephemerides. The behaviour checks
 * encode the trade's common practice (marked so); the numeric model itself is checked against
 * published values in test/sky-*.test.ts.
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { builtInBody } from '../lib/core/body.ts';
import { computeNight } from '../lib/models/night.ts';
import { defineSite, skylineAltitudeDeg } from '../lib/core/site.ts';
import { utDays } from '../lib/core/track.ts';
import { DEFAULT_INSTRUMENTS } from '../lib/models/sky/threshold.ts';
import { fixedBody, offsetFrom } from './helpers/fixed-body.ts';

const city = (extra: Record<string, unknown> = {}) =>
  defineSite({ id: 'city', latitude: 51.5, longitude: -0.1, timeZone: 'Europe/London', sky: { bortle: 8 }, ...extra });
const dark = defineSite({ id: 'dark', latitude: 51.5, longitude: -0.1, timeZone: 'Europe/London', sky: { bortle: 2 }, elevation: 300 });

/** Full Moon of December 2026 (astronomy-engine's search, an outside computation of the date). */
function fullMoonDate(): string {
  const t = Astronomy.SearchMoonPhase(180, Astronomy.MakeTime(new Date('2026-12-15T00:00:00Z')), 20)!;
  return t.date.toISOString().slice(0, 10);
}

describe('verdicts (common practice)', () => {
  it('Jupiter near opposition (2026 January) is a naked-eye object from a Bortle 8 city', () => {
    const r = computeNight(city(), '2026-01-12', [builtInBody('jupiter')]);
    expect(r.bodies[0]!.visibility.verdict).toBe('naked-eye');
  });

  it('Venus as an evening star (2026 August, near greatest eastern elongation) is a naked-eye object from a Bortle 8 city', () => {
    const r = computeNight(city(), '2026-08-12', [builtInBody('venus')]);
    const v = r.bodies[0]!.visibility;
    expect(v.verdict).toBe('naked-eye');
    expect(v.outsideViewingHours).toBe(false);
  });

  it('a magnitude-4.5 comet 60° from the full Moon is not naked-eye, but is a binocular object from a dark site (with the default findability margin)', () => {
    const date = fullMoonDate();
    const midnight = Astronomy.MakeTime(new Date(`${date}T00:00:00Z`));
    const moon = Astronomy.GeoVector(Astronomy.Body.Moon, midnight, true);
    const place = offsetFrom(moon, 60, true);
    const comet = fixedBody({ raHours: place.raHours, decDeg: place.decDeg, magnitude: 4.5, comaDiameterArcmin: 5 });
    const v = computeNight(dark, date, [comet]).bodies[0]!.visibility;
    expect(v.verdict).toBe('binoculars');
    const noMoon = computeNight(dark, '2026-12-09', [comet]).bodies[0]!.visibility;
    expect(noMoon.verdict, 'without the Moon the same comet is a naked-eye object at a dark site').toBe('naked-eye');
  });

  it('with the Sun up only the Moon and Venus near its brightest are naked-eye objects (at the detection threshold: findability margin 0)', () => {
    // Venus near greatest brilliancy (about −4.7) on 2026 September 10, seen around local noon
    // from a clear, dark, 800 m site at 32° N; the Moon is high that day, Jupiter (−1.9) too.
    const site = defineSite({ id: 'hill', latitude: 32, longitude: 35, elevation: 800, timeZone: 'Asia/Jerusalem', sky: { bortle: 4 }, findabilityMargin: 0 });
    const r = computeNight(site, '2026-09-10', [builtInBody('venus'), builtInBody('jupiter'), builtInBody('moon')]);
    const noon = utDays(r.night.start);
    const span = { ut0: noon - 2 / 24, ut1: noon + 3 / 24 };
    expect(r.frame.sun.at(noon).geometricAltitudeDeg).toBeGreaterThan(40);
    const nakedEye = [DEFAULT_INSTRUMENTS['naked-eye']];
    const verdict = (i: number) => r.sky.visibility(r.bodies[i]!.body, { span, instruments: nakedEye });
    expect(verdict(0).verdict).toBe('naked-eye');
    expect(r.frame.track(r.bodies[1]!.body).at(noon).geometricAltitudeDeg, 'Jupiter is well up').toBeGreaterThan(30);
    expect(verdict(1).verdict).toBe('not-visible');
    expect(verdict(1).reason).toBe('daylight');
    expect(r.frame.moon.at(noon).geometricAltitudeDeg, 'the Moon is well up').toBeGreaterThan(30);
    expect(verdict(2).verdict).toBe('naked-eye');
  });

  it('a target 10° from the Sun at dusk is reported as lost in twilight', () => {
    const date = '2026-03-20';
    const r0 = computeNight(city({ sky: { bortle: 4 } }), date, []);
    const sunset = r0.sun.set.time!;
    const sun = Astronomy.GeoVector(Astronomy.Body.Sun, Astronomy.MakeTime(sunset), true);
    const place = offsetFrom(sun, 10, true);
    const target = fixedBody({ raHours: place.raHours, decDeg: place.decDeg, magnitude: 1.5 });
    // For the eye and binoculars, the aids a bulletin recommends near the Sun.
    const r = computeNight(city({ sky: { bortle: 4 } }), date, [target]);
    const v = r.sky.visibility(target, { instruments: [DEFAULT_INSTRUMENTS['naked-eye'], DEFAULT_INSTRUMENTS.binoculars] });
    expect(v.verdict).toBe('not-visible');
    expect(v.reason).toBe('twilight');
  });

  it('a planet in conjunction with the Sun is too close to the Sun', () => {
    // Mercury inferior conjunction 2026 March 7 (astronomy-engine SearchRelativeLongitude gives the date).
    const t = Astronomy.SearchRelativeLongitude(Astronomy.Body.Mercury, 0, Astronomy.MakeTime(new Date('2026-02-20T00:00:00Z')));
    const date = t.date.toISOString().slice(0, 10);
    const v = computeNight(city(), date, [builtInBody('mercury')]).bodies[0]!.visibility;
    expect(v.verdict).toBe('not-visible');
    expect(v.reason).toBe('too-close-to-sun');
  });
});

describe('best time and window invariants', () => {
  const site = defineSite({
    id: 'roof',
    latitude: 48.2,
    longitude: 16.4,
    timeZone: 'Europe/Vienna',
    sky: { bortle: 6 },
    horizon: [
      { azimuth: 0, altitude: 4 },
      { azimuth: 90, altitude: 12 },
      { azimuth: 180, altitude: 6 },
      { azimuth: 270, altitude: 15 },
    ],
  });
  const dates = ['2026-01-05', '2026-03-18', '2026-06-21', '2026-09-09', '2026-12-04'];
  const ids = ['moon', 'venus', 'mars', 'jupiter', 'saturn', 'uranus'] as const;

  for (const date of dates) {
    it(`${date}: best time inside the window, above the skyline, stable when the step is halved`, () => {
      const r = computeNight(site, date, ids.map((id) => builtInBody(id)));
      for (const b of r.bodies) {
        const v = b.visibility;
        if (!v.best) {
          expect(v.reason).not.toBeNull();
          continue;
        }
        expect(v.window).not.toBeNull();
        expect(v.best.time.getTime()).toBeGreaterThanOrEqual(v.window!.start.getTime() - 1000);
        expect(v.best.time.getTime()).toBeLessThanOrEqual(v.window!.end.getTime() + 1000);
        expect(v.best.altitudeDeg).toBeGreaterThanOrEqual(Math.max(site.minAltitudeDeg, skylineAltitudeDeg(site, v.best.azimuthDeg)) - 1e-6);
        expect(v.best.margin).toBeGreaterThan(0);
        const halved = r.sky.visibility(b.body, { stepDays: 2.5 / 1440 });
        expect(halved.verdict).toBe(v.verdict);
        expect(Math.abs(halved.best!.time.getTime() - v.best.time.getTime()), `${b.body.id} best time moved`).toBeLessThan(60_000);
      }
    });
  }
});
