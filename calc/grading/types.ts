/**
 * The shapes of severity grading: guideline tables as data (bands of one quantity, each with its
 * printed threshold and citation) and the results of grading a value or a distribution. Types
 * only, so that the displays read them without importing any computation.
 *
 * @module
 */
import type { Citation, MimeBundle, Quantity, ValueRange } from "../core/types.ts";
import type { Interval } from "../uncertainty/types.ts";
import type { JUPYTER_DISPLAY } from "../../display/mime.ts";

/** One class of a severity table: the values of the graded quantity that belong to it. */
export interface SeverityBand {
  /** Class label as the guideline names it, e.g. "severe". */
  readonly grade: string;
  /** The values of this class, in the quantity's unit (±∞ where the class is unbounded; an
   * exclusive end does not belong to it). */
  readonly range: ValueRange;
  /** The threshold as printed in the source, e.g. "≥ 4.0" or "2.6–2.9". */
  readonly printed: string;
  /** Where this row comes from, with the table's locator. */
  readonly citation: Citation;
  /** True when the row was recalled rather than re-checked against the printed table. */
  readonly fromMemory: boolean;
}

/** A guideline severity table for one quantity. Bands are ordered by increasing value. */
export interface SeverityTable {
  /** Stable identifier, e.g. "aorticStenosisPeakVelocity2017". */
  readonly id: string;
  /** Human title. */
  readonly title: string;
  /** The quantity graded (its label, unit and valid range). */
  readonly quantity: Quantity;
  /** Bands in increasing order of the quantity, contiguous, covering its valid range. */
  readonly bands: readonly SeverityBand[];
  /** Notes on how printed thresholds were turned into contiguous bands, and caveats. */
  readonly notes: readonly string[];
}

/** What every grading result carries: the table, the class, its provenance and cautions. */
export interface SeverityResultBase {
  /** The table graded against. */
  readonly table: SeverityTable;
  /** The class of the value (of the median, for a distribution). */
  readonly grade: string;
  /** The band of that class. */
  readonly band: SeverityBand;
  /** The citations of the table's rows, each once. */
  readonly citations: readonly Citation[];
  /** True when any threshold of the table was recalled from memory rather than re-checked. */
  readonly fromMemory: boolean;
  /** A "from memory" warning where it applies, and the clinical caution (the table's own notes
   * are in `table.notes`). */
  readonly cautions: readonly string[];
  /** Notebook display. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** The grade of one value. */
export interface SeverityGrade extends SeverityResultBase {
  /** Brand used by displays. */
  readonly kind: "sonorigor.severityGrade";
  /** The graded value, in the quantity's unit. */
  readonly value: number;
}

/** The probability of one class. */
export interface ClassProbability {
  /** Class label. */
  readonly grade: string;
  /** Threshold as printed in the source. */
  readonly printed: string;
  /** Probability of the class, in [0, 1]. */
  readonly probability: number;
}

/** The grade distribution of an uncertain value or of samples. */
export interface SeverityDistribution extends SeverityResultBase {
  /** Brand used by displays. */
  readonly kind: "sonorigor.severityDistribution";
  /** "samples": shares of Monte Carlo (or given) samples; "normal": probabilities of the normal
   * distribution N(value, u²) of a GUM result. */
  readonly method: "samples" | "normal";
  /** How the probabilities were obtained, in words. */
  readonly basis: string;
  /** The estimate: the GUM value, the Monte Carlo average, or the mean of the samples. */
  readonly value: number;
  /** Standard uncertainty of the value (of the samples, for given samples). */
  readonly standardUncertainty: number;
  /** Median of the distribution (the value itself for the normal). */
  readonly median: number;
  /** Number of samples (null for the normal distribution). */
  readonly count: number | null;
  /** Coverage interval of the uncertain value (null for given samples). */
  readonly interval: Interval | null;
  /** Coverage probability of `interval` (null for given samples). */
  readonly coverage: number | null;
  /** Class with the highest probability (the first in table order on a tie). */
  readonly mostLikely: string;
  /** Probability of each class, in the table's band order; they sum to 1 (the lowest and highest
   * classes include any part of the distribution below or above every threshold). */
  readonly probabilities: readonly ClassProbability[];
  /** Probability that the quantity lies outside its valid range (a part of the distribution that
   * is physically impossible, counted in the lowest or highest class). */
  readonly outsideValid: number;
  /** Samples not counted: Monte Carlo trials excluded as physically inconsistent (NaN). */
  readonly excluded: number;
}
