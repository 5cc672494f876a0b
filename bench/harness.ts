/**
 * Shared benchmark helpers. Each `bench/*.bench.ts` exports `run(): Promise<BenchRow[]>`;
 * `bench/run.ts` runs them all and prints one table with targets. Targets are the issues'
 * budgets; a row over its target is reported, not hidden.
 */
import { readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { Bench } from 'tinybench';

export interface BenchRow {
  /** What was measured. */
  name: string;
  /** Median time of one run, milliseconds. */
  medianMs: number;
  /** Budget for the median, milliseconds, if the issue sets one. */
  targetMs?: number;
  samples: number;
}

/** Measures `fn` with tinybench for about `timeMs` and returns its median. */
export async function measure(name: string, fn: () => unknown, options: { timeMs?: number; targetMs?: number; warmup?: boolean } = {}): Promise<BenchRow> {
  const bench = new Bench({ time: options.timeMs ?? 1000, warmup: options.warmup ?? true, iterations: 5 });
  bench.add(name, fn);
  await bench.run();
  const task = bench.tasks[0]!;
  const result = task.result as unknown as { latency?: { p50?: number; samplesCount?: number }; state?: string; error?: unknown };
  if (result?.error) throw result.error;
  const p50 = result?.latency?.p50;
  if (p50 === undefined) throw new Error(`benchmark '${name}' produced no latency figures`);
  return { name, medianMs: p50, ...(options.targetMs !== undefined ? { targetMs: options.targetMs } : {}), samples: result.latency?.samplesCount ?? 0 };
}

/** Prints rows as a table with a verdict per budget. Returns false when a row misses its target. */
export function report(rows: BenchRow[]): boolean {
  let ok = true;
  const table = rows.map((r) => {
    const within = r.targetMs === undefined ? '' : r.medianMs <= r.targetMs ? 'yes' : 'NO';
    if (within === 'NO') ok = false;
    const fmt = (ms: number): string => (ms < 0.01 ? `${(ms * 1000).toFixed(2)} µs` : ms < 10 ? `${ms.toFixed(3)} ms` : `${ms.toFixed(0)} ms`);
    return { benchmark: r.name, median: fmt(r.medianMs), target: r.targetMs === undefined ? '' : fmt(r.targetMs), within, samples: r.samples };
  });
  console.table(table);
  return ok;
}

/** The median of some samples. */
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? s[m]! : (s[m - 1]! + s[m]!) / 2;
}

/** How many files below `dir` end with `suffix`. */
export function countFiles(dir: string, suffix: string): number {
  let n = 0;
  for (const name of readdirSync(dir)) {
    const full = join(dir, name);
    if (statSync(full).isDirectory()) n += countFiles(full, suffix);
    else if (name.endsWith(suffix)) n++;
  }
  return n;
}
