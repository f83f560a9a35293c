/**
 * The GUM law of propagation of uncertainty (JCGM 100:2008 §5) with correlations, budgets,
 * Welch–Satterthwaite effective degrees of freedom, coverage factors from the t distribution,
 * multi-output covariance, optional second-order terms, and a check for first-order inadequacy.
 *
 * @module
 */
import type { Calculation, InputValues } from "../core/types.ts";
import { cautionsOf, checkOutputs } from "../core/define.ts";
import { JUPYTER_DISPLAY, type MimeBundle } from "../core/display.ts";
import { tQuantile } from "../stats/distributions.ts";
import type { Correlations } from "./correlation.ts";
import { partialDerivative, stepFor } from "./derivatives.ts";
import { prepareInputs, type UncertainInputs } from "./prepare.ts";
import { displayGum } from "./display.ts";

/** Options of {@linkcode gum}. */
export interface GumOptions {
  /** Coverage probability of the expanded uncertainty, in (0, 1). @default 0.95 */
  readonly coverage?: number;
  /** Correlations between inputs (pairs or a full matrix). @default uncorrelated */
  readonly correlations?: Correlations;
  /** Add the second-order terms of JCGM 100:2008 §5.1.2 note (uncorrelated inputs). @default false */
  readonly secondOrder?: boolean;
}

/** One row of an uncertainty budget. */
export interface BudgetRow {
  /** Input name. */
  readonly input: string;
  /** Unit of the input. */
  readonly unit: string;
  /** Distribution of the input. */
  readonly distribution: string;
  /** Input estimate xᵢ. */
  readonly estimate: number;
  /** Standard uncertainty u(xᵢ). */
  readonly standardUncertainty: number;
  /** Degrees of freedom νᵢ. */
  readonly dof: number;
  /** Sensitivity coefficient cᵢ = ∂f/∂xᵢ. */
  readonly sensitivity: number;
  /** Uncertainty contribution uᵢ(y) = cᵢ·u(xᵢ) (signed). */
  readonly contribution: number;
  /** Share of the combined variance, cᵢ²u²(xᵢ)/u²(y) (excludes correlation terms). */
  readonly share: number;
}

/** The GUM result for one output. */
export interface GumOutput {
  /** Output name. */
  readonly output: string;
  /** Unit of the output. */
  readonly unit: string;
  /** Estimate y = f(x). */
  readonly value: number;
  /** Combined standard uncertainty u_c(y). */
  readonly standardUncertainty: number;
  /** Share of u_c²(y) due to correlation terms. */
  readonly correlationShare: number;
  /** Share of u_c²(y) due to second-order terms (0 unless requested). */
  readonly secondOrderShare: number;
  /** Welch–Satterthwaite effective degrees of freedom (JCGM 100 eq. G.2b). */
  readonly effectiveDof: number;
  /** Coverage factor k = t_p(ν_eff) with ν_eff truncated to an integer (JCGM 100 §G.6.4). */
  readonly coverageFactor: number;
  /** Expanded uncertainty U = k·u_c(y). */
  readonly expandedUncertainty: number;
  /** Coverage interval [y − U, y + U]. */
  readonly interval: readonly [number, number];
  /** Per-input budget. */
  readonly budget: readonly BudgetRow[];
  /** False when the curvature check found the first-order (linear) result inadequate for this
   * output; its uncertainty and interval are then not to be reported (use Monte Carlo). */
  readonly firstOrderAdequate: boolean;
}

/** Result of {@linkcode gum}. */
export interface GumResult<O extends string = string> {
  /** Calculation title. */
  readonly title: string;
  /** Calculation id. */
  readonly id: string;
  /** Coverage probability. */
  readonly coverage: number;
  /** Results per output. */
  readonly outputs: { readonly [K in O]: GumOutput };
  /** Output names in order. */
  readonly outputNames: readonly O[];
  /** Output covariance matrix J·V·Jᵀ (first-order). */
  readonly covariance: readonly (readonly number[])[];
  /** Output correlation matrix. */
  readonly correlation: readonly (readonly number[])[];
  /** Warnings: first-order inadequacy, estimates outside validated ranges, W–S with correlation. */
  readonly warnings: readonly string[];
  /** Cautions of the calculation. */
  readonly cautions: readonly string[];
  /** Notebook display: value ± U and the budget table. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Checks a coverage probability. */
export function checkCoverage(p: number, where: string): number {
  if (!(p > 0 && p < 1)) {
    throw new RangeError(`${where}: expected coverage probability in (0, 1), got ${p}`);
  }
  return p;
}

/**
 * Propagates input uncertainties through a calculation with the law of propagation of uncertainty
 * (JCGM 100:2008 §5.1–5.2, eq. (10) and (13)), for every output.
 *
 * u_c²(y) = Σᵢ Σⱼ cᵢ cⱼ u(xᵢ) u(xⱼ) r(xᵢ, xⱼ), cᵢ = ∂f/∂xᵢ at the estimates;
 * ν_eff = u_c⁴ / Σ (cᵢu(xᵢ))⁴/νᵢ (eq. G.2b); k = t_{(1+p)/2}(⌊ν_eff⌋); U = k·u_c.
 * With `secondOrder`, adds Σᵢ Σⱼ [½(∂²f/∂xᵢ∂xⱼ)² + ∂f/∂xᵢ·∂³f/∂xᵢ∂xⱼ²] u²(xᵢ)u²(xⱼ)
 * (JCGM 100:2008 §5.1.2 note, for uncorrelated normal inputs).
 *
 * Where an input's first-order contribution is much smaller than the change of the output over
 * ±u(xᵢ) (a vanishing sensitivity, as for an insonation angle near 0°), a warning says the
 * linear law is inadequate and points to Monte Carlo.
 *
 * @param calc The calculation.
 * @param inputs Uncertain inputs by name (plain values are exact).
 * @param options Coverage probability, correlations, second-order terms.
 * @returns Estimates, uncertainties, budgets and output covariance.
 * @throws {TypeError} For unknown or missing inputs or wrong units.
 * @throws {RangeError} For a coverage outside (0, 1), bad uncertainties or correlations, or a
 * non-finite output.
 *
 * @example Peak gradient 4v² with v = 4.0 ± 0.1 m/s
 * ```ts
 * import { expressionModel, gum, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = expressionModel({
 *   expression: "4 * v^2",
 *   inputs: { v: { unit: "m/s", description: "Peak velocity", range: { min: 0, max: 10 } } },
 *   output: { name: "gradient", unit: "mmHg", description: "Peak gradient" },
 * });
 * const r = gum(model, { v: normal(4, 0.1) });
 * // c = 8v = 32 mmHg per m/s → u = 3.2 mmHg (hand-checkable from eq. (10))
 * assert.ok(Math.abs(r.outputs.gradient.standardUncertainty - 3.2) < 1e-9);
 * ```
 */
export function gum<I extends string, O extends string>(
  calc: Calculation<I, O>,
  inputs: UncertainInputs<I>,
  options: GumOptions = {},
): GumResult<O> {
  const coverage = checkCoverage(options.coverage ?? 0.95, calc.title);
  const prepared = prepareInputs(calc, inputs, options.correlations);
  const { estimates, correlation } = prepared;
  const resolved = prepared.inputs;
  const x = estimates as InputValues<I>;
  const y = checkOutputs(calc, x, calc.formula(x));
  const names = calc.inputNames as readonly string[];
  const n = names.length;
  const steps: Record<string, number> = {};
  for (const r of resolved) steps[r.name] = stepFor(r.estimate, r.standardUncertainty, 1e-3);
  const warnings = [...prepared.flags];
  const c = calc as unknown as Calculation;
  const u = resolved.map((r) => r.standardUncertainty);

  const jacobian = calc.outputNames.map((o) =>
    names.map((name, i) => {
      const d = partialDerivative(c, o, [name], x as Record<string, number>, steps);
      if (!Number.isFinite(d)) {
        if (u[i] === 0) return 0;
        throw new RangeError(
          `${calc.title}: sensitivity of '${o}' to '${name}' is not finite at the estimates, got ${d}`,
        );
      }
      return d;
    })
  );

  if (options.secondOrder && prepared.correlated) {
    warnings.push(
      "Second-order terms assume uncorrelated inputs; the correlated inputs' second-order cross terms are omitted",
    );
  }
  const outputs = {} as Record<O, GumOutput>;
  calc.outputNames.forEach((o, index) => {
    const cRow = jacobian[index]!;
    let firstOrder = 0;
    let diagonal = 0;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        firstOrder += cRow[i]! * cRow[j]! * u[i]! * u[j]! * correlation[i]![j]!;
      }
      diagonal += (cRow[i]! * u[i]!) ** 2;
    }
    let second = 0;
    if (options.secondOrder) {
      const hsteps: Record<string, number> = {};
      for (const r of resolved) hsteps[r.name] = stepFor(r.estimate, r.standardUncertainty, 0.05);
      for (let i = 0; i < n; i++) {
        if (u[i] === 0) continue;
        for (let j = 0; j < n; j++) {
          if (u[j] === 0) continue;
          const xr = x as Record<string, number>;
          const fij = partialDerivative(c, o, [names[i]!, names[j]!], xr, hsteps);
          const fijj = partialDerivative(c, o, [names[i]!, names[j]!, names[j]!], xr, hsteps);
          second += (0.5 * fij ** 2 + cRow[i]! * fijj) * u[i]! ** 2 * u[j]! ** 2;
        }
      }
    }
    const variance = Math.max(firstOrder + second, 0);
    const uc = Math.sqrt(variance);
    let denominator = 0;
    for (let i = 0; i < n; i++) {
      const ci = (cRow[i]! * u[i]!) ** 4;
      if (ci > 0) denominator += ci / resolved[i]!.dof;
    }
    const effectiveDof = denominator > 0 ? variance ** 2 / denominator : Infinity;
    const dofForK = Number.isFinite(effectiveDof)
      ? Math.max(1, Math.floor(effectiveDof))
      : Infinity;
    const k = tQuantile((1 + coverage) / 2, dofForK);
    const U = k * uc;
    const value = y[o];
    const budget = resolved.map((r, i): BudgetRow => ({
      input: r.name,
      unit: calc.inputs[r.name as I].unit,
      distribution: r.kind,
      estimate: r.estimate,
      standardUncertainty: r.standardUncertainty,
      dof: r.dof,
      sensitivity: cRow[i]!,
      contribution: cRow[i]! * r.standardUncertainty,
      share: variance > 0 ? (cRow[i]! * r.standardUncertainty) ** 2 / variance : 0,
    }));
    const inadequate = linearityWarnings(
      calc,
      o,
      x,
      resolved.map((r) => r.name),
      u,
      uc,
      cRow,
      Boolean(options.secondOrder),
    );
    outputs[o] = {
      output: o,
      unit: calc.outputs[o].unit,
      value,
      standardUncertainty: uc,
      correlationShare: variance > 0 ? (firstOrder - diagonal) / variance : 0,
      secondOrderShare: variance > 0 ? second / variance : 0,
      effectiveDof,
      coverageFactor: k,
      expandedUncertainty: U,
      interval: [value - U, value + U],
      budget,
      firstOrderAdequate: inadequate.length === 0,
    };
    warnings.push(...inadequate);
  });
  if (prepared.correlated) {
    warnings.push(
      "Welch–Satterthwaite effective degrees of freedom assume independent inputs; with correlated inputs treat ν_eff as approximate",
    );
  }

  const m = calc.outputNames.length;
  const covariance: number[][] = [];
  for (let a = 0; a < m; a++) {
    covariance.push([]);
    for (let b = 0; b < m; b++) {
      let s = 0;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          s += jacobian[a]![i]! * jacobian[b]![j]! * u[i]! * u[j]! * correlation[i]![j]!;
        }
      }
      covariance[a]!.push(s);
    }
  }
  const outputCorrelation = covariance.map((row, a) =>
    row.map((v, b) => {
      const d = Math.sqrt(covariance[a]![a]! * covariance[b]![b]!);
      return a === b ? 1 : d > 0 ? v / d : 0;
    })
  );
  const result: GumResult<O> = {
    title: calc.title,
    id: calc.id,
    coverage,
    outputs,
    outputNames: calc.outputNames,
    covariance,
    correlation: outputCorrelation,
    warnings,
    cautions: cautionsOf(calc as unknown as Calculation),
    [JUPYTER_DISPLAY]: () => displayGum(result as GumResult),
  };
  return result;
}

/** Flags inputs whose effect over ±u is far from the first-order prediction (curvature). */
function linearityWarnings<I extends string, O extends string>(
  calc: Calculation<I, O>,
  output: O,
  x: InputValues<I>,
  names: readonly string[],
  u: readonly number[],
  uc: number,
  cRow: readonly number[],
  secondOrder: boolean,
): string[] {
  const warnings: string[] = [];
  const y0 = (calc.formula(x) as Record<string, number>)[output]!;
  names.forEach((name, i) => {
    const ui = u[i]!;
    if (!(ui > 0)) return;
    const plus =
      (calc.formula({ ...x, [name]: (x as Record<string, number>)[name]! + ui }) as Record<
        string,
        number
      >)[output]!;
    const minus =
      (calc.formula({ ...x, [name]: (x as Record<string, number>)[name]! - ui }) as Record<
        string,
        number
      >)[output]!;
    if (!Number.isFinite(plus) || !Number.isFinite(minus)) return;
    const curvature = Math.abs(plus + minus - 2 * y0) / 2; // ≈ ½|f''|u²
    const linear = Math.abs(cRow[i]! * ui);
    if (
      curvature > 0.1 * Math.max(linear, 1e-300) && curvature > 1e-3 * Math.max(uc, 1e-300) &&
      curvature > 1e-12 * Math.abs(y0)
    ) {
      warnings.push(
        `First-order propagation is inadequate for '${output}' with respect to '${name}': over ±u the output moves by ${
          curvature.toPrecision(2)
        } from curvature against a first-order contribution of ${linear.toPrecision(2)}${
          linear < 1e-12 ? " (the sensitivity vanishes at the estimate)" : ""
        }; ${
          secondOrder ? "second-order terms are included, but " : ""
        }use monteCarlo() for an honest uncertainty and interval`,
      );
    }
  });
  return warnings;
}
