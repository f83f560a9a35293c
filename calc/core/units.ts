/**
 * Unit-aware input: a number in the canonical unit, or a quantity string ("21 mm") or mathjs
 * Unit converted to it. Dimension mismatches are errors.
 *
 * @module
 */
import type { MathJsInstance, Unit } from "mathjs";
import { describeValue } from "./text.ts";

/** The part of a mathjs Unit this library uses (any mathjs Unit satisfies it). */
export interface MathJsUnit {
  /** The value converted to `unit`. */
  toNumber(unit: string): number;
  /** Formatted value and unit. */
  toString(): string;
}

/** Set on `globalThis` by the Monte Carlo worker (calc/uncertainty/worker.ts) before it loads
 * any module of this package: a worker evaluates formulas on canonical numbers only, so it skips
 * loading mathjs (about 80 MB and 0.3 s per worker). */
export const FORMULA_ONLY_WORKER: unique symbol = Symbol.for("sonorigor.formulaOnlyWorker");

/**
 * Whether this thread is a formula-only Monte Carlo worker (see {@linkcode FORMULA_ONLY_WORKER}):
 * modules then skip loading what only the calling thread needs (mathjs here, zod for Z-score model
 * data).
 *
 * @example
 * ```ts
 * import { isFormulaOnlyWorker } from "./units.ts";
 * import assert from "node:assert/strict";
 * // a test or notebook thread is not a worker: units and expressions are loaded
 * assert.equal(isFormulaOnlyWorker(), false);
 * ```
 */
export function isFormulaOnlyWorker(): boolean {
  return (globalThis as Record<symbol, unknown>)[FORMULA_ONLY_WORKER] === true;
}

/** A stand-in for mathjs inside a formula-only worker: any use is a clear error. */
function mathUnavailable(): MathJsInstance {
  return new Proxy({} as MathJsInstance, {
    get(_, property) {
      throw new Error(
        `Units and expressions (mathjs '${
          String(property)
        }') are not loaded in a Monte Carlo worker: workers evaluate formulas on canonical numbers only`,
      );
    },
  });
}

/** The project's one mathjs instance (units, expressions, symbolic derivatives). */
export const math: MathJsInstance = isFormulaOnlyWorker()
  ? mathUnavailable()
  // mathjs bundled into one file (vendor/build.ts): a few hundred ms less to import than its
  // ≈ 1,000 modules
  : await import("../../vendor/mathjs.js").then(({ all, create }) => create(all!, {}));

const knownUnits = new Map<string, Unit | null>();

/** The mathjs Unit for a canonical unit string, or null when mathjs does not know it (then only
 * plain numbers or the exact label are accepted). */
export function mathUnitOf(unit: string): Unit | null {
  if (knownUnits.has(unit)) return knownUnits.get(unit) ?? null;
  let parsed: Unit | null = null;
  if (unit !== "1" && unit !== "") {
    try {
      parsed = math.unit(1, unit) as Unit;
    } catch {
      parsed = null;
    }
  }
  knownUnits.set(unit, parsed);
  return parsed;
}

/** A value as callers may give it: a number in the canonical unit, a quantity string such as
 * "21 mm", or a mathjs Unit. */
export type QuantityInput = number | string | MathJsUnit;

/** True for a mathjs Unit object. */
export function isMathUnit(value: unknown): value is MathJsUnit {
  return typeof value === "object" && value !== null &&
    (value as { type?: unknown }).type === "Unit" &&
    typeof (value as { toNumber?: unknown }).toNumber === "function";
}

/** Why a value could not be read as an amount of a unit. */
export interface AmountProblem {
  /** "type": not a number, string or Unit; "unit": another dimension or an unreadable unit. */
  readonly problem: "type" | "unit";
}

const DECIMAL = /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/;

/**
 * Reads a value as a number in `unit`, without throwing: a number is taken as already in `unit`;
 * a string is a plain decimal or a quantity ("21 mm"); a mathjs Unit is converted.
 *
 * @param value The value as given.
 * @param unit The canonical unit.
 * @returns The number, or why it could not be read.
 *
 * @example
 * ```ts
 * import { readAmount } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(readAmount("21 mm", "cm"), 2.1);
 * assert.deepEqual(readAmount("21 mmHg", "cm"), { problem: "unit" });
 * assert.deepEqual(readAmount(true, "cm"), { problem: "type" });
 * ```
 */
export function readAmount(value: unknown, unit: string): number | AmountProblem {
  if (typeof value === "number") return value;
  if (typeof value === "string") {
    const text = value.trim();
    if (DECIMAL.test(text)) return Number(text);
    // text that does not start with a number ("abc", "n/a") is not an amount at all, and a
    // dimensionless field takes a plain number only
    if (!/^[+-]?(\d|\.\d)/.test(text) || unit === "1") return { problem: "type" };
    const target = mathUnitOf(unit);
    if (target === null) {
      // a label mathjs does not know ("%", "bpm", "dB"): accept "63 %" or "63%"
      const label = unit === "1" ? "" : unit;
      if (label !== "" && text.endsWith(label)) {
        const head = text.slice(0, text.length - label.length).trim();
        if (DECIMAL.test(head)) return Number(head);
      }
      return { problem: "unit" };
    }
    let parsed: Unit;
    try {
      parsed = math.unit(text) as Unit;
    } catch {
      return { problem: "unit" };
    }
    return convert(parsed, target, unit);
  }
  if (isMathUnit(value)) {
    const target = mathUnitOf(unit);
    if (target === null) return { problem: "unit" };
    return convert(value as unknown as Unit, target, unit);
  }
  return { problem: "type" };
}

/**
 * Converts a quantity to a number in `unit`.
 *
 * @param value A number (already in `unit`), a quantity string, or a mathjs Unit.
 * @param unit The canonical unit.
 * @param where Prefix for error messages, e.g. "Continuity valve area: lvotDiameterCm".
 * @returns The value in `unit`.
 * @throws {TypeError} When the value is neither a number, a string nor a Unit, or its dimension
 * differs from `unit`.
 *
 * @example
 * ```ts
 * import { toCanonical } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(toCanonical("21 mm", "cm", "LVOT"), 2.1);
 * assert.throws(() => toCanonical("21 mmHg", "cm", "LVOT"), TypeError);
 * ```
 */
export function toCanonical(value: QuantityInput, unit: string, where: string): number {
  const read = readAmount(value, unit);
  if (typeof read === "number") return read;
  const shown = typeof value === "string"
    ? `"${value}"`
    : isMathUnit(value)
    ? value.toString()
    : describeValue(value);
  throw new TypeError(
    read.problem === "type"
      ? `${where}: expected a number or a quantity string in ${unit}, got ${shown}`
      : `${where}: expected a quantity convertible to ${unit}, got ${shown}`,
  );
}

function convert(parsed: Unit, target: Unit, unit: string): number | AmountProblem {
  if (!parsed.equalBase(target)) return { problem: "unit" };
  // mathjs converts through SI base units; round to 15 significant digits so that "3.5 cm" stays
  // 3.5 and "21 mm" becomes 2.1 cm rather than 2.1000000000000001 (far below any measurement
  // resolution)
  return Number(parsed.toNumber(unit).toPrecision(15));
}

/** Short description of an unexpected value for error messages (see `describeValue`). */
export const describe: (value: unknown) => string = describeValue;
