import assert from "node:assert/strict";
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import {
  AORTIC_STENOSIS_2017,
  continuityValveArea,
  continuityValveAreaWithAngles,
  crossSectionalArea,
  gradeSeverity,
  gum,
  insonationAngleEffect,
  MITRAL_REGURGITATION_2017,
  monteCarlo,
  normal,
  pisaRegurgitation,
} from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what = "") =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what} expected ${expected} ± ${tol}, got ${actual}`,
  );

const DEG = Math.PI / 180;

Deno.test("angle uncertainty at θ ≈ 0: GUM sees zero sensitivity and warns; Monte Carlo is honest", () => {
  const inputs = { measuredVelocity: 4, angleDeg: normal(0, 10) };
  const g = gum(insonationAngleEffect, inputs);
  // JCGM 100 §5.1.2: first-order term c·u with c = ∂(v/cos θ)/∂θ = v·sin θ/cos²θ = 0 at θ = 0
  close(g.outputs.trueVelocity.standardUncertainty, 0, 1e-6, "first-order u");
  assert.ok(
    g.warnings.some((w) => /inadequate for 'trueVelocity' with respect to 'angleDeg'/.test(w)),
    `expected a first-order warning, got ${JSON.stringify(g.warnings)}`,
  );
  assert.ok(g.warnings.some((w) => /'trueGradient' with respect to 'angleDeg'/.test(w)));

  const m = monteCarlo(insonationAngleEffect, inputs, { trials: 200_000, seed: 7 });
  // Expected value from the series sec θ = 1 + θ²/2 + 5θ⁴/24 + 61θ⁶/720 (Abramowitz & Stegun
  // 4.3.69) and normal moments E θ² = σ², E θ⁴ = 3σ⁴, E θ⁶ = 15σ⁶: E[sec θ] = 1.015847 at σ = 10°
  const s = 10 * DEG;
  const meanSec = 1 + s ** 2 / 2 + (5 * 3 * s ** 4) / 24 + (61 * 15 * s ** 6) / 720;
  close(m.outputs.trueVelocity.estimate, 4 * meanSec, 0.002, "E[v/cos θ]");
  // The true velocity is never below the reading: the whole interval lies at or above 4 m/s
  assert.ok(m.outputs.trueVelocity.symmetricInterval[0] >= 4);
  // Second-order GUM term ½(f'')²u⁴ with f'' = v at θ = 0 (JCGM 100 §5.1.2 note):
  // u ≈ v·σ²/√2 = 0.0862 m/s; Monte Carlo agrees within 10 %
  close(m.outputs.trueVelocity.standardUncertainty, (4 * s * s) / Math.SQRT2, 0.0086, "u(v)");
  // E[sec²θ] = 1 + σ² + 2σ⁴ + ... (sec²θ = 1 + θ² + 2θ⁴/3 + ..., same moments): gradient bias
  const meanSec2 = 1 + s ** 2 + 2 * s ** 4;
  close(m.outputs.trueGradient.estimate, 64 * meanSec2, 0.15, "E[4v²/cos²θ]");
});

Deno.test("second-order GUM recovers the Monte Carlo spread at θ = 0", () => {
  const g2 = gum(insonationAngleEffect, { measuredVelocity: 4, angleDeg: normal(0, 10) }, {
    secondOrder: true,
  });
  // JCGM 100 §5.1.2 note: u² = ½(∂²f/∂θ²)²u⁴ with ∂²f/∂θ² = v (per rad²) → u = 4·σ²/√2
  const s = 10 * DEG;
  close(g2.outputs.trueVelocity.standardUncertainty, (4 * s * s) / Math.SQRT2, 0.002);
});

Deno.test("angle uncertainty into the continuity valve area: E[AVA] = AVA_aligned · e^(−σ²/2)", () => {
  const inputs = {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    lvotAngleDeg: 0,
    avPeakVelocity: 4,
    avAngleDeg: normal(0, 15),
  };
  const g = gum(continuityValveAreaWithAngles, inputs);
  assert.ok(g.warnings.some((w) => /'avaCm2' with respect to 'avAngleDeg'/.test(w)));
  const m = monteCarlo(continuityValveAreaWithAngles, inputs, { trials: 200_000, seed: 11 });
  // AVA_true = AVA_aligned·cos θ; E[cos θ] = exp(−σ²/2) for θ ~ N(0, σ²) (characteristic function
  // of the normal distribution, any probability text)
  const aligned = Math.PI / 4; // π·2²/4 · 1/4 (hand-checkable)
  const s = 15 * DEG;
  close(m.outputs.avaCm2.estimate, aligned * Math.exp(-(s * s) / 2), 0.001, "E[AVA]");
  // the angle can only make the true area smaller than the aligned estimate
  assert.ok(m.outputs.avaCm2.symmetricInterval[1] <= aligned + 1e-12);
});

Deno.test("LVOT diameter error is squared into area and valve area (GUM relative law)", () => {
  // JCGM 100 §5.1.6: for Y = c·X^p, u_r(Y) = |p|·u_r(X); d = 2.0 ± 0.1 cm (5 %) → area 10 %
  const a = gum(crossSectionalArea, { diameterCm: normal(2.0, 0.1) });
  close(
    a.outputs.areaCm2.standardUncertainty / a.outputs.areaCm2.value,
    0.10,
    1e-6,
    "u_r(CSA)",
  );
  // JCGM 100 eq. (12): u_r² = (2·u_r(d))² + u_r(VTI_LVOT)² + u_r(VTI_AV)²
  // = 0.10² + (1.5/22)² + (4/90)² → u_r = 0.12968
  const r = gum(continuityValveArea, {
    lvotDiameterCm: normal(2.0, 0.1),
    lvotVtiCm: normal(22, 1.5),
    avVtiCm: normal(90, 4),
  });
  const expected = Math.sqrt(0.1 ** 2 + (1.5 / 22) ** 2 + (4 / 90) ** 2);
  close(r.outputs.avaCm2.standardUncertainty / r.outputs.avaCm2.value, expected, 1e-5, "u_r(AVA)");
  // the diameter dominates the budget: share 0.01/0.016817 = 59 % (hand-checkable)
  const share = r.outputs.avaCm2.budget.find((b) => b.input === "lvotDiameterCm")!.share;
  close(share, 0.01 / expected ** 2, 1e-4, "diameter share");
});

Deno.test("probability of each AS class from Monte Carlo samples matches the exact normal probability", () => {
  // AVA = π d²/4 · 20/60 is monotone in d, so P(AVA < 1.0) = P(d < d*) with
  // d* = √(4·1.0·60/(π·20)) = 1.95441 cm; d ~ N(2.0, 0.1) → Φ(−0.4559) = 0.3242
  // (normal CDF from the @stdlib reference library)
  const m = monteCarlo(
    continuityValveArea,
    { lvotDiameterCm: normal(2.0, 0.1), lvotVtiCm: 20, avVtiCm: 60 },
    { trials: 100_000, seed: 3 },
  );
  const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, m.outputs.avaCm2);
  const dSevere = Math.sqrt((4 * 1.0 * 60) / (Math.PI * 20));
  const dModerateTop = Math.sqrt((4 * 1.5 * 60) / (Math.PI * 20));
  const pSevere = normalCdf(dSevere, 2.0, 0.1);
  const pMild = 1 - normalCdf(dModerateTop, 2.0, 0.1);
  const p = Object.fromEntries(d.probabilities.map((x) => [x.grade, x.probability]));
  close(pSevere, 0.3242, 2e-4, "exact P(severe)");
  close(p.severe!, pSevere, 0.006, "MC P(severe)");
  close(p.mild!, pMild, 0.003, "MC P(mild)");
  close(p.severe! + p.moderate! + p.mild!, 1, 1e-12, "probabilities sum to 1");
  // the point estimate 1.047 cm² is "moderate", yet severe has about a one-in-three chance
  assert.equal(d.grade, "moderate");
  assert.equal(d.count, 100_000);
});

Deno.test("PISA radius uncertainty is squared into EROA and graded", () => {
  // JCGM 100 §5.1.6: r = 1.0 ± 0.05 cm (5 %) → u_r(EROA) = 2·5 % = 10 % (other inputs exact)
  const inputs = {
    radiusCm: normal(1.0, 0.05),
    aliasingVelocityCmPerS: 40,
    wallAngleDeg: 180,
    regurgitantPeakVelocity: 5,
    regurgitantVtiCm: 150,
  };
  const g = gum(pisaRegurgitation, inputs);
  close(g.outputs.eroaCm2.standardUncertainty / g.outputs.eroaCm2.value, 0.1, 1e-6);
  // Monte Carlo: P(EROA ≥ 0.40) = P(r ≥ √(0.40·500/(2π·40))) = P(r ≥ 0.89206) = Φ(2.1588) ≈ 0.9846
  const m = monteCarlo(pisaRegurgitation, inputs, { trials: 100_000, seed: 5 });
  const pSevere = gradeSeverity(
    MITRAL_REGURGITATION_2017.eroa,
    m.outputs.eroaCm2,
  ).probabilities.find((x) => x.grade === "severe")!.probability;
  const rStar = Math.sqrt((0.4 * 500) / (2 * Math.PI * 40));
  close(pSevere, 1 - normalCdf(rStar, 1.0, 0.05), 0.003, "P(severe MR)");
});
