/**
 * The charts a method-validation report has, with file names derived from the observer names:
 * ASCII only, and unique within the report even when two names differ only in case, accents or
 * punctuation ("Reader A" and "reader_a", "Dr A-B" and "Dr A B"). A chart with more points than
 * {@linkcode MAX_CHART_POINTS} is not planned: the report states which and why.
 *
 * @module
 */
import type { FigurePlan, MethodComparison } from "./report_types.ts";

/** The most points one chart of a report draws (an SVG of more is too large to read or open;
 * every statistic still uses every reading). */
export const MAX_CHART_POINTS = 20_000;

/** The figures of a report, and a sentence for each chart left out for its size. */
export interface FigurePlans {
  /** The charts drawn, file names unique within the report. */
  readonly figures: FigurePlan[];
  /** One sentence per chart not drawn, naming it, its points and the limit. */
  readonly notDrawn: string[];
}

/**
 * A name reduced to a file-name part: accents removed, lower case, every run of other
 * characters made one "-", at most 40 characters; empty when nothing is left.
 *
 * @example
 * ```ts
 * import { fileNamePart } from "./figures.ts";
 * import assert from "node:assert/strict";
 * assert.equal(fileNamePart("Échographiste B / 2"), "echographiste-b-2");
 * assert.equal(fileNamePart("../../etc"), "etc");
 * ```
 */
export function fileNamePart(name: string): string {
  return name.normalize("NFKD").replace(/[\u0300-\u036f]/g, "").toLowerCase()
    .replace(/[^a-z0-9]+/g, "-").replace(/^-+|-+$/g, "").slice(0, 40).replace(/-+$/, "");
}

/** One unique name part per observer: its reduced name, "observer-N" when nothing is left, and
 * "-2", "-3", … appended when two observers reduce to the same part. */
function uniqueParts(observers: readonly string[]): Map<string, string> {
  const taken = new Set<string>();
  const parts = new Map<string, string>();
  observers.forEach((o, i) => {
    const base = fileNamePart(o) || `observer-${i + 1}`;
    let part = base;
    for (let k = 2; taken.has(part); k++) part = `${base}-${k}`;
    taken.add(part);
    parts.set(o, part);
  });
  return parts;
}

/**
 * The figures of a report of measurements: for each comparison a Bland–Altman plot (when it
 * was computed) and a method-comparison scatter (with at least 3 pairs), then the observer plot
 * of every reading; file names unique within the report; a chart of more than
 * {@linkcode MAX_CHART_POINTS} points left out with a sentence saying so.
 *
 * @param observers Observers in the report's order.
 * @param comparisons The report's comparisons.
 * @param readings Number of readings (the points of the observer plot).
 * @returns The figures, and the charts not drawn.
 *
 * @example
 * ```ts
 * import { figurePlans } from "./figures.ts";
 * import assert from "node:assert/strict";
 * const plans = figurePlans(["Dr A-B", "Dr A B"], [], 25_000);
 * assert.deepEqual(plans.figures, []);
 * assert.equal(plans.notDrawn[0],
 *   "The observer plot is not drawn: it would have 25,000 points, more than the 20,000 a chart of this report draws; every statistic uses every reading.");
 * ```
 */
export function figurePlans(
  observers: readonly string[],
  comparisons: readonly MethodComparison[],
  readings: number,
): FigurePlans {
  const parts = uniqueParts(observers);
  const figures: FigurePlan[] = [];
  const notDrawn: string[] = [];
  const files = new Set<string>();
  const add = (
    kind: FigurePlan["kind"],
    comparison: number | null,
    stem: string,
    points: number,
    what: string,
  ) => {
    if (points > MAX_CHART_POINTS) {
      notDrawn.push(
        `${what} is not drawn: it would have ${
          points.toLocaleString("en-US")
        } points, more than the ${
          MAX_CHART_POINTS.toLocaleString("en-US")
        } a chart of this report draws; every statistic uses every reading.`,
      );
      return;
    }
    let file = `${stem}.svg`;
    for (let k = 2; files.has(file); k++) file = `${stem}-${k}.svg`;
    files.add(file);
    figures.push({ kind, comparison, file });
  };
  comparisons.forEach((c, i) => {
    const pair = `${parts.get(c.test)}_vs_${parts.get(c.reference)}`;
    const n = c.subjects.length;
    if (c.blandAltman.status === "computed") {
      add(
        "blandAltman",
        i,
        `bland_altman_${pair}`,
        n,
        `The Bland–Altman plot of ${c.test} − ${c.reference}`,
      );
    }
    if (n >= 3) {
      add(
        "comparison",
        i,
        `method_comparison_${pair}`,
        n,
        `The scatter of ${c.test} against ${c.reference}`,
      );
    }
  });
  add("observers", null, "observers", readings, "The observer plot");
  return { figures, notDrawn };
}
