/**
 * Grading a column of a table against a severity table (a guideline's classes), row by row: the
 * class of every value as a new text column, with the table's provenance ("from memory" where it
 * applies) and the clinical caution added to the table's cautions. The table may depend on the
 * row (on its sex, for the adult limits).
 *
 * @module
 */
import type { ValidationIssue } from "../core/types.ts";
import { choiceError } from "../core/issues.ts";
import { formatCitation } from "../core/text.ts";
import { gradeSeverity } from "../grading/grade.ts";
import type { SeverityTable } from "../grading/types.ts";
import { adultReferenceRow, adultSeverityTable } from "../reference/adult.ts";
import type { Column, Table } from "./types.ts";
import { makeTable } from "./read.ts";
import { type TableRow, tableRow } from "./evaluate.ts";

/** The severity table of every row, or a function choosing it from the row's cells. */
export type SeverityChoice = SeverityTable | ((row: TableRow) => SeverityTable);

/**
 * Adds the class of every value of a column: a text column "<column> class" (empty where the
 * value is not measured, with an issue where the row's severity table cannot be chosen). The
 * classes come from {@linkcode gradeSeverity}, so they are the ones a single value gets; the
 * table's citations, its "from memory" mark and the clinical caution join the table's cautions.
 *
 * @param table The table.
 * @param column The numeric column to grade (a quantity id, e.g. "ejectionFraction").
 * @param severity The severity table, or a function choosing it per row.
 * @returns A new table with the class column.
 * @throws {TypeError} For a column that is not numeric or not of the severity table's quantity.
 *
 * @example LVEF classes by sex (Lang 2015 Table 2, from memory)
 * ```ts
 * import { adultSeverityBySex, gradeTable, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const table = readTable("patient,sex,lvef [%]\nA,F,53\nB,M,53\n");
 * const graded = gradeTable(table, "ejectionFraction", adultSeverityBySex("lvEjectionFraction"));
 * const classes = graded.columns.get("ejectionFraction class")!;
 * // 53 % is mildly abnormal in a woman (normal 54–74) and normal in a man (52–72)
 * assert.deepEqual(classes.values, ["mildly abnormal", "normal"]);
 * assert.ok(graded.cautions.some((c) => /from memory/.test(c)));
 * ```
 */
export function gradeTable(table: Table, column: string, severity: SeverityChoice): Table {
  const c = table.columns.get(column);
  const where = `Grading '${column}'`;
  if (c === undefined || c.kind !== "numeric") {
    const numeric = [...table.columns.values()].filter((x) => x.kind === "numeric");
    throw new TypeError(
      `${where}: expected a numeric column of the table, one of ${
        numeric.map((x) => x.name).join(", ")
      }, got '${column}'`,
    );
  }
  const choose = typeof severity === "function" ? severity : () => severity;
  const classes: string[] = [];
  const issues: ValidationIssue[] = [];
  const used = new Map<string, SeverityTable>();
  const cautions = [...table.cautions];
  for (let i = 0; i < table.rowCount; i++) {
    const v = c.values[i]!;
    const at = { row: i, ...(table.lines[i] ? { line: table.lines[i]! } : {}) };
    if (Number.isNaN(v)) {
      classes.push("");
      continue;
    }
    try {
      const chosen = choose(tableRow(table, i));
      if (chosen.quantity.id !== c.quantity.id) {
        throw new TypeError(
          `${where}: expected a severity table of ${c.quantity.label}, got one of ${chosen.quantity.label} (${chosen.title})`,
        );
      }
      const g = gradeSeverity(chosen, v);
      classes.push(g.grade);
      used.set(chosen.id, chosen);
      for (const caution of g.cautions) if (!cautions.includes(caution)) cautions.push(caution);
    } catch (e) {
      const found = (e as { issues?: ValidationIssue[] }).issues;
      if (!found) throw e;
      classes.push("");
      for (const issue of found) issues.push({ ...issue, ...at });
    }
  }
  for (const t of used.values()) {
    const cited = [...new Set(t.bands.map((b) => formatCitation(b.citation)))].join("; ");
    const note = `Classes of ${c.quantity.label}: ${t.title}; ${cited}`;
    if (!cautions.includes(note)) cautions.push(note);
  }
  const columns = new Map<string, Column>(table.columns);
  const name = `${column} class`;
  columns.set(name, {
    kind: "text",
    name,
    header: `${c.quantity.label} class`,
    values: classes,
  });
  return makeTable({
    ...table,
    columns,
    issues: [...table.issues, ...issues].sort((a, b) => (a.row ?? -1) - (b.row ?? -1)),
    cautions,
  });
}

const FEMALE = new Set(["f", "female", "woman", "w"]);
const MALE = new Set(["m", "male", "man"]);

/**
 * Chooses the adult severity table of a parameter from each row's sex cell ("F", "M", "female",
 * "male", any case), for {@linkcode gradeTable}.
 *
 * @param parameter Parameter key of the adult reference table, e.g. "lvEjectionFraction".
 * @param sexColumn The text column holding the sex. @default "sex"
 * @returns The chooser; a row whose sex cell is none of these is an issue on that row.
 *
 * @example
 * ```ts
 * import { adultSeverityBySex } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(adultSeverityBySex("laVolumeIndex")({ sex: "f" }).title, /LA volume index/);
 * assert.throws(() => adultSeverityBySex("laVolumeIndex")({ sex: "x" }), RangeError);
 * ```
 */
export function adultSeverityBySex(
  parameter: string,
  sexColumn = "sex",
): (row: TableRow) => SeverityTable {
  return (row) => {
    const cell = String(row[sexColumn] ?? "").trim().toLowerCase();
    const sex = FEMALE.has(cell) ? "female" : MALE.has(cell) ? "male" : null;
    if (sex === null) {
      throw choiceError("Adult reference", sexColumn, ["F", "M", "female", "male"], row[sexColumn]);
    }
    return adultSeverityTable(adultReferenceRow(parameter, sex));
  };
}
