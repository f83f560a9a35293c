/**
 * The package's catalog: every calculation, family and quantity registered explicitly. Each
 * domain lists its calculations in its own catalog.ts; reference docs, the worker pool and tables
 * resolve calculations here.
 *
 * @module
 */
import { type Catalog, defineCatalog } from "./core/catalog.ts";
import type { Family } from "./core/family.ts";
import { QUANTITIES } from "./quantities/mod.ts";
import { PHYSICS_CALCULATIONS } from "./physics/catalog.ts";
import { DOPPLER_CALCULATIONS } from "./doppler/catalog.ts";
import { CHAMBER_CALCULATIONS } from "./chamber/catalog.ts";
import { BODY_CALCULATIONS } from "./body/catalog.ts";
import { INDEXED_TO_BSA } from "./body/indexing.ts";
import { Z_SCORE } from "./reference/zscore.ts";
import {
  INPUT_UNCERTAINTY_CALCULATIONS,
  INPUT_UNCERTAINTY_FAMILIES,
} from "./input_uncertainty/catalog.ts";

/**
 * Every calculation, family and quantity of the package.
 *
 * @example
 * ```ts
 * import { CATALOG, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CATALOG.calculations.get("simplifiedBernoulli"), simplifiedBernoulli);
 * assert.ok(CATALOG.families.has("zScore"));
 * ```
 */
export const CATALOG: Catalog = defineCatalog({
  calculations: [
    ...PHYSICS_CALCULATIONS,
    ...DOPPLER_CALCULATIONS,
    ...CHAMBER_CALCULATIONS,
    ...BODY_CALCULATIONS,
    ...INPUT_UNCERTAINTY_CALCULATIONS,
  ],
  families: [INDEXED_TO_BSA, Z_SCORE, ...INPUT_UNCERTAINTY_FAMILIES] as Family<never>[],
  quantities: [...QUANTITIES.values()],
});
