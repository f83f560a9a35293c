/**
 * Method-validation statistics: agreement between methods (Bland–Altman, concordance, Deming and
 * Passing–Bablok regression), reproducibility (repeatability, intraclass correlation) and
 * agreement on graded findings (Cohen's and Fleiss' kappa), with the distributions they need.
 *
 * @module
 */
export { nonCentralTCdf, nonCentralTQuantile } from "./noncentral_t.ts";
export {
  blandAltman,
  type BlandAltmanOptions,
  blandAltmanRatio,
  type BlandAltmanRatioResult,
  blandAltmanRepeated,
  type BlandAltmanRepeatedResult,
  type BlandAltmanResult,
  type LimitOfAgreement,
  type ProportionalBias,
} from "./bland_altman.ts";
export {
  repeatability,
  type RepeatabilityOptions,
  type RepeatabilityResult,
} from "./repeatability.ts";
export {
  type IntraclassCorrelation,
  type IntraclassCorrelationResult,
  intraclassCorrelations,
} from "./icc.ts";
export { concordanceCorrelation, type ConcordanceResult } from "./concordance.ts";
export {
  type DemingOptions,
  demingRegression,
  type DemingResult,
  type FittedLine,
  passingBablokRegression,
  type PassingBablokResult,
} from "./regression.ts";
export {
  cohenKappa,
  cohenKappaFromTable,
  type CohenKappaOptions,
  type CohenKappaResult,
  fleissKappa,
  type FleissKappaResult,
  type KappaWeights,
} from "./kappa.ts";
