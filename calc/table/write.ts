/**
 * Writing a table as CSV: headers "label [unit]" that read back to the same quantities, numbers
 * as reported (by the metrology rule next to an uncertainty, to the quantity's resolution
 * otherwise) or at full precision, empty cells for missing values, a flags column with every
 * row's issues, the cautions in a leading comment line, and text cells neutralised against
 * spreadsheet formula injection.
 *
 * @module
 */
import type { Table } from "./types.ts";
import { renderIssue } from "../core/issues.ts";
import { reportedCell } from "../../display/table.ts";

/** Options of {@linkcode writeTableCsv}. */
export interface WriteTableOptions {
  /** "reported": computed numbers rounded for reading (the metrology rule next to an
   * uncertainty, else the quantity's resolution); "full": every number at full precision.
   * @default "reported" */
  readonly precision?: "reported" | "full";
  /** Add a column with each row's issues. @default true */
  readonly flags?: boolean;
}

/**
 * A text cell made safe for CSV (RFC 4180 quoting) and for spreadsheets: a cell that starts with
 * =, +, -, @, a tab or a carriage return is prefixed with an apostrophe so that no spreadsheet
 * evaluates it as a formula (the OWASP recommendation against CSV injection).
 *
 * @example
 * ```ts
 * import { csvTextCell } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(csvTextCell("+1+1"), "'+1+1");
 * assert.equal(csvTextCell('a "b", c'), '"a ""b"", c"');
 * ```
 */
export function csvTextCell(text: string): string {
  const safe = /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}

/**
 * Writes a table as CSV text.
 *
 * @param table The table (read, or evaluated).
 * @param options Precision and flags column.
 * @returns CSV text with a header line ("# " lines with the cautions first, when there are any).
 *
 * @example
 * ```ts
 * import { bsaMosteller, evaluateTable, readTable, writeTableCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = evaluateTable(readTable("id,height [cm],weight [kg]\nA,180,80\n"), bsaMosteller);
 * const lines = writeTableCsv(t).split("\n").filter((l) => !l.startsWith("#"));
 * // Mosteller: √(180·80/3600) = 2 m² (hand-checkable)
 * assert.equal(lines[0], "id,Height [cm],Weight [kg],Body surface area [m^2],flags");
 * assert.equal(lines[1], "A,180,80,2.00,");
 * ```
 */
export function writeTableCsv(table: Table, options: WriteTableOptions = {}): string {
  const full = options.precision === "full";
  const columns = [...table.columns.values()];
  const header = columns.map((c) => {
    if (c.kind === "text") return csvTextCell(c.header);
    const label = c.computed ? c.header.replace(/ \([^)]*\)$/, "") : c.quantity.label;
    return csvTextCell(c.quantity.unit === "1" ? label : `${label} [${c.quantity.unit}]`);
  });
  const withFlags = options.flags ?? true;
  if (withFlags) header.push("flags");
  const byRow = new Map<number, string[]>();
  for (const issue of table.issues) {
    if (issue.row === undefined) continue;
    const list = byRow.get(issue.row) ?? [];
    list.push(renderIssue(issue).replace(/^[^:]*: /, ""));
    byRow.set(issue.row, list);
  }
  const out = new Array<string>(table.rowCount + 1);
  out[0] = header.join(",");
  const cells = new Array<string>(header.length);
  for (let i = 0; i < table.rowCount; i++) {
    let k = 0;
    for (const c of columns) {
      if (c.kind === "text") cells[k++] = csvTextCell(c.values[i] ?? "");
      else {
        const v = c.values[i]!;
        cells[k++] = v !== v ? "" : full ? String(v) : reportedCell(table, c, i);
      }
    }
    if (withFlags) cells[k] = csvTextCell((byRow.get(i) ?? []).join("; "));
    out[i + 1] = cells.join(",");
  }
  const comments = table.cautions.map((c) => `# ${c.replace(/[\r\n]+/g, " ")}`);
  return [...comments, ...out].join("\n") + "\n";
}
