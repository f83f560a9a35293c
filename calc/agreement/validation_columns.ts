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
import { splitHeader } from "../table/header.ts";
import { InputTypeError, renderIssue } from "../core/issues.ts";

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

/** The roles of a study's columns (also the names of their options). */
type Role = "subject" | "observer" | "replicate" | "value";

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

/** A problem with one role's column: the sentence that names it. */
interface ColumnProblem {
  readonly role: Role;
  readonly text: string;
}

/** The most distinct values an observer column, or the largest number a replicate column, is
 * taken to hold when guessing candidates (a guess for the message only, never a rule). */
const FEW = 20;

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i;

/** What a column holds, for guessing its role: numbers or not, whole or not, how many distinct
 * values, how many filled cells. */
function profile(c: Column) {
  const distinct = new Set<string | number>();
  let filled = 0;
  let numeric = true;
  let whole = true;
  let min = Infinity;
  let max = -Infinity;
  const see = (v: number) => {
    if (!Number.isInteger(v)) whole = false;
    if (v < min) min = v;
    if (v > max) max = v;
  };
  if (c.kind === "numeric") {
    for (const v of c.values) {
      if (v !== v) continue;
      filled++;
      distinct.add(v);
      see(v);
    }
  } else {
    for (const raw of c.values) {
      const t = raw.trim();
      if (t === "") continue;
      filled++;
      distinct.add(t);
      if (numeric && NUMBER.test(t)) see(Number(t));
      else numeric = false;
    }
  }
  return {
    header: c.header,
    quantity: c.kind === "numeric" && c.quantity.id !== REPLICATE_NUMBER.id,
    numeric: numeric && filled > 0,
    whole,
    min,
    max,
    distinct: distinct.size,
    filled,
  };
}

/**
 * The columns that could hold each role, judged by their contents (a guess for the message):
 * value = numbers with a decimal part, more than 20 distinct numbers, or a column of a package
 * quantity; replicate = whole numbers from 1 up to at most 20 that repeat; identifiers (text or
 * whole numbers that repeat, at least 2 distinct) with the most distinct values = subject, the
 * others with at most 20 distinct values = observer.
 */
function candidates(table: Table, taken: ReadonlySet<string>): Record<string, string[]> {
  const profiles = [...table.columns.values()].filter((c) => !taken.has(c.header)).map(profile);
  const value = profiles.filter((p) => p.quantity || (p.numeric && (!p.whole || p.distinct > FEW)));
  const replicate = profiles.filter((p) =>
    !p.quantity && p.numeric && p.whole && p.min === 1 && p.max <= FEW && p.distinct < p.filled
  );
  const ids = profiles.filter((p) =>
    !value.includes(p) && !replicate.includes(p) && p.distinct >= 2 && p.distinct < p.filled
  ).sort((a, b) => b.distinct - a.distinct);
  const most = ids[0]?.distinct;
  const subject = ids.filter((p) => p.distinct === most);
  const rest = ids.filter((p) => p.distinct !== most && p.distinct <= FEW);
  const observer = rest.length > 0 ? rest : subject.length === 1 ? [] : subject;
  const name = (ps: typeof profiles, what: (p: (typeof profiles)[number]) => string) =>
    ps.map((p) => `'${p.header}' (${what(p)})`);
  return {
    subject: name(subject, (p) => `${p.distinct} distinct values`),
    observer: name(observer, (p) => `${p.distinct} distinct values`),
    replicate: name(replicate, (p) => `whole numbers ${p.min} to ${p.max}`),
    value: name(value, (p) => p.quantity ? "numbers of a known quantity" : "numbers"),
  };
}

/** The one error for every problem with the columns of a study: each problem, then the columns
 * that could hold the roles not found, judged by their contents. */
function columnsError(
  table: Table,
  problems: readonly ColumnProblem[],
  taken: ReadonlySet<string>,
  noReplicate: boolean,
): InputTypeError {
  const found = candidates(table, taken);
  const roles = [...new Set(problems.map((p) => p.role))];
  if (noReplicate && !roles.includes("replicate")) roles.push("replicate");
  const guesses = roles.map((role) => {
    const list = found[role] ?? [];
    return `${role}: ${list.length ? list.join(" or ") : "none"}`;
  });
  const issue: ValidationIssue = {
    kind: "format",
    severity: "error",
    where: table.source,
    field: "",
    expected:
      "a subject, an observer (or method) and a value column, found by their usual names or named with the options 'subject', 'observer', 'replicate' and 'value' (--subject, --rater, --replicate, --value on the command line)",
    received: `columns ${headersOf(table)}, with ${problems.length} problem${
      problems.length === 1 ? "" : "s"
    }: ${problems.map((p) => p.text).join("; ")}; candidate columns by their contents: ${
      guesses.join("; ")
    }`,
  };
  return new InputTypeError(renderIssue(issue), [issue]);
}

/**
 * Finds the columns of a validation study in a table: those named in the options, otherwise the
 * usual names (see {@linkcode ValidationDesignOptions}).
 *
 * @param table A table from `readTable`.
 * @param options Column names.
 * @returns The headers of the subject, observer, replicate and value columns.
 * @throws {TypeError} One error for every problem with the columns (a column named in the
 * options that is not in the table, a role without a column), naming the table's headers and
 * the columns that could hold each missing role (and the replicate, when none was found), judged
 * by their contents; or for one column in two roles.
 *
 * @example
 * ```ts
 * import { readTable, validationColumns } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("patient,observer,lvef percent\nP1,A,55\nP1,B,57\n", { source: "demo.csv" });
 * assert.deepEqual(validationColumns(t), {
 *   subject: "patient", observer: "observer", replicate: null, value: "lvef percent",
 * });
 * const odd = readTable("pt,who,ef\nP1,A,55.5\nP1,B,57.1\nP2,A,60.2\nP2,B,61.0\nP3,A,48.3\nP3,B,47.6\n",
 *   { source: "odd.csv" });
 * assert.throws(() => validationColumns(odd), {
 *   name: "TypeError",
 *   message: /3 problems: .*; candidate columns by their contents: subject: 'pt' \(3 distinct values\); observer: 'who' \(2 distinct values\); value: 'ef' \(numbers of a known quantity\); replicate: none$/,
 * });
 * ```
 */
export function validationColumns(
  table: Table,
  options: ValidationDesignOptions = {},
): ValidationColumns {
  const problems: ColumnProblem[] = [];
  const pick = (role: "subject" | "observer" | "replicate", wanted: string | null | undefined) => {
    if (wanted === null) return null;
    if (wanted !== undefined) {
      const c = findColumn(table, wanted);
      if (c === undefined) {
        problems.push({
          role,
          text: `no column ${JSON.stringify(wanted)} for the ${role} (option '${role}')`,
        });
      }
      return c?.header ?? null;
    }
    for (const name of FALLBACKS[role]) {
      const c = findColumn(table, name);
      if (c) return c.header;
    }
    if (role !== "replicate") {
      problems.push({
        role,
        text: `no ${role} column (none named ${FALLBACKS[role].join(", ")})`,
      });
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
      problems.push({
        role: "value",
        text: `no column ${JSON.stringify(options.value)} for the value (option 'value')`,
      });
    }
    value = c?.header ?? null;
  } else {
    const named = findColumn(table, "value");
    const rest = [...table.columns.values()].filter((c) =>
      c.header !== subject && c.header !== observer && c.header !== replicate
    );
    value = named?.header ?? (rest.length === 1 ? rest[0]!.header : null);
    if (value === null) {
      problems.push({
        role: "value",
        text: `no value column (none named 'value', and ${
          rest.length === 0 ? "no column" : `${rest.length} columns`
        } left over instead of one)`,
      });
    }
  }
  if (problems.length > 0) {
    const taken = new Set([subject, observer, replicate, value].filter((h) => h !== null));
    const noReplicate = replicate === null && options.replicate !== null;
    throw columnsError(table, problems, taken as Set<string>, noReplicate);
  }
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

/**
 * The quantity of a value column the package does not know, from its header and what the user
 * states: the unit from the header ("value [mm]") or the one stated, the label stated or made
 * from the header ("jet_width [mm]" → "Jet width"). Map the column to it when reading, with the
 * unit: `readTable(csv, { columns: { [header]: q }, units: { [header]: q.unit } })`.
 *
 * @param header The value column's header as written.
 * @param stated What the user states: a unit, a label (both optional).
 * @returns The quantity (id "statedQuantity").
 * @throws {TypeError} When neither the header nor the user states a unit, or both do and
 * differ.
 *
 * @example
 * ```ts
 * import { statedColumnQuantity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const q = statedColumnQuantity("jet_width [mm]");
 * assert.deepEqual([q.label, q.unit], ["Jet width", "mm"]);
 * assert.equal(statedColumnQuantity("value", { unit: "L/min", label: "Peak flow" }).unit, "L/min");
 * assert.throws(() => statedColumnQuantity("value"), TypeError);
 * ```
 */
export function statedColumnQuantity(
  header: string,
  stated: { readonly unit?: string | undefined; readonly label?: string | undefined } = {},
): Quantity {
  const inHeader = splitHeader(header).unit;
  if (inHeader === undefined && stated.unit === undefined) {
    throw new TypeError(
      `expected the unit of column '${header}' in its header (e.g. '${header} [mm]') or stated (--unit on the command line): it holds values of no quantity the package knows, got no unit; pass --graded for graded findings`,
    );
  }
  if (inHeader !== undefined && stated.unit !== undefined && inHeader !== stated.unit.trim()) {
    throw new TypeError(
      `expected one unit for column '${header}': its header states ${inHeader}, got also ${stated.unit}`,
    );
  }
  const words = normalizeHeader(header);
  const label = stated.label ?? (words.charAt(0).toUpperCase() + words.slice(1));
  return statedQuantity({ label, unit: (inHeader ?? stated.unit)! });
}
