/**
 * Propagation of distributions by the Monte Carlo method (JCGM 101:2008 §7) for a fixed number
 * of trials: every elementary source drawn from its own keyed stream (calc/uncertainty/
 * sampling.ts), values of earlier steps taken trial by trial from their samples, the model values
 * summarised as uncertain values that keep their samples so that the next step uses the same
 * draws.
 *
 * @module
 */
import type { Calculation, InputDefinition, OutputDefinition } from "../core/types.ts";
import { cautionsOf } from "../core/calculation.ts";
import { formatRange } from "../core/range.ts";
import { relationText } from "../core/validate.ts";
import { checkSeed } from "./random.ts";
import { type KnownTails, sampleCovariance } from "./intervals.ts";
import { intervalsFromTails, intervalsOfValues, meanAndStandardDeviation } from "./intervals.ts";
import { outsideDrawsWarning, outsideOutputsWarning, warningMessages } from "./prepare.ts";
import type { PreparedInputs } from "./prepare.ts";
import { keyWords, NO_SOURCES, sourceCorrelation } from "./sources.ts";
import { distributionInterval, exactDistribution } from "./distributions.ts";
import {
  BLOCK_TRIALS,
  blockCount,
  type InconsistentTrials,
  planGroups,
  type PlanInput,
  range,
  redrawSource,
  runBlocks,
  type RunCounts,
  type RunTargets,
  storesDraws,
  type TrialPlan,
} from "./sampling.ts";
import { correlationFromCovariance } from "./gum.ts";
import { withValueDisplay } from "../../display/uncertainty.ts";
import type {
  AdaptiveSummary,
  Interval,
  Propagation,
  ResolvedDistribution,
  SourceSet,
  TrialLayout,
  UncertainValue,
} from "./types.ts";

/**
 * Default number of Monte Carlo trials (JCGM 101:2008 §7.2.2 suggests 10⁶ for 95 % coverage).
 *
 * @example
 * ```ts
 * import { DEFAULT_TRIALS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DEFAULT_TRIALS, 1_000_000);
 * ```
 */
export const DEFAULT_TRIALS = 1_000_000;

/**
 * Default seed, used when none is given, so that every run is reproducible.
 *
 * @example
 * ```ts
 * import { DEFAULT_SEED } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Number.isInteger(DEFAULT_SEED) && DEFAULT_SEED > 0);
 * ```
 */
export const DEFAULT_SEED = 20080101;

/** Options of a fixed-size Monte Carlo run. */
export interface MonteCarloRunOptions {
  /** Coverage probability. */
  readonly coverage: number;
  /** Number of trials M (taken from the earlier step's values when they carry samples). */
  readonly trials?: number;
  /** Seed (taken from the earlier step's values when they carry samples). */
  readonly seed?: number;
  /** Keep the samples of every input and output in the result (needed to chain). @default true */
  readonly keepSamples?: boolean;
  /** Which coverage interval is `interval`. @default "symmetric" */
  readonly interval?: "symmetric" | "shortest";
  /** Physically inconsistent trials: excluded (the conditional distribution) or refused.
   * @default "exclude" */
  readonly inconsistentTrials?: InconsistentTrials;
}

/** A checked run: everything that can fail before the first draw has been checked. */
export interface MonteCarloRun<I extends string = string> {
  readonly prepared: PreparedInputs<I>;
  readonly plan: TrialPlan;
  readonly coverage: number;
  readonly trials: number;
  readonly seed: number;
  readonly keepSamples: boolean;
  readonly interval: "symmetric" | "shortest";
  readonly inconsistentTrials: InconsistentTrials;
}

/** Checks a number of trials for a coverage probability (M ≥ 1/(1 − p), JCGM 101 §7.2.2). */
export function checkTrials(trials: number, coverage: number, where: string): number {
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

/** The plan inputs of prepared inputs: exact values, sources to draw (or already drawn in an
 * earlier step), samples of earlier values. */
export function planInputs<I extends string>(
  calc: Calculation<I, string>,
  prepared: PreparedInputs<I>,
): TrialPlan {
  const inputs: PlanInput[] = prepared.inputs.map((p): PlanInput => {
    if (p.given !== null) {
      const s = p.given.samples!;
      return { kind: "samples", samples: p.factor === 1 ? s : s.map((v) => v * p.factor) };
    }
    if (p.fresh !== null) {
      const drawn = prepared.sources.samples.get(p.fresh.key);
      if (drawn) return { kind: "samples", samples: drawn };
      return {
        kind: "source",
        key: p.fresh.key,
        words: keyWords(p.fresh.key),
        distribution: p.fresh.distribution,
        group: -1,
      };
    }
    return { kind: "exact", value: p.estimate };
  });
  const keys = inputs.map((p) => (p.kind === "source" ? p.key : null));
  return planGroups(
    inputs,
    (i, j) => keys[i] && keys[j] ? sourceCorrelation(prepared.sources, keys[i]!, keys[j]!) : 0,
    calc.title,
    calc.inputNames,
  );
}

/** Checks the options of a fixed-size run against its inputs and plans it. */
export function monteCarloRun<I extends string>(
  calc: Calculation<I, string>,
  prepared: PreparedInputs<I>,
  options: MonteCarloRunOptions,
): MonteCarloRun<I> {
  const where = calc.title;
  const layouts = prepared.inputs.flatMap((p) => (p.given?.layout ? [p.given.layout] : []));
  for (const s of prepared.sources.samples.values()) {
    if (layouts.length === 0) break;
    if (s.length !== layouts[0]!.trials) {
      throw new RangeError(`${where}: inputs from Monte Carlo runs of different sizes`);
    }
  }
  const fromInputs = layouts[0];
  for (const l of layouts) {
    if (l.seed !== fromInputs!.seed || l.trials !== fromInputs!.trials) {
      throw new RangeError(
        `${where}: expected the inputs of one chain to come from Monte Carlo runs with one seed and one number of trials, got seeds ${
          fromInputs!.seed
        } and ${l.seed}, ${fromInputs!.trials} and ${l.trials} trials`,
      );
    }
  }
  const seed = checkSeed(options.seed ?? fromInputs?.seed ?? DEFAULT_SEED);
  const trials = checkTrials(
    options.trials ?? fromInputs?.trials ?? DEFAULT_TRIALS,
    options.coverage,
    where,
  );
  if (fromInputs && (seed !== fromInputs.seed || trials !== fromInputs.trials)) {
    throw new RangeError(
      `${where}: expected the seed ${fromInputs.seed} and ${fromInputs.trials} trials of the inputs' Monte Carlo run (a chain runs with one seed), got seed ${seed} and ${trials} trials`,
    );
  }
  const inconsistentTrials = options.inconsistentTrials ?? "exclude";
  if (inconsistentTrials !== "exclude" && inconsistentTrials !== "refuse") {
    throw new TypeError(
      `${where}: expected inconsistentTrials "exclude" or "refuse", got ${
        JSON.stringify(inconsistentTrials)
      }`,
    );
  }
  return {
    prepared,
    plan: { ...planInputs(calc, prepared), inconsistent: inconsistentTrials },
    inconsistentTrials,
    coverage: options.coverage,
    trials,
    seed,
    keepSamples: options.keepSamples ?? true,
    interval: options.interval ?? "symmetric",
  };
}

/** The arrays a run writes: one per output, and when samples are kept one per source whose draws
 * cannot be recomputed alone (see {@linkcode storesDraws}). */
export function runTargets(run: MonteCarloRun, outputs: number): RunTargets {
  return {
    outputs: range(outputs).map(() => new Float64Array(run.trials)),
    draws: run.plan.inputs.map((_, i) =>
      run.keepSamples && storesDraws(run.plan, i) ? new Float64Array(run.trials) : null
    ),
    firstTrial: 0,
  };
}

/** Zero counts for a run. */
export function emptyCounts(inputs: number, outputs: number): RunCounts {
  return { inputsOutside: range(inputs).map(() => 0), outputsOutside: range(outputs).map(() => 0) };
}

/** An uncertain value of the Monte Carlo method from model values. */
export function sampledValue(parts: {
  readonly name: string;
  readonly def: InputDefinition | OutputDefinition;
  readonly samples: Float64Array;
  readonly coverage: number;
  readonly sources: SourceSet;
  readonly layout: TrialLayout;
  readonly keep: boolean;
  readonly interval: "symmetric" | "shortest";
  readonly tails?: { readonly low: Float64Array; readonly high: Float64Array };
}): UncertainValue {
  const { samples, coverage } = parts;
  const { mean, sd, ...span } = meanAndStandardDeviation(samples);
  const count = span.count;
  let intervals: { symmetric: Interval; shortest: Interval } | undefined;
  const get = () =>
    intervals ??= parts.tails
      ? intervalsFromTails(parts.tails.low, parts.tails.high, count, coverage)
      : intervalsOfValues(samples, coverage, span);
  const value = {
    kind: "sonorigor.uncertainValue" as const,
    name: parts.name,
    label: parts.def.label,
    quantity: parts.def.quantity,
    unit: parts.def.unit,
    method: "monteCarlo" as const,
    value: mean,
    standardUncertainty: sd,
    coverage,
    get interval(): Interval {
      const i = get();
      return parts.interval === "shortest" ? i.shortest : i.symmetric;
    },
    expandedUncertainty: null,
    coverageFactor: null,
    effectiveDof: null,
    budget: [],
    correlationShare: 0,
    secondOrderShare: 0,
    firstOrderAdequate: true,
    sensitivities: new Map<string, number>(),
    sources: parts.sources,
    samples: parts.keep ? samples : null,
    get shortestInterval(): Interval {
      return get().shortest;
    },
    layout: parts.layout,
  };
  return withValueDisplay(value);
}

/** An uncertain value of the Monte Carlo method for an input given as a distribution: its exact
 * estimate, standard uncertainty and probabilistically symmetric interval, with its draws. */
export function distributionValue(parts: {
  readonly name: string;
  readonly def: InputDefinition;
  readonly distribution: ResolvedDistribution;
  readonly coverage: number;
  readonly sources: SourceSet;
  /** The draws, or a function giving them on first use. */
  readonly samples: Float64Array | null | (() => Float64Array | null);
  readonly layout: TrialLayout;
}): UncertainValue {
  const d = parts.distribution;
  const given = parts.samples;
  let drawn: Float64Array | null | undefined = typeof given === "function" ? undefined : given;
  const interval = distributionInterval(d, parts.coverage);
  return withValueDisplay({
    kind: "sonorigor.uncertainValue" as const,
    name: parts.name,
    label: parts.def.label,
    quantity: parts.def.quantity,
    unit: parts.def.unit,
    method: "monteCarlo" as const,
    value: d.estimate,
    standardUncertainty: d.standardUncertainty,
    coverage: parts.coverage,
    interval,
    expandedUncertainty: null,
    coverageFactor: null,
    effectiveDof: null,
    budget: [],
    correlationShare: 0,
    secondOrderShare: 0,
    firstOrderAdequate: true,
    sensitivities: new Map<string, number>(),
    sources: parts.sources,
    get samples(): Float64Array | null {
      return drawn !== undefined ? drawn : (drawn = (given as () => Float64Array | null)());
    },
    // the shortest interval of an asymmetric triangle or a cone is not the symmetric one: not
    // computed
    shortestInterval: (d.kind === "triangular" && d.mode !== d.estimate) || d.kind === "cone"
      ? null
      : interval,
    layout: parts.layout,
  });
}

/** The propagation result of a finished run. */
export function finishMonteCarlo<I extends string, O extends string>(
  calc: Calculation<I, O>,
  run: MonteCarloRun<I>,
  targets: RunTargets,
  counts: RunCounts,
  extra: { readonly tails?: KnownTails; readonly adaptive?: AdaptiveSummary } = {},
): Propagation<I, O> {
  const { prepared, coverage, trials, seed, keepSamples } = run;
  const chainable = keepSamples && extra.adaptive == null;
  const layout: TrialLayout = { seed, trials, chainable };
  // the draws of each source input: stored, or (independent sources of a chainable run)
  // recomputed from their streams on first use and then shared by the source set and the input's
  // value, so that both hold the same array
  const hasDraws = (i: number) =>
    targets.draws[i] !== null || (chainable && run.plan.inputs[i]!.kind === "source");
  const memo: (Float64Array | null | undefined)[] = [];
  const drawsOf = (i: number): Float64Array | null =>
    memo[i] !== undefined
      ? memo[i]!
      : (memo[i] = !hasDraws(i)
        ? null
        : targets.draws[i] ?? redrawSource(run.plan, i, [seed], trials));
  const drawnInputs = prepared.inputs.flatMap((p, i) =>
    p.fresh && hasDraws(i) ? [[p.fresh.key, i] as const] : []
  );
  let samples: Map<string, Float64Array> | undefined;
  const sources: SourceSet = prepared.sources.sources.size === 0 ? NO_SOURCES : Object.freeze({
    sources: prepared.sources.sources,
    correlations: prepared.sources.correlations,
    get samples(): Map<string, Float64Array> {
      return samples ??= new Map([
        ...prepared.sources.samples,
        ...drawnInputs.map(([key, i]) => [key, drawsOf(i)!] as const),
      ]);
    },
  });
  const warnings = warningMessages(prepared.warnings);
  for (const p of prepared.inputs) {
    const d = p.fresh?.distribution;
    if (d?.kind === "studentT" && d.dof <= 2) {
      warnings.push(
        `${calc.inputs[p.name as I].label} is drawn from a t distribution with ν = ${d.dof}${
          Number.isInteger(d.dof) ? ` (${d.dof + 1} repeated readings)` : ""
        }: its variance is infinite for ν ≤ 2 (JCGM 101:2008 §6.4.9.4), so a Monte Carlo standard uncertainty does not converge and is not meaningful; report the coverage interval only, or take more readings`,
      );
    }
  }
  const excluded = excludedTrials(targets.outputs);
  if (run.inconsistentTrials === "refuse") {
    const problems = [
      ...prepared.inputs.flatMap((p, i) => {
        const n = counts.inputsOutside[i]!;
        return n > 0 ? [outsideDrawsWarning(calc, p.name, n, trials)] : [];
      }),
      ...calc.outputNames.flatMap((o, k) => {
        const n = counts.outputsOutside[k]!;
        return n > 0 ? [outsideOutputsWarning(calc, o, n, trials)] : [];
      }),
    ];
    if (problems.length > 0) {
      throw new RangeError(
        `${calc.title}: Monte Carlo refused (inconsistentTrials: "refuse"): ${
          problems.join("; ")
        }; propagate with inconsistentTrials: "exclude" for the distribution conditional on consistent trials, or give the inputs distributions that respect the limits`,
      );
    }
  } else if (excluded > 0) {
    warnings.push(
      excludedWarning(calc, prepared.inputs.map((p) => p.name), counts, excluded, trials),
    );
  }
  const outputs = {} as Record<O, UncertainValue>;
  calc.outputNames.forEach((o, k) => {
    outputs[o] = sampledValue({
      name: o,
      def: calc.outputs[o],
      samples: targets.outputs[k]!,
      coverage,
      sources,
      layout,
      keep: keepSamples,
      interval: run.interval,
      ...(extra.tails ? { tails: extra.tails[k]! } : {}),
    });
  });
  const inputs = {} as Record<I, UncertainValue>;
  prepared.inputs.forEach((p, i) => {
    const def = calc.inputs[p.name as I];
    if (p.given !== null && p.factor === 1) {
      inputs[p.name as I] = p.given;
      return;
    }
    const plan = run.plan.inputs[i]!;
    if (p.given !== null) {
      // an earlier value in another unit: its samples, converted
      inputs[p.name as I] = sampledValue({
        name: p.name,
        def,
        samples: (plan as Extract<typeof plan, { kind: "samples" }>).samples,
        coverage,
        sources,
        layout,
        keep: keepSamples,
        interval: run.interval,
      });
      return;
    }
    inputs[p.name as I] = distributionValue({
      name: p.name,
      def,
      distribution: p.fresh?.distribution ?? exactDistribution(p.estimate),
      coverage,
      sources: p.fresh ? sources : NO_SOURCES,
      samples: !keepSamples ? null : plan.kind === "samples" ? plan.samples : () => drawsOf(i),
      layout,
    });
  });
  const covariance = calc.outputNames.length > 1
    ? sampleCovariance(targets.outputs)
    : [[outputs[calc.outputNames[0]!].standardUncertainty ** 2]];
  return {
    kind: "sonorigor.propagation",
    calculation: calc,
    method: "monteCarlo",
    coverage,
    inputs,
    outputs,
    outputNames: calc.outputNames,
    covariance,
    correlation: correlationFromCovariance(covariance),
    warnings,
    cautions: cautionsOf(calc),
    monteCarlo: {
      trials,
      seed,
      interval: run.interval,
      adaptive: extra.adaptive ?? null,
      excludedTrials: excluded,
      inconsistentTrials: run.inconsistentTrials,
    },
  };
}

/**
 * Runs a checked Monte Carlo run on this thread: all blocks of trials keyed [seed].
 */
export function runMonteCarlo<I extends string, O extends string>(
  calc: Calculation<I, O>,
  run: MonteCarloRun<I>,
): Propagation<I, O> {
  const parts = monteCarloInBlocks(calc, run);
  parts.run(0, parts.blocks);
  return parts.finish();
}

/** A Monte Carlo run taken a few blocks at a time (to report progress between them). */
export interface MonteCarloInBlocks<I extends string, O extends string> {
  /** Number of blocks of trials. */
  readonly blocks: number;
  /** Trials done once the first `blocks` blocks are done. */
  trialsAfter(blocks: number): number;
  /** Runs blocks [from, to). Each block has its own streams, so the result does not depend on
   * how the blocks are grouped. */
  run(from: number, to: number): void;
  /** The result, once every block has run. */
  finish(): Propagation<I, O>;
}

/**
 * A checked Monte Carlo run on this thread, taken block by block: the same result as
 * {@linkcode runMonteCarlo} whatever the grouping of the blocks.
 */
export function monteCarloInBlocks<I extends string, O extends string>(
  calc: Calculation<I, O>,
  run: MonteCarloRun<I>,
): MonteCarloInBlocks<I, O> {
  const targets = runTargets(run, calc.outputNames.length);
  const counts = emptyCounts(calc.inputNames.length, calc.outputNames.length);
  const blocks = blockCount(run.trials);
  return {
    blocks,
    trialsAfter: (done) => Math.min(run.trials, done * BLOCK_TRIALS),
    run(from, to) {
      const which: number[] = [];
      for (let b = from; b < to; b++) which.push(b);
      runBlocks(
        calc as unknown as Calculation,
        run.plan,
        [run.seed],
        run.trials,
        which,
        targets,
        counts,
      );
    },
    finish: () => finishMonteCarlo(calc, run, targets, counts),
  };
}

/** Trials excluded as physically inconsistent: NaN in every output (0 without outputs). */
export function excludedTrials(outputs: readonly Float64Array[]): number {
  const first = outputs[0];
  if (!first) return 0;
  let n = 0;
  for (let r = 0; r < first.length; r++) if (first[r] !== first[r]) n++;
  return n;
}

/** The warning for excluded trials: how many, why, and what the result then describes. */
export function excludedWarning(
  calc: Calculation,
  inputNames: readonly string[],
  counts: RunCounts,
  excluded: number,
  trials: number,
): string {
  const reasons = [
    ...inputNames.flatMap((name, i) => {
      const n = counts.inputsOutside[i]!;
      const def = calc.inputs[name]!;
      return n > 0
        ? [`${n} draws of ${def.label} outside ${formatRange(def.range, def.unit)}`]
        : [];
    }),
    ...(calc.constraints.length > 0
      ? [`draws breaking ${calc.constraints.map((c) => relationText(calc, c)).join(", ")}`]
      : []),
    ...calc.outputNames.flatMap((o, k) => {
      const n = counts.outputsOutside[k]!;
      const def = calc.outputs[o]!;
      return n > 0
        ? [`${n} values of ${def.label} outside ${formatRange(def.quantity.valid, def.unit)}`]
        : [];
    }),
  ];
  const share = (100 * excluded) / trials;
  return `${excluded} of ${trials} trials (${
    share < 0.1 ? share.toPrecision(1) : share.toFixed(1)
  } %) were physically inconsistent and were excluded (${
    reasons.length > 0 ? reasons.join("; ") : "excluded in an earlier step"
  }): the results describe the distribution conditional on consistent trials (a truncation); propagate with inconsistentTrials: "refuse" to stop instead`;
}
