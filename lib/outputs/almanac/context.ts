/**
 * Shared state of one `findEvents` call: the site, the night frames already built (so events of
 * the same night share their tracks), star pseudo-bodies, and local-time wording.
 */
import { fixedDirectionBody, type Body } from '../../core/body.ts';
import { wordsFor, type NamePhrase, type Words } from '../../core/language/index.ts';
import { bodyLabel, bodyPhrase } from '../../core/language/names/index.ts';
import type { Site } from '../../core/site.ts';
import type { Star } from '../../models/stars/catalogue.ts';
import { addDays, formatClock, localDateOf, nightOf, roundInstant, zonedParts } from '../../core/time.ts';
import { NightFrame } from '../../core/track.ts';

/** A bright star of the catalogue as a `Body` with id `star:<HIP>` (cannot clash with a body id). */
export function starBody(star: Star): Body {
  return fixedDirectionBody({ id: `star:${star.hip}`, name: star.label, kind: 'star', raDeg: star.raDeg, decDeg: star.decDeg, vMag: star.vMag });
}

/** The local date of the night (local noon to next local noon) that contains `instant`. */
export function nightDateOf(instant: Date, zone: string): string {
  const date = localDateOf(instant, zone);
  return zonedParts(instant, zone).hour < 12 ? addDays(date, -1) : date;
}

export class AlmanacContext {
  readonly site: Site;
  readonly darkSunAltitudeDeg: number;
  /** The words of the site's language: every event sentence comes from its catalogue (`ev.*`). */
  readonly words: Words;
  readonly #frames = new Map<string, NightFrame>();
  readonly #day: Intl.DateTimeFormat;

  constructor(site: Site, options: { darkSunAltitudeDeg?: number; frames?: Iterable<NightFrame> } = {}) {
    this.site = site;
    this.darkSunAltitudeDeg = options.darkSunAltitudeDeg ?? -6;
    this.words = wordsFor(site.locale);
    this.#day = new Intl.DateTimeFormat(site.locale, { timeZone: site.timeZone, weekday: 'short', day: 'numeric', month: 'short' });
    for (const frame of options.frames ?? []) if (frame.site === site) this.#frames.set(frame.night.date, frame);
  }

  /** The night frame (tracks, sidereal time) of the night whose evening is `date`, built once. */
  frame(date: string): NightFrame {
    let f = this.#frames.get(date);
    if (!f) {
      f = new NightFrame(this.site, nightOf(date, this.site.timeZone));
      this.#frames.set(date, f);
    }
    return f;
  }

  /** The night frame of the night containing `instant`. */
  frameAt(instant: Date): NightFrame {
    return this.frame(nightDateOf(instant, this.site.timeZone));
  }

  /** Local clock time in the site's locale and zone, rounded to the minute as pages show it: "21:05" (en-GB), "9:05 PM" (en-US). */
  clock(instant: Date): string {
    return formatClock(instant, this.site);
  }

  /** Local day in the site's locale and zone of the minute `instant` rounds to, e.g. "Wed 1 Mar". */
  day(instant: Date): string {
    return this.#day.format(roundInstant(instant, 'minute'));
  }

  /** "Wed 1 Mar at 21:05", "mié, 2 dic a las 9:05 p. m.". */
  when(instant: Date): string {
    return this.words.t('ev.when', { day: this.day(instant), clock: this.clock(instant) });
  }

  /** A body's name as a sentence reads it in the site's language ("the Moon", "la Luna", "Júpiter", a star's IAU name). */
  phrase(body: { id: string; name: string }): NamePhrase {
    return bodyPhrase(this.words.language, body);
  }

  /** A body's name as a title or label ("Moon", "Luna", "Júpiter"). */
  label(body: { id: string; name: string }): string {
    return bodyLabel(this.words.language, body);
  }

  /** "look east at 21:05" for a visibility's best moment, or null when it has none. */
  look(v: { azimuthDeg: number | null; time: Date | null }): string | null {
    return v.azimuthDeg !== null && v.time ? this.words.t('ev.look', { direction: this.direction(v.azimuthDeg), clock: this.clock(v.time) }) : null;
  }

  /** A compass word for an azimuth in the site's language. */
  direction(azimuthDeg: number): string {
    return this.words.compass(azimuthDeg).word;
  }
}
