/** The "tonight" fragment of a site, for a centre's own website to include (site/gloaming/fragment.ts). */
import type { APIRoute, GetStaticPaths } from 'astro';
import { tonightFragment } from '../../gloaming/fragment.ts';
import { builtSites, centre, mainPageOf, pagesOf, paths, type SiteEntry } from '../../data.ts';

export const getStaticPaths = (async () => {
  return (await builtSites()).map((site) => ({ params: { site: site.id }, props: { site } }));
}) satisfies GetStaticPaths;

export const GET: APIRoute = async ({ props, site: origin }) => {
  const { site } = props as { site: SiteEntry };
  const current = mainPageOf(await pagesOf(site.id), site.currentWeek);
  const tonight = site.nights[0];
  if (!tonight) throw new Error(`no nights computed for site '${site.id}'`);
  const html = tonightFragment({
    siteName: site.name,
    lang: site.locale,
    tonight,
    siteUrl: new URL(paths.site(site.id), origin).href,
    bulletin: current ? { title: current.title, url: new URL(paths.page(current), origin).href } : null,
    centreName: (await centre()).name,
  });
  return new Response(html, { headers: { 'Content-Type': 'text/html; charset=utf-8' } });
};
