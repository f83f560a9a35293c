import assert from "node:assert/strict";
import {
  chain,
  continuityValveArea,
  defineCalculation,
  LV_END_DIASTOLIC_DIAMETER,
  lvGeometryMeasures,
  lvGeometryProbabilities,
  lvMassLinear,
  POSTERIOR_WALL_THICKNESS,
  propagate,
  SEPTAL_THICKNESS,
  sharedBoundaryInputs,
  sharedTracingInputs,
  simplifiedBernoulli,
  type TracedMeasurement,
} from "../../mod.ts";
import { close } from "./helpers.ts";

const LINE = Object.freeze({
  septalThicknessDiastoleCm: 1.2,
  lvInternalDiameterDiastoleCm: 5.0,
  posteriorWallThicknessDiastoleCm: 1.1,
  septumRightSideMm: 0.5,
  septumLeftSideMm: 0.3,
  posteriorEndocardiumMm: 0.4,
  posteriorEpicardiumMm: 0.6,
});
const [u1, u2, u3, u4] = [0.05, 0.03, 0.04, 0.06]; // cm

/** The sum of the three dimensions: the distance between the outer boundaries B₄ − B₁. */
const outerDistance = defineCalculation({
  id: "testOuterDistance",
  title: "IVS + LVID + PW",
  description: "Sum of the three linear dimensions (test only).",
  inputs: {
    septalThicknessDiastoleCm: SEPTAL_THICKNESS,
    lvInternalDiameterDiastoleCm: LV_END_DIASTOLIC_DIAMETER,
    posteriorWallThicknessDiastoleCm: POSTERIOR_WALL_THICKNESS,
  },
  outputs: { sumCm: { unit: "cm", description: "IVS + LVID + PW" } },
  formula: (x) => ({
    sumCm: x.septalThicknessDiastoleCm + x.lvInternalDiameterDiastoleCm +
      x.posteriorWallThicknessDiastoleCm,
  }),
  formulaText: "IVS + LVID + PW",
  citations: [{ authors: "test", year: 2026, title: "sum", publication: "tests" }],
  cautions: [],
});

Deno.test("shared boundaries: variances and covariances of the three dimensions", () => {
  const s = sharedBoundaryInputs(LINE);
  // IVS = B₂ − B₁, LVID = B₃ − B₂, PW = B₄ − B₃ (JCGM 100:2008 eq. (13), hand-checkable)
  close(s.covariance[0]![0]!, u1 ** 2 + u2 ** 2, 1e-15, "var IVS");
  close(s.covariance[1]![1]!, u2 ** 2 + u3 ** 2, 1e-15, "var LVID");
  close(s.covariance[2]![2]!, u3 ** 2 + u4 ** 2, 1e-15, "var PW");
  close(s.covariance[0]![1]!, -(u2 ** 2), 1e-15, "cov IVS LVID");
  close(s.covariance[1]![2]!, -(u3 ** 2), 1e-15, "cov LVID PW");
  assert.equal(s.covariance[0]![2], 0);
  assert.deepEqual(s.correlations.map((c) => [c[0], c[1]]), [
    ["septalThicknessDiastoleCm", "lvInternalDiameterDiastoleCm"],
    ["lvInternalDiameterDiastoleCm", "posteriorWallThicknessDiastoleCm"],
  ]);
  close(
    s.correlations[0]![2],
    -(u2 ** 2) / Math.sqrt((u1 ** 2 + u2 ** 2) * (u2 ** 2 + u3 ** 2)),
    1e-15,
    "r",
  );
  // the names are those of the linear LV calculations
  for (const name of Object.keys(s.inputs)) {
    assert.ok(lvMassLinear.inputNames.includes(name as never));
  }
});

Deno.test("shared boundaries: IVS + LVID + PW = B₄ − B₁, so its u is √(u₁² + u₄²) exactly", () => {
  const s = sharedBoundaryInputs(LINE);
  const r = propagate(outerDistance, s.inputs, { correlations: s.correlations });
  // the inner boundaries cancel (analytic; JCGM 100 eq. (13) with the covariances above)
  close(r.outputs.sumCm.standardUncertainty, Math.hypot(u1, u4), 1e-10, "u(sum)");
  const independent = propagate(outerDistance, s.inputs);
  close(
    independent.outputs.sumCm.standardUncertainty,
    Math.sqrt(u1 ** 2 + 2 * u2 ** 2 + 2 * u3 ** 2 + u4 ** 2),
    1e-10,
    "ignoring the sharing counts u₂ and u₃ twice",
  );
});

Deno.test("shared boundaries: LV mass and RWT by the GUM law with the covariances", () => {
  const s = sharedBoundaryInputs(LINE);
  const m = propagate(lvMassLinear, s.inputs, { correlations: s.correlations });
  // M = 0.832·(S³ − L³) + 0.6 (Lang 2015): ∂M/∂IVS = ∂M/∂PW = 2.496·S², ∂M/∂L = 2.496·(S² − L²)
  const S = 1.2 + 5.0 + 1.1, L = 5.0;
  const cw = 2.496 * S * S, cl = 2.496 * (S * S - L * L);
  const varM = cw ** 2 * (u1 ** 2 + u2 ** 2) + cl ** 2 * (u2 ** 2 + u3 ** 2) +
    cw ** 2 * (u3 ** 2 + u4 ** 2) - 2 * cw * cl * u2 ** 2 - 2 * cl * cw * u3 ** 2;
  close(m.outputs.lvMassG.standardUncertainty, Math.sqrt(varM), 1e-4, "u(M), eq. (13)");
  // RWT = 2·PW/L: ∂/∂PW = 2/L, ∂/∂L = −2·PW/L²; cov(PW, L) = −u₃² widens u(RWT)
  const g = propagate(lvGeometryMeasures, { ...s.inputs, bodySurfaceAreaM2: 1.9 }, {
    correlations: s.correlations,
  });
  const cp = 2 / L, cL = (-2 * 1.1) / L ** 2;
  const varR = cp ** 2 * (u3 ** 2 + u4 ** 2) + cL ** 2 * (u2 ** 2 + u3 ** 2) +
    2 * cp * cL * -(u3 ** 2);
  close(g.outputs.relativeWallThickness.standardUncertainty, Math.sqrt(varR), 1e-8, "u(RWT)");
  const uncorrelated = propagate(lvGeometryMeasures, { ...s.inputs, bodySurfaceAreaM2: 1.9 });
  assert.ok(
    g.outputs.relativeWallThickness.standardUncertainty >
      uncorrelated.outputs.relativeWallThickness.standardUncertainty,
  );
});

Deno.test("shared boundaries: the geometry class by Monte Carlo takes the correlations", () => {
  const s = sharedBoundaryInputs(LINE);
  const trials = 40_000;
  const p = lvGeometryProbabilities({ ...s.inputs, bodySurfaceAreaM2: 1.9 }, "male", {
    correlations: s.correlations,
    trials,
    seed: 2,
  });
  const total = Object.values(p.probabilities).reduce((a, b) => a + b, 0);
  close(total, 1, 1e-12, "probabilities sum to 1");
  // the drawn IVS and LVID carry the declared correlation (JCGM 101 §6.4.8 correlated normals);
  // the standard error of a sample correlation near −0.5 is about (1 − r²)/√M = 0.004
  const a = p.measures.inputs.septalThicknessDiastoleCm.samples!;
  const b = p.measures.inputs.lvInternalDiameterDiastoleCm.samples!;
  const mean = (x: Float64Array) => x.reduce((t, v) => t + v, 0) / x.length;
  const ma = mean(a), mb = mean(b);
  let sab = 0, saa = 0, sbb = 0;
  for (let k = 0; k < a.length; k++) {
    sab += (a[k]! - ma) * (b[k]! - mb);
    saa += (a[k]! - ma) ** 2;
    sbb += (b[k]! - mb) ** 2;
  }
  close(sab / Math.sqrt(saa * sbb), s.correlations[0]![2], 0.02, "sample correlation");
});

Deno.test("shared tracing: one common relative error plus independent parts", () => {
  const calc = chain([simplifiedBernoulli, continuityValveArea]);
  const t = sharedTracingInputs(calc, {
    commonPercent: 3,
    measurements: {
      peakVelocity: { value: 4.2, independentPercent: 2 },
      avVtiCm: { value: 100, independentPercent: 3 },
    },
  });
  // u_r = √(u_c² + u_i²): √13 % and √18 %; r = u_c²/√((u_c² + u_i²)(u_c² + u_j²)) = 9/√234
  close(Number(t.inputs.peakVelocity!.standardUncertainty), 0.042 * Math.sqrt(13), 1e-12, "u(v)");
  close(Number(t.inputs.avVtiCm!.standardUncertainty), Math.sqrt(18), 1e-12, "u(VTI)");
  close(t.correlations[0]![2], 9 / Math.sqrt(13 * 18), 1e-15, "r");
  // a higher tracing raises the gradient and lowers the area: their outputs are anticorrelated
  const r = propagate(calc, { ...t.inputs, lvotDiameterCm: 2, lvotVtiCm: 20 }, {
    correlations: t.correlations,
  });
  const i = r.outputNames.indexOf("gradient"), j = r.outputNames.indexOf("avaCm2");
  assert.ok(r.correlation[i]![j]! < 0);
  // a gradient follows v², so its common part is 2·u_c: r = 2·9/√((36 + 4)(9 + 9))
  const two = sharedTracingInputs(continuityValveArea, {
    commonPercent: 3,
    measurements: {
      lvotVtiCm: { value: 20, independentPercent: 3 },
      avVtiCm: { value: 100, independentPercent: 2, power: 2 },
    },
  });
  close(two.correlations[0]![2], 18 / Math.sqrt(18 * 40), 1e-15, "r with k = 2");
});

Deno.test("shared boundaries and tracing: bad arguments name the field, the value and the range", () => {
  assert.throws(() => sharedBoundaryInputs({ ...LINE, septumRightSideMm: -1 }), {
    name: "RangeError",
    message:
      "Shared boundaries: expected 'septumRightSideMm' (Septum, right-ventricular side (u₁)) in [0, 20] mm, got -1",
  });
  assert.throws(
    () =>
      sharedTracingInputs(simplifiedBernoulli, {
        commonPercent: 3,
        measurements: { peakVelocity: { value: 4, independentPercent: 2 } },
      }),
    {
      name: "TypeError",
      message:
        "Shared tracing: expected 'measurements' at least 2 measurements traced on one envelope, got 1 measurement",
    },
  );
  const jetVti = { value: 90, independentPercent: 2 };
  const traced = (commonPercent: number, measurements: Record<string, TracedMeasurement>) => () =>
    sharedTracingInputs(continuityValveArea, { commonPercent, measurements });
  assert.throws(traced(3, { avVtiCm: jetVti, vmax: { value: 4, independentPercent: 2 } }), {
    name: "TypeError",
    message:
      "Shared tracing: unknown input 'vmax': expected one of lvotDiameterCm, lvotVtiCm, avVtiCm, got an input of no such name in 'continuityValveArea'",
  });
  const lvot = { value: 20, independentPercent: 2 };
  assert.throws(traced(3, { avVtiCm: { ...jetVti, power: 3 as never }, lvotVtiCm: lvot }), {
    name: "RangeError",
    message: `Shared tracing: expected 'avVtiCm.power' one of "1", "2", got 3`,
  });
  assert.throws(traced(120, { avVtiCm: jetVti, lvotVtiCm: lvot }), {
    name: "RangeError",
    message:
      "Shared tracing: expected 'commonPercent' (Relative standard uncertainty) in [0, 100) %, got 120",
  });
});
