/**
 * Sky-quality conversions: Garstang's units, the NELM ↔ sky-brightness relation and the Bortle
 * mapping. Each check names its source; "common practice" marks trade rules of thumb.
 */
import { describe, expect, it } from 'vitest';
import { expectWithin } from './helpers/tolerance.ts';
import { GloamingError } from '../lib/core/errors.ts';
import {
  BORTLE_CLASSES,
  DARKEST_NATURAL_SKY_MAG,
  darkSkyFromQuality,
  magPerArcsec2ToNl,
  nelmFromSkyBrightness,
  nlToMagPerArcsec2,
  skyBrightnessFromNelm,
  skyQualityFromBrightness,
} from '../lib/models/sky/quality.ts';

/** The widely used closed forms, as printed (constants rounded to 3 decimals), not our code. */
const widelyUsedNelm = (b: number): number => 7.93 - 5 * Math.log10(Math.pow(10, 4.316 - b / 5) + 1);
const widelyUsedSky = (nelm: number): number => 21.58 - 5 * Math.log10(Math.pow(10, 1.586 - nelm / 5) - 1);

describe('units (Garstang 1986, PASP 98:364, eq. 19)', () => {
  it('KS91 Mauna Kea dark zenith: 21.587 mag/arcsec² ↔ 79.0 nL', () => {
    // Krisciunas & Schaefer 1991 use B_zen = 79.0 nL ≡ 21.587 V mag/arcsec² (as read in third-party code).
    expectWithin(magPerArcsec2ToNl(21.587), 79.0, 0.05, '21.587 → nL');
    expectWithin(nlToMagPerArcsec2(79.0), 21.587, 0.001, '79 nL → mag');
  });

  it('natural dark zenith ~21.6 V mag/arcsec² (Patat 2003, A&A 400:1183, Paranal) is ~79 nL', () => {
    expectWithin(magPerArcsec2ToNl(21.6), 79, 1.5, 'Patat 21.6');
  });

  it('exp(20.7233) = 1e9 and 0.92104 = 0.4 ln 10, so B = 3.408e10 · 10^(−0.4 V) (Garstang eq. 19 rewritten)', () => {
    for (const v of [16, 18, 20, 22]) {
      expectWithin(magPerArcsec2ToNl(v) / (3.408e10 * Math.pow(10, -0.4 * v)), 1, 2e-4, `V=${v}`);
    }
  });
});

describe('NELM ↔ sky brightness (Schaefer threshold; widely used relation, common practice)', () => {
  it('matches the widely used NELM = 7.93 − 5 log10(10^(4.316 − B/5) + 1) to its printed precision', () => {
    for (const b of [22, 21.5, 21, 20, 19, 18, 17]) {
      expectWithin(nelmFromSkyBrightness(b), widelyUsedNelm(b), 0.003, `NELM at ${b}`);
    }
  });

  it('inverse matches B = 21.58 − 5 log10(10^(1.586 − NELM/5) − 1)', () => {
    for (const n of [6.5, 6, 5, 4, 3]) {
      expectWithin(skyBrightnessFromNelm(n), widelyUsedSky(n), 0.01, `sky at NELM ${n}`);
    }
  });

  it('check values [digest, computed]: SQM 22.0 → 6.62, 21.0 → 6.12, 20.0 → 5.49; NELM 6.0 → 20.80, 5.0 → 19.30', () => {
    expectWithin(nelmFromSkyBrightness(22), 6.62, 0.01, 'SQM 22');
    expectWithin(nelmFromSkyBrightness(21), 6.12, 0.01, 'SQM 21');
    expectWithin(nelmFromSkyBrightness(20), 5.49, 0.01, 'SQM 20');
    expectWithin(skyBrightnessFromNelm(6), 20.8, 0.01, 'NELM 6');
    expectWithin(skyBrightnessFromNelm(5), 19.3, 0.01, 'NELM 5');
  });

  it('saturates: NELM beyond what a natural sky allows gives the darkest natural sky (documented)', () => {
    expect(skyBrightnessFromNelm(7.5)).toBe(DARKEST_NATURAL_SKY_MAG);
    expect(skyBrightnessFromNelm(8)).toBe(DARKEST_NATURAL_SKY_MAG);
  });

  it('a sharper eye (Snellen 2, 20/10) sees 5 log10 2 = 1.5 mag deeper (Schaefer 1998, VISLIMIT)', () => {
    expectWithin(nelmFromSkyBrightness(21, { snellenRatio: 2 }) - nelmFromSkyBrightness(21), 1.505, 0.001, 'Snellen');
  });
});

describe('Bortle classes (Bortle 2001, Sky & Telescope 101(2):126; SQM values approximate, common practice)', () => {
  it('each class has a representative SQM inside its range; ranges are contiguous and get brighter with class', () => {
    for (let i = 0; i < BORTLE_CLASSES.length; i++) {
      const row = BORTLE_CLASSES[i]!;
      expect(row.bortle).toBe(i + 1);
      expect(row.sqm).toBeLessThanOrEqual(row.sqmRange[0]);
      expect(row.sqm).toBeGreaterThanOrEqual(row.sqmRange[1]);
      const next = BORTLE_CLASSES[i + 1];
      if (next) {
        expect(next.sqmRange[0]).toBe(row.sqmRange[1]);
        expect(next.nelmRange[0]).toBeLessThan(row.nelmRange[1]);
      }
    }
  });

  it('Bortle NELM ranges as published: class 1 7.6–8.0, class 3 6.6–7.0, class 4 6.1–6.5 (Bortle 2001)', () => {
    expect(BORTLE_CLASSES[0]!.nelmRange).toEqual([8.0, 7.6]);
    expect(BORTLE_CLASSES[2]!.nelmRange).toEqual([7.0, 6.6]);
    expect(BORTLE_CLASSES[3]!.nelmRange).toEqual([6.5, 6.1]);
  });

  it('SQM readings land in the commonly tabulated classes: 21.9 → 1, 21.6 → 2, 21.0 → 4, 20.0 → 5, 18.5 → 6, 17.0 → 8 or 9 (common practice)', () => {
    expect(skyQualityFromBrightness(21.9).bortle).toBe(1);
    expect(skyQualityFromBrightness(21.6).bortle).toBe(2);
    expect(skyQualityFromBrightness(21.0).bortle).toBe(4);
    expect(skyQualityFromBrightness(20.0).bortle).toBe(5);
    expect(skyQualityFromBrightness(18.5).bortle).toBe(6);
    expect([8, 9]).toContain(skyQualityFromBrightness(17.0).bortle);
  });

  it('the threshold NELM of each class is within 1.5 mag below Bortle\'s NELM, never above it (sources disagree; Bortle\'s observers are experienced)', () => {
    for (const row of BORTLE_CLASSES) {
      const nelm = nelmFromSkyBrightness(row.sqm);
      expect(nelm, `class ${row.bortle}`).toBeLessThanOrEqual(row.nelmRange[0]);
      expect(nelm, `class ${row.bortle}`).toBeGreaterThanOrEqual(row.nelmRange[1] - 1.5);
    }
  });
});

describe('darkSkyFromQuality', () => {
  it('SQM reading is taken as V mag/arcsec² (common practice)', () => {
    const d = darkSkyFromQuality({ sqm: 21.587 });
    expectWithin(d.zenithNl, 79.0, 0.05, 'nL');
    expect(d.zenithMagPerArcsec2).toBe(21.587);
  });

  it('NELM 6.0 gives the widely used 20.80 mag/arcsec²', () => {
    expectWithin(darkSkyFromQuality({ nelm: 6 }).zenithMagPerArcsec2, widelyUsedSky(6), 0.01, 'NELM 6');
  });

  it('Bortle 1 is near the natural dark sky (~21.6–22.0, Patat 2003) and Bortle 9 brighter than 18 (common practice)', () => {
    expectWithin(darkSkyFromQuality({ bortle: 1 }).zenithMagPerArcsec2, 21.8, 0.2, 'Bortle 1');
    expect(darkSkyFromQuality({ bortle: 9 }).zenithMagPerArcsec2).toBeLessThan(18);
  });

  it('rejects impossible values with a positioned GloamingError', () => {
    expect(() => darkSkyFromQuality({ bortle: 0 })).toThrow(GloamingError);
    expect(() => darkSkyFromQuality({ bortle: 3.5 })).toThrow(GloamingError);
    expect(() => darkSkyFromQuality({ sqm: 30 })).toThrow(GloamingError);
    expect(() => darkSkyFromQuality({ nelm: Number.NaN })).toThrow(GloamingError);
    try {
      darkSkyFromQuality({ sqm: 30 });
    } catch (error) {
      expect((error as GloamingError).place?.field).toBe('sqm');
    }
    expect(() => darkSkyFromQuality({} as never)).toThrow(GloamingError);
  });
});
