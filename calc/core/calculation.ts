/**
 * The one way a calculation is defined: inputs and outputs refer to quantities, the formula is
 * written once, and everything else (evaluation, validation, propagation, sensitivity, tables,
 * docs, display) derives from the returned object.
 *
 * @module
 */
import type {
  Calculation,
  Citation,
  InputConstraint,
  InputDefinition,
  InputValues,
  OutputDefinition,
  OutputValues,
  Quantity,
  Recipe,
  ValueRange,
} from "./types.ts";
import { defineQuantity, isQuantity } from "./quantity.ts";
import { formatRange, inRange, rangeWithin } from "./range.ts";

/**
 * The caution shown with every result that could reach a patient decision.
 *
 * @example
 * ```ts
 * import { CLINICAL_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(CLINICAL_CAUTION, /^Not a diagnosis/);
 * ```
 */
export const CLINICAL_CAUTION =
  "Not a diagnosis: verify against local guidelines and licensed clinical practice before acting on this number";

/** An input that plays a role: a quantity with this calculation's label, description, narrower
 * ranges (with the reason) or default. */
export interface InputRole {
  /** The quantity measured. */
  readonly quantity: Quantity;
  /** The role's label, when two inputs share a quantity ("First medium impedance"). */
  readonly label?: string;
  /** What the input is here. @default the quantity's description */
  readonly description?: string;
  /** The formula's domain when narrower than the quantity's valid range. */
  readonly valid?: ValueRange;
  /** Typical values for this calculation when narrower than the quantity's. */
  readonly typical?: ValueRange;
  /** Typical values for children for this calculation. */
  readonly typicalPediatric?: ValueRange;
  /** Why the ranges are narrowed (required with `valid`, `typical` or `typicalPediatric`). */
  readonly reason?: string;
  /** Value used when the caller omits the input, in the canonical unit. */
  readonly default?: number;
}

/** An output with this calculation's label or description. */
export interface OutputRole {
  /** The quantity computed. */
  readonly quantity: Quantity;
  /** The role's label. @default the quantity's label */
  readonly label?: string;
  /** What the output is here. @default the quantity's description */
  readonly description?: string;
}

/** An input declared on the spot (a user's own model): it becomes an ad-hoc quantity of this
 * calculation only. The package's own calculations use declared quantities instead. */
export interface InlineInput {
  /** Canonical unit. */
  readonly unit: string;
  /** Label. @default the description */
  readonly label?: string;
  /** Description. */
  readonly description: string;
  /** Valid range. */
  readonly range: ValueRange;
  /** Typical range. */
  readonly typical?: ValueRange;
  /** Default. */
  readonly default?: number;
}

/** An output declared on the spot (a user's own model): an ad-hoc quantity of this calculation. */
export interface InlineOutput {
  /** Unit. */
  readonly unit: string;
  /** Label. @default the description */
  readonly label?: string;
  /** Description. */
  readonly description: string;
}

/** How an author declares an input: a quantity, a quantity in a role, or another calculation's
 * input reused as it is. */
export type InputSpec = Quantity | InputRole | InputDefinition | InlineInput;
/** How an author declares an output: a quantity, or a quantity in a role. */
export type OutputSpec = Quantity | OutputRole | InlineOutput;

/** Everything a calculation author writes, once. */
export interface CalculationSpec<I extends string, O extends string> {
  /** Stable identifier in camelCase, e.g. "continuityValveArea". */
  readonly id: string;
  /** Short human title. */
  readonly title: string;
  /** What the calculation is for, one or two sentences. */
  readonly description: string;
  /** Inputs by name. */
  readonly inputs: { readonly [K in I]: InputSpec };
  /** Outputs by name. */
  readonly outputs: { readonly [K in O]: OutputSpec };
  /** The formula, written once as plain arithmetic on canonical units. */
  readonly formula: (x: InputValues<I>) => OutputValues<O>;
  /** The formula as a reader sees it in docs, e.g. "ΔP = 4·v²". */
  readonly formulaText: string;
  /** Published sources for the formula and its constants. */
  readonly citations?: readonly Citation[];
  /** Cautions specific to this calculation. */
  readonly cautions: readonly string[];
  /** Relations between inputs that must hold; a violation is a RangeError naming the inputs. */
  readonly constraints?: readonly InputConstraint<I>[];
  /** True when a result could reach a patient decision. @default false */
  readonly clinical?: boolean;
  /** Exact partial derivatives (expression models supply symbolic ones). */
  partial?(output: O, wrt: readonly I[]): (x: InputValues<I>) => number;
  /** How to make this calculation again in a worker; families and chains set it.
   * @default { kind: "catalog", id } */
  readonly recipe?: Recipe;
}

function isRole(spec: unknown): spec is InputRole | OutputRole {
  return typeof spec === "object" && spec !== null && isQuantity((spec as InputRole).quantity);
}

const UNBOUNDED: ValueRange = { min: -Infinity, max: Infinity };

function resolveInput(id: string, name: string, spec: InputSpec): InputDefinition {
  const where = `Calculation '${id}'`;
  if (isQuantity(spec)) {
    return {
      quantity: spec,
      label: spec.label,
      unit: spec.unit,
      description: spec.description,
      range: spec.valid,
      ...(spec.typical ? { typical: spec.typical } : {}),
      ...(spec.typicalPediatric ? { typicalPediatric: spec.typicalPediatric } : {}),
    };
  }
  if (isRole(spec) && "range" in spec && "unit" in spec) {
    // another calculation's resolved input, reused as it is
    return spec as unknown as InputDefinition;
  }
  if (isRole(spec)) {
    const role = spec as InputRole;
    const q = role.quantity;
    const narrowed = role.valid ?? role.typical ?? role.typicalPediatric;
    if (narrowed !== undefined && !role.reason) {
      throw new TypeError(
        `${where}: input '${name}' narrows the ranges of ${q.label}; expected a reason, got none`,
      );
    }
    const range = role.valid ?? q.valid;
    if (!rangeWithin(range, q.valid)) {
      throw new TypeError(
        `${where}: input '${name}' must narrow the valid range ${
          formatRange(q.valid, q.unit)
        } of ${q.label}, got ${formatRange(range, q.unit)}`,
      );
    }
    const typical = role.typical ?? q.typical;
    const typicalPediatric = role.typicalPediatric ?? q.typicalPediatric;
    for (const r of [typical, typicalPediatric]) {
      if (r && !rangeWithin(r, range)) {
        throw new TypeError(
          `${where}: input '${name}' has a typical range ${
            formatRange(r, q.unit)
          } outside its valid range ${formatRange(range, q.unit)}`,
        );
      }
    }
    if (role.default !== undefined && !inRange(role.default, range)) {
      throw new TypeError(
        `${where}: input '${name}' has a default outside ${
          formatRange(range, q.unit)
        }, got ${role.default}`,
      );
    }
    return {
      quantity: q,
      label: role.label ?? q.label,
      unit: q.unit,
      description: role.description ?? q.description,
      range,
      ...(typical ? { typical } : {}),
      ...(typicalPediatric ? { typicalPediatric } : {}),
      ...(role.reason ? { narrowedBecause: role.reason } : {}),
      ...(role.default !== undefined ? { default: role.default } : {}),
    };
  }
  const inline = spec as InlineInput;
  const label = inline.label ?? (inline.description || name);
  const q = defineQuantity({
    id: `${id}.${name}`,
    label,
    unit: inline.unit,
    description: inline.description,
    valid: inline.range,
    ...(inline.typical ? { typical: inline.typical } : {}),
    resolution: 1e-9,
  });
  return {
    quantity: q,
    label,
    unit: inline.unit,
    description: inline.description,
    range: inline.range,
    ...(inline.typical ? { typical: inline.typical } : {}),
    ...(inline.default !== undefined ? { default: inline.default } : {}),
  };
}

function resolveOutput(id: string, name: string, spec: OutputSpec): OutputDefinition {
  if (isQuantity(spec)) {
    return { quantity: spec, label: spec.label, unit: spec.unit, description: spec.description };
  }
  if (isRole(spec)) {
    const role = spec as OutputRole;
    return {
      quantity: role.quantity,
      label: role.label ?? role.quantity.label,
      unit: role.quantity.unit,
      description: role.description ?? role.quantity.description,
    };
  }
  const inline = spec as InlineOutput;
  const label = inline.label ?? (inline.description || name);
  const q = defineQuantity({
    id: `${id}.${name}`,
    label,
    unit: inline.unit,
    description: inline.description,
    valid: UNBOUNDED,
    resolution: 1e-9,
  });
  return { quantity: q, label, unit: inline.unit, description: inline.description };
}

/**
 * Declares a calculation once. Everything else (evaluation, validation, uncertainty propagation,
 * sensitivity curves, tables, reference docs, displays) derives from the returned object.
 *
 * @param spec Inputs and outputs as quantities, formula, citations and cautions.
 * @returns The frozen calculation.
 * @throws {TypeError} When the spec is malformed: no inputs or outputs, no citation, a narrowed
 * range without its reason or outside the quantity's valid range, a default outside the range.
 *
 * @example Simplified Bernoulli pressure gradient
 * ```ts
 * import { defineCalculation, defineQuantity, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const velocity = defineQuantity({ id: "demoVelocity", label: "Peak velocity", unit: "m/s",
 *   description: "Peak jet velocity", valid: { min: 0, max: 10 }, resolution: 0.01 });
 * const gradient = defineQuantity({ id: "demoGradient", label: "Peak gradient", unit: "mmHg",
 *   description: "Peak pressure gradient", valid: { min: 0, max: 400 }, resolution: 0.1 });
 * const bernoulli = defineCalculation({
 *   id: "demoBernoulli",
 *   title: "Demo gradient",
 *   description: "Peak gradient from a peak velocity.",
 *   inputs: { velocity },
 *   outputs: { gradient },
 *   formula: ({ velocity }) => ({ gradient: 4 * velocity ** 2 }),
 *   formulaText: "ΔP = 4·v²",
 *   citations: [{ authors: "Hatle L, Angelsen B", year: 1985,
 *     title: "Doppler Ultrasound in Cardiology", publication: "Lea & Febiger" }],
 *   cautions: [],
 * });
 * assert.equal(evaluate(bernoulli, { velocity: "400 cm/s" }).outputs.gradient, 64);
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
  const citations = spec.citations ?? [];
  if (citations.length === 0) {
    throw new TypeError(`${spec.title}: expected at least one published source, got none`);
  }
  widenFieldsForNumbers(spec.inputs);
  widenFieldsForNumbers(spec.outputs);
  const inputs = {} as Record<I, InputDefinition>;
  for (const name of inputNames) inputs[name] = resolveInput(spec.id, name, spec.inputs[name]);
  const outputs = {} as Record<O, OutputDefinition>;
  for (const name of outputNames) outputs[name] = resolveOutput(spec.id, name, spec.outputs[name]);
  return Object.freeze({
    kind: "sonorigor.calculation" as const,
    id: spec.id,
    title: spec.title,
    description: spec.description,
    inputs: Object.freeze(inputs),
    outputs: Object.freeze(outputs),
    inputNames: Object.freeze(inputNames),
    outputNames: Object.freeze(outputNames),
    formula: spec.formula,
    formulaText: spec.formulaText,
    citations: Object.freeze([...citations]),
    cautions: Object.freeze([
      ...new Set([...spec.cautions, ...recalledSourceCautions(citations)]),
    ]),
    constraints: Object.freeze([...(spec.constraints ?? [])]),
    clinical: spec.clinical ?? false,
    // a spread calculation brings its own recipe: a catalog recipe always names this id
    recipe: spec.recipe && spec.recipe.kind !== "catalog"
      ? spec.recipe
      : { kind: "catalog" as const, id: spec.id },
    ...(spec.partial ? { partial: spec.partial } : {}),
  });
}

/**
 * Keeps a formula's argument and result objects free of per-row allocations in the column loops
 * (Monte Carlo trials, table rows). The definition's `inputs` and `outputs` records are object
 * literals keyed by the same names, in the same order, as the objects a formula receives and
 * returns, so the JavaScript engine (V8) gives them the same hidden class; the records hold objects,
 * which fixes those fields to "heap object", and every number later stored in such a field is then
 * boxed (a heap allocation per row that the optimiser cannot remove). A throwaway copy of each
 * record (the same hidden class) given a small integer widens the fields to "any value", where the
 * optimiser keeps numbers unboxed. The caller's records are not changed. Measured: a one-line
 * formula over 10⁶ rows 2.7 ns per row with 416 young-generation collections before, 1.5 ns with
 * 16 after (bench/analysis.md); without this the same happens only after the engine's first full
 * garbage collection, which drops the definitions' hidden classes.
 */
function widenFieldsForNumbers(record: object): void {
  const copy: Record<string, unknown> = { ...record };
  for (const key of Object.keys(copy)) copy[key] = 0;
}

/**
 * The argument schema of a plain function that takes calculation-style arguments (a function
 * with several answers, such as an aliasing check): its inputs resolved from quantities exactly
 * as a calculation's are, for the one validator.
 *
 * @param title Who checks (the function's title in messages).
 * @param inputs The arguments as quantities or quantities in a role.
 * @returns The schema for `validateInputs` and `checkInputs`.
 * @throws {TypeError} As {@linkcode defineCalculation} for a malformed input.
 *
 * @example
 * ```ts
 * import { defineArguments, HEIGHT, validateInputs } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const schema = defineArguments("Demo", { heightCm: HEIGHT });
 * assert.equal(validateInputs(schema, { heightCm: "1.5 m" }).values.heightCm, 150);
 * ```
 */
export function defineArguments<I extends string>(
  title: string,
  inputs: { readonly [K in I]: InputSpec },
): {
  title: string;
  inputs: { readonly [K in I]: InputDefinition };
  inputNames: readonly I[];
  constraints: readonly InputConstraint<I>[];
} {
  const inputNames = Object.keys(inputs) as I[];
  const resolved = {} as Record<I, InputDefinition>;
  for (const name of inputNames) resolved[name] = resolveInput(title, name, inputs[name]);
  return { title, inputs: resolved, inputNames, constraints: [] };
}

/**
 * True when `value` is a calculation made by {@linkcode defineCalculation}.
 *
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

/** A citation whose locator says its details were recalled or not checked. */
const RECALLED = /from memory|not verified/i;

/**
 * The cautions that carry a recalled or unchecked source to every result that cites it: one per
 * citation whose locator says "from memory" or "not verified", naming its first author, year and
 * locator. A calculation lists them among its cautions so that its evaluations, propagations,
 * tables and displays show the mark with the number. {@linkcode defineCalculation} adds them to
 * every calculation's cautions, so no definition lists them by hand.
 *
 * @param citations The calculation's citations.
 * @returns One caution per recalled or unchecked citation, in order.
 *
 * @example
 * ```ts
 * import { recalledSourceCautions } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const [caution] = recalledSourceCautions([
 *   { authors: "Doe J, Roe R", year: 1999, title: "T", publication: "P", locator: "Table 2 (from memory)" },
 *   { authors: "Poe P", year: 2001, title: "T", publication: "P", locator: "Table 1" },
 * ]);
 * assert.equal(caution, "Doe 1999 (Table 2 (from memory)): cited without re-checking the publication; verify before relying on it");
 * ```
 */
export function recalledSourceCautions(citations: readonly Citation[]): string[] {
  return citations.filter((c) => RECALLED.test(c.locator ?? "")).map((c) =>
    `${
      c.authors.split(/[ ,]/)[0]
    } ${c.year} (${c.locator}): cited without re-checking the publication; verify before relying on it`
  );
}

/**
 * The cautions to show with a result of `calc`: its own, then the clinical caution where a
 * result could reach a patient decision.
 *
 * @example
 * ```ts
 * import { cautionsOf, CLINICAL_CAUTION, continuityValveArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(cautionsOf(continuityValveArea).includes(CLINICAL_CAUTION));
 * ```
 */
export function cautionsOf(calc: Pick<Calculation, "cautions" | "clinical">): string[] {
  return calc.clinical ? [...calc.cautions, CLINICAL_CAUTION] : [...calc.cautions];
}
