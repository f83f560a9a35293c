/**
 * A table's header line made into a plan per column: each header mapped to a quantity (by its
 * id, label or recognised headers, or by hand), its unit read from the header ("lvot diameter
 * [mm]", "lvotDiameterMm") and the conversion to the quantity's canonical unit; or kept as text.
 *
 * @module
 */
import type { Quantity } from "../core/types.ts";
import { headerMatches, normalizeHeader } from "../core/quantity.ts";
import { readAmount } from "../core/units.ts";
import { formatUnit } from "../core/text.ts";
import { QUANTITIES } from "../quantities/mod.ts";
import type { ReadTableOptions } from "./types.ts";
import { restoreFormula } from "./formula_guard.ts";

/** How one column of the file is read. */
export interface ColumnPlan {
  /** Position in the record. */
  readonly index: number;
  /** The header as written (trimmed). */
  readonly header: string;
  /** Column name: the quantity's id, or the header for a text column. */
  readonly name: string;
  /** The quantity, or null for a text column. */
  readonly quantity: Quantity | null;
  /** The unit the file uses. */
  readonly sourceUnit: string;
  /** Multiply by `factor`, or divide by `divisor` when the conversion is 1/integer (so 38 mm
   * gives exactly 3.8 cm). */
  readonly factor: number;
  /** See `factor`; 0 when unused. */
  readonly divisor: number;
}

/** Unit words written at the end of a header without brackets ("lvotDiameterMm"). */
const UNIT_WORDS: Readonly<Record<string, string>> = {
  mm: "mm",
  cm: "cm",
  m: "m",
  ml: "mL",
  l: "L",
  g: "g",
  kg: "kg",
  ms: "ms",
  s: "s",
  mps: "m/s",
  cmps: "cm/s",
  hz: "Hz",
  mhz: "MHz",
  mmhg: "mmHg",
  percent: "%",
  pct: "%",
  deg: "deg",
  m2: "m^2",
  cm2: "cm^2",
  y: "year",
  years: "year",
};

/** Splits "weight [kg]" into name and unit. */
/**
 * Splits a header into its name and the unit written in brackets at its end.
 *
 * @param header A column header.
 * @returns The name and the unit (undefined when the header names none).
 *
 * @example
 * ```ts
 * import { splitHeader } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(splitHeader("LVOT diameter [mm]"), { name: "LVOT diameter", unit: "mm" });
 * assert.deepEqual(splitHeader("patient"), { name: "patient", unit: undefined });
 * ```
 */
export function splitHeader(header: string): { name: string; unit: string | undefined } {
  const m = /^(.*?)\s*\[([^\]]+)\]\s*$/.exec(header);
  return m ? { name: m[1]!.trim(), unit: m[2]!.trim() } : { name: header.trim(), unit: undefined };
}

/**
 * Plans the columns of a header record.
 *
 * @param fields The header record's fields.
 * @param line The header's line in the file.
 * @param delimiter The delimiter the record was split with.
 * @param options The reader's options (mapping, units, quantities).
 * @param source Name of the file, for messages.
 * @returns One plan per column.
 * @throws {TypeError} For a header without a name, one column holding a delimiter the file does
 * not use, two columns of one quantity, a recognised numeric column without a unit, a unit that
 * cannot be converted, an ambiguous header, a mapping to an unknown quantity.
 *
 * @example
 * ```ts
 * import { planColumns } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const [id, d] = planColumns(["id", "lvot diameter [mm]"], 1, ",", {}, "demo.csv");
 * assert.equal(id!.quantity, null);
 * assert.equal(d!.name, "lvotDiameter");
 * assert.equal(d!.divisor, 10); // 1 mm = 1/10 cm
 * assert.throws(() => planColumns(["id;height [cm]"], 1, ",", { delimiter: "," }, "demo.csv"),
 *   /demo\.csv: line 1, expected columns separated by ',' \(the delimiter given\), got one column 'id;height \[cm\]' holding ';': set the delimiter to ';' or 'auto'/);
 * ```
 */
export function planColumns(
  fields: readonly string[],
  line: number,
  delimiter: string,
  options: ReadTableOptions,
  source: string,
): ColumnPlan[] {
  const fail = (message: string): never => {
    throw new TypeError(`${source}: line ${line}, ${message}`);
  };
  const quantities = [...(options.quantities ?? QUANTITIES.values())];
  const explicit = options.columns ?? {};
  // a header the writer neutralised against spreadsheet formulas reads back as written
  const headers = fields.map((h) => restoreFormula(h.trim()));
  if (headers.length === 1) {
    const other = [",", ";", "\t"].find((d) => d !== delimiter && headers[0]!.includes(d));
    if (other !== undefined) {
      const name = (d: string) => d === "\t" ? "a tab" : `'${d}'`;
      fail(
        `expected columns separated by ${name(delimiter)} (the delimiter ${
          options.delimiter && options.delimiter !== "auto" ? "given" : "detected"
        }), got one column '${headers[0]}' holding ${name(other)}: set the delimiter to ${
          name(other)
        } or 'auto'`,
      );
    }
  }
  const plans = headers.map((header, index): ColumnPlan => {
    if (header === "") fail(`expected a name for column ${index + 1}, got an empty header`);
    const split = splitHeader(header);
    const mapped = explicit[header] ?? explicit[split.name];
    let unit = options.units?.[header] ?? options.units?.[split.name] ?? split.unit;
    const text = {
      index,
      header,
      name: header,
      quantity: null,
      sourceUnit: "",
      factor: 1,
      divisor: 0,
    };
    let quantity: Quantity | null;
    if (mapped !== undefined) {
      if (mapped === "text") return text;
      quantity = typeof mapped === "string"
        ? QUANTITIES.get(mapped) ?? quantities.find((q) => q.id === mapped) ?? null
        : mapped;
      if (quantity === null) {
        fail(`column '${header}' is mapped to an unknown quantity '${mapped}'`);
      }
    } else {
      let matches = quantities.filter((q) => headerMatches(q, split.name));
      if (matches.length === 0 && unit === undefined) {
        // a unit written as the header's last word: "lvotDiameterMm", "lvef_percent"
        const words = normalizeHeader(split.name).split(" ");
        const word = UNIT_WORDS[words.at(-1) ?? ""];
        if (word !== undefined && words.length > 1) {
          const stem = words.slice(0, -1).join(" ");
          matches = quantities.filter((q) => headerMatches(q, stem));
          if (matches.length > 0) unit = word;
        }
      }
      if (matches.length > 1) {
        fail(
          `column '${header}' could mean ${
            matches.map((q) => q.label).join(" or ")
          }; map it with the option columns`,
        );
      }
      quantity = matches[0] ?? null;
    }
    if (quantity === null) return text;
    if (unit === undefined) {
      if (quantity.unit === "1" || quantity.unit === "%") unit = quantity.unit;
      else {
        fail(
          `column '${header}' (${quantity.label}) has no unit: expected it in the header, e.g. '${split.name} [${quantity.unit}]', got '${header}'`,
        );
      }
    }
    if (unit !== quantity.unit && typeof readAmount(`1 ${unit}`, quantity.unit) !== "number") {
      unit = UNIT_WORDS[unit!.toLowerCase()] ?? unit; // "y", "mps", "pct"
    }
    const factor = unit === quantity.unit ? 1 : readAmount(`1 ${unit}`, quantity.unit);
    if (typeof factor !== "number") {
      return fail(
        `column '${header}' (${quantity.label}): expected a unit convertible to ${
          formatUnit(quantity.unit) || "a number"
        }, got '${unit}'`,
      );
    }
    const inverse = Math.round(1 / factor);
    const divisor = factor < 1 && Math.abs(1 / factor - inverse) < 1e-9 * inverse ? inverse : 0;
    return { index, header, name: quantity.id, quantity, sourceUnit: unit!, factor, divisor };
  });
  const seen = new Map<string, string>();
  for (const p of plans) {
    const before = seen.get(p.name);
    if (before !== undefined) {
      fail(
        p.quantity
          ? `columns '${before}' and '${p.header}' both hold ${p.quantity.label}; expected one (map one of them as text)`
          : `expected unique column names, got '${p.name}' twice`,
      );
    }
    seen.set(p.name, p.header);
  }
  return plans;
}
