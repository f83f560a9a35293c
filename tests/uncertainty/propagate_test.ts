import assert from "node:assert/strict";
import {
  bsaHaycock,
  chain,
  correlation,
  covariance,
  defineCalculation,
  defineQuantity,
  mergeSources,
  normal,
  PHN_2017_MODELS,
  propagate,
  rectangular,
  typeA,
  zScore,
} from "../../mod.ts";

// Synthetic calculations for the chaining checks (invented formulas, not clinical): smooth,
// nonlinear, and with b feeding both steps.
const quantity = (id: string) =>
  defineQuantity({
    id: `test.${id}`,
    label: `test ${id}`,
    unit: "1",
    description: id,
    valid: { min: -100, max: 100 },
    resolution: 1e-6,
  });
const [A, B, C, G, Y] = ["a", "b", "c", "g", "y"].map(quantity) as [
  ReturnType<typeof quantity>,
  ReturnType<typeof quantity>,
  ReturnType<typeof quantity>,
  ReturnType<typeof quantity>,
  ReturnType<typeof quantity>,
];
const synthetic = [{ authors: "test", year: 2026, title: "synthetic", publication: "tests" }];
const g = defineCalculation({
  id: "testChainG",
  title: "g",
  description: "g(a, b)",
  inputs: { a: A, b: B },
  outputs: { g: G },
  formula: ({ a, b }) => ({ g: a * a + Math.sin(b) }),
  formulaText: "g = a² + sin b",
  citations: synthetic,
  cautions: [],
});
const f = defineCalculation({
  id: "testChainF",
  title: "f",
  description: "f(g, b, c)",
  inputs: { g: G, b: B, c: C },
  outputs: { y: Y },
  formula: ({ g, b, c }) => ({ y: g * Math.exp(b / 3) + c }),
  formulaText: "y = g·e^(b/3) + c",
  citations: synthetic,
  cautions: [],
});
const composite = chain([g, f]);
const given = { a: normal(1.3, 0.1), b: normal(0.7, 0.2), c: rectangular(-0.5, 0.5) };
const relative = (x: number, y: number) => Math.abs(x - y) / Math.max(Math.abs(y), 1e-300);

Deno.test("chained GUM of y = f(g(a, b), b, c) equals the one-shot GUM of the composite (1e-9)", () => {
  const first = propagate(g, { a: given.a, b: given.b });
  const second = propagate(f, { g: first.outputs.g, b: first.inputs.b, c: given.c });
  const one = propagate(composite, given);
  const y2 = second.outputs.y, y1 = one.outputs.y;
  assert.ok(relative(y2.value, y1.value) < 1e-9);
  assert.ok(relative(y2.standardUncertainty, y1.standardUncertainty) < 1e-9);
  // the budgets list the same elementary sources with the same sensitivities: b is counted once,
  // through both steps (∂y/∂b = ∂f/∂g·∂g/∂b + ∂f/∂b)
  assert.deepEqual(y2.budget.map((r) => r.source).sort(), ["a", "b", "c"]);
  for (const row of y1.budget) {
    const other = y2.budget.find((r) => r.source === row.source)!;
    assert.ok(relative(other.sensitivity, row.sensitivity) < 1e-9, row.source);
    assert.ok(relative(other.contribution, row.contribution) < 1e-9, row.source);
  }
  // hand derivation (chain rule, JCGM 100:2008 eq. (10)): ∂y/∂a = 2a·e^(b/3),
  // ∂y/∂b = cos b·e^(b/3) + g·e^(b/3)/3, ∂y/∂c = 1 with u(c) = 1/√12 (rectangular of width 1)
  const a = 1.3, b = 0.7, gv = a * a + Math.sin(b), e = Math.exp(b / 3);
  const dyda = 2 * a * e, dydb = Math.cos(b) * e + (gv * e) / 3;
  const u = Math.sqrt((dyda * 0.1) ** 2 + (dydb * 0.2) ** 2 + (1 / Math.sqrt(12)) ** 2);
  assert.ok(relative(y1.standardUncertainty, u) < 1e-9);
  // treating the step's output as independent of b would be wrong: it gives another u
  const naive = propagate(f, {
    g: normal(first.outputs.g.value, first.outputs.g.standardUncertainty),
    b: given.b,
    c: given.c,
  });
  assert.ok(relative(naive.outputs.y.standardUncertainty, u) > 1e-3);
});

Deno.test("chained Monte Carlo equals the one-shot Monte Carlo bit for bit for a seed", () => {
  const options = { method: "monteCarlo", trials: 150_000, seed: 31 } as const;
  const first = propagate(g, { a: given.a, b: given.b }, options);
  const second = propagate(f, { g: first.outputs.g, b: first.inputs.b, c: given.c }, {
    method: "monteCarlo",
  });
  const one = propagate(composite, given, options);
  assert.deepEqual(second.outputs.y.samples, one.outputs.y.samples);
  assert.equal(second.outputs.y.value, one.outputs.y.value);
  assert.deepEqual(second.outputs.y.interval, one.outputs.y.interval);
  // the same distribution given again in the later step is the same source: the same draws
  const again = propagate(f, { g: first.outputs.g, b: given.b, c: given.c }, {
    method: "monteCarlo",
  });
  assert.deepEqual(again.outputs.y.samples, one.outputs.y.samples);
});

Deno.test("GUM and Monte Carlo agree on the chain within the Monte Carlo tolerance", () => {
  const gumResult = propagate(composite, given);
  const mc = propagate(composite, given, { method: "monteCarlo", trials: 200_000, seed: 5 });
  // JCGM 101:2008 §8: agreement of u to its numerical tolerance (2 digits: δ = 0.005 here)
  assert.ok(
    Math.abs(mc.outputs.y.standardUncertainty - gumResult.outputs.y.standardUncertainty) < 0.02,
  );
});

Deno.test("a Z-score from height, weight and a measurement is one chain; u matches the GUM by hand", () => {
  const model = PHN_2017_MODELS.aorticRootSinus;
  const X = 2.2, uX = 0.1, H = 120, uH = 0.5, W = 22, uW = 0.2;
  const r = zScore(model, {
    measurement: normal(X, uX),
    heightCm: normal(H, uH),
    weightKg: normal(W, uW),
  });
  // Haycock BSA (Haycock et al. 1978): 0.024265·W^0.5378·H^0.3964
  const bsa = 0.024265 * W ** 0.5378 * H ** 0.3964;
  const alpha = model.alpha, S = model.sd, M = model.mean;
  // PHN form (Lopez et al. 2017): Z = (X/BSA^α − M)/S
  assert.ok(Math.abs(r.zScore - (X / bsa ** alpha - M) / S) < 1e-12);
  // JCGM 100:2008 eq. (10), by hand: ∂Z/∂X = BSA^−α/S, ∂Z/∂BSA = −α·X·BSA^(−α−1)/S,
  // ∂BSA/∂W = 0.5378·BSA/W, ∂BSA/∂H = 0.3964·BSA/H
  const u = (bsa ** -alpha / S) *
    Math.sqrt(uX ** 2 + (alpha * X) ** 2 * ((0.5378 * uW / W) ** 2 + (0.3964 * uH / H) ** 2));
  assert.ok(relative(r.uncertainty!.standardUncertainty, u) < 1e-8);
  // the budget names the three measurements
  assert.deepEqual(
    r.uncertainty!.budget.map((b) => b.label).sort(),
    ["Aortic root at the sinuses", "Height", "Weight"],
  );
  // the chain is the model's BSA formula followed by its Z-score
  assert.equal(r.bsaM2, bsaHaycock.formula({ heightCm: H, weightKg: W }).bsaM2);
});

Deno.test("outputs computed from shared inputs are correlated without a declared correlation", () => {
  const sv = defineCalculation({
    id: "testSharedInputs",
    title: "shared inputs",
    description: "two outputs of the same inputs",
    inputs: { a: A, b: B },
    outputs: { g: G, y: Y },
    formula: ({ a, b }) => ({ g: a + b, y: a - b }),
    formulaText: "g = a + b; y = a − b",
    citations: synthetic,
    cautions: [],
  });
  const r = propagate(sv, { a: normal(1, 0.3), b: normal(2, 0.4) });
  // cov(a + b, a − b) = u²(a) − u²(b) = 0.09 − 0.16 = −0.07 (JCGM 100:2008 eq. (F.2), by hand)
  assert.ok(Math.abs(covariance(r.outputs.g, r.outputs.y) + 0.07) < 1e-12);
  assert.ok(Math.abs(r.covariance[0]![1]! + 0.07) < 1e-12);
  assert.ok(Math.abs(correlation(r.outputs.g, r.outputs.y) + 0.07 / 0.25) < 1e-12);
});

Deno.test("one name, two measurements: a clear error, and a label keeps them apart", () => {
  const first = propagate(g, { a: normal(1, 0.1), b: normal(0.5, 0.1) });
  const other = propagate(g, { a: normal(2, 0.1), b: normal(0.5, 0.1) });
  assert.throws(() => mergeSources([first.outputs.g.sources, other.outputs.g.sources], "Demo"), {
    name: "TypeError",
    message:
      /^Demo: the source 'a' is given twice with different values \(normal 1, u = 0\.1 and normal 2, u = 0\.1\); expected one measurement per name: give one of the propagations a distinct 'label'$/,
  });
  const labelled = propagate(g, { a: normal(2, 0.1), b: normal(0.5, 0.1) }, { label: "P2" });
  assert.deepEqual(labelled.outputs.g.budget.map((b) => b.source), ["P2/a", "P2/b"]);
  assert.deepEqual(labelled.outputs.g.budget.map((b) => b.label), ["P2: test a", "P2: test b"]);
});

Deno.test("values of one method do not feed the other; Monte Carlo chains share one seed", () => {
  const ab = { a: given.a, b: given.b };
  const gumFirst = propagate(g, ab);
  assert.throws(
    () => propagate(f, { g: gumFirst.outputs.g, b: given.b, c: 0 }, { method: "monteCarlo" }),
    {
      name: "TypeError",
      message:
        /expected 'g' \(test g\) as a Monte Carlo value, a distribution or a number \(one chain, one method\), got a GUM value/,
    },
  );
  const mc = propagate(g, ab, { method: "monteCarlo", trials: 1000, seed: 1 });
  assert.throws(
    () =>
      propagate(f, { g: mc.outputs.g, b: given.b, c: 0 }, {
        method: "monteCarlo",
        seed: 2,
      }),
    {
      name: "RangeError",
      message: /expected the seed 1 and 1000 trials of the inputs' Monte Carlo run/,
    },
  );
  const unkept = propagate(g, ab, { method: "monteCarlo", trials: 1000, keepSamples: false });
  assert.throws(() => propagate(f, { g: unkept.outputs.g, b: 0, c: 0 }, { method: "monteCarlo" }), {
    name: "TypeError",
    message: /from a run without kept samples/,
  });
});

Deno.test("ν_eff is not defined for correlated sources with finite degrees of freedom: stated, and k is conservative", () => {
  const r = propagate(g, { a: typeA([1.2, 1.3, 1.4]), b: typeA([0.6, 0.7, 0.9, 0.8]) }, {
    correlations: [["a", "b", 0.5]],
  });
  const y = r.outputs.g;
  assert.equal(y.effectiveDof, null);
  // k = t_0.975(2) = 4.303 (the smallest ν of the sources; Student t table)
  assert.equal(y.coverageFactor!.toFixed(3), "4.303");
  assert.ok(r.warnings.some((w) => /ν_eff is not defined/.test(w) && /conservatively/.test(w)));
});
