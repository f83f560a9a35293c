/**
 * Notebook displays of reference-range results: a Z-score with its normal range, uncertainty,
 * tail probabilities, flags and cautions (the coefficients' provenance among them); the normal
 * limits of a model at one BSA; Z-scores of one measurement under several models. Labels and units
 * come from the measured quantity; measurements are rounded to its display resolution, Z-scores
 * to two decimals (or, with an uncertainty, by the metrology rule), missing values shown as "not
 * measured".
 *
 * @module
 */
import type { MimeBundle, Quantity } from "../calc/core/types.ts";
import type { NormalLimits, ZScoreComparisonRow, ZScoreResult } from "../calc/reference/types.ts";
import { withUnit } from "../calc/core/text.ts";
import { tableBundle } from "./mime.ts";
import { formatNumber, formatResolution, formatShare, NOT_MEASURED, roundLike } from "./format.ts";
import { labelWithUnit } from "./uncertainty.ts";

export { JUPYTER_DISPLAY } from "./mime.ts";

/** BSA as shown beside a Z-score: two decimals (m², common practice, no source). */
const BSA_RESOLUTION = 0.01;

/**
 * A Z-score as shown: two decimals with a true minus sign; "not measured" when missing.
 *
 * @example
 * ```ts
 * import { formatZScore } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * assert.equal(formatZScore(-2.4444), "−2.44");
 * assert.equal(formatZScore(null), "not measured");
 * ```
 */
export function formatZScore(z: number | null): string {
  if (z === null || !Number.isFinite(z)) return NOT_MEASURED;
  return formatResolution(z, 0.01).replace("-", "−");
}

/** A measurement of a quantity, rounded to its resolution, with its unit. */
function measured(value: number, q: Pick<Quantity, "resolution" | "unit">, unit = q.unit) {
  return withUnit(formatResolution(value, q.resolution), unit);
}

/**
 * The MIME bundle of a Z-score result: the measurement, BSA, Z (with u and its interval when an
 * input was uncertain), percentile, expected value and normal range, tail probabilities, flags and
 * cautions.
 *
 * @param r A result of `zScore`.
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { displayZScore, PHN_2017_MODELS, zScore } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = zScore(PHN_2017_MODELS.aorticRootSinus, { measurement: 2.5, bsaM2: 1 });
 * const text = String(displayZScore(r)["text/plain"]);
 * // Lopez 2017 form at 1 m²: Z = (2.5 − 2.06)/0.18 = 2.44; range (2.06 ∓ 0.36) cm (hand computation)
 * assert.match(text, /Z-score\s+2\.44/);
 * assert.match(text, /Normal range \(Z = −2 to \+2\)\s+1\.70 to 2\.42 cm/);
 * ```
 */
export function displayZScore(r: ZScoreResult): MimeBundle {
  const unit = r.model.unit;
  const q = r.quantity;
  const z = r.uncertainty;
  const rows: string[][] = [
    [labelWithUnit(q.label, unit), formatResolution(r.measurement, q.resolution)],
    [labelWithUnit("Body surface area", "m^2"), formatResolution(r.bsaM2, BSA_RESOLUTION)],
    [
      "Z-score",
      z
        ? `${roundLike(z.value, z.standardUncertainty).replace("-", "−")} (u = ${
          roundLike(z.standardUncertainty, z.standardUncertainty)
        })`
        : formatZScore(r.zScore),
    ],
    ["Percentile", formatResolution(r.percentile, 0.1)],
    [`Expected (Z = 0)`, measured(r.expected, q, unit)],
    [
      "Normal range (Z = −2 to +2)",
      withUnit(
        `${formatResolution(r.normalRange.lower, q.resolution)} to ${
          formatResolution(r.normalRange.upper, q.resolution)
        }`,
        unit,
      ),
    ],
  ];
  if (z) {
    rows.push(
      [
        `Interval of Z (${formatNumber(z.coverage * 100, 3)} % coverage)`,
        `${roundLike(z.interval.lower, z.standardUncertainty)} to ${
          roundLike(z.interval.upper, z.standardUncertainty)
        }`.replace(/-/g, "−"),
      ],
      ["P(true Z > +2)", formatShare(r.probabilityAbovePlus2!)],
      ["P(true Z < −2)", formatShare(r.probabilityBelowMinus2!)],
    );
  }
  const cite = `${r.model.source.authors.split(/[ ,]/)[0]} ${r.model.source.year}`;
  return tableBundle(`Z-score: ${q.label} (${cite})`, ["", "Value"], rows, {
    Flags: r.flags,
    Cautions: r.cautions,
  });
}

/**
 * The MIME bundle of a model's normal limits at one BSA: the expected measurement (Z = 0) and the
 * measurements at Z = −2 and +2, labelled with the measured quantity and its unit, rounded to its
 * resolution.
 *
 * @param limits A result of `normalLimits`.
 * @param context The measured quantity (label, unit, resolution), the title line (the model and
 * its source) and the cautions shown below (the model's, with the clinical caution).
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { JUPYTER_DISPLAY, normalLimits, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const l = normalLimits(PHN_2017_MODELS.aorticRootSinus, 0.81);
 * const text = String(l[JUPYTER_DISPLAY]()["text/plain"]);
 * // (2.06 ± 2·0.18)·√0.81 = 1.53 and 2.18 cm (hand computation)
 * assert.match(text, /Aortic root at the sinuses at Z = −2 \(cm\)\s+1\.53/);
 * assert.match(text, /at Z = \+2 \(cm\)\s+2\.18/);
 * ```
 */
export function displayNormalLimits(
  limits: NormalLimits,
  context: {
    readonly quantity: Pick<Quantity, "label" | "unit" | "resolution">;
    readonly title: string;
    readonly cautions: readonly string[];
  },
): MimeBundle {
  const { quantity: q, title, cautions } = context;
  const rows = [
    [labelWithUnit("Body surface area", "m^2"), formatResolution(limits.bsaM2, BSA_RESOLUTION)],
    [labelWithUnit(`${q.label} at Z = −2`, q.unit), formatResolution(limits.lower, q.resolution)],
    [labelWithUnit(`${q.label} at Z = 0`, q.unit), formatResolution(limits.mean, q.resolution)],
    [labelWithUnit(`${q.label} at Z = +2`, q.unit), formatResolution(limits.upper, q.resolution)],
  ];
  const flags = limits.bsaOutsideModelRange
    ? ["The BSA lies outside the model's BSA range: the limits are extrapolated"]
    : [];
  return tableBundle(title, ["", "Value"], rows, { Flags: flags, Cautions: cautions });
}

/**
 * The MIME bundle of Z-scores of one measurement under several models: a row per model with its
 * source, the BSA it used, Z, percentile and flags ("not measured" and the reason where a model
 * could not be applied).
 *
 * @param rows A result of `compareZScoreModels`.
 * @param context Each row's model as a reader names it (its measurement and source), the title
 * line and the cautions shown below (with the clinical caution).
 * @returns HTML and plain text.
 *
 * @example
 * ```ts
 * import { compareZScoreModels, JUPYTER_DISPLAY, PHN_2017_MODELS } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const rows = compareZScoreModels([PHN_2017_MODELS.aorticRootSinus], { measurement: 2.5, bsaM2: 1 });
 * const text = String(rows[JUPYTER_DISPLAY]()["text/plain"]);
 * // (2.5 − 2.06)/0.18 = 2.44 (hand computation, Lopez 2017 form)
 * assert.match(text, /Aortic root at the sinuses\s+Lopez L 2017\s+1\.00\s+2\.44\s+99\.3/);
 * ```
 */
export function displayZScoreComparison(
  rows: readonly ZScoreComparisonRow[],
  context: {
    readonly names: readonly string[];
    readonly title: string;
    readonly cautions: readonly string[];
  },
): MimeBundle {
  const { names, title, cautions } = context;
  const header = [
    "Model",
    "Source",
    labelWithUnit("Body surface area", "m^2"),
    "Z-score",
    "Percentile",
    "Flags",
  ];
  const cells = rows.map((r, i) => [
    names[i] ?? r.source,
    r.source,
    r.bsaM2 === null ? NOT_MEASURED : formatResolution(r.bsaM2, BSA_RESOLUTION),
    formatZScore(r.zScore),
    r.percentile === null ? NOT_MEASURED : formatResolution(r.percentile, 0.1),
    [...r.flags, ...(r.error === undefined ? [] : [r.error])].join("; "),
  ]);
  return tableBundle(title, header, cells, { Cautions: cautions });
}
