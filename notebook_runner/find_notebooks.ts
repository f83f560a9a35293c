/**
 * Lists the notebooks of a project's folders.
 *
 * @module
 */

/**
 * Lists the notebooks in the given folders: every `*.ipynb` file directly inside each folder,
 * except the `*.partial.ipynb` copies a failed run leaves, sorted. A folder that does not exist
 * contributes nothing.
 *
 * @param folders Folders to scan.
 * @returns Paths such as "notebooks/01_x.ipynb" (each folder as given, then the file name).
 * @throws {Deno.errors.PermissionDenied} When a folder may not be read.
 *
 * @example
 * ```ts
 * import { findNotebooks } from "@sonorigor/notebook-runner";
 * import assert from "node:assert/strict";
 * const dir = await Deno.makeTempDir();
 * for (const name of ["b.ipynb", "a.ipynb", "a.partial.ipynb", "notes.md"]) {
 *   await Deno.writeTextFile(`${dir}/${name}`, "{}");
 * }
 * assert.deepEqual(await findNotebooks([dir, `${dir}/missing`]), [`${dir}/a.ipynb`, `${dir}/b.ipynb`]);
 * await Deno.remove(dir, { recursive: true });
 * ```
 */
export async function findNotebooks(folders: readonly string[]): Promise<string[]> {
  const found: string[] = [];
  for (const folder of folders) {
    try {
      for await (const entry of Deno.readDir(folder)) {
        if (
          entry.isFile && entry.name.endsWith(".ipynb") && !entry.name.endsWith(".partial.ipynb")
        ) {
          found.push(`${folder}/${entry.name}`);
        }
      }
    } catch (error) {
      if (!(error instanceof Deno.errors.NotFound)) throw error;
    }
  }
  return found.sort();
}
