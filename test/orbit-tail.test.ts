/**
 * The comet tail's direction in the observer's sky. Two outside facts are used: (1) the anti-solar
 * direction projected on the sky is exactly opposite the direction towards the Sun along the great
 * circle through the comet and the Sun (the projected Sun–comet radius vector lies in that plane;
 * Meeus 2nd ed. ch. 48, bright-limb angle); (2) for a short tail, the sky angle equals the angle of
 * the small alt/az offset (Δaz·cos h to the right, Δh up) computed with astronomy-engine's Horizon.
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { loadBodies } from '../lib/models/content.ts';
import { defineSite } from '../lib/core/site.ts';
import { isSmallBody } from '../lib/models/orbit/body.ts';
import { tailInSky } from '../lib/models/orbit/tail.ts';
import { tailPointGeoVector } from '../lib/models/orbit/body.ts';
import { angleDiffDeg } from './helpers/tolerance.ts';

const RAD = Math.PI / 180;
const comet = loadBodies(new URL('../content/objects', import.meta.url).pathname).get('comet-lumen');

function horizon(site: ReturnType<typeof defineSite>, time: Astronomy.AstroTime, geo: Astronomy.Vector, refraction = 'normal') {
  const obs = Astronomy.ObserverVector(time, site.observer, false);
  const topo = new Astronomy.Vector(geo.x - obs.x, geo.y - obs.y, geo.z - obs.z, time);
  const d = Astronomy.EquatorFromVector(Astronomy.RotateVector(Astronomy.Rotation_EQJ_EQD(time), topo));
  return Astronomy.Horizon(time, site.observer, d.ra, d.dec, refraction);
}

/** Initial great-circle bearing from a to b in the alt/az frame, degrees clockwise from up (towards increasing azimuth). */
function bearing(a: { altitude: number; azimuth: number }, b: { altitude: number; azimuth: number }): number {
  const h1 = a.altitude * RAD, h2 = b.altitude * RAD, dA = (b.azimuth - a.azimuth) * RAD;
  const y = Math.sin(dA) * Math.cos(h2);
  const x = Math.cos(h1) * Math.sin(h2) - Math.sin(h1) * Math.cos(h2) * Math.cos(dA);
  return ((Math.atan2(y, x) / RAD) + 360) % 360;
}

describe('comet tail in the observer\'s sky', () => {
  const sites = [
    defineSite({ id: 'north', latitude: 50, longitude: 8, timeZone: 'Europe/Berlin' }),
    defineSite({ id: 'south', latitude: -34, longitude: 18.4, timeZone: 'Africa/Johannesburg' }),
  ];
  const times = ['2026-12-10T17:00:00Z', '2027-01-05T18:30:00Z', '2027-01-20T19:00:00Z', '2027-02-10T17:30:00Z'];
  it('is a small body', () => expect(isSmallBody(comet)).toBe(true));
  for (const site of sites) {
    for (const iso of times) {
      it(`${site.id} ${iso}: opposite the Sun and equal to the alt/az offset of a short tail`, () => {
        if (!isSmallBody(comet)) throw new Error('not a small body');
        const time = Astronomy.MakeTime(new Date(iso));
        const tail = tailInSky(site, comet, time);
        // (1) in airless coordinates (refraction bends great circles near the horizon; the tail's
        // sky angle itself is refracted, which moves it by a few tenths of a degree at most).
        const headAirless = horizon(site, time, comet.geoVector(time, { aberration: true }), '');
        const sun = horizon(site, time, Astronomy.GeoVector(Astronomy.Body.Sun, time, true), '');
        expect(angleDiffDeg(tail.skyAngleDeg, bearing(headAirless, sun) + 180)).toBeLessThan(1);
        const head = horizon(site, time, comet.geoVector(time, { aberration: true }));
        const tip = horizon(site, time, tailPointGeoVector(comet, time, { lengthAu: 0.001 }));
        const small = Math.atan2((((tip.azimuth - head.azimuth + 540) % 360) - 180) * Math.cos(head.altitude * RAD), tip.altitude - head.altitude) / RAD;
        expect(angleDiffDeg(tail.skyAngleDeg, small)).toBeLessThan(1);
      });
    }
  }
});
