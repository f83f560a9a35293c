/**
 * Matching uncertain inputs to a calculation: shared by the GUM law and Monte Carlo.
 *
 * @module
 */
import type { Calculation, InputValues } from "../core/types.ts";
import { checkConstraints, formatRange, inRange, typicalRangeFlag } from "../core/define.ts";
import { describe } from "../core/units.ts";
import { type InputEstimate, type ResolvedInput, resolveInput } from "./inputs.ts";
import { correlationMatrix, type Correlations } from "./correlation.ts";

/** Uncertain inputs of a calculation, by name; omitted inputs take their default as exact. */
export type UncertainInputs<I extends string> = { readonly [K in I]?: InputEstimate };

/** Inputs matched to a calculation. */
export interface PreparedInputs<I extends string> {
  /** Resolved inputs in the calculation's input order. */
  readonly inputs: readonly ResolvedInput[];
  /** Estimates by name (canonical units). */
  readonly estimates: InputValues<I>;
  /** Correlation matrix in input order. */
  readonly correlation: number[][];
  /** True when any off-diagonal correlation is non-zero. */
  readonly correlated: boolean;
  /** Estimates outside their validated range. */
  readonly flags: string[];
}

/**
 * Resolves and checks the uncertain inputs of a calculation.
 *
 * @throws {TypeError} For unknown or missing inputs, wrong units or shapes.
 * @throws {RangeError} For an estimate outside its valid range or a bad uncertainty/correlation.
 */
export function prepareInputs<I extends string>(
  calc: Calculation<I, string>,
  given: UncertainInputs<I>,
  correlations: Correlations | undefined,
): PreparedInputs<I> {
  if (typeof given !== "object" || given === null) {
    throw new TypeError(
      `${calc.title}: expected an object of uncertain inputs, got ${describe(given)}`,
    );
  }
  for (const key of Object.keys(given)) {
    if (!(calc.inputNames as readonly string[]).includes(key)) {
      throw new TypeError(
        `${calc.title}: unknown input '${key}'; expected one of ${calc.inputNames.join(", ")}`,
      );
    }
  }
  const flags: string[] = [];
  const estimates = {} as Record<I, number>;
  const inputs = calc.inputNames.map((name) => {
    const def = calc.inputs[name];
    let g = given[name];
    if (g === undefined) {
      if (def.default === undefined) {
        throw new TypeError(
          `${calc.title}: missing input '${name}' (${def.description}, ${def.unit})`,
        );
      }
      g = def.default;
    }
    const r = resolveInput(name, def.unit, g, calc.title);
    if (!inRange(r.estimate, def.range)) {
      throw new RangeError(
        `${calc.title}: expected '${name}' in ${
          formatRange(def.range, def.unit)
        }, got ${r.estimate}`,
      );
    }
    if (def.typical && !inRange(r.estimate, def.typical)) {
      flags.push(typicalRangeFlag(name, r.estimate, def));
    }
    estimates[name] = r.estimate;
    return r;
  });
  checkConstraints(calc, estimates as InputValues<I>);
  const correlation = correlationMatrix(calc.inputNames, correlations, calc.title);
  const correlated = correlation.some((row, i) => row.some((v, j) => i !== j && v !== 0));
  return { inputs, estimates, correlation, correlated, flags };
}
