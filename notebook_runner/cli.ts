/**
 * `deno task notebooks [paths...] [--out DIR] [--in-place] [--timeout SECONDS] [--html]
 * [--deno PATH]`: executes notebooks on the real Deno Jupyter kernel, without Python.
 *
 * With no paths, every `*.ipynb` in notebooks/ and examples/ is run. Relative paths given on the
 * command line are taken from the folder the command was typed in (`INIT_CWD` under `deno task`);
 * the defaults (notebooks/, examples/, out/notebooks) from the current folder of the process,
 * which `deno task` sets to the folder of the deno.json defining the task.
 *
 * On a terminal, a progress bar under the log lines shows the code cells done, the notebook's
 * place in the run and the time so far; when stderr is not a terminal only the log lines are
 * written (no bar, no control characters).
 *
 * Exit status ({@linkcode EXIT_CODES}, {@linkcode SIGNAL_EXIT_CODES}): 0 when every notebook ran;
 * 1 when a cell failed, timed out (`--timeout`) or the kernel died; 2 for bad input (usage, a
 * missing notebook, invalid JSON, a non-Deno kernelspec); 3 when the kernel could not be started
 * (e.g. the deno binary is missing); 128 + the signal number when stopped by a signal: 130 for
 * SIGINT (Ctrl-C), 143 for SIGTERM. A timed-out or interrupted run stops the kernel (interrupt,
 * then kill its process group) and writes `*.partial.ipynb` beside the notebook with the outputs
 * so far and an error output saying why: the limit, or the signal.
 *
 * @module
 */
import { parseArgs } from "node:util";
import { isAbsolute, relative, resolve } from "node:path";
import { findNotebooks } from "./find_notebooks.ts";
import { runNotebook } from "./isolation.ts";
import { createProgress, type ProgressState } from "./progress.ts";
import type { RunResult } from "./runner.ts";

const USAGE = `Usage: deno task notebooks [paths...] [options]

Executes Jupyter notebooks on the Deno kernel (no Python needed) and writes the executed copies.

Options:
  --out DIR          folder for executed notebooks and HTML (default: out/notebooks)
  --in-place         overwrite each original notebook after a successful run
  --timeout SECONDS  per-cell time limit (default: 300)
  --html             also export a self-contained HTML document per notebook
  --deno PATH        deno binary for the kernel (default: $SONORIGOR_DENO, else this deno)
  -h, --help         show this help

With no paths, runs every *.ipynb in notebooks/ and examples/ (skipping *.partial.ipynb).
A cell that fails, passes --timeout or is interrupted leaves NAME.partial.ipynb beside the
notebook: the outputs so far and an error output saying why.

Exit status: 0 all ran; 1 a cell failed or timed out, or the kernel died; 2 bad input;
3 the kernel could not be started; 130 interrupted by SIGINT (Ctrl-C); 143 by SIGTERM.
Relative paths you give (notebooks, --out, --deno) are taken from the folder you are in; the
defaults (notebooks/, examples/, out/notebooks) from the project folder where the task is defined.`;

/** Exit status per outcome ("interrupted" by anything but a signal below). */
export const EXIT_CODES: Readonly<Record<RunResult["status"], number>> = {
  ok: 0,
  failed: 1,
  invalid: 2,
  kernel: 3,
  interrupted: 130,
};

/**
 * Exit status when stopped by a signal: 128 + the signal number, the shell convention (signal
 * numbers from POSIX signal.h as Linux defines them, signal(7): SIGINT 2, SIGTERM 15).
 */
export const SIGNAL_EXIT_CODES: Readonly<Record<"SIGINT" | "SIGTERM", number>> = {
  SIGINT: 130,
  SIGTERM: 143,
};

/**
 * The folder the user typed the command in: `INIT_CWD` when started by `deno task` (which runs a
 * task in the folder of its deno.json and passes the caller's folder in that variable), else the
 * current folder of this process.
 */
function callerFolder(): string {
  const fromTask = Deno.env.get("INIT_CWD");
  return fromTask !== undefined && fromTask !== "" ? fromTask : Deno.cwd();
}

/**
 * A path typed by the user, resolved from the caller's folder and then written relative to the
 * current folder when it lies inside it (short labels in logs and reports), else absolute.
 *
 * @param path The path as typed.
 * @param caller The caller's folder (absolute).
 * @returns The path to open from the current folder.
 *
 * @example
 * ```ts
 * import { pathFromCaller } from "@sonorigor/notebook-runner/cli";
 * import assert from "node:assert/strict";
 * const here = Deno.cwd();
 * assert.equal(pathFromCaller("a.ipynb", `${here}/notebooks`), "notebooks/a.ipynb");
 * assert.equal(pathFromCaller("/tmp/b.ipynb", `${here}/notebooks`), "/tmp/b.ipynb");
 * ```
 */
export function pathFromCaller(path: string, caller: string): string {
  const absolute = resolve(caller, path);
  const inside = relative(Deno.cwd(), absolute);
  return inside !== "" && !inside.startsWith("..") && !isAbsolute(inside) ? inside : absolute;
}

/**
 * Runs the command line.
 *
 * @param args Command-line arguments.
 * @returns The exit status.
 */
export async function main(args: string[]): Promise<number> {
  let parsed;
  try {
    parsed = parseArgs({
      args,
      allowPositionals: true,
      options: {
        out: { type: "string" },
        "in-place": { type: "boolean", default: false },
        timeout: { type: "string" },
        html: { type: "boolean", default: false },
        deno: { type: "string" },
        help: { type: "boolean", short: "h", default: false },
      },
    });
  } catch (error) {
    console.error(`${(error as Error).message}\n\n${USAGE}`);
    return 2;
  }
  const { values, positionals } = parsed;
  if (values.help) {
    console.log(USAGE);
    return 0;
  }
  let timeoutSeconds = 300;
  if (values.timeout !== undefined) {
    timeoutSeconds = Number(values.timeout);
    if (!(timeoutSeconds > 0 && timeoutSeconds <= 86_400)) {
      console.error(`Option --timeout: expected seconds in (0, 86400], got ${values.timeout}`);
      return 2;
    }
  }
  if (values.out !== undefined && values["in-place"] && !values.html) {
    console.error("note: --out only matters with --html when --in-place is set");
  }
  const caller = callerFolder();
  const paths = positionals.length > 0
    ? positionals.map((path) => pathFromCaller(path, caller))
    : await findNotebooks(["notebooks", "examples"]);
  if (paths.length === 0) {
    console.error("No notebooks to run (none given, none in notebooks/ or examples/)");
    return 0;
  }

  // a bar on a terminal, redrawn each second and at each cell; nothing of it otherwise
  const progress = createProgress();
  const controller = new AbortController();
  const signals = ["SIGINT", "SIGTERM"] as const;
  const listeners = signals.map((name) => {
    const listener = () => {
      if (!controller.signal.aborted) {
        progress.line(`\nInterrupted by ${name}: stopping the kernel…`);
        controller.abort(name); // forwarded to the notebook client and named in the partial
      }
    };
    Deno.addSignalListener(name, listener);
    return [name, listener] as const;
  });

  const results: RunResult[] = [];
  let state: ProgressState | undefined;
  let started = 0;
  const redraw = () => {
    if (state !== undefined) progress.update({ ...state, elapsedMs: Date.now() - started });
  };
  const ticker = progress.drawn ? setInterval(redraw, 1000) : undefined;
  try {
    for (const [index, path] of paths.entries()) {
      if (controller.signal.aborted) break;
      started = Date.now();
      state = undefined;
      const notebook = { index: index + 1, count: paths.length };
      const result = await runNotebook(path, {
        timeoutSeconds,
        inPlace: values["in-place"],
        html: values.html,
        signal: controller.signal,
        log: (line) => progress.line(line),
        onCell: (_number, cellState, position) => {
          const done = cellState === "ended" ? position.codeCell : position.codeCell - 1;
          state = { label: path, done, total: position.codeCells, elapsedMs: 0, notebook };
          redraw();
        },
        ...(values.out === undefined ? {} : { outDir: pathFromCaller(values.out, caller) }),
        ...(values.deno === undefined ? {} : { denoPath: denoFromCaller(values.deno, caller) }),
      });
      progress.finish();
      results.push(result);
      if (result.status === "invalid" || result.status === "kernel") {
        console.error(result.message);
      }
    }
  } finally {
    clearInterval(ticker);
    progress.finish();
    for (const [name, listener] of listeners) Deno.removeSignalListener(name, listener);
  }

  const count = (status: RunResult["status"]) => results.filter((r) => r.status === status).length;
  if (results.length > 1) {
    console.error(
      `\n${results.length} notebooks: ${count("ok")} ok, ${results.length - count("ok")} not ok${
        controller.signal.aborted ? " (interrupted)" : ""
      }`,
    );
    for (const r of results) console.error(`  ${r.status.padEnd(11)} ${r.path}`);
  }
  if (controller.signal.aborted) {
    return SIGNAL_EXIT_CODES[controller.signal.reason as "SIGINT" | "SIGTERM"];
  }
  return Math.max(0, ...results.map((r) => EXIT_CODES[r.status]));
}

/** A deno binary given by path is taken from the caller's folder; a bare name is looked up. */
function denoFromCaller(deno: string, caller: string): string {
  return deno.includes("/") ? pathFromCaller(deno, caller) : deno;
}

if (import.meta.main) {
  Deno.exit(await main(Deno.args));
}
