/**
 * Statistics of Monte Carlo model values (JCGM 101:2008 §7.6–7.7): average and standard
 * deviation, and the probabilistically symmetric and shortest coverage intervals from the tails
 * of the values alone (only the M − q smallest and largest values are sorted), with an exact merge
 * of tails computed in parts (worker threads).
 *
 * @module
 */
import { sortFloat64 } from "./sort.ts";
import type { Interval } from "./types.ts";

/** What one pass over model values finds: how many are kept (not NaN), their smallest and
 * largest. */
export interface ValueSpan {
  readonly count: number;
  readonly min: number;
  readonly max: number;
}

/** How many values are kept (not NaN), their minimum and maximum: one pass (NaN compares false). */
function valueSpan(values: Float64Array): ValueSpan {
  let min = Infinity, max = -Infinity, count = 0;
  for (let r = 0; r < values.length; r++) {
    const v = values[r]!;
    if (v !== v) continue;
    count++;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  return { count, min, max };
}

/** Mean and standard deviation (two-pass, JCGM 101 eq. (16)–(17)) of the values that are not
 * NaN (NaN marks a trial excluded as physically inconsistent), how many those are, and (from the
 * first pass) their minimum and maximum, which the coverage intervals need too. */
export function meanAndStandardDeviation(
  values: Float64Array,
): { mean: number; sd: number } & ValueSpan {
  // NaN rows add 0 (the sums never hold −0, so adding +0 changes no bit) instead of being
  // branched around: V8 keeps a sum updated under a branch in a heap box, a fresh allocation per
  // row (3–5 times slower; bench/analysis.md); NaN fails both comparisons of the span
  let s = 0, m = 0, min = Infinity, max = -Infinity;
  for (let r = 0; r < values.length; r++) {
    const v = values[r]!;
    const kept = v === v;
    s += kept ? v : 0;
    m += kept ? 1 : 0;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const mean = s / m;
  let ss = 0, comp = 0;
  for (let r = 0; r < values.length; r++) {
    const d = values[r]! - mean;
    const e = d === d ? d : 0;
    ss += e * e;
    comp += e;
  }
  const sd = Math.sqrt(Math.max((ss - (comp * comp) / m) / (m - 1), 0));
  return { mean, sd, count: m, min, max };
}

/** The values that are not NaN (the trials kept), in order; the array itself when all are. */
export function keptValues(values: Float64Array): Float64Array {
  let n = 0;
  for (let r = 0; r < values.length; r++) if (values[r] === values[r]) n++;
  if (n === values.length) return values;
  const kept = new Float64Array(n);
  let k = 0;
  for (let r = 0; r < values.length; r++) {
    const v = values[r]!;
    if (v === v) kept[k++] = v;
  }
  return kept;
}

/**
 * The `count` smallest and the `count` largest values of `values`, each sorted ascending, without
 * sorting the whole array: one pass finds the range, one builds a value histogram that locates
 * both tails, one copies the tails, and only they are sorted. NaN values (excluded trials) are left
 * out. Exact otherwise: ties and heavy tails only enlarge the copied part; data the histogram
 * cannot split (one value, zeros of both signs only, a spread beyond the double range) is sorted
 * whole. When `count` ≥ the number of values, both are all of them.
 */
export function sortedTails(
  all: Float64Array,
  count: number,
): { low: Float64Array; high: Float64Array } {
  return tailsOf(all, () => count, null);
}

/** {@linkcode sortedTails} with the tail size a function of the number of values kept (known
 * after the first pass, which is skipped when the caller knows its span). */
function tailsOf(
  all: Float64Array,
  tailSize: (kept: number) => number,
  span: ValueSpan | null,
): { low: Float64Array; high: Float64Array } {
  const { min, max, count: kept } = span ?? valueSpan(all);
  const count = tailSize(kept);
  const values = kept === all.length ? all : keptValues(all);
  const m = values.length;
  if (2 * count < m) {
    // one repeated value (signed zeros aside: −0 === +0 but they sort apart)
    if (min === max && min !== 0) {
      return { low: new Float64Array(count).fill(min), high: new Float64Array(count).fill(min) };
    }
  }
  const bins = 4096;
  const scale = bins / (max - min);
  // the histogram needs a finite, non-zero spread: otherwise (short arrays, zeros only, spreads
  // beyond the double range or below its resolution) sort everything
  if (2 * count >= m || !(max > min) || !Number.isFinite(max - min) || !Number.isFinite(scale)) {
    const all = sortFloat64(values.slice());
    return { low: all.subarray(0, count), high: all.subarray(Math.max(0, m - count)) };
  }
  // the bin of v is ⌊(v − min)·scale⌋ kept within 0 … bins − 1: for v in [min, max] the argument is
  // ≥ 0 and below 2³¹, where a truncation to a 32-bit integer (| 0) is the floor; the clamp keeps
  // the binning monotone (so the tails exact) even for values outside a span given by the caller
  const counts = new Uint32Array(bins);
  for (let r = 0; r < m; r++) {
    const t = ((values[r]! - min) * scale) | 0;
    counts[t < 0 ? 0 : t < bins ? t : bins - 1]!++;
  }
  let lowCut = 0, lowTotal = 0;
  for (; lowCut < bins; lowCut++) if ((lowTotal += counts[lowCut]!) >= count) break;
  let highCut = bins - 1, highTotal = 0;
  for (; highCut >= 0; highCut--) if ((highTotal += counts[highCut]!) >= count) break;
  const low = new Float64Array(lowTotal), high = new Float64Array(highTotal);
  let nl = 0, nh = 0;
  for (let r = 0; r < m; r++) {
    const v = values[r]!;
    const t = ((v - min) * scale) | 0, b = t < 0 ? 0 : t < bins ? t : bins - 1;
    if (b <= lowCut) low[nl++] = v;
    if (b >= highCut) high[nh++] = v;
  }
  sortFloat64(low);
  sortFloat64(high);
  return { low: low.subarray(0, count), high: high.subarray(highTotal - count) };
}

/**
 * Coverage intervals from model values in any order (NaN, an excluded trial, left out; M counts
 * the values kept) (JCGM 101:2008 §7.7): q = pM (or
 * ⌊pM + ½⌋); probabilistically symmetric [y₍r₎, y₍r+q₎] with r = (M − q)/2 (or (M − q + 1)/2),
 * and the shortest interval minimising y₍r+q₎ − y₍r₎ over r = 1, …, M − q. Only the M − q
 * smallest and largest values are sorted: every order statistic needed lies there.
 *
 * @example
 * ```ts
 * import { coverageIntervals } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const values = Float64Array.from({ length: 100 }, (_, i) => 99 - i); // 0 … 99, reversed
 * // M = 100, p = 0.9: q = 90, r = 5 → [y₍5₎, y₍95₎] = [4, 94]
 * assert.deepEqual(coverageIntervals(values, 0.9).symmetric, { lower: 4, upper: 94 });
 * ```
 */
export function coverageIntervals(
  values: Float64Array,
  coverage: number,
): { symmetric: Interval; shortest: Interval } {
  return intervalsOfValues(values, coverage, null);
}

/** {@linkcode coverageIntervals}, skipping the first pass when the values' span is known (from
 * {@linkcode meanAndStandardDeviation}). */
export function intervalsOfValues(
  values: Float64Array,
  coverage: number,
  span: ValueSpan | null,
): { symmetric: Interval; shortest: Interval } {
  let m = 0;
  const tails = tailsOf(values, (kept) => coverageTailSize(m = kept, coverage), span);
  return intervalsFromTails(tails.low, tails.high, m, coverage);
}

/** q = pM (or ⌊pM + ½⌋), capped at M − 1 (JCGM 101:2008 §7.7). */
function coverageCount(m: number, coverage: number): number {
  const pm = coverage * m;
  return Math.min(m - 1, Number.isInteger(pm) ? pm : Math.floor(pm + 0.5));
}

/** How many of the smallest and of the largest model values the coverage intervals need: M − q
 * (order statistics 1 … M − q and q + 1 … M). */
export function coverageTailSize(m: number, coverage: number): number {
  return m - coverageCount(m, coverage);
}

/** The intervals from the M − q smallest (`low`, ascending) and largest (`high`, ascending) of M
 * model values. */
export function intervalsFromTails(
  low: Float64Array,
  high: Float64Array,
  m: number,
  coverage: number,
): { symmetric: Interval; shortest: Interval } {
  const q = coverageCount(m, coverage);
  const r = Number.isInteger((m - q) / 2) ? (m - q) / 2 : (m - q + 1) / 2;
  const tailSize = m - q;
  // low[j] = y_(j+1), high[j] = y_(q+1+j)
  const symmetric: Interval = { lower: low[r - 1]!, upper: high[r - 1]! };
  let best = Infinity, bestJ = 0;
  for (let j = 0; j < tailSize; j++) {
    const w = high[j]! - low[j]!; // y_(j+1+q) − y_(j+1)
    if (w < best) {
      best = w;
      bestJ = j;
    }
  }
  return { symmetric, shortest: { lower: low[bestJ]!, upper: high[bestJ]! } };
}

/** The tails of a whole sample from the tails of its parts (each ascending, each holding its
 * part's `count` smallest or largest values, or the whole part when shorter): a merge that keeps
 * the `count` smallest (`low`) or largest (`high`) values, ascending. */
export function mergeTails(
  parts: readonly Float64Array[],
  count: number,
  side: "low" | "high",
): Float64Array {
  // low: take the smallest head first, filling from the front; high: the largest tail first,
  // filling from the back
  const low = side === "low";
  const out = new Float64Array(count);
  const at = parts.map((p) => (low ? 0 : p.length - 1));
  const step = low ? 1 : -1;
  for (let n = 0; n < count; n++) {
    let best = -1;
    for (let i = 0; i < parts.length; i++) {
      const v = parts[i]![at[i]!];
      if (v === undefined) continue; // this part is used up
      if (best < 0) best = i;
      else {
        const w = parts[best]![at[best]!]!;
        if (low ? sortsBefore(v, w) : sortsBefore(w, v)) best = i;
      }
    }
    out[low ? n : count - 1 - n] = parts[best]![at[best]!]!;
    at[best]! += step;
  }
  return out;
}

/** The order of `Float64Array.prototype.sort`: numeric, with −0 before +0. */
function sortsBefore(a: number, b: number): boolean {
  return a < b || (a === 0 && b === 0 && Object.is(a, -0) && !Object.is(b, -0));
}

/** The `count` smallest and largest of each output, when already known (e.g. merged from the
 * tails computed by workers). */
export type KnownTails = readonly { readonly low: Float64Array; readonly high: Float64Array }[];

/**
 * The sample covariance matrix of trial-aligned columns.
 *
 * @example
 * ```ts
 * import { sampleCovariance } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = Float64Array.of(1, 2, 3), y = Float64Array.of(2, 4, 6);
 * assert.deepEqual(sampleCovariance([x, y]), [[1, 2], [2, 4]]);
 * ```
 */
export function sampleCovariance(columns: readonly Float64Array[]): number[][] {
  // the trials kept in every column (an excluded trial is NaN in all outputs of its run)
  const kept = columns.map(keptValues);
  const means = kept.map((c) => meanAndStandardDeviation(c).mean);
  return columns.map((a, i) =>
    columns.map((b, j) => {
      const ma = means[i]!, mb = means[j]!;
      let s = 0, m = 0;
      // a NaN product adds +0 (see meanAndStandardDeviation: no branch around a sum)
      for (let r = 0; r < a.length; r++) {
        const d = (a[r]! - ma) * (b[r]! - mb);
        const kept = d === d;
        s += kept ? d : 0;
        m += kept ? 1 : 0;
      }
      return s / (m - 1);
    })
  );
}
