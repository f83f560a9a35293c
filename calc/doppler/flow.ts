/**
 * Doppler volumetric flow: cross-sectional area, stroke volume, cardiac output and index, Qp/Qs.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import { QUINONES_2002 } from "./sources.ts";

const DIAMETER_RANGE = { min: 0, max: 5, minExclusive: true } as const;
const VTI_RANGE = { min: 0, max: 200, minExclusive: true } as const;

/**
 * Cross-sectional area of a circular flow region (LVOT, RVOT, annulus) from its diameter.
 *
 * Formula: CSA [cm²] = π · (d/2)² = π·d²/4, d in cm. An error δ in d gives an error of about 2δ/d
 * in the area (the diameter is squared).
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (Doppler volumetric flow).
 *
 * Throws (through `evaluate`) a RangeError for a diameter outside (0, 5] cm.
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
  inputs: {
    diameterCm: {
      unit: "cm",
      description: "Diameter of the flow region",
      range: DIAMETER_RANGE,
      typical: { min: 1.4, max: 3.5 },
    },
  },
  outputs: { areaCm2: { unit: "cm^2", description: "Cross-sectional area" } },
  formula: ({ diameterCm }) => ({ areaCm2: Math.PI * diameterCm * diameterCm / 4 }),
  formulaText: "CSA = π·d²/4",
  sources: [QUINONES_2002],
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
 * Throws (through `evaluate`) a RangeError for a diameter outside (0, 5] cm or a VTI outside
 * (0, 200] cm.
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
    inputs: {
      diameterCm: {
        unit: "cm",
        description: "Diameter of the flow region where the VTI was sampled",
        range: DIAMETER_RANGE,
        typical: { min: 1.4, max: 3.5 },
      },
      vtiCm: {
        unit: "cm",
        description: "Pulsed-wave velocity-time integral at that region",
        range: VTI_RANGE,
        typical: { min: 5, max: 50 },
      },
    },
    outputs: { strokeVolumeMl: { unit: "mL", description: "Stroke volume" } },
    formula: ({ diameterCm, vtiCm }) => ({
      strokeVolumeMl: crossSectionalArea.formula({ diameterCm }).areaCm2 * vtiCm,
    }),
    formulaText: "SV = π·d²/4 · VTI",
    sources: [QUINONES_2002],
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
 * Throws (through `evaluate`) a RangeError for a stroke volume outside (0, 500] mL or a heart rate
 * outside (0, 300] bpm.
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
  inputs: {
    strokeVolumeMl: {
      unit: "mL",
      description: "Stroke volume",
      range: { min: 0, max: 500, minExclusive: true },
      typical: { min: 20, max: 150 },
    },
    heartRateBpm: {
      unit: "bpm",
      description: "Heart rate in beats per minute",
      range: { min: 0, max: 300, minExclusive: true },
      typical: { min: 40, max: 150 },
    },
  },
  outputs: { cardiacOutputLPerMin: { unit: "L/min", description: "Cardiac output" } },
  formula: ({ strokeVolumeMl, heartRateBpm }) => ({
    cardiacOutputLPerMin: strokeVolumeMl * heartRateBpm / 1000,
  }),
  formulaText: "CO = SV·HR/1000",
  sources: [QUINONES_2002],
  cautions: ["In irregular rhythms average stroke volume and rate over several beats"],
  clinical: true,
});

/**
 * Cardiac index: cardiac output per body surface area.
 *
 * Formula: CI [L/min/m²] = CO [L/min] / BSA [m²].
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (indexing to BSA).
 *
 * Throws (through `evaluate`) a RangeError for a cardiac output outside (0, 40] L/min or a BSA
 * outside (0, 4] m².
 *
 * @example
 * ```ts
 * import { cardiacIndex, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 5 L/min over 2 m² = 2.5 L/min/m²
 * assert.equal(evaluate(cardiacIndex, { cardiacOutputLPerMin: 5, bsaM2: 2 }).outputs.cardiacIndex, 2.5);
 * ```
 */
export const cardiacIndex: Calculation<"cardiacOutputLPerMin" | "bsaM2", "cardiacIndex"> =
  defineCalculation({
    id: "cardiacIndex",
    title: "Cardiac index",
    description: "Cardiac output divided by body surface area.",
    inputs: {
      cardiacOutputLPerMin: {
        unit: "L/min",
        description: "Cardiac output",
        range: { min: 0, max: 40, minExclusive: true },
        typical: { min: 1, max: 15 },
      },
      bsaM2: {
        unit: "m^2",
        description: "Body surface area",
        range: { min: 0, max: 4, minExclusive: true },
        typical: { min: 1.2, max: 2.6 },
      },
    },
    outputs: { cardiacIndex: { unit: "L/min/m^2", description: "Cardiac index" } },
    formula: ({ cardiacOutputLPerMin, bsaM2 }) => ({ cardiacIndex: cardiacOutputLPerMin / bsaM2 }),
    formulaText: "CI = CO/BSA",
    sources: [QUINONES_2002],
    cautions: ["Indexing assumes output scales with BSA; it over-corrects in obesity"],
    clinical: true,
  });

/**
 * Pulmonary-to-systemic flow ratio (Qp/Qs) from RVOT and LVOT stroke volumes.
 *
 * Formula: Qp/Qs = SV_RVOT / SV_LVOT = (π·d_RVOT²/4 · VTI_RVOT) / (π·d_LVOT²/4 · VTI_LVOT), each
 * stroke volume from {@linkcode strokeVolume}.
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (shunt quantification).
 *
 * Throws (through `evaluate`) a RangeError for a diameter outside (0, 5] cm or a VTI outside
 * (0, 200] cm.
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
    rvotDiameterCm: {
      unit: "cm",
      description: "RVOT diameter at the pulsed-wave sample",
      range: DIAMETER_RANGE,
      typical: { min: 1.5, max: 3.5 },
    },
    rvotVtiCm: {
      unit: "cm",
      description: "RVOT pulsed-wave VTI",
      range: VTI_RANGE,
      typical: { min: 8, max: 50 },
    },
    lvotDiameterCm: {
      unit: "cm",
      description: "LVOT diameter at the pulsed-wave sample",
      range: DIAMETER_RANGE,
      typical: { min: 1.4, max: 3.0 },
    },
    lvotVtiCm: {
      unit: "cm",
      description: "LVOT pulsed-wave VTI",
      range: VTI_RANGE,
      typical: { min: 8, max: 40 },
    },
  },
  outputs: {
    qpQs: { unit: "1", description: "Pulmonary-to-systemic flow ratio" },
    pulmonaryStrokeVolumeMl: { unit: "mL", description: "RVOT stroke volume (Qp per beat)" },
    systemicStrokeVolumeMl: { unit: "mL", description: "LVOT stroke volume (Qs per beat)" },
  },
  formula: ({ rvotDiameterCm, rvotVtiCm, lvotDiameterCm, lvotVtiCm }) => {
    const qp =
      strokeVolume.formula({ diameterCm: rvotDiameterCm, vtiCm: rvotVtiCm }).strokeVolumeMl;
    const qs =
      strokeVolume.formula({ diameterCm: lvotDiameterCm, vtiCm: lvotVtiCm }).strokeVolumeMl;
    return { qpQs: qp / qs, pulmonaryStrokeVolumeMl: qp, systemicStrokeVolumeMl: qs };
  },
  formulaText: "Qp/Qs = (π·d_RVOT²/4·VTI_RVOT) / (π·d_LVOT²/4·VTI_LVOT)",
  sources: [QUINONES_2002],
  cautions: [
    "Both diameters are squared: diameter errors dominate the ratio",
    "Not valid with significant regurgitation of the pulmonary or aortic valve",
  ],
  clinical: true,
});
