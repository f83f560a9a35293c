/**
 * Chamber charts: the traced contours of a method-of-discs volume drawn in their long-axis frame,
 * with the long axis and every disc's measuring chord, so a reader can check the geometry the
 * volume came from. All numbers come from the chamber module
 * ({@linkcode biplaneDiscVolume}, {@linkcode singlePlaneDiscVolume}); no formula is written here.
 *
 * @module
 */
import { Chart } from "./chart.ts";
import { contourAxisFrame } from "../calc/chamber/contour.ts";
import type { DiscVolume, TracedView } from "../calc/chamber/volumes.ts";

/** One drawable element of {@linkcode discMethodChart}, in the long-axis frame of its view (cm). */
export interface DiscMethodRow {
  /** View name, e.g. "apical four-chamber". */
  readonly view: string;
  /** "contour" (outline point, closed by the annulus), "axis" (long axis) or "disc" (chord). */
  readonly kind: "contour" | "axis" | "disc";
  /** Transverse coordinate (start of the segment for axis and disc rows), cm. */
  readonly x: number;
  /** Axial coordinate from the annulus midpoint (start for axis and disc rows), cm. */
  readonly y: number;
  /** End transverse coordinate (axis and disc rows), cm. */
  readonly x2?: number;
  /** End axial coordinate (axis and disc rows), cm. */
  readonly y2?: number;
  /** Drawing order of contour points; disc index (from the annulus) for disc rows. */
  readonly order: number;
}

/**
 * The data behind {@linkcode discMethodChart}: each view's contour (closed by the annulus), long
 * axis and disc chords in the long-axis frame (annulus midpoint at the origin, apex up).
 *
 * @param result A method-of-discs result.
 * @returns Rows for every contour point, axis and chord interval.
 * @throws {TypeError} When `result` is not a method-of-discs result.
 *
 * @example
 * ```ts
 * import { singlePlaneDiscVolume } from "@sonorigor/sonorigor";
 * import { discMethodData } from "@sonorigor/sonorigor/plot";
 * import assert from "node:assert/strict";
 * const rows = discMethodData(singlePlaneDiscVolume([[-2, 0], [0, 8], [2, 0]]));
 * assert.equal(rows.filter((r) => r.kind === "disc").length, 20);
 * assert.equal(rows.filter((r) => r.kind === "contour").length, 4); // 3 points + closing point
 * ```
 */
export function discMethodData(result: DiscVolume): DiscMethodRow[] {
  if (typeof result !== "object" || result === null || !Array.isArray(result.views)) {
    throw new TypeError(
      `Method of discs chart: expected a result of biplaneDiscVolume or singlePlaneDiscVolume, got ${typeof result}`,
    );
  }
  const views: readonly TracedView[] = result.views;
  const rows: DiscMethodRow[] = [];
  for (const v of views) {
    const frame = contourAxisFrame(v.contour, v.longAxis);
    const n = frame.axialCm.length;
    for (let i = 0; i <= n; i++) {
      const k = i % n;
      rows.push({
        view: v.view,
        kind: "contour",
        x: frame.transverseCm[k]!,
        y: frame.axialCm[k]!,
        order: i,
      });
    }
    rows.push({ view: v.view, kind: "axis", x: 0, y: 0, x2: 0, y2: v.longAxis.lengthCm, order: 0 });
    v.chords.forEach((chord, index) => {
      for (const [from, to] of chord.intervals) {
        rows.push({
          view: v.view,
          kind: "disc",
          x: from,
          y: chord.axialCm,
          x2: to,
          y2: chord.axialCm,
          order: index,
        });
      }
    });
  }
  return rows;
}

/** Options of {@linkcode discMethodChart}. */
export interface DiscMethodChartOptions {
  /** Chart title. @default "Method of discs: <volume> mL" */
  readonly title?: string;
  /** Plot height per view in pixels, in [100, 2000]. @default 320 */
  readonly heightPx?: number;
}

/**
 * Chart of a method-of-discs volume: one panel per view with the traced contour (closed by the
 * annulus), the long axis (dashed) and the chord where each disc diameter was measured, drawn to
 * equal scale in both directions.
 *
 * @param result A result of {@linkcode biplaneDiscVolume} or {@linkcode singlePlaneDiscVolume}.
 * @param options Title and panel height.
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
 * ```
 */
export function discMethodChart(result: DiscVolume, options: DiscMethodChartOptions = {}): Chart {
  const rows = discMethodData(result);
  const heightPx = options.heightPx ?? 320;
  if (!(heightPx >= 100 && heightPx <= 2000)) {
    throw new RangeError(
      `Method of discs chart: expected 'heightPx' in [100, 2000], got ${heightPx}`,
    );
  }
  let xMin = Infinity, xMax = -Infinity, yMin = 0, yMax = -Infinity;
  for (const r of rows) {
    xMin = Math.min(xMin, r.x, r.x2 ?? r.x);
    xMax = Math.max(xMax, r.x, r.x2 ?? r.x);
    yMin = Math.min(yMin, r.y, r.y2 ?? r.y);
    yMax = Math.max(yMax, r.y, r.y2 ?? r.y);
  }
  const pad = 0.05 * (yMax - yMin);
  const xDomain = [xMin - pad, xMax + pad];
  const yDomain = [yMin - pad, yMax + pad];
  const widthPx = Math.round(
    (heightPx * (xDomain[1]! - xDomain[0]!)) / (yDomain[1]! - yDomain[0]!),
  );
  const title = options.title ??
    `Method of discs: ${result.volumeMl.toFixed(1)} mL (${result.discCount} discs, L = ${
      result.longAxisCm.toFixed(2)
    } cm)`;
  const x = {
    field: "x",
    type: "quantitative",
    title: "Transverse (cm)",
    scale: { domain: xDomain, nice: false },
  };
  const y = {
    field: "y",
    type: "quantitative",
    title: "Along the long axis from the annulus (cm)",
    scale: { domain: yDomain, nice: false },
  };
  return new Chart({
    title,
    data: { values: rows },
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
  }, { title });
}
