/**
 * The one-definition architecture: types, definition, validated evaluation, units.
 *
 * @module
 */
export type {
  Calculation,
  CalculationSpec,
  InputDefinition,
  InputsOf,
  InputValues,
  OutputDefinition,
  OutputsOf,
  OutputValues,
  Reference,
  ValueRange,
} from "./types.ts";
export {
  CLINICAL_CAUTION,
  cautionsOf,
  defineCalculation,
  evaluate,
  type Evaluation,
  formatRange,
  inRange,
  type InputArguments,
  isCalculation,
  validateInputs,
} from "./define.ts";
export { math, type QuantityInput, toCanonical } from "./units.ts";
export { JUPYTER_DISPLAY, type MimeBundle } from "./display.ts";
