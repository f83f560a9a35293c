/**
 * Notebook files: atomic writing, reading with errors that name the path, and the record of
 * where and why a run stopped that the partial notebook carries.
 */
import assert from "node:assert/strict";
import type { Notebook } from "../nbformat.ts";
import {
  interruptionText,
  markStopped,
  partialPathOf,
  readNotebook,
  STOP_ERROR_NAMES,
  timeoutText,
  writeNotebook,
} from "../notebook_files.ts";

const notebook = (): Notebook => ({
  metadata: { kernelspec: { name: "deno", display_name: "Deno" } },
  nbformat: 4,
  nbformat_minor: 5,
  cells: [
    { id: "m", cell_type: "markdown", metadata: {}, source: "# Title" },
    {
      id: "a",
      cell_type: "code",
      metadata: {},
      source: "print()",
      execution_count: 1,
      outputs: [{ output_type: "stream", name: "stdout", text: ["so far\n"] }],
    },
  ],
});

Deno.test("partialPathOf puts the partial notebook beside the original", () => {
  assert.equal(partialPathOf("notebooks/01-phantom.ipynb"), "notebooks/01-phantom.partial.ipynb");
  assert.equal(partialPathOf("/tmp/a.b.ipynb"), "/tmp/a.b.partial.ipynb");
});

Deno.test("writeNotebook replaces the file whole and leaves no temporary file", async () => {
  const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-files-" });
  await Deno.writeTextFile(`${dir}/a.ipynb`, "old content");
  await writeNotebook(`${dir}/a.ipynb`, notebook());
  assert.deepEqual(JSON.parse(await Deno.readTextFile(`${dir}/a.ipynb`)), notebook());
  assert.deepEqual([...Deno.readDirSync(dir)].map((e) => e.name), ["a.ipynb"]);
  // an invalid notebook is refused before anything is written (nbformat 4.5: ids are required)
  const broken = notebook() as unknown as { cells: { id?: string }[] };
  delete broken.cells[0]!.id;
  await assert.rejects(writeNotebook(`${dir}/b.ipynb`, broken as unknown as Notebook), {
    name: "TypeError",
    message: new RegExp(`^${dir}/b\\.ipynb: not valid nbformat 4\\.5: cells\\.0\\.id`),
  });
  assert.deepEqual([...Deno.readDirSync(dir)].map((e) => e.name), ["a.ipynb"]);
  // a write that fails (the destination is a folder) removes its temporary file
  await Deno.mkdir(`${dir}/c.ipynb`);
  await assert.rejects(writeNotebook(`${dir}/c.ipynb`, notebook()));
  assert.deepEqual([...Deno.readDirSync(dir)].map((e) => e.name).sort(), ["a.ipynb", "c.ipynb"]);
  await Deno.remove(dir, { recursive: true });
});

Deno.test("readNotebook names the path for a missing file, a folder and bad JSON", async () => {
  const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-files-" });
  await assert.rejects(readNotebook(`${dir}/none.ipynb`), {
    name: "NotebookInputError",
    message: `Notebook not found: none.ipynb (looked in ${dir})`,
  });
  await assert.rejects(readNotebook(dir), {
    name: "NotebookInputError",
    message: `Notebook path is a directory: ${dir}`,
  });
  await Deno.writeTextFile(`${dir}/bad.ipynb`, "{ nope");
  await assert.rejects(readNotebook(`${dir}/bad.ipynb`), {
    name: "NotebookInputError",
    message: new RegExp(`^Notebook ${dir}/bad\\.ipynb: invalid JSON: `),
  });
  await writeNotebook(`${dir}/ok.ipynb`, notebook());
  assert.deepEqual(await readNotebook(`${dir}/ok.ipynb`), notebook());
  await Deno.remove(dir, { recursive: true });
});

Deno.test("the stop texts name the limit or the cause", () => {
  assert.equal(timeoutText(300), "Cell did not finish within 300 s");
  assert.equal(
    timeoutText(2, true),
    "Cell did not finish within 2 s (its output was still arriving)",
  );
  assert.equal(interruptionText("SIGINT"), "Run interrupted by SIGINT");
  assert.equal(
    interruptionText("the exit of the runner process"),
    "Run interrupted by the exit of the runner process",
  );
  const controller = new AbortController();
  controller.abort(); // the default reason is a DOMException named AbortError
  assert.equal(interruptionText(controller.signal.reason), "Run interrupted");
  assert.equal(interruptionText(""), "Run interrupted");
});

Deno.test("markStopped appends the error output and records the cell and the reason", () => {
  const stopped = markStopped(notebook(), {
    cellNumber: 2,
    ename: STOP_ERROR_NAMES.aborted,
    evalue: "Run interrupted by SIGTERM; the kernel was stopped",
  });
  const cell = stopped.cells[1]!;
  assert.ok(cell.cell_type === "code");
  assert.deepEqual(cell.outputs, [
    { output_type: "stream", name: "stdout", text: ["so far\n"] }, // the outputs so far stay
    {
      output_type: "error",
      ename: "InterruptedError",
      evalue: "Run interrupted by SIGTERM; the kernel was stopped",
      traceback: ["InterruptedError: Run interrupted by SIGTERM; the kernel was stopped"],
    },
  ]);
  assert.deepEqual(stopped.metadata.sonorigor_partial, {
    failed_cell: 2,
    reason: "InterruptedError: Run interrupted by SIGTERM; the kernel was stopped",
  });
  // a kernel error already at the end keeps its own traceback: no second error output
  const again = markStopped(stopped, { cellNumber: 2, ename: "ReferenceError", evalue: "x" });
  assert.equal((again.cells[1] as { outputs: unknown[] }).outputs.length, 2);
  assert.deepEqual(again.metadata.sonorigor_partial, {
    failed_cell: 2,
    reason: "ReferenceError: x",
  });
  // a Markdown cell gets no output; the metadata still says where the run stopped
  const markdown = markStopped(notebook(), { cellNumber: 1, ename: "E", evalue: "v" });
  assert.equal("outputs" in markdown.cells[0]!, false);
  assert.deepEqual(markdown.metadata.sonorigor_partial, { failed_cell: 1, reason: "E: v" });
});
