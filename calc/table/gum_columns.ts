/**
 * The GUM law of propagation of uncertainty over every row of a table, column by column: the
 * same arithmetic as {@linkcode propagate} applies to one row (sensitivities by the same
 * Richardson-extrapolated central differences with the same steps, the same sum of squares in
 * the same order, the same coverage factor), done as whole-column passes through the
 * calculation's column loop instead of one propagation per row. Each row's numbers are
 * identical, bit for bit, to that row's propagation (tests/table/gum_columns_test.ts checks it
 * on random rows); rows the column passes cannot settle are marked for a propagation of their
 * own.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { columnLoop, runColumnLoop } from "../core/columns.ts";
import { inRange } from "../core/range.ts";
import { coverageFactor } from "../uncertainty/gum.ts";

/** What {@linkcode gumColumns} computed: one column per output of each result, and the rows
 * left to a propagation of their own. */
export interface GumColumns {
  /** The output at the estimates, per output. */
  readonly value: readonly Float64Array<ArrayBuffer>[];
  /** The combined standard uncertainty u_c, per output. */
  readonly standardUncertainty: readonly Float64Array<ArrayBuffer>[];
  /** value − k·u_c, per output. */
  readonly lower: readonly Float64Array<ArrayBuffer>[];
  /** value + k·u_c, per output. */
  readonly upper: readonly Float64Array<ArrayBuffer>[];
  /** 1 for a row to propagate on its own: an uncertainty that is not a finite number ≥ 0, an
   * output not finite or outside its valid range, or a sensitivity the central differences do
   * not give as a finite number (the propagation then tries one-sided differences or says why
   * the row cannot be computed). Its numbers here are NaN. */
  readonly perRow: Uint8Array;
}

/**
 * The GUM law over columns: for each row i not marked in `skip`, the inputs are independent
 * normal sources with estimates `inputs[k][i]` and standard uncertainties
 * `uncertainties[k][i]` (an exact input where the column is null or the value 0), and
 *
 * cₖ = (4·D(h/2) − D(h))/3 with D(s) = (f(x + s·eₖ) − f(x − s·eₖ))/(2s) and h = 10⁻³·u(xₖ),
 * u_c² = Σₖ cₖ²·u²(xₖ) (in input order), k = t_{(1+p)/2}(∞), interval y ± k·u_c
 *
 * (JCGM 100:2008 eq. (10) and §G.6.4; Richardson extrapolation as in the sensitivity of
 * {@linkcode propagate}). Every source is normal with infinitely many degrees of freedom, so the
 * Welch–Satterthwaite degrees of freedom are infinite and k is the normal quantile.
 *
 * @param calc The calculation (without exact partial derivatives: those go row by row).
 * @param inputs One column per input, in the calculation's input order, canonical units.
 * @param uncertainties One column of standard uncertainties per input, null for an exact input.
 * @param skip Rows not to compute (their numbers stay NaN and they are not marked per row).
 * @param coverage Coverage probability p, in (0, 1).
 * @returns The result columns and the rows left to a propagation of their own.
 *
 * @example One row by hand: y = π·d²/4·v₁/v₂ with d = 2 ± 0.1 cm (v₁ = 20 cm, v₂ = 80 cm exact)
 * ```ts
 * import { continuityValveArea } from "@sonorigor/sonorigor";
 * import { gumColumns } from "./gum_columns.ts";
 * import assert from "node:assert/strict";
 * const r = gumColumns(
 *   continuityValveArea,
 *   [Float64Array.of(2), Float64Array.of(20), Float64Array.of(80)],
 *   [Float64Array.of(0.1), null, null],
 *   new Uint8Array(1),
 *   0.95,
 * );
 * // u = ∂y/∂d·u(d) = π·d/2·v₁/v₂·0.1 = π/4·0.1 = 0.0785 cm² (hand computation)
 * assert.ok(Math.abs(r.standardUncertainty[0]![0]! - Math.PI / 40) < 1e-9);
 * ```
 */
export function gumColumns(
  calc: Calculation,
  inputs: readonly Float64Array[],
  uncertainties: readonly (Float64Array | null)[],
  skip: Uint8Array,
  coverage: number,
): GumColumns {
  const n = skip.length;
  const outs = calc.outputNames;
  const loop = columnLoop(calc, "lenient");
  const formula = calc.formula;
  const columns = () => outs.map(() => new Float64Array(n));
  const value = columns();
  runColumnLoop(loop, formula, inputs, value, n);
  const variance = columns();
  const perRow = new Uint8Array(n);
  // the four shifted evaluations of one input: x ± h and x ± h/2
  const plus = columns(), minus = columns(), plusHalf = columns(), minusHalf = columns();
  const shifted = new Float64Array(n);
  for (let k = 0; k < inputs.length; k++) {
    const u = uncertainties[k];
    if (!u) continue;
    const x = inputs[k]!;
    const args = inputs.map((c, j) => j === k ? shifted : c);
    const evaluateShifted = (sign: number, fraction: number, into: Float64Array[]) => {
      // x + (−s) is x − s exactly, as the propagation's shift by −s
      for (let i = 0; i < n; i++) shifted[i] = x[i]! + sign * ((u[i]! * 1e-3) / fraction);
      runColumnLoop(loop, formula, args, into, n);
    };
    evaluateShifted(1, 1, plus);
    evaluateShifted(-1, 1, minus);
    evaluateShifted(1, 2, plusHalf);
    evaluateShifted(-1, 2, minusHalf);
    for (let i = 0; i < n; i++) {
      if (skip[i] || perRow[i]) continue;
      const ui = u[i]!;
      if (!(ui >= 0 && ui < Infinity)) {
        perRow[i] = 1;
        continue;
      }
      if (ui === 0) continue; // an exact value: no source, no sensitivity
      const h = ui * 1e-3;
      const half = h / 2;
      for (let o = 0; o < outs.length; o++) {
        const d1 = (plus[o]![i]! - minus[o]![i]!) / (2 * h);
        const d2 = (plusHalf[o]![i]! - minusHalf[o]![i]!) / (2 * half);
        const c = (4 * d2 - d1) / 3;
        if (!(c - c === 0)) {
          perRow[i] = 1;
          break;
        }
        if (c === 0) continue;
        variance[o]![i]! += c * c * ui * ui;
      }
    }
  }
  const factor = coverageFactor(coverage, Infinity);
  // u_c replaces the variance in place; the shifted evaluations' columns take the interval ends
  const standardUncertainty = variance, lower = plus, upper = minus;
  const ranges = outs.map((o) => calc.outputs[o]!.quantity.valid);
  for (let i = 0; i < n; i++) {
    let settled = !(skip[i] || perRow[i]);
    for (let o = 0; settled && o < outs.length; o++) {
      const y = value[o]![i]!;
      if (!(y - y === 0 && inRange(y, ranges[o]!))) {
        perRow[i] = 1;
        settled = false;
      }
    }
    for (let o = 0; o < outs.length; o++) {
      if (!settled) {
        value[o]![i] =
          standardUncertainty[o]![i] =
          lower[o]![i] =
          upper[o]![i] =
            NaN;
        continue;
      }
      const y = value[o]![i]!;
      const uc = Math.sqrt(Math.max(variance[o]![i]! + 0, 0));
      const expanded = factor * uc;
      standardUncertainty[o]![i] = uc;
      lower[o]![i] = y - expanded;
      upper[o]![i] = y + expanded;
    }
  }
  return { value, standardUncertainty, lower, upper, perRow };
}
