/**
 * LV geometry: the four-way classification (normal, concentric remodeling, concentric or
 * eccentric hypertrophy) from relative wall thickness and LV mass index, its sex-specific limits
 * taken from the adult reference table with their provenance, and the class probabilities given
 * the uncertainty of the calipers and BSA (a Monte Carlo propagation of the LV geometry measures,
 * classified trial by trial).
 *
 * @module
 */
import { CLINICAL_CAUTION, defineArguments } from "../core/calculation.ts";
import type { Citation, Quantity } from "../core/types.ts";
import { validateInputs } from "../core/validate.ts";
import { throwIfErrors } from "../core/issues.ts";
import { describeValue, withUnit } from "../core/text.ts";
import { LV_MASS_INDEX, RELATIVE_WALL_THICKNESS } from "../quantities/structure.ts";
import { adultReferenceRow } from "../reference/adult.ts";
import { propagate, type PropagateOptions } from "../uncertainty/propagate.ts";
import { isUncertainValue } from "../uncertainty/uncertain_value.ts";
import type { UncertainInputs } from "../uncertainty/prepare.ts";
import { lvGeometryMeasures } from "./linear.ts";
import type {
  LvGeometry,
  LvGeometryClassification,
  LvGeometryInput,
  LvGeometryLimit,
  LvGeometryLimits,
  LvGeometryProbabilities,
  Sex,
} from "./types.ts";
import { JUPYTER_DISPLAY } from "../../display/mime.ts";
import { displayLvGeometryProbabilities } from "../../display/chamber.ts";

/** The classes in the order results list them. */
const CLASSES: readonly LvGeometry[] = [
  "normal",
  "concentric remodeling",
  "concentric hypertrophy",
  "eccentric hypertrophy",
];

const SEX_WORD: Readonly<Record<Sex, string>> = { male: "men", female: "women" };

/** The upper normal limit of `quantity` for `sex` from a row of the adult reference table. */
function limitOf(quantity: Quantity, parameter: string, sex: Sex): LvGeometryLimit {
  const row = adultReferenceRow(parameter, sex);
  const { lower, upper } = row.normal;
  if (upper === undefined || row.printedUnit !== quantity.unit) {
    throw new TypeError(
      `LV geometry limits: expected the reference row '${parameter}' (${sex}) to give an upper normal ${quantity.label} in ${quantity.unit}, got ${upper} ${row.printedUnit}`,
    );
  }
  const range = withUnit(`${lower ?? "−∞"}–${upper}`, row.printedUnit);
  return Object.freeze({
    quantity,
    upperNormal: upper,
    citation: { ...row.source, locator: row.table },
    fromMemory: row.fromMemory,
    provenance: `${shortCitation(row.source, row.table)}, ${row.method}, ${
      SEX_WORD[sex]
    }: normal range ${range}${
      row.fromMemory ? " (entered from memory: verify against the guideline)" : ""
    }`,
  });
}

/** "Lang 2015 Table 6": first author, year and locator. */
function shortCitation(citation: Citation, locator: string): string {
  return `${citation.authors.split(" ")[0]} ${citation.year} ${locator}`;
}

function limitsFor(sex: Sex): LvGeometryLimits {
  return Object.freeze({
    relativeWallThickness: limitOf(RELATIVE_WALL_THICKNESS, "relativeWallThickness", sex),
    lvMassIndexGPerM2: limitOf(LV_MASS_INDEX, "lvMassIndexLinear", sex),
  });
}

/**
 * The limits of the four-way LV geometry classification for each sex: upper normal relative wall
 * thickness and LV mass index (linear method), taken from the adult reference table
 * ({@linkcode ADULT_REFERENCE_LANG_2015}, the one copy of these numbers) with their citation and
 * provenance; "entered from memory" travels with them where the table says so.
 *
 * @example
 * ```ts
 * import { adultReferenceRow, LV_GEOMETRY_LIMITS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const men = LV_GEOMETRY_LIMITS.male.lvMassIndexGPerM2;
 * assert.equal(men.upperNormal, adultReferenceRow("lvMassIndexLinear", "male").normal.upper);
 * assert.match(men.provenance, /Table 6/);
 * ```
 */
export const LV_GEOMETRY_LIMITS: Readonly<Record<Sex, LvGeometryLimits>> = Object.freeze({
  male: limitsFor("male"),
  female: limitsFor("female"),
});

const WHERE_CLASSIFY = "LV geometry classification";
const WHERE_PROBABILITIES = "LV geometry probabilities";

function checkSex(sex: unknown, where: string): Sex {
  if (sex !== "male" && sex !== "female") {
    throwIfErrors([{
      kind: "type",
      severity: "error",
      where,
      field: "sex",
      received: describeValue(sex),
      expected: 'as "male" or "female"',
    }]);
  }
  return sex as Sex;
}

/** The class of one pair of values: increased means strictly above the upper normal limit. */
function geometryOf(rwt: number, massIndex: number, limits: LvGeometryLimits): LvGeometry {
  const thick = rwt > limits.relativeWallThickness.upperNormal;
  const heavy = massIndex > limits.lvMassIndexGPerM2.upperNormal;
  if (heavy) return thick ? "concentric hypertrophy" : "eccentric hypertrophy";
  return thick ? "concentric remodeling" : "normal";
}

/** The cautions of a geometry result: the method of the limits, which limits were entered from
 * memory (their provenance is in `limits`), the clinical caution. */
function geometryCautions(limits: LvGeometryLimits): string[] {
  const recalled = [limits.relativeWallThickness, limits.lvMassIndexGPerM2].filter((l) =>
    l.fromMemory
  );
  const sources = [...new Set(recalled.map((l) => shortCitation(l.citation, l.citation.locator!)))];
  return [
    "Mass-index limits apply to the linear (cube) method in adults",
    ...(recalled.length > 0
      ? [
        `Upper normal limits of ${
          recalled.map((l) => l.quantity.label).join(" and ")
        } entered from memory of ${sources.join(" and ")}: verify against the guideline`,
      ]
      : []),
    CLINICAL_CAUTION,
  ];
}

const CLASSIFY_ARGUMENTS = defineArguments(WHERE_CLASSIFY, {
  relativeWallThickness: RELATIVE_WALL_THICKNESS,
  lvMassIndexGPerM2: LV_MASS_INDEX,
});

/**
 * Classifies LV geometry into normal, concentric remodeling, concentric hypertrophy or eccentric
 * hypertrophy from relative wall thickness and LV mass index.
 *
 * Rule: increased RWT is above its upper normal limit (0.42); increased mass index is above the
 * sex-specific upper normal limit of the linear method (115 g/m² for men, 95 g/m² for women; both
 * from {@linkcode LV_GEOMETRY_LIMITS}). Normal mass + normal RWT → normal; normal mass + increased
 * RWT → concentric remodeling; increased mass + increased RWT → concentric hypertrophy;
 * increased mass + normal RWT → eccentric hypertrophy. Values exactly at a limit count as normal.
 *
 * Source: Lang RM et al., J Am Soc Echocardiogr 2015;28:1–39 (LV geometry figure and LV mass
 * table, linear method); Ganau A et al., J Am Coll Cardiol 1992;19:1550–1558.
 *
 * @param values RWT, LV mass index (g/m², linear method) and sex; other fields are ignored, so
 * the outputs of {@linkcode lvGeometryMeasures} can be passed as they are.
 * @returns The class, the limits used with their provenance, and cautions.
 * @throws {TypeError} When sex is not "male" or "female", or a value is missing or not a number.
 * @throws {RangeError} When RWT or the mass index is outside its valid range.
 *
 * @example
 * ```ts
 * import { classifyLvGeometry } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const g = classifyLvGeometry({ relativeWallThickness: 0.48, lvMassIndexGPerM2: 90, sex: "male" });
 * assert.equal(g.geometry, "concentric remodeling"); // 0.48 > 0.42, 90 ≤ 115 (Lang 2015)
 * ```
 */
export function classifyLvGeometry(values: {
  readonly relativeWallThickness: number;
  readonly lvMassIndexGPerM2: number;
  readonly sex: Sex;
}): LvGeometryClassification {
  if (typeof values !== "object" || values === null) {
    throwIfErrors([{
      kind: "type",
      severity: "error",
      where: WHERE_CLASSIFY,
      field: "values",
      received: describeValue(values),
      expected: "as an object with relativeWallThickness, lvMassIndexGPerM2 and sex",
    }]);
  }
  const limits = LV_GEOMETRY_LIMITS[checkSex(values.sex, WHERE_CLASSIFY)];
  const { values: x } = validateInputs(CLASSIFY_ARGUMENTS, {
    relativeWallThickness: values.relativeWallThickness,
    lvMassIndexGPerM2: values.lvMassIndexGPerM2,
  });
  return {
    geometry: geometryOf(x.relativeWallThickness, x.lvMassIndexGPerM2, limits),
    relativeWallThicknessLimit: limits.relativeWallThickness.upperNormal,
    lvMassIndexLimitGPerM2: limits.lvMassIndexGPerM2.upperNormal,
    limits,
    cautions: geometryCautions(limits),
  };
}

/** Inputs of {@linkcode lvGeometryProbabilities}: the linear dimensions and BSA, each exact, a
 * distribution (`normal(...)`, `rectangular(...)`, ...) or a Monte Carlo value of an earlier
 * step. */
export type LvGeometryUncertainInputs = UncertainInputs<LvGeometryInput>;

/** Options of {@linkcode lvGeometryProbabilities}: those of a Monte Carlo propagation. */
export type LvGeometryProbabilityOptions = Pick<
  PropagateOptions,
  "trials" | "seed" | "correlations" | "label" | "population"
>;

/**
 * Probability of each LV geometry class given the uncertainty of the calipers and BSA, by Monte
 * Carlo (JCGM 101:2008): {@linkcode lvGeometryMeasures} is propagated with `propagate(…, {
 * method: "monteCarlo" })`, and the trial-aligned samples of LV mass index and RWT are classified
 * trial by trial with {@linkcode classifyLvGeometry}'s rule, so the shared dependence of RWT and
 * mass on LVIDd and LVPWd is kept. A class probability is the fraction of trials in the class,
 * with its binomial standard error √(p·(1 − p)/M).
 *
 * @param inputs Dimensions (cm) and BSA (m²): exact numbers, distributions or Monte Carlo values.
 * @param sex "male" or "female" (selects the mass-index limit).
 * @param options Monte Carlo options (`trials`, default 100000, or that of an input's Monte Carlo
 * run; `seed`; `correlations`; `label`; `population`).
 * @returns Class probabilities and their standard errors, the most probable class, the
 * propagation of the measures, the limits with their provenance, warnings and cautions; it
 * displays itself in a notebook.
 * @throws {TypeError} For an invalid sex or malformed inputs.
 * @throws {RangeError} For input estimates outside their valid ranges, or bad trials or seed.
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
  options: LvGeometryProbabilityOptions = {},
): LvGeometryProbabilities {
  const limits = LV_GEOMETRY_LIMITS[checkSex(sex, WHERE_PROBABILITIES)];
  // an input from an earlier Monte Carlo run brings its trials (one chain, one run)
  const fromRun = typeof inputs === "object" && inputs !== null &&
    Object.values(inputs).some(isUncertainValue);
  const measures = propagate(lvGeometryMeasures, inputs, {
    ...(fromRun ? {} : { trials: 100_000 }),
    ...options,
    method: "monteCarlo",
    keepSamples: true,
  });
  const lvmi = measures.outputs.lvMassIndexGPerM2.samples;
  const rwt = measures.outputs.relativeWallThickness.samples;
  const m = measures.monteCarlo!.trials;
  const counts = new Map<LvGeometry, number>(CLASSES.map((c) => [c, 0]));
  for (let k = 0; k < m; k++) {
    const c = geometryOf(rwt![k]!, lvmi![k]!, limits);
    counts.set(c, counts.get(c)! + 1);
  }
  const probabilities = {} as Record<LvGeometry, number>;
  const standardErrors = {} as Record<LvGeometry, number>;
  let mostProbable: LvGeometry = CLASSES[0]!;
  for (const c of CLASSES) {
    const p = counts.get(c)! / m;
    probabilities[c] = p;
    standardErrors[c] = Math.sqrt((p * (1 - p)) / m);
    if (p > probabilities[mostProbable]) mostProbable = c;
  }
  const result: LvGeometryProbabilities & { [JUPYTER_DISPLAY](): unknown } = {
    kind: "sonorigor.lvGeometryProbabilities",
    sex: sex as Sex,
    probabilities,
    standardErrors,
    mostProbable,
    measures,
    limits,
    trials: m,
    seed: measures.monteCarlo!.seed,
    warnings: measures.warnings,
    cautions: [
      ...new Set([
        ...lvGeometryMeasures.cautions,
        "Class probabilities reflect only the uncertainties given for the inputs; they are not the probability of disease",
        ...geometryCautions(limits),
      ]),
    ],
    [JUPYTER_DISPLAY]: () => displayLvGeometryProbabilities(result),
  };
  return result;
}
