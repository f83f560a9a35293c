/**
 * The result shapes of the agreement statistics, types only, so that their displays read them
 * without importing any computation.
 *
 * @module
 */
import type { MimeBundle, Quantity } from "../core/types.ts";
import type { Interval } from "../uncertainty/types.ts";
import type { JUPYTER_DISPLAY } from "../../display/mime.ts";

/** What was measured, for the labels and units of displays: a quantity, or any label and unit
 * (only these two are kept in results). */
export type Measured = Pick<Quantity, "label" | "unit">;

/** Regression of the differences on the means (check for proportional bias). */
export interface ProportionalBias {
  /** Slope of difference on mean (0 when there is no proportional bias). */
  readonly slope: number;
  /** Intercept (units of the measurement). */
  readonly intercept: number;
  /** Standard error of the slope. */
  readonly slopeStandardError: number;
  /** Confidence interval of the slope, t with n − 2 degrees of freedom. */
  readonly slopeCi: Interval;
  /** Two-sided p-value of the t test of slope = 0. */
  readonly pValue: number;
}

/** One limit of agreement with its confidence intervals. */
export interface LimitOfAgreement {
  /** The limit: bias ∓ multiplier · SD. */
  readonly value: number;
  /** Approximate interval: limit ± t · SE, SE² = s²(1/n + z²/(2(n − 1))) (Bland & Altman 1999). */
  readonly approximateCi: Interval;
  /** Exact interval from the non-central t distribution (Carkeet 2015). */
  readonly exactCi: Interval;
}

/** Result of {@linkcode blandAltman}. */
export interface BlandAltmanResult {
  /** Number of pairs. */
  readonly n: number;
  /** Differences a − b, in input order. */
  readonly differences: readonly number[];
  /** Means (a + b)/2, in input order. */
  readonly means: readonly number[];
  /** Mean difference a − b. */
  readonly bias: number;
  /** Confidence interval of the bias: bias ± t_{n−1} · s/√n. */
  readonly biasCi: Interval;
  /** Standard deviation of the differences (n − 1 denominator). */
  readonly sdDifferences: number;
  /** Multiplier used for the limits. */
  readonly multiplier: number;
  /** Confidence level of the intervals. */
  readonly confidence: number;
  /** Lower limit of agreement, bias − multiplier · SD. */
  readonly lowerLimit: LimitOfAgreement;
  /** Upper limit of agreement, bias + multiplier · SD. */
  readonly upperLimit: LimitOfAgreement;
  /** Regression of differences on means; null when fewer than 3 pairs or constant means. */
  readonly proportionalBias: ProportionalBias | null;
  /** What was measured (label and unit), when stated. */
  readonly quantity: Measured | null;
  /** Names of method A and method B. */
  readonly methodNames: readonly [string, string];
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: the table of bias and limits with their intervals. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Result of {@linkcode blandAltmanRatio}. */
export interface BlandAltmanRatioResult {
  /** What was measured (label and unit), when stated. */
  readonly quantity: Measured | null;
  /** The analysis of ln(a) − ln(b) (bias and limits in natural-log units). */
  readonly log: BlandAltmanResult;
  /** Geometric mean ratio a/b = exp(bias), with its interval. */
  readonly ratio: { readonly value: number; readonly ci: Interval };
  /** Limits of agreement for the ratio a/b, exp of the log limits (with exact intervals). */
  readonly lowerRatioLimit: {
    readonly value: number;
    readonly exactCi: Interval;
    readonly approximateCi: Interval;
  };
  /** Upper ratio limit, as {@linkcode BlandAltmanRatioResult.lowerRatioLimit}. */
  readonly upperRatioLimit: {
    readonly value: number;
    readonly exactCi: Interval;
    readonly approximateCi: Interval;
  };
  /** Notebook display: the ratio and its limits with their intervals. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Result of {@linkcode blandAltmanRepeated}. */
export interface BlandAltmanRepeatedResult {
  /** Number of subjects. */
  readonly subjects: number;
  /** Number of pairs (all subjects). */
  readonly pairs: number;
  /** Mean of all differences a − b. */
  readonly bias: number;
  /** Between-subject variance component of the differences (truncated at 0). */
  readonly betweenSubjectVariance: number;
  /** Within-subject variance of the differences (one-way ANOVA residual mean square). */
  readonly withinSubjectVariance: number;
  /** SD of a single difference: √(between + within). */
  readonly sdDifferences: number;
  /** Multiplier used. */
  readonly multiplier: number;
  /** bias − multiplier · SD. */
  readonly lowerLimit: number;
  /** bias + multiplier · SD. */
  readonly upperLimit: number;
  /** What was measured (label and unit), when stated. */
  readonly quantity: Measured | null;
  /** Names of method A and method B. */
  readonly methodNames: readonly [string, string];
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: bias, variance components and limits. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Result of {@linkcode repeatability}. */
export interface RepeatabilityResult {
  /** Number of subjects. */
  readonly subjects: number;
  /** Number of readings. */
  readonly readings: number;
  /** Degrees of freedom of s_w: Σ(mᵢ − 1). */
  readonly degreesOfFreedom: number;
  /** Within-subject SD s_w (units of the measurement). */
  readonly withinSubjectSd: number;
  /** χ² interval of s_w. */
  readonly withinSubjectSdCi: Interval;
  /** Multiplier used. */
  readonly multiplier: number;
  /** Confidence level of the intervals. */
  readonly confidence: number;
  /** Repeatability coefficient z·√2·s_w: two readings on one subject differ by less than this
   * for about 95 % of pairs (z = 1.96). */
  readonly repeatabilityCoefficient: number;
  /** Interval of the coefficient (the s_w interval scaled). */
  readonly repeatabilityCoefficientCi: Interval;
  /** Within-subject coefficient of variation by the root-mean-square method, as a fraction;
   * null when a subject mean is ≤ 0 (the CV is then undefined). */
  readonly withinSubjectCv: number | null;
  /** What was measured (label and unit), when stated. */
  readonly quantity: Measured | null;
  /** Notebook display: s_w, the repeatability coefficient and the CV with their intervals. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** One intraclass correlation form. */
export interface IntraclassCorrelation {
  /** Shrout & Fleiss name, e.g. "ICC(2,1)". */
  readonly form: "ICC(1,1)" | "ICC(2,1)" | "ICC(3,1)" | "ICC(1,k)" | "ICC(2,k)" | "ICC(3,k)";
  /** McGraw & Wong name, e.g. "ICC(A,1)". */
  readonly mcGrawWong: "ICC(1)" | "ICC(k)" | "ICC(A,1)" | "ICC(A,k)" | "ICC(C,1)" | "ICC(C,k)";
  /** Model in words. */
  readonly model: string;
  /** "single" (one rater's reading) or "average" (mean of the k raters). */
  readonly unit: "single" | "average";
  /** "absolute agreement" or "consistency". */
  readonly definition: "absolute agreement" | "consistency";
  /** Point estimate. */
  readonly value: number;
  /** F-based confidence interval. */
  readonly ci: Interval;
  /** F statistic of the test ICC = 0. */
  readonly f: number;
  /** Numerator degrees of freedom of the F test. */
  readonly df1: number;
  /** Denominator degrees of freedom. */
  readonly df2: number;
  /** p-value of the F test (upper tail). */
  readonly pValue: number;
}

/** Result of {@linkcode intraclassCorrelations}. */
export interface IntraclassCorrelationResult {
  /** Number of subjects (rows). */
  readonly subjects: number;
  /** Number of raters or methods (columns). */
  readonly raters: number;
  /** Mean squares: between subjects, between raters, residual, within subjects (one-way). */
  readonly meanSquares: {
    readonly subjects: number;
    readonly raters: number;
    readonly residual: number;
    readonly within: number;
  };
  /** Confidence level. */
  readonly confidence: number;
  /** The six forms in the order ICC(1,1), ICC(2,1), ICC(3,1), ICC(1,k), ICC(2,k), ICC(3,k). */
  readonly forms: readonly IntraclassCorrelation[];
  /** What was measured (label and unit), when stated. */
  readonly quantity: Measured | null;
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: the six forms with intervals and F tests. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Result of {@linkcode concordanceCorrelation}. */
export interface ConcordanceResult {
  /** Number of pairs. */
  readonly n: number;
  /** Concordance correlation coefficient ρ_c. */
  readonly value: number;
  /** Interval from Fisher's z-transform of ρ_c. */
  readonly ci: Interval;
  /** Confidence level. */
  readonly confidence: number;
  /** Pearson correlation r (precision). */
  readonly pearson: number;
  /** Bias-correction factor C_b = ρ_c / r (accuracy). */
  readonly biasCorrectionFactor: number;
  /** Location shift u = (x̄ − ȳ)/√(s_x s_y). */
  readonly locationShift: number;
  /** Scale shift v = s_x/s_y. */
  readonly scaleShift: number;
  /** What was measured (label and unit), when stated. */
  readonly quantity: Measured | null;
  /** Names of methods X and Y. */
  readonly methodNames: readonly [string, string];
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: ρ_c with its interval, precision and accuracy parts. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** A fitted line y = intercept + slope · x with intervals. */
export interface FittedLine {
  /** Number of pairs. */
  readonly n: number;
  /** Slope. */
  readonly slope: number;
  /** Interval of the slope. */
  readonly slopeCi: Interval;
  /** Intercept (units of y). */
  readonly intercept: number;
  /** Interval of the intercept. */
  readonly interceptCi: Interval;
  /** Confidence level. */
  readonly confidence: number;
  /** What was measured (label and unit), when stated: the unit of the intercept. */
  readonly quantity: Measured | null;
  /** Names of methods X and Y. */
  readonly methodNames: readonly [string, string];
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: slope and intercept with their intervals. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Result of {@linkcode demingRegression}. */
export interface DemingResult extends FittedLine {
  /** Brand: which regression. */
  readonly method: "Deming";
  /** Error variance ratio used. */
  readonly errorVarianceRatio: number;
  /** Jackknife standard error of the slope. */
  readonly slopeStandardError: number;
  /** Jackknife standard error of the intercept. */
  readonly interceptStandardError: number;
}

/** Result of {@linkcode generalDemingRegression}: Deming regression where each reading has its
 * own standard deviation. */
export interface GeneralDemingResult extends FittedLine {
  /** Brand: which regression. */
  readonly method: "General Deming";
  /** Jackknife standard error of the slope. */
  readonly slopeStandardError: number;
  /** Jackknife standard error of the intercept. */
  readonly interceptStandardError: number;
  /** Weighted sum of squared distances to the line, S = Σ Wᵢ (yᵢ − a − b·xᵢ)². */
  readonly chiSquare: number;
  /** S / (n − 2): about 1 when the stated SDs describe the scatter. */
  readonly mswd: number;
}

/** Result of {@linkcode yorkRegression}: the best straight line when each point has its own,
 * possibly correlated, uncertainties in x and y. */
export interface YorkResult extends FittedLine {
  /** Brand: which regression. */
  readonly method: "York";
  /** Standard error of the slope from the stated uncertainties (York et al. 2004). */
  readonly slopeStandardError: number;
  /** Standard error of the intercept from the stated uncertainties (York et al. 2004). */
  readonly interceptStandardError: number;
  /** Covariance of slope and intercept from the stated uncertainties. */
  readonly slopeInterceptCovariance: number;
  /** Weighted sum of squared residuals S = Σ Wᵢ (yᵢ − a − b·xᵢ)², χ² with n − 2 degrees of
   * freedom when the stated uncertainties are right. */
  readonly chiSquare: number;
  /** Degrees of freedom of S: n − 2. */
  readonly degreesOfFreedom: number;
  /** Mean square of weighted deviations, S / (n − 2). */
  readonly mswd: number;
  /** Probability of a χ² at least as large as S (small: the stated uncertainties understate the
   * scatter). */
  readonly fitPValue: number;
  /** How the intervals were made: from the stated uncertainties (normal quantile) when MSWD ≤ 1,
   * or with the standard errors multiplied by √MSWD and the t quantile on n − 2 degrees of freedom
   * when the scatter exceeds them. */
  readonly intervalBasis: "stated uncertainties" | "scaled by √MSWD";
  /** Iterations of the slope until it converged. */
  readonly iterations: number;
}

/** Result of {@linkcode passingBablokRegression}. */
export interface PassingBablokResult extends FittedLine {
  /** Brand: which regression. */
  readonly method: "Passing–Bablok";
  /** Number of pairwise slopes used (pairs with equal x and y, or slope −1, are left out). */
  readonly slopesUsed: number;
  /** Cusum linearity check (Passing & Bablok 1983 §4). */
  readonly linearity: {
    /** max |cusum| / √(L + 1), L = number of points below the line. */
    readonly statistic: number;
    /** Critical value 1.36 (Kolmogorov–Smirnov, α = 0.05). */
    readonly criticalValue: number;
    /** True when the statistic exceeds the critical value (deviation from linearity). */
    readonly nonLinear: boolean;
  };
}

/** Any of the method-comparison regressions (what their displays and charts accept). */
export type RegressionResult =
  | DemingResult
  | GeneralDemingResult
  | YorkResult
  | PassingBablokResult;

/** Agreement weights for ordered categories. */
export type KappaWeights = "none" | "linear" | "quadratic";

/** Result of {@linkcode cohenKappa} and {@linkcode cohenKappaFromTable}. */
export interface CohenKappaResult {
  /** Number of subjects rated by both raters. */
  readonly n: number;
  /** Weights used. */
  readonly weights: KappaWeights;
  /** Categories in table order (rows: rater A, columns: rater B). */
  readonly categories: readonly string[];
  /** The c × c table of counts. */
  readonly table: readonly (readonly number[])[];
  /** Observed (weighted) agreement p_o. */
  readonly observedAgreement: number;
  /** Agreement expected by chance p_e. */
  readonly expectedAgreement: number;
  /** κ = (p_o − p_e)/(1 − p_e). */
  readonly kappa: number;
  /** Large-sample standard error of κ (for the interval; Fleiss, Cohen & Everitt 1969). */
  readonly standardError: number;
  /** Standard error under κ = 0 (for the test). */
  readonly standardErrorNull: number;
  /** κ ± z·SE, clipped to [−1, 1]. */
  readonly ci: Interval;
  /** Confidence level. */
  readonly confidence: number;
  /** z = κ / SE₀. */
  readonly z: number;
  /** Two-sided p-value of κ = 0. */
  readonly pValue: number;
  /** What was rated (its label), when stated. */
  readonly quantity: Measured | null;
  /** Names of rater A and rater B. */
  readonly raterNames: readonly [string, string];
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: κ with its interval and the table of counts. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Result of {@linkcode fleissKappa}. */
export interface FleissKappaResult {
  /** Number of subjects. */
  readonly subjects: number;
  /** Ratings per subject (m). */
  readonly ratersPerSubject: number;
  /** Mean observed agreement P̄. */
  readonly observedAgreement: number;
  /** Chance agreement P̄_e = Σ p_j². */
  readonly expectedAgreement: number;
  /** κ = (P̄ − P̄_e)/(1 − P̄_e). */
  readonly kappa: number;
  /** Standard error under κ = 0 (Fleiss, Nee & Landis 1979). */
  readonly standardErrorNull: number;
  /** z = κ/SE₀. */
  readonly z: number;
  /** Two-sided p-value of κ = 0. */
  readonly pValue: number;
  /** What was rated (its label), when stated. */
  readonly quantity: Measured | null;
  /** Category labels in column order ("1".."c" when not given). */
  readonly categories: readonly string[];
  /** Cautions for reading the result. */
  readonly cautions: readonly string[];
  /** Notebook display: κ with its null standard error and test. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** A reading whose value cell is empty: listed, and left out of every statistic. */
export interface MissingReading {
  /** Subject identifier. */
  readonly subject: string;
  /** Observer or method. */
  readonly observer: string;
  /** Replicate number. */
  readonly replicate: number;
  /** The 1-based line of the file. */
  readonly line: number;
}
