/**
 * The almanac's vocabulary: event types with stable ids, the event value every search returns,
 * and the options of `findEvents`. Times are instants (`Date`, UTC inside); local times are made
 * only when an event is described or serialised, in the site's IANA zone (`lib/core/time.ts`).
 */

/** Stable event type ids (public: JSON, iCalendar CATEGORIES, placeholders). Add ids; never rename one. */
export const EVENT_TYPES = [
  'new-moon',
  'first-quarter',
  'full-moon',
  'last-quarter',
  'perigee',
  'apogee',
  'equinox',
  'solstice',
  'opposition',
  'conjunction',
  'greatest-elongation',
  'greatest-brilliancy',
  'stationary',
  'close-approach',
  'meteor-shower-peak',
  'lunar-eclipse',
  'solar-eclipse',
  'perihelion',
  'closest-approach-to-earth',
  'peak-brightness',
  'satellite-pass',
  'variable-minimum',
  'occultation',
] as const;

export type AlmanacEventType = (typeof EVENT_TYPES)[number];

/** Why an event cannot be seen from the site. */
export type EventHiddenReason =
  | 'below-horizon' // the body (or one of the two) is below the skyline whenever the sky is dark
  | 'daylight' // happens in daylight and the bodies are not up together in darkness that night
  | 'too-close-to-sun' // within a few degrees of the Sun: lost in its glare
  | 'no-darkness' // the Sun never gets low enough that night (high-latitude summer)
  | 'radiant-below-horizon' // meteor shower: the radiant stays down during the dark hours
  | 'sun-below-horizon' // solar eclipse: the Sun is down for the whole eclipse
  | 'too-faint'; // up in a dark sky, but the visibility model finds it too faint (or washed out) from the site

/** Whether, when and where an event can be seen from the site. */
export interface EventVisibility {
  visible: boolean;
  /**
   * Which moment the note refers to: `event` — the bodies are up in darkness at the event's own
   * time; `night` — not at the event's time, but at the best moment of the same night (local
   * noon to local noon); `none` — not visible that night.
   */
  moment: 'event' | 'night' | 'none';
  /** The moment the note describes (the event time, or the night's best moment); null when not visible. */
  time: Date | null;
  /** Apparent altitude of the (first) body at `time`, degrees. */
  altitudeDeg: number | null;
  /** Azimuth of the (first) body at `time`, degrees from north through east. */
  azimuthDeg: number | null;
  reason: EventHiddenReason | null;
  /** One sentence, local time, e.g. "Visible at 21:10, 25° up in the south-west." */
  note: string;
}

/** One contact or phase boundary of an eclipse. */
export interface EclipseContact {
  /** `P1`, `U1`, `U2`, `max`, `U3`, `U4`, `P4` (lunar); `C1`, `C2`, `max`, `C3`, `C4` (solar). */
  name: string;
  time: Date;
  /** Apparent altitude of the eclipsed body (Moon or Sun) at the contact, degrees. */
  altitudeDeg: number;
}

export interface EclipseDetails {
  /** `penumbral`, `partial`, `annular` or `total` (solar: as seen from the site). */
  kind: 'penumbral' | 'partial' | 'annular' | 'total';
  /** Fraction of the disc area covered at maximum, 0–1 (lunar: by the umbra). */
  obscuration: number;
  contacts: EclipseContact[];
}

export interface ShowerDetails {
  /** IAU Meteor Data Center three-letter code, e.g. `PER`. */
  code: string;
  /** Zenithal hourly rate at the peak (from the shower table). */
  zhr: number;
  /** Population index r. */
  populationIndex: number;
  /** Geocentric entry velocity, km/s. */
  velocityKmS: number;
  /** Best moment of the peak night for the site: largest expected hourly count. */
  best: { time: Date; radiantAltitudeDeg: number; radiantAzimuthDeg: number; limitingMagnitude: number; hourlyRate: number } | null;
  /** The same without moonlight: the count a moonless sky would give at its best moment. */
  moonlessHourlyRate: number;
  /** Lit fraction of the Moon at the peak, 0–1. */
  moonIlluminatedFraction: number;
  /** True when moonlight cuts the best expected count by more than a third. */
  moonInterferes: boolean;
}

/** One event of the almanac. */
export interface AlmanacEvent {
  type: AlmanacEventType;
  /** The instant of the event (exact phase, minimum separation, peak, mid-eclipse …). */
  time: Date;
  /** End of a lasting event (an eclipse's last contact), when there is one. */
  end?: Date;
  /** Ids of the bodies involved: body ids (`moon`, `jupiter`, `comet-lumen`), `star:<HIP>` for stars, `shower:<code>` for showers, `satellite:<id>` for satellites. */
  bodies: string[];
  /** Display names, in the order of `bodies`. */
  names: string[];
  /** Minimum geocentric separation for close approaches; greatest elongation from the Sun for elongations; degrees. */
  separationDeg?: number;
  visible: boolean;
  visibility: EventVisibility;
  /** Short title, e.g. "Moon near Jupiter". */
  title: string;
  /** One sentence a reader can act on, in local time. */
  description: string;
  /** Editorial interest, 0–100 (higher is more worth a reader's evening; see `score.ts`). */
  score: number;
  /** Safety caution that must be shown with the event (solar eclipses). */
  caution?: string;
  eclipse?: EclipseDetails;
  shower?: ShowerDetails;
  /** Further numbers for the type: distances (km, AU), magnitudes, elongation side. */
  data?: Record<string, number | string>;
}

/** Separation limits of close approaches, degrees (geocentric minimum separation). */
export interface ApproachLimits {
  /** The Moon and a planet or comet (default 4°). */
  moonPlanetDeg?: number;
  /** The Moon and a bright star (default 2°). */
  moonStarDeg?: number;
  /** Two planets, or a planet and a comet (default 3°). */
  planetPlanetDeg?: number;
  /** A planet, comet or asteroid and a bright star (default 1.5°). */
  planetStarDeg?: number;
}

export interface FindEventsOptions {
  /** Only these types (default: all). */
  types?: readonly AlmanacEventType[];
  approach?: ApproachLimits;
  /** Stars used for close approaches: brighter than this V magnitude (default 1.6). */
  starMagnitudeLimit?: number;
  /** Stars used for close approaches lie within this many degrees of the ecliptic (default 10). */
  starEclipticLatitudeDeg?: number;
  /** Planets taking part in close approaches (default the naked-eye planets Mercury–Saturn). */
  approachPlanets?: readonly string[];
  /** The Sun's highest geometric altitude (centre, airless) that counts as dark enough to see an event, degrees (default −6: from the end of civil twilight, as printed, to its start). */
  darkSunAltitudeDeg?: number;
  /** Order of the result: `time` (default) or `interest` (score, then time). */
  order?: 'time' | 'interest';
}
