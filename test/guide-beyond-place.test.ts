/**
 * A sentence that already gives a target's altitude and direction ("10° (about a fist) up in the
 * south-east, …") gets from its guide only what those do not say (`:guide{omit=place}`,
 * `guideBeyondPlace` in lib/models/stars/guide.ts): when no star, pattern or bright body is near, the
 * horizon guide would repeat "low in the south-east, about a fist above the horizon", so it says only
 * where the Sun set or will rise, or nothing at all. Whether there is a Sun point to say is a sky
 * fact: it is checked here against astronomy-engine (`Horizon` for the Sun's and the target's
 * altitude and azimuth, `SearchRiseSet` for the sunset point), an independent path from gloaming's.
 */
import { Body, Equator, Horizon, MakeTime, SearchRiseSet } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { builtInBody, BodyRegistry } from '../lib/core/body.ts';
import { compass, handMeasure } from '../lib/core/describe.ts';
import { wordsFor } from '../lib/core/language/index.ts';
import { loadSites } from '../lib/models/content.ts';
import { guideFor } from '../lib/models/guide.ts';
import { defineSite, type Site } from '../lib/core/site.ts';
import { guideBeyondPlace, guidePhrase } from '../lib/models/stars/guide.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { parseBulletin, renderBulletinSync, WeekCache } from '../lib/outputs/bulletin/index.ts';
import { angleDiffDeg, expectWithin } from './helpers/tolerance.ts';

const LANGUAGES = ['en', 'es', 'de', 'fr'] as const;

/** The apparent (refracted) altitude and azimuth of a body from a site, and the Sun's altitude (astronomy-engine). */
function sky(site: Site, body: Body, time: Date): { altitude: number; azimuth: number; sunAltitude: number } {
  const t = MakeTime(time);
  const eq = Equator(body, t, site.observer, true, true);
  const hor = Horizon(t, site.observer, eq.ra, eq.dec, 'normal');
  const sun = Equator(Body.Sun, t, site.observer, true, true);
  return { altitude: hor.altitude, azimuth: hor.azimuth, sunAltitude: Horizon(t, site.observer, sun.ra, sun.dec, 'normal').altitude };
}

function count(text: string, word: string): number {
  return text.split(word).length - 1;
}

describe('guideBeyondPlace: the horizon guide without the altitude and direction', () => {
  it('Saturn 5° up in twilight from 33.9° S (2028-04-01 19:15 local): only where the Sun set, in every language', () => {
    const site = defineSite({ id: 'held-out-34s', name: 'Held-out site', latitude: -33.9, longitude: 151.2, timeZone: 'Australia/Sydney', sky: { bortle: 4 } });
    const time = new Date('2028-04-01T08:15:00Z');
    const s = sky(site, Body.Saturn, time);
    // astronomy-engine: the Sun is in twilight (between 0° and −18°), so a Sun point is there to say.
    expect(s.sunAltitude).toBeLessThan(0);
    expect(s.sunAltitude).toBeGreaterThan(-18);
    const g = guideFor({ site, body: builtInBody('saturn'), time })!;
    expect(g.kind).toBe('horizon');
    const sunset = SearchRiseSet(Body.Sun, site.observer, -1, MakeTime(time), -1)!;
    const sunEq = Equator(Body.Sun, sunset, site.observer, true, true);
    const sunsetAz = Horizon(sunset, site.observer, sunEq.ra, sunEq.dec, 'normal').azimuth;
    const offset = Math.round(angleDiffDeg(s.azimuth, sunsetAz));
    const side = ((s.azimuth - sunsetAz + 540) % 360) - 180 > 0 ? 'right' : 'left';
    expect(guideBeyondPlace(g.said)).toBe(`about ${offset}° (${handMeasure(offset)}) to the ${side} of where the Sun set`);
    for (const language of LANGUAGES) {
      const words = wordsFor(language);
      const beyond = guideBeyondPlace(g.said, words)!;
      const full = guidePhrase(g.said, words);
      // The full phrase names the direction and ends with the Sun point; the shorter one is that end alone.
      expect(full.endsWith(beyond), language).toBe(true);
      expect(count(full, words.compass(s.azimuth).word), language).toBe(1);
      expect(count(beyond, words.compass(s.azimuth).word), language).toBe(0);
      expect(beyond, language).not.toContain(words.handMeasure(g.horizon!.altitudeDeg));
    }
  });

});

describe(':guide{omit=place} on demo pages: each fact once', () => {
  const sites = loadSites('content/sites');
  const bodies = new BodyRegistry();
  const cache = new WeekCache();
  const TEMPLATE = [
    ':::provided{has=guide body=%b omit=place}',
    'WITH %B :altitude{body=%b at=best} up in the :direction{body=%b at=best}, :guide{body=%b omit=place}. Best at :best-time{body=%b}.',
    '::otherwise',
    'WITHOUT %B :altitude{body=%b at=best} up in the :direction{body=%b at=best}. Best at :best-time{body=%b}.',
    ':::',
    '',
    '::targets',
  ].join('\n');

  function page(siteId: string, date: string, body: string): { text: string; best: Date } {
    const site = sites.get(siteId)!;
    const markdown = TEMPLATE.replaceAll('%b', body).replaceAll('%B', body.toUpperCase());
    const template = parseBulletin(`---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n${markdown}\n`, 'beyond.md');
    const html = renderBulletinSync(template, { site, week: isoWeekOf(date), bodies }, cache).html;
    const best = /class="gl gl-best-time"[^>]*datetime="([^"]+)"|datetime="([^"]+)"[^>]*class="gl gl-best-time"/.exec(html);
    expect(best, html).not.toBeNull();
    return { text: html.replace(/<[^>]+>/g, '').replace(/[\u00a0\u202f]/g, ' '), best: new Date(best![1] ?? best![2]!) };
  }

  it('Jupiter from Cerro Lucero, Monday 25 January 2027 (10:59 p.m.): a horizon guide in full darkness adds nothing, so the sentence goes without it', () => {
    const { text, best } = page('cerro-lucero', '2027-01-25', 'jupiter');
    const site = sites.get('cerro-lucero')!;
    const s = sky(site, Body.Jupiter, best);
    // No Sun point to say (astronomy-engine): the Sun is more than 18° down, or the point where it set is more than 90° of azimuth from Jupiter.
    const sunset = SearchRiseSet(Body.Sun, site.observer, -1, MakeTime(best), -1)!;
    const sunEq = Equator(Body.Sun, sunset, site.observer, true, true);
    const sunsetAz = Horizon(sunset, site.observer, sunEq.ra, sunEq.dec, 'normal').azimuth;
    expect(s.sunAltitude < -18 || angleDiffDeg(s.azimuth, sunsetAz) > 90, `Sun ${s.sunAltitude.toFixed(1)}°, set point ${angleDiffDeg(s.azimuth, sunsetAz).toFixed(0)}° away`).toBe(true);
    // …and no star or pattern near: the guide leads from the horizon.
    const g = guideFor({ site, body: builtInBody('jupiter'), time: best })!;
    expect(g.kind).toBe('horizon');
    expectWithin(g.horizon!.altitudeDeg, s.altitude, 0.05, 'apparent altitude (astronomy-engine)');
    const words = wordsFor(site.locale);
    const sentence = text.split('\n').find((l) => l.includes('JUPITER'))!;
    expect(sentence).toMatch(/^WITHOUT JUPITER /);
    expect(sentence).toContain(`${Math.round(s.altitude)}°`);
    expect(count(sentence, words.compass(s.azimuth).word)).toBe(1);
    // Nowhere on the page, the target list included, is the height said again in hands above the horizon.
    expect(count(text, words.t('guide.height', { hand: words.handMeasure(s.altitude) }))).toBe(0);
  });

  it('Venus from Harbour Roof, Monday 22 February 2027 (morning twilight): only where the Sun will rise', () => {
    const { text, best } = page('harbour-roof', '2027-02-22', 'venus');
    const site = sites.get('harbour-roof')!;
    const s = sky(site, Body.Venus, best);
    expect(s.sunAltitude, 'Sun in twilight at the best time (astronomy-engine)').toBeLessThan(0);
    expect(s.sunAltitude).toBeGreaterThan(-18);
    const sentence = text.split('\n').find((l) => l.includes('VENUS'))!;
    expect(sentence).toMatch(/^WITH VENUS /);
    expect(sentence).toMatch(/where the Sun will rise\. Best at/);
    expect(count(sentence, compass(s.azimuth).word)).toBe(1);
    expect(sentence).not.toContain('above the horizon');
  });
});
