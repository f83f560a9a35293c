import assert from "node:assert/strict";
import {
  AORTIC_VALVE_AREA,
  continuityValveArea,
  continuityValveAreaPeakVelocity,
  crossSectionalArea,
  dimensionlessIndex,
  energyLossIndex,
  evaluate,
  indexedToBsa,
  indexedValveArea,
  mitralValveAreaPressureHalfTime,
  normal,
  pressureHalfTimeFromDecelerationTime,
  pressureHalfTimeFromSlope,
  propagate,
  simplifiedBernoulli,
} from "../../mod.ts";
import { close } from "./helpers.ts";

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
    evaluate(indexedValveArea, { aorticValveArea: 0.8, bsaM2: 1.6 }).outputs.aorticValveAreaIndex,
    0.5,
    1e-12,
  );
  // the indexed area is the indexing family's member for the aortic valve area
  assert.equal(indexedValveArea, indexedToBsa(AORTIC_VALVE_AREA));
});

Deno.test("continuity valve area rejects an LVOT diameter of 0 and a zero jet velocity", () => {
  // Issue 3: diameter 0 → clear error naming field and range
  assert.throws(
    () => evaluate(continuityValveArea, { lvotDiameterCm: 0, lvotVtiCm: 20, avVtiCm: 100 }),
    {
      name: "RangeError",
      message:
        /^Continuity valve area \(VTI\): expected 'lvotDiameterCm' \(LVOT diameter\) in \(0, 5\] cm, got 0$/,
    },
  );
  // the area divides by the jet velocity
  assert.throws(
    () =>
      evaluate(continuityValveAreaPeakVelocity, {
        lvotDiameterCm: 2,
        lvotPeakVelocity: 1,
        avPeakVelocity: 0,
      }),
    {
      name: "RangeError",
      message:
        /^Continuity valve area \(peak velocity\): expected 'avPeakVelocity' \(Aortic jet peak velocity\) in \(0, 10\] m\/s, got 0$/,
    },
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
    message:
      /^Mitral valve area by pressure half-time: expected 'phtMs' \(Pressure half-time\) in \(0, 1000\] ms, got 0$/,
  });
  // 220/20 = 11 cm² is larger than any mitral orifice: refused, naming the input
  assert.throws(() => evaluate(mitralValveAreaPressureHalfTime, { phtMs: 20 }), {
    name: "RangeError",
    message:
      /^Mitral valve area by pressure half-time: .*'mvaCm2' \(Mitral valve area\).* in \(0, 10\] cm², got 11 from phtMs = 20 ms$/,
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

Deno.test("LVOT diameter error is squared into area and valve area (GUM relative law)", () => {
  // JCGM 100 §5.1.6: for Y = c·X^p, u_r(Y) = |p|·u_r(X); d = 2.0 ± 0.1 cm (5 %) → area 10 %
  const a = propagate(crossSectionalArea, { diameterCm: normal(2.0, 0.1) });
  close(
    a.outputs.areaCm2.standardUncertainty / a.outputs.areaCm2.value,
    0.10,
    1e-6,
    "u_r(CSA)",
  );
  // JCGM 100 eq. (12): u_r² = (2·u_r(d))² + u_r(VTI_LVOT)² + u_r(VTI_AV)²
  // = 0.10² + (1.5/22)² + (4/90)² → u_r = 0.12968
  const r = propagate(continuityValveArea, {
    lvotDiameterCm: normal(2.0, 0.1),
    lvotVtiCm: normal(22, 1.5),
    avVtiCm: normal(90, 4),
  });
  const expected = Math.sqrt(0.1 ** 2 + (1.5 / 22) ** 2 + (4 / 90) ** 2);
  close(r.outputs.avaCm2.standardUncertainty / r.outputs.avaCm2.value, expected, 1e-5, "u_r(AVA)");
  // the diameter dominates the budget: share 0.01/0.016817 = 59 % (hand-checkable)
  const share = r.outputs.avaCm2.budget.find((b) => b.source === "lvotDiameterCm")!.share;
  close(share, 0.01 / expected ** 2, 1e-4, "diameter share");
});

Deno.test("energy loss index: (EOA·AA/(AA − EOA))/BSA", () => {
  // Hand computation of the published formula (Garcia D et al., Circulation 2000;101:765,
  // abstract: the coefficient (EOA×AA)/(AA−EOA), indexed to BSA): EOA 0.8 cm², AA 4 cm², BSA
  // 2 m² → ELCo = 3.2/3.2 = 1.0 cm², ELI = 0.5 cm²/m²
  const r = evaluate(energyLossIndex, { avaCm2: 0.8, aorticAreaCm2: 4, bsaM2: 2 });
  close(r.outputs.energyLossCoefficientCm2, 1, 1e-12, "ELCo");
  close(r.outputs.energyLossIndex, 0.5, 1e-12, "ELI");
  // STJ diameter 2.5 cm → AA = π·2.5²/4 = 4.9087 cm²; EOA 1.0 cm², BSA 1.8 m² →
  // ELCo = 4.9087/3.9087 = 1.25584 cm², ELI = 0.69769 cm²/m² (hand computation)
  const aa = evaluate(crossSectionalArea, { diameterCm: 2.5 }).outputs.areaCm2;
  const s = evaluate(energyLossIndex, { avaCm2: 1, aorticAreaCm2: aa, bsaM2: 1.8 });
  close(s.outputs.energyLossCoefficientCm2, 1.25584, 1e-5, "ELCo small aorta");
  close(s.outputs.energyLossIndex, 0.69769, 1e-5, "ELI small aorta");
  // pressure recovery shrinks as the aorta widens: ELCo → EOA as AA → ∞ (limit of the formula)
  const wide = evaluate(energyLossIndex, { avaCm2: 1, aorticAreaCm2: 20, bsaM2: 1.8 });
  assert.ok(wide.outputs.energyLossCoefficientCm2 > 1);
  assert.ok(wide.outputs.energyLossCoefficientCm2 < s.outputs.energyLossCoefficientCm2);
  close(wide.outputs.energyLossCoefficientCm2, 20 / 19, 1e-12, "wide aorta");
  // the published cut-off (Garcia 2000 abstract: ELI ≤ 0.52 cm²/m² best predicted death or valve
  // replacement) travels with the result as a caution, not as a grade
  assert.ok(r.cautions.some((c) => /0\.52 cm²\/m²/.test(c)));
  // an orifice as large as the aorta has no stenosis and no finite coefficient: refused
  assert.throws(
    () => evaluate(energyLossIndex, { avaCm2: 4, aorticAreaCm2: 4, bsaM2: 2 }),
    {
      name: "RangeError",
      message:
        "Energy loss index (aortic stenosis): expected 'avaCm2' (Effective orifice area) < 'aorticAreaCm2' (Aortic area at the sinotubular junction) (the valve orifice is smaller than the aorta above it), got avaCm2 = 4 cm², aorticAreaCm2 = 4 cm²",
    },
  );
});
