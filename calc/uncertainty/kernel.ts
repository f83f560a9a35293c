/**
 * Column kernels: the Monte Carlo loop that evaluates a calculation's formula over input columns,
 * generated once per calculation so that the formula call site sees one function only (the
 * JavaScript engine can then inline the formula and drop the per-trial argument and result
 * objects). The kernel only loops and copies; the formula is the calculation's own.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";

/** Evaluates `formula` for trials 0 … m − 1; returns the first trial with a non-finite output,
 * or −1. */
export type ColumnKernel = (
  formula: Calculation["formula"],
  columns: readonly Float64Array[],
  results: readonly Float64Array[],
  m: number,
) => number;

const kernels = new WeakMap<Calculation, ColumnKernel>();

/** The column kernel of a calculation (built on first use, then cached). */
export function columnKernel(calc: Calculation): ColumnKernel {
  let kernel = kernels.get(calc);
  if (kernel) return kernel;
  const key = (name: string) => JSON.stringify(name);
  const ins = calc.inputNames;
  const outs = calc.outputNames;
  const source = [
    '"use strict";',
    `const x = { ${ins.map((n) => `${key(n)}: 0`).join(", ")} };`,
    ...ins.map((_, i) => `const c${i} = columns[${i}];`),
    ...outs.map((_, k) => `const o${k} = results[${k}];`),
    "for (let r = 0; r < m; r++) {",
    ...ins.map((n, i) => `  x[${key(n)}] = c${i}[r];`),
    "  const y = formula(x);",
    ...outs.map((n, k) => `  const v${k} = y[${key(n)}];`),
    `  if (${outs.map((_, k) => `!(v${k} - v${k} === 0)`).join(" || ")}) return r;`,
    ...outs.map((_, k) => `  o${k}[r] = v${k};`),
    "}",
    "return -1;",
  ].join("\n");
  kernel = new Function("formula", "columns", "results", "m", source) as ColumnKernel;
  kernels.set(calc, kernel);
  return kernel;
}
