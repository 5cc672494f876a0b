/**
 * Words and numbers on charts and in their alt text: the body's short name, clock times and
 * dates in the site's zone and locale (12- or 24-hour as the locale has it), magnitudes with a
 * true minus sign.
 */
import type { Body } from '../../core/body.ts';
import type { Site } from '../../core/site.ts';
import { formatClock } from '../../core/time.ts';
import { wordsFor, type Words } from '../../core/language/index.ts';
import { bodyLabel } from '../../core/language/names/index.ts';

const dateFormats = new Map<string, Intl.DateTimeFormat>();

/** The words of a chart's site (its locale's catalogue and formats). */
export function chartWords(site: Pick<Site, 'locale'>): Words {
  return wordsFor(site.locale);
}

/** A body's name for a chart label in the site's language, without a trailing parenthesis ("Comet Lumen (invented …)" → "Comet Lumen", "Jupiter" → "Júpiter"). */
export function chartLabel(body: Pick<Body, 'id' | 'name'>, site: Pick<Site, 'locale'> = { locale: 'en' }): string {
  const name = bodyLabel(chartWords(site).language, body);
  return name.replace(/\s*\([^)]*\)\s*$/, '') || name;
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

/** A magnitude to one decimal with a true minus sign, in the site's digits ("−2.4", "4,9"). */
export function formatMagnitude(value: number, site: Pick<Site, 'locale'> = { locale: 'en' }): string {
  return chartWords(site).number(Math.round(value * 10) / 10, 1);
}
