/**
 * One exit-code convention for the command line and the build (issue #14 §7, docs/deploy.md):
 * 2 for input problems, 1 for unexpected failures; an error found inside Astro keeps its code.
 * These run without Astro: the errors are made the way Astro's module runner hands them over
 * (another copy of the GloamingError class, wrapped in Astro's own error as `cause`).
 */
import { describe, expect, it } from 'vitest';
import { asGloamingError, report } from '../scripts/build.ts';
import { main } from '../lib/outputs/cli/main.ts';
import { EXIT_CODES, GloamingError } from '../lib/core/errors.ts';

/** A GloamingError as another module instance makes it: same shape, different class. */
function foreign(error: GloamingError): Error {
  const copy = new Error(error.message);
  Object.assign(copy, { name: 'GloamingError', code: error.code, place: error.place, reason: error.reason });
  const astro = new Error('[AstroUserError] An error occurred while rendering', { cause: copy });
  return astro;
}

describe('build errors keep their codes; exit codes match the command line', () => {
  const inner = new GloamingError('unknown-body', "unknown body 'jupyter'", { place: { file: 'content/bulletins/weekly.md', line: 43, column: 1, field: 'body' }, hint: "did you mean 'jupiter'?" });

  it('an error from inside Astro keeps its code, place and message', () => {
    const found = asGloamingError(foreign(inner));
    expect(found?.code).toBe('unknown-body');
    expect(found?.place).toEqual(inner.place);
    expect(found?.message).toBe(inner.message);
  });

  it('input problems exit with the command line’s code for bad input, without a stack', () => {
    const lines: string[] = [];
    expect(report(foreign(inner), (l) => lines.push(l))).toBe(EXIT_CODES.input);
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
