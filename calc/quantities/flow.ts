/**
 * Quantities of blood flow and hemodynamics: velocities, velocity-time integrals, gradients,
 * pressures, flows, stroke volumes and valve areas.
 *
 * Valid ranges are what blood flow can physically reach; typical ranges are those seen in
 * adult and pediatric practice. Both are common practice, no source, unless a range says
 * otherwise.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

const NOTE = "common practice, no source";

/**
 * Blood velocity along the flow direction (negative: away from the probe).
 *
 * @example
 * ```ts
 * import { BLOOD_VELOCITY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(BLOOD_VELOCITY.unit, "m/s");
 * ```
 */
export const BLOOD_VELOCITY: Quantity = defineQuantity({
  id: "bloodVelocity",
  label: "Blood velocity",
  symbol: "v",
  unit: "m/s",
  description: "Velocity of blood along the flow direction (negative: away from the probe)",
  valid: { min: -20, max: 20 },
  typical: { min: -7, max: 7 },
  resolution: 0.01,
  headers: ["velocity"],
  rangeNote: NOTE,
});

/**
 * Stroke volume: blood ejected per beat.
 *
 * @example
 * ```ts
 * import { STROKE_VOLUME } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(STROKE_VOLUME.unit, "mL");
 * ```
 */
export const STROKE_VOLUME: Quantity = defineQuantity({
  id: "strokeVolume",
  label: "Stroke volume",
  symbol: "SV",
  unit: "mL",
  description: "Volume of blood ejected per beat",
  valid: { min: 0, max: 1000 },
  typical: { min: 20, max: 150 },
  typicalPediatric: { min: 2, max: 120 },
  resolution: 1,
  headers: ["sv", "stroke vol"],
  rangeNote: NOTE,
});

/**
 * Stroke volume indexed to body surface area.
 *
 * @example
 * ```ts
 * import { STROKE_VOLUME_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(STROKE_VOLUME_INDEX.unit, "mL/m^2");
 * ```
 */
export const STROKE_VOLUME_INDEX: Quantity = defineQuantity({
  id: "strokeVolumeIndex",
  label: "Stroke volume index",
  symbol: "SVi",
  unit: "mL/m^2",
  description: "Stroke volume per m² of body surface area",
  valid: { min: 0, max: 500 },
  typical: { min: 20, max: 80 },
  resolution: 1,
  headers: ["svi"],
  rangeNote: NOTE,
});

/**
 * Cardiac output.
 *
 * @example
 * ```ts
 * import { CARDIAC_OUTPUT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CARDIAC_OUTPUT.unit, "L/min");
 * ```
 */
export const CARDIAC_OUTPUT: Quantity = defineQuantity({
  id: "cardiacOutput",
  label: "Cardiac output",
  symbol: "CO",
  unit: "L/min",
  description: "Volume of blood pumped per minute",
  valid: { min: 0, max: 40, minExclusive: true },
  typical: { min: 1, max: 15 },
  resolution: 0.1,
  headers: ["co"],
  rangeNote: NOTE,
});

/**
 * Cardiac index: cardiac output per m² of body surface area.
 *
 * @example
 * ```ts
 * import { CARDIAC_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(CARDIAC_INDEX.unit, "L/min/m^2");
 * ```
 */
export const CARDIAC_INDEX: Quantity = defineQuantity({
  id: "cardiacIndex",
  label: "Cardiac index",
  symbol: "CI",
  unit: "L/min/m^2",
  description: "Cardiac output per m² of body surface area",
  valid: { min: 0, max: 20, minExclusive: true },
  typical: { min: 1, max: 6 },
  resolution: 0.1,
  headers: ["ci"],
  rangeNote: NOTE,
});

/**
 * Aortic valve area (effective orifice area).
 *
 * @example
 * ```ts
 * import { AORTIC_VALVE_AREA } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AORTIC_VALVE_AREA.symbol, "AVA");
 * ```
 */
export const AORTIC_VALVE_AREA: Quantity = defineQuantity({
  id: "aorticValveArea",
  label: "Aortic valve area",
  symbol: "AVA",
  unit: "cm^2",
  description: "Aortic valve effective orifice area",
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.3, max: 5 },
  resolution: 0.01,
  headers: ["ava", "aortic valve area cm2"],
  rangeNote: NOTE,
});

/**
 * Aortic valve area indexed to body surface area.
 *
 * @example
 * ```ts
 * import { AORTIC_VALVE_AREA_INDEX } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(AORTIC_VALVE_AREA_INDEX.symbol, "AVAi");
 * ```
 */
export const AORTIC_VALVE_AREA_INDEX: Quantity = defineQuantity({
  id: "aorticValveAreaIndex",
  label: "Indexed aortic valve area",
  symbol: "AVAi",
  unit: "cm^2/m^2",
  description: "Aortic valve area per m² of body surface area",
  valid: { min: 0, max: 10, minExclusive: true },
  typical: { min: 0.2, max: 3 },
  resolution: 0.01,
  headers: ["avai", "ava index"],
  rangeNote: NOTE,
});

/**
 * The flow and hemodynamic quantities, listed for the package's quantity lookup (tables, models).
 *
 * @example
 * ```ts
 * import { FLOW_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(FLOW_QUANTITIES.length > 0);
 * ```
 */
export const FLOW_QUANTITIES: readonly Quantity[] = [
  BLOOD_VELOCITY,
  STROKE_VOLUME,
  STROKE_VOLUME_INDEX,
  CARDIAC_OUTPUT,
  CARDIAC_INDEX,
  AORTIC_VALVE_AREA,
  AORTIC_VALVE_AREA_INDEX,
];
