/**
 * The method-validation analysis as one library function: a long-format table (subject,
 * observer or method, replicate, value) in, a plain report object out, with the statistics that
 * fit the design. Rendering (HTML, Markdown, notebook) lives in display/agreement.ts, charts in
 * plot/agreement.ts.
 *
 * @module
 */
import type { Table } from "../table/types.ts";
import { issueError } from "../core/issues.ts";
import { checkConfidence, checkMultiplier } from "./checks.ts";
import {
  type GradedReadings,
  type MeasuredReadings,
  validationReadings,
} from "./validation_table.ts";
import type { ValidationDesignOptions } from "./validation_columns.ts";
import {
  iccAcrossObservers,
  methodComparisons,
  repeatabilityByObserver,
  type StudySettings,
} from "./measured_analysis.ts";
import { kappaAnalysis } from "./graded_analysis.ts";
import { figurePlans } from "./figures.ts";
import {
  AGREEMENT_NOT_A_DIAGNOSIS,
  KAPPA_CAUTION,
  LIMITS_OF_AGREEMENT_CAUTION,
  SAMPLE_CAUTION,
  SUBJECT_SPREAD_CAUTION,
} from "./cautions.ts";
import type {
  DataSummary,
  MethodComparison,
  MethodValidationReport,
  ObserverSummary,
  ProvenanceDetails,
} from "./report_types.ts";
import { displayMethodValidation } from "../../display/method_validation.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";

/** Options of {@linkcode methodValidation}: the columns (see `ValidationDesignOptions`), then the
 * analysis. */
export interface MethodValidationOptions extends ValidationDesignOptions {
  /** Reference observer or method of the comparisons. @default the first in the table */
  readonly reference?: string;
  /** Multiplier of the limits of agreement and of the repeatability coefficient: 1.96 or 2.
   * @default 1.96 */
  readonly multiplier?: number;
  /** Confidence level of every interval. @default 0.95 */
  readonly confidence?: number;
  /** Title of the report. @default "Method validation report: <source>" */
  readonly title?: string;
  /** What the caller knows about the run (input hash, tool, date), for provenance. */
  readonly provenance?: ProvenanceDetails;
}

const WHERE = "Method validation";

/**
 * The interpretation every report starts with: it states no pass or fail.
 *
 * @example
 * ```ts
 * import { methodValidation, NO_VERDICT, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,lvef percent\nP1,A,55\nP1,B,54\nP2,A,40\nP2,B,43\n";
 * assert.equal(methodValidation(readTable(csv)).interpretation[0], NO_VERDICT);
 * ```
 */
export const NO_VERDICT =
  "This report states no pass or fail. Whether the agreement is good enough is a clinical decision that must be made, and written down, before the data are seen: the largest acceptable difference between methods (compare it with the limits of agreement and their confidence intervals, the upper confidence limit of the upper limit in particular), the smallest acceptable ICC or kappa (compare it with the lower confidence limit), and the largest acceptable repeatability coefficient. Published rules of thumb for ICC or kappa categories are conventions, not properties of the data; if you use one, cite it and apply it to the confidence limits.";

/**
 * Analyses a method-validation study: repeatability of each observer (with replicates); on first
 * readings each method against the reference, then every pair of the other observers (Bland–
 * Altman with exact limits, repeated-measures Bland–Altman, Lin's concordance, Deming and
 * Passing–Bablok regression); the intraclass correlation across observers; for graded findings, Cohen's kappa (unweighted,
 * linear, quadratic) for each pair of raters and Fleiss' kappa across three or more.
 *
 * Missing-cell policy: a reading whose value cell is empty is listed (with its line) and left
 * out; each statistic states how many subjects it used, and balanced methods (ICC, Fleiss'
 * kappa) use only subjects with a complete set of first readings, listing the others. Any other
 * defect (an invalid value, a missing subject or observer, a bad replicate number, a duplicate
 * reading, a wrong number of fields, an unknown category) is an error: nothing is computed.
 *
 * Sources: those of each statistic (Bland & Altman 1986, 1999, 2007; Carkeet 2015; Lin 1989;
 * Linnet 1990; Passing & Bablok 1983; Shrout & Fleiss 1979; McGraw & Wong 1996; Cohen 1960,
 * 1968; Fleiss 1971; Fleiss, Cohen & Everitt 1969), given in their documentation.
 *
 * @param table A table from `readTable`: the value column as numbers of a quantity (a quantity
 * of the package recognised by its header, or one made with `statedQuantity`), or as text for
 * graded findings.
 * @param options Columns, graded or not, categories, reference, multiplier, confidence, title,
 * provenance.
 * @returns The report: plain data; it displays itself in a notebook; render it with
 * `methodValidationHtml` or `methodValidationMarkdown`.
 * @throws {TypeError} For columns that cannot be found, a value column of the wrong kind, an
 * unknown reference; with `issues`, for a defective table (every problem with its line).
 * @throws {RangeError} For a multiplier outside (0, 5], a confidence outside (0, 1), fewer than
 * 2 subjects with readings; with `issues`, for invalid values in the table.
 *
 * @example Two observers, duplicate readings
 * ```ts
 * import { methodValidation, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "patient,observer,replicate,lvef percent\n" +
 *   "P1,A,1,55\nP1,A,2,57\nP1,B,1,54\nP1,B,2,58\n" +
 *   "P2,A,1,40\nP2,A,2,41\nP2,B,1,43\nP2,B,2,42\n" +
 *   "P3,A,1,62\nP3,A,2,60\nP3,B,1,61\nP3,B,2,64\n";
 * const report = methodValidation(readTable(csv, { source: "demo.csv" }));
 * assert.equal(report.study.measured.label, "LV ejection fraction");
 * assert.equal(report.data.readingsUsed, 12);
 * const ba = report.comparisons[0]!.blandAltman;
 * // B − A on first readings: −1, 3, −1, mean 1/3 (hand-checkable)
 * assert.ok(ba.status === "computed" && Math.abs(ba.result.bias - 1 / 3) < 1e-12);
 * ```
 */
export function methodValidation(
  table: Table,
  options: MethodValidationOptions = {},
): MethodValidationReport {
  const multiplier = checkMultiplier(WHERE, options.multiplier ?? 1.96);
  const confidence = checkConfidence(WHERE, options.confidence ?? 0.95);
  const study = validationReadings(table, options);
  if (study.issues.some((i) => i.severity === "error")) throw issueError(study.issues);
  if (study.subjects.length < 2) {
    throw new RangeError(
      `${WHERE}: expected at least 2 subjects with readings, got ${study.subjects.length}`,
    );
  }
  const reference = study.design === "continuous" ? options.reference ?? study.observers[0]! : null;
  if (reference !== null && !study.observers.includes(reference)) {
    throw issueError([{
      kind: "unknown",
      severity: "error",
      where: WHERE,
      field: "reference",
      received: JSON.stringify(reference),
      expected: `an observer or method of the table: ${study.observers.join(", ")}`,
    }]);
  }
  const measured = study.design === "continuous"
    ? { label: study.quantity.label, unit: study.quantity.unit }
    : { label: study.label, unit: "1" };
  const settings: StudySettings = { multiplier, confidence, quantity: measured };
  const repeatability = study.design === "continuous"
    ? repeatabilityByObserver(study, settings)
    : null;
  const comparisons = study.design === "continuous"
    ? methodComparisons(study, reference!, repeatability, settings)
    : [];
  const kappa = study.design === "graded" ? kappaAnalysis(study, confidence) : null;
  const plans = study.design === "continuous"
    ? figurePlans(study.observers, comparisons, study.readings.length)
    : { figures: [], notDrawn: [] };
  const report: Omit<MethodValidationReport, typeof JUPYTER_DISPLAY> = {
    kind: "sonorigor.methodValidation",
    title: options.title ?? `Method validation report: ${baseName(study.source)}`,
    study: {
      source: study.source,
      columns: study.columns,
      design: study.design,
      measured,
      quantityId: study.design === "continuous" ? study.quantity.id : null,
      reference,
      multiplier,
      confidence,
      categories: study.design === "graded" ? study.categories : null,
      categoriesFrom: study.design === "graded" ? study.categoriesFrom : null,
    },
    data: summarise(study),
    repeatability,
    comparisons,
    icc: study.design === "continuous" ? iccAcrossObservers(study, settings) : null,
    kappa,
    figures: plans.figures,
    interpretation: [NO_VERDICT, ...comparisons.flatMap(findings)],
    cautions: study.design === "continuous"
      ? [
        SAMPLE_CAUTION,
        LIMITS_OF_AGREEMENT_CAUTION,
        SUBJECT_SPREAD_CAUTION,
        AGREEMENT_NOT_A_DIAGNOSIS,
        ...plans.notDrawn,
      ]
      : [SAMPLE_CAUTION, KAPPA_CAUTION, AGREEMENT_NOT_A_DIAGNOSIS],
    provenance: {
      ...options.provenance,
      source: study.source,
      dataRows: study.dataRows,
      readingsUsed: study.readings.length,
      missingValues: study.missing.length,
      deterministic: true,
    },
    readings: study.readings,
  };
  return Object.assign(report, {
    [JUPYTER_DISPLAY]: () => displayMethodValidation(report as MethodValidationReport),
  });
}

function baseName(source: string): string {
  return source.split(/[\\/]/).pop() || source;
}

/** Counts per observer: readings, subjects, fewest and most replicates on one subject. */
function summarise(study: MeasuredReadings | GradedReadings): DataSummary {
  const perSubject = new Map<string, Map<string, number>>();
  for (const o of study.observers) perSubject.set(o, new Map());
  for (const r of study.readings) {
    const m = perSubject.get(r.observer)!;
    m.set(r.subject, (m.get(r.subject) ?? 0) + 1);
  }
  const byObserver: ObserverSummary[] = study.observers.map((observer) => {
    const counts = perSubject.get(observer)!;
    let readings = 0;
    let fewest = Infinity;
    let most = 0;
    for (const c of counts.values()) {
      readings += c;
      if (c < fewest) fewest = c;
      if (c > most) most = c;
    }
    return {
      observer,
      readings,
      subjects: counts.size,
      fewestReplicates: fewest,
      mostReplicates: most,
    };
  });
  return {
    dataRows: study.dataRows,
    readingsUsed: study.readings.length,
    subjects: study.subjects.length,
    observers: study.observers,
    byObserver,
    maxReplicate: study.maxReplicate,
    missing: study.missing,
    blankLines: study.blankLines,
    flags: study.issues.filter((i) => i.severity === "warning"),
  };
}

/** Plain statements of what a comparison's intervals show (no verdict). */
function findings(c: MethodComparison): string[] {
  const out: string[] = [];
  const pair = `${c.test} − ${c.reference}`;
  if (c.blandAltman.status === "computed") {
    const r = c.blandAltman.result;
    out.push(
      r.biasCi.lower > 0 || r.biasCi.upper < 0
        ? `${pair}: the confidence interval of the bias excludes 0, so ${c.test} reads systematically ${
          r.bias > 0 ? "higher" : "lower"
        } than ${c.reference}; a constant offset can be calibrated out, the limits of agreement include it.`
        : `${pair}: the confidence interval of the bias contains 0; no systematic difference is shown at this sample size.`,
    );
    const p = r.proportionalBias;
    if (p && (p.slopeCi.lower > 0 || p.slopeCi.upper < 0)) {
      out.push(
        `${pair}: the slope of the differences on the means excludes 0: the difference changes with the magnitude, so limits of constant width do not describe it (consider the ratio analysis).`,
      );
    }
  }
  if (c.passingBablok.status === "computed" && c.passingBablok.result.linearity.nonLinear) {
    out.push(
      `${c.test} against ${c.reference}: the Passing–Bablok cusum statistic exceeds its 5 % critical value, so the relation is not shown to be linear and the fitted lines should not be used.`,
    );
  }
  return out;
}
