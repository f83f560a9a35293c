/**
 * Adult reference limits from the 2015 ASE/EACVI chamber-quantification recommendations
 * (Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39), as data: each row with its quantity, its
 * table and its limits as printed; and, built from a row, a severity table (normal / mildly /
 * moderately / severely abnormal where the guideline gives partitions) that the one grading
 * function reads, for a value, a GUM result or Monte Carlo samples.
 *
 * All numbers here were entered from memory of the guideline tables and cross-read against
 * secondary summaries of them; each row says so in `fromMemory`, and every grade made from them
 * carries the mark. Verify against the guideline before clinical use.
 *
 * @module
 */
import type { Citation, Quantity, ValueRange } from "../core/types.ts";
import { type QuantityInput, readAmount } from "../core/units.ts";
import { choiceError } from "../core/issues.ts";
import { LANG_2015 } from "../citations.ts";
import {
  EJECTION_FRACTION,
  LA_VOLUME_INDEX,
  LV_END_DIASTOLIC_DIAMETER,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_DIAMETER,
  LV_END_SYSTOLIC_VOLUME,
  LV_MASS_INDEX,
  RELATIVE_WALL_THICKNESS,
  RV_BASAL_DIAMETER,
  TAPSE,
} from "../quantities/structure.ts";
import { indexedQuantity } from "../body/indexing.ts";
import { defineSeverityTable, gradeSeverity } from "../grading/grade.ts";
import type { SeverityBand, SeverityGrade, SeverityTable } from "../grading/types.ts";

/** Shared publications, re-exported under this module's names. */
export { LANG_2015 };

/** Sex a reference row applies to ("any" when the guideline gives one range for both). */
export type ReferenceSex = "male" | "female" | "any";

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
  /** Parameter key, e.g. "lvEjectionFraction" (one quantity may have rows by several methods:
   * "lvMassIndexLinear", "lvMassIndex2d"). */
  readonly parameter: string;
  /** The quantity the row limits (its label, unit and valid range). */
  readonly quantity: Quantity;
  /** The unit the table prints its numbers in (the limits below are in it). */
  readonly printedUnit: string;
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
  readonly source: Citation;
  /** True: entered from memory of the table, not copied from it here. */
  readonly fromMemory: boolean;
  /** Notes (e.g. how printed integer bands are turned into cut points). */
  readonly note?: string;
}

/** The RV tables, named by content: their numbers in the guideline (recalled as 8 and 9) could
 * not be checked against a copy of it, so none is claimed. The values agree with secondary
 * summaries of Lang 2015 (RV basal diameter 33 ± 4 mm, 25–41; TAPSE 24 ± 3.5 mm, < 17). */
const RV_SIZE_TABLE =
  "normal values for RV chamber size (table number not verified against the printed guideline)";
const RV_FUNCTION_TABLE =
  "normal values for RV function (table number not verified against the printed guideline)";

const row = (r: Omit<AdultReferenceRow, "source" | "fromMemory">): AdultReferenceRow =>
  Object.freeze({ ...r, source: LANG_2015, fromMemory: true });

/**
 * The 2015 ASE/EACVI adult reference rows (from memory of Lang et al. 2015, Tables 1, 2, 6 and
 * the tables of normal RV size and function, whose numbers are not claimed): LV diameters, indexed
 * volumes, EF with partitions, LV mass index, RWT, LA volume index with partitions, RV basal
 * diameter, TAPSE.
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
    quantity: LV_END_DIASTOLIC_DIAMETER,
    printedUnit: "mm",
    sex: "male",
    method: "2D linear",
    mean: 50.2,
    sd: 4.1,
    normal: { lower: 42.0, upper: 58.4 },
    table: "Table 1",
  }),
  row({
    parameter: "lvInternalDiameterDiastole",
    quantity: LV_END_DIASTOLIC_DIAMETER,
    printedUnit: "mm",
    sex: "female",
    method: "2D linear",
    mean: 45.0,
    sd: 3.6,
    normal: { lower: 37.8, upper: 52.2 },
    table: "Table 1",
  }),
  row({
    parameter: "lvInternalDiameterSystole",
    quantity: LV_END_SYSTOLIC_DIAMETER,
    printedUnit: "mm",
    sex: "male",
    method: "2D linear",
    mean: 32.4,
    sd: 3.7,
    normal: { lower: 25.0, upper: 39.8 },
    table: "Table 1",
  }),
  row({
    parameter: "lvInternalDiameterSystole",
    quantity: LV_END_SYSTOLIC_DIAMETER,
    printedUnit: "mm",
    sex: "female",
    method: "2D linear",
    mean: 28.2,
    sd: 3.3,
    normal: { lower: 21.6, upper: 34.8 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndDiastolicVolumeIndex",
    quantity: indexedQuantity(LV_END_DIASTOLIC_VOLUME),
    printedUnit: "mL/m^2",
    sex: "male",
    method: "2D biplane discs",
    mean: 54,
    sd: 10,
    normal: { lower: 34, upper: 74 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndDiastolicVolumeIndex",
    quantity: indexedQuantity(LV_END_DIASTOLIC_VOLUME),
    printedUnit: "mL/m^2",
    sex: "female",
    method: "2D biplane discs",
    mean: 45,
    sd: 8,
    normal: { lower: 29, upper: 61 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndSystolicVolumeIndex",
    quantity: indexedQuantity(LV_END_SYSTOLIC_VOLUME),
    printedUnit: "mL/m^2",
    sex: "male",
    method: "2D biplane discs",
    mean: 21,
    sd: 5,
    normal: { lower: 11, upper: 31 },
    table: "Table 1",
  }),
  row({
    parameter: "lvEndSystolicVolumeIndex",
    quantity: indexedQuantity(LV_END_SYSTOLIC_VOLUME),
    printedUnit: "mL/m^2",
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
    quantity: EJECTION_FRACTION,
    printedUnit: "%",
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
    quantity: EJECTION_FRACTION,
    printedUnit: "%",
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
    quantity: LA_VOLUME_INDEX,
    printedUnit: "mL/m^2",
    sex: "any",
    method: "2D biplane",
    normal: { lower: 16, upper: 34 },
    partitions: { direction: "high", mild: [35, 41], moderate: [42, 48], severe: 48 },
    table: "Table 2",
  }),
  // Table 6: LV mass indices (normal ranges only in this table)
  row({
    parameter: "lvMassIndexLinear",
    quantity: LV_MASS_INDEX,
    printedUnit: "g/m^2",
    sex: "male",
    method: "linear (cube) formula",
    normal: { lower: 49, upper: 115 },
    table: "Table 6",
  }),
  row({
    parameter: "lvMassIndexLinear",
    quantity: LV_MASS_INDEX,
    printedUnit: "g/m^2",
    sex: "female",
    method: "linear (cube) formula",
    normal: { lower: 43, upper: 95 },
    table: "Table 6",
  }),
  row({
    parameter: "lvMassIndex2d",
    quantity: LV_MASS_INDEX,
    printedUnit: "g/m^2",
    sex: "male",
    method: "2D (area–length or truncated ellipsoid)",
    normal: { lower: 50, upper: 102 },
    table: "Table 6",
  }),
  row({
    parameter: "lvMassIndex2d",
    quantity: LV_MASS_INDEX,
    printedUnit: "g/m^2",
    sex: "female",
    method: "2D (area–length or truncated ellipsoid)",
    normal: { lower: 44, upper: 88 },
    table: "Table 6",
  }),
  row({
    parameter: "relativeWallThickness",
    quantity: RELATIVE_WALL_THICKNESS,
    printedUnit: "1",
    sex: "male",
    method: "linear",
    normal: { lower: 0.24, upper: 0.42 },
    table: "Table 6",
  }),
  row({
    parameter: "relativeWallThickness",
    quantity: RELATIVE_WALL_THICKNESS,
    printedUnit: "1",
    sex: "female",
    method: "linear",
    normal: { lower: 0.22, upper: 0.42 },
    table: "Table 6",
    note:
      "The lower limit for women (0.22) is from memory and less certain than the shared upper limit 0.42",
  }),
  // RV size and function tables: one range for both sexes, upper or lower abnormality threshold.
  // Rudski LG et al. 2010 is the earlier ASE right-heart guideline; its thresholds are noted.
  row({
    parameter: "rvBasalDiameter",
    quantity: RV_BASAL_DIAMETER,
    printedUnit: "mm",
    sex: "any",
    method: "2D RV-focused apical view",
    mean: 33,
    sd: 4,
    normal: { lower: 25, upper: 41 },
    table: RV_SIZE_TABLE,
    note:
      "Rudski 2010 (the earlier ASE right-heart guideline) gave > 42 mm as dilated (from memory)",
  }),
  row({
    parameter: "tapse",
    quantity: TAPSE,
    printedUnit: "mm",
    sex: "any",
    method: "M-mode",
    mean: 24,
    sd: 3.5,
    normal: { lower: 17 },
    table: RV_FUNCTION_TABLE,
    note:
      "The guideline gives TAPSE < 17 mm as the abnormality threshold; no upper limit. Rudski 2010 (the earlier ASE right-heart guideline) gave < 16 mm (from memory; also in a secondary summary of RV reference limits)",
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
    throw choiceError("Adult reference", "sex", SEX_CHOICES, sex);
  }
  const found = table.find((r) => r.parameter === parameter && (r.sex === sex || r.sex === "any"));
  if (found === undefined) {
    const known = [...new Set(table.map((r) => r.parameter))];
    throw choiceError("Adult reference", "parameter", known, parameter);
  }
  return found;
}

const SEX_CHOICES = ["male", "female"] as const;

/** Where the printed limits of a row sit in the quantity's unit. */
function toQuantityUnit(row: AdultReferenceRow): (printed: number) => number {
  if (row.printedUnit === row.quantity.unit) return (x) => x;
  const factor = readAmount(`1 ${row.printedUnit}`, row.quantity.unit);
  if (typeof factor !== "number") {
    throw new TypeError(
      `Adult reference (${row.parameter}): expected a printed unit convertible to ${row.quantity.unit}, got ${row.printedUnit}`,
    );
  }
  return (x) => x * factor;
}

const tables = new Map<AdultReferenceRow, SeverityTable>();

/**
 * The severity table of a reference row, in the quantity's unit: printed integer bands become
 * contiguous cut points, and thresholds printed in another unit (LV and RV diameters in mm) are
 * written in the quantity's unit (cm), the unit every display appends to them, with a note. For a "high" partition (e.g. LA volume index normal 16–34, mild 35–41,
 * moderate 42–48, severe > 48) a value above 34 and up to 41 is mild, above 41 up to 48
 * moderate, above 48 severe; for a "low" partition (e.g. LVEF in men: normal 52–72, mild 41–51,
 * moderate 30–40, severe < 30) a value below 52 and at least 41 is mild, below 41 and at least 30
 * moderate, below 30 severe (interpretation of the printed bands for non-integer values; no
 * source). A value beyond the normal range on the side without partitions is "below normal range"
 * / "above normal range"; where the guideline gives no partitions an abnormal value is "abnormal"
 * on a one-sided limit, "below normal range" / "above normal range" on a two-sided one.
 *
 * @param row The reference row.
 * @returns The table (made once per row), graded by {@linkcode gradeSeverity}.
 *
 * @example LA volume index 45 mL/m² is moderately abnormal (Lang 2015 Table 2, from memory)
 * ```ts
 * import { adultReferenceRow, adultSeverityTable, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const table = adultSeverityTable(adultReferenceRow("laVolumeIndex", "male"));
 * assert.equal(gradeSeverity(table, 45).grade, "moderately abnormal");
 * assert.deepEqual(table.bands.map((b) => b.printed), ["< 16", "16–34", "35–41", "42–48", "> 48"]);
 * ```
 */
export function adultSeverityTable(row: AdultReferenceRow): SeverityTable {
  const made = tables.get(row);
  if (made) return made;
  const at = toQuantityUnit(row);
  // a threshold as the display shows it: in the quantity's unit, which the display appends
  const shown = (printed: number) => String(Number(at(printed).toPrecision(12)));
  const citation: Citation = { ...row.source, locator: `${row.table}, ${row.method}` };
  const band = (grade: string, range: ValueRange, printed: string): SeverityBand => ({
    grade,
    range,
    printed,
    citation,
    fromMemory: row.fromMemory,
  });
  const { lower, upper } = row.normal;
  const p = row.partitions;
  const bands: SeverityBand[] = [];
  const normalRange: ValueRange = {
    min: lower === undefined ? -Infinity : at(lower),
    max: upper === undefined ? Infinity : at(upper),
    ...(lower === undefined ? { minExclusive: true } : {}),
    ...(upper === undefined ? { maxExclusive: true } : {}),
  };
  const normalPrinted = lower !== undefined && upper !== undefined
    ? `${shown(lower)}–${shown(upper)}`
    : lower !== undefined
    ? `≥ ${shown(lower)}`
    : `≤ ${shown(upper!)}`;
  if (p?.direction === "low" && lower !== undefined) {
    bands.push(
      band("severely abnormal", {
        min: -Infinity,
        max: at(p.severe),
        minExclusive: true,
        maxExclusive: true,
      }, `< ${shown(p.severe)}`),
      band("moderately abnormal", {
        min: at(p.moderate[0]),
        max: at(p.mild[0]),
        maxExclusive: true,
      }, `${shown(p.moderate[0])}–${shown(p.moderate[1])}`),
      band(
        "mildly abnormal",
        { min: at(p.mild[0]), max: at(lower), maxExclusive: true },
        `${shown(p.mild[0])}–${shown(p.mild[1])}`,
      ),
    );
  } else if (lower !== undefined) {
    const grade = upper === undefined && !p ? "abnormal" : "below normal range";
    bands.push(
      band(
        grade,
        { min: -Infinity, max: at(lower), minExclusive: true, maxExclusive: true },
        `< ${shown(lower)}`,
      ),
    );
  }
  bands.push(band("normal", normalRange, normalPrinted));
  if (p?.direction === "high" && upper !== undefined) {
    bands.push(
      band(
        "mildly abnormal",
        { min: at(upper), max: at(p.mild[1]), minExclusive: true },
        `${shown(p.mild[0])}–${shown(p.mild[1])}`,
      ),
      band("moderately abnormal", {
        min: at(p.mild[1]),
        max: at(p.moderate[1]),
        minExclusive: true,
      }, `${shown(p.moderate[0])}–${shown(p.moderate[1])}`),
      band("severely abnormal", {
        min: at(p.severe),
        max: Infinity,
        minExclusive: true,
        maxExclusive: true,
      }, `> ${shown(p.severe)}`),
    );
  } else if (upper !== undefined) {
    const grade = lower === undefined && !p ? "abnormal" : "above normal range";
    bands.push(
      band(
        grade,
        { min: at(upper), max: Infinity, minExclusive: true, maxExclusive: true },
        `> ${shown(upper)}`,
      ),
    );
  }
  const table = defineSeverityTable({
    id: `lang2015.${row.parameter}.${row.sex}`,
    title: `${row.quantity.label}, ${
      row.sex === "any" ? "adults" : `adult ${row.sex === "male" ? "men" : "women"}`
    } (Lang 2015, ${row.method})`,
    quantity: row.quantity,
    bands,
    notes: [
      ...(row.printedUnit !== row.quantity.unit
        ? [
          `Limits printed in ${row.printedUnit} in the guideline, shown and applied in ${row.quantity.unit}`,
        ]
        : []),
      ...(row.note ? [row.note] : []),
    ],
  });
  tables.set(row, table);
  return table;
}

/**
 * Grades a value of a parameter for a sex against the 2015 ASE/EACVI adult limits: the severity
 * table of {@linkcode adultReferenceRow} read by {@linkcode gradeSeverity}, so the result carries
 * the row's citation, the "from memory" mark and the clinical caution, and displays itself.
 *
 * @param parameter Parameter key (see {@linkcode ADULT_REFERENCE_LANG_2015}).
 * @param sex "male" or "female".
 * @param value The value: a number in the quantity's unit, or a quantity string ("51 mm").
 * @returns The grade.
 * @throws {TypeError} For an unknown parameter or sex, or a value of the wrong unit.
 * @throws {RangeError} For a value outside the quantity's valid range.
 *
 * @example LVEF 45 % in a woman is mildly abnormal (41–53; Lang 2015 Table 2, from memory)
 * ```ts
 * import { classifyAdult } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const g = classifyAdult("lvEjectionFraction", "female", 45);
 * assert.equal(g.grade, "mildly abnormal");
 * assert.equal(g.fromMemory, true);
 * ```
 */
export function classifyAdult(
  parameter: string,
  sex: "male" | "female",
  value: QuantityInput,
): SeverityGrade {
  return gradeSeverity(adultSeverityTable(adultReferenceRow(parameter, sex)), value);
}

/** One limit line of a parameter: a band boundary of its severity table. */
export interface AdultLimitLine {
  /** "male", "female", or "both sexes" when the guideline gives one range. */
  readonly sex: "male" | "female" | "both sexes";
  /** The limit, in the quantity's unit. */
  readonly value: number;
  /** A limit of the normal range, or a cut point between abnormal classes. */
  readonly kind: "normal limit" | "severity cut point";
}

/**
 * The limit lines of a parameter for both sexes: every finite boundary between two classes of
 * its severity tables ({@linkcode adultSeverityTable}), in the quantity's unit.
 *
 * @param parameter Parameter key (see {@linkcode ADULT_REFERENCE_LANG_2015}).
 * @param table The rows. @default ADULT_REFERENCE_LANG_2015
 * @returns The lines, men's then women's (or one set for both sexes).
 * @throws {RangeError} For an unknown parameter.
 *
 * @example LVEF in women: normal 54–74 %, cut points 41 and 30 % (Lang 2015 Table 2, from memory)
 * ```ts
 * import { adultLimitLines } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const women = adultLimitLines("lvEjectionFraction").filter((l) => l.sex === "female");
 * assert.deepEqual(women.map((l) => [l.value, l.kind]), [
 *   [30, "severity cut point"], [41, "severity cut point"], [54, "normal limit"], [74, "normal limit"],
 * ]);
 * ```
 */
export function adultLimitLines(
  parameter: string,
  table: readonly AdultReferenceRow[] = ADULT_REFERENCE_LANG_2015,
): AdultLimitLine[] {
  const men = adultReferenceRow(parameter, "male", table);
  const women = adultReferenceRow(parameter, "female", table);
  const sets = men === women
    ? [["both sexes", men] as const]
    : [["male", men] as const, ["female", women] as const];
  const lines: AdultLimitLine[] = [];
  for (const [sex, row] of sets) {
    const bands = adultSeverityTable(row).bands;
    for (let i = 0; i + 1 < bands.length; i++) {
      const touchesNormal = bands[i]!.grade === "normal" || bands[i + 1]!.grade === "normal";
      lines.push({
        sex,
        value: bands[i]!.range.max,
        kind: touchesNormal ? "normal limit" : "severity cut point",
      });
    }
  }
  return lines;
}
