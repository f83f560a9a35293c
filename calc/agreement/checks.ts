/**
 * Input checks shared by the agreement statistics (internal). Errors follow the project rule:
 * TypeError for a wrong type or shape, RangeError for a value outside its domain, each naming
 * the field and ending with the offending value.
 *
 * @module
 */

/** The package's one interval shape. */
export type { Interval } from "../uncertainty/types.ts";

/** Short description of a value for messages. */
export function shown(value: unknown): string {
  if (typeof value === "string") return `"${value}"`;
  if (Array.isArray(value)) return `an array of length ${value.length}`;
  if (value === null) return "null";
  if (typeof value === "object") return "an object";
  return String(value);
}

/** Checks an array of finite numbers with at least `minLength` entries. */
export function checkNumbers(
  where: string,
  name: string,
  values: unknown,
  minLength = 2,
): readonly number[] {
  if (!Array.isArray(values) && !(values instanceof Float64Array)) {
    throw new TypeError(
      `${where}: expected '${name}' as an array of numbers, got ${shown(values)}`,
    );
  }
  const arr = values as ArrayLike<unknown>;
  if (arr.length < minLength) {
    throw new RangeError(
      `${where}: expected at least ${minLength} values in '${name}', got ${arr.length}`,
    );
  }
  for (let i = 0; i < arr.length; i++) {
    const v = arr[i];
    if (typeof v !== "number") {
      throw new TypeError(`${where}: expected a number at '${name}[${i}]', got ${shown(v)}`);
    }
    if (!Number.isFinite(v)) {
      throw new RangeError(`${where}: expected a finite number at '${name}[${i}]', got ${v}`);
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
    throw new TypeError(
      `${where}: expected '${names[0]}' and '${
        names[1]
      }' of equal length (paired readings), got ${x.length} and ${y.length}`,
    );
  }
  return [x, y];
}

/** Checks a confidence level in (0, 1). */
export function checkConfidence(where: string, confidence: unknown): number {
  if (typeof confidence !== "number") {
    throw new TypeError(
      `${where}: expected 'confidence' as a number in (0, 1), got ${shown(confidence)}`,
    );
  }
  if (!(confidence > 0 && confidence < 1)) {
    throw new RangeError(`${where}: expected 'confidence' in (0, 1), got ${confidence}`);
  }
  return confidence;
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
