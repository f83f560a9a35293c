import assert from "node:assert/strict";
import { defineCatalog, type Family, fingerprint, rebuild } from "../../calc/core/mod.ts";
import { INDEXED_TO_BSA } from "../../calc/body/mod.ts";
import { QUANTITIES } from "../../calc/quantities/mod.ts";
import { CHAMBER_CALCULATIONS, discSummationVolume } from "../../calc/chamber/mod.ts";

// The chamber domain's registrations with the one family its chains use (indexing to BSA): a
// chain whose step is not registered here cannot be made again in a worker.
const CATALOG = defineCatalog({
  calculations: CHAMBER_CALCULATIONS,
  families: [INDEXED_TO_BSA] as Family<never>[],
});

Deno.test("every chamber calculation is registered and made again from its recipe", () => {
  for (const c of CHAMBER_CALCULATIONS) {
    assert.equal(CATALOG.calculations.get(c.id), c, c.id);
    // chains are rebuilt from their steps' recipes: every step must be registered too
    assert.equal(fingerprint(rebuild(CATALOG, c.recipe)), fingerprint(c), c.id);
  }
});

Deno.test("chamber inputs and outputs are the package's quantities; narrowing has a reason", () => {
  for (const c of CHAMBER_CALCULATIONS) {
    for (const [name, d] of [...Object.entries(c.inputs), ...Object.entries(c.outputs)]) {
      assert.equal(QUANTITIES.get(d.quantity.id), d.quantity, `${c.id}.${name}`);
    }
    for (const [name, d] of Object.entries(c.inputs)) {
      const narrowed = d.range !== d.quantity.valid || d.typical !== d.quantity.typical;
      assert.ok(!narrowed || d.narrowedBecause, `${c.id}.${name} narrows without a reason`);
    }
  }
  // Counts are integer quantities.
  assert.equal(discSummationVolume.inputs.discCount.quantity.integer, true);
});
