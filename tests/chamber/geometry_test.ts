import assert from "node:assert/strict";
import { CLINICAL_CAUTION, evaluate } from "../../calc/core/mod.ts";
import { normal, propagate } from "../../calc/uncertainty/mod.ts";
import { bsaMosteller } from "../../calc/body/mod.ts";
import { adultReferenceRow } from "../../calc/reference/adult.ts";
import {
  classifyLvGeometry,
  LV_GEOMETRY_LIMITS,
  lvGeometryMeasures,
  type LvGeometryProbabilities,
  lvGeometryProbabilities,
} from "../../calc/chamber/mod.ts";
import { displayLvGeometryProbabilities } from "../../display/chamber.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";
import { HYPERTROPHY_CALIPERS, HYPERTROPHY_LV_MASS_G } from "./cases.ts";

Deno.test("LV geometry limits: the guideline numbers, from the adult reference table", () => {
  // Limits from Lang 2015 (LV mass table, linear method; geometry figure): RWT 0.42,
  // LVMi 115 g/m² (men), 95 g/m² (women) (entered from memory, as the adult table says).
  assert.equal(LV_GEOMETRY_LIMITS.male.relativeWallThickness.upperNormal, 0.42);
  assert.equal(LV_GEOMETRY_LIMITS.female.relativeWallThickness.upperNormal, 0.42);
  assert.equal(LV_GEOMETRY_LIMITS.male.lvMassIndexGPerM2.upperNormal, 115);
  assert.equal(LV_GEOMETRY_LIMITS.female.lvMassIndexGPerM2.upperNormal, 95);
  // One copy of the numbers: they are the adult reference rows', with the rows' provenance.
  for (const sex of ["male", "female"] as const) {
    const lvmi = adultReferenceRow("lvMassIndexLinear", sex);
    const limit = LV_GEOMETRY_LIMITS[sex].lvMassIndexGPerM2;
    assert.equal(limit.upperNormal, lvmi.normal.upper);
    assert.equal(limit.fromMemory, lvmi.fromMemory);
    assert.equal(limit.citation.locator, lvmi.table);
    assert.equal(limit.quantity.id, "lvMassIndex");
    assert.match(limit.provenance, /^Lang 2015 Table 6, .*entered from memory/);
  }
});

Deno.test("LV geometry: the four classes with the guideline limits", () => {
  const cases: [number, number, "male" | "female", string][] = [
    // Classification rule of Lang 2015 / Ganau 1992: (RWT, LVMi, sex) → class.
    [0.38, 90, "male", "normal"],
    [0.48, 90, "male", "concentric remodeling"],
    [0.48, 130, "male", "concentric hypertrophy"],
    [0.38, 130, "male", "eccentric hypertrophy"],
    [0.38, 100, "female", "eccentric hypertrophy"], // 100 > 95 for women
    [0.38, 100, "male", "normal"], // 100 ≤ 115 for men
    [0.42, 115, "male", "normal"], // values at the limit are within normal (guideline: RWT ≤ 0.42)
    [0.4201, 95.01, "female", "concentric hypertrophy"],
  ];
  for (const [rwt, lvmi, sex, expected] of cases) {
    assert.equal(
      classifyLvGeometry({ relativeWallThickness: rwt, lvMassIndexGPerM2: lvmi, sex }).geometry,
      expected,
      `${rwt}, ${lvmi}, ${sex}`,
    );
  }
  const g = classifyLvGeometry({
    relativeWallThickness: 0.4,
    lvMassIndexGPerM2: 90,
    sex: "female",
  });
  assert.equal(g.lvMassIndexLimitGPerM2, 95);
  assert.equal(g.relativeWallThicknessLimit, 0.42);
  // The from-memory provenance and the clinical caution travel with the class.
  assert.ok(g.cautions.some((c) => /entered from memory of Lang 2015 Table 6/.test(c)));
  assert.ok(g.cautions.includes(CLINICAL_CAUTION));
});

Deno.test("LV geometry measures classify as concentric hypertrophy (hand-checked case)", () => {
  // LVMi 122.2 g/m², RWT 0.5 (cases.ts) → concentric hypertrophy for a man (122 > 115,
  // 0.5 > 0.42; Lang 2015).
  const r = evaluate(lvGeometryMeasures, HYPERTROPHY_CALIPERS).outputs;
  assert.equal(classifyLvGeometry({ ...r, sex: "male" }).geometry, "concentric hypertrophy");
});

Deno.test("LV geometry classification: bad sex, out-of-range and missing values", () => {
  assert.throws(
    () =>
      classifyLvGeometry({
        relativeWallThickness: 0.4,
        lvMassIndexGPerM2: 90,
        sex: "M" as unknown as "male",
      }),
    {
      name: "TypeError",
      message: `LV geometry classification: expected 'sex' as "male" or "female", got "M"`,
    },
  );
  assert.throws(
    () => classifyLvGeometry({ relativeWallThickness: -0.1, lvMassIndexGPerM2: 90, sex: "male" }),
    {
      name: "RangeError",
      message:
        "LV geometry classification: expected 'relativeWallThickness' (Relative wall thickness) in (0, 5], got -0.1",
    },
  );
  assert.throws(
    () => classifyLvGeometry({ relativeWallThickness: 0.4, lvMassIndexGPerM2: NaN, sex: "male" }),
    {
      name: "RangeError",
      message:
        "LV geometry classification: expected 'lvMassIndexGPerM2' (LV mass index) in (0, 1000] g/m², got NaN",
    },
  );
  assert.throws(
    () => classifyLvGeometry({ relativeWallThickness: 0.4, sex: "male" } as never),
    {
      name: "TypeError",
      message:
        "LV geometry classification: missing input 'lvMassIndexGPerM2' (LV mass index): expected a value in (0, 1000] g/m², got nothing",
    },
  );
});

const EXACT = HYPERTROPHY_CALIPERS;

Deno.test("geometry class probabilities from a joint Monte Carlo of one set of calipers", () => {
  // Exact inputs: every trial gives the same class as the deterministic rule (Lang 2015 limits):
  // IVSd 1.3, LVIDd 4.8, LVPWd 1.2 cm, BSA 1.9 m² → LVMi 122.2 g/m², RWT 0.5 → concentric
  // hypertrophy for a man (hand-checked in cases.ts).
  const exact = lvGeometryProbabilities(EXACT, "male", { trials: 1000, seed: 5 });
  assert.equal(exact.probabilities["concentric hypertrophy"], 1);
  assert.equal(exact.standardErrors["concentric hypertrophy"], 0);
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
  assert.equal(rwtOnly.trials, 100_000); // the documented default
  assert.ok(Math.abs(rwtOnly.probabilities["concentric remodeling"] - 0.5) < 0.01);
  assert.ok(Math.abs(rwtOnly.probabilities["normal"] - 0.5) < 0.01);
  assert.equal(rwtOnly.probabilities["concentric hypertrophy"], 0);
  // Binomial standard error √(p(1 − p)/M) (common statistics, no source): ≈ 0.00158 at p = 0.5.
  const p = rwtOnly.probabilities["normal"];
  assert.ok(Math.abs(rwtOnly.standardErrors["normal"] - Math.sqrt((p * (1 - p)) / 1e5)) < 1e-15);
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
      message: `LV geometry probabilities: expected 'sex' as "male" or "female", got "other"`,
    },
  );
});

Deno.test("geometry probabilities: mass-index-only uncertainty has a closed form", () => {
  // LVMi = M/BSA with M = 181.976 g exact (IVSd 1, LVIDd 5, LVPWd 1; linear_test.ts) and
  // BSA ~ N(M/115, 0.05): LVMi > 115 ⟺ BSA < M/115, P = 0.5 by symmetry; RWT = 0.4 ≤ 0.42, so the
  // class is eccentric hypertrophy or normal, half each (Lang 2015 limits, men). 10⁵ trials:
  // binomial standard error 0.0016, tolerance 0.01.
  const r = lvGeometryProbabilities(
    {
      septalThicknessDiastoleCm: 1,
      lvInternalDiameterDiastoleCm: 5,
      posteriorWallThicknessDiastoleCm: 1,
      bodySurfaceAreaM2: normal(181.976 / 115, 0.05),
    },
    "male",
    { seed: 21 },
  );
  assert.ok(Math.abs(r.probabilities["eccentric hypertrophy"] - 0.5) < 0.01);
  assert.ok(Math.abs(r.probabilities["normal"] - 0.5) < 0.01);
  assert.equal(
    r.probabilities["concentric remodeling"] + r.probabilities["concentric hypertrophy"],
    0,
  );
});

Deno.test("geometry probabilities classify the trial-aligned samples of the propagated measures", () => {
  const r = lvGeometryProbabilities(
    {
      septalThicknessDiastoleCm: normal(1.05, 0.05),
      lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
      posteriorWallThicknessDiastoleCm: normal(1.05, 0.05),
      bodySurfaceAreaM2: 1.75,
    },
    "male",
    { trials: 20_000, seed: 3 },
  );
  // The same propagation by hand, same seed: identical samples (seeded, JCGM 101 §7 by trial).
  const m = propagate(lvGeometryMeasures, {
    septalThicknessDiastoleCm: normal(1.05, 0.05),
    lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
    posteriorWallThicknessDiastoleCm: normal(1.05, 0.05),
    bodySurfaceAreaM2: 1.75,
  }, { method: "monteCarlo", trials: 20_000, seed: 3 });
  assert.deepEqual(
    r.measures.outputs.lvMassIndexGPerM2.samples,
    m.outputs.lvMassIndexGPerM2.samples,
  );
  // Trial k is classified from LVMi and RWT of trial k: count concentric hypertrophy by hand.
  const lvmi = m.outputs.lvMassIndexGPerM2.samples!, rwt = m.outputs.relativeWallThickness.samples!;
  let both = 0;
  for (let k = 0; k < lvmi.length; k++) if (lvmi[k]! > 115 && rwt[k]! > 0.42) both++;
  assert.equal(r.probabilities["concentric hypertrophy"], both / 20_000);
  assert.equal(r.trials, 20_000);
  assert.equal(r.seed, 3);
});

Deno.test("geometry probabilities accept BSA as a Monte Carlo value of an earlier chain step", () => {
  // Mosteller √(180·80/3600) = 2 m² (N Engl J Med 1987); same seed and trials: the BSA draws are
  // the ones that reach the classification, and its uncertainty widens the LVMi interval.
  const bsa = propagate(bsaMosteller, { heightCm: normal(180, 2), weightKg: normal(80, 2) }, {
    method: "monteCarlo",
    trials: 20_000,
    seed: 4,
  });
  const r = lvGeometryProbabilities({ ...EXACT, bodySurfaceAreaM2: bsa.outputs.bsaM2 }, "male");
  assert.equal(r.trials, 20_000); // the run of the BSA step, not the default 10⁵
  assert.equal(r.seed, 4);
  const u = r.measures.outputs.lvMassIndexGPerM2.standardUncertainty;
  // LVMi = M/BSA: u ≈ M·u(BSA)/BSA² (first order, hand-derived), M = 232.2496 g (cases.ts).
  const hand = (HYPERTROPHY_LV_MASS_G * bsa.outputs.bsaM2.standardUncertainty) / 4;
  assert.ok(Math.abs(u / hand - 1) < 0.03, `${u} vs ${hand}`);
});

Deno.test("geometry probabilities display themselves: labels, probabilities, provenance, caution", () => {
  const r: LvGeometryProbabilities = lvGeometryProbabilities(EXACT, "male", {
    trials: 1000,
    seed: 1,
  });
  const bundle = displayLvGeometryProbabilities(r);
  const text = String(bundle["text/plain"]);
  assert.match(text, /^LV geometry of a man: class probabilities by Monte Carlo/);
  assert.match(text, /concentric hypertrophy \(most probable\)\s+100\.0 %\s+0\.0 %/);
  assert.match(text, /normal\s+0\.0 %/);
  // Labels come from the quantities, with units.
  assert.match(text, /LV mass index = 122\.2\d* g\/m²/); // 232.2496/1.9 = 122.2366 (hand-checked)
  assert.match(text, /Relative wall thickness = 0\.5/);
  assert.match(text, /LV mass index: upper normal 115 g\/m²; Lang 2015 Table 6/);
  assert.match(text, /entered from memory/);
  assert.ok(text.includes(CLINICAL_CAUTION));
  assert.match(String(bundle["text/html"]), /<table/);
  const shown = (r as unknown as { [JUPYTER_DISPLAY](): unknown })[JUPYTER_DISPLAY]();
  assert.deepEqual(shown, bundle);
});
