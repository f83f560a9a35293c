/**
 * Charts of uncertainty results: the Monte Carlo histogram with the GUM normal curve overlaid,
 * the uncertainty budget, and sensitivity curves.
 *
 * @module
 */
import type { GumResult } from "../calc/uncertainty/gum.ts";
import { coverageIntervals, type MonteCarloResult } from "../calc/uncertainty/montecarlo.ts";
import type { SensitivityCurve } from "../calc/core/sensitivity.ts";
import { formatUnit } from "../calc/core/display.ts";
import { Chart } from "./chart.ts";

/** Options of {@linkcode histogramChart}. */
export interface HistogramOptions {
  /** Output to show. @default the first output */
  readonly output?: string;
  /** GUM result for the same calculation: its normal (or scaled t) curve and interval are overlaid. */
  readonly gum?: GumResult;
  /** Number of bins. @default 60 */
  readonly bins?: number;
  /** Width in pixels. @default 480 */
  readonly width?: number;
}

function unitLabel(unit: string): string {
  return unit === "1" ? "" : ` [${formatUnit(unit)}]`;
}

/**
 * Histogram of the Monte Carlo model values, as a probability density, with the GUM Gaussian
 * N(y, u_c²) overlaid and both coverage intervals marked.
 *
 * @param mc A Monte Carlo result (with samples).
 * @param options Output, GUM overlay, bins.
 * @returns The chart.
 * @throws {TypeError} For an unknown output or a result without samples.
 *
 * @example
 * ```ts
 * import { expressionModel, gum, monteCarlo, normal } from "@sonorigor/sonorigor";
 * import { histogramChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * const inputs = { v: normal(4, 0.2) };
 * const chart = histogramChart(monteCarlo(model, inputs, { trials: 10_000, seed: 1 }), { gum: gum(model, inputs) });
 * assert.match(await chart.toSVG(), /<path/);
 * ```
 */
export function histogramChart(mc: MonteCarloResult, options: HistogramOptions = {}): Chart {
  const name = options.output ?? mc.outputNames[0]!;
  const o = mc.outputs[name];
  if (!o) {
    throw new TypeError(
      `Histogram: unknown output '${name}'; expected one of ${mc.outputNames.join(", ")}`,
    );
  }
  const s = o.samples;
  if (s.length === 0) {
    throw new TypeError(
      `Histogram: the Monte Carlo result holds no samples (keepSamples was false)`,
    );
  }
  const bins = options.bins ?? 60;
  // plotting range: the 99.9 % probabilistically symmetric interval, widened to show both intervals
  const wide = coverageIntervals(s, 0.999).symmetric;
  const lo = Math.min(wide[0], o.symmetricInterval[0], o.shortestInterval[0]);
  const hi = Math.max(wide[1], o.symmetricInterval[1], o.shortestInterval[1]);
  const width = (hi - lo) / bins || 1;
  const counts = new Array<number>(bins).fill(0);
  for (let i = 0; i < s.length; i++) {
    const b = Math.floor((s[i]! - lo) / width);
    if (b >= 0 && b < bins) counts[b]!++;
  }
  const bars = counts.map((c, b) => ({
    start: lo + b * width,
    end: lo + (b + 1) * width,
    density: c / (s.length * width),
    series: "Monte Carlo",
  }));
  const layers: Record<string, unknown>[] = [{
    data: { values: bars },
    mark: { type: "rect", color: "#9ecae1" },
    encoding: {
      x: {
        field: "start",
        type: "quantitative",
        title: `${name}${unitLabel(o.unit)}`,
        scale: { zero: false },
      },
      x2: { field: "end" },
      y: { field: "density", type: "quantitative", title: "probability density" },
    },
  }];
  const rules: Record<string, unknown>[] = [
    { value: o.symmetricInterval[0], label: "MC symmetric interval" },
    { value: o.symmetricInterval[1], label: "MC symmetric interval" },
  ];
  const g = options.gum?.outputs[name];
  if (g && g.standardUncertainty > 0) {
    const curve = [];
    for (let k = 0; k <= 200; k++) {
      const x = lo + ((hi - lo) * k) / 200;
      const z = (x - g.value) / g.standardUncertainty;
      curve.push({
        x,
        density: Math.exp(-0.5 * z * z) / (g.standardUncertainty * Math.sqrt(2 * Math.PI)),
      });
    }
    layers.push({
      data: { values: curve },
      mark: { type: "line", color: "#d62728", strokeWidth: 2 },
      encoding: {
        x: { field: "x", type: "quantitative" },
        y: { field: "density", type: "quantitative" },
      },
    });
    rules.push({ value: g.interval[0], label: "GUM interval" }, {
      value: g.interval[1],
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
        scale: { domain: ["MC symmetric interval", "GUM interval"], range: ["#08519c", "#d62728"] },
        legend: { orient: "bottom", labelLimit: 400 },
      },
    },
  });
  const title = `${mc.title}: ${name}, ${mc.trials} trials${g ? " with GUM normal curve" : ""}`;
  return new Chart({ title, width: options.width ?? 480, height: 260, layer: layers }, { title });
}

/**
 * Bar chart of an uncertainty budget: each input's share of the combined variance.
 *
 * @example
 * ```ts
 * import { expressionModel, gum, normal } from "@sonorigor/sonorigor";
 * import { budgetChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "a * b",
 *   inputs: { a: { unit: "1", description: "a", range: { min: 0, max: 9 } }, b: { unit: "1", description: "b", range: { min: 0, max: 9 } } },
 *   output: { name: "y", unit: "1", description: "y" },
 * });
 * const chart = budgetChart(gum(model, { a: normal(2, 0.1), b: normal(3, 0.3) }));
 * assert.equal((chart.spec.data as { values: unknown[] }).values.length, 2);
 * ```
 */
export function budgetChart(result: GumResult, output?: string): Chart {
  const name = output ?? result.outputNames[0]!;
  const o = result.outputs[name];
  if (!o) {
    throw new TypeError(
      `Budget chart: unknown output '${name}'; expected one of ${result.outputNames.join(", ")}`,
    );
  }
  const values = o.budget.map((b) => ({ input: b.input, sharePercent: 100 * b.share }));
  const title = `${result.title}: variance shares of ${name}`;
  return new Chart({
    title,
    width: 420,
    data: { values },
    mark: "bar",
    encoding: {
      y: { field: "input", type: "nominal", sort: "-x", title: null },
      x: { field: "sharePercent", type: "quantitative", title: "share of u²(y) [%]" },
    },
  }, { title });
}

/**
 * Line chart of one or more sensitivity curves (same swept input), as output values or as the
 * relative change in percent.
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
 * const chart = sensitivityChart([sensitivityCurve(model, { v: 4 }, { vary: "v", from: 3, to: 5 })]);
 * assert.match(await chart.toSVG(), /<svg/);
 * ```
 */
export function sensitivityChart(
  curves: readonly SensitivityCurve[],
  options: {
    readonly relative?: boolean;
    readonly labels?: readonly string[];
    readonly title?: string;
  } = {},
): Chart {
  if (curves.length === 0) {
    throw new RangeError(`Sensitivity chart: expected at least one curve, got 0`);
  }
  const first = curves[0]!;
  const relative = options.relative ?? false;
  const values = curves.flatMap((c, i) =>
    c.points.map((p) => ({
      x: p.x,
      y: relative ? p.relativeChangePercent : p.y,
      curve: options.labels?.[i] ?? `${c.title}: ${c.output}`,
    }))
  );
  const title = options.title ?? `Sensitivity of ${first.output} to ${first.input}`;
  return new Chart({
    title,
    width: 480,
    height: 280,
    data: { values },
    mark: { type: "line" },
    encoding: {
      x: { field: "x", type: "quantitative", title: `${first.input}${unitLabel(first.inputUnit)}` },
      y: {
        field: "y",
        type: "quantitative",
        title: relative
          ? `change of ${first.output} [%]`
          : `${first.output}${unitLabel(first.outputUnit)}`,
      },
      color: {
        field: "curve",
        type: "nominal",
        title: null,
        legend: curves.length > 1 ? { orient: "bottom", labelLimit: 400 } : null,
      },
    },
  }, { title });
}
