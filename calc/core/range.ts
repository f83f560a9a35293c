/**
 * Ranges of values: membership (NaN never belongs), interval notation with the unit, and
 * containment of one range in another.
 *
 * @module
 */
import type { ValueRange } from "./types.ts";
import { formatUnit } from "./text.ts";

/**
 * True when `value` lies in `range` (false for NaN).
 *
 * @example
 * ```ts
 * import { inRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(inRange(0, { min: 0, max: 1, minExclusive: true }), false);
 * assert.equal(inRange(NaN, { min: 0, max: 1 }), false);
 * ```
 */
export function inRange(value: number, range: ValueRange): boolean {
  const aboveMin = range.minExclusive ? value > range.min : value >= range.min;
  const belowMax = range.maxExclusive ? value < range.max : value <= range.max;
  return aboveMin && belowMax;
}

/** The adjacent double toward +∞ (`up`) or −∞ of a finite x. */
function adjacent(x: number, up: boolean): number {
  if (x === 0) return up ? Number.MIN_VALUE : -Number.MIN_VALUE;
  const view = new DataView(new ArrayBuffer(8));
  view.setFloat64(0, x);
  view.setBigInt64(0, view.getBigInt64(0) + ((x > 0) === up ? 1n : -1n));
  return view.getFloat64(0);
}

/**
 * The closed interval [lower, upper] of doubles equal to `range`: an exclusive bound moves to the
 * adjacent double inside (v > a ⇔ v ≥ the next double after a). Column loops then test
 * `v >= lower && v <= upper`, which is false for NaN like {@linkcode inRange}, with no test of the
 * bounds' kinds per value.
 *
 * @param range The range.
 * @returns The bounds, inclusive.
 *
 * @example
 * ```ts
 * import { closedBounds, inRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = { min: 0, max: 1, maxExclusive: true };
 * const { lower, upper } = closedBounds(r);
 * // 1 − 2⁻⁵³ is the largest double below 1 (IEEE 754 binary64)
 * assert.deepEqual([lower, upper], [0, 1 - 2 ** -53]);
 * assert.equal(inRange(upper, r), true);
 * assert.equal(inRange(1, r), false);
 * ```
 */
export function closedBounds(range: ValueRange): { lower: number; upper: number } {
  const lower = range.minExclusive && Number.isFinite(range.min)
    ? adjacent(range.min, true)
    : range.min;
  const upper = range.maxExclusive && Number.isFinite(range.max)
    ? adjacent(range.max, false)
    : range.max;
  return { lower, upper };
}

/**
 * The smallest and largest value of a column in one pass, both NaN when any value is NaN
 * (`Math.min` and `Math.max` propagate it, and NaN then fails every comparison with a bound);
 * ±Infinity for an empty column.
 *
 * @param values The column.
 * @returns Its minimum and maximum.
 *
 * @example
 * ```ts
 * import { columnSpan } from "./range.ts";
 * import assert from "node:assert/strict";
 * assert.deepEqual(columnSpan(Float64Array.of(3, -1, 2)), { min: -1, max: 3 });
 * assert.ok(Number.isNaN(columnSpan(Float64Array.of(3, NaN, 2)).min));
 * ```
 */
export function columnSpan(values: Float64Array): { min: number; max: number } {
  let min = Infinity, max = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    min = Math.min(min, v);
    max = Math.max(max, v);
  }
  return { min, max };
}

/**
 * The number of values of a column outside `range` (NaN included). Skipped rows (`skip[i]`
 * non-zero) are not counted. Without rows to skip, one pass of running minimum and maximum (which
 * NaN poisons) first answers the usual case, nothing outside; only then are values counted.
 *
 * Formula: #{ i : not (lower ≤ vᵢ ≤ upper) } with the closed bounds of {@linkcode closedBounds}.
 *
 * @param values The column.
 * @param range The range.
 * @param skip Rows to leave out, or null.
 * @returns How many values lie outside.
 *
 * @example
 * ```ts
 * import { countOutside } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0 is excluded by "(0, 5]", NaN belongs to no range, 6 > 5
 * const col = Float64Array.of(0, 2.5, NaN, 5, 6);
 * assert.equal(countOutside(col, { min: 0, max: 5, minExclusive: true }), 3);
 * ```
 */
export function countOutside(
  values: Float64Array,
  range: ValueRange,
  skip: Uint8Array | null = null,
): number {
  const { lower, upper } = closedBounds(range);
  if (!skip) {
    const { min, max } = columnSpan(values);
    if (values.length === 0 || (min >= lower && max <= upper)) return 0;
  }
  let n = 0;
  for (let i = 0; i < values.length; i++) {
    const v = values[i]!;
    if (!(v >= lower && v <= upper) && !(skip && skip[i] !== 0)) n++;
  }
  return n;
}

/**
 * Formats a range in interval notation with its unit, e.g. "(0, 5] cm".
 *
 * @param range The range.
 * @param unit Its canonical unit ("1" or "" for none).
 * @returns The interval as printed.
 *
 * @example
 * ```ts
 * import { formatRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatRange({ min: 0, max: 5, minExclusive: true }, "cm^2"), "(0, 5] cm²");
 * assert.equal(formatRange({ min: 0, max: 90, maxExclusive: true }, "deg"), "[0, 90)°");
 * ```
 */
export function formatRange(range: ValueRange, unit: string): string {
  const open = range.minExclusive ? "(" : "[";
  const close = range.maxExclusive ? ")" : "]";
  const u = formatUnit(unit);
  const text = `${open}${number(range.min)}, ${number(range.max)}${close}`;
  return u === "" ? text : u === "°" ? `${text}°` : `${text} ${u}`;
}

function number(v: number): string {
  if (v === Infinity) return "∞";
  if (v === -Infinity) return "−∞";
  return String(v);
}

/**
 * True when every value of `inner` lies in `outer`.
 *
 * @example
 * ```ts
 * import { rangeWithin } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(rangeWithin({ min: 1, max: 2 }, { min: 0, max: 5 }), true);
 * assert.equal(rangeWithin({ min: 0, max: 2 }, { min: 0, max: 5, minExclusive: true }), false);
 * ```
 */
export function rangeWithin(inner: ValueRange, outer: ValueRange): boolean {
  const lowOk = inner.min > outer.min ||
    (inner.min === outer.min && (!outer.minExclusive || Boolean(inner.minExclusive)));
  const highOk = inner.max < outer.max ||
    (inner.max === outer.max && (!outer.maxExclusive || Boolean(inner.maxExclusive)));
  return lowOk && highOk;
}
