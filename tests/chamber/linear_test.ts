import assert from "node:assert/strict";
import { CLINICAL_CAUTION, evaluate } from "../../calc/core/mod.ts";
import {
  classifyLvGeometry,
  fractionalShortening,
  LV_GEOMETRY_LIMITS,
  lvGeometryMeasures,
  lvMassIndex,
  lvMassLinear,
  relativeWallThickness,
  teichholzEjectionFraction,
  teichholzVolume,
} from "../../calc/chamber/mod.ts";

const close = (actual: number, expected: number, tol = 1e-9): void =>
  assert.ok(Math.abs(actual - expected) <= tol, `expected ${expected}, got ${actual}`);

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

Deno.test("Teichholz EF composes the volume and EF calculations", () => {
  // Hand-checkable: EDV = T(6) = 180 mL, ESV = T(4) = 70 mL → SV 110 mL, EF 110/180 = 61.11 %.
  const r = evaluate(teichholzEjectionFraction, {
    lvInternalDiameterDiastoleCm: 6,
    lvInternalDiameterSystoleCm: 4,
  }).outputs;
  close(r.endDiastolicVolumeMl, 180);
  close(r.endSystolicVolumeMl, 70);
  close(r.strokeVolumeMl, 110);
  close(r.ejectionFractionPercent, (100 * 110) / 180);
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

Deno.test("LV geometry: the four classes with the guideline limits", () => {
  // Limits from Lang 2015 (LV mass table, linear method; geometry figure): RWT 0.42,
  // LVMi 115 g/m² (men), 95 g/m² (women).
  assert.equal(LV_GEOMETRY_LIMITS.relativeWallThickness.upperNormal, 0.42);
  assert.equal(LV_GEOMETRY_LIMITS.lvMassIndexGPerM2.male.upperNormal, 115);
  assert.equal(LV_GEOMETRY_LIMITS.lvMassIndexGPerM2.female.upperNormal, 95);
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
});

Deno.test("LV geometry measures compose mass, index and RWT", () => {
  // Hand-checkable: IVSd 1.3, LVIDd 4.8, LVPWd 1.2 → (7.3³ − 4.8³) = 389.017 − 110.592 = 278.425;
  // 0.832·278.425 + 0.6 = 232.2496 g; /1.9 = 122.2366 g/m²; RWT = 2.4/4.8 = 0.5 → concentric
  // hypertrophy for a man (122 > 115, 0.5 > 0.42; Lang 2015).
  const r = evaluate(lvGeometryMeasures, {
    septalThicknessDiastoleCm: 1.3,
    lvInternalDiameterDiastoleCm: 4.8,
    posteriorWallThicknessDiastoleCm: 1.2,
    bodySurfaceAreaM2: 1.9,
  }).outputs;
  close(r.lvMassG, 232.2496, 1e-9);
  close(r.lvMassIndexGPerM2, 232.2496 / 1.9, 1e-9);
  close(r.relativeWallThickness, 0.5, 1e-15);
  assert.equal(classifyLvGeometry({ ...r, sex: "male" }).geometry, "concentric hypertrophy");
});

Deno.test("bad input: negative or missing dimensions, LVIDs above LVIDd, bad sex", () => {
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
        /LV mass \(linear cube formula\): expected 'septalThicknessDiastoleCm' in \(0, 5\] cm, got -1$/,
    },
  );
  assert.throws(() => evaluate(teichholzVolume, { lvInternalDiameterCm: 0 }), {
    name: "RangeError",
    message: /expected 'lvInternalDiameterCm' in \(0, 12\] cm, got 0$/,
  });
  assert.throws(() => evaluate(teichholzVolume, { lvInternalDiameterCm: NaN }), {
    name: "RangeError",
    message: /got NaN$/,
  });
  assert.throws(() => evaluate(teichholzVolume, { lvInternalDiameterCm: "5 mmHg" }), {
    name: "TypeError",
    message: /expected a quantity convertible to cm/,
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
        /expected 'lvInternalDiameterSystoleCm' <= 'lvInternalDiameterDiastoleCm', got lvInternalDiameterSystoleCm = 5, lvInternalDiameterDiastoleCm = 3.2$/,
    },
  );
  assert.throws(
    () =>
      evaluate(teichholzEjectionFraction, {
        lvInternalDiameterDiastoleCm: 4,
        lvInternalDiameterSystoleCm: 4.5,
      }),
    { name: "RangeError", message: /output 'ejectionFractionPercent' is not finite/ },
  );
  assert.throws(
    () =>
      classifyLvGeometry({
        relativeWallThickness: 0.4,
        lvMassIndexGPerM2: 90,
        sex: "M" as unknown as "male",
      }),
    { name: "TypeError", message: /expected 'sex' as "male" or "female", got "M"$/ },
  );
  assert.throws(
    () => classifyLvGeometry({ relativeWallThickness: -0.1, lvMassIndexGPerM2: 90, sex: "male" }),
    { name: "RangeError", message: /expected 'relativeWallThickness' in \(0, 5\], got -0.1$/ },
  );
});

Deno.test("values outside the typical range are flagged, not rejected", () => {
  // LVIDd 8.5 cm lies outside the typical adult span [3, 7.5] cm (common practice, no source).
  const r = evaluate(teichholzVolume, { lvInternalDiameterCm: 8.5 });
  assert.equal(r.flags.length, 1);
  assert.match(r.flags[0]!, /'lvInternalDiameterCm' = 8.5 cm lies outside the validated range/);
});
