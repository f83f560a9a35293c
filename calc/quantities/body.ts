/**
 * Quantities of body size: height, weight, age and body surface area.
 *
 * Valid ranges span every human (from the smallest viable preterm infant to above the largest
 * recorded adult); typical ranges are those the BSA formulas were fitted on. Both are common
 * practice, no source.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

/**
 * Standing height (recumbent length in infants).
 *
 * @example
 * ```ts
 * import { HEIGHT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(HEIGHT.unit, "cm");
 * ```
 */
export const HEIGHT: Quantity = defineQuantity({
  id: "height",
  label: "Height",
  symbol: "H",
  unit: "cm",
  description: "Standing height (recumbent length in infants)",
  // from the smallest viable preterm length to above the tallest recorded human (about 272 cm)
  valid: { min: 15, max: 280 },
  typical: { min: 140, max: 210 },
  typicalPediatric: { min: 45, max: 190 },
  resolution: 0.5,
  headers: ["height cm", "length", "stature", "ht"],
  rangeNote: "common practice, no source",
});

/**
 * Body weight.
 *
 * @example
 * ```ts
 * import { WEIGHT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(WEIGHT.unit, "kg");
 * ```
 */
export const WEIGHT: Quantity = defineQuantity({
  id: "weight",
  label: "Weight",
  symbol: "W",
  unit: "kg",
  description: "Body weight",
  // from the smallest viable preterm weight (about 0.25 kg) to above the heaviest recorded human
  // (about 635 kg)
  valid: { min: 0.2, max: 650 },
  typical: { min: 35, max: 200 },
  typicalPediatric: { min: 2, max: 120 },
  resolution: 0.1,
  headers: ["weight kg", "mass", "body weight", "wt"],
  rangeNote: "common practice, no source",
});

/**
 * Age at the study.
 *
 * @example
 * ```ts
 * import { AGE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AGE.unit, "year");
 * ```
 */
export const AGE: Quantity = defineQuantity({
  id: "age",
  label: "Age",
  symbol: "age",
  unit: "year",
  description: "Age at the study",
  valid: { min: 0, max: 130 },
  typical: { min: 18, max: 100 },
  typicalPediatric: { min: 0, max: 18 },
  resolution: 0.1,
  headers: ["age y", "age years"],
  rangeNote: "common practice, no source",
});

/**
 * Body surface area.
 *
 * @example
 * ```ts
 * import { BODY_SURFACE_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(BODY_SURFACE_AREA.label, "Body surface area");
 * ```
 */
export const BODY_SURFACE_AREA: Quantity = defineQuantity({
  id: "bsa",
  label: "Body surface area",
  symbol: "BSA",
  unit: "m^2",
  description: "Body surface area, from height and weight by a published formula",
  valid: { min: 0, max: 5, minExclusive: true },
  typical: { min: 1.2, max: 2.8 },
  typicalPediatric: { min: 0.15, max: 2.4 },
  resolution: 0.01,
  headers: ["body surface area", "bsa m2", "bsaM2"],
  rangeNote: "common practice, no source",
});

/**
 * The body-size quantities, listed for the package's quantity lookup (tables, models).
 *
 * @example
 * ```ts
 * import { BODY_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(BODY_QUANTITIES.length > 0);
 * ```
 */
export const BODY_QUANTITIES: readonly Quantity[] = [
  HEIGHT,
  WEIGHT,
  AGE,
  BODY_SURFACE_AREA,
];
