import assert from "node:assert/strict";
import {
  angleCorrectedVelocity,
  angleCosineMoments,
  CLINICAL_CAUTION,
  insonationAngleComparison,
  insonationAngleEffect,
  insonationAngleModel,
  insonationCone,
  propagate,
  rectangular,
} from "../../mod.ts";
import { close, simpson } from "./helpers.ts";

Deno.test("angle moments: the closed forms agree with numerical integration of the densities", () => {
  for (const maxDeg of [5, 15, 30, 60, 85]) {
    const m = (maxDeg * Math.PI) / 180;
    // cone: density sin θ/(1 − cos m) on [0, m]; in plane: 1/(2m) on [−m, m] (numerical
    // integration of the definitions, an outside computation of the same integrals)
    const cone = (g: (t: number) => number) =>
      simpson((t) => g(t) * Math.sin(t), 0, m) / (1 - Math.cos(m));
    const plane = (g: (t: number) => number) => simpson(g, -m, m) / (2 * m);
    const c = angleCosineMoments({ maxDeg, model: "cone" });
    const p = angleCosineMoments({ maxDeg, model: "inPlane" });
    close(c.meanCos, cone(Math.cos), 1e-12, `cone E[cos] ${maxDeg}°`);
    close(c.meanCosSquared, cone((t) => Math.cos(t) ** 2), 1e-12, `cone E[cos²] ${maxDeg}°`);
    close(p.meanCos, plane(Math.cos), 1e-12, `plane E[cos] ${maxDeg}°`);
    close(p.meanCosSquared, plane((t) => Math.cos(t) ** 2), 1e-12, `plane E[cos²] ${maxDeg}°`);
    // the cone puts less weight near 0°: a larger shortfall for the same θmax
    assert.ok(c.meanCos < p.meanCos, `${maxDeg}°`);
  }
  // hand values at 60°: cone (1 + ½)/2 = 3/4; in plane sin(π/3)/(π/3) = 0.826993
  close(angleCosineMoments({ maxDeg: 60 }).meanCos, 0.75, 1e-15, "cone 60°");
  close(angleCosineMoments({ maxDeg: 60, model: "inPlane" }).meanCos, 0.826993, 1e-6, "plane 60°");
});

Deno.test("angle model: the cone is the default; Monte Carlo draws reproduce the closed forms", () => {
  assert.deepEqual(insonationAngleModel({ maxDeg: 15 }), insonationCone(15));
  assert.deepEqual(insonationAngleModel({ maxDeg: 15, model: "inPlane" }), rectangular(-15, 15));
  const trials = 200_000;
  const cone = propagate(
    angleCorrectedVelocity,
    { measuredVelocity: 1, angleDeg: insonationAngleModel({ maxDeg: 20 }) },
    { method: "monteCarlo", trials, seed: 7 },
  );
  // E[100(1 − cos θ)] = 100(1 − (1 + cos 20°)/2) = 3.0154 % (closed form above); the Monte Carlo
  // standard error is sd/√M < 1.8/√200000 = 0.004 %, so 0.02 % is five standard errors
  close(cone.outputs.underestimationPercent.value, 3.0154, 0.02, "cone MC");
  const plane = propagate(
    insonationAngleEffect,
    { measuredVelocity: 1, angleDeg: insonationAngleModel({ maxDeg: 20, model: "inPlane" }) },
    { method: "monteCarlo", trials, seed: 7 },
  );
  // in plane: 100(1 − sin m/m) = 2.0184 % at 20°; same standard-error reasoning
  close(plane.outputs.velocityUnderestimationPercent.value, 2.0184, 0.02, "plane MC");
  // the gradient's mean shortfall 100(1 − E[cos² θ]) = 3.9637 % in plane (closed form)
  close(plane.outputs.gradientUnderestimationPercent.value, 3.9637, 0.03, "plane MC gradient");
});

Deno.test("angle comparison: both models for one θmax and one displayed velocity", () => {
  const r = insonationAngleComparison({ maxDeg: 20, displayedVelocity: "400 cm/s" });
  assert.equal(r.displayedVelocity, 4);
  assert.deepEqual(r.rows.map((x) => x.model), ["cone", "inPlane"]);
  for (const row of r.rows) {
    // v_true = v/E[cos θ], ΔP_true = 4v²/E[cos² θ] (definitions; Bernoulli 4v², Hatle 1985)
    close(row.trueVelocity, 4 / row.meanCos, 1e-12, `${row.model} velocity`);
    close(row.trueGradient, 64 / row.meanCosSquared, 1e-9, `${row.model} gradient`);
    close(row.velocityUnderestimationPercent, 100 * (1 - row.meanCos), 1e-12, row.model);
    close(row.gradientUnderestimationPercent, 100 * (1 - row.meanCosSquared), 1e-9, row.model);
  }
  // cone at 20°: 100·(1 − (1 + c + c²)/3) = 5.9095 % of the gradient (hand computation)
  const c = Math.cos(Math.PI / 9);
  close(r.rows[0]!.gradientUnderestimationPercent, 100 * (1 - (1 + c + c * c) / 3), 1e-9, "5.91 %");
  close(r.rows[0]!.gradientUnderestimationPercent, 5.9095, 1e-4, "5.91 % value");
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
  assert.match(r.notes[0]!, /Default model: the cone/);
});

Deno.test("angle model: bad arguments name the field, the value and the range", () => {
  assert.throws(() => insonationAngleModel({ maxDeg: 0 }), {
    name: "RangeError",
    message:
      "Insonation angle model: expected 'maxDeg' (Largest insonation angle) in (0, 90)°, got 0",
  });
  assert.throws(() => insonationAngleModel({ maxDeg: 10, model: "sphere" as never }), {
    name: "RangeError",
    message: `Insonation angle model: expected 'model' one of "cone", "inPlane", got "sphere"`,
  });
  assert.throws(() => insonationAngleComparison({ maxDeg: 10, displayedVelocity: 0 }), {
    name: "RangeError",
    message:
      "Insonation angle models compared: expected 'displayedVelocity' (Displayed velocity) in (0, 10] m/s, got 0",
  });
  assert.throws(() => angleCosineMoments(null as never), TypeError);
});
