// Astro configuration for the gloaming site. Build it through `npm run build`
// (scripts/build.ts), which sets the build date and the site subset, builds into a temporary
// folder, checks every page and then swaps the result into place.
//
// Environment (all optional except when noted):
//   GLOAMING_SITE_URL   overrides the public address of content/centre.yaml (`url`), e.g. for a staging host;
//                       with neither, the build is a preview whose absolute links point to http://localhost:4321/
//   GLOAMING_TODAY      the build date, YYYY-MM-DD (scripts/build.ts always sets it)
//   GLOAMING_SITES      comma-separated site ids to build (a CI shard); default: all
//   GLOAMING_CACHE_DIR  where Astro keeps its content-layer store between builds
import { defineConfig } from 'astro/config';
import { createHash } from 'node:crypto';
import { dirname, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import sitemap from '@astrojs/sitemap';
import { loadCentre, publicOrigin } from './lib/outputs/centre.ts';

const root = dirname(fileURLToPath(import.meta.url));
/** The centre's public address; a broken centre.yaml is reported with its place by the content loaders. */
function centreOrNull() {
  try {
    return loadCentre(resolve(root, process.env.GLOAMING_CONTENT || 'content'));
  } catch {
    return null;
  }
}
const siteUrl = publicOrigin(centreOrNull(), process.env).url;
const shard = (process.env.GLOAMING_SITES || '')
  .split(',')
  .map((s) => s.trim())
  .filter(Boolean)
  .sort();

export default defineConfig({
  site: siteUrl,
  srcDir: './site',
  publicDir: './site/public',
  output: 'static',
  trailingSlash: 'always',
  ...(process.env.GLOAMING_CACHE_DIR ? { cacheDir: process.env.GLOAMING_CACHE_DIR } : {}),
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
      // Card images and feeds are not pages.
      filter: (page) => !page.endsWith('.png') && !page.endsWith('.xml'),
    }),
  ],
});
