/**
 * Linear (M-mode or 2D-guided) left-ventricular measurements: fractional shortening, Teichholz
 * volumes and ejection fraction, LV mass by the cube formula, mass index and relative wall
 * thickness, and the measures that define LV geometry.
 *
 * All dimensions are end-diastolic unless the input name says systole, in cm, measured
 * perpendicular to the LV long axis at or just below the mitral leaflet tips (Lang 2015).
 *
 * @module
 */
import { defineCalculation, notAbove } from "../core/calculation.ts";
import { chain } from "../core/chain.ts";
import type { Calculation } from "../core/types.ts";
import {
  CHAMBER_VOLUME,
  FRACTIONAL_SHORTENING,
  LV_END_DIASTOLIC_DIAMETER,
  LV_END_DIASTOLIC_VOLUME,
  LV_END_SYSTOLIC_DIAMETER,
  LV_END_SYSTOLIC_VOLUME,
  LV_INTERNAL_DIAMETER,
  LV_MASS,
  POSTERIOR_WALL_THICKNESS,
  RELATIVE_WALL_THICKNESS,
  SEPTAL_THICKNESS,
} from "../quantities/structure.ts";
import { indexedToBsa } from "../body/indexing.ts";
import { DEVEREUX_1986, GANAU_1992, LANG_2015, TEICHHOLZ_1976 } from "./citations.ts";
import { ejectionFraction, percentReduction } from "./function.ts";
import { namedChain } from "./named_chain.ts";

/** End-diastolic LV internal diameter > end-systolic: a relation both FS and Teichholz EF need. */
const systoleNotAboveDiastole = notAbove(
  "lvInternalDiameterSystoleCm",
  "lvInternalDiameterDiastoleCm",
);

/**
 * Fractional shortening of the left ventricle from end-diastolic and end-systolic internal
 * diameters.
 *
 * Formula: FS [%] = 100 · (LVIDd − LVIDs) / LVIDd
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (linear measurements of LV size).
 *
 * @throws {RangeError} From `evaluate` when a diameter is outside (0, 12] cm, or when LVIDs
 * exceeds LVIDd (the message names both inputs).
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
    lvInternalDiameterDiastoleCm: LV_END_DIASTOLIC_DIAMETER,
    lvInternalDiameterSystoleCm: LV_END_SYSTOLIC_DIAMETER,
  },
  outputs: { fractionalShorteningPercent: FRACTIONAL_SHORTENING },
  formula: ({ lvInternalDiameterDiastoleCm, lvInternalDiameterSystoleCm }) => ({
    fractionalShorteningPercent: percentReduction(
      lvInternalDiameterDiastoleCm,
      lvInternalDiameterSystoleCm,
    ),
  }),
  constraints: [systoleNotAboveDiastole],
  formulaText: "FS = 100·(LVIDd − LVIDs)/LVIDd",
  citations: [LANG_2015],
  cautions: [
    "Reflects one basal dimension only; misleading with regional wall-motion abnormalities",
    "LVIDs above LVIDd is rejected as a measurement or labelling error",
  ],
  clinical: true,
});

/** The Teichholz formula, written once: V [mL] = 7/(2.4 + D)·D³, D in cm. */
function teichholzMl(diameterCm: number): number {
  return (7 / (2.4 + diameterCm)) * diameterCm ** 3;
}

const TEICHHOLZ_CAUTIONS = [
  "Assumes an ellipsoidal ventricle: not valid with regional wall-motion abnormalities or aneurysm",
  "Lang 2015 does not recommend volumes from linear dimensions for clinical use; prefer the biplane method of discs",
];

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
  inputs: { lvInternalDiameterCm: LV_INTERNAL_DIAMETER },
  outputs: {
    volumeMl: { quantity: CHAMBER_VOLUME, label: "LV volume", description: "LV cavity volume" },
  },
  formula: ({ lvInternalDiameterCm }) => ({ volumeMl: teichholzMl(lvInternalDiameterCm) }),
  formulaText: "V = 7/(2.4 + D)·D³",
  citations: [TEICHHOLZ_1976, LANG_2015],
  cautions: TEICHHOLZ_CAUTIONS,
  clinical: true,
});

/**
 * Teichholz end-diastolic and end-systolic LV volumes from the two internal diameters (the first
 * step of {@linkcode teichholzEjectionFraction}, which declares LVIDs ≤ LVIDd here).
 *
 * Formula: EDV = T(LVIDd), ESV = T(LVIDs), T(D) = 7/(2.4 + D)·D³
 *
 * Source: Teichholz LE et al., Am J Cardiol 1976;37:7–11.
 *
 * @throws {RangeError} From `evaluate` when LVIDs exceeds LVIDd (the message names both).
 *
 * @example LVIDd 6 cm, LVIDs 4 cm → 180 mL and 70 mL
 * ```ts
 * import { evaluate, teichholzVolumes } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(teichholzVolumes, {
 *   lvInternalDiameterDiastoleCm: 6,
 *   lvInternalDiameterSystoleCm: 4,
 * }).outputs;
 * assert.ok(Math.abs(r.endDiastolicVolumeMl - 180) < 1e-12); // 7·216/8.4, hand-checkable
 * assert.ok(Math.abs(r.endSystolicVolumeMl - 70) < 1e-12); // 7·64/6.4
 * ```
 */
export const teichholzVolumes: Calculation<
  "lvInternalDiameterDiastoleCm" | "lvInternalDiameterSystoleCm",
  "endDiastolicVolumeMl" | "endSystolicVolumeMl"
> = defineCalculation({
  id: "teichholzVolumes",
  title: "Teichholz LV volumes",
  description:
    "End-diastolic and end-systolic LV volumes by the Teichholz formula from the two internal diameters.",
  inputs: {
    lvInternalDiameterDiastoleCm: LV_END_DIASTOLIC_DIAMETER,
    lvInternalDiameterSystoleCm: LV_END_SYSTOLIC_DIAMETER,
  },
  outputs: {
    endDiastolicVolumeMl: LV_END_DIASTOLIC_VOLUME,
    endSystolicVolumeMl: LV_END_SYSTOLIC_VOLUME,
  },
  formula: ({ lvInternalDiameterDiastoleCm, lvInternalDiameterSystoleCm }) => ({
    endDiastolicVolumeMl: teichholzMl(lvInternalDiameterDiastoleCm),
    endSystolicVolumeMl: teichholzMl(lvInternalDiameterSystoleCm),
  }),
  constraints: [systoleNotAboveDiastole],
  formulaText: "EDV = 7/(2.4 + LVIDd)·LVIDd³; ESV = 7/(2.4 + LVIDs)·LVIDs³",
  citations: [TEICHHOLZ_1976, LANG_2015],
  cautions: TEICHHOLZ_CAUTIONS,
  clinical: true,
});

/**
 * Teichholz end-diastolic and end-systolic volumes, ejection fraction and stroke volume from two
 * diameters: the chain {@linkcode teichholzVolumes} → {@linkcode ejectionFraction}, so the
 * uncertainty of each diameter reaches EF and SV through both volumes.
 *
 * Formula: EDV = T(LVIDd), ESV = T(LVIDs) with T(D) = 7/(2.4 + D)·D³; EF = 100·(EDV − ESV)/EDV;
 * SV = EDV − ESV
 *
 * Source: Teichholz LE et al., Am J Cardiol 1976;37:7–11; Lang RM et al. 2015.
 *
 * @throws {RangeError} From `evaluate` when LVIDs exceeds LVIDd (the message names both).
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
> = chain([teichholzVolumes, ejectionFraction], {
  id: "teichholzEjectionFraction",
  title: "Teichholz LV volumes and ejection fraction",
  description:
    "End-diastolic and end-systolic LV volumes by the Teichholz formula, with the ejection fraction and stroke volume they imply.",
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
    septalThicknessDiastoleCm: SEPTAL_THICKNESS,
    lvInternalDiameterDiastoleCm: LV_END_DIASTOLIC_DIAMETER,
    posteriorWallThicknessDiastoleCm: POSTERIOR_WALL_THICKNESS,
  },
  outputs: { lvMassG: LV_MASS },
  formula: ({
    septalThicknessDiastoleCm: ivs,
    lvInternalDiameterDiastoleCm: lvid,
    posteriorWallThicknessDiastoleCm: pw,
  }) => ({ lvMassG: 0.8 * 1.04 * ((ivs + lvid + pw) ** 3 - lvid ** 3) + 0.6 }),
  formulaText: "LV mass = 0.8·1.04·[(IVSd + LVIDd + LVPWd)³ − LVIDd³] + 0.6",
  citations: [LANG_2015, DEVEREUX_1986],
  cautions: [
    "Cubes the dimensions: a 1 mm caliper error changes the mass by several percent",
    "Assumes a symmetric ventricle; not valid with asymmetric hypertrophy or distorted geometry",
  ],
  clinical: true,
});

/**
 * LV mass indexed to body surface area: the chain {@linkcode lvMassLinear} → the body-size
 * module's `indexedToBsa(LV_MASS)`, with the index step's inputs and output renamed to this
 * calculation's keys. Given BSA as an uncertain value from a BSA chain, the uncertainty of height
 * and weight reaches the index too.
 *
 * Formula: LV mass index [g/m²] = LV mass / BSA
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV mass, linear method; indexing
 * to BSA).
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
> = namedChain(
  {
    inputs: [
      "septalThicknessDiastoleCm",
      "lvInternalDiameterDiastoleCm",
      "posteriorWallThicknessDiastoleCm",
      "bodySurfaceAreaM2",
    ],
    outputs: ["lvMassG", "lvMassIndexGPerM2"],
  },
  [lvMassLinear, {
    calculation: indexedToBsa(LV_MASS),
    inputs: { lvMass: "lvMassG", bsaM2: "bodySurfaceAreaM2" },
    outputs: { lvMassIndex: "lvMassIndexGPerM2" },
  }],
  {
    id: "lvMassIndex",
    title: "LV mass index (linear method)",
    description: "LV mass by the cube formula divided by body surface area.",
  },
);

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
    posteriorWallThicknessDiastoleCm: POSTERIOR_WALL_THICKNESS,
    lvInternalDiameterDiastoleCm: LV_END_DIASTOLIC_DIAMETER,
  },
  outputs: { relativeWallThickness: RELATIVE_WALL_THICKNESS },
  formula: ({ posteriorWallThicknessDiastoleCm, lvInternalDiameterDiastoleCm }) => ({
    relativeWallThickness: (2 * posteriorWallThicknessDiastoleCm) / lvInternalDiameterDiastoleCm,
  }),
  formulaText: "RWT = 2·LVPWd/LVIDd",
  citations: [LANG_2015, GANAU_1992],
  cautions: [],
  clinical: true,
});

/**
 * The three numbers of LV geometry from one set of calipers, as the chain
 * {@linkcode lvMassIndex} → {@linkcode relativeWallThickness} (LVIDd and LVPWd shared by name).
 * Computing them together keeps their shared dependence on LVIDd and LVPWd when uncertainty is
 * propagated: the GUM output covariance, and the trial-aligned Monte Carlo samples that
 * {@linkcode lvGeometryProbabilities} classifies.
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
 * assert.equal(r.relativeWallThickness, 0.5); // 2·1.2/4.8, hand-checkable
 * assert.equal(classifyLvGeometry({ ...r, sex: "male" }).geometry, "concentric hypertrophy");
 * ```
 */
export const lvGeometryMeasures: Calculation<
  | "septalThicknessDiastoleCm"
  | "lvInternalDiameterDiastoleCm"
  | "posteriorWallThicknessDiastoleCm"
  | "bodySurfaceAreaM2",
  "lvMassG" | "lvMassIndexGPerM2" | "relativeWallThickness"
> = chain([lvMassIndex, relativeWallThickness], {
  id: "lvGeometryMeasures",
  title: "LV mass, mass index and relative wall thickness",
  description:
    "The measurements that define LV geometry, computed together from one set of end-diastolic linear dimensions.",
});
