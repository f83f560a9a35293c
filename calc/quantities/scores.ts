/**
 * Dimensionless scores: Z-scores and percentiles.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

/**
 * Percentile of a Z-score under the normal distribution.
 *
 * @example
 * ```ts
 * import { PERCENTILE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(PERCENTILE.valid.max, 100);
 * ```
 */
export const PERCENTILE: Quantity = defineQuantity({
  id: "percentile",
  label: "Percentile",
  symbol: "P",
  unit: "%",
  description: "Share of the reference population below the value, 100·Φ(Z)",
  valid: { min: 0, max: 100 },
  resolution: 0.1,
  rangeNote: "by definition",
});

/**
 * The score quantities, listed for the package's quantity lookup (tables, models).
 *
 * @example
 * ```ts
 * import { SCORE_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(SCORE_QUANTITIES.length > 0);
 * ```
 */
export const SCORE_QUANTITIES: readonly Quantity[] = [
  PERCENTILE,
];
