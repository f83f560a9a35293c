/**
 * The one formatting module: every number a display, report or file shows is written here, by the
 * metrology rule when an uncertainty is known (JCGM 100:2008 §7.2.6: the uncertainty to at most
 * two significant digits, the value to the same decimal place), otherwise to the quantity's
 * display resolution; counts as integers, missing values as "not measured".
 *
 * @module
 */
import { lastDigitExponent } from "../calc/uncertainty/rounding.ts";
import { withUnit } from "../calc/core/text.ts";
import type { Interval } from "../calc/uncertainty/types.ts";

/** What a missing value shows in a display or report. */
export const NOT_MEASURED = "not measured";

/** `value` rounded to the decimal position 10^l, half away from zero on the decimal digits as
 * written (2.05 → 2.1 at l = −1, although the double nearest 2.05 lies just below it). */
function fixed(value: number, l: number): string {
  if (l >= 0) return String(Math.round(value / 10 ** l) * 10 ** l);
  const k = 10 ** -l;
  // the scaled value, corrected by a relative 1e-12 so that a decimal half (2.05·10 = 20.499…)
  // rounds as written
  const scaled = Math.abs(value) * k * (1 + 1e-12);
  const text = (Math.sign(value) * (Math.round(scaled) / k)).toFixed(-l);
  return /^-0\.?0*$/.test(text) ? text.slice(1) : text;
}

/**
 * Rounds an estimate and its uncertainty for reporting (JCGM 100:2008 §7.2.6): the uncertainty to
 * `digits` significant digits, the estimate to the same decimal position.
 *
 * @param value The estimate.
 * @param uncertainty Standard or expanded uncertainty, ≥ 0.
 * @param digits Significant digits of the uncertainty. @default 2
 * @returns Both as strings (a zero or non-finite uncertainty leaves the value as given).
 *
 * @example
 * ```ts
 * import { roundForReport } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // JCGM 100:2008 §7.2.2: m_s = 100.021 47 g, u_c = 0.35 mg
 * assert.deepEqual(roundForReport(100.02147, 0.00035), { value: "100.02147", uncertainty: "0.00035" });
 * // JCGM 100:2008 §7.2.6: u = 28.05 kHz is quoted as 28 kHz
 * assert.deepEqual(roundForReport(1542.37, 28.05), { value: "1542", uncertainty: "28" });
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

/**
 * A value rounded to the decimal place its uncertainty allows (two significant digits of the
 * uncertainty), without the uncertainty: for interval ends and table cells.
 *
 * @example
 * ```ts
 * import { roundLike } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(roundLike(0.612345, 0.0473), "0.612");
 * ```
 */
export function roundLike(value: number, uncertainty: number): string {
  if (!Number.isFinite(value)) return NOT_MEASURED;
  if (!(uncertainty > 0) || !Number.isFinite(uncertainty)) return formatNumber(value);
  return fixed(value, lastDigitExponent(uncertainty, 2));
}

/**
 * A value rounded to a display resolution (the quantity's, when no uncertainty is known): as
 * many decimals as the resolution has.
 *
 * @example
 * ```ts
 * import { formatResolution } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatResolution(0.785398, 0.01), "0.79");
 * assert.equal(formatResolution(63.4, 1), "63");
 * ```
 */
export function formatResolution(value: number, resolution: number): string {
  if (!Number.isFinite(value)) return NOT_MEASURED;
  if (!(resolution > 1e-6)) return formatNumber(value);
  const l = Math.floor(Math.log10(resolution) + 1e-9);
  return fixed(value, l);
}

/**
 * A number with up to `digits` significant digits (for statistics without a stated uncertainty
 * or resolution); "not measured" for NaN.
 *
 * @example
 * ```ts
 * import { formatNumber } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatNumber(0.785398), "0.7854");
 * assert.equal(formatNumber(NaN), "not measured");
 * ```
 */
export function formatNumber(value: number, digits = 4): string {
  if (Number.isNaN(value)) return NOT_MEASURED;
  if (!Number.isFinite(value)) return value > 0 ? "∞" : "−∞";
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-4) return value.toExponential(digits - 1);
  return String(Number(value.toPrecision(digits)));
}

/**
 * A count as an integer ("3", never "3.000").
 *
 * @example
 * ```ts
 * import { formatCount } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatCount(1000000), "1000000");
 * ```
 */
export function formatCount(value: number): string {
  return Number.isFinite(value) ? String(Math.round(value)) : NOT_MEASURED;
}

/**
 * "value ± U unit" rounded by the metrology rule.
 *
 * @param value The estimate.
 * @param uncertainty The (expanded or standard) uncertainty it is quoted with.
 * @param unit Canonical unit.
 * @returns The text.
 *
 * @example
 * ```ts
 * import { formatPlusMinus } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatPlusMinus(0.78539, 0.1234, "cm^2"), "0.79 ± 0.12 cm²");
 * ```
 */
export function formatPlusMinus(value: number, uncertainty: number, unit: string): string {
  const r = roundForReport(value, uncertainty);
  return withUnit(`${r.value} ± ${r.uncertainty}`, unit);
}

/**
 * An interval "[lower, upper]" with both ends rounded as the uncertainty allows.
 *
 * @example
 * ```ts
 * import { formatInterval } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatInterval({ lower: 0.5432, upper: 1.0321 }, 0.12, "cm^2"), "[0.54, 1.03] cm²");
 * ```
 */
export function formatInterval(interval: Interval, uncertainty: number, unit = "1"): string {
  return withUnit(
    `[${roundLike(interval.lower, uncertainty)}, ${roundLike(interval.upper, uncertainty)}]`,
    unit,
  );
}

/**
 * A share of a whole (a budget's share of the variance, a probability) as a percentage with one
 * decimal: "12.3 %".
 *
 * @example
 * ```ts
 * import { formatShare } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatShare(0.12345), "12.3 %");
 * ```
 */
export function formatShare(share: number): string {
  return Number.isFinite(share) ? `${(100 * share).toFixed(1)} %` : NOT_MEASURED;
}
