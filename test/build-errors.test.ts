/**
 * One exit-code convention for the command line and the build (issue #14 §7, docs/deploy.md):
 * 2 for input problems, 1 for unexpected failures; an error found inside Astro keeps its code.
 * These run without Astro: the errors are handed over the way Astro does it (the library's own
 * error, thrown by the integration's session, as the `cause` of Astro's error).
 */
import { describe, expect, it } from 'vitest';
import { asGloamingError, report } from '../scripts/build.ts';
import { main } from '../lib/outputs/cli/main.ts';
import { EXIT_CODES, GloamingError } from '../lib/core/errors.ts';

/** An error as Astro passes on one thrown by a content loader: wrapped, with the original as `cause`. */
function wrapped(error: GloamingError): Error {
  return new Error('[AstroUserError] An error occurred while syncing content', { cause: error });
}

describe('build errors keep their codes; exit codes match the command line', () => {
  const inner = new GloamingError('unknown-body', "unknown body 'jupyter'", { place: { file: 'content/bulletins/weekly.md', line: 43, column: 1, field: 'body' }, hint: "did you mean 'jupiter'?" });

  it('an error from inside Astro is the one thrown, with its code, place and message (not rebuilt)', () => {
    const found = asGloamingError(wrapped(inner));
    expect(found).toBe(inner);
    expect(found?.code).toBe('unknown-body');
    expect(found?.place).toEqual(inner.place);
  });

  it('input problems exit with the command line’s code for bad input, without a stack', () => {
    const lines: string[] = [];
    expect(report(wrapped(inner), (l) => lines.push(l))).toBe(EXIT_CODES.input);
    expect(lines).toEqual([`error: ${inner.message}`]);
    const cli = main(['night', '--lat', '95', '--lon', '0', '--tz', 'UTC', '--date', '2026-01-01'], () => {}, () => {});
    expect(cli).toBe(EXIT_CODES.input);
    expect(EXIT_CODES.input).toBe(2);
  });

  it('an unexpected failure exits with 1 and prints the stack', () => {
    const lines: string[] = [];
    expect(report(new TypeError('boom'), (l) => lines.push(l))).toBe(EXIT_CODES.unexpected);
    expect(EXIT_CODES.unexpected).toBe(1);
    expect(lines.join('\n')).toMatch(/TypeError: boom\n\s+at /);
  });
});
