/**
 * Uncertain inputs: the probability distributions of JCGM 100 §4.2–4.3 and JCGM 101 §6.4, each
 * with its estimate, standard uncertainty and degrees of freedom.
 *
 * Values may be numbers in the input's canonical unit or quantity strings ("2.1 cm"); they are
 * converted when the input is matched to a calculation.
 *
 * @module
 */
import { describe, type QuantityInput, toCanonical } from "../core/units.ts";

/** A value in the input's canonical unit or a quantity string. */
export type Amount = number | string;

/** Normal (Gaussian) distribution, JCGM 101 §6.4.7. */
export interface NormalInput {
  /** Distribution tag. */
  readonly kind: "normal";
  /** Estimate (expectation), in the input's canonical unit or as a quantity string. */
  readonly value: Amount;
  /** Standard uncertainty, ≥ 0. */
  readonly standardUncertainty: Amount;
  /** Degrees of freedom of the standard uncertainty (infinite when omitted). */
  readonly dof?: number;
}
/** Rectangular (uniform) distribution on [lower, upper], JCGM 100 §4.3.7, JCGM 101 §6.4.2. */
export interface RectangularInput {
  /** Distribution tag. */
  readonly kind: "rectangular";
  /** Lower bound. */
  readonly lower: Amount;
  /** Upper bound. */
  readonly upper: Amount;
  /** Degrees of freedom of the standard uncertainty (infinite when omitted). */
  readonly dof?: number;
}
/** Triangular distribution on [lower, upper] with a mode, JCGM 100 §4.3.9, JCGM 101 §6.4.5. */
export interface TriangularInput {
  /** Distribution tag. */
  readonly kind: "triangular";
  /** Lower bound. */
  readonly lower: Amount;
  /** Upper bound. */
  readonly upper: Amount;
  /** Mode; the midpoint when omitted (symmetric triangle). */
  readonly mode?: Amount;
  /** Degrees of freedom of the standard uncertainty (infinite when omitted). */
  readonly dof?: number;
}
/** Arcsine (U-shaped) distribution on [lower, upper], JCGM 101 §6.4.6. */
export interface ArcsineInput {
  /** Distribution tag. */
  readonly kind: "arcsine";
  /** Lower bound. */
  readonly lower: Amount;
  /** Upper bound. */
  readonly upper: Amount;
  /** Degrees of freedom of the standard uncertainty (infinite when omitted). */
  readonly dof?: number;
}
/** Scaled and shifted Student t distribution (Type A evaluation), JCGM 101 §6.4.9. */
export interface StudentTInput {
  /** Distribution tag. */
  readonly kind: "studentT";
  /** Mean of the readings. */
  readonly value: Amount;
  /** Standard uncertainty of the mean, s/√n. */
  readonly standardUncertainty: Amount;
  /** Degrees of freedom, n − 1. */
  readonly dof: number;
}
/** A value known exactly (zero uncertainty). */
export interface ExactInput {
  /** Distribution tag. */
  readonly kind: "exact";
  /** Estimate (expectation), in the input's canonical unit or as a quantity string. */
  readonly value: Amount;
}

/** Any uncertain input. */
export type UncertainInput =
  | NormalInput
  | RectangularInput
  | TriangularInput
  | ArcsineInput
  | StudentTInput
  | ExactInput;

/** What callers may give for one input of a propagation: a distribution or an exact value. */
export type InputEstimate = UncertainInput | QuantityInput;

/**
 * Normal distribution with estimate `value` and standard uncertainty `standardUncertainty`.
 *
 * @param value Estimate (mean).
 * @param standardUncertainty Standard uncertainty (standard deviation), ≥ 0.
 * @param options Degrees of freedom of the uncertainty (infinite when omitted).
 * @returns The uncertain input.
 *
 * @example
 * ```ts
 * import { normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(normal(2.1, 0.05), { kind: "normal", value: 2.1, standardUncertainty: 0.05 });
 * ```
 */
export function normal(
  value: Amount,
  standardUncertainty: Amount,
  options: { dof?: number } = {},
): NormalInput {
  return options.dof === undefined
    ? { kind: "normal", value, standardUncertainty }
    : { kind: "normal", value, standardUncertainty, dof: options.dof };
}

/**
 * Rectangular distribution on [lower, upper]: estimate (a + b)/2, u = (b − a)/√12
 * (JCGM 100:2008 §4.3.7).
 *
 * @example
 * ```ts
 * import { rectangular } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(rectangular(-1, 1).kind, "rectangular");
 * ```
 */
export function rectangular(lower: Amount, upper: Amount): RectangularInput {
  return { kind: "rectangular", lower, upper };
}

/**
 * Rectangular distribution given its centre and half-width a: u = a/√3 (JCGM 100:2008 §4.3.7).
 *
 * @example
 * ```ts
 * import { rectangularHalfWidth } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(rectangularHalfWidth(10, 1), { kind: "rectangular", lower: 9, upper: 11 });
 * ```
 */
export function rectangularHalfWidth(center: number, halfWidth: number): RectangularInput {
  if (!(halfWidth >= 0)) {
    throw new RangeError(`Rectangular input: expected halfWidth >= 0, got ${halfWidth}`);
  }
  return { kind: "rectangular", lower: center - halfWidth, upper: center + halfWidth };
}

/**
 * Triangular distribution on [lower, upper] with optional mode (symmetric by default):
 * u = (b − a)/√24 when symmetric (JCGM 100:2008 §4.3.9).
 *
 * @example
 * ```ts
 * import { triangular } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(triangular(0, 2).kind, "triangular");
 * ```
 */
export function triangular(lower: Amount, upper: Amount, mode?: Amount): TriangularInput {
  return mode === undefined
    ? { kind: "triangular", lower, upper }
    : { kind: "triangular", lower, upper, mode };
}

/**
 * Arcsine (U-shaped) distribution on [lower, upper]: u = (b − a)/(2√2) (JCGM 101:2008 §6.4.6),
 * e.g. a quantity that oscillates sinusoidally between two limits.
 *
 * @example
 * ```ts
 * import { arcsine } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(arcsine(-1, 1).kind, "arcsine");
 * ```
 */
export function arcsine(lower: Amount, upper: Amount): ArcsineInput {
  return { kind: "arcsine", lower, upper };
}

/**
 * Scaled and shifted Student t distribution with mean, standard uncertainty of the mean and
 * degrees of freedom (JCGM 101:2008 §6.4.9).
 *
 * @example
 * ```ts
 * import { studentT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(studentT(5, 0.1, 4).dof, 4);
 * ```
 */
export function studentT(value: Amount, standardUncertainty: Amount, dof: number): StudentTInput {
  return { kind: "studentT", value, standardUncertainty, dof };
}

/**
 * Type A evaluation from repeated readings (JCGM 100:2008 §4.2): estimate the arithmetic mean
 * q̄, standard uncertainty s(q̄) = s/√n, degrees of freedom ν = n − 1; represented as a scaled and
 * shifted t distribution for Monte Carlo (JCGM 101:2008 §6.4.9).
 *
 * @param readings At least two finite readings in the input's canonical unit.
 * @returns A Student t input.
 * @throws {RangeError} With fewer than two readings or a non-finite reading.
 *
 * @example
 * ```ts
 * import { typeA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = typeA([1, 2, 3]);
 * assert.equal(x.value, 2);
 * assert.equal(x.dof, 2);
 * assert.ok(Math.abs(Number(x.standardUncertainty) - 1 / Math.sqrt(3)) < 1e-15);
 * ```
 */
export function typeA(readings: readonly number[]): StudentTInput {
  if (!Array.isArray(readings) || readings.length < 2) {
    throw new RangeError(
      `Type A input: expected at least 2 readings, got ${readings?.length ?? describe(readings)}`,
    );
  }
  readings.forEach((r, i) => {
    if (!Number.isFinite(r)) {
      throw new RangeError(`Type A input: expected finite readings, got reading ${i} = ${r}`);
    }
  });
  const n = readings.length;
  const mean = readings.reduce((a, b) => a + b, 0) / n;
  const ss = readings.reduce((a, b) => a + (b - mean) ** 2, 0);
  const s = Math.sqrt(ss / (n - 1));
  return { kind: "studentT", value: mean, standardUncertainty: s / Math.sqrt(n), dof: n - 1 };
}

/**
 * An exactly known value: contributes nothing to the uncertainty.
 *
 * @example
 * ```ts
 * import { exact } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(exact(1540), { kind: "exact", value: 1540 });
 * ```
 */
export function exact(value: Amount): ExactInput {
  return { kind: "exact", value };
}

/** True for a value made by one of the distribution constructors. *
 * @example
 * ```ts
 * import { isUncertainInput, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(isUncertainInput(normal(1, 0.1)), true);
 * assert.equal(isUncertainInput(1), false);
 * ```
 */
export function isUncertainInput(value: unknown): value is UncertainInput {
  const k = (value as { kind?: unknown } | null)?.kind;
  return typeof value === "object" && value !== null &&
    (k === "normal" || k === "rectangular" || k === "triangular" || k === "arcsine" ||
      k === "studentT" || k === "exact");
}

/** An input resolved to canonical numbers: what GUM and Monte Carlo consume. */
export interface ResolvedInput {
  /** Input name. */
  readonly name: string;
  /** Distribution tag. */
  readonly kind: UncertainInput["kind"];
  /** Expectation used as the estimate. */
  readonly estimate: number;
  /** Standard uncertainty. */
  readonly standardUncertainty: number;
  /** Degrees of freedom (Infinity for Type B without stated reliability). */
  readonly dof: number;
  /** Lower bound of a bounded shape (the estimate otherwise), canonical unit. */
  readonly lower: number;
  /** Upper bound of a bounded shape (the estimate otherwise), canonical unit. */
  readonly upper: number;
  /** Mode of a triangular shape (the estimate otherwise), canonical unit. */
  readonly mode: number;
}

/**
 * Resolves one input: converts units and computes estimate, standard uncertainty and degrees of
 * freedom.
 *
 * @throws {TypeError} For an unrecognised input shape or a wrong unit.
 * @throws {RangeError} For a negative or non-finite uncertainty, reversed bounds or dof ≤ 0.
 *
 * @example
 * ```ts
 * import { rectangular, resolveInput } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // u = (b − a)/√12 (JCGM 100:2008 §4.3.7), bounds converted from mm to cm
 * const r = resolveInput("d", "cm", rectangular("20 mm", "22 mm"), "Example");
 * assert.ok(Math.abs(r.standardUncertainty - 0.2 / Math.sqrt(12)) < 1e-15);
 * ```
 */
export function resolveInput(
  name: string,
  unit: string,
  input: InputEstimate,
  where: string,
): ResolvedInput {
  const at = `${where}: '${name}'`;
  const num = (v: Amount, field: string) => {
    const x = toCanonical(v, unit, `${at} ${field}`);
    if (!Number.isFinite(x)) throw new RangeError(`${at}: expected a finite ${field}, got ${x}`);
    return x;
  };
  const dofOf = (d: number | undefined) => {
    if (d === undefined) return Infinity;
    if (!(d > 0)) throw new RangeError(`${at}: expected degrees of freedom > 0, got ${d}`);
    return d;
  };
  if (!isUncertainInput(input)) {
    const value = num(input as QuantityInput as Amount, "value");
    return {
      name,
      kind: "exact",
      estimate: value,
      standardUncertainty: 0,
      dof: Infinity,
      lower: value,
      upper: value,
      mode: value,
    };
  }
  switch (input.kind) {
    case "exact": {
      const v = num(input.value, "value");
      return {
        name,
        kind: "exact",
        estimate: v,
        standardUncertainty: 0,
        dof: Infinity,
        lower: v,
        upper: v,
        mode: v,
      };
    }
    case "normal":
    case "studentT": {
      const v = num(input.value, "value");
      const u = toCanonical(input.standardUncertainty, unit, `${at} standard uncertainty`);
      if (!(u >= 0) || !Number.isFinite(u)) {
        throw new RangeError(`${at}: expected a standard uncertainty >= 0, got ${u}`);
      }
      const dof = dofOf(input.dof);
      return {
        name,
        kind: input.kind,
        estimate: v,
        standardUncertainty: u,
        dof,
        lower: v,
        upper: v,
        mode: v,
      };
    }
    case "rectangular":
    case "arcsine":
    case "triangular": {
      const a = num(input.lower, "lower bound");
      const b = num(input.upper, "upper bound");
      if (!(b >= a)) {
        throw new RangeError(`${at}: expected upper bound >= lower bound ${a}, got ${b}`);
      }
      const dof = dofOf(input.dof);
      if (input.kind === "rectangular") {
        return {
          name,
          kind: "rectangular",
          estimate: (a + b) / 2,
          standardUncertainty: (b - a) / Math.sqrt(12),
          dof,
          lower: a,
          upper: b,
          mode: (a + b) / 2,
        };
      }
      if (input.kind === "arcsine") {
        return {
          name,
          kind: "arcsine",
          estimate: (a + b) / 2,
          standardUncertainty: (b - a) / (2 * Math.SQRT2),
          dof,
          lower: a,
          upper: b,
          mode: (a + b) / 2,
        };
      }
      const c = input.mode === undefined ? (a + b) / 2 : num(input.mode, "mode");
      if (!(c >= a && c <= b)) {
        throw new RangeError(`${at}: expected the mode in [${a}, ${b}], got ${c}`);
      }
      const variance = (a * a + b * b + c * c - a * b - a * c - b * c) / 18;
      return {
        name,
        kind: "triangular",
        estimate: (a + b + c) / 3,
        standardUncertainty: Math.sqrt(variance),
        dof,
        lower: a,
        upper: b,
        mode: c,
      };
    }
  }
}
