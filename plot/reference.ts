/**
 * Normal-range charts: a measurement against BSA with the mean and ±1/±2/±3 SD bands of a
 * pediatric Z-score model, or a value against the sex-specific limit lines of the adult
 * reference table; one patient or a cohort as points with uncertainty error bars.
 *
 * @module
 */
import {
  ADULT_REFERENCE_LANG_2015,
  adultLimitLines,
  type AdultReferenceRow,
  adultReferenceRow,
} from "../calc/reference/adult.ts";
import type { ZScoreModel } from "../calc/reference/zscore_models.ts";
import {
  measuredQuantity,
  modelCitation,
  zScoreBands,
  zScoreCalculation,
} from "../calc/reference/zscore.ts";
import { zScoreFormula } from "../calc/reference/zscore_models.ts";
import { formatResolution, NOT_MEASURED } from "../display/format.ts";
import { withUnit } from "../calc/core/text.ts";
import { cautionsOf } from "../calc/core/calculation.ts";
import type { Table } from "../calc/table/types.ts";
import type { Citation } from "../calc/core/types.ts";
import { BODY_SURFACE_AREA } from "../calc/quantities/body.ts";
import { labelWithUnit } from "../display/uncertainty.ts";
import { rowLabels } from "../calc/table/evaluate.ts";
import { Chart, type ChartFootnotes, footnotesWith } from "./chart.ts";

/** The legend names of the shaded bands, widest first, and of the mean line. */
const BAND_NAMES = ["Z between −3 and +3", "Z between −2 and +2", "Z between −1 and +1"] as const;
const MEAN_NAME = "Mean (Z = 0)";

/** One patient on a pediatric normal-range chart. */
export interface ReferenceChartPoint {
  /** BSA, m² (by the model's BSA formula). */
  readonly bsaM2: number;
  /** Measurement in the model's unit. */
  readonly value: number;
  /** Standard uncertainty of the measurement (drawn as ±k·u). */
  readonly valueUncertainty?: number;
  /** Standard uncertainty of the BSA (drawn as ±k·u). */
  readonly bsaUncertainty?: number;
  /** Label shown in the tooltip. */
  readonly label?: string;
}

/** Options of {@linkcode zScoreChart}. */
export interface ZScoreChartOptions extends ChartFootnotes {
  /** Patients to plot. */
  readonly points?: readonly ReferenceChartPoint[];
  /** BSA axis range, m². @default the model's BSA range, widened to include the points */
  readonly bsaRange?: readonly [number, number];
  /** Coverage factor k of the error bars (±k·u). @default 2 */
  readonly coverageFactor?: number;
  /** Number of BSA grid points of the bands. @default 121 */
  readonly gridPoints?: number;
  /** Chart title. @default the model's measurement */
  readonly title?: string;
  /** Width in pixels. @default 520 */
  readonly width?: number;
  /** Height in pixels. @default 360 */
  readonly height?: number;
}

function checkPoints(where: string, points: readonly ReferenceChartPoint[]): void {
  points.forEach((p, i) => {
    for (const key of ["bsaM2", "value"] as const) {
      if (typeof p?.[key] !== "number" || !Number.isFinite(p[key])) {
        throw new TypeError(
          `${where}: expected point ${i} '${key}' as a finite number, got ${p?.[key]}`,
        );
      }
    }
    for (const key of ["valueUncertainty", "bsaUncertainty"] as const) {
      const u = p[key];
      if (u !== undefined && !(u >= 0)) {
        throw new RangeError(`${where}: expected point ${i} '${key}' >= 0, got ${u}`);
      }
    }
  });
}

/**
 * Pediatric normal-range chart: the model's mean (Z = 0) against BSA with shaded ±1, ±2 and ±3
 * SD bands (the measurements at those Z-scores, from the model's one Z formula) named in a
 * legend, dashed lines at the model's BSA range, and patients as points with ±k·u error bars in
 * both directions; a point outside ±2 is named on the chart with its Z (each point's Z from
 * `zScoreFormula`), and every point shows its name, BSA, measurement and Z on hover.
 *
 * @param model The Z-score model.
 * @param options Points, axis range, coverage factor, size.
 * @returns The chart (vega-lite spec; `await chart.toSVG()` for a static SVG).
 * @throws {TypeError} For a point without a finite BSA or value.
 * @throws {RangeError} For a negative uncertainty, an empty BSA range or k ≤ 0.
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import { zScoreChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = zScoreChart(PHN_2017_MODELS.lvEndDiastolicDimension, {
 *   points: [{ bsaM2: 0.85, value: 3.9, valueUncertainty: 0.1, bsaUncertainty: 0.02, label: "P1" }],
 * });
 * assert.match(await chart.toSVG(), /^<svg/);
 * ```
 */
export function zScoreChart(model: ZScoreModel, options: ZScoreChartOptions = {}): Chart {
  const where = `Z-score chart (${model.id})`;
  const points = options.points ?? [];
  checkPoints(where, points);
  const k = options.coverageFactor ?? 2;
  if (!(k > 0)) throw new RangeError(`${where}: expected 'coverageFactor' > 0, got ${k}`);
  let [lo, hi] = options.bsaRange ?? [model.bsaRange.min, model.bsaRange.max];
  if (options.bsaRange === undefined) {
    for (const p of points) {
      lo = Math.min(lo, p.bsaM2 - k * (p.bsaUncertainty ?? 0));
      hi = Math.max(hi, p.bsaM2 + k * (p.bsaUncertainty ?? 0));
    }
    lo = Math.max(lo, 0.05);
  }
  if (!(lo > 0 && hi > lo)) {
    throw new RangeError(`${where}: expected a BSA range 0 < min < max, got [${lo}, ${hi}]`);
  }
  const grid = zScoreBands(model, lo, hi, Math.max(2, Math.floor(options.gridPoints ?? 121)));
  const measured = measuredQuantity(model);
  const unit = measured.unit;
  const x = {
    field: "bsa",
    type: "quantitative",
    title: labelWithUnit(BODY_SURFACE_AREA.label, BODY_SURFACE_AREA.unit),
    scale: { domain: [lo, hi], nice: false },
  };
  const yTitle = labelWithUnit(measured.label, unit);
  // the bands and the mean in one legend (colour-blind-safe sequential blues, darkest inside)
  const legend = {
    domain: [...BAND_NAMES, MEAN_NAME],
    range: ["#deebf7", "#9ecae1", "#4292c6", "#08306b"],
  };
  const colour = (name: string) => ({
    datum: name,
    type: "nominal",
    scale: legend,
    title: "Normal range",
    legend: { orient: "bottom", labelLimit: 320 },
  });
  const band = (z: number, name: string) => ({
    mark: { type: "area", opacity: 1 },
    encoding: {
      x,
      y: { field: `z${-z}`, type: "quantitative", title: yTitle },
      y2: { field: `z${z}` },
      color: colour(name),
    },
  });
  const line = (z: number, dash: number[]) => ({
    mark: { type: "line", strokeDash: dash, strokeWidth: z === 0 ? 2 : 1 },
    encoding: {
      x,
      y: { field: `z${z}`, type: "quantitative" },
      ...(z === 0 ? { color: colour(MEAN_NAME) } : { color: { value: "#08306b" } }),
    },
  });
  const layers: Record<string, unknown>[] = [
    {
      data: { values: grid },
      layer: [
        band(3, BAND_NAMES[0]),
        band(2, BAND_NAMES[1]),
        band(1, BAND_NAMES[2]),
        line(0, []),
        line(2, [4, 3]),
        line(-2, [4, 3]),
      ],
    },
    {
      data: {
        values: [{ bsa: model.bsaRange.min }, { bsa: model.bsaRange.max }].filter((d) =>
          d.bsa >= lo && d.bsa <= hi
        ),
      },
      mark: { type: "rule", color: "#888", strokeDash: [2, 3] },
      encoding: { x: { field: "bsa", type: "quantitative" } },
    },
  ];
  if (points.length > 0) {
    const bsaTitle = labelWithUnit(BODY_SURFACE_AREA.label, BODY_SURFACE_AREA.unit);
    const values = points.map((p, i) => {
      // each point's Z by the model's one formula (calc/reference), for its label and tooltip
      const z = zScoreFormula(model, p.value, p.bsaM2);
      const label = p.label ?? `#${i + 1}`;
      const zText = Number.isFinite(z) ? z.toFixed(2).replace("-", "−") : NOT_MEASURED;
      return {
        label,
        bsa: p.bsaM2,
        value: p.value,
        valueLow: p.value - k * (p.valueUncertainty ?? 0),
        valueHigh: p.value + k * (p.valueUncertainty ?? 0),
        bsaLow: p.bsaM2 - k * (p.bsaUncertainty ?? 0),
        bsaHigh: p.bsaM2 + k * (p.bsaUncertainty ?? 0),
        outside: Math.abs(z) > 2,
        bsaText: formatResolution(p.bsaM2, BODY_SURFACE_AREA.resolution),
        valueText: withUnit(formatResolution(p.value, measured.resolution), unit),
        zText,
        outsideText: `${label} (Z ${zText})`,
      };
    });
    layers.push({
      data: { values },
      layer: [
        {
          mark: { type: "rule", color: "#d62728" },
          encoding: {
            x: { field: "bsa", type: "quantitative" },
            y: { field: "valueLow", type: "quantitative" },
            y2: { field: "valueHigh" },
          },
        },
        {
          mark: { type: "rule", color: "#d62728" },
          encoding: {
            x: { field: "bsaLow", type: "quantitative" },
            x2: { field: "bsaHigh" },
            y: { field: "value", type: "quantitative" },
          },
        },
        {
          mark: { type: "point", filled: true, color: "#d62728", size: 40 },
          encoding: {
            x: { field: "bsa", type: "quantitative" },
            y: { field: "value", type: "quantitative" },
            tooltip: [
              { field: "label", title: "Patient" },
              { field: "bsaText", title: bsaTitle },
              { field: "valueText", title: measured.label },
              { field: "zText", title: "Z-score" },
            ],
          },
        },
        {
          // every point outside ±2 is named on the chart, with its Z
          transform: [{ filter: "datum.outside" }],
          mark: { type: "text", align: "left", dx: 6, dy: -6, fontSize: 11, color: "#a50f15" },
          encoding: {
            x: { field: "bsa", type: "quantitative" },
            y: { field: "value", type: "quantitative" },
            text: { field: "outsideText" },
          },
        },
      ],
    });
  }
  const title = options.title ??
    `${measured.label}: mean and ±1/±2/±3 SD (${modelCitation(model)})`;
  // the model's cautions travel with the chart: a synthetic model, coefficients not verified
  const marks = cautionsOf(zScoreCalculation(model));
  return new Chart({
    title,
    width: options.width ?? 520,
    height: options.height ?? 360,
    layer: layers,
  }, { title, ...footnotesWith(options, marks) });
}

/**
 * A table's measurements on a model's normal-range chart: one point per row with a finite
 * measurement and BSA. The measurement is the table's column of the model's quantity; the BSA is
 * the table's BSA column (computed with the model's BSA formula, e.g. by `bsaHaycock` for PHN).
 *
 * @param table A table with the measurement and BSA columns.
 * @param model The Z-score model.
 * @param options Chart options (points come from the table); `valueUncertainty` applies to every
 * point.
 * @returns The chart.
 * @throws {TypeError} When the table has no column of the model's measurement or no BSA column.
 *
 * @example
 * ```ts
 * import { bsaHaycock, evaluateTable, PHN_2017_MODELS, readTable } from "@sonorigor/sonorigor";
 * import { tableZScoreChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const t = evaluateTable(
 *   readTable("id,height [cm],weight [kg],aortic root [cm]\nA,120,22,2.0\nB,150,40,2.5\n"),
 *   bsaHaycock,
 * );
 * const chart = tableZScoreChart(t, PHN_2017_MODELS.aorticRootSinus);
 * assert.match(await chart.toSVG(), /^<svg/);
 * ```
 */
export function tableZScoreChart(
  table: Table,
  model: ZScoreModel,
  options: Omit<ZScoreChartOptions, "points"> & { readonly valueUncertainty?: number } = {},
): Chart {
  const q = measuredQuantity(model);
  const column = table.columns.get(q.id);
  const bsa = table.columns.get("bsa");
  if (column?.kind !== "numeric" || bsa?.kind !== "numeric") {
    throw new TypeError(
      `Table chart (${model.id}): expected columns '${q.id}' (${q.label}) and 'bsa' (body surface area), got ${
        [...table.columns.keys()].join(", ")
      }`,
    );
  }
  const labels = rowLabels(table);
  const points: ReferenceChartPoint[] = [];
  for (let i = 0; i < table.rowCount; i++) {
    const v = column.values[i]!;
    const b = bsa.values[i]!;
    if (!(Number.isFinite(v) && Number.isFinite(b))) continue;
    points.push({
      bsaM2: b,
      value: v,
      label: labels[i]!,
      ...(options.valueUncertainty === undefined
        ? {}
        : { valueUncertainty: options.valueUncertainty }),
    });
  }
  const { valueUncertainty: _u, ...chartOptions } = options;
  return zScoreChart(model, { ...chartOptions, points });
}

/** A source as the chart names it: first author and year ("Lang RM 2015"). */
function sourceName(c: Citation): string {
  return `${c.authors.split(",")[0]} ${c.year}`;
}

/** The marks of the limits drawn: their table, "from memory" where they were entered from memory
 * of the table, and the rows' own notes. */
function limitMarks(rows: readonly AdultReferenceRow[]): string[] {
  const marks = rows.map((r) =>
    `Limits: ${sourceName(r.source)}, ${r.table} (${r.method})${
      r.fromMemory ? ", entered from memory, not re-checked against the printed table" : ""
    }`
  );
  return [...marks, ...rows.flatMap((r) => (r.note ? [r.note] : []))];
}

/** One patient on an adult limit chart. */
export interface AdultChartPoint {
  /** Value in the row's unit. */
  readonly value: number;
  /** "male" or "female". */
  readonly sex: "male" | "female";
  /** Standard uncertainty (drawn as ±k·u). */
  readonly uncertainty?: number;
  /** Label on the x axis. */
  readonly label?: string;
}

/** Options of {@linkcode adultLimitChart}. */
export interface AdultLimitChartOptions extends ChartFootnotes {
  /** Patients to plot. */
  readonly points?: readonly AdultChartPoint[];
  /** Coverage factor of the error bars. @default 2 */
  readonly coverageFactor?: number;
  /** Reference rows. @default ADULT_REFERENCE_LANG_2015 */
  readonly table?: readonly AdultReferenceRow[];
  /** Width in pixels. @default 520 */
  readonly width?: number;
  /** Height in pixels. @default 320 */
  readonly height?: number;
}

/**
 * Adult limit chart: horizontal lines at the sex-specific normal limits (solid) and severity cut
 * points (dashed) of a parameter (one grey set when the guideline gives one range for both
 * sexes), and patients as points coloured by sex with ±k·u error bars.
 *
 * @param parameter Parameter key of the adult reference table, e.g. "lvEjectionFraction".
 * @param options Points, coverage factor, table, size.
 * @returns The chart.
 * @throws {TypeError} For an unknown parameter or a point without a finite value or valid sex.
 * @throws {RangeError} For a negative uncertainty or k ≤ 0.
 *
 * @example
 * ```ts
 * import { adultLimitChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = adultLimitChart("lvEjectionFraction", {
 *   points: [{ value: 48, sex: "female", uncertainty: 3, label: "A03" }],
 * });
 * assert.match(await chart.toSVG(), /^<svg/);
 * ```
 */
export function adultLimitChart(parameter: string, options: AdultLimitChartOptions = {}): Chart {
  const table = options.table ?? ADULT_REFERENCE_LANG_2015;
  const rows = (["male", "female"] as const).map((sex) => ({
    sex,
    row: adultReferenceRow(parameter, sex, table),
  }));
  const where = `Adult limit chart (${parameter})`;
  const k = options.coverageFactor ?? 2;
  if (!(k > 0)) throw new RangeError(`${where}: expected 'coverageFactor' > 0, got ${k}`);
  const points = options.points ?? [];
  points.forEach((p, i) => {
    if (typeof p?.value !== "number" || !Number.isFinite(p.value)) {
      throw new TypeError(
        `${where}: expected point ${i} 'value' as a finite number, got ${p?.value}`,
      );
    }
    if (p.sex !== "male" && p.sex !== "female") {
      throw new TypeError(
        `${where}: expected point ${i} 'sex' "male" or "female", got ${JSON.stringify(p.sex)}`,
      );
    }
    if (p.uncertainty !== undefined && !(p.uncertainty >= 0)) {
      throw new RangeError(
        `${where}: expected point ${i} 'uncertainty' >= 0, got ${p.uncertainty}`,
      );
    }
  });
  const limits = adultLimitLines(parameter, table);
  const r0 = rows[0]!.row;
  const yTitle = labelWithUnit(r0.quantity.label, r0.quantity.unit);
  const color = {
    field: "sex",
    type: "nominal",
    scale: { domain: ["female", "male", "both sexes"], range: ["#e377c2", "#1f77b4", "#555555"] },
  };
  const layers: Record<string, unknown>[] = [{
    data: { values: limits },
    mark: { type: "rule", strokeWidth: 1.5 },
    encoding: {
      y: { field: "value", type: "quantitative", title: yTitle },
      color,
      strokeDash: {
        field: "kind",
        type: "nominal",
        scale: { domain: ["normal limit", "severity cut point"], range: [[1, 0], [5, 3]] },
      },
    },
  }];
  if (points.length > 0) {
    const values = points.map((p, i) => ({
      label: p.label ?? `#${i + 1}`,
      sex: p.sex,
      value: p.value,
      low: p.value - k * (p.uncertainty ?? 0),
      high: p.value + k * (p.uncertainty ?? 0),
    }));
    const xLabel = { field: "label", type: "nominal", title: "Patient", sort: null };
    layers.push({
      data: { values },
      layer: [
        {
          mark: { type: "rule" },
          encoding: {
            x: xLabel,
            y: { field: "low", type: "quantitative" },
            y2: { field: "high" },
            color,
          },
        },
        {
          mark: { type: "point", filled: true, size: 50 },
          encoding: {
            x: xLabel,
            y: { field: "value", type: "quantitative" },
            color,
            tooltip: [{ field: "label" }, { field: "value" }],
          },
        },
      ],
    });
  }
  const title = `${r0.quantity.label}: ${sourceName(r0.source)} limits by sex`;
  return new Chart({
    title,
    width: options.width ?? 520,
    height: options.height ?? 320,
    layer: layers,
  }, { title, ...footnotesWith(options, limitMarks(rows.map((r) => r.row))) });
}
