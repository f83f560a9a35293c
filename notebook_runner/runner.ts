/**
 * The Python-free notebook runner: executes a notebook's code cells in order on the real Deno
 * kernel, stores the outputs (nbformat 4.5, validated before writing), stops at the first error
 * with the cell number, the source line and the traceback, and always shuts the kernel down.
 *
 * Files: the executed notebook goes to the output folder (or over the original with `inPlace`);
 * when a run fails, times out or is interrupted, a partially executed notebook is written beside
 * the original as `*.partial.ipynb` (outputs so far, and an error output on the cell where it
 * stopped saying why); the original is never touched unless `inPlace` is set and the run
 * succeeded.
 *
 * {@linkcode runNotebookInProcess} is the in-process core; `runNotebook` (isolation.ts) runs it
 * in a child deno process that owns the kernel and its ZeroMQ sockets.
 *
 * @module
 */
import { basename, dirname, extname, join, resolve } from "node:path";
import {
  type CellFailure,
  diagnoseSyntax,
  formatFailure,
  locateErrorLine,
  type SourceLine,
} from "./diagnostics.ts";
import { notebookToHtml, stripAnsi } from "./html.ts";
import { DenoKernel, type ExecuteOutcome, KernelError, resolveDenoPath } from "./kernel.ts";
import {
  checkDenoKernelspec,
  type CodeCell,
  type DisplayDataOutput,
  joinText,
  type Notebook,
  NotebookInputError,
  OutputCollector,
} from "./nbformat.ts";
import {
  interruptionText,
  markStopped,
  partialPathOf,
  readNotebook,
  STOP_ERROR_NAMES,
  timeoutText,
  writeNotebook,
} from "./notebook_files.ts";

/** Options of {@linkcode runNotebook}. */
export interface RunOptions {
  /** Folder for the executed notebook and the HTML export (default "out/notebooks"). */
  outDir?: string;
  /** Overwrite the original notebook with the executed one (only after a successful run). */
  inPlace?: boolean;
  /** Per-cell time limit in seconds (default 300). */
  timeoutSeconds?: number;
  /** Time limit for the kernel to start and answer, in seconds (default 60). */
  startupTimeoutSeconds?: number;
  /** Also write a self-contained HTML export to the output folder. */
  html?: boolean;
  /** The deno binary (default: `SONORIGOR_DENO`, else the running deno). */
  denoPath?: string;
  /**
   * Aborts the run (Ctrl-C): the kernel is interrupted and killed and a partial notebook
   * written. A string reason (a signal name such as "SIGTERM") is named in the error output.
   */
  signal?: AbortSignal;
  /**
   * How long the notebook client of {@linkcode runNotebook} may take to stop, after the abort
   * signal or past a cell's limit, before it is killed with the kernel's process group and the
   * partial notebook is written without its outputs, in seconds (default 30).
   */
  stopGraceSeconds?: number;
  /** Receives progress and report lines (default: written to stderr). */
  log?: (line: string) => void;
  /**
   * Called as soon as the kernel has started, with its pid and the temporary folder of its
   * connection file (which holds the signing key; removed when the kernel is stopped).
   */
  onKernelStarted?: (pid: number, connectionFolder: string) => void;
  /**
   * Called when a code cell starts ("started") and when it ends ("ended"), with its number among
   * all cells and its place among the code cells (for a progress display).
   */
  onCell?: (cellNumber: number, state: "started" | "ended", position: CodeCellPosition) => void;
}

/** A code cell's place among the notebook's code cells (1-based), as `onCell` receives it. */
export interface CodeCellPosition {
  /** The cell's number among the code cells (1-based). */
  codeCell: number;
  /** Code cells in the notebook. */
  codeCells: number;
}

/** The result of {@linkcode runNotebook}; never thrown, always returned. */
export interface RunResult {
  /** The notebook path as given. */
  path: string;
  /**
   * "ok"; "failed" (a cell failed or the kernel died); "invalid" (missing file, bad JSON,
   * non-Deno kernelspec); "kernel" (the kernel could not be started); "interrupted".
   */
  status: "ok" | "failed" | "invalid" | "kernel" | "interrupted";
  /** A one-paragraph human-readable explanation when not ok. */
  message?: string;
  /** The failing cell, when a cell failed. */
  failure?: CellFailure;
  /** The executed (or partially executed) notebook. */
  notebook?: Notebook;
  /** Where the executed notebook was written (success only). */
  outputPath?: string;
  /** Where the HTML export was written. */
  htmlPath?: string;
  /** Where the partial notebook was written (failure only). */
  partialPath?: string;
  /** The kernel's process id (for checks that it is gone). */
  kernelPid?: number;
  /** Whether the kernel exited on its own after `shutdown_request`. */
  cleanShutdown?: boolean;
  /** Code cells executed (including a failing one). */
  cellsExecuted: number;
  /** Code cells in the notebook. */
  codeCells: number;
  /** Wall-clock milliseconds. */
  elapsedMs: number;
}

const STATUS_WORD: Readonly<Record<CellFailure["kind"], string>> = {
  error: "FAILED",
  timeout: "TIMED OUT",
  died: "KERNEL DIED",
  aborted: "INTERRUPTED",
};

function firstCodeLine(source: string): string {
  const line = source.split("\n").find((l) => l.trim() !== "" && !l.trim().startsWith("//")) ??
    "";
  return line.length > 60 ? `${line.slice(0, 57)}...` : line.trim();
}

function imageResolver(notebookDir: string): (href: string) => string | undefined {
  const types: Record<string, string> = {
    ".png": "image/png",
    ".jpg": "image/jpeg",
    ".jpeg": "image/jpeg",
    ".gif": "image/gif",
    ".svg": "image/svg+xml",
  };
  return (href) => {
    const mime = types[extname(href).toLowerCase()];
    if (mime === undefined) return undefined;
    try {
      const bytes = Deno.readFileSync(resolve(notebookDir, decodeURI(href)));
      let binary = "";
      for (let i = 0; i < bytes.length; i += 0x8000) {
        binary += String.fromCharCode(...bytes.subarray(i, i + 0x8000));
      }
      return `data:${mime};base64,${btoa(binary)}`;
    } catch {
      return undefined;
    }
  };
}

/**
 * Executes one notebook on the real Deno kernel in this process. Prefer
 * {@linkcode runNotebook}, which does the same in a child process.
 *
 * @param path The .ipynb file.
 * @param options Output folder, in-place, per-cell timeout, HTML export, deno binary, abort
 *   signal, logger.
 * @param closeSockets Close the ZeroMQ sockets at the end (false in a child that exits next).
 * @returns What happened (never throws for bad input or cell errors).
 */
export async function runNotebookInProcess(
  path: string,
  options: RunOptions = {},
  closeSockets = true,
): Promise<RunResult> {
  const started = Date.now();
  const log = options.log ?? ((line: string) => console.error(line));
  const timeoutSeconds = options.timeoutSeconds ?? 300;
  const result: RunResult = {
    path,
    status: "ok",
    cellsExecuted: 0,
    codeCells: 0,
    elapsedMs: 0,
  };
  const done = (status: RunResult["status"], message?: string): RunResult => {
    result.status = status;
    if (message !== undefined) result.message = message;
    result.elapsedMs = Date.now() - started;
    return result;
  };

  // ---- input ---------------------------------------------------------------------------------
  let notebook: Notebook;
  try {
    notebook = await readNotebook(path);
    if (!checkDenoKernelspec(notebook, path)) {
      log(`${path}: no kernelspec in the notebook metadata; running it on the Deno kernel`);
    }
  } catch (error) {
    if (error instanceof NotebookInputError) return done("invalid", error.message);
    throw error;
  }
  const codeCells = notebook.cells.filter((c): c is CodeCell => c.cell_type === "code");
  result.codeCells = codeCells.length;
  result.notebook = notebook;
  for (const cell of codeCells) {
    cell.outputs = [];
    cell.execution_count = null;
  }

  // ---- kernel --------------------------------------------------------------------------------
  const signal = options.signal;
  const firstCode = notebook.cells.findIndex((c) => c.cell_type === "code") + 1;
  /** A failure for a stop (timeout, interruption, kernel exit) at a cell. */
  const stopFailure = (
    kind: "timeout" | "aborted" | "died",
    cellNumber: number,
    executionCount: number | null,
    evalue: string,
  ): CellFailure => ({
    kind,
    cellNumber,
    cellCount: notebook.cells.length,
    cellId: notebook.cells[cellNumber - 1]?.id ?? "",
    executionCount,
    ename: STOP_ERROR_NAMES[kind],
    evalue,
    traceback: [],
  });
  const interrupted = () => `${interruptionText(signal?.reason)}; the kernel was stopped`;
  let kernel: DenoKernel | undefined;
  let failure: CellFailure | undefined;
  if (signal?.aborted) {
    failure = stopFailure("aborted", firstCode, null, interrupted());
  } else {
    try {
      kernel = await DenoKernel.start({
        cwd: dirname(resolve(path)),
        startupTimeoutMs: (options.startupTimeoutSeconds ?? 60) * 1000,
        closeSockets,
        ...(options.denoPath === undefined ? {} : { denoPath: options.denoPath }),
        ...(signal === undefined ? {} : { signal }),
      });
    } catch (error) {
      if (!(error instanceof KernelError)) throw error;
      if (!signal?.aborted) return done("kernel", `${path}: ${error.message}`);
      failure = stopFailure("aborted", firstCode, null, interrupted());
    }
  }
  const info = kernel?.kernelInfo ?? {};
  if (kernel !== undefined) {
    result.kernelPid = kernel.pid;
    options.onKernelStarted?.(kernel.pid, kernel.connectionFolder);
    log(
      `${path}: kernel started (pid ${kernel.pid}, ${String(info.implementation ?? "kernel")} ${
        String(info.implementation_version ?? "")
      }, protocol ${String(info.protocol_version ?? "?")})`,
    );
    if (!(await kernel.heartbeat())) log(`${path}: warning: the kernel heartbeat did not answer`);
    failure = await runCells(kernel);
  }

  async function runCells(kernel: DenoKernel): Promise<CellFailure | undefined> {
    const displays = new Map<string, DisplayDataOutput[]>();
    const collectors: OutputCollector[] = [];
    let failure: CellFailure | undefined;
    let stopped = false;
    try {
      let codeIndex = 0;
      for (const [index, cell] of notebook.cells.entries()) {
        if (cell.cell_type !== "code") continue;
        codeIndex++;
        const source = joinText(cell.source);
        const label = `${path} [cell ${
          index + 1
        }/${notebook.cells.length}, code ${codeIndex}/${codeCells.length}]`;
        if (source.trim() === "") {
          log(`${label} empty, skipped`);
          continue;
        }
        const collector = new OutputCollector(displays);
        collectors.push(collector);
        cell.outputs = collector.outputs;
        const stderrBefore = kernel.stderrTail;
        options.onCell?.(index + 1, "started", {
          codeCell: codeIndex,
          codeCells: codeCells.length,
        });
        const outcome: ExecuteOutcome = await kernel.execute(source, {
          timeoutMs: timeoutSeconds * 1000,
          onIopub: (m) => collector.handle(m.header.msg_type, m.content),
          ...(signal === undefined ? {} : { signal }),
        });
        if (outcome.status !== "ok" && outcome.status !== "error") {
          // interrupt, then kill the process group: no output arrives after this
          await kernel.kill();
          stopped = true;
        }
        options.onCell?.(index + 1, "ended", { codeCell: codeIndex, codeCells: codeCells.length });
        result.cellsExecuted++;
        cell.execution_count = outcome.executionCount;
        const seconds = (outcome.elapsedMs / 1000).toFixed(2);
        if (outcome.status === "ok") {
          log(`${label} ok in ${seconds} s · ${firstCodeLine(source)}`);
          continue;
        }
        if (outcome.status === "error") {
          failure = await errorFailure(outcome, index, cell.id, source, collector);
        } else {
          const evalue = outcome.status === "timeout"
            ? `${timeoutText(timeoutSeconds, outcome.outputPending)}; the kernel was stopped`
            : outcome.status === "aborted"
            ? interrupted()
            : `The kernel process exited during the cell${describeExit(kernel.exitStatus)}`;
          failure = stopFailure(outcome.status, index + 1, outcome.executionCount, evalue);
        }
        const newStderr = stderrSince(stderrBefore, kernel.stderrTail);
        if (newStderr.trim() !== "") failure.kernelStderr = stripAnsi(newStderr);
        log(`${label} ${STATUS_WORD[failure.kind]} after ${seconds} s · ${firstCodeLine(source)}`);
        break;
      }
    } finally {
      if (stopped) {
        result.cleanShutdown = false;
      } else if (failure === undefined || failure.kind === "error") {
        result.cleanShutdown = await kernel.shutdown();
      } else {
        await kernel.kill();
        result.cleanShutdown = false;
      }
      // the stream text of every cell (late console output included) becomes stored lines
      for (const collector of collectors) collector.flush();
    }
    return failure;
  }

  /** The failure of a cell the kernel reported an error for (a syntax error located). */
  async function errorFailure(
    outcome: ExecuteOutcome,
    index: number,
    cellId: string,
    source: string,
    collector: OutputCollector,
  ): Promise<CellFailure> {
    let error = outcome.error ?? { ename: "Error", evalue: "", traceback: [] };
    let line: SourceLine | undefined;
    if (error.traceback.length === 0) {
      // The Deno kernel answers a syntax error with a bare "Execution failed": ask the parser
      // of the same deno binary for the message and position.
      const syntax = await diagnoseSyntax(resolveDenoPath(options.denoPath), source);
      if (syntax !== undefined) {
        error = { ename: "SyntaxError", evalue: syntax.message, traceback: [] };
        error.traceback.push(`SyntaxError: ${syntax.message} (line ${syntax.line.number})`);
        line = syntax.line;
      }
    }
    const traceback = error.traceback.map(stripAnsi);
    const failure: CellFailure = {
      kind: "error",
      cellNumber: index + 1,
      cellCount: notebook.cells.length,
      cellId,
      executionCount: outcome.executionCount,
      ename: error.ename,
      evalue: error.evalue,
      traceback,
    };
    line ??= locateErrorLine(source, error.evalue, traceback);
    if (line !== undefined) failure.line = line;
    if (!collector.outputs.some((o) => o.output_type === "error")) {
      collector.handle("error", error);
    }
    return failure;
  }

  // ---- files ---------------------------------------------------------------------------------
  notebook.metadata.kernelspec ??= { name: "deno", display_name: "Deno", language: "typescript" };
  if (typeof info.language_info === "object" && info.language_info !== null) {
    notebook.metadata.language_info = info.language_info as { name: string };
  }
  const partialPath = partialPathOf(path);
  if (failure !== undefined) {
    result.failure = failure;
    markStopped(notebook, failure);
    await writeNotebook(partialPath, notebook);
    result.partialPath = partialPath;
    const report = `${formatFailure(path, failure)}\n  partial notebook: ${partialPath}`;
    log(report);
    return done(failure.kind === "aborted" ? "interrupted" : "failed", report);
  }
  await Deno.remove(partialPath).catch(() => {}); // a stale partial from an earlier failed run
  const outDir = options.outDir ?? "out/notebooks";
  const outputPath = options.inPlace ? path : join(outDir, basename(path));
  await writeNotebook(outputPath, notebook);
  result.outputPath = outputPath;
  if (options.html) {
    const htmlPath = join(outDir, `${basename(path, extname(path))}.html`);
    await Deno.mkdir(outDir, { recursive: true });
    await Deno.writeTextFile(
      htmlPath,
      notebookToHtml(notebook, {
        sourceLabel: path,
        resolveImage: imageResolver(dirname(resolve(path))),
      }),
    );
    result.htmlPath = htmlPath;
  }
  log(
    `${path}: ok, ${result.cellsExecuted} code cells in ${
      ((Date.now() - started) / 1000).toFixed(1)
    } s → ${outputPath}${result.htmlPath === undefined ? "" : ` and ${result.htmlPath}`}`,
  );
  return done("ok");
}

/** The text appended to a rolling tail between two snapshots. */
function stderrSince(before: string, after: string): string {
  if (after.startsWith(before)) return after.slice(before.length);
  // the tail rolled over: find the longest suffix of `before` that starts `after`
  for (let k = Math.min(before.length, after.length); k > 0; k--) {
    if (after.startsWith(before.slice(before.length - k))) return after.slice(k);
  }
  return after;
}

function describeExit(status: Deno.CommandStatus | null): string {
  if (status === null) return "";
  return status.signal === null ? ` (exit ${status.code})` : ` (signal ${status.signal})`;
}
