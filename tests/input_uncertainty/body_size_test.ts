import assert from "node:assert/strict";
import {
  bsaMosteller,
  bsaWithFormulaError,
  CATALOG,
  evaluate,
  indexedToBsa,
  LV_MASS,
  normal,
  propagate,
  withBsaFormulaError,
} from "../../mod.ts";
import { close, shownText } from "./helpers.ts";

Deno.test("BSA formula error: the formula's BSA times a factor", () => {
  // 2.0 m² × 1.03 = 2.06 m² (arithmetic)
  close(
    evaluate(bsaWithFormulaError, { formulaBsaM2: 2, bsaFormulaFactor: 1.03 }).outputs.bsaM2,
    2.06,
    1e-12,
    "BSA",
  );
  assert.equal(CATALOG.calculations.get("bsaWithFormulaError"), bsaWithFormulaError);
});

Deno.test("BSA formula error: ±5 % rectangular by default, its source in the budget label", () => {
  const r = withBsaFormulaError(1.9);
  // rectangular over ±a: u = a/√3 (JCGM 100:2008 §4.3.7); a = 5 % from memory of Verbraecken 2006
  close(r.outputs.bsaM2.value, 1.9, 1e-12, "unbiased");
  close(r.outputs.bsaM2.standardUncertainty, (1.9 * 0.05) / Math.sqrt(3), 1e-9, "u");
  assert.equal(
    r.outputs.bsaM2.budget[0]!.label,
    "BSA formula error within ±5 % (Verbraecken 2006, from memory): BSA formula factor",
  );
  assert.ok(r.cautions.some((c) => /^Verbraecken 2006 .*from memory/.test(c)));
  assert.match(shownText(r), /BSA formula error within ±5 % \(Verbraecken 2006, from memory\)/);
  // a wider limit for a very obese patient (Livingston & Lee 2001: up to 20 % with DuBois)
  const wide = withBsaFormulaError(2.4, { limitPercent: 20, limitSource: "Livingston & Lee 2001" });
  close(wide.outputs.bsaM2.standardUncertainty, (2.4 * 0.2) / Math.sqrt(3), 1e-9, "u at ±20 %");
  assert.match(wide.outputs.bsaM2.budget[0]!.label, /±20 % \(Livingston & Lee 2001\)/);
});

Deno.test("BSA formula error: the mark reaches an indexed value's budget through a chain of values", () => {
  const bsa = propagate(bsaMosteller, { heightCm: normal(180, 0.5), weightKg: normal(80, 0.5) });
  const withError = withBsaFormulaError(bsa.outputs.bsaM2);
  const index = propagate(indexedToBsa(LV_MASS), {
    lvMass: normal(190, 10),
    bsaM2: withError.outputs.bsaM2,
  });
  const labels = index.outputs.lvMassIndex!.budget.map((b) => b.label);
  assert.ok(labels.some((l) => /from memory/.test(l)), labels.join("; "));
  // Mosteller √(180·80/3600) = 2 m² (hand-checkable): 190/2 = 95 g/m²
  close(index.outputs.lvMassIndex!.value, 95, 1e-9, "index");
  // the formula factor is a relative error of the index too: u_r = 5 %/√3 (share of the budget)
  const row = index.outputs.lvMassIndex!.budget.find((b) => /from memory/.test(b.label))!;
  close(Math.abs(row.contribution) / 95, 0.05 / Math.sqrt(3), 1e-7, "relative contribution");
});

Deno.test("BSA formula error: bad limits name the field, the value and the range", () => {
  assert.throws(() => withBsaFormulaError(1.9, { limitPercent: 0 }), {
    name: "RangeError",
    message:
      "BSA formula error: expected 'limitPercent' (BSA formula error limit) in (0, 50] %, got 0",
  });
  assert.throws(() => withBsaFormulaError(1.9, { limitPercent: 60 }), RangeError);
  assert.throws(() => withBsaFormulaError(0), RangeError);
  assert.throws(() => withBsaFormulaError(1.9, null as never), TypeError);
});
