/**
 * A method-validation study read from a table in long format: every reading checked (value cells
 * by the one table reader, replicate numbers by the one validator), duplicate and incomplete rows
 * found with their file lines, missing values listed; nothing dropped silently.
 *
 * @module
 */
import type { Quantity, ValidationIssue } from "../core/types.ts";
import type { Table } from "../table/types.ts";
import { checkValue, quantityField } from "../core/validate.ts";
import {
  findColumn,
  REPLICATE_NUMBER,
  type ValidationColumns,
  validationColumns,
  type ValidationDesignOptions,
} from "./validation_columns.ts";
import type { MissingReading } from "./types.ts";

/** The most subjects a validation study may have: the analysis indexes readings by subject in
 * JavaScript Maps, which hold at most 2^24 entries (V8). */
export const MAX_SUBJECTS = 2 ** 24 - 1;

const NONE: readonly ValidationIssue[] = [];

function emptyIdentifier(
  where: string,
  field: string,
  label: "Subject" | "Observer",
  row: number,
  line: number,
): ValidationIssue {
  return {
    kind: "missing",
    severity: "error",
    where,
    field,
    label,
    received: "an empty cell",
    expected: label === "Subject" ? "a subject identifier" : "an observer or method name",
    row,
    line,
  };
}

/** One reading: a value (a number, or a category for graded findings) with where it came from. */
export interface Reading<V extends number | string = number> {
  /** Subject identifier. */
  readonly subject: string;
  /** Observer or method. */
  readonly observer: string;
  /** Replicate number, 1 when the table has no replicate column. */
  readonly replicate: number;
  /** The value, in the quantity's canonical unit, or the category. */
  readonly value: V;
  /** The 1-based line of the file. */
  readonly line: number;
}

/** What the readings of every study hold, measurements or graded findings. */
export interface StudyReadings {
  /** Name of the source (file). */
  readonly source: string;
  /** The columns used. */
  readonly columns: ValidationColumns;
  /** Data rows of the table (blank lines excluded). */
  readonly dataRows: number;
  /** Subjects with at least one reading, in order of first appearance. */
  readonly subjects: readonly string[];
  /** Observers or methods with at least one reading, in order of first appearance. */
  readonly observers: readonly string[];
  /** Largest replicate number among the readings (1 without a replicate column). */
  readonly maxReplicate: number;
  /** Readings with an empty value cell. */
  readonly missing: readonly MissingReading[];
  /** Blank lines skipped by the reader. */
  readonly blankLines: readonly number[];
  /** Every issue found in the columns used, errors and warnings, in line order. */
  readonly issues: readonly ValidationIssue[];
}

/** A study of measurements: numeric readings of one quantity. */
export interface MeasuredReadings extends StudyReadings {
  /** Brand. */
  readonly design: "continuous";
  /** What was measured. */
  readonly quantity: Quantity;
  /** The readings used (rows without errors and with a value). */
  readonly readings: readonly Reading<number>[];
}

/** A study of graded findings: categories. */
export interface GradedReadings extends StudyReadings {
  /** Brand. */
  readonly design: "graded";
  /** What was graded: the value column's header. */
  readonly label: string;
  /** The categories in order. */
  readonly categories: readonly string[];
  /** Where the order comes from. */
  readonly categoriesFrom: "option" | "first appearance";
  /** The readings used. */
  readonly readings: readonly Reading<string>[];
}

/** The readings of a study, checked. */
export type ValidationReadings = MeasuredReadings | GradedReadings;

function textColumn(table: Table, header: string, role: string): readonly string[] {
  const c = findColumn(table, header)!;
  if (c.kind !== "text") {
    throw new TypeError(
      `${table.source}: expected the ${role} column '${header}' as text identifiers, got numbers of ${c.quantity.label}; read it with readTable(…, { columns: { "${header}": "text" } })`,
    );
  }
  return c.values;
}

/**
 * Checks the readings of a validation study: subject and observer present, replicate numbers
 * whole and ≥ 1 (by the one validator), values valid (the value column's issues come from
 * `readTable`), graded values among the categories, one reading per subject, observer and
 * replicate. Never throws for a defect of the data: every problem is an issue with its file
 * line, and rows in error are left out of `readings`. Empty value cells are listed in `missing`.
 *
 * @param table A table from `readTable`: text columns, and the value column as numbers of a
 * quantity (or text for graded findings).
 * @param options Columns, graded or not, categories.
 * @returns The readings, the missing ones, and every issue.
 * @throws {TypeError} For columns that cannot be found (see {@linkcode validationColumns}), a
 * value column of text for measurements (map it to a quantity when reading), numbers for graded
 * findings, or identifiers read as numbers.
 *
 * @example
 * ```ts
 * import { readTable, renderIssue, validationReadings } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("patient,observer,lvef percent\nP1,A,55\nP1,B,\n,A,51\nP1,A,56\n",
 *   { source: "demo.csv" });
 * const r = validationReadings(t);
 * assert.equal(r.readings.length, 1);
 * assert.deepEqual(r.missing, [{ subject: "P1", observer: "B", replicate: 1, line: 3 }]);
 * assert.deepEqual(r.issues.filter((i) => i.severity === "error").map(renderIssue), [
 *   "demo.csv: line 4, missing column 'patient' (Subject): expected a subject identifier, got an empty cell",
 *   "demo.csv: line 5, expected one reading per subject, observer and replicate, got a second reading for subject 'P1', observer 'A', replicate 1 (first on line 2)",
 * ]);
 * ```
 */
export function validationReadings(
  table: Table,
  options: ValidationDesignOptions = {},
): ValidationReadings {
  const columns = validationColumns(table, options);
  const source = table.source;
  const subjects = textColumn(table, columns.subject, "subject");
  const observers = textColumn(table, columns.observer, "observer");
  const replicateColumn = columns.replicate === null ? null : findColumn(table, columns.replicate)!;
  const valueColumn = findColumn(table, columns.value)!;
  const graded = options.graded ?? false;
  if (graded && valueColumn.kind !== "text") {
    throw new TypeError(
      `${source}: expected the graded column '${columns.value}' as text, got numbers of ${valueColumn.quantity.label}; read it with readTable(…, { columns: { "${columns.value}": "text" } })`,
    );
  }
  if (!graded && valueColumn.kind !== "numeric") {
    throw new TypeError(
      `${source}: expected the value column '${columns.value}' as numbers of a quantity, got text: read the table with readTable(…, { columns: { "${columns.value}": quantity } }) (a quantity of the package, or one made with statedQuantity), or set graded for graded findings`,
    );
  }
  const categoryOption = options.categories;
  if (categoryOption !== undefined && !graded) {
    throw new TypeError(`${source}: expected 'categories' only with graded findings, got them`);
  }
  const categories = categoryOption ? categoryOption.map((c) => c.trim()) : [];
  const known = new Set(categories);
  // issues of the reader that concern the rows or the columns used
  const used = new Set([columns.value, ...(columns.replicate ? [columns.replicate] : [])]);
  const issues: ValidationIssue[] = [];
  const rowFlags = new Map<number, ValidationIssue[]>();
  for (const issue of table.issues) {
    if (issue.field !== "" && !used.has(issue.field)) continue;
    if (issue.row === undefined) {
      issues.push(issue);
      continue;
    }
    const list = rowFlags.get(issue.row);
    if (list) list.push(issue);
    else rowFlags.set(issue.row, [issue]);
  }
  const replicateField = quantityField(REPLICATE_NUMBER);
  const readings: Reading<number | string>[] = [];
  const missing: MissingReading[] = [];
  // the line of each (subject, observer, replicate): one map per (observer, replicate) pair, keyed
  // by the subject's index, so that millions of rows build no key strings
  const firstLine: Map<number, number>[] = [];
  const subjectIndex = new Map<string, number>();
  const pairIndex = new Map<string, (number | undefined)[]>();
  const subjectSeen = new Set<string>();
  const observerSeen = new Set<string>();
  const subjectOrder: string[] = [];
  const observerOrder: string[] = [];
  let maxReplicate = 1;
  for (let row = 0; row < table.rowCount; row++) {
    const line = table.lines[row]!;
    const fromReader = rowFlags.get(row) ?? NONE;
    let failed = false;
    let valueMissing = false;
    for (const issue of fromReader) {
      if (issue.kind === "notMeasured" && issue.field === columns.value) valueMissing = true;
      else if (issue.kind === "notMeasured") continue; // an empty replicate cell: below
      else {
        issues.push(issue);
        if (issue.severity === "error") failed = true;
      }
    }
    const subject = subjects[row]!.trim();
    const observer = observers[row]!.trim();
    if (subject === "") {
      failed = true;
      issues.push(emptyIdentifier(source, columns.subject, "Subject", row, line));
    }
    if (observer === "") {
      failed = true;
      issues.push(emptyIdentifier(source, columns.observer, "Observer", row, line));
    }
    let replicate = 1;
    if (replicateColumn !== null) {
      const raw = replicateColumn.kind === "text"
        ? replicateColumn.values[row]!.trim()
        : replicateColumn.values[row]!;
      const given = raw === "" || (typeof raw === "number" && raw !== raw) ? undefined : raw;
      // a numeric column's unreadable cell was reported by the reader already
      const reported = fromReader.length > 0 &&
        fromReader.some((i) => i.field === columns.replicate && i.severity === "error");
      if (typeof given === "number" && given >= 1 && Number.isInteger(given)) replicate = given;
      else if (!reported) {
        // the validator's message for anything but a whole number ≥ 1
        const context = { where: source, row, line };
        const checked = checkValue(columns.replicate!, replicateField, given, context);
        for (const issue of checked.issues) issues.push(issue);
        if (checked.value === undefined) failed = true;
        else replicate = checked.value;
      }
    }
    let value: number | string;
    if (valueColumn.kind === "text") {
      value = valueColumn.values[row]!.trim();
      if (value === "") valueMissing = true;
      else if (categoryOption !== undefined && !known.has(value)) {
        failed = true;
        issues.push({
          kind: "range",
          severity: "error",
          where: source,
          field: columns.value,
          received: JSON.stringify(value),
          expected: `one of ${categories.join(", ")}`,
          row,
          line,
        });
      }
    } else value = valueColumn.values[row]!;
    if (failed) continue;
    let si = subjectIndex.get(subject);
    if (si === undefined) {
      if (subjectIndex.size >= MAX_SUBJECTS) {
        throw new RangeError(
          `${source}: line ${line}, expected at most ${MAX_SUBJECTS} subjects (the most a JavaScript Map indexes), got more`,
        );
      }
      subjectIndex.set(subject, si = subjectIndex.size);
    }
    let byReplicate = pairIndex.get(observer);
    if (byReplicate === undefined) pairIndex.set(observer, byReplicate = []);
    let pi = byReplicate[replicate];
    if (pi === undefined) {
      byReplicate[replicate] = pi = firstLine.length;
      firstLine.push(new Map());
    }
    const lines = firstLine[pi]!;
    const first = lines.get(si);
    if (first !== undefined) {
      issues.push({
        kind: "constraint",
        severity: "error",
        where: source,
        field: columns.subject,
        received:
          `a second reading for subject '${subject}', observer '${observer}', replicate ${replicate} (first on line ${first})`,
        expected: "one reading per subject, observer and replicate",
        row,
        line,
      });
      continue;
    }
    lines.set(si, line);
    if (valueMissing) {
      missing.push({ subject, observer, replicate, line });
      continue;
    }
    if (typeof value === "string" && categoryOption === undefined && !known.has(value)) {
      known.add(value);
      categories.push(value);
    }
    if (!subjectSeen.has(subject)) {
      subjectSeen.add(subject);
      subjectOrder.push(subject);
    }
    if (!observerSeen.has(observer)) {
      observerSeen.add(observer);
      observerOrder.push(observer);
    }
    if (replicate > maxReplicate) maxReplicate = replicate;
    readings.push({ subject, observer, replicate, value, line });
  }
  issues.sort((p, q) => (p.line ?? 0) - (q.line ?? 0));
  const base = {
    source,
    columns,
    dataRows: table.rowCount,
    subjects: subjectOrder,
    observers: observerOrder,
    maxReplicate,
    missing,
    blankLines: table.blankLines,
    issues,
  };
  return valueColumn.kind === "text"
    ? {
      ...base,
      design: "graded",
      label: columns.value,
      categories,
      categoriesFrom: categoryOption ? "option" : "first appearance",
      readings: readings as Reading<string>[],
    }
    : {
      ...base,
      design: "continuous",
      quantity: valueColumn.quantity,
      readings: readings as Reading<number>[],
    };
}

/** Readings of two observers paired on the same subjects. */
export interface PairedReadings<V extends number | string> {
  /** Subjects with both readings, in order of first appearance. */
  readonly subjects: string[];
  /** The test observer's readings. */
  readonly test: V[];
  /** The reference observer's readings. */
  readonly reference: V[];
}

/**
 * The readings of two observers (or methods) paired on the same subjects, for one replicate:
 * subjects lacking either reading are left out.
 *
 * @param readings Readings from {@linkcode validationReadings} (or a report's `readings`).
 * @param test The observer whose readings are `test` (y, the minuend of differences).
 * @param reference The observer whose readings are `reference` (x).
 * @param replicate Which replicate. @default 1
 * @returns Subjects in order of first appearance with both readings.
 *
 * @example
 * ```ts
 * import { pairedReadings, readTable, validationReadings } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("patient,observer,ef\nP1,A,55\nP1,B,57\nP2,A,60\n", { source: "demo.csv" });
 * assert.deepEqual(pairedReadings(validationReadings(t).readings, "B", "A"),
 *   { subjects: ["P1"], test: [57], reference: [55] });
 * ```
 */
export function pairedReadings(
  readings: readonly Reading<number>[],
  test: string,
  reference: string,
  replicate?: number,
): PairedReadings<number>;
/** Paired categories of two raters (graded findings); see the first overload. */
export function pairedReadings(
  readings: readonly Reading<string>[],
  test: string,
  reference: string,
  replicate?: number,
): PairedReadings<string>;
/** Paired readings of a study of either kind; see the first overload. */
export function pairedReadings(
  readings: readonly Reading<number>[] | readonly Reading<string>[],
  test: string,
  reference: string,
  replicate?: number,
): PairedReadings<number> | PairedReadings<string>;
export function pairedReadings(
  readings: readonly Reading<number | string>[],
  test: string,
  reference: string,
  replicate = 1,
): PairedReadings<number | string> {
  type V = number | string;
  const ofReference = new Map<string, V>();
  for (const r of readings) {
    if (r.observer === reference && r.replicate === replicate) ofReference.set(r.subject, r.value);
  }
  const out = { subjects: [] as string[], test: [] as V[], reference: [] as V[] };
  for (const r of readings) {
    if (r.observer !== test || r.replicate !== replicate) continue;
    const x = ofReference.get(r.subject);
    if (x === undefined) continue;
    out.subjects.push(r.subject);
    out.test.push(r.value);
    out.reference.push(x);
  }
  return out;
}
