/**
 * Chamber charts: the traced contours of a method-of-discs volume drawn in their long-axis frame,
 * with the long axis and every disc's measuring chord, so a reader can check the geometry the
 * volume came from. The rows and their extent come from the chamber module
 * ({@linkcode discMethodData}); axis titles from the quantities of the contour frame; no formula
 * is written here.
 *
 * @module
 */
import { Chart, type ChartFootnotes, footnotesWith } from "./chart.ts";
import { discMethodData } from "../calc/chamber/disc_drawing.ts";
import type { DiscVolume } from "../calc/chamber/volumes.ts";
import {
  CHAMBER_LENGTH,
  CHAMBER_VOLUME,
  LONG_AXIS_POSITION,
  TRANSVERSE_POSITION,
} from "../calc/quantities/structure.ts";
import { checkValue } from "../calc/core/validate.ts";
import { throwIfErrors } from "../calc/core/issues.ts";
import { withUnit } from "../calc/core/text.ts";
import { formatCount, formatResolution } from "../display/format.ts";
import { labelWithUnit } from "../display/uncertainty.ts";

/** Options of {@linkcode discMethodChart}. */
export interface DiscMethodChartOptions extends ChartFootnotes {
  /** Chart title. @default "Method of discs: <volume> (<N> discs, L = <long axis>)" */
  readonly title?: string;
  /** Plot height per view in pixels, in [100, 2000]. @default 320 */
  readonly heightPx?: number;
}

const HEIGHT_PX = { label: "Panel height", unit: "px", range: { min: 100, max: 2000 } };

/** The default title: the volume, the disc count and the long axis, each at its resolution. */
function defaultTitle(result: DiscVolume): string {
  const volume = withUnit(formatResolution(result.volumeMl, CHAMBER_VOLUME.resolution), "mL");
  const axis = withUnit(formatResolution(result.longAxisCm, CHAMBER_LENGTH.resolution), "cm");
  return `Method of discs: ${volume} (${
    formatCount(result.discCount)
  } discs, ${CHAMBER_LENGTH.symbol} = ${axis})`;
}

/**
 * Chart of a method-of-discs volume: one panel per view with the traced contour (closed by the
 * annulus), the long axis (dashed) and the chord where each disc diameter was measured, drawn to
 * equal scale in both directions.
 *
 * @param result A result of `biplaneDiscVolume` or `singlePlaneDiscVolume`.
 * @param options Title, panel height, footnotes (the result's cautions are always among them).
 * @returns The chart (vega-lite spec plus SVG rendering).
 * @throws {TypeError} When `result` is not a method-of-discs result.
 * @throws {RangeError} When the height is outside [100, 2000] px.
 *
 * @example
 * ```ts
 * import { singlePlaneDiscVolume } from "@sonorigor/sonorigor";
 * import { discMethodChart } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const chart = discMethodChart(singlePlaneDiscVolume([[-2, 0], [-2.2, 4], [0, 8], [2.2, 4], [2, 0]]));
 * assert.match(await chart.toSVG(), /^<svg/);
 * assert.match(chart.title, /^Method of discs: \d+ mL \(20 discs, L = 8\.00 cm\)$/);
 * ```
 */
export function discMethodChart(result: DiscVolume, options: DiscMethodChartOptions = {}): Chart {
  const data = discMethodData(result);
  const checked = checkValue("heightPx", HEIGHT_PX, options.heightPx ?? 320, {
    where: "Method of discs chart",
  });
  throwIfErrors(checked.issues);
  const heightPx = checked.value!;
  // layout only: a 5 % margin around the drawing, and equal scales in both directions
  const { transverseExtent: xs, axialExtent: ys } = data;
  const pad = 0.05 * (ys.upper - ys.lower);
  const xDomain = [xs.lower - pad, xs.upper + pad];
  const yDomain = [ys.lower - pad, ys.upper + pad];
  const widthPx = Math.round(
    (heightPx * (xDomain[1]! - xDomain[0]!)) / (yDomain[1]! - yDomain[0]!),
  );
  const title = options.title ?? defaultTitle(result);
  const x = {
    field: "x",
    type: "quantitative",
    title: labelWithUnit(TRANSVERSE_POSITION.label, TRANSVERSE_POSITION.unit),
    scale: { domain: xDomain, nice: false },
  };
  const y = {
    field: "y",
    type: "quantitative",
    title: labelWithUnit(LONG_AXIS_POSITION.label, LONG_AXIS_POSITION.unit),
    scale: { domain: yDomain, nice: false },
  };
  return new Chart({
    title,
    data: { values: data.rows },
    facet: { column: { field: "view", type: "nominal", title: null } },
    spec: {
      width: widthPx,
      height: heightPx,
      layer: [
        {
          transform: [{ filter: "datum.kind === 'disc'" }],
          mark: { type: "rule", color: "#9ecae1", strokeWidth: 1.5 },
          encoding: { x, y, x2: { field: "x2" }, y2: { field: "y2" } },
        },
        {
          transform: [{ filter: "datum.kind === 'axis'" }],
          mark: { type: "rule", color: "#636363", strokeDash: [4, 3] },
          encoding: { x, y, x2: { field: "x2" }, y2: { field: "y2" } },
        },
        {
          transform: [{ filter: "datum.kind === 'contour'" }],
          mark: { type: "line", color: "#08519c", strokeWidth: 2 },
          encoding: { x, y, order: { field: "order", type: "quantitative" } },
        },
      ],
    },
  }, { title, ...footnotesWith(options, result.cautions) });
}
