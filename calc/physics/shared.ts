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

/** Bounds on x² inside which the reference cosine of x is its kernel alone: |x| from 2⁻²⁶ (above
 * the 2⁻²⁷ below which it returns 1) to √0.6168 ≈ 0.78537 (below π/4 ≈ 0.785398, up to which the
 * high-word test of the reference sends x to the kernel). A test of x² has no branch on the sign
 * of x, which random angles would mispredict half the time (a test of |x| measured twice as slow).
 */
const KERNEL_SQUARE_MIN = 2 ** -52, KERNEL_SQUARE_MAX = 0.6168;
/** π/180: radians per degree. */
const RADIANS_PER_DEGREE = Math.PI / 180;
// the kernel's coefficients C1 … C6, as @stdlib/math-base-special-kernel-cos 0.2.4 writes them
// (FreeBSD msun k_cos.c, Copyright (C) 1993 by Sun Microsystems, Inc.; freely redistributable
// with this notice)
const C1 = 0.0416666666666666, C2 = -0.001388888888887411, C3 = 0.00002480158728947673;
const C4 = -2.7557314351390663e-7, C5 = 2.087572321298175e-9, C6 = -1.1359647557788195e-11;

/**
 * cos θ for an angle in degrees. The one place the insonation-angle cosine is written.
 *
 * Formula: cos(θ·(π/180)) (θ times the double nearest π/180, as numpy's `radians` does; a
 * multiplication where a division by 180 cost a few nanoseconds per call), by @stdlib's JavaScript port of the FreeBSD/fdlibm cosine (faithfully
 * rounded, like `Math.cos`, from which it differs by at most 1 ulp). For 2⁻²⁷ ≤ |x| ≤ π/4 that
 * routine is its kernel `__kernel_cos(x, 0)` (a polynomial in x², written out here with the
 * package's coefficients and operations) after a test of the high word of x. Here the test is on
 * x² and slightly narrower (|x| from 2⁻²⁶ to 0.78537, about 45°), so the engine inlines the whole
 * cosine into Monte Carlo and cohort loops for every insonation angle in practice. The result is
 * the package's own, bit for bit (tests/physics/shared_test.ts); other angles go through the
 * whole routine.
 *
 * @param angleDeg θ in degrees.
 * @returns cos θ.
 *
 * @example
 * ```ts
 * import { cosDeg } from "./shared.ts";
 * import assert from "node:assert/strict";
 * // cos 60° = 1/2 and cos 20° = 0.9396926 (trigonometric tables)
 * assert.ok(Math.abs(cosDeg(60) - 0.5) < 1e-15);
 * assert.ok(Math.abs(cosDeg(20) - 0.9396926) < 1e-7);
 * ```
 */
export function cosDeg(angleDeg: number): number {
  const x = angleDeg * RADIANS_PER_DEGREE;
  const z = x * x;
  // + types the bundle's result as a number, so that inlined into a loop the two paths merge as
  // unboxed doubles (without it the fast path measured about 1.5 times slower)
  if (!(z > KERNEL_SQUARE_MIN && z < KERNEL_SQUARE_MAX)) return +cosine(x);
  // __kernel_cos(x, 0): the term x·y vanishes (z·r − (±0) = z·r)
  const w = z * z;
  const r = z * (C1 + z * (C2 + z * C3)) + w * w * (C4 + z * (C5 + z * C6));
  const hz = 0.5 * z, v = 1 - hz;
  return v + ((1 - v - hz) + z * r);
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
