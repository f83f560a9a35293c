/**
 * The Monte Carlo trial engine (JCGM 101:2008 §6–7.4): draws every elementary source column-wise
 * into typed arrays and evaluates the calculation's own formula over them, block by block.
 *
 * Stream layout. The trials of a run are cut into blocks of {@linkcode BLOCK_TRIALS}. In block b,
 * the source with key k draws from its own stream keyed [...runKey, w₀(k), w₁(k), b]
 * (xoshiro128** started from the first four MT19937 words of the reference `init_by_array` of
 * that key; calc/uncertainty/random.ts gives the reason for the choice), where w₀, w₁ are the two
 * words of the source key's 64-bit FNV-1a hash and `runKey` names the run ([seed] for a fixed
 * number of trials, [seed, h] for sequence h of the adaptive procedure). A source's draws therefore depend only on the seed, its key and the
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
import { closedBounds, countOutside, inRange } from "../core/range.ts";
import { columnLoop, runColumnLoop } from "../core/columns.ts";
import { relationText } from "../core/validate.ts";
import { choleskySemidefinite } from "./correlation.ts";
import { NORMAL_DRAW_LIMIT, type RandomStream, randomStream } from "./random.ts";
import { distributionQuantile } from "./distributions.ts";
import { keyWords } from "./sources.ts";
import { normalCdf } from "../stats/distributions.ts";
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

/**
 * A group of correlated sources: their input indices (ascending), the lower Cholesky factor of
 * the correlation matrix of their latent standard normals, and how those normals become draws:
 * - "normal": every member normal, x = μ + u·z (JCGM 101:2008 §6.4.8);
 * - "multivariateT": every member a Student t with one ν (repeated readings of the same
 *   measurement procedure, JCGM 102:2011 §6.5.3): x = μ + s·z·√(ν/W), one W ~ χ²(ν) per trial
 *   shared by the group, drawn from the group's own stream keyed `words`;
 * - "copula": any other mix (a Gaussian copula): x = F⁻¹(Φ(z)) per member's own distribution,
 *   with the latent correlation chosen so that the inputs' correlation is the one declared where
 *   a closed form exists (normal and rectangular margins), else the declared value itself.
 */
export interface CorrelatedGroup {
  readonly members: readonly number[];
  readonly factor: readonly (readonly number[])[];
  readonly method: "normal" | "multivariateT" | "copula";
  /** ν of a multivariate t group. */
  readonly dof?: number;
  /** Stream words of a multivariate t group's χ² draws. */
  readonly words?: readonly [number, number];
}

/** What to do with a trial that is physically inconsistent (an input outside its valid range, a
 * broken relation between inputs, an output not finite or outside its valid range): exclude it
 * (every output of that trial becomes NaN, so statistics describe the distribution conditional on
 * consistency), or refuse the run. */
export type InconsistentTrials = "exclude" | "refuse";

/** What a run needs besides the calculation: plain data, so it can be sent to a worker. */
export interface TrialPlan {
  /** One entry per calculation input, in input order. */
  readonly inputs: readonly PlanInput[];
  /** Correlated groups. */
  readonly groups: readonly CorrelatedGroup[];
  /** Inconsistent trials. @default "exclude" */
  readonly inconsistent?: InconsistentTrials;
}

/**
 * Groups the correlated sources of a plan, chooses how each group is drawn (joint normal,
 * multivariate t, or Gaussian copula; see {@linkcode CorrelatedGroup}) and factors the correlation
 * matrix of its latent normals.
 *
 * @param inputs The plan inputs (sources with `group` −1 are regrouped here).
 * @param correlation r(i, j) between two inputs' sources (0 when not declared).
 * @param where For messages.
 * @throws {TypeError} When a correlated input is exact or comes from an earlier step's samples.
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
    const dists = members.map((i) => {
      const p = inputs[i]!;
      if (p.kind !== "source" || p.distribution.kind === "exact") {
        throw new TypeError(
          `${where}: expected '${names[i]}' to be drawn from a distribution to correlate it, got ${
            p.kind === "source"
              ? "an exact value"
              : p.kind === "exact"
              ? "an exact value"
              : "the samples of an earlier step (their correlation is already in the draws)"
          }`,
        );
      }
      out[i] = { ...p, group: groups.length };
      return p.distribution;
    });
    const declared = members.map((i) => members.map((j) => (i === j ? 1 : correlation(i, j))));
    const allNormal = dists.every((d) => d.kind === "normal");
    const dof = dists[0]!.kind === "studentT" ? dists[0]!.dof : NaN;
    const sharedT = dists.every((d) => d.kind === "studentT" && d.dof === dof);
    const method = allNormal ? "normal" : sharedT ? "multivariateT" : "copula";
    const latent = method === "copula"
      ? declared.map((row, a) =>
        row.map((r, b) => (a === b ? 1 : latentCorrelation(r, dists[a]!, dists[b]!)))
      )
      : declared;
    const keys = members.map((i) => (inputs[i] as Extract<PlanInput, { kind: "source" }>).key);
    groups.push({
      members,
      factor: choleskySemidefinite(latent, members.map((i) => names[i]!), where),
      method,
      ...(method === "multivariateT" ? { dof, words: keyWords(`χ²(${keys.join(" & ")})`) } : {}),
    });
  }
  return { inputs: out, groups };
}

/**
 * The correlation of the latent normals of a Gaussian copula that gives two inputs the declared
 * correlation r: r itself between normals; 2·sin(πr/6) between two rectangular inputs (the
 * Pearson correlation of Φ(Z₁), Φ(Z₂) is (6/π)·arcsin(ρ/2), Pearson 1907 / Kruskal 1958);
 * r·√(π/3) between a normal and a rectangular input (corr(Z₁, Φ(Z₂)) = ρ·√(3/π)); r for other
 * margins, whose induced correlation then differs slightly from r (the propagation says so).
 */
export function latentCorrelation(
  r: number,
  a: ResolvedDistribution,
  b: ResolvedDistribution,
): number {
  const kinds = [a.kind, b.kind].sort().join("+");
  if (kinds === "rectangular+rectangular") return 2 * Math.sin((Math.PI * r) / 6);
  if (kinds === "normal+rectangular") return Math.max(-1, Math.min(1, r * Math.sqrt(Math.PI / 3)));
  return r;
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
    case "cone": {
      const k = d.radiansPerUnit!, one = 1 - Math.cos(b * k);
      rng.fillUniform(out);
      for (let r = 0; r < m; r++) out[r] = Math.acos(1 - out[r]! * one) / k;
      return;
    }
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

/** Distributions whose draws (sampleColumn) lie between their lower and upper bounds. */
const BOUNDED_DRAWS: ReadonlySet<string> = new Set(["rectangular", "triangular", "arcsine"]);

/** Number of values outside a range or not finite (one counting pass first: usually nothing
 * to mark); marks their trials in `bad` when given. */
function markOutside(
  col: Float64Array,
  r: ValueRange,
  bad: Uint8Array | null,
  skip: Uint8Array | null = null,
): number {
  const n = countOutside(col, r, skip);
  if (n === 0 || !bad) return n;
  const { lower, upper } = closedBounds(r);
  for (let i = 0; i < col.length; i++) {
    const v = col[i]!;
    if (!(v >= lower && v <= upper) && !skip?.[i]) bad[i] = 1;
  }
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

/**
 * Whether a run stores the draws of plan input i as it goes: only members of a correlated group
 * (their columns mix several streams). An independent source's draws are a function of the run's
 * key, the source's key and the block alone, so they are recomputed when asked for
 * ({@linkcode redrawSource}) rather than kept: a run of 10⁶ trials then writes and holds one array
 * per output, not one more per input (about half the memory and a sixth of the time for four
 * inputs, bench/analysis.md).
 */
export function storesDraws(plan: TrialPlan, i: number): boolean {
  const p = plan.inputs[i]!;
  return p.kind === "source" && p.group >= 0;
}

/**
 * The draws of an independent source input (see {@linkcode storesDraws}) over a whole run of m
 * trials keyed `runKey`: block by block from the same streams as {@linkcode runBlocks}, so the
 * same numbers, bit for bit.
 *
 * @throws {TypeError} For an input that is not an independent source.
 */
export function redrawSource(
  plan: TrialPlan,
  i: number,
  runKey: readonly number[],
  m: number,
): Float64Array {
  const p = plan.inputs[i]!;
  if (p.kind !== "source" || p.group >= 0) {
    throw new TypeError(`redrawSource: input ${i} is not an independent source`);
  }
  const out = new Float64Array(m);
  const size = Math.min(BLOCK_TRIALS, m);
  for (let b = 0; b < blockCount(m); b++) {
    const start = b * BLOCK_TRIALS;
    const n = Math.min(size, m - start);
    const rng = randomStream([...runKey, p.words[0], p.words[1], b]);
    sampleColumn(p.distribution, out.subarray(start, start + n), rng);
  }
  return out;
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
  // per-trial marks, reused by every block
  const exclude = (plan.inconsistent ?? "exclude") === "exclude";
  const badTrials = exclude ? new Uint8Array(size) : null;
  const beforeOutputs = exclude ? new Uint8Array(size) : null;
  const upstreamTrials = new Uint8Array(size);
  const normals = plan.groups.length > 0 ? plan.inputs.map(() => new Float64Array(size)) : [];
  const strict = columnLoop(calc, "strict");
  const lenient = columnLoop(calc, "lenient");
  const { firstTrial } = targets;
  const outputRanges = calc.outputNames.map((o) => calc.outputs[o]!.quantity.valid);
  const inputRanges = calc.inputNames.map((name) => calc.inputs[name]!.range);
  // an uncorrelated draw whose reach (the bounds of a bounded shape; for a normal, the farthest a
  // ziggurat draw can go) lies inside the input's valid range, with a margin far above rounding,
  // cannot leave it (the range is an interval): no range pass for it
  const withinByConstruction = plan.inputs.map((p, i) => {
    if (p.kind !== "source" || p.group >= 0) return false;
    const d = p.distribution;
    if (d.kind !== "normal" && !BOUNDED_DRAWS.has(d.kind)) return false;
    // a normal draw lies within μ ± NORMAL_DRAW_LIMIT·σ (the ziggurat's largest tail value)
    const reach = NORMAL_DRAW_LIMIT * d.standardUncertainty;
    const [lower, upper] = d.kind === "normal"
      ? [d.estimate - reach, d.estimate + reach]
      : [d.lower, d.upper];
    const margin = 1e-9 * Math.max(Math.abs(lower), Math.abs(upper), upper - lower);
    return inRange(lower - margin, inputRanges[i]!) && inRange(upper + margin, inputRanges[i]!);
  });

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
    for (const g of plan.groups) drawGroup(g, plan, cols, normals, runKey, b, n);
    const bad = badTrials ? badTrials.subarray(0, n).fill(0) : null;
    // trials an earlier step already excluded (NaN samples) stay excluded, and are not counted
    // again here
    const upstream = upstreamTrials.subarray(0, n).fill(0);
    plan.inputs.forEach((p, i) => {
      if (p.kind !== "samples") return;
      const col = cols[i]!;
      for (let r = 0; r < n; r++) if (col[r] !== col[r]) upstream[r] = 1;
    });
    if (bad) bad.set(upstream);
    plan.inputs.forEach((p, i) => {
      if (p.kind === "exact" || withinByConstruction[i]) return;
      counts.inputsOutside[i]! += markOutside(cols[i]!, inputRanges[i]!, bad, upstream);
    });
    if (calc.constraints.length > 0) markBrokenRelations(calc, cols, n, bad);
    const outs = targets.outputs.map((o) => o.subarray(at, at + n));
    const first = runColumnLoop(exclude ? lenient : strict, calc.formula, cols, outs, n);
    if (first >= 0) nonFiniteError(calc, cols, first, start + first);
    // outputs are counted on the trials still consistent after the inputs' checks
    const before = bad ? beforeOutputs!.subarray(0, n) : null;
    if (before) before.set(bad!);
    outs.forEach((o, k) =>
      counts.outputsOutside[k]! += markOutside(o, outputRanges[k]!, bad, before)
    );
    if (bad) {
      for (let r = 0; r < n; r++) {
        if (bad[r]) { for (const o of outs) o[r] = NaN; }
      }
    }
  }
}

/** Draws one correlated group into its members' columns (see {@linkcode CorrelatedGroup}). */
function drawGroup(
  g: CorrelatedGroup,
  plan: TrialPlan,
  cols: readonly Float64Array[],
  normals: readonly Float64Array[],
  runKey: readonly number[],
  block: number,
  n: number,
): void {
  // correlated standard normals: the Cholesky factor times the members' independent normals
  g.members.forEach((i, gi) => {
    const out = cols[i]!;
    const row = g.factor[gi]!;
    out.fill(0, 0, n);
    for (let k = 0; k <= gi; k++) {
      const coef = row[k]!;
      if (coef === 0) continue;
      const zk = normals[g.members[k]!]!;
      for (let r = 0; r < n; r++) out[r]! += coef * zk[r]!;
    }
  });
  let scale: Float64Array | null = null;
  if (g.method === "multivariateT") {
    // one χ²(ν) per trial, shared by the group: √(ν/W) scales every member (JCGM 102 §6.5.3)
    const rng = randomStream([...runKey, g.words![0], g.words![1], block]);
    scale = new Float64Array(n);
    for (let r = 0; r < n; r++) scale[r] = Math.sqrt(g.dof! / chiSquare(rng, g.dof!));
  }
  for (const i of g.members) {
    const p = plan.inputs[i]! as Extract<PlanInput, { kind: "source" }>;
    const d = p.distribution;
    const out = cols[i]!;
    const x = d.estimate, u = d.standardUncertainty;
    if (g.method === "normal" || (g.method === "copula" && d.kind === "normal")) {
      for (let r = 0; r < n; r++) out[r] = x + u * out[r]!;
    } else if (scale) {
      for (let r = 0; r < n; r++) out[r] = x + u * out[r]! * scale[r]!;
    } else {
      for (let r = 0; r < n; r++) out[r] = distributionQuantile(d, normalCdf(out[r]!));
    }
  }
}

/** One χ²(ν) draw: 2·Gamma(ν/2) by Marsaglia and Tsang (2000), with the shape boost
 * Gamma(a) = Gamma(a + 1)·U^(1/a) for a < 1. */
function chiSquare(rng: RandomStream, dof: number): number {
  const a = dof / 2;
  const shape = a < 1 ? a + 1 : a;
  const d = shape - 1 / 3, c = 1 / Math.sqrt(9 * d);
  const one = new Float64Array(1);
  const uniform = () => {
    rng.fillUniform(one);
    return one[0]!;
  };
  let g: number;
  for (;;) {
    rng.fillNormal(one);
    const z = one[0]!;
    const v = (1 + c * z) ** 3;
    if (v <= 0) continue;
    const u = uniform();
    if (Math.log(u) < 0.5 * z * z + d - d * v + d * Math.log(v)) {
      g = d * v;
      break;
    }
  }
  if (a < 1) g *= uniform() ** (1 / a);
  return 2 * g;
}

/** Marks the trials whose inputs break a relation the calculation declares (ESV ≤ EDV …); with
 * no marks to keep (refusing inconsistent trials), the first broken relation is an error. */
function markBrokenRelations(
  calc: Calculation,
  cols: readonly Float64Array[],
  n: number,
  bad: Uint8Array | null,
): void {
  // once per trial: plain loops, no closures
  const names = calc.inputNames;
  const x: Record<string, number> = {};
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < names.length; i++) x[names[i]!] = cols[i]![r]!;
    let broken: (typeof calc.constraints)[number] | undefined;
    for (const c of calc.constraints) {
      if (!c.holds(x)) {
        broken = c;
        break;
      }
    }
    if (broken === undefined) continue;
    if (bad) {
      bad[r] = 1;
      continue;
    }
    throw new RangeError(
      `${calc.title}: a Monte Carlo draw breaks the relation ${relationText(calc, broken)} (${
        broken.inputs.map((name) => `${name} = ${x[name]}`).join(", ")
      }); propagate with inconsistentTrials: "exclude" for the distribution conditional on consistent inputs, or give the inputs distributions that keep the relation`,
    );
  }
}
