/**
 * A satellite's expected visual magnitude from its standard magnitude.
 *
 * Convention (the one visual satellite observers use for "intrinsic" or standard magnitudes,
 * e.g. the McCants `qs.mag` list): the magnitude the satellite would have at a range of 1000 km
 * when half illuminated, i.e. at a phase angle (Sun–satellite–observer) of 90°. The satellite is
 * taken as a diffusely reflecting (Lambert) sphere, whose phase function is
 * Φ(α) = [sin α + (π − α) cos α] / π (Russell 1916, ApJ 43:173; phase integral q = 3/2), so
 *
 *   m = m_std + 5 log10(d / 1000 km) − 2.5 log10(π Φ(α)) − 2.5 log10(f),
 *
 * with π Φ(90°) = 1, and f the fraction of the Sun's disc seen from the satellite (1 in full
 * sunlight, 0 in the umbra; `lib/models/satellite/shadow.ts`). Real satellites are not spheres: flat
 * panels flare and tumble, so the result is an average expectation, typically good to about a
 * magnitude (common practice).
 */

/** The Lambert-sphere phase function Φ(α), normalised to Φ(0) = 1; α in degrees (0–180). */
export function lambertPhaseFunction(phaseAngleDeg: number): number {
  const a = (Math.min(180, Math.max(0, phaseAngleDeg)) * Math.PI) / 180;
  return (Math.sin(a) + (Math.PI - a) * Math.cos(a)) / Math.PI;
}

/** Range at which standard magnitudes are defined, km. */
export const STANDARD_RANGE_KM = 1000;

/**
 * Expected V magnitude of a satellite (outside the atmosphere; add extinction for the observer).
 * `Infinity` when it is in the umbra (nothing lit).
 *
 * @param input.standardMagnitude magnitude at 1000 km and phase angle 90°
 * @param input.rangeKm observer–satellite distance, km
 * @param input.phaseAngleDeg Sun–satellite–observer angle, degrees
 * @param input.sunlitFraction fraction of the Sun's disc visible from the satellite, 0–1 (default 1)
 */
export function satelliteMagnitude(input: { standardMagnitude: number; rangeKm: number; phaseAngleDeg: number; sunlitFraction?: number }): number {
  const lit = input.sunlitFraction ?? 1;
  const phase = Math.PI * lambertPhaseFunction(input.phaseAngleDeg);
  if (!(lit > 0) || !(phase > 0)) return Infinity;
  return input.standardMagnitude + 5 * Math.log10(input.rangeKm / STANDARD_RANGE_KM) - 2.5 * Math.log10(phase) - 2.5 * Math.log10(lit);
}
