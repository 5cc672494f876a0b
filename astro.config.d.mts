// Types of astro.config.mjs, for scripts/build.ts (which builds with `siteConfig({ session })`).
import type { AstroUserConfig } from 'astro';
import type { GloamingOptions } from './site/gloaming/integration.ts';

/** The site's configuration; `cacheDir` defaults to the session's, else `GLOAMING_CACHE_DIR`, else Astro's. */
export function siteConfig(options?: GloamingOptions & { cacheDir?: string }): AstroUserConfig;
declare const config: AstroUserConfig;
export default config;
