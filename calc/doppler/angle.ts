/**
 * Effect of the insonation angle on Doppler velocity, gradient and continuity valve area.
 *
 * The cos θ correction itself is defined once in the physics module
 * ({@linkcode angleCorrectedVelocity}); these calculations compose it with the Bernoulli and
 * continuity equations. The angle here is signed (−90°, 90°): the sign only says on which side of
 * the flow the beam lies, which lets an uncertain angle centred on 0° (e.g. normal(0, 10)) be
 * propagated without out-of-range draws.
 *
 * @module
 */
import { defineCalculation, type InputRole } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import {
  AORTIC_VALVE_AREA,
  DOPPLER_UNDERESTIMATION,
  PEAK_GRADIENT,
  PEAK_VELOCITY,
  VALVE_AREA_ERROR,
} from "../quantities/flow.ts";
import { SIGNED_INSONATION_ANGLE } from "../quantities/ultrasound.ts";
import { angleCorrectedVelocity } from "../physics/doppler.ts";
import { simplifiedBernoulli } from "./bernoulli.ts";
import { continuityValveAreaPeakVelocity } from "./valve_area.ts";
import { BAUMGARTNER_2009, HATLE_ANGELSEN_1985 } from "./citations.ts";
import { relativeChangePercent } from "../core/relative_change.ts";

// Why these two are compositions, not chains (`chain`):
// - both need the angle signed, with a default of 0°, so that an angle uncertain around 0°
//   propagates without impossible draws; the physics angle correction takes an unsigned angle, and
//   a chain takes each input's range from the step that reads it;
// - both report shortfalls that compare two results of one step (displayed against true gradient,
//   aligned against corrected area), which a chain could only give through one-off calculations;
// - in the continuity area, the displayed LVOT and jet velocities feed both the aligned area (as the
//   LVOT and aortic-jet velocity quantities, distinct so that one table can hold both) and the angle
//   correction (one generic velocity): a chain names each input once, with one quantity, and
//   refuses that.
// The compositions call each step's own formula, so nothing is written twice.

/** The cos θ correction, computed by the physics module's single definition. */
function trueVelocityAt(measuredVelocity: number, angleDeg: number): number {
  return angleCorrectedVelocity.formula({ measuredVelocity, angleDeg }).trueVelocity;
}

function signedAngle(label: string, description: string): InputRole {
  return { quantity: SIGNED_INSONATION_ANGLE, label, description, default: 0 };
}

/**
 * How an insonation angle θ biases a Doppler velocity and the Bernoulli gradient built on it.
 *
 * Formula: v_true = v_measured / cos θ (from {@linkcode angleCorrectedVelocity});
 * ΔP = 4·v² for both velocities (from {@linkcode simplifiedBernoulli});
 * velocity underestimation = −100·(v_measured − v_true)/v_true % = 100·(1 − cos θ) %;
 * gradient underestimation = −100·(ΔP_measured − ΔP_true)/ΔP_true % = 100·(1 − cos²θ) %
 * (the package's one relative change, {@linkcode relativeChangePercent}, relative to the true
 * value: 3.02 % for the gradient at 10°).
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 1985 (angle dependence);
 * Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (alignment of the CW beam).
 *
 * @throws {RangeError} (through `evaluate`) for a velocity or angle outside its valid range, or an
 * angle so steep that the true velocity exceeds any blood velocity.
 *
 * @example
 * ```ts
 * import { evaluate, insonationAngleEffect } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // At 60° the display shows half the velocity and a quarter of the gradient
 * const r = evaluate(insonationAngleEffect, { measuredVelocity: 2, angleDeg: 60 }).outputs;
 * assert.ok(Math.abs(r.trueVelocity - 4) < 1e-12);
 * assert.ok(Math.abs(r.trueGradient - 64) < 1e-9);
 * assert.ok(Math.abs(r.gradientUnderestimationPercent - 75) < 1e-9);
 * ```
 */
export const insonationAngleEffect: Calculation<
  "measuredVelocity" | "angleDeg",
  | "trueVelocity"
  | "velocityUnderestimationPercent"
  | "measuredGradient"
  | "trueGradient"
  | "gradientUnderestimationPercent"
> = defineCalculation({
  id: "insonationAngleEffect",
  title: "Insonation angle effect on velocity and gradient",
  description:
    "True velocity and gradient behind a Doppler reading taken at an angle to the flow, and how much the reading underestimates each.",
  inputs: {
    measuredVelocity: {
      quantity: PEAK_VELOCITY,
      label: "Displayed velocity",
      description: "Velocity displayed assuming the beam is parallel to the flow",
      valid: { min: 0, max: 10, minExclusive: true },
      typical: { min: 0.2, max: 7 },
      reason:
        "the shortfalls are relative to the true velocity, which a zero reading leaves undefined",
    },
    angleDeg: signedAngle(
      SIGNED_INSONATION_ANGLE.label,
      "Angle between the beam and the flow (signed; 0 = parallel)",
    ),
  },
  outputs: {
    trueVelocity: {
      quantity: PEAK_VELOCITY,
      label: "True velocity",
      description: "Velocity along the flow",
    },
    velocityUnderestimationPercent: {
      quantity: DOPPLER_UNDERESTIMATION,
      label: "Velocity underestimation relative to the true velocity",
      description: "Shortfall of the displayed velocity relative to the true velocity",
    },
    measuredGradient: {
      quantity: PEAK_GRADIENT,
      label: "Gradient from the displayed velocity",
    },
    trueGradient: {
      quantity: PEAK_GRADIENT,
      label: "True gradient",
      description: "Gradient from the true velocity",
    },
    gradientUnderestimationPercent: {
      quantity: DOPPLER_UNDERESTIMATION,
      label: "Gradient underestimation relative to the true gradient",
      description: "Shortfall of the displayed gradient relative to the true gradient",
    },
  },
  formula: ({ measuredVelocity, angleDeg }) => {
    const trueVelocity = trueVelocityAt(measuredVelocity, angleDeg);
    const measuredGradient =
      simplifiedBernoulli.formula({ peakVelocity: measuredVelocity }).gradient;
    const trueGradient = simplifiedBernoulli.formula({ peakVelocity: trueVelocity }).gradient;
    return {
      trueVelocity,
      // 0 − x: a reading at 0° shows 0, never −0
      velocityUnderestimationPercent: 0 - relativeChangePercent(measuredVelocity, trueVelocity),
      measuredGradient,
      trueGradient,
      gradientUnderestimationPercent: 0 - relativeChangePercent(measuredGradient, trueGradient),
    };
  },
  formulaText:
    "v_true = v/cos θ; ΔP = 4·v²; shortfalls 100·(1 − v/v_true) % and 100·(1 − ΔP/ΔP_true) %",
  citations: [HATLE_ANGELSEN_1985, BAUMGARTNER_2009],
  cautions: [...angleCorrectedVelocity.cautions],
  clinical: true,
});

/**
 * Continuity aortic valve area (peak-velocity form) with the LVOT and aortic-jet velocities
 * corrected for their insonation angles.
 *
 * Formula: AVA = π·d²/4 · (V_LVOT/cos θ_LVOT) / (V_AV/cos θ_AV) (angle correction from
 * {@linkcode angleCorrectedVelocity}, area from {@linkcode continuityValveAreaPeakVelocity});
 * `avaAssumingAlignmentCm2` is the same with both angles 0, and `areaOverestimationPercent` =
 * 100·(AVA_aligned − AVA)/AVA (relative to the angle-corrected area,
 * {@linkcode relativeChangePercent}).
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (continuity equation; a
 * misaligned jet underestimates velocity and overestimates the area).
 *
 * @throws {RangeError} (through `evaluate`) for a diameter, velocity or angle outside its valid
 * range.
 *
 * @example
 * ```ts
 * import { continuityValveAreaWithAngles, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // A 60° jet angle halves the jet velocity: the naive area is twice the true one
 * const r = evaluate(continuityValveAreaWithAngles, {
 *   lvotDiameterCm: 2, lvotPeakVelocity: 1, avPeakVelocity: 2.5, avAngleDeg: 60,
 * }).outputs;
 * assert.ok(Math.abs(r.avaCm2 - 0.2 * Math.PI) < 1e-12);
 * assert.ok(Math.abs(r.areaOverestimationPercent - 100) < 1e-9);
 * ```
 */
export const continuityValveAreaWithAngles: Calculation<
  "lvotDiameterCm" | "lvotPeakVelocity" | "lvotAngleDeg" | "avPeakVelocity" | "avAngleDeg",
  "avaCm2" | "avaAssumingAlignmentCm2" | "areaOverestimationPercent"
> = defineCalculation({
  id: "continuityValveAreaWithAngles",
  title: "Continuity valve area with insonation angles",
  description:
    "Continuity aortic valve area (peak-velocity form) with both velocities corrected for their beam angles.",
  inputs: {
    lvotDiameterCm: continuityValveAreaPeakVelocity.inputs.lvotDiameterCm,
    lvotPeakVelocity: continuityValveAreaPeakVelocity.inputs.lvotPeakVelocity,
    lvotAngleDeg: signedAngle(
      "LVOT beam angle",
      "Angle between the pulsed-wave beam and LVOT flow (signed)",
    ),
    avPeakVelocity: continuityValveAreaPeakVelocity.inputs.avPeakVelocity,
    avAngleDeg: signedAngle(
      "Aortic jet beam angle",
      "Angle between the continuous-wave beam and the aortic jet (signed)",
    ),
  },
  outputs: {
    avaCm2: {
      quantity: AORTIC_VALVE_AREA,
      description: "Aortic valve area from angle-corrected velocities",
    },
    avaAssumingAlignmentCm2: {
      quantity: AORTIC_VALVE_AREA,
      label: "Aortic valve area assuming alignment",
      description: "Aortic valve area assuming both beams are parallel to flow",
    },
    areaOverestimationPercent: {
      quantity: VALVE_AREA_ERROR,
      label: "Valve-area overestimation relative to the angle-corrected area",
      description: "Excess of the aligned-assumption area over the angle-corrected area",
    },
  },
  formula: ({ lvotDiameterCm, lvotPeakVelocity, lvotAngleDeg, avPeakVelocity, avAngleDeg }) => {
    const avaAssumingAlignmentCm2 = continuityValveAreaPeakVelocity.formula({
      lvotDiameterCm,
      lvotPeakVelocity,
      avPeakVelocity,
    }).avaCm2;
    const avaCm2 = continuityValveAreaPeakVelocity.formula({
      lvotDiameterCm,
      lvotPeakVelocity: trueVelocityAt(lvotPeakVelocity, lvotAngleDeg),
      avPeakVelocity: trueVelocityAt(avPeakVelocity, avAngleDeg),
    }).avaCm2;
    return {
      avaCm2,
      avaAssumingAlignmentCm2,
      areaOverestimationPercent: relativeChangePercent(avaAssumingAlignmentCm2, avaCm2),
    };
  },
  formulaText: "AVA = π·d²/4 · (V_LVOT/cos θ_LVOT)/(V_AV/cos θ_AV)",
  citations: [BAUMGARTNER_2009],
  cautions: [...continuityValveAreaPeakVelocity.cautions, ...angleCorrectedVelocity.cautions],
  clinical: true,
});
