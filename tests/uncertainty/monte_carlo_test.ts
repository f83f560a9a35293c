import assert from "node:assert/strict";
import {
  arcsine,
  expressionModel,
  normal,
  propagate,
  rectangular,
  studentT,
  triangular,
  validateGumWithMonteCarlo,
} from "../../mod.ts";
import { comparisonLoss } from "./jcgm101_models.ts";

const wide = { min: -1e6, max: 1e6 };
const additive = expressionModel({
  expression: "x1 + x2 + x3 + x4",
  inputs: {
    x1: { unit: "1", description: "x1", range: wide },
    x2: { unit: "1", description: "x2", range: wide },
    x3: { unit: "1", description: "x3", range: wide },
    x4: { unit: "1", description: "x4", range: wide },
  },
  output: { name: "y", unit: "1", description: "sum" },
});

Deno.test("JCGM 101 §9.2.2 additive model, normal inputs: MC agrees with GUM", () => {
  const inputs = { x1: normal(0, 1), x2: normal(0, 1), x3: normal(0, 1), x4: normal(0, 1) };
  const g = propagate(additive, inputs);
  const m = propagate(additive, inputs, { method: "monteCarlo", seed: 11 });
  // JCGM 101:2008 Table 2: GUF and MCM (10⁶ trials): y = 0.00, u(y) = 2.00, interval [−3.92, 3.92]
  assert.equal(g.outputs.y.standardUncertainty, 2);
  assert.equal(g.outputs.y.interval.upper.toFixed(2), "3.92");
  // Monte Carlo tolerance: the standard error of a 97.5 % quantile at M = 10⁶ is about 0.005, so
  // endpoints are checked to ±0.02 (4 standard errors), u and y to ±0.01
  assert.ok(Math.abs(m.outputs.y.standardUncertainty - 2) < 0.01);
  assert.ok(Math.abs(m.outputs.y.value) < 0.01);
  assert.ok(Math.abs(m.outputs.y.interval.lower + 3.92) < 0.02);
  assert.ok(Math.abs(m.outputs.y.interval.upper - 3.92) < 0.02);
  // JCGM 101:2008 §9.2.2.4: the GUF is validated (n_dig = 2) by the MCM result
  const [v] = validateGumWithMonteCarlo(g, m, 2);
  assert.ok(v!.validated, v!.verdict);
  assert.equal(g.outputs.y.firstOrderAdequate, true); // a linear model needs no higher-order terms
});

Deno.test("JCGM 101 §9.2.3 additive model, rectangular inputs: MC interval ±3.88 vs GUM ±3.92", () => {
  const h = Math.sqrt(3); // rectangular with u = 1: half-width √3
  const inputs = {
    x1: rectangular(-h, h),
    x2: rectangular(-h, h),
    x3: rectangular(-h, h),
    x4: rectangular(-h, h),
  };
  const g = propagate(additive, inputs);
  const m = propagate(additive, inputs, { method: "monteCarlo", seed: 12 });
  // JCGM 101:2008 Table 3: GUF [−3.92, 3.92]; MCM 10⁶: u = 2.00, [−3.88, 3.88]. The exact endpoint
  // is 2√3·(4 − 2 − 0.6^(1/4)) = 3.8795 from the Irwin–Hall CDF 1 − (4 − s)⁴/24 (analytic).
  assert.equal(g.outputs.y.interval.upper.toFixed(2), "3.92");
  assert.ok(Math.abs(m.outputs.y.standardUncertainty - 2) < 0.01);
  const exact = 2 * h * (2 - 0.6 ** 0.25);
  assert.ok(Math.abs(m.outputs.y.interval.upper - exact) < 0.02);
  assert.ok(Math.abs(m.outputs.y.interval.lower + exact) < 0.02);
});

Deno.test("JCGM 101 §9.4 comparison loss at x = 0: first order fails, MC and second order do not", () => {
  const inputs = { x1: normal(0, 0.005), x2: normal(0, 0.005) };
  const first = propagate(comparisonLoss, inputs);
  // JCGM 101:2008 Table 10 (x1 = 0, from memory): first-order GUF u(δY) = 0
  assert.equal(first.outputs.dY.standardUncertainty, 0);
  assert.ok(
    first.warnings.some((w) => /inadequate/.test(w) && /vanishes/.test(w)),
    first.warnings.join("\n"),
  );
  // the result says so itself, in the data and in what a notebook shows
  assert.equal(first.outputs.dY.firstOrderAdequate, false);
  const shown = (first as unknown as Record<symbol, () => Record<string, string>>)[
    Symbol.for("Jupyter.display")
  ]!();
  assert.match(shown["text/plain"]!, /NOT ADEQUATE: first-order result/);
  // Second-order GUF: u = 2u² = 5.0 × 10⁻⁵ (JCGM 101 Table 10, GUF with higher-order terms)
  const second = propagate(comparisonLoss, inputs, { secondOrder: true });
  assert.ok(Math.abs(second.outputs.dY.standardUncertainty - 5e-5) < 1e-12);
  // MCM: δY/u² ~ χ²₂ (analytic): mean 2u² = 5.0e-5, sd 2u² = 5.0e-5, shortest 95 % interval
  // [0, −2u²·ln 0.05] = [0, 1.50e-4]; JCGM 101 Table 10 prints 0.000 050, 0.000 050, [0.000 000, 0.000 150]
  const m = propagate(comparisonLoss, inputs, { method: "monteCarlo", seed: 13 });
  assert.ok(Math.abs(m.outputs.dY.value - 5e-5) < 2e-7);
  assert.ok(Math.abs(m.outputs.dY.standardUncertainty - 5e-5) < 5e-7);
  assert.ok(m.outputs.dY.shortestInterval!.lower < 1e-8);
  assert.ok(Math.abs(m.outputs.dY.shortestInterval!.upper - -2 * 25e-6 * Math.log(0.05)) < 1.5e-6);
  const [v] = validateGumWithMonteCarlo(first, m, 2);
  assert.equal(v!.validated, false);
  assert.match(v!.verdict, /NOT validated/);
});

Deno.test("Monte Carlo: the same seed gives bit-identical results; another seed differs", () => {
  const inputs = { x1: normal(1, 0.1), x2: rectangular(0, 1), x3: normal(0, 1), x4: 2 };
  const a = propagate(additive, inputs, { method: "monteCarlo", trials: 20_000, seed: 99 });
  const b = propagate(additive, inputs, { method: "monteCarlo", trials: 20_000, seed: 99 });
  const c = propagate(additive, inputs, { method: "monteCarlo", trials: 20_000, seed: 100 });
  assert.deepEqual(a.outputs.y.samples, b.outputs.y.samples);
  assert.notEqual(a.outputs.y.value, c.outputs.y.value);
});

Deno.test("Adaptive Monte Carlo (JCGM 101 §7.9) stabilises and agrees with the GUM on a linear model", () => {
  const inputs = { x1: normal(0, 1), x2: normal(0, 1), x3: normal(0, 1), x4: normal(0, 1) };
  const r = propagate(additive, inputs, {
    method: "monteCarlo",
    adaptive: { significantDigits: 2 },
    seed: 5,
  });
  assert.ok(r.monteCarlo!.adaptive!.stabilized);
  assert.ok(r.monteCarlo!.adaptive!.sequences >= 2);
  // JCGM 101 §7.9.4: M = max(⌈100/(1 − p)⌉, 10⁴) = 10⁴ for p = 0.95
  assert.equal(r.monteCarlo!.adaptive!.trialsPerSequence, 10_000);
  // δ for u = 2.0 at 2 digits is 0.05 (JCGM 101 §7.9.2 rule); the result lies within it of the GUM value
  assert.equal(r.monteCarlo!.adaptive!.tolerance.y, 0.05);
  assert.ok(Math.abs(r.outputs.y.standardUncertainty - 2) < 0.05);
});

Deno.test("Monte Carlo: non-finite model values are excluded and counted, or an error naming the output and trial", () => {
  const inverse = expressionModel({
    expression: "1 / sqrt(x)",
    inputs: { x: { unit: "1", description: "x", range: { min: 0, max: 10 } } },
    output: { name: "y", unit: "1", description: "y" },
  });
  const options = { method: "monteCarlo", trials: 10_000, seed: 1 } as const;
  // x ~ N(0.01, 1) is below 0 about half the time: Φ(−0.01) = 0.496 (standard normal table)
  const r = propagate(inverse, { x: normal(0.01, 1) }, options);
  const share = r.monteCarlo!.excludedTrials / 10_000;
  // binomial standard error √(0.25/10⁴) = 0.005: allow 4σ
  assert.ok(Math.abs(share - 0.496) < 0.02, String(share));
  assert.ok(r.warnings.some((w) => /were physically inconsistent and were excluded/.test(w)));
  assert.ok(Number.isFinite(r.outputs.y.value) && Number.isFinite(r.outputs.y.interval.upper));
  assert.throws(
    () => propagate(inverse, { x: normal(0.01, 1) }, { ...options, inconsistentTrials: "refuse" }),
    { name: "RangeError", message: /output 'y' is not finite at Monte Carlo trial \d+ \(x = -/ },
  );
});

Deno.test("Monte Carlo: draws outside an input's valid range are reported, excluded or refused", () => {
  const sq = expressionModel({
    expression: "x^2",
    inputs: { x: { unit: "1", description: "x", range: { min: 0, max: 10 } } },
    output: { name: "y", unit: "1", description: "y" },
  });
  const options = { method: "monteCarlo", trials: 100_000, seed: 3 } as const;
  const r = propagate(sq, { x: normal(0.1, 0.1) }, options);
  // P(x < 0) = Φ(−1) = 0.1587 (standard normal table); binomial σ = 0.0012
  assert.ok(Math.abs(r.monteCarlo!.excludedTrials / 100_000 - 0.1587) < 0.005);
  assert.ok(r.warnings.some((w) => /draws of x outside \[0, 10\]/.test(w)));
  // the kept trials are the normal truncated at 0: E[x² | x > 0] for x ~ N(0.1, 0.1²):
  // E[x | x > 0] = μ + σφ(1)/Φ(1) = 0.1 + 0.1·0.24197/0.84134 = 0.128760, Var = σ²(1 − 1·φ(1)/Φ(1)
  // − (φ(1)/Φ(1))²) = 0.01·(1 − 0.287600 − 0.082714) = 0.0062969 (truncated normal moments,
  // Johnson, Kotz & Balakrishnan 1994, §10.1), so E[x²] = 0.0062969 + 0.128760² = 0.0228759
  assert.ok(Math.abs(r.outputs.y.value - 0.0228759) < 3e-4);
  assert.throws(
    () => propagate(sq, { x: normal(0.1, 0.1) }, { ...options, inconsistentTrials: "refuse" }),
    {
      name: "RangeError",
      message:
        /Monte Carlo refused \(inconsistentTrials: "refuse"\): \d+ of 100000 draws of 'x' fell outside its valid range \[0, 10\]/,
    },
  );
  assert.throws(
    () =>
      propagate(sq, { x: normal(0.1, 0.1) }, { ...options, inconsistentTrials: "drop" as never }),
    {
      name: "TypeError",
      message:
        'Expression model: x^2: expected inconsistentTrials "exclude" or "refuse", got "drop"',
    },
  );
});

Deno.test("adaptive Monte Carlo: a trial limit below two sequences is refused with the limit shown", () => {
  // JCGM 101:2008 §7.9.4: M = max(⌈100/(1 − p)⌉, 10⁴) trials per sequence and h ≥ 2 sequences
  for (const maxTrials of [5000, 19_999, NaN, -1, 25_000.5]) {
    assert.throws(
      () =>
        propagate(additive, { x1: normal(0, 1), x2: 0, x3: 0, x4: 0 }, {
          method: "monteCarlo",
          adaptive: { maxTrials },
        }),
      {
        name: "RangeError",
        message: new RegExp(
          `expected maxTrials to be an integer >= 20000 \\(two sequences of M = 10000 trials, JCGM 101 §7\\.9\\), got ${maxTrials}`,
        ),
      },
    );
  }
  const r = propagate(additive, { x1: normal(0, 1), x2: 0, x3: 0, x4: 0 }, {
    method: "monteCarlo",
    adaptive: { maxTrials: 20_000, significantDigits: 4 },
  });
  assert.equal(r.monteCarlo!.trials, 20_000);
  assert.equal(r.monteCarlo!.adaptive!.stabilized, false);
});

Deno.test("Monte Carlo: M ≥ 1/(1 − p) holds at the boundary despite the rounding of 1 − p", () => {
  // JCGM 101:2008 §7.2.1: M should be at least 1/(1 − p); for p = 0.9999 that is 10⁴ exactly,
  // though 1/(1 − 0.9999) evaluates to 10000.0000000011 in double precision (Node.js check)
  const inputs = { x1: normal(0, 1), x2: 0, x3: 0, x4: 0 };
  assert.equal(
    propagate(additive, inputs, { method: "monteCarlo", trials: 10_000, coverage: 0.9999, seed: 1 })
      .monteCarlo!.trials,
    10_000,
  );
  assert.throws(
    () =>
      propagate(additive, inputs, {
        method: "monteCarlo",
        trials: 9_999,
        coverage: 0.9999,
        seed: 1,
      }),
    {
      name: "RangeError",
      message: /expected at least 1\/\(1 − p\) = 10000 trials for coverage 0\.9999, got 9999/,
    },
  );
});

Deno.test("Monte Carlo: an input's draws, recomputed on first use, are the draws the run used, bit for bit", () => {
  const copy = expressionModel({
    expression: "x",
    inputs: { x: { unit: "1", description: "x", range: wide } },
    output: { name: "y", unit: "1", description: "y" },
  });
  // every kind of independent draw, over three whole blocks and a shorter last one
  for (
    const x of [
      normal(2, 0.5),
      rectangular(-1, 3),
      triangular(0, 4, 1),
      arcsine(0.9, 1.1),
      studentT(1, 0.05, 4),
    ]
  ) {
    const r = propagate(copy, { x }, { method: "monteCarlo", trials: 3 * 65_536 + 777, seed: 9 });
    const drawn = r.inputs.x.samples!;
    // y = x on every trial: the model values are the draws as the run made them
    assert.deepEqual(drawn, r.outputs.y.samples);
    // the source set of the result holds the same array (one array per source and run)
    const [key] = [...r.inputs.x.sources.sources.keys()];
    assert.equal(r.inputs.x.sources.samples.get(key!), drawn);
    assert.equal(r.outputs.y.sources.samples.get(key!), drawn);
  }
});
