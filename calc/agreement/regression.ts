/**
 * Method-comparison regression: Deming regression (errors in both methods) and Passing–Bablok
 * regression (non-parametric), each with confidence intervals.
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
  median,
  namesOf,
  shown,
  sumSquares,
} from "./checks.ts";
import { normalQuantile, tQuantile } from "../stats/distributions.ts";
import { ERROR_RATIO_CAUTION } from "./cautions.ts";
import { displayRegression } from "../../display/agreement.ts";
import type { DemingResult, PassingBablokResult } from "./types.ts";

/** Options of both regressions. */
export interface RegressionOptions extends LabelOptions {
  /** Confidence level of the intervals. @default 0.95 */
  readonly confidence?: number;
  /** Names of method X (comparison) and method Y (test), for the display.
   * @default ["X", "Y"] */
  readonly methodNames?: readonly [string, string];
}

/** Options of {@linkcode demingRegression}. */
export interface DemingOptions extends RegressionOptions {
  /** Ratio of the error variances, var(error of y) / var(error of x); 1 gives orthogonal
   * regression. Estimate it from replicate readings of each method. @default 1 */
  readonly errorVarianceRatio?: number;
}

/** Options of {@linkcode passingBablokRegression}. */
export interface PassingBablokOptions extends RegressionOptions {
  /** Largest number of pairs accepted: the method sorts all n(n − 1)/2 pairwise slopes, whose
   * memory grows with the square of n (10 000 pairs: 50 million slopes, 400 MB).
   * @default 10000 */
  readonly maxPairs?: number;
}

/** Centred sums of a paired sample: means and S_xx, S_yy, S_xy. */
interface Moments {
  readonly mx: number;
  readonly my: number;
  readonly sxx: number;
  readonly syy: number;
  readonly sxy: number;
}

function moments(x: readonly number[], y: readonly number[]): Moments {
  const mx = mean(x);
  const my = mean(y);
  let sxy = 0;
  for (let i = 0; i < x.length; i++) sxy += (x[i]! - mx) * (y[i]! - my);
  return { mx, my, sxx: sumSquares(x, mx), syy: sumSquares(y, my), sxy };
}

/** The moments without pair i (n ≥ 3): the centred sums downdated by n/(n − 1)·dx·dy (the
 * removal step of Welford's updating formulas), so the jackknife costs O(n), not O(n²). */
function without(m: Moments, n: number, xi: number, yi: number): Moments {
  const dx = xi - m.mx;
  const dy = yi - m.my;
  const w = n / (n - 1);
  return {
    mx: m.mx - dx / (n - 1),
    my: m.my - dy / (n - 1),
    sxx: m.sxx - w * dx * dx,
    syy: m.syy - w * dy * dy,
    sxy: m.sxy - w * dx * dy,
  };
}

/** Deming slope and intercept of the moments. */
function demingFit(m: Moments, lambda: number): [slope: number, intercept: number] {
  const d = m.syy - lambda * m.sxx;
  const slope = (d + Math.sqrt(d * d + 4 * lambda * m.sxy * m.sxy)) / (2 * m.sxy);
  return [slope, m.my - slope * m.mx];
}

/**
 * Deming regression of method Y on method X with a known ratio of error variances, with
 * jackknife confidence intervals.
 *
 * Formulas: with S_xx, S_yy, S_xy the centred sums and λ = var(ε_y)/var(ε_x),
 * slope b = [S_yy − λS_xx + √((S_yy − λS_xx)² + 4λS_xy²)] / (2S_xy), intercept a = ȳ − b·x̄.
 * Jackknife: leave-one-out estimates b₍ᵢ₎; SE = √((n − 1)/n · Σ(b₍ᵢ₎ − b̄₍·₎)²); interval
 * b ± t_{n−2, 1−α/2}·SE (same for a). Each leave-one-out fit downdates the centred sums,
 * S′_xy = S_xy − n/(n − 1)·(xᵢ − x̄)(yᵢ − ȳ), so the whole jackknife costs O(n).
 *
 * Sources: Deming WE (1943) Statistical Adjustment of Data, Wiley; Linnet K (1990) Estimation of
 * the linear relationship between the measurements of two methods with proportional errors.
 * Stat Med 9:1463–1473, doi:10.1002/sim.4780091210 (jackknife); Linnet K (1993) Evaluation of
 * regression procedures for methods comparison studies. Clin Chem 39:424–432.
 *
 * @param x Readings by the comparison (reference) method.
 * @param y Readings by the test method, same subjects and order.
 * @param options Error variance ratio (default 1), confidence level, labels for the display.
 * @returns Slope and intercept with jackknife intervals.
 * @throws {TypeError} When inputs are not arrays of numbers of equal length.
 * @throws {RangeError} For fewer than 3 pairs, non-finite readings, an error variance ratio
 * outside (0, ∞), or no linear association (S_xy = 0) in the data or a jackknife subsample.
 *
 * @example
 * ```ts
 * import { demingRegression } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = demingRegression([1, 2, 3, 4, 5, 6], [1.2, 1.9, 3.2, 3.9, 5.1, 6.0]);
 * assert.ok(Math.abs(r.slope - 1) < 0.1 && r.slopeCi.lower < r.slope);
 * ```
 */
export function demingRegression(
  x: readonly number[],
  y: readonly number[],
  options: DemingOptions = {},
): DemingResult {
  const where = "Deming regression";
  const [a, b] = checkPairs(where, ["x", "y"], x, y, 3);
  const lambda = options.errorVarianceRatio ?? 1;
  if (typeof lambda !== "number") {
    throw new TypeError(
      `${where}: expected 'errorVarianceRatio' as a number, got ${shown(lambda)}`,
    );
  }
  if (!(lambda > 0 && lambda < Infinity)) {
    throw new RangeError(`${where}: expected 'errorVarianceRatio' in (0, ∞), got ${lambda}`);
  }
  const confidence = checkConfidence(where, options.confidence ?? 0.95);
  const quantity = measuredOf(where, options.quantity);
  const methodNames = namesOf(where, "methodNames", options.methodNames, ["X", "Y"]);
  const check = (m: Moments, what: string) => {
    // a downdated covariance is exact only to rounding: below 1e-12 of √(S_xx S_yy) it is none
    if (!(Math.abs(m.sxy) > 1e-12 * Math.sqrt(m.sxx * m.syy))) {
      throw new RangeError(
        `${where}: expected a linear association between x and y${what}, got covariance ${m.sxy}`,
      );
    }
  };
  const all = moments(a, b);
  check(all, "");
  const [slope, intercept] = demingFit(all, lambda);
  const n = a.length;
  const slopes: number[] = [];
  const intercepts: number[] = [];
  for (let i = 0; i < n; i++) {
    const m = without(all, n, a[i]!, b[i]!);
    check(m, ` without pair ${i}`);
    const [s, c] = demingFit(m, lambda);
    slopes.push(s);
    intercepts.push(c);
  }
  const jackSe = (values: number[]) => Math.sqrt(((n - 1) / n) * sumSquares(values));
  const seSlope = jackSe(slopes);
  const seIntercept = jackSe(intercepts);
  const tq = tQuantile(0.5 + confidence / 2, n - 2);
  return displayed({
    method: "Deming",
    n,
    slope,
    slopeCi: { lower: slope - tq * seSlope, upper: slope + tq * seSlope },
    intercept,
    interceptCi: { lower: intercept - tq * seIntercept, upper: intercept + tq * seIntercept },
    confidence,
    errorVarianceRatio: lambda,
    slopeStandardError: seSlope,
    interceptStandardError: seIntercept,
    quantity,
    methodNames,
    cautions: [ERROR_RATIO_CAUTION],
  }, displayRegression<DemingResult>);
}

/**
 * Passing–Bablok regression of method Y on method X: a shifted median of pairwise slopes, robust
 * to outliers and to errors in both methods, with rank-based confidence intervals and the cusum
 * check of linearity.
 *
 * Formulas: Sᵢⱼ = (yⱼ − yᵢ)/(xⱼ − xᵢ) for i < j, leaving out 0/0 and Sᵢⱼ = −1 (xⱼ = xᵢ with
 * yⱼ ≠ yᵢ counts as ±∞); K = #{S < −1}; with the N slopes sorted, b = S₍(N+1)/2+K₎ (N odd) or the
 * mean of S₍N/2+K₎ and S₍N/2+1+K₎ (N even); a = median(yᵢ − b·xᵢ). Intervals:
 * C = z_{1−α/2}·√(n(n − 1)(2n + 5)/18), M₁ = round((N − C)/2), M₂ = N − M₁ + 1, slope interval
 * [S₍M₁+K₎, S₍M₂+K₎], intercept interval [median(y − b_U x), median(y − b_L x)]. Linearity:
 * points above the line score √(L/l) and below −√(l/L) (l, L their counts), ordered by
 * Dᵢ = (yᵢ + xᵢ/b − a)/√(1 + 1/b²); statistic max|cusum|/√(L + 1) against 1.36.
 *
 * Source: Passing H, Bablok W (1983) A new biometrical procedure for testing the equality of
 * measurements from two different analytical methods. J Clin Chem Clin Biochem 21:709–720,
 * doi:10.1515/cclm.1983.21.11.709.
 *
 * @param x Readings by the comparison method.
 * @param y Readings by the test method, same subjects and order.
 * Cost: O(n² log n) time and O(n²) memory (every pairwise slope is kept and sorted).
 *
 * @param options Confidence level (default 0.95), largest number of pairs, display labels.
 * @returns Slope and intercept with intervals, and the linearity check.
 * @throws {TypeError} When inputs are not arrays of numbers of equal length.
 * @throws {RangeError} For fewer than 3 pairs or more than `maxPairs`, non-finite readings, too
 * few usable slopes for an interval, or a slope ≤ 0 (the method assumes positively related
 * methods).
 *
 * @example
 * ```ts
 * import { passingBablokRegression } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = passingBablokRegression([1, 2, 3, 4, 5, 6, 7], [1.1, 2.1, 2.9, 4.2, 5.0, 6.1, 6.9]);
 * assert.ok(r.slopeCi.lower <= r.slope && r.slope <= r.slopeCi.upper);
 * ```
 */
export function passingBablokRegression(
  x: readonly number[],
  y: readonly number[],
  options: PassingBablokOptions = {},
): PassingBablokResult {
  const where = "Passing-Bablok regression";
  const [a, b] = checkPairs(where, ["x", "y"], x, y, 3);
  const confidence = checkConfidence(where, options.confidence ?? 0.95);
  const quantity = measuredOf(where, options.quantity);
  const methodNames = namesOf(where, "methodNames", options.methodNames, ["X", "Y"]);
  const maxPairs = options.maxPairs ?? 10000;
  const n = a.length;
  if (!(n <= maxPairs)) {
    throw new RangeError(
      `${where}: expected at most ${maxPairs} pairs ('maxPairs'; the method sorts all n(n − 1)/2 pairwise slopes), got ${n}`,
    );
  }
  const all = new Float64Array((n * (n - 1)) / 2);
  let N = 0;
  let K = 0;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const dx = a[j]! - a[i]!;
      const dy = b[j]! - b[i]!;
      if (dx === 0 && dy === 0) continue;
      const s = dx === 0 ? (dy > 0 ? Infinity : -Infinity) : dy / dx;
      if (s === -1) continue;
      all[N++] = s;
      if (s < -1) K++;
    }
  }
  const slopes = all.subarray(0, N).sort();
  const at = (i: number) => {
    const v = slopes[i - 1];
    if (v === undefined) {
      throw new RangeError(
        `${where}: expected enough usable pairwise slopes for the interval, got ${N}`,
      );
    }
    return v;
  };
  const slope = N % 2 === 1 ? at((N + 1) / 2 + K) : 0.5 * (at(N / 2 + K) + at(N / 2 + 1 + K));
  if (!(slope > 0 && Number.isFinite(slope))) {
    throw new RangeError(
      `${where}: expected positively related methods (finite slope > 0), got slope ${slope}`,
    );
  }
  const intercept = median(a.map((v, i) => b[i]! - slope * v));
  const c = normalQuantile(0.5 + confidence / 2) * Math.sqrt((n * (n - 1) * (2 * n + 5)) / 18);
  const m1 = Math.round((N - c) / 2);
  const m2 = N - m1 + 1;
  if (m1 < 1 || m2 + K > N) {
    throw new RangeError(`${where}: expected enough pairs for a ${confidence} interval, got ${n}`);
  }
  const slopeLow = at(m1 + K);
  const slopeHigh = at(m2 + K);
  const interceptLow = median(a.map((v, i) => b[i]! - slopeHigh * v));
  const interceptHigh = median(a.map((v, i) => b[i]! - slopeLow * v));
  // cusum linearity check
  const resid = a.map((v, i) => b[i]! - (intercept + slope * v));
  const above = resid.filter((r) => r > 0).length;
  const below = resid.filter((r) => r < 0).length;
  const scores = resid.map((r) =>
    r > 0
      ? Math.sqrt(below / Math.max(above, 1))
      : r < 0
      ? -Math.sqrt(above / Math.max(below, 1))
      : 0
  );
  const dist = a.map((v, i) =>
    (b[i]! + v / slope - intercept) / Math.sqrt(1 + 1 / (slope * slope))
  );
  const order = dist.map((_, i) => i).sort((p, q) => dist[p]! - dist[q]!);
  let cusum = 0;
  let maxAbs = 0;
  for (const i of order) {
    cusum += scores[i]!;
    maxAbs = Math.max(maxAbs, Math.abs(cusum));
  }
  const statistic = maxAbs / Math.sqrt(below + 1);
  return displayed({
    method: "Passing–Bablok",
    n,
    slope,
    slopeCi: { lower: slopeLow, upper: slopeHigh },
    intercept,
    interceptCi: { lower: interceptLow, upper: interceptHigh },
    confidence,
    slopesUsed: N,
    linearity: { statistic, criticalValue: 1.36, nonLinear: statistic > 1.36 },
    quantity,
    methodNames,
    cautions: [],
  }, displayRegression<PassingBablokResult>);
}
