/**
 * Right-heart pressures: right-atrial pressure from the inferior vena cava and RV systolic
 * pressure from the tricuspid regurgitant velocity.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import { simplifiedBernoulli } from "./bernoulli.ts";
import { RUDSKI_2010 } from "./sources.ts";

/**
 * Right-atrial pressure estimated from IVC diameter and its collapse with a sniff.
 *
 * Rule (Rudski et al. 2010): IVC ≤ 2.1 cm and collapse > 50 % → 3 mmHg (range 0–5);
 * IVC > 2.1 cm and collapse < 50 % → 15 mmHg (range 10–20); any other combination → 8 mmHg
 * (range 5–10).
 *
 * Source: Rudski LG, et al. J Am Soc Echocardiogr 2010;23:685-713, estimation of RA pressure.
 *
 * Throws (through `evaluate`) a RangeError for a diameter outside (0, 5] cm or a collapse outside
 * [0, 100] %.
 *
 * @example
 * ```ts
 * import { evaluate, rightAtrialPressureFromIvc } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: "18 mm", ivcCollapsePercent: 60 });
 * assert.equal(r.outputs.rapMmHg, 3);
 * ```
 */
export const rightAtrialPressureFromIvc: Calculation<
  "ivcDiameterCm" | "ivcCollapsePercent",
  "rapMmHg"
> = defineCalculation({
  id: "rightAtrialPressureFromIvc",
  title: "Right-atrial pressure from the IVC",
  description: "Estimated right-atrial pressure from IVC diameter and sniff collapse.",
  inputs: {
    ivcDiameterCm: {
      unit: "cm",
      description: "Inferior vena cava diameter near the right atrium, at end-expiration",
      range: { min: 0, max: 5, minExclusive: true },
      typical: { min: 0.5, max: 3.5 },
    },
    ivcCollapsePercent: {
      unit: "%",
      description: "Collapse of the IVC diameter with a sniff",
      range: { min: 0, max: 100 },
    },
  },
  outputs: { rapMmHg: { unit: "mmHg", description: "Estimated right-atrial pressure" } },
  formula: ({ ivcDiameterCm, ivcCollapsePercent }) => ({
    rapMmHg: ivcDiameterCm <= 2.1 && ivcCollapsePercent > 50
      ? 3
      : ivcDiameterCm > 2.1 && ivcCollapsePercent < 50
      ? 15
      : 8,
  }),
  formulaText: "RAP = 3 (IVC ≤ 2.1 cm, collapse > 50 %); 15 (> 2.1 cm, < 50 %); else 8 mmHg",
  sources: [RUDSKI_2010],
  cautions: [
    "A categorical estimate: the true pressure spans about ±2.5 to ±5 mmHg around each value",
    "Not valid in ventilated patients; young athletes may have a dilated IVC with normal pressure",
  ],
  clinical: true,
});

/**
 * Right-ventricular systolic pressure from the peak tricuspid regurgitant velocity and the
 * right-atrial pressure.
 *
 * Formula: RVSP [mmHg] = 4 · v_TR² + RAP (simplified Bernoulli from
 * {@linkcode simplifiedBernoulli}). Without pulmonary stenosis RVSP equals pulmonary artery
 * systolic pressure.
 *
 * Source: Rudski LG, et al. J Am Soc Echocardiogr 2010;23:685-713 (RVSP from TR velocity).
 *
 * Throws (through `evaluate`) a RangeError for a velocity outside [0, 7] m/s or a pressure outside
 * [0, 40] mmHg.
 *
 * @example
 * ```ts
 * import { evaluate, rvSystolicPressure } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 4·3² + 8 = 44 mmHg
 * assert.equal(evaluate(rvSystolicPressure, { trVelocity: 3, rapMmHg: 8 }).outputs.rvspMmHg, 44);
 * ```
 */
export const rvSystolicPressure: Calculation<"trVelocity" | "rapMmHg", "rvspMmHg"> =
  defineCalculation({
    id: "rvSystolicPressure",
    title: "RV systolic pressure",
    description:
      "Right-ventricular systolic pressure from the tricuspid regurgitant jet and right-atrial pressure.",
    inputs: {
      trVelocity: {
        unit: "m/s",
        description: "Peak tricuspid regurgitant velocity (magnitude)",
        range: { min: 0, max: 7 },
        typical: { min: 1.5, max: 5.5 },
      },
      rapMmHg: {
        unit: "mmHg",
        description: "Right-atrial pressure",
        range: { min: 0, max: 40 },
        typical: { min: 0, max: 20 },
      },
    },
    outputs: { rvspMmHg: { unit: "mmHg", description: "RV systolic pressure" } },
    formula: ({ trVelocity, rapMmHg }) => ({
      rvspMmHg: simplifiedBernoulli.formula({ peakVelocity: trVelocity }).gradient + rapMmHg,
    }),
    formulaText: "RVSP = 4·v_TR² + RAP",
    sources: [RUDSKI_2010],
    cautions: [
      "Severe free tricuspid regurgitation makes the Bernoulli gradient underestimate the pressure",
      "Equals pulmonary artery systolic pressure only without pulmonary stenosis or RVOT obstruction",
    ],
    clinical: true,
  });

/**
 * RV systolic pressure with the right-atrial pressure estimated from the IVC, in one calculation
 * (so that uncertainty in the IVC measurements propagates through the categorical rule).
 *
 * Formula: RVSP = 4·v_TR² + RAP(IVC, collapse), composing {@linkcode rvSystolicPressure} and
 * {@linkcode rightAtrialPressureFromIvc}.
 *
 * Source: Rudski LG, et al. J Am Soc Echocardiogr 2010;23:685-713.
 *
 * Throws (through `evaluate`) a RangeError for any input outside its range.
 *
 * @example
 * ```ts
 * import { evaluate, rvSystolicPressureFromIvc } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Dilated, non-collapsing IVC: 4·3.2² + 15 = 55.96 mmHg
 * const r = evaluate(rvSystolicPressureFromIvc, {
 *   trVelocity: 3.2, ivcDiameterCm: 2.5, ivcCollapsePercent: 20,
 * }).outputs;
 * assert.equal(r.rapMmHg, 15);
 * assert.ok(Math.abs(r.rvspMmHg - 55.96) < 1e-9);
 * ```
 */
export const rvSystolicPressureFromIvc: Calculation<
  "trVelocity" | "ivcDiameterCm" | "ivcCollapsePercent",
  "rvspMmHg" | "rapMmHg"
> = defineCalculation({
  id: "rvSystolicPressureFromIvc",
  title: "RV systolic pressure (RA pressure from the IVC)",
  description: "RV systolic pressure from the TR velocity with RA pressure estimated from the IVC.",
  inputs: {
    trVelocity: rvSystolicPressure.inputs.trVelocity,
    ivcDiameterCm: rightAtrialPressureFromIvc.inputs.ivcDiameterCm,
    ivcCollapsePercent: rightAtrialPressureFromIvc.inputs.ivcCollapsePercent,
  },
  outputs: {
    rvspMmHg: rvSystolicPressure.outputs.rvspMmHg,
    rapMmHg: rightAtrialPressureFromIvc.outputs.rapMmHg,
  },
  formula: ({ trVelocity, ivcDiameterCm, ivcCollapsePercent }) => {
    const { rapMmHg } = rightAtrialPressureFromIvc.formula({ ivcDiameterCm, ivcCollapsePercent });
    return { ...rvSystolicPressure.formula({ trVelocity, rapMmHg }), rapMmHg };
  },
  formulaText: "RVSP = 4·v_TR² + RAP(IVC diameter, collapse)",
  sources: [RUDSKI_2010],
  cautions: [...rvSystolicPressure.cautions, ...rightAtrialPressureFromIvc.cautions],
  clinical: true,
});
