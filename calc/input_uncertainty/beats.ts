/**
 * Beat-to-beat variability: a measurement repeated on several beats, evaluated by Type A (the
 * mean, the standard uncertainty of the mean s/√n, ν = n − 1 degrees of freedom), with a clear
 * warning when so few beats were measured that the uncertainty itself is unreliable.
 *
 * @module
 */
import { issueError, renderIssue } from "../core/issues.ts";
import type { Quantity, ValidationIssue } from "../core/types.ts";
import { checkValue, quantityField } from "../core/validate.ts";
import { describeValue } from "../core/text.ts";
import { type StudentTInput, typeA } from "../uncertainty/distributions.ts";
import { tQuantile } from "../stats/distributions.ts";
import { labelWithUnit } from "../../display/uncertainty.ts";
import { JCGM_100, JCGM_101 } from "./citations.ts";
import { type ModelProvenance, notAnObject, withModelDisplay } from "./shared.ts";

/** The result of {@linkcode repeatedBeats}. */
export interface RepeatedBeats extends ModelProvenance {
  /** The quantity measured. */
  readonly quantity: Quantity;
  /** The readings in the quantity's canonical unit, in beat order. */
  readonly readings: readonly number[];
  /** Number of beats n. */
  readonly beats: number;
  /** Degrees of freedom ν = n − 1. */
  readonly dof: number;
  /** Mean of the readings. */
  readonly mean: number;
  /** Experimental standard deviation s of one beat. */
  readonly standardDeviation: number;
  /** Standard uncertainty of the mean, s/√n. */
  readonly standardUncertainty: number;
  /** The GUM coverage factor for 95 % with ν degrees of freedom, t₀.₉₇₅(ν). */
  readonly coverageFactor95: number;
  /** The input to give `propagate`: `typeA(readings)`. */
  readonly input: StudentTInput;
}

const WHERE = "Repeated beats";

/**
 * A measurement repeated on several beats as a Type A input: the mean of the beats, with the
 * standard uncertainty of the mean and its degrees of freedom.
 *
 * Formula: q̄ = Σqₖ/n; s² = Σ(qₖ − q̄)²/(n − 1); u(q̄) = s/√n; ν = n − 1; the input is
 * `typeA(readings)`, a scaled and shifted t distribution.
 *
 * Source: JCGM 100:2008 §4.2 (Type A evaluation); JCGM 101:2008 §6.4.9 (the t distribution, whose
 * variance is infinite for ν ≤ 2, §6.4.9.4). With ν ≤ 2 (three beats or fewer) the result warns:
 * the Monte Carlo standard uncertainty does not converge and the GUM coverage factor is large
 * (t₀.₉₇₅(2) = 4.30).
 *
 * @param quantity The quantity measured (its valid range checks each reading; its unit reads
 * strings such as "4.1 m/s").
 * @param readings At least two readings, one per beat.
 * @returns The Type A input with n, ν, the mean and the uncertainties; it displays itself.
 * @throws {TypeError} When readings is not an array, or a reading is not a number or a quantity
 * of the right unit.
 * @throws {RangeError} For fewer than two readings, or a reading outside the valid range.
 *
 * @example Three beats: ν = 2, and a warning says what that means
 * ```ts
 * import { PEAK_VELOCITY, repeatedBeats } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const b = repeatedBeats(PEAK_VELOCITY, [4.1, 4.3, 4.2]);
 * assert.equal(b.dof, 2);
 * assert.ok(Math.abs(b.standardUncertainty - 0.1 / Math.sqrt(3)) < 1e-12); // s = 0.1 m/s
 * assert.match(b.warnings[0]!, /ν = 2/);
 * ```
 */
export function repeatedBeats(quantity: Quantity, readings: readonly unknown[]): RepeatedBeats {
  if (
    typeof quantity !== "object" || quantity === null || Array.isArray(quantity) ||
    typeof (quantity as { label?: unknown }).label !== "string"
  ) {
    throw notAnObject(WHERE, "quantity", quantity, "as a quantity (e.g. PEAK_VELOCITY)");
  }
  if (!Array.isArray(readings)) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where: WHERE,
      field: "readings",
      received: describeValue(readings),
      expected: `as an array of ${quantity.label} readings, one per beat`,
    }]);
  }
  if (readings.length < 2) {
    throw issueError([{
      kind: "range",
      severity: "error",
      where: WHERE,
      field: "readings",
      received: `${readings.length} reading${readings.length === 1 ? "" : "s"}`,
      expected: "at least 2 readings (one per beat) for a Type A evaluation",
    }]);
  }
  const field = quantityField(quantity);
  const issues: ValidationIssue[] = [];
  const values = readings.map((r, k) => {
    const checked = checkValue(`readings[${k}]`, field, r, { where: WHERE });
    for (const issue of checked.issues) issues.push(issue);
    return checked.value ?? NaN;
  });
  if (issues.some((i) => i.severity === "error")) throw issueError(issues);
  const input = typeA(values);
  const n = values.length;
  const dof = n - 1;
  const u = Number(input.standardUncertainty);
  const k95 = tQuantile(0.975, dof);
  const warnings = issues.map(renderIssue);
  if (dof <= 2) {
    warnings.unshift(
      `Only ${n} beats (ν = ${dof}): the t distribution of the mean has infinite variance for ν ≤ 2 (JCGM 101:2008 §6.4.9.4), so a Monte Carlo standard uncertainty does not converge, and the 95 % coverage factor is ${
        k95.toFixed(2)
      }; measure at least 4 beats`,
    );
  }
  const result: RepeatedBeats = {
    quantity,
    readings: values,
    beats: n,
    dof,
    mean: Number(input.value),
    standardDeviation: u * Math.sqrt(n),
    standardUncertainty: u,
    coverageFactor95: k95,
    input,
    notes: [
      "Type A evaluation of the mean of the beats: u = s/√n, ν = n − 1 (JCGM 100:2008 §4.2); Monte Carlo draws it from a t distribution (JCGM 101:2008 §6.4.9)",
      "The beats are taken as independent repetitions: a trend (respiration, an arrhythmia) inflates s and is not removed",
    ],
    warnings,
    cautions: [],
    citations: [JCGM_100, JCGM_101],
  };
  return withModelDisplay(
    result,
    `${WHERE}: ${quantity.label}`,
    [
      "Beats n",
      "ν",
      labelWithUnit("Mean", quantity.unit),
      labelWithUnit("s", quantity.unit),
      labelWithUnit("u = s/√n", quantity.unit),
      "k (95 %)",
    ],
    [[
      String(n),
      String(dof),
      { value: result.mean, u },
      { u: result.standardDeviation },
      { u },
      k95,
    ]],
  );
}
