/**
 * The Doppler hemodynamics calculations this domain registers in the package's catalog. A calculation
 * of this domain is registered by adding it here.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { continuityValveAreaWithAngles, insonationAngleEffect } from "./angle.ts";
import { modifiedBernoulli, simplifiedBernoulli } from "./bernoulli.ts";
import {
  cardiacIndex,
  cardiacOutput,
  crossSectionalArea,
  pulmonarySystemicFlowRatio,
  strokeVolume,
} from "./flow.ts";
import {
  effectiveRegurgitantOrificeArea,
  pisaFlowRate,
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
  indexedValveArea,
  mitralValveAreaPressureHalfTime,
  pressureHalfTimeFromDecelerationTime,
  pressureHalfTimeFromSlope,
} from "./valve_area.ts";

/**
 * Every Doppler hemodynamics calculation, registered in the catalog.
 *
 * @example
 * ```ts
 * import { DOPPLER_CALCULATIONS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(DOPPLER_CALCULATIONS.length > 0);
 * ```
 */
export const DOPPLER_CALCULATIONS: readonly Calculation[] = [
  cardiacIndex,
  cardiacOutput,
  continuityValveArea,
  continuityValveAreaPeakVelocity,
  continuityValveAreaWithAngles,
  crossSectionalArea,
  dimensionlessIndex,
  effectiveRegurgitantOrificeArea,
  indexedValveArea,
  insonationAngleEffect,
  mitralValveAreaPressureHalfTime,
  modifiedBernoulli,
  pisaFlowRate,
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
