/**
 * Acoustic impedance and reflection/transmission of intensity at an interface.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import {
  ACOUSTIC_IMPEDANCE,
  INTENSITY_REFLECTED,
  INTENSITY_TRANSMITTED,
  MEDIUM_DENSITY,
  PRESSURE_REFLECTION_COEFFICIENT,
} from "../quantities/ultrasound.ts";
import { BUSHBERG, KREMKAU } from "./citations.ts";
import { SOUND_SPEED_INPUT } from "./shared.ts";

/**
 * Characteristic acoustic impedance of a medium.
 *
 * Formula: Z [MRayl] = ρ [kg/m³] · c [m/s] / 10⁶ (1 MRayl = 10⁶ kg/(m²·s)).
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2; Bushberg JT et
 * al. The Essential Physics of Medical Imaging, 3rd ed. 2012, ch. 14.
 *
 * Inputs: `densityKgPerM3`, `soundSpeedMps` (default 1540 m/s). Output: `impedanceMRayl`.
 *
 * @throws {RangeError} (through `evaluate`) for a density or speed ≤ 0.
 *
 * @example Soft tissue: 1050 kg/m³ × 1540 m/s ≈ 1.62 MRayl
 * ```ts
 * import { acousticImpedance, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(acousticImpedance, { densityKgPerM3: 1050 });
 * assert.ok(Math.abs(r.outputs.impedanceMRayl - 1.617) < 1e-9); // hand check
 * ```
 */
export const acousticImpedance: Calculation<
  "densityKgPerM3" | "soundSpeedMps",
  "impedanceMRayl"
> = defineCalculation({
  id: "acousticImpedance",
  title: "Acoustic impedance",
  description: "Characteristic acoustic impedance of a medium from its density and speed of sound.",
  inputs: {
    densityKgPerM3: MEDIUM_DENSITY,
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: { impedanceMRayl: ACOUSTIC_IMPEDANCE },
  formula: ({ densityKgPerM3, soundSpeedMps }) => ({
    impedanceMRayl: (densityKgPerM3 * soundSpeedMps) / 1e6,
  }),
  formulaText: "Z = ρ·c",
  citations: [KREMKAU, BUSHBERG],
  cautions: [],
});

/**
 * Reflection and transmission at a flat interface hit at normal incidence.
 *
 * Formula: pressure reflection coefficient r = (Z₂ − Z₁) / (Z₂ + Z₁); intensity reflection
 * R [%] = 100 · r²; intensity transmission T [%] = 100 − R.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2 (intensity
 * reflection coefficient at normal incidence); Bushberg JT et al. The Essential Physics of Medical
 * Imaging, 3rd ed. 2012, ch. 14.
 *
 * Inputs: `impedance1MRayl` (the medium the wave comes from), `impedance2MRayl` (the medium
 * beyond the interface). Outputs: `pressureReflectionCoefficient`, `intensityReflectionPercent`,
 * `intensityTransmissionPercent`.
 *
 * @throws {RangeError} (through `evaluate`) for an impedance ≤ 0.
 *
 * @example Soft tissue to air: about 99.9 % of the intensity is reflected
 * ```ts
 * import { evaluate, interfaceReflection } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(interfaceReflection, { impedance1MRayl: 1.62, impedance2MRayl: 0.0004 });
 * assert.ok(r.outputs.intensityReflectionPercent > 99.9);
 * ```
 */
export const interfaceReflection: Calculation<
  "impedance1MRayl" | "impedance2MRayl",
  "pressureReflectionCoefficient" | "intensityReflectionPercent" | "intensityTransmissionPercent"
> = defineCalculation({
  id: "interfaceReflection",
  title: "Reflection at an interface",
  description:
    "Fraction of the intensity reflected and transmitted at a flat interface between two media at normal incidence.",
  inputs: {
    impedance1MRayl: {
      quantity: ACOUSTIC_IMPEDANCE,
      label: "First medium impedance",
      description: "Acoustic impedance of the medium the wave comes from",
    },
    impedance2MRayl: {
      quantity: ACOUSTIC_IMPEDANCE,
      label: "Second medium impedance",
      description: "Acoustic impedance of the medium beyond the interface",
    },
  },
  outputs: {
    pressureReflectionCoefficient: PRESSURE_REFLECTION_COEFFICIENT,
    intensityReflectionPercent: INTENSITY_REFLECTED,
    intensityTransmissionPercent: INTENSITY_TRANSMITTED,
  },
  formula: ({ impedance1MRayl, impedance2MRayl }) => {
    const r = (impedance2MRayl - impedance1MRayl) / (impedance2MRayl + impedance1MRayl);
    const intensityReflectionPercent = 100 * r * r;
    return {
      pressureReflectionCoefficient: r,
      intensityReflectionPercent,
      intensityTransmissionPercent: 100 - intensityReflectionPercent,
    };
  },
  formulaText: "r = (Z₂ − Z₁)/(Z₂ + Z₁); R = r²; T = 1 − R",
  citations: [KREMKAU, BUSHBERG],
  cautions: [
    "Normal incidence on a flat, smooth interface larger than the beam; oblique and rough interfaces differ",
  ],
});
