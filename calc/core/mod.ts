/**
 * The one-definition architecture: types, definition, validated evaluation, units.
 *
 * @module
 */
export type {
  Calculation,
  CalculationSpec,
  InputConstraint,
  InputDefinition,
  InputSchema,
  InputsOf,
  InputValues,
  OutputDefinition,
  OutputsOf,
  OutputValues,
  Reference,
  ValueRange,
} from "./types.ts";
export {
  cautionsOf,
  CLINICAL_CAUTION,
  defineCalculation,
  evaluate,
  type Evaluation,
  formatRange,
  type InputArguments,
  inRange,
  isCalculation,
  notAbove,
  validateInputs,
} from "./define.ts";
export { type MathJsUnit, type QuantityInput, toCanonical } from "./units.ts";
export { JUPYTER_DISPLAY, type MimeBundle } from "./display.ts";
export {
  type SensitivityCurve,
  sensitivityCurve,
  type SensitivityOptions,
  type SensitivityPoint,
} from "./sensitivity.ts";
export { calculationsOf, formatReference, referenceMarkdown } from "./reference_docs.ts";
export {
  escapeHtml,
  formatNumber,
  formatUnit,
  htmlNotes,
  htmlTable,
  type TableDisplay,
  tableDisplay,
  textTable,
} from "./display.ts";
export { evaluateColumns } from "./kernel.ts";
