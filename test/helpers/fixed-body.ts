/**
 * A test body at a fixed place among the stars with a fixed magnitude, for behaviour tests of
 * the visibility model ("a magnitude-6 comet 60° from the full Moon"). It is test scaffolding,
 * not reference data: the checks it serves compare against common practice, not its output.
 */
import * as Astronomy from 'astronomy-engine';
import type { Body } from '../../lib/core/body.ts';

export function fixedBody(options: { id?: string; raHours: number; decDeg: number; magnitude: number; comaDiameterArcmin?: number }): Body {
  const r = Math.PI / 180;
  const a = options.raHours * 15 * r;
  const d = options.decDeg * r;
  const distanceAu = 1;
  return {
    id: options.id ?? 'fixed',
    name: 'Test object',
    kind: 'comet',
    radiusKm: 0,
    ...(options.comaDiameterArcmin ? { comaDiameterArcmin: options.comaDiameterArcmin } : {}),
    geoVector: (time) => new Astronomy.Vector(distanceAu * Math.cos(d) * Math.cos(a), distanceAu * Math.cos(d) * Math.sin(a), distanceAu * Math.sin(d), time),
    illumination: () => ({ heliocentricDistanceAu: 1, geocentricDistanceAu: distanceAu, phaseAngleDeg: 0, illuminatedFraction: 1, magnitude: { value: options.magnitude } }),
  };
}

/** RA/Dec (J2000) of the point `separationDeg` from a body at `time`, towards the celestial pole that keeps it high. */
export function offsetFrom(vector: Astronomy.Vector, separationDeg: number, towardsNorth: boolean): { raHours: number; decDeg: number } {
  const eq = Astronomy.EquatorFromVector(vector);
  const dec = eq.dec + (towardsNorth ? separationDeg : -separationDeg);
  return dec > 90 || dec < -90 ? { raHours: (eq.ra + 12) % 24, decDeg: Math.sign(dec) * 180 - dec } : { raHours: eq.ra, decDeg: dec };
}
