/**
 * The one-definition architecture: quantities, calculations, the one validator, evaluation,
 * chains, families, the catalog, units and sensitivity curves.
 *
 * @module
 */
export type {
  Calculation,
  Citation,
  Evaluation,
  InputConstraint,
  InputDefinition,
  InputSchema,
  InputsOf,
  InputValues,
  IssueKind,
  MimeBundle,
  OutputDefinition,
  OutputsOf,
  OutputValues,
  Population,
  Quantity,
  Recipe,
  ValidationIssue,
  ValueRange,
} from "./types.ts";
export {
  defineQuantity,
  headerMatches,
  isQuantity,
  normalizeHeader,
  type QuantitySpec,
  typicalRange,
} from "./quantity.ts";
export { closedBounds, countOutside, formatRange, inRange, rangeWithin } from "./range.ts";
export { describeValue, formatCitation, formatUnit, withUnit } from "./text.ts";
export {
  type CalculationSpec,
  cautionsOf,
  CLINICAL_CAUTION,
  defineArguments,
  defineCalculation,
  type InlineInput,
  type InlineOutput,
  type InputRole,
  type InputSpec,
  isCalculation,
  notAbove,
  type OutputRole,
  type OutputSpec,
  recalledSourceCautions,
} from "./calculation.ts";
export {
  choiceError,
  InputRangeError,
  InputTypeError,
  issueError,
  renderIssue,
  throwIfErrors,
} from "./issues.ts";
export {
  checkConstraints,
  type CheckContext,
  type CheckedField,
  type CheckedValue,
  checkInputs,
  checkValue,
  quantityField,
  relationText,
  validateInputs,
  type ValidateOptions,
} from "./validate.ts";
export { checkOutputs, evaluate, type EvaluateOptions, type InputArguments } from "./evaluate.ts";
export { chain, type Chained, type ChainOptions, type ChainStep } from "./chain.ts";
export { defineFamily, type Family, type FamilySpec } from "./family.ts";
export {
  type Catalog,
  catalogCalculations,
  type CatalogSpec,
  combineCatalogs,
  defineCatalog,
  fingerprint,
  rebuild,
} from "./catalog.ts";
export {
  type AmountProblem,
  type MathJsUnit,
  type QuantityInput,
  readAmount,
  toCanonical,
} from "./units.ts";
export {
  type SensitivityCurve,
  sensitivityCurve,
  type SensitivityOptions,
  type SensitivityPoint,
} from "./sensitivity.ts";
export { relativeChangePercent } from "./relative_change.ts";
export { calculationMarkdown, catalogMarkdown } from "./docs.ts";
export { evaluateColumns } from "./columns.ts";
