/**
 * The one table pipeline: read a CSV into columns keyed by quantity (line-numbered issues,
 * nothing dropped), evaluate any calculation or chain on every row (exactly, or with uncertainty
 * by the GUM law or Monte Carlo), write it back as CSV.
 *
 * @module
 */
export type {
  Column,
  NumericColumn,
  ReadTableOptions,
  Table,
  TextColumn,
  UncertaintyModel,
} from "./types.ts";
export {
  detectDelimiter,
  makeTable,
  MAX_RECORD_CHARS,
  readTable,
  readTableFile,
  readTableStream,
} from "./read.ts";
export { decodeUtf8, TableDecoder } from "./decode.ts";
export { type ColumnPlan, planColumns, splitHeader } from "./header.ts";
export { neutraliseFormula, restoreFormula } from "./formula_guard.ts";
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
export { csvTextCell, writeBudgetCsv, writeTableCsv, type WriteTableOptions } from "./write.ts";
export { adultSeverityBySex, gradeTable, type SeverityChoice } from "./grade.ts";
