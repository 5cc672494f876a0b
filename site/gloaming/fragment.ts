/**
 * The "tonight" fragment of a site (`/<site>/tonight.html`): a few lines of plain, static HTML —
 * no document around it, no script, no styles of its own, no images — that a centre's existing
 * website includes (a server-side include, a CMS block, a build step copying it in) to show
 * tonight's sunset, darkness and Moon with a link to the week's bulletin. Classes (`gloaming-…`)
 * let the host style it; every link is absolute (the centre's public address), so it works on
 * another site. Rebuilt with the site every week, like the pages.
 */
import { escapeXml } from '../../lib/outputs/chart/svg.ts';
import type { NightRow, ShownTime } from './nights.ts';

/** Text for HTML (the same escaping as XML text and attributes). */
const text = escapeXml;

function time(t: ShownTime): string {
  return t.datetime ? `<time datetime="${text(t.datetime)}">${text(t.text)}</time>` : text(t.text);
}

export interface TonightInput {
  siteName: string;
  /** BCP 47 language of the site. */
  lang: string;
  tonight: NightRow;
  /** Absolute address of the site's page, and of this week's bulletin (or null). */
  siteUrl: string;
  bulletin: { title: string; url: string } | null;
  centreName: string;
}

/** The fragment's HTML (one `<section>`). */
export function tonightFragment(input: TonightInput): string {
  const n = input.tonight;
  const moonTime = n.moon.time ? ` ${time(n.moon.time)}` : '';
  const phase = /Moon$/.test(n.moonPhase) ? n.moonPhase : `${n.moonPhase} Moon`;
  return [
    `<section class="gloaming-tonight" lang="${text(input.lang)}">`,
    `<h2 class="gloaming-tonight-title">Tonight at ${text(input.siteName)}, ${text(n.label)}</h2>`,
    '<dl class="gloaming-tonight-facts">',
    `<dt>Sunset</dt><dd>${time(n.sunset)}</dd>`,
    `<dt>Dark (Sun 18° down)</dt><dd>${time(n.darkness)}</dd>`,
    `<dt>Moon</dt><dd>${text(n.moon.verb)}${moonTime} · ${text(phase)}, ${n.moonLitPercent}% lit</dd>`,
    '</dl>',
    input.bulletin
      ? `<p class="gloaming-tonight-more"><a href="${text(input.bulletin.url)}">${text(input.bulletin.title)}</a>: what to look for this week, from ${text(input.centreName)}.</p>`
      : `<p class="gloaming-tonight-more"><a href="${text(input.siteUrl)}">The sky at ${text(input.siteName)}</a>, from ${text(input.centreName)}.</p>`,
    '</section>',
    '',
  ].join('\n');
}
