/**
 * `remarkPlaceholders`: the remark plugin that turns placeholder directives (parsed by
 * `remark-directive`) into semantic HTML nodes for `remark-rehype`, and decides the sections
 * (`:::provided`, `:::every-target`, `:::every-event`, see `sections.ts`). It only reads the syntax
 * tree and the week data; it knows nothing of Astro, files or the clock, so any unified pipeline
 * can use it:
 *
 * ```ts
 * unified().use(remarkParse).use(remarkDirective)
 *   .use(remarkPlaceholders, { scope: () => ({ site, week, bodies }) })
 *   .use(remarkRehype).use(rehypeStringify)
 * ```
 *
 * Every directive of a document is checked before any is computed. Each problem is a message on
 * the file at its directive's node (`file.message`, see `reportError` and `reportWarning` in
 * `problems.ts`): after checking, the errors are thrown at once (one `GloamingError` placed at
 * `file:line:column`, or a `TemplateErrors` listing several). Problems that depend on the site
 * and week (a value placeholder with no value, a repeated section with nothing to repeat) stay on
 * the file as warnings (`warningsOnFile`). Lines are the file's own: a caller that parses only a
 * template's body gives the file its front matter as blank lines (see `render.ts`).
 */
import { wordsFor } from '../../core/language/index.ts';
import type { ElementContent } from 'hast';
import type { List, Nodes, Parent, Root, RootContent, Text } from 'mdast';
import type { ContainerDirective, LeafDirective, TextDirective } from 'mdast-util-directive';
import type { VFile } from 'vfile';
import type { BodyRegistry } from '../../core/body.ts';
import { eventsBetween, type AlmanacEvent } from '../almanac/index.ts';
import { ChartCache } from '../chart/cache.ts';
import { GloamingError } from '../../core/errors.ts';
import type { Language } from '../../core/language/index.ts';
import type { Site } from '../../core/site.ts';
import { addDays, type IsoWeek } from '../../core/time.ts';
import { readAttribute, type AttributeSpec, type AttributeValue, type ReadContext } from './attributes.ts';
import { authorWords, quoted, type AuthorWords } from './messages.ts';
import { defaultClock, formatDay, type Clock } from './format.ts';
import { PLACEHOLDERS, type PlaceholderCall, type PlaceholderSpec } from './placeholders/registry.ts';
import { FALLBACK_MARK, errorsOnFile, reportError, reportWarning, throwErrors, type ProblemKind } from './problems.ts';
import type { ShownBody } from './safety.ts';
import { OTHERWISE, SECTIONS, type Binding, type SectionSpec } from './sections.ts';
import { WeekCache, type WeekData } from '../../models/week.ts';
import type { Satellite } from '../../models/satellite/passes.ts';
import type { ChartOutput } from './types.ts';

/** What the placeholders of one document are about. */
export interface PlaceholderScope {
  site: Site;
  week: IsoWeek;
  bodies: BodyRegistry;
  /** Satellites followed, for passes and `satellite-pass` events (default none). */
  satellites?: readonly Satellite[];
  /** Local date (inside `week`) of the default night; Monday of the week when absent. */
  defaultNight?: string;
  /**
   * The nights whose events the page is about (local dates of the first and last evening); the
   * seven nights of `week` when absent. A one-off bulletin looks ±3 nights around its date.
   */
  eventNights?: { first: string; last: string };
  /** Shared week data; a private cache is used when absent. */
  cache?: WeekCache;
  /** Finder charts for `::chart` (see `ChartOutput`); when absent, kept in memory for this document and linked as `/charts/<file>`. */
  charts?: ChartOutput;
  /** The template's language, which its problems are worded in (default English). */
  language?: Language;
}

export interface RemarkPlaceholdersOptions {
  /** Gives the site, week and bodies of the document being processed. */
  scope: (file: VFile) => PlaceholderScope;
}

/** What the plugin leaves in `file.data.placeholders` (its warnings are messages on the file). */
export interface PlaceholderReport {
  /** Number of placeholders rendered. */
  count: number;
  /** Every body a placeholder showed, with its night, in document order (for the eye-safety pass, `nearSunBodies`). */
  shown: ShownBody[];
}

declare module 'vfile' {
  interface DataMap {
    placeholders: PlaceholderReport;
  }
}

type Directive = TextDirective | LeafDirective | ContainerDirective;

const DIRECTIVE_TYPES = new Set(['textDirective', 'leafDirective', 'containerDirective']);
/** Directive-looking text that the directive parser did not accept (e.g. an unclosed `{`). */
const LEFTOVER_RE = /(^|[^\\:\w]):{1,3}([a-zA-Z][\w-]*)(\{|\[)/;
/** A placeholder name directly followed by a colon (`:name:`), which the directive parser leaves as text. */
const COLON_AFTER_RE = /(^|[^\\:\w]):([a-zA-Z][\w-]*):/g;
/** A block placeholder written inside a paragraph. */
const INLINE_BLOCK_RE = /(^|\s)::([a-zA-Z][\w-]*)/;

function isDirective(node: Nodes): node is Directive {
  return DIRECTIVE_TYPES.has(node.type);
}

/**
 * Prepares the tree: a text directive whose name starts with a digit is prose that happens to
 * contain a colon (`21:00`, `1:2`) and is turned back into its literal text; directives followed
 * by an unreadable `{` are put in `malformed`; text nodes are gathered for the leftover check.
 */
function normalize(node: Nodes, texts: Text[], malformed: Set<Directive>): void {
  if (node.type === 'text') texts.push(node);
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
    if (isDirective(child) && next?.type === 'text' && /^[{[]/.test(next.value)) malformed.add(child);
    normalize(child, texts, malformed);
  }
}

function colons(node: Directive): string {
  return node.type === 'textDirective' ? ':' : node.type === 'leafDirective' ? '::' : ':::';
}

function written(node: Directive): string {
  return `${colons(node)}${node.name}`;
}

/** The directive as written, with its attributes, for messages (`:best-time{body=jupiter}`). */
function asWritten(node: Directive): string {
  const attrs = Object.entries(node.attributes ?? {}).map(([k, v]) => `${k}=${v ?? ''}`);
  return `${written(node)}${attrs.length ? `{${attrs.join(' ')}}` : ''}`;
}

/** What sections around a directive bind, as far as checking knows (whether, not which). */
interface Bound {
  body: boolean;
  event: boolean;
}

interface Defaults {
  night: number;
  clock: Clock;
  binding: Binding;
}

/**
 * Reads a directive's attributes against `specs`: unknown, unreadable and missing ones are
 * `invalid-placeholder` errors (without a place); defaults are filled in, and a missing `body` or
 * event comes from the enclosing section's binding. Returns the values and the names written.
 */
function readAttributes(node: Directive, specs: Readonly<Record<string, AttributeSpec>>, example: string, read: ReadContext, defaults: Defaults, bound: Bound): { attrs: Map<string, AttributeValue>; given: Set<string> } {
  const words = read.words ?? authorWords();
  const attrs = new Map<string, AttributeValue>();
  const given = new Set<string>();
  for (const [name, raw] of Object.entries(node.attributes ?? {})) {
    const attr = specs[name];
    if (!attr) {
      const names = Object.keys(specs);
      const hint = words.didYouMean(name, names);
      throw words.error('invalid-placeholder', words.say('err.unknown-attribute', { name: quoted(name), placeholder: quoted(written(node)) }), {
        place: { field: name },
        expected: names.length ? words.oneOf(names) : words.say('err.no-attributes'),
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
  for (const [name, attr] of Object.entries(specs)) {
    if (attrs.has(name)) continue;
    if (attr.bound === 'body' && defaults.binding.body) {
      attrs.set(name, defaults.binding.body);
      continue;
    }
    if (attr.required && !(attr.bound && bound[attr.bound])) {
      const key = attr.bound === 'body' ? 'err.needs-attribute-target' : attr.bound === 'event' ? 'err.needs-attribute-event' : 'err.needs-attribute';
      throw words.error('invalid-placeholder', words.say(key, { placeholder: quoted(written(node)), name: quoted(name) }), {
        place: { field: name },
        expected: attr.need ? words.say(attr.need) : attr.doc,
        hint: words.say('err.for-example', { example }),
      });
    }
    if (attr.type.kind === 'night') attrs.set(name, defaults.night);
    else if (attr.type.kind === 'clock') attrs.set(name, defaults.clock);
    else if (attr.default !== undefined && !attr.bound) attrs.set(name, readAttribute(name, attr.default, attr.type, read));
  }
  return { attrs, given };
}

interface CheckedPlaceholder {
  spec: PlaceholderSpec;
  attrs: Map<string, AttributeValue>;
  given: Set<string>;
}

/** Checks one placeholder directive against the table and reads its attributes; errors carry no place (they are reported at the directive). */
function checkPlaceholder(node: Directive, read: ReadContext, defaults: Defaults, bound: Bound, malformed: boolean): CheckedPlaceholder {
  const words = read.words ?? authorWords();
  const spec = PLACEHOLDERS.get(node.name);
  if (malformed) throw unreadable(node, spec?.example ?? SECTIONS.get(node.name)?.example ?? ':rise{body=jupiter night=fri}', words);
  if (!spec) {
    const hint = words.didYouMean(node.name, PLACEHOLDERS.keys());
    throw words.error('unknown-placeholder', words.say('err.unknown-placeholder', { placeholder: quoted(written(node)) }), {
      expected: words.say('err.placeholder-listed', { file: 'lib/outputs/bulletin/PLACEHOLDERS.md' }),
      hint: hint ?? words.say('err.literal-colon', { escape: '\\:' }),
    });
  }
  const block = words.say('err.write-block', { placeholder: `::${spec.name}` });
  const inline = words.say('err.write-inline', { placeholder: `:${spec.name}` });
  if (node.type === 'containerDirective') {
    throw words.error('invalid-placeholder', words.say('err.container', { placeholder: quoted(written(node)) }), { hint: spec.form === 'block' ? block : inline });
  }
  if (spec.form === 'block' && node.type === 'textDirective') {
    throw words.error('invalid-placeholder', words.say('err.is-block', { placeholder: quoted(`:${spec.name}`) }), { hint: block });
  }
  if (spec.form === 'inline' && node.type === 'leafDirective') {
    throw words.error('invalid-placeholder', words.say('err.is-inline', { placeholder: quoted(`::${spec.name}`) }), { hint: inline });
  }
  if (node.children.length > 0) throw noLabel(node, spec.example, words);
  const { attrs, given } = readAttributes(node, spec.attributes, spec.example, read, defaults, bound);
  spec.validate?.(attrs, bound, words);
  return { spec, attrs, given };
}

/** The attributes of a directive could not be parsed (an unclosed brace, a stray quote). */
function unreadable(node: Directive, example: string, words: AuthorWords): GloamingError {
  return words.error('invalid-placeholder', words.say('err.attributes-unreadable', { placeholder: quoted(written(node)) }), {
    expected: words.say('err.attributes-expected', { example }),
    hint: words.say('err.check-brace'),
  });
}

/** A directive with a [label], which no placeholder or section takes. */
function noLabel(node: Directive, example: string, words: AuthorWords): GloamingError {
  return words.error('invalid-placeholder', words.say('err.no-label', { placeholder: quoted(written(node)) }), { hint: words.say('err.attributes-in-braces', { example }) });
}

interface CheckedSection {
  spec: SectionSpec;
  attrs: Map<string, AttributeValue>;
  /** The block, and the alternative after `::otherwise` (null when there is none). */
  body: RootContent[];
  otherwise: RootContent[] | null;
  /** A second `::otherwise`, which a section may not have (the check reports it there). */
  extraOtherwise: RootContent | null;
}

/** Checks a section directive and splits its children at `::otherwise`; errors carry no place (they are reported at the section). */
function checkSection(node: ContainerDirective, spec: SectionSpec, read: ReadContext, defaults: Defaults, bound: Bound, malformed: boolean): CheckedSection {
  const words = read.words ?? authorWords();
  if (malformed) throw unreadable(node, spec.example, words);
  const label = node.children[0];
  if (label?.type === 'paragraph' && (label.data as { directiveLabel?: boolean } | undefined)?.directiveLabel) throw noLabel(node, spec.example, words);
  const { attrs } = readAttributes(node, spec.attributesFor(node.attributes ?? {}, words), spec.example, read, defaults, bound);
  const splits = node.children.map((c, i) => (c.type === 'leafDirective' && c.name === OTHERWISE ? i : -1)).filter((i) => i >= 0);
  const split = splits[0];
  return {
    spec,
    attrs,
    body: split === undefined ? node.children : node.children.slice(0, split),
    otherwise: split === undefined ? null : node.children.slice(split + 1),
    extraOtherwise: splits.length > 1 ? node.children[splits[1]!]! : null,
  };
}

/** The point of the character at `index` of a text node's value (continuation lines counted from column 1). */
function textPoint(node: Text, index: number): { line: number; column: number } | undefined {
  const start = node.position?.start;
  if (!start) return undefined;
  const before = node.value.slice(0, index);
  const lines = before.split('\n');
  return lines.length === 1 ? { line: start.line, column: start.column + index } : { line: start.line + lines.length - 1, column: lines[lines.length - 1]!.length + 1 };
}

/** Text that looks like a placeholder but was not parsed as one: one error per text node, with the point inside the text where it starts. */
function leftovers(texts: Text[], words: AuthorWords): { error: GloamingError; at: { line: number; column: number } | undefined }[] {
  const errors: { error: GloamingError; at: { line: number; column: number } | undefined }[] = [];
  for (const node of texts) {
    const block = INLINE_BLOCK_RE.exec(node.value);
    if (block && (PLACEHOLDERS.has(block[2]!) || block[2] === OTHERWISE)) {
      const index = block.index + block[1]!.length;
      errors.push({
        at: textPoint(node, index),
        error: words.error('invalid-placeholder', words.say('err.own-line', { placeholder: quoted(`::${block[2]}`) }), {
          hint: PLACEHOLDERS.get(block[2]!)?.form === 'inline' ? words.say('err.inside-sentence', { placeholder: `:${block[2]}` }) : words.say('err.own-line-blank'),
        }),
      });
      continue;
    }
    const colon = [...node.value.matchAll(COLON_AFTER_RE)].find((c) => PLACEHOLDERS.has(c[2]!));
    if (colon) {
      errors.push({
        at: textPoint(node, colon.index + colon[1]!.length),
        error: words.error('invalid-placeholder', words.say('err.colon-after', { placeholder: quoted(`:${colon[2]}`), colon: quoted(':') }), {
          hint: words.say('err.end-before-colon', { fix: `:${colon[2]}{}:` }),
        }),
      });
      continue;
    }
    const m = LEFTOVER_RE.exec(node.value);
    if (m && node.value.slice(m.index + m[1]!.length).startsWith(':::') && SECTIONS.has(m[2]!)) {
      errors.push({
        at: textPoint(node, m.index + m[1]!.length),
        error: words.error('invalid-placeholder', words.say('err.section-own-line', { section: quoted(`:::${m[2]}`) }), {
          hint: words.say('err.section-layout', { open: `:::${m[2]}{…}`, close: ':::' }),
        }),
      });
    } else if (m) {
      const index = m.index + m[1]!.length;
      errors.push({
        at: textPoint(node, index),
        error: words.error('invalid-placeholder', words.say('err.malformed', { text: quoted(node.value.slice(index, index + 40).split('\n')[0]!) }), {
          expected: words.say('err.malformed-expected', { example: ':rise{body=jupiter night=fri}' }),
          hint: words.say('err.malformed-hint', { escape: '\\:' }),
        }),
      });
    }
  }
  return errors;
}

/** Sets a directive node's output: `remark-rehype` turns it into the rendered element. */
function replaceWith(node: Directive, output: ElementContent): void {
  if (output.type === 'element') {
    node.data = { hName: output.tagName, hProperties: output.properties, hChildren: output.children };
  } else {
    node.data = { hName: 'span', hProperties: {}, hChildren: [output] };
  }
}

/** Copies of a repeated block, each a single list, become one list (one item per target or event). */
function joinLists(copies: RootContent[][]): RootContent[] {
  const lists = copies.map((c) => (c.length === 1 && c[0]!.type === 'list' ? (c[0] as List) : null));
  if (copies.length < 2 || lists.some((l) => !l || l.ordered !== lists[0]!.ordered)) return copies.flat();
  return [{ ...lists[0]!, children: lists.flatMap((l) => l!.children) }];
}

/** Everything one document's pass needs. */
class Pass {
  readonly scope: PlaceholderScope;
  readonly file: VFile;
  readonly read: ReadContext;
  readonly clock: Clock;
  readonly defaultNight: number;
  readonly charts: ChartOutput;
  /** The messages of the template's language. */
  readonly words: AuthorWords;
  /** Directives followed directly by a `{` or `[` the parser could not read (unclosed brace, stray quote). */
  readonly malformed = new Set<Directive>();
  readonly shown: ShownBody[] = [];
  count = 0;
  #week: WeekData | undefined;
  #events: AlmanacEvent[] | undefined;

  constructor(scope: PlaceholderScope, file: VFile, defaultNight: number) {
    this.scope = scope;
    this.file = file;
    this.words = authorWords(scope.language);
    this.read = { bodies: scope.bodies, days: scope.week.days, words: this.words };
    this.clock = defaultClock(scope.site.locale);
    this.defaultNight = defaultNight;
    this.charts = scope.charts ?? { cache: new ChartCache(), url: (name) => `/charts/${name}` };
  }

  get week(): WeekData {
    this.#week ??= (this.scope.cache ?? new WeekCache()).get(this.scope.site, this.scope.week, this.scope.bodies, this.scope.satellites);
    return this.#week;
  }

  events(): AlmanacEvent[] {
    const span = this.scope.eventNights;
    const days = this.scope.week.days;
    this.#events ??= eventsBetween(this.week, span?.first ?? days[0]!, span?.last ?? days[6]!);
    return this.#events;
  }

  get eventSpan(): string {
    return wordsFor(this.scope.site.locale).t(this.scope.eventNights ? 'span.around-date' : 'span.week');
  }

  defaults(binding: Binding): Defaults {
    return { night: binding.night ?? this.defaultNight, clock: this.clock, binding };
  }

  /** Reports an error at a node (or a point inside a text); a `GloamingError` is a problem of the template, anything else a bug. */
  fail(error: unknown, at: Nodes | { line: number; column: number } | undefined): void {
    if (!(error instanceof GloamingError)) throw error;
    reportError(this.file, error, at);
  }

  warn(kind: ProblemKind, node: Nodes, message: string): void {
    reportWarning(this.file, kind, node, message);
  }

  // --- Checking: every directive, with what its sections bind; every error reported on the file.

  check(parent: Parent, bound: Bound, inSection: boolean): void {
    for (const child of parent.children as Nodes[]) {
      if (child.type === 'containerDirective' && SECTIONS.has(child.name)) {
        const spec = SECTIONS.get(child.name)!;
        let inner = bound;
        try {
          const c = checkSection(child, spec, this.read, this.defaults({}), bound, this.malformed.has(child));
          if (c.extraOtherwise) this.fail(this.words.error('invalid-placeholder', this.words.say('err.otherwise-twice', { section: quoted(written(child)), otherwise: '::otherwise' }), { hint: this.words.say('err.one-alternative') }), c.extraOtherwise);
        } catch (error) {
          this.fail(error, child);
        }
        if (spec.binds) inner = { ...bound, [spec.binds]: true };
        this.check(child, inner, true);
        continue;
      }
      if (child.type === 'leafDirective' && child.name === OTHERWISE) {
        if (!inSection || !(parent.type === 'containerDirective' && SECTIONS.has((parent as ContainerDirective).name))) {
          this.fail(this.words.error('invalid-placeholder', this.words.say('err.otherwise-outside', { otherwise: quoted('::otherwise') }), { hint: this.words.say('err.otherwise-where', { provided: ':::provided{…}', targets: ':::every-target', events: ':::every-event', close: ':::' }) }), child);
        }
        continue;
      }
      if (child.type === 'containerDirective' && !PLACEHOLDERS.has(child.name)) {
        const hint = this.words.didYouMean(child.name, SECTIONS.keys());
        this.fail(
          this.words.error('unknown-placeholder', this.words.say('err.unknown-section', { section: quoted(written(child)) }), {
            expected: this.words.oneOf([...SECTIONS.keys()].map((n) => `:::${n}`)),
            ...(hint ? { hint } : {}),
          }),
          child,
        );
        this.check(child, bound, true);
        continue;
      }
      if (isDirective(child)) {
        try {
          checkPlaceholder(child, this.read, this.defaults({}), bound, this.malformed.has(child));
        } catch (error) {
          this.fail(error, child);
        }
      }
      if ('children' in child) this.check(child as Parent, bound, false);
    }
  }

  // --- Rendering: sections decided and expanded in place, placeholders replaced by their values.

  render(parent: Parent, binding: Binding): void {
    const children = parent.children as RootContent[];
    for (let i = 0; i < children.length; i++) {
      const child = children[i]!;
      if (child.type === 'containerDirective' && SECTIONS.has(child.name)) {
        const out = this.section(child, binding);
        children.splice(i, 1, ...out);
        i += out.length - 1;
        continue;
      }
      if (isDirective(child)) this.placeholder(child, binding);
      if ('children' in child) this.render(child as Parent, binding);
    }
  }

  /** The nodes a section leaves in its place (already rendered). */
  section(node: ContainerDirective, binding: Binding): RootContent[] {
    const spec = SECTIONS.get(node.name)!;
    const bound = { body: !!binding.body, event: !!binding.event };
    const c = checkSection(node, spec, this.read, this.defaults(binding), bound, this.malformed.has(node));
    const night = (c.attrs.get('night') as number | undefined) ?? binding.night ?? this.defaultNight;
    const decision = spec.decide({
      name: spec.name,
      week: this.week,
      night,
      attrs: c.attrs,
      bound: binding,
      events: () => this.events(),
      hasValue: (placeholder, attrs) => {
        let missing = false;
        placeholder.render(this.call(placeholder, attrs, new Set(attrs.keys()), binding, { fallback: () => (missing = true) }));
        return !missing;
      },
    });
    const renderBlock = (nodes: RootContent[], inner: Binding): RootContent[] => {
      const root: Root = { type: 'root', children: structuredClone(nodes) };
      this.render(root, inner);
      return root.children;
    };
    if (decision.kind === 'choose') {
      const chosen = decision.show ? c.body : (c.otherwise ?? []);
      return renderBlock(chosen, binding);
    }
    if (decision.items.length === 0) {
      if (c.otherwise) return renderBlock(c.otherwise, binding);
      const w = this.words;
      const when = spec.binds === 'event' ? this.eventSpan : w.say('err.on-day', { date: formatDay(this.scope.week.days[night]!, this.scope.site, { weekday: 'long' }) });
      this.warn('empty-section', node, w.say(spec.binds === 'event' ? 'err.empty-section-weeks' : 'err.empty-section-nights', { section: quoted(asWritten(node)), when, otherwise: '::otherwise' }));
      return [];
    }
    return joinLists(decision.items.map((item) => renderBlock(c.body, { ...binding, ...item, night: item.night ?? night })));
  }

  call(spec: PlaceholderSpec, attrs: ReadonlyMap<string, AttributeValue>, given: ReadonlySet<string>, binding: Binding, hooks: Pick<PlaceholderCall, 'fallback'>): PlaceholderCall {
    return {
      name: spec.name,
      site: this.scope.site,
      week: this.week,
      night: (attrs.get('night') as number | undefined) ?? binding.night ?? this.defaultNight,
      clock: (attrs.get('clock') as Clock | undefined) ?? this.clock,
      attrs,
      given,
      events: () => this.events(),
      eventSpan: this.eventSpan,
      ...(binding.event ? { event: binding.event } : {}),
      charts: this.charts,
      ...hooks,
    };
  }

  placeholder(node: Directive, binding: Binding): void {
    const c = checkPlaceholder(node, this.read, this.defaults(binding), { body: !!binding.body, event: !!binding.event }, this.malformed.has(node));
    const call = this.call(c.spec, c.attrs, c.given, binding, {
      fallback: (honest, condition) => {
        const written = Object.entries(node.attributes ?? {}).map(([k, v]) => ` ${k}=${v ?? ''}`).join('');
        const guard = `:::provided{${condition ?? `has=${c.spec.name}${written}`}}`;
        const date = formatDay(this.scope.week.days[call.night]!, this.scope.site, { weekday: 'long' });
        this.warn('fallback', node, this.words.say('err.fallback', { placeholder: quoted(asWritten(node)), date, honest, mark: quoted(FALLBACK_MARK), guard, otherwise: '::otherwise', verdict: ':verdict' }));
      },
    });
    replaceWith(node, c.spec.render(call));
    for (const body of c.spec.shows?.(call) ?? []) this.shown.push({ body, night: call.night });
    this.count++;
  }
}

/**
 * The remark plugin. Decides every section and replaces every placeholder directive in the tree
 * by its rendered value for the scope's site and week, and leaves `file.data.placeholders`
 * ({ count, shown }); every problem is a message on the file (errors are thrown after checking).
 */
export function remarkPlaceholders(options: RemarkPlaceholdersOptions) {
  return (tree: Root, file: VFile): undefined => {
    const scope = options.scope(file);
    const fileName = file.path ?? '<markdown>';
    const days = scope.week.days;
    const defaultNight = scope.defaultNight === undefined ? 0 : days.indexOf(scope.defaultNight);
    if (defaultNight < 0) {
      throw new GloamingError('invalid-date', `the default night ${scope.defaultNight} is not in the week ${scope.week.id}`, { place: { file: fileName } });
    }
    if (scope.eventNights && scope.eventNights.first > scope.eventNights.last) {
      throw new GloamingError('invalid-date', `the event nights run backwards (${scope.eventNights.first} to ${scope.eventNights.last})`, { place: { file: fileName }, expected: `a first night on or before the last, e.g. ${addDays(days[0]!, -3)} to ${addDays(days[0]!, 3)}` });
    }
    const pass = new Pass(scope, file, defaultNight);
    const texts: Text[] = [];
    normalize(tree, texts, pass.malformed);
    pass.check(tree, { body: false, event: false }, false);
    for (const { error, at } of leftovers(texts, pass.words)) pass.fail(error, at);
    throwErrors(errorsOnFile(file));
    pass.render(tree, {});
    file.data.placeholders = { count: pass.count, shown: pass.shown };
    return undefined;
  };
}
