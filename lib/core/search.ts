/**
 * The one search mechanism. Every event gloaming reports — rise and set, twilight, transit,
 * visibility windows and the best viewing time — is a zero crossing or a maximum of a smooth
 * function of time, found here by sampling at a fixed step and refining each bracket.
 *
 * Time is measured in `astronomy-engine` UT days (days since 2000-01-01 12:00 UT). A function
 * may return NaN where it is undefined (e.g. below a horizon); such samples never bracket a root.
 * Two crossings closer together than the step may both be missed; callers choose the step for
 * the fastest change they need to see (10 minutes for rise and set).
 */

/** One zero crossing: its time and whether the function was rising (+1) or falling (−1). */
export interface Crossing {
  ut: number;
  direction: 1 | -1;
}

/** Refines a sign change of `f` in [a, b] by the Illinois variant of regula falsi. */
function refine(f: (ut: number) => number, a: number, fa: number, b: number, fb: number, toleranceDays: number): number {
  let side = 0;
  for (let i = 0; i < 60 && b - a > toleranceDays; i++) {
    const c = (a * fb - b * fa) / (fb - fa);
    const fc = f(c);
    if (!Number.isFinite(fc)) return (a + b) / 2;
    if ((fc > 0) === (fb > 0)) {
      b = c;
      fb = fc;
      if (side === -1) fa /= 2;
      side = -1;
    } else if ((fc > 0) === (fa > 0)) {
      a = c;
      fa = fc;
      if (side === 1) fb /= 2;
      side = 1;
    } else {
      return c;
    }
  }
  return (a * fb - b * fa) / (fb - fa);
}

export interface SearchOptions {
  /** Sampling step, days (default 10 minutes). */
  stepDays?: number;
  /** Refinement tolerance, days (default 0.1 s). */
  toleranceDays?: number;
  /**
   * Accepts a bracket [fa, fb] before refining. Used to reject jumps of a wrapped angle
   * (e.g. an hour angle passing ±180°), which change sign without crossing zero.
   */
  accept?: (fa: number, fb: number) => boolean;
}

/** All zero crossings of `f` in [ut0, ut1], in time order. */
export function findCrossings(f: (ut: number) => number, ut0: number, ut1: number, options: SearchOptions = {}): Crossing[] {
  const step = options.stepDays ?? 10 / 1440;
  const tolerance = options.toleranceDays ?? 0.1 / 86_400;
  const n = Math.max(1, Math.ceil((ut1 - ut0) / step));
  const h = (ut1 - ut0) / n;
  const out: Crossing[] = [];
  let a = ut0;
  let fa = f(a);
  for (let i = 1; i <= n; i++) {
    const b = i === n ? ut1 : ut0 + i * h;
    const fb = f(b);
    if (Number.isFinite(fa) && Number.isFinite(fb) && (fa < 0) !== (fb < 0) && (!options.accept || options.accept(fa, fb))) {
      const ut = fa === 0 ? a : fb === 0 && i === n ? b : refine(f, a, fa, b, fb, tolerance);
      if (!(fa === 0 && out.length && out[out.length - 1]!.ut === a)) out.push({ ut, direction: fb > fa ? 1 : -1 });
    }
    a = b;
    fa = fb;
  }
  return out;
}

/** The largest value of `f` in [ut0, ut1]: sampled at `stepDays`, then refined by golden-section search. */
export function findMaximum(f: (ut: number) => number, ut0: number, ut1: number, options: { stepDays?: number; toleranceDays?: number } = {}): { ut: number; value: number } | null {
  const step = options.stepDays ?? 5 / 1440;
  const tolerance = options.toleranceDays ?? 1 / 86_400;
  const n = Math.max(1, Math.ceil((ut1 - ut0) / step));
  const h = (ut1 - ut0) / n;
  let best = -1;
  let bestValue = -Infinity;
  const values: number[] = [];
  for (let i = 0; i <= n; i++) {
    const v = f(ut0 + i * h);
    values.push(v);
    if (Number.isFinite(v) && v > bestValue) {
      bestValue = v;
      best = i;
    }
  }
  if (best < 0) return null;
  // Search between the neighbouring samples. Where a neighbour is undefined (the function starts
  // or stops being defined there, e.g. a body clearing the skyline), first locate that edge by
  // bisection, so the maximum of a function that peaks at its edge does not depend on the step.
  const edge = (defined: number, undefinedAt: number): number => {
    let a = defined;
    let b = undefinedAt;
    while (Math.abs(b - a) > tolerance) {
      const m = (a + b) / 2;
      if (Number.isFinite(f(m))) a = m;
      else b = m;
    }
    return a;
  };
  const at = (i: number): number => ut0 + i * h;
  let lo = best > 0 ? (Number.isFinite(values[best - 1]!) ? at(best - 1) : edge(at(best), at(best - 1))) : at(best);
  let hi = best < n ? (Number.isFinite(values[best + 1]!) ? at(best + 1) : edge(at(best), at(best + 1))) : at(best);
  const g = (Math.sqrt(5) - 1) / 2;
  let c = hi - g * (hi - lo);
  let d = lo + g * (hi - lo);
  let fc = f(c);
  let fd = f(d);
  while (hi - lo > tolerance) {
    if (!(fd >= fc) && Number.isFinite(fc)) {
      hi = d;
      d = c;
      fd = fc;
      c = hi - g * (hi - lo);
      fc = f(c);
    } else {
      lo = c;
      c = d;
      fc = fd;
      d = lo + g * (hi - lo);
      fd = f(d);
    }
  }
  const mid = (lo + hi) / 2;
  const fm = f(mid);
  return Number.isFinite(fm) && fm >= bestValue ? { ut: mid, value: fm } : { ut: ut0 + best * h, value: bestValue };
}

/** Length of the fixed UT buckets of `sharedSearch`, days. */
const SHARED_BUCKET_DAYS = 8;
/** Buckets kept per owner before they are dropped (about 40 years of 8-day buckets). */
const SHARED_BUCKETS_KEPT = 2000;
const sharedResults = new WeakMap<object, Map<string, readonly unknown[]>>();

/**
 * The results of a search that does not depend on the site (the instants of the Moon's phases,
 * of planets' oppositions, of close approaches seen from the Earth's centre) with their times in
 * [from, to), found once per fixed bucket of 8 UT days (bucket k covers UT days [8k, 8k + 8)) and
 * kept: every site and week of a build that asks for the same bucket reads the same results. A
 * bucket's results depend only on `owner`, `key` and k, never on which site asked first, so builds
 * stay deterministic.
 *
 * `find(from, to)` must return every result with its time in [from, to) (more is filtered out);
 * `key` names everything the search depends on besides the bucket; `owner` is the object the
 * results belong to (a body loaded from content, or the searching function for built-in bodies):
 * when it is collected, so are its results.
 */
export function sharedSearch<T>(owner: object, key: string, from: Date, to: Date, find: (from: Date, to: Date) => T[], timeOf: (result: T) => Date): T[] {
  let buckets = sharedResults.get(owner);
  if (!buckets) {
    buckets = new Map();
    sharedResults.set(owner, buckets);
  }
  const bucketMs = SHARED_BUCKET_DAYS * 86_400_000;
  const origin = Date.UTC(2000, 0, 1, 12);
  const first = Math.floor((from.getTime() - origin) / bucketMs);
  const last = Math.floor((to.getTime() - 1 - origin) / bucketMs);
  const out: T[] = [];
  for (let k = first; k <= last; k++) {
    const id = `${key}#${k}`;
    let found = buckets.get(id) as readonly T[] | undefined;
    if (!found) {
      const a = new Date(origin + k * bucketMs);
      const b = new Date(origin + (k + 1) * bucketMs);
      found = find(a, b).filter((r) => timeOf(r) >= a && timeOf(r) < b);
      if (buckets.size >= SHARED_BUCKETS_KEPT) buckets.clear();
      buckets.set(id, found);
    }
    for (const r of found) if (timeOf(r) >= from && timeOf(r) < to) out.push(r);
  }
  return out;
}
