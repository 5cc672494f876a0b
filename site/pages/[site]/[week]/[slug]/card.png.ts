/**
 * The social card of one bulletin page (1200×630 PNG), referenced by the page's og:image. The
 * build drew it beside the page (site/gloaming/session.ts) into the card cache; this route reads
 * it back by its input's hash, and draws it only when the cache has lost it.
 */
import type { APIRoute, GetStaticPaths } from 'astro';
import { cards } from 'virtual:gloaming';
import { cardInputOf, renderCardCached } from '../../../../gloaming/card.ts';
import { allPages, allSites, centre, type PageEntry, type SiteEntry } from '../../../../data.ts';

export const getStaticPaths = (async () => {
  const sites = new Map((await allSites()).map((s) => [s.id, s]));
  return (await allPages()).map((page) => ({
    params: { site: page.siteId, week: page.weekId, slug: page.slug },
    props: { page, site: sites.get(page.siteId)! },
  }));
}) satisfies GetStaticPaths;

export const GET: APIRoute = async ({ props }) => {
  const { page, site } = props as { page: PageEntry; site: SiteEntry };
  const png = await renderCardCached(cardInputOf(page, site, await centre()), { cacheDir: cards.dir, codeDigest: cards.codeDigest });
  return new Response(Buffer.from(png), { headers: { 'Content-Type': 'image/png' } });
};
