import assert from "node:assert/strict";
import { CLINICAL_CAUTION, evaluate, type Recipe } from "../../calc/core/mod.ts";
import { normal, propagate } from "../../calc/uncertainty/mod.ts";
import { bsaMosteller } from "../../calc/body/mod.ts";
import {
  ejectionFraction,
  fractionalShortening,
  lvGeometryMeasures,
  lvMassIndex,
  lvMassLinear,
  relativeWallThickness,
  teichholzEjectionFraction,
  teichholzVolume,
  teichholzVolumes,
} from "../../calc/chamber/mod.ts";
import { HYPERTROPHY_CALIPERS, HYPERTROPHY_LV_MASS_G } from "./cases.ts";

const close = (actual: number, expected: number, tol = 1e-9): void =>
  assert.ok(Math.abs(actual - expected) <= tol, `expected ${expected}, got ${actual}`);
/** The recipes of a chain's steps (a worker makes the chain again from them). */
function chainSteps(c: { readonly recipe: Recipe }): readonly Recipe[] {
  assert.equal(c.recipe.kind, "chain");
  return c.recipe.kind === "chain" ? c.recipe.steps : [];
}
const relClose = (actual: number, expected: number, tol: number): void =>
  assert.ok(Math.abs(actual / expected - 1) <= tol, `expected ${expected}, got ${actual}`);

Deno.test("fractional shortening: 100·(LVIDd − LVIDs)/LVIDd", () => {
  // Hand-checkable arithmetic from the published formula (Lang 2015): (5.0 − 3.2)/5.0 = 36 %.
  const r = evaluate(fractionalShortening, {
    lvInternalDiameterDiastoleCm: 5.0,
    lvInternalDiameterSystoleCm: 3.2,
  });
  close(r.outputs.fractionalShorteningPercent, 36);
  // Same input in mm through the unit layer: 50 mm and 32 mm give the same 36 %.
  close(
    evaluate(fractionalShortening, {
      lvInternalDiameterDiastoleCm: "50 mm",
      lvInternalDiameterSystoleCm: "32 mm",
    }).outputs.fractionalShorteningPercent,
    36,
  );
  // Clinical caution is attached (project rule: clinical outputs carry the caution).
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
});

Deno.test("Teichholz volume V = 7/(2.4 + D)·D³ at hand-checkable diameters", () => {
  // Hand-checkable from Teichholz 1976: D = 4 cm → 7·64/6.4 = 70 mL exactly.
  close(evaluate(teichholzVolume, { lvInternalDiameterCm: 4 }).outputs.volumeMl, 70);
  // D = 6 cm → 7·216/8.4 = 180 mL exactly.
  close(evaluate(teichholzVolume, { lvInternalDiameterCm: 6 }).outputs.volumeMl, 180);
  // D = 5 cm → 7·125/7.4 = 118.2432… mL.
  close(
    evaluate(teichholzVolume, { lvInternalDiameterCm: 5 }).outputs.volumeMl,
    118.24324324324,
    1e-9,
  );
});

Deno.test("Teichholz EF is the chain Teichholz volumes → ejection fraction", () => {
  // Hand-checkable: EDV = T(6) = 180 mL, ESV = T(4) = 70 mL → SV 110 mL, EF 110/180 = 61.11 %.
  const r = evaluate(teichholzEjectionFraction, {
    lvInternalDiameterDiastoleCm: 6,
    lvInternalDiameterSystoleCm: 4,
  }).outputs;
  close(r.endDiastolicVolumeMl, 180);
  close(r.endSystolicVolumeMl, 70);
  close(r.strokeVolumeMl, 110);
  close(r.ejectionFractionPercent, (100 * 110) / 180);
  // The chain's recipe names its two steps (a worker makes it again from them).
  assert.deepEqual(chainSteps(teichholzEjectionFraction), [
    { kind: "catalog", id: teichholzVolumes.id },
    { kind: "catalog", id: ejectionFraction.id },
  ]);
  // Outputs keep their quantities: the EF output is the ejection-fraction quantity.
  assert.equal(
    teichholzEjectionFraction.outputs.ejectionFractionPercent.quantity.id,
    "ejectionFraction",
  );
});

Deno.test("Teichholz EF chain: GUM uncertainty from hand-derived sensitivities", () => {
  // EF = 100·(1 − T(s)/T(d)), T(D) = 7D³/(2.4 + D) (Teichholz 1976), T'(D) = 7D²(2D + 7.2)/(2.4 + D)²
  // (hand-derived). ∂EF/∂d = 100·T(s)·T'(d)/T(d)², ∂EF/∂s = −100·T'(s)/T(d); u = √Σ(cᵢ·uᵢ)²
  // (JCGM 100 eq. (10), uncorrelated). d = 6 ± 0.1 cm, s = 4 ± 0.1 cm → c_d = 14.815 %/cm,
  // c_s = −23.090 %/cm, u(EF) = 2.7434 %.
  const T = (d: number) => (7 * d ** 3) / (2.4 + d);
  const dT = (d: number) => (7 * d ** 2 * (2 * d + 7.2)) / (2.4 + d) ** 2;
  const cD = (100 * T(4) * dT(6)) / T(6) ** 2, cS = (-100 * dT(4)) / T(6);
  const g = propagate(teichholzEjectionFraction, {
    lvInternalDiameterDiastoleCm: normal(6, 0.1),
    lvInternalDiameterSystoleCm: normal(4, 0.1),
  });
  const ef = g.outputs.ejectionFractionPercent;
  const budget = Object.fromEntries(ef.budget.map((row) => [row.source, row]));
  relClose(budget.lvInternalDiameterDiastoleCm!.sensitivity, cD, 1e-6);
  relClose(budget.lvInternalDiameterSystoleCm!.sensitivity, cS, 1e-6);
  relClose(ef.standardUncertainty, Math.hypot(cD * 0.1, cS * 0.1), 1e-6);
  close(cD, 14.8148, 1e-4); // the hand values quoted above
  close(cS, -23.0903, 1e-4);
});

Deno.test("LV mass by the 2015 guideline linear formula", () => {
  // Hand-checkable from Lang 2015 (linear method): 0.8·1.04·[(1 + 5 + 1)³ − 5³] + 0.6
  // = 0.832·(343 − 125) + 0.6 = 181.976 g.
  const args = {
    septalThicknessDiastoleCm: 1.0,
    lvInternalDiameterDiastoleCm: 5.0,
    posteriorWallThicknessDiastoleCm: 1.0,
  };
  close(evaluate(lvMassLinear, args).outputs.lvMassG, 181.976);
  // Hand-checkable: IVSd 1.2, LVIDd 4.8, LVPWd 1.1 cm → 7.1³ = 357.911, 4.8³ = 110.592,
  // 0.832·247.319 + 0.6 = 206.369408 g.
  close(
    evaluate(lvMassLinear, {
      septalThicknessDiastoleCm: "12 mm",
      lvInternalDiameterDiastoleCm: "48 mm",
      posteriorWallThicknessDiastoleCm: "11 mm",
    }).outputs.lvMassG,
    206.369408,
    1e-9,
  );
  // Hand-checkable: index at BSA 2.0 m² = 181.976/2 = 90.988 g/m².
  const idx = evaluate(lvMassIndex, { ...args, bodySurfaceAreaM2: 2 }).outputs;
  close(idx.lvMassG, 181.976);
  close(idx.lvMassIndexGPerM2, 90.988);
});

Deno.test("LV mass index is the chain LV mass → indexed to BSA, with the public keys", () => {
  assert.deepEqual(lvMassIndex.inputNames, [
    "septalThicknessDiastoleCm",
    "lvInternalDiameterDiastoleCm",
    "posteriorWallThicknessDiastoleCm",
    "bodySurfaceAreaM2",
  ]);
  assert.deepEqual(lvMassIndex.outputNames, ["lvMassG", "lvMassIndexGPerM2"]);
  assert.deepEqual(chainSteps(lvMassIndex), [
    { kind: "catalog", id: "lvMassLinear" },
    { kind: "family", family: "indexedToBsa", parameter: "lvMass" },
  ]);
  assert.equal(lvMassIndex.outputs.lvMassIndexGPerM2.quantity.id, "lvMassIndex");
  assert.equal(lvMassIndex.inputs.bodySurfaceAreaM2.quantity.id, "bsa");
});

Deno.test("LV mass index with BSA from height and weight: uncertainty chains through BSA", () => {
  // BSA by Mosteller (N Engl J Med 1987): √(180·80/3600) = 2 m², ∂BSA/∂H = BSA/(2H),
  // ∂BSA/∂W = BSA/(2W) (hand-derived). Calipers as in uncertainty_test.ts: u = 0.05 cm each,
  // ∂M/∂IVSd = ∂M/∂LVPWd = 122.304 g/cm, ∂M/∂LVIDd = 59.904 g/cm (hand-derived).
  // LVMi = M/BSA: u² = (u_M/BSA)² + (M·u_BSA/BSA²)² (JCGM 100 eq. (10), independent sources).
  const bsa = propagate(bsaMosteller, { heightCm: normal(180, 1), weightKg: normal(80, 1) });
  const r = propagate(lvMassIndex, {
    septalThicknessDiastoleCm: normal(1.0, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.0, 0.05),
    bodySurfaceAreaM2: bsa.outputs.bsaM2,
  });
  const uBsa = Math.hypot(2 / 360, 2 / 160);
  const uMass = Math.hypot(122.304 * 0.05, 59.904 * 0.05, 122.304 * 0.05);
  const hand = Math.hypot(uMass / 2, (181.976 * uBsa) / 4);
  const lvmi = r.outputs.lvMassIndexGPerM2;
  close(lvmi.value, 90.988);
  relClose(lvmi.standardUncertainty, hand, 1e-6);
  // The budget names height and weight as sources: the BSA step did not hide them.
  const sources = lvmi.budget.map((row) => row.source).sort();
  assert.deepEqual(sources, [
    "heightCm",
    "lvInternalDiameterDiastoleCm",
    "posteriorWallThicknessDiastoleCm",
    "septalThicknessDiastoleCm",
    "weightKg",
  ]);
});

Deno.test("relative wall thickness 2·LVPWd/LVIDd", () => {
  // Hand-checkable from Lang 2015: 2·1.1/4.8 = 0.458333…
  close(
    evaluate(relativeWallThickness, {
      posteriorWallThicknessDiastoleCm: 1.1,
      lvInternalDiameterDiastoleCm: 4.8,
    }).outputs.relativeWallThickness,
    2.2 / 4.8,
    1e-15,
  );
});

Deno.test("LV geometry measures chain mass, index and RWT", () => {
  // Hand-checkable (cases.ts, Lang 2015 formulas): LV mass 232.2496 g; /1.9 = 122.2366 g/m²;
  // RWT = 2.4/4.8 = 0.5.
  const r = evaluate(lvGeometryMeasures, HYPERTROPHY_CALIPERS).outputs;
  close(r.lvMassG, HYPERTROPHY_LV_MASS_G, 1e-9);
  close(r.lvMassIndexGPerM2, HYPERTROPHY_LV_MASS_G / 1.9, 1e-9);
  close(r.relativeWallThickness, 0.5, 1e-15);
  assert.deepEqual(lvGeometryMeasures.outputNames, [
    "lvMassG",
    "lvMassIndexGPerM2",
    "relativeWallThickness",
  ]);
});

Deno.test("LV geometry measures: the chain keeps the covariance of LVMi and RWT", () => {
  // Shared calipers (LVIDd, LVPWd) feed both outputs. Sensitivities at IVSd 1, LVIDd 5, LVPWd 1,
  // BSA 2 (hand-derived): LVMi: 122.304/2, 59.904/2, 122.304/2 g/m² per cm; RWT = 2·LVPWd/LVIDd:
  // ∂/∂LVPWd = 2/5 = 0.4, ∂/∂LVIDd = −2/25 = −0.08 per cm. cov = Σ c₁ᵢ·c₂ᵢ·u² (JCGM 100 §5.2,
  // from the linear parts) = (61.152·0.4 − 29.952·0.08)·0.05² = 0.0551616 g/m².
  const g = propagate(lvGeometryMeasures, {
    septalThicknessDiastoleCm: normal(1.0, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.0, 0.05),
    bodySurfaceAreaM2: 2,
  });
  const i = g.outputNames.indexOf("lvMassIndexGPerM2"),
    j = g.outputNames.indexOf("relativeWallThickness");
  relClose(g.covariance[i]![j]!, (61.152 * 0.4 - 29.952 * 0.08) * 0.05 ** 2, 1e-6);
  relClose(g.outputs.relativeWallThickness.standardUncertainty, Math.hypot(0.4, 0.08) * 0.05, 1e-6);
});

Deno.test("bad input: negative or missing dimensions, LVIDs above LVIDd", () => {
  assert.throws(
    () =>
      evaluate(lvMassLinear, {
        septalThicknessDiastoleCm: -1,
        lvInternalDiameterDiastoleCm: 5,
        posteriorWallThicknessDiastoleCm: 1,
      }),
    {
      name: "RangeError",
      message:
        "LV mass (linear cube formula): expected 'septalThicknessDiastoleCm' (Septal thickness) in (0, 5] cm, got -1",
    },
  );
  assert.throws(() => evaluate(teichholzVolume, { lvInternalDiameterCm: 0 }), {
    name: "RangeError",
    message:
      "Teichholz LV volume: expected 'lvInternalDiameterCm' (LV internal diameter) in (0, 12] cm, got 0",
  });
  assert.throws(() => evaluate(teichholzVolume, { lvInternalDiameterCm: NaN }), {
    name: "RangeError",
    message:
      "Teichholz LV volume: expected 'lvInternalDiameterCm' (LV internal diameter) in (0, 12] cm, got NaN",
  });
  assert.throws(() => evaluate(teichholzVolume, { lvInternalDiameterCm: "5 mmHg" }), {
    name: "TypeError",
    message:
      `Teichholz LV volume: expected 'lvInternalDiameterCm' (LV internal diameter) in (0, 12] cm (a unit convertible to cm), got "5 mmHg"`,
  });
  assert.throws(
    () =>
      evaluate(fractionalShortening, {
        lvInternalDiameterDiastoleCm: 3.2,
        lvInternalDiameterSystoleCm: 5.0,
      }),
    {
      name: "RangeError",
      message:
        "LV fractional shortening: expected 'lvInternalDiameterSystoleCm' (LV end-systolic diameter) ≤ 'lvInternalDiameterDiastoleCm' (LV end-diastolic diameter), got lvInternalDiameterSystoleCm = 5 cm, lvInternalDiameterDiastoleCm = 3.2 cm",
    },
  );
  // Previously NaN inside the formula; now a declared constraint of the chain's first step.
  assert.throws(
    () =>
      evaluate(teichholzEjectionFraction, {
        lvInternalDiameterDiastoleCm: 4,
        lvInternalDiameterSystoleCm: 4.5,
      }),
    {
      name: "RangeError",
      message:
        "Teichholz LV volumes and ejection fraction: expected 'lvInternalDiameterSystoleCm' (LV end-systolic diameter) ≤ 'lvInternalDiameterDiastoleCm' (LV end-diastolic diameter), got lvInternalDiameterSystoleCm = 4.5 cm, lvInternalDiameterDiastoleCm = 4 cm",
    },
  );
  assert.throws(
    () =>
      propagate(teichholzEjectionFraction, {
        lvInternalDiameterDiastoleCm: normal(4, 0.1),
        lvInternalDiameterSystoleCm: normal(4.5, 0.1),
      }),
    {
      name: "RangeError",
      message: /expected 'lvInternalDiameterSystoleCm' \(LV end-systolic diameter\) ≤ /,
    },
  );
  assert.throws(
    () =>
      evaluate(lvMassIndex, {
        septalThicknessDiastoleCm: 1,
        lvInternalDiameterDiastoleCm: 5,
        posteriorWallThicknessDiastoleCm: 1,
      }),
    {
      name: "TypeError",
      message:
        "LV mass index (linear method): missing input 'bodySurfaceAreaM2' (Body surface area): expected a value in (0, 5] m², got nothing",
    },
  );
});

Deno.test("values outside the typical range are flagged, not rejected", () => {
  // LVID 8.5 cm lies outside the typical adult span [1.5, 7.5] cm (common practice, no source).
  const r = evaluate(teichholzVolume, { lvInternalDiameterCm: 8.5 });
  assert.equal(r.flags.length, 1);
  assert.equal(
    r.flags[0],
    "Teichholz LV volume: 'lvInternalDiameterCm' (LV internal diameter) = 8.5 cm lies outside the typical range [1.5, 7.5] cm: interpret with care",
  );
});
