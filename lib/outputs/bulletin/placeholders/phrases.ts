/**
 * The phrases placeholders print when an event does not happen, and the Moon's phase names as
 * words inside a sentence.
 */
import type { MissingReason } from '../../../core/events.ts';
import { PHASE_LABEL } from '../../../core/moon.ts';

export const RISE_PHRASES: Record<MissingReason, string> = {
  'always-below': 'does not rise this night',
  'always-above': 'stays up all night',
  'outside-night': 'does not rise this night',
  'stays-above': 'stays up all night',
  'stays-below': 'does not rise this night',
};
export const SET_PHRASES: Record<MissingReason, string> = {
  ...RISE_PHRASES,
  'always-above': 'does not set this night',
  'outside-night': 'does not set this night',
  'stays-above': 'does not set this night',
};
export const TRANSIT_PHRASES: Record<MissingReason, string> = {
  'always-below': 'does not cross the meridian this night',
  'always-above': 'does not cross the meridian this night',
  'outside-night': 'does not cross the meridian this night',
  'stays-above': 'does not cross the meridian this night',
  'stays-below': 'does not cross the meridian this night',
};
export const SUN_PHRASES: Record<MissingReason, string> = {
  'always-above': 'the Sun stays up all night',
  'stays-above': 'the Sun stays up all night',
  'always-below': 'the Sun stays below the horizon all day',
  'stays-below': 'the Sun stays below the horizon all day',
  'outside-night': 'not during this night',
};
export const TWILIGHT_DEPTH_DEG = { civil: 6, nautical: 12, astronomical: 18 } as const;
export type TwilightKind = keyof typeof TWILIGHT_DEPTH_DEG;

export function twilightPhrases(kind: TwilightKind): Record<MissingReason, string> {
  const depth = TWILIGHT_DEPTH_DEG[kind];
  const light = `no ${kind} darkness this night: the Sun stays less than ${depth}° below the horizon`;
  const dark = `dark all day: the Sun stays more than ${depth}° below the horizon`;
  return { 'stays-above': light, 'always-above': light, 'stays-below': dark, 'always-below': dark, 'outside-night': 'not during this night' };
}


export const PHASE_WORDS: Record<keyof typeof PHASE_LABEL, string> = Object.fromEntries(
  Object.entries(PHASE_LABEL).map(([k, v]) => [k, v.charAt(0).toLowerCase() + v.slice(1)]),
) as Record<keyof typeof PHASE_LABEL, string>;
