/**
 * Indexing a measurement to body size: value / BSA, with the BSA formula reused from its one
 * definition, so that the uncertainty of height and weight reaches the indexed value.
 *
 * @module
 */
import { defineCalculation, evaluate } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import { bsaCalculation, type BsaMethod } from "./bsa.ts";

/** Valid domain of a measurement to be indexed, in its own unit (non-negative, finite). */
const MEASUREMENT_RANGE = { min: 0, max: 1e6 } as const;
/** Valid domain of a BSA: positive, below any human value. */
const BSA_RANGE = { min: 0, max: 5, minExclusive: true } as const;

const LANG_2015_INDEXING = {
  authors: "Lang RM, Badano LP, Mor-Avi V, et al.",
  year: 2015,
  title:
    "Recommendations for cardiac chamber quantification by echocardiography in adults: an update from the American Society of Echocardiography and the European Association of Cardiovascular Imaging",
  publication: "J Am Soc Echocardiogr 2015;28(1):1–39",
  locator: "indexing of chamber size to BSA",
  doi: "10.1016/j.echo.2014.10.003",
} as const;

const indexCache = new Map<string, Calculation<"measurement" | "bsaM2", "indexed">>();

/**
 * The calculation "measurement / BSA" for a measurement in `unit`, defined once per unit and
 * cached (the same object is returned for the same unit).
 *
 * Formula: indexed [unit/m²] = measurement [unit] / BSA [m²]
 *
 * Source: indexing of chamber size to BSA as recommended by Lang RM et al., J Am Soc
 * Echocardiogr 2015;28:1–39.
 *
 * @param unit The measurement's unit (a mathjs unit string such as "mL", "g", "cm").
 * @returns A calculation with inputs `measurement` (unit) and `bsaM2` (m²) and output `indexed`.
 * @throws {TypeError} When `unit` is not a non-empty string.
 *
 * @example
 * ```ts
 * import { bsaIndexCalculation, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 120 mL / 2 m² = 60 mL/m² (hand-checkable arithmetic)
 * const lvedvi = evaluate(bsaIndexCalculation("mL"), { measurement: 120, bsaM2: 2 });
 * assert.equal(lvedvi.outputs.indexed, 60);
 * ```
 */
export function bsaIndexCalculation(
  unit: string,
): Calculation<"measurement" | "bsaM2", "indexed"> {
  if (typeof unit !== "string" || unit.trim() === "") {
    throw new TypeError(`Indexed measurement: expected a unit string, got ${JSON.stringify(unit)}`);
  }
  let calc = indexCache.get(unit);
  if (calc === undefined) {
    calc = defineCalculation({
      id: `bsaIndexed(${unit})`,
      title: `Measurement indexed to BSA (${unit}/m²)`,
      description: "A measurement divided by body surface area.",
      inputs: {
        measurement: { unit, description: "Measurement to index", range: MEASUREMENT_RANGE },
        bsaM2: {
          unit: "m^2",
          description: "Body surface area",
          range: BSA_RANGE,
          typical: { min: 0.1, max: 3 },
        },
      },
      outputs: { indexed: { unit: `${unit}/m^2`, description: "Measurement per m² of BSA" } },
      formula: ({ measurement, bsaM2 }) => ({ indexed: measurement / bsaM2 }),
      formulaText: `indexed = measurement / BSA  (${unit}/m²)`,
      sources: [LANG_2015_INDEXING],
      cautions: [
        "Ratio indexing assumes the measurement scales linearly with BSA; in obesity and in children this overcorrects",
      ],
      clinical: true,
    });
    indexCache.set(unit, calc);
  }
  return calc;
}

const bodyIndexCache = new Map<
  string,
  Calculation<"measurement" | "heightCm" | "weightKg", "bsaM2" | "indexed">
>();

/**
 * The calculation "measurement / BSA(height, weight)": BSA by the chosen formula, then the
 * index, so that height and weight uncertainties propagate (GUM or Monte Carlo) into the
 * indexed value. Defined once per (unit, method) and cached. Both steps call the formulas of
 * their one definitions ({@linkcode bsaCalculation} and {@linkcode bsaIndexCalculation}).
 *
 * Formula: BSA = f(H, W); indexed = measurement / BSA
 *
 * Source: the BSA formula's own paper; indexing per Lang RM et al., J Am Soc Echocardiogr
 * 2015;28:1–39.
 *
 * @param unit Unit of the measurement ("mL", "g", "cm", ...).
 * @param method BSA formula. @default "mosteller"
 * @returns A calculation with inputs `measurement`, `heightCm`, `weightKg` and outputs `bsaM2`,
 * `indexed`.
 * @throws {TypeError} For an empty unit or an unknown method.
 *
 * @example
 * ```ts
 * import { bodySizeIndexCalculation, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Mosteller BSA at 180 cm, 80 kg is exactly 2 m²; 120 mL / 2 m² = 60 mL/m²
 * const calc = bodySizeIndexCalculation("mL", "mosteller");
 * const r = evaluate(calc, { measurement: 120, heightCm: 180, weightKg: 80 });
 * assert.equal(r.outputs.indexed, 60);
 * ```
 */
export function bodySizeIndexCalculation(
  unit: string,
  method: BsaMethod = "mosteller",
): Calculation<"measurement" | "heightCm" | "weightKg", "bsaM2" | "indexed"> {
  const bsa = bsaCalculation(method);
  const index = bsaIndexCalculation(unit);
  const key = `${method}\u0000${unit}`;
  let calc = bodyIndexCache.get(key);
  if (calc === undefined) {
    calc = defineCalculation({
      id: `bodySizeIndexed(${unit}, ${method})`,
      title: `Measurement indexed to BSA by ${bsa.title.replace(/^Body surface area /, "")}`,
      description: "BSA from height and weight, then the measurement divided by it.",
      inputs: {
        measurement: index.inputs.measurement,
        heightCm: bsa.inputs.heightCm,
        weightKg: bsa.inputs.weightKg,
      },
      outputs: { bsaM2: bsa.outputs.bsaM2, indexed: index.outputs.indexed },
      formula: ({ measurement, heightCm, weightKg }) => {
        const { bsaM2 } = bsa.formula({ heightCm, weightKg });
        return { bsaM2, indexed: index.formula({ measurement, bsaM2 }).indexed };
      },
      formulaText: `BSA = ${bsa.formulaText}; indexed = measurement / BSA`,
      sources: [...bsa.sources, ...index.sources],
      cautions: [...bsa.cautions, ...index.cautions],
      clinical: true,
    });
    bodyIndexCache.set(key, calc);
  }
  return calc;
}

/** A measurement indexed to BSA, with its unit. */
export interface IndexedValue {
  /** Measurement / BSA. */
  readonly value: number;
  /** Unit of the indexed value, e.g. "mL/m^2". */
  readonly unit: string;
  /** Flags (e.g. BSA outside the usual human range). */
  readonly flags: readonly string[];
}

/**
 * Indexes a measurement to a known BSA (validated; evaluates {@linkcode bsaIndexCalculation}).
 *
 * @param measurement Value in `unit` (a number or a quantity string such as "120 mL").
 * @param bsaM2 Body surface area in m², in (0, 5].
 * @param unit Unit of the measurement.
 * @returns The indexed value with unit `${unit}/m^2` and any flags.
 * @throws {TypeError} For a value of the wrong type or unit.
 * @throws {RangeError} For a negative measurement or a BSA outside (0, 5] m².
 *
 * @example
 * ```ts
 * import { indexToBsa } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(indexToBsa(190, 1.9, "g"), { value: 100, unit: "g/m^2", flags: [] });
 * ```
 */
export function indexToBsa(
  measurement: number | string,
  bsaM2: number | string,
  unit: string,
): IndexedValue {
  const r = evaluate(bsaIndexCalculation(unit), { measurement, bsaM2 });
  return { value: r.outputs.indexed, unit: `${unit}/m^2`, flags: r.flags };
}
