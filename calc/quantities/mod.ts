/**
 * The vocabulary of measured and derived quantities, each declared once, and the explicit list of
 * them that tables and models look quantities up in.
 *
 * @module
 */
import type { Quantity } from "../core/types.ts";
import * as body from "./body.ts";
import * as structure from "./structure.ts";
import * as flow from "./flow.ts";
import * as scores from "./scores.ts";

export * from "./body.ts";
export * from "./structure.ts";
export * from "./flow.ts";
export * from "./scores.ts";

/**
 * Every quantity the package declares, by id (family members derive further quantities from
 * these). A test checks that every exported quantity is listed.
 *
 * @example
 * ```ts
 * import { HEIGHT, QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(QUANTITIES.get("height"), HEIGHT);
 * ```
 */
export const QUANTITIES: ReadonlyMap<string, Quantity> = new Map(
  [
    body.HEIGHT,
    body.WEIGHT,
    body.AGE,
    body.BODY_SURFACE_AREA,
    structure.LV_END_DIASTOLIC_DIAMETER,
    structure.LV_END_SYSTOLIC_DIAMETER,
    structure.SEPTAL_THICKNESS,
    structure.POSTERIOR_WALL_THICKNESS,
    structure.LV_END_DIASTOLIC_VOLUME,
    structure.LV_END_SYSTOLIC_VOLUME,
    structure.EJECTION_FRACTION,
    structure.LV_MASS,
    structure.LV_MASS_INDEX,
    structure.LA_VOLUME,
    structure.LA_VOLUME_INDEX,
    structure.LVOT_DIAMETER,
    structure.RVOT_DIAMETER,
    structure.AORTIC_ANNULUS,
    structure.AORTIC_ROOT,
    structure.SINOTUBULAR_JUNCTION,
    structure.ASCENDING_AORTA,
    structure.MAIN_PULMONARY_ARTERY,
    structure.RIGHT_PULMONARY_ARTERY,
    structure.LEFT_PULMONARY_ARTERY,
    structure.MITRAL_ANNULUS,
    structure.TRICUSPID_ANNULUS,
    flow.STROKE_VOLUME,
    flow.STROKE_VOLUME_INDEX,
    flow.CARDIAC_OUTPUT,
    flow.CARDIAC_INDEX,
    flow.AORTIC_VALVE_AREA,
    flow.AORTIC_VALVE_AREA_INDEX,
    scores.PERCENTILE,
  ].map((q) => [q.id, q]),
);
