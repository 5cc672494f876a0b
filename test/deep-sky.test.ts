/**
 * The deep-sky table (lib/models/deep-sky/): provenance and determinism of the generated file,
 * positions and separations against outside values, the objects as bodies (direction, annual
 * aberration), registry look-ups and errors, and verdicts against common practice.
 */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { expectWithin } from './helpers/tolerance.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { defineSite } from '../lib/core/site.ts';
import { computeNight } from '../lib/models/night.ts';
import { guideFor } from '../lib/models/guide.ts';
import { projectRegistry } from '../lib/models/content.ts';
import { deepSkyBody, deepSkyObject, deepSkyObjects, type DeepSkyObject } from '../lib/models/deep-sky/catalogue.ts';
import { meanSurfaceBrightness } from '../lib/models/sky/extended.ts';

const object = (slug: string): DeepSkyObject => deepSkyObject(slug)!;

describe('the table', () => {
  it('is what scripts/build-deep-sky.ts generates from the installed package (byte for byte)', () => {
    const dir = mkdtempSync(join(tmpdir(), 'deep-sky-'));
    const out = join(dir, 'catalogue.json');
    execFileSync(process.execPath, ['scripts/build-deep-sky.ts', '--out', out], { stdio: 'pipe' });
    expect(readFileSync(out, 'utf8')).toBe(readFileSync('lib/models/deep-sky/catalogue.json', 'utf8'));
  });

  it('holds about a hundred objects, each with a unique slug and alias, a size and a mean surface brightness S = m + 2.5 log10(π a b / 4)', () => {
    const all = deepSkyObjects();
    expect(all.length).toBeGreaterThanOrEqual(90);
    expect(all.length).toBeLessThanOrEqual(130);
    const ids = all.flatMap((o) => [o.slug, ...o.aliases]);
    expect(new Set(ids).size).toBe(ids.length);
    for (const o of all) {
      expect(o.slug).toMatch(/^[a-z0-9-]+$/);
      if (o.type === 'double-star') continue;
      expect(o.majorArcmin, o.id).toBeGreaterThan(0);
      expectWithin(o.surfaceBrightness!, meanSurfaceBrightness(o.mag, o.majorArcmin, o.minorArcmin), 0.006, o.id);
    }
  });

  it('positions agree with SIMBAD\'s J2000 coordinates within 2′ (M 31 00h42m44s +41°16′09″, M 13 16h41m41s +36°27′41″, NGC 869 02h19m00s +57°07′42″, ω Cen 13h26m47s −47°28′46″; from memory)', () => {
    const check = (slug: string, raH: number, raM: number, raS: number, dec: number): void => {
      const o = object(slug);
      const ra = (raH + raM / 60 + raS / 3600) * 15;
      const sep = Math.acos(
        Math.sin((o.decDeg * Math.PI) / 180) * Math.sin((dec * Math.PI) / 180) +
          Math.cos((o.decDeg * Math.PI) / 180) * Math.cos((dec * Math.PI) / 180) * Math.cos(((o.raDeg - ra) * Math.PI) / 180),
      );
      expect((sep * 180) / Math.PI, slug).toBeLessThan(2 / 60);
    };
    check('m31', 0, 42, 44, 41 + 16 / 60 + 9 / 3600);
    check('m13', 16, 41, 41, 36 + 27 / 60 + 41 / 3600);
    check('ngc869', 2, 19, 0, 57 + 7 / 60 + 42 / 3600);
    check('ngc5139', 13, 26, 47, -(47 + 28 / 60 + 46 / 3600));
  });

  it('double stars: separations from the star table match the Washington Double Star Catalog (Albireo 34.4″, ε Lyr 208″, Mizar–Alcor 11.8′; from memory)', () => {
    expectWithin(object('albireo').pair!.separationArcsec, 34.4, 0.6, 'Albireo');
    expectWithin(object('epsilon-lyrae').pair!.separationArcsec, 208, 3, 'ε Lyr');
    expectWithin(object('mizar-alcor').pair!.separationArcsec / 60, 11.8, 0.1, 'Mizar–Alcor');
  });

  it('a Messier object is found by its NGC number too, and ids ignore case and spaces', () => {
    expect(deepSkyObject('NGC 224')!.id).toBe('M 31');
    expect(deepSkyObject('M 31')!.slug).toBe('m31');
  });
});

describe('objects as bodies', () => {
  it('point to their J2000 place; with aberration they move by the annual aberration: at the ecliptic pole the constant of aberration 20.496″ (IAU 1976; from memory) times 1 ± e for the Earth’s changing speed (e = 0.0167)', () => {
    // A made-up row at the north ecliptic pole, where the aberration stays near its full value all year.
    const pole: DeepSkyObject = { ...object('m31'), slug: 'test-pole', raDeg: 270, decDeg: 66.5607, majorArcmin: 1, minorArcmin: 1 };
    const body = deepSkyBody(pole);
    for (const date of ['2026-01-01', '2026-04-01', '2026-07-01', '2026-10-01']) {
      const t = Astronomy.MakeTime(new Date(`${date}T00:00:00Z`));
      const plain = body.geoVector(t, { aberration: false });
      const moved = body.geoVector(t, { aberration: true });
      const eq = Astronomy.EquatorFromVector(plain);
      expectWithin(eq.ra, 18, 1e-9, 'RA');
      expectWithin(eq.dec, 66.5607, 1e-9, 'Dec');
      const angle = Astronomy.AngleBetween(plain, moved) * 3600;
      expectWithin(angle, 20.496, 20.496 * 0.0167 + 0.05, `aberration on ${date}`);
    }
  });
});

describe('registry', () => {
  const reg = projectRegistry();
  it('finds catalogue objects by id without listing them among every target', () => {
    expect(reg.get('m31').name).toBe('M 31 (Andromeda Galaxy)');
    expect(reg.get('NGC224').id).toBe('m31');
    expect(reg.ids()).not.toContain('m31');
  });

  it('an unknown id names what would be right: the bodies and the catalogue', () => {
    let error: unknown;
    try {
      reg.get('m999');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(GloamingError);
    const g = error as GloamingError;
    expect(g.code).toBe('unknown-body');
    expect(g.message).toContain("unknown object 'm999'");
    expect(String(g.expected)).toContain('jupiter');
    expect(String(g.expected)).toContain('a Messier or NGC id from the deep-sky catalogue');
  });
});

describe('verdicts (common practice)', () => {
  const rural = defineSite({ id: 'rural', latitude: 45, longitude: 0, timeZone: 'Europe/Paris', sky: { bortle: 2 }, elevation: 300 });
  const city = defineSite({ id: 'city', latitude: 45, longitude: 0, timeZone: 'Europe/Paris', sky: { bortle: 8 }, elevation: 30 });
  // 2026-10-12: a Moon-free evening two days after new Moon (10 October 2026), M 31 high in the east.
  const night = '2026-10-12';
  const verdict = (site: typeof rural, slug: string): string => computeNight(site, night, [deepSkyBody(object(slug))]).bodies[0]!.visibility.verdict;

  it('M 31: naked eye from a dark rural site, not from a city centre', () => {
    expect(verdict(rural, 'm31')).toBe('naked-eye');
    expect(verdict(city, 'm31')).not.toBe('naked-eye');
  });

  it('M 1 needs optics even in a dark sky', () => {
    expect(verdict(rural, 'm1')).not.toBe('naked-eye');
  });

  it('double stars need the aid that splits them: Mizar and Alcor the naked eye, Albireo binoculars, γ Del a telescope', () => {
    expect(verdict(rural, 'mizar-alcor')).toBe('naked-eye');
    expect(verdict(rural, 'albireo')).toBe('binoculars');
    expect(verdict(rural, 'gamma-delphini')).toBe('telescope');
  });
});

describe('guide phrases for deep-sky objects', () => {
  // A cluster's own stars (Alcyone in M 45) and a double star's pair (Albireo) do not lead the eye
  // to the object: the guide and the nearest star lie outside half the catalogue size (at least 0.25°).
  const north = defineSite({ id: 'north', latitude: 51.5, longitude: 0, timeZone: 'Europe/London' });
  const south = defineSite({ id: 'south', latitude: -33.9, longitude: 18.4, timeZone: 'Africa/Johannesburg' });
  it('never name a star of the object itself', () => {
    let phrased = 0;
    for (const object of deepSkyObjects()) {
      const body = deepSkyBody(object);
      const own = Math.max(0.25, object.majorArcmin / 120);
      for (const site of [north, south]) {
        // Every other month at local midnight: some night has the object up.
        for (let m = 0; m < 12; m += 2) {
          const time = new Date(Date.UTC(2027, m, 15, 0) - (site.longitudeDeg / 15) * 3_600_000);
          const guide = guideFor({ site, body, time });
          if (!guide) continue;
          phrased++;
          if (guide.nearestStar) expect(guide.nearestStar.separationDeg, `${object.slug} ${guide.phrase}`).toBeGreaterThanOrEqual(own - 1e-9);
          if (guide.anchorStar && guide.separationDeg !== null && guide.kind !== 'pattern') expect(guide.separationDeg, `${object.slug} ${guide.phrase}`).toBeGreaterThanOrEqual(own - 1e-9);
          expect(guide.phrase, object.slug).not.toMatch(/\b0\.[0-2]°/);
        }
      }
    }
    expect(phrased).toBeGreaterThan(300);
    // The Pleiades are found from another figure than their own (e.g. the V of Taurus, or Aldebaran).
    const m45 = guideFor({ site: north, body: deepSkyBody(deepSkyObject('m45')!), time: new Date('2026-12-04T23:00:00Z') })!;
    expect(m45.phrase).not.toContain('Alcyone');
    expect(m45.pattern?.id ?? '').not.toBe('pleiades');
  });
});
