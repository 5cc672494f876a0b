/**
 * Finder charts: `/charts/<key>.svg`, one per chart a bulletin page links (`PageEntry.charts`).
 * The loader drew them into the session's chart cache (content-hashed files, lib/outputs/chart/cache.ts);
 * this route serves them, in `astro dev` as in the build, so only charts in use are published.
 */
import { readFile } from 'node:fs/promises';
import { join } from 'node:path';
import type { APIRoute, GetStaticPaths } from 'astro';
import { charts } from 'virtual:gloaming';
import { allPages } from '../../data.ts';

export const getStaticPaths = (async () => {
  const files = new Set((await allPages()).flatMap((p) => p.charts));
  return [...files].sort().map((file) => ({ params: { chart: file.replace(/\.svg$/, '') } }));
}) satisfies GetStaticPaths;

export const GET: APIRoute = async ({ params }) => {
  const svg = await readFile(join(charts.dir, `${params.chart}.svg`));
  return new Response(svg, { headers: { 'Content-Type': 'image/svg+xml' } });
};
