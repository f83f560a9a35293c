/**
 * Writing a table as CSV: headers "label [unit]" that read back to the same quantities, numbers
 * as reported (by the metrology rule next to an uncertainty, to the quantity's resolution
 * otherwise) or at full precision, empty cells for missing values, a flags column with every
 * row's issues, the cautions in leading comment lines, and every text cell (headers, identifiers,
 * flags, comments) neutralised against spreadsheet formula injection.
 *
 * @module
 */
import type { Table } from "./types.ts";
import { renderIssue } from "../core/issues.ts";
import { formatUnit } from "../core/text.ts";
import { neutraliseFormula } from "./formula_guard.ts";
import { reportedCell } from "../../display/table.ts";
import { budgetExport, type BudgetExportOptions } from "../../display/budget_export.ts";
import type { Propagation } from "../uncertainty/types.ts";

/** A number as written: optional minus, digits, optional fraction and exponent (or nothing). */
const PLAIN_NUMBER = /^(-?\d+(\.\d+)?([eE][-+]?\d+)?)?$/;

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
 * A text cell made safe for CSV and for spreadsheets. Spreadsheets evaluate a cell that starts
 * with =, +, -, @, a tab, a carriage return, a line feed or a NUL as a formula (CSV or formula
 * injection: OWASP, "CSV Injection"; OWASP ASVS 5.0 requirement 1.2.10); the common practice,
 * used here, is to prefix such a cell with an apostrophe, which spreadsheets take as a text
 * marker and do not show (see `neutraliseFormula`; `readTable` removes it again, so a written
 * table reads back as it was). Then the cell is quoted as RFC 4180 §2.6–2.7 says when it holds a
 * quote, a comma, a semicolon, a tab or a line break (so it stays one cell whatever delimiter a
 * spreadsheet guesses). Numbers are written by `writeTableCsv` as plain decimals ("-2.5", never
 * an expression), which spreadsheets read as numbers.
 *
 * @param text The cell's text.
 * @returns The cell as written in the file.
 *
 * @example
 * ```ts
 * import { csvTextCell } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(csvTextCell("+1+1"), "'+1+1");
 * assert.equal(csvTextCell("@SUM(A1)"), "'@SUM(A1)");
 * assert.equal(csvTextCell('a "b", c'), '"a ""b"", c"');
 * assert.equal(csvTextCell("=1;=2"), `"'=1;=2"`);
 * ```
 */
export function csvTextCell(text: string): string {
  const safe = neutraliseFormula(text);
  return /[",;\t\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
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
 * // the cautions come first, as comment lines ("#", quoted when they hold a delimiter)
 * const lines = writeTableCsv(t).split("\n").filter((l) => !/^"?#/.test(l));
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
    // a computed column's header without its display unit ("… (cm²)"), keeping any other
    // parenthesis ("Z-score (Lopez 2017)")
    const shownUnit = formatUnit(c.quantity.unit);
    const label = !c.computed
      ? c.quantity.label
      : shownUnit !== "" && c.header.endsWith(` (${shownUnit})`)
      ? c.header.slice(0, -(shownUnit.length + 3))
      : c.header;
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
        const cell = v !== v ? "" : full ? String(v) : reportedCell(table, c, i);
        // a plain decimal is a number to a spreadsheet; anything else is written as text
        cells[k++] = PLAIN_NUMBER.test(cell) ? cell : csvTextCell(cell);
      }
    }
    if (withFlags) cells[k] = csvTextCell((byRow.get(i) ?? []).join("; "));
    out[i + 1] = cells.join(",");
  }
  // a comment line is one quoted cell when it holds a delimiter, so no part of it starts a cell
  const comments = table.cautions.map((c) => csvTextCell(`# ${c.replace(/[\r\n]+/g, " ")}`));
  return (comments.length > 0 ? comments.join("\n") + "\n" : "") + out.join("\n") + "\n";
}

/**
 * Writes the uncertainty budget of one output of a GUM propagation as CSV for a lab report: the
 * title, the warnings and the cautions first as "# " comment lines (as {@linkcode writeTableCsv} writes a
 * table's), then a header line and a row per source with its label and unit, its distribution,
 * estimate, u(xᵢ), νᵢ, sensitivity cᵢ (with its unit), contribution and share of the variance,
 * rounded as the notebook display rounds them (JCGM 100:2008 §7.2.6), then the result line and
 * the combined uncertainty as comment lines. Every cell is neutralised against spreadsheet
 * formula injection ({@linkcode csvTextCell}).
 *
 * @param result A GUM propagation.
 * @param options The output.
 * @returns CSV text.
 * @throws {TypeError} For a Monte Carlo result (it has no budget) or an unknown output.
 *
 * @example
 * ```ts
 * import { normal, propagate, simplifiedBernoulli, writeBudgetCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = writeBudgetCsv(propagate(simplifiedBernoulli, { peakVelocity: normal(4, 0.1) }));
 * const rows = csv.split("\n").filter((l) => l !== "" && !/^"?#/.test(l));
 * assert.equal(rows[0], "Source,Distribution,Estimate xᵢ,u(xᵢ),νᵢ,Sensitivity cᵢ,cᵢ·u(xᵢ),Share of u²");
 * // c = 8v = 32 mmHg/(m/s), c·u = 3.2 mmHg (hand computation)
 * assert.equal(rows[1], "Peak velocity (m/s),normal,4.00,0.10,∞,32 mmHg/(m/s),3.2 mmHg,100.0 %");
 * assert.match(csv, /^# Uncertainty budget of Peak gradient/);
 * assert.match(csv, /# Caution: Not a diagnosis/);
 * ```
 */
export function writeBudgetCsv(result: Propagation, options: BudgetExportOptions = {}): string {
  const b = budgetExport(result, options);
  const comment = (text: string) => csvTextCell(`# ${text.replace(/[\r\n]+/g, " ")}`);
  return [
    comment(b.title),
    ...b.notes.map(comment),
    b.header.map(csvTextCell).join(","),
    ...b.rows.map((r) => r.map(csvTextCell).join(",")),
    ...b.summary.map(comment),
    "",
  ].join("\n");
}
