/**
 * Quantities of blood flow and hemodynamics: velocities, velocity-time integrals, gradients,
 * pressures, flows, stroke volumes, valve and orifice areas, regurgitation, Doppler times, heart
 * rate, and the relative errors the Doppler sensitivity curves show. A few structural dimensions
 * that only the Doppler calculations measure (the diameter of a generic flow region, the IVC
 * diameter, the LVOT diameter error) are declared here too, each marked as such.
 *
 * Valid ranges are what blood flow can physically reach; typical ranges are those seen in
 * adult and pediatric practice. Both are common practice, no source, unless a range says
 * otherwise.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

const NOTE = "common practice, no source";

/**
 * Blood velocity along the flow direction (negative: away from the probe).
 *
 * @example
 * ```ts
 * import { BLOOD_VELOCITY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(BLOOD_VELOCITY.unit, "m/s");
 * ```
 */
export const BLOOD_VELOCITY: Quantity = defineQuantity({
  id: "bloodVelocity",
  label: "Blood velocity",
  symbol: "v",
  unit: "m/s",
  description: "Velocity of blood along the flow direction (negative: away from the probe)",
  valid: { min: -20, max: 20 },
  typical: { min: -7, max: 7 },
  resolution: 0.01,
  headers: ["velocity"],
  rangeNote: NOTE,
});

/**
 * Stroke volume: blood ejected per beat.
 *
 * @example
 * ```ts
 * import { STROKE_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(STROKE_VOLUME.unit, "mL");
 * ```
 */
export const STROKE_VOLUME: Quantity = defineQuantity({
  id: "strokeVolume",
  label: "Stroke volume",
  symbol: "SV",
  unit: "mL",
  description: "Volume of blood ejected per beat",
  valid: { min: 0, max: 1000 },
  typical: { min: 20, max: 150 },
  typicalPediatric: { min: 2, max: 120 },
  resolution: 1,
  headers: ["sv", "stroke vol"],
  rangeNote: NOTE,
});

/**
 * Stroke volume indexed to body surface area.
 *
 * @example
 * ```ts
 * import { STROKE_VOLUME_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(STROKE_VOLUME_INDEX.unit, "mL/m^2");
 * ```
 */
export const STROKE_VOLUME_INDEX: Quantity = defineQuantity({
  id: "strokeVolumeIndex",
  label: "Stroke volume index",
  symbol: "SVi",
  unit: "mL/m^2",
  description: "Stroke volume per m² of body surface area",
  valid: { min: 0, max: 500 },
  typical: { min: 20, max: 80 },
  resolution: 1,
  headers: ["svi"],
  rangeNote: NOTE,
});

/**
 * Cardiac output.
 *
 * @example
 * ```ts
 * import { CARDIAC_OUTPUT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CARDIAC_OUTPUT.unit, "L/min");
 * ```
 */
export const CARDIAC_OUTPUT: Quantity = defineQuantity({
  id: "cardiacOutput",
  label: "Cardiac output",
  symbol: "CO",
  unit: "L/min",
  description: "Volume of blood pumped per minute",
  valid: { min: 0, max: 40, minExclusive: true },
  typical: { min: 1, max: 15 },
  resolution: 0.1,
  headers: ["co"],
  rangeNote: NOTE,
});

/**
 * Cardiac index: cardiac output per m² of body surface area.
 *
 * @example
 * ```ts
 * import { CARDIAC_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CARDIAC_INDEX.unit, "L/min/m^2");
 * ```
 */
export const CARDIAC_INDEX: Quantity = defineQuantity({
  id: "cardiacIndex",
  label: "Cardiac index",
  symbol: "CI",
  unit: "L/min/m^2",
  description: "Cardiac output per m² of body surface area",
  valid: { min: 0, max: 20, minExclusive: true },
  typical: { min: 1, max: 6 },
  resolution: 0.1,
  headers: ["ci"],
  rangeNote: NOTE,
});

/**
 * Aortic valve area (effective orifice area).
 *
 * @example
 * ```ts
 * import { AORTIC_VALVE_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AORTIC_VALVE_AREA.symbol, "AVA");
 * ```
 */
export const AORTIC_VALVE_AREA: Quantity = defineQuantity({
  id: "aorticValveArea",
  label: "Aortic valve area",
  symbol: "AVA",
  unit: "cm^2",
  description: "Aortic valve effective orifice area",
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.3, max: 5 },
  resolution: 0.01,
  headers: ["ava", "aortic valve area cm2"],
  rangeNote: NOTE,
});

/**
 * Aortic valve area indexed to body surface area.
 *
 * @example
 * ```ts
 * import { AORTIC_VALVE_AREA_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AORTIC_VALVE_AREA_INDEX.symbol, "AVAi");
 * ```
 */
export const AORTIC_VALVE_AREA_INDEX: Quantity = defineQuantity({
  id: "aorticValveAreaIndex",
  label: "Indexed aortic valve area",
  symbol: "AVAi",
  unit: "cm^2/m^2",
  description: "Aortic valve area per m² of body surface area",
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.2, max: 3 },
  resolution: 0.01,
  headers: ["avai", "ava index"],
  rangeNote: NOTE,
});

/**
 * Peak Doppler velocity through a restriction (a magnitude).
 *
 * @example
 * ```ts
 * import { checkValue, PEAK_VELOCITY, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 400 cm/s is read as 4 m/s, the canonical unit
 * assert.equal(checkValue("v", quantityField(PEAK_VELOCITY), "400 cm/s", { where: "Demo" }).value, 4);
 * ```
 */
export const PEAK_VELOCITY: Quantity = defineQuantity({
  id: "peakVelocity",
  label: "Peak velocity",
  symbol: "v_max",
  unit: "m/s",
  description: "Peak Doppler velocity through a restriction (a magnitude)",
  valid: { min: 0, max: 10 },
  typical: { min: 0, max: 7 },
  resolution: 0.01,
  headers: ["vmax", "peak vel", "max velocity"],
  rangeNote: NOTE,
});

/**
 * Peak pulsed-wave velocity in the LVOT, at the level of the LVOT diameter.
 *
 * @example
 * ```ts
 * import { headerMatches, LVOT_PEAK_VELOCITY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(LVOT_PEAK_VELOCITY, "LVOT Vmax [m/s]"), true);
 * ```
 */
export const LVOT_PEAK_VELOCITY: Quantity = defineQuantity({
  id: "lvotPeakVelocity",
  label: "LVOT peak velocity",
  symbol: "V_LVOT",
  unit: "m/s",
  description: "Peak pulsed-wave velocity in the LVOT, at the level of the LVOT diameter",
  valid: { min: 0, max: 10 },
  typical: { min: 0.5, max: 2 },
  resolution: 0.01,
  headers: ["lvot vmax", "lvot velocity", "lvot peak vel"],
  rangeNote: NOTE,
});

/**
 * Peak continuous-wave velocity of the aortic jet.
 *
 * @example
 * ```ts
 * import { AORTIC_PEAK_VELOCITY, headerMatches } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(AORTIC_PEAK_VELOCITY, "av_peak_velocity [m/s]"), true);
 * ```
 */
export const AORTIC_PEAK_VELOCITY: Quantity = defineQuantity({
  id: "aorticPeakVelocity",
  label: "Aortic jet peak velocity",
  symbol: "V_AV",
  unit: "m/s",
  description: "Peak continuous-wave velocity of the aortic jet",
  valid: { min: 0, max: 10 },
  typical: { min: 1, max: 7 },
  resolution: 0.01,
  headers: ["av peak velocity", "av vmax", "aortic vmax", "av velocity"],
  rangeNote: NOTE,
});

/**
 * Peak continuous-wave velocity of the tricuspid regurgitant jet.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, TR_PEAK_VELOCITY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // above 7 m/s the RV would generate about 200 mmHg: not a physically possible reading
 * const r = checkValue("v", quantityField(TR_PEAK_VELOCITY), 8, { where: "Demo" });
 * assert.equal(r.issues[0]?.kind, "range");
 * ```
 */
export const TR_PEAK_VELOCITY: Quantity = defineQuantity({
  id: "trPeakVelocity",
  label: "Peak TR velocity",
  symbol: "v_TR",
  unit: "m/s",
  description: "Peak continuous-wave velocity of the tricuspid regurgitant jet",
  valid: { min: 0, max: 7 },
  typical: { min: 1.5, max: 5.5 },
  resolution: 0.01,
  headers: ["tr velocity", "tr vmax", "trv", "tr peak velocity"],
  rangeNote: NOTE,
});

/**
 * Peak continuous-wave velocity of a regurgitant jet.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, REGURGITANT_PEAK_VELOCITY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("v", quantityField(REGURGITANT_PEAK_VELOCITY), "500 cm/s", { where: "Demo" }).value, 5);
 * ```
 */
export const REGURGITANT_PEAK_VELOCITY: Quantity = defineQuantity({
  id: "regurgitantPeakVelocity",
  label: "Regurgitant jet peak velocity",
  symbol: "V_reg",
  unit: "m/s",
  description: "Peak continuous-wave velocity of a regurgitant jet",
  valid: { min: 0, max: 10 },
  typical: { min: 2, max: 7 },
  resolution: 0.01,
  headers: ["regurgitant vmax", "regurgitant velocity"],
  rangeNote: NOTE,
});

/**
 * Peak velocity of the early diastolic (E) wave of transmitral flow.
 *
 * @example
 * ```ts
 * import { headerMatches, MITRAL_E_VELOCITY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(MITRAL_E_VELOCITY, "E velocity [m/s]"), true);
 * ```
 */
export const MITRAL_E_VELOCITY: Quantity = defineQuantity({
  id: "mitralEVelocity",
  label: "Mitral E velocity",
  symbol: "v_E",
  unit: "m/s",
  description: "Peak velocity of the early diastolic (E) wave of transmitral flow",
  valid: { min: 0, max: 5 },
  typical: { min: 0.3, max: 3.5 },
  resolution: 0.01,
  headers: ["mitral e", "e velocity", "e wave"],
  rangeNote: NOTE,
});

/**
 * Peak instantaneous pressure gradient across a restriction.
 *
 * @example
 * ```ts
 * import { checkValue, PEAK_GRADIENT, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 2 kPa is 15.0 mmHg (1 mmHg = 133.322 Pa)
 * const r = checkValue("g", quantityField(PEAK_GRADIENT), "2 kPa", { where: "Demo" });
 * assert.ok(Math.abs(r.value! - 15.0012) < 1e-3);
 * ```
 */
export const PEAK_GRADIENT: Quantity = defineQuantity({
  id: "peakGradient",
  label: "Peak gradient",
  symbol: "ΔP_max",
  unit: "mmHg",
  description: "Peak instantaneous pressure gradient across a restriction",
  valid: { min: 0, max: 400 },
  typical: { min: 0, max: 150 },
  resolution: 0.1,
  headers: ["pg", "max pg", "ppg"],
  rangeNote: NOTE,
});

/**
 * Mean transaortic pressure gradient over the ejection period.
 *
 * @example
 * ```ts
 * import { AORTIC_MEAN_GRADIENT, headerMatches } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(AORTIC_MEAN_GRADIENT, "AV mean gradient [mmHg]"), true);
 * ```
 */
export const AORTIC_MEAN_GRADIENT: Quantity = defineQuantity({
  id: "aorticMeanGradient",
  label: "Mean aortic gradient",
  symbol: "ΔP_mean,AV",
  unit: "mmHg",
  description: "Mean transaortic pressure gradient over the ejection period",
  valid: { min: 0, max: 250 },
  typical: { min: 0, max: 100 },
  resolution: 0.1,
  headers: ["av mean gradient", "av mg", "mean aortic gradient", "aortic mean gradient"],
  rangeNote: NOTE,
});

/**
 * Mean transmitral pressure gradient over diastole.
 *
 * @example
 * ```ts
 * import { headerMatches, MITRAL_MEAN_GRADIENT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(MITRAL_MEAN_GRADIENT, "mv_mg [mmHg]"), true);
 * ```
 */
export const MITRAL_MEAN_GRADIENT: Quantity = defineQuantity({
  id: "mitralMeanGradient",
  label: "Mean mitral gradient",
  symbol: "ΔP_mean,MV",
  unit: "mmHg",
  description: "Mean transmitral pressure gradient over diastole",
  valid: { min: 0, max: 60 },
  typical: { min: 0, max: 25 },
  resolution: 0.1,
  headers: ["mv mean gradient", "mitral mean gradient", "mv mg"],
  rangeNote: NOTE,
});

/**
 * Mean right-atrial pressure.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, RIGHT_ATRIAL_PRESSURE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 25 mmHg is possible but outside the typical range: accepted and flagged
 * const r = checkValue("rap", quantityField(RIGHT_ATRIAL_PRESSURE), 25, { where: "Demo" });
 * assert.equal(r.value, 25);
 * assert.equal(r.issues[0]?.kind, "typical");
 * ```
 */
export const RIGHT_ATRIAL_PRESSURE: Quantity = defineQuantity({
  id: "rightAtrialPressure",
  label: "Right-atrial pressure",
  symbol: "RAP",
  unit: "mmHg",
  description: "Mean right-atrial pressure",
  valid: { min: 0, max: 40 },
  typical: { min: 0, max: 20 },
  resolution: 1,
  headers: ["rap", "ra pressure"],
  rangeNote: NOTE,
});

/**
 * Right-ventricular systolic pressure.
 *
 * @example
 * ```ts
 * import { headerMatches, RV_SYSTOLIC_PRESSURE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(RV_SYSTOLIC_PRESSURE, "RVSP [mmHg]"), true);
 * ```
 */
export const RV_SYSTOLIC_PRESSURE: Quantity = defineQuantity({
  id: "rvSystolicPressure",
  label: "RV systolic pressure",
  symbol: "RVSP",
  unit: "mmHg",
  description: "Right-ventricular systolic pressure",
  valid: { min: 0, max: 300 },
  typical: { min: 15, max: 100 },
  resolution: 1,
  headers: ["rvsp"],
  rangeNote: NOTE,
});

/**
 * Diameter of a circular flow region (outflow tract, valve annulus) where a VTI is sampled. A
 * structural dimension, declared here because only the flow calculations use it.
 *
 * @example
 * ```ts
 * import { checkValue, FLOW_REGION_DIAMETER, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("d", quantityField(FLOW_REGION_DIAMETER), "21 mm", { where: "Demo" }).value, 2.1);
 * ```
 */
export const FLOW_REGION_DIAMETER: Quantity = defineQuantity({
  id: "flowRegionDiameter",
  label: "Flow-region diameter",
  symbol: "d",
  unit: "cm",
  description:
    "Diameter of a circular flow region (outflow tract, valve annulus) where a VTI is sampled",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 1.4, max: 3.5 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Inferior vena cava diameter near the right atrium, at end-expiration. A structural dimension,
 * declared here because only the right-atrial pressure estimate uses it.
 *
 * @example
 * ```ts
 * import { checkValue, IVC_DIAMETER, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("d", quantityField(IVC_DIAMETER), "18 mm", { where: "Demo" }).value, 1.8);
 * ```
 */
export const IVC_DIAMETER: Quantity = defineQuantity({
  id: "ivcDiameter",
  label: "IVC diameter",
  symbol: "d_IVC",
  unit: "cm",
  description: "Inferior vena cava diameter near the right atrium, at end-expiration",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.5, max: 3.5 },
  resolution: 0.01,
  headers: ["ivc", "ivc d", "ivcd"],
  rangeNote: NOTE,
});

/**
 * Collapse of the IVC diameter with a sniff, as a share of the expiratory diameter.
 *
 * @example
 * ```ts
 * import { checkValue, IVC_COLLAPSE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("c", quantityField(IVC_COLLAPSE), "60 %", { where: "Demo" }).value, 60);
 * ```
 */
export const IVC_COLLAPSE: Quantity = defineQuantity({
  id: "ivcCollapse",
  label: "IVC collapse with sniff",
  symbol: "IVC_collapse",
  unit: "%",
  description: "Collapse of the IVC diameter with a sniff, as a share of the expiratory diameter",
  valid: { min: 0, max: 100 },
  resolution: 1,
  headers: ["ivc collapse", "ivc collapsibility"],
  rangeNote: "by definition",
});

/**
 * Error of a measured LVOT diameter against the true diameter (positive: measured too large). The
 * error of a structural dimension, declared here for the continuity sensitivity curve.
 *
 * @example
 * ```ts
 * import { checkValue, LVOT_DIAMETER_ERROR, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("e", quantityField(LVOT_DIAMETER_ERROR), "0.1 cm", { where: "Demo" }).value, 1);
 * ```
 */
export const LVOT_DIAMETER_ERROR: Quantity = defineQuantity({
  id: "lvotDiameterError",
  label: "LVOT diameter error",
  symbol: "δd_LVOT",
  unit: "mm",
  description:
    "Error of a measured LVOT diameter against the true diameter (positive: measured too large)",
  valid: { min: -50, max: 50 },
  typical: { min: -3, max: 3 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Area of a circular flow region.
 *
 * @example
 * ```ts
 * import { checkValue, CROSS_SECTIONAL_AREA, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("a", quantityField(CROSS_SECTIONAL_AREA), "314 mm^2", { where: "Demo" }).value, 3.14);
 * ```
 */
export const CROSS_SECTIONAL_AREA: Quantity = defineQuantity({
  id: "crossSectionalArea",
  label: "Cross-sectional area",
  symbol: "CSA",
  unit: "cm^2",
  description: "Area of a circular flow region",
  valid: { min: 0, max: 20, minExclusive: true },
  typical: { min: 1.5, max: 10 },
  resolution: 0.01,
  headers: ["csa"],
  rangeNote: NOTE,
});

/**
 * Cross-sectional area of the aorta at the sinotubular junction (a structural dimension that only
 * the energy loss index uses, declared here with it): π·d²/4 of the STJ diameter.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, SINOTUBULAR_JUNCTION_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("aa", quantityField(SINOTUBULAR_JUNCTION_AREA), "500 mm^2", { where: "Demo" }).value, 5);
 * ```
 */
export const SINOTUBULAR_JUNCTION_AREA: Quantity = defineQuantity({
  id: "sinotubularJunctionArea",
  label: "Aortic area at the sinotubular junction",
  symbol: "AA",
  unit: "cm^2",
  description:
    "Cross-sectional area of the ascending aorta at the sinotubular junction, where the pressure recovered downstream of a stenotic aortic valve is complete",
  valid: { min: 0, max: 20, minExclusive: true },
  typical: { min: 3, max: 12 },
  typicalPediatric: { min: 0.5, max: 8 },
  resolution: 0.01,
  headers: ["aa", "stj area"],
  rangeNote:
    "typical: STJ diameters of about 2.0 to 3.9 cm in adults (valid: the cross-sectional area's); common practice, no source",
});

/**
 * Energy loss coefficient: the aortic valve effective orifice area adjusted for the pressure
 * recovered in the ascending aorta.
 *
 * @example
 * ```ts
 * import { ENERGY_LOSS_COEFFICIENT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ENERGY_LOSS_COEFFICIENT.unit, "cm^2");
 * ```
 */
export const ENERGY_LOSS_COEFFICIENT: Quantity = defineQuantity({
  id: "energyLossCoefficient",
  label: "Energy loss coefficient",
  symbol: "ELCo",
  unit: "cm^2",
  description:
    "Effective orifice area of a stenotic aortic valve adjusted for pressure recovery: EOA·AA/(AA − EOA)",
  valid: { min: 0, max: Infinity, minExclusive: true, maxExclusive: true },
  typical: { min: 0.3, max: 4 },
  resolution: 0.01,
  headers: ["elco"],
  rangeNote:
    "valid: any positive area (it exceeds the orifice area and grows without bound as the orifice nears the aortic area); typical: common practice, no source",
});

/**
 * Energy loss index: the energy loss coefficient indexed to body surface area.
 *
 * @example
 * ```ts
 * import { ENERGY_LOSS_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ENERGY_LOSS_INDEX.unit, "cm^2/m^2");
 * ```
 */
export const ENERGY_LOSS_INDEX: Quantity = defineQuantity({
  id: "energyLossIndex",
  label: "Energy loss index",
  symbol: "ELI",
  unit: "cm^2/m^2",
  description: "Energy loss coefficient of a stenotic aortic valve per m² of body surface area",
  valid: { min: 0, max: Infinity, minExclusive: true, maxExclusive: true },
  typical: { min: 0.2, max: 2.5 },
  resolution: 0.01,
  headers: ["eli"],
  rangeNote:
    "valid: any positive value, as for the coefficient; typical: common practice, no source",
});

/**
 * Integral of the Doppler velocity over one ejection or filling period (stroke distance).
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, VELOCITY_TIME_INTEGRAL } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("vti", quantityField(VELOCITY_TIME_INTEGRAL), "0.2 m", { where: "Demo" }).value, 20);
 * ```
 */
export const VELOCITY_TIME_INTEGRAL: Quantity = defineQuantity({
  id: "velocityTimeIntegral",
  label: "Velocity-time integral",
  symbol: "VTI",
  unit: "cm",
  description:
    "Integral of the Doppler velocity over one ejection or filling period (stroke distance)",
  valid: { min: 0, max: 500, minExclusive: true },
  typical: { min: 5, max: 300 },
  resolution: 0.1,
  headers: ["vti", "stroke distance"],
  rangeNote: NOTE,
});

/**
 * Pulsed-wave velocity-time integral in the LVOT.
 *
 * @example
 * ```ts
 * import { headerMatches, LVOT_VTI } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(LVOT_VTI, "lvot_vti [cm]"), true);
 * ```
 */
export const LVOT_VTI: Quantity = defineQuantity({
  id: "lvotVti",
  label: "LVOT VTI",
  symbol: "VTI_LVOT",
  unit: "cm",
  description: "Pulsed-wave velocity-time integral in the LVOT",
  valid: { min: 0, max: 300, minExclusive: true },
  typical: { min: 8, max: 40 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Pulsed-wave velocity-time integral in the RVOT.
 *
 * @example
 * ```ts
 * import { headerMatches, RVOT_VTI } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(RVOT_VTI, "RVOT VTI [cm]"), true);
 * ```
 */
export const RVOT_VTI: Quantity = defineQuantity({
  id: "rvotVti",
  label: "RVOT VTI",
  symbol: "VTI_RVOT",
  unit: "cm",
  description: "Pulsed-wave velocity-time integral in the RVOT",
  valid: { min: 0, max: 300, minExclusive: true },
  typical: { min: 8, max: 50 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Continuous-wave velocity-time integral of the aortic jet.
 *
 * @example
 * ```ts
 * import { AORTIC_VTI, headerMatches } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(AORTIC_VTI, "AV VTI [cm]"), true);
 * ```
 */
export const AORTIC_VTI: Quantity = defineQuantity({
  id: "aorticVti",
  label: "Aortic jet VTI",
  symbol: "VTI_AV",
  unit: "cm",
  description: "Continuous-wave velocity-time integral of the aortic jet",
  valid: { min: 0, max: 300, minExclusive: true },
  typical: { min: 15, max: 200 },
  resolution: 0.1,
  headers: ["av vti"],
  rangeNote: NOTE,
});

/**
 * Continuous-wave velocity-time integral of a regurgitant jet.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, REGURGITANT_VTI } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("vti", quantityField(REGURGITANT_VTI), "1.5 m", { where: "Demo" }).value, 150);
 * ```
 */
export const REGURGITANT_VTI: Quantity = defineQuantity({
  id: "regurgitantVti",
  label: "Regurgitant jet VTI",
  symbol: "VTI_reg",
  unit: "cm",
  description: "Continuous-wave velocity-time integral of a regurgitant jet",
  valid: { min: 0, max: 500, minExclusive: true },
  typical: { min: 50, max: 300 },
  resolution: 0.1,
  rangeNote: NOTE,
});

/**
 * Mitral valve orifice area.
 *
 * @example
 * ```ts
 * import { headerMatches, MITRAL_VALVE_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(MITRAL_VALVE_AREA, "MVA [cm2]"), true);
 * ```
 */
export const MITRAL_VALVE_AREA: Quantity = defineQuantity({
  id: "mitralValveArea",
  label: "Mitral valve area",
  symbol: "MVA",
  unit: "cm^2",
  description: "Mitral valve orifice area",
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.5, max: 6 },
  resolution: 0.01,
  headers: ["mva"],
  rangeNote: NOTE,
});

/**
 * Ratio of the LVOT to the aortic jet velocity-time integral (or peak velocity).
 *
 * @example
 * ```ts
 * import { checkValue, DIMENSIONLESS_INDEX, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // flow accelerates through the valve: a ratio much above 1 is a measurement error
 * assert.equal(checkValue("dvi", quantityField(DIMENSIONLESS_INDEX), 2, { where: "Demo" }).issues[0]?.kind, "range");
 * ```
 */
export const DIMENSIONLESS_INDEX: Quantity = defineQuantity({
  id: "dimensionlessIndex",
  label: "Dimensionless index",
  symbol: "DVI",
  unit: "1",
  description: "Ratio of the LVOT to the aortic jet velocity-time integral (or peak velocity)",
  valid: { min: 0, max: 1.5, minExclusive: true },
  typical: { min: 0.1, max: 1 },
  resolution: 0.01,
  headers: ["dvi", "velocity ratio"],
  rangeNote:
    "common practice, no source: the jet is never slower than the flow proximal to it, so a ratio above 1 comes from measurement error; 1.5 leaves room for it",
});

/**
 * Time for the transmitral pressure gradient to fall to half its peak.
 *
 * @example
 * ```ts
 * import { checkValue, PRESSURE_HALF_TIME, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("pht", quantityField(PRESSURE_HALF_TIME), "0.22 s", { where: "Demo" }).value, 220);
 * ```
 */
export const PRESSURE_HALF_TIME: Quantity = defineQuantity({
  id: "pressureHalfTime",
  label: "Pressure half-time",
  symbol: "PHT",
  unit: "ms",
  description: "Time for the transmitral pressure gradient to fall to half its peak",
  valid: { min: 0, max: 1000, minExclusive: true },
  typical: { min: 30, max: 500 },
  resolution: 1,
  headers: ["pht"],
  rangeNote: NOTE,
});

/**
 * Time from the peak of the transmitral E wave to the zero-velocity intercept of its slope.
 *
 * @example
 * ```ts
 * import { checkValue, DECELERATION_TIME, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("dt", quantityField(DECELERATION_TIME), "0.6 s", { where: "Demo" }).value, 600);
 * ```
 */
export const DECELERATION_TIME: Quantity = defineQuantity({
  id: "decelerationTime",
  label: "E-wave deceleration time",
  symbol: "DT",
  unit: "ms",
  description:
    "Time from the peak of the transmitral E wave to the zero-velocity intercept of its slope",
  valid: { min: 0, max: 3000, minExclusive: true },
  typical: { min: 100, max: 1700 },
  resolution: 1,
  headers: ["dt", "e dt", "decel time"],
  rangeNote: NOTE,
});

/**
 * Magnitude of the deceleration slope of the transmitral E wave.
 *
 * @example
 * ```ts
 * import { checkValue, DECELERATION_SLOPE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("s", quantityField(DECELERATION_SLOPE), "300 cm/s^2", { where: "Demo" }).value, 3);
 * ```
 */
export const DECELERATION_SLOPE: Quantity = defineQuantity({
  id: "decelerationSlope",
  label: "E-wave deceleration slope",
  symbol: "s",
  unit: "m/s^2",
  description: "Magnitude of the deceleration slope of the transmitral E wave",
  valid: { min: 0, max: 100, minExclusive: true },
  typical: { min: 0.5, max: 20 },
  resolution: 0.01,
  rangeNote: NOTE,
});

/**
 * Radius from the orifice to the first aliasing boundary of the proximal isovelocity surface.
 *
 * @example
 * ```ts
 * import { checkValue, PISA_RADIUS, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("r", quantityField(PISA_RADIUS), "8 mm", { where: "Demo" }).value, 0.8);
 * ```
 */
export const PISA_RADIUS: Quantity = defineQuantity({
  id: "pisaRadius",
  label: "PISA radius",
  symbol: "r",
  unit: "cm",
  description:
    "Radius from the orifice to the first aliasing boundary of the proximal isovelocity surface",
  valid: { min: 0, max: 3, minExclusive: true },
  typical: { min: 0.2, max: 1.5 },
  resolution: 0.01,
  headers: ["pisa r"],
  rangeNote: NOTE,
});

/**
 * Aliasing (Nyquist) velocity of the colour map toward the orifice, at the PISA boundary.
 *
 * @example
 * ```ts
 * import { ALIASING_VELOCITY, checkValue, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("va", quantityField(ALIASING_VELOCITY), "0.4 m/s", { where: "Demo" }).value, 40);
 * ```
 */
export const ALIASING_VELOCITY: Quantity = defineQuantity({
  id: "aliasingVelocity",
  label: "Aliasing velocity",
  symbol: "Va",
  unit: "cm/s",
  description:
    "Aliasing (Nyquist) velocity of the colour map toward the orifice, at the PISA boundary",
  valid: { min: 0, max: 200, minExclusive: true },
  typical: { min: 20, max: 60 },
  resolution: 0.1,
  headers: ["va"],
  rangeNote: NOTE,
});

/**
 * Angle subtended by the wall around the orifice (180° for a flat wall).
 *
 * @example
 * ```ts
 * import { checkValue, PISA_WALL_ANGLE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // π rad is a flat wall, 180°
 * const r = checkValue("a", quantityField(PISA_WALL_ANGLE), "3.14159265359 rad", { where: "Demo" });
 * assert.ok(Math.abs(r.value! - 180) < 1e-9);
 * ```
 */
export const PISA_WALL_ANGLE: Quantity = defineQuantity({
  id: "pisaWallAngle",
  label: "PISA wall angle",
  symbol: "α",
  unit: "deg",
  description: "Angle subtended by the wall around the orifice (180° for a flat wall)",
  valid: { min: 0, max: 360, minExclusive: true },
  typical: { min: 90, max: 240 },
  resolution: 1,
  headers: ["wall angle"],
  rangeNote: NOTE,
});

/**
 * Peak instantaneous flow rate through a regurgitant orifice.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, REGURGITANT_FLOW_RATE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("q", quantityField(REGURGITANT_FLOW_RATE), "0.25 L/s", { where: "Demo" }).value, 250);
 * ```
 */
export const REGURGITANT_FLOW_RATE: Quantity = defineQuantity({
  id: "regurgitantFlowRate",
  label: "Regurgitant flow rate",
  symbol: "Q",
  unit: "mL/s",
  description: "Peak instantaneous flow rate through a regurgitant orifice",
  valid: { min: 0, max: 5000, minExclusive: true },
  typical: { min: 10, max: 1000 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Effective area of a regurgitant orifice.
 *
 * @example
 * ```ts
 * import { checkValue, EFFECTIVE_REGURGITANT_ORIFICE_AREA, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("a", quantityField(EFFECTIVE_REGURGITANT_ORIFICE_AREA), "40 mm^2", { where: "Demo" }).value, 0.4);
 * ```
 */
export const EFFECTIVE_REGURGITANT_ORIFICE_AREA: Quantity = defineQuantity({
  id: "effectiveRegurgitantOrificeArea",
  label: "Effective regurgitant orifice area",
  symbol: "EROA",
  unit: "cm^2",
  description: "Effective area of a regurgitant orifice",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.02, max: 1.5 },
  resolution: 0.01,
  headers: ["eroa", "ero"],
  rangeNote: NOTE,
});

/**
 * Volume flowing back through a regurgitant valve per beat.
 *
 * @example
 * ```ts
 * import { headerMatches, REGURGITANT_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(REGURGITANT_VOLUME, "RVol [mL]"), true);
 * ```
 */
export const REGURGITANT_VOLUME: Quantity = defineQuantity({
  id: "regurgitantVolume",
  label: "Regurgitant volume",
  symbol: "RVol",
  unit: "mL",
  description: "Volume flowing back through a regurgitant valve per beat",
  valid: { min: 0, max: 1000 },
  typical: { min: 0, max: 200 },
  resolution: 1,
  headers: ["rvol", "regurgitant vol"],
  rangeNote: NOTE,
});

/**
 * Share of the stroke volume through a regurgitant valve that flows back.
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, REGURGITANT_FRACTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // a fraction above 100 % is impossible
 * assert.equal(checkValue("rf", quantityField(REGURGITANT_FRACTION), 120, { where: "Demo" }).issues[0]?.kind, "range");
 * ```
 */
export const REGURGITANT_FRACTION: Quantity = defineQuantity({
  id: "regurgitantFraction",
  label: "Regurgitant fraction",
  symbol: "RF",
  unit: "%",
  description: "Share of the stroke volume through a regurgitant valve that flows back",
  valid: { min: 0, max: 100 },
  typical: { min: 0, max: 80 },
  resolution: 1,
  headers: ["rf"],
  rangeNote: "by definition (valid); common practice, no source (typical)",
});

/**
 * Ratio of pulmonary to systemic blood flow.
 *
 * @example
 * ```ts
 * import { headerMatches, PULMONARY_SYSTEMIC_FLOW_RATIO } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(PULMONARY_SYSTEMIC_FLOW_RATIO, "Qp/Qs"), true);
 * ```
 */
export const PULMONARY_SYSTEMIC_FLOW_RATIO: Quantity = defineQuantity({
  id: "pulmonarySystemicFlowRatio",
  label: "Pulmonary-to-systemic flow ratio",
  symbol: "Qp/Qs",
  unit: "1",
  description: "Ratio of pulmonary to systemic blood flow",
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.7, max: 3.5 },
  resolution: 0.01,
  headers: ["qp/qs", "qp qs", "qpqs"],
  rangeNote: NOTE,
});

/**
 * Heart rate in beats per minute.
 *
 * @example
 * ```ts
 * import { checkValue, HEART_RATE, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 170 bpm is outside the adult typical range but inside the pediatric one
 * const r = checkValue("hr", quantityField(HEART_RATE), 170, { where: "Demo", population: "pediatric" });
 * assert.deepEqual(r.issues, []);
 * ```
 */
export const HEART_RATE: Quantity = defineQuantity({
  id: "heartRate",
  label: "Heart rate",
  symbol: "HR",
  unit: "bpm",
  description: "Heart rate in beats per minute",
  valid: { min: 0, max: 300, minExclusive: true },
  typical: { min: 40, max: 150 },
  typicalPediatric: { min: 60, max: 200 },
  resolution: 1,
  headers: ["hr", "pulse"],
  rangeNote: NOTE,
});

/**
 * Shortfall of a Doppler reading (velocity, or the gradient built on it) relative to its true value.
 *
 * @example
 * ```ts
 * import { checkValue, DOPPLER_UNDERESTIMATION, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("s", quantityField(DOPPLER_UNDERESTIMATION), "6 %", { where: "Demo" }).value, 6);
 * ```
 */
export const DOPPLER_UNDERESTIMATION: Quantity = defineQuantity({
  id: "dopplerUnderestimation",
  label: "Underestimation of the true value",
  symbol: "shortfall",
  unit: "%",
  description:
    "Shortfall of a Doppler reading (velocity, or the gradient built on it) relative to its true value",
  valid: { min: 0, max: 100 },
  typical: { min: 0, max: 20 },
  resolution: 0.1,
  rangeNote: "by definition (valid); common practice, no source (typical)",
});

/**
 * Relative error of a computed valve area against the true area (positive: overestimated).
 *
 * @example
 * ```ts
 * import { checkValue, quantityField, VALVE_AREA_ERROR } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // an area cannot be more than 100 % too small
 * assert.equal(checkValue("e", quantityField(VALVE_AREA_ERROR), -100, { where: "Demo" }).issues[0]?.kind, "range");
 * ```
 */
export const VALVE_AREA_ERROR: Quantity = defineQuantity({
  id: "valveAreaError",
  label: "Valve-area error",
  symbol: "δA",
  unit: "%",
  description:
    "Relative error of a computed valve area against the true area (positive: overestimated)",
  valid: { min: -100, max: Infinity, minExclusive: true, maxExclusive: true },
  typical: { min: -50, max: 50 },
  resolution: 0.1,
  rangeNote: "by definition (valid); common practice, no source (typical)",
});

/**
 * The flow and hemodynamic quantities, listed for the package's quantity lookup (tables, models).
 *
 * @example
 * ```ts
 * import { FLOW_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(FLOW_QUANTITIES.length > 0);
 * ```
 */
export const FLOW_QUANTITIES: readonly Quantity[] = [
  BLOOD_VELOCITY,
  STROKE_VOLUME,
  STROKE_VOLUME_INDEX,
  CARDIAC_OUTPUT,
  CARDIAC_INDEX,
  AORTIC_VALVE_AREA,
  AORTIC_VALVE_AREA_INDEX,
  PEAK_VELOCITY,
  LVOT_PEAK_VELOCITY,
  AORTIC_PEAK_VELOCITY,
  TR_PEAK_VELOCITY,
  REGURGITANT_PEAK_VELOCITY,
  MITRAL_E_VELOCITY,
  PEAK_GRADIENT,
  AORTIC_MEAN_GRADIENT,
  MITRAL_MEAN_GRADIENT,
  RIGHT_ATRIAL_PRESSURE,
  RV_SYSTOLIC_PRESSURE,
  FLOW_REGION_DIAMETER,
  IVC_DIAMETER,
  IVC_COLLAPSE,
  LVOT_DIAMETER_ERROR,
  CROSS_SECTIONAL_AREA,
  SINOTUBULAR_JUNCTION_AREA,
  ENERGY_LOSS_COEFFICIENT,
  ENERGY_LOSS_INDEX,
  VELOCITY_TIME_INTEGRAL,
  LVOT_VTI,
  RVOT_VTI,
  AORTIC_VTI,
  REGURGITANT_VTI,
  MITRAL_VALVE_AREA,
  DIMENSIONLESS_INDEX,
  PRESSURE_HALF_TIME,
  DECELERATION_TIME,
  DECELERATION_SLOPE,
  PISA_RADIUS,
  ALIASING_VELOCITY,
  PISA_WALL_ANGLE,
  REGURGITANT_FLOW_RATE,
  EFFECTIVE_REGURGITANT_ORIFICE_AREA,
  REGURGITANT_VOLUME,
  REGURGITANT_FRACTION,
  PULMONARY_SYSTEMIC_FLOW_RATIO,
  HEART_RATE,
  DOPPLER_UNDERESTIMATION,
  VALVE_AREA_ERROR,
];
