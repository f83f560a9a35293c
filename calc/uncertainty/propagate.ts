/**
 * The one propagation entry point: the GUM law or Monte Carlo (fixed size or adaptive) as an
 * option, one result shape whatever the method, and uncertain values that feed the next
 * calculation with their correlations (GUM) or their draws (Monte Carlo).
 *
 * @module
 */
import type { Calculation, Population } from "../core/types.ts";
import type { Correlations } from "./correlation.ts";
import { type PreparedInputs, prepareInputs, type UncertainInputs } from "./prepare.ts";
import { type GumOptions, propagateGum } from "./gum.ts";
import {
  monteCarloInBlocks,
  type MonteCarloRun,
  monteCarloRun,
  runMonteCarlo,
} from "./monte_carlo.ts";
import {
  type AdaptiveOptions,
  type AdaptiveRun,
  adaptiveRun,
  sequenceStatistics,
} from "./adaptive.ts";
import { blockCount, range, runBlocks } from "./sampling.ts";
import type { MonteCarloProgress, Propagation } from "./types.ts";
export type { MonteCarloProgress } from "./types.ts";
import { displayPropagation, JUPYTER_DISPLAY } from "../../display/uncertainty.ts";

/** Options of {@linkcode propagate}. */
export interface PropagateOptions {
  /** "gum" (law of propagation of uncertainty, JCGM 100) or "monteCarlo" (JCGM 101).
   * @default "gum" */
  readonly method?: "gum" | "monteCarlo";
  /** Coverage probability, in (0, 1). @default 0.95 */
  readonly coverage?: number;
  /** Correlations between inputs given here as distributions (pairs or a full matrix). */
  readonly correlations?: Correlations;
  /** Label of this propagation's sources: "P07" makes the height of this patient the source
   * "P07/heightCm", distinct from another patient's. @default none (the source is the input
   * name, so the same measurement given to two steps of one analysis is one source) */
  readonly label?: string;
  /** Which typical ranges flag the estimates. @default "adult" */
  readonly population?: Population;
  /** GUM: add second-order terms (JCGM 100 §5.1.2 note). @default false */
  readonly secondOrder?: boolean;
  /** Monte Carlo: number of trials M. @default 1_000_000, or that of the inputs' run */
  readonly trials?: number;
  /** Monte Carlo: seed, an integer in [1, 2³² − 1]. @default 20080101, or that of the inputs'
   * run */
  readonly seed?: number;
  /** Monte Carlo: keep the samples of every input and output (needed to chain or grade). The
   * model values are stored; the draws of an independent input are recomputed from its random
   * streams, the same numbers, the first time they are asked for, so a run holds one array per
   * output. @default true */
  readonly keepSamples?: boolean;
  /** Monte Carlo: the reported interval, probabilistically symmetric or shortest.
   * @default "symmetric" */
  readonly interval?: "symmetric" | "shortest";
  /** Monte Carlo: the adaptive procedure of JCGM 101 §7.9 (true, or its options). */
  readonly adaptive?: boolean | AdaptiveOptions;
  /** Monte Carlo: what to do with a physically inconsistent trial (an input drawn outside its
   * valid range, a broken relation between inputs such as ESV > EDV, an output not finite or
   * outside its valid range). "exclude": every output of that trial is NaN in the samples and the
   * statistics describe the distribution conditional on consistent trials (a truncation), with a
   * warning giving the share and the reasons and `monteCarlo.excludedTrials`; "refuse": the run
   * is a RangeError naming the counts. @default "exclude" */
  readonly inconsistentTrials?: "exclude" | "refuse";
  /** Monte Carlo: called after each block of trials (fixed size) or each sequence (adaptive)
   * with the trials done so far, e.g. {@linkcode terminalProgress}'s callback. Without it the run
   * reports nothing. @default none */
  readonly onProgress?: (progress: MonteCarloProgress) => void;
}

/** Checks a coverage probability. */
export function checkCoverage(p: number, where: string): number {
  if (!(typeof p === "number" && p > 0 && p < 1)) {
    throw new RangeError(`${where}: expected coverage probability in (0, 1), got ${p}`);
  }
  return p;
}

/** Attaches the notebook display to a result. */
export function displayable<I extends string, O extends string>(
  result: Propagation<I, O>,
): Propagation<I, O> {
  const shown = result as Propagation<I, O> & { [JUPYTER_DISPLAY](): unknown };
  shown[JUPYTER_DISPLAY] = () => displayPropagation(result as unknown as Propagation);
  return shown;
}

/**
 * Propagates the uncertainty of the inputs through a calculation, by the GUM law (JCGM 100:2008
 * §5, the default) or by Monte Carlo (JCGM 101:2008 §7, fixed size or adaptive). Each input may be
 * exact (a number or quantity string), a distribution (`normal(…)`, `typeA(…)`, …) or an uncertain
 * value from an earlier propagation; the result holds an uncertain value for every input and
 * output, each a valid input to the next calculation.
 *
 * @param calc The calculation.
 * @param inputs Inputs by name.
 * @param options Method, coverage, correlations, label and the method's own options.
 * @returns Every input and output as an uncertain value, with output covariance, warnings and
 * cautions; it displays itself in a notebook.
 * @throws {TypeError} For unknown or missing inputs, wrong units, values of the other method, or
 * correlation involving a non-normal input (Monte Carlo).
 * @throws {RangeError} For estimates outside their valid range, bad uncertainties, coverage,
 * trials or seed, or a non-finite model value.
 *
 * @example Peak gradient 4v² with v = 4.0 ± 0.1 m/s
 * ```ts
 * import { normal, propagate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) });
 * // c = 8v = 32 mmHg per m/s → u = 3.2 mmHg (JCGM 100 eq. (10), hand-checkable)
 * assert.ok(Math.abs(r.outputs.gradient.standardUncertainty - 3.2) < 1e-9);
 * const m = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) },
 *   { method: "monteCarlo", trials: 100_000, seed: 1 });
 * // E[4v²] = 4(v² + u²) = 64.04 mmHg (exact for a normal v)
 * assert.ok(Math.abs(m.outputs.gradient.value - 64.04) < 0.05);
 * ```
 */
export function propagate<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: PropagateOptions = {},
): Propagation<I, O> {
  const planned = planPropagation(calc, inputs, options);
  const onProgress = options.onProgress;
  if (planned.kind === "fixed" && onProgress === undefined) {
    return displayable(runMonteCarlo(calc, planned.run)); // all blocks in one pass
  }
  const steps = propagationSteps(calc, planned);
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    onProgress?.(step.value);
  }
}

/**
 * {@linkcode propagate}, giving the event loop a turn after each block of trials (fixed size) or
 * each sequence (adaptive) so that progress reports reach the screen while the run goes on: in a
 * notebook, pass {@linkcode notebookProgress}'s callback as `onProgress`. Same result as
 * `propagate`, bit for bit.
 *
 * @param calc The calculation.
 * @param inputs Inputs by name.
 * @param options As {@linkcode propagate}.
 * @returns The propagation.
 * @throws {TypeError | RangeError} As {@linkcode propagate}.
 *
 * @example Progress reports of a Monte Carlo run of 200,000 trials (blocks of 65,536)
 * ```ts
 * import { normal, propagate, propagateInSteps, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const seen: number[] = [];
 * const options = { method: "monteCarlo", trials: 200_000, seed: 3 } as const;
 * const r = await propagateInSteps(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }, {
 *   ...options,
 *   onProgress: (p) => seen.push(p.trialsDone),
 * });
 * assert.deepEqual(seen, [65_536, 131_072, 196_608, 200_000]);
 * const once = propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }, options);
 * assert.equal(r.outputs.gradient.value, once.outputs.gradient.value);
 * ```
 */
export async function propagateInSteps<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: PropagateOptions = {},
): Promise<Propagation<I, O>> {
  const steps = propagationSteps(calc, planPropagation(calc, inputs, options));
  for (;;) {
    const step = steps.next();
    if (step.done) return step.value;
    options.onProgress?.(step.value);
    await new Promise((resolve) => setTimeout(resolve, 0));
  }
}

/** A planned propagation run step by step: yields the progress after each block of trials (fixed
 * size) or sequence (adaptive), returns the result. */
function* propagationSteps<I extends string, O extends string>(
  calc: Calculation<I, O>,
  planned: PlannedPropagation<I, O>,
): Generator<MonteCarloProgress, Propagation<I, O>, void> {
  switch (planned.kind) {
    case "gum":
      return displayable(propagateGum(calc, planned.prepared, planned.options));
    case "fixed": {
      const parts = monteCarloInBlocks(calc, planned.run);
      for (let b = 0; b < parts.blocks; b++) {
        parts.run(b, b + 1);
        yield { trialsDone: parts.trialsAfter(b + 1), trialsPlanned: planned.run.trials };
      }
      return displayable(parts.finish());
    }
    case "adaptive": {
      const state = planned.state;
      const c = calc as unknown as Calculation;
      const m = state.trialsPerSequence;
      while (state.wantsMore()) {
        const results = calc.outputNames.map(() => new Float64Array(m));
        const counts = {
          inputsOutside: calc.inputNames.map(() => 0),
          outputsOutside: calc.outputNames.map(() => 0),
        };
        runBlocks(c, state.plan, [state.seed, state.sequences], m, range(blockCount(m)), {
          outputs: results,
          draws: state.plan.inputs.map(() => null),
          firstTrial: 0,
        }, counts);
        state.add({
          results,
          ...counts,
          stats: sequenceStatistics(results, state.coverage, state.interval),
        });
        yield { trialsDone: state.sequences * m, trialsPlanned: state.maxSequences * m };
      }
      return displayable(state.finish() as unknown as Propagation<I, O>);
    }
  }
}

/** A propagation checked and planned, before any computation: what both this thread and the
 * worker pool run. */
export type PlannedPropagation<I extends string, O extends string> =
  | {
    readonly kind: "gum";
    readonly prepared: PreparedInputs<I>;
    readonly options: GumOptions;
  }
  | { readonly kind: "fixed"; readonly run: MonteCarloRun<I> }
  | { readonly kind: "adaptive"; readonly state: AdaptiveRun<O> };

/**
 * Checks the options and inputs of a propagation and plans it (everything that can fail before
 * the first computation fails here).
 *
 * @throws {TypeError | RangeError} As {@linkcode propagate}.
 */
export function planPropagation<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: PropagateOptions,
): PlannedPropagation<I, O> {
  const method = options.method ?? "gum";
  if (method !== "gum" && method !== "monteCarlo") {
    throw new TypeError(
      `${calc.title}: expected method "gum" or "monteCarlo", got ${JSON.stringify(method)}`,
    );
  }
  const coverage = checkCoverage(options.coverage ?? 0.95, calc.title);
  const prepared = prepareInputs(calc, inputs, {
    method,
    ...(options.correlations !== undefined ? { correlations: options.correlations } : {}),
    ...(options.label !== undefined ? { label: options.label } : {}),
    ...(options.population !== undefined ? { population: options.population } : {}),
  });
  if (method === "gum") {
    return {
      kind: "gum",
      prepared,
      options: { coverage, secondOrder: options.secondOrder ?? false },
    };
  }
  const shared = {
    coverage,
    ...(options.seed !== undefined ? { seed: options.seed } : {}),
    ...(options.interval !== undefined ? { interval: options.interval } : {}),
    ...(options.inconsistentTrials !== undefined
      ? { inconsistentTrials: options.inconsistentTrials }
      : {}),
  };
  if (options.adaptive) {
    const adaptive = options.adaptive === true ? {} : options.adaptive;
    return { kind: "adaptive", state: adaptiveRun(calc, prepared, { ...adaptive, ...shared }) };
  }
  return {
    kind: "fixed",
    run: monteCarloRun(calc, prepared, {
      ...shared,
      ...(options.trials !== undefined ? { trials: options.trials } : {}),
      ...(options.keepSamples !== undefined ? { keepSamples: options.keepSamples } : {}),
    }),
  };
}
