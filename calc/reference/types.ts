/**
 * The result shape of a Z-score, types only, so that its display reads it without importing any
 * computation.
 *
 * @module
 */
import type { Quantity } from "../core/types.ts";
import type { Interval, UncertainValue } from "../uncertainty/types.ts";
import type { ZScoreFormName, ZScoreModel } from "./zscore_models.ts";

/** A Z-score with its context and, when an input was uncertain, its uncertainty. */
export interface ZScoreResult {
  /** Brand for displays. */
  readonly kind: "sonorigor.zScore";
  /** The model used. */
  readonly model: ZScoreModel;
  /** The quantity measured (its label names the result). */
  readonly quantity: Quantity;
  /** The measurement in the model's unit (estimate). */
  readonly measurement: number;
  /** The BSA used, m² (estimate). */
  readonly bsaM2: number;
  /** Z: at the estimates (exact and GUM) or the average of the samples (Monte Carlo). */
  readonly zScore: number;
  /** Percentile, 100·Φ(Z). */
  readonly percentile: number;
  /** The expected measurement (Z = 0) for this BSA. */
  readonly expected: number;
  /** The measurements at Z = −2 and Z = +2 for this BSA. */
  readonly normalRange: Interval;
  /** True when the BSA lies outside the model's BSA range. */
  readonly bsaOutsideModelRange: boolean;
  /** Z as an uncertain value (u, interval, budget), or null when every input was exact. */
  readonly uncertainty: UncertainValue | null;
  /** Percentiles at the ends of Z's coverage interval, or null. */
  readonly percentileInterval: Interval | null;
  /** Probability that the true Z exceeds +2, from the distribution that gives the interval
   * (scaled t with ν_eff for the GUM law, the samples for Monte Carlo), or null. */
  readonly probabilityAbovePlus2: number | null;
  /** Probability that the true Z falls below −2, likewise, or null. */
  readonly probabilityBelowMinus2: number | null;
  /** Flags: inputs outside typical ranges, BSA outside the model's range, Monte Carlo notes. */
  readonly flags: readonly string[];
  /** Cautions (with the clinical caution and the coefficients' provenance). */
  readonly cautions: readonly string[];
}

/** Normal limits of a model at one BSA. */
export interface NormalLimits {
  /** BSA, m². */
  readonly bsaM2: number;
  /** Measurement at Z = 0. */
  readonly mean: number;
  /** Measurement at Z = −2. */
  readonly lower: number;
  /** Measurement at Z = +2. */
  readonly upper: number;
  /** True when the BSA lies outside the model's BSA range. */
  readonly bsaOutsideModelRange: boolean;
}

/** One row of `compareZScoreModels`. */
export interface ZScoreComparisonRow {
  /** Model identifier. */
  readonly modelId: string;
  /** Model form. */
  readonly form: ZScoreFormName;
  /** Source, "Authors year". */
  readonly source: string;
  /** Z, or null when the model could not be applied (see `error`). */
  readonly zScore: number | null;
  /** Percentile, or null. */
  readonly percentile: number | null;
  /** BSA used by this model (its own BSA formula), m², or null. */
  readonly bsaM2: number | null;
  /** Flags of this model (BSA outside range, ...). */
  readonly flags: readonly string[];
  /** Why the model could not be applied (unit mismatch, value out of domain), if so. */
  readonly error?: string;
}
