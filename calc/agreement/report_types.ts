/**
 * The shape of a method-validation report: plain data (it serialises to JSON as it is), read by
 * the HTML and Markdown renderers, the notebook display and the charts. Types only.
 *
 * @module
 */
import type { MimeBundle, ValidationIssue } from "../core/types.ts";
import type { Reading, StudyReadings } from "./validation_table.ts";
import type { ValidationColumns } from "./validation_columns.ts";
import type { JUPYTER_DISPLAY } from "../../display/mime.ts";
import type {
  BlandAltmanRepeatedResult,
  BlandAltmanResult,
  CohenKappaResult,
  ConcordanceResult,
  DemingResult,
  FleissKappaResult,
  IntraclassCorrelationResult,
  KappaWeights,
  Measured,
  PassingBablokResult,
  RepeatabilityResult,
} from "./types.ts";

/** A statistic that was computed, or the reason it was not (too few subjects, no variation…). */
export type Outcome<T> =
  | { readonly status: "computed"; readonly result: T }
  | { readonly status: "not computed"; readonly reason: string };

/** What the study is: its source, columns, design and options. */
export interface StudyDescription {
  /** The source (file name) of the table. */
  readonly source: string;
  /** The columns used. */
  readonly columns: ValidationColumns;
  /** Measurements or graded findings. */
  readonly design: "continuous" | "graded";
  /** What was measured (label and unit; unit "1" for graded findings). */
  readonly measured: Measured;
  /** Id of the package's quantity, "statedQuantity" for one stated by the user, null when
   * graded. */
  readonly quantityId: string | null;
  /** Reference observer or method of the comparisons (null when graded). */
  readonly reference: string | null;
  /** Multiplier of the limits of agreement and of the repeatability coefficient. */
  readonly multiplier: number;
  /** Confidence level of every interval. */
  readonly confidence: number;
  /** Graded findings: the categories in order (null for measurements). */
  readonly categories: readonly string[] | null;
  /** Where that order comes from. */
  readonly categoriesFrom: "option" | "first appearance" | null;
}

/** Counts of one observer or method. */
export interface ObserverSummary {
  /** Observer or method. */
  readonly observer: string;
  /** Readings used. */
  readonly readings: number;
  /** Subjects with at least one reading. */
  readonly subjects: number;
  /** Fewest replicates on one subject. */
  readonly fewestReplicates: number;
  /** Most replicates on one subject. */
  readonly mostReplicates: number;
}

/** What the table held and what was used: the study's rows, observers, largest replicate,
 * missing readings and blank lines, with counts. */
export interface DataSummary
  extends
    Pick<StudyReadings, "dataRows" | "observers" | "maxReplicate" | "missing" | "blankLines"> {
  /** Readings used by the statistics. */
  readonly readingsUsed: number;
  /** Subjects with at least one reading. */
  readonly subjects: number;
  /** Counts per observer. */
  readonly byObserver: readonly ObserverSummary[];
  /** Warnings about values kept (outside the quantity's typical range). */
  readonly flags: readonly ValidationIssue[];
}

/** Repeatability of one observer or method from its replicates. */
export interface ObserverRepeatability {
  /** Observer or method. */
  readonly observer: string;
  /** Subjects with at least two readings (used). */
  readonly subjectsUsed: number;
  /** Subjects with fewer than two readings (left out). */
  readonly subjectsLeftOut: number;
  /** The statistic. */
  readonly outcome: Outcome<RepeatabilityResult>;
}

/** One observer or method compared with another on first readings (replicate 1). */
export interface MethodComparison {
  /** The method compared (y; differences are test − reference). */
  readonly test: string;
  /** The method it is compared with (x): the study's reference, or another observer. */
  readonly reference: string;
  /** "reference" when `reference` is the study's reference; "observer" for a comparison
   * between two observers or methods other than the reference. */
  readonly against: "reference" | "observer";
  /** Subjects with a first reading by both. */
  readonly subjects: readonly string[];
  /** Subjects of the study lacking a first reading by either (left out). */
  readonly subjectsLeftOut: number;
  /** First readings of the reference, by subject. */
  readonly x: readonly number[];
  /** First readings of the test method, by subject. */
  readonly y: readonly number[];
  /** Bland–Altman analysis of first readings. */
  readonly blandAltman: Outcome<BlandAltmanResult>;
  /** Bland–Altman with all replicates paired by number (null without replicates). */
  readonly blandAltmanRepeated: Outcome<BlandAltmanRepeatedResult> | null;
  /** Lin's concordance correlation. */
  readonly concordance: Outcome<ConcordanceResult>;
  /** Error variance ratio used by Deming regression, and where it comes from. */
  readonly errorVarianceRatio: {
    readonly value: number;
    readonly from: "replicates" | "assumed";
  };
  /** Deming regression of test on reference. */
  readonly deming: Outcome<DemingResult>;
  /** Passing–Bablok regression of test on reference. */
  readonly passingBablok: Outcome<PassingBablokResult>;
}

/** The intraclass correlation across all observers (first readings, complete subjects). */
export interface IccAnalysis {
  /** Observers in column order. */
  readonly observers: readonly string[];
  /** Subjects with a first reading by every observer (used). */
  readonly completeSubjects: number;
  /** Subjects left out as incomplete. */
  readonly leftOut: readonly string[];
  /** The statistic. */
  readonly outcome: Outcome<IntraclassCorrelationResult>;
}

/** Cohen's kappa of one pair of raters, with each weighting. */
export interface KappaPair {
  /** First rater (table rows). */
  readonly raterA: string;
  /** Second rater (table columns). */
  readonly raterB: string;
  /** Subjects graded (first reading) by both. */
  readonly subjects: number;
  /** Unweighted, linear and quadratic weights, in that order. */
  readonly kappas: readonly {
    readonly weights: KappaWeights;
    readonly outcome: Outcome<CohenKappaResult>;
  }[];
}

/** Agreement on graded findings. */
export interface KappaAnalysis {
  /** Categories in order. */
  readonly categories: readonly string[];
  /** Cohen's kappa of each pair of raters. */
  readonly pairs: readonly KappaPair[];
  /** Fleiss' kappa across all raters (null with fewer than 3 raters). */
  readonly fleiss: {
    readonly completeSubjects: number;
    readonly leftOut: number;
    readonly outcome: Outcome<FleissKappaResult>;
  } | null;
}

/** A chart the report has, with a file name unique within the report. */
export interface FigurePlan {
  /** What it shows. */
  readonly kind: "blandAltman" | "comparison" | "observers";
  /** Index into `comparisons` (null for the observer plot). */
  readonly comparison: number | null;
  /** File name: derived from the observer names, unique within the report, safe on every
   * file system (ASCII letters, digits, "-", "_"). */
  readonly file: string;
}

/** What the caller knows about the run (the command line fills these in). */
export interface ProvenanceDetails {
  /** SHA-256 of the input file, hexadecimal. */
  readonly inputSha256?: string;
  /** Tool name and version. */
  readonly tool?: string;
  /** Runtime and version. */
  readonly runtime?: string;
  /** Pinned dependencies, one "name: version" each. */
  readonly dependencies?: readonly string[];
  /** Date and time of the run (ISO 8601). */
  readonly date?: string;
}

/** Where the numbers come from. */
export interface Provenance extends ProvenanceDetails {
  /** The source (file name). */
  readonly source: string;
  /** Data rows read. */
  readonly dataRows: number;
  /** Readings used. */
  readonly readingsUsed: number;
  /** Empty value cells left out. */
  readonly missingValues: number;
  /** True: no statistic of the report draws random numbers. */
  readonly deterministic: true;
}

/** The method-validation report: plain data, displayed in notebooks, rendered to HTML and
 * Markdown by display/agreement.ts. */
export interface MethodValidationReport {
  /** Brand. */
  readonly kind: "sonorigor.methodValidation";
  /** Title. */
  readonly title: string;
  /** The study. */
  readonly study: StudyDescription;
  /** Counts. */
  readonly data: DataSummary;
  /** Repeatability per observer (null without replicates or for graded findings). */
  readonly repeatability: readonly ObserverRepeatability[] | null;
  /** Every pair of observers or methods: each against the reference, then each pair of the
   * others (empty for graded findings or a single observer). */
  readonly comparisons: readonly MethodComparison[];
  /** ICC across observers (null for graded findings or a single observer). */
  readonly icc: IccAnalysis | null;
  /** Kappa statistics (null for measurements). */
  readonly kappa: KappaAnalysis | null;
  /** The charts the report has. */
  readonly figures: readonly FigurePlan[];
  /** How to read the results: no pass or fail, then what each comparison shows. */
  readonly interpretation: readonly string[];
  /** Cautions. */
  readonly cautions: readonly string[];
  /** Provenance. */
  readonly provenance: Provenance;
  /** The readings used (numbers for measurements, categories for graded findings). */
  readonly readings: readonly Reading<number>[] | readonly Reading<string>[];
  /** Notebook display: the summary tables. */
  [JUPYTER_DISPLAY](): MimeBundle;
}
