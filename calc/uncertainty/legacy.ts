/**
 * Transitional aliases while callers move to {@linkcode propagate}: they return the one result
 * shape. To be removed.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { propagate, type PropagateOptions } from "./propagate.ts";
import type { UncertainInputs } from "./prepare.ts";
import type { AdaptiveOptions } from "./adaptive.ts";
import type { Propagation } from "./types.ts";

/** @deprecated use propagate(calc, inputs, { method: "gum" }) */
export function gum<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: Omit<PropagateOptions, "method"> = {},
): Propagation<I, O> {
  return propagate(calc, inputs, { ...options, method: "gum" });
}

/** @deprecated use propagate(calc, inputs, { method: "monteCarlo" }) */
export function monteCarlo<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: Omit<PropagateOptions, "method"> = {},
): Propagation<I, O> {
  return propagate(calc, inputs, { ...options, method: "monteCarlo" });
}

/** @deprecated use propagate(calc, inputs, { method: "monteCarlo", adaptive: {…} }) */
export function monteCarloAdaptive<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: Omit<PropagateOptions, "method" | "adaptive"> & AdaptiveOptions = {},
): Propagation<I, O> {
  const { significantDigits, maxTrials, ...rest } = options;
  return propagate(calc, inputs, {
    ...rest,
    method: "monteCarlo",
    adaptive: {
      ...(significantDigits !== undefined ? { significantDigits } : {}),
      ...(maxTrials !== undefined ? { maxTrials } : {}),
    },
  });
}

/** @deprecated the one result shape is {@linkcode Propagation} */
export type GumResult<O extends string = string> = Propagation<string, O>;
/** @deprecated the one result shape is {@linkcode Propagation} */
export type MonteCarloResult<O extends string = string> = Propagation<string, O>;
