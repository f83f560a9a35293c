/**
 * The runner on the REAL Deno kernel (`deno jupyter --kernel`), through the library API. Each
 * run takes a few seconds; the hanging fixture uses a 2 s cell limit.
 */
import assert from "node:assert/strict";
import { stripAnsi } from "../html.ts";
import { joinText, type Notebook, notebookProblems, type Output } from "../nbformat.ts";
import { runNotebook } from "../isolation.ts";
import { childProcesses, processExists, processGroupAlive } from "../testing.ts";
import { CAN_RUN_KERNEL, copyFixtures, FIXTURES, readJson } from "./helpers.ts";

const kernelTest = (name: string, fn: () => Promise<void>) =>
  Deno.test({ name, ignore: !CAN_RUN_KERNEL, fn });

function assertKernelGone(pid: number | undefined): void {
  assert.ok(pid !== undefined && pid > 0, "the run reports the kernel pid");
  assert.equal(processExists(pid), false, `kernel process ${pid} still exists`);
  assert.equal(processGroupAlive(pid), false, `processes left in the kernel's group ${pid}`);
}

Deno.test("runNotebook refuses a time limit or a stop grace outside its range", async () => {
  await assert.rejects(runNotebook("x.ipynb", { timeoutSeconds: 0 }), {
    name: "RangeError",
    message: "Expected 'timeoutSeconds' in (0, ∞) seconds, got 0",
  });
  await assert.rejects(runNotebook("x.ipynb", { stopGraceSeconds: -1 }), {
    name: "RangeError",
    message: "Expected 'stopGraceSeconds' in [0, ∞) seconds, got -1",
  });
  await assert.rejects(runNotebook("x.ipynb", { stopGraceSeconds: Number.NaN }), {
    name: "RangeError",
    message: "Expected 'stopGraceSeconds' in [0, ∞) seconds, got NaN",
  });
});

const code = (nb: Notebook) => nb.cells.filter((c) => c.cell_type === "code");

kernelTest(
  "ok notebook: outputs stored, valid nbformat 4.5, HTML export, kernel gone",
  async () => {
    const out = await Deno.makeTempDir({ prefix: "sonorigor-nb-out-" });
    const original = await Deno.readTextFile(`${FIXTURES}/ok.ipynb`);
    const lines: string[] = [];
    const result = await runNotebook(`${FIXTURES}/ok.ipynb`, {
      outDir: out,
      html: true,
      timeoutSeconds: 60,
      log: (l) => lines.push(l),
    });
    assert.equal(result.status, "ok", result.message);
    assert.equal(result.codeCells, 7);
    assert.equal(result.cellsExecuted, 7);
    assert.equal(result.outputPath, `${out}/ok.ipynb`);
    assert.equal(result.htmlPath, `${out}/ok.html`);
    assert.equal(result.cleanShutdown, true);
    assertKernelGone(result.kernelPid);
    // the original is never touched without --in-place
    assert.equal(await Deno.readTextFile(`${FIXTURES}/ok.ipynb`), original);
    // one progress line per executed cell
    assert.equal(lines.filter((l) => / ok in \d+\.\d\d s · /.test(l)).length, 7);
    assert.ok(lines.some((l) => /kernel started \(pid \d+, Deno kernel/.test(l)));

    const nb = readJson(`${out}/ok.ipynb`) as Notebook;
    assert.deepEqual(notebookProblems(nb), []);
    assert.equal(nb.nbformat, 4);
    assert.equal(nb.nbformat_minor, 5);
    assert.equal(nb.metadata.language_info?.name, "typescript");
    const cells = code(nb);
    assert.deepEqual(cells.map((c) => c.cell_type === "code" && c.execution_count), [
      1,
      2,
      3,
      4,
      5,
      6,
      7,
    ]);
    const outputs = cells.map((c) => (c.cell_type === "code" ? c.outputs : []));
    assert.deepEqual(outputs[0]!.slice(0, 2), [
      {
        output_type: "stream",
        name: "stdout",
        text: ["hello from the kernel\n", "<b>not bold</b>\n"],
      },
      { output_type: "stream", name: "stderr", text: ["a warning line\n"] },
    ]);
    const result42 = outputs[0]![2]!;
    assert.equal(result42.output_type, "execute_result");
    if (result42.output_type === "execute_result") {
      assert.equal(result42.execution_count, 1);
      assert.equal(stripAnsi(joinText(result42.data["text/plain"])), "42");
    }
    const table = outputs[1]![0]!;
    assert.equal(table.output_type, "execute_result");
    if (table.output_type === "execute_result") {
      assert.match(joinText(table.data["text/html"]), /<table class="fixture-table">/);
    }
    const kinds = (i: number) => outputs[i]!.map((o) => o.output_type);
    assert.deepEqual(kinds(2), ["display_data"]); // `await display(...)` leaves no result
    assert.deepEqual(kinds(3), ["display_data"]);
    assert.deepEqual(kinds(4), ["display_data"]);
    const svg = outputs[2]![0]!;
    assert.ok(
      svg.output_type === "display_data" &&
        joinText(svg.data["image/svg+xml"]).includes("fixture-rect"),
    );
    const vega = outputs[4]![0]!;
    assert.ok(
      vega.output_type === "display_data" && "application/vnd.vegalite.v5+json" in vega.data,
    );

    const html = await Deno.readTextFile(`${out}/ok.html`);
    assert.match(html, /<h1>Fixture: a notebook that runs<\/h1>/);
    assert.match(html, /<strong>bold text<\/strong>/);
    assert.match(html, /<th>quantity<\/th>/); // Markdown table
    assert.match(html, /<table class="fixture-table">/); // HTML table output
    assert.match(html, /<svg [^>]*><rect id="fixture-rect"/); // inline SVG
    assert.match(html, /<img src="data:image\/png;base64,iVBORw0KGgo/); // PNG data URI
    assert.match(html, /<circle id="vega-twin"/); // vega-lite through its SVG twin
    assert.doesNotMatch(html, /<script/); // the cell source shows it escaped only
    assert.match(html, /&lt;b&gt;not bold&lt;\/b&gt;/); // stream text escaped
    assert.match(html, /<pre>{ velocity: 2\.5, unit: &quot;m\/s&quot; }<\/pre>/); // ANSI stripped
    assert.match(html, /<em>markdown output<\/em> from a cell/);
    assert.ok(!html.includes("\x1b"), "no ANSI escape left");
    assert.doesNotMatch(html, /(src|href)="(https?:)?\/\//);
    await Deno.remove(out, { recursive: true });
  },
);

kernelTest(
  "a cell that throws: cell number, source line, traceback, partial notebook",
  async () => {
    const dir = await copyFixtures("throws.ipynb");
    const path = `${dir}/throws.ipynb`;
    const original = await Deno.readTextFile(path);
    const lines: string[] = [];
    const result = await runNotebook(path, { outDir: `${dir}/out`, log: (l) => lines.push(l) });
    assert.equal(result.status, "failed");
    assert.equal(result.cellsExecuted, 2);
    const f = result.failure!;
    assert.equal(f.kind, "error");
    assert.equal(f.cellNumber, 3);
    assert.equal(f.cellCount, 4);
    assert.equal(f.executionCount, 2);
    assert.equal(f.ename, "ReferenceError");
    assert.equal(f.evalue, "missingFunction is not defined");
    assert.deepEqual(f.line, { number: 5, text: "  if (v > 2) missingFunction(v);", how: "name" });
    assert.match(f.traceback[0]!, /^ReferenceError: missingFunction is not defined$/);
    assert.ok(f.traceback.some((t) => t.includes("<anonymous>")));
    assert.match(result.message!, /cell 3 of 4 failed/);
    assert.match(result.message!, /at line 5 of the cell: if \(v > 2\) missingFunction\(v\);/);
    assert.match(result.message!, /traceback:\n {4}ReferenceError/);
    assert.ok(lines.some((l) => l.includes("FAILED after")));
    assert.equal(result.cleanShutdown, true);
    assertKernelGone(result.kernelPid);

    assert.equal(result.partialPath, `${dir}/throws.partial.ipynb`);
    assert.equal(result.outputPath, undefined);
    assert.equal(await Deno.readTextFile(path), original);
    await assert.rejects(Deno.stat(`${dir}/out/throws.ipynb`), Deno.errors.NotFound);
    const partial = readJson(result.partialPath!) as Notebook;
    assert.deepEqual(notebookProblems(partial), []);
    assert.deepEqual(partial.metadata.sonorigor_partial, {
      failed_cell: 3,
      reason: "ReferenceError: missingFunction is not defined",
    });
    const [first, failing, never] = code(partial);
    assert.ok(
      first?.cell_type === "code" && failing?.cell_type === "code" && never?.cell_type === "code",
    );
    assert.deepEqual(first.outputs, [
      { output_type: "stream", name: "stdout", text: ["before the error\n"] },
    ]);
    assert.deepEqual(failing.outputs.map((o) => o.output_type), ["stream", "error"]);
    assert.equal(never.execution_count, null);
    assert.deepEqual(never.outputs, []);
    await Deno.remove(dir, { recursive: true });
  },
);

kernelTest(
  "a cell that hangs: per-cell timeout, process group killed, partial notebook",
  async () => {
    const dir = await copyFixtures("hangs.ipynb");
    const started = Date.now();
    let pidSeenEarly: number | undefined;
    const result = await runNotebook(`${dir}/hangs.ipynb`, {
      outDir: `${dir}/out`,
      timeoutSeconds: 2,
      log: () => {},
      onKernelStarted: (pid) => {
        pidSeenEarly = pid;
        assert.equal(processExists(pid), true); // alive while the run goes on
      },
    });
    assert.equal(result.status, "failed");
    assert.equal(result.failure?.kind, "timeout");
    assert.equal(result.failure?.cellNumber, 3);
    assert.equal(result.failure?.ename, "CellTimeoutError");
    assert.match(result.message!, /cell 3 of 4 timed out/);
    assert.ok(Date.now() - started < 30_000, "the timeout stops the run promptly");
    assert.equal(pidSeenEarly, result.kernelPid);
    assertKernelGone(result.kernelPid);
    const partial = readJson(`${dir}/hangs.partial.ipynb`) as Notebook;
    assert.deepEqual(notebookProblems(partial), []);
    const [first, hanging] = code(partial);
    assert.ok(first?.cell_type === "code" && hanging?.cell_type === "code");
    assert.deepEqual(first.outputs, [{
      output_type: "stream",
      name: "stdout",
      text: ["started\n"],
    }]);
    assert.deepEqual(hanging.outputs.at(-1), {
      output_type: "error",
      ename: "CellTimeoutError",
      evalue: "Cell did not finish within 2 s; the kernel was stopped",
      traceback: ["CellTimeoutError: Cell did not finish within 2 s; the kernel was stopped"],
    });
    await Deno.remove(dir, { recursive: true });
  },
);

kernelTest(
  "abort signal (Ctrl-C path): kernel killed, partial written, status interrupted",
  async () => {
    const dir = await copyFixtures("hangs.ipynb");
    const controller = new AbortController();
    const result = await runNotebook(`${dir}/hangs.ipynb`, {
      timeoutSeconds: 60,
      signal: controller.signal,
      log: (line) => {
        if (line.includes("[cell 2/4") && line.includes(" ok in ")) {
          setTimeout(() => controller.abort(), 500);
        }
      },
    });
    assert.equal(result.status, "interrupted");
    assert.equal(result.failure?.kind, "aborted");
    assert.equal(result.failure?.cellNumber, 3);
    assertKernelGone(result.kernelPid);
    await Deno.stat(`${dir}/hangs.partial.ipynb`);
    await Deno.remove(dir, { recursive: true });
  },
);

kernelTest(
  "bad input: missing, invalid JSON, non-Deno kernelspec; no kernel, no files",
  async () => {
    const dir = await copyFixtures("invalid_json.ipynb", "python_kernel.ipynb");
    const escaped = dir.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
    const cases: [string, RegExp][] = [
      [
        `${dir}/missing.ipynb`,
        new RegExp(`^Notebook not found: missing\\.ipynb \\(looked in ${escaped}\\)$`),
      ],
      [`${dir}/invalid_json.ipynb`, /^Notebook .*invalid_json\.ipynb: invalid JSON: .+/],
      [
        `${dir}/python_kernel.ipynb`,
        /^Notebook .*python_kernel\.ipynb: expected a Deno kernelspec \(name 'deno'\), got 'python3'/,
      ],
      [dir, /^Notebook path is a directory: /],
    ];
    for (const [path, message] of cases) {
      const result = await runNotebook(path, { outDir: `${dir}/out`, log: () => {} });
      assert.equal(result.status, "invalid", path);
      assert.match(result.message!, message);
      assert.equal(result.kernelPid, undefined);
      assert.equal(result.partialPath, undefined);
    }
    assert.deepEqual([...Deno.readDirSync(dir)].map((e) => e.name).sort(), [
      "invalid_json.ipynb",
      "python_kernel.ipynb",
    ]);
    await Deno.remove(dir, { recursive: true });
  },
);

kernelTest("the kernel binary missing: clear message, status kernel", async () => {
  const result = await runNotebook(`${FIXTURES}/ok.ipynb`, {
    denoPath: "/nonexistent/bin/deno",
    log: () => {},
  });
  assert.equal(result.status, "kernel");
  assert.match(
    result.message!,
    /Deno binary not found: '\/nonexistent\/bin\/deno' \(set --deno PATH or SONORIGOR_DENO\)$/,
  );
});

kernelTest("a syntax error is located by the parser; a kernel that exits is reported", async () => {
  const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-test-" });
  await codeNotebook(`${dir}/syntax.ipynb`, ["const a = 1;", "const b = 2;\nconst c = ;"]);
  const syntax = await runNotebook(`${dir}/syntax.ipynb`, { log: () => {} });
  assert.equal(syntax.status, "failed");
  assert.equal(syntax.failure?.ename, "SyntaxError");
  assert.equal(syntax.failure?.evalue, "Expression expected");
  assert.deepEqual(syntax.failure?.line, { number: 2, text: "const c = ;", how: "parser" });
  assertKernelGone(syntax.kernelPid);

  await codeNotebook(`${dir}/exits.ipynb`, ["Deno.exit(3);", "1"]);
  const exits = await runNotebook(`${dir}/exits.ipynb`, { log: () => {} });
  assert.equal(exits.status, "failed");
  assert.equal(exits.failure?.kind, "died");
  assert.equal(exits.failure?.evalue, "The kernel process exited during the cell (exit 3)");
  assertKernelGone(exits.kernelPid);
  await Deno.remove(dir, { recursive: true });
});

kernelTest("--in-place replaces the original only after a successful run", async () => {
  const dir = await copyFixtures("throws.ipynb");
  const nb = {
    metadata: { kernelspec: { name: "deno", display_name: "Deno" } },
    nbformat: 4,
    nbformat_minor: 4, // upgraded to 4.5 on the way
    cells: [{
      cell_type: "code",
      metadata: {},
      source: "2 + 3",
      outputs: [],
      execution_count: null,
    }],
  };
  await Deno.writeTextFile(`${dir}/fine.ipynb`, JSON.stringify(nb));
  // a stale partial from an earlier failed run is removed by a successful one
  await Deno.writeTextFile(`${dir}/fine.partial.ipynb`, "{}");
  const ok = await runNotebook(`${dir}/fine.ipynb`, { inPlace: true, log: () => {} });
  assert.equal(ok.status, "ok");
  assert.equal(ok.outputPath, `${dir}/fine.ipynb`);
  const written = readJson(`${dir}/fine.ipynb`) as Notebook;
  assert.equal(written.nbformat_minor, 5);
  const cell = written.cells[0]!;
  assert.ok(cell.cell_type === "code");
  assert.equal(cell.execution_count, 1);
  assert.equal(
    stripAnsi(joinText((cell.outputs[0] as { data: Record<string, unknown> }).data["text/plain"])),
    "5",
  );
  await assert.rejects(Deno.stat(`${dir}/fine.partial.ipynb`), Deno.errors.NotFound);

  const before = await Deno.readTextFile(`${dir}/throws.ipynb`);
  const failed = await runNotebook(`${dir}/throws.ipynb`, { inPlace: true, log: () => {} });
  assert.equal(failed.status, "failed");
  assert.equal(await Deno.readTextFile(`${dir}/throws.ipynb`), before);
  await Deno.stat(`${dir}/throws.partial.ipynb`);
  await Deno.remove(dir, { recursive: true });
});

/** The stdout lines of a cell's outputs, joined across stream outputs. */
function stdoutLines(outputs: readonly Output[]): string[] {
  return outputs.flatMap((o) =>
    o.output_type === "stream" && o.name === "stdout"
      ? (Array.isArray(o.text) ? o.text : [o.text])
      : []
  );
}

/** The index of the first line that is not `line ${i}\n`, or -1 when all are. */
function firstMismatch(lines: readonly string[]): number {
  return lines.findIndex((line, i) => line !== `line ${i}\n`);
}

kernelTest("an output flood of 200,000 lines is stored exactly, as one stream output", async () => {
  // floods.ipynb prints "line 0" … "line 199999", one console.log (one iopub message) each
  const out = await Deno.makeTempDir({ prefix: "sonorigor-nb-out-" });
  const result = await runNotebook(`${FIXTURES}/floods.ipynb`, {
    outDir: out,
    timeoutSeconds: 300,
    log: () => {},
  });
  assert.equal(result.status, "ok", result.message);
  assertKernelGone(result.kernelPid);
  const [before, flood, after] = code(readJson(`${out}/floods.ipynb`) as Notebook);
  assert.ok(before?.cell_type === "code" && flood?.cell_type === "code");
  assert.ok(after?.cell_type === "code");
  assert.deepEqual(before.outputs, [
    { output_type: "stream", name: "stdout", text: ["before the flood\n"] },
  ]);
  assert.equal(flood.outputs.length, 1, "consecutive stdout messages merge into one output");
  const lines = stdoutLines(flood.outputs);
  assert.equal(lines.length, 200_000);
  assert.equal(firstMismatch(lines), -1, "every line stored once, in order");
  assert.deepEqual(after.outputs, [
    { output_type: "stream", name: "stdout", text: ["after the flood\n"] },
  ]);
  await Deno.remove(out, { recursive: true });
});

kernelTest(
  "output still arriving when the cell limit passes is a timeout, not a silent truncation",
  async () => {
    // 30,000 lines: the kernel ends the loop in about a second but delivers the lines for several
    // more; an "ok" at the limit would let the kernel be shut down with most of them unsent.
    const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-test-" });
    await Deno.writeTextFile(
      `${dir}/trickle.ipynb`,
      JSON.stringify({
        metadata: { kernelspec: { name: "deno", display_name: "Deno" } },
        nbformat: 4,
        nbformat_minor: 5,
        cells: [
          "for (let i = 0; i < 30_000; i++) console.log(`line ${i}`);",
          'console.log("next");',
        ].map((source, i) => ({
          id: `c${i}`,
          cell_type: "code",
          metadata: {},
          source,
          outputs: [],
          execution_count: null,
        })),
      }),
    );
    const result = await runNotebook(`${dir}/trickle.ipynb`, { timeoutSeconds: 2, log: () => {} });
    assert.equal(result.status, "failed", result.message);
    assert.equal(result.failure?.kind, "timeout");
    assert.equal(result.failure?.cellNumber, 1);
    assert.match(
      result.failure?.evalue ?? "",
      /^Cell did not finish within 2 s( \(its output was still arriving\))?; the kernel was stopped$/,
    );
    assertKernelGone(result.kernelPid);
    const [trickle, next] = code(readJson(`${dir}/trickle.partial.ipynb`) as Notebook);
    assert.ok(trickle?.cell_type === "code" && next?.cell_type === "code");
    const lines = stdoutLines(trickle.outputs);
    assert.ok(lines.length > 0 && lines.length < 30_000, `${lines.length} lines stored`);
    assert.equal(firstMismatch(lines), -1, "the lines so far, in order");
    assert.equal(trickle.outputs.at(-1)?.output_type, "error");
    assert.equal(next.execution_count, null);
    await Deno.remove(dir, { recursive: true });
  },
);

/** The notebook client (`child.ts`) this test process started, once it runs. */
function notebookClient(): number | undefined {
  return childProcesses(Deno.pid).find((c) => c.command.includes("child.ts"))?.pid;
}

kernelTest(
  "a notebook client that does not stop after a signal is killed; kernel gone, partial written",
  async () => {
    const dir = await copyFixtures("hangs.ipynb");
    const controller = new AbortController();
    let client: number | undefined;
    let connectionFolder: string | undefined;
    const result = await runNotebook(`${dir}/hangs.ipynb`, {
      timeoutSeconds: 60,
      stopGraceSeconds: 1,
      signal: controller.signal,
      onKernelStarted: (_pid, folder) => (connectionFolder = folder),
      log: (line) => {
        if (client === undefined && line.includes("[cell 2/4") && line.includes(" ok in ")) {
          client = notebookClient();
          Deno.kill(client!, "SIGSTOP"); // frozen: it can neither stop the kernel nor write
          setTimeout(() => controller.abort("SIGTERM"), 300);
        }
      },
    });
    assert.ok(client !== undefined, "the notebook client was found and frozen");
    assert.equal(processExists(client), false, `notebook client ${client} still exists`);
    // the connection file (it holds the signing key) went with the kernel
    assert.ok(connectionFolder !== undefined);
    await assert.rejects(Deno.stat(connectionFolder), Deno.errors.NotFound);
    assert.equal(result.status, "interrupted", result.message);
    assert.match(
      result.message!,
      /the notebook client process did not stop within 1 s of SIGTERM and was killed/,
    );
    assertKernelGone(result.kernelPid);
    const partial = readJson(`${dir}/hangs.partial.ipynb`) as Notebook;
    assert.deepEqual(notebookProblems(partial), []);
    assert.equal((partial.metadata.sonorigor_partial as { failed_cell: number }).failed_cell, 3);
    const hanging = code(partial)[1];
    assert.ok(hanging?.cell_type === "code");
    assert.deepEqual(hanging.outputs.map((o) => o.output_type), ["error"]);
    assert.match(
      (hanging.outputs[0] as { evalue: string }).evalue,
      /^Run interrupted by SIGTERM; the notebook client did not stop within 1 s and was killed, so the outputs of this run are lost$/,
    );
    await Deno.remove(dir, { recursive: true });
  },
);

kernelTest(
  "a notebook client frozen in a cell is killed at the cell limit plus the grace; partial written",
  async () => {
    const dir = await copyFixtures("hangs.ipynb");
    let client: number | undefined;
    let connectionFolder: string | undefined;
    const result = await runNotebook(`${dir}/hangs.ipynb`, {
      timeoutSeconds: 2,
      stopGraceSeconds: 1,
      onKernelStarted: (_pid, folder) => (connectionFolder = folder),
      log: (line) => {
        if (client === undefined && line.includes("[cell 2/4") && line.includes(" ok in ")) {
          client = notebookClient();
          Deno.kill(client!, "SIGSTOP"); // its own cell limit can no longer fire
        }
      },
    });
    assert.ok(client !== undefined, "the notebook client was found and frozen");
    assert.equal(processExists(client), false, `notebook client ${client} still exists`);
    // the connection file (it holds the signing key) went with the kernel
    assert.ok(connectionFolder !== undefined);
    await assert.rejects(Deno.stat(connectionFolder), Deno.errors.NotFound);
    assert.equal(result.status, "failed", result.message);
    assert.equal(result.failure?.kind, "timeout");
    assert.equal(result.failure?.cellNumber, 3);
    assertKernelGone(result.kernelPid);
    const hanging = code(readJson(`${dir}/hangs.partial.ipynb`) as Notebook)[1];
    assert.ok(hanging?.cell_type === "code");
    assert.deepEqual(hanging.outputs, [{
      output_type: "error",
      ename: "CellTimeoutError",
      evalue:
        "Cell did not finish within 2 s; the notebook client did not stop within 1 s and was killed, so the outputs of this run are lost",
      traceback: [
        "CellTimeoutError: Cell did not finish within 2 s; the notebook client did not stop within 1 s and was killed, so the outputs of this run are lost",
      ],
    }]);
    await Deno.remove(dir, { recursive: true });
  },
);

/** Writes a notebook of code cells with these sources. */
async function codeNotebook(path: string, sources: string[]): Promise<void> {
  await Deno.writeTextFile(
    path,
    JSON.stringify({
      metadata: { kernelspec: { name: "deno", display_name: "Deno" } },
      nbformat: 4,
      nbformat_minor: 5,
      cells: sources.map((source, i) => ({
        id: `c${i}`,
        cell_type: "code",
        metadata: {},
        source,
        outputs: [],
        execution_count: null,
      })),
    }),
  );
}

kernelTest(
  "output barriers: a cell that wraps console keeps every cell's output whole",
  async () => {
    const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-test-" });
    await codeNotebook(`${dir}/wrapped.ipynb`, [
      'const original = console.log;\nconsole.log = (...a) => original("[wrapped]", ...a);\nconsole.error = () => {};',
      "for (let i = 0; i < 3_000; i++) console.log(`line ${i}`);",
      'console.log("end"); console.error("silenced");',
    ]);
    const result = await runNotebook(`${dir}/wrapped.ipynb`, { outDir: dir, log: () => {} });
    assert.equal(result.status, "ok", result.message);
    const [wrap, flood, end] = code(readJson(`${dir}/wrapped.ipynb`) as Notebook);
    assert.ok(wrap?.cell_type === "code" && flood?.cell_type === "code");
    assert.ok(end?.cell_type === "code");
    // the barrier requests are silent and out of the history: the counts are the cells' own
    assert.deepEqual([wrap.execution_count, flood.execution_count, end.execution_count], [1, 2, 3]);
    assert.deepEqual(wrap.outputs.filter((o) => o.output_type === "stream"), []);
    const lines = stdoutLines(flood.outputs);
    assert.equal(lines.length, 3_000);
    assert.equal(lines.findIndex((line, i) => line !== `[wrapped] line ${i}\n`), -1);
    assert.deepEqual(end.outputs, [
      { output_type: "stream", name: "stdout", text: ["[wrapped] end\n"] },
    ]);
    assert.doesNotMatch(
      await Deno.readTextFile(`${dir}/wrapped.ipynb`),
      /sonorigor-output-barrier/,
    );
    assertKernelGone(result.kernelPid);
    await Deno.remove(dir, { recursive: true });
  },
);

kernelTest(
  "output barriers: when a barrier cannot print, the cell ends after a quiet spell",
  async () => {
    const dir = await Deno.makeTempDir({ prefix: "sonorigor-nb-test-" });
    await codeNotebook(`${dir}/no_console.ipynb`, [
      'delete globalThis[Symbol.for("sonorigor.outputBarrier")];\nglobalThis.console = undefined;',
      "6 * 7",
    ]);
    const result = await runNotebook(`${dir}/no_console.ipynb`, {
      outDir: dir,
      timeoutSeconds: 30,
      log: () => {},
    });
    assert.equal(result.status, "ok", result.message);
    assert.equal(result.cellsExecuted, 2);
    const answer = code(readJson(`${dir}/no_console.ipynb`) as Notebook)[1];
    assert.ok(answer?.cell_type === "code" && answer.outputs[0]?.output_type === "execute_result");
    assert.equal(stripAnsi(joinText(answer.outputs[0].data["text/plain"])), "42");
    await Deno.remove(dir, { recursive: true });
  },
);
