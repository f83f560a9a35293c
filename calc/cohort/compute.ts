/**
 * Columnar cohort computation: BSA, indexed values and Z-scores for every row in one call, on
 * Float64Array columns, by calling the formulas of the one calculation definitions in a loop
 * (no per-row result objects are kept), and writing the results back as CSV with flags.
 *
 * @module
 */
import Papa from "papaparse";
import { formatRange, inRange } from "../core/define.ts";
import { evaluateColumns } from "../core/kernel.ts";
import { bsaCalculation, type BsaMethod } from "../body/bsa.ts";
import { bsaIndexCalculation } from "../body/indexing.ts";
import { percentileFromZ, zScoreCalculation, type ZScoreModel } from "../reference/zscore.ts";
import {
  type CohortReadOptions,
  type CohortTable,
  readCohortCsv,
  ROW_INVALID,
  ROW_MISSING,
} from "./read.ts";

/** Options of {@linkcode computeCohort}. */
export interface CohortComputeOptions {
  /** BSA formula for BSA and indexing. Z-scores use each model's own BSA formula.
   * @default "haycock" */
  readonly bsaMethod?: BsaMethod;
  /** Measurements to index to BSA (by measurement name). */
  readonly index?: readonly string[];
  /** Z-score model for each measurement name. */
  readonly zScores?: Readonly<Record<string, ZScoreModel>>;
}

/**
 * Row flag bit: a cell of the row was invalid (outputs NaN).
 *
 * @example
 * ```ts
 * import { FLAG_INVALID_INPUT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(FLAG_INVALID_INPUT, 1);
 * ```
 */
export const FLAG_INVALID_INPUT = 1;
/**
 * Row flag bit: a measurement was not measured (its outputs NaN).
 *
 * @example
 * ```ts
 * import { FLAG_MISSING_MEASUREMENT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(FLAG_MISSING_MEASUREMENT, 2);
 * ```
 */
export const FLAG_MISSING_MEASUREMENT = 2;
/**
 * Row flag bit: height or weight outside the typical range of the BSA formula.
 *
 * @example
 * ```ts
 * import { FLAG_BODY_SIZE_ATYPICAL } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(FLAG_BODY_SIZE_ATYPICAL, 4);
 * ```
 */
export const FLAG_BODY_SIZE_ATYPICAL = 4;
/**
 * Row flag bit: the BSA lies outside the BSA range of at least one Z-score model.
 *
 * @example
 * ```ts
 * import { FLAG_BSA_OUTSIDE_MODEL } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(FLAG_BSA_OUTSIDE_MODEL, 8);
 * ```
 */
export const FLAG_BSA_OUTSIDE_MODEL = 8;

/** The computed cohort: the input table plus result columns. */
export interface CohortResult {
  /** The input table. */
  readonly table: CohortTable;
  /** BSA method used for `bsaM2` and indexing. */
  readonly bsaMethod: BsaMethod;
  /** BSA (m²) by `bsaMethod`. */
  readonly bsaM2: Float64Array;
  /** Indexed values by measurement name (unit/m²). */
  readonly indexed: Readonly<Record<string, Float64Array>>;
  /** Z-scores by measurement name. */
  readonly zScores: Readonly<Record<string, Float64Array>>;
  /** Per-row BSA outside the model's range, by measurement name (1 = outside). */
  readonly bsaOutsideModel: Readonly<Record<string, Uint8Array>>;
  /** The Z-score models by measurement name. */
  readonly models: Readonly<Record<string, ZScoreModel>>;
  /** Per-row flag bits (FLAG_*). */
  readonly flags: Uint8Array;
}

/**
 * Computes BSA, indexed values and Z-scores for every row of a cohort, columnwise.
 *
 * The formulas are those of the one definitions: the BSA calculation's `.formula`,
 * {@linkcode bsaIndexCalculation}'s and {@linkcode zScoreCalculation}'s, called in a loop over
 * the typed columns with one reused argument object per formula. Rows with invalid or missing
 * inputs get NaN outputs and a flag bit; nothing is dropped.
 *
 * @param table A table from {@linkcode readCohortCsv}.
 * @param options BSA method, measurements to index, Z-score models per measurement.
 * @returns Result columns and per-row flags.
 * @throws {TypeError} For an unknown measurement name or a Z-score model whose unit differs
 * from the measurement column's canonical unit.
 *
 * @example
 * ```ts
 * import { computeCohort, PHN_2017_MODELS, readCohortCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const model = PHN_2017_MODELS.lvEndDiastolicDimension;
 * const table = readCohortCsv("height [cm],weight [kg],lvedd [cm]\n120,22,3.6\n", {
 *   height: "height", weight: "weight",
 *   measurements: [{ column: "lvedd", canonicalUnit: model.unit, range: model.measurementRange }],
 * });
 * const r = computeCohort(table, { zScores: { lvedd: model }, index: ["lvedd"] });
 * assert.ok(r.bsaM2[0]! > 0.8 && r.bsaM2[0]! < 0.9);
 * assert.ok(Number.isFinite(r.zScores.lvedd![0]!));
 * ```
 */
export function computeCohort(
  table: CohortTable,
  options: CohortComputeOptions = {},
): CohortResult {
  const bsaMethod = options.bsaMethod ?? "haycock";
  const n = table.rowCount;
  const h = table.heightCm.values;
  const w = table.weightKg.values;
  const flags = new Uint8Array(n);
  for (let i = 0; i < n; i++) {
    const s = table.rowStatus[i]!;
    flags[i] = (s & ROW_INVALID ? FLAG_INVALID_INPUT : 0) |
      (s & ROW_MISSING ? FLAG_MISSING_MEASUREMENT : 0);
  }

  // BSA by each needed method, once per method.
  const bsaByMethod = new Map<BsaMethod, Float64Array>();
  const bsaColumn = (method: BsaMethod): Float64Array => {
    let out = bsaByMethod.get(method);
    if (out) return out;
    const calc = bsaCalculation(method);
    const typH = calc.inputs.heightCm.typical!;
    const typW = calc.inputs.weightKg.typical!;
    // the formula of the one definition over the columns (NaN rows give NaN)
    out = evaluateColumns(calc, { heightCm: h, weightKg: w }).bsaM2;
    for (let i = 0; i < n; i++) {
      const hi = h[i]!;
      const wi = w[i]!;
      if (hi === hi && wi === wi && (!inRange(hi, typH) || !inRange(wi, typW))) {
        flags[i]! |= FLAG_BODY_SIZE_ATYPICAL;
      }
    }
    bsaByMethod.set(method, out);
    return out;
  };
  const bsaM2 = bsaColumn(bsaMethod);

  const measurement = (name: string) => {
    const col = table.measurements[name];
    if (col === undefined) {
      throw new TypeError(
        `Cohort: expected a measurement in ${
          Object.keys(table.measurements).join(", ") || "(none)"
        }, got '${name}'`,
      );
    }
    return col;
  };

  const indexed: Record<string, Float64Array> = {};
  for (const name of options.index ?? []) {
    const col = measurement(name);
    const calc = bsaIndexCalculation(col.unit);
    // NaN in → NaN out (the row is already flagged)
    indexed[name] = evaluateColumns(calc, { measurement: col.values, bsaM2 }).indexed;
  }

  const zScores: Record<string, Float64Array> = {};
  const bsaOutsideModel: Record<string, Uint8Array> = {};
  const models: Record<string, ZScoreModel> = {};
  for (const [name, model] of Object.entries(options.zScores ?? {})) {
    const col = measurement(name);
    if (col.unit !== model.unit) {
      throw new TypeError(
        `Cohort: measurement '${name}' must be read in the unit of model '${model.id}' (${model.unit}), got ${col.unit}`,
      );
    }
    const bsa = bsaColumn(model.bsaMethod);
    const calc = zScoreCalculation(model);
    const out = evaluateColumns(calc, { measurement: col.values, bsaM2: bsa }).zScore;
    const outside = new Uint8Array(n);
    const { min, max } = model.bsaRange;
    for (let i = 0; i < n; i++) {
      const b = bsa[i]!;
      if (b === b && !(b >= min && b <= max) && !inRange(b, model.bsaRange)) {
        outside[i] = 1;
        flags[i]! |= FLAG_BSA_OUTSIDE_MODEL;
      }
    }
    zScores[name] = out;
    bsaOutsideModel[name] = outside;
    models[name] = model;
  }
  return { table, bsaMethod, bsaM2, indexed, zScores, bsaOutsideModel, models, flags };
}

/** A text cell quoted per RFC 4180 when it holds a comma, quote or line break. */
function csvText(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** Text of a number for CSV: full precision, empty for NaN (the flags column says why). */
function cell(v: number): string {
  return v === v ? String(v) : "";
}

/**
 * Writes a computed cohort as CSV: the identifiers, inputs in canonical units, BSA, indexed
 * values, Z-scores with percentiles, and a `flags` column explaining every NaN and every
 * extrapolation (invalid or missing cells with their line and column, BSA outside a model's
 * range, body size outside the typical range).
 *
 * @param result From {@linkcode computeCohort}.
 * @returns CSV text with a header line; units in the header as "name [unit]".
 *
 * @example
 * ```ts
 * import { cohortToCsv, computeCohort, readCohortCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const t = readCohortCsv("id,height [cm],weight [kg]\nA,180,80\n", { id: "id", height: "height", weight: "weight" });
 * const csv = cohortToCsv(computeCohort(t, { bsaMethod: "mosteller" }));
 * // Mosteller: √(180·80/3600) = 2 m² (hand-checkable)
 * assert.equal(csv.split("\n")[1], "A,180,80,2,");
 * ```
 */
export function cohortToCsv(result: CohortResult): string {
  const { table } = result;
  const n = table.rowCount;
  const fields: string[] = [];
  const getters: ((i: number) => string)[] = [];
  if (table.ids) {
    fields.push("id");
    getters.push((i) => csvText(table.ids![i]!));
  }
  if (table.sex) {
    fields.push("sex");
    getters.push((i) => csvText(table.sex![i]!));
  }
  fields.push("height [cm]", "weight [kg]", `bsa_${result.bsaMethod} [m^2]`);
  getters.push(
    (i) => cell(table.heightCm.values[i]!),
    (i) => cell(table.weightKg.values[i]!),
    (i) => cell(result.bsaM2[i]!),
  );
  for (const [name, col] of Object.entries(table.measurements)) {
    fields.push(`${name} [${col.unit}]`);
    getters.push((i) => cell(col.values[i]!));
    const idx = result.indexed[name];
    if (idx) {
      fields.push(`${name}_indexed [${col.unit}/m^2]`);
      getters.push((i) => cell(idx[i]!));
    }
    const z = result.zScores[name];
    if (z) {
      fields.push(`${name}_z`, `${name}_percentile`);
      getters.push(
        (i) => cell(z[i]!),
        (i) => (z[i]! === z[i]! ? String(percentileFromZ(z[i]!)) : ""),
      );
    }
  }
  fields.push("flags");
  const issuesByRow = new Map<number, string[]>();
  for (const issue of table.issues) {
    const list = issuesByRow.get(issue.row) ?? [];
    list.push(
      issue.kind === "missing"
        ? `${issue.column} not measured`
        : `invalid ${issue.column} at line ${issue.line}: ${
          issue.message.replace(/^.*?: (expected)/, "$1")
        }`,
    );
    issuesByRow.set(issue.row, list);
  }
  getters.push((i) => {
    const f = result.flags[i]!;
    if (f === 0) return "";
    const notes = [...(issuesByRow.get(i) ?? [])];
    if (f & FLAG_BODY_SIZE_ATYPICAL) {
      notes.push("height or weight outside the typical range of the BSA formula");
    }
    if (f & FLAG_BSA_OUTSIDE_MODEL) {
      for (const [name, outside] of Object.entries(result.bsaOutsideModel)) {
        if (outside[i]) {
          const m = result.models[name]!;
          notes.push(
            `${name}: BSA outside the range of model ${m.id} ${
              formatRange(m.bsaRange, "m^2")
            } (extrapolated Z)`,
          );
        }
      }
    }
    return csvText(notes.join("; "));
  });
  // Header through papaparse's quoting; rows joined directly (numbers never need quoting, text
  // cells are quoted per RFC 4180 by csvText) to keep the 10^6-row path fast.
  const parts = new Array<string>(n + 1);
  parts[0] = Papa.unparse([fields], { newline: "\n" });
  const k = getters.length;
  const values = new Array<string>(k);
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < k; c++) values[c] = getters[c]!(i);
    parts[i + 1] = values.join(",");
  }
  return parts.join("\n") + "\n";
}

/**
 * Reads, computes and writes a cohort in one call: {@linkcode readCohortCsv} with flagging of
 * invalid cells, then {@linkcode computeCohort}, then {@linkcode cohortToCsv}.
 *
 * @param text CSV text.
 * @param options Read options (the policy defaults to "flag" here) and compute options.
 * @returns The result columns and the output CSV.
 * @throws {TypeError} For malformed options, missing columns or undeclared units.
 *
 * @example
 * ```ts
 * import { analyzeCohortCsv } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const { csv } = analyzeCohortCsv("height [cm],weight [kg]\n180,80\n170,abc\n", {
 *   height: "height", weight: "weight", bsaMethod: "mosteller",
 * });
 * assert.match(csv, /invalid weight \[kg\] at line 3/);
 * ```
 */
export function analyzeCohortCsv(
  text: string,
  options: CohortReadOptions & CohortComputeOptions,
): { result: CohortResult; csv: string } {
  const { bsaMethod, index, zScores, ...read } = options;
  const table = readCohortCsv(text, { onInvalid: "flag", ...read });
  const compute: CohortComputeOptions = {
    ...(bsaMethod ? { bsaMethod } : {}),
    ...(index ? { index } : {}),
    ...(zScores ? { zScores } : {}),
  };
  const result = computeCohort(table, compute);
  return { result, csv: cohortToCsv(result) };
}
