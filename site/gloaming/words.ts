/** Short wordings the site uses around the computed values. */
import type { SkyQuality } from '../../lib/core/site.ts';
import type { IsoWeek } from '../../lib/core/time.ts';

/** "Bortle 7", "SQM 20.4", "naked-eye limit 5.5". */
export function skyLabel(sky: SkyQuality): string {
  if ('bortle' in sky) return `Bortle ${sky.bortle}`;
  if ('sqm' in sky) return `SQM ${sky.sqm} mag/arcsec²`;
  return `naked-eye limit ${sky.nelm}`;
}

function utcNoon(date: string): Date {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d, 12));
}

/** "30 Nov – 6 Dec 2026" (the week's Monday to Sunday, in the site's locale). */
export function weekLabel(week: IsoWeek, locale: string): string {
  const f = new Intl.DateTimeFormat(locale, { timeZone: 'UTC', day: 'numeric', month: 'short', year: 'numeric' });
  return f.formatRange(utcNoon(week.days[0]!), utcNoon(week.days[6]!));
}

/** "52.9° N, 1.4° W". */
export function latLonLabel(latitudeDeg: number, longitudeDeg: number): string {
  const lat = `${Math.abs(latitudeDeg).toFixed(1)}° ${latitudeDeg >= 0 ? 'N' : 'S'}`;
  const lon = `${Math.abs(longitudeDeg).toFixed(1)}° ${longitudeDeg >= 0 ? 'E' : 'W'}`;
  return `${lat}, ${lon}`;
}

/** "Wednesday 13 January 2027": the date of a one-off bulletin, in the site's locale. */
export function dateLabel(date: string, locale: string): string {
  // Weekday and date apart, as the bulletin's own dates read ("Wednesday 13 January"): ICU puts a comma after the weekday when a year follows.
  const weekday = new Intl.DateTimeFormat(locale, { timeZone: 'UTC', weekday: 'long' }).format(utcNoon(date));
  return `${weekday} ${new Intl.DateTimeFormat(locale, { timeZone: 'UTC', day: 'numeric', month: 'long', year: 'numeric' }).format(utcNoon(date))}`;
}
