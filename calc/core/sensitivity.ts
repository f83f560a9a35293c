/**
 * Sensitivity curves: one input swept over a range, every other input held, each point evaluated
 * through the calculation's own validated evaluation (no formula is restated).
 *
 * @module
 */
import { evaluate, type InputArguments } from "./evaluate.ts";
import { formatRange, inRange } from "./range.ts";
import type { Calculation, MimeBundle, SensitivityCurve, SensitivityPoint } from "./types.ts";

export type { SensitivityCurve, SensitivityPoint } from "./types.ts";
import { cautionsOf } from "./calculation.ts";
import { displaySensitivityCurve } from "../../display/sensitivity.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";
import { relativeChangePercent } from "./relative_change.ts";

/** Options of {@linkcode sensitivityCurve}. */
export interface SensitivityOptions<I extends string, O extends string> {
  /** The input to sweep. */
  readonly vary: I;
  /** First value of the sweep, in the input's canonical unit. */
  readonly from: number;
  /** Last value of the sweep, in the input's canonical unit. */
  readonly to: number;
  /** Number of points, ≥ 2. @default 50 */
  readonly steps?: number;
  /** The output to follow. @default the first output */
  readonly output?: O;
}

/**
 * Sweeps one input of a calculation and records an output, with its change relative to the
 * reference inputs.
 *
 * @param calc The calculation.
 * @param reference Reference inputs (numbers or quantity strings); the swept input's reference
 * value is taken from here.
 * @param options Swept input, range, number of points, output.
 * @returns The curve (it displays itself in a notebook: the points with the change relative to the
 * reference, and the calculation's cautions).
 * @throws {RangeError} When the sweep leaves the swept input's valid range or steps < 2.
 * @throws {TypeError} For an unknown input or output name.
 *
 * @example Gradient 4v² doubles its relative error: +10 % velocity → +21 % gradient
 * ```ts
 * import { expressionModel, sensitivityCurve } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * const curve = sensitivityCurve(model, { v: 4 }, { vary: "v", from: 4, to: 4.4, steps: 2 });
 * assert.equal(curve.points[1]!.relativeChangePercent.toFixed(1), "21.0");
 * ```
 */
export function sensitivityCurve<I extends string, O extends string>(
  calc: Calculation<I, O>,
  reference: InputArguments<I>,
  options: SensitivityOptions<I, O>,
): SensitivityCurve & { [JUPYTER_DISPLAY](): MimeBundle } {
  const { vary } = options;
  if (!calc.inputNames.includes(vary)) {
    throw new TypeError(
      `${calc.title}: unknown input '${vary}' to vary; expected one of ${
        calc.inputNames.join(", ")
      }`,
    );
  }
  const output = options.output ?? calc.outputNames[0]!;
  if (!calc.outputNames.includes(output)) {
    throw new TypeError(
      `${calc.title}: unknown output '${output}'; expected one of ${calc.outputNames.join(", ")}`,
    );
  }
  const steps = options.steps ?? 50;
  if (!(Number.isInteger(steps) && steps >= 2)) {
    throw new RangeError(`${calc.title}: expected steps to be an integer >= 2, got ${steps}`);
  }
  const def = calc.inputs[vary];
  for (const end of [options.from, options.to]) {
    if (!inRange(end, def.range)) {
      throw new RangeError(
        `${calc.title}: expected the sweep of '${vary}' in ${
          formatRange(def.range, def.unit)
        }, got ${end}`,
      );
    }
  }
  const base = evaluate(calc, reference);
  const y0 = base.outputs[output];
  const points: SensitivityPoint[] = [];
  for (let s = 0; s < steps; s++) {
    const x = options.from + ((options.to - options.from) * s) / (steps - 1);
    const y = evaluate(calc, { ...reference, [vary]: x }).outputs[output];
    points.push({ x, y, relativeChangePercent: relativeChangePercent(y, y0) });
  }
  const curve: SensitivityCurve = {
    title: calc.title,
    input: vary,
    inputLabel: def.label,
    inputUnit: def.unit,
    output,
    outputLabel: calc.outputs[output].label,
    outputUnit: calc.outputs[output].unit,
    reference: { x: base.inputs[vary], y: y0 },
    points,
  };
  const cautions = cautionsOf(calc);
  return Object.assign(curve, {
    [JUPYTER_DISPLAY]: () => displaySensitivityCurve(curve, cautions),
  });
}
