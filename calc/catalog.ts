/**
 * The package's catalog: every calculation, family and quantity registered explicitly, one list
 * per domain. Reference docs, the worker pool and tables resolve calculations here; a new
 * calculation is registered by adding it to its domain's list.
 *
 * @module
 */
import { type Catalog, defineCatalog } from "./core/catalog.ts";
import type { Family } from "./core/family.ts";
import { QUANTITIES } from "./quantities/mod.ts";
import {
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
} from "./physics/mod.ts";
import {
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
} from "./doppler/mod.ts";
import {
  areaLengthVolume,
  biplaneAreaLengthVolume,
  discSummationVolume,
  ejectionFraction,
  fractionalAreaChange,
  fractionalShortening,
  lvGeometryMeasures,
  lvMassIndex,
  lvMassLinear,
  mapse,
  myocardialPerformanceIndex,
  myocardialPerformanceIndexFromClosureTime,
  relativeWallThickness,
  tapse,
  teichholzEjectionFraction,
  teichholzVolume,
} from "./chamber/mod.ts";
import { bsaBoyd, bsaDuBois, bsaGehanGeorge, bsaHaycock, bsaMosteller } from "./body/mod.ts";
import { INDEXED_TO_BSA } from "./body/mod.ts";
import { Z_SCORE } from "./reference/mod.ts";

/**
 * Every calculation, family and quantity of the package.
 *
 * @example
 * ```ts
 * import { CATALOG, simplifiedBernoulli } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CATALOG.calculations.get("simplifiedBernoulli"), simplifiedBernoulli);
 * assert.ok(CATALOG.families.has("zScore"));
 * ```
 */
export const CATALOG: Catalog = defineCatalog({
  calculations: [
    // physics
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
    // doppler
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
    // chamber
    areaLengthVolume,
    biplaneAreaLengthVolume,
    discSummationVolume,
    ejectionFraction,
    fractionalAreaChange,
    fractionalShortening,
    lvGeometryMeasures,
    lvMassIndex,
    lvMassLinear,
    mapse,
    myocardialPerformanceIndex,
    myocardialPerformanceIndexFromClosureTime,
    relativeWallThickness,
    tapse,
    teichholzEjectionFraction,
    teichholzVolume,
    // body
    bsaBoyd,
    bsaDuBois,
    bsaGehanGeorge,
    bsaHaycock,
    bsaMosteller,
  ],
  families: [INDEXED_TO_BSA, Z_SCORE] as Family<never>[],
  quantities: [...QUANTITIES.values()],
});
