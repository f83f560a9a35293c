/**
 * The one validator: reads values given as numbers, quantity strings or mathjs Units, converts
 * them to canonical units and checks them against their quantity (or the calculation's narrower)
 * ranges, returning structured issues. Evaluation, both propagation methods, table reading and the
 * command line all check values here.
 *
 * @module
 */
import type {
  InputConstraint,
  InputDefinition,
  InputSchema,
  InputValues,
  Population,
  ValidationIssue,
  ValueRange,
} from "./types.ts";
import { formatRange, inRange } from "./range.ts";
import { typicalRange } from "./quantity.ts";
import { readAmount } from "./units.ts";
import { describeValue, withUnit } from "./text.ts";
import { throwIfErrors } from "./issues.ts";
import { renderIssue } from "./issues.ts";

/** Where a value comes from, for the issue: a calculation or a file, and a row or line. */
export interface CheckContext {
  /** Who checks: a calculation title or a file name. */
  readonly where: string;
  /** Which typical range applies. @default "adult" */
  readonly population?: Population;
  /** 0-based data row of a table. */
  readonly row?: number;
  /** 1-based line of a file. */
  readonly line?: number;
}

/** What one check found: the canonical value (undefined when it could not be read) and issues. */
export interface CheckedValue {
  /** The value in the canonical unit, or undefined when it is missing or unreadable. */
  readonly value: number | undefined;
  /** Errors and warnings about it. */
  readonly issues: readonly ValidationIssue[];
}

/** The parts of an input definition a check needs (a quantity satisfies it too, via
 * {@linkcode quantityField}). */
export type CheckedField =
  & Pick<
    InputDefinition,
    "label" | "unit" | "range" | "typical" | "typicalPediatric" | "default" | "narrowedBecause"
  >
  & {
    readonly integer?: boolean;
    /** An input definition's quantity: its `integer` flag applies when `integer` is not set. */
    readonly quantity?: { readonly integer: boolean };
  };

/**
 * The checked field of a quantity used directly (a table column, a command-line option).
 *
 * @example
 * ```ts
 * import { checkValue, HEIGHT, quantityField } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(checkValue("height", quantityField(HEIGHT), "1.8 m", { where: "Demo" }).value, 180);
 * ```
 */
export function quantityField(
  q: {
    readonly label: string;
    readonly unit: string;
    readonly valid: ValueRange;
    readonly typical?: ValueRange;
    readonly typicalPediatric?: ValueRange;
    readonly integer?: boolean;
  },
): CheckedField {
  return {
    label: q.label,
    unit: q.unit,
    range: q.valid,
    ...(q.typical ? { typical: q.typical } : {}),
    ...(q.typicalPediatric ? { typicalPediatric: q.typicalPediatric } : {}),
    ...(q.integer ? { integer: true } : {}),
  };
}

/**
 * Checks one value: present (or defaulted), readable as a number in the canonical unit, inside
 * the valid range (NaN and infinities are outside), whole when the quantity counts things, and
 * inside the typical range (a warning otherwise).
 *
 * @param field The input name or column header.
 * @param def The field's unit and ranges.
 * @param raw The value as given.
 * @param context Who checks, the population, and the row or line.
 * @returns The canonical value and the issues.
 *
 * @example
 * ```ts
 * import { checkValue, continuityValveArea, renderIssue } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const def = continuityValveArea.inputs.lvotDiameterCm;
 * const r = checkValue("lvotDiameterCm", def, "60 mm", { where: "Demo" });
 * assert.equal(r.value, undefined);
 * assert.equal(renderIssue(r.issues[0]!),
 *   `Demo: expected 'lvotDiameterCm' (LVOT diameter) in (0, 5] cm, got "60 mm" (6 cm)`);
 * ```
 */
export function checkValue(
  field: string,
  def: CheckedField,
  raw: unknown,
  context: CheckContext,
): CheckedValue {
  const base = {
    where: context.where,
    field,
    label: def.label,
    unit: def.unit,
    ...(context.row !== undefined ? { row: context.row } : {}),
    ...(context.line !== undefined ? { line: context.line } : {}),
  };
  const validText = formatRange(def.range, def.unit);
  if (raw === undefined) {
    if (def.default !== undefined) return { value: def.default, issues: [] };
    return {
      value: undefined,
      issues: [{
        ...base,
        kind: "missing",
        severity: "error",
        received: "nothing",
        range: def.range,
        expected: `a value in ${validText}`,
      }],
    };
  }
  const read = readAmount(raw, def.unit);
  if (typeof read !== "number") {
    const issue: ValidationIssue = read.problem === "type"
      ? {
        ...base,
        kind: "type",
        severity: "error",
        received: describeValue(raw),
        range: def.range,
        expected: `as a number or a quantity in ${validText}`,
      }
      : {
        ...base,
        kind: "unit",
        severity: "error",
        received: typeof raw === "string" ? JSON.stringify(raw) : String(raw),
        range: def.range,
        expected: `in ${validText} (a unit convertible to ${def.unit})`,
      };
    return { value: undefined, issues: [issue] };
  }
  const received = typeof raw === "number"
    ? String(raw)
    : `${JSON.stringify(typeof raw === "string" ? raw : String(raw))} (${
      withUnit(String(read), def.unit)
    })`;
  if (!inRange(read, def.range)) {
    return {
      value: undefined,
      issues: [{
        ...base,
        kind: "range",
        severity: "error",
        received,
        value: read,
        range: def.range,
        expected: `in ${validText}`,
      }],
    };
  }
  if ((def.integer ?? def.quantity?.integer) && !Number.isInteger(read)) {
    return {
      value: undefined,
      issues: [{
        ...base,
        kind: "integer",
        severity: "error",
        received,
        value: read,
        range: def.range,
        expected: `as a whole number in ${validText}`,
      }],
    };
  }
  const typical = typicalRange(def, context.population);
  if (typical && !inRange(read, typical)) {
    return {
      value: read,
      issues: [{
        ...base,
        kind: "typical",
        severity: "warning",
        // a note, not an error: six significant digits read better than a computed 2.5495403941762333
        received: withUnit(String(Number(read.toPrecision(6))), def.unit),
        value: read,
        range: typical,
        expected: formatRange(typical, def.unit),
        ...(def.narrowedBecause ? { note: def.narrowedBecause } : {}),
      }],
    };
  }
  return { value: read, issues: [] };
}

/** Options of {@linkcode checkInputs} and {@linkcode validateInputs}. */
export interface ValidateOptions {
  /** Which typical range flags values. @default "adult" */
  readonly population?: Population;
  /** Input names whose values are checked elsewhere (an uncertain input checked by its
   * distribution); they are skipped here but must be known names. */
  readonly skip?: readonly string[];
}

/**
 * Checks every input of a calculation without throwing: the argument is an object, every name is
 * known, every value is present, readable and in range; relations between inputs hold. Returns
 * all the issues, errors and warnings.
 *
 * @param schema The calculation (or any object with title, inputs, input names, constraints).
 * @param args Values by input name: numbers in canonical units or quantity strings.
 * @param options Population for typical ranges.
 * @returns The canonical values read (those in error are missing) and every issue.
 *
 * @example
 * ```ts
 * import { checkInputs, continuityValveArea } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = checkInputs(continuityValveArea, { lvotDiameterCm: "21 mmHg", lvotVtiCm: -1 });
 * assert.deepEqual(r.issues.map((i) => i.kind), ["unit", "range", "missing"]);
 * ```
 */
export function checkInputs<I extends string>(
  schema: InputSchema<I>,
  args: unknown,
  options: ValidateOptions = {},
): { values: Partial<Record<I, number>>; issues: ValidationIssue[] } {
  const context: CheckContext = { where: schema.title, population: options.population ?? "adult" };
  const names = schema.inputNames as readonly string[];
  if (typeof args !== "object" || args === null || Array.isArray(args)) {
    return {
      values: {},
      issues: [{
        kind: "type",
        severity: "error",
        where: schema.title,
        field: "inputs",
        received: describeValue(args),
        expected: `as an object with ${names.join(", ")}`,
      }],
    };
  }
  const given = args as Record<string, unknown>;
  const issues: ValidationIssue[] = [];
  for (const key of Object.keys(given)) {
    if (!names.includes(key)) {
      issues.push({
        kind: "unknown",
        severity: "error",
        where: schema.title,
        field: key,
        received: describeValue(given[key]),
        expected: `one of ${names.join(", ")}`,
      });
    }
  }
  const values: Partial<Record<I, number>> = {};
  const skip = options.skip ?? [];
  for (const name of schema.inputNames) {
    if (skip.includes(name)) continue;
    const r = checkValue(name, schema.inputs[name], given[name], context);
    for (const issue of r.issues) issues.push(issue);
    if (r.value !== undefined) values[name] = r.value;
  }
  for (const issue of checkConstraints(schema, values)) issues.push(issue);
  return { values, issues };
}

/**
 * The text of a relation between inputs as a reader sees it: each quoted input name followed by
 * its label, `<=` and `>=` written as ≤ and ≥ — the format of every validator message
 * ("'field' (Label)").
 *
 * @param schema The calculation (or argument schema) the relation belongs to.
 * @param constraint The relation.
 * @returns The relation with labels.
 *
 * @example
 * ```ts
 * import { ejectionFraction, relationText } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(
 *   relationText(ejectionFraction, ejectionFraction.constraints[0]!),
 *   "'endSystolicVolumeMl' (LV end-systolic volume) ≤ 'endDiastolicVolumeMl' (LV end-diastolic volume)",
 * );
 * ```
 */
export function relationText<I extends string>(
  schema: InputSchema<I>,
  constraint: InputConstraint<I>,
): string {
  return constraint.description
    .replace(/'(\w+)'/g, (whole, name: string) => {
      const input = Object.hasOwn(schema.inputs, name) ? schema.inputs[name as I] : undefined;
      return input ? `${whole} (${input.label})` : whole;
    })
    .replace(/ <= /g, " ≤ ")
    .replace(/ >= /g, " ≥ ");
}

/**
 * Checks the relations between inputs (e.g. end-systolic ≤ end-diastolic volume) whose values
 * are all known.
 *
 * @returns One constraint issue per relation that does not hold.
 *
 * @example
 * ```ts
 * import { checkConstraints, ejectionFraction, renderIssue } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const [issue] = checkConstraints(ejectionFraction,
 *   { endDiastolicVolumeMl: 120, endSystolicVolumeMl: 130 });
 * assert.match(renderIssue(issue!), /endSystolicVolumeMl = 130 mL, endDiastolicVolumeMl = 120 mL/);
 * ```
 */
export function checkConstraints<I extends string>(
  schema: InputSchema<I>,
  values: Partial<Record<I, number>>,
): ValidationIssue[] {
  const issues: ValidationIssue[] = [];
  for (const c of schema.constraints ?? []) {
    if (!c.inputs.every((n) => values[n] !== undefined)) continue;
    if (c.holds(values as InputValues<I>)) continue;
    issues.push({
      kind: "constraint",
      severity: "error",
      where: schema.title,
      field: c.inputs.join(", "),
      received: c.inputs.map((n) => `${n} = ${withUnit(String(values[n]), schema.inputs[n].unit)}`)
        .join(", "),
      expected: relationText(schema, c),
    });
  }
  return issues;
}

/**
 * Validates and converts a calculation's inputs to canonical numbers, throwing on any error.
 *
 * @param schema The calculation.
 * @param args Values by input name: numbers in canonical units or quantity strings.
 * @param options Population for typical ranges.
 * @returns Canonical values, warnings as messages (`flags`) and as issues.
 * @throws {TypeError} For an unknown or missing input, or a value of the wrong type or unit.
 * @throws {RangeError} For a value outside its valid range (NaN and infinities included), a
 * fraction given for a count, or a relation between inputs that does not hold.
 *
 * @example
 * ```ts
 * import { continuityValveArea, validateInputs } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const { values, flags } = validateInputs(continuityValveArea, { lvotDiameterCm: "3.5 cm", lvotVtiCm: 20, avVtiCm: 80 });
 * assert.equal(values.lvotDiameterCm, 3.5);
 * assert.equal(flags.length, 1); // 3.5 cm lies outside the typical range
 * ```
 */
export function validateInputs<I extends string>(
  schema: InputSchema<I>,
  args: unknown,
  options: ValidateOptions = {},
): { values: InputValues<I>; flags: string[]; issues: ValidationIssue[] } {
  const { values, issues } = checkInputs(schema, args, options);
  throwIfErrors(issues);
  return { values: values as InputValues<I>, flags: issues.map(renderIssue), issues };
}
