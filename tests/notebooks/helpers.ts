/**
 * Shared helpers of the notebook-runner tests: paths, process checks through /proc, and whether
 * this test process may start the real kernel.
 *
 * @module
 */
import { fileURLToPath } from "node:url";

/** The repository root (absolute, no trailing slash). */
export const ROOT: string = fileURLToPath(new URL("../../", import.meta.url)).replace(/\/$/, "");

/** The folder of the fixture notebooks. */
export const FIXTURES: string = `${ROOT}/tests/fixtures/notebooks`;

/**
 * Whether the permissions needed to run the real kernel were granted (spawn, loopback network,
 * the zeromq native addon, files). Tests that need the kernel are ignored, visibly, without them.
 */
export const CAN_RUN_KERNEL: boolean = (
  [
    { name: "run" },
    { name: "net", host: "127.0.0.1" },
    { name: "ffi" },
    { name: "read" },
    { name: "write" },
    { name: "env" },
  ] as Deno.PermissionDescriptor[]
).every((p) => Deno.permissions.querySync(p).state === "granted");

if (!CAN_RUN_KERNEL) {
  console.error(
    "notebook tests: the real-kernel tests are IGNORED: they need --allow-run --allow-net=127.0.0.1 " +
      "--allow-ffi --allow-read --allow-write --allow-env (as `deno task test` grants)",
  );
}

/**
 * Whether a process with this pid exists (a zombie counts as existing).
 *
 * @param pid Process id.
 * @returns True when /proc has it.
 */
export function processExists(pid: number): boolean {
  try {
    Deno.statSync(`/proc/${pid}`);
    return true;
  } catch {
    return false;
  }
}

/**
 * The pids of all processes whose process group is `pgid`.
 *
 * @param pgid Process group id (the kernel's pid: the runner starts it as a group leader).
 * @returns The member pids.
 */
export function processGroupMembers(pgid: number): number[] {
  const members: number[] = [];
  for (const entry of Deno.readDirSync("/proc")) {
    if (!/^\d+$/.test(entry.name)) continue;
    try {
      const stat = Deno.readTextFileSync(`/proc/${entry.name}/stat`);
      // fields after the ") " that closes the command name: state ppid pgrp ...
      const fields = stat.slice(stat.lastIndexOf(") ") + 2).split(" ");
      if (Number(fields[2]) === pgid) members.push(Number(entry.name));
    } catch {
      // the process ended while scanning
    }
  }
  return members;
}

/**
 * Copies fixture notebooks into a fresh temporary folder, so partial notebooks written beside
 * them never land in the repository.
 *
 * @param names Fixture file names.
 * @returns The temporary folder.
 */
export async function copyFixtures(...names: string[]): Promise<string> {
  const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-test-" });
  for (const name of names) await Deno.copyFile(`${FIXTURES}/${name}`, `${dir}/${name}`);
  return dir;
}

/**
 * Reads a JSON file.
 *
 * @param path The file.
 * @returns The parsed value.
 */
export function readJson(path: string): unknown {
  return JSON.parse(Deno.readTextFileSync(path));
}
