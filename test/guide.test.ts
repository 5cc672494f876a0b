/**
 * The guide phrase of lib/models/guide.ts on real skies, including three situations held out from
 * development (issue #13): a comet 25° from Markab, Mars inside Gemini seen from 33° S, and
 * Saturn 5° up in twilight from 33.9° S. Positions to compare with come from astronomy-engine
 * (`Equator`, `Horizon`, `SearchRiseSet`), an independent path from gloaming's own frame.
 */
import { Body, DefineStar, Equator, Horizon, MakeTime, SearchRiseSet } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { builtInBody } from '../lib/core/body.ts';
import { loadBodies } from '../lib/models/content.ts';
import { compass, handMeasure } from '../lib/core/describe.ts';
import { guideFor } from '../lib/models/guide.ts';
import { computeNight } from '../lib/models/night.ts';
import { defineSite } from '../lib/core/site.ts';
import { starByName } from '../lib/models/stars/catalogue.ts';
import { NEAR_STAR_DEG } from '../lib/models/stars/guide.ts';
import { angleDiffDeg, expectWithin } from './helpers/tolerance.ts';

const R = Math.PI / 180;

/** Separation of two alt-az places, degrees (spherical law of cosines). */
function altAzSeparationDeg(a: { altitude: number; azimuth: number }, b: { altitude: number; azimuth: number }): number {
  const c = Math.sin(a.altitude * R) * Math.sin(b.altitude * R) + Math.cos(a.altitude * R) * Math.cos(b.altitude * R) * Math.cos((a.azimuth - b.azimuth) * R);
  return Math.acos(Math.min(1, c)) / R;
}

describe('held-out situations (issue #13)', () => {
  it('a comet about 25° from Markab is not "in the Great Square of Pegasus" (51° N, 2027-01-13 19:00 UTC)', () => {
    const site = defineSite({ id: 'held-out-51n', name: 'Held-out site', latitude: 51, longitude: -1.5, timeZone: 'Europe/London', sky: { bortle: 7 } });
    const comet = loadBodies('content/objects').get('comet-lumen');
    const time = new Date('2027-01-13T19:00:00Z');
    const g = guideFor({ site, body: comet, time })!;
    expect(g.phrase).not.toMatch(/in the Great Square|inside/);
    // Whatever star it leads from is near enough to hop from, and stands above the horizon (astronomy-engine).
    if (g.anchorStar) {
      expect(g.separationDeg!).toBeLessThanOrEqual(NEAR_STAR_DEG);
      const star = starByName(g.anchorStar);
      DefineStar(Body.Star1, star.raDeg / 15, star.decDeg, 1000);
      const t = MakeTime(time);
      const eq = Equator(Body.Star1, t, site.observer, true, true);
      expect(Horizon(t, site.observer, eq.ra, eq.dec).altitude).toBeGreaterThan(0);
    }
  });

  it('Mars inside Gemini from 33° S (2025-03-24): "inside" comes with a named star, a direction and a distance', () => {
    const site = defineSite({ id: 'held-out-33s', name: 'Held-out site', latitude: -33, longitude: 151.2, timeZone: 'Australia/Sydney', sky: { bortle: 4 } });
    const night = computeNight(site, '2025-03-24', [builtInBody('mars')]);
    const g = night.bodies[0]!.guide!;
    const best = night.bodies[0]!.visibility.best!;
    expect(g.phrase).toMatch(/^inside (Gemini|the Winter Hexagon), about \d+° \([^)]+\) (above|below|to the (upper |lower )?(left|right) of) [A-Z][a-z]+$/);
    // The distance to the named star, from astronomy-engine's places of Mars and the star (J2000 star, apparent Mars).
    const t = MakeTime(best.time);
    const star = starByName(g.anchorStar!);
    const mars = Equator(Body.Mars, t, site.observer, true, true);
    const marsHor = Horizon(t, site.observer, mars.ra, mars.dec);
    DefineStar(Body.Star1, star.raDeg / 15, star.decDeg, 1000);
    const starEq = Equator(Body.Star1, t, site.observer, true, true);
    const starHor = Horizon(t, site.observer, starEq.ra, starEq.dec);
    // astronomy-engine adds stellar aberration (≤ 20″), the guide does not.
    expectWithin(g.separationDeg!, altAzSeparationDeg(marsHor, starHor), 0.02, 'distance from the named star');
  });

  it('Saturn 5° up in twilight from 33.9° S (2028-04-01 19:15 local) gets a guide from the horizon and the sunset point', () => {
    const site = defineSite({ id: 'held-out-34s', name: 'Held-out site', latitude: -33.9, longitude: 151.2, timeZone: 'Australia/Sydney', sky: { bortle: 4 } });
    const time = new Date('2028-04-01T08:15:00Z'); // 19:15 AEDT (UTC+11)
    const t = MakeTime(time);
    const saturn = Equator(Body.Saturn, t, site.observer, true, true);
    const hor = Horizon(t, site.observer, saturn.ra, saturn.dec, 'normal');
    expectWithin(hor.altitude, 5, 0.5, "Saturn's altitude (issue #13: 5° up)");
    const g = guideFor({ site, body: builtInBody('saturn'), time })!;
    expect(g).not.toBeNull();
    expect(g.kind).toBe('horizon');
    // The sunset point: the Sun's azimuth at the moment astronomy-engine finds for sunset.
    const sunset = SearchRiseSet(Body.Sun, site.observer, -1, t, -1)!;
    const sunEq = Equator(Body.Sun, sunset, site.observer, true, true);
    const sunsetAz = Horizon(sunset, site.observer, sunEq.ra, sunEq.dec, 'normal').azimuth;
    expectWithin(g.horizon!.sun!.offsetDeg, angleDiffDeg(hor.azimuth, sunsetAz), 0.3, 'degrees from the sunset point');
    // Facing the target, azimuth grows to the right.
    expect(g.horizon!.sun!.side).toBe(((hor.azimuth - sunsetAz + 540) % 360) - 180 > 0 ? 'right' : 'left');
    expectWithin(g.horizon!.altitudeDeg, hor.altitude, 0.05, 'apparent altitude');
    expect(g.phrase).toBe(`low in the ${compass(hor.azimuth).word}, ${handMeasure(g.horizon!.altitudeDeg)} above the horizon, about ${Math.round(g.horizon!.sun!.offsetDeg)}° (${handMeasure(Math.round(g.horizon!.sun!.offsetDeg))}) to the ${g.horizon!.sun!.side} of where the Sun set`);
  });
});
