/**
 * Severity grading against guideline tables held as data: the class of a value, or the
 * probability of each class for an uncertain value (Monte Carlo samples, or the normal
 * distribution of a GUM result), each result with its table's citations, its "from memory" mark
 * where it applies and the clinical caution.
 *
 * @module
 */
export {
  type ClassProbability,
  defineSeverityTable,
  gradeSeverity,
  type SeverityBand,
  type SeverityDistribution,
  type SeverityGrade,
  type SeverityResultBase,
  type SeverityTable,
} from "./grade.ts";
