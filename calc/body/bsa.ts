/**
 * Body surface area (BSA) from height and weight: five published height–weight formulas, each
 * defined once with {@linkcode defineCalculation}.
 *
 * @module
 */
import { defineCalculation, type InputRole } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import { BODY_SURFACE_AREA, HEIGHT, WEIGHT } from "../quantities/body.ts";

/** Height as the BSA formulas take it: the formulas are fitted from infancy to adulthood. */
const HEIGHT_INPUT: InputRole = {
  quantity: HEIGHT,
  typical: { min: 45, max: 220 },
  typicalPediatric: { min: 45, max: 190 },
  reason: "the range the BSA formulas were fitted on, term newborn to very tall adult",
};

/** Weight as the BSA formulas take it. */
const WEIGHT_INPUT: InputRole = {
  quantity: WEIGHT,
  typical: { min: 2, max: 200 },
  typicalPediatric: { min: 2, max: 120 },
  reason: "the range the BSA formulas were fitted on, term newborn to very heavy adult",
};

const BSA_OUTPUT = { bsaM2: BODY_SURFACE_AREA } as const;

const BSA_CAUTIONS = [
  "BSA formulas were derived on small samples; values differ between formulas by a few percent, more at the extremes of body size",
  "Use the BSA formula that the reference range or Z-score model was built with",
];

/**
 * Body surface area by Mosteller's simplified formula.
 *
 * Formula: BSA [m²] = √(H [cm] · W [kg] / 3600)
 *
 * Source: Mosteller RD. Simplified calculation of body-surface area. N Engl J Med
 * 1987;317(17):1098.
 *
 * @throws {RangeError} (through `evaluate`) for height or weight outside the human range.
 *
 * @example
 * ```ts
 * import { bsaMosteller, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // √(180·80/3600) = √4 = 2 m² exactly (hand-checkable from the published formula)
 * assert.equal(evaluate(bsaMosteller, { heightCm: 180, weightKg: 80 }).outputs.bsaM2, 2);
 * ```
 */
export const bsaMosteller: Calculation<"heightCm" | "weightKg", "bsaM2"> = defineCalculation({
  id: "bsaMosteller",
  title: "Body surface area (Mosteller)",
  description: "Body surface area from height and weight by Mosteller's square-root formula.",
  inputs: { heightCm: HEIGHT_INPUT, weightKg: WEIGHT_INPUT },
  outputs: BSA_OUTPUT,
  formula: ({ heightCm, weightKg }) => ({ bsaM2: Math.sqrt((heightCm * weightKg) / 3600) }),
  formulaText: "BSA = √(H·W / 3600)  (H in cm, W in kg, BSA in m²)",
  citations: [{
    authors: "Mosteller RD",
    year: 1987,
    title: "Simplified calculation of body-surface area",
    publication: "N Engl J Med 1987;317(17):1098",
    doi: "10.1056/NEJM198710223171717",
  }],
  cautions: BSA_CAUTIONS,
  clinical: true,
});

/**
 * Body surface area by the DuBois & DuBois formula.
 *
 * Formula: BSA [m²] = 0.007184 · W [kg]^0.425 · H [cm]^0.725 (the original 71.84 with BSA in
 * cm² rescaled to m²)
 *
 * Source: DuBois D, DuBois EF. A formula to estimate the approximate surface area if height and
 * weight be known. Arch Intern Med 1916;17(6_2):863–871.
 *
 * @throws {RangeError} (through `evaluate`) for height or weight outside the human range.
 *
 * @example
 * ```ts
 * import { bsaDuBois, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0.007184 · 80^0.425 · 180^0.725 = 1.9964 m² (hand computation of the published formula)
 * const { bsaM2 } = evaluate(bsaDuBois, { heightCm: 180, weightKg: 80 }).outputs;
 * assert.ok(Math.abs(bsaM2 - 1.9964) < 1e-4);
 * ```
 */
export const bsaDuBois: Calculation<"heightCm" | "weightKg", "bsaM2"> = defineCalculation({
  id: "bsaDuBois",
  title: "Body surface area (DuBois & DuBois)",
  description: "Body surface area from height and weight by the DuBois & DuBois power law.",
  inputs: { heightCm: HEIGHT_INPUT, weightKg: WEIGHT_INPUT },
  outputs: BSA_OUTPUT,
  formula: ({ heightCm, weightKg }) => ({
    bsaM2: 0.007184 * weightKg ** 0.425 * heightCm ** 0.725,
  }),
  formulaText: "BSA = 0.007184 · W^0.425 · H^0.725  (H in cm, W in kg, BSA in m²)",
  citations: [{
    authors: "DuBois D, DuBois EF",
    year: 1916,
    title: "A formula to estimate the approximate surface area if height and weight be known",
    publication: "Arch Intern Med 1916;17(6_2):863–871",
    doi: "10.1001/archinte.1916.00080130010002",
  }],
  cautions: [
    ...BSA_CAUTIONS,
    "Derived from nine subjects, none of them an infant: underestimates BSA in small children",
  ],
  clinical: true,
});

/**
 * Body surface area by the Haycock formula (validated in infants, children and adults; the BSA
 * used by the Pediatric Heart Network Z-score models).
 *
 * Formula: BSA [m²] = 0.024265 · W [kg]^0.5378 · H [cm]^0.3964
 *
 * Source: Haycock GB, Schwartz GJ, Wisotsky DH. Geometric method for measuring body surface
 * area: a height-weight formula validated in infants, children, and adults. J Pediatr
 * 1978;93(1):62–66.
 *
 * @throws {RangeError} (through `evaluate`) for height or weight outside the human range.
 *
 * @example
 * ```ts
 * import { bsaHaycock, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0.024265 · 80^0.5378 · 180^0.3964 = 2.0066 m² (hand computation of the published formula)
 * const { bsaM2 } = evaluate(bsaHaycock, { heightCm: 180, weightKg: 80 }).outputs;
 * assert.ok(Math.abs(bsaM2 - 2.0066) < 1e-4);
 * ```
 */
export const bsaHaycock: Calculation<"heightCm" | "weightKg", "bsaM2"> = defineCalculation({
  id: "bsaHaycock",
  title: "Body surface area (Haycock)",
  description:
    "Body surface area from height and weight by the Haycock power law, validated from infancy to adulthood.",
  inputs: { heightCm: HEIGHT_INPUT, weightKg: WEIGHT_INPUT },
  outputs: BSA_OUTPUT,
  formula: ({ heightCm, weightKg }) => ({
    bsaM2: 0.024265 * weightKg ** 0.5378 * heightCm ** 0.3964,
  }),
  formulaText: "BSA = 0.024265 · W^0.5378 · H^0.3964  (H in cm, W in kg, BSA in m²)",
  citations: [{
    authors: "Haycock GB, Schwartz GJ, Wisotsky DH",
    year: 1978,
    title:
      "Geometric method for measuring body surface area: a height-weight formula validated in infants, children, and adults",
    publication: "J Pediatr 1978;93(1):62–66",
    doi: "10.1016/s0022-3476(78)80601-5",
  }],
  cautions: BSA_CAUTIONS,
  clinical: true,
});

/**
 * Body surface area by the Gehan & George formula.
 *
 * Formula: BSA [m²] = 0.0235 · W [kg]^0.51456 · H [cm]^0.42246
 *
 * Source: Gehan EA, George SL. Estimation of human body surface area from height and weight.
 * Cancer Chemother Rep 1970;54(4):225–235.
 *
 * @throws {RangeError} (through `evaluate`) for height or weight outside the human range.
 *
 * @example
 * ```ts
 * import { bsaGehanGeorge, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0.0235 · 80^0.51456 · 180^0.42246 = 2.0095 m² (hand computation of the published formula)
 * const { bsaM2 } = evaluate(bsaGehanGeorge, { heightCm: 180, weightKg: 80 }).outputs;
 * assert.ok(Math.abs(bsaM2 - 2.0095) < 1e-4);
 * ```
 */
export const bsaGehanGeorge: Calculation<"heightCm" | "weightKg", "bsaM2"> = defineCalculation({
  id: "bsaGehanGeorge",
  title: "Body surface area (Gehan & George)",
  description: "Body surface area from height and weight by the Gehan & George power law.",
  inputs: { heightCm: HEIGHT_INPUT, weightKg: WEIGHT_INPUT },
  outputs: BSA_OUTPUT,
  formula: ({ heightCm, weightKg }) => ({
    bsaM2: 0.0235 * weightKg ** 0.51456 * heightCm ** 0.42246,
  }),
  formulaText: "BSA = 0.0235 · W^0.51456 · H^0.42246  (H in cm, W in kg, BSA in m²)",
  citations: [{
    authors: "Gehan EA, George SL",
    year: 1970,
    title: "Estimation of human body surface area from height and weight",
    publication: "Cancer Chemother Rep 1970;54(4):225–235",
  }],
  cautions: BSA_CAUTIONS,
  clinical: true,
});

/**
 * Body surface area by Boyd's formula, whose weight term is in grams and whose weight exponent
 * falls with weight.
 *
 * Formula: BSA [m²] = 0.0003207 · H [cm]^0.3 · Wg^(0.7285 − 0.0188 · log10 Wg), with
 * Wg = 1000 · W [kg] the weight in grams (Boyd's 3.207 with BSA in cm² rescaled to m²).
 *
 * Source: Boyd E. The Growth of the Surface Area of the Human Body. University of Minnesota
 * Press, Minneapolis, 1935 (Institute of Child Welfare Monograph Series No. 10).
 *
 * @param weightKg Weight in kg (converted to grams inside), valid [0.2, 650], typical [2, 200].
 * @throws {RangeError} (through `evaluate`) for height or weight outside the human range.
 *
 * @example
 * ```ts
 * import { bsaBoyd, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // 0.0003207 · 180^0.3 · 80000^(0.7285 − 0.0188·log10 80000) = 2.0074 m²
 * // (hand computation of the published formula)
 * const { bsaM2 } = evaluate(bsaBoyd, { heightCm: 180, weightKg: 80 }).outputs;
 * assert.ok(Math.abs(bsaM2 - 2.0074) < 1e-4);
 * ```
 */
export const bsaBoyd: Calculation<"heightCm" | "weightKg", "bsaM2"> = defineCalculation({
  id: "bsaBoyd",
  title: "Body surface area (Boyd)",
  description:
    "Body surface area from height and weight by Boyd's formula with a weight-dependent exponent (weight in grams).",
  inputs: { heightCm: HEIGHT_INPUT, weightKg: WEIGHT_INPUT },
  outputs: BSA_OUTPUT,
  formula: ({ heightCm, weightKg }) => {
    const grams = 1000 * weightKg;
    return { bsaM2: 0.0003207 * heightCm ** 0.3 * grams ** (0.7285 - 0.0188 * Math.log10(grams)) };
  },
  formulaText:
    "BSA = 0.0003207 · H^0.3 · Wg^(0.7285 − 0.0188·log10 Wg)  (H in cm, Wg in g, BSA in m²)",
  citations: [{
    authors: "Boyd E",
    year: 1935,
    title: "The Growth of the Surface Area of the Human Body",
    publication:
      "University of Minnesota Press, Minneapolis (Institute of Child Welfare Monograph 10)",
  }],
  cautions: BSA_CAUTIONS,
  clinical: true,
});

/** The BSA formula names accepted by the helpers that take a method. */
export type BsaMethod = "mosteller" | "duBois" | "haycock" | "gehanGeorge" | "boyd";

/**
 * The BSA calculations by method name. Each entry is the one definition of that formula.
 *
 * @example
 * ```ts
 * import { BSA_METHODS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(BSA_METHODS.haycock.id.length > 0, true);
 * ```
 */
export const BSA_METHODS: Readonly<
  Record<BsaMethod, Calculation<"heightCm" | "weightKg", "bsaM2">>
> = Object.freeze({
  mosteller: bsaMosteller,
  duBois: bsaDuBois,
  haycock: bsaHaycock,
  gehanGeorge: bsaGehanGeorge,
  boyd: bsaBoyd,
});

/**
 * The BSA calculation for a method name.
 *
 * @param method One of "mosteller", "duBois", "haycock", "gehanGeorge", "boyd".
 * @returns The calculation.
 * @throws {TypeError} For an unknown method name.
 *
 * @example
 * ```ts
 * import { bsaCalculation, bsaHaycock } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(bsaCalculation("haycock"), bsaHaycock);
 * ```
 */
export function bsaCalculation(
  method: BsaMethod,
): Calculation<"heightCm" | "weightKg", "bsaM2"> {
  const calc = Object.hasOwn(BSA_METHODS, method) ? BSA_METHODS[method] : undefined;
  if (calc === undefined) {
    throw new TypeError(
      `Body surface area: expected a method in ${Object.keys(BSA_METHODS).join(", ")}, got ${
        JSON.stringify(method)
      }`,
    );
  }
  return calc;
}
