import assert from "node:assert/strict";
import { cosDeg } from "../../calc/physics/shared.ts";
import { cos } from "../../vendor/stdlib_math.js";

// cosDeg inlines the kernel of @stdlib/math-base-special-cos for |x| ≤ π/4: its results must be
// the package's own, bit for bit (the package is the reference; FreeBSD msun s_cos.c / k_cos.c)
Deno.test("cosDeg: the package's cosine of θ·(π/180), bit for bit, inside and outside the kernel's range", () => {
  const angles: number[] = [];
  // a seeded sweep of ±180° (a 32-bit LCG, Numerical Recipes constants 1664525, 1013904223)
  let state = 12345;
  for (let k = 0; k < 200_000; k++) {
    state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
    angles.push((state / 2 ** 32 - 0.5) * 360);
  }
  // small angles, the 2⁻²⁷ rad threshold and the π/4 threshold with their neighbours
  const threshold = new Float64Array(Uint32Array.of(0, 0x3fe921fc).buffer)[0]!;
  for (const x of [2 ** -27, threshold, Math.PI / 4]) {
    for (const f of [1 - 2 ** -52, 1, 1 + 2 ** -52, 1 - 1e-12, 1 + 1e-12]) {
      angles.push((x * f) / (Math.PI / 180), (-x * f) / (Math.PI / 180));
    }
  }
  angles.push(0, -0, 1e-9, 45, -45, 44.999999, 45.000001, 60, 89, 90, -90, 180, 1e6);
  let kernel = 0;
  for (const a of angles) {
    const x = a * (Math.PI / 180);
    if (Math.abs(x) < threshold && Math.abs(x) >= 2 ** -27) kernel++;
    assert.ok(Object.is(cosDeg(a), cos(x)), `θ = ${a}°: ${cosDeg(a)} ≠ ${cos(x)}`);
  }
  assert.ok(kernel > 40_000, `kernel range reached ${kernel} times`);
  assert.ok(Number.isNaN(cosDeg(NaN)));
});

Deno.test("cosDeg: values of trigonometric tables", () => {
  // cos 0 = 1, cos 60° = 1/2, cos 30° = √3/2, cos 15° = (√6 + √2)/4 (exact values, common practice, no source)
  assert.equal(cosDeg(0), 1);
  assert.ok(Math.abs(cosDeg(60) - 0.5) < 2e-16);
  assert.ok(Math.abs(cosDeg(30) - Math.sqrt(3) / 2) < 2e-16);
  assert.ok(Math.abs(cosDeg(15) - (Math.sqrt(6) + Math.sqrt(2)) / 4) < 2e-16);
  assert.ok(Math.abs(cosDeg(-15) - cosDeg(15)) === 0);
});
