/**
 * The adaptive Monte Carlo procedure (JCGM 101:2008 §7.9): sequences of M trials until twice the
 * standard deviation of the sequence averages of y, u(y) and both ends of the reported coverage
 * interval is at most the numerical tolerance δ of u(y), for every output. The procedure is a
 * state that takes sequences in order (sequence h draws its sources from streams keyed
 * [seed, h, …]), so the worker pool can compute sequences ahead and add them in order.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { coverageIntervals, meanAndStandardDeviation } from "./intervals.ts";
import { numericalTolerance } from "./rounding.ts";
import { emptyCounts, finishMonteCarlo, type MonteCarloRun, planInputs } from "./monte_carlo.ts";
import type { PreparedInputs } from "./prepare.ts";
import { checkSeed } from "./random.ts";
import type { InconsistentTrials, TrialPlan } from "./sampling.ts";
import type { Propagation } from "./types.ts";

/** Options of the adaptive procedure. */
export interface AdaptiveOptions {
  /** Significant decimal digits n_dig regarded as meaningful in u(y). @default 2 */
  readonly significantDigits?: number;
  /** Upper limit on the total number of trials, at least two sequences. @default 50_000_000 */
  readonly maxTrials?: number;
}

/** Average, standard deviation and the reported interval's ends of one output over one sequence
 * (JCGM 101 §7.9.4 b). */
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
  interval: "symmetric" | "shortest",
): SequenceStatistics[] {
  return results.map((col) => {
    const { mean, sd } = meanAndStandardDeviation(col);
    const i = coverageIntervals(col, coverage)[interval];
    return { mean, sd, low: i.lower, high: i.upper };
  });
}

/** One finished sequence: its output columns, out-of-range counts and statistics. */
export interface SequenceRun {
  readonly results: Float64Array[];
  readonly inputsOutside: readonly number[];
  readonly outputsOutside: readonly number[];
  readonly stats: readonly SequenceStatistics[];
}

/** The adaptive procedure as a state (see the module doc). */
export interface AdaptiveRun<O extends string> {
  readonly coverage: number;
  readonly seed: number;
  readonly plan: TrialPlan;
  readonly interval: "symmetric" | "shortest";
  readonly trialsPerSequence: number;
  /** Sequences added so far. */
  readonly sequences: number;
  /** How many sequences the trial limit allows in all. */
  readonly maxSequences: number;
  /** True while not stabilised and the trial limit allows another sequence. */
  wantsMore(): boolean;
  /** Adds the next sequence; returns true when every output has stabilised. */
  add(sequence: SequenceRun): boolean;
  /** The result over all added sequences. */
  finish(): Propagation<string, O>;
}

/**
 * Checks the options and inputs of an adaptive run and returns its state.
 *
 * @throws {RangeError} For bad significant digits, trial limit or seed.
 * @throws {TypeError} For inputs that carry samples of an earlier step (an adaptive run draws
 * its own sequences).
 */
export function adaptiveRun<I extends string, O extends string>(
  calc: Calculation<I, O>,
  prepared: PreparedInputs<I>,
  options: AdaptiveOptions & {
    readonly coverage: number;
    readonly seed?: number;
    readonly interval?: "symmetric" | "shortest";
    readonly inconsistentTrials?: InconsistentTrials;
  },
): AdaptiveRun<O> {
  const { coverage } = options;
  const where = calc.title;
  if (prepared.inputs.some((p) => p.given !== null) || prepared.sources.samples.size > 0) {
    throw new TypeError(
      `${where}: an adaptive Monte Carlo run draws its own sequences; expected inputs given as distributions or numbers, got a value of an earlier step (declare the steps as one chain and run it adaptively)`,
    );
  }
  const digits = options.significantDigits ?? 2;
  if (!(Number.isInteger(digits) && digits >= 1 && digits <= 4)) {
    throw new RangeError(
      `${where}: expected significantDigits as an integer in [1, 4], got ${digits}`,
    );
  }
  const m = Math.max(Math.ceil(100 / (1 - coverage)), 10_000);
  const maxTrials = options.maxTrials ?? 50_000_000;
  if (!(Number.isInteger(maxTrials) && maxTrials >= 2 * m)) {
    throw new RangeError(
      `${where}: expected maxTrials to be an integer >= ${
        2 * m
      } (two sequences of M = ${m} trials, JCGM 101 §7.9), got ${maxTrials}`,
    );
  }
  const seed = checkSeed(options.seed ?? 20080101);
  const interval = options.interval ?? "symmetric";
  const inconsistentTrials = options.inconsistentTrials ?? "exclude";
  const plan: TrialPlan = { ...planInputs(calc, prepared), inconsistent: inconsistentTrials };
  const maxSequences = Math.floor(maxTrials / m);
  const outs = calc.outputNames;
  const batches: Float64Array[][] = [];
  const seqStats = outs.map(() => ({
    y: [] as number[],
    u: [] as number[],
    lo: [] as number[],
    hi: [] as number[],
  }));
  const tolerance: Record<string, number> = {};
  let stabilized = false;
  const counts = emptyCounts(calc.inputNames.length, outs.length);
  const sdOfMean = (v: number[]) =>
    meanAndStandardDeviation(Float64Array.from(v)).sd / Math.sqrt(v.length);
  const add = (sequence: SequenceRun): boolean => {
    sequence.inputsOutside.forEach((n, i) => (counts.inputsOutside[i]! += n));
    sequence.outputsOutside.forEach((n, k) => (counts.outputsOutside[k]! += n));
    batches.push(sequence.results);
    sequence.stats.forEach((st, k) => {
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
  const finish = (): Propagation<string, O> => {
    const total = batches.length * m;
    const merged = outs.map((_, k) => {
      const all = new Float64Array(total);
      batches.forEach((b, h) => all.set(b[k]!, h * m));
      return all;
    });
    const run: MonteCarloRun<I> = {
      prepared,
      plan,
      coverage,
      trials: total,
      seed,
      keepSamples: true,
      interval,
      inconsistentTrials,
    };
    const result = finishMonteCarlo(
      calc,
      run,
      { outputs: merged, draws: plan.inputs.map(() => null), firstTrial: 0 },
      counts,
      {
        adaptive: {
          sequences: batches.length,
          trialsPerSequence: m,
          significantDigits: digits,
          tolerance: { ...tolerance },
          stabilized,
        },
      },
    );
    if (!stabilized) {
      (result.warnings as string[]).push(
        `Adaptive Monte Carlo did not stabilise within ${maxTrials} trials at ${digits} significant digits`,
      );
    }
    return result as unknown as Propagation<string, O>;
  };
  return {
    coverage,
    seed,
    plan,
    interval,
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
