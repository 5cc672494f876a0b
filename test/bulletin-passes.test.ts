/**
 * Satellite passes on bulletin pages over a year of weeks: a page never shows a pass predicted
 * from elements more than 14 days away (MAX_ELEMENT_AGE_DAYS, the refusal limit of
 * `gloaming passes`), and a week the element sets do not reach says so in a sentence instead of
 * warning or failing. The passes themselves are checked against astronomy-engine in
 * test/satellite-passes.test.ts.
 */
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { addDays, isoWeekOf } from '../lib/core/time.ts';
import { wordsFor } from '../lib/core/language/index.ts';
import { loadSites } from '../lib/models/content.ts';
import { OVERHEAD_ALTITUDE_DEG, passWhere, passWords, visibleTop } from '../lib/models/satellite/words.ts';
import { passNights } from '../lib/models/satellite/nights.ts';
import { chartPassOf, passAltSentence } from '../lib/outputs/chart/pass.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';
import { MAX_ELEMENT_AGE_DAYS } from '../lib/models/satellite/passes.ts';
import { parseBulletin, renderBulletinSync, WeekCache } from '../lib/outputs/bulletin/index.ts';

const TEMPLATE = parseBulletin('---\ntitle: Passes\nsites: all\nschedule: { every: week, past: 0, future: 0 }\n---\n\n::passes{limit=50}\n\n:::provided{has=brightest-pass}\n:brightest-pass{show=sentence}\n:::\n', 'passes.md');

describe('satellite passes over 52 weeks of bulletin pages', () => {
  it('list only passes within the element-age limit; weeks out of reach say so, without a warning', () => {
    const satellites = loadSatellites('content/satellites');
    const sites = [...loadSites('content/sites').values()];
    const cache = new WeekCache();
    let listed = 0;
    let unavailable = 0;
    for (const site of sites) {
      for (let w = -26; w < 26; w++) {
        const week = isoWeekOf(addDays('2026-12-04', 7 * w));
        const r = renderBulletinSync(TEMPLATE, { site, week, bodies: new BodyRegistry(), satellites }, cache);
        expect(r.problems, `${site.id} ${week.id}`).toEqual([]);
        const ages = [...r.html.matchAll(/data-element-age-days="(-?[\d.]+)"/g)].map((m) => Number(m[1]));
        for (const age of ages) expect(Math.abs(age), `${site.id} ${week.id}`).toBeLessThanOrEqual(MAX_ELEMENT_AGE_DAYS);
        listed += ages.length;
        if (r.html.includes('data-reason="unavailable"')) {
          unavailable++;
          expect(ages, `${site.id} ${week.id}: no pass in an unavailable week`).toEqual([]);
          // The sentence in the site's language (the English one reads "Satellite pass predictions are not available for this week: …").
          const words = passWords(wordsFor(site.locale));
          const said = words.unavailable(words.thisWeek);
          expect(r.html).toContain(said.charAt(0).toUpperCase() + said.slice(1));
          if (site.locale.startsWith('en')) expect(r.html).toContain('Satellite pass predictions are not available for this week');
          if (site.locale.startsWith('es')) expect(r.html).toContain('No hay predicciones de pasos de satélites para esta semana');
        }
      }
    }
    // The demo's element sets (epochs 3–4 December 2026) reach about five weeks of the 52.
    expect(listed).toBeGreaterThan(30);
    expect(unavailable).toBeGreaterThan(40 * sites.length);
  }, 120_000);
});

describe('the highest point of a pass, as seen', () => {
  // Near the zenith a compass word sends the eyes the wrong way: the sentence and the pass chart's
  // caption both say "almost straight overhead" from OVERHEAD_ALTITUDE_DEG (our own choice) up, and
  // both name the same highest point. A pass whose culmination falls in the Earth's shadow is
  // highest where it is first seen: it must not "climb" to a height it reached unseen.
  const satellites = loadSatellites('content/satellites');
  const sites = [...loadSites('content/sites').values()];
  /** Each catalogue's words for a pass through the zenith and for one highest where it appears (golden). */
  const OVERHEAD_WORDS: Record<string, string> = { en: 'it passes almost straight overhead', es: 'pasa casi por el cenit', de: 'zieht fast durch den Zenit', fr: 'passe presque au zénith' };
  const START_WORDS: Record<string, string> = { en: 'it is highest there', es: 'allí está en su punto más alto', de: 'steht dort am höchsten', fr: 'y est à son plus haut' };
  const CLIMB_WORDS: Record<string, RegExp> = { en: /climbs to/, es: /sube hasta/, de: /steigt bis/, fr: /monte jusqu’à/ };
  it('is named the same way in the sentence and in the chart caption: overhead, highest where it appears, or the height it climbs to', () => {
    const kinds = { overhead: 0, start: 0, inside: 0, end: 0 };
    for (const site of sites) {
      const language = wordsFor(site.locale).language;
      const words = passWords(wordsFor(site.locale));
      for (const night of passNights({ site, satellites, from: '2026-11-30', to: '2026-12-06' })) {
        for (const pass of night.passes.filter((p) => p.recommended)) {
          const top = visibleTop(pass);
          const text = words.description(pass, (p) => p.time.toISOString(), { appears: 'fade', leaves: 'fade' });
          const caption = passAltSentence(chartPassOf(pass), site);
          if (top.point.altitudeDeg >= OVERHEAD_ALTITUDE_DEG) {
            kinds.overhead++;
            expect(text).toContain(OVERHEAD_WORDS[language]);
            if (top.at === 'inside') expect(caption).toContain(passWhere(wordsFor(site.locale), top.point));
            continue;
          }
          kinds[top.at]++;
          expect(text).not.toMatch(/overhead|cenit|Zenit|zénith/);
          if (top.at === 'start') {
            expect(text).toContain(START_WORDS[language]);
            expect(text).not.toMatch(CLIMB_WORDS[language]!);
          } else {
            expect(text).toMatch(CLIMB_WORDS[language]!);
            expect(text).toContain(`${Math.round(top.point.altitudeDeg)}°`);
          }
          // The sentence never names a height above the highest point the caption's drawn track reaches.
          const heights = [...text.matchAll(/(\d+)°/g)].map((m) => Number(m[1]));
          expect(Math.max(...heights), text).toBeLessThanOrEqual(Math.round(top.point.altitudeDeg));
        }
      }
    }
    // The demo week has passes of each kind at its sites (invented element sets, content/satellites/).
    expect(kinds.overhead).toBeGreaterThan(0);
    expect(kinds.inside).toBeGreaterThan(0);
    expect(kinds.start + kinds.end).toBeGreaterThan(0);
  });
});

describe('a pass in a few words', () => {
  // The home page's "tonight" line: where a pass goes, in compass words of the site's language.
  const satellites = loadSatellites('content/satellites');
  const sites = [...loadSites('content/sites').values()];
  /** Each catalogue's frame for a pass seen in one direction only (golden). */
  const IN_ONE: Record<string, (d: string) => string> = { en: (d) => `, in the ${d},`, es: (d) => `, en el ${d},`, de: (d) => `, im ${d},`, fr: (d) => `, vers ${d},` };
  it('says "in the north" for a pass that ends in the direction it began, never "north to north"', () => {
    let same = 0;
    let moving = 0;
    for (const site of sites) {
      const w = wordsFor(site.locale);
      const words = passWords(w);
      for (const night of passNights({ site, satellites, from: '2026-11-30', to: '2026-12-06' })) {
        for (const pass of night.passes.filter((p) => p.recommended)) {
          const from = w.compass(pass.visible!.start.azimuthDeg).word;
          const to = w.compass(pass.visible!.end.azimuthDeg).word;
          const text = words.short(pass);
          if (from === to) {
            same++;
            expect(text).toContain(IN_ONE[w.language]!(from));
          } else {
            moving++;
            expect(text).not.toContain(IN_ONE[w.language]!(from));
          }
          if (w.language === 'en') expect(text).not.toMatch(/, ([a-z-]+) to \1,/);
        }
      }
    }
    // The demo week at the four sites has both (invented element sets; the polar site sees passes that fade where they rose).
    expect(same).toBeGreaterThan(0);
    expect(moving).toBeGreaterThan(0);
  });
});
