/** Short wordings the site uses around the computed values, in the words of the page's locale (lib/core/language). */
import { catalogueLanguage, wordsFor } from '../../lib/core/language/index.ts';
import type { SkyQuality } from '../../lib/core/site.ts';
import type { IsoWeek } from '../../lib/core/time.ts';

/** "Bortle 7", "SQM 20.4", "naked-eye limit 5.5" (decimals in the locale's style). */
export function skyLabel(sky: SkyQuality, locale = 'en-GB'): string {
  const w = wordsFor(locale);
  const value = (x: number): string => w.number(x, Number.isInteger(x) ? 0 : 1);
  if ('bortle' in sky) return w.t('ui.sky-bortle', { value: String(sky.bortle) });
  if ('sqm' in sky) return w.t('ui.sky-sqm', { value: value(sky.sqm) });
  return w.t('ui.sky-nelm', { value: value(sky.nelm) });
}

function utcNoon(date: string): Date {
  const [y, m, d] = date.split('-').map(Number) as [number, number, number];
  return new Date(Date.UTC(y, m - 1, d, 12));
}

/** "30 Nov – 6 Dec 2026" (the week's Monday to Sunday, in the site's locale). */
export function weekLabel(week: IsoWeek, locale: string): string {
  return wordsFor(locale).dayRange(week.days[0]!, week.days[6]!, { month: 'short', year: true });
}

/** "52.9° N, 1.4° W" ("33,4° S, 70,5° O" in Spanish). */
export function latLonLabel(latitudeDeg: number, longitudeDeg: number, locale = 'en-GB'): string {
  const w = wordsFor(locale);
  const lat = w.t(latitudeDeg >= 0 ? 'ui.latitude-north' : 'ui.latitude-south', { value: w.number(Math.abs(latitudeDeg), 1) });
  const lon = w.t(longitudeDeg >= 0 ? 'ui.longitude-east' : 'ui.longitude-west', { value: w.number(Math.abs(longitudeDeg), 1) });
  return `${lat}, ${lon}`;
}

/** "Wednesday 13 January 2027": the date of a one-off bulletin, in the site's locale. */
export function dateLabel(date: string, locale: string): string {
  // Weekday and date apart, as the bulletin's own dates read ("Wednesday 13 January"): ICU puts a comma after the weekday when a year follows.
  const weekday = new Intl.DateTimeFormat(locale, { timeZone: 'UTC', weekday: 'long' }).format(utcNoon(date));
  return `${weekday} ${new Intl.DateTimeFormat(locale, { timeZone: 'UTC', day: 'numeric', month: 'long', year: 'numeric' }).format(utcNoon(date))}`;
}

/**
 * The demo notice of a page in `locale`: the centre's own sentence on pages in the centre's
 * language, the catalogue's in another language; null for a real centre.
 */
export function noticeIn(publisher: { name: string; locale: string; notice: string | null }, locale: string): string | null {
  if (publisher.notice === null) return null;
  if (catalogueLanguage(locale) === catalogueLanguage(publisher.locale)) return publisher.notice;
  return wordsFor(locale).t('ui.invented-note', { centre: publisher.name });
}
