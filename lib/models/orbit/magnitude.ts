/**
 * Expected visual magnitudes of comets and asteroids.
 *
 * - Comets: total (coma) magnitude m = M1 + 5 log10 Δ + K1 log10 r, the standard power law used
 *   by the Minor Planet Center and JPL's small-body database for total magnitudes (M1, K1), and
 *   given as m = g + 5 log Δ + κ log r in Meeus, *Astronomical Algorithms* 2nd ed., end of ch. 33
 *   (chapter reference from memory). K1 = 2.5 n; the common default n = 4 gives K1 = 10. Comet
 *   brightness is uncertain, so a second K1 or a ± band gives a range.
 * - Asteroids: the IAU H–G system, Bowell E., Hapke B., Domingue D., Lumme K., Peltoniemi J.,
 *   Harris A.W. 1989, "Application of photometric models to asteroids", in *Asteroids II*,
 *   pp. 524–556 (University of Arizona Press), with the full two-part phase functions of its
 *   appendix (linear blend of the small-angle and large-angle forms).
 *
 * r = heliocentric distance, Δ = geocentric distance (AU); α = phase angle (degrees).
 */
import type { MagnitudeEstimate } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import type { MagnitudeModel } from './elements.ts';

/** Comet total magnitude m = M1 + 5 log10 Δ + K1 log10 r; r and Δ in AU (see the module note). */
export function cometMagnitude(M1: number, K1: number, heliocentricDistanceAu: number, geocentricDistanceAu: number): number {
  return M1 + 5 * Math.log10(geocentricDistanceAu) + K1 * Math.log10(heliocentricDistanceAu);
}

const A1 = 3.332;
const B1 = 0.631;
const C1 = 0.986;
const A2 = 1.862;
const B2 = 1.218;
const C2 = 0.238;

/**
 * The H–G phase functions Φ1(α), Φ2(α) of Bowell et al. 1989 (appendix): Φi = W Φi,S + (1 − W) Φi,L
 * with W = exp(−90.56 tan²(α/2)), Φi,S = 1 − Ci sin α / (0.119 + 1.341 sin α − 0.754 sin² α),
 * Φi,L = exp(−Ai tan(α/2)^Bi); A1 3.332, B1 0.631, C1 0.986, A2 1.862, B2 1.218, C2 0.238.
 * For 0 ≤ α < 180°.
 */
export function hgPhaseFunctions(phaseAngleDeg: number): [number, number] {
  const a = (Math.abs(phaseAngleDeg) * Math.PI) / 180;
  const t = Math.tan(a / 2);
  const s = Math.sin(a);
  const w = Math.exp(-90.56 * t * t);
  const smallAngle = s / (0.119 + 1.341 * s - 0.754 * s * s);
  const phi1 = w * (1 - C1 * smallAngle) + (1 - w) * Math.exp(-A1 * Math.pow(t, B1));
  const phi2 = w * (1 - C2 * smallAngle) + (1 - w) * Math.exp(-A2 * Math.pow(t, B2));
  return [phi1, phi2];
}

/**
 * Asteroid V magnitude in the IAU H–G system (Bowell et al. 1989):
 * V = H + 5 log10(r Δ) − 2.5 log10((1 − G) Φ1(α) + G Φ2(α)).
 */
export function hgMagnitude(H: number, G: number, heliocentricDistanceAu: number, geocentricDistanceAu: number, phaseAngleDeg: number): number {
  const [phi1, phi2] = hgPhaseFunctions(phaseAngleDeg);
  return H + 5 * Math.log10(heliocentricDistanceAu * geocentricDistanceAu) - 2.5 * Math.log10((1 - G) * phi1 + G * phi2);
}

/**
 * The expected magnitude of an object from its model at distances r, Δ (AU) and phase angle α
 * (degrees). A comet with `K1Alternative` reports the range spanned by both K1 values (value =
 * the one from K1); with `uncertainty` the range is widened by ± that many magnitudes.
 */
export function expectedMagnitude(
  model: MagnitudeModel,
  geometry: { heliocentricDistanceAu: number; geocentricDistanceAu: number; phaseAngleDeg: number },
  origin?: { id: string; file?: string },
): MagnitudeEstimate {
  const { heliocentricDistanceAu: r, geocentricDistanceAu: delta, phaseAngleDeg } = geometry;
  const value = model.model === 'hg' ? hgMagnitude(model.H, model.G, r, delta, phaseAngleDeg) : cometMagnitude(model.M1, model.K1, r, delta);
  if (!Number.isFinite(value)) {
    // Never publish a magnitude that is not a number: name the object file so its author can fix it.
    throw new GloamingError('invalid-value', `the magnitude of '${origin?.id ?? 'the object'}' cannot be computed at r = ${r.toFixed(3)} AU, Δ = ${delta.toFixed(3)} AU, phase angle ${phaseAngleDeg.toFixed(1)}°`, {
      place: { ...(origin?.file ? { file: origin.file } : {}), field: 'magnitude' },
      actual: value,
      expected: 'magnitude parameters that give a finite magnitude (H–G: 0 ≤ G ≤ 1; comets: finite M1 and K1)',
    });
  }
  if (model.model === 'hg') return { value };
  if (model.K1Alternative === undefined && model.uncertaintyMag === undefined) return { value };
  let brightest = value;
  let faintest = value;
  if (model.K1Alternative !== undefined) {
    const alt = cometMagnitude(model.M1, model.K1Alternative, r, delta);
    brightest = Math.min(brightest, alt);
    faintest = Math.max(faintest, alt);
  }
  if (model.uncertaintyMag !== undefined) {
    brightest -= model.uncertaintyMag;
    faintest += model.uncertaintyMag;
  }
  return { value, brightest, faintest };
}
