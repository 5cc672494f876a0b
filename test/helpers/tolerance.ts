/**
 * Shared tolerance helpers for checks against outside references.
 * Every check names its source beside the call; these helpers only make the
 * units explicit and the failure messages readable.
 */
import { expect } from 'vitest';

export const ARCSEC = 1 / 3600;
export const ARCMIN = 1 / 60;
export const SECOND_MS = 1000;
export const MINUTE_MS = 60_000;

/** Asserts |actual − expected| ≤ tolerance, with a message naming what was compared. */
export function expectWithin(actual: number, expected: number, tolerance: number, what = 'value'): void {
  expect(Number.isFinite(actual), `${what}: got a non-finite value ${actual}`).toBe(true);
  const diff = Math.abs(actual - expected);
  expect(diff, `${what}: |${actual} − ${expected}| = ${diff} > ${tolerance}`).toBeLessThanOrEqual(tolerance);
}

/** Smallest difference between two angles in degrees (handles wrap-around at 360°). */
export function angleDiffDeg(a: number, b: number): number {
  const d = (((a - b) % 360) + 540) % 360 - 180;
  return Math.abs(d);
}

/** Smallest difference between two right ascensions in hours. */
export function raDiffHours(a: number, b: number): number {
  return angleDiffDeg(a * 15, b * 15) / 15;
}

/** Great-circle separation in degrees of two (RA hours, Dec degrees) points. */
export function separationDeg(ra1h: number, dec1: number, ra2h: number, dec2: number): number {
  const r = Math.PI / 180;
  const a1 = ra1h * 15 * r, a2 = ra2h * 15 * r, d1 = dec1 * r, d2 = dec2 * r;
  const s = Math.sin((d2 - d1) / 2) ** 2 + Math.cos(d1) * Math.cos(d2) * Math.sin((a2 - a1) / 2) ** 2;
  return (2 * Math.asin(Math.min(1, Math.sqrt(s)))) / r;
}

/** Summary statistics of a list of errors, for reporting rms and max against a reference set. */
export function errorStats(errors: number[]): { rms: number; max: number; n: number } {
  const n = errors.length;
  const rms = Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / Math.max(1, n));
  const max = errors.reduce((m, e) => Math.max(m, Math.abs(e)), 0);
  return { rms, max, n };
}
