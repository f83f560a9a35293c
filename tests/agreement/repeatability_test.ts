import assert from "node:assert/strict";
import { close } from "../close.ts";
import { repeatability } from "../../calc/agreement/mod.ts";
import { PEAK_FLOW } from "./data.ts";

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
    message: /^Repeatability: expected 'readingsBySubject\[0\]\[1\]' as a finite number, got NaN$/,
  });
});
