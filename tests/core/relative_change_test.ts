import assert from "node:assert/strict";
import {
  evaluate,
  insonationAngleEffect,
  relativeChangePercent,
  sensitivityCurve,
} from "../../mod.ts";

const COS_10 = 0.984807753012208; // cos 10° (hand computation, any table of cosines)

Deno.test("relative change: 100·(value − reference)/|reference|, NaN for a zero reference", () => {
  // hand computations
  assert.equal(relativeChangePercent(110, 100), 10);
  assert.equal(relativeChangePercent(90, 100), -10);
  assert.equal(relativeChangePercent(-90, -100), 10); // above a negative reference: positive
  assert.equal(relativeChangePercent(5, 5), 0);
  assert.ok(Number.isNaN(relativeChangePercent(1, 0)));
});

Deno.test("one definition for the 10° case: the angle shortfall is relative to the true value", () => {
  const r = evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 10 }).outputs;
  // 100·(1 − cos²10°) = 3.0154 % (hand computation); the old sensitivity-style 1/cos²10° − 1 =
  // 3.1091 % was relative to the displayed value
  assert.ok(Math.abs(r.gradientUnderestimationPercent - 100 * (1 - COS_10 ** 2)) < 1e-9);
  assert.equal(r.gradientUnderestimationPercent.toFixed(2), "3.02");
  // 100·(1 − cos 10°) = 1.519 % (hand computation)
  assert.equal(r.velocityUnderestimationPercent.toFixed(3), "1.519");
  // the same number from the one definition, displayed against true
  assert.equal(
    -relativeChangePercent(r.measuredGradient, r.trueGradient),
    r.gradientUnderestimationPercent,
  );
  // the labels state the reference value
  assert.match(insonationAngleEffect.outputs.gradientUnderestimationPercent.label, /true gradient/);
  // at 0° the shortfall is 0, not −0
  const zero = evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 0 }).outputs;
  assert.ok(Object.is(zero.gradientUnderestimationPercent, 0));
});

Deno.test("a sensitivity curve's change is relative to its reference point, stated in the curve", () => {
  // sweeping the angle from the 0° reference: the true gradient rises by 1/cos²10° − 1 =
  // 3.109 % (hand computation) over its value at 0° (= the displayed gradient)
  const c = sensitivityCurve(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 0 }, {
    vary: "angleDeg",
    from: 0,
    to: 10,
    steps: 2,
    output: "trueGradient",
  });
  assert.equal(c.reference.x, 0);
  assert.equal(c.points[1]!.relativeChangePercent.toFixed(3), "3.109");
  assert.ok(Math.abs(c.points[1]!.relativeChangePercent - 100 * (1 / COS_10 ** 2 - 1)) < 1e-9);
});
