/**
 * Starts the site's dev server with Astro's programmatic `dev()` API, configured as
 * astro.config.mjs does, and prints `{"origin": "http://127.0.0.1:<port>"}` on one line when it
 * is ready; stops when its standard input closes. Run by test/site-dev.test.ts in a child process
 * (Astro's dev server leaves pages to Vitest when `VITEST` is set, so it runs apart):
 *
 *   node test/helpers/dev-server.ts <options as JSON: today, sites, content, cacheDir, port>
 */
import { resolve } from 'node:path';
import { dev } from 'astro';
import { siteConfig } from '../../astro.config.mjs';

const ROOT = resolve(import.meta.dirname, '../..');
const { port, ...options } = JSON.parse(process.argv[2] ?? '{}') as { today: string; sites: string[]; content: string; cacheDir: string; port: number };
const server = await dev({ ...siteConfig(options), root: ROOT, configFile: false, logLevel: 'warn', server: { host: '127.0.0.1', port } });
console.log(JSON.stringify({ origin: `http://127.0.0.1:${server.address.port}` }));
process.stdin.resume();
process.stdin.on('close', () => void server.stop().then(() => process.exit(0)));
