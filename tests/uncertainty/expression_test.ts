import assert from "node:assert/strict";
import { expressionModel, normal, propagate, simplifiedBernoulli } from "../../mod.ts";

const bernoulli = expressionModel({
  expression: "4 * v^2",
  inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
  output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
});

Deno.test("an expression model evaluates and differentiates symbolically", () => {
  // 4·3² = 36 and d(4v²)/dv = 8v = 24 at v = 3 (hand computation)
  assert.equal(bernoulli.partial!("gradient", ["v"])({ v: 3 }), 24);
  assert.equal(bernoulli.partial!("gradient", ["v", "v"])({ v: 3 }), 8);
});

Deno.test("an expression model propagates like the catalog's own definition", () => {
  const v = normal(3, 0.1);
  const mine = propagate(bernoulli, { v });
  const catalog = propagate(simplifiedBernoulli, { peakVelocity: v });
  // first order: u = 8·v·u(v) = 2.4 mmHg (JCGM 100:2008 eq. (10))
  assert.ok(Math.abs(mine.outputs.gradient.standardUncertainty - 2.4) < 1e-12);
  assert.ok(
    Math.abs(
      mine.outputs.gradient.standardUncertainty -
        catalog.outputs.gradient.standardUncertainty,
    ) < 1e-9,
  );
  // second order (JCGM 100:2008 §5.1.2 note): u² = (8vσ)² + ½(8)²σ⁴ = 5.7632, which is also the
  // exact variance of 4v² for a normal v: 16(4μ²σ² + 2σ⁴) (moments of the normal distribution)
  const second = propagate(bernoulli, { v }, { secondOrder: true });
  assert.ok(Math.abs(second.outputs.gradient.standardUncertainty ** 2 - 5.7632) < 1e-9);
});

Deno.test("an expression with an unknown symbol or bad syntax is refused, naming it", () => {
  assert.throws(
    () =>
      expressionModel({
        expression: "4 * w^2",
        inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
        output: { name: "g", unit: "mmHg", description: "g" },
      }),
    {
      name: "TypeError",
      message: "Expression model: 4 * w^2: unknown symbol 'w'; expected inputs v",
    },
  );
  assert.throws(
    () =>
      expressionModel({
        expression: "4 * (v",
        inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
        output: { name: "g", unit: "mmHg", description: "g" },
      }),
    { name: "TypeError", message: /does not parse .*got "4 \* \(v"/ },
  );
});
