/**
 * Distribution functions shared by the uncertainty engine and the agreement statistics.
 *
 * @module
 */
export * from "./distributions.ts";
export { quantileByInversion } from "./invert.ts";
