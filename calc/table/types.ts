/**
 * The shapes of the table pipeline: columns keyed by name (numeric columns carry their quantity
 * and canonical unit), the table read from a file with its line numbers and issues, and the
 * uncertainty models a table's columns may be given. Types only.
 *
 * @module
 */
import type { Population, Quantity, ValidationIssue } from "../core/types.ts";
import type { UncertainInput } from "../uncertainty/distributions.ts";

/** A column of numbers of one quantity, in its canonical unit (NaN where missing or invalid). */
export interface NumericColumn {
  /** Brand. */
  readonly kind: "numeric";
  /** Column name: the quantity's id for a recognised column, or the output's name. */
  readonly name: string;
  /** The header as read, or as it will be written. */
  readonly header: string;
  /** The quantity. */
  readonly quantity: Quantity;
  /** Unit in the file (values are converted from it). */
  readonly sourceUnit: string;
  /** What the column holds: a value, or the uncertainty or interval of the column `of`. */
  readonly role: "value" | "standardUncertainty" | "lower" | "upper";
  /** For an uncertainty or interval column, the name of the value column. */
  readonly of?: string;
  /** True for a column computed by the pipeline (rounded when written as reported). */
  readonly computed: boolean;
  /** Values in the quantity's canonical unit, NaN where missing or invalid. */
  readonly values: Float64Array;
}

/** A column of text cells (identifiers, sex, observer, notes): kept as written. */
export interface TextColumn {
  /** Brand. */
  readonly kind: "text";
  /** Column name. */
  readonly name: string;
  /** Header as read. */
  readonly header: string;
  /** The cells. */
  readonly values: readonly string[];
}

/** Any column. */
export type Column = NumericColumn | TextColumn;

/** A table: columns in order, one line number per row, every issue found, nothing dropped. */
export interface Table {
  /** Brand used by displays. */
  readonly kind: "sonorigor.table";
  /** Where the table comes from (a file name), for messages. */
  readonly source: string;
  /** Number of data rows. */
  readonly rowCount: number;
  /** The 1-based line in the file where each row starts (0 for rows not from a file). */
  readonly lines: Int32Array;
  /** Columns by name, in order. */
  readonly columns: ReadonlyMap<string, Column>;
  /** Every issue found while reading and computing (errors and warnings), in row order. */
  readonly issues: readonly ValidationIssue[];
  /** Blank lines skipped (not rows). */
  readonly blankLines: readonly number[];
  /** Cautions of the calculations computed over the table. */
  readonly cautions: readonly string[];
}

/**
 * How uncertain a column's values are: an absolute standard uncertainty (a number in the
 * canonical unit or a quantity string such as "0.8 mm"), a relative one (0.06 for 6 %), or a
 * function from the value to any distribution.
 */
export type UncertaintyModel =
  | { readonly standardUncertainty: number | string }
  | { readonly relative: number }
  | ((value: number) => UncertainInput);

/** Options of the table readers (`readTable`, `readTableStream`, `readTableFile`). */
export interface ReadTableOptions {
  /** Name of the source in messages (a file name). @default "table" (the path for a file) */
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
  /** The encoding of bytes: a label of the WHATWG Encoding Standard ("utf-8", "windows-1252",
   * "iso-8859-1", "utf-16le", …). Decoding is strict whatever the encoding: a byte sequence the
   * encoding cannot hold is an error with its byte offset and line, never a replacement
   * character. Ignored for text input. @default "utf-8" */
  readonly encoding?: string;
  /** Which typical ranges flag the values. @default "adult" */
  readonly population?: Population;
  /** "flag" keeps invalid cells as NaN with an error issue; "throw" throws the first error after
   * the whole file is checked (its `issues` list all). @default "flag" */
  readonly onInvalid?: "flag" | "throw";
}
