/**
 * Ultrasound physics: the Doppler equation and angle correction, wavelength and resolution, beam
 * geometry, attenuation and penetration, impedance and reflection, pulse timing and frame rate,
 * Nyquist limit and aliasing advice, range ambiguity, mechanical index, a table of tissue
 * acoustic properties, and the data of the physics trade-off charts.
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
export {
  attenuationLoss,
  penetrationDepth,
  SOFT_TISSUE_ATTENUATION_DB_PER_CM_MHZ,
} from "./attenuation.ts";
export { acousticImpedance, interfaceReflection } from "./impedance.ts";
export { frameRate, maximumPrfForDepth, unambiguousDepthForPrf } from "./timing.ts";
export { rangeAmbiguity } from "./range_ambiguity.ts";
export {
  aliasingCheck,
  type AliasingCheckArguments,
  LOWEST_CARDIAC_TRANSMIT_FREQUENCY_MHZ,
  nyquistVelocityAtDepth,
} from "./aliasing.ts";
export type {
  AliasingArgument,
  AliasingCheck,
  AliasingOption,
  AliasingRemedy,
  AliasingSetting,
  CheckedArguments,
  CheckedResult,
  RangeAmbiguity,
  RangeAmbiguityArgument,
} from "./types.ts";
export {
  type NyquistDepthOptions,
  type NyquistDepthRow,
  nyquistDepthRows,
  readVelocityOfInterest,
  type ResolutionPenetrationOptions,
  type ResolutionPenetrationRow,
  resolutionPenetrationRows,
} from "./curves.ts";
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
