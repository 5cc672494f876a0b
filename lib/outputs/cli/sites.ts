/**
 * `gloaming sites`: the sites of the content folder, for scripts and CI. `--shards <n>` prints the
 * JSON list of comma-joined groups of at most n site ids (in id order) that a CI matrix builds one
 * job each (`npm run build -- --sites <group>`); `--json` prints ids and names.
 */
import { resolve } from 'node:path';
import { parseArgs } from 'node:util';
import { loadSites } from '../../models/content.ts';
import { argumentError, numberFlag } from './args.ts';

export const SITES_HELP = `gloaming sites — list the sites of the content folder

Usage: gloaming sites [--content <dir>] [--json | --shards <n>]

  --content <dir>   content folder (default ./content)
  --json            print [{ "id": …, "name": … }, …]
  --shards <n>      print the site ids as a JSON list of comma-joined groups of at most n sites,
                    for a CI matrix (one build job per group: npm run build -- --sites <group>)

Without --json or --shards, prints one id a line.`;

/** Site ids in groups of at most `size`, each group joined with commas, in id order. */
export function shardSites(ids: readonly string[], size: number): string[] {
  const sorted = [...ids].sort();
  const groups: string[] = [];
  for (let i = 0; i < sorted.length; i += size) groups.push(sorted.slice(i, i + size).join(','));
  return groups;
}

export function runSites(argv: string[], out: (s: string) => void): void {
  const { values } = parseArgs({
    args: argv,
    options: { content: { type: 'string' }, json: { type: 'boolean' }, shards: { type: 'string' }, help: { type: 'boolean', short: 'h' } },
    strict: true,
  });
  if (values.help) return out(SITES_HELP);
  const sites = loadSites(resolve(values.content ?? 'content', 'sites'));
  if (values.shards !== undefined) {
    const size = numberFlag(values.shards, '--shards', 'a whole number of sites per build job, at least 1');
    if (size === undefined || !Number.isInteger(size) || size < 1) throw argumentError('--shards', 'not a whole number of at least 1', 'a whole number of sites per build job, e.g. 10', values.shards);
    if (sites.size === 0) throw argumentError('--content', 'there are no sites in the content folder', 'at least one file in content/sites/');
    return out(JSON.stringify(shardSites([...sites.keys()], size)));
  }
  if (values.json) return out(JSON.stringify([...sites.values()].map((s) => ({ id: s.id, name: s.name })).sort((a, b) => (a.id < b.id ? -1 : 1))));
  for (const id of [...sites.keys()].sort()) out(id);
}
