/**
 * Body size: body surface area by five published formulas and indexing to BSA.
 *
 * @module
 */
export * from "./bsa.ts";
export * from "./indexing.ts";
export { BODY_CALCULATIONS } from "./catalog.ts";
