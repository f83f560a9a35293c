import assert from "node:assert/strict";
import { close } from "../close.ts";
import { intraclassCorrelations } from "../../calc/agreement/mod.ts";
import { SHROUT_FLEISS } from "./data.ts";

Deno.test("the six intraclass correlations of Shrout & Fleiss (1979)", () => {
  const r = intraclassCorrelations(SHROUT_FLEISS);
  const byForm = Object.fromEntries(r.forms.map((f) => [f.form, f]));
  // Shrout & Fleiss 1979 Psychol Bull 86:420, Table 4 (two decimals as printed)
  assert.equal(byForm["ICC(1,1)"]!.value.toFixed(2), "0.17");
  assert.equal(byForm["ICC(2,1)"]!.value.toFixed(2), "0.29");
  assert.equal(byForm["ICC(3,1)"]!.value.toFixed(2), "0.71");
  assert.equal(byForm["ICC(1,k)"]!.value.toFixed(2), "0.44");
  assert.equal(byForm["ICC(2,k)"]!.value.toFixed(2), "0.62");
  assert.equal(byForm["ICC(3,k)"]!.value.toFixed(2), "0.91");
  // R 4.2.2, psych 2.2.9: ICC(sf, lmer = FALSE) point estimates and 95 % bounds
  const psych: Record<string, [number, number, number]> = {
    "ICC(1,1)": [0.1657417684, -0.13293232487, 0.7225600623],
    "ICC(2,1)": [0.2897637795, 0.01878651337, 0.7610843696],
    "ICC(3,1)": [0.7148407148, 0.34246476503, 0.9458582600],
    "ICC(1,k)": [0.4427971337, -0.88444215524, 0.9124154203],
    "ICC(2,k)": [0.6200505476, 0.07113681530, 0.9272320402],
    "ICC(3,k)": [0.9093155424, 0.67567471382, 0.9858916782],
  };
  for (const [form, [value, lower, upper]] of Object.entries(psych)) {
    close(byForm[form]!.value, value, 1e-9, form);
    close(byForm[form]!.ci.lower, lower, 1e-8, `${form} lower`);
    close(byForm[form]!.ci.upper, upper, 1e-8, `${form} upper`);
  }
  // R 4.2.2, psych 2.2.9: F = 1.794678492 (5, 18), p = 0.1647688083; F = 11.027247956 (5, 15),
  // p = 0.0001345665165
  close(byForm["ICC(1,1)"]!.f, 1.794678492, 1e-8);
  close(byForm["ICC(1,1)"]!.pValue, 0.1647688083, 1e-9);
  close(byForm["ICC(3,1)"]!.f, 11.027247956, 1e-8);
  close(byForm["ICC(3,1)"]!.pValue, 0.0001345665165, 1e-12);
  assert.equal(byForm["ICC(2,1)"]!.mcGrawWong, "ICC(A,1)");
  assert.equal(byForm["ICC(3,k)"]!.mcGrawWong, "ICC(C,k)");
});

Deno.test("intraclass correlation rejects unbalanced, tiny and constant tables", () => {
  assert.throws(() => intraclassCorrelations([[1, 2, 3], [4, 5]]), {
    name: "TypeError",
    message: /balanced design with 3 readings per subject, 'ratings\[1\]' has 2$/,
  });
  assert.throws(() => intraclassCorrelations([[1, 2]]), {
    name: "RangeError",
    message: /expected at least 2 subjects, got 1$/,
  });
  assert.throws(() => intraclassCorrelations([[1], [2]]), {
    name: "RangeError",
    message: /expected at least 2 raters per subject, got 1$/,
  });
  assert.throws(() => intraclassCorrelations([[5, 5], [5, 5], [5, 5]]), {
    name: "RangeError",
    message: /residual variation.*got residual mean square 0$/,
  });
  assert.throws(() => intraclassCorrelations([[1, 2], [3, Infinity]]), {
    name: "RangeError",
    message:
      /^Intraclass correlation: expected 'ratings\[1\]\[1\]' as a finite number, got Infinity$/,
  });
});

Deno.test("intraclass correlation names its orientation: raters as rows are refused unless stated", () => {
  // Shrout & Fleiss 1979 Table 2 transposed: 4 judges as rows, 6 targets as columns
  const judges = [0, 1, 2, 3].map((j) => SHROUT_FLEISS.map((row) => row[j]!));
  assert.throws(() => intraclassCorrelations(judges), {
    name: "TypeError",
    message:
      /^Intraclass correlation: expected 'ratings' as subjects × raters \(one row per subject, one column per rater\), got 4 rows × 6 columns, more raters than subjects; if each row is one rater, pass \{ orientation: "ratersBySubjects" \}/,
  });
  // two observers given as two long rows (the easy mistake): refused, not a silent ICC
  const obsA = [50, 55, 60, 41, 62, 47, 58];
  const obsB = [51, 54, 61, 43, 60, 48, 57];
  assert.throws(() => intraclassCorrelations([obsA, obsB]), {
    name: "TypeError",
    message: /got 2 rows × 7 columns, more raters than subjects/,
  });
  // stated orientation: the same six values as the subjects × raters table
  const stated = intraclassCorrelations(judges, { orientation: "ratersBySubjects" });
  // Shrout & Fleiss 1979 Psychol Bull 86:420, Table 4 (two decimals as printed)
  assert.deepEqual(stated.forms.map((f) => f.value.toFixed(2)), [
    "0.17",
    "0.29",
    "0.71",
    "0.44",
    "0.62",
    "0.91",
  ]);
  assert.equal(stated.subjects, 6);
  assert.equal(stated.raters, 4);
  // a real design with more raters than subjects, stated: analysed as given (Table 2 rows 1–3,
  // 4 raters on 3 subjects), no error
  const wide = intraclassCorrelations(SHROUT_FLEISS.slice(0, 3), {
    orientation: "subjectsByRaters",
  });
  assert.equal(wide.subjects, 3);
  assert.throws(() => intraclassCorrelations(judges, { orientation: "rows" as never }), {
    name: "TypeError",
    message:
      /^Intraclass correlation: expected 'orientation' "subjectsByRaters" or "ratersBySubjects", got "rows"$/,
  });
  assert.throws(
    () =>
      intraclassCorrelations([[1, 2, 3], [4, Infinity, 6]], { orientation: "ratersBySubjects" }),
    { name: "RangeError", message: /'ratings\[1\]\[1\]' as a finite number, got Infinity$/ },
  );
});
