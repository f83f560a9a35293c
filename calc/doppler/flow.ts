/**
 * Doppler volumetric flow: cross-sectional area, stroke volume, cardiac output and index, Qp/Qs.
 *
 * @module
 */
import { defineCalculation, type InputRole } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import {
  CARDIAC_OUTPUT,
  CROSS_SECTIONAL_AREA,
  FLOW_REGION_DIAMETER,
  HEART_RATE,
  LVOT_VTI,
  PULMONARY_SYSTEMIC_FLOW_RATIO,
  RVOT_VTI,
  STROKE_VOLUME,
  VELOCITY_TIME_INTEGRAL,
} from "../quantities/flow.ts";
import { LVOT_DIAMETER, RVOT_DIAMETER } from "../quantities/structure.ts";
import { indexedToBsa } from "../body/indexing.ts";
import { QUINONES_2002 } from "./citations.ts";

/** The VTI at a flow region: pulsed-wave, so bounded well below a jet's. */
const FLOW_REGION_VTI: InputRole = {
  quantity: VELOCITY_TIME_INTEGRAL,
  description: "Pulsed-wave velocity-time integral at the flow region",
  valid: { min: 0, max: 200, minExclusive: true },
  typical: { min: 5, max: 50 },
  reason:
    "pulsed-wave flow at an outflow tract or annulus stays below about 3 m/s for under 0.5 s: 200 cm is out of reach",
};

/**
 * Cross-sectional area of a circular flow region (LVOT, RVOT, annulus) from its diameter.
 *
 * Formula: CSA [cm²] = π · (d/2)² = π·d²/4, d in cm. An error δ in d gives an error of about 2δ/d
 * in the area (the diameter is squared).
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (Doppler volumetric flow).
 *
 * @throws {RangeError} (through `evaluate`) for a diameter outside its valid range.
 *
 * @example
 * ```ts
 * import { crossSectionalArea, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // d = 2 cm → π cm²
 * assert.ok(Math.abs(evaluate(crossSectionalArea, { diameterCm: "20 mm" }).outputs.areaCm2 - Math.PI) < 1e-12);
 * ```
 */
export const crossSectionalArea: Calculation<"diameterCm", "areaCm2"> = defineCalculation({
  id: "crossSectionalArea",
  title: "Cross-sectional area from diameter",
  description: "Area of a circular flow region (LVOT, RVOT, valve annulus) from its diameter.",
  inputs: { diameterCm: FLOW_REGION_DIAMETER },
  outputs: { areaCm2: CROSS_SECTIONAL_AREA },
  formula: ({ diameterCm }) => ({ areaCm2: Math.PI * diameterCm * diameterCm / 4 }),
  formulaText: "CSA = π·d²/4",
  citations: [QUINONES_2002],
  cautions: [
    "Assumes a circular cross-section; the LVOT is often elliptical and its area underestimated",
    "The diameter is squared: a 1 mm error in a 2 cm diameter is about a 10 % area error",
  ],
  clinical: true,
});

/**
 * Stroke volume through a circular flow region from its diameter and pulsed-wave VTI.
 *
 * Formula: SV [mL] = CSA [cm²] · VTI [cm], CSA = π·d²/4 (from {@linkcode crossSectionalArea}).
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184.
 *
 * @throws {RangeError} (through `evaluate`) for a diameter or VTI outside its valid range.
 *
 * @example
 * ```ts
 * import { evaluate, strokeVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // d = 2 cm, VTI = 20 cm → 20π ≈ 62.8 mL
 * const sv = evaluate(strokeVolume, { diameterCm: 2, vtiCm: 20 }).outputs.strokeVolumeMl;
 * assert.ok(Math.abs(sv - 20 * Math.PI) < 1e-9);
 * ```
 */
export const strokeVolume: Calculation<"diameterCm" | "vtiCm", "strokeVolumeMl"> =
  defineCalculation({
    id: "strokeVolume",
    title: "Doppler stroke volume",
    description: "Volume ejected per beat through a circular region from its diameter and VTI.",
    inputs: { diameterCm: FLOW_REGION_DIAMETER, vtiCm: FLOW_REGION_VTI },
    outputs: { strokeVolumeMl: STROKE_VOLUME },
    formula: ({ diameterCm, vtiCm }) => ({
      strokeVolumeMl: crossSectionalArea.formula({ diameterCm }).areaCm2 * vtiCm,
    }),
    formulaText: "SV = π·d²/4 · VTI",
    citations: [QUINONES_2002],
    cautions: ["Diameter and VTI must be measured at the same level"],
    clinical: true,
  });

/**
 * Cardiac output from stroke volume and heart rate.
 *
 * Formula: CO [L/min] = SV [mL] · HR [beats/min] / 1000.
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184.
 *
 * @throws {RangeError} (through `evaluate`) for a stroke volume or heart rate outside its valid
 * range, or a zero output.
 *
 * @example
 * ```ts
 * import { cardiacOutput, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 70 mL × 72 /min = 5.04 L/min
 * const co = evaluate(cardiacOutput, { strokeVolumeMl: 70, heartRateBpm: 72 }).outputs;
 * assert.ok(Math.abs(co.cardiacOutputLPerMin - 5.04) < 1e-12);
 * ```
 */
export const cardiacOutput: Calculation<
  "strokeVolumeMl" | "heartRateBpm",
  "cardiacOutputLPerMin"
> = defineCalculation({
  id: "cardiacOutput",
  title: "Cardiac output",
  description: "Volume pumped per minute from the stroke volume and heart rate.",
  inputs: { strokeVolumeMl: STROKE_VOLUME, heartRateBpm: HEART_RATE },
  outputs: { cardiacOutputLPerMin: CARDIAC_OUTPUT },
  formula: ({ strokeVolumeMl, heartRateBpm }) => ({
    cardiacOutputLPerMin: strokeVolumeMl * heartRateBpm / 1000,
  }),
  formulaText: "CO = SV·HR/1000",
  citations: [QUINONES_2002],
  cautions: ["In irregular rhythms average stroke volume and rate over several beats"],
  clinical: true,
});

/**
 * Cardiac index: cardiac output per body surface area. This is the member of the indexing family
 * for cardiac output (`indexedToBsa(CARDIAC_OUTPUT)`), so the division is written once for every
 * indexed quantity; its inputs are `cardiacOutput` (L/min) and `bsaM2`, its output `cardiacIndex`.
 *
 * Formula: CI [L/min/m²] = CO [L/min] / BSA [m²].
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (indexing to BSA); Lang RM,
 * et al. J Am Soc Echocardiogr 2015;28:1-39 (indexing to BSA).
 *
 * @throws {RangeError} (through `evaluate`) for a cardiac output or BSA outside its valid range.
 *
 * @example
 * ```ts
 * import { cardiacIndex, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 5 L/min over 2 m² = 2.5 L/min/m²
 * assert.equal(evaluate(cardiacIndex, { cardiacOutput: 5, bsaM2: 2 }).outputs.cardiacIndex, 2.5);
 * ```
 */
export const cardiacIndex = indexedToBsa(CARDIAC_OUTPUT) as Calculation<
  "cardiacOutput" | "bsaM2",
  "cardiacIndex"
>;

/**
 * Pulmonary-to-systemic flow ratio (Qp/Qs) from RVOT and LVOT stroke volumes.
 *
 * Formula: Qp/Qs = SV_RVOT / SV_LVOT = (π·d_RVOT²/4 · VTI_RVOT) / (π·d_LVOT²/4 · VTI_LVOT), each
 * stroke volume from {@linkcode strokeVolume}.
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (shunt quantification).
 *
 * @throws {RangeError} (through `evaluate`) for a diameter or VTI outside its valid range.
 *
 * @example
 * ```ts
 * import { evaluate, pulmonarySystemicFlowRatio } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Equal diameters, RVOT VTI twice the LVOT VTI → Qp/Qs = 2
 * const r = evaluate(pulmonarySystemicFlowRatio, {
 *   rvotDiameterCm: 2.2, rvotVtiCm: 30, lvotDiameterCm: 2.2, lvotVtiCm: 15,
 * });
 * assert.ok(Math.abs(r.outputs.qpQs - 2) < 1e-12);
 * ```
 */
export const pulmonarySystemicFlowRatio: Calculation<
  "rvotDiameterCm" | "rvotVtiCm" | "lvotDiameterCm" | "lvotVtiCm",
  "qpQs" | "pulmonaryStrokeVolumeMl" | "systemicStrokeVolumeMl"
> = defineCalculation({
  id: "pulmonarySystemicFlowRatio",
  title: "Pulmonary-to-systemic flow ratio (Qp/Qs)",
  description: "Shunt ratio from the RVOT and LVOT Doppler stroke volumes.",
  inputs: {
    rvotDiameterCm: RVOT_DIAMETER,
    rvotVtiCm: RVOT_VTI,
    lvotDiameterCm: LVOT_DIAMETER,
    lvotVtiCm: LVOT_VTI,
  },
  outputs: {
    qpQs: PULMONARY_SYSTEMIC_FLOW_RATIO,
    pulmonaryStrokeVolumeMl: {
      quantity: STROKE_VOLUME,
      label: "Pulmonary stroke volume",
      description: "RVOT stroke volume (Qp per beat)",
    },
    systemicStrokeVolumeMl: {
      quantity: STROKE_VOLUME,
      label: "Systemic stroke volume",
      description: "LVOT stroke volume (Qs per beat)",
    },
  },
  formula: ({ rvotDiameterCm, rvotVtiCm, lvotDiameterCm, lvotVtiCm }) => {
    const qp =
      strokeVolume.formula({ diameterCm: rvotDiameterCm, vtiCm: rvotVtiCm }).strokeVolumeMl;
    const qs =
      strokeVolume.formula({ diameterCm: lvotDiameterCm, vtiCm: lvotVtiCm }).strokeVolumeMl;
    return { qpQs: qp / qs, pulmonaryStrokeVolumeMl: qp, systemicStrokeVolumeMl: qs };
  },
  formulaText: "Qp/Qs = (π·d_RVOT²/4·VTI_RVOT) / (π·d_LVOT²/4·VTI_LVOT)",
  citations: [QUINONES_2002],
  cautions: [
    "Both diameters are squared: diameter errors dominate the ratio",
    "Not valid with significant regurgitation of the pulmonary or aortic valve",
  ],
  clinical: true,
});
