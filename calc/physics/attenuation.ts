/**
 * Attenuation with depth and the deepest usable depth for a dynamic range.
 *
 * @module
 */
import { defineCalculation, type InputRole } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import {
  ATTENUATION_COEFFICIENT,
  ATTENUATION_LOSS,
  DYNAMIC_RANGE,
  PENETRATION_DEPTH,
  TRANSMIT_FREQUENCY,
} from "../quantities/ultrasound.ts";
import { BUSHBERG, HOSKINS, KREMKAU } from "./citations.ts";
import { depthInput } from "./shared.ts";

/**
 * Attenuation coefficient of average soft tissue, the textbook rule of thumb, dB/cm/MHz (Kremkau
 * 2015 ch. 2; common practice). The default of every attenuation input.
 *
 * @example Penetration at 3 MHz with the default coefficient
 * ```ts
 * import { evaluate, penetrationDepth, SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(penetrationDepth, { dynamicRangeDb: 60, transmitFrequencyMHz: 3 });
 * assert.equal(r.inputs.attenuationDbPerCmMHz, SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ);
 * assert.ok(Math.abs(r.outputs.maxDepthCm - 20) < 1e-12); // 60 / (2 · 0.5 · 3)
 * ```
 */
export const SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ = 0.5;

const ATTENUATION_INPUT: InputRole = {
  quantity: ATTENUATION_COEFFICIENT,
  description:
    "Attenuation coefficient per cm and per MHz (soft-tissue rule of thumb 0.5; see the tissue table)",
  default: SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ,
};

/**
 * Attenuation loss of an ultrasound pulse over a depth, one way and round trip, assuming the
 * attenuation coefficient grows in proportion to frequency.
 *
 * Formula: one-way loss [dB] = α [dB/cm/MHz] · f [MHz] · d [cm]; round-trip loss = 2 × one-way.
 * α defaults to 0.5 dB/cm/MHz (soft tissue).
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2 (attenuation
 * coefficient ≈ 0.5 dB/cm per MHz in soft tissue); Bushberg JT et al. The Essential Physics of
 * Medical Imaging, 3rd ed. 2012, ch. 14.
 *
 * Inputs: `attenuationDbPerCmMHz` (default 0.5 dB/cm/MHz), `transmitFrequencyMHz`, `depthCm`.
 * Outputs: `oneWayLossDb`, `roundTripLossDb`.
 *
 * @throws {RangeError} (through `evaluate`) for a coefficient, frequency or depth ≤ 0.
 *
 * @example Half-intensity depth: 3 dB one way at 6/f cm in soft tissue
 * ```ts
 * import { attenuationLoss, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(attenuationLoss, { transmitFrequencyMHz: 3, depthCm: 2 });
 * assert.ok(Math.abs(r.outputs.oneWayLossDb - 3) < 1e-12); // 0.5 · 3 · 2 (hand check)
 * assert.ok(Math.abs(r.outputs.roundTripLossDb - 6) < 1e-12);
 * ```
 */
export const attenuationLoss: Calculation<
  "attenuationDbPerCmMHz" | "transmitFrequencyMHz" | "depthCm",
  "oneWayLossDb" | "roundTripLossDb"
> = defineCalculation({
  id: "attenuationLoss",
  title: "Attenuation loss",
  description:
    "Loss of pulse amplitude with depth, one way and for the round trip to a reflector and back.",
  inputs: {
    attenuationDbPerCmMHz: ATTENUATION_INPUT,
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    depthCm: depthInput("Reflector depth", "Depth of the reflector"),
  },
  outputs: {
    oneWayLossDb: {
      quantity: ATTENUATION_LOSS,
      label: "One-way attenuation",
      description: "Attenuation from the probe to the depth",
    },
    roundTripLossDb: {
      quantity: ATTENUATION_LOSS,
      label: "Round-trip attenuation",
      description: "Attenuation to the depth and back",
    },
  },
  formula: ({ attenuationDbPerCmMHz, transmitFrequencyMHz, depthCm }) => {
    const oneWayLossDb = attenuationDbPerCmMHz * transmitFrequencyMHz * depthCm;
    return { oneWayLossDb, roundTripLossDb: 2 * oneWayLossDb };
  },
  formulaText: "L₁ = α·f·d; L₂ = 2·α·f·d",
  citations: [KREMKAU, BUSHBERG],
  cautions: [
    "Assumes attenuation proportional to frequency; in water and blood it rises faster (about as f² in water)",
  ],
});

/**
 * Deepest usable depth (penetration): the depth at which the round-trip attenuation uses up the
 * available dynamic range of the system.
 *
 * Formula: d_max [cm] = DR [dB] / (2 · α · f), i.e. the dynamic range divided by the round-trip
 * loss per cm from {@linkcode attenuationLoss}.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2 (attenuation,
 * imaging depth); Hoskins PR, Martin K, Thrush A. Diagnostic Ultrasound, 3rd ed. 2019, ch. 2.
 *
 * Inputs: `dynamicRangeDb`, `attenuationDbPerCmMHz` (default 0.5 dB/cm/MHz),
 * `transmitFrequencyMHz`. Output: `maxDepthCm`.
 *
 * @throws {RangeError} (through `evaluate`) for a dynamic range, coefficient or frequency ≤ 0.
 *
 * @example 60 dB at 3 MHz in soft tissue: 20 cm
 * ```ts
 * import { evaluate, penetrationDepth } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(penetrationDepth, { dynamicRangeDb: 60, transmitFrequencyMHz: 3 });
 * assert.ok(Math.abs(r.outputs.maxDepthCm - 20) < 1e-12); // 60 / (2 · 0.5 · 3) (hand check)
 * ```
 */
export const penetrationDepth: Calculation<
  "dynamicRangeDb" | "attenuationDbPerCmMHz" | "transmitFrequencyMHz",
  "maxDepthCm"
> = defineCalculation({
  id: "penetrationDepth",
  title: "Penetration depth",
  description:
    "Deepest depth from which echoes still return within the system's dynamic range, given the tissue attenuation and transmit frequency.",
  inputs: {
    dynamicRangeDb: DYNAMIC_RANGE,
    attenuationDbPerCmMHz: ATTENUATION_INPUT,
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
  },
  outputs: { maxDepthCm: PENETRATION_DEPTH },
  formula: ({ dynamicRangeDb, attenuationDbPerCmMHz, transmitFrequencyMHz }) => ({
    maxDepthCm: dynamicRangeDb /
      attenuationLoss.formula({ attenuationDbPerCmMHz, transmitFrequencyMHz, depthCm: 1 })
        .roundTripLossDb,
  }),
  formulaText: "d_max = DR / (2·α·f)",
  citations: [KREMKAU, HOSKINS],
  cautions: [
    "Ignores reflector strength, focusing gain and time-gain compensation limits; a first-order estimate",
  ],
});
