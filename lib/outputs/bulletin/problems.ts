/**
 * Problems a template shows only for some sites and weeks: a value placeholder with no value (it
 * prints the neutral mark `–`), a repeated section with nothing to repeat, a page over the size
 * budget, a comet's elements too old for the build date (an object file's problem, once per run),
 * and errors. Each is a positioned message (`file:line:column`) with the site and week it
 * appeared for, so `gloaming check` and the build can list every one of them at once.
 */
import type { Nodes } from 'mdast';
import type { VFile } from 'vfile';
import { GloamingError, formatPlace, type ErrorCode, type Place } from '../../core/errors.ts';

/** What kind of problem: the names `gloaming check --json` prints. */
export type ProblemKind = 'fallback' | 'empty-section' | 'page-size' | 'stale-elements' | 'error';

export interface Problem {
  kind: ProblemKind;
  /** Warnings stop nothing unless the build is strict; errors stop the build. */
  severity: 'warning' | 'error';
  /** What is wrong and what would help, without the place. */
  message: string;
  place: Place;
  /** Site id and ISO week id (or one-off date) the problem appeared for, when it depends on them. */
  site?: string;
  week?: string;
  /** The error catalogue code, for errors. */
  code?: ErrorCode;
}

/** The mark a value placeholder prints when it has no value (an en dash). */
export const FALLBACK_MARK = '\u2013';

/** How many problems a run collects before it stops looking (the rest are counted, not listed). */
export const PROBLEM_LIMIT = 200;

/** One line, as the build prints its errors: `warning: file:line:column: message (site x, week y)`. */
export function formatProblem(p: Problem): string {
  const where = formatPlace(p.place);
  const context = [p.site && `site ${p.site}`, p.week && `week ${p.week}`].filter(Boolean).join(', ');
  return `${p.severity}: ${where ? `${where}: ` : ''}${p.message}${context ? ` (${context})` : ''}`;
}

/** An error as a problem. */
export function problemOfError(error: GloamingError, context: { site?: string; week?: string } = {}): Problem {
  return { kind: 'error', severity: 'error', message: error.detail, place: error.place ?? {}, code: error.code, ...context };
}

/**
 * Several errors found in one pass (every placeholder of a template is checked before any stops
 * the run). Its code and place are the first error's; its message lists all of them, one a line.
 */
export class TemplateErrors extends GloamingError {
  readonly errors: readonly GloamingError[];

  constructor(errors: readonly GloamingError[]) {
    const first = errors[0]!;
    super(first.code, first.reason, {
      ...(first.place ? { place: first.place } : {}),
      ...(first.hasActual ? { actual: first.actual } : {}),
      ...(first.expected ? { expected: first.expected } : {}),
      ...(first.hint ? { hint: first.hint } : {}),
      wording: first.wording,
    });
    Object.defineProperty(this, 'message', { value: errors.map((e) => e.message).join('\n') });
    this.errors = errors;
  }
}

/** Throws nothing for no errors, the error itself for one, and `TemplateErrors` for several. */
export function throwErrors(errors: readonly GloamingError[]): void {
  if (errors.length === 1) throw errors[0]!;
  if (errors.length > 1) throw new TemplateErrors(errors);
}

/** Source of the messages gloaming leaves on a file. */
const SOURCE = 'gloaming';

/**
 * Reports `error` on `file` as a fatal message at the node (its start) or point it is about, the
 * unified way (`file.message`); `errorsOnFile` turns such messages back into placed errors.
 */
export function reportError(file: VFile, error: GloamingError, at: Nodes | { line: number; column: number } | undefined): void {
  const message = file.message(error.detail, { ...(at ? { place: 'type' in at ? at.position : at } : {}), ruleId: error.code, source: SOURCE, cause: error });
  message.fatal = true;
}

/** Reports a warning of `kind` on `file` at `node`. */
export function reportWarning(file: VFile, kind: ProblemKind, node: Nodes, text: string): void {
  file.message(text, { ...(node.position ? { place: node.position } : {}), ruleId: kind, source: SOURCE });
}

function placeOnFile(file: VFile, line: number | undefined, column: number | undefined): Place {
  return { file: file.path ?? '<markdown>', ...(line !== undefined ? { line } : {}), ...(column !== undefined ? { column } : {}) };
}

/** The errors reported on `file` by `reportError`, each placed at `file:line:column`, in order of place. */
export function errorsOnFile(file: VFile): GloamingError[] {
  return file.messages
    .filter((m) => m.fatal === true && m.source === SOURCE && m.cause instanceof GloamingError)
    .map((m) => (m.cause as GloamingError).at(placeOnFile(file, m.line, m.column)))
    .sort((a, b) => (a.place?.line ?? 0) - (b.place?.line ?? 0) || (a.place?.column ?? 0) - (b.place?.column ?? 0));
}

/** The warnings reported on `file` by `reportWarning`, as problems of the site and week the file was rendered for. */
export function warningsOnFile(file: VFile, context: { site?: string; week?: string } = {}): Problem[] {
  return file.messages
    .filter((m) => m.fatal === false && m.source === SOURCE)
    .map((m) => ({ kind: m.ruleId as ProblemKind, severity: 'warning' as const, message: m.reason, place: placeOnFile(file, m.line, m.column), ...context }));
}

/** The separate errors inside an error (one, or each of a `TemplateErrors`). */
export function errorsOf(error: GloamingError): readonly GloamingError[] {
  return error instanceof TemplateErrors ? error.errors : [error];
}

/**
 * Collects problems up to `limit`; identical problems (same kind, place and message, e.g. a
 * fallback seen for many sites) are kept once per site and week, and the count past the limit is kept.
 */
export class ProblemList {
  readonly items: Problem[] = [];
  /** Problems not kept because the limit was reached. */
  dropped = 0;
  readonly #seen = new Set<string>();
  readonly limit: number;

  constructor(limit = PROBLEM_LIMIT) {
    this.limit = limit;
  }

  add(problem: Problem): void {
    const key = JSON.stringify([problem.kind, problem.severity, formatPlace(problem.place), problem.message, problem.site, problem.week]);
    if (this.#seen.has(key)) return;
    this.#seen.add(key);
    if (this.items.length >= this.limit) this.dropped++;
    else this.items.push(problem);
  }

  get full(): boolean {
    return this.items.length >= this.limit;
  }

  get errors(): Problem[] {
    return this.items.filter((p) => p.severity === 'error');
  }

  get warnings(): Problem[] {
    return this.items.filter((p) => p.severity === 'warning');
  }
}
