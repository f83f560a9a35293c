/**
 * The Python-free notebook runner: executes a notebook's code cells in order on the real Deno
 * kernel, stores the outputs (nbformat 4.5, validated before writing), stops at the first error
 * with the cell number, the source line and the traceback, and always shuts the kernel down.
 *
 * Files: the executed notebook goes to the output folder (or over the original with `inPlace`);
 * on failure a partially executed notebook is written beside the original as `*.partial.ipynb`;
 * the original is never touched unless `inPlace` is set and the run succeeded.
 *
 * {@linkcode runNotebook} does the work in a child deno process (`child.ts`) that owns the
 * kernel and its ZeroMQ sockets, and kills the kernel's process group itself if that child ends
 * without a result; {@linkcode runNotebookInProcess} is the in-process core both share.
 *
 * @module
 */
import { basename, dirname, extname, join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
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
  assertValidNotebook,
  checkDenoKernelspec,
  type CodeCell,
  type DisplayDataOutput,
  joinText,
  type Notebook,
  NotebookInputError,
  OutputCollector,
  parseNotebook,
} from "./nbformat.ts";

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
  /** Aborts the run (Ctrl-C): the kernel is killed and a partial notebook written. */
  signal?: AbortSignal;
  /** Receives progress and report lines (default: written to stderr). */
  log?: (line: string) => void;
  /** Called with the kernel pid as soon as the kernel has started. */
  onKernelStarted?: (pid: number) => void;
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

/**
 * Writes a notebook after validating it against nbformat 4.5.
 *
 * @param path Destination.
 * @param notebook The notebook.
 * @returns When written.
 * @throws {TypeError} When the notebook is not valid (a runner defect; nothing is written).
 */
export async function writeNotebook(path: string, notebook: Notebook): Promise<void> {
  assertValidNotebook(notebook, path);
  await Deno.mkdir(dirname(path), { recursive: true });
  await Deno.writeTextFile(path, JSON.stringify(notebook, null, 1) + "\n");
}

const STATUS_WORD: Readonly<Record<CellFailure["kind"], string>> = {
  error: "FAILED",
  timeout: "TIMED OUT",
  died: "KERNEL DIED",
  aborted: "INTERRUPTED",
};

function stemOf(path: string): string {
  return basename(path, extname(path));
}

/** The path of the partial notebook beside `path`: `name.partial.ipynb`. */
export function partialPathOf(path: string): string {
  return join(dirname(path), `${stemOf(path)}.partial.ipynb`);
}

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
    let text: string;
    try {
      text = await Deno.readTextFile(path);
    } catch (error) {
      if (error instanceof Deno.errors.NotFound) {
        throw new NotebookInputError(
          `Notebook not found: ${basename(path)} (looked in ${dirname(resolve(path))})`,
        );
      }
      if (error instanceof Deno.errors.IsADirectory) {
        throw new NotebookInputError(`Notebook path is a directory: ${path}`);
      }
      throw new NotebookInputError(`Notebook ${path}: cannot read: ${(error as Error).message}`);
    }
    notebook = parseNotebook(text, path);
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
  if (options.signal?.aborted) return done("interrupted", `${path}: interrupted before start`);
  let kernel: DenoKernel;
  try {
    kernel = await DenoKernel.start({
      cwd: dirname(resolve(path)),
      startupTimeoutMs: (options.startupTimeoutSeconds ?? 60) * 1000,
      closeSockets,
      ...(options.denoPath === undefined ? {} : { denoPath: options.denoPath }),
    });
  } catch (error) {
    if (error instanceof KernelError) return done("kernel", `${path}: ${error.message}`);
    throw error;
  }
  result.kernelPid = kernel.pid;
  options.onKernelStarted?.(kernel.pid);
  const info = kernel.kernelInfo;
  log(
    `${path}: kernel started (pid ${kernel.pid}, ${String(info.implementation ?? "kernel")} ${
      String(info.implementation_version ?? "")
    }, protocol ${String(info.protocol_version ?? "?")})`,
  );
  if (!(await kernel.heartbeat())) log(`${path}: warning: the kernel heartbeat did not answer`);

  // ---- cells ---------------------------------------------------------------------------------
  const displays = new Map<string, DisplayDataOutput[]>();
  let failure: CellFailure | undefined;
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
      cell.outputs = collector.outputs;
      const stderrBefore = kernel.stderrTail;
      const outcome: ExecuteOutcome = await kernel.execute(source, {
        timeoutMs: timeoutSeconds * 1000,
        onIopub: (m) => collector.handle(m.header.msg_type, m.content),
        ...(options.signal === undefined ? {} : { signal: options.signal }),
      });
      result.cellsExecuted++;
      cell.execution_count = outcome.executionCount;
      const seconds = (outcome.elapsedMs / 1000).toFixed(2);
      if (outcome.status === "ok") {
        log(`${label} ok in ${seconds} s · ${firstCodeLine(source)}`);
        continue;
      }
      const base = {
        cellNumber: index + 1,
        cellCount: notebook.cells.length,
        cellId: cell.id,
        executionCount: outcome.executionCount,
      };
      if (outcome.status === "error") {
        let error = outcome.error ?? { ename: "Error", evalue: "", traceback: [] };
        let line: SourceLine | undefined;
        if (error.traceback.length === 0) {
          // The Deno kernel answers a syntax error with a bare "Execution failed": ask the
          // parser of the same deno binary for the message and position.
          const syntax = await diagnoseSyntax(resolveDenoPath(options.denoPath), source);
          if (syntax !== undefined) {
            error = { ename: "SyntaxError", evalue: syntax.message, traceback: [] };
            error.traceback.push(`SyntaxError: ${syntax.message} (line ${syntax.line.number})`);
            line = syntax.line;
          }
        }
        const traceback = error.traceback.map(stripAnsi);
        failure = { kind: "error", ...base, ename: error.ename, evalue: error.evalue, traceback };
        line ??= locateErrorLine(source, error.evalue, traceback);
        if (line !== undefined) failure.line = line;
        if (!collector.outputs.some((o) => o.output_type === "error")) {
          collector.handle("error", error);
        }
      } else {
        const evalue = outcome.status === "timeout"
          ? `Cell did not finish within ${timeoutSeconds} s; the kernel was stopped`
          : outcome.status === "aborted"
          ? "Run interrupted; the kernel was stopped"
          : `The kernel process exited during the cell${describeExit(kernel.exitStatus)}`;
        const ename =
          { timeout: "CellTimeoutError", aborted: "InterruptedError", died: "KernelDiedError" }[
            outcome.status
          ];
        failure = { kind: outcome.status, ...base, ename, evalue, traceback: [] };
        collector.handle("error", { ename, evalue, traceback: [`${ename}: ${evalue}`] });
      }
      const newStderr = stderrSince(stderrBefore, kernel.stderrTail);
      if (newStderr.trim() !== "") failure.kernelStderr = stripAnsi(newStderr);
      log(`${label} ${STATUS_WORD[failure.kind]} after ${seconds} s · ${firstCodeLine(source)}`);
      break;
    }
  } finally {
    if (failure === undefined || failure.kind === "error") {
      result.cleanShutdown = await kernel.shutdown();
    } else {
      await kernel.kill(); // hung, dead or interrupted: no point asking politely
      result.cleanShutdown = false;
    }
  }

  // ---- files ---------------------------------------------------------------------------------
  notebook.metadata.kernelspec ??= { name: "deno", display_name: "Deno", language: "typescript" };
  if (typeof info.language_info === "object" && info.language_info !== null) {
    notebook.metadata.language_info = info.language_info as { name: string };
  }
  const partialPath = partialPathOf(path);
  if (failure !== undefined) {
    result.failure = failure;
    notebook.metadata.sonorigor_partial = {
      failed_cell: failure.cellNumber,
      reason: `${failure.ename}: ${failure.evalue}`,
    };
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
    const htmlPath = join(outDir, `${stemOf(path)}.html`);
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

/**
 * Executes one notebook on the real Deno kernel, isolated in a child deno process that speaks
 * ZeroMQ to the kernel. The native zeromq addon could crash its process under Deno now and then
 * when sockets to a killed kernel were torn down; isolation means such a crash can neither take
 * the caller down nor leave the kernel behind: this parent kills the kernel's process group
 * whenever the child ends without a result. Progress lines, the kernel pid and the result come
 * back over the child's stdout.
 *
 * @param path The .ipynb file.
 * @param options Output folder, in-place, per-cell timeout, HTML export, deno binary, abort
 *   signal (forwarded to the child as SIGTERM), logger.
 * @returns What happened (never throws for bad input or cell errors).
 */
export async function runNotebook(path: string, options: RunOptions = {}): Promise<RunResult> {
  const started = Date.now();
  const log = options.log ?? ((line: string) => console.error(line));
  const { signal, log: _log, onKernelStarted, ...serializable } = options;
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
  const onAbort = () => {
    try {
      child.kill("SIGTERM");
    } catch {
      // already gone
    }
  };
  signal?.addEventListener("abort", onAbort, { once: true });
  if (signal?.aborted) onAbort();
  let kernelPid: number | undefined;
  let result: RunResult | undefined;
  let pending = "";
  const decoder = new TextDecoder();
  const handle = (line: string) => {
    if (line.trim() === "") return;
    let event: { type: string; line?: string; pid?: number; result?: RunResult };
    try {
      event = JSON.parse(line);
    } catch {
      log(line); // not ours: pass it on
      return;
    }
    if (event.type === "log" && event.line !== undefined) log(event.line);
    else if (event.type === "kernel" && event.pid !== undefined) {
      kernelPid = event.pid;
      onKernelStarted?.(event.pid);
    } else if (event.type === "result" && event.result !== undefined) result = event.result;
  };
  try {
    for await (const chunk of child.stdout) {
      pending += decoder.decode(chunk, { stream: true });
      let newline: number;
      while ((newline = pending.indexOf("\n")) >= 0) {
        handle(pending.slice(0, newline));
        pending = pending.slice(newline + 1);
      }
    }
    handle(pending);
  } finally {
    signal?.removeEventListener("abort", onAbort);
  }
  const status = await child.status;
  await child.stdin.close().catch(() => {});
  if (kernelPid !== undefined) {
    // whatever happened in the child, nothing of the kernel's process group survives
    try {
      Deno.kill(-kernelPid, "SIGKILL");
    } catch {
      // group already empty
    }
  }
  if (result !== undefined) return result;
  const how = status.signal !== null ? `signal ${status.signal}` : `exit ${status.code}`;
  return {
    path,
    status: signal?.aborted ? "interrupted" : "failed",
    message: `${path}: the notebook client process ended without a result (${how})${
      kernelPid === undefined ? "" : `; kernel process group ${kernelPid} was killed`
    }`,
    ...(kernelPid === undefined ? {} : { kernelPid }),
    cellsExecuted: 0,
    codeCells: 0,
    elapsedMs: Date.now() - started,
  };
}
