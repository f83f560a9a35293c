/**
 * Sensitivity charts for Doppler hemodynamics: velocity and gradient underestimation against the
 * insonation angle, continuity valve-area error against LVOT diameter error, and the probability
 * of each severity class. The data come from the calculation module
 * ({@linkcode angleUnderestimationData}, {@linkcode valveAreaDiameterErrorData},
 * {@linkcode gradeSeverity}); axis titles and legends are quantity labels with units. Nothing is
 * computed here.
 *
 * @module
 */
import { Chart, type ChartFootnotes, footnotesWith } from "./chart.ts";
import {
  angleUnderestimationData,
  type AngleUnderestimationOptions,
  valveAreaDiameterErrorData,
  type ValveAreaDiameterErrorOptions,
} from "../calc/doppler/measurement_error.ts";
import type { SeverityDistribution } from "../calc/grading/types.ts";
import {
  DOPPLER_UNDERESTIMATION,
  LVOT_DIAMETER_ERROR,
  VALVE_AREA_ERROR,
} from "../calc/quantities/flow.ts";
import { LVOT_DIAMETER } from "../calc/quantities/structure.ts";
import { INSONATION_ANGLE } from "../calc/quantities/ultrasound.ts";
import type { Quantity } from "../calc/core/types.ts";
import { labelWithUnit } from "../display/uncertainty.ts";
import { formatShare } from "../display/format.ts";
import { withUnit } from "../calc/core/text.ts";

function axisTitle(q: Pick<Quantity, "label" | "unit">): string {
  return labelWithUnit(q.label, q.unit);
}

/**
 * Chart: how much a Doppler velocity and the Bernoulli gradient built on it are underestimated
 * when the beam meets the flow at an angle (velocity by 1 − cos θ, gradient by 1 − cos²θ), with a
 * rule at 20°, below which the velocity error stays under about 6 %.
 *
 * Source of the relation: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 1985, ch. 2.
 *
 * @param options Largest angle and step (as {@linkcode angleUnderestimationData}), title and
 * footnotes (the clinical caution is on by default).
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {RangeError} As {@linkcode angleUnderestimationData}.
 *
 * @example
 * ```ts
 * import { angleUnderestimationChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = angleUnderestimationChart({ maxAngleDeg: 45, stepDeg: 5 });
 * const svg = await chart.toSVG();
 * assert.match(svg, /Insonation angle \(°\)/);
 * assert.match(svg, /Gradient underestimation/);
 * ```
 */
export function angleUnderestimationChart(
  options: AngleUnderestimationOptions & ChartFootnotes & { readonly title?: string } = {},
): Chart {
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
          x: { field: "angleDeg", type: "quantitative", title: axisTitle(INSONATION_ANGLE) },
          y: {
            field: "underestimationPercent",
            type: "quantitative",
            title: axisTitle(DOPPLER_UNDERESTIMATION),
          },
          color: { field: "label", type: "nominal", title: null },
        },
      },
      {
        data: { values: [{ angleDeg: 20 }] },
        mark: { type: "rule", strokeDash: [4, 4], color: "gray" },
        encoding: { x: { field: "angleDeg", type: "quantitative" } },
      },
    ],
  }, { title, ...footnotesWith(options) });
}

/**
 * Chart: the percentage error of the continuity aortic valve area against the error in the LVOT
 * diameter, one curve per true diameter. The diameter is squared, so a 1 mm error in a 2 cm LVOT
 * moves the area by about 10 %, more for small outflow tracts.
 *
 * Source of the relation: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (continuity
 * equation and its main error source).
 *
 * @param options Diameters, error range and step (as {@linkcode valveAreaDiameterErrorData}),
 * title and footnotes (the clinical caution is on by default).
 * @returns The chart (vega-lite spec and static SVG).
 * @throws {RangeError} | {TypeError} As {@linkcode valveAreaDiameterErrorData}.
 *
 * @example
 * ```ts
 * import { valveAreaDiameterErrorChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const svg = await valveAreaDiameterErrorChart().toSVG();
 * assert.match(svg, /LVOT diameter error \(mm\)/);
 * assert.match(svg, /Valve-area error \(%\)/);
 * ```
 */
export function valveAreaDiameterErrorChart(
  options: ValveAreaDiameterErrorOptions & ChartFootnotes & { readonly title?: string } = {},
): Chart {
  const title = options.title ?? "Continuity valve-area error vs LVOT diameter error";
  const values = valveAreaDiameterErrorData(options);
  return new Chart({
    title,
    width: 420,
    height: 280,
    data: { values },
    mark: { type: "line", point: false },
    encoding: {
      x: { field: "diameterErrorMm", type: "quantitative", title: axisTitle(LVOT_DIAMETER_ERROR) },
      y: { field: "areaErrorPercent", type: "quantitative", title: axisTitle(VALVE_AREA_ERROR) },
      color: { field: "lvotDiameterCm", type: "nominal", title: axisTitle(LVOT_DIAMETER) },
    },
  }, { title, ...footnotesWith(options) });
}

/**
 * Chart: the probability of each severity class of a graded distribution, in table order, with
 * the class of the median named in the title. The result's cautions (its "from memory" mark where
 * the thresholds were recalled, and the clinical caution) are the chart's footnotes.
 *
 * @param distribution A result of `gradeSeverity(table, uncertainValue)` or of samples.
 * @param options Title and further footnotes.
 * @returns The chart (bar per class).
 * @throws {TypeError} When `distribution` has no class probabilities.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, gradeSeverity } from "@sonorigor/sonorigor";
 * import { severityProbabilityChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 1.1, 1.2, 1.6]);
 * const chart = severityProbabilityChart(d);
 * assert.match(await chart.toSVG(), /Class: Aortic valve area \(cm²\)/);
 * // the 2017 thresholds were recalled from memory: the mark travels with the chart
 * assert.ok(chart.footnotes.some((f) => f.includes("from memory")));
 * ```
 */
export function severityProbabilityChart(
  distribution: SeverityDistribution,
  options: ChartFootnotes & { readonly title?: string } = {},
): Chart {
  if (!distribution || !Array.isArray(distribution.probabilities)) {
    throw new TypeError(
      "Severity probability chart: expected a graded distribution with 'probabilities', got " +
        typeof distribution,
    );
  }
  const q = distribution.table.quantity;
  const title = options.title ??
    `${distribution.table.title}: probability of each class (median → ${distribution.grade})`;
  const order = distribution.probabilities.map((p) => p.grade);
  return new Chart({
    title,
    width: 360,
    height: 220,
    data: {
      values: distribution.probabilities.map((p) => ({
        grade: p.grade,
        threshold: withUnit(p.printed, q.unit),
        probability: p.probability,
        share: formatShare(p.probability),
      })),
    },
    mark: { type: "bar" },
    encoding: {
      x: {
        field: "grade",
        type: "nominal",
        sort: order,
        title: `Class: ${axisTitle(q)}`,
        axis: { labelAngle: 0 },
      },
      y: {
        field: "probability",
        type: "quantitative",
        title: "Probability",
        scale: { domain: [0, 1] },
      },
      tooltip: [
        { field: "grade", title: "Class" },
        { field: "threshold", title: "Threshold (as printed)" },
        { field: "share", title: "Probability" },
      ],
    },
  }, { title, ...footnotesWith(options, distribution.cautions) });
}
