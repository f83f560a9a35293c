/**
 * Presentation: the one formatting module (metrology rounding), notebook MIME bundles and the
 * displays of results. Computation never depends on how a result is shown, except to attach
 * its notebook display.
 *
 * @module
 */
export {
  escapeHtml,
  htmlNotes,
  htmlTable,
  JUPYTER_DISPLAY,
  type MimeBundle,
  tableBundle,
  textTable,
} from "./mime.ts";
export {
  formatCount,
  formatInterval,
  formatNumber,
  formatPlusMinus,
  formatResolution,
  formatShare,
  NOT_MEASURED,
  roundForReport,
  roundLike,
} from "./format.ts";
export {
  BUDGET_HEADER,
  budgetRows,
  displayPropagation,
  displayValue,
  formatDof,
  formatUncertainValue,
  labelWithUnit,
} from "./uncertainty.ts";
export {
  type BudgetExport,
  budgetExport,
  type BudgetExportOptions,
  budgetLatex,
  budgetMarkdown,
  latexText,
} from "./budget_export.ts";
export { displayEvaluation, type TableDisplay, tableDisplay } from "./results.ts";
export { columnHeader, displayTable, reportedCell } from "./table.ts";
export {
  displayNormalLimits,
  displayZScore,
  displayZScoreComparison,
  formatZScore,
} from "./reference.ts";
export { displayGumValidation, displaySensitivityCurve } from "./sensitivity.ts";
export {
  formatMonteCarloProgress,
  type NotebookMessage,
  notebookProgress,
  type ProgressOptions,
  terminalProgress,
} from "./progress.ts";
export * from "./physics.ts";
export * from "./grading.ts";
export * from "./chamber.ts";
export * from "./agreement.ts";
export * from "./method_validation.ts";
