/**
 * RSS escaping (issue #14 §3): text from content files reaches feed readers as text. A reader
 * decodes the XML (here: fast-xml-parser, npm) and shows title and description as HTML (RSS 2.0
 * specification, RSS Advisory Board: description is entity-encoded HTML; titles are treated the
 * same by common practice); parsing that HTML with parse5 (npm, the WHATWG HTML parsing algorithm
 * browsers use) must give back the original characters as one text node, never an element.
 */
import { getRssString } from '@astrojs/rss';
import { XMLParser } from 'fast-xml-parser';
import { parseFragment } from 'parse5';
import { describe, expect, it } from 'vitest';
import { siteFeed } from '../site/gloaming/feed.ts';

const HOSTILE_SITE = 'Pier <svg onload=alert(1)> & "Quay"';
const HOSTILE_TITLE = '<img src=x onerror=alert(2)> Tonight';
const HOSTILE_DESCRIPTION = 'Look &amp; see <script>alert(3)</script>';

/** What a reader shows for an HTML string: its text if it is only text, else null. */
function shownText(html: string): string | null {
  const fragment = parseFragment(html);
  if (!fragment.childNodes.every((n) => n.nodeName === '#text')) return null;
  return fragment.childNodes.map((n) => (n as { value: string }).value).join('');
}

describe('RSS feed escaping', () => {
  it('site names, titles and descriptions reach the reader as text, not markup', async () => {
    const xml = await getRssString(
      siteFeed({
        siteName: HOSTILE_SITE,
        centreName: 'Centre',
        note: 'Invented.',
        origin: 'https://sky.example.org',
        pages: [{ title: HOSTILE_TITLE, description: HOSTILE_DESCRIPTION, weekLabel: '30 Nov – 6 Dec 2026', weekStart: '2026-11-30', path: '/pier/2026-W49/weekly/' }],
      }),
    );
    const feed = new XMLParser({ processEntities: true, htmlEntities: false }).parse(xml) as {
      rss: { channel: { title: string; description: string; item: { title: string; description: string; link: string } } };
    };
    const { channel } = feed.rss;
    expect(shownText(channel.title)).toBe(`${HOSTILE_SITE} · Centre`);
    expect(shownText(channel.description)).toBe(`Weekly night-sky bulletins for ${HOSTILE_SITE}. Invented.`);
    expect(shownText(channel.item.title)).toBe(`${HOSTILE_TITLE} (30 Nov – 6 Dec 2026)`);
    expect(shownText(channel.item.description)).toBe(HOSTILE_DESCRIPTION);
    expect(channel.item.link).toBe('https://sky.example.org/pier/2026-W49/weekly/');
  });
});
