/**
 * Evaluating catalog calculations and chains over every row of a table: inputs wired to columns
 * by name or by quantity, exact evaluation through the calculation's own column loop, or
 * propagation row by row (GUM law by default, Monte Carlo on request) from per-column uncertainty
 * models (the GUM law column by column where that gives each row's own numbers, see
 * gum_columns.ts). Results are new columns (value, and standard uncertainty and interval ends
 * when propagated); every row that cannot be computed keeps NaN with an issue saying why.
 *
 * @module
 */
import type { Calculation, ValidationIssue, ValueRange } from "../core/types.ts";
import type { Population } from "../core/types.ts";
import { cautionsOf } from "../core/calculation.ts";
import { evaluateColumns } from "../core/columns.ts";
import { closedBounds, columnSpan, formatRange, inRange } from "../core/range.ts";
import { typicalRange } from "../core/quantity.ts";
import { checkValue } from "../core/validate.ts";
import { withUnit } from "../core/text.ts";
import { issueError, renderIssue } from "../core/issues.ts";
import { normal } from "../uncertainty/distributions.ts";
import type { UncertainInput } from "../uncertainty/distributions.ts";
import { propagate, type PropagateOptions } from "../uncertainty/propagate.ts";
import type { Propagation } from "../uncertainty/types.ts";
import type { UncertainArgument } from "../uncertainty/prepare.ts";
import { readAmount } from "../core/units.ts";
import type { Column, NumericColumn, Table, UncertaintyModel } from "./types.ts";
import { makeTable } from "./read.ts";
import { type GumColumns, gumColumns } from "./gum_columns.ts";
import { labelWithUnit } from "../../display/uncertainty.ts";

/** Options of {@linkcode evaluateTable}. */
export interface EvaluateTableOptions {
  /** Inputs wired by hand: input name → column name. Others are wired by name, then by
   * quantity. */
  readonly inputs?: Readonly<Record<string, string>>;
  /** Uncertainty of columns (by column name): absolute, relative or any distribution. */
  readonly uncertainty?: Readonly<Record<string, UncertaintyModel>>;
  /** "exact", "gum" or "monteCarlo". @default "gum" with uncertainty models, else "exact" */
  readonly method?: "exact" | "gum" | "monteCarlo";
  /** Coverage probability of the intervals. @default 0.95 */
  readonly coverage?: number;
  /** Monte Carlo trials per row. @default 10_000 */
  readonly trials?: number;
  /** Monte Carlo seed (each row's sources are keyed by the row's label, so rows differ). */
  readonly seed?: number;
  /** Which typical ranges flag inputs. @default "adult" */
  readonly population?: Population;
  /** Text column that names the rows (sources and messages). @default the first text column */
  readonly rowLabels?: string;
}

function numericColumns(table: Table): NumericColumn[] {
  return [...table.columns.values()].filter((c): c is NumericColumn =>
    c.kind === "numeric" && c.role === "value"
  );
}

/** The column feeding each input of a calculation, or null for an input left to its default. */
function wire(
  table: Table,
  calc: Calculation,
  byHand: Readonly<Record<string, string>>,
): (NumericColumn | null)[] {
  const numeric = numericColumns(table);
  return calc.inputNames.map((name) => {
    const def = calc.inputs[name]!;
    const wanted = byHand[name];
    if (wanted !== undefined) {
      const c = table.columns.get(wanted);
      if (c === undefined || c.kind !== "numeric") {
        throw new TypeError(
          `${calc.title}: input '${name}' is wired to column '${wanted}', which the table has not as numbers; expected one of ${
            numeric.map((c) => c.name).join(", ")
          }`,
        );
      }
      return c;
    }
    const same = table.columns.get(name);
    if (same?.kind === "numeric") return same;
    const byQuantity = numeric.filter((c) => c.quantity.id === def.quantity.id);
    if (byQuantity.length === 1) return byQuantity[0]!;
    if (def.default !== undefined) return null;
    throw new TypeError(
      `${calc.title}: no column for input '${name}' (${def.label}); expected a column of ${
        labelWithUnit(def.label, def.unit)
      }${
        byQuantity.length > 1 ? ` (several match: ${byQuantity.map((c) => c.name).join(", ")})` : ""
      }, got columns ${[...table.columns.keys()].join(", ")}; wire it with the option inputs`,
    );
  });
}

/** Quantity strings already read ("0.8 mm" in cm …): a table applies one model to every row,
 * and reading a quantity string parses it. Keyed by unit and text; at most 256 kept. */
const readStrings = new Map<string, ReturnType<typeof readAmount>>();
function readUncertainty(value: number | string, unit: string): ReturnType<typeof readAmount> {
  if (typeof value !== "string") return readAmount(value, unit);
  const key = `${unit}\u0000${value}`;
  let read = readStrings.get(key);
  if (read === undefined) {
    if (readStrings.size >= 256) readStrings.clear();
    readStrings.set(key, read = readAmount(value, unit));
  }
  return read;
}

/** The standard uncertainty of a value under a relative model: |relative · value|. */
function relativeUncertainty(relative: number, value: number): number {
  return Math.abs(relative * value);
}

/** The distribution of one cell under a column's uncertainty model. */
function distributionOf(model: UncertaintyModel, value: number, unit: string): UncertainInput {
  if (typeof model === "function") return model(value);
  if ("relative" in model) return normal(value, relativeUncertainty(model.relative, value));
  const u = readUncertainty(model.standardUncertainty, unit);
  if (typeof u !== "number") {
    throw new TypeError(
      `Uncertainty model: expected a standard uncertainty convertible to ${unit}, got ${
        JSON.stringify(model.standardUncertainty)
      }`,
    );
  }
  return normal(value, u);
}

/** The arguments of one row: each wired cell, as a distribution where its column has a model. */
function rowArguments(
  calc: Calculation,
  wired: readonly (NumericColumn | null)[],
  inputs: readonly Float64Array[],
  i: number,
  models: Readonly<Record<string, UncertaintyModel>>,
): Record<string, UncertainArgument> {
  const args: Record<string, UncertainArgument> = {};
  calc.inputNames.forEach((name, k) => {
    const col = wired[k];
    const v = inputs[k]![i]!;
    const model = col ? models[col.name] ?? models[col.header] : undefined;
    args[name] = model ? distributionOf(model, v, calc.inputs[name]!.unit) : v;
  });
  return args;
}

/** The propagation options of one row: its label keys its sources (and its random streams). */
function rowPropagateOptions(
  method: "gum" | "monteCarlo",
  label: string,
  options: EvaluateTableOptions,
  keepSamples: boolean,
): PropagateOptions {
  return {
    method,
    label,
    ...(options.coverage !== undefined ? { coverage: options.coverage } : {}),
    ...(options.population !== undefined ? { population: options.population } : {}),
    ...(method === "monteCarlo" ? { trials: options.trials ?? 10_000, keepSamples } : {}),
    ...(options.seed !== undefined ? { seed: options.seed } : {}),
  };
}

/**
 * One row of {@linkcode evaluateTable}'s propagation, in full: the same wiring, uncertainty
 * models, method, seed and row label (so the same numbers), returned as the propagation itself
 * (budget, and for Monte Carlo the samples) to look into one patient, grade it or chain it on.
 *
 * @param table The table.
 * @param calc The calculation or chain.
 * @param row The row index (0-based; the file line is `table.lines[row]`).
 * @param options As for {@linkcode evaluateTable}; the method defaults to "gum".
 * @returns The row's propagation.
 * @throws {RangeError} For a row index outside the table or a row that cannot be computed (its
 * issues attached, as {@linkcode evaluateTable} records them).
 * @throws {TypeError} For an input no column can feed, or a bad uncertainty model.
 *
 * @example The budget of one patient, identical to that row's columns
 * ```ts
 * import { continuityValveArea, evaluateTable, propagateRow, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const table = readTable("patient,lvot diameter [mm],lvot vti [cm],av vti [cm]\nA,20,20,80\nB,22,21,70\n");
 * const options = { uncertainty: { lvotDiameter: { standardUncertainty: "0.8 mm" } } };
 * const b = propagateRow(table, continuityValveArea, 1, options);
 * const column = evaluateTable(table, continuityValveArea, options).columns.get("aorticValveArea u")!;
 * assert.equal(b.outputs.avaCm2.standardUncertainty, column.kind === "numeric" ? column.values[1] : NaN);
 * // the LVOT diameter is the only uncertain input, so it holds the whole budget
 * assert.equal(b.outputs.avaCm2.budget[0]!.label, "B: LVOT diameter");
 * ```
 */
export function propagateRow<I extends string, O extends string>(
  table: Table,
  calc: Calculation<I, O>,
  row: number,
  options: EvaluateTableOptions = {},
): Propagation<I, O> {
  if (!(Number.isInteger(row) && row >= 0 && row < table.rowCount)) {
    throw new RangeError(
      `${calc.title}: expected a row index in [0, ${table.rowCount - 1}], got ${row}`,
    );
  }
  const c = calc as unknown as Calculation;
  const method = options.method === "monteCarlo" ? "monteCarlo" : "gum";
  // the same row checks as the whole table's (missing, range, relations), without propagating
  const one = selectRows(table, (_, i) => i === row);
  const evaluated = evaluateOne(one, c, "exact", options);
  const problems = evaluated.issues.filter((i) =>
    i.where === calc.title && (i.severity === "error" || i.kind === "notMeasured")
  );
  if (problems.length > 0) {
    throw issueError(problems.map((i) => ({ ...i, severity: "error" as const })));
  }
  const wired = wire(table, c, options.inputs ?? {});
  const inputs = c.inputNames.map((name, k) => {
    const col = wired[k];
    return col ? col.values : new Float64Array(table.rowCount).fill(c.inputs[name]!.default!);
  });
  const label = rowLabels(table, options.rowLabels)[row]!;
  return propagate(
    calc,
    rowArguments(c, wired, inputs, row, options.uncertainty ?? {}) as never,
    rowPropagateOptions(method, label, options, true),
  );
}

/** Result columns are keyed by their quantity, like the columns read (two outputs of one
 * quantity, or a quantity already in the table: "calculation id.output"). */
function outputName(table: Table, calc: Calculation, o: string): string {
  const q = calc.outputs[o]!.quantity.id;
  const shared = calc.outputNames.filter((n) => calc.outputs[n]!.quantity.id === q).length > 1;
  return shared || table.columns.has(q) ? `${calc.id}.${o}` : q;
}

/**
 * Evaluates calculations (or chains) on every row of a table: each input is wired to the column
 * of the same name, or else to the one column of the same quantity (or by hand); results are
 * added as columns. Exactly, through the calculation's own column loop; or with uncertainty,
 * propagating each row by the GUM law (default) or Monte Carlo from the columns' uncertainty
 * models, adding for each output its standard uncertainty and coverage interval. The GUM law
 * runs column by column where it gives each row's own numbers bit for bit (absolute or
 * relative uncertainty models, finite-difference sensitivities), else row by row. Several
 * calculations run in order, each seeing the columns the earlier ones added.
 *
 * @param table The table (from {@linkcode readTable} or an earlier evaluation).
 * @param calculations A calculation or chain, or several in order.
 * @param options Wiring, uncertainty models, method, coverage, population.
 * @returns A new table with the result columns and the issues of every row not computed.
 * @throws {TypeError} For an input no column can feed, or a bad uncertainty model.
 *
 * @example Continuity valve area on every row, with the uncertainty of each input
 * ```ts
 * import { continuityValveArea, evaluateTable, readTable } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const table = readTable("patient,lvot diameter [mm],lvot vti [cm],av vti [cm]\nA,20,20,80\n");
 * const r = evaluateTable(table, continuityValveArea, {
 *   uncertainty: { lvotDiameter: { standardUncertainty: "0.8 mm" }, lvotVti: { relative: 0.06 } },
 * });
 * const ava = r.columns.get("aorticValveArea")!;
 * // π·(2/2)²·20/80 = 0.785 cm² (hand-checkable)
 * assert.ok(ava.kind === "numeric" && Math.abs(ava.values[0]! - Math.PI / 4) < 1e-12);
 * assert.ok(r.columns.has("aorticValveArea u"));
 * ```
 */
export function evaluateTable(
  table: Table,
  calculations: Calculation | readonly Calculation[],
  options: EvaluateTableOptions = {},
): Table {
  const list = Array.isArray(calculations) ? calculations : [calculations as Calculation];
  const method = options.method ?? (options.uncertainty ? "gum" : "exact");
  let current = table;
  const spans: Spans = new WeakMap();
  for (const calc of list) current = evaluateOne(current, calc, method, options, spans);
  return current;
}

/** The smallest and largest value of each column met in one evaluation (NaN when a value is
 * NaN: Math.min and Math.max propagate it), found once per column: a column is checked against
 * its valid and its typical range, and a result column again as the next calculation's input. */
type Spans = WeakMap<Float64Array, { readonly min: number; readonly max: number }>;

/** True when every value of `col` (outside the rows marked in `skip`) is finite and in `range`:
 * from the column's span when no row is skipped, else one pass. */
function columnWithin(
  col: Float64Array,
  range: ValueRange,
  spans: Spans,
  skip?: Uint8Array,
): boolean {
  const bounds = closedBounds(range);
  const lower = Math.max(bounds.lower, -Number.MAX_VALUE);
  const upper = Math.min(bounds.upper, Number.MAX_VALUE);
  if (!skip) {
    let span = spans.get(col);
    if (span === undefined) spans.set(col, span = columnSpan(col));
    return col.length === 0 || (span.min >= lower && span.max <= upper);
  }
  for (let i = 0; i < col.length; i++) {
    const v = col[i]!;
    if (!(v >= lower && v <= upper) && skip[i] === 0) return false;
  }
  return true;
}

function evaluateOne(
  table: Table,
  calc: Calculation,
  method: "exact" | "gum" | "monteCarlo",
  options: EvaluateTableOptions,
  spans: Spans = new WeakMap(),
): Table {
  const wired = wire(table, calc, options.inputs ?? {});
  const n = table.rowCount;
  const issues: ValidationIssue[] = [];
  const where = calc.title;
  const at = (i: number) => ({ row: i, ...(table.lines[i] ? { line: table.lines[i]! } : {}) });
  const inputs = calc.inputNames.map((name, k) => {
    const col = wired[k];
    return col ? col.values : new Float64Array(n).fill(calc.inputs[name]!.default!);
  });
  // rows that cannot be computed: a missing or invalid input, a value outside the calculation's
  // own (narrower) range, a broken relation between inputs. Checked column by column: a min/max
  // pass finds the columns with nothing to report (usually all), and only the rows of the others
  // are looked at one by one. Issues come out in phases (missing or out of range, then typical
  // ranges input by input, then relations); the stable sort by row at the end gives each row's
  // issues in the order of a row-by-row check.
  const skip = new Uint8Array(n);
  const population = options.population ?? "adult";
  const defs = calc.inputNames.map((name) => calc.inputs[name]!);
  const doubtful = inputs.map((col, k) => !columnWithin(col, defs[k]!.range, spans));
  if (doubtful.some(Boolean)) {
    for (let i = 0; i < n; i++) {
      for (let k = 0; k < inputs.length; k++) {
        if (!doubtful[k]) continue;
        const def = defs[k]!;
        const v = inputs[k]![i]!;
        if (v !== v) {
          skip[i] = 1;
          issues.push({
            kind: "notMeasured",
            severity: "warning",
            where,
            field: wired[k]?.header ?? calc.inputNames[k]!,
            label: def.label,
            received: "an empty cell",
            expected: "a value",
            note: `${
              calc.outputNames.map((o) => calc.outputs[o]!.label).join(", ")
            } not computed for this row`,
            ...at(i),
          });
          break;
        }
        if (!inRange(v, def.range)) {
          skip[i] = 1;
          issues.push({
            kind: "range",
            severity: "error",
            where,
            field: calc.inputNames[k]!,
            label: def.label,
            received: withUnit(String(v), def.unit),
            value: v,
            expected: `in ${formatRange(def.range, def.unit)}`,
            ...at(i),
          });
          break;
        }
      }
    }
  }
  // no row skipped so far (the usual case): the columns are checked whole, in the faster pass
  const skipped = skip.includes(1) ? skip : undefined;
  for (let k = 0; k < inputs.length; k++) {
    const name = calc.inputNames[k]!;
    const def = defs[k]!;
    const typical = typicalRange(def, population);
    // the table checked each column against its quantity; a calculation may narrow the range
    if (!typical || !wired[k] || typical === wired[k]!.quantity.typical) continue;
    const col = inputs[k]!;
    if (columnWithin(col, typical, spans, skipped)) continue;
    for (let i = 0; i < n; i++) {
      if (skip[i] || inRange(col[i]!, typical)) continue;
      const flagged = checkValue(name, def, col[i]!, { where, population, ...at(i) });
      for (const issue of flagged.issues) issues.push(issue);
    }
  }
  if (calc.constraints.length > 0) {
    const x: Record<string, number> = {};
    for (let i = 0; i < n; i++) {
      if (skip[i]) continue;
      for (let k = 0; k < inputs.length; k++) x[calc.inputNames[k]!] = inputs[k]![i]!;
      for (const c of calc.constraints) {
        if (!c.holds(x)) {
          skip[i] = 1;
          issues.push({
            kind: "constraint",
            severity: "error",
            where,
            field: c.inputs.join(", "),
            received: c.inputs.map((name) =>
              `${name} = ${withUnit(String(x[name]), calc.inputs[name]!.unit)}`
            ).join(", "),
            expected: c.description,
            ...at(i),
          });
          break;
        }
      }
    }
  }
  const outs = calc.outputNames;
  const anySkipped = skip.includes(1);
  // value columns: filled with NaN here, unless an exact evaluation's own column is taken whole
  const value = outs.map((): Float64Array =>
    method === "exact" && !anySkipped ? new Float64Array(0) : new Float64Array(n).fill(NaN)
  );
  // uncertainty columns only when propagating
  const spare = () => outs.map(() => new Float64Array(method === "exact" ? 0 : n).fill(NaN));
  const u = spare(), lower = spare(), upper = spare();
  if (method === "exact") {
    const results = evaluateColumns(
      calc,
      Object.fromEntries(calc.inputNames.map((name, k) => [name, inputs[k]!])),
    );
    outs.forEach((o, k) => {
      const col = results[o]!;
      const range = calc.outputs[o]!.quantity.valid;
      if (!anySkipped && columnWithin(col, range, spans)) {
        value[k] = col; // every row computed, every value finite and valid: the column itself
        return;
      }
      if (value[k]!.length !== n) value[k] = new Float64Array(n).fill(NaN);
      const out = value[k]!;
      if (columnWithin(col, range, spans, skip)) {
        // every computed value finite and valid: copy, leaving NaN in the skipped rows
        for (let i = 0; i < n; i++) if (!skip[i]) out[i] = col[i]!;
        return;
      }
      for (let i = 0; i < n; i++) {
        if (skip[i]) continue;
        const v = col[i]!;
        if (Number.isFinite(v) && inRange(v, range)) out[i] = v;
        else {
          issues.push({
            kind: "output",
            severity: "error",
            where,
            field: o,
            label: calc.outputs[o]!.label,
            received: String(v),
            expected: `in ${formatRange(range, calc.outputs[o]!.unit)}`,
            ...at(i),
          });
        }
      }
    });
  } else {
    const labelColumn = rowLabelColumn(table, options.rowLabels);
    // the GUM law column by column where it gives each row's numbers; the other rows (and Monte
    // Carlo) one propagation per row
    const columnWise = method === "gum" ? gumByColumns(calc, wired, inputs, skip, options) : null;
    if (columnWise) {
      outs.forEach((_, k) => {
        value[k] = columnWise.value[k]!;
        u[k] = columnWise.standardUncertainty[k]!;
        lower[k] = columnWise.lower[k]!;
        upper[k] = columnWise.upper[k]!;
      });
    }
    for (let i = 0; i < n; i++) {
      if (skip[i] || (columnWise && !columnWise.perRow[i])) continue;
      try {
        const r = propagate(
          calc,
          rowArguments(calc, wired, inputs, i, options.uncertainty ?? {}),
          rowPropagateOptions(method, rowLabel(labelColumn, i), options, false),
        );
        outs.forEach((o, k) => {
          const y = r.outputs[o]!;
          value[k]![i] = y.value;
          u[k]![i] = y.standardUncertainty;
          lower[k]![i] = y.interval.lower;
          upper[k]![i] = y.interval.upper;
        });
      } catch (e) {
        if (!(e instanceof TypeError || e instanceof RangeError)) throw e;
        const found = (e as { issues?: ValidationIssue[] }).issues;
        if (found) { for (const issue of found) issues.push({ ...issue, ...at(i) }); }
        else {
          issues.push({
            kind: "output",
            severity: "error",
            where,
            field: outs.join(", "),
            received: e.message,
            expected: "a result",
            ...at(i),
          });
        }
      }
    }
  }
  const columns = new Map<string, Column>(table.columns);
  outs.forEach((o, k) => {
    const def = calc.outputs[o]!;
    const name = outputName(table, calc, o);
    const base = {
      kind: "numeric" as const,
      quantity: def.quantity,
      sourceUnit: def.unit,
      computed: true,
    };
    columns.set(name, {
      ...base,
      name,
      header: labelWithUnit(def.label, def.unit),
      role: "value",
      values: value[k]!,
    });
    if (method !== "exact") {
      const p = `${Math.round((options.coverage ?? 0.95) * 1000) / 10} %`;
      for (
        const [suffix, role, values, header] of [
          ["u", "standardUncertainty", u[k]!, `${def.label} standard uncertainty`],
          ["lower", "lower", lower[k]!, `${def.label} ${p} interval lower end`],
          ["upper", "upper", upper[k]!, `${def.label} ${p} interval upper end`],
        ] as const
      ) {
        columns.set(`${name} ${suffix}`, {
          ...base,
          name: `${name} ${suffix}`,
          header: labelWithUnit(header, def.unit),
          role,
          of: name,
          values,
        });
      }
    }
  });
  const cautions = [...table.cautions];
  for (const c of cautionsOf(calc)) if (!cautions.includes(c)) cautions.push(c);
  return makeTable({
    source: table.source,
    rowCount: n,
    lines: table.lines,
    columns,
    issues: [...table.issues, ...issues].sort((a, b) => (a.row ?? -1) - (b.row ?? -1)),
    blankLines: table.blankLines,
    cautions,
  });
}

/** The column naming the rows: `column`, else the first text column, else none. */
function rowLabelColumn(table: Table, column?: string): Column | undefined {
  const c = column !== undefined
    ? table.columns.get(column)
    : [...table.columns.values()].find((x) => x.kind === "text");
  if (column !== undefined && c?.kind !== "text") {
    throw new TypeError(
      `Table: expected '${column}' to be a text column naming the rows, got ${
        c === undefined ? "no such column" : "a numeric column"
      }`,
    );
  }
  return c;
}

/** The label of row i: its cell in the row-label column, else the row number. */
function rowLabel(c: Column | undefined, i: number): string {
  return c?.kind === "text" && c.values[i]! !== "" ? c.values[i]! : `row ${i + 1}`;
}

/** A label per row: the row-label column's cells (or the first text column's), else the row
 * number. */
export function rowLabels(table: Table, column?: string): string[] {
  const c = rowLabelColumn(table, column);
  return Array.from({ length: table.rowCount }, (_, i) => rowLabel(c, i));
}

/**
 * The GUM law over the table's columns ({@linkcode gumColumns}) when every row's propagation
 * would be the one it computes: no exact partial derivatives, every uncertainty model absolute
 * (one quantity for the column) or relative, a valid coverage. Null otherwise (then every row
 * is propagated on its own).
 */
function gumByColumns(
  calc: Calculation,
  wired: readonly (NumericColumn | null)[],
  inputs: readonly Float64Array[],
  skip: Uint8Array,
  options: EvaluateTableOptions,
): GumColumns | null {
  const coverage = options.coverage ?? 0.95;
  if (calc.partial || !(coverage > 0 && coverage < 1)) return null;
  const models = options.uncertainty ?? {};
  const uncertainties: (Float64Array | null)[] = [];
  for (let k = 0; k < inputs.length; k++) {
    const col = wired[k];
    const model = col ? models[col.name] ?? models[col.header] : undefined;
    if (model === undefined) uncertainties.push(null);
    else if (typeof model === "function") return null;
    else if ("relative" in model) {
      const x = inputs[k]!, rel = model.relative;
      const u = new Float64Array(x.length);
      for (let i = 0; i < x.length; i++) u[i] = relativeUncertainty(rel, x[i]!);
      uncertainties.push(u);
    } else {
      const u = readUncertainty(model.standardUncertainty, calc.inputs[calc.inputNames[k]!]!.unit);
      if (typeof u !== "number") return null; // each row's propagation says why
      uncertainties.push(new Float64Array(inputs[k]!.length).fill(u));
    }
  }
  try {
    return gumColumns(calc, inputs, uncertainties, skip, coverage);
  } catch (e) {
    // a formula that throws on some rows: each row's propagation says which
    if (e instanceof TypeError || e instanceof RangeError) return null;
    throw e;
  }
}

/** The issues of one row, as messages (for a flags cell). */
export function rowIssues(table: Table, row: number): string[] {
  return table.issues.filter((i) => i.row === row).map(renderIssue);
}

/** One row of a table as a record: numbers for numeric columns (NaN where missing), text for
 * text columns. */
export type TableRow = Record<string, number | string>;

/**
 * One row of a table as a record keyed by column name.
 *
 * @example
 * ```ts
 * import { readTable, tableRow } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("id,height [m]\nA,1.8\n");
 * assert.deepEqual(tableRow(t, 0), { id: "A", height: 180 });
 * ```
 */
export function tableRow(table: Table, row: number): TableRow {
  if (!(Number.isInteger(row) && row >= 0 && row < table.rowCount)) {
    throw new RangeError(
      `${table.source}: expected a row in [0, ${table.rowCount - 1}], got ${row}`,
    );
  }
  const out: TableRow = {};
  for (const [name, c] of table.columns) out[name] = c.values[row]!;
  return out;
}

/**
 * The rows of a table that satisfy a condition, as a table (their lines, issues and cautions
 * kept).
 *
 * @param table The table.
 * @param keep Called with each row as a record and its index.
 * @returns A table of the kept rows.
 *
 * @example
 * ```ts
 * import { readTable, selectRows } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readTable("id,height [cm]\nA,180\nB,120\n");
 * const tall = selectRows(t, (r) => (r.height as number) > 150);
 * assert.equal(tall.rowCount, 1);
 * assert.deepEqual(Array.from(tall.lines), [2]);
 * ```
 */
export function selectRows(
  table: Table,
  keep: (row: TableRow, index: number) => boolean,
): Table {
  const kept: number[] = [];
  for (let i = 0; i < table.rowCount; i++) if (keep(tableRow(table, i), i)) kept.push(i);
  const newIndex = new Map(kept.map((old, i) => [old, i]));
  const columns = new Map<string, Column>();
  for (const [name, c] of table.columns) {
    columns.set(
      name,
      c.kind === "numeric"
        ? { ...c, values: Float64Array.from(kept, (i) => c.values[i]!) }
        : { ...c, values: kept.map((i) => c.values[i]!) },
    );
  }
  return makeTable({
    source: table.source,
    rowCount: kept.length,
    lines: Int32Array.from(kept, (i) => table.lines[i]!),
    columns,
    issues: table.issues.flatMap((issue) =>
      issue.row === undefined
        ? [issue]
        : newIndex.has(issue.row)
        ? [{ ...issue, row: newIndex.get(issue.row)! }]
        : []
    ),
    blankLines: table.blankLines,
    cautions: table.cautions,
  });
}

/**
 * Some columns of a table, in the order given (rows, lines, issues and cautions kept).
 *
 * @param table The table.
 * @param names Column names.
 * @returns The narrower table.
 * @throws {TypeError} For a name the table does not have.
 *
 * @example
 * ```ts
 * import { readTable, selectColumns } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = selectColumns(readTable("id,height [cm],weight [kg]\nA,180,80\n"), ["weight", "id"]);
 * assert.deepEqual([...t.columns.keys()], ["weight", "id"]);
 * ```
 */
export function selectColumns(table: Table, names: readonly string[]): Table {
  const columns = new Map<string, Column>();
  for (const name of names) {
    const c = table.columns.get(name);
    if (c === undefined) {
      throw new TypeError(
        `${table.source}: unknown column '${name}'; expected one of ${
          [...table.columns.keys()].join(", ")
        }`,
      );
    }
    columns.set(name, c);
    const related = [...table.columns.values()].filter((x) =>
      x.kind === "numeric" && x.of === name
    );
    for (const r of related) columns.set(r.name, r);
  }
  return makeTable({ ...table, columns });
}
