/**
 * How near the Sun is too near: every threshold gloaming applies to a target's angle from the Sun,
 * or to the Sun's own height, defined once, each with what it means and where it comes from. They
 * differ on purpose: each answers its own question.
 *
 * | constant | degrees | question |
 * |---|---|---|
 * | `TOO_CLOSE_TO_SUN_DEG` | 8 | is a body lost near conjunction? (the visibility model's reason) |
 * | `GLARE_ELONGATION_DEG` | 10 | is an event's body lost in the Sun's glare? (the almanac's hidden reason) |
 * | `NEAR_SUN_DEG` | 15 | does a page showing this body carry the eye-safety caution? |
 * | `OPTICS_SUN_DEPRESSION_DEG` | 4 (below the horizon) | may binoculars and telescopes be recommended yet? |
 *
 * Elongations are geocentric angles between the body and the Sun.
 */

/** Below this elongation a body is reported as too close to the Sun (near conjunction), degrees. This project's choice. */
export const TOO_CLOSE_TO_SUN_DEG = 8;

/** Below this elongation an almanac event's body is reported as lost in the Sun's glare, degrees (common practice). */
export const GLARE_ELONGATION_DEG = 10;

/**
 * A target within this elongation (at local midnight of the night shown) brings the eye-safety
 * caution to the page: never point binoculars or a telescope at or near the Sun. This project's choice.
 */
export const NEAR_SUN_DEG = 15;

/**
 * Optics safety: binoculars and telescopes are recommended only while the Sun's centre is at least this far below
 * the horizon (geometric altitude ≤ −4°) … This project's choice, on the common-practice advice not to sweep with
 * binoculars near the Sun until it has fully set (and to stop well before it rises).
 */
export const OPTICS_SUN_DEPRESSION_DEG = 4;
/** … and at least this many minutes after sunset and before sunrise, whichever is the later in the evening and the earlier in the morning. */
export const OPTICS_SUN_MINUTES = 20;
