/**
 * The Monte Carlo trial engine (JCGM 101:2008 §6–7.4): draws every elementary source column-wise
 * into typed arrays and evaluates the calculation's own formula over them, block by block.
 *
 * Stream layout. The trials of a run are cut into blocks of {@linkcode BLOCK_TRIALS}. In block b,
 * the source with key k draws from its own MT19937 stream keyed [...runKey, w₀(k), w₁(k), b]
 * (reference `init_by_array`), where w₀, w₁ are the two words of the source key's 64-bit FNV-1a
 * hash and `runKey` names the run ([seed] for a fixed number of trials, [seed, h] for sequence h
 * of the adaptive procedure). A source's draws therefore depend only on the seed, its key and the
 * block: adding a source never shifts another's, blocks can run in any order on any number of
 * workers with the same result bit for bit, and a source drawn in one step of a chain is drawn
 * identically when the chain is evaluated in one step. Correlated normal sources draw standard
 * normals from their own streams and are mixed by the Cholesky factor of their correlation
 * matrix, in input order. Changing the block size, the keys or the draw order changes every
 * seeded result: treat it as a breaking change.
 *
 * It converts no units: inputs arrive resolved to canonical numbers, so a worker (where
 * calc/core/units.ts skips mathjs) can run it.
 *
 * @module
 */
import type { Calculation, InputValues, ValueRange } from "../core/types.ts";
import { inRange } from "../core/range.ts";
import { columnLoop } from "../core/columns.ts";
import { choleskySemidefinite } from "./correlation.ts";
import { type RandomStream, randomStream } from "./random.ts";
import type { ResolvedDistribution } from "./types.ts";

/** Trials per block: input columns of this length stay in cache; part of the stream layout. */
export const BLOCK_TRIALS = 65_536;

/** How one input of a run gets its values: exact, drawn from a source, or taken from samples of
 * an earlier step (in trial order). */
export type PlanInput =
  | { readonly kind: "exact"; readonly value: number }
  | {
    readonly kind: "source";
    readonly key: string;
    /** The two words of the key's hash. */
    readonly words: readonly [number, number];
    readonly distribution: ResolvedDistribution;
    /** Index of its correlated group, or −1. */
    readonly group: number;
  }
  /** Samples of an earlier step, indexed from the run's first trial (0 on one thread). */
  | { readonly kind: "samples"; readonly samples: Float64Array };

/** A group of correlated normal sources: their input indices (ascending) and the lower
 * Cholesky factor of their correlation matrix. */
export interface CorrelatedGroup {
  readonly members: readonly number[];
  readonly factor: readonly (readonly number[])[];
}

/** What a run needs besides the calculation: plain data, so it can be sent to a worker. */
export interface TrialPlan {
  /** One entry per calculation input, in input order. */
  readonly inputs: readonly PlanInput[];
  /** Correlated normal groups. */
  readonly groups: readonly CorrelatedGroup[];
}

/**
 * Groups the correlated sources of a plan and factors each group's correlation matrix.
 *
 * @param inputs The plan inputs (sources with `group` −1 are regrouped here).
 * @param correlation r(i, j) between two inputs' sources (0 when not declared).
 * @param where For messages.
 * @throws {TypeError} When a correlated source is not normal (JCGM 101 §6.4.8).
 */
export function planGroups(
  inputs: readonly PlanInput[],
  correlation: (i: number, j: number) => number,
  where: string,
  names: readonly string[],
): TrialPlan {
  const n = inputs.length;
  const parent = Array.from({ length: n }, (_, i) => i);
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i]!)));
  let any = false;
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      if (correlation(i, j) !== 0) {
        parent[find(j)] = find(i);
        any = true;
      }
    }
  }
  if (!any) return { inputs, groups: [] };
  const byRoot = new Map<number, number[]>();
  for (let i = 0; i < n; i++) {
    const root = find(i);
    byRoot.set(root, [...(byRoot.get(root) ?? []), i]);
  }
  const groups: CorrelatedGroup[] = [];
  const out = [...inputs];
  for (const members of byRoot.values()) {
    if (members.length < 2) continue;
    for (const i of members) {
      const p = inputs[i]!;
      if (p.kind !== "source" || p.distribution.kind !== "normal") {
        throw new TypeError(
          `${where}: Monte Carlo supports correlation only between normal inputs (JCGM 101 §6.4.8), got '${
            names[i]
          }' with a ${p.kind === "source" ? p.distribution.kind : p.kind} distribution`,
        );
      }
      out[i] = { ...p, group: groups.length };
    }
    const matrix = members.map((i) => members.map((j) => (i === j ? 1 : correlation(i, j))));
    groups.push({
      members,
      factor: choleskySemidefinite(matrix, members.map((i) => names[i]!), where),
    });
  }
  return { inputs: out, groups };
}

/** Number of blocks of a run of `m` trials. */
export function blockCount(m: number): number {
  return Math.ceil(m / BLOCK_TRIALS);
}

/** Indices 0 … count − 1. */
export function range(count: number): number[] {
  return Array.from({ length: count }, (_, i) => i);
}

/** Fills one column with draws of a distribution (JCGM 101:2008 §6.4). */
function sampleColumn(d: ResolvedDistribution, out: Float64Array, rng: RandomStream): void {
  const m = out.length;
  const { estimate: x, standardUncertainty: u, lower: a, upper: b, mode: c } = d;
  switch (d.kind) {
    case "exact":
      out.fill(x);
      return;
    case "normal":
      rng.fillNormal(out, x, u);
      return;
    case "studentT":
      for (let r = 0; r < m; r++) out[r] = x + u * rng.studentT(d.dof);
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

/** Number of values outside a range (a min/max pass first: usually nothing to count). */
function countOutside(col: Float64Array, r: ValueRange): number {
  let min = Infinity, max = -Infinity;
  for (let i = 0; i < col.length; i++) {
    const v = col[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  if (inRange(min, r) && inRange(max, r)) return 0;
  let n = 0;
  for (let i = 0; i < col.length; i++) if (!inRange(col[i]!, r)) n++;
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

/** Where a run writes: the model values of each output and, for each source input, its draws
 * (full-length arrays, or null to draw into scratch columns). */
export interface RunTargets {
  /** One array per output, indexed from `firstTrial`. */
  readonly outputs: readonly Float64Array[];
  /** One array per input: where a source's draws are kept (indexed from `firstTrial`), or null. */
  readonly draws: readonly (Float64Array | null)[];
  /** Trial index of element 0 of the arrays. */
  readonly firstTrial: number;
}

/** Counts of a run: draws outside each input's valid range, model values outside each output's
 * valid range. */
export interface RunCounts {
  readonly inputsOutside: number[];
  readonly outputsOutside: number[];
}

/**
 * Draws and evaluates the given blocks of a run of `m` trials keyed `runKey`, writing model
 * values (and kept draws) into `targets` and adding out-of-range counts to `counts`.
 *
 * @throws {RangeError} For a non-finite model value, naming the trial and its inputs.
 */
export function runBlocks(
  calc: Calculation,
  plan: TrialPlan,
  runKey: readonly number[],
  m: number,
  blocks: Iterable<number>,
  targets: RunTargets,
  counts: RunCounts,
): void {
  const size = Math.min(BLOCK_TRIALS, m);
  const scratch = plan.inputs.map(() => new Float64Array(size));
  const normals = plan.groups.length > 0 ? plan.inputs.map(() => new Float64Array(size)) : [];
  const loop = columnLoop(calc);
  const { firstTrial } = targets;
  const outputRanges = calc.outputNames.map((o) => calc.outputs[o]!.quantity.valid);
  for (const b of blocks) {
    const start = b * BLOCK_TRIALS;
    const n = Math.min(size, m - start);
    const at = start - firstTrial;
    const cols = plan.inputs.map((p, i) => {
      if (p.kind === "samples") return p.samples.subarray(at, at + n);
      const kept = targets.draws[i];
      return kept ? kept.subarray(at, at + n) : scratch[i]!.subarray(0, n);
    });
    plan.inputs.forEach((p, i) => {
      const col = cols[i]!;
      if (p.kind === "exact") col.fill(p.value);
      else if (p.kind === "source") {
        const rng = randomStream([...runKey, p.words[0], p.words[1], b]);
        if (p.group < 0) sampleColumn(p.distribution, col, rng);
        else rng.fillNormal(normals[i]!.subarray(0, n));
      }
    });
    for (const g of plan.groups) {
      g.members.forEach((i, gi) => {
        const p = plan.inputs[i]! as Extract<PlanInput, { kind: "source" }>;
        const out = cols[i]!;
        const row = g.factor[gi]!;
        out.fill(0);
        for (let k = 0; k <= gi; k++) {
          const coef = row[k]!;
          if (coef === 0) continue;
          const zk = normals[g.members[k]!]!;
          for (let r = 0; r < n; r++) out[r]! += coef * zk[r]!;
        }
        const x = p.distribution.estimate, u = p.distribution.standardUncertainty;
        for (let r = 0; r < n; r++) out[r] = x + u * out[r]!;
      });
    }
    plan.inputs.forEach((p, i) => {
      if (p.kind === "source") {
        counts.inputsOutside[i]! += countOutside(cols[i]!, calc.inputs[calc.inputNames[i]!]!.range);
      }
    });
    const outs = targets.outputs.map((o) => o.subarray(at, at + n));
    const bad = loop(calc.formula, cols, outs, n);
    if (bad >= 0) nonFiniteError(calc, cols, bad, start + bad);
    outs.forEach((o, k) => (counts.outputsOutside[k]! += countOutside(o, outputRanges[k]!)));
  }
}
