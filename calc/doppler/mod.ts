/**
 * Doppler hemodynamics: Bernoulli gradients, envelopes and VTI, volumetric flow, continuity and
 * pressure-half-time valve areas, PISA and volumetric regurgitation, right-heart pressures, the
 * effect of the insonation angle with the data of its sensitivity curves, and guideline severity
 * grading (a value, Monte Carlo samples, or the normal distribution of a GUM result).
 *
 * @module
 */
export { modifiedBernoulli, simplifiedBernoulli } from "./bernoulli.ts";
export {
  type EnvelopeGradients,
  envelopeGradients,
  validateEnvelope,
  type VelocityEnvelope,
  velocityTimeIntegral,
} from "./envelope.ts";
export {
  cardiacIndex,
  cardiacOutput,
  crossSectionalArea,
  pulmonarySystemicFlowRatio,
  strokeVolume,
} from "./flow.ts";
export {
  continuityValveArea,
  continuityValveAreaPeakVelocity,
  dimensionlessIndex,
  energyLossIndex,
  indexedValveArea,
  mitralValveAreaPressureHalfTime,
  pressureHalfTimeFromDecelerationTime,
  pressureHalfTimeFromSlope,
} from "./valve_area.ts";
export {
  effectiveRegurgitantOrificeArea,
  type PisaCorrectedFlowInput,
  pisaFlowRate,
  pisaFlowRateAliasingCorrected,
  type PisaMitralAreaInput,
  pisaMitralValveArea,
  pisaRegurgitation,
  regurgitantFraction,
  regurgitantFractionPisa,
  regurgitantVolume,
  volumetricRegurgitation,
} from "./pisa.ts";
export {
  rightAtrialPressureFromIvc,
  rvSystolicPressure,
  rvSystolicPressureFromIvc,
} from "./right_heart.ts";
export { continuityValveAreaWithAngles, insonationAngleEffect } from "./angle.ts";
export {
  angleUnderestimationData,
  type AngleUnderestimationOptions,
  type AngleUnderestimationPoint,
  valveAreaDiameterErrorData,
  type ValveAreaDiameterErrorOptions,
  type ValveAreaErrorPoint,
} from "./measurement_error.ts";
export {
  AORTIC_REGURGITATION_2017,
  AORTIC_STENOSIS_2009,
  AORTIC_STENOSIS_2017,
  type AorticStenosisTables,
  GUIDELINE_SEVERITY_TABLES,
  MITRAL_REGURGITATION_2017,
  MITRAL_STENOSIS_AREA_2009,
  MITRAL_STENOSIS_MEAN_GRADIENT_2009,
  MITRAL_STENOSIS_STAGES_2014,
  MITRAL_STENOSIS_STAGES_2020,
  mitralStenosisAreaTable,
  type MitralStenosisScheme,
  PULMONARY_HYPERTENSION_2015,
  PULMONARY_HYPERTENSION_2022,
  pulmonaryHypertensionTable,
  type PulmonaryHypertensionTables,
  type RegurgitationTables,
} from "./grading_tables.ts";
export { DOPPLER_CALCULATIONS } from "./catalog.ts";
export { NISHIMURA_2014, OTTO_2020 } from "./citations.ts";
