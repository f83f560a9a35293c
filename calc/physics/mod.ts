/**
 * Ultrasound physics: the Doppler equation and angle correction, wavelength and resolution, beam
 * geometry, attenuation and penetration, impedance and reflection, pulse timing and frame rate,
 * Nyquist limit and aliasing advice, range ambiguity, mechanical index, and a table of tissue
 * acoustic properties.
 *
 * @module
 */
export { DEFAULT_SOUND_SPEED_MPS } from "./shared.ts";
export {
  angleCorrectedVelocity,
  dopplerShiftFromVelocity,
  velocityFromDopplerShift,
} from "./doppler.ts";
