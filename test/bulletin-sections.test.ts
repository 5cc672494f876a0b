/**
 * Sections (`:::provided`, `:::every-target`, `:::every-event`), value slots with no value, the
 * one-off date rule, and several problems reported in one run. Each decision is compared with an
 * outside reference where one exists (astronomy-engine's own searches and positions), otherwise
 * with the library's values computed directly (lib/models/night.ts, lib/outputs/almanac), never with the
 * section's own output.
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { eventsOfWeek, findEvents } from '../lib/outputs/almanac/index.ts';
import { BodyRegistry, builtInBody } from '../lib/core/body.ts';
import { loadSites } from '../lib/models/content.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { computeNight } from '../lib/models/night.ts';
import { defineSite, type Site } from '../lib/core/site.ts';
import { formatInstant, isoWeekOf, localMidnight, nightOf, zonedTime, type IsoWeek } from '../lib/core/time.ts';
import { computeWeek } from '../lib/models/week.ts';
import { skyBrightness } from '../lib/models/sky/brightness.ts';
import { darkSkyFromQuality } from '../lib/models/sky/quality.ts';
import { extinctionCoefficientGreen } from '../lib/models/sky/extinction.ts';
import { FALLBACK_MARK, TemplateErrors, WeekCache, formatProblem, parseBulletin, renderBulletinSync, type RenderedBulletin } from '../lib/outputs/bulletin/index.ts';
import { MINUTE_MS, expectWithin } from './helpers/tolerance.ts';

const sites = loadSites('content/sites');
const bodies = new BodyRegistry();
const cache = new WeekCache();
const FILE = 'content/bulletins/t.md';
/** Front matter of 5 lines: the body starts on line 6. */
const FM = '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n';

function render(site: Site, week: IsoWeek, markdown: string, frontMatter = FM): RenderedBulletin {
  return renderBulletinSync(parseBulletin(frontMatter + markdown + '\n', FILE), { site, week, bodies }, cache);
}

/** Text of the page without tags. */
function text(html: string): string {
  return html.replace(/<[^>]+>/g, '').replace(/\s+/g, ' ').trim();
}

const either = (markdown: string): string => `:::provided{${markdown}}\nYES\n::otherwise\nNO\n:::`;
const shown = (r: RenderedBulletin): boolean => {
  const t = text(r.html);
  expect(['YES', 'NO']).toContain(t);
  return t === 'YES';
};

const WEEKS = ['2026-03-18', '2026-06-24', '2026-12-02'].map(isoWeekOf);
const GRID = [...sites.values()].flatMap((site) => WEEKS.map((week) => [site.id, week.id, site, week] as const));

describe.each(GRID)(':::provided at %s, %s', (_s, _w, site, week) => {
  const fri = week.days[4]!;
  const planets = (['venus', 'mars', 'jupiter', 'saturn'] as const).map((id) => builtInBody(id));
  const night = computeNight(site, fri, planets);

  it('seen=naked-eye|binoculars|either follows the verdict of the visibility model (lib/models/visibility.ts via computeNight)', () => {
    for (const b of night.bodies) {
      const v = b.visibility.verdict;
      expect(shown(render(site, week, either(`seen=naked-eye body=${b.body.id} night=fri`)))).toBe(v === 'naked-eye');
      expect(shown(render(site, week, either(`seen=binoculars body=${b.body.id} night=fri`)))).toBe(v === 'binoculars');
      expect(shown(render(site, week, either(`seen=either body=${b.body.id} night=fri`)))).toBe(v === 'naked-eye' || v === 'binoculars');
    }
  });

  it('up=HH:MM follows the apparent altitude from astronomy-engine (Equator + Horizon with normal refraction)', () => {
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
    for (const id of ['jupiter', 'saturn', 'moon'] as const) {
      for (const [hh, date] of [['21:00', fri], ['03:30', week.days[5]!]] as const) {
        const instant = zonedTime(date, Number(hh.slice(0, 2)), Number(hh.slice(3)), site.timeZone);
        const eq = Astronomy.Equator(id === 'moon' ? Astronomy.Body.Moon : id === 'jupiter' ? Astronomy.Body.Jupiter : Astronomy.Body.Saturn, instant, observer, true, true);
        const alt = Astronomy.Horizon(instant, observer, eq.ra, eq.dec, 'normal').altitude;
        if (Math.abs(alt) < 0.2) continue; // too close to the horizon for two refraction models to agree on the sign
        expect(shown(render(site, week, either(`up=${hh} body=${id} night=fri`))), `${id} ${hh}: astronomy-engine altitude ${alt.toFixed(2)}°`).toBe(alt > 0);
      }
    }
  });

  it('has=rise body=moon follows astronomy-engine SearchRiseSet (a moonrise between local noon and the next local noon)', () => {
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
    for (const date of week.days) {
      const n = nightOf(date, site.timeZone);
      const rise = Astronomy.SearchRiseSet(Astronomy.Body.Moon, observer, +1, n.start, 1);
      const rises = rise !== null && rise.date < n.end;
      // A moonrise within 2 minutes of noon could fall on either side with two different models.
      if (rise && Math.abs(rise.date.getTime() - n.end.getTime()) < 2 * MINUTE_MS) continue;
      expect(shown(render(site, week, either(`has=rise body=moon night=${date}`))), `moonrise on the night of ${date}`).toBe(rises);
    }
  });

  it('first=set|rise body=moon follows astronomy-engine SearchRiseSet: both happen between local noon and the next, in that order', () => {
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
    for (const date of week.days) {
      const n = nightOf(date, site.timeZone);
      const rise = Astronomy.SearchRiseSet(Astronomy.Body.Moon, observer, +1, n.start, 1);
      const set = Astronomy.SearchRiseSet(Astronomy.Body.Moon, observer, -1, n.start, 1);
      const within = (e: Astronomy.AstroTime | null): e is Astronomy.AstroTime => e !== null && e.date < n.end;
      // Within 2 minutes of noon an event could fall on either side with two different models.
      if ([rise, set].some((e) => e && Math.abs(e.date.getTime() - n.end.getTime()) < 2 * MINUTE_MS)) continue;
      const both = within(rise) && within(set);
      const setBeforeRise = both && set.date < rise.date;
      expect(shown(render(site, week, either(`first=set body=moon night=${date}`))), `moonset first on the night of ${date}`).toBe(setBeforeRise);
      expect(shown(render(site, week, either(`first=rise body=moon night=${date}`))), `moonrise first on the night of ${date}`).toBe(both && !setBeforeRise);
    }
  });

  it('event=full-moon follows astronomy-engine SearchMoonPhase (180°) inside the week from Monday noon to the next Monday noon', () => {
    const from = nightOf(week.days[0]!, site.timeZone).start;
    const to = nightOf(week.days[6]!, site.timeZone).end;
    const full = Astronomy.SearchMoonPhase(180, from, 8);
    expect(shown(render(site, week, either('event=full-moon')))).toBe(full !== null && full.date < to);
  });

  it('moon=interferes without a body: at least half lit (astronomy-engine Illumination), up and lighting the sky overhead at least as much as the twilight for half an hour of the viewing hours (sky model fed with astronomy-engine altitudes); with a body: the nights computeWeek lists', () => {
    const observer = new Astronomy.Observer(site.latitudeDeg, site.longitudeDeg, site.elevationM);
    const report = computeNight(site, fri, []);
    const fraction = Astronomy.Illumination(Astronomy.Body.Moon, localMidnight(report.night)).phase_fraction;
    const h = site.viewingHours!;
    const start = zonedTime(fri, Math.floor(h.startMinutes / 60), h.startMinutes % 60, site.timeZone);
    const endMinutes = Math.min(h.endMinutes, 24 * 60 - 1);
    const end = zonedTime(fri, Math.floor(endMinutes / 60), endMinutes % 60, site.timeZone);
    const altitude = (body: Astronomy.Body, t: Date, refraction: 'normal' | null): number => {
      const eq = Astronomy.Equator(body, t, observer, true, true);
      return Astronomy.Horizon(t, observer, eq.ra, eq.dec, refraction ?? undefined).altitude;
    };
    // The published sky model (Krisciunas & Schaefer moonlight, Patat twilight) at the zenith: the Moon's light over the twilight's.
    const moonOverTwilight = (t: Date): number => {
      const moonAlt = altitude(Astronomy.Body.Moon, t, 'normal');
      if (moonAlt <= 0) return 0;
      const sunAlt = altitude(Astronomy.Body.Sun, t, 'normal');
      const sky = skyBrightness({
        target: { altitudeDeg: 90, sunSeparationDeg: 90 - sunAlt, moonSeparationDeg: 90 - moonAlt },
        sun: { altitudeDeg: sunAlt, geometricAltitudeDeg: altitude(Astronomy.Body.Sun, t, null) },
        moon: { altitudeDeg: moonAlt, phaseAngleDeg: Astronomy.Illumination(Astronomy.Body.Moon, t).phase_angle },
        darkSkyZenithNl: darkSkyFromQuality(site.sky).zenithNl,
        kV: extinctionCoefficientGreen(site.elevationM),
      });
      return sky.moonNl / sky.twilightNl;
    };
    // Every 10 minutes through the viewing hours: moonlight counts for half an hour or more (three samples).
    const samples: number[] = [];
    for (let t = start.getTime(); t <= end.getTime(); t += 10 * 60_000) samples.push(moonOverTwilight(new Date(t)));
    const lit = samples.filter((r) => r >= 1).length;
    const clear = samples.every((r) => r === 0 || Math.abs(r - 1) > 0.05) && Math.abs(fraction - 0.5) > 0.01;
    if (clear) expect(shown(render(site, week, either('moon=interferes night=fri')))).toBe(fraction >= 0.5 && lit >= 3);
    const w = computeWeek(site, week.days[0]!, [builtInBody('saturn')]);
    const saturn = w.bodies[0]!;
    for (const [i, date] of week.days.entries()) {
      expect(shown(render(site, week, either(`moon=interferes body=saturn night=${i + 1}`))), date).toBe(saturn.moonInterference.includes(date));
    }
  });
});

describe('moon=interferes in a sky bright from twilight', () => {
  it('a nearly full Moon up through the midnight Sun at 68.6° N does not count; the same Moon phase in the polar night does (astronomy-engine)', () => {
    const outpost = sites.get('northern-outpost')!;
    const june = isoWeekOf('2027-06-14'); // full Moon on 19 June 2027; the Sun never sets there
    const december = isoWeekOf('2026-12-21'); // full Moon on 24 December 2026, polar night
    const observer = new Astronomy.Observer(outpost.latitudeDeg, outpost.longitudeDeg, outpost.elevationM);
    const moonUpAtMidnight = (date: string): boolean => {
      const t = localMidnight(computeNight(outpost, date, []).night);
      const eq = Astronomy.Equator(Astronomy.Body.Moon, t, observer, true, true);
      return Astronomy.Horizon(t, observer, eq.ra, eq.dec, 'normal').altitude > 0;
    };
    // Monday 14 June 2027: 84 % lit and up in the evening, but the Sun stays above the horizon all night.
    expect(Astronomy.Illumination(Astronomy.Body.Moon, new Date('2027-06-14T21:00:00Z')).phase_fraction).toBeGreaterThan(0.5);
    expect(shown(render(outpost, june, either('moon=interferes night=mon')))).toBe(false);
    // Thursday 24 December 2026: full, up at midnight in the polar night.
    expect(moonUpAtMidnight(december.days[3]!)).toBe(true);
    expect(shown(render(outpost, december, either('moon=interferes night=thu')))).toBe(true);
  });
});

describe(':::every-target and :::every-event', () => {
  const site = sites.get('harbour-roof')!;
  const week = isoWeekOf('2026-12-02');

  it('repeats for each naked-eye planet of the night, by best time, with the body bound (lib/models/night.ts verdicts)', () => {
    const night = computeNight(site, week.days[2]!, (['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const).map((id) => builtInBody(id)));
    const expected = night.bodies
      .filter((b) => b.visibility.verdict === 'naked-eye')
      .sort((a, b) => a.visibility.best!.time.getTime() - b.visibility.best!.time.getTime());
    expect(expected.length).toBeGreaterThan(1);
    const r = render(site, week, ':::every-target{seen=naked-eye kind=planet night=wed}\n- :name at :best-time, :direction{at=best}\n:::');
    // One list, one item per planet, and the bound body reaches every placeholder inside.
    expect(r.html.match(/<ul>/g)).toHaveLength(1);
    const items = [...r.html.matchAll(/<li><span class="gl gl-name" data-body="([a-z]+)">/g)].map((m) => m[1]);
    expect(items).toEqual(expected.map((b) => b.body.id));
    for (const b of expected) {
      expect(r.html).toMatch(new RegExp(`class="gl gl-best-time" datetime="[^"]+" data-night="${week.days[2]}" data-body="${b.body.id}"`));
      expect(r.html).toContain(`data-body="${b.body.id}" data-at="best"`);
    }
    expect(r.problems).toEqual([]);
  });

  it('a night without any target prints ::otherwise, or nothing and an empty-section warning', () => {
    // Northern outpost in midsummer: no darkness, no naked-eye comet (there is none in the registry).
    const outpost = sites.get('northern-outpost')!;
    const june = isoWeekOf('2026-06-24');
    const withOtherwise = render(outpost, june, ':::every-target{kind=comet}\n- :name\n::otherwise\nNo comet tonight.\n:::');
    expect(text(withOtherwise.html)).toBe('No comet tonight.');
    expect(withOtherwise.problems).toEqual([]);
    const bare = render(outpost, june, 'Comets:\n\n:::every-target{kind=comet}\n- :name\n:::');
    expect(text(bare.html)).toBe('Comets:');
    expect(bare.problems.map(formatProblem)).toEqual([
      `warning: ${FILE}:8:1: ':::every-target{kind=comet}' has nothing to repeat on Monday 22 June and no ::otherwise, so it prints nothing — add ::otherwise with a sentence for such nights (site northern-outpost, week 2026-W26)`,
    ]);
  });

  it('repeats for each event of the week (lib/outputs/almanac eventsOfWeek), with the event bound: :event without a type is that event', () => {
    const events = eventsOfWeek({ site, date: week.days[0]!, bodies });
    expect(events.length).toBeGreaterThan(1);
    const r = render(site, week, ':::every-event\n- :name{}: :event{show=date}, :event\n:::');
    const times = [...r.html.matchAll(/<time class="gl gl-event" data-type="([a-z-]+)" data-visible="\w+" datetime="([^"]+T[^"]+)"/g)].map((m) => [m[1], m[2]]);
    expect(times).toEqual(events.map((e) => [e.type, formatInstant(e.time, site.timeZone)]));
    const only = render(site, week, ':::every-event{type=last-quarter}\n:name at :event.\n::otherwise\nNo last quarter.\n:::');
    const lq = events.filter((e) => e.type === 'last-quarter');
    expect(text(only.html)).toBe(lq.length ? `${lq[0]!.title} at ${new Intl.DateTimeFormat('en-GB', { timeZone: site.timeZone, hour: '2-digit', minute: '2-digit' }).format(new Date(Math.round(lq[0]!.time.getTime() / 60_000) * 60_000))}.` : 'No last quarter.');
  });

  it('sections nest (the outer takes more colons), and a condition inside :::every-target is about the bound body', () => {
    const r = render(site, week, '::::every-target{seen=either kind=planet}\n:::provided{seen=naked-eye}\n- :name{}: naked eye\n::otherwise\n- :name{}: binoculars\n:::\n::::');
    const night = computeNight(site, week.days[0]!, (['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const).map((id) => builtInBody(id)));
    const expected = night.bodies
      .filter((b) => ['naked-eye', 'binoculars'].includes(b.visibility.verdict))
      .sort((a, b) => a.visibility.best!.time.getTime() - b.visibility.best!.time.getTime())
      .map((b) => `${b.body.name}: ${b.visibility.verdict === 'naked-eye' ? 'naked eye' : 'binoculars'}`);
    expect(text(r.html)).toBe(expected.join(' '));
  });
});

describe('value slots with no value', () => {
  it('print the neutral mark and warn with file:line:column, site and week; :verdict keeps the honest sentence', () => {
    // Neptune at the northern outpost in midsummer (24 h daylight: hidden by daylight): no best time, no window.
    const outpost = sites.get('northern-outpost')!;
    const june = isoWeekOf('2026-06-24');
    const r = render(outpost, june, 'Neptune is :verdict{body=neptune}.\nLook at :best-time{body=neptune}, :guide{body=neptune}.');
    expect(text(r.html)).toMatch(new RegExp(`^Neptune is not visible this night: [a-z ]+\\. Look at ${FALLBACK_MARK}, `));
    const messages = r.problems.map(formatProblem);
    expect(messages[0]).toMatch(/^warning: content\/bulletins\/t\.md:7:9: ':best-time\{body=neptune\}' has no value on Monday 22 June \(Neptune is not visible this night: .+\), so it prints '–' — put it inside :::provided\{seen=either body=neptune\} with ::otherwise, or use :verdict for the honest sentence \(site northern-outpost, week 2026-W26\)$/);
    expect(r.problems.every((p) => p.kind === 'fallback' && p.severity === 'warning')).toBe(true);
  });

  it('inside a guarding section nothing is reported', () => {
    const outpost = sites.get('northern-outpost')!;
    const r = render(outpost, isoWeekOf('2026-06-24'), ':::provided{seen=either body=neptune}\nLook at :best-time{body=neptune}.\n::otherwise\nNeptune is :verdict{body=neptune}.\n:::');
    expect(text(r.html)).toMatch(/^Neptune is not visible this night/);
    expect(r.problems).toEqual([]);
  });
});

describe('one-off bulletins are dated', () => {
  // An invented equatorial city site at UTC−3 (the zone America/Fortaleza has kept −03:00 since 2000).
  const city = defineSite({ id: 'equator-city', name: 'Equator city (invented)', latitude: -3.7, longitude: -38.5, elevation: 20, timeZone: 'America/Fortaleza', sky: { bortle: 8 }, locale: 'en-GB' });
  const oneOff = '---\ntitle: Geminids\nsites: all\ndate: 2026-12-14\n---\n';

  it('a meteor shower peaking at 10:49 on a Monday morning is found by a one-off dated that Monday', () => {
    // Outside reference for the instant: the Sun's J2000 ecliptic longitude reaches 262.2° (the
    // Geminid peak, IMO calendar, from memory) — found here by bisection on astronomy-engine's
    // GeoVector(Sun) rotated to the J2000 mean ecliptic (Rotation_EQJ_ECL).
    const toEcliptic = Astronomy.Rotation_EQJ_ECL();
    const lon = (t: Date): number => Astronomy.SphereFromVector(Astronomy.RotateVector(toEcliptic, Astronomy.GeoVector(Astronomy.Body.Sun, t, true))).lon;
    let lo = new Date('2026-12-13T00:00:00Z').getTime();
    let hi = new Date('2026-12-15T00:00:00Z').getTime();
    while (hi - lo > 1000) {
      const mid = (lo + hi) / 2;
      if (lon(new Date(mid)) < 262.2) lo = mid;
      else hi = mid;
    }
    const peak = new Date(lo);
    // 10:49 local (UTC−3) on Monday 14 December 2026, within two minutes.
    expectWithin(peak.getTime(), new Date('2026-12-14T13:49:00Z').getTime(), 2 * MINUTE_MS, 'Geminid peak');

    // The old rule (the ISO week of the date, 14–20 Dec nights) misses it: the peak belongs to Sunday's night.
    const week = isoWeekOf('2026-12-14');
    expect(eventsOfWeek({ site: city, date: '2026-12-14' }).some((e) => e.type === 'meteor-shower-peak' && e.bodies.includes('shower:GEM'))).toBe(false);

    const r = render(city, week, 'On :date the :event{type=meteor-shower-peak show=title} at :event{type=meteor-shower-peak}, on :event{type=meteor-shower-peak show=date}.', oneOff);
    expect(text(r.html)).toBe('On Monday 14 December the Geminids peak at 10:49, on Monday 14 December.');
    expect(r.problems).toEqual([]);
  });

  it('events are looked up from 3 nights before to 3 nights after the date, not in the ISO week', () => {
    const week = isoWeekOf('2026-12-14');
    const r = render(city, week, ':::every-event\n- :event{show=date}\n:::', oneOff);
    const expected = findEvents({ site: city, from: nightOf('2026-12-11', city.timeZone).start, to: nightOf('2026-12-17', city.timeZone).end, bodies });
    const dates = [...r.html.matchAll(/datetime="(\d{4}-\d{2}-\d{2})"/g)].map((m) => m[1]);
    expect(dates).toEqual(expected.map((e) => new Intl.DateTimeFormat('sv-SE', { timeZone: city.timeZone }).format(e.time)));
    expect(dates.some((d) => d! < '2026-12-14')).toBe(true);
    // A problem on a one-off page names its date rather than the ISO week.
    const missing = render(city, week, ':event{type=solar-eclipse}', oneOff);
    expect(missing.problems[0]!.week).toBe('2026-12-14');
  });
});

describe('several problems in one run', () => {
  const site = sites.get('harbour-roof')!;
  const week = isoWeekOf('2026-12-02');

  it('every error of a template is reported at once, in file order, each with its line and column', () => {
    const t = parseBulletin(FM + 'Sunset :sunsett.\n\n:::provided{seen=sometimes body=jupiter}\nx\n:::\n\n:::every-planet\n:rise{body=jupyter}\n- :name: x\n:::\n::otherwise\n', FILE);
    let error: unknown;
    try {
      renderBulletinSync(t, { site, week, bodies }, cache);
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(TemplateErrors);
    const lines = (error as GloamingError).message.split('\n');
    expect(lines).toEqual([
      `${FILE}:6:8: unknown placeholder ':sunsett'; expected a placeholder listed in lib/outputs/bulletin/PLACEHOLDERS.md — did you mean 'sunset'?`,
      `${FILE}:8:1 field 'seen': 'sometimes' is not a value of 'seen' (got 'sometimes'); expected naked-eye | binoculars | either`,
      `${FILE}:12:1: unknown section ':::every-planet'; expected one of :::provided, :::every-target, :::every-event — did you mean 'every-target'?`,
      `${FILE}:13:1 field 'body': unknown body 'jupyter'; expected one of sun, moon, mercury, venus, mars, jupiter, saturn, uranus, neptune — did you mean 'jupiter'?`,
      `${FILE}:14:3: ':name' followed directly by ':' is read as plain text — write :name{}: to end the placeholder before the colon`,
      `${FILE}:16:1: '::otherwise' stands only directly inside a section — put it between :::provided{…} (or :::every-target, :::every-event) and its closing :::`,
    ]);
    expect((error as TemplateErrors).errors).toHaveLength(6);
  });

  it('a condition is required, and only one', () => {
    const run = (md: string): string => {
      try {
        render(site, week, md);
      } catch (e) {
        return (e as GloamingError).message;
      }
      return '';
    };
    expect(run(':::provided{body=jupiter}\nx\n:::')).toBe(`${FILE}:6:1: ':::provided' needs a condition; expected one of seen, up, first, has, event, moon — e.g. :::provided{seen=either body=jupiter}`);
    expect(run(':::provided{seen=either event=full-moon body=jupiter}\nx\n:::')).toBe(`${FILE}:6:1: ':::provided' takes one condition, not seen and event; expected one of seen, up, first, has, event, moon — put one section inside another for two conditions`);
    expect(run(':best-time')).toBe(`${FILE}:6:1 field 'body': ':best-time' needs the attribute 'body' (or sit inside :::every-target); expected the body or object — e.g. :best-time{body=jupiter}`);
    expect(run(':::provided{has=verdict body=jupiter}\nx\n:::')).toMatch(/field 'has': 'verdict' is not a value of 'has'/);
  });
});
