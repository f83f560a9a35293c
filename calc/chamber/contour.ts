/**
 * Traced endocardial contours: validation and the geometry the method of discs needs (long axis,
 * disc diameters, enclosed area).
 *
 * Convention (documented once, used by every contour-based chamber measurement):
 * - A contour is an open point list in cm, traced from one annulus hinge point, around the cavity,
 *   to the other hinge point. The first and last points are the two hinge points; the straight line
 *   between them (the annulus plane) closes the cavity.
 * - The long axis runs from the midpoint of the annulus (the midpoint of the first and last points)
 *   to the apex, taken as the contour point farthest from that midpoint (for the left atrium this
 *   is the atrial roof).
 * - Discs are slabs of equal height h = L/N perpendicular to the long axis. Each disc diameter is
 *   measured at the middle of its slab (axial position (i − ½)·h from the annulus midpoint) as the
 *   length of the perpendicular line that lies inside the closed contour (the sum of the inside
 *   chords when the line crosses the contour more than twice). Cavity behind the perpendicular
 *   through the annulus midpoint is not counted.
 *
 * @module
 */
import { issueError } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";

/** One traced point in cm: an `[x, y]` pair or an `{ x, y }` object. */
export type ContourPoint = readonly [number, number] | { readonly x: number; readonly y: number };

/** A traced contour: points in cm from one annulus hinge point, around the cavity, to the other. */
export type Contour = readonly ContourPoint[];

/** A validated contour in cm as two coordinate arrays. */
export interface ContourCoordinates {
  /** x coordinates in cm. */
  readonly x: Float64Array;
  /** y coordinates in cm. */
  readonly y: Float64Array;
}

/** The long axis of a validated contour. */
export interface LongAxis {
  /** Midpoint of the annulus (first and last contour points), cm. */
  readonly annulusMidpoint: readonly [number, number];
  /** The apex: the contour point farthest from the annulus midpoint, cm. */
  readonly apex: readonly [number, number];
  /** Index of the apex point in the contour. */
  readonly apexIndex: number;
  /** Long-axis length from the annulus midpoint to the apex, cm. */
  readonly lengthCm: number;
  /** Width of the annulus (distance between the hinge points), cm. */
  readonly annulusWidthCm: number;
}

/** Largest number of points accepted in one contour. */
const MAX_POINTS = 20000;

function pointText(x: number, y: number): string {
  return `(${x}, ${y})`;
}

/** Throws the validator's error for one finding about a contour. */
function reject(
  kind: "type" | "range",
  where: string,
  field: string,
  label: string,
  expected: string,
  received: string,
): never {
  throw issueError([{ kind, severity: "error", where, field, label, expected, received }]);
}

/**
 * Validates a traced contour and returns its coordinates.
 *
 * Checks: an array of at least 3 and at most 20000 points, each an `[x, y]` pair or `{ x, y }`
 * object of finite numbers in cm, no point repeating its predecessor, distinct hinge points, and
 * no self-intersection of the closed outline (the contour plus the annulus segment from the last
 * point back to the first), including touching and overlapping segments.
 *
 * @param contour The traced points in cm.
 * @param where Who checks, first in error messages, e.g. "Biplane method of discs".
 * @param view Name of the view for error messages, e.g. "apical four-chamber".
 * @param field The argument the contour was given as, named in error messages (a point is
 * `field[i]`). @default "contour"
 * @returns The coordinates as typed arrays.
 * @throws {TypeError} When the contour is not an array or a point is not a pair of numbers.
 * @throws {RangeError} For fewer than 3 points, a non-finite coordinate, a repeated point, equal
 * hinge points, or a self-intersecting outline; the message names the argument, the view and the
 * point index (0-based).
 *
 * @example A triangle is the smallest valid contour
 * ```ts
 * import { validateContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = validateContour([[0, 0], [0.5, 3], [1, 0]], "Demo", "apical four-chamber");
 * assert.equal(c.x.length, 3);
 * assert.throws(() => validateContour([[0, 0], [1, 0]], "Demo", "apical four-chamber"), {
 *   name: "RangeError",
 *   message: "Demo: expected 'contour' (apical four-chamber contour) with 3 to 20000 points, got 2 points",
 * });
 * ```
 */
export function validateContour(
  contour: unknown,
  where: string,
  view: string,
  field = "contour",
): ContourCoordinates {
  const label = `${view} contour`;
  if (!Array.isArray(contour)) {
    reject(
      "type",
      where,
      field,
      label,
      "as an array of [x, y] points in cm",
      describeValue(contour),
    );
  }
  const n = contour.length;
  if (!(n >= 3 && n <= MAX_POINTS)) {
    reject("range", where, field, label, `with 3 to ${MAX_POINTS} points`, `${n} points`);
  }
  const x = new Float64Array(n);
  const y = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p: unknown = contour[i];
    const at = `${field}[${i}]`;
    const pointLabel = `point ${i} of the ${label}`;
    let px: unknown;
    let py: unknown;
    if (Array.isArray(p) && p.length === 2) {
      px = p[0];
      py = p[1];
    } else if (typeof p === "object" && p !== null && !Array.isArray(p) && "x" in p && "y" in p) {
      px = (p as { x: unknown }).x;
      py = (p as { y: unknown }).y;
    } else {
      reject(
        "type",
        where,
        at,
        pointLabel,
        "as [x, y] or { x, y } in cm",
        JSON.stringify(p) ?? String(p),
      );
    }
    if (typeof px !== "number" || typeof py !== "number") {
      reject("type", where, at, pointLabel, "to hold numbers in cm", JSON.stringify(p));
    }
    if (!Number.isFinite(px) || !Number.isFinite(py)) {
      reject("range", where, at, pointLabel, "with finite coordinates in cm", pointText(px, py));
    }
    x[i] = px;
    y[i] = py;
    if (i > 0 && px === x[i - 1] && py === y[i - 1]) {
      reject(
        "range",
        where,
        at,
        pointLabel,
        `to differ from point ${i - 1}`,
        `the repeated point ${pointText(px, py)}`,
      );
    }
  }
  if (x[0] === x[n - 1] && y[0] === y[n - 1]) {
    reject(
      "range",
      where,
      field,
      label,
      "with distinct annulus hinge points (first and last points)",
      `${pointText(x[0]!, y[0]!)} twice`,
    );
  }
  const crossing = firstSelfIntersection(x, y);
  if (crossing) {
    const [i, j] = crossing;
    const segment = (k: number): string => `${k}–${(k + 1) % n}`;
    reject(
      "range",
      where,
      field,
      label,
      `not to cross itself (the outline is closed by the annulus segment ${n - 1}–0)`,
      `segment ${segment(i)} crossing segment ${segment(j)} near point ${i} at ${
        pointText(x[i]!, y[i]!)
      }`,
    );
  }
  return { x, y };
}

/** Orientation of the triangle (a, b, c): positive counter-clockwise, negative clockwise. */
function orient(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): number {
  return (bx - ax) * (cy - ay) - (by - ay) * (cx - ax);
}

/** True when c lies in the bounding box of segment ab (used for collinear cases). */
function onBox(ax: number, ay: number, bx: number, by: number, cx: number, cy: number): boolean {
  return Math.min(ax, bx) <= cx && cx <= Math.max(ax, bx) && Math.min(ay, by) <= cy &&
    cy <= Math.max(ay, by);
}

/** True when closed segments ab and cd share at least one point. */
function segmentsIntersect(
  ax: number,
  ay: number,
  bx: number,
  by: number,
  cx: number,
  cy: number,
  dx: number,
  dy: number,
): boolean {
  const d1 = orient(cx, cy, dx, dy, ax, ay);
  const d2 = orient(cx, cy, dx, dy, bx, by);
  const d3 = orient(ax, ay, bx, by, cx, cy);
  const d4 = orient(ax, ay, bx, by, dx, dy);
  if (((d1 > 0 && d2 < 0) || (d1 < 0 && d2 > 0)) && ((d3 > 0 && d4 < 0) || (d3 < 0 && d4 > 0))) {
    return true;
  }
  if (d1 === 0 && onBox(cx, cy, dx, dy, ax, ay)) return true;
  if (d2 === 0 && onBox(cx, cy, dx, dy, bx, by)) return true;
  if (d3 === 0 && onBox(ax, ay, bx, by, cx, cy)) return true;
  if (d4 === 0 && onBox(ax, ay, bx, by, dx, dy)) return true;
  return false;
}

/**
 * The lexicographically first pair of segments (i < j) of the closed outline that intersect, or
 * null. Segment k runs from point k to point (k + 1) mod n; segment n − 1 is the annulus segment.
 * Adjacent segments may share their common vertex but must not fold back onto each other.
 * Candidate pairs come from a sweep over segments sorted by their smallest x, so traced contours
 * of thousands of points are checked in near-linear time.
 */
function firstSelfIntersection(x: Float64Array, y: Float64Array): [number, number] | null {
  const n = x.length;
  let best: [number, number] | null = null;
  const consider = (i: number, j: number): void => {
    const a = Math.min(i, j), b = Math.max(i, j);
    if (!best || a < best[0] || (a === best[0] && b < best[1])) best = [a, b];
  };
  // Adjacent segments k and k+1 (mod n) overlap only when collinear and folding back.
  for (let k = 0; k < n; k++) {
    const a = k, b = (k + 1) % n, c = (k + 2) % n;
    const ax = x[a]!, ay = y[a]!, bx = x[b]!, by = y[b]!, cx = x[c]!, cy = y[c]!;
    if (orient(ax, ay, bx, by, cx, cy) === 0 && (ax - bx) * (cx - bx) + (ay - by) * (cy - by) > 0) {
      consider(k, (k + 1) % n);
    }
  }
  if (n === 3) return best;
  const minX = new Float64Array(n), maxX = new Float64Array(n);
  const minY = new Float64Array(n), maxY = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const j = (k + 1) % n;
    minX[k] = Math.min(x[k]!, x[j]!);
    maxX[k] = Math.max(x[k]!, x[j]!);
    minY[k] = Math.min(y[k]!, y[j]!);
    maxY[k] = Math.max(y[k]!, y[j]!);
  }
  const order = Array.from({ length: n }, (_, k) => k).sort((a, b) => minX[a]! - minX[b]!);
  for (let p = 0; p < n; p++) {
    const i = order[p]!;
    const ax = x[i]!, ay = y[i]!, bx = x[(i + 1) % n]!, by = y[(i + 1) % n]!;
    for (let r = p + 1; r < n; r++) {
      const j = order[r]!;
      if (minX[j]! > maxX[i]!) break;
      const d = Math.abs(i - j);
      if (d === 1 || d === n - 1) continue; // adjacent (including through point 0)
      if (maxY[j]! < minY[i]! || minY[j]! > maxY[i]!) continue;
      const cx = x[j]!, cy = y[j]!, dx = x[(j + 1) % n]!, dy = y[(j + 1) % n]!;
      if (segmentsIntersect(ax, ay, bx, by, cx, cy, dx, dy)) consider(i, j);
    }
  }
  return best;
}

/**
 * The long axis of a validated contour: from the annulus midpoint (midpoint of the first and last
 * points) to the apex (the contour point farthest from that midpoint; the first such point when
 * several are equally far).
 *
 * @param c Validated coordinates from {@linkcode validateContour}.
 * @returns Annulus midpoint, apex, apex index, long-axis length (cm) and annulus width (cm).
 *
 * @example Half of an ellipse standing on its minor axis
 * ```ts
 * import { contourLongAxis, validateContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = validateContour([[-2, 0], [-1, 6], [0, 8], [1, 6], [2, 0]], "Demo", "apical");
 * assert.equal(contourLongAxis(c).lengthCm, 8);
 * ```
 */
export function contourLongAxis(c: ContourCoordinates): LongAxis {
  const n = c.x.length;
  const x0 = c.x[0]!, y0 = c.y[0]!, x1 = c.x[n - 1]!, y1 = c.y[n - 1]!;
  const mx = (x0 + x1) / 2, my = (y0 + y1) / 2;
  let best = -1, bestIndex = 0;
  for (let i = 0; i < n; i++) {
    const d = Math.hypot(c.x[i]! - mx, c.y[i]! - my);
    if (d > best) {
      best = d;
      bestIndex = i;
    }
  }
  return {
    annulusMidpoint: [mx, my],
    apex: [c.x[bestIndex]!, c.y[bestIndex]!],
    apexIndex: bestIndex,
    lengthCm: best,
    annulusWidthCm: Math.hypot(x1 - x0, y1 - y0),
  };
}

/**
 * Area enclosed by the contour closed by the annulus segment (shoelace formula), cm².
 *
 * Formula: A = ½·|Σ (xᵢ·yᵢ₊₁ − xᵢ₊₁·yᵢ)| over the closed outline.
 *
 * @param c Validated coordinates from {@linkcode validateContour}.
 * @returns The enclosed area in cm².
 *
 * @example A right triangle with legs 3 and 4 cm
 * ```ts
 * import { contourArea, validateContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(contourArea(validateContour([[0, 0], [0, 4], [3, 0]], "Demo", "apical")), 6);
 * ```
 */
export function contourArea(c: ContourCoordinates): number {
  const n = c.x.length;
  let twice = 0;
  for (let i = 0; i < n; i++) {
    const j = (i + 1) % n;
    twice += c.x[i]! * c.y[j]! - c.x[j]! * c.y[i]!;
  }
  return Math.abs(twice) / 2;
}

/** Contour points in the long-axis frame: `axialCm` from the annulus midpoint towards the apex,
 * `transverseCm` perpendicular to it (positive to the left of the axis direction). */
export interface AxisFrame {
  /** Axial coordinate of each point, cm. */
  readonly axialCm: Float64Array;
  /** Transverse coordinate of each point, cm. */
  readonly transverseCm: Float64Array;
}

/**
 * Expresses a validated contour in its long-axis frame (origin at the annulus midpoint, axial
 * direction towards the apex).
 *
 * @param c Validated coordinates from {@linkcode validateContour}.
 * @param axis The long axis from {@linkcode contourLongAxis}.
 * @returns Axial and transverse coordinates of every point, cm.
 *
 * @example The apex lies on the axis at distance L
 * ```ts
 * import { contourAxisFrame, contourLongAxis, validateContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = validateContour([[1, 1], [4, 5], [1, 3]], "Demo", "apical");
 * const axis = contourLongAxis(c);
 * const f = contourAxisFrame(c, axis);
 * assert.ok(Math.abs(f.axialCm[axis.apexIndex]! - axis.lengthCm) < 1e-12);
 * assert.ok(Math.abs(f.transverseCm[axis.apexIndex]!) < 1e-12);
 * ```
 */
export function contourAxisFrame(c: ContourCoordinates, axis: LongAxis): AxisFrame {
  const n = c.x.length;
  const [mx, my] = axis.annulusMidpoint;
  const L = axis.lengthCm;
  const ux = (axis.apex[0] - mx) / L, uy = (axis.apex[1] - my) / L; // along the long axis
  const vx = -uy, vy = ux; // perpendicular
  const axialCm = new Float64Array(n);
  const transverseCm = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const dx = c.x[i]! - mx, dy = c.y[i]! - my;
    axialCm[i] = dx * ux + dy * uy;
    transverseCm[i] = dx * vx + dy * vy;
  }
  return { axialCm, transverseCm };
}

/** The chords of one disc: where the perpendicular at mid-slab lies inside the cavity. */
export interface DiscChord {
  /** Axial position of the disc's measuring line, cm from the annulus midpoint. */
  readonly axialCm: number;
  /** Inside intervals along the perpendicular, as [from, to] transverse coordinates in cm. */
  readonly intervals: readonly (readonly [number, number])[];
  /** Disc diameter: the summed length of the inside intervals, cm. */
  readonly diameterCm: number;
}

/**
 * The disc chords of a validated contour: for each of `discCount` slabs of equal height, the
 * perpendicular to the long axis at mid-slab and the intervals of it that lie inside the contour
 * closed by the annulus segment (see the module convention).
 *
 * @param c Validated coordinates from {@linkcode validateContour}.
 * @param axis The long axis from {@linkcode contourLongAxis}.
 * @param discCount Number of discs (20 in the guideline method).
 * @returns One chord set per disc, from the annulus towards the apex.
 *
 * @example A triangle 4 cm wide and 8 cm long: the first disc (at 0.2 cm) is 3.9 cm wide
 * ```ts
 * import { contourDiscChords, contourLongAxis, validateContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = validateContour([[-2, 0], [0, 8], [2, 0]], "Demo", "apical");
 * const chords = contourDiscChords(c, contourLongAxis(c), 20);
 * assert.ok(Math.abs(chords[0]!.diameterCm - 3.9) < 1e-12);
 * ```
 */
export function contourDiscChords(
  c: ContourCoordinates,
  axis: LongAxis,
  discCount: number,
): DiscChord[] {
  const n = c.x.length;
  const { axialCm: s, transverseCm: q } = contourAxisFrame(c, axis);
  const h = axis.lengthCm / discCount;
  const out: DiscChord[] = [];
  const crossings: number[] = [];
  for (let k = 0; k < discCount; k++) {
    const t = (k + 0.5) * h;
    crossings.length = 0;
    for (let i = 0; i < n; i++) {
      const j = (i + 1) % n;
      const si = s[i]! - t, sj = s[j]! - t;
      // Half-open rule (a vertex on the line counts as above it): crossings come in pairs.
      if ((si > 0) !== (sj > 0)) {
        const f = si / (si - sj);
        crossings.push(q[i]! + f * (q[j]! - q[i]!));
      }
    }
    crossings.sort((a, b) => a - b);
    const intervals: [number, number][] = [];
    let width = 0;
    for (let m = 0; m + 1 < crossings.length; m += 2) {
      intervals.push([crossings[m]!, crossings[m + 1]!]);
      width += crossings[m + 1]! - crossings[m]!;
    }
    out.push({ axialCm: t, intervals, diameterCm: width });
  }
  return out;
}

/**
 * Disc diameters of a validated contour: the cavity width perpendicular to the long axis at the
 * middle of each of `discCount` slabs of equal height (see the module convention); the
 * `diameterCm` of {@linkcode contourDiscChords}.
 *
 * @param c Validated coordinates from {@linkcode validateContour}.
 * @param axis The long axis from {@linkcode contourLongAxis}.
 * @param discCount Number of discs (20 in the guideline method).
 * @returns Diameters in cm, from the annulus towards the apex.
 *
 * @example A 2 cm wide chamber with a pointed apex: discs in the straight part are 2 cm wide
 * ```ts
 * import { contourLongAxis, discDiameters, validateContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = validateContour([[-1, 0], [-1, 4], [0, 6], [1, 4], [1, 0]], "Demo", "apical");
 * const d = discDiameters(c, contourLongAxis(c), 20);
 * assert.ok(Math.abs(d[5]! - 2) < 1e-12); // disc 5 sits 1.65 cm above the annulus
 * ```
 */
export function discDiameters(
  c: ContourCoordinates,
  axis: LongAxis,
  discCount: number,
): Float64Array {
  return Float64Array.from(contourDiscChords(c, axis, discCount), (d) => d.diameterCm);
}
