/**
 * Regurgitation quantification: PISA flow rate, effective regurgitant orifice area, regurgitant
 * volume, and regurgitant fraction by the PISA and volumetric methods.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import { PU_1995, ZOGHBI_2017 } from "./sources.ts";

/**
 * Instantaneous regurgitant flow rate by the proximal isovelocity surface area (PISA).
 *
 * Formula: Q [mL/s] = 2π · r² [cm²] · Va [cm/s] · α/180, where α is the angle (degrees) subtended
 * by the wall around the orifice; α = 180° is a flat wall (hemisphere). A funnel (α < 180°) means
 * only part of the hemisphere exists.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (PISA method); Pu M, et al.
 * Circulation 1995;92:2169-2177 (α/180 correction, from memory).
 *
 * Throws (through `evaluate`) a RangeError for a radius outside (0, 3] cm, an aliasing velocity
 * outside (0, 200] cm/s or an angle outside (0, 360] degrees.
 *
 * @example
 * ```ts
 * import { evaluate, pisaFlowRate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // r = 1 cm, Va = 40 cm/s → 2π·1·40 = 251.3 mL/s
 * const q = evaluate(pisaFlowRate, { radiusCm: 1, aliasingVelocityCmPerS: 40 }).outputs.flowRateMlPerS;
 * assert.ok(Math.abs(q - 80 * Math.PI) < 1e-9);
 * ```
 */
export const pisaFlowRate: Calculation<
  "radiusCm" | "aliasingVelocityCmPerS" | "wallAngleDeg",
  "flowRateMlPerS"
> = defineCalculation({
  id: "pisaFlowRate",
  title: "PISA regurgitant flow rate",
  description:
    "Peak regurgitant flow rate from the radius of the hemispheric isovelocity shell at the aliasing velocity.",
  inputs: {
    radiusCm: {
      unit: "cm",
      description: "PISA radius from the orifice to the first aliasing boundary",
      range: { min: 0, max: 3, minExclusive: true },
      typical: { min: 0.2, max: 1.5 },
    },
    aliasingVelocityCmPerS: {
      unit: "cm/s",
      description: "Aliasing (Nyquist) velocity of the colour map, toward the orifice",
      range: { min: 0, max: 200, minExclusive: true },
      typical: { min: 20, max: 60 },
    },
    wallAngleDeg: {
      unit: "deg",
      description: "Angle subtended by the wall around the orifice (180 for a flat wall)",
      range: { min: 0, max: 360, minExclusive: true },
      typical: { min: 90, max: 240 },
      default: 180,
    },
  },
  outputs: { flowRateMlPerS: { unit: "mL/s", description: "Regurgitant flow rate" } },
  formula: ({ radiusCm, aliasingVelocityCmPerS, wallAngleDeg }) => ({
    flowRateMlPerS: 2 * Math.PI * radiusCm * radiusCm * aliasingVelocityCmPerS * wallAngleDeg /
      180,
  }),
  formulaText: "Q = 2π·r²·Va·α/180",
  sources: [ZOGHBI_2017, PU_1995],
  cautions: [
    "The radius is squared: a 1 mm error in a 1 cm radius is about a 20 % flow error",
    "Assumes a hemispheric shell; eccentric or elongated orifices break the assumption",
  ],
  clinical: true,
});

/**
 * Effective regurgitant orifice area from the PISA flow rate and the peak regurgitant velocity.
 *
 * Formula: EROA [cm²] = Q [mL/s] / (100 · Vmax [m/s]), i.e. flow divided by velocity in cm/s.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (PISA method).
 *
 * Throws (through `evaluate`) a RangeError for a flow rate outside (0, 5000] mL/s or a velocity
 * outside (0, 10] m/s.
 *
 * @example
 * ```ts
 * import { effectiveRegurgitantOrificeArea, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 251.3 mL/s through a 5 m/s jet → 0.50 cm²
 * const r = evaluate(effectiveRegurgitantOrificeArea, {
 *   flowRateMlPerS: 80 * Math.PI, regurgitantPeakVelocity: 5,
 * });
 * assert.ok(Math.abs(r.outputs.eroaCm2 - 0.50265) < 1e-5);
 * ```
 */
export const effectiveRegurgitantOrificeArea: Calculation<
  "flowRateMlPerS" | "regurgitantPeakVelocity",
  "eroaCm2"
> = defineCalculation({
  id: "effectiveRegurgitantOrificeArea",
  title: "Effective regurgitant orifice area",
  description: "Regurgitant orifice area from the peak flow rate and the peak jet velocity.",
  inputs: {
    flowRateMlPerS: {
      unit: "mL/s",
      description: "Peak regurgitant flow rate (from PISA)",
      range: { min: 0, max: 5000, minExclusive: true },
      typical: { min: 10, max: 1000 },
    },
    regurgitantPeakVelocity: {
      unit: "m/s",
      description: "Peak continuous-wave velocity of the regurgitant jet",
      range: { min: 0, max: 10, minExclusive: true },
      typical: { min: 2, max: 7 },
    },
  },
  outputs: { eroaCm2: { unit: "cm^2", description: "Effective regurgitant orifice area" } },
  formula: ({ flowRateMlPerS, regurgitantPeakVelocity }) => ({
    eroaCm2: flowRateMlPerS / (100 * regurgitantPeakVelocity),
  }),
  formulaText: "EROA = Q / Vmax",
  sources: [ZOGHBI_2017],
  cautions: ["Peak flow and peak velocity should be simultaneous (both in early-to-mid systole)"],
  clinical: true,
});

/**
 * Regurgitant volume from the orifice area and the regurgitant jet VTI.
 *
 * Formula: RVol [mL] = EROA [cm²] · VTI [cm].
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (PISA method).
 *
 * Throws (through `evaluate`) a RangeError for an area outside (0, 5] cm² or a VTI outside
 * (0, 500] cm.
 *
 * @example
 * ```ts
 * import { evaluate, regurgitantVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0.4 cm² × 150 cm = 60 mL
 * const r = evaluate(regurgitantVolume, { eroaCm2: 0.4, regurgitantVtiCm: 150 });
 * assert.ok(Math.abs(r.outputs.regurgitantVolumeMl - 60) < 1e-12);
 * ```
 */
export const regurgitantVolume: Calculation<
  "eroaCm2" | "regurgitantVtiCm",
  "regurgitantVolumeMl"
> = defineCalculation({
  id: "regurgitantVolume",
  title: "Regurgitant volume (PISA)",
  description: "Regurgitant volume per beat from the orifice area and the jet VTI.",
  inputs: {
    eroaCm2: {
      unit: "cm^2",
      description: "Effective regurgitant orifice area",
      range: { min: 0, max: 5, minExclusive: true },
      typical: { min: 0.02, max: 1.5 },
    },
    regurgitantVtiCm: {
      unit: "cm",
      description: "Continuous-wave VTI of the regurgitant jet",
      range: { min: 0, max: 500, minExclusive: true },
      typical: { min: 50, max: 300 },
    },
  },
  outputs: { regurgitantVolumeMl: { unit: "mL", description: "Regurgitant volume per beat" } },
  formula: ({ eroaCm2, regurgitantVtiCm }) => ({ regurgitantVolumeMl: eroaCm2 * regurgitantVtiCm }),
  formulaText: "RVol = EROA·VTI",
  sources: [ZOGHBI_2017],
  cautions: ["Assumes the orifice area is constant through the cycle"],
  clinical: true,
});

/**
 * Regurgitant fraction: the share of the stroke volume through the leaking valve that leaks.
 *
 * Formula: RF [%] = 100 · RVol / SV_total, where SV_total is the stroke volume through the
 * regurgitant valve (forward plus regurgitant).
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371.
 *
 * Throws (through `evaluate`) a RangeError for volumes outside (0, 1000] mL.
 *
 * @example
 * ```ts
 * import { evaluate, regurgitantFraction } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(regurgitantFraction, { regurgitantVolumeMl: 45, totalStrokeVolumeMl: 90 });
 * assert.equal(r.outputs.regurgitantFractionPercent, 50);
 * ```
 */
export const regurgitantFraction: Calculation<
  "regurgitantVolumeMl" | "totalStrokeVolumeMl",
  "regurgitantFractionPercent"
> = defineCalculation({
  id: "regurgitantFraction",
  title: "Regurgitant fraction",
  description: "Fraction of the stroke volume through the regurgitant valve that flows back.",
  inputs: {
    regurgitantVolumeMl: {
      unit: "mL",
      description: "Regurgitant volume per beat",
      range: { min: 0, max: 1000 },
      typical: { min: 0, max: 200 },
    },
    totalStrokeVolumeMl: {
      unit: "mL",
      description: "Total stroke volume through the regurgitant valve (forward + regurgitant)",
      range: { min: 0, max: 1000, minExclusive: true },
      typical: { min: 30, max: 300 },
    },
  },
  outputs: { regurgitantFractionPercent: { unit: "%", description: "Regurgitant fraction" } },
  formula: ({ regurgitantVolumeMl, totalStrokeVolumeMl }) => ({
    regurgitantFractionPercent: 100 * regurgitantVolumeMl / totalStrokeVolumeMl,
  }),
  formulaText: "RF = RVol/SV_total",
  sources: [ZOGHBI_2017],
  cautions: ["A fraction above 100 % means the volumes are inconsistent"],
  clinical: true,
});

/**
 * Regurgitant fraction by the PISA method: PISA regurgitant volume over the sum of it and the
 * forward stroke volume measured at a competent valve.
 *
 * Formula: RF [%] = 100 · RVol_PISA / (RVol_PISA + SV_forward), via {@linkcode regurgitantFraction}.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (from memory).
 *
 * Throws (through `evaluate`) a RangeError for volumes outside their ranges.
 *
 * @example
 * ```ts
 * import { evaluate, regurgitantFractionPisa } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 60 mL regurgitant, 60 mL forward → 50 %
 * const r = evaluate(regurgitantFractionPisa, { regurgitantVolumeMl: 60, forwardStrokeVolumeMl: 60 });
 * assert.equal(r.outputs.regurgitantFractionPercent, 50);
 * ```
 */
export const regurgitantFractionPisa: Calculation<
  "regurgitantVolumeMl" | "forwardStrokeVolumeMl",
  "regurgitantFractionPercent"
> = defineCalculation({
  id: "regurgitantFractionPisa",
  title: "Regurgitant fraction (PISA)",
  description: "Regurgitant fraction from a PISA regurgitant volume and the forward stroke volume.",
  inputs: {
    regurgitantVolumeMl: {
      unit: "mL",
      description: "Regurgitant volume per beat by PISA",
      range: { min: 0, max: 1000 },
      typical: { min: 0, max: 200 },
    },
    forwardStrokeVolumeMl: {
      unit: "mL",
      description: "Forward stroke volume through a competent valve (e.g. LVOT Doppler)",
      range: { min: 0, max: 1000, minExclusive: true },
      typical: { min: 20, max: 150 },
    },
  },
  outputs: { regurgitantFractionPercent: { unit: "%", description: "Regurgitant fraction" } },
  formula: ({ regurgitantVolumeMl, forwardStrokeVolumeMl }) =>
    regurgitantFraction.formula({
      regurgitantVolumeMl,
      totalStrokeVolumeMl: regurgitantVolumeMl + forwardStrokeVolumeMl,
    }),
  formulaText: "RF = RVol / (RVol + SV_forward)",
  sources: [ZOGHBI_2017],
  cautions: ["Combines two independent methods: their errors add"],
  clinical: true,
});

/**
 * Regurgitant volume and fraction by the volumetric (Doppler stroke-volume) method.
 *
 * Formula: RVol [mL] = SV_regurgitant valve − SV_competent valve; RF [%] = 100 · RVol / SV_regurgitant
 * valve (via {@linkcode regurgitantFraction}). For mitral regurgitation: mitral annulus SV minus LVOT
 * SV; for aortic regurgitation: LVOT SV minus mitral annulus (or RVOT) SV.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (quantitative Doppler method).
 *
 * Throws (through `evaluate`) a RangeError for volumes outside (0, 1000] mL. A negative
 * regurgitant volume (competent-valve SV larger) is returned as is: it signals measurement error.
 *
 * @example
 * ```ts
 * import { evaluate, volumetricRegurgitation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Mitral annulus SV 120 mL, LVOT SV 70 mL → RVol 50 mL, RF 41.7 %
 * const r = evaluate(volumetricRegurgitation, { totalStrokeVolumeMl: 120, forwardStrokeVolumeMl: 70 });
 * assert.equal(r.outputs.regurgitantVolumeMl, 50);
 * assert.ok(Math.abs(r.outputs.regurgitantFractionPercent - 41.667) < 1e-3);
 * ```
 */
export const volumetricRegurgitation: Calculation<
  "totalStrokeVolumeMl" | "forwardStrokeVolumeMl",
  "regurgitantVolumeMl" | "regurgitantFractionPercent"
> = defineCalculation({
  id: "volumetricRegurgitation",
  title: "Regurgitant volume and fraction (volumetric)",
  description:
    "Regurgitation from the difference of Doppler stroke volumes at the regurgitant and a competent valve.",
  inputs: {
    totalStrokeVolumeMl: {
      unit: "mL",
      description: "Stroke volume through the regurgitant valve",
      range: { min: 0, max: 1000, minExclusive: true },
      typical: { min: 30, max: 300 },
    },
    forwardStrokeVolumeMl: {
      unit: "mL",
      description: "Stroke volume through a competent valve",
      range: { min: 0, max: 1000, minExclusive: true },
      typical: { min: 20, max: 150 },
    },
  },
  outputs: {
    regurgitantVolumeMl: { unit: "mL", description: "Regurgitant volume per beat" },
    regurgitantFractionPercent: { unit: "%", description: "Regurgitant fraction" },
  },
  formula: ({ totalStrokeVolumeMl, forwardStrokeVolumeMl }) => {
    const regurgitantVolumeMl = totalStrokeVolumeMl - forwardStrokeVolumeMl;
    return {
      regurgitantVolumeMl,
      ...regurgitantFraction.formula({ regurgitantVolumeMl, totalStrokeVolumeMl }),
    };
  },
  formulaText: "RVol = SV_total − SV_forward; RF = RVol/SV_total",
  sources: [ZOGHBI_2017],
  cautions: [
    "Small differences of two large volumes: the uncertainty of the result is large",
    "A negative regurgitant volume signals measurement error",
  ],
  clinical: true,
});

/**
 * The whole PISA chain in one calculation, for propagating measurement uncertainty from the
 * radius, aliasing velocity, wall angle, jet velocity and VTI into EROA and regurgitant volume.
 *
 * Formula: Q = 2π·r²·Va·α/180 ({@linkcode pisaFlowRate}); EROA = Q/Vmax
 * ({@linkcode effectiveRegurgitantOrificeArea}); RVol = EROA·VTI ({@linkcode regurgitantVolume}).
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371.
 *
 * Throws (through `evaluate`) a RangeError for any input outside its range.
 *
 * @example
 * ```ts
 * import { evaluate, pisaRegurgitation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(pisaRegurgitation, {
 *   radiusCm: 1, aliasingVelocityCmPerS: 40, regurgitantPeakVelocity: 5, regurgitantVtiCm: 150,
 * });
 * assert.ok(Math.abs(r.outputs.eroaCm2 - 0.503) < 1e-3);
 * assert.ok(Math.abs(r.outputs.regurgitantVolumeMl - 75.4) < 0.1);
 * ```
 */
export const pisaRegurgitation: Calculation<
  | "radiusCm"
  | "aliasingVelocityCmPerS"
  | "wallAngleDeg"
  | "regurgitantPeakVelocity"
  | "regurgitantVtiCm",
  "flowRateMlPerS" | "eroaCm2" | "regurgitantVolumeMl"
> = defineCalculation({
  id: "pisaRegurgitation",
  title: "PISA regurgitation (flow, EROA, volume)",
  description: "Regurgitant flow rate, orifice area and volume from PISA measurements.",
  inputs: {
    radiusCm: pisaFlowRate.inputs.radiusCm,
    aliasingVelocityCmPerS: pisaFlowRate.inputs.aliasingVelocityCmPerS,
    wallAngleDeg: pisaFlowRate.inputs.wallAngleDeg,
    regurgitantPeakVelocity: effectiveRegurgitantOrificeArea.inputs.regurgitantPeakVelocity,
    regurgitantVtiCm: regurgitantVolume.inputs.regurgitantVtiCm,
  },
  outputs: {
    flowRateMlPerS: pisaFlowRate.outputs.flowRateMlPerS,
    eroaCm2: effectiveRegurgitantOrificeArea.outputs.eroaCm2,
    regurgitantVolumeMl: regurgitantVolume.outputs.regurgitantVolumeMl,
  },
  formula: (
    { radiusCm, aliasingVelocityCmPerS, wallAngleDeg, regurgitantPeakVelocity, regurgitantVtiCm },
  ) => {
    const { flowRateMlPerS } = pisaFlowRate.formula({
      radiusCm,
      aliasingVelocityCmPerS,
      wallAngleDeg,
    });
    const { eroaCm2 } = effectiveRegurgitantOrificeArea.formula({
      flowRateMlPerS,
      regurgitantPeakVelocity,
    });
    const { regurgitantVolumeMl } = regurgitantVolume.formula({ eroaCm2, regurgitantVtiCm });
    return { flowRateMlPerS, eroaCm2, regurgitantVolumeMl };
  },
  formulaText: "Q = 2π·r²·Va·α/180; EROA = Q/Vmax; RVol = EROA·VTI",
  sources: [ZOGHBI_2017, PU_1995],
  cautions: [...pisaFlowRate.cautions, ...effectiveRegurgitantOrificeArea.cautions],
  clinical: true,
});
