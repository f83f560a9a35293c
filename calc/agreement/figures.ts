/**
 * The charts a method-validation report has, with file names derived from the observer names:
 * ASCII only, and unique within the report even when two names differ only in case, accents or
 * punctuation ("Reader A" and "reader_a").
 *
 * @module
 */
import type { FigurePlan, MethodComparison } from "./report_types.ts";

/** A name reduced to a file-name part: accents removed, lower case, every run of other
 * characters made one "-", at most 40 characters; empty when nothing is left
 * ("Échographiste B / 2" → "echographiste-b-2", "../../etc" → "etc"). */
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

/** The figures of a report of measurements: for each comparison a Bland–Altman plot (when it
 * was computed) and a method-comparison scatter (with at least 3 pairs), then the observer plot;
 * file names unique within the report. */
export function figurePlans(
  observers: readonly string[],
  comparisons: readonly MethodComparison[],
): FigurePlan[] {
  const parts = uniqueParts(observers);
  const figures: FigurePlan[] = [];
  const files = new Set<string>();
  const add = (kind: FigurePlan["kind"], comparison: number | null, stem: string) => {
    let file = `${stem}.svg`;
    for (let k = 2; files.has(file); k++) file = `${stem}-${k}.svg`;
    files.add(file);
    figures.push({ kind, comparison, file });
  };
  comparisons.forEach((c, i) => {
    const pair = `${parts.get(c.test)}_vs_${parts.get(c.reference)}`;
    if (c.blandAltman.status === "computed") add("blandAltman", i, `bland_altman_${pair}`);
    if (c.subjects.length >= 3) add("comparison", i, `method_comparison_${pair}`);
  });
  add("observers", null, "observers");
  return figures;
}
