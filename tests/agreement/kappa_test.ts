import assert from "node:assert/strict";
import { close } from "../close.ts";
import { cohenKappa, cohenKappaFromTable, fleissKappa } from "../../calc/agreement/mod.ts";
import { FLEISS_EXAMPLE, SEXUAL_FUN } from "./data.ts";

Deno.test("Cohen's kappa and weighted kappa with standard errors match R vcd", () => {
  // R 4.2.2, vcd 1.4.11: Kappa(SexualFun)$Unweighted = 0.1293302540416, ASE 0.0685985324807
  const u = cohenKappaFromTable(SEXUAL_FUN);
  close(u.kappa, 0.1293302540416, 1e-12, "kappa");
  close(u.standardError, 0.0685985324807, 1e-12, "ASE");
  // R 4.2.2, vcd 1.4.11: Kappa(SexualFun)$Weighted (equal-spacing = linear weights):
  // 0.2373806275580, ASE 0.0783163347784
  const l = cohenKappaFromTable(SEXUAL_FUN, { weights: "linear" });
  close(l.kappa, 0.237380627558, 1e-12, "linear");
  close(l.standardError, 0.0783163347784, 1e-12, "linear ASE");
  // R 4.2.2, vcd 1.4.11: Kappa(SexualFun, weights = "Fleiss-Cohen")$Weighted:
  // 0.3320455862469, ASE 0.0972975219586
  const q = cohenKappaFromTable(SEXUAL_FUN, { weights: "quadratic" });
  close(q.kappa, 0.3320455862469, 1e-12, "quadratic");
  close(q.standardError, 0.0972975219586, 1e-12, "quadratic ASE");
  // R 4.2.2, psych 2.2.9: cohen.kappa(SexualFun)$var.kappa = 0.00470575865851 (unweighted)
  close(u.standardError ** 2, 0.00470575865851, 1e-13, "psych variance");
  assert.equal(u.n, 91);
});

Deno.test("Cohen's kappa from labels builds the same table", () => {
  const a: string[] = [];
  const b: string[] = [];
  const labels = ["never", "fairly", "very", "always"];
  SEXUAL_FUN.forEach((row, i) =>
    row.forEach((count, j) => {
      for (let c = 0; c < count; c++) {
        a.push(labels[i]!);
        b.push(labels[j]!);
      }
    })
  );
  const r = cohenKappa(a, b, { weights: "linear", categories: labels });
  // same R vcd 1.4.11 value as above: 0.2373806275580
  close(r.kappa, 0.237380627558, 1e-12);
  assert.throws(() => cohenKappa(a, b, { weights: "linear" }), {
    name: "TypeError",
    message: /expected 'categories' \(the order of the grades\) for weighted kappa, got none$/,
  });
  assert.throws(() => cohenKappa(["x", "y"], ["x", "z"], { categories: ["x", "y"] }), {
    name: "TypeError",
    message: /expected 'raterB\[1\]' in the categories, got "z"$/,
  });
  assert.throws(() => cohenKappa(["x", "x"], ["x", "x"]), {
    name: "TypeError",
    message: /expected 'table' as a square array of at least 2 rows/,
  });
  assert.throws(() => cohenKappaFromTable([[4, 0], [0, 0]]), {
    name: "RangeError",
    message: /more than one category \(chance agreement < 1\), got 1$/,
  });
  assert.throws(() => cohenKappaFromTable([[4, -1], [0, 2]]), {
    name: "RangeError",
    message: /non-negative integer count at 'table\[0\]\[1\]', got -1$/,
  });
});

Deno.test("Fleiss' kappa worked example", () => {
  const r = fleissKappa(FLEISS_EXAMPLE);
  // Wikipedia "Fleiss' kappa" worked example (from memory): P̄ = 0.378, P̄e = 0.213, κ = 0.210
  close(r.observedAgreement, 0.378, 0.0005, "P");
  close(r.expectedAgreement, 0.213, 0.0005, "Pe");
  close(r.kappa, 0.210, 0.0005, "kappa");
  // With 2 raters Fleiss' kappa equals Scott's pi: (p_o − p_e)/(1 − p_e) with pooled marginals
  // (Fleiss 1971 Psychol Bull 76:378, hand-checkable): subjects AA, AB, BB, AA → p_o = 3/4,
  // pooled p_A = 5/8 → p_e = 25/64 + 9/64 = 34/64, pi = (48/64 − 34/64)/(30/64) = 14/30
  close(fleissKappa([[2, 0], [1, 1], [0, 2], [2, 0]]).kappa, 14 / 30, 1e-12, "Scott's pi");
  assert.throws(() => fleissKappa([[2, 0], [1, 2]]), {
    name: "RangeError",
    message: /same number of ratings \(2\) for every subject, 'counts\[1\]' has 3$/,
  });
  assert.throws(() => fleissKappa([[2, 0]]), {
    name: "RangeError",
    message: /expected at least 2 subjects, got 1$/,
  });
});
