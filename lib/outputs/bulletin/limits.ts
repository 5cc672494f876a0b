/**
 * The size limit of a bulletin template. A template is rendered once per site and week, and a
 * page's HTML and CSS must stay under 40 KB on a phone; a template many times that size only makes
 * builds slow and pages unreadable (a 1 MB template took 50 s and 1.9 GB to build, 5 MB over 600 s
 * and 4 GB). The demo's weekly template is 1.6 KB.
 */
import { authorWords, type AuthorWords } from './messages.ts';

/** Largest template gloaming reads, bytes of UTF-8 (64 KiB). */
export const MAX_TEMPLATE_BYTES = 64 * 1024;

/**
 * Throws `invalid-value` when `text` is larger than `MAX_TEMPLATE_BYTES`, placed at the line and
 * column where the limit is crossed.
 */
export function assertTemplateSize(text: string, file: string, words: AuthorWords = authorWords()): void {
  const total = Buffer.byteLength(text, 'utf8');
  if (total <= MAX_TEMPLATE_BYTES) return;
  let bytes = 0;
  let line = 1;
  let column = 1;
  for (const ch of text) {
    bytes += Buffer.byteLength(ch, 'utf8');
    if (bytes > MAX_TEMPLATE_BYTES) break;
    if (ch === '\n') {
      line++;
      column = 1;
    } else column++;
  }
  const limit = MAX_TEMPLATE_BYTES / 1024;
  throw words.error('invalid-value', words.say('err.too-large', { size: (total / 1024).toFixed(0), limit }), {
    place: { file, line, column },
    expected: words.say('err.too-large-expected', { limit, page: 40 }),
    hint: words.say('err.too-large-hint'),
  });
}
