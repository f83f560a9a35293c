/**
 * Sampled Doppler velocity envelopes: validation, peak and mean gradient, velocity-time integral.
 *
 * An envelope is the traced outer edge of a spectral Doppler signal: sample times (ms) and the
 * velocity magnitude (m/s) at each time. Between samples the velocity is taken as linear, so the
 * velocity-time integral is the trapezoidal rule and the mean gradient is the exact time-average of
 * 4·v(t)² over the piecewise-linear trace.
 *
 * @module
 */
import { defineArguments } from "../core/calculation.ts";
import { issueError, throwIfErrors } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import type { ValidationIssue } from "../core/types.ts";
import { checkValue } from "../core/validate.ts";
import { BLOOD_VELOCITY } from "../quantities/flow.ts";
import { simplifiedBernoulli } from "./bernoulli.ts";

/** A traced spectral Doppler envelope. */
export interface VelocityEnvelope {
  /** Sample times in ms, strictly increasing (any origin). */
  readonly timesMs: ArrayLike<number>;
  /** Velocity magnitudes in m/s at each time (trace below the baseline as positive values). */
  readonly velocitiesMPerS: ArrayLike<number>;
}

/** Gradients of an envelope. */
export interface EnvelopeGradients {
  /** Highest sampled velocity, m/s. */
  readonly peakVelocity: number;
  /** Peak instantaneous gradient 4·vmax², mmHg. */
  readonly peakGradient: number;
  /** Time-averaged instantaneous gradient (1/T)∫4v(t)²dt, mmHg. */
  readonly meanGradient: number;
  /** Duration of the envelope, ms. */
  readonly durationMs: number;
}

const WHERE = "Velocity envelope";

/** One sample of the traced velocity, checked by the one validator. */
const ENVELOPE_VELOCITY = defineArguments(WHERE, {
  velocity: {
    quantity: BLOOD_VELOCITY,
    label: "Envelope velocity",
    description: "Velocity magnitude of the traced envelope at one sample time",
    valid: { min: 0, max: 10 },
    typical: { min: 0, max: 7 },
    reason:
      "an envelope is traced as a magnitude (below the baseline as positive values), and no blood velocity reaches 10 m/s",
  },
}).inputs.velocity;

function isArrayLike(value: unknown): value is ArrayLike<unknown> {
  return Array.isArray(value) || ArrayBuffer.isView(value) && !(value instanceof DataView);
}

/** An error issue of the envelope, rendered by the one message format. */
function problem(
  kind: ValidationIssue["kind"],
  field: string,
  expected: string,
  received: string,
): ValidationIssue {
  return { kind, severity: "error", where: WHERE, field, expected, received };
}

/**
 * Validates a velocity envelope and returns it as two plain arrays.
 *
 * Checks: both fields are arrays (or typed arrays) of equal length with at least 2 samples; every
 * time is a finite number strictly greater than the previous one; every velocity is a number in
 * the valid range of an envelope velocity, [0, 10] m/s (by the one validator).
 *
 * @param envelope The envelope `{ timesMs, velocitiesMPerS }`.
 * @returns Copies of the times (ms) and velocities (m/s).
 * @throws {TypeError} When the envelope is not an object, a field is not an array, a sample is not
 * a number, or the lengths differ.
 * @throws {RangeError} For fewer than 2 samples, a non-finite or non-increasing time, or a
 * negative, non-finite or implausibly high velocity; the message names the field, the index, what
 * was expected and the value.
 *
 * @example
 * ```ts
 * import { validateEnvelope } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.throws(() => validateEnvelope({ timesMs: [0, 10, 10], velocitiesMPerS: [1, 2, 1] }), {
 *   name: "RangeError",
 *   message: "Velocity envelope: expected 'timesMs[2]' strictly greater than timesMs[1] = 10 ms, got 10",
 * });
 * ```
 */
export function validateEnvelope(
  envelope: VelocityEnvelope,
): { timesMs: number[]; velocitiesMPerS: number[] } {
  if (typeof envelope !== "object" || envelope === null) {
    throw issueError([
      problem(
        "type",
        "envelope",
        "as an object { timesMs, velocitiesMPerS }",
        describeValue(envelope),
      ),
    ]);
  }
  const { timesMs, velocitiesMPerS } = envelope;
  for (
    const [name, field] of [["timesMs", timesMs], ["velocitiesMPerS", velocitiesMPerS]] as const
  ) {
    if (!isArrayLike(field)) {
      throw issueError([problem("type", name, "as an array of numbers", describeValue(field))]);
    }
  }
  const n = timesMs.length;
  if (velocitiesMPerS.length !== n) {
    throw issueError([
      problem(
        "type",
        "velocitiesMPerS",
        `with the same length as 'timesMs' (${n})`,
        String(velocitiesMPerS.length),
      ),
    ]);
  }
  if (!(n >= 2)) {
    throw issueError([problem("range", "timesMs", "with at least 2 samples", String(n))]);
  }
  const times: number[] = new Array(n);
  const velocities: number[] = new Array(n);
  for (let i = 0; i < n; i++) {
    const t = timesMs[i];
    const field = `timesMs[${i}]`;
    if (typeof t !== "number") {
      throw issueError([problem("type", field, "as a number", describeValue(t))]);
    }
    if (!Number.isFinite(t)) throw issueError([problem("range", field, "finite", String(t))]);
    if (i > 0 && !(t > times[i - 1]!)) {
      const previous = `timesMs[${i - 1}] = ${times[i - 1]} ms`;
      throw issueError([problem("range", field, `strictly greater than ${previous}`, String(t))]);
    }
    const v = velocitiesMPerS[i];
    if (typeof v !== "number") {
      throw issueError([
        problem("type", `velocitiesMPerS[${i}]`, "as a number", describeValue(v)),
      ]);
    }
    const checked = checkValue(`velocitiesMPerS[${i}]`, ENVELOPE_VELOCITY, v, { where: WHERE });
    throwIfErrors(checked.issues);
    times[i] = t;
    velocities[i] = v;
  }
  return { timesMs: times, velocitiesMPerS: velocities };
}

/**
 * Velocity-time integral (VTI) of an envelope by the trapezoidal rule.
 *
 * Formula: VTI [cm] = Σᵢ ½(vᵢ + vᵢ₊₁)·(tᵢ₊₁ − tᵢ) with v in m/s and t in ms, times 0.1 cm per
 * (m/s·ms).
 *
 * Source: Quiñones MA, et al. J Am Soc Echocardiogr 2002;15:167-184 (VTI as the integral of the
 * velocity envelope); trapezoidal rule (any numerical-analysis text).
 *
 * @param envelope Sample times (ms) and velocity magnitudes (m/s).
 * @returns VTI in cm.
 * @throws {TypeError} | {RangeError} As {@linkcode validateEnvelope}.
 *
 * @example
 * ```ts
 * import { velocityTimeIntegral } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // A triangle peaking at 1 m/s over 300 ms: ½·1 m/s·0.3 s = 0.15 m = 15 cm
 * const vti = velocityTimeIntegral({ timesMs: [0, 150, 300], velocitiesMPerS: [0, 1, 0] });
 * assert.ok(Math.abs(vti - 15) < 1e-12);
 * ```
 */
export function velocityTimeIntegral(envelope: VelocityEnvelope): number {
  const { timesMs, velocitiesMPerS } = validateEnvelope(envelope);
  let sum = 0; // m/s · ms = mm
  for (let i = 1; i < timesMs.length; i++) {
    sum += 0.5 * (velocitiesMPerS[i - 1]! + velocitiesMPerS[i]!) * (timesMs[i]! - timesMs[i - 1]!);
  }
  return sum / 10;
}

/**
 * Peak and mean pressure gradient of an envelope.
 *
 * The peak gradient is the simplified Bernoulli gradient of the highest sampled velocity. The mean
 * gradient is the time-average of the instantaneous gradients 4·v(t)², not 4·(mean v)²: with v
 * linear between samples, the mean of v² on a segment is (vᵢ² + vᵢvᵢ₊₁ + vᵢ₊₁²)/3, so the mean
 * gradient is the simplified Bernoulli gradient of the root-mean-square velocity
 * v_rms = √((1/T)·Σ Δtᵢ·(vᵢ² + vᵢvᵢ₊₁ + vᵢ₊₁²)/3).
 *
 * Source: Baumgartner H, et al. J Am Soc Echocardiogr 2009;22:1-23 (mean gradient as the average of
 * instantaneous gradients over the ejection period; from memory).
 *
 * @param envelope Sample times (ms) and velocity magnitudes (m/s).
 * @returns Peak velocity (m/s), peak and mean gradient (mmHg) and duration (ms).
 * @throws {TypeError} | {RangeError} As {@linkcode validateEnvelope}.
 *
 * @example
 * ```ts
 * import { envelopeGradients } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Triangle 0 → 4 → 0 m/s: peak 64 mmHg, mean 4·16/3 = 21.3 mmHg (not 4·2² = 16)
 * const g = envelopeGradients({ timesMs: [0, 150, 300], velocitiesMPerS: [0, 4, 0] });
 * assert.equal(g.peakGradient, 64);
 * assert.ok(Math.abs(g.meanGradient - 64 / 3) < 1e-9);
 * ```
 */
export function envelopeGradients(envelope: VelocityEnvelope): EnvelopeGradients {
  const { timesMs, velocitiesMPerS } = validateEnvelope(envelope);
  let peakVelocity = 0;
  let sumSquares = 0; // ∫ v² dt, (m/s)²·ms
  for (let i = 0; i < timesMs.length; i++) {
    const v = velocitiesMPerS[i]!;
    if (v > peakVelocity) peakVelocity = v;
    if (i > 0) {
      const u = velocitiesMPerS[i - 1]!;
      sumSquares += (timesMs[i]! - timesMs[i - 1]!) * (u * u + u * v + v * v) / 3;
    }
  }
  const durationMs = timesMs[timesMs.length - 1]! - timesMs[0]!;
  const rmsVelocity = Math.sqrt(sumSquares / durationMs);
  return {
    peakVelocity,
    peakGradient: simplifiedBernoulli.formula({ peakVelocity }).gradient,
    meanGradient: simplifiedBernoulli.formula({ peakVelocity: rmsVelocity }).gradient,
    durationMs,
  };
}
