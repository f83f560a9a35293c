import assert from "node:assert/strict";
import { close } from "../close.ts";
import {
  methodValidation,
  type MethodValidationReport,
  type Outcome,
  statedQuantity,
  validationReadOptions,
} from "../../calc/agreement/mod.ts";
import { readTable } from "../../calc/table/mod.ts";
import { methodValidationHtml, methodValidationMarkdown } from "../../display/method_validation.ts";
import { InputRangeError, InputTypeError, renderIssue } from "../../calc/core/mod.ts";
import {
  fleissExampleCsv,
  FUN_GRADES,
  peakFlowCsv,
  sexualFunCsv,
  shroutFleissCsv,
} from "./data.ts";

function computed<T>(o: Outcome<T> | null | undefined, what: string): T {
  assert.ok(o, `${what}: expected an outcome, got none`);
  assert.equal(o.status, "computed", o.status === "not computed" ? o.reason : what);
  return (o as { result: T }).result;
}

const PEAK_FLOW = statedQuantity({ label: "Peak expiratory flow", unit: "L/min" });
const RATING = statedQuantity({ label: "Rating", unit: "1" });

function peakFlowReport(): MethodValidationReport {
  const table = readTable(peakFlowCsv(), {
    source: "peak_flow.csv",
    columns: { "peak flow": PEAK_FLOW, ...validationReadOptions().columns },
  });
  return methodValidation(table, { observer: "meter", reference: "mini", multiplier: 2 });
}

Deno.test("the report of the 1986 peak-flow study reproduces the published and reference values", () => {
  const r = peakFlowReport();
  assert.equal(r.study.measured.label, "Peak expiratory flow");
  assert.equal(r.study.measured.unit, "L/min");
  assert.equal(r.study.quantityId, "statedQuantity");
  assert.deepEqual(r.data.observers, ["wright", "mini"]);
  assert.equal(r.data.dataRows, 68);
  assert.equal(r.data.readingsUsed, 68);
  assert.equal(r.data.subjects, 17);
  assert.deepEqual(r.data.byObserver.map((o) => [o.readings, o.subjects, o.mostReplicates]), [
    [34, 17, 2],
    [34, 17, 2],
  ]);
  assert.equal(r.comparisons.length, 1);
  const c = r.comparisons[0]!;
  assert.deepEqual([c.test, c.reference, c.subjects.length], ["wright", "mini", 17]);
  const ba = computed(c.blandAltman, "Bland–Altman");
  // Bland & Altman 1986 Lancet 327:307, p. 308: mean difference (Wright − mini) −2.1 l/min
  close(ba.bias, -2.1, 0.05, "bias");
  // same page: SD of differences 38.8 l/min
  close(ba.sdDifferences, 38.8, 0.05, "SD");
  // same page: limits of agreement (2 SD) −79.7 and 75.5 l/min (from the rounded −2.1 ± 2 × 38.8)
  close(ba.lowerLimit.value, -79.7, 0.1, "lower");
  close(ba.upperLimit.value, 75.5, 0.1, "upper");
  const rep = r.repeatability!;
  // Bland & Altman 1986 (repeatability section), hand-checkable from the published data:
  // 2 × √(Σd²/17) = 2 × 21.647 (Wright) and 2 × 28.158 (mini) l/min
  close(computed(rep[0]!.outcome, "Wright").repeatabilityCoefficient, 2 * 21.64689897639192, 1e-9);
  close(computed(rep[1]!.outcome, "mini").repeatabilityCoefficient, 2 * 28.158166718399414, 1e-9);
  // Deming's error variance ratio from the replicates: (s_w Wright / s_w mini)², the same
  // hand-checkable values (s_w = √(Σd²/(2n)), Bland & Altman 1996 BMJ 313:41)
  assert.equal(c.errorVarianceRatio.from, "replicates");
  close(c.errorVarianceRatio.value, (21.64689897639192 / 28.158166718399414) ** 2, 1e-12);
  const rm = computed(c.blandAltmanRepeated, "repeated");
  // R 4.2.2, nlme 3.1.162: lme(d ~ 1, random = ~1|s, method = "REML") on the 34 differences
  // (Wright − mini, replicate with replicate): intercept −6.02941176471, subject variance
  // 789.1471, residual variance 626.7353 (balanced data: equal to the ANOVA estimates of
  // Bland & Altman 2007 J Biopharm Stat 17:571)
  close(rm.bias, -6.02941176471, 1e-9, "repeated bias");
  close(rm.betweenSubjectVariance, 789.1471, 1e-3, "between");
  close(rm.withinSubjectVariance, 626.7353, 1e-3, "within");
  const ccc = computed(c.concordance, "concordance");
  // R 4.2.2, epiR 2.0.57: epi.ccc(wright1, mini1, ci = "z-transform")$rho.c:
  // est 0.942742431427, lower 0.850491873169, upper 0.97872627917 (ρ_c is symmetric in x, y)
  close(ccc.value, 0.942742431427, 1e-11, "rho_c");
  close(ccc.ci.lower, 0.850491873169, 1e-11, "rho_c lower");
  close(ccc.ci.upper, 0.97872627917, 1e-10, "rho_c upper");
  assert.equal(computed(c.deming, "Deming").errorVarianceRatio, c.errorVarianceRatio.value);
  assert.deepEqual(r.figures.map((f) => f.file), [
    "bland_altman_wright_vs_mini.svg",
    "method_comparison_wright_vs_mini.svg",
    "observers.svg",
  ]);
  assert.ok(r.interpretation[0]!.startsWith("This report states no pass or fail"));
  // the bias interval contains 0 (−2.1 ± 2.12·38.8/√17, Bland & Altman 1986 figures)
  assert.match(
    r.interpretation[1]!,
    /^wright − mini: the confidence interval of the bias contains 0/,
  );
});

Deno.test("the report's intraclass correlations reproduce Shrout & Fleiss (1979) and R psych", () => {
  const table = readTable(shroutFleissCsv(), { source: "sf.csv", columns: { rating: RATING } });
  const r = methodValidation(table, { subject: "target", observer: "judge" });
  const icc = computed(r.icc?.outcome, "ICC");
  assert.equal(r.icc!.completeSubjects, 6);
  const byForm = Object.fromEntries(icc.forms.map((f) => [f.form, f]));
  // Shrout & Fleiss 1979 Psychol Bull 86:420, Table 4 (two decimals as printed)
  assert.equal(byForm["ICC(2,1)"]!.value.toFixed(2), "0.29");
  assert.equal(byForm["ICC(3,1)"]!.value.toFixed(2), "0.71");
  // R 4.2.2, psych 2.2.9: ICC(sf, lmer = FALSE) point estimates and 95 % bounds
  const psych: Record<string, [number, number, number]> = {
    "ICC(1,1)": [0.1657417684, -0.13293232487, 0.7225600623],
    "ICC(2,1)": [0.2897637795, 0.01878651337, 0.7610843696],
    "ICC(3,k)": [0.9093155424, 0.67567471382, 0.9858916782],
  };
  for (const [form, [value, lower, upper]] of Object.entries(psych)) {
    close(byForm[form]!.value, value, 1e-9, form);
    close(byForm[form]!.ci.lower, lower, 1e-8, `${form} lower`);
    close(byForm[form]!.ci.upper, upper, 1e-8, `${form} upper`);
  }
  // one reading per judge: no repeatability, no repeated-measures analysis, λ assumed 1
  assert.equal(r.repeatability, null);
  // every pair of the 4 judges: 3 against the reference j1, then the 3 pairs of the others
  assert.deepEqual(r.comparisons.map((c) => [c.test, c.reference, c.against]), [
    ["j2", "j1", "reference"],
    ["j3", "j1", "reference"],
    ["j4", "j1", "reference"],
    ["j3", "j2", "observer"],
    ["j4", "j2", "observer"],
    ["j4", "j3", "observer"],
  ]);
  // reader against reader, by hand from Shrout & Fleiss 1979 Table 2: judge 3 − judge 2 =
  // (3 + 2 + 2 + 1 + 1 + 2)/6 = 11/6
  const j3j2 = computed(r.comparisons[3]!.blandAltman, "j3 − j2");
  close(j3j2.bias, 11 / 6, 1e-12, "bias j3 − j2");
  // judge 4 − judge 3 = (3 − 1 + 2 + 4 + 3 + 3)/6 = 14/6
  close(computed(r.comparisons[5]!.blandAltman, "j4 − j3").bias, 14 / 6, 1e-12, "bias j4 − j3");
  for (const c of r.comparisons) {
    assert.equal(c.blandAltmanRepeated, null);
    assert.deepEqual(c.errorVarianceRatio, { value: 1, from: "assumed" });
  }
});

Deno.test("graded findings: Cohen's kappa of each weighting matches R vcd, Fleiss' kappa its worked example", () => {
  const table = readTable(sexualFunCsv(), {
    source: "fun.csv",
    ...validationReadOptions({ graded: true, value: "grade" }),
  });
  const r = methodValidation(table, {
    subject: "couple",
    graded: true,
    value: "grade",
    categories: FUN_GRADES,
  });
  assert.equal(r.study.design, "graded");
  assert.deepEqual(r.kappa!.categories, FUN_GRADES);
  const pair = r.kappa!.pairs[0]!;
  assert.deepEqual([pair.raterA, pair.raterB, pair.subjects], ["husband", "wife", 91]);
  const [none, linear, quadratic] = pair.kappas.map((k) => computed(k.outcome, k.weights));
  // R 4.2.2, vcd 1.4.11: Kappa(SexualFun): unweighted 0.1293302540416, ASE 0.0685985324807;
  // weighted (equal spacing = linear) 0.2373806275580, ASE 0.0783163347784;
  // weights = "Fleiss-Cohen" (quadratic) 0.3320455862469, ASE 0.0972975219586
  close(none!.kappa, 0.1293302540416, 1e-12, "kappa");
  close(none!.standardError, 0.0685985324807, 1e-12, "ASE");
  close(linear!.kappa, 0.237380627558, 1e-12, "linear");
  close(linear!.standardError, 0.0783163347784, 1e-12, "linear ASE");
  close(quadratic!.kappa, 0.3320455862469, 1e-12, "quadratic");
  close(quadratic!.standardError, 0.0972975219586, 1e-12, "quadratic ASE");
  assert.equal(r.kappa!.fleiss, null); // two raters
  assert.deepEqual([r.repeatability, r.comparisons, r.icc, r.figures], [null, [], null, []]);

  const fleissTable = readTable(fleissExampleCsv(), {
    source: "fleiss.csv",
    ...validationReadOptions({ graded: true, value: "category" }),
  });
  const f = methodValidation(fleissTable, {
    graded: true,
    value: "category",
    categories: ["1", "2", "3", "4", "5"],
  });
  const fk = computed(f.kappa!.fleiss!.outcome, "Fleiss");
  // Wikipedia "Fleiss' kappa" worked example (from memory): P̄ = 0.378, P̄e = 0.213, κ = 0.210
  close(fk.observedAgreement, 0.378, 0.0005, "P");
  close(fk.expectedAgreement, 0.213, 0.0005, "Pe");
  close(fk.kappa, 0.210, 0.0005, "kappa");
  assert.equal(f.kappa!.pairs.length, (14 * 13) / 2);
});

const DEMO = "examples/data/validation_demo.csv";

Deno.test("which statistics appear for which design", async () => {
  const demo = methodValidation(
    readTable(await Deno.readFile(DEMO), { source: DEMO, ...validationReadOptions() }),
  );
  // 30 patients × 3 methods × 2 rounds (the demo data's README): everything
  assert.equal(demo.data.readingsUsed, 180);
  assert.equal(demo.repeatability!.length, 3);
  // each method against the reference, then reader against reader
  assert.deepEqual(demo.comparisons.map((c) => `${c.test} − ${c.reference}`), [
    "sonographer_B − sonographer_A",
    "auto_trace − sonographer_A",
    "auto_trace − sonographer_B",
  ]);
  for (const c of demo.comparisons) {
    const outcomes: (Outcome<unknown> | null)[] = [
      c.blandAltman,
      c.blandAltmanRepeated,
      c.concordance,
      c.deming,
      c.passingBablok,
    ];
    for (const o of outcomes) computed(o, c.test);
  }
  assert.equal(computed(demo.icc!.outcome, "ICC").raters, 3);
  assert.equal(demo.figures.length, 7); // 3 Bland–Altman, 3 comparison scatters, 1 observer plot
  assert.equal(demo.kappa, null);

  // one observer with replicates: repeatability only
  const one = methodValidation(readTable(
    "patient,observer,replicate,lvef percent\nP1,A,1,50\nP1,A,2,52\nP2,A,1,61\nP2,A,2,60\nP3,A,1,40\nP3,A,2,43\n",
    { source: "one.csv" },
  ));
  // s_w² = (2²/2 + 1²/2 + 3²/2)/3 = 7/3 (one-way ANOVA residual, Bland & Altman 1996, by hand)
  close(computed(one.repeatability![0]!.outcome, "A").withinSubjectSd, Math.sqrt(7 / 3), 1e-12);
  assert.deepEqual([one.comparisons, one.icc], [[], null]);
  assert.deepEqual(one.figures.map((f) => f.kind), ["observers"]);

  // two observers, one reading each: comparison and ICC, no repeatability
  const two = methodValidation(readTable(
    "patient,observer,lvef percent\nP1,A,50\nP1,B,52\nP2,A,61\nP2,B,60\nP3,A,40\nP3,B,43\n",
    { source: "two.csv" },
  ));
  assert.equal(two.repeatability, null);
  assert.equal(two.comparisons[0]!.blandAltmanRepeated, null);
  // B − A: 2, −1, 3 → bias 4/3 (by hand)
  close(computed(two.comparisons[0]!.blandAltman, "BA").bias, 4 / 3, 1e-12);
  computed(two.icc!.outcome, "ICC");

  // fewer than 3 paired subjects: every comparison statistic says why it was not computed
  const few = methodValidation(readTable(
    "patient,observer,lvef percent\nP1,A,50\nP1,B,52\nP2,A,61\nP2,B,60\nP3,A,40\n",
    { source: "few.csv" },
  ));
  const c = few.comparisons[0]!;
  assert.equal(c.subjectsLeftOut, 1);
  for (const o of [c.blandAltman, c.concordance, c.deming, c.passingBablok]) {
    assert.deepEqual(o, {
      status: "not computed",
      reason:
        "Method comparison: expected at least 3 subjects with a first reading by both B and A, got 2",
    });
  }
  assert.deepEqual(few.figures.map((f) => f.kind), ["observers"]);
  assert.deepEqual(few.icc!.leftOut, ["P3"]);
  assert.equal(few.icc!.completeSubjects, 2);
});

Deno.test("counts, the missing-cell policy and flags", () => {
  const csv = [
    "patient,observer,lvef percent",
    "P1,A,50",
    "P1,B,",
    "",
    "P2,A,61",
    "P2,B,60",
    "P3,A,5",
    "P3,B,8",
    "P4,A,44",
    "P4,B,47",
  ].join("\n") + "\n";
  const r = methodValidation(readTable(csv, { source: "m.csv" }));
  assert.equal(r.data.dataRows, 8);
  assert.equal(r.data.readingsUsed, 7);
  assert.deepEqual(r.data.missing, [{ subject: "P1", observer: "B", replicate: 1, line: 3 }]);
  assert.deepEqual(r.data.blankLines, [4]);
  // EF 5 and 8 % lie outside the typical range of the quantity: flagged with their lines
  assert.deepEqual(r.data.flags.map((f) => [f.kind, f.line]), [["typical", 7], ["typical", 8]]);
  assert.deepEqual(r.data.byObserver.map((o) => [o.observer, o.readings, o.subjects]), [
    ["A", 4, 4],
    ["B", 3, 3],
  ]);
  assert.deepEqual(r.icc!.leftOut, ["P1"]);
  assert.equal(r.comparisons[0]!.subjects.length, 3);
  assert.equal(r.provenance.missingValues, 1);
  assert.equal(r.provenance.deterministic, true);
});

Deno.test("a defective table throws every problem with its line, and nothing is computed", async () => {
  const path = "examples/data/validation_defects.csv";
  const table = readTable(await Deno.readFile(path), {
    source: "validation_defects.csv",
    ...validationReadOptions(),
  });
  let e: unknown;
  try {
    methodValidation(table);
  } catch (thrown) {
    e = thrown;
  }
  assert.ok(e instanceof InputTypeError);
  const errors = e.issues.filter((i) => i.severity === "error");
  assert.deepEqual(errors.map((i) => i.line), [4, 8, 9, 11, 12]);
  assert.deepEqual(errors.map(renderIssue), [
    `validation_defects.csv: line 4, expected 'lvef_percent' (LV ejection fraction) as a number in [0, 100] %, got "abc"`,
    "validation_defects.csv: line 8, missing column 'patient' (Subject): expected a subject identifier, got an empty cell",
    `validation_defects.csv: line 9, expected 'replicate' (Replicate number) as a number in [1, ∞), got "x"`,
    "validation_defects.csv: line 11, expected one reading per subject, observer and replicate, got a second reading for subject 'P05', observer 'sonographer_A', replicate 1 (first on line 10)",
    "validation_defects.csv: line 12, expected 4 fields as in the header (the row is kept; missing cells are empty), got 5 fields",
  ]);
  assert.equal(e.message, `${renderIssue(errors[0]!)} (and 4 more problems)`);
  // a value outside the valid range is a RangeError with its line
  const bad = readTable("patient,observer,lvef percent\nP1,A,50\nP1,B,150\nP2,A,40\nP2,B,41\n", {
    source: "bad.csv",
  });
  assert.throws(() => methodValidation(bad), (err: unknown) => {
    assert.ok(err instanceof InputRangeError);
    assert.equal(
      err.message,
      "bad.csv: line 3, expected 'lvef percent' (LV ejection fraction) in [0, 100] %, got 150",
    );
    return true;
  });
  // an unknown category of graded findings, with its line
  const graded = readTable("patient,reader,grade\nP1,A,mild\nP1,B,trace\n", { source: "g.csv" });
  assert.throws(
    () => methodValidation(graded, { graded: true, categories: ["none", "mild"] }),
    {
      name: "RangeError",
      message: `g.csv: line 3, expected 'grade' one of none, mild, got "trace"`,
    },
  );
});

Deno.test("options and designs the analysis cannot use are refused with named fields", () => {
  const t = readTable("patient,observer,lvef percent\nP1,A,50\nP1,B,52\nP2,A,61\nP2,B,60\n", {
    source: "o.csv",
  });
  assert.throws(() => methodValidation(t, { reference: "C" }), {
    name: "TypeError",
    message:
      `Method validation: unknown input 'reference': expected an observer or method of the table: A, B, got "C"`,
  });
  assert.throws(() => methodValidation(t, { multiplier: 0 }), {
    name: "RangeError",
    message: "Method validation: expected 'multiplier' in (0, 5], got 0",
  });
  assert.throws(() => methodValidation(t, { confidence: 1 }), {
    name: "RangeError",
    message: "Method validation: expected 'confidence' in (0, 1), got 1",
  });
  const single = readTable("patient,observer,lvef percent\nP1,A,50\nP1,B,52\n", {
    source: "s.csv",
  });
  assert.throws(() => methodValidation(single), {
    name: "RangeError",
    message: "Method validation: expected at least 2 subjects with readings, got 1",
  });
  const text = readTable("patient,observer,value\nP1,A,50\nP1,B,52\n", { source: "v.csv" });
  assert.throws(() => methodValidation(text), {
    name: "TypeError",
    message: /^v\.csv: expected the value column 'value' as numbers of a quantity, got text/,
  });
});

Deno.test("a table of 400 000 readings is analysed without a stack overflow", () => {
  // 200 000 subjects, two observers, one reading each: every per-observer array holds 200 000
  // values, beyond the ~125 000 arguments at which a spread such as Math.min(...values)
  // overflows the stack in Deno 2.9 (measured)
  const n = 200_000;
  const lines = ["patient,observer,lvef percent"];
  let state = 12345; // a fixed linear congruential sequence (Numerical Recipes constants)
  const next = () => (state = (1664525 * state + 1013904223) % 4294967296) / 4294967296;
  for (let i = 0; i < n; i++) {
    const truth = 25 + 50 * next();
    lines.push(`P${i},A,${(truth + 3 * next()).toFixed(1)}`);
    lines.push(`P${i},B,${(truth + 3 * next()).toFixed(1)}`);
  }
  const table = readTable(lines.join("\n"), { source: "big.csv" });
  const r = methodValidation(table);
  assert.equal(r.data.readingsUsed, 2 * n);
  assert.equal(r.data.byObserver[0]!.fewestReplicates, 1);
  const c = r.comparisons[0]!;
  assert.equal(c.subjects.length, n);
  computed(c.blandAltman, "Bland–Altman");
  computed(c.concordance, "concordance");
  computed(c.deming, "Deming");
  computed(r.icc!.outcome, "ICC");
  // the renderers and the chart specifications (not rendered) handle it too
  assert.match(
    methodValidationMarkdown(r),
    /\| Passing–Bablok regression \| not computed \| – \| Passing-Bablok regression: expected at most 10000 pairs/,
  );
  assert.match(methodValidationHtml(r), /^<!doctype html>/);
  // a chart of more points than a report draws is not planned, and the report says so
  assert.deepEqual(r.figures, []);
  assert.ok(r.cautions.includes(
    "The observer plot is not drawn: it would have 400,000 points, more than the 20,000 a chart of this report draws; every statistic uses every reading.",
  ));
  assert.match(
    methodValidationMarkdown(r),
    /The Bland–Altman plot of B − A is not drawn: it would have 200,000 points/,
  );
  // Passing–Bablok would sort n(n − 1)/2 ≈ 2·10¹⁰ slopes: refused with the reason
  assert.deepEqual(c.passingBablok, {
    status: "not computed",
    reason:
      "Passing-Bablok regression: expected at most 10000 pairs ('maxPairs'; the method sorts all n(n − 1)/2 pairwise slopes), got 200000",
  });
});

Deno.test("chart file names derived from observer names are unique and safe", () => {
  const observers = ["Reader A", "reader_a", "READER-A", "Réader A", "読影者", "???", "../../etc"];
  const rows = ["patient,observer,lvef percent"];
  for (let s = 1; s <= 4; s++) {
    observers.forEach((o, j) =>
      rows.push(`P${s},"${o}",${40 + 5 * s + j + ((s * s * (j + 1)) % 7)}`)
    );
  }
  const r = methodValidation(readTable(rows.join("\n"), { source: "names.csv" }));
  const files = r.figures.map((f) => f.file);
  assert.equal(new Set(files).size, files.length);
  for (const f of files) assert.match(f, /^[a-z0-9_-]+\.svg$/);
  // against the reference first, then every pair of the others: 7·6/2 = 21 plots
  const ba = files.filter((f) => f.startsWith("bland_altman_"));
  assert.equal(ba.length, 21);
  assert.deepEqual(ba.slice(0, 7), [
    "bland_altman_reader-a-2_vs_reader-a.svg",
    "bland_altman_reader-a-3_vs_reader-a.svg",
    "bland_altman_reader-a-4_vs_reader-a.svg",
    "bland_altman_observer-5_vs_reader-a.svg",
    "bland_altman_observer-6_vs_reader-a.svg",
    "bland_altman_etc_vs_reader-a.svg",
    "bland_altman_reader-a-3_vs_reader-a-2.svg",
  ]);
});

/** An invented long table: `subjects` subjects read by each observer `replicates` times, values
 * from a fixed linear congruential stream (structure only: no statistic is checked on it). */
function inventedTable(subjects: number, observers: readonly string[], replicates = 1): string {
  let state = 7;
  const next = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32;
  const lines = ["patient,observer,replicate,lvef percent"];
  for (let s = 1; s <= subjects; s++) {
    const truth = 30 + 40 * next();
    for (const o of observers) {
      for (let r = 1; r <= replicates; r++) {
        lines.push(`P${s},${o},${r},${(truth + 4 * next() - 2).toFixed(1)}`);
      }
    }
  }
  return lines.join("\n") + "\n";
}

Deno.test("observer names that reduce to one file name get distinct chart files", () => {
  // "Dr A-B" and "Dr A B" both reduce to "dr-a-b"; the reference is the first, "Ref"
  const csv = inventedTable(5, ["Ref", "Dr A-B", "Dr A B", "dr a b 2"]);
  const report = methodValidation(readTable(csv, { source: "names.csv" }));
  const files = report.figures.map((f) => f.file);
  assert.equal(new Set(files).size, files.length);
  assert.deepEqual(files.filter((f) => f.startsWith("bland_altman_")), [
    "bland_altman_dr-a-b_vs_ref.svg",
    "bland_altman_dr-a-b-2_vs_ref.svg",
    "bland_altman_dr-a-b-2-2_vs_ref.svg",
    "bland_altman_dr-a-b-2_vs_dr-a-b.svg",
    "bland_altman_dr-a-b-2-2_vs_dr-a-b.svg",
    "bland_altman_dr-a-b-2-2_vs_dr-a-b-2.svg",
  ]);
  for (const f of files) assert.match(f, /^[a-z0-9_-]+\.svg$/);
});

Deno.test("Markdown and HTML reports carry no markup from subject or observer names", () => {
  const hostile = ["<script>alert(1)</script>", "<img src=x onerror=alert(1)>"];
  const csv = ["patient,observer,lvef percent"];
  for (let s = 0; s < 4; s++) {
    for (const [k, o] of ["A", hostile[0]!].entries()) {
      csv.push(`"${s === 0 ? hostile[1] : `P${s}`}","${o}",${50 + s * 3 + k}`);
    }
  }
  // a subject read by one observer only: listed as left out of the ICC, by name
  csv.push(`"${hostile[1]}2",A,50`);
  const report = methodValidation(readTable(csv.join("\n"), { source: "x.csv" }));
  const md = methodValidationMarkdown(report);
  assert.match(md, /left out as incomplete: \\<img src=x onerror=alert\(1\)>2/);
  const html = methodValidationHtml(report);
  // CommonMark: "\<" is a literal "<", so no tag opens; HTML: &lt; is text
  for (const text of [md, html]) assert.doesNotMatch(text, /(^|[^\\])<(script|img)/m);
  assert.match(md, /\\<script>alert\(1\)\\<\/script>/);
  assert.match(html, /&lt;script&gt;alert\(1\)&lt;\/script&gt;/);
});
