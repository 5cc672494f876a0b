/**
 * A comet's tail as a reader sees it: the anti-solar direction at the comet, both as a position
 * angle on the sky (from north through east) and as a direction in the observer's own sky at a
 * given moment ("the tail points to the upper left"). The tail of a real comet curves and lags
 * the anti-solar line (the dust tail especially); this is the usual first indication.
 */
import * as Astronomy from 'astronomy-engine';
import { SkyFrame, altitudeOfHor, apparentAltitudeDeg, azimuthOfHor, offsetInSky, type OffsetDirection } from '../../core/geometry.ts';
import { astroTime, type Instant } from '../../core/observe.ts';
import type { Site } from '../../core/site.ts';
import { tailPointGeoVector, tailPositionAngleDeg, type SmallBody } from './body.ts';

export interface TailInSky {
  /** Position angle of the anti-solar direction, degrees from north through east (J2000 equator). */
  positionAngleDeg: number;
  /**
   * Direction of the tail in the observer's sky, degrees clockwise from "up" (towards the zenith)
   * for an observer facing the comet: 0 up, 90 to the right, 180 down, 270 to the left.
   */
  skyAngleDeg: number;
  /** The same as a word: 'above', 'upper right', … ('above' reads "points up"). */
  direction: OffsetDirection;
  /** "points up and to the left". */
  words: string;
  /** Where the head and the tail's tip (at the length asked) are in the site's sky: apparent altitude and azimuth, degrees. */
  head: { altitudeDeg: number; azimuthDeg: number };
  tip: { altitudeDeg: number; azimuthDeg: number };
}

const WORDS: Record<OffsetDirection, string> = {
  above: 'points straight up',
  'upper right': 'points up and to the right',
  right: 'points to the right',
  'lower right': 'points down and to the right',
  below: 'points down',
  'lower left': 'points down and to the left',
  left: 'points to the left',
  'upper left': 'points up and to the left',
};

/** Apparent altitude and azimuth of a geocentric J2000 position (AU) seen from a site: the observer's position subtracted (parallax), `SkyFrame`, standard refraction. */
function altAz(site: Site, frame: SkyFrame, geo: Astronomy.Vector): { altitudeDeg: number; azimuthDeg: number } {
  const obs = Astronomy.ObserverVector(frame.time, site.observer, false);
  const hor = frame.horFromEqj(geo.x - obs.x, geo.y - obs.y, geo.z - obs.z);
  return { altitudeDeg: apparentAltitudeDeg(altitudeOfHor(hor)), azimuthDeg: azimuthOfHor(hor) };
}

/**
 * The tail direction of `body` for `site` at `instant`: where the tail's tip lies from the head in
 * the site's sky (`offsetInSky`). `lengthAu` is how far along the anti-solar line the tip is taken
 * (default 0.01 AU, see `tailPointGeoVector`); charts draw a longer stub in the same direction.
 * The one computation of the tail's direction: the command line's words and the finder chart's
 * drawn tail both come from here.
 */
export function tailInSky(site: Site, body: SmallBody, instant: Instant, options: { lengthAu?: number } = {}): TailInSky {
  const time = astroTime(instant);
  const frame = new SkyFrame(site, time);
  const head = altAz(site, frame, body.geoVector(time, { aberration: true }));
  const tip = altAz(site, frame, tailPointGeoVector(body, time, options));
  const off = offsetInSky({ fromAltitudeDeg: head.altitudeDeg, fromAzimuthDeg: head.azimuthDeg, toAltitudeDeg: tip.altitudeDeg, toAzimuthDeg: tip.azimuthDeg });
  return {
    positionAngleDeg: tailPositionAngleDeg(body, time),
    skyAngleDeg: off.positionAngleDeg,
    direction: off.offsetDirection,
    words: WORDS[off.offsetDirection],
    head,
    tip,
  };
}
