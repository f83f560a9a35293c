import assert from "node:assert/strict";
import Papa from "papaparse";
import {
  analyzeCohortCsv,
  bsaHaycock,
  bsaMosteller,
  cohortToCsv,
  computeCohort,
  evaluate,
  FLAG_BSA_OUTSIDE_MODEL,
  FLAG_INVALID_INPUT,
  FLAG_MISSING_MEASUREMENT,
  PHN_2017_MODELS,
  readCohortCsv,
  zScore,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what: string) =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what}: expected ${expected} ± ${tol}, got ${actual}`,
  );

const LVEDD = PHN_2017_MODELS.lvEndDiastolicDimension;
const ROOT = PHN_2017_MODELS.aorticRootSinus;
const MASS = PHN_2017_MODELS.lvMass;
const PEDIATRIC_OPTIONS = {
  id: "patient",
  sex: "sex",
  height: "height",
  weight: "weight",
  measurements: [
    { column: "lvedd", canonicalUnit: LVEDD.unit, range: LVEDD.measurementRange },
    {
      column: "aortic root",
      name: "aorticRoot",
      canonicalUnit: ROOT.unit,
      range: ROOT.measurementRange,
    },
    { column: "lv mass", name: "lvMass", canonicalUnit: MASS.unit, range: MASS.measurementRange },
  ],
} as const;

Deno.test("demo pediatric clinic list: every row computed, matching the per-patient path", async () => {
  // examples/data/pediatric_clinic.csv is INVENTED demo data; the check is that the columnar path
  // gives exactly what the validated one-patient path gives (same formulas, one definition each).
  const text = await Deno.readTextFile(
    new URL("../../examples/data/pediatric_clinic.csv", import.meta.url),
  );
  const table = readCohortCsv(text, PEDIATRIC_OPTIONS);
  assert.equal(table.rowCount, 20);
  const result = computeCohort(table, {
    bsaMethod: "haycock",
    index: ["lvMass"],
    zScores: { lvedd: LVEDD, aorticRoot: ROOT, lvMass: MASS },
  });
  for (let i = 0; i < table.rowCount; i++) {
    const h = table.heightCm.values[i]!;
    const w = table.weightKg.values[i]!;
    assert.equal(result.bsaM2[i], evaluate(bsaHaycock, { heightCm: h, weightKg: w }).outputs.bsaM2);
    const lvedd = table.measurements.lvedd!.values[i]!;
    assert.equal(
      result.zScores.lvedd![i],
      zScore(LVEDD, { measurement: lvedd, heightCm: h, weightKg: w }).zScore,
    );
  }
  // mm → cm conversion of the declared header unit: 24 mm = 2.4 cm
  assert.equal(table.measurements.lvedd!.values[0], 2.4);
  // Two empty LV mass cells: flagged as not measured, never dropped
  const missing = table.issues.filter((x) => x.kind === "missing");
  assert.deepEqual(missing.map((x) => [x.line, x.column]), [[2, "lv mass [g]"], [
    20,
    "lv mass [g]",
  ]]);
  assert.ok(result.flags[0]! & FLAG_MISSING_MEASUREMENT);
  assert.ok(Number.isNaN(result.zScores.lvMass![0]!));
  // Round trip through CSV: one output line per input row, flags explain the NaN
  const csv = cohortToCsv(result);
  const out = Papa.parse(csv.trim(), { header: true }).data as Record<string, string>[];
  assert.equal(out.length, 20);
  assert.equal(out[0]!.flags, "lv mass [g] not measured");
  assert.equal(out[0]!["lvMass_z"], "");
  assert.ok(Number.isFinite(Number(out[1]!["lvMass_indexed [g/m^2]"])));
});

Deno.test("column units: header brackets or options, converted to canonical units", () => {
  // 1 in = 2.54 cm and 1 lb = 0.45359237 kg exactly (international yard and pound agreement, 1959)
  const t = readCohortCsv("h,w\n70.8661,176.37\n", {
    height: { column: "h", unit: "inch" },
    weight: { column: "w", unit: "lb" },
  });
  close(t.heightCm.values[0]!, 70.8661 * 2.54, 1e-9, "in → cm");
  close(t.weightKg.values[0]!, 176.37 * 0.45359237, 1e-9, "lb → kg");
  const r = computeCohort(t, { bsaMethod: "mosteller" });
  // ≈ 180 cm, 80 kg → Mosteller ≈ 2.00 m² (Mosteller 1987, hand-checkable)
  close(
    r.bsaM2[0]!,
    evaluate(bsaMosteller, { heightCm: 180.000, weightKg: 80.000 }).outputs.bsaM2,
    1e-4,
    "bsa",
  );
  assert.throws(
    () => readCohortCsv("height,weight [kg]\n180,80\n", { height: "height", weight: "weight" }),
    {
      name: "TypeError",
      message:
        "Cohort CSV: column 'height' has no unit; declare it in the header as 'height [cm]' or in the options, got no unit",
    },
  );
  assert.throws(
    () =>
      readCohortCsv("height [mmHg],weight [kg]\n180,80\n", { height: "height", weight: "weight" }),
    {
      name: "TypeError",
      message: `Cohort CSV: column 'height [mmHg]' must be in a unit convertible to cm, got "mmHg"`,
    },
  );
});

Deno.test("bad cells: line-numbered errors naming the column, by class", () => {
  const csv = "id,height [cm],weight [kg]\nA,180,80\nB,175,abc\nC,900,70\n";
  const options = { id: "id", height: "height", weight: "weight" } as const;
  assert.throws(() => readCohortCsv(csv, options), {
    name: "TypeError",
    message:
      `Cohort CSV (2 invalid cells, first shown; see .issues): line 3, column 'weight [kg]': expected a number in [0.2, 650] kg, got "abc"`,
  });
  assert.throws(() => readCohortCsv("id,height [cm],weight [kg]\nC,900,70\n", options), {
    name: "RangeError",
    message:
      `Cohort CSV: line 2, column 'height [cm]': expected a number in [15, 280] cm, got "900"`,
  });
  assert.throws(() => readCohortCsv("id,height [cm],weight [kg]\nC,180,\n", options), {
    name: "TypeError",
    message: `Cohort CSV: line 2, column 'weight [kg]': expected a number in [0.2, 650] kg, got ""`,
  });
  // Converted units are checked after conversion: 2000 lb = 907 kg is outside the human range
  assert.throws(
    () =>
      readCohortCsv("height [cm],weight [lb]\n180,2000\n", { height: "height", weight: "weight" }),
    {
      name: "RangeError",
      message:
        `Cohort CSV: line 2, column 'weight [lb]': expected a number in [0.2, 650] kg after conversion from lb, got "2000"`,
    },
  );
  assert.throws(() => readCohortCsv("id,height [cm],weight [kg]\nA,180\n", options), {
    name: "TypeError",
    message: "Cohort CSV: line 2: expected 3 fields as in the header, got 2",
  });
  assert.throws(() => readCohortCsv("id,height [cm]\nA,180\n", options), {
    name: "TypeError",
    message: "Cohort CSV: expected a column 'weight' in the header, got 'id', 'height [cm]'",
  });
  assert.throws(
    () =>
      readCohortCsv(
        "h [cm],w [kg]\n1,2\n",
        { height: "h", weight: "w", onInvalid: "drop" } as never,
      ),
    {
      name: "TypeError",
      message: /^Cohort CSV: option 'onInvalid' .*, got "drop"$/,
    },
  );
});

Deno.test("flag policy: invalid rows kept with NaN and a flag; blank and quoted multi-line cells keep line numbers", () => {
  const csv = 'id,height [cm],weight [kg]\n"A\nsecond line",180,80\n\nB,175,abc\nC,170,70\n';
  const t = readCohortCsv(csv, { id: "id", height: "height", weight: "weight", onInvalid: "flag" });
  assert.equal(t.rowCount, 3);
  assert.deepEqual(Array.from(t.lines), [2, 5, 6]);
  assert.deepEqual(t.blankLines, [4]);
  assert.equal(t.issues.length, 1);
  assert.equal(t.issues[0]!.line, 5);
  const r = computeCohort(t, { bsaMethod: "mosteller" });
  assert.ok(Number.isNaN(r.bsaM2[1]!));
  assert.equal(r.flags[1]! & FLAG_INVALID_INPUT, FLAG_INVALID_INPUT);
  // Mosteller √(180·80/3600) = 2 (hand-checkable)
  assert.equal(r.bsaM2[0], 2);
  const lines = cohortToCsv(r).trim().split("\n");
  // CSV quoting (RFC 4180): the flag text contains commas and quotes, so it is quoted and "" escaped
  assert.equal(
    lines.at(-2),
    'B,175,,,"invalid weight [kg] at line 5: expected a number in [0.2, 650] kg, got ""abc"""',
  );
});

Deno.test("BSA outside a model's range is flagged per row in the output", () => {
  const csv = "height [cm],weight [kg],lvedd [cm]\n120,22,3.6\n200,120,6.0\n";
  const { result, csv: out } = analyzeCohortCsv(csv, {
    height: "height",
    weight: "weight",
    measurements: [{ column: "lvedd", canonicalUnit: "cm", range: LVEDD.measurementRange }],
    zScores: { lvedd: LVEDD },
  });
  // Haycock BSA at 200 cm, 120 kg = 2.566 m² (hand computation) > 2.4, the model's upper BSA
  assert.equal(result.bsaOutsideModel.lvedd![1], 1);
  assert.equal(result.flags[1]! & FLAG_BSA_OUTSIDE_MODEL, FLAG_BSA_OUTSIDE_MODEL);
  assert.equal(result.bsaOutsideModel.lvedd![0], 0);
  assert.match(
    out,
    /lvedd: BSA outside the range of model phn2017\.lvEndDiastolicDimension \[0\.15, 2\.4\] m²/,
  );
  assert.throws(() => computeCohort(result.table, { zScores: { lvedd: MASS } }), {
    name: "TypeError",
    message:
      "Cohort: measurement 'lvedd' must be read in the unit of model 'phn2017.lvMass' (g), got cm",
  });
  assert.throws(() => computeCohort(result.table, { index: ["lvesd"] }), {
    name: "TypeError",
    message: "Cohort: expected a measurement in lvedd, got 'lvesd'",
  });
});
