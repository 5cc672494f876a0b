/**
 * Safety of output and of readers. `assertPublishable` is the last check before a page is written:
 * a value that failed silently (NaN, `undefined`, an invalid date, an empty placeholder) must
 * never reach a reader. The eye-safety cautions are plain sentences a page shows verbatim.
 */
import type { Body } from '../../core/body.ts';
import { GloamingError } from '../../core/errors.ts';
import { NEAR_SUN_DEG } from '../../models/near-sun.ts';
import type { WeekData } from '../../models/week.ts';

/** A body a page shows, and the night (0–6 of the week) it shows it for. */
export interface ShownBody {
  body: Body;
  night: number;
}

/**
 * The eye-safety pass over a rendered page: the bodies that bring the near-Sun caution, in the
 * order first met. A body the front matter lists counts when it is within `NEAR_SUN_DEG` of the
 * Sun on any night of the week (the Sun itself always); a body a placeholder shows counts when it
 * is that near on the night shown.
 */
export function nearSunBodies(week: WeekData, input: { listed: readonly Body[]; shown: readonly ShownBody[] }): Body[] {
  const near = new Map<string, Body>();
  for (const body of input.listed) {
    if (body.kind === 'sun' || week.nights.some((_, i) => week.elongationDeg(i, body) < NEAR_SUN_DEG)) near.set(body.id, body);
  }
  for (const { body, night } of input.shown) {
    if (body.kind !== 'sun' && week.elongationDeg(night, body) < NEAR_SUN_DEG) near.set(body.id, body);
  }
  return [...near.values()];
}
import { wordsFor, type Words } from '../../core/language/index.ts';

const ENGLISH = wordsFor('en');

/** Shown when a bulletin's target is close to the Sun in the sky (names as sentences read them: "the Moon"). Our own wording, in the language of `words`. */
export function nearSunCaution(names: readonly string[], words: Words = ENGLISH): string {
  const list = names.length === 0 ? words.t('caution.a-target') : words.list(names);
  return words.t('caution.near-sun', { count: Math.max(1, names.length), names: `${list.charAt(0).toUpperCase()}${list.slice(1)}` });
}

/** Shown on every eclipse bulletin: never look at the Sun unprotected, only ISO 12312-2 viewers. Our own wording, in the language of `words`. */
export function eclipseCaution(words: Words = ENGLISH): string {
  return words.t('caution.eclipse');
}

/** The English eclipse caution. */
export const ECLIPSE_CAUTION = eclipseCaution();

const FORBIDDEN: { pattern: RegExp; what: string }[] = [
  { pattern: /\bNaN\b/, what: 'NaN' },
  { pattern: /\bundefined\b/, what: "'undefined'" },
  { pattern: /Invalid Date/, what: "'Invalid Date'" },
  { pattern: /<([a-z]+)\b[^>]*\bclass="gl(?: [^"]*)?"[^>]*>\s*<\/\1>/, what: 'an empty placeholder element' },
];

function lineColumn(text: string, index: number): { line: number; column: number } {
  const before = text.slice(0, index).split('\n');
  return { line: before.length, column: before[before.length - 1]!.length + 1 };
}

/**
 * Refuses HTML that contains `NaN`, `undefined`, `Invalid Date` or an empty placeholder element
 * (class `gl …` with no content): throws `unsafe-output` with the place in the HTML.
 */
export function assertPublishable(html: string, file: string): void {
  for (const { pattern, what } of FORBIDDEN) {
    const m = pattern.exec(html);
    if (m) {
      throw new GloamingError('unsafe-output', `the page contains ${what} and will not be published`, {
        place: { file, ...lineColumn(html, m.index) },
        actual: html.slice(Math.max(0, m.index - 30), m.index + m[0].length + 30),
        hint: 'a value failed to compute; fix the template or report the bug',
      });
    }
  }
}
