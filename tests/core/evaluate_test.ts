import assert from "node:assert/strict";
import {
  CLINICAL_CAUTION,
  defineCalculation,
  defineQuantity,
  evaluate,
  InputRangeError,
  LVOT_DIAMETER,
  normal,
  propagate,
  toCanonical,
} from "../../mod.ts";
import { math } from "../../calc/core/units.ts";

// A small calculation for exercising the machinery: continuity-equation valve area,
// AVA = π(D/2)²·VTI_LVOT/VTI_AV (Baumgartner et al., J Am Soc Echocardiogr 2009;22:1–23, eq. in text).
const area = defineCalculation({
  id: "testContinuity",
  title: "Test continuity area",
  description: "continuity equation for the tests of the core",
  inputs: {
    lvotDiameterCm: {
      quantity: LVOT_DIAMETER,
      typical: { min: 1.6, max: 3 },
      reason: "the adult range of the test",
    },
    lvotVtiCm: {
      unit: "cm",
      description: "LVOT VTI",
      range: { min: 0, max: 100, minExclusive: true },
    },
    valveVtiCm: {
      unit: "cm",
      description: "Valve VTI",
      range: { min: 0, max: 300, minExclusive: true },
    },
  },
  outputs: {
    areaCm2: defineQuantity({
      id: "testValveArea",
      label: "Valve area",
      unit: "cm^2",
      description: "valve area",
      valid: { min: 0, max: 10, minExclusive: true },
      resolution: 0.01,
    }),
  },
  formula: ({ lvotDiameterCm, lvotVtiCm, valveVtiCm }) => ({
    areaCm2: Math.PI * (lvotDiameterCm / 2) ** 2 * lvotVtiCm / valveVtiCm,
  }),
  formulaText: "AVA = π(D/2)²·VTI_LVOT/VTI_AV",
  citations: [{
    authors: "Baumgartner H, et al.",
    year: 2009,
    title: "Echocardiographic assessment of valve stenosis",
    publication: "J Am Soc Echocardiogr 22:1–23",
  }],
  cautions: ["LVOT diameter error is squared"],
  clinical: true,
});

Deno.test("evaluate converts quantity strings and mathjs units to the canonical unit", () => {
  // hand-checkable: π·1.0²·20/80 = 0.7854 cm² (common practice, no source)
  const a = evaluate(area, { lvotDiameterCm: "20 mm", lvotVtiCm: 20, valveVtiCm: "0.8 m" });
  assert.ok(Math.abs(a.outputs.areaCm2 - Math.PI / 4) < 1e-12);
  const b = evaluate(area, { lvotDiameterCm: math.unit(2, "cm"), lvotVtiCm: "20", valveVtiCm: 80 });
  assert.equal(b.outputs.areaCm2, a.outputs.areaCm2);
  assert.deepEqual(a.inputs, { lvotDiameterCm: 2, lvotVtiCm: 20, valveVtiCm: 80 });
});

Deno.test("evaluate carries the clinical caution and flags values outside the typical range", () => {
  const r = evaluate(area, { lvotDiameterCm: 3.5, lvotVtiCm: 20, valveVtiCm: 80 });
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
  assert.match(
    r.flags[0]!,
    /^Test continuity area: 'lvotDiameterCm' \(LVOT diameter\) = 3\.5 cm lies outside the typical range \[1\.6, 3\] cm \(the adult range of the test\): interpret with care$/,
  );
});

Deno.test("bad input: wrong unit, unknown and missing inputs, out of range, NaN, Infinity", () => {
  const ok = { lvotDiameterCm: 2, lvotVtiCm: 20, valveVtiCm: 80 };
  assert.throws(() => evaluate(area, { ...ok, lvotDiameterCm: "21 mmHg" }), {
    name: "TypeError",
    message:
      "Test continuity area: expected 'lvotDiameterCm' (LVOT diameter) in (0, 5] cm (a unit convertible to cm), got \"21 mmHg\"",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotDiameter: 2 } as never), {
    name: "TypeError",
    message:
      "Test continuity area: unknown input 'lvotDiameter': expected one of lvotDiameterCm, lvotVtiCm, valveVtiCm, got 2",
  });
  assert.throws(() => evaluate(area, { lvotVtiCm: 20, valveVtiCm: 80 }), {
    name: "TypeError",
    message:
      "Test continuity area: missing input 'lvotDiameterCm' (LVOT diameter): expected a value in (0, 5] cm, got nothing",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotDiameterCm: 0 }), {
    name: "RangeError",
    message: "Test continuity area: expected 'lvotDiameterCm' (LVOT diameter) in (0, 5] cm, got 0",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotDiameterCm: NaN }), {
    name: "RangeError",
    message:
      "Test continuity area: expected 'lvotDiameterCm' (LVOT diameter) in (0, 5] cm, got NaN",
  });
  assert.throws(() => evaluate(area, { ...ok, valveVtiCm: Infinity }), {
    name: "RangeError",
    message: "Test continuity area: expected 'valveVtiCm' (Valve VTI) in (0, 300] cm, got Infinity",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotVtiCm: true } as never), {
    name: "TypeError",
    message:
      "Test continuity area: expected 'lvotVtiCm' (LVOT VTI) as a number or a quantity in (0, 100] cm, got true",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotVtiCm: "twenty cm" }), {
    name: "TypeError",
    message:
      "Test continuity area: expected 'lvotVtiCm' (LVOT VTI) as a number or a quantity in (0, 100] cm, got \"twenty cm\"",
  });
  // every problem at once, as structured issues; the message renders the first
  try {
    evaluate(area, { lvotDiameterCm: 0, lvotVtiCm: "x", valveVtiCm: -1 });
    assert.fail("expected an error");
  } catch (e) {
    assert.ok(e instanceof InputRangeError);
    assert.deepEqual(e.issues.map((i) => [i.field, i.kind]), [
      ["lvotDiameterCm", "range"],
      ["lvotVtiCm", "type"],
      ["valveVtiCm", "range"],
    ]);
    assert.match(e.message, /\(and 2 more problems\)$/);
  }
});

Deno.test("evaluate does not mutate its arguments", () => {
  const args = Object.freeze({ lvotDiameterCm: "2 cm", lvotVtiCm: 20, valveVtiCm: 80 });
  evaluate(area, args);
  assert.deepEqual(args, { lvotDiameterCm: "2 cm", lvotVtiCm: 20, valveVtiCm: 80 });
});

Deno.test("defineCalculation leaves the spec's records as they were, frozen or not", () => {
  const role = { unit: "1", description: "a", range: { min: 0, max: 1 } };
  const inputs = { a: role };
  const outputs = Object.freeze({ b: { unit: "1", description: "b" } });
  const c = defineCalculation({
    id: "specUntouched",
    title: "Spec untouched",
    description: "",
    inputs,
    outputs,
    formula: ({ a }) => ({ b: 2 * a }),
    formulaText: "b = 2a",
    citations: [{ authors: "test", year: 2026, title: "t", publication: "t" }],
    cautions: [],
  });
  assert.equal(inputs.a, role);
  assert.deepEqual(Object.keys(inputs), ["a"]);
  assert.deepEqual(outputs, { b: { unit: "1", description: "b" } });
  // the formula's own objects still carry numbers (2 · 0.25 = 0.5, exact in binary)
  assert.equal(evaluate(c, { a: 0.25 }).outputs.b, 0.5);
});

Deno.test("defineCalculation rejects a spec without citations or with an empty range", () => {
  const base = {
    id: "x",
    title: "Broken",
    description: "",
    inputs: { a: { unit: "1", description: "a", range: { min: 0, max: 1 } } },
    outputs: { b: { unit: "1", description: "b" } },
    formula: ({ a }: { a: number }) => ({ b: a }),
    formulaText: "b = a",
    cautions: [],
  };
  assert.throws(() => defineCalculation({ ...base, citations: [] }), {
    name: "TypeError",
    message: "Broken: expected at least one published source, got none",
  });
  assert.throws(
    () =>
      defineCalculation({
        ...base,
        inputs: { a: { unit: "1", description: "a", range: { min: 2, max: 1 } } },
        citations: [{ authors: "a", year: 1, title: "t", publication: "p" }],
      }),
    {
      name: "TypeError",
      message: `Quantity 'x.a': expected a non-empty valid range, got {"min":2,"max":1}`,
    },
  );
});

Deno.test("a non-finite or impossible output is an error naming the inputs, never a silent NaN", () => {
  const bad = defineCalculation({
    id: "bad",
    title: "Log ratio",
    description: "",
    inputs: { a: { unit: "1", description: "a", range: { min: -1, max: 1 } } },
    outputs: { b: { unit: "1", description: "b" } },
    formula: ({ a }) => ({ b: Math.log(a) }),
    formulaText: "b = ln a",
    citations: [{ authors: "a", year: 1, title: "t", publication: "p" }],
    cautions: [],
  });
  assert.throws(() => evaluate(bad, { a: -0.5 }), {
    name: "RangeError",
    message: "Log ratio: output 'b' expected a finite number, got NaN from a = -0.5",
  });
  // an output outside its quantity's valid range: a negative area is impossible
  const negative = defineCalculation({ ...area, formula: () => ({ areaCm2: -1 }) });
  assert.throws(() => evaluate(negative, { lvotDiameterCm: 2, lvotVtiCm: 20, valveVtiCm: 80 }), {
    name: "RangeError",
    message:
      "Test continuity area: output 'areaCm2' (Valve area) expected in (0, 10] cm², got -1 from lvotDiameterCm = 2 cm, lvotVtiCm = 20 cm, valveVtiCm = 80 cm",
  });
});

Deno.test("display: an evaluation offers HTML and text/plain", () => {
  const r = evaluate(area, { lvotDiameterCm: 2, lvotVtiCm: 20, valveVtiCm: 80 });
  const bundle = (r as unknown as Record<symbol, () => Record<string, string>>)[
    Symbol.for("Jupyter.display")
  ]!();
  assert.match(bundle["text/html"]!, /<table/);
  // labels from the quantities with their units; the value to the quantity's resolution (0.01 cm²)
  assert.match(bundle["text/plain"]!, /output\s+Valve area \(cm²\)\s+0\.79/);
  assert.match(bundle["text/plain"]!, /input\s+LVOT diameter \(cm\)\s+2\.00/);
  assert.doesNotMatch(bundle["text/plain"]!, /areaCm2|lvotDiameterCm/);
});

Deno.test("cross-input constraints are checked in evaluation and propagation", async () => {
  const { ejectionFraction } = await import("../../mod.ts");
  // EF = 100·(EDV − ESV)/EDV needs ESV ≤ EDV (Lang et al. 2015, LV systolic function; common practice)
  assert.throws(
    () => evaluate(ejectionFraction, { endDiastolicVolumeMl: 50, endSystolicVolumeMl: 60 }),
    {
      name: "RangeError",
      message:
        "Ejection fraction: expected 'endSystolicVolumeMl' (LV end-systolic volume) ≤ 'endDiastolicVolumeMl' (LV end-diastolic volume), got endSystolicVolumeMl = 60 mL, endDiastolicVolumeMl = 50 mL",
    },
  );
  assert.throws(
    () =>
      propagate(ejectionFraction, {
        endDiastolicVolumeMl: normal(50, 3),
        endSystolicVolumeMl: normal(60, 3),
      }),
    {
      name: "RangeError",
      message:
        /expected 'endSystolicVolumeMl' \(LV end-systolic volume\) ≤ 'endDiastolicVolumeMl' \(LV end-diastolic volume\)/,
    },
  );
});

Deno.test("unit conversion leaves no floating-point residue from the SI round trip", () => {
  // 21 mm = 2.1 cm and 3.5 cm = 3.5 cm exactly (common practice, no source)
  assert.equal(toCanonical("21 mm", "cm", "t"), 2.1);
  assert.equal(toCanonical("3.5 cm", "cm", "t"), 3.5);
  assert.equal(toCanonical("0.8 m/s", "cm/s", "t"), 80);
});
