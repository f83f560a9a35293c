/**
 * Attenuation with depth and the deepest usable depth for a dynamic range.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import type { InlineInput } from "../core/calculation.ts";
import { BUSHBERG, depthInput, HOSKINS, KREMKAU, transmitFrequencyInput } from "./shared.ts";

const attenuationInput: InlineInput = {
  unit: "dB/cm/MHz",
  description:
    "Attenuation coefficient per cm and per MHz (soft-tissue rule of thumb 0.5; see the tissue table)",
  range: { min: 0, max: 50, minExclusive: true },
  typical: { min: 0.1, max: 1.5 },
  default: 0.5,
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
 * Inputs: `attenuationDbPerCmMHz` (dB/cm/MHz, (0, 50], default 0.5), `transmitFrequencyMHz` (MHz),
 * `depthCm` (cm, (0, 50]). Outputs: `oneWayLossDb` (dB), `roundTripLossDb` (dB).
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
    attenuationDbPerCmMHz: attenuationInput,
    transmitFrequencyMHz: transmitFrequencyInput,
    depthCm: depthInput("Depth of the reflector"),
  },
  outputs: {
    oneWayLossDb: { unit: "dB", description: "Attenuation from the probe to the depth" },
    roundTripLossDb: { unit: "dB", description: "Attenuation to the depth and back" },
  },
  formula: ({ attenuationDbPerCmMHz, transmitFrequencyMHz, depthCm }) => {
    const oneWayLossDb = attenuationDbPerCmMHz * transmitFrequencyMHz * depthCm;
    return { oneWayLossDb, roundTripLossDb: 2 * oneWayLossDb };
  },
  formulaText: "L₁ = α·f·d; L₂ = 2·α·f·d",
  sources: [KREMKAU, BUSHBERG],
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
 * Inputs: `dynamicRangeDb` (dB, (0, 200], typical [40, 120]), `attenuationDbPerCmMHz`
 * (dB/cm/MHz, default 0.5), `transmitFrequencyMHz` (MHz). Output: `maxDepthCm` (cm).
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
    dynamicRangeDb: {
      unit: "dB",
      description: "Dynamic range available for attenuation (transmit level to noise floor)",
      range: { min: 0, max: 200, minExclusive: true },
      typical: { min: 40, max: 120 },
    },
    attenuationDbPerCmMHz: attenuationInput,
    transmitFrequencyMHz: transmitFrequencyInput,
  },
  outputs: { maxDepthCm: { unit: "cm", description: "Deepest usable depth" } },
  formula: ({ dynamicRangeDb, attenuationDbPerCmMHz, transmitFrequencyMHz }) => ({
    maxDepthCm: dynamicRangeDb /
      attenuationLoss.formula({ attenuationDbPerCmMHz, transmitFrequencyMHz, depthCm: 1 })
        .roundTripLossDb,
  }),
  formulaText: "d_max = DR / (2·α·f)",
  sources: [KREMKAU, HOSKINS],
  cautions: [
    "Ignores reflector strength, focusing gain and time-gain compensation limits; a first-order estimate",
  ],
});
