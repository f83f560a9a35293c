import assert from "node:assert/strict";
import * as sonorigor from "../../mod.ts";
import {
  BODY_SURFACE_AREA,
  defineQuantity,
  formatRange,
  headerMatches,
  HEIGHT,
  isQuantity,
  LVOT_DIAMETER,
  normalizeHeader,
  QUANTITIES,
  rangeWithin,
  readAmount,
  typicalRange,
} from "../../mod.ts";

const base = {
  id: "demoQuantity",
  label: "Demo",
  unit: "cm",
  description: "demo",
  valid: { min: 0, max: 10 },
  resolution: 0.1,
};

Deno.test("defineQuantity rejects malformed declarations with the field and value", () => {
  assert.throws(() => defineQuantity({ ...base, id: "no spaces" }), {
    name: "TypeError",
    message: "Quantity 'no spaces': expected an id of letters and digits, got no spaces",
  });
  assert.throws(() => defineQuantity({ ...base, valid: { min: 5, max: 1 } }), {
    name: "TypeError",
    message: `Quantity 'demoQuantity': expected a non-empty valid range, got {"min":5,"max":1}`,
  });
  assert.throws(() => defineQuantity({ ...base, typical: { min: 5, max: 20 } }), {
    name: "TypeError",
    message:
      "Quantity 'demoQuantity': expected the typical range inside the valid range [0, 10] cm, got [5, 20] cm",
  });
  assert.throws(() => defineQuantity({ ...base, resolution: 0 }), {
    name: "TypeError",
    message: "Quantity 'demoQuantity': expected a resolution > 0, got 0",
  });
});

Deno.test("headers match a quantity by id, label or alias, whatever the case, spacing or unit", () => {
  for (const header of ["lvotDiameter", "LVOT diameter [mm]", "lvot_d", "LVOT-Diameter", "LVOTd"]) {
    assert.ok(headerMatches(LVOT_DIAMETER, header), header);
  }
  assert.equal(headerMatches(LVOT_DIAMETER, "rvot diameter"), false);
  assert.equal(normalizeHeader("Body_Surface.Area [m^2]"), "body surface area");
});

Deno.test("typical ranges: children fall back to adults where no pediatric range is declared", () => {
  assert.deepEqual(typicalRange(HEIGHT, "pediatric"), { min: 45, max: 190 });
  const noChildren = defineQuantity({ ...base, typical: { min: 1, max: 2 } });
  assert.deepEqual(typicalRange(noChildren, "pediatric"), { min: 1, max: 2 });
});

Deno.test("every exported quantity is listed once in QUANTITIES, with a sane declaration", () => {
  const exported = Object.values(sonorigor).filter(isQuantity);
  const ids = new Set<string>();
  for (const q of exported) {
    assert.equal(QUANTITIES.get(q.id), q, `${q.id} is exported but not listed`);
    assert.ok(!ids.has(q.id), `${q.id} twice`);
    ids.add(q.id);
  }
  for (const q of QUANTITIES.values()) {
    const where = `${q.id} (${q.label})`;
    // a label a clinician reads: not the code identifier
    assert.notEqual(q.label, q.id, where);
    assert.doesNotMatch(q.label, /^[a-z]+[A-Z]/, where);
    for (const r of [q.typical, q.typicalPediatric]) {
      if (r) assert.ok(rangeWithin(r, q.valid), `${where}: ${formatRange(r, q.unit)}`);
    }
    assert.ok(q.resolution > 0, where);
    // the unit is one the unit engine reads (or a plain label for %, 1, dB, bpm)
    const one = q.unit === "1" ? "1" : `1 ${q.unit}`;
    assert.equal(typeof readAmount(one, q.unit), "number", `${where}: unit ${q.unit}`);
  }
  // no two quantities claim one header
  const claimed = new Map<string, string>();
  for (const q of QUANTITIES.values()) {
    for (const h of [q.id, q.label, ...q.headers].map(normalizeHeader)) {
      const before = claimed.get(h);
      assert.ok(before === undefined || before === q.id, `header '${h}': ${before} and ${q.id}`);
      claimed.set(h, q.id);
    }
  }
  assert.ok(QUANTITIES.get("bsa") === BODY_SURFACE_AREA);
});
