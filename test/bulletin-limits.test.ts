/**
 * The template size limit (issue #14 §4): a template over MAX_TEMPLATE_BYTES (64 KiB) stops with
 * an error placed at the line and column where the limit is crossed; one just under it is read.
 */
import { describe, expect, it } from 'vitest';
import { parseBulletin } from '../lib/outputs/bulletin/index.ts';
import { MAX_TEMPLATE_BYTES } from '../lib/outputs/bulletin/limits.ts';
import { GloamingError } from '../lib/core/errors.ts';

const FRONT = '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n'; // 5 lines
const LINE = 'The Moon and Jupiter are close tonight — look south-east after dark. ✨\n';

describe('template size limit', () => {
  it('refuses a template over 64 KiB at the line and column where the limit is crossed', () => {
    const lineBytes = Buffer.byteLength(LINE);
    const count = Math.ceil(MAX_TEMPLATE_BYTES / lineBytes) + 10;
    const text = FRONT + LINE.repeat(count);
    let error: unknown;
    try {
      parseBulletin(text, 'content/bulletins/huge.md');
    } catch (e) {
      error = e;
    }
    expect(error).toBeInstanceOf(GloamingError);
    // Bytes before line L: front matter, then whole body lines; the crossing byte is the 65,537th.
    const frontBytes = Buffer.byteLength(FRONT);
    const bodyLine = Math.floor((MAX_TEMPLATE_BYTES - frontBytes) / lineBytes);
    const line = 5 + bodyLine + 1;
    const before = MAX_TEMPLATE_BYTES - frontBytes - bodyLine * lineBytes; // bytes of that line within the limit
    const column = [...LINE].reduce((acc, ch) => (acc.bytes + Buffer.byteLength(ch) <= before ? { bytes: acc.bytes + Buffer.byteLength(ch), col: acc.col + 1 } : acc), { bytes: 0, col: 1 }).col;
    expect((error as GloamingError).message).toMatch(new RegExp(`^content/bulletins/huge\\.md:${line}:${column}: the template is \\d+ KiB, more than the 64 KiB`));
    expect((error as GloamingError).code).toBe('invalid-value');
  });

  it('reads a template just under the limit', () => {
    const text = FRONT + 'x'.repeat(MAX_TEMPLATE_BYTES - Buffer.byteLength(FRONT));
    expect(Buffer.byteLength(text)).toBe(MAX_TEMPLATE_BYTES);
    expect(parseBulletin(text, 'ok.md').frontMatter.title).toBe('T');
  });
});
