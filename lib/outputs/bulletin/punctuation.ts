/**
 * Punctuation where a template's words meet a placeholder's value (a rehype plugin that runs
 * after the placeholders are replaced):
 *
 * - no doubled full stop: "se pone a las :sunset." with a value that ends in an abbreviation's
 *   full stop ("8:47 p. m.") reads "a las 8:47 p. m.", not "p. m.." (the abbreviation's stop ends
 *   the sentence; common usage in every language with such abbreviations);
 * - Spanish "a las"/"desde las" before a clock time of one o'clock reads "a la 1:05", "desde la
 *   1:05" (the article agrees with the hour; common usage, from memory).
 */
import type { Element, ElementContent, Root, RootContent, Text } from 'hast';
import type { Language } from '../../core/language/index.ts';

function textOf(node: ElementContent | RootContent): string {
  if (node.type === 'text') return node.value;
  if (node.type === 'element') return node.children.map(textOf).join('');
  return '';
}

function isPlaceholder(node: ElementContent | RootContent | undefined): node is Element {
  if (!node || node.type !== 'element') return false;
  const cls = node.properties.className;
  return (Array.isArray(cls) && cls.includes('gl')) || node.tagName === 'time';
}

/** The language's fixes of text before and after a placeholder's value. */
function tidyChildren(children: (ElementContent | RootContent)[], language: Language): void {
  for (let i = 0; i < children.length; i++) {
    const node = children[i]!;
    if (node.type === 'element') tidyChildren(node.children, language);
    if (!isPlaceholder(node)) continue;
    const value = textOf(node).trimEnd();
    const next = children[i + 1];
    if (next?.type === 'text' && /[.…]$/.test(value) && next.value.startsWith('.')) (next as Text).value = next.value.slice(1);
    const before = children[i - 1];
    if (language === 'es' && before?.type === 'text' && /^0?1[:.]\d/.test(value)) {
      (before as Text).value = before.value.replace(/(^|[^\p{L}])([Aa]|[Dd]esde) las $/u, '$1$2 la ');
    }
  }
}

/** The rehype plugin: `options.language` is the page's. */
export function rehypeTidyPunctuation(options: { language: (file: { data: Record<string, unknown> }) => Language }) {
  return (tree: Root, file: { data: Record<string, unknown> }): void => {
    tidyChildren(tree.children, options.language(file));
  };
}
