/**
 * Monte Carlo on several cores: a pool of workers with an explicit lifecycle
 * ({@linkcode createMonteCarloPool} … `close()`). The pool runs the same trial engine and the
 * same stream layout as {@linkcode monteCarlo} and {@linkcode monteCarloAdaptive} (block b of a
 * run keyed k draws from MT19937 keyed [...k, b]), so its results are identical, bit for bit, to
 * the single-thread functions for any number of workers.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import {
  type AdaptiveOptions,
  type AdaptiveResult,
  adaptiveRun,
  coverageTailSize,
  finishMonteCarlo,
  mergeTails,
  type MonteCarloOptions,
  type MonteCarloResult,
  monteCarloRun,
  type SequenceRun,
} from "./montecarlo.ts";
import type { UncertainInputs } from "./prepare.ts";
import { EXPRESSION_MODEL_ID } from "./expression.ts";
import { BLOCK_TRIALS, blockCount, range, type TrialPlan } from "./trials.ts";
import type { WorkerReply, WorkerRequest, WorkerTask } from "./worker.ts";

/** Options of {@linkcode createMonteCarloPool}. */
export interface MonteCarloPoolOptions {
  /** Number of workers, an integer in [1, 64]. @default navigator.hardwareConcurrency (at most 64) */
  readonly workers?: number;
  /** Absolute URLs of modules whose exported calculations the workers may run, besides the
   * package's own (mod.ts). A calculation defined in a notebook cell cannot run in a worker:
   * define it in a module and list the module here. */
  readonly modules?: readonly (string | URL)[];
}

/** A pool of Monte Carlo workers. Close it when done (or use `using`). */
export interface MonteCarloPool {
  /** Number of workers. */
  readonly workers: number;
  /** {@linkcode monteCarlo} with the blocks of trials shared among the workers. */
  monteCarlo<I extends string, O extends string>(
    calc: Calculation<I, O>,
    inputs: UncertainInputs<I>,
    options?: MonteCarloOptions,
  ): Promise<MonteCarloResult<O>>;
  /** {@linkcode monteCarloAdaptive} with sequences computed ahead in parallel and taken in order
   * (sequences past the stopping point are discarded). */
  monteCarloAdaptive<I extends string, O extends string>(
    calc: Calculation<I, O>,
    inputs: UncertainInputs<I>,
    options?: AdaptiveOptions,
  ): Promise<AdaptiveResult<O>>;
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

type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/** The error a worker reported, as the same class. */
function rebuild(error: { name: string; message: string }): Error {
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

/**
 * Starts a pool of Monte Carlo workers. Each worker loads the package and the given modules once
 * (about 0.2 s and 15–25 MB per worker; mathjs is not loaded in workers); the pool then runs
 * {@linkcode monteCarlo} and {@linkcode monteCarloAdaptive} across them with results identical to
 * the single-thread functions, bit for bit, whatever the number of workers.
 *
 * Inputs are prepared (units converted, distributions checked) on the calling thread; workers
 * only draw and evaluate. Worth it for runs of about 10⁵ trials and more.
 *
 * @param options Number of workers and extra modules with calculations.
 * @returns The pool; close it when done.
 * @throws {RangeError} For a bad number of workers.
 * @throws {TypeError} For a module that is not an absolute URL, or one that fails to load.
 *
 * @example Same result as the single-thread function
 * ```ts
 * import { continuityValveArea, createMonteCarloPool, monteCarlo, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const inputs = { lvotDiameterCm: normal(2.0, 0.1), lvotVtiCm: normal(20, 1), avVtiCm: normal(80, 3) };
 * const pool = await createMonteCarloPool({ workers: 2 });
 * try {
 *   const parallel = await pool.monteCarlo(continuityValveArea, inputs, { trials: 200_000, seed: 5 });
 *   const single = monteCarlo(continuityValveArea, inputs, { trials: 200_000, seed: 5 });
 *   assert.equal(parallel.outputs.avaCm2.estimate, single.outputs.avaCm2.estimate);
 *   assert.deepEqual(parallel.outputs.avaCm2.symmetricInterval, single.outputs.avaCm2.symmetricInterval);
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
  const modules = [new URL("../../mod.ts", import.meta.url).href];
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
  /** Stops every worker: runs in flight are refused with `during`, later calls with `later`. */
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
  // a worker that died leaves the pool unusable: stop the others, refuse later calls
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
    if (failed?.error) {
      throw new TypeError(`Monte Carlo pool: ${failed.error.message}`);
    }
  } catch (e) {
    close();
    throw e;
  }

  /** Refuses what the workers cannot run, before any work is sent. */
  const checkRunnable = (calc: Calculation) => {
    if (calc.id === EXPRESSION_MODEL_ID) {
      throw new TypeError(
        `Monte Carlo pool: expression models need mathjs, which workers do not load; run '${calc.title}' with monteCarlo or monteCarloAdaptive on this thread`,
      );
    }
  };
  const ensureOpen = () => {
    if (refusal !== null) throw new Error(refusal);
  };

  /** Sends each worker its tasks (skipping idle workers) and waits for every reply. */
  const dispatch = (
    calc: Calculation,
    formula: string,
    plan: TrialPlan,
    shares: readonly (readonly WorkerTask[])[],
    coverage: number | null,
    tailSize: number | null,
  ): Promise<Done[]> =>
    Promise.all(
      shares.map((tasks, w) =>
        workers[w]!.request<Done>({
          type: "run",
          id: calc.id,
          formula,
          plan,
          tasks,
          coverage,
          tailSize,
        })
      ),
    );

  return {
    workers: count,
    async monteCarlo<I extends string, O extends string>(
      calc: Calculation<I, O>,
      inputs: UncertainInputs<I>,
      runOptions: MonteCarloOptions = {},
    ): Promise<MonteCarloResult<O>> {
      ensureOpen();
      checkRunnable(calc as unknown as Calculation);
      const run = monteCarloRun(calc, inputs, runOptions);
      const m = run.trials;
      const shares = split(range(blockCount(m)), count).map((blocks) => [
        { key: [run.seed], m, blocks },
      ]);
      const tailSize = coverageTailSize(m, run.coverage);
      const replies = await dispatch(
        calc as unknown as Calculation,
        calc.formula.toString(),
        run.plan,
        shares,
        null,
        tailSize,
      );
      // the failure of the earliest blocks, as the single-thread run would report it
      const failed = replies.find((r) => r.error);
      if (failed?.error) throw rebuild(failed.error);
      const outside = run.plan.inputs.map((_, i) =>
        replies.reduce((n, r) => n + r.outside[0]![i]!, 0)
      );
      const results = calc.outputNames.map((_, k) => {
        const all = new Float64Array(m);
        replies.forEach((r, w) =>
          all.set(r.results[0]![k]!, shares[w]![0]!.blocks[0]! * BLOCK_TRIALS)
        );
        return all;
      });
      // the intervals need only the tails: merge the workers' own (exact, as from one sort)
      const tails = calc.outputNames.map((_, k) => ({
        low: mergeTails(replies.map((r) => r.tails[0]![k]!.low), tailSize, "low"),
        high: mergeTails(replies.map((r) => r.tails[0]![k]!.high), tailSize, "high"),
      }));
      return finishMonteCarlo(calc, run, results, outside, tails);
    },

    async monteCarloAdaptive<I extends string, O extends string>(
      calc: Calculation<I, O>,
      inputs: UncertainInputs<I>,
      runOptions: AdaptiveOptions = {},
    ): Promise<AdaptiveResult<O>> {
      ensureOpen();
      checkRunnable(calc as unknown as Calculation);
      const state = adaptiveRun(calc, inputs, runOptions);
      const m = state.trialsPerSequence;
      const blocks = range(blockCount(m));
      const formula = calc.formula.toString();
      // rounds of sequences; the next round is sent before this one is taken, so that the
      // workers never wait for the main thread (a round past the stopping point is discarded)
      const lastSequence = state.maxSequences;
      let next = state.sequences;
      const inFlight: { shares: WorkerTask[][]; replies: Promise<Done[]> }[] = [];
      const send = () => {
        while (inFlight.length < ROUNDS_IN_FLIGHT && next < lastSequence) {
          const batch = Math.min(count * SEQUENCES_PER_WORKER, lastSequence - next);
          const first = next;
          const tasks: WorkerTask[] = range(batch).map((i) => ({
            key: [state.seed, first + i],
            m,
            blocks,
          }));
          const shares = split(tasks, count);
          const replies = dispatch(
            calc as unknown as Calculation,
            formula,
            state.plan,
            shares,
            state.coverage,
            null,
          );
          replies.catch(() => {}); // a discarded round may fail unobserved; a taken one rethrows
          inFlight.push({ shares, replies });
          next += batch;
        }
      };
      while (state.wantsMore()) {
        send();
        const round = inFlight.shift()!;
        const replies = await round.replies;
        // take the sequences in order until the procedure stops
        let stopped = false;
        for (const [w, reply] of replies.entries()) {
          for (let t = 0; t < round.shares[w]!.length; t++) {
            if (t === reply.failedTask) throw rebuild(reply.error!);
            const sequence: SequenceRun = {
              results: reply.results[t]! as Float64Array[],
              outside: reply.outside[t]!,
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
    },

    close,
    [Symbol.dispose]: close,
  };
}
