/**
 * Uncertainty: input distributions, elementary sources, the one propagation entry point (the GUM
 * law of JCGM 100 or Monte Carlo of JCGM 101), uncertain values that chain, the worker pool,
 * expression models and reporting.
 *
 * @module
 */
export type {
  AdaptiveSummary,
  BudgetRow,
  DistributionKind,
  Interval,
  Propagation,
  ResolvedDistribution,
  Source,
  SourceSet,
  TrialLayout,
  UncertainValue,
} from "./types.ts";
export {
  type Amount,
  arcsine,
  type ArcsineInput,
  type ConeInput,
  distributionInterval,
  exact,
  exactDistribution,
  type ExactInput,
  type InputEstimate,
  insonationCone,
  isUncertainInput,
  normal,
  type NormalInput,
  rectangular,
  rectangularHalfWidth,
  type RectangularInput,
  resolveDistribution,
  studentT,
  type StudentTInput,
  triangular,
  type TriangularInput,
  typeA,
  type UncertainInput,
} from "./distributions.ts";
export { correlationFromReadings, type CorrelationPair, type Correlations } from "./correlation.ts";
export { type UncertainArgument, type UncertainInputs } from "./prepare.ts";
export {
  keyWords,
  linearCovariance,
  mergeSources,
  sourceKey,
  welchSatterthwaite,
} from "./sources.ts";
export { correlation, covariance, isUncertainValue } from "./uncertain_value.ts";
export {
  type MonteCarloProgress,
  propagate,
  propagateInSteps,
  type PropagateOptions,
} from "./propagate.ts";
export { type AdaptiveOptions } from "./adaptive.ts";
export { DEFAULT_SEED, DEFAULT_TRIALS } from "./monte_carlo.ts";
export { coverageIntervals, sampleCovariance } from "./intervals.ts";
export { type GumValidation, validateGumWithMonteCarlo } from "./gum_validation.ts";
export { expressionModel, type ExpressionModelSpec } from "./expression.ts";
export { numericalTolerance } from "./rounding.ts";
export { type RandomStream, randomStream } from "./random.ts";
export { createMonteCarloPool, type MonteCarloPool, type MonteCarloPoolOptions } from "./pool.ts";
export { densityHistogram, gumDensity, type HistogramBar, histogramRange } from "./histogram.ts";
