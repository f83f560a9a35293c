/**
 * Notebook display primitives: the Jupyter display symbol, MIME bundles, HTML and plain-text
 * tables and note lists. Plain strings only; no DOM and no rendering library.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import { NOT_MEASURED } from "./format.ts";

export type { MimeBundle };

/**
 * The symbol the Deno Jupyter kernel calls to display a value.
 *
 * @example
 * ```ts
 * import { JUPYTER_DISPLAY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(JUPYTER_DISPLAY, Symbol.for("Jupyter.display"));
 * ```
 */
export const JUPYTER_DISPLAY: unique symbol = Symbol.for("Jupyter.display");

const HTML_ESCAPES: Record<string, string> = {
  "&": "&amp;",
  "<": "&lt;",
  ">": "&gt;",
  '"': "&quot;",
  "'": "&#39;",
};

/**
 * Escapes text for HTML.
 *
 * @example
 * ```ts
 * import { escapeHtml } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(escapeHtml("<b>&"), "&lt;b&gt;&amp;");
 * ```
 */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => HTML_ESCAPES[c]!);
}

/**
 * An HTML table from a header row and body rows (cells are escaped; numeric-looking cells are
 * right-aligned, as is "not measured").
 *
 * @example
 * ```ts
 * import { htmlTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(htmlTable(["a"], [["x"]]), /<td[^>]*>x<\/td>/);
 * ```
 */
export function htmlTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const th = header.map((h) => `<th style="text-align:left;padding:2px 8px">${escapeHtml(h)}</th>`)
    .join("");
  const td = (c: string) =>
    `<td style="padding:2px 8px${
      /^[−\-+]?[\d.]+( |$)/.test(c) || c === NOT_MEASURED
        ? ";text-align:right;font-variant-numeric:tabular-nums;white-space:nowrap"
        : ""
    }">${escapeHtml(c)}</td>`;
  const body = rows.map((r) => `<tr>${r.map(td).join("")}</tr>`).join("");
  return `<table style="border-collapse:collapse"><thead><tr>${th}</tr></thead><tbody>${body}</tbody></table>`;
}

/**
 * A plain-text table with padded columns.
 *
 * @example
 * ```ts
 * import { textTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(textTable(["a", "b"], [["1", "22"]]), "a  b\n-  --\n1  22");
 * ```
 */
export function textTable(header: readonly string[], rows: readonly (readonly string[])[]): string {
  const widths = header.map((h, i) => {
    let w = h.length;
    for (const r of rows) w = Math.max(w, (r[i] ?? "").length);
    return w;
  });
  const line = (r: readonly string[]) => r.map((c, i) => c.padEnd(widths[i]!)).join("  ").trimEnd();
  return [line(header), widths.map((w) => "-".repeat(w)).join("  "), ...rows.map(line)].join("\n");
}

/**
 * A titled list of notes (flags, warnings, cautions) as HTML; empty when there are none.
 *
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

/**
 * A bundle from a title, a table and notes, in HTML and plain text.
 *
 * @param title Bold title line.
 * @param header Column headers.
 * @param rows Formatted cells.
 * @param notes Titled lists of notes ("Warnings", "Cautions").
 * @returns The MIME bundle.
 *
 * @example
 * ```ts
 * import { tableBundle } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const b = tableBundle("Demo", ["a"], [["1"]], { Cautions: ["not a diagnosis"] });
 * assert.match(String(b["text/plain"]), /Caution: not a diagnosis/);
 * ```
 */
export function tableBundle(
  title: string,
  header: readonly string[],
  rows: readonly (readonly string[])[],
  notes: Readonly<Record<string, readonly string[]>> = {},
): MimeBundle {
  const text = [title, textTable(header, rows)];
  const html = [
    `<div><p style="margin:4px 0"><b>${escapeHtml(title)}</b></p>`,
    htmlTable(header, rows),
  ];
  for (const [heading, list] of Object.entries(notes)) {
    const singular = heading.replace(/s$/, "");
    for (const n of list) text.push(`${singular}: ${n}`);
    html.push(htmlNotes(heading, list));
  }
  html.push("</div>");
  return { "text/plain": text.join("\n"), "text/html": html.join("") };
}
