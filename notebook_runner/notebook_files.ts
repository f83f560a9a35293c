/**
 * Reading and writing notebook files, and the partially executed notebook a failed or stopped
 * run leaves beside
 * the original (`name.partial.ipynb`): the outputs so far, an error output on the cell where the
 * run stopped saying why, and `metadata.sonorigor_partial`. Shared by the in-process runner and
 * by the runner process, which writes it itself when its notebook client could not.
 *
 * @module
 */
import { basename, dirname, extname, join, resolve } from "node:path";
import {
  assertValidNotebook,
  type Notebook,
  NotebookInputError,
  parseNotebook,
} from "./nbformat.ts";

/**
 * Reads and parses a notebook file, with errors that say what is wrong with the path.
 *
 * @param path The .ipynb file.
 * @returns The notebook (upgraded to nbformat 4.5).
 * @throws {NotebookInputError} When the file is missing, a directory, unreadable, not JSON or
 *   not a notebook.
 *
 * @example
 * ```ts
 * import { readNotebook } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const dir = await Deno.makeTempDir();
 * await assert.rejects(readNotebook(`${dir}/none.ipynb`), {
 *   name: "NotebookInputError",
 *   message: `Notebook not found: none.ipynb (looked in ${dir})`,
 * });
 * await Deno.remove(dir);
 * ```
 */
export async function readNotebook(path: string): Promise<Notebook> {
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
  return parseNotebook(text, path);
}

/**
 * Writes a notebook after validating it against nbformat 4.5. The text goes to a temporary file
 * beside the destination, which is then renamed over it, so a run stopped mid-write never
 * leaves a truncated notebook.
 *
 * @param path Destination.
 * @param notebook The notebook.
 * @returns When written.
 * @throws {TypeError} When the notebook is not valid (a runner defect; nothing is written).
 *
 * @example
 * ```ts
 * import { writeNotebook } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const dir = await Deno.makeTempDir();
 * await writeNotebook(`${dir}/a.ipynb`, { metadata: {}, nbformat: 4, nbformat_minor: 5, cells: [] });
 * assert.equal(JSON.parse(await Deno.readTextFile(`${dir}/a.ipynb`)).nbformat_minor, 5);
 * assert.deepEqual([...Deno.readDirSync(dir)].map((e) => e.name), ["a.ipynb"]);
 * await Deno.remove(dir, { recursive: true });
 * ```
 */
export async function writeNotebook(path: string, notebook: Notebook): Promise<void> {
  assertValidNotebook(notebook, path);
  await Deno.mkdir(dirname(path), { recursive: true });
  const temporary = join(dirname(path), `.${basename(path)}.${Deno.pid}.tmp`);
  try {
    await Deno.writeTextFile(temporary, JSON.stringify(notebook, null, 1) + "\n");
    await Deno.rename(temporary, path);
  } catch (error) {
    await Deno.remove(temporary).catch(() => {});
    throw error;
  }
}

/**
 * The path of the partial notebook beside `path`: `name.partial.ipynb`.
 *
 * @param path The notebook's path.
 * @returns The partial notebook's path.
 *
 * @example
 * ```ts
 * import { partialPathOf } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * assert.equal(partialPathOf("notebooks/01_lab.ipynb"), "notebooks/01_lab.partial.ipynb");
 * ```
 */
export function partialPathOf(path: string): string {
  return join(dirname(path), `${basename(path, extname(path))}.partial.ipynb`);
}

/** Error names of the error output that says why a run stopped, by the kind of stop. */
export const STOP_ERROR_NAMES: Readonly<
  { timeout: "CellTimeoutError"; aborted: "InterruptedError"; died: "KernelDiedError" }
> = { timeout: "CellTimeoutError", aborted: "InterruptedError", died: "KernelDiedError" };

/**
 * Why a cell timed out, in words.
 *
 * @param seconds The per-cell limit in seconds.
 * @param outputPending Whether the code had finished but its output was still arriving.
 * @returns E.g. "Cell did not finish within 2 s".
 *
 * @example
 * ```ts
 * import { timeoutText } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * assert.equal(
 *   timeoutText(2, true),
 *   "Cell did not finish within 2 s (its output was still arriving)",
 * );
 * ```
 */
export function timeoutText(seconds: number, outputPending = false): string {
  return `Cell did not finish within ${seconds} s${
    outputPending ? " (its output was still arriving)" : ""
  }`;
}

/**
 * Why a run was interrupted, in words, from an abort signal's reason: a signal name or another
 * text is named; anything else (the default `AbortError`) is not.
 *
 * @param reason `AbortSignal.reason`.
 * @returns E.g. "Run interrupted by SIGTERM".
 *
 * @example
 * ```ts
 * import { interruptionText } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const controller = new AbortController();
 * controller.abort("SIGTERM");
 * assert.equal(interruptionText(controller.signal.reason), "Run interrupted by SIGTERM");
 * assert.equal(interruptionText(new DOMException("stop", "AbortError")), "Run interrupted");
 * ```
 */
export function interruptionText(reason: unknown): string {
  return typeof reason === "string" && reason !== ""
    ? `Run interrupted by ${reason}`
    : "Run interrupted";
}

/** Why a run stopped at a cell: the error that goes into the partial notebook. */
export interface StopRecord {
  /** 1-based position of the cell among all cells. */
  cellNumber: number;
  /** Error class name, e.g. "CellTimeoutError". */
  ename: string;
  /** Error message. */
  evalue: string;
}

/**
 * Records in a notebook where and why a run stopped: `metadata.sonorigor_partial` with the cell
 * number and the reason, and, when the cell is a code cell whose outputs do not already end with
 * an error (a kernel error keeps its own traceback), an error output with the traceback
 * "ename: evalue" at the end of its outputs.
 *
 * @param notebook The notebook (changed in place).
 * @param stop The cell and the error.
 * @returns The same notebook.
 *
 * @example
 * ```ts
 * import { markStopped } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const notebook = markStopped({
 *   metadata: {},
 *   nbformat: 4,
 *   nbformat_minor: 5,
 *   cells: [{ id: "a", cell_type: "code", metadata: {}, source: "run()", outputs: [], execution_count: 1 }],
 * }, { cellNumber: 1, ename: "CellTimeoutError", evalue: "Cell did not finish within 2 s" });
 * assert.deepEqual(notebook.metadata.sonorigor_partial, {
 *   failed_cell: 1,
 *   reason: "CellTimeoutError: Cell did not finish within 2 s",
 * });
 * ```
 */
export function markStopped(notebook: Notebook, stop: StopRecord): Notebook {
  const reason = `${stop.ename}: ${stop.evalue}`;
  const cell = notebook.cells[stop.cellNumber - 1];
  if (cell?.cell_type === "code" && cell.outputs.at(-1)?.output_type !== "error") {
    cell.outputs.push({
      output_type: "error",
      ename: stop.ename,
      evalue: stop.evalue,
      traceback: [reason],
    });
  }
  notebook.metadata.sonorigor_partial = { failed_cell: stop.cellNumber, reason };
  return notebook;
}
