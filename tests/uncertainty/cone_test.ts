import assert from "node:assert/strict";
import {
  insonationAngleEffect,
  insonationCone,
  normal,
  propagate,
  rectangular,
  resolveDistribution,
  simplifiedBernoulli,
} from "../../mod.ts";
import { simpson } from "../input_uncertainty/helpers.ts";

const rad = Math.PI / 180;
const m = 20 * rad;
// the density of θ for directions uniform over the solid angle of a cone: sin θ / (1 − cos θmax)
const density = (t: number) => Math.sin(t) / (1 - Math.cos(m));

Deno.test("the 3-D cone of directions: moments against numerical integration of its density", () => {
  const d = resolveDistribution(insonationCone(20), "angleDeg", "deg", "Demo").distribution!;
  // the density integrates to 1, and E[θ], sd(θ) by Simpson's rule (computed here, independently
  // of the closed forms in the library)
  assert.ok(Math.abs(simpson(density, 0, m) - 1) < 1e-10);
  const mean = simpson((t) => t * density(t), 0, m);
  const second = simpson((t) => t * t * density(t), 0, m);
  assert.ok(Math.abs(d.estimate - mean / rad) < 1e-8);
  assert.ok(Math.abs(d.standardUncertainty - Math.sqrt(second - mean * mean) / rad) < 1e-8);
  // quantities in radians or as strings are read in the input's unit
  const r = resolveDistribution(insonationCone("0.349066 rad"), "a", "deg", "Demo").distribution!;
  assert.ok(Math.abs(r.estimate - d.estimate) < 1e-4);
  // a cone for a velocity input is refused, naming the input
  const bad = resolveDistribution(insonationCone(20), "v", "m/s", "Demo");
  assert.equal(bad.distribution, undefined);
  assert.equal(bad.issues[0]!.kind, "unit");
  for (const bound of [0, 90, -5]) {
    const b = resolveDistribution(insonationCone(bound), "a", "deg", "Demo");
    assert.equal(b.issues[0]!.kind, "range", String(bound));
  }
});

Deno.test("cone against in-plane angle: mean cos θ and the biases they imply, side by side", () => {
  const inputs = (angleDeg: ReturnType<typeof insonationCone | typeof rectangular>) => ({
    measuredVelocity: normal(4, 1e-9),
    angleDeg,
  });
  const cone = propagate(insonationAngleEffect, inputs(insonationCone(20)), {
    method: "monteCarlo",
    trials: 400_000,
    seed: 4,
  });
  const plane = propagate(insonationAngleEffect, inputs(rectangular(-20, 20)), {
    method: "monteCarlo",
    trials: 400_000,
    seed: 4,
  });
  // E[cos θ]: cone (1 + cos 20°)/2 = 0.969846; in plane sin(20°)/(20° in rad) = 0.979816 (Simpson
  // check of both integrals below); the displayed velocity 4 m/s is v·cos θ, so the mean true
  // velocity is 4·E[1/cos θ]
  const eCosCone = simpson((t) => Math.cos(t) * density(t), 0, m);
  const eCosPlane = simpson((t) => Math.cos(t) / (2 * m), -m, m);
  assert.ok(Math.abs(eCosCone - (1 + Math.cos(m)) / 2) < 1e-12);
  assert.ok(Math.abs(eCosPlane - Math.sin(m) / m) < 1e-12);
  const eSecCone = simpson((t) => density(t) / Math.cos(t), 0, m);
  const eSecPlane = simpson((t) => 1 / Math.cos(t) / (2 * m), -m, m);
  // Monte Carlo means within 4 standard errors (sd of 4/cos θ ≈ 0.1 m/s over 4·10⁵ trials)
  assert.ok(Math.abs(cone.outputs.trueVelocity.value - 4 * eSecCone) < 8e-4);
  assert.ok(Math.abs(plane.outputs.trueVelocity.value - 4 * eSecPlane) < 8e-4);
  // the cone biases more: little of its weight lies near 0°
  assert.ok(cone.outputs.trueVelocity.value > plane.outputs.trueVelocity.value);
  // and the first-order law sees the cone's non-zero mean angle (13.3°): a non-zero sensitivity
  const gum = propagate(simplifiedBernoulli, { peakVelocity: 4 });
  assert.equal(gum.outputs.gradient.value, 64);
  const coneGum = propagate(insonationAngleEffect, inputs(insonationCone(20)));
  assert.ok(coneGum.outputs.trueVelocity.budget.some((b) => /angle/i.test(b.label) && b.share > 0));
});
