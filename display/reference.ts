/**
 * Notebook displays of reference-range results: a Z-score with its normal range, uncertainty,
 * tail probabilities, flags and cautions (the coefficients' provenance among them).
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type { ZScoreResult } from "../calc/reference/types.ts";
import { withUnit } from "../calc/core/text.ts";
import { tableBundle } from "./mime.ts";
import { formatNumber, formatShare, roundLike } from "./format.ts";

export { JUPYTER_DISPLAY } from "./mime.ts";

/** The MIME bundle of a Z-score result. */
export function displayZScore(r: ZScoreResult): MimeBundle {
  const unit = r.model.unit;
  const z = r.uncertainty;
  const rows: string[][] = [
    ["Measurement", withUnit(formatNumber(r.measurement, 4), unit)],
    ["Body surface area", withUnit(formatNumber(r.bsaM2, 3), "m^2")],
    [
      "Z-score",
      z
        ? `${roundLike(z.value, z.standardUncertainty)} (u = ${
          formatNumber(z.standardUncertainty, 2)
        })`
        : r.zScore.toFixed(2),
    ],
    ["Percentile", r.percentile.toFixed(1)],
    ["Expected (Z = 0)", withUnit(formatNumber(r.expected, 3), unit)],
    [
      "Normal range (Z = −2 to +2)",
      withUnit(
        `${formatNumber(r.normalRange.lower, 3)} to ${formatNumber(r.normalRange.upper, 3)}`,
        unit,
      ),
    ],
  ];
  if (z) {
    rows.push(
      [
        `${formatNumber(z.coverage * 100, 3)} % interval of Z`,
        `${roundLike(z.interval.lower, z.standardUncertainty)} to ${
          roundLike(z.interval.upper, z.standardUncertainty)
        }`,
      ],
      ["P(true Z > +2)", formatShare(r.probabilityAbovePlus2!)],
      ["P(true Z < −2)", formatShare(r.probabilityBelowMinus2!)],
    );
  }
  const cite = `${r.model.source.authors.split(/[ ,]/)[0]} ${r.model.source.year}`;
  return tableBundle(`Z-score: ${r.quantity.label} (${cite})`, ["", "Value"], rows, {
    Flags: r.flags,
    Cautions: r.cautions,
  });
}
