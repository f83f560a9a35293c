import assert from "node:assert/strict";
import { diagnoseSyntax, formatFailure, locateErrorLine } from "../diagnostics.ts";
import { CAN_RUN_KERNEL } from "./helpers.ts";

// The kernel's traceback positions refer to the transpiled cell, so names from the message win
// over the reported line number. The tracebacks below were recorded from the Deno 2.9.6 kernel.

Deno.test("locateErrorLine finds the line that uses the undefined name", () => {
  const source =
    'console.log("x");\n\n// comment\nvalues.forEach((v) => {\n  if (v > 2) missingFunction(v);\n});';
  const line = locateErrorLine(source, "missingFunction is not defined", [
    "ReferenceError: missingFunction is not defined",
    "    at <anonymous>:4:14",
  ]);
  assert.deepEqual(line, { number: 5, text: "  if (v > 2) missingFunction(v);", how: "name" });
});

Deno.test("locateErrorLine uses a quoted input name from a library error message", () => {
  const source =
    "const args = { lvotDiameterCm: -1 };\nconst r = evaluate(calc, args);\nconsole.log(r);";
  const line = locateErrorLine(
    source,
    "Continuity valve area: expected 'lvotDiameterCm' in (0, 5] cm, got -1",
    [
      "RangeError: ...",
      "    at validateInputs (file:///x/define.ts:10:5)",
      "    at <anonymous>:2:11",
    ],
  );
  assert.deepEqual(line, { number: 1, text: "const args = { lvotDiameterCm: -1 };", how: "name" });
});

Deno.test("locateErrorLine finds a thrown message, else falls back to the reported line", () => {
  const source = "const a = 1;\nif (a) {\n  throw new Error('custom failure');\n}";
  assert.deepEqual(locateErrorLine(source, "custom failure", ["Error: custom failure"]), {
    number: 3,
    text: "  throw new Error('custom failure');",
    how: "message",
  });
  assert.deepEqual(
    locateErrorLine("a\nb\nc", "boom", ["Error: boom", "    at <anonymous>:2:7"]),
    { number: 2, text: "b", how: "position" },
  );
  assert.equal(locateErrorLine("a", "boom", ["Error: boom", "    at <anonymous>:9:1"]), undefined);
  assert.equal(locateErrorLine("a", "", []), undefined);
});

Deno.test("formatFailure prints the cell number, the line and the traceback", () => {
  const text = formatFailure("nb.ipynb", {
    kind: "error",
    cellNumber: 3,
    cellCount: 4,
    cellId: "c3",
    executionCount: 2,
    ename: "ReferenceError",
    evalue: "f is not defined",
    traceback: ["ReferenceError: f is not defined", "    at <anonymous>:1:1"],
    line: { number: 1, text: "f()", how: "name" },
  });
  assert.equal(
    text,
    [
      "nb.ipynb: cell 3 of 4 failed (id c3, execution count 2)",
      "  ReferenceError: f is not defined",
      "  at line 1 of the cell: f()",
      "  traceback:",
      "    ReferenceError: f is not defined",
      "        at <anonymous>:1:1",
    ].join("\n"),
  );
  const timeout = formatFailure("h.ipynb", {
    kind: "timeout",
    cellNumber: 2,
    cellCount: 2,
    cellId: "x",
    executionCount: null,
    ename: "CellTimeoutError",
    evalue: "Cell did not finish within 2 s; the kernel was stopped",
    traceback: [],
    line: { number: 4, text: "loop()", how: "position" },
  });
  assert.match(timeout, /^h\.ipynb: cell 2 of 2 timed out \(id x\)\n/);
  assert.ok(timeout.endsWith("\n  near line 4 of the cell: loop()"));
});

Deno.test({
  name: "diagnoseSyntax reports the parser's message and line for a syntax error",
  ignore: !CAN_RUN_KERNEL,
  async fn() {
    const found = await diagnoseSyntax(Deno.execPath(), "const a = 1;\nconst b = ;\n");
    assert.deepEqual(found, {
      message: "Expression expected",
      line: { number: 2, text: "const b = ;", how: "parser" },
    });
    // valid TypeScript with top-level await and imports parses fine
    assert.equal(
      await diagnoseSyntax(
        Deno.execPath(),
        'import { x } from "./y.ts";\nconst v: number = await x();',
      ),
      undefined,
    );
    assert.equal(await diagnoseSyntax("/nonexistent/deno", "const b = ;"), undefined);
  },
});
