/**
 * Notebook displays of severity grading: the class with its threshold as printed, the
 * probability of each class for an uncertain value (and how it was obtained), the citations with
 * their "from memory" marks, the table's notes and the clinical caution.
 *
 * @module
 */
import type { MimeBundle } from "../calc/core/types.ts";
import type {
  SeverityDistribution,
  SeverityGrade,
  SeverityResultBase,
} from "../calc/grading/types.ts";
import { withUnit } from "../calc/core/text.ts";
import { formatCitation } from "../calc/core/text.ts";
import { tableBundle } from "./mime.ts";
import {
  formatInterval,
  formatNumber,
  formatResolution,
  formatShare,
  roundLike,
} from "./format.ts";

function threshold(printed: string, unit: string): string {
  return withUnit(printed, unit);
}

function notes(r: SeverityResultBase, extra: readonly string[]): Record<string, string[]> {
  return {
    Notes: [...extra, ...r.table.notes],
    Sources: r.citations.map(formatCitation),
    Cautions: [...r.cautions],
  };
}

/**
 * The MIME bundle of one graded value: the class and its printed threshold among every class of
 * the table, the table's notes, the sources (with their "from memory" marks) and the cautions.
 *
 * @param r A result of `gradeSeverity(table, value)`.
 * @returns HTML with a plain-text twin.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, displaySeverityGrade, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * const text = String(displaySeverityGrade(gradeSeverity(AORTIC_STENOSIS_2017.valveArea, 0.85))["text/plain"]);
 * assert.match(text, /Aortic valve area = 0\.85 cm² → severe/);
 * assert.match(text, /from memory/);
 * assert.match(text, /Caution: Not a diagnosis/);
 * ```
 */
export function displaySeverityGrade(r: SeverityGrade): MimeBundle {
  const q = r.table.quantity;
  const title = `${r.table.title}: ${q.label} = ${
    withUnit(formatResolution(r.value, q.resolution), q.unit)
  } → ${r.grade}`;
  const rows = r.table.bands.map((b) => [
    b.grade,
    threshold(b.printed, q.unit),
    b === r.band ? "this value" : "",
  ]);
  return tableBundle(title, ["Class", "Threshold (as printed)", ""], rows, notes(r, []));
}

/**
 * The MIME bundle of a graded distribution: the probability of each class, how the probabilities
 * were obtained (Monte Carlo samples, or the normal distribution of a GUM result), the class of the
 * median and the most likely class, the share outside the valid range (once it reaches 0.1 %), the
 * table's notes, the sources with their "from memory" marks and the cautions.
 *
 * @param r A result of `gradeSeverity(table, uncertainValue)` or of samples.
 * @returns HTML with a plain-text twin.
 *
 * @example
 * ```ts
 * import { AORTIC_STENOSIS_2017, displaySeverityDistribution, gradeSeverity } from "@sonorigor/sonorigor";
 * import assert from "node:assert/strict";
 * // counting (hand-checkable): 2 of 4 samples below 1.0 cm²
 * const d = gradeSeverity(AORTIC_STENOSIS_2017.valveArea, [0.9, 0.95, 1.05, 1.2]);
 * const text = String(displaySeverityDistribution(d)["text/plain"]);
 * assert.match(text, /severe\s+< 1\.0 cm²\s+50\.0 %/);
 * assert.match(text, /Note: Share of the given samples in each class/);
 * ```
 */
export function displaySeverityDistribution(r: SeverityDistribution): MimeBundle {
  const q = r.table.quantity;
  const u = r.standardUncertainty;
  const shown = (v: number) => withUnit(u > 0 ? roundLike(v, u) : formatNumber(v), q.unit);
  const title = `${r.table.title}: median ${
    shown(r.median)
  } → ${r.grade}; most likely ${r.mostLikely}`;
  const rows = r.probabilities.map((p) => [
    p.grade,
    threshold(p.printed, q.unit),
    formatShare(p.probability),
  ]);
  const basis = r.method === "normal"
    ? `${r.basis}: N(${shown(r.value)}, (${shown(u)})²)`
    : `${r.basis} (${r.count} samples; mean ${shown(r.value)}, u = ${shown(u)})`;
  const extra = [
    basis,
    ...(r.interval !== null && r.coverage !== null
      ? [
        `${formatNumber(100 * r.coverage)} % coverage interval of the value: ${
          formatInterval(r.interval, u, q.unit)
        }`,
      ]
      : []),
    ...(r.outsideValid >= 0.0005 // shown once it rounds to 0.1 %
      ? [
        `${
          formatShare(r.outsideValid)
        } of the distribution lies outside the valid range of ${q.label} (counted in the nearest class): the uncertainty model is unrealistic there`,
      ]
      : []),
  ];
  return tableBundle(
    title,
    ["Class", "Threshold (as printed)", "Probability"],
    rows,
    notes(r, extra),
  );
}
