/**
 * Hostile and malformed CSV, generated (fast-check, fixed seeds, a few hundred cases each):
 * every record of a well-formed file becomes a row, with the line it starts on, whatever the
 * delimiter, line endings, quoting, embedded line breaks and chunking of the stream; random
 * garbage gives line-numbered issues or a TypeError naming a line or byte, never another kind of
 * exception and never a row silently lost.
 */
import assert from "node:assert/strict";
import fc from "fast-check";
import { readTable, readTableStream, type Table } from "../../mod.ts";

const SEED = 20240611;

/** One cell of text as generated: letters, digits, spaces, and the characters CSV must quote. */
const cellText = fc.string({
  unit: fc.constantFrom("a", "B", "é", "7", " ", ",", ";", "\t", '"', "\n", "\r\n", "=", "-", "'"),
  maxLength: 8,
}).filter((c) => !/^'+[=\-\t\r\n]/.test(c)); // an apostrophe before = - … is a text marker (write_test)

/** A cell as RFC 4180 writes it: quoted when it holds a delimiter, a quote or a line break (or
 * begins or ends with a space, which the reader would keep anyway). */
function rfc4180(cell: string, delimiter: string): string {
  return /[",;\t\r\n]/.test(cell) || cell.includes(delimiter)
    ? `"${cell.replace(/"/g, '""')}"`
    : cell;
}

/** Line breaks a written cell spans (each "\r\n" or "\n" one line). */
function breaks(text: string): number {
  return (text.match(/\r\n|\n/g) ?? []).length;
}

/** A table written by the test: its text, its rows' cells, and the line each row starts on. */
interface Written {
  readonly text: string;
  readonly cells: string[][];
  readonly lines: number[];
  readonly blankLines: number[];
}

const written = fc.record({
  delimiter: fc.constantFrom(",", ";", "\t"),
  eol: fc.constantFrom("\n", "\r\n"),
  width: fc.integer({ min: 1, max: 4 }),
  rows: fc.array(fc.array(cellText, { minLength: 4, maxLength: 4 }), { maxLength: 12 }),
  blanks: fc.array(fc.boolean(), { minLength: 12, maxLength: 12 }),
  finalBreak: fc.boolean(),
}).map(({ delimiter, eol, width, rows, blanks, finalBreak }): Written => {
  const header = Array.from({ length: width }, (_, k) => `note ${k + 1}`);
  const out = [header.join(delimiter)];
  let line = 2;
  const cells: string[][] = [];
  const lines: number[] = [];
  const blankLines: number[] = [];
  rows.forEach((row, r) => {
    if (blanks[r]) {
      out.push("");
      blankLines.push(line++);
    }
    const kept = row.slice(0, width);
    // a one-column row whose only cell is blank is a blank line, not a row: make it visible
    if (width === 1 && kept[0]!.trim() === "") kept[0] = `x${kept[0]}`;
    const text = kept.map((c) => rfc4180(c, delimiter)).join(delimiter);
    cells.push(kept);
    lines.push(line);
    line += 1 + breaks(text);
    out.push(text);
  });
  return { text: out.join(eol) + (finalBreak ? eol : ""), cells, lines, blankLines };
});

function textCells(t: Table): string[][] {
  const columns = [...t.columns.values()];
  return Array.from(
    { length: t.rowCount },
    (_, i) => columns.map((c) => (c.kind === "text" ? c.values[i]! : String(c.values[i]))),
  );
}

/** The bytes of a text cut into chunks at the given fractions (a character may be split). */
function chunked(bytes: Uint8Array, cuts: readonly number[]): ReadableStream<Uint8Array> {
  const at = [...new Set(cuts.map((f) => Math.floor(f * bytes.length)))].sort((a, b) => a - b);
  const parts: Uint8Array[] = [];
  let from = 0;
  for (const k of [...at, bytes.length]) {
    parts.push(bytes.subarray(from, k));
    from = k;
  }
  return ReadableStream.from(parts);
}

Deno.test("fuzz: every record of a well-formed file is a row, on the line it starts", () => {
  fc.assert(
    fc.property(written, (w) => {
      const t = readTable(w.text, { source: "fuzz.csv" });
      // RFC 4180 §2: a record per line, quoted fields may hold delimiters, quotes, line breaks
      assert.equal(t.rowCount, w.cells.length);
      assert.deepEqual(textCells(t), w.cells.map((row) => row.map((c) => c)));
      assert.deepEqual(Array.from(t.lines), w.lines);
      assert.deepEqual(t.blankLines, w.blankLines);
      assert.deepEqual(t.issues, []);
    }),
    { seed: SEED, numRuns: 300 },
  );
});

Deno.test("fuzz: a stream cut anywhere (inside a character, a quote, a CRLF) reads as the whole", async () => {
  await fc.assert(
    fc.asyncProperty(
      written,
      fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 6 }),
      async (w, cuts) => {
        const bytes = new TextEncoder().encode(w.text);
        const whole = readTable(bytes, { source: "fuzz.csv" });
        const streamed = await readTableStream(chunked(bytes, cuts), { source: "fuzz.csv" });
        assert.deepEqual(textCells(streamed), textCells(whole));
        assert.deepEqual(Array.from(streamed.lines), Array.from(whole.lines));
        assert.deepEqual(streamed.blankLines, whole.blankLines);
      },
    ),
    { seed: SEED, numRuns: 200 },
  );
});

/** The messages a malformed file may give: each names a line or a byte (or says it is empty). */
const CLEAR =
  /^fuzz\.csv: (line \d+, |expected a header line, got an empty file$|expected UTF-8 text, got an invalid byte 0x[0-9a-f]{2} at byte \d+, line \d+)/;

/** Reads hostile input: a table whose issues all have lines within the file, or a TypeError
 * with a clear message; anything else fails the test. */
async function readHostile(input: Uint8Array, cuts: readonly number[]): Promise<Table | null> {
  let whole: Table | null = null;
  let message: string | null = null;
  try {
    whole = readTable(input, { source: "fuzz.csv" });
  } catch (e) {
    assert.ok(e instanceof TypeError, `${e}`);
    assert.match(e.message, CLEAR);
    message = e.message;
  }
  // the stream gives the same answer
  try {
    const streamed = await readTableStream(chunked(input, cuts), { source: "fuzz.csv" });
    assert.equal(message, null);
    assert.deepEqual(Array.from(streamed.lines), Array.from(whole!.lines));
    assert.deepEqual(textCells(streamed), textCells(whole!));
  } catch (e) {
    if (e instanceof assert.AssertionError) throw e;
    assert.ok(e instanceof TypeError, `${e}`);
    assert.equal(e.message, message);
  }
  if (whole === null) return null;
  // an upper bound whatever the line ending ("\n", "\r\n" or "\r")
  const lineCount = (new TextDecoder().decode(input).match(/\r\n|\n|\r/g) ?? []).length + 1;
  for (const issue of whole.issues) {
    assert.ok(issue.line! >= 2 && issue.line! <= lineCount, `line ${issue.line} of ${lineCount}`);
    assert.ok(issue.row! >= 0 && issue.row! < whole.rowCount);
  }
  return whole;
}

Deno.test("fuzz: random bytes give a table with line-numbered issues or a clear TypeError", async () => {
  await fc.assert(
    fc.asyncProperty(
      fc.uint8Array({ maxLength: 200 }),
      fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 4 }),
      async (bytes, cuts) => {
        await readHostile(bytes, cuts);
      },
    ),
    { seed: SEED, numRuns: 400 },
  );
});

Deno.test("fuzz: random quotes, delimiters and line breaks: no row lost, issues by line", async () => {
  const hostile = fc.string({
    unit: fc.constantFrom('"', ",", ";", "\t", "\n", "\r\n", "\r", "a", "1", " ", "#"),
    maxLength: 60,
  });
  await fc.assert(
    fc.asyncProperty(
      hostile,
      fc.array(fc.double({ min: 0, max: 1, noNaN: true }), { maxLength: 4 }),
      async (text, cuts) => {
        const input = new TextEncoder().encode(`id,value\n${text}`);
        const t = await readHostile(input, cuts);
        if (t === null || text.includes('"') || text.includes("\r") || text.includes("#")) return;
        // without quotes every line after the header is a row or a blank line: none is lost
        const lines = text.split("\n");
        if (lines.at(-1) === "") lines.pop();
        assert.equal(t.rowCount + t.blankLines.length, lines.length);
      },
    ),
    { seed: SEED, numRuns: 400 },
  );
});
