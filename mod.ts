/**
 * sonorigor: quantitative echocardiography with honest error bars.
 *
 * Quantities are declared once ({@linkcode defineQuantity}); calculations are defined once from
 * them ({@linkcode defineCalculation}) and from that definition are evaluated with validated,
 * unit-aware inputs, propagated by the GUM law or Monte Carlo ({@linkcode propagate}) with
 * results that chain, run over tables, swept into sensitivity curves, documented and displayed.
 * Charts live behind the separate `./plot` entry point.
 *
 * @module
 */
export * from "./calc/core/mod.ts";
export * from "./display/mod.ts";
export * from "./calc/uncertainty/mod.ts";
export * from "./calc/physics/mod.ts";
export * from "./calc/stats/mod.ts";
export * from "./calc/body/mod.ts";
export * from "./calc/reference/mod.ts";
export * from "./calc/chamber/mod.ts";
export * from "./calc/doppler/mod.ts";
export * from "./calc/grading/mod.ts";
export * from "./calc/agreement/mod.ts";
export * from "./calc/quantities/mod.ts";
export * from "./calc/table/mod.ts";
export * from "./calc/catalog.ts";
export * from "./calc/input_uncertainty/mod.ts";
