/**
 * Executes Jupyter notebooks (.ipynb) on the real Deno kernel over ZeroMQ, without Python or
 * Jupyter installed, and exports them as self-contained HTML.
 *
 * - {@linkcode runNotebook} runs one notebook in a child process: code cells in order, outputs
 *   stored as nbformat 4.5, the first failing cell reported with its source line and traceback,
 *   the kernel's process group always stopped; a failed, timed-out or interrupted run leaves
 *   `*.partial.ipynb` beside it with the outputs so far and an error output saying why.
 * - Per-cell limits and stop signals hold even while a cell floods output: stream text is
 *   accumulated in linear time ({@linkcode OutputCollector}) and kernel messages are drained in
 *   bounded batches ({@linkcode drainInBatches}) so timers and signals keep their turn.
 * - {@linkcode findNotebooks} lists the notebooks of a project's folders.
 * - {@linkcode parseNotebook}, {@linkcode notebookProblems} and {@linkcode assertValidNotebook}
 *   read and check nbformat 4 documents; {@linkcode notebookToHtml} renders one offline.
 * - {@linkcode createProgress} and {@linkcode formatProgress} draw a run's progress bar on a
 *   terminal and stay quiet otherwise.
 * - {@linkcode DenoKernel} is the kernel client itself (connection file, signed messages).
 *
 * The command line is the `./cli` entry (`deno task notebooks` in this repository; `--help` lists
 * its options); process checks for tests are in `./testing`.
 *
 * @example Render a notebook to HTML without running it
 * ```ts
 * import { notebookToHtml, parseNotebook } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const notebook = parseNotebook(
 *   JSON.stringify({
 *     metadata: { kernelspec: { name: "deno", display_name: "Deno", language: "typescript" } },
 *     nbformat: 4,
 *     nbformat_minor: 5,
 *     cells: [{ id: "a", cell_type: "markdown", metadata: {}, source: "# Velocity & pressure" }],
 *   }),
 *   "example.ipynb",
 * );
 * const html = notebookToHtml(notebook);
 * assert.match(html, /<title>Velocity &amp; pressure<\/title>/);
 * assert.match(html, /<h1[^>]*>Velocity &amp; pressure<\/h1>/);
 * ```
 *
 * @module
 */
export {
  type CellFailure,
  diagnoseSyntax,
  formatFailure,
  locateErrorLine,
  type SourceLine,
} from "./diagnostics.ts";
export { findNotebooks } from "./find_notebooks.ts";
export {
  type HtmlExportOptions,
  notebookTitle,
  notebookToHtml,
  renderMimeBundle,
  stripAnsi,
} from "./html.ts";
export {
  type ConnectionInfo,
  DenoKernel,
  type ExecuteOptions,
  type ExecuteOutcome,
  KernelError,
  type KernelStartOptions,
  resolveDenoPath,
} from "./kernel.ts";
export {
  appendLines,
  assertValidNotebook,
  type Cell,
  checkDenoKernelspec,
  type CodeCell,
  type DisplayDataOutput,
  type ErrorOutput,
  type ExecuteResultOutput,
  joinText,
  type MarkdownCell,
  type MimeData,
  type MultilineString,
  type Notebook,
  NotebookInputError,
  notebookProblems,
  type Output,
  OutputCollector,
  parseNotebook,
  type RawCell,
  type StreamOutput,
} from "./nbformat.ts";
export { type JupyterMessage, type MessageHeader, PROTOCOL_VERSION } from "./protocol.ts";
export { drainInBatches, type DrainOptions, yieldToEventLoop } from "./drain.ts";
export { DEFAULT_STOP_GRACE_SECONDS, runNotebook } from "./isolation.ts";
export {
  interruptionText,
  markStopped,
  partialPathOf,
  readNotebook,
  type StopRecord,
  timeoutText,
  writeNotebook,
} from "./notebook_files.ts";
export {
  type CodeCellPosition,
  runNotebookInProcess,
  type RunOptions,
  type RunResult,
} from "./runner.ts";
export {
  createProgress,
  formatProgress,
  type Progress,
  type ProgressOptions,
  type ProgressState,
} from "./progress.ts";
