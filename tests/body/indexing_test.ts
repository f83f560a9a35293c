import assert from "node:assert/strict";
import {
  bsaHaycock,
  bsaMosteller,
  chain,
  evaluate,
  INDEXED_TO_BSA,
  indexedQuantity,
  indexedToBsa,
  LA_VOLUME,
  LV_END_DIASTOLIC_VOLUME,
  LV_MASS,
  normal,
  propagate,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

Deno.test("indexing divides by BSA, one calculation per quantity, named by the guideline where it names one", () => {
  // Lang 2015 indexing: LV mass 190 g at BSA 1.9 m² = 100 g/m² (hand-checkable arithmetic)
  const lvmi = evaluate(indexedToBsa(LV_MASS), { lvMass: 190, bsaM2: 1.9 });
  assert.deepEqual(lvmi.outputs, { lvMassIndex: 100 });
  assert.equal(indexedToBsa(LV_MASS).outputs.lvMassIndex!.label, "LV mass index");
  // 0.12 L = 120 mL over 2 m² = 60 mL/m² (hand-checkable)
  const edvi = evaluate(indexedToBsa(LV_END_DIASTOLIC_VOLUME), {
    lvEndDiastolicVolume: "0.12 L",
    bsaM2: 2,
  });
  close(edvi.outputs.lvEndDiastolicVolumeIndex!, 60, 1e-12, "L to mL");
  assert.equal(
    indexedQuantity(LV_END_DIASTOLIC_VOLUME).label,
    "LV end-diastolic volume indexed to BSA",
  );
  assert.equal(indexedQuantity(LV_END_DIASTOLIC_VOLUME).unit, "mL/m^2");
  assert.throws(() => evaluate(indexedToBsa(LA_VOLUME), { laVolume: 120, bsaM2: 0 }), {
    name: "RangeError",
    message: "LA volume index: expected 'bsaM2' (Body surface area) in (0, 5] m², got 0",
  });
  assert.throws(() => evaluate(indexedToBsa(LA_VOLUME), { laVolume: -1, bsaM2: 1.5 }), {
    name: "RangeError",
    message: "LA volume index: expected 'laVolume' (LA volume) in (0, 1000] mL, got -1",
  });
  assert.equal(
    INDEXED_TO_BSA.calculation(LV_MASS),
    indexedToBsa(LV_MASS),
    "made once per quantity",
  );
});

Deno.test("indexing from height and weight is a chain that reuses the BSA formula", () => {
  const calc = chain([bsaHaycock, indexedToBsa(LV_END_DIASTOLIC_VOLUME)]);
  const r = evaluate(calc, { lvEndDiastolicVolume: 120, heightCm: 180, weightKg: 80 });
  // Haycock 2.00656 m² (hand computation, J Pediatr 1978) → 120 / 2.00656 = 59.8038 mL/m²
  close(r.outputs.bsaM2!, 2.00656, 1e-5, "bsa");
  close(r.outputs.lvEndDiastolicVolumeIndex!, 59.8038, 1e-3, "indexed");
});

Deno.test("an indexed value carries measurement and BSA uncertainty (GUM and Monte Carlo agree)", () => {
  const calc = chain([bsaMosteller, indexedToBsa(LV_END_DIASTOLIC_VOLUME)]);
  const inputs = {
    lvEndDiastolicVolume: normal(120, 6),
    heightCm: normal(180, 1),
    weightKg: normal(80, 0.5),
  };
  const g = propagate(calc, inputs);
  // (u/60)² = 0.05² + 0.0041818² → u = 3.01047 mL/m² (JCGM 100:2008 eq. (12), hand computation)
  close(g.outputs.lvEndDiastolicVolumeIndex!.standardUncertainty, 3.01047, 1e-3, "GUM u indexed");
  // JCGM 101:2008 §8: Monte Carlo validates the GUM result when the model is nearly linear
  const mc = propagate(calc, inputs, { method: "monteCarlo", trials: 200_000, seed: 7 });
  close(mc.outputs.lvEndDiastolicVolumeIndex!.standardUncertainty, 3.01047, 0.03, "MC u indexed");
  // the BSA of one step and the index of the next share height and weight: correlated
  assert.ok(g.correlation[0]![1]! < -0.05);
});
