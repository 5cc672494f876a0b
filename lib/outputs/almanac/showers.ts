/**
 * Meteor showers: the table of major annual showers (`showers.json`, sources named there), the
 * local peak from the Sun's ecliptic longitude, and the count a person can expect from the site.
 *
 * Peak: the instant the Sun's geocentric ecliptic longitude, J2000.0 mean equinox and ecliptic,
 * reaches the shower's tabulated λ☉ (the IMO's convention), found with lib/search.ts.
 *
 * Expected hourly count (the IMO's ZHR definition turned round; Koschack R. & Rendtel J. 1990,
 * "Determination of spatial number density and mass index from visual meteor observations (I)",
 * WGN 18:44–58): HR = ZHR · sin(h) / r^(6.5 − LM), with h the radiant's altitude, r the
 * population index and LM the limiting magnitude at the zenith. LM comes from the sky model:
 * the zenith sky brightness with the site's dark sky, twilight and moonlight (lib/models/sky) turned
 * into a naked-eye limiting magnitude by `nelmFromSkyBrightness`.
 */
import * as Astronomy from 'astronomy-engine';
import { builtInBody, fixedDirectionBody } from '../../core/body.ts';
import { findCrossings, findMaximum, sharedSearch } from '../../core/search.ts';
import { darkSkyFromQuality, nelmFromSkyBrightness } from '../../models/sky/quality.ts';
import { extinctionCoefficientGreen } from '../../models/sky/extinction.ts';
import { skyBrightness } from '../../models/sky/brightness.ts';
import { dateFromUt, utDays } from '../../core/track.ts';
import type { AlmanacContext } from './context.ts';
import { eclipticLongitudeJ2000Deg, wrap180 } from './planets.ts';
import { apparentPlace, hidden, isDark } from './visibility.ts';
import type { AlmanacEvent, ShowerDetails } from './types.ts';
import table from './showers.json' with { type: 'json' };

export interface MeteorShower {
  id: string;
  code: string;
  name: string;
  /** Constellation of the radiant, for the description. */
  constellation: string;
  /** Sun's ecliptic longitude at the peak, J2000.0, degrees. */
  peakSolarLongitudeDeg: number;
  /** Radiant at the peak, J2000, degrees. */
  radiantRaDeg: number;
  radiantDecDeg: number;
  /** Zenithal hourly rate at the peak. */
  zhr: number;
  /** Geocentric velocity, km/s. */
  velocityKmS: number;
  /** Population index r. */
  populationIndex: number;
  /** Usual activity period, `MM-DD/MM-DD`. */
  activity: string;
  /** Where the row's values come from. */
  source: string;
}

/** The shower table (see `showers.json` for its provenance). */
export const METEOR_SHOWERS: readonly MeteorShower[] = Object.freeze(table.showers as MeteorShower[]);
/** Provenance note of the whole table. */
export const METEOR_SHOWER_SOURCE: string = table.source;

/**
 * Expected hourly count of one observer: HR = ZHR · sin(h) / r^(6.5 − LM) (Koschack & Rendtel 1990;
 * the IMO's ZHR definition with the field-obstruction factor 1). Zero when the radiant is down.
 */
export function hourlyRate(input: { zhr: number; radiantAltitudeDeg: number; limitingMagnitude: number; populationIndex: number }): number {
  if (input.radiantAltitudeDeg <= 0) return 0;
  return (input.zhr * Math.sin((input.radiantAltitudeDeg * Math.PI) / 180)) / Math.pow(input.populationIndex, 6.5 - input.limitingMagnitude);
}

/** The Sun's apparent geocentric ecliptic longitude, J2000.0 mean equinox and ecliptic, degrees 0–360. */
export function solarLongitudeJ2000Deg(instant: Date): number {
  return eclipticLongitudeJ2000Deg(Astronomy.GeoVector(Astronomy.Body.Sun, Astronomy.MakeTime(instant), true));
}

/** Instants in [from, to) at which the Sun's J2000 ecliptic longitude reaches `longitudeDeg`. */
export function solarLongitudeCrossings(longitudeDeg: number, from: Date, to: Date): Date[] {
  const f = (ut: number): number => wrap180(solarLongitudeJ2000Deg(dateFromUt(ut)) - longitudeDeg);
  return findCrossings(f, utDays(from), utDays(to), { stepDays: 1, toleranceDays: 1 / 1440, accept: (a, b) => Math.abs(a) < 90 && Math.abs(b) < 90 })
    .filter((c) => c.direction === 1)
    .map((c) => dateFromUt(c.ut));
}

/** Rounds a count for a reader: whole numbers below 10, then to the nearest 5 (at least 1: callers word counts under one themselves). */
function readerCount(n: number): number {
  return n < 10 ? Math.max(1, Math.round(n)) : Math.round(n / 5) * 5;
}

/** Peaks of the given showers with instants in [from, to), with the site's expected counts. */
export function showerEvents(ctx: AlmanacContext, from: Date, to: Date, showers: readonly MeteorShower[] = METEOR_SHOWERS): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const darkNl = darkSkyFromQuality(ctx.site.sky).zenithNl;
  const kV = extinctionCoefficientGreen(ctx.site.elevationM);
  for (const shower of showers) {
    const peaks = (a: Date, b: Date): Date[] => solarLongitudeCrossings(shower.peakSolarLongitudeDeg, a, b);
    for (const time of sharedSearch(showerEvents, `${shower.code}:${shower.peakSolarLongitudeDeg}`, from, to, peaks, (t) => t)) {
      const frame = ctx.frameAt(time);
      const radiant = fixedDirectionBody({ id: `shower:${shower.code}`, name: `${shower.name} radiant`, kind: 'radiant', raDeg: shower.radiantRaDeg, decDeg: shower.radiantDecDeg, vMag: 99 });
      const moonPhaseAngleDeg = Astronomy.Illumination(Astronomy.Body.Moon, Astronomy.MakeTime(time)).phase_angle;
      const moonFraction = Astronomy.Illumination(Astronomy.Body.Moon, Astronomy.MakeTime(time)).phase_fraction;
      const moonBody = builtInBody('moon');
      const state = (ut: number, moonless: boolean): { rate: number; h: number; az: number; lm: number } | null => {
        if (!isDark(ctx, frame, ut)) return null;
        const sun = apparentPlace(frame, frame.sun.body, ut).altitudeDeg;
        const r = apparentPlace(frame, radiant, ut);
        if (r.altitudeDeg <= 0) return null;
        const moonAlt = moonless ? -90 : apparentPlace(frame, moonBody, ut).altitudeDeg;
        const sky = skyBrightness({
          target: { altitudeDeg: 90, sunSeparationDeg: 90 - sun, moonSeparationDeg: 90 - moonAlt },
          sun: { altitudeDeg: sun, geometricAltitudeDeg: frame.sun.at(ut).geometricAltitudeDeg },
          moon: { altitudeDeg: moonAlt, phaseAngleDeg: moonPhaseAngleDeg },
          darkSkyZenithNl: darkNl,
          kV,
        });
        const lm = nelmFromSkyBrightness(sky.magPerArcsec2);
        return { rate: hourlyRate({ zhr: shower.zhr, radiantAltitudeDeg: r.altitudeDeg, limitingMagnitude: lm, populationIndex: shower.populationIndex }), h: r.altitudeDeg, az: r.azimuthDeg, lm };
      };
      const search = (moonless: boolean): { ut: number; value: number } | null =>
        findMaximum((ut) => state(ut, moonless)?.rate ?? NaN, frame.ut0, frame.ut1, { stepDays: 10 / 1440, toleranceDays: 30 / 86_400 });
      const best = search(false);
      const moonless = search(true);
      const bestState = best ? state(best.ut, false) : null;
      const details: ShowerDetails = {
        code: shower.code,
        zhr: shower.zhr,
        populationIndex: shower.populationIndex,
        velocityKmS: shower.velocityKmS,
        best:
          best && bestState
            ? { time: dateFromUt(best.ut), radiantAltitudeDeg: bestState.h, radiantAzimuthDeg: bestState.az, limitingMagnitude: bestState.lm, hourlyRate: bestState.rate }
            : null,
        moonlessHourlyRate: moonless ? moonless.value : 0,
        moonIlluminatedFraction: moonFraction,
        moonInterferes: !!moonless && (!best || best.value < (2 / 3) * moonless.value),
      };
      const w = ctx.words;
      const name = ctx.label({ id: `shower:${shower.code}`, name: shower.name });
      const night = w.t('ev.shower-night', { day: ctx.day(frame.night.start) });
      let description: string;
      let visibility;
      if (details.best && details.best.hourlyRate >= 1) {
        const b = details.best;
        const moon = details.moonInterferes ? 'cuts' : moonFraction < 0.3 ? 'little' : 'none';
        const place = { degrees: Math.round(b.radiantAltitudeDeg), direction: ctx.direction(b.radiantAzimuthDeg), clock: ctx.clock(b.time) };
        description = w.t('ev.shower', {
          name,
          night,
          count: readerCount(b.hourlyRate),
          constellation: shower.constellation,
          moon,
          percent: w.percent(moonFraction),
          moonless: readerCount(details.moonlessHourlyRate),
          ...place,
        });
        visibility = {
          visible: true,
          moment: 'night' as const,
          time: b.time,
          altitudeDeg: b.radiantAltitudeDeg,
          azimuthDeg: b.radiantAzimuthDeg,
          reason: null,
          note: w.t('ev.shower-note', place),
        };
      } else {
        // Dark at some moment: the Sun's lowest point of the night (geometric, as `isDark`) is below the darkness altitude.
        const lowest = -findMaximum((ut) => -frame.sun.at(ut).geometricAltitudeDeg, frame.ut0, frame.ut1, { stepDays: 10 / 1440 })!.value;
        const dark = lowest <= ctx.darkSunAltitudeDeg;
        visibility = hidden(ctx, dark ? 'radiant-below-horizon' : 'no-darkness');
        description = dark ? w.t('ev.shower-low', { name, night, constellation: shower.constellation }) : w.t('ev.shower-no-dark', { name, night });
      }
      out.push({
        type: 'meteor-shower-peak',
        time,
        bodies: [`shower:${shower.code}`],
        names: [shower.name],
        visible: visibility.visible,
        visibility,
        title: w.t('ev.title.shower', { name }),
        description,
        score: 0,
        shower: details,
        data: { zhr: shower.zhr },
      });
    }
  }
  return out;
}
