import assert from "node:assert/strict";
import {
  BODY_SURFACE_AREA,
  bsaMosteller,
  CATALOG,
  chain,
  defineCalculation,
  defineQuantity,
  evaluate,
  indexedToBsa,
  LV_MASS,
  rebuild,
} from "../../mod.ts";

const synthetic = [{ authors: "test", year: 2026, title: "synthetic", publication: "tests" }];
const q = (id: string, unit = "1") =>
  defineQuantity({
    id: `chainTest.${id}`,
    label: `chain test ${id}`,
    unit,
    description: id,
    valid: { min: -1e6, max: 1e6 },
    resolution: 1e-6,
  });
const X = q("x"), Y = q("y"), Z = q("z"), W = q("w", "cm");
const double = defineCalculation({
  id: "chainTestDouble",
  title: "Double",
  description: "y = 2x",
  inputs: { x: X },
  outputs: { y: Y },
  formula: ({ x }) => ({ y: 2 * x }),
  formulaText: "y = 2x",
  citations: synthetic,
  cautions: ["first caution"],
});
const addX = defineCalculation({
  id: "chainTestAdd",
  title: "Add",
  description: "z = y + x",
  inputs: { y: Y, x: X },
  outputs: { z: Z },
  formula: ({ x, y }) => ({ z: x + y }),
  formulaText: "z = y + x",
  citations: synthetic,
  cautions: ["second caution"],
  clinical: true,
});

Deno.test("a chain wires outputs to inputs by name and shares the other inputs", () => {
  const c = chain([double, addX]);
  assert.deepEqual(c.inputNames, ["x"]);
  assert.deepEqual(c.outputNames, ["y", "z"]);
  // y = 2·3 = 6, z = 6 + 3 = 9 (arithmetic)
  assert.deepEqual(evaluate(c, { x: 3 }).outputs, { y: 6, z: 9 });
  assert.equal(c.title, "Double → Add");
  assert.deepEqual(c.cautions, ["first caution", "second caution"]);
  assert.equal(c.clinical, true);
  assert.equal(c.formulaText, "y = 2x; z = y + x");
});

Deno.test("a chain with renames, chosen outputs, and its own id and title", () => {
  const c = chain([
    { calculation: double, outputs: { y: "twice" } },
    { calculation: addX, inputs: { y: "twice" } },
  ], { id: "chainTestRenamed", title: "Twice plus", outputs: ["z"] });
  assert.equal(c.id, "chainTestRenamed");
  assert.deepEqual(c.outputNames, ["z"]);
  assert.deepEqual(evaluate(c, { x: 1 }).outputs, { z: 3 });
});

Deno.test("a chain is made again from its recipe (catalog members by id, families by parameter)", () => {
  const c = chain([bsaMosteller, indexedToBsa(LV_MASS)]);
  const again = rebuild(CATALOG, c.recipe);
  assert.equal(again.id, c.id);
  assert.deepEqual(again.inputNames, ["heightCm", "weightKg", "lvMass"]);
  // Mosteller: √(180·80/3600) = 2 m² (Mosteller 1987, hand computation); 190 g / 2 m² = 95 g/m²
  assert.deepEqual(evaluate(again, { heightCm: 180, weightKg: 80, lvMass: 190 }).outputs, {
    bsaM2: 2,
    lvMassIndex: 95,
  });
  assert.equal(c.outputs.bsaM2!.quantity, BODY_SURFACE_AREA);
});

Deno.test("chain errors: one step, two steps giving one output, two quantities under one name", () => {
  assert.throws(() => chain([double] as never), {
    name: "TypeError",
    message: "Chain: expected at least two steps, got 1",
  });
  assert.throws(() => chain([double, double]), {
    name: "TypeError",
    message: /two steps give the output 'y'; expected one \(rename it in a step's outputs\)/,
  });
  const otherX = defineCalculation({
    ...addX,
    id: "chainTestOther",
    inputs: { y: Y, x: W },
  });
  assert.throws(() => chain([double, otherX]), {
    name: "TypeError",
    message:
      /input 'x' of 'Add' measures chain test w, but an earlier step's 'x' measures another quantity/,
  });
  assert.throws(() => chain([double, addX], { outputs: ["nope"] }), {
    name: "TypeError",
    message: /unknown output 'nope' to keep; expected one of y, z/,
  });
});
