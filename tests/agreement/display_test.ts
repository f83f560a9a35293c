import assert from "node:assert/strict";
import {
  blandAltman,
  blandAltmanRatio,
  blandAltmanRepeated,
  cohenKappaFromTable,
  concordanceCorrelation,
  demingRegression,
  fleissKappa,
  intraclassCorrelations,
  methodValidation,
  passingBablokRegression,
  repeatability,
  validationReadOptions,
} from "../../calc/agreement/mod.ts";
import { readTable } from "../../calc/table/mod.ts";
import { JUPYTER_DISPLAY, type MimeBundle } from "../../display/mime.ts";
import {
  escapeMarkdown,
  methodValidationHtml,
  methodValidationMarkdown,
} from "../../display/method_validation.ts";
import {
  FLEISS_EXAMPLE,
  MINI1,
  MINI2,
  PEAK_FLOW,
  SEXUAL_FUN,
  SHROUT_FLEISS,
  WRIGHT1,
  WRIGHT2,
} from "./data.ts";

const FLOW = { label: "Peak expiratory flow", unit: "L/min" };

function shown(result: { [JUPYTER_DISPLAY](): MimeBundle }): { text: string; html: string } {
  const b = result[JUPYTER_DISPLAY]();
  const text = String(b["text/plain"]);
  const html = String(b["text/html"]);
  for (const t of [text, html]) {
    // a display, never a raw object or an unformatted number
    assert.doesNotMatch(t, /\[object Object\]|undefined|NaN|\d\.\d{7,}/);
  }
  return { text, html };
}

Deno.test("Bland–Altman results display their table with labels, units and rounded numbers", () => {
  const r = blandAltman(WRIGHT1, MINI1, {
    multiplier: 2,
    quantity: FLOW,
    methodNames: ["Wright", "mini"],
  });
  const { text, html } = shown(r);
  assert.match(text, /^Bland–Altman analysis: Peak expiratory flow/);
  // bias −2.12, CI half-width t(0.975, 16)·s/√n = 2.120 × 38.77/√17 = 19.9 (Bland & Altman 1986
  // figures): two significant digits of the half-width → whole L/min (JCGM 100:2008 §7.2.6)
  assert.match(text, /Bias \(mean of Wright − mini\) \(L\/min\) +-2 +\[-22, 18\]/);
  // limits −79.6 and 75.4 L/min (Bland & Altman 1986 p. 308: −79.7, 75.5 from rounded inputs)
  assert.match(text, /Lower limit of agreement \(bias − 2 SD\) \(L\/min\) +-80 /);
  assert.match(text, /Upper limit of agreement \(bias \+ 2 SD\) \(L\/min\) +75 /);
  assert.match(text, /Caution: Limits of agreement assume differences roughly normal/);
  assert.match(html, /<th[^>]*>95 % CI \(exact, Carkeet 2015\)<\/th>/);

  const ratio = shown(blandAltmanRatio(WRIGHT1, MINI1, { quantity: FLOW })).text;
  assert.match(ratio, /^Bland–Altman analysis of ratios: Peak expiratory flow/);
  assert.match(ratio, /Geometric mean ratio A\/B/);

  const ids = [...PEAK_FLOW.map((_, i) => `s${i}`), ...PEAK_FLOW.map((_, i) => `s${i}`)];
  const repeated = shown(
    blandAltmanRepeated(ids, [...WRIGHT1, ...WRIGHT2], [...MINI1, ...MINI2], { quantity: FLOW }),
  ).text;
  // R nlme REML variances 789.1471 and 626.7353 (see bland_altman_test.ts), shown to two
  // significant digits (no interval is known: the spread's own two digits, JCGM 100:2008 §7.2.6)
  assert.match(repeated, /Between-subject variance of differences \(\(L\/min\)²\) +790\n/);
  assert.match(repeated, /Within-subject variance of differences \(\(L\/min\)²\) +630\n/);
  // bias, SD and limits to the decimal place of the SD's two significant digits (SD 37.63 → 38,
  // whole L/min): one precision in the table, no "−6.32" next to "38"
  assert.match(repeated, /SD of a single difference \(L\/min\) +38\n/);
  assert.match(repeated, /Bias \(mean of A − B\) \(L\/min\) +-6\n/);
  assert.match(repeated, /Limits of agreement \(bias ∓ 1\.96 SD\) \(L\/min\) +-80 to 68\n/);
  assert.match(repeated, /Caution: No confidence intervals/);
});

Deno.test("repeatability, ICC, concordance, regressions and kappa display compact tables", () => {
  const rep = shown(repeatability(PEAK_FLOW.map((r) => [r[0], r[1]]), { quantity: FLOW })).text;
  // s_w = 21.647/√2 = 15.31 L/min (Bland & Altman 1996, hand-checkable); interval
  // s_w·√(17/χ²): χ²(0.975, 17) = 30.19, χ²(0.025, 17) = 7.564 (any χ² table) → 11.49 to 22.95
  assert.match(rep, /Within-subject SD s_w \[95 % CI\] \(L\/min\) +15\.3 \[11\.5, 22\.9\]/);
  assert.match(rep, /Repeatability coefficient 2\.77·s_w/);

  const icc = shown(
    intraclassCorrelations(SHROUT_FLEISS, { quantity: { label: "Rating", unit: "1" } }),
  );
  assert.match(icc.text, /^Intraclass correlation: Rating \(6 subjects × 4 raters\)/);
  // R psych 2.2.9: ICC(2,1) 0.29 [0.019, 0.76], rounded to the interval's half-width 0.37
  assert.match(icc.text, /ICC\(2,1\) +ICC\(A,1\) .* 0\.29 +\[0\.02, 0\.76\]/);
  assert.match(icc.text, /Caution: Intraclass and concordance correlations depend on the spread/);

  const ccc = shown(concordanceCorrelation(WRIGHT1, MINI1, { methodNames: ["Wright", "mini"] }));
  // R epiR 2.0.57: ρ_c 0.9427 [0.8505, 0.9787]
  assert.match(ccc.text, /Lin's concordance correlation ρ_c +0\.943 +\[0\.850, 0\.979\]/);
  assert.match(ccc.text, /\(mini against Wright, 17 pairs\)/);

  const deming = shown(demingRegression(WRIGHT1, MINI1, { quantity: FLOW })).text;
  // SciPy ODR slope 0.9709, jackknife SE 0.139 (see regression_test.ts)
  assert.match(deming, /Deming slope +0\.97 /);
  assert.match(deming, /Deming intercept \(L\/min\)/);
  assert.match(deming, /jackknife SE 0\.14/);
  const pb = shown(passingBablokRegression(WRIGHT1, MINI1, { quantity: FLOW })).text;
  assert.match(pb, /Passing–Bablok slope +\d\.\d+ +\[\d\.\d+, \d\.\d+\] +\d+ pairwise slopes/);
  assert.match(pb, /Cusum linearity statistic/);

  const kappa = shown(
    cohenKappaFromTable(SEXUAL_FUN, {
      weights: "linear",
      categories: ["never", "fairly", "very", "always"],
      raterNames: ["husband", "wife"],
    }),
  );
  // R vcd 1.4.11: weighted kappa 0.2374, ASE 0.0783
  assert.match(kappa.text, /^weighted kappa \(linear\) \(husband and wife\)/);
  assert.match(kappa.text, /91 +0\.\d+ +0\.\d+ +0\.24 +0\.078 /);
  assert.match(kappa.html, /<td[^>]*>never<\/td><td[^>]*>7<\/td>/);
  const fleiss = shown(fleissKappa(FLEISS_EXAMPLE)).text;
  // Wikipedia worked example (from memory): P̄ = 0.378, P̄e = 0.213, κ = 0.210, all three shown
  // to three decimals (one precision in the row, trailing zero kept)
  assert.match(fleiss, /^Fleiss' kappa\n/);
  assert.match(fleiss, / 0\.378 +0\.213 +0\.210 /);
});

Deno.test("both renderers escape every text that comes from the data", () => {
  const observers = ["Reader A", "<img src=x onerror=alert(1)>", "*bold* | pipe"];
  const rows = ["patient,observer,lvef percent"];
  const subjects = ["P1", "P2", "P3", "[link](http://x)"];
  subjects.forEach((s, i) =>
    observers.forEach((o, j) =>
      rows.push(`"${s}","${o}",${j === 2 && i === 3 ? "" : 50 + 3 * i + j + ((i * j) % 3)}`)
    )
  );
  const report = methodValidation(
    readTable(rows.join("\n"), { source: "odd_<name>.csv", ...validationReadOptions() }),
    { title: "Study <1> & *2*" },
  );
  const html = methodValidationHtml(report, {
    svgs: Object.fromEntries(report.figures.map((f) => [f.file, "<svg></svg>"])),
  });
  assert.doesNotMatch(html, /<img/);
  assert.match(html, /&lt;img src=x onerror=alert\(1\)&gt;/);
  assert.match(html, /<title>Study &lt;1&gt; &amp; \*2\*<\/title>/);
  assert.match(html, /odd_&lt;name&gt;\.csv/);
  assert.equal(html.match(/<figure><svg><\/svg>/g)?.length, report.figures.length);
  const md = methodValidationMarkdown(report);
  assert.doesNotMatch(md, /(^|[^\\])<img/m);
  assert.match(md, /^# Study <1> & \\\*2\\\*$/m); // "<1" opens no tag, "& " no entity
  assert.match(md, /\\\*bold\\\* \\\| pipe/);
  // the missing reading of subject "[link](http://x)": listed, escaped
  assert.match(md, /Missing value, left out: line 13: subject '\\\[link\\\]\(http:\/\/x\)'/);
  assert.match(md, /odd\\_\\<name>\.csv/);
  // every table row keeps its number of cells (no unescaped "|" from a name)
  for (const line of md.split("\n").filter((l) => l.startsWith("| Observer / method"))) {
    assert.equal(line.replace(/\\\|/g, "").split("|").length - 2, 4);
  }
  assert.equal(escapeMarkdown("a\nb", true), "a b");
  assert.equal(escapeMarkdown("- item", true), "\\- item");
  assert.equal(escapeMarkdown("&amp; & x"), "\\&amp; & x");
});

Deno.test("a report displays itself in a notebook without its figures", () => {
  const report = methodValidation(readTable(
    "patient,observer,lvef percent\nP1,A,55\nP1,B,54\nP2,A,40\nP2,B,43\nP3,A,62\nP3,B,61\n",
    { source: "demo.csv" },
  ));
  const { text, html } = shown(report);
  assert.match(text, /^# Method validation report: demo\.csv/);
  assert.match(text, /## Method comparison: B against the reference A/);
  assert.doesNotMatch(text, /!\[/); // no figure links
  assert.match(html, /^<div><h1>Method validation report: demo\.csv<\/h1>/);
  assert.match(html, /Not a diagnosis/);
  // the same text as the Markdown renderer, figures apart
  assert.equal(
    text,
    methodValidationMarkdown(report).split("\n").filter((l) => !l.startsWith("![")).join("\n")
      .replace(/\n{3,}/g, "\n\n"),
  );
});
