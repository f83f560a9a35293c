/**
 * Wavelength, period, pulse length and axial resolution.
 *
 * @module
 */
import { defineCalculation } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import { HOSKINS, KREMKAU, soundSpeedInput, transmitFrequencyInput } from "./shared.ts";

/**
 * Wavelength and period of the transmitted wave from its frequency.
 *
 * Formula: λ [mm] = c [m/s] / (f [MHz] · 1000); T [µs] = 1 / f [MHz]. Speed of sound defaults
 * to 1540 m/s.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. Elsevier 2015, ch. 2;
 * Hoskins PR, Martin K, Thrush A. Diagnostic Ultrasound: Physics and Equipment, 3rd ed. 2019, ch. 2.
 *
 * Inputs: `transmitFrequencyMHz` (MHz, (0, 100], typical [1, 15]), `soundSpeedMps` (m/s,
 * default 1540). Outputs: `wavelengthMm` (mm), `periodUs` (µs).
 *
 * @throws {RangeError} (through `evaluate`) for a frequency ≤ 0 or a speed of sound ≤ 0.
 *
 * @example λ ≈ 0.77 mm at 2 MHz in soft tissue
 * ```ts
 * import { evaluate, wavelengthAndPeriod } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: "2 MHz" });
 * assert.ok(Math.abs(r.outputs.wavelengthMm - 0.77) < 1e-12); // 1540 / 2e6 m (hand check)
 * assert.equal(r.outputs.periodUs, 0.5);
 * ```
 */
export const wavelengthAndPeriod: Calculation<
  "transmitFrequencyMHz" | "soundSpeedMps",
  "wavelengthMm" | "periodUs"
> = defineCalculation({
  id: "wavelengthAndPeriod",
  title: "Wavelength and period",
  description:
    "Wavelength in the medium and period of the transmitted wave. Structures closer together than about one wavelength are not resolved.",
  inputs: { transmitFrequencyMHz: transmitFrequencyInput, soundSpeedMps: soundSpeedInput },
  outputs: {
    wavelengthMm: { unit: "mm", description: "Wavelength in the medium" },
    periodUs: { unit: "us", description: "Period of one cycle" },
  },
  formula: ({ transmitFrequencyMHz, soundSpeedMps }) => ({
    wavelengthMm: soundSpeedMps / (transmitFrequencyMHz * 1000),
    periodUs: 1 / transmitFrequencyMHz,
  }),
  formulaText: "λ = c / f; T = 1 / f",
  sources: [KREMKAU, HOSKINS],
  cautions: [],
});

/**
 * Spatial pulse length, axial resolution and pulse duration from the number of cycles in a pulse.
 *
 * Formula: SPL [mm] = n · λ; axial resolution [mm] = SPL / 2; pulse duration [µs] = n · T, with
 * λ and T from {@linkcode wavelengthAndPeriod}.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. Elsevier 2015, ch. 2 and 3
 * (axial resolution equals half the spatial pulse length).
 *
 * Inputs: `transmitFrequencyMHz` (MHz), `cyclesPerPulse` ([0.5, 100], typical [1, 4] for
 * imaging; pulsed Doppler uses longer pulses), `soundSpeedMps` (m/s, default 1540). Outputs:
 * `spatialPulseLengthMm` (mm), `axialResolutionMm` (mm), `pulseDurationUs` (µs).
 *
 * @throws {RangeError} (through `evaluate`) for a frequency ≤ 0 or cycles outside the range.
 *
 * @example Two cycles at 5 MHz: axial resolution about 0.31 mm
 * ```ts
 * import { axialResolution, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(axialResolution, { transmitFrequencyMHz: 5, cyclesPerPulse: 2 });
 * // λ = 0.308 mm, SPL = 0.616 mm, resolution = 0.308 mm (hand check)
 * assert.ok(Math.abs(r.outputs.axialResolutionMm - 0.308) < 1e-12);
 * ```
 */
export const axialResolution: Calculation<
  "transmitFrequencyMHz" | "cyclesPerPulse" | "soundSpeedMps",
  "spatialPulseLengthMm" | "axialResolutionMm" | "pulseDurationUs"
> = defineCalculation({
  id: "axialResolution",
  title: "Axial resolution",
  description:
    "Spatial pulse length and the axial (range) resolution it allows: two reflectors along the beam are separated when they are more than half a pulse length apart.",
  inputs: {
    transmitFrequencyMHz: transmitFrequencyInput,
    cyclesPerPulse: {
      unit: "1",
      description: "Number of cycles in the transmitted pulse",
      range: { min: 0.5, max: 100 },
      typical: { min: 1, max: 4 },
    },
    soundSpeedMps: soundSpeedInput,
  },
  outputs: {
    spatialPulseLengthMm: { unit: "mm", description: "Spatial pulse length" },
    axialResolutionMm: { unit: "mm", description: "Axial resolution (half the pulse length)" },
    pulseDurationUs: { unit: "us", description: "Pulse duration" },
  },
  formula: ({ transmitFrequencyMHz, cyclesPerPulse, soundSpeedMps }) => {
    const { wavelengthMm, periodUs } = wavelengthAndPeriod.formula({
      transmitFrequencyMHz,
      soundSpeedMps,
    });
    const spatialPulseLengthMm = cyclesPerPulse * wavelengthMm;
    return {
      spatialPulseLengthMm,
      axialResolutionMm: spatialPulseLengthMm / 2,
      pulseDurationUs: cyclesPerPulse * periodUs,
    };
  },
  formulaText: "SPL = n·λ; axial resolution = SPL / 2; pulse duration = n·T",
  sources: [KREMKAU],
  cautions: [
    "The effective pulse length depends on the probe bandwidth and the receive filter; the number of cycles is an idealisation",
  ],
});
