/**
 * Private building blocks shared by the ultrasound-physics calculations: the default speed of
 * sound, the common input definitions, the published sources, and the few one-line relations
 * (cos θ, the Doppler shift per unit velocity, the round-trip time) that several formulas reuse,
 * so that each relation is written exactly once.
 *
 * Not re-exported from the package except {@linkcode DEFAULT_SOUND_SPEED_MPS}.
 *
 * @module
 */
import type { InputValues, Reference } from "../core/types.ts";
import { defineArguments, type InlineInput } from "../core/calculation.ts";
import { validateInputs } from "../core/validate.ts";
import { HATLE_ANGELSEN_1985 as HATLE_ANGELSEN, QUINONES_2002 } from "../references.ts";
import cosine from "@stdlib/math-base-special-cos";

/** Shared publications, re-exported under this module's names. */
export { HATLE_ANGELSEN, QUINONES_2002 };

/**
 * Speed of sound assumed by scanners for soft tissue, in m/s (common practice).
 *
 * @example
 * ```ts
 * import { DEFAULT_SOUND_SPEED_MPS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DEFAULT_SOUND_SPEED_MPS, 1540);
 * ```
 */
export const DEFAULT_SOUND_SPEED_MPS = 1540;

/** cos θ for an angle in degrees. The one place the insonation-angle cosine is written.
 *
 * The cosine is @stdlib's JavaScript port of the FreeBSD/fdlibm routine (faithfully rounded, like
 * `Math.cos`, from which it differs by at most 1 ulp): the engine can inline it in Monte Carlo
 * and cohort loops, where it runs about 2.5 times faster than `Math.cos` (bench/analysis.md). */
export function cosDeg(angleDeg: number): number {
  return cosine((angleDeg * Math.PI) / 180);
}

/**
 * Doppler shift produced by a unit velocity, in Hz per (m/s): 2·f0·cos θ / c.
 * The Doppler equation Δf = 2·f0·v·cos θ / c is this factor times v; every Doppler calculation
 * (shift, velocity, Nyquist limit) goes through it.
 */
export function dopplerShiftPerVelocity(
  transmitFrequencyMHz: number,
  angleDeg: number,
  soundSpeedMps: number,
): number {
  return (2 * transmitFrequencyMHz * 1e6 * cosDeg(angleDeg)) / soundSpeedMps;
}

/** Pulse round-trip time to a depth, in seconds: 2·d / c (depth in cm). The PRF limit, the frame
 * time and the range-ambiguity depths all derive from it. */
export function roundTripTimeS(depthCm: number, soundSpeedMps: number): number {
  return (2 * depthCm * 1e-2) / soundSpeedMps;
}

/** Depth in cm reached by a round trip lasting `timeS` seconds: c·t / 2 (inverse of
 * {@linkcode roundTripTimeS}). */
export function depthForRoundTripCm(timeS: number, soundSpeedMps: number): number {
  return ((soundSpeedMps * timeS) / 2) * 1e2;
}

/** Speed-of-sound input, default 1540 m/s. */
export const soundSpeedInput: InlineInput = {
  unit: "m/s",
  description: "Speed of sound in the medium (scanner assumption for soft tissue: 1540 m/s)",
  range: { min: 0, max: 10000, minExclusive: true },
  typical: { min: 1400, max: 1650 },
  default: DEFAULT_SOUND_SPEED_MPS,
};

/** Transmit (carrier) frequency input in MHz. */
export const transmitFrequencyInput: InlineInput = {
  unit: "MHz",
  description: "Transmit (carrier) frequency of the probe",
  range: { min: 0, max: 100, minExclusive: true },
  typical: { min: 1, max: 15 },
};

/** Insonation angle input: between the beam and the flow direction. */
export const angleInput: InlineInput = {
  unit: "deg",
  description: "Insonation angle between the ultrasound beam and the flow direction",
  range: { min: 0, max: 90, maxExclusive: true },
  typical: { min: 0, max: 20 },
};

/** Imaging or sample depth in cm. */
export function depthInput(description: string): InlineInput {
  return {
    unit: "cm",
    description,
    range: { min: 0, max: 50, minExclusive: true },
    typical: { min: 0.5, max: 30 },
  };
}

/** Textbook of diagnostic ultrasound physics (wavelength, pulse, beam, timing, attenuation). */
export const KREMKAU: Reference = {
  authors: "Kremkau FW",
  year: 2015,
  title: "Sonography Principles and Instruments",
  publication: "9th ed. Elsevier, St Louis",
  locator: "ch. 2 (ultrasound), ch. 3 (transducers), ch. 5 (Doppler)",
};

/** Textbook of ultrasound physics and equipment (UK). */
export const HOSKINS: Reference = {
  authors: "Hoskins PR, Martin K, Thrush A",
  year: 2019,
  title: "Diagnostic Ultrasound: Physics and Equipment",
  publication: "3rd ed. CRC Press, Boca Raton",
  locator: "ch. 2 (physics), ch. 3 (transducers and beam forming), ch. 8 (Doppler)",
};

/** Standard physics text: beam and pulse formulas. */
export const SZABO: Reference = {
  authors: "Szabo TL",
  year: 2014,
  title: "Diagnostic Ultrasound Imaging: Inside Out",
  publication: "2nd ed. Academic Press, Oxford",
  locator: "ch. 6 (beams), ch. 11 (Doppler)",
};

/** Bushberg: physics tables (speed of sound, impedance, attenuation). */
export const BUSHBERG: Reference = {
  authors: "Bushberg JT, Seibert JA, Leidholdt EM Jr, Boone JM",
  year: 2012,
  title: "The Essential Physics of Medical Imaging",
  publication: "3rd ed. Lippincott Williams & Wilkins, Philadelphia",
  locator: "ch. 14 (ultrasound), tables of acoustic properties and of attenuation coefficients",
};

/**
 * Validates the arguments of a plain (multi-answer) function with the same rules and messages as
 * a defined calculation's inputs: unknown or missing keys and wrong types are TypeErrors, values
 * outside the valid range RangeErrors naming the field, the range and the value; values outside
 * the typical range become flags. Reuses `validateInputs` so the convention lives in one place.
 */
export function validateArguments<I extends string>(
  title: string,
  inputs: { readonly [K in I]: InlineInput },
  args: unknown,
): { values: InputValues<I>; flags: string[] } {
  return validateInputs(defineArguments(title, inputs), args);
}

/** Pulse repetition frequency input in Hz. */
export const prfInput: InlineInput = {
  unit: "Hz",
  description: "Pulse repetition frequency",
  range: { min: 0, max: 1e6, minExclusive: true },
  typical: { min: 100, max: 50000 },
};
