/**
 * Notebook displays of evaluations and of ad-hoc tables: labels from quantities, values rounded
 * to each quantity's display resolution, flags and cautions below.
 *
 * @module
 */
import type { Evaluation, MimeBundle } from "../calc/core/types.ts";
import { JUPYTER_DISPLAY, tableBundle } from "./mime.ts";
import { formatNumber, formatResolution, NOT_MEASURED } from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";

export { JUPYTER_DISPLAY };

/** The MIME bundle of an evaluation: a table of inputs and outputs with labels and units. */
export function displayEvaluation(result: Evaluation): MimeBundle {
  const calc = result.calculation;
  const rows = [
    ...calc.inputNames.map((n) => {
      const d = calc.inputs[n]!;
      return [
        "input",
        labelWithUnit(d.label, d.unit),
        formatResolution(result.inputs[n]!, d.quantity.resolution),
      ];
    }),
    ...calc.outputNames.map((n) => {
      const d = calc.outputs[n]!;
      return [
        "output",
        labelWithUnit(d.label, d.unit),
        formatResolution(result.outputs[n]!, d.quantity.resolution),
      ];
    }),
  ];
  return tableBundle(calc.title, ["", "Quantity", "Value"], rows, {
    Flags: result.flags,
    Cautions: result.cautions,
  });
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
 * with up to 4 significant digits ("not measured" for NaN), columns in first-seen order. Prefer
 * the displays of results (they round by the metrology rule); this is for ad-hoc summaries whose
 * cells are already formatted.
 *
 * @param records The rows.
 * @param title Optional caption.
 * @param cautions Cautions shown below the table (the clinical caution, where the numbers could
 * reach a patient decision).
 * @returns The table.
 *
 * @example
 * ```ts
 * import { CLINICAL_CAUTION, JUPYTER_DISPLAY, tableDisplay } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = tableDisplay([{ patient: "A", area: 0.81234 }, { patient: "B", area: NaN }], "Areas",
 *   [CLINICAL_CAUTION]);
 * assert.deepEqual(t.columns, ["patient", "area"]);
 * assert.deepEqual(t.rows, [["A", "0.8123"], ["B", "not measured"]]);
 * assert.match(String(t[JUPYTER_DISPLAY]()["text/plain"]), /Caution: Not a diagnosis/);
 * ```
 */
export function tableDisplay(
  records: readonly Record<string, unknown>[],
  title = "",
  cautions: readonly string[] = [],
): TableDisplay {
  const columns: string[] = [];
  for (const r of records) {
    for (const k of Object.keys(r)) if (!columns.includes(k)) columns.push(k);
  }
  const show = (v: unknown) =>
    typeof v === "number"
      ? formatNumber(v)
      : v === undefined || v === null
      ? NOT_MEASURED
      : String(v);
  const rows = records.map((r) => columns.map((c) => show(r[c])));
  return {
    columns,
    rows,
    [JUPYTER_DISPLAY]: () => tableBundle(title, columns, rows, { Cautions: cautions }),
  };
}
