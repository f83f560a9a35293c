/**
 * Z-scores with uncertainty: how much of a borderline Z is measurement noise. Propagates the
 * measurement's uncertainty and the BSA's (or height's and weight's) through the one Z-score
 * calculation of a model, by the GUM law or by Monte Carlo (JCGM 100 / JCGM 101).
 *
 * @module
 */
import { inRange } from "../core/define.ts";
import { gum } from "../uncertainty/gum.ts";
import { monteCarlo } from "../uncertainty/montecarlo.ts";
import type { InputEstimate } from "../uncertainty/inputs.ts";
import {
  bsaOutsideModelFlag,
  percentileFromZ,
  zScoreCalculation,
  zScoreFromBodySizeCalculation,
  type ZScoreModel,
} from "./zscore.ts";

/** Uncertain inputs of a Z-score: with the BSA, or with height and weight. */
export type UncertainZScoreInputs =
  | { readonly measurement: InputEstimate; readonly bsaM2: InputEstimate }
  | {
    readonly measurement: InputEstimate;
    readonly heightCm: InputEstimate;
    readonly weightKg: InputEstimate;
  };

/** Options of {@linkcode zScoreWithUncertainty}. */
export interface ZScoreUncertaintyOptions {
  /** "gum" (law of propagation, fast) or "monteCarlo" (JCGM 101). @default "gum" */
  readonly method?: "gum" | "monteCarlo";
  /** Coverage probability. @default 0.95 */
  readonly coverage?: number;
  /** Monte Carlo trials. @default 200_000 */
  readonly trials?: number;
  /** Monte Carlo seed. @default 1 */
  readonly seed?: number;
}

/** A Z-score with its uncertainty. */
export interface ZScoreUncertaintyResult {
  /** The model. */
  readonly model: ZScoreModel;
  /** Method used. */
  readonly method: "gum" | "monteCarlo";
  /** Estimate of Z (GUM: Z at the estimates; Monte Carlo: mean of the samples). */
  readonly zScore: number;
  /** Standard uncertainty of Z. */
  readonly standardUncertainty: number;
  /** Coverage interval of Z (GUM: y ± U; Monte Carlo: probabilistically symmetric). */
  readonly interval: readonly [number, number];
  /** Coverage probability. */
  readonly coverage: number;
  /** Percentiles at the ends of the interval. */
  readonly percentileInterval: readonly [number, number];
  /** Probability that the true Z exceeds +2 (normal approximation for GUM, sample fraction for
   * Monte Carlo). */
  readonly probabilityAbovePlus2: number;
  /** Probability that the true Z falls below −2 (same method). */
  readonly probabilityBelowMinus2: number;
  /** Share of the variance of Z from each input (GUM only; empty for Monte Carlo). */
  readonly shares: Readonly<Record<string, number>>;
  /** BSA estimate, m². */
  readonly bsaM2: number;
  /** Flags (BSA outside the model's range, inputs outside typical ranges, draws outside domain). */
  readonly flags: readonly string[];
  /** Cautions. */
  readonly cautions: readonly string[];
}

function normalTail(z: number): number {
  return 1 - percentileFromZ(z) / 100;
}

/**
 * The Z-score of a measurement with its uncertainty from the measurement and the BSA (given
 * directly or from height and weight through the model's BSA formula).
 *
 * Formula: Z from {@linkcode zScoreCalculation}; GUM: u²(Z) = Σ (∂Z/∂xᵢ)²·u²(xᵢ) (JCGM 100:2008
 * eq. (10)); for PHN, ∂Z/∂X = BSA^−α / S and ∂Z/∂BSA = −α·X·BSA^(−α−1) / S.
 * Monte Carlo: JCGM 101:2008 §7.
 *
 * @param model The Z-score model.
 * @param inputs `{ measurement, bsaM2 }` or `{ measurement, heightCm, weightKg }`, each an
 * uncertain input (`normal(...)`, ...) or an exact value.
 * @param options Method, coverage, trials and seed.
 * @returns Z, its standard uncertainty, interval, tail probabilities and flags.
 * @throws {TypeError} For missing or mistyped inputs.
 * @throws {RangeError} For values or uncertainties outside their domains.
 *
 * @example
 * ```ts
 * import { normal, PHN_2017_MODELS, zScoreWithUncertainty } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Aortic annulus 1.76 ± 0.05 cm at BSA 1 m² (exact): Z = 2, u(Z) = 0.05 / 0.14 = 0.357
 * // (hand computation of JCGM 100 eq. (10) with ∂Z/∂X = 1/S)
 * const r = zScoreWithUncertainty(PHN_2017_MODELS.aorticAnnulus,
 *   { measurement: normal(1.76, 0.05), bsaM2: 1 });
 * assert.ok(Math.abs(r.zScore - 2) < 1e-9);
 * assert.ok(Math.abs(r.standardUncertainty - 0.05 / 0.14) < 1e-6);
 * assert.ok(Math.abs(r.probabilityAbovePlus2 - 0.5) < 1e-6);
 * ```
 */
export function zScoreWithUncertainty(
  model: ZScoreModel,
  inputs: UncertainZScoreInputs,
  options: ZScoreUncertaintyOptions = {},
): ZScoreUncertaintyResult {
  if (typeof inputs !== "object" || inputs === null) {
    throw new TypeError(
      `Z-score with uncertainty (${model.id}): expected an object of inputs, got ${String(inputs)}`,
    );
  }
  const method = options.method ?? "gum";
  if (method !== "gum" && method !== "monteCarlo") {
    throw new TypeError(
      `Z-score with uncertainty (${model.id}): expected 'method' "gum" or "monteCarlo", got ${
        JSON.stringify(method)
      }`,
    );
  }
  const coverage = options.coverage ?? 0.95;
  const byBsa = "bsaM2" in inputs;
  const calc = byBsa ? zScoreCalculation(model) : zScoreFromBodySizeCalculation(model);
  // GUM always runs: it gives the estimates (BSA), the budget and the first-order answer.
  const g = gum(calc as never, inputs as never, { coverage });
  const zOut = g.outputs.zScore as typeof g.outputs[string] & { value: number };
  const bsaM2 = byBsa
    ? zOut.budget.find((b) => b.input === "bsaM2")!.estimate
    : (g.outputs as Record<string, { value: number }>).bsaM2!.value;
  const flags = g.warnings.filter((w) => !w.startsWith("'bsaM2'"));
  if (!inRange(bsaM2, model.bsaRange)) flags.push(bsaOutsideModelFlag(model, bsaM2));
  let zScore: number;
  let u: number;
  let interval: readonly [number, number];
  let above: number;
  let below: number;
  let shares: Record<string, number> = {};
  if (method === "gum") {
    zScore = zOut.value;
    u = zOut.standardUncertainty;
    interval = zOut.interval;
    above = u > 0 ? normalTail((2 - zScore) / u) : (zScore > 2 ? 1 : 0);
    below = u > 0 ? 1 - normalTail((-2 - zScore) / u) : (zScore < -2 ? 1 : 0);
    shares = Object.fromEntries(zOut.budget.map((b) => [b.input, b.share]));
  } else {
    const m = monteCarlo(calc as never, inputs as never, {
      coverage,
      trials: options.trials ?? 200_000,
      seed: options.seed ?? 1,
    });
    const out = (m.outputs as Record<string, typeof m.outputs[string]>).zScore!;
    zScore = out.estimate;
    u = out.standardUncertainty;
    interval = out.symmetricInterval;
    let a = 0;
    let b = 0;
    for (let i = 0; i < out.samples.length; i++) {
      const s = out.samples[i]!;
      if (s > 2) a++;
      else if (s < -2) b++;
    }
    above = a / out.samples.length;
    below = b / out.samples.length;
    for (const w of m.warnings) if (!w.startsWith("'bsaM2'") && !flags.includes(w)) flags.push(w);
  }
  return {
    model,
    method,
    zScore,
    standardUncertainty: u,
    interval,
    coverage,
    percentileInterval: [percentileFromZ(interval[0]), percentileFromZ(interval[1])],
    probabilityAbovePlus2: above,
    probabilityBelowMinus2: below,
    shares,
    bsaM2,
    flags,
    cautions: g.cautions,
  };
}
