/**
 * Valve areas: continuity equation for the aortic valve (VTI and peak-velocity forms), indexed
 * area, dimensionless index, the energy loss index (aortic stenosis with pressure recovery), and
 * mitral valve area by pressure half-time.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation, Citation, InputConstraint } from "../core/types.ts";
import {
  AORTIC_PEAK_VELOCITY,
  AORTIC_VALVE_AREA,
  AORTIC_VTI,
  DECELERATION_SLOPE,
  DECELERATION_TIME,
  DIMENSIONLESS_INDEX,
  ENERGY_LOSS_COEFFICIENT,
  ENERGY_LOSS_INDEX,
  LVOT_PEAK_VELOCITY,
  LVOT_VTI,
  MITRAL_E_VELOCITY,
  MITRAL_VALVE_AREA,
  PRESSURE_HALF_TIME,
  SINOTUBULAR_JUNCTION_AREA,
} from "../quantities/flow.ts";
import { BODY_SURFACE_AREA } from "../quantities/body.ts";
import { LVOT_DIAMETER } from "../quantities/structure.ts";
import { indexedToBsa } from "../body/indexing.ts";
import { crossSectionalArea, strokeVolume } from "./flow.ts";
import { BAUMGARTNER_2009, BAUMGARTNER_2017, GARCIA_2000, HATLE_1979 } from "./citations.ts";

const CONTINUITY_CAUTIONS = [
  "LVOT diameter is squared: a 1 mm error in a 2 cm LVOT changes the area by about 10 %",
  "Under-aligned aortic jet Doppler underestimates its velocity and overestimates the area",
] as const;

/**
 * Continuity-equation aortic valve area, VTI form.
 *
 * Formula: AVA [cm²] = CSA_LVOT · VTI_LVOT / VTI_AV = SV_LVOT / VTI_AV, CSA_LVOT = π·d²/4 (stroke
 * volume from {@linkcode strokeVolume}).
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23, continuity equation
 * (recommended method); Baumgartner H, et al. 2017 focused update.
 *
 * @throws {RangeError} (through `evaluate`) for a diameter or VTI outside its valid range.
 *
 * @example
 * ```ts
 * import { continuityValveArea, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // d = 2 cm, VTI_LVOT = 20 cm, VTI_AV = 100 cm → π·20/100 = 0.628 cm²
 * const r = evaluate(continuityValveArea, { lvotDiameterCm: 2, lvotVtiCm: 20, avVtiCm: 100 });
 * assert.ok(Math.abs(r.outputs.avaCm2 - 0.2 * Math.PI) < 1e-12);
 * ```
 */
export const continuityValveArea: Calculation<
  "lvotDiameterCm" | "lvotVtiCm" | "avVtiCm",
  "avaCm2"
> = defineCalculation({
  id: "continuityValveArea",
  title: "Continuity valve area (VTI)",
  description: "Aortic valve effective orifice area from the continuity equation with VTIs.",
  inputs: { lvotDiameterCm: LVOT_DIAMETER, lvotVtiCm: LVOT_VTI, avVtiCm: AORTIC_VTI },
  outputs: { avaCm2: AORTIC_VALVE_AREA },
  formula: ({ lvotDiameterCm, lvotVtiCm, avVtiCm }) => ({
    avaCm2: strokeVolume.formula({ diameterCm: lvotDiameterCm, vtiCm: lvotVtiCm }).strokeVolumeMl /
      avVtiCm,
  }),
  formulaText: "AVA = π·d_LVOT²/4 · VTI_LVOT / VTI_AV",
  citations: [BAUMGARTNER_2009, BAUMGARTNER_2017],
  cautions: [...CONTINUITY_CAUTIONS],
  clinical: true,
});

const PEAK_VELOCITY_CONTINUITY_CITATIONS: readonly Citation[] = [{
  ...BAUMGARTNER_2009,
  locator: "simplified continuity equation with peak velocities (from memory)",
}];

/**
 * Continuity-equation aortic valve area, peak-velocity form.
 *
 * Formula: AVA [cm²] = CSA_LVOT · V_LVOT / V_AV, CSA_LVOT = π·d²/4 (from
 * {@linkcode crossSectionalArea}), velocities in m/s.
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (simplified continuity
 * equation with peak velocities, from memory).
 *
 * @throws {RangeError} (through `evaluate`) for a diameter or velocity outside its valid range,
 * or a zero jet velocity.
 *
 * @example
 * ```ts
 * import { continuityValveAreaPeakVelocity, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // d = 2 cm, V_LVOT = 1 m/s, V_AV = 5 m/s → π·0.2 = 0.628 cm²
 * const r = evaluate(continuityValveAreaPeakVelocity, {
 *   lvotDiameterCm: 2, lvotPeakVelocity: 1, avPeakVelocity: 5,
 * });
 * assert.ok(Math.abs(r.outputs.avaCm2 - 0.2 * Math.PI) < 1e-12);
 * ```
 */
export const continuityValveAreaPeakVelocity: Calculation<
  "lvotDiameterCm" | "lvotPeakVelocity" | "avPeakVelocity",
  "avaCm2"
> = defineCalculation({
  id: "continuityValveAreaPeakVelocity",
  title: "Continuity valve area (peak velocity)",
  description: "Aortic valve area from the continuity equation with peak velocities.",
  inputs: {
    lvotDiameterCm: LVOT_DIAMETER,
    lvotPeakVelocity: LVOT_PEAK_VELOCITY,
    avPeakVelocity: {
      quantity: AORTIC_PEAK_VELOCITY,
      valid: { min: 0, max: 10, minExclusive: true },
      reason: "the area divides by the jet velocity",
    },
  },
  outputs: { avaCm2: AORTIC_VALVE_AREA },
  formula: ({ lvotDiameterCm, lvotPeakVelocity, avPeakVelocity }) => ({
    avaCm2: crossSectionalArea.formula({ diameterCm: lvotDiameterCm }).areaCm2 *
      lvotPeakVelocity / avPeakVelocity,
  }),
  formulaText: "AVA = π·d_LVOT²/4 · V_LVOT / V_AV",
  citations: PEAK_VELOCITY_CONTINUITY_CITATIONS,
  cautions: [
    ...CONTINUITY_CAUTIONS,
    "Less accurate than the VTI form when the ejection profiles differ in shape",
  ],
  clinical: true,
});

/**
 * Aortic valve area indexed to body surface area. This is the member of the indexing family for
 * the aortic valve area (`indexedToBsa(AORTIC_VALVE_AREA)`), so the division is written once for
 * every indexed quantity; its inputs are `aorticValveArea` (cm²) and `bsaM2`, its output
 * `aorticValveAreaIndex`.
 *
 * Formula: AVAi [cm²/m²] = AVA [cm²] / BSA [m²].
 *
 * Source: Baumgartner H, et al. 2017 focused update, table of AS severity (indexed AVA); Lang RM,
 * et al. J Am Soc Echocardiogr 2015;28:1-39 (indexing to BSA).
 *
 * @throws {RangeError} (through `evaluate`) for an area or BSA outside its valid range.
 *
 * @example
 * ```ts
 * import { evaluate, indexedValveArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(indexedValveArea, { aorticValveArea: 1.2, bsaM2: 2 });
 * assert.equal(r.outputs.aorticValveAreaIndex, 0.6);
 * ```
 */
export const indexedValveArea = indexedToBsa(AORTIC_VALVE_AREA) as Calculation<
  "aorticValveArea" | "bsaM2",
  "aorticValveAreaIndex"
>;

/**
 * Dimensionless index (velocity ratio) of the aortic valve: LVOT over aortic jet.
 *
 * Formula: DVI = VTI_LVOT / VTI_AV (the same ratio may be formed from peak velocities). It needs
 * no LVOT diameter, so it avoids the squared diameter error.
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (velocity ratio); 2017 update.
 *
 * @throws {RangeError} (through `evaluate`) for a VTI outside its valid range, or a ratio above
 * 1.5 (flow does not slow down through a stenosis: such a ratio is a measurement error).
 *
 * @example
 * ```ts
 * import { dimensionlessIndex, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(evaluate(dimensionlessIndex, { lvotVtiCm: 20, avVtiCm: 100 }).outputs.dvi, 0.2);
 * ```
 */
export const dimensionlessIndex: Calculation<"lvotVtiCm" | "avVtiCm", "dvi"> = defineCalculation({
  id: "dimensionlessIndex",
  title: "Dimensionless index (velocity ratio)",
  description: "Ratio of LVOT to aortic jet VTI, independent of the LVOT diameter.",
  inputs: { lvotVtiCm: LVOT_VTI, avVtiCm: AORTIC_VTI },
  outputs: { dvi: DIMENSIONLESS_INDEX },
  formula: ({ lvotVtiCm, avVtiCm }) => ({ dvi: lvotVtiCm / avVtiCm }),
  formulaText: "DVI = VTI_LVOT / VTI_AV",
  citations: [BAUMGARTNER_2009, BAUMGARTNER_2017],
  cautions: ["Depends on LVOT size: a large LVOT lowers the ratio for the same valve area"],
  clinical: true,
});

const ENERGY_LOSS_CITATIONS: readonly Citation[] = [
  GARCIA_2000,
  {
    ...BAUMGARTNER_2009,
    locator: "energy loss index, aortic area measured at the sinotubular junction (from memory)",
  },
];

/** The orifice of a stenotic valve is smaller than the aorta it opens into (else AA − EOA ≤ 0). */
const ORIFICE_SMALLER_THAN_AORTA: InputConstraint<"avaCm2" | "aorticAreaCm2" | "bsaM2"> = {
  inputs: ["avaCm2", "aorticAreaCm2"],
  description: "'avaCm2' < 'aorticAreaCm2' (the valve orifice is smaller than the aorta above it)",
  holds: ({ avaCm2, aorticAreaCm2 }) => avaCm2 < aorticAreaCm2,
};

/**
 * Energy loss index of aortic stenosis: the effective orifice area corrected for the pressure
 * recovered in the ascending aorta, indexed to body surface area. Recovery matters when the aorta
 * is small relative to the orifice; in a wide aorta the coefficient approaches the orifice area.
 *
 * Formula: ELCo [cm²] = EOA · AA / (AA − EOA); ELI [cm²/m²] = ELCo / BSA, with EOA the continuity
 * valve area and AA the aortic cross-sectional area at the sinotubular junction.
 *
 * Source: Garcia D, Pibarot P, Dumesnil JG, Sakr F, Durand LG. Circulation 2000;101:765-771
 * (formula, indexing to BSA, ELI ≤ 0.52 cm²/m² as the best predictor of death or valve
 * replacement); Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (AA at the
 * sinotubular junction, from memory).
 *
 * @throws {RangeError} (through `evaluate`) for an area or BSA outside its valid range, or an
 * orifice area not smaller than the aortic area.
 *
 * @example EOA 0.8 cm², AA 4 cm², BSA 2 m²: ELCo 1.0 cm², ELI 0.5 cm²/m²
 * ```ts
 * import { energyLossIndex, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(energyLossIndex, { avaCm2: 0.8, aorticAreaCm2: 4, bsaM2: 2 });
 * assert.ok(Math.abs(r.outputs.energyLossCoefficientCm2 - 1) < 1e-12); // 3.2 / 3.2
 * assert.ok(Math.abs(r.outputs.energyLossIndex - 0.5) < 1e-12);
 * ```
 */
export const energyLossIndex: Calculation<
  "avaCm2" | "aorticAreaCm2" | "bsaM2",
  "energyLossCoefficientCm2" | "energyLossIndex"
> = defineCalculation({
  id: "energyLossIndex",
  title: "Energy loss index (aortic stenosis)",
  description:
    "Aortic valve effective orifice area corrected for pressure recovery in the ascending aorta, and indexed to body surface area.",
  inputs: {
    avaCm2: {
      quantity: AORTIC_VALVE_AREA,
      label: "Effective orifice area",
      description: "Aortic valve effective orifice area by the continuity equation (Doppler)",
    },
    aorticAreaCm2: SINOTUBULAR_JUNCTION_AREA,
    bsaM2: BODY_SURFACE_AREA,
  },
  outputs: {
    energyLossCoefficientCm2: ENERGY_LOSS_COEFFICIENT,
    energyLossIndex: ENERGY_LOSS_INDEX,
  },
  formula: ({ avaCm2, aorticAreaCm2, bsaM2 }) => {
    const energyLossCoefficientCm2 = avaCm2 * aorticAreaCm2 / (aorticAreaCm2 - avaCm2);
    return { energyLossCoefficientCm2, energyLossIndex: energyLossCoefficientCm2 / bsaM2 };
  },
  formulaText: "ELCo = EOA·AA/(AA − EOA); ELI = ELCo/BSA",
  constraints: [ORIFICE_SMALLER_THAN_AORTA],
  citations: ENERGY_LOSS_CITATIONS,
  cautions: [
    "Garcia 2000: ELI ≤ 0.52 cm²/m² was the best predictor of death or valve replacement (positive predictive value 67 %, 138 patients); an outcome cut-off, not a guideline severity class",
    "Use the Doppler (continuity) orifice area, not a planimetered one, and the aortic area at the sinotubular junction",
  ],
  clinical: true,
});

/**
 * Mitral valve area by pressure half-time.
 *
 * Formula: MVA [cm²] = 220 / PHT [ms]. The constant 220 is empirical.
 *
 * Source: Hatle L, Angelsen B, Tromsdal A. Circulation 1979;60:1096-1104; Baumgartner H, et al.
 * J Am Soc Echocardiogr 2009;22:1-23 (mitral stenosis, pressure half-time).
 *
 * @throws {RangeError} (through `evaluate`) for a PHT outside its valid range, or one so short
 * that the area exceeds any valve's.
 *
 * @example
 * ```ts
 * import { evaluate, mitralValveAreaPressureHalfTime } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(evaluate(mitralValveAreaPressureHalfTime, { phtMs: 220 }).outputs.mvaCm2, 1);
 * ```
 */
export const mitralValveAreaPressureHalfTime: Calculation<"phtMs", "mvaCm2"> = defineCalculation({
  id: "mitralValveAreaPressureHalfTime",
  title: "Mitral valve area by pressure half-time",
  description: "Mitral stenosis orifice area from the transmitral pressure half-time.",
  inputs: {
    phtMs: {
      quantity: PRESSURE_HALF_TIME,
      typical: { min: 60, max: 500 },
      reason: "the empirical constant 220 was fitted on stenotic valves, whose PHT lies here",
    },
  },
  outputs: { mvaCm2: MITRAL_VALVE_AREA },
  formula: ({ phtMs }) => ({ mvaCm2: 220 / phtMs }),
  formulaText: "MVA = 220/PHT",
  citations: [HATLE_1979, BAUMGARTNER_2009],
  cautions: [
    "Unreliable immediately after balloon valvotomy, with significant aortic regurgitation and with abnormal left-ventricular compliance",
    "Not validated in normal valves: short PHT gives meaningless large areas",
  ],
  clinical: true,
});

const PHT_FROM_DT_CITATIONS: readonly Citation[] = [{
  ...BAUMGARTNER_2009,
  locator: "mitral stenosis, pressure half-time from the deceleration time (from memory)",
}];

/**
 * Pressure half-time from the deceleration time of the transmitral E wave.
 *
 * Formula: PHT [ms] = 0.29 · DT [ms] (for a linear deceleration PHT/DT = 1 − 1/√2 ≈ 0.293).
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23, mitral stenosis section
 * (from memory).
 *
 * @throws {RangeError} (through `evaluate`) for a deceleration time outside its valid range.
 *
 * @example
 * ```ts
 * import { evaluate, pressureHalfTimeFromDecelerationTime } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // DT 759 ms → PHT 220 ms (MVA 1.0 cm²)
 * const r = evaluate(pressureHalfTimeFromDecelerationTime, { decelerationTimeMs: 759 });
 * assert.ok(Math.abs(r.outputs.phtMs - 220.11) < 1e-9);
 * ```
 */
export const pressureHalfTimeFromDecelerationTime: Calculation<"decelerationTimeMs", "phtMs"> =
  defineCalculation({
    id: "pressureHalfTimeFromDecelerationTime",
    title: "Pressure half-time from deceleration time",
    description:
      "Pressure half-time of the mitral E wave from the time its velocity takes to reach zero.",
    inputs: { decelerationTimeMs: DECELERATION_TIME },
    outputs: { phtMs: PRESSURE_HALF_TIME },
    formula: ({ decelerationTimeMs }) => ({ phtMs: 0.29 * decelerationTimeMs }),
    formulaText: "PHT = 0.29·DT",
    citations: PHT_FROM_DT_CITATIONS,
    cautions: [
      "With a bimodal (non-linear) deceleration use the mid-diastolic slope",
    ],
    clinical: true,
  });

/**
 * Pressure half-time from the E-wave peak velocity and a linear deceleration slope.
 *
 * The pressure gradient halves when the velocity falls to v₀/√2 (ΔP ∝ v²). With a linear
 * deceleration at slope s the time to get there is
 * PHT [ms] = 1000 · v₀ · (1 − 1/√2) / s, v₀ in m/s and s in m/s².
 *
 * Source: Hatle L, Angelsen B, Tromsdal A. Circulation 1979;60:1096-1104 (definition of the
 * pressure half-time); hand-checkable arithmetic.
 *
 * @throws {RangeError} (through `evaluate`) for a velocity or slope outside its valid range, or
 * a zero velocity.
 *
 * @example
 * ```ts
 * import { evaluate, pressureHalfTimeFromSlope } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 2 m/s falling at 2 m/s² reaches zero after 1000 ms; half-pressure after 292.9 ms
 * const r = evaluate(pressureHalfTimeFromSlope, { peakVelocity: 2, decelerationSlope: 2 });
 * assert.ok(Math.abs(r.outputs.phtMs - 1000 * (1 - Math.SQRT1_2)) < 1e-9);
 * ```
 */
export const pressureHalfTimeFromSlope: Calculation<
  "peakVelocity" | "decelerationSlope",
  "phtMs"
> = defineCalculation({
  id: "pressureHalfTimeFromSlope",
  title: "Pressure half-time from deceleration slope",
  description:
    "Time for the transmitral velocity to fall from its peak to peak/√2 along a linear slope.",
  inputs: {
    peakVelocity: {
      quantity: MITRAL_E_VELOCITY,
      description: "Peak E-wave velocity where the deceleration starts",
    },
    decelerationSlope: DECELERATION_SLOPE,
  },
  outputs: { phtMs: PRESSURE_HALF_TIME },
  formula: ({ peakVelocity, decelerationSlope }) => ({
    phtMs: 1000 * peakVelocity * (1 - Math.SQRT1_2) / decelerationSlope,
  }),
  formulaText: "PHT = v₀·(1 − 1/√2)/s",
  citations: [HATLE_1979],
  cautions: ["Assumes a linear deceleration from the peak"],
  clinical: true,
});
