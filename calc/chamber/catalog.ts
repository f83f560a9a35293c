/**
 * The chamber quantification calculations this domain registers in the package's catalog. A
 * calculation of this domain is registered by adding it here; the chains (Teichholz EF, LV mass
 * index, LV geometry measures) are registered with every step they are made of, so a worker can
 * make them again from their recipe.
 *
 * @module
 */
import type { Calculation } from "../core/types.ts";
import {
  ejectionFraction,
  fractionalAreaChange,
  mapse,
  myocardialPerformanceIndex,
  myocardialPerformanceIndexFromClosureTime,
  tapse,
} from "./function.ts";
import {
  fractionalShortening,
  lvGeometryMeasures,
  lvMassIndex,
  lvMassLinear,
  relativeWallThickness,
  teichholzEjectionFraction,
  teichholzVolume,
  teichholzVolumes,
} from "./linear.ts";
import { areaLengthVolume, biplaneAreaLengthVolume, discSummationVolume } from "./volumes.ts";

/**
 * Every chamber quantification calculation, registered in the catalog.
 *
 * @example
 * ```ts
 * import { CHAMBER_CALCULATIONS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(CHAMBER_CALCULATIONS.some((c) => c.id === "teichholzEjectionFraction"));
 * ```
 */
export const CHAMBER_CALCULATIONS: readonly Calculation[] = [
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
  teichholzVolumes,
] as readonly Calculation[];
