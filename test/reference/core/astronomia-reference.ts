/**
 * Reference values computed with `astronomia` 4.2 (npm), an independent implementation of
 * Meeus, *Astronomical Algorithms* (2nd ed.): full VSOP87B planets (ch. 32–33), the Sun from
 * VSOP87 (ch. 25), the Moon from the ch. 47 series, nutation (ch. 22), sidereal time (ch. 12),
 * parallax (ch. 40), rising and setting (ch. 15) and the 1984 Astronomical Almanac planet
 * magnitudes (ch. 41). See README.md beside this file.
 *
 * Only ΔT is shared with the library under test: instants are converted from UT to TT with
 * `astronomy-engine`'s ΔT model, so that position differences measure the theories, not two
 * ΔT extrapolations (the two models differ by up to several seconds after 2025; `deltaTModels`
 * reports both).
 */
import * as Astronomy from 'astronomy-engine';
import { Planet, toFK5 } from 'astronomia/planetposition';
import data from 'astronomia/data';
import { position as planetApparent } from 'astronomia/elliptic';
import { apparentEquatorialVSOP87 } from 'astronomia/solar';
import { position as moonPosition, parallax as moonParallax } from 'astronomia/moonposition';
import { nutation, meanObliquity } from 'astronomia/nutation';
import { Ecliptic, Equatorial } from 'astronomia/coord';
import { apparent as apparentSiderealSeconds } from 'astronomia/sidereal';
import { Ellipsoid } from 'astronomia/globe';
import { topocentric } from 'astronomia/parallax';
import * as illum from 'astronomia/illum';
import { ring, ub } from 'astronomia/saturnring';
import { position as precess } from 'astronomia/precess';
import { deltaT } from 'astronomia/deltat';

const RAD = Math.PI / 180;
const ARCMIN_RAD = RAD / 60;
const ARCSEC_RAD = RAD / 3600;
/** Light time for 1 AU, days (Meeus 33.3: τ = 0.0057755183 Δ). */
const LIGHT_DAYS_PER_AU = 0.0057755183;
/** IAU 2012 astronomical unit, km. */
const KM_PER_AU = 149_597_870.7;
/** Standard horizontal refraction at rise and set, 34′ (Meeus ch. 15; USNO). */
const REFRACTION_RAD = 34 * ARCMIN_RAD;
/** Sun's semidiameter at 1 AU, 959.63″ (Meeus ch. 55, after the Astronomical Almanac). */
const SUN_SEMIDIAMETER_1AU_RAD = 959.63 * ARCSEC_RAD;
/** Solar equatorial horizontal parallax at 1 AU, 8.794″ (Meeus 40.1). */
const SOLAR_PARALLAX_1AU_RAD = 8.794 * ARCSEC_RAD;
/** Equatorial radii, km (IAU WGCCRE 2015, Archinal et al. 2018), for the planets' semidiameters. */
const PLANET_RADIUS_KM: Record<string, number> = {
  mercury: 2440.53, venus: 6051.8, mars: 3396.19, jupiter: 71_492, saturn: 60_268, uranus: 25_559, neptune: 24_764,
};
/** WGS 84 ellipsoid (equatorial radius km, flattening). */
const WGS84 = new Ellipsoid(6378.137, 1 / 298.257223563);

export type RefBodyId = 'sun' | 'moon' | 'mercury' | 'venus' | 'mars' | 'jupiter' | 'saturn' | 'uranus' | 'neptune';
export const REF_PLANETS = ['mercury', 'venus', 'mars', 'jupiter', 'saturn', 'uranus', 'neptune'] as const;
export const REF_BODIES: readonly RefBodyId[] = ['sun', 'moon', ...REF_PLANETS];

const earth = new Planet(data.vsop87Bearth);
const planets: Record<string, Planet> = Object.fromEntries(
  REF_PLANETS.map((id) => [id, new Planet(data[`vsop87B${id}`])]),
);

export interface RefSite {
  latitudeDeg: number;
  longitudeDeg: number;
  elevationM: number;
}

/** Julian day (UT) of a `Date`. */
export function jdUtOf(date: Date): number {
  return date.getTime() / 86_400_000 + 2_440_587.5;
}

/** `Date` of a Julian day (UT). */
export function dateOfJd(jdUt: number): Date {
  return new Date(Math.round((jdUt - 2_440_587.5) * 86_400_000));
}

/** ΔT = TT − UT in seconds from `astronomy-engine`'s model (the one the library uses). */
export function deltaTSeconds(jdUt: number): number {
  const t = Astronomy.MakeTime(dateOfJd(jdUt));
  return (t.tt - t.ut) * 86_400;
}

/** Both ΔT models at a date, seconds: astronomy-engine's and astronomia's. */
export function deltaTModels(jdUt: number): { engine: number; astronomia: number } {
  const year = 2000 + (jdUt - 2_451_545) / 365.25;
  return { engine: deltaTSeconds(jdUt), astronomia: deltaT(year) };
}

function jdeOf(jdUt: number): number {
  return jdUt + deltaTSeconds(jdUt) / 86_400;
}

function rect(c: { lon: number; lat: number; range: number }): [number, number, number] {
  return [c.range * Math.cos(c.lat) * Math.cos(c.lon), c.range * Math.cos(c.lat) * Math.sin(c.lon), c.range * Math.sin(c.lat)];
}

/** Light-time corrected geometry of a planet: heliocentric r, geocentric Δ, Earth–Sun R (AU). */
export function planetGeometry(id: string, jde: number): { r: number; delta: number; R: number } {
  const planet = planets[id]!;
  const e = rect(earth.position(jde));
  let tau = 0;
  let p: [number, number, number] = [0, 0, 0];
  let r = 0;
  for (let i = 0; i < 3; i++) {
    const c = planet.position(jde - tau);
    r = c.range;
    p = rect(c);
    tau = LIGHT_DAYS_PER_AU * Math.hypot(p[0] - e[0], p[1] - e[1], p[2] - e[2]);
  }
  return { r, delta: Math.hypot(p[0] - e[0], p[1] - e[1], p[2] - e[2]), R: earth.position(jde).range };
}

/** Geocentric apparent RA/Dec (true equator and equinox of date), radians, and distance, AU. */
export function apparentGeocentric(id: RefBodyId, jde: number): { ra: number; dec: number; range: number } {
  if (id === 'sun') return apparentEquatorialVSOP87(earth, jde);
  if (id === 'moon') {
    const m = moonPosition(jde);
    const [dpsi, deps] = nutation(jde);
    // Meeus ch. 47: apparent λ = λ + Δψ, referred to the true obliquity ε0 + Δε.
    const eq = new Ecliptic(m.lon + dpsi, m.lat).toEquatorial(meanObliquity(jde) + deps);
    return { ra: eq.ra, dec: eq.dec, range: m.range / KM_PER_AU };
  }
  const eq = planetApparent(planets[id]!, earth, jde);
  return { ra: eq.ra, dec: eq.dec, range: planetGeometry(id, jde).delta };
}

/** Topocentric apparent RA/Dec (equator of date), radians, for a site at `jdUt` (Meeus 40.2–40.3). */
export function apparentTopocentric(id: RefBodyId, site: RefSite, jdUt: number): { ra: number; dec: number } {
  const geo = apparentGeocentric(id, jdeOf(jdUt));
  const [rs, rc] = WGS84.parallaxConstants(site.latitudeDeg * RAD, site.elevationM);
  return topocentric(geo, rs, rc, -site.longitudeDeg * RAD, jdUt);
}

/**
 * Geocentric astrometric RA/Dec on the J2000 mean equator, radians: the planet where it was when
 * the light left it (Meeus 33.3) minus the Earth now, from VSOP87B (ecliptic J2000), FK5 correction
 * (Meeus 32.3), J2000 obliquity. The Moon: ch. 47 mean-of-date position precessed to J2000 (ch. 21).
 */
export function astrometricJ2000(id: RefBodyId, jdUt: number): { ra: number; dec: number } {
  const jde = jdeOf(jdUt);
  const eps0 = meanObliquity(2_451_545.0);
  if (id === 'moon') {
    const m = moonPosition(jde);
    const ofDate = new Ecliptic(m.lon, m.lat).toEquatorial(meanObliquity(jde));
    const epoch = 2000 + (jde - 2_451_545) / 365.25;
    const p = precess(new Equatorial(ofDate.ra, ofDate.dec), epoch, 2000, 0, 0);
    return { ra: p.ra, dec: p.dec };
  }
  const e = rect(earth.position2000(jde));
  let v: [number, number, number] = [-e[0], -e[1], -e[2]];
  if (id !== 'sun') {
    let tau = 0;
    for (let i = 0; i < 3; i++) {
      const p = rect(planets[id]!.position2000(jde - tau));
      v = [p[0] - e[0], p[1] - e[1], p[2] - e[2]];
      tau = LIGHT_DAYS_PER_AU * Math.hypot(...v);
    }
  }
  const fk5 = toFK5(Math.atan2(v[1], v[0]), Math.atan2(v[2], Math.hypot(v[0], v[1])), 2_451_545.0);
  return new Ecliptic(fk5.lon, fk5.lat).toEquatorial(eps0);
}

/**
 * Visual magnitude from the formulas adopted by the Astronomical Almanac in 1984 (Meeus ch. 41,
 * astronomia `illum.*84`), with the phase angle from r, Δ, R (Meeus 41.1). Also returns the phase
 * angle in degrees, so callers can stay inside the formulas' range of validity.
 */
export function planetMagnitude(id: (typeof REF_PLANETS)[number], jdUt: number): { magnitude: number; phaseAngleDeg: number } {
  const jde = jdeOf(jdUt);
  const { r, delta, R } = planetGeometry(id, jde);
  const i = illum.phaseAngle(r, delta, R);
  let magnitude: number;
  switch (id) {
    case 'mercury': magnitude = illum.mercury84(r, delta, i); break;
    case 'venus': magnitude = illum.venus84(r, delta, i); break;
    case 'mars': magnitude = illum.mars84(r, delta, i); break;
    case 'jupiter': magnitude = illum.jupiter84(r, delta, i); break;
    case 'saturn': {
      const [dU, B] = ub(jde, earth, planets.saturn!);
      magnitude = illum.saturn84(r, delta, B, dU);
      break;
    }
    case 'uranus': magnitude = illum.uranus84(r, delta); break;
    case 'neptune': magnitude = illum.neptune84(r, delta); break;
  }
  return { magnitude, phaseAngleDeg: i / RAD };
}

/**
 * Saturn's geometry for the ring-dependent magnitude formulas: r, Δ (AU), phase angle (degrees) and
 * the Saturnicentric latitudes of the Earth (B) and the Sun (B′) on the ring plane, degrees (Meeus ch. 45).
 */
export function saturnRingGeometry(jdUt: number): { r: number; delta: number; phaseAngleDeg: number; earthLatitudeDeg: number; sunLatitudeDeg: number } {
  const jde = jdeOf(jdUt);
  const { r, delta, R } = planetGeometry('saturn', jde);
  const [B, B1] = ring(jde, earth, planets.saturn!);
  return { r, delta, phaseAngleDeg: illum.phaseAngle(r, delta, R) / RAD, earthLatitudeDeg: B / RAD, sunLatitudeDeg: B1 / RAD };
}

/** Greenwich apparent sidereal time, degrees 0–360 (Meeus 12.4 plus nutation in RA). */
export function apparentSiderealDeg(jdUt: number): number {
  return apparentSiderealSeconds(jdUt) / 240;
}

export type RefEventKind = 'rise' | 'transit' | 'set';
export interface RefEvent {
  kind: RefEventKind;
  jdUt: number;
}

/**
 * The geometric altitude of the centre, radians, at which an event is counted (Meeus ch. 15
 * "standard altitude" h0): for the Sun and planets −34′ − semidiameter + horizontal parallax
 * (upper limb on the ideal horizon, seen from the surface); for the Moon 0.7275 π − 34′;
 * for twilight the given depth (−6°, −12°, −18°, centre, airless).
 */
function standardAltitude(id: RefBodyId, rangeAu: number, twilightDeg: number | undefined): number {
  if (twilightDeg !== undefined) return twilightDeg * RAD;
  if (id === 'moon') return 0.7275 * moonParallax(rangeAu * KM_PER_AU) - REFRACTION_RAD;
  if (id === 'sun') return -REFRACTION_RAD - SUN_SEMIDIAMETER_1AU_RAD / rangeAu + SOLAR_PARALLAX_1AU_RAD / rangeAu;
  const semidiameter = Math.asin(PLANET_RADIUS_KM[id]! / (rangeAu * KM_PER_AU));
  return -REFRACTION_RAD - semidiameter + SOLAR_PARALLAX_1AU_RAD / rangeAu;
}

function wrapDeg(x: number): number {
  return ((((x + 180) % 360) + 360) % 360) - 180;
}

/**
 * Rise, transit and set times (UT Julian days) between `jdUt0` and `jdUt1` by the method of
 * Meeus ch. 15: approximate times from the position at 0h UT of each day (15.1, 15.2), then the
 * corrections Δm = −H/360 (transit) and Δm = (h − h0)/(360 cos δ cos φ sin H) (rise, set), with
 * the position evaluated directly at each trial time and repeated until |Δm| < 0.01 s.
 * With `twilightDeg` only the Sun's crossings of that altitude are returned (rise = dawn, set = dusk).
 */
export function referenceEvents(id: RefBodyId, site: RefSite, jdUt0: number, jdUt1: number, options: { twilightDeg?: number } = {}): RefEvent[] {
  const phi = site.latitudeDeg * RAD;
  const lonDeg = site.longitudeDeg;
  const out: RefEvent[] = [];
  const firstDay = Math.floor(jdUt0 - 0.5) + 0.5 - 1;
  for (let jd0 = firstDay; jd0 <= jdUt1 + 0.5; jd0 += 1) {
    // The distance only enters the standard altitude (parallax, semidiameter): once a day is enough
    // for the planets; the Sun and the Moon come with their distance at no extra cost.
    let rangeAu = apparentGeocentric(id, jdeOf(jd0 + 0.5)).range;
    const state = (m: number): { H: number; dec: number; h: number; h0: number } => {
      const jd = jd0 + m;
      const jde = jdeOf(jd);
      let p: { ra: number; dec: number };
      if (id === 'sun' || id === 'moon') {
        const full = apparentGeocentric(id, jde);
        rangeAu = full.range;
        p = full;
      } else {
        p = planetApparent(planets[id]!, earth, jde);
      }
      const H = wrapDeg(apparentSiderealDeg(jd) + lonDeg - p.ra / RAD);
      const h = Math.asin(Math.sin(phi) * Math.sin(p.dec) + Math.cos(phi) * Math.cos(p.dec) * Math.cos(H * RAD));
      return { H, dec: p.dec, h, h0: standardAltitude(id, rangeAu, options.twilightDeg) };
    };
    const s0 = state(0.5);
    const mNoon = (((-s0.H / 360 + 0.5) % 1) + 1) % 1; // transit nearest to 12h UT, as a day fraction
    // Near a day boundary the transit of the previous or next day may be the one this day owns.
    const bases = [mNoon, ...(mNoon < 0.1 ? [mNoon + 1] : []), ...(mNoon > 0.9 ? [mNoon - 1] : [])];
    const cosH0 = (Math.sin(s0.h0) - Math.sin(phi) * Math.sin(s0.dec)) / (Math.cos(phi) * Math.cos(s0.dec));
    const starts: [RefEventKind, number][] = [];
    for (const m0 of bases) {
      if (options.twilightDeg === undefined) starts.push(['transit', m0]);
      if (Math.abs(cosH0) <= 1) {
        const H0 = Math.acos(cosH0) / RAD / 360;
        starts.push(['rise', m0 - H0], ['set', m0 + H0]);
      }
    }
    for (const [kind, start] of starts) {
      let m = start;
      let converged = false;
      for (let i = 0; i < 30; i++) {
        const s = state(m);
        const dm = kind === 'transit'
          ? -s.H / 360
          : (s.h - s.h0) / (2 * Math.PI * Math.cos(s.dec) * Math.cos(phi) * Math.sin(s.H * RAD));
        if (!Number.isFinite(dm)) break;
        m += Math.max(-0.1, Math.min(0.1, dm));
        if (Math.abs(dm) < 0.01 / 86_400) {
          // A rise lies east of the meridian (H < 0), a set west of it.
          converged = kind === 'transit' || (kind === 'rise' ? s.H < 0 : s.H > 0);
          break;
        }
      }
      const jd = jd0 + m;
      if (converged && jd >= jdUt0 && jd <= jdUt1 && !out.some((e) => e.kind === kind && Math.abs(e.jdUt - jd) < 0.02)) {
        out.push({ kind, jdUt: jd });
      }
    }
  }
  return out.sort((a, b) => a.jdUt - b.jdUt);
}
