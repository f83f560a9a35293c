/**
 * The cautions that travel with agreement statistics and with the method-validation report, each
 * written once (common practice in method-comparison studies; the sources are those of the
 * statistics they accompany: Bland & Altman 1986 and 1999, Shrout & Fleiss 1979, Lin 1989,
 * Cohen 1960, Linnet 1990).
 *
 * @module
 */

/**
 * Limits of agreement assume differences roughly normal with a spread that does not change with
 * the magnitude (Bland & Altman 1999 §3).
 *
 * @example
 * ```ts
 * import { blandAltman, LIMITS_OF_AGREEMENT_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = blandAltman([10, 12, 14, 16, 18], [9, 12, 13, 17, 16]);
 * assert.ok(r.cautions.includes(LIMITS_OF_AGREEMENT_CAUTION));
 * ```
 */
export const LIMITS_OF_AGREEMENT_CAUTION =
  "Limits of agreement assume differences roughly normal and unrelated to magnitude; check the Bland–Altman plot and the proportional-bias slope, and use the ratio analysis when the spread grows with the mean";

/**
 * Correlation-type summaries (ICC, concordance) depend on the spread of the subjects studied.
 *
 * @example
 * ```ts
 * import { concordanceCorrelation, SUBJECT_SPREAD_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = concordanceCorrelation([1, 2, 3, 4, 5], [1.1, 2.3, 2.8, 4.2, 5.3]);
 * assert.ok(r.cautions.includes(SUBJECT_SPREAD_CAUTION));
 * ```
 */
export const SUBJECT_SPREAD_CAUTION =
  "Intraclass and concordance correlations depend on the spread of the subjects studied: a narrow case mix gives low values even with small measurement error; quote the limits of agreement, in the unit of measurement, alongside them";

/**
 * Kappa depends on prevalence, on how differently raters use the categories, and on the weights.
 *
 * @example
 * ```ts
 * import { cohenKappaFromTable, KAPPA_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(cohenKappaFromTable([[20, 5], [10, 15]]).cautions.includes(KAPPA_CAUTION));
 * ```
 */
export const KAPPA_CAUTION =
  "Kappa depends on how often each category occurs and on how differently the raters use the categories; weighted kappa also depends on the weights, which must be chosen before the data are seen";

/**
 * The 2007 repeated-measures limits come without confidence intervals.
 *
 * @example
 * ```ts
 * import { blandAltmanRepeated, NO_INTERVALS_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = blandAltmanRepeated(["p1", "p1", "p2", "p2"], [10, 11, 20, 22], [9, 11, 19, 19]);
 * assert.ok(r.cautions.includes(NO_INTERVALS_CAUTION));
 * ```
 */
export const NO_INTERVALS_CAUTION =
  "No confidence intervals: the repeated-measures method of Bland & Altman (2007) gives none, so these limits look more precise than they are";

/**
 * Deming regression needs the ratio of the two methods' error variances.
 *
 * @example
 * ```ts
 * import { demingRegression, ERROR_RATIO_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = demingRegression([1, 2, 3, 4, 5, 6], [1.2, 1.9, 3.2, 3.9, 5.1, 6.0]);
 * assert.ok(r.cautions.includes(ERROR_RATIO_CAUTION));
 * ```
 */
export const ERROR_RATIO_CAUTION =
  "Deming regression assumes the stated ratio of error variances; a ratio from replicate readings assumes the replicate scatter is each method's whole measurement error";

/**
 * A statistic describes the sample it was computed from.
 *
 * @example
 * ```ts
 * import { methodValidation, readTable, SAMPLE_CAUTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,lvef percent\nP1,A,55\nP1,B,54\nP2,A,40\nP2,B,43\n";
 * assert.ok(methodValidation(readTable(csv)).cautions.includes(SAMPLE_CAUTION));
 * ```
 */
export const SAMPLE_CAUTION =
  "Statistics describe this sample only; confidence intervals show how far the population values may lie from them";

/**
 * Agreement statistics are not a diagnosis.
 *
 * @example
 * ```ts
 * import { AGREEMENT_NOT_A_DIAGNOSIS, methodValidation, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,reader,grade\nP1,A,mild\nP1,B,mild\nP2,A,none\nP2,B,mild\n";
 * const report = methodValidation(readTable(csv), { graded: true });
 * assert.ok(report.cautions.includes(AGREEMENT_NOT_A_DIAGNOSIS)); // graded findings too
 * ```
 */
export const AGREEMENT_NOT_A_DIAGNOSIS =
  "Not a diagnosis: these numbers describe measurement agreement and do not by themselves decide any patient's care; verify against local guidelines and licensed clinical practice";
