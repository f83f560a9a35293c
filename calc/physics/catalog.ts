/**
 * The ultrasound physics calculations this domain registers in the package's catalog. A calculation
 * of this domain is registered by adding it here.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import { nyquistVelocityAtDepth } from "./aliasing.ts";
import { attenuationLoss, penetrationDepth } from "./attenuation.ts";
import { lateralResolution, nearFieldLength } from "./beam.ts";
import {
  angleCorrectedVelocity,
  dopplerShiftFromVelocity,
  nyquistVelocity,
  velocityFromDopplerShift,
} from "./doppler.ts";
import { acousticImpedance, interfaceReflection } from "./impedance.ts";
import { deratedPressure, mechanicalIndex } from "./safety.ts";
import { frameRate, maximumPrfForDepth, unambiguousDepthForPrf } from "./timing.ts";
import { axialResolution, wavelengthAndPeriod } from "./wave.ts";

/**
 * Every ultrasound physics calculation, registered in the catalog.
 *
 * @example
 * ```ts
 * import { CATALOG, nyquistVelocityAtDepth, PHYSICS_CALCULATIONS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // the Nyquist limit at a depth is a chain, registered under its own id like the others
 * assert.ok(PHYSICS_CALCULATIONS.includes(nyquistVelocityAtDepth));
 * assert.equal(CATALOG.calculations.get("nyquistVelocityAtDepth"), nyquistVelocityAtDepth);
 * ```
 */
export const PHYSICS_CALCULATIONS: readonly Calculation[] = [
  acousticImpedance,
  angleCorrectedVelocity,
  attenuationLoss,
  axialResolution,
  deratedPressure,
  dopplerShiftFromVelocity,
  frameRate,
  interfaceReflection,
  lateralResolution,
  maximumPrfForDepth,
  mechanicalIndex,
  nearFieldLength,
  nyquistVelocity,
  nyquistVelocityAtDepth,
  penetrationDepth,
  unambiguousDepthForPrf,
  velocityFromDopplerShift,
  wavelengthAndPeriod,
] as readonly Calculation[];
