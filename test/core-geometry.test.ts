/**
 * The one geometry module (lib/core/geometry.ts) against astronomy-engine's own horizontal
 * coordinates and rotations (an independent implementation of the same transformations), and the
 * sidereal day against its published length.
 */
import * as Astronomy from 'astronomy-engine';
import { describe, expect, it } from 'vitest';
import { SIDEREAL_DAY_DAYS, SkyFrame, altitudeOfHor, apparentAltitudeDeg, azimuthOfHor, offsetInSky, unitFromRaDec } from '../lib/core/geometry.ts';
import { ARCSEC, angleDiffDeg, expectWithin } from './helpers/tolerance.ts';
import { seededRandom } from './helpers/random.ts';

describe('geometry', () => {
  it('a sidereal day is 86 164.0905 s (the usually quoted mean sidereal day; from memory), to 1 ms', () => {
    expectWithin(SIDEREAL_DAY_DAYS * 86_400, 86_164.0905, 0.001, 'sidereal day, s');
  });

  it('SkyFrame gives the altitude and azimuth of astronomy-engine Horizon (with and without refraction) to 0.001″', () => {
    const random = seededRandom(11);
    for (let i = 0; i < 200; i++) {
      const observer = { latitudeDeg: -89 + 178 * random(), longitudeDeg: -180 + 360 * random(), elevationM: 0 };
      const time = Astronomy.MakeTime(new Date(Date.UTC(1950, 0, 1) + random() * 100 * 365.25 * 86_400_000));
      const raHours = 24 * random();
      const decDeg = -89 + 178 * random();
      const frame = new SkyFrame(observer, time);
      const hor = frame.horFromEqd(...unitFromRaDec(raHours * 15, decDeg));
      const site = new Astronomy.Observer(observer.latitudeDeg, observer.longitudeDeg, 0);
      const plain = Astronomy.Horizon(time, site, raHours, decDeg);
      const refracted = Astronomy.Horizon(time, site, raHours, decDeg, 'normal');
      expectWithin(altitudeOfHor(hor), plain.altitude, 0.001 * ARCSEC, 'geometric altitude');
      expectWithin(apparentAltitudeDeg(altitudeOfHor(hor)), refracted.altitude, 0.001 * ARCSEC, 'apparent altitude');
      // Azimuth on the sky: the difference shrinks with the cosine of the altitude.
      expectWithin(angleDiffDeg(azimuthOfHor(hor), plain.azimuth) * Math.cos((plain.altitude * Math.PI) / 180), 0, 0.001 * ARCSEC, 'azimuth');
    }
  });

  it('J2000 directions go through astronomy-engine precession–nutation (Rotation_EQJ_EQD) before the horizon', () => {
    const observer = { latitudeDeg: 51.48, longitudeDeg: 0, elevationM: 0 };
    const time = Astronomy.MakeTime(new Date('2026-12-07T19:00:00Z'));
    const eqj = unitFromRaDec(101.287, -16.716); // Sirius, J2000 (Hipparcos)
    const eqd = Astronomy.RotateVector(Astronomy.Rotation_EQJ_EQD(time), new Astronomy.Vector(eqj[0], eqj[1], eqj[2], time));
    const eq = Astronomy.EquatorFromVector(eqd);
    const ref = Astronomy.Horizon(time, new Astronomy.Observer(51.48, 0, 0), eq.ra, eq.dec);
    const hor = new SkyFrame(observer, time).horFromEqj(...eqj);
    expectWithin(altitudeOfHor(hor), ref.altitude, 0.001 * ARCSEC, 'altitude');
    expectWithin(azimuthOfHor(hor), ref.azimuth, 0.001 * ARCSEC, 'azimuth');
  });

  it('offsetInSky: a point straight above is "above" at 0°, one to the east of a southern target is "left"', () => {
    expect(offsetInSky({ fromAltitudeDeg: 30, fromAzimuthDeg: 180, toAltitudeDeg: 35, toAzimuthDeg: 180 })).toMatchObject({ offsetDirection: 'above', positionAngleDeg: 0 });
    const left = offsetInSky({ fromAltitudeDeg: 30, fromAzimuthDeg: 180, toAltitudeDeg: 30, toAzimuthDeg: 170 });
    expect(left.offsetDirection).toBe('left');
    // Spherical law of cosines for two points at altitude 30°, 10° of azimuth apart: cos s = sin²h + cos²h cos ΔA.
    const h = Math.PI / 6;
    expectWithin(left.separationDeg, (Math.acos(Math.sin(h) ** 2 + Math.cos(h) ** 2 * Math.cos(Math.PI / 18)) * 180) / Math.PI, 1e-9, 'separation');
  });
});
