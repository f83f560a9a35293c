/**
 * The shapes of uncertainty results: one interval shape, elementary sources of uncertainty, the
 * uncertain value that both methods return and that the next calculation accepts as an input,
 * and the result of one propagation. Types only.
 *
 * @module
 */
import type { Calculation, Quantity } from "../core/types.ts";

/** A closed interval [lower, upper]: the one interval shape of the package (coverage intervals,
 * confidence intervals, limits). */
export interface Interval {
  /** Lower end. */
  readonly lower: number;
  /** Upper end. */
  readonly upper: number;
}

/** The probability distributions an input may be given (JCGM 100 §4, JCGM 101 §6.4). */
export type DistributionKind =
  | "normal"
  | "rectangular"
  | "triangular"
  | "arcsine"
  | "studentT"
  | "cone"
  | "exact";

/** A distribution resolved to canonical numbers. */
export interface ResolvedDistribution {
  /** Distribution tag. */
  readonly kind: DistributionKind;
  /** Expectation used as the estimate. */
  readonly estimate: number;
  /** Standard uncertainty. */
  readonly standardUncertainty: number;
  /** Degrees of freedom (Infinity for a Type B evaluation without stated reliability). */
  readonly dof: number;
  /** Lower bound of a bounded shape (the estimate otherwise). */
  readonly lower: number;
  /** Upper bound of a bounded shape (the estimate otherwise). */
  readonly upper: number;
  /** Mode of a triangular shape (the estimate otherwise). */
  readonly mode: number;
  /** Radians per canonical unit of an angle drawn from a cone (the cone distribution only). */
  readonly radiansPerUnit?: number;
}

/**
 * One elementary source of uncertainty: an input a user gave with a distribution. Sources are
 * independent unless a correlation between two of them was declared. Its key is unique within an
 * analysis: the input name, prefixed by the propagation's label ("P07/heightCm") when one is
 * given, so that the same measurement used in two steps is one source.
 */
export interface Source {
  /** Unique key within an analysis. */
  readonly key: string;
  /** What a reader sees in a budget: the input's label, with the propagation's label. */
  readonly label: string;
  /** The quantity measured. */
  readonly quantity: Quantity;
  /** Canonical unit of the distribution. */
  readonly unit: string;
  /** The distribution in canonical units. */
  readonly distribution: ResolvedDistribution;
}

/** The sources a value depends on, their declared correlations and (Monte Carlo) their draws. */
export interface SourceSet {
  /** Sources by key. */
  readonly sources: ReadonlyMap<string, Source>;
  /** Declared correlation coefficients, keyed "a\u0000b" with a < b. */
  readonly correlations: ReadonlyMap<string, number>;
  /** Monte Carlo draws of each source, in trial order (empty for the GUM law). */
  readonly samples: ReadonlyMap<string, Float64Array>;
}

/** One row of an uncertainty budget: one elementary source. */
export interface BudgetRow {
  /** Key of the source. */
  readonly source: string;
  /** Label of the source (quantity label, with the propagation's label). */
  readonly label: string;
  /** Canonical unit of the source. */
  readonly unit: string;
  /** Distribution of the source. */
  readonly distribution: DistributionKind;
  /** Estimate xᵢ. */
  readonly estimate: number;
  /** Standard uncertainty u(xᵢ). */
  readonly standardUncertainty: number;
  /** Degrees of freedom νᵢ. */
  readonly dof: number;
  /** Sensitivity coefficient cᵢ = ∂y/∂xᵢ (through every step of a chain). */
  readonly sensitivity: number;
  /** Uncertainty contribution uᵢ(y) = cᵢ·u(xᵢ) (signed). */
  readonly contribution: number;
  /** Share of the combined variance, cᵢ²u²(xᵢ)/u²(y) (correlation terms excluded). */
  readonly share: number;
}

/** How a Monte Carlo value was drawn: what a later step needs to draw new sources trial by
 * trial alongside it. */
export interface TrialLayout {
  /** Seed of the run. */
  readonly seed: number;
  /** Number of trials M. */
  readonly trials: number;
  /** False for adaptive runs (their trials come in sequences) and runs without kept samples:
   * such values cannot feed a later step. */
  readonly chainable: boolean;
}

/**
 * An uncertain value: what the GUM law and Monte Carlo both return for every input and output of
 * a propagation, and what the next calculation accepts as an input. For the GUM law it carries
 * its sensitivities to the elementary sources (so correlations survive chaining); for Monte Carlo
 * its samples, trial-aligned with every other value of the same run.
 */
export interface UncertainValue {
  /** Brand used by `isUncertainValue`. */
  readonly kind: "sonorigor.uncertainValue";
  /** The input or output name in its calculation. */
  readonly name: string;
  /** The label a reader sees (the quantity's, or its role). */
  readonly label: string;
  /** The quantity. */
  readonly quantity: Quantity;
  /** Canonical unit. */
  readonly unit: string;
  /** Method that produced it. */
  readonly method: "gum" | "monteCarlo";
  /** Estimate: f(x) at the input estimates (GUM), or the average of the model values (Monte
   * Carlo, JCGM 101 eq. (16)). */
  readonly value: number;
  /** Standard uncertainty (JCGM 100 eq. (13); JCGM 101 eq. (17)). */
  readonly standardUncertainty: number;
  /** Coverage probability of `interval`. */
  readonly coverage: number;
  /** Coverage interval: y ± U (GUM) or the probabilistically symmetric interval (Monte Carlo,
   * unless the shortest was asked for). */
  readonly interval: Interval;
  /** Expanded uncertainty U = k·u (GUM); null for Monte Carlo, whose interval need not be
   * symmetric. */
  readonly expandedUncertainty: number | null;
  /** Coverage factor k (GUM); null for Monte Carlo. */
  readonly coverageFactor: number | null;
  /** Welch–Satterthwaite effective degrees of freedom (GUM); null where not defined (correlated
   * sources with finite degrees of freedom) and for Monte Carlo. */
  readonly effectiveDof: number | null;
  /** Budget: one row per elementary source (GUM); empty for Monte Carlo. */
  readonly budget: readonly BudgetRow[];
  /** Share of u² from declared correlations (GUM). */
  readonly correlationShare: number;
  /** Share of u² from second-order terms (GUM, when asked for). */
  readonly secondOrderShare: number;
  /** False when the curvature check found the first-order result inadequate (GUM). */
  readonly firstOrderAdequate: boolean;
  /** Sensitivities ∂value/∂source by source key (GUM linear part); empty for Monte Carlo. */
  readonly sensitivities: ReadonlyMap<string, number>;
  /** The sources the value depends on. */
  readonly sources: SourceSet;
  /** Model values in trial order (Monte Carlo, unless samples were not kept). */
  readonly samples: Float64Array | null;
  /** Shortest coverage interval (Monte Carlo, JCGM 101 §7.7.2). */
  readonly shortestInterval: Interval | null;
  /** How the trials were drawn (Monte Carlo). */
  readonly layout: TrialLayout | null;
}

/** Adaptive Monte Carlo bookkeeping (JCGM 101 §7.9). */
export interface AdaptiveSummary {
  /** Number of sequences h. */
  readonly sequences: number;
  /** Trials per sequence M = max(⌈100/(1 − p)⌉, 10⁴). */
  readonly trialsPerSequence: number;
  /** Significant digits asked for. */
  readonly significantDigits: number;
  /** Numerical tolerance δ per output (JCGM 101 §7.9.2). */
  readonly tolerance: Readonly<Record<string, number>>;
  /** True when every result stabilised before the trial limit. */
  readonly stabilized: boolean;
}

/** The result of one propagation: an uncertain value for every input and output. */
export interface Propagation<I extends string = string, O extends string = string> {
  /** Brand used by displays. */
  readonly kind: "sonorigor.propagation";
  /** The calculation propagated. */
  readonly calculation: Calculation<I, O>;
  /** Method used. */
  readonly method: "gum" | "monteCarlo";
  /** Coverage probability. */
  readonly coverage: number;
  /** Every input as an uncertain value (exact inputs have u = 0); a source created here can be
   * passed to a later step to keep its identity. */
  readonly inputs: { readonly [K in I]: UncertainValue };
  /** Every output. */
  readonly outputs: { readonly [K in O]: UncertainValue };
  /** Output names in order. */
  readonly outputNames: readonly O[];
  /** Covariance matrix of the outputs (GUM: from the linear parts; Monte Carlo: of the samples). */
  readonly covariance: readonly (readonly number[])[];
  /** Correlation matrix of the outputs. */
  readonly correlation: readonly (readonly number[])[];
  /** Warnings: first-order inadequacy, values outside typical ranges, draws outside valid
   * ranges, undefined degrees of freedom. */
  readonly warnings: readonly string[];
  /** Cautions of the calculation (with the clinical caution where it applies). */
  readonly cautions: readonly string[];
  /** Trials and seed (Monte Carlo). */
  readonly monteCarlo: {
    readonly trials: number;
    readonly seed: number;
    /** Which coverage interval the values report. */
    readonly interval: "symmetric" | "shortest";
    readonly adaptive: AdaptiveSummary | null;
    /** Trials excluded as physically inconsistent (NaN in the samples of every output). */
    readonly excludedTrials: number;
    /** What was done with inconsistent trials. */
    readonly inconsistentTrials: "exclude" | "refuse";
  } | null;
}

/** The verdict of `validateGumWithMonteCarlo` for one output. */
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
  /** True when the Monte Carlo interval ends were stabilised by the adaptive procedure (JCGM
   * 101 §7.9), so that the verdict does not depend on the seed; false for a fixed-size run. */
  readonly stable: boolean;
}

/** How far a Monte Carlo run has come. */
export interface MonteCarloProgress {
  /** Trials done so far. */
  readonly trialsDone: number;
  /** Trials the run will make at most (the trial limit of an adaptive run, which may stop
   * earlier). */
  readonly trialsPlanned: number;
}
