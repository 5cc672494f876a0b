/**
 * Words and numbers on charts and in their alt text: the body's short name, clock times and
 * dates in the site's zone and locale (12- or 24-hour as the locale has it), magnitudes with a
 * true minus sign.
 */
import type { Body } from '../../core/body.ts';
import type { Site } from '../../core/site.ts';
import { formatClock } from '../../core/time.ts';

const dateFormats = new Map<string, Intl.DateTimeFormat>();

/** A body's name for a chart label, without a trailing parenthesis ("Comet Lumen (invented …)" → "Comet Lumen"). */
export function chartLabel(body: Body): string {
  return body.name.replace(/\s*\([^)]*\)\s*$/, '') || body.name;
}

/** Clock time of `instant` in the site's zone and locale ("21:40", "9:40 pm"). */
export function formatChartTime(instant: Date, site: Pick<Site, 'locale' | 'timeZone'>): string {
  return formatClock(instant, site);
}

/** Short local date of `instant` ("12 Jan", "Jan 12"), in the site's zone and locale. */
export function formatChartDate(instant: Date, site: Pick<Site, 'locale' | 'timeZone'>): string {
  const key = `${site.locale}|${site.timeZone}`;
  let f = dateFormats.get(key);
  if (!f) {
    f = new Intl.DateTimeFormat(site.locale, { timeZone: site.timeZone, day: 'numeric', month: 'short' });
    dateFormats.set(key, f);
  }
  return f.format(instant);
}

/** A magnitude to one decimal with a true minus sign ("−2.4", "4.9"). */
export function formatMagnitude(value: number): string {
  const r = Math.round(value * 10) / 10;
  return (r < 0 ? '\u2212' : '') + Math.abs(r).toFixed(1);
}
