/**
 * The one table pipeline: read a CSV into columns keyed by quantity (line-numbered issues,
 * nothing dropped), evaluate any calculation or chain on every row (exactly, or with uncertainty
 * by the GUM law or Monte Carlo), write it back as CSV.
 *
 * @module
 */
export type { Column, NumericColumn, Table, TextColumn, UncertaintyModel } from "./types.ts";
export { decodeUtf8, detectDelimiter, readTable, type ReadTableOptions } from "./read.ts";
export {
  evaluateTable,
  type EvaluateTableOptions,
  propagateRow,
  rowIssues,
  rowLabels,
  selectColumns,
  selectRows,
  type TableRow,
  tableRow,
} from "./evaluate.ts";
export { csvTextCell, writeTableCsv, type WriteTableOptions } from "./write.ts";
export { adultSeverityBySex, gradeTable, type SeverityChoice } from "./grade.ts";
