/**
 * Reading a patient table from CSV into typed columns: papaparse for the CSV grammar, zod for
 * the options and for every cell's domain, units declared per column (in the header as
 * "name [unit]" or in the options), line-numbered errors naming the column, no row dropped.
 *
 * @module
 */
import Papa from "papaparse";
import * as z from "zod";
import { formatRange } from "../core/define.ts";
import type { ValueRange } from "../core/types.ts";
import { mathUnitOf } from "../core/units.ts";
import { bsaMosteller } from "../body/bsa.ts";

/** A numeric column to read: its header name and, optionally, its unit. */
export interface CohortColumn {
  /** Header name as written in the CSV, without the "[unit]" suffix, e.g. "weight". */
  readonly column: string;
  /** Unit of the values in the file (overrides a "[unit]" in the header), e.g. "lb". */
  readonly unit?: string;
}

/** A measurement column to read. */
export interface CohortMeasurementColumn extends CohortColumn {
  /** Name of the measurement in the result (defaults to `column`). */
  readonly name?: string;
  /** Canonical unit the values are converted to (e.g. the Z-score model's unit). */
  readonly canonicalUnit: string;
  /** Valid domain in the canonical unit. @default (0, 1e6] */
  readonly range?: ValueRange;
}

/** Options of {@linkcode readCohortCsv}. */
export interface CohortReadOptions {
  /** Column holding a patient identifier (kept as text). */
  readonly id?: string;
  /** Column holding sex (kept as text, e.g. "F"/"M"). */
  readonly sex?: string;
  /** Height column (converted to cm). */
  readonly height: string | CohortColumn;
  /** Weight column (converted to kg). */
  readonly weight: string | CohortColumn;
  /** Measurement columns. */
  readonly measurements?: readonly CohortMeasurementColumn[];
  /** "throw" (default): any invalid cell throws after the whole file is checked, naming the
   * first and counting the rest. "flag": invalid cells become NaN and are listed in `issues`. */
  readonly onInvalid?: "throw" | "flag";
}

/** A problem with one cell. */
export interface CohortIssue {
  /** 1-based line in the CSV text. */
  readonly line: number;
  /** 0-based data row. */
  readonly row: number;
  /** Header of the column. */
  readonly column: string;
  /** "invalid" (not a number, outside the domain) or "missing" (empty measurement cell). */
  readonly kind: "invalid" | "missing";
  /** Error class the issue maps to. */
  readonly errorName: "TypeError" | "RangeError";
  /** Full message, e.g. `Cohort CSV: line 4, column 'weight [kg]': expected ..., got "abc"`. */
  readonly message: string;
}

/** A numeric column in canonical units. */
export interface CohortNumericColumn {
  /** Header as in the file. */
  readonly header: string;
  /** Unit in the file. */
  readonly sourceUnit: string;
  /** Canonical unit of `values`. */
  readonly unit: string;
  /** Values in the canonical unit; NaN where missing or invalid (see issues). */
  readonly values: Float64Array;
}

/** A cohort as columns. */
export interface CohortTable {
  /** Number of data rows. */
  readonly rowCount: number;
  /** Source line (1-based) of each data row. */
  readonly lines: Int32Array;
  /** Identifiers, when an id column was given. */
  readonly ids?: readonly string[];
  /** Sex, when a sex column was given. */
  readonly sex?: readonly string[];
  /** Height in cm. */
  readonly heightCm: CohortNumericColumn;
  /** Weight in kg. */
  readonly weightKg: CohortNumericColumn;
  /** Measurements by name, in their canonical units. */
  readonly measurements: Readonly<Record<string, CohortNumericColumn>>;
  /** Per-row bit set: 1 = an invalid cell, 2 = a missing measurement. */
  readonly rowStatus: Uint8Array;
  /** Every invalid or missing cell, in file order. */
  readonly issues: readonly CohortIssue[];
  /** Lines that were entirely blank (not data rows). */
  readonly blankLines: readonly number[];
}

/**
 * Row status bit: a cell of the row is invalid (value NaN).
 *
 * @example
 * ```ts
 * import { ROW_INVALID, ROW_MISSING } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(ROW_INVALID & ROW_MISSING, 0);
 * ```
 */
export const ROW_INVALID = 1;
/**
 * Row status bit: a measurement cell of the row is empty.
 *
 * @example
 * ```ts
 * import { ROW_MISSING } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(ROW_MISSING > 0);
 * ```
 */
export const ROW_MISSING = 2;

/**
 * The error thrown for an invalid cohort file; `issues` lists every invalid cell.
 *
 * @example
 * ```ts
 * import { CohortCsvError, readCohortCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.throws(() => readCohortCsv("height [cm],weight [kg]\nx,20\n", { height: "height", weight: "weight" }), CohortCsvError);
 * ```
 */
export class CohortCsvError extends Error {
  /** Every invalid cell. */
  readonly issues: readonly CohortIssue[];
  /**
   * Creates the error from the first invalid cell and the list of all of them.
   *
   * @param name "TypeError" (not a number, missing) or "RangeError" (outside the domain).
   * @param message The message of the first invalid cell.
   * @param issues Every invalid cell.
   */
  constructor(name: "TypeError" | "RangeError", message: string, issues: readonly CohortIssue[]) {
    super(message);
    this.name = name;
    this.issues = issues;
  }
}

const columnSchema = z.union([
  z.string().min(1),
  z.object({ column: z.string().min(1), unit: z.string().min(1).optional() }),
]);
const rangeSchema = z.object({
  min: z.number(),
  max: z.number(),
  minExclusive: z.boolean().optional(),
  maxExclusive: z.boolean().optional(),
});
const optionsSchema = z.strictObject({
  id: z.string().min(1).optional(),
  sex: z.string().min(1).optional(),
  height: columnSchema,
  weight: columnSchema,
  measurements: z.array(z.strictObject({
    column: z.string().min(1),
    unit: z.string().min(1).optional(),
    name: z.string().min(1).optional(),
    canonicalUnit: z.string().min(1),
    range: rangeSchema.optional(),
  })).optional(),
  onInvalid: z.enum(["throw", "flag"]).optional(),
});

const DECIMAL = /^\s*[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?\s*$/;
const DEFAULT_RANGE: ValueRange = { min: 0, max: 1e6 };

/** Splits "weight [kg]" into name and unit. */
function splitHeader(header: string): { name: string; unit: string | undefined } {
  const m = /^(.*?)\s*\[([^\]]+)\]\s*$/.exec(header);
  return m ? { name: m[1]!.trim(), unit: m[2]!.trim() } : { name: header.trim(), unit: undefined };
}

/** Conversion factor from `from` to `to` (plain labels must match exactly). */
function conversionFactor(from: string, to: string, header: string): number {
  if (from === to) return 1;
  const a = mathUnitOf(from);
  const b = mathUnitOf(to);
  if (a === null || b === null || !a.equalBase(b)) {
    throw new TypeError(
      `Cohort CSV: column '${header}' must be in a unit convertible to ${to}, got "${from}"`,
    );
  }
  return a.toNumber(to);
}

interface Plan {
  readonly key: string;
  readonly header: string;
  readonly index: number;
  readonly sourceUnit: string;
  readonly unit: string;
  readonly factor: number;
  /** When the conversion is a division by an integer (mm → cm: 10), that integer, so that
   * 38 mm gives exactly 3.8 cm; otherwise 0. */
  readonly divisor: number;
  readonly range: ValueRange;
  readonly schema: z.ZodNumber | z.ZodType<number>;
  readonly optional: boolean;
}

function rangeSchemaFor(range: ValueRange): z.ZodType<number> {
  let s = z.number();
  s = range.minExclusive ? s.gt(range.min) : s.gte(range.min);
  s = range.maxExclusive ? s.lt(range.max) : s.lte(range.max);
  return s;
}

/**
 * Reads a cohort CSV into typed columns, converting each numeric column to its canonical unit.
 *
 * Every cell is checked: text that is not a decimal number is a TypeError issue, a number
 * outside the column's domain (height and weight: the human ranges of the BSA calculations) a
 * RangeError issue, an empty measurement cell a "missing" issue (not an error). No row is
 * dropped: invalid cells become NaN with their issue, blank lines are listed in `blankLines`.
 *
 * @param text The CSV text; the first line is the header.
 * @param options Columns, units and the invalid-cell policy.
 * @returns The cohort as columns with issues.
 * @throws {TypeError} For malformed options, a missing column, a unit that cannot be converted,
 * a row with the wrong number of fields, or (policy "throw") a non-numeric cell.
 * @throws {RangeError} (policy "throw") For a value outside its column's domain.
 *
 * @example
 * ```ts
 * import { readCohortCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const csv = "id,height [cm],weight [lb],lvedd [mm]\nA,120,44.1,38\nB,130,55.1,\n";
 * const t = readCohortCsv(csv, {
 *   id: "id", height: "height", weight: "weight",
 *   measurements: [{ column: "lvedd", canonicalUnit: "cm" }],
 * });
 * assert.equal(t.rowCount, 2);
 * assert.ok(Math.abs(t.weightKg.values[0]! - 20.0034) < 1e-4); // 44.1 lb = 20.0034 kg
 * assert.equal(t.measurements.lvedd!.values[0], 3.8);
 * assert.equal(t.issues[0]!.kind, "missing");
 * ```
 */
export function readCohortCsv(text: string, options: CohortReadOptions): CohortTable {
  if (typeof text !== "string") {
    throw new TypeError(`Cohort CSV: expected the CSV text as a string, got ${typeof text}`);
  }
  const parsedOptions = optionsSchema.safeParse(options);
  if (!parsedOptions.success) {
    const issue = parsedOptions.error.issues[0]!;
    throw new TypeError(
      `Cohort CSV: option '${
        issue.path.join(".") || "(options)"
      }' ${issue.message.toLowerCase()}, got ${
        JSON.stringify(
          issue.path.reduce<unknown>(
            (v, k) => (typeof v === "object" && v !== null
              ? (v as Record<PropertyKey, unknown>)[k as PropertyKey]
              : v),
            options,
          ),
        )
      }`,
    );
  }
  const parsed = Papa.parse(text, { skipEmptyLines: false, delimiter: "," }) as {
    data: string[][];
    errors: { code: string; message: string; row?: number }[];
  };
  const quoteError = parsed.errors.find((e) =>
    e.code === "MissingQuotes" || e.code === "InvalidQuotes"
  );
  const rows = parsed.data;
  const headerRow = rows[0];
  if (headerRow === undefined || (headerRow.length === 1 && headerRow[0]!.trim() === "")) {
    throw new TypeError(`Cohort CSV: expected a header line, got an empty file`);
  }
  if (quoteError) {
    throw new TypeError(
      `Cohort CSV: malformed quotes (${quoteError.message}) in data row ${
        quoteError.row ?? "?"
      }, got ${quoteError.code}`,
    );
  }
  const headers = headerRow.map((h) => h.trim());
  const byName = new Map<string, number>();
  headers.forEach((h, i) => {
    const name = splitHeader(h).name;
    if (byName.has(name)) {
      throw new TypeError(`Cohort CSV: expected unique column names, got '${name}' twice`);
    }
    byName.set(name, i);
  });
  const find = (column: string): number => {
    const i = byName.get(column);
    if (i === undefined) {
      throw new TypeError(
        `Cohort CSV: expected a column '${column}' in the header, got ${
          headers.map((h) => `'${h}'`).join(", ")
        }`,
      );
    }
    return i;
  };
  const plan = (
    key: string,
    spec: string | CohortColumn,
    unit: string,
    range: ValueRange,
    optional: boolean,
  ): Plan => {
    const column = typeof spec === "string" ? spec : spec.column;
    const index = find(column);
    const header = headers[index]!;
    const sourceUnit = (typeof spec === "string" ? undefined : spec.unit) ??
      splitHeader(header).unit;
    if (sourceUnit === undefined) {
      throw new TypeError(
        `Cohort CSV: column '${header}' has no unit; declare it in the header as '${column} [${unit}]' or in the options, got no unit`,
      );
    }
    const factor = conversionFactor(sourceUnit, unit, header);
    const inverse = Math.round(1 / factor);
    const divisor = factor < 1 && Math.abs(1 / factor - inverse) < 1e-9 * inverse ? inverse : 0;
    return {
      divisor,
      key,
      header,
      index,
      sourceUnit,
      unit,
      factor,
      range,
      schema: rangeSchemaFor(range),
      optional,
    };
  };
  const plans: Plan[] = [
    plan("heightCm", options.height, "cm", bsaMosteller.inputs.heightCm.range, false),
    plan("weightKg", options.weight, "kg", bsaMosteller.inputs.weightKg.range, false),
  ];
  const measurementKeys = new Set<string>();
  for (const m of options.measurements ?? []) {
    const key = m.name ?? m.column;
    if (measurementKeys.has(key) || key === "heightCm" || key === "weightKg") {
      throw new TypeError(`Cohort CSV: expected unique measurement names, got '${key}' twice`);
    }
    measurementKeys.add(key);
    plans.push(plan(key, m, m.canonicalUnit, m.range ?? DEFAULT_RANGE, true));
  }
  const idIndex = options.id === undefined ? -1 : find(options.id);
  const sexIndex = options.sex === undefined ? -1 : find(options.sex);

  // Data rows: skip blank lines (recorded), keep every other line as a row.
  const width = headers.length;
  const dataRows: number[] = [];
  const lineOf: number[] = [];
  const blankLines: number[] = [];
  let line = 1 + countNewlines(headerRow);
  for (let r = 1; r < rows.length; r++) {
    const fields = rows[r]!;
    line += 1;
    if (fields.length === 1 && fields[0]!.trim() === "") {
      // A final empty record after the last line break is not a line of data.
      if (r !== rows.length - 1) blankLines.push(line);
      continue;
    }
    if (fields.length !== width) {
      throw new TypeError(
        `Cohort CSV: line ${line}: expected ${width} fields as in the header, got ${fields.length}`,
      );
    }
    dataRows.push(r);
    lineOf.push(line);
    line += countNewlines(fields);
  }

  const n = dataRows.length;
  const columns = plans.map(() => new Float64Array(n));
  const rowStatus = new Uint8Array(n);
  const issues: CohortIssue[] = [];
  const ids = idIndex >= 0 ? new Array<string>(n) : undefined;
  const sex = sexIndex >= 0 ? new Array<string>(n) : undefined;
  for (let i = 0; i < n; i++) {
    const fields = rows[dataRows[i]!]!;
    if (ids) ids[i] = fields[idIndex]!;
    if (sex) sex[i] = fields[sexIndex]!.trim();
    for (let c = 0; c < plans.length; c++) {
      const p = plans[c]!;
      const cell = fields[p.index]!;
      const col = columns[c]!;
      if (cell.trim() === "") {
        col[i] = NaN;
        if (p.optional) {
          rowStatus[i]! |= ROW_MISSING;
          issues.push(
            issue(lineOf[i]!, i, p, "missing", "TypeError", `not measured (empty cell)`, cell),
          );
        } else {
          rowStatus[i]! |= ROW_INVALID;
          issues.push(issue(lineOf[i]!, i, p, "invalid", "TypeError", expected(p), cell));
        }
        continue;
      }
      if (!DECIMAL.test(cell)) {
        col[i] = NaN;
        rowStatus[i]! |= ROW_INVALID;
        issues.push(issue(lineOf[i]!, i, p, "invalid", "TypeError", expected(p), cell));
        continue;
      }
      const value = p.divisor > 0 ? Number(cell) / p.divisor : Number(cell) * p.factor;
      if (!p.schema.safeParse(value).success) {
        col[i] = NaN;
        rowStatus[i]! |= ROW_INVALID;
        issues.push(issue(lineOf[i]!, i, p, "invalid", "RangeError", expected(p), cell));
        continue;
      }
      col[i] = value;
    }
  }
  const invalid = issues.filter((x) => x.kind === "invalid");
  if (invalid.length > 0 && (options.onInvalid ?? "throw") === "throw") {
    const first = invalid[0]!;
    const prefix = invalid.length === 1
      ? "Cohort CSV"
      : `Cohort CSV (${invalid.length} invalid cells, first shown; see .issues)`;
    throw new CohortCsvError(
      first.errorName,
      first.message.replace(/^Cohort CSV/, prefix),
      invalid,
    );
  }
  const numeric = (c: number): CohortNumericColumn => {
    const p = plans[c]!;
    return { header: p.header, sourceUnit: p.sourceUnit, unit: p.unit, values: columns[c]! };
  };
  const measurements: Record<string, CohortNumericColumn> = {};
  for (let c = 2; c < plans.length; c++) measurements[plans[c]!.key] = numeric(c);
  return {
    rowCount: n,
    lines: Int32Array.from(lineOf),
    ...(ids ? { ids } : {}),
    ...(sex ? { sex } : {}),
    heightCm: numeric(0),
    weightKg: numeric(1),
    measurements,
    rowStatus,
    issues,
    blankLines,
  };
}

function countNewlines(fields: readonly string[]): number {
  let count = 0;
  for (const f of fields) {
    for (let k = f.indexOf("\n"); k !== -1; k = f.indexOf("\n", k + 1)) count++;
  }
  return count;
}

function expected(p: Plan): string {
  const domain = p.factor === 1
    ? formatRange(p.range, p.unit)
    : `${formatRange(p.range, p.unit)} after conversion from ${p.sourceUnit}`;
  return `expected a number in ${domain}`;
}

function issue(
  line: number,
  row: number,
  p: Plan,
  kind: "invalid" | "missing",
  errorName: "TypeError" | "RangeError",
  what: string,
  cell: string,
): CohortIssue {
  return {
    line,
    row,
    column: p.header,
    kind,
    errorName,
    message: `Cohort CSV: line ${line}, column '${p.header}': ${what}, got ${JSON.stringify(cell)}`,
  };
}
