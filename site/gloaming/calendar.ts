/**
 * The iCalendar (RFC 5545) feed of a site: the sky's events (lib/outputs/almanac) from the Monday of the
 * build week for 13 weeks, in UTC, so phones can subscribe. Deterministic: DTSTAMP is the build
 * date and UIDs come from each event and the site. Satellite passes appear for the weeks the
 * element sets in content/satellites/ are good for (lib/outputs/almanac/satellite-passes.ts). Computed in the content layer with the site.
 */
import { eventsToICalendar, findEvents } from '../../lib/outputs/almanac/index.ts';
import type { BodyRegistry } from '../../lib/core/body.ts';
import type { Satellite } from '../../lib/models/satellite/passes.ts';
import type { Site } from '../../lib/core/site.ts';
import { addDays, isoWeekOf, zonedTime } from '../../lib/core/time.ts';
import { wordsFor } from '../../lib/core/language/index.ts';

/** Weeks of events in each feed. */
export const CALENDAR_WEEKS = 13;

/** The calendar of `site`: `today` is the build date, `centreName` the publisher (content/centre.yaml) for the PRODID. */
export function siteCalendar(site: Site, options: { bodies: BodyRegistry; today: string; satellites?: readonly Satellite[]; centreName: string }): string {
  const { bodies, today, satellites = [] } = options;
  const monday = isoWeekOf(today).days[0]!;
  const events = findEvents({
    site,
    from: zonedTime(monday, 0, 0, site.timeZone),
    to: zonedTime(addDays(monday, 7 * CALENDAR_WEEKS), 0, 0, site.timeZone),
    bodies,
    satellites,
  });
  return eventsToICalendar(events, {
    site,
    // The PRODID's last field names the language of its text (RFC 5545 §3.7.3).
    prodId: `-//${options.centreName}//gloaming night-sky diary//${wordsFor(site.locale).language.toUpperCase()}`,
    now: new Date(`${today}T00:00:00Z`),
    name: wordsFor(site.locale).t('ui.diary-title', { site: site.name }),
  });
}
