/**
 * `npm run bench`: runs every `bench/*.bench.ts` and prints medians against the issues' budgets.
 * Exits 1 when a benchmark misses its budget.
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { join } from 'node:path';
import { report, type BenchRow } from './harness.ts';

const dir = fileURLToPath(new URL('.', import.meta.url));
const only = process.argv.slice(2);
const rows: BenchRow[] = [];
for (const file of readdirSync(dir).filter((f) => f.endsWith('.bench.ts')).sort()) {
  if (only.length && !only.some((o) => file.includes(o))) continue;
  const mod = (await import(pathToFileURL(join(dir, file)).href)) as { run?: () => Promise<BenchRow[]> };
  if (typeof mod.run !== 'function') continue;
  console.error(`running ${file} …`);
  rows.push(...(await mod.run()));
}
process.exitCode = report(rows) ? 0 : 1;
