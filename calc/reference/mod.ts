/**
 * Reference ranges: adult limits (2015 ASE/EACVI) and pediatric Z-score models.
 *
 * @module
 */
export * from "./adult.ts";
export * from "./zscore_models.ts";
export * from "./zscore.ts";
