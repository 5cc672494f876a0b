/**
 * The centre that publishes the bulletins, from `content/centre.yaml`: its name, public address,
 * logo, accent colour, footer, links, default locale and whether it is an invented demo. Every
 * page, feed, calendar and card that names the publisher reads it from here.
 *
 * ```yaml
 * name: Example Science Centre      # required
 * shortName: Example                # breadcrumb; default: name
 * url: https://sky.example.net/     # public address; without it the build is a preview
 * logo: logo.svg                    # a file in the content folder (svg, png, jpg, webp; ≤ 200 KB)
 * accent: "#f3b962"                 # times and values; WCAG AA against both page modes
 * locale: en-GB                     # default locale of sites that give none
 * footer: |                         # Markdown (links: http, https, mailto or relative)
 *   Open every clear Friday.
 * links:                            # shown in the footer
 *   - { label: Visit us, href: https://example.net/visit }
 * demo: false                       # true only for an invented demo: shows the notice
 * ```
 *
 * Validation errors name the file, line and column of the field (through `lib/yaml.ts`).
 */
import { existsSync, readFileSync, statSync } from 'node:fs';
import { extname, join, relative, resolve, sep } from 'node:path';
import rehypeStringify from 'rehype-stringify';
import remarkParse from 'remark-parse';
import remarkRehype from 'remark-rehype';
import { unified } from 'unified';
import { VFile } from 'vfile';
import { remarkSafeLinks, isSafeUrl } from './bulletin/links.ts';
import { GloamingError } from '../core/errors.ts';
import { loadYaml, validateYaml } from '../core/yaml.ts';

/** The file name of the centre's description inside the content folder. */
export const CENTRE_FILE = 'centre.yaml';

/**
 * Where a build without a public address points its absolute links (feeds, sitemap, cards):
 * the address `astro preview` serves on, so a preview's links work on the machine that built it.
 */
export const PREVIEW_ORIGIN = 'http://localhost:4321/';

/** The page colours the accent is shown on (site/styles/base.css; test/centre.test.ts keeps them equal). */
export const PAGE_COLOURS = {
  dark: { background: '#0c1019', panel: '#151b2a' },
  red: { background: '#000000', panel: '#0f0000' },
} as const;

/** WCAG 2.1 success criterion 1.4.3 (AA): contrast of normal text against its background. */
export const MIN_TEXT_CONTRAST = 4.5;

/** Logo formats a page can show as `<img>`, by file extension, with their media types. */
export const LOGO_TYPES: Record<string, string> = { '.svg': 'image/svg+xml', '.png': 'image/png', '.jpg': 'image/jpeg', '.jpeg': 'image/jpeg', '.webp': 'image/webp' };

/** Largest logo file, bytes (every page shows it: it must not weigh more than the page). */
export const MAX_LOGO_BYTES = 200 * 1024;

export interface CentreLink {
  label: string;
  href: string;
}

export interface Centre {
  name: string;
  shortName: string;
  /** Public origin and path with a trailing slash, or null: a preview build. */
  url: string | null;
  /** The logo file, absolute path, or null. */
  logoFile: string | null;
  /** Where pages load the logo from (`/logo.svg`), or null. */
  logoPath: string | null;
  /** Accent colour in dark mode, `#rrggbb`. */
  accentDark: string;
  /** The same accent in red-light mode: a pure red of the same relative luminance, `#rrggbb`. */
  accentRed: string;
  /** BCP 47 locale for sites that do not give their own. */
  locale: string;
  /** The footer Markdown rendered to HTML (no raw HTML, safe links only); '' when none. */
  footerHtml: string;
  links: CentreLink[];
  /** An invented demo: pages show the notice. */
  demo: boolean;
}

const FIELDS = ['name', 'shortName', 'url', 'logo', 'accent', 'locale', 'footer', 'links', 'demo'] as const;

/** The project's own accent (dark mode), used when centre.yaml gives none. */
export const DEFAULT_ACCENT = '#f3b962';

function fail(field: string, reason: string, actual: unknown, expected: string): never {
  throw new GloamingError('invalid-value', reason, { place: { field }, actual, expected });
}

function text(o: Record<string, unknown>, field: string, expected: string): string | undefined {
  const v = o[field];
  if (v === undefined || v === null) return undefined;
  if (typeof v !== 'string' || v.trim() === '') fail(field, `'${field}' must be non-empty text`, v, expected);
  return v.trim();
}

/** sRGB channel (0–255) to linear light (WCAG 2.1 relative luminance definition). */
function linear(channel: number): number {
  const c = channel / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function rgb(hex: string): [number, number, number] {
  const h = hex.slice(1);
  return [0, 2, 4].map((i) => parseInt(h.slice(i, i + 2), 16)) as [number, number, number];
}

/** Relative luminance of a `#rrggbb` colour, 0–1 (WCAG 2.1, after sRGB IEC 61966-2-1). */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = rgb(hex).map(linear) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** Contrast ratio of two `#rrggbb` colours, 1–21 (WCAG 2.1: (L1 + 0.05) / (L2 + 0.05)). */
export function contrastRatio(a: string, b: string): number {
  const [hi, lo] = [relativeLuminance(a), relativeLuminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

/**
 * The red-light rendering of a colour: pure red (no green or blue, which would spoil dark
 * adaptation) with the same relative luminance, capped at full red (luminance 0.2126).
 */
export function redLightColour(hex: string): string {
  const target = Math.min(relativeLuminance(hex) / 0.2126, 1);
  // Inverse of `linear`, to the nearest 8-bit step at or above the target (never darker).
  let r = 0;
  while (r < 255 && linear(r) < target) r++;
  return `#${r.toString(16).padStart(2, '0')}0000`;
}

function parseAccent(value: unknown): { dark: string; red: string } {
  const accent = value === undefined || value === null ? DEFAULT_ACCENT : value;
  if (typeof accent !== 'string' || !/^#[0-9a-fA-F]{6}$/.test(accent)) fail('accent', 'the accent must be a hex colour', accent, "'#rrggbb', quoted in YAML (e.g. \"#f3b962\")");
  const dark = accent.toLowerCase();
  const red = redLightColour(dark);
  for (const [mode, colour] of [['dark', dark], ['red-light', red]] as const) {
    const colours = PAGE_COLOURS[mode === 'dark' ? 'dark' : 'red'];
    for (const [where, background] of Object.entries(colours)) {
      const ratio = contrastRatio(colour, background);
      if (ratio < MIN_TEXT_CONTRAST) {
        fail(
          'accent',
          `the accent ${mode === 'dark' ? dark : `${dark} (shown as ${red} in red-light mode)`} has a contrast of ${ratio.toFixed(2)}:1 against the ${mode} mode's ${where} ${background}, below WCAG AA`,
          accent,
          `a colour with at least ${MIN_TEXT_CONTRAST}:1 against ${PAGE_COLOURS.dark.background}, ${PAGE_COLOURS.dark.panel} and, as red, against black (a lighter colour, e.g. ${DEFAULT_ACCENT})`,
        );
      }
    }
  }
  return { dark, red };
}

function parseUrl(value: unknown): string | null {
  if (value === undefined || value === null || value === '') return null;
  let url: URL;
  try {
    if (typeof value !== 'string') throw new Error('not text');
    url = new URL(value);
  } catch {
    return fail('url', 'the public address is not a URL', value, "an absolute http(s) address such as 'https://sky.example.net/' (or leave it out for a preview build)");
  }
  if (url.protocol !== 'https:' && url.protocol !== 'http:') fail('url', 'the public address must be http or https', value, "an address such as 'https://sky.example.net/'");
  if (url.search || url.hash) fail('url', 'the public address has a query or fragment', value, 'an origin with an optional path, such as https://example.net/sky/');
  if (!url.pathname.endsWith('/')) url.pathname += '/';
  return url.href;
}

function isLocale(tag: string): boolean {
  try {
    return Intl.DateTimeFormat.supportedLocalesOf([tag]).length > 0;
  } catch {
    return false;
  }
}

/**
 * Renders the footer's Markdown: no raw HTML (dropped), links only to safe addresses. An unsafe
 * link is reported at its line in the YAML file (`lineOffset`: the line before the block's first).
 */
function renderFooter(markdown: string, place: { file: string; lineOffset: number }): string {
  const processor = unified().use(remarkParse).use(remarkSafeLinks).use(remarkRehype).use(rehypeStringify);
  try {
    return String(processor.processSync(new VFile({ value: markdown, path: place.file }))).trim();
  } catch (error) {
    if (!(error instanceof GloamingError)) throw error;
    const { line, column } = error.place ?? {};
    throw new GloamingError(error.code, error.reason, {
      place: { file: place.file, ...(line !== undefined ? { line: line + place.lineOffset } : {}), ...(column !== undefined ? { column } : {}), field: 'footer' },
      ...(error.hasActual ? { actual: error.actual } : {}),
      ...(error.expected ? { expected: error.expected } : {}),
    });
  }
}

function parseLinks(value: unknown): CentreLink[] {
  if (value === undefined || value === null) return [];
  if (!Array.isArray(value)) fail('links', "'links' must be a list", value, '- { label: Visit us, href: https://… } lines');
  return value.map((item: unknown, i) => {
    const field = `links.${i}`;
    if (!item || typeof item !== 'object' || Array.isArray(item)) fail(field, 'a link is a mapping of label and href', item, '{ label: Visit us, href: https://… }');
    const o = item as Record<string, unknown>;
    for (const key of Object.keys(o)) if (key !== 'label' && key !== 'href') fail(`${field}.${key}`, `unknown link field '${key}'`, key, 'label and href');
    const label = text(o, 'label', 'the words of the link');
    const href = text(o, 'href', 'an address');
    if (label === undefined) throw new GloamingError('missing-field', 'a link needs a label', { place: { field: `${field}.label` }, expected: 'the words of the link' });
    if (href === undefined) throw new GloamingError('missing-field', 'a link needs an href', { place: { field: `${field}.href` }, expected: 'an address' });
    if (!isSafeUrl(href)) fail(`${field}.href`, 'a link may only use http, https, mailto or a relative address', href, 'https://…, mailto:… or /…');
    return { label, href };
  });
}

function parseLogo(value: unknown, contentDir: string): { file: string; path: string } | null {
  if (value === undefined || value === null) return null;
  if (typeof value !== 'string' || value.trim() === '') fail('logo', 'the logo must be a file name', value, "a file in the content folder, e.g. 'logo.svg'");
  const file = resolve(contentDir, value);
  const inside = relative(resolve(contentDir), file);
  if (inside.startsWith('..') || inside.includes(`..${sep}`)) fail('logo', 'the logo must be inside the content folder', value, "a file in the content folder, e.g. 'logo.svg'");
  const ext = extname(file).toLowerCase();
  if (!(ext in LOGO_TYPES)) fail('logo', `a logo cannot be a '${ext || 'file without extension'}'`, value, `one of ${Object.keys(LOGO_TYPES).join(', ')}`);
  if (!existsSync(file) || !statSync(file).isFile()) fail('logo', 'the logo file does not exist', value, `a file at ${file}`);
  const bytes = statSync(file).size;
  if (bytes > MAX_LOGO_BYTES) fail('logo', `the logo file is ${Math.round(bytes / 1024)} KB`, value, `at most ${MAX_LOGO_BYTES / 1024} KB`);
  return { file, path: `/logo${ext === '.jpeg' ? '.jpg' : ext}` };
}

/**
 * Validates the centre's fields. `contentDir` resolves the logo; `file` and `footerLine` place
 * errors inside the footer's Markdown.
 */
export function defineCentre(input: unknown, options: { contentDir: string; file?: string; footerLine?: number }): Centre {
  if (!input || typeof input !== 'object' || Array.isArray(input)) fail('', 'centre.yaml must be a mapping of fields', input, 'name, url, accent, …');
  const o = input as Record<string, unknown>;
  for (const key of Object.keys(o)) {
    if (!(FIELDS as readonly string[]).includes(key)) {
      throw new GloamingError('unknown-field', `unknown centre field '${key}'`, { place: { field: key }, expected: `one of ${FIELDS.join(', ')}` });
    }
  }
  const name = text(o, 'name', 'the name of the centre');
  if (name === undefined) throw new GloamingError('missing-field', 'the centre needs a name', { place: { field: 'name' }, expected: "name: Example Science Centre" });
  const shortName = text(o, 'shortName', 'a short form of the name for the breadcrumb') ?? name;
  const locale = o.locale === undefined ? 'en-GB' : o.locale;
  if (typeof locale !== 'string' || !isLocale(locale)) fail('locale', 'unknown locale', locale, "a BCP 47 locale such as 'en-GB' or 'en-US'");
  const footer = o.footer === undefined || o.footer === null ? '' : o.footer;
  if (typeof footer !== 'string') fail('footer', 'the footer must be Markdown text', footer, 'footer: | followed by indented Markdown lines');
  if (o.demo !== undefined && typeof o.demo !== 'boolean') fail('demo', "'demo' must be true or false", o.demo, 'true only for an invented demo centre');
  const accent = parseAccent(o.accent);
  const logo = parseLogo(o.logo, options.contentDir);
  let footerHtml: string;
  try {
    footerHtml = footer.trim() ? renderFooter(footer, { file: options.file ?? CENTRE_FILE, lineOffset: options.footerLine ?? 0 }) : '';
  } catch (error) {
    if (error instanceof GloamingError) throw error.at({ field: 'footer' });
    throw error;
  }
  return {
    name,
    shortName,
    url: parseUrl(o.url),
    logoFile: logo?.file ?? null,
    logoPath: logo?.path ?? null,
    accentDark: accent.dark,
    accentRed: accent.red,
    locale,
    footerHtml,
    links: parseLinks(o.links),
    demo: o.demo === true,
  };
}

/** Parses the text of a centre file (`file` is the name used in messages). */
export function parseCentre(text: string, file: string, contentDir: string): Centre {
  const source = loadYaml(text, file);
  // Markdown lines of a block scalar (`footer: |`) start on the line after the key.
  const footerLine = source.locate('footer').line;
  return validateYaml(source, (data) => defineCentre(data, { contentDir, file, ...(footerLine !== undefined ? { footerLine } : {}) }));
}

/**
 * The centre of a content folder. A missing `centre.yaml` is an error that says how to write one
 * (`gloaming init` scaffolds it): pages must never name a publisher that is not the user's.
 */
export function loadCentre(contentDir: string, shownDir: string = contentDir): Centre {
  const file = join(contentDir, CENTRE_FILE);
  let text: string;
  try {
    text = readFileSync(file, 'utf8');
  } catch (error) {
    throw new GloamingError('missing-field', `there is no ${CENTRE_FILE} in the content folder`, {
      place: { file: join(shownDir, CENTRE_FILE) },
      expected: 'a file naming the centre (at least `name: …`; see the README, or scaffold one with `gloaming init`)',
      cause: error,
    });
  }
  return parseCentre(text, join(shownDir, CENTRE_FILE), contentDir);
}

const NUMBER_WORDS = ['no', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten'];

/** The invented-demo notice, or null for a real centre. */
export function demoNotice(centre: Pick<Centre, 'name' | 'demo'>, siteCount: number): string | null {
  if (!centre.demo) return null;
  const count = NUMBER_WORDS[siteCount] ?? String(siteCount);
  const sites = siteCount === 1 ? 'its observing site is' : `its ${count} observing sites are`;
  const name = /^the /i.test(centre.name) ? centre.name : `The ${centre.name}`;
  return `${name} and ${sites} invented for this demo of gloaming.`;
}

/**
 * The origin absolute links are made against, and whether the build is a preview:
 * `GLOAMING_SITE_URL` (a staging address) wins, then centre.yaml's `url`, else `PREVIEW_ORIGIN`.
 */
export function publicOrigin(centre: Pick<Centre, 'url'> | null, env: Record<string, string | undefined>): { url: string; preview: boolean } {
  const override = env.GLOAMING_SITE_URL;
  if (override) return { url: parseUrl(override) ?? PREVIEW_ORIGIN, preview: false };
  if (centre?.url) return { url: centre.url, preview: false };
  return { url: PREVIEW_ORIGIN, preview: true };
}
