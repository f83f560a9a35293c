/**
 * Monte Carlo on several cores: a pool of workers with an explicit lifecycle
 * ({@linkcode createMonteCarloPool} … `close()`). The pool runs the same trial engine and the
 * same stream layout as {@linkcode propagate}, so its results are identical, bit for bit, to one
 * thread's for any number of workers. Workers make each calculation again from the catalog by its
 * recipe and refuse it when its fingerprint differs from the caller's copy.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { fingerprint } from "../core/catalog.ts";
import type { AdaptiveRun, SequenceRun } from "./adaptive.ts";
import { coverageTailSize, mergeTails } from "./intervals.ts";
import { finishMonteCarlo, type MonteCarloRun } from "./monte_carlo.ts";
import type { UncertainInputs } from "./prepare.ts";
import { displayable, planPropagation, type PropagateOptions } from "./propagate.ts";
import { propagateGum } from "./gum.ts";
import { BLOCK_TRIALS, blockCount, type PlanInput, range, type TrialPlan } from "./sampling.ts";
import type { Propagation } from "./types.ts";
import type { PlainError, WorkerReply, WorkerRequest, WorkerTask } from "./worker.ts";

/** Options of {@linkcode createMonteCarloPool}. */
export interface MonteCarloPoolOptions {
  /** Number of workers, an integer in [1, 64]. @default navigator.hardwareConcurrency (at most 64) */
  readonly workers?: number;
  /** Absolute URLs of modules whose exported calculations, families or catalogs the workers may
   * run, besides the package's catalog. A calculation defined in a notebook cell cannot run in a
   * worker: define it in a module and list the module here. */
  readonly modules?: readonly (string | URL)[];
}

/** A pool of Monte Carlo workers. Close it when done (or use `using`). */
export interface MonteCarloPool {
  /** Number of workers. */
  readonly workers: number;
  /** {@linkcode propagate} with the trials (or the adaptive sequences) shared among the workers;
   * the GUM law runs on the calling thread. */
  propagate<I extends string, O extends string>(
    calc: Calculation<I, O>,
    inputs: UncertainInputs<I>,
    options?: PropagateOptions,
  ): Promise<Propagation<I, O>>;
  /** Stops the workers; later calls are refused. */
  close(): void;
  /** Same as `close()`, for `using`. */
  [Symbol.dispose](): void;
}

/** Sequences of the adaptive procedure sent to each worker per round. */
const SEQUENCES_PER_WORKER = 4;
/** Rounds of sequences the adaptive procedure keeps in flight. */
const ROUNDS_IN_FLIGHT = 2;

type Done = Extract<WorkerReply, { type: "done" }>;
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/** One worker with request/reply bookkeeping. */
class PoolWorker {
  readonly #worker: Worker;
  readonly #pending = new Map<number, { resolve(r: WorkerReply): void; reject(e: Error): void }>();
  #next = 0;

  /** @param onFailure Called once the worker has died of an uncaught error. */
  constructor(onFailure: (message: string) => void) {
    this.#worker = new Worker(new URL("./worker.ts", import.meta.url), { type: "module" });
    this.#worker.onmessage = ({ data }: MessageEvent<WorkerReply>) => {
      const waiting = this.#pending.get(data.job);
      this.#pending.delete(data.job);
      waiting?.resolve(data);
    };
    this.#worker.onerror = (event: ErrorEvent) => {
      event.preventDefault();
      const error = new Error(`Monte Carlo pool: a worker failed: ${event.message}`);
      for (const waiting of this.#pending.values()) waiting.reject(error);
      this.#pending.clear();
      onFailure(event.message);
    };
  }

  /** Sends a request (its job number filled in) and waits for the reply. */
  request<R extends WorkerReply>(message: DistributiveOmit<WorkerRequest, "job">): Promise<R> {
    const job = this.#next++;
    return new Promise<R>((resolve, reject) => {
      this.#pending.set(job, { resolve: resolve as (r: WorkerReply) => void, reject });
      this.#worker.postMessage({ ...message, job });
    });
  }

  /** Stops the worker; requests still waiting are refused with `reason`. */
  terminate(reason: string): void {
    this.#worker.terminate();
    const error = new Error(reason);
    for (const waiting of this.#pending.values()) waiting.reject(error);
    this.#pending.clear();
  }
}

/** The error a worker reported, as the same class. */
function rebuildError(error: PlainError): Error {
  if (error.name === "RangeError") return new RangeError(error.message);
  if (error.name === "TypeError") return new TypeError(error.message);
  return new Error(error.message);
}

/** Splits `items` into at most `parts` contiguous runs of nearly equal length (none empty). */
function split<T>(items: readonly T[], parts: number): T[][] {
  const out: T[][] = [];
  const size = Math.ceil(items.length / parts);
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

/** The plan of a share of blocks: sample inputs cut to the share's trials. */
function sharePlan(plan: TrialPlan, first: number, n: number): TrialPlan {
  return {
    groups: plan.groups,
    inputs: plan.inputs.map((p): PlanInput =>
      p.kind === "samples" ? { kind: "samples", samples: p.samples.slice(first, first + n) } : p
    ),
  };
}

/**
 * Starts a pool of Monte Carlo workers. Each worker loads the package's catalog and the given
 * modules once (mathjs is not loaded in workers); the pool then runs {@linkcode propagate} by
 * Monte Carlo across them with results identical to one thread, bit for bit, whatever the number
 * of workers. Inputs are prepared (units converted, distributions checked) on the calling thread;
 * workers only draw and evaluate. Worth it for runs of about 10⁵ trials and more on a machine
 * with free cores.
 *
 * @param options Number of workers and extra modules with calculations.
 * @returns The pool; close it when done.
 * @throws {RangeError} For a bad number of workers.
 * @throws {TypeError} For a module that is not an absolute URL, or one that fails to load.
 *
 * @example Same result as one thread
 * ```ts
 * import { continuityValveArea, createMonteCarloPool, normal, propagate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const inputs = { lvotDiameterCm: normal(2.0, 0.1), lvotVtiCm: normal(20, 1), avVtiCm: normal(80, 3) };
 * const options = { method: "monteCarlo", trials: 200_000, seed: 5 } as const;
 * const pool = await createMonteCarloPool({ workers: 2 });
 * try {
 *   const parallel = await pool.propagate(continuityValveArea, inputs, options);
 *   const single = propagate(continuityValveArea, inputs, options);
 *   assert.equal(parallel.outputs.avaCm2.value, single.outputs.avaCm2.value);
 *   assert.deepEqual(parallel.outputs.avaCm2.interval, single.outputs.avaCm2.interval);
 * } finally {
 *   pool.close();
 * }
 * ```
 */
export async function createMonteCarloPool(
  options: MonteCarloPoolOptions = {},
): Promise<MonteCarloPool> {
  const count = options.workers ?? Math.min(64, navigator.hardwareConcurrency ?? 1);
  if (!(Number.isInteger(count) && count >= 1 && count <= 64)) {
    throw new RangeError(
      `Monte Carlo pool: expected workers to be an integer in [1, 64], got ${count}`,
    );
  }
  const modules: string[] = [];
  for (const m of options.modules ?? []) {
    let url: URL;
    try {
      url = new URL(String(m));
    } catch {
      throw new TypeError(
        `Monte Carlo pool: expected modules as absolute URLs (e.g. new URL("./models.ts", import.meta.url)), got '${m}'`,
      );
    }
    modules.push(url.href);
  }
  /** Why later calls are refused (null while the pool is open). */
  let refusal: string | null = null;
  const stop = (during: string, later: string) => {
    if (refusal !== null) return;
    refusal = later;
    workers.forEach((w) => w.terminate(during));
  };
  const close = () =>
    stop(
      "Monte Carlo pool: the pool was closed during the run",
      "Monte Carlo pool: the pool is closed; create a new one",
    );
  const workers = range(count).map(() =>
    new PoolWorker((message) => {
      const reason = `Monte Carlo pool: a worker failed (${message}); create a new pool`;
      stop(reason, reason);
    })
  );
  try {
    const loaded = await Promise.all(
      workers.map((w) =>
        w.request<Extract<WorkerReply, { type: "loaded" }>>({ type: "load", modules })
      ),
    );
    const failed = loaded.find((r) => r.error);
    if (failed?.error) throw new TypeError(`Monte Carlo pool: ${failed.error.message}`);
  } catch (e) {
    close();
    throw e;
  }

  /** Refuses what the workers cannot run, before any work is sent. */
  const checkRunnable = (calc: Calculation) => {
    if (calc.recipe.kind === "local") {
      throw new TypeError(
        `Monte Carlo pool: '${calc.title}' cannot run in a worker (${calc.recipe.why}); run it with propagate() on this thread`,
      );
    }
  };
  const ensureOpen = () => {
    if (refusal !== null) throw new Error(refusal);
  };
  const dispatch = (
    calc: Calculation,
    shares: readonly (readonly WorkerTask[])[],
    extra: Pick<
      Extract<WorkerRequest, { type: "run" }>,
      "keepDraws" | "statistics" | "tailSize"
    >,
  ): Promise<Done[]> => {
    const recipe = calc.recipe, print = fingerprint(calc);
    return Promise.all(
      shares.map((tasks, w) =>
        workers[w]!.request<Done>({ type: "run", recipe, fingerprint: print, tasks, ...extra })
      ),
    );
  };

  const fixed = async <I extends string, O extends string>(
    calc: Calculation<I, O>,
    run: MonteCarloRun<I>,
  ): Promise<Propagation<I, O>> => {
    const m = run.trials;
    const shares = split(range(blockCount(m)), count).map((blocks) => {
      const first = blocks[0]! * BLOCK_TRIALS;
      const n = Math.min(m, (blocks.at(-1)! + 1) * BLOCK_TRIALS) - first;
      return [{ runKey: [run.seed], m, blocks, plan: sharePlan(run.plan, first, n) }];
    });
    const tailSize = coverageTailSize(m, run.coverage);
    const replies = await dispatch(calc as unknown as Calculation, shares, {
      keepDraws: run.keepSamples,
      statistics: null,
      tailSize,
    });
    // the failure of the earliest blocks, as the single-thread run would report it
    const failed = replies.find((r) => r.error);
    if (failed?.error) throw rebuildError(failed.error);
    const at = (w: number) => shares[w]![0]!.blocks[0]! * BLOCK_TRIALS;
    const outputs = calc.outputNames.map((_, k) => {
      const all = new Float64Array(m);
      replies.forEach((r, w) => all.set(r.results[0]![k]!, at(w)));
      return all;
    });
    const draws = run.plan.inputs.map((p, i) => {
      if (p.kind !== "source" || !run.keepSamples) return null;
      const all = new Float64Array(m);
      replies.forEach((r, w) => all.set(r.draws[0]![i]!, at(w)));
      return all;
    });
    const counts = {
      inputsOutside: calc.inputNames.map((_, i) =>
        replies.reduce((n, r) => n + r.counts[0]!.inputsOutside[i]!, 0)
      ),
      outputsOutside: calc.outputNames.map((_, k) =>
        replies.reduce((n, r) => n + r.counts[0]!.outputsOutside[k]!, 0)
      ),
    };
    // the intervals need only the tails: merge the workers' own (exact, as from one sort)
    const tails = calc.outputNames.map((_, k) => ({
      low: mergeTails(replies.map((r) => r.tails[0]![k]!.low), tailSize, "low"),
      high: mergeTails(replies.map((r) => r.tails[0]![k]!.high), tailSize, "high"),
    }));
    return finishMonteCarlo(calc, run, { outputs, draws, firstTrial: 0 }, counts, { tails });
  };

  const adaptive = async <O extends string>(
    calc: Calculation,
    state: AdaptiveRun<O>,
  ): Promise<Propagation<string, O>> => {
    const m = state.trialsPerSequence;
    const blocks = range(blockCount(m));
    // rounds of sequences; the next round is sent before this one is taken, so that the workers
    // never wait for the main thread (a round past the stopping point is discarded)
    let next = state.sequences;
    const inFlight: { shares: WorkerTask[][]; replies: Promise<Done[]> }[] = [];
    const send = () => {
      while (inFlight.length < ROUNDS_IN_FLIGHT && next < state.maxSequences) {
        const batch = Math.min(count * SEQUENCES_PER_WORKER, state.maxSequences - next);
        const first = next;
        const tasks: WorkerTask[] = range(batch).map((i) => ({
          runKey: [state.seed, first + i],
          m,
          blocks,
          plan: state.plan,
        }));
        const shares = split(tasks, count);
        const replies = dispatch(calc, shares, {
          keepDraws: false,
          statistics: { coverage: state.coverage, interval: state.interval },
          tailSize: null,
        });
        replies.catch(() => {}); // a discarded round may fail unobserved; a taken one rethrows
        inFlight.push({ shares, replies });
        next += batch;
      }
    };
    while (state.wantsMore()) {
      send();
      const round = inFlight.shift()!;
      const replies = await round.replies;
      let stopped = false;
      for (const [w, reply] of replies.entries()) {
        for (let t = 0; t < round.shares[w]!.length; t++) {
          if (t === reply.failedTask) throw rebuildError(reply.error!);
          const sequence: SequenceRun = {
            results: reply.results[t]! as Float64Array[],
            inputsOutside: reply.counts[t]!.inputsOutside,
            outputsOutside: reply.counts[t]!.outputsOutside,
            stats: reply.stats[t]!,
          };
          if (state.add(sequence) || !state.wantsMore()) {
            stopped = true;
            break;
          }
        }
        if (stopped) break;
      }
    }
    return state.finish();
  };

  return {
    workers: count,
    async propagate<I extends string, O extends string>(
      calc: Calculation<I, O>,
      inputs: UncertainInputs<I>,
      runOptions: PropagateOptions = {},
    ): Promise<Propagation<I, O>> {
      ensureOpen();
      const planned = planPropagation(calc, inputs, runOptions);
      if (planned.kind === "gum") {
        return displayable(propagateGum(calc, planned.prepared, planned.options));
      }
      checkRunnable(calc as unknown as Calculation);
      if (planned.kind === "adaptive") {
        const result = await adaptive(calc as unknown as Calculation, planned.state);
        return displayable(result as unknown as Propagation<I, O>);
      }
      return displayable(await fixed(calc, planned.run));
    },
    close,
    [Symbol.dispose]: close,
  };
}
