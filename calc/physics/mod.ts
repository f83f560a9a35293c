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
  nyquistVelocity,
  velocityFromDopplerShift,
} from "./doppler.ts";
export { axialResolution, wavelengthAndPeriod } from "./wave.ts";
export { lateralResolution, nearFieldLength } from "./beam.ts";
export { attenuationLoss, penetrationDepth } from "./attenuation.ts";
export { acousticImpedance, interfaceReflection } from "./impedance.ts";
export {
  frameRate,
  maximumPrfForDepth,
  type RangeAmbiguity,
  rangeAmbiguity,
  unambiguousDepthForPrf,
} from "./timing.ts";
export {
  type AliasingCheck,
  aliasingCheck,
  type AliasingCheckArguments,
  type AliasingOption,
  type AliasingRemedy,
  LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ,
  nyquistVelocityAtDepth,
} from "./aliasing.ts";
export {
  deratedPressure,
  DERATING_DB_PER_CM_MHZ,
  MECHANICAL_INDEX_LIMIT,
  mechanicalIndex,
} from "./safety.ts";
export {
  TISSUE_ACOUSTIC_PROPERTIES,
  type TissueAcousticProperties,
  type TissueName,
  tissueProperties,
} from "./tissues.ts";
export { PHYSICS_CALCULATIONS } from "./catalog.ts";
