import assert from "node:assert/strict";
import {
  expressionModel,
  normal,
  numericalTolerance,
  propagate,
  rectangular,
  typeA,
  validateGumWithMonteCarlo,
} from "../../mod.ts";

const sum = expressionModel({
  expression: "a + b",
  inputs: {
    a: { unit: "1", description: "a", range: { min: -100, max: 100 } },
    b: { unit: "1", description: "b", range: { min: -100, max: 100 } },
  },
  output: { name: "y", unit: "1", description: "y" },
});

/** Pearson correlation of two equally long arrays. */
function pearson(x: Float64Array, y: Float64Array): number {
  const n = x.length;
  let mx = 0, my = 0;
  for (let i = 0; i < n; i++) {
    mx += x[i]! / n;
    my += y[i]! / n;
  }
  let sxy = 0, sxx = 0, syy = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i]! - mx) * (y[i]! - my);
    sxx += (x[i]! - mx) ** 2;
    syy += (y[i]! - my) ** 2;
  }
  return sxy / Math.sqrt(sxx * syy);
}

// 30 readings each (invented, test data only): ν = 29
const readingsA = Array.from({ length: 30 }, (_, i) => 10 + Math.sin(i) * 0.5);
const readingsB = Array.from({ length: 30 }, (_, i) => 20 + Math.cos(2 * i) * 0.8);

Deno.test("a correlated Type A pair: Monte Carlo (multivariate t) agrees with the GUM law", () => {
  const inputs = { a: typeA(readingsA), b: typeA(readingsB) };
  const correlations = [["a", "b", 0.6]] as const;
  const gum = propagate(sum, inputs, { correlations: [...correlations] });
  const mc = propagate(sum, inputs, {
    method: "monteCarlo",
    trials: 1_000_000,
    seed: 5,
    correlations: [...correlations],
  });
  // JCGM 101:2008 §6.4.9: the mean of ν + 1 readings is a scaled t with ν degrees of freedom, whose
  // variance is ν/(ν − 2)·s²/n (JCGM 101 eq. (7)); the GUM law uses u = s/√n. For a sum of two such
  // inputs sharing ν (JCGM 102:2011 §6.5.3, multivariate t) the Monte Carlo u is therefore the
  // GUM u times √(ν/(ν − 2)) = √(29/27); they agree within the numerical tolerance δ of u at two
  // significant digits (JCGM 101 §7.9.2)
  const expected = gum.outputs.y.standardUncertainty * Math.sqrt(29 / 27);
  const delta = numericalTolerance(expected, 2);
  assert.ok(Math.abs(mc.outputs.y.standardUncertainty - expected) <= delta);
  // and the draws carry the declared correlation (the multivariate t keeps that of its normals)
  const r = pearson(mc.inputs.a.samples!, mc.inputs.b.samples!);
  assert.ok(Math.abs(r - 0.6) < 0.005, String(r));
  assert.ok(!mc.warnings.some((w) => /infinite/.test(w)));
});

Deno.test("a Gaussian copula gives correlated rectangular and mixed inputs the declared correlation", () => {
  for (
    const [a, b] of [
      [rectangular(0, 1), rectangular(5, 7)],
      [normal(0, 1), rectangular(-1, 1)],
    ] as const
  ) {
    const mc = propagate(sum, { a, b }, {
      method: "monteCarlo",
      trials: 400_000,
      seed: 9,
      correlations: [["a", "b", 0.5]],
    });
    // latent ρ = 2·sin(π·0.5/6) for two rectangular margins (Pearson 1907; Kruskal 1958, JASA
    // 53:814, r = (6/π)·arcsin(ρ/2)) and ρ = 0.5·√(π/3) for normal with rectangular (hand
    // derivation: cov(Z₁, Φ(Z₂)) = ρ·E[φ(Z₂)] = ρ/(2√π), sd(Φ(Z₂)) = 1/√12): the draws' Pearson
    // correlation is 0.5, within its sampling error (1 − r²)/√M ≈ 0.0012
    const r = pearson(mc.inputs.a.samples!, mc.inputs.b.samples!);
    assert.ok(Math.abs(r - 0.5) < 0.006, `${a.kind}/${b.kind}: ${r}`);
    // so the GUM law (u² = u_a² + u_b² + 2r·u_a·u_b, exact for a sum) and Monte Carlo agree
    const gum = propagate(sum, { a, b }, { correlations: [["a", "b", 0.5]] });
    const delta = numericalTolerance(gum.outputs.y.standardUncertainty, 2);
    assert.ok(
      Math.abs(mc.outputs.y.standardUncertainty - gum.outputs.y.standardUncertainty) <= delta,
    );
  }
});

Deno.test("three repeated readings (ν = 2): Monte Carlo says its u is not meaningful", () => {
  const mc = propagate(sum, { a: typeA([1, 2, 4]), b: 0 }, {
    method: "monteCarlo",
    trials: 20_000,
    seed: 1,
  });
  // JCGM 101:2008 §6.4.9.4: the t distribution has finite variance only for ν > 2
  assert.ok(
    mc.warnings.some((w) =>
      /a is drawn from a t distribution with ν = 2 \(3 repeated readings\): its variance is infinite for ν ≤ 2/
        .test(w)
    ),
    mc.warnings.join("\n"),
  );
  const four = propagate(sum, { a: typeA([1, 2, 4, 3]), b: 0 }, {
    method: "monteCarlo",
    trials: 20_000,
    seed: 1,
  });
  assert.ok(!four.warnings.some((w) => /infinite/.test(w)));
});

Deno.test("the GUM check says whether its Monte Carlo verdict is stable under the seed", () => {
  const inputs = { a: normal(0, 1), b: rectangular(-1, 1) };
  const gum = propagate(sum, inputs);
  const fixed = propagate(sum, inputs, { method: "monteCarlo", trials: 100_000, seed: 2 });
  const [v] = validateGumWithMonteCarlo(gum, fixed, 1);
  assert.equal(v!.stable, false);
  assert.match(v!.verdict, /from a fixed-size Monte Carlo run: near δ this verdict can change/);
  const adaptive = propagate(sum, inputs, { method: "monteCarlo", adaptive: true, seed: 2 });
  const [w] = validateGumWithMonteCarlo(gum, adaptive, 1);
  assert.equal(w!.stable, true);
  assert.doesNotMatch(w!.verdict, /can change/);
});
