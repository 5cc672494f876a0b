/**
 * The centre is content (content/centre.yaml, lib/outputs/centre.ts): validation with positioned errors,
 * the accent's contrast against both page modes (WCAG 2.1), the footer's Markdown, the demo notice
 * and the preview label of a build without a public address.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join, resolve } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { contrastRatio, demoNotice, loadCentre, PAGE_COLOURS, parseCentre, PREVIEW_ORIGIN, publicOrigin, redLightColour, relativeLuminance } from '../lib/outputs/centre.ts';
import { parseSite } from '../lib/models/content.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { expectWithin } from './helpers/tolerance.ts';

const ROOT = resolve(import.meta.dirname, '..');
let dir: string;

beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'gloaming-centre-'));
  writeFileSync(join(dir, 'logo.svg'), '<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 1 1"/>');
});
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function errorOf(text: string): GloamingError {
  try {
    parseCentre(text, 'centre.yaml', dir);
  } catch (error) {
    if (error instanceof GloamingError) return error;
    throw error;
  }
  throw new Error('expected an error');
}

describe('WCAG 2.1 contrast', () => {
  it('matches the definition and commonly cited pairs', () => {
    // WCAG 2.1, definition of contrast ratio: black on white is 21:1, a colour on itself 1:1.
    expectWithin(contrastRatio('#000000', '#ffffff'), 21, 1e-9, 'black/white');
    expectWithin(contrastRatio('#0c1019', '#0c1019'), 1, 1e-9, 'same colour');
    // From memory (widely quoted in accessibility guides): #767676 on white is the lightest grey
    // passing AA at 4.54:1, and #777777 fails at 4.48:1.
    expectWithin(contrastRatio('#767676', '#ffffff'), 4.54, 0.01, '#767676 on white');
    expectWithin(contrastRatio('#777777', '#ffffff'), 4.48, 0.01, '#777777 on white');
  });

  it('uses the page colours of site/styles/base.css', () => {
    const css = readFileSync(join(ROOT, 'site/styles/base.css'), 'utf8');
    const block = (selector: string): string => css.slice(css.indexOf(`${selector} {`), css.indexOf('}', css.indexOf(`${selector} {`)));
    const dark = block(':root');
    const red = block(':root:has(#red-light:checked)');
    const value = (b: string, name: string): string => new RegExp(`--${name}:\\s*(#[0-9a-f]+)`).exec(b)![1]!;
    const long = (hex: string): string => (hex.length === 4 ? `#${[...hex.slice(1)].map((c) => c + c).join('')}` : hex);
    expect(long(value(dark, 'bg'))).toBe(PAGE_COLOURS.dark.background);
    expect(long(value(dark, 'panel'))).toBe(PAGE_COLOURS.dark.panel);
    expect(long(value(red, 'bg'))).toBe(PAGE_COLOURS.red.background);
    expect(long(value(red, 'panel'))).toBe(PAGE_COLOURS.red.panel);
  });

  it("renders the accent in red light as pure red of the same luminance (capped at full red)", () => {
    for (const hex of ['#5a7fc0', '#a060b0', '#4f7a3a']) {
      const red = redLightColour(hex);
      expect(red).toMatch(/^#[0-9a-f]{2}0000$/);
      // One 8-bit step of red near these levels moves the luminance by < 0.005.
      expectWithin(relativeLuminance(red), relativeLuminance(hex), 0.005, `luminance of ${hex} → ${red}`);
    }
    expect(redLightColour('#ffffff')).toBe('#ff0000');
  });
});

describe('centre.yaml', () => {
  it('reads the demo centre', () => {
    const centre = loadCentre(join(ROOT, 'content'));
    expect(centre.name).toBe('Quayside Lantern Science Centre');
    expect(centre.demo).toBe(true);
    expect(centre.url).toBe('https://sky.example.org/');
    expect(centre.logoPath).toBe('/logo.svg');
    for (const bg of Object.values(PAGE_COLOURS.dark)) expect(contrastRatio(centre.accentDark, bg)).toBeGreaterThanOrEqual(4.5);
    for (const bg of Object.values(PAGE_COLOURS.red)) expect(contrastRatio(centre.accentRed, bg)).toBeGreaterThanOrEqual(4.5);
  });

  it('a minimal file: the short name is the name, no url means a preview, no notice', () => {
    const centre = parseCentre('name: Example Astronomy Club\n', 'centre.yaml', dir);
    expect(centre.shortName).toBe('Example Astronomy Club');
    expect(centre.url).toBeNull();
    expect(demoNotice(centre, 2)).toBeNull();
    expect(publicOrigin(centre, {})).toEqual({ url: PREVIEW_ORIGIN, preview: true });
    expect(publicOrigin(centre, { GLOAMING_SITE_URL: 'https://staging.example.net/sky' })).toEqual({ url: 'https://staging.example.net/sky/', preview: false });
    expect(publicOrigin({ url: 'https://sky.example.net/' }, {})).toEqual({ url: 'https://sky.example.net/', preview: false });
  });

  it('counts the sites in the demo notice', () => {
    expect(demoNotice({ name: 'Example Centre', demo: true }, 2)).toBe('The Example Centre and its two observing sites are invented for this demo of gloaming.');
    expect(demoNotice({ name: 'The Example Club', demo: true }, 1)).toBe('The Example Club and its observing site is invented for this demo of gloaming.');
  });

  it('a dark accent is refused with its place, the ratio and what would pass', () => {
    const e = errorOf('name: X\naccent: "#2a3f7a"\n');
    expect(e.message).toMatch(/^centre\.yaml:2:9 field 'accent': the accent #2a3f7a has a contrast of \d\.\d\d:1 against the dark mode's background #0c1019, below WCAG AA/);
    expect(e.message).toContain('#f3b962');
    expect(errorOf('name: X\naccent: orange\n').message).toMatch(/^centre\.yaml:2:9 field 'accent': the accent must be a hex colour/);
  });

  it('names the line and column of other bad fields', () => {
    expect(errorOf('name: X\nurl: sky.example.net\n').message).toMatch(/^centre\.yaml:2:6 field 'url': the public address is not a URL/);
    expect(errorOf('name: X\nlocale: xx-nonsense-123456789\n').message).toMatch(/^centre\.yaml:2:9 field 'locale': unknown locale/);
    expect(errorOf('name: X\nlogo: missing.png\n').message).toMatch(/^centre\.yaml:2:7 field 'logo': the logo file does not exist/);
    expect(errorOf('name: X\nlogo: ../outside.svg\n').message).toMatch(/field 'logo': the logo must be inside the content folder/);
    expect(errorOf('name: X\nlogo: logo.gif\n').message).toMatch(/field 'logo': a logo cannot be a '\.gif'/);
    expect(errorOf('name: X\ndemo: yes\n').message).toMatch(/^centre\.yaml:2:7 field 'demo'/);
    expect(errorOf('name: X\ncolour: red\n').message).toMatch(/^centre\.yaml:2:9 field 'colour': unknown centre field 'colour'/);
    expect(errorOf('shortName: X\n').message).toMatch(/field 'name': the centre needs a name/);
    expect(errorOf('name: X\nlinks:\n  - { label: Home, href: "javascript:alert(1)" }\n').message).toMatch(/^centre\.yaml:3:\d+ field 'links\.0\.href'/);
  });

  it('renders the footer Markdown without raw HTML and refuses unsafe links at their line', () => {
    const centre = parseCentre('name: X\nlogo: logo.svg\nfooter: |\n  Open on *clear* Fridays.\n  <script>alert(1)</script>\n  [Visit](https://example.net/visit)\n', 'centre.yaml', dir);
    expect(centre.footerHtml).toContain('<em>clear</em>');
    expect(centre.footerHtml).toContain('<a href="https://example.net/visit">Visit</a>');
    expect(centre.footerHtml).not.toContain('<script');
    const e = errorOf('name: X\nfooter: |\n  First line.\n  [bad](javascript:alert(1))\n');
    expect(e.message).toMatch(/^centre\.yaml:4:\d+ field 'footer': the link address 'javascript:alert\(1\)'/);
  });

  it('a missing centre.yaml says how to write one', () => {
    expect(() => loadCentre(join(dir, 'nowhere'))).toThrow(/there is no centre\.yaml in the content folder; expected a file naming the centre/);
  });

  it("gives sites without a locale the centre's default locale", () => {
    const text = 'latitude: 40\nlongitude: -3.7\ntimeZone: Europe/Madrid\nsky: { bortle: 5 }\n';
    expect(parseSite(text, 'sites/x.yaml', { defaultLocale: 'es-ES' }).locale).toBe('es-ES');
    expect(parseSite(`${text}locale: en-US\n`, 'sites/x.yaml', { defaultLocale: 'es-ES' }).locale).toBe('en-US');
  });
});
