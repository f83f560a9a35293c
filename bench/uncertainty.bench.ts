/**
 * Benchmarks of the uncertainty engine: Monte Carlo time per trial on a 4-input continuity model
 * with an uncertain insonation angle (10⁶ trials, 95 % intervals), the adaptive procedure on the
 * same model, and GUM propagation of a 10-input model. Run with `deno task bench`.
 */
import { propagate } from "../mod.ts";
import { continuityInputs, continuityWithJetAngle, tenInputModel, tenUncertain } from "./models.ts";

Deno.bench({
  name: "Monte Carlo, continuity area with jet angle, 10^6 trials (time/iter ÷ 10^6 = per trial)",
  group: "monte-carlo",
  n: 5,
  fn() {
    propagate(continuityWithJetAngle, continuityInputs, {
      method: "monteCarlo",
      trials: 1_000_000,
      seed: 1,
    });
  },
});

Deno.bench({
  name: "Adaptive Monte Carlo (JCGM 101 §7.9), same model, 2 significant digits",
  group: "monte-carlo",
  n: 5,
  fn() {
    propagate(continuityWithJetAngle, continuityInputs, {
      method: "monteCarlo",
      adaptive: { significantDigits: 2 },
      seed: 1,
    });
  },
});

Deno.bench({
  name: "GUM propagation, 10-input model (time per call)",
  group: "gum",
  fn() {
    propagate(tenInputModel, tenUncertain);
  },
});
