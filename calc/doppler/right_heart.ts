/**
 * Right-heart pressures: right-atrial pressure from the inferior vena cava and RV systolic
 * pressure from the tricuspid regurgitant velocity.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import { chain } from "../core/chain.ts";
import type { Calculation } from "../core/types.ts";
import {
  IVC_COLLAPSE,
  IVC_DIAMETER,
  RIGHT_ATRIAL_PRESSURE,
  RV_SYSTOLIC_PRESSURE,
  TR_PEAK_VELOCITY,
} from "../quantities/flow.ts";
import { simplifiedBernoulli } from "./bernoulli.ts";
import { RUDSKI_2010 } from "./citations.ts";

/**
 * Right-atrial pressure estimated from IVC diameter and its collapse with a sniff.
 *
 * Rule (Rudski et al. 2010): IVC ≤ 2.1 cm and collapse > 50 % → 3 mmHg (range 0–5);
 * IVC > 2.1 cm and collapse < 50 % → 15 mmHg (range 10–20); any other combination → 8 mmHg
 * (range 5–10).
 *
 * Source: Rudski LG, et al. J Am Soc Echocardiogr 2010;23:685-713, estimation of RA pressure.
 *
 * @throws {RangeError} (through `evaluate`) for a diameter or collapse outside its valid range.
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
  inputs: { ivcDiameterCm: IVC_DIAMETER, ivcCollapsePercent: IVC_COLLAPSE },
  outputs: {
    rapMmHg: { quantity: RIGHT_ATRIAL_PRESSURE, description: "Estimated right-atrial pressure" },
  },
  formula: ({ ivcDiameterCm, ivcCollapsePercent }) => ({
    rapMmHg: ivcDiameterCm <= 2.1 && ivcCollapsePercent > 50
      ? 3
      : ivcDiameterCm > 2.1 && ivcCollapsePercent < 50
      ? 15
      : 8,
  }),
  formulaText: "RAP = 3 (IVC ≤ 2.1 cm, collapse > 50 %); 15 (> 2.1 cm, < 50 %); else 8 mmHg",
  citations: [RUDSKI_2010],
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
 * @throws {RangeError} (through `evaluate`) for a velocity or pressure outside its valid range.
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
    inputs: { trVelocity: TR_PEAK_VELOCITY, rapMmHg: RIGHT_ATRIAL_PRESSURE },
    outputs: { rvspMmHg: RV_SYSTOLIC_PRESSURE },
    formula: ({ trVelocity, rapMmHg }) => ({
      rvspMmHg: simplifiedBernoulli.formula({ peakVelocity: trVelocity }).gradient + rapMmHg,
    }),
    formulaText: "RVSP = 4·v_TR² + RAP",
    citations: [RUDSKI_2010],
    cautions: [
      "Severe free tricuspid regurgitation makes the Bernoulli gradient underestimate the pressure",
      "Equals pulmonary artery systolic pressure only without pulmonary stenosis or RVOT obstruction",
    ],
    clinical: true,
  });

/**
 * RV systolic pressure with the right-atrial pressure estimated from the IVC, as one chain (so
 * that uncertainty in the IVC measurements propagates through the categorical rule: Monte Carlo
 * sees the jump between 3, 8 and 15 mmHg, the GUM law sees a zero slope and says so).
 *
 * Formula: RAP = rule(IVC diameter, collapse) ({@linkcode rightAtrialPressureFromIvc}), then
 * RVSP = 4·v_TR² + RAP ({@linkcode rvSystolicPressure}), chained with `chain`.
 *
 * Source: Rudski LG, et al. J Am Soc Echocardiogr 2010;23:685-713.
 *
 * @throws {RangeError} (through `evaluate`) for any input outside its valid range.
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
> = chain([rightAtrialPressureFromIvc, rvSystolicPressure], {
  id: "rvSystolicPressureFromIvc",
  title: "RV systolic pressure (RA pressure from the IVC)",
  description: "RV systolic pressure from the TR velocity with RA pressure estimated from the IVC.",
  outputs: ["rvspMmHg", "rapMmHg"],
});
