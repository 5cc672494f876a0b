/**
 * A close approach of the Moon that cannot be seen says how far apart the pair is *from the site*,
 * not from the Earth's centre: the Moon's parallax moves it by up to a degree, so the Moon and
 * Antares 0.0° apart geocentrically on 17 June 2027 (a lunar occultation of Antares somewhere on
 * the Earth) are about half a degree apart from the invented Northern Fjord Outpost at 68.6° N;
 * where the Moon's disc does cover the star from the site, it "passes in front of" it. Checked
 * against astronomy-engine's topocentric Moon.
 */
import { AngleFromSun, Body, Equator, MakeTime, RotateVector, Rotation_EQJ_EQD, Vector } from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { findEvents } from '../lib/outputs/almanac/index.ts';
import { loadSites } from '../lib/models/content.ts';
import { starByName } from '../lib/models/stars/catalogue.ts';
import { isoWeekOf, nightOf } from '../lib/core/time.ts';
import { BodyRegistry } from '../lib/core/body.ts';
import { WeekCache, parseBulletin, renderBulletinSync } from '../lib/outputs/bulletin/index.ts';
import { main } from '../lib/outputs/cli/main.ts';

const RAD = Math.PI / 180;
const sites = loadSites('content/sites');
const site = sites.get('northern-outpost')!;

/**
 * Antares (HIP 80763), ICRS J2000: RA 16h 29m 24.46s, Dec −26° 25′ 55.2″ — Hipparcos values quoted
 * from memory; the test first checks that gloaming's star table (d3-celestial's Hipparcos data)
 * agrees within 2″, so the check below rests on the outside catalogue, not on our own data.
 */
const ANTARES = { raDeg: (16 + 29 / 60 + 24.46 / 3600) * 15, decDeg: -(26 + 25 / 60 + 55.2 / 3600) };

function angleDeg(a: number[], b: number[]): number {
  const dot = a[0]! * b[0]! + a[1]! * b[1]! + a[2]! * b[2]!;
  return Math.acos(Math.max(-1, Math.min(1, dot / (Math.hypot(a[0]!, a[1]!, a[2]!) * Math.hypot(b[0]!, b[1]!, b[2]!))))) / RAD;
}

/** The Moon–Antares separation seen from the site at `date` (astronomy-engine topocentric Moon, equator of date), degrees. */
function topocentricSeparationDeg(date: Date, observer = site.observer): number {
  const t = MakeTime(date);
  const moon = Equator(Body.Moon, t, observer, true, true).vec;
  const j2000 = new Vector(Math.cos(ANTARES.decDeg * RAD) * Math.cos(ANTARES.raDeg * RAD), Math.cos(ANTARES.decDeg * RAD) * Math.sin(ANTARES.raDeg * RAD), Math.sin(ANTARES.decDeg * RAD), t);
  const star = RotateVector(Rotation_EQJ_EQD(t), j2000);
  return angleDeg([moon.x, moon.y, moon.z], [star.x, star.y, star.z]);
}

describe('a hidden close approach of the Moon', () => {
  it('our star table holds Antares where Hipparcos puts it (within 2″)', () => {
    const s = starByName('Antares');
    expect(Math.abs(s.raDeg - ANTARES.raDeg) * Math.cos(ANTARES.decDeg * RAD) * 3600).toBeLessThan(2);
    expect(Math.abs(s.decDeg - ANTARES.decDeg) * 3600).toBeLessThan(2);
  });

  it('gives the separation seen from the site (astronomy-engine, within 0.06°), not the geocentric 0.0°', () => {
    const events = findEvents({ site, from: nightOf('2027-06-14', site.timeZone).start, to: nightOf('2027-06-20', site.timeZone).end, options: { types: ['close-approach'] } });
    const e = events.find((x) => x.bodies.includes('moon') && x.names.includes('Antares'));
    expect(e, 'the Moon–Antares approach of 17 June 2027').toBeDefined();
    // Geocentric: a grazing pass, what an almanac tabulates.
    expect(e!.separationDeg).toBeLessThan(0.1);
    expect(e!.visible).toBe(false);
    const said = Number(/passes (\d+\.\d)° from Antares/.exec(e!.description)?.[1]);
    // astronomy-engine: the least topocentric separation within six hours of the geocentric minimum, minute by minute.
    let least = Infinity;
    for (let m = -360; m <= 360; m++) least = Math.min(least, topocentricSeparationDeg(new Date(e!.time.getTime() + m * 60_000)));
    expect(least).toBeGreaterThan(0.3);
    expect(Math.abs(said - least)).toBeLessThanOrEqual(0.06);
  });

  it('says the Moon passes in front of the star when, seen from the site, its disc covers it (astronomy-engine)', () => {
    // Harbour Roof Terrace, 1 November 2027: geocentrically and from the site the Moon covers Antares, out of sight.
    const roof = sites.get('harbour-roof')!;
    const events = findEvents({ site: roof, from: nightOf('2027-10-30', roof.timeZone).start, to: nightOf('2027-11-02', roof.timeZone).end, options: { types: ['close-approach', 'occultation'] } });
    const e = events.find((x) => x.type === 'close-approach' && x.bodies.includes('moon') && x.names.includes('Antares'));
    expect(e).toBeDefined();
    expect(e!.visible).toBe(false);
    let least = Infinity;
    let leastAt = e!.time;
    for (let m = -360; m <= 360; m++) {
      const at = new Date(e!.time.getTime() + m * 60_000);
      const d = topocentricSeparationDeg(at, roof.observer);
      if (d < least) [least, leastAt] = [d, at];
    }
    // The Moon's topocentric semidiameter: its mean radius 1737.4 km (IAU) over the site's distance from astronomy-engine.
    const semidiameterDeg = Math.asin(1737.4 / (Equator(Body.Moon, MakeTime(leastAt), roof.observer, true, true).dist * 149_597_870.7)) / RAD;
    expect(least).toBeLessThan(semidiameterDeg);
    expect(e!.description).toMatch(/^The Moon passes in front of Antares on /);
    expect(e!.description).not.toMatch(/0\.0°/);
    // The same covering is an occultation in the list, with its own contacts.
    expect(events.some((x) => x.type === 'occultation' && x.names.includes('Antares'))).toBe(true);
  });

  it('says why it cannot be seen once, on the page and on the command line (the Moon 8 Dec 2026 near the Sun, astronomy-engine)', () => {
    const station = sites.get('southern-station')!;
    // The Moon a day before new, 9° from the Sun (astronomy-engine AngleFromSun): lost in the glare.
    expect(AngleFromSun(Body.Moon, MakeTime(new Date('2026-12-08T11:16:00Z')))).toBeLessThan(15);
    const html = renderBulletinSync(parseBulletin('---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n::events\n', 'content/bulletins/t.md'), { site: station, week: isoWeekOf('2026-12-08'), bodies: new BodyRegistry() }, new WeekCache()).html;
    const item = html.match(/<li[^>]*data-type="close-approach"[^>]*>.*?<\/li>/)?.[0].replace(/<[^>]+>/g, '') ?? '';
    expect(item).toContain('The Moon passes 0.5° from Antares');
    expect(item.match(/too close to the Sun/g)).toHaveLength(1);
    const lines: string[] = [];
    main(['events', '--site', 'southern-station', '--from', '2026-12-08', '--to', '2026-12-08', '--type', 'close-approach'], (l) => lines.push(l), () => {});
    const line = lines.join('\n').split('\n').find((l) => l.includes('Antares')) ?? '';
    expect(line).toMatch(/not visible {2}The Moon passes 0\.5° from Antares on Tue, 8 Dec\. Not visible from Southern Field Station: too close to the Sun/);
  });
});
