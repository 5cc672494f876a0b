/**
 * Hostile or careless links in a bulletin (issue #14 §3): only http:, https:, mailto: and
 * relative addresses are published; anything else stops the build at the link's file:line:column.
 * Scheme rules: WHATWG URL Standard (scheme state; leading C0 controls and spaces stripped, tab and
 * newline removed); Markdown parsing of entities and autolinks: CommonMark 0.31 §2.5, §6.5.
 */
import { describe, expect, it } from 'vitest';
import { BodyRegistry } from '../lib/core/body.ts';
import { parseBulletin, renderBulletinSync } from '../lib/outputs/bulletin/index.ts';
import { isSafeUrl } from '../lib/outputs/bulletin/links.ts';
import { loadSites } from '../lib/models/content.ts';
import { GloamingError } from '../lib/core/errors.ts';
import { isoWeekOf } from '../lib/core/time.ts';

const site = [...loadSites('content/sites').values()][0]!;
const week = isoWeekOf('2026-12-02');
const bodies = new BodyRegistry();
const FRONT = '---\ntitle: T\nsites: all\nschedule: { every: week }\n---\n';

function render(markdown: string): string {
  return renderBulletinSync(parseBulletin(`${FRONT}${markdown}\n`, 'content/bulletins/links.md'), { site, week, bodies }).html;
}

function failure(markdown: string): GloamingError {
  try {
    render(markdown);
  } catch (error) {
    if (error instanceof GloamingError) return error;
    throw error;
  }
  throw new Error(`no error for ${markdown}`);
}

describe('bulletin links', () => {
  const hostile: [string, string][] = [
    ['[x](javascript:alert(1))', 'javascript'],
    ['[x](JavaScript:alert(1))', 'javascript'],
    ['[x](jav&#x61;script:alert(1))', 'javascript'], // character reference decoded by the parser
    ['[x](<\tjavascript:alert(1)>)', 'javascript'], // leading C0 whitespace
    ['[x](data:text/html;base64,PHNjcmlwdD4=)', 'data'],
    ['[x](vbscript:msgbox)', 'vbscript'],
    ['![chart](javascript:alert(1))', 'javascript'],
    ['<javascript:alert(1)>', 'javascript'], // an autolink
    ['[x][ref]\n\n[ref]: javascript:alert(1)', 'javascript'], // a reference definition (placed at line 10, where it is written)
  ];
  for (const [markdown, scheme] of hostile) {
    it(`refuses ${JSON.stringify(markdown)} with its place`, () => {
      const e = failure(`Intro line.\n\n${markdown}`);
      // Front matter: lines 1–5; "Intro line." line 6; the link line 8.
      const line = markdown.includes('[ref]:') ? 10 : 8;
      expect(e.message).toMatch(new RegExp(`^content/bulletins/links\\.md:${line}:\\d+: .*scheme '${scheme}:'`));
      expect(e.message).toMatch(/expected an http:, https: or mailto: address, or a relative one/);
    });
  }

  it('publishes http, https, mailto and relative links unchanged', () => {
    const html = render('[a](https://example.org/a?b=1) [b](http://example.org/) [c](mailto:sky@example.org) [d](/harbour-roof/) [e](../archive/) [f](#tonight) [g](?week=2) ![h](/charts/x.svg)');
    for (const href of ['https://example.org/a?b=1', 'http://example.org/', 'mailto:sky@example.org', '/harbour-roof/', '../archive/', '#tonight', '?week=2']) {
      expect(html).toContain(`href="${href}"`);
    }
    expect(html).toContain('src="/charts/x.svg"');
  });

  it('reads the scheme the way browsers do (WHATWG URL Standard)', () => {
    expect(isSafeUrl('java\nscript:alert(1)')).toBe(false);
    expect(isSafeUrl(' \u0001javascript:alert(1)')).toBe(false);
    expect(isSafeUrl('HTTPS://example.org')).toBe(true);
    expect(isSafeUrl('week:2/notes')).toBe(false); // a scheme, not a relative path
    expect(isSafeUrl('./week:2')).toBe(true);
  });
});
