/**
 * The Monte Carlo worker behind {@linkcode createMonteCarloPool}: loads the package's catalog and
 * the modules it is given, makes each requested calculation again from its recipe, refuses it
 * when its fingerprint differs from the caller's copy, then draws and evaluates the blocks of
 * trials it is sent and transfers the model values back. It runs the same trial engine
 * (sampling.ts) as the main thread, so a block's values do not depend on where it runs.
 *
 * The worker never handles units: it marks itself formula-only before loading any module of the
 * package, which then skips loading mathjs (calc/core/units.ts) and zod (the check of Z-score
 * model data, calc/reference/zscore_models.ts).
 *
 * It runs on `node:worker_threads` (see pool.ts for why), says "ready" once it listens, and
 * handles its messages strictly one after the other, in the order sent, a load included: the pool
 * may send a new worker its modules and its runs at once, and knows which run a worker was busy
 * with when it died (the oldest one not answered).
 *
 * Internal: not exported from the package.
 *
 * @module
 */
import { parentPort } from "node:worker_threads";
import type { Calculation, Recipe } from "../core/types.ts";
import type { Catalog } from "../core/catalog.ts";
import type { SequenceStatistics } from "./adaptive.ts";
import type { RunCounts, TrialPlan } from "./sampling.ts";

/** One piece of work: the given blocks (consecutive) of the run keyed `runKey` of m trials;
 * sample inputs of the plan are indexed from the first block's first trial. */
export interface WorkerTask {
  readonly runKey: readonly number[];
  readonly m: number;
  readonly blocks: readonly number[];
  readonly plan: TrialPlan;
}

/** Messages to a worker. */
export type WorkerRequest =
  | { readonly type: "load"; readonly job: number; readonly modules: readonly string[] }
  | {
    readonly type: "run";
    readonly job: number;
    /** How to make the calculation from the catalog, and the caller's fingerprint of it. */
    readonly recipe: Recipe;
    readonly fingerprint: string;
    readonly tasks: readonly WorkerTask[];
    /** Keep the draws of source inputs (returned). */
    readonly keepDraws: boolean;
    /** When set, also return each task's sequence statistics at this coverage probability. */
    readonly statistics: { coverage: number; interval: "symmetric" | "shortest" } | null;
    /** When set, also return this many of the smallest and of the largest values of each
     * output. */
    readonly tailSize: number | null;
  };

/** A plain error for a reply. */
export interface PlainError {
  readonly name: string;
  readonly message: string;
}

/** Messages from a worker: "ready" once it listens (Deno drops what a `node:worker_threads`
 * worker is sent before it listens, so nothing is sent before), then one reply per request. Tasks
 * run in order; on a failure, `failedTask` is its index and the tasks before it are complete. */
export type WorkerReply =
  | { readonly type: "ready" }
  | {
    readonly type: "loaded";
    readonly job: number;
    readonly error: PlainError | null;
  }
  | {
    readonly type: "done";
    readonly job: number;
    /** Per task: the model values of its trials, one array per output (transferred). */
    readonly results: readonly (readonly Float64Array[])[];
    /** Per task: the draws of each input (null where not a kept source). */
    readonly draws: readonly (readonly (Float64Array | null)[])[];
    readonly counts: readonly RunCounts[];
    readonly stats: readonly (readonly SequenceStatistics[])[];
    /** Per task and output: its `tailSize` smallest and largest values, ascending. */
    readonly tails: readonly (readonly { low: Float64Array; high: Float64Array }[])[];
    readonly failedTask: number;
    readonly error: PlainError | null;
  };

if (parentPort === null) {
  throw new Error(
    "Monte Carlo pool: calc/uncertainty/worker.ts runs only as a worker of createMonteCarloPool()",
  );
}
const port = parentPort;
// FORMULA_ONLY_WORKER of calc/core/units.ts, set before any module of the package is loaded
// (importing units.ts to read it would load mathjs)
(globalThis as Record<symbol, unknown>)[Symbol.for("sonorigor.formulaOnlyWorker")] = true;
const { BLOCK_TRIALS, runBlocks, storesDraws } = await import("./sampling.ts");
const { sequenceStatistics } = await import("./adaptive.ts");
const { sortedTails } = await import("./intervals.ts");
const { combineCatalogs, defineCatalog, fingerprint, rebuild } = await import(
  "../core/catalog.ts"
);
const { isCalculation } = await import("../core/calculation.ts");
const { CATALOG } = await import("../catalog.ts");

let catalog: Catalog = CATALOG;

async function load(modules: readonly string[]): Promise<void> {
  const found: Catalog[] = [catalog];
  for (const url of modules) {
    let module: Record<string, unknown>;
    try {
      module = await import(url);
    } catch (e) {
      throw new TypeError(`module ${url} failed to load in a worker: ${plain(e).message}`);
    }
    const values = Object.values(module);
    const kindOf = (v: unknown) => (v as { kind?: unknown } | null)?.kind;
    for (const v of values) if (kindOf(v) === "sonorigor.catalog") found.push(v as Catalog);
    found.push(
      defineCatalog({
        calculations: values.filter(isCalculation),
        families: values.filter((v) => kindOf(v) === "sonorigor.family") as never[],
      }),
    );
  }
  catalog = combineCatalogs(found);
}

/** An error as plain data for the reply. */
function plain(e: unknown): PlainError {
  const error = e instanceof Error ? e : new Error(String(e));
  return { name: error.name, message: error.message };
}

function resolve(request: Extract<WorkerRequest, { type: "run" }>): Calculation {
  let calc: Calculation;
  try {
    calc = rebuild(catalog, request.recipe);
  } catch (e) {
    throw new TypeError(
      `Monte Carlo pool: ${
        plain(e).message
      }; define the calculation in a module and list it in createMonteCarloPool({ modules })`,
    );
  }
  const mine = fingerprint(calc);
  if (mine !== request.fingerprint) {
    throw new TypeError(
      `Monte Carlo pool: the workers' copy of '${calc.id}' differs from the one given (fingerprint ${
        mine.slice(0, 12)
      }… against ${
        request.fingerprint.slice(0, 12)
      }…): same id, another definition; give each calculation its own id and list the module that defines it`,
    );
  }
  return calc;
}

function run(request: Extract<WorkerRequest, { type: "run" }>): WorkerReply {
  const results: Float64Array[][] = [];
  const draws: (Float64Array | null)[][] = [];
  const counts: RunCounts[] = [];
  const stats: SequenceStatistics[][] = [];
  const tails: { low: Float64Array; high: Float64Array }[][] = [];
  const reply = (failedTask: number, error: PlainError | null): WorkerReply => ({
    type: "done",
    job: request.job,
    results,
    draws,
    counts,
    stats,
    tails,
    failedTask,
    error,
  });
  let calc: Calculation;
  try {
    calc = resolve(request);
  } catch (e) {
    return reply(0, plain(e));
  }
  for (const [t, task] of request.tasks.entries()) {
    const firstTrial = task.blocks[0]! * BLOCK_TRIALS;
    const n = Math.min(task.m, (task.blocks.at(-1)! + 1) * BLOCK_TRIALS) - firstTrial;
    const targets = {
      outputs: calc.outputNames.map(() => new Float64Array(n)),
      draws: task.plan.inputs.map((_, i) =>
        request.keepDraws && storesDraws(task.plan, i) ? new Float64Array(n) : null
      ),
      firstTrial,
    };
    const c: RunCounts = {
      inputsOutside: calc.inputNames.map(() => 0),
      outputsOutside: calc.outputNames.map(() => 0),
    };
    try {
      runBlocks(calc, task.plan, task.runKey, task.m, task.blocks, targets, c);
    } catch (e) {
      return reply(t, plain(e));
    }
    results.push(targets.outputs);
    draws.push(targets.draws);
    counts.push(c);
    if (request.statistics !== null) {
      stats.push(
        sequenceStatistics(
          targets.outputs,
          request.statistics.coverage,
          request.statistics.interval,
        ),
      );
    }
    const tailSize = request.tailSize;
    if (tailSize !== null) tails.push(targets.outputs.map((col) => sortedTails(col, tailSize)));
  }
  return reply(-1, null);
}

/** Answers one request. */
async function answer(data: WorkerRequest): Promise<void> {
  if (data.type === "load") {
    try {
      await load(data.modules);
      port.postMessage({ type: "loaded", job: data.job, error: null } satisfies WorkerReply);
    } catch (e) {
      port.postMessage({ type: "loaded", job: data.job, error: plain(e) } satisfies WorkerReply);
    }
  } else {
    const reply = run(data) as Extract<WorkerReply, { type: "done" }>;
    const arrays = [
      ...reply.results.flat(),
      ...reply.draws.flat().filter((d): d is Float64Array => d !== null),
      ...reply.tails.flat().flatMap((t) => [t.low, t.high]),
    ];
    port.postMessage(reply, [...new Set(arrays.map((a) => a.buffer as ArrayBuffer))]);
  }
}

/** Requests answered in the order sent: each waits for the one before (a load awaits imports). */
let answered: Promise<void> = Promise.resolve();
port.on("message", (data: WorkerRequest) => {
  answered = answered.then(() => answer(data));
});
port.postMessage({ type: "ready" } satisfies WorkerReply);
