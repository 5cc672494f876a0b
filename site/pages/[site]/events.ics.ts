/** One iCalendar feed per site (computed with the site in the content layer, see site/gloaming/calendar.ts). */
import type { APIRoute, GetStaticPaths } from 'astro';
import { builtSites, entryText, type SiteEntry } from '../../data.ts';

export const getStaticPaths = (async () => {
  return (await builtSites()).map((site) => ({ params: { site: site.id }, props: { site } }));
}) satisfies GetStaticPaths;

export const GET: APIRoute = ({ props }) => {
  const { site } = props as { site: SiteEntry };
  return new Response(entryText(site.calendarFile!), { headers: { 'Content-Type': 'text/calendar; charset=utf-8' } });
};
