import assert from "node:assert/strict";
import {
  CATALOG,
  catalogCalculations,
  combineCatalogs,
  defineCalculation,
  defineCatalog,
  defineFamily,
  evaluate,
  fingerprint,
  indexedToBsa,
  isQuantity,
  LV_MASS,
  PHN_2017_MODELS,
  QUANTITIES,
  rebuild,
  simplifiedBernoulli,
  Z_SCORE,
  zScoreCalculation,
} from "../../mod.ts";

const synthetic = [{ authors: "test", year: 2026, title: "synthetic", publication: "tests" }];
const scaled = (k: number) =>
  defineCalculation({
    id: "catalogTestScaled",
    title: "Scaled",
    description: "y = k·x",
    inputs: { x: { unit: "1", description: "x", range: { min: -10, max: 10 } } },
    outputs: { y: { unit: "1", description: "y" } },
    formula: ({ x }) => ({ y: k * x }),
    formulaText: "y = k·x",
    citations: synthetic,
    cautions: [],
  });

Deno.test("fingerprints tell apart calculations that share an id and a formula's source text", () => {
  const two = scaled(2), three = scaled(3);
  assert.equal(two.formula.toString(), three.formula.toString());
  assert.notEqual(fingerprint(two), fingerprint(three));
  assert.equal(fingerprint(two), fingerprint(scaled(2)));
  assert.match(fingerprint(simplifiedBernoulli), /^[0-9a-f]{64}$/);
});

Deno.test("the catalog registers every calculation once and refuses two under one id", () => {
  for (const c of CATALOG.calculations.values()) {
    assert.equal(rebuild(CATALOG, c.recipe), c, c.id);
    // every input and output of a registered calculation is a declared quantity, never an
    // ad-hoc one made on the spot
    for (const d of [...Object.values(c.inputs), ...Object.values(c.outputs)]) {
      assert.ok(isQuantity(d.quantity));
      assert.equal(QUANTITIES.get(d.quantity.id), d.quantity, `${c.id}: ${d.quantity.id}`);
    }
  }
  assert.throws(() => defineCatalog({ calculations: [scaled(2), scaled(3)] }), {
    name: "TypeError",
    message:
      "Catalog: two different calculations share the id 'catalogTestScaled'; give each its own id",
  });
  assert.equal(combineCatalogs([CATALOG, CATALOG]).calculations.size, CATALOG.calculations.size);
});

Deno.test("families: every documented member is listed, made once, and made again from its data", () => {
  const all = catalogCalculations(CATALOG);
  for (const model of Object.values(PHN_2017_MODELS)) {
    assert.ok(all.some((c) => c.id === `zScore(${model.id})`), model.id);
  }
  assert.ok(all.some((c) => c.id === "indexedToBsa(lvMass)"));
  const z = zScoreCalculation(PHN_2017_MODELS.lvMass);
  assert.equal(z, Z_SCORE.calculation(PHN_2017_MODELS.lvMass));
  const again = rebuild(CATALOG, structuredClone(z.recipe));
  assert.equal(again.id, z.id);
  assert.equal(fingerprint(again), fingerprint(z));
  assert.equal(rebuild(CATALOG, indexedToBsa(LV_MASS).recipe), indexedToBsa(LV_MASS));
  assert.throws(() => rebuild(CATALOG, { kind: "family", family: "nope", parameter: 1 }), {
    name: "TypeError",
    message:
      /family 'nope' is not registered; expected one of indexedToBsa, zScore, atTrueSoundSpeed, got 'nope'/,
  });
  assert.throws(() => rebuild(CATALOG, { kind: "local", why: "made in a test" }), {
    name: "TypeError",
    message: "Catalog: this calculation cannot be made again elsewhere: made in a test",
  });
});

Deno.test("defineFamily: the member of one parameter is made once; its recipe carries the data", () => {
  const family = defineFamily<number>({
    id: "catalogTestFamily",
    title: "Scaled family",
    description: "y = k·x",
    members: [2, 3],
    key: String,
    define: (k) => ({ ...scaled(k), id: `catalogTestFamily(${k})` }),
  });
  const two = family.calculation(2);
  assert.equal(family.calculation(2), two);
  assert.deepEqual(two.recipe, { kind: "family", family: "catalogTestFamily", parameter: 2 });
  // y = 2·4 = 8 (arithmetic)
  assert.equal(evaluate(family.fromData(2), { x: 4 }).outputs.y, 8);
});
