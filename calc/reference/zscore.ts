/**
 * Pediatric Z-scores against body surface area: model families as data, the PHN 2017 models,
 * Z ↔ measurement in both directions, percentiles, normal limits and side-by-side comparison.
 *
 * A Z-score model reduces to three functions of BSA: a transform T(X, BSA), a mean μ(BSA) and a
 * standard deviation σ(BSA) of the transformed measurement, so that Z = (T(X, BSA) − μ) / σ and
 * X = T⁻¹(μ + Z·σ, BSA). Each family fills these in from its coefficients; a new published model
 * of an existing family is added as data, a new family by one entry in {@linkcode ZSCORE_FAMILIES}.
 *
 * @module
 */
import * as z from "zod";
import { defineCalculation, evaluate, formatRange, inRange } from "../core/define.ts";
import type { Calculation, Reference, ValueRange } from "../core/types.ts";
import { mathUnitOf, type QuantityInput } from "../core/units.ts";
import { bsaCalculation, type BsaMethod } from "../body/bsa.ts";
import { normalCdf } from "../stats/distributions.ts";

/** Fields shared by every Z-score model. */
export interface ZScoreModelBase {
  /** Stable identifier, e.g. "phn2017.lvEndDiastolicDimension". */
  readonly id: string;
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
  readonly source: Reference;
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
  /** Family discriminator. */
  readonly family: "allometricConstantSd";
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
  /** Family discriminator. */
  readonly family: "logPolynomialBsa";
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
  /** Family discriminator. */
  readonly family: "allometricModelledSd";
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
export type ZScoreFamilyName = ZScoreModel["family"];

/** The three functions a family provides (all pure, allocation-free). */
export interface ZScoreFamily<M extends ZScoreModel = ZScoreModel> {
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
 * The Z-score model families, keyed by name. Adding a family is adding one entry here (and its
 * model type to {@linkcode ZScoreModel}); adding a model is adding data.
 *
 * @example
 * ```ts
 * import { ZSCORE_FAMILIES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(Object.keys(ZSCORE_FAMILIES), [
 *   "allometricConstantSd", "logPolynomialBsa", "allometricModelledSd",
 * ]);
 * ```
 */
export const ZSCORE_FAMILIES: {
  readonly allometricConstantSd: ZScoreFamily<AllometricConstantSdModel>;
  readonly logPolynomialBsa: ZScoreFamily<LogPolynomialBsaModel>;
  readonly allometricModelledSd: ZScoreFamily<AllometricModelledSdModel>;
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

function familyOf(model: ZScoreModel): ZScoreFamily {
  return ZSCORE_FAMILIES[model.family] as ZScoreFamily;
}

/**
 * The Z-score of a measurement for a model: the one Z formula (no validation; used by the
 * calculations below, by cohorts and by charts).
 *
 * Formula: Z = (T(X, BSA) − μ(BSA)) / σ(BSA), per family (see {@linkcode ZSCORE_FAMILIES}).
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
  const f = familyOf(model);
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
  const f = familyOf(model);
  return f.inverse(model, f.mean(model, bsaM2) + zScore * f.sd(model, bsaM2), bsaM2);
}

// ---------------------------------------------------------------------------------------------
// Model definition (validated data)

const rangeSchema = z.object({
  min: z.number(),
  max: z.number(),
  minExclusive: z.boolean().optional(),
  maxExclusive: z.boolean().optional(),
}).refine((r) => r.min <= r.max, "expected min <= max");

const baseShape = {
  id: z.string().min(1),
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

const modelSchema = z.discriminatedUnion("family", [
  z.object({
    ...baseShape,
    family: z.literal("allometricConstantSd"),
    alpha: finite,
    mean: finite,
    sd: positive,
  }),
  z.object({
    ...baseShape,
    family: z.literal("logPolynomialBsa"),
    meanCoefficients: z.array(finite).min(1),
    sdCoefficients: z.array(finite).min(1),
  }),
  z.object({
    ...baseShape,
    family: z.literal("allometricModelledSd"),
    meanScale: positive,
    meanExponent: finite,
    sdScale: positive,
    sdExponent: finite,
  }),
]);

/**
 * Validates and freezes a Z-score model given as data. Use it to add a published model (or a
 * clearly labelled synthetic one for tests) without touching code.
 *
 * @param model The model data.
 * @returns The same data, frozen.
 * @throws {TypeError} Naming the field when the data do not match the family's shape (unknown
 * family, missing or non-finite coefficient, SD ≤ 0, empty range).
 * @throws {RangeError} When the SD is not positive across the model's BSA range.
 *
 * @example
 * ```ts
 * import { defineZScoreModel, zScoreFormula } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // A SYNTHETIC model (invented numbers) showing the data shape of a log-polynomial family
 * const model = defineZScoreModel({
 *   id: "synthetic.demo", measurement: "Demo diameter", unit: "cm", bsaMethod: "haycock",
 *   bsaRange: { min: 0.2, max: 2 }, bsaRangeNote: "synthetic",
 *   measurementRange: { min: 0, max: 10, minExclusive: true },
 *   source: { authors: "none", year: 2026, title: "Synthetic test model", publication: "none" },
 *   provenance: "synthetic: invented for this example", synthetic: true,
 *   family: "logPolynomialBsa", meanCoefficients: [0, 0.5], sdCoefficients: [0.1],
 * });
 * // ln X = 0.5 at BSA 1 → X = e^0.5 gives Z = 0
 * assert.ok(Math.abs(zScoreFormula(model, Math.exp(0.5), 1)) < 1e-12);
 * ```
 */
export function defineZScoreModel<M extends ZScoreModel>(model: M): M {
  const parsed = modelSchema.safeParse(model);
  if (!parsed.success) {
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
  const f = familyOf(model);
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
export const LOPEZ_2017: Reference = Object.freeze({
  authors: "Lopez L, Colan S, Stylianou M, Granger S, Trachtenberg F, Frommelt P, et al.",
  year: 2017,
  title:
    "Relationship of echocardiographic Z scores adjusted for body surface area to age, sex, race, and ethnicity: the Pediatric Heart Network Normal Echocardiogram Database",
  publication: "Circ Cardiovasc Imaging 2017;10(11):e006979",
  doi: "10.1161/CIRCIMAGING.117.006979",
});

const PHN_PROVENANCE =
  "Coefficients (α, M, S) as listed in the project's issue 4, which attributes them to Lopez et al. 2017; not re-checked against the paper's table here";
const PHN_BSA_RANGE_NOTE =
  "Assumed span of the PHN reference population (healthy non-obese children 0–18 years, BSA by Haycock); the paper's exact BSA range was not available here: verify before relying on the out-of-range flag";
const PHN_BSA_RANGE: ValueRange = { min: 0.15, max: 2.4 };

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
    measurement,
    unit,
    bsaMethod: "haycock",
    bsaRange: PHN_BSA_RANGE,
    bsaRangeNote: PHN_BSA_RANGE_NOTE,
    measurementRange: { min: 0, max, minExclusive: true },
    source: LOPEZ_2017,
    provenance: PHN_PROVENANCE,
    family: "allometricConstantSd",
    alpha,
    mean,
    sd,
  });
}

/**
 * The Pediatric Heart Network 2017 Z-score models (Lopez et al., Circ Cardiovasc Imaging
 * 2017;10:e006979): Z = (X / BSA^α − M) / S with BSA by Haycock; X in cm unless stated
 * (LV end-diastolic volume in mL, LV mass in g). Coefficients as listed in issue 4.
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

// ---------------------------------------------------------------------------------------------
// Calculations (one per model, cached): validated, propagatable

const fromBsaCache = new WeakMap<ZScoreModel, Calculation<"measurement" | "bsaM2", "zScore">>();
const fromBodyCache = new WeakMap<
  ZScoreModel,
  Calculation<"measurement" | "heightCm" | "weightKg", "bsaM2" | "zScore">
>();

const Z_CAUTIONS = [
  "A Z-score is only as good as the model's reference population and its BSA formula; compare models before acting on a borderline value",
];

/**
 * The Z-score of a model as a calculation of (measurement, BSA), defined once per model and
 * cached. The BSA input's typical range is the model's BSA range, so BSA outside it is flagged.
 *
 * Formula: {@linkcode zScoreFormula}.
 *
 * @param model The Z-score model.
 * @returns Calculation with inputs `measurement` (model unit) and `bsaM2` (m²), output `zScore`.
 *
 * @example
 * ```ts
 * import { evaluate, PHN_2017_MODELS, zScoreCalculation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const calc = zScoreCalculation(PHN_2017_MODELS.aorticAnnulus);
 * // (1.48 + 2·0.14)·1^0.5 = 1.76 cm at BSA 1 m² gives Z = 2 (hand-checkable from the model)
 * const z = evaluate(calc, { measurement: "17.6 mm", bsaM2: 1 }).outputs.zScore;
 * assert.ok(Math.abs(z - 2) < 1e-12);
 * ```
 */
export function zScoreCalculation(
  model: ZScoreModel,
): Calculation<"measurement" | "bsaM2", "zScore"> {
  let calc = fromBsaCache.get(model);
  if (calc === undefined) {
    calc = defineCalculation({
      id: `zScore(${model.id})`,
      title: `Z-score: ${model.measurement} (${model.id})`,
      description: `Z-score of the ${model.measurement.toLowerCase()} for body surface area.`,
      inputs: {
        measurement: {
          unit: model.unit,
          description: model.measurement,
          range: model.measurementRange,
        },
        bsaM2: {
          unit: "m^2",
          description: `Body surface area (${model.bsaMethod})`,
          range: { min: 0, max: 5, minExclusive: true },
          typical: model.bsaRange,
        },
      },
      outputs: { zScore: { unit: "1", description: "Z-score (SDs from the mean for BSA)" } },
      formula: ({ measurement, bsaM2 }) => ({ zScore: zScoreFormula(model, measurement, bsaM2) }),
      formulaText: familyOf(model).formulaText,
      sources: [model.source],
      cautions: model.synthetic
        ? [
          "SYNTHETIC model: invented coefficients for tests and demos, not for patients",
          ...Z_CAUTIONS,
        ]
        : Z_CAUTIONS,
      clinical: true,
    });
    fromBsaCache.set(model, calc);
  }
  return calc;
}

/**
 * The Z-score of a model as a calculation of (measurement, height, weight): BSA by the model's
 * BSA formula, then Z, so height and weight uncertainty propagates into Z. Defined once per
 * model and cached; both steps call the formulas of their one definitions.
 *
 * @param model The Z-score model.
 * @returns Calculation with inputs `measurement`, `heightCm`, `weightKg`; outputs `bsaM2`,
 * `zScore`.
 *
 * @example
 * ```ts
 * import { evaluate, PHN_2017_MODELS, zScoreFromBodySizeCalculation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const calc = zScoreFromBodySizeCalculation(PHN_2017_MODELS.lvEndDiastolicDimension);
 * const r = evaluate(calc, { measurement: 3.5, heightCm: 120, weightKg: 22 });
 * assert.ok(r.outputs.bsaM2 > 0.8 && r.outputs.bsaM2 < 0.9);
 * ```
 */
export function zScoreFromBodySizeCalculation(
  model: ZScoreModel,
): Calculation<"measurement" | "heightCm" | "weightKg", "bsaM2" | "zScore"> {
  let calc = fromBodyCache.get(model);
  if (calc === undefined) {
    const bsa = bsaCalculation(model.bsaMethod);
    const zCalc = zScoreCalculation(model);
    calc = defineCalculation({
      id: `zScoreFromBodySize(${model.id})`,
      title: `Z-score from height and weight: ${model.measurement} (${model.id})`,
      description:
        `BSA by ${bsa.title}, then the Z-score of the ${model.measurement.toLowerCase()}.`,
      inputs: {
        measurement: zCalc.inputs.measurement,
        heightCm: bsa.inputs.heightCm,
        weightKg: bsa.inputs.weightKg,
      },
      outputs: { bsaM2: bsa.outputs.bsaM2, zScore: zCalc.outputs.zScore },
      formula: ({ measurement, heightCm, weightKg }) => {
        const { bsaM2 } = bsa.formula({ heightCm, weightKg });
        return { bsaM2, zScore: zCalc.formula({ measurement, bsaM2 }).zScore };
      },
      formulaText: `BSA = ${bsa.formulaText}; ${zCalc.formulaText}`,
      sources: [...zCalc.sources, ...bsa.sources],
      cautions: [...zCalc.cautions, ...bsa.cautions],
      clinical: true,
    });
    fromBodyCache.set(model, calc);
  }
  return calc;
}

// ---------------------------------------------------------------------------------------------
// User-facing helpers

/**
 * Percentile (0–100) of a Z-score under the normal distribution (standard normal CDF from
 * @stdlib).
 *
 * Formula: P = 100 · Φ(Z)
 *
 * @param zScore Z (finite).
 * @returns The percentile in [0, 100].
 * @throws {RangeError} For NaN or an infinite Z.
 *
 * @example
 * ```ts
 * import { percentileFromZ } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Φ(1.959964) = 0.975 (standard normal table)
 * assert.ok(Math.abs(percentileFromZ(1.959964) - 97.5) < 1e-4);
 * ```
 */
export function percentileFromZ(zScore: number): number {
  if (!Number.isFinite(zScore)) {
    throw new RangeError(`Percentile: expected a finite 'zScore', got ${zScore}`);
  }
  return 100 * normalCdf(zScore);
}

/** A measurement with its BSA, or with the height and weight that give the BSA. */
export type ZScoreArguments =
  | { readonly measurement: QuantityInput; readonly bsaM2: QuantityInput }
  | {
    readonly measurement: QuantityInput;
    readonly heightCm: QuantityInput;
    readonly weightKg: QuantityInput;
  };

/** The result of {@linkcode zScore}. */
export interface ZScoreResult {
  /** The model used. */
  readonly model: ZScoreModel;
  /** The measurement in the model's unit. */
  readonly measurement: number;
  /** The BSA used, m². */
  readonly bsaM2: number;
  /** Z. */
  readonly zScore: number;
  /** Percentile, 100·Φ(Z). */
  readonly percentile: number;
  /** The expected measurement (Z = 0) for this BSA. */
  readonly expected: number;
  /** The measurements at Z = −2 and Z = +2 for this BSA. */
  readonly normalRange: readonly [number, number];
  /** True when the BSA lies outside the model's BSA range. */
  readonly bsaOutsideModelRange: boolean;
  /** Flags: inputs outside typical ranges, BSA outside the model's range. */
  readonly flags: readonly string[];
  /** Cautions (with the clinical caution). */
  readonly cautions: readonly string[];
}

/**
 * The flag text for a BSA outside a model's range.
 *
 * @example
 * ```ts
 * import { bsaOutsideModelFlag, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(bsaOutsideModelFlag(PHN_2017_MODELS.lvMass, 2.8), /extrapolation/);
 * ```
 */
export function bsaOutsideModelFlag(model: ZScoreModel, bsaM2: number): string {
  return `BSA ${
    Number(bsaM2.toPrecision(4))
  } m² lies outside the range the model '${model.id}' was built on ${
    formatRange(model.bsaRange, "m^2")
  }: the Z-score is an extrapolation`;
}

/**
 * The Z-score of one measurement for a model, with percentile, expected value, ±2 limits and
 * flags. Give either the BSA (by the model's BSA method) or the height and weight.
 *
 * Formula: {@linkcode zScoreFormula}; percentile = 100·Φ(Z).
 *
 * Source: the model's (for PHN: Lopez L et al., Circ Cardiovasc Imaging 2017;10:e006979).
 *
 * @param model The Z-score model.
 * @param args `{ measurement, bsaM2 }` or `{ measurement, heightCm, weightKg }`; numbers in
 * canonical units or quantity strings ("3.6 cm").
 * @returns Z with its context.
 * @throws {TypeError} For missing, unknown or mistyped inputs.
 * @throws {RangeError} For a measurement, BSA, height or weight outside its valid domain.
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS, zScore } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // LVEDD (M + 2S)·BSA^α = (3.89 + 0.66)·1 = 4.55 cm at BSA 1 m² → Z = 2
 * const r = zScore(PHN_2017_MODELS.lvEndDiastolicDimension, { measurement: 4.55, bsaM2: 1 });
 * assert.ok(Math.abs(r.zScore - 2) < 1e-12);
 * assert.equal(r.bsaOutsideModelRange, false);
 * ```
 */
export function zScore(model: ZScoreModel, args: ZScoreArguments): ZScoreResult {
  if (typeof args !== "object" || args === null) {
    throw new TypeError(`Z-score (${model.id}): expected an object of inputs, got ${String(args)}`);
  }
  let bsaM2: number;
  let measurement: number;
  let zValue: number;
  let flags: string[];
  let cautions: readonly string[];
  if ("bsaM2" in args) {
    const r = evaluate(zScoreCalculation(model), args);
    ({ bsaM2, measurement } = r.inputs);
    zValue = r.outputs.zScore;
    flags = r.flags.filter((f) => !f.startsWith("'bsaM2'"));
    cautions = r.cautions;
  } else {
    const r = evaluate(zScoreFromBodySizeCalculation(model), args);
    measurement = r.inputs.measurement;
    bsaM2 = r.outputs.bsaM2;
    zValue = r.outputs.zScore;
    flags = [...r.flags];
    cautions = r.cautions;
  }
  const outside = !inRange(bsaM2, model.bsaRange);
  if (outside) flags.push(bsaOutsideModelFlag(model, bsaM2));
  return {
    model,
    measurement,
    bsaM2,
    zScore: zValue,
    percentile: percentileFromZ(zValue),
    expected: measurementFormula(model, 0, bsaM2),
    normalRange: [measurementFormula(model, -2, bsaM2), measurementFormula(model, 2, bsaM2)],
    bsaOutsideModelRange: outside,
    flags,
    cautions,
  };
}

function checkBsa(where: string, bsaM2: number): void {
  if (typeof bsaM2 !== "number") {
    throw new TypeError(`${where}: expected 'bsaM2' as a number in m², got ${typeof bsaM2}`);
  }
  if (!(bsaM2 > 0 && bsaM2 <= 5)) {
    throw new RangeError(`${where}: expected 'bsaM2' in (0, 5] m², got ${bsaM2}`);
  }
}

/**
 * The measurement at a given Z-score for a BSA (inverse of the Z-score).
 *
 * Formula: X = T⁻¹(μ(BSA) + Z·σ(BSA)); for PHN X = (M + Z·S)·BSA^α.
 *
 * @param model The Z-score model.
 * @param zScore Z, finite.
 * @param bsaM2 BSA in m², in (0, 5].
 * @returns X in the model's unit.
 * @throws {TypeError} For a non-number Z or BSA.
 * @throws {RangeError} For a non-finite Z, a BSA outside (0, 5] m², or a Z giving a
 * non-positive measurement.
 *
 * @example
 * ```ts
 * import { measurementAtZ, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // LV mass at Z = 0, BSA 1 m²: 53.02 · 1^1.25 = 53.02 g
 * assert.equal(measurementAtZ(PHN_2017_MODELS.lvMass, 0, 1), 53.02);
 * ```
 */
export function measurementAtZ(model: ZScoreModel, zScore: number, bsaM2: number): number {
  const where = `Measurement at Z (${model.id})`;
  if (typeof zScore !== "number") {
    throw new TypeError(`${where}: expected 'zScore' as a number, got ${typeof zScore}`);
  }
  if (!Number.isFinite(zScore)) {
    throw new RangeError(`${where}: expected a finite 'zScore', got ${zScore}`);
  }
  checkBsa(where, bsaM2);
  const x = measurementFormula(model, zScore, bsaM2);
  if (!(x > 0 && Number.isFinite(x))) {
    throw new RangeError(
      `${where}: Z = ${zScore} at BSA ${bsaM2} m² gives no positive measurement, got ${x}`,
    );
  }
  return x;
}

/** Normal limits of a model at one BSA. */
export interface NormalLimits {
  /** BSA, m². */
  readonly bsaM2: number;
  /** Measurement at Z = 0. */
  readonly mean: number;
  /** Measurement at Z = −2. */
  readonly lower: number;
  /** Measurement at Z = +2. */
  readonly upper: number;
  /** True when the BSA lies outside the model's BSA range. */
  readonly bsaOutsideModelRange: boolean;
}

/**
 * The mean and the Z = ±2 measurements of a model at a BSA.
 *
 * @param model The Z-score model.
 * @param bsaM2 BSA in m², in (0, 5].
 * @returns Mean, lower (Z = −2), upper (Z = +2) and whether the BSA is outside the model's range.
 * @throws {RangeError} For a BSA outside (0, 5] m².
 *
 * @example
 * ```ts
 * import { normalLimits, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // Aortic root at BSA 0.81 m²: (2.06 ± 2·0.18)·0.9 = 1.530 and 2.178 cm
 * const l = normalLimits(PHN_2017_MODELS.aorticRootSinus, 0.81);
 * assert.ok(Math.abs(l.lower - 1.53) < 1e-12 && Math.abs(l.upper - 2.178) < 1e-12);
 * ```
 */
export function normalLimits(model: ZScoreModel, bsaM2: number): NormalLimits {
  checkBsa(`Normal limits (${model.id})`, bsaM2);
  return {
    bsaM2,
    mean: measurementFormula(model, 0, bsaM2),
    lower: measurementFormula(model, -2, bsaM2),
    upper: measurementFormula(model, 2, bsaM2),
    bsaOutsideModelRange: !inRange(bsaM2, model.bsaRange),
  };
}

/** One row of {@linkcode compareZScoreModels}. */
export interface ZScoreComparisonRow {
  /** Model identifier. */
  readonly modelId: string;
  /** Model family. */
  readonly family: ZScoreFamilyName;
  /** Source, "Authors year". */
  readonly source: string;
  /** Z, or NaN when the model could not be applied (see `error`). */
  readonly zScore: number;
  /** Percentile, or NaN. */
  readonly percentile: number;
  /** BSA used by this model (its own BSA formula), m². */
  readonly bsaM2: number;
  /** Flags of this model (BSA outside range, ...). */
  readonly flags: readonly string[];
  /** Why the model could not be applied (unit mismatch, value out of domain), if so. */
  readonly error?: string;
}

/**
 * Z-scores of one measurement under several models, side by side (each model uses its own BSA
 * formula when height and weight are given). A model that cannot be applied (a unit of another
 * dimension than the first model's, or a value outside its domain) yields a row with `error`
 * rather than failing the whole comparison.
 *
 * @param models The models to compare (typically of the same measurement).
 * @param args `{ measurement, heightCm, weightKg }` (preferred: each model gets its own BSA) or
 * `{ measurement, bsaM2 }`.
 * @returns One row per model, in the order given.
 * @throws {TypeError} When `models` is empty or not an array.
 *
 * @example
 * ```ts
 * import { compareZScoreModels, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const rows = compareZScoreModels(
 *   [PHN_2017_MODELS.aorticRootSinus, PHN_2017_MODELS.sinotubularJunction],
 *   { measurement: "2.0 cm", bsaM2: 1 },
 * );
 * assert.equal(rows.length, 2);
 * assert.ok(rows[0]!.zScore < rows[1]!.zScore);
 * ```
 */
export function compareZScoreModels(
  models: readonly ZScoreModel[],
  args: ZScoreArguments,
): ZScoreComparisonRow[] {
  if (!Array.isArray(models) || models.length === 0) {
    throw new TypeError(
      `Z-score comparison: expected a non-empty array of models, got ${
        Array.isArray(models) ? "an empty array" : typeof models
      }`,
    );
  }
  const first = models[0]!;
  const firstUnit = mathUnitOf(first.unit);
  return models.map((model) => {
    const source = `${model.source.authors.split(",")[0]} ${model.source.year}`;
    const unit = mathUnitOf(model.unit);
    const comparable = model.unit === first.unit ||
      (unit !== null && firstUnit !== null && unit.equalBase(firstUnit));
    const failed = (error: string): ZScoreComparisonRow => ({
      modelId: model.id,
      family: model.family,
      source,
      zScore: NaN,
      percentile: NaN,
      bsaM2: NaN,
      flags: [],
      error,
    });
    if (!comparable) {
      return failed(
        `Z-score comparison: model '${model.id}' measures in ${model.unit}, not comparable with ${first.unit} of '${first.id}', got ${model.unit}`,
      );
    }
    try {
      const r = zScore(model, args);
      return {
        modelId: model.id,
        family: model.family,
        source,
        zScore: r.zScore,
        percentile: r.percentile,
        bsaM2: r.bsaM2,
        flags: r.flags,
      };
    } catch (error) {
      if (!(error instanceof TypeError || error instanceof RangeError)) throw error;
      return failed(error.message);
    }
  });
}
