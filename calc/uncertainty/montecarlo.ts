/**
 * Propagation of distributions by the Monte Carlo method (JCGM 101:2008): seeded column-wise
 * sampling into typed arrays, correlated normal inputs by Cholesky factor, estimate, standard
 * uncertainty, probabilistically symmetric and shortest coverage intervals, the adaptive
 * procedure (§7.9), and the validation of a GUM result (§8).
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { cautionsOf, formatRange } from "../core/define.ts";
import { JUPYTER_DISPLAY, type MimeBundle } from "../core/display.ts";
import type { Correlations } from "./correlation.ts";
import { prepareInputs, type UncertainInputs } from "./prepare.ts";
import { checkSeed } from "./random.ts";
import { sortFloat64 } from "./sort.ts";
import { blockCount, range, runBlocks, type TrialPlan, trialPlan } from "./trials.ts";
import { checkCoverage, type GumResult } from "./gum.ts";
import { numericalTolerance } from "./rounding.ts";
import { displayMonteCarlo } from "./display.ts";

/** Default number of Monte Carlo trials (JCGM 101:2008 §7.2.2 suggests 10⁶ for 95 % coverage). *
 * @example
 * ```ts
 * import { DEFAULT_TRIALS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DEFAULT_TRIALS, 1_000_000);
 * ```
 */
export const DEFAULT_TRIALS = 1_000_000;
/** Default seed, used when none is given, so that every run is reproducible. *
 * @example
 * ```ts
 * import { DEFAULT_SEED } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Number.isInteger(DEFAULT_SEED) && DEFAULT_SEED > 0);
 * ```
 */
export const DEFAULT_SEED = 20080101;

/** Options of {@linkcode monteCarlo}. */
export interface MonteCarloOptions {
  /** Number of trials M. @default 1_000_000 */
  readonly trials?: number;
  /** Seed of the random stream, an integer in [1, 2³² − 1]. @default 20080101 */
  readonly seed?: number;
  /** Coverage probability p in (0, 1). @default 0.95 */
  readonly coverage?: number;
  /** Correlations between inputs (only between normal inputs, JCGM 101 §6.4.8). */
  readonly correlations?: Correlations;
  /** Keep the output samples (in trial order) in the result. @default true */
  readonly keepSamples?: boolean;
}

/** Monte Carlo result for one output. */
export interface MonteCarloOutput {
  /** Output name. */
  readonly output: string;
  /** Unit of the output. */
  readonly unit: string;
  /** Estimate ỹ: the average of the model values (JCGM 101 eq. (16)). */
  readonly estimate: number;
  /** Standard uncertainty u(ỹ): their standard deviation (JCGM 101 eq. (17)). */
  readonly standardUncertainty: number;
  /** Probabilistically symmetric coverage interval (JCGM 101 §7.7.1). */
  readonly symmetricInterval: readonly [number, number];
  /** Shortest coverage interval (JCGM 101 §7.7.2). */
  readonly shortestInterval: readonly [number, number];
  /** Model values in trial order, so that samples of several outputs stay paired (empty when
   * `keepSamples` is false). */
  readonly samples: Float64Array;
}

/** Result of {@linkcode monteCarlo}. */
export interface MonteCarloResult<O extends string = string> {
  /** Calculation title. */
  readonly title: string;
  /** Calculation id. */
  readonly id: string;
  /** Number of trials. */
  readonly trials: number;
  /** Seed used. */
  readonly seed: number;
  /** Coverage probability. */
  readonly coverage: number;
  /** Results per output. */
  readonly outputs: { readonly [K in O]: MonteCarloOutput };
  /** Output names in order. */
  readonly outputNames: readonly O[];
  /** Output correlation matrix estimated from the samples. */
  readonly correlation: readonly (readonly number[])[];
  /** Warnings: samples outside valid input ranges, estimates outside validated ranges. */
  readonly warnings: readonly string[];
  /** Cautions of the calculation. */
  readonly cautions: readonly string[];
  /** Notebook display. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

function checkTrials(trials: number, coverage: number, where: string): number {
  if (!(Number.isInteger(trials) && trials >= 2)) {
    throw new RangeError(`${where}: expected trials to be an integer >= 2, got ${trials}`);
  }
  // M ≥ 1/(1 − p), with a margin for the rounding of 1 − p (p = 0.9999 allows M = 10⁴)
  if (trials * (1 - coverage) < 1 - 1e-9) {
    throw new RangeError(
      `${where}: expected at least 1/(1 − p) = ${
        Math.ceil(1 / (1 - coverage) - 1e-6)
      } trials for coverage ${coverage}, got ${trials}`,
    );
  }
  return trials;
}

/** Draws and evaluates a run of `m` trials keyed `key` on this thread; returns the output columns
 * and, per input, how many draws fell outside its valid range. */
function runTrials<I extends string, O extends string>(
  calc: Calculation<I, O>,
  plan: TrialPlan,
  key: readonly number[],
  m: number,
): { results: Float64Array[]; outside: number[] } {
  const results = calc.outputNames.map(() => new Float64Array(m));
  const outside = plan.inputs.map(() => 0);
  runBlocks(calc as unknown as Calculation, plan, key, m, range(blockCount(m)), results, outside);
  return { results, outside };
}

/** Warnings for draws outside an input's valid range. */
function rangeWarnings(calc: Calculation, outside: readonly number[], trials: number): string[] {
  const warnings: string[] = [];
  calc.inputNames.forEach((name, i) => {
    const def = calc.inputs[name]!;
    if (outside[i]! > 0) {
      warnings.push(
        `${outside[i]} of ${trials} draws of '${name}' fell outside its valid range ${
          formatRange(def.range, def.unit)
        }: its distribution puts mass where the quantity cannot be`,
      );
    }
  });
  return warnings;
}

/** Mean and standard deviation (two-pass, JCGM 101 eq. (16)–(17)). */
export function meanAndStandardDeviation(values: Float64Array): { mean: number; sd: number } {
  const m = values.length;
  let s = 0;
  for (let r = 0; r < m; r++) s += values[r]!;
  const mean = s / m;
  let ss = 0, comp = 0;
  for (let r = 0; r < m; r++) {
    const d = values[r]! - mean;
    ss += d * d;
    comp += d;
  }
  return { mean, sd: Math.sqrt(Math.max((ss - (comp * comp) / m) / (m - 1), 0)) };
}

/**
 * The `count` smallest and the `count` largest values of `values`, each sorted ascending, without
 * sorting the whole array: one pass finds the range, one builds a value histogram that locates
 * both tails, one copies the tails, and only they are sorted. Exact for any data without NaN: ties
 * and heavy tails only enlarge the copied part; data the histogram cannot split (one value, zeros
 * of both signs only, a spread beyond the double range) is sorted whole. When `count` ≥ the number
 * of values, both are all of them.
 */
export function sortedTails(
  values: Float64Array,
  count: number,
): { low: Float64Array; high: Float64Array } {
  const m = values.length;
  let min = Infinity, max = -Infinity;
  if (2 * count < m) {
    for (let r = 0; r < m; r++) {
      const v = values[r]!;
      if (v < min) min = v;
      if (v > max) max = v;
    }
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
  const counts = new Uint32Array(bins);
  for (let r = 0; r < m; r++) counts[Math.min(bins - 1, Math.floor((values[r]! - min) * scale))]!++;
  let lowCut = 0, lowTotal = 0;
  for (; lowCut < bins; lowCut++) if ((lowTotal += counts[lowCut]!) >= count) break;
  let highCut = bins - 1, highTotal = 0;
  for (; highCut >= 0; highCut--) if ((highTotal += counts[highCut]!) >= count) break;
  const low = new Float64Array(lowTotal), high = new Float64Array(highTotal);
  let nl = 0, nh = 0;
  for (let r = 0; r < m; r++) {
    const v = values[r]!;
    const b = Math.min(bins - 1, Math.floor((v - min) * scale));
    if (b <= lowCut) low[nl++] = v;
    if (b >= highCut) high[nh++] = v;
  }
  sortFloat64(low);
  sortFloat64(high);
  return { low: low.subarray(0, count), high: high.subarray(highTotal - count) };
}

/**
 * Coverage intervals from model values in any order (JCGM 101:2008 §7.7): q = pM (or
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
 * assert.deepEqual(coverageIntervals(values, 0.9).symmetric, [4, 94]);
 * ```
 */
export function coverageIntervals(
  values: Float64Array,
  coverage: number,
): { symmetric: [number, number]; shortest: [number, number] } {
  const tails = sortedTails(values, coverageTailSize(values.length, coverage));
  return intervalsFromTails(tails.low, tails.high, values.length, coverage);
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
): { symmetric: [number, number]; shortest: [number, number] } {
  const q = coverageCount(m, coverage);
  const r = Number.isInteger((m - q) / 2) ? (m - q) / 2 : (m - q + 1) / 2;
  const tailSize = m - q;
  // low[j] = y_(j+1), high[j] = y_(q+1+j)
  const symmetric: [number, number] = [low[r - 1]!, high[r - 1]!];
  let best = Infinity, bestJ = 0;
  for (let j = 0; j < tailSize; j++) {
    const w = high[j]! - low[j]!; // y_(j+1+q) − y_(j+1)
    if (w < best) {
      best = w;
      bestJ = j;
    }
  }
  return { symmetric, shortest: [low[bestJ]!, high[bestJ]!] };
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

function correlationOf(columns: readonly Float64Array[]): number[][] {
  const stats = columns.map(meanAndStandardDeviation);
  return columns.map((a, i) =>
    columns.map((b, j) => {
      if (i === j) return 1;
      const sa = stats[i]!, sb = stats[j]!;
      if (!(sa.sd > 0 && sb.sd > 0)) return 0;
      let s = 0;
      for (let r = 0; r < a.length; r++) s += (a[r]! - sa.mean) * (b[r]! - sb.mean);
      return s / (a.length - 1) / (sa.sd * sb.sd);
    })
  );
}

function summarise<I extends string, O extends string>(
  calc: Calculation<I, O>,
  results: Float64Array[],
  coverage: number,
  trials: number,
  seed: number,
  warnings: string[],
  keepSamples: boolean,
  tails?: KnownTails,
): MonteCarloResult<O> {
  const correlation = results.length > 1 ? correlationOf(results) : [[1]];
  const outputs = {} as Record<O, MonteCarloOutput>;
  calc.outputNames.forEach((o, k) => {
    const col = results[k]!;
    const { mean, sd } = meanAndStandardDeviation(col);
    const known = tails?.[k];
    const { symmetric, shortest } = known
      ? intervalsFromTails(known.low, known.high, col.length, coverage)
      : coverageIntervals(col, coverage);
    outputs[o] = {
      output: o,
      unit: calc.outputs[o].unit,
      estimate: mean,
      standardUncertainty: sd,
      symmetricInterval: symmetric,
      shortestInterval: shortest,
      samples: keepSamples ? col : new Float64Array(0),
    };
  });
  const result: MonteCarloResult<O> = {
    title: calc.title,
    id: calc.id,
    trials,
    seed,
    coverage,
    outputs,
    outputNames: calc.outputNames,
    correlation,
    warnings,
    cautions: cautionsOf(calc as unknown as Calculation),
    [JUPYTER_DISPLAY]: () => displayMonteCarlo(result as MonteCarloResult),
  };
  return result;
}

/**
 * Propagates the input distributions through a calculation by Monte Carlo (JCGM 101:2008 §7):
 * M trials drawn column-wise in blocks, each block from its own stream keyed by the seed and the
 * block index (see calc/uncertainty/trials.ts), model values, their average and standard
 * deviation, and probabilistically symmetric and shortest coverage intervals.
 *
 * @param calc The calculation.
 * @param inputs Uncertain inputs by name (plain values are exact).
 * @param options Trials, seed, coverage probability, correlations, whether to keep the samples.
 * @returns Estimates, uncertainties, intervals and (unless `keepSamples` is false) the samples in
 * trial order, per output.
 * @throws {TypeError} For unknown or missing inputs, wrong units, or correlation involving a
 * non-normal input.
 * @throws {RangeError} For bad trials, seed, coverage, uncertainties, or a non-finite model value.
 *
 * @example Additive model of JCGM 101:2008 §9.2.2: four standard normal inputs
 * ```ts
 * import { expressionModel, monteCarlo, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const range = { min: -100, max: 100 };
 * const model = expressionModel({
 *   expression: "x1 + x2 + x3 + x4",
 *   inputs: Object.fromEntries(["x1", "x2", "x3", "x4"].map((n) => [n, { unit: "1", description: n, range }])),
 *   output: { name: "y", unit: "1", description: "sum" },
 * });
 * const r = monteCarlo(model, { x1: normal(0, 1), x2: normal(0, 1), x3: normal(0, 1), x4: normal(0, 1) },
 *   { trials: 100_000, seed: 1 });
 * // JCGM 101:2008 Table 2: u(y) = 2.00, 95 % interval [−3.92, 3.92]
 * assert.ok(Math.abs(r.outputs.y.standardUncertainty - 2) < 0.02);
 * ```
 */
export function monteCarlo<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: MonteCarloOptions = {},
): MonteCarloResult<O> {
  const run = monteCarloRun(calc, inputs, options);
  const { results, outside } = runTrials(calc, run.plan, [run.seed], run.trials);
  return finishMonteCarlo(calc, run, results, outside);
}

/** A checked Monte Carlo run: options with their defaults, the resolved inputs and the trial
 * plan. Shared by {@linkcode monteCarlo} and the worker pool. */
export interface MonteCarloRun {
  readonly coverage: number;
  readonly trials: number;
  readonly seed: number;
  readonly keepSamples: boolean;
  readonly flags: readonly string[];
  readonly plan: TrialPlan;
}

/** Checks the options and inputs of a Monte Carlo run (everything that can fail before a draw). */
export function monteCarloRun<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: MonteCarloOptions,
): MonteCarloRun {
  const coverage = checkCoverage(options.coverage ?? 0.95, calc.title);
  const trials = checkTrials(options.trials ?? DEFAULT_TRIALS, coverage, calc.title);
  const seed = checkSeed(options.seed ?? DEFAULT_SEED);
  const prepared = prepareInputs(calc, inputs, options.correlations);
  const plan = trialPlan(prepared, calc.title);
  return {
    coverage,
    trials,
    seed,
    keepSamples: options.keepSamples ?? true,
    flags: prepared.flags,
    plan,
  };
}

/** The result of a run from its output columns (trial order) and out-of-range counts. */
export function finishMonteCarlo<I extends string, O extends string>(
  calc: Calculation<I, O>,
  run: MonteCarloRun,
  results: Float64Array[],
  outside: readonly number[],
  tails?: KnownTails,
): MonteCarloResult<O> {
  const warnings = [
    ...run.flags,
    ...rangeWarnings(calc as unknown as Calculation, outside, run.trials),
  ];
  return summarise(
    calc,
    results,
    run.coverage,
    run.trials,
    run.seed,
    warnings,
    run.keepSamples,
    tails,
  );
}

/** Options of {@linkcode monteCarloAdaptive}. */
export interface AdaptiveOptions {
  /** Significant decimal digits n_dig regarded as meaningful in u(y). @default 2 */
  readonly significantDigits?: number;
  /** Seed of the random stream. @default 20080101 */
  readonly seed?: number;
  /** Coverage probability. @default 0.95 */
  readonly coverage?: number;
  /** Correlations between (normal) inputs. */
  readonly correlations?: Correlations;
  /** Upper limit on the total number of trials, an integer of at least two sequences (2·M).
   * @default 50_000_000 */
  readonly maxTrials?: number;
}

/** Result of {@linkcode monteCarloAdaptive}. */
export interface AdaptiveResult<O extends string = string> extends MonteCarloResult<O> {
  /** Number of sequences h of M trials each. */
  readonly sequences: number;
  /** Trials per sequence M = max(⌈100/(1 − p)⌉, 10⁴). */
  readonly trialsPerSequence: number;
  /** Numerical tolerance δ per output (JCGM 101 §7.9.2). */
  readonly tolerance: { readonly [K in O]: number };
  /** True when every result stabilised before `maxTrials`. */
  readonly stabilized: boolean;
}

/**
 * Adaptive Monte Carlo procedure (JCGM 101:2008 §7.9): sequences of M trials until twice the
 * standard deviation of the sequence averages of y, u(y), y_low and y_high is at most the
 * numerical tolerance δ = ½·10^l of u(y) at `significantDigits` digits, for every output.
 *
 * @param calc The calculation.
 * @param inputs Uncertain inputs by name.
 * @param options Significant digits, seed, coverage, correlations, trial limit.
 * @returns The Monte Carlo result over all trials, with the number of sequences and tolerances.
 *
 * @example
 * ```ts
 * import { expressionModel, monteCarloAdaptive, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "2 * x",
 *   inputs: { x: { unit: "1", description: "x", range: { min: -10, max: 10 } } },
 *   output: { name: "y", unit: "1", description: "y" },
 * });
 * const r = monteCarloAdaptive(model, { x: normal(0, 1) }, { significantDigits: 1, seed: 3 });
 * assert.ok(r.stabilized);
 * ```
 */
export function monteCarloAdaptive<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: AdaptiveOptions = {},
): AdaptiveResult<O> {
  const state = adaptiveRun(calc, inputs, options);
  while (state.wantsMore()) {
    const h = state.sequences;
    const { results, outside } = runTrials(
      calc,
      state.plan,
      [state.seed, h],
      state.trialsPerSequence,
    );
    state.add({ results, outside, stats: sequenceStatistics(results, state.coverage) });
  }
  return state.finish();
}

/** Average, standard deviation and probabilistically symmetric interval of one output over one
 * sequence of the adaptive procedure (JCGM 101 §7.9.4 b). */
export interface SequenceStatistics {
  readonly mean: number;
  readonly sd: number;
  readonly low: number;
  readonly high: number;
}

/** The statistics of each output column of one sequence. */
export function sequenceStatistics(
  results: readonly Float64Array[],
  coverage: number,
): SequenceStatistics[] {
  return results.map((col) => {
    const { mean, sd } = meanAndStandardDeviation(col);
    const { symmetric } = coverageIntervals(col, coverage);
    return { mean, sd, low: symmetric[0], high: symmetric[1] };
  });
}

/** One finished sequence of the adaptive procedure: its output columns, out-of-range counts per
 * input, and statistics per output. */
export interface SequenceRun {
  readonly results: Float64Array[];
  readonly outside: readonly number[];
  readonly stats: readonly SequenceStatistics[];
}

/** The adaptive procedure as a state that takes sequences in order (h = 0, 1, …; sequence h is the
 * run keyed [seed, h]) and says when to stop. Shared by {@linkcode monteCarloAdaptive} and the
 * worker pool, which computes sequences ahead in parallel and adds them in order. */
export interface AdaptiveRun<O extends string> {
  readonly coverage: number;
  readonly seed: number;
  readonly plan: TrialPlan;
  readonly trialsPerSequence: number;
  /** Sequences added so far. */
  readonly sequences: number;
  /** How many sequences the trial limit allows in all: ⌊maxTrials / M⌋. */
  readonly maxSequences: number;
  /** True while not stabilised and the trial limit allows another sequence. */
  wantsMore(): boolean;
  /** Adds the next sequence; returns true when every output has stabilised. */
  add(sequence: SequenceRun): boolean;
  /** The result over all added sequences. */
  finish(): AdaptiveResult<O>;
}

/** Checks the options and inputs of an adaptive run and returns its state. */
export function adaptiveRun<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: AdaptiveOptions,
): AdaptiveRun<O> {
  const coverage = checkCoverage(options.coverage ?? 0.95, calc.title);
  const digits = options.significantDigits ?? 2;
  if (!(Number.isInteger(digits) && digits >= 1 && digits <= 4)) {
    throw new RangeError(
      `${calc.title}: expected significantDigits as an integer in [1, 4], got ${digits}`,
    );
  }
  const m = Math.max(Math.ceil(100 / (1 - coverage)), 10_000);
  const maxTrials = options.maxTrials ?? 50_000_000;
  if (!(Number.isInteger(maxTrials) && maxTrials >= 2 * m)) {
    throw new RangeError(
      `${calc.title}: expected maxTrials to be an integer >= ${
        2 * m
      } (two sequences of M = ${m} trials, JCGM 101 §7.9), got ${maxTrials}`,
    );
  }
  const seed = checkSeed(options.seed ?? DEFAULT_SEED);
  const prepared = prepareInputs(calc, inputs, options.correlations);
  const plan = trialPlan(prepared, calc.title);
  const maxSequences = Math.floor(maxTrials / m);
  const outs = calc.outputNames;
  const batches: Float64Array[][] = [];
  const seqStats = outs.map(() => ({
    y: [] as number[],
    u: [] as number[],
    lo: [] as number[],
    hi: [] as number[],
  }));
  const tolerance = {} as Record<O, number>;
  let stabilized = false;
  const outsideTotal = calc.inputNames.map(() => 0);
  const sdOfMean = (v: number[]) =>
    meanAndStandardDeviation(Float64Array.from(v)).sd / Math.sqrt(v.length);
  const add = ({ results, outside, stats }: SequenceRun): boolean => {
    outside.forEach((n, i) => (outsideTotal[i]! += n));
    batches.push(results);
    stats.forEach((st, k) => {
      const s = seqStats[k]!;
      s.y.push(st.mean);
      s.u.push(st.sd);
      s.lo.push(st.low);
      s.hi.push(st.high);
    });
    const h = batches.length;
    if (h < 2) return false;
    stabilized = outs.every((o, k) => {
      const s = seqStats[k]!;
      const uAll = s.u.reduce((a, b) => a + b, 0) / h;
      const delta = numericalTolerance(uAll, digits);
      tolerance[o] = delta;
      return [s.y, s.u, s.lo, s.hi].every((v) => 2 * sdOfMean(v) <= delta);
    });
    return stabilized;
  };
  const finish = (): AdaptiveResult<O> => {
    const warnings = [...prepared.flags];
    if (!stabilized) {
      warnings.push(
        `Adaptive Monte Carlo did not stabilise within ${maxTrials} trials at ${digits} significant digits`,
      );
    }
    const total = batches.length * m;
    warnings.push(...rangeWarnings(calc as unknown as Calculation, outsideTotal, total));
    const merged = outs.map((_, k) => {
      const all = new Float64Array(total);
      batches.forEach((b, h) => all.set(b[k]!, h * m));
      return all;
    });
    const base = summarise(calc, merged, coverage, total, seed, warnings, true);
    const result: AdaptiveResult<O> = {
      ...base,
      sequences: batches.length,
      trialsPerSequence: m,
      tolerance,
      stabilized,
      [JUPYTER_DISPLAY]: () => displayMonteCarlo(result as MonteCarloResult),
    };
    return result;
  };
  return {
    coverage,
    seed,
    plan,
    trialsPerSequence: m,
    get sequences() {
      return batches.length;
    },
    maxSequences,
    wantsMore: () => !stabilized && batches.length < maxSequences,
    add,
    finish,
  };
}

/** The verdict of {@linkcode validateGumWithMonteCarlo} for one output. */
export interface GumValidation {
  /** Output name. */
  readonly output: string;
  /** Numerical tolerance δ from u(y) at n_dig digits. */
  readonly tolerance: number;
  /** |y − U − y_low| */
  readonly lowDifference: number;
  /** |y + U − y_high| */
  readonly highDifference: number;
  /** True when both differences are at most δ (JCGM 101 §8.2). */
  readonly validated: boolean;
  /** A plain-language verdict. */
  readonly verdict: string;
}

/**
 * Validates a GUM result against a Monte Carlo result (JCGM 101:2008 §8.2): δ = ½·10^l from
 * u(y) at `significantDigits` digits; the GUM interval is validated when
 * d_low = |y − U_p − y_low| and d_high = |y + U_p − y_high| are both ≤ δ, with [y_low, y_high]
 * the probabilistically symmetric Monte Carlo interval.
 *
 * @example
 * ```ts
 * import { expressionModel, gum, monteCarlo, normal, validateGumWithMonteCarlo } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "a + b",
 *   inputs: { a: { unit: "1", description: "a", range: { min: -9, max: 9 } }, b: { unit: "1", description: "b", range: { min: -9, max: 9 } } },
 *   output: { name: "y", unit: "1", description: "y" },
 * });
 * const inputs = { a: normal(0, 1), b: normal(0, 1) };
 * const [v] = validateGumWithMonteCarlo(gum(model, inputs), monteCarlo(model, inputs, { seed: 2 }), 1);
 * assert.ok(v!.validated);
 * ```
 */
export function validateGumWithMonteCarlo(
  gumResult: GumResult,
  mcResult: MonteCarloResult,
  significantDigits = 2,
): GumValidation[] {
  if (Math.abs(gumResult.coverage - mcResult.coverage) > 1e-12) {
    throw new RangeError(
      `GUM validation: expected equal coverage probabilities, got ${gumResult.coverage} and ${mcResult.coverage}`,
    );
  }
  return gumResult.outputNames.map((name) => {
    const g = gumResult.outputs[name]!;
    const m = mcResult.outputs[name];
    if (!m) {
      throw new TypeError(
        `GUM validation: output '${name}' is missing from the Monte Carlo result`,
      );
    }
    const uForTolerance = g.standardUncertainty > 0 ? g.standardUncertainty : m.standardUncertainty;
    const tolerance = numericalTolerance(uForTolerance, significantDigits);
    const lowDifference = Math.abs(g.interval[0] - m.symmetricInterval[0]);
    const highDifference = Math.abs(g.interval[1] - m.symmetricInterval[1]);
    const validated = lowDifference <= tolerance && highDifference <= tolerance;
    const verdict = validated
      ? `The GUM interval for '${name}' is validated by Monte Carlo at ${significantDigits} significant digit(s): endpoint differences ${
        lowDifference.toPrecision(2)
      } and ${highDifference.toPrecision(2)} are within δ = ${tolerance}`
      : `The GUM interval for '${name}' is NOT validated by Monte Carlo at ${significantDigits} significant digit(s): endpoint differences ${
        lowDifference.toPrecision(2)
      } and ${
        highDifference.toPrecision(2)
      } exceed δ = ${tolerance}; report the Monte Carlo interval`;
    return { output: name, tolerance, lowDifference, highDifference, validated, verdict };
  });
}
