/**
 * Reading a table from CSV: the one module that parses CSV (papaparse for the grammar). Text is
 * read record by record, so a file of any size is read in bounded working memory (a chunk of
 * text and one record at a time) into typed columns that grow as rows arrive: `readTable` for
 * text or bytes in memory, `readTableStream` for a byte stream, `readTableFile` for a file.
 * Bytes are decoded strictly (UTF-8 unless another encoding is named: an invalid byte is an error
 * with its offset and line, never a silent replacement); the delimiter is detected from the
 * header line; each header is mapped to a quantity (by its id, label or recognised headers), with
 * the unit in the header ("lvot diameter [mm]"); every numeric cell is checked by the one
 * validator and converted to the canonical unit. Every problem becomes a structured issue with
 * the line where its record starts (quoted line breaks counted); no row is dropped.
 *
 * @module
 */
import Papa from "papaparse";
import type { ValidationIssue, ValueRange } from "../core/types.ts";
import { type CheckedField, checkValue, quantityField } from "../core/validate.ts";
import { inRange } from "../core/range.ts";
import { typicalRange } from "../core/quantity.ts";
import { readAmount } from "../core/units.ts";
import { formatUnit, withUnit } from "../core/text.ts";
import { formatRange } from "../core/range.ts";
import { throwIfErrors } from "../core/issues.ts";
import type { Column, NumericColumn, ReadTableOptions, Table, TextColumn } from "./types.ts";
import { type ColumnPlan, planColumns } from "./header.ts";
import { TableDecoder } from "./decode.ts";
import { restoreFormula } from "./formula_guard.ts";
import { displayTable, JUPYTER_DISPLAY } from "../../display/table.ts";

export type { ReadTableOptions } from "./types.ts";

const DECIMAL = /^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/;
const EMPTY_MATCH = /(?:)/;

/**
 * Points the engine's record of the last regular-expression match (the legacy `RegExp.input`,
 * one per realm) at an empty string. V8 keeps the subject of the last match alive, and a cell of
 * 13 characters or more is a slice that holds its whole chunk of the file: after a 10⁶-row text
 * was read, its 60 MB stayed in memory until some other regular expression ran.
 */
function forgetLastMatch(): void {
  EMPTY_MATCH.test("");
}

/** The longest record accepted (characters): a quoted field left open would otherwise swallow
 * the rest of the file. */
export const MAX_RECORD_CHARS = 1 << 24;
/** Distinct values of a text column shared as one string each (identifiers repeat on many rows);
 * beyond this, values are kept as read. */
const INTERNED_VALUES = 1 << 22;

/**
 * The delimiter of a CSV text: the most frequent of , ; tab in its first line outside quotes
 * (a comma when there is none, or on a tie with it).
 *
 * @example
 * ```ts
 * import { detectDelimiter } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(detectDelimiter("id;height [cm];\"a;b,c\"\n1;2;3"), ";");
 * ```
 */
export function detectDelimiter(text: string): "," | ";" | "\t" {
  const counts = { ",": 0, ";": 0, "\t": 0 };
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === "\n" || ch === "\r")) break;
    else if (!quoted && ch in counts) counts[ch as keyof typeof counts]++;
  }
  let best: "," | ";" | "\t" = ",";
  for (const d of [";", "\t"] as const) if (counts[d] > counts[best]) best = d;
  return best;
}

/** Line breaks in a field (each "\r\n" counts once, through its "\n"; a lone "\r" only in a
 * file whose lines end with "\r"). */
function countBreaks(text: string, newline: string, from = 0, to = text.length): number {
  let n = 0;
  for (let k = text.indexOf(newline, from); k !== -1 && k < to; k = text.indexOf(newline, k + 1)) {
    n++;
  }
  return n;
}

/** A Float64Array that grows by doubling. */
class GrowingNumbers {
  values = new Float64Array(1024);
  push(i: number, v: number): void {
    if (i >= this.values.length) {
      const bigger = new Float64Array(this.values.length * 2);
      bigger.set(this.values);
      this.values = bigger;
    }
    this.values[i] = v;
  }
  done(n: number): Float64Array {
    return this.values.length === n ? this.values : this.values.slice(0, n);
  }
}

/** Text cells, with repeated values held once. */
class TextCells {
  readonly values: string[] = [];
  readonly #seen = new Map<string, string>();
  push(cell: string): void {
    let shared = this.#seen.get(cell);
    if (shared === undefined) {
      shared = cell;
      if (this.#seen.size < INTERNED_VALUES) this.#seen.set(cell, cell);
    }
    this.values.push(shared);
  }
}

// papaparse's package ships no types: the part of its low-level parser used here
interface PapaResult {
  data: string[][];
  errors: { code: string; message: string; row?: number; index?: number }[];
  meta: { cursor: number };
}
interface PapaParser {
  parse(input: string, baseIndex: number, ignoreLastRow: boolean): PapaResult;
}
const PapaParserClass = (Papa as unknown as {
  Parser: new (config: { delimiter: string; newline: string }) => PapaParser;
}).Parser;

/**
 * Reads decoded text, chunk by chunk, into a table: comments and header first, then one record
 * at a time into growing columns.
 */
class TableReader {
  readonly #options: ReadTableOptions;
  readonly #source: string;
  readonly #population;
  #pending = "";
  #started = false;
  /** Line where the text in `#pending` starts. */
  #line = 1;
  #newline = "\n";
  #delimiter = ",";
  #parser: PapaParser | null = null;
  #plans: ColumnPlan[] | null = null;
  #columns: (GrowingNumbers | TextCells)[] = [];
  /** Per numeric column: the checked field, and the range inside which a value needs no check
   * (valid and typical, whole where the quantity counts): the validator sees every other value. */
  #fields: (CheckedField | null)[] = [];
  #quiet: (ValueRange | null)[] = [];
  #lines = new Int32Array(1024);
  #rows = 0;
  readonly #blankLines: number[] = [];
  readonly #issues: ValidationIssue[] = [];

  constructor(options: ReadTableOptions) {
    this.#options = options;
    this.#source = options.source ?? "table";
    this.#population = options.population ?? "adult";
  }

  #fail(message: string): never {
    throw new TypeError(`${this.#source}: ${message}`);
  }

  /** Adds the next piece of text (`last` for the end of the file). */
  push(text: string, last: boolean): void {
    let pending = this.#pending + text;
    let fresh = text; // the text no parse has seen
    if (!this.#started) {
      fresh = pending;
      if (pending.charCodeAt(0) === 0xfeff) pending = pending.slice(1);
      // leading "# …" lines (cautions written by writeTableCsv) are comments, not data
      for (;;) {
        const comment = pending.startsWith("#") || pending.startsWith('"#');
        const nl = pending.indexOf("\n");
        if (!comment || (nl < 0 && !last)) break;
        pending = nl < 0 ? "" : pending.slice(nl + 1);
        this.#line++;
      }
      const nl = pending.search(/[\r\n]/);
      if ((nl < 0 || nl === pending.length - 1) && !last && pending.length < MAX_RECORD_CHARS) {
        this.#pending = pending; // the header line is not complete yet
        return;
      }
      this.#start(pending, nl);
    }
    if (!last && !fresh.includes(this.#newline)) {
      // no record can have ended in the new text
      this.#pending = pending;
      if (pending.length >= MAX_RECORD_CHARS) this.#tooLong();
      return;
    }
    this.#parse(pending, last);
  }

  /** Detects the delimiter and the line break from the header line; makes the parser. */
  #start(text: string, nl: number) {
    this.#started = true;
    const given = this.#options.delimiter;
    this.#delimiter = !given || given === "auto" ? detectDelimiter(text) : given;
    // lines end with "\n" (a "\r" before it is taken off), or with "\r" alone (old Mac files)
    this.#newline = nl >= 0 && text[nl] === "\r" && text[nl + 1] !== "\n" ? "\r" : "\n";
    this.#parser = new PapaParserClass({ delimiter: this.#delimiter, newline: this.#newline });
  }

  #parse(text: string, last: boolean) {
    const result = this.#parser!.parse(text, 0, !last);
    const records = result.data;
    // errors on the unfinished last record are found again when it is complete
    const error = result.errors.find((e) => last || (e.row ?? 0) < records.length);
    if (error) {
      const at = error.index ?? 0;
      this.#fail(
        `line ${this.#line + countBreaks(text, this.#newline, 0, at)}, ${
          error.code === "MissingQuotes"
            ? "expected every quoted field to be closed, got a quote that opens a field here and is never closed"
            : error.code === "InvalidQuotes"
            ? "expected a quoted field to end at its closing quote, got text after the closing quote (write a quote inside a quoted field as two quotes)"
            : `expected well-formed CSV, got ${error.message}`
        }`,
      );
    }
    let count = records.length;
    // the empty text after a final line break is not a record
    if (last && text.endsWith(this.#newline)) {
      const end = records[count - 1];
      if (end && end.length === 1 && end[0] === "") count--;
    }
    for (let r = 0; r < count; r++) {
      const fields = records[r]!;
      const line = this.#line;
      let breaks = 0;
      for (const f of fields) if (f.length > 0) breaks += countBreaks(f, this.#newline);
      this.#line += 1 + breaks;
      if (this.#newline === "\n") {
        const lastField = fields[fields.length - 1]!;
        if (lastField.endsWith("\r")) fields[fields.length - 1] = lastField.slice(0, -1);
      }
      this.#record(fields, line);
    }
    this.#pending = last ? "" : text.slice(result.meta.cursor);
    if (this.#pending.length >= MAX_RECORD_CHARS) this.#tooLong();
  }

  #tooLong(): never {
    return this.#fail(
      `line ${this.#line}, expected a record of at most ${MAX_RECORD_CHARS} characters, got a longer one (a quote that opens a field and is never closed?)`,
    );
  }

  #record(fields: string[], line: number) {
    if (this.#plans === null) {
      if (fields.every((h) => h.trim() === "")) {
        this.#fail(`line ${line}, expected a header line, got an empty line`);
      }
      this.#plans = planColumns(fields, line, this.#delimiter, this.#options, this.#source);
      this.#columns = this.#plans.map((p) => (p.quantity ? new GrowingNumbers() : new TextCells()));
      this.#fields = this.#plans.map((p) => (p.quantity ? quantityField(p.quantity) : null));
      this.#quiet = this.#plans.map((p) =>
        p.quantity
          ? typicalRange(this.#fields[p.index]!, this.#population) ?? p.quantity.valid
          : null
      );
      return;
    }
    if (fields.length === 1 && fields[0]!.trim() === "") {
      this.#blankLines.push(line);
      return;
    }
    const i = this.#rows++;
    if (i >= this.#lines.length) {
      const bigger = new Int32Array(this.#lines.length * 2);
      bigger.set(this.#lines);
      this.#lines = bigger;
    }
    this.#lines[i] = line;
    const plans = this.#plans;
    const source = this.#source;
    if (fields.length !== plans.length) {
      this.#issues.push({
        kind: "format",
        severity: "error",
        where: source,
        field: "",
        received: `${fields.length} fields`,
        expected:
          `${plans.length} fields as in the header (the row is kept; missing cells are empty)`,
        row: i,
        line,
      });
    }
    for (let c = 0; c < plans.length; c++) {
      const p = plans[c]!;
      const cell = fields[p.index] ?? "";
      const q = p.quantity;
      if (q === null) {
        // a cell the writer neutralised against spreadsheet formulas reads back as written
        (this.#columns[c] as TextCells).push(restoreFormula(cell));
        continue;
      }
      const col = this.#columns[c] as GrowingNumbers;
      if (cell.trim() === "") {
        col.push(i, NaN);
        this.#issues.push({
          kind: "notMeasured",
          severity: "warning",
          where: source,
          field: p.header,
          label: q.label,
          received: "an empty cell",
          expected: "a value",
          row: i,
          line,
        });
        continue;
      }
      let v: number;
      if (DECIMAL.test(cell)) {
        const x = Number(cell);
        v = p.divisor ? x / p.divisor : x * p.factor;
      } else {
        const read = readAmount(cell, q.unit);
        if (typeof read !== "number") {
          col.push(i, NaN);
          this.#issues.push({
            kind: "type",
            severity: "error",
            where: source,
            field: p.header,
            label: q.label,
            received: JSON.stringify(cell),
            range: q.valid,
            expected: `as a number in ${
              p.sourceUnit === q.unit
                ? formatRange(q.valid, q.unit)
                : `${formatUnit(p.sourceUnit)} (valid: ${formatRange(q.valid, q.unit)})`
            }`,
            row: i,
            line,
          });
          continue;
        }
        v = read;
      }
      const quiet = this.#quiet[c]!;
      if (inRange(v, quiet) && inRange(v, q.valid) && (!q.integer || Number.isInteger(v))) {
        col.push(i, v);
        continue;
      }
      const checked = checkValue(p.header, this.#fields[c]!, v, {
        where: source,
        population: this.#population,
        row: i,
        line,
      });
      col.push(i, checked.value ?? NaN);
      for (const issue of checked.issues) {
        this.#issues.push(
          p.factor === 1 && p.divisor === 0 ? issue : {
            ...issue,
            received: `${JSON.stringify(`${cell.trim()} ${formatUnit(p.sourceUnit)}`)} (${
              withUnit(String(v), q.unit)
            })`,
          },
        );
      }
    }
  }

  /** The table read. */
  finish(): Table {
    try {
      return this.#finish();
    } finally {
      forgetLastMatch();
    }
  }

  #finish(): Table {
    const plans = this.#plans;
    if (plans === null) this.#fail("expected a header line, got an empty file");
    const n = this.#rows;
    const columns = new Map<string, Column>();
    plans.forEach((p, c) => {
      const cells = this.#columns[c]!;
      const column: Column = p.quantity
        ? {
          kind: "numeric",
          name: p.name,
          header: p.header,
          quantity: p.quantity,
          sourceUnit: p.sourceUnit,
          role: "value",
          computed: false,
          values: (cells as GrowingNumbers).done(n),
        } satisfies NumericColumn
        : {
          kind: "text",
          name: p.name,
          header: p.header,
          values: (cells as TextCells).values,
        } satisfies TextColumn;
      columns.set(p.name, column);
    });
    const table = makeTable({
      source: this.#source,
      rowCount: n,
      lines: this.#lines.length === n ? this.#lines : this.#lines.slice(0, n),
      columns,
      issues: this.#issues,
      blankLines: this.#blankLines,
      cautions: [],
    });
    if (this.#options.onInvalid === "throw") throwIfErrors(this.#issues);
    return table;
  }
}

/**
 * Reads a table from CSV text or bytes: headers mapped to quantities, units from the headers,
 * values converted and checked, line-numbered issues, nothing dropped. For a large file, read it
 * with {@linkcode readTableFile} instead: the bytes are then never all in memory.
 *
 * @param input CSV text, or its bytes (decoded strictly, as UTF-8 unless `encoding` is set).
 * @param options Column mapping, units, quantities, delimiter, encoding, population, policy.
 * @returns The table; it displays itself in a notebook.
 * @throws {TypeError} For bytes the encoding cannot hold (with their offset and line), an
 * unknown encoding, an empty file, a header without a name, two columns of one quantity, a
 * recognised numeric column without a unit, a unit that cannot be converted, malformed quotes
 * (with their line); with `onInvalid: "throw"`, for the first invalid cell.
 * @throws {RangeError} With `onInvalid: "throw"`, for the first value outside its valid range.
 *
 * @example
 * ```ts
 * import { readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("patient;height [cm];weight [lb];lvot diameter [mm]\nA;120;44.1;19\nB;130;55.1;\n");
 * assert.equal(t.rowCount, 2);
 * const w = t.columns.get("weight")!;
 * assert.ok(w.kind === "numeric" && Math.abs(w.values[0]! - 20.0034) < 1e-4); // 44.1 lb in kg
 * const d = t.columns.get("lvotDiameter")!;
 * assert.ok(d.kind === "numeric" && d.values[0] === 1.9);
 * // the empty LVOT cell, line 3 (a 120 cm, 20 kg row is also flagged against adult typical ranges)
 * const empty = t.issues.find((i) => i.kind === "notMeasured")!;
 * assert.equal(empty.line, 3);
 * ```
 */
export function readTable(input: string | Uint8Array, options: ReadTableOptions = {}): Table {
  const source = options.source ?? "table";
  const reader = new TableReader(options);
  if (typeof input === "string") reader.push(input, true);
  else if (input instanceof Uint8Array) {
    reader.push(new TableDecoder(source, options.encoding).decode(input, true), true);
  } else {
    throw new TypeError(`${source}: expected CSV text or bytes, got ${typeof input}`);
  }
  return reader.finish();
}

/**
 * Reads a table from a stream of bytes, chunk by chunk: the same table as {@linkcode readTable}
 * on the whole file, in working memory bounded by one chunk of text and one record besides the
 * columns themselves (8 bytes per numeric cell; text cells share repeated values).
 *
 * @param stream The file's bytes (e.g. `(await Deno.open(path)).readable`).
 * @param options As for `readTable`.
 * @returns The table.
 * @throws {TypeError} As `readTable`; for a record longer than {@linkcode MAX_RECORD_CHARS}.
 *
 * @example
 * ```ts
 * import { readTableStream } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // "é" and a quoted line break split across chunks
 * const bytes = new TextEncoder().encode('patient,note\nRené,"two\nlines"\nB,x\n');
 * const stream = ReadableStream.from([bytes.subarray(0, 16), bytes.subarray(16)]);
 * const t = await readTableStream(stream, { source: "notes.csv" });
 * const patient = t.columns.get("patient")!;
 * assert.ok(patient.kind === "text" && patient.values[0] === "René");
 * assert.deepEqual(Array.from(t.lines), [2, 4]); // the second row starts on line 4
 * ```
 */
export async function readTableStream(
  stream: ReadableStream<Uint8Array>,
  options: ReadTableOptions = {},
): Promise<Table> {
  const decoder = new TableDecoder(options.source ?? "table", options.encoding);
  const reader = new TableReader(options);
  for await (const chunk of stream) reader.push(decoder.decode(chunk), false);
  reader.push(decoder.decode(new Uint8Array(0), true), true);
  return reader.finish();
}

/**
 * Reads a table from a file, streamed (see {@linkcode readTableStream}); the source of messages
 * is the path unless given.
 *
 * @param path The file.
 * @param options As for `readTable`.
 * @returns The table.
 * @throws {Deno.errors.NotFound} When the file does not exist (and the other errors of opening a
 * file).
 * @throws {TypeError} As `readTableStream`.
 *
 * @example
 * ```ts
 * import { readTableFile } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // invented demo data: 30 subjects × 3 observers × 2 replicates
 * const t = await readTableFile(new URL("../../examples/data/validation_demo.csv", import.meta.url));
 * assert.equal(t.rowCount, 180);
 * const ef = t.columns.get("ejectionFraction")!;
 * assert.ok(ef.kind === "numeric" && ef.values[0] === 74.3); // the first reading, as written
 * ```
 */
export async function readTableFile(
  path: string | URL,
  options: ReadTableOptions = {},
): Promise<Table> {
  const file = await Deno.open(path, { read: true });
  return await readTableStream(file.readable, { source: String(path), ...options });
}

/**
 * A table that displays itself in a notebook.
 *
 * @example
 * ```ts
 * import { makeTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = makeTable({ source: "x", rowCount: 0, lines: new Int32Array(0), columns: new Map(),
 *   issues: [], blankLines: [], cautions: [] });
 * assert.equal(t.kind, "sonorigor.table");
 * ```
 */
export function makeTable(parts: Omit<Table, "kind">): Table {
  const table: Table = { kind: "sonorigor.table", ...parts };
  return Object.assign(table, { [JUPYTER_DISPLAY]: () => displayTable(table) });
}
