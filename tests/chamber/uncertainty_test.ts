import assert from "node:assert/strict";
import { normal, propagate } from "../../calc/uncertainty/mod.ts";
import { ejectionFraction, lvMassLinear } from "../../calc/chamber/mod.ts";

const relClose = (actual: number, expected: number, tol: number): void =>
  assert.ok(Math.abs(actual / expected - 1) <= tol, `expected ${expected}, got ${actual}`);

// EF = 100·(1 − ESV/EDV). Sensitivities (hand-derived): c_EDV = 100·ESV/EDV², c_ESV = −100/EDV.
// JCGM 100:2008 §5.2.2, eq. (16) (equation number from memory): u_c²(y) = Σ cᵢ²u²(xᵢ) + 2·Σ_{i<j} cᵢ·cⱼ·u(xᵢ)·u(xⱼ)·r(xᵢ, xⱼ).
// The sensitivities have opposite signs, so r > 0 makes the cross term negative: correlated
// tracing errors partly cancel in the ratio and the EF uncertainty shrinks.
const EDV = 120, ESV = 50, U_EDV = 6, U_ESV = 5;
const cEdv = (100 * ESV) / EDV ** 2, cEsv = -100 / EDV;
const handU = (r: number): number =>
  Math.sqrt((cEdv * U_EDV) ** 2 + (cEsv * U_ESV) ** 2 + 2 * cEdv * cEsv * U_EDV * U_ESV * r);

Deno.test("EF uncertainty: positively correlated EDV/ESV errors give a smaller u(EF) (JCGM 100 §5.2)", () => {
  const inputs = {
    endDiastolicVolumeMl: normal(EDV, U_EDV),
    endSystolicVolumeMl: normal(ESV, U_ESV),
  };
  const independent = propagate(ejectionFraction, inputs);
  const correlated = propagate(ejectionFraction, inputs, {
    correlations: [["endDiastolicVolumeMl", "endSystolicVolumeMl", 0.6]],
  });
  const u0 = independent.outputs.ejectionFractionPercent.standardUncertainty;
  const u6 = correlated.outputs.ejectionFractionPercent.standardUncertainty;
  // Hand-computed from eq. (16): r = 0 → 4.6585 %-points; r = 0.6 → 3.3593 %-points.
  relClose(u0, handU(0), 1e-6);
  relClose(u6, handU(0.6), 1e-6);
  assert.ok(u6 < u0);
  // Stroke volume SV = EDV − ESV has sensitivities +1 and −1: same logic, u² = 36 + 25 − 2·0.6·30.
  relClose(correlated.outputs.strokeVolumeMl.standardUncertainty, Math.sqrt(61 - 36), 1e-6);
  // Monte Carlo (JCGM 101) with the same correlation reproduces the GUM value for this nearly
  // linear model (tolerance: Monte Carlo noise at 2·10⁵ trials plus curvature, a few percent).
  const mc = propagate(ejectionFraction, inputs, {
    method: "monteCarlo",
    trials: 200_000,
    seed: 7,
    correlations: [["endDiastolicVolumeMl", "endSystolicVolumeMl", 0.6]],
  });
  relClose(mc.outputs.ejectionFractionPercent.standardUncertainty, u6, 0.03);
  assert.ok(mc.outputs.ejectionFractionPercent.standardUncertainty < u0);
});

Deno.test("LV mass uncertainty budget from caliper errors", () => {
  // Calipers: u = 0.05 cm (0.5 mm) on each of IVSd 1.0, LVIDd 5.0, LVPWd 1.0 cm (illustrative
  // caliper error, common practice, no source). Sensitivities of 0.832·(S³ − D³) + 0.6 with
  // S = IVSd + LVIDd + LVPWd = 7 (hand-derived): ∂M/∂IVSd = ∂M/∂LVPWd = 3·0.832·S² = 122.304 g/cm,
  // ∂M/∂LVIDd = 3·0.832·(S² − D²) = 59.904 g/cm. u_c² = 2·(122.304·0.05)² + (59.904·0.05)²
  // (JCGM 100 eq. (10), uncorrelated) → u_c = 9.1522 g; wall shares 44.64 % each, LVIDd 10.71 %.
  const g = propagate(lvMassLinear, {
    septalThicknessDiastoleCm: normal(1.0, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.0, 0.05),
  });
  const out = g.outputs.lvMassG;
  assert.ok(Math.abs(out.value - 181.976) < 1e-9); // hand-checkable, Lang 2015 formula
  const budget = Object.fromEntries(out.budget.map((row) => [row.source, row]));
  relClose(budget.septalThicknessDiastoleCm!.sensitivity, 122.304, 1e-6);
  relClose(budget.posteriorWallThicknessDiastoleCm!.sensitivity, 122.304, 1e-6);
  relClose(budget.lvInternalDiameterDiastoleCm!.sensitivity, 59.904, 1e-6);
  const uc = Math.sqrt(2 * (122.304 * 0.05) ** 2 + (59.904 * 0.05) ** 2);
  relClose(out.standardUncertainty, uc, 1e-6);
  relClose(budget.septalThicknessDiastoleCm!.share, (122.304 * 0.05) ** 2 / uc ** 2, 1e-5);
  relClose(budget.lvInternalDiameterDiastoleCm!.share, (59.904 * 0.05) ** 2 / uc ** 2, 1e-5);
  // Monte Carlo: the cube formula is mildly nonlinear; its u agrees with GUM within a few percent.
  const mc = propagate(lvMassLinear, {
    septalThicknessDiastoleCm: normal(1.0, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.0, 0.05),
  }, { method: "monteCarlo", trials: 100_000, seed: 11 });
  relClose(mc.outputs.lvMassG.standardUncertainty, uc, 0.03);
});
