/**
 * Intraclass correlation coefficients: the six forms of Shrout & Fleiss (1979), named also as
 * McGraw & Wong (1996), with F-based confidence intervals.
 *
 * @module
 */
import {
  checkConfidence,
  checkNumbers,
  displayed,
  type Interval,
  type LabelOptions,
  mean,
  measuredOf,
  shown,
} from "./checks.ts";
import { fCdf, fQuantile } from "../stats/distributions.ts";
import { SUBJECT_SPREAD_CAUTION } from "./cautions.ts";
import { displayIntraclassCorrelation } from "../../display/agreement.ts";
import type { IntraclassCorrelation, IntraclassCorrelationResult } from "./types.ts";

/** Options of {@linkcode intraclassCorrelations}. */
export interface IntraclassCorrelationOptions extends LabelOptions {
  /** Confidence level of the intervals. @default 0.95 */
  readonly confidence?: number;
  /** How `ratings` is laid out: "subjectsByRaters" (one row per subject, one column per rater)
   * or "ratersBySubjects" (one row per rater, transposed before the analysis). Required when
   * the rows would have more raters than there are subjects: that shape is far more often a
   * table given raters as rows by mistake than a real design, and silently gives a wrong ICC.
   * @default "subjectsByRaters" when the rows hold no more readings than there are rows */
  readonly orientation?: "subjectsByRaters" | "ratersBySubjects";
}

/** The ratings as subjects × raters: transposed when given raters × subjects; refused when the
 * orientation is not stated and the rows hold more readings (raters) than there are rows
 * (subjects). Checks the shape only; the numbers are checked by the caller. */
function subjectsByRaters(
  where: string,
  ratings: readonly (readonly number[])[],
  orientation: unknown,
): readonly (readonly number[])[] {
  const rows = ratings.length;
  const width = Array.isArray(ratings[0]) ? ratings[0].length : 0;
  if (orientation === "ratersBySubjects") {
    ratings.forEach((r, i) => {
      if (!Array.isArray(r) || r.length !== width) {
        throw new TypeError(
          `${where}: expected 'ratings' as ${rows} rows (raters) of ${width} readings (subjects), 'ratings[${i}]' has ${
            Array.isArray(r) ? r.length : shown(r)
          }`,
        );
      }
      checkNumbers(where, `ratings[${i}]`, r, 1);
    });
    return Array.from({ length: width }, (_, j) => ratings.map((r) => r[j]!));
  }
  if (orientation !== undefined && orientation !== "subjectsByRaters") {
    throw new TypeError(
      `${where}: expected 'orientation' "subjectsByRaters" or "ratersBySubjects", got ${
        shown(orientation)
      }`,
    );
  }
  if (
    orientation === undefined && width > rows && rows >= 2 &&
    ratings.every((r) => Array.isArray(r) && r.length === width)
  ) {
    throw new TypeError(
      `${where}: expected 'ratings' as subjects × raters (one row per subject, one column per rater), got ${rows} rows × ${width} columns, more raters than subjects; if each row is one rater, pass { orientation: "ratersBySubjects" } (or transpose), and if the design truly has more raters than subjects, pass { orientation: "subjectsByRaters" }`,
    );
  }
  return ratings;
}

/**
 * All six intraclass correlation coefficients of an n × k table (subjects × raters), with
 * F-based confidence intervals.
 *
 * Formulas (two-way ANOVA mean squares: MSR subjects, MSC raters, MSE residual; one-way MSW):
 * ICC(1,1) = (MSR − MSW)/(MSR + (k − 1)MSW); ICC(2,1) = (MSR − MSE)/(MSR + (k − 1)MSE +
 * k(MSC − MSE)/n); ICC(3,1) = (MSR − MSE)/(MSR + (k − 1)MSE); ICC(1,k) = (MSR − MSW)/MSR;
 * ICC(2,k) = (MSR − MSE)/(MSR + (MSC − MSE)/n); ICC(3,k) = (MSR − MSE)/MSR. Intervals: for forms
 * 1 and 3, F_L = F₀/F_{1−α/2}(df1, df2), F_U = F₀·F_{1−α/2}(df2, df1), then (F − 1)/(F + k − 1)
 * (single) or 1 − 1/F (average); for form 2, the Satterthwaite approximation of Shrout & Fleiss
 * (1979) eq. for ICC(2,1), and ICC(2,k) bounds from the single-rater bounds by Spearman–Brown.
 * McGraw & Wong names: ICC(1,·) = ICC(1)/ICC(k) (one-way random); ICC(2,·) = ICC(A,·)
 * (absolute agreement, two-way random or mixed); ICC(3,·) = ICC(C,·) (consistency).
 *
 * Sources: Shrout PE, Fleiss JL (1979) Intraclass correlations: uses in assessing rater
 * reliability. Psychol Bull 86:420–428, doi:10.1037/0033-2909.86.2.420 (Tables 2–4). McGraw KO,
 * Wong SP (1996) Forming inferences about some intraclass correlation coefficients. Psychol
 * Methods 1:30–46, doi:10.1037/1082-989X.1.1.30 (Table 7).
 *
 * @param ratings n rows (subjects) of k readings (one per rater or method, same rater order in
 * every row), or k rows (raters) of n readings with `orientation: "ratersBySubjects"`. The design
 * must be complete and balanced.
 * @param options Confidence level (default 0.95), orientation of `ratings`.
 * @returns The six forms with intervals and F tests.
 * @throws {TypeError} When the table is not an array of equal-length arrays of numbers
 * (unbalanced or incomplete designs are rejected: drop or impute beforehand, stating how), or
 * when its rows hold more readings than there are rows and no `orientation` says which way it
 * is laid out (raters given as rows is the usual mistake).
 * @throws {RangeError} For fewer than 2 subjects or 2 raters, non-finite readings, or no
 * residual variation (every reading explained exactly by subject and rater).
 *
 * @example Shrout & Fleiss (1979) Table 2
 * ```ts
 * import { intraclassCorrelations } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 *
 * const r = intraclassCorrelations([[9, 2, 5, 8], [6, 1, 3, 2], [8, 4, 6, 8], [7, 1, 2, 6],
 *   [10, 5, 6, 9], [6, 2, 4, 7]]);
 * assert.equal(r.forms[2]!.value.toFixed(2), "0.71"); // ICC(3,1), as printed in Table 4
 * ```
 *
 * @example Raters as rows must be said so
 * ```ts
 * import { intraclassCorrelations } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Shrout & Fleiss (1979) Table 2 with the 4 judges as rows and the 6 targets as columns
 * const judges = [[9, 6, 8, 7, 10, 6], [2, 1, 4, 1, 5, 2], [5, 3, 6, 2, 6, 4], [8, 2, 8, 6, 9, 7]];
 * assert.throws(() => intraclassCorrelations(judges), TypeError); // 4 rows × 6 columns
 * const r = intraclassCorrelations(judges, { orientation: "ratersBySubjects" });
 * assert.equal(r.forms[1]!.value.toFixed(2), "0.29"); // ICC(2,1), as printed in Table 4
 * ```
 */
export function intraclassCorrelations(
  ratings: readonly (readonly number[])[],
  options: IntraclassCorrelationOptions = {},
): IntraclassCorrelationResult {
  const where = "Intraclass correlation";
  if (!Array.isArray(ratings)) {
    throw new TypeError(
      `${where}: expected 'ratings' as an array of rows (subjects), got ${shown(ratings)}`,
    );
  }
  const table = subjectsByRaters(where, ratings, options.orientation);
  const n = table.length;
  if (n < 2) throw new RangeError(`${where}: expected at least 2 subjects, got ${n}`);
  const rows = table.map((r, i) => checkNumbers(where, `ratings[${i}]`, r, 1));
  const k = rows[0]!.length;
  if (k < 2) throw new RangeError(`${where}: expected at least 2 raters per subject, got ${k}`);
  rows.forEach((r, i) => {
    if (r.length !== k) {
      throw new TypeError(
        `${where}: expected a balanced design with ${k} readings per subject, 'ratings[${i}]' has ${r.length}`,
      );
    }
  });
  const confidence = checkConfidence(where, options.confidence ?? 0.95);
  const quantity = measuredOf(where, options.quantity);
  const grand = mean(rows.flat());
  const rowMeans = rows.map((r) => mean(r));
  const colMeans = Array.from({ length: k }, (_, j) => mean(rows.map((r) => r[j]!)));
  let ssTotal = 0;
  for (const r of rows) for (const v of r) ssTotal += (v - grand) ** 2;
  const ssRows = k * rowMeans.reduce((s, m) => s + (m - grand) ** 2, 0);
  const ssCols = n * colMeans.reduce((s, m) => s + (m - grand) ** 2, 0);
  const ssError = Math.max(0, ssTotal - ssRows - ssCols);
  const msr = ssRows / (n - 1);
  const msc = ssCols / (k - 1);
  const mse = ssError / ((n - 1) * (k - 1));
  const msw = (ssTotal - ssRows) / (n * (k - 1));
  if (!(mse > 0) || !(msw > 0)) {
    throw new RangeError(
      `${where}: expected residual variation between raters within subjects, got residual mean square ${mse}`,
    );
  }
  const alpha = 1 - confidence;
  const q = (d1: number, d2: number) => fQuantile(1 - alpha / 2, d1, d2);
  const upperTail = (f: number, d1: number, d2: number) => 1 - fCdf(f, d1, d2);
  const single = (f: number) => (f - 1) / (f + k - 1);
  const average = (f: number) => 1 - 1 / f;

  // One-way
  const f1 = msr / msw;
  const d1a = n - 1;
  const d1b = n * (k - 1);
  const f1L = f1 / q(d1a, d1b);
  const f1U = f1 * q(d1b, d1a);
  // Two-way, consistency
  const f3 = msr / mse;
  const d3a = n - 1;
  const d3b = (n - 1) * (k - 1);
  const f3L = f3 / q(d3a, d3b);
  const f3U = f3 * q(d3b, d3a);
  // Two-way, absolute agreement
  const icc21 = (msr - mse) / (msr + (k - 1) * mse + (k * (msc - mse)) / n);
  const fj = msc / mse;
  const vn = (k - 1) * (n - 1) * (k * icc21 * fj + n * (1 + (k - 1) * icc21) - k * icc21) ** 2;
  const vd = (n - 1) * k * k * icc21 * icc21 * fj * fj +
    (n * (1 + (k - 1) * icc21) - k * icc21) ** 2;
  const v = vn / vd;
  const fL2 = q(n - 1, v);
  const fU2 = q(v, n - 1);
  const l21 = (n * (msr - fL2 * mse)) / (fL2 * (k * msc + (k * n - k - n) * mse) + n * msr);
  const u21 = (n * (fU2 * msr - mse)) / (k * msc + (k * n - k - n) * mse + n * fU2 * msr);
  const sb = (x: number) => (k * x) / (1 + (k - 1) * x);

  const make = (
    form: IntraclassCorrelation["form"],
    mcGrawWong: IntraclassCorrelation["mcGrawWong"],
    model: string,
    unit: "single" | "average",
    definition: IntraclassCorrelation["definition"],
    value: number,
    ci: Interval,
    f: number,
    df1: number,
    df2: number,
  ): IntraclassCorrelation => ({
    form,
    mcGrawWong,
    model,
    unit,
    definition,
    value,
    ci,
    f,
    df1,
    df2,
    pValue: upperTail(f, df1, df2),
  });
  const oneWay = "one-way random effects";
  const twoWayRandom = "two-way random effects (raters a random sample)";
  const twoWayMixed = "two-way mixed effects (these raters only)";
  return displayed({
    subjects: n,
    raters: k,
    meanSquares: { subjects: msr, raters: msc, residual: mse, within: msw },
    confidence,
    forms: [
      make(
        "ICC(1,1)",
        "ICC(1)",
        oneWay,
        "single",
        "absolute agreement",
        (msr - msw) / (msr + (k - 1) * msw),
        {
          lower: single(f1L),
          upper: single(f1U),
        },
        f1,
        d1a,
        d1b,
      ),
      make(
        "ICC(2,1)",
        "ICC(A,1)",
        twoWayRandom,
        "single",
        "absolute agreement",
        icc21,
        {
          lower: l21,
          upper: u21,
        },
        f3,
        d3a,
        d3b,
      ),
      make(
        "ICC(3,1)",
        "ICC(C,1)",
        twoWayMixed,
        "single",
        "consistency",
        (msr - mse) / (msr + (k - 1) * mse),
        {
          lower: single(f3L),
          upper: single(f3U),
        },
        f3,
        d3a,
        d3b,
      ),
      make(
        "ICC(1,k)",
        "ICC(k)",
        oneWay,
        "average",
        "absolute agreement",
        (msr - msw) / msr,
        {
          lower: average(f1L),
          upper: average(f1U),
        },
        f1,
        d1a,
        d1b,
      ),
      make(
        "ICC(2,k)",
        "ICC(A,k)",
        twoWayRandom,
        "average",
        "absolute agreement",
        (msr - mse) / (msr + (msc - mse) / n),
        {
          lower: sb(l21),
          upper: sb(u21),
        },
        f3,
        d3a,
        d3b,
      ),
      make(
        "ICC(3,k)",
        "ICC(C,k)",
        twoWayMixed,
        "average",
        "consistency",
        (msr - mse) / msr,
        {
          lower: average(f3L),
          upper: average(f3U),
        },
        f3,
        d3a,
        d3b,
      ),
    ],
    quantity,
    cautions: [SUBJECT_SPREAD_CAUTION],
  }, displayIntraclassCorrelation);
}
