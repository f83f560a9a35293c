/**
 * Charts of uncertainty results: the Monte Carlo histogram with the GUM normal curve overlaid,
 * the uncertainty budget, and sensitivity curves.
 *
 * @module
 */
import type { Propagation } from "../calc/uncertainty/types.ts";
import { densityHistogram, gumDensity, histogramRange } from "../calc/uncertainty/histogram.ts";
import type { SensitivityCurve } from "../calc/core/sensitivity.ts";
import { labelWithUnit } from "../display/uncertainty.ts";
import { formatNumber, formatShare } from "../display/format.ts";
import { withUnit } from "../calc/core/text.ts";
import { Chart, type ChartFootnotes, footnotesWith } from "./chart.ts";

/** Options of {@linkcode histogramChart}. */
export interface HistogramOptions extends ChartFootnotes {
  /** Output to show. @default the first output */
  readonly output?: string;
  /** GUM result for the same calculation: its normal curve and interval are overlaid. */
  readonly gum?: Propagation;
  /** Number of bins. @default 60 */
  readonly bins?: number;
  /** Width in pixels. @default 480 */
  readonly width?: number;
}

/**
 * Histogram of the Monte Carlo model values, as a probability density, with the GUM Gaussian
 * N(y, u_c²) overlaid and both coverage intervals marked. The result's cautions (the clinical
 * caution of a clinical calculation, a model's "not verified" mark) are the chart's footnotes.
 *
 * @param mc A Monte Carlo result (with samples).
 * @param options Output, GUM overlay, bins, further footnotes.
 * @returns The chart.
 * @throws {TypeError} For an unknown output or a result without samples.
 *
 * @example
 * ```ts
 * import { expressionModel, normal, propagate } from "@sonorigor/sonorigor";
 * import { histogramChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * const inputs = { v: normal(4, 0.2) };
 * const mc = propagate(model, inputs, { method: "monteCarlo", trials: 10_000, seed: 1 });
 * const chart = histogramChart(mc, { gum: propagate(model, inputs) });
 * assert.match(await chart.toSVG(), /<path/);
 * ```
 */
export function histogramChart(mc: Propagation, options: HistogramOptions = {}): Chart {
  const name = options.output ?? mc.outputNames[0]!;
  const o = mc.outputs[name];
  if (!o) {
    throw new TypeError(
      `Histogram: unknown output '${name}'; expected one of ${mc.outputNames.join(", ")}`,
    );
  }
  if (mc.method !== "monteCarlo" || o.samples === null) {
    throw new TypeError(
      `Histogram: expected a Monte Carlo result with its samples, got ${
        mc.method === "gum" ? "a GUM result" : "a result without samples (keepSamples was false)"
      }`,
    );
  }
  const g = options.gum?.outputs[name];
  const range = histogramRange(o, ...(g && g.standardUncertainty > 0 ? [g.interval] : []));
  const bars = densityHistogram(o.samples, range, options.bins ?? 60).map((b) => ({
    ...b,
    series: "Monte Carlo",
  }));
  const layers: Record<string, unknown>[] = [{
    data: { values: bars },
    mark: { type: "rect", color: "#9ecae1" },
    encoding: {
      x: {
        field: "start",
        type: "quantitative",
        title: labelWithUnit(o.label, o.unit),
        scale: { zero: false },
      },
      x2: { field: "end" },
      y: { field: "density", type: "quantitative", title: "probability density" },
    },
  }];
  const rules: Record<string, unknown>[] = [
    { value: o.interval.lower, label: "Monte Carlo interval" },
    { value: o.interval.upper, label: "Monte Carlo interval" },
  ];
  if (g && g.standardUncertainty > 0) {
    const curve = gumDensity(g, range);
    layers.push({
      data: { values: curve },
      mark: { type: "line", color: "#d62728", strokeWidth: 2 },
      encoding: {
        x: { field: "x", type: "quantitative" },
        y: { field: "density", type: "quantitative" },
      },
    });
    rules.push({ value: g.interval.lower, label: "GUM interval" }, {
      value: g.interval.upper,
      label: "GUM interval",
    });
  }
  layers.push({
    data: { values: rules },
    mark: { type: "rule", strokeDash: [4, 3] },
    encoding: {
      x: { field: "value", type: "quantitative" },
      color: {
        field: "label",
        type: "nominal",
        title: null,
        scale: { domain: ["Monte Carlo interval", "GUM interval"], range: ["#08519c", "#d62728"] },
        legend: { orient: "bottom", labelLimit: 400 },
      },
    },
  });
  const title = `${mc.calculation.title}: ${o.label}, ${mc.monteCarlo!.trials} trials${
    g ? " with the GUM normal curve" : ""
  }`;
  return new Chart(
    { title, width: options.width ?? 480, height: 260, layer: layers },
    { title, ...footnotesWith(options, mc.cautions) },
  );
}

/** Options of {@linkcode budgetChart}. */
export interface BudgetChartOptions extends ChartFootnotes {
  /** Output to show. @default the first output */
  readonly output?: string;
}

/**
 * Bar chart of an uncertainty budget: each input's share of the combined variance, with the
 * result's cautions as footnotes.
 *
 * @param result A GUM result.
 * @param options Output and further footnotes.
 * @returns The chart.
 * @throws {TypeError} For an unknown output or a Monte Carlo result.
 *
 * @example
 * ```ts
 * import { expressionModel, normal, propagate } from "@sonorigor/sonorigor";
 * import { budgetChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "a * b",
 *   inputs: { a: { unit: "1", description: "a", range: { min: 0, max: 9 } }, b: { unit: "1", description: "b", range: { min: 0, max: 9 } } },
 *   output: { name: "y", unit: "1", description: "y" },
 * });
 * const chart = budgetChart(propagate(model, { a: normal(2, 0.1), b: normal(3, 0.3) }));
 * assert.equal((chart.content.data as { values: unknown[] }).values.length, 2);
 * ```
 */
export function budgetChart(result: Propagation, options: BudgetChartOptions = {}): Chart {
  const name = options.output ?? result.outputNames[0]!;
  const o = result.outputs[name];
  if (!o) {
    throw new TypeError(
      `Budget chart: unknown output '${name}'; expected one of ${result.outputNames.join(", ")}`,
    );
  }
  if (result.method !== "gum") {
    throw new TypeError(
      `Budget chart: expected a GUM result (Monte Carlo has no budget), got ${result.method}`,
    );
  }
  const values = o.budget.map((b) => ({
    source: labelWithUnit(b.label, b.unit),
    sharePercent: 100 * b.share,
    shareText: formatShare(b.share),
  }));
  const title = `${result.calculation.title}: variance shares of ${o.label}`;
  return new Chart({
    title,
    width: 420,
    data: { values },
    mark: "bar",
    encoding: {
      y: {
        field: "source",
        type: "nominal",
        sort: "-x",
        title: null,
        // a long source label (a model with its provenance) is cut at 300 px; the tooltip has it all
        axis: { labelLimit: 300 },
      },
      x: {
        field: "sharePercent",
        type: "quantitative",
        title: `Share of the variance of ${o.label} (%)`,
      },
      tooltip: [
        { field: "source", title: "Source" },
        { field: "shareText", title: `Share of the variance of ${o.label}` },
      ],
    },
  }, { title, ...footnotesWith(options, result.cautions) });
}

/** Options of {@linkcode sensitivityChart}. */
export interface SensitivityChartOptions extends ChartFootnotes {
  /** Plot the change relative to each curve's value at its reference inputs, in percent
   * (`relativeChangePercent`, the package's one definition); false plots the output values.
   * @default true */
  readonly relative?: boolean;
  /** Start the y axis at zero (a small change then looks flat); by default the axis spans the
   * curves' values. @default false */
  readonly zeroBased?: boolean;
  /** Legend label of each curve. @default "<calculation title>: <output label>" */
  readonly labels?: readonly string[];
  /** Chart title. @default "Sensitivity of <output> to <input>" */
  readonly title?: string;
}

/**
 * Line chart of one or more sensitivity curves (same swept input): by default the change of the
 * output relative to its value at the reference inputs, in percent, on an axis that spans the
 * change (zero-based only on request), the reference point named in the axis title; or the
 * output values. The clinical caution is the footnote (on by default).
 *
 * Formula: change = 100·(y − y_ref)/|y_ref| % (`relativeChangePercent`), y_ref the output at the
 * reference inputs (`curve.reference`).
 *
 * @param curves Curves from `sensitivityCurve` (the first names the axes).
 * @param options Relative or absolute, zero-based axis, legend labels, title, footnotes.
 * @returns The chart.
 * @throws {RangeError} For an empty list of curves.
 *
 * @example
 * ```ts
 * import { expressionModel, sensitivityCurve } from "@sonorigor/sonorigor";
 * import { sensitivityChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * const chart = sensitivityChart([sensitivityCurve(model, { v: 4 }, { vary: "v", from: 3, to: 5, steps: 3 })]);
 * // (5/4)² − 1 = +56.25 % (hand computation)
 * const values = (chart.content.data as { values: { y: number }[] }).values;
 * assert.equal(values.at(-1)!.y, 56.25);
 * assert.match(await chart.toSVG(), /relative to its value at Peak velocity = 4 m\/s/);
 * ```
 */
export function sensitivityChart(
  curves: readonly SensitivityCurve[],
  options: SensitivityChartOptions = {},
): Chart {
  if (curves.length === 0) {
    throw new RangeError(`Sensitivity chart: expected at least one curve, got 0`);
  }
  const first = curves[0]!;
  const relative = options.relative ?? true;
  const output = labelWithUnit(first.outputLabel, first.outputUnit);
  const input = labelWithUnit(first.inputLabel, first.inputUnit);
  const values = curves.flatMap((c, i) =>
    c.points.map((p) => ({
      x: p.x,
      y: relative ? p.relativeChangePercent : p.y,
      curve: options.labels?.[i] ?? `${c.title}: ${c.outputLabel}`,
      xText: formatNumber(p.x),
      yText: formatNumber(p.y),
      changeText: `${formatNumber(p.relativeChangePercent, 3)} %`,
    }))
  );
  const at = `${first.inputLabel} = ${withUnit(formatNumber(first.reference.x), first.inputUnit)}`;
  const title = options.title ?? `Sensitivity of ${first.outputLabel} to ${first.inputLabel}`;
  return new Chart({
    title,
    width: 480,
    height: 280,
    data: { values },
    mark: { type: "line", point: { size: 12 } },
    encoding: {
      x: { field: "x", type: "quantitative", title: input, scale: { zero: false } },
      y: {
        field: "y",
        type: "quantitative",
        title: relative
          ? `Change of ${first.outputLabel} relative to its value at ${at} (%)`
          : output,
        scale: { zero: options.zeroBased ?? false },
      },
      color: {
        field: "curve",
        type: "nominal",
        title: null,
        legend: curves.length > 1 ? { orient: "bottom", labelLimit: 400 } : null,
      },
      tooltip: [
        { field: "curve", title: "Curve" },
        { field: "xText", title: input },
        { field: "yText", title: output },
        { field: "changeText", title: `Change relative to its value at ${at}` },
      ],
    },
  }, { title, ...footnotesWith(options) });
}
