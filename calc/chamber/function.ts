/**
 * Ventricular function: ejection fraction and stroke volume from volumes, RV fractional area
 * change, annular plane systolic excursions (TAPSE, MAPSE), the myocardial performance index and
 * global longitudinal strain from segment values.
 *
 * @module
 */
import { CLINICAL_CAUTION, defineCalculation, notAbove } from "../core/calculation.ts";
import type { Calculation, Citation, InputConstraint, ValidationIssue } from "../core/types.ts";
import { checkValue, quantityField } from "../core/validate.ts";
import { renderIssue, throwIfErrors } from "../core/issues.ts";
import { describeValue } from "../core/text.ts";
import {
  ANNULUS_DEPTH,
  EJECTION_FRACTION,
  EJECTION_TIME,
  FRACTIONAL_AREA_CHANGE,
  ISOVOLUMIC_CONTRACTION_TIME,
  ISOVOLUMIC_RELAXATION_TIME,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_VOLUME,
  MAPSE,
  MITRAL_ANNULAR_EXCURSION,
  MYOCARDIAL_PERFORMANCE_INDEX,
  RV_END_DIASTOLIC_AREA,
  RV_END_SYSTOLIC_AREA,
  SEGMENT_LONGITUDINAL_STRAIN,
  TAPSE,
  VALVE_CLOSURE_TO_OPENING_TIME,
} from "../quantities/structure.ts";
import { STROKE_VOLUME } from "../quantities/flow.ts";
import {
  HU_2013,
  KAUL_1984,
  LANG_2015,
  RUDSKI_2010,
  SCHILLER_1989,
  TEI_1995,
  VOIGT_2015,
} from "./citations.ts";
import type { ResultNotes } from "./types.ts";

/**
 * Percentage reduction from a diastolic to a systolic value, 100·(D − S)/D: the one place this
 * arithmetic is written (fractional shortening, ejection fraction and fractional area change call
 * it). Plain arithmetic: each calculation that calls it declares S ≤ D as a constraint, so a
 * systolic value above the diastolic one is an error naming both inputs before the formula runs.
 *
 * @param diastolic End-diastolic value (> 0).
 * @param systolic End-systolic value, same unit.
 * @returns The reduction in percent.
 *
 * @example
 * ```ts
 * import { percentReduction } from "./function.ts";
 * import assert from "node:assert/strict";
 * assert.equal(percentReduction(120, 48), 60); // 100·72/120, hand-checkable
 * ```
 */
export function percentReduction(diastolic: number, systolic: number): number {
  return (100 * (diastolic - systolic)) / diastolic;
}

/**
 * Ejection fraction and stroke volume from end-diastolic and end-systolic volumes.
 *
 * Formula: EF [%] = 100 · (EDV − ESV) / EDV; SV [mL] = EDV − ESV
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV global systolic function).
 *
 * Uncertainty: EDV and ESV traced by the same observer on the same loop share part of their
 * errors (foreshortening, gain, border convention). Pass that as a positive correlation
 * (`{ correlations: [["endDiastolicVolumeMl", "endSystolicVolumeMl", r]] }`): because ∂EF/∂EDV
 * = 100·ESV/EDV² > 0 and ∂EF/∂ESV = −100/EDV < 0, the covariance term of JCGM 100 eq. (13)
 * is negative and a positive correlation shrinks the EF uncertainty.
 *
 * @throws {RangeError} From `evaluate` when ESV exceeds EDV (the message names both volumes), or
 * a volume is outside its valid range.
 *
 * @example EDV 120 mL, ESV 48 mL → EF 60 %, SV 72 mL
 * ```ts
 * import { ejectionFraction, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(ejectionFraction, { endDiastolicVolumeMl: 120, endSystolicVolumeMl: 48 });
 * assert.equal(r.outputs.ejectionFractionPercent, 60);
 * assert.equal(r.outputs.strokeVolumeMl, 72);
 * ```
 */
export const ejectionFraction: Calculation<
  "endDiastolicVolumeMl" | "endSystolicVolumeMl",
  "ejectionFractionPercent" | "strokeVolumeMl"
> = defineCalculation({
  id: "ejectionFraction",
  title: "Ejection fraction",
  description: "Ejection fraction and stroke volume from end-diastolic and end-systolic volumes.",
  inputs: {
    endDiastolicVolumeMl: LV_END_DIASTOLIC_VOLUME,
    endSystolicVolumeMl: LV_END_SYSTOLIC_VOLUME,
  },
  outputs: {
    ejectionFractionPercent: EJECTION_FRACTION,
    strokeVolumeMl: { quantity: STROKE_VOLUME, description: "Stroke volume (EDV − ESV)" },
  },
  formula: ({ endDiastolicVolumeMl: edv, endSystolicVolumeMl: esv }) => ({
    ejectionFractionPercent: percentReduction(edv, esv),
    strokeVolumeMl: edv - esv,
  }),
  constraints: [notAbove("endSystolicVolumeMl", "endDiastolicVolumeMl")],
  formulaText: "EF = 100·(EDV − ESV)/EDV; SV = EDV − ESV",
  citations: [LANG_2015, SCHILLER_1989],
  cautions: [
    "End-systolic volume above end-diastolic volume is rejected as a measurement or labelling error",
    "Errors of EDV and ESV traced on the same loop are positively correlated; ignoring that overstates the EF uncertainty",
  ],
  clinical: true,
});

/**
 * Right-ventricular fractional area change from end-diastolic and end-systolic areas traced in
 * the RV-focused apical four-chamber view.
 *
 * Formula: FAC [%] = 100 · (EDA − ESA) / EDA
 *
 * Source: Rudski LG et al., J Am Soc Echocardiogr 2010;23:685–713; Lang RM et al. 2015 (RV
 * systolic function; FAC < 35 % abnormal).
 *
 * @throws {RangeError} From `evaluate` when ESA exceeds EDA (the message names both areas).
 *
 * @example EDA 24 cm², ESA 14 cm² → 41.67 %
 * ```ts
 * import { evaluate, fractionalAreaChange } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(fractionalAreaChange, {
 *   endDiastolicAreaCm2: 24,
 *   endSystolicAreaCm2: "1400 mm^2",
 * });
 * assert.ok(Math.abs(r.outputs.fractionalAreaChangePercent - 1000 / 24) < 1e-9);
 * ```
 */
export const fractionalAreaChange: Calculation<
  "endDiastolicAreaCm2" | "endSystolicAreaCm2",
  "fractionalAreaChangePercent"
> = defineCalculation({
  id: "fractionalAreaChange",
  title: "RV fractional area change",
  description:
    "Percentage change of the RV cavity area from end-diastole to end-systole in the apical four-chamber view.",
  inputs: {
    endDiastolicAreaCm2: RV_END_DIASTOLIC_AREA,
    endSystolicAreaCm2: RV_END_SYSTOLIC_AREA,
  },
  outputs: { fractionalAreaChangePercent: FRACTIONAL_AREA_CHANGE },
  formula: ({ endDiastolicAreaCm2, endSystolicAreaCm2 }) => ({
    fractionalAreaChangePercent: percentReduction(endDiastolicAreaCm2, endSystolicAreaCm2),
  }),
  constraints: [notAbove("endSystolicAreaCm2", "endDiastolicAreaCm2")],
  formulaText: "FAC = 100·(EDA − ESA)/EDA",
  citations: [RUDSKI_2010, LANG_2015],
  cautions: [
    "Trace the RV cavity including trabeculations and the moderator band",
    "End-systolic area above end-diastolic area is rejected as a measurement or labelling error",
  ],
  clinical: true,
});

/** Systolic excursion towards the apex from M-mode depths (apical window): the annulus is
 * deeper at end-diastole than at end-systole (each calculation declares that constraint). */
function annularExcursionMm(depthEndDiastoleMm: number, depthEndSystoleMm: number): number {
  return depthEndDiastoleMm - depthEndSystoleMm;
}

/** The M-mode depth of an annulus at one phase, as an input role. */
const annulusDepth = (site: string, phase: string) => ({
  quantity: ANNULUS_DEPTH,
  label: `${site} annulus depth at ${phase}`,
  description: `Depth of the ${site.toLowerCase()} annulus on the apical M-mode trace at ${phase}`,
});

/**
 * Tricuspid annular plane systolic excursion (TAPSE) from the M-mode depths of the lateral
 * tricuspid annulus at end-diastole and at peak systole (apical four-chamber view, cursor along
 * the annulus motion).
 *
 * Formula: TAPSE [mm] = depth(end-diastole) − depth(peak systole)
 *
 * Source: Kaul S et al., Am Heart J 1984;107:526–531; Rudski LG et al. 2010 and Lang RM et al.
 * 2015 (TAPSE < 17 mm suggests RV systolic dysfunction).
 *
 * @throws {RangeError} From `evaluate` when the annulus is deeper at systole than at diastole
 * (wrong cursor, phase or labelling; the message names both depths).
 *
 * @example Annulus at 128 mm in diastole and 106 mm in systole → 22 mm
 * ```ts
 * import { evaluate, tapse } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(tapse, { annulusDepthEndDiastoleMm: 128, annulusDepthPeakSystoleMm: "10.6 cm" });
 * assert.ok(Math.abs(r.outputs.tapseMm - 22) < 1e-12);
 * ```
 */
export const tapse: Calculation<
  "annulusDepthEndDiastoleMm" | "annulusDepthPeakSystoleMm",
  "tapseMm"
> = defineCalculation({
  id: "tapse",
  title: "Tricuspid annular plane systolic excursion (TAPSE)",
  description:
    "Longitudinal systolic excursion of the lateral tricuspid annulus towards the apex, from two M-mode depths.",
  inputs: {
    annulusDepthEndDiastoleMm: annulusDepth("Tricuspid", "end-diastole"),
    annulusDepthPeakSystoleMm: annulusDepth("Tricuspid", "peak systole"),
  },
  outputs: { tapseMm: TAPSE },
  formula: ({ annulusDepthEndDiastoleMm, annulusDepthPeakSystoleMm }) => ({
    tapseMm: annularExcursionMm(annulusDepthEndDiastoleMm, annulusDepthPeakSystoleMm),
  }),
  constraints: [notAbove("annulusDepthPeakSystoleMm", "annulusDepthEndDiastoleMm")],
  formulaText: "TAPSE = depth(ED) − depth(peak systole)",
  citations: [KAUL_1984, RUDSKI_2010, LANG_2015],
  cautions: [
    "Angle-dependent: align the M-mode cursor with the annular motion",
    "Reflects longitudinal function of the RV free wall only",
  ],
  clinical: true,
});

/**
 * Mitral annular plane systolic excursion (MAPSE): the mean of the septal and lateral annular
 * excursions, each from its M-mode depths at end-diastole and peak systole (apical four-chamber
 * view). One calculation rather than a chain: the two site excursions are the same formula on
 * two pairs of inputs, which a chain step cannot express without two copies of a step.
 *
 * Formula: e_site = depth(ED) − depth(peak systole); MAPSE [mm] = (e_septal + e_lateral) / 2
 *
 * Source: Hu K et al., Eur Heart J Cardiovasc Imaging 2013;14:205–212 (average of sites).
 *
 * @throws {RangeError} From `evaluate` when an annulus is deeper at systole than at diastole.
 *
 * @example Septal 12 mm and lateral 14 mm → 13 mm
 * ```ts
 * import { evaluate, mapse } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(mapse, {
 *   septalDepthEndDiastoleMm: 120,
 *   septalDepthPeakSystoleMm: 108,
 *   lateralDepthEndDiastoleMm: 125,
 *   lateralDepthPeakSystoleMm: 111,
 * });
 * assert.equal(r.outputs.mapseMm, 13);
 * ```
 */
export const mapse: Calculation<
  | "septalDepthEndDiastoleMm"
  | "septalDepthPeakSystoleMm"
  | "lateralDepthEndDiastoleMm"
  | "lateralDepthPeakSystoleMm",
  "septalExcursionMm" | "lateralExcursionMm" | "mapseMm"
> = defineCalculation({
  id: "mapse",
  title: "Mitral annular plane systolic excursion (MAPSE)",
  description:
    "Mean longitudinal systolic excursion of the septal and lateral mitral annulus towards the apex.",
  inputs: {
    septalDepthEndDiastoleMm: annulusDepth("Septal mitral", "end-diastole"),
    septalDepthPeakSystoleMm: annulusDepth("Septal mitral", "peak systole"),
    lateralDepthEndDiastoleMm: annulusDepth("Lateral mitral", "end-diastole"),
    lateralDepthPeakSystoleMm: annulusDepth("Lateral mitral", "peak systole"),
  },
  outputs: {
    septalExcursionMm: { quantity: MITRAL_ANNULAR_EXCURSION, label: "Septal annular excursion" },
    lateralExcursionMm: { quantity: MITRAL_ANNULAR_EXCURSION, label: "Lateral annular excursion" },
    mapseMm: MAPSE,
  },
  formula: (x) => {
    const septal = annularExcursionMm(x.septalDepthEndDiastoleMm, x.septalDepthPeakSystoleMm);
    const lateral = annularExcursionMm(x.lateralDepthEndDiastoleMm, x.lateralDepthPeakSystoleMm);
    return {
      septalExcursionMm: septal,
      lateralExcursionMm: lateral,
      mapseMm: (septal + lateral) / 2,
    };
  },
  constraints: [
    notAbove("septalDepthPeakSystoleMm", "septalDepthEndDiastoleMm"),
    notAbove("lateralDepthPeakSystoleMm", "lateralDepthEndDiastoleMm"),
  ],
  formulaText: "MAPSE = ½·[(depth ED − depth PS)septal + (depth ED − depth PS)lateral]",
  citations: [HU_2013],
  cautions: ["Angle-dependent: align the M-mode cursor with the annular motion"],
  clinical: true,
});

/**
 * Myocardial performance index (Tei index) from the isovolumic times and the ejection time.
 *
 * Formula: MPI = (IVCT + IVRT) / ET
 *
 * Source: Tei C et al., J Cardiol 1995;26:357–366; Rudski LG et al. 2010 (RV index).
 *
 * @example IVCT 60 ms, IVRT 80 ms, ET 280 ms → 0.5
 * ```ts
 * import { evaluate, myocardialPerformanceIndex } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(myocardialPerformanceIndex, {
 *   isovolumicContractionTimeMs: 60,
 *   isovolumicRelaxationTimeMs: 80,
 *   ejectionTimeMs: 280,
 * });
 * assert.equal(r.outputs.myocardialPerformanceIndex, 0.5);
 * ```
 */
export const myocardialPerformanceIndex: Calculation<
  "isovolumicContractionTimeMs" | "isovolumicRelaxationTimeMs" | "ejectionTimeMs",
  "myocardialPerformanceIndex"
> = defineCalculation({
  id: "myocardialPerformanceIndex",
  title: "Myocardial performance index (Tei)",
  description: "Isovolumic time over ejection time: a combined systolic and diastolic index.",
  inputs: {
    isovolumicContractionTimeMs: ISOVOLUMIC_CONTRACTION_TIME,
    isovolumicRelaxationTimeMs: ISOVOLUMIC_RELAXATION_TIME,
    ejectionTimeMs: EJECTION_TIME,
  },
  outputs: { myocardialPerformanceIndex: MYOCARDIAL_PERFORMANCE_INDEX },
  formula: ({ isovolumicContractionTimeMs, isovolumicRelaxationTimeMs, ejectionTimeMs }) => ({
    myocardialPerformanceIndex: (isovolumicContractionTimeMs + isovolumicRelaxationTimeMs) /
      ejectionTimeMs,
  }),
  formulaText: "MPI = (IVCT + IVRT)/ET",
  citations: [TEI_1995, RUDSKI_2010],
  cautions: [
    "Measure all intervals at similar heart rates; unreliable in irregular rhythm",
    "Unreliable when right atrial pressure is raised (the IVRT shortens)",
  ],
  clinical: true,
});

/** The closure-to-opening time includes the ejection: a ≥ b. */
const closureIncludesEjection: InputConstraint<"closureToOpeningTimeMs" | "ejectionTimeMs"> =
  notAbove("ejectionTimeMs", "closureToOpeningTimeMs");

/**
 * Myocardial performance index from the atrioventricular valve closure-to-opening time `a` and
 * the ejection time `b`. It calls {@linkcode myocardialPerformanceIndex}'s formula with
 * IVCT + IVRT = a − b rather than being a chain: the total isovolumic time a − b is not an input
 * the index takes (it takes the two times apart), so there is no step output to wire.
 *
 * Formula: MPI = (a − b) / b
 *
 * Source: Tei C et al., J Cardiol 1995;26:357–366; Rudski LG et al. 2010 (RV index, pulsed
 * Doppler and tissue Doppler methods).
 *
 * @throws {RangeError} From `evaluate` when a is shorter than b (the message names both times).
 *
 * @example a = 420 ms, b = 280 ms → 0.5
 * ```ts
 * import { evaluate, myocardialPerformanceIndexFromClosureTime } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(myocardialPerformanceIndexFromClosureTime, {
 *   closureToOpeningTimeMs: 420,
 *   ejectionTimeMs: 280,
 * });
 * assert.equal(r.outputs.myocardialPerformanceIndex, 0.5);
 * ```
 */
export const myocardialPerformanceIndexFromClosureTime: Calculation<
  "closureToOpeningTimeMs" | "ejectionTimeMs",
  "myocardialPerformanceIndex"
> = defineCalculation({
  id: "myocardialPerformanceIndexFromClosureTime",
  title: "Myocardial performance index from closure-to-opening time",
  description:
    "Tei index from the interval between atrioventricular valve closure and opening (a) and the ejection time (b).",
  inputs: {
    closureToOpeningTimeMs: VALVE_CLOSURE_TO_OPENING_TIME,
    ejectionTimeMs: EJECTION_TIME,
  },
  outputs: { myocardialPerformanceIndex: MYOCARDIAL_PERFORMANCE_INDEX },
  formula: ({ closureToOpeningTimeMs: a, ejectionTimeMs: b }) =>
    myocardialPerformanceIndex.formula({
      isovolumicContractionTimeMs: a - b,
      isovolumicRelaxationTimeMs: 0,
      ejectionTimeMs: b,
    }),
  constraints: [closureIncludesEjection],
  formulaText: "MPI = (a − b)/b",
  citations: [TEI_1995, RUDSKI_2010],
  cautions: [
    ...myocardialPerformanceIndex.cautions,
    "a shorter than b is rejected as a measurement or labelling error",
  ],
  clinical: true,
});

/**
 * Segment models accepted by {@linkcode globalLongitudinalStrain}, by segment count.
 *
 * @example
 * ```ts
 * import { globalLongitudinalStrain, STRAIN_SEGMENT_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(globalLongitudinalStrain(Array(17).fill(-20)).model, STRAIN_SEGMENT_MODELS[17]);
 * ```
 */
export const STRAIN_SEGMENT_MODELS: Readonly<Record<16 | 17 | 18, string>> = Object.freeze({
  16: "16 segments: 6 basal, 6 mid, 4 apical (no apical cap)",
  17: "17 segments: 6 basal, 6 mid, 4 apical and the apical cap",
  18: "18 segments: 6 basal, 6 mid, 6 apical (three apical views × 6 segments)",
});

/** The result of {@linkcode globalLongitudinalStrain}. */
export interface GlobalLongitudinalStrain extends ResultNotes {
  /** GLS, in % (negative for shortening). */
  readonly glsPercent: number;
  /** Number of segments averaged. */
  readonly segmentCount: 16 | 17 | 18;
  /** The segment model. */
  readonly model: string;
  /** Published sources of the definition and the segment models. */
  readonly citations: readonly Citation[];
}

const GLS_WHERE = "Global longitudinal strain";
const SEGMENTS_FIELD = "segmentPeakStrainsPercent";

/**
 * Global longitudinal strain as the mean of segmental peak systolic longitudinal strains.
 *
 * Formula: GLS [%] = (1/n) · Σ εᵢ over n = 16, 17 or 18 segments (Lang 2015 segment models).
 * Strain is negative for shortening; a more negative GLS means better function.
 *
 * Definition note: Voigt et al. 2015 define GLS from the strain of the whole myocardial line in
 * the three apical views; the mean of segment peaks is the common approximation and differs from
 * it slightly because segment peaks need not be simultaneous. Every segment value must be given:
 * a non-trackable segment must be excluded by the caller choosing a model, never silently.
 *
 * Source: Voigt JU et al., Eur Heart J Cardiovasc Imaging 2015;16:1–11; Lang RM et al., J Am
 * Soc Echocardiogr 2015;28:1–39 (segment models, GLS).
 *
 * @param segmentPeakStrainsPercent Peak systolic longitudinal strain of each segment, in %.
 * @returns GLS in %, the segment count, the model description, citations, flags and cautions.
 * @throws {TypeError} When the input is not an array of 16, 17 or 18 numbers, naming the segment.
 * @throws {RangeError} For a segment value that is not finite or outside the valid range of a
 * segment strain, naming its index.
 *
 * @example 18 segments
 * ```ts
 * import { globalLongitudinalStrain } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const s = [...Array(6).fill(-17), ...Array(6).fill(-19), ...Array(6).fill(-24)];
 * assert.equal(globalLongitudinalStrain(s).glsPercent, -20); // −360/18, hand-checkable
 * ```
 */
export function globalLongitudinalStrain(
  segmentPeakStrainsPercent: readonly number[],
): GlobalLongitudinalStrain {
  const n = Array.isArray(segmentPeakStrainsPercent) ? segmentPeakStrainsPercent.length : -1;
  if (n !== 16 && n !== 17 && n !== 18) {
    throwIfErrors([{
      kind: "type",
      severity: "error",
      where: GLS_WHERE,
      field: SEGMENTS_FIELD,
      label: `${SEGMENT_LONGITUDINAL_STRAIN.label}s`,
      received: n < 0 ? describeValue(segmentPeakStrainsPercent) : `${n} values`,
      expected: "as an array of 16, 17 or 18 values in % (one per segment of the model)",
    }]);
  }
  const field = quantityField(SEGMENT_LONGITUDINAL_STRAIN);
  const issues: ValidationIssue[] = [];
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const raw: unknown = segmentPeakStrainsPercent[i];
    const checked = checkValue(`${SEGMENTS_FIELD}[${i}]`, field, raw, { where: GLS_WHERE });
    for (const issue of checked.issues) issues.push(issue);
    sum += checked.value ?? NaN;
  }
  throwIfErrors(issues);
  const segmentCount = n as 16 | 17 | 18;
  return {
    glsPercent: sum / n,
    segmentCount,
    model: STRAIN_SEGMENT_MODELS[segmentCount],
    citations: [VOIGT_2015, LANG_2015],
    flags: issues.map(renderIssue),
    cautions: [
      "Mean of segment peaks approximates the global-trace definition; values differ between vendors and software versions",
      CLINICAL_CAUTION,
    ],
  };
}
