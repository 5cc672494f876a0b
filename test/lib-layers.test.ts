/**
 * lib/ is a one-way pipeline, lib/core/ → lib/models/ → lib/outputs/: no file imports a later
 * stage, no files import each other in a loop, nothing imports Astro or leaves lib/, and
 * DEVELOPERS.md shows the graph as the code has it. The graph is read from the code by
 * scripts/lib-graph.ts (TypeScript's own import scanner, `ts.preProcessFile`); the first test
 * checks that reader on imports written out in a scratch folder.
 */
import { mkdtempSync, mkdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { backwardImports, importCycles, readLibGraph, stageOf, unitGraphText } from '../scripts/lib-graph.ts';

const UPDATE = process.env.UPDATE_FIXTURES === '1';
const graph = readLibGraph();

describe('the import reader', () => {
  const root = mkdtempSync(join(tmpdir(), 'gloaming-layers-'));
  afterAll(() => rmSync(root, { recursive: true, force: true }));
  const write = (path: string, text: string): void => {
    mkdirSync(dirname(join(root, path)), { recursive: true });
    writeFileSync(join(root, path), text);
  };
  write('lib/core/a.ts', "import type { B } from '../models/b.ts';\n// import { x } from '../outputs/c.ts';\nexport const a = 1;\n");
  write('lib/models/b.ts', "export type B = number;\nexport const c = await import('../outputs/c.ts');\n");
  write('lib/outputs/c.ts', "import { a } from '../core/a.ts';\nimport 'astro:content';\nexport { a };\n");
  const scratch = readLibGraph(root);

  it('reads static, type-only, dynamic and re-exports, not comments', () => {
    expect(scratch.imports.get('lib/core/a.ts')).toEqual(['lib/models/b.ts']);
    expect(scratch.imports.get('lib/models/b.ts')).toEqual(['lib/outputs/c.ts']);
    expect(scratch.packages.get('lib/outputs/c.ts')).toEqual(['astro:content']);
  });

  it('finds the backward imports and the loop', () => {
    expect(backwardImports(scratch)).toEqual([
      ['lib/core/a.ts', 'lib/models/b.ts'],
      ['lib/models/b.ts', 'lib/outputs/c.ts'],
    ]);
    expect(importCycles(scratch)).toEqual([['lib/core/a.ts', 'lib/models/b.ts', 'lib/outputs/c.ts']]);
  });
});

describe('lib/', () => {
  it('every source file lives in a stage folder (core, models or outputs)', () => {
    expect(graph.files.length).toBeGreaterThan(50);
    expect(graph.files.filter((f) => stageOf(f) === null)).toEqual([]);
  });

  it('no import runs backward (core → models → outputs)', () => {
    expect(backwardImports(graph)).toEqual([]);
  });

  it('no import cycle', () => {
    expect(importCycles(graph)).toEqual([]);
  });

  it('imports nothing from Astro, and nothing outside lib/ by path', () => {
    const astro = [...graph.packages].flatMap(([f, pkgs]) => pkgs.filter((p) => /^(astro(:|\/|$)|@astrojs\/)/.test(p)).map((p) => `${f} → ${p}`));
    expect(astro).toEqual([]);
    expect([...graph.outside].filter(([, targets]) => targets.length > 0)).toEqual([]);
  });

  it('DEVELOPERS.md shows the dependency graph as the code has it (UPDATE_FIXTURES=1 rewrites it)', () => {
    const file = 'DEVELOPERS.md';
    const text = readFileSync(file, 'utf8');
    const markers = /(<!-- lib-graph: begin[^\n]*-->\n```\n)([\s\S]*?)(\n```\n<!-- lib-graph: end -->)/;
    expect(text, 'DEVELOPERS.md has the lib-graph markers').toMatch(markers);
    const generated = unitGraphText(graph);
    if (UPDATE) writeFileSync(file, text.replace(markers, (_, a: string, _b: string, c: string) => a + generated + c));
    expect(markers.exec(readFileSync(file, 'utf8'))![2]).toBe(generated);
  });
});
