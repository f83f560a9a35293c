import assert from "node:assert/strict";
import {
  continuityValveAreaPeakVelocity,
  continuityValveAreaWithAngles,
  evaluate,
  insonationAngleEffect,
  normal,
  propagate,
  SIGNED_INSONATION_ANGLE,
} from "../../mod.ts";
import { close, DEG } from "./helpers.ts";

Deno.test("insonation angle: velocity and gradient underestimation", () => {
  // Common practice (issue 3): cos θ error under about 6 % below 20°: 1 − cos 20° = 6.03 %
  const r20 = evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 20 }).outputs;
  close(r20.velocityUnderestimationPercent, 6.03, 0.005);
  // gradient ∝ v²: 1 − cos² 20° = sin² 20° = 11.70 % (hand-checkable)
  close(r20.gradientUnderestimationPercent, 11.70, 0.005);
  close(r20.measuredGradient, 64, 1e-12);
  close(r20.trueGradient, 64 / Math.cos(Math.PI / 9) ** 2, 1e-9);
  // cos 60° = 0.5 exactly (trigonometry): the reading is half the true velocity
  const r60 = evaluate(insonationAngleEffect, { measuredVelocity: 2, angleDeg: 60 }).outputs;
  close(r60.trueVelocity, 4, 1e-12);
  close(r60.gradientUnderestimationPercent, 75, 1e-9);
  // the angle sign does not matter (cos is even)
  close(
    evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: -20 }).outputs.trueVelocity,
    r20.trueVelocity,
    1e-12,
  );
  // angle ≥ 90° is rejected (issue 3)
  // (the label is the signed-angle quantity's, declared by the ultrasound vocabulary)
  assert.throws(() => evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 90 }), {
    name: "RangeError",
    message:
      `Insonation angle effect on velocity and gradient: expected 'angleDeg' (${SIGNED_INSONATION_ANGLE.label}) in (-90, 90)°, got 90`,
  });
  // a reading of 4 m/s at 80° would mean 23 m/s along the flow: not a blood velocity
  assert.throws(() => evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 80 }), {
    name: "RangeError",
    message: /'trueVelocity' \(True velocity\).* in \[0, 10\] m\/s, got 23\.03/,
  });
});

Deno.test("misaligned aortic jet overestimates the continuity area by 1/cos θ − 1", () => {
  // Baumgartner 2009: under-recorded jet velocity overestimates AVA; at θ_AV = 20°
  // the naive area is 1/cos 20° − 1 = 6.42 % too large (hand-checkable)
  const r = evaluate(continuityValveAreaWithAngles, {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    avPeakVelocity: 4,
    avAngleDeg: 20,
  }).outputs;
  close(r.areaOverestimationPercent, 6.418, 0.001);
  // with both angles 0 the result equals the peak-velocity continuity area
  const aligned = evaluate(continuityValveAreaPeakVelocity, {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    avPeakVelocity: 4,
  }).outputs.avaCm2;
  close(r.avaAssumingAlignmentCm2, aligned, 1e-15);
  // equal angles at both sites cancel (hand-checkable)
  const both = evaluate(continuityValveAreaWithAngles, {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    lvotAngleDeg: 25,
    avPeakVelocity: 4,
    avAngleDeg: 25,
  }).outputs;
  close(both.areaOverestimationPercent, 0, 1e-9);
});

Deno.test("angle uncertainty at θ ≈ 0: GUM sees zero sensitivity and warns; Monte Carlo is honest", () => {
  const inputs = { measuredVelocity: 4, angleDeg: normal(0, 10) };
  const g = propagate(insonationAngleEffect, inputs);
  // JCGM 100 §5.1.2: first-order term c·u with c = ∂(v/cos θ)/∂θ = v·sin θ/cos²θ = 0 at θ = 0
  close(g.outputs.trueVelocity.standardUncertainty, 0, 1e-6, "first-order u");
  assert.ok(
    g.warnings.some((w) =>
      /inadequate for True velocity with respect to Signed insonation angle/.test(w)
    ),
    `expected a first-order warning, got ${JSON.stringify(g.warnings)}`,
  );
  assert.ok(
    g.warnings.some((w) =>
      /inadequate for True gradient with respect to Signed insonation angle/.test(w)
    ),
  );

  const m = propagate(insonationAngleEffect, inputs, {
    method: "monteCarlo",
    trials: 200_000,
    seed: 7,
  });
  // Expected value from the series sec θ = 1 + θ²/2 + 5θ⁴/24 + 61θ⁶/720 (Abramowitz & Stegun
  // 4.3.69) and normal moments E θ² = σ², E θ⁴ = 3σ⁴, E θ⁶ = 15σ⁶: E[sec θ] = 1.015847 at σ = 10°
  const s = 10 * DEG;
  const meanSec = 1 + s ** 2 / 2 + (5 * 3 * s ** 4) / 24 + (61 * 15 * s ** 6) / 720;
  close(m.outputs.trueVelocity.value, 4 * meanSec, 0.002, "E[v/cos θ]");
  // The true velocity is never below the reading: the whole interval lies at or above 4 m/s
  assert.ok(m.outputs.trueVelocity.interval.lower >= 4);
  // Second-order GUM term ½(f'')²u⁴ with f'' = v at θ = 0 (JCGM 100 §5.1.2 note):
  // u ≈ v·σ²/√2 = 0.0862 m/s; Monte Carlo agrees within 10 %
  close(m.outputs.trueVelocity.standardUncertainty, (4 * s * s) / Math.SQRT2, 0.0086, "u(v)");
  // E[sec²θ] = 1 + σ² + 2σ⁴ + ... (sec²θ = 1 + θ² + 2θ⁴/3 + ..., same moments): gradient bias
  const meanSec2 = 1 + s ** 2 + 2 * s ** 4;
  close(m.outputs.trueGradient.value, 64 * meanSec2, 0.15, "E[4v²/cos²θ]");
});

Deno.test("second-order GUM recovers the Monte Carlo spread at θ = 0", () => {
  const g2 = propagate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: normal(0, 10) }, {
    secondOrder: true,
  });
  // JCGM 100 §5.1.2 note: u² = ½(∂²f/∂θ²)²u⁴ with ∂²f/∂θ² = v (per rad²) → u = 4·σ²/√2
  const s = 10 * DEG;
  close(g2.outputs.trueVelocity.standardUncertainty, (4 * s * s) / Math.SQRT2, 0.002);
});

Deno.test("angle uncertainty into the continuity valve area: E[AVA] = AVA_aligned · e^(−σ²/2)", () => {
  const inputs = {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    lvotAngleDeg: 0,
    avPeakVelocity: 4,
    avAngleDeg: normal(0, 15),
  };
  const g = propagate(continuityValveAreaWithAngles, inputs);
  assert.ok(
    g.warnings.some((w) =>
      /inadequate for Aortic valve area with respect to Aortic jet beam angle/.test(w)
    ),
  );
  const m = propagate(continuityValveAreaWithAngles, inputs, {
    method: "monteCarlo",
    trials: 200_000,
    seed: 11,
  });
  // AVA_true = AVA_aligned·cos θ; E[cos θ] = exp(−σ²/2) for θ ~ N(0, σ²) (characteristic function
  // of the normal distribution, any probability text)
  const aligned = Math.PI / 4; // π·2²/4 · 1/4 (hand-checkable)
  const s = 15 * DEG;
  close(m.outputs.avaCm2.value, aligned * Math.exp(-(s * s) / 2), 0.001, "E[AVA]");
  // the angle can only make the true area smaller than the aligned estimate
  assert.ok(m.outputs.avaCm2.interval.upper <= aligned + 1e-12);
});
