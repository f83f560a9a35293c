/**
 * The error of a BSA formula: a height–weight formula estimates the body surface area of a person
 * of average build; the true area of a given person differs by a few percent, more in obesity.
 * Carried as a relative factor on the formula's BSA, its source named in the budget label.
 *
 * @module
 */
import { defineArguments, defineCalculation } from "../core/calculation.ts";
import type { Calculation } from "../core/types.ts";
import { validateInputs } from "../core/validate.ts";
import { BODY_SURFACE_AREA } from "../quantities/body.ts";
import { BSA_FORMULA_FACTOR, RELATIVE_ERROR_LIMIT } from "../quantities/uncertainty.ts";
import { recalledSourceCautions } from "../citations.ts";
import { rectangular } from "../uncertainty/distributions.ts";
import { propagate, type PropagateOptions } from "../uncertainty/propagate.ts";
import type { UncertainArgument } from "../uncertainty/prepare.ts";
import type { Propagation } from "../uncertainty/types.ts";
import { JCGM_100, LIVINGSTON_LEE_2001, VERBRAECKEN_2006 } from "./citations.ts";
import { notAnObject } from "./shared.ts";

const FORMULA_ERROR_CITATIONS = [VERBRAECKEN_2006, LIVINGSTON_LEE_2001, JCGM_100];

/**
 * BSA with the formula's error: the formula's BSA times a factor for the person's departure
 * from the formula (a chain step after any BSA formula, with the formula's output renamed to
 * `formulaBsaM2`).
 *
 * Formula: BSA = BSA_formula · f, f the BSA formula factor (1 on average).
 *
 * Source: the size of the factor's spread, Verbraecken et al. 2006 (formulas compared in obese
 * adults; size from memory) and Livingston & Lee 2001 (DuBois underestimated BSA in obese
 * patients by as much as 20 %).
 *
 * @example 2.0 m² by a formula, 3 % more in this person
 * ```ts
 * import { bsaWithFormulaError, evaluate } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = evaluate(bsaWithFormulaError, { formulaBsaM2: 2, bsaFormulaFactor: 1.03 });
 * assert.ok(Math.abs(r.outputs.bsaM2 - 2.06) < 1e-12);
 * ```
 */
export const bsaWithFormulaError: Calculation<"formulaBsaM2" | "bsaFormulaFactor", "bsaM2"> =
  defineCalculation({
    id: "bsaWithFormulaError",
    title: "BSA with the formula's error",
    description:
      "Body surface area from a height–weight formula times a factor for this person's departure from the formula.",
    inputs: {
      formulaBsaM2: {
        quantity: BODY_SURFACE_AREA,
        label: "BSA by the formula",
        description: "Body surface area from a height–weight formula",
      },
      bsaFormulaFactor: BSA_FORMULA_FACTOR,
    },
    outputs: {
      bsaM2: {
        quantity: BODY_SURFACE_AREA,
        label: "BSA with the formula's error",
        description: "Body surface area with the formula's error for this person",
      },
    },
    formula: ({ formulaBsaM2, bsaFormulaFactor }) => ({ bsaM2: formulaBsaM2 * bsaFormulaFactor }),
    formulaText: "BSA = BSA_formula · f",
    citations: FORMULA_ERROR_CITATIONS,
    cautions: [
      "The formulas' error grows with obesity: widen the limit for a very obese patient",
      ...recalledSourceCautions(FORMULA_ERROR_CITATIONS),
    ],
    clinical: true,
  });

/** The default limit of the formula's relative error, %, and where it comes from. */
const DEFAULT_LIMIT_PERCENT = 5;
const DEFAULT_LIMIT_SOURCE = "Verbraecken 2006, from memory";

const LIMIT_ARGUMENTS = defineArguments("BSA formula error", {
  limitPercent: {
    quantity: RELATIVE_ERROR_LIMIT,
    label: "BSA formula error limit",
    description: "The formula's relative error lies within ± this percentage",
    valid: { min: 0, max: 50, minExclusive: true },
    typical: { min: 1, max: 25 },
    reason: "a zero limit is no error; beyond ±50 % no formula is usable",
    default: DEFAULT_LIMIT_PERCENT,
  },
});

/** Options of {@linkcode withBsaFormulaError}. */
export interface BsaFormulaErrorOptions
  extends Pick<PropagateOptions, "method" | "trials" | "seed" | "coverage"> {
  /** The formula's relative error lies within ± this percentage (rectangular).
   * @default 5 (Verbraecken et al. 2006, from memory) */
  readonly limitPercent?: number;
  /** Where a limit given here comes from, for the budget label. @default "given" */
  readonly limitSource?: string;
}

/**
 * A BSA with its formula's error, as an uncertain value whose budget label names the limit and
 * its source: the BSA (a number, a distribution, or the output of a BSA formula's propagation)
 * times the factor f ~ rectangular(1 − a, 1 + a), propagated through
 * {@linkcode bsaWithFormulaError}. Feed `outputs.bsaM2` to an indexing step: the formula's
 * error reaches the indexed value with its label.
 *
 * Formula: BSA = BSA_formula · f; u_r(f) = a/√3 (rectangular over ±a, JCGM 100:2008 §4.3.7).
 *
 * Source: the default a = 5 %, Verbraecken et al. 2006 (the formulas err by a few percent in
 * obese adults; from memory); Livingston & Lee 2001 report DuBois underestimating BSA in obese
 * patients by as much as 20 %, so give a wider limit for a very obese patient.
 *
 * @param bsa The formula's BSA, m².
 * @param options The limit (%) and its source, and the propagation's method options.
 * @returns The propagation; `outputs.bsaM2` carries the factor as a source labelled
 * "BSA formula error within ±5 % (Verbraecken 2006, from memory): BSA formula factor".
 * @throws {TypeError | RangeError} For a BSA or limit outside its range, or options of the wrong
 * type.
 *
 * @example u_r = 5 %/√3 = 2.89 % on a 1.9 m² BSA
 * ```ts
 * import { withBsaFormulaError } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = withBsaFormulaError(1.9);
 * assert.ok(Math.abs(r.outputs.bsaM2.standardUncertainty - 1.9 * 0.05 / Math.sqrt(3)) < 1e-9);
 * assert.match(r.outputs.bsaM2.budget[0]!.label, /from memory/);
 * ```
 */
export function withBsaFormulaError(
  bsa: UncertainArgument,
  options: BsaFormulaErrorOptions = {},
): Propagation<"formulaBsaM2" | "bsaFormulaFactor", "bsaM2"> {
  if (typeof options !== "object" || options === null) {
    throw notAnObject(LIMIT_ARGUMENTS.title, "options", options, "as an object of options");
  }
  const { limitPercent, limitSource, ...method } = options;
  const { values } = validateInputs(
    LIMIT_ARGUMENTS,
    limitPercent === undefined ? {} : { limitPercent },
  );
  const a = values.limitPercent / 100;
  const source = limitPercent === undefined ? DEFAULT_LIMIT_SOURCE : limitSource ?? "given";
  return propagate(
    bsaWithFormulaError,
    { formulaBsaM2: bsa, bsaFormulaFactor: rectangular(1 - a, 1 + a) },
    { ...method, label: `BSA formula error within ±${values.limitPercent} % (${source})` },
  );
}
