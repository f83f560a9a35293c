/**
 * Side-by-side speed comparison with a vectorised numpy implementation of the same models, in
 * one invocation on the same machine. Prints medians over repeated runs and the ratio
 * (sonorigor time / numpy time); with `--write` also writes bench/RESULTS.md.
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
 * Run: deno run -A bench/compare-numpy.ts [--runs 5] [--write]
 *
 * @module
 */
import { parseArgs } from "node:util";
import { gum, monteCarlo, monteCarloAdaptive, PHN_2017_MODELS, randomStream } from "../mod.ts";
import { computeCohort, readCohortCsv } from "../mod.ts";
import { continuityInputs, continuityWithJetAngle, tenInputModel, tenUncertain } from "./models.ts";

const { values: args } = parseArgs({
  options: {
    runs: { type: "string", default: "5" },
    write: { type: "boolean", default: false },
    "memory-probe": { type: "boolean", default: false },
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

if (args["memory-probe"]) {
  monteCarlo(continuityWithJetAngle, continuityInputs, { trials: 1_000_000, seed: 1 });
  console.log(JSON.stringify({ peakMb: await peakMemoryMb() }));
  Deno.exit(0);
}

const median = (v: number[]) => {
  const s = [...v].sort((a, b) => a - b);
  const k = s.length >> 1;
  return s.length % 2 ? s[k]! : (s[k - 1]! + s[k]!) / 2;
};
const time = (fn: () => unknown) => {
  const t = performance.now();
  fn();
  return (performance.now() - t) / 1000;
};

// (c) data: 10⁶ invented rows, generated deterministically, shared with numpy as raw float64.
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
const table = readCohortCsv(csv.join("\n") + "\n", {
  height: "height",
  weight: "weight",
  measurements: [{ column: "lvedd", canonicalUnit: model.unit, range: model.measurementRange }],
});

console.error(`sonorigor: ${runs} runs of each model …`);
const ours = { a: [] as number[], b: [] as number[], c: [] as number[], d: 0, bTrials: 0 };
for (let k = 0; k < runs; k++) {
  ours.a.push(
    time(() =>
      monteCarlo(continuityWithJetAngle, continuityInputs, { trials: 1_000_000, seed: 1 + k })
    ),
  );
  ours.b.push(time(() => {
    ours.bTrials = monteCarloAdaptive(continuityWithJetAngle, continuityInputs, {
      significantDigits: 2,
      seed: 1 + k,
    })
      .trials;
  }));
  ours.c.push(time(() => computeCohort(table, { zScores: { lvedd: model } })));
}
const calls = 20_000;
for (let i = 0; i < 2_000; i++) gum(tenInputModel, tenUncertain); // warm-up
const tGum = performance.now();
for (let i = 0; i < calls; i++) gum(tenInputModel, tenUncertain);
ours.d = ((performance.now() - tGum) / calls) * 1000; // µs

const probe = await new Deno.Command(Deno.execPath(), {
  args: ["run", "-A", new URL(import.meta.url).pathname, "--memory-probe"],
  stdout: "piped",
  stderr: "null",
}).output();
const peakMb = probe.success
  ? JSON.parse(new TextDecoder().decode(probe.stdout)).peakMb as number
  : NaN;

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
const line = (name: string, target: string, our: number[], theirs: number[] | undefined) => {
  const o = median(our);
  const t = theirs && theirs.length ? median(theirs) : NaN;
  const ratio = Number.isFinite(t) ? (o / t).toFixed(2) : "n/a";
  return `| ${name} | ${fmt(o)} | ${
    Number.isFinite(t) ? fmt(t) : "skipped"
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
  `Medians of ${runs} runs; ratio = sonorigor / numpy (below 1 is faster).`,
  "",
  "Reproduce: `deno run -A bench/compare-numpy.ts --runs 5 --write`",
  "",
  "| model | sonorigor | numpy | ratio | target |",
  "| --- | --- | --- | --- | --- |",
  line(
    "(a) Monte Carlo, 4-input continuity with angle, 10⁶ trials + 95 % intervals",
    "ratio ≤ 0.5",
    ours.a,
    peer?.a,
  ),
  line(
    `(b) adaptive Monte Carlo, 2 digits (${ours.bTrials} trials here${
      peer ? `, ${peer.b_trials} numpy` : ""
    })`,
    "ratio ≤ 0.5",
    ours.b,
    peer?.b,
  ),
  line("(c) Haycock BSA + PHN Z-score, 10⁶ cohort rows", "ratio ≤ 1.0", ours.c, peer?.c),
  `| (d) GUM law, 10-input model, per call | ${ours.d.toFixed(1)} µs | — | — | < 50 µs |`,
  "",
  `Peak resident memory of a process running (a): ${peakMb.toFixed(0)} MB (target < 200 MB).`,
  peer ? "" : `\nnumpy comparison skipped: ${peerNote}.`,
].join("\n");
console.log(report);
if (args.write) await Deno.writeTextFile(new URL("./RESULTS.md", import.meta.url), report + "\n");
