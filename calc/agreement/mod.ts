/**
 * Method-validation statistics: agreement between methods (Bland–Altman, concordance, Deming and
 * Passing–Bablok regression), reproducibility (repeatability, intraclass correlation) and
 * agreement on graded findings (Cohen's and Fleiss' kappa), with the distributions they need;
 * and the method-validation analysis of a whole table, returning a report object.
 *
 * @module
 */
export type { Interval, LabelOptions } from "./checks.ts";
export type {
  BlandAltmanRatioResult,
  BlandAltmanRepeatedResult,
  BlandAltmanResult,
  CohenKappaResult,
  ConcordanceResult,
  DemingResult,
  FittedLine,
  FleissKappaResult,
  GeneralDemingResult,
  IntraclassCorrelation,
  IntraclassCorrelationResult,
  KappaWeights,
  LimitOfAgreement,
  Measured,
  MissingReading,
  PassingBablokResult,
  ProportionalBias,
  RegressionResult,
  RepeatabilityResult,
  YorkResult,
} from "./types.ts";
export { nonCentralTCdf, nonCentralTQuantile } from "./noncentral_t.ts";
export {
  blandAltman,
  type BlandAltmanOptions,
  blandAltmanRatio,
  blandAltmanRepeated,
} from "./bland_altman.ts";
export { repeatability, type RepeatabilityOptions } from "./repeatability.ts";
export { type IntraclassCorrelationOptions, intraclassCorrelations } from "./icc.ts";
export { concordanceCorrelation, type ConcordanceOptions } from "./concordance.ts";
export {
  type DemingOptions,
  demingRegression,
  type GeneralDemingOptions,
  generalDemingRegression,
  type PassingBablokOptions,
  passingBablokRegression,
  PER_POINT_SD_CAUTION,
  type RegressionOptions,
  type YorkOptions,
  yorkRegression,
} from "./regression.ts";
export {
  cohenKappa,
  cohenKappaFromTable,
  type CohenKappaOptions,
  fleissKappa,
  type FleissKappaOptions,
} from "./kappa.ts";
export {
  AGREEMENT_NOT_A_DIAGNOSIS,
  ERROR_RATIO_CAUTION,
  KAPPA_CAUTION,
  LIMITS_OF_AGREEMENT_CAUTION,
  NO_INTERVALS_CAUTION,
  SAMPLE_CAUTION,
  SUBJECT_SPREAD_CAUTION,
} from "./cautions.ts";
export {
  statedColumnQuantity,
  statedQuantity,
  type StatedQuantityOptions,
  type ValidationColumns,
  validationColumns,
  type ValidationDesignOptions,
  validationReadOptions,
} from "./validation_columns.ts";
export {
  type GradedReadings,
  type MeasuredReadings,
  type PairedReadings,
  pairedReadings,
  type Reading,
  type StudyReadings,
  type ValidationReadings,
  validationReadings,
} from "./validation_table.ts";
export { methodValidation, type MethodValidationOptions, NO_VERDICT } from "./method_validation.ts";
export type {
  DataSummary,
  FigurePlan,
  IccAnalysis,
  KappaAnalysis,
  KappaPair,
  MethodComparison,
  MethodValidationReport,
  ObserverRepeatability,
  ObserverSummary,
  Outcome,
  Provenance,
  ProvenanceDetails,
  StudyDescription,
} from "./report_types.ts";
