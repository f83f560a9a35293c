/**
 * Probability distributions used by the agreement statistics. Central t, F, χ² and normal come
 * from the pinned @stdlib packages; the non-central t (needed for exact confidence limits of
 * limits of agreement) is built on the stdlib F distribution function, which supplies the
 * regularized incomplete beta function.
 *
 * @module
 */
import tQuantileStdlib from "@stdlib/stats-base-dists-t-quantile";
import tCdfStdlib from "@stdlib/stats-base-dists-t-cdf";
import fQuantileStdlib from "@stdlib/stats-base-dists-f-quantile";
import fCdfStdlib from "@stdlib/stats-base-dists-f-cdf";
import chisquareQuantileStdlib from "@stdlib/stats-base-dists-chisquare-quantile";
import normalQuantileStdlib from "@stdlib/stats-base-dists-normal-quantile";
import normalCdfStdlib from "@stdlib/stats-base-dists-normal-cdf";
import { math } from "../core/units.ts";

/** ln Γ(x) from the project's mathjs instance. */
const logGamma = (x: number): number => math.lgamma(x) as number;

function checkProbability(where: string, p: number): void {
  if (!(p >= 0 && p <= 1)) throw new RangeError(`${where}: expected 'p' in [0, 1], got ${p}`);
}

function checkDegrees(where: string, name: string, v: number): void {
  if (!(v > 0)) throw new RangeError(`${where}: expected '${name}' in (0, ∞), got ${v}`);
}

/**
 * Quantile of the standard normal distribution (stdlib).
 *
 * @param p Probability in [0, 1].
 * @returns z with Φ(z) = p.
 * @throws {RangeError} When p is outside [0, 1] or NaN.
 *
 * @example
 * ```ts
 * import { normalQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Math.abs(normalQuantile(0.975) - 1.959964) < 1e-6);
 * ```
 */
export function normalQuantile(p: number): number {
  checkProbability("Normal quantile", p);
  return normalQuantileStdlib(p, 0, 1);
}

/**
 * Distribution function Φ of the standard normal distribution (stdlib).
 *
 * @param z Standard normal deviate.
 * @returns Φ(z).
 * @throws {RangeError} When z is NaN.
 *
 * @example
 * ```ts
 * import { normalCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(normalCdf(0), 0.5);
 * ```
 */
export function normalCdf(z: number): number {
  if (Number.isNaN(z)) {
    throw new RangeError(`Normal distribution function: expected a number 'z', got ${z}`);
  }
  return normalCdfStdlib(z, 0, 1);
}

/**
 * Quantile of Student's t distribution (stdlib).
 *
 * @param p Probability in [0, 1].
 * @param df Degrees of freedom, > 0.
 * @returns t with P(T ≤ t) = p.
 * @throws {RangeError} For p outside [0, 1] or df ≤ 0.
 *
 * @example
 * ```ts
 * import { tQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 2.120 for 16 degrees of freedom: any t table, e.g. Fisher & Yates Table III
 * assert.ok(Math.abs(tQuantile(0.975, 16) - 2.1199) < 1e-4);
 * ```
 */
export function tQuantile(p: number, df: number): number {
  checkProbability("Student t quantile", p);
  checkDegrees("Student t quantile", "df", df);
  return tQuantileStdlib(p, df);
}

/**
 * Distribution function of Student's t distribution (stdlib).
 *
 * @param t Value.
 * @param df Degrees of freedom, > 0.
 * @returns P(T ≤ t).
 * @throws {RangeError} For df ≤ 0 or NaN t.
 *
 * @example
 * ```ts
 * import { tCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(tCdf(0, 5), 0.5);
 * ```
 */
export function tCdf(t: number, df: number): number {
  if (Number.isNaN(t)) {
    throw new RangeError(`Student t distribution function: expected a number 't', got ${t}`);
  }
  checkDegrees("Student t distribution function", "df", df);
  return tCdfStdlib(t, df);
}

/**
 * Quantile of the F distribution (stdlib).
 *
 * @param p Probability in [0, 1].
 * @param df1 Numerator degrees of freedom, > 0.
 * @param df2 Denominator degrees of freedom, > 0.
 * @returns F with P(X ≤ F) = p.
 * @throws {RangeError} For p outside [0, 1] or non-positive degrees of freedom.
 *
 * @example
 * ```ts
 * import { fQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // F(0.95; 5, 10) = 3.33 in any F table
 * assert.ok(Math.abs(fQuantile(0.95, 5, 10) - 3.3258) < 1e-4);
 * ```
 */
export function fQuantile(p: number, df1: number, df2: number): number {
  checkProbability("F quantile", p);
  checkDegrees("F quantile", "df1", df1);
  checkDegrees("F quantile", "df2", df2);
  return fQuantileStdlib(p, df1, df2);
}

/**
 * Quantile of the χ² distribution (stdlib).
 *
 * @param p Probability in [0, 1].
 * @param df Degrees of freedom, > 0.
 * @returns x with P(X ≤ x) = p.
 * @throws {RangeError} For p outside [0, 1] or df ≤ 0.
 *
 * @example
 * ```ts
 * import { chiSquareQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 3.841 for 1 degree of freedom in any χ² table
 * assert.ok(Math.abs(chiSquareQuantile(0.95, 1) - 3.8415) < 1e-4);
 * ```
 */
export function chiSquareQuantile(p: number, df: number): number {
  checkProbability("Chi-square quantile", p);
  checkDegrees("Chi-square quantile", "df", df);
  return chisquareQuantileStdlib(p, df);
}

/** Regularized incomplete beta I_x(a, b) through the stdlib F distribution function:
 * F_{2a,2b}(f) = I_{x}(a, b) with f = b·x / (a·(1 − x)). */
function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  return fCdfStdlib((b * x) / (a * (1 - x)), 2 * a, 2 * b);
}

/** Series for P(T ≤ t) with t ≥ 0 (Lenth 1989, AS 243, written with Poisson weights in log
 * space and summed outward from the largest weight so that large δ does not underflow). */
function nonCentralTSeries(t: number, df: number, delta: number): number {
  const x = (t * t) / (t * t + df);
  const lambda = delta * delta / 2;
  const b = df / 2;
  const logLambda = lambda > 0 ? Math.log(lambda) : -Infinity;
  // log weights: p_j = e^{-λ} λ^j / j!; q_j = δ e^{-λ} λ^j / (√2 Γ(j + 3/2))
  const logP = (j: number) => -lambda + j * logLambda - logGamma(j + 1);
  const logQ = (j: number) => -lambda + j * logLambda - 0.5 * Math.LN2 - logGamma(j + 1.5);
  const term = (j: number) => {
    const p = lambda > 0 || j === 0 ? Math.exp(logP(j)) : 0;
    const q = delta === 0 ? 0 : Math.sign(delta) * Math.abs(delta) *
      (lambda > 0 || j === 0 ? Math.exp(logQ(j)) : 0);
    const tp = p > 1e-300 ? p * incompleteBeta(x, j + 0.5, b) : 0;
    const tq = Math.abs(q) > 1e-300 ? q * incompleteBeta(x, j + 1, b) : 0;
    return { value: tp + tq, weight: p + Math.abs(q) };
  };
  if (x === 0) return normalCdf(-delta);
  const mode = Math.floor(lambda);
  let sum = 0;
  for (let j = mode; j >= 0; j--) {
    const { value, weight } = term(j);
    sum += value;
    if (j < mode && weight < 1e-17) break;
  }
  for (let j = mode + 1; j < mode + 100000; j++) {
    const { value, weight } = term(j);
    sum += value;
    if (weight < 1e-17) break;
  }
  return normalCdf(-delta) + 0.5 * sum;
}

/**
 * Distribution function of the non-central t distribution.
 *
 * Series: P(T ≤ t) = Φ(−δ) + ½ Σ_j [p_j I_x(j + ½, ν/2) + q_j I_x(j + 1, ν/2)], x = t²/(t² + ν),
 * p_j = e^{−δ²/2}(δ²/2)^j/j!, q_j = δ e^{−δ²/2}(δ²/2)^j/(√2 Γ(j + 3/2)), for t ≥ 0; for t < 0,
 * P(T ≤ t; δ) = 1 − P(T ≤ −t; −δ). The regularized incomplete beta I comes from the stdlib F
 * distribution function. Terms are summed outward from the largest Poisson weight until the
 * weights fall below 1e−17, so the series also converges for large δ.
 *
 * Source: Lenth RV (1989) Algorithm AS 243: cumulative distribution function of the non-central
 * t distribution. Applied Statistics 38:185–189, doi:10.2307/2347693.
 *
 * @param t Value.
 * @param df Degrees of freedom ν > 0.
 * @param delta Non-centrality parameter δ (finite).
 * @returns P(T ≤ t).
 * @throws {RangeError} For NaN t, ν ≤ 0 or non-finite δ.
 *
 * @example
 * ```ts
 * import { nonCentralTCdf, tCdf } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // δ = 0 is the central t distribution
 * assert.ok(Math.abs(nonCentralTCdf(1.5, 7, 0) - tCdf(1.5, 7)) < 1e-12);
 * ```
 */
export function nonCentralTCdf(t: number, df: number, delta: number): number {
  const where = "Non-central t distribution function";
  if (Number.isNaN(t)) throw new RangeError(`${where}: expected a number 't', got ${t}`);
  checkDegrees(where, "df", df);
  if (!Number.isFinite(delta)) {
    throw new RangeError(`${where}: expected a finite 'delta', got ${delta}`);
  }
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const p = t >= 0 ? nonCentralTSeries(t, df, delta) : 1 - nonCentralTSeries(-t, df, -delta);
  return Math.min(1, Math.max(0, p));
}

/**
 * Quantile of the non-central t distribution, by bracketing and bisection on
 * {@linkcode nonCentralTCdf} to a relative tolerance of 1e−12.
 *
 * Source: Lenth RV (1989) Applied Statistics 38:185–189, doi:10.2307/2347693 (distribution
 * function); the quantile is its numerical inverse.
 *
 * @param p Probability in (0, 1).
 * @param df Degrees of freedom ν > 0.
 * @param delta Non-centrality parameter δ (finite).
 * @returns t with P(T ≤ t) = p.
 * @throws {RangeError} For p outside (0, 1), ν ≤ 0 or non-finite δ.
 *
 * @example
 * ```ts
 * import { nonCentralTQuantile, tQuantile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Math.abs(nonCentralTQuantile(0.975, 10, 0) - tQuantile(0.975, 10)) < 1e-9);
 * ```
 */
export function nonCentralTQuantile(p: number, df: number, delta: number): number {
  const where = "Non-central t quantile";
  if (!(p > 0 && p < 1)) throw new RangeError(`${where}: expected 'p' in (0, 1), got ${p}`);
  checkDegrees(where, "df", df);
  if (!Number.isFinite(delta)) {
    throw new RangeError(`${where}: expected a finite 'delta', got ${delta}`);
  }
  const cdf = (t: number) => nonCentralTCdf(t, df, delta);
  let step = 1 + Math.abs(delta) * 0.1;
  let lo = delta - step;
  let hi = delta + step;
  while (cdf(lo) > p) {
    step *= 2;
    lo = delta - step;
    if (step > 1e12) throw new RangeError(`${where}: no bracket found for p = ${p}, got ${lo}`);
  }
  step = 1 + Math.abs(delta) * 0.1;
  while (cdf(hi) < p) {
    step *= 2;
    hi = delta + step;
    if (step > 1e12) throw new RangeError(`${where}: no bracket found for p = ${p}, got ${hi}`);
  }
  for (let i = 0; i < 200; i++) {
    const mid = 0.5 * (lo + hi);
    if (cdf(mid) < p) lo = mid;
    else hi = mid;
    if (hi - lo <= 1e-12 * Math.max(1, Math.abs(mid))) break;
  }
  return 0.5 * (lo + hi);
}
