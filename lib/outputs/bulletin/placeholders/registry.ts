/**
 * The placeholder vocabulary: one table, one entry per placeholder, gathered from the families
 * (times, positions, the Moon, visibility, deep-sky objects, charts, events, satellite passes). An entry names the placeholder, says
 * whether it is written inline (`:name{…}`) or as a block on its own line (`::name{…}`), lists
 * its attributes with types and defaults, gives an example for the docs, says which bodies it
 * shows (for the eye-safety pass), and renders from the shared week data (`WeekData`). Adding a
 * placeholder is adding one entry to its family.
 *
 * Output is semantic HTML: `<time datetime>` for instants and dates, `<data value>` for numbers,
 * `data-*` attributes carrying the exact values, and classes `gl gl-<name>` for styling.
 */
import type { PlaceholderSpec } from './call.ts';
import { CHART_PLACEHOLDERS } from './charts.ts';
import { DEEP_SKY_PLACEHOLDERS } from './deep-sky.ts';
import { EVENT_PLACEHOLDERS } from './events.ts';
import { MOON_PLACEHOLDERS } from './moon.ts';
import { PASS_PLACEHOLDERS } from './passes.ts';
import { POSITION_PLACEHOLDERS } from './positions.ts';
import { TIME_PLACEHOLDERS } from './times.ts';
import { VISIBILITY_PLACEHOLDERS } from './visibility.ts';

export type { PlaceholderCall, PlaceholderSpec } from './call.ts';

/** Every placeholder by name, in the order of the documentation table. */
export const PLACEHOLDERS: ReadonlyMap<string, PlaceholderSpec> = new Map(
  [...TIME_PLACEHOLDERS, ...POSITION_PLACEHOLDERS, ...MOON_PLACEHOLDERS, ...VISIBILITY_PLACEHOLDERS, ...DEEP_SKY_PLACEHOLDERS, ...CHART_PLACEHOLDERS, ...EVENT_PLACEHOLDERS, ...PASS_PLACEHOLDERS].map((d) => [d.name, d]),
);
