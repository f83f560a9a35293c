/**
 * The Doppler equation and the insonation-angle correction.
 *
 * All three calculations go through one relation, the Doppler shift per unit velocity
 * k = 2·f0·cos θ / c, so the Doppler equation is written once.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import { BLOOD_VELOCITY, DOPPLER_UNDERESTIMATION } from "../quantities/flow.ts";
import {
  DOPPLER_SHIFT,
  INSONATION_ANGLE,
  NYQUIST_VELOCITY,
  PULSE_REPETITION_FREQUENCY,
  TRANSMIT_FREQUENCY,
} from "../quantities/ultrasound.ts";
import { HATLE_ANGELSEN, KREMKAU, QUINONES_2002 } from "./citations.ts";
import {
  ALIGNED_ANGLE_INPUT,
  bloodSpeedInput,
  cosDeg,
  dopplerShiftPerVelocity,
  SOUND_SPEED_INPUT,
} from "./shared.ts";

const ANGLE_CAUTION =
  "In cardiac Doppler the flow direction in three dimensions is unknown: align the beam with the flow rather than rely on an angle correction";

/**
 * Blood velocity from a measured Doppler frequency shift (the Doppler equation solved for v).
 *
 * Formula: v [m/s] = c · Δf / (2 · f0 · cos θ), with f0 in Hz (MHz × 10⁶) and c defaulting to
 * 1540 m/s. A negative shift gives a negative velocity (flow away from the probe).
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2; Kremkau FW.
 * Sonography Principles and Instruments, 9th ed. 2015, ch. 5.
 *
 * Inputs: `dopplerShiftHz`, `transmitFrequencyMHz`, `angleDeg`, `soundSpeedMps` (default
 * 1540 m/s). Output: `velocity`.
 *
 * @throws {RangeError} (through `evaluate`) for an angle ≥ 90°, a frequency ≤ 0 or another value
 * outside its valid range, naming the field and the range.
 *
 * @example A 2.6 kHz shift at 2 MHz along the beam is about 1 m/s
 * ```ts
 * import { evaluate, velocityFromDopplerShift } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(velocityFromDopplerShift, {
 *   dopplerShiftHz: "2.6 kHz",
 *   transmitFrequencyMHz: 2,
 *   angleDeg: 0,
 * });
 * // 1540 · 2600 / (2 · 2e6) = 1.001 m/s (hand check from the Doppler equation)
 * assert.ok(Math.abs(r.outputs.velocity - 1.001) < 1e-9);
 * ```
 */
export const velocityFromDopplerShift: Calculation<
  "dopplerShiftHz" | "transmitFrequencyMHz" | "angleDeg" | "soundSpeedMps",
  "velocity"
> = defineCalculation({
  id: "velocityFromDopplerShift",
  title: "Velocity from Doppler shift",
  description:
    "Velocity of the reflectors (blood) from the measured Doppler frequency shift, transmit frequency and insonation angle.",
  inputs: {
    dopplerShiftHz: DOPPLER_SHIFT,
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    angleDeg: INSONATION_ANGLE,
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: { velocity: BLOOD_VELOCITY },
  formula: ({ dopplerShiftHz, transmitFrequencyMHz, angleDeg, soundSpeedMps }) => ({
    velocity: dopplerShiftHz /
      dopplerShiftPerVelocity(transmitFrequencyMHz, angleDeg, soundSpeedMps),
  }),
  formulaText: "v = c·Δf / (2·f0·cos θ)",
  citations: [HATLE_ANGELSEN, KREMKAU],
  cautions: [
    "Velocity falls as cos θ when the beam is not aligned with the flow: about 6 % low at 20°, 13 % at 30°",
    ANGLE_CAUTION,
  ],
  clinical: true,
});

/**
 * Doppler frequency shift produced by a velocity (the Doppler equation).
 *
 * Formula: Δf [Hz] = 2 · f0 · v · cos θ / c, with f0 in Hz (MHz × 10⁶) and c defaulting to
 * 1540 m/s.
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2; Kremkau FW.
 * Sonography Principles and Instruments, 9th ed. 2015, ch. 5.
 *
 * Inputs: `velocity`, `transmitFrequencyMHz`, `angleDeg`, `soundSpeedMps` (default 1540 m/s).
 * Output: `dopplerShiftHz`.
 *
 * @throws {RangeError} (through `evaluate`) for an angle ≥ 90°, a frequency ≤ 0 or another value
 * outside its valid range.
 *
 * @example 1 m/s at 2 MHz, beam aligned: about 2.6 kHz
 * ```ts
 * import { dopplerShiftFromVelocity, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(dopplerShiftFromVelocity, { velocity: 1, transmitFrequencyMHz: 2, angleDeg: 0 });
 * // 2 · 2e6 · 1 / 1540 = 2597.4 Hz (hand check from the Doppler equation)
 * assert.ok(Math.abs(r.outputs.dopplerShiftHz - 2597.4026) < 1e-3);
 * ```
 */
export const dopplerShiftFromVelocity: Calculation<
  "velocity" | "transmitFrequencyMHz" | "angleDeg" | "soundSpeedMps",
  "dopplerShiftHz"
> = defineCalculation({
  id: "dopplerShiftFromVelocity",
  title: "Doppler shift from velocity",
  description:
    "Doppler frequency shift that a given blood velocity produces at a transmit frequency and insonation angle.",
  inputs: {
    velocity: BLOOD_VELOCITY,
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    angleDeg: INSONATION_ANGLE,
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: { dopplerShiftHz: DOPPLER_SHIFT },
  formula: ({ velocity, transmitFrequencyMHz, angleDeg, soundSpeedMps }) => ({
    dopplerShiftHz: velocity *
      dopplerShiftPerVelocity(transmitFrequencyMHz, angleDeg, soundSpeedMps),
  }),
  formulaText: "Δf = 2·f0·v·cos θ / c",
  citations: [HATLE_ANGELSEN, KREMKAU],
  cautions: [],
});

/**
 * Angle correction of a displayed velocity: the true velocity when the scanner assumed θ = 0, and
 * how much the displayed value underestimates it.
 *
 * Formula: v_true = v_measured / cos θ; underestimation [%] = 100 · (1 − cos θ).
 *
 * Source: Quiñones MA, Otto CM, Stoddard M, et al. Recommendations for quantification of Doppler
 * echocardiography. J Am Soc Echocardiogr 2002;15:167-184 (angle and its error); Hatle L,
 * Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2.
 *
 * Inputs: `measuredVelocity` (a speed, 0 to 10 m/s), `angleDeg`. Outputs: `trueVelocity`,
 * `underestimationPercent`.
 *
 * @throws {RangeError} (through `evaluate`) for an angle ≥ 90° or a negative velocity.
 *
 * @example At 20° the displayed velocity is about 6 % low
 * ```ts
 * import { angleCorrectedVelocity, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(angleCorrectedVelocity, { measuredVelocity: 4, angleDeg: 20 });
 * // 1 − cos 20° = 0.0603 (common practice: "under about 6 % below 20°")
 * assert.ok(Math.abs(r.outputs.underestimationPercent - 6.0307) < 1e-3);
 * assert.ok(Math.abs(r.outputs.trueVelocity - 4 / Math.cos(Math.PI / 9)) < 1e-12);
 * ```
 */
export const angleCorrectedVelocity: Calculation<
  "measuredVelocity" | "angleDeg",
  "trueVelocity" | "underestimationPercent"
> = defineCalculation({
  id: "angleCorrectedVelocity",
  title: "Angle-corrected velocity",
  description:
    "True flow velocity from the velocity displayed under the assumption of parallel alignment (θ = 0), and the percentage by which the display underestimates it.",
  inputs: {
    measuredVelocity: bloodSpeedInput(
      "Displayed velocity",
      "Velocity displayed by the scanner assuming the beam is parallel to the flow",
      { min: 0, max: 10 },
      "a displayed speed (magnitude), up to 10 m/s so that the corrected velocity stays possible at moderate angles",
    ),
    angleDeg: INSONATION_ANGLE,
  },
  outputs: {
    trueVelocity: {
      quantity: BLOOD_VELOCITY,
      label: "Angle-corrected velocity",
      description: "Velocity along the flow direction",
    },
    underestimationPercent: {
      quantity: DOPPLER_UNDERESTIMATION,
      label: "Velocity underestimation",
      description: "How much the displayed velocity underestimates the true velocity",
    },
  },
  formula: ({ measuredVelocity, angleDeg }) => {
    const c = cosDeg(angleDeg);
    return { trueVelocity: measuredVelocity / c, underestimationPercent: 100 * (1 - c) };
  },
  formulaText: "v_true = v / cos θ; underestimation = 100·(1 − cos θ) %",
  citations: [QUINONES_2002, HATLE_ANGELSEN],
  cautions: [
    ANGLE_CAUTION,
    "The gradient from the Bernoulli equation scales with v², so its underestimation is about twice the velocity's at small angles",
  ],
  clinical: true,
});

/**
 * Nyquist velocity limit of pulsed Doppler: the highest velocity displayed without aliasing at a
 * PRF, transmit frequency and angle.
 *
 * Formula: Nyquist shift = PRF / 2; v_N [m/s] = (PRF / 2) · c / (2 · f0 · cos θ), i.e. the
 * Doppler equation ({@linkcode velocityFromDopplerShift}) at half the PRF. A higher transmit
 * frequency lowers the limit at the same PRF.
 *
 * Source: Hatle L, Angelsen B. Doppler Ultrasound in Cardiology, 2nd ed. 1985, ch. 2 (Nyquist
 * limit); Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 5 (aliasing).
 *
 * Inputs: `prfHz`, `transmitFrequencyMHz`, `angleDeg` (default 0°), `soundSpeedMps` (default
 * 1540 m/s). Outputs: `nyquistVelocity`, `nyquistShiftHz`.
 *
 * @throws {RangeError} (through `evaluate`) for a PRF or frequency ≤ 0 or an angle ≥ 90°.
 *
 * @example 5 kHz PRF at 2 MHz: about 0.96 m/s
 * ```ts
 * import { evaluate, nyquistVelocity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(nyquistVelocity, { prfHz: 5000, transmitFrequencyMHz: 2 });
 * // 2500 · 1540 / (2 · 2e6) = 0.9625 m/s (hand check)
 * assert.ok(Math.abs(r.outputs.nyquistVelocity - 0.9625) < 1e-12);
 * ```
 */
export const nyquistVelocity: Calculation<
  "prfHz" | "transmitFrequencyMHz" | "angleDeg" | "soundSpeedMps",
  "nyquistVelocity" | "nyquistShiftHz"
> = defineCalculation({
  id: "nyquistVelocity",
  title: "Nyquist velocity limit",
  description:
    "Highest velocity pulsed Doppler displays without aliasing, from the pulse repetition frequency, transmit frequency and angle.",
  inputs: {
    prfHz: PULSE_REPETITION_FREQUENCY,
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    angleDeg: ALIGNED_ANGLE_INPUT,
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: {
    nyquistVelocity: NYQUIST_VELOCITY,
    nyquistShiftHz: {
      quantity: DOPPLER_SHIFT,
      label: "Nyquist frequency",
      description: "Highest Doppler shift sampled without aliasing: half the PRF",
    },
  },
  formula: ({ prfHz, transmitFrequencyMHz, angleDeg, soundSpeedMps }) => {
    const nyquistShiftHz = prfHz / 2;
    return {
      nyquistVelocity: velocityFromDopplerShift.formula({
        dopplerShiftHz: nyquistShiftHz,
        transmitFrequencyMHz,
        angleDeg,
        soundSpeedMps,
      }).velocity,
      nyquistShiftHz,
    };
  },
  formulaText: "v_N = (PRF/2)·c / (2·f0·cos θ)",
  citations: [HATLE_ANGELSEN, KREMKAU],
  cautions: [
    "Continuous-wave Doppler has no Nyquist limit; this applies to pulsed and colour Doppler",
  ],
});
