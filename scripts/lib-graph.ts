/**
 * The import graph of lib/, read from the code itself: which file imports which, which packages
 * each imports, and the stage of each file in the one-way pipeline
 *
 *   lib/core/ → lib/models/ → lib/outputs/
 *
 * (a file may import its own stage or an earlier one, never a later one). `test/lib-layers.test.ts`
 * uses it to refuse import cycles and backward imports; `node scripts/lib-graph.ts` prints the
 * graph of units (a file of lib/core/, a folder or file of lib/models/ and lib/outputs/) that
 * DEVELOPERS.md shows (the test keeps the two in step).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { dirname, join, posix, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import ts from 'typescript';

/** The pipeline's stages, in order: each may import only itself and the stages before it. */
export const STAGES = ['core', 'models', 'outputs'] as const;
export type Stage = (typeof STAGES)[number];

export interface LibGraph {
  /** Every source file of lib/, as a path from the project root (`lib/core/time.ts`). */
  files: string[];
  /** For each file, the lib/ files it imports (static, dynamic and type-only imports alike). */
  imports: Map<string, string[]>;
  /** For each file, the packages it imports (`astronomy-engine`, `node:fs`, …). */
  packages: Map<string, string[]>;
  /** Relative imports that leave lib/ (`../site/…`), by file. */
  outside: Map<string, string[]>;
}

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');

function sourceFiles(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true })
    .sort((a, b) => a.name.localeCompare(b.name))
    .flatMap((e) => (e.isDirectory() ? sourceFiles(join(dir, e.name)) : /\.(ts|mts|js|mjs)$/.test(e.name) ? [join(dir, e.name)] : []));
}

/** Reads the import graph of `root`/lib (the project root by default). */
export function readLibGraph(root: string = ROOT): LibGraph {
  const files = sourceFiles(join(root, 'lib')).map((f) => relative(root, f).split('\\').join('/'));
  const imports = new Map<string, string[]>();
  const packages = new Map<string, string[]>();
  const outside = new Map<string, string[]>();
  for (const file of files) {
    const info = ts.preProcessFile(readFileSync(join(root, file), 'utf8'), true, true);
    const own: string[] = [];
    const pkgs: string[] = [];
    const out: string[] = [];
    for (const { fileName } of info.importedFiles) {
      if (!fileName.startsWith('.')) {
        pkgs.push(fileName);
        continue;
      }
      const target = posix.normalize(posix.join(posix.dirname(file), fileName));
      (target.startsWith('lib/') ? own : out).push(target);
    }
    imports.set(file, [...new Set(own)].sort());
    packages.set(file, [...new Set(pkgs)].sort());
    outside.set(file, [...new Set(out)].sort());
  }
  return { files, imports, packages, outside };
}

/** The stage of a lib/ path (`lib/models/sky/quality.ts` → 'models'), or null outside the stages. */
export function stageOf(path: string): Stage | null {
  const s = path.split('/')[1];
  return (STAGES as readonly string[]).includes(s ?? '') ? (s as Stage) : null;
}

/** Imports that run backward through the pipeline: [importer, imported]. */
export function backwardImports(graph: LibGraph): [string, string][] {
  const rank = (p: string): number => STAGES.indexOf(stageOf(p) ?? 'outputs');
  return graph.files.flatMap((f) => (graph.imports.get(f) ?? []).filter((t) => rank(t) > rank(f)).map((t): [string, string] => [f, t]));
}

/** Groups of files that import each other in a loop (strongly connected components of two files or more; Tarjan 1972). */
export function importCycles(graph: LibGraph): string[][] {
  const index = new Map<string, number>();
  const low = new Map<string, number>();
  const stack: string[] = [];
  const onStack = new Set<string>();
  const cycles: string[][] = [];
  let next = 0;
  const visit = (v: string): void => {
    index.set(v, next);
    low.set(v, next++);
    stack.push(v);
    onStack.add(v);
    for (const w of graph.imports.get(v) ?? []) {
      if (!index.has(w)) {
        visit(w);
        low.set(v, Math.min(low.get(v)!, low.get(w)!));
      } else if (onStack.has(w)) low.set(v, Math.min(low.get(v)!, index.get(w)!));
    }
    if (low.get(v) === index.get(v)) {
      const group: string[] = [];
      let w: string;
      do {
        w = stack.pop()!;
        onStack.delete(w);
        group.push(w);
      } while (w !== v);
      if (group.length > 1 || (graph.imports.get(v) ?? []).includes(v)) cycles.push(group.sort());
    }
  };
  for (const f of graph.files) if (!index.has(f)) visit(f);
  return cycles;
}

/**
 * The unit a file belongs to in the printed graph: each file of lib/core/ is its own unit; in
 * lib/models/ and lib/outputs/ a folder is one unit (`models/sky`) and a lone file another
 * (`models/night`).
 */
export function unitOf(path: string): string {
  const parts = path.replace(/\.(ts|mts|js|mjs|json|yaml)$/, '').split('/');
  return parts.slice(1, 3).join('/');
}

/**
 * The graph of units as text, one line per unit, stage by stage from the outputs down: the other
 * units it imports directly.
 */
export function unitGraphText(graph: LibGraph): string {
  const units = new Map<string, Set<string>>();
  for (const f of graph.files) {
    const u = unitOf(f);
    const uses = units.get(u) ?? new Set<string>();
    for (const t of graph.imports.get(f) ?? []) if (unitOf(t) !== u) uses.add(unitOf(t));
    units.set(u, uses);
  }
  const order = (u: string): number => STAGES.indexOf(u.split('/')[0] as Stage);
  const names = [...units.keys()].sort((a, b) => order(b) - order(a) || a.localeCompare(b));
  const width = Math.max(...names.map((n) => n.length));
  const lines: string[] = [];
  let stage = '';
  for (const name of names) {
    const s = name.split('/')[0]!;
    if (s !== stage) {
      if (stage) lines.push('');
      lines.push(`lib/${s}/`);
      stage = s;
    }
    const list = [...units.get(name)!].sort((a, b) => order(b) - order(a) || a.localeCompare(b));
    lines.push(`  ${name.padEnd(width)} → ${list.length ? list.join(', ') : '(nothing)'}`);
  }
  return lines.join('\n');
}

if (import.meta.main) console.log(unitGraphText(readLibGraph()));
