// Astro configuration for the gloaming site. `npm run build` (scripts/build.ts) builds with
// `siteConfig({ session })`: the build date, the site subset and the content folder travel in the
// gloaming() integration's session, not in the environment. `npm run dev` and `astro check` use
// the default export below.
//
// Environment (all optional):
//   GLOAMING_TODAY      the build date for `npm run dev` and `astro check`, YYYY-MM-DD (`npm run dev` sets today's)
//   GLOAMING_SITE_URL   overrides the public address of content/centre.yaml (`url`), e.g. for a staging host;
//                       with neither, the build is a preview whose absolute links point to http://localhost:4321/
//   GLOAMING_CACHE_DIR  where Astro keeps its content-layer store, the charts and the cards between builds
import { defineConfig } from 'astro/config';
import { createHash } from 'node:crypto';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import sitemap from '@astrojs/sitemap';
import { loadCentre, publicOrigin } from './lib/outputs/centre.ts';
import gloaming from './site/gloaming/integration.ts';

const root = dirname(fileURLToPath(import.meta.url));

/** The centre's public address; a broken centre.yaml is reported with its place by the content loaders. */
function centreOrNull(content) {
  try {
    return loadCentre(resolve(root, content));
  } catch {
    return null;
  }
}

/**
 * The configuration of one build or dev server. `options` are gloaming()'s (see
 * site/gloaming/integration.ts): `today`, `sites`, `content`, `strict`, or a ready `session`.
 */
export function siteConfig({ cacheDir, ...options } = {}) {
  cacheDir ??= options.session?.cacheDir ?? process.env.GLOAMING_CACHE_DIR;
  const shard = [...(options.session?.sites ?? options.sites ?? [])].sort();
  const content = options.session?.contentDir ?? options.content ?? 'content';
  return defineConfig({
    site: publicOrigin(centreOrNull(content), process.env).url,
    srcDir: './site',
    publicDir: './site/public',
    output: 'static',
    trailingSlash: 'always',
    ...(cacheDir ? { cacheDir } : {}),
    build: {
      format: 'directory',
      // Every page carries its own small stylesheet: one request, nothing to go stale.
      inlineStylesheets: 'always',
    },
    compressHTML: true,
    devToolbar: { enabled: false },
    integrations: [
      sitemap({
        // A shard writes its own sitemap files; `scripts/build.ts --merge` joins them.
        // The name is short and stable for a given set of sites, however many sites a shard holds.
        ...(shard.length ? { filenameBase: `sitemap-shard-${createHash('sha256').update(shard.join(',')).digest('hex').slice(0, 10)}` } : {}),
        // Card images, charts and feeds are not pages.
        filter: (page) => !page.endsWith('.png') && !page.endsWith('.svg') && !page.endsWith('.xml'),
      }),
      // Last: its output checks run after the sitemap is written.
      gloaming(options),
    ],
  });
}

export default siteConfig({ today: process.env.GLOAMING_TODAY });
