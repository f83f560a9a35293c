/**
 * Validated evaluation of a calculation on exact inputs: every input checked by the one
 * validator, the formula run once, every output checked against its quantity's valid range.
 *
 * @module
 */
import type {
  Calculation,
  Evaluation,
  InputValues,
  OutputValues,
  Population,
  ValidationIssue,
} from "./types.ts";
import type { QuantityInput } from "./units.ts";
import { cautionsOf } from "./calculation.ts";
import { formatRange, inRange } from "./range.ts";
import { withUnit } from "./text.ts";
import { throwIfErrors } from "./issues.ts";
import { validateInputs } from "./validate.ts";
import { displayEvaluation, JUPYTER_DISPLAY } from "../../display/results.ts";

/** Inputs as a caller may give them: numbers in the canonical unit or quantity strings. */
export type InputArguments<I extends string> = { readonly [K in I]?: QuantityInput };

/** Options of {@linkcode evaluate}. */
export interface EvaluateOptions {
  /** Which typical ranges flag the inputs. @default "adult" */
  readonly population?: Population;
}

/**
 * Checks formula outputs against their quantities: each must be finite and inside the valid
 * range (a negative volume, a fraction above 100 %, a negative gradient are impossible numbers).
 *
 * @param calc The calculation.
 * @param inputs The inputs that produced the outputs (named in the issue).
 * @param outputs The formula's outputs.
 * @returns One "output" issue per impossible output.
 *
 * @example
 * ```ts
 * import { checkOutputs, regurgitantFraction, renderIssue } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const x = { regurgitantVolumeMl: 150, totalStrokeVolumeMl: 60 };
 * const issues = checkOutputs(regurgitantFraction, x, regurgitantFraction.formula(x));
 * assert.equal(issues.length, 1);
 * ```
 */
export function checkOutputs<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: InputValues<I>,
  outputs: OutputValues<O>,
): ValidationIssue[] {
  const issues: ValidationIssue[] = [];
  for (const name of calc.outputNames) {
    const def = calc.outputs[name];
    const v = outputs[name];
    const ok = typeof v === "number" && Number.isFinite(v) && inRange(v, def.quantity.valid);
    if (ok) continue;
    const shown = calc.inputNames.map((n) =>
      `${n} = ${withUnit(String(inputs[n]), calc.inputs[n].unit)}`
    ).join(", ");
    issues.push({
      kind: "output",
      severity: "error",
      where: calc.title,
      field: name,
      label: def.label,
      received: `${v} from ${shown}`,
      ...(typeof v === "number" ? { value: v } : {}),
      unit: def.unit,
      range: def.quantity.valid,
      expected: Number.isFinite(v)
        ? `in ${formatRange(def.quantity.valid, def.unit)}`
        : "a finite number",
    });
  }
  return issues;
}

/**
 * Evaluates a calculation on validated inputs.
 *
 * @param calc The calculation.
 * @param args Inputs as numbers in canonical units or quantity strings ("21 mm").
 * @param options Population whose typical ranges flag the inputs.
 * @returns Outputs with flags and cautions; it displays itself in a notebook.
 * @throws {TypeError} For unknown, missing or mistyped inputs or wrong units.
 * @throws {RangeError} For inputs outside their valid range, a broken relation between inputs,
 * or an output that is not finite or outside its quantity's valid range.
 *
 * @example
 * ```ts
 * import { continuityValveArea, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // π·(2/2)²·20/80 = 0.785 cm² (hand-checkable); "20 mm" is converted to cm
 * const r = evaluate(continuityValveArea, { lvotDiameterCm: "20 mm", lvotVtiCm: 20, avVtiCm: 80 });
 * assert.ok(Math.abs(r.outputs.avaCm2 - Math.PI / 4) < 1e-12);
 * assert.throws(() => evaluate(continuityValveArea, { lvotDiameterCm: 0, lvotVtiCm: 20, avVtiCm: 80 }), RangeError);
 * ```
 */
export function evaluate<I extends string, O extends string>(
  calc: Calculation<I, O>,
  args: InputArguments<I>,
  options: EvaluateOptions = {},
): Evaluation<I, O> {
  const { values, flags, issues } = validateInputs(calc, args, options);
  const outputs = calc.formula(values);
  throwIfErrors(checkOutputs(calc, values, outputs));
  const result: Evaluation<I, O> & { [JUPYTER_DISPLAY](): unknown } = {
    kind: "sonorigor.evaluation",
    calculation: calc,
    inputs: values,
    outputs,
    flags,
    issues,
    cautions: cautionsOf(calc),
    [JUPYTER_DISPLAY]: () => displayEvaluation(result),
  };
  return result;
}
