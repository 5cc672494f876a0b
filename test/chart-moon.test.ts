/**
 * The Moon's phase on charts. Outside facts used: the lit limb faces the Sun along the great circle
 * joining them (the bright-limb angle of Meeus, *Astronomical Algorithms* 2nd ed., ch. 48); a lit
 * fraction k shows a terminator of semi-axis r·|1 − 2k| (orthographic projection of the terminator
 * circle; k = 0.5 is a straight line).
 */
import { describe, expect, it } from 'vitest';
import { makeLayout } from '../lib/outputs/chart/projection.ts';
import { brightLimbAngle, moonMarkup } from '../lib/outputs/chart/moon.ts';

const RAD = Math.PI / 180;
// Facing south, centred on the horizon: east is on the left, west on the right (as on the charts).
const layout = makeLayout({ altitudeDeg: 0, azimuthDeg: 180 }, 200, 195, 200);

describe('bright limb', () => {
  it('faces the Sun: to the right when the Sun is west of the Moon on the same altitude (facing south)', () => {
    expect(Math.abs(brightLimbAngle(layout, { altitudeDeg: 30, azimuthDeg: 180 }, { altitudeDeg: 30, azimuthDeg: 220 })!) / RAD).toBeLessThan(12);
  });
  it('faces down when the Sun is straight below the Moon', () => {
    expect(brightLimbAngle(layout, { altitudeDeg: 20, azimuthDeg: 180 }, { altitudeDeg: -30, azimuthDeg: 180 })! / RAD).toBeCloseTo(90, 5);
  });
  it('faces up when the Sun is straight above the Moon, and left when it is east of it (facing south)', () => {
    expect(brightLimbAngle(layout, { altitudeDeg: 20, azimuthDeg: 180 }, { altitudeDeg: 60, azimuthDeg: 180 })! / RAD).toBeCloseTo(-90, 5);
    expect(Math.abs(Math.abs(brightLimbAngle(layout, { altitudeDeg: 30, azimuthDeg: 180 }, { altitudeDeg: 30, azimuthDeg: 140 })!) / RAD - 180)).toBeLessThan(12);
  });
});

describe('phase shape', () => {
  it('draws a full disc at full Moon, only the outline at new Moon, and a terminator of semi-axis r·|1 − 2k| between', () => {
    expect(moonMarkup(0, 0, 10, 1, 0)).not.toContain('<path');
    expect(moonMarkup(0, 0, 10, 0, 0)).not.toContain('<path');
    const crescent = moonMarkup(0, 0, 10, 0.25, 0);
    expect(crescent).toMatch(/A10 10 0 0 1 0 10A5 10 0 0 0 0 -10Z/);
    const gibbous = moonMarkup(0, 0, 10, 0.75, 0);
    expect(gibbous).toMatch(/A10 10 0 0 1 0 10A5 10 0 0 1 0 -10Z/);
    const quarter = moonMarkup(0, 0, 10, 0.5, Math.PI / 2);
    expect(quarter).toMatch(/A0 10 0 0 [01] 0 -10Z/);
    expect(quarter).toContain('rotate(90)');
  });
});
