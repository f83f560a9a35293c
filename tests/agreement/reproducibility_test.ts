import assert from "node:assert/strict";
import { intraclassCorrelations, repeatability } from "../../mod.ts";
import { PEAK_FLOW, SHROUT_FLEISS } from "./data.ts";

const close = (actual: number, expected: number, tol: number, what = "") =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what} expected ${expected} ± ${tol}, got ${actual}`,
  );

Deno.test("repeatability coefficients of the 1986 peak-flow meters", () => {
  const wright = repeatability(PEAK_FLOW.map((r) => [r[0], r[1]]), { multiplier: 2 });
  const mini = repeatability(PEAK_FLOW.map((r) => [r[2], r[3]]), { multiplier: 2 });
  // Bland & Altman 1986 Lancet 327:307 (repeatability section): coefficient = 2 × SD of the
  // differences between replicates, SD taken as √(Σd²/n) because the mean difference should be 0;
  // the paper printed about 43 l/min for the Wright and 56 l/min for the mini meter (from
  // memory). Hand-checkable from the published data: √(Σd²/17) = 21.647 and 28.158 l/min.
  close(wright.repeatabilityCoefficient, 2 * 21.64689897639192, 1e-9, "Wright");
  close(mini.repeatabilityCoefficient, 2 * 28.158166718399414, 1e-9, "mini");
  close(wright.repeatabilityCoefficient, 43, 0.5, "Wright, printed");
  close(mini.repeatabilityCoefficient, 56, 0.5, "mini, printed");
  // Bland & Altman 1996 BMJ 313:744: repeatability = 1.96·√2·s_w = 2.77·s_w
  const r196 = repeatability(PEAK_FLOW.map((r) => [r[0], r[1]]));
  close(r196.repeatabilityCoefficient / r196.withinSubjectSd, 2.77, 0.005, "2.77");
  // s_w² = Σd²/(2n) for duplicates (Bland & Altman 1996 BMJ 313:41, hand-checkable)
  close(r196.withinSubjectSd, 21.64689897639192 / Math.SQRT2, 1e-9, "s_w");
});

Deno.test("within-subject SD interval and RMS coefficient of variation (hand-checkable)", () => {
  // s_w² = (1² + 1² + 2²·... ) hand example: subjects [10, 12], [20, 22], [30, 36]
  const r = repeatability([[10, 12], [20, 22], [30, 36]]);
  // per-subject variances 2, 2, 18 → s_w² = 22/3 (one-way ANOVA residual, Bland & Altman 1996)
  close(r.withinSubjectSd, Math.sqrt(22 / 3), 1e-12);
  // RMS CV (Bland 2006): √(mean(s_i²/m_i²)) = √((2/121 + 2/441 + 18/1089)/3)
  close(r.withinSubjectCv!, Math.sqrt((2 / 121 + 2 / 441 + 18 / 1089) / 3), 1e-12);
  // χ² interval, 3 df: χ²(0.975, 3) = 9.348, χ²(0.025, 3) = 0.2158 (any χ² table)
  close(r.withinSubjectSdCi.lower, Math.sqrt(22 / 3) * Math.sqrt(3 / 9.348), 0.002);
  close(r.withinSubjectSdCi.upper, Math.sqrt(22 / 3) * Math.sqrt(3 / 0.2158), 0.01);
  assert.equal(repeatability([[-1, 1], [2, 3]]).withinSubjectCv, null);
});

Deno.test("repeatability rejects designs it cannot use", () => {
  assert.throws(() => repeatability([[1, 2]]), {
    name: "RangeError",
    message: /^Repeatability: expected at least 2 subjects, got 1$/,
  });
  assert.throws(() => repeatability([[1, 2], [3]]), {
    name: "RangeError",
    message: /expected at least 2 readings for every subject, 'readingsBySubject\[1\]' has 1$/,
  });
  assert.throws(() => repeatability([[1, 1], [3, 3]]), {
    name: "RangeError",
    message: /expected readings that vary within subjects, got within-subject SD 0$/,
  });
  assert.throws(() => repeatability([[1, NaN], [3, 3]]), {
    name: "RangeError",
    message: /'readingsBySubject\[0\]\[1\]', got NaN$/,
  });
});

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
    message: /'ratings\[1\]\[1\]', got Infinity$/,
  });
});
