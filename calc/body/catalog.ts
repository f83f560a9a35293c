/**
 * The body size calculations this domain registers in the package's catalog. A calculation
 * of this domain is registered by adding it here.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { bsaBoyd, bsaDuBois, bsaGehanGeorge, bsaHaycock, bsaMosteller } from "./bsa.ts";

/**
 * Every body size calculation, registered in the catalog.
 *
 * @example
 * ```ts
 * import { BODY_CALCULATIONS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(BODY_CALCULATIONS.length > 0);
 * ```
 */
export const BODY_CALCULATIONS: readonly Calculation[] = [
  bsaBoyd,
  bsaDuBois,
  bsaGehanGeorge,
  bsaHaycock,
  bsaMosteller,
] as readonly Calculation[];
