/**
 * How measurement errors move Doppler results, as data for sensitivity charts: the
 * underestimation of velocity and gradient against the insonation angle, and the error of the
 * continuity valve area against the error of the LVOT diameter. Every number comes from the
 * calculations' own definitions through `sensitivityCurve` (inputs validated); no formula is
 * written here.
 *
 * @module
 */
import { defineArguments, type InputRole } from "../core/calculation.ts";
import { issueError, throwIfErrors } from "../core/issues.ts";
import { sensitivityCurve } from "../core/sensitivity.ts";
import { describeValue } from "../core/text.ts";
import type { Quantity } from "../core/types.ts";
import { checkValue, quantityField, validateInputs } from "../core/validate.ts";
import { LVOT_DIAMETER_ERROR } from "../quantities/flow.ts";
import { LVOT_DIAMETER } from "../quantities/structure.ts";
import { INSONATION_ANGLE } from "../quantities/ultrasound.ts";
import { insonationAngleEffect } from "./angle.ts";
import { continuityValveArea } from "./valve_area.ts";

/** A positive option of a curve (its extent or its step), at most `max`. */
function curveOption(
  quantity: Quantity,
  label: string,
  max: number,
  reason: string,
  fallback: number,
): InputRole {
  const range = { min: 0, max, minExclusive: true };
  return { quantity, label, valid: range, typical: range, reason, default: fallback };
}

const ANGLE_CURVE = defineArguments("Angle underestimation curve", {
  maxAngleDeg: curveOption(
    INSONATION_ANGLE,
    "Largest angle",
    89,
    "a curve needs a positive extent, and the reading vanishes at 90°",
    60,
  ),
  stepDeg: curveOption(
    INSONATION_ANGLE,
    "Angle step",
    10,
    "a step above 10° leaves too few points to draw the curve",
    1,
  ),
});

/** One point of the angle-underestimation curve. */
export interface AngleUnderestimationPoint {
  /** Insonation angle, degrees. */
  readonly angleDeg: number;
  /** The output of {@linkcode insonationAngleEffect} followed. */
  readonly output: "velocityUnderestimationPercent" | "gradientUnderestimationPercent";
  /** Its label ("Velocity underestimation", "Gradient underestimation"). */
  readonly label: string;
  /** Shortfall of the displayed value relative to the true value, %. */
  readonly underestimationPercent: number;
}

/** Options of {@linkcode angleUnderestimationData}. */
export interface AngleUnderestimationOptions {
  /** Largest angle, degrees, in (0, 89]. @default 60 */
  readonly maxAngleDeg?: number;
  /** Angle step, degrees, in (0, 10]; the largest angle is divided into equal steps as close to
   * it as possible. @default 1 */
  readonly stepDeg?: number;
}

/** Equal steps from 0 to `extent` as close to `step` as possible: their number. */
function stepsOver(extent: number, step: number): number {
  return Math.max(1, Math.round(extent / step));
}

/** A swept value without floating-point drift (0.1 + 0.2 → 0.3). */
function tidy(x: number): number {
  return Number(x.toFixed(10));
}

/**
 * Velocity and gradient underestimation (%) of {@linkcode insonationAngleEffect} on a grid of
 * insonation angles from 0 to the largest angle: the velocity reads low by 100·(1 − cos θ) %, the
 * Bernoulli gradient by 100·(1 − cos²θ) % (whatever the velocity; 1 m/s is used).
 *
 * Source of the relation: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 1985.
 *
 * @param options Largest angle and step.
 * @returns Points for both outputs, angle ascending.
 * @throws {RangeError} For a largest angle or a step outside its valid range.
 * @throws {TypeError} For an option that is not a number (or an angle string).
 *
 * @example
 * ```ts
 * import { angleUnderestimationData } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const rows = angleUnderestimationData({ maxAngleDeg: 60, stepDeg: 10 });
 * // cos 60° = ½: the velocity reads 50 % low and the gradient 75 % low
 * const at60 = rows.filter((r) => r.angleDeg === 60).map((r) => Math.round(r.underestimationPercent));
 * assert.deepEqual(at60, [50, 75]);
 * ```
 */
export function angleUnderestimationData(
  options: AngleUnderestimationOptions = {},
): AngleUnderestimationPoint[] {
  const { maxAngleDeg, stepDeg } = validateInputs(ANGLE_CURVE, {
    maxAngleDeg: options.maxAngleDeg,
    stepDeg: options.stepDeg,
  }).values;
  const outputs = ["velocityUnderestimationPercent", "gradientUnderestimationPercent"] as const;
  const curves = outputs.map((output) =>
    sensitivityCurve(insonationAngleEffect, { measuredVelocity: 1, angleDeg: 0 }, {
      vary: "angleDeg",
      from: 0,
      to: maxAngleDeg,
      steps: stepsOver(maxAngleDeg, stepDeg) + 1,
      output,
    })
  );
  const rows: AngleUnderestimationPoint[] = [];
  curves[0]!.points.forEach((_, i) => {
    outputs.forEach((output, k) => {
      const p = curves[k]!.points[i]!;
      rows.push({
        angleDeg: tidy(p.x),
        output,
        label: insonationAngleEffect.outputs[output].label,
        underestimationPercent: p.y,
      });
    });
  });
  return rows;
}

const VALVE_AREA_CURVE = defineArguments("Valve-area error curve", {
  maxErrorMm: curveOption(
    LVOT_DIAMETER_ERROR,
    "Largest diameter error",
    5,
    "the curve runs from −max to +max; errors beyond 5 mm are gross mismeasurements",
    3,
  ),
  stepMm: curveOption(
    LVOT_DIAMETER_ERROR,
    "Diameter error step",
    1,
    "a step above 1 mm leaves too few points to draw the curve",
    0.25,
  ),
});

/** One point of the valve-area error curve. */
export interface ValveAreaErrorPoint {
  /** True LVOT diameter, cm. */
  readonly lvotDiameterCm: number;
  /** Error in the measured diameter, mm. */
  readonly diameterErrorMm: number;
  /** Resulting error in the continuity valve area, % of the true area. */
  readonly areaErrorPercent: number;
}

/** Options of {@linkcode valveAreaDiameterErrorData}. */
export interface ValveAreaDiameterErrorOptions {
  /** True LVOT diameters, one curve each, cm. @default [1.8, 2.0, 2.2] */
  readonly lvotDiametersCm?: readonly number[];
  /** Largest absolute diameter error, mm, in (0, 5]. @default 3 */
  readonly maxErrorMm?: number;
  /** Error step, mm, in (0, 1]. @default 0.25 */
  readonly stepMm?: number;
}

/** The checked diameters of the valve-area curve. */
function checkedDiameters(list: unknown): number[] {
  const where = VALVE_AREA_CURVE.title;
  if (!Array.isArray(list) || list.length === 0) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where,
      field: "lvotDiametersCm",
      expected: "as a non-empty array of LVOT diameters",
      received: Array.isArray(list) ? "an empty array" : describeValue(list),
    }]);
  }
  return list.map((d, i) => {
    const r = checkValue(`lvotDiametersCm[${i}]`, quantityField(LVOT_DIAMETER), d, { where });
    throwIfErrors(r.issues);
    return r.value!;
  });
}

/**
 * The percentage error of the continuity valve area ({@linkcode continuityValveArea}) when the LVOT
 * diameter is mis-measured by a given number of millimetres, one curve per true diameter (the VTIs
 * are held fixed: the error does not depend on them). The diameter is squared, so the area error
 * is (1 + δ/d)² − 1.
 *
 * Source of the relation: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (continuity
 * equation and its main error source).
 *
 * @param options Diameters, largest error and step.
 * @returns Points per diameter, error ascending.
 * @throws {RangeError} For a diameter, largest error or step outside its valid range, or a largest
 * error that would make a measured diameter zero or negative.
 * @throws {TypeError} For an empty or missing list of diameters.
 *
 * @example
 * ```ts
 * import { valveAreaDiameterErrorData } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const rows = valveAreaDiameterErrorData({ lvotDiametersCm: [2.0], maxErrorMm: 1, stepMm: 1 });
 * // (2.1/2.0)² − 1 = +10.25 %, (1.9/2.0)² − 1 = −9.75 %
 * assert.deepEqual(rows.map((r) => Number(r.areaErrorPercent.toFixed(2))), [-9.75, 0, 10.25]);
 * ```
 */
export function valveAreaDiameterErrorData(
  options: ValveAreaDiameterErrorOptions = {},
): ValveAreaErrorPoint[] {
  const { maxErrorMm, stepMm } = validateInputs(VALVE_AREA_CURVE, {
    maxErrorMm: options.maxErrorMm,
    stepMm: options.stepMm,
  }).values;
  const diameters = checkedDiameters(options.lvotDiametersCm ?? [1.8, 2.0, 2.2]);
  const smallest = diameters.reduce((m, d) => Math.min(m, d), Infinity);
  if (!(smallest - maxErrorMm / 10 > 0)) {
    throw issueError([{
      kind: "range",
      severity: "error",
      where: VALVE_AREA_CURVE.title,
      field: "maxErrorMm",
      label: VALVE_AREA_CURVE.inputs.maxErrorMm.label,
      expected: `below the smallest LVOT diameter, ${tidy(smallest * 10)} mm`,
      received: String(maxErrorMm),
    }]);
  }
  const vtis = { lvotVtiCm: 20, avVtiCm: 80 };
  const steps = 2 * stepsOver(maxErrorMm, stepMm) + 1;
  return diameters.flatMap((d) =>
    sensitivityCurve(continuityValveArea, { lvotDiameterCm: d, ...vtis }, {
      vary: "lvotDiameterCm",
      from: d - maxErrorMm / 10,
      to: d + maxErrorMm / 10,
      steps,
    }).points.map((p) => ({
      lvotDiameterCm: d,
      diameterErrorMm: tidy(10 * (p.x - d)),
      areaErrorPercent: p.relativeChangePercent,
    }))
  );
}
