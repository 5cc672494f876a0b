/**
 * Two-body (Keplerian) motion about the Sun for every conic: ellipse, parabola and hyperbola,
 * with one formulation and no branch at e = 1.
 *
 * Method: universal variables with Stumpff functions (Stumpff 1959; Danby, *Fundamentals of
 * Celestial Mechanics*, 2nd ed., §6.9–6.10; Battin, *An Introduction to the Mathematics and
 * Methods of Astrodynamics*, ch. 4). Starting at perihelion (r₀ = q, radial velocity 0,
 * speed v_q = √(μ(1 + e)/q)), with β = μ(1 − e)/q (= μ/a; positive for ellipses, zero for
 * parabolas, negative for hyperbolas) and x = β s², the universal anomaly s solves
 *
 *     t − T = q s c₁(x) + μ s³ c₃(x)                      (universal Kepler equation)
 *
 * and the position in the orbital plane (x axis towards perihelion) is
 *
 *     X = q − μ s² c₂(x),   Y = v_q q s c₁(x),   r = q c₀(x) + μ s² c₂(x).
 *
 * None of these divides by 1 − e or by a, so precision does not degrade near e = 1. The
 * equation is solved by the Laguerre–Conway iteration (Conway 1986, Celestial Mechanics 39:199)
 * kept inside a bracket (F is monotonic: dF/ds = r ≥ q > 0).
 *
 * Units: AU and days; μ = k² with the Gaussian gravitational constant k = 0.01720209895
 * (IAU 1976 system; Meeus, *Astronomical Algorithms* 2nd ed., ch. 33–35). Angles in degrees at
 * the interface. Elements refer to the J2000 ecliptic and equinox; `orbitFrame` rotates to the
 * J2000 mean equator (EQJ) with astronomy-engine's `Rotation_ECL_EQJ`.
 */
import * as Astronomy from 'astronomy-engine';

/** Gaussian gravitational constant k, AU^{3/2} day⁻¹ (solar mass units). */
export const GAUSSIAN_K = 0.01720209895;
/** Heliocentric gravitational parameter μ = k², AU³ day⁻². */
export const GM_SUN_AU3_PER_DAY2 = GAUSSIAN_K * GAUSSIAN_K;

const DEG = Math.PI / 180;

/** Stumpff functions c₀…c₃ of x (Stumpff 1959; Danby §6.9), written into `out`. */
export function stumpff(x: number, out: [number, number, number, number] = [0, 0, 0, 0]): [number, number, number, number] {
  let c2: number;
  let c3: number;
  if (Math.abs(x) < 1) {
    // Series c₂ = Σ (−x)^k/(2k+2)!, c₃ = Σ (−x)^k/(2k+3)!; 11 terms reach 1e-22 for |x| < 1.
    c2 = 0;
    c3 = 0;
    let t2 = 1 / 2;
    let t3 = 1 / 6;
    for (let k = 0; k < 11; k++) {
      c2 += t2;
      c3 += t3;
      t2 *= -x / ((2 * k + 3) * (2 * k + 4));
      t3 *= -x / ((2 * k + 4) * (2 * k + 5));
    }
    out[0] = 1 - x * c2;
    out[1] = 1 - x * c3;
  } else if (x > 0) {
    const sx = Math.sqrt(x);
    out[0] = Math.cos(sx);
    out[1] = Math.sin(sx) / sx;
    c2 = (1 - out[0]) / x;
    c3 = (1 - out[1]) / x;
  } else {
    const sx = Math.sqrt(-x);
    out[0] = Math.cosh(sx);
    out[1] = Math.sinh(sx) / sx;
    c2 = (1 - out[0]) / x;
    c3 = (1 - out[1]) / x;
  }
  out[2] = c2;
  out[3] = c3;
  return out;
}

/** A position in the orbital plane: x axis towards perihelion, y axis in the direction of motion. */
export interface PlanePosition {
  /** Coordinate towards perihelion, AU. */
  xAu: number;
  /** Coordinate 90° ahead of perihelion in the direction of motion, AU. */
  yAu: number;
  /** Heliocentric distance r, AU. */
  radiusAu: number;
  /** True anomaly ν, degrees in (−180, 180]. */
  trueAnomalyDeg: number;
}

const scratch: [number, number, number, number] = [0, 0, 0, 0];

/**
 * Solves the universal Kepler equation and returns the position in the orbital plane.
 *
 * @param perihelionDistanceAu q, AU (> 0)
 * @param eccentricity e (≥ 0; any conic)
 * @param daysFromPerihelion t − T, days (TT)
 *
 * Source: universal-variable formulation (Danby 1988 §6.9; Battin 1987 ch. 4), Laguerre–Conway
 * solver (Conway 1986). Checked against Meeus, *Astronomical Algorithms* 2nd ed., ch. 30, 34, 35.
 */
export function conicPosition(perihelionDistanceAu: number, eccentricity: number, daysFromPerihelion: number): PlanePosition {
  const q = perihelionDistanceAu;
  const e = eccentricity;
  const mu = GM_SUN_AU3_PER_DAY2;
  const beta = (mu * (1 - e)) / q;
  let dt = daysFromPerihelion;

  // Whole revolutions of an ellipse are removed first (continuous as e → 1⁻: the period → ∞).
  let sMaxOrbit = Infinity;
  if (beta > 0) {
    const sqrtBeta = Math.sqrt(beta);
    const periodDays = (2 * Math.PI * mu) / (beta * sqrtBeta);
    dt -= periodDays * Math.round(dt / periodDays);
    sMaxOrbit = Math.PI / sqrtBeta; // eccentric anomaly E = √β s reaches π at half a period
  }

  const sign = dt < 0 ? -1 : 1;
  const target = Math.abs(dt);
  const s = target === 0 ? 0 : solveUniversal(q, e, beta, target, sMaxOrbit);
  const signed = sign * s;
  const c = stumpff(beta * signed * signed, scratch);
  const s2 = signed * signed;
  const xAu = q - mu * s2 * c[2];
  const yAu = Math.sqrt(mu * q * (1 + e)) * signed * c[1];
  const radiusAu = q * c[0] + mu * s2 * c[2];
  return { xAu, yAu, radiusAu, trueAnomalyDeg: Math.atan2(yAu, xAu) / DEG };
}

/** The universal anomaly s ≥ 0 with F(s) = q s c₁ + μ s³ c₃ = dt (dt > 0). */
function solveUniversal(q: number, e: number, beta: number, dt: number, sMaxOrbit: number): number {
  const mu = GM_SUN_AU3_PER_DAY2;
  // Bracket: F(0) = 0 and F'(s) = r ≥ q, so s ≤ dt/q; for ellipses also s ≤ π/√β; for
  // hyperbolas e sinh H − H ≥ (e − 1) sinh H gives H ≤ asinh(M/(e − 1)), with H = √(−β) s.
  let lo = 0;
  let hi = Math.min(dt / q, sMaxOrbit);
  if (beta < 0) {
    const sqrtMinusBeta = Math.sqrt(-beta);
    const meanAnomaly = ((-beta * sqrtMinusBeta) / mu) * dt;
    hi = Math.min(hi, Math.asinh(meanAnomaly / (e - 1)) / sqrtMinusBeta);
  }

  // Starting value: Barker's equation (exact for e = 1), W = 3k/√2 · dt/q^{3/2}
  // (Meeus 2nd ed. ch. 34); replaced by a Kepler-equation starter when far from parabolic.
  const w = ((3 * GAUSSIAN_K) / Math.SQRT2) * (dt / (q * Math.sqrt(q)));
  const g = w / 2;
  const y = Math.cbrt(g + Math.sqrt(g * g + 1));
  const sigma = y - 1 / y; // tan(ν/2) of the parabola
  let s = sigma * Math.sqrt((2 * q) / mu);
  if (Math.abs(beta * s * s) > 1) {
    if (beta > 0) {
      // Danby's starter E₀ = M + 0.85 e for 0 ≤ M ≤ π.
      const sqrtBeta = Math.sqrt(beta);
      const meanAnomaly = ((beta * sqrtBeta) / mu) * dt;
      s = (meanAnomaly + 0.85 * e) / sqrtBeta;
    } else if (beta < 0) {
      // Hyperbolic starter H₀ = ln(2M/e + 1.8) (Danby §6.10).
      const sqrtMinusBeta = Math.sqrt(-beta);
      const meanAnomaly = ((-beta * sqrtMinusBeta) / mu) * dt;
      s = Math.log((2 * meanAnomaly) / e + 1.8) / sqrtMinusBeta;
    }
  }
  if (!(s > lo && s < hi)) s = 0.5 * (lo + hi);

  const n = 5; // Laguerre–Conway order
  for (let iter = 0; iter < 60; iter++) {
    const s2 = s * s;
    const c = stumpff(beta * s2, scratch);
    const f = q * s * c[1] + mu * s2 * s * c[3] - dt;
    if (f === 0) return s;
    if (!(f < 0)) hi = s; // f > 0, or overflow (NaN) far beyond the root
    else lo = s;
    const f1 = q * c[0] + mu * s2 * c[2]; // r
    const f2 = mu * e * s * c[1]; // dr/ds
    const disc = Math.sqrt(Math.abs((n - 1) * (n - 1) * f1 * f1 - n * (n - 1) * f * f2));
    let next = s - (n * f) / (f1 + disc);
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi); // keep inside the bracket
    const step = Math.abs(next - s);
    s = next;
    if (step <= 2e-16 * s || hi - lo <= 2e-16 * hi) return s;
  }
  return s;
}

/** Heliocentric Cartesian coordinates, AU. */
export interface Xyz {
  x: number;
  y: number;
  z: number;
}

/** Orbital elements of one conic, J2000 ecliptic and equinox. */
export interface ConicElements {
  /** q, AU. */
  perihelionDistanceAu: number;
  /** e. */
  eccentricity: number;
  /** i, degrees. */
  inclinationDeg: number;
  /** Ω, longitude of the ascending node, degrees. */
  ascendingNodeDeg: number;
  /** ω, argument of perihelion, degrees. */
  argumentOfPerihelionDeg: number;
  /** T, time of perihelion, days since J2000.0 (2000-01-01 12:00 TT), TT. */
  perihelionTimeTt: number;
}

/** A compiled orbit: fast heliocentric positions at any TT. */
export interface Orbit {
  readonly elements: ConicElements;
  /** Heliocentric position, J2000 ecliptic, AU, at `tt` (days since J2000.0, TT). */
  eclipticAu(tt: number): Xyz;
  /** Heliocentric position, J2000 mean equator (EQJ), AU, at `tt` (days since J2000.0, TT). */
  equatorialAu(tt: number): Xyz;
  /** Distance r from the Sun, AU, and true anomaly ν, degrees, at `tt`. */
  plane(tt: number): PlanePosition;
}

/**
 * Builds an orbit from elements. Orientation: the Gaussian vectors P (towards perihelion) and
 * Q (90° ahead) from i, Ω, ω (Meeus 2nd ed. eq. 33.7 in the ecliptic form; Danby §6.2), then
 * astronomy-engine's `Rotation_ECL_EQJ` (obliquity of J2000) to the equatorial frame.
 */
export function makeOrbit(elements: ConicElements): Orbit {
  const i = elements.inclinationDeg * DEG;
  const node = elements.ascendingNodeDeg * DEG;
  const w = elements.argumentOfPerihelionDeg * DEG;
  const [si, ci] = [Math.sin(i), Math.cos(i)];
  const [sn, cn] = [Math.sin(node), Math.cos(node)];
  const [sw, cw] = [Math.sin(w), Math.cos(w)];
  const pEcl: Xyz = { x: cw * cn - sw * sn * ci, y: cw * sn + sw * cn * ci, z: sw * si };
  const qEcl: Xyz = { x: -sw * cn - cw * sn * ci, y: -sw * sn + cw * cn * ci, z: cw * si };
  const rotation = Astronomy.Rotation_ECL_EQJ();
  const epoch = new Astronomy.AstroTime(0);
  const toEqj = (v: Xyz): Xyz => {
    const r = Astronomy.RotateVector(rotation, new Astronomy.Vector(v.x, v.y, v.z, epoch));
    return { x: r.x, y: r.y, z: r.z };
  };
  const pEqj = toEqj(pEcl);
  const qEqj = toEqj(qEcl);
  const { perihelionDistanceAu: q, eccentricity: e, perihelionTimeTt: T } = elements;

  const combine = (p: Xyz, qv: Xyz, tt: number): Xyz => {
    const pos = conicPosition(q, e, tt - T);
    return {
      x: pos.xAu * p.x + pos.yAu * qv.x,
      y: pos.xAu * p.y + pos.yAu * qv.y,
      z: pos.xAu * p.z + pos.yAu * qv.z,
    };
  };
  return {
    elements: { ...elements },
    eclipticAu: (tt) => combine(pEcl, qEcl, tt),
    equatorialAu: (tt) => combine(pEqj, qEqj, tt),
    plane: (tt) => conicPosition(q, e, tt - T),
  };
}
