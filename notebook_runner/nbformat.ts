/**
 * Notebook documents (nbformat 4.5): types, reading with clear errors, upgrading 4.x to 4.5 (cell
 * ids), strict validation of what the runner writes, and collection of kernel iopub messages
 * into cell outputs.
 *
 * Reference: Jupyter nbformat, "The Notebook file format" and the JSON schema nbformat.v4.5.
 *
 * @module
 */
import { randomUUID } from "node:crypto";
import * as z from "zod";

/** A string stored whole or as a list of lines (each but the last ending in "\n"). */
export type MultilineString = string | string[];

/** A MIME bundle as stored in a notebook: MIME type → content. */
export type MimeData = Record<string, unknown>;

/** `stream` output. */
export interface StreamOutput {
  /** Output type. */
  output_type: "stream";
  /** "stdout" or "stderr". */
  name: string;
  /** The text. */
  text: MultilineString;
}

/** `display_data` output. */
export interface DisplayDataOutput {
  /** Output type. */
  output_type: "display_data";
  /** MIME bundle. */
  data: MimeData;
  /** Metadata per MIME type. */
  metadata: Record<string, unknown>;
}

/** `execute_result` output. */
export interface ExecuteResultOutput {
  /** Output type. */
  output_type: "execute_result";
  /** Execution count of the cell. */
  execution_count: number | null;
  /** MIME bundle. */
  data: MimeData;
  /** Metadata per MIME type. */
  metadata: Record<string, unknown>;
}

/** `error` output. */
export interface ErrorOutput {
  /** Output type. */
  output_type: "error";
  /** Error class name. */
  ename: string;
  /** Error message. */
  evalue: string;
  /** Traceback lines (may contain ANSI colour codes). */
  traceback: string[];
}

/** One output of a code cell. */
export type Output = StreamOutput | DisplayDataOutput | ExecuteResultOutput | ErrorOutput;

/** A code cell. */
export interface CodeCell {
  /** Cell id (nbformat 4.5). */
  id: string;
  /** Cell type. */
  cell_type: "code";
  /** Cell metadata. */
  metadata: Record<string, unknown>;
  /** Source code. */
  source: MultilineString;
  /** Outputs from the last execution. */
  outputs: Output[];
  /** Execution count, null when not executed. */
  execution_count: number | null;
}

/** A Markdown cell. */
export interface MarkdownCell {
  /** Cell id. */
  id: string;
  /** Cell type. */
  cell_type: "markdown";
  /** Cell metadata. */
  metadata: Record<string, unknown>;
  /** Markdown source. */
  source: MultilineString;
  /** Attachments (name → MIME bundle). */
  attachments?: Record<string, MimeData>;
}

/** A raw cell. */
export interface RawCell {
  /** Cell id. */
  id: string;
  /** Cell type. */
  cell_type: "raw";
  /** Cell metadata. */
  metadata: Record<string, unknown>;
  /** Raw source. */
  source: MultilineString;
  /** Attachments. */
  attachments?: Record<string, MimeData>;
}

/** Any cell. */
export type Cell = CodeCell | MarkdownCell | RawCell;

/** A notebook document, nbformat 4.5. */
export interface Notebook {
  /** Notebook metadata (kernelspec, language_info, …). */
  metadata: {
    kernelspec?: { name: string; display_name: string; language?: string };
    language_info?: { name: string; [key: string]: unknown };
    [key: string]: unknown;
  };
  /** Major format version (4). */
  nbformat: 4;
  /** Minor format version (5 or more once ids exist). */
  nbformat_minor: number;
  /** The cells. */
  cells: Cell[];
}

/** Bad notebook input: missing file, invalid JSON, wrong structure or a non-Deno kernel. */
export class NotebookInputError extends Error {
  /** Creates the error. */
  constructor(message: string, options?: ErrorOptions) {
    super(message, options);
    this.name = "NotebookInputError";
  }
}

const multiline = z.union([z.string(), z.array(z.string())]);
const record = z.record(z.string(), z.unknown());
const cellId = z.string().regex(/^[a-zA-Z0-9-_]+$/).min(1).max(64);
const mimeBundle = z.record(
  z.string().regex(/^[^/\s]+\/[^/\s]+$/, "expected a MIME type key"),
  z.unknown(),
);

const outputSchema = z.discriminatedUnion("output_type", [
  z.strictObject({ output_type: z.literal("stream"), name: z.string(), text: multiline }),
  z.strictObject({ output_type: z.literal("display_data"), data: mimeBundle, metadata: record }),
  z.strictObject({
    output_type: z.literal("execute_result"),
    execution_count: z.number().int().min(0).nullable(),
    data: mimeBundle,
    metadata: record,
  }),
  z.strictObject({
    output_type: z.literal("error"),
    ename: z.string(),
    evalue: z.string(),
    traceback: z.array(z.string()),
  }),
]);

const cellSchema = z.discriminatedUnion("cell_type", [
  z.strictObject({
    id: cellId,
    cell_type: z.literal("code"),
    metadata: record,
    source: multiline,
    outputs: z.array(outputSchema),
    execution_count: z.number().int().min(0).nullable(),
  }),
  z.strictObject({
    id: cellId,
    cell_type: z.literal("markdown"),
    metadata: record,
    source: multiline,
    attachments: z.record(z.string(), mimeBundle).optional(),
  }),
  z.strictObject({
    id: cellId,
    cell_type: z.literal("raw"),
    metadata: record,
    source: multiline,
    attachments: z.record(z.string(), mimeBundle).optional(),
  }),
]);

const notebookSchema = z.strictObject({
  metadata: z.looseObject({
    kernelspec: z.looseObject({ name: z.string(), display_name: z.string() }).optional(),
    language_info: z.looseObject({ name: z.string() }).optional(),
  }),
  nbformat: z.literal(4),
  nbformat_minor: z.number().int().min(5),
  cells: z.array(cellSchema),
});

/**
 * Validates a notebook against the nbformat 4.5 structure (cell ids, cell and output shapes,
 * unique ids). Used on everything the runner writes.
 *
 * @param notebook The notebook to check.
 * @returns The list of problems, each "path: message"; empty when valid.
 */
export function notebookProblems(notebook: unknown): string[] {
  const result = notebookSchema.safeParse(notebook);
  const problems = result.success
    ? []
    : result.error.issues.map((issue) =>
      `${issue.path.length === 0 ? "(root)" : issue.path.join(".")}: ${issue.message}`
    );
  if (result.success) {
    const seen = new Set<string>();
    result.data.cells.forEach((cell, i) => {
      if (seen.has(cell.id)) problems.push(`cells.${i}.id: duplicate cell id '${cell.id}'`);
      seen.add(cell.id);
    });
  }
  return problems;
}

/**
 * Throws when the notebook is not valid nbformat 4.5.
 *
 * @param notebook The notebook to check.
 * @param label Where it came from (for the message).
 * @throws {TypeError} Listing up to five problems.
 */
export function assertValidNotebook(
  notebook: unknown,
  label: string,
): asserts notebook is Notebook {
  const problems = notebookProblems(notebook);
  if (problems.length > 0) {
    throw new TypeError(
      `${label}: not valid nbformat 4.5: ${problems.slice(0, 5).join("; ")}${
        problems.length > 5 ? ` (and ${problems.length - 5} more)` : ""
      }`,
    );
  }
}

/**
 * Joins a multiline string.
 *
 * @param text A string or list of lines.
 * @returns The text.
 */
export function joinText(text: MultilineString | unknown): string {
  if (Array.isArray(text)) return text.join("");
  return typeof text === "string" ? text : "";
}

/**
 * Splits text into lines that keep their "\n", as Jupyter stores sources and text outputs.
 *
 * @param text The text.
 * @returns The lines (empty list for empty text).
 */
export function splitLines(text: string): string[] {
  return text === "" ? [] : text.split(/(?<=\n)/);
}

/** Whether a MIME type's content is stored as lines (text-like, not JSON, not base64). */
function storedAsLines(mime: string): boolean {
  return mime.startsWith("text/") || mime === "image/svg+xml" ||
    mime === "application/javascript";
}

/**
 * Converts a kernel MIME bundle to the stored form: text-like values split into lines.
 *
 * @param data The bundle from the kernel.
 * @returns The bundle to store.
 */
export function storedMimeData(data: Record<string, unknown>): MimeData {
  const out: MimeData = {};
  for (const [mime, value] of Object.entries(data)) {
    out[mime] = typeof value === "string" && storedAsLines(mime) ? splitLines(value) : value;
  }
  return out;
}

/**
 * Parses notebook JSON text, upgrading nbformat 4.0–4.4 to 4.5 (adds cell ids) and normalizing
 * missing optional members, with clear errors for input that is not a notebook.
 *
 * @param text The file content.
 * @param label The path (for messages).
 * @returns The notebook.
 * @throws {NotebookInputError} On invalid JSON, a non-v4 notebook or a wrong structure.
 */
export function parseNotebook(text: string, label: string): Notebook {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (error) {
    throw new NotebookInputError(
      `Notebook ${label}: invalid JSON: ${(error as Error).message}`,
      { cause: error },
    );
  }
  if (typeof raw !== "object" || raw === null || Array.isArray(raw)) {
    throw new NotebookInputError(
      `Notebook ${label}: expected a JSON object, got ${
        Array.isArray(raw) ? "an array" : JSON.stringify(raw)
      }`,
    );
  }
  const nb = raw as Record<string, unknown>;
  if (nb.nbformat !== 4) {
    throw new NotebookInputError(
      `Notebook ${label}: expected 'nbformat' 4, got ${JSON.stringify(nb.nbformat)}`,
    );
  }
  if (!Array.isArray(nb.cells)) {
    throw new NotebookInputError(
      `Notebook ${label}: expected 'cells' to be an array, got ${JSON.stringify(nb.cells)}`,
    );
  }
  const used = new Set<string>();
  const cells = nb.cells.map((c, i) => {
    if (typeof c !== "object" || c === null) {
      throw new NotebookInputError(`Notebook ${label}: cell ${i + 1} is not an object`);
    }
    const cell = { ...(c as Record<string, unknown>) };
    if (!["code", "markdown", "raw"].includes(cell.cell_type as string)) {
      throw new NotebookInputError(
        `Notebook ${label}: cell ${i + 1}: expected 'cell_type' code, markdown or raw, got ${
          JSON.stringify(cell.cell_type)
        }`,
      );
    }
    let id = typeof cell.id === "string" && /^[a-zA-Z0-9-_]{1,64}$/.test(cell.id) ? cell.id : "";
    if (id === "" || used.has(id)) id = randomUUID().replaceAll("-", "").slice(0, 16);
    used.add(id);
    cell.id = id;
    cell.metadata ??= {};
    cell.source ??= "";
    if (cell.cell_type === "code") {
      cell.outputs ??= [];
      cell.execution_count ??= null;
    }
    return cell;
  });
  const metadata = typeof nb.metadata === "object" && nb.metadata !== null ? nb.metadata : {};
  const notebook = {
    metadata,
    nbformat: 4,
    nbformat_minor: Math.max(5, typeof nb.nbformat_minor === "number" ? nb.nbformat_minor : 5),
    cells,
  };
  const problems = notebookProblems(notebook);
  if (problems.length > 0) {
    throw new NotebookInputError(
      `Notebook ${label}: not a valid notebook: ${problems.slice(0, 5).join("; ")}`,
    );
  }
  return notebook as unknown as Notebook;
}

/**
 * Checks that a notebook is meant for the Deno kernel: its kernelspec names Deno (or it has no
 * kernelspec, in which case it is run with Deno anyway).
 *
 * @param notebook The notebook.
 * @param label The path (for messages).
 * @returns Whether a kernelspec was present.
 * @throws {NotebookInputError} When the kernelspec names another kernel.
 */
export function checkDenoKernelspec(notebook: Notebook, label: string): boolean {
  const spec = notebook.metadata.kernelspec;
  if (spec === undefined) return false;
  if (/deno/i.test(spec.name) || /deno/i.test(spec.display_name)) return true;
  throw new NotebookInputError(
    `Notebook ${label}: expected a Deno kernelspec (name 'deno'), got '${spec.name}' (${spec.display_name})`,
  );
}

/**
 * Appends text to stored lines in place: the text continues the last line when that line has no
 * "\n" yet, and each further line is pushed. Work is proportional to the text and the open last
 * line, never to the lines before it.
 *
 * @param lines Lines as {@linkcode splitLines} makes them (changed in place).
 * @param text The text to append.
 * @returns The same array.
 *
 * @example
 * ```ts
 * import { appendLines } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const lines = ["done\n", "progress 4"];
 * assert.deepEqual(appendLines(lines, "0%\nnext\n"), ["done\n", "progress 40%\n", "next\n"]);
 * ```
 */
export function appendLines(lines: string[], text: string): string[] {
  if (text === "") return lines;
  const open = lines.length > 0 && !lines[lines.length - 1]!.endsWith("\n");
  for (const line of splitLines(open ? lines.pop() + text : text)) lines.push(line);
  return lines;
}

/**
 * Collects the iopub messages of one execution into nbformat outputs the way Jupyter front ends
 * do: consecutive stream text of the same name is merged, `clear_output` (with `wait`) and
 * `update_display_data` are honoured. Carriage returns are stored as sent (no terminal
 * overwriting).
 *
 * Stream text is accumulated in linear time: a message only appends its text to a list of
 * chunks, and the chunks become stored lines (joined once, split once) when the outputs are
 * read, so an output flood of N lines costs O(N), not O(N²).
 *
 * @example Two stdout messages merge; a line cut between messages is joined
 * ```ts
 * import { OutputCollector } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const collector = new OutputCollector();
 * collector.handle("stream", { name: "stdout", text: "peak vel" });
 * collector.handle("stream", { name: "stdout", text: "ocity 2.5 m/s\ndone\n" });
 * assert.deepEqual(collector.outputs, [
 *   { output_type: "stream", name: "stdout", text: ["peak velocity 2.5 m/s\n", "done\n"] },
 * ]);
 * ```
 */
export class OutputCollector {
  readonly #outputs: Output[] = [];
  /** Stream outputs with text not yet turned into lines, and that text's chunks. */
  readonly #pending = new Map<StreamOutput, string[]>();
  #clearOnNext = false;
  /** display_id → outputs (in any cell of the run) showing it; shared across collectors. */
  readonly #displays: Map<string, DisplayDataOutput[]>;

  /**
   * Creates a collector for one cell.
   *
   * @param displays The run-wide display-id registry (share one map across the cells of a run).
   */
  constructor(displays: Map<string, DisplayDataOutput[]> = new Map()) {
    this.#displays = displays;
  }

  /**
   * The outputs collected so far, with all stream text stored as lines (see
   * {@linkcode OutputCollector.flush}). The same array every time.
   */
  get outputs(): Output[] {
    return this.flush();
  }

  /**
   * Turns the pending stream chunks into stored lines (each chunk list joined once and appended
   * with {@linkcode appendLines}). Call it before the outputs are written or compared.
   *
   * @returns The outputs.
   */
  flush(): Output[] {
    for (const [output, chunks] of this.#pending) {
      appendLines(output.text as string[], chunks.join(""));
    }
    this.#pending.clear();
    return this.#outputs;
  }

  #clear(): void {
    this.#outputs.length = 0;
    this.#pending.clear();
  }

  #add(output: Output): void {
    if (this.#clearOnNext) {
      this.#clear();
      this.#clearOnNext = false;
    }
    this.#outputs.push(output);
  }

  /** Queues stream text for an output (its lines are made in {@linkcode OutputCollector.flush}). */
  #append(output: StreamOutput, text: string): void {
    const chunks = this.#pending.get(output);
    if (chunks === undefined) this.#pending.set(output, [text]);
    else chunks.push(text);
  }

  /**
   * Handles one iopub message.
   *
   * @param msgType The message type.
   * @param content The message content.
   */
  handle(msgType: string, content: Record<string, unknown>): void {
    const data = (content.data ?? {}) as Record<string, unknown>;
    const metadata = (content.metadata ?? {}) as Record<string, unknown>;
    const transient = (content.transient ?? {}) as Record<string, unknown>;
    const outputs = this.#outputs;
    switch (msgType) {
      case "stream": {
        const name = String(content.name ?? "stdout");
        const text = String(content.text ?? "");
        // An error ends the cell, so console output that arrives after it was written before it:
        // the Deno kernel forwards console output asynchronously and it can trail the error.
        const tail = outputs[outputs.length - 1];
        const at = tail?.output_type === "error" && !this.#clearOnNext
          ? outputs.length - 1
          : outputs.length;
        const last = outputs[at - 1];
        if (!this.#clearOnNext && last?.output_type === "stream" && last.name === name) {
          this.#append(last, text);
          break;
        }
        const output: StreamOutput = { output_type: "stream", name, text: [] };
        if (at < outputs.length) outputs.splice(at, 0, output);
        else this.#add(output);
        this.#append(output, text);
        break;
      }
      case "display_data": {
        const output: DisplayDataOutput = {
          output_type: "display_data",
          data: storedMimeData(data),
          metadata,
        };
        this.#add(output);
        if (typeof transient.display_id === "string") {
          const list = this.#displays.get(transient.display_id) ?? [];
          list.push(output);
          this.#displays.set(transient.display_id, list);
        }
        break;
      }
      case "update_display_data": {
        if (typeof transient.display_id !== "string") break;
        for (const output of this.#displays.get(transient.display_id) ?? []) {
          output.data = storedMimeData(data);
          output.metadata = metadata;
        }
        break;
      }
      case "execute_result": {
        const count = content.execution_count;
        this.#add({
          output_type: "execute_result",
          execution_count: typeof count === "number" ? count : null,
          data: storedMimeData(data),
          metadata,
        });
        break;
      }
      case "error":
        this.#add({
          output_type: "error",
          ename: String(content.ename ?? "Error"),
          evalue: String(content.evalue ?? ""),
          traceback: Array.isArray(content.traceback) ? content.traceback.map(String) : [],
        });
        break;
      case "clear_output":
        if (content.wait === true) this.#clearOnNext = true;
        else this.#clear();
        break;
      default:
        break; // status, execute_input, comm messages: not outputs
    }
  }
}
