/**
 * Notebook display helpers: MIME bundles with an HTML table and a text/plain fallback. Plain
 * strings only; no DOM and no rendering library.
 *
 * @module
 */
import type { Evaluation } from "./define.ts";

/** A Jupyter MIME bundle: MIME type → content. */
export type MimeBundle = Record<string, unknown>;

/** The symbol the Deno Jupyter kernel calls to display a value. *
 * @example
 * ```ts
 * import { JUPYTER_DISPLAY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(JUPYTER_DISPLAY, Symbol.for("Jupyter.display"));
 * ```
 */
export const JUPYTER_DISPLAY: unique symbol = Symbol.for("Jupyter.display");

/** Escapes text for HTML. *
 * @example
 * ```ts
 * import { escapeHtml } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(escapeHtml("<b>&"), "&lt;b&gt;&amp;");
 * ```
 */
export function escapeHtml(text: string): string {
  return text.replace(
    /[&<>"']/g,
    (c) =>
      c === "&"
        ? "&amp;"
        : c === "<"
        ? "&lt;"
        : c === ">"
        ? "&gt;"
        : c === '"'
        ? "&quot;"
        : "&#39;",
  );
}

/** An HTML table from a header row and body rows (cells are escaped). *
 * @example
 * ```ts
 * import { htmlTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(htmlTable(["a"], [["1"]]), /<td[^>]*>1<\/td>/);
 * ```
 */
export function htmlTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const th = header.map((h) => `<th style="text-align:left;padding:2px 8px">${escapeHtml(h)}</th>`)
    .join("");
  const body = rows.map((r) =>
    `<tr>${r.map((c) => `<td style="padding:2px 8px">${escapeHtml(c)}</td>`).join("")}</tr>`
  ).join("");
  return `<table style="border-collapse:collapse"><thead><tr>${th}</tr></thead><tbody>${body}</tbody></table>`;
}

/** A plain-text table with padded columns. *
 * @example
 * ```ts
 * import { textTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(textTable(["a", "b"], [["1", "22"]]), "a  b\n-  --\n1  22");
 * ```
 */
export function textTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((r) => (r[i] ?? "").length)));
  const line = (r: readonly string[]) => r.map((c, i) => c.padEnd(widths[i]!)).join("  ").trimEnd();
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

/** A list of notes (flags, cautions) as HTML. *
 * @example
 * ```ts
 * import { htmlNotes } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(htmlNotes("Cautions", ["check the angle"]), /<li>check the angle<\/li>/);
 * ```
 */
export function htmlNotes(title: string, notes: readonly string[]): string {
  if (notes.length === 0) return "";
  return `<p style="margin:4px 0"><b>${escapeHtml(title)}</b></p><ul style="margin:0">${
    notes.map((n) => `<li>${escapeHtml(n)}</li>`).join("")
  }</ul>`;
}

const SUPERSCRIPTS: Record<string, string> = { "2": "²", "3": "³", "-1": "⁻¹", "-2": "⁻²" };

/** Formats a mathjs unit string for people: "cm^2" → "cm²", "1" → "" (dimensionless). *
 * @example
 * ```ts
 * import { formatUnit } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatUnit("cm^2"), "cm²");
 * ```
 */
export function formatUnit(unit: string): string {
  if (unit === "1") return "";
  return unit.replace(/\^(-?\d)/g, (m, p: string) => SUPERSCRIPTS[p] ?? m);
}

/** Formats a number for display with up to `digits` significant digits. *
 * @example
 * ```ts
 * import { formatNumber } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatNumber(0.785398), "0.7854");
 * ```
 */
export function formatNumber(value: number, digits = 4): string {
  if (!Number.isFinite(value)) return String(value);
  if (value === 0) return "0";
  const abs = Math.abs(value);
  if (abs >= 1e6 || abs < 1e-4) return value.toExponential(digits - 1);
  return String(Number(value.toPrecision(digits)));
}

/** The MIME bundle of an evaluation. */
export function displayEvaluation(result: Evaluation): MimeBundle {
  const calc = result.calculation;
  const rows = [
    ...calc.inputNames.map((
      n,
    ) => ["input", n, formatNumber(result.inputs[n]!, 6), calc.inputs[n]!.unit]),
    ...calc.outputNames.map((
      n,
    ) => ["output", n, formatNumber(result.outputs[n]!, 6), calc.outputs[n]!.unit]),
  ];
  const header = ["", "name", "value", "unit"];
  const notes = [
    ...result.flags.map((f) => `Flag: ${f}`),
    ...result.cautions.map((c) => `Caution: ${c}`),
  ];
  return {
    "text/plain": [calc.title, textTable(header, rows), ...notes].join("\n"),
    "text/html": `<div><b>${escapeHtml(calc.title)}</b>${htmlTable(header, rows)}${
      htmlNotes("Flags", result.flags)
    }${htmlNotes("Cautions", result.cautions)}</div>`,
  };
}

/** A table that displays itself in notebooks (HTML) with a text/plain fallback. */
export interface TableDisplay {
  /** Column names. */
  readonly columns: readonly string[];
  /** Rows of formatted cells. */
  readonly rows: readonly (readonly string[])[];
  /** Notebook display. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/**
 * Turns rows of plain objects into a table that displays itself in notebooks; numbers are shown
 * with up to 4 significant digits, columns in first-seen order.
 *
 * @param records The rows.
 * @param title Optional caption.
 * @returns The displayable table.
 *
 * @example
 * ```ts
 * import { tableDisplay } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = tableDisplay([{ patient: "A", area: 0.81234 }, { patient: "B", area: 1.2 }]);
 * assert.deepEqual(t.columns, ["patient", "area"]);
 * assert.deepEqual(t.rows[0], ["A", "0.8123"]);
 * ```
 */
export function tableDisplay(
  records: readonly Record<string, unknown>[],
  title = "",
): TableDisplay {
  const columns: string[] = [];
  for (const r of records) {
    for (const k of Object.keys(r)) if (!columns.includes(k)) columns.push(k);
  }
  const show = (
    v: unknown,
  ) => (typeof v === "number" ? formatNumber(v) : v === undefined ? "" : String(v));
  const rows = records.map((r) => columns.map((c) => show(r[c])));
  return {
    columns,
    rows,
    [JUPYTER_DISPLAY]: () => ({
      "text/plain": (title ? `${title}\n` : "") + textTable(columns, rows),
      "text/html": (title ? `<p><b>${escapeHtml(title)}</b></p>` : "") + htmlTable(columns, rows),
    }),
  };
}
