/**
 * Column loops: the loop that evaluates a calculation's formula over input columns (Monte Carlo
 * trials, table rows), generated once per calculation so that the formula call site sees one
 * function only (the JavaScript engine can then inline the formula and drop the per-row argument
 * and result objects). The loop only copies; the formula is the calculation's own.
 *
 * @module
 */
import type { Calculation } from "./types.ts";

/** Evaluates `formula` for rows 0 … m − 1; in strict mode returns the first row with a
 * non-finite output (−1 when none), in lenient mode writes every value (NaN included) and
 * returns −1. */
export type ColumnLoop = (
  formula: Calculation["formula"],
  columns: readonly Float64Array[],
  results: readonly Float64Array[],
  m: number,
) => number;

const strictLoops = new WeakMap<Calculation, ColumnLoop>();
const lenientLoops = new WeakMap<Calculation, ColumnLoop>();

/** The column loop of a calculation (built on first use, then cached). The argument object is a
 * fresh literal per row, not one object refilled: with the formula inlined the engine then drops
 * it whole, whereas refilled fields (their hidden class shared with the definition's `inputs`
 * literal, so not kept as raw doubles) boxed every value, a heap allocation per input and row
 * (Haycock BSA over 10⁶ rows: 36 → 27 ms, 49 → 0 young-generation collections; bench/analysis.md). */
export function columnLoop(
  calc: Calculation,
  mode: "strict" | "lenient" = "strict",
): ColumnLoop {
  const loops = mode === "strict" ? strictLoops : lenientLoops;
  let loop = loops.get(calc);
  if (loop) return loop;
  const key = (name: string) => JSON.stringify(name);
  const ins = calc.inputNames;
  const outs = calc.outputNames;
  const source = [
    '"use strict";',
    ...ins.map((_, i) => `const c${i} = columns[${i}];`),
    ...outs.map((_, k) => `const o${k} = results[${k}];`),
    "for (let r = 0; r < m; r++) {",
    `  const y = formula({ ${ins.map((n, i) => `${key(n)}: c${i}[r]`).join(", ")} });`,
    ...outs.map((n, k) => `  const v${k} = y[${key(n)}];`),
    mode === "strict"
      ? `  if (${outs.map((_, k) => `!(v${k} - v${k} === 0)`).join(" || ")}) return r;`
      : "",
    ...outs.map((_, k) => `  o${k}[r] = v${k};`),
    "}",
    "return -1;",
  ].join("\n");
  loop = new Function("formula", "columns", "results", "m", source) as ColumnLoop;
  loops.set(calc, loop);
  return loop;
}

/**
 * Runs a column loop (see {@linkcode columnLoop}) from one call site shared by every loop. The
 * engine has seen that site call several functions (the warm-up below), so it never inlines a
 * loop into the function that runs it: each loop keeps its own optimised code, in which the
 * formula has the whole inlining budget. Called directly, a loop was sometimes inlined into the
 * Monte Carlo block runner with part of the formula left out, and that process then allocated the
 * formula's argument and result objects on every row: 9 of 30 fresh processes ran the Monte Carlo
 * model of bench/analysis.md about 30 % slower throughout, none of 20 through this site.
 *
 * @param loop The loop.
 * @param formula The calculation's formula.
 * @param columns One array per input, in the calculation's input order.
 * @param results One array per output.
 * @param m Rows.
 * @returns What the loop returns (the first row with a non-finite output in strict mode, else −1).
 *
 * @example
 * ```ts
 * import { columnLoop, runColumnLoop } from "./columns.ts";
 * import { defineCalculation } from "./calculation.ts";
 * import assert from "node:assert/strict";
 * const half = defineCalculation({
 *   id: "exampleHalf", title: "Half", description: "y = x / 2",
 *   inputs: { x: { unit: "1", description: "x", range: { min: -10, max: 10 } } },
 *   outputs: { y: { unit: "1", description: "y" } },
 *   formula: ({ x }: { x: number }) => ({ y: x / 2 }), formulaText: "y = x / 2",
 *   citations: [{ authors: "none", year: 2026, title: "arithmetic", publication: "none" }],
 *   cautions: [],
 * });
 * const y = new Float64Array(3);
 * const first = runColumnLoop(columnLoop(half), half.formula as never, [Float64Array.of(2, 4, 6)], [y], 3);
 * assert.equal(first, -1);
 * assert.deepEqual([...y], [1, 2, 3]);
 * ```
 */
export function runColumnLoop(
  loop: ColumnLoop,
  formula: Calculation["formula"],
  columns: readonly Float64Array[],
  results: readonly Float64Array[],
  m: number,
): number {
  return loop(formula, columns, results, m);
}
// the warm-up: distinct functions through the site, in rounds, since the engine records what a
// call site calls only once the function has run a few times (a site that has called more than
// one function is then "megamorphic": the optimiser inlines none of them)
{
  const warmUps = [0, 1, 2, 3, 4, 5].map((k) =>
    new Function("formula", "columns", "results", "m", `return ${k} - 1;`) as ColumnLoop
  );
  for (let round = 0; round < 12; round++) {
    for (const warmUp of warmUps) runColumnLoop(warmUp, () => ({}), [], [], 0);
  }
}

/**
 * Evaluates a calculation over columns of inputs (one typed array per input, canonical units),
 * row by row through its own formula, without validation: the fast path for tables. Rows with a
 * NaN input give NaN outputs; validate or flag rows before or after as the caller's policy says.
 *
 * @param calc The calculation.
 * @param columns One array per input name, all of the same length.
 * @returns One Float64Array per output.
 * @throws {TypeError} For a missing input column or columns of different lengths.
 *
 * @example Haycock-style power law over three rows
 * ```ts
 * import { evaluateColumns, expressionModel } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const square = expressionModel({
 *   expression: "x^2",
 *   inputs: { x: { unit: "1", description: "x", range: { min: -10, max: 10 } } },
 *   output: { name: "y", unit: "1", description: "y" },
 * });
 * const { y } = evaluateColumns(square, { x: Float64Array.of(1, 2, NaN) });
 * assert.deepEqual([...y], [1, 4, NaN]);
 * ```
 */
export function evaluateColumns<I extends string, O extends string>(
  calc: Calculation<I, O>,
  columns: { readonly [K in I]: ArrayLike<number> },
): Record<O, Float64Array> {
  const cols = calc.inputNames.map((name) => {
    const col = columns[name];
    if (!col) throw new TypeError(`${calc.title}: missing input column '${name}'`);
    return col instanceof Float64Array ? col : Float64Array.from(col);
  });
  const n = cols[0]!.length;
  cols.forEach((c, i) => {
    if (c.length !== n) {
      throw new TypeError(
        `${calc.title}: expected input columns of equal length ${n}, got ${c.length} for '${
          calc.inputNames[i]
        }'`,
      );
    }
  });
  const results = calc.outputNames.map(() => new Float64Array(n));
  const c = calc as unknown as Calculation;
  runColumnLoop(columnLoop(c, "lenient"), c.formula, cols, results, n);
  return Object.fromEntries(calc.outputNames.map((o, k) => [o, results[k]!])) as Record<
    O,
    Float64Array
  >;
}
