/**
 * Severity grading against guideline tables: a table is data (bands of one measured quantity, each
 * with its printed threshold and source); one function grades a value, or a set of Monte Carlo
 * samples into the probability of each class.
 *
 * @module
 */
import type { Reference } from "../core/types.ts";
import {
  escapeHtml,
  formatNumber,
  formatUnit,
  htmlTable,
  JUPYTER_DISPLAY,
  type MimeBundle,
  textTable,
} from "../core/display.ts";

/** One class of a severity table: a half-open or closed interval of the graded quantity. */
export interface SeverityBand {
  /** Class label as the guideline names it, e.g. "severe". */
  readonly grade: string;
  /** Lower bound in the table's unit, or null for no lower bound. */
  readonly lower: number | null;
  /** True when the lower bound itself belongs to this band. */
  readonly lowerInclusive: boolean;
  /** Upper bound in the table's unit, or null for no upper bound. */
  readonly upper: number | null;
  /** True when the upper bound itself belongs to this band. */
  readonly upperInclusive: boolean;
  /** The threshold as printed in the source, e.g. "≥ 4.0" or "2.6–2.9". */
  readonly printed: string;
  /** Where this row comes from (with table locator). */
  readonly source: Reference;
  /** True when the row was recalled rather than re-checked against the printed table. */
  readonly fromMemory: boolean;
}

/** A guideline severity table for one quantity. Bands are ordered by increasing value. */
export interface SeverityTable {
  /** Stable identifier, e.g. "aorticStenosisPeakVelocity2017". */
  readonly id: string;
  /** Human title. */
  readonly title: string;
  /** What is graded, e.g. "Peak aortic jet velocity". */
  readonly quantity: string;
  /** Unit of the graded quantity (same as the calculation output it grades). */
  readonly unit: string;
  /** Bands in increasing order of the quantity, contiguous, covering the domain. */
  readonly bands: readonly SeverityBand[];
  /** Notes on how printed thresholds were turned into contiguous bands, and caveats. */
  readonly notes: readonly string[];
}

/** The grade of one value. */
export interface SeverityGrade {
  /** Table identifier. */
  readonly table: string;
  /** The graded value. */
  readonly value: number;
  /** Class label. */
  readonly grade: string;
  /** The matching band. */
  readonly band: SeverityBand;
  /** Notebook display. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

/** Probability of one class from samples. */
export interface ClassProbability {
  /** Class label. */
  readonly grade: string;
  /** Threshold as printed in the source. */
  readonly printed: string;
  /** Fraction of samples in this class, in [0, 1]. */
  readonly probability: number;
}

/** The grade distribution of a set of samples (e.g. Monte Carlo output samples). */
export interface SeverityDistribution {
  /** Table identifier. */
  readonly table: string;
  /** Number of samples. */
  readonly count: number;
  /** Median of the samples. */
  readonly median: number;
  /** Class of the median. */
  readonly grade: string;
  /** Class with the highest probability. */
  readonly mostLikely: string;
  /** Probability of each class, in the table's band order. */
  readonly probabilities: readonly ClassProbability[];
  /** Notebook display. */
  [JUPYTER_DISPLAY](): MimeBundle;
}

function boundText(b: SeverityBand, unit: string): string {
  const lo = b.lower === null ? "-∞" : String(b.lower);
  const hi = b.upper === null ? "∞" : String(b.upper);
  return `${b.lower !== null && b.lowerInclusive ? "[" : "("}${lo}, ${hi}${
    b.upper !== null && b.upperInclusive ? "]" : ")"
  } ${unit}`;
}

/**
 * Checks and freezes a severity table: at least one band, bands contiguous and in increasing
 * order, every shared bound belonging to exactly one band.
 *
 * @param table The table data.
 * @returns The frozen table.
 * @throws {TypeError} When the bands are empty, out of order, overlapping or leave a gap.
 *
 * @example
 * ```ts
 * import { defineSeverityTable, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const source = { authors: "Example A", year: 2000, title: "Demo", publication: "Demo" };
 * const table = defineSeverityTable({
 *   id: "demo", title: "Demo", quantity: "x", unit: "1", notes: [],
 *   bands: [
 *     { grade: "low", lower: null, lowerInclusive: false, upper: 1, upperInclusive: false,
 *       printed: "< 1", source, fromMemory: false },
 *     { grade: "high", lower: 1, lowerInclusive: true, upper: null, upperInclusive: false,
 *       printed: "≥ 1", source, fromMemory: false },
 *   ],
 * });
 * assert.equal(gradeSeverity(table, 1).grade, "high");
 * ```
 */
export function defineSeverityTable(table: SeverityTable): SeverityTable {
  const where = `Severity table '${table.id}'`;
  if (table.bands.length === 0) throw new TypeError(`${where}: expected at least one band, got 0`);
  table.bands.forEach((b, i) => {
    if (b.lower !== null && b.upper !== null && !(b.lower < b.upper)) {
      throw new TypeError(
        `${where}: band '${b.grade}' has an empty interval ${boundText(b, table.unit)}`,
      );
    }
    const next = table.bands[i + 1];
    if (next === undefined) return;
    if (b.upper === null || next.lower === null || b.upper !== next.lower) {
      throw new TypeError(
        `${where}: band '${next.grade}' must start where '${b.grade}' ends (${b.upper}), got ${next.lower}`,
      );
    }
    if (b.upperInclusive === next.lowerInclusive) {
      throw new TypeError(
        `${where}: the bound ${b.upper} must belong to exactly one of '${b.grade}' and '${next.grade}', got ${
          b.upperInclusive ? "both" : "neither"
        }`,
      );
    }
  });
  return Object.freeze({
    ...table,
    bands: Object.freeze(table.bands.map((b) => Object.freeze({ ...b }))),
  });
}

function inBand(value: number, b: SeverityBand): boolean {
  const aboveLower = b.lower === null || (b.lowerInclusive ? value >= b.lower : value > b.lower);
  const belowUpper = b.upper === null || (b.upperInclusive ? value <= b.upper : value < b.upper);
  return aboveLower && belowUpper;
}

function domainText(table: SeverityTable): string {
  const first = table.bands[0]!;
  const last = table.bands[table.bands.length - 1]!;
  return boundText(
    { ...first, upper: last.upper, upperInclusive: last.upperInclusive },
    formatUnit(table.unit),
  ).trim();
}

function bandIndex(table: SeverityTable, value: number, where: string): number {
  for (let i = 0; i < table.bands.length; i++) if (inBand(value, table.bands[i]!)) return i;
  throw new RangeError(`${where}: expected a value in ${domainText(table)}, got ${value}`);
}

function isArrayLikeOfNumbers(value: unknown): value is ArrayLike<number> {
  return Array.isArray(value) || (ArrayBuffer.isView(value) && !(value instanceof DataView));
}

/**
 * Grades a value, or a set of samples, against a severity table.
 *
 * With a number: returns the class whose band contains it. With samples (an array, a typed array
 * or an object with `samples`, such as a Monte Carlo output): returns the probability of each
 * class (the fraction of samples in its band), the most likely class, and the class of the median.
 *
 * @param table A severity table (see the exported guideline tables).
 * @param value A value in the table's unit, or samples of it.
 * @returns The grade, or the grade distribution for samples.
 * @throws {TypeError} When the value is neither a number nor samples, or the samples are empty.
 * @throws {RangeError} For a value or sample that is not finite or lies outside the table's domain
 * (e.g. a negative velocity); the message names the index and the value.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(gradeSeverity(AORTIC_STENOSIS_2017.peakVelocity, 4.0).grade, "severe");
 * const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 0.95, 1.05, 1.2]);
 * assert.equal(d.probabilities.find((p) => p.grade === "severe")?.probability, 0.5);
 * ```
 */
export function gradeSeverity(table: SeverityTable, value: number): SeverityGrade;
/**
 * Grades Monte Carlo samples (an array, a typed array or an object with `samples`) against a
 * severity table: the probability of each class, the most likely class and the class of the median.
 *
 * @param table A severity table.
 * @param value Samples in the table's unit, or an object with `samples` (a Monte Carlo output).
 * @returns The grade distribution.
 * @throws {TypeError} For empty samples. @throws {RangeError} For a non-finite or out-of-domain sample.
 *
 * @example
 * ```ts
 * import { gradeSeverity, MITRAL_REGURGITATION_2017 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const d = gradeSeverity(MITRAL_REGURGITATION_2017.eroa, { samples: new Float64Array([0.35, 0.45]) });
 * assert.equal(d.probabilities.at(-1)?.probability, 0.5);
 * ```
 */
export function gradeSeverity(
  table: SeverityTable,
  value: ArrayLike<number> | { readonly samples: ArrayLike<number> },
): SeverityDistribution;
export function gradeSeverity(
  table: SeverityTable,
  value: number | ArrayLike<number> | { readonly samples: ArrayLike<number> },
): SeverityGrade | SeverityDistribution {
  const where = `Severity grading (${table.title})`;
  if (typeof value === "number") {
    if (!Number.isFinite(value)) {
      throw new RangeError(
        `${where}: expected a finite value in ${domainText(table)}, got ${value}`,
      );
    }
    const band = table.bands[bandIndex(table, value, where)]!;
    const result: SeverityGrade = {
      table: table.id,
      value,
      grade: band.grade,
      band,
      [JUPYTER_DISPLAY]: () => displayGrade(table, result),
    };
    return result;
  }
  const samples = isArrayLikeOfNumbers(value)
    ? value
    : typeof value === "object" && value !== null &&
        isArrayLikeOfNumbers((value as { samples?: unknown }).samples)
    ? (value as { samples: ArrayLike<number> }).samples
    : null;
  if (samples === null) {
    throw new TypeError(
      `${where}: expected a number, an array of samples or an object with 'samples', got ${
        value === null ? "null" : typeof value
      }`,
    );
  }
  const n = samples.length;
  if (n === 0) throw new TypeError(`${where}: expected at least one sample, got 0`);
  const counts = new Array<number>(table.bands.length).fill(0);
  const sorted = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const s = samples[i]!;
    if (typeof s !== "number" || !Number.isFinite(s)) {
      throw new RangeError(`${where}: expected 'samples[${i}]' finite, got ${s}`);
    }
    counts[bandIndex(table, s, `${where}: 'samples[${i}]'`)]!++;
    sorted[i] = s;
  }
  sorted.sort();
  const median = n % 2 === 1 ? sorted[(n - 1) / 2]! : (sorted[n / 2 - 1]! + sorted[n / 2]!) / 2;
  const probabilities = table.bands.map((b, i) => ({
    grade: b.grade,
    printed: b.printed,
    probability: counts[i]! / n,
  }));
  let best = 0;
  for (let i = 1; i < counts.length; i++) if (counts[i]! > counts[best]!) best = i;
  const result: SeverityDistribution = {
    table: table.id,
    count: n,
    median,
    grade: table.bands[bandIndex(table, median, where)]!.grade,
    mostLikely: table.bands[best]!.grade,
    probabilities,
    [JUPYTER_DISPLAY]: () => displayDistribution(table, result),
  };
  return result;
}

function sourceText(b: SeverityBand): string {
  return `${b.source.authors.split(",")[0]} et al. ${b.source.year}${
    b.source.locator ? `, ${b.source.locator}` : ""
  }${b.fromMemory ? " (from memory)" : ""}`;
}

function displayGrade(table: SeverityTable, r: SeverityGrade): MimeBundle {
  const line = `${table.quantity} ${
    formatNumber(r.value)
  } ${table.unit}: ${r.grade} (${r.band.printed}; ${sourceText(r.band)})`;
  return { "text/plain": line, "text/html": `<p>${escapeHtml(line)}</p>` };
}

function displayDistribution(table: SeverityTable, r: SeverityDistribution): MimeBundle {
  const header = ["class", "threshold", "probability"];
  const rows = r.probabilities.map((
    p,
  ) => [p.grade, `${p.printed} ${table.unit}`, formatNumber(p.probability, 3)]);
  const title = `${table.title}: median ${
    formatNumber(r.median)
  } ${table.unit} → ${r.grade}; most likely ${r.mostLikely} (n = ${r.count})`;
  return {
    "text/plain": [title, textTable(header, rows)].join("\n"),
    "text/html": `<div><b>${escapeHtml(title)}</b>${htmlTable(header, rows)}</div>`,
  };
}
