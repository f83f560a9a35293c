/**
 * Matching what a caller gives for each input of a propagation (an exact value, a distribution,
 * or an uncertain value from an earlier step) to the calculation: the one validator checks every
 * estimate; distributions become elementary sources keyed by input name; earlier values bring
 * their sources (GUM) or their samples (Monte Carlo). Shared by both methods.
 *
 * @module
 */
import type { Calculation, InputValues, Population, ValidationIssue } from "../core/types.ts";
import { checkConstraints, checkValue } from "../core/validate.ts";
import { issueError, renderIssue, throwIfErrors } from "../core/issues.ts";
import { readAmount } from "../core/units.ts";
import { describeValue } from "../core/text.ts";
import { formatRange } from "../core/range.ts";
import { type InputEstimate, isUncertainInput, resolveDistribution } from "./distributions.ts";
import { correlationMatrix, type Correlations } from "./correlation.ts";
import { isUncertainValue } from "./uncertain_value.ts";
import { mergeSources, NO_SOURCES, pairKey, sourceKey } from "./sources.ts";
import type { Source, SourceSet, UncertainValue } from "./types.ts";

/** What a caller may give for one input of a propagation: an exact value, a distribution, or
 * an uncertain value from an earlier step. */
export type UncertainArgument = InputEstimate | UncertainValue;

/** Uncertain inputs by name. */
export type UncertainInputs<I extends string> = { readonly [K in I]?: UncertainArgument };

/** One input matched to a calculation. */
export interface PreparedInput {
  /** Input name. */
  readonly name: string;
  /** Estimate in the canonical unit. */
  readonly estimate: number;
  /** Combined standard uncertainty of the input (0 when exact). */
  readonly standardUncertainty: number;
  /** The source created for it here (a distribution with u > 0), or null. */
  readonly fresh: Source | null;
  /** The earlier value given for it, or null. */
  readonly given: UncertainValue | null;
  /** Conversion factor from the earlier value's unit to the input's unit. */
  readonly factor: number;
  /** Sensitivities of the input to the sources (GUM linear part). */
  readonly linear: ReadonlyMap<string, number>;
}

/** Every input matched, with the merged sources and the warnings. */
export interface PreparedInputs<I extends string> {
  /** In the calculation's input order. */
  readonly inputs: readonly PreparedInput[];
  /** Estimates by name. */
  readonly estimates: InputValues<I>;
  /** Every source the inputs depend on, with declared correlations. */
  readonly sources: SourceSet;
  /** Warnings (typical ranges) as issues. */
  readonly warnings: readonly ValidationIssue[];
  /** True when any correlation is declared among the sources. */
  readonly correlated: boolean;
}

/** Options that shape the matching. */
export interface PrepareOptions {
  /** Method the inputs are for. */
  readonly method: "gum" | "monteCarlo";
  /** Correlations between inputs given as distributions here (pairs or a full matrix). */
  readonly correlations?: Correlations;
  /** Prefix of the keys of the sources created here ("P07" gives "P07/heightCm"). */
  readonly label?: string;
  /** Which typical ranges flag the estimates. @default "adult" */
  readonly population?: Population;
}

function unitFactor(from: string, to: string): number | null {
  if (from === to) return 1;
  const f = readAmount(`1 ${from}`, to);
  return typeof f === "number" ? f : null;
}

/**
 * Matches uncertain inputs to a calculation.
 *
 * @throws {TypeError} For an unknown or missing input, a wrong type or unit, a value of the
 * other method, or a correlation that names an input not given as a distribution here.
 * @throws {RangeError} For an estimate outside its valid range, a bad distribution or
 * correlation, or a broken relation between inputs.
 */
export function prepareInputs<I extends string>(
  calc: Calculation<I, string>,
  given: UncertainInputs<I>,
  options: PrepareOptions,
): PreparedInputs<I> {
  const where = calc.title;
  const context = { where, population: options.population ?? "adult" };
  const issues: ValidationIssue[] = [];
  if (typeof given !== "object" || given === null || Array.isArray(given)) {
    throw issueError([{
      kind: "type",
      severity: "error",
      where,
      field: "inputs",
      received: describeValue(given),
      expected: `as an object with ${calc.inputNames.join(", ")}`,
    }]);
  }
  for (const key of Object.keys(given)) {
    if (!(calc.inputNames as readonly string[]).includes(key)) {
      issues.push({
        kind: "unknown",
        severity: "error",
        where,
        field: key,
        received: describeValue((given as Record<string, unknown>)[key]),
        expected: `one of ${calc.inputNames.join(", ")}`,
      });
    }
  }
  const prepared: PreparedInput[] = [];
  const estimates = {} as Record<I, number>;
  const sets: SourceSet[] = [];
  for (const name of calc.inputNames) {
    const def = calc.inputs[name];
    const g = (given as Record<string, UncertainArgument | undefined>)[name];
    if (isUncertainValue(g)) {
      if (g.method !== options.method) {
        issues.push({
          kind: "type",
          severity: "error",
          where,
          field: name,
          label: def.label,
          received: `a ${g.method === "gum" ? "GUM" : "Monte Carlo"} value`,
          expected: `as a ${
            options.method === "gum" ? "GUM" : "Monte Carlo"
          } value, a distribution or a number (one chain, one method)`,
        });
        continue;
      }
      const factor = unitFactor(g.unit, def.unit);
      if (factor === null) {
        issues.push({
          kind: "unit",
          severity: "error",
          where,
          field: name,
          label: def.label,
          received: `${g.label} in ${g.unit}`,
          expected: `a value in a unit convertible to ${def.unit}`,
        });
        continue;
      }
      if (options.method === "monteCarlo" && !(g.layout?.chainable && g.samples !== null)) {
        issues.push({
          kind: "type",
          severity: "error",
          where,
          field: name,
          label: def.label,
          received: `${g.label} from ${
            g.samples === null ? "a run without kept samples" : "an adaptive run"
          }`,
          expected:
            "a Monte Carlo value with its samples from a fixed-size run (keepSamples, no adaptive procedure)",
        });
        continue;
      }
      const estimate = g.value * factor;
      const checked = checkValue(name, def, estimate, context);
      for (const issue of checked.issues) issues.push(issue);
      if (checked.value === undefined) continue;
      const linear = new Map<string, number>();
      for (const [k, c] of g.sensitivities) linear.set(k, c * factor);
      estimates[name] = estimate;
      sets.push(g.sources);
      prepared.push({
        name,
        estimate,
        standardUncertainty: g.standardUncertainty * Math.abs(factor),
        fresh: null,
        given: g,
        factor,
        linear,
      });
      continue;
    }
    if (g === undefined) {
      const checked = checkValue(name, def, undefined, context);
      for (const issue of checked.issues) issues.push(issue);
      if (checked.value === undefined) continue;
      estimates[name] = checked.value;
      prepared.push({
        name,
        estimate: checked.value,
        standardUncertainty: 0,
        fresh: null,
        given: null,
        factor: 1,
        linear: new Map(),
      });
      continue;
    }
    const resolved = resolveDistribution(g, name, def.unit, where, def.label);
    // a plain value (or an exact one) that cannot be read: the validator says why
    const unreadable = resolved.distribution === undefined && resolved.issues.length === 0
      ? checkValue(name, def, isUncertainInput(g) ? (g as { value?: unknown }).value : g, context)
        .issues
      : [];
    for (const issue of [...resolved.issues, ...unreadable]) issues.push(issue);
    const d = resolved.distribution;
    if (d === undefined) continue;
    const checked = checkValue(name, def, d.estimate, context);
    for (const issue of checked.issues) issues.push(issue);
    if (checked.value === undefined) continue;
    estimates[name] = d.estimate;
    const fresh: Source | null = d.standardUncertainty > 0
      ? {
        key: sourceKey(options.label, name),
        label: options.label ? `${options.label}: ${def.label}` : def.label,
        quantity: def.quantity,
        unit: def.unit,
        distribution: d,
      }
      : null;
    prepared.push({
      name,
      estimate: d.estimate,
      standardUncertainty: d.standardUncertainty,
      fresh,
      given: null,
      factor: 1,
      linear: fresh ? new Map([[fresh.key, 1]]) : new Map(),
    });
  }
  for (const issue of checkConstraints(calc, estimates as Partial<Record<I, number>>)) {
    issues.push(issue);
  }
  throwIfErrors(issues);

  // the sources created here, with their declared correlations
  const freshSources = new Map<string, Source>();
  for (const p of prepared) if (p.fresh) freshSources.set(p.fresh.key, p.fresh);
  const correlations = new Map<string, number>();
  if (options.correlations !== undefined) {
    const names = calc.inputNames as readonly string[];
    const matrix = correlationMatrix(names, options.correlations, where);
    for (let i = 0; i < names.length; i++) {
      for (let j = i + 1; j < names.length; j++) {
        const rho = matrix[i]![j]!;
        if (rho === 0) continue;
        const a = prepared.find((p) => p.name === names[i]);
        const b = prepared.find((p) => p.name === names[j]);
        for (const p of [a, b]) {
          if (p && p.fresh === null) {
            throw new TypeError(
              `${where}: correlation of '${names[i]}' and '${
                names[j]
              }' names '${p.name}', which is ${
                p.given ? "a value from an earlier step" : "exact"
              }; expected correlations only between inputs given as distributions here, got ${rho}`,
            );
          }
        }
        correlations.set(pairKey(a!.fresh!.key, b!.fresh!.key), rho);
      }
    }
  }
  if (freshSources.size > 0) {
    sets.push(Object.freeze({ sources: freshSources, correlations, samples: new Map() }));
  }
  const sources = mergeSources(sets, where);
  const warnings = issues.filter((i) => i.severity === "warning");
  return {
    inputs: prepared,
    estimates: estimates as InputValues<I>,
    sources: sources === NO_SOURCES ? NO_SOURCES : sources,
    warnings,
    correlated: sources.correlations.size > 0,
  };
}

/** Warning messages of prepared inputs. */
export function warningMessages(issues: readonly ValidationIssue[]): string[] {
  return issues.map(renderIssue);
}

/** A warning for draws of an input outside its valid range (Monte Carlo). */
export function outsideDrawsWarning(
  calc: Calculation,
  name: string,
  count: number,
  trials: number,
): string {
  const def = calc.inputs[name]!;
  const label = def.label === name ? "" : ` (${def.label})`;
  return `${count} of ${trials} draws of '${name}'${label} fell outside its valid range ${
    formatRange(def.range, def.unit)
  }: its distribution puts mass where the quantity cannot be`;
}

/** A warning for model values outside an output's valid range (Monte Carlo). */
export function outsideOutputsWarning(
  calc: Calculation,
  name: string,
  count: number,
  trials: number,
): string {
  const def = calc.outputs[name]!;
  const label = def.label === name ? "" : ` (${def.label})`;
  return `${count} of ${trials} model values of '${name}'${label} fell outside its valid range ${
    formatRange(def.quantity.valid, def.unit)
  }: some combinations of input draws are physically inconsistent`;
}
