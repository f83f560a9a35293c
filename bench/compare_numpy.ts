/**
 * Side-by-side speed comparison with a vectorised numpy implementation of the same models, in
 * one invocation on the same machine. Prints medians over repeated runs and the ratio
 * (sonorigor time / numpy time); with `--write` also writes bench/results.md.
 *
 * Models: (a) continuity valve area with uncertain LVOT diameter, two VTIs and a beam angle,
 * 10⁶ trials with 95 % symmetric and shortest intervals; (b) the JCGM 101 §7.9 adaptive
 * procedure on the same model to 2 significant digits; (c) Haycock BSA and a PHN Z-score for
 * 10⁶ cohort rows; (d) GUM propagation of a 10-input model (µs per call, no numpy peer).
 *
 * numpy comes from the machine's python3 (Debian's python3-numpy or any existing numpy); when it
 * is absent the comparison is skipped with a clear message and the sonorigor times are still
 * printed.
 *
 * Run: deno run -A bench/compare_numpy.ts [--runs 15] [--write]
 *
 * @module
 */
import { parseArgs } from "node:util";
import { createMonteCarloPool, PHN_2017_MODELS, propagate, randomStream } from "../mod.ts";
import { bsaHaycock, evaluateTable, readTable, zScoreCalculation } from "../mod.ts";
import { continuityInputs, continuityWithJetAngle, tenInputModel, tenUncertain } from "./models.ts";

const { values: args } = parseArgs({
  options: {
    runs: { type: "string", default: "15" },
    write: { type: "boolean", default: false },
    "memory-probe": { type: "boolean", default: false },
    pool: { type: "boolean", default: false },
  },
});
const runs = Number(args.runs);
if (!(Number.isInteger(runs) && runs >= 1)) {
  throw new RangeError(`--runs: expected an integer >= 1, got ${args.runs}`);
}

/** Peak resident memory of this process (VmHWM), in MB, from /proc (Linux). */
async function peakMemoryMb(): Promise<number> {
  const status = await Deno.readTextFile("/proc/self/status");
  const kb = Number(/VmHWM:\s+(\d+)\s+kB/.exec(status)?.[1] ?? NaN);
  return kb / 1024;
}

/** The bench model's module, which the workers load. */
const modelsModule = new URL("./models.ts", import.meta.url);
const workers = navigator.hardwareConcurrency;

if (args["memory-probe"]) {
  if (args.pool) {
    using pool = await createMonteCarloPool({ workers, modules: [modelsModule] });
    await pool.propagate(continuityWithJetAngle, continuityInputs, {
      method: "monteCarlo",
      trials: 1_000_000,
      seed: 1,
    });
  } else {propagate(continuityWithJetAngle, continuityInputs, {
      method: "monteCarlo",
      trials: 1_000_000,
      seed: 1,
    });}
  console.log(JSON.stringify({ peakMb: await peakMemoryMb() }));
  Deno.exit(0);
}

const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  const k = s.length >> 1;
  return s.length % 2 ? s[k]! : (s[k - 1]! + s[k]!) / 2;
};
const time = async (fn: () => unknown) => {
  const t = performance.now();
  await fn();
  return (performance.now() - t) / 1000;
};

console.error(`sonorigor: ${runs} runs of each model …`);
const ours = {
  a: [] as number[],
  b: [] as number[],
  aPool: [] as number[],
  bPool: [] as number[],
  c: [] as number[],
  d: 0,
  bTrials: 0,
  poolStartMs: 0,
};
const t0 = performance.now();
const pool = await createMonteCarloPool({ workers, modules: [modelsModule] });
ours.poolStartMs = performance.now() - t0;
// one untimed round of each, as numpy's imports and first calls are outside its timings
await pool.propagate(continuityWithJetAngle, continuityInputs, {
  method: "monteCarlo",
  trials: 1_000_000,
  seed: 99,
});
await pool.propagate(continuityWithJetAngle, continuityInputs, {
  method: "monteCarlo",
  adaptive: true,
  seed: 99,
});
for (let k = 0; k < runs; k++) {
  const options = { trials: 1_000_000, seed: 1 + k };
  ours.a.push(
    await time(() =>
      propagate(continuityWithJetAngle, continuityInputs, { method: "monteCarlo", ...options })
    ),
  );
  ours.aPool.push(
    await time(() =>
      pool.propagate(continuityWithJetAngle, continuityInputs, { method: "monteCarlo", ...options })
    ),
  );
  const adaptive = {
    method: "monteCarlo",
    adaptive: { significantDigits: 2 },
    seed: 1 + k,
  } as const;
  ours.b.push(
    await time(() => {
      ours.bTrials =
        propagate(continuityWithJetAngle, continuityInputs, adaptive).monteCarlo!.trials;
    }),
  );
  ours.bPool.push(
    await time(() => pool.propagate(continuityWithJetAngle, continuityInputs, adaptive)),
  );
}
pool.close();

// (c) data, built after the Monte Carlo timings (as numpy loads it after its own): 10⁶ invented rows, generated deterministically, shared with numpy as raw float64.
const rows = 1_000_000;
const rng = randomStream(4242);
const height = new Float64Array(rows),
  weight = new Float64Array(rows),
  lvedd = new Float64Array(rows);
for (let i = 0; i < rows; i++) {
  height[i] = 50 + 140 * rng.uniform();
  weight[i] = Math.max(3, 0.0000165 * height[i]! ** 2.9 * (0.85 + 0.3 * rng.uniform()));
  lvedd[i] = (20 + 0.17 * height[i]! * (0.9 + 0.2 * rng.uniform())) / 10;
}
const model = PHN_2017_MODELS.lvEndDiastolicDimension;
const csv = ["height [cm],weight [kg],lvedd [cm]"];
for (let i = 0; i < rows; i++) csv.push(`${height[i]},${weight[i]},${lvedd[i]}`);
const table = readTable(csv.join("\n") + "\n", { population: "pediatric" });
const cohortCalculations = [bsaHaycock, zScoreCalculation(model)];

for (let k = 0; k < runs; k++) {
  ours.c.push(
    await time(() => evaluateTable(table, cohortCalculations, { population: "pediatric" })),
  );
}
const calls = 20_000;
for (let i = 0; i < 2_000; i++) propagate(tenInputModel, tenUncertain); // warm-up
const tGum = performance.now();
for (let i = 0; i < calls; i++) propagate(tenInputModel, tenUncertain);
ours.d = ((performance.now() - tGum) / calls) * 1000; // µs

/** Peak resident memory (MB) of a fresh process running (a) once, single-thread or pooled. */
async function probeMemory(pooled: boolean): Promise<number> {
  const probe = await new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "-A",
      new URL(import.meta.url).pathname,
      "--memory-probe",
      ...(pooled ? ["--pool"] : []),
    ],
    stdout: "piped",
    stderr: "null",
  }).output();
  return probe.success ? JSON.parse(new TextDecoder().decode(probe.stdout)).peakMb as number : NaN;
}
const peakMb = await probeMemory(false);
const peakPoolMb = await probeMemory(true);

// numpy peer
const dataDir = await Deno.makeTempDir({ prefix: "sonorigor-bench-" });
for (const [name, col] of [["height", height], ["weight", weight], ["lvedd", lvedd]] as const) {
  await Deno.writeFile(`${dataDir}/${name}.f64`, new Uint8Array(col.buffer));
}
let peer: { numpy: string; a: number[]; b: number[]; c: number[]; b_trials: number } | null = null;
let peerNote = "";
try {
  const env = { ...Deno.env.toObject() };
  // OpenBLAS core-type pins slow a current numpy; unset them for this command only
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  console.error("numpy: running bench/peer_numpy.py …");
  const out = await new Deno.Command("python3", {
    args: [
      new URL("./peer_numpy.py", import.meta.url).pathname,
      "--runs",
      String(runs),
      "--data",
      dataDir,
    ],
    env,
    clearEnv: true,
    stdout: "piped",
    stderr: "piped",
  }).output();
  const stderr = new TextDecoder().decode(out.stderr);
  if (out.success) peer = JSON.parse(new TextDecoder().decode(out.stdout));
  else {peerNote = /No module named 'numpy'/.test(stderr)
      ? "numpy is not installed"
      : stderr.trim().split("\n").at(-1) ?? "";}
} catch (e) {
  peerNote = e instanceof Deno.errors.NotFound ? "python3 is not installed" : String(e);
} finally {
  await Deno.remove(dataDir, { recursive: true });
}
if (!peer) console.error(`numpy comparison skipped: ${peerNote}`);

const fmt = (s: number) => (s < 1 ? `${(s * 1000).toFixed(1)} ms` : `${s.toFixed(2)} s`);
/** Median with the range of the runs, e.g. "95.1 ms (88.0–131.2)". */
const spread = (v: number[]) => {
  const lo = Math.min(...v), hi = Math.max(...v);
  const unit = (x: number) => (median(v) < 1 ? (x * 1000).toFixed(1) : x.toFixed(2));
  return `${fmt(median(v))} (${unit(lo)}–${unit(hi)})`;
};
const line = (name: string, target: string, our: number[], theirs: number[] | undefined) => {
  const o = median(our);
  const t = theirs && theirs.length ? median(theirs) : NaN;
  const ratio = Number.isFinite(t) ? (o / t).toFixed(2) : "n/a";
  return `| ${name} | ${spread(our)} | ${
    Number.isFinite(t) ? spread(theirs!) : "skipped"
  } | ${ratio} | ${target} |`;
};
const cpu =
  (await Deno.readTextFile("/proc/cpuinfo").catch(() => "")).match(/model name\s*:\s*(.*)/)?.[1] ??
    "unknown";
const report = [
  "# Benchmark: sonorigor vs vectorised numpy",
  "",
  `Measured ${
    new Date().toISOString().slice(0, 10)
  } on ${cpu}, ${navigator.hardwareConcurrency} logical cores, ` +
  `Deno ${Deno.version.deno} (V8 ${Deno.version.v8})${peer ? `, numpy ${peer.numpy}` : ""}. ` +
  `Medians of ${runs} runs (range in brackets); ratio = sonorigor median / numpy median (below 1 is ` +
  "faster).",
  "",
  "Reproduce: `npx -y deno@2.9.6 run -A bench/compare_numpy.ts --runs 15 --write` (or `deno task bench`)",
  "",
  "| model | sonorigor | numpy | ratio | target |",
  "| --- | --- | --- | --- | --- |",
  line(
    `(a) Monte Carlo, 4-input continuity with angle, 10⁶ trials + 95 % intervals: pool of ${workers} workers`,
    "ratio ≤ 0.5",
    ours.aPool,
    peer?.a,
  ),
  line("(a) the same, single thread (`propagate`, Monte Carlo)", "—", ours.a, peer?.a),
  line(
    `(b) adaptive Monte Carlo, 2 digits (${ours.bTrials} trials here${
      peer ? `, ${peer.b_trials} numpy` : ""
    }): pool of ${workers} workers`,
    "ratio ≤ 0.5",
    ours.bPool,
    peer?.b,
  ),
  line("(b) the same, single thread (`propagate`, adaptive Monte Carlo)", "—", ours.b, peer?.b),
  line("(c) Haycock BSA + PHN Z-score, 10⁶ cohort rows", "ratio ≤ 1.0", ours.c, peer?.c),
  `| (d) GUM law, 10-input model, per call | ${ours.d.toFixed(1)} µs | — | — | < 50 µs |`,
  "",
  `Peak resident memory of a fresh process running (a) once (target < 200 MB): ${
    peakPoolMb.toFixed(0)
  } MB with the pool of ${workers} workers, ${peakMb.toFixed(0)} MB single-thread.`,
  "",
  `Starting the pool (workers load the package without mathjs) took ${
    ours.poolStartMs.toFixed(0)
  } ms, once per session; it is not in the timings above, as numpy's import is not in its own.`,
  "The pool's results are identical, bit for bit, to the single-thread functions' for the same seed " +
  "(tests/uncertainty/pool_test.ts).",
  peer ? "" : `\nnumpy comparison skipped: ${peerNote}.`,
].join("\n");
console.log(report);
if (args.write) await Deno.writeTextFile(new URL("./results.md", import.meta.url), report + "\n");
