/**
 * Words for directions and angles. The 16-point compass rose (each point 22.5° wide, centred on
 * multiples of 22.5°) is the mariner's standard; hand measures at arm's length (fist ≈ 10°,
 * finger ≈ 2°) are common practice.
 */
import { describe, expect, it } from 'vitest';
import { compass, describeAltitude, fists, handMeasure } from '../lib/core/describe.ts';
import { wordsFor } from '../lib/core/language/index.ts';
import { distanceWords } from '../lib/models/stars/guide.ts';

describe('compass', () => {
  it('names the 16 points at their centres and switches half-way between them', () => {
    const points = ['N', 'NNE', 'NE', 'ENE', 'E', 'ESE', 'SE', 'SSE', 'S', 'SSW', 'SW', 'WSW', 'W', 'WNW', 'NW', 'NNW'];
    points.forEach((p, i) => {
      expect(compass(i * 22.5).abbreviation).toBe(p);
      expect(compass(i * 22.5 + 11.2).abbreviation).toBe(p);
      expect(compass(i * 22.5 - 11.2 + 360).abbreviation).toBe(p);
    });
    expect(compass(292.5).word).toBe('west-northwest');
    expect(compass(-10).abbreviation).toBe('N');
    expect(compass(725).abbreviation).toBe('N');
  });
});

describe('hand measures (common practice: fist ≈ 10°, finger ≈ 2°)', () => {
  it.each([
    [0.5, 'less than a finger'],
    [2, 'about a finger'],
    [4.1, 'about 2 fingers'],
    [6.9, 'about 3 fingers'],
    [7, 'almost a fist'],
    [8, 'almost a fist'],
    [10, 'about a fist'],
    [15, 'about a fist and a half'],
    [18, 'about 2 fists'],
    [26, 'about 2 and a half fists'],
    [-20, 'about 2 fists'],
  ])('%s° → %s', (deg, words) => expect(handMeasure(deg)).toBe(words));

  it('every angle from 0° to 90° gets a phrase with no zero count', () => {
    for (let a = 0; a <= 90; a += 0.25) expect(handMeasure(a)).not.toMatch(/\b0\b|NaN|undefined/);
  });

  it('altitudes carry degrees and fists', () => {
    expect(fists(18)).toBe(2);
    expect(describeAltitude(18.4)).toEqual({ degrees: 18, fists: 2, words: '18° (about 2 fists) up' });
  });

  it('below the horizon the words say so, with no hand measure and no "up"', () => {
    expect(describeAltitude(-13.2).words).toBe('13° below the horizon');
    expect(describeAltitude(-0.3).words).toBe('just below the horizon');
    for (let a = -90; a < 0; a += 0.7) expect(describeAltitude(a).words).not.toMatch(/\bup\b|fist|finger|−/);
  });
});

describe('the hand measure beside printed degrees', () => {
  it('follows the degrees as printed, so one number always reads one way, in every language (a finger ≈ 2°, a fist ≈ 10° at arm’s length: common practice)', () => {
    for (const language of ['en', 'es', 'de', 'fr']) {
      const words = wordsFor(language);
      for (let tenths = 5; tenths <= 600; tenths++) {
        const altitude = tenths / 10;
        const printed = Math.round(altitude);
        // 6.6° prints as "7°": it must read as a printed 7° does, as an altitude and as a distance between two points.
        expect(words.altitude(altitude), `${language} ${altitude}°`).toBe(words.altitude(printed));
        expect(words.altitude(altitude), `${language} ${altitude}°`).toContain(words.handMeasure(printed));
        // Distances under 1° print a decimal ("0.7°"), so whole degrees are compared from 1° up.
        if (altitude >= 1) expect(distanceWords(altitude, words), `${language} ${altitude}°`).toContain(words.handMeasure(printed));
      }
    }
  });
});
