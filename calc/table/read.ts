/**
 * Reading a table from CSV: the one module that parses CSV (papaparse for the grammar). Bytes
 * are decoded as strict UTF-8 (an invalid byte is an error with its offset and line, never a
 * silent replacement); the delimiter is detected from the header line; each header is mapped to a
 * quantity (by its id, label or recognised headers), with the unit in the header ("lvot diameter
 * [mm]"); every numeric cell is checked by the one validator and converted to the canonical unit.
 * Every problem becomes a structured issue with its line; no row is dropped.
 *
 * @module
 */
import Papa from "papaparse";
import type { Population, Quantity, ValidationIssue } from "../core/types.ts";
import { headerMatches, normalizeHeader } from "../core/quantity.ts";
import { checkValue, quantityField } from "../core/validate.ts";
import { readAmount } from "../core/units.ts";
import { formatUnit, withUnit } from "../core/text.ts";
import { formatRange } from "../core/range.ts";
import { throwIfErrors } from "../core/issues.ts";
import { QUANTITIES } from "../quantities/mod.ts";
import type { Column, NumericColumn, Table, TextColumn } from "./types.ts";
import { displayTable, JUPYTER_DISPLAY } from "../../display/table.ts";

/** Options of {@linkcode readTable}. */
export interface ReadTableOptions {
  /** Name of the source in messages (a file name). @default "table" */
  readonly source?: string;
  /** Columns mapped by hand: header (with or without its "[unit]") → quantity (or its id), or
   * "text" to keep a column as text. Other headers are recognised automatically. */
  readonly columns?: Readonly<Record<string, string | Quantity>>;
  /** The unit of a column whose header has none: header → unit. */
  readonly units?: Readonly<Record<string, string>>;
  /** Quantities to recognise headers by. @default every quantity of the package */
  readonly quantities?: Iterable<Quantity>;
  /** The delimiter, or "auto" to detect it from the header line. @default "auto" */
  readonly delimiter?: "," | ";" | "\t" | "auto";
  /** Which typical ranges flag the values. @default "adult" */
  readonly population?: Population;
  /** "flag" keeps invalid cells as NaN with an error issue; "throw" throws the first error after
   * the whole file is checked (its `issues` list all). @default "flag" */
  readonly onInvalid?: "flag" | "throw";
}

const DECIMAL = /^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/;
/** Unit words written at the end of a header without brackets ("lvotDiameterMm"). */
const UNIT_WORDS: Readonly<Record<string, string>> = {
  mm: "mm",
  cm: "cm",
  m: "m",
  ml: "mL",
  l: "L",
  g: "g",
  kg: "kg",
  ms: "ms",
  s: "s",
  mps: "m/s",
  cmps: "cm/s",
  hz: "Hz",
  mhz: "MHz",
  mmhg: "mmHg",
  percent: "%",
  pct: "%",
  deg: "deg",
  m2: "m^2",
  cm2: "cm^2",
  y: "year",
  years: "year",
};

/**
 * Checks that bytes are UTF-8 and decodes them; an invalid sequence is an error naming its byte
 * offset and line (RFC 3629 for what is valid).
 *
 * @param bytes The file's bytes.
 * @param source Name for messages.
 * @returns The text, without a leading byte-order mark.
 * @throws {TypeError} At the first invalid byte, with its offset and line.
 *
 * @example
 * ```ts
 * import { decodeUtf8 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(decodeUtf8(new TextEncoder().encode("René"), "demo.csv"), "René");
 * // "Ren" + 0xE8 (è in Latin-1) is not UTF-8
 * assert.throws(() => decodeUtf8(Uint8Array.of(0x52, 0x65, 0x6e, 0xe8), "demo.csv"),
 *   /byte 3, line 1/);
 * ```
 */
export function decodeUtf8(bytes: Uint8Array, source: string): string {
  try {
    return new TextDecoder("utf-8", { fatal: true, ignoreBOM: false }).decode(bytes);
  } catch {
    const at = firstInvalidByte(bytes);
    let line = 1;
    for (let i = 0; i < at; i++) if (bytes[i] === 0x0a) line++;
    throw new TypeError(
      `${source}: expected UTF-8 text, got an invalid byte 0x${
        bytes[at]!.toString(16).padStart(2, "0")
      } at byte ${at}, line ${line}: save the file as UTF-8 (a Latin-1 or Windows-1252 export turns "é" into one such byte)`,
    );
  }
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 §4). */
function firstInvalidByte(b: Uint8Array): number {
  let i = 0;
  while (i < b.length) {
    const c = b[i]!;
    const n = c < 0x80
      ? 0
      : c >= 0xc2 && c <= 0xdf
      ? 1
      : c >= 0xe0 && c <= 0xef
      ? 2
      : c >= 0xf0 && c <= 0xf4
      ? 3
      : -1;
    if (n < 0) return i;
    for (let k = 1; k <= n; k++) {
      const d = b[i + k];
      if (d === undefined || (d & 0xc0) !== 0x80) return i;
    }
    const second = b[i + 1] ?? 0;
    if (
      (c === 0xe0 && second < 0xa0) || (c === 0xed && second > 0x9f) ||
      (c === 0xf0 && second < 0x90) || (c === 0xf4 && second > 0x8f)
    ) {
      return i;
    }
    i += n + 1;
  }
  return b.length;
}

/** The delimiter of a CSV text: the most frequent of , ; tab in its first line outside quotes. */
export function detectDelimiter(text: string): "," | ";" | "\t" {
  const counts = { ",": 0, ";": 0, "\t": 0 };
  let quoted = false;
  for (let i = 0; i < text.length; i++) {
    const ch = text[i]!;
    if (ch === '"') quoted = !quoted;
    else if (!quoted && (ch === "\n" || ch === "\r")) break;
    else if (!quoted && ch in counts) counts[ch as keyof typeof counts]++;
  }
  const best = (Object.entries(counts) as [keyof typeof counts, number][])
    .sort((a, b) => b[1] - a[1])[0]!;
  return best[1] > 0 ? best[0] : ",";
}

/** Splits "weight [kg]" into name and unit. */
function splitHeader(header: string): { name: string; unit: string | undefined } {
  const m = /^(.*?)\s*\[([^\]]+)\]\s*$/.exec(header);
  return m ? { name: m[1]!.trim(), unit: m[2]!.trim() } : { name: header.trim(), unit: undefined };
}

function countNewlines(fields: readonly string[]): number {
  let count = 0;
  for (const f of fields) {
    for (let k = f.indexOf("\n"); k !== -1; k = f.indexOf("\n", k + 1)) count++;
  }
  return count;
}

interface Plan {
  readonly index: number;
  readonly header: string;
  readonly name: string;
  readonly quantity: Quantity | null;
  readonly sourceUnit: string;
  /** Multiply by `factor`, or divide by `divisor` when the conversion is 1/integer (so 38 mm
   * gives exactly 3.8 cm). */
  readonly factor: number;
  readonly divisor: number;
}

/**
 * Reads a table from CSV text or bytes: headers mapped to quantities, units from the headers,
 * values converted and checked, line-numbered issues, nothing dropped.
 *
 * @param input CSV text, or its bytes (decoded as strict UTF-8).
 * @param options Column mapping, units, quantities, delimiter, population, policy.
 * @returns The table; it displays itself in a notebook.
 * @throws {TypeError} For bytes that are not UTF-8, an empty file, a header without a name, two
 * columns of one quantity, a recognised numeric column without a unit, a unit that cannot be
 * converted, malformed quotes; with `onInvalid: "throw"`, for the first invalid cell.
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
  let text: string;
  if (typeof input === "string") text = input.replace(/^\uFEFF/, "");
  else if (input instanceof Uint8Array) text = decodeUtf8(input, source).replace(/^\uFEFF/, "");
  else {
    throw new TypeError(`${source}: expected CSV text or bytes, got ${typeof input}`);
  }
  // leading "# …" lines (cautions written by writeTableCsv) are comments, not data
  let skipped = 0;
  while (text.startsWith("#")) {
    const nl = text.indexOf("\n");
    text = nl < 0 ? "" : text.slice(nl + 1);
    skipped++;
  }
  const delimiter = !options.delimiter || options.delimiter === "auto"
    ? detectDelimiter(text)
    : options.delimiter;
  // papaparse's package ships no types: the part of its result used here
  const parsed = Papa.parse(text, { delimiter, skipEmptyLines: false }) as {
    data: string[][];
    errors: { code: string; message: string; row?: number }[];
  };
  const rows = parsed.data;
  const headerRow = rows[0];
  if (headerRow === undefined || headerRow.every((h) => h.trim() === "")) {
    throw new TypeError(`${source}: expected a header line, got an empty file`);
  }
  const issues: ValidationIssue[] = [];
  const fail = (message: string): never => {
    throw new TypeError(`${source}: ${message}`);
  };
  // line where each parsed record starts
  const lineOf: number[] = [];
  let line = 1 + skipped;
  for (const fields of rows) {
    lineOf.push(line);
    line += 1 + countNewlines(fields);
  }
  const quoteError = parsed.errors.find((e) =>
    e.code === "MissingQuotes" || e.code === "InvalidQuotes"
  );
  if (quoteError) {
    fail(
      `line ${lineOf[quoteError.row ?? 0] ?? "?"}: expected every quoted field to be closed, got ${
        quoteError.code === "MissingQuotes"
          ? "an unclosed quote"
          : "a quote inside an unquoted field"
      } (${quoteError.message})`,
    );
  }
  const quantities = [...(options.quantities ?? QUANTITIES.values())];
  const explicit = options.columns ?? {};
  const headers = headerRow.map((h) => h.trim());
  if (headers.length === 1 && delimiter === "," && /[;\t]/.test(headers[0]!)) {
    fail(`expected columns separated by ',', ';' or tabs, got one column '${headers[0]}'`);
  }
  const plans: Plan[] = headers.map((header, index) => {
    if (header === "") fail(`line 1: expected a name for column ${index + 1}, got an empty header`);
    const split = splitHeader(header);
    const mapped = explicit[header] ?? explicit[split.name];
    let quantity: Quantity | null = null;
    let unit = split.unit ?? options.units?.[header] ?? options.units?.[split.name];
    if (mapped === "text") quantity = null;
    else if (mapped !== undefined) {
      quantity = typeof mapped === "string"
        ? QUANTITIES.get(mapped) ?? quantities.find((q) => q.id === mapped) ?? null
        : mapped;
      if (quantity === null) {
        fail(`column '${header}' is mapped to an unknown quantity '${mapped}'`);
      }
    } else {
      let matches = quantities.filter((q) => headerMatches(q, split.name));
      if (matches.length === 0 && unit === undefined) {
        // a unit written as the header's last word: "lvotDiameterMm", "lvef_percent"
        const words = normalizeHeader(split.name).split(" ");
        const word = UNIT_WORDS[words.at(-1) ?? ""];
        if (word !== undefined && words.length > 1) {
          const stem = words.slice(0, -1).join(" ");
          matches = quantities.filter((q) => headerMatches(q, stem));
          if (matches.length > 0) unit = word;
        }
      }
      if (matches.length > 1) {
        fail(
          `column '${header}' could mean ${
            matches.map((q) => q.label).join(" or ")
          }; map it with the option columns`,
        );
      }
      quantity = matches[0] ?? null;
    }
    if (quantity === null) {
      return {
        index,
        header,
        name: split.name,
        quantity: null,
        sourceUnit: "",
        factor: 1,
        divisor: 0,
      };
    }
    if (unit === undefined) {
      if (quantity.unit === "1" || quantity.unit === "%") unit = quantity.unit;
      else {
        fail(
          `column '${header}' (${quantity.label}) has no unit: expected it in the header, e.g. '${split.name} [${quantity.unit}]', got '${header}'`,
        );
      }
    }
    if (unit !== quantity.unit && typeof readAmount(`1 ${unit}`, quantity.unit) !== "number") {
      unit = UNIT_WORDS[unit!.toLowerCase()] ?? unit; // "y", "mps", "pct"
    }
    const factor = unit === quantity.unit ? 1 : readAmount(`1 ${unit}`, quantity.unit);
    if (typeof factor !== "number") {
      return fail(
        `column '${header}' (${quantity.label}): expected a unit convertible to ${
          formatUnit(quantity.unit) || "a number"
        }, got '${unit}'`,
      );
    }
    const inverse = Math.round(1 / factor);
    const divisor = factor < 1 && Math.abs(1 / factor - inverse) < 1e-9 * inverse ? inverse : 0;
    return { index, header, name: quantity.id, quantity, sourceUnit: unit!, factor, divisor };
  });
  const seen = new Map<string, string>();
  for (const p of plans) {
    const before = seen.get(p.name);
    if (before !== undefined) {
      fail(
        p.quantity
          ? `columns '${before}' and '${p.header}' both hold ${p.quantity.label}; expected one (map one of them as text)`
          : `expected unique column names, got '${p.name}' twice`,
      );
    }
    seen.set(p.name, p.header);
  }

  // data rows: blank lines are recorded and skipped, every other line is a row
  const width = headers.length;
  const dataRows: number[] = [];
  const blankLines: number[] = [];
  for (let r = 1; r < rows.length; r++) {
    const fields = rows[r]!;
    if (fields.length === 1 && fields[0]!.trim() === "") {
      // a final empty record after the last line break is not a line of data
      if (r !== rows.length - 1) blankLines.push(lineOf[r]!);
      continue;
    }
    dataRows.push(r);
  }
  const n = dataRows.length;
  const lines = Int32Array.from(dataRows.map((r) => lineOf[r]!));
  const population = options.population ?? "adult";
  const columns = new Map<string, Column>();
  const values = plans.map((p) => (p.quantity ? new Float64Array(n) : new Array<string>(n)));
  for (let i = 0; i < n; i++) {
    const fields = rows[dataRows[i]!]!;
    const at = lines[i]!;
    if (fields.length !== width) {
      issues.push({
        kind: "format",
        severity: "error",
        where: source,
        field: "",
        received: `${fields.length} fields`,
        expected: `${width} fields as in the header (the row is kept; missing cells are empty)`,
        row: i,
        line: at,
      });
    }
    for (let c = 0; c < plans.length; c++) {
      const p = plans[c]!;
      const cell = fields[p.index] ?? "";
      if (p.quantity === null) {
        // a cell the writer neutralised against spreadsheet formulas reads back as written
        (values[c] as string[])[i] = /^'[=+\-@\t\r]/.test(cell) ? cell.slice(1) : cell;
        continue;
      }
      const col = values[c] as Float64Array;
      const q = p.quantity;
      if (cell.trim() === "") {
        col[i] = NaN;
        issues.push({
          kind: "notMeasured",
          severity: "warning",
          where: source,
          field: p.header,
          label: q.label,
          received: "an empty cell",
          expected: "a value",
          row: i,
          line: at,
        });
        continue;
      }
      let v: number;
      if (DECIMAL.test(cell)) {
        const x = Number(cell);
        v = p.divisor ? x / p.divisor : x * p.factor;
      } else {
        const read = readAmount(cell, q.unit);
        v = typeof read === "number" ? read : NaN;
        if (typeof read !== "number") {
          col[i] = NaN;
          issues.push({
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
            line: at,
          });
          continue;
        }
      }
      const checked = checkValue(p.header, quantityField(q), v, {
        where: source,
        population,
        row: i,
        line: at,
      });
      col[i] = checked.value ?? NaN;
      for (const issue of checked.issues) {
        issues.push(
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
  plans.forEach((p, c) => {
    const column: Column = p.quantity
      ? {
        kind: "numeric",
        name: p.name,
        header: p.header,
        quantity: p.quantity,
        sourceUnit: p.sourceUnit,
        role: "value",
        computed: false,
        values: values[c] as Float64Array,
      } satisfies NumericColumn
      : {
        kind: "text",
        name: p.name,
        header: p.header,
        values: values[c] as string[],
      } satisfies TextColumn;
    columns.set(p.name, column);
  });
  const table = makeTable({
    source,
    rowCount: n,
    lines,
    columns,
    issues,
    blankLines,
    cautions: [],
  });
  if (options.onInvalid === "throw") throwIfErrors(issues);
  return table;
}

/** A table that displays itself in a notebook. */
export function makeTable(parts: Omit<Table, "kind">): Table {
  const table: Table = { kind: "sonorigor.table", ...parts };
  return Object.assign(table, { [JUPYTER_DISPLAY]: () => displayTable(table) });
}
