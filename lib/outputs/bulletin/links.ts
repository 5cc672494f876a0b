/**
 * `remarkSafeLinks`: a remark plugin that lets a bulletin link only to addresses a reader can
 * follow safely — `http:`, `https:`, `mailto:` and relative addresses (`/harbour-roof/`,
 * `../archive/`, `#tonight`). Any other scheme (`javascript:`, `data:`, `vbscript:`, `file:` …) in
 * a link, an image or a link reference definition stops the build with the place of the link.
 *
 * The scheme is read the way browsers read it (WHATWG URL Standard, "scheme state"): leading and
 * trailing C0 controls and spaces are ignored and tabs and line breaks inside are removed, so
 * `java\tscript:` or ` javascript:` cannot slip through; character references were already decoded
 * by the Markdown parser (`jav&#x61;script:` arrives as `javascript:`).
 */
import type { Nodes, Root } from 'mdast';
import type { VFile } from 'vfile';
import { quoteValue } from '../../core/errors.ts';
import type { Language } from '../../core/language/index.ts';
import { authorWords, quoted } from './messages.ts';
import { errorsOnFile, reportError, throwErrors } from './problems.ts';

/** Schemes a bulletin may link to. */
export const SAFE_URL_SCHEMES = ['http', 'https', 'mailto'] as const;

/** The scheme of `url` in lower case, or null for a relative address. */
export function urlScheme(url: string): string | null {
  // eslint-disable-next-line no-control-regex
  const cleaned = url.replace(/^[\u0000-\u0020]+|[\u0000-\u0020]+$/g, '').replace(/[\t\n\r]/g, '');
  const m = /^([a-zA-Z][a-zA-Z0-9+.-]*):/.exec(cleaned);
  return m ? m[1]!.toLowerCase() : null;
}

/** Whether a bulletin may publish `url`. */
export function isSafeUrl(url: string): boolean {
  const scheme = urlScheme(url);
  return scheme === null || (SAFE_URL_SCHEMES as readonly string[]).includes(scheme);
}

/**
 * The remark plugin: reports `invalid-value` on the file at the first unsafe link, image or
 * definition, and throws it there (`file:line:column` of the node).
 */
export function remarkSafeLinks(options: { language?: (file: VFile) => Language | undefined } = {}) {
  return (tree: Root, file: VFile): void => {
    const words = authorWords(options.language?.(file));
    const check = (node: Nodes): void => {
      if ((node.type === 'link' || node.type === 'image' || node.type === 'definition') && !isSafeUrl(node.url)) {
        const error = words.error('invalid-value', words.say(node.type === 'image' ? 'err.unsafe-image' : 'err.unsafe-link', { url: quoteValue(node.url), scheme: quoted(`${urlScheme(node.url)}:`) }), {
          expected: words.say('err.safe-address', { example: '/harbour-roof/' }),
        });
        reportError(file, error, node);
        throwErrors(errorsOnFile(file));
      }
      if ('children' in node) for (const child of node.children) check(child as Nodes);
    };
    check(tree);
  };
}
