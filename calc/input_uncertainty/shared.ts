/**
 * Private building blocks of the uncertainty models: the provenance every model returns with its
 * numbers (notes, warnings, cautions, citations) and the notebook display that shows them with a
 * table, so that a "from memory" or "common practice, no source" mark reaches the reader with the
 * number. Not re-exported from the package except the {@linkcode ModelProvenance} type.
 *
 * @module
 */
import type { Citation, MimeBundle } from "../core/types.ts";
import { JUPYTER_DISPLAY, tableBundle } from "../../display/mime.ts";
import { formatNumber, roundLike } from "../../display/format.ts";
import { issueError } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";

/** Where a model's numbers come from, carried by every model's result and shown by its display. */
export interface ModelProvenance {
  /** One line per number or assumption naming its source; "from memory" marks what was
   * recalled and "common practice, no source" what has no published source. */
  readonly notes: readonly string[];
  /** Problems with this use of the model (too few beats, values outside typical ranges). */
  readonly warnings: readonly string[];
  /** Cautions that travel with numbers that could reach a patient decision. */
  readonly cautions: readonly string[];
  /** The published sources. */
  readonly citations: readonly Citation[];
}

/** A table cell of a model's display: a plain number (four significant digits), an uncertainty
 * `{ u }` (two significant digits, GUM 7.2.6), a value rounded like its uncertainty
 * `{ value, u }` (GUM 7.2.6), or text as it is. */
export type ModelCell = number | string | { readonly u: number; readonly value?: number };

/** The text of a cell (see {@linkcode ModelCell}). */
function cell(value: ModelCell): string {
  if (typeof value === "number") return formatNumber(value);
  if (typeof value === "string") return value;
  if (value.value !== undefined) return roundLike(value.value, value.u);
  return formatNumber(value.u, 2);
}

/**
 * Attaches a notebook display to a model's result (not enumerable, so the result compares and
 * serialises as plain data): a titled table followed by the notes, warnings and cautions.
 */
export function withModelDisplay<T extends ModelProvenance>(
  result: T,
  title: string,
  header: readonly string[],
  rows: readonly (readonly ModelCell[])[],
): T {
  const bundle = (): MimeBundle =>
    tableBundle(title, header, rows.map((r) => r.map(cell)), {
      Notes: result.notes,
      Warnings: result.warnings,
      Cautions: result.cautions,
    });
  Object.defineProperty(result, JUPYTER_DISPLAY, { value: bundle, enumerable: false });
  return result;
}

/** The error for an argument that is not an object (the validator's message format). */
export function notAnObject(where: string, field: string, got: unknown, expected: string): Error {
  return issueError([{
    kind: "type",
    severity: "error",
    where,
    field,
    received: describeValue(got),
    expected,
  }]);
}
