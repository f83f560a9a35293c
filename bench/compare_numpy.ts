/**
 * Side-by-side speed comparison with a vectorised numpy implementation of the same models, in
 * one invocation on the same machine, with the rounds alternated: one sonorigor run, then one
 * numpy run of the same model and seed (A B A B …). The ratio is taken pair by pair (sonorigor
 * time / numpy time of the same round), so drift in the machine's load cancels; the table gives
 * the median of those ratios with their range. The machine's load (1-minute load average) is
 * recorded before, during (highest) and after the runs. With `--write` also writes
 * bench/results.md.
 *
 * Models: (a) continuity valve area with uncertain LVOT diameter, two VTIs and a beam angle,
 * 10⁶ trials with 95 % symmetric and shortest intervals; (b) the JCGM 101 §7.9 adaptive
 * procedure on the same model to 2 significant digits; (c) Haycock BSA and a PHN Z-score for
 * 10⁶ cohort rows; (d) GUM propagation of a 10-input model (µs per call, no numpy peer);
 * (e) GUM law row by row over a table of 10⁶ rows with three uncertain columns (rows per second,
 * no numpy peer). numpy's `np.sort` of the 10⁶ values of (a) is also timed alone.
 *
 * Every round also checks that both sides agree: the Monte Carlo mean, standard deviation and
 * interval ends within Monte Carlo tolerance (the two use different random streams), the cohort
 * values to rounding. A disagreement is reported in the table and makes the command fail.
 *
 * numpy comes from the machine's python3 (Debian's python3-numpy or any existing numpy); when it
 * is absent the comparison is skipped with a clear message and the sonorigor times are still
 * printed.
 *
 * Run: deno run -A bench/compare_numpy.ts [--runs 15] [--write] [--no-pool] [--gum-rows 1000000]
 * [--cases a,b,c,d,e] (`--cases c,e` times only those models; `--write` needs them all)
 *
 * @module
 */
import { parseArgs } from "node:util";
import { createMonteCarloPool, PHN_2017_MODELS, propagate, randomStream } from "../mod.ts";
import { bsaHaycock, evaluateTable, readTable, zScoreCalculation } from "../mod.ts";
import type { Propagation } from "../mod.ts";
import { continuityInputs, continuityWithJetAngle, tenInputModel, tenUncertain } from "./models.ts";
import { gumRowsTable, gumRowsUncertainty, threeInputCalculation } from "./models.ts";

const { values: args } = parseArgs({
  options: {
    runs: { type: "string", default: "15" },
    write: { type: "boolean", default: false },
    "memory-probe": { type: "boolean", default: false },
    pool: { type: "boolean", default: false },
    "no-pool": { type: "boolean", default: false },
    "gum-rows": { type: "string", default: "1000000" },
    cases: { type: "string", default: "a,b,c,d,e" },
    help: { type: "boolean", default: false },
  },
});
if (args.help) {
  console.log(
    "deno run -A bench/compare_numpy.ts [--runs 15] [--write] [--no-pool] [--gum-rows 1000000] " +
      "[--cases a,b,c,d,e]",
  );
  Deno.exit(0);
}
const CASES = ["a", "b", "c", "d", "e"] as const;
const cases = new Set(args.cases!.split(",").map((c) => c.trim()));
for (const c of cases) {
  if (!(CASES as readonly string[]).includes(c)) {
    throw new RangeError(
      `--cases: expected a comma-separated list of ${CASES.join(", ")}, got ${c}`,
    );
  }
}
if (args.write && cases.size < CASES.length) {
  throw new RangeError(
    `--write: expected every case (${CASES.join(",")}), got --cases ${args.cases}`,
  );
}
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

/** Model (a), with both intervals computed (they are computed on first access). */
function touch(p: Propagation): Propagation {
  const y = p.outputs[p.outputNames[0]!]!;
  void y.interval.lower;
  void y.shortestInterval?.lower;
  return p;
}

if (args["memory-probe"]) {
  const options = { method: "monteCarlo", trials: 1_000_000, seed: 1 } as const;
  if (args.pool) {
    using pool = await createMonteCarloPool({ workers, modules: [modelsModule] });
    touch(await pool.propagate(continuityWithJetAngle, continuityInputs, options));
  } else touch(propagate(continuityWithJetAngle, continuityInputs, options));
  console.log(JSON.stringify({ peakMb: await peakMemoryMb() }));
  Deno.exit(0);
}

const median = (v: readonly number[]) => {
  const s = [...v].sort((a, b) => a - b);
  const k = s.length >> 1;
  return s.length % 2 ? s[k]! : (s[k - 1]! + s[k]!) / 2;
};
const load = () => Deno.loadavg()[0]!;
const loads: number[] = [load()];

/** One numpy request line answered by bench/peer_numpy.py (serve mode). */
type PeerAnswer = Record<string, number | number[] | string>;
/** The numpy peer, kept running so its rounds can alternate with ours; null without numpy. */
class Peer {
  readonly #proc: Deno.ChildProcess;
  readonly #writer: WritableStreamDefaultWriter<Uint8Array>;
  readonly #lines: AsyncIterator<string>;
  numpy = "";
  private constructor(proc: Deno.ChildProcess) {
    this.#proc = proc;
    this.#writer = proc.stdin.getWriter();
    this.#lines = proc.stdout.pipeThrough(new TextDecoderStream()).pipeThrough(splitLines())
      [Symbol.asyncIterator]();
  }
  static async start(): Promise<{ peer: Peer | null; note: string }> {
    const env = { ...Deno.env.toObject() };
    // OpenBLAS core-type pins slow a current numpy; unset them for this command only
    delete env.OPENBLAS_CORETYPE;
    delete env.OPENBLAS_L2_SIZE;
    let proc: Deno.ChildProcess;
    try {
      proc = new Deno.Command("python3", {
        args: [new URL("./peer_numpy.py", import.meta.url).pathname],
        env,
        clearEnv: true,
        stdin: "piped",
        stdout: "piped",
        stderr: "piped",
      }).spawn();
    } catch (e) {
      return {
        peer: null,
        note: e instanceof Deno.errors.NotFound ? "python3 is not installed" : String(e),
      };
    }
    const peer = new Peer(proc);
    const first = await peer.#lines.next();
    if (first.done) {
      const stderr = await new Response(proc.stderr).text();
      return {
        peer: null,
        note: /No module named 'numpy'/.test(stderr)
          ? "numpy is not installed"
          : stderr.trim().split("\n").at(-1) ?? "",
      };
    }
    proc.stderr.cancel();
    peer.numpy = JSON.parse(first.value).numpy;
    return { peer, note: "" };
  }
  async ask(request: string): Promise<PeerAnswer> {
    await this.#writer.write(new TextEncoder().encode(request + "\n"));
    const line = await this.#lines.next();
    if (line.done) throw new Error(`numpy peer: no answer to '${request}'`);
    const answer = JSON.parse(line.value) as PeerAnswer;
    if (answer.error) throw new Error(`numpy peer: ${answer.error}`);
    return answer;
  }
  async close(): Promise<void> {
    await this.#writer.close();
    await this.#proc.status;
  }
}
function splitLines(): TransformStream<string, string> {
  let rest = "";
  return new TransformStream({
    transform(chunk, out) {
      const parts = (rest + chunk).split("\n");
      rest = parts.pop()!;
      for (const p of parts) if (p) out.enqueue(p);
    },
    flush(out) {
      if (rest) out.enqueue(rest);
    },
  });
}

/** Seconds taken by fn. */
const time = async <T>(fn: () => T | Promise<T>): Promise<{ s: number; value: T }> => {
  const t = performance.now();
  const value = await fn();
  return { s: (performance.now() - t) / 1000, value };
};

interface Summary {
  mean: number;
  sd: number;
  symmetric: [number, number];
  shortest: [number, number];
}
const summaryOf = (p: Propagation): Summary => {
  const y = p.outputs[p.outputNames[0]!]!;
  return {
    mean: y.value,
    sd: y.standardUncertainty,
    symmetric: [y.interval.lower, y.interval.upper],
    shortest: [y.shortestInterval!.lower, y.shortestInterval!.upper],
  };
};
/**
 * Whether two Monte Carlo summaries of M and N trials agree, as two independent estimates of
 * the same distribution: mean within 5 combined standard errors (s·√(1/M + 1/N)); standard
 * deviation within 5 combined standard errors of s (≈ s·√(1/(2M) + 1/(2N)) for a near-normal
 * output); symmetric interval ends within 5 combined standard errors of a 2.5 % quantile
 * (√(p(1 − p)/M)/f(x), with f(x) ≈ 0.058/s at the 2.5 % point of a normal: ≈ 2.7 s/√M each);
 * the shortest interval's width likewise, its ends within 0.06 s. Common practice, no source.
 */
const mismatches: string[] = [];
function checkAgreement(what: string, ours: Summary, theirs: PeerAnswer, m: number, n: number) {
  const s = ours.sd;
  const both = Math.sqrt(1 / m + 1 / n);
  const checks: [string, number, number, number][] = [
    ["mean", ours.mean, theirs.mean as number, 5 * s * both],
    ["sd", ours.sd, theirs.sd as number, 5 * s * both / Math.SQRT2],
    ...[0, 1].map((e): [string, number, number, number] => [
      `symmetric[${e}]`,
      ours.symmetric[e]!,
      (theirs.symmetric as number[])[e]!,
      5 * 2.7 * s * both,
    ]),
    // the shortest interval's width is well determined, but where it lies along the flat
    // minimum of widths is not: its ends vary several times more than a quantile's
    [
      "shortest width",
      ours.shortest[1] - ours.shortest[0],
      (theirs.shortest as number[])[1]! - (theirs.shortest as number[])[0]!,
      5 * 2.7 * s * both * Math.SQRT2,
    ],
    ...[0, 1].map((e): [string, number, number, number] => [
      `shortest[${e}]`,
      ours.shortest[e]!,
      (theirs.shortest as number[])[e]!,
      0.06 * s,
    ]),
  ];
  for (const [name, a, b, tol] of checks) {
    if (!(Math.abs(a - b) <= tol)) {
      mismatches.push(`${what} ${name}: sonorigor ${a}, numpy ${b}, tolerance ±${tol.toFixed(6)}`);
    }
  }
}

const { peer, note: peerNote } = await Peer.start();
if (!peer) console.error(`numpy comparison skipped: ${peerNote}`);

// (c) data: 10⁶ invented rows, generated deterministically, shared with numpy as raw float64
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
const zModel = PHN_2017_MODELS.lvEndDiastolicDimension;
const csv = ["height [cm],weight [kg],lvedd [cm]"];
for (let i = 0; i < rows; i++) csv.push(`${height[i]},${weight[i]},${lvedd[i]}`);
const table = readTable(csv.join("\n") + "\n", { population: "pediatric" });
csv.length = 0;
const cohortCalculations = [bsaHaycock, zScoreCalculation(zModel)];
const dataDir = await Deno.makeTempDir({ prefix: "sonorigor-bench-" });
try {
  for (const [name, col] of [["height", height], ["weight", weight], ["lvedd", lvedd]] as const) {
    await Deno.writeFile(`${dataDir}/${name}.f64`, new Uint8Array(col.buffer));
  }
  if (peer) await peer.ask(`load ${dataDir}`);
} finally {
  await Deno.remove(dataDir, { recursive: true });
}

const usePool = !args["no-pool"] && (cases.has("a") || cases.has("b"));
const tPool = performance.now();
const pool = usePool ? await createMonteCarloPool({ workers, modules: [modelsModule] }) : null;
const poolStartMs = performance.now() - tPool;

type Key = "a" | "aPool" | "b" | "bPool" | "c";
const ours: Record<Key, number[]> = { a: [], aPool: [], b: [], bPool: [], c: [] };
const theirs: Record<Key, number[]> = { a: [], aPool: [], b: [], bPool: [], c: [] };
const numpySort: number[] = [];
let bTrials = 0, bTrialsNumpy = 0;

const BSA_COLUMN = /^bsa$/;
const Z_COLUMN = /^zScore\./;
/** The name of a cohort output column. */
function outputColumn(t: ReturnType<typeof evaluateTable>, pattern: RegExp): string {
  const name = [...t.columns.keys()].find((n) => pattern.test(n));
  if (!name) throw new Error(`cohort: no column ${pattern} in ${[...t.columns.keys()].join(", ")}`);
  return name;
}

const optionsA = (seed: number) => ({ method: "monteCarlo", trials: 1_000_000, seed } as const);
const optionsB = (seed: number) =>
  ({ method: "monteCarlo", adaptive: { significantDigits: 2 }, seed }) as const;

/** One sonorigor run of a model. */
async function runOurs(key: Key, seed: number): Promise<{ s: number; value: unknown }> {
  if (key === "c") {
    return await time(() => evaluateTable(table, cohortCalculations, { population: "pediatric" }));
  }
  const options = key.startsWith("a") ? optionsA(seed) : optionsB(seed);
  return key.endsWith("Pool")
    ? await time(async () =>
      touch(await pool!.propagate(continuityWithJetAngle, continuityInputs, options))
    )
    : await time(() => touch(propagate(continuityWithJetAngle, continuityInputs, options)));
}
const peerRequest = (key: Key, seed: number) =>
  key === "c" ? "c" : `${key.startsWith("a") ? "a" : "b"} ${seed}`;

const keys = (usePool ? ["a", "aPool", "b", "bPool", "c"] as const : ["a", "b", "c"] as const)
  .filter((k) => cases.has(k[0]!)) as Key[];
console.error(`${runs} alternated rounds of ${keys.join(", ")} …`);
// one untimed round of each side, as numpy's imports and first calls are outside its timings
for (const key of keys) {
  await runOurs(key, 99);
  if (peer) await peer.ask(peerRequest(key, 99));
}
for (let k = 0; k < runs; k++) {
  const seed = 1 + k;
  for (const key of keys) {
    const mine = await runOurs(key, seed);
    ours[key].push(mine.s);
    if (key === "b" || key === "bPool") {
      bTrials = (mine.value as Propagation).monteCarlo!.trials;
    }
    if (!peer) continue;
    const answer = await peer.ask(peerRequest(key, seed));
    theirs[key].push(answer.t as number);
    if (key === "c") checkCohort(mine.value as ReturnType<typeof evaluateTable>, answer);
    else {
      const p = mine.value as Propagation;
      const m = p.monteCarlo!.trials;
      const n = key.startsWith("b") ? answer.trials as number : 1_000_000;
      if (key.startsWith("b")) bTrialsNumpy = n;
      checkAgreement(`(${key}) seed ${seed}`, summaryOf(p), answer, m, n);
    }
  }
  if (peer && cases.has("a")) numpySort.push((await peer.ask(`sort ${seed}`)).t as number);
  loads.push(load());
}
pool?.close();

/** The cohort's BSA and Z columns against numpy's: sums to rounding, same missing and flagged. */
function checkCohort(t: ReturnType<typeof evaluateTable>, answer: PeerAnswer): void {
  const numeric = (name: string) => {
    const c = t.columns.get(name);
    if (!c || c.kind !== "numeric") {
      throw new Error(`cohort: no numeric column '${name}' in ${[...t.columns.keys()].join(", ")}`);
    }
    return c.values;
  };
  const bsa = numeric(outputColumn(t, BSA_COLUMN));
  const z = numeric(outputColumn(t, Z_COLUMN));
  let bsaSum = 0, zSum = 0, missing = 0;
  for (let i = 0; i < bsa.length; i++) {
    bsaSum += bsa[i]!;
    if (z[i]! === z[i]!) zSum += z[i]!;
    else missing++;
  }
  const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));
  if (!close(bsaSum, answer.bsaSum as number) || !close(zSum, answer.zSum as number)) {
    mismatches.push(
      `(c) sums: BSA ${bsaSum} vs numpy ${answer.bsaSum}, Z ${zSum} vs numpy ${answer.zSum}`,
    );
  }
  if (missing !== answer.zMissing) {
    mismatches.push(`(c) Z missing in ${missing} rows, numpy ${answer.zMissing}`);
  }
}
// (d) GUM law, one 10-input call
const calls = cases.has("d") ? 20_000 : 0;
for (let i = 0; i < calls / 10; i++) propagate(tenInputModel, tenUncertain); // warm-up
const tGum = performance.now();
for (let i = 0; i < calls; i++) propagate(tenInputModel, tenUncertain);
const gumMicroseconds = ((performance.now() - tGum) / calls) * 1000;

// (e) GUM law row by row over a table of 10⁶ rows with three uncertain columns
// (one run at first; with a case filter, as many runs as rounds, for a range)
const gumRowCount = Number(args["gum-rows"]);
const gumRowTimes: number[] = [];
if (cases.has("e")) {
  const gumTable = gumRowsTable(gumRowCount);
  evaluateTable(gumRowsTable(10_000), threeInputCalculation, { uncertainty: gumRowsUncertainty }); // warm-up
  for (let k = 0; k < (cases.size < CASES.length ? runs : 1); k++) {
    const gumRows = await time(() =>
      evaluateTable(gumTable, threeInputCalculation, { uncertainty: gumRowsUncertainty })
    );
    gumRowTimes.push(gumRows.s);
    loads.push(load());
  }
}
const gumRowsPerSecond = gumRowCount / median(gumRowTimes);
await peer?.close();

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
const peakMb = cases.has("a") ? await probeMemory(false) : NaN;
const peakPoolMb = usePool && cases.has("a") ? await probeMemory(true) : NaN;
loads.push(load());

const ms = (s: number) => (s * 1000).toFixed(1);
/** Median with the range of the runs, e.g. "95.1 ms (88.0–131.2)". */
const spread = (v: readonly number[]) =>
  v.length ? `${ms(median(v))} ms (${ms(Math.min(...v))}–${ms(Math.max(...v))})` : "skipped";
/** Median of the pair-by-pair ratios with their range, e.g. "0.48 (0.41–0.60)". */
const ratios = (key: Key) => {
  if (!theirs[key].length) return "n/a";
  const r = ours[key].map((o, i) => o / theirs[key][i]!);
  return `${median(r).toFixed(2)} (${Math.min(...r).toFixed(2)}–${Math.max(...r).toFixed(2)})`;
};
const line = (name: string, target: string, key: Key) =>
  `| ${name} | ${spread(ours[key])} | ${spread(theirs[key])} | ${ratios(key)} | ${target} |`;
const cpu =
  (await Deno.readTextFile("/proc/cpuinfo").catch(() => "")).match(/model name\s*:\s*(.*)/)?.[1] ??
    "unknown";
const report = [
  "# Benchmark: sonorigor vs vectorised numpy",
  "",
  `Measured ${new Date().toISOString().slice(0, 16).replace("T", " ")} UTC on ${cpu}, ` +
  `${navigator.hardwareConcurrency} logical cores, Deno ${Deno.version.deno} (V8 ${Deno.version.v8})` +
  `${
    peer ? `, numpy ${peer.numpy}` : ""
  }. ${runs} alternated rounds (one sonorigor run, then one ` +
  "numpy run of the same model and seed). Times: median (range) of the runs. Ratio: median " +
  "(range) of the pair-by-pair ratios sonorigor / numpy, below 1 is faster.",
  "",
  `Machine load (1-minute load average): ${loads[0]!.toFixed(2)} before, ${
    Math.max(...loads).toFixed(2)
  } highest, ${loads.at(-1)!.toFixed(2)} after. Ratios taken under load above about 0.5 on these ` +
  `${navigator.hardwareConcurrency} cores are not final.`,
  "",
  "Reproduce: `deno run -A bench/compare_numpy.ts --runs 15 --write` on a quiet machine.",
  "",
  "| model | sonorigor | numpy | ratio (pairs) | target |",
  "| --- | --- | --- | --- | --- |",
  line(
    "(a) Monte Carlo, 4-input continuity with angle, 10⁶ trials + 95 % intervals, single thread",
    "ratio ≤ 0.5",
    "a",
  ),
  ...(usePool ? [line(`(a) the same, pool of ${workers} workers`, "—", "aPool")] : []),
  line(
    `(b) adaptive Monte Carlo, 2 digits (${bTrials} trials here${
      peer ? `, ${bTrialsNumpy} numpy` : ""
    }), single thread`,
    "—",
    "b",
  ),
  ...(usePool ? [line(`(b) the same, pool of ${workers} workers`, "—", "bPool")] : []),
  line("(c) Haycock BSA + PHN Z-score, 10⁶ cohort rows", "ratio ≤ 1.0", "c"),
  `| (d) GUM law, 10-input model, per call | ${
    calls ? `${gumMicroseconds.toFixed(1)} µs` : "skipped"
  } | — | — | < 50 µs |`,
  `| (e) GUM law per row, 3 uncertain inputs, ${gumRowCount.toLocaleString("en")} rows | ${
    gumRowTimes.length
      ? `${Math.round(gumRowsPerSecond).toLocaleString("en")} rows/s (${spread(gumRowTimes)})`
      : "skipped"
  } | — | — | ≥ 200,000 rows/s |`,
  "",
  peer && numpySort.length
    ? `numpy's \`np.sort\` of the 10⁶ values of (a), timed alone: ${spread(numpySort)}, ${
      (100 * median(numpySort) / median(theirs.a)).toFixed(0)
    } % of its median (a) time.`
    : "",
  "",
  cases.has("a")
    ? `Peak resident memory of a fresh process running (a) once (target < 200 MB): ${
      peakMb.toFixed(0)
    } MB single-thread${
      usePool ? `, ${peakPoolMb.toFixed(0)} MB with the pool of ${workers} workers` : ""
    }.`
    : "",
  "",
  usePool
    ? `Starting the pool took ${
      poolStartMs.toFixed(0)
    } ms, once per session; it is not in the timings above, as numpy's import is not in its own. ` +
      "The pool's results are identical, bit for bit, to the single-thread functions' for the same " +
      "seed (tests/uncertainty/pool_test.ts)."
    : "",
  "",
  peer
    ? (mismatches.length
      ? `**Results disagree with numpy** beyond Monte Carlo tolerance:\n\n${
        mismatches.map((m) => `- ${m}`).join("\n")
      }`
      : "Results agree with numpy in every round: Monte Carlo mean, standard deviation, symmetric " +
        "interval ends and shortest interval width within 5 combined standard errors (shortest " +
        "interval ends within 0.06 standard deviations); cohort BSA and Z sums to 10⁻⁹ and the " +
        "same rows missing.")
    : `numpy comparison skipped: ${peerNote}.`,
].join("\n");
console.log(report);
if (args.write) await Deno.writeTextFile(new URL("./results.md", import.meta.url), report + "\n");
if (mismatches.length) Deno.exit(1);
