/**
 * The decimal position of a reported uncertainty (JCGM 100:2008 §7.2.6) and the numerical
 * tolerance of JCGM 101:2008 §7.9.2 built on it. The rounding of displayed numbers lives in the one
 * formatting module, display/format.ts.
 *
 * @module
 */

/** Exponent of the last kept digit when `u` is written with `digits` significant digits. */
export function lastDigitExponent(u: number, digits: number): number {
  if (!(u > 0) || !Number.isFinite(u)) return 0;
  let l = Math.floor(Math.log10(u)) - digits + 1;
  // rounding may carry into a new digit (e.g. 0.0996 → 0.10)
  if (Math.round(u / 10 ** l) >= 10 ** digits) l += 1;
  return l;
}

/**
 * The numerical tolerance δ = ½·10^l of JCGM 101:2008 §7.9.2, where u = c × 10^l with c an
 * n_dig-digit integer.
 *
 * @example
 * ```ts
 * import { numericalTolerance } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // JCGM 101:2008 §7.9.2 example: u(y) = 0.028 with 2 digits → δ = 0.0005
 * assert.equal(numericalTolerance(0.028, 2), 0.0005);
 * ```
 */
export function numericalTolerance(u: number, significantDigits: number): number {
  const l = lastDigitExponent(u, significantDigits);
  return Number((0.5 * 10 ** l).toPrecision(12));
}
