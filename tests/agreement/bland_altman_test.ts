import assert from "node:assert/strict";
import { close } from "../close.ts";
import {
  blandAltman,
  blandAltmanRatio,
  blandAltmanRepeated,
  nonCentralTCdf,
  nonCentralTQuantile,
} from "../../calc/agreement/mod.ts";
import { tQuantile } from "../../calc/stats/mod.ts";
import { MINI1, MINI2, PEAK_FLOW, WRIGHT1, WRIGHT2 } from "./data.ts";

Deno.test("Bland-Altman on the 1986 peak-flow data reproduces the published bias, SD and 2 SD limits", () => {
  const r = blandAltman(WRIGHT1, MINI1, { multiplier: 2 });
  // Bland & Altman 1986 Lancet 327:307, p. 308: mean difference (Wright − mini) −2.1 l/min
  close(r.bias, -2.1, 0.05, "bias");
  // same page: SD of differences 38.8 l/min
  close(r.sdDifferences, 38.8, 0.05, "SD");
  // same page: limits of agreement (2 SD) −79.7 and 75.5 l/min, computed there from the rounded
  // −2.1 ± 2 × 38.8; unrounded they are −79.65 and 75.41, hence the 0.1 tolerance
  close(r.lowerLimit.value, -79.7, 0.1, "lower");
  close(r.upperLimit.value, 75.5, 0.1, "upper");
  assert.equal(r.n, 17);
});

Deno.test("Bland-Altman intervals follow the published formulas (hand-checkable arithmetic)", () => {
  const r = blandAltman(WRIGHT1, MINI1, { multiplier: 2 });
  const n = 17;
  const s = r.sdDifferences;
  // Bland & Altman 1986: bias ± t(0.975, 16)·s/√n; t(0.975, 16) = 2.120 (any t table)
  close(tQuantile(0.975, 16), 2.120, 0.0005, "t table");
  close(r.biasCi.lower, r.bias - 2.1199 * s / Math.sqrt(n), 0.01, "bias CI lower");
  // Bland & Altman 1999 Stat Methods Med Res 8:135 §2.2: SE(limit) = s·√(1/n + z²/(2(n − 1)))
  const se = s * Math.sqrt(1 / n + 4 / (2 * (n - 1)));
  close(r.upperLimit.approximateCi.upper, r.upperLimit.value + 2.1199 * se, 0.01, "approx CI");
  // Proportional bias: slope of difference on mean; no outside value, so check OLS identity:
  // residuals sum to zero (least squares normal equation, hand-checkable)
  const pb = r.proportionalBias!;
  const resid = r.differences.reduce(
    (acc, d, i) => acc + d - pb.intercept - pb.slope * r.means[i]!,
    0,
  );
  close(resid, 0, 1e-9, "OLS residual sum");
});

Deno.test("exact limits of agreement (Carkeet 2015) use non-central t quantiles matching R and SciPy", () => {
  // R 4.2.2: qt(c(0.025, 0.975), 16, 2*sqrt(17)) = 5.55541028738, 13.22077824163
  close(nonCentralTQuantile(0.025, 16, 2 * Math.sqrt(17)), 5.55541028738, 1e-8, "R lower");
  close(nonCentralTQuantile(0.975, 16, 2 * Math.sqrt(17)), 13.22077824163, 1e-8, "R upper");
  // R 4.2.2: qt(c(0.025, 0.975), 29, qnorm(0.975)*sqrt(30)) = 7.94387310085, 15.09846445563
  close(nonCentralTQuantile(0.025, 29, 1.959963984540054 * Math.sqrt(30)), 7.94387310085, 1e-8);
  close(nonCentralTQuantile(0.975, 29, 1.959963984540054 * Math.sqrt(30)), 15.09846445563, 1e-8);
  // SciPy 1.17.1 (Boost): nct.cdf(3, 16, 1.96*sqrt(17)) = 3.7135211286667315e-06
  close(nonCentralTCdf(3, 16, 1.96 * Math.sqrt(17)), 3.7135211286667315e-06, 1e-15, "cdf tail");
  // SciPy 1.17.1: nct.cdf(-1, 5, 2) = 0.0023163756540751507
  close(nonCentralTCdf(-1, 5, 2), 0.0023163756540751507, 1e-12, "cdf negative t");
  // SciPy 1.17.1: nct.cdf(50, 400, 1.96*sqrt(401)) = 0.9999999653225449 (δ ≈ 39; R's pnt
  // switches to an approximation above δ = 37.62, SciPy does not)
  close(nonCentralTCdf(50, 400, 1.96 * Math.sqrt(401)), 0.9999999653225449, 1e-9, "large δ");
  // SciPy 1.17.1: nct.ppf(0.975, 499, 1.96*sqrt(500))/sqrt(500) = 2.1183044705984617
  close(
    nonCentralTQuantile(0.975, 499, 1.96 * Math.sqrt(500)) / Math.sqrt(500),
    2.1183044705984617,
    1e-8,
  );
  // One-sided normal tolerance factor k(n = 10, p = 0.95, γ = 0.95) = 2.911 (Odeh & Owen tables,
  // from memory; also SciPy 1.17.1 nct.ppf(0.95, 9, 1.6449*sqrt(10))/sqrt(10) = 2.9109634)
  close(
    nonCentralTQuantile(0.95, 9, 1.6448536269514722 * Math.sqrt(10)) / Math.sqrt(10),
    2.911,
    0.0005,
  );

  const r = blandAltman(WRIGHT1, MINI1, { multiplier: 2 });
  const s = r.sdDifferences;
  // Carkeet 2015 Optom Vis Sci 92:e71: upper limit CI = d̄ + s·t′/√n with the R quantiles above
  close(r.upperLimit.exactCi.lower, r.bias + s * 5.55541028738 / Math.sqrt(17), 1e-6);
  close(r.upperLimit.exactCi.upper, r.bias + s * 13.22077824163 / Math.sqrt(17), 1e-6);
  close(r.lowerLimit.exactCi.lower, r.bias - s * 13.22077824163 / Math.sqrt(17), 1e-6);
  close(r.lowerLimit.exactCi.upper, r.bias - s * 5.55541028738 / Math.sqrt(17), 1e-6);
});

Deno.test("ratio variant is the log-scale analysis back-transformed (Bland & Altman 1999 §3.3)", () => {
  const r = blandAltmanRatio(WRIGHT1, MINI1);
  const logs = blandAltman(WRIGHT1.map(Math.log), MINI1.map(Math.log));
  // hand-checkable: ratio = exp(mean of log differences)
  close(r.ratio.value, Math.exp(logs.bias), 1e-12);
  close(r.upperRatioLimit.value, Math.exp(logs.bias + 1.96 * logs.sdDifferences), 1e-12);
  assert.throws(() => blandAltmanRatio([1, 0, 2], [1, 1, 2]), {
    name: "RangeError",
    message: /expected 'methodA\[1\]' > 0 for logarithms, got 0$/,
  });
});

Deno.test("repeated-measures variant matches a REML random-intercept model on balanced data", () => {
  const ids = [...PEAK_FLOW.map((_, i) => `s${i}`), ...PEAK_FLOW.map((_, i) => `s${i}`)];
  const r = blandAltmanRepeated(ids, [...WRIGHT1, ...WRIGHT2], [...MINI1, ...MINI2]);
  // R 4.2.2, nlme 3.1.162: lme(d ~ 1, random = ~1|s, method = "REML") on the 34 differences:
  // fixed intercept −6.02941176471, subject variance 789.1471, residual variance 626.7353
  // (for balanced data with positive components, REML equals the ANOVA estimates of
  // Bland & Altman 2007 J Biopharm Stat 17:571)
  close(r.bias, -6.02941176471, 1e-9, "bias");
  close(r.betweenSubjectVariance, 789.1471, 1e-3, "between");
  close(r.withinSubjectVariance, 626.7353, 1e-3, "within");
  close(r.sdDifferences, Math.sqrt(789.1471 + 626.7353), 1e-4, "SD");
  assert.equal(r.subjects, 17);
  assert.throws(() => blandAltmanRepeated(["a", "b"], [1, 2], [1, 3]), {
    name: "RangeError",
    message: /no within-subject information.*got 2 pairs for 2 subjects$/,
  });
  assert.throws(() => blandAltmanRepeated(["a", "a"], [1, 2], [1, 3]), {
    name: "RangeError",
    message: /expected at least 2 subjects, got 1$/,
  });
  assert.throws(() => blandAltmanRepeated(["a"], [1, 2], [1, 3]), {
    name: "TypeError",
    message: /expected 'subjectIds' with one entry per pair \(2\), got an array of length 1$/,
  });
});

Deno.test("Bland-Altman rejects bad input with named fields", () => {
  assert.throws(() => blandAltman([1], [2]), {
    name: "RangeError",
    message: /^Bland-Altman analysis: expected 'methodA' with at least 2 values, got 1$/,
  });
  assert.throws(() => blandAltman([1, NaN, 3], [1, 2, 3]), {
    name: "RangeError",
    message: /^Bland-Altman analysis: expected 'methodA\[1\]' as a finite number, got NaN$/,
  });
  assert.throws(() => blandAltman([1, 2, 3], [1, 2]), {
    name: "TypeError",
    message:
      /^Bland-Altman analysis: expected 'methodB' with 3 values, one per reading of 'methodA' \(paired readings\), got 2$/,
  });
  assert.throws(() => blandAltman([1, 2, "3" as unknown as number], [1, 2, 3]), {
    name: "TypeError",
    message: /^Bland-Altman analysis: expected 'methodA\[2\]' as a number, got "3"$/,
  });
  assert.throws(() => blandAltman([1, 2, 3], [0, 1, 2]), {
    name: "RangeError",
    message: /zero variance.*got SD 0$/,
  });
  assert.throws(() => blandAltman([1, 2, 3], [0, 1, 3], { multiplier: 0 }), {
    name: "RangeError",
    message: /^Bland-Altman analysis: expected 'multiplier' in \(0, 5\], got 0$/,
  });
  assert.throws(() => blandAltman([1, 2, 3], [0, 1, 3], { confidence: 1.5 }), {
    name: "RangeError",
    message: /^Bland-Altman analysis: expected 'confidence' in \(0, 1\), got 1\.5$/,
  });
});
