import assert from "node:assert/strict";
import {
  appendLines,
  assertValidNotebook,
  checkDenoKernelspec,
  joinText,
  type Notebook,
  NotebookInputError,
  notebookProblems,
  OutputCollector,
  parseNotebook,
  splitLines,
  storedMimeData,
} from "../nbformat.ts";
import { FIXTURES } from "./helpers.ts";

const minimal = (cells: unknown[], extra: Record<string, unknown> = {}) =>
  JSON.stringify({ metadata: {}, nbformat: 4, nbformat_minor: 5, cells, ...extra });

Deno.test("parseNotebook reads the fixture notebooks as valid nbformat 4.5", () => {
  for (const name of ["ok.ipynb", "throws.ipynb", "hangs.ipynb", "python_kernel.ipynb"]) {
    const nb = parseNotebook(Deno.readTextFileSync(`${FIXTURES}/${name}`), name);
    assert.deepEqual(notebookProblems(nb), [], name);
  }
});

Deno.test("parseNotebook upgrades nbformat 4.4 by adding unique cell ids", () => {
  // nbformat docs, "Cell ids": required from 4.5, pattern ^[a-zA-Z0-9-_]+$, 1 to 64 characters.
  const nb = parseNotebook(
    JSON.stringify({
      metadata: {},
      nbformat: 4,
      nbformat_minor: 4,
      cells: [
        { cell_type: "code", metadata: {}, source: "1", outputs: [], execution_count: null },
        { cell_type: "markdown", metadata: {}, source: "# a" },
      ],
    }),
    "old.ipynb",
  );
  assert.equal(nb.nbformat_minor, 5);
  const ids = nb.cells.map((c) => c.id);
  assert.equal(new Set(ids).size, 2);
  for (const id of ids) assert.match(id, /^[a-zA-Z0-9-_]{1,64}$/);
  assertValidNotebook(nb, "old.ipynb");
});

Deno.test("parseNotebook replaces duplicate cell ids", () => {
  const cell = { id: "same", cell_type: "markdown", metadata: {}, source: "x" };
  const nb = parseNotebook(minimal([cell, cell]), "dup.ipynb");
  assert.equal(nb.cells[0]!.id, "same");
  assert.notEqual(nb.cells[1]!.id, "same");
});

Deno.test("parseNotebook names the problem in invalid input", () => {
  assert.throws(() => parseNotebook("{ not json", "bad.ipynb"), {
    name: "NotebookInputError",
    message: /^Notebook bad\.ipynb: invalid JSON: /,
  });
  assert.throws(() => parseNotebook("[1, 2]", "arr.ipynb"), {
    name: "NotebookInputError",
    message: "Notebook arr.ipynb: expected a JSON object, got an array",
  });
  assert.throws(() => parseNotebook(JSON.stringify({ nbformat: 3, cells: [] }), "v3.ipynb"), {
    name: "NotebookInputError",
    message: "Notebook v3.ipynb: expected 'nbformat' 4, got 3",
  });
  assert.throws(() => parseNotebook(JSON.stringify({ nbformat: 4 }), "nocells.ipynb"), {
    name: "NotebookInputError",
    message: "Notebook nocells.ipynb: expected 'cells' to be an array, got undefined",
  });
  assert.throws(() => parseNotebook(minimal([{ cell_type: "image", source: "" }]), "ct.ipynb"), {
    name: "NotebookInputError",
    message: `Notebook ct.ipynb: cell 1: expected 'cell_type' code, markdown or raw, got "image"`,
  });
  assert.throws(
    () =>
      parseNotebook(
        minimal([{
          cell_type: "code",
          source: "1",
          outputs: [{ output_type: "stream", text: "x" }],
        }]),
        "out.ipynb",
      ),
    {
      name: "NotebookInputError",
      message: /^Notebook out\.ipynb: not a valid notebook: cells\.0\.outputs\.0\.name/,
    },
  );
  assert.ok(new NotebookInputError("x") instanceof Error);
});

Deno.test("the invalid-JSON fixture is reported with the JSON parser's position", () => {
  const text = Deno.readTextFileSync(`${FIXTURES}/invalid_json.ipynb`);
  assert.throws(() => parseNotebook(text, "invalid_json.ipynb"), {
    name: "NotebookInputError",
    message: /^Notebook invalid_json\.ipynb: invalid JSON: .*position \d+/,
  });
});

Deno.test("notebookProblems catches structures nbformat 4.5 forbids", () => {
  const valid: Notebook = {
    metadata: { kernelspec: { name: "deno", display_name: "Deno" } },
    nbformat: 4,
    nbformat_minor: 5,
    cells: [{
      id: "a",
      cell_type: "code",
      metadata: {},
      source: ["1\n", "2"],
      execution_count: 1,
      outputs: [
        { output_type: "stream", name: "stdout", text: ["x\n"] },
        {
          output_type: "execute_result",
          execution_count: 1,
          data: { "text/plain": "2" },
          metadata: {},
        },
        { output_type: "error", ename: "E", evalue: "v", traceback: [] },
      ],
    }],
  };
  assert.deepEqual(notebookProblems(valid), []);
  // nbformat.v4.5.schema.json: cell id pattern, no extra members on outputs (additionalProperties
  // false), MIME bundle keys are MIME types, execution_count an integer or null, ids unique.
  const broken = structuredClone(valid) as unknown as { cells: Record<string, unknown>[] };
  broken.cells[0]!.id = "has space";
  assert.match(notebookProblems(broken).join("\n"), /cells\.0\.id/);
  const extra = structuredClone(valid) as unknown as { cells: { outputs: object[] }[] };
  extra.cells[0]!.outputs[0] = { output_type: "stream", name: "stdout", text: "", transient: {} };
  assert.match(notebookProblems(extra).join("\n"), /cells\.0\.outputs\.0/);
  const mime = structuredClone(valid) as unknown as { cells: { outputs: object[] }[] };
  mime.cells[0]!.outputs[1] = {
    output_type: "execute_result",
    execution_count: 1,
    data: { plain: "2" },
    metadata: {},
  };
  assert.match(notebookProblems(mime).join("\n"), /cells\.0\.outputs\.1\.data\.plain: Invalid key/);
  const count = structuredClone(valid) as unknown as { cells: Record<string, unknown>[] };
  count.cells[0]!.execution_count = 1.5;
  assert.match(notebookProblems(count).join("\n"), /cells\.0\.execution_count/);
  const dup = structuredClone(valid);
  dup.cells.push(structuredClone(dup.cells[0]!));
  assert.deepEqual(notebookProblems(dup), ["cells.1.id: duplicate cell id 'a'"]);
  assert.throws(() => assertValidNotebook(dup, "x.ipynb"), {
    name: "TypeError",
    message: "x.ipynb: not valid nbformat 4.5: cells.1.id: duplicate cell id 'a'",
  });
});

Deno.test("checkDenoKernelspec accepts Deno, tolerates none and rejects other kernels", () => {
  const nb = (kernelspec?: { name: string; display_name: string }): Notebook => ({
    metadata: kernelspec === undefined ? {} : { kernelspec },
    nbformat: 4,
    nbformat_minor: 5,
    cells: [],
  });
  assert.equal(checkDenoKernelspec(nb({ name: "deno", display_name: "Deno" }), "a"), true);
  assert.equal(checkDenoKernelspec(nb({ name: "deno-2", display_name: "Deno 2" }), "a"), true);
  assert.equal(checkDenoKernelspec(nb(), "a"), false);
  assert.throws(
    () =>
      checkDenoKernelspec(nb({ name: "python3", display_name: "Python 3 (ipykernel)" }), "p.ipynb"),
    {
      name: "NotebookInputError",
      message:
        "Notebook p.ipynb: expected a Deno kernelspec (name 'deno'), got 'python3' (Python 3 (ipykernel))",
    },
  );
});

Deno.test("splitLines and joinText store text the way Jupyter does", () => {
  // nbformat docs, "multiline strings": a list of lines, each keeping its newline.
  assert.deepEqual(splitLines("a\nb\n"), ["a\n", "b\n"]);
  assert.deepEqual(splitLines("a\nb"), ["a\n", "b"]);
  assert.deepEqual(splitLines(""), []);
  assert.equal(joinText(["a\n", "b"]), "a\nb");
  assert.equal(joinText("x"), "x");
  assert.deepEqual(
    storedMimeData({ "text/plain": "a\nb", "image/png": "AAA\nBBB", "application/json": { a: 1 } }),
    { "text/plain": ["a\n", "b"], "image/png": "AAA\nBBB", "application/json": { a: 1 } },
  );
});

Deno.test("OutputCollector merges streams, honours clear_output and display updates", () => {
  const displays = new Map();
  const c = new OutputCollector(displays);
  c.handle("status", { execution_state: "busy" });
  c.handle("stream", { name: "stdout", text: "a\n" });
  c.handle("stream", { name: "stdout", text: "b\n" });
  c.handle("stream", { name: "stderr", text: "w\n" });
  assert.deepEqual(c.outputs, [
    { output_type: "stream", name: "stdout", text: ["a\n", "b\n"] },
    { output_type: "stream", name: "stderr", text: ["w\n"] },
  ]);
  c.handle("clear_output", { wait: true });
  assert.equal(c.outputs.length, 2); // wait: cleared only when the next output arrives
  c.handle("display_data", {
    data: { "text/plain": "v1" },
    metadata: {},
    transient: { display_id: "d" },
  });
  assert.equal(c.outputs.length, 1);
  const later = new OutputCollector(displays); // a later cell updates the earlier display
  later.handle("update_display_data", {
    data: { "text/plain": "v2" },
    metadata: {},
    transient: { display_id: "d" },
  });
  assert.deepEqual(c.outputs[0], {
    output_type: "display_data",
    data: { "text/plain": ["v2"] },
    metadata: {},
  });
  assert.equal(later.outputs.length, 0);
  c.handle("execute_result", { execution_count: 3, data: { "text/plain": "1" }, metadata: {} });
  c.handle("error", { ename: "E", evalue: "v", traceback: ["E: v"] });
  c.handle("clear_output", { wait: false });
  assert.deepEqual(c.outputs, []);
});

Deno.test("OutputCollector places console output that trails an error before the error", () => {
  // The Deno 2.9.6 kernel was observed to send console output after the cell's "idle" status,
  // so the stream of a console.log that ran before a throw can trail the error message.
  const c = new OutputCollector();
  c.handle("stream", { name: "stdout", text: "one\n" });
  c.handle("error", { ename: "E", evalue: "v", traceback: [] });
  c.handle("stream", { name: "stdout", text: "two\n" });
  c.handle("stream", { name: "stderr", text: "warn\n" });
  assert.deepEqual(c.outputs.map((o) => o.output_type), ["stream", "stream", "error"]);
  assert.deepEqual(c.outputs[0], {
    output_type: "stream",
    name: "stdout",
    text: ["one\n", "two\n"],
  });
  assert.deepEqual(c.outputs[1], { output_type: "stream", name: "stderr", text: ["warn\n"] });
  const fresh = new OutputCollector();
  fresh.handle("error", { ename: "E", evalue: "v", traceback: [] });
  fresh.handle("stream", { name: "stdout", text: "late\n" });
  assert.deepEqual(fresh.outputs.map((o) => o.output_type), ["stream", "error"]);
});

/**
 * Counting harness: the characters that `String.prototype.split` and `Array.prototype.join`
 * process while `work` runs (the two operations that turn stream chunks into stored lines).
 */
function textWork(work: () => void): number {
  const split = String.prototype.split;
  const join = Array.prototype.join;
  let characters = 0;
  String.prototype.split = function (this: string, ...args: Parameters<typeof split>) {
    characters += this.length;
    return split.apply(this, args);
  } as typeof split;
  Array.prototype.join = function (this: unknown[], separator?: string) {
    const joined = join.call(this, separator);
    characters += joined.length;
    return joined;
  };
  try {
    work();
  } finally {
    String.prototype.split = split;
    Array.prototype.join = join;
  }
  return characters;
}

Deno.test("OutputCollector: stream text is accumulated in linear work, not re-split per message", () => {
  // A flood of 5,000 one-line messages (40 kB). Re-joining and re-splitting all earlier text on
  // every message processes about 5,000² / 2 lines (≈ 10⁸ characters); appending chunks and
  // splitting once when the outputs are read processes each character a bounded number of times.
  const chunks = Array.from({ length: 5_000 }, (_, i) => `line ${i}\n`);
  const size = chunks.reduce((sum, chunk) => sum + chunk.length, 0);
  const once = new OutputCollector();
  const onceWork = textWork(() => {
    for (const text of chunks) once.handle("stream", { name: "stdout", text });
    void once.outputs;
  });
  assert.ok(onceWork <= 4 * size, `read once: ${onceWork} characters processed for ${size}`);
  // a reader that looks at the outputs after every message (a progress view) stays linear too
  const often = new OutputCollector();
  const oftenWork = textWork(() => {
    for (const text of chunks) {
      often.handle("stream", { name: "stdout", text });
      void often.outputs;
    }
  });
  assert.ok(oftenWork <= 4 * size, `read often: ${oftenWork} characters processed for ${size}`);
  for (const collector of [once, often]) {
    assert.equal(collector.outputs.length, 1);
    const [output] = collector.outputs;
    assert.ok(output?.output_type === "stream");
    assert.deepEqual(output.text, chunks); // one stored line per printed line, in order
  }
});

Deno.test("OutputCollector: chunks cut anywhere give the lines of the whole text", () => {
  // nbformat docs, "multiline strings": stored as lines that keep their "\n"; the kernel may cut
  // console output anywhere (mid-line, several lines per message). Chunk lengths follow a fixed
  // sequence (no randomness) so every cut position class occurs: mid-line, at "\n", several lines.
  const text = Array.from({ length: 2_000 }, (_, i) => `velocity ${i} m/s\n`).join("") + "tail";
  const collector = new OutputCollector();
  let at = 0;
  for (let k = 0; at < text.length; k++) {
    const length = [1, 7, 16, 17, 18, 40, 300][k % 7]!;
    collector.handle("stream", { name: "stdout", text: text.slice(at, at + length) });
    if (k % 97 === 0) void collector.outputs; // reads in between must not change the result
    at += length;
  }
  collector.handle("stream", { name: "stdout", text: "" }); // an empty message adds nothing
  assert.deepEqual(collector.outputs, [
    { output_type: "stream", name: "stdout", text: splitLines(text) },
  ]);
  assert.equal(joinText((collector.outputs[0] as { text: string[] }).text), text);
});

Deno.test("OutputCollector: stdout and stderr alternate as separate outputs; \\r is kept as sent", () => {
  // Consecutive stream messages of one name merge; a message of the other name starts a new
  // output (Jupyter front ends, nbformat "stream output"). Carriage returns are stored verbatim:
  // the runner does not apply terminal overwriting (neither did it before).
  const c = new OutputCollector();
  for (let i = 0; i < 300; i++) {
    c.handle("stream", { name: "stdout", text: `out ${i}\n` });
    c.handle("stream", { name: "stdout", text: `progress ${i}%\r` });
    if (i % 100 === 99) c.handle("stream", { name: "stderr", text: `warn ${i}\n` });
  }
  const outputs = c.outputs;
  assert.deepEqual(outputs.map((o) => o.output_type === "stream" && o.name), [
    "stdout",
    "stderr",
    "stdout",
    "stderr",
    "stdout",
    "stderr",
  ]);
  const first = outputs[0] as { text: string[] };
  assert.equal(first.text[0], "out 0\n");
  assert.equal(first.text[1], "progress 0%\rout 1\n");
  assert.equal(first.text.length, 101);
  assert.equal(first.text.at(-2), "progress 98%\rout 99\n");
  // an unterminated last line stays with its output; the next stdout output starts afresh
  assert.equal(first.text.at(-1), "progress 99%\r");
  assert.deepEqual(outputs[1], { output_type: "stream", name: "stderr", text: ["warn 99\n"] });
  assert.equal((outputs[2] as { text: string[] }).text[0], "out 100\n");
  assert.equal((outputs[4] as { text: string[] }).text.at(-1), "progress 299%\r");
});

Deno.test("OutputCollector: clear_output drops pending stream text; late text merges before an error", () => {
  const c = new OutputCollector();
  c.handle("stream", { name: "stdout", text: "old 1\n" });
  c.handle("stream", { name: "stdout", text: "old 2\n" });
  c.handle("clear_output", { wait: false });
  c.handle("stream", { name: "stdout", text: "new\n" });
  assert.deepEqual(c.outputs, [{ output_type: "stream", name: "stdout", text: ["new\n"] }]);
  c.handle("stream", { name: "stdout", text: "kept until the next output\n" });
  c.handle("clear_output", { wait: true });
  c.handle("stream", { name: "stdout", text: "after wait\n" });
  assert.deepEqual(c.outputs, [{ output_type: "stream", name: "stdout", text: ["after wait\n"] }]);
  c.handle("stream", { name: "stdout", text: "par" });
  c.handle("error", { ename: "E", evalue: "v", traceback: [] });
  c.handle("stream", { name: "stdout", text: "tial\n" });
  assert.deepEqual(c.outputs, [
    { output_type: "stream", name: "stdout", text: ["after wait\n", "partial\n"] },
    { output_type: "error", ename: "E", evalue: "v", traceback: [] },
  ]);
});

Deno.test("appendLines continues an open last line and pushes the rest", () => {
  // nbformat docs, "multiline strings": every stored line but the last ends with "\n"
  assert.deepEqual(appendLines([], "a\nb"), ["a\n", "b"]);
  assert.deepEqual(appendLines(["a\n", "b"], "c\nd\n"), ["a\n", "bc\n", "d\n"]);
  assert.deepEqual(appendLines(["a\n"], "b"), ["a\n", "b"]);
  assert.deepEqual(appendLines(["a"], ""), ["a"]);
  assert.deepEqual(appendLines(["a"], "\n"), ["a\n"]);
  const lines = ["x\n"];
  assert.equal(appendLines(lines, "y"), lines, "changed in place");
});
