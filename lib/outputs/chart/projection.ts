/**
 * The chart projection: a stereographic projection of the observer's sky (altitude, azimuth)
 * centred on the direction the reader faces.
 *
 * Why stereographic: it is conformal (angles and small shapes are kept everywhere), so a star
 * pattern keeps its recognisable shape even near the edges of a 90°-wide field, and circles on
 * the sky stay circles on the chart. Scale grows away from the centre (×1.17 at 45°, ×2 at 90°).
 *
 * Formulas: Snyder, J. P. (1987), "Map Projections — A Working Manual", USGS Professional Paper
 * 1395, §21 (oblique stereographic on the sphere): forward eqs. 21-2 to 21-4, inverse eqs.
 * 20-14, 20-15, 21-15. Latitude φ is altitude, longitude λ is azimuth.
 *
 * Orientation, as seen by an observer standing inside the sphere and facing the centre with the
 * head toward the zenith: `x` grows to the right (toward increasing azimuth: facing south, west
 * is on the right), `y` grows upward (toward the zenith). Both are in units of the sphere's radius
 * (a point at angular distance c from the centre lies at ρ = 2 tan(c/2)). Drawing code scales
 * them and flips `y` for SVG.
 */

const RAD = Math.PI / 180;

/** A direction in the observer's horizontal frame, degrees (azimuth from north through east, 0–360). */
export interface AltAz {
  altitudeDeg: number;
  azimuthDeg: number;
}

/** A projected point, in units of the sphere's radius; `x` right, `y` up (see the module note). */
export interface PlanePoint {
  x: number;
  y: number;
}

/** A stereographic projection centred on one direction of the sky. */
export interface Stereographic {
  readonly centre: AltAz;
  /** Projects a direction; null for the antipode of the centre (ρ would be infinite). */
  project(altitudeDeg: number, azimuthDeg: number): PlanePoint | null;
  /** The direction a plane point comes from (the inverse projection). */
  unproject(x: number, y: number): AltAz;
  /** Angular distance of a direction from the centre, degrees. */
  distanceFromCentreDeg(altitudeDeg: number, azimuthDeg: number): number;
}

/** ρ on the plane (sphere radii) of a point at angular distance `angleDeg` from the centre: 2 tan(c/2) (Snyder eq. 21-1 with k0 = 1). */
export function stereographicRadius(angleDeg: number): number {
  return 2 * Math.tan((angleDeg * RAD) / 2);
}

/** The angular distance from the centre, degrees, of a point at `rho` sphere radii (Snyder eq. 21-15: c = 2 arctan(ρ/2)). */
export function angleFromRadius(rho: number): number {
  return (2 * Math.atan(rho / 2)) / RAD;
}

/**
 * A stereographic projection centred on `centre` (altitude φ1, azimuth λ0), k0 = 1.
 *
 * Forward (Snyder eqs. 21-2 to 21-4): k = 2 / (1 + sin φ1 sin φ + cos φ1 cos φ cos(λ − λ0));
 * x = k cos φ sin(λ − λ0); y = k (cos φ1 sin φ − sin φ1 cos φ cos(λ − λ0)).
 * Inverse (eqs. 20-14, 20-15, 21-15): ρ = √(x² + y²), c = 2 arctan(ρ/2);
 * φ = asin(cos c sin φ1 + y sin c cos φ1 / ρ); λ = λ0 + atan2(x sin c, ρ cos φ1 cos c − y sin φ1 sin c).
 */
export function stereographic(centre: AltAz): Stereographic {
  const phi1 = centre.altitudeDeg * RAD;
  const lambda0 = centre.azimuthDeg * RAD;
  const sinPhi1 = Math.sin(phi1);
  const cosPhi1 = Math.cos(phi1);
  return {
    centre: { altitudeDeg: centre.altitudeDeg, azimuthDeg: centre.azimuthDeg },
    project(altitudeDeg, azimuthDeg) {
      const phi = altitudeDeg * RAD;
      const dl = azimuthDeg * RAD - lambda0;
      const sinPhi = Math.sin(phi);
      const cosPhi = Math.cos(phi);
      const cosDl = Math.cos(dl);
      const denominator = 1 + sinPhi1 * sinPhi + cosPhi1 * cosPhi * cosDl;
      if (denominator < 1e-12) return null;
      const k = 2 / denominator;
      return { x: k * cosPhi * Math.sin(dl), y: k * (cosPhi1 * sinPhi - sinPhi1 * cosPhi * cosDl) };
    },
    unproject(x, y) {
      const rho = Math.hypot(x, y);
      if (rho < 1e-15) return { altitudeDeg: centre.altitudeDeg, azimuthDeg: ((centre.azimuthDeg % 360) + 360) % 360 };
      const c = 2 * Math.atan(rho / 2);
      const sinC = Math.sin(c);
      const cosC = Math.cos(c);
      const phi = Math.asin(Math.max(-1, Math.min(1, cosC * sinPhi1 + (y * sinC * cosPhi1) / rho)));
      const lambda = lambda0 + Math.atan2(x * sinC, rho * cosPhi1 * cosC - y * sinPhi1 * sinC);
      return { altitudeDeg: phi / RAD, azimuthDeg: ((lambda / RAD) % 360 + 360) % 360 };
    },
    distanceFromCentreDeg(altitudeDeg, azimuthDeg) {
      const phi = altitudeDeg * RAD;
      const dl = azimuthDeg * RAD - lambda0;
      const cosC = sinPhi1 * Math.sin(phi) + cosPhi1 * Math.cos(phi) * Math.cos(dl);
      return Math.acos(Math.max(-1, Math.min(1, cosC))) / RAD;
    },
  };
}

/** How sky directions map to chart units and back. */
export interface ChartLayout {
  /** Chart position (user units, y down) of a direction, or null when it cannot be projected. */
  toChart(altitudeDeg: number, azimuthDeg: number): { x: number; y: number } | null;
  /** The direction drawn at a chart position. */
  fromChart(x: number, y: number): AltAz;
  projection: Stereographic;
  /** User units per sphere radius of the stereographic plane. */
  scale: number;
}

/**
 * A chart layout: the stereographic projection centred on `centre`, scaled by `scale` user units
 * per sphere radius, with the centre drawn at (`cx`, `cy`) and y growing downwards.
 */
export function makeLayout(centre: AltAz, scale: number, cx: number, cy: number): ChartLayout {
  const projection = stereographic(centre);
  return {
    projection,
    scale,
    toChart(altitudeDeg, azimuthDeg) {
      const p = projection.project(altitudeDeg, azimuthDeg);
      return p ? { x: cx + scale * p.x, y: cy - scale * p.y } : null;
    },
    fromChart(x, y) {
      return projection.unproject((x - cx) / scale, (cy - y) / scale);
    },
  };
}
