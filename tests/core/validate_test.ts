import assert from "node:assert/strict";
import {
  checkInputs,
  checkValue,
  defineArguments,
  discSummationVolume,
  evaluate,
  HEIGHT,
  InputTypeError,
  issueError,
  quantityField,
  renderIssue,
  validateInputs,
  WEIGHT,
} from "../../mod.ts";

// The validator's conventions (DEVELOPERS.md, "Errors"): every message names the field, the value
// received and the valid range; TypeError for type, unit, name and shape, RangeError for a value
// outside its domain. Ranges of height and weight: common practice, no source.

const height = quantityField(HEIGHT);

Deno.test("checkValue: converts, checks the range, flags the typical range", () => {
  // 1.8 m = 180 cm (SI definition of the prefixes)
  assert.deepEqual(checkValue("heightCm", height, "1.8 m", { where: "Demo" }), {
    value: 180,
    issues: [],
  });
  const tall = checkValue("heightCm", height, 250, { where: "Demo" });
  assert.equal(tall.value, 250);
  assert.equal(tall.issues[0]!.kind, "typical");
  assert.equal(
    renderIssue(tall.issues[0]!),
    "Demo: 'heightCm' (Height) = 250 cm lies outside the typical range [140, 210] cm: interpret with care",
  );
  // children have their own typical range
  assert.deepEqual(
    checkValue("heightCm", height, 80, { where: "Demo", population: "pediatric" }).issues,
    [],
  );
});

Deno.test("checkValue: every failure names the field, the value and the valid range", () => {
  const cases: [unknown, string, string][] = [
    [
      undefined,
      "missing",
      "Demo: missing input 'h' (Height): expected a value in [15, 280] cm, got nothing",
    ],
    [
      true,
      "type",
      "Demo: expected 'h' (Height) as a number or a quantity in [15, 280] cm, got true",
    ],
    [
      "2 kg",
      "unit",
      `Demo: expected 'h' (Height) in [15, 280] cm (a unit convertible to cm), got "2 kg"`,
    ],
    [NaN, "range", "Demo: expected 'h' (Height) in [15, 280] cm, got NaN"],
    [-Infinity, "range", "Demo: expected 'h' (Height) in [15, 280] cm, got -Infinity"],
    ["3 m", "range", `Demo: expected 'h' (Height) in [15, 280] cm, got "3 m" (300 cm)`],
  ];
  for (const [raw, kind, message] of cases) {
    const r = checkValue("h", height, raw, { where: "Demo" });
    assert.equal(r.value, undefined);
    assert.equal(r.issues[0]!.kind, kind);
    assert.equal(renderIssue(r.issues[0]!), message);
  }
});

Deno.test("checkValue: a table cell carries its line", () => {
  const r = checkValue("height [cm]", height, 9, { where: "clinic.csv", row: 3, line: 5 });
  assert.equal(
    renderIssue(r.issues[0]!),
    "clinic.csv: line 5, expected 'height [cm]' (Height) in [15, 280] cm, got 9",
  );
});

Deno.test("checkValue: counts accept whole numbers only", () => {
  const count = { label: "Disc count", unit: "1", range: { min: 1, max: 100 }, integer: true };
  assert.equal(checkValue("discs", count, 20, { where: "Demo" }).value, 20);
  const r = checkValue("discs", count, 2.5, { where: "Demo" });
  assert.equal(r.value, undefined);
  assert.equal(
    renderIssue(r.issues[0]!),
    "Demo: expected 'discs' (Disc count) as a whole number in [1, 100], got 2.5",
  );
  // a calculation's input takes the flag from its quantity (a count of discs is whole: the
  // method of discs divides the long axis into N equal slices: common practice, no source)
  assert.throws(
    () =>
      evaluate(discSummationVolume, { diameterProductSumCm2: 300, longAxisCm: 8, discCount: 2.5 }),
    { name: "RangeError", message: /'discCount' \(.*\) as a whole number in .*, got 2\.5/ },
  );
});

Deno.test("checkInputs collects every issue; validateInputs throws the first with all attached", () => {
  const schema = defineArguments("Body size", { heightCm: HEIGHT, weightKg: WEIGHT });
  const r = checkInputs(schema, { heightCm: "tall", weightKg: 700, extra: 1 });
  assert.deepEqual(r.issues.map((i) => i.kind), ["unknown", "type", "range"]);
  assert.throws(() => validateInputs(schema, { heightCm: "tall", weightKg: 700 }), (e) => {
    assert.ok(e instanceof InputTypeError);
    assert.equal(
      e.message,
      `Body size: expected 'heightCm' (Height) as a number or a quantity in [15, 280] cm, got "tall" (and 1 more problem)`,
    );
    assert.equal(e.issues.length, 2);
    return true;
  });
  assert.throws(() => validateInputs(schema, null), {
    name: "TypeError",
    message: "Body size: expected 'inputs' as an object with heightCm, weightKg, got null",
  });
});

Deno.test("issueError refuses a list without errors", () => {
  assert.throws(() => issueError([]), {
    name: "TypeError",
    message: "issueError: expected at least one error among the issues, got none",
  });
});
