/**
 * Private building blocks shared by the ultrasound-physics calculations: the default speed of
 * sound, the inputs several calculations take (roles of the shared quantities), the few one-line
 * relations (cos θ, the Doppler shift per unit velocity, the round-trip time) that several
 * formulas reuse, so that each relation is written exactly once, and the validation of the plain
 * functions' arguments through the one validator.
 *
 * Not re-exported from the package except {@linkcode DEFAULT_SOUND_SPEED_MPS}.
 *
 * @module
 */
import type { InputSchema, InputValues, ValueRange } from "../core/types.ts";
import type { InputRole } from "../core/calculation.ts";
import { validateInputs, type ValidateOptions } from "../core/validate.ts";
import { BLOOD_VELOCITY } from "../quantities/flow.ts";
import { DEPTH, INSONATION_ANGLE, SOUND_SPEED } from "../quantities/ultrasound.ts";
import type { CheckedArguments } from "./types.ts";
import { cos as cosine } from "../../vendor/stdlib_math.js"; // @stdlib/math-base-special-cos

/**
 * Speed of sound assumed by scanners for soft tissue, in m/s (common practice).
 *
 * @example The default of every speed-of-sound input
 * ```ts
 * import { DEFAULT_SOUND_SPEED_MPS, evaluate, wavelengthAndPeriod } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(wavelengthAndPeriod, { transmitFrequencyMHz: 1 });
 * assert.equal(r.inputs.soundSpeedMps, DEFAULT_SOUND_SPEED_MPS);
 * assert.equal(r.outputs.wavelengthMm, 1.54); // 1540 m/s / 1 MHz
 * ```
 */
export const DEFAULT_SOUND_SPEED_MPS = 1540;

/** Speed of sound as an input: the scanner's soft-tissue assumption unless given. */
export const SOUND_SPEED_INPUT: InputRole = {
  quantity: SOUND_SPEED,
  default: DEFAULT_SOUND_SPEED_MPS,
};

/** Insonation angle as an input that defaults to a beam aligned with the flow. */
export const ALIGNED_ANGLE_INPUT: InputRole = { quantity: INSONATION_ANGLE, default: 0 };

/**
 * A depth in the role it plays in a calculation ("Sample-volume depth", "Focal depth").
 *
 * @param label The role's label.
 * @param description What the depth is here.
 * @returns The input role.
 */
export function depthInput(label: string, description: string): InputRole {
  return { quantity: DEPTH, label, description };
}

/**
 * A blood velocity taken as a speed (a magnitude, never negative): valid from 0 to `max` m/s, and
 * typical up to the blood velocity's own typical maximum.
 *
 * @param label The role's label.
 * @param description What the speed is here.
 * @param valid The speeds the formula accepts, from 0.
 * @param reason Why the blood velocity's range is narrowed here.
 * @returns The input role.
 */
export function bloodSpeedInput(
  label: string,
  description: string,
  valid: ValueRange,
  reason: string,
): InputRole {
  const typical: ValueRange = {
    min: 0,
    max: BLOOD_VELOCITY.typical!.max,
    ...(valid.minExclusive ? { minExclusive: true } : {}),
  };
  return { quantity: BLOOD_VELOCITY, label, description, valid, typical, reason };
}

/** The depth of the pulsed-Doppler sample volume. */
export const SAMPLE_DEPTH_INPUT: InputRole = depthInput(
  "Sample-volume depth",
  "Depth of the pulsed-Doppler sample volume",
);

/**
 * cos θ for an angle in degrees. The one place the insonation-angle cosine is written.
 *
 * The cosine is @stdlib's JavaScript port of the FreeBSD/fdlibm routine (faithfully rounded, like
 * `Math.cos`, from which it differs by at most 1 ulp): the engine can inline it in Monte Carlo
 * and cohort loops, where it runs about 2.5 times faster than `Math.cos` (bench/analysis.md).
 */
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

/**
 * Validates the arguments of a plain function with the one validator (the same rules and
 * messages as a calculation's inputs: unknown, missing or mistyped arguments are TypeErrors,
 * values outside the valid range or broken relations RangeErrors; values outside the typical
 * range become flags).
 *
 * @param schema The arguments' schema (`defineArguments`, with constraints where they apply).
 * @param args The arguments as given.
 * @param options Arguments to skip (optional ones not given).
 * @returns The checked arguments, their values typed as all present.
 * @throws {TypeError | RangeError} From the validator.
 */
export function validateArguments<I extends string>(
  schema: InputSchema<I>,
  args: unknown,
  options: ValidateOptions = {},
): CheckedArguments<I> & { readonly values: InputValues<I> } {
  const { values, flags } = validateInputs(schema, args, options);
  return { title: schema.title, values, definitions: schema.inputs, flags };
}
