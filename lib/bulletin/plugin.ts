/**
 * `remarkPlaceholders`: the remark plugin that turns placeholder directives (parsed by
 * `remark-directive`) into semantic HTML nodes for `remark-rehype`. It only reads the syntax tree
 * and the week data; it knows nothing of Astro, files or the clock, so any unified pipeline can
 * use it:
 *
 * ```ts
 * unified().use(remarkParse).use(remarkDirective)
 *   .use(remarkPlaceholders, { scope: () => ({ site, week, bodies }) })
 *   .use(remarkRehype).use(rehypeStringify)
 * ```
 *
 * Problems are `GloamingError`s placed at the directive (`file:line:column`, with the template's
 * body offset added), with what is wrong and a suggestion. All placeholders of a document are
 * checked before any is computed.
 */
import type { ElementContent } from 'hast';
import type { Nodes, Root, Text } from 'mdast';
import type { ContainerDirective, LeafDirective, TextDirective } from 'mdast-util-directive';
import type { VFile } from 'vfile';
import type { Body, BodyRegistry } from '../body.ts';
import { GloamingError, didYouMean, type Place } from '../errors.ts';
import type { Site } from '../site.ts';
import type { IsoWeek } from '../time.ts';
import { readAttribute, type AttributeValue, type ReadContext } from './attributes.ts';
import { defaultClock, type Clock } from './format.ts';
import { PLACEHOLDERS, type PlaceholderCall, type PlaceholderSpec } from './placeholders.ts';
import { WeekCache, type WeekData } from './week.ts';
import type { ChartOutput } from './types.ts';

/** What the placeholders of one document are about. */
export interface PlaceholderScope {
  site: Site;
  week: IsoWeek;
  bodies: BodyRegistry;
  /** Local date (inside `week`) of the default night; Monday of the week when absent. */
  defaultNight?: string;
  /** Shared week data; a private cache is used when absent. */
  cache?: WeekCache;
  /** File name for error places (default: the vfile's path). */
  file?: string;
  /** Added to directive line numbers, e.g. the number of front matter lines (`bodyLine − 1`). */
  lineOffset?: number;
  /** Finder charts for `::chart` (see `ChartOutput`). */
  charts?: ChartOutput;
}

export interface RemarkPlaceholdersOptions {
  /** Gives the site, week and bodies of the document being processed. */
  scope: (file: VFile) => PlaceholderScope;
}

/** What the plugin leaves in `file.data.placeholders`. */
export interface PlaceholderReport {
  /** Number of placeholders rendered. */
  count: number;
  /** Bodies a placeholder showed while they were within `NEAR_SUN_DEG` of the Sun. */
  nearSun: Body[];
}

declare module 'vfile' {
  interface DataMap {
    placeholders: PlaceholderReport;
  }
}

type Directive = TextDirective | LeafDirective | ContainerDirective;

interface Checked {
  node: Directive;
  spec: PlaceholderSpec;
  attrs: Map<string, AttributeValue>;
  given: Set<string>;
}

const DIRECTIVE_TYPES = new Set(['textDirective', 'leafDirective', 'containerDirective']);
/** Directive-looking text that the directive parser did not accept (e.g. an unclosed `{`). */
const LEFTOVER_RE = /(^|[^\\:\w]):{1,3}([a-zA-Z][\w-]*)(\{|\[)/;
/** A block placeholder written inside a paragraph. */
const INLINE_BLOCK_RE = /(^|\s)::([a-zA-Z][\w-]*)/;

/**
 * Gathers directives and text nodes. A text directive whose name starts with a digit is prose
 * that happens to contain a colon (`21:00`, `1:2`): it is turned back into its literal text.
 */
function collect(node: Nodes, directives: Directive[], texts: Text[]): void {
  if (DIRECTIVE_TYPES.has(node.type)) directives.push(node as Directive);
  else if (node.type === 'text') texts.push(node);
  if (!('children' in node)) return;
  const children = node.children as Nodes[];
  for (let i = 0; i < children.length; i++) {
    const child = children[i]!;
    if (child.type === 'textDirective' && /^\d/.test(child.name) && Object.keys(child.attributes ?? {}).length === 0 && child.children.length === 0) {
      const literal: Text = { type: 'text', value: `:${child.name}`, ...(child.position ? { position: child.position } : {}) };
      children[i] = literal;
      texts.push(literal);
      continue;
    }
    const next = children[i + 1];
    if (DIRECTIVE_TYPES.has(child.type) && next?.type === 'text' && /^[{[]/.test(next.value)) malformed.add(child as Directive);
    collect(child, directives, texts);
  }
}

/** Directives followed directly by a `{` or `[` the parser could not read (unclosed brace, stray quote). */
const malformed = new WeakSet<Directive>();

function written(node: Directive): string {
  const colons = node.type === 'textDirective' ? ':' : node.type === 'leafDirective' ? '::' : ':::';
  return `${colons}${node.name}`;
}

/** Checks one directive against the table and reads its attributes; errors carry no place yet. */
function check(node: Directive, read: ReadContext, defaults: { night: number; clock: Clock }): Checked {
  const spec = PLACEHOLDERS.get(node.name);
  if (malformed.has(node)) {
    throw new GloamingError('invalid-placeholder', `the attributes of '${written(node)}' cannot be read`, {
      expected: `name=value pairs separated by spaces inside { }, e.g. ${spec?.example ?? ':rise{body=jupiter night=fri}'}`,
      hint: 'check for a missing } or an unbalanced quote',
    });
  }
  if (!spec) {
    const hint = didYouMean(node.name, PLACEHOLDERS.keys());
    throw new GloamingError('unknown-placeholder', `unknown placeholder '${written(node)}'`, {
      expected: 'a placeholder listed in lib/bulletin/PLACEHOLDERS.md',
      ...(hint ? { hint } : { hint: 'write \\: to keep a literal colon before a word' }),
    });
  }
  if (node.type === 'containerDirective') {
    throw new GloamingError('invalid-placeholder', `'${written(node)}' is written as a container, which no placeholder is`, {
      hint: spec.form === 'block' ? `write ::${spec.name} on a line of its own` : `write :${spec.name} inside a sentence`,
    });
  }
  if (spec.form === 'block' && node.type === 'textDirective') {
    throw new GloamingError('invalid-placeholder', `':${spec.name}' is a block placeholder`, { hint: `write ::${spec.name} on a line of its own` });
  }
  if (spec.form === 'inline' && node.type === 'leafDirective') {
    throw new GloamingError('invalid-placeholder', `'::${spec.name}' is an inline placeholder`, { hint: `write :${spec.name} inside a sentence` });
  }
  if (node.children.length > 0) {
    throw new GloamingError('invalid-placeholder', `'${written(node)}' takes no [label]`, { hint: `attributes go in braces, e.g. ${spec.example}` });
  }
  const attrs = new Map<string, AttributeValue>();
  const given = new Set<string>();
  for (const [name, raw] of Object.entries(node.attributes ?? {})) {
    const attr = spec.attributes[name];
    if (!attr) {
      const names = Object.keys(spec.attributes);
      const hint = didYouMean(name, names);
      throw new GloamingError('invalid-placeholder', `unknown attribute '${name}' on '${written(node)}'`, {
        place: { field: name },
        expected: names.length ? `one of ${names.join(', ')}` : 'no attributes',
        ...(hint ? { hint } : {}),
      });
    }
    try {
      attrs.set(name, readAttribute(name, raw ?? '', attr.type, read));
    } catch (error) {
      if (error instanceof GloamingError) throw error.at({ field: name });
      throw error;
    }
    given.add(name);
  }
  for (const [name, attr] of Object.entries(spec.attributes)) {
    if (attrs.has(name)) continue;
    if (attr.required) {
      throw new GloamingError('invalid-placeholder', `'${written(node)}' needs the attribute '${name}'`, {
        place: { field: name },
        expected: attr.doc,
        hint: `e.g. ${spec.example}`,
      });
    }
    if (attr.type.kind === 'night') attrs.set(name, defaults.night);
    else if (attr.type.kind === 'clock') attrs.set(name, defaults.clock);
    else if (attr.default !== undefined) attrs.set(name, readAttribute(name, attr.default, attr.type, read));
  }
  return { node, spec, attrs, given };
}

function textPlace(node: Text, index: number): { line?: number; column?: number } {
  const start = node.position?.start;
  if (!start) return {};
  const before = node.value.slice(0, index);
  const lines = before.split('\n');
  return lines.length === 1 ? { line: start.line, column: start.column + index } : { line: start.line + lines.length - 1, column: lines[lines.length - 1]!.length + 1 };
}

/** Raises on text that looks like a placeholder but was not parsed as one. */
function checkLeftovers(texts: Text[], placeAt: (p: { line?: number; column?: number }) => Place): void {
  for (const node of texts) {
    const block = INLINE_BLOCK_RE.exec(node.value);
    if (block && PLACEHOLDERS.has(block[2]!)) {
      const index = block.index + block[1]!.length;
      throw new GloamingError('invalid-placeholder', `'::${block[2]}' must stand on a line of its own`, {
        place: placeAt(textPlace(node, index)),
        hint: PLACEHOLDERS.get(block[2]!)!.form === 'inline' ? `inside a sentence write :${block[2]}` : 'put it on its own line, with blank lines around it',
      });
    }
    const m = LEFTOVER_RE.exec(node.value);
    if (m) {
      const index = m.index + m[1]!.length;
      throw new GloamingError('invalid-placeholder', `malformed placeholder '${node.value.slice(index, index + 40).split('\n')[0]}'`, {
        place: placeAt(textPlace(node, index)),
        expected: 'attributes in braces as name=value pairs separated by spaces, e.g. :rise{body=jupiter night=fri}',
        hint: 'check for a missing } or a stray quote; write \\: for a literal colon',
      });
    }
  }
}

/** Sets a directive node's output: `remark-rehype` turns it into the rendered element. */
function replaceWith(node: Directive, output: ElementContent): void {
  if (output.type === 'element') {
    node.data = { hName: output.tagName, hProperties: output.properties, hChildren: output.children };
  } else {
    node.data = { hName: 'span', hProperties: {}, hChildren: [output] };
  }
}

/**
 * The remark plugin. Replaces every placeholder directive in the tree by its rendered value for
 * the scope's site and week, and leaves `file.data.placeholders` ({ count, nearSun }).
 */
export function remarkPlaceholders(options: RemarkPlaceholdersOptions) {
  return (tree: Root, file: VFile): undefined => {
    const scope = options.scope(file);
    const fileName = scope.file ?? file.path ?? '<markdown>';
    const offset = scope.lineOffset ?? 0;
    const placeAt = (p: { line?: number; column?: number }): Place => ({
      file: fileName,
      ...(p.line !== undefined ? { line: p.line + offset } : {}),
      ...(p.column !== undefined ? { column: p.column } : {}),
    });
    const directives: Directive[] = [];
    const texts: Text[] = [];
    collect(tree, directives, texts);

    const days = scope.week.days;
    const defaultNight = scope.defaultNight === undefined ? 0 : days.indexOf(scope.defaultNight);
    if (defaultNight < 0) {
      throw new GloamingError('invalid-date', `the default night ${scope.defaultNight} is not in the week ${scope.week.id}`, { place: { file: fileName } });
    }
    const read: ReadContext = { bodies: scope.bodies, days };
    const defaults = { night: defaultNight, clock: defaultClock(scope.site.locale) };
    const checked = directives.map((node) => {
      try {
        return check(node, read, defaults);
      } catch (error) {
        if (error instanceof GloamingError) {
          const start = node.position?.start;
          throw error.at(placeAt(start ? { line: start.line, column: start.column } : {}));
        }
        throw error;
      }
    });
    checkLeftovers(texts, placeAt);

    const nearSun = new Map<string, Body>();
    let week: WeekData | undefined;
    for (const c of checked) {
      week ??= (scope.cache ?? new WeekCache()).get(scope.site, scope.week, scope.bodies);
      const call: PlaceholderCall = {
        name: c.spec.name,
        site: scope.site,
        week,
        night: c.attrs.get('night') as number | undefined ?? defaultNight,
        clock: (c.attrs.get('clock') as Clock | undefined) ?? defaults.clock,
        attrs: c.attrs,
        given: c.given,
        nearSun: (body) => nearSun.set(body.id, body),
        ...(scope.charts ? { charts: scope.charts } : {}),
      };
      replaceWith(c.node, c.spec.render(call));
    }
    file.data.placeholders = { count: checked.length, nearSun: [...nearSun.values()] };
    return undefined;
  };
}
