import assert from "node:assert/strict";
import { gum, monteCarlo, normal } from "../../calc/uncertainty/mod.ts";
import { ejectionFraction, lvGeometryProbabilities, lvMassLinear } from "../../calc/chamber/mod.ts";

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
  const independent = gum(ejectionFraction, inputs);
  const correlated = gum(ejectionFraction, inputs, {
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
  const mc = monteCarlo(ejectionFraction, inputs, {
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
  const g = gum(lvMassLinear, {
    septalThicknessDiastoleCm: normal(1.0, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.0, 0.05),
  });
  const out = g.outputs.lvMassG;
  assert.ok(Math.abs(out.value - 181.976) < 1e-9); // hand-checkable, Lang 2015 formula
  const budget = Object.fromEntries(out.budget.map((row) => [row.input, row]));
  relClose(budget.septalThicknessDiastoleCm!.sensitivity, 122.304, 1e-6);
  relClose(budget.posteriorWallThicknessDiastoleCm!.sensitivity, 122.304, 1e-6);
  relClose(budget.lvInternalDiameterDiastoleCm!.sensitivity, 59.904, 1e-6);
  const uc = Math.sqrt(2 * (122.304 * 0.05) ** 2 + (59.904 * 0.05) ** 2);
  relClose(out.standardUncertainty, uc, 1e-6);
  relClose(budget.septalThicknessDiastoleCm!.share, (122.304 * 0.05) ** 2 / uc ** 2, 1e-5);
  relClose(budget.lvInternalDiameterDiastoleCm!.share, (59.904 * 0.05) ** 2 / uc ** 2, 1e-5);
  // Monte Carlo: the cube formula is mildly nonlinear; its u agrees with GUM within a few percent.
  const mc = monteCarlo(lvMassLinear, {
    septalThicknessDiastoleCm: normal(1.0, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.0, 0.05),
  }, { trials: 100_000, seed: 11 });
  relClose(mc.outputs.lvMassG.standardUncertainty, uc, 0.03);
});

Deno.test("geometry class probabilities from a joint Monte Carlo of one set of calipers", () => {
  // Exact inputs: every trial gives the same class as the deterministic rule (Lang 2015 limits):
  // IVSd 1.3, LVIDd 4.8, LVPWd 1.2 cm, BSA 1.9 m² → LVMi 122.2 g/m², RWT 0.5 → concentric
  // hypertrophy for a man (hand-checked in linear_test.ts).
  const exact = lvGeometryProbabilities(
    {
      septalThicknessDiastoleCm: 1.3,
      lvInternalDiameterDiastoleCm: 4.8,
      posteriorWallThicknessDiastoleCm: 1.2,
      bodySurfaceAreaM2: 1.9,
    },
    "male",
    { trials: 1000, seed: 5 },
  );
  assert.equal(exact.probabilities["concentric hypertrophy"], 1);
  assert.equal(exact.mostProbable, "concentric hypertrophy");
  // RWT-only uncertainty check with a closed form: LVPWd ~ N(1.05, 0.05) with IVSd and LVIDd exact
  // and a large BSA (mass index far below 115 g/m²): the class is concentric remodeling exactly
  // when 2·LVPWd/5 > 0.42, i.e. LVPWd > 1.05, so P = 0.5 (normal distribution symmetry); Monte
  // Carlo with 10⁵ trials: binomial standard error 0.0016, tolerance 0.01.
  const rwtOnly = lvGeometryProbabilities(
    {
      septalThicknessDiastoleCm: 1.0,
      lvInternalDiameterDiastoleCm: 5.0,
      posteriorWallThicknessDiastoleCm: normal(1.05, 0.05),
      bodySurfaceAreaM2: 4.0,
    },
    "female",
    { seed: 9 },
  );
  assert.ok(Math.abs(rwtOnly.probabilities["concentric remodeling"] - 0.5) < 0.01);
  assert.ok(Math.abs(rwtOnly.probabilities["normal"] - 0.5) < 0.01);
  assert.equal(rwtOnly.probabilities["concentric hypertrophy"], 0);
  // Joint case: mass index ≈ 111 g/m² (0.832·(7.1³ − 125) + 0.6 = 194.4 g over 1.75 m²), RWT = 0.42 at the estimates; the four probabilities sum to 1
  // and the two hypertrophy classes are both plausible.
  const borderline = lvGeometryProbabilities(
    {
      septalThicknessDiastoleCm: normal(1.05, 0.05),
      lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
      posteriorWallThicknessDiastoleCm: normal(1.05, 0.05),
      bodySurfaceAreaM2: 1.75,
    },
    "male",
    { trials: 50_000, seed: 3 },
  );
  const total = Object.values(borderline.probabilities).reduce((a, b) => a + b, 0);
  assert.ok(Math.abs(total - 1) < 1e-12);
  assert.ok(borderline.probabilities["concentric hypertrophy"] > 0.05);
  assert.ok(borderline.probabilities["normal"] > 0.05);
  assert.throws(
    () => lvGeometryProbabilities({ bodySurfaceAreaM2: 1.8 } as never, "other" as never),
    {
      name: "TypeError",
      message: /^LV geometry probabilities: expected 'sex' as "male" or "female", got "other"$/,
    },
  );
});
