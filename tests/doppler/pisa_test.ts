import assert from "node:assert/strict";
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import {
  correlation,
  effectiveRegurgitantOrificeArea,
  evaluate,
  gradeSeverity,
  MITRAL_REGURGITATION_2017,
  normal,
  pisaFlowRate,
  pisaFlowRateAliasingCorrected,
  pisaMitralValveArea,
  pisaRegurgitation,
  propagate,
  regurgitantFraction,
  regurgitantFractionPisa,
  regurgitantVolume,
  volumetricRegurgitation,
} from "../../mod.ts";
import { close } from "./helpers.ts";

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
    {
      name: "RangeError",
      message:
        /^PISA regurgitant flow rate: expected 'radiusCm' \(PISA radius\) in \(0, 3\] cm, got 0$/,
    },
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

Deno.test("inconsistent volumes are refused, naming both", () => {
  // Zoghbi 2017: the regurgitant volume is part of the total stroke volume, so RF ≤ 100 %
  assert.throws(
    () => evaluate(regurgitantFraction, { regurgitantVolumeMl: 95, totalStrokeVolumeMl: 90 }),
    {
      name: "RangeError",
      message:
        "Regurgitant fraction: expected 'regurgitantVolumeMl' (Regurgitant volume) ≤ 'totalStrokeVolumeMl' (Total stroke volume), got regurgitantVolumeMl = 95 mL, totalStrokeVolumeMl = 90 mL",
    },
  );
  // a competent-valve stroke volume above the regurgitant-valve one would give a negative volume
  assert.throws(
    () =>
      evaluate(volumetricRegurgitation, { totalStrokeVolumeMl: 70, forwardStrokeVolumeMl: 120 }),
    {
      name: "RangeError",
      message:
        "Regurgitant volume and fraction (volumetric): expected 'forwardStrokeVolumeMl' (Forward stroke volume) ≤ 'totalStrokeVolumeMl' (Total stroke volume), got forwardStrokeVolumeMl = 120 mL, totalStrokeVolumeMl = 70 mL",
    },
  );
  // issue 13: a regurgitant volume of 150 mL with a stroke volume of 60 mL would be RF 250 %
  assert.throws(
    () => evaluate(regurgitantFraction, { regurgitantVolumeMl: 150, totalStrokeVolumeMl: 60 }),
    {
      name: "RangeError",
      message:
        "Regurgitant fraction: expected 'regurgitantVolumeMl' (Regurgitant volume) ≤ 'totalStrokeVolumeMl' (Total stroke volume), got regurgitantVolumeMl = 150 mL, totalStrokeVolumeMl = 60 mL",
    },
  );
  // issue 13: total 60 mL < forward 100 mL would be RVol −40 mL and RF −67 %
  assert.throws(
    () =>
      evaluate(volumetricRegurgitation, { totalStrokeVolumeMl: 60, forwardStrokeVolumeMl: 100 }),
    {
      name: "RangeError",
      message:
        "Regurgitant volume and fraction (volumetric): expected 'forwardStrokeVolumeMl' (Forward stroke volume) ≤ 'totalStrokeVolumeMl' (Total stroke volume), got forwardStrokeVolumeMl = 100 mL, totalStrokeVolumeMl = 60 mL",
    },
  );
  assert.throws(
    () => evaluate(regurgitantFraction, { regurgitantVolumeMl: 10, totalStrokeVolumeMl: 0 }),
    {
      name: "RangeError",
      message:
        /^Regurgitant fraction: expected 'totalStrokeVolumeMl' \(Total stroke volume\) in \(0, 1000\] mL, got 0$/,
    },
  );
});

/** The hand-written composite that the chain replaced (before the redesign), for comparison. */
function oldPisaComposite(x: {
  radiusCm: number;
  aliasingVelocityCmPerS: number;
  wallAngleDeg: number;
  regurgitantPeakVelocity: number;
  regurgitantVtiCm: number;
}) {
  const { flowRateMlPerS } = pisaFlowRate.formula(x);
  const { eroaCm2 } = effectiveRegurgitantOrificeArea.formula({
    flowRateMlPerS,
    regurgitantPeakVelocity: x.regurgitantPeakVelocity,
  });
  const { regurgitantVolumeMl } = regurgitantVolume.formula({
    eroaCm2,
    regurgitantVtiCm: x.regurgitantVtiCm,
  });
  return { flowRateMlPerS, eroaCm2, regurgitantVolumeMl };
}

Deno.test("PISA chain equals the old composite and keeps its public keys", () => {
  // Regression against the composite it replaced; each point hand-checkable from Zoghbi 2017
  // (Q = 2πr²·Va·α/180, EROA = Q/Vmax, RVol = EROA·VTI)
  assert.deepEqual(pisaRegurgitation.inputNames, [
    "radiusCm",
    "aliasingVelocityCmPerS",
    "wallAngleDeg",
    "regurgitantPeakVelocity",
    "regurgitantVtiCm",
  ]);
  assert.deepEqual(pisaRegurgitation.outputNames, [
    "flowRateMlPerS",
    "eroaCm2",
    "regurgitantVolumeMl",
  ]);
  assert.equal(pisaRegurgitation.id, "pisaRegurgitation");
  assert.equal(pisaRegurgitation.title, "PISA regurgitation (flow, EROA, volume)");
  assert.equal(pisaRegurgitation.inputs.wallAngleDeg.default, 180);
  for (
    const x of [
      {
        radiusCm: 1,
        aliasingVelocityCmPerS: 40,
        wallAngleDeg: 180,
        regurgitantPeakVelocity: 5,
        regurgitantVtiCm: 150,
      },
      {
        radiusCm: 0.6,
        aliasingVelocityCmPerS: 32,
        wallAngleDeg: 120,
        regurgitantPeakVelocity: 4.6,
        regurgitantVtiCm: 120,
      },
      {
        radiusCm: 0.35,
        aliasingVelocityCmPerS: 55,
        wallAngleDeg: 200,
        regurgitantPeakVelocity: 3.9,
        regurgitantVtiCm: 95,
      },
    ]
  ) {
    const chained = evaluate(pisaRegurgitation, x).outputs;
    const old = oldPisaComposite(x);
    for (const k of ["flowRateMlPerS", "eroaCm2", "regurgitantVolumeMl"] as const) {
      close(chained[k], old[k], 1e-12 * old[k], k);
    }
  }
  // 2π·0.6²·32·(120/180) = 48.255 mL/s (hand computation)
  close(
    evaluate(pisaRegurgitation, {
      radiusCm: 0.6,
      aliasingVelocityCmPerS: 32,
      wallAngleDeg: 120,
      regurgitantPeakVelocity: 4.6,
      regurgitantVtiCm: 120,
    }).outputs.flowRateMlPerS,
    48.2549,
    1e-4,
  );
});

const PISA_INPUTS = {
  radiusCm: normal(0.9, 0.05),
  aliasingVelocityCmPerS: normal(40, 2),
  wallAngleDeg: 180,
  regurgitantPeakVelocity: normal(5, 0.2),
  regurgitantVtiCm: normal(150, 10),
};

Deno.test("PISA chain: GUM uncertainty matches the relative law, with correlated outputs", () => {
  const r = propagate(pisaRegurgitation, PISA_INPUTS);
  // JCGM 100:2008 §5.1.6, eq. (12) for a product of powers of independent inputs:
  // u_r(RVol)² = (2·0.05/0.9)² + (2/40)² + (0.2/5)² + (10/150)²
  //            = 0.0123457 + 0.0025 + 0.0016 + 0.0044444 = 0.0208901 (hand computation)
  const radius = (2 * 0.05 / 0.9) ** 2, others = (2 / 40) ** 2 + (0.2 / 5) ** 2;
  const vti = (10 / 150) ** 2;
  const rvol = r.outputs.regurgitantVolumeMl;
  close(rvol.standardUncertainty / rvol.value, Math.sqrt(0.0208901), 1e-6, "u_r(RVol)");
  close(rvol.standardUncertainty / rvol.value, Math.sqrt(radius + others + vti), 1e-9, "exact");
  // u_r(EROA)² = 0.0123457 + 0.0025 + 0.0016 = 0.0164457 (the same law, without the VTI)
  const eroa = r.outputs.eroaCm2;
  close(eroa.standardUncertainty / eroa.value, Math.sqrt(0.0164457), 1e-6, "u_r(EROA)");
  // RVol = EROA·VTI with VTI independent: r(EROA, RVol) = u_r(EROA)/u_r(RVol) = 0.88727
  // (JCGM 100 eq. (F.2) on the shared sources; hand computation)
  close(correlation(eroa, rvol), 0.88727, 1e-5, "r(EROA, RVol)");
  close(
    correlation(eroa, rvol),
    Math.sqrt((radius + others) / (radius + others + vti)),
    1e-9,
    "r(EROA, RVol) exact",
  );
  // the radius, squared in the first step, is the largest share of u²(RVol): 0.0123457/0.0208901
  const share = rvol.budget.find((b) => b.source === "radiusCm")!.share;
  close(share, radius / (radius + others + vti), 1e-9, "radius share");
  close(share, 0.59098, 1e-5, "radius share (hand computation)");
});

Deno.test("PISA chain: one chain equals three propagations fed by each other", () => {
  // The same analysis step by step (each uncertain result fed to the next) must give the
  // chain's value, u and budget: GUM results carry their sensitivities to the input sources
  // (JCGM 100 §5.1: the law applied to the composed function)
  const whole = propagate(pisaRegurgitation, PISA_INPUTS).outputs.regurgitantVolumeMl;
  const q = propagate(pisaFlowRate, {
    radiusCm: PISA_INPUTS.radiusCm,
    aliasingVelocityCmPerS: PISA_INPUTS.aliasingVelocityCmPerS,
    wallAngleDeg: 180,
  }).outputs.flowRateMlPerS;
  const e = propagate(effectiveRegurgitantOrificeArea, {
    flowRateMlPerS: q,
    regurgitantPeakVelocity: PISA_INPUTS.regurgitantPeakVelocity,
  }).outputs.eroaCm2;
  const stepwise = propagate(regurgitantVolume, {
    eroaCm2: e,
    regurgitantVtiCm: PISA_INPUTS.regurgitantVtiCm,
  }).outputs.regurgitantVolumeMl;
  close(stepwise.value, whole.value, 1e-12 * whole.value, "value");
  close(stepwise.standardUncertainty, whole.standardUncertainty, 1e-9 * whole.value, "u");
  const budget = (v: typeof whole) =>
    Object.fromEntries(v.budget.map((b) => [b.source, b.contribution]));
  const a = budget(whole), b = budget(stepwise);
  assert.deepEqual(Object.keys(b).sort(), Object.keys(a).sort());
  for (const k of Object.keys(a)) close(b[k]!, a[k]!, 1e-9 * whole.value, `budget ${k}`);
});

Deno.test("PISA radius uncertainty is squared into EROA and graded", () => {
  // JCGM 100 §5.1.6: r = 1.0 ± 0.05 cm (5 %) → u_r(EROA) = 2·5 % = 10 % (other inputs exact)
  const inputs = {
    radiusCm: normal(1.0, 0.05),
    aliasingVelocityCmPerS: 40,
    wallAngleDeg: 180,
    regurgitantPeakVelocity: 5,
    regurgitantVtiCm: 150,
  };
  const g = propagate(pisaRegurgitation, inputs);
  close(g.outputs.eroaCm2.standardUncertainty / g.outputs.eroaCm2.value, 0.1, 1e-6);
  // Monte Carlo: P(EROA ≥ 0.40) = P(r ≥ √(0.40·500/(2π·40))) = P(r ≥ 0.89206) = Φ(2.1588) ≈ 0.9846
  const m = propagate(pisaRegurgitation, inputs, {
    method: "monteCarlo",
    trials: 100_000,
    seed: 5,
  });
  const pSevere = gradeSeverity(
    MITRAL_REGURGITATION_2017.eroa,
    m.outputs.eroaCm2,
  ).probabilities.find((x) => x.grade === "severe")!.probability;
  const rStar = Math.sqrt((0.4 * 500) / (2 * Math.PI * 40));
  close(pSevere, 1 - normalCdf(rStar, 1.0, 0.05), 0.003, "P(severe MR)");
});

Deno.test("PISA flow rate with the aliasing-velocity correction Q·Vmax/(Vmax − Va)", () => {
  // Hand computation of the published correction (Zoghbi 2017, PISA for tricuspid regurgitation,
  // from memory): r = 1 cm, Va = 40 cm/s, α = 180° → 2π·1²·40 = 80π mL/s; a low-velocity jet
  // of 2 m/s gives the factor 200/(200 − 40) = 1.25 → 100π = 314.16 mL/s
  const tr = evaluate(pisaFlowRateAliasingCorrected, {
    radiusCm: 1,
    aliasingVelocityCmPerS: 40,
    regurgitantPeakVelocity: 2,
  });
  close(tr.outputs.flowRateMlPerS, 100 * Math.PI, 1e-9, "TR flow");
  // a 5 m/s mitral jet: factor 500/460 = 1.08696, so Va/Vmax = 8 % changes the flow by 8.7 %
  const mr = evaluate(pisaFlowRateAliasingCorrected, {
    radiusCm: 1,
    aliasingVelocityCmPerS: 40,
    regurgitantPeakVelocity: 5,
  });
  close(mr.outputs.flowRateMlPerS, 80 * Math.PI * 500 / 460, 1e-9, "MR flow");
  // the uncorrected flow is the same formula without the factor (one formula, written once)
  const plain = evaluate(pisaFlowRate, { radiusCm: 1, aliasingVelocityCmPerS: 40 });
  close(mr.outputs.flowRateMlPerS / plain.outputs.flowRateMlPerS, 500 / 460, 1e-12, "factor");
  // the wall angle applies as in the uncorrected method (α/180, Pu 1995): 120° → 2/3
  const funnel = evaluate(pisaFlowRateAliasingCorrected, {
    radiusCm: 1,
    aliasingVelocityCmPerS: 40,
    wallAngleDeg: 120,
    regurgitantPeakVelocity: 2,
  });
  close(funnel.outputs.flowRateMlPerS, 100 * Math.PI * 2 / 3, 1e-9, "funnel");
  // an aliasing velocity at or above the jet velocity has no meaning (flow accelerates toward
  // the orifice, so Va < Vmax): refused, naming both
  assert.throws(
    () =>
      evaluate(pisaFlowRateAliasingCorrected, {
        radiusCm: 1,
        aliasingVelocityCmPerS: 150,
        regurgitantPeakVelocity: 1.5,
      }),
    {
      name: "RangeError",
      message:
        "PISA flow rate corrected for the aliasing velocity: expected 'aliasingVelocityCmPerS' (Aliasing velocity) < 'regurgitantPeakVelocity' (Regurgitant jet peak velocity) (compared in the same unit: the flow accelerates toward the orifice), got aliasingVelocityCmPerS = 150 cm/s, regurgitantPeakVelocity = 1.5 m/s",
    },
  );
  // the source of the correction is cited from memory, and the result says so
  assert.ok(tr.cautions.some((c) => /Zoghbi 2017.*from memory/.test(c)), tr.cautions.join("; "));
});

Deno.test("mitral valve area by PISA: 2πr²·Va/Vpeak·α/180", () => {
  // Hand computation of the published formula (Rodriguez 1993; Baumgartner 2009, from memory):
  // r = 1 cm, Va = 40 cm/s, Vpeak = 1.6 m/s, α = 120° → 2π·1·40/160·(120/180) = π/3 cm²
  const r = evaluate(pisaMitralValveArea, {
    radiusCm: 1,
    aliasingVelocityCmPerS: 40,
    wallAngleDeg: 120,
    mitralPeakVelocity: 1.6,
  });
  close(r.outputs.mvaCm2, Math.PI / 3, 1e-12, "MVA");
  // r = 0.8 cm, Va = 35 cm/s, Vpeak = 2.2 m/s, α = 100° → 2π·0.64·35/220·(100/180) = 0.35542 cm²
  const small = evaluate(pisaMitralValveArea, {
    radiusCm: 0.8,
    aliasingVelocityCmPerS: 35,
    wallAngleDeg: 100,
    mitralPeakVelocity: 2.2,
  });
  close(small.outputs.mvaCm2, 0.35542, 1e-5, "small MVA");
  // the funnel angle is measured, never assumed: no default
  assert.throws(
    () =>
      evaluate(pisaMitralValveArea, {
        radiusCm: 1,
        aliasingVelocityCmPerS: 40,
        mitralPeakVelocity: 1.6,
      } as never),
    {
      name: "TypeError",
      message:
        "Mitral valve area by PISA: missing input 'wallAngleDeg' (Funnel angle of the mitral leaflets): expected a value in (0, 360]°, got nothing",
    },
  );
  assert.throws(
    () =>
      evaluate(pisaMitralValveArea, {
        radiusCm: 1,
        aliasingVelocityCmPerS: 200,
        wallAngleDeg: 120,
        mitralPeakVelocity: 1.6,
      }),
    {
      name: "RangeError",
      message:
        "Mitral valve area by PISA: expected 'aliasingVelocityCmPerS' (Aliasing velocity) < 'mitralPeakVelocity' (Peak transmitral velocity) (compared in the same unit: the flow accelerates toward the orifice), got aliasingVelocityCmPerS = 200 cm/s, mitralPeakVelocity = 1.6 m/s",
    },
  );
  assert.ok(r.cautions.some((c) => /Rodriguez 1993.*from memory/.test(c)), r.cautions.join("; "));
});
