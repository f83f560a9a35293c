/**
 * Validation of a GUM result against a Monte Carlo result (JCGM 101:2008 §8): are the GUM
 * coverage interval's ends within the numerical tolerance of the Monte Carlo ones?
 *
 * @module
 */
import { numericalTolerance } from "./rounding.ts";
import type { MimeBundle } from "../core/types.ts";
import type { GumValidation, Propagation } from "./types.ts";

export type { GumValidation } from "./types.ts";
import { displayGumValidation } from "../../display/sensitivity.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";
import { labelWithUnit } from "../../display/uncertainty.ts";

/**
 * Validates a GUM result against a Monte Carlo result (JCGM 101:2008 §8.2): δ = ½·10^l from
 * u(y) at `significantDigits` digits; the GUM interval is validated when
 * d_low = |y − U_p − y_low| and d_high = |y + U_p − y_high| are both ≤ δ, with [y_low, y_high]
 * the probabilistically symmetric Monte Carlo interval.
 *
 * @example
 * ```ts
 * import { expressionModel, normal, propagate, validateGumWithMonteCarlo } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "a + b",
 *   inputs: { a: { unit: "1", description: "a", range: { min: -9, max: 9 } }, b: { unit: "1", description: "b", range: { min: -9, max: 9 } } },
 *   output: { name: "y", unit: "1", description: "y" },
 * });
 * const inputs = { a: normal(0, 1), b: normal(0, 1) };
 * const [v] = validateGumWithMonteCarlo(propagate(model, inputs),
 *   propagate(model, inputs, { method: "monteCarlo", seed: 2 }), 1);
 * assert.ok(v!.validated);
 * ```
 */
export function validateGumWithMonteCarlo(
  gumResult: Propagation,
  mcResult: Propagation,
  significantDigits = 2,
): GumValidation[] & { [JUPYTER_DISPLAY](): MimeBundle } {
  if (gumResult.method !== "gum" || mcResult.method !== "monteCarlo") {
    throw new TypeError(
      `GUM validation: expected a GUM result and a Monte Carlo result, got ${gumResult.method} and ${mcResult.method}`,
    );
  }
  if (mcResult.monteCarlo?.interval !== "symmetric") {
    throw new TypeError(
      `GUM validation: expected a Monte Carlo result with probabilistically symmetric intervals (JCGM 101 §8.2), got ${mcResult.monteCarlo?.interval} intervals`,
    );
  }
  if (Math.abs(gumResult.coverage - mcResult.coverage) > 1e-12) {
    throw new RangeError(
      `GUM validation: expected equal coverage probabilities, got ${gumResult.coverage} and ${mcResult.coverage}`,
    );
  }
  const checks = gumResult.outputNames.map((name): GumValidation => {
    const g = gumResult.outputs[name]!;
    const m = mcResult.outputs[name];
    if (!m) {
      throw new TypeError(
        `GUM validation: output '${name}' is missing from the Monte Carlo result`,
      );
    }
    const uForTolerance = g.standardUncertainty > 0 ? g.standardUncertainty : m.standardUncertainty;
    const tolerance = numericalTolerance(uForTolerance, significantDigits);
    const symmetric = m.interval;
    const lowDifference = Math.abs(g.interval.lower - symmetric.lower);
    const highDifference = Math.abs(g.interval.upper - symmetric.upper);
    const validated = lowDifference <= tolerance && highDifference <= tolerance;
    const verdict = validated
      ? `The GUM interval of ${g.label} is validated by Monte Carlo at ${significantDigits} significant digit(s): endpoint differences ${
        lowDifference.toPrecision(2)
      } and ${highDifference.toPrecision(2)} are within δ = ${tolerance}`
      : `The GUM interval of ${g.label} is NOT validated by Monte Carlo at ${significantDigits} significant digit(s): endpoint differences ${
        lowDifference.toPrecision(2)
      } and ${
        highDifference.toPrecision(2)
      } exceed δ = ${tolerance}; report the Monte Carlo interval`;
    // a fixed-size run's interval ends carry their own Monte Carlo noise: near δ the verdict can
    // change with the seed, unless the adaptive procedure stabilised them to δ (JCGM 101 §7.9)
    const fixed = mcResult.monteCarlo?.adaptive == null;
    const note = fixed
      ? " (from a fixed-size Monte Carlo run: near δ this verdict can change with the seed; propagate with adaptive: true for a stable one, JCGM 101 §7.9)"
      : "";
    return {
      output: name,
      tolerance,
      lowDifference,
      highDifference,
      validated,
      verdict: verdict + note,
      stable: !fixed,
    };
  });
  const labels = Object.fromEntries(
    gumResult.outputNames.map((n) => {
      const o = gumResult.outputs[n]!;
      return [n, labelWithUnit(o.label, o.unit)];
    }),
  );
  return Object.assign(checks, {
    [JUPYTER_DISPLAY]: () => displayGumValidation(checks, { labels }),
  });
}
