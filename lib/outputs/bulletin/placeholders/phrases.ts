/**
 * The phrases placeholders print when an event does not happen, and the Moon's phase names as
 * words inside a sentence.
 */
import type { MissingReason } from '../../../core/events.ts';
import type { MessageKey } from '../../../core/language/index.ts';

/** Catalogue keys of the phrases for an event that does not happen, by reason (lib/core/language). */
export type MissingPhrases = Readonly<Record<MissingReason, MessageKey>>;

export const RISE_PHRASES: MissingPhrases = {
  'always-below': 'missing.does-not-rise',
  'always-above': 'missing.stays-up',
  'outside-night': 'missing.does-not-rise',
  'stays-above': 'missing.stays-up',
  'stays-below': 'missing.does-not-rise',
};
export const SET_PHRASES: MissingPhrases = {
  ...RISE_PHRASES,
  // Under a "set" heading, a body that never rose is said to stay down, not "does not rise".
  'always-below': 'missing.always-below',
  'stays-below': 'missing.always-below',
  'always-above': 'missing.does-not-set',
  'outside-night': 'missing.does-not-set',
  'stays-above': 'missing.does-not-set',
};
export const TRANSIT_PHRASES: MissingPhrases = {
  'always-below': 'missing.no-transit',
  'always-above': 'missing.no-transit',
  'outside-night': 'missing.no-transit',
  'stays-above': 'missing.no-transit',
  'stays-below': 'missing.no-transit',
};
export const SUN_PHRASES: MissingPhrases = {
  'always-above': 'missing.sun-stays-up',
  'stays-above': 'missing.sun-stays-up',
  'always-below': 'missing.sun-stays-down',
  'stays-below': 'missing.sun-stays-down',
  'outside-night': 'missing.not-this-night',
};
export const TWILIGHT_DEPTH_DEG = { civil: 6, nautical: 12, astronomical: 18 } as const;
export type TwilightKind = keyof typeof TWILIGHT_DEPTH_DEG;
