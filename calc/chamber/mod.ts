/**
 * Chamber quantification: linear LV measurements (fractional shortening, Teichholz, LV mass,
 * relative wall thickness), LV geometry (classification and class probabilities), 2D volumes from
 * traced contours (method of discs, area–length, ejection fraction, left-atrial volume) and
 * ventricular function (TAPSE, MAPSE, fractional area change, myocardial performance index,
 * global longitudinal strain).
 *
 * @module
 */
export {
  type AxisFrame,
  type Contour,
  contourArea,
  contourAxisFrame,
  type ContourCoordinates,
  contourDiscChords,
  contourLongAxis,
  type ContourPoint,
  type DiscChord,
  discDiameters,
  type LongAxis,
  validateContour,
} from "./contour.ts";
export { type DiscMethodData, discMethodData, type DiscMethodRow } from "./disc_drawing.ts";
export {
  fractionalShortening,
  lvGeometryMeasures,
  lvMassIndex,
  lvMassLinear,
  relativeWallThickness,
  teichholzEjectionFraction,
  teichholzVolume,
  teichholzVolumes,
} from "./linear.ts";
export {
  classifyLvGeometry,
  LV_GEOMETRY_LIMITS,
  lvGeometryProbabilities,
  type LvGeometryProbabilityOptions,
  type LvGeometryUncertainInputs,
} from "./geometry.ts";
export type {
  LvGeometry,
  LvGeometryClassification,
  LvGeometryInput,
  LvGeometryLimit,
  LvGeometryLimits,
  LvGeometryOutput,
  LvGeometryProbabilities,
  ResultNotes,
  Sex,
} from "./types.ts";
export {
  ejectionFraction,
  fractionalAreaChange,
  type GlobalLongitudinalStrain,
  globalLongitudinalStrain,
  mapse,
  myocardialPerformanceIndex,
  myocardialPerformanceIndexFromClosureTime,
  STRAIN_SEGMENT_MODELS,
  tapse,
} from "./function.ts";
export {
  areaLengthVolume,
  areaLengthVolumeFromContour,
  biplaneAreaLengthVolume,
  type BiplaneContours,
  biplaneDiscVolume,
  type BiplaneEjectionFraction,
  biplaneEjectionFraction,
  type ContourAreaLengthVolume,
  type DiscOptions,
  discSummationVolume,
  type DiscVolume,
  GUIDELINE_DISC_COUNT,
  type LeftAtrialVolume,
  leftAtrialVolume,
  singlePlaneDiscVolume,
  type TracedView,
} from "./volumes.ts";
export { CHAMBER_CALCULATIONS } from "./catalog.ts";
