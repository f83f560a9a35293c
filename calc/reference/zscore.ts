/**
 * Pediatric Z-scores: one calculation per model (a family registered in the catalog), and one
 * entry point for a Z-score with or without uncertainty, from the BSA or from height and weight
 * (a chain of the model's BSA formula and its Z-score). Percentiles, the measurement at a Z,
 * normal limits, and side-by-side comparison of models.
 *
 * @module
 */
import type { Calculation, MimeBundle, Population, Quantity } from "../core/types.ts";
import { defineQuantity } from "../core/quantity.ts";
import { cautionsOf } from "../core/calculation.ts";
import { formatRange, inRange } from "../core/range.ts";
import { defineFamily, type Family } from "../core/family.ts";
import { chain } from "../core/chain.ts";
import { evaluate } from "../core/evaluate.ts";
import { checkValue, quantityField } from "../core/validate.ts";
import { throwIfErrors } from "../core/issues.ts";
import { readAmount } from "../core/units.ts";
import { bsaCalculation } from "../body/bsa.ts";
import { BODY_SURFACE_AREA } from "../quantities/body.ts";
import { QUANTITIES } from "../quantities/mod.ts";
import { normalCdf, tCdf } from "../stats/distributions.ts";
import { isUncertainValue } from "../uncertainty/uncertain_value.ts";
import { propagate, type PropagateOptions } from "../uncertainty/propagate.ts";
import type { UncertainArgument } from "../uncertainty/prepare.ts";
import { isUncertainInput } from "../uncertainty/distributions.ts";
import type { UncertainValue } from "../uncertainty/types.ts";
import {
  defineZScoreModel,
  measurementFormula,
  PHN_2017_MODELS,
  ZSCORE_FORMS,
  type ZScoreForm,
  zScoreFormula,
  type ZScoreModel,
} from "./zscore_models.ts";
import {
  displayNormalLimits,
  displayZScore,
  displayZScoreComparison,
  JUPYTER_DISPLAY,
} from "../../display/reference.ts";
import type { NormalLimits, ZScoreComparisonRow, ZScoreResult } from "./types.ts";

export type { NormalLimits, ZScoreComparisonRow } from "./types.ts";
export type { ZScoreResult } from "./types.ts";

const Z_CAUTIONS = [
  "A Z-score is only as good as the model's reference population and its BSA formula; compare models before acting on a borderline value",
];

/**
 * A model as a reader names it: its first author and year, e.g. "Lopez 2017".
 *
 * @example
 * ```ts
 * import { modelCitation, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(modelCitation(PHN_2017_MODELS.lvMass), "Lopez 2017");
 * ```
 */
export function modelCitation(model: ZScoreModel): string {
  return `${model.source.authors.split(/[ ,]/)[0]} ${model.source.year}`;
}

const measured = new Map<string, Quantity>();

/**
 * The quantity a model measures: the package's quantity of that id, or one declared from the
 * model's own label, unit and range (for a model of a measurement the package does not name).
 *
 * @example
 * ```ts
 * import { AORTIC_ROOT, measuredQuantity, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(measuredQuantity(PHN_2017_MODELS.aorticRootSinus), AORTIC_ROOT);
 * ```
 */
export function measuredQuantity(model: ZScoreModel): Quantity {
  const known = model.quantity === undefined ? undefined : QUANTITIES.get(model.quantity);
  if (known !== undefined) return known;
  let q = measured.get(model.id);
  if (q === undefined) {
    q = defineQuantity({
      id: model.id.replace(/[^A-Za-z0-9]+/g, "_"),
      label: model.measurement,
      unit: model.unit,
      description: `${model.measurement} (as measured for the model ${model.id})`,
      valid: model.measurementRange,
      resolution: 0.01,
      rangeNote: `the valid range given with the model ${model.id}`,
    });
    measured.set(model.id, q);
  }
  return q;
}

const zQuantities = new Map<string, Quantity>();

/**
 * The Z-score of a model's measurement as a quantity: "Aortic root at the sinuses Z-score
 * (Lopez 2017)", dimensionless (the "coefficients not verified" mark, where the model's provenance
 * says so, travels as a caution of every result, table and chart that uses the model).
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS, zScoreQuantity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.match(zScoreQuantity(PHN_2017_MODELS.lvMass).label, /^LV mass Z-score/);
 * ```
 */
export function zScoreQuantity(model: ZScoreModel): Quantity {
  let q = zQuantities.get(model.id);
  if (q === undefined) {
    const m = measuredQuantity(model);
    q = defineQuantity({
      id: `zScore.${model.id}`,
      label: `${m.label} Z-score (${modelCitation(model)})`,
      symbol: `Z(${m.symbol})`,
      unit: "1",
      description:
        `Standard deviations of the measured ${m.label} from the mean for body surface area (model ${model.id})`,
      valid: { min: -Infinity, max: Infinity },
      resolution: 0.01,
      rangeNote: "any real number",
    });
    zQuantities.set(model.id, q);
  }
  return q;
}

function formOf(model: ZScoreModel): ZScoreForm {
  return ZSCORE_FORMS[model.form] as ZScoreForm;
}

/**
 * The family of Z-score calculations, one member per model: inputs the measurement (named by its
 * quantity's id) and `bsaM2` (typical range: the model's BSA range), output `zScore`. Its
 * documented members are the PHN 2017 models.
 *
 * @example
 * ```ts
 * import { evaluate, PHN_2017_MODELS, Z_SCORE } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const calc = Z_SCORE.calculation(PHN_2017_MODELS.aorticAnnulus);
 * // (1.48 + 2·0.14)·1^0.5 = 1.76 cm at BSA 1 m² gives Z = 2 (hand-checkable from the model)
 * const z = evaluate(calc, { aorticAnnulus: "17.6 mm", bsaM2: 1 }).outputs.zScore!;
 * assert.ok(Math.abs(z - 2) < 1e-12);
 * ```
 */
export const Z_SCORE: Family<ZScoreModel> = defineFamily<ZScoreModel>({
  id: "zScore",
  title: "Pediatric Z-score",
  description:
    "Z-score of a measurement for body surface area, one calculation per published model.",
  members: Object.values(PHN_2017_MODELS),
  key: (model) => JSON.stringify(model),
  fromData: (data) => defineZScoreModel(data as ZScoreModel),
  define: (model) => {
    const m = measuredQuantity(model);
    return {
      id: `zScore(${model.id})`,
      title: `Z-score: ${m.label} (${modelCitation(model)})`,
      description: `Z-score of the measured ${m.label} for body surface area.`,
      inputs: {
        [m.id]: m,
        bsaM2: {
          quantity: BODY_SURFACE_AREA,
          description: `Body surface area by the ${model.bsaMethod} formula`,
          typical: model.bsaRange,
          typicalPediatric: model.bsaRange,
          reason: `the BSA range of the reference population of ${modelCitation(model)}`,
        },
      },
      outputs: { zScore: zScoreQuantity(model) },
      formula: (x: Record<string, number>) => ({
        zScore: zScoreFormula(model, x[m.id]!, x.bsaM2!),
      }),
      formulaText: formOf(model).formulaText,
      citations: [model.source],
      cautions: [
        ...(model.synthetic
          ? ["SYNTHETIC model: invented coefficients for tests and demos, not for patients"]
          : []),
        ...(/not re-checked|from memory|not verified/i.test(model.provenance)
          ? [`Coefficients not verified against the publication: ${model.provenance}`]
          : []),
        ...Z_CAUTIONS,
      ],
      clinical: true,
    };
  },
});

/**
 * The Z-score calculation of a model (a member of {@linkcode Z_SCORE}).
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS, zScoreCalculation } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.deepEqual(zScoreCalculation(PHN_2017_MODELS.lvMass).inputNames, ["lvMass", "bsaM2"]);
 * ```
 */
export function zScoreCalculation(model: ZScoreModel): Calculation {
  return Z_SCORE.calculation(model);
}

const fromBodySize = new Map<Calculation, Calculation>();

/**
 * The chain "BSA by the model's formula, then the Z-score" of a model: inputs height, weight and
 * the measurement; outputs `bsaM2` and `zScore`.
 *
 * @example
 * ```ts
 * import { evaluate, PHN_2017_MODELS, zScoreFromBodySize } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const c = zScoreFromBodySize(PHN_2017_MODELS.lvEndDiastolicDimension);
 * const r = evaluate(c, { lvEndDiastolicDiameter: 3.5, heightCm: 120, weightKg: 22 });
 * // Haycock: 0.024265·22^0.5378·120^0.3964 = 0.8533 m² (hand computation of the formula)
 * assert.ok(Math.abs(r.outputs.bsaM2! - 0.8533) < 1e-4);
 * ```
 */
export function zScoreFromBodySize(model: ZScoreModel): Calculation {
  const z = zScoreCalculation(model);
  let c = fromBodySize.get(z);
  if (c === undefined) {
    c = chain([bsaCalculation(model.bsaMethod), z], {
      title: `Z-score from height and weight: ${measuredQuantity(model).label} (${
        modelCitation(model)
      })`,
    });
    fromBodySize.set(z, c);
  }
  return c;
}

/**
 * Percentile (0–100) of a Z-score under the normal distribution.
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
  return `BSA ${Number(bsaM2.toPrecision(4))} m² lies outside the range the model (${
    measuredQuantity(model).label
  }, ${modelCitation(model)}) was built on ${
    formatRange(model.bsaRange, "m^2")
  }: the Z-score is an extrapolation`;
}

/** A measurement with its BSA, or with the height and weight that give the BSA; each exact, a
 * distribution, or an uncertain value of an earlier step. */
export interface ZScoreArguments {
  /** The measurement, in the model's unit or as a quantity string ("17.6 mm"). */
  readonly measurement: UncertainArgument;
  /** BSA by the model's formula, m² (give this, or height and weight). */
  readonly bsaM2?: UncertainArgument;
  /** Height, cm. */
  readonly heightCm?: UncertainArgument;
  /** Weight, kg. */
  readonly weightKg?: UncertainArgument;
}

/** Options of {@linkcode zScore}: the propagation's, when an input is uncertain. */
export type ZScoreOptions = PropagateOptions;

function isUncertain(v: unknown): boolean {
  return isUncertainValue(v) || (isUncertainInput(v) && v.kind !== "exact");
}

/** P(true Z > 2) and P(true Z < −2) from the distribution of the interval. */
function tailProbabilities(z: UncertainValue): { above: number; below: number } {
  if (z.samples !== null) {
    let a = 0, b = 0;
    for (let i = 0; i < z.samples.length; i++) {
      const s = z.samples[i]!;
      if (s > 2) a++;
      else if (s < -2) b++;
    }
    return { above: a / z.samples.length, below: b / z.samples.length };
  }
  const u = z.standardUncertainty;
  if (!(u > 0)) return { above: z.value > 2 ? 1 : 0, below: z.value < -2 ? 1 : 0 };
  // the interval is z ± t_p(ν)·u: the same scaled t gives the tail probabilities
  const nu = z.effectiveDof === null || !Number.isFinite(z.effectiveDof)
    ? Infinity
    : Math.max(1, Math.floor(z.effectiveDof));
  const cdf = (t: number) => (nu === Infinity ? normalCdf(t) : tCdf(t, nu));
  return { above: 1 - cdf((2 - z.value) / u), below: cdf((-2 - z.value) / u) };
}

/**
 * The Z-score of a measurement for a model: the one entry point, with or without uncertainty.
 * Give the BSA (by the model's formula) or the height and weight; each exact, a distribution
 * (`normal(…)`), or an uncertain value of an earlier step. With any uncertain input the Z-score
 * is propagated (GUM by default; `method: "monteCarlo"` for Monte Carlo) through the model's
 * calculation, or through the chain BSA → Z when height and weight are given.
 *
 * Formula: Z = (T(X, BSA) − μ(BSA)) / σ(BSA) of the model's form; percentile = 100·Φ(Z).
 *
 * Source: the model's (for PHN: Lopez L et al., Circ Cardiovasc Imaging 2017;10:e006979).
 *
 * @param model The Z-score model.
 * @param args The measurement and the BSA, or the measurement, height and weight.
 * @param options Propagation options (used when an input is uncertain).
 * @returns Z with its context and uncertainty; it displays itself in a notebook.
 * @throws {TypeError} For missing, unknown or mistyped inputs.
 * @throws {RangeError} For a value outside its valid range.
 *
 * @example
 * ```ts
 * import { normal, PHN_2017_MODELS, zScore } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // LVEDD (M + 2S)·BSA^α = (3.89 + 0.66)·1 = 4.55 cm at BSA 1 m² → Z = 2
 * const r = zScore(PHN_2017_MODELS.lvEndDiastolicDimension, { measurement: 4.55, bsaM2: 1 });
 * assert.ok(Math.abs(r.zScore - 2) < 1e-12);
 * // Aortic annulus 1.76 ± 0.05 cm at BSA 1 m²: u(Z) = 0.05/0.14 (JCGM 100 eq. (10), ∂Z/∂X = 1/S)
 * const u = zScore(PHN_2017_MODELS.aorticAnnulus, { measurement: normal(1.76, 0.05), bsaM2: 1 });
 * assert.ok(Math.abs(u.uncertainty!.standardUncertainty - 0.05 / 0.14) < 1e-6);
 * assert.ok(Math.abs(u.probabilityAbovePlus2! - 0.5) < 1e-6);
 * ```
 */
export function zScore(
  model: ZScoreModel,
  args: ZScoreArguments,
  options: ZScoreOptions = {},
): ZScoreResult {
  const where = `Z-score: ${measuredQuantity(model).label} (${modelCitation(model)})`;
  if (typeof args !== "object" || args === null) {
    throw new TypeError(`${where}: expected an object of inputs, got ${String(args)}`);
  }
  const { measurement, ...body } = args;
  const byBsa = body.bsaM2 !== undefined;
  const calc = byBsa ? zScoreCalculation(model) : zScoreFromBodySize(model);
  const key = measuredQuantity(model).id;
  const inputs: Record<string, UncertainArgument | undefined> = { [key]: measurement, ...body };
  const uncertain = options.method !== undefined || Object.values(inputs).some(isUncertain);
  const population: Population = options.population ?? "pediatric";
  let z: number, bsaM2: number, x: number;
  let flags: string[];
  let cautions: readonly string[];
  let uncertainty: UncertainValue | null = null;
  if (!uncertain) {
    const r = evaluate(calc, inputs as Record<string, never>, { population });
    z = r.outputs.zScore!;
    x = r.inputs[key]!;
    bsaM2 = byBsa ? r.inputs.bsaM2! : r.outputs.bsaM2!;
    flags = [...r.flags];
    cautions = r.cautions;
  } else {
    const r = propagate(calc, inputs, { ...options, population });
    uncertainty = r.outputs.zScore!;
    z = uncertainty.value;
    x = r.inputs[key]!.value;
    bsaM2 = byBsa ? r.inputs.bsaM2!.value : r.outputs.bsaM2!.value;
    flags = [...r.warnings];
    cautions = r.cautions;
  }
  // the model's BSA range flag says more than the generic typical-range flag of bsaM2
  flags = flags.filter((f) => !f.includes("'bsaM2'"));
  const outside = !inRange(bsaM2, model.bsaRange);
  if (outside) flags.push(bsaOutsideModelFlag(model, bsaM2));
  const tails = uncertainty ? tailProbabilities(uncertainty) : null;
  const result: ZScoreResult = {
    kind: "sonorigor.zScore",
    model,
    quantity: measuredQuantity(model),
    measurement: x,
    bsaM2,
    zScore: z,
    percentile: percentileFromZ(z),
    expected: measurementFormula(model, 0, bsaM2),
    normalRange: {
      lower: measurementFormula(model, -2, bsaM2),
      upper: measurementFormula(model, 2, bsaM2),
    },
    bsaOutsideModelRange: outside,
    uncertainty,
    percentileInterval: uncertainty
      ? {
        lower: percentileFromZ(uncertainty.interval.lower),
        upper: percentileFromZ(uncertainty.interval.upper),
      }
      : null,
    probabilityAbovePlus2: tails?.above ?? null,
    probabilityBelowMinus2: tails?.below ?? null,
    flags,
    cautions,
  };
  return Object.assign(result, { [JUPYTER_DISPLAY]: () => displayZScore(result) });
}

function checkBsa(where: string, bsaM2: unknown): number {
  const r = checkValue("bsaM2", quantityField(BODY_SURFACE_AREA), bsaM2, { where });
  throwIfErrors(r.issues);
  return r.value!;
}

/**
 * The measurement at a given Z-score for a BSA (inverse of the Z-score).
 *
 * Formula: X = T⁻¹(μ(BSA) + Z·σ(BSA)); for PHN X = (M + Z·S)·BSA^α.
 *
 * @param model The Z-score model.
 * @param zScore Z, finite.
 * @param bsaM2 BSA in m² (a number or a quantity string).
 * @returns X in the model's unit.
 * @throws {TypeError} For a non-number Z or BSA.
 * @throws {RangeError} For a non-finite Z, a BSA outside its valid range, or a Z giving a
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
export function measurementAtZ(model: ZScoreModel, zScore: number, bsaM2: number | string): number {
  const where = `Measurement at Z (${model.id})`;
  if (typeof zScore !== "number") {
    throw new TypeError(`${where}: expected 'zScore' as a number, got ${typeof zScore}`);
  }
  if (!Number.isFinite(zScore)) {
    throw new RangeError(`${where}: expected a finite 'zScore', got ${zScore}`);
  }
  const bsa = checkBsa(where, bsaM2);
  const x = measurementFormula(model, zScore, bsa);
  if (!(x > 0 && Number.isFinite(x))) {
    throw new RangeError(
      `${where}: Z = ${zScore} at BSA ${bsa} m² gives no positive measurement, got ${x}`,
    );
  }
  return x;
}

/**
 * The mean and the Z = ±2 measurements of a model at a BSA.
 *
 * @param model The Z-score model.
 * @param bsaM2 BSA in m².
 * @returns Mean, lower (Z = −2), upper (Z = +2) and whether the BSA is outside the model's range.
 * @throws {RangeError} For a BSA outside its valid range.
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
export function normalLimits(
  model: ZScoreModel,
  bsaM2: number | string,
): NormalLimits & { [JUPYTER_DISPLAY](): MimeBundle } {
  const bsa = checkBsa(`Normal limits (${model.id})`, bsaM2);
  const limits: NormalLimits = {
    bsaM2: bsa,
    mean: measurementFormula(model, 0, bsa),
    lower: measurementFormula(model, -2, bsa),
    upper: measurementFormula(model, 2, bsa),
    bsaOutsideModelRange: !inRange(bsa, model.bsaRange),
  };
  const quantity = measuredQuantity(model);
  return Object.assign(limits, {
    [JUPYTER_DISPLAY]: () =>
      displayNormalLimits(limits, {
        quantity,
        title: `Normal limits: ${quantity.label} (${modelCitation(model)})`,
        cautions: cautionsOf(zScoreCalculation(model)),
      }),
  });
}

/**
 * Z-scores of one measurement under several models, side by side (each model uses its own BSA
 * formula when height and weight are given). A model that cannot be applied (a unit of another
 * dimension than the first model's, or a value outside its domain) yields a row with `error`
 * rather than failing the whole comparison.
 *
 * @param models The models to compare (typically of the same measurement).
 * @param args `{ measurement, heightCm, weightKg }` (preferred: each model gets its own BSA) or
 * `{ measurement, bsaM2 }`; exact values.
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
 * assert.ok(rows[0]!.zScore! < rows[1]!.zScore!);
 * ```
 */
export function compareZScoreModels(
  models: readonly ZScoreModel[],
  args: ZScoreArguments,
): ZScoreComparisonRow[] & { [JUPYTER_DISPLAY](): MimeBundle } {
  if (!Array.isArray(models) || models.length === 0) {
    throw new TypeError(
      `Z-score comparison: expected a non-empty array of models, got ${
        Array.isArray(models) ? "an empty array" : typeof models
      }`,
    );
  }
  const first = models[0]!;
  const rows = models.map((model) => {
    const source = `${model.source.authors.split(",")[0]} ${model.source.year}`;
    const failed = (error: string): ZScoreComparisonRow => ({
      modelId: model.id,
      form: model.form,
      source,
      zScore: null,
      percentile: null,
      bsaM2: null,
      flags: [],
      error,
    });
    if (
      model.unit !== first.unit && typeof readAmount(`1 ${model.unit}`, first.unit) !== "number"
    ) {
      return failed(
        `Z-score comparison: model '${model.id}' measures in ${model.unit}, not comparable with ${first.unit} of '${first.id}', got ${model.unit}`,
      );
    }
    try {
      const r = zScore(model, args);
      return {
        modelId: model.id,
        form: model.form,
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
  const label = measuredQuantity(first).label;
  return Object.assign(rows, {
    [JUPYTER_DISPLAY]: () =>
      displayZScoreComparison(rows, {
        names: models.map((m) => measuredQuantity(m).label),
        title: `Z-scores of ${label} under ${models.length} model${models.length > 1 ? "s" : ""}`,
        cautions: [...new Set(models.flatMap((m) => cautionsOf(zScoreCalculation(m))))],
      }),
  });
}

/** One row of {@linkcode zScoreBands}: the measurement at Z = −3 … +3 for one BSA. */
export interface ZScoreBandRow {
  /** BSA, m². */
  readonly bsa: number;
  /** Measurement at Z = −3. */
  readonly "z-3": number;
  /** Measurement at Z = −2. */
  readonly "z-2": number;
  /** Measurement at Z = −1. */
  readonly "z-1": number;
  /** Measurement at Z = 0 (the mean). */
  readonly z0: number;
  /** Measurement at Z = 1. */
  readonly z1: number;
  /** Measurement at Z = 2. */
  readonly z2: number;
  /** Measurement at Z = 3. */
  readonly z3: number;
}

/**
 * The measurements at Z = −3 … +3 of a model across a BSA range: the data of a normal-range
 * chart, from the model's one inverse formula.
 *
 * @param model The Z-score model.
 * @param from First BSA, m² (> 0).
 * @param to Last BSA, m² (> from).
 * @param points Number of BSA grid points, ≥ 2. @default 121
 * @returns One row per BSA.
 * @throws {RangeError} For an empty or non-positive BSA range or fewer than 2 points.
 *
 * @example
 * ```ts
 * import { PHN_2017_MODELS, zScoreBands } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const [row] = zScoreBands(PHN_2017_MODELS.aorticAnnulus, 1, 2, 2);
 * // (1.48 + 2·0.14)·1^0.5 = 1.76 cm at Z = 2, BSA 1 m² (hand-checkable)
 * assert.ok(Math.abs(row!["z2"] - 1.76) < 1e-12);
 * ```
 */
export function zScoreBands(
  model: ZScoreModel,
  from: number,
  to: number,
  points = 121,
): ZScoreBandRow[] {
  if (!(from > 0 && to > from)) {
    throw new RangeError(
      `Z-score bands (${model.id}): expected a BSA range 0 < from < to, got [${from}, ${to}]`,
    );
  }
  if (!(Number.isInteger(points) && points >= 2)) {
    throw new RangeError(
      `Z-score bands (${model.id}): expected at least 2 grid points, got ${points}`,
    );
  }
  const rows: ZScoreBandRow[] = [];
  for (let i = 0; i < points; i++) {
    const bsa = from + ((to - from) * i) / (points - 1);
    const row: Record<string, number> = { bsa };
    for (const z of [-3, -2, -1, 0, 1, 2, 3]) row[`z${z}`] = measurementFormula(model, z, bsa);
    rows.push(row as unknown as ZScoreBandRow);
  }
  return rows;
}
