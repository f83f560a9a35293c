import assert from "node:assert/strict";
import { CLINICAL_CAUTION, defineCalculation, evaluate, toCanonical } from "../../mod.ts";
import { math } from "../../calc/core/units.ts";

// A small calculation for exercising the machinery: continuity-equation valve area,
// AVA = π(D/2)²·VTI_LVOT/VTI_AV (Baumgartner et al., J Am Soc Echocardiogr 2009;22:1–23, eq. in text).
const area = defineCalculation({
  id: "testContinuity",
  title: "Test continuity area",
  description: "continuity equation for the tests of the core",
  inputs: {
    lvotDiameterCm: {
      unit: "cm",
      description: "LVOT diameter",
      range: { min: 0, max: 5, minExclusive: true },
      typical: { min: 1.6, max: 3 },
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
  outputs: { areaCm2: { unit: "cm^2", description: "valve area" } },
  formula: ({ lvotDiameterCm, lvotVtiCm, valveVtiCm }) => ({
    areaCm2: Math.PI * (lvotDiameterCm / 2) ** 2 * lvotVtiCm / valveVtiCm,
  }),
  formulaText: "AVA = π(D/2)²·VTI_LVOT/VTI_AV",
  sources: [{
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
    /'lvotDiameterCm' = 3.5 cm lies outside the validated range \[1.6, 3\] cm/,
  );
});

Deno.test("bad input: wrong unit, unknown and missing inputs, out of range, NaN, Infinity", () => {
  const ok = { lvotDiameterCm: 2, lvotVtiCm: 20, valveVtiCm: 80 };
  assert.throws(() => evaluate(area, { ...ok, lvotDiameterCm: "21 mmHg" }), {
    name: "TypeError",
    message:
      "Test continuity area: 'lvotDiameterCm': expected a quantity convertible to cm, got \"21 mmHg\"",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotDiameter: 2 } as never), {
    name: "TypeError",
    message: /unknown input 'lvotDiameter'; expected one of lvotDiameterCm, lvotVtiCm, valveVtiCm/,
  });
  assert.throws(() => evaluate(area, { lvotVtiCm: 20, valveVtiCm: 80 }), {
    name: "TypeError",
    message: /missing input 'lvotDiameterCm' \(LVOT diameter, cm\)/,
  });
  assert.throws(() => evaluate(area, { ...ok, lvotDiameterCm: 0 }), {
    name: "RangeError",
    message: "Test continuity area: expected 'lvotDiameterCm' in (0, 5] cm, got 0",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotDiameterCm: NaN }), {
    name: "RangeError",
    message: "Test continuity area: expected 'lvotDiameterCm' in (0, 5] cm, got NaN",
  });
  assert.throws(() => evaluate(area, { ...ok, valveVtiCm: Infinity }), {
    name: "RangeError",
    message: "Test continuity area: expected 'valveVtiCm' in (0, 300] cm, got Infinity",
  });
  assert.throws(() => evaluate(area, { ...ok, lvotVtiCm: true } as never), {
    name: "TypeError",
    message: /expected 'lvotVtiCm' as a number or a quantity string, got true/,
  });
  assert.throws(() => evaluate(area, { ...ok, lvotVtiCm: "twenty cm" }), {
    name: "TypeError",
    message: /lvotVtiCm/,
  });
});

Deno.test("evaluate does not mutate its arguments", () => {
  const args = Object.freeze({ lvotDiameterCm: "2 cm", lvotVtiCm: 20, valveVtiCm: 80 });
  evaluate(area, args);
  assert.deepEqual(args, { lvotDiameterCm: "2 cm", lvotVtiCm: 20, valveVtiCm: 80 });
});

Deno.test("defineCalculation rejects a spec without sources or with an empty range", () => {
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
  assert.throws(() => defineCalculation({ ...base, sources: [] }), {
    name: "TypeError",
    message: "Broken: expected at least one published source, got none",
  });
  assert.throws(
    () =>
      defineCalculation({
        ...base,
        inputs: { a: { unit: "1", description: "a", range: { min: 2, max: 1 } } },
        sources: [{ authors: "a", year: 1, title: "t", publication: "p" }],
      }),
    { name: "TypeError", message: /input 'a' has an empty range/ },
  );
});

Deno.test("a non-finite output is an error, never a silent NaN", () => {
  const bad = defineCalculation({
    id: "bad",
    title: "Log ratio",
    description: "",
    inputs: { a: { unit: "1", description: "a", range: { min: -1, max: 1 } } },
    outputs: { b: { unit: "1", description: "b" } },
    formula: ({ a }) => ({ b: Math.log(a) }),
    formulaText: "b = ln a",
    sources: [{ authors: "a", year: 1, title: "t", publication: "p" }],
    cautions: [],
  });
  assert.throws(() => evaluate(bad, { a: -0.5 }), {
    name: "RangeError",
    message: "Log ratio: output 'b' is not finite for a = -0.5, got NaN",
  });
});

Deno.test("display: an evaluation offers HTML and text/plain", () => {
  const r = evaluate(area, { lvotDiameterCm: 2, lvotVtiCm: 20, valveVtiCm: 80 });
  const bundle = (r as unknown as Record<symbol, () => Record<string, string>>)[
    Symbol.for("Jupyter.display")
  ]!();
  assert.match(bundle["text/html"]!, /<table/);
  assert.match(bundle["text/plain"]!, /areaCm2\s+0\.785398/);
});

Deno.test("cross-input constraints are checked in evaluation and propagation", async () => {
  const { ejectionFraction, gum, normal } = await import("../../mod.ts");
  // EF = 100·(EDV − ESV)/EDV needs ESV ≤ EDV (Lang et al. 2015, LV systolic function; common practice)
  assert.throws(
    () => evaluate(ejectionFraction, { endDiastolicVolumeMl: 50, endSystolicVolumeMl: 60 }),
    {
      name: "RangeError",
      message:
        "Ejection fraction: expected 'endSystolicVolumeMl' <= 'endDiastolicVolumeMl', got endSystolicVolumeMl = 60, endDiastolicVolumeMl = 50",
    },
  );
  assert.throws(
    () =>
      gum(ejectionFraction, {
        endDiastolicVolumeMl: normal(50, 3),
        endSystolicVolumeMl: normal(60, 3),
      }),
    { name: "RangeError", message: /expected 'endSystolicVolumeMl' <= 'endDiastolicVolumeMl'/ },
  );
});

Deno.test("unit conversion leaves no floating-point residue from the SI round trip", () => {
  // 21 mm = 2.1 cm and 3.5 cm = 3.5 cm exactly (common practice, no source)
  assert.equal(toCanonical("21 mm", "cm", "t"), 2.1);
  assert.equal(toCanonical("3.5 cm", "cm", "t"), 3.5);
  assert.equal(toCanonical("0.8 m/s", "cm/s", "t"), 80);
});
