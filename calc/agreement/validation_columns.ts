/**
 * Where the columns of a method-validation study are in a table read by `readTable`: subject,
 * observer or method, replicate, value, found as named or by their usual names; how to read such a
 * table (identifiers as text, replicate numbers as whole numbers ≥ 1); and the quantity a user
 * states for a value column the package does not know.
 *
 * @module
 */
import type { Quantity, ValidationIssue } from "../core/types.ts";
import type { Column, Table } from "../table/types.ts";
import type { ReadTableOptions } from "../table/read.ts";
import { defineQuantity, normalizeHeader } from "../core/quantity.ts";
import { issueError } from "../core/issues.ts";

/** The replicate number of a reading: a design variable (1, 2, …), not a measurand, so it is
 * kept here rather than in the package's vocabulary of quantities. */
export const REPLICATE_NUMBER: Quantity = defineQuantity({
  id: "replicateNumber",
  label: "Replicate number",
  unit: "1",
  description: "Which repeat of a reading by one observer on one subject: 1, 2, …",
  valid: { min: 1, max: Infinity, maxExclusive: true },
  resolution: 1,
  integer: true,
  rangeNote: "by definition",
});

/** Where the columns of a validation study are found, and how its values are read. */
export interface ValidationDesignOptions {
  /** Subject column (its header, or its name in the table).
   * @default the first of "subject", "patient", "subject_id", "id" */
  readonly subject?: string;
  /** Observer or method column. @default the first of "observer", "rater", "reader", "method" */
  readonly observer?: string;
  /** Replicate column (1, 2, …), or null when each subject has one reading per observer.
   * @default the first of "replicate", "repeat", "reading", "round"; none when absent */
  readonly replicate?: string | null;
  /** Value column: numbers of a quantity (read by `readTable`), or text for graded findings.
   * @default "value", or the only column left over */
  readonly value?: string;
  /** True when the values are ordered categories (grades) rather than measurements.
   * @default false */
  readonly graded?: boolean;
  /** Graded findings: the categories in their clinical order (for weighted kappa); a value not
   * in the list is an error. @default the order of first appearance */
  readonly categories?: readonly string[];
}

/** The headers of the columns a study uses, as written in the file. */
export interface ValidationColumns {
  /** Subject column. */
  readonly subject: string;
  /** Observer or method column. */
  readonly observer: string;
  /** Replicate column, or null. */
  readonly replicate: string | null;
  /** Value column. */
  readonly value: string;
}

const FALLBACKS = {
  subject: ["subject", "patient", "subject_id", "id"],
  observer: ["observer", "rater", "reader", "method"],
  replicate: ["replicate", "repeat", "reading", "round"],
} as const;

const ROLE_LABELS = {
  subject: "Subject column",
  observer: "Observer column",
  replicate: "Replicate column",
  value: "Value column",
} as const;

/** The column of a table named `wanted` (its name in the table, or its header). */
export function findColumn(table: Table, wanted: string): Column | undefined {
  const exact = table.columns.get(wanted);
  if (exact) return exact;
  const key = normalizeHeader(wanted);
  for (const c of table.columns.values()) {
    if (c.header === wanted || normalizeHeader(c.header) === key) return c;
  }
  return undefined;
}

function headersOf(table: Table): string {
  return [...table.columns.values()].map((c) => c.header).join(", ");
}

function columnIssue(
  table: Table,
  role: keyof typeof ROLE_LABELS,
  received: string,
  expected: string,
  kind: "unknown" | "missing",
): ValidationIssue {
  return {
    kind,
    severity: "error",
    where: table.source,
    field: role,
    label: ROLE_LABELS[role],
    received,
    expected,
  };
}

/**
 * Finds the columns of a validation study in a table: those named in the options, otherwise the
 * usual names (see {@linkcode ValidationDesignOptions}).
 *
 * @param table A table from `readTable`.
 * @param options Column names.
 * @returns The headers of the subject, observer, replicate and value columns.
 * @throws {TypeError} Naming the option, the value given and the table's headers, for a column
 * that is not in the table, a role without a column, or one column in two roles.
 *
 * @example
 * ```ts
 * import { readTable, validationColumns } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("patient,observer,lvef percent\nP1,A,55\nP1,B,57\n", { source: "demo.csv" });
 * assert.deepEqual(validationColumns(t), {
 *   subject: "patient", observer: "observer", replicate: null, value: "lvef percent",
 * });
 * assert.throws(() => validationColumns(t, { value: "ef2" }), {
 *   name: "TypeError",
 *   message: `demo.csv: unknown input 'value' (Value column): expected a column of the table: patient, observer, lvef percent, got "ef2"`,
 * });
 * ```
 */
export function validationColumns(
  table: Table,
  options: ValidationDesignOptions = {},
): ValidationColumns {
  const issues: ValidationIssue[] = [];
  const pick = (role: "subject" | "observer" | "replicate", wanted: string | null | undefined) => {
    if (wanted === null) return null;
    if (wanted !== undefined) {
      const c = findColumn(table, wanted);
      if (c === undefined) {
        issues.push(columnIssue(
          table,
          role,
          JSON.stringify(wanted),
          `a column of the table: ${headersOf(table)}`,
          "unknown",
        ));
      }
      return c?.header ?? null;
    }
    for (const name of FALLBACKS[role]) {
      const c = findColumn(table, name);
      if (c) return c.header;
    }
    if (role !== "replicate") {
      issues.push(columnIssue(
        table,
        role,
        `columns ${headersOf(table)}`,
        `a column named ${FALLBACKS[role].join(", ")} (or name it with the option '${role}')`,
        "missing",
      ));
    }
    return null;
  };
  const subject = pick("subject", options.subject);
  const observer = pick("observer", options.observer);
  const replicate = pick("replicate", options.replicate);
  let value: string | null = null;
  if (options.value !== undefined) {
    const c = findColumn(table, options.value);
    if (c === undefined) {
      issues.push(columnIssue(
        table,
        "value",
        JSON.stringify(options.value),
        `a column of the table: ${headersOf(table)}`,
        "unknown",
      ));
    }
    value = c?.header ?? null;
  } else {
    const named = findColumn(table, "value");
    const rest = [...table.columns.values()].filter((c) =>
      c.header !== subject && c.header !== observer && c.header !== replicate
    );
    value = named?.header ?? (rest.length === 1 ? rest[0]!.header : null);
    if (value === null) {
      issues.push(columnIssue(
        table,
        "value",
        `columns ${rest.map((c) => c.header).join(", ") || "none"} besides the others`,
        "a column named 'value' or a single column left over (or name it with the option 'value')",
        "missing",
      ));
    }
  }
  if (issues.length > 0) throw issueError(issues);
  const roles = [subject!, observer!, ...(replicate ? [replicate] : []), value!];
  if (new Set(roles).size !== roles.length) {
    throw new TypeError(
      `${table.source}: expected a different column for subject, observer, replicate and value, got ${
        roles.join(", ")
      }`,
    );
  }
  return { subject: subject!, observer: observer!, replicate, value: value! };
}

/**
 * The column mapping for `readTable` that suits a validation table: the subject and observer
 * columns kept as text, the replicate column read as whole numbers ≥ 1 (so the reader reports a
 * bad replicate cell with its line), and the value column as text for graded findings. Columns
 * are named as in the options, or by the usual names.
 *
 * @param options The design options (as for `validationReadings`).
 * @returns Options to spread into `readTable`'s.
 *
 * @example
 * ```ts
 * import { readTable, renderIssue, validationReadOptions } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("patient,observer,replicate,ef\nP1,A,x,55\n",
 *   { source: "demo.csv", ...validationReadOptions() });
 * assert.equal(renderIssue(t.issues[0]!),
 *   `demo.csv: line 2, expected 'replicate' (Replicate number) as a number in [1, ∞), got "x"`);
 * ```
 */
export function validationReadOptions(
  options: ValidationDesignOptions = {},
): Required<Pick<ReadTableOptions, "columns">> {
  const columns: Record<string, string | Quantity> = {};
  for (const role of ["subject", "observer"] as const) {
    for (const name of options[role] !== undefined ? [options[role]] : FALLBACKS[role]) {
      columns[name] = "text";
    }
  }
  if (options.replicate !== null) {
    const names = options.replicate !== undefined ? [options.replicate] : FALLBACKS.replicate;
    for (const name of names) columns[name] = REPLICATE_NUMBER;
  }
  if (options.graded && options.value !== undefined) columns[options.value] = "text";
  return { columns };
}

/** Options of {@linkcode statedQuantity}. */
export interface StatedQuantityOptions {
  /** What was measured, as a clinician says it ("Peak flow"). */
  readonly label: string;
  /** Its unit as written in the file ("L/min", "%", "1" for none). */
  readonly unit: string;
  /** Possible values. @default any finite number */
  readonly valid?: { readonly min: number; readonly max: number };
  /** Display resolution when no uncertainty is known. @default 0.01 */
  readonly resolution?: number;
}

/**
 * A quantity the user states for a value column the package does not know (its header matches
 * no quantity): a label and a unit, any finite value valid unless a range is given. Map the
 * column to it when reading: `readTable(csv, { columns: { value: q } })`.
 *
 * @param options Label, unit, valid range, resolution.
 * @returns The quantity (id "statedQuantity").
 * @throws {TypeError} For an empty label or unit, or an empty or inverted range.
 *
 * @example
 * ```ts
 * import { readTable, statedQuantity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const flow = statedQuantity({ label: "Peak flow", unit: "L/min" });
 * const t = readTable("subject,method,value\n1,W,494\n", {
 *   columns: { value: flow },
 *   units: { value: "L/min" }, // or a header "value [L/min]"
 * });
 * const c = t.columns.get("statedQuantity")!;
 * assert.ok(c.kind === "numeric" && c.values[0] === 494 && c.header === "value");
 * ```
 */
export function statedQuantity(options: StatedQuantityOptions): Quantity {
  const unit = options.unit?.trim();
  return defineQuantity({
    id: "statedQuantity",
    label: options.label?.trim(),
    unit: unit === "" ? "1" : unit,
    description: `${options.label} as stated by the user (not a quantity of the package)`,
    valid: options.valid ??
      { min: -Infinity, max: Infinity, minExclusive: true, maxExclusive: true },
    resolution: options.resolution ?? 0.01,
    rangeNote: "stated by the user",
  });
}
