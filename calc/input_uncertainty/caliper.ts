/**
 * Caliper placement from the imaging system: the Type B components of placing one caliper on one
 * boundary (display pixel, axial resolution along the beam, lateral resolution across it at the
 * measurement depth), their combination, and what they give a distance (two boundaries) or a
 * traced area (a whole contour). The resolutions come from the physics calculations' own
 * formulas ({@linkcode axialResolution}, {@linkcode lateralResolution}).
 *
 * These are the imaging system's limits only: where an observer puts the caliper inside the
 * resolution cell, and how the boundary is chosen (leading edge, blood–tissue interface), adds an
 * observer component that repeated measurements show (see {@linkcode repeatedBeats}).
 *
 * @module
 */
import { defineArguments, notAbove } from "../core/calculation.ts";
import { choiceError } from "../core/issues.ts";
import type { InputConstraint } from "../core/types.ts";
import { validateInputs } from "../core/validate.ts";
import { DEPTH } from "../quantities/ultrasound.ts";
import { CHAMBER_AREA } from "../quantities/structure.ts";
import { IMAGE_ROWS, TRACED_PERIMETER } from "../quantities/uncertainty.ts";
import { axialResolution } from "../physics/wave.ts";
import { lateralResolution } from "../physics/beam.ts";
import { HOSKINS, KREMKAU, SZABO } from "../physics/citations.ts";
import { normal, type NormalInput } from "../uncertainty/distributions.ts";
import { JCGM_100 } from "./citations.ts";
import { type ModelProvenance, notAnObject, withModelDisplay } from "./shared.ts";

/** Which way the caliper moves to find the boundary: along the beam (the beam crosses the
 * boundary; resolved by the pulse length) or across the beam (the boundary lies side-on; resolved
 * by the beam width). */
export type BoundaryOrientation = "alongBeam" | "acrossBeam";

const ORIENTATIONS: readonly BoundaryOrientation[] = ["alongBeam", "acrossBeam"];

/** The settings and geometry of {@linkcode caliperPlacement}. */
export interface CaliperSettings {
  /** Displayed image depth, cm (or a depth string). */
  readonly imageDepthCm: number | string;
  /** Display pixel rows over which the depth is drawn. */
  readonly imageRows: number;
  /** Transmit frequency, MHz. */
  readonly transmitFrequencyMHz: number | string;
  /** Cycles in the transmitted imaging pulse. */
  readonly cyclesPerPulse: number;
  /** Active aperture width in the scan plane, mm. */
  readonly apertureMm: number | string;
  /** Depth of the transmit focus, cm. */
  readonly focalDepthCm: number | string;
  /** Depth of the boundary measured, cm (at most the image depth). */
  readonly measurementDepthCm: number | string;
  /** Speed of sound the scanner assumes, m/s. @default 1540 */
  readonly soundSpeedMps?: number | string;
  /** "alongBeam": the beam crosses the boundary (M-mode or parasternal wall thickness, an LVOT
   * diameter measured along the beam); "acrossBeam": the boundary lies side-on (a lateral wall
   * in an apical view, a diameter measured across the beam). */
  readonly orientation: BoundaryOrientation;
}

/** One Type B component of placing a caliper on a boundary. */
export interface CaliperComponent {
  /** Key: "pixel", "axialResolution" or "lateralResolution". */
  readonly name: "pixel" | "axialResolution" | "lateralResolution";
  /** What a reader sees. */
  readonly label: string;
  /** Full width R of the cell the boundary can lie anywhere in, mm. */
  readonly cellWidthMm: number;
  /** Standard uncertainty R/√12 (rectangular over ±R/2), mm. */
  readonly standardUncertaintyMm: number;
  /** The same in cm, the canonical unit of cardiac dimensions. */
  readonly standardUncertaintyCm: number;
  /** Where the cell width comes from. */
  readonly source: string;
}

/** The result of {@linkcode caliperPlacement}. */
export interface CaliperPlacement extends ModelProvenance {
  /** Brand. */
  readonly kind: "sonorigor.caliperPlacement";
  /** The settings, checked and in canonical units. */
  readonly settings: {
    readonly imageDepthCm: number;
    readonly imageRows: number;
    readonly transmitFrequencyMHz: number;
    readonly cyclesPerPulse: number;
    readonly apertureMm: number;
    readonly focalDepthCm: number;
    readonly measurementDepthCm: number;
    readonly soundSpeedMps: number;
    readonly orientation: BoundaryOrientation;
  };
  /** Display pixel size p = depth / rows, mm. */
  readonly pixelSizeMm: number;
  /** Axial resolution (half the spatial pulse length), mm. */
  readonly axialResolutionMm: number;
  /** Lateral resolution at the focus (pulse-echo −6 dB beam width), mm. */
  readonly beamWidthAtFocusMm: number;
  /** Beam width at the measurement depth, √(w_f² + (D·(z − z_f)/z_f)²), mm. */
  readonly beamWidthAtDepthMm: number;
  /** The components for this boundary's orientation: the pixel, then its resolution. */
  readonly components: readonly CaliperComponent[];
  /** Combined standard uncertainty of one boundary, √Σu², mm. */
  readonly boundaryUncertaintyMm: number;
  /** The same in cm. */
  readonly boundaryUncertaintyCm: number;
}

const WHERE = "Caliper placement";

const SETTING_SCHEMA = defineArguments(WHERE, {
  imageDepthCm: {
    quantity: DEPTH,
    label: "Image depth",
    description: "Displayed image depth, drawn over the image rows",
  },
  imageRows: IMAGE_ROWS,
  transmitFrequencyMHz: axialResolution.inputs.transmitFrequencyMHz,
  cyclesPerPulse: axialResolution.inputs.cyclesPerPulse,
  apertureMm: lateralResolution.inputs.apertureMm,
  focalDepthCm: lateralResolution.inputs.focalDepthCm,
  measurementDepthCm: {
    quantity: DEPTH,
    label: "Measurement depth",
    description: "Depth of the boundary the caliper is placed on",
  },
  soundSpeedMps: axialResolution.inputs.soundSpeedMps,
});

const SETTINGS = {
  ...SETTING_SCHEMA,
  constraints: [
    notAbove<(typeof SETTING_SCHEMA.inputNames)[number]>("measurementDepthCm", "imageDepthCm"),
  ],
};

const RESOLUTION_CELL_NOTE =
  "Each resolution cell is taken as a rectangular distribution over ±R/2 (u = R/√12): the boundary lies anywhere in the cell with equal chance (common practice, no single source)";

/**
 * The Type B components of placing one caliper on one boundary, from the scanner's settings.
 *
 * Formulas:
 * - display pixel p = image depth / image rows; quantisation over ±p/2, u_pixel = p/√12
 *   (JCGM 100:2008 F.2.2.1, the resolution of a digital indication);
 * - along the beam: axial resolution R_ax = SPL/2 = n·λ/2 ({@linkcode axialResolution}),
 *   u = R_ax/√12;
 * - across the beam: the beam width at the measurement depth z,
 *   w(z) = √(w_f² + (D·(z − z_f)/z_f)²), where w_f = 0.886·λ·z_f/D is the width at the focus
 *   ({@linkcode lateralResolution}) and D·|z − z_f|/z_f the width of the geometric cone of rays
 *   from an aperture D converging to the focus z_f; u = w(z)/√12;
 * - one boundary: u_b = √(u_pixel² + u_resolution²).
 *
 * Sources: the pixel rule and the rectangular cell, JCGM 100:2008 §4.3.7 and F.2.2.1; the
 * resolutions, Kremkau 2015 ch. 3 and Szabo 2014 ch. 6. The widening away from the focus is the
 * form of a Gaussian beam's width, w₀·√(1 + (Δz/z_R)²), with its far slope set to the geometric
 * cone: common practice, no single source; it ignores side lobes, apodisation, dynamic receive
 * focusing (which narrows the receive beam at every depth) and the elevation (slice) width.
 *
 * @param settings Depth and rows of the display, pulse, aperture, focus, measurement depth and the
 * boundary's orientation.
 * @returns The components with their sources, the combined boundary uncertainty, and the
 * resolutions; it displays itself in a notebook.
 * @throws {TypeError} For a missing or mistyped setting, or an orientation that is not
 * "alongBeam" or "acrossBeam".
 * @throws {RangeError} For a setting outside its valid range, or a measurement deeper than the
 * image.
 *
 * @example 3 MHz, 2 cycles, 16 cm over 800 rows, a wall met along the beam
 * ```ts
 * import { caliperPlacement } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = caliperPlacement({
 *   imageDepthCm: 16, imageRows: 800, transmitFrequencyMHz: 3, cyclesPerPulse: 2,
 *   apertureMm: 20, focalDepthCm: 8, measurementDepthCm: 10, orientation: "alongBeam",
 * });
 * // p = 160/800 = 0.2 mm; R_ax = 2·(1540/3000)/2 = 0.5133 mm (hand check)
 * assert.ok(Math.abs(c.pixelSizeMm - 0.2) < 1e-12);
 * assert.ok(Math.abs(c.boundaryUncertaintyMm - Math.hypot(0.2, 1540 / 3000) / Math.sqrt(12)) < 1e-12);
 * ```
 */
export function caliperPlacement(settings: CaliperSettings): CaliperPlacement {
  if (typeof settings !== "object" || settings === null) {
    throw notAnObject(WHERE, "settings", settings, "as an object of scanner settings");
  }
  const { orientation, ...values } = settings;
  if (!ORIENTATIONS.includes(orientation)) {
    throw choiceError(WHERE, "orientation", ORIENTATIONS, orientation);
  }
  const { values: x, flags } = validateInputs(SETTINGS, values);
  const pixelSizeMm = (x.imageDepthCm * 10) / x.imageRows;
  const { axialResolutionMm } = axialResolution.formula({
    transmitFrequencyMHz: x.transmitFrequencyMHz,
    cyclesPerPulse: x.cyclesPerPulse,
    soundSpeedMps: x.soundSpeedMps,
  });
  const { beamWidthMm } = lateralResolution.formula({
    transmitFrequencyMHz: x.transmitFrequencyMHz,
    apertureMm: x.apertureMm,
    focalDepthCm: x.focalDepthCm,
    soundSpeedMps: x.soundSpeedMps,
  });
  const coneMm = (x.apertureMm * Math.abs(x.measurementDepthCm - x.focalDepthCm)) /
    x.focalDepthCm;
  const beamWidthAtDepthMm = Math.hypot(beamWidthMm, coneMm);
  const component = (
    name: CaliperComponent["name"],
    label: string,
    cellWidthMm: number,
    source: string,
  ): CaliperComponent => {
    const u = cellWidthMm / Math.sqrt(12);
    return {
      name,
      label,
      cellWidthMm,
      standardUncertaintyMm: u,
      standardUncertaintyCm: u / 10,
      source,
    };
  };
  const components = [
    component(
      "pixel",
      "Display pixel (image depth / rows)",
      pixelSizeMm,
      "JCGM 100:2008 F.2.2.1 (resolution of a digital indication)",
    ),
    orientation === "alongBeam"
      ? component(
        "axialResolution",
        "Axial resolution (half the pulse length)",
        axialResolutionMm,
        "Kremkau 2015 ch. 3 (axial resolution = SPL/2)",
      )
      : component(
        "lateralResolution",
        `Beam width at ${x.measurementDepthCm} cm (focus at ${x.focalDepthCm} cm)`,
        beamWidthAtDepthMm,
        "Szabo 2014 ch. 6 (width at the focus); widening away from it: common practice, no single source",
      ),
  ];
  const boundaryUncertaintyMm = Math.sqrt(
    components.reduce((sum, c) => sum + c.standardUncertaintyMm ** 2, 0),
  );
  const result: CaliperPlacement = {
    kind: "sonorigor.caliperPlacement",
    settings: { ...x, orientation },
    pixelSizeMm,
    axialResolutionMm,
    beamWidthAtFocusMm: beamWidthMm,
    beamWidthAtDepthMm,
    components,
    boundaryUncertaintyMm,
    boundaryUncertaintyCm: boundaryUncertaintyMm / 10,
    notes: [
      RESOLUTION_CELL_NOTE,
      "Display pixel = image depth / image rows: the image is drawn with the depth over its rows (common practice, no source)",
      ...(orientation === "acrossBeam"
        ? [
          "Beam width away from the focus: w(z) = √(w_f² + (D·(z − z_f)/z_f)²), the diffraction-limited width at the focus combined with the geometric cone of the focused aperture (common practice, no single source); dynamic receive focusing narrows it, side lobes and the slice width widen it",
        ]
        : []),
      "Imaging-system components only: the observer's choice of the edge adds a component that repeated measurements show",
    ],
    warnings: flags,
    cautions: [],
    citations: [JCGM_100, KREMKAU, SZABO, HOSKINS],
  };
  return withModelDisplay(
    result,
    `${WHERE}: one boundary ${
      orientation === "alongBeam" ? "along" : "across"
    } the beam at ${x.measurementDepthCm} cm`,
    ["Component", "Cell width R (mm)", "u = R/√12 (mm)", "Source"],
    [
      ...components.map((c) => [c.label, c.cellWidthMm, { u: c.standardUncertaintyMm }, c.source]),
      ["One boundary, combined", "", { u: boundaryUncertaintyMm }, "√Σu²"],
    ],
  );
}

/** An uncertain input made from a caliper model, with where its uncertainty comes from. */
export interface CaliperInput extends ModelProvenance {
  /** The input to give `propagate`: the measured value with the caliper's standard uncertainty
   * (in mm or cm², converted to the input's unit when matched). */
  readonly input: NormalInput;
  /** Its standard uncertainty in the canonical unit of the measurement (cm for a distance, cm²
   * for an area). */
  readonly standardUncertainty: number;
  /** That unit. */
  readonly unit: "cm" | "cm^2";
}

function checkPlacement(placement: CaliperPlacement, where: string): void {
  if ((placement as { kind?: unknown } | null)?.kind !== "sonorigor.caliperPlacement") {
    throw notAnObject(where, "placement", placement, "as the result of caliperPlacement(…)");
  }
}

/**
 * A distance between two boundaries measured with calipers (a diameter, a wall thickness, a
 * length): the two placements are independent, so u(d) = √2·u_b.
 *
 * Formula: u(d) = √(u_b² + u_b²) = √2·u_b, with u_b from {@linkcode caliperPlacement} (both
 * boundaries on one line, so with one orientation).
 *
 * Source: JCGM 100:2008 eq. (10) for the difference of two independent positions.
 *
 * @param placement The boundary model.
 * @param value The measured distance: a number in the unit of the input it will feed (cm for the
 * package's dimensions) or a string ("21 mm").
 * @returns The normal input `normal(value, √2·u_b)` with its provenance.
 * @throws {TypeError} When `placement` is not a caliper model.
 *
 * @example
 * ```ts
 * import { caliperDistance, caliperPlacement, continuityValveArea, propagate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = caliperPlacement({ imageDepthCm: 16, imageRows: 800, transmitFrequencyMHz: 3,
 *   cyclesPerPulse: 2, apertureMm: 20, focalDepthCm: 8, measurementDepthCm: 9, orientation: "alongBeam" });
 * const d = caliperDistance(c, 2.1);
 * const r = propagate(continuityValveArea, { lvotDiameterCm: d.input, lvotVtiCm: 20, avVtiCm: 80 });
 * assert.ok(Math.abs(r.inputs.lvotDiameterCm.standardUncertainty - Math.SQRT2 * c.boundaryUncertaintyCm) < 1e-12);
 * ```
 */
export function caliperDistance(placement: CaliperPlacement, value: number | string): CaliperInput {
  const where = "Caliper distance";
  checkPlacement(placement, where);
  const u = Math.SQRT2 * placement.boundaryUncertaintyMm;
  return withModelDisplay(
    {
      input: normal(value, `${u} mm`),
      standardUncertainty: u / 10,
      unit: "cm",
      notes: [
        ...placement.notes,
        "Two boundaries placed independently: u(d) = √2·u_b (JCGM 100:2008 eq. (10))",
      ],
      warnings: placement.warnings,
      cautions: [],
      citations: placement.citations,
    },
    where,
    ["Measured", "u_b (mm)", "u(d) = √2·u_b (mm)"],
    [[String(value), placement.boundaryUncertaintyMm, u]],
  );
}

const AREA_SCHEMA = defineArguments("Caliper traced area", {
  areaCm2: {
    quantity: CHAMBER_AREA,
    label: "Traced area",
    description: "Area enclosed by a contour traced on the image",
  },
  perimeterCm: TRACED_PERIMETER,
});

const AREA_ARGUMENTS = {
  ...AREA_SCHEMA,
  constraints: [{
    inputs: ["areaCm2", "perimeterCm"],
    description:
      "'perimeterCm'² >= 4π·'areaCm2' (no contour encloses more area than the circle of its perimeter)",
    holds: ({ areaCm2, perimeterCm }) => perimeterCm ** 2 >= 4 * Math.PI * areaCm2 * (1 - 1e-12),
  }] as InputConstraint<"areaCm2" | "perimeterCm">[],
};

/**
 * An area traced on the image: when the whole contour is offset by δ (a boundary convention, a
 * gain setting, the resolution cell), the area changes by P·δ, so u(A) = P·u_b.
 *
 * Formula: u(A) = P·u_b, P the traced perimeter: the first-order term of Steiner's formula for a
 * contour offset outward by δ, A(δ) = A + P·δ + π·δ² for a convex contour (a circle of radius r:
 * π(r + δ)² = πr² + 2πr·δ + πδ²).
 *
 * Source: Steiner's formula for parallel convex sets (from memory; the circle case is
 * hand-checkable). The assumption is a coherent offset of the whole contour (the same δ all
 * round), which is what a boundary convention or a resolution cell does; independent errors at
 * many points along the contour would largely cancel and give much less.
 *
 * @param placement The boundary model (use "acrossBeam" when much of the contour is lateral).
 * @param traced The traced area (cm²) and its perimeter (cm).
 * @returns The normal input `normal(area, P·u_b)` with its provenance.
 * @throws {TypeError} When `placement` is not a caliper model, or a value is missing or mistyped.
 * @throws {RangeError} For an area or perimeter outside its range, or an area larger than the
 * circle of that perimeter.
 *
 * @example A circle of radius 2 cm: P = 4π cm, A = 4π cm²
 * ```ts
 * import { caliperPlacement, caliperTracedArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = caliperPlacement({ imageDepthCm: 16, imageRows: 800, transmitFrequencyMHz: 3,
 *   cyclesPerPulse: 2, apertureMm: 20, focalDepthCm: 8, measurementDepthCm: 12, orientation: "acrossBeam" });
 * const a = caliperTracedArea(c, { areaCm2: 4 * Math.PI, perimeterCm: 4 * Math.PI });
 * assert.ok(Math.abs(a.standardUncertainty - 4 * Math.PI * c.boundaryUncertaintyCm) < 1e-12);
 * ```
 */
export function caliperTracedArea(
  placement: CaliperPlacement,
  traced: { readonly areaCm2: number | string; readonly perimeterCm: number | string },
): CaliperInput {
  const where = "Caliper traced area";
  checkPlacement(placement, where);
  const { values: x, flags } = validateInputs(AREA_ARGUMENTS, traced);
  const u = x.perimeterCm * placement.boundaryUncertaintyCm;
  return withModelDisplay(
    {
      input: normal(x.areaCm2, `${u} cm^2`),
      standardUncertainty: u,
      unit: "cm^2",
      notes: [
        ...placement.notes,
        "The whole contour offset by one boundary error δ: u(A) = P·u_b (first-order term of Steiner's formula, from memory; exact for a circle to first order); independent errors along the contour would give much less",
      ],
      warnings: [...placement.warnings, ...flags],
      cautions: [],
      citations: placement.citations,
    },
    where,
    ["Area (cm²)", "Perimeter (cm)", "u_b (cm)", "u(A) = P·u_b (cm²)"],
    [[x.areaCm2, x.perimeterCm, placement.boundaryUncertaintyCm, u]],
  );
}
