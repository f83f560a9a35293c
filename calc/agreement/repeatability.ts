/**
 * Repeatability from replicate readings: within-subject SD, repeatability coefficient and
 * within-subject coefficient of variation.
 *
 * @module
 */
import {
  checkConfidence,
  checkMultiplier,
  checkNumbers,
  displayed,
  type LabelOptions,
  mean,
  measuredOf,
  shown,
  sumSquares,
} from "./checks.ts";
import { chiSquareQuantile } from "../stats/distributions.ts";
import { displayRepeatability } from "../../display/agreement.ts";
import type { RepeatabilityResult } from "./types.ts";

/** Options of {@linkcode repeatability}. */
export interface RepeatabilityOptions extends LabelOptions {
  /** Multiplier z in the repeatability coefficient z·√2·s_w: 1.96 (coefficient 2.77·s_w) or 2
   * (the British Standards Institution coefficient used by Bland & Altman 1986). @default 1.96 */
  readonly multiplier?: number;
  /** Confidence level of the interval of s_w. @default 0.95 */
  readonly confidence?: number;
}

/**
 * Repeatability of a measurement from replicate readings on each subject.
 *
 * Formulas: s²_w = Σᵢ Σⱼ (xᵢⱼ − x̄ᵢ)² / Σᵢ (mᵢ − 1) (one-way ANOVA residual mean square, which
 * for two readings equals Σ dᵢ²/(2n)); repeatability coefficient = z·√2·s_w (2.77·s_w for
 * z = 1.96); interval of s_w: s_w·√(df/χ²_{1−α/2,df}) to s_w·√(df/χ²_{α/2,df}); within-subject
 * CV = √(mean over subjects of (sᵢ/x̄ᵢ)²) (root-mean-square method, chosen over the logarithmic
 * method because it needs no assumption that SD is proportional to the mean).
 *
 * Sources: Bland JM, Altman DG (1986) Lancet 327:307–310, doi:10.1016/S0140-6736(86)90837-8
 * (coefficient of repeatability); Bland JM, Altman DG (1996) Measurement error. BMJ 313:744,
 * doi:10.1136/bmj.313.7059.744 (2.77·s_w); Bland JM (2006) How should I calculate a
 * within-subject coefficient of variation? (www-users.york.ac.uk/~mb55/meas/cv.htm; RMS method);
 * Hyslop NP, White WH (2009) Atmos Environ 43:2245–2248 (RMS estimator).
 *
 * @param readingsBySubject One array of replicate readings per subject (units of the
 * measurement); numbers of replicates may differ.
 * @param options Multiplier and confidence level.
 * @returns Within-subject SD with interval, repeatability coefficient and CV.
 * @throws {TypeError} When the input is not an array of arrays of numbers.
 * @throws {RangeError} For fewer than 2 subjects, a subject with fewer than 2 readings,
 * non-finite readings or no within-subject variation at all.
 *
 * @example Three subjects measured twice
 * ```ts
 * import { repeatability } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = repeatability([[10, 12], [20, 19], [15, 15]]);
 * // s_w² = (2² + 1² + 0²)/(2·3) = 5/6, hand-checkable
 * assert.ok(Math.abs(r.withinSubjectSd - Math.sqrt(5 / 6)) < 1e-12);
 * ```
 */
export function repeatability(
  readingsBySubject: readonly (readonly number[])[],
  options: RepeatabilityOptions = {},
): RepeatabilityResult {
  const where = "Repeatability";
  if (!Array.isArray(readingsBySubject)) {
    throw new TypeError(
      `${where}: expected 'readingsBySubject' as an array of arrays of readings, got ${
        shown(readingsBySubject)
      }`,
    );
  }
  if (readingsBySubject.length < 2) {
    throw new RangeError(`${where}: expected at least 2 subjects, got ${readingsBySubject.length}`);
  }
  const multiplier = checkMultiplier(where, options.multiplier ?? 1.96);
  const confidence = checkConfidence(where, options.confidence ?? 0.95);
  const quantity = measuredOf(where, options.quantity);
  let ss = 0;
  let df = 0;
  let readings = 0;
  let cvSum = 0;
  let cvDefined = true;
  readingsBySubject.forEach((raw, i) => {
    const x = checkNumbers(where, `readingsBySubject[${i}]`, raw, 1);
    if (x.length < 2) {
      throw new RangeError(
        `${where}: expected at least 2 readings for every subject, 'readingsBySubject[${i}]' has ${x.length}`,
      );
    }
    const m = mean(x);
    const ssi = sumSquares(x, m);
    ss += ssi;
    df += x.length - 1;
    readings += x.length;
    if (m > 0) cvSum += ssi / (x.length - 1) / (m * m);
    else cvDefined = false;
  });
  const sw = Math.sqrt(ss / df);
  if (!(sw > 0)) {
    throw new RangeError(
      `${where}: expected readings that vary within subjects, got within-subject SD ${sw}`,
    );
  }
  const alpha = 1 - confidence;
  const swCi = {
    lower: sw * Math.sqrt(df / chiSquareQuantile(1 - alpha / 2, df)),
    upper: sw * Math.sqrt(df / chiSquareQuantile(alpha / 2, df)),
  };
  const k = multiplier * Math.SQRT2;
  return displayed({
    subjects: readingsBySubject.length,
    readings,
    degreesOfFreedom: df,
    withinSubjectSd: sw,
    withinSubjectSdCi: swCi,
    multiplier,
    confidence,
    repeatabilityCoefficient: k * sw,
    repeatabilityCoefficientCi: { lower: k * swCi.lower, upper: k * swCi.upper },
    withinSubjectCv: cvDefined ? Math.sqrt(cvSum / readingsBySubject.length) : null,
    quantity,
  }, displayRepeatability);
}
