/**
 * Helpers shared by the Doppler tests.
 *
 * @module
 */

export { close } from "../close.ts";

/** Radians per degree. */
export const DEG = Math.PI / 180;
