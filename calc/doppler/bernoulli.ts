/**
 * Pressure gradients from Doppler velocities: the simplified and modified Bernoulli equations.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import { BAUMGARTNER_2009, HATLE_ANGELSEN_1985 } from "./sources.ts";

/**
 * Simplified Bernoulli equation: peak instantaneous pressure gradient from a peak velocity.
 *
 * Formula: ΔP [mmHg] = 4 · v² [m/s]. The factor 4 is ½ρ for blood (ρ ≈ 1060 kg/m³) converted to
 * mmHg, with viscous and flow-acceleration terms neglected.
 *
 * Inputs: `peakVelocity` in m/s (a magnitude, [0, 10]; validated range [0, 7]).
 * Output: `gradient` in mmHg.
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed., 1985, ch. 2;
 * Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (EAE/ASE valve stenosis).
 *
 * Throws (through `evaluate`) a RangeError for a negative or non-finite velocity.
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
  inputs: {
    peakVelocity: {
      unit: "m/s",
      description: "Peak Doppler velocity through the restriction (magnitude)",
      range: { min: 0, max: 10 },
      typical: { min: 0, max: 7 },
    },
  },
  outputs: { gradient: { unit: "mmHg", description: "Peak instantaneous pressure gradient" } },
  formula: ({ peakVelocity }) => ({ gradient: 4 * peakVelocity * peakVelocity }),
  formulaText: "ΔP = 4·v²",
  sources: [HATLE_ANGELSEN_1985, BAUMGARTNER_2009],
  cautions: [
    "Neglects the proximal velocity; use the modified form when it exceeds about 1.5 m/s",
    "Velocity underestimated by a non-parallel beam is squared into the gradient",
  ],
  clinical: true,
});

/**
 * Modified (expanded) Bernoulli equation: gradient corrected for the proximal velocity.
 *
 * Formula: ΔP [mmHg] = 4 · (v₂² − v₁²), with v₂ the jet (distal) velocity and v₁ the proximal
 * (e.g. LVOT) velocity, both in m/s. Computed as the difference of two simplified-Bernoulli terms.
 *
 * Inputs: `jetVelocity` (v₂) and `proximalVelocity` (v₁), magnitudes in m/s.
 * Output: `gradient` in mmHg. A negative result means the proximal velocity exceeds the jet
 * velocity: check that the inputs are not swapped.
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23, section on pressure gradients
 * (from memory); Hatle L, Angelsen B, 1985.
 *
 * Throws (through `evaluate`) a RangeError for a negative or non-finite velocity.
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
        unit: "m/s",
        description: "Peak jet velocity through the restriction, v₂ (magnitude)",
        range: { min: 0, max: 10 },
        typical: { min: 0, max: 7 },
      },
      proximalVelocity: {
        unit: "m/s",
        description: "Peak velocity proximal to the restriction, v₁ (magnitude)",
        range: { min: 0, max: 10 },
        typical: { min: 0, max: 3 },
      },
    },
    outputs: { gradient: { unit: "mmHg", description: "Peak pressure gradient" } },
    formula: ({ jetVelocity, proximalVelocity }) => ({
      gradient: simplifiedBernoulli.formula({ peakVelocity: jetVelocity }).gradient -
        simplifiedBernoulli.formula({ peakVelocity: proximalVelocity }).gradient,
    }),
    formulaText: "ΔP = 4·(v₂² − v₁²)",
    sources: [BAUMGARTNER_2009, HATLE_ANGELSEN_1985],
    cautions: [
      "A negative gradient means the proximal velocity exceeds the jet velocity: check the inputs",
    ],
    clinical: true,
  });
