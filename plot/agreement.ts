/**
 * Charts for method validation: the Bland–Altman plot, the method-comparison scatter and the
 * observer plot. Each takes results from the agreement statistics and returns a {@linkcode Chart}.
 *
 * @module
 */
import { Chart } from "./chart.ts";
import type { BlandAltmanResult } from "../calc/agreement/bland_altman.ts";

/** Options of {@linkcode blandAltmanChart}. */
export interface BlandAltmanChartOptions {
  /** Chart title. @default "Bland–Altman plot" */
  readonly title?: string;
  /** Unit label of the measurement, e.g. "mL". @default "" */
  readonly unit?: string;
  /** Name of method A (minuend). @default "A" */
  readonly methodA?: string;
  /** Name of method B (subtrahend). @default "B" */
  readonly methodB?: string;
  /** Which limit intervals to draw as bands: "exact" (Carkeet 2015) or "approximate".
   * @default "exact" */
  readonly bands?: "exact" | "approximate";
}

const withUnit = (label: string, unit: string) => (unit ? `${label} (${unit})` : label);

/**
 * Bland–Altman plot: differences against means, with the bias and the limits of agreement as
 * lines and their confidence intervals as shaded bands.
 *
 * Source: Bland JM, Altman DG (1986) Lancet 327:307–310, Fig. 2 layout;
 * doi:10.1016/S0140-6736(86)90837-8.
 *
 * @param result A {@linkcode BlandAltmanResult} from `blandAltman`.
 * @param options Title, unit, method names, band kind.
 * @returns The chart.
 *
 * @example
 * ```ts
 * import { blandAltman } from "@sonorigor/sonorigor";
 * import { blandAltmanChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const chart = blandAltmanChart(blandAltman([10, 12, 14, 16, 18], [9, 12, 13, 17, 16]));
 * assert.match(await chart.toSVG(), /^<svg/);
 * ```
 */
export function blandAltmanChart(
  result: BlandAltmanResult,
  options: BlandAltmanChartOptions = {},
): Chart {
  const unit = options.unit ?? "";
  const a = options.methodA ?? "A";
  const b = options.methodB ?? "B";
  const title = options.title ?? "Bland–Altman plot";
  const kind = options.bands ?? "exact";
  const ci = (
    l: BlandAltmanResult["lowerLimit"],
  ) => (kind === "exact" ? l.exactCi : l.approximateCi);
  const points = result.means.map((m, i) => ({ mean: m, difference: result.differences[i]! }));
  const bands = [
    { what: "bias CI", lower: result.biasCi.lower, upper: result.biasCi.upper },
    {
      what: "lower limit CI",
      lower: ci(result.lowerLimit).lower,
      upper: ci(result.lowerLimit).upper,
    },
    {
      what: "upper limit CI",
      lower: ci(result.upperLimit).lower,
      upper: ci(result.upperLimit).upper,
    },
  ];
  const lines = [
    { what: "bias", y: result.bias },
    { what: `bias − ${result.multiplier} SD`, y: result.lowerLimit.value },
    { what: `bias + ${result.multiplier} SD`, y: result.upperLimit.value },
  ];
  const yTitle = withUnit(`Difference ${a} − ${b}`, unit);
  return new Chart({
    title,
    width: 520,
    height: 320,
    layer: [
      {
        data: { values: bands },
        mark: { type: "rect", opacity: 0.15, color: "#4c78a8" },
        encoding: {
          y: { field: "lower", type: "quantitative", title: yTitle },
          y2: { field: "upper" },
          tooltip: [{ field: "what" }, { field: "lower" }, { field: "upper" }],
        },
      },
      {
        data: { values: lines },
        mark: { type: "rule", strokeDash: [6, 3] },
        encoding: {
          y: { field: "y", type: "quantitative" },
          color: { field: "what", type: "nominal", title: "Line" },
        },
      },
      {
        data: { values: points },
        mark: { type: "point", filled: true, color: "#222" },
        encoding: {
          x: {
            field: "mean",
            type: "quantitative",
            title: withUnit(`Mean of ${a} and ${b}`, unit),
            scale: { zero: false },
          },
          y: { field: "difference", type: "quantitative" },
        },
      },
    ],
  }, { title });
}

/** A fitted line to draw on {@linkcode methodComparisonChart}. */
export interface LineToDraw {
  /** Legend name, e.g. "Deming". */
  readonly name: string;
  /** Slope. */
  readonly slope: number;
  /** Intercept. */
  readonly intercept: number;
}

/**
 * Method-comparison scatter: method Y against method X with the line of identity and fitted
 * lines (e.g. Deming, Passing–Bablok).
 *
 * Source: layout as in Passing H, Bablok W (1983) J Clin Chem Clin Biochem 21:709–720,
 * doi:10.1515/cclm.1983.21.11.709.
 *
 * @param x Readings by method X.
 * @param y Readings by method Y (same subjects).
 * @param lines Fitted lines to draw.
 * @param options Title, unit and method names.
 * @returns The chart.
 * @throws {TypeError} When x and y differ in length.
 *
 * @example
 * ```ts
 * import { methodComparisonChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const chart = methodComparisonChart([1, 2, 3], [1.1, 2.2, 2.9], [{ name: "fit", slope: 1, intercept: 0 }]);
 * assert.match(await chart.toSVG(), /<svg/);
 * ```
 */
export function methodComparisonChart(
  x: readonly number[],
  y: readonly number[],
  lines: readonly LineToDraw[],
  options: {
    readonly title?: string;
    readonly unit?: string;
    readonly methodX?: string;
    readonly methodY?: string;
  } = {},
): Chart {
  if (x.length !== y.length) {
    throw new TypeError(
      `Method-comparison chart: expected 'x' and 'y' of equal length, got ${x.length} and ${y.length}`,
    );
  }
  const unit = options.unit ?? "";
  const title = options.title ?? "Method comparison";
  const lo = Math.min(...x, ...y);
  const hi = Math.max(...x, ...y);
  const segs = [
    { line: "identity (y = x)", x: lo, y: lo },
    { line: "identity (y = x)", x: hi, y: hi },
    ...lines.flatMap((l) => [
      { line: l.name, x: lo, y: l.intercept + l.slope * lo },
      { line: l.name, x: hi, y: l.intercept + l.slope * hi },
    ]),
  ];
  const scale = { domain: [lo - 0.05 * (hi - lo), hi + 0.05 * (hi - lo)] };
  return new Chart({
    title,
    width: 420,
    height: 420,
    layer: [
      {
        data: { values: segs },
        mark: { type: "line", clip: true },
        encoding: {
          x: {
            field: "x",
            type: "quantitative",
            scale,
            title: withUnit(options.methodX ?? "X", unit),
          },
          y: {
            field: "y",
            type: "quantitative",
            scale,
            title: withUnit(options.methodY ?? "Y", unit),
          },
          color: { field: "line", type: "nominal", title: "Line" },
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
  }, { title });
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

/**
 * Observer plot: every reading by subject, coloured by observer, so that systematic offsets
 * between observers and subjects with poor agreement stand out.
 *
 * Source: a dot plot of readings by subject as used in Shrout PE, Fleiss JL (1979) Psychol
 * Bull 86:420–428 (the data layout of Table 2), doi:10.1037/0033-2909.86.2.420.
 *
 * @param readings Readings in long format.
 * @param options Title and unit.
 * @returns The chart.
 *
 * @example
 * ```ts
 * import { observerChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 *
 * const chart = observerChart([{ subject: "p1", observer: "A", value: 3 }, { subject: "p1", observer: "B", value: 4 }]);
 * assert.match(await chart.toSVG(), /<svg/);
 * ```
 */
export function observerChart(
  readings: readonly ObserverReading[],
  options: { readonly title?: string; readonly unit?: string } = {},
): Chart {
  const title = options.title ?? "Readings by subject and observer";
  return new Chart({
    title,
    width: 560,
    height: 300,
    data: { values: readings.map((r) => ({ ...r })) },
    mark: { type: "point", filled: true, size: 50, opacity: 0.8 },
    encoding: {
      x: { field: "subject", type: "nominal", title: "Subject", sort: null },
      y: {
        field: "value",
        type: "quantitative",
        title: withUnit("Reading", options.unit ?? ""),
        scale: { zero: false },
      },
      color: { field: "observer", type: "nominal", title: "Observer / method" },
      shape: { field: "observer", type: "nominal" },
    },
  }, { title });
}
