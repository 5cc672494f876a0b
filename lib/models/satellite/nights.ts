/**
 * Satellite passes night by night, with what cannot be predicted said plainly. A satellite's
 * passes are given for a night only when its element set is within `MAX_ELEMENT_AGE_DAYS` of the
 * whole night (local noon to local noon); otherwise the night lists it as unavailable, so pages,
 * feeds and events built weeks away from the element sets' epochs say that predictions are not
 * available rather than show a stale pass or stop the build.
 */
import type { Site } from '../../core/site.ts';
import { addDays, nightOf } from '../../core/time.ts';
import { utDays } from '../../core/track.ts';
import { elementsCover, findPasses, type Satellite, type SatellitePass } from './passes.ts';

/** One night's passes. */
export interface PassNight {
  /** Local date of the evening, YYYY-MM-DD. */
  date: string;
  /** Passes of the satellites whose elements cover the night, in time order (recommended or not). */
  passes: SatellitePass[];
  /** Satellites whose element sets are too far from this night to predict it. */
  unavailable: { id: string; name: string; epoch: Date }[];
}

/**
 * The passes of `satellites` over `site` for each night from the evening of `from` to that of
 * `to` (local dates, inclusive). Nights no satellite's elements cover cost nothing. `known` holds
 * nights already computed for the same site and satellites (a bulletin week's, see
 * `WeekData.passNights`): those are reused, not computed again.
 */
export function passNights(input: { site: Site; satellites: readonly Satellite[]; from: string; to: string; known?: readonly PassNight[] }): PassNight[] {
  const { site, satellites } = input;
  const known = new Map((input.known ?? []).map((n) => [n.date, n]));
  const out: PassNight[] = [];
  for (let date = input.from; date <= input.to; date = addDays(date, 1)) {
    const reused = known.get(date);
    if (reused) {
      out.push(reused);
      continue;
    }
    const night = nightOf(date, site.timeZone);
    const ut0 = utDays(night.start);
    const ut1 = utDays(night.end);
    const fresh = satellites.filter((s) => elementsCover(s, ut0, ut1));
    const unavailable = satellites.filter((s) => !fresh.includes(s)).map((s) => ({ id: s.id, name: s.name, epoch: s.elements.epoch }));
    out.push({ date, passes: fresh.length ? findPasses({ site, satellites: fresh, from: date, to: date }) : [], unavailable });
  }
  return out;
}

/** The passes to recommend (`recommended`: naked eye, at least a minute) of some nights, in time order. */
export function recommendedPasses(nights: readonly PassNight[]): SatellitePass[] {
  return nights.flatMap((n) => n.passes.filter((p) => p.recommended));
}

/** The brightest recommended pass (smallest magnitude at its best moment; the earlier on a tie), or null. */
export function brightestPass(nights: readonly PassNight[]): SatellitePass | null {
  let best: SatellitePass | null = null;
  for (const p of recommendedPasses(nights)) {
    if (!best || p.visible!.best.magnitude! < best.visible!.best.magnitude!) best = p;
  }
  return best;
}
