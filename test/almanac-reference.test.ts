/**
 * The almanac against outside references: `astronomia` 4.2 (Meeus, Astronomical Algorithms 2nd
 * ed.; independent of astronomy-engine) and published values typed from memory. Sources and
 * their accuracy: test/reference/almanac/README.md.
 */
import { describe, expect, it } from 'vitest';
import * as Astronomy from 'astronomy-engine';
import * as moonphase from 'astronomia/moonphase';
import * as solstice from 'astronomia/solstice';
import * as eclipse from 'astronomia/eclipse';
import * as planetary from 'astronomia/planetary';
import * as apsis from 'astronomia/apsis';
import { Planet } from 'astronomia/planetposition';
import data from 'astronomia/data';
import { apparentGeocentric } from './reference/core/astronomia-reference.ts';
import { builtInBody } from '../lib/core/body.ts';
import { defineSite } from '../lib/core/site.ts';
import { closestApproaches, findEvents, METEOR_SHOWERS, type AlmanacEvent, type AlmanacEventType } from '../lib/outputs/almanac/index.ts';
import { errorStats, expectWithin, MINUTE_MS } from './helpers/tolerance.ts';

const RAD = Math.PI / 180;
const DAY_MS = 86_400_000;
const greenwich = defineSite({ id: 'greenwich', name: 'Greenwich', latitude: 51.4779, longitude: 0, elevation: 46, timeZone: 'Europe/London' });
const dallas = defineSite({ id: 'dallas', name: 'Dallas', latitude: 32.7767, longitude: -96.797, elevation: 140, timeZone: 'America/Chicago' });
const nashville = defineSite({ id: 'nashville', name: 'Nashville', latitude: 36.1627, longitude: -86.7816, elevation: 170, timeZone: 'America/Chicago' });

/** Julian Ephemeris Day (TT) of an instant, with astronomy-engine's ΔT. */
function jdeOf(date: Date): number {
  return Astronomy.MakeTime(date).tt + 2451545.0;
}
function decimalYear(date: Date): number {
  const y = date.getUTCFullYear();
  return y + (date.getTime() - Date.UTC(y, 0, 1)) / (Date.UTC(y + 1, 0, 1) - Date.UTC(y, 0, 1));
}
function events(types: AlmanacEventType[], from: string, to: string, site = greenwich): AlmanacEvent[] {
  return findEvents({ site, from: new Date(from), to: new Date(to), options: { types } });
}
/** Separation of two apparent places (radians in, degrees out). */
function sepDeg(a: { ra: number; dec: number }, b: { ra: number; dec: number }): number {
  const s = Math.sin(a.dec) * Math.sin(b.dec) + Math.cos(a.dec) * Math.cos(b.dec) * Math.cos(a.ra - b.ra);
  return Math.acos(Math.min(1, s)) / RAD;
}
/** Apparent geocentric ecliptic longitude (of date) from astronomia's apparent RA/Dec, degrees. */
function apparentLongitudeDeg(id: 'sun' | 'mars' | 'jupiter' | 'saturn' | 'mercury' | 'venus', jde: number): number {
  const eq = apparentGeocentric(id, jde);
  const e = 23.4392911 * RAD; // the rotation only needs to be the same for both bodies
  const lon = Math.atan2(Math.sin(eq.ra) * Math.cos(e) + Math.tan(eq.dec) * Math.sin(e), Math.cos(eq.ra)) / RAD;
  return (lon + 360) % 360;
}

describe('Moon phases against astronomia moonphase (Meeus ch. 49)', () => {
  it('every principal phase of 2024 and 2030 within 1 minute', () => {
    const fn = { 'new-moon': moonphase.newMoon, 'first-quarter': moonphase.first, 'full-moon': moonphase.full, 'last-quarter': moonphase.last } as const;
    const errors: number[] = [];
    for (const year of [2024, 2030]) {
      const list = events(['new-moon', 'first-quarter', 'full-moon', 'last-quarter'], `${year}-01-01T00:00:00Z`, `${year + 1}-01-01T00:00:00Z`);
      expect(list.length).toBeGreaterThanOrEqual(48);
      for (const e of list) {
        const ref = fn[e.type as keyof typeof fn](decimalYear(e.time));
        errors.push((jdeOf(e.time) - ref) * 1440);
      }
    }
    const stats = errorStats(errors);
    console.log(`moon phases vs astronomia: n=${stats.n} rms ${(stats.rms * 60).toFixed(1)} s, max ${(stats.max * 60).toFixed(1)} s`);
    expect(stats.max).toBeLessThanOrEqual(1);
  });
});

describe('equinoxes and solstices', () => {
  it('2000–2040 against astronomia solstice (Meeus ch. 27, within 1 min 1951–2050): within 2 min', () => {
    const errors: number[] = [];
    for (let year = 2000; year <= 2040; year += 4) {
      const list = events(['equinox', 'solstice'], `${year}-01-01T00:00:00Z`, `${year + 1}-01-01T00:00:00Z`);
      expect(list.map((e) => e.type)).toEqual(['equinox', 'solstice', 'equinox', 'solstice']);
      const refs = [solstice.march(year), solstice.june(year), solstice.september(year), solstice.december(year)];
      list.forEach((e, i) => errors.push((jdeOf(e.time) - refs[i]!) * 1440));
    }
    const stats = errorStats(errors);
    console.log(`seasons vs astronomia: n=${stats.n} rms ${stats.rms.toFixed(2)} min, max ${stats.max.toFixed(2)} min`);
    expect(stats.max).toBeLessThanOrEqual(2);
  });

  it('2024 against the published UTC instants (from memory): within 2 min', () => {
    const list = events(['equinox', 'solstice'], '2024-01-01T00:00:00Z', '2025-01-01T00:00:00Z');
    const published = ['2024-03-20T03:06Z', '2024-06-20T20:51Z', '2024-09-22T12:44Z', '2024-12-21T09:21Z'];
    list.forEach((e, i) => expectWithin(e.time.getTime(), Date.parse(published[i]!), 2 * MINUTE_MS, `${e.title} 2024`));
  });

  it('wording follows the hemisphere: the June solstice is the longest night in the south', () => {
    const south = defineSite({ id: 'south', latitude: -34.35, longitude: 150.05, timeZone: 'Australia/Sydney' });
    const june = events(['solstice'], '2024-06-01T00:00:00Z', '2024-07-01T00:00:00Z', south)[0]!;
    expect(june.description).toContain('longest night');
    expect(events(['solstice'], '2024-06-01T00:00:00Z', '2024-07-01T00:00:00Z')[0]!.description).toContain('shortest night');
  });
});

describe('lunar eclipses', () => {
  it('2021–2030 against astronomia eclipse.lunar (Meeus ch. 54): same kind, greatest eclipse within 5 min', () => {
    const list = [
      ...events(['lunar-eclipse'], '2021-01-01T00:00:00Z', '2026-01-01T00:00:00Z'),
      ...events(['lunar-eclipse'], '2026-01-01T00:00:00Z', '2031-01-01T00:00:00Z'),
    ];
    expect(list.length).toBeGreaterThanOrEqual(18);
    const kindOf: Record<number, string> = { [eclipse.TYPE.Penumbral]: 'penumbral', [eclipse.TYPE.Umbral]: 'partial', [eclipse.TYPE.Total]: 'total' };
    const errors: number[] = [];
    let marginal = 0;
    for (const e of list) {
      const ref = eclipse.lunar(decimalYear(e.time));
      if (ref.type === eclipse.TYPE.None) {
        // A grazing penumbral eclipse (2027 Jul 18) that Meeus's series just misses: allowed only as penumbral.
        expect(e.eclipse!.kind, `astronomia finds no eclipse near ${e.time.toISOString()}`).toBe('penumbral');
        marginal++;
        continue;
      }
      expect(e.eclipse!.kind, e.time.toISOString()).toBe(kindOf[ref.type]);
      errors.push((jdeOf(e.time) - ref.jdeMax!) * 1440);
      // Total phase semi-duration (Meeus 54) within 3 minutes. Skipped for grazing totalities (half
      // of totality < 20 min, e.g. 2021 May 26), whose length hangs on the shadow-enlargement convention.
      if (ref.sdTotal && ref.sdTotal * 1440 > 20) {
        const u2 = e.eclipse!.contacts.find((c) => c.name === 'U2')!.time;
        expectWithin((e.time.getTime() - u2.getTime()) / MINUTE_MS, ref.sdTotal * 1440, 3, `half of totality ${e.time.toISOString()}`);
      }
    }
    const stats = errorStats(errors);
    expect(marginal).toBeLessThanOrEqual(1);
    console.log(`lunar eclipses vs astronomia: n=${stats.n} (+${marginal} marginal penumbral) rms ${stats.rms.toFixed(2)} min, max ${stats.max.toFixed(2)} min`);
    expect(stats.max).toBeLessThanOrEqual(5);
  });

  it('published greatest eclipse of three total lunar eclipses (from memory): within 3 min', () => {
    for (const t of ['2022-11-08T10:59Z', '2025-03-14T06:59Z', '2025-09-07T18:12Z']) {
      const ms = Date.parse(t);
      const [e] = events(['lunar-eclipse'], new Date(ms - DAY_MS).toISOString(), new Date(ms + DAY_MS).toISOString());
      expect(e?.eclipse?.kind).toBe('total');
      expectWithin(e!.time.getTime(), ms, 3 * MINUTE_MS, `lunar eclipse ${t}`);
    }
  });

  it('the 2025 September 7 eclipse: visible from Sydney (evening of the 8th, local), not from Dallas (daytime), and labelled', () => {
    const sydney = defineSite({ id: 'sydney', latitude: -33.87, longitude: 151.21, timeZone: 'Australia/Sydney' });
    const [a] = events(['lunar-eclipse'], '2025-09-06T00:00:00Z', '2025-09-09T00:00:00Z', sydney);
    const [b] = events(['lunar-eclipse'], '2025-09-06T00:00:00Z', '2025-09-09T00:00:00Z', dallas);
    expect(a!.visible).toBe(true);
    expect(b!.visible).toBe(false);
    expect(b!.visibility.reason).toBe('below-horizon');
    expect(b!.description).toMatch(/below the horizon/);
  });
});

describe('solar eclipses, local circumstances', () => {
  it('2024 April 8 from Dallas: total; totality begins ≈ 18:40:40 UT and lasts ≈ 3 min 50 s (from memory)', () => {
    const [e] = events(['solar-eclipse'], '2024-04-08T00:00:00Z', '2024-04-09T00:00:00Z', dallas);
    expect(e!.eclipse!.kind).toBe('total');
    const c2 = e!.eclipse!.contacts.find((c) => c.name === 'C2')!.time;
    const c3 = e!.eclipse!.contacts.find((c) => c.name === 'C3')!.time;
    expectWithin(c2.getTime(), Date.parse('2024-04-08T18:40:40Z'), 3 * MINUTE_MS, 'Dallas C2');
    expectWithin((c3.getTime() - c2.getTime()) / 1000, 230, 30, 'Dallas totality, s');
    expect(e!.caution).toMatch(/ISO 12312-2/);
    expect(e!.caution).toMatch(/totality/);
  });

  it('2017 August 21 from Nashville: total; totality begins ≈ 18:27 UT (from memory), lasts ≈ 2 min', () => {
    const [e] = events(['solar-eclipse'], '2017-08-21T00:00:00Z', '2017-08-22T00:00:00Z', nashville);
    expect(e!.eclipse!.kind).toBe('total');
    const c2 = e!.eclipse!.contacts.find((c) => c.name === 'C2')!.time;
    const c3 = e!.eclipse!.contacts.find((c) => c.name === 'C3')!.time;
    expectWithin(c2.getTime(), Date.parse('2017-08-21T18:27:00Z'), 3 * MINUTE_MS, 'Nashville C2');
    expectWithin((c3.getTime() - c2.getTime()) / 1000, 115, 30, 'Nashville totality, s');
  });

  it('the same 2024 eclipse is only partial from Greenwich… and below the horizon there (it happens after sunset): labelled not visible, caution kept', () => {
    const list = events(['solar-eclipse'], '2024-04-08T00:00:00Z', '2024-04-09T00:00:00Z');
    for (const e of list) {
      expect(e.eclipse!.kind).toBe('partial');
      expect(e.visible).toBe(false);
      expect(e.caution).toMatch(/never look straight at the Sun/);
    }
  });

  it('2027 August 2 from 68.55° N, 13.4° E: astronomy-engine finds the Moon covering under half a per cent of the Sun; the page says it only grazes, not "0% covered", and keeps the caution', () => {
    const site = defineSite({ id: 'far-north', latitude: 68.55, longitude: 13.4, elevation: 15, timeZone: 'Europe/Oslo' });
    const reference = Astronomy.SearchLocalSolarEclipse(new Date('2027-07-25T00:00:00Z'), site.observer);
    expect(reference.kind).toBe('partial');
    expect(reference.obscuration).toBeGreaterThan(0);
    expect(reference.obscuration).toBeLessThan(0.005);
    const [e] = events(['solar-eclipse'], '2027-08-01T00:00:00Z', '2027-08-04T00:00:00Z', site);
    expect(e!.eclipse!.obscuration).toBeCloseTo(reference.obscuration, 6);
    expect(e!.description).not.toMatch(/\b0%/);
    expect(e!.description).toMatch(/less than 1%/);
    expect(e!.caution).toMatch(/never look straight at the Sun/);
    // The same eclipse from a harbour city at 50.45° N covers 46% (astronomy-engine): the usual sentence, with its percentage.
    const harbour = defineSite({ id: 'harbour', latitude: 50.45, longitude: -1.55, timeZone: 'Europe/London' });
    const [h] = events(['solar-eclipse'], '2027-08-01T00:00:00Z', '2027-08-04T00:00:00Z', harbour);
    const percent = Math.round(Astronomy.SearchLocalSolarEclipse(new Date('2027-07-25T00:00:00Z'), harbour.observer).obscuration * 100);
    expect(h!.description).toContain(`with ${percent}% of the Sun's disc covered`);
  });

  it('global maximum of the 2024 April 8 eclipse agrees with astronomia eclipse.solar (Meeus ch. 54) to 1 hour, kind total', () => {
    const ref = eclipse.solar(2024.27);
    expect(ref.type).toBe(eclipse.TYPE.Total);
    const [e] = events(['solar-eclipse'], '2024-04-08T00:00:00Z', '2024-04-09T00:00:00Z', dallas);
    expect(Math.abs(jdeOf(e!.time) - ref.jdeMax!) * 24).toBeLessThan(1);
  });
});

describe('oppositions', () => {
  const list = [...events(['opposition'], '2022-01-01T00:00:00Z', '2026-01-01T00:00:00Z')];

  it('at each opposition the planet is 180° from the Sun in apparent geocentric longitude (astronomia VSOP87): within 0.02°', () => {
    expect(list.length).toBeGreaterThanOrEqual(15);
    for (const e of list) {
      const id = e.bodies[0] as 'mars' | 'jupiter' | 'saturn';
      if (!['mars', 'jupiter', 'saturn'].includes(id)) continue;
      const jde = jdeOf(e.time);
      const diff = Math.abs((((apparentLongitudeDeg(id, jde) - apparentLongitudeDeg('sun', jde)) % 360) + 360) % 360 - 180);
      expect(diff, `${e.title} ${e.time.toISOString()}`).toBeLessThan(0.02);
    }
  });

  it('published dates (from memory): Mars 2022-12-08, 2025-01-16; Jupiter 2022-09-26, 2023-11-03; Saturn 2023-08-27', () => {
    const dates = (id: string): string[] => list.filter((e) => e.bodies[0] === id).map((e) => e.time.toISOString().slice(0, 10));
    expect(dates('mars')).toEqual(expect.arrayContaining(['2022-12-08', '2025-01-16']));
    expect(dates('jupiter')).toEqual(expect.arrayContaining(['2022-09-26', '2023-11-03']));
    expect(dates('saturn')).toEqual(expect.arrayContaining(['2023-08-27']));
  });

  it('against astronomia planetary (Meeus ch. 36 periodic terms): within 0.5 day', () => {
    const fn = { mars: planetary.marsOpp, jupiter: planetary.jupiterOpp, saturn: planetary.saturnOpp, uranus: planetary.uranusOpp, neptune: planetary.neptuneOpp } as const;
    const errors: number[] = [];
    for (const e of list) errors.push(jdeOf(e.time) - fn[e.bodies[0] as keyof typeof fn](decimalYear(e.time)));
    const stats = errorStats(errors);
    console.log(`oppositions vs Meeus ch. 36: n=${stats.n} rms ${(stats.rms * 24).toFixed(2)} h, max ${(stats.max * 24).toFixed(2)} h`);
    expect(stats.max).toBeLessThanOrEqual(0.5);
  });
});

describe('greatest elongations', () => {
  const list = [...events(['greatest-elongation'], '2023-01-01T00:00:00Z', '2026-01-01T00:00:00Z')];

  it("Venus (from memory): 2023 Jun 4 45.4° E, 2023 Oct 23 46.4° W, 2025 Jan 10 47.2° E, 2025 Jun 1 45.9° W — date within a day, angle within 0.2°", () => {
    const venus = list.filter((e) => e.bodies[0] === 'venus');
    const published: [string, number, string][] = [['2023-06-04', 45.4, 'evening'], ['2023-10-23', 46.4, 'morning'], ['2025-01-10', 47.2, 'evening'], ['2025-06-01', 45.9, 'morning']];
    expect(venus).toHaveLength(4);
    venus.forEach((e, i) => {
      const [date, angle, side] = published[i]!;
      expectWithin(e.time.getTime(), Date.parse(`${date}T12:00:00Z`), DAY_MS, `Venus elongation ${date}`);
      expectWithin(e.separationDeg!, angle, 0.2, `Venus elongation angle ${date}`);
      expect(e.data?.side).toBe(side);
    });
  });

  it('Mercury against astronomia planetary (Meeus ch. 36): instant within 0.5 day, elongation within 0.1°', () => {
    const mercury = list.filter((e) => e.bodies[0] === 'mercury');
    expect(mercury.length).toBeGreaterThanOrEqual(18);
    for (const e of mercury) {
      const [jde, elongationRad] = (e.data?.side === 'evening' ? planetary.mercuryEastElongation : planetary.mercuryWestElongation)(decimalYear(e.time));
      expectWithin(jdeOf(e.time), jde, 0.5, `Mercury elongation ${e.time.toISOString()}`);
      expectWithin(e.separationDeg!, elongationRad / RAD, 0.1, `Mercury elongation angle ${e.time.toISOString()}`);
    }
  });
});

describe('close approaches against published separations and astronomia', () => {
  it('Venus–Jupiter, 2023 March 1–2: about 0.5° (published, from memory); astronomia VSOP87 separation at our instant within 0.01°', () => {
    const [m] = closestApproaches(builtInBody('venus'), builtInBody('jupiter'), new Date('2023-02-20'), new Date('2023-03-10'));
    expectWithin(m!.separationDeg, 0.5, 0.05, 'Venus–Jupiter separation');
    expectWithin(m!.time.getTime(), Date.parse('2023-03-02T00:00:00Z'), DAY_MS, 'Venus–Jupiter date');
    const jde = jdeOf(m!.time);
    expectWithin(m!.separationDeg, sepDeg(apparentGeocentric('venus', jde), apparentGeocentric('jupiter', jde)), 0.01, 'astronomia separation');
  });

  it('Jupiter–Saturn, 2020 December 21: 6.1′ (published, from memory) within 0.3′ (astronomy-engine states ~1′ accuracy; its minimum is 5.93′, VSOP87B 6.11′)', () => {
    const [m] = closestApproaches(builtInBody('jupiter'), builtInBody('saturn'), new Date('2020-12-10'), new Date('2021-01-01'));
    expectWithin(m!.separationDeg * 60, 6.1, 0.3, 'Jupiter–Saturn separation, arcmin');
    expectWithin(m!.time.getTime(), Date.parse('2020-12-21T18:00:00Z'), 6 * 3600_000, 'Jupiter–Saturn instant');
    const jde = jdeOf(m!.time);
    const ref = sepDeg(apparentGeocentric('jupiter', jde), apparentGeocentric('saturn', jde)) * 60;
    expectWithin(m!.separationDeg * 60, ref, 0.3, 'astronomia separation, arcmin');
  });

  it('findEvents lists both as close-approach events with the separation', () => {
    const a = events(['close-approach'], '2023-03-01T00:00:00Z', '2023-03-04T00:00:00Z').filter((e) => e.bodies.includes('venus') && e.bodies.includes('jupiter'));
    expect(a).toHaveLength(1);
    expect(a[0]!.bodies[0]).toBe('venus'); // the brighter body leads
    expectWithin(a[0]!.separationDeg!, 0.5, 0.05, 'separation');
    expect(a[0]!.visible).toBe(true); // evening sky in the west from Greenwich
  });
});

describe('lunar perigee and apogee against astronomia apsis (Meeus ch. 50)', () => {
  it('2024–2025: perigee within 35 min (Meeus: max 31 min), apogee within 10 min (Meeus: 3 min)', () => {
    const list = events(['perigee', 'apogee'], '2024-01-01T00:00:00Z', '2026-01-01T00:00:00Z');
    expect(list.length).toBeGreaterThanOrEqual(50);
    for (const e of list) {
      const ref = (e.type === 'perigee' ? apsis.perigee : apsis.apogee)(decimalYear(e.time));
      expectWithin(jdeOf(e.time) * 1440, ref * 1440, e.type === 'perigee' ? 35 : 10, `${e.type} ${e.time.toISOString()}`);
    }
  });
});

describe('stationary points', () => {
  it("Mars's second station of 2022–23 against astronomia planetary.marsStation2 (Meeus ch. 36): within 1 day", () => {
    const mars = events(['stationary'], '2022-06-01T00:00:00Z', '2023-06-01T00:00:00Z').filter((e) => e.bodies[0] === 'mars');
    expect(mars.map((e) => e.data?.motion)).toEqual(['retrograde', 'direct']);
    expectWithin(jdeOf(mars[1]!.time), planetary.marsStation2(decimalYear(mars[1]!.time)), 1, 'Mars station 2');
  });

  it('at every station of 2024 the apparent longitude (astronomia VSOP87) changes by < 0.01° over ±1 day', () => {
    const list = events(['stationary'], '2024-01-01T00:00:00Z', '2025-01-01T00:00:00Z').filter((e) => ['mercury', 'venus', 'mars', 'jupiter', 'saturn'].includes(e.bodies[0]!));
    expect(list.length).toBeGreaterThanOrEqual(6);
    for (const e of list) {
      const id = e.bodies[0] as 'mars';
      const jde = jdeOf(e.time);
      const change = apparentLongitudeDeg(id, jde + 1) - apparentLongitudeDeg(id, jde - 1);
      expect(Math.abs(change), `${e.title} ${e.time.toISOString()}`).toBeLessThan(0.01);
    }
  });
});

describe('meteor shower peaks', () => {
  const list = events(['meteor-shower-peak'], '2024-01-01T00:00:00Z', '2025-01-01T00:00:00Z');

  it('2024 peak dates (UT) match the IMO Meteor Shower Calendar 2024 (from memory) within a day', () => {
    const published: Record<string, string> = { QUA: '2024-01-04', LYR: '2024-04-22', ETA: '2024-05-05', SDA: '2024-07-30', PER: '2024-08-12', ORI: '2024-10-21', LEO: '2024-11-17', GEM: '2024-12-14', URS: '2024-12-22' };
    for (const [code, date] of Object.entries(published)) {
      const e = list.find((x) => x.shower?.code === code);
      expect(e, code).toBeDefined();
      expectWithin(e!.time.getTime(), Date.parse(`${date}T12:00:00Z`), 1.5 * DAY_MS, `${code} peak`);
    }
  });

  it("at each peak the Sun's J2000 longitude from astronomia VSOP87B (Earth's position2000 + 180°, minus 20.5″ aberration) equals the table's λ☉ within 0.002°", () => {
    const earth = new Planet(data.vsop87Bearth);
    for (const e of list) {
      const shower = METEOR_SHOWERS.find((s) => s.code === e.shower!.code)!;
      const jde = jdeOf(e.time);
      // Light time ≈ 8.3 min: the Sun is seen where the Earth–Sun line was then (≈ the aberration term; Meeus ch. 25).
      const helio = earth.position2000(jde);
      const lon = ((helio.lon / RAD + 180 - 20.496 / 3600 / helio.range) % 360 + 360) % 360;
      const diff = Math.abs(((lon - shower.peakSolarLongitudeDeg + 540) % 360) - 180);
      expect(diff, `${shower.code}: ${lon}`).toBeLessThan(0.002);
    }
  });
});
