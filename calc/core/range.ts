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
