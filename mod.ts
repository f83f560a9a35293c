/**
 * sonorigor: quantitative echocardiography with honest error bars.
 *
 * Calculations are defined once ({@linkcode defineCalculation}) and from that definition are
 * evaluated with validated, unit-aware inputs, propagated with the GUM law or Monte Carlo, swept
 * into sensitivity curves and documented. Charts live behind the separate `./plot` entry point.
 *
 * @module
 */
export * from "./calc/core/mod.ts";
export * from "./calc/uncertainty/mod.ts";
export * from "./calc/physics/mod.ts";
export * from "./calc/stats/mod.ts";
export * from "./calc/body/mod.ts";
export * from "./calc/reference/mod.ts";
export * from "./calc/chamber/mod.ts";
export * from "./calc/doppler/mod.ts";
export * from "./calc/agreement/mod.ts";
export * from "./calc/cohort/mod.ts";
