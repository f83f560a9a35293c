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
  budgetRows,
  displayPropagation,
  displayValue,
  formatUncertainValue,
  labelWithUnit,
} from "./uncertainty.ts";
export { displayEvaluation, type TableDisplay, tableDisplay } from "./results.ts";
export { columnHeader, displayTable, reportedCell } from "./table.ts";
export { displayZScore } from "./reference.ts";
export * from "./physics.ts";
export * from "./grading.ts";
export * from "./chamber.ts";
export * from "./agreement.ts";
export * from "./method_validation.ts";
