import assert from "node:assert/strict";
import {
  bsaHaycock,
  bsaMosteller,
  continuityValveArea,
  evaluate,
  evaluateTable,
  indexedToBsa,
  LV_MASS,
  normal,
  PHN_2017_MODELS,
  propagate,
  propagateRow,
  readTable,
  renderIssue,
  zScore,
  zScoreCalculation,
} from "../../mod.ts";

const numeric = (t: ReturnType<typeof readTable>, name: string): Float64Array => {
  const c = t.columns.get(name);
  assert.ok(c?.kind === "numeric", `${name} is a numeric column`);
  return c.values;
};
const LVEDD = PHN_2017_MODELS.lvEndDiastolicDimension;
const ROOT = PHN_2017_MODELS.aorticRootSinus;
const MASS = PHN_2017_MODELS.lvMass;

Deno.test("the demo pediatric list: BSA, Z-scores and the LV mass index for every row, as one patient gives them", async () => {
  // examples/data/pediatric_clinic.csv is INVENTED demo data; the check is that the table path
  // gives exactly what the validated one-patient path gives (same formulas, one definition each)
  const table = readTable(
    await Deno.readTextFile(new URL("../../examples/data/pediatric_clinic.csv", import.meta.url)),
    { population: "pediatric" },
  );
  const r = evaluateTable(table, [
    bsaHaycock,
    zScoreCalculation(LVEDD),
    zScoreCalculation(ROOT),
    zScoreCalculation(MASS),
    indexedToBsa(LV_MASS),
  ], { population: "pediatric" });
  const h = numeric(r, "height"),
    w = numeric(r, "weight"),
    x = numeric(r, "lvEndDiastolicDiameter");
  for (let i = 0; i < r.rowCount; i++) {
    assert.equal(
      numeric(r, "bsa")[i],
      evaluate(bsaHaycock, { heightCm: h[i]!, weightKg: w[i]! }).outputs.bsaM2,
    );
    assert.equal(
      numeric(r, `zScore.${LVEDD.id}`)[i],
      zScore(LVEDD, { measurement: x[i]!, heightCm: h[i]!, weightKg: w[i]! }).zScore,
    );
  }
  // a missing LV mass gives no Z-score and no index, with a note naming the row's line
  assert.ok(Number.isNaN(numeric(r, `zScore.${MASS.id}`)[0]!));
  assert.ok(Number.isNaN(numeric(r, "lvMassIndex")[0]!));
  assert.ok(
    r.issues.some((i) => i.line === 2 && i.kind === "notMeasured" && i.label === "LV mass"),
  );
  assert.ok(Number.isFinite(numeric(r, "lvMassIndex")[1]!));
});

Deno.test("a BSA outside a model's range is flagged on its row, with the reason", () => {
  const t = readTable("height [cm],weight [kg],lvedd [cm]\n120,22,3.6\n190,120,6.0\n", {
    population: "pediatric",
  });
  const r = evaluateTable(t, [bsaHaycock, zScoreCalculation(LVEDD)], { population: "pediatric" });
  // Haycock BSA at 190 cm, 120 kg: 0.024265·120^0.5378·190^0.3964 = 2.5495 m² (hand computation
  // of the published formula, checked with Python), above the model's upper BSA of 2.4 m²
  assert.ok(Math.abs(numeric(r, "bsa")[1]! - 2.5495) < 0.0001);
  const flag = r.issues.find((i) => i.row === 1 && i.kind === "typical")!;
  assert.match(
    renderIssue(flag),
    /^Z-score: LV end-diastolic diameter \(Lopez 2017\): line 3, 'bsaM2' \(Body surface area\) = 2\.54954 m² lies outside the typical range \[0\.15, 2\.4\] m² \(the BSA range of the reference population of Lopez 2017\): interpret with care$/,
  );
  assert.equal(r.issues.filter((i) => i.row === 0 && i.kind === "typical").length, 0);
});

Deno.test("inputs wired by name, by quantity or by hand; an unwired input is a clear error", () => {
  const t = readTable("id,h [cm],w [kg]\nA,180,80\n", { columns: { h: "height", w: "weight" } });
  // Mosteller: √(180·80/3600) = 2 m² (Mosteller 1987, hand computation)
  assert.equal(numeric(evaluateTable(t, bsaMosteller), "bsa")[0], 2);
  const odd = readTable("id,a [cm],b [kg]\nA,180,80\n", { columns: { a: "height", b: "weight" } });
  assert.equal(
    numeric(evaluateTable(odd, bsaMosteller, { inputs: { heightCm: "height" } }), "bsa")[0],
    2,
  );
  assert.throws(() => evaluateTable(readTable("id,height [cm]\nA,180\n"), bsaMosteller), {
    name: "TypeError",
    message:
      "Body surface area (Mosteller): no column for input 'weightKg' (Weight); expected a column of Weight (kg), got columns id, height; wire it with the option inputs",
  });
});

Deno.test("with uncertainty models: GUM per row equals one propagation, with u and interval columns", () => {
  const t = readTable(
    "patient,lvot diameter [mm],lvot vti [cm],av vti [cm]\nA,20,20,80\nB,22,24,90\n",
  );
  const models = {
    lvotDiameter: { standardUncertainty: "0.8 mm" },
    lvotVti: { relative: 0.06 },
    aorticVti: { relative: 0.05 },
  } as const;
  const r = evaluateTable(t, continuityValveArea, { uncertainty: models });
  const single = propagate(continuityValveArea, {
    lvotDiameterCm: normal(2, 0.08),
    lvotVtiCm: normal(20, 1.2),
    avVtiCm: normal(80, 4),
  });
  const ava = single.outputs.avaCm2;
  const name = [...r.columns.keys()].find((k) =>
    r.columns.get(k)!.kind === "numeric" &&
    (r.columns.get(k) as { role: string }).role === "value" &&
    (r.columns.get(k) as { computed: boolean }).computed
  )!;
  assert.equal(numeric(r, name)[0], ava.value);
  assert.equal(numeric(r, `${name} u`)[0], ava.standardUncertainty);
  assert.equal(numeric(r, `${name} lower`)[0], ava.interval.lower);
  assert.equal(numeric(r, `${name} upper`)[0], ava.interval.upper);
  // rows are distinct measurements: their sources are labelled by the patient column
  assert.ok(Number.isFinite(numeric(r, `${name} u`)[1]!));
});

Deno.test("propagateRow gives one row's propagation in full, the same numbers as the table's", () => {
  const t = readTable(
    "patient,lvot diameter [mm],lvot vti [cm],av vti [cm]\nA,20,20,80\nB,22,24,90\nC,,24,90\n",
  );
  const options = {
    uncertainty: { lvotDiameter: { standardUncertainty: "0.8 mm" }, lvotVti: { relative: 0.06 } },
    method: "monteCarlo",
    trials: 20_000,
    seed: 11,
  } as const;
  const table = evaluateTable(t, continuityValveArea, options);
  const b = propagateRow(t, continuityValveArea, 1, options);
  // same seed, same row label, same streams: bit-identical to the table's row (JCGM 101 §7 run
  // reproduced by its seed)
  assert.equal(b.outputs.avaCm2.value, numeric(table, "aorticValveArea")[1]);
  assert.equal(b.outputs.avaCm2.interval.upper, numeric(table, "aorticValveArea upper")[1]);
  assert.equal(b.outputs.avaCm2.samples!.length, 20_000);
  // a row that cannot be computed is refused with the table's issue (line 4: no LVOT diameter)
  assert.throws(() => propagateRow(t, continuityValveArea, 2, options), {
    name: "RangeError",
    message: /^Continuity valve area \(VTI\): line 4, /,
  });
  assert.throws(() => propagateRow(t, continuityValveArea, 3, options), {
    name: "RangeError",
    message: "Continuity valve area (VTI): expected a row index in [0, 2], got 3",
  });
});
