import assert from "node:assert/strict";
import { expressionModel, sensitivityCurve } from "../../mod.ts";

const cosine = expressionModel({
  expression: "v / cos(theta * pi / 180)",
  inputs: {
    v: { unit: "m/s", description: "displayed velocity", range: { min: 0, max: 10 } },
    theta: { unit: "deg", description: "beam angle", range: { min: 0, max: 89 } },
  },
  output: { name: "trueVelocity", unit: "m/s", description: "velocity along the flow" },
});

Deno.test("sensitivity curve: cos θ error under about 6 % below 20° (common practice, no source)", () => {
  const c = sensitivityCurve(cosine, { v: 1, theta: 0 }, {
    vary: "theta",
    from: 0,
    to: 20,
    steps: 21,
  });
  assert.equal(c.points.length, 21);
  assert.equal(c.points[0]!.relativeChangePercent, 0);
  // 1/cos 20° − 1 = 6.4 %; the displayed velocity is 1 − cos 20° = 6.0 % low
  assert.equal(c.points[20]!.relativeChangePercent.toFixed(1), "6.4");
  assert.ok(c.points.every((p, i) => i === 0 || p.y > c.points[i - 1]!.y));
});

Deno.test("sensitivity curve: bad sweeps are errors naming the input and range", () => {
  assert.throws(
    () => sensitivityCurve(cosine, { v: 1, theta: 0 }, { vary: "theta", from: 0, to: 95 }),
    {
      name: "RangeError",
      message: /expected the sweep of 'theta' in \[0, 89\]°, got 95/,
    },
  );
  assert.throws(
    () => sensitivityCurve(cosine, { v: 1, theta: 0 }, { vary: "phi" as never, from: 0, to: 1 }),
    {
      name: "TypeError",
      message: /unknown input 'phi' to vary/,
    },
  );
  assert.throws(
    () => sensitivityCurve(cosine, { v: 1, theta: 0 }, { vary: "v", from: 0, to: 1, steps: 1 }),
    {
      name: "RangeError",
      message: /expected steps to be an integer >= 2, got 1/,
    },
  );
});
