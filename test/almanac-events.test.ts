/**
 * Behaviour of the almanac: local times right across daylight-saving changes (against the
 * legal rules, typed from legislation — see test/reference/almanac/README.md), events that cannot
 * be seen labelled rather than dropped, the meteor count formula against its published form
 * (Koschack & Rendtel 1990) and common practice, the Moon's interference, and the command.
 */
import { describe, expect, it } from 'vitest';
import { GloamingError } from '../lib/core/errors.ts';
import { defineSite } from '../lib/core/site.ts';
import { findEvents, hourlyRate, METEOR_SHOWERS, type AlmanacEvent } from '../lib/outputs/almanac/index.ts';
import { eventJson, EVENTS_HELP, runEvents } from '../lib/outputs/cli/events.ts';
import * as Astronomy from 'astronomy-engine';
import { observe } from '../lib/core/observe.ts';
import { nightOf } from '../lib/core/time.ts';
import { nightDateOf } from '../lib/outputs/almanac/context.ts';
import { wordsFor } from '../lib/core/language/index.ts';
import { builtInBody } from '../lib/core/body.ts';
import { expectWithin, separationDeg } from './helpers/tolerance.ts';

const london = defineSite({ id: 'london', name: 'London', latitude: 51.5, longitude: -0.12, timeZone: 'Europe/London', sky: { bortle: 6 } });
const sydney = defineSite({ id: 'sydney-field', name: 'Field station', latitude: -34.35, longitude: 150.05, elevation: 640, timeZone: 'Australia/Sydney', sky: { bortle: 3 } });

/** Last Sunday of a month, as a UTC date at `hourUtc`. */
function lastSunday(year: number, month: number, hourUtc: number): number {
  const last = new Date(Date.UTC(year, month, 0));
  return Date.UTC(year, month - 1, last.getUTCDate() - last.getUTCDay(), hourUtc);
}
/** First Sunday of a month in local (NSW) terms; the change happens the Saturday before at 16:00 UTC. */
function firstSundayChangeUtc(year: number, month: number): number {
  const first = new Date(Date.UTC(year, month - 1, 1));
  const sunday = 1 + ((7 - first.getUTCDay()) % 7);
  return Date.UTC(year, month - 1, sunday - 1, 16);
}
/** UK: UTC+1 from 01:00 UTC last Sunday of March to 01:00 UTC last Sunday of October (Summer Time Order 2002). */
function ukOffsetMinutes(t: Date): number {
  const y = t.getUTCFullYear();
  return t.getTime() >= lastSunday(y, 3, 1) && t.getTime() < lastSunday(y, 10, 1) ? 60 : 0;
}
/** NSW: UTC+11 from the first Sunday of October to the first Sunday of April (Standard Time Act 1987 as amended 2007). */
function nswOffsetMinutes(t: Date): number {
  const y = t.getUTCFullYear();
  return t.getTime() >= firstSundayChangeUtc(y, 4) && t.getTime() < firstSundayChangeUtc(y, 10) ? 600 : 660;
}

function offsetOf(iso: string): number {
  const m = /([+-])(\d{2}):(\d{2})$/.exec(iso)!;
  return (m[1] === '-' ? -1 : 1) * (Number(m[2]) * 60 + Number(m[3]));
}

describe('local times across daylight-saving changes', () => {
  for (const [site, rule, label] of [
    [london, ukOffsetMinutes, 'London (UK rule)'],
    [sydney, nswOffsetMinutes, 'NSW field station (NSW rule)'],
  ] as const) {
    it(`every event of 2026 carries the legal offset in ${label}, and its ISO text is the same instant`, () => {
      const events = findEvents({ site, from: new Date('2026-01-01T00:00:00Z'), to: new Date('2027-01-01T00:00:00Z') });
      expect(events.length).toBeGreaterThan(150);
      const offsets = new Set<number>();
      for (const e of events) {
        const json = eventJson(e, site.timeZone) as { time: string };
        expect(offsetOf(json.time), `${e.type} ${e.time.toISOString()} → ${json.time}`).toBe(rule(e.time));
        expectWithin(Date.parse(json.time), e.time.getTime(), 500, `${e.type} instant`);
        offsets.add(offsetOf(json.time));
      }
      expect(offsets.size).toBe(2); // both sides of a change were exercised
    });
  }

  it('the clock time written in a phase description is the local time of the phase (UK rule)', () => {
    const events = findEvents({ site: london, from: new Date('2026-03-01T00:00:00Z'), to: new Date('2026-11-30T00:00:00Z'), options: { types: ['new-moon', 'full-moon'] } });
    for (const e of events) {
      // Rounded to the nearest minute, as almanacs and the pages print times.
      const rounded = new Date(Math.round(e.time.getTime() / 60_000) * 60_000);
      const local = new Date(rounded.getTime() + ukOffsetMinutes(rounded) * 60_000);
      const hhmm = `${String(local.getUTCHours()).padStart(2, '0')}:${String(local.getUTCMinutes()).padStart(2, '0')}`;
      expect(e.description, e.time.toISOString()).toContain(`at ${hhmm}`);
    }
  });
});

describe('events that cannot be seen are labelled, not dropped', () => {
  const events = findEvents({ site: london, from: new Date('2026-01-01T00:00:00Z'), to: new Date('2026-07-01T00:00:00Z') });

  it('conjunctions with the Sun are listed as not visible, too close to the Sun', () => {
    const conj = events.filter((e) => e.type === 'conjunction');
    expect(conj.length).toBeGreaterThan(3);
    for (const e of conj) {
      expect(e.visible).toBe(false);
      expect(e.visibility.reason).toBe('too-close-to-sun');
    }
  });

  it('the total lunar eclipse of 2026 March 3 (daytime in London) is listed as not visible, below the horizon', () => {
    const e = events.find((x) => x.type === 'lunar-eclipse' && x.time.toISOString().startsWith('2026-03-03'))!;
    expect(e.visible).toBe(false);
    expect(e.visibility.reason).toBe('below-horizon');
    expect(e.visibility.note).toMatch(/Not visible from London/);
  });

  it('a visible close approach has both bodies above the skyline in a dark sky at the moment named', () => {
    const visible = events.filter((e) => e.type === 'close-approach' && e.visible && e.bodies[0] === 'moon' && !e.bodies[1]!.startsWith('star:'));
    expect(visible.length).toBeGreaterThan(3);
    for (const e of visible) {
      const t = e.visibility.time!;
      expect(observe(london, builtInBody('moon'), t).altitudeDeg).toBeGreaterThanOrEqual(london.minAltitudeDeg - 0.01);
      expect(observe(london, builtInBody(e.bodies[1] as 'jupiter'), t).altitudeDeg).toBeGreaterThanOrEqual(london.minAltitudeDeg - 0.01);
      // Dark: the Sun's centre at least 6° below the horizon, geometrically (the end of civil twilight as printed).
      expect(observe(london, builtInBody('sun'), t).geometricAltitudeDeg).toBeLessThanOrEqual(-6 + 0.01);
      expect(e.description).toMatch(/look [a-z-]+ at \d{2}:\d{2}/);
    }
  });

  it('the interest order puts the most interesting first', () => {
    const ranked = findEvents({ site: london, from: new Date('2026-08-01T00:00:00Z'), to: new Date('2026-09-01T00:00:00Z'), options: { order: 'interest' } });
    expect(ranked[0]!.type).toBe('solar-eclipse');
    for (let i = 1; i < ranked.length; i++) expect(ranked[i]!.score).toBeLessThanOrEqual(ranked[i - 1]!.score);
  });

  it('an empty or reversed range is a GloamingError', () => {
    expect(() => findEvents({ site: london, from: new Date('2026-02-01'), to: new Date('2026-01-01') })).toThrow(GloamingError);
  });
});

describe('meteor showers', () => {
  it('HR = ZHR·sin(h)/r^(6.5−LM) (Koschack & Rendtel 1990): radiant at the zenith under LM 6.5 gives the ZHR; at 30° half; each magnitude of LM lost divides by r (common practice)', () => {
    expectWithin(hourlyRate({ zhr: 100, radiantAltitudeDeg: 90, limitingMagnitude: 6.5, populationIndex: 2.2 }), 100, 1e-9, 'zenith');
    expectWithin(hourlyRate({ zhr: 100, radiantAltitudeDeg: 30, limitingMagnitude: 6.5, populationIndex: 2.2 }), 50, 1e-9, '30°');
    expectWithin(hourlyRate({ zhr: 100, radiantAltitudeDeg: 90, limitingMagnitude: 5.5, populationIndex: 2.2 }), 100 / 2.2, 1e-9, 'LM 5.5');
    expect(hourlyRate({ zhr: 100, radiantAltitudeDeg: -5, limitingMagnitude: 6.5, populationIndex: 2.2 })).toBe(0);
  });

  it('the table has the issue’s showers, each with a source', () => {
    for (const code of ['QUA', 'LYR', 'ETA', 'SDA', 'PER', 'ORI', 'LEO', 'GEM', 'URS']) {
      const s = METEOR_SHOWERS.find((x) => x.code === code);
      expect(s, code).toBeDefined();
      expect(s!.source).toMatch(/IMO/);
    }
  });

  it('the Moon, from a dark site: the 2026 Perseids (new Moon on Aug 12) are not spoilt; the 2025 Perseids (Moon 85% lit) are', () => {
    const darkSite = defineSite({ id: 'dark', latitude: 51.5, longitude: -0.12, timeZone: 'Europe/London', sky: { bortle: 3 } });
    const per = (site: typeof london, year: number): AlmanacEvent =>
      findEvents({ site, from: new Date(`${year}-08-10T00:00:00Z`), to: new Date(`${year}-08-16T00:00:00Z`), options: { types: ['meteor-shower-peak'] } }).find((e) => e.shower?.code === 'PER')!;
    const dark = per(darkSite, 2026);
    const bright = per(darkSite, 2025);
    expect(dark.shower!.moonInterferes).toBe(false);
    expect(dark.description).toMatch(/little moonlight/);
    expect(bright.shower!.moonInterferes).toBe(true);
    expect(bright.shower!.moonIlluminatedFraction).toBeGreaterThan(0.7);
    expect(bright.description).toMatch(/Moon cuts that/);
    // A darker sky shows more meteors than a town sky (common practice): Bortle 3 against Bortle 6.
    expect(dark.shower!.best!.hourlyRate).toBeGreaterThan(per(london, 2026).shower!.best!.hourlyRate * 1.5);
  });

  it('a count of one reads as one meteor, in every language (English, Spanish, German and French grammar: a singular noun after 1)', () => {
    // A bright harbour sky (Bortle 7, 50.45° N) on the 2027 Orionids: the computed rate rounds to 1 an hour.
    const town = defineSite({ id: 'town', latitude: 50.45, longitude: -1.55, timeZone: 'Europe/London', sky: { bortle: 7 }, minAltitude: 10 });
    const ori = findEvents({ site: town, from: new Date('2027-10-19T00:00:00Z'), to: new Date('2027-10-24T00:00:00Z'), options: { types: ['meteor-shower-peak'] } }).find((e) => e.shower?.code === 'ORI')!;
    expect(ori.shower!.best!.hourlyRate).toBeLessThan(1.5);
    expect(ori.description).toMatch(/about 1 meteor an hour/);
    const args = { name: 'Orionids', night: 'night', clock: '05:00', constellation: 'Orion', degrees: 55, direction: 'south', moon: 'none', percent: '', moonless: 1 };
    const singular: Record<string, RegExp> = { en: /\b1 meteor an hour/, es: /\b1 meteoro por hora/, de: /\b1 Meteor pro Stunde/, fr: /\b1 météore par heure/ };
    const plural: Record<string, RegExp> = { en: /\b5 meteors an hour/, es: /\b5 meteoros por hora/, de: /\b5 Meteore pro Stunde/, fr: /\b5 météores par heure/ };
    for (const language of ['en', 'es', 'de', 'fr']) {
      expect(wordsFor(language).t('ev.shower', { ...args, count: 1 }), language).toMatch(singular[language]!);
      expect(wordsFor(language).t('ev.shower', { ...args, count: 5 }), language).toMatch(plural[language]!);
    }
  });

  it('the Quadrantids from 50° S (radiant at +49° never rises) are listed as not visible', () => {
    const south = defineSite({ id: 'far-south', latitude: -50, longitude: -70, timeZone: 'America/Punta_Arenas' });
    const [q] = findEvents({ site: south, from: new Date('2026-01-01T00:00:00Z'), to: new Date('2026-01-08T00:00:00Z'), options: { types: ['meteor-shower-peak'] } });
    expect(q!.shower!.code).toBe('QUA');
    expect(q!.visible).toBe(false);
    expect(q!.visibility.reason).toBe('radiant-below-horizon');
  });
});

describe('the full Moon’s sentence says how much of the night it is up, as astronomy-engine finds it', () => {
  // The sentence is checked against astronomy-engine's own topocentric Moon and Sun (Equator + Horizon, with
  // normal refraction), sampled every 5 minutes over the night (local noon to local noon) that holds the full Moon.
  const outpost = defineSite({ id: 'outpost', latitude: 68.55, longitude: 13.4, timeZone: 'Europe/Oslo', sky: { bortle: 2 } });
  const harbour = defineSite({ id: 'harbour', latitude: 50.45, longitude: -1.55, timeZone: 'Europe/London', sky: { bortle: 7 } });
  function reference(site: typeof outpost, time: Date): { moonMaxDeg: number; darkMinutesDown: number; darkMinutes: number } {
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, 0);
    const night = nightOf(nightDateOf(time, site.timeZone), site.timeZone);
    const altitude = (body: Astronomy.Body, t: Date): number => {
      const eq = Astronomy.Equator(body, t, observer, true, true);
      return Astronomy.Horizon(t, observer, eq.ra, eq.dec, 'normal').altitude;
    };
    let moonMaxDeg = -90, darkMinutes = 0, darkMinutesDown = 0;
    for (let t = night.start.getTime(); t <= night.end.getTime(); t += 5 * 60_000) {
      const moon = altitude(Astronomy.Body.Moon, new Date(t));
      moonMaxDeg = Math.max(moonMaxDeg, moon);
      // The sky is dark once the Sun is 6° below the horizon (the end of civil twilight; astronomy-engine's refracted altitude, near enough there).
      if (altitude(Astronomy.Body.Sun, new Date(t)) < -6) {
        darkMinutes += 5;
        if (moon < 0) darkMinutesDown += 5;
      }
    }
    return { moonMaxDeg, darkMinutesDown, darkMinutes };
  }
  /** The Moon's altitude when the night's sky gets dark (the Sun 6° down), by astronomy-engine; null when it never does. */
  function moonAtDusk(site: typeof outpost, time: Date): number | null {
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, 0);
    const night = nightOf(nightDateOf(time, site.timeZone), site.timeZone);
    const altitude = (body: Astronomy.Body, t: Date): number => {
      const eq = Astronomy.Equator(body, t, observer, true, true);
      return Astronomy.Horizon(t, observer, eq.ra, eq.dec, 'normal').altitude;
    };
    for (let t = night.start.getTime(); t <= night.end.getTime(); t += 5 * 60_000) if (altitude(Astronomy.Body.Sun, new Date(t)) < -6) return altitude(Astronomy.Body.Moon, new Date(t));
    return null;
  }
  for (const site of [outpost, harbour]) {
    it(`last quarter, ${site.latitudeDeg}° N: "the evening sky stays dark" only when the sky gets dark with the Moon still down`, () => {
      const quarters = findEvents({ site, from: new Date('2026-12-04T00:00:00Z'), to: new Date('2027-12-04T00:00:00Z'), options: { types: ['last-quarter'] } });
      expect(quarters.length).toBeGreaterThanOrEqual(12);
      for (const e of quarters) {
        const moon = moonAtDusk(site, e.time);
        const label = `${site.id} ${e.time.toISOString()} (Moon at dusk ${moon?.toFixed(1)}°): ${e.description}`;
        // A degree's margin either side of the horizon, where the sampling (5 and 10 minutes) may disagree.
        if (moon === null || moon > 1) expect(e.description, label).not.toMatch(/evening sky stays dark/);
        if (moon !== null && moon < -1) expect(e.description, label).toMatch(/evening sky stays dark/);
      }
    });
  }
  for (const site of [outpost, harbour]) {
    it(`${site.latitudeDeg}° N, December 2026 to December 2027`, () => {
      const fulls = findEvents({ site, from: new Date('2026-12-04T00:00:00Z'), to: new Date('2027-12-04T00:00:00Z'), options: { types: ['full-moon'] } });
      expect(fulls.length).toBeGreaterThanOrEqual(12);
      let checked = 0;
      for (const e of fulls) {
        const r = reference(site, e.time);
        const label = `${site.id} ${e.time.toISOString()}: ${e.description}`;
        // Never above the horizon (by more than a grazing limb, 0.3°): it cannot "stay up all night".
        if (r.moonMaxDeg < -0.3) {
          expect(e.description, label).toMatch(/below the horizon all night/);
          checked++;
        }
        // Up through every dark minute: it does.
        if (r.darkMinutes > 0 && r.darkMinutesDown === 0) {
          expect(e.description, label).toMatch(/stays up all night/);
          checked++;
        }
        // Down for more than an hour of the dark sky: it does not.
        if (r.darkMinutesDown > 60) expect(e.description, label).not.toMatch(/stays up all night/);
      }
      expect(checked).toBeGreaterThan(0);
    });
  }
});

describe('gloaming events (runEvents)', () => {
  const run = (args: string[]): string => {
    let text = '';
    runEvents(args, (s) => (text += s));
    return text;
  };

  it('--json prints { events: [{ type, time, bodies, separation?, visible, description }] } with local offsets', () => {
    const out = JSON.parse(run(['--lat', '51.5', '--lon', '-0.12', '--tz', 'Europe/London', '--from', '2023-03-01', '--to', '2023-03-02', '--json', '--type', 'close-approach'])) as { events: Record<string, unknown>[] };
    const vj = out.events.find((e) => (e.bodies as string[]).join() === 'venus,jupiter')!;
    expect(vj).toBeDefined();
    expect(vj.time).toMatch(/^2023-03-0[12]T\d{2}:\d{2}:\d{2}\+00:00$/);
    expectWithin(vj.separation as number, 0.5, 0.05, 'separation');
    expect(typeof vj.visible).toBe('boolean');
    expect(typeof vj.description).toBe('string');
  });

  it('wrong input raises GloamingError naming the flag', () => {
    expect(() => run(['--site', 'nowhere-at-all', '--from', '2026-01-01', '--content', 'content'])).toThrow(GloamingError);
    expect(() => run(['--lat', '51', '--lon', '0', '--tz', 'Europe/London', '--from', '2026-02-30'])).toThrow(/--from|cannot read the date/);
    expect(() => run(['--lat', '51', '--lon', '0', '--tz', 'Europe/London', '--from', '2026-01-01', '--type', 'eclipse'])).toThrow(GloamingError);
    expect(() => run(['--lat', '51', '--lon', '0', '--tz', 'Europe/London', '--from', '2026-01-10', '--to', '2026-01-01'])).toThrow(GloamingError);
    expect(() => run(['--lat', '51', '--lon', '0', '--from', '2026-01-01'])).toThrow(GloamingError);
  });

  it('--help prints the help text; --ics prints a calendar', () => {
    expect(run(['--help'])).toBe(EVENTS_HELP);
    const ics = run(['--lat', '51.5', '--lon', '-0.12', '--tz', 'Europe/London', '--from', '2026-08-12', '--to', '2026-08-12', '--ics', '--now', '2026-08-01T00:00:00Z']);
    expect(ics.startsWith('BEGIN:VCALENDAR\r\n')).toBe(true);
    expect(ics).toContain('DTSTAMP:20260801T000000Z');
  });
});

describe('week helpers for the bulletin placeholders', () => {
  it('eventsOfWeek covers Monday noon to the next Monday noon local time, the seven nights (week of 2023-03-01, UK winter time)', async () => {
    const { eventsOfWeek, pickEvent } = await import('../lib/outputs/almanac/index.ts');
    const week = eventsOfWeek({ site: london, date: '2023-03-01' });
    for (const e of week) {
      expect(e.time.getTime()).toBeGreaterThanOrEqual(Date.parse('2023-02-27T12:00:00Z'));
      expect(e.time.getTime()).toBeLessThan(Date.parse('2023-03-06T12:00:00Z'));
    }
    const vj = pickEvent(week, { type: 'close-approach', bodies: ['venus', 'jupiter'] });
    expect(vj?.bodies).toEqual(['venus', 'jupiter']);
    expect(pickEvent(week, { type: 'solar-eclipse' })).toBeNull();
  });
});

describe('comets passing the stars of familiar patterns', () => {
  it('finds the invented comet passing stars of the Circlet of Pisces, at the separation of the two J2000 directions (Meeus eq. 17.1)', async () => {
    const { loadBodies } = await import('../lib/models/content.ts');
    const { starByHip } = await import('../lib/models/stars/catalogue.ts');
    const bodies = loadBodies('content/objects');
    const events = findEvents({ site: london, from: new Date('2027-01-20T00:00:00Z'), to: new Date('2027-02-15T00:00:00Z'), bodies, options: { types: ['close-approach'] } });
    const passes = events.filter((e) => e.bodies[0] === 'comet-lumen' && e.bodies[1]!.startsWith('star:'));
    expect(passes.length).toBeGreaterThan(0);
    const circlet = passes.find((e) => e.description.includes('Circlet of Pisces'));
    expect(circlet, passes.map((e) => e.description).join('\n')).toBeDefined();
    for (const e of passes) {
      const star = starByHip(Number(e.bodies[1]!.slice(5)))!;
      const comet = observe(london, bodies.get('comet-lumen'), e.time);
      // Separation of the comet's astrometric J2000 place and the catalogue star (the minimum is geocentric, J2000).
      expectWithin(separationDeg(comet.raJ2000Hours, comet.decJ2000Deg, star.raDeg / 15, star.decDeg), e.separationDeg!, 0.02, `${e.title} separation`);
      expect(e.separationDeg!).toBeLessThanOrEqual(1.5);
    }
  });
});

describe('comet and asteroid events speak for the site', () => {
  it("say what the site's own visibility verdict for that night says (not a magnitude rule), with its best time", async () => {
    const { loadBodies } = await import('../lib/models/content.ts');
    const { computeNight } = await import('../lib/models/night.ts');
    const { nightDateOf } = await import('../lib/outputs/almanac/context.ts');
    const { verdictWords } = await import('../lib/models/visibility.ts');
    const { formatClock } = await import('../lib/core/time.ts');
    const bodies = loadBodies('content/objects');
    const comet = bodies.get('comet-lumen');
    const city = defineSite({ id: 'city', name: 'City centre', latitude: 51.5, longitude: -0.12, timeZone: 'Europe/London', sky: { bortle: 9 } });
    const verdicts = new Set<string>();
    for (const site of [city, london, sydney]) {
      const events = findEvents({ site, from: new Date('2026-12-01T00:00:00Z'), to: new Date('2027-03-01T00:00:00Z'), bodies, options: { types: ['perihelion', 'closest-approach-to-earth', 'peak-brightness'] } });
      const own = events.filter((e) => e.bodies[0] === 'comet-lumen');
      expect(own.length, site.id).toBeGreaterThan(0);
      for (const e of own) {
        const v = computeNight(site, nightDateOf(e.time, site.timeZone), [comet]).body(comet).visibility;
        verdicts.add(`${site.id}:${v.verdict}`);
        if (v.verdict === 'not-visible') {
          expect(e.visible, e.description).toBe(false);
          expect(e.description).toContain('not visible that night');
        } else {
          expect(e.description).toContain(`${verdictWords(v.verdict as "naked-eye")} from here`);
          expect(e.description).toContain(formatClock(v.best!.time, site));
        }
        // The old rule called every comet brighter than magnitude 5 naked-eye "from a dark site", whatever the site.
        expect(e.description).not.toContain('dark site');
      }
    }
    // A magnitude ~4.6 comet is not a naked-eye object from a Bortle 9 city (Bortle 2001: naked-eye limit ≤ 4.0 there).
    expect([...verdicts].filter((v) => v.startsWith('city:'))).not.toContain('city:naked-eye');
  });
});
