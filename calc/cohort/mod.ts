/**
 * Cohorts: a patient table read from CSV into typed columns, BSA, indexed values and Z-scores
 * computed columnwise, results written back as CSV with flags.
 *
 * @module
 */
export * from "./read.ts";
export * from "./compute.ts";
