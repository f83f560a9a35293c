/**
 * Bland–Altman analysis of agreement between two methods of measurement: bias, limits of
 * agreement with approximate and exact confidence intervals, proportional-bias regression, the
 * ratio (log) variant and the variant for several paired readings per subject.
 *
 * @module
 */
import {
  checkConfidence,
  checkMultiplier,
  checkPairs,
  displayed,
  type Interval,
  type LabelOptions,
  mean,
  measuredOf,
  namesOf,
  shown,
  sumSquares,
} from "./checks.ts";
import { tCdf, tQuantile } from "../stats/distributions.ts";
import { nonCentralTQuantile } from "./noncentral_t.ts";
import { LIMITS_OF_AGREEMENT_CAUTION, NO_INTERVALS_CAUTION } from "./cautions.ts";
import {
  displayBlandAltman,
  displayBlandAltmanRatio,
  displayBlandAltmanRepeated,
} from "../../display/agreement.ts";
import type {
  BlandAltmanRatioResult,
  BlandAltmanRepeatedResult,
  BlandAltmanResult,
  LimitOfAgreement,
  ProportionalBias,
} from "./types.ts";
import type { Measured } from "./types.ts";

export type { Interval } from "./checks.ts";

/** Options of {@linkcode blandAltman}. */
export interface BlandAltmanOptions extends LabelOptions {
  /** Multiplier of the SD of differences for the limits of agreement: 1.96 (95 % limits under
   * normality) or 2 (as in Bland & Altman 1986); any value in (0, 5] is accepted.
   * @default 1.96 */
  readonly multiplier?: number;
  /** Confidence level of the intervals. @default 0.95 */
  readonly confidence?: number;
  /** Names of method A (minuend) and method B (subtrahend), for the display.
   * @default ["A", "B"] */
  readonly methodNames?: readonly [string, string];
}

const WHERE = "Bland-Altman analysis";

/** Ordinary least squares of y on x with slope inference; null when x is constant or n < 3. */
function regressSlope(
  x: readonly number[],
  y: readonly number[],
  confidence: number,
): ProportionalBias | null {
  const n = x.length;
  if (n < 3) return null;
  const mx = mean(x);
  const my = mean(y);
  const sxx = sumSquares(x, mx);
  if (!(sxx > 0)) return null;
  let sxy = 0;
  for (let i = 0; i < n; i++) sxy += (x[i]! - mx) * (y[i]! - my);
  const slope = sxy / sxx;
  const intercept = my - slope * mx;
  let sse = 0;
  for (let i = 0; i < n; i++) sse += (y[i]! - intercept - slope * x[i]!) ** 2;
  const se = Math.sqrt(sse / (n - 2) / sxx);
  const tq = tQuantile(0.5 + confidence / 2, n - 2);
  const pValue = se > 0 ? 2 * (1 - tCdf(Math.abs(slope / se), n - 2)) : slope === 0 ? 1 : 0;
  return {
    slope,
    intercept,
    slopeStandardError: se,
    slopeCi: { lower: slope - tq * se, upper: slope + tq * se },
    pValue,
  };
}

/** Limits with both kinds of interval, from summary statistics. */
function limitsFromSummary(
  bias: number,
  sd: number,
  n: number,
  multiplier: number,
  confidence: number,
): { lower: LimitOfAgreement; upper: LimitOfAgreement } {
  const tq = tQuantile(0.5 + confidence / 2, n - 1);
  const seLimit = sd * Math.sqrt(1 / n + multiplier ** 2 / (2 * (n - 1)));
  const delta = multiplier * Math.sqrt(n);
  const kLow = nonCentralTQuantile(0.5 - confidence / 2, n - 1, delta) / Math.sqrt(n);
  const kHigh = nonCentralTQuantile(0.5 + confidence / 2, n - 1, delta) / Math.sqrt(n);
  const lowerValue = bias - multiplier * sd;
  const upperValue = bias + multiplier * sd;
  return {
    lower: {
      value: lowerValue,
      approximateCi: { lower: lowerValue - tq * seLimit, upper: lowerValue + tq * seLimit },
      exactCi: { lower: bias - kHigh * sd, upper: bias - kLow * sd },
    },
    upper: {
      value: upperValue,
      approximateCi: { lower: upperValue - tq * seLimit, upper: upperValue + tq * seLimit },
      exactCi: { lower: bias + kLow * sd, upper: bias + kHigh * sd },
    },
  };
}

/**
 * Bland–Altman analysis of two methods measured once on the same subjects.
 *
 * Formulas: dᵢ = aᵢ − bᵢ; bias = d̄; s = SD(d) (n − 1); limits = d̄ ∓ z·s with z the multiplier.
 * Bias CI: d̄ ± t_{n−1}·s/√n. Approximate limit CI: limit ± t_{n−1}·s·√(1/n + z²/(2(n − 1)))
 * (Bland & Altman 1999 §2.2; the 1986 paper used the simplification s·√(3/n) for z ≈ 2).
 * Exact limit CI (Carkeet 2015): upper limit d̄ + s·[t′_{α/2}, t′_{1−α/2}]/√n, with t′_p the p
 * quantile of the non-central t with n − 1 degrees of freedom and non-centrality z·√n; the
 * lower limit mirrors it. Proportional bias: least-squares slope of d on (a + b)/2 with its t
 * interval (Bland & Altman 1999 §3.2).
 *
 * Sources: Bland JM, Altman DG (1986) Statistical methods for assessing agreement between two
 * methods of clinical measurement. Lancet 327:307–310, doi:10.1016/S0140-6736(86)90837-8.
 * Bland JM, Altman DG (1999) Measuring agreement in method comparison studies. Stat Methods Med
 * Res 8:135–160, doi:10.1177/096228029900800204. Carkeet A (2015) Exact parametric confidence
 * intervals for Bland-Altman limits of agreement. Optom Vis Sci 92:e71–e80,
 * doi:10.1097/OPX.0000000000000513.
 *
 * @param methodA Readings by method A (units of the measurement), one per subject.
 * @param methodB Readings by method B on the same subjects, same order and units.
 * @param options Multiplier (1.96 default, or 2) and confidence level (0.95 default).
 * @returns Bias, SD, limits with approximate and exact intervals, proportional-bias regression.
 * @throws {TypeError} When an input is not an array of numbers or the arrays differ in length.
 * @throws {RangeError} For fewer than 2 pairs, a non-finite reading, all differences equal (zero
 * variance), a multiplier outside (0, 5] or a confidence outside (0, 1).
 *
 * @example Two methods on five subjects
 * ```ts
 * import { blandAltman } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = blandAltman([10, 12, 14, 16, 18], [9, 12, 13, 17, 16]);
 * assert.equal(r.bias, 0.6); // mean of 1, 0, 1, −1, 2
 * assert.ok(r.lowerLimit.exactCi.lower < r.lowerLimit.value);
 * ```
 */
export function blandAltman(
  methodA: readonly number[],
  methodB: readonly number[],
  options: BlandAltmanOptions = {},
): BlandAltmanResult {
  const [a, b] = checkPairs(WHERE, ["methodA", "methodB"], methodA, methodB);
  const multiplier = checkMultiplier(WHERE, options.multiplier ?? 1.96);
  const confidence = checkConfidence(WHERE, options.confidence ?? 0.95);
  const quantity = measuredOf(WHERE, options.quantity);
  const methodNames = namesOf(WHERE, "methodNames", options.methodNames, ["A", "B"]);
  const differences = a.map((v, i) => v - b[i]!);
  const means = a.map((v, i) => (v + b[i]!) / 2);
  return fromDifferences(differences, means, multiplier, confidence, quantity, methodNames);
}

function fromDifferences(
  differences: readonly number[],
  means: readonly number[],
  multiplier: number,
  confidence: number,
  quantity: Measured | null,
  methodNames: readonly [string, string],
): BlandAltmanResult {
  const n = differences.length;
  const bias = mean(differences);
  const sd = Math.sqrt(sumSquares(differences, bias) / (n - 1));
  if (!(sd > 0)) {
    throw new RangeError(
      `${WHERE}: expected differences that vary (zero variance makes limits meaningless), got SD ${sd}`,
    );
  }
  const tq = tQuantile(0.5 + confidence / 2, n - 1);
  const seBias = sd / Math.sqrt(n);
  const limits = limitsFromSummary(bias, sd, n, multiplier, confidence);
  return displayed({
    n,
    differences,
    means,
    bias,
    biasCi: { lower: bias - tq * seBias, upper: bias + tq * seBias },
    sdDifferences: sd,
    multiplier,
    confidence,
    lowerLimit: limits.lower,
    upperLimit: limits.upper,
    proportionalBias: regressSlope(means, differences, confidence),
    quantity,
    methodNames,
    cautions: [LIMITS_OF_AGREEMENT_CAUTION],
  }, displayBlandAltman);
}

/**
 * Bland–Altman analysis on the log scale, for differences that grow with the magnitude: the
 * analysis of ln a − ln b, back-transformed to ratios a/b.
 *
 * Formula: dᵢ = ln aᵢ − ln bᵢ; ratio = exp(d̄); ratio limits = exp(d̄ ∓ z·s); every interval is
 * the exp of the log-scale interval.
 *
 * Source: Bland JM, Altman DG (1999) Stat Methods Med Res 8:135–160 §3.3,
 * doi:10.1177/096228029900800204; Euser AM, Dekker FW, le Cessie S (2008) J Clin Epidemiol
 * 61:978–982, doi:10.1016/j.jclinepi.2007.11.003.
 *
 * @param methodA Readings by method A (> 0).
 * @param methodB Readings by method B (> 0), same subjects and order.
 * @param options As {@linkcode blandAltman}.
 * @returns The log-scale analysis and the ratio scale.
 * @throws {TypeError} As {@linkcode blandAltman}.
 * @throws {RangeError} As {@linkcode blandAltman}, and for a reading ≤ 0.
 *
 * @example
 * ```ts
 * import { blandAltmanRatio } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = blandAltmanRatio([20, 40, 80, 160], [10, 20, 40, 90]);
 * assert.ok(r.ratio.value > 1.9 && r.ratio.value < 2);
 * ```
 */
export function blandAltmanRatio(
  methodA: readonly number[],
  methodB: readonly number[],
  options: BlandAltmanOptions = {},
): BlandAltmanRatioResult {
  const where = "Bland-Altman ratio analysis";
  const [a, b] = checkPairs(where, ["methodA", "methodB"], methodA, methodB);
  a.forEach((v, i) => {
    if (!(v > 0)) {
      throw new RangeError(`${where}: expected 'methodA[${i}]' > 0 for logarithms, got ${v}`);
    }
  });
  b.forEach((v, i) => {
    if (!(v > 0)) {
      throw new RangeError(`${where}: expected 'methodB[${i}]' > 0 for logarithms, got ${v}`);
    }
  });
  const quantity = measuredOf(where, options.quantity);
  const { quantity: _stated, ...rest } = options;
  const log = blandAltman(a.map(Math.log), b.map(Math.log), {
    ...rest,
    ...(quantity ? { quantity: { label: `ln ${quantity.label}`, unit: "1" } } : {}),
  });
  const ex = (i: Interval): Interval => ({ lower: Math.exp(i.lower), upper: Math.exp(i.upper) });
  const limit = (l: LimitOfAgreement) => ({
    value: Math.exp(l.value),
    exactCi: ex(l.exactCi),
    approximateCi: ex(l.approximateCi),
  });
  return displayed({
    quantity,
    log,
    ratio: { value: Math.exp(log.bias), ci: ex(log.biasCi) },
    lowerRatioLimit: limit(log.lowerLimit),
    upperRatioLimit: limit(log.upperLimit),
  }, displayBlandAltmanRatio);
}

/**
 * Bland–Altman limits of agreement when each subject has several paired readings (a and b taken
 * together each time) and the true value may change between readings.
 *
 * Formulas (one-way ANOVA of the differences by subject; n subjects, N pairs, mᵢ pairs for
 * subject i): s²_w = MS_within; s²_b = (MS_between − MS_within)/λ with
 * λ = (N² − Σmᵢ²)/((n − 1)N), truncated at 0; SD = √(s²_b + s²_w); limits = d̄ ∓ z·SD where d̄ is
 * the mean of all N differences. Subjects with a single pair are used (they add to the
 * between-subject term only). Confidence intervals are not given: the 2007 paper gives none.
 *
 * Source: Bland JM, Altman DG (2007) Agreement between methods of measurement with multiple
 * observations per individual. J Biopharm Stat 17:571–582, doi:10.1080/10543400701329422
 * (section "true value varies").
 *
 * @param subjectIds Subject of each pair (strings or numbers).
 * @param methodA Reading by method A of each pair.
 * @param methodB Reading by method B of each pair.
 * @param options Multiplier (default 1.96).
 * @returns Bias, variance components, SD and limits.
 * @throws {TypeError} When the arrays differ in length or hold the wrong types.
 * @throws {RangeError} For fewer than 2 subjects, non-finite readings, no subject with two or
 * more pairs (no within-subject information) or differences with zero variance.
 *
 * @example Three subjects, two pairs each
 * ```ts
 * import { blandAltmanRepeated } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = blandAltmanRepeated(["p1", "p1", "p2", "p2", "p3", "p3"],
 *   [10, 11, 20, 21, 30, 33], [9, 11, 19, 19, 30, 30]);
 * // differences 1, 0, 1, 2, 0, 3: mean 7/6
 * assert.ok(Math.abs(r.bias - 7 / 6) < 1e-12);
 * assert.ok(r.upperLimit > r.bias && r.lowerLimit < r.bias);
 * ```
 */
export function blandAltmanRepeated(
  subjectIds: readonly (string | number)[],
  methodA: readonly number[],
  methodB: readonly number[],
  options: Pick<BlandAltmanOptions, "multiplier" | "methodNames" | "quantity"> = {},
): BlandAltmanRepeatedResult {
  const where = "Bland-Altman repeated-measures analysis";
  const [a, b] = checkPairs(where, ["methodA", "methodB"], methodA, methodB);
  const multiplier = checkMultiplier(where, options.multiplier ?? 1.96);
  const quantity = measuredOf(where, options.quantity);
  const methodNames = namesOf(where, "methodNames", options.methodNames, ["A", "B"]);
  if (!Array.isArray(subjectIds) || subjectIds.length !== a.length) {
    throw new TypeError(
      `${where}: expected 'subjectIds' with one entry per pair (${a.length}), got ${
        shown(subjectIds)
      }`,
    );
  }
  const groups = new Map<string, number[]>();
  subjectIds.forEach((id, i) => {
    if (typeof id !== "string" && typeof id !== "number") {
      throw new TypeError(
        `${where}: expected a string or number at 'subjectIds[${i}]', got ${shown(id)}`,
      );
    }
    const key = String(id);
    const list = groups.get(key) ?? [];
    list.push(a[i]! - b[i]!);
    groups.set(key, list);
  });
  const n = groups.size;
  if (n < 2) throw new RangeError(`${where}: expected at least 2 subjects, got ${n}`);
  const N = a.length;
  if (N - n < 1) {
    throw new RangeError(
      `${where}: expected at least one subject with two or more pairs (no within-subject information), got ${N} pairs for ${n} subjects`,
    );
  }
  const all = [...groups.values()].flat();
  const grand = mean(all);
  let ssWithin = 0;
  let ssBetween = 0;
  let sumM2 = 0;
  for (const d of groups.values()) {
    const m = mean(d);
    ssWithin += sumSquares(d, m);
    ssBetween += d.length * (m - grand) ** 2;
    sumM2 += d.length ** 2;
  }
  const msWithin = ssWithin / (N - n);
  const msBetween = ssBetween / (n - 1);
  const lambda = (N * N - sumM2) / ((n - 1) * N);
  const between = Math.max(0, (msBetween - msWithin) / lambda);
  const sd = Math.sqrt(between + msWithin);
  if (!(sd > 0)) {
    throw new RangeError(`${where}: expected differences that vary, got SD ${sd}`);
  }
  return displayed({
    subjects: n,
    pairs: N,
    bias: grand,
    betweenSubjectVariance: between,
    withinSubjectVariance: msWithin,
    sdDifferences: sd,
    multiplier,
    lowerLimit: grand - multiplier * sd,
    upperLimit: grand + multiplier * sd,
    quantity,
    methodNames,
    cautions: [NO_INTERVALS_CAUTION, LIMITS_OF_AGREEMENT_CAUTION],
  }, displayBlandAltmanRepeated);
}
