/**
 * The Monte Carlo worker behind {@linkcode createMonteCarloPool}: loads the modules that export
 * calculations, then draws and evaluates the blocks of trials it is sent and transfers the model
 * values back (with each part's tails, or each sequence's statistics). It runs the same trial
 * engine (trials.ts) as the main thread, so a block's values do not depend on where it runs.
 *
 * The worker never handles units: it marks itself formula-only before loading any module of the
 * package, which then skips loading mathjs (calc/core/units.ts).
 *
 * Internal: not exported from the package.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import type { SequenceStatistics } from "./montecarlo.ts";
import type { TrialPlan } from "./trials.ts";

/** One piece of work: the given blocks (consecutive) of the run keyed `key` of m trials. */
export interface WorkerTask {
  readonly key: readonly number[];
  readonly m: number;
  readonly blocks: readonly number[];
}

/** Messages to a worker. */
export type WorkerRequest =
  | { readonly type: "load"; readonly job: number; readonly modules: readonly string[] }
  | {
    readonly type: "run";
    readonly job: number;
    /** Calculation id and the source text of its formula (checked against the worker's copy). */
    readonly id: string;
    readonly formula: string;
    readonly plan: TrialPlan;
    readonly tasks: readonly WorkerTask[];
    /** When set, also return each task's sequence statistics at this coverage probability. */
    readonly coverage: number | null;
    /** When set, also return this many of the smallest and of the largest values of each
     * output. */
    readonly tailSize: number | null;
  };

/** Replies from a worker. Tasks run in order; on a failure, `failedTask` is its index and the
 * tasks before it are complete. */
export type WorkerReply =
  | {
    readonly type: "loaded";
    readonly job: number;
    readonly ids: readonly string[];
    readonly error: { readonly name: string; readonly message: string } | null;
  }
  | {
    readonly type: "done";
    readonly job: number;
    /** Per task: the model values of its trials, one array per output (transferred). */
    readonly results: readonly (readonly Float64Array[])[];
    readonly outside: readonly (readonly number[])[];
    readonly stats: readonly (readonly SequenceStatistics[])[];
    /** Per task and output: its `tailSize` smallest and largest values, ascending (transferred). */
    readonly tails: readonly (readonly { low: Float64Array; high: Float64Array }[])[];
    readonly failedTask: number;
    readonly error: { readonly name: string; readonly message: string } | null;
  };

const scope = globalThis as unknown as {
  onmessage: ((event: MessageEvent<WorkerRequest>) => void) | null;
  postMessage(message: WorkerReply, transfer?: Transferable[]): void;
  [key: symbol]: unknown;
};
// FORMULA_ONLY_WORKER of calc/core/units.ts, set before any module of the package is loaded
// (importing units.ts to read it would load mathjs)
scope[Symbol.for("sonorigor.formulaOnlyWorker")] = true;
const { BLOCK_TRIALS, runBlocks } = await import("./trials.ts");
const { sequenceStatistics, sortedTails } = await import("./montecarlo.ts");
const { isCalculation } = await import("../core/define.ts");

const calculations = new Map<string, Calculation>();

async function load(modules: readonly string[]): Promise<string[]> {
  for (const url of modules) {
    let module: Record<string, unknown>;
    try {
      module = await import(url);
    } catch (e) {
      throw new TypeError(`module ${url} failed to load in a worker: ${plain(e).message}`);
    }
    for (const value of Object.values(module)) {
      if (!isCalculation(value)) continue;
      const known = calculations.get(value.id);
      // the same object exported twice is fine; two calculations under one id are not
      if (known && known !== value) {
        throw new TypeError(
          `two different calculations share the id '${value.id}' (the second in ${url}); give each its own id`,
        );
      }
      calculations.set(value.id, value);
    }
  }
  return [...calculations.keys()];
}

/** An error as plain data for the reply. */
function plain(e: unknown): { name: string; message: string } {
  const error = e instanceof Error ? e : new Error(String(e));
  return { name: error.name, message: error.message };
}

function run(request: Extract<WorkerRequest, { type: "run" }>): WorkerReply {
  const calc = calculations.get(request.id);
  const done: Float64Array[][] = [];
  const outside: number[][] = [];
  const stats: SequenceStatistics[][] = [];
  const tails: { low: Float64Array; high: Float64Array }[][] = [];
  const reply = (failedTask: number, error: ReturnType<typeof plain> | null): WorkerReply => ({
    type: "done",
    job: request.job,
    results: done,
    outside,
    stats,
    tails,
    failedTask,
    error,
  });
  if (!calc || calc.formula.toString() !== request.formula) {
    const message = calc
      ? `Monte Carlo pool: the workers' calculation '${request.id}' has a different formula from the one given; give each calculation a unique id`
      : `Monte Carlo pool: calculation '${request.id}' is not exported by the modules the pool loaded; define it in a module and list that module in createMonteCarloPool({ modules })`;
    return reply(0, { name: "TypeError", message });
  }
  for (const [t, task] of request.tasks.entries()) {
    const counts = calc.inputNames.map(() => 0);
    const firstTrial = task.blocks[0]! * BLOCK_TRIALS;
    const n = Math.min(task.m, (task.blocks.at(-1)! + 1) * BLOCK_TRIALS) - firstTrial;
    const results = calc.outputNames.map(() => new Float64Array(n));
    try {
      runBlocks(calc, request.plan, task.key, task.m, task.blocks, results, counts, firstTrial);
    } catch (e) {
      return reply(t, plain(e));
    }
    done.push(results);
    outside.push(counts);
    if (request.coverage !== null) stats.push(sequenceStatistics(results, request.coverage));
    const tailSize = request.tailSize;
    if (tailSize !== null) tails.push(results.map((col) => sortedTails(col, tailSize)));
  }
  return reply(-1, null);
}

scope.onmessage = async ({ data }) => {
  if (data.type === "load") {
    try {
      scope.postMessage({
        type: "loaded",
        job: data.job,
        ids: await load(data.modules),
        error: null,
      });
    } catch (e) {
      scope.postMessage({ type: "loaded", job: data.job, ids: [], error: plain(e) });
    }
  } else {
    const reply = run(data) as Extract<WorkerReply, { type: "done" }>;
    const arrays = [...reply.results.flat(), ...reply.tails.flat().flatMap((t) => [t.low, t.high])];
    scope.postMessage(reply, [...new Set(arrays.map((a) => a.buffer as ArrayBuffer))]);
  }
};
