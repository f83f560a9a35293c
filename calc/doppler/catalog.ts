/**
 * The Doppler hemodynamics calculations this domain registers in the package's catalog. A calculation
 * of this domain is registered by adding it here. The cardiac index and the indexed valve area are
 * members of the indexing family (`indexedToBsa`), registered with the family.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { continuityValveAreaWithAngles, insonationAngleEffect } from "./angle.ts";
import { modifiedBernoulli, simplifiedBernoulli } from "./bernoulli.ts";
import {
  cardiacOutput,
  crossSectionalArea,
  pulmonarySystemicFlowRatio,
  strokeVolume,
} from "./flow.ts";
import {
  effectiveRegurgitantOrificeArea,
  pisaFlowRate,
  pisaFlowRateAliasingCorrected,
  pisaMitralValveArea,
  pisaRegurgitation,
  regurgitantFraction,
  regurgitantFractionPisa,
  regurgitantVolume,
  volumetricRegurgitation,
} from "./pisa.ts";
import {
  rightAtrialPressureFromIvc,
  rvSystolicPressure,
  rvSystolicPressureFromIvc,
} from "./right_heart.ts";
import {
  continuityValveArea,
  continuityValveAreaPeakVelocity,
  dimensionlessIndex,
  energyLossIndex,
  mitralValveAreaPressureHalfTime,
  pressureHalfTimeFromDecelerationTime,
  pressureHalfTimeFromSlope,
} from "./valve_area.ts";

/**
 * Every Doppler hemodynamics calculation, registered in the catalog.
 *
 * @example
 * ```ts
 * import { DOPPLER_CALCULATIONS, pisaRegurgitation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // the PISA chain is registered under its own id, and rebuilt in a worker from its steps
 * assert.ok(DOPPLER_CALCULATIONS.includes(pisaRegurgitation));
 * assert.equal(pisaRegurgitation.recipe.kind, "chain");
 * ```
 */
export const DOPPLER_CALCULATIONS: readonly Calculation[] = [
  cardiacOutput,
  continuityValveArea,
  continuityValveAreaPeakVelocity,
  continuityValveAreaWithAngles,
  crossSectionalArea,
  dimensionlessIndex,
  effectiveRegurgitantOrificeArea,
  energyLossIndex,
  insonationAngleEffect,
  mitralValveAreaPressureHalfTime,
  modifiedBernoulli,
  pisaFlowRate,
  pisaFlowRateAliasingCorrected,
  pisaMitralValveArea,
  pisaRegurgitation,
  pressureHalfTimeFromDecelerationTime,
  pressureHalfTimeFromSlope,
  pulmonarySystemicFlowRatio,
  regurgitantFraction,
  regurgitantFractionPisa,
  regurgitantVolume,
  rightAtrialPressureFromIvc,
  rvSystolicPressure,
  rvSystolicPressureFromIvc,
  simplifiedBernoulli,
  strokeVolume,
  volumetricRegurgitation,
] as readonly Calculation[];
