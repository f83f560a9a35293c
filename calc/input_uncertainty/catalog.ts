/**
 * The calculations and families of the uncertainty models, registered in the package's catalog
 * (so that docs, tables and the worker pool find them).
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import type { Family } from "../core/family.ts";
import { bsaWithFormulaError } from "./body_size.ts";
import { AT_TRUE_SOUND_SPEED, soundSpeedScale } from "./sound_speed.ts";

/**
 * Every calculation of the uncertainty models, registered in the catalog.
 *
 * @example
 * ```ts
 * import { CATALOG, INPUT_UNCERTAINTY_CALCULATIONS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(INPUT_UNCERTAINTY_CALCULATIONS.every((c) => CATALOG.calculations.get(c.id) === c));
 * ```
 */
export const INPUT_UNCERTAINTY_CALCULATIONS: readonly Calculation[] = [
  bsaWithFormulaError,
  soundSpeedScale,
] as readonly Calculation[];

/**
 * Every family of the uncertainty models, registered in the catalog.
 *
 * @example
 * ```ts
 * import { CATALOG, INPUT_UNCERTAINTY_FAMILIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(INPUT_UNCERTAINTY_FAMILIES.every((f) => CATALOG.families.get(f.id) === f));
 * ```
 */
export const INPUT_UNCERTAINTY_FAMILIES: readonly Family<never>[] = [
  AT_TRUE_SOUND_SPEED,
] as unknown as readonly Family<never>[];
