/** One RSS feed per site: its bulletins up to the current week, newest first (site/gloaming/feed.ts). */
import rss from '@astrojs/rss';
import type { APIRoute, GetStaticPaths } from 'astro';
import { siteFeed } from '../../gloaming/feed.ts';
import { builtSites, centre, pagesOf, paths, type SiteEntry } from '../../data.ts';
import { noticeIn } from '../../gloaming/words.ts';

export const getStaticPaths = (async () => {
  return (await builtSites()).map((site) => ({ params: { site: site.id }, props: { site } }));
}) satisfies GetStaticPaths;

export const GET: APIRoute = async ({ props, site: origin }) => {
  const { site } = props as { site: SiteEntry };
  const pages = (await pagesOf(site.id)).filter((p) => p.weekId <= site.currentWeek).reverse();
  const publisher = await centre();
  return rss(
    siteFeed({
      siteName: site.name,
      centreName: publisher.name,
      note: noticeIn(publisher, site.locale) ?? '',
      language: site.locale,
      origin: origin!,
      pages: pages.map((p) => ({ title: p.title, description: p.description, weekLabel: p.when, weekStart: p.weekStart, path: paths.page(p) })),
    }),
  );
};
