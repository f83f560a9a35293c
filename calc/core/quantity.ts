/**
 * Quantities: each measurand and derived quantity declared once, with the label a clinician
 * reads, its canonical unit, its valid and typical ranges, a display resolution and the column
 * headers it is recognised by.
 *
 * @module
 */
import type { Population, Quantity, ValueRange } from "./types.ts";
import { formatRange, rangeWithin } from "./range.ts";

/** What an author writes to declare a quantity; `defineQuantity` fills in the rest. */
export interface QuantitySpec {
  /** Stable identifier in camelCase, e.g. "lvotDiameter". */
  readonly id: string;
  /** What a clinician calls it, e.g. "LVOT diameter". */
  readonly label: string;
  /** Short symbol, e.g. "d_LVOT". @default the label */
  readonly symbol?: string;
  /** Canonical unit ("cm", "m/s", "mmHg", "%", "1"). */
  readonly unit: string;
  /** One line a practitioner reads without a glossary. */
  readonly description: string;
  /** Physically or mathematically possible values. */
  readonly valid: ValueRange;
  /** Values seen in adult practice (or in everyone, when children do not differ). */
  readonly typical?: ValueRange;
  /** Values seen in children, where they differ. */
  readonly typicalPediatric?: ValueRange;
  /** Smallest difference worth showing when no uncertainty is known. */
  readonly resolution: number;
  /** Counts: only integers are valid. @default false */
  readonly integer?: boolean;
  /** Further column headers that mean this quantity ("lvot_d", "lvotd"). @default none */
  readonly headers?: readonly string[];
  /** Where the ranges come from. */
  readonly rangeNote?: string;
}

/**
 * Declares a quantity once. Calculations, tables, charts and messages take its label, unit and
 * ranges from the returned object; nothing else declares them.
 *
 * @param spec Identifier, label, unit, valid and typical ranges, resolution, headers.
 * @returns The frozen quantity.
 * @throws {TypeError} For an empty id or label, an empty or inverted range, a typical range that
 * leaves the valid one, or a resolution that is not a positive number.
 *
 * @example
 * ```ts
 * import { defineQuantity, formatRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const jet = defineQuantity({
 *   id: "demoJetVelocity", label: "Jet velocity", unit: "m/s", resolution: 0.01,
 *   description: "Peak continuous-wave velocity of a jet",
 *   valid: { min: 0, max: 10 }, typical: { min: 1, max: 6 },
 * });
 * assert.equal(formatRange(jet.valid, jet.unit), "[0, 10] m/s");
 * assert.deepEqual(jet.headers, []);
 * ```
 */
export function defineQuantity(spec: QuantitySpec): Quantity {
  const where = `Quantity '${spec?.id}'`;
  if (typeof spec?.id !== "string" || !/^[A-Za-z][A-Za-z0-9_.]*$/.test(spec.id)) {
    throw new TypeError(`${where}: expected an id of letters and digits, got ${spec?.id}`);
  }
  if (typeof spec.label !== "string" || spec.label.trim() === "") {
    throw new TypeError(`${where}: expected a label, got ${JSON.stringify(spec.label)}`);
  }
  if (typeof spec.unit !== "string" || spec.unit === "") {
    throw new TypeError(`${where}: expected a unit string, got ${JSON.stringify(spec.unit)}`);
  }
  checkRange(where, "valid", spec.valid);
  for (const key of ["typical", "typicalPediatric"] as const) {
    const r = spec[key];
    if (r === undefined) continue;
    checkRange(where, key, r);
    if (!rangeWithin(r, spec.valid)) {
      throw new TypeError(
        `${where}: expected the ${key} range inside the valid range ${
          formatRange(spec.valid, spec.unit)
        }, got ${formatRange(r, spec.unit)}`,
      );
    }
  }
  if (!(spec.resolution > 0 && Number.isFinite(spec.resolution))) {
    throw new TypeError(`${where}: expected a resolution > 0, got ${spec.resolution}`);
  }
  return Object.freeze({
    kind: "sonorigor.quantity" as const,
    id: spec.id,
    label: spec.label,
    symbol: spec.symbol ?? spec.label,
    unit: spec.unit,
    description: spec.description,
    valid: Object.freeze({ ...spec.valid }),
    ...(spec.typical ? { typical: Object.freeze({ ...spec.typical }) } : {}),
    ...(spec.typicalPediatric
      ? { typicalPediatric: Object.freeze({ ...spec.typicalPediatric }) }
      : {}),
    resolution: spec.resolution,
    integer: spec.integer ?? false,
    headers: Object.freeze([...(spec.headers ?? [])]),
    ...(spec.rangeNote ? { rangeNote: spec.rangeNote } : {}),
  });
}

function checkRange(where: string, name: string, r: ValueRange | undefined): void {
  if (
    typeof r !== "object" || r === null || typeof r.min !== "number" ||
    typeof r.max !== "number" || Number.isNaN(r.min) || Number.isNaN(r.max) || !(r.min <= r.max) ||
    (r.min === r.max && (r.minExclusive || r.maxExclusive))
  ) {
    throw new TypeError(`${where}: expected a non-empty ${name} range, got ${JSON.stringify(r)}`);
  }
}

/**
 * True for a quantity made by {@linkcode defineQuantity}.
 *
 * @example
 * ```ts
 * import { HEIGHT, isQuantity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(isQuantity(HEIGHT), true);
 * assert.equal(isQuantity({ id: "height" }), false);
 * ```
 */
export function isQuantity(value: unknown): value is Quantity {
  return typeof value === "object" && value !== null &&
    (value as { kind?: unknown }).kind === "sonorigor.quantity";
}

/**
 * The typical range of a quantity for a population (children fall back to the adult range when
 * the quantity does not distinguish them).
 *
 * @example
 * ```ts
 * import { HEIGHT, typicalRange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(typicalRange(HEIGHT, "pediatric")!.min < typicalRange(HEIGHT, "adult")!.min);
 * ```
 */
export function typicalRange(
  q: Pick<Quantity, "typical" | "typicalPediatric">,
  population: Population = "adult",
): ValueRange | undefined {
  return population === "pediatric" ? q.typicalPediatric ?? q.typical : q.typical;
}

/**
 * A column header reduced for matching: lower case, unit in brackets removed, every run of
 * spaces, underscores, hyphens and dots made one space.
 *
 * @example
 * ```ts
 * import { normalizeHeader } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(normalizeHeader("LVOT_Diameter [mm]"), "lvot diameter");
 * ```
 */
export function normalizeHeader(header: string): string {
  return header.replace(/\[[^\]]*\]\s*$/, "").replace(/\([^)]*\)\s*$/, "").trim()
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2").toLowerCase().replace(/[\s_.\-]+/g, " ").trim();
}

/**
 * True when a column header names the quantity: its id, its label or one of its headers.
 *
 * @example
 * ```ts
 * import { HEIGHT, headerMatches } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(headerMatches(HEIGHT, "Height [cm]"), true);
 * assert.equal(headerMatches(HEIGHT, "weight"), false);
 * ```
 */
export function headerMatches(q: Quantity, header: string): boolean {
  const h = normalizeHeader(header);
  return h === normalizeHeader(q.id) || h === normalizeHeader(q.label) ||
    q.headers.some((alias) => normalizeHeader(alias) === h);
}
