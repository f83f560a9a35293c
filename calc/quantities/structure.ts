/**
 * Quantities of cardiac structure and function: dimensions of chambers, walls, valves and great
 * vessels, traced areas and lengths, volumes, mass, the indices computed from them (fractions,
 * relative wall thickness), annular excursions, the time intervals of the cardiac cycle, strain,
 * and the coordinates of a traced contour. Stroke volume and cardiac output are flow quantities.
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

/** Where the valid ranges of the indexed LV volumes come from. */
const LV_VOLUME_INDEX_NOTE =
  "valid: up to 1000 mL/m², half the 2000 mL limit of the volume, as for the LV mass and LA volume indices (a large volume over a small body is not a heart that exists); common practice, no source";

/**
 * LV end-diastolic volume indexed to body surface area (the output of
 * `indexedToBsa(LV_END_DIASTOLIC_VOLUME)`).
 *
 * @example
 * ```ts
 * import { formatRange, LV_END_DIASTOLIC_VOLUME_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // no index of a positive volume is 0 or unbounded
 * assert.equal(formatRange(LV_END_DIASTOLIC_VOLUME_INDEX.valid, LV_END_DIASTOLIC_VOLUME_INDEX.unit), "(0, 1000] mL/m²");
 * ```
 */
export const LV_END_DIASTOLIC_VOLUME_INDEX: Quantity = defineQuantity({
  id: "lvEndDiastolicVolumeIndex",
  label: "LV end-diastolic volume indexed to BSA",
  symbol: "EDVi",
  unit: "mL/m^2",
  description: "LV end-diastolic volume per m² of body surface area",
  valid: { min: 0, max: 1000, minExclusive: true },
  resolution: 1,
  headers: ["lvedvi", "edvi"],
  rangeNote: LV_VOLUME_INDEX_NOTE,
});

/**
 * LV end-systolic volume indexed to body surface area (the output of
 * `indexedToBsa(LV_END_SYSTOLIC_VOLUME)`).
 *
 * @example
 * ```ts
 * import { formatRange, LV_END_SYSTOLIC_VOLUME_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatRange(LV_END_SYSTOLIC_VOLUME_INDEX.valid, LV_END_SYSTOLIC_VOLUME_INDEX.unit), "[0, 1000] mL/m²");
 * ```
 */
export const LV_END_SYSTOLIC_VOLUME_INDEX: Quantity = defineQuantity({
  id: "lvEndSystolicVolumeIndex",
  label: "LV end-systolic volume indexed to BSA",
  symbol: "ESVi",
  unit: "mL/m^2",
  description: "LV end-systolic volume per m² of body surface area",
  valid: { min: 0, max: 1000 },
  resolution: 1,
  headers: ["lvesvi", "esvi"],
  rangeNote: LV_VOLUME_INDEX_NOTE,
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
  headers: ["lvot d", "lvotd", "lvot diam"],
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
 * LV internal diameter at either phase of the cycle (the Teichholz volume takes one diameter).
 *
 * @example
 * ```ts
 * import { LV_INTERNAL_DIAMETER } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LV_INTERNAL_DIAMETER.unit, "cm");
 * ```
 */
export const LV_INTERNAL_DIAMETER: Quantity = defineQuantity({
  id: "lvInternalDiameter",
  label: "LV internal diameter",
  symbol: "LVID",
  unit: "cm",
  description: "LV internal diameter at end-diastole or end-systole, parasternal long axis",
  valid: { min: 0, max: 12, minExclusive: true },
  typical: { min: 1.5, max: 7.5 },
  typicalPediatric: { min: 0.7, max: 6 },
  resolution: 0.01,
  headers: ["lvid"],
  rangeNote: NOTE,
});

/**
 * LV fractional shortening.
 *
 * @example
 * ```ts
 * import { FRACTIONAL_SHORTENING } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(FRACTIONAL_SHORTENING.symbol, "FS");
 * ```
 */
export const FRACTIONAL_SHORTENING: Quantity = defineQuantity({
  id: "fractionalShortening",
  label: "LV fractional shortening",
  symbol: "FS",
  unit: "%",
  description: "Shortening of the LV internal diameter from end-diastole to end-systole",
  valid: { min: 0, max: 100 },
  typical: { min: 5, max: 60 },
  resolution: 1,
  headers: ["fs", "lvfs"],
  rangeNote: NOTE,
});

/**
 * Relative wall thickness of the left ventricle.
 *
 * @example
 * ```ts
 * import { RELATIVE_WALL_THICKNESS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(RELATIVE_WALL_THICKNESS.unit, "1");
 * ```
 */
export const RELATIVE_WALL_THICKNESS: Quantity = defineQuantity({
  id: "relativeWallThickness",
  label: "Relative wall thickness",
  symbol: "RWT",
  unit: "1",
  description: "Twice the posterior wall thickness over the LV internal diameter at end-diastole",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.2, max: 0.8 },
  resolution: 0.01,
  headers: ["rwt"],
  rangeNote: NOTE,
});

/**
 * Volume of a cardiac chamber from a volume method (discs, area–length, Teichholz), without
 * saying which chamber or phase.
 *
 * @example
 * ```ts
 * import { CHAMBER_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CHAMBER_VOLUME.unit, "mL");
 * ```
 */
export const CHAMBER_VOLUME: Quantity = defineQuantity({
  id: "chamberVolume",
  label: "Chamber volume",
  symbol: "V",
  unit: "mL",
  description: "Volume of a cardiac chamber by a volume method",
  valid: { min: 0, max: 2000 },
  typical: { min: 5, max: 500 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Cavity area traced in an apical view (closed by the annulus segment).
 *
 * @example
 * ```ts
 * import { CHAMBER_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CHAMBER_AREA.unit, "cm^2");
 * ```
 */
export const CHAMBER_AREA: Quantity = defineQuantity({
  id: "chamberArea",
  label: "Chamber area",
  symbol: "A",
  unit: "cm^2",
  description: "Cavity area traced in an apical view, closed by the annulus segment",
  valid: { min: 0, max: 400, minExclusive: true },
  typical: { min: 5, max: 80 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Long-axis length of a chamber, from the annulus midpoint to the apex (or the atrial roof).
 *
 * @example
 * ```ts
 * import { CHAMBER_LENGTH } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CHAMBER_LENGTH.symbol, "L");
 * ```
 */
export const CHAMBER_LENGTH: Quantity = defineQuantity({
  id: "chamberLength",
  label: "Chamber long-axis length",
  symbol: "L",
  unit: "cm",
  description: "Long-axis length from the annulus midpoint to the apex or the atrial roof",
  valid: { min: 0, max: 30, minExclusive: true },
  typical: { min: 2, max: 15 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Sum over the discs of the products of their two orthogonal diameters (Σ aᵢ·bᵢ).
 *
 * @example
 * ```ts
 * import { DISC_DIAMETER_PRODUCT_SUM } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DISC_DIAMETER_PRODUCT_SUM.unit, "cm^2");
 * ```
 */
export const DISC_DIAMETER_PRODUCT_SUM: Quantity = defineQuantity({
  id: "discDiameterProductSum",
  label: "Sum of disc diameter products",
  symbol: "Σab",
  unit: "cm^2",
  description: "Sum over the discs of the products of the two orthogonal disc diameters",
  valid: { min: 0, max: 1e5 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Number of discs of a method-of-discs volume (a count: whole numbers only).
 *
 * @example
 * ```ts
 * import { DISC_COUNT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DISC_COUNT.integer, true);
 * ```
 */
export const DISC_COUNT: Quantity = defineQuantity({
  id: "discCount",
  label: "Number of discs",
  symbol: "N",
  unit: "1",
  description: "Number of discs of equal height the long axis is cut into",
  valid: { min: 1, max: 100000 },
  typical: { min: 20, max: 20 },
  resolution: 1,
  integer: true,
  rangeNote:
    "typical: the 20 discs of the guideline method (Lang 2015); other counts are for verification",
});

/**
 * Distance along a chamber's long axis from the annulus midpoint (the axial coordinate of a
 * traced contour).
 *
 * @example
 * ```ts
 * import { LONG_AXIS_POSITION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LONG_AXIS_POSITION.unit, "cm");
 * ```
 */
export const LONG_AXIS_POSITION: Quantity = defineQuantity({
  id: "longAxisPosition",
  label: "Distance along the long axis from the annulus",
  symbol: "s",
  unit: "cm",
  description: "Axial coordinate of a contour point: from the annulus midpoint towards the apex",
  valid: { min: -30, max: 30 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Distance across a chamber's long axis (the transverse coordinate of a traced contour).
 *
 * @example
 * ```ts
 * import { TRANSVERSE_POSITION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(TRANSVERSE_POSITION.unit, "cm");
 * ```
 */
export const TRANSVERSE_POSITION: Quantity = defineQuantity({
  id: "transversePosition",
  label: "Distance across the long axis",
  symbol: "q",
  unit: "cm",
  description: "Transverse coordinate of a contour point, perpendicular to the long axis",
  valid: { min: -30, max: 30 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * RV cavity area at end-diastole, RV-focused apical four-chamber view.
 *
 * @example
 * ```ts
 * import { RV_END_DIASTOLIC_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(RV_END_DIASTOLIC_AREA.symbol, "RVEDA");
 * ```
 */
export const RV_END_DIASTOLIC_AREA: Quantity = defineQuantity({
  id: "rvEndDiastolicArea",
  label: "RV end-diastolic area",
  symbol: "RVEDA",
  unit: "cm^2",
  description: "RV cavity area at end-diastole, RV-focused apical four-chamber view",
  valid: { min: 0, max: 200, minExclusive: true },
  typical: { min: 8, max: 45 },
  resolution: 0.1,
  headers: ["rveda", "rv eda"],
  rangeNote: NOTE,
});

/**
 * RV basal diameter: the maximal transverse dimension in the basal third of the RV inflow at
 * end-diastole, RV-focused apical four-chamber view.
 *
 * @example
 * ```ts
 * import { RV_BASAL_DIAMETER, typicalRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(typicalRange(RV_BASAL_DIAMETER, "adult"), { min: 2, max: 6 });
 * ```
 */
export const RV_BASAL_DIAMETER: Quantity = defineQuantity({
  id: "rvBasalDiameter",
  label: "RV basal diameter",
  symbol: "RVD1",
  unit: "cm",
  description:
    "Maximal transverse RV dimension in the basal third at end-diastole, RV-focused apical four-chamber view",
  valid: { min: 0, max: 12, minExclusive: true },
  typical: { min: 2, max: 6 },
  typicalPediatric: { min: 0.8, max: 5 },
  resolution: 0.1,
  headers: ["rvd1", "rv basal", "rv basal diameter"],
  rangeNote: NOTE,
});

/**
 * RV cavity area at end-systole, RV-focused apical four-chamber view.
 *
 * @example
 * ```ts
 * import { RV_END_SYSTOLIC_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(RV_END_SYSTOLIC_AREA.symbol, "RVESA");
 * ```
 */
export const RV_END_SYSTOLIC_AREA: Quantity = defineQuantity({
  id: "rvEndSystolicArea",
  label: "RV end-systolic area",
  symbol: "RVESA",
  unit: "cm^2",
  description: "RV cavity area at end-systole, RV-focused apical four-chamber view",
  valid: { min: 0, max: 200 },
  typical: { min: 3, max: 35 },
  resolution: 0.1,
  headers: ["rvesa", "rv esa"],
  rangeNote: NOTE,
});

/**
 * RV fractional area change.
 *
 * @example
 * ```ts
 * import { FRACTIONAL_AREA_CHANGE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(FRACTIONAL_AREA_CHANGE.unit, "%");
 * ```
 */
export const FRACTIONAL_AREA_CHANGE: Quantity = defineQuantity({
  id: "fractionalAreaChange",
  label: "RV fractional area change",
  symbol: "FAC",
  unit: "%",
  description: "Change of the RV cavity area from end-diastole to end-systole",
  valid: { min: 0, max: 100 },
  typical: { min: 10, max: 70 },
  resolution: 1,
  headers: ["fac", "rv fac"],
  rangeNote: NOTE,
});

/**
 * Depth of an annulus on an apical M-mode trace (distance from the probe).
 *
 * @example
 * ```ts
 * import { ANNULUS_DEPTH } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ANNULUS_DEPTH.unit, "mm");
 * ```
 */
export const ANNULUS_DEPTH: Quantity = defineQuantity({
  id: "annulusDepth",
  label: "Annulus depth",
  symbol: "z",
  unit: "mm",
  description: "Distance from the probe to an annulus on an apical M-mode trace",
  valid: { min: 0, max: 400 },
  typical: { min: 40, max: 250 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Tricuspid annular plane systolic excursion (TAPSE).
 *
 * @example
 * ```ts
 * import { TAPSE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(TAPSE.unit, "mm");
 * ```
 */
export const TAPSE: Quantity = defineQuantity({
  id: "tapse",
  label: "TAPSE",
  symbol: "TAPSE",
  unit: "mm",
  description: "Systolic excursion of the lateral tricuspid annulus towards the apex",
  valid: { min: 0, max: 60 },
  typical: { min: 5, max: 35 },
  resolution: 1,
  headers: ["tricuspid annular plane systolic excursion"],
  rangeNote: NOTE,
});

/**
 * Systolic excursion of the mitral annulus at one site (septal or lateral).
 *
 * @example
 * ```ts
 * import { MITRAL_ANNULAR_EXCURSION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(MITRAL_ANNULAR_EXCURSION.unit, "mm");
 * ```
 */
export const MITRAL_ANNULAR_EXCURSION: Quantity = defineQuantity({
  id: "mitralAnnularExcursion",
  label: "Mitral annular excursion",
  symbol: "e_MA",
  unit: "mm",
  description: "Systolic excursion of the mitral annulus towards the apex at one site",
  valid: { min: 0, max: 60 },
  typical: { min: 4, max: 25 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Mitral annular plane systolic excursion (MAPSE): the mean of the septal and lateral sites.
 *
 * @example
 * ```ts
 * import { MAPSE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(MAPSE.unit, "mm");
 * ```
 */
export const MAPSE: Quantity = defineQuantity({
  id: "mapse",
  label: "MAPSE",
  symbol: "MAPSE",
  unit: "mm",
  description: "Mean systolic excursion of the septal and lateral mitral annulus",
  valid: { min: 0, max: 60 },
  typical: { min: 4, max: 25 },
  resolution: 1,
  headers: ["mitral annular plane systolic excursion"],
  rangeNote: NOTE,
});

/**
 * Isovolumic contraction time (IVCT).
 *
 * @example
 * ```ts
 * import { ISOVOLUMIC_CONTRACTION_TIME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ISOVOLUMIC_CONTRACTION_TIME.symbol, "IVCT");
 * ```
 */
export const ISOVOLUMIC_CONTRACTION_TIME: Quantity = defineQuantity({
  id: "isovolumicContractionTime",
  label: "Isovolumic contraction time",
  symbol: "IVCT",
  unit: "ms",
  description: "Time from atrioventricular valve closure to the start of ejection",
  valid: { min: 0, max: 1000 },
  typical: { min: 10, max: 200 },
  resolution: 1,
  headers: ["ivct"],
  rangeNote: NOTE,
});

/**
 * Isovolumic relaxation time (IVRT).
 *
 * @example
 * ```ts
 * import { ISOVOLUMIC_RELAXATION_TIME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ISOVOLUMIC_RELAXATION_TIME.symbol, "IVRT");
 * ```
 */
export const ISOVOLUMIC_RELAXATION_TIME: Quantity = defineQuantity({
  id: "isovolumicRelaxationTime",
  label: "Isovolumic relaxation time",
  symbol: "IVRT",
  unit: "ms",
  description: "Time from the end of ejection to atrioventricular valve opening",
  valid: { min: 0, max: 1000 },
  typical: { min: 20, max: 250 },
  resolution: 1,
  headers: ["ivrt"],
  rangeNote: NOTE,
});

/**
 * Ventricular ejection time (ET).
 *
 * @example
 * ```ts
 * import { EJECTION_TIME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(EJECTION_TIME.unit, "ms");
 * ```
 */
export const EJECTION_TIME: Quantity = defineQuantity({
  id: "ejectionTime",
  label: "Ejection time",
  symbol: "ET",
  unit: "ms",
  description: "Duration of ventricular ejection, from outflow opening to closure",
  valid: { min: 0, max: 1000, minExclusive: true },
  typical: { min: 150, max: 450 },
  resolution: 1,
  headers: ["et", "lvet", "rvet"],
  rangeNote: NOTE,
});

/**
 * Atrioventricular valve closure-to-opening time, which includes the ejection time.
 *
 * @example
 * ```ts
 * import { VALVE_CLOSURE_TO_OPENING_TIME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(VALVE_CLOSURE_TO_OPENING_TIME.unit, "ms");
 * ```
 */
export const VALVE_CLOSURE_TO_OPENING_TIME: Quantity = defineQuantity({
  id: "valveClosureToOpeningTime",
  label: "Valve closure-to-opening time",
  symbol: "a",
  unit: "ms",
  description:
    "Time from atrioventricular valve closure to its next opening (isovolumic times and ejection)",
  valid: { min: 0, max: 1000 },
  typical: { min: 250, max: 700 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Myocardial performance index (Tei index).
 *
 * @example
 * ```ts
 * import { MYOCARDIAL_PERFORMANCE_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(MYOCARDIAL_PERFORMANCE_INDEX.symbol, "MPI");
 * ```
 */
export const MYOCARDIAL_PERFORMANCE_INDEX: Quantity = defineQuantity({
  id: "myocardialPerformanceIndex",
  label: "Myocardial performance index",
  symbol: "MPI",
  unit: "1",
  description: "Isovolumic contraction and relaxation times over the ejection time",
  valid: { min: 0, max: 5 },
  typical: { min: 0.2, max: 1.2 },
  resolution: 0.01,
  headers: ["mpi", "tei index", "tei"],
  rangeNote: NOTE,
});

/**
 * Peak systolic longitudinal strain of one myocardial segment (negative for shortening).
 *
 * @example
 * ```ts
 * import { SEGMENT_LONGITUDINAL_STRAIN } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(SEGMENT_LONGITUDINAL_STRAIN.unit, "%");
 * ```
 */
export const SEGMENT_LONGITUDINAL_STRAIN: Quantity = defineQuantity({
  id: "segmentLongitudinalStrain",
  label: "Segment peak longitudinal strain",
  symbol: "ε",
  unit: "%",
  description: "Peak systolic longitudinal strain of one segment, negative for shortening",
  valid: { min: -100, max: 100, minExclusive: true, maxExclusive: true },
  typical: { min: -40, max: 10 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Global longitudinal strain (GLS), negative for shortening.
 *
 * @example
 * ```ts
 * import { GLOBAL_LONGITUDINAL_STRAIN } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(GLOBAL_LONGITUDINAL_STRAIN.symbol, "GLS");
 * ```
 */
export const GLOBAL_LONGITUDINAL_STRAIN: Quantity = defineQuantity({
  id: "globalLongitudinalStrain",
  label: "Global longitudinal strain",
  symbol: "GLS",
  unit: "%",
  description: "Longitudinal strain of the whole LV myocardium, negative for shortening",
  valid: { min: -100, max: 100, minExclusive: true, maxExclusive: true },
  typical: { min: -30, max: -5 },
  resolution: 0.1,
  headers: ["gls", "lv gls"],
  rangeNote: NOTE,
});

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
  RV_BASAL_DIAMETER,
  LV_END_DIASTOLIC_DIAMETER,
  LV_END_SYSTOLIC_DIAMETER,
  SEPTAL_THICKNESS,
  POSTERIOR_WALL_THICKNESS,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME,
  LV_END_DIASTOLIC_VOLUME_INDEX,
  LV_END_SYSTOLIC_VOLUME_INDEX,
  EJECTION_FRACTION,
  LV_MASS,
  LV_MASS_INDEX,
  LA_VOLUME,
  LA_VOLUME_INDEX,
  LV_INTERNAL_DIAMETER,
  FRACTIONAL_SHORTENING,
  RELATIVE_WALL_THICKNESS,
  CHAMBER_VOLUME,
  CHAMBER_AREA,
  CHAMBER_LENGTH,
  DISC_DIAMETER_PRODUCT_SUM,
  DISC_COUNT,
  LONG_AXIS_POSITION,
  TRANSVERSE_POSITION,
  RV_END_DIASTOLIC_AREA,
  RV_END_SYSTOLIC_AREA,
  FRACTIONAL_AREA_CHANGE,
  ANNULUS_DEPTH,
  TAPSE,
  MITRAL_ANNULAR_EXCURSION,
  MAPSE,
  ISOVOLUMIC_CONTRACTION_TIME,
  ISOVOLUMIC_RELAXATION_TIME,
  EJECTION_TIME,
  VALVE_CLOSURE_TO_OPENING_TIME,
  MYOCARDIAL_PERFORMANCE_INDEX,
  SEGMENT_LONGITUDINAL_STRAIN,
  GLOBAL_LONGITUDINAL_STRAIN,
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
