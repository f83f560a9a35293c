/**
 * Notebook displays of chamber results: the LV geometry class probabilities with the measures
 * they were classified from, the limits with their provenance, warnings and cautions.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type { LvGeometry, LvGeometryProbabilities } from "../calc/chamber/types.ts";
import { withUnit } from "../calc/core/text.ts";
import { tableBundle } from "./mime.ts";
import { formatResolution, formatShare } from "./format.ts";
import { formatUncertainValue } from "./uncertainty.ts";

const HEADER = ["LV geometry", "Probability", "Monte Carlo standard error"];

const SEX_WORD: Readonly<Record<LvGeometryProbabilities["sex"], string>> = {
  male: "man",
  female: "woman",
};

/**
 * The MIME bundle of LV geometry class probabilities: a row per class (probability and its Monte
 * Carlo standard error), then the measures classified (LV mass index and relative wall thickness
 * with their Monte Carlo intervals, labels from their quantities), the limits with their
 * provenance ("entered from memory" where that is the case), warnings and cautions (the clinical
 * caution among them).
 *
 * @param result A result of `lvGeometryProbabilities`.
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { displayLvGeometryProbabilities, lvGeometryProbabilities } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const p = lvGeometryProbabilities({
 *   septalThicknessDiastoleCm: 1.3,
 *   lvInternalDiameterDiastoleCm: 4.8,
 *   posteriorWallThicknessDiastoleCm: 1.2,
 *   bodySurfaceAreaM2: 1.9,
 * }, "male", { trials: 1000, seed: 1 });
 * const text = String(displayLvGeometryProbabilities(p)["text/plain"]);
 * // exact calipers: LVMi 122 g/m² > 115 and RWT 0.5 > 0.42 in every trial (Lang 2015 limits)
 * assert.match(text, /concentric hypertrophy \(most probable\)\s+100\.0 %/);
 * assert.match(text, /LV mass index/);
 * assert.match(text, /from memory/);
 * assert.match(text, /Not a diagnosis/);
 * ```
 */
export function displayLvGeometryProbabilities(result: LvGeometryProbabilities): MimeBundle {
  const classes = Object.keys(result.probabilities) as LvGeometry[];
  const rows = classes.map((c) => [
    c === result.mostProbable ? `${c} (most probable)` : c,
    formatShare(result.probabilities[c]),
    formatShare(result.standardErrors[c]),
  ]);
  const measures = result.measures.outputs;
  const limits = [result.limits.lvMassIndexGPerM2, result.limits.relativeWallThickness].map(
    (l) =>
      `${l.quantity.label}: upper normal ${
        withUnit(formatResolution(l.upperNormal, l.quantity.resolution), l.quantity.unit)
      }; ${l.provenance}`,
  );
  return tableBundle(
    `LV geometry of a ${
      SEX_WORD[result.sex]
    }: class probabilities by Monte Carlo (JCGM 101:2008), ${result.trials} trials, seed ${result.seed}`,
    HEADER,
    rows,
    {
      Measures: [
        formatUncertainValue(measures.lvMassIndexGPerM2),
        formatUncertainValue(measures.relativeWallThickness),
      ],
      Limits: limits,
      Warnings: result.warnings,
      Cautions: result.cautions,
    },
  );
}
