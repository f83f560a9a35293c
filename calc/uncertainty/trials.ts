/**
 * The Monte Carlo trial engine (JCGM 101:2008 §6–7.4): draws input values column-wise into typed
 * arrays and evaluates the calculation's own formula over them, block by block.
 *
 * Stream layout. The trials of a run are cut into blocks of {@linkcode BLOCK_TRIALS}; block b
 * draws from its own MT19937 stream keyed [...key, b] (`init_by_array`), where `key` names the run
 * (the seed for a fixed number of trials; the seed and the sequence number in the adaptive
 * procedure). Inside a block the inputs are drawn one whole column after another, in the
 * calculation's input order. A block's values therefore depend only on the key and the block
 * index: blocks can run in any order, on the main thread or on any number of workers, and give the
 * same result bit for bit.
 *
 * Shared by {@linkcode monteCarlo} and the worker pool. It converts no units: inputs arrive
 * resolved to canonical numbers, so a worker (where calc/core/units.ts skips mathjs) can run it.
 *
 * @module
 */
import type { Calculation, InputValues } from "../core/types.ts";
import { inRange } from "../core/define.ts";
import { columnKernel } from "../core/kernel.ts";
import { choleskySemidefinite } from "./correlation.ts";
import type { ResolvedInput } from "./inputs.ts";
import type { PreparedInputs } from "./prepare.ts";
import { type RandomStream, randomStream } from "./random.ts";

/** Trials per block: input columns of this length stay in cache; part of the stream layout. */
export const BLOCK_TRIALS = 65_536;

/** What a run needs besides the calculation: the resolved inputs in input order and the
 * Cholesky factor of their correlation (null when uncorrelated). Plain data, so it can be sent
 * to a worker. */
export interface TrialPlan {
  /** Resolved inputs in the calculation's input order. */
  readonly inputs: readonly ResolvedInput[];
  /** Lower-triangular factor of the input correlation matrix, or null. */
  readonly factor: readonly (readonly number[])[] | null;
}

/** The plan of a run: checks that correlated inputs are normal (JCGM 101 §6.4.8) and factors
 * their correlation matrix. */
export function trialPlan<I extends string>(prepared: PreparedInputs<I>, where: string): TrialPlan {
  const { inputs, correlation, correlated } = prepared;
  if (!correlated) return { inputs, factor: null };
  inputs.forEach((input, i) => {
    const involved = correlation[i]!.some((v, j) => j !== i && v !== 0);
    if (involved && input.kind !== "normal") {
      throw new TypeError(
        `${where}: Monte Carlo supports correlation only between normal inputs (JCGM 101 §6.4.8), got '${input.name}' with a ${input.kind} distribution`,
      );
    }
  });
  return { inputs, factor: choleskySemidefinite(correlation, inputs.map((i) => i.name), where) };
}

/** Number of blocks of a run of `m` trials. */
export function blockCount(m: number): number {
  return Math.ceil(m / BLOCK_TRIALS);
}

/** Fills one column with draws of an input (JCGM 101:2008 §6.4). */
function sampleColumn(input: ResolvedInput, out: Float64Array, rng: RandomStream): void {
  const m = out.length;
  const { estimate: x, standardUncertainty: u, lower: a, upper: b, mode: c } = input;
  switch (input.kind) {
    case "exact":
      out.fill(x);
      return;
    case "normal":
      rng.fillNormal(out, x, u);
      return;
    case "studentT":
      for (let r = 0; r < m; r++) out[r] = x + u * rng.studentT(input.dof);
      return;
    case "rectangular":
      rng.fillUniform(out);
      for (let r = 0; r < m; r++) out[r] = a + (b - a) * out[r]!;
      return;
    case "arcsine": {
      const mid = (a + b) / 2, half = (b - a) / 2;
      rng.fillUniform(out);
      for (let r = 0; r < m; r++) out[r] = mid + half * Math.sin(2 * Math.PI * out[r]!);
      return;
    }
    case "triangular": {
      const w = b - a;
      const fc = w > 0 ? (c - a) / w : 0.5;
      rng.fillUniform(out);
      for (let r = 0; r < m; r++) {
        const v = out[r]!;
        out[r] = v < fc ? a + Math.sqrt(v * w * (c - a)) : b - Math.sqrt((1 - v) * w * (b - c));
      }
      return;
    }
  }
}

/** Fills one column per input with draws (correlated normal inputs mixed by the Cholesky factor;
 * `scratch` holds their standard normal draws). */
function sampleInputs(
  plan: TrialPlan,
  columns: readonly Float64Array[],
  scratch: readonly Float64Array[],
  rng: RandomStream,
): void {
  const { inputs, factor: l } = plan;
  if (!l) {
    inputs.forEach((input, i) => sampleColumn(input, columns[i]!, rng));
    return;
  }
  const m = columns[0]!.length;
  inputs.forEach((input, i) => {
    if (input.kind === "normal") rng.fillNormal(scratch[i]!);
    else sampleColumn(input, columns[i]!, rng);
  });
  inputs.forEach((input, i) => {
    if (input.kind !== "normal") return;
    const out = columns[i]!;
    const row = l[i]!;
    out.fill(0);
    for (let k = 0; k <= i; k++) {
      const coef = row[k]!;
      if (coef === 0 || inputs[k]!.kind !== "normal") continue;
      const zk = scratch[k]!;
      for (let r = 0; r < m; r++) out[r]! += coef * zk[r]!;
    }
    const x = input.estimate, u = input.standardUncertainty;
    for (let r = 0; r < m; r++) out[r] = x + u * out[r]!;
  });
}

/** Number of values outside a range (a min/max pass first: usually nothing to count). */
function countOutside(col: Float64Array, range: Calculation["inputs"][string]["range"]): number {
  let min = Infinity, max = -Infinity;
  for (let r = 0; r < col.length; r++) {
    const v = col[r]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (inRange(min, range) && inRange(max, range)) return 0;
  let n = 0;
  for (let r = 0; r < col.length; r++) if (!inRange(col[r]!, range)) n++;
  return n;
}

/** The error for a non-finite model value, naming the trial and its input values. */
function nonFiniteError(
  calc: Calculation,
  cols: readonly Float64Array[],
  index: number,
  trial: number,
): never {
  const x: Record<string, number> = {};
  calc.inputNames.forEach((n, i) => (x[n] = cols[i]![index]!));
  const y = calc.formula(x as InputValues<string>) as Record<string, number>;
  const output = calc.outputNames.find((o) => !Number.isFinite(y[o]))!;
  const shown = calc.inputNames.map((n) => `${n} = ${x[n]}`).join(", ");
  throw new RangeError(
    `${calc.title}: output '${output}' is not finite at Monte Carlo trial ${trial} (${shown}), got ${
      y[output]
    }; give the inputs distributions that respect the formula's domain (e.g. rectangular bounds)`,
  );
}

/**
 * Draws and evaluates the given blocks of a run of `m` trials keyed `key`: writes the model
 * values of trial t to `results[k][t − firstTrial]` for every output k, and adds to `outside[i]`
 * the number of draws of input i outside its valid range.
 *
 * @throws {RangeError} For a non-finite model value, naming the trial and its inputs.
 */
export function runBlocks(
  calc: Calculation,
  plan: TrialPlan,
  key: readonly number[],
  m: number,
  blocks: Iterable<number>,
  results: readonly Float64Array[],
  outside: number[],
  firstTrial = 0,
): void {
  const size = Math.min(BLOCK_TRIALS, m);
  const columns = plan.inputs.map(() => new Float64Array(size));
  const scratch = plan.factor ? plan.inputs.map(() => new Float64Array(size)) : [];
  const kernel = columnKernel(calc);
  for (const b of blocks) {
    const start = b * BLOCK_TRIALS;
    const n = Math.min(size, m - start);
    const cut = (cols: readonly Float64Array[]) =>
      n === size ? cols : cols.map((col) => col.subarray(0, n));
    const cols = cut(columns);
    sampleInputs(plan, cols, cut(scratch), randomStream([...key, b]));
    calc.inputNames.forEach((name, i) => {
      outside[i]! += countOutside(cols[i]!, calc.inputs[name]!.range);
    });
    const outs = results.map((r) => r.subarray(start - firstTrial, start - firstTrial + n));
    const bad = kernel(calc.formula, cols, outs, n);
    if (bad >= 0) nonFiniteError(calc, cols, bad, start + bad);
  }
}

/** Indices 0 … count − 1. */
export function range(count: number): number[] {
  return Array.from({ length: count }, (_, i) => i);
}
