/**
 * Adult reference limits from the 2015 ASE/EACVI chamber-quantification recommendations
 * (Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39), as data: each row with its table, and a
 * classification into normal / mildly / moderately / severely abnormal where the guideline gives
 * partitions.
 *
 * All numbers here were entered from memory of the guideline tables and cross-read against
 * secondary summaries of them; each row says so in `fromMemory`. Verify against the guideline
 * before clinical use.
 *
 * @module
 */
import type { Reference } from "../core/types.ts";
import { LANG_2015 } from "../references.ts";

/** Shared publications, re-exported under this module's names. */
export { LANG_2015 };

/** Sex a reference row applies to ("any" when the guideline gives one range for both). */
export type ReferenceSex = "male" | "female" | "any";

/** Severity class of a value against a reference row. */
export type SeverityClass =
  | "normal"
  | "mildly abnormal"
  | "moderately abnormal"
  | "severely abnormal"
  | "abnormal"
  | "below normal range"
  | "above normal range";

/** The guideline's partition cut points for values beyond one side of the normal range. */
export interface SeverityPartitions {
  /** Which side is abnormal: "low" (e.g. EF) or "high" (e.g. LA volume index). */
  readonly direction: "low" | "high";
  /** Mild class as printed [first, last] (integers as in the table). */
  readonly mild: readonly [number, number];
  /** Moderate class as printed. */
  readonly moderate: readonly [number, number];
  /** Severe threshold as printed: "< x" (low) or "> x" (high). */
  readonly severe: number;
}

/** One row of the adult reference table. */
export interface AdultReferenceRow {
  /** Parameter key, e.g. "lvEjectionFraction". */
  readonly parameter: string;
  /** Human label. */
  readonly label: string;
  /** Unit (mathjs unit string or "%" / "1"). */
  readonly unit: string;
  /** Sex the row applies to. */
  readonly sex: ReferenceSex;
  /** Method (e.g. "2D biplane", "linear", "M-mode"). */
  readonly method: string;
  /** Mean of normals, when the table gives it. */
  readonly mean?: number;
  /** SD of normals, when the table gives it. */
  readonly sd?: number;
  /** Normal range [lower, upper] as printed; a missing side is unbounded. */
  readonly normal: { readonly lower?: number; readonly upper?: number };
  /** Severity partitions, only where the guideline gives them. */
  readonly partitions?: SeverityPartitions;
  /** The guideline table the row comes from. */
  readonly table: string;
  /** The source. */
  readonly source: Reference;
  /** True: entered from memory of the table, not copied from it here. */
  readonly fromMemory: boolean;
  /** Notes (e.g. how printed integer bands are turned into cut points). */
  readonly note?: string;
}

const row = (r: Omit<AdultReferenceRow, "source" | "fromMemory">): AdultReferenceRow =>
  Object.freeze({ ...r, source: LANG_2015, fromMemory: true });

/**
 * The 2015 ASE/EACVI adult reference rows (from memory of Lang et al. 2015, Tables 1, 2, 6 and
 * the RV tables): LV diameters, indexed volumes, EF with partitions, LV mass index, RWT, LA
 * volume index with partitions, RV basal diameter, TAPSE.
 *
 * @example
 * ```ts
 * import { ADULT_REFERENCE_LANG_2015 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const ef = ADULT_REFERENCE_LANG_2015.find((r) => r.parameter === "lvEjectionFraction" && r.sex === "male");
 * assert.deepEqual(ef?.normal, { lower: 52, upper: 72 });
 * ```
 */
export const ADULT_REFERENCE_LANG_2015: readonly AdultReferenceRow[] = Object.freeze([
  // Table 1: 2D LV size and function by sex, mean ± SD and 2-SD range
  row({
    parameter: "lvInternalDiameterDiastole",
    label: "LV internal diameter, end-diastole",
    unit: "mm",
    sex: "male",
    method: "2D linear",
    mean: 50.2,
    sd: 4.1,
    normal: { lower: 42.0, upper: 58.4 },
    table: "Table 1",
  }),
  row({
    parameter: "lvInternalDiameterDiastole",
    label: "LV internal diameter, end-diastole",
    unit: "mm",
    sex: "female",
    method: "2D linear",
    mean: 45.0,
    sd: 3.6,
    normal: { lower: 37.8, upper: 52.2 },
    table: "Table 1",
  }),
  row({
    parameter: "lvInternalDiameterSystole",
    label: "LV internal diameter, end-systole",
    unit: "mm",
    sex: "male",
    method: "2D linear",
    mean: 32.4,
    sd: 3.7,
    normal: { lower: 25.0, upper: 39.8 },
    table: "Table 1",
  }),
  row({
    parameter: "lvInternalDiameterSystole",
    label: "LV internal diameter, end-systole",
    unit: "mm",
    sex: "female",
    method: "2D linear",
    mean: 28.2,
    sd: 3.3,
    normal: { lower: 21.6, upper: 34.8 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndDiastolicVolumeIndex",
    label: "LV end-diastolic volume / BSA",
    unit: "mL/m^2",
    sex: "male",
    method: "2D biplane discs",
    mean: 54,
    sd: 10,
    normal: { lower: 34, upper: 74 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndDiastolicVolumeIndex",
    label: "LV end-diastolic volume / BSA",
    unit: "mL/m^2",
    sex: "female",
    method: "2D biplane discs",
    mean: 45,
    sd: 8,
    normal: { lower: 29, upper: 61 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndSystolicVolumeIndex",
    label: "LV end-systolic volume / BSA",
    unit: "mL/m^2",
    sex: "male",
    method: "2D biplane discs",
    mean: 21,
    sd: 5,
    normal: { lower: 11, upper: 31 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndSystolicVolumeIndex",
    label: "LV end-systolic volume / BSA",
    unit: "mL/m^2",
    sex: "female",
    method: "2D biplane discs",
    mean: 16,
    sd: 4,
    normal: { lower: 8, upper: 24 },
    table: "Table 1",
  }),
  // Table 2: LVEF and LA volume, normal ranges and severity partitions
  row({
    parameter: "lvEjectionFraction",
    label: "LV ejection fraction",
    unit: "%",
    sex: "male",
    method: "2D biplane discs",
    mean: 62,
    sd: 5,
    normal: { lower: 52, upper: 72 },
    partitions: { direction: "low", mild: [41, 51], moderate: [30, 40], severe: 30 },
    table: "Table 2",
  }),
  row({
    parameter: "lvEjectionFraction",
    label: "LV ejection fraction",
    unit: "%",
    sex: "female",
    method: "2D biplane discs",
    mean: 64,
    sd: 5,
    normal: { lower: 54, upper: 74 },
    partitions: { direction: "low", mild: [41, 53], moderate: [30, 40], severe: 30 },
    table: "Table 2",
  }),
  row({
    parameter: "laVolumeIndex",
    label: "Maximum LA volume / BSA",
    unit: "mL/m^2",
    sex: "any",
    method: "2D biplane",
    normal: { lower: 16, upper: 34 },
    partitions: { direction: "high", mild: [35, 41], moderate: [42, 48], severe: 48 },
    table: "Table 2",
  }),
  // Table 6: LV mass indices (normal ranges only in this table)
  row({
    parameter: "lvMassIndexLinear",
    label: "LV mass / BSA (linear method)",
    unit: "g/m^2",
    sex: "male",
    method: "linear (cube) formula",
    normal: { lower: 49, upper: 115 },
    table: "Table 6",
  }),
  row({
    parameter: "lvMassIndexLinear",
    label: "LV mass / BSA (linear method)",
    unit: "g/m^2",
    sex: "female",
    method: "linear (cube) formula",
    normal: { lower: 43, upper: 95 },
    table: "Table 6",
  }),
  row({
    parameter: "lvMassIndex2d",
    label: "LV mass / BSA (2D method)",
    unit: "g/m^2",
    sex: "male",
    method: "2D (area–length or truncated ellipsoid)",
    normal: { lower: 50, upper: 102 },
    table: "Table 6",
  }),
  row({
    parameter: "lvMassIndex2d",
    label: "LV mass / BSA (2D method)",
    unit: "g/m^2",
    sex: "female",
    method: "2D (area–length or truncated ellipsoid)",
    normal: { lower: 44, upper: 88 },
    table: "Table 6",
  }),
  row({
    parameter: "relativeWallThickness",
    label: "Relative wall thickness",
    unit: "1",
    sex: "male",
    method: "linear",
    normal: { lower: 0.24, upper: 0.42 },
    table: "Table 6",
  }),
  row({
    parameter: "relativeWallThickness",
    label: "Relative wall thickness",
    unit: "1",
    sex: "female",
    method: "linear",
    normal: { lower: 0.22, upper: 0.42 },
    table: "Table 6",
    note:
      "The lower limit for women (0.22) is from memory and less certain than the shared upper limit 0.42",
  }),
  // RV size and function tables: one range for both sexes, upper or lower abnormality threshold
  row({
    parameter: "rvBasalDiameter",
    label: "RV basal diameter",
    unit: "mm",
    sex: "any",
    method: "2D RV-focused apical view",
    mean: 33,
    sd: 4,
    normal: { lower: 25, upper: 41 },
    table: "Table 8 (RV chamber size; table number from memory)",
  }),
  row({
    parameter: "tapse",
    label: "Tricuspid annular plane systolic excursion (TAPSE)",
    unit: "mm",
    sex: "any",
    method: "M-mode",
    mean: 24,
    sd: 3.5,
    normal: { lower: 17 },
    table: "Table 9 (RV function; table number from memory)",
    note: "The guideline gives TAPSE < 17 mm as the abnormality threshold; no upper limit",
  }),
]);

/**
 * The reference row for a parameter and sex ("any" rows match both sexes).
 *
 * @param parameter Parameter key, e.g. "lvEjectionFraction".
 * @param sex "male" or "female".
 * @param table The rows to search. @default ADULT_REFERENCE_LANG_2015
 * @returns The row.
 * @throws {TypeError} For an unknown parameter or sex, naming the valid choices.
 *
 * @example
 * ```ts
 * import { adultReferenceRow } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(adultReferenceRow("laVolumeIndex", "female").normal.upper, 34);
 * ```
 */
export function adultReferenceRow(
  parameter: string,
  sex: "male" | "female",
  table: readonly AdultReferenceRow[] = ADULT_REFERENCE_LANG_2015,
): AdultReferenceRow {
  if (sex !== "male" && sex !== "female") {
    throw new TypeError(
      `Adult reference: expected 'sex' "male" or "female", got ${JSON.stringify(sex)}`,
    );
  }
  const found = table.find((r) => r.parameter === parameter && (r.sex === sex || r.sex === "any"));
  if (found === undefined) {
    const known = [...new Set(table.map((r) => r.parameter))].join(", ");
    throw new TypeError(
      `Adult reference: expected 'parameter' in ${known}, got ${JSON.stringify(parameter)}`,
    );
  }
  return found;
}

/**
 * Classifies a value against a reference row.
 *
 * Printed integer bands are contiguous cut points: for a "high" partition (e.g. LA volume index
 * normal 16–34, mild 35–41, moderate 42–48, severe > 48) a value above 34 and up to 41 is mild,
 * above 41 up to 48 moderate, above 48 severe; for a "low" partition (e.g. LVEF in men: normal
 * 52–72, mild 41–51, moderate 30–40, severe < 30) a value below 52 and at least 41 is mild,
 * below 41 and at least 30 moderate, below 30 severe. (Interpretation of the printed bands for
 * non-integer values; no source.) A value beyond the normal range on the side without partitions
 * is "below normal range" / "above normal range"; where the guideline gives no partitions an
 * abnormal value is "abnormal" on its abnormal side.
 *
 * @param row The reference row.
 * @param value The value in the row's unit, finite.
 * @returns The class.
 * @throws {RangeError} For a non-finite value.
 *
 * @example
 * ```ts
 * import { adultReferenceRow, classifyAgainstRow } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Lang 2015 Table 2 (from memory): LA volume index 45 mL/m² is moderately abnormal
 * assert.equal(classifyAgainstRow(adultReferenceRow("laVolumeIndex", "male"), 45), "moderately abnormal");
 * ```
 */
export function classifyAgainstRow(row: AdultReferenceRow, value: number): SeverityClass {
  if (typeof value !== "number" || !Number.isFinite(value)) {
    throw new RangeError(
      `Classification (${row.label}): expected a finite value in ${row.unit}, got ${value}`,
    );
  }
  const { lower, upper } = row.normal;
  const p = row.partitions;
  if (p?.direction === "high" && upper !== undefined && value > upper) {
    if (value <= p.mild[1]) return "mildly abnormal";
    if (value <= p.moderate[1]) return "moderately abnormal";
    return "severely abnormal";
  }
  if (p?.direction === "low" && lower !== undefined && value < lower) {
    if (value >= p.mild[0]) return "mildly abnormal";
    if (value >= p.moderate[0]) return "moderately abnormal";
    return "severely abnormal";
  }
  const belowAbnormal = lower !== undefined && value < lower;
  const aboveAbnormal = upper !== undefined && value > upper;
  if (!belowAbnormal && !aboveAbnormal) return "normal";
  if (p) return belowAbnormal ? "below normal range" : "above normal range";
  // No partitions: one-sided thresholds are "abnormal"; two-sided ranges say which side.
  if (lower === undefined || upper === undefined) return "abnormal";
  return belowAbnormal ? "below normal range" : "above normal range";
}

/** A classification result. */
export interface AdultClassification {
  /** The class. */
  readonly class: SeverityClass;
  /** The row used. */
  readonly row: AdultReferenceRow;
  /** The value classified. */
  readonly value: number;
  /** Cautions (from-memory provenance, clinical caution). */
  readonly cautions: readonly string[];
}

/**
 * Classifies a value of a parameter for a sex against the 2015 ASE/EACVI limits.
 *
 * @param parameter Parameter key (see {@linkcode ADULT_REFERENCE_LANG_2015}).
 * @param sex "male" or "female".
 * @param value Value in the row's unit.
 * @returns Class, row and cautions.
 * @throws {TypeError} For an unknown parameter or sex.
 * @throws {RangeError} For a non-finite value.
 *
 * @example
 * ```ts
 * import { classifyAdult } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Lang 2015 Table 2 (from memory): LVEF 45 % in a woman is mildly abnormal (41–53)
 * assert.equal(classifyAdult("lvEjectionFraction", "female", 45).class, "mildly abnormal");
 * ```
 */
export function classifyAdult(
  parameter: string,
  sex: "male" | "female",
  value: number,
): AdultClassification {
  const r = adultReferenceRow(parameter, sex);
  return {
    class: classifyAgainstRow(r, value),
    row: r,
    value,
    cautions: [
      ...(r.fromMemory
        ? [`Reference limits of ${r.label} entered from memory of Lang 2015 ${r.table}: verify`]
        : []),
      "Not a diagnosis: verify against local guidelines and licensed clinical practice before acting on this number",
    ],
  };
}

/**
 * The probability of each class given Monte Carlo samples of a value (e.g. from
 * `monteCarlo(...).outputs.x.samples`).
 *
 * @param row The reference row.
 * @param samples Samples of the value in the row's unit.
 * @returns Probability per class (classes with zero probability omitted); sums to 1.
 * @throws {TypeError} For an empty sample set.
 * @throws {RangeError} For a non-finite sample.
 *
 * @example
 * ```ts
 * import { adultReferenceRow, classProbabilities } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const p = classProbabilities(adultReferenceRow("lvEjectionFraction", "male"), [50, 53, 55, 60]);
 * assert.deepEqual(p, { "mildly abnormal": 0.25, normal: 0.75 });
 * ```
 */
export function classProbabilities(
  row: AdultReferenceRow,
  samples: ArrayLike<number>,
): Partial<Record<SeverityClass, number>> {
  if (!(samples.length > 0)) {
    throw new TypeError(
      `Class probabilities (${row.label}): expected at least one sample, got ${samples.length}`,
    );
  }
  const counts: Partial<Record<SeverityClass, number>> = {};
  for (let i = 0; i < samples.length; i++) {
    const c = classifyAgainstRow(row, samples[i]!);
    counts[c] = (counts[c] ?? 0) + 1;
  }
  for (const key of Object.keys(counts) as SeverityClass[]) {
    counts[key] = counts[key]! / samples.length;
  }
  return counts;
}
