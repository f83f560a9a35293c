/**
 * Transitional re-exports while the domains move to quantities: import from calculation.ts,
 * evaluate.ts, range.ts and validate.ts instead.
 *
 * @module
 */
export {
  type CalculationSpec,
  cautionsOf,
  CLINICAL_CAUTION,
  defineArguments,
  defineCalculation,
  type InlineInput,
  isCalculation,
  notAbove,
} from "./calculation.ts";
export { checkOutputs, evaluate, type InputArguments } from "./evaluate.ts";
export type { Evaluation } from "./types.ts";
export { formatRange, inRange } from "./range.ts";
export { checkConstraints, validateInputs } from "./validate.ts";
