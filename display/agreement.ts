/**
 * Agreement results as people read them: the notebook displays of Bland–Altman, repeatability,
 * intraclass correlation, concordance, regression and kappa results. Compact tables with labels
 * and units; numbers rounded by display/format.ts (to the decimal place the confidence interval
 * allows, JCGM 100:2008 §7.2.6); cautions below.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type {
  BlandAltmanRatioResult,
  BlandAltmanRepeatedResult,
  BlandAltmanResult,
} from "../calc/agreement/types.ts";
import type { RepeatabilityResult } from "../calc/agreement/types.ts";
import type { IntraclassCorrelationResult } from "../calc/agreement/types.ts";
import type { ConcordanceResult } from "../calc/agreement/types.ts";
import type { RegressionResult } from "../calc/agreement/types.ts";
import type { CohenKappaResult, FleissKappaResult } from "../calc/agreement/types.ts";
import { htmlTable, tableBundle } from "./mime.ts";
import { formatCount, formatNumber, roundLike } from "./format.ts";
import {
  blandAltmanRows,
  ci,
  concordanceRows,
  fleissRows,
  halfWidth,
  iccRows,
  kappaCells,
  kappaHeader,
  kappaStatistic,
  level,
  regressionRows,
  repeatabilityCells,
  repeatabilityHeader,
  repeatedRows,
  titled,
} from "./agreement_rows.ts";

export { JUPYTER_DISPLAY } from "./mime.ts";

// ---------------------------------------------------------------------------------------------
// Notebook displays of single results

/**
 * The MIME bundle of a Bland–Altman result: bias and limits with both kinds of interval, labels
 * with the unit, numbers rounded to the decimal place the bias interval allows.
 *
 * @example
 * ```ts
 * import { blandAltman, EJECTION_FRACTION, JUPYTER_DISPLAY } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = blandAltman([60, 52, 41, 66, 58], [58, 52, 44, 63, 59], {
 *   quantity: EJECTION_FRACTION, methodNames: ["auto", "manual"],
 * });
 * // bias (2 + 0 − 3 + 3 − 1)/5 = 0.2 %
 * // a difference of two percentages is in percentage points
 * assert.match(String(r[JUPYTER_DISPLAY]()["text/plain"]),
 *   /Bias \(mean of auto − manual\) \(percentage points\) +0\.2 /);
 * ```
 */
export function displayBlandAltman(r: BlandAltmanResult): MimeBundle {
  const t = blandAltmanRows(r);
  return tableBundle(titled("Bland–Altman analysis", r.quantity), t.header, t.rows, {
    Cautions: r.cautions,
  });
}

/** The MIME bundle of a Bland–Altman ratio result: the ratio and its limits. */
export function displayBlandAltmanRatio(r: BlandAltmanRatioResult): MimeBundle {
  const [a, b] = r.log.methodNames;
  const u = halfWidth(r.ratio.ci);
  const m = formatNumber(r.log.multiplier, 3);
  return tableBundle(
    titled("Bland–Altman analysis of ratios", r.quantity),
    [
      "Statistic",
      "Estimate",
      `${level(r.log.confidence)} (approximate)`,
      `${level(r.log.confidence)} (exact, Carkeet 2015)`,
    ],
    [
      ["Pairs", formatCount(r.log.n), "", ""],
      [`Geometric mean ratio ${a}/${b}`, roundLike(r.ratio.value, u), ci(r.ratio.ci, u), "–"],
      ...([["Lower", r.lowerRatioLimit, "÷"], ["Upper", r.upperRatioLimit, "×"]] as const).map((
        [name, l, sign],
      ) => [
        `${name} ratio limit (ratio ${sign} e^(${m} SD))`,
        roundLike(l.value, u),
        ci(l.approximateCi, u),
        ci(l.exactCi, u),
      ]),
    ],
    { Cautions: r.log.cautions },
  );
}

/** The MIME bundle of a repeated-measures Bland–Altman result. */
export function displayBlandAltmanRepeated(r: BlandAltmanRepeatedResult): MimeBundle {
  const t = repeatedRows(r);
  return tableBundle(
    titled("Bland–Altman analysis with replicates (Bland & Altman 2007)", r.quantity),
    t.header,
    t.rows,
    { Cautions: r.cautions },
  );
}

/** The MIME bundle of a repeatability result. */
export function displayRepeatability(r: RepeatabilityResult): MimeBundle {
  const cells = repeatabilityCells(r);
  const header = repeatabilityHeader(r.quantity, r.multiplier, r.confidence);
  return tableBundle(titled("Repeatability", r.quantity), ["Statistic", "Estimate"], [
    ["Subjects", formatCount(r.subjects)],
    ["Readings", formatCount(r.readings)],
    ["Degrees of freedom Σ(m − 1)", formatCount(r.degreesOfFreedom)],
    ...header.map((h, i) => [h, cells[i]!]),
  ]);
}

/** The MIME bundle of the six intraclass correlations. */
export function displayIntraclassCorrelation(r: IntraclassCorrelationResult): MimeBundle {
  const t = iccRows(r);
  return tableBundle(
    `${titled("Intraclass correlation", r.quantity)} (${formatCount(r.subjects)} subjects × ${
      formatCount(r.raters)
    } raters)`,
    t.header,
    t.rows,
    { Cautions: r.cautions },
  );
}

/** The MIME bundle of Lin's concordance correlation. */
export function displayConcordance(r: ConcordanceResult): MimeBundle {
  const [x, y] = r.methodNames;
  return tableBundle(
    `${titled("Concordance correlation", r.quantity)} (${y} against ${x}, ${
      formatCount(r.n)
    } pairs)`,
    ["Statistic", "Estimate", level(r.confidence)],
    concordanceRows(r).map((row) => row.slice(0, 3)),
    { Cautions: r.cautions },
  );
}

/**
 * The MIME bundle of a regression (Deming, general Deming, York or Passing–Bablok): slope and
 * intercept with their intervals and how they were obtained; for York's method the goodness of
 * fit (MSWD, χ² probability).
 *
 * @example
 * ```ts
 * import { JUPYTER_DISPLAY, yorkRegression } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const r = yorkRegression([1, 2, 3, 4, 5], [2.1, 3.9, 6.2, 7.8, 10.1], { sdX: 0.1, sdY: 0.2 });
 * const text = String(r[JUPYTER_DISPLAY]()["text/plain"]);
 * assert.match(text, /^York regression \(Y on X, 5 pairs\)/);
 * assert.match(text, /MSWD/);
 * ```
 */
export function displayRegression<R extends RegressionResult>(r: R): MimeBundle {
  const [x, y] = r.methodNames;
  return tableBundle(
    `${titled(`${r.method} regression`, r.quantity)} (${y} on ${x}, ${formatCount(r.n)} pairs)`,
    ["Statistic", "Estimate", level(r.confidence), "Notes"],
    regressionRows(r),
    { Cautions: r.cautions },
  );
}

/** The MIME bundle of Cohen's kappa: the statistic and the table of counts. */
export function displayCohenKappa(r: CohenKappaResult): MimeBundle {
  const [a, b] = r.raterNames;
  const main = tableBundle(
    `${titled(kappaStatistic(r.weights), r.quantity)} (${a} and ${b})`,
    kappaHeader(r.confidence),
    [kappaCells(r)],
    { Cautions: r.cautions },
  );
  const header = [`${a} ↓ / ${b} →`, ...r.categories];
  const counts = r.table.map((row, i) => [r.categories[i]!, ...row.map(formatCount)]);
  return {
    "text/plain": `${main["text/plain"]}\nCounts:\n${
      counts.map((c, i) => (i === 0 ? header.join("  ") + "\n" : "") + c.join("  ")).join("\n")
    }`,
    "text/html": `${main["text/html"]}<p style="margin:4px 0">Counts</p>${
      htmlTable(header, counts)
    }`,
  };
}

/** The MIME bundle of Fleiss' kappa. */
export function displayFleissKappa(r: FleissKappaResult): MimeBundle {
  const t = fleissRows(r);
  return tableBundle(titled("Fleiss' kappa", r.quantity), t.header, t.rows, {
    Cautions: r.cautions,
  });
}
