/**
 * The one definition of a relative change in the package: a value compared with a reference
 * value, in percent of the reference. Every "percent change", "underestimation",
 * "overestimation" and "error (%)" the package reports is this function with a stated reference
 * (the true value, for a measurement error).
 *
 * @module
 */

/**
 * The change of `value` relative to `reference`, in percent of the reference:
 * 100·(value − reference)/|reference|. For a measurement error the reference is the true value
 * (the usual metrology convention: the relative error of a measured value is
 * (measured − true)/true, JCGM 200:2012 (VIM) §2.16 and §2.12 note); the sign says whether the
 * value lies above (+) or below (−) the reference whatever the reference's sign.
 *
 * @param value The value compared.
 * @param reference The value it is compared with (the true value, for an error).
 * @returns The change in percent; NaN when the reference is 0 (no relative change is defined).
 *
 * @example A 10° beam angle: the displayed gradient is cos²10° of the true one
 * ```ts
 * import { relativeChangePercent } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const cos2 = Math.cos(Math.PI / 18) ** 2; // cos²10° = 0.969846 (hand computation)
 * // displayed relative to true: 100·(cos²10° − 1) = −3.015 %
 * assert.equal(relativeChangePercent(64 * cos2, 64).toFixed(3), "-3.015");
 * assert.ok(Number.isNaN(relativeChangePercent(1, 0)));
 * ```
 */
export function relativeChangePercent(value: number, reference: number): number {
  return reference === 0 ? NaN : (100 * (value - reference)) / Math.abs(reference);
}
