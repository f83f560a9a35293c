/**
 * Two-dimensional chamber volumes: the method of discs (biplane and single-plane) from traced
 * contours, the area–length method, ejection fraction from traced end-diastolic and end-systolic
 * contours, and left-atrial volume.
 *
 * Contours follow the convention of the contour module: open point lists in cm from one annulus
 * hinge point around the cavity to the other; long axis from the annulus midpoint to the farthest
 * contour point; discs measured at mid-slab, perpendicular to each view's own long axis.
 *
 * The contour functions are not chains: their inputs are point lists, not quantities. Each
 * reduces its contours to scalar inputs (Σ aᵢ·bᵢ, areas, lengths) and evaluates the calculations
 * defined here, so every formula is written once and every value is checked by the validator.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import { evaluate } from "../core/evaluate.ts";
import type { Calculation } from "../core/types.ts";
import { checkConstraints, checkValue, quantityField } from "../core/validate.ts";
import { issueError, throwIfErrors } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import {
  CHAMBER_AREA,
  CHAMBER_LENGTH,
  CHAMBER_VOLUME,
  DISC_COUNT,
  DISC_DIAMETER_PRODUCT_SUM,
  LA_VOLUME,
} from "../quantities/structure.ts";
import { BODY_SURFACE_AREA } from "../quantities/body.ts";
import {
  type Contour,
  contourArea,
  type ContourCoordinates,
  contourDiscChords,
  contourLongAxis,
  type DiscChord,
  type LongAxis,
  validateContour,
} from "./contour.ts";
import { ejectionFraction } from "./function.ts";
import type { ResultNotes } from "./types.ts";
import { LANG_2015, SCHILLER_1989 } from "./citations.ts";
import { indexedToBsa } from "../body/indexing.ts";

/** Measurement / BSA for millilitres: the one indexing definition of the body-size module. */
const indexLaVolume = indexedToBsa(LA_VOLUME);

/**
 * The number of discs of the guideline method (Lang 2015): the typical value of the disc-count
 * quantity, where it is declared once.
 *
 * @example
 * ```ts
 * import { biplaneDiscVolume, GUIDELINE_DISC_COUNT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const half = [[-2, 0], [0, 8], [2, 0]] as [number, number][];
 * assert.equal(biplaneDiscVolume({ fourChamber: half, twoChamber: half }).discCount, GUIDELINE_DISC_COUNT);
 * ```
 */
export const GUIDELINE_DISC_COUNT: number = DISC_COUNT.typical!.min;

/**
 * Volume by summation of elliptical discs, from the summed products of the two orthogonal disc
 * diameters and the long axis. Single-plane discs use the squared diameters (aᵢ = bᵢ).
 *
 * Formula: V [mL] = (π/4) · Σ aᵢ·bᵢ · L/N, diameters and L in cm, N discs (20 in the guideline)
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV volumes, biplane method of
 * discs); Schiller NB et al., J Am Soc Echocardiogr 1989;2:358–367.
 *
 * @example 20 discs of 4 cm × 4 cm over 8 cm: a 4 cm cylinder, π·2²·8 = 100.53 mL
 * ```ts
 * import { discSummationVolume, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(discSummationVolume, { diameterProductSumCm2: 20 * 16, longAxisCm: 8 });
 * assert.ok(Math.abs(r.outputs.volumeMl - 32 * Math.PI) < 1e-9);
 * ```
 */
export const discSummationVolume: Calculation<
  "diameterProductSumCm2" | "longAxisCm" | "discCount",
  "volumeMl"
> = defineCalculation({
  id: "discSummationVolume",
  title: "Method of discs volume",
  description:
    "Chamber volume as a stack of elliptical discs of equal height, from the sum of the products of orthogonal disc diameters.",
  inputs: {
    diameterProductSumCm2: DISC_DIAMETER_PRODUCT_SUM,
    longAxisCm: {
      quantity: CHAMBER_LENGTH,
      description: "Long-axis length used for the disc height (L/N)",
    },
    discCount: { quantity: DISC_COUNT, default: GUIDELINE_DISC_COUNT },
  },
  outputs: { volumeMl: CHAMBER_VOLUME },
  formula: ({ diameterProductSumCm2, longAxisCm, discCount }) => ({
    volumeMl: (Math.PI / 4) * diameterProductSumCm2 * (longAxisCm / discCount),
  }),
  formulaText: "V = (π/4)·Σ aᵢ·bᵢ·L/N",
  citations: [LANG_2015, SCHILLER_1989],
  cautions: [
    "Foreshortened apical views underestimate the long axis and the volume",
    "Trace the compacted myocardium boundary; trabeculae and papillary muscles belong to the cavity",
  ],
  clinical: true,
});

/**
 * Biplane area–length volume from the areas of two orthogonal views and one length.
 *
 * Formula: V [mL] = 0.85 · A₁ · A₂ / L (0.85 ≈ 8/(3π) = 0.8488), areas in cm², L in cm
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LA volume, biplane area–length:
 * L is the shorter of the two long axes, from memory); Schiller NB et al. 1989.
 *
 * @example A₁ = A₂ = 20 cm², L = 5 cm → 0.85·400/5 = 68 mL
 * ```ts
 * import { biplaneAreaLengthVolume, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(biplaneAreaLengthVolume, {
 *   fourChamberAreaCm2: 20,
 *   twoChamberAreaCm2: 20,
 *   lengthCm: 5,
 * });
 * assert.ok(Math.abs(r.outputs.volumeMl - 68) < 1e-9);
 * ```
 */
export const biplaneAreaLengthVolume: Calculation<
  "fourChamberAreaCm2" | "twoChamberAreaCm2" | "lengthCm",
  "volumeMl"
> = defineCalculation({
  id: "biplaneAreaLengthVolume",
  title: "Biplane area–length volume",
  description:
    "Chamber volume from the traced areas of two orthogonal apical views and a long-axis length, assuming an ellipsoid.",
  inputs: {
    fourChamberAreaCm2: {
      quantity: CHAMBER_AREA,
      label: "Apical four-chamber area",
      description: "Traced area in the apical four-chamber view",
    },
    twoChamberAreaCm2: {
      quantity: CHAMBER_AREA,
      label: "Apical two-chamber area",
      description: "Traced area in the apical two-chamber view",
    },
    lengthCm: {
      quantity: CHAMBER_LENGTH,
      description: "Long-axis length (for the left atrium the shorter of the two views)",
    },
  },
  outputs: { volumeMl: CHAMBER_VOLUME },
  formula: ({ fourChamberAreaCm2, twoChamberAreaCm2, lengthCm }) => ({
    volumeMl: (0.85 * fourChamberAreaCm2 * twoChamberAreaCm2) / lengthCm,
  }),
  formulaText: "V = 0.85·A₁·A₂/L",
  citations: [LANG_2015, SCHILLER_1989],
  cautions: ["Assumes an ellipsoidal chamber; distorted chambers are better measured by discs"],
  clinical: true,
});

/**
 * Single-plane area–length volume: {@linkcode biplaneAreaLengthVolume}'s formula with
 * A₁ = A₂ = A. Not a chain: it is one step whose two area inputs take the same value, which a
 * chain (at least two steps) does not express.
 *
 * Formula: V [mL] = 0.85 · A² / L
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV volumes, area–length);
 * Schiller NB et al. 1989.
 *
 * @example A = 30 cm², L = 8.5 cm → 90 mL
 * ```ts
 * import { areaLengthVolume, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(areaLengthVolume, { areaCm2: 30, lengthCm: 8.5 });
 * assert.ok(Math.abs(r.outputs.volumeMl - 90) < 1e-9);
 * ```
 */
export const areaLengthVolume: Calculation<"areaCm2" | "lengthCm", "volumeMl"> = defineCalculation(
  {
    id: "areaLengthVolume",
    title: "Single-plane area–length volume",
    description:
      "Chamber volume from one traced area and its long axis, assuming an ellipsoid of revolution.",
    inputs: {
      areaCm2: { quantity: CHAMBER_AREA, description: "Traced cavity area in one apical view" },
      lengthCm: CHAMBER_LENGTH,
    },
    outputs: { volumeMl: CHAMBER_VOLUME },
    formula: ({ areaCm2, lengthCm }) =>
      biplaneAreaLengthVolume.formula({
        fourChamberAreaCm2: areaCm2,
        twoChamberAreaCm2: areaCm2,
        lengthCm,
      }),
    formulaText: "V = 0.85·A²/L",
    citations: [LANG_2015, SCHILLER_1989],
    cautions: biplaneAreaLengthVolume.cautions,
    clinical: true,
  },
);

/** One apical view reduced to the geometry the volume methods use. */
export interface TracedView {
  /** Name of the view, e.g. "apical four-chamber". */
  readonly view: string;
  /** The long axis (annulus midpoint to apex). */
  readonly longAxis: LongAxis;
  /** Area enclosed by the contour and the annulus segment, cm². */
  readonly areaCm2: number;
  /** Disc diameters from the annulus towards the apex, cm. */
  readonly diameters: Float64Array;
  /** The disc chords (position and inside intervals of each measuring line). */
  readonly chords: readonly DiscChord[];
  /** The validated contour. */
  readonly contour: ContourCoordinates;
}

/** Result of a method-of-discs volume. */
export interface DiscVolume extends ResultNotes {
  /** Volume in mL. */
  readonly volumeMl: number;
  /** Long axis used for the disc height, cm. */
  readonly longAxisCm: number;
  /** Number of discs. */
  readonly discCount: number;
  /** Σ aᵢ·bᵢ, cm² (the scalar input of {@linkcode discSummationVolume}). */
  readonly diameterProductSumCm2: number;
  /** The views used. */
  readonly views: readonly TracedView[];
}

/** Options of the method of discs. */
export interface DiscOptions {
  /** Number of discs. The guideline method uses 20; other counts are for verification (the
   * result is flagged). @default 20 */
  readonly discCount?: number;
}

/** Foreshortening check between two views (common practice, no source). */
const LONG_AXIS_MISMATCH = 0.1;

/** One contour to trace: the argument it came as and the name of its view. */
interface ViewToTrace {
  readonly contour: unknown;
  readonly field: string;
  readonly view: string;
}

/** The disc count asked for, checked as a count (whole number in its valid range). */
function discCountOf(options: DiscOptions | undefined, where: string): number {
  const raw = options?.discCount ?? GUIDELINE_DISC_COUNT;
  const checked = checkValue("discCount", quantityField(DISC_COUNT), raw, { where });
  throwIfErrors(checked.issues); // the typical-range flag comes with the volume's evaluation
  return checked.value!;
}

/** Throws the validator's error when `value` is not an object (the contours argument). */
function checkObject(value: unknown, where: string, field: string, expected: string): void {
  if (typeof value !== "object" || value === null || Array.isArray(value)) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where,
      field,
      received: describeValue(value),
      expected,
    }]);
  }
}

function traceView(v: ViewToTrace, where: string, discCount: number): TracedView {
  const c: ContourCoordinates = validateContour(v.contour, where, v.view, v.field);
  const longAxis = contourLongAxis(c);
  const chords = contourDiscChords(c, longAxis, discCount);
  return {
    view: v.view,
    longAxis,
    areaCm2: contourArea(c),
    diameters: Float64Array.from(chords, (d) => d.diameterCm),
    chords,
    contour: c,
  };
}

function mismatchFlag(a: TracedView, b: TracedView): string[] {
  const la = a.longAxis.lengthCm, lb = b.longAxis.lengthCm;
  const rel = Math.abs(la - lb) / Math.max(la, lb);
  return rel > LONG_AXIS_MISMATCH
    ? [
      `Long axes differ by ${(100 * rel).toFixed(1)} % (${a.view} ${la.toFixed(2)} cm, ${b.view} ${
        lb.toFixed(2)
      } cm): check for foreshortening`,
    ]
    : [];
}

/**
 * The method of discs on one or two traced views: disc i of one view is paired with disc i of the
 * other (single plane: with itself), the disc height uses the longer long axis, and the sum feeds
 * {@linkcode discSummationVolume}.
 */
function discVolume(
  views: readonly ViewToTrace[],
  where: string,
  options: DiscOptions | undefined,
): DiscVolume {
  const n = discCountOf(options, where);
  const traced = views.map((v) => traceView(v, where, n));
  const a = traced[0]!, b = traced[1] ?? a;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += a.diameters[i]! * b.diameters[i]!;
  const longAxisCm = Math.max(a.longAxis.lengthCm, b.longAxis.lengthCm);
  const r = evaluate(discSummationVolume, {
    diameterProductSumCm2: sum,
    longAxisCm,
    discCount: n,
  });
  return {
    volumeMl: r.outputs.volumeMl,
    longAxisCm,
    discCount: n,
    diameterProductSumCm2: sum,
    views: traced,
    flags: [...r.flags, ...(b === a ? [] : mismatchFlag(a, b))],
    cautions: b === a
      ? [...r.cautions, "Single-plane discs assume circular cross-sections"]
      : r.cautions,
  };
}

/** A pair of orthogonal apical contours at one phase of the cycle. */
export interface BiplaneContours {
  /** Apical four-chamber contour, points in cm. */
  readonly fourChamber: Contour;
  /** Apical two-chamber contour, points in cm. */
  readonly twoChamber: Contour;
}

const BIPLANE_EXPECTED = "as an object with 'fourChamber' and 'twoChamber' contours";

/** The two views of a biplane pair, named by their argument path and phase. */
function biplaneViews(contours: BiplaneContours, path = "", phase = ""): ViewToTrace[] {
  return [
    {
      contour: contours.fourChamber,
      field: `${path}fourChamber`,
      view: `${phase}apical four-chamber`,
    },
    {
      contour: contours.twoChamber,
      field: `${path}twoChamber`,
      view: `${phase}apical two-chamber`,
    },
  ];
}

/**
 * Chamber volume by the biplane method of discs from traced contours in two orthogonal apical
 * views (four-chamber and two-chamber).
 *
 * Geometry: in each view, the long axis runs from the annulus midpoint (midpoint of the first and
 * last contour points) to the contour point farthest from it; the axis is cut into N slabs of
 * equal height and each disc diameter is the cavity width perpendicular to the axis at mid-slab.
 * Disc i of one view is paired with disc i of the other (same fraction of each view's own axis).
 * The disc height uses the longer of the two long axes, so that the view more likely to be
 * foreshortened does not shorten the stack.
 *
 * Formula: V [mL] = (π/4) · Σ aᵢ·bᵢ · L/N, L = max(L₄ch, L₂ch), N = 20
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (biplane method of discs);
 * Schiller NB et al., J Am Soc Echocardiogr 1989;2:358–367.
 *
 * @param contours `fourChamber` and `twoChamber` contours, points in cm.
 * @param options `discCount` (default 20; other values for verification only, and flagged).
 * @returns Volume, the long axis used, the per-view geometry, flags and cautions.
 * @throws {TypeError} For contours that are not an object of point arrays.
 * @throws {RangeError} For a contour with fewer than 3 points, non-finite coordinates, repeated
 * points or a self-intersection (the message names the contour and point index), or a disc count
 * that is not a whole number in its valid range.
 *
 * @example Half-ellipse contours (L = 8 cm, D = 4 cm): volume close to π/6·L·D² = 67.02 mL
 * ```ts
 * import { biplaneDiscVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const half = Array.from({ length: 401 }, (_, k) => {
 *   const t = (Math.PI * k) / 400;
 *   return [2 * Math.cos(t), 8 * Math.sin(t)] as [number, number];
 * });
 * const v = biplaneDiscVolume({ fourChamber: half, twoChamber: half }).volumeMl;
 * assert.ok(Math.abs(v / ((Math.PI / 6) * 8 * 16) - 1) < 1e-3);
 * ```
 */
export function biplaneDiscVolume(contours: BiplaneContours, options?: DiscOptions): DiscVolume {
  const where = "Biplane method of discs";
  checkObject(contours, where, "contours", BIPLANE_EXPECTED);
  return discVolume(biplaneViews(contours), where, options);
}

/**
 * Chamber volume by the single-plane method of discs: circular discs whose diameters come from
 * one traced view.
 *
 * Formula: V [mL] = (π/4) · Σ aᵢ² · L/N, N = 20
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (method of discs; single-plane when
 * only one apical view is adequate).
 *
 * @param contour Contour points in cm (annulus hinge, around the cavity, other hinge).
 * @param options `view` names the view in messages (default "apical four-chamber");
 * `discCount` (default 20).
 * @returns Volume, long axis, view geometry, flags and cautions.
 * @throws {TypeError} For a contour that is not an array of points.
 * @throws {RangeError} For an invalid contour (message names the view and point index).
 *
 * @example A half-ellipse of revolution, L = 8 cm, D = 4 cm
 * ```ts
 * import { singlePlaneDiscVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const half = Array.from({ length: 401 }, (_, k) => {
 *   const t = (Math.PI * k) / 400;
 *   return { x: 2 * Math.cos(t), y: 8 * Math.sin(t) };
 * });
 * assert.ok(Math.abs(singlePlaneDiscVolume(half).volumeMl - 67.02) < 0.1);
 * ```
 */
export function singlePlaneDiscVolume(
  contour: Contour,
  options?: DiscOptions & { readonly view?: string },
): DiscVolume {
  const view = options?.view ?? "apical four-chamber";
  return discVolume([{ contour, field: "contour", view }], "Single-plane method of discs", options);
}

/** Result of {@linkcode areaLengthVolumeFromContour}. */
export interface ContourAreaLengthVolume extends ResultNotes {
  /** Volume, mL. */
  readonly volumeMl: number;
  /** Area enclosed by the contour and the annulus segment, cm². */
  readonly areaCm2: number;
  /** Long axis, cm. */
  readonly longAxisCm: number;
}

/**
 * Single-plane area–length volume from a traced contour: the enclosed area (contour closed by the
 * annulus segment) and the long axis feed {@linkcode areaLengthVolume}.
 *
 * Formula: V [mL] = 0.85 · A² / L
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (area–length method).
 *
 * @param contour Contour points in cm.
 * @param options `view` names the view in messages (default "apical four-chamber").
 * @returns Volume, area, long axis, flags and cautions.
 * @throws {TypeError} For a contour that is not an array of points.
 * @throws {RangeError} For an invalid contour (message names the view and point index).
 *
 * @example
 * ```ts
 * import { areaLengthVolumeFromContour } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = areaLengthVolumeFromContour([[-2, 0], [0, 8], [2, 0]]);
 * assert.equal(r.areaCm2, 16); // ½·4·8, hand-checkable
 * assert.ok(Math.abs(r.volumeMl - 0.85 * 256 / 8) < 1e-9);
 * ```
 */
export function areaLengthVolumeFromContour(
  contour: Contour,
  options?: { readonly view?: string },
): ContourAreaLengthVolume {
  const where = "Area–length volume";
  const c = validateContour(contour, where, options?.view ?? "apical four-chamber");
  const axis = contourLongAxis(c);
  const areaCm2 = contourArea(c);
  const r = evaluate(areaLengthVolume, { areaCm2, lengthCm: axis.lengthCm });
  return {
    volumeMl: r.outputs.volumeMl,
    areaCm2,
    longAxisCm: axis.lengthCm,
    flags: r.flags,
    cautions: r.cautions,
  };
}

/** Result of {@linkcode biplaneEjectionFraction}. */
export interface BiplaneEjectionFraction extends ResultNotes {
  /** The end-diastolic volume by discs. */
  readonly endDiastole: DiscVolume;
  /** The end-systolic volume by discs. */
  readonly endSystole: DiscVolume;
  /** Ejection fraction, %. */
  readonly ejectionFractionPercent: number;
  /** Stroke volume, mL. */
  readonly strokeVolumeMl: number;
}

/**
 * Biplane (method of discs) end-diastolic and end-systolic volumes, ejection fraction and stroke
 * volume from four traced contours: the two disc volumes feed {@linkcode ejectionFraction}, whose
 * constraint (ESV ≤ EDV) is checked with this function's name.
 *
 * Formula: EDV, ESV by V = (π/4)·Σ aᵢ·bᵢ·L/20; EF = 100·(EDV − ESV)/EDV; SV = EDV − ESV
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV volumes and EF, biplane
 * method of discs).
 *
 * @param contours End-diastolic and end-systolic contour pairs.
 * @param options `discCount` (default 20).
 * @returns The two volume results, EF (%), SV (mL), flags and cautions.
 * @throws {TypeError} For contours that are not objects of point arrays.
 * @throws {RangeError} For invalid contours (the message names the phase and view), or when the
 * end-systolic volume exceeds the end-diastolic volume.
 *
 * @example
 * ```ts
 * import { biplaneEjectionFraction } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const halfEllipse = (L: number, D: number) =>
 *   Array.from({ length: 201 }, (_, k) => {
 *     const t = (Math.PI * k) / 200;
 *     return [(D / 2) * Math.cos(t), L * Math.sin(t)] as [number, number];
 *   });
 * const r = biplaneEjectionFraction({
 *   endDiastole: { fourChamber: halfEllipse(8, 5), twoChamber: halfEllipse(8, 5) },
 *   endSystole: { fourChamber: halfEllipse(7, 3.5), twoChamber: halfEllipse(7, 3.5) },
 * });
 * // half-ellipsoids: EF = 1 − (7·3.5²)/(8·5²) = 57.1 % (solid geometry)
 * assert.ok(r.ejectionFractionPercent > 55 && r.ejectionFractionPercent < 60);
 * ```
 */
export function biplaneEjectionFraction(
  contours: { readonly endDiastole: BiplaneContours; readonly endSystole: BiplaneContours },
  options?: DiscOptions,
): BiplaneEjectionFraction {
  const where = "Biplane ejection fraction";
  checkObject(contours, where, "contours", "as an object with 'endDiastole' and 'endSystole'");
  checkObject(contours.endDiastole, where, "endDiastole", BIPLANE_EXPECTED);
  checkObject(contours.endSystole, where, "endSystole", BIPLANE_EXPECTED);
  const ed = discVolume(
    biplaneViews(contours.endDiastole, "endDiastole.", "end-diastolic "),
    where,
    options,
  );
  const es = discVolume(
    biplaneViews(contours.endSystole, "endSystole.", "end-systolic "),
    where,
    options,
  );
  const volumes = { endDiastolicVolumeMl: ed.volumeMl, endSystolicVolumeMl: es.volumeMl };
  throwIfErrors(checkConstraints({ ...ejectionFraction, title: where }, volumes));
  const r = evaluate(ejectionFraction, volumes);
  return {
    endDiastole: ed,
    endSystole: es,
    ejectionFractionPercent: r.outputs.ejectionFractionPercent,
    strokeVolumeMl: r.outputs.strokeVolumeMl,
    flags: [
      ...ed.flags.map((f) => `End-diastole: ${f}`),
      ...es.flags.map((f) => `End-systole: ${f}`),
      ...r.flags,
    ],
    cautions: [...new Set([...ed.cautions, ...r.cautions])],
  };
}

/** Result of {@linkcode leftAtrialVolume}. */
export interface LeftAtrialVolume extends ResultNotes {
  /** Biplane area–length volume, mL. */
  readonly areaLengthMl: number;
  /** Biplane method-of-discs volume, mL. */
  readonly discsMl: number;
  /** Area–length volume / BSA, mL/m² (when BSA is given). */
  readonly areaLengthIndexMlPerM2?: number;
  /** Discs volume / BSA, mL/m² (when BSA is given). */
  readonly discsIndexMlPerM2?: number;
  /** Area of the four-chamber contour, cm². */
  readonly fourChamberAreaCm2: number;
  /** Area of the two-chamber contour, cm². */
  readonly twoChamberAreaCm2: number;
  /** Length used by the area–length method (the shorter long axis), cm. */
  readonly areaLengthLengthCm: number;
  /** The method-of-discs result. */
  readonly discs: DiscVolume;
}

/**
 * Left-atrial volume from end-systolic (maximal LA) contours in the apical four- and two-chamber
 * views, by both guideline methods: biplane area–length (areas enclosed by each contour and the
 * mitral annulus segment; L = the shorter of the two long axes, annulus midpoint to atrial roof)
 * and biplane discs (same convention as the LV: the longer long axis). Pulmonary veins and the
 * appendage must be excluded from the trace by the caller.
 *
 * Formula: V_AL = 0.85·A₄ch·A₂ch/min(L₄ch, L₂ch); V_discs = (π/4)·Σ aᵢ·bᵢ·max(L₄ch, L₂ch)/20;
 * LAVi = V/BSA when `bodySurfaceAreaM2` is given (the body-size module's indexing calculation).
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LA volume: biplane area–length
 * and disc summation; the shorter-length rule from memory).
 *
 * @param contours `fourChamber` and `twoChamber` LA contours in cm, hinge to hinge.
 * @param options `bodySurfaceAreaM2` (m², for the indexed volumes), `discCount` (default 20).
 * @returns Both volumes, the indexed volumes when BSA is given, areas, lengths, flags, cautions.
 * @throws {TypeError} For contours that are not an object of point arrays.
 * @throws {RangeError} For an invalid contour or a BSA outside its valid range.
 *
 * @example
 * ```ts
 * import { leftAtrialVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const half = Array.from({ length: 201 }, (_, k) => {
 *   const t = (Math.PI * k) / 200;
 *   return [2 * Math.cos(t), 5 * Math.sin(t)] as [number, number];
 * });
 * const r = leftAtrialVolume({ fourChamber: half, twoChamber: half }, { bodySurfaceAreaM2: 2 });
 * assert.ok(Math.abs(r.discsMl - (Math.PI / 6) * 5 * 16) < 0.2); // half-ellipsoid, solid geometry
 * assert.ok(r.discsIndexMlPerM2 !== undefined && Math.abs(r.discsIndexMlPerM2 - r.discsMl / 2) < 1e-12);
 * ```
 */
export function leftAtrialVolume(
  contours: BiplaneContours,
  options?: DiscOptions & { readonly bodySurfaceAreaM2?: number },
): LeftAtrialVolume {
  const where = "Left atrial volume";
  checkObject(contours, where, "contours", BIPLANE_EXPECTED);
  const bsa = options?.bodySurfaceAreaM2;
  if (bsa !== undefined) {
    const field = quantityField(BODY_SURFACE_AREA);
    throwIfErrors(checkValue("bodySurfaceAreaM2", field, bsa, { where }).issues);
  }
  const discs = discVolume(biplaneViews(contours), where, options);
  const [a, b] = discs.views as [TracedView, TracedView];
  const lengthCm = Math.min(a.longAxis.lengthCm, b.longAxis.lengthCm);
  const al = evaluate(biplaneAreaLengthVolume, {
    fourChamberAreaCm2: a.areaCm2,
    twoChamberAreaCm2: b.areaCm2,
    lengthCm,
  });
  const out = {
    areaLengthMl: al.outputs.volumeMl,
    discsMl: discs.volumeMl,
    fourChamberAreaCm2: a.areaCm2,
    twoChamberAreaCm2: b.areaCm2,
    areaLengthLengthCm: lengthCm,
    discs,
    flags: [...discs.flags, ...al.flags],
    cautions: [
      "Trace at LA end-systole (frame before mitral opening), excluding pulmonary veins and the appendage",
      ...new Set([...discs.cautions, ...al.cautions]),
    ],
  };
  if (bsa === undefined) return out;
  const areaLengthIndex = evaluate(indexLaVolume, { laVolume: out.areaLengthMl, bsaM2: bsa });
  const discsIndex = evaluate(indexLaVolume, { laVolume: out.discsMl, bsaM2: bsa });
  return {
    ...out,
    areaLengthIndexMlPerM2: areaLengthIndex.outputs.laVolumeIndex!,
    discsIndexMlPerM2: discsIndex.outputs.laVolumeIndex!,
    flags: [...out.flags, ...discsIndex.flags],
    cautions: [...out.cautions, ...indexLaVolume.cautions],
  };
}
