/**
 * Benchmarks of the uncertainty engine: Monte Carlo time per trial on a 4-input continuity model
 * with an uncertain insonation angle (10⁶ trials, 95 % intervals), and GUM propagation of a
 * 10-input model. Run with `deno task bench`.
 */
import {
  angleCorrectedVelocity,
  continuityValveArea,
  defineCalculation,
  gum,
  monteCarlo,
  normal,
  rectangular,
} from "../mod.ts";

/** Continuity area (VTI form) with the jet VTI corrected for the CW beam angle, composed from the
 * library's own definitions (no formula restated). */
const continuityWithJetAngle = defineCalculation({
  id: "benchContinuityWithJetAngle",
  title: "Continuity valve area with jet angle (benchmark)",
  description: "continuity VTI form with the aortic VTI corrected for the beam angle",
  inputs: {
    lvotDiameterCm: continuityValveArea.inputs.lvotDiameterCm,
    lvotVtiCm: continuityValveArea.inputs.lvotVtiCm,
    avVtiCm: continuityValveArea.inputs.avVtiCm,
    avAngleDeg: { unit: "deg", description: "beam angle", range: { min: -89, max: 89 } },
  },
  outputs: { avaCm2: continuityValveArea.outputs.avaCm2 },
  formula: ({ lvotDiameterCm, lvotVtiCm, avVtiCm, avAngleDeg }) =>
    continuityValveArea.formula({
      lvotDiameterCm,
      lvotVtiCm,
      avVtiCm: angleCorrectedVelocity.formula({ measuredVelocity: avVtiCm, angleDeg: avAngleDeg })
        .trueVelocity,
    }),
  formulaText: "AVA = π·d²/4 · VTI_LVOT / (VTI_AV / cos θ)",
  sources: continuityValveArea.sources,
  cautions: [],
});

const continuityInputs = {
  lvotDiameterCm: normal(2.1, 0.08),
  lvotVtiCm: normal(21, 1.5),
  avVtiCm: normal(95, 4),
  avAngleDeg: rectangular(-15, 15),
};

Deno.bench({
  name:
    "Monte Carlo, continuity area with jet angle, 10^6 trials (divide by 10^6 for time per trial)",
  group: "monte-carlo",
  n: 5,
  fn() {
    monteCarlo(continuityWithJetAngle, continuityInputs, { trials: 1_000_000, seed: 1 });
  },
});

const names = ["a", "b", "c", "d", "e", "f", "g", "h", "i", "j"] as const;
const tenInputs = defineCalculation({
  id: "benchTenInputs",
  title: "Ten-input model (benchmark)",
  description: "a smooth nonlinear model of ten inputs",
  inputs: Object.fromEntries(
    names.map((n) => [n, { unit: "1", description: n, range: { min: -1e3, max: 1e3 } }]),
  ) as Record<
    (typeof names)[number],
    { unit: string; description: string; range: { min: number; max: number } }
  >,
  outputs: { y: { unit: "1", description: "y" } },
  formula: (x) => ({
    y: x.a * x.b + x.c / x.d + Math.sqrt(x.e * x.e + x.f * x.f) + x.g * Math.cos(x.h / 10) +
      x.i ** 2 - x.j,
  }),
  formulaText: "y = ab + c/d + √(e² + f²) + g·cos(h/10) + i² − j",
  sources: [{ authors: "benchmark", year: 2026, title: "synthetic model", publication: "bench" }],
  cautions: [],
});
const tenUncertain = Object.fromEntries(names.map((n, i) => [n, normal(1 + i, 0.01 * (1 + i))]));

Deno.bench({
  name: "GUM propagation, 10-input model (time per call)",
  group: "gum",
  fn() {
    gum(tenInputs, tenUncertain);
  },
});
