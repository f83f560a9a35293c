/**
 * What the agreement statistics share: the option that labels their displays (what was measured),
 * input checks (rendered from structured issues by the one issue renderer: TypeError for a wrong
 * type or shape, RangeError for a value outside its domain, each naming the field and ending with
 * the offending value), the attachment of notebook displays, and small sums.
 *
 * @module
 */

import type { MimeBundle } from "../core/types.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";
import { issueError } from "../core/issues.ts";
import type { Measured } from "./types.ts";

/** The package's one interval shape. */
export type { Interval } from "../uncertainty/types.ts";

/** Options every agreement statistic takes to label its display. */
export interface LabelOptions {
  /** What was measured (a quantity such as `EJECTION_FRACTION`, or `{ label, unit }`): labels
   * and units of the display. @default not stated (no unit shown) */
  readonly quantity?: Measured;
}

/** Checks the `quantity` option and keeps its label and unit; null when it is not given. */
export function measuredOf(where: string, quantity: unknown): Measured | null {
  if (quantity === undefined) return null;
  const q = quantity as Partial<Measured> | null;
  if (
    typeof q !== "object" || q === null || typeof q.label !== "string" ||
    typeof q.unit !== "string"
  ) {
    throw new TypeError(
      `${where}: expected 'quantity' as a quantity or { label, unit }, got ${shown(quantity)}`,
    );
  }
  return { label: q.label, unit: q.unit };
}

/** Checks a pair of names (methods, raters) for displays; the defaults when not given. */
export function namesOf(
  where: string,
  option: string,
  names: unknown,
  defaults: readonly [string, string],
): readonly [string, string] {
  if (names === undefined) return defaults;
  if (
    !Array.isArray(names) || names.length !== 2 || typeof names[0] !== "string" ||
    typeof names[1] !== "string"
  ) {
    throw new TypeError(`${where}: expected '${option}' as two names, got ${shown(names)}`);
  }
  return [names[0], names[1]];
}

/** Attaches a notebook display to a result (the display lives in display/agreement.ts). */
export function displayed<R extends { [JUPYTER_DISPLAY](): MimeBundle }>(
  result: Omit<R, typeof JUPYTER_DISPLAY>,
  display: (r: R) => MimeBundle,
): R {
  const full = result as R;
  return Object.assign(full, { [JUPYTER_DISPLAY]: () => display(full) });
}

/** Short description of a value for messages. */
export function shown(value: unknown): string {
  if (typeof value === "string") return `"${value}"`;
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  if (value === null) return "null";
  if (typeof value === "object") return "an object";
  return String(value);
}

/** Throws the error of one issue found by a check (rendered by the one issue renderer). */
function refuse(
  where: string,
  kind: "type" | "range",
  field: string,
  expected: string,
  received: string,
): never {
  throw issueError([{ kind, severity: "error", where, field, received, expected }]);
}

/** Checks an array of finite numbers with at least `minLength` entries. */
export function checkNumbers(
  where: string,
  name: string,
  values: unknown,
  minLength = 2,
): readonly number[] {
  if (!Array.isArray(values) && !(values instanceof Float64Array)) {
    refuse(where, "type", name, "as an array of numbers", shown(values));
  }
  const arr = values as ArrayLike<unknown>;
  if (arr.length < minLength) {
    refuse(where, "range", name, `with at least ${minLength} values`, String(arr.length));
  }
  for (let i = 0; i < arr.length; i++) {
    const v = arr[i];
    if (typeof v !== "number") refuse(where, "type", `${name}[${i}]`, "as a number", shown(v));
    if (!Number.isFinite(v)) {
      refuse(where, "range", `${name}[${i}]`, "as a finite number", String(v));
    }
  }
  return Array.from(arr as ArrayLike<number>);
}

/** Checks two paired arrays of equal length. */
export function checkPairs(
  where: string,
  names: readonly [string, string],
  a: unknown,
  b: unknown,
  minLength = 2,
): [readonly number[], readonly number[]] {
  const x = checkNumbers(where, names[0], a, minLength);
  const y = checkNumbers(where, names[1], b, minLength);
  if (x.length !== y.length) {
    refuse(
      where,
      "type",
      names[1],
      `with ${x.length} values, one per reading of '${names[0]}' (paired readings)`,
      String(y.length),
    );
  }
  return [x, y];
}

/** Checks a confidence level in (0, 1). */
export function checkConfidence(where: string, confidence: unknown): number {
  if (typeof confidence !== "number") {
    refuse(where, "type", "confidence", "as a number in (0, 1)", shown(confidence));
  }
  if (!(confidence > 0 && confidence < 1)) {
    refuse(where, "range", "confidence", "in (0, 1)", String(confidence));
  }
  return confidence;
}

/** Checks the multiplier of limits of agreement and repeatability coefficients: (0, 5]. */
export function checkMultiplier(where: string, multiplier: unknown): number {
  if (typeof multiplier !== "number") {
    refuse(where, "type", "multiplier", "as a number in (0, 5]", shown(multiplier));
  }
  if (!(multiplier > 0 && multiplier <= 5)) {
    refuse(where, "range", "multiplier", "in (0, 5]", String(multiplier));
  }
  return multiplier;
}

/** Arithmetic mean. */
export function mean(values: readonly number[]): number {
  let s = 0;
  for (const v of values) s += v;
  return s / values.length;
}

/** Sum of squared deviations from the mean. */
export function sumSquares(values: readonly number[], center = mean(values)): number {
  let s = 0;
  for (const v of values) s += (v - center) ** 2;
  return s;
}

/** Median of a numeric array (copy sorted ascending). */
export function median(values: readonly number[]): number {
  const s = [...values].sort((p, q) => p - q);
  const m = s.length >> 1;
  return s.length % 2 === 1 ? s[m]! : 0.5 * (s[m - 1]! + s[m]!);
}

/** A statistic computed, or the reason it was not: the message of the RangeError, or of the
 * TypeError in the package's format ("<Title>: expected …"), that it threw (too few subjects, no
 * variation, a single category…). Other errors, programming errors among them, are not caught. */
export function attempt<T>(compute: () => T):
  | { readonly status: "computed"; readonly result: T }
  | { readonly status: "not computed"; readonly reason: string } {
  try {
    return { status: "computed", result: compute() };
  } catch (e) {
    if (
      e instanceof RangeError || (e instanceof TypeError && /^[^:]+: expected /.test(e.message))
    ) {
      return { status: "not computed", reason: e.message };
    }
    throw e;
  }
}
