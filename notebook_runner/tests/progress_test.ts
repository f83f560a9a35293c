/**
 * The progress display of `deno task notebooks`: the line's format and width, the bar drawn in
 * place on a terminal, and nothing of it when the output is not a terminal.
 */
import assert from "node:assert/strict";
import { createProgress, formatProgress } from "../progress.ts";

Deno.test("formatProgress: bar proportional to the code cells done, place in the run, seconds", () => {
  const state = { label: "nb.ipynb", done: 0, total: 8, elapsedMs: 0 };
  // 100 columns → a 20-character bar; 2 of 8 cells → 5 marks (hand count)
  assert.equal(
    formatProgress({ ...state, done: 2, elapsedMs: 61_999 }, 100),
    "[#####---------------] 2/8 code cells · nb.ipynb · 61 s",
  );
  assert.equal(
    formatProgress({ ...state, done: 8, notebook: { index: 3, count: 7 } }, 100),
    "[####################] 8/8 code cells · notebook 3 of 7 · nb.ipynb · 0 s",
  );
  // a single notebook does not say "notebook 1 of 1"
  assert.doesNotMatch(formatProgress({ ...state, notebook: { index: 1, count: 1 } }, 100), /of 1/);
  // a notebook without code cells reads as complete
  assert.match(formatProgress({ ...state, total: 0 }, 100), /^\[#{20}\] 0\/0 code cells/);
});

Deno.test("formatProgress: fits the terminal width, the name shortened from its start", () => {
  const label = "notebooks/a_very_long_folder_name/03_pediatric_cohort_with_a_long_name.ipynb";
  for (const columns of [20, 40, 60, 80, 200]) {
    const line = formatProgress({ label, done: 1, total: 3, elapsedMs: 5_000 }, columns);
    assert.ok(line.length <= columns - 1, `${columns}: ${line.length} characters: ${line}`);
    assert.ok(!/[\r\n]/.test(line) && !line.includes("\x1b"), JSON.stringify(line));
  }
  const line = formatProgress({ label, done: 1, total: 3, elapsedMs: 5_000 }, 80);
  assert.match(line, /…[^ ]*_long_name\.ipynb · 5 s$/);
});

Deno.test("formatProgress: impossible counts and widths are refused with the value", () => {
  assert.throws(
    () => formatProgress({ label: "a", done: 4, total: 3, elapsedMs: 0 }, 80),
    { name: "RangeError", message: "Expected 'done' cells in [0, 3] (an integer), got 4" },
  );
  assert.throws(
    () => formatProgress({ label: "a", done: 1.5, total: 3, elapsedMs: 0 }, 80),
    { name: "RangeError", message: "Expected 'done' cells in [0, 3] (an integer), got 1.5" },
  );
  assert.throws(
    () => formatProgress({ label: "a", done: 1, total: 3, elapsedMs: 0 }, 10),
    { name: "RangeError", message: "Expected 'columns' in [20, ∞), got 10" },
  );
});

Deno.test("createProgress: quiet when not a terminal (log lines only, no control characters)", () => {
  let written = "";
  const progress = createProgress({ isTerminal: false, write: (t) => written += t });
  assert.equal(progress.drawn, false);
  for (let done = 0; done <= 3; done++) {
    progress.update({ label: "a.ipynb", done, total: 3, elapsedMs: done * 1000 });
    progress.line(`line ${done}`);
  }
  progress.finish();
  assert.equal(written, "line 0\nline 1\nline 2\nline 3\n");
});

Deno.test("createProgress: on a terminal, log lines above the bar, the bar redrawn and removed", () => {
  const writes: string[] = [];
  const progress = createProgress({ isTerminal: true, columns: 60, write: (t) => writes.push(t) });
  assert.equal(progress.drawn, true);
  progress.line("before any bar");
  progress.update({ label: "a.ipynb", done: 1, total: 2, elapsedMs: 1_500 });
  progress.line("cell 1 ok");
  progress.update({ label: "a.ipynb", done: 2, total: 2, elapsedMs: 2_500 });
  progress.finish();
  progress.line("summary");
  const clear = "\r\x1b[2K"; // carriage return + erase line (ECMA-48 EL 2)
  const bar1 = "[######------] 1/2 code cells · a.ipynb · 1 s";
  const bar2 = "[############] 2/2 code cells · a.ipynb · 2 s";
  assert.deepEqual(writes, [
    "before any bar\n",
    `${clear}${bar1}`,
    `${clear}cell 1 ok\n${bar1}`,
    `${clear}${bar2}`,
    clear,
    "summary\n",
  ]);
});
