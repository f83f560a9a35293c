/**
 * Pediatric Z-score models as data: the model forms, the validation of a model given as data, and
 * the PHN 2017 models.
 *
 * A Z-score model reduces to three functions of BSA: a transform T(X, BSA), a mean μ(BSA) and a
 * standard deviation σ(BSA) of the transformed measurement, so that Z = (T(X, BSA) − μ) / σ and
 * X = T⁻¹(μ + Z·σ, BSA). Each form fills these in from its coefficients; a new published model of
 * an existing form is added as data, a new form by one entry in {@linkcode ZSCORE_FORMS}.
 *
 * @module
 */
import type { Citation, ValueRange } from "../core/types.ts";
import { isFormulaOnlyWorker } from "../core/units.ts";
import type { BsaMethod } from "../body/bsa.ts";

/** Fields shared by every Z-score model. */
export interface ZScoreModelBase {
  /** Stable identifier, e.g. "phn2017.lvEndDiastolicDimension". */
  readonly id: string;
  /** Id of the quantity measured, when it is one of the package's quantities (then its label,
   * unit and valid range are the quantity's). */
  readonly quantity?: string;
  /** What is measured, in words a practitioner reads without a glossary. */
  readonly measurement: string;
  /** Unit of the raw measurement X (mathjs unit string: "cm", "mL", "g"). */
  readonly unit: string;
  /** The BSA formula the model was built with. */
  readonly bsaMethod: BsaMethod;
  /** BSA range (m²) of the population the model was built on; outside it Z is flagged. */
  readonly bsaRange: ValueRange;
  /** Where the BSA range comes from (and how sure we are of it). */
  readonly bsaRangeNote: string;
  /** Valid domain of the raw measurement in `unit` (outside → RangeError). */
  readonly measurementRange: ValueRange;
  /** Published source of the model. */
  readonly source: Citation;
  /** How the coefficients reached this table (transcription, memory, synthetic). */
  readonly provenance: string;
  /** True for synthetic models used only in tests and demos; never published coefficients. */
  readonly synthetic?: boolean;
}

/**
 * Allometric index with constant SD (the PHN 2017 form):
 * Z = (X / BSA^α − M) / S.
 */
export interface AllometricConstantSdModel extends ZScoreModelBase {
  /** Model form. */
  readonly form: "allometricConstantSd";
  /** Exponent α of BSA. */
  readonly alpha: number;
  /** Mean M of X / BSA^α. */
  readonly mean: number;
  /** Standard deviation S of X / BSA^α (> 0). */
  readonly sd: number;
}

/**
 * Log-normal model with mean and SD polynomial in BSA:
 * Z = (ln X − Σ aᵢ·BSAⁱ) / Σ sᵢ·BSAⁱ (X in `unit`; a single SD coefficient means constant SD).
 */
export interface LogPolynomialBsaModel extends ZScoreModelBase {
  /** Model form. */
  readonly form: "logPolynomialBsa";
  /** a₀, a₁, … of the mean of ln X. */
  readonly meanCoefficients: readonly number[];
  /** s₀, s₁, … of the SD of ln X. */
  readonly sdCoefficients: readonly number[];
}

/**
 * Allometric mean with modelled (heteroscedastic) SD:
 * Z = (X − a·BSA^b) / (c·BSA^d).
 */
export interface AllometricModelledSdModel extends ZScoreModelBase {
  /** Model form. */
  readonly form: "allometricModelledSd";
  /** a of the mean a·BSA^b. */
  readonly meanScale: number;
  /** b of the mean a·BSA^b. */
  readonly meanExponent: number;
  /** c of the SD c·BSA^d. */
  readonly sdScale: number;
  /** d of the SD c·BSA^d. */
  readonly sdExponent: number;
}

/** Any Z-score model. */
export type ZScoreModel =
  | AllometricConstantSdModel
  | LogPolynomialBsaModel
  | AllometricModelledSdModel;

/** The names of the model families. */
export type ZScoreFormName = ZScoreModel["form"];

/** The three functions a model form provides (all pure, allocation-free). */
export interface ZScoreForm<M extends ZScoreModel = ZScoreModel> {
  /** Formula in words for docs. */
  readonly formulaText: string;
  /** T(X, BSA): the transformed measurement. */
  transform(model: M, x: number, bsa: number): number;
  /** T⁻¹(y, BSA): the measurement from a transformed value. */
  inverse(model: M, y: number, bsa: number): number;
  /** μ(BSA): mean of the transformed measurement. */
  mean(model: M, bsa: number): number;
  /** σ(BSA): SD of the transformed measurement. */
  sd(model: M, bsa: number): number;
}

function polynomial(coefficients: readonly number[], x: number): number {
  let sum = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) sum = sum * x + coefficients[i]!;
  return sum;
}

/**
 * The Z-score model forms, keyed by name. Adding a form is adding one entry here (and its
 * model type to {@linkcode ZScoreModel}); adding a model is adding data.
 *
 * @example
 * ```ts
 * import { ZSCORE_FORMS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(Object.keys(ZSCORE_FORMS), [
 *   "allometricConstantSd", "logPolynomialBsa", "allometricModelledSd",
 * ]);
 * ```
 */
export const ZSCORE_FORMS: {
  readonly allometricConstantSd: ZScoreForm<AllometricConstantSdModel>;
  readonly logPolynomialBsa: ZScoreForm<LogPolynomialBsaModel>;
  readonly allometricModelledSd: ZScoreForm<AllometricModelledSdModel>;
} = Object.freeze({
  allometricConstantSd: {
    formulaText: "Z = (X / BSA^α − M) / S",
    transform: (m, x, bsa) => x / bsa ** m.alpha,
    inverse: (m, y, bsa) => y * bsa ** m.alpha,
    mean: (m) => m.mean,
    sd: (m) => m.sd,
  },
  logPolynomialBsa: {
    formulaText: "Z = (ln X − Σ aᵢ·BSAⁱ) / Σ sᵢ·BSAⁱ",
    transform: (_m, x) => Math.log(x),
    inverse: (_m, y) => Math.exp(y),
    mean: (m, bsa) => polynomial(m.meanCoefficients, bsa),
    sd: (m, bsa) => polynomial(m.sdCoefficients, bsa),
  },
  allometricModelledSd: {
    formulaText: "Z = (X − a·BSA^b) / (c·BSA^d)",
    transform: (_m, x) => x,
    inverse: (_m, y) => y,
    mean: (m, bsa) => m.meanScale * bsa ** m.meanExponent,
    sd: (m, bsa) => m.sdScale * bsa ** m.sdExponent,
  },
});

function formOf(model: ZScoreModel): ZScoreForm {
  return ZSCORE_FORMS[model.form] as ZScoreForm;
}

/**
 * The Z-score of a measurement for a model: the one Z formula (no validation; used by the
 * calculations below, by cohorts and by charts).
 *
 * Formula: Z = (T(X, BSA) − μ(BSA)) / σ(BSA), per model form (see {@linkcode ZSCORE_FORMS}).
 *
 * @param model The model.
 * @param measurement X in the model's unit.
 * @param bsaM2 BSA in m² by the model's BSA method.
 * @returns Z (NaN only if an input is NaN: validate before calling).
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS, zScoreFormula } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // PHN form: X = M·BSA^α gives Z = 0 (hand-checkable: 3.89 · 1^0.45 = 3.89 cm)
 * assert.equal(zScoreFormula(PHN_2017_MODELS.lvEndDiastolicDimension, 3.89, 1), 0);
 * ```
 */
export function zScoreFormula(model: ZScoreModel, measurement: number, bsaM2: number): number {
  const f = formOf(model);
  return (f.transform(model, measurement, bsaM2) - f.mean(model, bsaM2)) / f.sd(model, bsaM2);
}

/**
 * The measurement at a given Z for a model: the inverse of {@linkcode zScoreFormula}.
 *
 * Formula: X = T⁻¹(μ(BSA) + Z·σ(BSA), BSA); for PHN: X = (M + Z·S)·BSA^α.
 *
 * @param model The model.
 * @param zScore Z.
 * @param bsaM2 BSA in m².
 * @returns X in the model's unit (no validation).
 *
 * @example
 * ```ts
 * import { measurementFormula, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // PHN aortic annulus at BSA 1 m²: (1.48 + 2·0.14)·1^0.5 = 1.76 cm
 * const x = measurementFormula(PHN_2017_MODELS.aorticAnnulus, 2, 1);
 * assert.ok(Math.abs(x - 1.76) < 1e-12);
 * ```
 */
export function measurementFormula(model: ZScoreModel, zScore: number, bsaM2: number): number {
  const f = formOf(model);
  return f.inverse(model, f.mean(model, bsaM2) + zScore * f.sd(model, bsaM2), bsaM2);
}

// ---------------------------------------------------------------------------------------------
// Model definition (validated data)

/** The data shape of a model, by form (zod). */
function modelSchemaOf(z: typeof import("zod")) {
  const rangeSchema = z.object({
    min: z.number(),
    max: z.number(),
    minExclusive: z.boolean().optional(),
    maxExclusive: z.boolean().optional(),
  }).refine((r) => r.min <= r.max, "expected min <= max");

  const baseShape = {
    id: z.string().min(1),
    quantity: z.string().min(1).optional(),
    measurement: z.string().min(1),
    unit: z.string().min(1),
    bsaMethod: z.enum(["mosteller", "duBois", "haycock", "gehanGeorge", "boyd"]),
    bsaRange: rangeSchema,
    bsaRangeNote: z.string(),
    measurementRange: rangeSchema,
    source: z.object({
      authors: z.string(),
      year: z.number(),
      title: z.string(),
      publication: z.string(),
      locator: z.string().optional(),
      doi: z.string().optional(),
    }),
    provenance: z.string().min(1),
    synthetic: z.boolean().optional(),
  };
  const finite = z.number().refine(Number.isFinite, "expected a finite number");
  const positive = z.number().refine(
    (v) => v > 0 && Number.isFinite(v),
    "expected a finite number > 0",
  );

  return z.discriminatedUnion("form", [
    z.object({
      ...baseShape,
      form: z.literal("allometricConstantSd"),
      alpha: finite,
      mean: finite,
      sd: positive,
    }),
    z.object({
      ...baseShape,
      form: z.literal("logPolynomialBsa"),
      meanCoefficients: z.array(finite).min(1),
      sdCoefficients: z.array(finite).min(1),
    }),
    z.object({
      ...baseShape,
      form: z.literal("allometricModelledSd"),
      meanScale: positive,
      meanExponent: finite,
      sdScale: positive,
      sdExponent: finite,
    }),
  ]);
}

/**
 * The schema that checks model data; null in a Monte Carlo worker, which does not load zod (about
 * 7 MB per worker): a model reaches a worker's run only through a calculation whose fingerprint
 * equals the caller's, and the caller's copy of that model passed this check on the main thread.
 */
const modelSchema = isFormulaOnlyWorker() ? null : modelSchemaOf(await import("zod"));

/**
 * Validates and freezes a Z-score model given as data. Use it to add a published model (or a
 * clearly labelled synthetic one for tests) without touching code.
 *
 * @param model The model data.
 * @returns The same data, frozen.
 * @throws {TypeError} Naming the field when the data do not match the form's shape (unknown
 * form, missing or non-finite coefficient, SD ≤ 0, empty range).
 * @throws {RangeError} When the SD is not positive across the model's BSA range.
 *
 * @example
 * ```ts
 * import { defineZScoreModel, zScoreFormula } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // A SYNTHETIC model (invented numbers) showing the data shape of a log-polynomial form
 * const model = defineZScoreModel({
 *   id: "synthetic.demo", measurement: "Demo diameter", unit: "cm", bsaMethod: "haycock",
 *   bsaRange: { min: 0.2, max: 2 }, bsaRangeNote: "synthetic",
 *   measurementRange: { min: 0, max: 10, minExclusive: true },
 *   source: { authors: "none", year: 2026, title: "Synthetic test model", publication: "none" },
 *   provenance: "synthetic: invented for this example", synthetic: true,
 *   form: "logPolynomialBsa", meanCoefficients: [0, 0.5], sdCoefficients: [0.1],
 * });
 * // ln X = 0.5 at BSA 1 → X = e^0.5 gives Z = 0
 * assert.ok(Math.abs(zScoreFormula(model, Math.exp(0.5), 1)) < 1e-12);
 * ```
 */
export function defineZScoreModel<M extends ZScoreModel>(model: M): M {
  const parsed = modelSchema?.safeParse(model);
  if (parsed && !parsed.success) {
    const issue = parsed.error.issues[0]!;
    const path = issue.path.join(".");
    let value: unknown = model;
    for (const key of issue.path) {
      value = typeof value === "object" && value !== null
        ? (value as Record<PropertyKey, unknown>)[key as PropertyKey]
        : undefined;
    }
    const id = typeof (model as { id?: unknown })?.id === "string"
      ? (model as { id: string }).id
      : "?";
    throw new TypeError(
      `Z-score model '${id}': field '${path}' ${issue.message.toLowerCase()}, got ${
        JSON.stringify(value) ?? "undefined"
      }`,
    );
  }
  const f = formOf(model);
  for (
    const bsa of [
      model.bsaRange.min,
      (model.bsaRange.min + model.bsaRange.max) / 2,
      model.bsaRange.max,
    ]
  ) {
    if (bsa > 0 && !(f.sd(model, bsa) > 0)) {
      throw new RangeError(
        `Z-score model '${model.id}': expected a positive SD across the BSA range, got ${
          f.sd(model, bsa)
        } at BSA ${bsa} m²`,
      );
    }
  }
  return Object.freeze({ ...model }) as unknown as M;
}

// ---------------------------------------------------------------------------------------------
// PHN 2017 models

/**
 * Lopez L, Colan S, Stylianou M, et al. Circ Cardiovasc Imaging 2017;10:e006979.
 *
 * @example
 * ```ts
 * import { LOPEZ_2017 } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(LOPEZ_2017.year, 2017);
 * ```
 */
export const LOPEZ_2017: Citation = Object.freeze({
  authors: "Lopez L, Colan S, Stylianou M, Granger S, Trachtenberg F, Frommelt P, et al.",
  year: 2017,
  title:
    "Relationship of echocardiographic Z scores adjusted for body surface area to age, sex, race, and ethnicity: the Pediatric Heart Network Normal Echocardiogram Database",
  publication: "Circ Cardiovasc Imaging 2017;10(11):e006979",
  doi: "10.1161/CIRCIMAGING.117.006979",
});

/** What was checked: the Z form X/BSA^α and the population (healthy non-obese children ≤ 18
 * years, BSA by Haycock) against the paper's abstract; all 14 (α, M, S) against a second,
 * independent public listing of the PHN coefficients. Not checked: the paper's own table (no
 * public copy of it was found), so every result says "not verified". */
const PHN_PROVENANCE =
  "Coefficients (α, M, S) transcribed from a secondary listing attributed to Lopez et al. 2017; all 14 agree with a second, independent secondary listing, but they are not verified against the paper's table";
const PHN_BSA_RANGE_NOTE =
  "Assumed span of the PHN reference population (healthy non-obese children ≤ 18 years, BSA by Haycock, per the paper's abstract); the paper's exact BSA range was not available here: verify before relying on the out-of-range flag";
const PHN_BSA_RANGE: ValueRange = { min: 0.15, max: 2.4 };

/** The quantity each PHN model measures. */
const PHN_QUANTITIES: Readonly<Record<string, string>> = {
  aorticAnnulus: "aorticAnnulus",
  aorticRootSinus: "aorticRoot",
  sinotubularJunction: "sinotubularJunction",
  ascendingAorta: "ascendingAorta",
  mainPulmonaryArtery: "mainPulmonaryArtery",
  rightPulmonaryArtery: "rightPulmonaryArtery",
  leftPulmonaryArtery: "leftPulmonaryArtery",
  mitralAnnulusAp: "mitralAnnulus",
  tricuspidAnnulusAp: "tricuspidAnnulus",
  lvEndDiastolicDimension: "lvEndDiastolicDiameter",
  lvPosteriorWallDiastole: "posteriorWallThickness",
  interventricularSeptumDiastole: "septalThickness",
  lvEndDiastolicVolume: "lvEndDiastolicVolume",
  lvMass: "lvMass",
};

function phn(
  key: string,
  measurement: string,
  alpha: number,
  mean: number,
  sd: number,
  unit = "cm",
): AllometricConstantSdModel {
  const max = unit === "cm" ? 15 : 1000;
  return defineZScoreModel({
    id: `phn2017.${key}`,
    quantity: PHN_QUANTITIES[key]!,
    measurement,
    unit,
    bsaMethod: "haycock",
    bsaRange: PHN_BSA_RANGE,
    bsaRangeNote: PHN_BSA_RANGE_NOTE,
    measurementRange: { min: 0, max, minExclusive: true },
    source: LOPEZ_2017,
    provenance: PHN_PROVENANCE,
    form: "allometricConstantSd",
    alpha,
    mean,
    sd,
  });
}

/**
 * The Pediatric Heart Network 2017 Z-score models (Lopez et al., Circ Cardiovasc Imaging
 * 2017;10:e006979): Z = (X / BSA^α − M) / S with BSA by Haycock; X in cm unless stated
 * (LV end-diastolic volume in mL, LV mass in g). Coefficients transcribed from a secondary
 * listing and cross-checked against a second, independent listing, but not verified against the
 * paper's table: every result, table, CSV and doc page that uses them says so.
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const m = PHN_2017_MODELS.lvEndDiastolicDimension;
 * assert.deepEqual([m.alpha, m.mean, m.sd], [0.45, 3.89, 0.33]);
 * ```
 */
export const PHN_2017_MODELS: {
  readonly aorticAnnulus: AllometricConstantSdModel;
  readonly aorticRootSinus: AllometricConstantSdModel;
  readonly sinotubularJunction: AllometricConstantSdModel;
  readonly ascendingAorta: AllometricConstantSdModel;
  readonly mainPulmonaryArtery: AllometricConstantSdModel;
  readonly rightPulmonaryArtery: AllometricConstantSdModel;
  readonly leftPulmonaryArtery: AllometricConstantSdModel;
  readonly mitralAnnulusAp: AllometricConstantSdModel;
  readonly tricuspidAnnulusAp: AllometricConstantSdModel;
  readonly lvEndDiastolicDimension: AllometricConstantSdModel;
  readonly lvPosteriorWallDiastole: AllometricConstantSdModel;
  readonly interventricularSeptumDiastole: AllometricConstantSdModel;
  readonly lvEndDiastolicVolume: AllometricConstantSdModel;
  readonly lvMass: AllometricConstantSdModel;
} = Object.freeze({
  aorticAnnulus: phn("aorticAnnulus", "Aortic valve annulus", 0.5, 1.48, 0.14),
  aorticRootSinus: phn("aorticRootSinus", "Aortic root at the sinuses", 0.5, 2.06, 0.18),
  sinotubularJunction: phn("sinotubularJunction", "Sinotubular junction", 0.5, 1.69, 0.16),
  ascendingAorta: phn("ascendingAorta", "Ascending aorta", 0.5, 1.79, 0.18),
  mainPulmonaryArtery: phn("mainPulmonaryArtery", "Main pulmonary artery", 0.5, 1.82, 0.24),
  rightPulmonaryArtery: phn("rightPulmonaryArtery", "Right pulmonary artery", 0.5, 1.07, 0.18),
  leftPulmonaryArtery: phn("leftPulmonaryArtery", "Left pulmonary artery", 0.5, 1.1, 0.18),
  mitralAnnulusAp: phn(
    "mitralAnnulusAp",
    "Mitral valve annulus (anteroposterior)",
    0.5,
    2.31,
    0.24,
  ),
  tricuspidAnnulusAp: phn(
    "tricuspidAnnulusAp",
    "Tricuspid valve annulus (anteroposterior)",
    0.5,
    2.36,
    0.28,
  ),
  lvEndDiastolicDimension: phn(
    "lvEndDiastolicDimension",
    "LV end-diastolic dimension",
    0.45,
    3.89,
    0.33,
  ),
  lvPosteriorWallDiastole: phn(
    "lvPosteriorWallDiastole",
    "LV posterior wall thickness (diastole)",
    0.4,
    0.57,
    0.09,
  ),
  interventricularSeptumDiastole: phn(
    "interventricularSeptumDiastole",
    "Interventricular septal thickness (diastole)",
    0.4,
    0.58,
    0.09,
  ),
  lvEndDiastolicVolume: phn(
    "lvEndDiastolicVolume",
    "LV end-diastolic volume",
    1.3,
    62.02,
    11.94,
    "mL",
  ),
  lvMass: phn("lvMass", "LV mass", 1.25, 53.02, 9.06, "g"),
});
