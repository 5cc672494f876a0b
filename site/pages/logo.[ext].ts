/** The centre's logo (`logo:` in content/centre.yaml), served from the site's root as /logo.<ext>. */
import { readFileSync } from 'node:fs';
import type { APIRoute, GetStaticPaths } from 'astro';
import { LOGO_TYPES } from '../../lib/outputs/centre.ts';
import { centre } from '../data.ts';

export const getStaticPaths = (async () => {
  const { logoFile, logoPath } = await centre();
  if (!logoFile || !logoPath) return [];
  return [{ params: { ext: logoPath.slice('/logo.'.length) }, props: { file: logoFile } }];
}) satisfies GetStaticPaths;

export const GET: APIRoute = ({ props, params }) => {
  const { file } = props as { file: string };
  return new Response(readFileSync(file), { headers: { 'Content-Type': LOGO_TYPES[`.${params.ext}`] ?? 'application/octet-stream' } });
};
