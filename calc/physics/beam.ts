/**
 * Beam geometry: lateral resolution at the focus, near-field (Fresnel) length and far-field
 * divergence.
 *
 * @module
 */
import { defineCalculation } from "../core/calculation.ts";
import type { Calculation, InputConstraint } from "../core/types.ts";
import {
  APERTURE,
  BEAM_WIDTH,
  DIVERGENCE_ANGLE,
  F_NUMBER,
  NEAR_FIELD_LENGTH,
  TRANSMIT_FREQUENCY,
} from "../quantities/ultrasound.ts";
import { HOSKINS, KREMKAU, SZABO } from "./citations.ts";
import { depthInput, SOUND_SPEED_INPUT } from "./shared.ts";
import { wavelengthAndPeriod } from "./wave.ts";

/** Pulse-echo −6 dB width factor of a uniformly weighted line (one-dimensional) aperture: the
 * root of sinc²(u) = 1/2 is u = 0.4429, so the full width is 0.8859·λ·F/D. */
const LINE_APERTURE_WIDTH_FACTOR = 0.8859;

/**
 * Lateral resolution: the pulse-echo −6 dB beam width at the focus of a focused aperture.
 *
 * Formula: F# = focal depth / aperture; beam width [mm] = 0.886 · λ · F#, the pulse-echo −6 dB
 * width of a uniformly weighted line aperture (transmit and receive both focused at the same
 * depth). The common rule of thumb "lateral resolution ≈ λ · F-number" is the same to within
 * about 12 %.
 *
 * Source: Szabo TL. Diagnostic Ultrasound Imaging: Inside Out, 2nd ed. Academic Press 2014,
 * ch. 6 (focusing, pulse-echo beam width); Hoskins PR, Martin K, Thrush A. Diagnostic Ultrasound:
 * Physics and Equipment, 3rd ed. 2019, ch. 3.
 *
 * Inputs: `transmitFrequencyMHz`, `apertureMm` (width in the scan plane), `focalDepthCm`,
 * `soundSpeedMps` (default 1540 m/s). Outputs: `beamWidthMm`, `fNumber`.
 *
 * @throws {RangeError} (through `evaluate`) for a frequency, aperture or depth ≤ 0.
 *
 * @example 3 MHz, 20 mm aperture focused at 8 cm (F# = 4)
 * ```ts
 * import { evaluate, lateralResolution } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(lateralResolution, { transmitFrequencyMHz: 3, apertureMm: 20, focalDepthCm: 8 });
 * assert.equal(r.outputs.fNumber, 4);
 * // 0.8859 · (1540 / 3e3 mm) · 4 = 1.819 mm (hand check)
 * assert.ok(Math.abs(r.outputs.beamWidthMm - 1.819) < 1e-3);
 * ```
 */
export const lateralResolution: Calculation<
  "transmitFrequencyMHz" | "apertureMm" | "focalDepthCm" | "soundSpeedMps",
  "beamWidthMm" | "fNumber"
> = defineCalculation({
  id: "lateralResolution",
  title: "Lateral resolution at the focus",
  description:
    "Pulse-echo −6 dB beam width at the focus, the lateral resolution of the image there, from aperture, focal depth and wavelength.",
  inputs: {
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    apertureMm: {
      quantity: APERTURE,
      label: "Aperture width",
      description: "Active aperture width of the probe in the scan plane",
    },
    focalDepthCm: depthInput("Focal depth", "Depth of the transmit and receive focus"),
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: {
    beamWidthMm: {
      quantity: BEAM_WIDTH,
      label: "Lateral resolution at the focus",
      description: "Pulse-echo −6 dB beam width at the focus",
    },
    fNumber: F_NUMBER,
  },
  formula: ({ transmitFrequencyMHz, apertureMm, focalDepthCm, soundSpeedMps }) => {
    const { wavelengthMm } = wavelengthAndPeriod.formula({ transmitFrequencyMHz, soundSpeedMps });
    const fNumber = (focalDepthCm * 10) / apertureMm;
    return { beamWidthMm: LINE_APERTURE_WIDTH_FACTOR * wavelengthMm * fNumber, fNumber };
  },
  formulaText: "F# = z_f / D; w = 0.886·λ·F#",
  citations: [SZABO, HOSKINS],
  cautions: [
    "Beyond the focus and in the elevation direction the beam is wider; apodisation widens the main lobe further",
  ],
});

/** The Airy factor of the first zero of a uniform disc's far-field pattern (3.8317/π). */
const AIRY_FIRST_ZERO = 1.22;

/** sin θ = 1.22·λ/D needs D > 1.22·λ: a smaller disc has no far-field main lobe to measure. */
const APERTURE_ABOVE_AIRY_LIMIT: InputConstraint<
  "transmitFrequencyMHz" | "apertureMm" | "soundSpeedMps"
> = {
  inputs: ["transmitFrequencyMHz", "apertureMm", "soundSpeedMps"],
  description:
    "'apertureMm' > 1.22 wavelengths (1.22·'soundSpeedMps'/'transmitFrequencyMHz'), the smallest disc with a far-field main lobe",
  holds: ({ transmitFrequencyMHz, apertureMm, soundSpeedMps }) =>
    apertureMm >
      AIRY_FIRST_ZERO *
        wavelengthAndPeriod.formula({ transmitFrequencyMHz, soundSpeedMps }).wavelengthMm,
};

/**
 * Near-field (Fresnel zone) length and far-field divergence of an unfocused circular aperture.
 *
 * Formula: N [cm] = D² / (4·λ); far-field divergence half-angle θ = asin(1.22·λ / D) (first zero
 * of the Airy pattern).
 *
 * Source: Kremkau FW. Sonography Principles and Instruments, 9th ed. 2015, ch. 3 (near-zone
 * length, divergence); Szabo TL. Diagnostic Ultrasound Imaging: Inside Out, 2nd ed. 2014, ch. 6.
 *
 * Inputs: `transmitFrequencyMHz`, `apertureMm` (disc diameter), `soundSpeedMps` (default
 * 1540 m/s). Outputs: `nearFieldLengthCm`, `divergenceHalfAngleDeg`.
 *
 * @throws {RangeError} (through `evaluate`) for a frequency or aperture ≤ 0, or when the aperture
 * is not larger than 1.22 wavelengths (no far-field main lobe: no divergence angle exists), for
 * instance a 10 mm disc at 0.049 MHz.
 *
 * @example A 10 mm disc at 5 MHz: near field about 8.1 cm
 * ```ts
 * import { evaluate, nearFieldLength } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(nearFieldLength, { transmitFrequencyMHz: 5, apertureMm: 10 });
 * // 10² / (4 · 0.308) mm = 81.17 mm (hand check)
 * assert.ok(Math.abs(r.outputs.nearFieldLengthCm - 8.117) < 1e-3);
 * ```
 */
export const nearFieldLength: Calculation<
  "transmitFrequencyMHz" | "apertureMm" | "soundSpeedMps",
  "nearFieldLengthCm" | "divergenceHalfAngleDeg"
> = defineCalculation({
  id: "nearFieldLength",
  title: "Near-field length and far-field divergence",
  description:
    "Length of the near field (Fresnel zone) of an unfocused circular aperture, and the half-angle at which the beam spreads beyond it.",
  inputs: {
    transmitFrequencyMHz: TRANSMIT_FREQUENCY,
    apertureMm: {
      quantity: APERTURE,
      label: "Aperture diameter",
      description: "Diameter of the (unfocused, circular) aperture",
    },
    soundSpeedMps: SOUND_SPEED_INPUT,
  },
  outputs: { nearFieldLengthCm: NEAR_FIELD_LENGTH, divergenceHalfAngleDeg: DIVERGENCE_ANGLE },
  formula: ({ transmitFrequencyMHz, apertureMm, soundSpeedMps }) => {
    const { wavelengthMm } = wavelengthAndPeriod.formula({ transmitFrequencyMHz, soundSpeedMps });
    return {
      nearFieldLengthCm: apertureMm ** 2 / (4 * wavelengthMm) / 10,
      divergenceHalfAngleDeg: (Math.asin((AIRY_FIRST_ZERO * wavelengthMm) / apertureMm) * 180) /
        Math.PI,
    };
  },
  constraints: [APERTURE_ABOVE_AIRY_LIMIT],
  formulaText: "N = D² / (4λ); sin θ = 1.22·λ / D",
  citations: [{ ...KREMKAU, locator: "ch. 3 (near-zone length and far-zone divergence)" }, SZABO],
  cautions: [
    "Applies to an unfocused disc with D much larger than λ; focused and array probes have their own beam shapes",
  ],
});
