/**
 * Method-comparison regression: Deming regression (errors in both methods, one ratio of error
 * variances or each reading's own SD), York's regression (each point's own, possibly correlated,
 * uncertainties in x and y) and Passing–Bablok regression (non-parametric), each with confidence
 * intervals.
 *
 * @module
 */
import {
  checkConfidence,
  checkNumbers,
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
import { chiSquareCdf, normalQuantile, tQuantile } from "../stats/distributions.ts";
import { issueError } from "../core/issues.ts";
import { ERROR_RATIO_CAUTION } from "./cautions.ts";
import { displayRegression } from "../../display/agreement.ts";
import type {
  DemingResult,
  GeneralDemingResult,
  PassingBablokResult,
  YorkResult,
} from "./types.ts";

/**
 * The caution of the regressions that weight each reading by its stated SD (general Deming and
 * York): the line and, for York, its standard errors are only as good as those SDs.
 *
 * @example
 * ```ts
 * import { generalDemingRegression, PER_POINT_SD_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = generalDemingRegression([1, 2, 3, 4], [1.1, 2.2, 2.8, 4.1], { sdX: 0.1, sdY: 0.1 });
 * assert.deepEqual(r.cautions, [PER_POINT_SD_CAUTION]);
 * ```
 */
export const PER_POINT_SD_CAUTION =
  "Each reading is weighted by its stated SD (and, for York's method, the correlation of its errors); SDs estimated from a few replicates make the line and York's standard errors less certain than shown";

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

/** Options of {@linkcode generalDemingRegression}. */
export interface GeneralDemingOptions extends RegressionOptions {
  /** Standard deviation of each reading of x, in its unit: one number for all readings or one per
   * reading (≥ 0; a reading may be exact in x if its y has an SD). */
  readonly sdX: number | readonly number[];
  /** Standard deviation of each reading of y, as `sdX`. */
  readonly sdY: number | readonly number[];
  /** Relative change of the slope at which the iteration stops. @default 1e-15 */
  readonly tolerance?: number;
  /** Largest number of iterations of the slope. @default 100 */
  readonly maxIterations?: number;
}

/** Options of {@linkcode yorkRegression}. */
export interface YorkOptions extends GeneralDemingOptions {
  /** Correlation of the errors of x and y of each point: one number for all points or one per
   * point, in (−1, 1). @default 0 */
  readonly correlation?: number | readonly number[];
}

/** Per-point variances and covariances of the errors, and the iteration settings. */
interface YorkData {
  readonly x: readonly number[];
  readonly y: readonly number[];
  /** σ²(xᵢ). */
  readonly vx: readonly number[];
  /** σ²(yᵢ). */
  readonly vy: readonly number[];
  /** rᵢ·σ(xᵢ)·σ(yᵢ). */
  readonly cxy: readonly number[];
  readonly tolerance: number;
  readonly maxIterations: number;
}

/** A York fit: the line, the weights and the least-squares-adjusted abscissae. */
interface YorkFit {
  readonly slope: number;
  readonly intercept: number;
  /** Wᵢ at the fitted slope. */
  readonly weights: readonly number[];
  /** x̄ + βᵢ: the adjusted abscissae (York et al. 2004, step 7). */
  readonly adjusted: readonly number[];
  /** S = Σ Wᵢ (yᵢ − a − b·xᵢ)². */
  readonly chiSquare: number;
  readonly iterations: number;
}

function rangeError(where: string, field: string, expected: string, received: string): never {
  throw issueError([{ kind: "range", severity: "error", where, field, expected, received }]);
}

/** One value per point: a number repeated, or an array of n finite numbers, each inside
 * `[min, max]` (or the open interval when `open`). */
function perPoint(
  where: string,
  name: string,
  value: unknown,
  n: number,
  range: { readonly min: number; readonly max: number; readonly open: boolean },
): number[] {
  const text = range.open ? `in (${range.min}, ${range.max})` : `>= ${range.min}`;
  const values = typeof value === "number"
    ? new Array<number>(n).fill(value)
    : [...checkNumbers(where, name, value, 1)];
  if (values.length !== n) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where,
      field: name,
      expected: `as a number or ${n} numbers, one per pair`,
      received: String(values.length),
    }]);
  }
  values.forEach((v, i) => {
    const ok = range.open ? v > range.min && v < range.max : v >= range.min && v < Infinity;
    const field = typeof value === "number" ? name : `${name}[${i}]`;
    if (!ok) rangeError(where, field, text, String(v));
  });
  return values;
}

function yorkData(
  where: string,
  x: readonly number[],
  y: readonly number[],
  options: YorkOptions,
): YorkData {
  if (typeof options !== "object" || options === null) {
    throw issueError([{
      kind: "missing",
      severity: "error",
      where,
      field: "sdX",
      expected: "the standard deviations 'sdX' and 'sdY' of the readings",
      received: "nothing",
    }]);
  }
  const n = x.length;
  const nonNegative = { min: 0, max: Infinity, open: false };
  for (const name of ["sdX", "sdY"] as const) {
    if (options[name] === undefined) {
      throw issueError([{
        kind: "missing",
        severity: "error",
        where,
        field: name,
        expected: "a standard deviation >= 0 per reading (a number or an array)",
        received: "nothing",
      }]);
    }
  }
  const sx = perPoint(where, "sdX", options.sdX, n, nonNegative);
  const sy = perPoint(where, "sdY", options.sdY, n, nonNegative);
  const r = perPoint(where, "correlation", options.correlation ?? 0, n, {
    min: -1,
    max: 1,
    open: true,
  });
  sx.forEach((s, i) => {
    if (s === 0 && sy[i] === 0) {
      rangeError(where, `sdY[${i}]`, "> 0 where sdX is 0 (a point with no uncertainty)", "0");
    }
  });
  const tolerance = options.tolerance ?? 1e-15;
  if (!(tolerance > 0 && tolerance < 1)) {
    rangeError(where, "tolerance", "in (0, 1)", String(tolerance));
  }
  const maxIterations = options.maxIterations ?? 100;
  if (!(Number.isInteger(maxIterations) && maxIterations >= 1)) {
    rangeError(where, "maxIterations", "a whole number >= 1", String(maxIterations));
  }
  return {
    x,
    y,
    vx: sx.map((s) => s * s),
    vy: sy.map((s) => s * s),
    cxy: r.map((c, i) => c * sx[i]! * sy[i]!),
    tolerance,
    maxIterations,
  };
}

/** One pass of York's iteration at slope b (York et al. 2004, §III steps 2–4): the weights
 * Wᵢ = 1/(σ²(yᵢ) + b²σ²(xᵢ) − 2b·rᵢσ(xᵢ)σ(yᵢ)), the weighted means, βᵢ = Wᵢ[Uᵢσ²(yᵢ) +
 * b·Vᵢσ²(xᵢ) − (b·Uᵢ + Vᵢ)·rᵢσ(xᵢ)σ(yᵢ)] and the next slope ΣWᵢβᵢVᵢ / ΣWᵢβᵢUᵢ. */
function yorkStep(where: string, d: YorkData, idx: readonly number[], b: number) {
  const weights = idx.map((i) => 1 / (d.vy[i]! + b * b * d.vx[i]! - 2 * b * d.cxy[i]!));
  const infinite = weights.findIndex((w) => !(w > 0 && w < Infinity));
  if (infinite >= 0) {
    // only a point exact in y (σ(y) = 0) on a horizontal line (b = 0) has no finite weight
    rangeError(
      where,
      `sdY[${idx[infinite]}]`,
      "> 0 when the slope reaches 0 (a point exact in y would fix the line)",
      "0",
    );
  }
  let sw = 0;
  let swx = 0;
  let swy = 0;
  weights.forEach((w, k) => {
    sw += w;
    swx += w * d.x[idx[k]!]!;
    swy += w * d.y[idx[k]!]!;
  });
  const xBar = swx / sw;
  const yBar = swy / sw;
  let num = 0;
  let den = 0;
  const beta = idx.map((i, k) => {
    const u = d.x[i]! - xBar;
    const v = d.y[i]! - yBar;
    const w = weights[k]!;
    const bk = w * (u * d.vy[i]! + b * v * d.vx[i]! - (b * u + v) * d.cxy[i]!);
    num += w * bk * v;
    den += w * bk * u;
    return bk;
  });
  return { weights, xBar, yBar, beta, next: num / den };
}

/** York's iteration (York et al. 2004, §III steps 1–7), leaving out point `skip` (jackknife). */
function yorkFit(where: string, d: YorkData, skip = -1): YorkFit {
  const idx = d.x.map((_, i) => i).filter((i) => i !== skip);
  // step 1: the ordinary least-squares slope starts the iteration
  const m = moments(idx.map((i) => d.x[i]!), idx.map((i) => d.y[i]!));
  if (!(m.sxx > 0)) {
    rangeError(where, "x", "readings that are not all equal", `all ${d.x[idx[0]!]}`);
  }
  let b = m.sxy / m.sxx;
  for (let iteration = 1; iteration <= d.maxIterations; iteration++) {
    const next = yorkStep(where, d, idx, b).next;
    if (!Number.isFinite(next)) {
      rangeError(where, "x", "readings with a linear trend", `slope ${next}`);
    }
    const settled = Math.abs(next - b) <= d.tolerance * Math.abs(next);
    b = next;
    if (settled) {
      // steps 6–7 at the settled slope: intercept, adjusted abscissae x̄ + βᵢ, S
      const { weights, xBar, yBar, beta } = yorkStep(where, d, idx, b);
      const a = yBar - b * xBar;
      let s = 0;
      idx.forEach((i, k) => {
        s += weights[k]! * (d.y[i]! - a - b * d.x[i]!) ** 2;
      });
      return {
        slope: b,
        intercept: a,
        weights,
        adjusted: beta.map((bk) => xBar + bk),
        chiSquare: s,
        iterations: iteration,
      };
    }
  }
  return rangeError(
    where,
    "maxIterations",
    `enough iterations for the slope to settle within a relative ${d.tolerance}`,
    String(d.maxIterations),
  );
}

/** York et al. (2004) standard errors at the adjusted points: σ²_b = 1/Σ Wᵢuᵢ²,
 * σ²_a = 1/ΣWᵢ + x̄²σ²_b, cov(a, b) = −x̄σ²_b, with uᵢ = xᵢ′ − x̄ and x̄ = ΣWᵢxᵢ′/ΣWᵢ. */
function yorkErrors(fit: YorkFit): { slope: number; intercept: number; covariance: number } {
  let sw = 0;
  let swx = 0;
  fit.weights.forEach((w, k) => {
    sw += w;
    swx += w * fit.adjusted[k]!;
  });
  const xBar = swx / sw;
  let swu = 0;
  fit.weights.forEach((w, k) => {
    swu += w * (fit.adjusted[k]! - xBar) ** 2;
  });
  const varSlope = 1 / swu;
  return {
    slope: Math.sqrt(varSlope),
    intercept: Math.sqrt(1 / sw + xBar * xBar * varSlope),
    covariance: -xBar * varSlope,
  };
}

/** The checked inputs, settings and labels of a regression on per-point SDs, and York's fit. */
function weightedFit(
  where: string,
  x: readonly number[],
  y: readonly number[],
  options: YorkOptions,
) {
  const [a, b] = checkPairs(where, ["x", "y"], x, y, 3);
  const data = yorkData(where, a, b, options);
  return {
    data,
    n: a.length,
    confidence: checkConfidence(where, options.confidence ?? 0.95),
    labels: {
      quantity: measuredOf(where, options.quantity),
      methodNames: namesOf(where, "methodNames", options.methodNames, ["X", "Y"]),
    },
    fit: yorkFit(where, data),
  };
}

/**
 * Deming regression of method Y on method X when each reading has its own standard deviation
 * (general Deming regression): the line minimising the sum of squared distances of each point to
 * the line, x and y each scaled by that reading's SD, with jackknife confidence intervals. With
 * the same SDs for every reading it is {@linkcode demingRegression} with λ = sdY²/sdX²; with SDs
 * proportional to the level (sdX = CV·x) it is the weighted Deming regression of method
 * comparison.
 *
 * Formulas: minimise Σ[(xᵢ − x̂ᵢ)²/σ²(xᵢ) + (yᵢ − a − b·x̂ᵢ)²/σ²(yᵢ)]; eliminating the true values
 * x̂ᵢ leaves S(b) = Σ Wᵢ(yᵢ − a − b·xᵢ)² with Wᵢ = 1/(σ²(yᵢ) + b²σ²(xᵢ)), solved by York's
 * iteration (York's method with uncorrelated errors; see {@linkcode yorkRegression}).
 * Jackknife: leave-one-out slopes b₍ᵢ₎, SE = √((n − 1)/n · Σ(b₍ᵢ₎ − b̄₍·₎)²), interval
 * b ± t_{n−2, 1−α/2}·SE (same for a).
 *
 * Sources: Martin RF (2000) General Deming regression for estimating systematic bias and its
 * confidence interval in method-comparison studies. Clin Chem 46:100–104; York D (1966) Least-
 * squares fitting of a straight line. Can J Phys 44:1079–1086, doi:10.1139/p66-090; Linnet K
 * (1990) Stat Med 9:1463–1473, doi:10.1002/sim.4780091210 (jackknife).
 *
 * Cost: O(n²·k) for the jackknife (k iterations per fit, typically under 20).
 *
 * @param x Readings by the comparison method.
 * @param y Readings by the test method, same subjects and order.
 * @param options SDs of the readings (`sdX`, `sdY`), confidence level, iteration settings,
 * display labels.
 * @returns Slope and intercept with jackknife intervals, the weighted sum of squares S and S/(n − 2).
 * @throws {TypeError} When inputs are not arrays of numbers of equal length, or an SD array has
 * the wrong length.
 * @throws {RangeError} For fewer than 3 pairs, non-finite readings, a negative SD, a point with no
 * uncertainty at all, all x equal, or a slope that does not settle.
 *
 * @example Equal SDs give the ordinary Deming line with λ = sdY²/sdX²
 * ```ts
 * import { demingRegression, generalDemingRegression } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = [1, 2, 3, 4, 5, 6], y = [1.2, 1.9, 3.2, 3.9, 5.1, 6.0];
 * const general = generalDemingRegression(x, y, { sdX: 0.2, sdY: 0.4 });
 * const deming = demingRegression(x, y, { errorVarianceRatio: 4 });
 * assert.ok(Math.abs(general.slope - deming.slope) < 1e-12);
 * assert.ok(Math.abs(general.slopeStandardError - deming.slopeStandardError) < 1e-9);
 * ```
 */
export function generalDemingRegression(
  x: readonly number[],
  y: readonly number[],
  options: GeneralDemingOptions,
): GeneralDemingResult {
  const where = "General Deming regression";
  const { data, n, confidence, labels, fit } = weightedFit(where, x, y, {
    ...options,
    correlation: 0,
  });
  const slopes: number[] = [];
  const intercepts: number[] = [];
  for (let i = 0; i < n; i++) {
    const f = yorkFit(`${where} without pair ${i}`, data, i);
    slopes.push(f.slope);
    intercepts.push(f.intercept);
  }
  const jackSe = (values: number[]) => Math.sqrt(((n - 1) / n) * sumSquares(values));
  const seSlope = jackSe(slopes);
  const seIntercept = jackSe(intercepts);
  const tq = tQuantile(0.5 + confidence / 2, n - 2);
  return displayed({
    method: "General Deming",
    n,
    slope: fit.slope,
    slopeCi: { lower: fit.slope - tq * seSlope, upper: fit.slope + tq * seSlope },
    intercept: fit.intercept,
    interceptCi: {
      lower: fit.intercept - tq * seIntercept,
      upper: fit.intercept + tq * seIntercept,
    },
    confidence,
    slopeStandardError: seSlope,
    interceptStandardError: seIntercept,
    chiSquare: fit.chiSquare,
    mswd: fit.chiSquare / (n - 2),
    ...labels,
    cautions: [PER_POINT_SD_CAUTION],
  }, displayRegression<GeneralDemingResult>);
}

/**
 * York's best straight line through points that each have their own uncertainties in x and y,
 * possibly correlated: the least-squares (and maximum-likelihood, for normal errors) line, with
 * the standard errors of slope and intercept from the stated uncertainties, the goodness of fit
 * (S, MSWD and its χ² probability) and confidence intervals. Ordinary, weighted, orthogonal and
 * Deming regressions are special cases (York et al. 2004, §IV).
 *
 * Formulas (York et al. 2004, §III): Wᵢ = 1/(σ²(yᵢ) + b²σ²(xᵢ) − 2b·rᵢσ(xᵢ)σ(yᵢ));
 * x̄ = ΣWᵢxᵢ/ΣWᵢ, ȳ likewise, Uᵢ = xᵢ − x̄, Vᵢ = yᵢ − ȳ;
 * βᵢ = Wᵢ[Uᵢσ²(yᵢ) + b·Vᵢσ²(xᵢ) − (b·Uᵢ + Vᵢ)·rᵢσ(xᵢ)σ(yᵢ)];
 * b = ΣWᵢβᵢVᵢ / ΣWᵢβᵢUᵢ, iterated from the least-squares slope until it settles; a = ȳ − b·x̄.
 * Adjusted points xᵢ′ = x̄ + βᵢ, uᵢ = xᵢ′ − x̄′ (x̄′ = ΣWᵢxᵢ′/ΣWᵢ): σ²_b = 1/ΣWᵢuᵢ²,
 * σ²_a = 1/ΣWᵢ + x̄′²σ²_b, cov(a, b) = −x̄′σ²_b. Fit: S = ΣWᵢ(yᵢ − a − b·xᵢ)², χ² on n − 2
 * degrees of freedom, MSWD = S/(n − 2). Intervals: b ± z_{1−α/2}·σ_b when MSWD ≤ 1; when the
 * scatter exceeds the stated uncertainties (MSWD > 1), b ± t_{n−2, 1−α/2}·√MSWD·σ_b, as in
 * weighted least squares with the scale estimated from the residuals (same for a).
 *
 * Sources: York D (1966) Can J Phys 44:1079–1086, doi:10.1139/p66-090; York D (1968) Least
 * squares fitting of a straight line with correlated errors. Earth Planet Sci Lett 5:320–324,
 * doi:10.1016/S0012-821X(68)80059-7; York D, Evensen NM, López Martínez M, De Basabe Delgado J
 * (2004) Unified equations for the slope, intercept, and standard errors of the best straight
 * line. Am J Phys 72:367–375, doi:10.1119/1.1632486.
 *
 * @param x Readings of x (e.g. the comparison method).
 * @param y Readings of y, same points and order.
 * @param options SDs of x and y (`sdX`, `sdY`) and the correlation of their errors, confidence
 * level, iteration settings, display labels.
 * @returns Slope and intercept with standard errors, covariance, intervals and goodness of fit.
 * @throws {TypeError} When inputs are not arrays of numbers of equal length, or a per-point array
 * has the wrong length.
 * @throws {RangeError} For fewer than 3 points, non-finite readings, a negative SD, a point with no
 * uncertainty at all, a correlation outside (−1, 1), all x equal, or a slope that does not settle.
 *
 * @example Pearson's data with York's weights (York 1966): slope −0.4805, intercept 5.4799
 * ```ts
 * import { yorkRegression } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = [0, 0.9, 1.8, 2.6, 3.3, 4.4, 5.2, 6.1, 6.5, 7.4];
 * const y = [5.9, 5.4, 4.4, 4.6, 3.5, 3.7, 2.8, 2.8, 2.4, 1.5];
 * const wx = [1000, 1000, 500, 800, 200, 80, 60, 20, 1.8, 1];
 * const wy = [1, 1.8, 4, 8, 20, 20, 70, 70, 100, 500];
 * const r = yorkRegression(x, y, { sdX: wx.map((w) => 1 / Math.sqrt(w)), sdY: wy.map((w) => 1 / Math.sqrt(w)) });
 * // York et al. 2004: b = −0.4805 ± 0.0580, a = 5.4799 ± 0.2950
 * assert.equal(r.slope.toFixed(4), "-0.4805");
 * assert.equal(r.intercept.toFixed(4), "5.4799");
 * assert.equal(r.slopeStandardError.toFixed(4), "0.0580");
 * ```
 */
export function yorkRegression(
  x: readonly number[],
  y: readonly number[],
  options: YorkOptions,
): YorkResult {
  const { n, confidence, labels, fit } = weightedFit("York regression", x, y, options);
  const se = yorkErrors(fit);
  const dof = n - 2;
  const mswd = fit.chiSquare / dof;
  const scaled = mswd > 1;
  const k = scaled
    ? tQuantile(0.5 + confidence / 2, dof) * Math.sqrt(mswd)
    : normalQuantile(0.5 + confidence / 2);
  return displayed({
    method: "York",
    n,
    slope: fit.slope,
    slopeCi: { lower: fit.slope - k * se.slope, upper: fit.slope + k * se.slope },
    intercept: fit.intercept,
    interceptCi: {
      lower: fit.intercept - k * se.intercept,
      upper: fit.intercept + k * se.intercept,
    },
    confidence,
    slopeStandardError: se.slope,
    interceptStandardError: se.intercept,
    slopeInterceptCovariance: se.covariance,
    chiSquare: fit.chiSquare,
    degreesOfFreedom: dof,
    mswd,
    fitPValue: 1 - chiSquareCdf(fit.chiSquare, dof),
    intervalBasis: scaled ? "scaled by √MSWD" : "stated uncertainties",
    iterations: fit.iterations,
    ...labels,
    cautions: [PER_POINT_SD_CAUTION],
  }, displayRegression<YorkResult>);
}
