/**
 * Deep-sky objects on bulletin pages: the `::deep-sky` list agrees with the library's
 * `wellPlaced` and its visibility model item by item; per-object placeholders work through the
 * registry (`:verdict{body=m31}`), in the page's language; an unknown id is an error at its place;
 * a night that never gets fully dark says so.
 */
import { describe, expect, it } from 'vitest';
import { defineSite } from '../lib/core/site.ts';
import { isoWeekOf } from '../lib/core/time.ts';
import { projectRegistry } from '../lib/models/content.ts';
import { wellPlaced, WELL_PLACED_ALTITUDE_DEG } from '../lib/models/deep-sky/placed.ts';
import { parseBulletin, renderBulletinSync, WeekCache } from '../lib/outputs/bulletin/index.ts';
import { GloamingError } from '../lib/core/errors.ts';

const page = (body: string): ReturnType<typeof parseBulletin> =>
  parseBulletin(`---\ntitle: Deep sky\nsites: all\nschedule: { every: week, past: 0, future: 0 }\n---\n\n${body}\n`, 'deep-sky.md');

const dark = defineSite({ id: 'dark', name: 'Dark field', latitude: 45, longitude: 0, timeZone: 'Europe/Paris', sky: { bortle: 2 }, elevation: 300 });
const week = isoWeekOf('2026-10-12');
const bodies = projectRegistry();

describe('::deep-sky', () => {
  it('lists what the library finds well placed, best first, with each object\'s verdict and best time', () => {
    const cache = new WeekCache();
    const r = renderBulletinSync(page('::deep-sky{limit=8}'), { site: dark, week, bodies }, cache);
    expect(r.problems).toEqual([]);
    const data = cache.get(dark, week, bodies);
    const expected = wellPlaced(data.nights[0]!, { limit: 8 });
    const listed = [...r.html.matchAll(/<li data-body="([^"]+)" data-verdict="([^"]+)"/g)].map((m) => [m[1], m[2]]);
    expect(listed).toEqual(expected.objects.map((p) => [p.night.body.id, p.night.visibility.verdict]));
    expect(listed.length).toBe(8);
    for (const p of expected.objects) {
      expect(p.night.visibility.verdict).not.toBe('not-visible');
      // Well placed: the best moment of a recommended object in this Moon-free October evening is high (≥ 30° at some dark moment).
      expect(p.night.body.kind).toBe('deep-sky');
    }
    // M 31 in an October evening from a dark rural site at 45° N, two days after new Moon (common practice).
    expect(r.html).toContain('M 31 (Andromeda Galaxy)</strong>, galaxy');
  });

  it('says so when the sky does not get fully dark in the viewing hours (midsummer at 55° N)', () => {
    const north = defineSite({ id: 'north', name: 'North', latitude: 55, longitude: 0, timeZone: 'Europe/London', sky: { bortle: 2 }, elevation: 0 });
    const r = renderBulletinSync(page('::deep-sky'), { site: north, week: isoWeekOf('2026-06-22'), bodies }, new WeekCache());
    expect(r.html).toContain('data-reason="no-darkness"');
    expect(r.html).toContain('The sky does not get fully dark during the viewing hours this night');
  });

  it(`leaves out bright objects that never climb ${WELL_PLACED_ALTITUDE_DEG}° (common practice): M 7 culminates about 10° up from 45° N`, () => {
    const data = new WeekCache().get(dark, week, bodies);
    const all = wellPlaced(data.nights[0]!).objects.map((p) => p.object.id);
    expect(all).not.toContain('M 7');
    expect(all).not.toContain('NGC 5139');
    expect(all.length).toBeGreaterThan(10);
  });
});

describe('per-object placeholders', () => {
  it(':verdict, :best-time and :direction work for a catalogue id, and names read in the page\'s language', () => {
    const es = defineSite({ id: 'es', name: 'Sitio', latitude: 40, longitude: -3.7, timeZone: 'Europe/Madrid', sky: { bortle: 2 }, elevation: 700, locale: 'es-ES' });
    const r = renderBulletinSync(page(':name{body=m31} — :verdict{body=m31}, :best-time{body=ngc224}, :direction{body=m31 at=best}'), { site: es, week, bodies }, new WeekCache());
    expect(r.problems).toEqual([]);
    expect(r.html).toContain('M 31 (Galaxia Andrómeda)');
    expect(r.html).toContain('a simple vista');
    expect(r.html).toMatch(/<time[^>]*data-body="m31"/);
  });

  it('an unknown id stops with its place and what would be right', () => {
    let error: unknown;
    try {
      renderBulletinSync(page('Look for :verdict{body=m999}.'), { site: dark, week, bodies }, new WeekCache());
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(GloamingError);
    const text = String((error as Error).message);
    expect(text).toContain("unknown object 'm999'");
    expect(text).toContain('a Messier or NGC id from the deep-sky catalogue');
    expect(text).toMatch(/deep-sky\.md:7:\d+/);
  });
});
