import assert from "node:assert/strict";
import {
  CATALOG,
  CLINICAL_CAUTION,
  continuityValveArea,
  DOPPLER_CALCULATIONS,
  evaluate,
  fingerprint,
  FLOW_QUANTITIES,
  isQuantity,
  mitralValveAreaPressureHalfTime,
  pisaFlowRate,
  pisaRegurgitation,
  QUANTITIES,
  rebuild,
  rvSystolicPressure,
  rvSystolicPressureFromIvc,
  simplifiedBernoulli,
} from "../../mod.ts";
import * as flow from "../../calc/quantities/flow.ts";

Deno.test("calculations reaching a patient decision carry the clinical caution", () => {
  // HELPER_RULES: clinical results carry the standard caution (project rule, no outside source)
  for (
    const calc of [simplifiedBernoulli, continuityValveArea, pisaFlowRate, rvSystolicPressure]
  ) {
    assert.equal(calc.clinical, true, calc.id);
  }
  assert.ok(
    evaluate(mitralValveAreaPressureHalfTime, { phtMs: 220 }).cautions.includes(CLINICAL_CAUTION),
  );
});

Deno.test("every input and output is a declared quantity; every narrowing says why", () => {
  // Project rule (issue 11): one vocabulary of quantities, narrowed ranges carry a reason
  for (const calc of DOPPLER_CALCULATIONS) {
    const defs = [...Object.values(calc.inputs), ...Object.values(calc.outputs)];
    for (const d of defs) {
      assert.equal(QUANTITIES.get(d.quantity.id), d.quantity, `${calc.id}: ${d.label}`);
    }
    for (const [name, d] of Object.entries(calc.inputs)) {
      const q = d.quantity;
      if (d.range !== q.valid || d.typical !== q.typical) {
        assert.ok(d.narrowedBecause, `${calc.id}.${name} narrows ${q.label} without a reason`);
      }
    }
    assert.ok(calc.citations.length > 0, calc.id);
  }
});

Deno.test("FLOW_QUANTITIES lists every quantity the flow module exports", () => {
  const exported = Object.values(flow).filter(isQuantity);
  assert.equal(exported.length, FLOW_QUANTITIES.length);
  for (const q of exported) assert.ok(FLOW_QUANTITIES.includes(q), q.id);
});

Deno.test("the chains are registered by id and rebuilt from their steps in another thread", () => {
  // a worker makes a chain again from its recipe; the fingerprint proves it is the same
  for (const c of [pisaRegurgitation, rvSystolicPressureFromIvc]) {
    assert.equal(CATALOG.calculations.get(c.id), c);
    assert.equal(c.recipe.kind, "chain");
    const again = rebuild(CATALOG, c.recipe);
    assert.equal(again.id, c.id);
    assert.equal(again.title, c.title);
    assert.equal(fingerprint(again), fingerprint(c));
  }
});
