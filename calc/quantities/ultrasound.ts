/**
 * Quantities of ultrasound physics and scanner settings: transmit frequency, speed of sound,
 * depth, insonation angle, pulse repetition frequency, Doppler shift, and what is computed from
 * them (wavelength, resolution, attenuation, timing, acoustic output).
 *
 * @module
 */
import type { Quantity } from "../core/types.ts";

/**
 * The ultrasound-physics quantities, listed for the package's quantity lookup.
 *
 * @example
 * ```ts
 * import { ULTRASOUND_QUANTITIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(Array.isArray(ULTRASOUND_QUANTITIES));
 * ```
 */
export const ULTRASOUND_QUANTITIES: readonly Quantity[] = [];
