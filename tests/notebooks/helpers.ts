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

/** Runs `kill -0` (no signal, only the existence check) through sh; true when it succeeds. */
function kill0(target: string): boolean {
  // /proc needs --allow-all under Deno; spawning sh only needs --allow-run, as the task grants.
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
 * @param pid Process id.
 * @returns True when it exists.
 */
export function processExists(pid: number): boolean {
  if (!(Number.isInteger(pid) && pid > 1)) throw new RangeError(`processExists: bad pid ${pid}`);
  return kill0(String(pid));
}

/**
 * Whether any process is left in the process group `pgid` (the runner starts the kernel as a
 * group leader, so its pid is the group id; anything a notebook started belongs to it too).
 *
 * @param pgid Process group id.
 * @returns True when the group still has a member.
 */
export function processGroupAlive(pgid: number): boolean {
  if (!(Number.isInteger(pgid) && pgid > 1)) {
    throw new RangeError(`processGroupAlive: bad pgid ${pgid}`);
  }
  return kill0(`-${pgid}`); // dash: "kill -0 -PGID" targets the group
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
