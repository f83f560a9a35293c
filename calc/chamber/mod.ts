/**
 * Chamber quantification: linear LV measurements (fractional shortening, Teichholz, LV mass,
 * relative wall thickness, geometry), 2D volumes from traced contours (method of discs,
 * area–length, ejection fraction, left-atrial volume) and ventricular function (TAPSE, MAPSE,
 * fractional area change, myocardial performance index, global longitudinal strain).
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
export {
  classifyLvGeometry,
  fractionalShortening,
  LV_GEOMETRY_LIMITS,
  type LvGeometry,
  lvGeometryMeasures,
  lvGeometryProbabilities,
  type LvGeometryUncertainInputs,
  lvMassIndex,
  lvMassLinear,
  relativeWallThickness,
  type Sex,
  teichholzEjectionFraction,
  teichholzVolume,
} from "./linear.ts";
export {
  ejectionFraction,
  fractionalAreaChange,
  globalLongitudinalStrain,
  mapse,
  myocardialPerformanceIndex,
  myocardialPerformanceIndexFromClosureTime,
  percentReduction,
  STRAIN_SEGMENT_MODELS,
  tapse,
} from "./function.ts";
export {
  areaLengthVolume,
  areaLengthVolumeFromContour,
  biplaneAreaLengthVolume,
  type BiplaneContours,
  biplaneDiscVolume,
  biplaneEjectionFraction,
  type DiscOptions,
  discSummationVolume,
  type DiscVolume,
  GUIDELINE_DISC_COUNT,
  leftAtrialVolume,
  singlePlaneDiscVolume,
  type TracedView,
} from "./volumes.ts";
export { CHAMBER_CALCULATIONS } from "./catalog.ts";
