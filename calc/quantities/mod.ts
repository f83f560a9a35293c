/**
 * The vocabulary of measured and derived quantities, each declared once, and the explicit list of
 * them that tables and models look quantities up in.
 *
 * @module
 */
import type { Quantity } from "../core/types.ts";
import { BODY_QUANTITIES } from "./body.ts";
import { STRUCTURE_QUANTITIES } from "./structure.ts";
import { FLOW_QUANTITIES } from "./flow.ts";
import { ULTRASOUND_QUANTITIES } from "./ultrasound.ts";
import { SCORE_QUANTITIES } from "./scores.ts";
import { UNCERTAINTY_QUANTITIES } from "./uncertainty.ts";

export * from "./body.ts";
export * from "./structure.ts";
export * from "./flow.ts";
export * from "./ultrasound.ts";
export * from "./scores.ts";
export * from "./uncertainty.ts";

/**
 * Every quantity the package declares, by id (family members derive further quantities from
 * these). Each quantity file lists its own; a test checks that every exported quantity is listed.
 *
 * @example
 * ```ts
 * import { HEIGHT, QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(QUANTITIES.get("height"), HEIGHT);
 * ```
 */
export const QUANTITIES: ReadonlyMap<string, Quantity> = new Map(
  [
    ...BODY_QUANTITIES,
    ...STRUCTURE_QUANTITIES,
    ...FLOW_QUANTITIES,
    ...ULTRASOUND_QUANTITIES,
    ...SCORE_QUANTITIES,
    ...UNCERTAINTY_QUANTITIES,
  ].map((q) => [q.id, q]),
);
