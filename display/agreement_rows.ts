/**
 * The tables of one agreement result (rows of formatted cells with labelled, unit-bearing
 * headers), shared by the notebook displays (display/agreement.ts) and the method-validation
 * report (display/method_validation.ts). Internal to display/: not re-exported by the package.
 *
 * @module
 */
import type { Interval } from "../calc/uncertainty/types.ts";
import type { Measured } from "../calc/agreement/types.ts";
import type { BlandAltmanRepeatedResult, BlandAltmanResult } from "../calc/agreement/types.ts";
import type { RepeatabilityResult } from "../calc/agreement/types.ts";
import type { IntraclassCorrelationResult } from "../calc/agreement/types.ts";
import type { ConcordanceResult } from "../calc/agreement/types.ts";
import type { RegressionResult } from "../calc/agreement/types.ts";
import type { CohenKappaResult, FleissKappaResult } from "../calc/agreement/types.ts";
import {
  formatCount,
  formatInterval,
  formatNumber,
  formatResolution,
  roundLike,
} from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";

// ---------------------------------------------------------------------------------------------
// Numbers

export const halfWidth = (i: Interval) => (i.upper - i.lower) / 2;
/** A confidence level as a column header: "95 % CI". */
export const level = (confidence: number) => `${formatNumber(100 * confidence, 3)} % CI`;
/** An interval rounded like its estimate. */
export const ci = (i: Interval, u: number) => formatInterval(i, u);
/** A p-value: "< 0.001" below 0.001, else two significant digits. */
export function pValue(p: number): string {
  return p < 0.001 ? "< 0.001" : formatNumber(p, 2);
}
/** A label with the unit of what was measured (none when it was not stated). */
export const inUnit = (label: string, q: Measured | null) => labelWithUnit(label, q?.unit ?? "1");
/** The unit of a difference or a spread of readings: "percentage points" for readings in %
 * (the difference of two percentages is not a percentage of anything), else the unit itself. */
export function differenceUnit(unit: string): string {
  return unit === "%" ? "percentage points" : unit;
}
/** A label with the unit of a difference or spread of what was measured. */
export const inDifferenceUnit = (label: string, q: Measured | null) =>
  labelWithUnit(label, differenceUnit(q?.unit ?? "1"));
/** A label with the square of the unit of a difference (variances of differences). */
export function inUnitSquared(label: string, q: Measured | null): string {
  const u = differenceUnit(q?.unit ?? "1");
  if (u === "1") return label;
  return labelWithUnit(label, /[ /*]/.test(u) ? `(${u})^2` : `${u}^2`);
}
/** The title of a result: "<statistic>: <what was measured>". */
export const titled = (statistic: string, q: Measured | null) =>
  q ? `${statistic}: ${q.label}` : statistic;

// ---------------------------------------------------------------------------------------------
// Tables of one result (shared by the notebook displays and the report)

export interface Rows {
  readonly header: readonly string[];
  readonly rows: readonly (readonly string[])[];
}

/** The bias and limits of agreement of a Bland–Altman result as its table shows them (rounded to
 * the decimal place the bias interval allows), also written on the lines of its chart. */
export function blandAltmanLevels(
  r: BlandAltmanResult,
): { bias: string; lower: string; upper: string } {
  const u = halfWidth(r.biasCi);
  return {
    bias: roundLike(r.bias, u),
    lower: roundLike(r.lowerLimit.value, u),
    upper: roundLike(r.upperLimit.value, u),
  };
}

/** The name of a limit of agreement: "Upper limit of agreement (bias + 1.96 SD)". */
export function limitName(which: "Lower" | "Upper", multiplier: number): string {
  return `${which} limit of agreement (bias ${which === "Lower" ? "−" : "+"} ${
    formatNumber(multiplier, 3)
  } SD)`;
}

export function blandAltmanRows(r: BlandAltmanResult): Rows {
  const q = r.quantity;
  const [a, b] = r.methodNames;
  const u = halfWidth(r.biasCi);
  const shown = blandAltmanLevels(r);
  const rows: string[][] = [
    ["Pairs", formatCount(r.n), "", ""],
    [inDifferenceUnit(`Bias (mean of ${a} − ${b})`, q), shown.bias, ci(r.biasCi, u), "–"],
    [inDifferenceUnit("SD of differences", q), roundLike(r.sdDifferences, u), "–", "–"],
    ...([["Lower", r.lowerLimit, shown.lower], ["Upper", r.upperLimit, shown.upper]] as const)
      .map(([name, l, value]) => [
        inDifferenceUnit(limitName(name, r.multiplier), q),
        value,
        ci(l.approximateCi, u),
        ci(l.exactCi, u),
      ]),
  ];
  const p = r.proportionalBias;
  if (p) {
    const us = halfWidth(p.slopeCi);
    rows.push([
      "Proportional bias: slope of difference on mean",
      roundLike(p.slope, us),
      ci(p.slopeCi, us),
      `p ${p.pValue < 0.001 ? "" : "= "}${pValue(p.pValue)}`,
    ]);
  }
  return {
    header: [
      "Statistic",
      "Estimate",
      `${level(r.confidence)} (approximate)`,
      `${level(r.confidence)} (exact, Carkeet 2015)`,
    ],
    rows,
  };
}

/** The repeated-measures analysis: no confidence intervals, so bias, SD and limits are rounded
 * to the decimal place of the SD of a single difference at two significant digits, and each
 * variance to two significant digits of itself (JCGM 100:2008 §7.2.6 applied to the spread). */
export function repeatedRows(r: BlandAltmanRepeatedResult): Rows {
  const q = r.quantity;
  const [a, b] = r.methodNames;
  const sd = (v: number) => roundLike(v, r.sdDifferences);
  const m = formatNumber(r.multiplier, 3);
  return {
    header: ["Statistic", "Estimate"],
    rows: [
      ["Pairs (subjects)", `${formatCount(r.pairs)} (${formatCount(r.subjects)})`],
      [inDifferenceUnit(`Bias (mean of ${a} − ${b})`, q), sd(r.bias)],
      [
        inUnitSquared("Between-subject variance of differences", q),
        roundLike(r.betweenSubjectVariance, r.betweenSubjectVariance),
      ],
      [
        inUnitSquared("Within-subject variance of differences", q),
        roundLike(r.withinSubjectVariance, r.withinSubjectVariance),
      ],
      [inDifferenceUnit("SD of a single difference", q), sd(r.sdDifferences)],
      [
        inDifferenceUnit(`Limits of agreement (bias ∓ ${m} SD)`, q),
        `${sd(r.lowerLimit)} to ${sd(r.upperLimit)}`,
      ],
    ],
  };
}

/** The cells of a repeatability result: s_w and the coefficient with their intervals, and the
 * CV in % of the mean to two significant digits (no interval is computed for it; its relative
 * uncertainty is about that of s_w, tens of percent in a usual study). */
export function repeatabilityCells(r: RepeatabilityResult): string[] {
  const u = halfWidth(r.withinSubjectSdCi);
  const uc = halfWidth(r.repeatabilityCoefficientCi);
  const cv = r.withinSubjectCv === null ? null : 100 * r.withinSubjectCv;
  return [
    `${roundLike(r.withinSubjectSd, u)} ${ci(r.withinSubjectSdCi, u)}`,
    `${roundLike(r.repeatabilityCoefficient, uc)} ${ci(r.repeatabilityCoefficientCi, uc)}`,
    cv === null ? "undefined (a subject mean ≤ 0)" : roundLike(cv, cv),
  ];
}

/** The header of the coefficient of variation: a percentage of the mean (never percentage
 * points). */
export const CV_HEADER = "Within-subject CV, root mean square (% of the subject mean)";

export function repeatabilityHeader(q: Measured | null, multiplier: number, confidence: number) {
  return [
    inDifferenceUnit(`Within-subject SD s_w [${level(confidence)}]`, q),
    inDifferenceUnit(
      `Repeatability coefficient ${formatNumber(multiplier * Math.SQRT2, 3)}·s_w [${
        level(confidence)
      }]`,
      q,
    ),
    CV_HEADER,
  ];
}

/** Degrees of freedom: a count when whole, else three significant digits (Satterthwaite). */
const degrees = (df: number) => Number.isInteger(df) ? formatCount(df) : formatNumber(df, 3);

export function iccRows(r: IntraclassCorrelationResult): Rows {
  return {
    header: [
      "Shrout & Fleiss",
      "McGraw & Wong",
      "Model",
      "Definition",
      "Reading",
      "ICC",
      level(r.confidence),
      "F (df1, df2)",
      "p",
    ],
    rows: r.forms.map((f) => {
      const u = halfWidth(f.ci);
      return [
        f.form,
        f.mcGrawWong,
        f.model,
        f.definition,
        f.unit,
        roundLike(f.value, u),
        ci(f.ci, u),
        `${formatNumber(f.f, 3)} (${degrees(f.df1)}, ${degrees(f.df2)})`,
        pValue(f.pValue),
      ];
    }),
  };
}

export function concordanceRows(r: ConcordanceResult): string[][] {
  const u = halfWidth(r.ci);
  return [
    ["Lin's concordance correlation ρ_c", roundLike(r.value, u), ci(r.ci, u), ""],
    ["Pearson r (precision)", roundLike(r.pearson, u), "–", ""],
    ["Bias-correction factor C_b (accuracy)", roundLike(r.biasCorrectionFactor, u), "–", ""],
    ["Location shift u", formatNumber(r.locationShift, 3), "–", ""],
    ["Scale shift v", formatNumber(r.scaleShift, 3), "–", ""],
  ];
}

export function regressionRows(r: RegressionResult): string[][] {
  const us = halfWidth(r.slopeCi);
  const ui = halfWidth(r.interceptCi);
  const rows = [
    [`${r.method} slope`, roundLike(r.slope, us), ci(r.slopeCi, us), ""],
    [
      inUnit(`${r.method} intercept`, r.quantity),
      roundLike(r.intercept, ui),
      ci(r.interceptCi, ui),
      "",
    ],
  ];
  const se = (what: string, value: number) => `${what} SE ${formatNumber(value, 2)}`;
  switch (r.method) {
    case "Deming":
      rows[0]![3] = `${se("jackknife", r.slopeStandardError)}; error variance ratio ${
        formatNumber(r.errorVarianceRatio, 2)
      }`;
      rows[1]![3] = se("jackknife", r.interceptStandardError);
      break;
    case "General Deming":
      rows[0]![3] = `${se("jackknife", r.slopeStandardError)}; weights from each reading's SD`;
      rows[1]![3] = se("jackknife", r.interceptStandardError);
      rows.push([
        "MSWD: S/(n − 2), S = weighted sum of squares",
        formatNumber(r.mswd, 3),
        "–",
        "about 1 when the stated SDs describe the scatter",
      ]);
      break;
    case "York": {
      const basis = r.intervalBasis === "stated uncertainties"
        ? "interval from the stated SDs"
        : "interval widened by √MSWD (t quantile)";
      rows[0]![3] = `${se("York 2004", r.slopeStandardError)}; ${basis}`;
      rows[1]![3] = se("York 2004", r.interceptStandardError);
      rows.push([
        "MSWD: S/(n − 2), S = weighted sum of squares",
        formatNumber(r.mswd, 3),
        "–",
        `S = ${formatNumber(r.chiSquare, 4)} on ${formatCount(r.degreesOfFreedom)} df, p ${
          r.fitPValue < 0.001 ? "" : "= "
        }${pValue(r.fitPValue)}`,
      ]);
      break;
    }
    case "Passing–Bablok":
      rows[0]![3] = `${formatCount(r.slopesUsed)} pairwise slopes`;
      rows.push([
        "Cusum linearity statistic",
        // two decimals, as the critical values of Passing & Bablok (1983) are tabulated
        formatResolution(r.linearity.statistic, 0.01),
        "–",
        `${
          r.linearity.nonLinear ? "exceeds" : "does not exceed"
        } the 5 % critical value ${r.linearity.criticalValue}`,
      ]);
  }
  return rows;
}

/** A proportion of agreement (or a kappa without an interval) to three decimals, trailing zeros
 * kept so that a column reads at one precision ("0.900" beside "0.725"). */
const proportion = (p: number) => formatResolution(p, 0.001);

export function kappaStatistic(weights: CohenKappaResult["weights"]): string {
  return weights === "none" ? "Cohen's kappa" : `weighted kappa (${weights})`;
}

export function kappaCells(r: CohenKappaResult): string[] {
  const u = halfWidth(r.ci);
  return [
    formatCount(r.n),
    proportion(r.observedAgreement),
    proportion(r.expectedAgreement),
    roundLike(r.kappa, u),
    formatNumber(r.standardError, 2),
    ci(r.ci, u),
  ];
}

export function kappaHeader(confidence: number): string[] {
  return ["Subjects", "Observed agreement", "Chance agreement", "κ", "SE", level(confidence)];
}

export function fleissRows(r: FleissKappaResult): Rows {
  return {
    header: ["Subjects", "Ratings per subject", "P̄", "P̄e", "κ", "SE under κ = 0", "z", "p"],
    rows: [[
      formatCount(r.subjects),
      formatCount(r.ratersPerSubject),
      proportion(r.observedAgreement),
      proportion(r.expectedAgreement),
      proportion(r.kappa),
      formatNumber(r.standardErrorNull, 3),
      formatNumber(r.z, 3),
      pValue(r.pValue),
    ]],
  };
}
