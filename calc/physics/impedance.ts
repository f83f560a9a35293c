/**
 * Acoustic impedance and reflection/transmission of intensity at an interface.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import type { InlineInput } from "../core/calculation.ts";
import { BUSHBERG, KREMKAU, soundSpeedInput } from "./shared.ts";

/**
 * Characteristic acoustic impedance of a medium.
 *
 * Formula: Z [MRayl] = ρ [kg/m³] · c [m/s] / 10⁶ (1 MRayl = 10⁶ kg/(m²·s)).
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 2; Bushberg JT et
 * al. The Essential Physics of Medical Imaging, 3rd ed. 2012, ch. 14.
 *
 * Inputs: `densityKgPerM3` (kg/m³, (0, 25000]), `soundSpeedMps` (m/s, default 1540). Output:
 * `impedanceMRayl` (MRayl).
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
    densityKgPerM3: {
      unit: "kg/m^3",
      description: "Density of the medium",
      range: { min: 0, max: 25000, minExclusive: true },
    },
    soundSpeedMps: soundSpeedInput,
  },
  outputs: { impedanceMRayl: { unit: "MRayl", description: "Acoustic impedance" } },
  formula: ({ densityKgPerM3, soundSpeedMps }) => ({
    impedanceMRayl: (densityKgPerM3 * soundSpeedMps) / 1e6,
  }),
  formulaText: "Z = ρ·c",
  sources: [KREMKAU, BUSHBERG],
  cautions: [],
});

const impedanceInput = (which: string): InlineInput => ({
  unit: "MRayl",
  description: `Acoustic impedance of the ${which} medium`,
  range: { min: 0, max: 100, minExclusive: true },
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
 * Inputs: `impedance1MRayl` (MRayl, medium the wave comes from), `impedance2MRayl` (MRayl, medium
 * beyond the interface), both in (0, 100]. Outputs: `pressureReflectionCoefficient`,
 * `intensityReflectionPercent` (%), `intensityTransmissionPercent` (%).
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
    impedance1MRayl: impedanceInput("first (incident)"),
    impedance2MRayl: impedanceInput("second"),
  },
  outputs: {
    pressureReflectionCoefficient: {
      unit: "1",
      description: "Pressure amplitude reflection coefficient (negative: phase inversion)",
    },
    intensityReflectionPercent: { unit: "%", description: "Share of the intensity reflected" },
    intensityTransmissionPercent: { unit: "%", description: "Share of the intensity transmitted" },
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
  sources: [KREMKAU, BUSHBERG],
  cautions: [
    "Normal incidence on a flat, smooth interface larger than the beam; oblique and rough interfaces differ",
  ],
});
