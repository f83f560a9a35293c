/**
 * Progress of long Monte Carlo runs, for the `onProgress` option of `propagate` and
 * `propagateInSteps`: a bar on a terminal, an updating display in a notebook, and nothing when
 * the output is neither (piped, CI) or the run ends within a second.
 *
 * @module
 */
import type { MonteCarloProgress } from "../calc/uncertainty/types.ts";
import { formatCount } from "./format.ts";
import { escapeHtml } from "./mime.ts";

/**
 * One line of progress: a bar, the trials done of those planned, the share and the time.
 *
 * @param progress Trials done and planned.
 * @param elapsedMs Time since the run started, ms.
 * @param width Characters of the bar.
 * @returns The line.
 *
 * @example
 * ```ts
 * import { formatMonteCarloProgress } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const line = formatMonteCarloProgress({ trialsDone: 250_000, trialsPlanned: 1_000_000 }, 1500, 8);
 * assert.equal(line, "[##------] 250000 of 1000000 trials · 25 % · 1.5 s");
 * ```
 */
export function formatMonteCarloProgress(
  progress: MonteCarloProgress,
  elapsedMs: number,
  width = 24,
): string {
  const { trialsDone, trialsPlanned } = progress;
  const share = trialsPlanned > 0 ? Math.min(1, trialsDone / trialsPlanned) : 1;
  const filled = Math.round(share * width);
  return `[${"#".repeat(filled)}${"-".repeat(width - filled)}] ${formatCount(trialsDone)} of ${
    formatCount(trialsPlanned)
  } trials · ${Math.floor(share * 100)} % · ${(elapsedMs / 1000).toFixed(1)} s`;
}

/** Options of {@linkcode terminalProgress} and {@linkcode notebookProgress}. */
export interface ProgressOptions {
  /** What runs, shown before the bar. @default "Monte Carlo" */
  readonly label?: string;
  /** Show nothing for runs shorter than this, ms. @default 1000 */
  readonly afterMs?: number;
  /** The clock, ms. @default performance.now */
  readonly now?: () => number;
}

/**
 * A progress callback that draws a bar on standard error when it is a terminal, once the run has
 * taken a second, and ends the line when the run is done; quiet when standard error is not a
 * terminal (piped output, CI).
 *
 * @param options Label, delay, clock; `isTerminal` and `write` replace the terminal check and
 * the writer (for tests and other outputs).
 * @returns The callback for `onProgress`.
 *
 * @example A run seen on a terminal (a fake clock: 0.5 s per block)
 * ```ts
 * import { terminalProgress } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * let t = 0;
 * const written: string[] = [];
 * const report = terminalProgress({ isTerminal: true, write: (s) => written.push(s), now: () => t });
 * for (const done of [1, 2, 3, 4]) {
 *   t += 500;
 *   report({ trialsDone: done * 250_000, trialsPlanned: 1_000_000 });
 * }
 * assert.equal(written.length, 3); // nothing before one second
 * assert.ok(written[2]!.endsWith("1000000 of 1000000 trials · 100 % · 2.0 s\n"));
 * ```
 */
export function terminalProgress(
  options: ProgressOptions & {
    readonly isTerminal?: boolean;
    readonly write?: (text: string) => void;
  } = {},
): (progress: MonteCarloProgress) => void {
  if (!(options.isTerminal ?? Deno.stderr.isTerminal())) return () => {};
  const encoder = new TextEncoder();
  const write = options.write ?? ((text: string) => Deno.stderr.writeSync(encoder.encode(text)));
  return afterDelay(options, (line, progress) => {
    const done = progress.trialsDone >= progress.trialsPlanned;
    write(`\r${line}${done ? "\n" : ""}`);
  });
}

/** A callback that shows the progress line (label, bar, counts, time) with `show`, from the first
 * report made `afterMs` after it was created; `first` is true for the first line shown. */
function afterDelay(
  options: ProgressOptions,
  show: (line: string, progress: MonteCarloProgress, first: boolean) => void,
): (progress: MonteCarloProgress) => void {
  const label = options.label ?? "Monte Carlo";
  const afterMs = options.afterMs ?? 1000;
  const now = options.now ?? (() => performance.now());
  const start = now();
  let shown = false;
  return (progress) => {
    const elapsed = now() - start;
    if (!shown && elapsed < afterMs) return;
    show(`${label}: ${formatMonteCarloProgress(progress, elapsed)}`, progress, !shown);
    shown = true;
  };
}

/** What a notebook progress display sends: a Jupyter message type and its content. */
export type NotebookMessage = (type: string, content: Record<string, unknown>) => unknown;

/**
 * A progress callback that shows a bar in a Jupyter notebook (Deno kernel) once the run has taken
 * a second and updates that one display in place; outside a kernel it does nothing. Pass it to
 * `propagateInSteps`, which gives the kernel a turn between blocks so the updates are sent while
 * the run goes on (a synchronous `propagate` sends them only at its end).
 *
 * @param options Label, delay, clock; `send` replaces the kernel's message channel
 * (`Deno.jupyter.broadcast`), for tests.
 * @returns The callback for `onProgress`.
 *
 * @example Outside a kernel and with a stand-in channel
 * ```ts
 * import { notebookProgress } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const sent: string[] = [];
 * let t = 0;
 * const report = notebookProgress({ send: (type) => sent.push(type), now: () => (t += 600) });
 * report({ trialsDone: 1, trialsPlanned: 3 });
 * report({ trialsDone: 2, trialsPlanned: 3 });
 * report({ trialsDone: 3, trialsPlanned: 3 });
 * assert.deepEqual(sent, ["display_data", "update_display_data"]);
 * ```
 */
export function notebookProgress(
  options: ProgressOptions & { readonly send?: NotebookMessage } = {},
): (progress: MonteCarloProgress) => void {
  const send = options.send ?? kernelChannel();
  if (send === undefined) return () => {};
  const id = `sonorigor-progress-${options.label ?? ""}-${performance.now()}`;
  return afterDelay(options, (text, progress, first) => {
    const html = `<progress value="${progress.trialsDone}" max="${progress.trialsPlanned}">` +
      `</progress> <span>${escapeHtml(text)}</span>`;
    // a display that cannot be sent must not stop the run
    Promise.resolve(send(first ? "display_data" : "update_display_data", {
      data: { "text/plain": text, "text/html": html },
      metadata: {},
      transient: { display_id: id },
    })).catch(() => {});
  });
}

/** The Deno kernel's message channel, or undefined outside `deno jupyter` (where reading
 * `Deno.jupyter` throws). */
function kernelChannel(): NotebookMessage | undefined {
  try {
    const kernel = (Deno as unknown as { jupyter?: { broadcast?: NotebookMessage } }).jupyter;
    return kernel?.broadcast?.bind(kernel);
  } catch {
    return undefined;
  }
}
