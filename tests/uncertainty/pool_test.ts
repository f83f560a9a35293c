import assert from "node:assert/strict";
import fc from "fast-check";
import {
  arcsine,
  continuityValveArea,
  createMonteCarloPool,
  defineCalculation,
  expressionModel,
  type MonteCarloPool,
  normal,
  PHN_2017_MODELS,
  propagate,
  type PropagateOptions,
  type Propagation,
  rectangular,
  studentT,
  triangular,
  zScoreCalculation,
} from "../../mod.ts";
import { planPropagation } from "../../calc/uncertainty/propagate.ts";
import { mergeTails, sortedTails } from "../../calc/uncertainty/intervals.ts";
import { BLOCK_TRIALS, range, runBlocks } from "../../calc/uncertainty/sampling.ts";
import process from "node:process";
import type { Worker as Thread } from "node:worker_threads";
import {
  crashesLater,
  exitsAboveEight,
  inverseRoot,
  rounded,
  scaled,
  scaledByTwo,
  sumAndProduct,
  waitsForeverAboveEight,
} from "./fixtures/pool_models.ts";

const fixtures = new URL("./fixtures/pool_models.ts", import.meta.url);

// Reference for every check below: the single-thread propagation of this package, whose results
// are checked against JCGM 101 in monte_carlo_test.ts. The pool must reproduce them bit for bit.

/** A call on a model that never returns (x ~ N(9, 0.1) is above 8 at every trial), limited to
 * `timeoutMs`. */
function neverReturns(pool: MonteCarloPool, timeoutMs: number, trials = 1000) {
  return pool.propagate(waitsForeverAboveEight, { x: normal(9, 0.1) }, {
    method: "monteCarlo",
    trials,
    timeoutMs,
  });
}

/** `promise`, or a failure naming `what` when it has not settled after `ms`: a pool that hangs
 * fails its test instead of hanging the suite. */
async function within<T>(ms: number, what: string, promise: Promise<T>): Promise<T> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const limit = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`${what}: not settled after ${ms} ms`)), ms);
  });
  try {
    return await Promise.race([promise, limit]);
  } finally {
    clearTimeout(timer);
  }
}

const mixedInputs = {
  a: normal(1, 0.1),
  b: normal(2, 0.2),
  c: rectangular(0.5, 1.5),
  d: triangular(1, 3, 1.5),
  e: arcsine(0.9, 1.1),
  f: studentT(1, 0.05, 4),
};
const mixedOptions: PropagateOptions = {
  method: "monteCarlo",
  trials: 3 * BLOCK_TRIALS + 1234, // a last block shorter than the others
  seed: 77,
  correlations: [["a", "b", 0.6] as const],
};
/** A run long enough (a second or more) to still be pending on both workers of a two-worker pool
 * when something happens to one of them. */
const longRun: PropagateOptions = {
  method: "monteCarlo",
  trials: 4_000_000,
  seed: 5,
  keepSamples: false,
};

function assertSameResult(actual: Propagation, expected: Propagation): void {
  assert.deepEqual(actual.monteCarlo, expected.monteCarlo);
  assert.deepEqual(actual.warnings, expected.warnings);
  assert.deepEqual(actual.correlation, expected.correlation);
  for (const name of expected.outputNames) {
    const a = actual.outputs[name]!, e = expected.outputs[name]!;
    assert.equal(a.value, e.value);
    assert.equal(a.standardUncertainty, e.standardUncertainty);
    assert.deepEqual(a.interval, e.interval);
    assert.deepEqual(a.shortestInterval, e.shortestInterval);
    assert.deepEqual(a.samples, e.samples);
  }
  for (const name of expected.calculation.inputNames) {
    assert.deepEqual(actual.inputs[name]!.samples, expected.inputs[name]!.samples);
  }
}

Deno.test("pool: results identical to one thread for 1, 2 and 3 workers (mixed shapes, correlation, short last block)", async () => {
  const single = propagate(sumAndProduct, mixedInputs, mixedOptions);
  for (const workers of [1, 2, 3]) {
    const pool = await createMonteCarloPool({ workers, modules: [fixtures] });
    try {
      assert.equal(pool.workers, workers);
      assertSameResult(await pool.propagate(sumAndProduct, mixedInputs, mixedOptions), single);
    } finally {
      pool.close();
    }
  }
});

Deno.test("pool: identical for several seeds; a chained step takes the earlier step's samples", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  for (const seed of [1, 2, 4_000_000_000]) {
    const options = { ...mixedOptions, seed, trials: 70_000 };
    const first = propagate(sumAndProduct, mixedInputs, options);
    assertSameResult(await pool.propagate(sumAndProduct, mixedInputs, options), first);
    // the next step on the pool draws nothing new and reuses the first step's trials
    const next = { x: first.outputs.sum };
    assertSameResult(
      await pool.propagate(rounded, next, { method: "monteCarlo" }),
      propagate(rounded, next, { method: "monteCarlo" }),
    );
  }
});

Deno.test("pool: a built-in calculation needs no extra module; units are converted on the calling thread", async () => {
  const inputs = {
    lvotDiameterCm: normal("20 mm", "1 mm"),
    lvotVtiCm: normal(20, 1),
    avVtiCm: normal(80, 3),
  };
  const options: PropagateOptions = {
    method: "monteCarlo",
    trials: 100_000,
    seed: 3,
    keepSamples: false,
  };
  using pool = await createMonteCarloPool({ workers: 2 });
  assertSameResult(
    await pool.propagate(continuityValveArea, inputs, options),
    propagate(continuityValveArea, inputs, options),
  );
});

Deno.test("pool: adaptive procedure identical to one thread (same sequences, same stop)", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const options: PropagateOptions = {
    method: "monteCarlo",
    adaptive: { significantDigits: 2 },
    seed: 11,
    correlations: [["a", "b", 0.6] as const],
  };
  const single = propagate(sumAndProduct, mixedInputs, options);
  const pooled = await pool.propagate(sumAndProduct, mixedInputs, options);
  assert.ok(single.monteCarlo!.adaptive!.sequences >= 2);
  assertSameResult(pooled, single);
  // a trial limit that stops the procedure before it stabilises: same stop, same warning
  const limited = { ...options, adaptive: { significantDigits: 4, maxTrials: 50_000 } };
  assertSameResult(
    await pool.propagate(sumAndProduct, mixedInputs, limited),
    propagate(sumAndProduct, mixedInputs, limited),
  );
});

Deno.test("pool: a non-finite model value is the same error as on one thread (refused), or the same exclusion", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const inputs = { x: normal(0.01, 1) };
  const excluded: PropagateOptions = { method: "monteCarlo", trials: 200_000, seed: 1 };
  const refused: PropagateOptions = { ...excluded, inconsistentTrials: "refuse" };
  let expected = "";
  try {
    propagate(inverseRoot, inputs, refused);
  } catch (e) {
    expected = (e as Error).message;
  }
  assert.match(expected, /output 'y' is not finite at Monte Carlo trial \d+/);
  await assert.rejects(() => pool.propagate(inverseRoot, inputs, refused), {
    name: "RangeError",
    message: expected,
  });
  await assert.rejects(
    () =>
      pool.propagate(inverseRoot, inputs, {
        method: "monteCarlo",
        adaptive: true,
        seed: 1,
        inconsistentTrials: "refuse",
      }),
    { name: "RangeError", message: /output 'y' is not finite at Monte Carlo trial \d+/ },
  );
  // excluded instead (the default): the same trials excluded, the same warning, bit for bit
  const adaptive: PropagateOptions = {
    method: "monteCarlo",
    adaptive: { significantDigits: 1 },
    seed: 1,
  };
  for (const options of [excluded, adaptive]) {
    assertSameResult(
      await pool.propagate(inverseRoot, inputs, options),
      propagate(inverseRoot, inputs, options),
    );
  }
});

Deno.test("pool: ties and zeros of both signs: same intervals as one thread, −0 included", async () => {
  // y = round(x) has many ties and gives −0 for x in (−0.5, −0]; the merged tails must keep the
  // order of a full sort (−0 before +0), as one thread does
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  for (const coverage of [0.4, 0.95]) {
    const options: PropagateOptions = { method: "monteCarlo", trials: 262_144, seed: 3, coverage };
    const inputs = { x: normal(0.45, 0.3) };
    assertSameResult(
      await pool.propagate(rounded, inputs, options),
      propagate(rounded, inputs, options),
    );
  }
});

Deno.test("pool: concurrent runs give the results of sequential runs", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const a = { ...mixedOptions, seed: 1 }, b = { ...mixedOptions, seed: 2 };
  const c: PropagateOptions = {
    method: "monteCarlo",
    seed: 3,
    adaptive: { significantDigits: 1 },
  };
  const [ra, rb, rc] = await Promise.all([
    pool.propagate(sumAndProduct, mixedInputs, a),
    pool.propagate(sumAndProduct, mixedInputs, b),
    pool.propagate(sumAndProduct, mixedInputs, c),
  ]);
  assertSameResult(ra, propagate(sumAndProduct, mixedInputs, a));
  assertSameResult(rb, propagate(sumAndProduct, mixedInputs, b));
  assertSameResult(rc, propagate(sumAndProduct, mixedInputs, c));
});

Deno.test("pool: closing during a run refuses the run with that reason", async () => {
  const pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const running = pool.propagate(sumAndProduct, mixedInputs, {
    ...mixedOptions,
    trials: 2_000_000,
  });
  pool.close();
  await within(
    30_000,
    "a call pending at close()",
    assert.rejects(() => running, {
      message: "Monte Carlo pool: the pool was closed during the run of 'Sum and product (test)'",
    }),
  );
});

Deno.test("pool: a calculation whose fingerprint differs from the workers' copy is refused", async () => {
  // same id, same formula source text, another value closed over (k = 3 here, 2 in the workers):
  // the pool must not run the workers' copy in its place (it would report the wrong numbers)
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const mine = scaled(3);
  assert.equal(mine.formula.toString(), scaledByTwo.formula.toString());
  assert.equal(mine.id, scaledByTwo.id);
  await assert.rejects(
    () => pool.propagate(mine, { x: normal(1, 0.1) }, { method: "monteCarlo", trials: 1000 }),
    {
      name: "TypeError",
      message:
        /^Monte Carlo pool: the workers' copy of 'testPoolScaled' differs from the one given \(fingerprint [0-9a-f]{12}… against [0-9a-f]{12}…\): same id, another definition/,
    },
  );
  // the same definition runs, and gives the one-thread answer
  const options: PropagateOptions = { method: "monteCarlo", trials: 1000, seed: 9 };
  assertSameResult(
    await pool.propagate(scaledByTwo, { x: normal(1, 0.1) }, options),
    propagate(scaledByTwo, { x: normal(1, 0.1) }, options),
  );
});

Deno.test("pool: calculations the workers cannot load, and misuse, are clear errors", async () => {
  await assert.rejects(() => createMonteCarloPool({ workers: 0 }), {
    name: "RangeError",
    message: "Monte Carlo pool: expected workers to be an integer in [1, 64], got 0",
  });
  await assert.rejects(() => createMonteCarloPool({ workers: 1, modules: ["./relative.ts"] }), {
    name: "TypeError",
    message: /expected modules as absolute URLs .* got '\.\/relative\.ts'/,
  });
  const missing = new URL("./fixtures/missing.ts", import.meta.url);
  await assert.rejects(() => createMonteCarloPool({ workers: 1, modules: [missing] }), {
    name: "TypeError",
    message: new RegExp(`^Monte Carlo pool: module ${missing.href} failed to load in a worker`),
  });
  await assert.rejects(
    () =>
      createMonteCarloPool({
        workers: 1,
        modules: [fixtures, new URL("./fixtures/pool_duplicate_id.ts", import.meta.url)],
      }),
    {
      name: "TypeError",
      message: /two different calculations share the id 'testPoolInverseRoot'/,
    },
  );
  using pool = await createMonteCarloPool({ workers: 1, modules: [fixtures] });
  const model = expressionModel({
    expression: "2 * x",
    inputs: { x: { unit: "1", description: "x", range: { min: -10, max: 10 } } },
    output: { name: "y", unit: "1", description: "y" },
  });
  const mc: PropagateOptions = { method: "monteCarlo", trials: 1000 };
  await assert.rejects(() => pool.propagate(model, { x: normal(1, 0.1) }, mc), {
    name: "TypeError",
    message:
      /cannot run in a worker \(an expression model is made at run time and needs mathjs, which workers do not load\); run it with propagate\(\) on this thread/,
  });
  const local = defineCalculation({ ...inverseRoot, id: "testPoolLocalOnly" });
  await assert.rejects(() => pool.propagate(local, { x: normal(5, 0.1) }, mc), {
    name: "TypeError",
    message: /calculation 'testPoolLocalOnly' is not registered.*list it in createMonteCarloPool/,
  });
  const impostor = defineCalculation({
    ...inverseRoot,
    formula: ({ x }: { x: number }) => ({ y: x }),
  });
  await assert.rejects(() => pool.propagate(impostor, { x: normal(5, 0.1) }, mc), {
    name: "TypeError",
    message: /the workers' copy of 'testPoolInverseRoot' differs from the one given/,
  });
  // bad inputs fail on the calling thread, before any draw, as on one thread
  await assert.rejects(() => pool.propagate(inverseRoot, { x: normal(5, -1) }, mc), {
    name: "RangeError",
  });
  pool.close();
  await assert.rejects(() => pool.propagate(inverseRoot, { x: normal(5, 0.1) }, mc), {
    message: "Monte Carlo pool: the pool is closed; create a new one",
  });
  pool.close(); // closing twice is harmless
});

Deno.test("trial blocks: any order of blocks gives the same values (a stream per source and block)", () => {
  const planned = planPropagation(sumAndProduct, mixedInputs, mixedOptions);
  assert.equal(planned.kind, "fixed");
  const run = (planned as Extract<typeof planned, { kind: "fixed" }>).run;
  const m = run.trials;
  const targets = () => ({
    outputs: [new Float64Array(m), new Float64Array(m)],
    draws: run.plan.inputs.map(() => new Float64Array(m)),
    firstTrial: 0,
  });
  const counts = () => ({ inputsOutside: [0, 0, 0, 0, 0, 0], outputsOutside: [0, 0] });
  const forward = targets(), backward = targets();
  const blocks = range(Math.ceil(m / BLOCK_TRIALS));
  runBlocks(sumAndProduct, run.plan, [run.seed], m, blocks, forward, counts());
  runBlocks(sumAndProduct, run.plan, [run.seed], m, blocks.toReversed(), backward, counts());
  assert.deepEqual(backward, forward);
});

Deno.test("merged tails of parts equal the tails of the whole (property, against a full sort)", () => {
  fc.assert(
    fc.property(
      fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }), {
        minLength: 2,
        maxLength: 400,
      }),
      fc.integer({ min: 1, max: 5 }),
      fc.integer({ min: 1, max: 100 }),
      (values, parts, countSeed) => {
        const all = Float64Array.from(values);
        const count = 1 + (countSeed % Math.floor(all.length / 2));
        const size = Math.ceil(all.length / parts);
        const pieces = range(parts).map((p) => all.subarray(p * size, (p + 1) * size)).filter((p) =>
          p.length
        );
        const tails = pieces.map((p) => sortedTails(p, count));
        const sorted = all.slice().sort();
        assert.deepEqual(
          mergeTails(tails.map((t) => t.low), count, "low"),
          sorted.subarray(0, count),
        );
        assert.deepEqual(
          mergeTails(tails.map((t) => t.high), count, "high"),
          sorted.subarray(all.length - count),
        );
      },
    ),
  );
});

Deno.test("pool: a worker that dies leaves the pool closed with the reason, never hanging", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const mc: PropagateOptions = { method: "monteCarlo", trials: 1000 };
  try {
    await pool.propagate(crashesLater, { x: normal(1, 0.1) }, {
      method: "monteCarlo",
      trials: 100,
    });
  } catch {
    // the run itself may finish first or be cut short by the crash
  }
  // the crash arrives as an event after the reply: poll until the pool refuses (10 s at most)
  let refusal: Error | null = null;
  for (let waited = 0; refusal === null && waited < 10_000; waited += 50) {
    await new Promise((resolve) => setTimeout(resolve, 50));
    await pool.propagate(inverseRoot, { x: normal(5, 0.1) }, mc).catch((e) => {
      refusal = e as Error;
    });
  }
  // the worker dies after its reply: between runs, or during the next call sent to it
  const cause =
    /worker [12] of 2 died of an uncaught error \(uncaught in the test fixture\) (between runs|while running 'Inverse root \(test\)')/;
  const refused = new RegExp(
    `^Monte Carlo pool: the pool failed \\(${cause.source}\\); create a new one$`,
  );
  const stopped = new RegExp(
    `^Monte Carlo pool: 'Inverse root \\(test\\)' stopped: ${cause.source}; the pool is closed: create a new one$`,
  );
  const message = String((refusal as Error | null)?.message);
  assert.ok(refused.test(message) || stopped.test(message), message);
  await assert.rejects(() => pool.propagate(inverseRoot, { x: normal(5, 0.1) }, mc), {
    message: refused,
  });
  pool.close(); // closing again is harmless
});

Deno.test("pool: a worker that calls Deno.exit() fails every pending call, naming the worker, the exit and the calculation; later calls say why", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  // 1000 trials are one block, all sent to worker 1; the long run then waits on both workers
  const exiting = pool.propagate(exitsAboveEight, { x: normal(9, 0.1) }, {
    method: "monteCarlo",
    trials: 1000,
  });
  const waiting = pool.propagate(sumAndProduct, mixedInputs, longRun);
  const [exited, stoppedToo] = await within(
    30_000,
    "calls pending when a worker exits",
    Promise.allSettled([exiting, waiting]),
  );
  const cause =
    "worker 1 of 2 exited with code 3 (a model or a module it loads called Deno.exit(), process.exit() or close()) while running 'Exits above eight (test)'";
  assert.equal(exited.status, "rejected");
  assert.equal(
    (exited as PromiseRejectedResult).reason.message,
    `Monte Carlo pool: 'Exits above eight (test)' stopped: ${cause}; the pool is closed: create a new one`,
  );
  assert.equal(stoppedToo.status, "rejected");
  assert.equal(
    (stoppedToo as PromiseRejectedResult).reason.message,
    `Monte Carlo pool: 'Sum and product (test)' stopped: ${cause}; the pool is closed: create a new one`,
  );
  await assert.rejects(
    () => pool.propagate(inverseRoot, { x: normal(5, 0.1) }, { method: "monteCarlo" }),
    { message: `Monte Carlo pool: the pool failed (${cause}); create a new one` },
  );
});

Deno.test("pool: a reply that cannot be read (messageerror) fails the pending call and the pool", async () => {
  // the threads the pool starts, as Node's process "worker" event reports them; no value a worker
  // can send makes Deno 2.9 fail to read it, so the event is emitted on the real thread here
  const threads: Thread[] = [];
  const seen = (thread: Thread) => threads.push(thread);
  process.on("worker", seen);
  let pool;
  try {
    pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  } finally {
    process.off("worker", seen);
  }
  using _ = pool;
  assert.equal(threads.length, 2);
  const waiting = pool.propagate(sumAndProduct, mixedInputs, longRun);
  threads[1]!.emit("messageerror", new Error("synthetic: data could not be deserialized"));
  const cause =
    "worker 2 of 2 sent a reply that could not be read (synthetic: data could not be deserialized) while running 'Sum and product (test)'";
  await within(
    30_000,
    "a call pending at a messageerror",
    assert.rejects(() => waiting, {
      message:
        `Monte Carlo pool: 'Sum and product (test)' stopped: ${cause}; the pool is closed: create a new one`,
    }),
  );
  await assert.rejects(
    () => pool.propagate(inverseRoot, { x: normal(5, 0.1) }, { method: "monteCarlo" }),
    { message: `Monte Carlo pool: the pool failed (${cause}); create a new one` },
  );
});

Deno.test("pool: timeoutMs refuses a call that never returns, naming the limit; the pool replaces the workers and loses no other call", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const hanging = neverReturns(pool, 1000, 2 * BLOCK_TRIALS); // two blocks: one on each worker
  // a call without a limit, queued behind it on both workers: replacing them must not lose it
  const queued = pool.propagate(sumAndProduct, mixedInputs, mixedOptions);
  await within(
    30_000,
    "a call past its time limit",
    assert.rejects(() => hanging, {
      name: "TimeoutError",
      message:
        "Monte Carlo pool: 'Waits forever above eight (test)' did not finish within timeoutMs = 1000 ms; workers 1 and 2 of 2 were stopped and replaced",
    }),
  );
  assertSameResult(
    await within(60_000, "the call queued behind it", queued),
    propagate(sumAndProduct, mixedInputs, mixedOptions),
  );
  // later calls, with a limit they stay under, give the one-thread results bit for bit
  const options: PropagateOptions = { method: "monteCarlo", trials: 1000, seed: 9 };
  assertSameResult(
    await within(
      60_000,
      "a call after the replacement",
      pool.propagate(scaledByTwo, { x: normal(1, 0.1) }, { ...options, timeoutMs: 60_000 }),
    ),
    propagate(scaledByTwo, { x: normal(1, 0.1) }, options),
  );
});

Deno.test("pool: time limits in quick succession: each call is refused, and the pool still answers", async () => {
  using pool = await createMonteCarloPool({ workers: 1, modules: [fixtures] });
  // the second waits behind the first, then on a replacement that may still be starting
  const first = neverReturns(pool, 500), second = neverReturns(pool, 700);
  const refusal = (ms: number) => ({
    name: "TimeoutError",
    message:
      `Monte Carlo pool: 'Waits forever above eight (test)' did not finish within timeoutMs = ${ms} ms; worker 1 of 1 was stopped and replaced`,
  });
  await within(
    30_000,
    "two calls past their limits",
    Promise.all([
      assert.rejects(() => first, refusal(500)),
      assert.rejects(() => second, refusal(700)),
    ]),
  );
  const options: PropagateOptions = { method: "monteCarlo", trials: 1000, seed: 9 };
  assertSameResult(
    await within(
      60_000,
      "a call after two replacements",
      pool.propagate(scaledByTwo, { x: normal(1, 0.1) }, options),
    ),
    propagate(scaledByTwo, { x: normal(1, 0.1) }, options),
  );
});

Deno.test("pool: a replacement worker that cannot load its modules fails the pool with that reason", async () => {
  // a module the first worker loads and its replacement cannot: deleted in between
  const temp = await Deno.makeTempFile({ prefix: "pool_extra_", suffix: ".ts" });
  await Deno.writeTextFile(temp, "export const unused = 0;\n");
  const extra = new URL(`file://${temp}`);
  using pool = await createMonteCarloPool({ workers: 1, modules: [fixtures, extra] });
  await Deno.remove(temp);
  const hanging = neverReturns(pool, 500);
  // queued behind it, then sent to the replacement
  const queued = pool.propagate(inverseRoot, { x: normal(5, 0.1) }, {
    method: "monteCarlo",
    trials: 1000,
  });
  await within(
    30_000,
    "a call past its limit",
    assert.rejects(() => hanging, { name: "TimeoutError" }),
  );
  const cause =
    `worker 1 of 1 could not be started again: module ${extra.href} failed to load in a worker: `;
  const stopped = await within(
    30_000,
    "a call sent to the replacement",
    queued.catch((e: Error) => e),
  );
  assert.ok(stopped instanceof Error);
  assert.ok(
    stopped.message.startsWith(`Monte Carlo pool: 'Inverse root (test)' stopped: ${cause}`),
    stopped.message,
  );
  assert.ok(stopped.message.endsWith("; the pool is closed: create a new one"), stopped.message);
  const refused = await pool.propagate(inverseRoot, { x: normal(5, 0.1) }, { method: "monteCarlo" })
    .catch((e: Error) => e);
  assert.ok(refused instanceof Error);
  assert.ok(
    refused.message.startsWith(`Monte Carlo pool: the pool failed (${cause}`),
    refused.message,
  );
});

Deno.test("pool: a module that ends its worker while loading: the pool is not made, and says why", async () => {
  const exits = new URL("./fixtures/pool_exits_on_load.ts", import.meta.url);
  await within(
    30_000,
    "a pool whose worker exits while loading",
    assert.rejects(() => createMonteCarloPool({ workers: 1, modules: [exits] }), {
      message:
        "Monte Carlo pool: the pool failed (worker 1 of 1 exited with code 4 (a model or a module it loads called Deno.exit(), process.exit() or close()) while loading its modules); create a new one",
    }),
  );
});

Deno.test("pool: timeoutMs must be a number of milliseconds in (0, 2147483647]", async () => {
  using pool = await createMonteCarloPool({ workers: 1, modules: [fixtures] });
  const run = (timeoutMs: unknown) =>
    pool.propagate(inverseRoot, { x: normal(5, 0.1) }, {
      method: "monteCarlo",
      trials: 1000,
      timeoutMs: timeoutMs as number,
    });
  // 2147483647 ms = 2³¹ − 1, the longest delay setTimeout keeps (a longer one fires at once)
  for (const bad of [0, -5, Number.NaN, Number.POSITIVE_INFINITY, 2 ** 31]) {
    await assert.rejects(() => run(bad), {
      name: "RangeError",
      message: `Monte Carlo pool: expected timeoutMs in (0, 2147483647] ms, got ${bad}`,
    });
  }
  await assert.rejects(() => run("1000"), {
    name: "TypeError",
    message: 'Monte Carlo pool: expected timeoutMs to be a number of milliseconds, got "1000"',
  });
  const options: PropagateOptions = { method: "monteCarlo", trials: 1000, seed: 4 };
  assertSameResult(
    await pool.propagate(inverseRoot, { x: normal(5, 0.1) }, {
      ...options,
      timeoutMs: 2 ** 31 - 1,
    }),
    propagate(inverseRoot, { x: normal(5, 0.1) }, options),
  );
  // the GUM law runs on the calling thread: a limit does not apply to it
  const gum = await pool.propagate(inverseRoot, { x: normal(5, 0.1) }, { timeoutMs: 1 });
  assert.equal(gum.outputs.y.value, propagate(inverseRoot, { x: normal(5, 0.1) }).outputs.y.value);
});

Deno.test("pool: a model that spins forever: a time limit leaves the pool usable, and close() lets the process end", async () => {
  // in a subprocess: Deno 2.9 cannot stop a thread spinning in synchronous code, so the spinning
  // threads this leaves behind end with that process, not with this one
  const script = new URL("./fixtures/pool_runaway_script.ts", import.meta.url);
  const child = new Deno.Command(Deno.execPath(), {
    args: ["run", "--allow-read", "--no-prompt", "--quiet", script.pathname],
    stdout: "piped",
    stderr: "piped",
  }).spawn();
  const limit = 90_000;
  const kill = setTimeout(() => child.kill("SIGKILL"), limit);
  const output = await child.output();
  const endedAt = Date.now();
  clearTimeout(kill);
  const stderr = new TextDecoder().decode(output.stderr);
  assert.equal(output.signal, null, `killed after ${limit} ms: the process hangs; ${stderr}`);
  assert.equal(output.code, 0, stderr);
  const lines = new TextDecoder().decode(output.stdout).trim().split("\n").map((line) =>
    JSON.parse(line)
  );
  assert.deepEqual(lines[0], {
    timedOut:
      "TimeoutError: Monte Carlo pool: 'Spins forever above eight (test)' did not finish within timeoutMs = 500 ms; worker 1 of 2 was stopped and replaced",
  });
  assert.deepEqual(lines[1], {
    after: propagate(scaledByTwo, { x: normal(1, 0.1) }, {
      method: "monteCarlo",
      trials: 1000,
      seed: 9,
    }).outputs.y.value,
  });
  assert.equal(typeof lines[2].closedAt, "number");
  assert.deepEqual(lines[3], {
    closedRun:
      "Error: Monte Carlo pool: the pool was closed during the run of 'Spins forever above eight (test)'",
  });
  // the process ends promptly after close(), although both workers still spin
  const afterClose = endedAt - lines[2].closedAt;
  assert.ok(afterClose < 10_000, `the process took ${afterClose} ms to end after close()`);
});

// A Z-score calculation is a catalog family member made again in the worker from its model's
// data, where zod (the check of model data) is not loaded: the worker's copy must still be the
// caller's, bit for bit (reference: the single-thread run, as above)
Deno.test("pool: a Z-score calculation (model data not re-checked in workers) gives the single-thread result", async () => {
  const z = zScoreCalculation(PHN_2017_MODELS.lvEndDiastolicDimension);
  const measurement = z.inputNames.find((n) => n !== "bsaM2")!;
  const inputs = { [measurement]: normal(3.6, 0.1), bsaM2: normal(0.9, 0.03) };
  const options: PropagateOptions = { method: "monteCarlo", trials: 100_000, seed: 7 };
  using pool = await createMonteCarloPool({ workers: 2 });
  assertSameResult(
    await pool.propagate(z, inputs as never, options),
    propagate(z, inputs as never, options),
  );
});
