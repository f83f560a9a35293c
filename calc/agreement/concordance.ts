/**
 * Lin's concordance correlation coefficient.
 *
 * @module
 */
import {
  checkConfidence,
  checkPairs,
  displayed,
  type LabelOptions,
  mean,
  measuredOf,
  namesOf,
  sumSquares,
} from "./checks.ts";
import { normalQuantile } from "../stats/distributions.ts";
import { SUBJECT_SPREAD_CAUTION } from "./cautions.ts";
import { displayConcordance } from "../../display/agreement.ts";
import type { ConcordanceResult } from "./types.ts";

/** Options of {@linkcode concordanceCorrelation}. */
export interface ConcordanceOptions extends LabelOptions {
  /** Confidence level of the interval. @default 0.95 */
  readonly confidence?: number;
  /** Names of methods X and Y, for the display. @default ["X", "Y"] */
  readonly methodNames?: readonly [string, string];
}

/**
 * Lin's concordance correlation coefficient between paired readings, with a confidence interval
 * from the z-transform.
 *
 * Formulas (moments with divisor n): ρ_c = 2s_xy / (s²_x + s²_y + (x̄ − ȳ)²); ẑ = atanh ρ_c;
 * var ẑ = [ (1 − r²)ρ_c² / ((1 − ρ_c²) r²) + 2ρ_c³(1 − ρ_c)u² / (r(1 − ρ_c²)²)
 * − ρ_c⁴u⁴ / (2r²(1 − ρ_c²)²) ] / (n − 2); interval tanh(ẑ ∓ z_{1−α/2}·√var ẑ).
 *
 * Sources: Lin LI-K (1989) A concordance correlation coefficient to evaluate reproducibility.
 * Biometrics 45:255–268, doi:10.2307/2532051 (eqs. 2 and 9); Lin LI-K (2000) A note on the
 * concordance correlation coefficient. Biometrics 56:324–325 (correction of the variance).
 *
 * @param x Readings by method X.
 * @param y Readings by method Y on the same subjects.
 * @param options Confidence level (default 0.95).
 * @returns ρ_c with interval and its precision and accuracy parts.
 * @throws {TypeError} When inputs are not arrays of numbers of equal length.
 * @throws {RangeError} For fewer than 3 pairs, non-finite readings, a constant series (zero
 * variance) or perfect concordance (the z-transform is infinite).
 *
 * @example
 * ```ts
 * import { concordanceCorrelation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = concordanceCorrelation([1, 2, 3, 4, 5], [1.1, 2.3, 2.8, 4.2, 5.3]);
 * assert.ok(r.value > 0.95 && r.value <= r.pearson);
 * ```
 */
export function concordanceCorrelation(
  x: readonly number[],
  y: readonly number[],
  options: ConcordanceOptions = {},
): ConcordanceResult {
  const where = "Concordance correlation";
  const [a, b] = checkPairs(where, ["x", "y"], x, y, 3);
  const confidence = checkConfidence(where, options.confidence ?? 0.95);
  const quantity = measuredOf(where, options.quantity);
  const methodNames = namesOf(where, "methodNames", options.methodNames, ["X", "Y"]);
  const n = a.length;
  const mx = mean(a);
  const my = mean(b);
  const sxx = sumSquares(a, mx) / n;
  const syy = sumSquares(b, my) / n;
  if (!(sxx > 0)) {
    throw new RangeError(`${where}: expected 'x' values that vary, got variance ${sxx}`);
  }
  if (!(syy > 0)) {
    throw new RangeError(`${where}: expected 'y' values that vary, got variance ${syy}`);
  }
  let sxy = 0;
  for (let i = 0; i < n; i++) sxy += (a[i]! - mx) * (b[i]! - my);
  sxy /= n;
  const rc = (2 * sxy) / (sxx + syy + (mx - my) ** 2);
  const r = sxy / Math.sqrt(sxx * syy);
  if (!(Math.abs(rc) < 1)) {
    throw new RangeError(`${where}: expected imperfect concordance for the z-transform, got ${rc}`);
  }
  const u = (mx - my) / Math.sqrt(Math.sqrt(sxx * syy));
  const varZ = ((1 - r * r) * rc * rc / ((1 - rc * rc) * r * r) +
    (2 * rc ** 3 * (1 - rc) * u * u) / (r * (1 - rc * rc) ** 2) -
    (rc ** 4 * u ** 4) / (2 * r * r * (1 - rc * rc) ** 2)) / (n - 2);
  const z = Math.atanh(rc);
  const half = normalQuantile(0.5 + confidence / 2) * Math.sqrt(varZ);
  return displayed({
    n,
    value: rc,
    ci: { lower: Math.tanh(z - half), upper: Math.tanh(z + half) },
    confidence,
    pearson: r,
    biasCorrectionFactor: rc / r,
    locationShift: u,
    scaleShift: Math.sqrt(sxx / syy),
    quantity,
    methodNames,
    cautions: [SUBJECT_SPREAD_CAUTION],
  }, displayConcordance);
}
