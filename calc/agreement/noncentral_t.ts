/**
 * The non-central t distribution, needed for exact confidence limits of Bland–Altman limits of
 * agreement (Carkeet 2015). No pinned library provides it; it is built on the project's F
 * distribution function (stdlib), which supplies the regularized incomplete beta function, and
 * on the normal distribution function from calc/stats.
 *
 * @module
 */
import { fCdf, normalCdf } from "../stats/distributions.ts";
import { math } from "../core/units.ts";

/** ln Γ(x) from the project's mathjs instance. */
const logGamma = (x: number): number => math.lgamma(x) as number;

function checkDegrees(where: string, name: string, v: number): void {
  if (!(v > 0)) throw new RangeError(`${where}: expected '${name}' in (0, ∞), got ${v}`);
}

/** Regularized incomplete beta I_x(a, b) through the stdlib F distribution function:
 * F_{2a,2b}(f) = I_{x}(a, b) with f = b·x / (a·(1 − x)). */
function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  return fCdf((b * x) / (a * (1 - x)), 2 * a, 2 * b);
}

/** Series for P(T ≤ t) with t ≥ 0 (Lenth 1989, AS 243, written with Poisson weights in log
 * space and summed outward from the largest weight so that large δ does not underflow). */
function nonCentralTSeries(t: number, df: number, delta: number): number {
  const x = (t * t) / (t * t + df);
  const lambda = delta * delta / 2;
  const b = df / 2;
  const logLambda = lambda > 0 ? Math.log(lambda) : -Infinity;
  // log weights: p_j = e^{-λ} λ^j / j!; q_j = δ e^{-λ} λ^j / (√2 Γ(j + 3/2))
  const powLambda = (j: number) => (j === 0 ? 0 : j * logLambda);
  const logP = (j: number) => -lambda + powLambda(j) - logGamma(j + 1);
  const logQ = (j: number) => -lambda + powLambda(j) - 0.5 * Math.LN2 - logGamma(j + 1.5);
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
