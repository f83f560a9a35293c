import assert from "node:assert/strict";
import { close } from "../close.ts";
import {
  demingRegression,
  generalDemingRegression,
  passingBablokRegression,
  yorkRegression,
} from "../../calc/agreement/mod.ts";
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

// Pearson K (1901) Philos Mag 2:559 data with York D (1966) Can J Phys 44:1079 weights
// (ω = 1/σ²), the classic test of York's method, as tabulated in York et al. (2004).
const PY_X = [0, 0.9, 1.8, 2.6, 3.3, 4.4, 5.2, 6.1, 6.5, 7.4];
const PY_Y = [5.9, 5.4, 4.4, 4.6, 3.5, 3.7, 2.8, 2.8, 2.4, 1.5];
const PY_SDX = [1000, 1000, 500, 800, 200, 80, 60, 20, 1.8, 1].map((w) => 1 / Math.sqrt(w));
const PY_SDY = [1, 1.8, 4, 8, 20, 20, 70, 70, 100, 500].map((w) => 1 / Math.sqrt(w));

Deno.test("York regression reproduces the published fit of Pearson's data with York's weights", () => {
  const r = yorkRegression(PY_X, PY_Y, { sdX: PY_SDX, sdY: PY_SDY });
  // York et al. 2004, Am J Phys 72:367 (doi:10.1119/1.1632486), results for this data set as
  // quoted to four decimals: b = −0.4805 ± 0.0580, a = 5.4799 ± 0.2950
  close(r.slope, -0.4805, 5e-5, "published slope");
  close(r.intercept, 5.4799, 5e-5, "published intercept");
  close(r.slopeStandardError, 0.058, 5e-5, "published σ_b");
  close(r.interceptStandardError, 0.295, 5e-5, "published σ_a");
  // The bfsl R package (York's solution) tests the same data to nine digits: a = 5.479910224,
  // b = −0.480533407, σ_a = 0.294970735, σ_b = 0.0579850090, S/(n − 2) = 1.483294149
  close(r.intercept, 5.479910224, 1e-8, "bfsl intercept");
  close(r.slope, -0.480533407, 1e-8, "bfsl slope");
  close(r.interceptStandardError, 0.294970735, 1e-8, "bfsl σ_a");
  close(r.slopeStandardError, 0.057985009, 1e-9, "bfsl σ_b");
  close(r.mswd, 1.483294149, 1e-8, "bfsl goodness of fit");
  // S = 11.8663531941, the weighted sum of squares asserted for this data set by the BurnMan test
  // suite (its linear-fit test cites Neri F et al., Meas Sci Technol 1990;1:1007)
  close(r.chiSquare, 11.8663531941, 1e-8, "S");
  assert.equal(r.degreesOfFreedom, 8);
  // P(χ²₈ ≥ 11.87) = 0.1573 (bfsl summary of this fit)
  close(r.fitPValue, 0.1573, 5e-5, "probability of fit");
  // SciPy 1.17.1 scipy.odr (ODRPACK), y = β0 + β1·x with sx, sy per point: cov_beta (the
  // unscaled covariance at the adjusted points) off-diagonal −0.016472543499187118
  close(r.slopeInterceptCovariance, -0.016472543499187118, 1e-8, "cov(a, b)");
});

Deno.test("York regression: intervals from the stated SDs, widened by √MSWD when the scatter exceeds them", () => {
  const r = yorkRegression(PY_X, PY_Y, { sdX: PY_SDX, sdY: PY_SDY });
  // MSWD 1.48 > 1: t(0.975, 8) = 2.306 (any t table) × √MSWD × σ_b (weighted least squares with
  // the scale estimated from the residuals)
  assert.equal(r.intervalBasis, "scaled by √MSWD");
  close(
    r.slopeCi.upper - r.slope,
    2.306 * Math.sqrt(1.483294149) * 0.057985009,
    5e-5,
    "scaled half-width",
  );
  // MSWD < 1 (the 12-point data below with r = −0.5: S = 9.2374 on 10 df): z(0.975) = 1.95996
  // (any normal table) × σ_b
  const q = yorkRegression(ISO_X, ISO_Y, { ...ISO_SD, correlation: -0.5 });
  assert.equal(q.intervalBasis, "stated uncertainties");
  close(q.slopeCi.upper - q.slope, 1.95996 * q.slopeStandardError, 1e-9, "stated half-width");
});

// A 12-point isochron with 1 % SDs in x, 0.5 % in y (the example data of the IsoplotR R package's
// York fit documentation), for correlated errors.
const ISO_X = [
  1.55,
  12.395,
  20.445,
  20.435,
  20.61,
  24.9,
  28.53,
  50.54,
  51.595,
  86.51,
  106.4,
  157.35,
];
const ISO_Y = [
  0.7268,
  0.7849,
  0.82,
  0.8156,
  0.816,
  0.8322,
  0.8642,
  0.9584,
  0.9617,
  1.135,
  1.23,
  1.49,
];
const ISO_SD = { sdX: ISO_X.map((v) => v * 0.01), sdY: ISO_Y.map((v) => v * 0.005) };

Deno.test("York regression with correlated errors matches a direct minimisation of York's criterion", () => {
  // SciPy 1.17.1: scipy.optimize minimisation of York's (1968) S(a, b) = Σ Wᵢ(yᵢ − a − b·xᵢ)²,
  // Wᵢ = 1/(σ²(yᵢ) + b²σ²(xᵢ) − 2b·rσ(xᵢ)σ(yᵢ)); standard errors from the Gauss–Newton normal
  // matrix of the errors-in-variables model with the true x as parameters (per-point 2 × 2 error
  // covariance), inverted (Titterington DM, Halliday AN, Chem Geol 1979;26:183)
  const expected = [
    [
      0.8,
      0.7178538463754728,
      0.004841297698003941,
      26.0276125452041,
      0.0015071503666536318,
      2.6209877543934318e-5,
      -2.9699512065369594e-8,
    ],
    [
      -0.5,
      0.7193780289305571,
      0.0048126557027540935,
      9.237411452075932,
      0.0021631582487969528,
      5.67825718768813e-5,
      -8.67629819165643e-8,
    ],
  ] as const;
  for (const [rho, a, b, s, sa, sb, cov] of expected) {
    const r = yorkRegression(ISO_X, ISO_Y, { ...ISO_SD, correlation: rho });
    close(r.slope / b, 1, 1e-9, `slope r = ${rho}`);
    close(r.intercept / a, 1, 1e-9, `intercept r = ${rho}`);
    close(r.chiSquare / s, 1, 1e-9, `S r = ${rho}`);
    close(r.interceptStandardError / sa, 1, 1e-9, `σ_a r = ${rho}`);
    close(r.slopeStandardError / sb, 1, 1e-9, `σ_b r = ${rho}`);
    close(r.slopeInterceptCovariance / cov, 1, 1e-9, `cov r = ${rho}`);
  }
  // a per-point correlation equal for every point is the same as the single number
  const one = yorkRegression(ISO_X, ISO_Y, { ...ISO_SD, correlation: 0.8 });
  const each = yorkRegression(ISO_X, ISO_Y, { ...ISO_SD, correlation: ISO_X.map(() => 0.8) });
  assert.equal(each.slope, one.slope);
});

Deno.test("York regression reduces to its special cases (York et al. 2004 §IV)", () => {
  // exact x: weighted least squares of y on x, b = Σw(x − x̄w)(y − ȳw)/Σw(x − x̄w)², w = 1/σ²(y)
  // (any regression text); by hand for x = 1..4, y = 1, 3, 2, 5, σ(y) = 1, 1, 2, 2
  const x = [1, 2, 3, 4];
  const y = [1, 3, 2, 5];
  const w = [1, 1, 0.25, 0.25];
  const sw = 2.5;
  const xw = (1 + 2 + 0.75 + 1) / sw; // 1.9
  const yw = (1 + 3 + 0.5 + 1.25) / sw; // 2.3
  const sxy = w.reduce((s, wi, i) => s + wi * (x[i]! - xw) * (y[i]! - yw), 0);
  const sxx = w.reduce((s, wi, i) => s + wi * (x[i]! - xw) ** 2, 0);
  const ols = yorkRegression(x, y, { sdX: 0, sdY: [1, 1, 2, 2] });
  close(ols.slope, sxy / sxx, 1e-12, "weighted least squares slope");
  // σ_b² = 1/Σw(x − x̄w)² for exact x (any regression text)
  close(ols.slopeStandardError, 1 / Math.sqrt(sxx), 1e-12, "weighted least squares σ_b");
  // constant SDs: Deming regression with λ = σ²(y)/σ²(x); SciPy 1.17.1 scipy.odr on the peak-flow
  // data with λ = 2.5: slope 0.9466451707413903, intercept 26.146151224494854
  const deming = yorkRegression(WRIGHT1, MINI1, { sdX: 1, sdY: Math.sqrt(2.5) });
  close(deming.slope, 0.9466451707413903, 1e-6, "Deming slope λ = 2.5");
  close(deming.intercept, 26.146151224494854, 1e-3, "Deming intercept λ = 2.5");
});

Deno.test("General Deming regression: York's line with jackknife intervals", () => {
  const r = generalDemingRegression(PY_X, PY_Y, { sdX: PY_SDX, sdY: PY_SDY });
  // the same minimisation as York's with uncorrelated errors (Martin 2000, Clin Chem 46:100):
  // bfsl's a = 5.479910224, b = −0.480533407 for this data set
  close(r.slope, -0.480533407, 1e-8, "slope");
  close(r.intercept, 5.479910224, 1e-8, "intercept");
  // jackknife from 10 leave-one-out SciPy 1.17.1 scipy.odr fits with per-point sx, sy,
  // √((n − 1)/n Σ(b(i) − b̄)²): slope 0.08630403046544002, intercept 0.42905225458386725
  close(r.slopeStandardError, 0.08630403046544002, 1e-7, "jackknife SE slope");
  close(r.interceptStandardError, 0.42905225458386725, 1e-6, "jackknife SE intercept");
  // interval b ± t(0.975, 8)·SE, t = 2.306 (any t table; Linnet 1990)
  close(r.slopeCi.upper - r.slope, 2.306 * r.slopeStandardError, 1e-4, "CI half-width");
  // equal SDs: the ordinary Deming jackknife, SciPy scipy.odr λ = 1 on the peak-flow data: SE of
  // the slope 0.13901661379069344 from 17 leave-one-out fits
  const equal = generalDemingRegression(WRIGHT1, MINI1, { sdX: 1, sdY: 1 });
  close(equal.slope, 0.9708785589989477, 1e-5, "slope λ = 1");
  close(equal.slopeStandardError, 0.13901661379069344, 1e-5, "jackknife SE λ = 1");
});

Deno.test("York and general Deming regression: bad input is named with its value", () => {
  assert.throws(() => yorkRegression(PY_X, PY_Y, { sdY: PY_SDY } as never), {
    name: "TypeError",
    message:
      "York regression: missing input 'sdX': expected a standard deviation >= 0 per reading (a number or an array), got nothing",
  });
  assert.throws(
    () => yorkRegression(PY_X, PY_Y, { sdX: PY_SDX.map((s, i) => i === 2 ? -1 : s), sdY: 1 }),
    { name: "RangeError", message: "York regression: expected 'sdX[2]' >= 0, got -1" },
  );
  assert.throws(() => yorkRegression(PY_X, PY_Y, { sdX: [1, 2, 3], sdY: 1 }), {
    name: "TypeError",
    message: "York regression: expected 'sdX' as a number or 10 numbers, one per pair, got 3",
  });
  assert.throws(() => yorkRegression(PY_X, PY_Y, { sdX: 1, sdY: 1, correlation: 1 }), {
    name: "RangeError",
    message: "York regression: expected 'correlation' in (-1, 1), got 1",
  });
  assert.throws(() => generalDemingRegression([1, 2, 3], [1, 2, 4], { sdX: 0, sdY: [1, 0, 1] }), {
    name: "RangeError",
    message:
      "General Deming regression: expected 'sdY[1]' > 0 where sdX is 0 (a point with no uncertainty), got 0",
  });
  assert.throws(() => yorkRegression([2, 2, 2], [1, 2, 3], { sdX: 1, sdY: 1 }), {
    name: "RangeError",
    message: "York regression: expected 'x' readings that are not all equal, got all 2",
  });
  assert.throws(() => yorkRegression(PY_X, PY_Y, { sdX: 1, sdY: 1, maxIterations: 1 }), {
    name: "RangeError",
    message:
      "York regression: expected 'maxIterations' enough iterations for the slope to settle within a relative 1e-15, got 1",
  });
});

Deno.test("York and general Deming results display their fit with its provenance", () => {
  const display = Symbol.for("Jupyter.display");
  type Shown = { [display]: () => Record<string, unknown> };
  const york = yorkRegression(PY_X, PY_Y, { sdX: PY_SDX, sdY: PY_SDY });
  const text = String((york as unknown as Shown)[display]()["text/plain"]);
  // S = 11.87 on 8 df, p = 0.157 (bfsl summary of this fit: "Chisq-statistic: 11.87 on 8 degrees
  // of freedom", p-value 0.1573), rounded to two significant digits in the display
  assert.match(text, /S = 11\.87 on 8 df, p = 0\.16/);
  assert.match(
    text,
    /York slope +-0\.48 +\[-0\.64, -0\.32\] +York 2004 SE 0\.058; interval widened/,
  );
  const general = generalDemingRegression(PY_X, PY_Y, { sdX: PY_SDX, sdY: PY_SDY });
  const g = String((general as unknown as Shown)[display]()["text/plain"]);
  assert.match(g, /^General Deming regression \(Y on X, 10 pairs\)/);
  assert.match(g, /jackknife SE 0\.086/);
});
