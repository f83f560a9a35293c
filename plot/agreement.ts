/**
 * Charts for method validation: the Bland–Altman plot, the method-comparison scatter and the
 * observer plot, and the charts of a method-validation report. Each draws results of the
 * agreement statistics as they are (bias, limits, intervals, fitted lines come from calc); the
 * only arithmetic here is layout (the plotted extent, where a fitted line meets it). Axis titles
 * and legends are labels with units.
 *
 * @module
 */
import { Chart, type ChartFootnotes, footnotesWith, wrapText } from "./chart.ts";
import type { Interval } from "../calc/agreement/checks.ts";
import type { FigurePlan, MethodValidationReport } from "../calc/agreement/report_types.ts";
import { labelWithUnit } from "../display/uncertainty.ts";
import { withUnit } from "../calc/core/text.ts";
import { blandAltmanLevels, differenceUnit, limitName } from "../display/agreement_rows.ts";
import type { BlandAltmanResult, Measured } from "../calc/agreement/types.ts";

/** Options of {@linkcode blandAltmanChart}. */
export interface BlandAltmanChartOptions extends ChartFootnotes {
  /** Chart title. @default "Bland–Altman plot" */
  readonly title?: string;
  /** Which limit intervals to draw as bands: "exact" (Carkeet 2015) or "approximate".
   * @default "exact" */
  readonly bands?: "exact" | "approximate";
}

/** An axis title: "<label>: <what>" with the unit, or the bare description when nothing was
 * stated. */
function axisTitle(
  q: Measured | null | undefined,
  what: string,
  fallback: string,
  unit: (u: string) => string = (u) => u,
): string {
  return q ? labelWithUnit(`${q.label}: ${what}`, unit(q.unit)) : fallback;
}

/** Glyph width of an axis title (11 px bold sans-serif), in pixels, on the wide side so that a
 * line never runs past the axis (layout). */
const AXIS_GLYPH_PX = 7.5;

/** A vertical axis title broken into lines that fit the axis length (a longer title would push
 * the plot down; layout only). */
function fitted(title: string, length: number): string[] {
  return wrapText(title, Math.floor(length / AXIS_GLYPH_PX));
}

/** Colour-blind-safe colours (Okabe M, Ito K (2008) Color Universal Design, the eight-colour
 * palette) and dash patterns, so that lines differ in both colour and style. */
const BLUE = "#0072B2";
const VERMILLION = "#D55E00";
const ORANGE = "#E69F00";
const GREEN = "#009E73";
const GREY = "#595959";
const SOLID: number[] = [1, 0];
const DASHED = [7, 4];
const DASH_DOT = [9, 3, 2, 3];
const DOTTED = [2, 3];
/** The eight colours of Okabe & Ito in the order used for observers (shapes differ as well). */
const OBSERVER_COLOURS = [
  BLUE,
  ORANGE,
  GREEN,
  VERMILLION,
  "#CC79A7",
  "#56B4E9",
  "#000000",
  "#F0E442",
];
/** Styles of fitted lines, in order: solid blue, dash-dotted orange, dotted green. */
const FIT_STYLES = [
  { color: BLUE, dash: SOLID },
  { color: ORANGE, dash: DASH_DOT },
  { color: GREEN, dash: DOTTED },
] as const;

/**
 * Bland–Altman plot: differences against means, with the bias (solid line) and the limits of
 * agreement (dashed lines), each with its value written on it and in the legend (rounded as the
 * result's table shows them), and their confidence intervals as shaded bands in the line's
 * colour; colour-blind-safe colours (Okabe & Ito). Labels come from the result (what was
 * measured, its unit, the method names given to `blandAltman`); differences of a quantity in %
 * are in percentage points.
 *
 * Source: Bland JM, Altman DG (1986) Lancet 327:307–310, Fig. 2 layout;
 * doi:10.1016/S0140-6736(86)90837-8.
 *
 * @param result A {@linkcode BlandAltmanResult} from `blandAltman`.
 * @param options Title, band kind, footnotes (the clinical caution is on by default).
 * @returns The chart.
 *
 * @example
 * ```ts
 * import { blandAltman, EJECTION_FRACTION } from "@sonorigor/sonorigor";
 * import { blandAltmanChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const r = blandAltman([60, 52, 41, 66, 58], [58, 52, 44, 63, 59], {
 *   quantity: EJECTION_FRACTION, methodNames: ["auto", "manual"],
 * });
 * const chart = blandAltmanChart(r);
 * // differences of percentages in percentage points, the bias written on its line
 * const svg = await chart.toSVG();
 * assert.match(svg, /LV ejection fraction: auto − manual \(percentage points\)/);
 * assert.match(svg, />bias 0\.2</); // (2 + 0 − 3 + 3 − 1)/5
 * ```
 */
export function blandAltmanChart(
  result: BlandAltmanResult,
  options: BlandAltmanChartOptions = {},
): Chart {
  const [a, b] = result.methodNames;
  const q = result.quantity;
  const title = options.title ?? "Bland–Altman plot";
  const kind = options.bands ?? "exact";
  const ci = (l: BlandAltmanResult["lowerLimit"]) => kind === "exact" ? l.exactCi : l.approximateCi;
  const points = result.means.map((m, i) => ({ mean: m, difference: result.differences[i]! }));
  // the values as the report's table shows them, written on the lines and in the legend
  const shown = blandAltmanLevels(result);
  const named = (name: string, value: string) =>
    `${name}: ${q ? withUnit(value, differenceUnit(q.unit)) : value}`;
  const biasName = named("Bias", shown.bias);
  const upperName = named(limitName("Upper", result.multiplier), shown.upper);
  const lowerName = named(limitName("Lower", result.multiplier), shown.lower);
  const lines = [
    { line: biasName, y: result.bias, text: `bias ${shown.bias}` },
    { line: upperName, y: result.upperLimit.value, text: `upper limit ${shown.upper}` },
    { line: lowerName, y: result.lowerLimit.value, text: `lower limit ${shown.lower}` },
  ];
  const bands = [
    { line: biasName, lower: result.biasCi.lower, upper: result.biasCi.upper },
    { line: upperName, lower: ci(result.upperLimit).lower, upper: ci(result.upperLimit).upper },
    { line: lowerName, lower: ci(result.lowerLimit).lower, upper: ci(result.lowerLimit).upper },
  ];
  const domain = [biasName, upperName, lowerName];
  const color = {
    field: "line",
    type: "nominal",
    scale: { domain, range: [BLUE, VERMILLION, VERMILLION] },
    legend: {
      title: "Bias and limits of agreement (shaded: their confidence intervals)",
      titleLimit: 0,
      orient: "bottom",
      direction: "vertical",
      labelLimit: 0,
      symbolStrokeWidth: 2.5,
      symbolSize: 400,
      symbolType: "stroke",
      symbolOpacity: 1,
    },
  };
  const width = 520;
  const height = 320;
  return new Chart({
    title,
    width,
    height,
    layer: [
      {
        data: { values: bands },
        mark: { type: "rect", opacity: 0.13 },
        encoding: {
          y: {
            field: "lower",
            type: "quantitative",
            title: fitted(
              axisTitle(q, `${a} − ${b}`, `Difference ${a} − ${b}`, differenceUnit),
              height,
            ),
          },
          y2: { field: "upper" },
          color,
          tooltip: [
            { field: "line", title: "Confidence interval of" },
            { field: "lower", title: "lower end" },
            { field: "upper", title: "upper end" },
          ],
        },
      },
      {
        data: { values: lines },
        mark: { type: "rule", strokeWidth: 2 },
        encoding: {
          y: { field: "y", type: "quantitative" },
          color,
          strokeDash: {
            field: "line",
            type: "nominal",
            scale: { domain, range: [SOLID, DASHED, DASHED] },
            legend: color.legend,
          },
        },
      },
      {
        data: { values: lines },
        mark: {
          type: "text",
          align: "right",
          baseline: "bottom",
          dy: -3,
          fontSize: 11,
          fontWeight: "bold",
        },
        encoding: {
          x: { value: width - 4 },
          y: { field: "y", type: "quantitative" },
          text: { field: "text" },
          color,
        },
      },
      {
        data: { values: points },
        mark: { type: "point", filled: true, color: "#222", opacity: 0.8 },
        encoding: {
          x: {
            field: "mean",
            type: "quantitative",
            title: axisTitle(q, `mean of ${a} and ${b}`, `Mean of ${a} and ${b}`),
            scale: { zero: false },
          },
          y: { field: "difference", type: "quantitative" },
        },
      },
    ],
  }, { title, ...footnotesWith(options) });
}

/** A fitted line to draw on {@linkcode methodComparisonChart}: a regression result, or any
 * named line. */
export interface LineToDraw {
  /** Legend name, e.g. "Deming". */
  readonly name: string;
  /** Slope. */
  readonly slope: number;
  /** Intercept (unit of y). */
  readonly intercept: number;
}

/** Options of {@linkcode methodComparisonChart}. */
export interface MethodComparisonChartOptions extends ChartFootnotes {
  /** Chart title. @default "Method comparison" */
  readonly title?: string;
  /** What was measured (label and unit, e.g. a quantity). @default not stated */
  readonly quantity?: Measured;
  /** Names of method X and method Y. @default ["X", "Y"] */
  readonly methodNames?: readonly [string, string];
}

/** Smallest and largest of two series, by a loop (no argument spread over the data). */
function extent(x: readonly number[], y: readonly number[]): Interval {
  let lo = Infinity;
  let hi = -Infinity;
  for (const s of [x, y]) {
    for (const v of s) {
      if (v < lo) lo = v;
      if (v > hi) hi = v;
    }
  }
  return { lower: lo, upper: hi };
}

/**
 * Method-comparison scatter: method Y against method X with the line of identity (grey, dashed)
 * and fitted lines (e.g. Deming, Passing–Bablok: solid blue, dash-dotted orange, dotted green in
 * turn), each drawn across the plotted extent and named in the legend.
 *
 * Source: layout as in Passing H, Bablok W (1983) J Clin Chem Clin Biochem 21:709–720,
 * doi:10.1515/cclm.1983.21.11.709.
 *
 * @param x Readings by method X.
 * @param y Readings by method Y (same subjects).
 * @param lines Fitted lines to draw.
 * @param options Title, what was measured, method names, footnotes.
 * @returns The chart.
 * @throws {TypeError} When x and y differ in length.
 *
 * @example
 * ```ts
 * import { demingRegression, EJECTION_FRACTION } from "@sonorigor/sonorigor";
 * import { methodComparisonChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const x = [40, 52, 61, 35, 58], y = [42, 51, 63, 36, 57];
 * const { slope, intercept } = demingRegression(x, y);
 * const chart = methodComparisonChart(x, y, [{ name: "Deming", slope, intercept }], {
 *   quantity: EJECTION_FRACTION, methodNames: ["manual", "auto"],
 * });
 * assert.match(await chart.toSVG(), /LV ejection fraction: auto \(%\)/);
 * ```
 */
export function methodComparisonChart(
  x: readonly number[],
  y: readonly number[],
  lines: readonly LineToDraw[],
  options: MethodComparisonChartOptions = {},
): Chart {
  if (x.length !== y.length) {
    throw new TypeError(
      `Method-comparison chart: expected 'x' and 'y' of equal length, got ${x.length} and ${y.length}`,
    );
  }
  const title = options.title ?? "Method comparison";
  const [nameX, nameY] = options.methodNames ?? ["X", "Y"];
  const q = options.quantity;
  const { lower: lo, upper: hi } = extent(x, y);
  // where each line meets the plotted extent (layout)
  const identity = `Line of identity (${nameY} = ${nameX})`;
  const segs = [
    { line: identity, x: lo, y: lo },
    { line: identity, x: hi, y: hi },
    ...lines.flatMap((l) => [
      { line: l.name, x: lo, y: l.intercept + l.slope * lo },
      { line: l.name, x: hi, y: l.intercept + l.slope * hi },
    ]),
  ];
  // identity grey and dashed; fitted lines each in their own colour and dash (colour-blind safe)
  const domain = [identity, ...lines.map((l) => l.name)];
  const styles = lines.map((_, i) => FIT_STYLES[i % FIT_STYLES.length]!);
  const color = [GREY, ...styles.map((st) => st.color)];
  const dash = [DASHED, ...styles.map((st) => st.dash)];
  const legend = {
    title: "Lines",
    orient: "bottom",
    direction: "vertical",
    labelLimit: 0,
    symbolType: "stroke",
    symbolStrokeWidth: 2.5,
    symbolSize: 400,
  };
  const scale = { domain: [lo - 0.05 * (hi - lo), hi + 0.05 * (hi - lo)] };
  return new Chart({
    title,
    width: 420,
    height: 420,
    layer: [
      {
        data: { values: segs },
        mark: { type: "line", clip: true, strokeWidth: 2 },
        encoding: {
          x: { field: "x", type: "quantitative", scale, title: axisTitle(q, nameX, nameX) },
          y: {
            field: "y",
            type: "quantitative",
            scale,
            title: fitted(axisTitle(q, nameY, nameY), 420),
          },
          color: {
            field: "line",
            type: "nominal",
            scale: { domain, range: color },
            legend,
          },
          strokeDash: { field: "line", type: "nominal", scale: { domain, range: dash }, legend },
        },
      },
      {
        data: { values: x.map((v, i) => ({ x: v, y: y[i]! })) },
        mark: { type: "point", filled: true, color: "#222" },
        encoding: {
          x: { field: "x", type: "quantitative" },
          y: { field: "y", type: "quantitative" },
        },
      },
    ],
  }, { title, ...footnotesWith(options) });
}

/** One reading for {@linkcode observerChart}. */
export interface ObserverReading {
  /** Subject identifier. */
  readonly subject: string;
  /** Observer or method. */
  readonly observer: string;
  /** Reading. */
  readonly value: number;
}

/** Options of {@linkcode observerChart}. */
export interface ObserverChartOptions extends ChartFootnotes {
  /** Chart title. @default "Readings by subject and observer" */
  readonly title?: string;
  /** What was measured (label and unit, e.g. a quantity). @default not stated */
  readonly quantity?: Measured;
}

/**
 * Observer plot: every reading by subject, coloured by observer, so that systematic offsets
 * between observers and subjects with poor agreement stand out.
 *
 * Source: a dot plot of readings by subject as used in Shrout PE, Fleiss JL (1979) Psychol
 * Bull 86:420–428 (the data layout of Table 2), doi:10.1037/0033-2909.86.2.420.
 *
 * @param readings Readings in long format.
 * @param options Title, what was measured, footnotes.
 * @returns The chart.
 *
 * @example
 * ```ts
 * import { EJECTION_FRACTION } from "@sonorigor/sonorigor";
 * import { observerChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const chart = observerChart([{ subject: "p1", observer: "A", value: 53 },
 *   { subject: "p1", observer: "B", value: 55 }], { quantity: EJECTION_FRACTION });
 * assert.match(await chart.toSVG(), /LV ejection fraction \(%\)/);
 * ```
 */
export function observerChart(
  readings: readonly ObserverReading[],
  options: ObserverChartOptions = {},
): Chart {
  const title = options.title ?? "Readings by subject and observer";
  const q = options.quantity;
  return new Chart({
    title,
    width: 560,
    height: 300,
    data: {
      values: readings.map((r) => ({ subject: r.subject, observer: r.observer, value: r.value })),
    },
    mark: { type: "point", filled: true, size: 50, opacity: 0.8 },
    encoding: {
      x: { field: "subject", type: "nominal", title: "Subject", sort: null },
      y: {
        field: "value",
        type: "quantitative",
        title: q ? labelWithUnit(q.label, q.unit) : "Reading",
        scale: { zero: false },
      },
      color: {
        field: "observer",
        type: "nominal",
        title: "Observer / method",
        scale: { range: OBSERVER_COLOURS },
      },
      shape: { field: "observer", type: "nominal" },
    },
  }, { title, ...footnotesWith(options) });
}

/**
 * The chart of one figure of a method-validation report (its Bland–Altman plot, method-comparison
 * scatter or observer plot), drawn from the report's results.
 *
 * @param report A report of measurements from `methodValidation`.
 * @param figure One of `report.figures`.
 * @param options Footnotes (the clinical caution is on by default; `inventedData` for demo data).
 * @returns The chart.
 * @throws {TypeError} For a figure whose statistic the report does not hold.
 *
 * @example
 * ```ts
 * import { methodValidation, readTable } from "@sonorigor/sonorigor";
 * import { methodValidationChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,lvef percent\nP1,A,55\nP1,B,54\nP2,A,40\nP2,B,43\nP3,A,62\nP3,B,61\n";
 * const report = methodValidation(readTable(csv));
 * assert.deepEqual(report.figures.map((f) => f.file),
 *   ["bland_altman_b_vs_a.svg", "method_comparison_b_vs_a.svg", "observers.svg"]);
 * const svg = await methodValidationChart(report, report.figures[0]!).toSVG();
 * assert.match(svg, /LV ejection fraction: B − A \(percentage points\)/);
 * ```
 */
export function methodValidationChart(
  report: MethodValidationReport,
  figure: FigurePlan,
  options: ChartFootnotes = {},
): Chart {
  const quantity = report.study.measured;
  if (figure.kind === "observers") {
    if (report.study.design !== "continuous") {
      throw new TypeError(
        "Method-validation chart: expected a report of measurements for the observer plot, got graded findings",
      );
    }
    return observerChart(report.readings as readonly ObserverReading[], {
      ...options,
      quantity,
      title: "All readings by subject and observer/method",
    });
  }
  const c = report.comparisons[figure.comparison ?? -1];
  if (c === undefined) {
    throw new TypeError(
      `Method-validation chart: expected a figure of one of the ${report.comparisons.length} comparisons, got comparison ${figure.comparison}`,
    );
  }
  if (figure.kind === "blandAltman") {
    if (c.blandAltman.status !== "computed") {
      throw new TypeError(
        `Method-validation chart: expected a computed Bland–Altman analysis of ${c.test} − ${c.reference}, got none (${c.blandAltman.reason})`,
      );
    }
    return blandAltmanChart(c.blandAltman.result, {
      ...options,
      title: `Bland–Altman: ${c.test} − ${c.reference}`,
    });
  }
  const lines: LineToDraw[] = [];
  for (const fit of [c.deming, c.passingBablok]) {
    if (fit.status === "computed") {
      const { method, slope, intercept } = fit.result;
      lines.push({ name: `${method} regression`, slope, intercept });
    }
  }
  return methodComparisonChart(c.x, c.y, lines, {
    ...options,
    quantity,
    methodNames: [c.reference, c.test],
    title: `${c.test} against ${c.reference}`,
  });
}
