import assert from "node:assert/strict";
import fc from "fast-check";
import {
  arcsine,
  continuityValveArea,
  createMonteCarloPool,
  defineCalculation,
  expressionModel,
  normal,
  propagate,
  type PropagateOptions,
  type Propagation,
  rectangular,
  studentT,
  triangular,
} from "../../mod.ts";
import { planPropagation } from "../../calc/uncertainty/propagate.ts";
import { mergeTails, sortedTails } from "../../calc/uncertainty/intervals.ts";
import { BLOCK_TRIALS, range, runBlocks } from "../../calc/uncertainty/sampling.ts";
import {
  crashesLater,
  inverseRoot,
  rounded,
  scaled,
  scaledByTwo,
  sumAndProduct,
} from "./fixtures/pool_models.ts";

const fixtures = new URL("./fixtures/pool_models.ts", import.meta.url);

// Reference for every check below: the single-thread propagation of this package, whose results
// are checked against JCGM 101 in monte_carlo_test.ts. The pool must reproduce them bit for bit.

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

Deno.test("pool: a non-finite model value is the same error as on one thread", async () => {
  using pool = await createMonteCarloPool({ workers: 2, modules: [fixtures] });
  const inputs = { x: normal(0.01, 1) };
  const options: PropagateOptions = { method: "monteCarlo", trials: 200_000, seed: 1 };
  let expected = "";
  try {
    propagate(inverseRoot, inputs, options);
  } catch (e) {
    expected = (e as Error).message;
  }
  assert.match(expected, /output 'y' is not finite at Monte Carlo trial \d+/);
  await assert.rejects(() => pool.propagate(inverseRoot, inputs, options), {
    name: "RangeError",
    message: expected,
  });
  await assert.rejects(
    () => pool.propagate(inverseRoot, inputs, { method: "monteCarlo", adaptive: true, seed: 1 }),
    { name: "RangeError", message: /output 'y' is not finite at Monte Carlo trial \d+/ },
  );
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
  await assert.rejects(() => running, {
    message: "Monte Carlo pool: the pool was closed during the run",
  });
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
  assert.match(
    String((refusal as Error | null)?.message),
    /Monte Carlo pool: a worker failed.*uncaught in the test fixture/,
  );
  await assert.rejects(() => pool.propagate(inverseRoot, { x: normal(5, 0.1) }, mc), {
    message:
      /Monte Carlo pool: a worker failed \(.*uncaught in the test fixture.*\); create a new pool/,
  });
  pool.close(); // closing again is harmless
});
