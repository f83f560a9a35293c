/**
 * Monte Carlo on several cores: a pool of workers with an explicit lifecycle
 * ({@linkcode createMonteCarloPool} … `close()`). The pool runs the same trial engine and the
 * same stream layout as {@linkcode propagate}, so its results are identical, bit for bit, to one
 * thread's for any number of workers. Workers make each calculation again from the catalog by its
 * recipe and refuse it when its fingerprint differs from the caller's copy.
 *
 * A pool never hangs on a worker. What Deno 2.9 does, measured (and why the workers run on
 * `node:worker_threads` rather than the web `Worker`):
 *
 * - A web `Worker` that calls `Deno.exit()` or `close()` stops without any event on the calling
 *   side (no `error`, no `messageerror`, no reply), and `Worker.terminate()` does not stop a
 *   worker running synchronous code: the thread keeps its core and keeps the process alive.
 * - A `node:worker_threads` Worker reports every way it ends by its `exit` event (`Deno.exit(n)`
 *   and `process.exit(n)`: code n; `close()`: 0; an uncaught error: an `error` event, then 1), and
 *   after its `terminate()` the process can end even while the thread still spins.
 * - Nothing in Deno 2.9 interrupts synchronous JavaScript running in another thread: a model that
 *   never returns keeps its thread busy until the process ends, whatever the pool does. The pool
 *   stops waiting for it, replaces it (time limit) or drops it (`close()`), and the process can
 *   exit; a long-lived process (a notebook kernel) keeps that core busy until it restarts.
 * - A heartbeat cannot tell a dead worker from one inside a long run (which answers nothing until
 *   the run ends), so the pool relies on the `exit`, `error` and `messageerror` events instead.
 *
 * @module
 */
import { Worker as Thread } from "node:worker_threads";
import type { Calculation } from "../core/types.ts";
import { fingerprint } from "../core/catalog.ts";
import type { AdaptiveRun, SequenceRun } from "./adaptive.ts";
import { coverageTailSize, mergeTails } from "./intervals.ts";
import { excludedTrials, finishMonteCarlo, type MonteCarloRun } from "./monte_carlo.ts";
import type { UncertainInputs } from "./prepare.ts";
import { displayable, planPropagation, type PropagateOptions } from "./propagate.ts";
import { propagateGum } from "./gum.ts";
import {
  BLOCK_TRIALS,
  blockCount,
  type PlanInput,
  range,
  storesDraws,
  type TrialPlan,
} from "./sampling.ts";
import type { Propagation } from "./types.ts";
import type { PlainError, WorkerReply, WorkerRequest, WorkerTask } from "./worker.ts";

/**
 * Options of {@linkcode createMonteCarloPool}.
 *
 * @example Options the pool refuses, and why
 * ```ts
 * import { createMonteCarloPool, type MonteCarloPoolOptions } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // a worker cannot resolve a relative path: modules are absolute URLs
 * const relative: MonteCarloPoolOptions = { workers: 2, modules: ["./models.ts"] };
 * await assert.rejects(() => createMonteCarloPool(relative), {
 *   name: "TypeError",
 *   message: /expected modules as absolute URLs .* got '\.\/models\.ts'/,
 * });
 * await assert.rejects(() => createMonteCarloPool({ workers: 0 }), {
 *   name: "RangeError",
 *   message: "Monte Carlo pool: expected workers to be an integer in [1, 64], got 0",
 * });
 * ```
 */
export interface MonteCarloPoolOptions {
  /** Number of workers, an integer in [1, 64]. @default navigator.hardwareConcurrency (at most 64) */
  readonly workers?: number;
  /** Absolute URLs of modules whose exported calculations, families or catalogs the workers may
   * run, besides the package's catalog. A calculation defined in a notebook cell cannot run in a
   * worker: define it in a module and list the module here. */
  readonly modules?: readonly (string | URL)[];
}

/**
 * A pool of Monte Carlo workers. Close it when done (or use `using`): open workers keep the
 * process alive.
 *
 * @example A time limit per call; a call past it is refused and the pool goes on
 * ```ts
 * import {
 *   continuityValveArea, createMonteCarloPool, normal, propagate,
 * } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const inputs = {
 *   lvotDiameterCm: normal(2.0, 0.1), lvotVtiCm: normal(20, 1), avVtiCm: normal(80, 3),
 * };
 * using pool = await createMonteCarloPool({ workers: 1 });
 * // two million trials cannot be done in a millisecond
 * await assert.rejects(
 *   () =>
 *     pool.propagate(continuityValveArea, inputs, {
 *       method: "monteCarlo", trials: 2_000_000, timeoutMs: 1,
 *     }),
 *   {
 *     name: "TimeoutError",
 *     message: /within timeoutMs = 1 ms; worker 1 of 1 was stopped and replaced$/,
 *   },
 * );
 * // the new worker gives the one-thread result, bit for bit
 * const options = { method: "monteCarlo", trials: 50_000, seed: 2 } as const;
 * const pooled = await pool.propagate(continuityValveArea, inputs, { ...options, timeoutMs: 60_000 });
 * const single = propagate(continuityValveArea, inputs, options);
 * assert.equal(pooled.outputs.avaCm2.value, single.outputs.avaCm2.value);
 * assert.deepEqual(pooled.outputs.avaCm2.interval, single.outputs.avaCm2.interval);
 * ```
 */
export interface MonteCarloPool {
  /** Number of workers. */
  readonly workers: number;
  /**
   * {@linkcode propagate} with the trials (or the adaptive sequences) shared among the workers;
   * the GUM law runs on the calling thread.
   *
   * `timeoutMs` limits this call: when its Monte Carlo run has not finished that many
   * milliseconds after the call (waiting behind other calls on the same workers included), the
   * call is refused with a `TimeoutError` naming the limit, and the workers busy with it are
   * replaced by new ones (other calls queued on them are sent again and give the same results).
   * A model that never returns keeps its old thread busy until the process ends: nothing can stop
   * it in Deno 2.9 (see the module notes). Without `timeoutMs` a call has no limit. The GUM law
   * runs on this thread and is not limited.
   *
   * @throws {RangeError} For `timeoutMs` outside (0, 2147483647] ms (the longest delay a timer
   * keeps), and as {@linkcode propagate}.
   * @throws {TypeError} For a `timeoutMs` that is not a number, and as {@linkcode propagate}.
   */
  propagate<I extends string, O extends string>(
    calc: Calculation<I, O>,
    inputs: UncertainInputs<I>,
    options?: PropagateOptions & { readonly timeoutMs?: number },
  ): Promise<Propagation<I, O>>;
  /** Stops the workers (calls in progress are refused, naming the calculation; the process can
   * exit even if a model never returns); later calls are refused. Closing twice is harmless. */
  close(): void;
  /** Same as `close()`, for `using`. */
  [Symbol.dispose](): void;
}

/** Sequences of the adaptive procedure sent to each worker per round. */
const SEQUENCES_PER_WORKER = 4;
/** Rounds of sequences the adaptive procedure keeps in flight. */
const ROUNDS_IN_FLIGHT = 2;
/** The longest delay a timer keeps, in ms (2³¹ − 1; a longer one fires at once). */
const LONGEST_TIMEOUT_MS = 2 ** 31 - 1;
/** Node's Worker takes only file: and data: URLs, and the package may be loaded over https: a
 * worker starts from this data: module, which imports the real one. */
const WORKER_START = new URL(
  `data:text/javascript,${
    encodeURIComponent(
      `await import(${JSON.stringify(new URL("./worker.ts", import.meta.url).href)});`,
    )
  }`,
);

type Done = Extract<WorkerReply, { type: "done" }>;
type DistributiveOmit<T, K extends PropertyKey> = T extends unknown ? Omit<T, K> : never;

/** One call of `pool.propagate` running on the workers. */
interface Call {
  readonly title: string;
  /** Set when the call has its answer or was refused: its work left on the workers is waste. */
  done: boolean;
  /** Refuses the call (the first refusal counts). */
  readonly refuse: (error: Error) => void;
}

/** A request to a worker and who waits for its reply. */
interface Job {
  readonly message: WorkerRequest;
  /** The call it belongs to; null for loading the modules. */
  readonly call: Call | null;
  readonly resolve: (reply: WorkerReply) => void;
  readonly reject: (error: Error) => void;
}

/** One worker with request/reply bookkeeping; its thread can be replaced. */
class PoolWorker {
  /** 1-based position in the pool. */
  readonly number: number;
  /** "worker 2 of 4", for messages. */
  readonly name: string;
  /** Settles when the first thread has loaded its modules; a TypeError when one failed. */
  readonly loaded: Promise<void>;
  readonly #modules: readonly string[];
  readonly #onFailure: (cause: string) => void;
  #thread: Thread;
  /** Requests not yet answered, oldest first: the worker answers in order, so the first is the
   * one it is busy with. */
  #jobs = new Map<number, Job>();
  #next = 0;
  #stopped = false;
  /** Whether the current thread listens: requests wait in `#jobs` until it does. */
  #listening = false;

  /**
   * Starts the thread and sends it the modules to load (see {@linkcode PoolWorker.loaded}).
   *
   * @param onFailure Called with the cause ("worker 2 of 4 exited with code 3 … while running
   * 'Title'") when the thread ends or fails by itself.
   */
  constructor(
    number: number,
    count: number,
    modules: readonly string[],
    onFailure: (cause: string) => void,
  ) {
    this.number = number;
    this.name = `worker ${number} of ${count}`;
    this.#modules = modules;
    this.#onFailure = onFailure;
    this.#thread = this.#start();
    this.loaded = this.#load().then((error) => {
      if (error) throw new TypeError(`Monte Carlo pool: ${error.message}`);
    });
  }

  #start(): Thread {
    const thread = new Thread(WORKER_START);
    // events of a thread already replaced or stopped are ignored (it was let go on purpose)
    const failed = (what: string) => {
      if (this.#stopped || thread !== this.#thread) return;
      const busy = this.#jobs.values().next().value;
      const doing = busy === undefined
        ? "between runs"
        : busy.call === null
        ? "while loading its modules"
        : `while running '${busy.call.title}'`;
      this.#onFailure(`${this.name} ${what} ${doing}`);
    };
    thread.on("message", (reply: WorkerReply) => {
      if (this.#stopped || thread !== this.#thread) return;
      if (reply.type === "ready") {
        this.#listening = true;
        for (const job of this.#jobs.values()) thread.postMessage(job.message);
        return;
      }
      const job = this.#jobs.get(reply.job);
      this.#jobs.delete(reply.job);
      job?.resolve(reply);
    });
    thread.on("error", (e: Error) => failed(`died of an uncaught error (${e.message})`));
    thread.on("messageerror", (e: Error) => {
      failed(`sent a reply that could not be read (${e.message})`);
    });
    thread.on("exit", (code: number) => {
      failed(
        `exited with code ${code} (a model or a module it loads called Deno.exit(), process.exit() or close())`,
      );
    });
    this.#listening = false;
    return thread;
  }

  /** Sends the modules to load (first in the thread's queue); the reply's error, if any. */
  async #load(): Promise<PlainError | null> {
    const reply = await this.request<Extract<WorkerReply, { type: "loaded" }>>(
      { type: "load", modules: this.#modules },
      null,
    );
    return reply.error;
  }

  /** Sends a request (its job number filled in) and waits for the reply. */
  request<R extends WorkerReply>(
    message: DistributiveOmit<WorkerRequest, "job">,
    call: Call | null,
  ): Promise<R> {
    return new Promise<R>((resolve, reject) => {
      const job = this.#next++;
      const full = { ...message, job } as WorkerRequest;
      this.#jobs.set(job, {
        message: full,
        call,
        resolve: resolve as (r: WorkerReply) => void,
        reject,
      });
      if (this.#listening) this.#thread.postMessage(full);
    });
  }

  /** Whether a request of `call` waits for this worker. */
  holds(call: Call): boolean {
    return [...this.#jobs.values()].some((job) => job.call === call);
  }

  /**
   * Lets the thread go and starts a new one, which loads the modules and is sent again every
   * run still waiting, in the same order, except those `drop` refuses (with its error). A new
   * thread that cannot load the modules is a failure of the worker.
   */
  replace(drop: (call: Call) => Error | null): void {
    const waiting = [...this.#jobs.values()];
    this.#jobs = new Map();
    const old = this.#thread;
    this.#thread = this.#start(); // first: terminate() may report the old thread's exit at once
    letGo(old);
    this.#load().then((error) => {
      if (error) this.#onFailure(`${this.name} could not be started again: ${error.message}`);
    }, () => {}); // refused: this thread was replaced or stopped in turn, which says why
    for (const job of waiting) {
      const error = job.call === null ? REPLACED : drop(job.call);
      if (error !== null) {
        job.reject(error);
      } else {
        this.#jobs.set(job.message.job, job); // sent when the new thread listens
      }
    }
  }

  /** Lets the thread go for good; requests still waiting are refused with `error(job)`. */
  stop(error: (job: Job) => Error): void {
    this.#stopped = true;
    letGo(this.#thread);
    for (const job of this.#jobs.values()) job.reject(error(job));
    this.#jobs.clear();
  }
}

/** Refuses the modules load of a thread replaced before it answered (its replacement loads
 * them again; nobody reads this). */
const REPLACED = new Error("Monte Carlo pool: replaced before loading its modules");

/** Terminates a thread without waiting: a thread stuck in synchronous code runs on until the
 * process ends (Deno 2.9), but no longer keeps the process alive. */
function letGo(thread: Thread): void {
  // the promise only reports the exit code of a thread the pool no longer listens to
  thread.terminate().catch(() => {});
}

/** "worker 1 of 2", "workers 1 and 3 of 4". */
function workerList(workers: readonly PoolWorker[], count: number): string {
  const numbers = workers.map((w) => w.number);
  return numbers.length === 1
    ? `worker ${numbers[0]} of ${count}`
    : `workers ${numbers.slice(0, -1).join(", ")} and ${numbers.at(-1)} of ${count}`;
}

/** Checks a time limit in milliseconds (undefined: none). */
function checkTimeout(timeoutMs: unknown): number | null {
  if (timeoutMs === undefined) return null;
  if (typeof timeoutMs !== "number") {
    throw new TypeError(
      `Monte Carlo pool: expected timeoutMs to be a number of milliseconds, got ${
        JSON.stringify(timeoutMs)
      }`,
    );
  }
  if (!(timeoutMs > 0 && timeoutMs <= LONGEST_TIMEOUT_MS)) {
    throw new RangeError(
      `Monte Carlo pool: expected timeoutMs in (0, ${LONGEST_TIMEOUT_MS}] ms, got ${timeoutMs}`,
    );
  }
  return timeoutMs;
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

/** The plan of a share of blocks: sample inputs cut to the share's trials, the rest as planned. */
function sharePlan(plan: TrialPlan, first: number, n: number): TrialPlan {
  return {
    ...plan,
    inputs: plan.inputs.map((p): PlanInput =>
      p.kind === "samples" ? { kind: "samples", samples: p.samples.slice(first, first + n) } : p
    ),
  };
}

/**
 * Starts a pool of Monte Carlo workers. Each worker loads the package's catalog and the given
 * modules once (mathjs and zod are not loaded in workers); the pool then runs
 * {@linkcode propagate} by Monte Carlo across them with results identical to one thread, bit for
 * bit, whatever the number of workers. Inputs are prepared (units converted, distributions
 * checked) on the calling thread; workers only draw and evaluate.
 *
 * When it helps: Monte Carlo runs of about 10⁵ trials and more (or the adaptive procedure) on a
 * machine with free cores; the time falls with the number of workers up to the number of cores
 * nobody else is using. When it does not: the GUM law (it runs on the calling thread anyway),
 * short runs (starting the workers, each loading the catalog in about a second, and gathering
 * their samples cost more than the trials), a single core or cores already busy (other processes,
 * another pool), and calculations the workers cannot load (defined in a notebook cell, expression
 * models).
 *
 * Measured (bench/results.md, bench/analysis.md) for 10⁶ trials of the continuity model with an
 * uncertain angle on a 2-core machine: the pool of two took 39 ms against 54 ms on one thread in
 * one run of 41 rounds, but was slower than one thread in another run and whenever other work
 * shared its cores. It used about 174–180 MB instead of about 105–109 MB. It pays only with idle
 * cores and runs long enough to repay starting the workers (about 0.2–0.5 s per pool);
 * `propagate` therefore stays single-thread and the pool is opt-in.
 *
 * Failures: a worker that ends or fails instead of answering (a model or module calling
 * `Deno.exit()` or `close()`, an uncaught error, a reply that cannot be read) refuses every call
 * in progress, naming the worker, what happened and the calculation it was running, and fails the
 * pool: later calls are refused with that reason. An error thrown by a model during a run is that
 * call's error (the same as on one thread), and the pool goes on. A call past its `timeoutMs` (see
 * {@linkcode MonteCarloPool}) is refused and its workers are replaced.
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
  /** Calls in progress. */
  const calls = new Set<Call>();
  /** Refuses every call in progress with `error(call)` and later ones with `later`, and lets every
   * worker go. */
  const stop = (later: string, error: (call: Call) => Error) => {
    if (refusal !== null) return;
    refusal = later;
    for (const call of calls) call.refuse(error(call));
    for (const w of workers) w.stop((job) => (job.call ? error(job.call) : new Error(later)));
  };
  const close = () =>
    stop(
      "Monte Carlo pool: the pool is closed; create a new one",
      (call) =>
        new Error(`Monte Carlo pool: the pool was closed during the run of '${call.title}'`),
    );
  const fail = (cause: string) =>
    stop(
      `Monte Carlo pool: the pool failed (${cause}); create a new one`,
      (call) =>
        new Error(
          `Monte Carlo pool: '${call.title}' stopped: ${cause}; the pool is closed: create a new one`,
        ),
    );
  const workers = range(count).map((i) => new PoolWorker(i + 1, count, modules, fail));
  try {
    await Promise.all(workers.map((w) => w.loaded));
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
  /** Refuses a call past its time limit and replaces the workers busy with it. A timer fires only
   * while its call waits for a worker: the timer is cleared as the call settles, and the call's
   * work on this thread between two replies never awaits. */
  const timeOut = (call: Call, timeoutMs: number) => {
    const busy = workers.filter((w) => w.holds(call));
    const error = new DOMException(
      `Monte Carlo pool: '${call.title}' did not finish within timeoutMs = ${timeoutMs} ms; ${
        workerList(busy, count)
      } ${busy.length === 1 ? "was" : "were"} stopped and replaced`,
      "TimeoutError",
    );
    call.refuse(error);
    // runs of calls already answered (adaptive rounds past the stop) are not sent again
    for (const w of busy) w.replace((c) => (c === call || c.done ? error : null));
  };
  /** Runs `work` as a call: refused on close, failure or time limit, whatever the work awaits. */
  const track = async <T>(
    title: string,
    timeoutMs: number | null,
    work: (call: Call) => Promise<T>,
  ): Promise<T> => {
    let reject!: (error: Error) => void;
    const refused = new Promise<never>((_, r) => (reject = r));
    const call: Call = {
      title,
      done: false,
      refuse: (error) => {
        call.done = true;
        reject(error);
      },
    };
    calls.add(call);
    const timer = timeoutMs === null
      ? undefined
      : setTimeout(() => timeOut(call, timeoutMs), timeoutMs);
    const running = work(call);
    try {
      return await Promise.race([running, refused]);
    } finally {
      call.done = true;
      calls.delete(call);
      clearTimeout(timer);
    }
  };
  const dispatch = (
    call: Call,
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
        workers[w]!.request<Done>(
          { type: "run", recipe, fingerprint: print, tasks, ...extra },
          call,
        )
      ),
    );
  };

  const fixed = async <I extends string, O extends string>(
    call: Call,
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
    const replies = await dispatch(call, calc as unknown as Calculation, shares, {
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
    const draws = run.plan.inputs.map((_, i) => {
      if (!run.keepSamples || !storesDraws(run.plan, i)) return null;
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
    // the intervals need only the tails: merge the workers' own (exact, as from one sort). They
    // are of the trials kept (excluded ones are NaN and left out), whose fewer values need shorter
    // tails: each worker's tails hold at least its share of those.
    const keptTail = coverageTailSize(m - excludedTrials(outputs), run.coverage);
    const tails = calc.outputNames.map((_, k) => ({
      low: mergeTails(replies.map((r) => r.tails[0]![k]!.low), keptTail, "low"),
      high: mergeTails(replies.map((r) => r.tails[0]![k]!.high), keptTail, "high"),
    }));
    return finishMonteCarlo(calc, run, { outputs, draws, firstTrial: 0 }, counts, { tails });
  };

  const adaptive = async <O extends string>(
    call: Call,
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
        const replies = dispatch(call, calc, shares, {
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
      // a refused call sends no more rounds (its answer was given: this error reaches no one)
      if (call.done) throw new Error(`Monte Carlo pool: '${calc.title}' was refused`);
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
      runOptions: PropagateOptions & { readonly timeoutMs?: number } = {},
    ): Promise<Propagation<I, O>> {
      ensureOpen();
      const { timeoutMs, ...propagateOptions } = runOptions;
      const limit = checkTimeout(timeoutMs);
      const planned = planPropagation(calc, inputs, propagateOptions);
      if (planned.kind === "gum") {
        return displayable(propagateGum(calc, planned.prepared, planned.options));
      }
      const untyped = calc as unknown as Calculation;
      checkRunnable(untyped);
      if (planned.kind === "adaptive") {
        const state = planned.state;
        const result = await track(calc.title, limit, (call) => adaptive(call, untyped, state));
        return displayable(result as unknown as Propagation<I, O>);
      }
      const run = planned.run;
      return displayable(await track(calc.title, limit, (call) => fixed(call, calc, run)));
    },
    close,
    [Symbol.dispose]: close,
  };
}
