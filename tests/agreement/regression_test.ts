import assert from "node:assert/strict";
import { close } from "./close.ts";
import { demingRegression, passingBablokRegression } from "../../calc/agreement/mod.ts";
import { MINI1, WRIGHT1 } from "./data.ts";

Deno.test("Deming regression matches orthogonal distance regression in SciPy", () => {
  // SciPy 1.17.1 scipy.odr (ODRPACK), model y = b0 + b1·x, sx = 1, sy = √λ, fit_type 0:
  // λ = 1: slope 0.9708785589989477, intercept 15.232598409483279
  const r1 = demingRegression(WRIGHT1, MINI1);
  close(r1.slope, 0.9708785589989477, 1e-5, "slope λ=1"); // ODRPACK stops at its own tolerance
  close(r1.intercept, 15.232598409483279, 2e-3, "intercept λ=1");
  // λ = 2.5: slope 0.9466451707413903, intercept 26.146151224494854
  const r2 = demingRegression(WRIGHT1, MINI1, { errorVarianceRatio: 2.5 });
  close(r2.slope, 0.9466451707413903, 1e-6, "slope λ=2.5");
  close(r2.intercept, 26.146151224494854, 1e-3, "intercept λ=2.5");
  // Jackknife SE from 17 leave-one-out scipy.odr fits, √((n−1)/n Σ(b(i) − b̄)²):
  // λ = 1: slope 0.13901661379069344, intercept 69.47933992663121
  close(r1.slopeStandardError, 0.13901661379069344, 1e-5, "jackknife SE slope");
  close(r1.interceptStandardError, 69.47933992663121, 2e-3, "jackknife SE intercept");
  // Linnet 1990: interval b ± t(n − 2)·SE; t(0.975, 15) = 2.131 (any t table)
  close(r1.slopeCi.upper - r1.slope, 2.1314 * r1.slopeStandardError, 1e-4, "CI half-width");
});

Deno.test("Deming regression: OLS limit and bad input", () => {
  // Deming 1943: as λ → ∞ (x without error) the slope tends to the least-squares slope of y on x
  // (hand-checkable: S_xy/S_xx = 1 for y = x + alternating noise centred on x)
  const x = [1, 2, 3, 4, 5, 6];
  const y = [1.5, 1.5, 3.5, 3.5, 5.5, 5.5];
  const sxy = 16; // Σ(x − 3.5)(y − 3.5) = 5 + 3 + 0 + 0 + 3 + 5, hand-computed
  const sxx = 17.5; // Σ(x − 3.5)²
  close(demingRegression(x, y, { errorVarianceRatio: 1e6 }).slope, sxy / sxx, 1e-5);
  assert.throws(() => demingRegression(x, y, { errorVarianceRatio: -1 }), {
    name: "RangeError",
    message: /expected 'errorVarianceRatio' in \(0, ∞\), got -1$/,
  });
  assert.throws(() => demingRegression([1, 2, 3], [2, 2, 2]), {
    name: "RangeError",
    message: /expected a linear association between x and y, got covariance 0$/,
  });
});

Deno.test("Passing-Bablok slope and interval match SciPy's Theil-Sen estimator when no slope is below -1", () => {
  const x = [1.2, 2.3, 2.9, 4.1, 5.2, 5.9, 7.3, 8.1, 9.0, 10.2, 11.1, 12.4];
  const y = [1.5, 2.1, 3.4, 4.0, 5.9, 6.1, 7.0, 8.9, 9.3, 10.1, 12.0, 12.2];
  const r = passingBablokRegression(x, y);
  // Passing & Bablok 1983 §3: with K = 0 (all 66 slopes > −1, checked) the estimator is the
  // median of pairwise slopes and the interval uses Kendall's variance n(n−1)(2n+5)/18, as
  // SciPy 1.17.1 stats.theilslopes(y, x, 0.95, method="joint") (no ties):
  // slope 1.0063291139240507, low 0.9178082191780822, high 1.0869565217391306,
  // intercept median(y − b·x) = 0.20284810126582276
  close(r.slope, 1.0063291139240507, 1e-12, "slope");
  close(r.slopeCi.lower, 0.9178082191780822, 1e-12, "low");
  close(r.slopeCi.upper, 1.0869565217391306, 1e-12, "high");
  close(r.intercept, 0.20284810126582276, 1e-12, "intercept");
  assert.equal(r.slopesUsed, 66);
  assert.equal(r.linearity.nonLinear, false);
});

Deno.test("Passing-Bablok shifted median and cusum check (hand-checkable)", () => {
  // Passing & Bablok 1983 §3, by hand for x = 0..5, y = 0, 3, 1, 3, 4, 6: the 15 pairwise slopes
  // sorted are −2, 0, 1/3, 0.5, 0.75, 1, 1, 1, 1.2, 1.5, 1.5, 5/3, 2, 2, 3; K = 1 slope < −1;
  // N = 15 odd → b = S((N + 1)/2 + K) = S(9) = 1.2 (the unshifted median S(8) would be 1)
  const r = passingBablokRegression([0, 1, 2, 3, 4, 5], [0, 3, 1, 3, 4, 6]);
  close(r.slope, 1.2, 1e-12);
  // a = median(y − 1.2x) = median(0, 1.8, −1.4, −0.6, −0.8, 0) = −0.3
  close(r.intercept, -0.3, 1e-12);
  // C = 1.96·√(6·5·17/18) = 10.43, M1 = round((15 − 10.43)/2) = 2, M2 = 15 − 2 + 1 = 14:
  // slope interval [S(M1 + K), S(M2 + K)] = [S(3), S(15)] = [1/3, 3]
  close(r.slopeCi.lower, 1 / 3, 1e-12);
  close(r.slopeCi.upper, 3, 1e-12);
  // A clearly curved relation fails the cusum linearity check (Passing & Bablok 1983 §4)
  const xq = Array.from({ length: 20 }, (_, i) => i + 1);
  const yq = xq.map((v) => 0.1 * v * v + ((v % 3) - 1) * 0.3);
  assert.equal(passingBablokRegression(xq, yq).linearity.nonLinear, true);
  assert.throws(() => passingBablokRegression([1, 2, 3, 4, 5, 6], [6, 5, 4, 3, 2, 1.5]), {
    name: "RangeError",
    message: /positively related methods \(finite slope > 0\), got slope -/,
  });
  assert.throws(() => passingBablokRegression([0, 1, 2, 3], [0, 3, 1, 3]), {
    name: "RangeError",
    message: /expected enough pairs for a 0.95 interval, got 4$/,
  });
});
