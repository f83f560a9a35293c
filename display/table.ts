/**
 * Tables as people read them: headers from each column's quantity label and unit, values rounded
 * to the quantity's resolution or, next to an uncertainty, by the metrology rule, "not measured"
 * for a missing value, and each row's issues; the notebook display of a table and the cells the
 * CSV writer writes in "reported" precision.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type { NumericColumn, Table } from "../calc/table/types.ts";
import { renderIssue } from "../calc/core/issues.ts";
import { escapeHtml, htmlNotes, htmlTable, textTable } from "./mime.ts";
import { formatResolution, NOT_MEASURED, roundLike } from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";

export { JUPYTER_DISPLAY } from "./mime.ts";

/** The uncertainty column that rounds a column's values, if any. */
function uncertaintyOf(table: Table, c: NumericColumn): Float64Array | null {
  const owner = c.role === "value" ? c.name : c.of;
  const u = owner === undefined ? undefined : table.columns.get(`${owner} u`);
  return u?.kind === "numeric" ? u.values : null;
}

/**
 * A numeric cell as reported: by the metrology rule when the column (or the value it belongs to)
 * has a standard uncertainty in that row, otherwise a computed value to the quantity's display
 * resolution and a value as read as it was written (without the noise of its unit conversion);
 * empty text for a missing value.
 *
 * @param table The table.
 * @param c A numeric column of it.
 * @param row The row.
 * @returns The cell text ("" when missing).
 */
export function reportedCell(table: Table, c: NumericColumn, row: number): string {
  const v = c.values[row]!;
  if (v !== v) return "";
  const u = uncertaintyOf(table, c)?.[row];
  if (u !== undefined && u === u && u > 0) return roundLike(v, u);
  if (c.computed) return formatResolution(v, c.quantity.resolution);
  // a value as read, without the binary noise of its unit conversion (19.3 mm → 1.93 cm, never
  // 1.9300000000000002): 12 significant digits keep every digit a person writes
  return String(Number(v.toPrecision(12)));
}

/** The header of a column as a person reads it: the quantity's label with the unit. */
export function columnHeader(c: NumericColumn | { kind: "text"; header: string }): string {
  if (c.kind === "text") return c.header;
  if (c.computed) return c.header;
  return labelWithUnit(c.quantity.label, c.quantity.unit);
}

/** The MIME bundle of a table: the first rows, the issues and the cautions. */
export function displayTable(table: Table, maxRows = 25): MimeBundle {
  const columns = [...table.columns.values()];
  const header = columns.map((c) => columnHeader(c));
  const shown = Math.min(table.rowCount, maxRows);
  const rows: string[][] = [];
  for (let i = 0; i < shown; i++) {
    rows.push(columns.map((c) => {
      if (c.kind === "text") return c.values[i] ?? "";
      const cell = reportedCell(table, c, i);
      return cell === "" ? NOT_MEASURED : cell;
    }));
  }
  const title = `${table.source}: ${table.rowCount} rows${
    shown < table.rowCount ? ` (first ${shown} shown)` : ""
  }, ${table.issues.filter((i) => i.severity === "error").length} errors, ${
    table.issues.filter((i) => i.severity === "warning").length
  } notes`;
  const issues = table.issues.slice(0, 12).map(renderIssue);
  if (table.issues.length > issues.length) {
    issues.push(`… and ${table.issues.length - issues.length} more`);
  }
  return {
    "text/plain": [
      title,
      textTable(header, rows),
      ...issues.map((i) => `Issue: ${i}`),
      ...table.cautions.map((c) => `Caution: ${c}`),
    ].join("\n"),
    "text/html": `<div><p style="margin:4px 0"><b>${escapeHtml(title)}</b></p>${
      htmlTable(header, rows)
    }${htmlNotes("Issues", issues)}${htmlNotes("Cautions", table.cautions)}</div>`,
  };
}
