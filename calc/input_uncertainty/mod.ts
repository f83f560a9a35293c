/**
 * Models of where echo measurement uncertainty comes from, each returning uncertain inputs for
 * `propagate` with its published source (or "common practice, no source", or "from memory",
 * marks that reach the result and its display): caliper placement from the imaging system, the
 * insonation angle, the speed-of-sound scale, beat-to-beat variability, shared boundaries and
 * shared tracings, right-atrial pressure as a category, and the BSA formula's error.
 *
 * @module
 */
export {
  type BoundaryOrientation,
  type CaliperComponent,
  caliperDistance,
  type CaliperInput,
  type CaliperPlacement,
  caliperPlacement,
  type CaliperSettings,
  caliperTracedArea,
} from "./caliper.ts";
export {
  type AngleCosineMoments,
  angleCosineMoments,
  type InsonationAngleComparison,
  insonationAngleComparison,
  insonationAngleModel,
  type InsonationAngleModelName,
  type InsonationAngleModelOptions,
  type InsonationAngleModelRow,
} from "./insonation_angle.ts";
export {
  AT_TRUE_SOUND_SPEED,
  atTrueSoundSpeed,
  atTrueSoundSpeedChain,
  soundSpeedPower,
  soundSpeedScale,
  type TrueSoundSpeedOptions,
  trueSoundSpeedScale,
} from "./sound_speed.ts";
export { type RepeatedBeats, repeatedBeats } from "./beats.ts";
export {
  type LinearDimensionName,
  type SharedBoundaryArguments,
  type SharedBoundaryInputs,
  sharedBoundaryInputs,
  type SharedTracingInputs,
  sharedTracingInputs,
  type TracedMeasurement,
} from "./boundaries.ts";
export {
  RIGHT_ATRIAL_PRESSURE_RANGES,
  type RightAtrialPressureCategory,
  type RightAtrialPressureModel,
  type RightAtrialPressureRange,
  rightAtrialPressureRange,
} from "./right_atrial_pressure.ts";
export {
  type BsaFormulaErrorOptions,
  bsaWithFormulaError,
  withBsaFormulaError,
} from "./body_size.ts";
export type { ModelProvenance } from "./shared.ts";
export { INPUT_UNCERTAINTY_CALCULATIONS, INPUT_UNCERTAINTY_FAMILIES } from "./catalog.ts";
