import assert from "node:assert/strict";
import {
  budgetExport,
  budgetLatex,
  budgetMarkdown,
  expressionModel,
  normal,
  propagate,
  readTable,
  writeBudgetCsv,
} from "../../mod.ts";

const product = expressionModel({
  expression: "a * b",
  inputs: {
    a: { unit: "cm", description: "Length", range: { min: 0, max: 9 } },
    b: { unit: "cm", description: '=HYPERLINK("x")', range: { min: 0, max: 9 } },
  },
  output: { name: "area", unit: "cm^2", description: "Area" },
});
const result = propagate(product, { a: normal(2, 0.1), b: normal(3, 0.3) });

Deno.test("budget export: rows with labels, units and GUM rounding (hand computation)", () => {
  const b = budgetExport(result);
  // y = a·b: c_a = b = 3 cm, c_b = a = 2 cm; c·u = 0.30 and 0.60 cm²; u² = 0.09 + 0.36 = 0.45,
  // shares 20 % and 80 % (JCGM 100:2008 eq. (10), hand computation)
  assert.deepEqual(b.rows.map((r) => r.slice(2)), [
    ["2.00", "0.10", "∞", "3 cm²/cm", "0.30 cm²", "20.0 %"],
    ["3.00", "0.30", "∞", "2 cm²/cm", "0.60 cm²", "80.0 %"],
  ]);
  assert.match(b.rows[0]![0]!, /^Length \(cm\)/);
  // u = √0.45 = 0.6708 → 0.67 cm²; U = 1.96·0.6708 = 1.3148 → 1.3 cm², value 6.0 (JCGM 100 §7.2.6)
  assert.equal(b.summary[0], "Area = 6.0 ± 1.3 cm² (k = 1.96, p = 95 %)");
  assert.match(b.summary[1]!, /u = 0\.67 cm²/);
});

Deno.test("budget CSV: reads back as a table, formula cells neutralised, cautions as comments", () => {
  const csv = writeBudgetCsv(result);
  assert.ok(!/^=|,=/m.test(csv), "no cell starts a formula");
  assert.match(csv, /'=HYPERLINK/);
  // the one reader reads it back: same rows and cells (comments skipped)
  const lines = csv.split("\n").filter((l) => l !== "" && !/^"?#/.test(l));
  assert.equal(lines.length, 3);
  const t = readTable(lines.join("\n"), { source: "budget.csv" });
  assert.equal(t.rowCount, 2);
  assert.match(csv, /^# Uncertainty budget of Area/);
});

Deno.test("budget Markdown and LaTeX carry the same numbers, escaped for their format", () => {
  const md = budgetMarkdown(result);
  assert.match(md, /\| 3\.00 \| 0\.30 \| ∞ \| 2 cm²\/cm \| 0\.60 cm² \| 80\.0 % \|/);
  assert.match(md, /Area = 6\.0 ± 1\.3 cm²/);
  const tex = budgetLatex(result);
  assert.match(
    tex,
    /3\.00 & 0\.30 & \$\\infty\$ & 2 cm\$\^\{2\}\$\/cm & 0\.60 cm\$\^\{2\}\$ & 80\.0 \\% \\\\/,
  );
  assert.match(tex, /6\.0 \$\\pm\$ 1\.3/);
  // special characters of a label are escaped: the quote stays, no bare { } $ & % _
  assert.ok(!/[^\\]%/.test(tex.replace(/\\%/g, "")), "every % escaped");
  assert.ok(tex.includes("\\begin{tabular}{llrrrrrr}"));
});

Deno.test("budget exports refuse a Monte Carlo result and an unknown output, naming them", () => {
  const mc = propagate(product, { a: normal(2, 0.1), b: normal(3, 0.3) }, {
    method: "monteCarlo",
    trials: 1000,
    seed: 1,
  });
  assert.throws(() => budgetMarkdown(mc), {
    name: "TypeError",
    message:
      "Uncertainty budget: expected a GUM result (Monte Carlo has no budget), got monteCarlo",
  });
  assert.throws(() => writeBudgetCsv(result, { output: "volume" }), {
    name: "TypeError",
    message: "Uncertainty budget: unknown output 'volume'; expected one of area",
  });
});
