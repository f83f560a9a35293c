/**
 * Linear (M-mode or 2D-guided) left-ventricular measurements: fractional shortening, Teichholz
 * volumes and ejection fraction, LV mass by the cube formula, mass index, relative wall thickness
 * and the four-way geometry classification.
 *
 * All dimensions are end-diastolic unless the input name says systole, in cm, measured
 * perpendicular to the LV long axis at or just below the mitral leaflet tips (Lang 2015).
 *
 * @module
 */
import { CLINICAL_CAUTION, defineCalculation, notAbove } from "../core/define.ts";
import type { Calculation } from "../core/types.ts";
import type { InlineInput } from "../core/calculation.ts";
import { DEVEREUX_1986, GANAU_1992, LANG_2015, TEICHHOLZ_1976 } from "./sources.ts";
import { ejectionFraction, percentReduction } from "./function.ts";
import { monteCarlo } from "../uncertainty/legacy.ts";
import type { PropagateOptions } from "../uncertainty/propagate.ts";
import type { UncertainInputs } from "../uncertainty/prepare.ts";
import { indexedToBsa } from "../body/indexing.ts";
import { LV_MASS } from "../quantities/structure.ts";

/** Measurement / BSA for grams: the one indexing definition of the body-size module. */
const indexLvMass = indexedToBsa(LV_MASS);

// Valid domains are physical limits; typical ranges are the adult span seen in practice
// (common practice, no source) and only raise a flag.
const lvidDiastole: InlineInput = {
  unit: "cm",
  description: "LV internal diameter at end-diastole (LVIDd)",
  range: { min: 0, max: 12, minExclusive: true },
  typical: { min: 3, max: 7.5 },
};
const lvidSystole: InlineInput = {
  unit: "cm",
  description: "LV internal diameter at end-systole (LVIDs)",
  range: { min: 0, max: 12, minExclusive: true },
  typical: { min: 1.5, max: 6.5 },
};
const septumDiastole: InlineInput = {
  unit: "cm",
  description: "Interventricular septal thickness at end-diastole (IVSd)",
  range: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.5, max: 2 },
};
const posteriorWallDiastole: InlineInput = {
  unit: "cm",
  description: "LV posterior (inferolateral) wall thickness at end-diastole (LVPWd)",
  range: { min: 0, max: 5, minExclusive: true },
  typical: { min: 0.5, max: 2 },
};
/** Body surface area input shared by the indexed chamber calculations (BSA itself is computed in
 * the body-size module). Typical range: adults, to which the guideline limits apply (common
 * practice, no source). */
export const bodySurfaceAreaInput: InlineInput = {
  unit: "m^2",
  description: "Body surface area",
  range: { min: 0, max: 5, minExclusive: true },
  typical: { min: 1.2, max: 2.8 },
};

/**
 * Fractional shortening of the left ventricle from end-diastolic and end-systolic internal
 * diameters.
 *
 * Formula: FS [%] = 100 · (LVIDd − LVIDs) / LVIDd
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (linear measurements of LV size).
 *
 * @throws {RangeError} From `evaluate` when a diameter is outside (0, 12] cm, or when LVIDs
 * exceeds LVIDd (the output is then not finite and the message names both inputs).
 *
 * @example LVIDd 5.0 cm, LVIDs 3.2 cm → 36 %
 * ```ts
 * import { evaluate, fractionalShortening } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(fractionalShortening, {
 *   lvInternalDiameterDiastoleCm: 5.0,
 *   lvInternalDiameterSystoleCm: "32 mm",
 * });
 * assert.ok(Math.abs(r.outputs.fractionalShorteningPercent - 36) < 1e-12);
 * ```
 */
export const fractionalShortening: Calculation<
  "lvInternalDiameterDiastoleCm" | "lvInternalDiameterSystoleCm",
  "fractionalShorteningPercent"
> = defineCalculation({
  id: "fractionalShortening",
  title: "LV fractional shortening",
  description:
    "Percentage shortening of the LV internal diameter from end-diastole to end-systole.",
  inputs: {
    lvInternalDiameterDiastoleCm: lvidDiastole,
    lvInternalDiameterSystoleCm: lvidSystole,
  },
  outputs: {
    fractionalShorteningPercent: { unit: "%", description: "Fractional shortening" },
  },
  formula: ({ lvInternalDiameterDiastoleCm, lvInternalDiameterSystoleCm }) => ({
    fractionalShorteningPercent: percentReduction(
      lvInternalDiameterDiastoleCm,
      lvInternalDiameterSystoleCm,
    ),
  }),
  constraints: [notAbove("lvInternalDiameterSystoleCm", "lvInternalDiameterDiastoleCm")],
  formulaText: "FS = 100·(LVIDd − LVIDs)/LVIDd",
  sources: [LANG_2015],
  cautions: [
    "Reflects one basal dimension only; misleading with regional wall-motion abnormalities",
    "LVIDs above LVIDd is rejected as a measurement or labelling error",
  ],
  clinical: true,
});

/**
 * Left-ventricular volume from one internal diameter by the Teichholz formula.
 *
 * Formula: V [mL] = 7 / (2.4 + D) · D³, D in cm
 *
 * Source: Teichholz LE et al., Am J Cardiol 1976;37:7–11. Lang 2015 no longer recommends linear
 * volume estimates for clinical use.
 *
 * @example D = 5.0 cm → 7·125/7.4 = 118.24 mL
 * ```ts
 * import { evaluate, teichholzVolume } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const v = evaluate(teichholzVolume, { lvInternalDiameterCm: 5 }).outputs.volumeMl;
 * assert.ok(Math.abs(v - 875 / 7.4) < 1e-9);
 * ```
 */
export const teichholzVolume: Calculation<"lvInternalDiameterCm", "volumeMl"> = defineCalculation({
  id: "teichholzVolume",
  title: "Teichholz LV volume",
  description:
    "LV cavity volume from one internal diameter, assuming a prolate ellipsoid whose long axis shortens less than the minor axis as the ventricle enlarges.",
  inputs: {
    lvInternalDiameterCm: {
      unit: "cm",
      description: "LV internal diameter (end-diastolic or end-systolic)",
      range: { min: 0, max: 12, minExclusive: true },
      typical: { min: 1.5, max: 7.5 },
    },
  },
  outputs: { volumeMl: { unit: "mL", description: "LV volume" } },
  formula: ({ lvInternalDiameterCm: d }) => ({ volumeMl: (7 / (2.4 + d)) * d ** 3 }),
  formulaText: "V = 7/(2.4 + D)·D³",
  sources: [TEICHHOLZ_1976, LANG_2015],
  cautions: [
    "Assumes an ellipsoidal ventricle: not valid with regional wall-motion abnormalities or aneurysm",
    "Lang 2015 does not recommend volumes from linear dimensions for clinical use; prefer the biplane method of discs",
  ],
  clinical: true,
});

/**
 * Teichholz end-diastolic and end-systolic volumes, ejection fraction and stroke volume from two
 * diameters; composes {@linkcode teichholzVolume} and {@linkcode ejectionFraction}.
 *
 * Formula: EDV = T(LVIDd), ESV = T(LVIDs) with T(D) = 7/(2.4 + D)·D³; EF = 100·(EDV − ESV)/EDV;
 * SV = EDV − ESV
 *
 * Source: Teichholz LE et al., Am J Cardiol 1976;37:7–11.
 *
 * @throws {RangeError} From `evaluate` when LVIDs exceeds LVIDd.
 *
 * @example LVIDd 5.0 cm, LVIDs 3.5 cm
 * ```ts
 * import { evaluate, teichholzEjectionFraction } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(teichholzEjectionFraction, {
 *   lvInternalDiameterDiastoleCm: 5,
 *   lvInternalDiameterSystoleCm: 3.5,
 * }).outputs;
 * assert.ok(Math.abs(r.endSystolicVolumeMl - 7 * 3.5 ** 3 / 5.9) < 1e-9);
 * assert.ok(r.ejectionFractionPercent > 56.9 && r.ejectionFractionPercent < 57.1);
 * ```
 */
export const teichholzEjectionFraction: Calculation<
  "lvInternalDiameterDiastoleCm" | "lvInternalDiameterSystoleCm",
  "endDiastolicVolumeMl" | "endSystolicVolumeMl" | "ejectionFractionPercent" | "strokeVolumeMl"
> = defineCalculation({
  id: "teichholzEjectionFraction",
  title: "Teichholz LV volumes and ejection fraction",
  description:
    "End-diastolic and end-systolic LV volumes by the Teichholz formula, with the ejection fraction and stroke volume they imply.",
  inputs: {
    lvInternalDiameterDiastoleCm: lvidDiastole,
    lvInternalDiameterSystoleCm: lvidSystole,
  },
  outputs: {
    endDiastolicVolumeMl: { unit: "mL", description: "End-diastolic volume" },
    endSystolicVolumeMl: { unit: "mL", description: "End-systolic volume" },
    ejectionFractionPercent: { unit: "%", description: "Ejection fraction" },
    strokeVolumeMl: { unit: "mL", description: "Stroke volume" },
  },
  formula: ({ lvInternalDiameterDiastoleCm, lvInternalDiameterSystoleCm }) => {
    const edv = teichholzVolume.formula({ lvInternalDiameterCm: lvInternalDiameterDiastoleCm })
      .volumeMl;
    const esv = teichholzVolume.formula({ lvInternalDiameterCm: lvInternalDiameterSystoleCm })
      .volumeMl;
    const ef = ejectionFraction.formula({ endDiastolicVolumeMl: edv, endSystolicVolumeMl: esv });
    return {
      endDiastolicVolumeMl: edv,
      endSystolicVolumeMl: esv,
      ejectionFractionPercent: ef.ejectionFractionPercent,
      strokeVolumeMl: ef.strokeVolumeMl,
    };
  },
  formulaText:
    "EDV = 7/(2.4 + LVIDd)·LVIDd³; ESV = 7/(2.4 + LVIDs)·LVIDs³; EF = 100·(EDV − ESV)/EDV",
  sources: [TEICHHOLZ_1976, LANG_2015],
  cautions: teichholzVolume.cautions,
  clinical: true,
});

/**
 * Left-ventricular mass by the linear (cube) formula of the 2015 ASE/EACVI chamber
 * quantification guideline (Devereux formula with the 0.8 correction).
 *
 * Formula: LV mass [g] = 0.8 · 1.04 · [(IVSd + LVIDd + LVPWd)³ − LVIDd³] + 0.6, dimensions in cm
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV mass, linear method; from
 * Devereux RB et al., Am J Cardiol 1986;57:450–458).
 *
 * @example IVSd 1.0, LVIDd 5.0, LVPWd 1.0 cm → 0.832·(343 − 125) + 0.6 = 181.976 g
 * ```ts
 * import { evaluate, lvMassLinear } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const m = evaluate(lvMassLinear, {
 *   septalThicknessDiastoleCm: 1,
 *   lvInternalDiameterDiastoleCm: 5,
 *   posteriorWallThicknessDiastoleCm: 1,
 * }).outputs.lvMassG;
 * assert.ok(Math.abs(m - 181.976) < 1e-9);
 * ```
 */
export const lvMassLinear: Calculation<
  "septalThicknessDiastoleCm" | "lvInternalDiameterDiastoleCm" | "posteriorWallThicknessDiastoleCm",
  "lvMassG"
> = defineCalculation({
  id: "lvMassLinear",
  title: "LV mass (linear cube formula)",
  description:
    "Left-ventricular myocardial mass from end-diastolic septal thickness, internal diameter and posterior wall thickness.",
  inputs: {
    septalThicknessDiastoleCm: septumDiastole,
    lvInternalDiameterDiastoleCm: lvidDiastole,
    posteriorWallThicknessDiastoleCm: posteriorWallDiastole,
  },
  outputs: { lvMassG: { unit: "g", description: "LV mass" } },
  formula: ({
    septalThicknessDiastoleCm: ivs,
    lvInternalDiameterDiastoleCm: lvid,
    posteriorWallThicknessDiastoleCm: pw,
  }) => ({ lvMassG: 0.8 * 1.04 * ((ivs + lvid + pw) ** 3 - lvid ** 3) + 0.6 }),
  formulaText: "LV mass = 0.8·1.04·[(IVSd + LVIDd + LVPWd)³ − LVIDd³] + 0.6",
  sources: [LANG_2015, DEVEREUX_1986],
  cautions: [
    "Cubes the dimensions: a 1 mm caliper error changes the mass by several percent",
    "Assumes a symmetric ventricle; not valid with asymmetric hypertrophy or distorted geometry",
  ],
  clinical: true,
});

/**
 * LV mass indexed to body surface area; composes {@linkcode lvMassLinear} and the body-size
 * module's indexing calculation (`indexedToBsa(LV_MASS)`).
 *
 * Formula: LV mass index [g/m²] = LV mass / BSA
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV mass, linear method).
 *
 * @example 181.976 g at BSA 2.0 m² → 90.988 g/m²
 * ```ts
 * import { evaluate, lvMassIndex } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(lvMassIndex, {
 *   septalThicknessDiastoleCm: 1,
 *   lvInternalDiameterDiastoleCm: 5,
 *   posteriorWallThicknessDiastoleCm: 1,
 *   bodySurfaceAreaM2: 2,
 * }).outputs;
 * assert.ok(Math.abs(r.lvMassIndexGPerM2 - 90.988) < 1e-9);
 * ```
 */
export const lvMassIndex: Calculation<
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm"
  | "bodySurfaceAreaM2",
  "lvMassG" | "lvMassIndexGPerM2"
> = defineCalculation({
  id: "lvMassIndex",
  title: "LV mass index (linear method)",
  description: "LV mass by the cube formula divided by body surface area.",
  inputs: { ...lvMassLinear.inputs, bodySurfaceAreaM2: bodySurfaceAreaInput },
  outputs: {
    lvMassG: { unit: "g", description: "LV mass" },
    lvMassIndexGPerM2: { unit: "g/m^2", description: "LV mass index" },
  },
  formula: (x) => {
    const { lvMassG } = lvMassLinear.formula(x);
    const { lvMassIndex } = indexLvMass.formula({ lvMass: lvMassG, bsaM2: x.bodySurfaceAreaM2 });
    return { lvMassG, lvMassIndexGPerM2: lvMassIndex! };
  },
  formulaText: "LVMi = LV mass / BSA",
  sources: [LANG_2015],
  cautions: [...lvMassLinear.cautions, ...indexLvMass.cautions],
  clinical: true,
});

/**
 * Relative wall thickness of the left ventricle.
 *
 * Formula: RWT = 2 · LVPWd / LVIDd
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV mass and geometry).
 *
 * @example LVPWd 1.0 cm, LVIDd 5.0 cm → 0.40
 * ```ts
 * import { evaluate, relativeWallThickness } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(relativeWallThickness, {
 *   posteriorWallThicknessDiastoleCm: 1,
 *   lvInternalDiameterDiastoleCm: 5,
 * });
 * assert.equal(r.outputs.relativeWallThickness, 0.4);
 * ```
 */
export const relativeWallThickness: Calculation<
  "posteriorWallThicknessDiastoleCm" | "lvInternalDiameterDiastoleCm",
  "relativeWallThickness"
> = defineCalculation({
  id: "relativeWallThickness",
  title: "Relative wall thickness",
  description: "Twice the posterior wall thickness over the LV internal diameter at end-diastole.",
  inputs: {
    posteriorWallThicknessDiastoleCm: posteriorWallDiastole,
    lvInternalDiameterDiastoleCm: lvidDiastole,
  },
  outputs: { relativeWallThickness: { unit: "1", description: "Relative wall thickness" } },
  formula: ({ posteriorWallThicknessDiastoleCm, lvInternalDiameterDiastoleCm }) => ({
    relativeWallThickness: (2 * posteriorWallThicknessDiastoleCm) / lvInternalDiameterDiastoleCm,
  }),
  formulaText: "RWT = 2·LVPWd/LVIDd",
  sources: [LANG_2015, GANAU_1992],
  cautions: [],
  clinical: true,
});

/**
 * The three numbers of LV geometry from one set of calipers: mass, mass index and relative wall
 * thickness; composes {@linkcode lvMassIndex} and {@linkcode relativeWallThickness}. Computing
 * them together keeps their shared dependence on LVIDd and LVPWd when uncertainty is propagated
 * (the GUM output covariance, and the joint Monte Carlo of {@linkcode lvGeometryProbabilities}).
 *
 * Formula: LV mass = 0.8·1.04·[(IVSd + LVIDd + LVPWd)³ − LVIDd³] + 0.6; LVMi = LV mass/BSA;
 * RWT = 2·LVPWd/LVIDd
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV mass and geometry).
 *
 * @example
 * ```ts
 * import { classifyLvGeometry, evaluate, lvGeometryMeasures } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(lvGeometryMeasures, {
 *   septalThicknessDiastoleCm: 1.3,
 *   lvInternalDiameterDiastoleCm: 4.8,
 *   posteriorWallThicknessDiastoleCm: 1.2,
 *   bodySurfaceAreaM2: 1.9,
 * }).outputs;
 * assert.equal(classifyLvGeometry({ ...r, sex: "male" }).geometry, "concentric hypertrophy");
 * ```
 */
export const lvGeometryMeasures: Calculation<
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm"
  | "bodySurfaceAreaM2",
  "lvMassG" | "lvMassIndexGPerM2" | "relativeWallThickness"
> = defineCalculation({
  id: "lvGeometryMeasures",
  title: "LV mass, mass index and relative wall thickness",
  description:
    "The measurements that define LV geometry, computed together from one set of end-diastolic linear dimensions.",
  inputs: lvMassIndex.inputs,
  outputs: {
    ...lvMassIndex.outputs,
    relativeWallThickness: { unit: "1", description: "Relative wall thickness" },
  },
  formula: (x) => ({
    ...lvMassIndex.formula(x),
    ...relativeWallThickness.formula(x),
  }),
  formulaText: "LV mass, LVMi = LV mass/BSA, RWT = 2·LVPWd/LVIDd",
  sources: [LANG_2015, GANAU_1992],
  cautions: lvMassLinear.cautions,
  clinical: true,
});

/** Sex for the sex-specific LV mass-index limit. */
export type Sex = "male" | "female";

/** The four patterns of LV geometry. */
export type LvGeometry =
  | "normal"
  | "concentric remodeling"
  | "concentric hypertrophy"
  | "eccentric hypertrophy";

/**
 * The partition limits of the four-way geometry classification, each with its source.
 *
 * @example
 * ```ts
 * import { LV_GEOMETRY_LIMITS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.ok(LV_GEOMETRY_LIMITS !== undefined);
 * ```
 */
export const LV_GEOMETRY_LIMITS: {
  readonly relativeWallThickness: { readonly upperNormal: number; readonly source: string };
  readonly lvMassIndexGPerM2: {
    readonly male: { readonly upperNormal: number; readonly source: string };
    readonly female: { readonly upperNormal: number; readonly source: string };
  };
} = Object.freeze({
  relativeWallThickness: {
    upperNormal: 0.42,
    source: "Lang 2015, LV geometry figure: RWT > 0.42 concentric, ≤ 0.42 normal or eccentric",
  },
  lvMassIndexGPerM2: {
    male: {
      upperNormal: 115,
      source: "Lang 2015, LV mass table, linear method: men normal range 49–115 g/m²",
    },
    female: {
      upperNormal: 95,
      source: "Lang 2015, LV mass table, linear method: women normal range 43–95 g/m²",
    },
  },
});

const GEOMETRIES: readonly LvGeometry[] = [
  "normal",
  "concentric remodeling",
  "concentric hypertrophy",
  "eccentric hypertrophy",
];

function checkSex(sex: unknown, where: string): Sex {
  if (sex !== "male" && sex !== "female") {
    throw new TypeError(
      `${where}: expected 'sex' as "male" or "female", got ${JSON.stringify(sex)}`,
    );
  }
  return sex;
}

function geometryOf(rwt: number, massIndex: number, limit: number): LvGeometry {
  const thick = rwt > LV_GEOMETRY_LIMITS.relativeWallThickness.upperNormal;
  const heavy = massIndex > limit;
  if (heavy) return thick ? "concentric hypertrophy" : "eccentric hypertrophy";
  return thick ? "concentric remodeling" : "normal";
}

/**
 * Classifies LV geometry into normal, concentric remodeling, concentric hypertrophy or eccentric
 * hypertrophy from relative wall thickness and LV mass index.
 *
 * Rule: increased RWT is > 0.42; increased mass index is > 115 g/m² (men) or > 95 g/m² (women).
 * Normal mass + normal RWT → normal; normal mass + increased RWT → concentric remodeling;
 * increased mass + increased RWT → concentric hypertrophy; increased mass + normal RWT →
 * eccentric hypertrophy. Values exactly at a limit count as normal.
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV geometry figure and LV mass
 * table, linear method); Ganau A et al., J Am Coll Cardiol 1992;19:1550–1558.
 *
 * @param values RWT (dimensionless), LV mass index (g/m², linear method) and sex.
 * @returns The geometry with the limits used.
 * @throws {TypeError} When sex is not "male" or "female" or a value is not a number.
 * @throws {RangeError} When RWT is outside (0, 5] or the mass index outside (0, 1000] g/m².
 *
 * @example
 * ```ts
 * import { classifyLvGeometry } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const g = classifyLvGeometry({ relativeWallThickness: 0.48, lvMassIndexGPerM2: 90, sex: "male" });
 * assert.equal(g.geometry, "concentric remodeling");
 * ```
 */
export function classifyLvGeometry(values: {
  readonly relativeWallThickness: number;
  readonly lvMassIndexGPerM2: number;
  readonly sex: Sex;
}): {
  geometry: LvGeometry;
  relativeWallThicknessLimit: number;
  lvMassIndexLimitGPerM2: number;
  cautions: string[];
} {
  const where = "LV geometry classification";
  if (typeof values !== "object" || values === null) {
    throw new TypeError(`${where}: expected an object of values, got ${String(values)}`);
  }
  const sex = checkSex(values.sex, where);
  const rwt = checkNumber(values.relativeWallThickness, "relativeWallThickness", 0, 5, "", where);
  const lvmi = checkNumber(values.lvMassIndexGPerM2, "lvMassIndexGPerM2", 0, 1000, " g/m^2", where);
  const limit = LV_GEOMETRY_LIMITS.lvMassIndexGPerM2[sex].upperNormal;
  return {
    geometry: geometryOf(rwt, lvmi, limit),
    relativeWallThicknessLimit: LV_GEOMETRY_LIMITS.relativeWallThickness.upperNormal,
    lvMassIndexLimitGPerM2: limit,
    cautions: [
      "Mass-index limits apply to the linear (cube) method in adults",
      CLINICAL_CAUTION,
    ],
  };
}

function checkNumber(
  v: unknown,
  name: string,
  min: number,
  max: number,
  unit: string,
  where: string,
): number {
  if (typeof v !== "number") {
    throw new TypeError(`${where}: expected '${name}' as a number, got ${JSON.stringify(v)}`);
  }
  if (!(v > min && v <= max)) {
    throw new RangeError(`${where}: expected '${name}' in (${min}, ${max}]${unit}, got ${v}`);
  }
  return v;
}

/** Internal composition for class probabilities: the geometry class of one trial as a code
 * (index into the class list), so that counting Monte Carlo samples of this single output gives
 * the joint class probabilities (sorting a single output does not change its counts). */
const lvGeometryClassCode: Calculation<
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm"
  | "bodySurfaceAreaM2"
  | "lvMassIndexLimitGPerM2",
  "geometryCode"
> = defineCalculation({
  id: "lvGeometryClassCode",
  title: "LV geometry class",
  description: "Index of the LV geometry class of one set of linear dimensions.",
  inputs: {
    ...lvGeometryMeasures.inputs,
    lvMassIndexLimitGPerM2: {
      unit: "g/m^2",
      description: "Upper normal LV mass index for the patient's sex",
      range: { min: 0, max: 1000, minExclusive: true },
    },
  },
  outputs: {
    geometryCode: {
      unit: "1",
      description:
        "0 normal, 1 concentric remodeling, 2 concentric hypertrophy, 3 eccentric hypertrophy",
    },
  },
  formula: (x) => {
    const m = lvGeometryMeasures.formula(x);
    return {
      geometryCode: GEOMETRIES.indexOf(
        geometryOf(m.relativeWallThickness, m.lvMassIndexGPerM2, x.lvMassIndexLimitGPerM2),
      ),
    };
  },
  formulaText: "class(RWT > 0.42, LVMi > limit)",
  sources: [LANG_2015, GANAU_1992],
  cautions: lvMassLinear.cautions,
  clinical: true,
});

/** Inputs of {@linkcode lvGeometryProbabilities}: the linear dimensions and BSA, each exact or
 * with an uncertainty (`normal(...)`, `rectangular(...)`, ...). */
export type LvGeometryUncertainInputs = UncertainInputs<
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm"
  | "bodySurfaceAreaM2"
>;

/**
 * Probability of each LV geometry class given the uncertainty of the calipers and BSA, by Monte
 * Carlo (JCGM 101:2008). Each trial draws one set of dimensions, computes mass index and RWT
 * together (composing {@linkcode lvGeometryMeasures}) and classifies them with
 * {@linkcode classifyLvGeometry}'s rule, so the shared dependence of RWT and mass on LVIDd and
 * LVPWd is kept. The class probabilities are the fractions of trials in each class.
 *
 * @param inputs Dimensions (cm) and BSA (m²), exact numbers or uncertain inputs.
 * @param sex "male" or "female" (selects the mass-index limit).
 * @param options Monte Carlo options (`trials`, default 100000; `seed`; `correlations`).
 * @returns Class probabilities (sum 1), the most probable class, trials, seed and warnings.
 * @throws {TypeError} For an invalid sex or malformed inputs.
 * @throws {RangeError} For input estimates outside their valid ranges.
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (limits); JCGM 101:2008 (method).
 *
 * @example A borderline patient: several classes are plausible
 * ```ts
 * import { lvGeometryProbabilities, normal } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const p = lvGeometryProbabilities({
 *   septalThicknessDiastoleCm: normal(1.05, 0.05),
 *   lvInternalDiameterDiastoleCm: normal(5.0, 0.05),
 *   posteriorWallThicknessDiastoleCm: normal(1.05, 0.05),
 *   bodySurfaceAreaM2: 1.75,
 * }, "male", { trials: 20000, seed: 1 });
 * const total = Object.values(p.probabilities).reduce((a, b) => a + b, 0);
 * assert.ok(Math.abs(total - 1) < 1e-12);
 * assert.ok(p.probabilities["concentric hypertrophy"] > 0.05);
 * ```
 */
export function lvGeometryProbabilities(
  inputs: LvGeometryUncertainInputs,
  sex: Sex,
  options: Pick<PropagateOptions, "trials" | "seed" | "correlations"> = {},
): {
  probabilities: Record<LvGeometry, number>;
  mostProbable: LvGeometry;
  trials: number;
  seed: number;
  warnings: readonly string[];
  cautions: readonly string[];
} {
  const where = "LV geometry probabilities";
  const limit = LV_GEOMETRY_LIMITS.lvMassIndexGPerM2[checkSex(sex, where)].upperNormal;
  if (typeof inputs !== "object" || inputs === null) {
    throw new TypeError(`${where}: expected an object of inputs, got ${String(inputs)}`);
  }
  const mc = monteCarlo(lvGeometryClassCode, { ...inputs, lvMassIndexLimitGPerM2: limit }, {
    trials: 100_000,
    ...options,
    keepSamples: true,
  });
  const codes = mc.outputs.geometryCode.samples!;
  const counts = [0, 0, 0, 0];
  for (let k = 0; k < codes.length; k++) counts[codes[k]!]!++;
  const probabilities = {} as Record<LvGeometry, number>;
  let mostProbable: LvGeometry = "normal";
  GEOMETRIES.forEach((g, i) => {
    probabilities[g] = counts[i]! / codes.length;
    if (probabilities[g] > probabilities[mostProbable]) mostProbable = g;
  });
  return {
    probabilities,
    mostProbable,
    trials: mc.monteCarlo!.trials,
    seed: mc.monteCarlo!.seed,
    warnings: mc.warnings,
    cautions: mc.cautions,
  };
}
