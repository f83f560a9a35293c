/**
 * Regurgitation quantification: PISA flow rate (with the aliasing-velocity correction for
 * low-velocity jets), effective regurgitant orifice area, regurgitant volume, and regurgitant
 * fraction by the PISA and volumetric methods; the mitral valve area of stenosis by PISA.
 *
 * @module
 */
import { defineCalculation, type InputRole, notAbove } from "../core/calculation.ts";
import { chain } from "../core/chain.ts";
import type { Calculation, Citation, InputConstraint } from "../core/types.ts";
import {
  ALIASING_VELOCITY,
  EFFECTIVE_REGURGITANT_ORIFICE_AREA,
  MITRAL_E_VELOCITY,
  MITRAL_VALVE_AREA,
  PISA_RADIUS,
  PISA_WALL_ANGLE,
  REGURGITANT_FLOW_RATE,
  REGURGITANT_FRACTION,
  REGURGITANT_PEAK_VELOCITY,
  REGURGITANT_VOLUME,
  REGURGITANT_VTI,
  STROKE_VOLUME,
} from "../quantities/flow.ts";
import { BAUMGARTNER_2009, PU_1995, RODRIGUEZ_1993, ZOGHBI_2017 } from "./citations.ts";

const PISA_FLOW_CITATIONS: readonly Citation[] = [ZOGHBI_2017, PU_1995];

/** What limits every PISA flow: the squared radius and the shape of the shell. */
const PISA_SHELL_CAUTIONS = [
  "The radius is squared: a 1 mm error in a 1 cm radius is about a 20 % flow error",
  "Assumes a hemispheric shell; eccentric or elongated orifices break the assumption",
] as const;

/** The stroke volume a fraction divides by: zero flow has no fraction. */
function strokeVolumeDividedBy(label: string, description: string): InputRole {
  return {
    quantity: STROKE_VOLUME,
    label,
    description,
    valid: { min: 0, max: 1000, minExclusive: true },
    reason: "the regurgitant fraction divides by it",
  };
}

const TOTAL_STROKE_VOLUME = strokeVolumeDividedBy(
  "Total stroke volume",
  "Stroke volume through the regurgitant valve (forward + regurgitant)",
);

const FORWARD_STROKE_VOLUME = strokeVolumeDividedBy(
  "Forward stroke volume",
  "Forward stroke volume through a competent valve (e.g. LVOT Doppler)",
);

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
 * @throws {RangeError} (through `evaluate`) for a radius, aliasing velocity or wall angle outside
 * its valid range.
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
    radiusCm: PISA_RADIUS,
    aliasingVelocityCmPerS: ALIASING_VELOCITY,
    wallAngleDeg: { quantity: PISA_WALL_ANGLE, default: 180 },
  },
  outputs: { flowRateMlPerS: REGURGITANT_FLOW_RATE },
  formula: ({ radiusCm, aliasingVelocityCmPerS, wallAngleDeg }) => ({
    flowRateMlPerS: 2 * Math.PI * radiusCm * radiusCm * aliasingVelocityCmPerS * wallAngleDeg /
      180,
  }),
  formulaText: "Q = 2π·r²·Va·α/180",
  citations: PISA_FLOW_CITATIONS,
  cautions: [...PISA_SHELL_CAUTIONS],
  clinical: true,
});

/** The aliasing velocity (cm/s) lies below the peak velocity (m/s) of the flow it converges to. */
function aliasingBelow<V extends string>(
  velocity: V,
): InputConstraint<"aliasingVelocityCmPerS" | V> {
  return {
    inputs: ["aliasingVelocityCmPerS", velocity],
    description:
      `'aliasingVelocityCmPerS' < '${velocity}' (compared in the same unit: the flow accelerates toward the orifice)`,
    holds: (x) => x.aliasingVelocityCmPerS < 100 * x[velocity],
  };
}

/** The input names of {@linkcode pisaFlowRateAliasingCorrected}. */
export type PisaCorrectedFlowInput =
  | "radiusCm"
  | "aliasingVelocityCmPerS"
  | "wallAngleDeg"
  | "regurgitantPeakVelocity";

const ALIASING_CORRECTION_CITATIONS: readonly Citation[] = [
  {
    ...ZOGHBI_2017,
    locator:
      "PISA for tricuspid regurgitation: flow corrected by Vmax/(Vmax − Va) when the aliasing velocity is not small against the jet velocity (from memory)",
  },
  PU_1995,
];

/**
 * PISA flow rate corrected for the aliasing velocity: the isovelocity shell lies where the flow
 * has already reached Va, so when Va is not small against the jet's peak velocity (tricuspid
 * regurgitation, other low-velocity jets, a high colour scale) the uncorrected flow
 * ({@linkcode pisaFlowRate}) underestimates it.
 *
 * Formula: Q [mL/s] = 2π · r² · Va · α/180 · Vmax / (Vmax − Va), velocities in the same unit
 * (Va in cm/s, Vmax in m/s here); the first factor is {@linkcode pisaFlowRate}'s formula.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (PISA in tricuspid
 * regurgitation, correction factor from memory); Pu M, et al. Circulation 1995;92:2169-2177 (α/180,
 * from memory).
 *
 * @throws {RangeError} (through `evaluate`) for a radius, velocity or angle outside its valid
 * range, or an aliasing velocity not below the jet velocity.
 *
 * @example r = 1 cm, Va = 40 cm/s, a 2 m/s tricuspid jet: 80π · 200/160 = 100π mL/s
 * ```ts
 * import { evaluate, pisaFlowRateAliasingCorrected } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(pisaFlowRateAliasingCorrected, {
 *   radiusCm: 1, aliasingVelocityCmPerS: 40, regurgitantPeakVelocity: 2,
 * });
 * assert.ok(Math.abs(r.outputs.flowRateMlPerS - 100 * Math.PI) < 1e-9);
 * ```
 */
export const pisaFlowRateAliasingCorrected: Calculation<PisaCorrectedFlowInput, "flowRateMlPerS"> =
  defineCalculation<PisaCorrectedFlowInput, "flowRateMlPerS">({
    id: "pisaFlowRateAliasingCorrected",
    title: "PISA flow rate corrected for the aliasing velocity",
    description:
      "Peak regurgitant flow rate by PISA with the correction Vmax/(Vmax − Va), for jets whose peak velocity is not much above the aliasing velocity (tricuspid regurgitation).",
    inputs: {
      ...pisaFlowRate.inputs,
      regurgitantPeakVelocity: {
        quantity: REGURGITANT_PEAK_VELOCITY,
        valid: { min: 0, max: 10, minExclusive: true },
        reason: "the correction divides by the difference of the jet and aliasing velocities",
      },
    },
    outputs: { flowRateMlPerS: REGURGITANT_FLOW_RATE },
    formula: ({ radiusCm, aliasingVelocityCmPerS, wallAngleDeg, regurgitantPeakVelocity }) => {
      const vmax = 100 * regurgitantPeakVelocity; // cm/s, the unit of Va
      const { flowRateMlPerS } = pisaFlowRate.formula({
        radiusCm,
        aliasingVelocityCmPerS,
        wallAngleDeg,
      });
      return { flowRateMlPerS: flowRateMlPerS * vmax / (vmax - aliasingVelocityCmPerS) };
    },
    formulaText: "Q = 2π·r²·Va·α/180 · Vmax/(Vmax − Va)",
    constraints: [aliasingBelow("regurgitantPeakVelocity")],
    citations: ALIASING_CORRECTION_CITATIONS,
    cautions: [
      ...PISA_SHELL_CAUTIONS,
      "The correction adds Va/(Vmax − Va) to the flow: 8.7 % for Va = 40 cm/s and a 5 m/s jet, 25 % for a 2 m/s jet",
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
 * @throws {RangeError} (through `evaluate`) for a flow rate or velocity outside its valid range.
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
    flowRateMlPerS: REGURGITANT_FLOW_RATE,
    regurgitantPeakVelocity: {
      quantity: REGURGITANT_PEAK_VELOCITY,
      valid: { min: 0, max: 10, minExclusive: true },
      reason: "the orifice area divides by the jet velocity",
    },
  },
  outputs: { eroaCm2: EFFECTIVE_REGURGITANT_ORIFICE_AREA },
  formula: ({ flowRateMlPerS, regurgitantPeakVelocity }) => ({
    eroaCm2: flowRateMlPerS / (100 * regurgitantPeakVelocity),
  }),
  formulaText: "EROA = Q / Vmax",
  citations: [ZOGHBI_2017],
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
 * @throws {RangeError} (through `evaluate`) for an area or VTI outside its valid range.
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
  inputs: { eroaCm2: EFFECTIVE_REGURGITANT_ORIFICE_AREA, regurgitantVtiCm: REGURGITANT_VTI },
  outputs: { regurgitantVolumeMl: REGURGITANT_VOLUME },
  formula: ({ eroaCm2, regurgitantVtiCm }) => ({ regurgitantVolumeMl: eroaCm2 * regurgitantVtiCm }),
  formulaText: "RVol = EROA·VTI",
  citations: [ZOGHBI_2017],
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
 * @throws {RangeError} (through `evaluate`) for a volume outside its valid range, or a
 * regurgitant volume larger than the total stroke volume.
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
  inputs: { regurgitantVolumeMl: REGURGITANT_VOLUME, totalStrokeVolumeMl: TOTAL_STROKE_VOLUME },
  outputs: { regurgitantFractionPercent: REGURGITANT_FRACTION },
  formula: ({ regurgitantVolumeMl, totalStrokeVolumeMl }) => ({
    regurgitantFractionPercent: 100 * regurgitantVolumeMl / totalStrokeVolumeMl,
  }),
  formulaText: "RF = RVol/SV_total",
  citations: [ZOGHBI_2017],
  cautions: ["The two volumes come from different methods: check that they are consistent"],
  constraints: [notAbove("regurgitantVolumeMl", "totalStrokeVolumeMl")],
  clinical: true,
});

const RF_PISA_CITATIONS: readonly Citation[] = [{
  ...ZOGHBI_2017,
  locator: "regurgitant fraction from the PISA volume and a forward stroke volume (from memory)",
}];

/**
 * Regurgitant fraction by the PISA method: PISA regurgitant volume over the sum of it and the
 * forward stroke volume measured at a competent valve.
 *
 * Formula: RF [%] = 100 · RVol_PISA / (RVol_PISA + SV_forward), via {@linkcode regurgitantFraction}.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371 (from memory).
 *
 * @throws {RangeError} (through `evaluate`) for a volume outside its valid range.
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
      quantity: REGURGITANT_VOLUME,
      description: "Regurgitant volume per beat by PISA",
    },
    forwardStrokeVolumeMl: FORWARD_STROKE_VOLUME,
  },
  outputs: { regurgitantFractionPercent: REGURGITANT_FRACTION },
  formula: ({ regurgitantVolumeMl, forwardStrokeVolumeMl }) =>
    regurgitantFraction.formula({
      regurgitantVolumeMl,
      totalStrokeVolumeMl: regurgitantVolumeMl + forwardStrokeVolumeMl,
    }),
  formulaText: "RF = RVol / (RVol + SV_forward)",
  citations: RF_PISA_CITATIONS,
  cautions: [
    "Combines two independent methods: their errors add",
  ],
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
 * @throws {RangeError} (through `evaluate`) for a volume outside its valid range, or a
 * competent-valve stroke volume larger than the regurgitant-valve one (a negative regurgitant
 * volume signals a measurement error; it is refused rather than returned).
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
    totalStrokeVolumeMl: TOTAL_STROKE_VOLUME,
    forwardStrokeVolumeMl: FORWARD_STROKE_VOLUME,
  },
  outputs: {
    regurgitantVolumeMl: REGURGITANT_VOLUME,
    regurgitantFractionPercent: REGURGITANT_FRACTION,
  },
  formula: ({ totalStrokeVolumeMl, forwardStrokeVolumeMl }) => {
    const regurgitantVolumeMl = totalStrokeVolumeMl - forwardStrokeVolumeMl;
    return {
      regurgitantVolumeMl,
      ...regurgitantFraction.formula({ regurgitantVolumeMl, totalStrokeVolumeMl }),
    };
  },
  formulaText: "RVol = SV_total − SV_forward; RF = RVol/SV_total",
  citations: [ZOGHBI_2017],
  cautions: ["Small differences of two large volumes: the uncertainty of the result is large"],
  constraints: [notAbove("forwardStrokeVolumeMl", "totalStrokeVolumeMl")],
  clinical: true,
});

/**
 * The whole PISA method as one chain, for propagating measurement uncertainty from the radius,
 * aliasing velocity, wall angle, jet velocity and VTI into the flow rate, EROA and regurgitant
 * volume (the radius, squared in the first step, is one source for all three outputs).
 *
 * Formula: Q = 2π·r²·Va·α/180 ({@linkcode pisaFlowRate}); EROA = Q/Vmax
 * ({@linkcode effectiveRegurgitantOrificeArea}); RVol = EROA·VTI ({@linkcode regurgitantVolume}),
 * chained with `chain` so that each step's formula is its own.
 *
 * Source: Zoghbi WA, et al. J Am Soc Echocardiogr 2017;30:303-371.
 *
 * @throws {RangeError} (through `evaluate`) for any input outside its valid range, or a flow rate,
 * orifice area or volume outside its quantity's valid range.
 *
 * @example
 * ```ts
 * import { evaluate, normal, pisaRegurgitation, propagate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const inputs = {
 *   radiusCm: 1, aliasingVelocityCmPerS: 40, regurgitantPeakVelocity: 5, regurgitantVtiCm: 150,
 * };
 * const r = evaluate(pisaRegurgitation, inputs);
 * // 2π·1²·40 = 251.3 mL/s; / 500 cm/s = 0.503 cm²; × 150 cm = 75.4 mL (hand-checkable)
 * assert.ok(Math.abs(r.outputs.eroaCm2 - 0.503) < 1e-3);
 * assert.ok(Math.abs(r.outputs.regurgitantVolumeMl - 75.4) < 0.1);
 * // r = 1.0 ± 0.05 cm (5 %) alone: u_r(RVol) = 2 · 5 % = 10 % (JCGM 100 §5.1.6)
 * const g = propagate(pisaRegurgitation, { ...inputs, radiusCm: normal(1, 0.05) });
 * const rvol = g.outputs.regurgitantVolumeMl;
 * assert.ok(Math.abs(rvol.standardUncertainty / rvol.value - 0.1) < 1e-6);
 * ```
 */
export const pisaRegurgitation = chain(
  [pisaFlowRate, effectiveRegurgitantOrificeArea, regurgitantVolume],
  {
    id: "pisaRegurgitation",
    title: "PISA regurgitation (flow, EROA, volume)",
    description: "Regurgitant flow rate, orifice area and volume from PISA measurements.",
  },
) as Calculation<
  | "radiusCm"
  | "aliasingVelocityCmPerS"
  | "wallAngleDeg"
  | "regurgitantPeakVelocity"
  | "regurgitantVtiCm",
  "flowRateMlPerS" | "eroaCm2" | "regurgitantVolumeMl"
>;

/** The input names of {@linkcode pisaMitralValveArea}. */
export type PisaMitralAreaInput =
  | "radiusCm"
  | "aliasingVelocityCmPerS"
  | "wallAngleDeg"
  | "mitralPeakVelocity";

const PISA_MITRAL_AREA_CITATIONS: readonly Citation[] = [
  RODRIGUEZ_1993,
  { ...BAUMGARTNER_2009, locator: "PISA method for the mitral valve area (from memory)" },
];

/**
 * Mitral valve area in stenosis by PISA: the flow converging on the atrial side of the funnel
 * (measured at the aliasing velocity and corrected by the funnel angle α/180) divided by the peak
 * transmitral velocity.
 *
 * Formula: MVA [cm²] = 2π · r² · Va / Vpeak · α/180, Va in cm/s and Vpeak in m/s (× 100); the
 * flow is {@linkcode pisaFlowRate}'s formula and flow over velocity is
 * {@linkcode effectiveRegurgitantOrificeArea}'s, each written once.
 *
 * Source: Rodriguez L, et al. Circulation 1993;88:1157-1165; Baumgartner H, et al. J Am Soc
 * Echocardiogr 2009;22:1-23 (PISA method in mitral stenosis); both from memory.
 *
 * @throws {RangeError} (through `evaluate`) for a radius, velocity or angle outside its valid
 * range, or an aliasing velocity not below the peak transmitral velocity.
 * @throws {TypeError} (through `evaluate`) when the funnel angle is missing (it has no default:
 * the mitral funnel is rarely flat).
 *
 * @example r = 1 cm, Va = 40 cm/s, Vpeak = 1.6 m/s, α = 120°: π/3 = 1.05 cm²
 * ```ts
 * import { evaluate, pisaMitralValveArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(pisaMitralValveArea, {
 *   radiusCm: 1, aliasingVelocityCmPerS: 40, wallAngleDeg: 120, mitralPeakVelocity: 1.6,
 * });
 * assert.ok(Math.abs(r.outputs.mvaCm2 - Math.PI / 3) < 1e-12); // 2π·40/160·(2/3)
 * ```
 */
export const pisaMitralValveArea: Calculation<PisaMitralAreaInput, "mvaCm2"> = defineCalculation<
  PisaMitralAreaInput,
  "mvaCm2"
>({
  id: "pisaMitralValveArea",
  title: "Mitral valve area by PISA",
  description:
    "Mitral stenosis orifice area from the proximal flow convergence on the atrial side and the peak transmitral velocity.",
  inputs: {
    radiusCm: PISA_RADIUS,
    aliasingVelocityCmPerS: ALIASING_VELOCITY,
    wallAngleDeg: {
      quantity: PISA_WALL_ANGLE,
      label: "Funnel angle of the mitral leaflets",
      description:
        "Angle between the mitral leaflets on the atrial side, measured on the colour image (no default)",
    },
    mitralPeakVelocity: {
      quantity: MITRAL_E_VELOCITY,
      label: "Peak transmitral velocity",
      description: "Peak diastolic velocity through the stenotic mitral valve (continuous wave)",
      valid: { min: 0, max: 5, minExclusive: true },
      reason: "the area divides by the peak velocity",
    },
  },
  outputs: { mvaCm2: MITRAL_VALVE_AREA },
  formula: ({ radiusCm, aliasingVelocityCmPerS, wallAngleDeg, mitralPeakVelocity }) => {
    const { flowRateMlPerS } = pisaFlowRate.formula({
      radiusCm,
      aliasingVelocityCmPerS,
      wallAngleDeg,
    });
    const { eroaCm2 } = effectiveRegurgitantOrificeArea.formula({
      flowRateMlPerS,
      regurgitantPeakVelocity: mitralPeakVelocity,
    });
    return { mvaCm2: eroaCm2 };
  },
  formulaText: "MVA = 2π·r²·Va/Vpeak·α/180",
  constraints: [aliasingBelow("mitralPeakVelocity")],
  citations: PISA_MITRAL_AREA_CITATIONS,
  cautions: [
    ...PISA_SHELL_CAUTIONS,
    "The funnel angle changes the area in proportion: measure it, do not assume 180°",
  ],
  clinical: true,
});
