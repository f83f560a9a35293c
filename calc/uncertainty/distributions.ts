/**
 * Uncertain inputs: the probability distributions of JCGM 100 §4.2–4.3 and JCGM 101 §6.4, each
 * with its estimate, standard uncertainty and degrees of freedom.
 *
 * Values may be numbers in the input's canonical unit or quantity strings ("2.1 cm"); they are
 * converted when the input is matched to a calculation.
 *
 * @module
 */
import { type QuantityInput, readAmount } from "../core/units.ts";
import { describeValue } from "../core/text.ts";
import type { ValidationIssue } from "../core/types.ts";
import type { Interval, ResolvedDistribution } from "./types.ts";
import { normalQuantile, tQuantile } from "../stats/distributions.ts";

export type { ResolvedDistribution };

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
/** The angle between a beam and a flow whose direction lies anywhere, with equal chance over
 * solid angle, within a cone of half-angle θmax around the beam: density ∝ sin θ on [0, θmax]. */
export interface ConeInput {
  /** Distribution tag. */
  readonly kind: "cone";
  /** Half-angle θmax of the cone, in the input's canonical angle unit or as a quantity string. */
  readonly maxAngle: Amount;
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
  | ConeInput
  | ExactInput;

/** What callers may give for one input: a distribution or an exact value. */
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
      `Type A input: expected at least 2 readings, got ${
        readings?.length ?? describeValue(readings)
      }`,
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

/**
 * The insonation angle when the flow direction is known only to lie within a cone of half-angle
 * θmax around the beam, in three dimensions, with every direction in the cone equally likely
 * (uniform over solid angle): θ has density sin θ / (1 − cos θmax) on [0, θmax], so
 * E[θ] = (sin θmax − θmax·cos θmax)/(1 − cos θmax) and E[cos θ] = (1 + cos θmax)/2 (integrals
 * of the density, elementary calculus). Drawn by inversion: θ = arccos(1 − U·(1 − cos θmax)).
 * Unlike an angle uniform in the image plane, it puts little weight near 0° — the beam is
 * rarely exactly parallel in 3-D — so the mean displayed velocity is lower.
 *
 * @param maxAngle Half-angle θmax of the cone (degrees for a degree input, or "15 deg").
 * @returns The uncertain input.
 *
 * @example θmax = 20°: E[cos θ] = (1 + cos 20°)/2 = 0.96985
 * ```ts
 * import { insonationCone, resolveDistribution } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const d = resolveDistribution(insonationCone(20), "angleDeg", "deg", "Demo").distribution!;
 * // E[θ] = (sin m − m·cos m)/(1 − cos m) = 0.23223 rad = 13.306° for m = 20°
 * assert.ok(Math.abs(d.estimate - 13.306) < 1e-3);
 * ```
 */
export function insonationCone(maxAngle: Amount): ConeInput {
  return { kind: "cone", maxAngle };
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
      k === "studentT" || k === "cone" || k === "exact");
}

/**
 * Resolves a distribution given for one input to canonical numbers: converts every amount to the
 * input's unit and computes the estimate, standard uncertainty and degrees of freedom (JCGM 100
 * §4.3, JCGM 101 §6.4). Problems come back as issues naming the input and the part of the
 * distribution at fault; the estimate's range is checked by the caller.
 *
 * @param input A distribution or an exact value (number or quantity string).
 * @param field The input name.
 * @param unit The canonical unit.
 * @param where Who checks (the calculation title).
 * @param label The input's label, for messages.
 * @returns The resolved distribution, or the issues found.
 *
 * @example
 * ```ts
 * import { rectangular, resolveDistribution } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // u = (b − a)/√12 (JCGM 100:2008 §4.3.7), bounds converted from mm to cm
 * const r = resolveDistribution(rectangular("20 mm", "22 mm"), "d", "cm", "Example");
 * assert.ok(Math.abs(r.distribution!.standardUncertainty - 0.2 / Math.sqrt(12)) < 1e-15);
 * ```
 */
export function resolveDistribution(
  input: InputEstimate,
  field: string,
  unit: string,
  where: string,
  label?: string,
): { distribution?: ResolvedDistribution; issues: ValidationIssue[] } {
  const issues: ValidationIssue[] = [];
  const problem = (
    part: string,
    received: string,
    expected: string,
    kind: "type" | "unit" | "range",
  ) =>
    issues.push({
      kind,
      severity: "error",
      where,
      field,
      ...(label !== undefined && label !== field ? { label } : {}),
      ...(part === "" ? {} : { part }),
      received,
      unit,
      expected,
    });
  const amount = (v: unknown, part: string, finiteOnly = true): number => {
    const read = readAmount(v, unit);
    if (typeof read !== "number") {
      problem(
        part,
        describeValue(v),
        read.problem === "type"
          ? `as a number or a quantity in ${unit}`
          : `in a unit convertible to ${unit}`,
        read.problem,
      );
      return NaN;
    }
    if (finiteOnly && !Number.isFinite(read)) {
      problem(part, String(read), "as a finite number", "range");
    }
    return read;
  };
  const dofOf = (d: number | undefined): number => {
    if (d === undefined) return Infinity;
    if (!(typeof d === "number" && d > 0)) {
      problem("degrees of freedom", describeValue(d), "> 0", "range");
      return NaN;
    }
    return d;
  };
  const exactly = (v: number): ResolvedDistribution => ({
    kind: "exact",
    estimate: v,
    standardUncertainty: 0,
    dof: Infinity,
    lower: v,
    upper: v,
    mode: v,
  });
  if (!isUncertainInput(input)) {
    // a plain value: the estimate's own check (type, unit, range) is the caller's
    const read = readAmount(input, unit);
    return typeof read === "number" ? { distribution: exactly(read), issues } : { issues };
  }
  switch (input.kind) {
    case "exact": {
      const read = readAmount(input.value, unit);
      return typeof read === "number" ? { distribution: exactly(read), issues } : { issues };
    }
    case "normal":
    case "studentT": {
      const v = readAmount(input.value, unit);
      const u = amount(input.standardUncertainty, "standard uncertainty");
      if (Number.isFinite(u) && !(u >= 0)) {
        problem("standard uncertainty", String(u), ">= 0", "range");
      }
      const dof = dofOf(input.dof);
      if (typeof v !== "number" || issues.length > 0) return { issues };
      return {
        distribution: {
          kind: input.kind,
          estimate: v,
          standardUncertainty: u,
          dof,
          lower: v,
          upper: v,
          mode: v,
        },
        issues,
      };
    }
    case "cone": {
      const m = amount(input.maxAngle, "half-angle of the cone");
      const perUnit = readAmount(`1 ${unit}`, "rad");
      if (typeof perUnit !== "number") {
        issues.push({
          kind: "unit",
          severity: "error",
          where,
          field,
          ...(label !== undefined ? { label } : {}),
          part: "distribution",
          received: `a cone of directions for an input in ${unit}`,
          expected: "a cone distribution only for an angle",
        });
        return { issues };
      }
      const mr = m * perUnit;
      if (Number.isFinite(mr) && !(mr > 0 && mr < Math.PI / 2)) {
        const right = Math.PI / 2 / perUnit;
        problem("half-angle of the cone", String(m), `in (0, ${right}) ${unit}`, "range");
      }
      if (issues.length > 0) return { issues };
      const one = 1 - Math.cos(mr);
      const mean = (Math.sin(mr) - mr * Math.cos(mr)) / one;
      const second = (-mr * mr * Math.cos(mr) + 2 * mr * Math.sin(mr) + 2 * Math.cos(mr) - 2) / one;
      return {
        distribution: {
          kind: "cone",
          estimate: mean / perUnit,
          standardUncertainty: Math.sqrt(Math.max(second - mean * mean, 0)) / perUnit,
          dof: Infinity,
          lower: 0,
          upper: m,
          mode: m,
          radiansPerUnit: perUnit,
        },
        issues,
      };
    }
    case "rectangular":
    case "arcsine":
    case "triangular": {
      const a = amount(input.lower, "lower bound");
      const b = amount(input.upper, "upper bound");
      if (Number.isFinite(a) && Number.isFinite(b) && !(b >= a)) {
        problem("upper bound", String(b), `>= the lower bound ${a}`, "range");
      }
      const dof = dofOf(input.dof);
      const c = input.kind === "triangular" && input.mode !== undefined
        ? amount(input.mode, "mode")
        : (a + b) / 2;
      if (input.kind === "triangular" && Number.isFinite(c) && !(c >= a && c <= b)) {
        problem("mode", String(c), `in [${a}, ${b}]`, "range");
      }
      if (issues.length > 0) return { issues };
      if (input.kind === "rectangular") {
        return {
          distribution: {
            kind: "rectangular",
            estimate: (a + b) / 2,
            standardUncertainty: (b - a) / Math.sqrt(12),
            dof,
            lower: a,
            upper: b,
            mode: (a + b) / 2,
          },
          issues,
        };
      }
      if (input.kind === "arcsine") {
        return {
          distribution: {
            kind: "arcsine",
            estimate: (a + b) / 2,
            standardUncertainty: (b - a) / (2 * Math.SQRT2),
            dof,
            lower: a,
            upper: b,
            mode: (a + b) / 2,
          },
          issues,
        };
      }
      const variance = (a * a + b * b + c * c - a * b - a * c - b * c) / 18;
      return {
        distribution: {
          kind: "triangular",
          estimate: (a + b + c) / 3,
          standardUncertainty: Math.sqrt(variance),
          dof,
          lower: a,
          upper: b,
          mode: c,
        },
        issues,
      };
    }
  }
}

/**
 * An exact value as a resolved distribution (u = 0).
 *
 * @example
 * ```ts
 * import { exactDistribution } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(exactDistribution(1540).standardUncertainty, 0);
 * ```
 */
export function exactDistribution(value: number): ResolvedDistribution {
  return {
    kind: "exact",
    estimate: value,
    standardUncertainty: 0,
    dof: Infinity,
    lower: value,
    upper: value,
    mode: value,
  };
}

/** The quantile function of a resolved distribution, for probability q in (0, 1). */
export function distributionQuantile(d: ResolvedDistribution, q: number): number {
  const { estimate: x, standardUncertainty: u, lower: a, upper: b, mode: c } = d;
  switch (d.kind) {
    case "exact":
      return x;
    case "normal":
      return x + u * normalQuantile(q);
    case "studentT":
      return x + u * tQuantile(q, d.dof);
    case "rectangular":
      return a + q * (b - a);
    case "cone": {
      const k = d.radiansPerUnit!;
      return Math.acos(1 - q * (1 - Math.cos(b * k))) / k;
    }
    case "arcsine":
      return (a + b) / 2 + ((b - a) / 2) * Math.sin(Math.PI * (q - 0.5));
    case "triangular": {
      const w = b - a;
      const fc = w > 0 ? (c - a) / w : 0.5;
      return q < fc ? a + Math.sqrt(q * w * (c - a)) : b - Math.sqrt((1 - q) * w * (b - c));
    }
  }
}

/**
 * The probabilistically symmetric coverage interval of a distribution: its (1 − p)/2 and
 * (1 + p)/2 quantiles (JCGM 101:2008 §5.3.4 for the definition).
 *
 * @param d The distribution.
 * @param coverage Coverage probability p.
 * @returns The interval.
 *
 * @example
 * ```ts
 * import { distributionInterval, rectangular, resolveDistribution } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const d = resolveDistribution(rectangular(0, 10), "x", "1", "Demo").distribution!;
 * // a rectangular distribution on [0, 10]: the central 95 % lie in [0.25, 9.75]
 * const i = distributionInterval(d, 0.95);
 * assert.ok(Math.abs(i.lower - 0.25) < 1e-12 && Math.abs(i.upper - 9.75) < 1e-12);
 * ```
 */
export function distributionInterval(d: ResolvedDistribution, coverage: number): Interval {
  return {
    lower: distributionQuantile(d, (1 - coverage) / 2),
    upper: distributionQuantile(d, (1 + coverage) / 2),
  };
}
