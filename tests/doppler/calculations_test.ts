import assert from "node:assert/strict";
import {
  cardiacIndex,
  cardiacOutput,
  continuityValveArea,
  continuityValveAreaPeakVelocity,
  continuityValveAreaWithAngles,
  crossSectionalArea,
  dimensionlessIndex,
  effectiveRegurgitantOrificeArea,
  evaluate,
  indexedValveArea,
  insonationAngleEffect,
  mitralValveAreaPressureHalfTime,
  modifiedBernoulli,
  pisaFlowRate,
  pisaRegurgitation,
  pressureHalfTimeFromDecelerationTime,
  pressureHalfTimeFromSlope,
  pulmonarySystemicFlowRatio,
  regurgitantFraction,
  regurgitantFractionPisa,
  regurgitantVolume,
  rightAtrialPressureFromIvc,
  rvSystolicPressure,
  rvSystolicPressureFromIvc,
  simplifiedBernoulli,
  strokeVolume,
  volumetricRegurgitation,
} from "../../mod.ts";
import { CLINICAL_CAUTION } from "../../mod.ts";

const close = (actual: number, expected: number, tol: number, what = "") =>
  assert.ok(
    Math.abs(actual - expected) <= tol,
    `${what} expected ${expected} ± ${tol}, got ${actual}`,
  );

// ------------------------------------------------------------------ Bernoulli

Deno.test("simplified Bernoulli: 4 m/s gives 64 mmHg", () => {
  // Issue 3 / Hatle & Angelsen 1985 ch. 2: ΔP = 4v², v = 4 m/s → 64 mmHg (hand-checkable)
  assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: 4 }).outputs.gradient, 64);
  // unit conversion: 400 cm/s is the same velocity
  assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: "400 cm/s" }).outputs.gradient, 64);
  // Baumgartner 2009 (from memory): severe AS threshold 4 m/s ↔ 64 mmHg peak gradient; 5 m/s → 100
  assert.equal(evaluate(simplifiedBernoulli, { peakVelocity: 5 }).outputs.gradient, 100);
});

Deno.test("simplified Bernoulli constant agrees with ½ρ for blood converted to mmHg", () => {
  // Physics: ΔP = ½ρv²; ρ_blood ≈ 1060 kg/m³ (common practice, no source);
  // 1 mmHg = 133.322 Pa (standard definition). ½·1060/133.322 = 3.975 mmHg per (m/s)²
  const physical = 0.5 * 1060 / 133.322;
  const g = evaluate(simplifiedBernoulli, { peakVelocity: 1 }).outputs.gradient;
  close(g, physical, 0.01 * physical, "constant within 1 %");
});

Deno.test("modified Bernoulli subtracts the proximal term", () => {
  // Baumgartner 2009 (from memory): ΔP = 4(v2² − v1²); hand check 4·(16 − 2.25) = 55 mmHg
  close(
    evaluate(modifiedBernoulli, { jetVelocity: 4, proximalVelocity: 1.5 }).outputs.gradient,
    55,
    1e-12,
  );
  // v1 = 0 reduces to the simplified form (hand-checkable)
  assert.equal(
    evaluate(modifiedBernoulli, { jetVelocity: 3, proximalVelocity: 0 }).outputs.gradient,
    36,
  );
});

Deno.test("Bernoulli rejects a negative velocity with field and range", () => {
  // Issue 3: negative velocity where a magnitude is required → RangeError naming field and range
  assert.throws(() => evaluate(simplifiedBernoulli, { peakVelocity: -1 }), {
    name: "RangeError",
    message: /^Simplified Bernoulli gradient: expected 'peakVelocity' in \[0, 10\] m\/s, got -1$/,
  });
  assert.throws(() => evaluate(modifiedBernoulli, { jetVelocity: 4, proximalVelocity: -0.5 }), {
    name: "RangeError",
    message: /'proximalVelocity' in \[0, 10\] m\/s, got -0.5$/,
  });
  assert.throws(() => evaluate(simplifiedBernoulli, { peakVelocity: Number.NaN }), {
    name: "RangeError",
    message: /got NaN$/,
  });
  // a pressure unit for a velocity is a TypeError
  assert.throws(() => evaluate(simplifiedBernoulli, { peakVelocity: "4 mmHg" }), {
    name: "TypeError",
  });
});

Deno.test("calculations reaching a patient decision carry the clinical caution", () => {
  // HELPER_RULES: clinical results carry the standard caution (project rule, no outside source)
  for (
    const calc of [simplifiedBernoulli, continuityValveArea, pisaFlowRate, rvSystolicPressure]
  ) {
    assert.equal(calc.clinical, true, calc.id);
  }
  assert.ok(
    evaluate(mitralValveAreaPressureHalfTime, { phtMs: 220 }).cautions.includes(CLINICAL_CAUTION),
  );
});

// ------------------------------------------------------------------ flow

Deno.test("cross-sectional area and stroke volume", () => {
  // CSA = π d²/4 (Quiñones 2002): d = 2 cm → π = 3.14159 cm² (hand-checkable)
  close(evaluate(crossSectionalArea, { diameterCm: 2 }).outputs.areaCm2, 3.14159, 1e-5);
  // d = 2.1 cm → 3.4636 cm² (hand-checkable: 0.7854·4.41)
  close(evaluate(crossSectionalArea, { diameterCm: "21 mm" }).outputs.areaCm2, 3.4636, 1e-4);
  // SV = CSA·VTI: 3.4636 cm² × 22 cm = 76.2 mL (hand-checkable)
  close(evaluate(strokeVolume, { diameterCm: 2.1, vtiCm: 22 }).outputs.strokeVolumeMl, 76.2, 0.01);
});

Deno.test("diameter squared: +5 % diameter gives +10.25 % area", () => {
  // (1.05)² = 1.1025 (hand-checkable power law; JCGM 100 §5.1.6 for the relative form)
  const a = evaluate(crossSectionalArea, { diameterCm: 2 }).outputs.areaCm2;
  const b = evaluate(crossSectionalArea, { diameterCm: 2.1 }).outputs.areaCm2;
  close(b / a, 1.1025, 1e-12);
});

Deno.test("diameter 0 is rejected with the valid range", () => {
  // Issue 3: diameter 0 → clear error naming field and range
  assert.throws(() => evaluate(crossSectionalArea, { diameterCm: 0 }), {
    name: "RangeError",
    message: /^Cross-sectional area from diameter: expected 'diameterCm' in \(0, 5\] cm, got 0$/,
  });
  assert.throws(
    () => evaluate(continuityValveArea, { lvotDiameterCm: 0, lvotVtiCm: 20, avVtiCm: 100 }),
    { name: "RangeError", message: /'lvotDiameterCm' in \(0, 5\] cm, got 0$/ },
  );
});

Deno.test("cardiac output and index", () => {
  // CO = SV·HR: 70 mL × 72/min = 5.04 L/min (hand-checkable)
  close(
    evaluate(cardiacOutput, { strokeVolumeMl: 70, heartRateBpm: 72 }).outputs.cardiacOutputLPerMin,
    5.04,
    1e-12,
  );
  // CI = CO/BSA: 5.04/1.8 = 2.8 L/min/m² (hand-checkable)
  close(
    evaluate(cardiacIndex, { cardiacOutputLPerMin: 5.04, bsaM2: 1.8 }).outputs.cardiacIndex,
    2.8,
    1e-12,
  );
  assert.throws(() => evaluate(cardiacOutput, { strokeVolumeMl: 70, heartRateBpm: 0 }), {
    name: "RangeError",
    message: /'heartRateBpm' in \(0, 300\] bpm, got 0$/,
  });
});

Deno.test("Qp/Qs", () => {
  // Hand-checkable: RVOT 2.5 cm / 20 cm, LVOT 2.0 cm / 20 cm → (2.5/2.0)² = 1.5625
  const r = evaluate(pulmonarySystemicFlowRatio, {
    rvotDiameterCm: 2.5,
    rvotVtiCm: 20,
    lvotDiameterCm: 2.0,
    lvotVtiCm: 20,
  }).outputs;
  close(r.qpQs, 1.5625, 1e-12);
  close(r.pulmonaryStrokeVolumeMl, Math.PI * 6.25 / 4 * 20, 1e-9);
});

// ------------------------------------------------------------------ valve areas

Deno.test("continuity valve area, VTI and peak-velocity forms", () => {
  // Hand-checkable (Baumgartner 2009 continuity equation): d 2.0 cm, VTI_LVOT 20, VTI_AV 100
  // → CSA 3.1416 cm², SV 62.83 mL, AVA 0.628 cm²
  close(
    evaluate(continuityValveArea, { lvotDiameterCm: 2, lvotVtiCm: 20, avVtiCm: 100 }).outputs
      .avaCm2,
    0.6283,
    1e-4,
  );
  // Hand-checkable: d 2.2 cm, V_LVOT 0.9 m/s, V_AV 4.5 m/s → 3.8013·0.2 = 0.7603 cm²
  close(
    evaluate(continuityValveAreaPeakVelocity, {
      lvotDiameterCm: 2.2,
      lvotPeakVelocity: 0.9,
      avPeakVelocity: 4.5,
    }).outputs.avaCm2,
    0.7603,
    1e-4,
  );
  // AVA = CSA × DVI (identity of the continuity equation, hand-checkable)
  const dvi = evaluate(dimensionlessIndex, { lvotVtiCm: 20, avVtiCm: 100 }).outputs.dvi;
  assert.equal(dvi, 0.2);
  // AVAi: 0.8 cm² / 1.6 m² = 0.5 cm²/m² (hand-checkable)
  close(
    evaluate(indexedValveArea, { avaCm2: 0.8, bsaM2: 1.6 }).outputs.avaIndexCm2PerM2,
    0.5,
    1e-12,
  );
});

Deno.test("mitral valve area by pressure half-time", () => {
  // Issue 3 / Hatle 1979: MVA = 220/PHT; PHT 220 ms → 1.0 cm²
  assert.equal(evaluate(mitralValveAreaPressureHalfTime, { phtMs: 220 }).outputs.mvaCm2, 1);
  // PHT 110 ms → 2.0 cm²; 0.44 s → 0.5 cm² (hand-checkable, unit conversion)
  assert.equal(evaluate(mitralValveAreaPressureHalfTime, { phtMs: 110 }).outputs.mvaCm2, 2);
  close(evaluate(mitralValveAreaPressureHalfTime, { phtMs: "0.44 s" }).outputs.mvaCm2, 0.5, 1e-12);
  assert.throws(() => evaluate(mitralValveAreaPressureHalfTime, { phtMs: 0 }), {
    name: "RangeError",
    message: /'phtMs' in \(0, 1000\] ms, got 0$/,
  });
});

Deno.test("pressure half-time from deceleration time and from slope agree", () => {
  // Baumgartner 2009 (from memory): PHT = 0.29·DT; MVA = 759/DT follows (220/0.29 = 758.6)
  close(
    evaluate(pressureHalfTimeFromDecelerationTime, { decelerationTimeMs: 759 }).outputs.phtMs,
    220.11,
    1e-9,
  );
  // Definition (Hatle 1979): PHT is the time for v to fall to v/√2; with a linear slope
  // DT = v/s, so PHT/DT = 1 − 1/√2 = 0.2929 (hand-checkable), within 1 % of 0.29
  const v = 1.8;
  const s = 3; // m/s² → DT = 600 ms
  const fromSlope = evaluate(pressureHalfTimeFromSlope, { peakVelocity: v, decelerationSlope: s })
    .outputs.phtMs;
  close(fromSlope, 600 * 0.29289, 0.01);
  const fromDt = evaluate(pressureHalfTimeFromDecelerationTime, { decelerationTimeMs: 600 }).outputs
    .phtMs;
  close(fromSlope / fromDt, 1, 0.01);
  // Direct check of the definition: v(PHT) = v0/√2 ⇒ gradient halves (Bernoulli ∝ v²)
  const vAtPht = v - s * fromSlope / 1000;
  close(
    evaluate(simplifiedBernoulli, { peakVelocity: vAtPht }).outputs.gradient /
      evaluate(simplifiedBernoulli, { peakVelocity: v }).outputs.gradient,
    0.5,
    1e-12,
  );
});

// ------------------------------------------------------------------ PISA and regurgitation

Deno.test("PISA worked numbers", () => {
  // Issue 3 worked example (hand-checkable from Zoghbi 2017 PISA formula):
  // r = 1 cm, Va = 40 cm/s → 2π·1·40 = 251.3 mL/s
  const q =
    evaluate(pisaFlowRate, { radiusCm: 1, aliasingVelocityCmPerS: 40 }).outputs.flowRateMlPerS;
  close(q, 251.3, 0.05);
  // with Vmax 5 m/s → EROA = 251.3/500 = 0.50 cm²
  const eroa = evaluate(effectiveRegurgitantOrificeArea, {
    flowRateMlPerS: q,
    regurgitantPeakVelocity: 5,
  }).outputs.eroaCm2;
  close(eroa, 0.50, 0.005);
  // RVol = EROA·VTI: 0.5027 × 150 = 75.4 mL (hand-checkable)
  close(
    evaluate(regurgitantVolume, { eroaCm2: eroa, regurgitantVtiCm: 150 }).outputs
      .regurgitantVolumeMl,
    75.4,
    0.05,
  );
  // The composed chain gives the same numbers
  const chain = evaluate(pisaRegurgitation, {
    radiusCm: 1,
    aliasingVelocityCmPerS: 40,
    regurgitantPeakVelocity: 5,
    regurgitantVtiCm: 150,
  }).outputs;
  close(chain.eroaCm2, eroa, 1e-12);
  close(chain.regurgitantVolumeMl, 75.4, 0.05);
});

Deno.test("PISA wall-angle correction α/180", () => {
  // Pu et al. 1995 (from memory): Q = 2πr²·Va·α/180; α = 120° → 2/3 of the flat-wall flow
  const flat =
    evaluate(pisaFlowRate, { radiusCm: 0.8, aliasingVelocityCmPerS: 35 }).outputs.flowRateMlPerS;
  const funnel = evaluate(pisaFlowRate, {
    radiusCm: 0.8,
    aliasingVelocityCmPerS: 35,
    wallAngleDeg: 120,
  }).outputs.flowRateMlPerS;
  close(funnel / flat, 2 / 3, 1e-12);
  // flat default equals an explicit 180° (and "π rad")
  close(
    evaluate(pisaFlowRate, {
      radiusCm: 0.8,
      aliasingVelocityCmPerS: 35,
      wallAngleDeg: "3.14159265359 rad",
    })
      .outputs.flowRateMlPerS,
    flat,
    1e-6,
  );
  assert.throws(
    () => evaluate(pisaFlowRate, { radiusCm: 0, aliasingVelocityCmPerS: 40 }),
    { name: "RangeError", message: /'radiusCm' in \(0, 3\] cm, got 0$/ },
  );
});

Deno.test("regurgitant fraction, PISA and volumetric", () => {
  // RF = RVol/total SV (Zoghbi 2017): 45/90 = 50 % (hand-checkable)
  assert.equal(
    evaluate(regurgitantFraction, { regurgitantVolumeMl: 45, totalStrokeVolumeMl: 90 }).outputs
      .regurgitantFractionPercent,
    50,
  );
  // PISA method: RVol 40, forward 60 → 40/100 = 40 % (hand-checkable)
  close(
    evaluate(regurgitantFractionPisa, { regurgitantVolumeMl: 40, forwardStrokeVolumeMl: 60 })
      .outputs
      .regurgitantFractionPercent,
    40,
    1e-12,
  );
  // Volumetric: mitral SV 120, LVOT SV 70 → RVol 50, RF 41.67 % (hand-checkable)
  const vol =
    evaluate(volumetricRegurgitation, { totalStrokeVolumeMl: 120, forwardStrokeVolumeMl: 70 })
      .outputs;
  assert.equal(vol.regurgitantVolumeMl, 50);
  close(vol.regurgitantFractionPercent, 41.667, 1e-3);
});

// ------------------------------------------------------------------ right heart

Deno.test("RA pressure from the IVC follows Rudski et al. 2010", () => {
  // Rudski 2010: ≤ 2.1 cm and > 50 % collapse → 3 mmHg
  assert.equal(
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 1.8, ivcCollapsePercent: 60 }).outputs
      .rapMmHg,
    3,
  );
  // boundary diameter 2.1 cm is still "≤ 2.1"
  assert.equal(
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 2.1, ivcCollapsePercent: 51 }).outputs
      .rapMmHg,
    3,
  );
  // > 2.1 cm and < 50 % → 15 mmHg
  assert.equal(
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 2.5, ivcCollapsePercent: 30 }).outputs
      .rapMmHg,
    15,
  );
  // mixed findings → 8 mmHg (both "other" combinations, and exactly 50 %)
  assert.equal(
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 2.5, ivcCollapsePercent: 60 }).outputs
      .rapMmHg,
    8,
  );
  assert.equal(
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 1.8, ivcCollapsePercent: 30 }).outputs
      .rapMmHg,
    8,
  );
  assert.equal(
    evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 1.8, ivcCollapsePercent: 50 }).outputs
      .rapMmHg,
    8,
  );
  assert.throws(
    () => evaluate(rightAtrialPressureFromIvc, { ivcDiameterCm: 1.8, ivcCollapsePercent: 120 }),
    { name: "RangeError", message: /'ivcCollapsePercent' in \[0, 100\] %, got 120$/ },
  );
});

Deno.test("RV systolic pressure = 4v² + RAP", () => {
  // Rudski 2010: RVSP = 4v² + RAP; 2.8 m/s + 3 mmHg = 31.36 + 3 = 34.36 (hand-checkable)
  close(
    evaluate(rvSystolicPressure, { trVelocity: 2.8, rapMmHg: 3 }).outputs.rvspMmHg,
    34.36,
    1e-9,
  );
  // composed with the IVC rule: 3.4 m/s, IVC 2.4 cm, 20 % → 46.24 + 15 = 61.24 (hand-checkable)
  const r = evaluate(rvSystolicPressureFromIvc, {
    trVelocity: 3.4,
    ivcDiameterCm: 2.4,
    ivcCollapsePercent: 20,
  }).outputs;
  close(r.rvspMmHg, 61.24, 1e-9);
  assert.equal(r.rapMmHg, 15);
  assert.throws(() => evaluate(rvSystolicPressure, { trVelocity: -2, rapMmHg: 3 }), {
    name: "RangeError",
    message: /'trVelocity' in \[0, 7\] m\/s, got -2$/,
  });
});

// ------------------------------------------------------------------ insonation angle

Deno.test("insonation angle: velocity and gradient underestimation", () => {
  // Common practice (issue 3): cos θ error under about 6 % below 20°: 1 − cos 20° = 6.03 %
  const r20 = evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 20 }).outputs;
  close(r20.velocityUnderestimationPercent, 6.03, 0.005);
  // gradient ∝ v²: 1 − cos² 20° = sin² 20° = 11.70 % (hand-checkable)
  close(r20.gradientUnderestimationPercent, 11.70, 0.005);
  close(r20.measuredGradient, 64, 1e-12);
  close(r20.trueGradient, 64 / Math.cos(Math.PI / 9) ** 2, 1e-9);
  // cos 60° = 0.5 exactly (trigonometry): the reading is half the true velocity
  const r60 = evaluate(insonationAngleEffect, { measuredVelocity: 2, angleDeg: 60 }).outputs;
  close(r60.trueVelocity, 4, 1e-12);
  close(r60.gradientUnderestimationPercent, 75, 1e-9);
  // the angle sign does not matter (cos is even)
  close(
    evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: -20 }).outputs.trueVelocity,
    r20.trueVelocity,
    1e-12,
  );
  // angle ≥ 90° is rejected (issue 3)
  assert.throws(() => evaluate(insonationAngleEffect, { measuredVelocity: 4, angleDeg: 90 }), {
    name: "RangeError",
    message: /'angleDeg' in \(-90, 90\) deg, got 90$/,
  });
});

Deno.test("misaligned aortic jet overestimates the continuity area by 1/cos θ − 1", () => {
  // Baumgartner 2009: under-recorded jet velocity overestimates AVA; at θ_AV = 20°
  // the naive area is 1/cos 20° − 1 = 6.42 % too large (hand-checkable)
  const r = evaluate(continuityValveAreaWithAngles, {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    avPeakVelocity: 4,
    avAngleDeg: 20,
  }).outputs;
  close(r.areaOverestimationPercent, 6.418, 0.001);
  // with both angles 0 the result equals the peak-velocity continuity area
  const aligned = evaluate(continuityValveAreaPeakVelocity, {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    avPeakVelocity: 4,
  }).outputs.avaCm2;
  close(r.avaAssumingAlignmentCm2, aligned, 1e-15);
  // equal angles at both sites cancel (hand-checkable)
  const both = evaluate(continuityValveAreaWithAngles, {
    lvotDiameterCm: 2,
    lvotPeakVelocity: 1,
    lvotAngleDeg: 25,
    avPeakVelocity: 4,
    avAngleDeg: 25,
  }).outputs;
  close(both.areaOverestimationPercent, 0, 1e-9);
});
