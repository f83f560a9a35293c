/**
 * Wavelength, period, pulse length and axial resolution.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import {
  AXIAL_RESOLUTION,
  CYCLES_PER_PULSE,
  PULSE_DURATION,
  SPATIAL_PULSE_LENGTH,
  TRANSMIT_FREQUENCY,
  WAVE_PERIOD,
  WAVELENGTH,
} from "../quantities/ultrasound.ts";
import { HOSKINS, KREMKAU } from "./citations.ts";
import { SOUND_SPEED_INPUT } from "./shared.ts";

/**
 * Wavelength and period of the transmitted wave from its frequency.
 *
 * Formula: λ [mm] = c [m/s] / (f [MHz] · 1000); T [µs] = 1 / f [MHz]. Speed of sound defaults
 * to 1540 m/s.
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. Elsevier 2015, ch. 2;
 * Hoskins PR, Martin K, Thrush A. Diagnostic Ultrasound: Physics and Equipment, 3rd ed. 2019, ch. 2.
 *
 * Inputs: `transmitFrequencyMHz`, `soundSpeedMps` (default 1540 m/s). Outputs: `wavelengthMm`,
 * `periodUs`.
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
  inputs: { transmitFrequencyMHz: TRANSMIT_FREQUENCY, soundSpeedMps: SOUND_SPEED_INPUT },
  outputs: { wavelengthMm: WAVELENGTH, periodUs: WAVE_PERIOD },
  formula: ({ transmitFrequencyMHz, soundSpeedMps }) => ({
    wavelengthMm: soundSpeedMps / (transmitFrequencyMHz * 1000),
    periodUs: 1 / transmitFrequencyMHz,
  }),
  formulaText: "λ = c / f; T = 1 / f",
  citations: [KREMKAU, HOSKINS],
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
 * Inputs: `transmitFrequencyMHz`, `cyclesPerPulse` (typical 1 to 4 for imaging; pulsed Doppler
 * uses longer pulses and is flagged), `soundSpeedMps` (default 1540 m/s). Outputs:
 * `spatialPulseLengthMm`, `axialResolutionMm`, `pulseDurationUs`.
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
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    cyclesPerPulse: {
      quantity: CYCLES_PER_PULSE,
      typical: { min: 1, max: 4 },
      reason: "imaging pulses are 1 to 4 cycles long; a longer (Doppler) pulse is flagged",
    },
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: {
    spatialPulseLengthMm: SPATIAL_PULSE_LENGTH,
    axialResolutionMm: AXIAL_RESOLUTION,
    pulseDurationUs: PULSE_DURATION,
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
  citations: [KREMKAU],
  cautions: [
    "The effective pulse length depends on the probe bandwidth and the receive filter; the number of cycles is an idealisation",
  ],
});
