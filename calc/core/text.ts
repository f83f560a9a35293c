/**
 * Text of units, values and citations: the one place that writes "cm²" for "cm^2", shows an
 * unexpected value in an error and formats a citation.
 *
 * @module
 */
import type { Citation } from "./types.ts";

const SUPERSCRIPTS: Record<string, string> = {
  "2": "²",
  "3": "³",
  "4": "⁴",
  "-1": "⁻¹",
  "-2": "⁻²",
  "-3": "⁻³",
};

/**
 * Formats a unit string for people: "cm^2" → "cm²", "1" → "" (dimensionless), "deg" → "°",
 * "us" → "µs", "L/min/m^2" → "L/min/m²".
 *
 * @param unit A canonical unit string.
 * @returns The unit as printed.
 *
 * @example
 * ```ts
 * import { formatUnit } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatUnit("cm^2/m^2"), "cm²/m²");
 * assert.equal(formatUnit("deg"), "°");
 * ```
 */
export function formatUnit(unit: string): string {
  if (unit === "1" || unit === "") return "";
  if (unit === "deg") return "°";
  return unit
    .replace(/\bus\b/g, "µs")
    .replace(/\^(-?\d)/g, (m, p: string) => SUPERSCRIPTS[p] ?? m);
}

/**
 * A value followed by its unit as printed: "2.1 cm", "45°", "0.3" (dimensionless).
 *
 * @param value The value, already formatted.
 * @param unit A canonical unit string.
 * @returns Value and unit.
 *
 * @example
 * ```ts
 * import { withUnit } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(withUnit("2.1", "cm"), "2.1 cm");
 * assert.equal(withUnit("45", "deg"), "45°");
 * ```
 */
export function withUnit(value: string, unit: string): string {
  const u = formatUnit(unit);
  if (u === "") return value;
  return u === "°" || u === "%" ? `${value}${u === "%" ? " %" : u}` : `${value} ${u}`;
}

/**
 * Shows an unexpected value in an error message: strings quoted, numbers as written, objects by
 * kind (never a dump of their contents).
 *
 * @param value Anything.
 * @returns A short description.
 *
 * @example
 * ```ts
 * import { describeValue } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(describeValue("abc"), '"abc"');
 * assert.equal(describeValue([1, 2]), "an array");
 * assert.equal(describeValue(undefined), "nothing");
 * ```
 */
export function describeValue(value: unknown): string {
  if (value === null) return "null";
  if (value === undefined) return "nothing";
  if (typeof value === "string") return JSON.stringify(value);
  if (typeof value === "number" || typeof value === "boolean" || typeof value === "bigint") {
    return String(value);
  }
  if (Array.isArray(value)) return "an array";
  if (ArrayBuffer.isView(value)) return "a typed array";
  if (typeof value === "function") return "a function";
  return `a value of type ${typeof value}`;
}

/**
 * Formats a citation as "Authors (year). Title. Publication, locator. doi:…".
 *
 * @example
 * ```ts
 * import { formatCitation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(
 *   formatCitation({ authors: "Hatle L, Angelsen B", year: 1985, title: "Doppler Ultrasound in Cardiology", publication: "Lea & Febiger" }),
 *   "Hatle L, Angelsen B (1985). Doppler Ultrasound in Cardiology. Lea & Febiger.",
 * );
 * ```
 */
export function formatCitation(c: Citation): string {
  const locator = c.locator ? `, ${c.locator}` : "";
  const doi = c.doi ? ` doi:${c.doi}` : "";
  const year = c.year > 0 ? String(c.year) : "n.d.";
  return `${c.authors} (${year}). ${c.title}. ${c.publication}${locator}.${doi}`;
}
