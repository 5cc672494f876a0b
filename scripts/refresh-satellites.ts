/**
 * Refreshes the element sets of the satellites listed in `content/satellites/satellites.yaml`
 * from a public source of CCSDS OMM JSON, before a build. Writes
 * `content/satellites/refreshed.json` (one OMM per satellite); the loader takes the newest epoch
 * per object, so the refreshed sets replace the committed ones without deleting them.
 *
 *   node scripts/refresh-satellites.ts [--content <folder>] [--source <url with {norad}>]
 *
 * The source defaults to CelesTrak's general-perturbations query, one object per request
 * (`https://celestrak.org/NORAD/elements/gp.php?CATNR={norad}&FORMAT=json`), or
 * `GLOAMING_ELEMENTS_URL`. Every answer is read with the same checks as a committed file; if any
 * satellite cannot be fetched or read, nothing is written and the command exits with code 2.
 */
import { readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { GloamingError } from '../lib/core/errors.ts';
import { CATALOGUE_FILE, parseCatalogue } from '../lib/models/satellite/catalogue.ts';
import { readOmmJson } from '../lib/models/satellite/elements.ts';

const DEFAULT_SOURCE = 'https://celestrak.org/NORAD/elements/gp.php?CATNR={norad}&FORMAT=json';

async function refresh(): Promise<void> {
  const { values } = parseArgs({ options: { content: { type: 'string' }, source: { type: 'string' } }, strict: true });
  const dir = resolve(values.content ?? process.env.GLOAMING_CONTENT ?? 'content', 'satellites');
  const source = values.source ?? process.env.GLOAMING_ELEMENTS_URL ?? DEFAULT_SOURCE;
  const catalogueFile = join(dir, CATALOGUE_FILE);
  const entries = parseCatalogue(readFileSync(catalogueFile, 'utf8'), catalogueFile);
  const messages: unknown[] = [];
  for (const entry of entries) {
    const url = source.replace('{norad}', String(entry.noradId));
    const response = await fetch(url);
    const text = await response.text();
    if (!response.ok) throw new GloamingError('invalid-argument', `fetching the elements of ${entry.name} failed with HTTP ${response.status}`, { place: { file: url } });
    const data: unknown = JSON.parse(text);
    const first = Array.isArray(data) ? data[0] : data;
    // The same checks as a committed file: keywords, ranges, epoch, SGP4 start-up.
    readOmmJson(JSON.stringify([first]), url);
    messages.push(first);
  }
  const out = join(dir, 'refreshed.json');
  writeFileSync(`${out}.tmp`, `${JSON.stringify(messages, null, 2)}\n`);
  renameSync(`${out}.tmp`, out);
  console.log(`refreshed ${messages.length} element sets into ${out}`);
}

refresh().catch((error: unknown) => {
  console.error(`refresh-satellites: ${error instanceof Error ? error.message : String(error)}`);
  process.exitCode = error instanceof GloamingError ? 2 : 1;
});
