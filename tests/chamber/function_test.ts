import assert from "node:assert/strict";
import { CLINICAL_CAUTION, evaluate } from "../../calc/core/mod.ts";
import { normal, propagate } from "../../calc/uncertainty/mod.ts";
import {
  ejectionFraction,
  fractionalAreaChange,
  globalLongitudinalStrain,
  mapse,
  myocardialPerformanceIndex,
  myocardialPerformanceIndexFromClosureTime,
  tapse,
} from "../../calc/chamber/mod.ts";

const close = (actual: number, expected: number, tol = 1e-12): void =>
  assert.ok(Math.abs(actual - expected) <= tol, `expected ${expected}, got ${actual}`);

Deno.test("ejection fraction and stroke volume from volumes", () => {
  // Hand-checkable from the published formula (Lang 2015): EDV 120, ESV 48 → SV 72 mL,
  // EF 72/120 = 60 %.
  const r = evaluate(ejectionFraction, { endDiastolicVolumeMl: 120, endSystolicVolumeMl: 48 });
  close(r.outputs.ejectionFractionPercent, 60);
  close(r.outputs.strokeVolumeMl, 72);
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
  // Hand-checkable: EDV 0.15 L and ESV 90 cm³ (unit conversion) → EF 40 %, SV 60 mL.
  const s = evaluate(ejectionFraction, {
    endDiastolicVolumeMl: "0.15 L",
    endSystolicVolumeMl: "90 cm^3",
  });
  close(s.outputs.ejectionFractionPercent, 40, 1e-9);
  close(s.outputs.strokeVolumeMl, 60, 1e-9);
  // ESV = EDV is allowed (EF 0 %); ESV above EDV is rejected naming both volumes.
  close(
    evaluate(ejectionFraction, { endDiastolicVolumeMl: 80, endSystolicVolumeMl: 80 }).outputs
      .ejectionFractionPercent,
    0,
  );
  assert.throws(
    () => evaluate(ejectionFraction, { endDiastolicVolumeMl: 50, endSystolicVolumeMl: 60 }),
    {
      name: "RangeError",
      message:
        "Ejection fraction: expected 'endSystolicVolumeMl' (LV end-systolic volume) ≤ 'endDiastolicVolumeMl' (LV end-diastolic volume), got endSystolicVolumeMl = 60 mL, endDiastolicVolumeMl = 50 mL",
    },
  );
  assert.throws(
    () => evaluate(ejectionFraction, { endDiastolicVolumeMl: -5, endSystolicVolumeMl: 2 }),
    {
      name: "RangeError",
      message:
        "Ejection fraction: expected 'endDiastolicVolumeMl' (LV end-diastolic volume) in (0, 2000] mL, got -5",
    },
  );
  assert.throws(() => evaluate(ejectionFraction, { endDiastolicVolumeMl: 120 }), {
    name: "TypeError",
    message:
      "Ejection fraction: missing input 'endSystolicVolumeMl' (LV end-systolic volume): expected a value in [0, 2000] mL, got nothing",
  });
});

Deno.test("RV fractional area change", () => {
  // Hand-checkable from the formula (Rudski 2010): (24 − 14)/24 = 41.67 %.
  close(
    evaluate(fractionalAreaChange, { endDiastolicAreaCm2: 24, endSystolicAreaCm2: 14 }).outputs
      .fractionalAreaChangePercent,
    1000 / 24,
  );
  assert.throws(
    () => evaluate(fractionalAreaChange, { endDiastolicAreaCm2: 14, endSystolicAreaCm2: 24 }),
    {
      name: "RangeError",
      message:
        "RV fractional area change: expected 'endSystolicAreaCm2' (RV end-systolic area) ≤ 'endDiastolicAreaCm2' (RV end-diastolic area), got endSystolicAreaCm2 = 24 cm², endDiastolicAreaCm2 = 14 cm²",
    },
  );
});

Deno.test("TAPSE and MAPSE from M-mode annular depths", () => {
  // Hand-checkable (Kaul 1984 definition): 128 − 106 mm = 22 mm.
  close(
    evaluate(tapse, { annulusDepthEndDiastoleMm: 128, annulusDepthPeakSystoleMm: 106 }).outputs
      .tapseMm,
    22,
  );
  // Values in cm through the unit layer: 12.8 cm and 10.6 cm → 22 mm.
  close(
    evaluate(tapse, { annulusDepthEndDiastoleMm: "12.8 cm", annulusDepthPeakSystoleMm: "10.6 cm" })
      .outputs.tapseMm,
    22,
    1e-9,
  );
  assert.throws(
    () => evaluate(tapse, { annulusDepthEndDiastoleMm: 100, annulusDepthPeakSystoleMm: 110 }),
    {
      name: "RangeError",
      message:
        "Tricuspid annular plane systolic excursion (TAPSE): expected 'annulusDepthPeakSystoleMm' (Tricuspid annulus depth at peak systole) ≤ 'annulusDepthEndDiastoleMm' (Tricuspid annulus depth at end-diastole), got annulusDepthPeakSystoleMm = 110 mm, annulusDepthEndDiastoleMm = 100 mm",
    },
  );
  // Hand-checkable (Hu 2013: mean of sites): septal 120 − 108 = 12, lateral 125 − 111 = 14 → 13 mm.
  const m = evaluate(mapse, {
    septalDepthEndDiastoleMm: 120,
    septalDepthPeakSystoleMm: 108,
    lateralDepthEndDiastoleMm: 125,
    lateralDepthPeakSystoleMm: 111,
  }).outputs;
  assert.deepEqual(m, { septalExcursionMm: 12, lateralExcursionMm: 14, mapseMm: 13 });
  // Each site's depths are a declared relation, named in the error.
  assert.throws(
    () =>
      evaluate(mapse, {
        septalDepthEndDiastoleMm: 120,
        septalDepthPeakSystoleMm: 108,
        lateralDepthEndDiastoleMm: 111,
        lateralDepthPeakSystoleMm: 125,
      }),
    {
      name: "RangeError",
      message:
        "Mitral annular plane systolic excursion (MAPSE): expected 'lateralDepthPeakSystoleMm' (Lateral mitral annulus depth at peak systole) ≤ 'lateralDepthEndDiastoleMm' (Lateral mitral annulus depth at end-diastole), got lateralDepthPeakSystoleMm = 125 mm, lateralDepthEndDiastoleMm = 111 mm",
    },
  );
  // A physically impossible excursion is an output error naming the inputs: 300 − 100 = 200 mm
  // is beyond any human annulus (TAPSE valid range, common practice, no source).
  assert.throws(
    () => evaluate(tapse, { annulusDepthEndDiastoleMm: 300, annulusDepthPeakSystoleMm: 100 }),
    {
      name: "RangeError",
      message:
        "Tricuspid annular plane systolic excursion (TAPSE): output 'tapseMm' (TAPSE) expected in [0, 60] mm, got 200 from annulusDepthEndDiastoleMm = 300 mm, annulusDepthPeakSystoleMm = 100 mm",
    },
  );
});

Deno.test("myocardial performance index: both forms agree", () => {
  // Hand-checkable (Tei 1995): (60 + 80)/280 = 0.5; with a = 60 + 280 + 80 = 420 ms,
  // (a − b)/b = 140/280 = 0.5.
  close(
    evaluate(myocardialPerformanceIndex, {
      isovolumicContractionTimeMs: 60,
      isovolumicRelaxationTimeMs: 80,
      ejectionTimeMs: 280,
    }).outputs.myocardialPerformanceIndex,
    0.5,
  );
  close(
    evaluate(myocardialPerformanceIndexFromClosureTime, {
      closureToOpeningTimeMs: 420,
      ejectionTimeMs: 280,
    })
      .outputs.myocardialPerformanceIndex,
    0.5,
  );
  // Hand-checkable: 0.42 s and 0.3 s in seconds → (420 − 300)/300 = 0.4.
  close(
    evaluate(myocardialPerformanceIndexFromClosureTime, {
      closureToOpeningTimeMs: "0.42 s",
      ejectionTimeMs: "0.3 s",
    })
      .outputs.myocardialPerformanceIndex,
    0.4,
    1e-12,
  );
  assert.throws(
    () =>
      evaluate(myocardialPerformanceIndexFromClosureTime, {
        closureToOpeningTimeMs: 250,
        ejectionTimeMs: 280,
      }),
    {
      name: "RangeError",
      message:
        "Myocardial performance index from closure-to-opening time: expected 'ejectionTimeMs' (Ejection time) ≤ 'closureToOpeningTimeMs' (Valve closure-to-opening time), got ejectionTimeMs = 280 ms, closureToOpeningTimeMs = 250 ms",
    },
  );
  assert.throws(
    () =>
      evaluate(myocardialPerformanceIndex, {
        isovolumicContractionTimeMs: 60,
        isovolumicRelaxationTimeMs: 80,
        ejectionTimeMs: 0,
      }),
    {
      name: "RangeError",
      message:
        "Myocardial performance index (Tei): expected 'ejectionTimeMs' (Ejection time) in (0, 1000] ms, got 0",
    },
  );
});

Deno.test("global longitudinal strain: mean of 16, 17 or 18 segment peaks", () => {
  // Hand-checkable mean (Voigt 2015 segment-average definition): 6×(−17), 6×(−19), 6×(−24)
  // sum to −360 over 18 segments → −20 %.
  const s18 = [...Array(6).fill(-17), ...Array(6).fill(-19), ...Array(6).fill(-24)];
  const r = globalLongitudinalStrain(s18);
  close(r.glsPercent, -20);
  assert.equal(r.segmentCount, 18);
  // 17 segments: 16 at −18 and an apical cap of −35 → (−288 − 35)/17 = −19 %.
  close(globalLongitudinalStrain([...Array(16).fill(-18), -35]).glsPercent, -19);
  // 16 segments with a dyskinetic segment (+4): (15·(−20) + 4)/16 = −18.5 %.
  close(globalLongitudinalStrain([...Array(15).fill(-20), 4]).glsPercent, -18.5);
  assert.throws(() => globalLongitudinalStrain(Array(15).fill(-20)), {
    name: "TypeError",
    message:
      "Global longitudinal strain: expected 'segmentPeakStrainsPercent' (Segment peak longitudinal strains) as an array of 16, 17 or 18 values in % (one per segment of the model), got 15 values",
  });
  const withNaN = Array(17).fill(-20);
  withNaN[3] = NaN;
  assert.throws(() => globalLongitudinalStrain(withNaN), {
    name: "RangeError",
    message:
      "Global longitudinal strain: expected 'segmentPeakStrainsPercent[3]' (Segment peak longitudinal strain) in (-100, 100) %, got NaN",
  });
  const withNull = Array(16).fill(-20);
  withNull[5] = null;
  assert.throws(() => globalLongitudinalStrain(withNull), {
    name: "TypeError",
    message:
      "Global longitudinal strain: expected 'segmentPeakStrainsPercent[5]' (Segment peak longitudinal strain) as a number or a quantity in (-100, 100) %, got null",
  });
});

Deno.test("outputs are quantities: labels and units come from the vocabulary", () => {
  assert.equal(ejectionFraction.outputs.ejectionFractionPercent.quantity.id, "ejectionFraction");
  assert.equal(ejectionFraction.outputs.strokeVolumeMl.quantity.id, "strokeVolume");
  assert.equal(tapse.outputs.tapseMm.label, "TAPSE");
  assert.equal(mapse.outputs.septalExcursionMm.label, "Septal annular excursion");
  assert.equal(
    mapse.inputs.lateralDepthPeakSystoleMm.label,
    "Lateral mitral annulus depth at peak systole",
  );
  assert.equal(myocardialPerformanceIndex.inputs.ejectionTimeMs.quantity.id, "ejectionTime");
  assert.equal(
    myocardialPerformanceIndexFromClosureTime.inputs.ejectionTimeMs.quantity,
    myocardialPerformanceIndex.inputs.ejectionTimeMs.quantity,
  );
});

Deno.test("EF by Monte Carlo: draws that cross the ESV ≤ EDV relation are flagged, not NaN", () => {
  // EDV 60 ± 10 mL, ESV 55 ± 10 mL: the estimates satisfy ESV ≤ EDV, but P(ESV > EDV) =
  // Φ(−5/√200) = 0.362 (normal difference, hand-computed). Those trials give a negative EF, outside
  // its valid range [0, 100] %: the run warns and counts them (excluding them as physically
  // inconsistent draws) instead of stopping.
  const r = propagate(ejectionFraction, {
    endDiastolicVolumeMl: normal(60, 10),
    endSystolicVolumeMl: normal(55, 10),
  }, { method: "monteCarlo", trials: 20_000, seed: 2 });
  const warning = r.warnings.find((w) =>
    /^\d+ of 20000 /.test(w) && /endSystolicVolumeMl|ejectionFractionPercent/.test(w)
  );
  assert.ok(warning !== undefined, r.warnings.join("; "));
  const count = Number(/^(\d+) of 20000/.exec(warning)![1]);
  // binomial standard error √(0.362·0.638/20000) = 0.0034; tolerance 0.015
  assert.ok(Math.abs(count / 20_000 - 0.362) < 0.015, `${count}`);
});

Deno.test("global longitudinal strain carries citations, flags and the clinical caution", () => {
  const r = globalLongitudinalStrain([...Array(15).fill(-20), -45]);
  // −45 % lies outside the typical segment range [−40, 10] % (common practice, no source): flagged.
  assert.equal(r.flags.length, 1);
  assert.match(
    r.flags[0]!,
    /'segmentPeakStrainsPercent\[15\]' \(Segment peak longitudinal strain\) = -45 %/,
  );
  // (15·(−20) − 45)/16 = −21.5625 % (hand-checkable).
  close(r.glsPercent, -21.5625);
  assert.deepEqual(r.citations.map((c) => c.year), [2015, 2015]);
  assert.ok(r.cautions.includes(CLINICAL_CAUTION));
  assert.throws(() => globalLongitudinalStrain("-20" as never), {
    name: "TypeError",
    message:
      `Global longitudinal strain: expected 'segmentPeakStrainsPercent' (Segment peak longitudinal strains) as an array of 16, 17 or 18 values in % (one per segment of the model), got "-20"`,
  });
});
