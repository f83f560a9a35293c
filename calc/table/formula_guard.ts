/**
 * Spreadsheet formula injection: a CSV text cell whose first character is =, +, -, @, a tab, a
 * carriage return, a line feed or a NUL is evaluated as a formula by common spreadsheets
 * (OWASP, "CSV Injection"; OWASP ASVS 5.0 requirement 1.2.10 lists =, +, -, @, tab and NUL). The
 * usual defence, used here, is to prefix such a cell with an apostrophe, which spreadsheets take
 * as "this cell is text" and do not display. The full-width forms ＝ ＋ － ＠ are treated the same
 * (some spreadsheets convert them; from memory). A cell that already starts with apostrophes
 * before such a character gets one more, so that reading the file back (removing one apostrophe)
 * gives every cell exactly as it was.
 *
 * @module
 */

/** A cell that a spreadsheet could evaluate, after any apostrophes already there. */
const FORMULA_START = /^'*[=+\-@\t\r\n\0\uFF1D\uFF0B\uFF0D\uFF20]/;

/**
 * A text cell made safe to open in a spreadsheet: an apostrophe before a formula's first
 * character (see the module documentation).
 *
 * @param text The cell as it should read.
 * @returns The cell to write.
 *
 * @example
 * ```ts
 * import { neutraliseFormula, restoreFormula } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(neutraliseFormula("=HYPERLINK(\"x\")"), "'=HYPERLINK(\"x\")");
 * assert.equal(neutraliseFormula("-2"), "'-2");
 * assert.equal(neutraliseFormula("Dr A-B"), "Dr A-B");
 * assert.equal(neutraliseFormula("'=x"), "''=x"); // so that it reads back as written
 * assert.equal(restoreFormula(neutraliseFormula("'=x")), "'=x");
 * ```
 */
export function neutraliseFormula(text: string): string {
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/**
 * A cell as read back: the apostrophe {@linkcode neutraliseFormula} adds is removed (the
 * spreadsheet convention for a text marker), every other cell is kept as written.
 *
 * @param cell The cell in the file.
 * @returns The cell's text.
 *
 * @example
 * ```ts
 * import { restoreFormula } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(restoreFormula("'+1+1"), "+1+1");
 * assert.equal(restoreFormula("'quoted'"), "'quoted'"); // no formula character: as written
 * ```
 */
export function restoreFormula(cell: string): string {
  return cell.charCodeAt(0) === 0x27 && FORMULA_START.test(cell) ? cell.slice(1) : cell;
}
