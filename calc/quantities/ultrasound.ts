/**
 * Quantities of ultrasound physics and scanner settings: transmit frequency, speed of sound,
 * depth, insonation angle, pulse repetition frequency, Doppler shift, and what is computed from
 * them (wavelength, resolution, attenuation, timing, acoustic output).
 *
 * Valid ranges are what the physics allows; typical ranges are those of diagnostic cardiac
 * ultrasound. Both are common practice, no source, unless a range says otherwise.
 *
 * @module
 */
import { defineQuantity } from "../core/quantity.ts";
import type { Quantity } from "../core/types.ts";

const NOTE = "common practice, no source";

/**
 * Transmit (carrier) frequency of the probe.
 *
 * @example
 * ```ts
 * import { TRANSMIT_FREQUENCY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(TRANSMIT_FREQUENCY.unit, "MHz");
 * ```
 */
export const TRANSMIT_FREQUENCY: Quantity = defineQuantity({
  id: "transmitFrequency",
  label: "Transmit frequency",
  symbol: "f₀",
  unit: "MHz",
  description: "Transmit (carrier) frequency of the probe",
  valid: { min: 0, max: 100, minExclusive: true },
  typical: { min: 1, max: 15 },
  resolution: 0.1,
  headers: ["frequency", "probe frequency", "f0"],
  rangeNote: NOTE,
});

/**
 * Speed of sound in the medium (the scanner assumes 1540 m/s in soft tissue).
 *
 * @example
 * ```ts
 * import { SOUND_SPEED } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(SOUND_SPEED.unit, "m/s");
 * ```
 */
export const SOUND_SPEED: Quantity = defineQuantity({
  id: "soundSpeed",
  label: "Speed of sound",
  symbol: "c",
  unit: "m/s",
  description: "Speed of sound in the medium (scanner assumption for soft tissue: 1540 m/s)",
  valid: { min: 0, max: 10000, minExclusive: true },
  typical: { min: 1400, max: 1650 },
  resolution: 1,
  headers: ["c", "sound speed"],
  rangeNote: NOTE,
});

/**
 * Depth along the beam (imaging depth, sample-volume depth, reflector depth).
 *
 * @example
 * ```ts
 * import { DEPTH } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DEPTH.unit, "cm");
 * ```
 */
export const DEPTH: Quantity = defineQuantity({
  id: "depth",
  label: "Depth",
  symbol: "d",
  unit: "cm",
  description: "Depth along the beam",
  valid: { min: 0, max: 50, minExclusive: true },
  typical: { min: 0.5, max: 30 },
  resolution: 0.1,
  headers: ["imaging depth", "sample depth"],
  rangeNote: NOTE,
});

/**
 * Insonation angle between the ultrasound beam and the flow direction (0° = parallel).
 *
 * @example
 * ```ts
 * import { INSONATION_ANGLE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(INSONATION_ANGLE.valid.maxExclusive, true);
 * ```
 */
export const INSONATION_ANGLE: Quantity = defineQuantity({
  id: "insonationAngle",
  label: "Insonation angle",
  symbol: "θ",
  unit: "deg",
  description: "Angle between the ultrasound beam and the flow direction (0° = parallel)",
  valid: { min: 0, max: 90, maxExclusive: true },
  typical: { min: 0, max: 20 },
  resolution: 1,
  headers: ["angle", "theta"],
  rangeNote: NOTE,
});

/**
 * Signed insonation angle: the beam on either side of the flow direction (0° = parallel).
 *
 * @example
 * ```ts
 * import { SIGNED_INSONATION_ANGLE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(SIGNED_INSONATION_ANGLE.valid.min, -90);
 * ```
 */
export const SIGNED_INSONATION_ANGLE: Quantity = defineQuantity({
  id: "signedInsonationAngle",
  label: "Insonation angle (signed)",
  symbol: "θ",
  unit: "deg",
  description:
    "Angle between the ultrasound beam and the flow direction, signed by the side of the beam (0° = parallel)",
  valid: { min: -90, max: 90, minExclusive: true, maxExclusive: true },
  typical: { min: -20, max: 20 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * Pulse repetition frequency.
 *
 * @example
 * ```ts
 * import { PULSE_REPETITION_FREQUENCY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(PULSE_REPETITION_FREQUENCY.symbol, "PRF");
 * ```
 */
export const PULSE_REPETITION_FREQUENCY: Quantity = defineQuantity({
  id: "pulseRepetitionFrequency",
  label: "Pulse repetition frequency",
  symbol: "PRF",
  unit: "Hz",
  description: "Pulses transmitted per second",
  valid: { min: 0, max: 1e6, minExclusive: true },
  typical: { min: 100, max: 50000 },
  resolution: 1,
  headers: ["prf"],
  rangeNote: NOTE,
});

/**
 * Doppler frequency shift (negative: flow away from the probe).
 *
 * @example
 * ```ts
 * import { DOPPLER_SHIFT } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(DOPPLER_SHIFT.unit, "Hz");
 * ```
 */
export const DOPPLER_SHIFT: Quantity = defineQuantity({
  id: "dopplerShift",
  label: "Doppler shift",
  symbol: "Δf",
  unit: "Hz",
  description: "Doppler frequency shift of the echoes (negative: flow away from the probe)",
  valid: { min: -1e6, max: 1e6 },
  typical: { min: -20000, max: 20000 },
  resolution: 1,
  rangeNote: NOTE,
});

/**
 * The ultrasound-physics quantities, listed for the package's quantity lookup.
 *
 * @example
 * ```ts
 * import { ULTRASOUND_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(ULTRASOUND_QUANTITIES.length > 0);
 * ```
 */
export const ULTRASOUND_QUANTITIES: readonly Quantity[] = [
  TRANSMIT_FREQUENCY,
  SOUND_SPEED,
  DEPTH,
  INSONATION_ANGLE,
  SIGNED_INSONATION_ANGLE,
  PULSE_REPETITION_FREQUENCY,
  DOPPLER_SHIFT,
];
