// The physics catalog: every calculation of the domain registered, each input and output a
// declared quantity (no ad-hoc quantity), every narrowed range with its reason.
import assert from "node:assert/strict";
import {
  type Calculation,
  CATALOG,
  isCalculation,
  PHYSICS_CALCULATIONS,
  QUANTITIES,
} from "../../mod.ts";
import * as physics from "../../calc/physics/mod.ts";

Deno.test("every exported physics calculation is in the catalog", () => {
  const exported: Calculation[] = [];
  for (const v of Object.values(physics) as unknown[]) if (isCalculation(v)) exported.push(v);
  assert.equal(exported.length, PHYSICS_CALCULATIONS.length);
  for (const c of exported) {
    assert.ok(PHYSICS_CALCULATIONS.includes(c), c.id);
    assert.equal(CATALOG.calculations.get(c.id), c, c.id);
  }
});

Deno.test("physics inputs and outputs are declared quantities; narrowed ranges say why", () => {
  for (const c of PHYSICS_CALCULATIONS) {
    assert.ok(c.citations.length > 0, `${c.id} cites a source`);
    for (const [name, d] of Object.entries(c.inputs)) {
      assert.equal(QUANTITIES.get(d.quantity.id), d.quantity, `${c.id}.${name}`);
      const narrowed = d.range !== d.quantity.valid || d.typical !== d.quantity.typical;
      if (narrowed) assert.ok(d.narrowedBecause, `${c.id}.${name} narrows without a reason`);
    }
    for (const [name, d] of Object.entries(c.outputs)) {
      assert.equal(QUANTITIES.get(d.quantity.id), d.quantity, `${c.id}.${name}`);
    }
  }
});
