/**
 * The Moon's phase: name, lit fraction, phase angle and age.
 *
 * Phase names follow the Moon's geocentric ecliptic elongation from the Sun (0° new, 90° first
 * quarter, 180° full, 270° last quarter). A principal phase name is used within ±6.1° of its
 * exact elongation — half a day either side of the instant, at the Moon's mean elongation rate of
 * 12.19°/day — so the name matches the calendar day of the event; otherwise the intermediate name.
 */
import * as Astronomy from 'astronomy-engine';
import { astroTime, type Instant } from './observe.ts';

export type PhaseName =
  | 'new-moon'
  | 'waxing-crescent'
  | 'first-quarter'
  | 'waxing-gibbous'
  | 'full-moon'
  | 'waning-gibbous'
  | 'last-quarter'
  | 'waning-crescent';

export const PHASE_LABEL: Record<PhaseName, string> = {
  'new-moon': 'New Moon',
  'waxing-crescent': 'Waxing crescent',
  'first-quarter': 'First quarter',
  'waxing-gibbous': 'Waxing gibbous',
  'full-moon': 'Full Moon',
  'waning-gibbous': 'Waning gibbous',
  'last-quarter': 'Last quarter',
  'waning-crescent': 'Waning crescent',
};

/** Half-width of a principal phase, degrees of elongation (half a day at 12.19°/day). */
const PRINCIPAL_HALF_WIDTH_DEG = 6.1;

export interface MoonPhase {
  name: PhaseName;
  /** Geocentric ecliptic longitude of the Moon minus that of the Sun, degrees 0–360. */
  elongationDeg: number;
  /** Fraction of the disc lit, 0–1. */
  illuminatedFraction: number;
  /** Sun–Moon–Earth angle, degrees (0 at full). */
  phaseAngleDeg: number;
  /** Days since the most recent new Moon. */
  ageDays: number;
}

/** The phase name for an elongation in degrees (0–360). */
export function phaseName(elongationDeg: number): PhaseName {
  const e = ((elongationDeg % 360) + 360) % 360;
  const principal: [number, PhaseName][] = [
    [0, 'new-moon'],
    [90, 'first-quarter'],
    [180, 'full-moon'],
    [270, 'last-quarter'],
    [360, 'new-moon'],
  ];
  for (const [at, name] of principal) if (Math.abs(e - at) <= PRINCIPAL_HALF_WIDTH_DEG) return name;
  if (e < 90) return 'waxing-crescent';
  if (e < 180) return 'waxing-gibbous';
  if (e < 270) return 'waning-gibbous';
  return 'waning-crescent';
}

/**
 * The lit fraction to print beside the phase's name, as a percentage with `digits` decimals: the
 * fraction itself, except that a crescent or gibbous Moon, which is neither dark nor fully lit,
 * never prints as 0% or 100% — within half a day of new Moon the disc is under 0.5% lit while the
 * name is already "crescent" — but as the nearest value that is not (1%, 99% with no decimals).
 */
export function printedLitFraction(phase: Pick<MoonPhase, 'name' | 'illuminatedFraction'>, digits = 0): number {
  const f = phase.illuminatedFraction;
  if (phase.name !== 'waxing-crescent' && phase.name !== 'waning-crescent' && phase.name !== 'waxing-gibbous' && phase.name !== 'waning-gibbous') return f;
  const step = 10 ** -(digits + 2);
  return Math.min(Math.max(f, step), 1 - step);
}

/** Mean synodic month, days (Meeus, Astronomical Algorithms, eq. 49.1). */
const SYNODIC_MONTH_DAYS = 29.530588861;
/** The mean new Moon of lunation 0 (Meeus eq. 49.1, k = 0: JDE 2451550.09766, 2000 January 6), days from J2000 (TT; UT differs by a minute). */
const MEAN_NEW_MOON_UT = 5.09766;

/**
 * The new Moon of lunation `k` (counted from January 2000), UT days, or null: found once by
 * astronomy-engine's search within three days of the mean new Moon (the true one differs from it by
 * at most about 14 hours) and kept, since every night of a lunation asks for the same one.
 */
const newMoons = new Map<number, number | null>();
function newMoonUt(k: number): number | null {
  let ut = newMoons.get(k);
  if (ut === undefined) {
    ut = Astronomy.SearchMoonPhase(0, Astronomy.MakeTime(MEAN_NEW_MOON_UT + k * SYNODIC_MONTH_DAYS - 3), 6)?.ut ?? null;
    newMoons.set(k, ut);
  }
  return ut;
}

/** The Moon's phase at `instant` (geocentric). */
export function moonPhase(instant: Instant): MoonPhase {
  const time = astroTime(instant);
  const elongationDeg = Astronomy.MoonPhase(time);
  const illum = Astronomy.Illumination(Astronomy.Body.Moon, time);
  // The previous new Moon lies about elongation / 12.19 days back (the mean daily gain on the Sun).
  const k = Math.round((time.ut - elongationDeg / 12.19 - MEAN_NEW_MOON_UT) / SYNODIC_MONTH_DAYS);
  const found = newMoonUt(k);
  const lastNew = found !== null && found > time.ut ? newMoonUt(k - 1) : found;
  return {
    name: phaseName(elongationDeg),
    elongationDeg,
    illuminatedFraction: illum.phase_fraction,
    phaseAngleDeg: illum.phase_angle,
    ageDays: lastNew !== null ? time.ut - lastNew : (elongationDeg / 360) * SYNODIC_MONTH_DAYS,
  };
}
