/**
 * The geometry of a method-of-discs volume laid out for drawing: each view's contour (closed by
 * the annulus), long axis and disc chords in the view's long-axis frame, with the extent of the
 * drawing. Charts draw these rows; they compute nothing themselves.
 *
 * @module
 */
import type { Interval } from "../uncertainty/types.ts";
import { issueError } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import { contourAxisFrame } from "./contour.ts";
import type { DiscVolume, TracedView } from "./volumes.ts";

/** One drawable element of a method-of-discs drawing, in the long-axis frame of its view (cm). */
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

/** The rows of a method-of-discs drawing and their extent. */
export interface DiscMethodData {
  /** Every contour point, axis and chord interval. */
  readonly rows: readonly DiscMethodRow[];
  /** Smallest and largest transverse coordinate of any row, cm. */
  readonly transverseExtent: Interval;
  /** Smallest (at most 0, the annulus) and largest axial coordinate of any row, cm. */
  readonly axialExtent: Interval;
}

/**
 * The data of a method-of-discs drawing: each view's contour (closed by the annulus), long axis
 * and disc chords in the long-axis frame (annulus midpoint at the origin, apex up), and the
 * extent of all of them.
 *
 * @param result A result of `biplaneDiscVolume` or `singlePlaneDiscVolume`.
 * @returns Rows for every contour point, axis and chord interval, and their extent.
 * @throws {TypeError} When `result` is not a method-of-discs result.
 *
 * @example A triangle 4 cm wide and 8 cm long
 * ```ts
 * import { discMethodData, singlePlaneDiscVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const d = discMethodData(singlePlaneDiscVolume([[-2, 0], [0, 8], [2, 0]]));
 * assert.equal(d.rows.filter((r) => r.kind === "disc").length, 20);
 * assert.equal(d.rows.filter((r) => r.kind === "contour").length, 4); // 3 points + closing point
 * assert.deepEqual(d.axialExtent, { lower: 0, upper: 8 }); // annulus to apex
 * ```
 */
export function discMethodData(result: DiscVolume): DiscMethodData {
  if (typeof result !== "object" || result === null || !Array.isArray(result.views)) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where: "Method of discs drawing",
      field: "result",
      received: describeValue(result),
      expected: "as a result of biplaneDiscVolume or singlePlaneDiscVolume",
    }]);
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
  let xMin = Infinity, xMax = -Infinity, yMin = 0, yMax = -Infinity;
  for (const r of rows) {
    xMin = Math.min(xMin, r.x, r.x2 ?? r.x);
    xMax = Math.max(xMax, r.x, r.x2 ?? r.x);
    yMin = Math.min(yMin, r.y, r.y2 ?? r.y);
    yMax = Math.max(yMax, r.y, r.y2 ?? r.y);
  }
  return {
    rows,
    transverseExtent: { lower: xMin, upper: xMax },
    axialExtent: { lower: yMin, upper: yMax },
  };
}
