/**
 * The Astro integration: `gloaming()` in astro.config.mjs. It owns one `GloamingSession` per
 * build or dev server — the project is loaded once and shared by the content loaders
 * (content.config.ts) — and adds:
 *
 * - `virtual:gloaming`: the session's cache folders and code digest for the routes that serve
 *   bulletin pages' HTML and calendar feeds, social cards and finder charts (`/[site]/[week]/[slug]/card.png`, `/charts/[chart].svg`);
 * - in `astro dev`, the session watches the content folder: an edited site, template, object or
 *   satellite file reloads the project and both collections, so the next request shows it;
 * - after a build (`astro:build:done`), the output checks (scripts/output-check.ts): nothing
 *   unpublishable, every linked file present, the page budget (a warning, an error with `strict`).
 *
 * Other integrations and the loaders reach the session through the custom hook `gloaming:session`.
 */
import { fileURLToPath } from 'node:url';
import type { AstroConfig, AstroIntegration } from 'astro';
import { checkOutput } from '../../scripts/output-check.ts';
import { GloamingSession, stopOnProblems } from './session.ts';

export interface GloamingOptions {
  /** Build date, YYYY-MM-DD. */
  today?: string | undefined;
  /** Site ids to publish (a CI shard); default all. */
  sites?: readonly string[] | null;
  /** Content folder; default `content` in the project root. */
  content?: string;
  /** Warnings stop the build (`--strict`). */
  strict?: boolean;
  /** A session made beforehand (scripts/build.ts makes one to check the input before Astro starts). */
  session?: GloamingSession;
}

/** The id pages import: `import { cards, charts, texts } from 'virtual:gloaming'`. */
export const VIRTUAL_MODULE = 'virtual:gloaming';

/** The session of the `gloaming()` integration in `config`; throws when the integration is missing. */
export function sessionOf(config: Pick<AstroConfig, 'integrations'>): GloamingSession {
  const hook = config.integrations.find((i) => i.name === 'gloaming')?.hooks['gloaming:session'];
  if (typeof hook !== 'function') throw new Error('the gloaming() integration is missing from astro.config.mjs (integrations: [gloaming(…)])');
  return (hook as () => GloamingSession)();
}

export default function gloaming(options: GloamingOptions = {}): AstroIntegration {
  let session = options.session;
  const current = (): GloamingSession => {
    if (!session) throw new Error('gloaming(): the session is made in astro:config:setup');
    return session;
  };
  return {
    name: 'gloaming',
    hooks: {
      'astro:config:setup': ({ config, updateConfig }) => {
        session ??= new GloamingSession({
          root: fileURLToPath(config.root),
          cacheDir: fileURLToPath(config.cacheDir),
          today: options.today,
          sites: options.sites ?? null,
          ...(options.content ? { content: options.content } : {}),
          strict: options.strict ?? false,
        });
        const resolved = `\0${VIRTUAL_MODULE}`;
        const s = session;
        updateConfig({
          vite: {
            plugins: [
              {
                name: 'gloaming:virtual',
                resolveId: (id: string) => (id === VIRTUAL_MODULE ? resolved : undefined),
                load: (id: string) =>
                  id === resolved
                    ? `export const cards = ${JSON.stringify({ dir: s.cardDir, codeDigest: s.project().codeDigest })};\nexport const charts = ${JSON.stringify({ dir: s.chartDir })};\nexport const texts = ${JSON.stringify({ dir: s.textDir })};\n`
                    : undefined,
              },
            ],
          },
        });
      },
      'astro:build:done': async ({ dir }) => {
        const s = current();
        // The output's own checks (the page budget) add their warnings to the same list; --strict decides once, here.
        const { warnings } = await checkOutput(fileURLToPath(dir), { pages: s.sites === null });
        for (const w of warnings) s.problems.add({ kind: 'page-size', severity: 'warning', message: w, place: {} });
        stopOnProblems(s.problems, s.strict);
      },
      'gloaming:session': current,
    },
  };
}
