import assert from "node:assert/strict";
import { evaluate } from "../../calc/core/mod.ts";
import { bsaMosteller, indexedToBsa } from "../../calc/body/mod.ts";
import { LV_MASS } from "../../calc/quantities/structure.ts";
import { namedChain } from "../../calc/chamber/named_chain.ts";

const INDEX_STEP = {
  calculation: indexedToBsa(LV_MASS),
  inputs: { lvMass: "massG" },
  outputs: { lvMassIndex: "indexGPerM2" },
};

Deno.test("named chain: typed by its names, checked when made", () => {
  const c = namedChain(
    { inputs: ["heightCm", "weightKg", "massG"], outputs: ["bsaM2", "indexGPerM2"] },
    [bsaMosteller, INDEX_STEP],
    { id: "demoNamedChain" },
  );
  // Mosteller √(170·72/3600) = √3.4 = 1.84391 m² (N Engl J Med 1987, hand computation);
  // 150 g / 1.84391 m² = 81.349 g/m².
  const r = evaluate(c, { heightCm: 170, weightKg: 72, massG: 150 }).outputs;
  assert.ok(Math.abs(r.bsaM2 - Math.sqrt(3.4)) < 1e-12);
  assert.ok(Math.abs(r.indexGPerM2 - 150 / Math.sqrt(3.4)) < 1e-9);
  assert.throws(
    () =>
      namedChain({ inputs: ["heightCm", "massG"], outputs: ["indexGPerM2"] }, [
        bsaMosteller,
        INDEX_STEP,
      ], { id: "demoWrong", title: "Demo" }),
    {
      name: "TypeError",
      message: "Chain 'Demo': expected the inputs heightCm, massG, got heightCm, weightKg, massG",
    },
  );
});
