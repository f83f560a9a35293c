import assert from "node:assert/strict";
import {
  CARDIAC_OUTPUT,
  cardiacIndex,
  cardiacOutput,
  crossSectionalArea,
  evaluate,
  indexedToBsa,
  normal,
  propagate,
  pulmonarySystemicFlowRatio,
  strokeVolume,
} from "../../mod.ts";
import { close } from "./helpers.ts";

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
    message:
      /^Cross-sectional area from diameter: expected 'diameterCm' \(Flow-region diameter\) in \(0, 5\] cm, got 0$/,
  });
  // a VTI no flow region reaches (pulsed-wave, below about 3 m/s for under 0.5 s)
  assert.throws(() => evaluate(strokeVolume, { diameterCm: 2, vtiCm: 250 }), {
    name: "RangeError",
    message:
      /^Doppler stroke volume: expected 'vtiCm' \(Velocity-time integral\) in \(0, 200\] cm, got 250$/,
  });
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
    evaluate(cardiacIndex, { cardiacOutput: 5.04, bsaM2: 1.8 }).outputs.cardiacIndex,
    2.8,
    1e-12,
  );
  // the cardiac index is the indexing family's member for cardiac output: one division, once
  assert.equal(cardiacIndex, indexedToBsa(CARDIAC_OUTPUT));
  assert.throws(() => evaluate(cardiacOutput, { strokeVolumeMl: 70, heartRateBpm: 0 }), {
    name: "RangeError",
    message: /^Cardiac output: expected 'heartRateBpm' \(Heart rate\) in \(0, 300\] bpm, got 0$/,
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

Deno.test("Qp/Qs: both diameters squared into the ratio's uncertainty", () => {
  // JCGM 100 §5.1.6, eq. (12): Qp/Qs = d_R²·VTI_R/(d_L²·VTI_L), independent inputs:
  // u_r² = (2·0.1/2.5)² + (2·0.1/2.0)² + (1/20)² + (1/20)² = 0.0064 + 0.01 + 0.0025 + 0.0025
  // = 0.0214 → u_r = 0.146287 (hand computation)
  const r = propagate(pulmonarySystemicFlowRatio, {
    rvotDiameterCm: normal(2.5, 0.1),
    rvotVtiCm: normal(20, 1),
    lvotDiameterCm: normal(2.0, 0.1),
    lvotVtiCm: normal(20, 1),
  });
  const q = r.outputs.qpQs;
  close(q.standardUncertainty / q.value, Math.sqrt(0.0214), 1e-6, "u_r(Qp/Qs)");
});
