/**
 * Words for directions and angles. The 16-point compass rose (each point 22.5° wide, centred on
 * multiples of 22.5°) is the mariner's standard; hand measures at arm's length (fist ≈ 10°,
 * finger ≈ 2°) are common practice.
 */
import { describe, expect, it } from 'vitest';
import { compass, describeAltitude, fists, handMeasure } from '../lib/core/describe.ts';

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
