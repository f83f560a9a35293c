/**
 * Uncertainty: inputs with distributions, the GUM law (JCGM 100:2008), Monte Carlo
 * (JCGM 101:2008), expression models, and reporting.
 *
 * @module
 */
export * from "./inputs.ts";
export { correlationFromReadings, type CorrelationPair, type Correlations } from "./correlation.ts";
export { type UncertainInputs } from "./prepare.ts";
export { type BudgetRow, gum, type GumOptions, type GumOutput, type GumResult } from "./gum.ts";
export {
  type AdaptiveOptions,
  type AdaptiveResult,
  coverageIntervals,
  DEFAULT_SEED,
  DEFAULT_TRIALS,
  type GumValidation,
  monteCarlo,
  monteCarloAdaptive,
  type MonteCarloOptions,
  type MonteCarloOutput,
  type MonteCarloResult,
  validateGumWithMonteCarlo,
} from "./montecarlo.ts";
export { expressionModel, type ExpressionModelSpec } from "./expression.ts";
export { numericalTolerance, roundForReport } from "./rounding.ts";
export { formatGumOutput } from "./display.ts";
export { type RandomStream, randomStream } from "./random.ts";
export { createMonteCarloPool, type MonteCarloPool, type MonteCarloPoolOptions } from "./pool.ts";
