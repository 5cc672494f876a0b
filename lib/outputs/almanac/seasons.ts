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
    const items = [
      { time: s.mar_equinox.date, type: 'equinox' as const, title: 'March equinox', text: north ? 'spring begins in the northern hemisphere and from now the nights get shorter than the days' : 'autumn begins in the southern hemisphere and from now the nights get longer than the days' },
      { time: s.jun_solstice.date, type: 'solstice' as const, title: 'June solstice', text: north ? 'the longest day and the shortest night of the year here, with the least darkness for stargazing' : 'the shortest day and the longest night of the year here, the most hours of darkness for stargazing' },
      { time: s.sep_equinox.date, type: 'equinox' as const, title: 'September equinox', text: north ? 'autumn begins in the northern hemisphere and from now the nights get longer than the days' : 'spring begins in the southern hemisphere and from now the nights get shorter than the days' },
      { time: s.dec_solstice.date, type: 'solstice' as const, title: 'December solstice', text: north ? 'the shortest day and the longest night of the year here, the most hours of darkness for stargazing' : 'the longest day and the shortest night of the year here, with the least darkness for stargazing' },
    ];
    for (const item of items) {
      if (item.time < from || item.time >= to) continue;
      const what = item.type === 'equinox' ? 'the Sun crosses the celestial equator' : `the Sun reaches its ${item.title.startsWith('June') ? 'northernmost' : 'southernmost'} point in the sky`;
      out.push({
        type: item.type,
        time: item.time,
        bodies: ['sun'],
        names: ['Sun'],
        visible: true,
        visibility: { visible: true, moment: 'event', time: item.time, altitudeDeg: null, azimuthDeg: null, reason: null, note: 'A turning point of the seasons, not a sight: nothing to look for in the sky.' },
        title: item.title,
        description: `${item.title} on ${ctx.when(item.time)}: ${what}; ${item.text}.`,
        score: 0,
      });
    }
  }
  return out;
}
