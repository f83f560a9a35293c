/**
 * Child-process entry of the runner: runs ONE notebook in process and reports to the parent as
 * JSON lines on stdout (`{"type":"log"}`, `{"type":"kernel"}`, `{"type":"result"}`), then exits
 * without closing its ZeroMQ sockets (process exit frees them; see `closeSockets` in kernel.ts).
 * It also reports each code cell's start and end (`{"type":"cell"}`), so the parent can bound a
 * cell even should this process stall. SIGINT/SIGTERM abort the run cleanly (kernel interrupted
 * and killed, partial notebook written, the signal named in its error output), and so does the
 * end of stdin: the parent holds the other end of that pipe, so if the parent dies, even by
 * SIGKILL, the child notices and stops the kernel instead of leaving it behind.
 *
 * Usage (by `runNotebook` in isolation.ts only): `deno run -A child.ts '<json {path, options}>'`.
 *
 * @module
 */
import { type CodeCellPosition, runNotebookInProcess, type RunOptions } from "./runner.ts";

/** What the parent passes: the notebook path and the serializable options. */
export interface ChildRequest {
  /** The notebook path. */
  path: string;
  /** Options without callbacks or signals. */
  options: Omit<RunOptions, "signal" | "log" | "onKernelStarted" | "onCell">;
}

/** One line the child writes on stdout. */
export type ChildEvent =
  | { type: "log"; line: string }
  | { type: "kernel"; pid: number; connectionFolder: string }
  | { type: "cell"; number: number; state: "started" | "ended"; position: CodeCellPosition }
  | { type: "result"; result: unknown };

const encoder = new TextEncoder();

let parentGone = false;

function emit(event: ChildEvent): void {
  if (parentGone) return;
  const bytes = encoder.encode(JSON.stringify(event) + "\n");
  try {
    let written = 0;
    while (written < bytes.length) written += Deno.stdout.writeSync(bytes.subarray(written));
  } catch {
    parentGone = true; // nobody reads any more: finish the cleanup (and the partial) silently
  }
}

if (import.meta.main) {
  const request = JSON.parse(Deno.args[0] ?? "{}") as ChildRequest;
  const controller = new AbortController();
  // the reason names the cause in the partial notebook's error output ("Run interrupted by …")
  for (const name of ["SIGINT", "SIGTERM"] as const) {
    Deno.addSignalListener(name, () => controller.abort(name));
  }
  (async () => {
    try {
      for await (const _ of Deno.stdin.readable) {
        // the parent never writes; only the end of the stream matters
      }
    } catch {
      // a read error means the same: the parent is gone
    }
    controller.abort("the exit of the runner process");
  })();
  const result = await runNotebookInProcess(request.path, {
    ...request.options,
    signal: controller.signal,
    log: (line) => emit({ type: "log", line }),
    onKernelStarted: (pid, connectionFolder) => emit({ type: "kernel", pid, connectionFolder }),
    onCell: (number, state, position) => emit({ type: "cell", number, state, position }),
  }, false);
  emit({ type: "result", result });
  Deno.exit(0);
}
