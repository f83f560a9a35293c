/**
 * Right-atrial pressure estimated from the IVC is a category, not a measurement: carried as a
 * rectangular distribution over the guideline's range for the category, so that its width
 * reaches the RV systolic pressure built on it.
 *
 * @module
 */
import { evaluate } from "../core/evaluate.ts";
import type { Citation } from "../core/types.ts";
import { rightAtrialPressureFromIvc } from "../doppler/right_heart.ts";
import { RUDSKI_2010 } from "../citations.ts";
import { recalledSourceCautions } from "../citations.ts";
import { rectangular, type RectangularInput } from "../uncertainty/distributions.ts";
import { JCGM_100 } from "./citations.ts";
import { type ModelProvenance, notAnObject, withModelDisplay } from "./shared.ts";

/** The three categories of the IVC rule. */
export type RightAtrialPressureCategory = "normal" | "intermediate" | "high";

/** The range of right-atrial pressure the guideline gives each category, mmHg. */
export interface RightAtrialPressureRange {
  /** The category. */
  readonly category: RightAtrialPressureCategory;
  /** Lower end, mmHg. */
  readonly lowerMmHg: number;
  /** Upper end, mmHg. */
  readonly upperMmHg: number;
}

/** Rudski 2010, with what was checked of the ranges. */
const RUDSKI_RANGES: Citation = {
  ...RUDSKI_2010,
  locator:
    "estimation of RA pressure: normal 0–5, intermediate 5–10, high 10–20 mmHg (checked in secondary summaries; the high range is not verified in the guideline's own table, which gives 15 mmHg alone)",
};

/**
 * The ranges of right-atrial pressure for the three categories of the IVC rule: normal 0–5 mmHg,
 * intermediate 5–10 mmHg, high 10–20 mmHg.
 *
 * Source: Rudski LG et al., J Am Soc Echocardiogr 2010;23:685–713 (estimation of RA pressure).
 * Checked with secondary summaries: a reporting guide's table lists normal 0–5 (mean 3),
 * intermediate 5–10 (8), high 10–20 (15) mmHg, and research papers quote the guideline's text
 * with the same ranges; a review's reproduction of the guideline's table gives ranges for the
 * normal and intermediate categories only and 15 mmHg for high, so the high range is marked
 * "not verified" in the guideline itself.
 *
 * @example
 * ```ts
 * import { RIGHT_ATRIAL_PRESSURE_RANGES } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const widths = RIGHT_ATRIAL_PRESSURE_RANGES.map((r) => r.upperMmHg - r.lowerMmHg);
 * assert.deepEqual(widths, [5, 5, 10]);
 * ```
 */
export const RIGHT_ATRIAL_PRESSURE_RANGES: readonly RightAtrialPressureRange[] = Object.freeze([
  { category: "normal", lowerMmHg: 0, upperMmHg: 5 },
  { category: "intermediate", lowerMmHg: 5, upperMmHg: 10 },
  { category: "high", lowerMmHg: 10, upperMmHg: 20 },
]);

/** The result of {@linkcode rightAtrialPressureRange}. */
export interface RightAtrialPressureModel extends ModelProvenance, RightAtrialPressureRange {
  /** The point value the rule gives ({@linkcode rightAtrialPressureFromIvc}), mmHg. */
  readonly pointValueMmHg: number;
  /** The midpoint of the range, the estimate of the rectangular input, mmHg. */
  readonly midpointMmHg: number;
  /** Standard uncertainty (upper − lower)/√12, mmHg. */
  readonly standardUncertaintyMmHg: number;
  /** The input to give `propagate`: `rectangular(lower, upper)`. */
  readonly input: RectangularInput;
}

const WHERE = "Right-atrial pressure range";

/**
 * Right-atrial pressure from the IVC as an uncertain input: the category found by
 * {@linkcode rightAtrialPressureFromIvc}'s own rule, carried as a rectangular distribution over
 * the guideline's range for it.
 *
 * Formula: category from the rule's point value (3, 8 or 15 mmHg, the value inside the range);
 * RAP ~ rectangular(lower, upper): estimate (lower + upper)/2, u = (upper − lower)/√12 (JCGM
 * 100:2008 §4.3.7). The midpoint (2.5, 7.5, 15 mmHg) differs from the rule's point value (3, 8,
 * 15 mmHg): the point value is a convention, the midpoint is the expectation when any pressure in
 * the range is equally likely.
 *
 * Source: Rudski et al. 2010 (rule and ranges, see {@linkcode RIGHT_ATRIAL_PRESSURE_RANGES});
 * JCGM 100:2008 §4.3.7.
 *
 * @param ivc IVC diameter (cm) and its collapse with a sniff (%).
 * @returns The category, its range, the point value and the rectangular input; it displays
 * itself with the clinical caution.
 * @throws {TypeError} For a missing or mistyped value.
 * @throws {RangeError} For a diameter or collapse outside its valid range.
 *
 * @example A dilated IVC that hardly collapses: 10–20 mmHg, u = 10/√12 = 2.89 mmHg
 * ```ts
 * import { normal, propagate, rightAtrialPressureRange, rvSystolicPressure } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const ra = rightAtrialPressureRange({ ivcDiameterCm: 2.5, ivcCollapsePercent: 20 });
 * assert.equal(ra.category, "high");
 * const r = propagate(rvSystolicPressure, { trVelocity: normal(3, 0.1), rapMmHg: ra.input });
 * // u² = (8·3·0.1)² + (10/√12)² (JCGM 100 eq. (10), hand-checkable)
 * assert.ok(Math.abs(r.outputs.rvspMmHg.standardUncertainty - Math.hypot(2.4, 10 / Math.sqrt(12))) < 1e-6);
 * ```
 */
export function rightAtrialPressureRange(ivc: {
  readonly ivcDiameterCm: number | string;
  readonly ivcCollapsePercent: number | string;
}): RightAtrialPressureModel {
  if (typeof ivc !== "object" || ivc === null) {
    throw notAnObject(WHERE, "ivc", ivc, "as an object { ivcDiameterCm, ivcCollapsePercent }");
  }
  const rule = evaluate(rightAtrialPressureFromIvc, ivc);
  const point = rule.outputs.rapMmHg;
  const range = RIGHT_ATRIAL_PRESSURE_RANGES.find((r) =>
    point > r.lowerMmHg && point < r.upperMmHg
  );
  if (range === undefined) {
    throw new RangeError(
      `${WHERE}: expected the rule's point value inside one category range, got ${point} mmHg`,
    );
  }
  const width = range.upperMmHg - range.lowerMmHg;
  const midpoint = (range.lowerMmHg + range.upperMmHg) / 2;
  const result: RightAtrialPressureModel = {
    ...range,
    pointValueMmHg: point,
    midpointMmHg: midpoint,
    standardUncertaintyMmHg: width / Math.sqrt(12),
    input: rectangular(range.lowerMmHg, range.upperMmHg),
    notes: [
      `Category "${range.category}" by the IVC rule of Rudski et al. 2010; range ${range.lowerMmHg}–${range.upperMmHg} mmHg from the guideline (checked in secondary summaries)`,
      "Any pressure in the range taken as equally likely: rectangular, u = range/√12 (JCGM 100:2008 §4.3.7)",
      midpoint === point
        ? `The estimate is the midpoint ${midpoint} mmHg, which here equals the rule's point value`
        : `The estimate is the midpoint ${midpoint} mmHg, not the rule's point value ${point} mmHg`,
    ],
    warnings: [...rule.flags],
    cautions: [...recalledSourceCautions([RUDSKI_RANGES]), ...rule.cautions],
    citations: [RUDSKI_RANGES, JCGM_100],
  };
  return withModelDisplay(
    result,
    `${WHERE}: IVC ${rule.inputs.ivcDiameterCm} cm, collapse ${rule.inputs.ivcCollapsePercent} %`,
    ["Category", "Range (mmHg)", "Point value (mmHg)", "Midpoint (mmHg)", "u (mmHg)"],
    [[
      range.category,
      `${range.lowerMmHg}–${range.upperMmHg}`,
      point,
      midpoint,
      { u: result.standardUncertaintyMmHg },
    ]],
  );
}
