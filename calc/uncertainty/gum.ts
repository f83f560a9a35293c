/**
 * The GUM law of propagation of uncertainty (JCGM 100:2008 §5) on linear parts: each input is
 * an elementary source or a value carrying its sensitivities to elementary sources, so the
 * output of one calculation feeds the next with its correlations intact. Budgets per source,
 * Welch–Satterthwaite effective degrees of freedom, coverage factors from the t distribution,
 * output covariance, optional second-order terms and a check for first-order inadequacy.
 *
 * @module
 */
import type { Calculation, InputValues } from "../core/types.ts";
import { cautionsOf } from "../core/calculation.ts";
import { checkOutputs } from "../core/evaluate.ts";
import { throwIfErrors } from "../core/issues.ts";
import { tQuantile } from "../stats/distributions.ts";
import { partialDerivative, stepFor } from "./derivatives.ts";
import type { PreparedInput, PreparedInputs } from "./prepare.ts";
import { warningMessages } from "./prepare.ts";
import { budgetOf, linearCovariance, NO_SOURCES, welchSatterthwaite } from "./sources.ts";
import type { Propagation, Source, SourceSet, UncertainValue } from "./types.ts";
import type { InputDefinition, OutputDefinition } from "../core/types.ts";
import { withValueDisplay } from "../../display/uncertainty.ts";

/** Options of the GUM law. */
export interface GumOptions {
  /** Coverage probability of the expanded uncertainty, in (0, 1). @default 0.95 */
  readonly coverage: number;
  /** Add the second-order terms of JCGM 100:2008 §5.1.2 note (uncorrelated elementary inputs
   * given here). @default false */
  readonly secondOrder?: boolean;
}

/** k = t_{(1+p)/2}(ν) with ν truncated to an integer (JCGM 100:2008 §G.6.4; normal for ν = ∞). */
export function coverageFactor(coverage: number, dof: number): number {
  const nu = Number.isFinite(dof) ? Math.max(1, Math.floor(dof)) : Infinity;
  return tQuantile((1 + coverage) / 2, nu);
}

interface ValueParts {
  readonly name: string;
  readonly def: InputDefinition | OutputDefinition;
  readonly value: number;
  readonly linear: ReadonlyMap<string, number>;
  readonly sources: SourceSet;
  readonly coverage: number;
  readonly secondOrder?: number;
  readonly firstOrderAdequate?: boolean;
}

/** An uncertain value of the GUM law from its linear part. Returns the value and, when its
 * degrees of freedom are not defined, the reason. */
export function gumValue(parts: ValueParts): { value: UncertainValue; dofNote: string | null } {
  const { sources, linear, coverage } = parts;
  const first = linearCovariance(sources, linear, linear);
  const second = parts.secondOrder ?? 0;
  const variance = Math.max(first + second, 0);
  const u = Math.sqrt(variance);
  let diagonal = 0;
  for (const [key, c] of linear) {
    diagonal += (c * (sources.sources.get(key)?.distribution.standardUncertainty ?? 0)) ** 2;
  }
  const ws = welchSatterthwaite(sources, linear, variance);
  let k: number;
  let dofNote: string | null = null;
  if (ws.dof === null) {
    // conservative: the smallest degrees of freedom among the contributing sources
    let smallest = Infinity;
    for (const [key, c] of linear) {
      const d = sources.sources.get(key)?.distribution;
      if (d && c !== 0 && d.standardUncertainty > 0) smallest = Math.min(smallest, d.dof);
    }
    k = coverageFactor(coverage, smallest);
    dofNote = `'${parts.name}': ν_eff is not defined because ${ws.reason}; k = ${
      k.toFixed(2)
    } is taken, conservatively, from the smallest degrees of freedom of its sources (${smallest})`;
  } else {
    k = coverageFactor(coverage, ws.dof);
  }
  const U = k * u;
  const value: UncertainValue = withValueDisplay({
    kind: "sonorigor.uncertainValue" as const,
    name: parts.name,
    label: parts.def.label,
    quantity: parts.def.quantity,
    unit: parts.def.unit,
    method: "gum" as const,
    value: parts.value,
    standardUncertainty: u,
    coverage,
    interval: Object.freeze({ lower: parts.value - U, upper: parts.value + U }),
    expandedUncertainty: U,
    coverageFactor: k,
    effectiveDof: ws.dof,
    budget: Object.freeze(budgetOf(sources, linear, variance)),
    correlationShare: variance > 0 ? (first - diagonal) / variance : 0,
    secondOrderShare: variance > 0 ? second / variance : 0,
    firstOrderAdequate: parts.firstOrderAdequate ?? true,
    sensitivities: linear,
    sources,
    samples: null,
    shortestInterval: null,
    layout: null,
  });
  return { value, dofNote };
}

/** The uncertain value of one input of a GUM propagation. */
function inputValue(
  calc: Calculation,
  p: PreparedInput,
  sources: SourceSet,
  coverage: number,
): UncertainValue {
  if (p.given !== null && p.factor === 1) return p.given;
  const own: SourceSet = p.fresh ? sourceOnly(p.fresh) : p.given ? sources : NO_SOURCES;
  return gumValue({
    name: p.name,
    def: calc.inputs[p.name]!,
    value: p.estimate,
    linear: p.linear,
    sources: own,
    coverage,
  }).value;
}

/** The set of one fresh source (its correlations with others travel with the outputs' sets). */
function sourceOnly(source: Source): SourceSet {
  return { sources: new Map([[source.key, source]]), correlations: new Map(), samples: new Map() };
}

/**
 * Propagates prepared inputs through a calculation by the law of propagation of uncertainty
 * (JCGM 100:2008 §5.1–5.2, eq. (10) and (13)) on linear parts: the new linear part of output j
 * is Σᵢ (∂fⱼ/∂xᵢ)·linearPart(xᵢ), so y = f(g(a, b), b) counts b once.
 *
 * u_c²(y) = Σₖ Σₗ cₖ cₗ u(sₖ) u(sₗ) r(sₖ, sₗ) over the elementary sources s;
 * ν_eff = u_c⁴ / Σ (cₖu(sₖ))⁴/νₖ (eq. G.2b); k = t_{(1+p)/2}(⌊ν_eff⌋); U = k·u_c.
 * With `secondOrder`, adds Σᵢ Σⱼ [½(∂²f/∂xᵢ∂xⱼ)² + ∂f/∂xᵢ·∂³f/∂xᵢ∂xⱼ²] u²(xᵢ)u²(xⱼ) (JCGM 100
 * §5.1.2 note, uncorrelated normal inputs).
 *
 * @throws {RangeError} For a non-finite or impossible output or sensitivity at the estimates.
 */
export function propagateGum<I extends string, O extends string>(
  calc: Calculation<I, O>,
  prepared: PreparedInputs<I>,
  options: GumOptions,
): Propagation<I, O> {
  const { coverage } = options;
  const x = prepared.estimates;
  const y = calc.formula(x);
  throwIfErrors(checkOutputs(calc, x, y));
  const c = calc as unknown as Calculation;
  const inputs = prepared.inputs;
  const steps: Record<string, number> = {};
  for (const p of inputs) steps[p.name] = stepFor(p.estimate, p.standardUncertainty, 1e-3);
  const warnings = warningMessages(prepared.warnings);
  const xr = x as unknown as Record<string, number>;
  const jacobian = calc.outputNames.map((o) =>
    inputs.map((p) => {
      if (p.standardUncertainty === 0) return 0;
      const d = partialDerivative(c, o, [p.name], xr, steps);
      if (!Number.isFinite(d)) {
        throw new RangeError(
          `${calc.title}: sensitivity of '${o}' to '${p.name}' is not finite at the estimates, got ${d}`,
        );
      }
      return d;
    })
  );
  const canSecondOrder = inputs.every((p) => p.given === null) && !prepared.correlated;
  if (options.secondOrder && !canSecondOrder) {
    warnings.push(
      "Second-order terms need uncorrelated inputs given here as distributions; they are omitted",
    );
  }
  const sources = prepared.sources;
  const outputs = {} as Record<O, UncertainValue>;
  const linearParts: Map<string, number>[] = [];
  calc.outputNames.forEach((o, index) => {
    const row = jacobian[index]!;
    const linear = new Map<string, number>();
    inputs.forEach((p, i) => {
      const ci = row[i]!;
      // a zero sensitivity still lists the source (with no contribution), as budgets do
      for (const [k, s] of p.linear) linear.set(k, (linear.get(k) ?? 0) + ci * s);
    });
    linearParts.push(linear);
    let second = 0;
    if (options.secondOrder && canSecondOrder) {
      const hsteps: Record<string, number> = {};
      for (const p of inputs) hsteps[p.name] = stepFor(p.estimate, p.standardUncertainty, 0.05);
      for (let i = 0; i < inputs.length; i++) {
        const ui = inputs[i]!.standardUncertainty;
        if (ui === 0) continue;
        for (let j = 0; j < inputs.length; j++) {
          const uj = inputs[j]!.standardUncertainty;
          if (uj === 0) continue;
          const ni = inputs[i]!.name, nj = inputs[j]!.name;
          const fij = partialDerivative(c, o, [ni, nj], xr, hsteps);
          const fijj = partialDerivative(c, o, [ni, nj, nj], xr, hsteps);
          second += (0.5 * fij ** 2 + row[i]! * fijj) * ui ** 2 * uj ** 2;
        }
      }
    }
    const inadequate = linearityWarnings(calc, o, x, inputs, row, Boolean(options.secondOrder));
    const { value, dofNote } = gumValue({
      name: o,
      def: calc.outputs[o],
      value: y[o],
      linear,
      sources,
      coverage,
      secondOrder: second,
      firstOrderAdequate: inadequate.length === 0,
    });
    outputs[o] = value;
    for (const w of inadequate) warnings.push(w);
    if (dofNote) warnings.push(dofNote);
  });
  const covariance = linearParts.map((a) =>
    linearParts.map((b) => linearCovariance(sources, a, b))
  );
  // the inputs' own uncertain values are built when first asked for: a propagation per table row
  // reads its outputs only (building them was about a fifth of a 10-input propagation's time)
  let inputValues: Record<I, UncertainValue> | undefined;
  return {
    kind: "sonorigor.propagation",
    calculation: calc,
    method: "gum",
    coverage,
    get inputs(): Record<I, UncertainValue> {
      if (inputValues === undefined) {
        inputValues = {} as Record<I, UncertainValue>;
        for (const p of inputs) inputValues[p.name as I] = inputValue(c, p, sources, coverage);
      }
      return inputValues;
    },
    outputs,
    outputNames: calc.outputNames,
    covariance,
    correlation: correlationFromCovariance(covariance),
    warnings,
    cautions: cautionsOf(calc),
    monteCarlo: null,
  };
}

/** The correlation matrix of a covariance matrix (0 where a variance is 0). */
export function correlationFromCovariance(cov: readonly (readonly number[])[]): number[][] {
  return cov.map((row, a) =>
    row.map((v, b) => {
      if (a === b) return 1;
      const d = Math.sqrt(cov[a]![a]! * cov[b]![b]!);
      return d > 0 ? v / d : 0;
    })
  );
}

/** Flags inputs whose effect over ±u is far from the first-order prediction (curvature). */
function linearityWarnings<I extends string, O extends string>(
  calc: Calculation<I, O>,
  output: O,
  x: InputValues<I>,
  inputs: readonly PreparedInput[],
  row: readonly number[],
  secondOrder: boolean,
): string[] {
  const warnings: string[] = [];
  const f = (v: Record<string, number>) =>
    (calc.formula(v as InputValues<I>) as Record<string, number>)[output]!;
  const xr = x as unknown as Record<string, number>;
  const y0 = f(xr);
  const uc = Math.sqrt(inputs.reduce((s, p, i) => s + (row[i]! * p.standardUncertainty) ** 2, 0));
  inputs.forEach((p, i) => {
    const ui = p.standardUncertainty;
    if (!(ui > 0)) return;
    const plus = f({ ...xr, [p.name]: xr[p.name]! + ui });
    const minus = f({ ...xr, [p.name]: xr[p.name]! - ui });
    if (!Number.isFinite(plus) || !Number.isFinite(minus)) return;
    const curvature = Math.abs(plus + minus - 2 * y0) / 2; // ≈ ½|f''|u²
    const linear = Math.abs(row[i]! * ui);
    if (
      curvature > 0.1 * Math.max(linear, 1e-300) && curvature > 1e-3 * Math.max(uc, 1e-300) &&
      curvature > 1e-12 * Math.abs(y0)
    ) {
      warnings.push(
        `First-order propagation is inadequate for ${calc.outputs[output]!.label} with respect to ${
          calc.inputs[p.name as I]!.label
        }: over ±u the output moves by ${
          curvature.toPrecision(2)
        } from curvature against a first-order contribution of ${linear.toPrecision(2)}${
          linear < 1e-12 ? " (the sensitivity vanishes at the estimate)" : ""
        }; ${
          secondOrder ? "second-order terms are included, but " : ""
        }use the Monte Carlo method for an honest uncertainty and interval`,
      );
    }
  });
  return warnings;
}
