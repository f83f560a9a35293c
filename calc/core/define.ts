/**
 * The one way a calculation is defined, and its validated evaluation.
 *
 * @module
 */
import * as z from "zod";
import type {
  Calculation,
  CalculationSpec,
  InputConstraint,
  InputDefinition,
  InputSchema,
  InputValues,
  OutputValues,
  ValueRange,
} from "./types.ts";
import { describe, isMathUnit, type QuantityInput, toCanonical } from "./units.ts";
import { displayEvaluation, formatUnit, JUPYTER_DISPLAY, type MimeBundle } from "./display.ts";

/** The caution shown with every result that could reach a patient decision. *
 * @example
 * ```ts
 * import { CLINICAL_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(CLINICAL_CAUTION, /^Not a diagnosis/);
 * ```
 */
export const CLINICAL_CAUTION =
  "Not a diagnosis: verify against local guidelines and licensed clinical practice before acting on this number";

/**
 * Declares a calculation once. Everything else (evaluation, validation, uncertainty propagation,
 * sensitivity curves, reference docs) derives from the returned object.
 *
 * @param spec Inputs with canonical units and ranges, outputs, formula, sources and cautions.
 * @returns The frozen calculation.
 * @throws {TypeError} When the spec is malformed (no inputs, no outputs, empty range, missing
 * source).
 *
 * @example Simplified Bernoulli pressure gradient
 * ```ts
 * import { defineCalculation, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const gradient = defineCalculation({
 *   id: "demoGradient",
 *   title: "Demo gradient",
 *   description: "Peak gradient from a peak velocity.",
 *   inputs: { velocity: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   outputs: { gradient: { unit: "mmHg", description: "Peak gradient" } },
 *   formula: ({ velocity }) => ({ gradient: 4 * velocity ** 2 }),
 *   formulaText: "ΔP = 4·v²",
 *   sources: [{ authors: "Hatle L, Angelsen B", year: 1985, title: "Doppler Ultrasound in Cardiology",
 *     publication: "Lea & Febiger" }],
 *   cautions: [],
 * });
 * assert.equal(evaluate(gradient, { velocity: "400 cm/s" }).outputs.gradient, 64);
 * ```
 */
export function defineCalculation<I extends string, O extends string>(
  spec: CalculationSpec<I, O>,
): Calculation<I, O> {
  const inputNames = Object.keys(spec.inputs) as I[];
  const outputNames = Object.keys(spec.outputs) as O[];
  if (inputNames.length === 0) {
    throw new TypeError(`${spec.title}: expected at least one input, got none`);
  }
  if (outputNames.length === 0) {
    throw new TypeError(`${spec.title}: expected at least one output, got none`);
  }
  if (spec.sources.length === 0) {
    throw new TypeError(`${spec.title}: expected at least one published source, got none`);
  }
  for (const name of inputNames) {
    const { range, typical } = spec.inputs[name];
    for (const r of typical ? [range, typical] : [range]) {
      if (!(r.min <= r.max)) {
        throw new TypeError(
          `${spec.title}: input '${name}' has an empty range ${formatRange(r, "")}`,
        );
      }
    }
  }
  return Object.freeze({
    ...spec,
    inputNames,
    outputNames,
    kind: "sonorigor.calculation" as const,
  });
}

/** True when `value` is a calculation made by {@linkcode defineCalculation}. *
 * @example
 * ```ts
 * import { continuityValveArea, isCalculation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(isCalculation(continuityValveArea), true);
 * assert.equal(isCalculation({}), false);
 * ```
 */
export function isCalculation(value: unknown): value is Calculation {
  return typeof value === "object" && value !== null &&
    (value as { kind?: unknown }).kind === "sonorigor.calculation";
}

/** Formats a range in interval notation with its unit, e.g. "(0, 5] cm". *
 * @example
 * ```ts
 * import { formatRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatRange({ min: 0, max: 5, minExclusive: true }, "cm^2"), "(0, 5] cm²");
 * ```
 */
export function formatRange(range: ValueRange, unit: string): string {
  const open = range.minExclusive ? "(" : "[";
  const close = range.maxExclusive ? ")" : "]";
  const u = unit === "1" || unit === "" ? "" : ` ${formatUnit(unit)}`;
  return `${open}${range.min}, ${range.max}${close}${u}`;
}

/** True when `value` lies in `range` (false for NaN). *
 * @example
 * ```ts
 * import { inRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(inRange(0, { min: 0, max: 1, minExclusive: true }), false);
 * assert.equal(inRange(NaN, { min: 0, max: 1 }), false);
 * ```
 */
export function inRange(value: number, range: ValueRange): boolean {
  const aboveMin = range.minExclusive ? value > range.min : value >= range.min;
  const belowMax = range.maxExclusive ? value < range.max : value <= range.max;
  return aboveMin && belowMax;
}

/** Inputs as a caller may give them: numbers in the canonical unit or quantity strings. */
export type InputArguments<I extends string> = { readonly [K in I]?: QuantityInput };

const quantitySchema = z.custom<QuantityInput>(
  (v) => typeof v === "number" || typeof v === "string" || isMathUnit(v),
);

/** Builds the zod schema of a calculation's argument object (shape only; ranges are checked
 * afterwards so that messages carry the valid range). */
function argumentSchema(calc: InputSchema<string>): z.ZodType {
  const shape: Record<string, z.ZodType> = {};
  for (const name of calc.inputNames) {
    const base = quantitySchema;
    shape[name] = calc.inputs[name]!.default === undefined ? base : base.optional();
  }
  return z.strictObject(shape);
}

/** Argument schemas, keyed by the (frozen, long-lived) inputs object of a definition. */
const schemas = new WeakMap<object, z.ZodType>();

/**
 * Validates and converts a calculation's inputs to canonical numbers.
 *
 * @param calc The calculation.
 * @param args Input values: numbers in canonical units or quantity strings.
 * @returns Canonical input values and flags for values outside the typical range.
 * @throws {TypeError} For an unknown or missing input, or a value of the wrong type or unit.
 * @throws {RangeError} For a value outside the input's valid range (NaN and infinities included).
 *
 * @example
 * ```ts
 * import { continuityValveArea, validateInputs } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const { values, flags } = validateInputs(continuityValveArea, { lvotDiameterCm: "3.5 cm", lvotVtiCm: 20, avVtiCm: 80 });
 * assert.equal(values.lvotDiameterCm, 3.5);
 * assert.equal(flags.length, 1); // 3.5 cm lies outside the validated range
 * ```
 */
export function validateInputs<I extends string>(
  calc: InputSchema<I>,
  args: InputArguments<I>,
): { values: InputValues<I>; flags: string[] } {
  if (typeof args !== "object" || args === null) {
    throw new TypeError(`${calc.title}: expected an object of inputs, got ${describe(args)}`);
  }
  let schema = schemas.get(calc.inputs);
  if (!schema) {
    schema = argumentSchema(calc as InputSchema<string>);
    schemas.set(calc.inputs, schema);
  }
  const parsed = schema.safeParse(args);
  if (!parsed.success) {
    const issue = parsed.error.issues[0]!;
    if (issue.code === "unrecognized_keys") {
      throw new TypeError(
        `${calc.title}: unknown input '${issue.keys.join("', '")}'; expected one of ${
          calc.inputNames.join(", ")
        }`,
      );
    }
    const field = String(issue.path[0] ?? "");
    const value = (args as Record<string, unknown>)[field];
    if (value === undefined) {
      const def = calc.inputs[field as I];
      throw new TypeError(
        `${calc.title}: missing input '${field}' (${def?.description ?? ""}, ${def?.unit ?? ""})`,
      );
    }
    throw new TypeError(
      `${calc.title}: expected '${field}' as a number or a quantity string, got ${describe(value)}`,
    );
  }
  const values = {} as Record<I, number>;
  const flags: string[] = [];
  for (const name of calc.inputNames) {
    const def = calc.inputs[name];
    const raw = args[name];
    const value = raw === undefined
      ? def.default!
      : toCanonical(raw, def.unit, `${calc.title}: '${name}'`);
    if (!inRange(value, def.range)) {
      throw new RangeError(
        `${calc.title}: expected '${name}' in ${formatRange(def.range, def.unit)}, got ${value}`,
      );
    }
    if (def.typical && !inRange(value, def.typical)) flags.push(typicalRangeFlag(name, value, def));
    values[name] = value;
  }
  checkConstraints(calc, values);
  return { values, flags };
}

/** The flag for a value outside an input's validated range. */
export function typicalRangeFlag(name: string, value: number, def: InputDefinition): string {
  const unit = formatUnit(def.unit);
  return `'${name}' = ${value}${unit ? ` ${unit}` : ""} lies outside the validated range ${
    formatRange(def.typical!, def.unit)
  }: interpret with care`;
}

/**
 * A constraint that one input must not exceed another (e.g. end-systolic ≤ end-diastolic volume).
 *
 * @param smaller The input that must be the smaller (or equal).
 * @param larger The input that must be the larger (or equal).
 * @returns The constraint.
 *
 * @example
 * ```ts
 * import { notAbove } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = notAbove("esv", "edv");
 * assert.equal(c.holds({ esv: 50, edv: 120 }), true);
 * assert.equal(c.description, "'esv' <= 'edv'");
 * ```
 */
export function notAbove<I extends string>(smaller: I, larger: I): InputConstraint<I> {
  return {
    inputs: [smaller, larger],
    description: `'${smaller}' <= '${larger}'`,
    holds: (x) => x[smaller] <= x[larger],
  };
}

/**
 * Checks the cross-input constraints of a calculation.
 *
 * @throws {RangeError} Naming the relation and the values of the inputs involved.
 */
export function checkConstraints<I extends string>(
  calc: InputSchema<I>,
  values: InputValues<I>,
): void {
  for (const c of calc.constraints ?? []) {
    if (!c.holds(values)) {
      const shown = c.inputs.map((n) => `${n} = ${values[n]}`).join(", ");
      throw new RangeError(`${calc.title}: expected ${c.description}, got ${shown}`);
    }
  }
}

/**
 * Checks formula outputs: every output must be a finite number.
 *
 * @throws {RangeError} Naming the output and the inputs that produced a non-finite value.
 */
export function checkOutputs<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: InputValues<I>,
  outputs: OutputValues<O>,
): OutputValues<O> {
  for (const name of calc.outputNames) {
    const v = outputs[name];
    if (typeof v !== "number" || !Number.isFinite(v)) {
      const shown = calc.inputNames.map((n) => `${n} = ${inputs[n]}`).join(", ");
      throw new RangeError(`${calc.title}: output '${name}' is not finite for ${shown}, got ${v}`);
    }
  }
  return outputs;
}

/** The validated result of one evaluation; it displays itself in notebooks. */
export interface Evaluation<I extends string = string, O extends string = string> {
  /** The calculation that produced it. */
  readonly calculation: Calculation<I, O>;
  /** Inputs in canonical units. */
  readonly inputs: InputValues<I>;
  /** Outputs in their units. */
  readonly outputs: OutputValues<O>;
  /** Inputs outside their validated range. */
  readonly flags: readonly string[];
  /** Cautions of the calculation, with the clinical caution where it applies. */
  readonly cautions: readonly string[];
  /** Notebook display: a table of inputs and outputs. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** The cautions to show with a result of `calc`. *
 * @example
 * ```ts
 * import { cautionsOf, CLINICAL_CAUTION, continuityValveArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(cautionsOf(continuityValveArea).includes(CLINICAL_CAUTION));
 * ```
 */
export function cautionsOf(calc: Calculation): string[] {
  return calc.clinical ? [...calc.cautions, CLINICAL_CAUTION] : [...calc.cautions];
}

/**
 * Evaluates a calculation on validated inputs.
 *
 * @param calc The calculation.
 * @param args Inputs as numbers in canonical units or quantity strings ("21 mm").
 * @returns Outputs with flags and cautions.
 * @throws {TypeError} For unknown, missing or mistyped inputs or wrong units.
 * @throws {RangeError} For inputs outside their valid range or a non-finite output.
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
): Evaluation<I, O> {
  const { values, flags } = validateInputs(calc, args);
  const outputs = checkOutputs(calc, values, calc.formula(values));
  const result: Evaluation<I, O> = {
    calculation: calc,
    inputs: values,
    outputs,
    flags,
    cautions: cautionsOf(calc),
    [JUPYTER_DISPLAY]: () => displayEvaluation(result),
  };
  return result;
}
