import assert from "node:assert/strict";
import { angleUnderestimationData, valveAreaDiameterErrorData } from "../../mod.ts";
import { close } from "./helpers.ts";

Deno.test("angle curve reproduces 1 − cos θ and 1 − cos²θ", () => {
  const rows = angleUnderestimationData({ maxAngleDeg: 60, stepDeg: 5 });
  assert.equal(rows.length, 2 * 13);
  const at = (a: number, output: string) =>
    rows.find((r) => r.angleDeg === a && r.output === output)!.underestimationPercent;
  const velocity = "velocityUnderestimationPercent", gradient = "gradientUnderestimationPercent";
  // Common practice (issue 3): velocity error under about 6 % below 20° → 6.03 % at 20°
  close(at(20, velocity), 6.03, 0.005);
  assert.ok(at(15, velocity) < 6);
  // trigonometry: cos 60° = ½ exactly; gradient 1 − ¼ = 75 %
  close(at(60, velocity), 50, 1e-9);
  close(at(60, gradient), 75, 1e-9);
  close(at(0, gradient), 0, 1e-12);
  // the gradient error is always at least the velocity error (v² vs v)
  for (const a of [5, 10, 30, 45]) assert.ok(at(a, gradient) > at(a, velocity));
  // each row is labelled by the output's quantity role, for the chart's legend
  assert.deepEqual(
    [...new Set(rows.map((r) => r.label))],
    [
      "Velocity underestimation relative to the true velocity",
      "Gradient underestimation relative to the true gradient",
    ],
  );
});

Deno.test("valve-area error curve: the diameter is squared", () => {
  const rows = valveAreaDiameterErrorData({
    lvotDiametersCm: [1.8, 2.2],
    maxErrorMm: 2,
    stepMm: 1,
  });
  assert.equal(rows.length, 2 * 5);
  const at = (d: number, e: number) =>
    rows.find((r) => r.lvotDiameterCm === d && r.diameterErrorMm === e)!.areaErrorPercent;
  // (d + e)²/d² − 1 (hand-checkable): 1.9²/1.8² − 1 = 11.42 %; 2.3²/2.2² − 1 = 9.30 %
  close(at(1.8, 1), 11.42, 0.005);
  close(at(2.2, 1), 9.30, 0.005);
  close(at(2.2, -2), 100 * ((2.0 / 2.2) ** 2 - 1), 1e-9);
  close(at(1.8, 0), 0, 1e-12);
});

Deno.test("curve options are validated", () => {
  assert.throws(() => angleUnderestimationData({ maxAngleDeg: 90 }), {
    name: "RangeError",
    message:
      "Angle underestimation curve: expected 'maxAngleDeg' (Largest angle) in (0, 89]°, got 90",
  });
  assert.throws(() => valveAreaDiameterErrorData({ stepMm: 0 }), {
    name: "RangeError",
    message: "Valve-area error curve: expected 'stepMm' (Diameter error step) in (0, 1] mm, got 0",
  });
  assert.throws(() => valveAreaDiameterErrorData({ lvotDiametersCm: [0.2], maxErrorMm: 3 }), {
    name: "RangeError",
    message:
      "Valve-area error curve: expected 'maxErrorMm' (Largest diameter error) below the smallest LVOT diameter, 2 mm, got 3",
  });
  assert.throws(() => valveAreaDiameterErrorData({ lvotDiametersCm: [2, -1] }), {
    name: "RangeError",
    message:
      "Valve-area error curve: expected 'lvotDiametersCm[1]' (LVOT diameter) in (0, 5] cm, got -1",
  });
  assert.throws(() => valveAreaDiameterErrorData({ lvotDiametersCm: [] }), {
    name: "TypeError",
    message:
      "Valve-area error curve: expected 'lvotDiametersCm' as a non-empty array of LVOT diameters, got an empty array",
  });
});
