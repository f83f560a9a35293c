/**
 * Transitional re-exports while the domains move to the display modules: import from
 * display/ instead.
 *
 * @module
 */
export {
  escapeHtml,
  htmlNotes,
  htmlTable,
  JUPYTER_DISPLAY,
  type MimeBundle,
  textTable,
} from "../../display/mime.ts";
export { formatNumber } from "../../display/format.ts";
export { formatUnit } from "./text.ts";
export { displayEvaluation, type TableDisplay, tableDisplay } from "../../display/results.ts";
