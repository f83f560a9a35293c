/**
 * Reporting a result: rounding per JCGM 100:2008 §7.2.6 (uncertainty to at most two significant
 * digits, the estimate to the same decimal position).
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

function fixed(value: number, l: number): string {
  if (l >= 0) return String(Math.round(value / 10 ** l) * 10 ** l);
  return value.toFixed(-l);
}

/**
 * Rounds an estimate and its uncertainty for reporting (JCGM 100:2008 §7.2.6): the uncertainty
 * to `digits` significant digits, the estimate to the same decimal position.
 *
 * @param value The estimate.
 * @param uncertainty Standard or expanded uncertainty, ≥ 0.
 * @param digits Significant digits of the uncertainty. @default 2
 * @returns Both as strings.
 *
 * @example
 * ```ts
 * import { roundForReport } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // JCGM 100:2008 §7.2.2: m_s = 100.021 47 g, u_c = 0.35 mg
 * assert.deepEqual(roundForReport(100.02147, 0.00035), { value: "100.02147", uncertainty: "0.00035" });
 * ```
 */
export function roundForReport(
  value: number,
  uncertainty: number,
  digits = 2,
): { value: string; uncertainty: string } {
  if (!(uncertainty > 0) || !Number.isFinite(uncertainty)) {
    return { value: String(value), uncertainty: String(uncertainty) };
  }
  const l = lastDigitExponent(uncertainty, digits);
  return { value: fixed(value, l), uncertainty: fixed(uncertainty, l) };
}
