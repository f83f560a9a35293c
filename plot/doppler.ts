/**
 * Sensitivity charts for Doppler hemodynamics: velocity and gradient underestimation against the
 * insonation angle, continuity valve-area error against LVOT diameter error, and the probability
 * of each severity class. The numbers come from the calculations themselves
 * ({@linkcode insonationAngleEffect}, {@linkcode continuityValveArea}, {@linkcode gradeSeverity});
 * no formula is written here.
 *
 * @module
 */
import { Chart } from "./chart.ts";
import { evaluate } from "../calc/core/define.ts";
import { insonationAngleEffect } from "../calc/doppler/angle.ts";
import { continuityValveArea } from "../calc/doppler/valve_area.ts";
import type { SeverityDistribution } from "../calc/doppler/grading.ts";

function checkPositive(
  where: string,
  name: string,
  value: number,
  max: number,
  unit: string,
): void {
  if (!(value > 0 && value <= max)) {
    throw new RangeError(`${where}: expected '${name}' in (0, ${max}] ${unit}, got ${value}`);
  }
}

/** Evenly spaced values from `start` to `stop` inclusive with step `step` (no float drift). */
function grid(start: number, stop: number, step: number): number[] {
  const n = Math.round((stop - start) / step);
  return Array.from({ length: n + 1 }, (_, i) => Number((start + i * step).toFixed(10)));
}

/** One point of the angle-underestimation curve. */
export interface AngleUnderestimationPoint {
  /** Insonation angle, degrees. */
  readonly angleDeg: number;
  /** "velocity" or "gradient". */
  readonly quantity: "velocity" | "gradient";
  /** Shortfall of the displayed value relative to the true value, %. */
  readonly underestimationPercent: number;
}

/** Options of {@linkcode angleUnderestimationChart}. */
export interface AngleUnderestimationOptions {
  /** Largest angle shown, degrees, in (0, 89]. @default 60 */
  readonly maxAngleDeg?: number;
  /** Angle step, degrees, in (0, 10]. @default 1 */
  readonly stepDeg?: number;
  /** Chart title. @default "Doppler underestimation vs insonation angle" */
  readonly title?: string;
}

/**
 * The data behind {@linkcode angleUnderestimationChart}: velocity and gradient underestimation
 * (%) from {@linkcode insonationAngleEffect} on a grid of angles.
 *
 * @param options Largest angle and step.
 * @returns Points for both quantities, angle ascending.
 * @throws {RangeError} For a largest angle outside (0, 89] or a step outside (0, 10] degrees.
 *
 * @example
 * ```ts
 * import { angleUnderestimationData } from "@sonorigor/sonorigor/plot";
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
  const where = "Angle underestimation chart";
  const maxAngleDeg = options.maxAngleDeg ?? 60;
  const stepDeg = options.stepDeg ?? 1;
  checkPositive(where, "maxAngleDeg", maxAngleDeg, 89, "deg");
  checkPositive(where, "stepDeg", stepDeg, 10, "deg");
  const rows: AngleUnderestimationPoint[] = [];
  for (const angleDeg of grid(0, maxAngleDeg, stepDeg)) {
    // The underestimation is independent of the velocity itself; 1 m/s is a placeholder reading.
    const r = evaluate(insonationAngleEffect, { measuredVelocity: 1, angleDeg }).outputs;
    rows.push({
      angleDeg,
      quantity: "velocity",
      underestimationPercent: r.velocityUnderestimationPercent,
    });
    rows.push({
      angleDeg,
      quantity: "gradient",
      underestimationPercent: r.gradientUnderestimationPercent,
    });
  }
  return rows;
}

/**
 * Chart: how much a Doppler velocity and the Bernoulli gradient built on it are underestimated
 * when the beam meets the flow at an angle (velocity by 1 − cos θ, gradient by 1 − cos²θ), with a
 * rule at 20°, below which the velocity error stays under about 6 %.
 *
 * Source of the relation: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 1985, ch. 2.
 *
 * @param options Largest angle, step and title.
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {RangeError} As {@linkcode angleUnderestimationData}.
 *
 * @example
 * ```ts
 * import { angleUnderestimationChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = angleUnderestimationChart({ maxAngleDeg: 45, stepDeg: 5 });
 * assert.match(await chart.toSVG(), /^<svg/);
 * ```
 */
export function angleUnderestimationChart(options: AngleUnderestimationOptions = {}): Chart {
  const title = options.title ?? "Doppler underestimation vs insonation angle";
  const values = angleUnderestimationData(options);
  return new Chart({
    title,
    width: 420,
    height: 280,
    layer: [
      {
        data: { values },
        mark: { type: "line" },
        encoding: {
          x: { field: "angleDeg", type: "quantitative", title: "Insonation angle θ (degrees)" },
          y: {
            field: "underestimationPercent",
            type: "quantitative",
            title: "Underestimation of the true value (%)",
          },
          color: { field: "quantity", type: "nominal", title: "Quantity" },
        },
      },
      {
        data: { values: [{ angleDeg: 20 }] },
        mark: { type: "rule", strokeDash: [4, 4], color: "gray" },
        encoding: { x: { field: "angleDeg", type: "quantitative" } },
      },
    ],
  }, { title });
}

/** One point of the valve-area error curve. */
export interface ValveAreaErrorPoint {
  /** True LVOT diameter, cm. */
  readonly lvotDiameterCm: number;
  /** Error in the measured diameter, mm. */
  readonly diameterErrorMm: number;
  /** Resulting error in the continuity valve area, % of the true area. */
  readonly areaErrorPercent: number;
}

/** Options of {@linkcode valveAreaDiameterErrorChart}. */
export interface ValveAreaDiameterErrorOptions {
  /** True LVOT diameters, one curve each, cm. @default [1.8, 2.0, 2.2] */
  readonly lvotDiametersCm?: readonly number[];
  /** Largest absolute diameter error, mm, in (0, 5]. @default 3 */
  readonly maxErrorMm?: number;
  /** Error step, mm, in (0, 1]. @default 0.25 */
  readonly stepMm?: number;
  /** Chart title. @default "Continuity valve-area error vs LVOT diameter error" */
  readonly title?: string;
}

/**
 * The data behind {@linkcode valveAreaDiameterErrorChart}: percentage error in the continuity
 * valve area ({@linkcode continuityValveArea}) when the LVOT diameter is mis-measured by a given
 * number of millimetres (VTIs held fixed; the error does not depend on them).
 *
 * @param options Diameters, error range and step.
 * @returns Points per diameter, error ascending.
 * @throws {RangeError} For a diameter outside (0, 5] cm, an error range outside (0, 5] mm, a step
 * outside (0, 1] mm, or a diameter the error would make non-positive.
 *
 * @example
 * ```ts
 * import { valveAreaDiameterErrorData } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const rows = valveAreaDiameterErrorData({ lvotDiametersCm: [2.0], maxErrorMm: 1, stepMm: 1 });
 * // (2.1/2.0)² − 1 = +10.25 %, (1.9/2.0)² − 1 = −9.75 %
 * assert.deepEqual(rows.map((r) => Number(r.areaErrorPercent.toFixed(2))), [-9.75, 0, 10.25]);
 * ```
 */
export function valveAreaDiameterErrorData(
  options: ValveAreaDiameterErrorOptions = {},
): ValveAreaErrorPoint[] {
  const where = "Valve-area error chart";
  const diameters = options.lvotDiametersCm ?? [1.8, 2.0, 2.2];
  const maxErrorMm = options.maxErrorMm ?? 3;
  const stepMm = options.stepMm ?? 0.25;
  checkPositive(where, "maxErrorMm", maxErrorMm, 5, "mm");
  checkPositive(where, "stepMm", stepMm, 1, "mm");
  if (!Array.isArray(diameters) || diameters.length === 0) {
    throw new TypeError(
      `${where}: expected 'lvotDiametersCm' as a non-empty array, got ${String(diameters)}`,
    );
  }
  const vtis = { lvotVtiCm: 20, avVtiCm: 80 };
  const rows: ValveAreaErrorPoint[] = [];
  diameters.forEach((d, i) => {
    checkPositive(where, `lvotDiametersCm[${i}]`, d, 5, "cm");
    if (!(d - maxErrorMm / 10 > 0)) {
      throw new RangeError(
        `${where}: expected 'maxErrorMm' below the diameter ${d * 10} mm, got ${maxErrorMm}`,
      );
    }
    const truth = evaluate(continuityValveArea, { lvotDiameterCm: d, ...vtis }).outputs.avaCm2;
    for (const e of grid(-maxErrorMm, maxErrorMm, stepMm)) {
      const measured =
        evaluate(continuityValveArea, { lvotDiameterCm: d + e / 10, ...vtis }).outputs.avaCm2;
      rows.push({
        lvotDiameterCm: d,
        diameterErrorMm: e,
        areaErrorPercent: 100 * (measured / truth - 1),
      });
    }
  });
  return rows;
}

/**
 * Chart: the percentage error of the continuity aortic valve area against the error in the LVOT
 * diameter, one curve per true diameter. The diameter is squared, so a 1 mm error in a 2 cm LVOT
 * moves the area by about 10 %, more for small outflow tracts.
 *
 * Source of the relation: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (continuity
 * equation and its main error source).
 *
 * @param options Diameters, error range, step and title.
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {RangeError} | {TypeError} As {@linkcode valveAreaDiameterErrorData}.
 *
 * @example
 * ```ts
 * import { valveAreaDiameterErrorChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * assert.match(await valveAreaDiameterErrorChart().toSVG(), /^<svg/);
 * ```
 */
export function valveAreaDiameterErrorChart(options: ValveAreaDiameterErrorOptions = {}): Chart {
  const title = options.title ?? "Continuity valve-area error vs LVOT diameter error";
  const values = valveAreaDiameterErrorData(options).map((r) => ({
    ...r,
    series: `LVOT ${r.lvotDiameterCm} cm`,
  }));
  return new Chart({
    title,
    width: 420,
    height: 280,
    data: { values },
    mark: { type: "line", point: false },
    encoding: {
      x: { field: "diameterErrorMm", type: "quantitative", title: "LVOT diameter error (mm)" },
      y: { field: "areaErrorPercent", type: "quantitative", title: "Valve-area error (%)" },
      color: { field: "series", type: "nominal", title: "True diameter" },
    },
  }, { title });
}

/**
 * Chart: the probability of each severity class from a graded Monte Carlo distribution, with the
 * class of the median named in the title.
 *
 * @param distribution A result of `gradeSeverity(table, samples)`.
 * @param options Title.
 * @returns The chart (bar per class, in table order).
 * @throws {TypeError} When `distribution` has no class probabilities.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, gradeSeverity } from "@sonorigor/sonorigor";
 * import { severityProbabilityChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 1.1, 1.2, 1.6]);
 * assert.match(await severityProbabilityChart(d).toSVG(), /^<svg/);
 * ```
 */
export function severityProbabilityChart(
  distribution: SeverityDistribution,
  options: { readonly title?: string } = {},
): Chart {
  if (!distribution || !Array.isArray(distribution.probabilities)) {
    throw new TypeError(
      "Severity probability chart: expected a graded distribution with 'probabilities', got " +
        typeof distribution,
    );
  }
  const title = options.title ??
    `Severity class probabilities (median → ${distribution.grade}, n = ${distribution.count})`;
  const order = distribution.probabilities.map((p) => p.grade);
  return new Chart({
    title,
    width: 360,
    height: 220,
    data: {
      values: distribution.probabilities.map((p) => ({
        grade: p.grade,
        threshold: p.printed,
        probability: p.probability,
      })),
    },
    mark: { type: "bar" },
    encoding: {
      x: { field: "grade", type: "nominal", sort: order, title: "Class" },
      y: {
        field: "probability",
        type: "quantitative",
        title: "Probability",
        scale: { domain: [0, 1] },
      },
      tooltip: [{ field: "threshold" }, { field: "probability", format: ".3f" }],
    },
  }, { title });
}
