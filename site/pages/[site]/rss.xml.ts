/** One RSS feed per site: its bulletins up to the current week, newest first. */
import rss from '@astrojs/rss';
import type { APIRoute, GetStaticPaths } from 'astro';
import { CENTRE } from '../../gloaming/centre.ts';
import { builtSites, pagesOf, paths, type SiteEntry } from '../../data.ts';

export const getStaticPaths = (async () => {
  return (await builtSites()).map((site) => ({ params: { site: site.id }, props: { site } }));
}) satisfies GetStaticPaths;

export const GET: APIRoute = async ({ props, site: origin }) => {
  const { site } = props as { site: SiteEntry };
  const pages = (await pagesOf(site.id)).filter((p) => p.weekId <= site.currentWeek).reverse();
  return rss({
    title: `${site.name} · ${CENTRE.name}`,
    description: `Weekly night-sky bulletins for ${site.name}. ${CENTRE.inventedNote}`,
    site: origin!,
    items: pages.map((p) => ({
      title: `${p.title} (${p.weekLabel})`,
      link: paths.page(p),
      // Monday of the bulletin's week, at 00:00 UTC: stable from build to build.
      pubDate: new Date(`${p.weekStart}T00:00:00Z`),
      description: p.description,
    })),
    customData: '<language>en</language>',
  });
};
