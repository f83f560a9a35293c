/**
 * Quantiles by inverting a cumulative distribution function: bracket the root of F(x) − p, then
 * Brent's method (Brent 1973, "Algorithms for Minimization without Derivatives", ch. 4), which
 * keeps the bracket and converges superlinearly. Used where a distribution library's own quantile
 * function cannot be loaded without reading the environment (see DEVELOPERS.md, Dependencies): the
 * CDF stays the library's.
 *
 * @module
 */

/**
 * The x in (lower, ∞) with cdf(x) = p, for a continuous, non-decreasing cdf.
 *
 * @param cdf The cumulative distribution function.
 * @param p A probability in (0, 1).
 * @param lower The lower end of the support (−∞ or 0).
 * @param guess A starting point inside the support.
 * @returns The quantile, to about 2 ulp of x or of the CDF's own resolution.
 *
 * @example The median of an exponential distribution: ln 2
 * ```ts
 * import { quantileByInversion } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = quantileByInversion((x) => 1 - Math.exp(-x), 0.5, 0, 1);
 * assert.ok(Math.abs(x - Math.LN2) < 1e-14);
 * ```
 */
export function quantileByInversion(
  cdf: (x: number) => number,
  p: number,
  lower: number,
  guess: number,
): number {
  const f = (x: number) => cdf(x) - p;
  // bracket: step outwards from the guess, doubling, until the sign changes
  let a = guess, fa = f(a);
  let b = a, fb = fa;
  let step = Math.max(1, Math.abs(guess));
  for (let i = 0; i < 2000 && fa * fb > 0; i++) {
    if (fa > 0) {
      b = a;
      fb = fa;
      a = lower === 0 ? a / 2 : a - step;
      fa = f(a);
    } else {
      a = b;
      fa = fb;
      b = b + step;
      fb = f(b);
    }
    step *= 2;
    if (lower === 0 && a < 1e-300) {
      a = 0;
      fa = f(0);
    }
  }
  if (fa === 0) return a;
  if (fb === 0) return b;
  if (fa * fb > 0) {
    throw new RangeError(`Quantile by inversion: no root found for p = ${p}`);
  }
  // Brent's method (zeroin)
  let c = a, fc = fa, d = b - a, e = d;
  for (let i = 0; i < 200; i++) {
    if (fb * fc > 0) {
      c = a;
      fc = fa;
      d = e = b - a;
    }
    if (Math.abs(fc) < Math.abs(fb)) {
      a = b;
      b = c;
      c = a;
      fa = fb;
      fb = fc;
      fc = fa;
    }
    const tol = 2 * Number.EPSILON * Math.abs(b) + 1e-300;
    const m = (c - b) / 2;
    if (Math.abs(m) <= tol || fb === 0) return b;
    if (Math.abs(e) >= tol && Math.abs(fa) > Math.abs(fb)) {
      // inverse quadratic interpolation, or the secant when only two points differ
      const s = fb / fa;
      let pp: number, q: number;
      if (a === c) {
        pp = 2 * m * s;
        q = 1 - s;
      } else {
        const qa = fa / fc, r = fb / fc;
        pp = s * (2 * m * qa * (qa - r) - (b - a) * (r - 1));
        q = (qa - 1) * (r - 1) * (s - 1);
      }
      if (pp > 0) q = -q;
      else pp = -pp;
      if (2 * pp < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
        e = d;
        d = pp / q;
      } else {
        d = m;
        e = m;
      }
    } else {
      d = m;
      e = m;
    }
    a = b;
    fa = fb;
    b += Math.abs(d) > tol ? d : m > 0 ? tol : -tol;
    fb = f(b);
  }
  return b;
}
