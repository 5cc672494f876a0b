/**
 * End to end: the built demo opened in headless Chromium as a phone (390×844 CSS px), the way a
 * reader meets it outside. Checks layout (nothing scrolls sideways), text size, tap targets,
 * images and fonts, the red night light (no JavaScript), and text contrast in both modes
 * (WCAG 2.1 relative luminance and contrast ratio, success criterion 1.4.3: ≥ 4.5:1).
 * Also the print stylesheet (light, no navigation, A4 and Letter; PDFs rendered by Chromium) and the
 * static "tonight" fragment a centre's own website includes. Screenshots go to .scratch/ for a person to look at.
 */
import { existsSync, mkdirSync, readFileSync, realpathSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { extname, join, resolve } from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { readdirSync, statSync } from 'node:fs';
import { CATALOGUES } from '../lib/core/language/index.ts';
import { NAMES } from '../lib/core/language/names/index.ts';
import { loadCentre } from '../lib/outputs/centre.ts';
import { loadSatellites } from '../lib/models/satellite/catalogue.ts';
import { loadBodies } from '../lib/models/content.ts';

const ROOT = resolve(import.meta.dirname, '..');
const CHROMIUM = '/usr/bin/chromium';
const TODAY = '2026-12-04';
const SHOTS = join(ROOT, '.scratch');

// Every kind of page once, every site's home once. A site's home page carries this week's weekly
// bulletin whole, so the English weekly pages are covered there (and by the policy, night-light and
// print checks below, which open one); the weekly page with its pager is checked in Spanish.
const PAGES = [
  '/',
  '/harbour-roof/',
  '/harbour-roof/2026-W49/wonders/',
  '/southern-station/',
  '/northern-outpost/',
  '/northern-outpost/archive/',
  '/cerro-lucero/',
  '/cerro-lucero/2026-W49/weekly/',
];

const TYPES: Record<string, string> = { '.html': 'text/html; charset=utf-8', '.png': 'image/png', '.woff2': 'font/woff2', '.xml': 'application/xml', '.css': 'text/css', '.svg': 'image/svg+xml' };

let server: Server;
let origin: string;
let browser: Browser;

function serve(dir: string): Promise<Server> {
  const s = createServer((req, res) => {
    let path = decodeURIComponent(new URL(req.url ?? '/', 'http://x').pathname);
    if (path.endsWith('/')) path += 'index.html';
    const file = join(dir, path);
    if (!file.startsWith(dir) || !existsSync(file)) {
      res.writeHead(404).end('not found');
      return;
    }
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
  });
  return new Promise((done) => s.listen(0, '127.0.0.1', () => done(s)));
}

/** WCAG 2.1 relative luminance of an sRGB colour `rgb(r, g, b)`. */
function luminance(css: string): number {
  const [r, g, b] = css.match(/[\d.]+/g)!.slice(0, 3).map((v) => {
    const c = Number(v) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  }) as [number, number, number];
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x) as [number, number];
  return (hi + 0.05) / (lo + 0.05);
}

async function open(path: string): Promise<Page> {
  const page = await browser.newPage({ viewport: { width: 390, height: 844 }, deviceScaleFactor: 2 });
  const response = await page.goto(origin + path, { waitUntil: 'load' });
  expect(response?.status(), path).toBe(200);
  await page.evaluate('document.fonts.ready.then(() => true)');
  // Finder charts load lazily (loading="lazy"); a reader scrolls to them. Ask for every image now
  // and wait until each is decoded (scrolling to each in turn costs about 1.7 s a page of waiting
  // for the lazy-load threshold, and checks nothing more).
  await page.evaluate(`Promise.all([...document.images].map((img) => { img.loading = 'eager'; return img.decode().catch(() => null); }))`);
  return page;
}

/** Runs in the page (plain JavaScript: the project's TypeScript has no DOM types). */
const MEASURE = `(() => {
  const vw = document.documentElement.clientWidth;
  const small = [];
  const wide = [];
  const inScroller = (el) => {
    for (let p = el.parentElement; p; p = p.parentElement) if (getComputedStyle(p).overflowX === 'auto') return true;
    return false;
  };
  for (const el of document.body.querySelectorAll('*')) {
    const style = getComputedStyle(el);
    if (style.display === 'none' || style.visibility === 'hidden' || el.closest('.sr-only')) continue;
    const ownText = [...el.childNodes].some((n) => n.nodeType === Node.TEXT_NODE && n.textContent.trim() !== '');
    if (ownText && parseFloat(style.fontSize) < 16) small.push(el.tagName + '.' + el.className + ' ' + style.fontSize);
    const r = el.getBoundingClientRect();
    if (r.width > 0 && (r.right > vw + 0.5 || r.left < -0.5) && !inScroller(el) && !el.classList.contains('skip')) {
      wide.push(el.tagName + '.' + el.className + ' ' + r.left + '–' + r.right);
    }
  }
  const targets = [...document.querySelectorAll('.bar a, .bar label, .pager a')].map((el) => {
    const r = el.getBoundingClientRect();
    return { text: el.textContent.trim(), width: r.width, height: r.height };
  });
  return {
    scrollWidth: document.documentElement.scrollWidth,
    vw,
    small,
    wide,
    targets,
    images: [...document.images].map((img) => ({ src: img.src, ok: img.complete && img.naturalWidth > 0 })),
    fontsLoaded: [...document.fonts].filter((f) => f.status === 'loaded').map((f) => f.weight),
    og: document.querySelector('meta[property="og:image"]')?.getAttribute('content') ?? null,
    lang: document.documentElement.lang,
    h1: document.querySelectorAll('h1').length,
  };
})()`;

interface Measures {
  scrollWidth: number;
  vw: number;
  small: string[];
  wide: string[];
  targets: { text: string; width: number; height: number }[];
  images: { src: string; ok: boolean }[];
  fontsLoaded: string[];
  og: string | null;
  lang: string;
  h1: number;
}

// A developer machine without Debian's Chromium skips these checks; CI (.ci/run installs it)
// never does: there a missing browser fails the run.
const available = existsSync(CHROMIUM) || process.env.CI === 'true';

/** The shared demo build's output folder. */
let dist: string;

beforeAll(async () => {
  if (!available) return;
  // The suite's shared demo build (test/setup/demo-build.ts), read only.
  const demo = inject('demoBuild');
  expect(demo.today).toBe(TODAY);
  dist = realpathSync(demo.dist);
  server = await serve(dist);
  const address = server.address() as { port: number };
  origin = `http://127.0.0.1:${address.port}`;
  browser = await chromium.launch({ executablePath: CHROMIUM, args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-background-networking'] });
  mkdirSync(SHOTS, { recursive: true });
}, 180_000);

afterAll(async () => {
  await browser?.close();
  server?.close();
});

describe.skipIf(!available)('built pages on a phone (390×844)', () => {
  for (const path of PAGES) {
    it(`${path}: no sideways scrolling, text ≥ 16 px, tap targets ≥ 44 px, images and fonts load`, async () => {
      const page = await open(path);
      const m = (await page.evaluate(MEASURE)) as Measures;
      expect(m.scrollWidth, 'page width').toBeLessThanOrEqual(m.vw);
      expect(m.wide, 'elements sticking out sideways').toEqual([]);
      expect(m.small, 'text smaller than 16 px').toEqual([]);
      for (const t of m.targets) expect(Math.min(t.width, t.height), `tap target '${t.text}'`).toBeGreaterThanOrEqual(44);
      for (const img of m.images) expect(img.ok, img.src).toBe(true);
      expect(m.fontsLoaded.sort()).toEqual(['400', '700']);
      expect(m.lang).toMatch(path.startsWith('/cerro-lucero/') ? /^es-CL$/ : /^en/);
      expect(m.h1).toBe(1);
      if (m.og) {
        // The social card the page announces exists and is a PNG.
        const res = await page.request.get(origin + new URL(m.og).pathname);
        expect(res.status()).toBe(200);
        expect(res.headers()['content-type']).toBe('image/png');
      }
      await page.screenshot({ path: join(SHOTS, `e2e${path.replace(/\//g, '_')}.png`) });
      await page.close();
    });
  }

  it('the Content-Security-Policy blocks a script slipped into a page and nothing the page needs', async () => {
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    const violations: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy/i.test(m.text())) violations.push(m.text());
    });
    await page.goto(origin + '/southern-station/2026-W49/weekly/', { waitUntil: 'load' });
    await page.evaluate('document.fonts.ready.then(() => true)');
    expect(violations, 'the page itself breaks its policy').toEqual([]);
    // As if a content file had smuggled markup in: an inline script and an event handler.
    await page.evaluate(`(() => {
      const s = document.createElement('script'); s.textContent = 'window.__ran = 1'; document.body.append(s);
      const img = document.createElement('img'); img.setAttribute('onerror', 'window.__ran = 2'); img.src = '/nowhere.png'; document.body.append(img);
      return new Promise((r) => setTimeout(r, 300));
    })()`);
    expect(await page.evaluate('window.__ran ?? null')).toBeNull();
    expect(violations.length).toBeGreaterThan(0);
    await page.close();
  });

  it('the red night light needs no JavaScript, turns the whole page red, and keeps contrast ≥ 4.5:1', async () => {
    const browserNoJs = await browser.newContext({ viewport: { width: 390, height: 844 }, javaScriptEnabled: false });
    const page = await browserNoJs.newPage();
    await page.goto(origin + '/harbour-roof/2026-W49/weekly/');
    const colours = async (): Promise<{ bg: string; fg: string; muted: string; accent: string }> =>
      (await page.evaluate(`({
        bg: getComputedStyle(document.body).backgroundColor,
        fg: getComputedStyle(document.body).color,
        muted: getComputedStyle(document.querySelector('.meta')).color,
        accent: getComputedStyle(document.querySelector('.kicker')).color,
      })`)) as { bg: string; fg: string; muted: string; accent: string };
    const dark = await colours();
    for (const c of [dark.fg, dark.muted, dark.accent]) expect(contrast(c, dark.bg)).toBeGreaterThanOrEqual(4.5);
    await page.click('label[for=red-light]');
    const red = await colours();
    expect(red.bg).toBe('rgb(0, 0, 0)');
    for (const c of [red.fg, red.muted, red.accent]) {
      const [r, g, b] = c.match(/\d+/g)!.map(Number) as [number, number, number];
      expect(r, c).toBeGreaterThan(2 * Math.max(g, b)); // red dominates: little light at the wavelengths dark adaptation needs
      expect(contrast(c, red.bg), c).toBeGreaterThanOrEqual(4.5);
    }
    await page.screenshot({ path: join(SHOTS, 'e2e-red-light.png') });
    await browserNoJs.close();
  });
});

/** Printable widths of the two paper sizes, CSS px at 96 per inch, with the print stylesheet's 12 mm side margins. */
const PAPER = { A4: { widthPx: (210 - 24) / 25.4 * 96 }, Letter: { widthPx: (8.5 * 25.4 - 24) / 25.4 * 96 } };

describe.skipIf(!available)('printing a bulletin (print stylesheet)', () => {
  it('prints light, without navigation, within the width of A4 and Letter; the PDFs have a few pages', async () => {
    const page = await browser.newPage({ viewport: { width: Math.floor(PAPER.A4.widthPx), height: 1100 } });
    await page.goto(origin + '/harbour-roof/2026-W49/weekly/', { waitUntil: 'load' });
    await page.evaluate('document.fonts.ready.then(() => true)');
    await page.evaluate(`Promise.all([...document.images].map((img) => { img.loading = 'eager'; return img.decode().catch(() => null); }))`);
    await page.emulateMedia({ media: 'print' });
    const look = (await page.evaluate(`({
      bg: getComputedStyle(document.body).backgroundColor,
      fg: getComputedStyle(document.body).color,
      accent: getComputedStyle(document.querySelector('.bulletin time, .bulletin [data-value], .value') ?? document.body).color,
      hidden: ['.bar', '.crumbs', '.pager', '.skip'].map((s) => [...document.querySelectorAll(s)].every((el) => getComputedStyle(el).display === 'none')),
      scrollWidth: document.documentElement.scrollWidth,
      vw: document.documentElement.clientWidth,
    })`)) as { bg: string; fg: string; accent: string; hidden: boolean[]; scrollWidth: number; vw: number };
    expect(look.bg).toBe('rgb(255, 255, 255)');
    expect(contrast(look.fg, look.bg)).toBeGreaterThanOrEqual(7); // WCAG 2.1 AAA for body text on paper
    expect(contrast(look.accent, look.bg)).toBeGreaterThanOrEqual(4.5);
    expect(look.hidden).toEqual([true, true, true, true]);
    expect(look.scrollWidth, 'nothing wider than an A4 page').toBeLessThanOrEqual(look.vw);
    await page.screenshot({ path: join(SHOTS, 'e2e-print-a4.png'), fullPage: true });
    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await page.pdf({ format, printBackground: true });
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      // Page objects of the PDF (ISO 32000-1 §7.7.3.3: /Type /Page); a week's bulletin fits a few sheets.
      const pages = pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g)?.length ?? 0;
      expect(pages, `${format} pages`).toBeGreaterThanOrEqual(1);
      expect(pages, `${format} pages`).toBeLessThanOrEqual(6);
    }
    await page.setViewportSize({ width: Math.floor(PAPER.Letter.widthPx), height: 1100 });
    expect(await page.evaluate('document.documentElement.scrollWidth <= document.documentElement.clientWidth')).toBe(true);
    await page.close();
  });
});

describe.skipIf(!available)('the "tonight" fragment', () => {
  it('is static HTML without script, styles or a document around it, and links absolutely to the public site', async () => {
    const res = await fetch(origin + '/harbour-roof/tonight.html');
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html).toMatch(/^<section class="gloaming-tonight" lang="en-GB">/);
    expect(html).not.toMatch(/<(script|style|html|head|body|link|img|iframe)\b/i);
    expect(html).not.toMatch(/\bon[a-z]+=/i);
    expect(html).toContain('Tonight at Harbour Roof Terrace, Fri 4 Dec');
    expect(html).toMatch(/<dt>Sunset<\/dt><dd><time datetime="2026-12-04T\d\d:\d\d:\d\d\+00:00">\d\d:\d\d<\/time><\/dd>/);
    for (const m of html.matchAll(/href="([^"]+)"/g)) expect(m[1]).toMatch(/^https:\/\/sky\.example\.org\//);
    // Included into another page, it shows its facts (and nothing of the gloaming page's look).
    const page = await browser.newPage({ viewport: { width: 390, height: 844 } });
    await page.setContent(`<!doctype html><html><body><main><h1>Visit us</h1>${html}</main></body></html>`);
    expect(await page.textContent('.gloaming-tonight')).toMatch(/Sunset\s*\d\d:\d\d/);
    await page.screenshot({ path: join(SHOTS, 'e2e-tonight-fragment.png') });
    await page.close();
  });
});

/** The words of a catalogue's messages (ICU syntax and argument names left out), lower case. */
function catalogueWords(messages: Iterable<string>): Set<string> {
  const out = new Set<string>();
  for (const m of messages) {
    const text = m.replace(/\{[A-Za-z_]+(, (plural|select),)?/g, ' ').replace(/\b(one|other|masculine|feminine|neuter|plural-\w+|left|right|civil|nautical|new-moon|full-moon|[a-z]+-[a-z-]+)\s*\{/g, ' ');
    for (const w of text.toLowerCase().match(/\p{L}+/gu) ?? []) out.add(w);
  }
  return out;
}

/** Every HTML file below `dir`. */
function htmlFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const path = join(dir, name);
    return statSync(path).isDirectory() ? htmlFiles(path) : name.endsWith('.html') ? [path] : [];
  });
}

describe.skipIf(!available)('a site in Spanish (the invented Observatorio Cerro Lucero, es-CL)', () => {
  // Words only the English catalogue has: any of them on a Spanish page is a message that was not translated.
  const spanish = catalogueWords([...Object.values(CATALOGUES.es), ...Object.values(NAMES.es.patterns).flatMap((p) => [p.name, p.phrase, ...Object.values(p.parts ?? {}).map((x) => x.phrase)])]);
  const englishOnly = [...catalogueWords(Object.values(CATALOGUES.en))].filter((w) => w.length >= 4 && !spanish.has(w));

  const centre = loadCentre(join(ROOT, 'content'));
  // Names from the content (the centre's, written in its language; the invented satellites' and comet's own names) are not catalogue messages.
  const objects = loadBodies(join(ROOT, 'content', 'objects'));
  const contentNames = [
    centre.name,
    centre.shortName,
    ...loadSatellites(join(ROOT, 'content', 'satellites')).map((s) => s.name),
    ...objects.ids().map((id) => objects.get(id).name).filter((n) => /\s/.test(n)),
  ];
  /** Words of the English catalogue only, in a text a reader sees or hears. */
  const englishWordsIn = (text: string): string[] => {
    let t = text;
    for (const name of contentNames) t = t.replaceAll(name, ' ');
    const words = new Set(t.toLowerCase().match(/\p{L}+/gu) ?? []);
    return englishOnly.filter((w) => words.has(w));
  };

  it('its pages (bulletin with its events and satellite passes, site, archive, week pages, the tonight.html fragment) contain no word of the English catalogue', () => {
    const dir = join(dist, 'cerro-lucero');
    // The English versions of its bulletins (weekly.en) are English by design.
    const pages = htmlFiles(dir).filter((f) => !/\/[\w-]+\.en\//.test(f));
    expect(pages.length).toBeGreaterThan(10);
    expect(pages.some((f) => f.endsWith('/tonight.html'))).toBe(true);
    expect(englishOnly.length).toBeGreaterThan(200);
    const found: string[] = [];
    for (const file of pages) {
      // The centre's footer and links come from content/centre.yaml, written in the centre's language: not catalogue messages.
      const html = readFileSync(file, 'utf8')
        .replace(/<div class="centre-footer">[\s\S]*?<\/div>/g, ' ')
        .replace(/<ul class="centre-links">[\s\S]*?<\/ul>/g, ' ');
      // What a reader sees or hears: text, alt text, titles, labels, descriptions (not class names or URLs).
      const said = [
        ...html.replace(/<style[^>]*>[\s\S]*?<\/style>/g, ' ').replace(/<[^>]+>/g, ' ').split(/\s+/),
        ...[...html.matchAll(/\s(?:alt|title|aria-label)="([^"]*)"/g)].map((m) => m[1]!),
        ...[...html.matchAll(/<meta (?:name|property)="(?:description|og:title|og:description|og:image:alt)" content="([^"]*)"/g)].map((m) => m[1]!),
      ].join(' ');
      for (const w of englishWordsIn(said)) found.push(`${file.slice(dir.length)}: ${w}`);
    }
    expect(found).toEqual([]);
  });

  it("the Spanish weekly bulletin lists the week's events and satellite passes, in Spanish", () => {
    const page = readFileSync(join(dist, 'cerro-lucero', '2026-W49', 'weekly', 'index.html'), 'utf8');
    expect(page).toMatch(/<ul class="gl gl-events"/);
    expect(page).toMatch(/class="gl gl-passes"/);
    // A Moon phase of the week (last quarter on 1 December 2026, from the almanac) in the Spanish catalogue's words.
    expect(page).toContain('Cuarto menguante el mar, 1 dic a las');
  });

  it('its calendar feed (events.ics) and RSS feed are in Spanish', () => {
    const ics = readFileSync(join(dist, 'cerro-lucero', 'events.ics'), 'utf8').replace(/\r\n[ \t]/g, '');
    const values = [...ics.matchAll(/^(?:SUMMARY|DESCRIPTION|X-WR-CALNAME):(.*)$/gm)].map((m) => m[1]!.replace(/\\n/g, ' ').replace(/\\([,;\\])/g, '$1'));
    expect(values.length).toBeGreaterThan(20);
    expect(englishWordsIn(values.join(' '))).toEqual([]);
    // The feed's text, without its markup and addresses.
    const rss = readFileSync(join(dist, 'cerro-lucero', 'rss.xml'), 'utf8').replace(/<[^>]+>/g, ' ').replace(/https?:\/\/\S+/g, ' ');
    expect(englishWordsIn(rss)).toEqual([]);
  });

  it('says its language (<html lang="es-CL">) and links the English version of the bulletin both ways with hreflang', () => {
    const es = readFileSync(join(dist, 'cerro-lucero', '2026-W49', 'weekly', 'index.html'), 'utf8');
    const en = readFileSync(join(dist, 'cerro-lucero', '2026-W49', 'weekly.en', 'index.html'), 'utf8');
    expect(es).toMatch(/<html lang="es-CL"/);
    expect(en).toMatch(/<html lang="en-CL"/);
    expect(es).toMatch(/<link rel="alternate" hreflang="en-CL" href="[^"]*\/cerro-lucero\/2026-W49\/weekly\.en\/"/);
    expect(en).toMatch(/<link rel="alternate" hreflang="es-CL" href="[^"]*\/cerro-lucero\/2026-W49\/weekly\/"/);
    expect(en).toContain('After dark this week');
  });

  it('draws its finder charts with Spanish labels (compass letters with O for oeste, fists as puños)', () => {
    const page = readFileSync(join(dist, 'cerro-lucero', '2026-W49', 'weekly', 'index.html'), 'utf8');
    const src = /<img src="(\/charts\/[^"]+\.svg)"/.exec(page)?.[1];
    expect(src, 'the Spanish weekly page has a finder chart').toBeDefined();
    const svg = readFileSync(join(dist, src!), 'utf8');
    const labels = [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => m[1]!);
    expect(labels.some((l) => /puños?$/.test(l))).toBe(true);
    expect(labels.some((l) => /mirando al/.test(l))).toBe(true);
    expect(labels.filter((l) => /\b(fists?|facing|Sun set here)\b/.test(l))).toEqual([]);
  });
});
