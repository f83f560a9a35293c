/**
 * Shared helpers of the notebook-runner tests: the fixture folder, temporary copies of fixtures,
 * and whether this test process may start the real kernel.
 *
 * @module
 */
import { fileURLToPath } from "node:url";
import { canRunKernel } from "../testing.ts";

/** The runner package's folder (absolute, no trailing slash). */
export const PACKAGE: string = fileURLToPath(new URL("../", import.meta.url)).replace(/\/$/, "");

/** The folder of the fixture notebooks. */
export const FIXTURES: string = `${PACKAGE}/tests/fixtures`;

/** Whether the real-kernel tests run here (they are ignored, visibly, without the permissions). */
export const CAN_RUN_KERNEL: boolean = canRunKernel();

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
