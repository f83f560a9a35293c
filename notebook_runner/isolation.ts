/**
 * Running a notebook isolated in a child deno process, the notebook client (`child.ts`), which
 * owns the kernel and its ZeroMQ sockets and reports progress, the kernel pid, cell starts and
 * ends, and the result as JSON lines on its stdout.
 *
 * This process keeps the run bounded whatever the client does: it forwards the abort signal
 * (SIGINT or SIGTERM, by name), kills the client when it has not stopped within the grace after
 * that signal or past a cell's limit, always kills the kernel's process group at the end, and
 * writes the partial notebook itself (without outputs, which died with the client) when the
 * client could not.
 *
 * @module
 */
import { fileURLToPath } from "node:url";
import { type CellFailure, formatFailure } from "./diagnostics.ts";
import type { ChildEvent } from "./child.ts";
import {
  interruptionText,
  markStopped,
  partialPathOf,
  readNotebook,
  STOP_ERROR_NAMES,
  timeoutText,
  writeNotebook,
} from "./notebook_files.ts";
import type { RunOptions, RunResult } from "./runner.ts";

/** The default of {@linkcode RunOptions.stopGraceSeconds}. */
export const DEFAULT_STOP_GRACE_SECONDS = 30;

/** Signals forwarded to the notebook client under their own name (others as SIGTERM). */
const FORWARDED_SIGNALS: ReadonlySet<string> = new Set(["SIGINT", "SIGTERM"]);

/** An abort reason as words: a string as it is (e.g. "SIGTERM"), else "the interruption". */
function namedReason(reason: unknown): string {
  return typeof reason === "string" && reason !== "" ? reason : "the interruption";
}

/**
 * Kills a process group and waits until it is empty: a kernel orphaned by a killed client is
 * collected by init a moment later, and until then it still exists. Gives up after 5 s.
 */
async function killGroupAndWait(pgid: number): Promise<void> {
  for (const until = Date.now() + 5_000; Date.now() < until;) {
    try {
      Deno.kill(-pgid, "SIGKILL");
    } catch {
      return; // no process left in the group
    }
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/**
 * Splits a byte stream into lines in linear time: each chunk is searched once, and the pieces
 * of a line that spans chunks are joined once.
 */
async function forEachLine(
  stream: ReadableStream<Uint8Array>,
  handle: (line: string) => void,
): Promise<void> {
  const decoder = new TextDecoder();
  const pieces: string[] = [];
  for await (const chunk of stream) {
    const text = decoder.decode(chunk, { stream: true });
    let from = 0;
    for (let newline = text.indexOf("\n"); newline >= 0; newline = text.indexOf("\n", from)) {
      pieces.push(text.slice(from, newline));
      handle(pieces.join(""));
      pieces.length = 0;
      from = newline + 1;
    }
    if (from < text.length) pieces.push(text.slice(from));
  }
  pieces.push(decoder.decode());
  handle(pieces.join(""));
}

/**
 * Executes one notebook on the real Deno kernel, isolated in a child deno process that speaks
 * ZeroMQ to the kernel. The native zeromq addon could crash its process under Deno now and then
 * when sockets to a killed kernel were torn down; isolation means such a crash can neither take
 * the caller down nor leave the kernel behind.
 *
 * Stopping is bounded: the abort signal is forwarded to the client (its reason, when "SIGINT" or
 * "SIGTERM", as that signal; else SIGTERM), which interrupts and kills the kernel and writes the
 * partial notebook with the outputs so far. A client that has not finished within
 * `stopGraceSeconds` of the signal, or of a cell's limit, is killed (SIGKILL) with the kernel's
 * process group, and the partial notebook is then written here, naming why.
 *
 * @param path The .ipynb file.
 * @param options Output folder, in-place, per-cell timeout, stop grace, HTML export, deno binary,
 *   abort signal, logger, callbacks.
 * @returns What happened (never throws for bad notebooks or cell errors).
 * @throws {RangeError} When `timeoutSeconds` is not above 0 or `stopGraceSeconds` is negative.
 *
 * @example A missing notebook is reported, not thrown
 * ```ts
 * import { runNotebook } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const result = await runNotebook("no_such_notebook.ipynb", { log: () => {} });
 * assert.equal(result.status, "invalid");
 * assert.match(result.message ?? "", /^Notebook not found: no_such_notebook\.ipynb/);
 * ```
 */
export async function runNotebook(path: string, options: RunOptions = {}): Promise<RunResult> {
  const started = Date.now();
  const log = options.log ?? ((line: string) => console.error(line));
  const { signal, log: _log, onKernelStarted, onCell, ...serializable } = options;
  const graceSeconds = options.stopGraceSeconds ?? DEFAULT_STOP_GRACE_SECONDS;
  const timeoutSeconds = options.timeoutSeconds ?? 300;
  if (!(timeoutSeconds > 0)) {
    throw new RangeError(`Expected 'timeoutSeconds' in (0, ∞) seconds, got ${timeoutSeconds}`);
  }
  if (!(graceSeconds >= 0)) {
    throw new RangeError(`Expected 'stopGraceSeconds' in [0, ∞) seconds, got ${graceSeconds}`);
  }
  const config = fileURLToPath(new URL("./deno.json", import.meta.url));
  const entry = fileURLToPath(new URL("./child.ts", import.meta.url));
  const child = new Deno.Command(Deno.execPath(), {
    args: [
      "run",
      "--allow-all",
      "--quiet",
      "--config",
      config,
      entry,
      JSON.stringify({ path, options: serializable }),
    ],
    stdin: "piped", // held open until the end: its closing tells the child the parent is gone
    stdout: "piped",
    stderr: "inherit",
  }).spawn();
  let kernelPid: number | undefined;
  let connectionFolder: string | undefined;
  let result: RunResult | undefined;
  let cellNumber: number | undefined;
  let cellsStarted = 0;
  let killedFor: "timeout" | "aborted" | undefined;
  let watchdog: ReturnType<typeof setTimeout> | undefined;
  const killKernelGroup = () => {
    if (kernelPid === undefined) return;
    try {
      Deno.kill(-kernelPid, "SIGKILL");
    } catch {
      // group already empty
    }
  };
  /** Kills the client (and the kernel's group) unless it finishes within `seconds`. */
  const armWatchdog = (seconds: number, kind: "timeout" | "aborted") => {
    clearTimeout(watchdog);
    watchdog = setTimeout(() => {
      killedFor = kind;
      try {
        child.kill("SIGKILL");
      } catch {
        // already gone
      }
      killKernelGroup();
    }, seconds * 1000);
  };
  const onAbort = () => {
    const reason = signal?.reason;
    try {
      child.kill(
        typeof reason === "string" && FORWARDED_SIGNALS.has(reason)
          ? reason as Deno.Signal
          : "SIGTERM",
      );
    } catch {
      // already gone
    }
    if (result === undefined) armWatchdog(graceSeconds, "aborted");
  };
  signal?.addEventListener("abort", onAbort, { once: true });
  if (signal?.aborted) onAbort();
  const handle = (line: string) => {
    if (line.trim() === "") return;
    let event: ChildEvent;
    try {
      event = JSON.parse(line);
    } catch {
      log(line); // not ours: pass it on
      return;
    }
    if (event.type === "log") log(event.line);
    else if (event.type === "kernel") {
      kernelPid = event.pid;
      connectionFolder = event.connectionFolder;
      onKernelStarted?.(event.pid, event.connectionFolder);
    } else if (event.type === "cell") {
      cellNumber = event.number;
      if (event.state === "started") cellsStarted++;
      onCell?.(event.number, event.state, event.position);
      if (!signal?.aborted) {
        // the client enforces the limit itself; this is the bound should it fail to
        if (event.state === "started") armWatchdog(timeoutSeconds + graceSeconds, "timeout");
        else clearTimeout(watchdog);
      }
    } else if (event.type === "result") {
      result = event.result as RunResult;
      clearTimeout(watchdog);
    }
  };
  try {
    await forEachLine(child.stdout, handle);
  } finally {
    clearTimeout(watchdog);
    signal?.removeEventListener("abort", onAbort);
  }
  const status = await child.status;
  await child.stdin.close().catch(() => {});
  // whatever happened in the child, nothing of the kernel's group survives the run
  if (kernelPid !== undefined) await killGroupAndWait(kernelPid);
  if (result !== undefined) return result;
  // the client did not stop the kernel itself: the key in its connection file goes too
  if (connectionFolder !== undefined) {
    await Deno.remove(connectionFolder, { recursive: true }).catch(() => {});
  }

  // ---- no result: the client was killed here, or ended by itself ----------------------------
  const how = status.signal !== null ? `signal ${status.signal}` : `exit ${status.code}`;
  const lost = "so the outputs of this run are lost";
  const killed = `the notebook client did not stop within ${graceSeconds} s and was killed`;
  const interruption = interruptionText(signal?.reason);
  let kind: "timeout" | "aborted" | undefined;
  let evalue: string;
  if (killedFor === "timeout") {
    kind = "timeout";
    evalue = `${timeoutText(timeoutSeconds)}; ${killed}, ${lost}`;
  } else if (killedFor === "aborted" || signal?.aborted) {
    kind = "aborted";
    evalue = killedFor === "aborted"
      ? `${interruption}; ${killed}, ${lost}`
      : `${interruption}; the notebook client ended without a result (${how}), ${lost}`;
  } else {
    evalue = `The notebook client process ended without a result (${how}), ${lost}`;
  }
  const what = killedFor === "timeout" ? "of the cell limit" : `of ${namedReason(signal?.reason)}`;
  let message = killedFor === undefined
    ? `${path}: the notebook client process ended without a result (${how})`
    : `${path}: the notebook client process did not stop within ${graceSeconds} s ${what} and was killed`;
  if (kernelPid !== undefined) message += `; kernel process group ${kernelPid} was killed`;
  const run: RunResult = {
    path,
    status: kind === "timeout" || kind === undefined ? "failed" : "interrupted",
    message,
    ...(kernelPid === undefined ? {} : { kernelPid }),
    cellsExecuted: cellsStarted,
    codeCells: 0,
    elapsedMs: 0,
  };
  const notebook = await readNotebook(path).catch(() => undefined);
  if (notebook !== undefined) {
    const codeCells = notebook.cells.filter((c) => c.cell_type === "code");
    run.codeCells = codeCells.length;
    for (const cell of codeCells) {
      cell.outputs = [];
      cell.execution_count = null;
    }
    const stoppedAt = cellNumber ?? notebook.cells.findIndex((c) => c.cell_type === "code") + 1;
    const ename = kind === undefined ? "NotebookClientError" : STOP_ERROR_NAMES[kind];
    const partialPath = partialPathOf(path);
    // a partial the client finished writing in this run holds the outputs: keep it
    const written = await Deno.stat(partialPath).then((s) => (s.mtime?.getTime() ?? 0) >= started)
      .catch(() => false);
    if (!written) {
      await writeNotebook(
        partialPath,
        markStopped(notebook, { cellNumber: stoppedAt, ename, evalue }),
      );
    }
    run.partialPath = partialPath;
    if (kind !== undefined) {
      const failure: CellFailure = {
        kind,
        cellNumber: stoppedAt,
        cellCount: notebook.cells.length,
        cellId: notebook.cells[stoppedAt - 1]?.id ?? "",
        executionCount: null,
        ename,
        evalue,
        traceback: [],
      };
      run.failure = failure;
      message += `\n${formatFailure(path, failure)}`;
    }
    run.message = `${message}\n  partial notebook: ${partialPath}`;
    log(run.message);
  }
  run.elapsedMs = Date.now() - started;
  return run;
}
