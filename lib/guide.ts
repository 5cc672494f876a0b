/**
 * The guide phrase for a body at a moment, as every page, chart and command prints it: the body's
 * apparent place, the Sun's, and the Moon's and planets' (the guides of lib/stars/guide.ts, rule
 * 2) from `observe` (topocentric, equator of date), turned into words by `guideTarget`, which
 * passes over what the site's skyline hides.
 */
import { builtInBody, BUILT_IN_IDS, type Body } from './body.ts';
import { observe, type Instant } from './observe.ts';
import { skylineAltitudeDeg, type Site } from './site.ts';
import { guideTarget, type GuideCompanion, type GuideResult } from './stars/guide.ts';

/**
 * Where `body` is at `time` seen from `site`, in words (see `guideTarget` for the rules and their
 * order). Null only when the body is below the horizon; the Sun gets no guide.
 */
export function guideFor(input: { site: Site; body: Body; time: Instant }): GuideResult | null {
  const { site, body } = input;
  if (body.kind === 'sun') return null;
  const o = observe(site, body, input.time);
  const sun = observe(site, builtInBody('sun'), o.time);
  const companions: GuideCompanion[] = [];
  for (const id of BUILT_IN_IDS) {
    if (id === 'sun' || id === body.id) continue;
    const other = builtInBody(id);
    const p = observe(site, other, o.time);
    companions.push({ id, name: other.name, kind: other.kind === 'moon' ? 'moon' : 'planet', place: { raHours: p.raHours, decDeg: p.decDeg }, magnitude: p.magnitude.value });
  }
  return guideTarget({
    observer: site,
    time: o.time,
    target: { raHours: o.raHours, decDeg: o.decDeg },
    sun: { raHours: sun.raHours, decDeg: sun.decDeg },
    companions,
    skylineAltitudeDeg: (azimuthDeg) => skylineAltitudeDeg(site, azimuthDeg),
  });
}
