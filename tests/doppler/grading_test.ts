import assert from "node:assert/strict";
import {
  AORTIC_REGURGITATION_2017,
  AORTIC_STENOSIS_2009,
  AORTIC_STENOSIS_2017,
  defineSeverityTable,
  gradeSeverity,
  JUPYTER_DISPLAY,
  MITRAL_REGURGITATION_2017,
  MITRAL_STENOSIS_AREA_2009,
  MITRAL_STENOSIS_MEAN_GRADIENT_2009,
  MITRAL_STENOSIS_STAGES_2014,
  mitralStenosisAreaTable,
  PULMONARY_HYPERTENSION_2015,
  PULMONARY_HYPERTENSION_2022,
  pulmonaryHypertensionTable,
  type SeverityTable,
} from "../../mod.ts";

const grade = (t: SeverityTable, v: number) => gradeSeverity(t, v).grade;

Deno.test("severe aortic stenosis thresholds of the 2017 update", () => {
  const t = AORTIC_STENOSIS_2017;
  // Baumgartner 2017 (from memory): severe Vmax ≥ 4.0 m/s
  assert.equal(grade(t.peakVelocity, 4.0), "severe");
  assert.equal(grade(t.peakVelocity, 3.99), "moderate");
  // mean gradient ≥ 40 mmHg
  assert.equal(grade(t.meanGradient, 40), "severe");
  assert.equal(grade(t.meanGradient, 39.9), "moderate");
  // AVA < 1.0 cm²
  assert.equal(grade(t.valveArea, 0.99), "severe");
  assert.equal(grade(t.valveArea, 1.0), "moderate");
  // AVAi < 0.6 cm²/m²
  assert.equal(grade(t.indexedValveArea, 0.59), "severe");
  assert.equal(grade(t.indexedValveArea, 0.6), "moderate");
  // velocity ratio (DVI) < 0.25
  assert.equal(grade(t.velocityRatio, 0.24), "severe");
  assert.equal(grade(t.velocityRatio, 0.25), "moderate");
});

Deno.test("mild, moderate and sclerosis bands of aortic stenosis", () => {
  const t = AORTIC_STENOSIS_2017;
  // Baumgartner 2017 (from memory): sclerosis ≤ 2.5, mild 2.6–2.9, moderate 3.0–3.9 m/s
  assert.equal(grade(t.peakVelocity, 2.5), "aortic sclerosis");
  assert.equal(grade(t.peakVelocity, 2.6), "mild");
  assert.equal(grade(t.peakVelocity, 2.95), "mild"); // gap 2.9–3.0 closed at 3.0
  assert.equal(grade(t.peakVelocity, 3.0), "moderate");
  // mean gradient < 20 mild, 20–39 moderate
  assert.equal(grade(t.meanGradient, 19.9), "mild");
  assert.equal(grade(t.meanGradient, 20), "moderate");
  // AVA > 1.5 mild, 1.0–1.5 moderate; AVAi > 0.85 mild; DVI > 0.50 mild
  assert.equal(grade(t.valveArea, 1.5), "moderate");
  assert.equal(grade(t.valveArea, 1.51), "mild");
  assert.equal(grade(t.indexedValveArea, 0.85), "moderate");
  assert.equal(grade(t.indexedValveArea, 0.86), "mild");
  assert.equal(grade(t.velocityRatio, 0.5), "moderate");
  assert.equal(grade(t.velocityRatio, 0.51), "mild");
});

Deno.test("2009 and 2017 aortic stenosis differ only at 4 m/s and 40 mmHg", () => {
  // Baumgartner 2009 (from memory): moderate 3.0–4.0 m/s and 20–40 mmHg; severe > 4.0, > 40
  assert.equal(grade(AORTIC_STENOSIS_2009.peakVelocity, 4.0), "moderate");
  assert.equal(grade(AORTIC_STENOSIS_2009.peakVelocity, 4.01), "severe");
  assert.equal(grade(AORTIC_STENOSIS_2009.meanGradient, 40), "moderate");
  assert.equal(grade(AORTIC_STENOSIS_2009.meanGradient, 40.5), "severe");
  // same area thresholds in both (AVA < 1.0 severe)
  assert.equal(grade(AORTIC_STENOSIS_2009.valveArea, 0.9), "severe");
});

Deno.test("mitral stenosis: older grading and newer staging are both selectable", () => {
  // Baumgartner 2009 (from memory): mild > 1.5, moderate 1.0–1.5, severe < 1.0 cm²
  assert.equal(grade(MITRAL_STENOSIS_AREA_2009, 1.6), "mild");
  assert.equal(grade(MITRAL_STENOSIS_AREA_2009, 1.5), "moderate");
  assert.equal(grade(MITRAL_STENOSIS_AREA_2009, 0.99), "severe");
  // mean gradient < 5, 5–10, > 10 mmHg
  assert.equal(grade(MITRAL_STENOSIS_MEAN_GRADIENT_2009, 4.9), "mild");
  assert.equal(grade(MITRAL_STENOSIS_MEAN_GRADIENT_2009, 10), "moderate");
  assert.equal(grade(MITRAL_STENOSIS_MEAN_GRADIENT_2009, 10.1), "severe");
  // Nishimura 2014 AHA/ACC (from memory): severe ≤ 1.5 cm², very severe ≤ 1.0 cm²
  assert.equal(grade(MITRAL_STENOSIS_STAGES_2014, 1.5), "severe (stage C/D)");
  assert.equal(grade(MITRAL_STENOSIS_STAGES_2014, 1.0), "very severe (stage C/D)");
  assert.equal(grade(MITRAL_STENOSIS_STAGES_2014, 1.6), "progressive (stage B)");
  // selection by scheme name
  assert.equal(mitralStenosisAreaTable("EAE/ASE 2009"), MITRAL_STENOSIS_AREA_2009);
  assert.equal(mitralStenosisAreaTable("AHA/ACC 2014"), MITRAL_STENOSIS_STAGES_2014);
  assert.throws(() => mitralStenosisAreaTable("ESC 2030" as never), {
    name: "RangeError",
    message: /expected 'scheme' "EAE\/ASE 2009" or "AHA\/ACC 2014", got "ESC 2030"$/,
  });
});

Deno.test("mitral and aortic regurgitation by Zoghbi et al. 2017", () => {
  const mr = MITRAL_REGURGITATION_2017;
  // Zoghbi 2017 (from memory): MR EROA < 0.20 mild, 0.20–0.29, 0.30–0.39, ≥ 0.40 severe cm²
  assert.equal(grade(mr.eroa, 0.19), "mild");
  assert.equal(grade(mr.eroa, 0.2), "moderate (mild-to-moderate)");
  assert.equal(grade(mr.eroa, 0.35), "moderate (moderate-to-severe)");
  assert.equal(grade(mr.eroa, 0.4), "severe");
  // RVol < 30, 30–44, 45–59, ≥ 60 mL
  assert.equal(grade(mr.regurgitantVolume, 29), "mild");
  assert.equal(grade(mr.regurgitantVolume, 45), "moderate (moderate-to-severe)");
  assert.equal(grade(mr.regurgitantVolume, 60), "severe");
  // RF < 30, 30–39, 40–49, ≥ 50 %
  assert.equal(grade(mr.regurgitantFraction, 30), "moderate (mild-to-moderate)");
  assert.equal(grade(mr.regurgitantFraction, 50), "severe");
  const ar = AORTIC_REGURGITATION_2017;
  // Zoghbi 2017 (from memory): AR EROA < 0.10 mild, 0.10–0.19, 0.20–0.29, ≥ 0.30 severe cm²
  assert.equal(grade(ar.eroa, 0.09), "mild");
  assert.equal(grade(ar.eroa, 0.1), "moderate (mild-to-moderate)");
  assert.equal(grade(ar.eroa, 0.29), "moderate (moderate-to-severe)");
  assert.equal(grade(ar.eroa, 0.3), "severe");
  // AR RVol ≥ 60 mL and RF ≥ 50 % severe
  assert.equal(grade(ar.regurgitantVolume, 60), "severe");
  assert.equal(grade(ar.regurgitantFraction, 49.9), "moderate (moderate-to-severe)");
  // Issue 3 PISA example: EROA 0.50 cm² is severe MR
  assert.equal(grade(mr.eroa, 0.5), "severe");
});

Deno.test("pulmonary hypertension echo probability by TR velocity (ESC/ERS 2015 and 2022)", () => {
  // Galiè 2015 Table 8 (from memory): ≤ 2.8 low, 2.9–3.4 intermediate, > 3.4 m/s high
  const t15 = PULMONARY_HYPERTENSION_2015.withoutOtherSigns;
  assert.equal(grade(t15, 2.8), "low");
  assert.equal(grade(t15, 2.9), "intermediate");
  assert.equal(grade(t15, 3.4), "intermediate");
  assert.equal(grade(t15, 3.5), "high");
  // with other echo signs: ≤ 2.8 intermediate, 2.9–3.4 high
  const s15 = PULMONARY_HYPERTENSION_2015.withOtherSigns;
  assert.equal(grade(s15, 2.5), "intermediate");
  assert.equal(grade(s15, 3.0), "high");
  // Humbert 2022 (from memory): the same TR-velocity bands were kept
  for (const v of [1.5, 2.8, 2.85, 3.4, 3.41, 5]) {
    assert.equal(grade(PULMONARY_HYPERTENSION_2022.withoutOtherSigns, v), grade(t15, v));
    assert.equal(grade(PULMONARY_HYPERTENSION_2022.withOtherSigns, v), grade(s15, v));
  }
  assert.equal(pulmonaryHypertensionTable("ESC/ERS 2015", true), s15);
  assert.throws(() => pulmonaryHypertensionTable("ESC/ERS 2015", "yes" as never), {
    name: "TypeError",
    message: /'otherEchoSigns' as true or false, got string$/,
  });
});

Deno.test("every table row carries a source and the tables are contiguous", () => {
  // Project rule (HELPER_RULES): each guideline row carries its source
  const tables: SeverityTable[] = [
    ...Object.values(AORTIC_STENOSIS_2009),
    ...Object.values(AORTIC_STENOSIS_2017),
    MITRAL_STENOSIS_AREA_2009,
    MITRAL_STENOSIS_MEAN_GRADIENT_2009,
    MITRAL_STENOSIS_STAGES_2014,
    ...Object.values(MITRAL_REGURGITATION_2017),
    ...Object.values(AORTIC_REGURGITATION_2017),
    ...Object.values(PULMONARY_HYPERTENSION_2015),
    ...Object.values(PULMONARY_HYPERTENSION_2022),
  ];
  assert.equal(tables.length, 23); // 5 + 5 AS, 3 MS, 3 + 3 regurgitation, 2 + 2 PH
  for (const t of tables) {
    for (const b of t.bands) {
      assert.ok(b.source.authors.length > 0 && b.source.year >= 2009, `${t.id} ${b.grade}`);
      assert.ok(b.source.locator !== undefined && b.printed.length > 0, `${t.id} ${b.grade}`);
    }
    // defineSeverityTable re-checks contiguity; this throws if a table were malformed
    defineSeverityTable(t);
  }
});

Deno.test("malformed tables are rejected", () => {
  const source = { authors: "A", year: 2020, title: "T", publication: "P" };
  const b = (lower: number | null, li: boolean, upper: number | null, ui: boolean) => ({
    grade: `${lower}-${upper}`,
    lower,
    lowerInclusive: li,
    upper,
    upperInclusive: ui,
    printed: "",
    source,
    fromMemory: false,
  });
  const base = { id: "t", title: "T", quantity: "x", unit: "1", notes: [] };
  assert.throws(
    () => defineSeverityTable({ ...base, bands: [b(0, true, 1, false), b(2, true, null, false)] }),
    {
      name: "TypeError",
      message: /must start where '0-1' ends \(1\), got 2$/,
    },
  );
  assert.throws(
    () => defineSeverityTable({ ...base, bands: [b(0, true, 1, true), b(1, true, null, false)] }),
    {
      name: "TypeError",
      message: /exactly one of .* got both$/,
    },
  );
  assert.throws(() => defineSeverityTable({ ...base, bands: [] }), {
    name: "TypeError",
    message: /at least one band, got 0$/,
  });
});

Deno.test("grading samples gives the probability of each class", () => {
  // Counting (hand-checkable): 2 of 5 below 1.0 (severe), 2 in [1.0, 1.5], 1 above
  const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.8, 0.95, 1.0, 1.4, 1.6]);
  assert.deepEqual(
    d.probabilities.map((p) => [p.grade, p.probability]),
    [["severe", 0.4], ["moderate", 0.4], ["mild", 0.2]],
  );
  assert.equal(d.count, 5);
  assert.equal(d.median, 1.0);
  assert.equal(d.grade, "moderate"); // class of the median
  assert.equal(d.mostLikely, "severe"); // first of the tied classes in table order
  // an object with samples (a Monte Carlo output) and typed arrays work the same
  const d2 = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, {
    samples: new Float64Array([0.8, 0.95, 1.0, 1.4, 1.6]),
  });
  assert.deepEqual(d2.probabilities, d.probabilities);
  const shown = d[JUPYTER_DISPLAY]()["text/plain"] as string;
  assert.match(shown, /severe .* 0\.4/);
});

Deno.test("bad values for grading", () => {
  assert.throws(() => gradeSeverity(AORTIC_STENOSIS_2017.peakVelocity, -1), {
    name: "RangeError",
    message: /expected a value in \[0, ∞\) m\/s, got -1$/,
  });
  assert.throws(() => gradeSeverity(AORTIC_STENOSIS_2017.valveArea, Number.NaN), {
    name: "RangeError",
    message: /got NaN$/,
  });
  assert.throws(() => gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [1, Number.NaN]), {
    name: "RangeError",
    message: /'samples\[1\]' finite, got NaN$/,
  });
  assert.throws(() => gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [1, 0]), {
    name: "RangeError",
    message: /'samples\[1\]': expected a value in \(0, ∞\) cm², got 0$/,
  });
  assert.throws(() => gradeSeverity(AORTIC_STENOSIS_2017.valveArea, []), {
    name: "TypeError",
    message: /at least one sample, got 0$/,
  });
  assert.throws(() => gradeSeverity(AORTIC_STENOSIS_2017.valveArea, "1.0" as never), {
    name: "TypeError",
    message: /got string$/,
  });
});
