/**
 * Checks for tests that run notebooks on the real kernel: whether this process was granted the
 * permissions the kernel needs, and whether a kernel (or anything it started) is still alive
 * after a run.
 *
 * @module
 */

const KERNEL_PERMISSIONS: readonly Deno.PermissionDescriptor[] = [
  { name: "run" },
  { name: "net", host: "127.0.0.1" },
  { name: "ffi" },
  { name: "read" },
  { name: "write" },
  { name: "env" },
];

let warned = false;

/**
 * Whether this process may start the real kernel: spawning processes, the loopback network, the
 * zeromq native addon (FFI), files and environment. When it may not, one line on stderr says that
 * the real-kernel tests are ignored and which flags they need, so the skip is visible.
 *
 * @returns True when every permission is granted.
 *
 * @example Without FFI (the zeromq addon) the kernel cannot be reached
 * ```ts
 * import { canRunKernel } from "@sonorigor/notebook-runner/testing";
 * import assert from "node:assert/strict";
 * await Deno.permissions.revoke({ name: "ffi" });
 * assert.equal(canRunKernel(), false);
 * ```
 */
export function canRunKernel(): boolean {
  const granted = KERNEL_PERMISSIONS.every((p) =>
    Deno.permissions.querySync(p).state === "granted"
  );
  if (!granted && !warned) {
    warned = true;
    console.error(
      "notebook tests: the real-kernel tests are IGNORED: they need --allow-run " +
        "--allow-net=127.0.0.1 --allow-ffi --allow-read --allow-write --allow-env (or -A)",
    );
  }
  return granted;
}

/** Runs `kill -0` (no signal, only the existence check) through sh; true when it succeeds. */
function kill0(target: string): boolean {
  // /proc needs --allow-all under Deno; spawning sh only needs --allow-run.
  const out = new Deno.Command("sh", {
    args: ["-c", `kill -0 ${target} 2>/dev/null`],
    stdout: "null",
    stderr: "null",
  }).outputSync();
  return out.success;
}

/**
 * Whether a process with this pid exists (a zombie not yet reaped counts as existing).
 *
 * @param pid Process id, an integer above 1.
 * @returns True when it exists.
 * @throws {RangeError} When `pid` is not an integer above 1.
 *
 * @example
 * ```ts
 * import { processExists } from "@sonorigor/notebook-runner/testing";
 * import assert from "node:assert/strict";
 * assert.equal(processExists(Deno.pid), true);
 * assert.throws(() => processExists(0), /Expected a process id above 1, got 0/);
 * ```
 */
export function processExists(pid: number): boolean {
  if (!(Number.isInteger(pid) && pid > 1)) {
    throw new RangeError(`Expected a process id above 1, got ${pid}`);
  }
  return kill0(String(pid));
}

/**
 * Whether any process is left in the process group `pgid` (the runner starts the kernel as a
 * group leader, so its pid is the group id; anything a notebook started belongs to it too).
 *
 * @param pgid Process group id, an integer above 1.
 * @returns True when the group still has a member.
 * @throws {RangeError} When `pgid` is not an integer above 1.
 *
 * @example
 * ```ts
 * import { processGroupAlive } from "@sonorigor/notebook-runner/testing";
 * import assert from "node:assert/strict";
 * const child = new Deno.Command("sleep", { args: ["0"] }).spawn();
 * await child.status;
 * assert.equal(processGroupAlive(child.pid), false); // the child led no group
 * ```
 */
export function processGroupAlive(pgid: number): boolean {
  if (!(Number.isInteger(pgid) && pgid > 1)) {
    throw new RangeError(`Expected a process group id above 1, got ${pgid}`);
  }
  return kill0(`-${pgid}`); // dash: "kill -0 -PGID" targets the group
}

/** A process found by {@linkcode childProcesses}. */
export interface ProcessEntry {
  /** Process id. */
  pid: number;
  /** Its command line as `ps` shows it. */
  command: string;
}

/**
 * The live child processes of a process (e.g. the notebook client a runner started), from `ps`.
 *
 * @param pid Parent process id, an integer above 1.
 * @returns Each child's pid and command line (empty when it has none).
 * @throws {RangeError} When `pid` is not an integer above 1.
 *
 * @example
 * ```ts
 * import { childProcesses } from "@sonorigor/notebook-runner/testing";
 * import assert from "node:assert/strict";
 * const sleeper = new Deno.Command("sleep", { args: ["5"] }).spawn();
 * assert.ok(childProcesses(Deno.pid).some((c) => c.pid === sleeper.pid));
 * sleeper.kill("SIGKILL");
 * await sleeper.status;
 * assert.ok(!childProcesses(Deno.pid).some((c) => c.pid === sleeper.pid));
 * ```
 */
export function childProcesses(pid: number): ProcessEntry[] {
  if (!(Number.isInteger(pid) && pid > 1)) {
    throw new RangeError(`Expected a process id above 1, got ${pid}`);
  }
  const out = new Deno.Command("ps", {
    args: ["-o", "pid=,stat=,args=", "--ppid", String(pid)],
    stdout: "piped",
    stderr: "null",
  }).outputSync();
  const entries: ProcessEntry[] = [];
  for (const line of new TextDecoder().decode(out.stdout).split("\n")) {
    const match = /^\s*(\d+)\s+(\S+)\s+(.*)$/.exec(line);
    // a zombie (state Z) has ended and only waits for its parent to collect the status
    if (match !== null && !match[2]!.startsWith("Z")) {
      entries.push({ pid: Number(match[1]), command: match[3]! });
    }
  }
  return entries;
}
