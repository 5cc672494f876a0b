/**
 * Week summaries (issue #4): the best night and the week's changes in words. Checks against
 * outside facts: the Moon rises on average about 50 minutes later each day (the synodic month,
 * 29.53 d, makes the Moon lag the Sun by 24 h × 24 h / 29.53 d ≈ 49 min a day; common practice
 * quotes "about 50 minutes"), and the ISO week's nights run Monday to Sunday.
 */
import { describe, expect, it } from 'vitest';
import { builtInBody } from '../lib/core/body.ts';
import { main } from '../lib/outputs/cli/main.ts';
import { defineSite } from '../lib/core/site.ts';
import { computeWeek, weekdayName } from '../lib/models/week.ts';

const site = defineSite({ id: 'mid', latitude: 45, longitude: 7.7, timeZone: 'Europe/Rome', sky: { bortle: 4 } });

describe('week summaries', () => {
  it('the nights are Monday to Sunday of the ISO week', () => {
    const w = computeWeek(site, '2026-12-10', [builtInBody('moon')]);
    expect(w.week.id).toBe('2026-W50');
    expect(w.nights.map((n) => weekdayName(n.night.date))).toEqual(['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday']);
  });

  // 2026-11-09 at 52° N, 5° E: moonrise crosses local noon during the week (a case that once read
  // "rises 273 minutes earlier each night").
  it.each(['2026-03-11', '2026-06-10', '2026-09-16', '2026-12-10', '2026-11-09'])('the Moon rises 30–75 minutes later each night in the week of %s (about 50 on average, common practice)', (date) => {
    const w = computeWeek(date === '2026-11-09' ? defineSite({ id: 'nl', latitude: 52, longitude: 5, timeZone: 'Europe/Amsterdam' }) : site, date, [builtInBody('moon')]);
    const sentence = w.bodies[0]!.changes.find((c) => /^(rises|sets) \d+ minutes later each night$/.test(c));
    expect(sentence, w.bodies[0]!.changes.join('; ')).toBeDefined();
    const minutes = Number(/(\d+) minutes/.exec(sentence!)![1]);
    expect(minutes).toBeGreaterThanOrEqual(30);
    expect(minutes).toBeLessThanOrEqual(75);
  });

  it('a planet that barely changes gets no sentence about brightness; the best night is one of the seven', () => {
    const w = computeWeek(site, '2026-12-10', [builtInBody('saturn')]);
    const saturn = w.bodies[0]!;
    expect(saturn.changes.some((c) => c.startsWith('brightens') || c.startsWith('fades'))).toBe(false);
    expect(w.week.days).toContain(saturn.bestNight);
  });

  it('in the full-Moon week the evening Moon troubles a faint target early in the week, and the sentence says when that ends', () => {
    // Full Moon 2026-12-24 (astronomy-engine's phase search); after full the Moon rises about 50
    // minutes later each evening (common practice), so the evening sky clears as the week goes on.
    const w = computeWeek(site, '2026-12-24', [builtInBody('uranus')]);
    const uranus = w.bodies[0]!;
    const nights = w.week.days;
    expect(uranus.moonInterference[0]).toBe(nights[0]);
    const last = nights.indexOf(uranus.moonInterference[uranus.moonInterference.length - 1]!);
    expect(last).toBeLessThan(6);
    expect(uranus.moonInterference).toEqual(nights.slice(0, last + 1));
    expect(uranus.changes).toContain(`Moon interference ends on ${weekdayName(nights[last + 1]!)}`);
  });

  it('gloaming week --json prints the summary', () => {
    let out = '';
    const code = main(['week', '--lat', '45', '--lon', '7.7', '--tz', 'Europe/Rome', '--date', '2026-12-10', '--body', 'moon', '--json'], (s) => (out += s), () => {});
    expect(code).toBe(0);
    const json = JSON.parse(out) as { week: string; bodies: { body: string; changes: string[]; nights: unknown[] }[] };
    expect(json.week).toBe('2026-W50');
    expect(json.bodies[0]!.nights).toHaveLength(7);
    expect(json.bodies[0]!.changes.length).toBeGreaterThan(0);
  });
});
