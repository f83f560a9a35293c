/**
 * The display of a GUM result: a contribution that is zero but for rounding error, and an
 * effective number of degrees of freedom beyond any t table.
 */
import assert from "node:assert/strict";
import { budgetRows, expressionModel, formatDof, normal, propagate, typeA } from "../../mod.ts";

// y = a + 0·c: c enters with a sensitivity of zero
const model = expressionModel({
  expression: "a + 0 * c",
  inputs: {
    a: { unit: "mm", description: "Length", range: { min: -100, max: 100 } },
    c: { unit: "mm", description: "Offset", range: { min: -100, max: 100 } },
  },
  output: { name: "y", unit: "mm", description: "Result" },
});

Deno.test("budget rows: contributions to the decimal place of the combined u (GUM 7.2.6)", () => {
  const r = propagate(model, { a: normal(10, 0.123), c: normal(1, 5) });
  const rows = budgetRows(r.outputs.y);
  // u(y) = 0.123 mm (c has sensitivity 0): u to two digits, 0.12 mm; contributions to 0.01 mm
  assert.equal(rows[0]![6], "0.12 mm");
  assert.equal(rows[1]![6], "0.00 mm");
  assert.ok(rows.every((row) => !/\d{6,}/.test(row.join(" "))), rows.join("\n"));
});

Deno.test("ν_eff beyond a million is shown as ∞, a few as one decimal (JCGM 100 G.4)", () => {
  assert.equal(formatDof(2.1), "2.1");
  assert.equal(formatDof(1234.4), "1234");
  assert.equal(formatDof(6.5e45), "∞");
  // a Type A input with ν = 4 next to a Type B input 1000 times larger: Welch–Satterthwaite
  // ν_eff = u⁴/Σ(uᵢ⁴/νᵢ) = (1 + 10⁻⁶)² / (10⁻¹²/4) ≈ 4·10¹² (hand computation)
  const r = propagate(
    expressionModel({
      expression: "a + c",
      inputs: {
        a: { unit: "mm", description: "Repeated", range: { min: -100, max: 100 } },
        c: { unit: "mm", description: "Calibration", range: { min: -100, max: 100 } },
      },
      output: { name: "y", unit: "mm", description: "Result" },
    }),
    { a: typeA([1, 1.001, 0.999, 1.0005, 0.9995]), c: normal(0, 1) },
  );
  const dof = r.outputs.y!.effectiveDof!;
  assert.ok(dof > 1e6, String(dof));
  const shown = (r as unknown as Record<symbol, () => Record<string, string>>)[
    Symbol.for("Jupyter.display")
  ]!()["text/plain"]!;
  assert.match(shown, /ν_eff = ∞/);
  assert.match(shown, /u = 1\.0 mm/);
});
