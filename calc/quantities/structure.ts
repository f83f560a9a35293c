/**
 * Quantities of cardiac structure and function: dimensions of chambers, walls, valves and great
 * vessels, volumes, mass, and the indices computed from them.
 *
 * Valid ranges are what a human heart can physically measure (diameters to 12 cm, walls to
 * 5 cm); typical ranges are those seen in adult and pediatric practice. Both are common practice,
 * no source, unless a range says otherwise.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

const NOTE = "common practice, no source";

/**
 * LV internal diameter at end-diastole (LVIDd).
 *
 * @example
 * ```ts
 * import { LV_END_DIASTOLIC_DIAMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_END_DIASTOLIC_DIAMETER.symbol, "LVIDd");
 * ```
 */
export const LV_END_DIASTOLIC_DIAMETER: Quantity = defineQuantity({
  id: "lvEndDiastolicDiameter",
  label: "LV end-diastolic diameter",
  symbol: "LVIDd",
  unit: "cm",
  description: "LV internal diameter at end-diastole (LVIDd), parasternal long axis",
  valid: { min: 0, max: 12, minExclusive: true },
  typical: { min: 3, max: 7.5 },
  typicalPediatric: { min: 1.2, max: 6 },
  resolution: 0.01,
  headers: ["lvidd", "lvedd", "lvdd", "lv end diastolic dimension"],
  rangeNote: NOTE,
});

/**
 * LV internal diameter at end-systole (LVIDs).
 *
 * @example
 * ```ts
 * import { LV_END_SYSTOLIC_DIAMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_END_SYSTOLIC_DIAMETER.unit, "cm");
 * ```
 */
export const LV_END_SYSTOLIC_DIAMETER: Quantity = defineQuantity({
  id: "lvEndSystolicDiameter",
  label: "LV end-systolic diameter",
  symbol: "LVIDs",
  unit: "cm",
  description: "LV internal diameter at end-systole (LVIDs), parasternal long axis",
  valid: { min: 0, max: 12, minExclusive: true },
  typical: { min: 1.5, max: 6.5 },
  typicalPediatric: { min: 0.7, max: 4.5 },
  resolution: 0.01,
  headers: ["lvids", "lvesd", "lvsd", "lv end systolic dimension"],
  rangeNote: NOTE,
});

/**
 * Interventricular septal thickness at end-diastole (IVSd).
 *
 * @example
 * ```ts
 * import { SEPTAL_THICKNESS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(SEPTAL_THICKNESS.symbol, "IVSd");
 * ```
 */
export const SEPTAL_THICKNESS: Quantity = defineQuantity({
  id: "septalThickness",
  label: "Septal thickness",
  symbol: "IVSd",
  unit: "cm",
  description: "Interventricular septal thickness at end-diastole (IVSd)",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.5, max: 2 },
  typicalPediatric: { min: 0.2, max: 1.2 },
  resolution: 0.01,
  headers: ["ivsd", "ivs", "septum", "interventricular septum"],
  rangeNote: NOTE,
});

/**
 * LV posterior (inferolateral) wall thickness at end-diastole (LVPWd).
 *
 * @example
 * ```ts
 * import { POSTERIOR_WALL_THICKNESS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(POSTERIOR_WALL_THICKNESS.symbol, "LVPWd");
 * ```
 */
export const POSTERIOR_WALL_THICKNESS: Quantity = defineQuantity({
  id: "posteriorWallThickness",
  label: "Posterior wall thickness",
  symbol: "LVPWd",
  unit: "cm",
  description: "LV posterior (inferolateral) wall thickness at end-diastole (LVPWd)",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.5, max: 2 },
  typicalPediatric: { min: 0.2, max: 1.2 },
  resolution: 0.01,
  headers: ["lvpwd", "pwd", "lvpw", "posterior wall"],
  rangeNote: NOTE,
});

/**
 * LV end-diastolic volume.
 *
 * @example
 * ```ts
 * import { LV_END_DIASTOLIC_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_END_DIASTOLIC_VOLUME.unit, "mL");
 * ```
 */
export const LV_END_DIASTOLIC_VOLUME: Quantity = defineQuantity({
  id: "lvEndDiastolicVolume",
  label: "LV end-diastolic volume",
  symbol: "EDV",
  unit: "mL",
  description: "Left-ventricular volume at end-diastole",
  valid: { min: 0, max: 2000, minExclusive: true },
  typical: { min: 20, max: 500 },
  typicalPediatric: { min: 2, max: 250 },
  resolution: 1,
  headers: ["edv", "lvedv", "end diastolic volume"],
  rangeNote: NOTE,
});

/**
 * LV end-systolic volume.
 *
 * @example
 * ```ts
 * import { LV_END_SYSTOLIC_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_END_SYSTOLIC_VOLUME.symbol, "ESV");
 * ```
 */
export const LV_END_SYSTOLIC_VOLUME: Quantity = defineQuantity({
  id: "lvEndSystolicVolume",
  label: "LV end-systolic volume",
  symbol: "ESV",
  unit: "mL",
  description: "Left-ventricular volume at end-systole",
  valid: { min: 0, max: 2000 },
  typical: { min: 5, max: 400 },
  typicalPediatric: { min: 1, max: 150 },
  resolution: 1,
  headers: ["esv", "lvesv", "end systolic volume"],
  rangeNote: NOTE,
});

/**
 * LV ejection fraction.
 *
 * @example
 * ```ts
 * import { EJECTION_FRACTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual([EJECTION_FRACTION.valid.min, EJECTION_FRACTION.valid.max], [0, 100]);
 * ```
 */
export const EJECTION_FRACTION: Quantity = defineQuantity({
  id: "ejectionFraction",
  label: "LV ejection fraction",
  symbol: "EF",
  unit: "%",
  description: "Stroke volume as a share of end-diastolic volume",
  valid: { min: 0, max: 100 },
  typical: { min: 10, max: 80 },
  resolution: 1,
  headers: ["lvef", "ef", "lvef percent", "ejection fraction"],
  rangeNote: NOTE,
});

/**
 * LV mass.
 *
 * @example
 * ```ts
 * import { LV_MASS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_MASS.unit, "g");
 * ```
 */
export const LV_MASS: Quantity = defineQuantity({
  id: "lvMass",
  label: "LV mass",
  symbol: "LVM",
  unit: "g",
  description: "Left-ventricular myocardial mass",
  valid: { min: 0, max: 2000, minExclusive: true },
  typical: { min: 50, max: 500 },
  typicalPediatric: { min: 3, max: 300 },
  resolution: 1,
  headers: ["lvm", "lv mass g", "left ventricular mass"],
  rangeNote: NOTE,
});

/**
 * LV mass indexed to body surface area.
 *
 * @example
 * ```ts
 * import { LV_MASS_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_MASS_INDEX.unit, "g/m^2");
 * ```
 */
export const LV_MASS_INDEX: Quantity = defineQuantity({
  id: "lvMassIndex",
  label: "LV mass index",
  symbol: "LVMi",
  unit: "g/m^2",
  description: "LV mass per m² of body surface area",
  valid: { min: 0, max: 1000, minExclusive: true },
  typical: { min: 30, max: 250 },
  resolution: 1,
  headers: ["lvmi", "lv mass indexed"],
  rangeNote: NOTE,
});

/**
 * Left-atrial volume.
 *
 * @example
 * ```ts
 * import { LA_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LA_VOLUME.unit, "mL");
 * ```
 */
export const LA_VOLUME: Quantity = defineQuantity({
  id: "laVolume",
  label: "LA volume",
  symbol: "LAV",
  unit: "mL",
  description: "Left-atrial volume at end-systole",
  valid: { min: 0, max: 1000, minExclusive: true },
  typical: { min: 15, max: 250 },
  resolution: 1,
  headers: ["lav", "left atrial volume"],
  rangeNote: NOTE,
});

/**
 * Left-atrial volume indexed to body surface area.
 *
 * @example
 * ```ts
 * import { LA_VOLUME_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LA_VOLUME_INDEX.symbol, "LAVi");
 * ```
 */
export const LA_VOLUME_INDEX: Quantity = defineQuantity({
  id: "laVolumeIndex",
  label: "LA volume index",
  symbol: "LAVi",
  unit: "mL/m^2",
  description: "LA volume per m² of body surface area",
  valid: { min: 0, max: 500, minExclusive: true },
  typical: { min: 10, max: 100 },
  resolution: 1,
  headers: ["lavi", "la volume indexed", "left atrial volume index"],
  rangeNote: NOTE,
});

/** A diameter of a valve or great vessel, for the PHN Z-score measurements. */
function vessel(
  id: string,
  label: string,
  symbol: string,
  description: string,
  typical: { min: number; max: number },
  typicalPediatric: { min: number; max: number },
  headers: readonly string[],
): Quantity {
  return defineQuantity({
    id,
    label,
    symbol,
    unit: "cm",
    description,
    valid: { min: 0, max: 10, minExclusive: true },
    typical,
    typicalPediatric,
    resolution: 0.01,
    headers,
    rangeNote: NOTE,
  });
}

/**
 * LVOT diameter.
 *
 * @example
 * ```ts
 * import { LVOT_DIAMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LVOT_DIAMETER.label, "LVOT diameter");
 * ```
 */
export const LVOT_DIAMETER: Quantity = defineQuantity({
  id: "lvotDiameter",
  label: "LVOT diameter",
  symbol: "d_LVOT",
  unit: "cm",
  description: "LVOT diameter, measured at the level of the pulsed-wave sample",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 1.4, max: 3.0 },
  typicalPediatric: { min: 0.4, max: 2.6 },
  resolution: 0.01,
  headers: ["lvot d", "lvotd", "lvot diam", "lvot diameter mm", "lvot diameter cm"],
  rangeNote: NOTE,
});

/**
 * RVOT diameter.
 *
 * @example
 * ```ts
 * import { RVOT_DIAMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(RVOT_DIAMETER.unit, "cm");
 * ```
 */
export const RVOT_DIAMETER: Quantity = defineQuantity({
  id: "rvotDiameter",
  label: "RVOT diameter",
  symbol: "d_RVOT",
  unit: "cm",
  description: "RVOT diameter at the pulsed-wave sample",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 1.5, max: 3.5 },
  typicalPediatric: { min: 0.5, max: 3 },
  resolution: 0.01,
  headers: ["rvot d", "rvotd"],
  rangeNote: NOTE,
});

/**
 * Aortic valve annulus diameter. @example
 * ```ts
 * import { AORTIC_ANNULUS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AORTIC_ANNULUS.unit, "cm");
 * ```
 */
export const AORTIC_ANNULUS: Quantity = vessel(
  "aorticAnnulus",
  "Aortic valve annulus",
  "AoAnn",
  "Aortic valve annulus diameter (hinge points, mid-systole)",
  { min: 1.8, max: 3 },
  { min: 0.5, max: 2.6 },
  ["aortic annulus", "ao annulus"],
);
/**
 * Aortic root diameter at the sinuses of Valsalva. @example
 * ```ts
 * import { AORTIC_ROOT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AORTIC_ROOT.label, "Aortic root at the sinuses");
 * ```
 */
export const AORTIC_ROOT: Quantity = vessel(
  "aorticRoot",
  "Aortic root at the sinuses",
  "AoRoot",
  "Aortic root diameter at the sinuses of Valsalva",
  { min: 2.4, max: 4 },
  { min: 0.7, max: 3.5 },
  ["aortic root", "ao root", "sinus of valsalva", "aortic sinus"],
);
/**
 * Sinotubular junction diameter. @example
 * ```ts
 * import { SINOTUBULAR_JUNCTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(SINOTUBULAR_JUNCTION.symbol, "STJ");
 * ```
 */
export const SINOTUBULAR_JUNCTION: Quantity = vessel(
  "sinotubularJunction",
  "Sinotubular junction",
  "STJ",
  "Aortic diameter at the sinotubular junction",
  { min: 2, max: 3.6 },
  { min: 0.6, max: 3 },
  ["stj"],
);
/**
 * Proximal ascending aorta diameter. @example
 * ```ts
 * import { ASCENDING_AORTA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ASCENDING_AORTA.unit, "cm");
 * ```
 */
export const ASCENDING_AORTA: Quantity = vessel(
  "ascendingAorta",
  "Ascending aorta",
  "AAo",
  "Proximal ascending aorta diameter",
  { min: 2, max: 3.8 },
  { min: 0.6, max: 3.2 },
  ["aao", "asc aorta"],
);
/**
 * Main pulmonary artery diameter. @example
 * ```ts
 * import { MAIN_PULMONARY_ARTERY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(MAIN_PULMONARY_ARTERY.symbol, "MPA");
 * ```
 */
export const MAIN_PULMONARY_ARTERY: Quantity = vessel(
  "mainPulmonaryArtery",
  "Main pulmonary artery",
  "MPA",
  "Main pulmonary artery diameter",
  { min: 1.5, max: 3 },
  { min: 0.5, max: 3 },
  ["mpa"],
);
/**
 * Right pulmonary artery diameter. @example
 * ```ts
 * import { RIGHT_PULMONARY_ARTERY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(RIGHT_PULMONARY_ARTERY.symbol, "RPA");
 * ```
 */
export const RIGHT_PULMONARY_ARTERY: Quantity = vessel(
  "rightPulmonaryArtery",
  "Right pulmonary artery",
  "RPA",
  "Right pulmonary artery diameter",
  { min: 0.8, max: 2.2 },
  { min: 0.3, max: 2 },
  ["rpa"],
);
/**
 * Left pulmonary artery diameter. @example
 * ```ts
 * import { LEFT_PULMONARY_ARTERY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LEFT_PULMONARY_ARTERY.symbol, "LPA");
 * ```
 */
export const LEFT_PULMONARY_ARTERY: Quantity = vessel(
  "leftPulmonaryArtery",
  "Left pulmonary artery",
  "LPA",
  "Left pulmonary artery diameter",
  { min: 0.8, max: 2.2 },
  { min: 0.3, max: 2 },
  ["lpa"],
);
/**
 * Mitral valve annulus, anteroposterior diameter. @example
 * ```ts
 * import { MITRAL_ANNULUS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(MITRAL_ANNULUS.unit, "cm");
 * ```
 */
export const MITRAL_ANNULUS: Quantity = vessel(
  "mitralAnnulus",
  "Mitral valve annulus (anteroposterior)",
  "MVAnn",
  "Mitral valve annulus diameter, anteroposterior",
  { min: 2.2, max: 4 },
  { min: 0.8, max: 3.8 },
  ["mitral annulus", "mv annulus"],
);
/**
 * Tricuspid valve annulus, anteroposterior diameter. @example
 * ```ts
 * import { TRICUSPID_ANNULUS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(TRICUSPID_ANNULUS.unit, "cm");
 * ```
 */
export const TRICUSPID_ANNULUS: Quantity = vessel(
  "tricuspidAnnulus",
  "Tricuspid valve annulus (anteroposterior)",
  "TVAnn",
  "Tricuspid valve annulus diameter, anteroposterior",
  { min: 2.2, max: 4.2 },
  { min: 0.8, max: 4 },
  ["tricuspid annulus", "tv annulus"],
);

/**
 * The cardiac structure and function quantities, listed for the package's quantity lookup (tables, models).
 *
 * @example
 * ```ts
 * import { STRUCTURE_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(STRUCTURE_QUANTITIES.length > 0);
 * ```
 */
export const STRUCTURE_QUANTITIES: readonly Quantity[] = [
  LV_END_DIASTOLIC_DIAMETER,
  LV_END_SYSTOLIC_DIAMETER,
  SEPTAL_THICKNESS,
  POSTERIOR_WALL_THICKNESS,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME,
  EJECTION_FRACTION,
  LV_MASS,
  LV_MASS_INDEX,
  LA_VOLUME,
  LA_VOLUME_INDEX,
  LVOT_DIAMETER,
  RVOT_DIAMETER,
  AORTIC_ANNULUS,
  AORTIC_ROOT,
  SINOTUBULAR_JUNCTION,
  ASCENDING_AORTA,
  MAIN_PULMONARY_ARTERY,
  RIGHT_PULMONARY_ARTERY,
  LEFT_PULMONARY_ARTERY,
  MITRAL_ANNULUS,
  TRICUSPID_ANNULUS,
];
