/**
 * Pressure gradients from Doppler velocities: the simplified and modified Bernoulli equations.
 *
 * @module
 */
import { defineCalculation, notAbove } from "../core/calculation.ts";
import type { Calculation, Citation } from "../core/types.ts";
import { PEAK_GRADIENT, PEAK_VELOCITY } from "../quantities/flow.ts";
import { BAUMGARTNER_2009, HATLE_ANGELSEN_1985 } from "./citations.ts";

/**
 * Simplified Bernoulli equation: peak instantaneous pressure gradient from a peak velocity.
 *
 * Formula: ΔP [mmHg] = 4 · v² [m/s]. The factor 4 is ½ρ for blood (ρ ≈ 1060 kg/m³) converted to
 * mmHg, with viscous and flow-acceleration terms neglected.
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed., 1985;
 * Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (EAE/ASE valve stenosis).
 *
 * @throws {RangeError} (through `evaluate`) for a negative or non-finite velocity.
 *
 * @example
 * ```ts
 * import { evaluate, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: "4 m/s" }).outputs.gradient, 64);
 * ```
 */
export const simplifiedBernoulli: Calculation<"peakVelocity", "gradient"> = defineCalculation({
  id: "simplifiedBernoulli",
  title: "Simplified Bernoulli gradient",
  description: "Peak instantaneous pressure gradient across a restriction from the peak velocity.",
  inputs: { peakVelocity: PEAK_VELOCITY },
  outputs: { gradient: PEAK_GRADIENT },
  formula: ({ peakVelocity }) => ({ gradient: 4 * peakVelocity * peakVelocity }),
  formulaText: "ΔP = 4·v²",
  citations: [HATLE_ANGELSEN_1985, BAUMGARTNER_2009],
  cautions: [
    "Neglects the proximal velocity; use the modified form when it exceeds about 1.5 m/s",
    "Velocity underestimated by a non-parallel beam is squared into the gradient",
  ],
  clinical: true,
});

const MODIFIED_BERNOULLI_CITATIONS: readonly Citation[] = [
  { ...BAUMGARTNER_2009, locator: "pressure gradients, modified Bernoulli equation (from memory)" },
  HATLE_ANGELSEN_1985,
];

/**
 * Modified (expanded) Bernoulli equation: gradient corrected for the proximal velocity.
 *
 * Formula: ΔP [mmHg] = 4 · (v₂² − v₁²), with v₂ the jet (distal) velocity and v₁ the proximal
 * (e.g. LVOT) velocity, both in m/s. Computed as the difference of two simplified-Bernoulli terms.
 * The proximal velocity must not exceed the jet velocity (swapped inputs are refused).
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23, section on pressure gradients
 * (from memory); Hatle L, Angelsen B, 1985.
 *
 * @throws {RangeError} (through `evaluate`) for a negative or non-finite velocity, or a proximal
 * velocity above the jet velocity.
 *
 * @example
 * ```ts
 * import { evaluate, modifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 4·(4² − 1.5²) = 64 − 9 = 55 mmHg
 * const r = evaluate(modifiedBernoulli, { jetVelocity: 4, proximalVelocity: "150 cm/s" });
 * assert.ok(Math.abs(r.outputs.gradient - 55) < 1e-12);
 * ```
 */
export const modifiedBernoulli: Calculation<"jetVelocity" | "proximalVelocity", "gradient"> =
  defineCalculation({
    id: "modifiedBernoulli",
    title: "Modified Bernoulli gradient",
    description:
      "Peak pressure gradient across a restriction corrected for the velocity proximal to it.",
    inputs: {
      jetVelocity: {
        quantity: PEAK_VELOCITY,
        label: "Jet velocity",
        description: "Peak jet velocity through the restriction, v₂ (magnitude)",
      },
      proximalVelocity: {
        quantity: PEAK_VELOCITY,
        label: "Proximal velocity",
        description: "Peak velocity proximal to the restriction, v₁ (magnitude)",
        typical: { min: 0, max: 3 },
        reason: "flow proximal to a restriction (LVOT, RVOT) rarely exceeds 3 m/s",
      },
    },
    outputs: {
      gradient: {
        quantity: PEAK_GRADIENT,
        description: "Peak pressure gradient corrected for the proximal velocity",
      },
    },
    formula: ({ jetVelocity, proximalVelocity }) => ({
      gradient: simplifiedBernoulli.formula({ peakVelocity: jetVelocity }).gradient -
        simplifiedBernoulli.formula({ peakVelocity: proximalVelocity }).gradient,
    }),
    formulaText: "ΔP = 4·(v₂² − v₁²)",
    citations: MODIFIED_BERNOULLI_CITATIONS,
    cautions: [
      "The proximal velocity must be sampled just below the restriction, on the same beat",
    ],
    constraints: [notAbove("proximalVelocity", "jetVelocity")],
    clinical: true,
  });
