/**
 * The "tonight" fragment of a site (`/<site>/tonight.html`): a few lines of plain, static HTML —
 * no document around it, no script, no styles of its own, no images — that a centre's existing
 * website includes (a server-side include, a CMS block, a build step copying it in) to show
 * tonight's sunset, darkness and Moon with a link to the week's bulletin. Classes (`gloaming-…`)
 * let the host style it; every link is absolute (the centre's public address), so it works on
 * another site. Rebuilt with the site every week, like the pages.
 */
import { wordsFor } from '../../lib/core/language/index.ts';
import { escapeXml } from '../../lib/outputs/chart/svg.ts';
import type { NightRow, ShownTime } from './nights.ts';

/** Text for HTML (the same escaping as XML text and attributes). */
const text = escapeXml;

function time(t: ShownTime): string {
  return t.datetime ? `<time datetime="${text(t.datetime)}">${text(t.text)}</time>` : text(t.text);
}

export interface TonightInput {
  siteName: string;
  /** BCP 47 locale of the site: the fragment's words and its `lang`. */
  lang: string;
  tonight: NightRow;
  /** Absolute address of the site's page, and of this week's bulletin (or null). */
  siteUrl: string;
  bulletin: { title: string; url: string } | null;
  centreName: string;
}

/** A catalogue sentence as HTML with one link in it: the words escaped, the link's markup kept. */
function withLink(sentence: (link: string) => string, href: string, label: string): string {
  const mark = '\u0000link\u0000';
  return text(sentence(mark)).replace(mark, `<a href="${text(href)}">${text(label)}</a>`);
}

/** The fragment's HTML (one `<section>`), in the site's language. */
export function tonightFragment(input: TonightInput): string {
  const n = input.tonight;
  const w = wordsFor(input.lang);
  const moonTime = n.moon.time ? ` ${time(n.moon.time)}` : '';
  const phase = w.t('ui.moon-phase-line', { phase: n.moonPhase });
  const centre = input.centreName;
  return [
    `<section class="gloaming-tonight" lang="${text(input.lang)}">`,
    `<h2 class="gloaming-tonight-title">${text(w.t('ui.fragment-title', { site: input.siteName, date: n.label }))}</h2>`,
    '<dl class="gloaming-tonight-facts">',
    `<dt>${text(w.t('ui.sunset'))}</dt><dd>${time(n.sunset)}</dd>`,
    `<dt>${text(w.t('ui.dark'))}</dt><dd>${time(n.darkness)}</dd>`,
    `<dt>${text(w.t('ui.moon'))}</dt><dd>${text(n.moon.verb)}${moonTime} · ${text(phase)}, ${text(w.t('ui.row-lit', { percent: w.percent(n.moonLitPercent / 100) }))}</dd>`,
    '</dl>',
    input.bulletin
      ? `<p class="gloaming-tonight-more">${withLink((link) => w.t('ui.fragment-bulletin', { link, centre }), input.bulletin.url, input.bulletin.title)}</p>`
      : `<p class="gloaming-tonight-more">${withLink((link) => w.t('ui.fragment-site', { link, centre }), input.siteUrl, w.t('ui.fragment-site-link', { site: input.siteName }))}</p>`,
    '</section>',
    '',
  ].join('\n');
}
