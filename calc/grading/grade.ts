/**
 * Severity grading against guideline tables: a table is data (bands of one quantity, each with its
 * printed threshold and citation); one function grades a value, Monte Carlo samples (the share of
 * samples in each class) or a GUM result (the probability of each class under its normal
 * distribution N(value, u²)).
 *
 * @module
 */
import type { Citation, ValidationIssue, ValueRange } from "../core/types.ts";
import { CLINICAL_CAUTION } from "../core/calculation.ts";
import { inRange, rangeWithin } from "../core/range.ts";
import { issueError, throwIfErrors } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import { type QuantityInput, readAmount } from "../core/units.ts";
import { checkValue, quantityField } from "../core/validate.ts";
import { normalCdf } from "../stats/distributions.ts";
import type { UncertainValue } from "../uncertainty/types.ts";
import { isUncertainValue } from "../uncertainty/uncertain_value.ts";
import { displaySeverityDistribution, displaySeverityGrade } from "../../display/grading.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";
import type {
  SeverityDistribution,
  SeverityGrade,
  SeverityResultBase,
  SeverityTable,
} from "./types.ts";

export type {
  ClassProbability,
  SeverityBand,
  SeverityDistribution,
  SeverityGrade,
  SeverityResultBase,
  SeverityTable,
} from "./types.ts";

/** The caution added to a result whose table holds recalled thresholds. */
const FROM_MEMORY_CAUTION =
  "Thresholds recalled from memory, not re-checked against the printed guideline table: verify them before use";

/**
 * Checks and freezes a severity table: at least one band, each non-empty, bands contiguous and in
 * increasing order, every shared bound belonging to exactly one band, and the bands together
 * covering the quantity's valid range (so every valid value has a class).
 *
 * @param table The table data.
 * @returns The frozen table.
 * @throws {TypeError} When the bands are empty, out of order, overlapping, leave a gap or leave
 * part of the valid range without a class.
 *
 * @example
 * ```ts
 * import { defineSeverityTable, gradeSeverity, REGURGITANT_FRACTION } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const citation = { authors: "Example A", year: 2000, title: "Demo", publication: "Demo" };
 * const table = defineSeverityTable({
 *   id: "demo", title: "Demo", quantity: REGURGITANT_FRACTION, notes: [],
 *   bands: [
 *     { grade: "low", range: { min: 0, max: 50, maxExclusive: true }, printed: "< 50",
 *       citation, fromMemory: false },
 *     { grade: "high", range: { min: 50, max: Infinity, maxExclusive: true }, printed: "≥ 50",
 *       citation, fromMemory: false },
 *   ],
 * });
 * assert.equal(gradeSeverity(table, 50).grade, "high");
 * ```
 */
export function defineSeverityTable(table: SeverityTable): SeverityTable {
  const where = `Severity table '${table.id}'`;
  const bands = table.bands;
  if (bands.length === 0) throw new TypeError(`${where}: expected at least one band, got 0`);
  bands.forEach((b, i) => {
    const r = b.range;
    if (!(r.min < r.max)) {
      throw new TypeError(
        `${where}: band '${b.grade}' has an empty range; expected min < max, got [${r.min}, ${r.max}]`,
      );
    }
    const next = bands[i + 1];
    if (next === undefined) return;
    if (r.max !== next.range.min) {
      throw new TypeError(
        `${where}: band '${next.grade}' must start where '${b.grade}' ends (${r.max}), got ${next.range.min}`,
      );
    }
    const inFirst = !r.maxExclusive, inNext = !next.range.minExclusive;
    if (inFirst === inNext) {
      throw new TypeError(
        `${where}: the bound ${r.max} must belong to exactly one of '${b.grade}' and '${next.grade}', got ${
          inFirst ? "both" : "neither"
        }`,
      );
    }
  });
  const q = table.quantity;
  if (!rangeWithin(q.valid, domainOf(table))) {
    throw new TypeError(
      `${where}: expected the bands to cover the valid range of ${q.label} [${q.valid.min}, ${q.valid.max}], got [${
        bands[0]!.range.min
      }, ${bands[bands.length - 1]!.range.max}]`,
    );
  }
  return Object.freeze({
    ...table,
    bands: Object.freeze(bands.map((b) => Object.freeze({ ...b }))),
    notes: Object.freeze([...table.notes]),
  });
}

/** The values the bands of a table cover together. */
function domainOf(table: SeverityTable): ValueRange {
  const first = table.bands[0]!.range, last = table.bands[table.bands.length - 1]!.range;
  return {
    min: first.min,
    max: last.max,
    ...(first.minExclusive ? { minExclusive: true } : {}),
    ...(last.maxExclusive ? { maxExclusive: true } : {}),
  };
}

/** The band ranges with the lowest and highest opened to ±∞ (for distributions, whose tails
 * beyond every threshold belong to the extreme classes). */
function openEnded(table: SeverityTable): ValueRange[] {
  const n = table.bands.length;
  return table.bands.map((b, i) => ({
    ...b.range,
    ...(i === 0 ? { min: -Infinity, minExclusive: true } : {}),
    ...(i === n - 1 ? { max: Infinity, maxExclusive: true } : {}),
  }));
}

function bandIndex(ranges: readonly ValueRange[], value: number): number {
  return ranges.findIndex((r) => inRange(value, r));
}

/** What every result carries: citations, the "from memory" mark, notes and cautions. */
function provenance(
  table: SeverityTable,
  bandAt: number,
): Omit<SeverityResultBase, typeof JUPYTER_DISPLAY> {
  const citations: Citation[] = [];
  for (const b of table.bands) if (!citations.includes(b.citation)) citations.push(b.citation);
  const fromMemory = table.bands.some((b) => b.fromMemory);
  return {
    table,
    grade: table.bands[bandAt]!.grade,
    band: table.bands[bandAt]!,
    citations,
    fromMemory,
    cautions: [...(fromMemory ? [FROM_MEMORY_CAUTION] : []), CLINICAL_CAUTION],
  };
}

function whereOf(table: SeverityTable): string {
  return `Severity grading (${table.title})`;
}

function typeProblem(table: SeverityTable, field: string, expected: string, got: string) {
  const issue: ValidationIssue = {
    kind: "type",
    severity: "error",
    where: whereOf(table),
    field,
    expected,
    received: got,
  };
  return issueError([issue]);
}

function isArrayOfNumbers(value: unknown): value is ArrayLike<number> {
  return Array.isArray(value) || (ArrayBuffer.isView(value) && !(value instanceof DataView));
}

/**
 * Grades a value against a severity table: the class whose band contains it.
 *
 * @param table A severity table (see the exported guideline tables).
 * @param value A value in the table quantity's unit, or a quantity string ("0.9 cm^2").
 * @returns The grade with the table's citations, its "from memory" mark and cautions; it displays
 * itself in a notebook.
 * @throws {TypeError} When the value is of the wrong type or unit.
 * @throws {RangeError} For a value outside the quantity's valid range (NaN included).
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const g = gradeSeverity(AORTIC_STENOSIS_2017.peakVelocity, 4.0);
 * assert.equal(g.grade, "severe");
 * assert.equal(g.fromMemory, true); // the thresholds were recalled, and the result says so
 * // a quantity string is read in the quantity's unit: 0.9 cm² is severe by area
 * assert.equal(gradeSeverity(AORTIC_STENOSIS_2017.valveArea, "90 mm^2").grade, "severe");
 * ```
 */
export function gradeSeverity(table: SeverityTable, value: QuantityInput): SeverityGrade;
/**
 * Grades an uncertain value or samples against a severity table: the probability of each class,
 * the most likely class and the class of the median. A Monte Carlo value (with its samples) or
 * given samples: the share of samples in each class. A GUM value: the probability of each class
 * under the normal distribution N(value, u²) of the result (the normal approximation that
 * JCGM 100:2008 Annex G justifies by the central limit theorem, from memory; it ignores the
 * skewness of a non-linear model, which Monte Carlo keeps), stated in the result's `basis`.
 *
 * @param table A severity table.
 * @param value An uncertain value of the quantity (or of a unit convertible to it), or samples in
 * the quantity's unit.
 * @returns The grade distribution; it displays itself in a notebook.
 * @throws {TypeError} For empty samples, a Monte Carlo value without samples, or a unit that does
 * not convert to the quantity's.
 * @throws {RangeError} For a sample that is not finite.
 *
 * @example A GUM valve area of 1.047 ± 0.105 cm²: about a one-in-three chance of severe
 * ```ts
 * import { AORTIC_STENOSIS_2017, continuityValveArea, gradeSeverity, normal, propagate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = propagate(continuityValveArea, {
 *   lvotDiameterCm: normal(2.0, 0.1), lvotVtiCm: 20, avVtiCm: 60,
 * });
 * const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, r.outputs.avaCm2);
 * // y = π/3 = 1.0472 cm², u = 10 % of y (JCGM 100 §5.1.6); P(AVA < 1.0) = Φ(−0.4507) = 0.3261
 * // (standard normal table)
 * const severe = d.probabilities.find((p) => p.grade === "severe")!.probability;
 * assert.equal(d.method, "normal");
 * assert.ok(Math.abs(severe - 0.3261) < 1e-4);
 * assert.equal(d.grade, "moderate"); // the class of the estimate
 * ```
 */
export function gradeSeverity(
  table: SeverityTable,
  value: UncertainValue | ArrayLike<number>,
): SeverityDistribution;
export function gradeSeverity(
  table: SeverityTable,
  value: QuantityInput | UncertainValue | ArrayLike<number>,
): SeverityGrade | SeverityDistribution {
  if (isUncertainValue(value)) return gradeUncertain(table, value);
  if (isArrayOfNumbers(value)) return gradeSamples(table, value, 1, null);
  const q = table.quantity;
  const checked = checkValue("value", quantityField(q), value, { where: whereOf(table) });
  throwIfErrors(checked.issues);
  const v = checked.value!;
  const result: SeverityGrade = {
    kind: "sonorigor.severityGrade",
    value: v,
    ...provenance(table, bandIndex(table.bands.map((b) => b.range), v)),
    [JUPYTER_DISPLAY]: () => displaySeverityGrade(result),
  };
  return result;
}

/** The factor from an uncertain value's unit to the table quantity's. */
function unitFactor(table: SeverityTable, v: UncertainValue): number {
  const to = table.quantity.unit;
  const f = v.unit === to ? 1 : readAmount(`1 ${v.unit}`, to);
  if (typeof f !== "number") {
    throw typeProblem(
      table,
      v.name,
      `as a value convertible to ${to} (${table.quantity.label})`,
      `a value in ${v.unit} (${v.label})`,
    );
  }
  return f;
}

function gradeUncertain(table: SeverityTable, v: UncertainValue): SeverityDistribution {
  const factor = unitFactor(table, v);
  const interval = { lower: v.interval.lower * factor, upper: v.interval.upper * factor };
  if (v.method === "monteCarlo") {
    if (v.samples === null) {
      throw typeProblem(
        table,
        v.name,
        "as a Monte Carlo value with its samples (propagate with keepSamples: true, not adaptive)",
        "a Monte Carlo value without samples",
      );
    }
    return gradeSamples(table, v.samples, factor, { interval, coverage: v.coverage });
  }
  const y = v.value * factor, u = v.standardUncertainty * factor;
  const ranges = openEnded(table);
  const mass = (r: ValueRange) => {
    if (u === 0) return inRange(y, r) ? 1 : 0;
    return normalCdf((r.max - y) / u) - normalCdf((r.min - y) / u);
  };
  const valid = table.quantity.valid;
  const outsideValid = u === 0
    ? (inRange(y, valid) ? 0 : 1)
    : normalCdf((valid.min - y) / u) + (1 - normalCdf((valid.max - y) / u));
  return distribution(table, {
    method: "normal",
    basis:
      "Probability of each class under the normal distribution N(y, u²) of the GUM result (estimate y, standard uncertainty u)",
    value: y,
    standardUncertainty: u,
    median: y,
    count: null,
    interval,
    coverage: v.coverage,
    probabilities: ranges.map(mass),
    outsideValid,
    excluded: 0,
  });
}

function gradeSamples(
  table: SeverityTable,
  samples: ArrayLike<number>,
  factor: number,
  coverage: { interval: { lower: number; upper: number }; coverage: number } | null,
): SeverityDistribution {
  if (samples.length === 0) {
    throw typeProblem(table, "samples", "with at least one value", "an empty array");
  }
  const ranges = openEnded(table);
  const counts = new Array<number>(ranges.length).fill(0);
  const kept = new Float64Array(samples.length);
  const valid = table.quantity.valid;
  let outside = 0, sum = 0, n = 0, excluded = 0;
  for (let i = 0; i < samples.length; i++) {
    const raw = samples[i];
    // NaN marks a Monte Carlo trial excluded as physically inconsistent: not a class member
    if (typeof raw === "number" && raw !== raw) {
      excluded++;
      continue;
    }
    if (typeof raw !== "number" || !Number.isFinite(raw)) {
      throw issueError([{
        kind: typeof raw === "number" ? "range" : "type",
        severity: "error",
        where: whereOf(table),
        field: `samples[${i}]`,
        expected: typeof raw === "number" ? "finite" : "as a number",
        received: describeValue(raw),
      }]);
    }
    const s = raw * factor;
    counts[bandIndex(ranges, s)]!++;
    if (!inRange(s, valid)) outside++;
    kept[n++] = s;
    sum += s;
  }
  if (n === 0) {
    throw typeProblem(
      table,
      "samples",
      "at least one sample that was not excluded",
      `${excluded} excluded (NaN) samples only`,
    );
  }
  const sorted = kept.subarray(0, n);
  sorted.sort();
  const mean = sum / n;
  let squares = 0;
  for (let i = 0; i < n; i++) squares += (sorted[i]! - mean) ** 2;
  const median = n % 2 === 1 ? sorted[(n - 1) / 2]! : (sorted[n / 2 - 1]! + sorted[n / 2]!) / 2;
  return distribution(table, {
    method: "samples",
    basis: (coverage === null
      ? "Share of the given samples in each class"
      : "Share of the Monte Carlo samples in each class") +
      (excluded > 0
        ? ` (${excluded} trials excluded as physically inconsistent are not counted)`
        : ""),
    value: mean,
    standardUncertainty: n > 1 ? Math.sqrt(squares / (n - 1)) : 0,
    median,
    count: n,
    interval: coverage?.interval ?? null,
    coverage: coverage?.coverage ?? null,
    probabilities: counts.map((c) =>
      c / n
    ),
    outsideValid: outside / n,
    excluded,
  });
}

function distribution(
  table: SeverityTable,
  d:
    & Omit<
      SeverityDistribution,
      keyof SeverityResultBase | "kind" | "mostLikely" | "probabilities"
    >
    & { probabilities: number[] },
): SeverityDistribution {
  let best = 0;
  d.probabilities.forEach((p, i) => {
    if (p > d.probabilities[best]!) best = i;
  });
  const result: SeverityDistribution = {
    kind: "sonorigor.severityDistribution",
    ...d,
    ...provenance(table, bandIndex(openEnded(table), d.median)),
    mostLikely: table.bands[best]!.grade,
    probabilities: table.bands.map((b, i) => ({
      grade: b.grade,
      printed: b.printed,
      probability: d.probabilities[i]!,
    })),
    [JUPYTER_DISPLAY]: () => displaySeverityDistribution(result),
  };
  return result;
}
