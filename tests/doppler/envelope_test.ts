import assert from "node:assert/strict";
import { envelopeGradients, validateEnvelope, velocityTimeIntegral } from "../../mod.ts";
import { close } from "./helpers.ts";

/** Samples f on n + 1 equally spaced times over [0, T] ms. */
function sampled(f: (tMs: number) => number, T: number, n: number) {
  const timesMs = Array.from({ length: n + 1 }, (_, i) => (T * i) / n);
  return { timesMs, velocitiesMPerS: timesMs.map(f) };
}

Deno.test("VTI of a triangle is exact under the trapezoidal rule", () => {
  // Area of a triangle ½·base·height (hand-checkable): ½ · 0.3 s · 1.2 m/s = 0.18 m = 18 cm
  close(
    velocityTimeIntegral({ timesMs: [0, 100, 300], velocitiesMPerS: [0, 1.2, 0] }),
    18,
    1e-12,
  );
  // non-uniform sampling of the same piecewise-linear trace gives the same integral
  close(
    velocityTimeIntegral({
      timesMs: [0, 50, 100, 250, 300],
      velocitiesMPerS: [0, 0.6, 1.2, 0.3, 0],
    }),
    18,
    1e-12,
  );
});

Deno.test("VTI of a half-sine envelope converges to 2·V·T/π", () => {
  // Calculus (hand-checkable): ∫₀ᵀ V sin(πt/T) dt = 2VT/π; V = 1 m/s, T = 0.3 s → 19.099 cm
  const env = sampled((t) => Math.sin((Math.PI * t) / 300), 300, 2000);
  close(velocityTimeIntegral(env), (2 * 1 * 30) / Math.PI, 1e-3);
});

Deno.test("mean gradient is the mean of instantaneous gradients, not 4·(mean v)²", () => {
  // Triangle 0 → 4 → 0 m/s (linear): mean of 4v² = 4·16/3 = 21.33 mmHg (calculus, hand-checkable)
  const g = envelopeGradients({ timesMs: [0, 150, 300], velocitiesMPerS: [0, 4, 0] });
  assert.equal(g.peakVelocity, 4);
  assert.equal(g.peakGradient, 64); // 4·4² (issue 3: 4 m/s → 64 mmHg)
  close(g.meanGradient, 64 / 3, 1e-9);
  // the naive 4·(mean v)² = 4·2² = 16 mmHg would be 25 % too low
  assert.ok(g.meanGradient > 16 + 5);
  assert.equal(g.durationMs, 300);
});

Deno.test("mean gradient of a half-sine envelope is 2·V² (mean of sin² = ½)", () => {
  // Calculus (hand-checkable): (1/T)∫ 4V² sin²(πt/T) dt = 2V²; V = 4.5 m/s → 40.5 mmHg
  const env = sampled((t) => 4.5 * Math.sin((Math.PI * t) / 320), 320, 1000);
  const g = envelopeGradients(env);
  close(g.meanGradient, 40.5, 1e-3);
  close(g.peakGradient, 81, 1e-9);
  // mean/peak = ½ exactly for a half-sine (hand-checkable from the two identities above)
  close(g.meanGradient / g.peakGradient, 0.5, 1e-4);
});

Deno.test("a constant envelope has mean gradient = peak gradient", () => {
  // 4·3² = 36 mmHg everywhere (hand-checkable)
  const g = envelopeGradients({ timesMs: [0, 10, 30, 60], velocitiesMPerS: [3, 3, 3, 3] });
  close(g.meanGradient, 36, 1e-12);
  assert.equal(g.peakGradient, 36);
});

Deno.test("typed arrays are accepted and the input is not modified", () => {
  const timesMs = new Float64Array([0, 100, 200]);
  const velocitiesMPerS = new Float64Array([0, 2, 0]);
  // ½ · 0.2 s · 2 m/s = 0.2 m = 20 cm (hand-checkable)
  close(velocityTimeIntegral({ timesMs, velocitiesMPerS }), 20, 1e-12);
  assert.deepEqual(Array.from(timesMs), [0, 100, 200]);
});

Deno.test("bad envelopes: fewer than 2 samples, non-increasing times, bad values", () => {
  // Issue 3: envelope with fewer than 2 samples → clear error naming the field
  assert.throws(() => velocityTimeIntegral({ timesMs: [0], velocitiesMPerS: [1] }), {
    name: "RangeError",
    message: "Velocity envelope: expected 'timesMs' with at least 2 samples, got 1",
  });
  // Issue 3: non-increasing times → field, index and value
  assert.throws(
    () => envelopeGradients({ timesMs: [0, 10, 10, 20], velocitiesMPerS: [1, 2, 2, 1] }),
    {
      name: "RangeError",
      message:
        /^Velocity envelope: expected 'timesMs\[2\]' strictly greater than timesMs\[1\] = 10 ms, got 10$/,
    },
  );
  assert.throws(
    () => velocityTimeIntegral({ timesMs: [0, 20, 10], velocitiesMPerS: [1, 2, 1] }),
    {
      name: "RangeError",
      message:
        "Velocity envelope: expected 'timesMs[2]' strictly greater than timesMs[1] = 20 ms, got 10",
    },
  );
  // negative velocity where a magnitude is required
  assert.throws(
    () => velocityTimeIntegral({ timesMs: [0, 10, 20], velocitiesMPerS: [1, -2, 1] }),
    {
      name: "RangeError",
      message:
        "Velocity envelope: expected 'velocitiesMPerS[1]' (Envelope velocity) in [0, 10] m/s, got -2",
    },
  );
  // non-finite values are never silent
  assert.throws(
    () => velocityTimeIntegral({ timesMs: [0, Number.NaN], velocitiesMPerS: [1, 1] }),
    { name: "RangeError", message: "Velocity envelope: expected 'timesMs[1]' finite, got NaN" },
  );
  assert.throws(
    () => envelopeGradients({ timesMs: [0, 10], velocitiesMPerS: [1, Infinity] }),
    {
      name: "RangeError",
      message:
        "Velocity envelope: expected 'velocitiesMPerS[1]' (Envelope velocity) in [0, 10] m/s, got Infinity",
    },
  );
  // shape errors are TypeErrors
  assert.throws(
    () => velocityTimeIntegral({ timesMs: [0, 10, 20], velocitiesMPerS: [1, 2] }),
    {
      name: "TypeError",
      message:
        "Velocity envelope: expected 'velocitiesMPerS' with the same length as 'timesMs' (3), got 2",
    },
  );
  assert.throws(
    () => velocityTimeIntegral({ timesMs: "0,10" as unknown as number[], velocitiesMPerS: [1, 2] }),
    {
      name: "TypeError",
      message: `Velocity envelope: expected 'timesMs' as an array of numbers, got "0,10"`,
    },
  );
  assert.throws(
    () => validateEnvelope({ timesMs: [0, "5" as unknown as number], velocitiesMPerS: [1, 2] }),
    {
      name: "TypeError",
      message: `Velocity envelope: expected 'timesMs[1]' as a number, got "5"`,
    },
  );
  assert.throws(
    () => validateEnvelope(null as unknown as { timesMs: number[]; velocitiesMPerS: number[] }),
    {
      name: "TypeError",
      message:
        "Velocity envelope: expected 'envelope' as an object { timesMs, velocitiesMPerS }, got null",
    },
  );
});
