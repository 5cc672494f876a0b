/**
 * The guide phrase for a body at a moment, as every page, chart and command prints it: the body's
 * apparent place, the Sun's, and the Moon's and planets' (the guides of lib/models/stars/guide.ts, rule
 * 2) from `observe` and `topocentricOfDate` (topocentric, equator of date), turned into words by
 * `guideTarget`, which passes over what the site's skyline hides.
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody, BUILT_IN_IDS, type Body } from '../core/body.ts';
import { separationDeg } from '../core/geometry.ts';
import { observe, topocentricOfDate, vectorToRaDec, type Instant } from '../core/observe.ts';
import { skylineAltitudeDeg, type Site } from '../core/site.ts';
import { guideTarget, NEAR_BODY_DEG, type GuideCompanion, type GuideResult } from './stars/guide.ts';

/**
 * How far from a deep-sky object's centre its own stars reach, degrees: half its catalogue size,
 * and at least 0.25° (a double star's pair, a small cluster's brightest star), so "0.0° from
 * Albireo" or "0.1° from Alcyone, in the Pleiades" never guides the eye to the object itself.
 */
function ownRadiusDeg(body: Body): number {
  return Math.max(0.25, (body.extentArcmin?.major ?? 0) / 120);
}

/**
 * Where `body` is at `time` seen from `site`, in words (see `guideTarget` for the rules and their
 * order). Null only when the body is below the horizon; the Sun gets no guide. Only the Moon and
 * planets within `NEAR_BODY_DEG` (+1°) of the body are offered as guides, so magnitudes are
 * computed for those alone.
 */
export function guideFor(input: { site: Site; body: Body; time: Instant }): GuideResult | null {
  const { site, body } = input;
  if (body.kind === 'sun') return null;
  const o = observe(site, body, input.time);
  const rotation = Astronomy.Rotation_EQJ_EQD(o.time);
  const placeOf = (other: Body): { raHours: number; decDeg: number; v: Astronomy.Vector } => {
    const v = topocentricOfDate(site, other, o.time, rotation);
    const eq = vectorToRaDec(v.x, v.y, v.z);
    return { raHours: eq.raHours, decDeg: eq.decDeg, v };
  };
  const target = topocentricOfDate(site, body, o.time, rotation);
  const companions: GuideCompanion[] = [];
  for (const id of BUILT_IN_IDS) {
    if (id === 'sun' || id === body.id) continue;
    const other = builtInBody(id);
    const p = placeOf(other);
    if (separationDeg([p.v.x, p.v.y, p.v.z], [target.x, target.y, target.z]) > NEAR_BODY_DEG + 1) continue;
    const magnitude = other.kind === 'moon' ? -10 : other.illumination(o.time).magnitude.value;
    companions.push({ id, name: other.name, kind: other.kind === 'moon' ? 'moon' : 'planet', place: { raHours: p.raHours, decDeg: p.decDeg }, magnitude });
  }
  const sun = placeOf(builtInBody('sun'));
  return guideTarget({
    observer: site,
    time: o.time,
    target: { raHours: o.raHours, decDeg: o.decDeg },
    sun: { raHours: sun.raHours, decDeg: sun.decDeg },
    companions,
    skylineAltitudeDeg: (azimuthDeg) => skylineAltitudeDeg(site, azimuthDeg),
    ...(body.kind === 'deep-sky' ? { ownRadiusDeg: ownRadiusDeg(body) } : {}),
  });
}
