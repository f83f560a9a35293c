/**
 * Reference ranges: adult limits (2015 ASE/EACVI) and pediatric Z-score models.
 *
 * @module
 */
export * from "./adult.ts";
export * from "./zscore.ts";
export * from "./zscore_uncertainty.ts";
