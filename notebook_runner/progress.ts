/**
 * Progress of a notebook run on a terminal: one line at the bottom, redrawn in place, with a bar
 * of the code cells done, the notebook's place in the run, its name and the time so far. Log
 * lines are printed above it. When the output is not a terminal (a pipe, a file, CI), nothing
 * of the bar is written: no carriage returns, no escape codes, only the log lines.
 *
 * @module
 */

/** Where a run is, as {@linkcode formatProgress} shows it. */
export interface ProgressState {
  /** The notebook being run (a path or a name). */
  label: string;
  /** Code cells finished (0 before the first). */
  done: number;
  /** Code cells in the notebook. */
  total: number;
  /** Milliseconds since the notebook started. */
  elapsedMs: number;
  /** This notebook's place in the run (1-based) and the number of notebooks, when several. */
  notebook?: { readonly index: number; readonly count: number };
}

/** Options of {@linkcode createProgress}. */
export interface ProgressOptions {
  /** Whether the output is a terminal; the bar is drawn only then (default: stderr's). */
  isTerminal?: boolean;
  /** Writes text (default: to stderr, synchronously). */
  write?: (text: string) => void;
  /** Width of the terminal in columns (default: the console's when it says, else 80). */
  columns?: number;
}

/** The progress display of a run (see {@linkcode createProgress}). */
export interface Progress {
  /** Whether the bar is drawn (the output is a terminal). */
  readonly drawn: boolean;
  /** Shows a new state: redraws the bar on a terminal, nothing otherwise. */
  update(state: ProgressState): void;
  /** Prints a log line: above the bar on a terminal, as it is otherwise. */
  line(text: string): void;
  /** Removes the bar (on a terminal); later lines print as they are. */
  finish(): void;
}

const ESCAPE = "\x1b[";
/** Carriage return and "erase the whole line" (ECMA-48 EL, parameter 2). */
const CLEAR_LINE = `\r${ESCAPE}2K`;

/**
 * One progress line: `[#####-----] 3/7 code cells · notebook 2 of 5 · name.ipynb · 12 s`, cut
 * to the given width (the name is shortened from its start, so its end stays readable).
 *
 * @param state Cells done and in total, the notebook, its place in the run, the time so far.
 * @param columns The width available, in characters (at least 20).
 * @returns The line, without a newline or any control character.
 * @throws {RangeError} When `done` is not in [0, total] or `columns` is below 20.
 *
 * @example
 * ```ts
 * import { formatProgress } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const line = formatProgress(
 *   { label: "notebooks/02_cohort.ipynb", done: 3, total: 6, elapsedMs: 12_400, notebook: { index: 2, count: 5 } },
 *   100,
 * );
 * assert.equal(line, "[##########----------] 3/6 code cells · notebook 2 of 5 · notebooks/02_cohort.ipynb · 12 s");
 * ```
 */
export function formatProgress(state: ProgressState, columns: number): string {
  const { done, total } = state;
  if (
    !(Number.isInteger(total) && total >= 0 && Number.isInteger(done) && done >= 0 &&
      done <= total)
  ) {
    throw new RangeError(
      `Expected 'done' cells in [0, ${total}] (an integer), got ${done}`,
    );
  }
  if (!(columns >= 20)) throw new RangeError(`Expected 'columns' in [20, ∞), got ${columns}`);
  const width = Math.min(20, Math.max(5, Math.floor(columns / 5)));
  const filled = total === 0 ? width : Math.round((done / total) * width);
  const bar = `[${"#".repeat(filled)}${"-".repeat(width - filled)}]`;
  const seconds = `${Math.floor(state.elapsedMs / 1000)} s`;
  const place = state.notebook !== undefined && state.notebook.count > 1
    ? ` · notebook ${state.notebook.index} of ${state.notebook.count}`
    : "";
  const head = `${bar} ${done}/${total} code cells${place} · `;
  const tail = ` · ${seconds}`;
  const room = columns - 1 - head.length - tail.length; // the last column stays free: no wrap
  const label = state.label.length <= room
    ? state.label
    : room >= 2
    ? `…${state.label.slice(state.label.length - room + 1)}`
    : "";
  return `${head}${label}${tail}`.slice(0, columns - 1);
}

/**
 * The progress display of a notebook run: a bar redrawn in place on a terminal, quiet
 * otherwise (log lines only, so piped output and CI logs hold no control characters).
 *
 * @param options Whether the output is a terminal, where to write, the width.
 * @returns The display.
 *
 * @example Quiet when the output is not a terminal
 * ```ts
 * import { createProgress } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * let written = "";
 * const progress = createProgress({ isTerminal: false, write: (t) => written += t });
 * progress.update({ label: "a.ipynb", done: 1, total: 4, elapsedMs: 900 });
 * progress.line("a.ipynb [cell 1/4, code 1/2] ok in 0.90 s");
 * progress.finish();
 * assert.equal(written, "a.ipynb [cell 1/4, code 1/2] ok in 0.90 s\n");
 * ```
 *
 * @example On a terminal: the bar is redrawn below the log lines
 * ```ts
 * import { createProgress } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * let written = "";
 * const progress = createProgress({ isTerminal: true, columns: 80, write: (t) => written += t });
 * progress.update({ label: "a.ipynb", done: 1, total: 4, elapsedMs: 900 });
 * progress.line("done");
 * progress.finish();
 * const bar = "[####------------] 1/4 code cells · a.ipynb · 0 s";
 * const clear = "\r\x1b[2K";
 * assert.equal(written, `${clear}${bar}${clear}done\n${bar}${clear}`);
 * ```
 */
export function createProgress(options: ProgressOptions = {}): Progress {
  const drawn = options.isTerminal ?? Deno.stderr.isTerminal();
  const encoder = new TextEncoder();
  const write = options.write ?? ((text: string) => {
    const bytes = encoder.encode(text);
    for (let at = 0; at < bytes.length;) at += Deno.stderr.writeSync(bytes.subarray(at));
  });
  const columns = () => {
    if (options.columns !== undefined) return options.columns;
    try {
      const width = Deno.consoleSize().columns; // 0 where the terminal does not say
      return width > 0 ? Math.max(20, width) : 80;
    } catch {
      return 80;
    }
  };
  let shown = ""; // the bar on screen ("" when none)
  return {
    drawn,
    update(state) {
      if (!drawn) return;
      shown = formatProgress(state, columns());
      write(`${CLEAR_LINE}${shown}`);
    },
    line(text) {
      if (!drawn || shown === "") write(`${text}\n`);
      else write(`${CLEAR_LINE}${text}\n${shown}`);
    },
    finish() {
      if (drawn && shown !== "") write(CLEAR_LINE);
      shown = "";
    },
  };
}
