/**
 * Equinoxes and solstices: the Sun's apparent geocentric ecliptic longitude (true equinox of
 * date) reaches 0°, 90°, 180°, 270° (`astronomy-engine` `Seasons`; the almanac definition, Meeus,
 * Astronomical Algorithms 2nd ed., ch. 27). Worded for the site's hemisphere.
 */
import * as Astronomy from 'astronomy-engine';
import type { AlmanacContext } from './context.ts';
import type { AlmanacEvent } from './types.ts';

/** Equinoxes and solstices with instants in [from, to). */
export function seasonEvents(ctx: AlmanacContext, from: Date, to: Date): AlmanacEvent[] {
  const out: AlmanacEvent[] = [];
  const north = ctx.site.latitudeDeg >= 0;
  for (let year = from.getUTCFullYear(); year <= to.getUTCFullYear(); year++) {
    const s = Astronomy.Seasons(year);
    const w = ctx.words;
    const items = [
      { time: s.mar_equinox.date, type: 'equinox' as const, month: 'march', text: w.t(north ? 'ev.season.spring-north' : 'ev.season.autumn-south') },
      { time: s.jun_solstice.date, type: 'solstice' as const, month: 'june', text: w.t(north ? 'ev.season.longest-day' : 'ev.season.shortest-day') },
      { time: s.sep_equinox.date, type: 'equinox' as const, month: 'september', text: w.t(north ? 'ev.season.autumn-north' : 'ev.season.spring-south') },
      { time: s.dec_solstice.date, type: 'solstice' as const, month: 'december', text: w.t(north ? 'ev.season.shortest-day' : 'ev.season.longest-day') },
    ];
    for (const item of items) {
      if (item.time < from || item.time >= to) continue;
      const what = w.t(item.type === 'equinox' ? 'ev.season.equinox' : item.month === 'june' ? 'ev.season.solstice-north' : 'ev.season.solstice-south');
      const title = w.t('ev.title.season', { month: item.month });
      out.push({
        type: item.type,
        time: item.time,
        bodies: ['sun'],
        names: ['Sun'],
        visible: true,
        visibility: { visible: true, moment: 'event', time: item.time, altitudeDeg: null, azimuthDeg: null, reason: null, note: w.t('ev.season.note') },
        title,
        description: w.t('ev.season', { title, when: ctx.when(item.time), what, text: item.text }),
        score: 0,
      });
    }
  }
  return out;
}
