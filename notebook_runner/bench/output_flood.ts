/**
 * Output-flood benchmark of the notebook runner: a notebook whose middle cell prints N lines
 * (`console.log` in a loop) runs on the real Deno kernel through `runNotebook`. One Markdown table
 * row per size: the run's wall-clock time, its status, the lines stored for the flooding cell and
 * whether they are exactly the lines printed, and the kernel's peak resident memory.
 *
 * Speed is measured here only, never in tests (notebook_runner/bench/results.md holds the
 * numbers of record). `--runner` points at another copy of the runner's `mod.ts`, e.g. the
 * previous commit extracted with `git archive`, so that the before/after comparison runs this
 * same script; pass that copy's deno.json as `--config` so its npm imports resolve.
 *
 * Run: deno run -A notebook_runner/bench/output_flood.ts [--lines 10000,40000,400000]
 *   [--timeout SECONDS] [--runner PATH/mod.ts]
 *
 * @module
 */
import { parseArgs } from "node:util";
import { resolve } from "node:path";
import { pathToFileURL } from "node:url";
import type { Notebook, RunOptions, RunResult } from "../mod.ts";

const { values: args } = parseArgs({
  options: {
    lines: { type: "string", default: "10000,40000,400000" },
    timeout: { type: "string", default: "3600" },
    runner: { type: "string" },
  },
});
const sizes = args.lines.split(",").map((s) => Number(s.trim()));
for (const [i, size] of sizes.entries()) {
  if (!(Number.isInteger(size) && size >= 1)) {
    throw new RangeError(`--lines: expected integers >= 1, got '${args.lines.split(",")[i]}'`);
  }
}
const timeoutSeconds = Number(args.timeout);
if (!(timeoutSeconds > 0)) {
  throw new RangeError(`--timeout: expected seconds > 0, got ${args.timeout}`);
}

const runnerUrl = args.runner === undefined
  ? new URL("../mod.ts", import.meta.url)
  : pathToFileURL(resolve(args.runner));
const { runNotebook } = (await import(runnerUrl.href)) as {
  runNotebook: (path: string, options: RunOptions) => Promise<RunResult>;
};

/** The flooding cell's source: N numbered lines on stdout. */
const floodSource = (lines: number) =>
  `for (let i = 0; i < ${lines}; i++) console.log("line " + i);`;

function floodNotebook(lines: number): string {
  const sources = [`console.log("before");`, floodSource(lines), `console.log("after");`];
  return JSON.stringify({
    metadata: { kernelspec: { name: "deno", display_name: "Deno", language: "typescript" } },
    nbformat: 4,
    nbformat_minor: 5,
    cells: sources.map((source, i) => ({
      id: `cell-${i}`,
      cell_type: "code",
      metadata: {},
      source,
      outputs: [],
      execution_count: null,
    })),
  });
}

/** Resident memory of a process in MB (VmRSS from /proc, Linux), or 0 once it is gone. */
function residentMb(pid: number): number {
  try {
    const status = Deno.readTextFileSync(`/proc/${pid}/status`);
    return Number(/VmRSS:\s+(\d+)\s+kB/.exec(status)?.[1] ?? 0) / 1024;
  } catch {
    return 0;
  }
}

/** Lines stored on stdout for the flooding cell and whether they are exactly the lines printed. */
function storedLines(notebook: Notebook | undefined, lines: number): [number, boolean] {
  const cell = notebook?.cells[1];
  if (cell?.cell_type !== "code") return [0, false];
  const stdout = cell.outputs.flatMap((o) =>
    o.output_type === "stream" && o.name === "stdout"
      ? (Array.isArray(o.text) ? o.text : [o.text])
      : []
  );
  const stored = stdout.join("").split("\n").slice(0, -1);
  return [stored.length, stored.length === lines && stored.every((l, i) => l === `line ${i}`)];
}

console.log(
  `runner: ${runnerUrl.pathname}; deno ${Deno.version.deno}; per-cell limit ${timeoutSeconds} s`,
);
console.log("");
console.log("| lines | status | wall time (s) | lines stored | exact | kernel peak RSS (MB) |");
console.log("| ----: | ------ | ------------: | -----------: | ----- | -------------------: |");
for (const lines of sizes) {
  const dir = await Deno.makeTempDir({ prefix: "sonorigor-flood-bench-" });
  const path = `${dir}/flood_${lines}.ipynb`;
  await Deno.writeTextFile(path, floodNotebook(lines));
  let peak = 0;
  let sampler: ReturnType<typeof setInterval> | undefined;
  const started = performance.now();
  const result = await runNotebook(path, {
    outDir: `${dir}/out`,
    timeoutSeconds,
    log: () => {},
    onKernelStarted: (pid) => {
      sampler = setInterval(() => (peak = Math.max(peak, residentMb(pid))), 250);
    },
  });
  const seconds = (performance.now() - started) / 1000;
  clearInterval(sampler);
  const [stored, exact] = storedLines(result.notebook, lines);
  console.log(
    `| ${lines} | ${result.status} | ${seconds.toFixed(1)} | ${stored} | ${
      exact ? "yes" : "no"
    } | ${peak.toFixed(0)} |`,
  );
  await Deno.remove(dir, { recursive: true });
}
